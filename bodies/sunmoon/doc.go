// Package sunmoon gives geocentric positions of the Sun and the Moon from
// published analytic series, in the GCRF, in km.
//
//	s := sunmoon.Sun(epoch)   // [3]float64, km, GCRF
//	m := sunmoon.Moon(epoch)
//
// # Units
//
// Positions in km, angles in radians; dates are two-part Julian dates of
// TT ([timescale.Epoch.JDTT]). The series are in TDB; the difference from
// TT (< 2 ms) moves the Moon by 2 m and the Sun by 60 m, and is ignored.
//
// # Frames
//
// Both series give geometric (not apparent: no light time, no aberration)
// geocentric coordinates referred to the mean ecliptic and equinox of
// date; [earthframe.EclipticOfDate] (IAU 2006 precession with frame bias)
// rotates them into the GCRF.
//
// # Accuracy
//
// Sun: the Earth's heliocentric longitude and distance from VSOP87
// (Bretagnon & Francou 1988) as truncated in Meeus, Astronomical
// Algorithms, 2nd ed. (1998), Appendix III, further truncated here to the
// terms with amplitude at least 1000e-8 (10 periodic terms in L0, 2 in L1,
// 1 in L2; 5 in R0, 2 in R1, 1 in R2; latitude B, below 1.2 arcsec,
// neglected). The omitted terms add up to at most 23 arcsec in direction
// and 8100 km in distance; against ERFA epv00 the largest error found in
// a scan of 6000 dates over 1980-2060 is 10.4 arcsec (0.0029 deg) in
// direction and 4400 km in distance. Meant for 1900-2100.
//
// Moon: Meeus (1998), chapter 47, the ELP-2000/82 truncation with the 60
// longitude/distance terms of Table 47.A, the 60 latitude terms of Table
// 47.B and the additive terms for Venus, Jupiter and the flattening of
// the Earth, with the mean longitude of Simon et al. (1994) without
// Meeus's light-time constant (so the position is geometric, as ERFA
// moon98). ERFA reports for this algorithm, against ELP/MPP02 over
// 1950-2100, 2.9 arcsec RMS and 18.3 arcsec (0.005 deg) at worst in
// direction, 6.1 km RMS and 31.7 km at worst in distance.
//
// # Conventions
//
// Functions are pure; they allocate nothing and modify nothing.
package sunmoon
