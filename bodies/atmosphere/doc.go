// Package atmosphere is Earth's neutral-atmosphere density model for drag:
// the U.S. Standard Atmosphere 1976 from -5 to 86 km and a piecewise
// exponential density table above 86 km.
//
// The common calls:
//
//	rho := atmosphere.Density(400)          // kg/m^3, for a drag right-hand side
//	p, err := atmosphere.Properties(30)     // density, temperature, pressure, with checks
//	rho = scale.Density(400)                // scale is a DensityScale, validated once
//
// # Units
//
// Altitudes in km (geometric height above the reference surface, that is
// above sea level; the caller decides how it computes altitude, usually
// above the WGS 84 ellipsoid). Density in kg/m^3, temperature in K,
// pressure in Pa. Note that density is in SI units while the rest of
// centra uses km: a drag acceleration in km/s^2 needs a factor 1000 (m per
// km) somewhere, which the caller supplies.
//
// # Frames
//
// The model is static and spherically symmetric: density depends on
// altitude only, with no dependence on latitude, local time, season or
// solar and geomagnetic activity. The atmosphere is taken to co-rotate with
// the Earth by callers that compute the relative wind; this package does
// not.
//
// # Models and altitudes
//
//   - -5 km <= h <= 86 km: U.S. Standard Atmosphere 1976 (NOAA, NASA and
//     USAF, NOAA-S/T 76-1562, Washington 1976), Part 1, exactly as defined:
//     geometric altitude Z is converted to geopotential altitude
//     H = r0 Z / (r0 + Z) with r0 = 6356.766 km; seven layers with base
//     geopotential heights 0, 11, 20, 32, 47, 51, 71 km' (top 84.852 km',
//     where T_M = 186.946 K; 86 km is 84.852046 km' and the last 0.05 m'
//     are isothermal) and molecular-scale temperature lapse rates -6.5, 0,
//     +1.0, +2.8, 0, -2.8, -2.0 K/km'; T0 = 288.15 K, P0 = 101325 Pa,
//     R* = 8.31432 J/(mol K), M0 = 28.9644 kg/kmol, g0 = 9.80665 m/s^2.
//     Pressure follows the standard's closed-form hydrostatic equations
//     and density is rho = P M0 / (R* T_M). The first layer is continued
//     down to -5 km as the standard's tables are. [Properties] reports the
//     model [ModelUSSA1976].
//   - h > 86 km: density only, from the exponential model of Vallado,
//     Fundamentals of Astrodynamics and Applications, 4th ed. (2013),
//     Table 8-4: rho = rho0 exp(-(h - h0)/H) with the row whose base h0 is
//     the highest base not above h (the 80 km row for 86 <= h < 90 km).
//     Above 1000 km the last row (h0 = 1000 km, H = 268 km) is continued:
//     density keeps falling with a 268 km scale height and never becomes 0
//     or negative except by floating-point underflow, far beyond any orbit
//     with drag. [Properties] reports the model [ModelExponential] and has
//     no temperature or pressure (HasTemperature and HasPressure are
//     false, TemperatureK and PressurePa are 0; callers print them as
//     null).
//
// The two models do not join exactly: at 86 km the exponential table gives
// 2.7% less than the USSA 1976 density, and density steps down by that
// amount across 86 km (it never steps up, so density decreases with
// altitude everywhere).
//
// Temperature below 86 km is the molecular-scale temperature T_M of the
// standard. It equals the kinetic temperature up to 80 km; between 80 and
// 86 km the standard's kinetic temperature is T = T_M (M/M0) with the
// molecular-weight ratio of its Table 8, at most 0.042% lower (0.08 K at
// 86 km, where M/M0 = 0.999579). That correction is omitted here; density
// and pressure do not depend on it.
//
// # Conventions
//
// [Properties] is for values a user asked for: an altitude that is NaN,
// infinite or below [MinAltitudeKm] (-5 km) is a returned *[AltitudeError].
// [Density] is for a drag right-hand side: it does not allocate or return
// an error, clamps altitudes below -5 km to the -5 km density, returns 0
// for +Inf and NaN for NaN.
//
// The exponential table is a mean model for moderate solar activity; real
// densities above about 200 km vary by a factor of 10 or more with the
// solar cycle. A [DensityScale] is a factor that callers multiply into the
// density (for example to bracket a lifetime estimate between solar
// minimum and maximum); the model itself never applies it. It must be
// validated with [DensityScale.Validate] before use.
package atmosphere
