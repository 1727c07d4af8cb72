package reports

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"
)

func sample() Record {
	return Record{
		{Key: "name", Value: "x"},
		Num("period_s", "period", 5553.6, 6),
		Opt("v_infinity_km_s", "v-infinity", 0, false, 6),
		{Key: "position_km", Value: [3]float64{7000, -1.5, 0.25}},
		{Key: "pass", Value: true},
		{Key: "checks", Value: []Record{{{Key: "name", Value: "a"}, {Key: "relative_error", Value: 1e-16}}}},
	}
}

func TestWriteJSONOrderAndNull(t *testing.T) {
	var b bytes.Buffer
	if err := WriteJSON(&b, sample()); err != nil {
		t.Fatal(err)
	}
	var m map[string]any
	if err := json.Unmarshal(b.Bytes(), &m); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, b.String())
	}
	if m["v_infinity_km_s"] != nil || m["period_s"] != 5553.6 || m["pass"] != true {
		t.Errorf("decoded %v", m)
	}
	s := b.String()
	if !(strings.Index(s, `"name"`) < strings.Index(s, `"period_s"`) && strings.Index(s, `"period_s"`) < strings.Index(s, `"checks"`)) {
		t.Errorf("keys out of order:\n%s", s)
	}
}

func TestNonFiniteRefused(t *testing.T) {
	for _, v := range []any{math.NaN(), math.Inf(1), [3]float64{0, math.NaN(), 0}, []Record{{{Key: "x", Value: math.Inf(-1)}}}} {
		r := Record{{Key: "bad_km", Value: v}}
		for name, write := range map[string]func() error{
			"json":  func() error { return WriteJSON(&bytes.Buffer{}, r) },
			"csv":   func() error { return WriteCSV(&bytes.Buffer{}, r) },
			"table": func() error { return WriteSummaryTable(&bytes.Buffer{}, r) },
		} {
			if err := write(); !errors.Is(err, ErrNotFinite) {
				t.Errorf("%s of %v: error %v, want ErrNotFinite", name, v, err)
			}
		}
	}
}

func TestCSVVectorColumns(t *testing.T) {
	r := sample()
	h := strings.Join(CSVHeader(r), ",")
	if h != "name,period_s,v_infinity_km_s,position_x_km,position_y_km,position_z_km,pass" {
		t.Errorf("header %s", h)
	}
	if got := strings.Join(CSVRow(r), ","); got != "x,5553.6,,7000,-1.5,0.25,true" {
		t.Errorf("row %s", got)
	}
	if k := vectorKeys("velocity_km_s"); k[0] != "velocity_x_km_s" {
		t.Errorf("vectorKeys = %v", k)
	}
}

func TestUnitOfAndRounding(t *testing.T) {
	for key, unit := range map[string]string{"period_s": "s", "speed_km_s": "km/s", "gm_km3_s2": "km^3/s^2", "raan_rate_deg_day": "deg/day", "eccentricity": "", "lifetime_days": "d"} {
		if got := UnitOf(key); got != unit {
			t.Errorf("UnitOf(%q) = %q, want %q", key, got, unit)
		}
	}
	for _, c := range []struct {
		x      float64
		digits int
		want   string
	}{{5553.61234, 6, "5553.61"}, {0.000123456, 3, "0.000123"}, {1.5e-9, 3, "1.50e-09"}, {0, 5, "0"}, {-42.5, 3, "-42.5"}} {
		if got := formatRounded(c.x, c.digits); got != c.want {
			t.Errorf("formatRounded(%g, %d) = %q, want %q", c.x, c.digits, got, c.want)
		}
	}
}
