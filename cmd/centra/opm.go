package main

import (
	"errors"
	"fmt"
	"os"
	"strings"
	"time"

	"github.com/urfave/cli/v2"

	"centra/bodies/earthframe"
	"centra/bodies/timescale"
	"centra/cmd/centra/internal/ccsds"
	"centra/orbit"
)

// opmSpacecraft holds the spacecraft parameters an OPM may carry; zero
// values mean not given.
type opmSpacecraft struct {
	Mass, DragArea, DragCoeff, SRPArea, SRPCoeff float64
	Name, ID                                     string
}

// stateFromOPM reads --from-opm into spec: body, epoch and the GCRF state.
func stateFromOPM(c *cli.Context, spec *orbitSpec) error {
	path := c.String("from-opm")
	for _, fl := range []string{"inclination", "raan", "arg-periapsis", "true-anomaly", "mean-anomaly", "eccentricity", "sun-synchronous", "epoch"} {
		if c.IsSet(fl) {
			return inputErrorf("drop --"+fl+": the message gives the whole state and its epoch", "--%s cannot be combined with --from-opm", fl)
		}
	}
	f, err := os.Open(path)
	if err != nil {
		return inputErrorf("check the path", "--from-opm %q cannot be read: %v", path, unwrapPathError(err))
	}
	defer f.Close()
	m, err := ccsds.ParseOPM(f, path)
	if err != nil {
		return inputErrorf("fix the message (CCSDS 502.0-B-2, section 3)", "--from-opm: %v", strings.TrimPrefix(err.Error(), "ccsds: "))
	}
	center := strings.ToLower(m.CenterName)
	if c.IsSet("body") && !strings.EqualFold(c.String("body"), center) {
		return inputErrorf("drop --body or use a message centred on "+c.String("body"), "--body %s contradicts CENTER_NAME = %s in %s", c.String("body"), m.CenterName, path)
	}
	body, err := lookupBody(c, center)
	if err != nil {
		return inputErrorf("use a message centred on a body in 'centra bodies', or add it with --bodies", "--from-opm %s: CENTER_NAME = %s is not a known body", path, m.CenterName)
	}
	ep, err := opmEpoch(m.Epoch, m.TimeSystem)
	if err != nil {
		return inputErrorf("write EPOCH as YYYY-MM-DDThh:mm:ss[.d] or YYYY-DDDThh:mm:ss[.d] in TIME_SYSTEM UTC, TAI, TT or GPS", "--from-opm %s: %v", path, err)
	}
	s := orbit.State{R: m.Position, V: m.Velocity}
	switch frame := strings.ToUpper(m.RefFrame); {
	case frame == "GCRF" || frame == "ICRF" || frame == "EME2000":
		// EME2000 and GCRF differ by the ~20 mas frame bias, ignored for
		// planning (see the README, 'Units and keys').
	case strings.HasPrefix(frame, "ITRF"):
		if body.Name != "earth" {
			return inputErrorf("use an inertial frame for bodies other than Earth", "--from-opm %s: REF_FRAME %s is Earth-fixed but CENTER_NAME is %s", path, m.RefFrame, m.CenterName)
		}
		rot := earthframe.NewRotation(ep, 0)
		s.R, s.V = rot.StateToGCRF(s.R, s.V)
	default:
		return inputErrorf("give the state in GCRF, ICRF, EME2000 or ITRF", "--from-opm %s: REF_FRAME %s is not supported", path, m.RefFrame)
	}
	el, err := orbit.ElementsFromState(body.GM, s)
	if err != nil {
		return inputErrorf("check the state vector in the message", "--from-opm %s: %v", path, err)
	}
	spec.Body, spec.Epoch, spec.State, spec.Elements = body, ep, s, el
	spec.Spacecraft = opmSpacecraft{Name: m.ObjectName, ID: m.ObjectID}
	if m.HasMass {
		spec.Spacecraft.Mass = m.Mass
	}
	if m.HasDragArea {
		spec.Spacecraft.DragArea = m.DragArea
	}
	if m.HasDragCoeff {
		spec.Spacecraft.DragCoeff = m.DragCoeff
	}
	if m.HasSolarRadArea {
		spec.Spacecraft.SRPArea = m.SolarRadArea
	}
	if m.HasSolarRadCoeff {
		spec.Spacecraft.SRPCoeff = m.SolarRadCoeff
	}
	if m.HasKeplerian && m.GM != 0 && (m.GM/body.GM > 1+1e-6 || m.GM/body.GM < 1-1e-6) {
		spec.Warnings = append(spec.Warnings, fmt.Sprintf("the message's GM = %g km^3/s^2 differs from the catalogue's %g; centra uses the catalogue's", m.GM, body.GM))
	}
	return nil
}

// opmEpoch converts an OPM epoch in its time system.
func opmEpoch(s, system string) (epoch, error) {
	s = strings.TrimSpace(s)
	layout := "2006-01-02T15:04:05.999999999"
	// (len(s) > 8: an 8-character EPOCH such as "2027-001" used to index
	// past its end.)
	if len(s) > 8 && s[4] == '-' && s[8] == 'T' && !strings.Contains(s[5:], "-") {
		layout = "2006-002T15:04:05.999999999"
	}
	t, err := time.Parse(layout, strings.TrimSuffix(s, "Z"))
	if err != nil {
		return epoch{}, fmt.Errorf("EPOCH %q is not a CCSDS time", s)
	}
	// The same span as --epoch, on the reading itself (the scales differ
	// by about a minute): before 1972 there is no UTC with leap seconds,
	// and beyond 2200 neither the Earth-orientation series nor
	// time.Duration (292 years from 2000) holds.
	if t.Year() < 1972 {
		return epoch{}, fmt.Errorf("EPOCH %s is before 1972", s)
	}
	if !t.Before(time.Date(2200, 1, 1, 0, 0, 0, 0, time.UTC)) {
		return epoch{}, fmt.Errorf("EPOCH %s is beyond the supported range (before 2200)", s)
	}
	switch strings.ToUpper(system) {
	case "UTC":
		e, err := timescale.FromUTC(t)
		if errors.Is(err, timescale.ErrBeforeLeapTable) {
			return epoch{}, fmt.Errorf("EPOCH %s is before 1972", s)
		}
		return e, err
	case "TAI", "TT", "GPS":
		// Read the wall-clock reading as seconds on the given scale.
		ref := time.Date(2000, 1, 1, 12, 0, 0, 0, time.UTC)
		sec := t.Sub(ref).Seconds()
		switch strings.ToUpper(system) {
		case "TT":
			sec -= timescale.TTMinusTAI
		case "GPS":
			sec += 19 // TAI - GPS = 19 s exactly (GPS time was UTC at 1980-01-06, when TAI-UTC was 19 s)
		}
		e := timescale.FromTAISeconds(sec)
		if first, err := timescale.FromUTC(time.Date(1972, 1, 1, 0, 0, 0, 0, time.UTC)); err == nil && e.Sub(first) < 0 {
			return epoch{}, fmt.Errorf("EPOCH %s %s is before 1972 in UTC", s, strings.ToUpper(system))
		}
		return e, nil
	}
	return epoch{}, fmt.Errorf("TIME_SYSTEM %s is not supported (UTC, TAI, TT, GPS)", system)
}
