package ccsds

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// OEMState is one data line of an OEM.
type OEMState struct {
	Epoch    string     // as written
	Position [3]float64 // km
	Velocity [3]float64 // km/s
}

// OEM is an Orbit Ephemeris Message (CCSDS 502.0-B-2, section 5) with one
// or more segments; Meta holds each segment's metadata keywords.
type OEM struct {
	Version      string
	CreationDate string
	Originator   string
	Segments     []OEMSegment
}

// OEMSegment is one metadata block and its data lines.
type OEMSegment struct {
	Meta   map[string]string
	States []OEMState
}

var oemMetaMandatory = []string{"OBJECT_NAME", "OBJECT_ID", "CENTER_NAME", "REF_FRAME", "TIME_SYSTEM", "START_TIME", "STOP_TIME"}

var oemMetaOptional = map[string]bool{"REF_FRAME_EPOCH": true, "USEABLE_START_TIME": true, "USEABLE_STOP_TIME": true, "INTERPOLATION": true, "INTERPOLATION_DEGREE": true}

// ParseOEM reads an OEM in KVN form (covariance blocks are refused: centra
// writes none). name is used in errors.
func ParseOEM(r io.Reader, name string) (*OEM, error) {
	m := &OEM{}
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), 1<<20)
	line := 0
	bad := func(format string, args ...any) error {
		return &Error{File: name, Line: line, Msg: fmt.Sprintf(format, args...), Err: ErrSyntax}
	}
	state := "header"
	var seg *OEMSegment
	for sc.Scan() {
		line++
		text := strings.TrimSpace(sc.Text())
		if text == "" || strings.HasPrefix(text, "COMMENT") {
			continue
		}
		switch {
		case text == "META_START":
			if state == "meta" {
				return nil, bad("META_START inside a metadata block")
			}
			if m.Version == "" {
				return nil, bad("CCSDS_OEM_VERS must come first")
			}
			m.Segments = append(m.Segments, OEMSegment{Meta: map[string]string{}})
			seg = &m.Segments[len(m.Segments)-1]
			state = "meta"
			continue
		case text == "META_STOP":
			if state != "meta" {
				return nil, bad("META_STOP without META_START")
			}
			for _, k := range oemMetaMandatory {
				if _, ok := seg.Meta[k]; !ok {
					return nil, &Error{File: name, Line: line, Msg: "metadata keyword " + k + " is missing", Err: ErrMissing}
				}
			}
			state = "data"
			continue
		case text == "COVARIANCE_START":
			return nil, bad("covariance blocks are not read by centra")
		}
		switch state {
		case "header":
			key, val, _, ok := splitKVN(text)
			if !ok {
				return nil, bad("%q is not KEYWORD = VALUE", clip(text))
			}
			switch key {
			case "CCSDS_OEM_VERS":
				m.Version = val
			case "CREATION_DATE":
				m.CreationDate = val
			case "ORIGINATOR":
				m.Originator = val
			case "MESSAGE_ID":
			default:
				return nil, bad("unknown header keyword %s", key)
			}
		case "meta":
			key, val, _, ok := splitKVN(text)
			if !ok {
				return nil, bad("%q is not KEYWORD = VALUE", clip(text))
			}
			known := oemMetaOptional[key]
			for _, k := range oemMetaMandatory {
				known = known || k == key
			}
			if !known {
				return nil, bad("unknown metadata keyword %s", key)
			}
			seg.Meta[key] = val
		case "data":
			f := strings.Fields(text)
			if len(f) != 7 && len(f) != 10 {
				return nil, bad("a data line has an epoch and 6 (or 9, with accelerations) numbers, not %d fields", len(f))
			}
			st := OEMState{Epoch: f[0]}
			for i := 0; i < 6; i++ {
				x, err := strconv.ParseFloat(f[i+1], 64)
				if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
					return nil, bad("field %d %q is not a finite number", i+2, clip(f[i+1]))
				}
				if i < 3 {
					st.Position[i] = x
				} else {
					st.Velocity[i-3] = x
				}
			}
			seg.States = append(seg.States, st)
		}
	}
	if err := sc.Err(); err != nil {
		return nil, &Error{File: name, Line: line, Msg: err.Error(), Err: ErrSyntax}
	}
	if m.Version == "" || m.CreationDate == "" || m.Originator == "" {
		return nil, &Error{File: name, Msg: "the header needs CCSDS_OEM_VERS, CREATION_DATE and ORIGINATOR", Err: ErrMissing}
	}
	if len(m.Segments) == 0 || state == "meta" {
		return nil, &Error{File: name, Msg: "no complete metadata block", Err: ErrMissing}
	}
	return m, nil
}
