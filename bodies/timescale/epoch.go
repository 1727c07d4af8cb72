package timescale

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"time"
)

// Time-scale constants.
const (
	// TTMinusTAI is TT-TAI in seconds, exact by definition (IAU 1991
	// Resolution A4; IERS Conventions 2010, section 10.1).
	TTMinusTAI = 32.184
	// J2000 is the Julian date 2451545.0 (2000-01-01T12:00:00 of the
	// scale in question).
	J2000 = 2451545.0
	// SecondsPerDay is the length of a day of 86400 SI seconds.
	SecondsPerDay = 86400.0
	// DaysPerCentury is the Julian century, 36525 days.
	DaysPerCentury = 36525.0
	// MaxDUT1 is the bound IERS keeps |UT1-UTC| below, 0.9 s (ITU-R
	// Recommendation TF.460-6).
	MaxDUT1 = 0.9
)

// Sentinel errors.
var (
	// ErrBeforeLeapTable: a UTC time before 1972-01-01T00:00:00Z.
	ErrBeforeLeapTable = errors.New("timescale: UTC before 1972-01-01 (start of the leap-second table)")
	// ErrSyntax: a time string that is not RFC 3339.
	ErrSyntax = errors.New("timescale: not an RFC 3339 time")
	// ErrNotLeapSecond: second 60 on a minute that has no leap second.
	ErrNotLeapSecond = errors.New("timescale: second 60 where the leap-second table has no leap second")
	// ErrDUT1: DUT1 not finite or not within +-0.9 s.
	ErrDUT1 = errors.New("timescale: DUT1 out of range")
)

// BeforeLeapTableError reports a UTC time before the leap-second table.
type BeforeLeapTableError struct {
	UTC time.Time // the refused time, in UTC
}

func (e *BeforeLeapTableError) Error() string {
	return fmt.Sprintf("timescale: %s is before 1972-01-01T00:00:00Z, where the leap-second table starts "+
		"(earlier UTC had no whole-second offset from TAI); give an epoch on or after 1972-01-01T00:00:00Z",
		e.UTC.Format(time.RFC3339Nano))
}

// Unwrap returns [ErrBeforeLeapTable].
func (e *BeforeLeapTableError) Unwrap() error { return ErrBeforeLeapTable }

// ParseError reports a time string that could not be used.
type ParseError struct {
	Input string // the string given
	Err   error  // ErrSyntax, ErrNotLeapSecond or ErrBeforeLeapTable (possibly wrapped)
	Why   string // detail, may be empty
}

func (e *ParseError) Error() string {
	msg := fmt.Sprintf("timescale: parsing time %q", e.Input)
	switch {
	case errors.Is(e.Err, ErrBeforeLeapTable):
		return e.Err.Error()
	case errors.Is(e.Err, ErrNotLeapSecond):
		return msg + ": " + e.Why + "; second 60 exists only at 23:59:60 UTC on a day that ends with a leap second"
	}
	if e.Why != "" {
		msg += ": " + e.Why
	}
	return msg + "; write an RFC 3339 time such as 2024-03-01T12:00:00Z or 2024-03-01T13:00:00.5+01:00"
}

// Unwrap returns the sentinel behind the error.
func (e *ParseError) Unwrap() error { return e.Err }

// CheckDUT1 returns an error wrapping [ErrDUT1] unless dut1 (UT1-UTC in
// seconds) is finite and |dut1| <= [MaxDUT1].
func CheckDUT1(dut1 float64) error {
	if math.IsNaN(dut1) || math.Abs(dut1) > MaxDUT1 {
		return fmt.Errorf("%w: %g s; UT1-UTC is kept within +-0.9 s, see IERS Bulletin A", ErrDUT1, dut1)
	}
	return nil
}

// Epoch is an instant, stored as whole TAI seconds since
// 2000-01-01T12:00:00 TAI plus a fraction of a second in [0, 1). The zero
// value is 2000-01-01T12:00:00 TAI. Compare epochs with [Epoch.Sub] or
// [Epoch.Compare]; == works too, since the representation is canonical.
type Epoch struct {
	sec  int64
	frac float64
}

// FromTAISeconds returns the epoch s seconds (may be negative or
// fractional) after 2000-01-01T12:00:00 TAI.
func FromTAISeconds(s float64) Epoch { return Epoch{}.Add(s) }

