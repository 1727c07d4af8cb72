package main

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"runtime"
	"slices"
	"strconv"
	"strings"
	"sync"

	"github.com/urfave/cli/v2"

	"centra/cmd/centra/internal/study"
	"centra/reports"
)

func init() { register(80, sweepCommand) }

func sweepCommand() *cli.Command {
	return &cli.Command{
		Name:      "sweep",
		Usage:     "run a command over a grid or Monte Carlo draws of its flags, one row per case",
		ArgsUsage: "COMMAND [command flags]",
		UsageText: `centra [--format table|csv|json|jsonl] sweep [sweep flags] COMMAND [command flags]

examples:
  centra --format csv sweep --vary inclination=40:60:5 --vary altitude=400:800:100 --outputs period_s,raan_rate_deg_day orbit --eccentricity 0
  centra --format csv sweep --vary altitude=400km:800km:100km --vary model=point,j2 --outputs final_x_km,final_y_km,final_z_km ephemeris --final --inclination 51.6 --span 1d
  centra --format jsonl sweep --draw 'altitude=uniform(400km,600km)' --draw 'raan=uniform(0,360)' --cases 200 --seed 7 --outputs final_radius_km ephemeris --final --inclination 53 --span 1d
  centra --format csv sweep --shard 3/8 --draw 'inclination=normal(97.4,0.05)' --cases 800 --outputs raan_rate_deg_day orbit --altitude 550
  centra --format csv sweep --draw 'burnout-speed=normal(2km/s,0.01km/s)' --cases 100 --outputs apogee_alt_km,impact_lat_deg,impact_lon_deg ballistic --site 57.35,-7.33 --burnout-alt 35 --flight-path-angle 84 --azimuth 290`,
		Description: `Runs COMMAND once per case, on all cores, and prints one row per case in case
order: the case index, the varied values and the chosen --outputs keys of the
command's JSON record (scalars; a vector key gives three _x/_y/_z columns; a
dotted path such as checks.energy.pass reaches into a list of named records).

--vary NAME=FROM:TO:STEP steps the flag --NAME from FROM to TO (included when it
falls on a step); NAME=V1,V2,... lists values (numbers or words such as
model=point,j2). Several --vary make a Cartesian product, the first the outer
loop. --draw NAME=normal(MEAN,SIGMA) or NAME=uniform(LO,HI) draws --cases N
values (per grid point, with --vary). Values carry the flag's units
(altitude=400km:800km:100km, speed=normal(2.1km/s,20m/s) is refused: one unit
per expression); the unit is in the column name (altitude_km).

Case i's draws depend only on --seed and i, and --shard K/N runs the K-th of N
contiguous slices (K = 1..N), so shards run anywhere, in any order, give the
rows of the unsharded run; concatenate their CSV bodies to merge them. With no
--epoch in the command flags the current minute is fixed once for all cases.

A case that fails (an orbit that hits the body, a drawn eccentricity below 0)
gives a row with its message in the error column and a warning at the end; a
case whose --expect fails sets exit code 1. The nominal case (first grid
values, centres of the distributions) is run first: when it fails the sweep
stops with exit 2 before any row. 'ephemeris --final' prints the end state of a
propagation as one record, the usual command to sweep for propagations.`,
		Flags: []cli.Flag{
			&cli.StringSliceFlag{Name: "vary", Usage: "step flag --NAME over `NAME=FROM:TO:STEP` or NAME=V1,V2,...; repeatable (Cartesian product)"},
			&cli.StringSliceFlag{Name: "draw", Usage: "draw flag --NAME from `NAME=normal(MEAN,SIGMA)` or NAME=uniform(LO,HI); repeatable"},
			&cli.StringFlag{Name: "cases", Usage: "number `N` of Monte Carlo draws (per grid point); needs --draw"},
			&cli.StringFlag{Name: "seed", Value: "1", Usage: "`SEED` of the draws, 0..2^64-1; case i's values depend only on SEED and i"},
			&cli.StringFlag{Name: "outputs", Usage: "comma-separated `KEYS` of the command's JSON record to print (default: every scalar key)"},
			&cli.StringFlag{Name: "shard", Usage: "run only slice `K/N` (K = 1..N) of the cases, for job arrays"},
			&cli.StringFlag{Name: "workers", Usage: "cases run at once, `N` (default: the number of cores)"},
		},
		// checkArgs (app.go) allows as many positional arguments as
		// ArgsUsage has words, and runs before the action it wraps; the
		// positional arguments of sweep are a whole command line, so the
		// action is installed here, after that wrapping.
		Before: func(c *cli.Context) error {
			c.Command.Action = sweepAction
			return nil
		},
		Action: sweepAction,
	}
}

