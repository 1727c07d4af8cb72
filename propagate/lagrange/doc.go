// Package lagrange derives equations of motion from a Lagrangian written
// once over hyperdual numbers (gonum.org/v1/gonum/num/hyperdual). For
// generalized coordinates q, velocities qdot and time t the Euler-Lagrange
// equations
//
//	M qddot = g + Q - C qdot - d2L/(dqdot dt),
//	M = d2L/dqdot2, C = d2L/(dqdot dq), g = dL/dq,
//
// are formed with exact first and second derivatives (two infinitesimal
// parts give mixed second derivatives; no finite differences) and solved
// by Gaussian elimination on the stack (n <= [MaxDim] = 6). Q are
// generalized non-conservative forces supplied by a callback.
//
// Built-in Lagrangians: [PointMassPolar] (inverse-square field in the
// planar polar coordinates of the orbit plane, with [ToPolar] and
// [Plane.State] to pass between an inertial state and the plane),
// [ZonalCartesian] (three-dimensional motion in the field of the zonal
// harmonics J2..J6, potential U(r, sin(latitude)) evaluated from Cartesian
// coordinates, so regular at the poles and on the equator) and
// [CentralPolar] (any central potential U(r)).
//
// # Units
//
// Those of the Lagrangian. The built-in ones are per unit mass: q in km
// (and rad for theta), qdot in km/s (rad/s), L and U in km^2/s^2, mu in
// km^3/s^2, the reference radius in km, J_n dimensionless (unnormalized).
//
// # Frames
//
// [ZonalCartesian] works in the inertial frame whose z axis is the
// symmetry axis of the body. [Plane] is an inertial basis of the orbit
// plane: P along the initial position, W along the angular momentum.
//
// # Conventions
//
// Lagrangians must build their result with hyperdual arithmetic only and
// must not keep their argument slices. A [System] is not safe for
// concurrent use and does not allocate. Wrong slice lengths panic; a
// singular mass matrix is returned as [ErrSingular] in a [*StateError];
// invalid parameters as [ErrParameter], invalid states as [ErrState].
package lagrange
