package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"strings"
	"sync"
	"syscall"

	"github.com/urfave/cli/v2"

	"centra/reports"
)

// outputFlags are added to every command.
func outputFlags() []cli.Flag {
	return []cli.Flag{
		&cli.StringFlag{Name: "out", Usage: "write the result to `FILE` (atomically: all or nothing) instead of stdout"},
		&cli.BoolFlag{Name: "force", Usage: "allow --out to replace an existing file"},
	}
}

// lookupString returns the value of a flag declared on the app and on
// the command, from the innermost context that set it.
func lookupString(c *cli.Context, name string) string {
	for _, ctx := range c.Lineage() {
		if ctx.IsSet(name) {
			return ctx.String(name)
		}
	}
	return c.String(name)
}

func lookupBool(c *cli.Context, name string) bool {
	for _, ctx := range c.Lineage() {
		if ctx.IsSet(name) {
			return ctx.Bool(name)
		}
	}
	return c.Bool(name)
}

// output is where a command writes its result.
type output struct {
	Format string
	W      io.Writer
	Stderr io.Writer
	Quiet  bool

	file   *os.File // temporary file behind --out
	target string
}

// openOutput resolves --format against the formats the command knows
// and opens --out atomically.
func openOutput(c *cli.Context, formats ...string) (*output, error) {
	if len(formats) == 0 {
		formats = []string{"table", "csv", "json"}
	}
	f := strings.ToLower(lookupString(c, "format"))
	ok := false
	for _, x := range formats {
		ok = ok || x == f
	}
	if !ok {
		return nil, inputErrorf("use --format "+strings.Join(formats, ", "), "--format %q is not a format of %q", f, c.Command.Name)
	}
	o := &output{Format: f, W: c.App.Writer, Stderr: c.App.ErrWriter, Quiet: lookupBool(c, "quiet")}
	path := c.String("out")
	if path == "" {
		return o, nil
	}
	if err := o.openFile(path, c.Bool("force")); err != nil {
		return nil, err
	}
	return o, nil
}

func (o *output) openFile(path string, force bool) error {
	dir := filepath.Dir(path)
	st, err := os.Stat(dir)
	if err != nil || !st.IsDir() {
		return inputErrorf("create the directory first or choose another path", "--out %q: directory %q does not exist", path, dir)
	}
	if fi, err := os.Stat(path); err == nil {
		if fi.IsDir() {
			return inputErrorf("give a file name, not a directory", "--out %q is a directory", path)
		}
		if !fi.Mode().IsRegular() {
			// The rename that commits the file would replace the device
			// or pipe itself (as root, /dev/null).
			kind := "a special file"
			switch m := fi.Mode(); {
			case m&os.ModeDevice != 0:
				kind = "a device"
			case m&os.ModeNamedPipe != 0:
				kind = "a named pipe"
			case m&os.ModeSocket != 0:
				kind = "a socket"
			}
			return inputErrorf("give the name of a regular file, or leave out --out and redirect stdout", "--out %q is %s, not a regular file", path, kind)
		}
		if !force {
			return inputErrorf("add --force to replace it or choose another name", "--out %q already exists", path)
		}
	}
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return inputErrorf("check the directory's permissions or choose another path", "--out %q cannot be written: %v", path, unwrapPathError(err))
	}
	trackTemp(tmp.Name())
	o.file, o.target, o.W = tmp, path, tmp
	return nil
}

func unwrapPathError(err error) error {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}

// finish commits the --out file when err is nil and removes it
// otherwise. It returns err, or the commit's own error.
func (o *output) finish(err error) error {
	var ee *expectationError
	if o != nil && o.Stderr != nil && (err == nil || errors.As(err, &ee)) {
		flushLeapWarning(o.Stderr)
	}
	if o == nil || o.file == nil {
		return err
	}
	name := o.file.Name()
	defer untrackTemp(name)
	if errors.As(err, &ee) {
		// A failed expectation is a verdict on a complete result: keep it.
		if cerr := o.finish(nil); cerr != nil {
			return cerr
		}
		return err
	}
	if err != nil {
		o.file.Close()
		os.Remove(name)
		return err
	}
	// CreateTemp makes the file private; a result is an ordinary file.
	if err := o.file.Chmod(0o644); err != nil {
		o.file.Close()
		os.Remove(name)
		return inputErrorf("check the file system", "--out %q: %v", o.target, err)
	}
	if err := o.file.Sync(); err != nil {
		o.file.Close()
		os.Remove(name)
		return inputErrorf("check the disk", "--out %q: %v", o.target, err)
	}
	if err := o.file.Close(); err != nil {
		os.Remove(name)
		return inputErrorf("check the disk", "--out %q: %v", o.target, err)
	}
	if err := os.Rename(name, o.target); err != nil {
		os.Remove(name)
		return inputErrorf("check the directory's permissions", "--out %q: %v", o.target, unwrapPathError(err))
	}
	return nil
}

// warn prints a warning on stderr unless --quiet.
func (o *output) warn(format string, args ...any) {
	if o.Quiet {
		return
	}
	fmt.Fprintf(o.Stderr, "centra: warning: "+format+"\n", args...)
}

// emit writes one record in the chosen format; for tables, title heads
// the summary and lists follow under their own headings.
func (o *output) emit(title string, r reports.Record) error {
	switch o.Format {
	case "json":
		return reports.WriteJSON(o.W, r)
	case "csv":
		return reports.WriteCSV(o.W, r)
	}
	if err := reports.WriteTitle(o.W, title); err != nil {
		return err
	}
	return reports.WriteSummaryTable(o.W, r)
}

// Temporary files of --out are removed on Ctrl-C or SIGTERM.
var (
	tempMu    sync.Mutex
	tempFiles = map[string]bool{}
	sigOnce   sync.Once
)

func trackTemp(name string) {
	sigOnce.Do(func() {
		ch := make(chan os.Signal, 1)
		signal.Notify(ch, os.Interrupt, syscall.SIGTERM)
		go func() {
			s := <-ch
			tempMu.Lock()
			for n := range tempFiles {
				os.Remove(n)
			}
			tempMu.Unlock()
			fmt.Fprintf(os.Stderr, "centra: interrupted (%v); no output file was written\n", s)
			os.Exit(130)
		}()
	})
	tempMu.Lock()
	tempFiles[name] = true
	tempMu.Unlock()
}

func untrackTemp(name string) {
	tempMu.Lock()
	delete(tempFiles, name)
	tempMu.Unlock()
}