// sweepable reports whether a command prints one JSON record per run.
func sweepable(name string) bool {
	switch name {
	case "sweep", "run", "demo", "plot", "help":
		return false
	}
	return true
}

// globalCaseFlags may not appear among the swept command's flags: sweep
// sets them for every case.
var globalCaseFlags = map[string]string{
	"format": "put --format before 'sweep' (centra --format csv sweep ...); the cases always run with JSON",
	"out":    "put --out among the sweep flags (centra sweep --out FILE ... COMMAND ...)",
	"force":  "put --force among the sweep flags",
	"quiet":  "put --quiet before 'sweep'",
	"help":   "run 'centra COMMAND --help' for the command's flags",
	"h":      "run 'centra COMMAND --help' for the command's flags",
}

// flagUnits gives the unit a bare number of a flag is read in, for the
// column names of varied values (the flag parsers' defaults, see
// internal/quantity). Flags not listed get no unit suffix unless the
// expression writes one.
var flagUnits = map[string]string{
	"altitude": "km", "periapsis-alt": "km", "apoapsis-alt": "km", "semi-major-axis": "km",
	"inclination": "deg", "raan": "deg", "arg-periapsis": "deg", "true-anomaly": "deg", "mean-anomaly": "deg",
	"span": "s", "step": "s",
	"burnout-alt": "km", "burnout-speed": "km/s", "flight-path-angle": "deg", "azimuth": "deg",
	"burnout-lat": "deg", "burnout-lon": "deg", "above": "km", "impact-alt": "km",
}

// sweepSpec is a parsed sweep: the plan, the command line of every case
// and the columns to print.
type sweepSpec struct {
	plan    *study.Plan
	command string
	base    []string // argv of every case before the varied flags
	lo, hi  int      // cases of this shard
	shard   study.Shard
	workers int
	columns []string   // varied columns, then output columns
	outputs []outputOf // how to read the output columns
}

// outputOf reads one --outputs key from a case's JSON object.
type outputOf struct {
	key    string
	path   []string // further steps of a dotted key
	vector bool     // a 3-vector: three columns
}

func studyError(flag string, err error) error {
	var se *study.Error
	if errors.As(err, &se) {
		msg := strings.TrimPrefix(se.Err.Error(), "study: ")
		if se.Input == "" || flag == "" {
			// a plan error: the detail alone reads better than the class
			if _, detail, ok := strings.Cut(msg, ": "); ok {
				msg = detail
			}
			return inputErrorf(se.Hint, "%s", msg)
		}
		return inputErrorf(se.Hint, "--%s %q: %s", flag, se.Input, msg)
	}
	return inputErrorf("run 'centra sweep --help'", "--%s: %v", flag, err)
}

