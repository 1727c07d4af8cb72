package main

import (
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/urfave/cli/v2"
)

// Exit codes of the command-line contract.
const (
	exitOK          = 0
	exitExpectation = 1
	exitInput       = 2
)

// inputError is anything the user's input caused: exit 2, one line
// "centra: <what is wrong>; <how to fix it>".
type inputError struct {
	What, Fix string
}

func (e *inputError) Error() string {
	if e.Fix == "" {
		return e.What
	}
	return e.What + "; " + e.Fix
}

func inputErrorf(fix, format string, args ...any) error {
	return &inputError{What: fmt.Sprintf(format, args...), Fix: fix}
}

// expectationError reports failed --expect assertions: exit 1.
type expectationError struct{ Failed, Total int }

func (e *expectationError) Error() string {
	return fmt.Sprintf("%d of %d expectations failed; see the expectation table", e.Failed, e.Total)
}

// exitCode maps an error to the contract's exit code and writes the one
// line message to stderr.
func exitCode(err error, stderr io.Writer) int {
	if err == nil {
		return exitOK
	}
	var ee *expectationError
	if errors.As(err, &ee) {
		fmt.Fprintf(stderr, "centra: %s\n", oneLine(err.Error()))
		return exitExpectation
	}
	var ie *inputError
	if errors.As(err, &ie) {
		fmt.Fprintf(stderr, "centra: %s\n", oneLine(err.Error()))
		return exitInput
	}
	var ec cli.ExitCoder
	if errors.As(err, &ec) && ec.ExitCode() == 0 {
		return exitOK
	}
	// Anything else (flag parsing inside urfave/cli, I/O on stdout) is
	// still the user's to fix; say what happened in one line.
	fmt.Fprintf(stderr, "centra: %s; run 'centra --help' or 'centra COMMAND --help'\n", oneLine(err.Error()))
	return exitInput
}

func oneLine(s string) string {
	s = strings.TrimSpace(s)
	s = strings.ReplaceAll(s, "\r", " ")
	return strings.ReplaceAll(s, "\n", " ")
}
