package timescale_test

import (
	"fmt"

	"centra/bodies/timescale"
)

func ExampleParseUTC() {
	e, err := timescale.ParseUTC("2024-03-01T13:30:00.25+01:30")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(e.FormatUTC())
	jd1, jd2 := e.JDTT()
	fmt.Printf("JD(TT) = %.1f + %.9f\n", jd1, jd2)
	// Output:
	// 2024-03-01T12:00:00.250Z
	// JD(TT) = 2460371.0 + 0.000803634
}

func ExampleEpoch_Add() {
	// The last minute of 2016 had 61 seconds.
	e := timescale.MustParseUTC("2016-12-31T23:59:59.5Z")
	for _, s := range []float64{0, 0.5, 1.5} {
		fmt.Println(e.Add(s).FormatUTC())
	}
	fmt.Println(timescale.MustParseUTC("2017-01-01T00:00:00Z").Sub(timescale.MustParseUTC("2016-12-31T23:59:00Z")), "s")
	// Output:
	// 2016-12-31T23:59:59.500Z
	// 2016-12-31T23:59:60.000Z
	// 2017-01-01T00:00:00.000Z
	// 61 s
}

func ExampleEpoch_LeapWarning() {
	e := timescale.MustParseUTC("2031-01-01T00:00:00Z")
	if w := e.LeapWarning(); w != nil {
		fmt.Println("valid until", w.ValidUntil.Format("2006-01-02"))
	}
	_, err := timescale.ParseUTC("1969-07-20T20:17:40Z")
	fmt.Println(err)
	// Output:
	// valid until 2026-06-28
	// timescale: 1969-07-20T20:17:40Z is before 1972-01-01T00:00:00Z, where the leap-second table starts (earlier UTC had no whole-second offset from TAI); give an epoch on or after 1972-01-01T00:00:00Z
}