func parseSweep(c *cli.Context) (*sweepSpec, error) {
	args := c.Args().Slice()
	if len(args) == 0 {
		return nil, inputErrorf("name the command to run per case, e.g. centra sweep --vary altitude=400:800:100 orbit --inclination 51.6", "sweep needs a COMMAND")
	}
	sp := &sweepSpec{command: args[0]}
	cmdArgs := args[1:]
	known := commandFlags(sp.command)
	if known == nil || !sweepable(sp.command) {
		return nil, inputErrorf("sweep one of: "+strings.Join(sweepableCommands(), ", "), "%q is not a command that sweep can run", sp.command)
	}

	// The command's own flags: none of the global ones, each known.
	given := map[string]bool{}
	for _, a := range cmdArgs {
		if a == "--" {
			break
		}
		if !strings.HasPrefix(a, "-") || len(a) < 2 || a[1] >= '0' && a[1] <= '9' || a[1] == '.' {
			continue
		}
		name, _, _ := strings.Cut(strings.TrimLeft(a, "-"), "=")
		if fix, bad := globalCaseFlags[name]; bad {
			return nil, inputErrorf(fix, "--%s cannot be given to the swept command", name)
		}
		given[name] = true
	}

	parse := func(flag string, each func(string) error) error {
		for _, s := range c.StringSlice(flag) {
			if err := each(s); err != nil {
				return err
			}
		}
		return nil
	}
	checkName := func(flag, name string) error {
		if !known[name] {
			return inputErrorf("vary one of the flags of 'centra "+sp.command+" --help'", "--%s: %s has no flag --%s", flag, sp.command, name)
		}
		if globalCaseFlags[name] != "" || name == "bodies" {
			return inputErrorf("vary a flag of the command", "--%s: --%s cannot be varied", flag, name)
		}
		if given[name] {
			return inputErrorf("drop --"+name+" from the command flags or stop varying it", "--%s is both varied and given to %s", name, sp.command)
		}
		return nil
	}
	var vary []study.Vary
	var draw []study.Draw
	if err := parse("vary", func(s string) error {
		v, err := study.ParseVary(s)
		if err != nil {
			return studyError("vary", err)
		}
		if err := checkName("vary", v.Name); err != nil {
			return err
		}
		vary = append(vary, v)
		return nil
	}); err != nil {
		return nil, err
	}
	if err := parse("draw", func(s string) error {
		d, err := study.ParseDraw(s)
		if err != nil {
			return studyError("draw", err)
		}
		if err := checkName("draw", d.Name); err != nil {
			return err
		}
		draw = append(draw, d)
		return nil
	}); err != nil {
		return nil, err
	}
	cases := 0
	if c.IsSet("cases") {
		n, err := strconv.Atoi(strings.TrimSpace(c.String("cases")))
		if err != nil || n < 1 || n > study.MaxCases {
			return nil, inputErrorf(fmt.Sprintf("give a whole number of cases from 1 to %d", study.MaxCases), "--cases %q is not a number of cases", c.String("cases"))
		}
		cases = n
	}
	seed, err := strconv.ParseUint(strings.TrimSpace(c.String("seed")), 10, 64)
	if err != nil {
		return nil, inputErrorf("give a whole number from 0 to 18446744073709551615", "--seed %q is not a seed", c.String("seed"))
	}
	sp.plan, err = study.NewPlan(vary, draw, cases, seed)
	if err != nil {
		return nil, studyError("", err)
	}
	if c.IsSet("shard") {
		if sp.shard, err = study.ParseShard(c.String("shard")); err != nil {
			return nil, studyError("shard", err)
		}
	}
	sp.lo, sp.hi = sp.shard.Range(sp.plan.Len())
	sp.workers = runtime.GOMAXPROCS(0)
	if c.IsSet("workers") {
		n, err := strconv.Atoi(strings.TrimSpace(c.String("workers")))
		if err != nil || n < 1 || n > 4096 {
			return nil, inputErrorf("give a whole number of workers from 1 to 4096", "--workers %q is not usable", c.String("workers"))
		}
		sp.workers = n
	}

	// Every case: JSON, no warnings, the sweep's bodies file, the
	// command's flags and one epoch for all.
	sp.base = []string{"centra", "--format", "json", "--quiet"}
	if b := lookupString(c, "bodies"); b != "" {
		sp.base = append(sp.base, "--bodies", b)
	}
	sp.base = append(sp.base, sp.command)
	sp.base = append(sp.base, cmdArgs...)
	if known["epoch"] && !given["epoch"] && !slices.ContainsFunc(sp.plan.Nominal(), func(v study.Value) bool { return v.Name == "epoch" }) {
		sp.base = append(sp.base, "--epoch", formatEpoch(nowEpoch()))
	}
	for _, v := range sp.plan.Nominal() {
		sp.columns = append(sp.columns, valueColumn(v))
	}
	return sp, nil
}

func sweepableCommands() []string {
	var names []string
	for _, cmd := range newApp(io.Discard, io.Discard).Commands {
		if sweepable(cmd.Name) {
			names = append(names, cmd.Name)
		}
	}
	return names
}

