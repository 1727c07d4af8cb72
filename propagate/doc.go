// Package propagate integrates orbits numerically: a point mass, the zonal
// harmonics J2..J6 and optional non-conservative perturbations, with an
// 8th-order adaptive integrator, fixed-step streaming output, event
// location and the conservation and Kepler-law checks of the result.
//
// The common calls are
//
//	p, err := propagate.New(propagate.J2(mu, re, j2), propagate.Options{})
//	final, err := p.Propagate(s0, 86400)                  // one day later
//	res, err := p.Run(s0, span, &propagate.Output{         // stream and find events
//		Step:    60,
//		OnState: func(t float64, s orbit.State) error { ...; return nil },
//		Events:  []propagate.Event{{Kind: propagate.Periapsis}},
//		OnEvent: func(h propagate.EventHit) error { ...; return nil },
//	})
//	checks, err := propagate.Checks(model, s0, span, propagate.Options{})
//
// The equations of motion come from a Lagrangian through the engine of
// package [centra/propagate/lagrange] (Options.Equations = [Engine] or
// [EnginePolar]); the default [FastPath] evaluates the same equations in
// closed form (package [centra/propagate/gravity]), which a test shows
// equal to the engine's to 1e-13 relative. The integrator is DOP853 of
// package [centra/propagate/integrate].
//
// # Units
//
// Internally and in every argument and result: km, km/s, km/s^2, s, rad;
// Mu in km^3/s^2, Re in km, J_n dimensionless (unnormalized), specific
// energy in km^2/s^2, specific angular momentum in km^2/s. Time t in the
// callbacks and results is in seconds from the initial state (negative
// when propagating backwards); the caller relates it to an epoch.
//
// # Frames
//
// States are inertial and centred on the body (GCRF for the Earth). The
// zonal field is symmetric about the z axis of that frame, which is taken
// as the body's rotation axis (precession and nutation of the axis are
// ignored). Node events refer to the xy plane of the frame; altitude
// events to the sphere of radius Model.Re.
//
// # Conventions
//
// Models and options are values; their zero fields mean documented
// defaults ([Options]). A [Propagator] keeps its scratch space: it
// allocates a few objects per run and none per step or per output row, so
// memory does not grow with the length of an ephemeris. Inputs are never
// modified. Everything a user's input can cause is a returned error
// (sentinels [ErrModel], [ErrOptions], [ErrState], [ErrSpan], [ErrStepSize],
// [ErrMaxSteps]; [*StepError] carries the time and state where a run
// stopped); a collision with a point mass ends in [ErrStepSize], not a hang.
package propagate
