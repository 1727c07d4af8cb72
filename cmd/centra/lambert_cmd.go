package main

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/cmd/centra/internal/quantity"
	"centra/orbit"
	"centra/orbit/lambert"
	"centra/reports"
)

func init() { register(55, lambertCommand) }

// lambertMethod names the solver in the output.
const lambertMethod = "Izzo 2015"

func lambertFlags() []cli.Flag {
	geo, sol, dv := "Geometry (inertial frame of the body)", "Solution", "Delta-v"
	return []cli.Flag{
		&cli.StringFlag{Name: "body", Value: "earth", Usage: "central `NAME` (see 'centra bodies')", Category: geo},
		&cli.StringFlag{Name: "r1", Usage: "departure position `X,Y,Z` (required)", Category: geo},
		&cli.StringFlag{Name: "r2", Usage: "arrival position `X,Y,Z` (required)", Category: geo},
		&cli.StringFlag{Name: "tof", Usage: "time of flight `DURATION` (required; for example 76min or 1d6h)", Category: geo},
		&cli.BoolFlag{Name: "retrograde", Usage: "move clockwise seen from +z (default prograde: counter-clockwise)", Category: sol},
		&cli.StringFlag{Name: "revs", Value: "0", Usage: "`N` complete revolutions before arriving", Category: sol},
		&cli.StringFlag{Name: "branch", Usage: "with --revs 1 or more, which of the two solutions: `short` (shorter period) or long", Category: sol},
		&cli.StringFlag{Name: "v1-before", Usage: "velocity `VX,VY,VZ` at r1 before departure: reports the departure burn", Category: dv},
		&cli.StringFlag{Name: "v2-after", Usage: "velocity `VX,VY,VZ` wanted at r2 after arrival: reports the arrival burn", Category: dv},
		expectFlag(),
	}
}

func lambertCommand() *cli.Command {
	return &cli.Command{
		Name:  "lambert",
		Usage: "velocities joining two positions in a time of flight (Lambert's problem)",
		UsageText: `centra lambert --r1 X,Y,Z --r2 X,Y,Z --tof D [--retrograde] [--revs N --branch short|long]
    [--v1-before VX,VY,VZ] [--v2-after VX,VY,VZ] [--body NAME] [--expect NAME=VALUE±TOL ...]

examples:
  centra lambert --r1 15945.34,0,0 --r2 12214.83899,10249.46731,0 --tof 76min
  centra --format json lambert --r1 7000,0,0 --r2 -1389.19,6302.77,4727.08 --tof 5h --revs 1 --branch short
  centra lambert --r1 7000,0,0 --r2 -42003.6,3674.8,0 --tof 5h --v1-before 0,7.546,0 --v2-after -0.26797,-3.063,0
  centra lambert --r1 15945.34,0,0 --r2 12214.83899,10249.46731,0 --tof 76min --expect v1_x_km_s=2.058913±1e-6`,
		Description: `Solves Lambert's problem about one body: the two-body (point-mass) orbit that
leaves --r1 and reaches --r2 after --tof, and its velocities v1 at r1 and v2
at r2, with Izzo's method (D. Izzo, "Revisiting Lambert's problem", Celestial
Mechanics and Dynamical Astronomy 121, 2015). Positions and velocities are in
any inertial frame centred on the body (GCRF for the Earth); lengths take
units (km, m, au), speeds km/s or m/s.

Direction: prograde (default) moves counter-clockwise seen from +z, so the
transfer angle is measured counter-clockwise from r1 to r2, in (0, 360) deg;
--retrograde moves clockwise. When r1 and r2 are collinear with the centre
(transfer angle 0 or 180 deg) the plane of the transfer is undefined: move one
end point off that line, in the plane you want.

Revolutions: --revs N asks for N complete revolutions before arriving; such
solutions exist only above a minimum time of flight (min_tof_s, printed when
--tof is too short), and then there are two. --branch short picks the one with
the shorter period (smaller semi-major axis), long the one with the longer
period; centra solves both of Izzo's branches and compares their periods, and
izzo_branch says which it was (left: the larger swept eccentric anomaly,
nearer (N+1) revolutions; right: nearer N).

--v1-before and --v2-after give the velocities on the orbits joined, so the
burns dv_departure_km_s = |v1 - v1_before| and dv_arrival_km_s = |v2_after -
v2| and their sum dv_total_km_s are reported.

JSON keys: method, v1_km_s, v2_km_s (vectors), transfer_angle_deg,
semi_major_axis_km (null for a parabola), eccentricity, conic, period_s (null
unless an ellipse), periapsis_alt_km, min_alt_km (lowest altitude on the
arc), min_tof_s (with --revs), dv_departure_km_s, dv_arrival_km_s,
dv_total_km_s (null unless the velocities are given). CSV: one row, vectors in
three columns (v1_x_km_s, ...); --expect takes those column names too.`,
		Flags:  lambertFlags(),
		Action: lambertAction,
	}
}