// valueColumn names the column of a varied value: the flag, then the unit
// written or the flag's default unit for a bare number.
func valueColumn(v study.Value) string {
	unit := v.Unit
	if unit == "" && v.Numeric {
		unit = flagUnits[v.Name]
	}
	return study.Column(v.Name, unit)
}

// argv returns the command line of a case.
func (sp *sweepSpec) argv(values []study.Value) []string {
	a := make([]string, 0, len(sp.base)+2*len(values))
	a = append(a, sp.base...)
	for _, v := range values {
		a = append(a, "--"+v.Name, v.Text)
	}
	return a
}

// caseRun is the outcome of one case.
type caseRun struct {
	record   []byte // the command's JSON output
	err      error  // an input error of the case
	expected error  // a failed --expect of the case
}

// caseRunner runs cases in-process, as 'run' and 'demo' do, on one app
// that it keeps between cases (urfave/cli builds a new flag set on every
// Run, so no value carries over). One per goroutine.
type caseRunner struct {
	app       *cli.App
	out, errb bytes.Buffer
}

func newCaseRunner() *caseRunner {
	r := &caseRunner{}
	// newApp's flags compute their names once (namedOnce), which per
	// case costs urfave/cli more than a day of J2 propagation otherwise.
	r.app = newApp(&r.out, &r.errb)
	// No --help: urfave/cli adds the one package-level HelpFlag to every
	// app and writes to it on each Run, a data race between runners.
	// sweep refuses --help among the command flags anyway.
	r.app.HideHelp = true
	for _, cmd := range r.app.Commands {
		cmd.HideHelp = true
	}
	return r
}

// run runs one command line; the record is a copy.
func (r *caseRunner) run(argv []string) (cr caseRun) {
	r.out.Reset()
	r.errb.Reset()
	defer func() {
		if p := recover(); p != nil {
			cr = caseRun{err: fmt.Errorf("internal error, please report it with the command line: %v", p)}
		}
	}()
	err := r.app.Run(argv)
	var ee *expectationError
	switch {
	case err == nil:
	case errors.As(err, &ee):
		cr.expected = err
	default:
		return caseRun{err: err}
	}
	cr.record = bytes.Clone(r.out.Bytes())
	return cr
}

// decodeRecord reads a case's JSON object into its top-level values.
func decodeRecord(b []byte) (map[string]json.RawMessage, error) {
	var m map[string]json.RawMessage
	if err := json.Unmarshal(b, &m); err != nil {
		return nil, err
	}
	return m, nil
}

// recordKeys returns the top-level keys of a JSON object in order.
func recordKeys(b []byte) ([]string, error) {
	dec := json.NewDecoder(bytes.NewReader(b))
	if t, err := dec.Token(); err != nil || t != json.Delim('{') {
		return nil, fmt.Errorf("not a JSON object")
	}
	var keys []string
	for dec.More() {
		t, err := dec.Token()
		if err != nil {
			return nil, err
		}
		keys = append(keys, t.(string))
		var skip json.RawMessage
		if err := dec.Decode(&skip); err != nil {
			return nil, err
		}
	}
	return keys, nil
}

// kindOf classifies a JSON value: scalar, vector (3 numbers), list or object.
func kindOf(raw json.RawMessage) string {
	raw = bytes.TrimSpace(raw)
	if len(raw) == 0 {
		return "scalar"
	}
	switch raw[0] {
	case '{':
		return "object"
	case '[':
		var v []json.Number
		if json.Unmarshal(raw, &v) == nil && len(v) == 3 {
			return "vector"
		}
		return "list"
	}
	return "scalar"
}

// vectorColumns splits a vector key like reports does for CSV:
// position_km -> position_x_km, position_y_km, position_z_km.
func vectorColumns(key string) []string {
	suffix := ""
	for _, s := range []string{"_km_s2", "_km_s", "_m_s", "_km", "_m", "_deg", "_rad", "_s"} {
		if strings.HasSuffix(key, s) {
			suffix = s
			break
		}
	}
	base := strings.TrimSuffix(key, suffix)
	return []string{base + "_x" + suffix, base + "_y" + suffix, base + "_z" + suffix}
}

