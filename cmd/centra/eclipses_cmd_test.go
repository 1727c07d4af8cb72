package main

import (
	"encoding/csv"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

type eclipsesJSON struct {
	EclipseCount int     `json:"eclipse_count"`
	UmbraCount   int     `json:"umbra_count"`
	MaxDuration  float64 `json:"max_duration_s"`
	Fraction     float64 `json:"eclipse_fraction"`
	BetaStart    float64 `json:"beta_start_deg"`
	OrbitCount   int     `json:"orbit_count"`
	Eclipses     []struct {
		Kind     string  `json:"kind"`
		EntryUTC string  `json:"entry_utc"`
		ExitUTC  string  `json:"exit_utc"`
		Entry    float64 `json:"entry_t_s"`
		Exit     float64 `json:"exit_t_s"`
		Duration float64 `json:"duration_s"`
		Beta     float64 `json:"beta_deg"`
		Partial  bool    `json:"partial"`
	} `json:"eclipses"`
	Beta []struct {
		UTC  string  `json:"utc"`
		T    float64 `json:"t_s"`
		Beta float64 `json:"beta_deg"`
	} `json:"beta"`
	Orbits []struct {
		Orbit         int     `json:"orbit"`
		Duration      float64 `json:"duration_s"`
		Umbra         float64 `json:"umbra_s"`
		UmbraFraction float64 `json:"umbra_fraction"`
	} `json:"orbits"`
	Notes []string `json:"notes"`
}

func runEclipsesJSON(t *testing.T, args ...string) eclipsesJSON {
	t.Helper()
	out, stderr, code := runBinary(t, append([]string{"--quiet", "--format", "json", "eclipses"}, args...)...)
	if code != 0 {
		t.Fatalf("centra eclipses %v: exit %d: %s", args, code, stderr)
	}
	var res eclipsesJSON
	if err := json.Unmarshal([]byte(out), &res); err != nil {
		t.Fatalf("JSON: %v\n%s", err, out)
	}
	return res
}

// The command against the SciPy/ERFA eclipses of testdata/eclipses (an
// orbit with J2 over two days, the Sun from ERFA epv00): every window
// within 0.2 s and every beta angle within 0.005 deg (centra's Sun is good
// to 10 arcsec; see TestPropagatedAgainstSciPyERFA in package shadow).
func TestEclipsesCommandAgainstReference(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "eclipses", "eclipses_reference.json"))
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Propagated struct {
			Span     float64    `json:"span_s"`
			Position [3]float64 `json:"position_km"`
			Velocity [3]float64 `json:"velocity_km_s"`
			Events   []struct {
				Kind        string
				Entry, Exit float64
				Beta        float64
				Partial     bool
			} `json:"-"`
			Raw  []map[string]any `json:"events"`
			Beta []struct {
				T    float64 `json:"t_s"`
				Beta float64 `json:"beta_deg"`
			} `json:"beta"`
		} `json:"propagated"`
	}
	if err := json.Unmarshal(data, &ref); err != nil {
		t.Fatal(err)
	}
	pr := ref.Propagated
	res := runEclipsesJSON(t, "--epoch", "2027-04-13T00:00:00Z", "--position", vec(pr.Position), "--velocity", vec(pr.Velocity), "--span", "2d")
	if len(res.Eclipses) != len(pr.Raw) {
		t.Fatalf("%d windows, want %d", len(res.Eclipses), len(pr.Raw))
	}
	passages, longest := 0, 0.0
	for i, w := range pr.Raw {
		g := res.Eclipses[i]
		entry, exit := w["entry_t_s"].(float64), w["exit_t_s"].(float64)
		partial := w["partial"].(bool) || exit == pr.Span
		if g.Kind != w["kind"] || g.Partial != partial || math.Abs(g.Entry-entry) > 0.2 || math.Abs(g.Exit-exit) > 0.2 {
			t.Errorf("window %d: %s %.3f..%.3f partial %v; want %s %.3f..%.3f partial %v", i, g.Kind, g.Entry, g.Exit, g.Partial, w["kind"], entry, exit, partial)
		}
		if b, ok := w["beta_deg"].(float64); ok && !partial && math.Abs(g.Beta-b) > 0.005 {
			t.Errorf("window %d: beta %.5f deg, want %.5f", i, g.Beta, b)
		}
		if w["kind"] == "penumbra" {
			passages++
		} else if !partial {
			longest = math.Max(longest, exit-entry)
		}
	}
	if res.EclipseCount != passages || math.Abs(res.MaxDuration-longest) > 0.4 {
		t.Errorf("eclipse_count %d, max_duration_s %.3f; want %d, %.3f", res.EclipseCount, res.MaxDuration, passages, longest)
	}
	if len(res.Beta) != len(pr.Beta) {
		t.Fatalf("%d beta angles, want %d", len(res.Beta), len(pr.Beta))
	}
	for i, b := range pr.Beta {
		if res.Beta[i].T != b.T || math.Abs(res.Beta[i].Beta-b.Beta) > 0.005 {
			t.Errorf("beta %d: %v s %.5f deg, want %v s %.5f deg", i, res.Beta[i].T, res.Beta[i].Beta, b.T, b.Beta)
		}
	}
	// --expect on the reference numbers.
	args := []string{"--quiet", "eclipses", "--epoch", "2027-04-13T00:00:00Z", "--position", vec(pr.Position), "--velocity", vec(pr.Velocity), "--span", "2d",
		"--expect", fmt.Sprintf("eclipse_count=%d±0", passages), "--expect", fmt.Sprintf("max_duration_s=%.3f±0.4", longest),
		"--expect", fmt.Sprintf("beta_start_deg=%.5f±0.005", pr.Beta[0].Beta)}
	if out, stderr, code := runBinary(t, args...); code != 0 {
		t.Errorf("expectations from the reference: exit %d\n%s%s", code, out, stderr)
	}
}

