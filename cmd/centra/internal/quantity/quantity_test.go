package quantity

import (
	"errors"
	"math"
	"testing"
)

// Expected values are unit definitions: 1 au = 149597870.700 km
// (IAU 2012 Resolution B2), 1 d = 86400 s, 1 deg = pi/180 rad (SI
// Brochure, 9th ed., Table 8).
var parseTests = []struct {
	name string
	kind Kind
	in   string
	want float64
	err  error
}{
	{"bare km", Length, "400", 400, nil},
	{"km", Length, "400km", 400, nil},
	{"m", Length, "400000 m", 400, nil},
	{"au", Length, "1au", 149597870.700, nil},
	{"exponent", Length, "6.5e3", 6500, nil},
	{"negative", Length, "-12.5km", -12.5, nil},
	{"speed m/s", Speed, "7500m/s", 7.5, nil},
	{"speed bare", Speed, "7.5", 7.5, nil},
	{"angle bare deg", Angle, "90", math.Pi / 2, nil},
	{"angle rad", Angle, "1rad", 1, nil},
	{"duration s", Duration, "5400", 5400, nil},
	{"duration min", Duration, "90min", 5400, nil},
	{"duration h", Duration, "1.5h", 5400, nil},
	{"duration combined", Duration, "1d6h", 108000, nil},
	{"duration combined 3", Duration, "1h30min15s", 5415, nil},
	{"duration negative", Duration, "-2h", -7200, nil},
	{"unknown unit", Length, "400 furlong", 0, ErrUnit},
	{"trailing junk", Length, "400kmx", 0, ErrUnit},
	{"empty", Length, "  ", 0, ErrEmpty},
	{"nan", Length, "NaN", 0, ErrSyntax},
	{"inf", Length, "Inf", 0, ErrSyntax},
	{"overflow", Length, "1e400", 0, ErrSyntax},
	{"overflow by unit", Length, "1e306au", 0, ErrFinite},
	{"duration bare then unit", Duration, "1 2h", 0, ErrSyntax},
	{"duration bad unit", Duration, "3weeks", 0, ErrUnit},
	{"duration inner sign", Duration, "1h-5min", 0, ErrSyntax},
	{"scalar with unit", Scalar, "3km", 0, ErrUnit},
	{"only unit", Length, "km", 0, ErrSyntax},
}

func TestParse(t *testing.T) {
	for _, tt := range parseTests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Parse(tt.kind, tt.in)
			if tt.err != nil {
				if !errors.Is(err, tt.err) {
					t.Fatalf("Parse(%v, %q) error = %v, want %v", tt.kind, tt.in, err, tt.err)
				}
				return
			}
			if err != nil {
				t.Fatalf("Parse(%v, %q) error %v", tt.kind, tt.in, err)
			}
			if math.Abs(got-tt.want) > 1e-15*math.Abs(tt.want) {
				t.Errorf("Parse(%v, %q) = %.17g, want %.17g", tt.kind, tt.in, got, tt.want)
			}
		})
	}
}

func TestVector(t *testing.T) {
	v, err := Vector(Length, "7000km, 1e6m ,0")
	if err != nil || v != [3]float64{7000, 1000, 0} {
		t.Fatalf("Vector = %v, %v; want [7000 1000 0]", v, err)
	}
	for _, bad := range []string{"1,2", "1,2,3,4", "1,,3", "1,2,x", "1,2,3au m"} {
		if _, err := Vector(Length, bad); err == nil {
			t.Errorf("Vector(%q) accepted bad input", bad)
		}
	}
}

func TestParseTolerance(t *testing.T) {
	tests := []struct {
		in       string
		kind     Kind
		value    float64
		tol      float64
		relative bool
	}{
		{"5553.6±1", Duration, 5553.6, 1, false},
		{"92.56min+-1s", Duration, 5553.6, 1, false},
		{"92.56min+-0.5min", Duration, 5553.6, 30, false},
		{"400km±0.5%", Length, 400, 0.005, true},
		{"400000m+-10", Length, 400, 0.01, false},
		{"97.4±0.1", Angle, 97.4 * math.Pi / 180, 0.1 * math.Pi / 180, false},
	}
	for _, tt := range tests {
		got, err := ParseTolerance(tt.kind, tt.in)
		if err != nil {
			t.Fatalf("ParseTolerance(%q) error %v", tt.in, err)
		}
		if math.Abs(got.Value-tt.value) > 1e-12*math.Abs(tt.value) || math.Abs(got.Tol-tt.tol) > 1e-12*tt.tol || got.Relative != tt.relative {
			t.Errorf("ParseTolerance(%q) = %+v, want {%v %v %v}", tt.in, got, tt.value, tt.tol, tt.relative)
		}
	}
	for _, bad := range []string{"5", "5±", "±1", "5±-1", "5±x%", "5±1furlong"} {
		if _, err := ParseTolerance(Length, bad); err == nil {
			t.Errorf("ParseTolerance(%q) accepted bad input", bad)
		}
	}
	tol := Tolerance{Value: 100, Tol: 0.01, Relative: true}
	if !tol.Contains(100.9) || tol.Contains(101.1) || tol.Contains(math.NaN()) {
		t.Errorf("Tolerance.Contains wrong for %+v", tol)
	}
}

// FuzzParse checks that no input panics and that accepted input is finite.
func FuzzParse(f *testing.F) {
	for _, tt := range parseTests {
		f.Add(int(tt.kind), tt.in)
	}
	f.Add(int(Length), "1,2,3")
	f.Add(int(Duration), "92min±1s")
	f.Fuzz(func(t *testing.T, k int, s string) {
		kind := Kind(((k % 9) + 9) % 9)
		if v, err := Parse(kind, s); err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
			t.Fatalf("Parse(%v, %q) = %v without error", kind, s, v)
		}
		if v, err := Vector(kind, s); err == nil {
			for _, x := range v {
				if math.IsNaN(x) || math.IsInf(x, 0) {
					t.Fatalf("Vector(%q) = %v without error", s, v)
				}
			}
		}
		if tol, err := ParseTolerance(kind, s); err == nil && (math.IsNaN(tol.Value) || math.IsNaN(tol.Tol) || tol.Tol < 0) {
			t.Fatalf("ParseTolerance(%q) = %+v without error", s, tol)
		}
	})
}
