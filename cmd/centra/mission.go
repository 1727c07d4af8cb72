package main

import (
	_ "embed"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"github.com/BurntSushi/toml"
	"github.com/urfave/cli/v2"
)

// A mission file describes spacecraft, sites and the outputs wanted; the
// runner turns each output into the command line of the command that
// makes it and runs it in-process, so a mission and the commands share
// one code path. The format is documented in the README ("Mission files").

type missionFile struct {
	Mission    missionHeader    `toml:"mission"`
	Spacecraft []map[string]any `toml:"spacecraft"`
	Site       []map[string]any `toml:"site"`
	Output     []map[string]any `toml:"output"`
}

type missionHeader struct {
	Name        string `toml:"name"`
	Team        string `toml:"team"`
	Description string `toml:"description"`
	Epoch       string `toml:"epoch"`
	BodiesFile  string `toml:"bodies_file"`
	Note        string `toml:"note"`
}

// spacecraftKeys maps mission keys to command flags.
var spacecraftKeys = map[string]string{
	"id": "", "name": "", "description": "",
	"body": "body", "epoch": "epoch",
	"altitude": "altitude", "periapsis_alt": "periapsis-alt", "apoapsis_alt": "apoapsis-alt",
	"semi_major_axis": "semi-major-axis", "eccentricity": "eccentricity",
	"position": "position", "velocity": "velocity",
	"inclination": "inclination", "raan": "raan", "arg_periapsis": "arg-periapsis",
	"true_anomaly": "true-anomaly", "mean_anomaly": "mean-anomaly", "sun_synchronous": "sun-synchronous",
	"mass_kg": "mass", "area_m2": "area", "cd": "cd", "cr": "cr", "srp_area_m2": "srp-area",
	"ballistic_coefficient_kg_m2": "ballistic-coefficient",
	"burnout_alt":                 "burnout-alt", "burnout_lat": "burnout-lat", "burnout_lon": "burnout-lon",
	"burnout_speed": "burnout-speed", "flight_path_angle": "flight-path-angle", "azimuth": "azimuth",
	"launch_site": "",
}

var siteKeys = map[string]bool{"id": true, "name": true, "lat": true, "lon": true, "alt_m": true, "mask": true, "min_elevation": true}

var outputKeys = map[string]bool{"kind": true, "title": true, "spacecraft": true, "site": true, "format": true, "out": true, "force": true, "flags": true, "expect": true}

// outputKinds maps an output kind to the command that makes it.
var outputKinds = map[string]string{
	"summary": "orbit", "orbit": "orbit", "ephemeris": "ephemeris", "passes": "passes", "eclipses": "eclipses",
	"lifetime": "lifetime", "transfer": "transfer", "ballistic": "ballistic", "plot": "plot",
	"lambert": "lambert", "atmosphere": "atmosphere", "bodies": "bodies",
}

// missionError names the file, line and key of a mission-file problem.
func missionError(file string, line int, key, what, fix string) error {
	loc := file
	if line > 0 {
		loc += ":" + strconv.Itoa(line)
	}
	if key != "" {
		loc += " (key " + key + ")"
	}
	return &inputError{What: loc + ": " + what, Fix: fix}
}

// keyLine finds the line of key inside the n-th [[table]] (or [table]
// when n < 0); 0 when not found.
func keyLine(data []byte, table string, n int, key string) int {
	lines := strings.Split(string(data), "\n")
	header := regexp.MustCompile(`^\s*\[\[\s*` + regexp.QuoteMeta(table) + `\s*\]\]`)
	if n < 0 {
		header = regexp.MustCompile(`^\s*\[\s*` + regexp.QuoteMeta(table) + `\s*\]`)
		n = 0
	}
	anyHeader := regexp.MustCompile(`^\s*\[`)
	keyRe := regexp.MustCompile(`^\s*"?` + regexp.QuoteMeta(key) + `"?\s*=`)
	count := -1
	in := false
	for i, l := range lines {
		if header.MatchString(l) {
			count++
			in = count == n
			if in && key == "" {
				return i + 1
			}
			continue
		}
		if anyHeader.MatchString(l) {
			in = false
			continue
		}
		if in && keyRe.MatchString(l) {
			return i + 1
		}
	}
	return 0
}

// flagText turns a TOML value into flag text.
func flagText(v any) (string, bool) {
	switch x := v.(type) {
	case string:
		return x, true
	case int64:
		return strconv.FormatInt(x, 10), true
	case float64:
		return strconv.FormatFloat(x, 'g', -1, 64), true
	case bool:
		return strconv.FormatBool(x), true
	}
	return "", false
}

