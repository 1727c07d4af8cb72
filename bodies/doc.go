// Package bodies is the catalogue of central bodies: gravitational
// parameters, radii and reference ellipsoids, zonal gravity coefficients
// and rotation rates, each with the published source it comes from, plus
// user-defined bodies read from a small TOML "bodies file".
//
// The common calls:
//
//	earth, err := bodies.Lookup("earth")       // built-in body, case-insensitive
//	cat := bodies.NewCatalogue()               // built-ins, to extend
//	bs, err := bodies.LoadFile("my-bodies.toml")
//	err = cat.Merge(bs...)                     // file entries replace or add
//	mars, err := cat.Lookup("Mars")
//
// # Units
//
// Lengths in km, GM in km^3/s^2, rotation rates in rad/s, zonal
// coefficients J_n unnormalized and dimensionless. [AU] is in km. The same
// units, named in every key, are used in bodies files.
//
// # Frames
//
// A body's rotation is a rate about its north pole (the pole of the IAU
// WGCCRE report); positive is prograde, negative retrograde (Venus,
// Uranus). J_n are coefficients of the zonal expansion
// U = -(GM/r) [1 - sum_n J_n (R/r)^n P_n(sin(latitude))] in the body-fixed
// frame, where R is [Body.EquatorialRadius] and latitude is geocentric
// (body-centric). Orientation of the pole and prime meridian is not part
// of this package.
//
// # Conventions
//
// Names are lower case; [Lookup] and [Catalogue.Lookup] trim white space and
// ignore case. A [Body] returned by a lookup is a copy. J[n] is J_n; J[0]
// and J[1] are 0. Where a source gives its zonal coefficients for a
// reference radius R_ref other than the equatorial radius a used here, they
// are rescaled, J_n(a) = J_n(R_ref) (R_ref/a)^n, so that J_n (a/r)^n is
// unchanged; the body's JSource says so. Earth's EGM2008 coefficients are
// the exception: they are used with the WGS 84 a without rescaling (the
// relative effect is 1.1e-7 n).
//
// Every number names its source in a comment in catalogue.go and in the
// Body's Source fields, shown by `centra bodies NAME`. Values that were
// recalled rather than read from the source document when written are
// marked "from memory" in the comments and cross-checked in the tests
// against another source or a law (Kepler's third law with the Earth's
// year and the Moon's month, the geostationary radius, rotation periods,
// planetary mass ratios of the IAU 2009 system, planet-plus-satellite
// sums).
//
// # Catalogue
//
// The built-in bodies are sun, mercury, venus, earth, moon, mars, jupiter,
// saturn, uranus and neptune. Earth uses the WGS 84 ellipsoid, GM and
// rotation rate (NIMA TR8350.2, 3rd ed.) and the EGM2008 zonal
// coefficients J2..J6. The Sun and Jupiter use the IAU 2015 Resolution B3
// nominal GM and radii; other radii and rotation rates come from the IAU
// WGCCRE 2015 report (Archinal et al. 2018); other GM values from JPL DE440
// or, for the giant planets, from satellite-orbit solutions of the planet
// alone (without its satellites, the right value for orbits close to the
// planet).
//
// # Bodies file
//
// A bodies file is TOML (version 1.0). Each body is one table named
// [body.NAME]; NAME is 1 to 40 characters from a-z, 0-9, '-' and '_'
// (matched case-insensitively, so it may not appear twice in different
// case). The keys, all optional except as stated:
//
//	gm_km3_s2             GM, km^3/s^2, > 0            (required for a new body)
//	equatorial_radius_km  equatorial radius, km, > 0   (required for a new body)
//	mean_radius_km        mean radius, km, > 0
//	flattening            (a-b)/a, in [0, 1)
//	rotation_rate_rad_s   sidereal rotation rate, rad/s, negative for retrograde
//	j2 ... j20            unnormalized zonal coefficients J_n, |J_n| <= 1,
//	                      referred to equatorial_radius_km
//	source                free text naming where the numbers come from; it
//	                      becomes the source of every constant this table sets
//	description           one line for people
//
// Numbers may be written as integers or floats; NaN and infinities are
// refused. A table whose NAME is a built-in body overrides only the keys
// it gives and keeps the built-in values (and sources) of the others; if
// it changes equatorial_radius_km, the built-in J_n keep their values but
// now refer to the new radius, so restate them too. A new NAME defines a
// new body; keys it leaves out are 0. Any other key, a top-level key
// outside the [body.NAME] tables, a wrong type or an out-of-range value is
// an error that names the file, the line (when the TOML library reports
// it), the body, the key and the fix. For example:
//
//	# trainer.toml
//	[body.trainer]
//	description = "Trainer, a fictional planet for training"
//	source = "invented for the training course"
//	gm_km3_s2 = 3500.5
//	equatorial_radius_km = 600
//	rotation_rate_rad_s = 2.9088820866e-4
//
//	[body.earth]       # override one constant of the built-in Earth
//	j2 = 1.08262668e-3
//	source = "EGM96 J2, to compare with older results"
//
// [Parse] and [LoadFile] return the bodies with overrides already applied
// to the built-in values; [Catalogue.Merge] adds them to a catalogue.
package bodies
