package plots

import (
	"bytes"
	"errors"
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/recorder"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

var (
	// ErrFormat reports a file name whose extension is not a picture
	// format of this package.
	ErrFormat = errors.New("plots: unsupported picture format")
	// ErrSize reports a picture size or resolution out of range.
	ErrSize = errors.New("plots: invalid picture size")
	// ErrData reports data that cannot be drawn: empty, or not finite.
	ErrData = errors.New("plots: invalid data")
)

// Format is an output format.
type Format int

const (
	SVG Format = iota + 1 // scalable vector graphics (text as text, fonts not embedded)
	PNG                   // raster image at Size.DPI
)

func (f Format) String() string {
	switch f {
	case SVG:
		return "svg"
	case PNG:
		return "png"
	}
	return fmt.Sprintf("Format(%d)", int(f))
}

// FormatOfPath returns the format named by the extension of path
// (.svg or .png, any case).
func FormatOfPath(path string) (Format, error) {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".svg":
		return SVG, nil
	case ".png":
		return PNG, nil
	}
	return 0, fmt.Errorf("%w: %q (want a name ending in .svg or .png)", ErrFormat, path)
}

// Size is the size of a picture. Width and Height are lengths (1/72 in
// units, see vg.Length); DPI is the resolution of a PNG in dots per inch
// (0 means DefaultDPI). An SVG ignores DPI.
type Size struct {
	Width, Height vg.Length
	DPI           int
}

const (
	DefaultDPI = 150 // 8 in x 5 in is 1200 x 750 px
	MinDPI     = 36
	MaxDPI     = 600
	// MaxPixels bounds a PNG: 40 million pixels (160 MB of RGBA).
	MaxPixels = 40e6
)

// Limits of Width and Height.
const (
	MinSide = 2 * vg.Inch
	MaxSide = 100 * vg.Inch
)

// DefaultSize is 8 in x 5 in at 150 dpi.
var DefaultSize = Size{Width: 8 * vg.Inch, Height: 5 * vg.Inch, DPI: DefaultDPI}

// Validate checks the size against the limits above.
func (s Size) Validate(f Format) error {
	dpi := s.dpi()
	switch {
	case !(s.Width >= MinSide && s.Width <= MaxSide) || !(s.Height >= MinSide && s.Height <= MaxSide):
		return fmt.Errorf("%w: %.4g in x %.4g in, want each side from %g in to %g in", ErrSize, s.Width/vg.Inch, s.Height/vg.Inch, MinSide/vg.Inch, MaxSide/vg.Inch)
	case dpi < MinDPI || dpi > MaxDPI:
		return fmt.Errorf("%w: %d dpi, want %d to %d", ErrSize, dpi, MinDPI, MaxDPI)
	}
	if f == PNG {
		w, h := s.Pixels()
		if float64(w)*float64(h) > MaxPixels {
			return fmt.Errorf("%w: %d x %d px is more than %.0f million pixels", ErrSize, w, h, MaxPixels/1e6)
		}
	}
	return nil
}

func (s Size) dpi() int {
	if s.DPI == 0 {
		return DefaultDPI
	}
	return s.DPI
}

// Pixels returns the size of a PNG in pixels.
func (s Size) Pixels() (w, h int) {
	d := float64(s.dpi())
	return int(math.Ceil(s.Width.Dots(d) - 1e-9)), int(math.Ceil(s.Height.Dots(d) - 1e-9))
}

// aspect modes of a figure's first panel.
type aspectMode int

const (
	aspectFree   aspectMode = iota
	aspectExpand            // equal scaling: widen the shorter range
	aspectCrop              // equal scaling: keep the ranges, shrink the drawing area
)

// Figure is a picture ready to render: one or more panels stacked top to
// bottom and a legend strip under them.
type Figure struct {
	// Title is drawn centred across the top of the picture (from the
	// first panel's title when empty).
	Title string
	// Panels are the plots, top to bottom; tests read their axes.
	Panels []*plot.Plot
	// Legend is drawn as a strip across the bottom of the picture.
	Legend []LegendEntry
	// Extent is the range of the plotted data of the first panel, in
	// its data units (before any widening for equal scaling).
	Extent Extent
	// Lines are the polylines of the main data series as drawn (the
	// trajectory of an orbit, the pieces of a ground track), in data
	// units, for callers and tests that check what is on the picture.
	Lines []plotter.XYs

	aspect      aspectMode
	base        Extent // axis ranges before equal scaling
	legendRight bool   // legend as a column on the right instead of a strip
}

