package main

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/cmd/centra/internal/quantity"
	"centra/orbit"
	"centra/reports"
)

// The orbit design helpers --repeat REVS/DAYS and --frozen (flags in
// orbitflags.go; the computation is orbit.Design). They give mean
// elements of first-order J2 theory; the state is their osculating
// equivalent (orbit.MeanToOsculating), so that a propagation with J2 shows
// the designed repeat period and frozen eccentricity.

// orbitDesign is what a design helper solved, for the orbit record.
type orbitDesign struct {
	Result     orbit.DesignResult
	Revs, Days int
	Frozen     bool
	RAAN, Nu   float64 // rad, mean
}

// parseRepeat reads --repeat REVS/DAYS.
func parseRepeat(text string) (revs, days int, err error) {
	fix := "write --repeat REVS/DAYS with whole numbers, for example --repeat 15/1 or --repeat 233/16"
	r, d, ok := strings.Cut(strings.TrimSpace(text), "/")
	if !ok {
		return 0, 0, inputErrorf(fix, "--repeat %q has no REVS/DAYS", text)
	}
	revs, err1 := strconv.Atoi(strings.TrimSpace(r))
	days, err2 := strconv.Atoi(strings.TrimSpace(d))
	if err1 != nil || err2 != nil {
		return 0, 0, inputErrorf(fix, "--repeat %q is not two whole numbers", text)
	}
	if revs < 1 || days < 1 || revs > orbit.MaxRepeatRevs || days > orbit.MaxRepeatDays {
		return 0, 0, inputErrorf(fmt.Sprintf("give 1..%d revolutions in 1..%d days", orbit.MaxRepeatRevs, orbit.MaxRepeatDays), "--repeat %q is out of range", text)
	}
	return revs, days, nil
}

// designOrbit builds spec from --repeat and/or --frozen with the other
// orbit flags.
func designOrbit(c *cli.Context, spec *orbitSpec) (*orbitSpec, error) {
	body := spec.Body
	mu, re := body.GM, body.EquatorialRadius
	frozen := c.Bool("frozen")
	sizeFix := "give the size by --altitude H, --semi-major-axis A or --repeat REVS/DAYS"
	switch spec.Given {
	case "--repeat", "--altitude", "--semi-major-axis/--eccentricity":
	default:
		return nil, inputErrorf(sizeFix, "--frozen solves the eccentricity, which %s already fixes", spec.Given)
	}
	if body.Jn(2) == 0 {
		return nil, inputErrorf("give the body's J2 in a bodies file, or drop the design flags", "%s has no J2: the design helpers rest on the J2 rates", body.Name)
	}
	d := orbit.Design{Mu: mu, Re: re, J2: body.Jn(2), J3: body.Jn(3), RotationRate: body.RotationRate, Frozen: frozen}
	if frozen {
		if body.Jn(3) == 0 {
			return nil, inputErrorf("give the body's J3 in a bodies file, or drop --frozen", "%s has no J3: a frozen eccentricity needs J3", body.Name)
		}
		for _, fl := range []string{"eccentricity", "arg-periapsis"} {
			if c.IsSet(fl) {
				return nil, inputErrorf("drop --"+fl+"; --frozen solves it", "--%s and --frozen both set the %s", fl, strings.ReplaceAll(fl, "-", " of "))
			}
		}
	}
	switch spec.Given {
	case "--repeat":
		revs, days, err := parseRepeat(c.String("repeat"))
		if err != nil {
			return nil, err
		}
		if !(body.RotationRate > 0) {
			return nil, inputErrorf("choose a body that turns prograde", "a repeat ground track needs the body's rotation, and %s turns at %g rad/s", body.Name, body.RotationRate)
		}
		d.Revs, d.Days = revs, days
	case "--altitude":
		h, _, err := quantityFlag(c, "altitude", quantity.Length)
		if err != nil {
			return nil, err
		}
		d.A = re + h
		if !frozen {
			// --altitude with --repeat is caught as two size forms.
			return nil, inputErrorf(sizeFix, "no design flag given")
		}
	case "--semi-major-axis/--eccentricity":
		a, _, err := quantityFlag(c, "semi-major-axis", quantity.Length)
		if err != nil {
			return nil, err
		}
		d.A = a
	}
	if !frozen {
		ev, _, err := quantityFlag(c, "eccentricity", quantity.Scalar)
		if err != nil {
			return nil, err
		}
		if !(ev >= 0 && ev < 1) {
			return nil, inputErrorf("give an eccentricity from 0 to below 1", "--eccentricity %g does not give a closed orbit", ev)
		}
		d.E = ev
		argp, _, err := quantityFlag(c, "arg-periapsis", quantity.Angle)
		if err != nil {
			return nil, err
		}
		d.ArgP = argp
	}
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
		d.SunSynchronous = true
	} else if incl < 0 || incl > math.Pi*(1+1e-15) {
		return nil, inputErrorf("give an inclination from 0 to 180 deg", "--inclination %g deg is outside 0..180 deg", incl*180/math.Pi)
	}
	d.I = math.Min(incl, math.Pi)
	if frozen && !d.SunSynchronous {
		if c5 := 5*math.Cos(d.I)*math.Cos(d.I) - 1; math.Abs(c5) < 0.05 {
			return nil, inputErrorf("choose an inclination away from 63.4 deg and 116.6 deg", "at the critical inclination (%.2f deg) J2 does not turn the perigee, and the frozen eccentricity of J2 and J3 is not defined", d.I*180/math.Pi)
		}
	}
	res, err := d.Solve()
	if err != nil {
		return nil, designError(d, err)
	}
	raan, _, err := quantityFlag(c, "raan", quantity.Angle)
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
		nu = orbit.TrueFromMean(m, res.E)
	}
	mean := orbit.Elements{A: res.A, P: res.A * (1 - res.E) * (1 + res.E), E: res.E, I: res.I, RAAN: wrap2pi(raan), ArgP: res.ArgP, Nu: wrap2pi(nu)}
	osc, err := orbit.MeanToOsculating(mu, re, body.Jn(2), mean)
	if err != nil {
		return nil, inputErrorf("check the design flags", "the designed orbit has no osculating state: %v", err)
	}
	st, err := orbit.StateFromElements(mu, osc)
	if err != nil {
		return nil, inputErrorf("check the design flags", "the designed orbit has no state: %v", err)
	}
	spec.State = st
	spec.Elements = osc
	spec.Design = &orbitDesign{Result: res, Revs: d.Revs, Days: d.Days, Frozen: frozen, RAAN: mean.RAAN, Nu: mean.Nu}
	spec.check(re)
	return spec, nil
}

