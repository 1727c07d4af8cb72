package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
)

// TestOrbitDesignFlags: --repeat and --frozen through the binary. The
// numbers are checked against propagation in orbit/design_test.go; here
// the wiring: the mean elements printed, the osculating state, and every
// contradiction as one line with exit 2.
func TestOrbitDesignFlags(t *testing.T) {
	out, stderr, code := runBinary(t, strings.Fields("--format json orbit --epoch 2027-04-12T09:30:00Z --repeat 233/16 --sun-synchronous --frozen --raan 112.5")...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	golden(t, "orbit/repeat-sso-frozen-json", out)
	var r map[string]any
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	if r["repeat_revolutions"] != 233.0 || r["repeat_days"] != 16.0 || r["frozen"] != true {
		t.Errorf("design keys: %v %v %v", r["repeat_revolutions"], r["repeat_days"], r["frozen"])
	}
	// Sun-synchronous: the mean node turns at the Sun's mean motion,
	// 0.98564736 deg/day (orbit.SunMeanMotion; 360 deg per tropical year).
	if v := r["mean_raan_rate_deg_day"].(float64); math.Abs(v-0.98564736) > 1e-7 {
		t.Errorf("mean RAAN rate %v deg/day", v)
	}
	// The osculating and mean semi-major axes differ by the J2
	// short-period term, at most 3/2 J2 Re^2/a (about 10 km here).
	da := math.Abs(r["semi_major_axis_km"].(float64) - r["mean_semi_major_axis_km"].(float64))
	if da == 0 || da > 1.5*1.0826e-3*6378.137*6378.137/7077 {
		t.Errorf("osculating minus mean a = %g km", da)
	}
	errs := []struct{ args, msg string }{
		{"orbit --repeat 15/1 --altitude 500", "given twice (--altitude and --repeat)"},
		{"orbit --repeat 15", "has no REVS/DAYS"},
		{"orbit --repeat 15/0", "is out of range"},
		{"orbit --repeat a/b", "is not two whole numbers"},
		{"orbit --repeat 20/1", "no repeat ground track of 20 revolutions in 1 days"},
		{"orbit --repeat 1/1 --sun-synchronous", "too high for J2 to make it sun-synchronous"},
		{"orbit --repeat 15/1 --sun-synchronous --inclination 98", "both set the inclination"},
		{"orbit --frozen --periapsis-alt 500 --apoapsis-alt 600", "--frozen solves the eccentricity"},
		{"orbit --frozen --altitude 700 --eccentricity 0.01", "--eccentricity and --frozen both set"},
		{"orbit --frozen --altitude 700 --arg-periapsis 10", "--arg-periapsis and --frozen both set"},
		{"orbit --frozen --altitude 700 --inclination 63.4", "critical inclination"},
		{"orbit --frozen --position 7000,0,0 --velocity 0,7.5,0", "--frozen solves the eccentricity"},
		{"orbit --body mars --frozen --altitude 300 --inclination 90", "has no J3"},
		{"orbit --body mars --repeat 13/1 --sun-synchronous", "Earth only"},
		{"orbit --repeat 15/1 --eccentricity 1.2", "does not give a closed orbit"},
		{"orbit --repeat 15/1 --true-anomaly 1 --mean-anomaly 2", "both set the position in orbit"},
	}
	for _, e := range errs {
		_, stderr, code := runBinary(t, strings.Fields(e.args)...)
		if code != 2 || !strings.Contains(stderr, e.msg) || strings.Count(strings.TrimSpace(stderr), "\n") != 0 {
			t.Errorf("%s: exit %d, stderr %q, want one line with %q", e.args, code, stderr, e.msg)
		}
	}
}
