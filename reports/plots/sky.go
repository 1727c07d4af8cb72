package plots

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg/draw"

	"centra/propagate/track"
)

// SkyXY is the projection of the sky picture: azimuth az and elevation el
// (rad) to the plane, with the zenith at the origin, the horizon on the
// unit circle, north up (+y) and east right (+x), as on a map seen from
// above: x = r sin(az), y = r cos(az), r = (pi/2 - el)/(pi/2), linear in
// zenith distance. (Az, el) = (90 deg, 0) is (1, 0), the east rim.
func SkyXY(az, el float64) (x, y float64) {
	r := (math.Pi/2 - el) / (math.Pi / 2)
	s, c := math.Sincos(az)
	return r * s, r * c
}

// SkyPass is one pass on the sky picture.
type SkyPass struct {
	AOS, LOS     string  // RFC 3339 UTC times of acquisition and loss
	MaxElevation float64 // rad
	Sunlit       bool    // the spacecraft is outside the umbra at the greatest elevation
	Partial      bool    // cut by the start or the end of the span
	Path         []track.SkyPoint
}

// SkyData is the passes over one site.
type SkyData struct {
	Header
	Site         string  // name of the site, with its coordinates
	MinElevation float64 // rad: the threshold of a pass
	// Threshold, when not nil, is the threshold around the horizon (a
	// terrain mask, raised to MinElevation), drawn instead of the ring
	// of MinElevation.
	Threshold []track.SkyPoint
	// Refraction says that the elevations are apparent (refracted).
	Refraction bool
	Passes     []SkyPass
}

// maxSkyTimeLabels is the number of passes whose AOS and LOS carry their
// times on the picture; beyond it the legend carries them.
const maxSkyTimeLabels = 6

// passInks are told apart by hue and lightness.
var passInks = []color.NRGBA{
	{0x1f, 0x4e, 0x79, 0xff}, {0xd1, 0x5f, 0x0e, 0xff}, {0x2a, 0x8c, 0x55, 0xff}, {0x9b, 0x2d, 0x6f, 0xff},
	{0x4f, 0x9d, 0xd6, 0xff}, {0x8c, 0x6d, 0x1f, 0xff}, {0xc9, 0x3c, 0x3c, 0xff}, {0x55, 0x55, 0x55, 0xff},
}

