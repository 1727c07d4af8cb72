package timescale

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
	"time"

	"centra/bodies/internal/frametest"
)

// jdDiffSeconds returns (a1+a2)-(b1+b2) in seconds without adding the
// large parts to the small ones first.
func jdDiffSeconds(a1, a2, b1, b2 float64) float64 {
	return ((a1 - b1) + (a2 - b2)) * SecondsPerDay
}

// TestLeapTableERFA compares TAI-UTC with erfa.dat (ERFA 2.0.0) at every
// table date and the day before (testdata/frames/leap_seconds.csv).
func TestLeapTableERFA(t *testing.T) {
	for _, r := range frametest.Read(t, "leap_seconds.csv") {
		d, err := time.Parse(time.DateOnly, r["date"])
		if err != nil {
			t.Fatal(err)
		}
		got, err := TAIMinusUTC(d)
		if err != nil {
			t.Fatalf("TAIMinusUTC(%s): %v", r["date"], err)
		}
		if want := r.F(t, "dat_at_0h"); float64(got) != want {
			t.Errorf("TAIMinusUTC(%s 00:00) = %d s, want %g s (erfa.dat)", r["date"], got, want)
		}
		if want := r.F(t, "dat_day_before_12h"); !math.IsNaN(want) {
			got, _ := TAIMinusUTC(d.Add(-12 * time.Hour))
			if float64(got) != want {
				t.Errorf("TAIMinusUTC(day before %s, 12:00) = %d s, want %g s (erfa.dat)", r["date"], got, want)
			}
		}
	}
}

// TestLeapTablePublished checks the published IERS values: TAI-UTC = 10 s
// on 1972-01-01 and 37 s since 2017-01-01 (IERS Bulletin C 52, July 2016,
// and leap-seconds.list), 36 s just before.
func TestLeapTablePublished(t *testing.T) {
	tests := []struct {
		utc  string
		want int
	}{
		{"1972-01-01T00:00:00Z", 10}, // IERS leap-seconds.list, first line
		{"2016-12-31T23:59:59Z", 36}, // IERS Bulletin C 52
		{"2017-01-01T00:00:00Z", 37}, // IERS Bulletin C 52
		{"2025-01-01T00:00:00Z", 37}, // IERS Bulletin C 69: no change
	}
	for _, tt := range tests {
		d, _ := time.Parse(time.RFC3339, tt.utc)
		if got, err := TAIMinusUTC(d); err != nil || got != tt.want {
			t.Errorf("TAIMinusUTC(%s) = %d, %v; want %d", tt.utc, got, err, tt.want)
		}
	}
	if _, err := TAIMinusUTC(time.Date(1971, 12, 31, 23, 59, 59, 0, time.UTC)); !errors.Is(err, ErrBeforeLeapTable) {
		t.Errorf("TAIMinusUTC(1971-12-31T23:59:59Z) error = %v, want ErrBeforeLeapTable", err)
	}
}

// TestJulianDatesERFA compares the JDs of TAI, TT, UT1 and TDB with ERFA
// 2.0.0 (erfa.utctai, taitt, utcut1, tttdb+dtdb) at 60 epochs 1980-2060
// and four leap seconds (testdata/frames/times.csv).
func TestJulianDatesERFA(t *testing.T) {
	const (
		tolExact = 1e-9  // s: TAI, TT, UT1 are exact offsets; only the JD split rounds (~1e-11 s)
		tolTDB   = 10e-6 // s: Kaplan, USNO Circular 179, eq. 2.6 claims ~10 us against the full series
	)
	for _, r := range frametest.Read(t, "times.csv") {
		e, err := ParseUTC(r["utc"])
		if err != nil {
			t.Fatalf("ParseUTC(%q): %v", r["utc"], err)
		}
		dut1 := r.F(t, "dut1_s")
		check := func(name string, a1, a2 float64, k string, tol float64) {
			d := jdDiffSeconds(a1, a2, r.F(t, k+"1"), r.F(t, k+"2"))
			if math.Abs(d) > tol {
				t.Errorf("%s: JD%s off by %.3g s from ERFA, tolerance %.1g s", r["utc"], name, d, tol)
			}
		}
		a1, a2 := e.JDTAI()
		check("TAI", a1, a2, "tai", tolExact)
		a1, a2 = e.JDTT()
		check("TT", a1, a2, "tt", tolExact)
		a1, a2 = e.JDUT1(dut1)
		check("UT1", a1, a2, "ut1", tolExact)
		a1, a2 = e.JDTDB()
		check("TDB", a1, a2, "tdb", tolTDB)
	}
}

