package main

import (
	"fmt"
	"math"

	"github.com/urfave/cli/v2"

	"centra/bodies/earthframe"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/reports"
)

func init() { register(20, orbitCommand) }

func orbitCommand() *cli.Command {
	flags := append(orbitFlags(), expectFlag())
	return &cli.Command{
		Name:  "orbit",
		Usage: "everything derived from one state, with the Kepler-law checks",
		UsageText: `centra orbit [orbit flags] [--expect NAME=VALUE±TOL ...]

examples:
  centra orbit --altitude 500 --inclination 97.4
  centra --format json orbit --periapsis-alt 300 --apoapsis-alt 35786 --inclination 27
  centra orbit --position 6524.834,6862.875,6448.296 --velocity 4.901327,5.533756,-1.976341
  centra orbit --altitude 550km --sun-synchronous --expect period_s=95.6min±0.2min`,
		Description: `Prints the classical elements, the conic geometry (period, apsides, energy,
angular momentum, speeds, v-infinity), the J2 secular rates and the checks
against Kepler's three laws, vis-viva and the conservation laws. Altitudes are
above the body's equatorial radius. Undefined quantities (the period of a
hyperbola) are null in JSON, empty in CSV and "-" in tables.`,
		Flags:  flags,
		Action: orbitAction,
	}
}

