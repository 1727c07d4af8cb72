// Package trajectory samples a propagated orbit at a fixed step and
// interpolates it with cubic Hermite polynomials under a proven error
// bound, and searches functions of time along it: roots, maxima and the
// windows where a function is positive. Passes and eclipses
// (packages [centra/propagate/visibility] and [centra/propagate/shadow])
// are found on one shared [Trajectory].
//
//	tr, err := trajectory.Sample(p, s0, 7*86400, trajectory.Options{})
//	r, v := tr.At(3600.5)                  // km, km/s, error below tr.Bound()
//	ws := trajectory.Windows(f, 0, tr.Span(), tr.Step(), 1e-4)
//
// # Units
//
// Times are seconds from the initial state (t = 0 .. Span); positions km,
// velocities km/s, the fourth-derivative bound km/s^4. Tolerances of the
// searches are in seconds.
//
// # Frames
//
// States are in the inertial frame of the propagation (GCRF for the
// Earth); this package never rotates them.
//
// # Conventions
//
// The samples are the states of the propagator's 7th-order dense output
// at t_k = k h, h = Span/N, k = 0..N. Between samples, each component is
// the cubic Hermite polynomial matching position and velocity at both
// ends, so the interpolated position is C^1 and its derivative is the
// interpolated velocity.
//
// Error bound. For a component x with |x””| <= M4 on an interval of
// length h, the cubic Hermite interpolant H satisfies
// |x - H| <= M4 h^4 / 384 and |x' - H'| <= sqrt(3) M4 h^3 / 216
// (Birkhoff and Priver, "Hermite interpolation errors for derivatives",
// J. Math. and Phys. 46 (1967) 440-447; the constants are attained by
// x = t^4/24, which the tests check). For the vector, the bounds are
// multiplied by sqrt(3). For Keplerian motion the fourth derivative of the
// position is r”” = (u^2 + 3uq - 15up^2) r + 6up v with u = mu/r^3,
// p = r.v/r^2, q = v^2/r^2 - u (the t^4 coefficients of the f and g
// series); with |p| <= v/r and -u <= q <= v^2/r^2 - u this gives
//
//	|r''''| <= 2 mu^2/r^5 + 21 mu v^2/r^4,
//
// largest at the smallest radius and the largest speed. [Sample] takes the
// smallest osculating periapsis radius and the largest osculating
// periapsis speed met at any sample, and multiplies the bound by 1.1 for
// the zonal harmonics (J2 adds about 27 J2 u^2 r, below 0.2% of the bound
// for orbits above the surface) and other small perturbations. The
// reported [Bound] is therefore an upper bound of the interpolation error
// against the propagated solution; the propagator's own error (its
// tolerance) comes on top.
//
// Searches. [Windows] samples f at a fixed step; it finds every sign
// change between samples by bisection, and every window that opens and
// closes between samples when f has a local maximum (golden-section
// search on the three samples around it), and likewise short dips. A
// window is missed only if f rises above zero and falls back within one
// step without making a local maximum of the samples: two extrema of f
// within a step. The callers choose steps much shorter than the time scale
// of their functions.
//
// Everything a user's input can cause is a returned error; a time outside
// the span passed to [Trajectory.At] is a caller bug and panics.
package trajectory
