package main

import (
	"bufio"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// Golden files of the atmosphere command. Their numbers are checked
// against the world by TestAtmosphereAgainstFluids and TestAtmosphereTables
// below and by the bodies/atmosphere tests.
func TestAtmosphereGolden(t *testing.T) {
	cases := []struct{ name, args string }{
		{"atmosphere/levels-table", "atmosphere --alt 0 --alt 11km --alt 50 --alt 86 --alt 120 --alt 400"},
		{"atmosphere/table-csv", "--format csv atmosphere --from 0 --to 1000 --step 100"},
		{"atmosphere/scaled-json", "--format json atmosphere --alt 30 --alt 400 --density-scale 2"},
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

type atmosphereJSON struct {
	DensityScale float64 `json:"density_scale"`
	Levels       []struct {
		AltitudeKm   float64  `json:"altitude_km"`
		Density      float64  `json:"density_kg_m3"`
		ModelDensity *float64 `json:"model_density_kg_m3"`
		Temperature  *float64 `json:"temperature_k"`
		Pressure     *float64 `json:"pressure_pa"`
		Model        string   `json:"model"`
	} `json:"levels"`
}

func runAtmosphereJSON(t *testing.T, args ...string) atmosphereJSON {
	t.Helper()
	out, stderr, code := runBinary(t, append([]string{"--format", "json", "atmosphere"}, args...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var r atmosphereJSON
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatalf("output is not JSON: %v\n%s", err, out)
	}
	return r
}

// TestAtmosphereAgainstFluids runs the command at the altitudes of the
// stored reference of python3-fluids 1.0.22 (fluids.atmosphere.ATMOSPHERE_1976,
// testdata/atmosphere/ussa1976_fluids.csv and its script) and compares
// density, temperature and pressure, to 1e-6 relative (fluids evaluates
// the same closed forms of the standard).
func TestAtmosphereAgainstFluids(t *testing.T) {
	f, err := os.Open(filepath.Join("..", "..", "testdata", "atmosphere", "ussa1976_fluids.csv"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	type row struct{ h, temp, p, rho float64 }
	var rows []row
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.HasPrefix(line, "alt_km") || line == "" {
			continue
		}
		parts := strings.Split(line, ",")
		var v [4]float64
		for i := range v {
			v[i], err = strconv.ParseFloat(parts[i], 64)
			if err != nil {
				t.Fatal(err)
			}
		}
		if v[0] <= 86 {
			rows = append(rows, row{v[0], v[1], v[2], v[3]})
		}
	}
	var args []string
	for _, r := range rows {
		args = append(args, "--alt", strconv.FormatFloat(r.h, 'g', -1, 64))
	}
	got := runAtmosphereJSON(t, args...)
	if len(got.Levels) != len(rows) {
		t.Fatalf("%d levels for %d altitudes", len(got.Levels), len(rows))
	}
	const relTol = 1e-6
	for i, r := range rows {
		l := got.Levels[i]
		if l.Temperature == nil || l.Pressure == nil {
			t.Fatalf("%g km: temperature or pressure missing", r.h)
		}
		for _, c := range []struct {
			name      string
			got, want float64
		}{{"density", l.Density, r.rho}, {"temperature", *l.Temperature, r.temp}, {"pressure", *l.Pressure, r.p}} {
			if rel := math.Abs(c.got-c.want) / c.want; rel > relTol {
				t.Errorf("%g km: %s %g, fluids %g (rel %.2g)", r.h, c.name, c.got, c.want, rel)
			}
		}
	}
}

// TestAtmosphereTables checks printed values against the standard: the
// sea-level values that define the U.S. Standard Atmosphere 1976
// (NOAA-S/T 76-1562, Part 1: 1.2250 kg/m^3, 288.15 K, 101325 Pa) and, at
// 11 km geometric, Table I's 3.6480e-1 kg/m^3 and 216.774 K (from memory;
// the temperature is recomputed as 288.15 - 6.5 H with the geopotential
// height H = r0 Z/(r0 + Z), r0 = 6356.766 km, of the standard's
// eq. 18), to half a unit of the last printed digit; the base densities of Vallado, 4th ed., Table 8-4, at 400
// km (3.725e-12 kg/m^3) and 1000 km (3.019e-15 kg/m^3), exactly; null
// temperature and pressure above 86 km; and the density scale applied to
// density only.
func TestAtmosphereTables(t *testing.T) {
	got := runAtmosphereJSON(t, "--alt", "0", "--alt", "11", "--alt", "400", "--alt", "1000")
	l := got.Levels
	within := func(name string, v, want, half float64) {
		if math.Abs(v-want) > half {
			t.Errorf("%s = %.8g, table %.8g ± %g", name, v, want, half)
		}
	}
	within("rho(0)", l[0].Density, 1.2250, 0.00005)
	within("T(0)", *l[0].Temperature, 288.150, 0.0005)
	within("p(0)", *l[0].Pressure, 101325, 0.5)
	within("rho(11 km)", l[1].Density, 0.36480, 0.000005)
	within("T(11 km)", *l[1].Temperature, 216.774, 0.0005)
	h := 6356.766 * 11 / (6356.766 + 11)
	within("T(11 km) from the lapse rate", *l[1].Temperature, 288.15-6.5*h, 1e-9)
	within("rho(400 km)", l[2].Density, 3.725e-12, 1e-27)
	within("rho(1000 km)", l[3].Density, 3.019e-15, 1e-30)
	if l[2].Temperature != nil || l[2].Pressure != nil || l[2].Model != "exponential-vallado-table-8-4" {
		t.Errorf("400 km: temperature %v, pressure %v, model %q; want null, null, the exponential table", l[2].Temperature, l[2].Pressure, l[2].Model)
	}
	scaled := runAtmosphereJSON(t, "--alt", "0", "--alt", "400", "--density-scale", "2")
	if scaled.DensityScale != 2 || scaled.Levels[1].Density != 2*3.725e-12 || scaled.Levels[1].ModelDensity == nil || *scaled.Levels[1].ModelDensity != 3.725e-12 {
		t.Errorf("density scale 2: %+v", scaled)
	}
	if *scaled.Levels[0].Temperature != *l[0].Temperature {
		t.Errorf("the density scale changed the temperature")
	}
}

func TestAtmosphereErrors(t *testing.T) {
	tests := []struct {
		name, args string
		code       int
		msg        string
	}{
		{"nothing", "atmosphere", 2, "no altitude given"},
		{"both forms", "atmosphere --alt 5 --from 0 --to 10 --step 1", 2, "both give the altitudes"},
		{"half table", "atmosphere --from 0 --to 10", 2, "needs --from, --to and --step"},
		{"reversed", "atmosphere --from 10 --to 0 --step 1", 2, "swap --from and --to"},
		{"zero step", "atmosphere --from 0 --to 10 --step 0", 2, "is not positive"},
		{"too many", "atmosphere --from 0 --to 1000 --step 1m", 2, "add --force"},
		{"below the model", "atmosphere --alt -6", 2, "below the model's lowest altitude"},
		{"bad unit", "atmosphere --alt 5furlong", 2, `--alt "5furlong" is not a valid length`},
		{"nan", "atmosphere --alt NaN", 2, `--alt "NaN"`},
		{"bad scale", "atmosphere --alt 5 --density-scale zero", 2, "--density-scale \"zero\" is not a number"},
		{"negative scale", "atmosphere --alt 5 --density-scale -1", 2, "is not usable"},
		{"expect two levels", "atmosphere --alt 5 --alt 6 --expect density_kg_m3=1±1", 2, "applies to one altitude"},
		{"expect unknown key", "atmosphere --alt 5 --expect speed_km_s=1±1", 2, `no result named "speed_km_s"`},
		{"expect fails", "atmosphere --alt 0 --expect density_kg_m3=1.3±0.01", 1, "1 of 1 expectations failed"},
		{"stray argument", "atmosphere --alt 5 extra", 2, `unexpected argument "extra"`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, stderr, code := runBinary(t, strings.Fields(tc.args)...)
			if code != tc.code {
				t.Fatalf("exit %d, want %d; stderr: %s", code, tc.code, stderr)
			}
			if !strings.Contains(stderr, tc.msg) {
				t.Errorf("stderr %q does not contain %q", stderr, tc.msg)
			}
			if lines := strings.Count(strings.TrimSpace(stderr), "\n"); tc.code == 2 && lines != 0 {
				t.Errorf("stderr has %d lines, want one: %q", lines+1, stderr)
			}
		})
	}
	if out, _, code := runBinary(t, "atmosphere", "--alt", "0", "--expect", "density_kg_m3=1.225±0.001"); code != 0 || !strings.Contains(out, "Expectations") {
		t.Errorf("passing expectation: exit %d, output %q", code, out)
	}
}
