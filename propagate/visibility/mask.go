package visibility

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
)

// Mask elevation limits, rad: a mask point may lie from 5 deg below the
// horizontal plane to just below the zenith.
const (
	MinMaskElevation = -5 * math.Pi / 180
	MaxMaskElevation = 90 * math.Pi / 180
)

// Mask is a terrain mask: the least elevation at which a site sees the
// sky, as a function of azimuth, linear between the given points and
// periodic in azimuth (from the last point back to the first through
// north). A Mask is immutable and safe for concurrent use.
type Mask struct {
	az, el []float64 // rad, az strictly increasing in [0, 2pi)
	min    float64
}

// MaskError says which line of a mask file is wrong and why.
type MaskError struct {
	Line int    // 1-based line number, 0 for the file as a whole
	Text string // the line as written
	Why  string
}

func (e *MaskError) Error() string {
	if e.Line == 0 {
		return "visibility: mask: " + e.Why
	}
	return fmt.Sprintf("visibility: mask line %d %q: %s", e.Line, e.Text, e.Why)
}

// NewMask returns the mask through the points (az[i], el[i]) in rad;
// azimuths must be strictly increasing within [0, 2pi), elevations within
// [MinMaskElevation, MaxMaskElevation).
func NewMask(az, el []float64) (*Mask, error) {
	if len(az) == 0 || len(az) != len(el) {
		return nil, &MaskError{Why: fmt.Sprintf("%d azimuths and %d elevations; give at least one point", len(az), len(el))}
	}
	m := &Mask{az: append([]float64(nil), az...), el: append([]float64(nil), el...), min: math.Inf(1)}
	for i := range az {
		if err := checkPoint(az[i], el[i]); err != "" {
			return nil, &MaskError{Why: fmt.Sprintf("point %d: %s", i+1, err)}
		}
		if i > 0 && !(az[i] > az[i-1]) {
			return nil, &MaskError{Why: fmt.Sprintf("point %d: azimuths must increase", i+1)}
		}
		m.min = math.Min(m.min, el[i])
	}
	return m, nil
}

func checkPoint(az, el float64) string {
	switch {
	case !(az >= 0 && az < 2*math.Pi):
		return fmt.Sprintf("azimuth %g deg is outside 0..360 (360 excluded)", az*180/math.Pi)
	case !(el >= MinMaskElevation && el < MaxMaskElevation):
		return fmt.Sprintf("elevation %g deg is outside -5..90 (90 excluded)", el*180/math.Pi)
	}
	return ""
}

// ParseMask reads a mask file: one point per line, "AZIMUTH_DEG
// ELEVATION_DEG" separated by spaces, tabs or one comma; '#' starts a
// comment; blank lines are ignored. Azimuths (from north through east)
// must increase from line to line within [0, 360); elevations lie within
// [-5, 90). At least one point is needed; one point is a constant mask.
func ParseMask(r io.Reader) (*Mask, error) {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), 1<<20)
	var az, el []float64
	line := 0
	for sc.Scan() {
		line++
		raw := sc.Text()
		text := raw
		if i := strings.IndexByte(text, '#'); i >= 0 {
			text = text[:i]
		}
		text = strings.TrimSpace(text)
		if text == "" {
			continue
		}
		fields := strings.FieldsFunc(text, func(r rune) bool { return r == ' ' || r == '\t' || r == ',' })
		if len(fields) != 2 || strings.Count(text, ",") > 1 {
			return nil, &MaskError{Line: line, Text: raw, Why: "want two numbers: azimuth_deg elevation_deg"}
		}
		a, err1 := strconv.ParseFloat(fields[0], 64)
		e, err2 := strconv.ParseFloat(fields[1], 64)
		if err1 != nil || err2 != nil || math.IsNaN(a) || math.IsNaN(e) {
			return nil, &MaskError{Line: line, Text: raw, Why: "want two numbers: azimuth_deg elevation_deg"}
		}
		ar, er := a*math.Pi/180, e*math.Pi/180
		if why := checkPoint(ar, er); why != "" {
			return nil, &MaskError{Line: line, Text: raw, Why: why}
		}
		if n := len(az); n > 0 && !(ar > az[n-1]) {
			return nil, &MaskError{Line: line, Text: raw, Why: fmt.Sprintf("azimuth %g deg does not increase (previous %g deg)", a, az[n-1]*180/math.Pi)}
		}
		az, el = append(az, ar), append(el, er)
	}
	if err := sc.Err(); err != nil {
		return nil, &MaskError{Line: line + 1, Why: err.Error()}
	}
	if len(az) == 0 {
		return nil, &MaskError{Why: "no points; give lines of azimuth_deg elevation_deg"}
	}
	return NewMask(az, el)
}

// At returns the mask elevation (rad) at azimuth az (rad, any value; it
// is reduced to [0, 2pi)).
func (m *Mask) At(az float64) float64 {
	n := len(m.az)
	if n == 1 {
		return m.el[0]
	}
	az = math.Mod(az, 2*math.Pi)
	if az < 0 {
		az += 2 * math.Pi
	}
	i := sort.SearchFloat64s(m.az, az) // first index with m.az[i] >= az
	if i < n && m.az[i] == az {
		return m.el[i]
	}
	// Between point j = i-1 and i, wrapping through north.
	a0, e0, a1, e1 := 0.0, 0.0, 0.0, 0.0
	switch {
	case i == 0:
		a0, e0 = m.az[n-1]-2*math.Pi, m.el[n-1]
		a1, e1 = m.az[0], m.el[0]
	case i == n:
		a0, e0 = m.az[n-1], m.el[n-1]
		a1, e1 = m.az[0]+2*math.Pi, m.el[0]
	default:
		a0, e0 = m.az[i-1], m.el[i-1]
		a1, e1 = m.az[i], m.el[i]
	}
	return e0 + (e1-e0)*(az-a0)/(a1-a0)
}

// Min returns the lowest elevation of the mask, rad.
func (m *Mask) Min() float64 { return m.min }

// Points returns copies of the azimuths and elevations, rad.
func (m *Mask) Points() (az, el []float64) {
	return append([]float64(nil), m.az...), append([]float64(nil), m.el...)
}