// Extent is a rectangle in data units.
type Extent struct {
	XMin, XMax, YMin, YMax float64
}

func emptyExtent() Extent {
	return Extent{math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)}
}

func (e *Extent) add(x, y float64) {
	e.XMin, e.XMax = math.Min(e.XMin, x), math.Max(e.XMax, x)
	e.YMin, e.YMax = math.Min(e.YMin, y), math.Max(e.YMax, y)
}

func (e Extent) valid() bool {
	return e.XMin <= e.XMax && e.YMin <= e.YMax && !math.IsInf(e.XMin, 0) && !math.IsInf(e.YMax, 0)
}

// pad returns e widened by frac of its larger side on every side.
func (e Extent) pad(frac float64) Extent {
	d := frac * math.Max(e.XMax-e.XMin, e.YMax-e.YMin)
	if d == 0 {
		d = 1
	}
	return Extent{e.XMin - d, e.XMax + d, e.YMin - d, e.YMax + d}
}

// LegendEntry is one item of the legend strip.
type LegendEntry struct {
	Label  string
	Thumbs []plot.Thumbnailer
}

// Render draws the figure at size s in format f to w.
func (fig *Figure) Render(w io.Writer, f Format, s Size) error {
	if err := s.Validate(f); err != nil {
		return err
	}
	if len(fig.Panels) == 0 {
		return fmt.Errorf("%w: figure without panels", ErrData)
	}
	var (
		cw  vg.CanvasWriterTo
		cnv vg.CanvasSizer
	)
	switch f {
	case SVG:
		c := vgsvg.New(s.Width, s.Height)
		cw, cnv = c, c
	case PNG:
		c := vgimg.NewWith(vgimg.UseWH(s.Width, s.Height), vgimg.UseDPI(s.dpi()), vgimg.UseBackgroundColor(color.White))
		cw, cnv = vgimg.PngCanvas{Canvas: c}, c
	default:
		return fmt.Errorf("%w: %v", ErrFormat, f)
	}
	fig.draw(draw.New(cnv))
	if f != SVG {
		_, err := cw.WriteTo(w)
		return err
	}
	var buf bytes.Buffer
	if _, err := cw.WriteTo(&buf); err != nil {
		return err
	}
	_, err := w.Write(bytes.ReplaceAll(buf.Bytes(), []byte(svgFace), []byte(svgFaces)))
	return err
}

// The SVG names the Liberation Sans face it was laid out with and, after
// it, Arial and Helvetica, whose widths are the same (Liberation Sans is
// metric-compatible with Arial), so that text keeps its place in a viewer
// without the Liberation fonts.
const (
	svgFace  = "font-family:Liberation Sans;"
	svgFaces = "font-family:'Liberation Sans',Arial,Helvetica,sans-serif;"
)

// Fit lays the figure out for size s without drawing it, applying the
// equal scaling of the first panel; it returns the canvas of each
// panel's data area. Render calls it; tests use it to read the scales.
func (fig *Figure) Fit(s Size) []draw.Canvas {
	dc := draw.NewCanvas(&recorder.Canvas{}, s.Width, s.Height)
	tiles := fig.layout(dc)
	out := make([]draw.Canvas, len(tiles))
	for i, t := range tiles {
		out[i] = fig.Panels[i].DataCanvas(t)
	}
	return out
}