// TestLeapSecondArithmetic: the leap second at the end of 2016-12-31
// (IERS Bulletin C 52) makes that minute 61 s long.
func TestLeapSecondArithmetic(t *testing.T) {
	start := MustParseUTC("2016-12-31T23:59:59.500Z")
	tests := []struct {
		add  float64
		want string
		leap bool
	}{
		{0, "2016-12-31T23:59:59.500Z", false},
		{0.5, "2016-12-31T23:59:60.000Z", true},
		{1.25, "2016-12-31T23:59:60.750Z", true},
		{1.5, "2017-01-01T00:00:00.000Z", false},
		{61.5, "2017-01-01T00:01:00.000Z", false},
	}
	for _, tt := range tests {
		e := start.Add(tt.add)
		if got := e.FormatUTC(); got != tt.want {
			t.Errorf("start.Add(%g).FormatUTC() = %s, want %s", tt.add, got, tt.want)
		}
		if got := e.IsLeapSecond(); got != tt.leap {
			t.Errorf("start.Add(%g).IsLeapSecond() = %v, want %v", tt.add, got, tt.leap)
		}
	}
	a := MustParseUTC("2016-12-31T23:59:00Z")
	b := MustParseUTC("2017-01-01T00:00:00Z")
	if got := b.Sub(a); got != 61 {
		t.Errorf("minute before 2017-01-01 lasted %g s, want 61 s (IERS Bulletin C 52)", got)
	}
	if got := MustParseUTC("2016-12-31T23:59:60.5Z").UTC(); !got.Equal(time.Date(2016, 12, 31, 23, 59, 59, 5e8, time.UTC)) {
		t.Errorf("UTC() in a leap second = %v, want the repeated 23:59:59.5", got)
	}
}

// TestParseUTC covers offsets, fractions and refusals. Expected instants
// follow from RFC 3339 section 5.6 (offsets) and 5.7 (leap seconds with
// offsets: 1990-12-31T15:59:60-08:00 is the 1990 leap second).
func TestParseUTC(t *testing.T) {
	tests := []struct {
		in      string
		want    string // FormatUTC of the result
		wantErr error
	}{
		{"2024-03-01T12:00:00Z", "2024-03-01T12:00:00.000Z", nil},
		{"2024-03-01t12:00:00z", "2024-03-01T12:00:00.000Z", nil},
		{"2024-03-01 12:00:00Z", "2024-03-01T12:00:00.000Z", nil},
		{"2024-03-01T13:30:00.25+01:30", "2024-03-01T12:00:00.250Z", nil},
		{"2024-03-01T06:59:59.9995-05:00", "2024-03-01T12:00:00.000Z", nil}, // rounds to ms
		{"1990-12-31T15:59:60-08:00", "1990-12-31T23:59:60.000Z", nil},      // RFC 3339 section 5.8 example
		{"1990-12-31T23:59:60Z", "1990-12-31T23:59:60.000Z", nil},
		{"1972-01-01T00:00:00Z", "1972-01-01T00:00:00.000Z", nil},
		{"1971-12-31T23:59:59.999Z", "", ErrBeforeLeapTable},
		{"1972-01-01T00:30:00+01:00", "", ErrBeforeLeapTable},
		{"2017-06-30T23:59:60Z", "", ErrNotLeapSecond},
		{"2016-12-31T22:59:60Z", "", ErrNotLeapSecond},
		{"2024-03-01T12:00:00", "", ErrSyntax},
		{"2024-13-01T12:00:00Z", "", ErrSyntax},
		{"2024-02-30T12:00:00Z", "", ErrSyntax},
		{"yesterday", "", ErrSyntax},
		{"", "", ErrSyntax},
	}
	for _, tt := range tests {
		e, err := ParseUTC(tt.in)
		if tt.wantErr != nil {
			if !errors.Is(err, tt.wantErr) {
				t.Errorf("ParseUTC(%q) error = %v, want %v", tt.in, err, tt.wantErr)
			}
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Input != tt.in {
				t.Errorf("ParseUTC(%q) error %T does not carry the input", tt.in, err)
			}
			if err != nil && !strings.Contains(err.Error(), ";") {
				t.Errorf("ParseUTC(%q) error %q has no fix hint", tt.in, err)
			}
			continue
		}
		if err != nil {
			t.Errorf("ParseUTC(%q) error %v", tt.in, err)
			continue
		}
		if got := e.FormatUTC(); got != tt.want {
			t.Errorf("ParseUTC(%q).FormatUTC() = %s, want %s", tt.in, got, tt.want)
		}
	}
}

