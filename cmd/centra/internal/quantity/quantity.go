package quantity

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Kind is the physical dimension of a quantity.
type Kind int

const (
	Scalar Kind = iota
	Length
	Speed
	Angle
	Duration
	Mass
	Area
	Frequency
	AngleRate // deg/day by default
)

var kindNames = [...]string{"number", "length", "speed", "angle", "duration", "mass", "area", "frequency", "angle rate"}

func (k Kind) String() string {
	if int(k) < len(kindNames) {
		return kindNames[k]
	}
	return "quantity"
}

// AU is the astronomical unit in km (IAU 2012 Resolution B2, exact).
const AU = 149597870.700

// unit tables: factor to the internal unit of the kind.
var units = map[Kind]map[string]float64{
	Scalar:    {"": 1},
	Length:    {"": 1, "km": 1, "m": 1e-3, "au": AU},
	Speed:     {"": 1, "km/s": 1, "m/s": 1e-3},
	Angle:     {"": math.Pi / 180, "deg": math.Pi / 180, "rad": 1},
	Duration:  {"": 1, "ms": 1e-3, "s": 1, "min": 60, "h": 3600, "d": 86400, "y": 31557600},
	Mass:      {"": 1, "kg": 1},
	Area:      {"": 1, "m2": 1, "m^2": 1},
	Frequency: {"": 1, "mhz": 1, "ghz": 1e3, "khz": 1e-3},
	AngleRate: {"": 1, "deg/day": 1, "deg/d": 1},
}

// DefaultUnit names the unit a bare number is read in.
func DefaultUnit(k Kind) string {
	switch k {
	case Length:
		return "km"
	case Speed:
		return "km/s"
	case Angle:
		return "deg"
	case Duration:
		return "s"
	case Mass:
		return "kg"
	case Area:
		return "m2"
	case Frequency:
		return "MHz"
	case AngleRate:
		return "deg/day"
	}
	return ""
}

// ErrSyntax and ErrUnit classify parse failures.
var (
	ErrSyntax = errors.New("not a number")
	ErrUnit   = errors.New("unknown unit")
	ErrEmpty  = errors.New("empty value")
	ErrFinite = errors.New("not a finite number")
)

// Error records a failed parse: the kind wanted, the input and why.
type Error struct {
	Kind  Kind
	Input string
	Err   error
	Hint  string
}

func (e *Error) Error() string {
	msg := fmt.Sprintf("%q is not a valid %s: %v", e.Input, e.Kind, e.Err)
	if e.Hint != "" {
		msg += " (" + e.Hint + ")"
	}
	return msg
}

func (e *Error) Unwrap() error { return e.Err }

func unitHint(k Kind) string {
	u := units[k]
	var names []string
	for _, n := range []string{"km", "m", "au", "km/s", "m/s", "deg", "rad", "ms", "s", "min", "h", "d", "y", "kg", "m2", "MHz", "GHz", "kHz", "deg/day"} {
		if _, ok := u[strings.ToLower(n)]; ok {
			names = append(names, n)
		}
	}
	if len(names) == 0 {
		return "give a plain number without a unit"
	}
	return "units: " + strings.Join(names, ", ") + "; a bare number is " + DefaultUnit(k)
}

// SplitNumber splits s into the longest leading decimal number and the
// rest (its unit); num is "" when s does not start with a number.
func SplitNumber(s string) (num, rest string) {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := false
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
		digits = true
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
			digits = true
		}
	}
	if digits && i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	if !digits {
		return "", s
	}
	return s[:i], s[i:]
}

// Parse reads one quantity of kind k and returns it in the internal unit.
func Parse(k Kind, s string) (float64, error) {
	in := s
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, &Error{Kind: k, Input: in, Err: ErrEmpty}
	}
	if k == Duration {
		return parseDuration(in, s)
	}
	num, rest := SplitNumber(s)
	if num == "" {
		return 0, &Error{Kind: k, Input: in, Err: ErrSyntax, Hint: unitHint(k)}
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil {
		return 0, &Error{Kind: k, Input: in, Err: ErrSyntax}
	}
	unit := strings.ToLower(strings.TrimSpace(rest))
	f, ok := units[k][unit]
	if !ok {
		return 0, &Error{Kind: k, Input: in, Err: fmt.Errorf("%w %q", ErrUnit, strings.TrimSpace(rest)), Hint: unitHint(k)}
	}
	v *= f
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, &Error{Kind: k, Input: in, Err: ErrFinite}
	}
	return v, nil
}

