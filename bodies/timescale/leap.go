package timescale

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"sort"
	"strconv"
	"strings"
	"sync/atomic"
	"time"
)

// LeapSecond is one line of the leap-second table: from the UTC instant
// Start (00:00:00 of a day) on, TAI-UTC is TAIMinusUTC seconds.
type LeapSecond struct {
	Start       time.Time // 00:00:00 UTC of the first day with this offset
	TAIMinusUTC int       // s
}

// builtinLeaps is TAI-UTC since 1972, from the IERS leap-second table
// (IERS Bulletin C; file leap-seconds.list): 10 s on 1972-01-01, one
// second more at each date below, 37 s since 2017-01-01. Checked against
// erfa.dat (ERFA 2.0.0) in testdata/frames/leap_seconds.csv.
var builtinLeaps = [...]struct{ y, m, dat int }{
	{1972, 1, 10}, {1972, 7, 11}, {1973, 1, 12}, {1974, 1, 13}, {1975, 1, 14},
	{1976, 1, 15}, {1977, 1, 16}, {1978, 1, 17}, {1979, 1, 18}, {1980, 1, 19},
	{1981, 7, 20}, {1982, 7, 21}, {1983, 7, 22}, {1985, 7, 23}, {1988, 1, 24},
	{1990, 1, 25}, {1991, 1, 26}, {1992, 7, 27}, {1993, 7, 28}, {1994, 7, 29},
	{1996, 1, 30}, {1997, 7, 31}, {1999, 1, 32}, {2006, 1, 33}, {2009, 1, 34},
	{2012, 7, 35}, {2015, 7, 36}, {2017, 1, 37},
}

// BuiltinValidUntil is the date through which the built-in table is known
// to be complete: 2026-06-28T00:00:00Z, the expiry that the IERS
// leap-seconds.list issued with Bulletin C 70 (July 2025) carries; that
// Bulletin C announced no leap second at the end of December 2025 (from
// memory; a later Bulletin C may extend it: see [SetValidUntil]).
var BuiltinValidUntil = time.Date(2026, 6, 28, 0, 0, 0, 0, time.UTC)

// tableStart is where UTC with whole-second offsets begins.
var tableStart = time.Date(1972, 1, 1, 0, 0, 0, 0, time.UTC)

// j2000Unix is 2000-01-01T12:00:00 as POSIX seconds, the origin of the
// TAI count in Epoch (the TAI instant 2000-01-01T12:00:00 TAI).
const j2000Unix = 946728000

type leapEntry struct {
	startUnix int64 // POSIX seconds of the UTC day start
	dat       int64 // TAI-UTC, s
	startTAI  int64 // Epoch.sec at which this offset starts
}

type leapTable struct {
	entries    []leapEntry
	validUntil time.Time
}

var current atomic.Pointer[leapTable]

func init() {
	ls := make([]LeapSecond, len(builtinLeaps))
	for i, b := range builtinLeaps {
		ls[i] = LeapSecond{time.Date(b.y, time.Month(b.m), 1, 0, 0, 0, 0, time.UTC), b.dat}
	}
	t, err := newTable(ls, BuiltinValidUntil)
	if err != nil {
		panic("timescale: built-in leap table: " + err.Error())
	}
	current.Store(t)
}

// ErrLeapTable is returned for an update that would make the leap-second
// table inconsistent.
var ErrLeapTable = errors.New("timescale: invalid leap-second table update")

// LeapTableError describes a rejected table update.
type LeapTableError struct {
	What string // what is wrong, in words
}

func (e *LeapTableError) Error() string {
	return "timescale: invalid leap-second table update: " + e.What
}

// Unwrap returns [ErrLeapTable].
func (e *LeapTableError) Unwrap() error { return ErrLeapTable }

