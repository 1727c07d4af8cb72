package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"strings"
	"time"
)

// progressBar is a one-line progress display on stderr for long runs,
// redrawn in place with '\r':
//
//	centra: ephemeris  37.5% [#########...............] 0:04 elapsed, about 0:07 left
//
// It draws only when stderr is a terminal (a character device), --quiet
// is not set, the run has already taken more than a second, and, for a
// command that streams its rows while it runs, the rows do not go to that
// same terminal (they go to --out, or stdout is a pipe or a file);
// otherwise every method is a no-op. Clear removes the
// line, so that what follows on stderr starts on a clean line. A nil
// *progressBar is valid and draws nothing.
type progressBar struct {
	w      io.Writer
	on     bool
	label  string
	total  float64 // the amount of work, in the unit of Update's done
	stride int     // read the clock every stride calls of Update (>= 1)
	// Detail, when not nil, gives text for the end of the line (called
	// only when the line is redrawn).
	Detail func() string
	// NoETA drops the time left, for work that may end early (total is
	// then a bound, such as lifetime's --max-span).
	NoETA bool

	now   func() time.Time
	start time.Time
	last  time.Time // last redraw
	calls int
	width int // length of the line on screen; 0 when none is
}

const (
	progressDelay  = time.Second            // no line for runs shorter than this
	progressPeriod = 200 * time.Millisecond // at most five redraws a second
	progressBarLen = 24                     // characters between the brackets
)

// isTerminal reports whether w is a character device (a terminal; also
// /dev/null, where drawing is harmless). Pipes and files are not.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}

// newProgressBar returns the progress display of a run of o that does
// total units of work (seconds of span, cases, ...); streams says that
// the command writes its output while the bar runs (rather than after
// it). It is off unless the conditions of [progressBar] hold.
func newProgressBar(o *output, label string, total float64, streams bool) *progressBar {
	on := o != nil && !o.Quiet && isTerminal(o.Stderr) && (!streams || o.file != nil || !isTerminal(o.W)) &&
		total > 0 && !math.IsInf(total, 0)
	p := &progressBar{on: on, label: label, total: total, stride: 1, now: time.Now}
	if o != nil {
		p.w = o.Stderr
	}
	p.start = p.now()
	return p
}

// Update reports that done of total units are finished.
func (p *progressBar) Update(done float64) {
	if p == nil || !p.on {
		return
	}
	p.calls++
	if p.stride > 1 && p.calls%p.stride != 0 {
		return
	}
	t := p.now()
	if t.Sub(p.start) < progressDelay || t.Sub(p.last) < progressPeriod {
		return
	}
	p.last = t
	p.draw(done, t.Sub(p.start))
}

func (p *progressBar) draw(done float64, elapsed time.Duration) {
	f := done / p.total
	if !(f >= 0) {
		f = 0
	}
	f = math.Min(f, 1)
	n := int(f * progressBarLen)
	line := fmt.Sprintf("centra: %s %5.1f%% [%s%s] %s elapsed", p.label, 100*f, strings.Repeat("#", n), strings.Repeat(".", progressBarLen-n), clock(elapsed))
	if f > 0.01 && f < 1 && !p.NoETA {
		left := time.Duration(float64(elapsed) * (1 - f) / f)
		line += ", about " + clock(left) + " left"
	}
	if p.Detail != nil {
		line += "; " + p.Detail()
	}
	pad := ""
	if len(line) < p.width {
		pad = strings.Repeat(" ", p.width-len(line))
	}
	fmt.Fprint(p.w, "\r"+line+pad)
	p.width = len(line)
}

// Clear removes the line, if one is on screen.
func (p *progressBar) Clear() {
	if p == nil || p.width == 0 {
		return
	}
	fmt.Fprint(p.w, "\r"+strings.Repeat(" ", p.width)+"\r")
	p.width = 0
}

// clock formats d as M:SS, or H:MM:SS from an hour on.
func clock(d time.Duration) string {
	s := int64(d.Round(time.Second) / time.Second)
	if s < 0 {
		s = 0
	}
	if s >= 3600 {
		return fmt.Sprintf("%d:%02d:%02d", s/3600, s/60%60, s%60)
	}
	return fmt.Sprintf("%d:%02d", s/60, s%60)
}
