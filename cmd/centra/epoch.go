package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
	"sync"
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
	e := nowEpoch()
	if c.IsSet(name) {
		var err error
		if e, err = parseEpoch(name, c.String(name)); err != nil {
			return e, err
		}
	}
	warnLeap(c, e)
	return e, nil
}

var (
	leapMu      sync.Mutex
	leapPending string
	leapShown   bool // once per process: a mission runs many commands
)

// warnLeap notes, for the end of a successful run, that an epoch lies
// beyond the date the leap-second table is known to be complete.
func warnLeap(c *cli.Context, e epoch) {
	if e.LeapWarning() == nil || lookupBool(c, "quiet") {
		return
	}
	leapMu.Lock()
	defer leapMu.Unlock()
	if leapPending == "" && !leapShown {
		leapPending = fmt.Sprintf("centra: warning: epoch %s is after %s, the date centra's leap-second table is known complete; UTC may be off by whole seconds if a leap second was announced since (IERS Bulletin C); give --leap-seconds FILE with a current IERS leap-seconds.list\n",
			e.FormatUTC(), timescale.ValidUntil().Format("2006-01-02"))
	}
}

// flushLeapWarning prints the pending leap-second warning once.
func flushLeapWarning(w io.Writer) {
	leapMu.Lock()
	defer leapMu.Unlock()
	if leapPending != "" {
		io.WriteString(w, leapPending)
		leapPending, leapShown = "", true
	}
}

// loadLeapSeconds reads --leap-seconds FILE (the IERS leap-seconds.list
// format) into the time-scale table.
func loadLeapSeconds(c *cli.Context) error {
	path := lookupString(c, "leap-seconds")
	if path == "" {
		return nil
	}
	f, err := os.Open(path)
	if err != nil {
		return inputErrorf("give the path of an IERS leap-seconds.list", "--leap-seconds %q cannot be read: %v", path, unwrapPathError(err))
	}
	defer f.Close()
	if err := timescale.ReadLeapSecondsList(f); err != nil {
		return inputErrorf("give an unmodified IERS leap-seconds.list", "--leap-seconds %q: %v", path, strings.TrimPrefix(err.Error(), "timescale: "))
	}
	return nil
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
