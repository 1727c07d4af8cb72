package main

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/cmd/centra/internal/quantity"
	"centra/reports"
)

func expectFlag() cli.Flag {
	return &cli.StringSliceFlag{Name: "expect", Usage: "assert `NAME=VALUE±TOL` on a result key (also +-, units, or a relative tolerance like ±0.5%); exit 1 when one fails; repeatable"}
}

// expectation is one parsed --expect.
type expectation struct {
	Text  string
	Key   string
	Tol   quantity.Tolerance
	scale float64 // from internal units to the key's unit
}

// keyKind says how a value for key is read: its kind and the factor
// from the parser's internal unit to the unit in the key's suffix.
func keyKind(key string) (quantity.Kind, float64) {
	switch {
	case strings.HasSuffix(key, "_km_s"):
		return quantity.Speed, 1
	case strings.HasSuffix(key, "_deg_day"):
		return quantity.AngleRate, 1
	case strings.HasSuffix(key, "_km2_s2"), strings.HasSuffix(key, "_km2_s"), strings.HasSuffix(key, "_km3_s2"), strings.HasSuffix(key, "_rad_s"):
		return quantity.Scalar, 1
	case strings.HasSuffix(key, "_km"):
		return quantity.Length, 1
	case strings.HasSuffix(key, "_m"):
		return quantity.Length, 1000
	case strings.HasSuffix(key, "_deg"):
		return quantity.Angle, 180 / math.Pi
	case strings.HasSuffix(key, "_days"):
		return quantity.Duration, 1.0 / 86400
	case strings.HasSuffix(key, "_s"):
		return quantity.Duration, 1
	case strings.HasSuffix(key, "_kg"):
		return quantity.Mass, 1
	}
	return quantity.Scalar, 1
}

// bareUnit is the unit a bare number takes for key when it differs from
// the parser's default for the key's kind (days for _days, metres for _m).
func bareUnit(key string) string {
	switch {
	case strings.HasSuffix(key, "_days"):
		return "d"
	case strings.HasSuffix(key, "_m"):
		return "m"
	}
	return ""
}

// withBareUnit appends unit to the value and tolerance of VALUE±TOL when
// they are bare numbers.
func withBareUnit(val, unit string) string {
	if unit == "" {
		return val
	}
	sep := "±"
	if !strings.Contains(val, sep) {
		sep = "+-"
	}
	v, t, ok := strings.Cut(val, sep)
	if !ok {
		return val
	}
	bare := func(x string) string {
		x = strings.TrimSpace(x)
		if _, err := strconv.ParseFloat(x, 64); err == nil {
			return x + unit
		}
		return x
	}
	return bare(v) + sep + bare(t)
}

// parseExpectations reads every --expect of the command.
func parseExpectations(c *cli.Context) ([]expectation, error) {
	var out []expectation
	for _, text := range c.StringSlice("expect") {
		key, val, ok := strings.Cut(text, "=")
		key = strings.TrimSpace(key)
		if !ok || key == "" {
			return nil, inputErrorf("write --expect NAME=VALUE±TOL, for example --expect period_s=5554±1", "--expect %q has no NAME=", text)
		}
		kind, scale := keyKind(key)
		tol, err := quantity.ParseTolerance(kind, withBareUnit(val, bareUnit(key)))
		if err != nil {
			var qe *quantity.Error
			hint := "write --expect NAME=VALUE±TOL, for example --expect period_s=92.6min±1s"
			if errors.As(err, &qe) && qe.Hint != "" {
				hint = qe.Hint
			}
			return nil, inputErrorf(hint, "--expect %q: %v", text, errWithoutHint(err))
		}
		out = append(out, expectation{Text: text, Key: key, Tol: tol, scale: scale})
	}
	return out, nil
}

func errWithoutHint(err error) string {
	var qe *quantity.Error
	if errors.As(err, &qe) {
		return fmt.Sprintf("%q is not a valid %s: %v", qe.Input, qe.Kind, qe.Err)
	}
	return err.Error()
}

// checkExpectations evaluates expectations against the numeric fields
// of r. An unknown key is an input error that lists the known ones.
func checkExpectations(exps []expectation, r reports.Record) ([]reports.Record, int, error) {
	var rows []reports.Record
	failed := 0
	for _, e := range exps {
		f, ok := r.Get(e.Key)
		if !ok {
			return nil, 0, inputErrorf("use one of: "+strings.Join(numericKeys(r), ", "), "--expect %q: no result named %q", e.Text, e.Key)
		}
		var got float64
		switch v := f.Value.(type) {
		case float64:
			got = v
		case int:
			got = float64(v)
		case nil:
			got = math.NaN() // undefined for this orbit: the expectation fails
		default:
			return nil, 0, inputErrorf("expectations apply to numbers only", "--expect %q: %q is not a number", e.Text, e.Key)
		}
		want := e.Tol.Value * e.scale
		tol := e.Tol.Tol * e.scale
		if e.Tol.Relative {
			tol = math.Abs(want) * e.Tol.Tol
		}
		pass := !math.IsNaN(got) && math.Abs(got-want) <= tol
		if !pass {
			failed++
		}
		measured := any(got)
		if math.IsNaN(got) {
			measured = nil
		}
		rows = append(rows, reports.Record{
			{Key: "name", Value: e.Key},
			{Key: "expected", Value: want, Digits: 12},
			{Key: "tolerance", Value: tol, Digits: 6},
			{Key: "measured", Value: measured, Digits: 12},
			{Key: "pass", Value: pass},
		})
	}
	return rows, failed, nil
}

func numericKeys(r reports.Record) []string {
	var keys []string
	for _, f := range r {
		switch f.Value.(type) {
		case float64, int, nil:
			keys = append(keys, f.Key)
		}
	}
	sort.Strings(keys)
	return keys
}

// emitWithExpectations writes r, evaluates the expectations, and adds
// the pass/fail table (or the "expectations" list in JSON). It returns an
// expectationError when any fails.
func (o *output) emitWithExpectations(title string, r reports.Record, exps []expectation, extra func() error) error {
	return o.emitCheckedWithExpectations(title, r, r, exps, extra)
}

// emitCheckedWithExpectations is emitWithExpectations where the
// expectations are evaluated against check, a record that may hold more
// keys than the printed r (for example vector components).
func (o *output) emitCheckedWithExpectations(title string, r, check reports.Record, exps []expectation, extra func() error) error {
	rows, failed, err := checkExpectations(exps, check)
	if err != nil {
		return err
	}
	if o.Format == "json" && len(rows) > 0 {
		r = append(r, reports.Field{Key: "expectations", Value: rows})
	}
	if err := o.emit(title, r); err != nil {
		return err
	}
	if extra != nil {
		if err := extra(); err != nil {
			return err
		}
	}
	if len(rows) > 0 {
		switch o.Format {
		case "table":
			fmt.Fprintln(o.W)
			reports.WriteTitle(o.W, "Expectations")
			if err := reports.WriteListTable(o.W, rows); err != nil {
				return err
			}
		case "csv":
			// stdout stays one CSV document; the verdicts go to stderr.
			reports.WriteListTable(o.Stderr, rows)
		}
	}
	if failed > 0 {
		return &expectationError{Failed: failed, Total: len(rows)}
	}
	return nil
}
