// Package gravity evaluates the gravity field of an axially symmetric
// body, a point mass plus the zonal harmonics J2..J6, in closed form:
//
//	U = -mu/r [1 - sum_{n=2..N} J_n (Re/r)^n P_n(sin phi)],  sin phi = z/r,
//	a = -grad U = -mu/r^2 { u [1 - sum J_n (Re/r)^n P'_{n+1}(s)] + z^ sum J_n (Re/r)^n P'_n(s) }.
//
// It is the fast path of package propagate: TestFastPathMatchesEngine shows
// that these accelerations equal the Euler-Lagrange equations derived by
// package lagrange from the same potential to 1e-13 relative at 10^4
// random states.
//
// # Units
//
// Positions in km, accelerations in km/s^2, potential energy per unit mass
// in km^2/s^2, mu in km^3/s^2, Re in km, J_n dimensionless and
// unnormalized (J_n = -C_n0 sqrt(2n+1) from fully normalized C_n0).
//
// # Frames
//
// Body-centred, with z along the symmetry (rotation) axis; since the field
// is symmetric about z, any frame sharing that axis (an inertial one for
// the Earth when precession is ignored) may be used.
//
// # Conventions
//
// [Zonal] is built and validated by [New]; its methods take arrays by value
// and allocate nothing. At the centre (r = 0) the results are not finite:
// callers decide what a collision means. Invalid parameters are returned
// as [ErrMu], [ErrRadius], [ErrDegree] or [ErrCoefficient].
package gravity
