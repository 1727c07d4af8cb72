package plots

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg/draw"

	"centra/propagate/track"
)

const rad2deg = 180 / math.Pi

// GroundSite is a site on the ground-track map.
type GroundSite struct {
	Name         string
	Lat, Lon     float64        // rad
	MinElevation float64        // rad
	Circle       []track.LatLon // visibility circle (rad); nil: not drawn
	CircleAlt    float64        // km: the altitude the circle is drawn for
}

// GroundData is a ground track with its sites.
type GroundData struct {
	Header
	Track *track.GroundTrack
	Sites []GroundSite // Track.InView[k] belongs to Sites[k]
}

// Track styles: in view of a site or not, sunlit or in shadow.
var (
	litStyle    = draw.LineStyle{Color: trackInk, Width: 1.1}
	shadowStyle = draw.LineStyle{Color: shadeInk, Width: 1.1, Dashes: dashes(3, 2)}
	viewStyle   = draw.LineStyle{Color: viewInk, Width: 2.6}
	viewShadow  = draw.LineStyle{Color: viewInk, Width: 2.6, Dashes: dashes(4, 2)}
	circleFill  = color.NRGBA{0xe0, 0x7a, 0x1f, 0x26}
	siteInk     = color.NRGBA{0x7a, 0x1f, 0x5c, 0xff}
)

func dashes(d ...float64) []vgLength {
	out := make([]vgLength, len(d))
	for i, x := range d {
		out[i] = vgLength(x)
	}
	return out
}

// GroundTrack draws the track on an equirectangular map of longitude
// and latitude in degrees with a 30 deg graticule, cut where it crosses
// the date line, with each site, its visibility circle, the segments in
// view of any site highlighted and the segments in shadow dashed.
func GroundTrack(d GroundData) (*Figure, error) {
	if d.Track == nil || len(d.Track.Points) < 2 {
		return nil, fmt.Errorf("%w: a ground track needs at least 2 points", ErrData)
	}
	if len(d.Track.InView) != len(d.Sites) {
		return nil, fmt.Errorf("%w: %d visibility series for %d sites", ErrData, len(d.Track.InView), len(d.Sites))
	}
	pts := d.Track.Points
	ext := emptyExtent()
	for _, p := range pts {
		if !finite(p.T, p.Lat, p.Lon, p.Alt) {
			return nil, fmt.Errorf("%w: non-finite ground point at t = %g s", ErrData, p.T)
		}
		ext.add(p.Lon*rad2deg, p.Lat*rad2deg)
	}
	p := newPlot(d.title("Ground track"))
	p.X.Label.Text = "geodetic longitude (deg)"
	p.Y.Label.Text = "geodetic latitude (deg, WGS 84)"
	p.X.Tick.Marker = stepTicks{Step: 30, Label: lonLabel}
	p.Y.Tick.Marker = stepTicks{Step: 30, Label: latLabel}
	gridLines(p)
	// The frame of the map.
	frame := line(plotter.XYs{{X: -180, Y: -90}, {X: 180, Y: -90}, {X: 180, Y: 90}, {X: -180, Y: 90}, {X: -180, Y: -90}}, 0.8, noteInk)
	p.Add(frame)
	p.Add(line(plotter.XYs{{X: -180, Y: 0}, {X: 180, Y: 0}}, 0.7, noteInk))

	var legend []LegendEntry

	// Visibility circles under the track.
	for _, s := range d.Sites {
		if len(s.Circle) < 3 {
			continue
		}
		ring := make(plotter.XYs, len(s.Circle))
		for i, q := range s.Circle {
			ring[i] = plotter.XY{X: q.Lon * rad2deg, Y: q.Lat * rad2deg}
		}
		for _, poly := range circleFillPolygons(ring, s.Lat >= 0) {
			pg, err := plotter.NewPolygon(poly)
			if err != nil {
				continue
			}
			pg.Color = circleFill
			pg.LineStyle.Width = 0
			p.Add(pg)
		}
		for _, seg := range SplitAtDateLine(ring) {
			p.Add(line(seg, 0.9, viewInk, 3, 2))
		}
	}
	if len(d.Sites) > 0 {
		if len(d.Sites[0].Circle) > 0 {
			legend = append(legend, LegendEntry{
				Label:  fmt.Sprintf("visibility at el ≥ %s° for h = %s km (spherical Earth)", trimFloat(d.Sites[0].MinElevation*rad2deg, 1), groupDigits(round(d.Sites[0].CircleAlt, 0))),
				Thumbs: []plotThumb{thumbFill{Fill: circleFill}, thumbLine(0.9, viewInk, 3, 2)},
			})
		}
	}

	// The track, in runs of one style.
	style := func(i int) int {
		s := 0
		for k := range d.Sites {
			if d.Track.InView[k][i] {
				s = 2
				break
			}
		}
		if !pts[i].Sunlit {
			s++
		}
		return s
	}
	styles := [4]draw.LineStyle{litStyle, shadowStyle, viewStyle, viewShadow}
	names := [4]string{"sunlit", "in the Earth's shadow (umbra)", "in view of a site", "in view, in shadow"}
	var used [4]bool
	var lines []plotter.XYs
	start := 0
	for i := 1; i < len(pts); i++ {
		if i < len(pts)-1 && style(i) == style(start) {
			continue
		}
		run := make(plotter.XYs, 0, i-start+1)
		for _, q := range pts[start : i+1] {
			run = append(run, plotter.XY{X: q.Lon * rad2deg, Y: q.Lat * rad2deg})
		}
		used[style(start)] = true
		for _, seg := range SplitAtDateLine(run) {
			l := &plotter.Line{XYs: seg, LineStyle: styles[style(start)]}
			p.Add(l)
			lines = append(lines, seg)
		}
		start = i
	}

	var styleLegend []LegendEntry
	for k := range styles {
		if used[k] {
			styleLegend = append(styleLegend, LegendEntry{Label: names[k], Thumbs: []plotThumb{styled(styles[k])}})
		}
	}
	legend = append(styleLegend, legend...)

	// Start of the track and the sites on top.
	s0 := pts[0]
	p.Add(&marker{X: s0.Lon * rad2deg, Y: s0.Lat * rad2deg, Style: glyph(draw.CircleGlyph{}, 3.2, ink)})
	p.Add(newLabel(s0.Lon*rad2deg, s0.Lat*rad2deg, 5, 4, "t = 0", 8, ink, draw.XLeft, draw.YBottom))
	for k, s := range d.Sites {
		x, y := s.Lon*rad2deg, s.Lat*rad2deg
		p.Add(&marker{X: x, Y: y, Style: glyph(draw.PyramidGlyph{}, 4, siteInk)})
		xa, dx := draw.XLeft, vgLength(6)
		if x > 120 {
			xa, dx = draw.XRight, -6
		}
		p.Add(newLabel(x, y, dx, -3, fmt.Sprint(k+1), 8.5, siteInk, xa, draw.YTop))
		legend = append(legend, LegendEntry{Label: fmt.Sprintf("%d: %s", k+1, s.Name), Thumbs: []plotThumb{&marker{Style: glyph(draw.PyramidGlyph{}, 4, siteInk)}}})
	}
	fig := &Figure{Panels: []*plotPlot{p}, Legend: legend, Extent: ext, Lines: lines, aspect: aspectCrop, base: Extent{-180, 180, -90, 90}}
	return fig, nil
}