// designError explains a design without a solution.
func designError(d orbit.Design, err error) error {
	switch {
	case errors.Is(err, orbit.ErrNoRepeat):
		if d.Revs > 0 {
			return inputErrorf("choose another REVS/DAYS: in LEO about 12 to 16 revolutions a day", "no repeat ground track of %d revolutions in %d days: %v", d.Revs, d.Days, err)
		}
		return inputErrorf("raise the orbit", "%v", err)
	case errors.Is(err, orbit.ErrNoSunSynchronous):
		return inputErrorf("lower the orbit: J2 cannot turn the plane fast enough this high", "no sun-synchronous solution: %v", err)
	}
	return inputErrorf("check the design flags", "%v", err)
}

// designFields are the orbit record's keys of a design helper.
func designFields(spec *orbitSpec) []reports.Field {
	ds := spec.Design
	if ds == nil {
		return nil
	}
	r := ds.Result
	daily := 86400 * rad2deg
	f := []reports.Field{
		reports.Num("mean_semi_major_axis_km", "mean semi-major axis (J2 theory)", r.A, 10),
		reports.Num("mean_altitude_km", "mean altitude above the equatorial radius", r.A-spec.Body.EquatorialRadius, 10),
		reports.Num("mean_eccentricity", "mean eccentricity", r.E, 8),
		reports.Num("mean_inclination_deg", "mean inclination", r.I*rad2deg, 8),
		reports.Num("mean_arg_periapsis_deg", "mean argument of periapsis", r.ArgP*rad2deg, 8),
		reports.Num("nodal_period_s", "nodal period (J2)", r.NodalPeriod, 9),
		reports.Num("mean_raan_rate_deg_day", "RAAN drift of the mean orbit (J2)", r.RAANRate*daily, 8),
		reports.Num("mean_arg_periapsis_rate_deg_day", "periapsis drift of the mean orbit (J2)", r.ArgPRate*daily, 8),
	}
	if ds.Revs > 0 {
		f = append(f,
			reports.Field{Key: "repeat_revolutions", Label: "repeat cycle: revolutions", Value: ds.Revs},
			reports.Field{Key: "repeat_days", Label: "repeat cycle: nodal days", Value: ds.Days},
			reports.Num("nodal_day_s", "nodal day (Earth turn relative to the node)", r.NodalDay, 9),
			reports.Num("track_spacing_deg", "spacing of adjacent tracks at the equator", 360/float64(ds.Revs), 8),
		)
	}
	if ds.Frozen {
		f = append(f, reports.Field{Key: "frozen", Label: "frozen eccentricity (J2, J3)", Value: true})
	}
	return f
}