// resolveOutputs checks --outputs against the nominal case's record and
// returns the readers and the column names.
func (sp *sweepSpec) resolveOutputs(text string, rec []byte) error {
	keys, err := recordKeys(rec)
	if err != nil {
		return inputErrorf("sweep commands that print one JSON record", "%s does not print one JSON record: %v", sp.command, err)
	}
	m, err := decodeRecord(rec)
	if err != nil {
		return inputErrorf("sweep commands that print one JSON record", "%s does not print one JSON record: %v", sp.command, err)
	}
	var scalars []string
	for _, k := range keys {
		if kd := kindOf(m[k]); kd == "scalar" || kd == "vector" {
			scalars = append(scalars, k)
		}
	}
	hint := "choose from the keys of '" + sp.command + "': " + strings.Join(scalars, ", ")
	if sp.command == "ephemeris" {
		hint += " (add --final to ephemeris for the end state: final_x_km, final_radius_km, ...)"
	}
	var want []string
	if strings.TrimSpace(text) == "" {
		want = scalars
		if len(want) == 0 {
			return inputErrorf(hint, "%s prints no scalar keys", sp.command)
		}
	} else {
		for _, k := range strings.Split(text, ",") {
			if k = strings.TrimSpace(k); k != "" {
				want = append(want, k)
			}
		}
		if len(want) == 0 {
			return inputErrorf(hint, "--outputs %q names no key", text)
		}
	}
	seen := map[string]bool{}
	for _, k := range want {
		if seen[k] {
			return inputErrorf("name each output once", "--outputs names %s twice", k)
		}
		seen[k] = true
		path := strings.Split(k, ".")
		raw, ok := m[path[0]]
		if !ok {
			return inputErrorf(hint, "--outputs: %s has no key %q", sp.command, path[0])
		}
		o := outputOf{key: path[0], path: path[1:]}
		if len(o.path) > 0 {
			leaf, err := walk(raw, o.path)
			if err != nil {
				return inputErrorf("write a dotted key as LIST.NAME.FIELD or OBJECT.KEY, e.g. checks.energy.relative_error", "--outputs %q: %v", k, err)
			}
			raw = leaf
		}
		switch kindOf(raw) {
		case "vector":
			o.vector = true
			sp.columns = append(sp.columns, vectorColumns(strings.ReplaceAll(k, ".", "_"))...)
		case "scalar":
			sp.columns = append(sp.columns, k)
		default:
			return inputErrorf(hint+"; or a dotted key into it such as "+k+".NAME.FIELD", "--outputs %q is a list or object, not a number", k)
		}
		sp.outputs = append(sp.outputs, o)
	}
	return nil
}

// walk follows a dotted path: object keys, list indices, or the "name" of
// a record in a list.
func walk(raw json.RawMessage, path []string) (json.RawMessage, error) {
	for _, step := range path {
		raw = bytes.TrimSpace(raw)
		switch {
		case len(raw) > 0 && raw[0] == '{':
			var m map[string]json.RawMessage
			if err := json.Unmarshal(raw, &m); err != nil {
				return nil, err
			}
			v, ok := m[step]
			if !ok {
				return nil, fmt.Errorf("no key %q", step)
			}
			raw = v
		case len(raw) > 0 && raw[0] == '[':
			var l []json.RawMessage
			if err := json.Unmarshal(raw, &l); err != nil {
				return nil, err
			}
			found := false
			if i, err := strconv.Atoi(step); err == nil && i >= 0 && i < len(l) {
				raw, found = l[i], true
			} else {
				for _, e := range l {
					var named struct{ Name string }
					if json.Unmarshal(e, &named) == nil && named.Name == step {
						raw, found = e, true
						break
					}
				}
			}
			if !found {
				return nil, fmt.Errorf("no element %q", step)
			}
		default:
			return nil, fmt.Errorf("%q is below a scalar", step)
		}
	}
	return raw, nil
}