func newTable(ls []LeapSecond, validUntil time.Time) (*leapTable, error) {
	if len(ls) == 0 {
		return nil, &LeapTableError{"empty table"}
	}
	if !ls[0].Start.Equal(tableStart) || ls[0].TAIMinusUTC != 10 {
		return nil, &LeapTableError{fmt.Sprintf("table must start with TAI-UTC = 10 s on 1972-01-01, not %d s on %s",
			ls[0].TAIMinusUTC, ls[0].Start.UTC().Format(time.DateOnly))}
	}
	t := &leapTable{validUntil: validUntil.UTC()}
	for i, l := range ls {
		s := l.Start.UTC()
		if s.Hour() != 0 || s.Minute() != 0 || s.Second() != 0 || s.Nanosecond() != 0 {
			return nil, &LeapTableError{fmt.Sprintf("offset change at %s is not at 00:00:00 UTC", s.Format(time.RFC3339Nano))}
		}
		if i > 0 {
			p := ls[i-1]
			if !s.After(p.Start) {
				return nil, &LeapTableError{fmt.Sprintf("%s is not after %s", s.Format(time.DateOnly), p.Start.UTC().Format(time.DateOnly))}
			}
			if d := l.TAIMinusUTC - p.TAIMinusUTC; d != 1 && d != -1 {
				return nil, &LeapTableError{fmt.Sprintf("TAI-UTC changes by %d s on %s; a leap second changes it by 1 s", d, s.Format(time.DateOnly))}
			}
		}
		u := s.Unix()
		d := int64(l.TAIMinusUTC)
		t.entries = append(t.entries, leapEntry{startUnix: u, dat: d, startTAI: u + d - j2000Unix})
	}
	if last := ls[len(ls)-1].Start; t.validUntil.Before(last) {
		return nil, &LeapTableError{fmt.Sprintf("valid-until date %s is before the last offset change %s",
			t.validUntil.Format(time.DateOnly), last.UTC().Format(time.DateOnly))}
	}
	return t, nil
}

// LeapSeconds returns a copy of the leap-second table in force.
func LeapSeconds() []LeapSecond {
	t := current.Load()
	out := make([]LeapSecond, len(t.entries))
	for i, e := range t.entries {
		out[i] = LeapSecond{time.Unix(e.startUnix, 0).UTC(), int(e.dat)}
	}
	return out
}

// ValidUntil returns the UTC date through which the table in force is
// known to be complete.
func ValidUntil() time.Time { return current.Load().validUntil }

// AddLeapSecond appends a leap second announced in IERS Bulletin C: from
// start (00:00:00 UTC of the first day after the leap second) TAI-UTC is
// taiMinusUTC seconds, which must differ by one from the last entry.
// validUntil is the new validity date of the table (the date the same
// Bulletin C makes the table good until). It returns an error wrapping
// [ErrLeapTable] and leaves the table unchanged if the update is
// inconsistent.
func AddLeapSecond(start time.Time, taiMinusUTC int, validUntil time.Time) error {
	for {
		old := current.Load()
		ls := LeapSeconds()
		ls = append(ls, LeapSecond{start.UTC(), taiMinusUTC})
		t, err := newTable(ls, validUntil)
		if err != nil {
			return err
		}
		if current.CompareAndSwap(old, t) {
			return nil
		}
	}
}

// SetValidUntil extends (or shortens) the date through which the table is
// known complete, for a Bulletin C that announces no new leap second. It
// must not be before the last offset change.
func SetValidUntil(validUntil time.Time) error {
	for {
		old := current.Load()
		t, err := newTable(LeapSeconds(), validUntil)
		if err != nil {
			return err
		}
		if current.CompareAndSwap(old, t) {
			return nil
		}
	}
}

// ntpUnixOffset is 1900-01-01 to 1970-01-01 in seconds (the NTP epoch
// used by leap-seconds.list).
const ntpUnixOffset = 2208988800

