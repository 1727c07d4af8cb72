package study

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"testing"
)

// checkValue fails when a value could not be passed to a flag: a numeric
// value must be finite and its text must read back as the same number and
// unit.
func checkValue(t *testing.T, in string, v Value) {
	t.Helper()
	if !v.Numeric {
		if v.Text == "" {
			t.Fatalf("%q: empty word value", in)
		}
		return
	}
	if math.IsNaN(v.Num) || math.IsInf(v.Num, 0) {
		t.Fatalf("%q: non-finite value %v", in, v.Num)
	}
	num, ok := strings.CutSuffix(v.Text, v.Unit)
	if !ok {
		t.Fatalf("%q: text %q does not end in unit %q", in, v.Text, v.Unit)
	}
	x, err := strconv.ParseFloat(num, 64)
	if err != nil || x != v.Num {
		t.Fatalf("%q: text %q reads back as %v (%v), want %v", in, v.Text, x, err, v.Num)
	}
}

// isStudyError checks that a failure is an *Error with a sentinel and a hint.
func isStudyError(t *testing.T, in string, err error) {
	t.Helper()
	var se *Error
	if !errors.As(err, &se) || se.Hint == "" {
		t.Fatalf("%q: error %v is not a *study.Error with a hint", in, err)
	}
	if !errors.Is(err, ErrSyntax) && !errors.Is(err, ErrRange) && !errors.Is(err, ErrUnit) && !errors.Is(err, ErrTooMany) {
		t.Fatalf("%q: error %v wraps no sentinel", in, err)
	}
}

// FuzzParseVary: any text either fails with a *study.Error or gives a
// dimension of 1..MaxCases values that are finite, in order, and read back
// from their text.
func FuzzParseVary(f *testing.F) {
	for _, tt := range varyTests {
		f.Add(tt.in)
	}
	f.Fuzz(func(t *testing.T, in string) {
		v, err := ParseVary(in)
		if err != nil {
			isStudyError(t, in, err)
			return
		}
		n := v.Len()
		if n < 1 || n > MaxCases {
			t.Fatalf("%q: %d values", in, n)
		}
		// Check the ends and a few values between (a dimension may hold
		// up to MaxCases values).
		ks := []int{0, n - 1, n / 2, n / 3}
		var prev Value
		for i, k := range ks {
			val := v.At(k)
			checkValue(t, in, val)
			if val.Name != v.Name || val.Unit != v.Unit || val.Numeric != v.Numeric() {
				t.Fatalf("%q: value %+v does not match the dimension %q %q", in, val, v.Name, v.Unit)
			}
			if i == 1 && v.list == nil && n > 1 {
				// a range is monotone from FROM to TO
				if (val.Num-prev.Num)*v.step < 0 {
					t.Fatalf("%q: first %v, last %v against step %v", in, prev.Num, val.Num, v.step)
				}
			}
			prev = val
		}
	})
}

// FuzzParseDraw: any text either fails with a *study.Error or gives a
// distribution whose nominal value and samples are finite and read back
// from their text; uniform samples lie in [LO, HI).
func FuzzParseDraw(f *testing.F) {
	for _, tt := range drawTests {
		f.Add(tt.in)
	}
	f.Fuzz(func(t *testing.T, in string) {
		d, err := ParseDraw(in)
		if err != nil {
			isStudyError(t, in, err)
			return
		}
		checkValue(t, in, d.Nominal())
		src := NewSource(uint64(len(in)), 3)
		for range 8 {
			v := d.Sample(src)
			checkValue(t, in, v)
			if d.Dist == Uniform && (v.Num < d.A || v.Num >= d.B) {
				t.Fatalf("%q: uniform sample %v outside [%v, %v)", in, v.Num, d.A, d.B)
			}
		}
	})
}
