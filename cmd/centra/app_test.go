package main

import (
	"bytes"
	"slices"
	"strings"
	"testing"

	"github.com/urfave/cli/v2"
)

func TestCommandToken(t *testing.T) {
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"centra"}, ""},
		{[]string{"centra", "orbit", "--altitude", "500"}, "orbit"},
		{[]string{"centra", "--format", "json", "ephemeris"}, "ephemeris"},
		{[]string{"centra", "--format=csv", "--quiet", "passes"}, "passes"},
		{[]string{"centra", "-format", "csv", "lifetime"}, "lifetime"},
		{[]string{"centra", "--bodies", "orbit", "transfer"}, "transfer"}, // a file named orbit
		{[]string{"centra", "--leap-seconds", "f.list", "--quiet", "demo"}, "demo"},
		{[]string{"centra", "--help"}, ""},
		{[]string{"centra", "--", "orbit"}, ""},
		{[]string{"centra", "--format"}, ""},
	}
	for _, c := range cases {
		if got := commandToken(c.args); got != c.want {
			t.Errorf("commandToken(%q) = %q, want %q", c.args, got, c.want)
		}
	}
}

// TestLazyAppSameAsFull: the application built for one command line
// prints the same help, for the program and for every command, as the
// fully built one, and a command whose flags were left out (reached only
// if urfave/cli dispatched differently from commandToken) still runs.
func TestLazyAppSameAsFull(t *testing.T) {
	help := func(full bool, args ...string) string {
		var out, errb bytes.Buffer
		argv := append([]string{"centra"}, args...)
		app := newAppFor(&out, &errb, argv)
		if full {
			app = newApp(&out, &errb)
		}
		code := exitCode(app.Run(argv), &errb)
		return out.String() + "|" + errb.String() + "|" + string(rune('0'+code))
	}
	if got, want := help(false, "--help"), help(true, "--help"); got != want {
		t.Errorf("centra --help differs:\n%s\nfull:\n%s", got, want)
	}
	for _, cmd := range newApp(nil, nil).Commands {
		for _, name := range append([]string{cmd.Name}, cmd.Aliases...) {
			got, want := help(false, name, "--help"), help(true, name, "--help")
			if got != want {
				t.Errorf("centra %s --help differs:\n%s\nfull:\n%s", name, got, want)
			}
			if !strings.Contains(got, cmd.Name) {
				t.Errorf("centra %s --help does not name the command:\n%s", name, got)
			}
		}
	}
	// dispatch to a command built without flags
	var out, errb bytes.Buffer
	argv := []string{"centra", "--format", "json", "orbit", "--altitude", "500", "--eccentricity", "0"}
	app := buildApp(&out, &errb, argv, "transfer")
	code := exitCode(app.Run(argv), &errb)
	if code != 0 || !strings.Contains(out.String(), `"period_s"`) {
		t.Errorf("orbit through an unprepared command: exit %d, stdout %q, stderr %q", code, out.String(), errb.String())
	}
}

// TestNoHiddenBoolFlags: namedBool hides the concrete *cli.BoolFlag from
// urfave/cli's completion list, which would then offer a hidden boolean
// flag; there must be none.
func TestNoHiddenBoolFlags(t *testing.T) {
	for _, rc := range registry {
		cmd := rc.make()
		for _, f := range append(cmd.Flags, globalFlags()...) {
			if b, ok := f.(*cli.BoolFlag); ok && b.Hidden {
				t.Errorf("centra %s --%s is a hidden boolean flag", cmd.Name, b.Name)
			}
		}
	}
}

// TestFlagNamesAsUrfave: flagNames gives what urfave/cli's Names gives for
// every flag of every command.
func TestFlagNamesAsUrfave(t *testing.T) {
	for _, rc := range registry {
		cmd := rc.make()
		for _, f := range append(append(cmd.Flags, globalFlags()...), outputFlags()...) {
			if got, want := flagNames(f), f.Names(); !slices.Equal(got, want) {
				t.Errorf("centra %s: flagNames %q, Names %q", cmd.Name, got, want)
			}
		}
	}
}
