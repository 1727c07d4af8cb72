// Package quantity parses the quantities users type on the command line
// and in mission files: lengths, speeds, angles, durations, vectors of
// them, and tolerances of the form VALUE±TOL.
//
// # Units
//
// Every parser returns the internal unit of its kind:
//
//	Length    km    (accepts km, m, au; bare numbers are km)
//	Speed     km/s  (accepts km/s, m/s; bare numbers are km/s)
//	Angle     rad   (accepts deg, rad; bare numbers are degrees)
//	Duration  s     (accepts ms, s, min, h, d, y (Julian year, 365.25 d), combinable as 1d6h30min; bare numbers are s)
//	Mass      kg, Area m^2, Frequency MHz, Scalar (no unit allowed)
//
// The astronomical unit is the IAU 2012 Resolution B2 value,
// 149597870.700 km exactly.
//
// # Conventions
//
// Unknown units, NaN, Inf, empty parts and trailing junk are errors of
// type [*Error], which carries the bad text and the reason; the caller
// adds the flag name. Vectors are "x,y,z" and each part may carry its
// own unit ("7000km,0,0" or "7e6m,0m,0m").
package quantity