// Sky draws each pass over a site on a polar azimuth-elevation chart:
// north up, east right, zenith at the centre, horizon on the rim, with
// AOS and LOS marked and labelled with their UTC times.
func Sky(d SkyData) (*Figure, error) {
	if !(d.MinElevation >= -10*math.Pi/180 && d.MinElevation <= math.Pi/2) {
		return nil, fmt.Errorf("%w: minimum elevation %g rad", ErrData, d.MinElevation)
	}
	for i, ps := range d.Passes {
		if len(ps.Path) < 2 {
			return nil, fmt.Errorf("%w: pass %d has %d points", ErrData, i+1, len(ps.Path))
		}
		for _, q := range ps.Path {
			if !finite(q.T, q.Az, q.El) {
				return nil, fmt.Errorf("%w: non-finite look angle in pass %d", ErrData, i+1)
			}
		}
	}
	what := "Sky view of the passes"
	if d.Site != "" {
		what += " over " + d.Site
	}
	p := newPlot(d.title(what))
	p.HideAxes()
	labels := &labelGroup{}
	// Elevation rings and azimuth spokes.
	ring := func(el float64) plotter.XYs {
		xys := make(plotter.XYs, 361)
		for k := range xys {
			x, y := SkyXY(float64(k)*math.Pi/180, el)
			xys[k] = plotter.XY{X: x, Y: y}
		}
		return xys
	}
	for _, el := range []float64{30, 60} {
		p.Add(line(ring(el*math.Pi/180), 0.6, gridInk))
		_, y := SkyXY(0, el*math.Pi/180)
		labels.Fixed = append(labels.Fixed, newLabel(0, y, 3, 2, fmt.Sprintf("%g°", el), 7.5, noteInk, draw.XLeft, draw.YBottom))
	}
	labels.Fixed = append(labels.Fixed, newLabel(0, 0, 3, 2, "90°", 7.5, noteInk, draw.XLeft, draw.YBottom))
	for k := range 12 {
		az := float64(k) * math.Pi / 6
		x, y := SkyXY(az, 0)
		p.Add(line(plotter.XYs{{X: 0, Y: 0}, {X: x, Y: y}}, 0.6, gridInk))
		name := fmt.Sprintf("%d°", k*30)
		size, clr := 7.5, noteInk
		switch k {
		case 0:
			name, size, clr = "N", 10, ink
		case 3:
			name, size, clr = "E", 10, ink
		case 6:
			name, size, clr = "S", 10, ink
		case 9:
			name, size, clr = "W", 10, ink
		}
		lx, ly := SkyXY(az, -0.08)
		labels.Fixed = append(labels.Fixed, newLabel(lx, ly, 0, 0, name, vgLength(size), clr, draw.XCenter, draw.YCenter))
	}
	p.Add(line(ring(0), 1.0, ink))
	legend := []LegendEntry{}
	switch {
	case len(d.Threshold) > 1:
		xys := make(plotter.XYs, 0, len(d.Threshold))
		for _, q := range d.Threshold {
			if !finite(q.Az, q.El) {
				return nil, fmt.Errorf("%w: non-finite threshold", ErrData)
			}
			x, y := SkyXY(q.Az, math.Max(q.El, -0.05))
			xys = append(xys, plotter.XY{X: x, Y: y})
		}
		p.Add(line(xys, 1.0, noteInk, 4, 3))
		legend = append(legend, LegendEntry{Label: fmt.Sprintf("terrain mask (at least %s°)", trimFloat(d.MinElevation*rad2deg, 2)), Thumbs: []plotThumb{thumbLine(1.0, noteInk, 4, 3)}})
	case d.MinElevation > 0:
		p.Add(line(ring(d.MinElevation), 0.9, noteInk, 4, 3))
		legend = append(legend, LegendEntry{Label: fmt.Sprintf("minimum elevation %s°", trimFloat(d.MinElevation*rad2deg, 2)), Thumbs: []plotThumb{thumbLine(0.9, noteInk, 4, 3)}})
	}
	if d.Refraction {
		legend = append(legend, LegendEntry{Label: "elevations apparent (refraction applied)"})
	}

	labelTimes := len(d.Passes) <= maxSkyTimeLabels
	for i, ps := range d.Passes {
		clr := passInks[i%len(passInks)]
		xys := make(plotter.XYs, len(ps.Path))
		best := 0
		for k, q := range ps.Path {
			x, y := SkyXY(q.Az, math.Max(q.El, -0.05))
			xys[k] = plotter.XY{X: x, Y: y}
			if q.El > ps.Path[best].El {
				best = k
			}
		}
		var dash []vgLength
		if !ps.Sunlit {
			dash = dashes(5, 2.5)
		}
		p.Add(line(xys, 1.6, clr, dash...))
		a, l := xys[0], xys[len(xys)-1]
		aos := &marker{X: a.X, Y: a.Y, Style: glyph(draw.CircleGlyph{}, 3.2, clr)}
		los := &marker{X: l.X, Y: l.Y, Style: glyph(draw.BoxGlyph{}, 2.8, clr)}
		p.Add(aos, los)
		num := fmt.Sprint(i + 1)
		b := xys[best]
		labels.Movable = append(labels.Movable, newLabel(b.X, b.Y, 0, 4, num, 9, clr, draw.XCenter, draw.YBottom))
		if labelTimes {
			labels.Movable = append(labels.Movable, edgeLabel(a.X, a.Y, num+" AOS "+clock(ps.AOS), clr), edgeLabel(l.X, l.Y, num+" LOS "+clock(ps.LOS), clr))
		}
		txt := fmt.Sprintf("%s: %s to %s UTC\nmax el %s°", num, dateClock(ps.AOS), clock(ps.LOS), trimFloat(ps.MaxElevation*rad2deg, 1))
		if !ps.Sunlit {
			txt += ", in shadow"
		}
		if ps.Partial {
			txt += ", cut by the span"
		}
		legend = append(legend, LegendEntry{Label: txt, Thumbs: []plotThumb{thumbLine(1.6, clr, dash...)}})
	}
	p.Add(labels)
	if len(d.Passes) == 0 {
		p.Add(newLabel(0, -0.5, 0, 0, "no pass above the minimum elevation in the span", 10, noteInk, draw.XCenter, draw.YCenter))
	}
	legend = append(legend,
		LegendEntry{Label: "AOS", Thumbs: []plotThumb{&marker{Style: glyph(draw.CircleGlyph{}, 3.2, ink)}}},
		LegendEntry{Label: "LOS", Thumbs: []plotThumb{&marker{Style: glyph(draw.BoxGlyph{}, 2.8, ink)}}},
		LegendEntry{Label: "dashed: in the Earth's shadow at the highest point", Thumbs: []plotThumb{thumbLine(1.6, ink, 5, 2.5)}},
		LegendEntry{Label: "chart: north up, east right (map view from above);\nzenith (el 90°) at the centre, horizon (el 0°) on the rim,\nelevation linear in zenith distance"},
	)
	ext := Extent{-1, 1, -1, 1}
	return &Figure{Panels: []*plotPlot{p}, Legend: legend, Extent: ext, aspect: aspectExpand, base: Extent{-1.15, 1.15, -1.15, 1.15}, legendRight: true}, nil
}

// edgeLabel places text beside a point on the side away from the centre.
func edgeLabel(x, y float64, text string, clr color.Color) *label {
	xa, dx := draw.XLeft, vgLength(5)
	if x < 0 {
		xa, dx = draw.XRight, -5
	}
	ya, dy := draw.YBottom, vgLength(3)
	if y < 0 {
		ya, dy = draw.YTop, -3
	}
	l := newLabel(x, y, dx, dy, text, 8, clr, xa, ya)
	l.Backdrop = color.NRGBA{0xff, 0xff, 0xff, 0xd8}
	return l
}

// clock returns hh:mm:ss of an RFC 3339 time, or the text unchanged.
func clock(utc string) string {
	if _, rest, ok := strings.Cut(utc, "T"); ok && len(rest) >= 8 {
		return rest[:8]
	}
	return utc
}

// dateClock returns "yyyy-mm-dd hh:mm:ss" of an RFC 3339 time.
func dateClock(utc string) string {
	if d, _, ok := strings.Cut(utc, "T"); ok {
		return d + " " + clock(utc)
	}
	return utc
}
