package plots_test

import (
	"bytes"
	"encoding/xml"
	"errors"
	"image"
	_ "image/png"
	"io"
	"math"
	"testing"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"centra/bodies/geodesy"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/track"
	"centra/propagate/visibility"
	"centra/reports/plots"
)

const (
	earthMu = 398600.4418   // km^3/s^2, WGS 84 (NIMA TR8350.2, 3rd ed., Table 3.1)
	earthRe = 6378.137      // km, WGS 84
	earthJ2 = 1.08262668e-3 // EGM2008 C20 unnormalized (as in the bodies catalogue)
	deg     = math.Pi / 180
)

var epoch = timescale.MustParseUTC("2027-04-12T09:30:00Z")

func prop(t testing.TB, m propagate.Model) *propagate.Propagator {
	t.Helper()
	p, err := propagate.New(m, propagate.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

func state(t testing.TB, el orbit.Elements) orbit.State {
	t.Helper()
	s, err := orbit.StateFromElements(earthMu, el)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// ellipse is a = 12000 km, e = 0.3 starting at periapsis.
func ellipse() (orbit.Elements, float64, float64) {
	a, e := 12000.0, 0.3
	return orbit.Elements{P: a * (1 - e*e), E: e, I: 50 * deg, RAAN: 1, ArgP: 0.5}, a, e
}

func orbitFigure(t testing.TB) (*plots.Figure, float64, float64) {
	el, a, e := ellipse()
	period := 2 * math.Pi * math.Sqrt(a*a*a/earthMu)
	tr, err := track.Propagate(prop(t, propagate.PointMass(earthMu)), state(t, el), period, period/360)
	if err != nil {
		t.Fatal(err)
	}
	pts, aps := tr.InPlane(track.PerifocalOf(el))
	fig, err := plots.Orbit(plots.OrbitData{
		Header:     plots.Header{Body: "earth", Epoch: epoch.FormatUTC(), Model: "point mass", Span: period},
		BodyRadius: earthRe, Points: pts, Apsides: aps, Eccentricity: e,
		PeriapsisRadius: a * (1 - e), ApoapsisRadius: a * (1 + e), PeriapsisAlt: a*(1-e) - earthRe, ApoapsisAlt: a*(1+e) - earthRe,
	})
	if err != nil {
		t.Fatal(err)
	}
	return fig, a, e
}

var site = geodesy.Site{Lat: 47.412 * deg, Lon: 8.917 * deg, Alt: 0.612}

func groundFigure(t testing.TB, span, step float64) (*plots.Figure, *track.GroundTrack) {
	el := orbit.Elements{P: earthRe + 530, E: 0, I: 97.5 * deg, RAAN: 2}
	tr, err := track.Propagate(prop(t, propagate.J2(earthMu, earthRe, earthJ2)), state(t, el), span, step)
	if err != nil {
		t.Fatal(err)
	}
	a, err := visibility.NewSite("A", site, 10*deg, nil, false)
	if err != nil {
		t.Fatal(err)
	}
	b, err := visibility.NewSite("B", geodesy.Site{Lat: -77.8 * deg, Lon: 166.7 * deg}, 5*deg, nil, false)
	if err != nil {
		t.Fatal(err)
	}
	sites := []visibility.Site{a, b}
	g, err := track.Ground(tr, epoch, 0, earthRe, sites)
	if err != nil {
		t.Fatal(err)
	}
	d := plots.GroundData{Header: plots.Header{Body: "earth", Epoch: epoch.FormatUTC(), Model: "J2", Span: span}, Track: g}
	for _, s := range sites {
		lambda, err := track.CentralAngle(earthRe, g.MeanAlt, s.MinElevation)
		if err != nil {
			t.Fatal(err)
		}
		ss := s.Station.Site
		ring, err := track.VisibilityCircle(ss.Lat, ss.Lon, lambda, 180)
		if err != nil {
			t.Fatal(err)
		}
		d.Sites = append(d.Sites, plots.GroundSite{Name: s.Name, Lat: ss.Lat, Lon: ss.Lon, MinElevation: s.MinElevation, Circle: ring, CircleAlt: g.MeanAlt})
	}
	fig, err := plots.GroundTrack(d)
	if err != nil {
		t.Fatal(err)
	}
	return fig, g
}

func altitudeFigure(t testing.TB, speed bool) *plots.Figure {
	el, a, _ := ellipse()
	period := 2 * math.Pi * math.Sqrt(a*a*a/earthMu)
	tr, err := track.Propagate(prop(t, propagate.J2(earthMu, earthRe, earthJ2)), state(t, el), 3*period, period/200)
	if err != nil {
		t.Fatal(err)
	}
	samples, aps := tr.Profile(earthRe)
	fig, err := plots.Altitude(plots.AltitudeData{Header: plots.Header{Body: "earth"}, Samples: samples, Apsides: aps, Speed: speed})
	if err != nil {
		t.Fatal(err)
	}
	return fig
}

func skyFigure(t testing.TB) *plots.Figure {
	el := orbit.Elements{P: earthRe + 530, E: 0, I: 97.5 * deg, RAAN: 2}
	vs, err := visibility.NewSite("A", site, 10*deg, nil, false)
	if err != nil {
		t.Fatal(err)
	}
	passes, err := track.Sky(prop(t, propagate.J2(earthMu, earthRe, earthJ2)), state(t, el), epoch, 0, 86400, 10, earthRe, vs)
	if err != nil {
		t.Fatal(err)
	}
	d := plots.SkyData{Header: plots.Header{Body: "earth"}, Site: "A", MinElevation: 10 * deg}
	for _, ps := range passes {
		d.Passes = append(d.Passes, plots.SkyPass{AOS: epoch.Add(ps.AOS).FormatUTC(), LOS: epoch.Add(ps.LOS).FormatUTC(), MaxElevation: ps.MaxElevation(), Sunlit: ps.Sunlit, Path: ps.Path})
	}
	fig, err := plots.Sky(d)
	if err != nil {
		t.Fatal(err)
	}
	return fig
}

func dispersionFigure(t testing.TB) *plots.Figure {
	// Points on an ellipse and its centre: any cloud will do for drawing.
	e1 := plots.Ellipse{SemiMajor: 4, SemiMinor: 1.5, Azimuth: 30 * deg}
	e3 := plots.Ellipse{SemiMajor: 12, SemiMinor: 4.5, Azimuth: 30 * deg}
	pts := e1.Points(100)
	d := plots.DispersionData{Header: plots.Header{Body: "earth"}, MeanLat: 32 * deg, MeanLon: -106 * deg, Sigma1: e1, Sigma3: e3, HasNominal: true, NominalEast: 0.3, NominalNorth: -0.2}
	for _, p := range pts {
		d.East = append(d.East, p.X)
		d.North = append(d.North, p.Y)
	}
	fig, err := plots.Dispersion(d)
	if err != nil {
		t.Fatal(err)
	}
	return fig
}

// checkSVG parses the document to its end and wants an <svg> root.
func checkSVG(t *testing.T, b []byte) {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(b))
	root := ""
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("SVG does not parse: %v", err)
		}
		if se, ok := tok.(xml.StartElement); ok && root == "" {
			root = se.Name.Local
		}
	}
	if root != "svg" {
		t.Fatalf("SVG root element %q, want svg", root)
	}
	if bytes.Contains(b, []byte("NaN")) || bytes.Contains(b, []byte("Inf")) {
		t.Fatal("SVG contains NaN or Inf")
	}
}