type missionRun struct {
	file    string
	data    []byte
	m       missionFile
	format  string
	quiet   bool
	bodies  string
	stdout  io.Writer
	stderr  io.Writer
	failed  int
	checked int
}

func loadMission(file string, data []byte) (*missionRun, error) {
	mr := &missionRun{file: file, data: data}
	md, err := toml.Decode(string(data), &mr.m)
	if err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, missionError(file, pe.Position.Line, pe.LastKey, pe.Message, "fix the TOML syntax or the value's type")
		}
		return nil, missionError(file, 0, "", err.Error(), "fix the TOML syntax or the value's type")
	}
	var und []toml.Key
	for _, k := range md.Undecoded() {
		// The free-form tables are checked key by key below; the library
		// does not mark keys nested under them as decoded.
		if len(k) > 0 && (k[0] == "spacecraft" || k[0] == "site" || k[0] == "output") {
			continue
		}
		und = append(und, k)
	}
	if len(und) > 0 {
		k := und[0]
		line := 0
		switch {
		case len(k) >= 2:
			line = keyLine(data, k[0], -1, k[len(k)-1])
		case len(k) == 1:
			line = keyLine(data, k[0], -1, "")
		}
		return nil, missionError(file, line, k.String(), "unknown key", "top-level tables are [mission], [[spacecraft]], [[site]] and [[output]]; see the README, 'Mission files'")
	}
	// Validate keys of the free-form tables.
	ids := map[string]bool{}
	for i, sc := range mr.m.Spacecraft {
		for k, v := range sc {
			if _, ok := spacecraftKeys[k]; !ok {
				return nil, missionError(file, keyLine(data, "spacecraft", i, k), "spacecraft."+k, "unknown key", "spacecraft keys are "+sortedKeys(spacecraftKeys))
			}
			if _, ok := flagText(v); !ok {
				return nil, missionError(file, keyLine(data, "spacecraft", i, k), "spacecraft."+k, fmt.Sprintf("wrong type %T", v), "give a string such as \"500km\", a number or a boolean")
			}
		}
		id, _ := sc["id"].(string)
		if id == "" {
			return nil, missionError(file, keyLine(data, "spacecraft", i, ""), "spacecraft.id", fmt.Sprintf("spacecraft %d has no id", i+1), "add id = \"short-name\"")
		}
		if ids[id] {
			return nil, missionError(file, keyLine(data, "spacecraft", i, "id"), "spacecraft.id", fmt.Sprintf("duplicate id %q", id), "give each spacecraft and site its own id")
		}
		ids[id] = true
	}
	for i, st := range mr.m.Site {
		for k, v := range st {
			if !siteKeys[k] {
				return nil, missionError(file, keyLine(data, "site", i, k), "site."+k, "unknown key", "site keys are alt_m, id, lat, lon, mask, min_elevation, name")
			}
			if _, ok := flagText(v); !ok {
				return nil, missionError(file, keyLine(data, "site", i, k), "site."+k, fmt.Sprintf("wrong type %T", v), "give a string or a number")
			}
		}
		id, _ := st["id"].(string)
		if id == "" {
			return nil, missionError(file, keyLine(data, "site", i, ""), "site.id", fmt.Sprintf("site %d has no id", i+1), "add id = \"short-name\"")
		}
		for _, k := range []string{"lat", "lon"} {
			if _, ok := st[k]; !ok {
				return nil, missionError(file, keyLine(data, "site", i, "id"), "site."+k, fmt.Sprintf("site %q has no %s", id, k), "add "+k+" = DEGREES")
			}
		}
		if ids[id] {
			return nil, missionError(file, keyLine(data, "site", i, "id"), "site.id", fmt.Sprintf("duplicate id %q", id), "give each spacecraft and site its own id")
		}
		ids[id] = true
	}
	if len(mr.m.Output) == 0 {
		return nil, missionError(file, 0, "output", "the mission asks for no outputs", "add at least one [[output]] table with kind = \"summary\"")
	}
	for i, out := range mr.m.Output {
		for k := range out {
			if !outputKeys[k] {
				return nil, missionError(file, keyLine(data, "output", i, k), "output."+k, "unknown key", "output keys are expect, flags, force, format, kind, out, site, spacecraft, title")
			}
		}
		if err := checkOutputTypes(file, data, i, out); err != nil {
			return nil, err
		}
		kind, ok := out["kind"].(string)
		if !ok {
			return nil, missionError(file, keyLine(data, "output", i, ""), "output.kind", fmt.Sprintf("output %d has no kind", i+1), "add kind = one of "+sortedKinds())
		}
		if _, ok := outputKinds[kind]; !ok {
			return nil, missionError(file, keyLine(data, "output", i, "kind"), "output.kind", fmt.Sprintf("unknown output kind %q", kind), "use one of "+sortedKinds())
		}
	}
	return mr, nil
}

