// Package orbit is the two-body mathematics of centra: states and classical
// elements and the conversions between them, Kepler's equation for every
// conic, analytic propagation, conic geometry, secular J2 rates and
// sun-synchronous design, and checks of a state against Kepler's laws.
//
// The common calls:
//
//	el, err := orbit.ElementsFromState(mu, s)     // r, v -> a, e, i, RAAN, argp, nu
//	s, err := orbit.StateFromElements(mu, el)     // and back
//	s1, err := orbit.Propagate(mu, s, dt)         // any conic, dt of either sign
//	g, err := orbit.GeometryOf(mu, el)            // period, apsides, speeds, v_inf
//	E := orbit.SolveKeplerElliptic(M, e)          // Kepler's equation
//	dO, dw, dM, err := orbit.J2Rates(mu, re, j2, a, e, i)
//	i, err := orbit.SunSynchronousInclination(mu, re, j2, a, e)
//	checks, err := orbit.KeplerChecks(mu, s)      // Kepler I-III, vis-viva, energy, h
//
// The package takes the gravitational parameter mu, reference radius re and
// zonal coefficient j2 as plain numbers; it knows no body.
//
// # Units
//
// Lengths in km, speeds in km/s, times in s, angles in rad, mu in km^3/s^2,
// rates in rad/s, specific energy in km^2/s^2, specific angular momentum in
// km^2/s. The universal anomaly of [Propagate] is in km^(1/2) (internal).
//
// # Frames
//
// A [State] is given in any inertial frame centred on the body (GCRF for
// the Earth). Inclination, node and the other angles are measured from that
// frame's xy-plane and +x axis: for GCRF the mean equator and equinox of
// J2000, to within the frame bias.
//
// # Conventions
//
//   - Elements: I in [0, pi]; RAAN and ArgP in [0, 2pi); Nu in [0, 2pi) for an
//     ellipse and between the asymptotes, (-arccos(-1/e), arccos(-1/e)), for a
//     hyperbola or parabola. A < 0 for a hyperbola and A = 0 for the parabola
//     (E == 1 exactly); P = h^2/mu is always set and is the size that
//     [StateFromElements] uses.
//   - Degenerate cases ([ElementsFromState]): circular (e < [CircularTolerance])
//     has ArgP = 0 and Nu = argument of latitude; equatorial (sin i <
//     [EquatorialTolerance]) has RAAN = 0, so ArgP is the longitude of
//     periapsis; circular equatorial has Nu = true longitude. Angles run in the
//     direction of motion, so on a retrograde equatorial orbit (I = pi) they
//     are measured clockwise seen from +z. Near-parabolic orbits (|e - 1| <
//     [ParabolicTolerance]) are parabolas.
//   - Mean anomaly: M = E - e sin E for an ellipse; the hyperbolic mean
//     anomaly M = e sinh H - H; for a parabola Barker's M = D/2 + D^3/6 with
//     D = tan(nu/2), so that in every case M = n (t - T) with n the
//     [Geometry] MeanMotion (sqrt(mu/p^3) for the parabola) and T the time of
//     periapsis passage.
//   - Kepler solvers and anomaly conversions ([SolveKeplerElliptic],
//     [TrueFromEccentric], ...) are math-style functions: they return NaN
//     outside their documented domain. Everything that takes a state or
//     elements ([ElementsFromState], [Propagate], [GeometryOf], [J2Rates],
//     [MeanFromTrue], ...) returns an error instead, wrapping one of the
//     sentinel errors (ErrRectilinear, ErrOpenOrbit, ...) in an [*InputError]
//     that names the function and the offending value; no result is NaN or
//     infinite. [Geometry] flags the quantities an orbit does not have
//     (HasPeriod, HasApoapsis, HasVInfinity, HasSemiMajorAxis) and leaves them
//     zero.
//   - Inputs are never modified; vectors are [3]float64 values.
//   - Some fast paths use math.FMA, which is a single instruction on amd64
//     processors with FMA3 (all since about 2013) and a slow software
//     emulation on older ones.
//
// # Accuracy
//
// State -> elements -> state round trips agree to 1e-12 relative (see the
// tests for the cases, including e ~ 1e-10, i ~ 1e-10, e = 1 +- 1e-6 and
// hyperbolas); [SolveKeplerElliptic] leaves |E - e sin E - M| <= 1e-15 rad;
// [Propagate] conserves energy and angular momentum to about 1e-13 and is
// limited only by the conditioning of the problem (very eccentric orbits
// over many periods, hyperbolas traced back from far out).
package orbit