// layout reserves the legend strip, tiles the panels and applies the
// aspect mode; it returns the canvas of each panel.
func (fig *Figure) layout(dc draw.Canvas) []draw.Canvas {
	if fig.Title == "" && fig.Panels[0].Title.Text != "" {
		fig.Title, fig.Panels[0].Title.Text = fig.Panels[0].Title.Text, ""
	}
	dc = draw.Crop(dc, margin, -margin, margin, -margin)
	if fig.Title != "" {
		dc = draw.Crop(dc, 0, 0, 0, -(titleStyle().Height(fig.Title) + titleGap))
	}
	if fig.legendRight {
		if w := fig.legendWidth(dc); w > 0 {
			dc = draw.Crop(dc, 0, -w-entryGap, 0, 0)
		}
	} else if h := fig.legendHeight(dc); h > 0 {
		dc = draw.Crop(dc, 0, 0, h, 0)
	}
	n := len(fig.Panels)
	var tiles []draw.Canvas
	if n == 1 {
		tiles = []draw.Canvas{dc}
	} else {
		rows := make([][]*plot.Plot, n)
		for i, p := range fig.Panels {
			rows[i] = []*plot.Plot{p}
		}
		al := plot.Align(rows, draw.Tiles{Rows: n, Cols: 1, PadY: 6}, dc)
		for i := range al {
			tiles = append(tiles, al[i][0])
		}
	}
	p := fig.Panels[0]
	switch fig.aspect {
	case aspectExpand:
		b := fig.base
		for range 4 {
			da := p.DataCanvas(tiles[0])
			wl, hl := float64(da.Max.X-da.Min.X), float64(da.Max.Y-da.Min.Y)
			if wl <= 0 || hl <= 0 {
				break
			}
			xr, yr := b.XMax-b.XMin, b.YMax-b.YMin
			if xr/wl > yr/hl {
				cy, half := (b.YMin+b.YMax)/2, xr/wl*hl/2
				p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = b.XMin, b.XMax, cy-half, cy+half
			} else {
				cx, half := (b.XMin+b.XMax)/2, yr/hl*wl/2
				p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = cx-half, cx+half, b.YMin, b.YMax
			}
		}
	case aspectCrop:
		b := fig.base
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = b.XMin, b.XMax, b.YMin, b.YMax
		da := p.DataCanvas(tiles[0])
		wl, hl := da.Max.X-da.Min.X, da.Max.Y-da.Min.Y
		want := vg.Length((b.XMax - b.XMin) / (b.YMax - b.YMin))
		if wl > 0 && hl > 0 {
			if wl/hl > want {
				d := (wl - hl*want) / 2
				tiles[0] = draw.Crop(tiles[0], d, -d, 0, 0)
			} else {
				d := (hl - wl/want) / 2
				tiles[0] = draw.Crop(tiles[0], 0, 0, d, -d)
			}
		}
	}
	return tiles
}

const margin = 6 // points of white around the picture

func (fig *Figure) draw(dc draw.Canvas) {
	full := dc
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	tiles := fig.layout(dc)
	for i, t := range tiles {
		fig.Panels[i].Draw(t)
	}
	inner := draw.Crop(full, margin, -margin, margin, -margin)
	if fig.Title != "" {
		sty := titleStyle()
		sty.XAlign, sty.YAlign = draw.XCenter, draw.YTop
		inner.FillText(sty, vg.Point{X: inner.Center().X, Y: inner.Max.Y}, fig.Title)
	}
	fig.drawLegend(inner)
}

const titleGap = 8 // points between the title and the panels

func titleStyle() draw.TextStyle {
	return textStyle(11.5, ink)
}

// Legend strip: entries left to right, wrapping into rows.
const (
	thumbW   = 22
	thumbH   = 9
	entryGap = 14
	rowGap   = 4
)

func legendStyle() draw.TextStyle {
	return textStyle(8.5, ink)
}

func (fig *Figure) legendRows(dc draw.Canvas) [][]int {
	if len(fig.Legend) == 0 {
		return nil
	}
	sty := legendStyle()
	avail := dc.Max.X - dc.Min.X
	var rows [][]int
	var row []int
	x := vg.Length(0)
	for i, e := range fig.Legend {
		w := thumbW + 4 + sty.Width(e.Label)
		if len(row) > 0 && x+w > avail {
			rows = append(rows, row)
			row, x = nil, 0
		}
		row = append(row, i)
		x += w + entryGap
	}
	return append(rows, row)
}

func (fig *Figure) legendHeight(dc draw.Canvas) vg.Length {
	rows := fig.legendRows(dc)
	if len(rows) == 0 {
		return 0
	}
	lh := legendStyle().Height("Ag")
	return vg.Length(len(rows))*(lh+rowGap) + 6
}

// legendWidth is the width of the legend column: the widest entry, at
// most 45% of the picture.
func (fig *Figure) legendWidth(dc draw.Canvas) vg.Length {
	if len(fig.Legend) == 0 {
		return 0
	}
	sty := legendStyle()
	w := vg.Length(0)
	for _, e := range fig.Legend {
		w = max(w, thumbW+4+sty.Width(e.Label))
	}
	return min(w, 0.45*(dc.Max.X-dc.Min.X))
}

