package main

import (
	"fmt"
	"math"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/cmd/centra/internal/quantity"
	"centra/orbit"
)

// orbitFlags are shared by every command that needs an orbit.
func orbitFlags() []cli.Flag {
	cat := "Orbit"
	return []cli.Flag{
		&cli.StringFlag{Name: "body", Value: "earth", Usage: "central `NAME` (see 'centra bodies')", Category: cat},
		&cli.StringFlag{Name: "epoch", Usage: "epoch of the state, RFC 3339 UTC `TIME` (default: now, to the minute)", Category: cat},
		&cli.StringFlag{Name: "altitude", Usage: "circular orbit at altitude `H` above the equatorial radius", Category: cat},
		&cli.StringFlag{Name: "periapsis-alt", Usage: "periapsis altitude `H` (with --apoapsis-alt or --eccentricity)", Category: cat},
		&cli.StringFlag{Name: "apoapsis-alt", Usage: "apoapsis altitude `H` (with --periapsis-alt)", Category: cat},
		&cli.StringFlag{Name: "semi-major-axis", Usage: "semi-major axis `A` (negative for a hyperbola; with --eccentricity)", Category: cat},
		&cli.StringFlag{Name: "eccentricity", Usage: "eccentricity `E` (with --semi-major-axis or --periapsis-alt; 0 with --altitude)", Category: cat},
		&cli.StringFlag{Name: "position", Usage: "inertial position `X,Y,Z` (with --velocity)", Category: cat},
		&cli.StringFlag{Name: "velocity", Usage: "inertial velocity `VX,VY,VZ` (with --position)", Category: cat},
		&cli.StringFlag{Name: "inclination", Usage: "inclination `ANGLE` (default 0)", Category: cat},
		&cli.StringFlag{Name: "raan", Usage: "right ascension of the ascending node `ANGLE` (default 0)", Category: cat},
		&cli.StringFlag{Name: "arg-periapsis", Usage: "argument of periapsis `ANGLE` (default 0)", Category: cat},
		&cli.StringFlag{Name: "true-anomaly", Usage: "true anomaly `ANGLE` at epoch (default 0)", Category: cat},
		&cli.StringFlag{Name: "mean-anomaly", Usage: "mean anomaly `ANGLE` at epoch (hyperbolic mean anomaly for e > 1)", Category: cat},
		&cli.BoolFlag{Name: "sun-synchronous", Usage: "solve the inclination that makes the orbit sun-synchronous (J2)", Category: cat},
		&cli.StringFlag{Name: "repeat", Usage: "solve the mean semi-major axis of a repeat ground track of `REVS/DAYS` revolutions in nodal days (J2; circular unless --eccentricity or --frozen)", Category: cat},
		&cli.BoolFlag{Name: "frozen", Usage: "solve the frozen eccentricity and argument of periapsis (J2, J3) for --altitude, --semi-major-axis or --repeat", Category: cat},
		&cli.StringFlag{Name: "from-opm", Usage: "read body, epoch and state from a CCSDS Orbit Parameter Message (KVN) `FILE`", Category: cat},
	}
}

// orbitSpec is a parsed, validated orbit in internal units.
type orbitSpec struct {
	Body     *bodies.Body
	Epoch    epoch
	State    orbit.State
	Elements orbit.Elements
	// Given says which form defined the orbit, for messages.
	Given    string
	Warnings []string
	// Spacecraft holds what an OPM says about the spacecraft.
	Spacecraft opmSpacecraft
	// Design is set by --repeat and --frozen (designflags.go).
	Design *orbitDesign
}

var shapeForms = []struct {
	name  string
	flags []string
}{
	{"--altitude", []string{"altitude"}},
	{"--periapsis-alt/--apoapsis-alt", []string{"periapsis-alt", "apoapsis-alt"}},
	{"--semi-major-axis/--eccentricity", []string{"semi-major-axis"}},
	{"--position/--velocity", []string{"position", "velocity"}},
	{"--from-opm", []string{"from-opm"}},
	{"--repeat", []string{"repeat"}},
}