// FromJDTT returns the epoch of the two-part Julian date of TT jd1+jd2.
// The resolution is that of jd1-J2000 and jd2 in days (about 20 us for a
// one-part JD, much better when jd1 carries the whole days).
func FromJDTT(jd1, jd2 float64) Epoch {
	d1 := jd1 - J2000
	w := math.Floor(d1)
	e := Epoch{sec: int64(w) * 86400}
	return e.Add((d1-w)*SecondsPerDay + jd2*SecondsPerDay - TTMinusTAI)
}

// Add returns e + s seconds. s must be finite (it panics otherwise: a
// non-finite duration is a caller bug).
func (e Epoch) Add(s float64) Epoch {
	if math.IsNaN(s) || math.IsInf(s, 0) {
		panic("timescale: Epoch.Add of a non-finite duration")
	}
	w := math.Floor(s)
	f := e.frac + (s - w)
	e.sec += int64(w)
	if f >= 1 {
		f--
		e.sec++
	}
	if f < 0 { // rounding of s-w can give -0 or a tiny negative
		f = 0
	}
	e.frac = f
	return e
}

// AddSeconds returns e + whole + frac seconds without rounding whole to a
// float64; frac may be any finite value.
func (e Epoch) AddSeconds(whole int64, frac float64) Epoch {
	e.sec += whole
	return e.Add(frac)
}

// Sub returns e - o in seconds.
func (e Epoch) Sub(o Epoch) float64 { return float64(e.sec-o.sec) + (e.frac - o.frac) }

// Compare returns -1, 0 or +1 as e is before, equal to or after o.
func (e Epoch) Compare(o Epoch) int {
	switch {
	case e.sec < o.sec || (e.sec == o.sec && e.frac < o.frac):
		return -1
	case e == o:
		return 0
	}
	return 1
}

// TAISeconds returns the epoch as whole TAI seconds since
// 2000-01-01T12:00:00 TAI and the fraction in [0, 1).
func (e Epoch) TAISeconds() (whole int64, frac float64) { return e.sec, e.frac }

// SinceJ2000TT returns TT seconds since J2000.0 (2000-01-01T12:00:00 TT)
// as one float64 (resolution about 0.1 us over a century).
func (e Epoch) SinceJ2000TT() float64 { return float64(e.sec) + (e.frac + TTMinusTAI) }

// jd splits sec+frac+extra (extra in seconds, |extra| < a day) into a
// two-part JD.
func (e Epoch) jd(extra float64) (float64, float64) {
	d := e.sec / 86400
	r := e.sec % 86400
	if r < 0 {
		r += 86400
		d--
	}
	return J2000 + float64(d), (float64(r) + e.frac + extra) / SecondsPerDay
}

// JDTAI returns the two-part Julian date of TAI.
func (e Epoch) JDTAI() (jd1, jd2 float64) { return e.jd(0) }

// JDTT returns the two-part Julian date of TT.
func (e Epoch) JDTT() (jd1, jd2 float64) { return e.jd(TTMinusTAI) }

// JDTDB returns the two-part Julian date of TDB, with TDB-TT from
// [TDBMinusTT] (about 10 us).
func (e Epoch) JDTDB() (jd1, jd2 float64) {
	j1, j2 := e.jd(TTMinusTAI)
	t := ((j1 - J2000) + j2) / DaysPerCentury
	return j1, j2 + TDBMinusTT(t)/SecondsPerDay
}

// TDBMinusTT returns TDB-TT in seconds at t Julian centuries of TT from
// J2000.0: the seven leading terms of Fairhead & Bretagnon (1990) as
// given by Kaplan, USNO Circular 179 (2005), eq. 2.6 (error about 10 us;
// the periodic terms depending on the observer's place, < 2 us, are
// left out).
func TDBMinusTT(t float64) float64 {
	return 0.001657*math.Sin(628.3076*t+6.2401) +
		0.000022*math.Sin(575.3385*t+4.2970) +
		0.000014*math.Sin(1256.6152*t+6.1969) +
		0.000005*math.Sin(606.9777*t+4.0212) +
		0.000005*math.Sin(52.9691*t+0.4444) +
		0.000002*math.Sin(21.3299*t+5.5431) +
		0.000010*t*math.Sin(628.3076*t+4.2490)
}

