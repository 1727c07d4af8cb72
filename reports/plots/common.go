package plots

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Header is what every picture's title says: the body, the epoch, the
// force model and the span covered.
type Header struct {
	Body  string  // name of the central body, e.g. "earth"
	Epoch string  // RFC 3339 UTC epoch of t = 0
	Model string  // force model, e.g. "point mass + J2"
	Span  float64 // s covered by the picture (0: not shown)
}

// title returns "what about Body" on the first line and the epoch, model
// and span on the second.
func (h Header) title(what string) string {
	var parts []string
	if h.Epoch != "" {
		parts = append(parts, "epoch "+h.Epoch)
	}
	if h.Model != "" {
		parts = append(parts, "model "+h.Model)
	}
	if h.Span != 0 {
		parts = append(parts, "span "+FormatDuration(h.Span))
	}
	first := what
	if h.Body != "" {
		first += " — " + titleCase(h.Body)
	}
	if len(parts) == 0 {
		return first
	}
	return first + "\n" + strings.Join(parts, " · ")
}

func titleCase(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

// FormatDuration writes a duration in s as days, hours, minutes and
// seconds, for example "1 d 6 h", "95 min 33 s", "12.5 s".
func FormatDuration(s float64) string {
	sign := ""
	if s < 0 {
		sign, s = "-", -s
	}
	if s < 60 {
		return sign + trimFloat(s, 1) + " s"
	}
	t := int64(math.Round(s))
	d, t := t/86400, t%86400
	h, t := t/3600, t%3600
	m, sec := t/60, t%60
	var parts []string
	if d > 0 {
		parts = append(parts, fmt.Sprintf("%d d", d))
	}
	if h > 0 {
		parts = append(parts, fmt.Sprintf("%d h", h))
	}
	if m > 0 && d == 0 {
		parts = append(parts, fmt.Sprintf("%d min", m))
	}
	if sec > 0 && d == 0 && h == 0 {
		parts = append(parts, fmt.Sprintf("%d s", sec))
	}
	if len(parts) == 0 {
		parts = append(parts, fmt.Sprintf("%d d", d))
	}
	return sign + strings.Join(parts, " ")
}

func trimFloat(x float64, digits int) string {
	s := fmt.Sprintf("%.*f", digits, x)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}

// timeAxis chooses the unit of a time axis for a span in s.
func timeAxis(span float64) (unit string, scale float64) {
	switch span = math.Abs(span); {
	case span <= 3*3600:
		return "min", 60
	case span <= 3*86400:
		return "h", 3600
	}
	return "d", 86400
}

// label is text drawn at a data point with an offset in points. It has
// no data range and no glyph box, so it never changes the layout.
type label struct {
	X, Y   float64
	DX, DY vg.Length
	Text   string
	Style  draw.TextStyle
	// Backdrop, when not nil, fills the text's box first so the text
	// stays readable over lines.
	Backdrop color.Color
}

func (l *label) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	pt := vg.Point{X: tx(l.X) + l.DX, Y: ty(l.Y) + l.DY}
	if !finite(float64(pt.X), float64(pt.Y)) {
		return
	}
	if l.Backdrop != nil {
		r := l.Style.Rectangle(l.Text)
		const pad = 1.5
		mn := vg.Point{X: pt.X + r.Min.X - pad, Y: pt.Y + r.Min.Y - pad}
		mx := vg.Point{X: pt.X + r.Max.X + pad, Y: pt.Y + r.Max.Y + pad}
		c.FillPolygon(l.Backdrop, []vg.Point{mn, {X: mx.X, Y: mn.Y}, mx, {X: mn.X, Y: mx.Y}})
	}
	c.FillText(l.Style, pt, l.Text)
}

// newLabel returns a label with the house text style of size pt,
// aligned by xa, ya.
func newLabel(x, y float64, dx, dy vg.Length, text string, size vg.Length, clr color.Color, xa draw.XAlignment, ya draw.YAlignment) *label {
	sty := textStyle(size, clr)
	sty.XAlign, sty.YAlign = xa, ya
	return &label{X: x, Y: y, DX: dx, DY: dy, Text: text, Style: sty}
}

// marker draws one glyph at a point, with no effect on the layout.
type marker struct {
	X, Y  float64
	Style draw.GlyphStyle
}

func (m *marker) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	c.DrawGlyph(m.Style, vg.Point{X: tx(m.X), Y: ty(m.Y)})
}

func (m *marker) Thumbnail(c *draw.Canvas) {
	c.DrawGlyph(m.Style, c.Center())
}

func glyph(shape draw.GlyphDrawer, r vg.Length, clr color.Color) draw.GlyphStyle {
	return draw.GlyphStyle{Color: clr, Radius: r, Shape: shape}
}

// line returns a polyline in style (width in points, dashes, colour).
func line(xys plotter.XYs, width vg.Length, clr color.Color, dashes ...vg.Length) *plotter.Line {
	l := &plotter.Line{XYs: xys}
	l.LineStyle = draw.LineStyle{Color: clr, Width: width, Dashes: dashes}
	return l
}

// thumbLine is a legend sample of a line style.
func thumbLine(width vg.Length, clr color.Color, dashes ...vg.Length) plot.Thumbnailer {
	return line(plotter.XYs{{X: 0, Y: 0}, {X: 1, Y: 0}}, width, clr, dashes...)
}