// TestRenderEveryKind draws every kind to SVG and PNG and decodes both.
func TestRenderEveryKind(t *testing.T) {
	kinds := []struct {
		name string
		make func(t *testing.T) *plots.Figure
	}{
		{"orbit", func(t *testing.T) *plots.Figure { f, _, _ := orbitFigure(t); return f }},
		{"groundtrack", func(t *testing.T) *plots.Figure { f, _ := groundFigure(t, 3*5700, 30); return f }},
		{"altitude", func(t *testing.T) *plots.Figure { return altitudeFigure(t, false) }},
		{"altitude+speed", func(t *testing.T) *plots.Figure { return altitudeFigure(t, true) }},
		{"sky", func(t *testing.T) *plots.Figure { return skyFigure(t) }},
		{"dispersion", func(t *testing.T) *plots.Figure { return dispersionFigure(t) }},
	}
	for _, k := range kinds {
		t.Run(k.name, func(t *testing.T) {
			fig := k.make(t)
			var svg, png bytes.Buffer
			if err := fig.Render(&svg, plots.SVG, plots.DefaultSize); err != nil {
				t.Fatal(err)
			}
			checkSVG(t, svg.Bytes())
			size := plots.Size{Width: 6 * vg.Inch, Height: 4 * vg.Inch, DPI: 100}
			if err := fig.Render(&png, plots.PNG, size); err != nil {
				t.Fatal(err)
			}
			img, format, err := image.Decode(&png)
			if err != nil {
				t.Fatalf("PNG does not decode: %v", err)
			}
			if b := img.Bounds(); format != "png" || b.Dx() != 600 || b.Dy() != 400 {
				t.Errorf("decoded %s of %d x %d px, want png of 600 x 400", format, b.Dx(), b.Dy())
			}
		})
	}
}

