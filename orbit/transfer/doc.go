// Package transfer computes impulsive manoeuvre budgets between two-body
// orbits: Hohmann and bi-elliptic transfers, tangent transfers between apses
// of ellipses, plane changes alone or combined with a Hohmann transfer, and
// phasing in a circular orbit; and the rocket equation that turns delta-v
// into propellant.
//
// The common calls:
//
//	plan, err := transfer.Hohmann(mu, r1, r2)                  // circular to circular
//	plan, err := transfer.BiElliptic(mu, r1, r2, rb)           // via apoapsis radius rb
//	plan, err := transfer.ApsisTransfer(mu, from, transfer.Apoapsis, transfer.Circular(r), transfer.Periapsis)
//	plan, err := transfer.HohmannPlaneChange(mu, r1, r2, di)   // optimal split of di
//	plan, err := transfer.Phasing(mu, r, phase, revs, minRadius)
//	steps, err := transfer.PropellantBudget(plan.Burns, isp, massInitial)
//
// Every manoeuvre returns a [Plan]: its burns in order ([Burn]: where, how
// large, when, with how much plane change), the total delta-v, the transfer
// time, and the intermediate orbits flown ([Leg]).
//
// # Units
//
// Lengths and radii in km, speeds and delta-v in km/s, times in s, angles in
// radians, the gravitational parameter mu in km^3/s^2, specific impulse in s,
// masses in kg. Standard gravity [G0] is 9.80665 m/s^2 = 9.80665e-3 km/s^2
// exactly.
//
// # Frames
//
// None: the manoeuvres are planar (or, for plane changes, described by the
// angle between two planes), so only radii, speeds and angles appear. Radii
// are measured from the centre of the attracting body, not from its surface.
//
// # Conventions
//
//   - Burns are impulsive and, except for plane changes, tangential at an apsis.
//     Orbits are coplanar unless a plane change is asked for, and the apse lines
//     of the orbits joined by [ApsisTransfer] are aligned so that the arrival
//     apsis lies 180 degrees from the departure point.
//   - Burn.DeltaV is a magnitude (>= 0); Burn.SpeedChange is the signed change
//     of speed (negative when braking). Burn.Cumulative is the running total of
//     DeltaV. Burn.Time is measured from the first burn, which is at t = 0.
//   - Burn.TrueAnomaly is the true anomaly of the burn point on the transfer
//     orbit (Leg) that the burn starts or, for the last burn, ends: 0 at
//     periapsis, π at apoapsis. For a plane change alone it is the anomaly on the
//     orbit whose plane is turned.
//   - Plane change angles are magnitudes in [0, π]; phase angles are signed: the
//     target's position minus the chaser's, along the direction of motion.
//   - Errors: sentinel errors (ErrMu, ErrRadius, ...) wrapped in [*InputError]
//     naming the function, the parameter and its value, or [*PhasingError]. No
//     input makes a function panic or return NaN or an infinity.
package transfer
