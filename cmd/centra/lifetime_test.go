package main

import (
	"encoding/json"
	"math"
	"strconv"
	"strings"
	"testing"
)

// The LARK-1-like case of the demo: fast with the averaged method.
const larkArgs = "--epoch 2027-04-12T09:30:00Z --periapsis-alt 524 --apoapsis-alt 541 --sun-synchronous --raan 112.5 --arg-periapsis 90 --mass 4.2 --area 0.034 --cd 2.2"

// Golden files of the lifetime command. The numbers are checked against
// the world in package decay (published first-order decay rate,
// exponential-atmosphere quadrature, full integration); here the layout.
func TestLifetimeGolden(t *testing.T) {
	cases := []struct{ name, args string }{
		{"lifetime/lark-table", "--quiet lifetime " + larkArgs},
		{"lifetime/lark-history-json", "--quiet --format json lifetime " + larkArgs + " --history 1y"},
		{"lifetime/lark-csv", "--quiet --format csv lifetime " + larkArgs + " --bracket=false"},
		{"lifetime/no-reentry-table", "--quiet lifetime --epoch 2027-04-12T09:30:00Z --altitude 900 --inclination 98 --ballistic-coefficient 80 --max-span 2y"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			out, stderr, code := runBinary(t, strings.Fields(tc.args)...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			golden(t, tc.name, out)
		})
	}
}

type lifetimeJSON struct {
	LifetimeDays      *float64 `json:"lifetime_days"`
	ReentryUTC        *string  `json:"reentry_utc"`
	HalfDays          *float64 `json:"lifetime_half_density_days"`
	DoubleDays        *float64 `json:"lifetime_double_density_days"`
	Reentered         bool     `json:"reentered"`
	DensityScale      float64  `json:"density_scale"`
	Ballistic         float64  `json:"ballistic_coefficient_kg_m2"`
	MassKg            *float64 `json:"mass_kg"`
	AreaM2            *float64 `json:"area_m2"`
	Cd                *float64 `json:"cd"`
	Method            string   `json:"method"`
	Cautions          []string `json:"cautions"`
	FinalPerigeeAltKm *float64 `json:"final_perigee_alt_km"`
	History           []struct {
		TDays   float64 `json:"t_days"`
		Perigee float64 `json:"perigee_alt_km"`
	} `json:"history"`
}

func runLifetimeJSON(t *testing.T, args string) lifetimeJSON {
	t.Helper()
	out, stderr, code := runBinary(t, append([]string{"--quiet", "--format", "json", "lifetime"}, strings.Fields(args)...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var r lifetimeJSON
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, out)
	}
	return r
}

// TestLifetimeDensityScaling: the drag acceleration is proportional to
// density scale / B, so scaling the density by s is the same as dividing
// B by s, and (for an orbit whose shape drag alone changes) divides the
// lifetime by s: the equations in the time s t are those of the nominal
// case. The J2 rotation of the perigee does not scale, so the law holds to
// the eccentricity's small share, 1% here.
func TestLifetimeDensityScaling(t *testing.T) {
	r := runLifetimeJSON(t, "--epoch 2027-04-12T09:30:00Z --altitude 420 --inclination 51.6 --ballistic-coefficient 40")
	if !r.Reentered || r.LifetimeDays == nil || r.HalfDays == nil || r.DoubleDays == nil {
		t.Fatalf("missing lifetimes: %+v", r)
	}
	l, h, d := *r.LifetimeDays, *r.HalfDays, *r.DoubleDays
	if rel := math.Abs(h/(2*l) - 1); rel > 0.01 {
		t.Errorf("half density %.3f d, nominal %.3f d: ratio %.4f, want 2 within 1%%", h, l, h/l)
	}
	if rel := math.Abs(2*d/l - 1); rel > 0.01 {
		t.Errorf("double density %.3f d, nominal %.3f d: ratio %.4f, want 0.5 within 1%%", d, l, d/l)
	}
	// Same drag through B: density x2 is B / 2.
	r2 := runLifetimeJSON(t, "--epoch 2027-04-12T09:30:00Z --altitude 420 --inclination 51.6 --ballistic-coefficient 20 --bracket=false")
	if rel := math.Abs(*r2.LifetimeDays/d - 1); rel > 1e-9 {
		t.Errorf("B 20: %.6f d; B 40 at double density: %.6f d", *r2.LifetimeDays, d)
	}
	if r.MassKg != nil || r.Cd != nil || r.Ballistic != 40 || len(r.Cautions) != 3 {
		t.Errorf("spacecraft fields: mass %v, cd %v, B %v, %d cautions", r.MassKg, r.Cd, r.Ballistic, len(r.Cautions))
	}
}