// checkOutputTypes rejects an [[output]] value of the wrong type, which
// args would otherwise ignore without a word.
func checkOutputTypes(file string, data []byte, i int, out map[string]any) error {
	for _, k := range []string{"kind", "title", "spacecraft", "format", "out", "force", "site"} {
		v, ok := out[k]
		if !ok {
			continue
		}
		want, good := "a string", false
		switch x := v.(type) {
		case string:
			good = k != "force"
		case bool:
			good = k == "force"
		case []any:
			if k == "site" {
				good = true
				for _, e := range x {
					if _, isStr := e.(string); !isStr {
						good = false
					}
				}
			}
		}
		switch k {
		case "force":
			want = "true or false"
		case "site":
			want = "a site id or a list of site ids"
		}
		if !good {
			return missionError(file, keyLine(data, "output", i, k), "output."+k, fmt.Sprintf("wrong type %T", v), "give "+k+" as "+want)
		}
	}
	return nil
}

func sortedKeys(m map[string]string) string {
	var k []string
	for x := range m {
		k = append(k, x)
	}
	sort.Strings(k)
	return strings.Join(k, ", ")
}

func sortedKinds() string {
	var k []string
	for x := range outputKinds {
		k = append(k, x)
	}
	sort.Strings(k)
	return strings.Join(k, ", ")
}

func (mr *missionRun) find(table []map[string]any, id string) (map[string]any, bool) {
	for _, t := range table {
		if t["id"] == id {
			return t, true
		}
	}
	return nil, false
}

// commandFlags lists the flag names a command accepts.
func commandFlags(name string) map[string]bool {
	app := newApp(io.Discard, io.Discard)
	for _, c := range app.Commands {
		if c.Name == name {
			m := map[string]bool{}
			for _, f := range c.Flags {
				for _, n := range f.Names() {
					m[n] = true
				}
			}
			return m
		}
	}
	return nil
}