// TestOrbitScale: the plotted trajectory reaches x = -a(1+e) (apoapsis,
// sampled exactly half a period after periapsis) and x = a(1-e), y = ±b
// (b = a sqrt(1-e^2)) (the conic's geometry, Kepler's first law); the
// axes hold that extent and scale x and y alike.
func TestOrbitScale(t *testing.T) {
	fig, a, e := orbitFigure(t)
	b := a * math.Sqrt(1-e*e)
	ext := fig.Extent
	const rel = 1e-6
	if math.Abs(ext.XMin+a*(1+e)) > rel*a || math.Abs(ext.XMax-a*(1-e)) > rel*a {
		t.Errorf("x extent [%.6f, %.6f] km, want [%.6f, %.6f]", ext.XMin, ext.XMax, -a*(1+e), a*(1-e))
	}
	// y = ±b is reached at the end of the minor axis, between samples:
	// within the chord error of one degree of true anomaly.
	if math.Abs(ext.YMax-b) > 2e-3*b || math.Abs(ext.YMin+b) > 2e-3*b {
		t.Errorf("y extent [%.3f, %.3f] km, want ±%.3f", ext.YMin, ext.YMax, b)
	}
	xmin, xmax := math.Inf(1), math.Inf(-1)
	for _, l := range fig.Lines {
		for _, q := range l {
			xmin, xmax = math.Min(xmin, q.X), math.Max(xmax, q.X)
		}
	}
	if xmin != ext.XMin || xmax != ext.XMax {
		t.Errorf("drawn lines span x [%g, %g], extent [%g, %g]", xmin, xmax, ext.XMin, ext.XMax)
	}
	for _, size := range []plots.Size{plots.DefaultSize, {Width: 4 * vg.Inch, Height: 7 * vg.Inch}, {Width: 10 * vg.Inch, Height: 3 * vg.Inch}} {
		da := fig.Fit(size)[0]
		p := fig.Panels[0]
		if p.X.Min > ext.XMin || p.X.Max < ext.XMax || p.Y.Min > ext.YMin || p.Y.Max < ext.YMax {
			t.Errorf("%v: axes [%g, %g] x [%g, %g] do not hold the orbit", size, p.X.Min, p.X.Max, p.Y.Min, p.Y.Max)
		}
		sx := (p.X.Max - p.X.Min) / float64(da.Max.X-da.Min.X)
		sy := (p.Y.Max - p.Y.Min) / float64(da.Max.Y-da.Min.Y)
		if math.Abs(sx/sy-1) > 5e-3 {
			t.Errorf("%v: %g km/pt across, %g km/pt up: not to scale", size, sx, sy)
		}
		// The tighter axis is filled: the orbit spans at least 80% of it.
		if fx, fy := (ext.XMax-ext.XMin)/(p.X.Max-p.X.Min), (ext.YMax-ext.YMin)/(p.Y.Max-p.Y.Min); math.Max(fx, fy) < 0.8 {
			t.Errorf("%v: the orbit fills %.2f and %.2f of the axes", size, fx, fy)
		}
	}
}

// TestGroundTrackPieces: no drawn piece of a day's ground track jumps
// more than 180 deg in longitude between consecutive points; pieces cut
// at the date line end on ±180 deg; the map is drawn at 1 deg of
// longitude = 1 deg of latitude.
func TestGroundTrackPieces(t *testing.T) {
	fig, g := groundFigure(t, 86400, 30)
	cuts := 0
	for _, l := range fig.Lines {
		for i := 1; i < len(l); i++ {
			if d := math.Abs(l[i].X - l[i-1].X); d > 180 {
				t.Fatalf("jump of %g deg in longitude at %v -> %v", d, l[i-1], l[i])
			}
		}
		if x := l[len(l)-1].X; math.Abs(x) == 180 {
			cuts++
		}
	}
	// A 530 km orbit circles the Earth about 15 times a day relative to
	// the ground; each circuit crosses the date line once.
	if cuts < 14 {
		t.Errorf("%d pieces end on the date line, want at least 14", cuts)
	}
	n := 0
	for _, l := range fig.Lines {
		n += len(l)
	}
	if n < len(g.Points) {
		t.Errorf("%d points drawn for %d track points", n, len(g.Points))
	}
	for _, size := range []plots.Size{plots.DefaultSize, {Width: 5 * vg.Inch, Height: 8 * vg.Inch}} {
		da := fig.Fit(size)[0]
		if r := float64(da.Max.X-da.Min.X) / float64(da.Max.Y-da.Min.Y); math.Abs(r-2) > 5e-3 {
			t.Errorf("%v: map drawn %g times as wide as high, want 2", size, r)
		}
	}
}

