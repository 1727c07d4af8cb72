package bodies

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"github.com/BurntSushi/toml"
)

// MaxFileSize is the largest bodies file [LoadFile] reads, in bytes.
const MaxFileSize = 1 << 20

// maxTextLen is the longest description or source text, in characters.
const maxTextLen = 300

// The keys of one [body.NAME] table. Zonal keys j2 .. j20 are handled
// apart.
const (
	keyDescription = "description"
	keySource      = "source"
	keyGM          = "gm_km3_s2"
	keyRadius      = "equatorial_radius_km"
	keyMeanRadius  = "mean_radius_km"
	keyFlattening  = "flattening"
	keyRotation    = "rotation_rate_rad_s"
)

// knownKeysText lists the keys for error messages.
var knownKeysText = fmt.Sprintf("%s, %s, %s, %s, %s, %s, %s and j2 to j%d",
	keyGM, keyRadius, keyMeanRadius, keyFlattening, keyRotation, keySource, keyDescription, MaxZonalDegree)

// entryDoc is one [body.NAME] table. Nil pointers are keys not given.
type entryDoc struct {
	Description      *string  `toml:"description"`
	Source           *string  `toml:"source"`
	GM               *float64 `toml:"gm_km3_s2"`
	EquatorialRadius *float64 `toml:"equatorial_radius_km"`
	MeanRadius       *float64 `toml:"mean_radius_km"`
	Flattening       *float64 `toml:"flattening"`
	RotationRate     *float64 `toml:"rotation_rate_rad_s"`

	J2  *float64 `toml:"j2"`
	J3  *float64 `toml:"j3"`
	J4  *float64 `toml:"j4"`
	J5  *float64 `toml:"j5"`
	J6  *float64 `toml:"j6"`
	J7  *float64 `toml:"j7"`
	J8  *float64 `toml:"j8"`
	J9  *float64 `toml:"j9"`
	J10 *float64 `toml:"j10"`
	J11 *float64 `toml:"j11"`
	J12 *float64 `toml:"j12"`
	J13 *float64 `toml:"j13"`
	J14 *float64 `toml:"j14"`
	J15 *float64 `toml:"j15"`
	J16 *float64 `toml:"j16"`
	J17 *float64 `toml:"j17"`
	J18 *float64 `toml:"j18"`
	J19 *float64 `toml:"j19"`
	J20 *float64 `toml:"j20"`
}

// zonals returns the zonal fields indexed by degree (nil below 2).
func (e *entryDoc) zonals() [MaxZonalDegree + 1]*float64 {
	return [MaxZonalDegree + 1]*float64{2: e.J2, 3: e.J3, 4: e.J4, 5: e.J5, 6: e.J6, 7: e.J7,
		8: e.J8, 9: e.J9, 10: e.J10, 11: e.J11, 12: e.J12, 13: e.J13, 14: e.J14, 15: e.J15,
		16: e.J16, 17: e.J17, 18: e.J18, 19: e.J19, 20: e.J20}
}

type fileDoc struct {
	Body map[string]entryDoc `toml:"body"`
}

// keyKind tells what TOML type a known key takes.
type keyKind int

const (
	kindNumber keyKind = iota + 1
	kindString
)

// keyKindOf returns the kind of a known body key, or 0 for an unknown one.
func keyKindOf(k string) keyKind {
	switch k {
	case keyGM, keyRadius, keyMeanRadius, keyFlattening, keyRotation:
		return kindNumber
	case keyDescription, keySource:
		return kindString
	}
	if n, ok := zonalDegree(k); ok && n >= 2 && n <= MaxZonalDegree {
		return kindNumber
	}
	return 0
}

// zonalDegree parses "jN" and returns N.
func zonalDegree(k string) (int, bool) {
	if len(k) < 2 || k[0] != 'j' {
		return 0, false
	}
	n, err := strconv.Atoi(k[1:])
	if err != nil || n < 0 || strconv.Itoa(n) != k[1:] {
		return 0, false
	}
	return n, true
}

// LoadFile reads and parses a bodies file (see [Parse]). A file that
// cannot be read returns a *[FileError] wrapping the operating system's
// error; a file larger than [MaxFileSize] is refused.
func LoadFile(path string) ([]Body, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, &FileError{File: path, Msg: fmt.Sprintf("cannot open: %v; check the path of the bodies file", unwrapPath(err)), Err: err}
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, MaxFileSize+1))
	if err != nil {
		return nil, &FileError{File: path, Msg: fmt.Sprintf("cannot read: %v; check the bodies file", unwrapPath(err)), Err: err}
	}
	if len(data) > MaxFileSize {
		return nil, &FileError{File: path, Msg: fmt.Sprintf("file is larger than %d bytes; a bodies file holds a few small tables", MaxFileSize), Err: ErrSyntax}
	}
	return Parse(data, path)
}