// TestLifetimeMethodsAgree: the command's two methods on a short case
// (package decay checks them on more).
func TestLifetimeMethodsAgree(t *testing.T) {
	args := "--epoch 2027-04-12T09:30:00Z --altitude 260 --inclination 51.6 --ballistic-coefficient 50 --bracket=false"
	avg := runLifetimeJSON(t, args)
	full := runLifetimeJSON(t, args+" --method full --tolerance 1e-9")
	if avg.Method != "averaged" || full.Method != "full" {
		t.Fatalf("methods %q, %q", avg.Method, full.Method)
	}
	if rel := math.Abs(*avg.LifetimeDays / *full.LifetimeDays - 1); rel > 0.015 {
		t.Errorf("averaged %.4f d, full %.4f d (rel %.3g), want within 1.5%%", *avg.LifetimeDays, *full.LifetimeDays, rel)
	}
	// The Sun and Moon barely change a low LEO's lifetime.
	lunisolar := runLifetimeJSON(t, args+" --method full --tolerance 1e-9 --third-body sun,moon --srp --mass 4 --area 0.03")
	if rel := math.Abs(*lunisolar.LifetimeDays / *full.LifetimeDays - 1); rel > 0.01 {
		t.Errorf("with Sun, Moon and radiation pressure %.4f d, without %.4f d", *lunisolar.LifetimeDays, *full.LifetimeDays)
	}
}

func TestLifetimeNoReentry(t *testing.T) {
	r := runLifetimeJSON(t, "--epoch 2027-04-12T09:30:00Z --altitude 900 --ballistic-coefficient 80 --max-span 1y --history 90d")
	if r.Reentered || r.LifetimeDays != nil || r.ReentryUTC != nil || r.FinalPerigeeAltKm == nil {
		t.Errorf("900 km over a year: %+v", r)
	}
	if len(r.History) != 6 || r.History[4].TDays != 360 {
		t.Errorf("history: %+v", r.History)
	}
}

func TestLifetimeCautionsInEveryFormat(t *testing.T) {
	args := strings.Fields("lifetime --epoch 2027-04-12T09:30:00Z --altitude 300 --ballistic-coefficient 50 --bracket=false")
	for _, f := range []string{"table", "csv", "json"} {
		out, stderr, code := runBinary(t, append([]string{"--format", f}, args...)...)
		if code != 0 {
			t.Fatalf("%s: exit %d: %s", f, code, stderr)
		}
		if !strings.Contains(out, "licensing authority") || !strings.Contains(out, "solar activity") {
			t.Errorf("%s output lacks the cautions:\n%s", f, out)
		}
	}
}

