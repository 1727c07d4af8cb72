package timescale

import (
	"errors"
	"strings"
	"testing"
)

// FuzzReadLeapSecondsList: any text either replaces the table with one
// that converts both ways, or fails with a LeapTableError (or a read
// error) and leaves the table as it was; nothing panics.
func FuzzReadLeapSecondsList(f *testing.F) {
	for _, s := range []string{
		// IERS leap-seconds.list layout (IERS Bulletin C distribution): the
		// first entries and an expiry line.
		"#@ 3960057600\n2272060800 10 # 1 Jan 1972\n2287785600 11 # 1 Jul 1972\n3692217600 37 # 1 Jan 2017\n",
		"#@ 3960057600\n2272060800 ten\n",
		"2272060800 10\n",
		"#@ x\n",
		"#@ -9223372036854775808\n-9223372036854775808 10\n",
		"#@ 9223372036854775807\n9223372036854775807 2147483647\n",
		"#@ 3960057600\n3692217600 37\n2272060800 10\n",
		"#@ 3960057600\n2272060800 10\n2272060800 11\n",
		"#@ 100\n2272060800 10\n",
		"#\n\n# comment\n#@ 3960057600\n2272060800 10 11\n",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		defer resetBuiltin()
		before := LeapSeconds()
		err := ReadLeapSecondsList(strings.NewReader(s))
		if err != nil {
			var le *LeapTableError
			if !errors.As(err, &le) && !strings.HasPrefix(err.Error(), "timescale: ") {
				t.Fatalf("ReadLeapSecondsList error %T %v", err, err)
			}
			after := LeapSeconds()
			if len(after) != len(before) {
				t.Fatalf("table changed on error %v: %d -> %d entries", err, len(before), len(after))
			}
			return
		}
		// An accepted table must give instants that format and parse back.
		for _, u := range []string{"1972-01-01T00:00:00Z", "2000-01-01T12:00:00Z", "2017-01-01T00:00:00Z", "2150-06-30T23:59:59Z"} {
			e, err := ParseUTC(u)
			if err != nil {
				continue
			}
			back, err := ParseUTC(e.FormatUTC())
			if err != nil || back.Sub(e) != 0 {
				t.Fatalf("table from %q: %s formats as %q, reads back %v (%v)", s, u, e.FormatUTC(), back.Sub(e), err)
			}
		}
	})
}