// The shadow per orbit of a circular orbit: one umbra per orbit from
// node to node, each close to the cylindrical duration of its beta angle
// (Vallado, 4th ed., sec. 5.3), shorter by the cone (8 s at 500 km; see
// package shadow), and the fraction the quotient of the two.
func TestEclipsesPerOrbit(t *testing.T) {
	res := runEclipsesJSON(t, "--epoch", "2027-04-13T00:00:00Z", "--altitude", "500", "--inclination", "51.6", "--raan", "30", "--model", "point", "--span", "6h")
	if len(res.Orbits) != 3 {
		t.Fatalf("%d complete orbits in 6 h, want 3", len(res.Orbits))
	}
	const re, h = 6378.137, 500.0
	period := 2 * math.Pi * math.Sqrt(math.Pow(re+h, 3)/398600.4418)
	for _, o := range res.Orbits {
		if math.Abs(o.Duration-period) > 1e-3 {
			t.Errorf("orbit %d lasts %.4f s, want the period %.4f s", o.Orbit, o.Duration, period)
		}
		if math.Abs(o.UmbraFraction-o.Umbra/o.Duration) > 1e-12 {
			t.Errorf("orbit %d fraction %v, umbra %v s of %v s", o.Orbit, o.UmbraFraction, o.Umbra, o.Duration)
		}
	}
	for _, e := range res.Eclipses {
		if e.Kind != "umbra" || e.Partial {
			continue
		}
		x := math.Sqrt(h*h+2*re*h) / ((re + h) * math.Cos(e.Beta*math.Pi/180))
		cyl := period / math.Pi * math.Acos(x)
		if d := cyl - e.Duration; d < 5 || d > 12 {
			t.Errorf("umbra %.2f s at beta %.2f deg; cylindrical %.2f s: the cone should shorten it by 5..12 s", e.Duration, e.Beta, cyl)
		}
	}
	// CSV: one row per window.
	out, _, code := runBinary(t, "--quiet", "--format", "csv", "eclipses", "--epoch", "2027-04-13T00:00:00Z", "--altitude", "500", "--inclination", "51.6", "--raan", "30", "--model", "point", "--span", "6h")
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if code != 0 || err != nil || len(rows) != len(res.Eclipses)+1 || strings.Join(rows[0], ",") != "kind,entry_utc,exit_utc,entry_t_s,exit_t_s,duration_s,beta_deg,partial" {
		t.Errorf("CSV: exit %d, %v, %d rows for %d windows; header %v", code, err, len(rows), len(res.Eclipses), rows[0])
	}
}

// A dawn-dusk orbit in April never enters the shadow: an empty list and a
// note (the beta angle stays above the limiting 68 deg).
func TestEclipsesNone(t *testing.T) {
	res := runEclipsesJSON(t, "--epoch", "2027-04-12T09:30:00Z", "--periapsis-alt", "524", "--apoapsis-alt", "541", "--sun-synchronous", "--raan", "112.5", "--span", "1d")
	if len(res.Eclipses) != 0 || res.EclipseCount != 0 || res.MaxDuration != 0 || res.Fraction != 0 {
		t.Fatalf("eclipses %+v", res)
	}
	if len(res.Notes) == 0 || !strings.HasPrefix(res.Notes[0], "no eclipse over the span") || !(res.BetaStart > 68) {
		t.Errorf("notes %q, beta %v deg", res.Notes, res.BetaStart)
	}
}
