package ccsds

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// ErrSyntax and ErrMissing classify parse failures.
var (
	ErrSyntax  = errors.New("ccsds: malformed message")
	ErrMissing = errors.New("ccsds: mandatory keyword missing")
)

// Error is a problem in a message, with its place.
type Error struct {
	File string
	Line int // 1-based; 0 when the problem is the whole message
	Msg  string
	Err  error
}

func (e *Error) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("%s:%d: %s", e.File, e.Line, e.Msg)
	}
	return fmt.Sprintf("%s: %s", e.File, e.Msg)
}

func (e *Error) Unwrap() error { return e.Err }

// OPM is an Orbit Parameter Message (CCSDS 502.0-B-2, section 3).
type OPM struct {
	Version      string
	CreationDate string
	Originator   string
	ObjectName   string
	ObjectID     string
	CenterName   string
	RefFrame     string
	TimeSystem   string
	Epoch        string     // as written; interpret with TimeSystem
	Position     [3]float64 // km
	Velocity     [3]float64 // km/s

	// Keplerian elements block (optional).
	HasKeplerian                    bool
	SemiMajorAxis, Eccentricity     float64 // km, -
	Inclination, RAAN, ArgPeriapsis float64 // deg
	TrueAnomaly, MeanAnomaly        float64 // deg; one of them, see HasTrueAnomaly
	HasTrueAnomaly                  bool
	GM                              float64 // km^3/s^2

	// Spacecraft parameters (optional); Has* says which were given.
	Mass, SolarRadArea, SolarRadCoeff, DragArea, DragCoeff                float64
	HasMass, HasSolarRadArea, HasSolarRadCoeff, HasDragArea, HasDragCoeff bool

	Comments []string
	// Other holds maneuver, covariance and user-defined keywords as text.
	Other map[string]string
}

type keyword struct {
	unit      string // the standard's unit, "" for none
	mandatory bool
	text      bool // value is text, not a number
}

var opmKeywords = map[string]keyword{
	"CCSDS_OPM_VERS":    {mandatory: true, text: true},
	"CREATION_DATE":     {mandatory: true, text: true},
	"ORIGINATOR":        {mandatory: true, text: true},
	"MESSAGE_ID":        {text: true},
	"OBJECT_NAME":       {mandatory: true, text: true},
	"OBJECT_ID":         {mandatory: true, text: true},
	"CENTER_NAME":       {mandatory: true, text: true},
	"REF_FRAME":         {mandatory: true, text: true},
	"REF_FRAME_EPOCH":   {text: true},
	"TIME_SYSTEM":       {mandatory: true, text: true},
	"EPOCH":             {mandatory: true, text: true},
	"X":                 {unit: "km", mandatory: true},
	"Y":                 {unit: "km", mandatory: true},
	"Z":                 {unit: "km", mandatory: true},
	"X_DOT":             {unit: "km/s", mandatory: true},
	"Y_DOT":             {unit: "km/s", mandatory: true},
	"Z_DOT":             {unit: "km/s", mandatory: true},
	"SEMI_MAJOR_AXIS":   {unit: "km"},
	"ECCENTRICITY":      {},
	"INCLINATION":       {unit: "deg"},
	"RA_OF_ASC_NODE":    {unit: "deg"},
	"ARG_OF_PERICENTER": {unit: "deg"},
	"TRUE_ANOMALY":      {unit: "deg"},
	"MEAN_ANOMALY":      {unit: "deg"},
	"GM":                {unit: "km**3/s**2"},
	"MASS":              {unit: "kg"},
	"SOLAR_RAD_AREA":    {unit: "m**2"},
	"SOLAR_RAD_COEFF":   {},
	"DRAG_AREA":         {unit: "m**2"},
	"DRAG_COEFF":        {},
}

// otherKeyword reports keywords of the standard that are kept as text.
func otherKeyword(k string) bool {
	if strings.HasPrefix(k, "MAN_") || strings.HasPrefix(k, "USER_DEFINED_") {
		return true
	}
	if k == "COV_REF_FRAME" {
		return true
	}
	// Covariance: CX_X, CY_X, ..., CZ_DOT_Z_DOT.
	if strings.HasPrefix(k, "C") && strings.Contains(k[1:], "_") {
		parts := []string{"X", "Y", "Z", "X_DOT", "Y_DOT", "Z_DOT"}
		for _, a := range parts {
			for _, b := range parts {
				if k == "C"+a+"_"+b {
					return true
				}
			}
		}
	}
	return false
}

// splitKVN splits "KEY = VALUE [unit]".
func splitKVN(line string) (key, value, unit string, ok bool) {
	k, v, found := strings.Cut(line, "=")
	if !found {
		return "", "", "", false
	}
	key = strings.TrimSpace(k)
	v = strings.TrimSpace(v)
	if i := strings.LastIndex(v, "["); i >= 0 && strings.HasSuffix(v, "]") {
		unit = strings.TrimSpace(v[i+1 : len(v)-1])
		v = strings.TrimSpace(v[:i])
	}
	return key, v, unit, key != ""
}