// lambertSpec is the parsed command line, in internal units.
type lambertSpec struct {
	body          *bodies.Body
	r1, r2        [3]float64 // km
	tof           float64    // s
	opts          lambert.Options
	branch        string // "", "short" or "long"
	v1b, v2a      [3]float64
	hasV1b, hasV2 bool
}

// lambertResult is the solution and what the report says about it.
type lambertResult struct {
	spec       *lambertSpec
	v1, v2     [3]float64
	izzo       lambert.Branch
	angle      float64 // transfer angle, rad, in (0, 2π)
	geom       orbit.Geometry
	minRadius  float64 // lowest radius on the arc, km
	minTOF     float64 // s (revs > 0)
	dv1, dv2   float64
	warnings   []string
	hasMinTOF  bool
	hasDVTotal bool
}

func lambertAction(c *cli.Context) error {
	spec, err := parseLambert(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	res, err := solveLambert(spec)
	if err != nil {
		return err
	}
	rec := lambertRecord(res)
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	if o.Format != "table" {
		for _, w := range res.warnings {
			o.warn("%s", w)
		}
	}
	title := fmt.Sprintf("Lambert transfer about %s in %s (%s, %s)", spec.body.Name, lambertDuration(spec.tof), lambertMethod, lambertDirection(spec))
	err = lambertEmit(o, title, rec, exps, func() error {
		if o.Format != "table" {
			return nil
		}
		for _, w := range res.warnings {
			fmt.Fprintf(o.W, "\nWARNING: %s\n", w)
		}
		return nil
	})
	return o.finish(err)
}

func parseLambert(c *cli.Context) (*lambertSpec, error) {
	b, err := lookupBody(c, c.String("body"))
	if err != nil {
		return nil, err
	}
	s := &lambertSpec{body: b}
	for _, f := range []string{"r1", "r2", "tof"} {
		if !c.IsSet(f) {
			return nil, inputErrorf("give --r1 X,Y,Z --r2 X,Y,Z --tof DURATION; run 'centra lambert --help' for an example", "--%s is required", f)
		}
	}
	if s.r1, _, err = vectorFlag(c, "r1", quantity.Length); err != nil {
		return nil, err
	}
	if s.r2, _, err = vectorFlag(c, "r2", quantity.Length); err != nil {
		return nil, err
	}
	for _, p := range []struct {
		name string
		r    [3]float64
	}{{"r1", s.r1}, {"r2", s.r2}} {
		if p.r == [3]float64{} {
			return nil, inputErrorf("give a position away from the centre", "--%s is the centre of %s (|%s| = 0 km): Lambert's problem needs two points off the centre", p.name, b.Name, p.name)
		}
	}
	if s.tof, err = parseDurationFlag(c, "tof"); err != nil {
		return nil, err
	}
	if !(s.tof > 0) {
		return nil, inputErrorf("give a positive time of flight, for example --tof 90min", "--tof must be positive, got %g s", s.tof)
	}
	revs, err := strconv.Atoi(strings.TrimSpace(c.String("revs")))
	if err != nil || revs < 0 {
		return nil, inputErrorf("give a whole number of revolutions, 0 or more", "--revs %q is not a whole number of 0 or more", c.String("revs"))
	}
	s.opts = lambert.Options{Retrograde: c.Bool("retrograde"), Revs: revs}
	switch br := strings.ToLower(strings.TrimSpace(c.String("branch"))); {
	case revs == 0 && c.IsSet("branch"):
		return nil, inputErrorf("drop --branch, or ask for --revs 1 or more", "--branch chooses between the two solutions with complete revolutions; with --revs 0 the solution is unique")
	case revs > 0 && !c.IsSet("branch"):
		return nil, inputErrorf("add --branch short (the shorter-period solution) or --branch long", "with --revs %d there are two solutions", revs)
	case revs > 0 && br != "short" && br != "long":
		return nil, inputErrorf("write --branch short or --branch long", "--branch %q is not short or long", c.String("branch"))
	default:
		s.branch = br
	}
	if s.v1b, s.hasV1b, err = vectorFlag(c, "v1-before", quantity.Speed); err != nil {
		return nil, err
	}
	if s.v2a, s.hasV2, err = vectorFlag(c, "v2-after", quantity.Speed); err != nil {
		return nil, err
	}
	return s, nil
}

// solveLambert calls the lambert package; the geometry of the solution
// comes from the orbit package.
func solveLambert(s *lambertSpec) (*lambertResult, error) {
	mu := s.body.GM
	res := &lambertResult{spec: s}
	var err error
	if s.opts.Revs == 0 {
		res.v1, res.v2, err = lambert.Solve(mu, s.r1, s.r2, s.tof, s.opts)
		if err != nil {
			return nil, lambertError(s, err)
		}
	} else {
		// Both branches; the words short and long go by the period.
		type sol struct {
			v1, v2 [3]float64
			a      float64
			b      lambert.Branch
		}
		var sols [2]sol
		for i, br := range []lambert.Branch{lambert.Left, lambert.Right} {
			o := s.opts
			o.Branch = br
			v1, v2, err := lambert.Solve(mu, s.r1, s.r2, s.tof, o)
			if err != nil {
				return nil, lambertError(s, err)
			}
			g, err := orbit.GeometryOfState(mu, orbit.State{R: s.r1, V: v1})
			if err != nil {
				return nil, inputErrorf("check the geometry", "the transfer orbit of the %s branch: %v", br, err)
			}
			sols[i] = sol{v1, v2, g.SemiMajorAxis, br}
		}
		short, long := sols[0], sols[1]
		if long.a < short.a {
			short, long = long, short
		}
		pick := short
		if s.branch == "long" {
			pick = long
		}
		res.v1, res.v2, res.izzo = pick.v1, pick.v2, pick.b
		res.minTOF, err = lambert.MinTimeOfFlight(mu, s.r1, s.r2, s.opts)
		if err != nil {
			return nil, lambertError(s, err)
		}
		res.hasMinTOF = true
	}
	st := orbit.State{R: s.r1, V: res.v1}
	res.geom, err = orbit.GeometryOfState(mu, st)
	if err != nil {
		return nil, inputErrorf("check the geometry", "the transfer orbit: %v", err)
	}
	el, err := orbit.ElementsFromState(mu, st)
	if err != nil {
		return nil, inputErrorf("check the geometry", "the transfer orbit: %v", err)
	}
	res.angle = lambert.SweptAngle(s.r1, s.r2, res.v1)
	res.minRadius = lambert.LowestRadius(el, res.geom, res.angle, s.opts.Revs, s.r1, s.r2)
	if s.hasV1b {
		res.dv1 = lambertNorm(lambertSub(res.v1, s.v1b))
	}
	if s.hasV2 {
		res.dv2 = lambertNorm(lambertSub(s.v2a, res.v2))
	}
	res.hasDVTotal = s.hasV1b && s.hasV2
	re := s.body.EquatorialRadius
	for _, p := range []struct {
		name string
		r    [3]float64
	}{{"r1", s.r1}, {"r2", s.r2}} {
		if n := lambertNorm(p.r); n < re {
			res.warnings = append(res.warnings, fmt.Sprintf("--%s (|%s| = %s km) is inside %s (equatorial radius %g km)", p.name, p.name, transferKm(n), s.body.Name, re))
		}
	}
	if res.minRadius < re && lambertNorm(s.r1) >= re && lambertNorm(s.r2) >= re {
		res.warnings = append(res.warnings, fmt.Sprintf("the arc passes periapsis at %s km altitude, below the surface of %s: this transfer hits the body", transferKm(res.minRadius-re), s.body.Name))
	}
	return res, nil
}

// lambertError turns a package error into the one-line input error.
func lambertError(s *lambertSpec, err error) error {
	var re *lambert.RevsError
	if errors.As(err, &re) {
		floor := math.Ceil(re.MinTOF*1000) / 1000
		return inputErrorf(fmt.Sprintf("give --tof %.3f (seconds) or more, or fewer --revs", floor),
			"no transfer with %d complete revolution(s) in %s: the minimum time of flight for this geometry is %s", re.Revs, lambertDuration(re.TOF), lambertDuration(floor))
	}
	if errors.Is(err, lambert.ErrNoConvergence) {
		return inputErrorf("check that --r1, --r2 and --tof are in the units meant (km and s unless a unit is given)",
			"the Lambert solver did not converge for a time of flight of %g s between these positions", s.tof)
	}
	var ie *lambert.InputError
	if errors.As(err, &ie) && errors.Is(err, lambert.ErrPlaneUndefined) {
		return inputErrorf("use a non-collinear geometry: move one end point off the line through the centre, in the plane you want the transfer to have (a tilt of 0.001 deg is enough)",
			"--r1 and --r2 are collinear with the centre of %s (transfer angle %g deg), so the plane of the transfer is undefined", s.body.Name, ie.Value)
	}
	msg := strings.TrimPrefix(err.Error(), "lambert: ")
	return inputErrorf("check --r1, --r2 and --tof", "%s", msg)
}

func lambertDot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func lambertNorm(a [3]float64) float64   { return math.Sqrt(lambertDot(a, a)) }
func lambertSub(a, b [3]float64) [3]float64 {
	return [3]float64{a[0] - b[0], a[1] - b[1], a[2] - b[2]}
}

func lambertDirection(s *lambertSpec) string {
	d := "prograde"
	if s.opts.Retrograde {
		d = "retrograde"
	}
	if s.opts.Revs > 0 {
		d += fmt.Sprintf(", %d rev, %s branch", s.opts.Revs, s.branch)
	}
	return d
}

// lambertDuration prints a time of flight for people: 4560 s (1.267 h).
func lambertDuration(t float64) string {
	s := strconv.FormatFloat(t, 'f', -1, 64)
	if t >= 1e6 || (t < 1e-3 && t > 0) {
		s = fmt.Sprintf("%.6g", t)
	}
	switch {
	case t >= 86400:
		return fmt.Sprintf("%s s (%.4g d)", s, t/86400)
	case t >= 3600:
		return fmt.Sprintf("%s s (%.4g h)", s, t/3600)
	case t >= 60:
		return fmt.Sprintf("%s s (%.4g min)", s, t/60)
	}
	return s + " s"
}

func lambertRecord(res *lambertResult) reports.Record {
	s := res.spec
	re := s.body.EquatorialRadius
	g := res.geom
	var branch, izzo any
	if s.opts.Revs > 0 {
		branch, izzo = s.branch, res.izzo.String()
	}
	rec := reports.Record{
		{Key: "method", Label: "method", Value: lambertMethod},
		{Key: "body", Label: "central body", Value: s.body.Name},
		{Key: "direction", Label: "direction", Value: map[bool]string{false: "prograde", true: "retrograde"}[s.opts.Retrograde]},
		{Key: "revs", Label: "complete revolutions", Value: s.opts.Revs},
		{Key: "branch", Label: "branch", Value: branch},
		{Key: "izzo_branch", Label: "Izzo's branch", Value: izzo},
		reports.Num("tof_s", "time of flight", s.tof, 10),
		{Key: "r1_km", Label: "departure position", Value: s.r1, Digits: 10},
		{Key: "r2_km", Label: "arrival position", Value: s.r2, Digits: 10},
		reports.Num("transfer_angle_deg", "transfer angle (in the sense of motion)", res.angle*rad2deg, 10),
		{Key: "v1_km_s", Label: "velocity at departure", Value: res.v1, Digits: 10},
		{Key: "v2_km_s", Label: "velocity at arrival", Value: res.v2, Digits: 10},
		reports.Num("speed_departure_km_s", "speed at departure", lambertNorm(res.v1), 10),
		reports.Num("speed_arrival_km_s", "speed at arrival", lambertNorm(res.v2), 10),
		{Key: "conic", Label: "transfer conic", Value: g.Conic.String()},
		reports.Opt("semi_major_axis_km", "semi-major axis of the transfer conic", g.SemiMajorAxis, g.HasSemiMajorAxis, 10),
		reports.Num("eccentricity", "eccentricity of the transfer conic", g.Eccentricity, 10),
		reports.Opt("period_s", "period of the transfer conic", g.Period, g.HasPeriod, 10),
		reports.Num("periapsis_alt_km", "periapsis altitude of the transfer conic", g.PeriapsisRadius-re, 10),
		reports.Num("min_alt_km", "lowest altitude on the arc", res.minRadius-re, 10),
		reports.Opt("min_tof_s", "minimum time of flight for these revolutions", res.minTOF, res.hasMinTOF, 10),
	}
	if s.hasV1b {
		rec = append(rec, reports.Field{Key: "v1_before_km_s", Label: "velocity before departure", Value: s.v1b, Digits: 10})
	}
	rec = append(rec, reports.Opt("dv_departure_km_s", "departure burn", res.dv1, s.hasV1b, 10))
	if s.hasV2 {
		rec = append(rec, reports.Field{Key: "v2_after_km_s", Label: "velocity after arrival", Value: s.v2a, Digits: 10})
	}
	rec = append(rec,
		reports.Opt("dv_arrival_km_s", "arrival burn", res.dv2, s.hasV2, 10),
		reports.Opt("dv_total_km_s", "total delta-v", res.dv1+res.dv2, res.hasDVTotal, 10))
	if len(res.warnings) > 0 {
		rec = append(rec, reports.Field{Key: "warnings", Value: res.warnings})
	}
	return rec
}

// lambertEmit is emitWithExpectations with one addition: --expect also
// takes the components of the vectors under their CSV column names
// (v1_x_km_s), which are checked but not printed twice.
func lambertEmit(o *output, title string, rec reports.Record, exps []expectation, extra func() error) error {
	check := append(reports.Record(nil), rec...)
	for _, f := range rec {
		v, ok := f.Value.([3]float64)
		if !ok {
			continue
		}
		suffix := "_km_s"
		if !strings.HasSuffix(f.Key, suffix) {
			suffix = "_km"
		}
		base := strings.TrimSuffix(f.Key, suffix)
		for i, axis := range []string{"x", "y", "z"} {
			check = append(check, reports.Num(base+"_"+axis+suffix, "", v[i], f.Digits))
		}
	}
	return o.emitCheckedWithExpectations(title, rec, check, exps, extra)
}