func TestSplitAtDateLine(t *testing.T) {
	in := plotter.XYs{{X: 170, Y: 0}, {X: -170, Y: 10}, {X: -150, Y: 12}, {X: 179, Y: 20}, {X: 175, Y: 21}, {X: -180, Y: 22}, {X: 180, Y: 23}}
	got := plots.SplitAtDateLine(in)
	want := []plotter.XYs{
		{{X: 170, Y: 0}, {X: 180, Y: 5}},
		{{X: -180, Y: 5}, {X: -170, Y: 10}, {X: -150, Y: 12}, {X: -180, Y: 12 + 8*30.0/31}},
		{{X: 180, Y: 12 + 8*30.0/31}, {X: 179, Y: 20}, {X: 175, Y: 21}, {X: 180, Y: 22}},
		{{X: -180, Y: 22}, {X: -180, Y: 22}, {X: -180, Y: 22.5}},
		{{X: 180, Y: 22.5}, {X: 180, Y: 23}},
	}
	// (-150, 12) -> (179, 20) goes west across -180: 30 deg of 31 to the
	// edge, at latitude 12 + 8 * 30/31. (175, 21) -> (-180, 22) is 5 deg
	// east to the edge; (-180, 22) -> (180, 23) is a jump of 360 deg at
	// the edge itself, cut halfway in latitude.
	if len(got) != len(want) {
		t.Fatalf("SplitAtDateLine = %v, want %v", got, want)
	}
	for i := range want {
		if len(got[i]) != len(want[i]) {
			t.Fatalf("piece %d = %v, want %v", i, got[i], want[i])
		}
		for j := range want[i] {
			if math.Abs(got[i][j].X-want[i][j].X) > 1e-12 || math.Abs(got[i][j].Y-want[i][j].Y) > 1e-12 {
				t.Errorf("piece %d point %d = %v, want %v", i, j, got[i][j], want[i][j])
			}
		}
	}
	if plots.SplitAtDateLine(nil) != nil {
		t.Error("SplitAtDateLine(nil) is not nil")
	}
}

// TestSkyXY: the chart's projection puts (az, el) = (90 deg, 0) on the
// east rim at (1, 0), north up, the zenith at the centre.
func TestSkyXY(t *testing.T) {
	cases := []struct{ az, el, x, y float64 }{
		{90, 0, 1, 0},   // east on the right rim
		{0, 0, 0, 1},    // north at the top
		{180, 0, 0, -1}, // south at the bottom
		{270, 0, -1, 0}, // west on the left
		{123, 90, 0, 0}, // zenith at the centre whatever the azimuth
		{90, 45, 0.5, 0},
		{45, 30, math.Sqrt(2) / 3, math.Sqrt(2) / 3},
	}
	for _, c := range cases {
		x, y := plots.SkyXY(c.az*deg, c.el*deg)
		if math.Abs(x-c.x) > 1e-15 || math.Abs(y-c.y) > 1e-15 {
			t.Errorf("SkyXY(%g deg, %g deg) = (%g, %g), want (%g, %g)", c.az, c.el, x, y, c.x, c.y)
		}
	}
}

func TestSkyScale(t *testing.T) {
	fig := skyFigure(t)
	da := fig.Fit(plots.DefaultSize)[0]
	p := fig.Panels[0]
	sx := (p.X.Max - p.X.Min) / float64(da.Max.X-da.Min.X)
	sy := (p.Y.Max - p.Y.Min) / float64(da.Max.Y-da.Min.Y)
	if math.Abs(sx/sy-1) > 5e-3 || p.X.Min > -1 || p.Y.Max < 1 {
		t.Errorf("sky chart axes [%g, %g] x [%g, %g], scales %g and %g: the horizon is not a circle", p.X.Min, p.X.Max, p.Y.Min, p.Y.Max, sx, sy)
	}
}

// TestEllipsePoints: the points satisfy the ellipse's equation in its
// own axes, and the major axis points to the azimuth.
func TestEllipsePoints(t *testing.T) {
	e := plots.Ellipse{SemiMajor: 5, SemiMinor: 2, Azimuth: 60 * deg}
	pts := e.Points(72)
	ua := [2]float64{math.Sin(e.Azimuth), math.Cos(e.Azimuth)}
	for _, p := range pts {
		u := p.X*ua[0] + p.Y*ua[1]
		v := p.X*ua[1] - p.Y*ua[0]
		if q := u*u/25 + v*v/4; math.Abs(q-1) > 1e-12 {
			t.Fatalf("point %v: (u/a)^2 + (v/b)^2 = %g", p, q)
		}
	}
	if p := pts[0]; math.Abs(p.X-5*math.Sin(60*deg)) > 1e-12 || math.Abs(p.Y-5*math.Cos(60*deg)) > 1e-12 {
		t.Errorf("first point %v, want the end of the major axis at azimuth 60 deg", p)
	}
}