// ParseOPM reads an OPM in KVN form. name is used in errors.
func ParseOPM(r io.Reader, name string) (*OPM, error) {
	m := &OPM{Other: map[string]string{}}
	seen := map[string]int{}
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), 1<<20)
	line := 0
	bad := func(format string, args ...any) error {
		return &Error{File: name, Line: line, Msg: fmt.Sprintf(format, args...), Err: ErrSyntax}
	}
	for sc.Scan() {
		line++
		text := strings.TrimSpace(sc.Text())
		if text == "" {
			continue
		}
		if strings.HasPrefix(text, "COMMENT") && (len(text) == 7 || text[7] == ' ' || text[7] == '\t') {
			m.Comments = append(m.Comments, strings.TrimSpace(text[7:]))
			continue
		}
		key, val, unit, ok := splitKVN(text)
		if !ok {
			return nil, bad("%q is not KEYWORD = VALUE; the standard allows only keyword lines, COMMENT lines and blank lines", clip(text))
		}
		if line == 1 || len(seen) == 0 {
			if key != "CCSDS_OPM_VERS" {
				return nil, bad("the first keyword must be CCSDS_OPM_VERS, not %s", key)
			}
		}
		if prev, dup := seen[key]; dup && !strings.HasPrefix(key, "MAN_") {
			return nil, bad("%s appears twice (first on line %d)", key, prev)
		}
		seen[key] = line
		kw, known := opmKeywords[key]
		if !known {
			if otherKeyword(key) {
				m.Other[key] = val
				continue
			}
			return nil, bad("unknown keyword %s", key)
		}
		if val == "" {
			return nil, bad("%s has no value", key)
		}
		if unit != "" && !strings.EqualFold(unit, kw.unit) {
			if kw.unit == "" {
				return nil, bad("%s is dimensionless, but the line gives the unit [%s]", key, unit)
			}
			return nil, bad("%s must be in [%s], not [%s]", key, kw.unit, unit)
		}
		if kw.text {
			switch key {
			case "CCSDS_OPM_VERS":
				if val != "1.0" && val != "2.0" {
					return nil, bad("CCSDS_OPM_VERS %s is not a version this reader knows (1.0, 2.0)", val)
				}
				m.Version = val
			case "CREATION_DATE":
				m.CreationDate = val
			case "ORIGINATOR":
				m.Originator = val
			case "OBJECT_NAME":
				m.ObjectName = val
			case "OBJECT_ID":
				m.ObjectID = val
			case "CENTER_NAME":
				m.CenterName = val
			case "REF_FRAME":
				m.RefFrame = val
			case "TIME_SYSTEM":
				m.TimeSystem = val
			case "EPOCH":
				m.Epoch = val
			default:
				m.Other[key] = val
			}
			continue
		}
		x, err := strconv.ParseFloat(val, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return nil, bad("%s = %q is not a finite number", key, clip(val))
		}
		switch key {
		case "X":
			m.Position[0] = x
		case "Y":
			m.Position[1] = x
		case "Z":
			m.Position[2] = x
		case "X_DOT":
			m.Velocity[0] = x
		case "Y_DOT":
			m.Velocity[1] = x
		case "Z_DOT":
			m.Velocity[2] = x
		case "SEMI_MAJOR_AXIS":
			m.SemiMajorAxis = x
		case "ECCENTRICITY":
			m.Eccentricity = x
		case "INCLINATION":
			m.Inclination = x
		case "RA_OF_ASC_NODE":
			m.RAAN = x
		case "ARG_OF_PERICENTER":
			m.ArgPeriapsis = x
		case "TRUE_ANOMALY":
			m.TrueAnomaly, m.HasTrueAnomaly = x, true
		case "MEAN_ANOMALY":
			m.MeanAnomaly = x
		case "GM":
			if x <= 0 {
				return nil, bad("GM = %g must be positive", x)
			}
			m.GM = x
		case "MASS":
			m.Mass, m.HasMass = x, true
		case "SOLAR_RAD_AREA":
			m.SolarRadArea, m.HasSolarRadArea = x, true
		case "SOLAR_RAD_COEFF":
			m.SolarRadCoeff, m.HasSolarRadCoeff = x, true
		case "DRAG_AREA":
			m.DragArea, m.HasDragArea = x, true
		case "DRAG_COEFF":
			m.DragCoeff, m.HasDragCoeff = x, true
		}
		if (key == "MASS" || strings.HasSuffix(key, "_AREA")) && x < 0 {
			return nil, bad("%s = %g must not be negative", key, x)
		}
	}
	if err := sc.Err(); err != nil {
		return nil, &Error{File: name, Line: line, Msg: err.Error(), Err: ErrSyntax}
	}
	for k, kw := range opmKeywords {
		if kw.mandatory {
			if _, ok := seen[k]; !ok {
				return nil, &Error{File: name, Msg: fmt.Sprintf("mandatory keyword %s is missing", k), Err: ErrMissing}
			}
		}
	}
	// The Keplerian block is all or nothing (502.0-B-2, table 3-3).
	kep := []string{"SEMI_MAJOR_AXIS", "ECCENTRICITY", "INCLINATION", "RA_OF_ASC_NODE", "ARG_OF_PERICENTER", "GM"}
	n := 0
	for _, k := range kep {
		if _, ok := seen[k]; ok {
			n++
		}
	}
	_, ta := seen["TRUE_ANOMALY"]
	_, ma := seen["MEAN_ANOMALY"]
	if n > 0 || ta || ma {
		if n != len(kep) || ta == ma {
			return nil, &Error{File: name, Line: firstLine(seen, append(kep, "TRUE_ANOMALY", "MEAN_ANOMALY")), Msg: "the Keplerian elements block needs SEMI_MAJOR_AXIS, ECCENTRICITY, INCLINATION, RA_OF_ASC_NODE, ARG_OF_PERICENTER, GM and exactly one of TRUE_ANOMALY or MEAN_ANOMALY", Err: ErrMissing}
		}
		m.HasKeplerian = true
	}
	return m, nil
}

func firstLine(seen map[string]int, keys []string) int {
	best := 0
	for _, k := range keys {
		if l, ok := seen[k]; ok && (best == 0 || l < best) {
			best = l
		}
	}
	return best
}

func clip(s string) string {
	if len(s) > 40 {
		return s[:40] + "..."
	}
	return s
}
