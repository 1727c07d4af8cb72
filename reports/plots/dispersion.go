package plots

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg/draw"
)

// Ellipse is an impact ellipse in the east-north tangent plane.
type Ellipse struct {
	SemiMajor, SemiMinor float64 // km
	Azimuth              float64 // of the major axis from north through east, rad
}

// Points returns n+1 points (east, north in km; the last repeats the
// first) of the ellipse centred at the origin.
func (e Ellipse) Points(n int) plotter.XYs {
	sa, ca := math.Sincos(e.Azimuth)
	u := [2]float64{sa, ca}  // major axis (east, north)
	v := [2]float64{ca, -sa} // minor axis, 90 deg clockwise of u
	out := make(plotter.XYs, n+1)
	for k := range out {
		s, c := math.Sincos(2 * math.Pi * float64(k%n) / float64(n))
		out[k] = plotter.XY{X: e.SemiMajor*c*u[0] + e.SemiMinor*s*v[0], Y: e.SemiMajor*c*u[1] + e.SemiMinor*s*v[1]}
	}
	return out
}

// DispersionData is the impact points of a dispersion run.
type DispersionData struct {
	Header
	// East and North place each case's impact point in the tangent plane
	// at the mean impact point, km.
	East, North      []float64
	MeanLat, MeanLon float64 // mean impact point, rad
	// CentreEast and CentreNorth (km) centre the ellipses: the mean of
	// East and North.
	CentreEast, CentreNorth float64
	Sigma1, Sigma3          Ellipse
	// Nominal, when HasNominal, is the impact point of the undispersed
	// arc in the same plane, km.
	NominalEast, NominalNorth float64
	HasNominal                bool
}

// MaxDispersionPoints bounds the impact points drawn; the legend says
// when only the first of them are shown.
const MaxDispersionPoints = 20000

// Dispersion draws the impact points east and north of their mean, to
// scale, with the 1-sigma and 3-sigma ellipses of their covariance.
func Dispersion(d DispersionData) (*Figure, error) {
	n := len(d.East)
	if n == 0 || len(d.North) != n {
		return nil, fmt.Errorf("%w: %d east and %d north offsets", ErrData, len(d.East), len(d.North))
	}
	for _, e := range []Ellipse{d.Sigma1, d.Sigma3} {
		if !finite(e.SemiMajor, e.SemiMinor, e.Azimuth) || e.SemiMajor < 0 || e.SemiMinor < 0 {
			return nil, fmt.Errorf("%w: ellipse %+v", ErrData, e)
		}
	}
	if !finite(d.MeanLat, d.MeanLon, d.NominalEast, d.NominalNorth) {
		return nil, fmt.Errorf("%w: mean or nominal impact point not finite", ErrData)
	}
	shown := min(n, MaxDispersionPoints)
	ext := emptyExtent()
	pts := make(plotter.XYs, shown)
	for i := range shown {
		if !finite(d.East[i], d.North[i]) {
			return nil, fmt.Errorf("%w: impact point %d not finite", ErrData, i+1)
		}
		pts[i] = plotter.XY{X: d.East[i], Y: d.North[i]}
		ext.add(pts[i].X, pts[i].Y)
	}
	e1, e3 := d.Sigma1.Points(180), d.Sigma3.Points(180)
	if !finite(d.CentreEast, d.CentreNorth) {
		return nil, fmt.Errorf("%w: ellipse centre not finite", ErrData)
	}
	for _, e := range []plotter.XYs{e1, e3} {
		for i := range e {
			e[i].X += d.CentreEast
			e[i].Y += d.CentreNorth
		}
	}
	view := ext
	for _, q := range e3 {
		view.add(q.X, q.Y)
	}
	view.add(0, 0)
	if d.HasNominal {
		view.add(d.NominalEast, d.NominalNorth)
	}
	if view.XMax-view.XMin < 1e-3 && view.YMax-view.YMin < 1e-3 {
		view = Extent{view.XMin - 0.5, view.XMax + 0.5, view.YMin - 0.5, view.YMax + 0.5}
	}
	lat, lon := d.MeanLat*rad2deg, d.MeanLon*rad2deg
	ns, ew := "N", "E"
	if lat < 0 {
		ns, lat = "S", -lat
	}
	lon = math.Remainder(lon, 360)
	if lon < 0 {
		ew, lon = "W", -lon
	}
	p := newPlot(d.title(fmt.Sprintf("Impact dispersion of %s cases about %.4f°%s %.4f°%s", groupDigits(float64(n)), lat, ns, lon, ew)))
	p.X.Label.Text = "east of the mean impact point (km)"
	p.Y.Label.Text = "north of the mean impact point (km)"
	p.X.Tick.Marker, p.Y.Tick.Marker = niceTicks{}, niceTicks{}
	gridLines(p)

	dot := glyph(draw.CircleGlyph{}, 1.3, color.NRGBA{0x1f, 0x4e, 0x79, 0x90})
	sc, _ := plotter.NewScatter(pts)
	sc.GlyphStyle = dot
	p.Add(sc)
	p.Add(line(e1, 1.6, viewInk))
	p.Add(line(e3, 1.6, periInk, 5, 3))
	mean := &marker{Style: glyph(draw.CrossGlyph{}, 5, ink)}
	legend := []LegendEntry{}
	cases := fmt.Sprintf("impact point (%s cases)", groupDigits(float64(n)))
	if shown < n {
		cases = fmt.Sprintf("impact point (first %s of %s cases shown)", groupDigits(float64(shown)), groupDigits(float64(n)))
	}
	legend = append(legend,
		LegendEntry{Label: cases, Thumbs: []plotThumb{&marker{Style: glyph(draw.CircleGlyph{}, 2, dot.Color)}}},
		LegendEntry{Label: "mean impact point", Thumbs: []plotThumb{mean}},
	)
	if d.HasNominal {
		nom := &marker{X: d.NominalEast, Y: d.NominalNorth, Style: glyph(draw.PyramidGlyph{}, 4, apoInk)}
		p.Add(nom)
		legend = append(legend, LegendEntry{Label: "nominal (undispersed) impact", Thumbs: []plotThumb{nom}})
	}
	p.Add(mean)
	legend = append(legend,
		LegendEntry{Label: ellipseText("1σ", d.Sigma1, 1), Thumbs: []plotThumb{thumbLine(1.6, viewInk)}},
		LegendEntry{Label: ellipseText("3σ", d.Sigma3, 3), Thumbs: []plotThumb{thumbLine(1.6, periInk, 5, 3)}},
		LegendEntry{Label: "planning estimate: the burnout dispersion dominates; defer to the launch range's safety office"},
	)
	return &Figure{Panels: []*plotPlot{p}, Legend: legend, Extent: ext, aspect: aspectExpand, base: view.pad(0.08)}, nil
}

// ellipseText describes the k-sigma ellipse; a bivariate normal puts
// 1 - exp(-k^2/2) of its mass inside it (the chi-square distribution with
// two degrees of freedom).
func ellipseText(name string, e Ellipse, k float64) string {
	return fmt.Sprintf("%s ellipse %s km × %s km, major axis at azimuth %s° (holds %.1f%% of a normal spread)",
		name, groupDigits(round(e.SemiMajor, 3)), groupDigits(round(e.SemiMinor, 3)), trimFloat(e.Azimuth*rad2deg, 1), 100*(1-math.Exp(-k*k/2)))
}