// cells reads the output cells of a case: raw JSON scalars, null when the
// record lacks one.
func (sp *sweepSpec) cells(rec []byte) ([]json.RawMessage, error) {
	m, err := decodeRecord(rec)
	if err != nil {
		return nil, err
	}
	var out []json.RawMessage
	for _, o := range sp.outputs {
		raw, ok := m[o.key]
		if ok && len(o.path) > 0 {
			raw, err = walk(raw, o.path)
			ok = err == nil
		}
		if !o.vector {
			if !ok || kindOf(raw) != "scalar" {
				raw = json.RawMessage("null")
			}
			out = append(out, raw)
			continue
		}
		var v []json.RawMessage
		if !ok || json.Unmarshal(raw, &v) != nil || len(v) != 3 {
			v = []json.RawMessage{json.RawMessage("null"), json.RawMessage("null"), json.RawMessage("null")}
		}
		out = append(out, v...)
	}
	return out, nil
}

// caseRow is one row of output.
type caseRow struct {
	index  int
	values []study.Value
	cells  []json.RawMessage // output cells, raw JSON
	err    string            // why the case failed; "" when it ran
	failed bool              // an --expect of the case failed
}

func (sp *sweepSpec) run1(r *caseRunner, i int) caseRow {
	values := sp.plan.Case(i)
	row := caseRow{index: i, values: values}
	cr := r.run(sp.argv(values))
	if cr.err != nil {
		row.err = oneLine(cr.err.Error())
	} else {
		cells, err := sp.cells(cr.record)
		if err != nil {
			row.err = "the command printed no JSON record: " + err.Error()
		}
		row.cells = cells
		if cr.expected != nil {
			row.err, row.failed = oneLine(cr.expected.Error()), true
		}
	}
	if row.cells == nil {
		row.cells = make([]json.RawMessage, len(sp.columns)-len(values))
		for k := range row.cells {
			row.cells[k] = json.RawMessage("null")
		}
	}
	return row
}

func sweepAction(c *cli.Context) error {
	sp, err := parseSweep(c)
	if err != nil {
		return err
	}
	// The nominal case checks the command line before any output.
	nominal := sp.plan.Nominal()
	cr := newCaseRunner().run(sp.argv(nominal))
	if cr.err != nil {
		what, fix := oneLine(cr.err.Error()), "fix the command flags or the ranges"
		var ie *inputError
		if errors.As(cr.err, &ie) {
			what, fix = ie.What, ie.Fix
		}
		return inputErrorf(fix, "the nominal case (%s) fails: %s", describe(nominal), what)
	}
	if err := sp.resolveOutputs(c.String("outputs"), cr.record); err != nil {
		return err
	}
	o, err := openOutput(c, "table", "csv", "json", "jsonl")
	if err != nil {
		return err
	}
	err = sp.stream(o)
	return o.finish(err)
}

func describe(values []study.Value) string {
	var b []string
	for _, v := range values {
		b = append(b, "--"+v.Name+" "+v.Text)
	}
	return strings.Join(b, " ")
}

// stream runs the cases of the shard on sp.workers goroutines and writes
// the rows in case order as they complete.
func (sp *sweepSpec) stream(o *output) error {
	bw := bufio.NewWriterSize(o.W, 1<<16)
	w := newRowWriter(o.Format, bw, sp)
	if err := w.begin(); err != nil {
		return err
	}
	jobs := make(chan int)
	results := make(chan caseRow, sp.workers)
	done := make(chan struct{})
	window := make(chan struct{}, 64*sp.workers) // rows in flight
	var wg sync.WaitGroup
	go func() {
		defer close(jobs)
		for i := sp.lo; i < sp.hi; i++ {
			select {
			case window <- struct{}{}:
			case <-done:
				return
			}
			select {
			case jobs <- i:
			case <-done:
				return
			}
		}
	}()
	for range sp.workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			runner := newCaseRunner()
			for i := range jobs {
				r := sp.run1(runner, i)
				select {
				case results <- r:
				case <-done:
					return
				}
			}
		}()
	}
	go func() { wg.Wait(); close(results) }()

	pending := map[int]caseRow{}
	next, failed, expectFailed := sp.lo, 0, 0
	bar := newProgressBar(o, "sweep", float64(sp.hi-sp.lo), true)
	bar.Detail = func() string { return fmt.Sprintf("%d of %d cases", next-sp.lo, sp.hi-sp.lo) }
	defer bar.Clear()
	var werr error
	for r := range results {
		pending[r.index] = r
		for {
			row, ok := pending[next]
			if !ok {
				break
			}
			delete(pending, next)
			next++
			bar.Update(float64(next - sp.lo))
			<-window
			if row.err != "" {
				if row.failed {
					expectFailed++
				} else {
					failed++
				}
			}
			if werr = w.row(&row); werr != nil {
				break
			}
		}
		if werr == nil && len(results) == 0 {
			werr = bw.Flush()
		}
		if werr != nil {
			close(done)
			for range results { // let the workers finish
			}
			return werr
		}
	}
	if err := w.end(); err != nil {
		return err
	}
	if err := bw.Flush(); err != nil {
		return err
	}
	total := sp.hi - sp.lo
	if failed > 0 {
		o.warn("%d of %d cases failed; the error column says why", failed, total)
	}
	if expectFailed > 0 {
		return &expectationError{Failed: expectFailed, Total: total}
	}
	return nil
}

