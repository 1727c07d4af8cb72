// Package visibility finds the passes of a spacecraft over ground sites:
// the windows in which it stands above a minimum elevation or a terrain
// mask, with acquisition (AOS), the time of greatest elevation (TCA), loss
// (LOS), look angles, the least range, the range rate for Doppler shifts,
// and whether the spacecraft is sunlit and the site dark.
//
//	fr := visibility.NewEarthFrame(start, dut1, span)      // once
//	res, err := visibility.FindAll(tr, fr, sites, visibility.Options{})
//	for _, p := range res[0].Passes { ... p.AOS, p.TCA, p.LOS, p.MaxElevation ... }
//
// # Units
//
// Times are seconds from the start of the [trajectory.Trajectory]; angles
// in radians (azimuth from north through east in [0, 2pi), elevation in
// [-pi/2, pi/2]); ranges km, range rates km/s (positive when the range
// grows); frequencies and Doppler shifts Hz.
//
// # Frames
//
// The trajectory is inertial (GCRF). A [Frame] rotates it into the
// Earth-fixed frame (ITRF, polar motion ignored) at any time; sites are
// geodetic on WGS 84 with the local east-north-up frame of package
// [centra/bodies/geodesy]. [EarthFrame] is the rotation of package
// [centra/bodies/earthframe] (IAU 2006/2000B, CIO based) made cheap for
// many times: the Earth rotation angle is evaluated exactly at every time
// from UT1 = UTC(start) + dut1 + t (UT1 runs on uniformly, also across a
// leap second, as the real UT1 does), and the slowly varying rest
// R3(-ERA) M (precession, nutation, the CIO and TIO locators) is
// interpolated linearly between nodes at most one hour apart. Over an hour
// that part turns by less than 0.02 arcsec, and the error of the linear
// interpolation, dominated by the 13.7-day nutation term, is below
// 1e-4 arcsec (3 mm at the surface); the tests compare with
// earthframe.NewRotation to 1e-9 rad.
//
// # Conventions
//
// A pass is a maximal window in which the elevation, apparent if
// [Site.Refraction] is set, exceeds the site's threshold: the larger of
// [Site.MinElevation] and the terrain [Mask] at the current azimuth. The
// search runs on the interpolated trajectory (see package trajectory for
// its error bound): first the windows above the lowest threshold at any
// azimuth, sampled at the trajectory step on Earth-fixed positions
// computed once per [Track] and shared by all sites (the test is on the
// sine of the geometric elevation against the sine of the geometric
// elevation whose apparent elevation is the threshold, which has the same
// sign and extrema as the elevation minus the threshold); then, with a
// mask, the windows above the mask within those, sampled every second. Window ends are
// located to [Options.Tol]; TCA is the maximum of the elevation in the
// window, the least range its own minimum (not always at TCA). Passes cut
// by the start or the end of the span are marked partial; a spacecraft
// that never sets gives one window over the whole span.
//
// Time accuracy: a position error dr moves the elevation by at most
// dr/range, so an event time by dr/(range * elevation rate). With the
// default trajectory bound of 0.1 m, a range of 500 km or more and the
// elevation rates of LEO passes at the horizon (1e-3 rad/s and more) this is
// below 1 ms; it grows without bound only for passes that just graze the
// threshold, whose AOS and LOS are ill-conditioned by nature.
//
// Refraction is the formula of Saemundsson (Sky and Telescope 72 (1986)
// 70) as given by Meeus, Astronomical Algorithms, 2nd ed. (1998), eq.
// 16.4, for 1010 hPa and 10 deg C, with the constant that makes it vanish
// at the zenith: R = 1.02' / tan(h + 10.3/(h + 5.11)) + 0.0019279', h the
// true (geometric) elevation in degrees. It is meant for h from 0 to 90
// deg; below -1 deg it is held at its value at -1 deg (0.65 deg), so the
// apparent elevation stays continuous.
//
// Doppler shift is non-relativistic: -f * range rate / c, with
// c = 299792.458 km/s exactly (SI definition of the metre).
//
// Everything a user's input can cause is a returned error ([ErrSite],
// [*MaskError]); the functions never return NaN.
package visibility
