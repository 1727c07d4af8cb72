package reports

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// ErrNotFinite reports a NaN or Inf that would have reached the output.
var ErrNotFinite = errors.New("reports: non-finite value")

// Field is one named quantity. Value is one of: nil (undefined), float64,
// int, bool, string, [3]float64, []Record (a list of objects) or Record
// (a nested object).
type Field struct {
	Key    string // JSON key, with its unit suffix
	Label  string // words for the table; Key is used when empty
	Value  any
	Digits int // significant digits in tables; 0 means 10
}

// Record is an ordered set of fields.
type Record []Field

// Get returns the field with the given key.
func (r Record) Get(key string) (Field, bool) {
	for _, f := range r {
		if f.Key == key {
			return f, true
		}
	}
	return Field{}, false
}

// Keys returns the keys in order.
func (r Record) Keys() []string {
	k := make([]string, len(r))
	for i, f := range r {
		k[i] = f.Key
	}
	return k
}

// Num makes a numeric field.
func Num(key, label string, v float64, digits int) Field {
	return Field{Key: key, Label: label, Value: v, Digits: digits}
}

// Opt makes a numeric field that is undefined (null) when ok is false.
func Opt(key, label string, v float64, ok bool, digits int) Field {
	if !ok {
		return Field{Key: key, Label: label, Value: nil, Digits: digits}
	}
	return Num(key, label, v, digits)
}

// Validate refuses non-finite numbers anywhere in r.
func (r Record) Validate() error {
	for _, f := range r {
		if err := validateValue(f.Key, f.Value); err != nil {
			return err
		}
	}
	return nil
}

func validateValue(key string, v any) error {
	bad := func(x float64) bool { return math.IsNaN(x) || math.IsInf(x, 0) }
	switch x := v.(type) {
	case float64:
		if bad(x) {
			return fmt.Errorf("%w for %s", ErrNotFinite, key)
		}
	case [3]float64:
		for _, c := range x {
			if bad(c) {
				return fmt.Errorf("%w for %s", ErrNotFinite, key)
			}
		}
	case Record:
		return x.Validate()
	case []Record:
		for _, r := range x {
			if err := r.Validate(); err != nil {
				return err
			}
		}
	}
	return nil
}

// FormatFloat prints full precision: the shortest text that reads back
// as the same float64.
func FormatFloat(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// formatRounded prints x with the given significant digits for tables,
// in plain notation where that stays short.
func formatRounded(x float64, digits int) string {
	if digits <= 0 {
		digits = 10
	}
	if x == 0 {
		return "0"
	}
	ax := math.Abs(x)
	if ax >= 1e-4 && ax < 1e12 {
		// Fixed notation with enough decimals for the significant digits.
		dec := digits - 1 - int(math.Floor(math.Log10(ax)))
		if dec < 0 {
			dec = 0
		}
		return strconv.FormatFloat(x, 'f', dec, 64)
	}
	return strconv.FormatFloat(x, 'e', digits-1, 64)
}

// unitSuffixes maps key suffixes to units, longest first.
var unitSuffixes = []struct{ s, u string }{
	{"_km3_s2", "km^3/s^2"}, {"_km2_s2", "km^2/s^2"}, {"_km2_s", "km^2/s"},
	{"_km_s", "km/s"}, {"_m_s", "m/s"}, {"_rad_s", "rad/s"}, {"_deg_day", "deg/day"},
	{"_kg_m3", "kg/m^3"}, {"_kg_m2", "kg/m^2"}, {"_deg", "deg"}, {"_km", "km"}, {"_m", "m"},
	{"_s", "s"}, {"_days", "d"}, {"_kg", "kg"}, {"_k", "K"}, {"_pa", "Pa"}, {"_hz", "Hz"}, {"_mhz", "MHz"}, {"_m2", "m^2"},
}

// unitSuffixOf returns the unit suffix of a key and its unit.
func unitSuffixOf(key string) (suffix, unit string) {
	for _, s := range unitSuffixes {
		if strings.HasSuffix(key, s.s) {
			return s.s, s.u
		}
	}
	return "", ""
}

// UnitOf returns the unit written in a key's suffix, for table columns.
func UnitOf(key string) string {
	_, u := unitSuffixOf(key)
	return u
}

// fixedDecimals gives the decimals tables print for units whose
// resolution is absolute (1 mm, 1 nm/s, 1 ms, 1e-6 deg); 0 means use
// significant digits.
func fixedDecimals(key string) int {
	switch UnitOf(key) {
	case "km", "deg":
		return 6
	case "km/s":
		return 9
	case "s":
		return 3
	case "deg/day":
		return 8
	}
	return 0
}

// formatField renders a numeric field for a table: fixed decimals for
// keys with an absolute resolution, significant digits otherwise.
func formatField(key string, x float64, digits int) string {
	if d := fixedDecimals(key); d > 0 && math.Abs(x) < 1e12 {
		s := strconv.FormatFloat(x, 'f', d, 64)
		if strings.TrimLeft(s, "-0.") == "" {
			return strconv.FormatFloat(0, 'f', d, 64) // no "-0.000000"
		}
		return s
	}
	return formatRounded(x, digits)
}

// tableText renders a value for a table cell.
func tableText(v any, digits int) string {
	return tableTextKey("", v, digits)
}

func tableTextKey(key string, v any, digits int) string {
	switch x := v.(type) {
	case nil:
		return "-"
	case float64:
		return formatField(key, x, digits)
	case int:
		return strconv.Itoa(x)
	case bool:
		if x {
			return "yes"
		}
		return "no"
	case string:
		return x
	case [3]float64:
		return formatField(key, x[0], digits) + ", " + formatField(key, x[1], digits) + ", " + formatField(key, x[2], digits)
	}
	return fmt.Sprint(v)
}
