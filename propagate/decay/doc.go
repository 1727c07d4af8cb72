// Package decay estimates the orbital lifetime of a satellite under
// atmospheric drag: the time until its altitude falls below a reentry
// altitude.
//
//	res, err := decay.Lifetime(decay.Config{Gravity: model, Drag: drag, Method: decay.Averaged}, s0)
//	days := res.T / 86400
//
// Two methods are offered:
//
//   - [Full] integrates the equations of motion of package propagate with
//     the gravity model, the drag and any further perturbations (Sun,
//     Moon, radiation pressure) until the geodetic height of the
//     trajectory crosses the reentry altitude, located on the dense
//     output. It is exact for the models but costs about 100 integration
//     steps per revolution: a year of LEO takes seconds.
//   - [Averaged] integrates the orbit-averaged rates of the mean elements
//     (a, e cos argp, e sin argp, i). Each rate is the average over one
//     revolution of Gauss's variational equations with the same drag force
//     (same atmosphere, same co-rotation, same geodetic height) evaluated
//     at points spread in eccentric anomaly along the osculating orbit of
//     the mean elements (first-order J2 short-period terms of
//     [orbit.MeanToOsculating] included, since they move the height by
//     kilometres); the secular J2 rotation of periapsis and the
//     long-period J3 term that makes frozen orbits frozen are added. Steps
//     are days long: a 25-year lifetime takes a fraction of a second. The
//     tests check it against Full on cases that decay within weeks, and
//     against the published first-order decay rate of a circular orbit in
//     an atmosphere of constant density, da/dt = -rho sqrt(mu a) Cd A / m.
//     Sun, Moon and radiation pressure are not in the averaged rates; for
//     orbits they shape (high apogees, GTO) use Full.
//
// The result is a planning estimate: the density of the upper atmosphere
// varies by an order of magnitude with solar activity, which no static
// model follows, so the uncertainty of the estimate is that of the density
// (bracket it with the drag's density scale).
//
// # Units
//
// km, km/s, s, rad as in package propagate; ballistic coefficients and
// densities in SI as in package forces. Times t are s from the initial
// state.
//
// # Frames
//
// GCRF, body-centred, as package propagate and package forces (the
// atmosphere co-rotates about the GCRF z axis). The reentry altitude is a
// geodetic height above the drag's ellipsoid (WGS 84). Perigee and apogee
// altitudes reported in [Sample] are mean radii minus the body's
// equatorial radius, as elsewhere in centra.
//
// # Conventions
//
// [Config] fields have documented zero values. Errors wrap [ErrConfig] for
// a configuration the user gave, and the errors of package propagate for a
// propagation that fails. A lifetime longer than MaxSpan is not an error:
// Result.Reentered is false.
package decay
