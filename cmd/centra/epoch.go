package main

import (
	"time"

	"github.com/urfave/cli/v2"
)

// epoch is an instant in UTC.
type epoch = time.Time

// nowEpoch is the default epoch: the current UTC minute. Tests replace it.
var nowEpoch = func() epoch { return time.Now().UTC().Truncate(time.Minute) }

var leapTableStart = time.Date(1972, 1, 1, 0, 0, 0, 0, time.UTC)

// parseEpochFlag reads an RFC 3339 UTC time from flag name.
func parseEpochFlag(c *cli.Context, name string) (epoch, error) {
	if !c.IsSet(name) {
		return nowEpoch(), nil
	}
	return parseEpoch(name, c.String(name))
}

func parseEpoch(name, s string) (epoch, error) {
	t, err := time.Parse(time.RFC3339Nano, s)
	if err != nil {
		return epoch{}, inputErrorf("write an RFC 3339 UTC time such as 2027-03-21T06:00:00Z", "--%s %q is not a valid time", name, s)
	}
	t = t.UTC()
	if t.Before(leapTableStart) {
		return epoch{}, inputErrorf("give an epoch from 1972-01-01 on (UTC with leap seconds starts then)", "--%s %s is before 1972", name, s)
	}
	if t.Year() > 2200 {
		return epoch{}, inputErrorf("give an epoch before 2200", "--%s %s is beyond the supported range", name, s)
	}
	return t, nil
}

func formatEpoch(t epoch) string { return t.UTC().Format("2006-01-02T15:04:05.000Z") }
