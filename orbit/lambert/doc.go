// Package lambert solves Lambert's problem: the two-body orbit that joins two
// positions in a given time of flight.
//
// [Solve] returns the velocities at both ends:
//
//	v1, v2, err := lambert.Solve(mu, r1, r2, tof, lambert.Options{})
//
// The method is Izzo's (D. Izzo, "Revisiting Lambert's problem", Celestial
// Mechanics and Dynamical Astronomy 121, 1–15, 2015): the time of flight is
// written as a function of one variable x on which Householder's third-order
// iteration converges in two to four steps from Izzo's initial guesses, for
// every conic (ellipse, parabola, hyperbola) and for any number of complete
// revolutions. If the iteration ever fails to settle on the requested
// solution, a bisection on the bracket where that solution must lie takes
// over, so Solve either returns a solution that reaches r2 or an error.
//
// # Units
//
// Lengths in km, speeds in km/s, times in s, the gravitational parameter mu in
// km^3/s^2. Angles quoted in errors are in degrees.
//
// # Frames
//
// Any inertial frame centred on the attracting body; r1, r2, v1 and v2 are in
// the same frame. The frame's z axis defines the sense of motion (see
// Conventions).
//
// # Conventions
//
//   - Direction: with Options.Retrograde false the transfer is prograde, that
//     is its angular momentum has a non-negative z component (motion
//     counter-clockwise seen from +z); the transfer angle is then the angle
//     from r1 to r2 measured counter-clockwise about +z, in (0, 2π). With
//     Retrograde true the motion is clockwise. When r1 × r2 has a zero z
//     component (the plane contains the z axis) the direction of r1 × r2 is
//     taken as prograde, so Retrograde false gives the short way.
//   - Revolutions: Options.Revs is the number N of complete revolutions made
//     before arriving; the total angle swept is the transfer angle plus 2πN.
//     For N > 0 there are two solutions when the time of flight exceeds a
//     minimum [MinTimeOfFlight] and none below it. Options.Branch picks one:
//     [Left] is Izzo's solution with x below the minimum-time point x_M; it
//     sweeps the larger eccentric anomaly (closer to 2π(N+1)), and for long
//     times of flight its period approaches tof/(N+1). [Right] has x above x_M,
//     sweeps the smaller eccentric anomaly (closer to 2πN), and its period
//     approaches tof/N. For N = 0 the branch is ignored: the solution is
//     unique.
//   - Degenerate geometry: when r1 and r2 are collinear with the centre
//     (transfer angle 0 or 180 degrees to within sin(angle) <= 1e-12) the
//     transfer plane is undefined and Solve returns [ErrPlaneUndefined]. Near
//     but not at those angles Solve converges; near 180 degrees the plane, and
//     so the out-of-plane direction of v1 and v2, is as ill-conditioned as the
//     geometry (a relative input error ε tilts it by about ε/sin(angle)).
//   - Errors: sentinel errors (ErrMu, ErrPosition, ErrTimeOfFlight, ErrRevs,
//     ErrBranch, ErrPlaneUndefined, ErrNoSolution, ErrNoConvergence), wrapped
//     in [*InputError] or [*RevsError] that carry the offending value. Nothing
//     a caller passes makes Solve panic or return NaN.
//   - Inputs are never modified; the arrays are passed by value.
package lambert