// unwrapPath drops the *os.PathError wrapper, whose path the FileError
// already shows.
func unwrapPath(err error) error {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}

// Parse reads a bodies file's contents; filename is used in error
// messages and sources only. It returns the bodies in the order their
// tables appear, each complete and valid: an entry named like a built-in
// body starts from the built-in constants and replaces only the keys it
// gives; an entry with a new name must give gm_km3_s2 and
// equatorial_radius_km, and the other constants default to 0. The format
// is described in the package documentation.
//
// Errors are *[FileError] values wrapping [ErrSyntax], [ErrUnknownKey],
// [ErrBadValue], [ErrMissingKey] or [ErrBadName]; they name the file, the
// line (when the TOML library reports it), the body, the key and the fix.
func Parse(data []byte, filename string) ([]Body, error) {
	src := string(data)
	fail := func(line int, body, key string, class error, format string, args ...any) error {
		return &FileError{File: filename, Line: line, Body: body, Key: key, Msg: fmt.Sprintf(format, args...), Err: class}
	}

	// Phase 1: syntax, and the shape of the document.
	var raw map[string]any
	md, err := toml.Decode(src, &raw)
	if err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, fail(pe.Position.Line, "", "", ErrSyntax, "%s; fix the TOML syntax (see the bodies file format in the documentation)", pe.Message)
		}
		return nil, fail(0, "", "", ErrSyntax, "%s; fix the TOML syntax", strings.TrimPrefix(err.Error(), "toml: "))
	}
	var order []string // body table names as written, in file order
	inOrder := make(map[string]bool)
	for _, k := range md.Keys() {
		// A body's table may be implicit (dotted keys), so take its name
		// from the first key under it.
		if len(k) >= 2 && k[0] == "body" && !inOrder[k[1]] {
			inOrder[k[1]] = true
			order = append(order, k[1])
		}
		switch {
		case k[0] != "body":
			if strings.EqualFold(k[0], "body") {
				return nil, fail(keyLine(src, k[:1]), "", k[0], ErrUnknownKey, "unknown top-level key; keys are lower case: write [body.NAME]")
			}
			// Other unknown top-level keys are reported through
			// MetaData.Undecoded below.
		case len(k) == 1:
			if t := md.Type(k...); t != "" && t != "Hash" {
				return nil, fail(keyLine(src, k), "", "body", ErrBadValue, "body is %s, not a table; give each body as a table [body.NAME]", typeName(t))
			}
		case len(k) == 2:
			if t := md.Type(k...); t != "" && t != "Hash" {
				return nil, fail(keyLine(src, k), k[1], "", ErrBadValue, "body.%s is %s, not a table; give the body as a table [body.%s] with key = value lines", k[1], typeName(t), k[1])
			}
		case len(k) == 3:
			kind := keyKindOf(k[2])
			if kind == 0 {
				if keyKindOf(strings.ToLower(k[2])) != 0 {
					return nil, fail(keyLine(src, k), k[1], k[2], ErrUnknownKey, "unknown key; keys are lower case: write %s", strings.ToLower(k[2]))
				}
				continue // reported through MetaData.Undecoded below
			}
			t := md.Type(k...)
			switch {
			case kind == kindNumber && t != "Integer" && t != "Float":
				return nil, fail(keyLine(src, k), k[1], k[2], ErrBadValue, "value is %s; give a number, for example %s = 1.5e3", typeName(t), k[2])
			case kind == kindString && t != "String":
				return nil, fail(keyLine(src, k), k[1], k[2], ErrBadValue, "value is %s; give a quoted string, for example %s = \"...\"", typeName(t), k[2])
			}
		}
	}

	// Phase 2: decode into the typed document.
	var doc fileDoc
	md, err = toml.Decode(src, &doc)
	if err != nil {
		var pe toml.ParseError
		body, key := "", ""
		if errors.As(err, &pe) {
			if parts := strings.Split(pe.LastKey, "."); len(parts) >= 3 && parts[0] == "body" {
				body, key = parts[1], parts[2]
			}
			return nil, fail(pe.Position.Line, body, key, ErrBadValue, "%s; write the number with a decimal point or an exponent, for example 1.5e3", pe.Message)
		}
		return nil, fail(0, "", "", ErrBadValue, "%s", strings.TrimPrefix(err.Error(), "toml: "))
	}

	// Phase 3: keys that the typed document did not take are unknown.
	for _, k := range md.Undecoded() {
		if k[0] != "body" || len(k) < 3 {
			return nil, fail(keyLine(src, k), "", k.String(), ErrUnknownKey, "unknown top-level key; a bodies file holds only [body.NAME] tables")
		}
		msg := "unknown key; the keys of a body are " + knownKeysText
		if n, ok := zonalDegree(k[2]); ok {
			switch {
			case n < 2:
				msg = "J0 and J1 cannot be set (J0 is 1 by definition and J1 vanishes in a centre-of-mass frame); give j2 to j" + strconv.Itoa(MaxZonalDegree)
			default:
				msg = fmt.Sprintf("zonal coefficients are supported up to j%d; remove the higher ones", MaxZonalDegree)
			}
		} else if k[2] == "j" {
			msg = "zonal coefficients are not an array; give them one per key, j2 = ..., j3 = ..."
		}
		return nil, fail(keyLine(src, k[:3]), k[1], k[2], ErrUnknownKey, "%s", msg)
	}

	// Phase 4: build and check each body.
	out := make([]Body, 0, len(order))
	seen := make(map[string]string) // normalized name -> name as written
	for _, rawName := range order {
		line := func(key ...string) int { return keyLine(src, append(toml.Key{"body", rawName}, key...)) }
		name := normalizeName(rawName)
		if !validName(name) {
			return nil, fail(line(), rawName, "", ErrBadName, "not a valid body name; %s", nameRule)
		}
		if first, dup := seen[name]; dup {
			return nil, fail(line(), rawName, "", ErrBadName, "body is defined twice (also as [body.%s] on line %d); names are case-insensitive, keep one table", first, keyLine(src, toml.Key{"body", first}))
		}
		seen[name] = rawName
		e := doc.Body[rawName]

		var b Body
		builtinBody, isBuiltin := builtinCatalogue.bodies[name]
		if isBuiltin {
			b = *builtinBody.Clone()
		} else {
			var missing []string
			if e.GM == nil {
				missing = append(missing, keyGM)
			}
			if e.EquatorialRadius == nil {
				missing = append(missing, keyRadius)
			}
			if len(missing) > 0 {
				it := "it"
				if len(missing) > 1 {
					it = "them"
				}
				return nil, fail(line(), rawName, "", ErrMissingKey, "a new body needs %s; give %s, or use a built-in name (%s) to override only some constants",
					strings.Join(missing, " and "), it, strings.Join(Names(), ", "))
			}
			b = Body{
				Name:             name,
				FlatteningSource: "not given (0)",
				JSource:          "not given (none)",
				RotationSource:   "not given (0)",
			}
		}

		var srcText string
		if e.Source != nil {
			if msg := checkText(*e.Source); msg != "" {
				return nil, fail(line(keySource), rawName, keySource, ErrBadValue, "%s", msg)
			}
			srcText = strings.TrimSpace(*e.Source)
		}
		source := Source("bodies file " + filename)
		if filename == "" {
			source = "bodies file"
		}
		if srcText != "" {
			source = Source(srcText) + " (" + source + ")"
		}
		if e.Description != nil {
			if msg := checkText(*e.Description); msg != "" {
				return nil, fail(line(keyDescription), rawName, keyDescription, ErrBadValue, "%s", msg)
			}
			b.Description = strings.TrimSpace(*e.Description)
		}

		type numKey struct {
			key  string
			v    *float64
			dst  *float64
			src  *Source
			ok   func(float64) bool
			why  string // what is wrong when ok is false
			what string // what to give
		}
		positive := func(x float64) bool { return x > 0 }
		nums := []numKey{
			{keyGM, e.GM, &b.GM, &b.GMSource, positive, "is not greater than 0",
				"give the gravitational parameter GM in km^3/s^2, a number greater than 0"},
			{keyRadius, e.EquatorialRadius, &b.EquatorialRadius, &b.RadiusSource, positive, "is not greater than 0",
				"give the equatorial radius in km, a number greater than 0"},
			{keyMeanRadius, e.MeanRadius, &b.MeanRadius, &b.MeanRadiusSource, positive, "is not greater than 0",
				"give the mean radius in km, a number greater than 0, or leave the key out"},
			{keyFlattening, e.Flattening, &b.Flattening, &b.FlatteningSource, func(x float64) bool { return x >= 0 && x < 1 }, "is outside [0, 1)",
				"give the flattening (a-b)/a, at least 0 (a sphere) and less than 1"},
			{keyRotation, e.RotationRate, &b.RotationRate, &b.RotationSource, func(float64) bool { return true }, "",
				"give the sidereal rotation rate in rad/s (negative for retrograde)"},
		}
		for _, nk := range nums {
			if nk.v == nil {
				continue
			}
			x := *nk.v
			if !finite(x) {
				return nil, fail(line(nk.key), rawName, nk.key, ErrBadValue, "%v is not a finite number; %s", x, nk.what)
			}
			if !nk.ok(x) {
				return nil, fail(line(nk.key), rawName, nk.key, ErrBadValue, "%s %s; %s", strconv.FormatFloat(x, 'g', -1, 64), nk.why, nk.what)
			}
			*nk.dst = x
			*nk.src = source
		}
		var given []string // zonal keys given, in degree order
		for n, v := range e.zonals() {
			if v == nil {
				continue
			}
			key := "j" + strconv.Itoa(n)
			x := *v
			if !finite(x) || math.Abs(x) > 1 {
				return nil, fail(line(key), rawName, key, ErrBadValue,
					"%s is not a plausible zonal coefficient; give the unnormalized J_%d, finite and |J_%d| <= 1 (Earth's J2 is 1.0826e-3)",
					strconv.FormatFloat(x, 'g', -1, 64), n, n)
			}
			if len(b.J) <= n {
				b.J = append(b.J, make([]float64, n+1-len(b.J))...)
			}
			b.J[n] = x
			given = append(given, key)
		}
		if len(given) > 0 {
			b.JSource = source
			if isBuiltin {
				for n := 2; n <= builtinBody.Degree(); n++ {
					if builtinBody.J[n] != 0 && e.zonals()[n] == nil {
						b.JSource = Source(fmt.Sprintf("%s from %s; the other J_n from %s", strings.Join(given, ", "), source, builtinBody.JSource))
						break
					}
				}
			}
		}
		if err := b.Validate(); err != nil {
			// Unreachable when the checks above are complete; kept so that
			// Parse never returns an unphysical body.
			return nil, fail(line(), rawName, "", ErrBadValue, "%v", err)
		}
		out = append(out, b)
	}
	return out, nil
}

