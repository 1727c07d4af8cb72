package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies/geodesy"
	"centra/cmd/centra/internal/quantity"
	"centra/propagate"
	"centra/propagate/suborbital"
	"centra/reports"
)

func init() { register(70, ballisticCommand) }

// ballisticFlags are the burnout, arc and dispersion flags; the vehicle
// flags --mass, --area and --cd come from modelFlags when it has them.
func ballisticFlags() []cli.Flag {
	bo, arc, disp := "Burnout", "Arc", "Dispersion"
	return []cli.Flag{
		&cli.StringFlag{Name: "site", Usage: "launcher `[NAME=]LAT,LON[,ALT_M]`: geodetic degrees on WGS 84 and metres; burnout is above it unless --burnout-lat/--burnout-lon are given (its height is not used: --burnout-alt is above the ellipsoid)", Category: bo},
		&cli.StringFlag{Name: "burnout-alt", Usage: "burnout height `H` above the WGS 84 ellipsoid (required)", Category: bo},
		&cli.StringFlag{Name: "burnout-lat", Usage: "geodetic latitude `ANGLE` of the burnout point (with --burnout-lon)", Category: bo},
		&cli.StringFlag{Name: "burnout-lon", Usage: "longitude `ANGLE` of the burnout point, east positive (with --burnout-lat)", Category: bo},
		&cli.StringFlag{Name: "burnout-speed", Usage: "burnout speed `V` relative to the rotating Earth (required)", Category: bo},
		&cli.StringFlag{Name: "flight-path-angle", Usage: "flight-path `ANGLE` above the local horizontal, -90..90 deg (required)", Category: bo},
		&cli.StringFlag{Name: "azimuth", Usage: "direction `ANGLE` of flight from north through east (required unless the flight-path angle is ±90 deg)", Category: bo},
		&cli.StringFlag{Name: "epoch", Usage: "burnout time, RFC 3339 UTC `TIME` (default: now, to the minute); it only labels the times", Category: bo},
		&cli.StringFlag{Name: "above", Value: "100km", Usage: "report the time above height `H`", Category: arc},
		&cli.StringFlag{Name: "impact-alt", Value: "0", Usage: "impact surface: geodetic height `H` above WGS 84", Category: arc},
		&cli.BoolFlag{Name: "non-rotating", Usage: "for checks: the Earth does not turn, the burnout velocity is inertial", Category: arc},
		&cli.StringFlag{Name: "step", Usage: "tabulate the arc every `DURATION` (utc, t_s, lat_deg, lon_deg, alt_km, speed_km_s)", Category: arc},
		&cli.StringFlag{Name: "dispersions", Usage: "fly `N` dispersed cases (2..1000000) and report the impact ellipses", Category: disp},
		&cli.StringFlag{Name: "sigma-speed", Usage: "1-sigma burnout speed `V`", Category: disp},
		&cli.StringFlag{Name: "sigma-flight-path-angle", Usage: "1-sigma flight-path `ANGLE`", Category: disp},
		&cli.StringFlag{Name: "sigma-azimuth", Usage: "1-sigma azimuth `ANGLE`", Category: disp},
		&cli.StringFlag{Name: "sigma-cd", Usage: "1-sigma drag coefficient `S` (absolute)", Category: disp},
		&cli.StringFlag{Name: "seed", Value: "1", Usage: "`SEED` of the random draws (case i always gets the same draws)", Category: disp},
		&cli.StringFlag{Name: "dispersions-out", Usage: "write every case's burnout and impact point to CSV `FILE`", Category: disp},
	}
}

// ballisticVehicleFlags are defined here only when modelFlags lacks them.
func ballisticVehicleFlags() []cli.Flag {
	cat := "Vehicle (drag when all three are given)"
	return []cli.Flag{
		&cli.StringFlag{Name: "mass", Usage: "payload mass `KG`", Category: cat},
		&cli.StringFlag{Name: "area", Usage: "drag reference area `M2`", Category: cat},
		&cli.StringFlag{Name: "cd", Usage: "drag coefficient `CD`", Category: cat},
	}
}

