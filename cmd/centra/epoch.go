package main

import (
	"errors"
	"time"

	"github.com/urfave/cli/v2"

	"centra/bodies/timescale"
)

// epoch is an instant; inside it is TAI seconds (two-part), outside UTC.
type epoch = timescale.Epoch

// nowEpoch is the default epoch: the current UTC minute. Tests replace it.
var nowEpoch = func() epoch {
	e, err := timescale.FromUTC(time.Now().UTC().Truncate(time.Minute))
	if err != nil {
		panic("centra: the system clock is before 1972")
	}
	return e
}

// latestEpoch bounds epochs to the span the Earth-orientation and Sun and
// Moon series are meant for.
var latestEpoch = timescale.MustParseUTC("2200-01-01T00:00:00Z")

// parseEpochFlag reads an RFC 3339 UTC time from flag name.
func parseEpochFlag(c *cli.Context, name string) (epoch, error) {
	if !c.IsSet(name) {
		return nowEpoch(), nil
	}
	return parseEpoch(name, c.String(name))
}

func parseEpoch(name, s string) (epoch, error) {
	e, err := timescale.ParseUTC(s)
	if err != nil {
		if errors.Is(err, timescale.ErrBeforeLeapTable) {
			return epoch{}, inputErrorf("give an epoch on or after 1972-01-01T00:00:00Z (UTC with leap seconds starts then)", "--%s %s is before 1972", name, s)
		}
		if errors.Is(err, timescale.ErrNotLeapSecond) {
			return epoch{}, inputErrorf("second 60 exists only at 23:59:60 UTC at the end of a day with a leap second", "--%s %q has no leap second", name, s)
		}
		return epoch{}, inputErrorf("write an RFC 3339 UTC time such as 2027-03-21T06:00:00Z", "--%s %q is not a valid time", name, s)
	}
	if e.Sub(latestEpoch) >= 0 {
		return epoch{}, inputErrorf("give an epoch before 2200", "--%s %s is beyond the supported range", name, s)
	}
	return e, nil
}

func formatEpoch(t epoch) string { return t.FormatUTC() }
