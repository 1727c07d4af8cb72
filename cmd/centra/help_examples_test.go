package main

import (
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Every command's --help shows an example, and the examples run as
// written (in a scratch directory, so --out examples write there). An
// example that names a file the user would bring (a mission, a bodies
// file, a mask, an OPM) is run only when the file exists in the repository.
func TestHelpExamplesRun(t *testing.T) {
	if testing.Short() {
		t.Skip("runs every example")
	}
	app := newApp(io.Discard, io.Discard)
	root, _ := filepath.Abs(filepath.Join("..", ".."))
	scratch := t.TempDir()
	for _, cmd := range app.Commands {
		if cmd.Name == "help" {
			continue
		}
		var examples []string
		text := strings.ReplaceAll(cmd.UsageText, "\\\n", " ")
		for _, line := range strings.Split(text, "\n") {
			l := strings.Join(strings.Fields(line), " ")
			if strings.HasPrefix(l, "centra ") && strings.Contains(cmd.UsageText, "example") && !strings.ContainsAny(l, "[]|<>$") {
				examples = append(examples, l)
			}
		}
		if len(examples) == 0 {
			t.Errorf("centra %s --help shows no runnable example", cmd.Name)
			continue
		}
		for _, ex := range examples {
			args := strings.Fields(ex)[1:]
			skip := false
			for i, a := range args {
				a = strings.Trim(a, `'"`)
				args[i] = a
				if strings.HasSuffix(a, ".toml") || strings.HasSuffix(a, ".txt") || strings.HasSuffix(a, ".opm") || strings.HasSuffix(a, ".list") {
					if _, err := os.Stat(filepath.Join(root, a)); err != nil {
						skip = true
					} else {
						args[i] = filepath.Join(root, a)
					}
				}
			}
			if skip {
				continue
			}
			t.Run(cmd.Name+"/"+strings.Join(args, "_"), func(t *testing.T) {
				t.Parallel()
				_, stderr, code := runBinaryIn(t, scratch, args...)
				if code != 0 && code != 1 {
					t.Errorf("example %q: exit %d: %s", ex, code, stderr)
				}
			})
		}
	}
}

func TestCompletion(t *testing.T) {
	out, _, code := runBinary(t, "completion", "bash")
	if code != 0 || !strings.Contains(out, "complete -o") || !strings.Contains(out, "--generate-bash-completion") {
		t.Errorf("completion bash: exit %d\n%s", code, out)
	}
	out, _, _ = runBinary(t, "--generate-bash-completion")
	for _, c := range []string{"orbit", "ephemeris", "demo"} {
		if !strings.Contains(out, c+"\n") {
			t.Errorf("completion does not list %s:\n%s", c, out)
		}
	}
	out, _, _ = runBinary(t, "orbit", "--alt", "--generate-bash-completion")
	if !strings.Contains(out, "--altitude") {
		t.Errorf("flag completion: %q", out)
	}
	if _, stderr, code := runBinary(t, "completion", "fish"); code != 2 || !strings.Contains(stderr, "bash or zsh") {
		t.Errorf("completion fish: exit %d %q", code, stderr)
	}
}
