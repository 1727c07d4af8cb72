package main

import (
	"encoding/csv"
	"encoding/json"
	"math"
	"strconv"
	"strings"
	"testing"

	"centra/cmd/centra/internal/ccsds"
)

const ephemBase = "ephemeris --altitude 500 --inclination 51.6 --epoch 2027-01-01T00:00:00Z --span 1h --step 10min"

func TestEphemerisCSV(t *testing.T) {
	out, stderr, code := runBinary(t, append([]string{"--format", "csv"}, strings.Fields(ephemBase)...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	// The contract's header; rows at t = 0, step, ..., span inclusive.
	if strings.Join(rows[0], ",") != "utc,t_s,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s" {
		t.Errorf("header = %v", rows[0])
	}
	if len(rows) != 1+7 {
		t.Fatalf("%d data rows, want 7", len(rows)-1)
	}
	for i, r := range rows[1:] {
		ts, _ := strconv.ParseFloat(r[1], 64)
		if ts != float64(600*i) {
			t.Errorf("row %d t_s = %v, want %d", i, ts, 600*i)
		}
	}
	if rows[7][0] != "2027-01-01T01:00:00.000Z" {
		t.Errorf("last utc = %s", rows[7][0])
	}
	// The first row is the initial state: a circle of radius Re + 500 km.
	var r2 float64
	for _, s := range rows[1][2:5] {
		x, _ := strconv.ParseFloat(s, 64)
		r2 += x * x
	}
	if math.Abs(math.Sqrt(r2)-6878.137) > 1e-6 {
		t.Errorf("initial radius %v, want 6878.137 km (WGS 84 a + 500 km)", math.Sqrt(r2))
	}
}

func TestEphemerisGeodeticAndJSON(t *testing.T) {
	out, stderr, code := runBinary(t, append([]string{"--format", "csv"}, strings.Fields(ephemBase+" --frame geodetic")...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if !strings.HasPrefix(out, "utc,t_s,lat_deg,lon_deg,alt_km\n") {
		t.Errorf("geodetic header: %q", strings.SplitN(out, "\n", 2)[0])
	}
	out, stderr, code = runBinary(t, append([]string{"--format", "json"}, strings.Fields(ephemBase+" --checks")...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var doc struct {
		States []struct {
			UTC      string     `json:"utc"`
			T        float64    `json:"t_s"`
			Position [3]float64 `json:"position_km"`
			Velocity [3]float64 `json:"velocity_km_s"`
		} `json:"states"`
		Checks []struct {
			Name string `json:"name"`
			Pass bool   `json:"pass"`
		} `json:"checks"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, out)
	}
	if len(doc.States) != 7 || doc.States[6].T != 3600 || len(doc.Checks) == 0 {
		t.Errorf("JSON: %d states, %d checks", len(doc.States), len(doc.Checks))
	}
	for _, c := range doc.Checks {
		if !c.Pass {
			t.Errorf("check %s failed", c.Name)
		}
	}
}

// The OEM's data lines read back equal the CSV states to the OEM's printed
// precision (1e-6 km, 1e-9 km/s; CCSDS 502.0-B-2 section 5.2.4 data lines).
func TestEphemerisOEMRoundTrip(t *testing.T) {
	oemText, stderr, code := runBinary(t, append([]string{"--format", "oem"}, strings.Fields(ephemBase+" --object-name LARK-1")...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	m, err := ccsds.ParseOEM(strings.NewReader(oemText), "oem")
	if err != nil {
		t.Fatalf("ParseOEM: %v\n%s", err, oemText)
	}
	seg := m.Segments[0]
	if seg.Meta["OBJECT_NAME"] != "LARK-1" || seg.Meta["REF_FRAME"] != "GCRF" || seg.Meta["TIME_SYSTEM"] != "UTC" || seg.Meta["START_TIME"] != "2027-01-01T00:00:00.000" || seg.Meta["STOP_TIME"] != "2027-01-01T01:00:00.000" {
		t.Errorf("metadata %v", seg.Meta)
	}
	csvText, _, _ := runBinary(t, append([]string{"--format", "csv"}, strings.Fields(ephemBase)...)...)
	rows, _ := csv.NewReader(strings.NewReader(csvText)).ReadAll()
	if len(seg.States) != len(rows)-1 {
		t.Fatalf("OEM has %d states, CSV %d", len(seg.States), len(rows)-1)
	}
	for i, st := range seg.States {
		if st.Epoch+"Z" != rows[i+1][0] {
			t.Errorf("epoch %s vs %s", st.Epoch, rows[i+1][0])
		}
		for k := 0; k < 6; k++ {
			want, _ := strconv.ParseFloat(rows[i+1][2+k], 64)
			got, tol := 0.0, 0.5e-6
			if k < 3 {
				got = st.Position[k]
			} else {
				got, tol = st.Velocity[k-3], 0.5e-9
			}
			if math.Abs(got-want) > tol*(1+1e-9) {
				t.Errorf("state %d component %d: OEM %v, CSV %v", i, k, got, want)
			}
		}
	}
}

func TestEphemerisErrors(t *testing.T) {
	tests := []struct {
		args string
		msg  string
	}{
		{ephemBase + " --step 0", "--step 0 is not positive"},
		{ephemBase + " --step -5s", "is not positive"},
		{ephemBase + " --step 0.1ms", "below the 1 ms"},
		{"ephemeris --altitude 500 --span 0", "--span is zero"},
		{"ephemeris --altitude 500 --span 1000y", "absurdly long"},
		{"ephemeris --altitude 500 --span 3weeks", "not a valid duration"},
		{"ephemeris --altitude 500 --span 100d --step 1ms", "rows"},
		{ephemBase + " --frame ecliptic", `--frame "ecliptic" is not known`},
		{"ephemeris --body mars --altitude 300 --frame fixed", "Earth only"},
		{ephemBase + " --model spherical", `--model "spherical"`},
		{ephemBase + " --model point --degree 4", "--degree applies to --model zonal only"},
		{ephemBase + " --model zonal --degree 9", "not a zonal degree"},
		{ephemBase + " --tolerance 1e-20", "--tolerance"},
		{ephemBase + " --dut1 2", "--dut1"},
		{ephemBase + " --expect energy_conservation_relative_error=0±1e-9", "needs --checks"},
		{"--format oem " + ephemBase + " --frame geodetic", "OEM carries Cartesian"},
	}
	for _, tt := range tests {
		_, stderr, code := runBinary(t, strings.Fields(tt.args)...)
		if code != 2 || !strings.Contains(stderr, tt.msg) || strings.Count(strings.TrimSpace(stderr), "\n") > 0 {
			t.Errorf("centra %s: exit %d, stderr %q; want 2 and %q", tt.args, code, stderr, tt.msg)
		}
	}
}

func TestEphemerisExpectOnChecks(t *testing.T) {
	_, stderr, code := runBinary(t, strings.Fields(ephemBase+" --checks --expect energy_conservation_relative_error=0±1e-7")...)
	if code != 0 {
		t.Errorf("exit %d: %s", code, stderr)
	}
	_, _, code = runBinary(t, strings.Fields(ephemBase+" --checks --expect energy_conservation_relative_error=1±1e-7")...)
	if code != 1 {
		t.Errorf("failing expectation: exit %d, want 1", code)
	}
}

// The orbit command's sub-satellite point is the first row of the
// geodetic ephemeris (the frames themselves are checked against ERFA in
// bodies/earthframe and bodies/geodesy).
func TestSubSatellitePointMatchesGeodeticEphemeris(t *testing.T) {
	args := "--epoch 2027-01-01T00:00:00Z --altitude 500 --inclination 51.6 --true-anomaly 30"
	out, stderr, code := runBinary(t, append([]string{"--format", "json", "orbit"}, strings.Fields(args)...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var m map[string]any
	json.Unmarshal([]byte(out), &m)
	csvText, _, _ := runBinary(t, append([]string{"--format", "csv", "ephemeris", "--frame", "geodetic", "--span", "1min", "--step", "1min"}, strings.Fields(args)...)...)
	rows, _ := csv.NewReader(strings.NewReader(csvText)).ReadAll()
	for i, key := range []string{"subsatellite_lat_deg", "subsatellite_lon_deg", "geodetic_alt_km"} {
		want, _ := strconv.ParseFloat(rows[1][2+i], 64)
		if got, _ := m[key].(float64); math.Abs(got-want) > 1e-9 {
			t.Errorf("%s = %v, geodetic ephemeris says %v", key, got, want)
		}
	}
}