func (fig *Figure) drawLegendColumn(dc draw.Canvas) {
	sty := legendStyle()
	sty.YAlign = draw.YTop
	x := dc.Max.X - fig.legendWidth(dc)
	y := dc.Max.Y - titleStyle().Height(fig.Title) - titleGap - 10
	for _, e := range fig.Legend {
		h := sty.Height(e.Label)
		line1 := sty.Height("Ag")
		tc := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
			Min: vg.Point{X: x, Y: y - line1/2 - thumbH/2}, Max: vg.Point{X: x + thumbW, Y: y - line1/2 + thumbH/2}}}
		for _, t := range e.Thumbs {
			t.Thumbnail(&tc)
		}
		dc.FillText(sty, vg.Point{X: x + thumbW + 4, Y: y}, e.Label)
		y -= h + rowGap + 2
	}
}

func (fig *Figure) drawLegend(dc draw.Canvas) {
	if fig.legendRight {
		fig.drawLegendColumn(dc)
		return
	}
	rows := fig.legendRows(dc)
	if len(rows) == 0 {
		return
	}
	sty := legendStyle()
	lh := sty.Height("Ag")
	sty.YAlign = draw.YCenter
	for r, row := range rows {
		yc := dc.Min.Y + vg.Length(len(rows)-1-r)*(lh+rowGap) + lh/2
		x := dc.Min.X
		for _, i := range row {
			e := fig.Legend[i]
			tc := draw.Canvas{Canvas: dc.Canvas, Rectangle: vg.Rectangle{
				Min: vg.Point{X: x, Y: yc - thumbH/2}, Max: vg.Point{X: x + thumbW, Y: yc + thumbH/2}}}
			for _, t := range e.Thumbs {
				t.Thumbnail(&tc)
			}
			dc.FillText(sty, vg.Point{X: x + thumbW + 4, Y: yc}, e.Label)
			x += thumbW + 4 + sty.Width(e.Label) + entryGap
		}
	}
}

// The house style: a sans-serif face, dark ink, pale grid.
var sans = font.Font{Typeface: "Liberation", Variant: "Sans"}

var (
	ink      = color.NRGBA{0x1d, 0x24, 0x33, 0xff}
	gridInk  = color.NRGBA{0xd5, 0xda, 0xe1, 0xff}
	noteInk  = color.NRGBA{0x55, 0x5f, 0x6d, 0xff}
	trackInk = color.NRGBA{0x1f, 0x4e, 0x79, 0xff}
	viewInk  = color.NRGBA{0xe0, 0x7a, 0x1f, 0xff}
	shadeInk = color.NRGBA{0x6b, 0x72, 0x80, 0xff}
	periInk  = color.NRGBA{0xc0, 0x39, 0x2b, 0xff}
	apoInk   = color.NRGBA{0x1e, 0x8b, 0x57, 0xff}
	bodyFill = color.NRGBA{0xcf, 0xe2, 0xf3, 0xff}
	bodyEdge = color.NRGBA{0x5b, 0x7f, 0xa3, 0xff}
)

func textStyle(size vg.Length, c color.Color) draw.TextStyle {
	return draw.TextStyle{Color: c, Font: font.From(sans, size), Handler: plot.DefaultTextHandler}
}

// newPlot returns a plot in the house style with a title.
func newPlot(title string) *plot.Plot {
	p := plot.New()
	p.BackgroundColor = color.White
	p.Title.Text = title
	p.Title.TextStyle.Font = font.From(sans, 11.5)
	p.Title.TextStyle.Color = ink
	p.Title.Padding = 8
	for _, a := range []*plot.Axis{&p.X, &p.Y} {
		a.Label.TextStyle.Font = font.From(sans, 10)
		a.Label.TextStyle.Color = ink
		a.Tick.Label.Font = font.From(sans, 8.5)
		a.Tick.Label.Color = ink
		a.Color = ink
		a.Tick.Color = ink
		a.Padding = 0
	}
	return p
}

// ramp returns the colour of time fraction f in [0, 1] on the track
// ramp, from a pale blue at the start to a deep blue at the end.
func ramp(f float64) color.NRGBA {
	f = math.Max(0, math.Min(1, f))
	a := [3]float64{0x9e, 0xc9, 0xe8}
	b := [3]float64{0x0b, 0x25, 0x45}
	return color.NRGBA{uint8(a[0] + f*(b[0]-a[0]) + 0.5), uint8(a[1] + f*(b[1]-a[1]) + 0.5), uint8(a[2] + f*(b[2]-a[2]) + 0.5), 0xff}
}

// finite reports whether every number is finite.
func finite(xs ...float64) bool {
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}