// thumbFill is a legend sample of a filled area.
type thumbFill struct {
	Fill, Edge color.Color
}

func (t thumbFill) Thumbnail(c *draw.Canvas) {
	r := c.Rectangle
	pts := []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}}
	c.FillPolygon(t.Fill, pts)
	if t.Edge != nil {
		c.StrokeLines(draw.LineStyle{Color: t.Edge, Width: 0.8}, append(pts, pts[0]))
	}
}

// gridLines draws lines at the major ticks of both axes.
func gridLines(p *plot.Plot) {
	g := plotter.NewGrid()
	g.Vertical = draw.LineStyle{Color: gridInk, Width: 0.5}
	g.Horizontal = draw.LineStyle{Color: gridInk, Width: 0.5}
	p.Add(g)
}

// stepTicks returns ticks every step from lo to hi with labels by f.
type stepTicks struct {
	Step  float64
	Label func(x float64) string
}

func (t stepTicks) Ticks(min, max float64) []plot.Tick {
	var out []plot.Tick
	k0 := math.Ceil(min/t.Step - 1e-9)
	for k := k0; k*t.Step <= max+1e-9*t.Step; k++ {
		x := k * t.Step
		if x == 0 {
			x = 0 // no "-0"
		}
		out = append(out, plot.Tick{Value: x, Label: t.Label(x)})
	}
	return out
}

// niceTicks puts major ticks at 1, 2 or 5 times a power of ten, about
// seven across the range, with a minor tick between, and labels them in
// plain numbers with thousands separated by a thin space, never in
// exponent form.
type niceTicks struct{}

func (niceTicks) Ticks(min, max float64) []plot.Tick {
	if !(max > min) || !finite(min, max) {
		return nil
	}
	raw := (max - min) / 7
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	step := mag
	for _, m := range []float64{1, 2, 5, 10} {
		if m*mag >= raw {
			step = m * mag
			break
		}
	}
	var out []plot.Tick
	half := step / 2
	for k := math.Ceil(min/half - 1e-9); k*half <= max+1e-9*half; k++ {
		x := k * half
		if math.Abs(x) < 1e-9*step {
			x = 0
		}
		t := plot.Tick{Value: x}
		if math.Mod(math.Abs(k), 2) == 0 {
			t.Label = groupDigits(x)
		}
		out = append(out, t)
	}
	return out
}

func groupDigits(x float64) string {
	s := trimFloat(x, 6)
	if math.Abs(x) >= 1e15 {
		return fmt.Sprintf("%.3g", x)
	}
	neg := strings.HasPrefix(s, "-")
	s = strings.TrimPrefix(s, "-")
	intPart, frac, _ := strings.Cut(s, ".")
	if len(intPart) > 4 {
		var b strings.Builder
		for i, r := range intPart {
			if i > 0 && (len(intPart)-i)%3 == 0 {
				b.WriteRune(' ')
			}
			b.WriteRune(r)
		}
		intPart = b.String()
	}
	if frac != "" {
		intPart += "." + frac
	}
	if neg && intPart != "0" {
		intPart = "−" + intPart
	}
	return intPart
}

type (
	plotThumb = plot.Thumbnailer
	plotPlot  = plot.Plot
)

func dyLen(x float64) vgLength { return vgLength(x) }

type vgLength = vg.Length

// glyphPair is a legend sample of two glyphs side by side.
type glyphPair [2]draw.GlyphStyle

func (g glyphPair) Thumbnail(c *draw.Canvas) {
	y := c.Center().Y
	w := c.Max.X - c.Min.X
	c.DrawGlyph(g[0], vg.Point{X: c.Min.X + w/3, Y: y})
	c.DrawGlyph(g[1], vg.Point{X: c.Min.X + 2*w/3, Y: y})
}

// labelGroup places its labels at draw time, each at the first of a few
// positions (the given one, then shifted up and down by a line) where it
// overlaps no label placed before; Fixed labels are placed first and
// never move.
type labelGroup struct {
	Fixed, Movable []*label
}

func (g *labelGroup) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	var placed []vg.Rectangle
	box := func(l *label, dy vg.Length) (vg.Rectangle, vg.Point) {
		pt := vg.Point{X: tx(l.X) + l.DX, Y: ty(l.Y) + l.DY + dy}
		r := l.Style.Rectangle(l.Text)
		return vg.Rectangle{Min: vg.Point{X: pt.X + r.Min.X, Y: pt.Y + r.Min.Y}, Max: vg.Point{X: pt.X + r.Max.X, Y: pt.Y + r.Max.Y}}, pt
	}
	overlaps := func(r vg.Rectangle) bool {
		for _, q := range placed {
			if r.Min.X < q.Max.X && q.Min.X < r.Max.X && r.Min.Y < q.Max.Y && q.Min.Y < r.Max.Y {
				return true
			}
		}
		return false
	}
	for _, l := range g.Fixed {
		r, _ := box(l, 0)
		placed = append(placed, r)
		l.Plot(c, p)
	}
	for _, l := range g.Movable {
		h := l.Style.Height(l.Text) + 1
		chosen := vg.Length(0)
		for _, k := range []vg.Length{0, 1, -1, 2, -2, 3, -3} {
			if r, _ := box(l, k*h); !overlaps(r) {
				chosen = k * h
				break
			}
		}
		r, _ := box(l, chosen)
		placed = append(placed, r)
		moved := *l
		moved.DY += chosen
		moved.Plot(c, p)
	}
}
