package ccsds

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"centra/orbit"
)

func readOPM(t *testing.T, name string) *OPM {
	t.Helper()
	f, err := os.Open(filepath.Join("..", "..", "..", "..", "testdata", "ccsds", name))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	m, err := ParseOPM(f, name)
	if err != nil {
		t.Fatalf("ParseOPM(%s): %v", name, err)
	}
	return m
}

// CCSDS 502.0-B-2, section 3, figure 3-1 (from memory; see
// testdata/ccsds/README.md).
func TestParseOPMExample1(t *testing.T) {
	m := readOPM(t, "opm-example1.txt")
	if m.ObjectName != "GODZILLA 5" || m.RefFrame != "ITRF-97" || m.TimeSystem != "UTC" || m.Epoch != "1998-12-18T14:28:15.1172" {
		t.Errorf("metadata = %+v", m)
	}
	if m.Position != [3]float64{6503.514, 1239.647, -717.490} || m.Velocity != [3]float64{-0.873160, 8.740420, -4.191076} {
		t.Errorf("state = %v %v", m.Position, m.Velocity)
	}
	if !m.HasMass || m.Mass != 3000 || m.DragCoeff != 2.5 || m.HasKeplerian {
		t.Errorf("spacecraft = %+v", m)
	}
}

// CCSDS 502.0-B-2, section 3, figure 3-2 (from memory): the state vector
// and the Keplerian block of the same message must agree. The message's
// own GM is used. Tolerances are the printed precision of the state
// (1e-4 km, 1e-8 km/s) carried into the elements: about 1 m in a (da =
// 2 a^2 v dv / mu), 2e-8 in e and 5e-5 deg in the angles.
func TestOPMExample2StateAgreesWithElements(t *testing.T) {
	m := readOPM(t, "opm-example2.txt")
	if !m.HasKeplerian || m.HasTrueAnomaly || len(m.Comments) < 5 || m.Other["MAN_REF_FRAME"] == "" {
		t.Fatalf("parsed %+v", m)
	}
	el, err := orbit.ElementsFromState(m.GM, orbit.State{R: m.Position, V: m.Velocity})
	if err != nil {
		t.Fatal(err)
	}
	mean, err := orbit.MeanFromTrue(el.Nu, el.E)
	if err != nil {
		t.Fatal(err)
	}
	deg := 180 / math.Pi
	checks := []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"semi-major axis km", el.A, m.SemiMajorAxis, 2e-3},
		{"eccentricity", el.E, m.Eccentricity, 5e-8},
		{"inclination deg", el.I * deg, m.Inclination, 5e-6},
		{"RAAN deg", el.RAAN * deg, m.RAAN, 5e-5},
		{"argument of pericenter deg", el.ArgP * deg, m.ArgPeriapsis, 5e-5},
		{"mean anomaly deg", mean * deg, m.MeanAnomaly, 5e-5},
	}
	for _, c := range checks {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("%s from the state = %.9g, message says %.9g (tolerance %g)", c.name, c.got, c.want, c.tol)
		}
	}
}

func TestParseOPMErrors(t *testing.T) {
	good, err := os.ReadFile(filepath.Join("..", "..", "..", "..", "testdata", "ccsds", "opm-example1.txt"))
	if err != nil {
		t.Fatal(err)
	}
	base := string(good)
	tests := []struct {
		name string
		text string
		line int
		msg  string
		err  error
	}{
		{"unknown keyword", strings.Replace(base, "MASS = 3000.000000", "MASSE = 3000.000000", 1), 17, "unknown keyword MASSE", ErrSyntax},
		{"duplicate", strings.Replace(base, "Y = 1239.647000", "X = 1239.647000", 1), 12, "appears twice", ErrSyntax},
		{"missing Y", strings.Replace(base, "Y = 1239.647000\n", "", 1), 0, "mandatory keyword Y is missing", ErrMissing},
		{"bad number", strings.Replace(base, "Z = -717.490000", "Z = -717.49.0", 1), 13, "not a finite number", ErrSyntax},
		{"nan", strings.Replace(base, "Z = -717.490000", "Z = NaN", 1), 13, "not a finite number", ErrSyntax},
		{"wrong unit", strings.Replace(base, "X = 6503.514000", "X = 6503.514000 [m]", 1), 11, "must be in [km]", ErrSyntax},
		{"not kvn", strings.Replace(base, "X = 6503.514000", "X 6503.514000", 1), 11, "not KEYWORD = VALUE", ErrSyntax},
		{"version first", "ORIGINATOR = X\n" + base, 1, "first keyword must be CCSDS_OPM_VERS", ErrSyntax},
		{"half keplerian", base + "SEMI_MAJOR_AXIS = 7000\n", 22, "Keplerian elements block", ErrMissing},
		{"negative mass", strings.Replace(base, "MASS = 3000.000000", "MASS = -3", 1), 17, "must not be negative", ErrSyntax},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ParseOPM(strings.NewReader(tt.text), "x.opm")
			var pe *Error
			if !errors.As(err, &pe) || !errors.Is(err, tt.err) {
				t.Fatalf("ParseOPM error = %v, want %v", err, tt.err)
			}
			if pe.Line != tt.line || !strings.Contains(pe.Msg, tt.msg) {
				t.Errorf("ParseOPM error = %q (line %d), want line %d with %q", pe.Error(), pe.Line, tt.line, tt.msg)
			}
		})
	}
}

// FuzzParseOPM: no input panics; an accepted message has finite numbers.
func FuzzParseOPM(f *testing.F) {
	for _, n := range []string{"opm-example1.txt", "opm-example2.txt"} {
		b, err := os.ReadFile(filepath.Join("..", "..", "..", "..", "testdata", "ccsds", n))
		if err != nil {
			f.Fatal(err)
		}
		f.Add(string(b))
	}
	f.Add("CCSDS_OPM_VERS = 2.0\nX = 1 [km]\n")
	f.Fuzz(func(t *testing.T, s string) {
		m, err := ParseOPM(strings.NewReader(s), "fuzz")
		if err != nil {
			return
		}
		for _, x := range append(m.Position[:], m.Velocity[:]...) {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Fatalf("accepted non-finite state %v %v", m.Position, m.Velocity)
			}
		}
	})
}

func FuzzParseOEM(f *testing.F) {
	f.Add("CCSDS_OEM_VERS = 2.0\nCREATION_DATE = 2027-01-01T00:00:00\nORIGINATOR = X\nMETA_START\nOBJECT_NAME = A\nOBJECT_ID = B\nCENTER_NAME = EARTH\nREF_FRAME = GCRF\nTIME_SYSTEM = UTC\nSTART_TIME = 2027-01-01T00:00:00\nSTOP_TIME = 2027-01-01T00:00:00\nMETA_STOP\n2027-01-01T00:00:00 1 2 3 4 5 6\n")
	f.Fuzz(func(t *testing.T, s string) {
		m, err := ParseOEM(strings.NewReader(s), "fuzz")
		if err != nil {
			return
		}
		for _, seg := range m.Segments {
			for _, st := range seg.States {
				for _, x := range append(st.Position[:], st.Velocity[:]...) {
					if math.IsNaN(x) || math.IsInf(x, 0) {
						t.Fatalf("accepted non-finite state %v", st)
					}
				}
			}
		}
	})
}