// sweepRows writes the rows of one format.
type sweepRows interface {
	begin() error
	row(r *caseRow) error
	end() error
}

func newRowWriter(format string, w *bufio.Writer, sp *sweepSpec) sweepRows {
	switch format {
	case "csv":
		return &sweepCSV{w: csv.NewWriter(w), sp: sp}
	case "json":
		return &sweepJSON{w: w, sp: sp}
	case "jsonl":
		return &sweepJSON{w: w, sp: sp, lines: true}
	}
	return &sweepTable{w: w, sp: sp}
}

// valueJSON is a varied value as JSON: a number or a string.
func valueJSON(v study.Value) json.RawMessage {
	if v.Numeric {
		return json.RawMessage(strconv.FormatFloat(v.Num, 'g', -1, 64))
	}
	b, _ := json.Marshal(v.Text)
	return b
}

// cellText is a raw JSON scalar as CSV text: numbers as printed, strings
// unquoted, null empty.
func cellText(raw json.RawMessage) string {
	raw = bytes.TrimSpace(raw)
	switch {
	case len(raw) == 0 || string(raw) == "null":
		return ""
	case raw[0] == '"':
		var s string
		if json.Unmarshal(raw, &s) == nil {
			return s
		}
	}
	return string(raw)
}

type sweepCSV struct {
	w   *csv.Writer
	sp  *sweepSpec
	rec []string
}

func (s *sweepCSV) begin() error {
	h := append([]string{"case"}, s.sp.columns...)
	return s.w.Write(append(h, "error"))
}

func (s *sweepCSV) row(r *caseRow) error {
	rec := append(s.rec[:0], strconv.Itoa(r.index))
	for _, v := range r.values {
		rec = append(rec, cellText(valueJSON(v)))
	}
	for _, c := range r.cells {
		rec = append(rec, cellText(c))
	}
	rec = append(rec, r.err)
	s.rec = rec
	if err := s.w.Write(rec); err != nil {
		return err
	}
	s.w.Flush()
	return s.w.Error()
}

func (s *sweepCSV) end() error { s.w.Flush(); return s.w.Error() }

// sweepJSON writes {"cases": [...]} with one case per line, or JSON Lines.
type sweepJSON struct {
	w     *bufio.Writer
	sp    *sweepSpec
	lines bool
	n     int
	buf   []byte
}

func (s *sweepJSON) begin() error {
	if s.lines {
		return nil
	}
	shard := s.sp.shard
	if shard.N == 0 {
		shard = study.Shard{K: 1, N: 1}
	}
	hdr := fmt.Sprintf("{\n  \"command\": %q,\n  \"cases_total\": %d,\n  \"shard\": \"%d/%d\",\n  \"first_case\": %d,\n  \"case_count\": %d,\n  \"seed\": %d,\n  \"cases\": [",
		s.sp.command, s.sp.plan.Len(), shard.K, shard.N, s.sp.lo, s.sp.hi-s.sp.lo, s.sp.plan.Seed)
	_, err := s.w.WriteString(hdr)
	return err
}