// taiMinusUTC returns TAI-UTC at e (the offset before the leap second
// during one; the first entry, 10 s, before 1972) and the leap flag.
func (e Epoch) taiMinusUTC() (dat int64, leap bool) {
	t := current.Load()
	i, leap := t.lookupTAI(e.sec)
	if i < 0 {
		i = 0
	}
	return t.entries[i].dat, leap
}

// JDUTC returns the two-part quasi Julian date of UTC: TAI minus the
// TAI-UTC in force (during a leap second, the offset before it, so the
// date runs past the end of the day as ERFA's quasi-JD does).
func (e Epoch) JDUTC() (jd1, jd2 float64) {
	dat, _ := e.taiMinusUTC()
	return e.jd(-float64(dat))
}

// JDUT1 returns the two-part Julian date of UT1 = UTC + dut1 (seconds).
func (e Epoch) JDUT1(dut1 float64) (jd1, jd2 float64) {
	dat, _ := e.taiMinusUTC()
	return e.jd(dut1 - float64(dat))
}

// IsLeapSecond reports whether e falls inside a leap second (UTC
// 23:59:60).
func (e Epoch) IsLeapSecond() bool {
	_, leap := e.taiMinusUTC()
	return leap
}

// utcParts returns the POSIX second of the UTC second that contains e
// (for a leap second, that of 23:59:59 of its day) and the leap flag.
func (e Epoch) utcParts() (unix int64, leap bool) {
	dat, leap := e.taiMinusUTC()
	u := e.sec + j2000Unix - dat
	if leap {
		u--
	}
	return u, leap
}

// UTC returns e as a time.Time in UTC, rounded to the nearest
// nanosecond. During a leap second it returns 23:59:59 plus the fraction
// (time.Time has no second 60); see [Epoch.IsLeapSecond]. Before 1972
// TAI-UTC = 10 s is used.
func (e Epoch) UTC() time.Time {
	ns := math.Round(e.frac * 1e9)
	if ns >= 1e9 {
		e.sec++
		ns = 0
	}
	u, _ := e.utcParts()
	return time.Unix(u, int64(ns)).UTC()
}

// FormatUTC formats e as RFC 3339 UTC with milliseconds and "Z", for
// example "2024-03-01T12:00:00.250Z", rounded to the nearest millisecond;
// a leap second prints as 23:59:60.xxx.
func (e Epoch) FormatUTC() string {
	ms := int64(math.Round(e.frac * 1000))
	if ms >= 1000 {
		e.sec++
		ms -= 1000
	}
	u, leap := e.utcParts()
	t := time.Unix(u, 0).UTC()
	s := t.Second()
	if leap {
		s = 60
	}
	y, mo, d := t.Date()
	return fmt.Sprintf("%04d-%02d-%02dT%02d:%02d:%02d.%03dZ", y, int(mo), d, t.Hour(), t.Minute(), s, ms)
}

// String returns [Epoch.FormatUTC].
func (e Epoch) String() string { return e.FormatUTC() }

// FromUTC returns the epoch of the UTC instant t (any location; the
// instant is what counts). It returns an error wrapping
// [ErrBeforeLeapTable] before 1972-01-01T00:00:00Z.
func FromUTC(t time.Time) (Epoch, error) {
	tab := current.Load()
	u := t.Unix()
	i := tab.lookupUTC(u)
	if i < 0 {
		return Epoch{}, &BeforeLeapTableError{UTC: t.UTC()}
	}
	return Epoch{sec: u + tab.entries[i].dat - j2000Unix, frac: float64(t.Nanosecond()) * 1e-9}, nil
}

// MustFromUTC is [FromUTC] for times known to be valid (tests, examples,
// constants); it panics on error.
func MustFromUTC(t time.Time) Epoch {
	e, err := FromUTC(t)
	if err != nil {
		panic(err)
	}
	return e
}