func orbitAction(c *cli.Context) error {
	spec, err := parseOrbit(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	b := spec.Body
	sum, err := orbit.Summarize(b.GM, b.EquatorialRadius, b.Jn(2), spec.State)
	if err != nil {
		return inputErrorf("check the orbit", "%v", err)
	}
	checks, err := orbit.KeplerChecks(b.GM, spec.State)
	if err != nil {
		return inputErrorf("check the orbit", "Kepler-law checks: %v", err)
	}
	rec := orbitRecord(spec, sum, checks)
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	for _, w := range spec.Warnings {
		if o.Format != "table" {
			o.warn("%s", w)
		}
	}
	err = o.emitWithExpectations("Orbit about "+b.Name+" at "+formatEpoch(spec.Epoch), rec, exps, func() error {
		if o.Format != "table" {
			return nil
		}
		if err := writeChecksTable(o, checks); err != nil {
			return err
		}
		for _, w := range spec.Warnings {
			fmt.Fprintf(o.W, "\nWARNING: %s\n", w)
		}
		return nil
	})
	return o.finish(err)
}

const rad2deg = 180 / math.Pi

// orbitRecord lays out the contract's keys for one orbit.
func orbitRecord(spec *orbitSpec, s orbit.Summary, checks []orbit.Check) reports.Record {
	re := spec.Body.EquatorialRadius
	el := s.Elements
	daily := 86400 * rad2deg
	rec := reports.Record{
		{Key: "body", Label: "central body", Value: spec.Body.Name},
		{Key: "epoch_utc", Label: "epoch", Value: formatEpoch(spec.Epoch)},
		reports.Opt("semi_major_axis_km", "semi-major axis", s.SemiMajorAxis, s.HasSemiMajorAxis, 10),
		reports.Num("eccentricity", "eccentricity", el.E, 8),
		reports.Num("inclination_deg", "inclination", el.I*rad2deg, 8),
		reports.Num("raan_deg", "right ascension of ascending node", el.RAAN*rad2deg, 8),
		reports.Num("arg_periapsis_deg", "argument of periapsis", el.ArgP*rad2deg, 8),
		reports.Num("true_anomaly_deg", "true anomaly", el.Nu*rad2deg, 8),
		reports.Num("mean_anomaly_deg", "mean anomaly", s.MeanAnomaly*rad2deg, 8),
		reports.Num("semi_latus_rectum_km", "semi-latus rectum", s.SemiLatusRectum, 10),
		reports.Opt("period_s", "period", s.Period, s.HasPeriod, 9),
		reports.Opt("mean_motion_deg_day", "mean motion", s.MeanMotion*daily, s.HasPeriod, 9),
		reports.Num("periapsis_radius_km", "periapsis radius", s.PeriapsisRadius, 10),
		reports.Opt("apoapsis_radius_km", "apoapsis radius", s.ApoapsisRadius, s.HasApoapsis, 10),
		reports.Num("periapsis_alt_km", "periapsis altitude", s.PeriapsisRadius-re, 10),
		reports.Opt("apoapsis_alt_km", "apoapsis altitude", s.ApoapsisRadius-re, s.HasApoapsis, 10),
		reports.Num("specific_energy_km2_s2", "specific orbital energy", s.SpecificEnergy, 10),
		reports.Num("specific_angular_momentum_km2_s", "specific angular momentum", s.AngularMomentum, 10),
		reports.Num("speed_periapsis_km_s", "speed at periapsis", s.SpeedPeriapsis, 9),
		reports.Opt("speed_apoapsis_km_s", "speed at apoapsis", s.SpeedApoapsis, s.HasApoapsis, 9),
		reports.Opt("v_infinity_km_s", "hyperbolic excess speed", s.VInfinity, s.HasVInfinity, 9),
		reports.Num("radius_km", "radius at epoch", s.Radius, 10),
		reports.Num("speed_km_s", "speed at epoch", s.Speed, 10),
		reports.Num("flight_path_angle_deg", "flight-path angle at epoch", s.FlightPath*rad2deg, 8),
		{Key: "position_km", Label: "position (inertial)", Value: s.State.R, Digits: 10},
		{Key: "velocity_km_s", Label: "velocity (inertial)", Value: s.State.V, Digits: 10},
		reports.Opt("raan_rate_deg_day", "RAAN drift (J2, secular)", s.RAANRate*daily, s.HasJ2Rates, 8),
		reports.Opt("arg_periapsis_rate_deg_day", "periapsis drift (J2, secular)", s.ArgPeriapsisRate*daily, s.HasJ2Rates, 8),
	}
	rec = append(rec, designFields(spec)...)
	rec = append(rec, subSatelliteFields(spec)...)
	rec = append(rec, reports.Field{Key: "checks", Value: checkRecords(checks)})
	if len(spec.Warnings) > 0 {
		rec = append(rec, reports.Field{Key: "warnings", Value: spec.Warnings})
	}
	return rec
}

// subSatelliteFields gives the geodetic point below an Earth orbiter at
// the epoch (WGS 84, ITRF with polar motion ignored, DUT1 = 0).
func subSatelliteFields(spec *orbitSpec) []reports.Field {
	if spec.Body.Name != "earth" {
		return nil
	}
	rot := earthframe.NewRotation(spec.Epoch, 0)
	rf := rot.ToITRF(spec.State.R)
	lat, lon, h := geodesy.WGS84.FromECEF(rf)
	return []reports.Field{
		reports.Num("subsatellite_lat_deg", "sub-satellite latitude at epoch (geodetic)", lat*rad2deg, 8),
		reports.Num("subsatellite_lon_deg", "sub-satellite longitude at epoch", lon*rad2deg, 8),
		reports.Num("geodetic_alt_km", "height above the WGS 84 ellipsoid at epoch", h, 10),
	}
}

func checkRecords(checks []orbit.Check) []reports.Record {
	rows := make([]reports.Record, 0, len(checks))
	for _, ch := range checks {
		rows = append(rows, reports.Record{
			{Key: "name", Value: ch.Name},
			{Key: "expected", Value: ch.Expected, Digits: 14},
			{Key: "measured", Value: ch.Measured, Digits: 14},
			{Key: "relative_error", Value: ch.RelativeError, Digits: 3},
			{Key: "tolerance", Value: ch.Tolerance, Digits: 2},
			{Key: "pass", Value: ch.Pass},
		})
	}
	return rows
}

func writeChecksTable(o *output, checks []orbit.Check) error {
	if len(checks) == 0 {
		return nil
	}
	fmt.Fprintln(o.W)
	reports.WriteTitle(o.W, "Checks against Kepler's laws and the conservation laws")
	return reports.WriteListTable(o.W, checkRecords(checks))
}