func (s *sweepJSON) row(r *caseRow) error {
	b := s.buf[:0]
	if !s.lines {
		if s.n > 0 {
			b = append(b, ',')
		}
		b = append(b, "\n    "...)
	}
	s.n++
	b = append(b, `{"case": `...)
	b = strconv.AppendInt(b, int64(r.index), 10)
	k := 0
	add := func(raw json.RawMessage) {
		b = append(b, ", "...)
		b = strconv.AppendQuote(b, s.sp.columns[k])
		b = append(b, ": "...)
		b = append(b, raw...)
		k++
	}
	for _, v := range r.values {
		add(valueJSON(v))
	}
	for _, c := range r.cells {
		add(c)
	}
	b = append(b, `, "error": `...)
	if r.err == "" {
		b = append(b, "null"...)
	} else {
		e, _ := json.Marshal(r.err)
		b = append(b, e...)
	}
	b = append(b, '}')
	if s.lines {
		b = append(b, '\n')
	}
	s.buf = b
	_, err := s.w.Write(b)
	return err
}

func (s *sweepJSON) end() error {
	if s.lines {
		return nil
	}
	_, err := s.w.WriteString("\n  ]\n}\n")
	return err
}

// sweepTable streams a fixed-width table.
type sweepTable struct {
	w      *bufio.Writer
	sp     *sweepSpec
	widths []int
	rule   string
}

func (s *sweepTable) begin() error {
	var names []string
	for _, v := range s.sp.plan.Vary {
		names = append(names, v.Name)
	}
	for _, d := range s.sp.plan.Draw {
		names = append(names, d.Name)
	}
	title := fmt.Sprintf("Sweep of %s over %s: cases %d..%d of %d", s.sp.command, strings.Join(names, " x "), s.sp.lo, s.sp.hi-1, s.sp.plan.Len())
	if len(s.sp.plan.Draw) > 0 {
		title += fmt.Sprintf(", seed %d", s.sp.plan.Seed)
	}
	reports.WriteTitle(s.w, title)
	cols := append([]string{"case"}, s.sp.columns...)
	s.widths = make([]int, len(cols))
	var head strings.Builder
	head.WriteString("|")
	for k, c := range cols {
		s.widths[k] = max(len(c), 12)
		if k == 0 {
			s.widths[k] = max(len(c), 6)
		}
		fmt.Fprintf(&head, " %*s |", s.widths[k], c)
	}
	// the box holds the fixed-width columns; a case's error, of any
	// length, trails its row outside the box
	var rule strings.Builder
	rule.WriteString("+")
	for _, w := range s.widths {
		rule.WriteString(strings.Repeat("-", w+2) + "+")
	}
	s.rule = rule.String()
	_, err := fmt.Fprintf(s.w, "%s\n%s  error\n%s\n", s.rule, head.String(), s.rule)
	return err
}

// tableCell rounds numbers to 10 significant digits for reading.
func tableCell(raw json.RawMessage) string {
	t := cellText(raw)
	if t == "" {
		return "-"
	}
	if x, err := strconv.ParseFloat(t, 64); err == nil && t[0] != '"' {
		if x == math.Trunc(x) && math.Abs(x) < 1e15 {
			return strconv.FormatFloat(x, 'f', -1, 64)
		}
		return strconv.FormatFloat(x, 'g', 10, 64)
	}
	return t
}

func (s *sweepTable) row(r *caseRow) error {
	var b strings.Builder
	fmt.Fprintf(&b, "| %*d |", s.widths[0], r.index)
	k := 1
	for _, v := range r.values {
		fmt.Fprintf(&b, " %*s |", s.widths[k], tableCell(valueJSON(v)))
		k++
	}
	for _, c := range r.cells {
		fmt.Fprintf(&b, " %*s |", s.widths[k], tableCell(c))
		k++
	}
	if r.err != "" {
		b.WriteString("  " + r.err)
	}
	b.WriteByte('\n')
	_, err := s.w.WriteString(b.String())
	return err
}

func (s *sweepTable) end() error {
	_, err := fmt.Fprintln(s.w, s.rule)
	return err
}