// ParseUTC parses an RFC 3339 time: "2024-03-01T12:00:00Z",
// "2024-03-01T12:00:00.123456789Z", "2024-03-01T13:00:00+01:00". A
// lower-case t or z and a space for T are accepted; an offset is
// required. Second 60 is accepted at a leap second (in UTC, 23:59:60 of a
// day after which TAI-UTC increases; with an offset, the local time of
// that second). Fractional seconds beyond nanoseconds are truncated.
// Errors are *ParseError wrapping [ErrSyntax], [ErrNotLeapSecond] or
// [ErrBeforeLeapTable].
func ParseUTC(s string) (Epoch, error) {
	in := s
	s = strings.TrimSpace(s)
	if len(s) > 10 && (s[10] == 't' || s[10] == ' ') {
		s = s[:10] + "T" + s[11:]
	}
	if n := len(s); n > 0 && s[n-1] == 'z' {
		s = s[:n-1] + "Z"
	}
	if len(s) < 20 || s[10] != 'T' {
		return Epoch{}, &ParseError{Input: in, Err: ErrSyntax, Why: "want YYYY-MM-DDTHH:MM:SS[.fff] and Z or +hh:mm"}
	}
	leap := s[17:19] == "60"
	if leap {
		s = s[:17] + "59" + s[19:]
	}
	t, err := time.Parse(time.RFC3339Nano, s)
	if err != nil {
		why := err.Error()
		if pe := (*time.ParseError)(nil); errors.As(err, &pe) && pe.Message != "" {
			why = strings.TrimPrefix(pe.Message, ": ")
		} else if strings.Contains(why, "cannot parse") {
			why = "not of the form YYYY-MM-DDTHH:MM:SS[.fff] followed by Z or +hh:mm"
		}
		return Epoch{}, &ParseError{Input: in, Err: ErrSyntax, Why: why}
	}
	e, err := FromUTC(t)
	if err != nil {
		return Epoch{}, &ParseError{Input: in, Err: err}
	}
	if leap {
		// t is hh:mm:59 local; the UTC second must be 23:59:59 of a day
		// followed by a leap second.
		u := t.UTC()
		tab := current.Load()
		next := time.Date(u.Year(), u.Month(), u.Day()+1, 0, 0, 0, 0, time.UTC).Unix()
		i := tab.lookupUTC(next)
		ok := u.Hour() == 23 && u.Minute() == 59 && i > 0 &&
			tab.entries[i].startUnix == next && tab.entries[i].dat == tab.entries[i-1].dat+1
		if !ok {
			return Epoch{}, &ParseError{Input: in, Err: ErrNotLeapSecond,
				Why: fmt.Sprintf("no leap second at the end of %s UTC", u.Format(time.DateOnly))}
		}
		e = e.AddSeconds(1, 0)
	}
	return e, nil
}

// MustParseUTC is [ParseUTC] for literals known to be valid; it panics on
// error.
func MustParseUTC(s string) Epoch {
	e, err := ParseUTC(s)
	if err != nil {
		panic(err)
	}
	return e
}

// LeapWarning says that an epoch lies outside the span where the
// leap-second table is known to be right, so its UTC may be off by whole
// seconds. It is advice, not an error: the conversion was still made.
type LeapWarning struct {
	UTC        time.Time // the epoch's UTC (with the last known TAI-UTC)
	ValidUntil time.Time // the date through which the table is known complete
	Before1972 bool      // true for an epoch before the table starts
}

func (w *LeapWarning) String() string {
	if w.Before1972 {
		return fmt.Sprintf("timescale: %s is before 1972-01-01, where the leap-second table starts; its UTC uses TAI-UTC = 10 s and is not historical UTC",
			w.UTC.Format(time.RFC3339))
	}
	return fmt.Sprintf("timescale: %s is after %s, the date the leap-second table is known valid until; "+
		"UTC assumes no leap second since then and may be off by whole seconds; to update, load a newer IERS "+
		"leap-seconds.list (timescale.ReadLeapSecondsList) or add the leap seconds of the latest IERS Bulletin C "+
		"(timescale.AddLeapSecond, timescale.SetValidUntil)",
		w.UTC.Format(time.RFC3339), w.ValidUntil.Format(time.DateOnly))
}

// LeapWarning returns nil if e lies between 1972-01-01 and the table's
// validity date, otherwise a warning to show the user.
func (e Epoch) LeapWarning() *LeapWarning {
	tab := current.Load()
	u, _ := e.utcParts()
	switch {
	case u < tab.entries[0].startUnix:
		return &LeapWarning{UTC: time.Unix(u, 0).UTC(), ValidUntil: tab.validUntil, Before1972: true}
	case u > tab.validUntil.Unix():
		return &LeapWarning{UTC: time.Unix(u, 0).UTC(), ValidUntil: tab.validUntil}
	}
	return nil
}