// parseDuration reads a sum of number-unit terms such as 1d6h30min or
// 90min or 5400 (seconds). A sign may lead the whole expression only.
func parseDuration(in, s string) (float64, error) {
	sign := 1.0
	switch s[0] {
	case '-':
		sign, s = -1, s[1:]
	case '+':
		s = s[1:]
	}
	total := 0.0
	terms := 0
	for len(s) > 0 {
		num, rest := SplitNumber(s)
		if num == "" || num[0] == '+' || num[0] == '-' {
			return 0, &Error{Kind: Duration, Input: in, Err: ErrSyntax, Hint: unitHint(Duration)}
		}
		v, err := strconv.ParseFloat(num, 64)
		if err != nil {
			return 0, &Error{Kind: Duration, Input: in, Err: ErrSyntax}
		}
		j := 0
		for j < len(rest) && (rest[j] >= 'a' && rest[j] <= 'z' || rest[j] >= 'A' && rest[j] <= 'Z') {
			j++
		}
		unit := strings.ToLower(rest[:j])
		f, ok := units[Duration][unit]
		if !ok {
			return 0, &Error{Kind: Duration, Input: in, Err: fmt.Errorf("%w %q", ErrUnit, rest[:j]), Hint: unitHint(Duration)}
		}
		if unit == "" && (terms > 0 || j < len(rest)) {
			return 0, &Error{Kind: Duration, Input: in, Err: fmt.Errorf("%w: each part of a combined duration needs a unit", ErrSyntax), Hint: unitHint(Duration)}
		}
		total += v * f
		terms++
		s = strings.TrimSpace(rest[j:])
	}
	if terms == 0 {
		// a sign alone ("-", "+") is no duration
		return 0, &Error{Kind: Duration, Input: in, Err: ErrSyntax, Hint: unitHint(Duration)}
	}
	total *= sign
	if math.IsNaN(total) || math.IsInf(total, 0) {
		return 0, &Error{Kind: Duration, Input: in, Err: ErrFinite}
	}
	return total, nil
}

// Vector reads "x,y,z" where each part is a quantity of kind k.
func Vector(k Kind, s string) ([3]float64, error) {
	var v [3]float64
	parts := strings.Split(s, ",")
	if len(parts) != 3 {
		return v, &Error{Kind: k, Input: s, Err: fmt.Errorf("%w: a vector needs three parts x,y,z, got %d", ErrSyntax, len(parts))}
	}
	for i, p := range parts {
		x, err := Parse(k, p)
		if err != nil {
			var qe *Error
			if errors.As(err, &qe) {
				return v, &Error{Kind: k, Input: s, Err: fmt.Errorf("part %d %q: %w", i+1, strings.TrimSpace(p), qe.Err), Hint: qe.Hint}
			}
			return v, err
		}
		v[i] = x
	}
	return v, nil
}

// Tolerance is a value with an allowed deviation, in internal units.
// When Relative is true, Tol is a fraction of Value (0.005 for ±0.5%).
type Tolerance struct {
	Value, Tol float64
	Relative   bool
}

// Contains reports whether x lies within the tolerance.
func (t Tolerance) Contains(x float64) bool {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return false
	}
	tol := t.Tol
	if t.Relative {
		tol = math.Abs(t.Value) * t.Tol
	}
	return math.Abs(x-t.Value) <= tol
}

// ParseTolerance reads VALUE±TOL or VALUE+-TOL; TOL may be a percentage
// ("0.5%") or carry its own unit; a TOL without a unit takes the unit of
// VALUE when VALUE has one.
func ParseTolerance(k Kind, s string) (Tolerance, error) {
	var sep string
	switch {
	case strings.Contains(s, "±"):
		sep = "±"
	case strings.Contains(s, "+-"):
		sep = "+-"
	default:
		return Tolerance{}, &Error{Kind: k, Input: s, Err: fmt.Errorf("%w: a tolerance is VALUE±TOL or VALUE+-TOL", ErrSyntax)}
	}
	i := strings.Index(s, sep)
	vs, ts := strings.TrimSpace(s[:i]), strings.TrimSpace(s[i+len(sep):])
	v, err := Parse(k, vs)
	if err != nil {
		return Tolerance{}, err
	}
	if strings.HasSuffix(ts, "%") {
		p, err := Parse(Scalar, strings.TrimSuffix(ts, "%"))
		if err != nil {
			return Tolerance{}, &Error{Kind: k, Input: s, Err: fmt.Errorf("%w: bad percentage %q", ErrSyntax, ts)}
		}
		if p < 0 {
			return Tolerance{}, &Error{Kind: k, Input: s, Err: errors.New("a tolerance must not be negative")}
		}
		return Tolerance{Value: v, Tol: p / 100, Relative: true}, nil
	}
	// A bare tolerance borrows the value's unit.
	if _, rest := SplitNumber(ts); strings.TrimSpace(rest) == "" {
		if _, vu := SplitNumber(vs); strings.TrimSpace(vu) != "" && k != Duration {
			ts += strings.TrimSpace(vu)
		} else if k == Duration && strings.TrimSpace(vu) != "" {
			if _, last := splitLastUnit(vs); last != "" {
				ts += last
			}
		}
	}
	t, err := Parse(k, ts)
	if err != nil {
		return Tolerance{}, err
	}
	if t < 0 {
		return Tolerance{}, &Error{Kind: k, Input: s, Err: errors.New("a tolerance must not be negative")}
	}
	return Tolerance{Value: v, Tol: t}, nil
}

func splitLastUnit(s string) (string, string) {
	j := len(s)
	for j > 0 && (s[j-1] >= 'a' && s[j-1] <= 'z' || s[j-1] >= 'A' && s[j-1] <= 'Z') {
		j--
	}
	return s[:j], s[j:]
}