func ballisticCommand() *cli.Command {
	flags := modelFlags()
	have := map[string]bool{}
	for _, f := range flags {
		for _, n := range f.Names() {
			have[n] = true
		}
	}
	for _, f := range ballisticVehicleFlags() {
		if !have[f.Names()[0]] {
			flags = append(flags, f)
		}
	}
	flags = append(flags, ballisticFlags()...)
	flags = append(flags, expectFlag())
	return &cli.Command{
		Name:  "ballistic",
		Usage: "suborbital arc from burnout: apogee, time above 100 km, impact point, with drag and dispersion",
		UsageText: `centra ballistic (--site LAT,LON[,ALT_M] | --burnout-lat ANGLE --burnout-lon ANGLE) --burnout-alt H
    --burnout-speed V --flight-path-angle ANGLE [--azimuth ANGLE] [--mass KG --area M2 --cd CD]
    [--above H] [--impact-alt H] [--step D] [--dispersions N --sigma-speed V ...]

examples:
  centra ballistic --site 57.35,-7.33 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 84 --azimuth 290
  centra ballistic --site 57.35,-7.33 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 84 --azimuth 290 --mass 25 --area 0.02 --cd 0.9
  centra --format csv ballistic --burnout-lat 67.9 --burnout-lon 21.1 --burnout-alt 40 --burnout-speed 2.3 --flight-path-angle 87 --azimuth 0 --step 10s
  centra ballistic --site 57.35,-7.33 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 84 --azimuth 290 --mass 25 --area 0.02 --cd 0.9 \
    --dispersions 2000 --sigma-speed 10m/s --sigma-flight-path-angle 0.5 --sigma-azimuth 1 --sigma-cd 0.05 --dispersions-out cases.csv
  centra ballistic --site 0,0 --burnout-alt 0 --burnout-speed 1.4 --flight-path-angle 90 --expect apogee_alt_km=100±1`,
		Description: `Flies a payload from burnout to impact: point-mass, J2 or zonal gravity
(--model, --degree) over the WGS 84 ellipsoid, the Earth turning under it
(--non-rotating turns that off), and cannonball drag in the U.S. Standard
Atmosphere 1976 (exponential table above 86 km) turning with the Earth when
--mass, --area and --cd (or --ballistic-coefficient) are given. Heights are
geodetic; the burnout speed and the impact speed are relative to the
rotating Earth. The apogee, the crossings of --above going up and down and
the impact at --impact-alt are located on the integrator's dense output.
ground_range_km is the geodesic on the WGS 84 ellipsoid (Vincenty) from the
point below burnout to the impact point.

--dispersions N flies N cases with normal draws of the burnout speed,
flight-path angle, azimuth and Cd (--sigma-*; case i always draws the same
numbers for a --seed, whatever the number of cores) and reports the mean
impact point, the 1-sigma and 3-sigma impact ellipses (semi-axes and the
azimuth of the major axis, from the sample covariance in the east-north
plane at the mean impact point; they hold 39 % and 99 % of the impacts of
a normal spread) and the spread of apogee and time above. The cases are in
the JSON "cases" list and, with --dispersions-out, in a CSV file.

Winds are not modelled. The result is a planning estimate: impact areas
and hazard zones are for the launch range's safety office to set.

JSON keys: apogee_alt_km, time_to_apogee_s, time_above_s, flight_time_s,
impact_lat_deg, impact_lon_deg, ground_range_km, impact_speed_km_s,
apogee_utc, apogee_lat_deg, apogee_lon_deg, impact_utc, cautions; with
--step the "arc" list; with --dispersions ellipse_1sigma_major_km ... and
the "cases" list. With --format csv and --step, stdout is the arc and the
summary goes to stderr.`,
		Flags:  flags,
		Action: ballisticAction,
	}
}

// ballisticCautions are printed with every ballistic result.
func ballisticCautions(drag bool) []string {
	c := []string{
		"Planning estimate only, not for flight safety or operational decisions.",
		"Impact areas and hazard zones are for the launch range's safety office to set, under the local regulations and licensed practice; this result does not replace their analysis.",
	}
	if drag {
		c = append(c, "The impact point's dominant uncertainties are the burnout dispersion (speed, flight-path angle, azimuth), the winds (not modelled) and the drag model (constant Cd, static standard atmosphere).")
	} else {
		c = append(c, "The impact point's dominant uncertainties are the burnout dispersion (speed, flight-path angle, azimuth) and the winds (not modelled); without --mass, --area and --cd this is a vacuum arc, which flies higher and farther than the real one.")
	}
	return c
}

// ballisticSpec is the parsed command line, in internal units.
type ballisticSpec struct {
	cfg      suborbital.Config
	burnout  suborbital.Burnout
	vehicle  suborbital.Vehicle
	ep       epoch
	model    string
	siteName string
	site     *[2]float64 // launcher latitude and longitude, rad, when --site was given with an explicit burnout point
	bcOnly   bool        // drag from --ballistic-coefficient
	step     float64
	disp     *suborbital.Dispersion
	dispOut  string
}

