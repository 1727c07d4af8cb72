// Package plots draws the pictures of centra: the orbit in its plane
// ([Orbit]), the ground track ([GroundTrack]), altitude and speed against
// time ([Altitude]), the passes over a site on a polar sky chart ([Sky])
// and the impact points of a ballistic dispersion ([Dispersion]), as SVG
// or PNG through gonum.org/v1/plot.
//
//	fig, err := plots.Orbit(plots.OrbitData{...})   // data computed elsewhere
//	err = fig.Render(w, plots.PNG, plots.DefaultSize) // 8 in x 5 in, 1200 x 750 px
//
// The package renders results; it computes no physics. The projections,
// visibility circles, passes and shadows it draws come from package
// centra/propagate/track and its neighbours; here they are only placed on
// the page (the one transform of its own, [SkyXY], is the chart's).
//
// # Units
//
// Data arrive in the units of the computation: km, km/s, s, rad. Axes
// say their unit in their label: km for distances, deg for angles (the
// map and the sky chart), the time unit chosen for the span (s, min, h
// or d since the epoch) for time axes. A [Size] is in vg.Length (1/72 in)
// with a PNG resolution in dots per inch.
//
// # Frames
//
// The orbit picture is the perifocal frame of the initial osculating
// elements (x toward periapsis, y 90 deg ahead in the direction of
// motion), drawn to scale. The ground track is geodetic longitude and
// latitude (WGS 84) on an equirectangular map, 1 deg across = 1 deg up.
// The sky chart has north up, east right (a map seen from above, not the
// sky seen from below), the zenith at the centre and the horizon on the
// rim, the radius linear in zenith distance. The dispersion picture is
// the east-north tangent plane at the mean impact point, to scale.
//
// # Conventions
//
// Every builder checks its data and returns [ErrData] for empty or
// non-finite input, so no NaN reaches a picture; [Figure.Render] checks
// the size ([ErrSize]). A [Figure] is one or more panels, a title across
// the top naming the body, epoch, model and span, and a legend strip
// along the bottom (a column on the right for the sky chart). Text is
// set in the Liberation Sans face that gonum/plot embeds, so a PNG looks
// the same on every machine; an SVG names the face and does not embed it
// (a viewer without it substitutes a sans-serif face).
//
// The ground track is cut where consecutive points are more than 180 deg
// apart in longitude ([SplitAtDateLine]), so no line crosses the map; a
// visibility circle around a pole is filled up to that pole. Labels of
// apsides and passes are placed so that they do not overlap, where a few
// shifts suffice; with many apsides or passes the legend carries the
// numbers instead.
package plots