func TestLifetimeExpect(t *testing.T) {
	r := runLifetimeJSON(t, "--epoch 2027-04-12T09:30:00Z --altitude 300 --ballistic-coefficient 50 --bracket=false")
	want := *r.LifetimeDays
	base := "lifetime --epoch 2027-04-12T09:30:00Z --altitude 300 --ballistic-coefficient 50 --bracket=false --expect "
	if _, stderr, code := runBinary(t, strings.Fields(base+"lifetime_days="+strf(want)+"d±1%")...); code != 0 {
		t.Errorf("passing expectation: exit %d: %s", code, stderr)
	}
	if _, stderr, code := runBinary(t, strings.Fields(base+"lifetime_days="+strf(2*want)+"d±1%")...); code != 1 || !strings.Contains(stderr, "1 of 1 expectations failed") {
		t.Errorf("failing expectation: exit %d: %s", code, stderr)
	}
	// Durations with units: days in the key, hours in the value.
	if _, stderr, code := runBinary(t, strings.Fields(base+"lifetime_days="+strf(want*24)+"h±2h")...); code != 0 {
		t.Errorf("expectation in hours: exit %d: %s", code, stderr)
	}
}

func strf(x float64) string { return strconv.FormatFloat(x, 'g', 10, 64) }

func TestLifetimeErrors(t *testing.T) {
	orb := "--altitude 400 --inclination 51.6 "
	tests := []struct {
		name, args string
		msg        string
	}{
		{"no spacecraft", "lifetime " + orb, "drag needs the spacecraft's mass and area"},
		{"mass only", "lifetime " + orb + "--mass 4", "drag needs the spacecraft's mass and area"},
		{"bad mass", "lifetime " + orb + "--mass -4 --area 0.03", "--mass must be positive"},
		{"bad cd", "lifetime " + orb + "--mass 4 --area 0.03 --cd 40", "--cd 40 is not a drag coefficient"},
		{"B and cd", "lifetime " + orb + "--ballistic-coefficient 50 --cd 2.2", "both set the drag"},
		{"bad B", "lifetime " + orb + "--ballistic-coefficient 0", "is not usable"},
		{"bad scale", "lifetime " + orb + "--ballistic-coefficient 50 --density-scale 5000", "is not usable"},
		{"bad method", "lifetime " + orb + "--ballistic-coefficient 50 --method guess", `--method "guess" is not known`},
		{"bad reentry", "lifetime " + orb + "--ballistic-coefficient 50 --reentry-alt 20", "outside 60..200 km"},
		{"bad span", "lifetime " + orb + "--ballistic-coefficient 50 --max-span 0", "is not usable"},
		{"long span", "lifetime " + orb + "--ballistic-coefficient 50 --max-span 300y", "is not usable"},
		{"span text", "lifetime " + orb + "--ballistic-coefficient 50 --max-span forever", "--max-span"},
		{"bad history", "lifetime " + orb + "--ballistic-coefficient 50 --history -1d", "is not positive"},
		{"fine history", "lifetime " + orb + "--ballistic-coefficient 50 --history 1min", "more than 100000 rows"},
		{"other body", "lifetime --body mars --altitude 300 --ballistic-coefficient 50", "Earth's only"},
		{"open orbit", "lifetime --periapsis-alt 400 --eccentricity 1.2 --ballistic-coefficient 50", "never decays"},
		{"below reentry", "lifetime --altitude 80 --ballistic-coefficient 50", "starts below the reentry altitude"},
		{"expect unknown", "lifetime " + orb + "--ballistic-coefficient 50 --expect life_days=1±1", `no result named "life_days"`},
		{"polar equations", "lifetime " + orb + "--model point --equations polar --ballistic-coefficient 50 --drag", "point mass only"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, stderr, code := runBinary(t, strings.Fields(tc.args)...)
			if code != 2 {
				t.Fatalf("exit %d, want 2; stderr: %s", code, stderr)
			}
			if !strings.Contains(stderr, tc.msg) {
				t.Errorf("stderr %q does not contain %q", stderr, tc.msg)
			}
			if n := strings.Count(strings.TrimSpace(stderr), "\n"); n != 0 || !strings.HasPrefix(stderr, "centra: ") {
				t.Errorf("want one line 'centra: ...', got %q", stderr)
			}
		})
	}
}