func ballisticAction(c *cli.Context) error {
	spec, err := parseBallistic(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	return o.finish(runBallistic(c, o, spec, exps))
}

// runBallistic flies the nominal arc (tabulated with --step), the
// dispersion, and writes the result.
func runBallistic(c *cli.Context, o *output, spec *ballisticSpec, exps []expectation) error {
	f, err := suborbital.New(spec.cfg)
	if err != nil {
		return inputErrorf("check --model, --tolerance and --impact-alt", "%v", err)
	}
	arc, err := f.Fly(spec.burnout, spec.vehicle, nil)
	if err != nil {
		return ballisticError(err)
	}
	var points []suborbital.Point
	if spec.step > 0 {
		if rows := arc.FlightTime / spec.step; rows > 1e5 && !c.Bool("force") {
			return inputErrorf("lengthen --step, or add --force", "--step %s gives %.3g rows over the %.0f s flight", c.String("step"), rows, arc.FlightTime)
		}
		// The arc again, tabulated on the integrator's dense output.
		if _, err := f.Fly(spec.burnout, spec.vehicle, &suborbital.Output{Step: spec.step, OnPoint: func(p suborbital.Point) error {
			points = append(points, p)
			return nil
		}}); err != nil {
			return ballisticError(err)
		}
		points = append(points, arc.Impact)
	}
	var disp *suborbital.DispersionResult
	if spec.disp != nil {
		res, err := suborbital.Disperse(spec.cfg, spec.burnout, spec.vehicle, *spec.disp)
		if err != nil {
			return ballisticError(err)
		}
		disp = &res
		if spec.dispOut != "" {
			if err := writeBallisticCases(spec, disp, c.Bool("force")); err != nil {
				return err
			}
		}
	}
	return writeBallistic(o, spec, f, arc, points, disp, exps)
}

// parseBallistic reads and validates the flags.
func parseBallistic(c *cli.Context) (*ballisticSpec, error) {
	body, err := lookupBody(c, "earth")
	if err != nil {
		return nil, err
	}
	ep, err := parseEpochFlag(c, "epoch")
	if err != nil {
		return nil, err
	}
	if c.IsSet("drag") {
		return nil, inputErrorf("drop --drag: ballistic turns drag on by itself when --mass, --area and --cd (or --ballistic-coefficient) are given", "--drag is not used by ballistic")
	}
	if c.IsSet("density-scale") {
		return nil, inputErrorf("drop --density-scale: ballistic uses the standard atmosphere as published (solar activity matters above about 150 km, where a suborbital payload meets little drag)", "--density-scale is not used by ballistic")
	}
	for _, fl := range []string{"third-body", "srp"} {
		if c.IsSet(fl) {
			return nil, inputErrorf("drop --"+fl+": ballistic models gravity and drag only", "--%s is not used by ballistic (the Sun, the Moon and radiation pressure move a suborbital impact point by millimetres)", fl)
		}
	}
	ms, err := parseModel(c, body, ep)
	if err != nil {
		return nil, err
	}
	spec := &ballisticSpec{ep: ep, model: ms.Label}
	m := ms.Model
	m.Perturbation = nil
	spec.cfg = suborbital.Config{Gravity: m, Options: ms.Options,
		Ellipsoid: geodesy.NewEllipsoid(body.EquatorialRadius, body.Flattening)}
	if !c.Bool("non-rotating") {
		spec.cfg.Omega = body.RotationRate
	}

	// Arc flags.
	impactAlt, err := ballisticDefaultQuantity(c, "impact-alt", quantity.Length)
	if err != nil {
		return nil, err
	}
	if !(impactAlt >= -1 && impactAlt <= 100) {
		return nil, inputErrorf("give the height of the impact surface above WGS 84, from -1 to 100 km", "--impact-alt %s is out of range", c.String("impact-alt"))
	}
	above, err := ballisticDefaultQuantity(c, "above", quantity.Length)
	if err != nil {
		return nil, err
	}
	if !(above > impactAlt) || above > 100000 {
		return nil, inputErrorf("give --above higher than --impact-alt, for example 100km", "--above %s is not above the impact surface at %g km", c.String("above"), impactAlt)
	}
	spec.cfg.ImpactAlt, spec.cfg.Above = impactAlt, above

	// Burnout point.
	b := &spec.burnout
	alt, okAlt, err := quantityFlag(c, "burnout-alt", quantity.Length)
	if err != nil {
		return nil, err
	}
	if !okAlt {
		return nil, inputErrorf("add --burnout-alt H, the height of burnout above WGS 84 (for example 35km)", "ballistic needs the burnout height")
	}
	if alt < impactAlt || alt > 10000 {
		return nil, inputErrorf(fmt.Sprintf("give a burnout height from --impact-alt (%g km) to 10000 km", impactAlt), "--burnout-alt %s is out of range", c.String("burnout-alt"))
	}
	b.Alt = alt
	lat, okLat, err := quantityFlag(c, "burnout-lat", quantity.Angle)
	if err != nil {
		return nil, err
	}
	lon, okLon, err := quantityFlag(c, "burnout-lon", quantity.Angle)
	if err != nil {
		return nil, err
	}
	if okLat != okLon {
		return nil, inputErrorf("give both --burnout-lat and --burnout-lon, or --site alone", "the burnout point needs both its latitude and its longitude")
	}
	if c.IsSet("site") {
		name, slat, slon, _, err := parseSiteSpec(c.String("site"))
		if err != nil {
			return nil, err
		}
		spec.siteName = name
		if okLat {
			spec.site = &[2]float64{slat / rad2deg, slon / rad2deg}
		} else {
			lat, lon = slat/rad2deg, slon/rad2deg
		}
	} else if !okLat {
		return nil, inputErrorf("add --site LAT,LON (burnout above the launcher) or --burnout-lat and --burnout-lon", "ballistic needs the burnout point")
	}
	if !(lat >= -math.Pi/2-1e-15 && lat <= math.Pi/2+1e-15) {
		return nil, inputErrorf("give a geodetic latitude from -90 to 90 deg", "--burnout-lat %s is beyond ±90 deg", c.String("burnout-lat"))
	}
	b.Lat = math.Max(-math.Pi/2, math.Min(math.Pi/2, lat))
	b.Lon = math.Remainder(lon, 2*math.Pi)

	// Burnout velocity.
	v, okV, err := quantityFlag(c, "burnout-speed", quantity.Speed)
	if err != nil {
		return nil, err
	}
	if !okV {
		return nil, inputErrorf("add --burnout-speed V relative to the rotating Earth (for example 2km/s)", "ballistic needs the burnout speed")
	}
	if !(v > 0) || v > 20 {
		return nil, inputErrorf("give a burnout speed above 0 and at most 20 km/s", "--burnout-speed %s is out of range", c.String("burnout-speed"))
	}
	b.Speed = v
	gamma, okG, err := quantityFlag(c, "flight-path-angle", quantity.Angle)
	if err != nil {
		return nil, err
	}
	if !okG {
		return nil, inputErrorf("add --flight-path-angle ANGLE above the local horizontal (90 for vertical)", "ballistic needs the flight-path angle")
	}
	if !(math.Abs(gamma) <= math.Pi/2*(1+1e-12)) {
		return nil, inputErrorf("give a flight-path angle from -90 to 90 deg", "--flight-path-angle %s is outside -90..90 deg", c.String("flight-path-angle"))
	}
	b.FlightPath = math.Max(-math.Pi/2, math.Min(math.Pi/2, gamma))
	if b.Alt == impactAlt && !(b.FlightPath > 0) {
		return nil, inputErrorf("give a positive flight-path angle, or a burnout above the impact surface", "a burnout on the impact surface must climb")
	}
	az, okAz, err := quantityFlag(c, "azimuth", quantity.Angle)
	if err != nil {
		return nil, err
	}
	if !okAz && math.Abs(b.FlightPath) < math.Pi/2 {
		return nil, inputErrorf("add --azimuth ANGLE from north through east (90 for east)", "the azimuth is needed unless the flight-path angle is ±90 deg")
	}
	b.Azimuth = wrap2pi(az)

	// Vehicle.
	if err := parseBallisticVehicle(c, spec); err != nil {
		return nil, err
	}

	// Tabulation.
	if c.IsSet("step") {
		step, err := parseDurationFlag(c, "step")
		if err != nil {
			return nil, err
		}
		if !(step >= 1e-3) {
			return nil, inputErrorf("give a step of 1 ms or more, for example 10s", "--step %s is below 1 ms or not positive", c.String("step"))
		}
		spec.step = step
	}
	return spec, parseBallisticDispersion(c, spec)
}

// ballisticDefaultQuantity reads a quantity flag that has a default value.
func ballisticDefaultQuantity(c *cli.Context, name string, k quantity.Kind) (float64, error) {
	v, err := quantity.Parse(k, c.String(name))
	if err != nil {
		return 0, flagError(name, err)
	}
	return v, nil
}

// ballisticText returns the text of a flag whatever its type (the vehicle
// flags may be defined by modelFlags).
func ballisticText(c *cli.Context, name string) string {
	switch v := c.Value(name).(type) {
	case string:
		return v
	case nil:
		return ""
	default:
		return fmt.Sprint(v)
	}
}

func ballisticScalar(c *cli.Context, name string, k quantity.Kind) (float64, bool, error) {
	if !c.IsSet(name) {
		return 0, false, nil
	}
	v, err := quantity.Parse(k, ballisticText(c, name))
	if err != nil {
		return 0, true, flagError(name, err)
	}
	if !(v > 0) {
		return 0, true, inputErrorf("give a positive value", "--%s must be positive, got %s", name, ballisticText(c, name))
	}
	return v, true, nil
}

func parseBallisticVehicle(c *cli.Context, spec *ballisticSpec) error {
	mass, okM, err := ballisticScalar(c, "mass", quantity.Mass)
	if err != nil {
		return err
	}
	area, okA, err := ballisticScalar(c, "area", quantity.Area)
	if err != nil {
		return err
	}
	cd, okC, err := ballisticScalar(c, "cd", quantity.Scalar)
	if err != nil {
		return err
	}
	if c.IsSet("ballistic-coefficient") {
		if okC || okA {
			return inputErrorf("give --ballistic-coefficient alone, or --mass, --area and --cd", "--ballistic-coefficient and --area/--cd both set the drag")
		}
		bc, _, err := ballisticScalar(c, "ballistic-coefficient", quantity.Scalar)
		if err != nil {
			return err
		}
		// m/(Cd A) = bc with A = 1 m^2 and Cd = 1.
		spec.vehicle = suborbital.Vehicle{Mass: bc, Area: 1, Cd: 1}
		spec.bcOnly = true
		return nil
	}
	switch n := ballisticBtoi(okM) + ballisticBtoi(okA) + ballisticBtoi(okC); {
	case n == 3:
		if cd > 10 {
			return inputErrorf("give a drag coefficient of at most 10 (about 0.3 to 1.5 for a payload in the lower atmosphere)", "--cd %s is not a drag coefficient", ballisticText(c, "cd"))
		}
		spec.vehicle = suborbital.Vehicle{Mass: mass, Area: area, Cd: cd}
	case n > 0 && (okA || okC):
		return inputErrorf("give all three of --mass, --area and --cd for drag, or none for a vacuum arc", "drag needs the payload's mass, reference area and drag coefficient")
	}
	// --mass alone (a mission's spacecraft) is a vacuum arc: the mass
	// matters only with the area and Cd.
	return nil
}

func ballisticBtoi(b bool) int {
	if b {
		return 1
	}
	return 0
}

func parseBallisticDispersion(c *cli.Context, spec *ballisticSpec) error {
	sigmaFlags := []string{"sigma-speed", "sigma-flight-path-angle", "sigma-azimuth", "sigma-cd"}
	if !c.IsSet("dispersions") {
		for _, fl := range append(sigmaFlags, "dispersions-out", "seed") {
			if c.IsSet(fl) {
				return inputErrorf("add --dispersions N", "--%s needs --dispersions", fl)
			}
		}
		return nil
	}
	n, err := strconv.Atoi(strings.TrimSpace(c.String("dispersions")))
	if err != nil || n < 2 || n > 1000000 {
		return inputErrorf("give a whole number of cases from 2 to 1000000, for example --dispersions 1000", "--dispersions %q is not usable", c.String("dispersions"))
	}
	seed, err := strconv.ParseUint(strings.TrimSpace(c.String("seed")), 10, 64)
	if err != nil {
		return inputErrorf("give a whole number of 0 or more, for example --seed 1", "--seed %q is not usable", c.String("seed"))
	}
	d := &suborbital.Dispersion{Cases: n, Seed: seed}
	kinds := []quantity.Kind{quantity.Speed, quantity.Angle, quantity.Angle, quantity.Scalar}
	dst := []*float64{&d.Sigma.Speed, &d.Sigma.FlightPath, &d.Sigma.Azimuth, &d.Sigma.Cd}
	for i, fl := range sigmaFlags {
		v, ok, err := quantityFlag(c, fl, kinds[i])
		if err != nil {
			return err
		}
		if ok && !(v >= 0) {
			return inputErrorf("give a 1-sigma value of 0 or more", "--%s %s is negative", fl, c.String(fl))
		}
		*dst[i] = v
	}
	s := d.Sigma
	switch {
	case s == suborbital.Sigma{}:
		return inputErrorf("give at least one of --sigma-speed, --sigma-flight-path-angle, --sigma-azimuth, --sigma-cd", "--dispersions has nothing to disperse")
	case s.Speed > spec.burnout.Speed/4:
		return inputErrorf("give --sigma-speed below a quarter of the burnout speed", "--sigma-speed %s is too large for a normal spread of the speed", c.String("sigma-speed"))
	case s.FlightPath > 10/rad2deg || s.Azimuth > 30/rad2deg:
		return inputErrorf("give at most 10 deg of flight-path angle and 30 deg of azimuth: beyond that the spread is not a dispersion", "--sigma-flight-path-angle or --sigma-azimuth is too large")
	case s.Cd > 0 && !spec.vehicle.HasDrag():
		return inputErrorf("add --mass, --area and --cd, or drop --sigma-cd", "--sigma-cd needs drag")
	case s.Cd > 0 && spec.bcOnly:
		return inputErrorf("give --mass, --area and --cd instead of --ballistic-coefficient to disperse Cd", "--sigma-cd needs --cd")
	case s.Cd > spec.vehicle.Cd/4:
		return inputErrorf("give --sigma-cd below a quarter of --cd", "--sigma-cd %s is too large for a normal spread of Cd", c.String("sigma-cd"))
	}
	spec.disp = d
	spec.dispOut = c.String("dispersions-out")
	if spec.dispOut != "" && spec.dispOut == c.String("out") {
		return inputErrorf("give --dispersions-out and --out different files", "--dispersions-out and --out are the same file")
	}
	return nil
}

// ballisticError explains why an arc could not be flown.
func ballisticError(err error) error {
	msg := strings.ReplaceAll(err.Error(), "suborbital: ", "")
	var ce *suborbital.CaseError
	caseFix := ""
	if errors.As(err, &ce) {
		caseFix = "; or reduce the --sigma-* values"
	}
	switch {
	case errors.Is(err, suborbital.ErrEscape):
		return inputErrorf("lower --burnout-speed: ballistic computes arcs that come down"+caseFix, "%s", msg)
	case errors.Is(err, suborbital.ErrOrbit):
		return inputErrorf("lower --burnout-speed or steepen --flight-path-angle; for an orbit use 'centra orbit' or 'centra lifetime'"+caseFix, "%s", msg)
	case errors.Is(err, suborbital.ErrNoImpact):
		return inputErrorf("lower --burnout-speed; for a decaying orbit use 'centra lifetime'"+caseFix, "%s", msg)
	case errors.Is(err, suborbital.ErrBurnout), errors.Is(err, suborbital.ErrVehicle), errors.Is(err, suborbital.ErrDispersion):
		return inputErrorf("check the burnout, vehicle and dispersion flags", "%s", msg)
	case errors.Is(err, propagate.ErrModel):
		return inputErrorf("use --equations fast or engine with drag", "%s", msg)
	}
	var se *propagate.StepError
	if errors.As(err, &se) {
		return inputErrorf("loosen --tolerance or check the burnout"+caseFix, "the integration stopped at t = %.3f s after burnout: %v", se.T, se.Err)
	}
	return inputErrorf("check the burnout and the model"+caseFix, "%s", msg)
}

func ballisticDeg(x float64) float64 { return x * rad2deg }

// ballisticEcho returns an input angle in degrees rounded to 1e-10 deg,
// so that 57.35 deg given prints as 57.35 after the trip through radians.
func ballisticEcho(x float64) float64 { return math.Round(x*rad2deg*1e10) / 1e10 }

// ballisticRecords lays out the result: the burnout, the arc, the
// dispersion (each a section of the table; one flat object in JSON).
func ballisticRecords(spec *ballisticSpec, f *suborbital.Flight, arc suborbital.Arc, disp *suborbital.DispersionResult) (burnout, arcRec, dispRec reports.Record) {
	b, v := spec.burnout, spec.vehicle
	dragLabel := "none (vacuum arc)"
	if v.HasDrag() {
		dragLabel = "cannonball, USSA 1976"
	}
	rotation := "on"
	if spec.cfg.Omega == 0 {
		rotation = "off (--non-rotating)"
	}
	burnout = reports.Record{
		{Key: "burnout_utc", Label: "burnout time", Value: formatEpoch(spec.ep)},
		reports.Num("burnout_lat_deg", "burnout latitude (geodetic)", ballisticEcho(b.Lat), 9),
		reports.Num("burnout_lon_deg", "burnout longitude", ballisticEcho(b.Lon), 10),
		reports.Num("burnout_alt_km", "burnout height (WGS 84)", b.Alt, 9),
		reports.Num("burnout_speed_km_s", "burnout speed (Earth-relative)", b.Speed, 9),
		reports.Num("flight_path_angle_deg", "flight-path angle", ballisticEcho(b.FlightPath), 9),
		reports.Num("azimuth_deg", "azimuth", ballisticEcho(b.Azimuth), 9),
		{Key: "gravity", Label: "gravity", Value: spec.model},
		{Key: "earth_rotation", Label: "Earth rotation", Value: rotation},
		{Key: "drag", Label: "drag", Value: dragLabel},
		reports.Opt("ballistic_coefficient_kg_m2", "ballistic coefficient m/(Cd A)", v.BallisticCoefficient(), v.HasDrag(), 6),
	}
	if v.HasDrag() && !spec.bcOnly {
		burnout = append(burnout,
			reports.Num("mass_kg", "mass", v.Mass, 6),
			reports.Num("area_m2", "reference area", v.Area, 6),
			reports.Num("cd", "drag coefficient", v.Cd, 6))
	}
	at := func(t float64) string { return formatEpoch(spec.ep.Add(t)) }
	rangeMethod := "WGS 84 geodesic"
	if arc.RangeApprox {
		rangeMethod = "mean-sphere great circle"
	}
	arcRec = reports.Record{
		reports.Num("apogee_alt_km", "apogee height (WGS 84)", arc.Apogee.Alt, 9),
		reports.Num("time_to_apogee_s", "time to apogee", arc.Apogee.T, 9),
		{Key: "apogee_utc", Label: "apogee time", Value: at(arc.Apogee.T)},
		reports.Num("apogee_lat_deg", "apogee latitude", ballisticDeg(arc.Apogee.Lat), 9),
		reports.Num("apogee_lon_deg", "apogee longitude", ballisticDeg(arc.Apogee.Lon), 10),
		reports.Num("apogee_speed_km_s", "speed at apogee (Earth-relative)", arc.Apogee.Speed, 9),
		reports.Num("above_alt_km", "time above is counted above", spec.cfg.Above, 9),
		reports.Num("time_above_s", "time above that height", arc.TimeAbove, 9),
		reports.Opt("above_up_s", "rises through it at", arc.AboveUp, arc.WasAbove, 9),
		reports.Opt("above_down_s", "falls through it at", arc.AboveDown, arc.WasAbove, 9),
		reports.Num("flight_time_s", "flight time to impact", arc.FlightTime, 9),
		{Key: "impact_utc", Label: "impact time", Value: at(arc.FlightTime)},
		reports.Num("impact_alt_km", "impact surface height (WGS 84)", spec.cfg.ImpactAlt, 9),
		reports.Num("impact_lat_deg", "impact latitude (geodetic)", ballisticDeg(arc.Impact.Lat), 9),
		reports.Num("impact_lon_deg", "impact longitude", ballisticDeg(arc.Impact.Lon), 10),
		{Key: "impact_uncertainty", Label: "impact point uncertainty", Value: ballisticUncertainty(v.HasDrag())},
		reports.Num("impact_speed_km_s", "impact speed (Earth-relative)", arc.Impact.Speed, 9),
		reports.Num("ground_range_km", "ground range from below burnout", arc.GroundRange, 9),
		reports.Num("range_azimuth_deg", "direction of impact from burnout", ballisticDeg(arc.RangeAzimuth), 8),
		{Key: "ground_range_method", Label: "ground range is the", Value: rangeMethod},
	}
	if spec.site != nil {
		s, _, _, err := suborbital.Inverse(f.Ellipsoid(), spec.site[0], spec.site[1], arc.Impact.Lat, arc.Impact.Lon)
		arcRec = append(arcRec, reports.Opt("range_from_site_km", "ground range from the site", s, err == nil, 9))
	}
	if disp != nil {
		d := spec.disp
		off, _, _, err := suborbital.Inverse(f.Ellipsoid(), arc.Impact.Lat, arc.Impact.Lon, disp.MeanLat, disp.MeanLon)
		dispRec = reports.Record{
			{Key: "dispersion_cases", Label: "cases", Value: d.Cases},
			ballisticSeedField(d.Seed),
			reports.Num("sigma_speed_km_s", "1-sigma burnout speed", d.Sigma.Speed, 6),
			reports.Num("sigma_flight_path_angle_deg", "1-sigma flight-path angle", ballisticEcho(d.Sigma.FlightPath), 6),
			reports.Num("sigma_azimuth_deg", "1-sigma azimuth", ballisticEcho(d.Sigma.Azimuth), 6),
			reports.Num("sigma_cd", "1-sigma Cd", d.Sigma.Cd, 6),
			reports.Num("mean_impact_lat_deg", "mean impact latitude", ballisticDeg(disp.MeanLat), 9),
			reports.Num("mean_impact_lon_deg", "mean impact longitude", ballisticDeg(disp.MeanLon), 10),
			reports.Opt("mean_impact_offset_km", "mean impact from the nominal", off, err == nil, 6),
			reports.Num("ellipse_1sigma_major_km", "1-sigma ellipse, semi-major axis", disp.Sigma1.SemiMajor, 6),
			reports.Num("ellipse_1sigma_minor_km", "1-sigma ellipse, semi-minor axis", disp.Sigma1.SemiMinor, 6),
			reports.Num("ellipse_3sigma_major_km", "3-sigma ellipse, semi-major axis", disp.Sigma3.SemiMajor, 6),
			reports.Num("ellipse_3sigma_minor_km", "3-sigma ellipse, semi-minor axis", disp.Sigma3.SemiMinor, 6),
			reports.Num("ellipse_major_azimuth_deg", "major axis, from north", ballisticDeg(disp.Sigma1.Azimuth), 5),
			reports.Num("apogee_alt_mean_km", "apogee, mean", disp.Apogee.Mean, 7),
			reports.Num("apogee_alt_std_km", "apogee, standard deviation", disp.Apogee.Std, 5),
			reports.Num("time_above_mean_s", "time above, mean", disp.TimeAbove.Mean, 7),
			reports.Num("time_above_std_s", "time above, standard deviation", disp.TimeAbove.Std, 5),
			reports.Num("flight_time_mean_s", "flight time, mean", disp.FlightTime.Mean, 7),
			reports.Num("flight_time_std_s", "flight time, standard deviation", disp.FlightTime.Std, 5),
		}
	}
	return burnout, arcRec, dispRec
}

// ballisticUncertainty names the dominant uncertainties of the impact
// point, in the table beside it.
func ballisticUncertainty(drag bool) string {
	if drag {
		return "burnout dispersion; winds (not modelled); drag model"
	}
	return "burnout dispersion; winds (not modelled); no drag"
}

func ballisticArcRecords(points []suborbital.Point, ep epoch) []reports.Record {
	rows := make([]reports.Record, len(points))
	for i, p := range points {
		rows[i] = reports.Record{
			{Key: "utc", Value: formatEpoch(ep.Add(p.T))},
			reports.Num("t_s", "", p.T, 10),
			reports.Num("lat_deg", "", ballisticDeg(p.Lat), 9),
			reports.Num("lon_deg", "", ballisticDeg(p.Lon), 10),
			reports.Num("alt_km", "", p.Alt, 9),
			reports.Num("speed_km_s", "", p.Speed, 7),
		}
	}
	return rows
}

func ballisticCaseRecords(disp *suborbital.DispersionResult) []reports.Record {
	rows := make([]reports.Record, len(disp.Cases))
	for i, c := range disp.Cases {
		rows[i] = reports.Record{
			{Key: "case", Value: c.Index},
			reports.Num("speed_km_s", "", c.Burnout.Speed, 10),
			reports.Num("flight_path_angle_deg", "", ballisticDeg(c.Burnout.FlightPath), 10),
			reports.Num("azimuth_deg", "", ballisticDeg(c.Burnout.Azimuth), 10),
			reports.Num("cd", "", c.Cd, 10),
			reports.Num("apogee_alt_km", "", c.Apogee, 10),
			reports.Num("time_above_s", "", c.TimeAbove, 10),
			reports.Num("flight_time_s", "", c.FlightTime, 10),
			reports.Num("impact_lat_deg", "", ballisticDeg(c.ImpactLat), 10),
			reports.Num("impact_lon_deg", "", ballisticDeg(c.ImpactLon), 10),
			reports.Num("east_km", "", c.East, 10),
			reports.Num("north_km", "", c.North, 10),
		}
	}
	return rows
}

var ballisticCaseHeader = []string{"case", "speed_km_s", "flight_path_angle_deg", "azimuth_deg", "cd", "apogee_alt_km", "time_above_s", "flight_time_s", "impact_lat_deg", "impact_lon_deg", "east_km", "north_km"}

var ballisticArcHeader = []string{"utc", "t_s", "lat_deg", "lon_deg", "alt_km", "speed_km_s"}

// writeBallisticCases writes --dispersions-out atomically.
func writeBallisticCases(spec *ballisticSpec, disp *suborbital.DispersionResult, force bool) error {
	do := &output{}
	path := spec.dispOut
	if err := do.openFile(path, force); err != nil {
		return ballisticRenameFlag(err, "--out", "--dispersions-out")
	}
	return ballisticRenameFlag(do.finish(reports.WriteCSVList(do.W, ballisticCaseHeader, ballisticCaseRecords(disp))), "--out", "--dispersions-out")
}

// ballisticRenameFlag makes the messages of the shared --out file code name the
// flag the user gave.
func ballisticRenameFlag(err error, from, to string) error {
	var ie *inputError
	if errors.As(err, &ie) {
		return &inputError{What: strings.ReplaceAll(ie.What, from, to), Fix: ie.Fix}
	}
	return err
}

func writeBallistic(o *output, spec *ballisticSpec, f *suborbital.Flight, arc suborbital.Arc, points []suborbital.Point, disp *suborbital.DispersionResult, exps []expectation) error {
	burnout, arcRec, dispRec := ballisticRecords(spec, f, arc, disp)
	full := append(append(append(reports.Record{}, burnout...), arcRec...), dispRec...)
	rows, failed, err := checkExpectations(exps, full)
	if err != nil {
		return err
	}
	cautions := ballisticCautions(spec.vehicle.HasDrag())
	title := fmt.Sprintf("Ballistic arc from burnout at %s", formatEpoch(spec.ep))
	if spec.siteName != "" && !strings.Contains(spec.siteName, ",") {
		title += " over " + spec.siteName
	}
	switch o.Format {
	case "json":
		full = append(full, reports.Field{Key: "cautions", Value: cautions})
		if points != nil {
			full = append(full, reports.Field{Key: "arc", Value: ballisticArcRecords(points, spec.ep)})
		}
		if disp != nil {
			full = append(full, reports.Field{Key: "cases", Value: ballisticCaseRecords(disp)})
		}
		if len(rows) > 0 {
			full = append(full, reports.Field{Key: "expectations", Value: rows})
		}
		if err := reports.WriteJSON(o.W, full); err != nil {
			return err
		}
	case "csv":
		if points != nil {
			if err := reports.WriteCSVList(o.W, ballisticArcHeader, ballisticArcRecords(points, spec.ep)); err != nil {
				return err
			}
			if !o.Quiet {
				if err := writeBallisticTable(o.Stderr, title, burnout, arcRec, dispRec, spec); err != nil {
					return err
				}
			}
		} else if err := reports.WriteCSV(o.W, full); err != nil {
			return err
		}
		if !o.Quiet {
			writeBallisticCautions(o.Stderr, cautions)
		}
		if len(rows) > 0 {
			reports.WriteListTable(o.Stderr, rows)
		}
	default:
		if err := writeBallisticTable(o.W, title, burnout, arcRec, dispRec, spec); err != nil {
			return err
		}
		fmt.Fprintln(o.W)
		writeBallisticCautions(o.W, cautions)
		if points != nil {
			fmt.Fprintln(o.W)
			reports.WriteTitle(o.W, fmt.Sprintf("Arc every %s s (speed relative to the rotating Earth; the last row is the impact)", trimFloat(spec.step, 6)))
			if err := reports.WriteListTable(o.W, ballisticArcRecords(points, spec.ep)); err != nil {
				return err
			}
		}
		if len(rows) > 0 {
			fmt.Fprintln(o.W)
			reports.WriteTitle(o.W, "Expectations")
			if err := reports.WriteListTable(o.W, rows); err != nil {
				return err
			}
		}
	}
	if failed > 0 {
		return &expectationError{Failed: failed, Total: len(rows)}
	}
	return nil
}

func writeBallisticTable(w io.Writer, title string, burnout, arcRec, dispRec reports.Record, spec *ballisticSpec) error {
	reports.WriteTitle(w, title)
	if err := reports.WriteSummaryTable(w, burnout); err != nil {
		return err
	}
	fmt.Fprintln(w)
	reports.WriteTitle(w, "Arc: apogee, time above, impact")
	if err := reports.WriteSummaryTable(w, arcRec); err != nil {
		return err
	}
	if dispRec != nil {
		fmt.Fprintln(w)
		reports.WriteTitle(w, fmt.Sprintf("Impact dispersion, %d cases (ellipses in the east-north plane at the mean impact point)", spec.disp.Cases))
		if err := reports.WriteSummaryTable(w, dispRec); err != nil {
			return err
		}
	}
	return nil
}

func writeBallisticCautions(w io.Writer, cautions []string) {
	reports.WriteTitle(w, "Cautions")
	for _, c := range cautions {
		fmt.Fprintf(w, "- %s\n", strings.ReplaceAll(wrapText(c, 76), "\n", "\n  "))
	}
}

// ballisticSeedField is the seed as a number, or as text beyond 2^53
// where JSON readers lose integers.
func ballisticSeedField(seed uint64) reports.Field {
	if seed < 1<<53 {
		return reports.Field{Key: "seed", Label: "seed", Value: int(seed)}
	}
	return reports.Field{Key: "seed", Label: "seed", Value: strconv.FormatUint(seed, 10)}
}
