package main

import (
	"io"
	"slices"
	"sort"
	"strings"

	"github.com/urfave/cli/v2"
)

// registered commands; each command file adds itself in init so that
// adding a command touches no shared file.
var registry []registeredCommand

type registeredCommand struct {
	order int
	make  func() *cli.Command
}

func register(order int, make func() *cli.Command) {
	registry = append(registry, registeredCommand{order, make})
}

// globalFlags are accepted before and after the command name.
func globalFlags() []cli.Flag {
	return []cli.Flag{
		&cli.StringFlag{Name: "format", Value: "table", Usage: "output `FORMAT`: table, csv or json (ephemeris also oem, sweep also jsonl)"},
		&cli.StringFlag{Name: "bodies", Usage: "add or override central bodies from a TOML `FILE` (see README, 'Bodies file')"},
		&cli.BoolFlag{Name: "quiet", Usage: "print no warnings or progress on stderr"},
		&cli.StringFlag{Name: "leap-seconds", Usage: "read leap seconds from an IERS leap-seconds.list `FILE` (for epochs after the built-in table)"},
	}
}

const appDescription = `centra answers the questions of orbit and suborbital planning from first
principles: orbit geometry and the Kepler-law checks, ephemerides, passes,
eclipses, J2 drift, lifetime, transfers and ballistic arcs. Quantities take
units (400km, 7.5km/s, 98.2deg, 1d6h); times are RFC 3339 UTC.

Exit codes: 0 success, 1 an --expect failed, 2 bad input or usage.
Results are planning estimates; see 'centra demo' and the README cautions.`

// newApp returns the application with every command fully built: for
// listings of commands and flags (mission keys, sweep, completion, tests).
func newApp(stdout, stderr io.Writer) *cli.App { return buildApp(stdout, stderr, nil, "") }

// newAppFor returns the application that runs the command line args. Only
// the command named in args gets its flags: urfave/cli v2.27.7 renders
// every flag of every command into help text on each run (Setup's flag
// categories) and rescans all of a command's flags with a regular
// expression for every flag it checks (Context.IsSet, runFlagActions), which
// cost a command-line run more than a day of propagation. The other
// commands keep their names and usage for 'centra --help'; should
// urfave/cli ever dispatch to one of them, it runs the command line on the
// fully built application instead, so the result never depends on the
// shortcut.
func newAppFor(stdout, stderr io.Writer, args []string) *cli.App {
	return buildApp(stdout, stderr, args, commandToken(args))
}

// commandToken returns the first argument after the program name and the
// global flags (with their values), or "" when there is none or the line
// cannot be read that way (then everything is built).
func commandToken(args []string) string {
	valued := map[string]bool{}
	for _, f := range globalFlags() {
		if _, ok := f.(*cli.StringFlag); ok {
			for _, n := range flagNames(f) {
				valued[n] = true
			}
		}
	}
	for i := 1; i < len(args); i++ {
		a := args[i]
		switch {
		case a == "--" || a == "-" || a == "":
			return ""
		case strings.HasPrefix(a, "-"):
			name := strings.TrimLeft(a, "-")
			if strings.Contains(name, "=") {
				continue
			}
			if valued[name] {
				i++
			}
		default:
			return a
		}
	}
	return ""
}

// buildApp builds the application; when only names a command, the others
// are left unprepared and run args on a full application if reached.
func buildApp(stdout, stderr io.Writer, args []string, only string) *cli.App {
	app := &cli.App{
		Name:                      "centra",
		Usage:                     "orbital and central-force trajectory planner",
		UsageText:                 "centra [--format table|csv|json] [--bodies FILE] [--quiet] COMMAND [flags]\n\nexample: centra orbit --altitude 500 --inclination 97.4",
		Description:               appDescription,
		Writer:                    stdout,
		ErrWriter:                 stderr,
		Flags:                     namedOnce(globalFlags()),
		HideHelpCommand:           true,
		EnableBashCompletion:      true,
		DisableSliceFlagSeparator: true,
		ExitErrHandler:            func(*cli.Context, error) {},
		OnUsageError:              usageError,
		Action: func(c *cli.Context) error {
			if c.NArg() > 0 {
				return inputErrorf("run 'centra --help' for the list of commands", "unknown command %q", c.Args().First())
			}
			return cli.ShowAppHelp(c)
		},
	}
	cmds := append([]registeredCommand(nil), registry...)
	sort.SliceStable(cmds, func(i, j int) bool { return cmds[i].order < cmds[j].order })
	built := make([]*cli.Command, len(cmds))
	named := false
	for i, rc := range cmds {
		built[i] = rc.make()
		if only != "" && (built[i].Name == only || slices.Contains(built[i].Aliases, only)) {
			named = built[i].Name != "completion"
		}
	}
	for _, cmd := range built {
		if named && cmd.Name != only && !slices.Contains(cmd.Aliases, only) {
			app.Commands = append(app.Commands, unprepared(cmd, stdout, stderr, args))
			continue
		}
		cmd.Flags = append(cmd.Flags, globalFlags()...)
		cmd.Flags = append(cmd.Flags, outputFlags()...)
		cmd.OnUsageError = usageError
		if cmd.Action != nil {
			cmd.Action = checkArgs(cmd, cmd.Action)
		}
		cmd.Flags = namedOnce(cmd.Flags)
		app.Commands = append(app.Commands, cmd)
	}
	return app
}