// TestBeforeLeapTableMessage: the error names the date and the fix.
func TestBeforeLeapTableMessage(t *testing.T) {
	_, err := ParseUTC("1969-07-20T20:17:40Z")
	var be *BeforeLeapTableError
	if !errors.As(err, &be) || !be.UTC.Equal(time.Date(1969, 7, 20, 20, 17, 40, 0, time.UTC)) {
		t.Fatalf("error %v does not carry the date", err)
	}
	for _, s := range []string{"1969-07-20T20:17:40Z", "1972-01-01", "give an epoch"} {
		if !strings.Contains(err.Error(), s) {
			t.Errorf("error %q lacks %q", err, s)
		}
	}
}

// TestNanosecondsSurvive: whole-second TAI plus a fraction keeps
// nanoseconds across decades. The expected day count comes from the
// standard library calendar, the leap seconds from IERS Bulletin C
// (TAI-UTC 19 s in 1980, 37 s in 2030).
func TestNanosecondsSurvive(t *testing.T) {
	a := MustParseUTC("1980-01-01T00:00:00.000000001Z")
	b := MustParseUTC("2030-01-01T00:00:00.000000003Z")
	days := int64(time.Date(2030, 1, 1, 0, 0, 0, 0, time.UTC).Sub(time.Date(1980, 1, 1, 0, 0, 0, 0, time.UTC)).Hours() / 24)
	as, af := a.TAISeconds()
	bs, bf := b.TAISeconds()
	if got, want := bs-as, days*86400+37-19; got != want {
		t.Errorf("whole seconds 1980->2030 = %d, want %d", got, want)
	}
	if d := (bf - af) - 2e-9; math.Abs(d) > 1e-15 {
		t.Errorf("fraction difference = %.18f s, want 2e-9 s", bf-af)
	}
	rng := rand.New(rand.NewPCG(1, 1))
	lo := time.Date(1972, 1, 1, 0, 0, 0, 0, time.UTC).Unix()
	hi := time.Date(2100, 1, 1, 0, 0, 0, 0, time.UTC).Unix()
	for range 2000 {
		tm := time.Unix(lo+rng.Int64N(hi-lo), rng.Int64N(1e9)).UTC()
		e, err := FromUTC(tm)
		if err != nil {
			t.Fatal(err)
		}
		if got := e.UTC(); !got.Equal(tm) {
			t.Fatalf("FromUTC(%v).UTC() = %v", tm, got)
		}
		if got := e.Add(1e-9).UTC(); !got.Equal(tm.Add(1)) {
			t.Fatalf("FromUTC(%v).Add(1ns).UTC() = %v", tm, got)
		}
	}
}

