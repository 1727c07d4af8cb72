package plots

import (
	"fmt"
	"math"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"centra/propagate/track"
)

// OrbitData is the trajectory in the plane of the initial osculating
// orbit (perifocal frame: x toward periapsis, y 90 deg ahead).
type OrbitData struct {
	Header
	BodyRadius   float64            // km: the body is drawn as a disc of this radius
	Points       []track.PlanePoint // the trajectory, in time order
	Apsides      []track.PlaneApsis // located apsides (drawn as small marks, coloured by time)
	Eccentricity float64            // of the initial osculating conic
	// PeriapsisRadius and ApoapsisRadius (km) of the initial osculating
	// conic: marked at (r_p, 0) and (-r_a, 0) with their altitudes.
	// ApoapsisRadius is 0 for an open orbit.
	PeriapsisRadius, ApoapsisRadius float64
	PeriapsisAlt, ApoapsisAlt       float64 // km above the body's radius
}

// circularE is the eccentricity below which the apsides are not marked:
// their direction is then set by rounding, not by the orbit.
const circularE = 1e-4

// Orbit draws the trajectory in its plane, to scale (equal axes), with
// the body as a disc, the initial conic's periapsis and apoapsis and line
// of apsides, and the track coloured from pale (t = 0) to deep (end of
// span) so that the drift of a perturbed orbit shows.
func Orbit(d OrbitData) (*Figure, error) {
	if len(d.Points) < 2 {
		return nil, fmt.Errorf("%w: an orbit picture needs at least 2 points, got %d", ErrData, len(d.Points))
	}
	if !finite(d.BodyRadius, d.PeriapsisRadius, d.ApoapsisRadius, d.PeriapsisAlt, d.ApoapsisAlt, d.Eccentricity) || !(d.BodyRadius > 0) {
		return nil, fmt.Errorf("%w: body radius %g km, apsides %g km, %g km", ErrData, d.BodyRadius, d.PeriapsisRadius, d.ApoapsisRadius)
	}
	ext := emptyExtent()
	for _, p := range d.Points {
		if !finite(p.T, p.X, p.Y) {
			return nil, fmt.Errorf("%w: non-finite point at t = %g s", ErrData, p.T)
		}
		ext.add(p.X, p.Y)
	}
	p := newPlot(d.title("Orbit in its initial plane"))
	p.X.Label.Text = "x toward initial periapsis (km)"
	p.Y.Label.Text = "y, 90° ahead in the direction of motion (km)"
	p.X.Tick.Marker, p.Y.Tick.Marker = niceTicks{}, niceTicks{}
	gridLines(p)

	// The body.
	const nDisc = 240
	disc := make(plotter.XYs, nDisc)
	for i := range disc {
		s, c := math.Sincos(2 * math.Pi * float64(i) / nDisc)
		disc[i] = plotter.XY{X: d.BodyRadius * c, Y: d.BodyRadius * s}
	}
	body, _ := plotter.NewPolygon(disc)
	body.Color = bodyFill
	body.LineStyle = draw.LineStyle{Color: bodyEdge, Width: 0.8}
	p.Add(body)
	view := ext
	view.add(-d.BodyRadius, -d.BodyRadius)
	view.add(d.BodyRadius, d.BodyRadius)

	// The line of apsides of the initial conic.
	marked := d.Eccentricity >= circularE
	if marked {
		lo := -view.XMax
		if d.ApoapsisRadius > 0 {
			lo = -d.ApoapsisRadius
		}
		lo = math.Min(lo, view.XMin)
		hi := math.Max(d.PeriapsisRadius, view.XMax)
		p.Add(line(plotter.XYs{{X: lo, Y: 0}, {X: hi, Y: 0}}, 0.7, noteInk, 4, 3))
	}

	// The trajectory in colour bins of time.
	t0, t1 := d.Points[0].T, d.Points[len(d.Points)-1].T
	frac := func(t float64) float64 {
		if t1 == t0 {
			return 1
		}
		return (t - t0) / (t1 - t0)
	}
	const bins = 48
	var lines []plotter.XYs
	start := 0
	bin := func(i int) int { return int(math.Min(bins-1, math.Floor(frac(d.Points[i].T)*bins))) }
	for i := 1; i <= len(d.Points); i++ {
		if i < len(d.Points) && bin(i) == bin(start) {
			continue
		}
		end := min(i, len(d.Points)-1)
		xys := make(plotter.XYs, 0, end-start+1)
		for _, q := range d.Points[start : end+1] {
			xys = append(xys, plotter.XY{X: q.X, Y: q.Y})
		}
		p.Add(line(xys, 1.4, ramp((float64(bin(start))+0.5)/bins)))
		lines = append(lines, xys)
		start = i
	}

	// Located apsides, small and coloured by time.
	for _, a := range d.Apsides {
		if !marked || !finite(a.X, a.Y) {
			continue
		}
		clr := apoInk
		if a.Periapsis {
			clr = periInk
		}
		p.Add(&marker{X: a.X, Y: a.Y, Style: glyph(draw.CircleGlyph{}, 1.6, clr)})
	}

	// Start of the trajectory.
	s := d.Points[0]
	p.Add(&marker{X: s.X, Y: s.Y, Style: glyph(draw.CircleGlyph{}, 3.2, ink)})
	p.Add(newLabel(s.X, s.Y, 5, 5, "t = 0", 8.5, ink, draw.XLeft, draw.YBottom))

	var legend []LegendEntry
	legend = append(legend,
		LegendEntry{Label: "track at t = 0", Thumbs: []plotThumb{thumbLine(2, ramp(0))}},
		LegendEntry{Label: "at the end of the span", Thumbs: []plotThumb{thumbLine(2, ramp(1))}},
	)
	if marked {
		peri := &marker{X: d.PeriapsisRadius, Y: 0, Style: glyph(draw.PyramidGlyph{}, 4.5, periInk)}
		p.Add(peri)
		p.Add(newLabel(d.PeriapsisRadius, 0, 6, -6, fmt.Sprintf("periapsis\naltitude %s km", groupDigits(round(d.PeriapsisAlt, 1))), 8.5, periInk, draw.XLeft, draw.YTop))
		view.add(d.PeriapsisRadius, 0)
		legend = append(legend, LegendEntry{Label: "periapsis (initial conic)", Thumbs: []plotThumb{peri}})
		if d.ApoapsisRadius > 0 {
			apo := &marker{X: -d.ApoapsisRadius, Y: 0, Style: glyph(draw.BoxGlyph{}, 3.5, apoInk)}
			p.Add(apo)
			p.Add(newLabel(-d.ApoapsisRadius, 0, -6, -6, fmt.Sprintf("apoapsis\naltitude %s km", groupDigits(round(d.ApoapsisAlt, 1))), 8.5, apoInk, draw.XRight, draw.YTop))
			view.add(-d.ApoapsisRadius, 0)
			legend = append(legend, LegendEntry{Label: "apoapsis", Thumbs: []plotThumb{apo}})
		}
		legend = append(legend, LegendEntry{Label: "line of apsides", Thumbs: []plotThumb{thumbLine(0.7, noteInk, 4, 3)}})
		if len(d.Apsides) > 0 {
			legend = append(legend, LegendEntry{Label: "periapsides / apoapsides located over the span", Thumbs: []plotThumb{
				glyphPair{glyph(draw.CircleGlyph{}, 1.8, periInk), glyph(draw.CircleGlyph{}, 1.8, apoInk)}}})
		}
	} else {
		legend = append(legend, LegendEntry{Label: fmt.Sprintf("circular (e = %.2g): no apsides marked", d.Eccentricity)})
	}
	legend = append(legend, LegendEntry{Label: titleCase(d.Body) + fmt.Sprintf(" (radius %s km)", groupDigits(round(d.BodyRadius, 1))), Thumbs: []plotThumb{thumbFill{Fill: bodyFill, Edge: bodyEdge}}})

	fig := &Figure{Panels: []*plotPlot{p}, Legend: legend, Extent: ext, Lines: lines, aspect: aspectExpand, base: view.pad(0.06)}
	return fig, nil
}

func round(x float64, digits int) float64 {
	k := math.Pow(10, float64(digits))
	return math.Round(x*k) / k
}

var _ = vg.Points
