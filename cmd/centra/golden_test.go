package main

import (
	"strings"
	"testing"
)

// Golden files of the table output. Their numbers are checked against
// the world elsewhere: the Vallado orbit by TestOrbitValladoExample and
// the orbit package's tests, the bodies by the bodies package's tests,
// the ephemeris by the propagate package's tests against SciPy.
func TestGoldenTables(t *testing.T) {
	cases := []struct {
		name, args string
	}{
		{"orbit/vallado-2-5", "orbit --epoch 2027-01-01T00:00:00Z --position 6524.834,6862.875,6448.296 --velocity 4.901327,5.533756,-1.976341"},
		{"orbit/hyperbola", "orbit --epoch 2027-01-01T00:00:00Z --semi-major-axis -20000 --eccentricity 1.5 --inclination 30 --true-anomaly 40"},
		{"orbit/sun-synchronous-csv", "--format csv orbit --epoch 2027-01-01T00:00:00Z --altitude 700 --sun-synchronous"},
		{"demo/demo", "demo"},
		{"bodies/list", "bodies"},
		{"bodies/earth", "bodies earth"},
		{"bodies/mars-json", "--format json bodies mars"},
		{"ephemeris/leo-table", "ephemeris --epoch 2027-01-01T00:00:00Z --altitude 500 --inclination 51.6 --span 30min --step 10min"},
		{"ephemeris/leo-geodetic-csv", "--format csv ephemeris --epoch 2027-01-01T00:00:00Z --altitude 500 --inclination 51.6 --span 30min --step 10min --frame geodetic"},
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
