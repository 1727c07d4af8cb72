package bodies

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
)

// Error classes. Every error returned by this package wraps exactly one of
// them (or, for [LoadFile], the operating system's error); test with
// [errors.Is].
var (
	// ErrUnknownBody: a name that is neither built in nor defined in a
	// bodies file. See [UnknownBodyError].
	ErrUnknownBody = errors.New("bodies: unknown body")
	// ErrInvalidBody: a Body whose constants are not physical. See
	// [BodyError].
	ErrInvalidBody = errors.New("bodies: invalid body constant")

	// ErrSyntax: a bodies file that is not valid TOML.
	ErrSyntax = errors.New("bodies: bodies file is not valid TOML")
	// ErrUnknownKey: a key the bodies file format does not define.
	ErrUnknownKey = errors.New("bodies: unknown key in bodies file")
	// ErrBadValue: a value of the wrong type, not finite, or out of range.
	ErrBadValue = errors.New("bodies: bad value in bodies file")
	// ErrMissingKey: a new body without gm_km3_s2 or equatorial_radius_km.
	ErrMissingKey = errors.New("bodies: missing key in bodies file")
	// ErrBadName: a body name that is empty, too long, uses characters
	// other than a-z, 0-9, '-' and '_', or is defined twice.
	ErrBadName = errors.New("bodies: bad body name in bodies file")
)

// UnknownBodyError reports a name that the catalogue does not hold, with
// the names it does hold.
type UnknownBodyError struct {
	Name  string   // the name as given
	Known []string // the catalogue's names, sorted
}

func (e *UnknownBodyError) Error() string {
	return fmt.Sprintf("bodies: unknown body %q; use one of %s, or define it in a bodies file",
		e.Name, strings.Join(e.Known, ", "))
}

// Unwrap returns [ErrUnknownBody].
func (e *UnknownBodyError) Unwrap() error { return ErrUnknownBody }

// BodyError reports one unphysical constant of a Body (see
// [Body.Validate]).
type BodyError struct {
	Body   string  // the body's name
	Field  string  // the bodies-file key of the constant, e.g. "gm_km3_s2"
	Value  float64 // the offending value (unused for "name")
	Reason string  // the rule it breaks
	Err    error   // ErrInvalidBody
}

func (e *BodyError) Error() string {
	if e.Field == "name" {
		return fmt.Sprintf("bodies: body name %q is not valid; %s", e.Body, e.Reason)
	}
	return fmt.Sprintf("bodies: body %q: %s = %s is not valid; %s",
		e.Body, e.Field, strconv.FormatFloat(e.Value, 'g', -1, 64), e.Reason)
}

// Unwrap returns the error class.
func (e *BodyError) Unwrap() error { return e.Err }

// FileError reports a problem in a bodies file: which file, which line
// (when the TOML library knows it), which body and key, what is wrong and
// how to fix it.
type FileError struct {
	File string // the file name given to Parse or LoadFile ("" if none)
	Line int    // 1-based line, or 0 when unknown
	Body string // the body's name as written, or "" when not about one body
	Key  string // the key as written, or "" when not about one key
	Msg  string // "what is wrong; how to fix it"
	Err  error  // the class: ErrSyntax, ErrUnknownKey, ErrBadValue, ErrMissingKey, ErrBadName, or an I/O error
}

func (e *FileError) Error() string {
	var b strings.Builder
	b.WriteString("bodies: ")
	file := e.File
	if file == "" {
		file = "bodies file"
	}
	b.WriteString(file)
	if e.Line > 0 {
		b.WriteString(":")
		b.WriteString(strconv.Itoa(e.Line))
	}
	b.WriteString(": ")
	if e.Body != "" {
		fmt.Fprintf(&b, "body %q: ", e.Body)
	}
	if e.Key != "" {
		fmt.Fprintf(&b, "key %q: ", e.Key)
	}
	b.WriteString(e.Msg)
	return b.String()
}

// Unwrap returns the error class.
func (e *FileError) Unwrap() error { return e.Err }
