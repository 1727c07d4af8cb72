package plots

import (
	"fmt"
	"math"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg/draw"

	"centra/propagate/track"
)

// AltitudeData is altitude (and speed) against time.
type AltitudeData struct {
	Header
	Samples []track.Sample      // in time order
	Apsides []track.SampleApsis // located periapsides and apoapsides
	// Eccentricity of the initial osculating orbit: below 1e-4 the
	// apsides are not marked (their place is set by rounding).
	Eccentricity float64
	Speed        bool // add a panel of the speed
}

// maxApsisLabels is the number of apsides labelled one by one; beyond it
// only the lowest periapsis and the highest apoapsis carry a label.
const maxApsisLabels = 8

// Altitude draws altitude above the body's equatorial radius against time
// since the epoch, with the located apsides marked, and optionally a
// second panel of the inertial speed.
func Altitude(d AltitudeData) (*Figure, error) {
	if len(d.Samples) < 2 {
		return nil, fmt.Errorf("%w: an altitude picture needs at least 2 samples, got %d", ErrData, len(d.Samples))
	}
	ext := emptyExtent()
	for _, s := range d.Samples {
		if !finite(s.T, s.Alt, s.Speed) {
			return nil, fmt.Errorf("%w: non-finite sample at t = %g s", ErrData, s.T)
		}
		ext.add(s.T, s.Alt)
	}
	for _, a := range d.Apsides {
		if !finite(a.T, a.Alt, a.Speed) {
			return nil, fmt.Errorf("%w: non-finite apsis at t = %g s", ErrData, a.T)
		}
	}
	unit, scale := timeAxis(ext.XMax - ext.XMin)
	if unit == "min" && math.Abs(ext.XMax-ext.XMin) < 600 {
		unit, scale = "s", 1
	}
	what := "Altitude"
	if d.Speed {
		what = "Altitude and speed"
	}
	top := newPlot(d.title(what))
	panels := []*plotPlot{top}
	var bottom *plotPlot
	if d.Speed {
		bottom = newPlot("")
		panels = append(panels, bottom)
	}
	xlabel := fmt.Sprintf("time since epoch (%s)", unit)
	panels[len(panels)-1].X.Label.Text = xlabel
	top.Y.Label.Text = "altitude (km)"
	top.Y.Tick.Marker = niceTicks{}
	gridLines(top)

	alt := make(plotter.XYs, len(d.Samples))
	spd := make(plotter.XYs, len(d.Samples))
	for i, s := range d.Samples {
		alt[i] = plotter.XY{X: s.T / scale, Y: s.Alt}
		spd[i] = plotter.XY{X: s.T / scale, Y: s.Speed}
	}
	top.Add(line(alt, 1.3, trackInk))
	legend := []LegendEntry{{Label: "altitude above the equatorial radius", Thumbs: []plotThumb{thumbLine(1.3, trackInk)}}}
	if bottom != nil {
		bottom.Y.Label.Text = "speed (km/s)"
		gridLines(bottom)
		bottom.Add(line(spd, 1.3, viewInk))
		legend = append(legend, LegendEntry{Label: "inertial speed", Thumbs: []plotThumb{thumbLine(1.3, viewInk)}})
	}

	// Apsides: markers; labels on a few.
	lowP, highA := -1, -1
	for i, a := range d.Apsides {
		if a.Periapsis && (lowP < 0 || a.Alt < d.Apsides[lowP].Alt) {
			lowP = i
		}
		if !a.Periapsis && (highA < 0 || a.Alt > d.Apsides[highA].Alt) {
			highA = i
		}
	}
	if d.Eccentricity < circularE {
		legend = append(legend, LegendEntry{Label: fmt.Sprintf("circular (e = %.2g): apsides not marked", d.Eccentricity)})
		d.Apsides = nil
	}
	periStyle := glyph(draw.PyramidGlyph{}, 4, periInk)
	apoStyle := glyph(draw.BoxGlyph{}, 3, apoInk)
	nP, nA := 0, 0
	t0, t1 := ext.XMin/scale, ext.XMax/scale
	few := len(d.Apsides) <= maxApsisLabels
	for _, a := range d.Apsides {
		sty, clr, dy, ya := apoStyle, apoInk, 6.0, draw.YBottom
		if a.Periapsis {
			sty, clr, dy, ya = periStyle, periInk, -6.0, draw.YTop
			nP++
		} else {
			nA++
		}
		x := a.T / scale
		top.Add(&marker{X: x, Y: a.Alt, Style: sty})
		if bottom != nil {
			bottom.Add(&marker{X: x, Y: a.Speed, Style: sty})
		}
		if few {
			xa := draw.XCenter
			switch f := (x - t0) / (t1 - t0); {
			case f < 0.12:
				xa = draw.XLeft
			case f > 0.88:
				xa = draw.XRight
			}
			top.Add(newLabel(x, a.Alt, 0, dyLen(dy), groupDigits(round(a.Alt, 1))+" km", 8, clr, xa, ya))
		}
	}
	if nP > 0 {
		txt := fmt.Sprintf("periapsis (%d located)", nP)
		if !few {
			lo := d.Apsides[lowP]
			txt += fmt.Sprintf(", lowest %s km at %s %s", groupDigits(round(lo.Alt, 1)), trimFloat(lo.T/scale, 2), unit)
		}
		legend = append(legend, LegendEntry{Label: txt, Thumbs: []plotThumb{&marker{Style: periStyle}}})
	}
	if nA > 0 {
		txt := fmt.Sprintf("apoapsis (%d located)", nA)
		if !few {
			hi := d.Apsides[highA]
			txt += fmt.Sprintf(", highest %s km at %s %s", groupDigits(round(hi.Alt, 1)), trimFloat(hi.T/scale, 2), unit)
		}
		legend = append(legend, LegendEntry{Label: txt, Thumbs: []plotThumb{&marker{Style: apoStyle}}})
	}
	for _, p := range panels {
		p.X.Tick.Marker = niceTicks{}
		p.Y.Tick.Marker = niceTicks{}
	}
	// Room above and below for the labels.
	pad := 0.04
	if few && len(d.Apsides) > 0 {
		pad = 0.22
	}
	alo, ahi := ext.YMin, ext.YMax
	vlo, vhi := math.Inf(1), math.Inf(-1)
	for _, s := range d.Samples {
		vlo, vhi = math.Min(vlo, s.Speed), math.Max(vhi, s.Speed)
	}
	for _, a := range d.Apsides {
		alo, ahi = math.Min(alo, a.Alt), math.Max(ahi, a.Alt)
		vlo, vhi = math.Min(vlo, a.Speed), math.Max(vhi, a.Speed)
	}
	top.Y.Min, top.Y.Max = padRange(alo, ahi, pad)
	if bottom != nil {
		bottom.Y.Min, bottom.Y.Max = padRange(vlo, vhi, 0.04)
	}
	for _, p := range panels {
		p.X.Min, p.X.Max = ext.XMin/scale, ext.XMax/scale
		if p.X.Min > p.X.Max {
			p.X.Min, p.X.Max = p.X.Max, p.X.Min
		}
	}
	return &Figure{Panels: panels, Legend: legend, Extent: ext}, nil
}

func padRange(lo, hi, frac float64) (float64, float64) {
	d := (hi - lo) * frac
	if d == 0 {
		d = math.Max(1, math.Abs(hi)*0.01)
	}
	return lo - d, hi + d
}
