// Package integrate solves initial-value problems y' = f(t, y) with the
// explicit embedded Runge-Kutta method of Dormand and Prince of order
// 8(5,3), DOP853 (Hairer, Norsett & Wanner, Solving Ordinary Differential
// Equations I, 2nd ed., Sections II.5-II.6, and the Fortran code dop853.f),
// with its standard step-size control, the 7th-order continuous (dense)
// output, fixed-step output taken from the dense output, and event
// location by Brent's method on the dense output.
//
//	s, err := integrate.New(n, f, integrate.Settings{RelTol: 1e-12})
//	t, err := s.Integrate(yEnd, t0, y0, t1, &integrate.Observer{...})
//
// or step by step with [Solver.Reset], [Solver.Step] and
// [Solver.Interpolate].
//
// # Units
//
// The package is unit-free: t and y carry whatever units f uses; the
// absolute tolerances and Observer.Step, MaxCheck and EventTol are in the
// units of y and t.
//
// # Frames
//
// None: the package knows nothing of geometry.
//
// # Conventions
//
// Integration runs forwards (t1 > t0) or backwards (t1 < t0). The local
// error of a step is measured as in dop853.f, with the weights
// AbsTol + RelTol max(|y_old|, |y_new|) per component, and the step ratio
// is kept in [0.333, 6] with safety factor 0.9. The solver owns its
// buffers: slices passed to callbacks are valid only during the call, and
// after [New] nothing allocates per step. A dst argument is written, other
// slices are only read. Wrong slice lengths are programmer errors and
// panic; everything else is a returned error: [ErrSettings],
// [ErrNotFinite], and, inside a [*StepError] that carries time and state,
// [ErrStepSize] (the step fell below 16 ulp of t, for example at a
// singularity of f) and [ErrMaxSteps].
package integrate