// checkText returns "" when s is an acceptable one-line text, else the
// reason and fix.
func checkText(s string) string {
	if !utf8.ValidString(s) {
		return "text is not valid UTF-8; save the file as UTF-8"
	}
	if utf8.RuneCountInString(s) > maxTextLen {
		return fmt.Sprintf("text is longer than %d characters; shorten it", maxTextLen)
	}
	for _, r := range s {
		if unicode.IsControl(r) {
			return "text holds a line break or control character; keep it to one line"
		}
	}
	return ""
}

// typeName turns a TOML library type name into words, with an article,
// for messages.
func typeName(t string) string {
	switch t {
	case "Integer":
		return "an integer"
	case "Float":
		return "a number"
	case "String":
		return "a string"
	case "Bool":
		return "a boolean"
	case "Array":
		return "an array"
	case "Hash":
		return "a table"
	case "ArrayHash":
		return "an array of tables"
	case "Datetime", "DatetimeLocal", "DateLocal", "TimeLocal":
		return "a date or time"
	}
	return "a " + strings.ToLower(t)
}

// lineProbe is decoded into a TOML value only to make the library report
// the value's position.
type lineProbe struct{}

var errProbe = errors.New("probe")

func (*lineProbe) UnmarshalTOML(any) error { return errProbe }

// keyLine returns the 1-based line on which the TOML library says key is
// defined, or 0 when it does not say. It decodes the document again into
// nested primitives, walks down to key, and decodes that value into a
// type that always fails: the library's error carries the position.
func keyLine(src string, key toml.Key) int {
	if len(key) == 0 {
		return 0
	}
	var top map[string]toml.Primitive
	md, err := toml.Decode(src, &top)
	if err != nil {
		return 0
	}
	p, ok := top[key[0]]
	if !ok {
		return 0
	}
	for _, k := range key[1:] {
		var m map[string]toml.Primitive
		if err := md.PrimitiveDecode(p, &m); err != nil || m == nil {
			return 0
		}
		if p, ok = m[k]; !ok {
			return 0
		}
	}
	var probe lineProbe
	var pe toml.ParseError
	if errors.As(md.PrimitiveDecode(p, &probe), &pe) {
		return pe.Position.Line
	}
	return 0
}
