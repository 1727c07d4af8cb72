package quantity

import (
	"errors"
	"testing"
)

// A sign alone was read as a duration of 0 s ("--span -" became "--span
// is zero", "period_s=5000±-" a zero tolerance); found while cataloguing
// bad input. Each must be a syntax error.
func TestReliabilitySignAloneIsNoDuration(t *testing.T) {
	for _, s := range []string{"-", "+", " - ", "-  "} {
		if v, err := Parse(Duration, s); !errors.Is(err, ErrSyntax) {
			t.Errorf("Parse(Duration, %q) = %v, %v; want ErrSyntax", s, v, err)
		}
	}
	if tol, err := ParseTolerance(Duration, "5000±-"); err == nil {
		t.Errorf("ParseTolerance(Duration, %q) = %+v, want an error", "5000±-", tol)
	}
	// The signs still work in front of a number.
	for _, tt := range []struct {
		in   string
		want float64
	}{{"-90min", -5400}, {"+1h", 3600}, {"-0", 0}} {
		if v, err := Parse(Duration, tt.in); err != nil || v != tt.want {
			t.Errorf("Parse(Duration, %q) = %v, %v; want %v", tt.in, v, err, tt.want)
		}
	}
}
