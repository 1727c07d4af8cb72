// Package timescale converts between the time scales that orbit planning
// needs: UTC, TAI, TT, UT1 and TDB, and holds the precise internal epoch
// type [Epoch].
//
// The common calls are
//
//	e, err := timescale.ParseUTC("2024-03-01T12:00:00.250Z")
//	jd1, jd2 := e.JDTT()          // two-part Julian date of TT
//	later := e.Add(90 * 60)       // 90 minutes later (SI seconds)
//	fmt.Println(later.FormatUTC()) // 2024-03-01T13:30:00.250Z
//	if w := later.LeapWarning(); w != nil { /* tell the user */ }
//
// # Units
//
// Durations are SI seconds (float64). Julian dates are days, returned as
// two parts (jd1, jd2) whose sum is the date; jd1 is a whole number of days
// plus 0.5 or 0 and jd2 carries the fraction, so no precision is lost
// (ERFA's two-part convention). DUT1 = UT1 - UTC is in seconds.
//
// # Frames
//
// Time scales, not space frames:
//   - TAI, International Atomic Time, the scale [Epoch] counts.
//   - TT = TAI + 32.184 s exactly (IAU 1991 Resolution A4; IERS Conventions
//     2010, chapter 10).
//   - UTC = TAI - (TAI-UTC), with TAI-UTC from the leap-second table
//     (whole seconds since 1972-01-01; see [LeapSeconds]).
//   - UT1 = UTC + DUT1; DUT1 is given by the caller (0 unless known; IERS
//     keeps |DUT1| < 0.9 s, see [CheckDUT1]).
//   - TDB = TT + (TDB-TT), with TDB-TT from [TDBMinusTT]: the seven leading
//     terms of the Fairhead & Bretagnon (1990) series as given by Kaplan,
//     USNO Circular 179 (2005), eq. 2.6, accurate to about 10 us (within
//     9.3 us of the full series of ERFA dtdb over 1972-2100, geocentric).
//
// # Conventions
//
// An [Epoch] is whole TAI seconds since 2000-01-01T12:00:00 TAI (an int64)
// plus a fraction in [0, 1) (a float64), so sub-nanosecond resolution
// survives any span of centuries. Epochs are values; methods never modify
// their receiver.
//
// UTC input before 1972-01-01T00:00:00Z is refused with
// [ErrBeforeLeapTable]: before then UTC ran on stretched ("rubber")
// seconds that this package does not model. An epoch reached by
// arithmetic that falls before 1972 is formatted with TAI-UTC = 10 s
// (proleptic) and [Epoch.LeapWarning] reports it.
//
// Leap seconds are handled exactly: "2016-12-31T23:59:60.5Z" parses, and
// [Epoch.FormatUTC] prints 23:59:60 during a leap second. A time.Time
// cannot hold second 60, so [Epoch.UTC] repeats 23:59:59 during a leap
// second (as POSIX clocks do); use [Epoch.IsLeapSecond] to tell them apart.
//
// # Keeping the leap-second table current
//
// The built-in table ends with TAI-UTC = 37 s from 2017-01-01 and is known
// valid until [BuiltinValidUntil] (see the comment there). An epoch after
// the validity date still converts, with the last known offset, but
// [Epoch.LeapWarning] returns a [LeapWarning] saying so. To bring the table
// up to date without a new release, either
//   - load the IERS file leap-seconds.list (published with every IERS
//     Bulletin C) with [ReadLeapSecondsList]; the command-line layer reads
//     it from a path the user names, or
//   - call [AddLeapSecond] for a new leap second announced in Bulletin C,
//     and [SetValidUntil] when a Bulletin C announces that none will be
//     inserted.
//
// The table is shared by the whole process and safe for concurrent use;
// updates replace it atomically.
package timescale