// TestPerturbationFlagsOnOtherCommands: the perturbation flags reach the
// commands that propagate through parseModel, and their mistakes are one
// line with exit 2.
func TestPerturbationFlagsOnOtherCommands(t *testing.T) {
	epoch := "--epoch 2027-04-12T09:30:00Z"
	out, stderr, code := runBinary(t, strings.Fields("--quiet ephemeris "+epoch+" --altitude 400 --inclination 51.6 --span 1h --step 30min --model zonal --degree 4 --drag --mass 4 --area 0.03 --third-body sun,moon --srp")...)
	if code != 0 || !strings.Contains(out, "drag (B 60.61 kg/m^2) + Sun + Moon + SRP (Cr 1.3") {
		t.Errorf("ephemeris with perturbations: exit %d, %s\n%s", code, stderr, out)
	}
	// The perturbations move the state: compare with the gravity-only run.
	plain, _, _ := runBinary(t, strings.Fields("--quiet --format csv ephemeris "+epoch+" --altitude 400 --inclination 51.6 --span 1h --step 1h --model zonal --degree 4")...)
	pert, _, _ := runBinary(t, strings.Fields("--quiet --format csv ephemeris "+epoch+" --altitude 400 --inclination 51.6 --span 1h --step 1h --model zonal --degree 4 --drag --ballistic-coefficient 20")...)
	if plain == pert || plain == "" {
		t.Errorf("drag did not change the ephemeris")
	}
	for _, cmd := range []string{"passes --site 47.4,8.9", "eclipses"} {
		args := strings.Fields("--quiet " + cmd + " " + epoch + " --altitude 500 --inclination 97.4 --span 6h --drag --ballistic-coefficient 50 --third-body moon")
		if _, stderr, code := runBinary(t, args...); code != 0 {
			t.Errorf("%s with perturbations: exit %d: %s", cmd, code, stderr)
		}
	}
	errs := []struct{ args, msg string }{
		{"ephemeris --altitude 400 --span 1h --drag --ballistic-coefficient 50 --checks", "--checks compares the propagation with conservation laws"},
		{"ephemeris --altitude 400 --span 1h --density-scale 2", "drag, which is off"},
		{"ephemeris --altitude 400 --span 1h --third-body sun,sun", "twice"},
		{"ephemeris --altitude 400 --span 1h --third-body jupiter", `"jupiter" is not a body`},
		{"ephemeris --altitude 400 --span 1h --third-body ,", "names no body"},
		{"ephemeris --altitude 400 --span 1h --srp --mass 4", "the area facing the Sun"},
		{"ephemeris --altitude 400 --span 1h --srp --mass 4 --area 1 --cr 3", "--cr 3 is not usable"},
		{"ephemeris --altitude 400 --span 1h --srp --mass 0.001 --srp-area 10", "area-to-mass"},
		{"ephemeris --body mars --altitude 400 --span 1h --drag --ballistic-coefficient 50", "Earth's only"},
		{"ephemeris --body moon --altitude 100 --span 1h --srp --mass 4 --area 1", "Earth-centred"},
		{"ephemeris --body mars --altitude 300 --span 1h --third-body sun", "Earth-centred"},
	}
	for _, e := range errs {
		_, stderr, code := runBinary(t, strings.Fields(e.args)...)
		if code != 2 || !strings.Contains(stderr, e.msg) || strings.Count(strings.TrimSpace(stderr), "\n") != 0 {
			t.Errorf("%s: exit %d, stderr %q, want one line with %q", e.args, code, stderr, e.msg)
		}
	}
	// Spacecraft properties alone (as a mission hands them to every
	// command) change nothing.
	withProps, _, code := runBinary(t, strings.Fields("--quiet --format csv ephemeris "+epoch+" --altitude 400 --inclination 51.6 --span 1h --step 1h --model zonal --degree 4 --mass 4 --area 0.03 --cd 2.2 --cr 1.3")...)
	if code != 0 || withProps != plain {
		t.Errorf("spacecraft properties without forces changed the ephemeris (exit %d)", code)
	}
}