const shapeFix = "give exactly one of --altitude H | --periapsis-alt H --apoapsis-alt H | --semi-major-axis A --eccentricity E | --position X,Y,Z --velocity VX,VY,VZ | --from-opm FILE | --repeat REVS/DAYS"

// parseOrbit reads the orbit flags of c.
func parseOrbit(c *cli.Context) (*orbitSpec, error) {
	body, err := lookupBody(c, c.String("body"))
	if err != nil {
		return nil, err
	}
	ep, err := parseEpochFlag(c, "epoch")
	if err != nil {
		return nil, err
	}
	spec := &orbitSpec{Body: body, Epoch: ep}

	var given []string
	for _, f := range shapeForms {
		for _, fl := range f.flags {
			if c.IsSet(fl) {
				given = append(given, f.name)
				break
			}
		}
	}
	if c.IsSet("periapsis-alt") && c.IsSet("eccentricity") && !c.IsSet("apoapsis-alt") {
		given = append(given[:0:0], dropForm(given, "--periapsis-alt/--apoapsis-alt")...)
		given = append(given, "--periapsis-alt/--eccentricity")
	}
	switch len(given) {
	case 0:
		return nil, inputErrorf(shapeFix, "no orbit size and shape given")
	case 1:
	default:
		return nil, inputErrorf(shapeFix, "orbit size and shape given twice (%s)", strings.Join(given, " and "))
	}
	spec.Given = given[0]
	mu, re := body.GM, body.EquatorialRadius
	if spec.Given == "--repeat" || c.Bool("frozen") {
		return designOrbit(c, spec)
	}
	if spec.Given == "--from-opm" {
		if err := stateFromOPM(c, spec); err != nil {
			return nil, err
		}
		spec.check(spec.Body.EquatorialRadius)
		return spec, nil
	}

	if spec.Given == "--position/--velocity" {
		for _, fl := range []string{"inclination", "raan", "arg-periapsis", "true-anomaly", "mean-anomaly", "eccentricity", "sun-synchronous"} {
			if c.IsSet(fl) {
				return nil, inputErrorf("drop --"+fl+" or describe the orbit by elements instead", "--%s cannot be combined with --position/--velocity", fl)
			}
		}
		r, okr, err := vectorFlag(c, "position", quantity.Length)
		if err != nil {
			return nil, err
		}
		v, okv, err := vectorFlag(c, "velocity", quantity.Speed)
		if err != nil {
			return nil, err
		}
		if !okr || !okv {
			return nil, inputErrorf("give both --position X,Y,Z and --velocity VX,VY,VZ", "a state vector needs both --position and --velocity")
		}
		spec.State = orbit.State{R: r, V: v}
		el, err := orbit.ElementsFromState(mu, spec.State)
		if err != nil {
			return nil, inputErrorf("check the state vector", "--position/--velocity: %v", err)
		}
		spec.Elements = el
		spec.check(re)
		return spec, nil
	}

	// Size and shape.
	var a, e, p float64
	switch spec.Given {
	case "--altitude":
		h, _, err := quantityFlag(c, "altitude", quantity.Length)
		if err != nil {
			return nil, err
		}
		if ev, ok, err := quantityFlag(c, "eccentricity", quantity.Scalar); err != nil {
			return nil, err
		} else if ok && ev != 0 {
			return nil, inputErrorf("for an eccentric orbit use --periapsis-alt with --apoapsis-alt or --eccentricity", "--altitude is a circular orbit, but --eccentricity is %g", ev)
		}
		a, e = re+h, 0
		if a <= 0 {
			return nil, inputErrorf("give an altitude above the body's centre", "--altitude %g km puts the orbit inside the centre of %s", h, body.Name)
		}
		p = a
	case "--periapsis-alt/--apoapsis-alt":
		hp, okp, err := quantityFlag(c, "periapsis-alt", quantity.Length)
		if err != nil {
			return nil, err
		}
		ha, oka, err := quantityFlag(c, "apoapsis-alt", quantity.Length)
		if err != nil {
			return nil, err
		}
		if !okp || !oka {
			return nil, inputErrorf("give both --periapsis-alt and --apoapsis-alt (or --periapsis-alt with --eccentricity)", "an orbit by its apsides needs both altitudes")
		}
		if c.IsSet("eccentricity") {
			return nil, inputErrorf("drop --eccentricity: the two apsides fix it", "--eccentricity cannot be combined with --periapsis-alt and --apoapsis-alt")
		}
		rp, ra := re+hp, re+ha
		if rp <= 0 {
			return nil, inputErrorf("raise the periapsis", "--periapsis-alt %g km is below the centre of %s", hp, body.Name)
		}
		if ra < rp {
			return nil, inputErrorf("swap the two values; an open orbit (hyperbola) has no apoapsis: give it by --periapsis-alt H --eccentricity E with E > 1", "--apoapsis-alt %g km is below --periapsis-alt %g km", ha, hp)
		}
		a = (rp + ra) / 2
		e = (ra - rp) / (ra + rp)
		p = 2 * rp * ra / (rp + ra)
	case "--periapsis-alt/--eccentricity":
		hp, _, err := quantityFlag(c, "periapsis-alt", quantity.Length)
		if err != nil {
			return nil, err
		}
		ev, _, err := quantityFlag(c, "eccentricity", quantity.Scalar)
		if err != nil {
			return nil, err
		}
		rp := re + hp
		if rp <= 0 {
			return nil, inputErrorf("raise the periapsis", "--periapsis-alt %g km is below the centre of %s", hp, body.Name)
		}
		if ev < 0 {
			return nil, inputErrorf("give an eccentricity of 0 or more", "--eccentricity %g is negative", ev)
		}
		e = ev
		p = rp * (1 + e)
		if e != 1 {
			a = rp / (1 - e)
		}
	case "--semi-major-axis/--eccentricity":
		av, _, err := quantityFlag(c, "semi-major-axis", quantity.Length)
		if err != nil {
			return nil, err
		}
		ev, oke, err := quantityFlag(c, "eccentricity", quantity.Scalar)
		if err != nil {
			return nil, err
		}
		if !oke {
			return nil, inputErrorf("add --eccentricity E (0 for a circle)", "--semi-major-axis needs --eccentricity")
		}
		switch {
		case ev < 0:
			return nil, inputErrorf("give an eccentricity of 0 or more", "--eccentricity %g is negative", ev)
		case ev == 1:
			return nil, inputErrorf("describe a parabola by --periapsis-alt H --eccentricity 1", "a parabola has no finite semi-major axis")
		case ev < 1 && av <= 0:
			return nil, inputErrorf("give a positive semi-major axis for e < 1", "--semi-major-axis %g km is not positive for an ellipse (e = %g)", av, ev)
		case ev > 1 && av >= 0:
			return nil, inputErrorf("hyperbolas take a negative semi-major axis, e.g. --semi-major-axis -20000km --eccentricity 1.5", "--semi-major-axis %g km must be negative for a hyperbola (e = %g)", av, ev)
		}
		a, e = av, ev
		p = a * (1 - e*e)
	}
	if a == 0 && e != 1 || math.IsInf(a, 0) || p <= 0 {
		return nil, inputErrorf("check the size and shape", "the orbit has no valid size (a = %g km, p = %g km)", a, p)
	}

	// Orientation and position in orbit.
	incl, okI, err := quantityFlag(c, "inclination", quantity.Angle)
	if err != nil {
		return nil, err
	}
	if c.Bool("sun-synchronous") {
		if okI {
			return nil, inputErrorf("drop --inclination; --sun-synchronous solves it", "--inclination and --sun-synchronous both set the inclination")
		}
		if body.Name != "earth" {
			return nil, inputErrorf("use --body earth or give --inclination", "--sun-synchronous is defined for Earth only (the Sun's mean motion about the Earth)")
		}
		if e >= 1 {
			return nil, inputErrorf("give a closed orbit", "--sun-synchronous needs an elliptic orbit, not e = %g", e)
		}
		incl, err = orbit.SunSynchronousInclination(mu, re, body.Jn(2), a, e)
		if err != nil {
			return nil, inputErrorf("lower the orbit: J2 cannot turn the plane fast enough this high", "no sun-synchronous inclination exists for a = %.3f km, e = %g: %v", a, e, err)
		}
	}
	if incl < 0 || incl > math.Pi*(1+1e-15) {
		return nil, inputErrorf("give an inclination from 0 to 180 deg", "--inclination %g deg is outside 0..180 deg", incl*180/math.Pi)
	}
	raan, _, err := quantityFlag(c, "raan", quantity.Angle)
	if err != nil {
		return nil, err
	}
	argp, _, err := quantityFlag(c, "arg-periapsis", quantity.Angle)
	if err != nil {
		return nil, err
	}
	nu, okNu, err := quantityFlag(c, "true-anomaly", quantity.Angle)
	if err != nil {
		return nil, err
	}
	m, okM, err := quantityFlag(c, "mean-anomaly", quantity.Angle)
	if err != nil {
		return nil, err
	}
	if okNu && okM {
		return nil, inputErrorf("give one of them", "--true-anomaly and --mean-anomaly both set the position in orbit")
	}
	if okM {
		nu = orbit.TrueFromMean(m, e)
	}
	if e >= 1 {
		// An open orbit exists only for |nu| below the asymptote.
		nuInf := math.Pi
		if e > 1 {
			nuInf = math.Acos(-1 / e)
		}
		w := math.Remainder(nu, 2*math.Pi)
		if math.Abs(w) >= nuInf {
			return nil, inputErrorf(fmt.Sprintf("give a true anomaly within ±%.6f deg", nuInf*180/math.Pi), "--true-anomaly %g deg is beyond the asymptote of this open orbit", nu*180/math.Pi)
		}
		nu = w
	}
	spec.Elements = orbit.Elements{A: a, P: p, E: e, I: incl, RAAN: wrap2pi(raan), ArgP: wrap2pi(argp), Nu: nu}
	if e < 1 {
		spec.Elements.Nu = wrap2pi(nu)
	}
	st, err := orbit.StateFromElements(mu, spec.Elements)
	if err != nil {
		return nil, inputErrorf("check the elements", "the elements do not give a state: %v", err)
	}
	spec.State = st
	spec.check(re)
	return spec, nil
}