// args builds the command line of output i.
func (mr *missionRun) args(i int) (cmdName, title string, argv []string, err error) {
	out := mr.m.Output[i]
	kind := out["kind"].(string)
	cmdName = outputKinds[kind]
	accepted := commandFlags(cmdName)
	if accepted == nil {
		return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "kind"), "output.kind", fmt.Sprintf("output kind %q needs the %q command, which this build does not have yet", kind, cmdName), "remove the output or use a newer centra")
	}
	format := mr.format
	if f, ok := out["format"].(string); ok {
		format = f
	}
	argv = []string{"centra", "--format", format}
	if mr.bodies != "" {
		argv = append(argv, "--bodies", mr.bodies)
	}
	if mr.quiet {
		argv = append(argv, "--quiet")
	}
	argv = append(argv, cmdName)
	set := map[string]bool{}
	add := func(flag, val string) {
		argv = append(argv, "--"+flag, val)
		set[flag] = true
	}
	title, _ = out["title"].(string)
	if scID, ok := out["spacecraft"].(string); ok {
		sc, ok := mr.find(mr.m.Spacecraft, scID)
		if !ok {
			return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "spacecraft"), "output.spacecraft", fmt.Sprintf("no spacecraft with id %q", scID), "use the id of a [[spacecraft]] table")
		}
		if title == "" {
			name, _ := sc["name"].(string)
			if name == "" {
				name = scID
			}
			title = kind + ": " + name
		}
		keys := make([]string, 0, len(sc))
		for k := range sc {
			keys = append(keys, k)
		}
		sort.Strings(keys)
		for _, k := range keys {
			flag := spacecraftKeys[k]
			if flag == "" || !accepted[flag] {
				continue
			}
			v, _ := flagText(sc[k])
			if b, isBool := sc[k].(bool); isBool {
				if b {
					argv = append(argv, "--"+flag)
					set[flag] = true
				}
				continue
			}
			add(flag, v)
		}
		if ls, ok := sc["launch_site"].(string); ok && accepted["site"] {
			st, ok := mr.find(mr.m.Site, ls)
			if !ok {
				return "", "", nil, missionError(mr.file, 0, "spacecraft.launch_site", fmt.Sprintf("no site with id %q", ls), "use the id of a [[site]] table")
			}
			add("site", siteText(st))
		}
	}
	if mr.m.Mission.Epoch != "" && accepted["epoch"] && !set["epoch"] {
		add("epoch", mr.m.Mission.Epoch)
	}
	if title == "" {
		title = kind
	}
	if siteRef, ok := out["site"]; ok {
		var ids []string
		switch x := siteRef.(type) {
		case string:
			ids = []string{x}
		case []any:
			for _, v := range x {
				s, _ := v.(string)
				ids = append(ids, s)
			}
		}
		for _, id := range ids {
			st, ok := mr.find(mr.m.Site, id)
			if !ok {
				return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "site"), "output.site", fmt.Sprintf("no site with id %q", id), "use the id of a [[site]] table")
			}
			if cmdName == "passes" {
				// passes names its sites (NAME=LAT,LON,ALT_M) and pairs
				// --min-elevation with --site by order, so every site gets one.
				add("site", id+"="+siteText(st))
				if _, ok := st["min_elevation"]; !ok {
					add("min-elevation", "0")
				}
			} else {
				add("site", siteText(st))
			}
			if me, ok := st["min_elevation"]; ok && accepted["min-elevation"] {
				v, _ := flagText(me)
				add("min-elevation", v)
			}
			if mk, ok := st["mask"].(string); ok && accepted["mask"] {
				add("mask", mr.rel(mk))
			}
		}
	}
	if fl, ok := out["flags"].(map[string]any); ok {
		keys := make([]string, 0, len(fl))
		for k := range fl {
			keys = append(keys, k)
		}
		sort.Strings(keys)
		for _, k := range keys {
			name := strings.ReplaceAll(k, "_", "-")
			if !accepted[name] {
				return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "flags"), "output.flags."+k, fmt.Sprintf("the %s command has no flag --%s", cmdName, name), "run 'centra "+cmdName+" --help' for its flags")
			}
			switch x := fl[k].(type) {
			case bool:
				if x {
					argv = append(argv, "--"+name)
				}
			case []any:
				for _, e := range x {
					v, ok := flagText(e)
					if !ok {
						return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "flags"), "output.flags."+k, "wrong type in list", "give strings or numbers")
					}
					add(name, v)
				}
			default:
				v, ok := flagText(x)
				if !ok {
					return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "flags"), "output.flags."+k, fmt.Sprintf("wrong type %T", x), "give a string, a number or a boolean")
				}
				add(name, v)
			}
		}
	} else if _, ok := out["flags"]; ok {
		return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "flags"), "output.flags", "flags must be a table", "write flags = { span = \"1d\", step = \"10min\" }")
	}
	if p, ok := out["out"].(string); ok {
		add("out", mr.rel(p))
		if f, _ := out["force"].(bool); f {
			argv = append(argv, "--force")
		}
	}
	if ex, ok := out["expect"]; ok {
		list, ok := ex.([]any)
		if !ok {
			return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "expect"), "output.expect", "expect must be a list of strings", "write expect = [\"period_s=5554±2\"]")
		}
		if !accepted["expect"] {
			return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "expect"), "output.expect", fmt.Sprintf("the %s output takes no expectations", kind), "remove expect from this output")
		}
		for _, e := range list {
			s, ok := e.(string)
			if !ok {
				return "", "", nil, missionError(mr.file, keyLine(mr.data, "output", i, "expect"), "output.expect", "expect must be a list of strings", "write expect = [\"period_s=5554±2\"]")
			}
			add("expect", s)
		}
	}
	return cmdName, title, argv, nil
}

func siteText(st map[string]any) string {
	lat, _ := flagText(st["lat"])
	lon, _ := flagText(st["lon"])
	s := lat + "," + lon
	if alt, ok := st["alt_m"]; ok {
		a, _ := flagText(alt)
		s += "," + a
	}
	return s
}

// rel resolves a path in the mission file relative to the file.
func (mr *missionRun) rel(p string) string {
	if filepath.IsAbs(p) || mr.file == "" || strings.HasPrefix(mr.file, "(") {
		return p
	}
	return filepath.Join(filepath.Dir(mr.file), p)
}