func lonLabel(x float64) string {
	switch {
	case x == 0:
		return "0°"
	case x == 180 || x == -180:
		return "180°"
	case x < 0:
		return trimFloat(-x, 0) + "°W"
	}
	return trimFloat(x, 0) + "°E"
}

func latLabel(y float64) string {
	switch {
	case y == 0:
		return "0°"
	case y < 0:
		return trimFloat(-y, 0) + "°S"
	}
	return trimFloat(y, 0) + "°N"
}

// styled is a legend sample of a line style.
type styled draw.LineStyle

func (s styled) Thumbnail(c *draw.Canvas) {
	y := c.Center().Y
	c.StrokeLine2(draw.LineStyle(s), c.Min.X, y, c.Max.X, y)
}

// SplitAtDateLine cuts a polyline of (longitude, latitude) in degrees,
// longitudes in [-180, 180], where consecutive points are more than 180
// deg apart in longitude (the shorter way round crosses the date line):
// each piece ends at the map edge and the next begins at the other edge,
// at the latitude interpolated linearly in longitude. No piece has two
// consecutive points more than 180 deg apart.
func SplitAtDateLine(pts plotter.XYs) []plotter.XYs {
	if len(pts) == 0 {
		return nil
	}
	var out []plotter.XYs
	cur := plotter.XYs{pts[0]}
	for i := 1; i < len(pts); i++ {
		a, b := pts[i-1], pts[i]
		dx := b.X - a.X
		if math.Abs(dx) <= 180 {
			cur = append(cur, b)
			continue
		}
		edge, other, bx := 180.0, -180.0, b.X+360 // eastward across +180
		if dx > 0 {
			edge, other, bx = -180, 180, b.X-360 // westward across -180
		}
		f := 0.5
		if bx != a.X {
			f = (edge - a.X) / (bx - a.X)
		}
		y := a.Y + f*(b.Y-a.Y)
		cur = append(cur, plotter.XY{X: edge, Y: y})
		out = append(out, cur)
		cur = plotter.XYs{{X: other, Y: y}, b}
	}
	return append(out, cur)
}

// circleFillPolygons returns the area inside a ring of (longitude,
// latitude) in degrees as polygons to be clipped by the map frame: the
// ring with its longitudes unwrapped, shifted by -360, 0 and +360. A
// ring that goes once round a pole (its unwrapped longitude changes by
// 360 deg) is closed along that pole's latitude (north if north).
func circleFillPolygons(ring plotter.XYs, north bool) []plotter.XYs {
	if len(ring) < 3 {
		return nil
	}
	un := make(plotter.XYs, len(ring))
	un[0] = ring[0]
	for i := 1; i < len(ring); i++ {
		dx := math.Remainder(ring[i].X-ring[i-1].X, 360)
		un[i] = plotter.XY{X: un[i-1].X + dx, Y: ring[i].Y}
	}
	if turn := un[len(un)-1].X - un[0].X; math.Abs(turn) > 180 {
		pole := 90.0
		if !north {
			pole = -90
		}
		un = append(un, plotter.XY{X: un[len(un)-1].X, Y: pole}, plotter.XY{X: un[0].X, Y: pole})
	}
	var out []plotter.XYs
	for _, shift := range []float64{-360, 0, 360} {
		poly := make(plotter.XYs, len(un))
		for i, q := range un {
			poly[i] = plotter.XY{X: q.X + shift, Y: q.Y}
		}
		out = append(out, poly)
	}
	return out
}