// ReadLeapSecondsList replaces the table with the one in an IERS
// leap-seconds.list file (as distributed with IERS Bulletin C): data
// lines "NTP_SECONDS TAI-UTC [# comment]", the expiry line
// "#@ NTP_SECONDS", other lines starting with '#' ignored. NTP seconds
// count from 1900-01-01T00:00:00. The file's expiry becomes the validity
// date. The table is left unchanged on any error.
func ReadLeapSecondsList(r io.Reader) error {
	var ls []LeapSecond
	var expiry time.Time
	sc := bufio.NewScanner(r)
	line := 0
	for sc.Scan() {
		line++
		s := strings.TrimSpace(sc.Text())
		if s == "" {
			continue
		}
		if strings.HasPrefix(s, "#@") {
			n, err := strconv.ParseInt(strings.TrimSpace(s[2:]), 10, 64)
			if err != nil {
				return &LeapTableError{fmt.Sprintf("line %d: bad expiry %q", line, s)}
			}
			expiry = time.Unix(n-ntpUnixOffset, 0).UTC()
			continue
		}
		if s[0] == '#' {
			continue
		}
		if i := strings.IndexByte(s, '#'); i >= 0 {
			s = s[:i]
		}
		f := strings.Fields(s)
		if len(f) != 2 {
			return &LeapTableError{fmt.Sprintf("line %d: want \"NTP_SECONDS TAI-UTC\", got %q", line, sc.Text())}
		}
		n, err1 := strconv.ParseInt(f[0], 10, 64)
		d, err2 := strconv.Atoi(f[1])
		if err1 != nil || err2 != nil {
			return &LeapTableError{fmt.Sprintf("line %d: want two integers, got %q", line, sc.Text())}
		}
		ls = append(ls, LeapSecond{time.Unix(n-ntpUnixOffset, 0).UTC(), d})
	}
	if err := sc.Err(); err != nil {
		return fmt.Errorf("timescale: reading leap-seconds.list: %w", err)
	}
	if expiry.IsZero() {
		return &LeapTableError{"no expiry line (#@) in leap-seconds.list"}
	}
	sort.SliceStable(ls, func(i, j int) bool { return ls[i].Start.Before(ls[j].Start) })
	t, err := newTable(ls, expiry)
	if err != nil {
		return err
	}
	current.Store(t)
	return nil
}

// resetBuiltin restores the built-in table (tests only).
func resetBuiltin() {
	ls := make([]LeapSecond, len(builtinLeaps))
	for i, b := range builtinLeaps {
		ls[i] = LeapSecond{time.Date(b.y, time.Month(b.m), 1, 0, 0, 0, 0, time.UTC), b.dat}
	}
	t, _ := newTable(ls, BuiltinValidUntil)
	current.Store(t)
}

// lookupTAI returns the table index in force at TAI second sec (-1 before
// the table), and whether sec falls inside the leap second that precedes
// entry index+1.
func (t *leapTable) lookupTAI(sec int64) (i int, leap bool) {
	es := t.entries
	i = sort.Search(len(es), func(k int) bool { return es[k].startTAI > sec }) - 1
	if i >= 0 && i+1 < len(es) {
		n := es[i+1]
		// The leap second occupies [n.startUnix + es[i].dat, n.startTAI) in
		// TAI, i.e. UTC 23:59:60 of the day before n.
		if sec >= n.startUnix+es[i].dat-j2000Unix {
			leap = true
		}
	}
	return i, leap
}

// lookupUTC returns the table index in force at POSIX second u (-1 before
// the table).
func (t *leapTable) lookupUTC(u int64) int {
	es := t.entries
	return sort.Search(len(es), func(k int) bool { return es[k].startUnix > u }) - 1
}

// TAIMinusUTC returns TAI-UTC in seconds in force at the UTC instant t,
// or an error wrapping [ErrBeforeLeapTable] before 1972.
func TAIMinusUTC(t time.Time) (int, error) {
	tab := current.Load()
	i := tab.lookupUTC(t.Unix())
	if i < 0 {
		return 0, &BeforeLeapTableError{UTC: t.UTC()}
	}
	return int(tab.entries[i].dat), nil
}