// execute runs every output in order, each under a heading.
func (mr *missionRun) execute() error {
	if mr.m.Mission.BodiesFile != "" && mr.bodies == "" {
		mr.bodies = mr.rel(mr.m.Mission.BodiesFile)
	}
	// Build every command line first: a bad output stops the run before
	// anything is printed.
	type step struct {
		cmd, title string
		argv       []string
	}
	var steps []step
	for i := range mr.m.Output {
		cmd, title, argv, err := mr.args(i)
		if err != nil {
			return err
		}
		steps = append(steps, step{cmd, title, argv})
	}
	if mr.m.Mission.Name != "" {
		fmt.Fprintf(mr.stdout, "%s\n%s\n", mr.m.Mission.Name, strings.Repeat("=", len([]rune(mr.m.Mission.Name))))
		for _, l := range []string{mr.m.Mission.Team, mr.m.Mission.Description, mr.m.Mission.Note} {
			if l != "" {
				fmt.Fprintln(mr.stdout, wrapText(l, 78))
			}
		}
	}
	for i, s := range steps {
		fmt.Fprintf(mr.stdout, "\n[%d/%d] %s\n", i+1, len(steps), s.title)
		fmt.Fprintf(mr.stdout, "$ %s\n\n", shellQuote(s.argv))
		app := newAppFor(mr.stdout, mr.stderr, s.argv)
		err := app.Run(s.argv)
		var ee *expectationError
		switch {
		case errors.As(err, &ee):
			mr.failed += ee.Failed
			mr.checked += ee.Total
		case err != nil:
			return fmt.Errorf("%s, output %d (%s): %w", mr.file, i+1, s.cmd, err)
		}
	}
	if mr.failed > 0 {
		return &expectationError{Failed: mr.failed, Total: mr.checked}
	}
	return nil
}

func wrapText(s string, width int) string {
	var b strings.Builder
	n := 0
	for _, w := range strings.Fields(s) {
		if n > 0 && n+1+len(w) > width {
			b.WriteString("\n")
			n = 0
		} else if n > 0 {
			b.WriteString(" ")
			n++
		}
		b.WriteString(w)
		n += len(w)
	}
	return b.String()
}

func shellQuote(argv []string) string {
	out := make([]string, len(argv))
	for i, a := range argv {
		if a == "" || strings.ContainsAny(a, " \t'\"$±*?;&|<>()") {
			out[i] = "'" + strings.ReplaceAll(a, "'", `'\''`) + "'"
		} else {
			out[i] = a
		}
	}
	return strings.Join(out, " ")
}

func init() { register(90, runCommand); register(5, demoCommand) }

func runCommand() *cli.Command {
	return &cli.Command{
		Name:      "run",
		Usage:     "run a mission file: spacecraft, sites and the outputs wanted",
		ArgsUsage: "FILE",
		UsageText: `centra run FILE.toml

example:
  centra run testdata/missions/leo-imager.toml`,
		Description: "Runs each [[output]] of the mission file through the command that makes it,\nunder a heading. See the README, 'Mission files', for every key.",
		Action: func(c *cli.Context) error {
			if c.NArg() != 1 {
				return inputErrorf("give the mission file: centra run FILE.toml", "run needs exactly one mission file")
			}
			file := c.Args().First()
			data, err := os.ReadFile(file)
			if err != nil {
				return inputErrorf("check the path", "mission file %q cannot be read: %v", file, unwrapPathError(err))
			}
			return runMission(c, file, data)
		},
	}
}

//go:embed demo.toml
var demoMission []byte

func demoCommand() *cli.Command {
	return &cli.Command{
		Name:  "demo",
		Usage: "run the embedded demo mission (an invented university team's small satellite)",
		UsageText: `centra demo

example:
  centra demo | less`,
		Description: "The demo mission is an ordinary mission file compiled into the program; it\nshows every feature that has landed. Print it with 'centra demo --print'.",
		Flags:       []cli.Flag{&cli.BoolFlag{Name: "print", Usage: "print the demo mission file instead of running it"}},
		Action: func(c *cli.Context) error {
			if c.Bool("print") {
				_, err := c.App.Writer.Write(demoMission)
				return err
			}
			return runMission(c, "(demo mission)", demoMission)
		},
	}
}

func runMission(c *cli.Context, file string, data []byte) error {
	mr, err := loadMission(file, data)
	if err != nil {
		return err
	}
	if c.String("out") != "" {
		return inputErrorf("give out = \"FILE\" per output in the mission file", "--out is not used by %s; each output names its own file", c.Command.Name)
	}
	mr.format = lookupString(c, "format")
	mr.quiet = lookupBool(c, "quiet")
	mr.bodies = lookupString(c, "bodies")
	mr.stdout, mr.stderr = c.App.Writer, c.App.ErrWriter
	return mr.execute()
}