// unprepared keeps what 'centra --help' shows of a command that the
// command line does not run; see newAppFor.
func unprepared(cmd *cli.Command, stdout, stderr io.Writer, args []string) *cli.Command {
	return &cli.Command{
		Name:            cmd.Name,
		Aliases:         cmd.Aliases,
		Usage:           cmd.Usage,
		Category:        cmd.Category,
		Hidden:          cmd.Hidden,
		SkipFlagParsing: true,
		Action: func(*cli.Context) error {
			return newApp(stdout, stderr).Run(args)
		},
	}
}

// namedString and namedStringSlice compute their names once: urfave/cli's
// Names runs a regular expression on every call and is called for every
// flag of the command at every flag it checks. Everything else, help text
// included, is the wrapped flag's own.
type namedString struct {
	*cli.StringFlag
	names []string
}

func (f *namedString) Names() []string { return f.names }

type namedStringSlice struct {
	*cli.StringSliceFlag
	names []string
}

func (f *namedStringSlice) Names() []string { return f.names }

// namedBool wraps a boolean flag. urfave/cli asserts *cli.BoolFlag in two
// places: its flag text (which it renders from the wrapped flag, so the
// help is unchanged) and its completion list, where hidden boolean flags
// are left out; no centra boolean flag is hidden (TestNoHiddenBoolFlags).
type namedBool struct {
	*cli.BoolFlag
	names []string
}

func (f *namedBool) Names() []string { return f.names }

// namedOnce wraps the flags of a command so that their names are computed
// once.
func namedOnce(flags []cli.Flag) []cli.Flag {
	out := make([]cli.Flag, len(flags))
	for i, f := range flags {
		switch f := f.(type) {
		case *cli.StringFlag:
			out[i] = &namedString{f, flagNames(f)}
		case *cli.StringSliceFlag:
			out[i] = &namedStringSlice{f, flagNames(f)}
		case *cli.BoolFlag:
			out[i] = &namedBool{f, flagNames(f)}
		default:
			out[i] = f
		}
	}
	return out
}

// flagNames returns a flag's name and aliases: what f.Names() returns for
// centra's flags (whose names hold no comma or space, the only thing
// urfave/cli's regular expression removes), without running it.
func flagNames(f cli.Flag) []string {
	switch f := f.(type) {
	case *cli.StringFlag:
		return append([]string{f.Name}, f.Aliases...)
	case *cli.StringSliceFlag:
		return append([]string{f.Name}, f.Aliases...)
	case *cli.BoolFlag:
		return append([]string{f.Name}, f.Aliases...)
	case *cli.IntFlag:
		return append([]string{f.Name}, f.Aliases...)
	}
	return f.Names()
}

// usageError turns urfave/cli's flag errors into our one-line exit 2.
func usageError(c *cli.Context, err error, _ bool) error {
	name := "centra"
	if c != nil && c.Command != nil && c.Command.Name != "" {
		name = "centra " + c.Command.Name
	}
	msg := err.Error()
	if rest, ok := strings.CutPrefix(msg, "flag provided but not defined: "); ok {
		msg = "unknown flag -" + strings.TrimLeft(rest, "-") + " for " + name
		msg = strings.Replace(msg, "flag -", "flag --", 1)
	}
	return inputErrorf("run '"+name+" --help' for the flags and an example", "%s", msg)
}

// checkArgs rejects stray positional arguments: urfave/cli stops parsing
// flags at the first one, which would silently drop the rest.
func checkArgs(cmd *cli.Command, action cli.ActionFunc) cli.ActionFunc {
	maxArgs := 0
	if cmd.ArgsUsage != "" {
		maxArgs = strings.Count(cmd.ArgsUsage, " ") + 1
	}
	return func(c *cli.Context) error {
		if c.NArg() > maxArgs {
			extra := c.Args().Slice()[maxArgs:]
			return inputErrorf("put all flags before positional arguments; run 'centra "+cmd.Name+" --help'",
				"unexpected argument %q", strings.Join(extra, " "))
		}
		if err := loadLeapSeconds(c); err != nil {
			return err
		}
		return action(c)
	}
}

// run is main without os.Exit, so tests can call it.
func run(args []string, stdout, stderr io.Writer) int {
	app := newAppFor(stdout, stderr, args)
	err := app.Run(args)
	return exitCode(err, stderr)
}
