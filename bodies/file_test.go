package bodies

import (
	"errors"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// parseErrorCases are bodies files that Parse must refuse. They also seed
// FuzzParseBodiesFile.
var parseErrorCases = []struct {
	name    string
	src     string
	wantErr error
	line    int    // 0: not checked
	body    string // as written
	key     string
	msgHas  string // a fragment the message must hold
}{
	{"syntax", "[body.trainer]\ngm_km3_s2 = = 1\n", ErrSyntax, 2, "", "", "fix the TOML syntax"},
	{"duplicate key", "[body.trainer]\ngm_km3_s2 = 1\ngm_km3_s2 = 2\n", ErrSyntax, 3, "", "", ""},
	{"unknown key", "[body.trainer]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\n\nradius = 3\n", ErrUnknownKey, 5, "trainer", "radius", "equatorial_radius_km"},
	{"unknown top-level key", "version = 1\n[body.trainer]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\n", ErrUnknownKey, 1, "", "version", "[body.NAME]"},
	{"upper-case key", "[body.earth]\nJ2 = 1e-3\n", ErrUnknownKey, 2, "earth", "J2", "write j2"},
	{"upper-case table", "[Body.earth]\nj2 = 1e-3\n", ErrUnknownKey, 0, "", "Body", "lower case"},
	{"j1", "[body.earth]\nj1 = 0\n", ErrUnknownKey, 2, "earth", "j1", "J1 vanishes"},
	{"j21", "[body.earth]\nj21 = 1e-9\n", ErrUnknownKey, 2, "earth", "j21", "up to j20"},
	{"j array", "[body.earth]\nj = [0, 0, 1e-3]\n", ErrUnknownKey, 2, "earth", "j", "one per key"},
	{"sub-table", "[body.mars.extra]\nx = 1\n", ErrUnknownKey, 0, "mars", "extra", "unknown key"},
	{"array of tables", "[[body]]\nname = \"trainer\"\n", ErrBadValue, 1, "", "body", "[body.NAME]"},
	{"body not a table", "body = 3\n", ErrBadValue, 1, "", "body", "not a table"},
	{"entry not a table", "[body]\ntrainer = 3\n", ErrBadValue, 2, "trainer", "", "not a table"},
	{"string GM", "[body.trainer]\ngm_km3_s2 = \"3500.5\"\nequatorial_radius_km = 600\n", ErrBadValue, 2, "trainer", "gm_km3_s2", "give a number"},
	{"boolean radius", "[body.mars]\nequatorial_radius_km = true\n", ErrBadValue, 2, "mars", "equatorial_radius_km", "a boolean"},
	{"number source", "[body.mars]\nsource = 3\n", ErrBadValue, 2, "mars", "source", "quoted string"},
	{"negative GM", "[body.trainer]\ngm_km3_s2 = -3500.5\nequatorial_radius_km = 600\n", ErrBadValue, 2, "trainer", "gm_km3_s2", "not greater than 0"},
	{"zero GM override", "[body.earth]\ngm_km3_s2 = 0\n", ErrBadValue, 2, "earth", "gm_km3_s2", "greater than 0"},
	{"NaN GM", "[body.trainer]\ngm_km3_s2 = nan\nequatorial_radius_km = 600\n", ErrBadValue, 2, "trainer", "gm_km3_s2", "not a finite number"},
	{"Inf radius", "[body.trainer]\ngm_km3_s2 = 1\nequatorial_radius_km = inf\n", ErrBadValue, 3, "trainer", "equatorial_radius_km", "not a finite number"},
	{"zero radius", "[body.trainer]\ngm_km3_s2 = 1\nequatorial_radius_km = 0\n", ErrBadValue, 3, "trainer", "equatorial_radius_km", "greater than 0"},
	{"negative mean radius", "[body.earth]\nmean_radius_km = -1\n", ErrBadValue, 2, "earth", "mean_radius_km", "greater than 0"},
	{"flattening 1", "[body.mars]\nflattening = 1\n", ErrBadValue, 2, "mars", "flattening", "[0, 1)"},
	{"negative flattening", "[body.mars]\nflattening = -0.01\n", ErrBadValue, 2, "mars", "flattening", "[0, 1)"},
	{"infinite rotation", "[body.mars]\nrotation_rate_rad_s = -inf\n", ErrBadValue, 2, "mars", "rotation_rate_rad_s", "not a finite number"},
	{"absurd J2", "[body.trainer]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\nj2 = 1.5\n", ErrBadValue, 4, "trainer", "j2", "|J_2| <= 1"},
	{"NaN J3", "[body.earth]\nj3 = nan\n", ErrBadValue, 2, "earth", "j3", "plausible"},
	{"unsafe integer", "[body.earth]\ngm_km3_s2 = 9007199254740993\n", ErrBadValue, 2, "earth", "gm_km3_s2", "decimal point"},
	{"multi-line source", "[body.mars]\nsource = \"\"\"a\nb\"\"\"\n", ErrBadValue, 0, "mars", "source", "one line"},
	{"missing radius", "[body.trainer]\ngm_km3_s2 = 3500.5\n", ErrMissingKey, 1, "trainer", "", "needs equatorial_radius_km; give it"},
	{"missing both", "# a comment\n[body.trainer]\nflattening = 0\n", ErrMissingKey, 2, "trainer", "", "needs gm_km3_s2 and equatorial_radius_km"},
	{"bad name", "[body.\"my planet\"]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\n", ErrBadName, 1, "my planet", "", "a-z, 0-9"},
	{"empty name", "[body.\"\"]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\n", ErrBadName, 0, "", "", "not a valid body name"},
	{"long name", "[body." + strings.Repeat("a", 41) + "]\ngm_km3_s2 = 1\nequatorial_radius_km = 1\n", ErrBadName, 1, strings.Repeat("a", 41), "", "1 to 40"},
	{"twice in different case", "[body.Earth]\nj2 = 1e-3\n\n[body.earth]\nj3 = 0\n", ErrBadName, 4, "earth", "", "also as [body.Earth] on line 1"},
	{"inline tables", "body = { trainer = { gm_km3_s2 = -1, equatorial_radius_km = 1 } }\n", ErrBadValue, 1, "trainer", "gm_km3_s2", "greater than 0"},
}

func TestParseErrors(t *testing.T) {
	for _, tc := range parseErrorCases {
		t.Run(tc.name, func(t *testing.T) {
			bs, err := Parse([]byte(tc.src), "test.toml")
			if !errors.Is(err, tc.wantErr) {
				t.Fatalf("Parse(%q) = %v, %v; want error %v", tc.src, bs, err, tc.wantErr)
			}
			var fe *FileError
			if !errors.As(err, &fe) {
				t.Fatalf("Parse(%q) error %T is not a *FileError", tc.src, err)
			}
			if fe.File != "test.toml" || !strings.Contains(err.Error(), "test.toml") {
				t.Errorf("error %q does not name the file", err)
			}
			if tc.line != 0 && fe.Line != tc.line {
				t.Errorf("error %q: line %d, want %d", err, fe.Line, tc.line)
			}
			if fe.Body != tc.body {
				t.Errorf("error %q: body %q, want %q", err, fe.Body, tc.body)
			}
			if fe.Key != tc.key {
				t.Errorf("error %q: key %q, want %q", err, fe.Key, tc.key)
			}
			if !strings.Contains(err.Error(), tc.msgHas) {
				t.Errorf("error %q does not contain %q", err, tc.msgHas)
			}
			if !strings.Contains(fe.Msg, "; ") && tc.wantErr != ErrSyntax {
				t.Errorf("error %q does not say how to fix it (\"what; fix\")", err)
			}
		})
	}
}

// parseOKCases are bodies files that Parse must accept; they also seed
// FuzzParseBodiesFile.
var parseOKCases = []struct {
	name  string
	src   string
	check func(t *testing.T, bs []Body)
}{
	{"empty file", "", func(t *testing.T, bs []Body) {
		if len(bs) != 0 {
			t.Errorf("got %d bodies, want 0", len(bs))
		}
	}},
	{"new body", "[body.trainer]\ndescription = \"Trainer\"\nsource = \"invented\"\ngm_km3_s2 = 3500.5\nequatorial_radius_km = 600\nj2 = 1e-3\nj4 = -2e-6\nrotation_rate_rad_s = 2.9e-4\n",
		func(t *testing.T, bs []Body) {
			b := one(t, bs)
			if b.Name != "trainer" || b.Description != "Trainer" || b.GM != 3500.5 || b.EquatorialRadius != 600 ||
				b.Flattening != 0 || b.MeanRadius != 0 || b.RotationRate != 2.9e-4 || b.Jn(2) != 1e-3 || b.Jn(3) != 0 || b.Jn(4) != -2e-6 || b.Degree() != 4 {
				t.Errorf("got %+v", b)
			}
			if b.GMSource != "invented (bodies file test.toml)" || b.JSource != b.GMSource || b.RotationSource != b.GMSource {
				t.Errorf("sources: GM %q, J %q, rotation %q", b.GMSource, b.JSource, b.RotationSource)
			}
			if b.FlatteningSource != "not given (0)" {
				t.Errorf("flattening source %q", b.FlatteningSource)
			}
		}},
	{"integers and upper-case name", "[body.TRAINER]\ngm_km3_s2 = 3500\nequatorial_radius_km = 600\n", func(t *testing.T, bs []Body) {
		b := one(t, bs)
		if b.Name != "trainer" || b.GM != 3500 {
			t.Errorf("got %+v", b)
		}
		if b.GMSource != "bodies file test.toml" {
			t.Errorf("GM source %q, want the file named", b.GMSource)
		}
	}},
	{"partial override", "[body.earth]\nj2 = 1.08262668e-3\nsource = \"EGM96\"\n", func(t *testing.T, bs []Body) {
		b := one(t, bs)
		want := mustLookup(t, "earth")
		if b.Jn(2) != 1.08262668e-3 || b.GM != want.GM || b.EquatorialRadius != want.EquatorialRadius ||
			b.Flattening != want.Flattening || b.Jn(3) != want.Jn(3) || b.Jn(6) != want.Jn(6) || b.Description != want.Description {
			t.Errorf("override changed more than J2: %+v", b)
		}
		if b.GMSource != want.GMSource {
			t.Errorf("GM source changed to %q", b.GMSource)
		}
		if !strings.HasPrefix(string(b.JSource), "j2 from EGM96 (bodies file test.toml); the other J_n from EGM2008") {
			t.Errorf("J source %q", b.JSource)
		}
	}},
	{"override all zonals", "[body.mars]\nj2 = 1.9e-3\nj3 = 3e-5\n", func(t *testing.T, bs []Body) {
		b := one(t, bs)
		if b.JSource != "bodies file test.toml" || b.Jn(2) != 1.9e-3 || b.Jn(3) != 3e-5 {
			t.Errorf("got J %v, source %q", b.J, b.JSource)
		}
	}},
	{"zonal added to a body without zonals", "[body.sun]\nj2 = 2.2e-7\n", func(t *testing.T, bs []Body) {
		if b := one(t, bs); b.JSource != "bodies file test.toml" || b.Jn(2) != 2.2e-7 {
			t.Errorf("got J %v, source %q", b.J, b.JSource)
		}
	}},
	{"two bodies in file order, inline and dotted", "[body]\nzeta.gm_km3_s2 = 1\nzeta.equatorial_radius_km = 2\nalpha = { gm_km3_s2 = 3, equatorial_radius_km = 4, flattening = 0.5 }\n",
		func(t *testing.T, bs []Body) {
			if len(bs) != 2 || bs[0].Name != "zeta" || bs[1].Name != "alpha" || bs[1].Flattening != 0.5 {
				t.Errorf("got %+v", bs)
			}
		}},
	{"retrograde rotation and comments", "# comment\n[body.venus] # override\nrotation_rate_rad_s = -2.99e-7\n", func(t *testing.T, bs []Body) {
		if b := one(t, bs); b.RotationRate != -2.99e-7 {
			t.Errorf("got %g", b.RotationRate)
		}
	}},
}

func one(t *testing.T, bs []Body) Body {
	t.Helper()
	if len(bs) != 1 {
		t.Fatalf("got %d bodies, want 1", len(bs))
	}
	return bs[0]
}

func TestParseOK(t *testing.T) {
	for _, tc := range parseOKCases {
		t.Run(tc.name, func(t *testing.T) {
			bs, err := Parse([]byte(tc.src), "test.toml")
			if err != nil {
				t.Fatalf("Parse(%q) error: %v", tc.src, err)
			}
			for i := range bs {
				if err := bs[i].Validate(); err != nil {
					t.Errorf("Parse returned an invalid body: %v", err)
				}
			}
			tc.check(t, bs)
		})
	}
}

func TestParseDoesNotChangeBuiltins(t *testing.T) {
	if _, err := Parse([]byte("[body.earth]\nj2 = 0.5\ngm_km3_s2 = 1\n"), "x.toml"); err != nil {
		t.Fatal(err)
	}
	if e := mustLookup(t, "earth"); e.GM != WGS84GM || e.Jn(2) == 0.5 {
		t.Fatalf("Parse changed the built-in Earth: %+v", e)
	}
}

func TestLoadFile(t *testing.T) {
	// The example file shipped for users (testdata/bodies/trainer.toml).
	path := filepath.Join("..", "testdata", "bodies", "trainer.toml")
	bs, err := LoadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if len(bs) != 2 || bs[0].Name != "trainer" || bs[1].Name != "earth" {
		t.Fatalf("LoadFile(%s) = %+v", path, bs)
	}
	c := NewCatalogue()
	if err := c.Merge(bs...); err != nil {
		t.Fatal(err)
	}
	k, err := c.Lookup("trainer")
	if err != nil || k.GM != 3500.5 || k.EquatorialRadius != 600 {
		t.Fatalf("trainer = %+v, %v", k, err)
	}
	if !strings.Contains(string(k.GMSource), path) {
		t.Errorf("source %q does not name the file", k.GMSource)
	}

	// A missing file.
	_, err = LoadFile(filepath.Join(t.TempDir(), "nope.toml"))
	var fe *FileError
	if !errors.Is(err, fs.ErrNotExist) || !errors.As(err, &fe) || !strings.Contains(err.Error(), "nope.toml") {
		t.Errorf("LoadFile(missing) = %v", err)
	}

	// A file that is too large.
	big := filepath.Join(t.TempDir(), "big.toml")
	if err := os.WriteFile(big, []byte(strings.Repeat("#\n", MaxFileSize/2+1)), 0o600); err != nil {
		t.Fatal(err)
	}
	if _, err := LoadFile(big); !errors.Is(err, ErrSyntax) || !strings.Contains(err.Error(), "larger than") {
		t.Errorf("LoadFile(big) = %v", err)
	}
}

func TestFileErrorFormat(t *testing.T) {
	err := &FileError{File: "f.toml", Line: 3, Body: "trainer", Key: "gm_km3_s2", Msg: "bad; fix", Err: ErrBadValue}
	want := `bodies: f.toml:3: body "trainer": key "gm_km3_s2": bad; fix`
	if err.Error() != want {
		t.Errorf("Error() = %q, want %q", err.Error(), want)
	}
	err = &FileError{Msg: "bad; fix", Err: ErrSyntax}
	if want := "bodies: bodies file: bad; fix"; err.Error() != want {
		t.Errorf("Error() = %q, want %q", err.Error(), want)
	}
	be := &BodyError{Body: "x", Field: "gm_km3_s2", Value: math.Inf(-1), Reason: "r", Err: ErrInvalidBody}
	if want := `bodies: body "x": gm_km3_s2 = -Inf is not valid; r`; be.Error() != want {
		t.Errorf("Error() = %q, want %q", be.Error(), want)
	}
}