func dropForm(given []string, name string) []string {
	var out []string
	for _, g := range given {
		if g != name {
			out = append(out, g)
		}
	}
	return out
}

func wrap2pi(x float64) float64 {
	x = math.Mod(x, 2*math.Pi)
	if x < 0 {
		x += 2 * math.Pi
	}
	return x
}

// check adds the warnings a planner must see.
func (s *orbitSpec) check(re float64) {
	rp := s.Elements.P / (1 + s.Elements.E)
	if rp < re {
		s.Warnings = append(s.Warnings, fmt.Sprintf("this trajectory intersects the surface: periapsis altitude %.3f km is below the equatorial radius of %s", rp-re, s.Body.Name))
	}
	// Near e = 1, a = p/(1-e^2) and the energy cancel digits (see
	// orbit.CheckTolerance): say so where a check may then fail.
	if d := math.Abs(1 - s.Elements.E); d > 0 && d < nearParabolicWarn {
		s.Warnings = append(s.Warnings, fmt.Sprintf("the orbit is nearly parabolic (|1-e| = %.2g): the semi-major axis, period and energy lose about %.0f of 16 digits, so a Kepler-law check may miss its %g tolerance; the state, periapsis and semi-latus rectum keep full precision", d, math.Round(-math.Log10(d)), orbit.CheckTolerance))
	}
}

// nearParabolicWarn is the |1-e| below which orbit.CheckTolerance's
// comment says the checks may fail.
const nearParabolicWarn = 1e-4
