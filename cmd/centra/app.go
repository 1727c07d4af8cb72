package main

import (
	"io"
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

func newApp(stdout, stderr io.Writer) *cli.App {
	app := &cli.App{
		Name:                      "centra",
		Usage:                     "orbital and central-force trajectory planner",
		UsageText:                 "centra [--format table|csv|json] [--bodies FILE] [--quiet] COMMAND [flags]\n\nexample: centra orbit --altitude 500 --inclination 97.4",
		Description:               appDescription,
		Writer:                    stdout,
		ErrWriter:                 stderr,
		Flags:                     globalFlags(),
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
	for _, rc := range cmds {
		cmd := rc.make()
		cmd.Flags = append(cmd.Flags, globalFlags()...)
		cmd.Flags = append(cmd.Flags, outputFlags()...)
		cmd.OnUsageError = usageError
		if cmd.Action != nil {
			cmd.Action = checkArgs(cmd, cmd.Action)
		}
		app.Commands = append(app.Commands, cmd)
	}
	return app
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
	app := newApp(stdout, stderr)
	err := app.Run(args)
	return exitCode(err, stderr)
}
