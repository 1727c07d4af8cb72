package bodies

import (
	"errors"
	"math"
	"testing"
)

// FuzzParseBodiesFile checks that Parse never panics, that every error is
// a *FileError of a known class, and that every accepted body is physical.
// The seed corpus is the unit-test tables (plus testdata/fuzz).
func FuzzParseBodiesFile(f *testing.F) {
	for _, tc := range parseErrorCases {
		f.Add([]byte(tc.src))
	}
	for _, tc := range parseOKCases {
		f.Add([]byte(tc.src))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		bs, err := Parse(data, "fuzz.toml")
		if err != nil {
			var fe *FileError
			if !errors.As(err, &fe) {
				t.Fatalf("error %T %v is not a *FileError", err, err)
			}
			known := false
			for _, class := range []error{ErrSyntax, ErrUnknownKey, ErrBadValue, ErrMissingKey, ErrBadName} {
				known = known || errors.Is(err, class)
			}
			if !known {
				t.Fatalf("error %v has no known class", err)
			}
			return
		}
		for _, b := range bs {
			if err := b.Validate(); err != nil {
				t.Fatalf("accepted an invalid body: %v", err)
			}
			if !(b.GM > 0) || math.IsInf(b.GM, 0) || !(b.EquatorialRadius > 0) || math.IsInf(b.EquatorialRadius, 0) {
				t.Fatalf("accepted an unphysical body: %+v", b)
			}
		}
	})
}