// TestAddSub: Add and Sub are inverse, including negative and fractional
// durations.
func TestAddSub(t *testing.T) {
	e := MustParseUTC("2024-03-01T12:00:00.75Z")
	for _, s := range []float64{0, 1e-9, 0.25, -0.25, -0.75, -1.5, 86400.5, -3.2e9, 1.5e9} {
		got := e.Add(s).Sub(e)
		if math.Abs(got-s) > 1e-15*math.Max(1, math.Abs(s)) {
			t.Errorf("e.Add(%g).Sub(e) = %.17g", s, got)
		}
		_, f := e.Add(s).TAISeconds()
		if f < 0 || f >= 1 {
			t.Errorf("e.Add(%g) fraction %g outside [0, 1)", s, f)
		}
	}
	if e.Add(1).Compare(e) != 1 || e.Compare(e.Add(1)) != -1 || e.Compare(e) != 0 {
		t.Error("Compare is wrong")
	}
	// J2000.0 TT is JD 2451545.0 TT by definition (IAU 1991 Resolution A4);
	// the TAI instant is 2000-01-01T11:59:27.816 TAI = 11:58:55.816 UTC
	// (TAI-UTC = 32 s in 2000, IERS Bulletin C).
	j := FromJDTT(J2000, 0)
	if got := j.FormatUTC(); got != "2000-01-01T11:58:55.816Z" {
		t.Errorf("FromJDTT(J2000) = %s, want 2000-01-01T11:58:55.816Z", got)
	}
	if got := j.SinceJ2000TT(); math.Abs(got) > 1e-12 {
		t.Errorf("FromJDTT(J2000).SinceJ2000TT() = %g, want 0", got)
	}
}

// TestLeapTableUpdates exercises AddLeapSecond, SetValidUntil,
// ReadLeapSecondsList and the warning. Not parallel: it swaps the global
// table.
func TestLeapTableUpdates(t *testing.T) {
	defer resetBuiltin()
	future := MustParseUTC("2030-01-01T00:00:00Z")
	w := future.LeapWarning()
	if w == nil {
		t.Fatal("no warning for 2030")
	}
	for _, s := range []string{"2026-06-28", "ReadLeapSecondsList", "AddLeapSecond"} {
		if !strings.Contains(w.String(), s) {
			t.Errorf("warning %q lacks %q", w, s)
		}
	}
	if w := MustParseUTC("2025-06-01T00:00:00Z").LeapWarning(); w != nil {
		t.Errorf("warning %v for 2025", w)
	}
	if w := MustParseUTC("1972-01-01T00:00:00Z").Add(-1).LeapWarning(); w == nil || !w.Before1972 {
		t.Errorf("warning for 1971 = %v, want Before1972", w)
	}

	// A hypothetical leap second at the end of 2027 (test data, not a
	// prediction).
	jan28 := time.Date(2028, 1, 1, 0, 0, 0, 0, time.UTC)
	if err := AddLeapSecond(jan28, 38, time.Date(2030, 6, 28, 0, 0, 0, 0, time.UTC)); err != nil {
		t.Fatal(err)
	}
	if w := future.LeapWarning(); w != nil {
		t.Errorf("warning after the update: %v", w)
	}
	e := MustParseUTC("2027-12-31T23:59:60.5Z")
	if got := MustParseUTC("2028-01-01T00:00:00Z").Sub(e); got != 0.5 {
		t.Errorf("after AddLeapSecond, 23:59:60.5 is %g s before midnight, want 0.5", got)
	}
	bad := []struct {
		start time.Time
		dat   int
		until time.Time
	}{
		{jan28, 39, jan28}, // not after the last
		{jan28.AddDate(1, 0, 0), 40, jan28.AddDate(2, 0, 0)}, // jump of 2 s
		{jan28.AddDate(1, 0, 0).Add(time.Hour), 39, jan28.AddDate(2, 0, 0)},
		{jan28.AddDate(1, 0, 0), 39, jan28}, // valid-until before it
	}
	for _, b := range bad {
		if err := AddLeapSecond(b.start, b.dat, b.until); !errors.Is(err, ErrLeapTable) {
			t.Errorf("AddLeapSecond(%v, %d) error = %v, want ErrLeapTable", b.start, b.dat, err)
		}
	}
	if err := SetValidUntil(time.Date(2020, 1, 1, 0, 0, 0, 0, time.UTC)); !errors.Is(err, ErrLeapTable) {
		t.Errorf("SetValidUntil before last entry: error = %v", err)
	}

	// leap-seconds.list in the IERS layout; NTP seconds computed here from
	// the calendar, offsets from IERS Bulletin C.
	ntp := func(y, m int) int64 {
		return time.Date(y, time.Month(m), 1, 0, 0, 0, 0, time.UTC).Unix() + 2208988800
	}
	var sb strings.Builder
	sb.WriteString("#\tleap-seconds.list (test excerpt)\n#$\t 3913697179\n")
	fmt.Fprintf(&sb, "#@\t%d\n", ntp(2027, 1)-86400*4)
	for i, b := range builtinLeaps {
		fmt.Fprintf(&sb, "%d\t%d\t# entry %d\n", ntp(b.y, b.m), b.dat, i)
	}
	if err := ReadLeapSecondsList(strings.NewReader(sb.String())); err != nil {
		t.Fatal(err)
	}
	if got, want := ValidUntil(), time.Date(2026, 12, 28, 0, 0, 0, 0, time.UTC); !got.Equal(want) {
		t.Errorf("ValidUntil() = %v, want %v", got, want)
	}
	if n := len(LeapSeconds()); n != 28 {
		t.Errorf("table has %d entries, want 28", n)
	}
	if err := ReadLeapSecondsList(strings.NewReader("2272060800 10\n")); !errors.Is(err, ErrLeapTable) {
		t.Errorf("list without expiry: error = %v", err)
	}
	if err := ReadLeapSecondsList(strings.NewReader("#@ 3960057600\n2272060800 ten\n")); !errors.Is(err, ErrLeapTable) {
		t.Errorf("malformed list: error = %v", err)
	}
}