func TestFormatAndSize(t *testing.T) {
	for _, c := range []struct {
		path string
		want plots.Format
	}{{"a.svg", plots.SVG}, {"dir/B.PNG", plots.PNG}, {"x.Svg", plots.SVG}} {
		if f, err := plots.FormatOfPath(c.path); err != nil || f != c.want {
			t.Errorf("FormatOfPath(%q) = %v, %v; want %v", c.path, f, err, c.want)
		}
	}
	for _, p := range []string{"a.pdf", "a", "a.svg.txt", ""} {
		if _, err := plots.FormatOfPath(p); !errors.Is(err, plots.ErrFormat) {
			t.Errorf("FormatOfPath(%q) error %v, want ErrFormat", p, err)
		}
	}
	if w, h := plots.DefaultSize.Pixels(); w != 1200 || h != 750 {
		t.Errorf("default PNG %d x %d px, want 1200 x 750", w, h)
	}
	bad := []plots.Size{
		{Width: 1 * vg.Inch, Height: 5 * vg.Inch},
		{Width: 8 * vg.Inch, Height: 200 * vg.Inch},
		{Width: 8 * vg.Inch, Height: 5 * vg.Inch, DPI: 1000},
		{Width: 90 * vg.Inch, Height: 90 * vg.Inch, DPI: 300},
	}
	for _, s := range bad {
		if err := s.Validate(plots.PNG); !errors.Is(err, plots.ErrSize) {
			t.Errorf("Validate(%+v) = %v, want ErrSize", s, err)
		}
	}
	if err := (plots.Size{Width: 90 * vg.Inch, Height: 90 * vg.Inch, DPI: 300}).Validate(plots.SVG); err != nil {
		t.Errorf("a large SVG is refused: %v", err)
	}
}

func TestBadData(t *testing.T) {
	nan := math.NaN()
	if _, err := plots.Orbit(plots.OrbitData{BodyRadius: earthRe, Points: []track.PlanePoint{{X: 1}, {X: nan}}}); !errors.Is(err, plots.ErrData) {
		t.Errorf("orbit with NaN: %v", err)
	}
	if _, err := plots.Orbit(plots.OrbitData{BodyRadius: earthRe}); !errors.Is(err, plots.ErrData) {
		t.Errorf("orbit without points: %v", err)
	}
	if _, err := plots.Altitude(plots.AltitudeData{Samples: []track.Sample{{T: 0}, {T: 1, Alt: math.Inf(1)}}}); !errors.Is(err, plots.ErrData) {
		t.Errorf("altitude with Inf: %v", err)
	}
	if _, err := plots.GroundTrack(plots.GroundData{}); !errors.Is(err, plots.ErrData) {
		t.Errorf("empty ground track: %v", err)
	}
	if _, err := plots.Dispersion(plots.DispersionData{East: []float64{1}}); !errors.Is(err, plots.ErrData) {
		t.Errorf("mismatched dispersion: %v", err)
	}
	if _, err := plots.Sky(plots.SkyData{MinElevation: 2}); !errors.Is(err, plots.ErrData) {
		t.Errorf("sky with min elevation 2 rad: %v", err)
	}
}

func TestFormatDuration(t *testing.T) {
	for _, c := range []struct {
		s    float64
		want string
	}{{12.5, "12.5 s"}, {5733, "1 h 35 min"}, {5400, "1 h 30 min"}, {600, "10 min"}, {90, "1 min 30 s"}, {86400, "1 d"}, {108000, "1 d 6 h"}, {-3600, "-1 h"}} {
		if got := plots.FormatDuration(c.s); got != c.want {
			t.Errorf("FormatDuration(%g) = %q, want %q", c.s, got, c.want)
		}
	}
}

// BenchmarkGroundTrackDay is the whole picture of a day's ground track
// at a 30 s step: propagation, ground track, drawing and the PNG.
func BenchmarkGroundTrackDay(b *testing.B) {
	for b.Loop() {
		fig, _ := groundFigure(b, 86400, 30)
		if err := fig.Render(io.Discard, plots.PNG, plots.DefaultSize); err != nil {
			b.Fatal(err)
		}
	}
}