func TestCheckDUT1(t *testing.T) {
	for _, tt := range []struct {
		d  float64
		ok bool
	}{{0, true}, {0.9, true}, {-0.35, true}, {0.95, false}, {math.NaN(), false}, {math.Inf(1), false}} {
		if err := CheckDUT1(tt.d); (err == nil) != tt.ok || (err != nil && !errors.Is(err, ErrDUT1)) {
			t.Errorf("CheckDUT1(%g) = %v", tt.d, err)
		}
	}
}

func FuzzParseUTC(f *testing.F) {
	for _, s := range []string{"2024-03-01T12:00:00Z", "1990-12-31T15:59:60-08:00", "2016-12-31T23:59:60.999999999Z",
		"2024-03-01T06:59:59.9995-05:00", "1971-12-31T23:59:59.999Z", "x"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		e, err := ParseUTC(s)
		if err != nil {
			return
		}
		out := e.FormatUTC()
		e2, err := ParseUTC(out)
		if err != nil {
			t.Fatalf("ParseUTC(FormatUTC(ParseUTC(%q)) = %q): %v", s, out, err)
		}
		if d := math.Abs(e2.Sub(e)); d > 0.0005+1e-9 {
			t.Fatalf("round trip of %q moved %g s", s, d)
		}
	})
}

func BenchmarkParseUTC(b *testing.B) {
	for b.Loop() {
		_, _ = ParseUTC("2024-03-01T12:00:00.250Z")
	}
}

func BenchmarkFormatUTC(b *testing.B) {
	e := MustParseUTC("2024-03-01T12:00:00.250Z")
	for b.Loop() {
		_ = e.FormatUTC()
	}
}

func BenchmarkJDTT(b *testing.B) {
	e := MustParseUTC("2024-03-01T12:00:00.250Z")
	var s float64
	for b.Loop() {
		j1, j2 := e.JDTT()
		s += j1 + j2
	}
	_ = s
}
