package main

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"
	"time"

	"github.com/urfave/cli/v2"

	"centra/bodies/earthframe"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
	"centra/reports"
)

func init() { register(30, ephemerisCommand) }

func ephemerisCommand() *cli.Command {
	flags := append(orbitFlags(), modelFlags()...)
	flags = append(flags, spanFlags("1d", "60s")...)
	flags = append(flags,
		&cli.StringFlag{Name: "frame", Value: "inertial", Usage: "output `FRAME`: inertial (GCRF), fixed (ITRF, Earth only) or geodetic (WGS 84 latitude, longitude, altitude; Earth only)"},
		&cli.BoolFlag{Name: "checks", Usage: "add the conservation and Kepler-law checks of the propagation"},
		&cli.BoolFlag{Name: "final", Usage: "print only the state at the end of the span, as one record (final_x_km, ..., final_radius_km; for --expect and 'centra sweep')"},
		&cli.StringFlag{Name: "dut1", Value: "0", Usage: "UT1-UTC in `SECONDS` for the Earth-fixed frames (IERS Bulletin A), |DUT1| <= 0.9"},
		&cli.StringFlag{Name: "object-name", Value: "SPACECRAFT", Usage: "OBJECT_NAME for --format oem"},
		&cli.StringFlag{Name: "object-id", Value: "UNKNOWN", Usage: "OBJECT_ID for --format oem (international designator when there is one)"},
		expectFlag(),
	)
	return &cli.Command{
		Name:  "ephemeris",
		Usage: "tabulated states over a span at a fixed step",
		UsageText: `centra ephemeris [orbit flags] [--span D] [--step D] [--model point|j2|zonal] [--frame inertial|fixed|geodetic]

examples:
  centra ephemeris --altitude 500 --inclination 51.6 --span 1d --step 10min
  centra --format csv ephemeris --altitude 500 --inclination 97.4 --span 7d --step 30s --out track.csv
  centra --format csv ephemeris --altitude 500 --inclination 97.4 --frame geodetic --span 2h --step 1min
  centra --format oem ephemeris --periapsis-alt 300 --apoapsis-alt 1200 --inclination 63.4 --object-name LARK-1
  centra ephemeris --altitude 800 --inclination 98 --model zonal --degree 6 --span 3d --checks
  centra ephemeris --altitude 500 --inclination 51.6 --span 1d --final --checks`,
		Description: `Propagates the orbit with the chosen force model (equations of motion from the
Lagrangian of the point mass in the body's field, DOP853 with 7th-order dense
output) and prints states at t = 0, step, 2 step, ... up to the end of the
span (the end itself when it is a multiple of the step). Output streams:
memory does not grow with the number of rows.

CSV columns: utc,t_s,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s (inertial, fixed);
utc,t_s,lat_deg,lon_deg,alt_km (geodetic). JSON: {"states":[{"utc","t_s",
"position_km","velocity_km_s"}]} (geodetic: "lat_deg","lon_deg","alt_km").
--format oem writes a CCSDS 502.0-B-2 Orbit Ephemeris Message (KVN).
--checks adds energy and angular-momentum drift, the measured period, the
equal-areas law, the measured apsides and (J2) the measured drift rates.
--final prints one record instead of the rows: the state at the end of the
span (final_x_km ... final_vz_km_s, or final_lat_deg, final_lon_deg,
final_alt_km with --frame geodetic), final_radius_km, final_speed_km_s, the
steps and evaluations, and with --checks NAME_relative_error for each check.`,
		Flags:  flags,
		Action: ephemerisAction,
	}
}

type ephemerisFrame int

const (
	frameInertial ephemerisFrame = iota
	frameFixed
	frameGeodetic
)

func ephemerisAction(c *cli.Context) error {
	spec, err := parseOrbit(c)
	if err != nil {
		return err
	}
	if _, err := surfaceEvent(spec); err != nil {
		return err
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return err
	}
	span, step, err := parseSpanStep(c)
	if err != nil {
		return err
	}
	frame := frameInertial
	switch strings.ToLower(c.String("frame")) {
	case "inertial", "gcrf":
	case "fixed", "itrf":
		frame = frameFixed
	case "geodetic":
		frame = frameGeodetic
	default:
		return inputErrorf("use --frame inertial, fixed or geodetic", "--frame %q is not known", c.String("frame"))
	}
	if frame != frameInertial && spec.Body.Name != "earth" {
		return inputErrorf("use --frame inertial for bodies other than Earth", "--frame %s needs the Earth-orientation model, which centra has for Earth only", c.String("frame"))
	}
	dut1, err := parseDUT1(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	if len(exps) > 0 && !c.Bool("checks") && !c.Bool("final") {
		return inputErrorf("add --checks: expectations apply to the check results of an ephemeris", "--expect needs --checks on ephemeris")
	}
	o, err := openOutput(c, "table", "csv", "json", "oem")
	if err != nil {
		return err
	}
	if o.Format == "oem" && frame == frameGeodetic {
		return o.finish(inputErrorf("use --frame inertial or fixed with --format oem", "an OEM carries Cartesian states, not geodetic coordinates"))
	}
	for _, w := range spec.Warnings {
		o.warn("%s", w)
	}
	if c.Bool("final") {
		if o.Format == "oem" {
			return o.finish(inputErrorf("drop --format oem or --final", "--final prints one record, not an OEM"))
		}
		return o.finish(ephemerisFinal(o, spec, ms, span, frame, dut1, c.Bool("checks"), exps))
	}
	err = writeEphemeris(o, c, spec, ms, span, step, frame, dut1, exps)
	return o.finish(err)
}

func parseDUT1(c *cli.Context) (float64, error) {
	s := strings.TrimSpace(c.String("dut1"))
	s = strings.TrimSuffix(s, "s")
	d, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsNaN(d) || math.Abs(d) > 0.9 {
		return 0, inputErrorf("give UT1-UTC in seconds from IERS Bulletin A, within ±0.9", "--dut1 %q is not usable", c.String("dut1"))
	}
	return d, nil
}

// ephemerisRow is one tabulated state in the output frame.
type ephemerisRow struct {
	utc      string
	t        float64
	r, v     [3]float64
	lat, lon float64 // rad (geodetic)
	alt      float64 // km (geodetic)
}

// rowWriter writes rows in one format.
type rowWriter interface {
	begin() error
	row(r *ephemerisRow) error
	end(checks []orbit.Check) error
}

func writeEphemeris(o *output, c *cli.Context, spec *orbitSpec, ms *modelSpec, span, step float64, frame ephemerisFrame, dut1 float64, exps []expectation) error {
	p, err := propagate.New(ms.Model, ms.Options)
	if err != nil {
		return inputErrorf("check --model and --tolerance", "%v", err)
	}
	bw := bufio.NewWriterSize(o.W, 1<<16)
	var rw rowWriter
	switch o.Format {
	case "csv":
		rw = &csvRows{w: bw, frame: frame}
	case "json":
		rw = &jsonRows{w: bw, frame: frame}
	case "oem":
		rw = &oemRows{w: bw, spec: spec, frame: frame, span: span, step: step, name: c.String("object-name"), id: c.String("object-id")}
	default:
		rw = &tableRows{w: bw, frame: frame, title: fmt.Sprintf("Ephemeris about %s from %s, %s, frame %s", spec.Body.Name, formatEpoch(spec.Epoch), ms.Label, frameName(frame))}
	}
	if err := rw.begin(); err != nil {
		return err
	}
	row := &ephemerisRow{}
	bar := newProgressBar(o, "ephemeris", math.Abs(span), true)
	bar.stride = 64
	defer bar.Clear()
	onState := func(t float64, s orbit.State) error {
		bar.Update(math.Abs(t))
		ep := spec.Epoch.Add(t)
		row.t, row.r, row.v = t, s.R, s.V
		row.utc = ep.FormatUTC()
		if frame != frameInertial {
			rot := earthframe.NewRotation(ep, dut1)
			row.r, row.v = rot.StateToITRF(s.R, s.V)
			if frame == frameGeodetic {
				row.lat, row.lon, row.alt = geodesy.WGS84.FromECEF(row.r)
			}
		}
		return rw.row(row)
	}
	surface, err := surfaceEvent(spec)
	if err != nil {
		return err
	}
	res, err := p.Run(spec.State, span, &propagate.Output{Step: step, OnState: onState, Events: []propagate.Event{surface}})
	if err != nil {
		bw.Flush()
		return propagationError(err)
	}
	if res.Terminated {
		bw.Flush()
		return impactError(spec, res)
	}
	var checks []orbit.Check
	if c.Bool("checks") {
		checks, err = propagate.Checks(ms.Model, spec.State, span, ms.Options)
		if err != nil {
			return propagationError(err)
		}
	}
	if err := rw.end(checks); err != nil {
		return err
	}
	if err := bw.Flush(); err != nil {
		return err
	}
	if len(exps) > 0 {
		rec := reports.Record{}
		for _, ch := range checks {
			rec = append(rec, reports.Num(ch.Name+"_relative_error", "", ch.RelativeError, 6))
		}
		rows, failed, err := checkExpectations(exps, rec)
		if err != nil {
			return err
		}
		reports.WriteTitle(o.Stderr, "Expectations")
		reports.WriteListTable(o.Stderr, rows)
		if failed > 0 {
			return &expectationError{Failed: failed, Total: len(rows)}
		}
	}
	return nil
}

// surfaceSlack keeps an orbit grazing the surface (--altitude 0 on the
// equator) from stopping on rounding noise, km.
const surfaceSlack = 1e-6

// surfaceEvent stops a propagation where the trajectory enters the
// body's reference ellipsoid (equatorial radius a, polar radius a(1-f))
// taken about the inertial z axis; the tilt of the true pole from it
// moves the surface by at most a few hundred metres before 2200. An
// initial state inside the body is an input error.
func surfaceEvent(spec *orbitSpec) (propagate.Event, error) {
	a := spec.Body.EquatorialRadius
	k := 1 / (1 - spec.Body.Flattening)
	g := func(_ float64, s orbit.State) float64 {
		return math.Sqrt(s.R[0]*s.R[0]+s.R[1]*s.R[1]+k*k*s.R[2]*s.R[2]) - a + surfaceSlack
	}
	if h := g(0, spec.State); h < 0 {
		r := math.Sqrt(spec.State.R[0]*spec.State.R[0] + spec.State.R[1]*spec.State.R[1] + spec.State.R[2]*spec.State.R[2])
		return propagate.Event{}, inputErrorf("give a state above the surface (altitudes are above the equatorial radius)",
			"the initial state is inside %s (radius %.3f km, %.3f km below its surface)", spec.Body.Name, r, -h)
	}
	return propagate.Event{Name: "surface", Kind: propagate.Custom, G: g, Direction: -1, Terminal: true}, nil
}

// impactError reports a run that a surfaceEvent stopped.
func impactError(spec *orbitSpec, res propagate.Result) error {
	r := math.Sqrt(res.State.R[0]*res.State.R[0] + res.State.R[1]*res.State.R[1] + res.State.R[2]*res.State.R[2])
	return inputErrorf("shorten --span to end before the impact, raise the periapsis, or use 'centra ballistic' for a suborbital arc",
		"the trajectory reaches the surface of %s at %s (t = %.3f s, radius %.3f km), where the propagation stops", spec.Body.Name, formatEpoch(spec.Epoch.Add(res.T)), res.T, r)
}

// surfaceStop returns impactError when err reports that a sampling or
// track propagation stopped at its surface event, and nil otherwise.
func surfaceStop(spec *orbitSpec, err error) error {
	var stop *trajectory.StopError
	if !errors.As(err, &stop) {
		return nil
	}
	return impactError(spec, propagate.Result{T: stop.T, State: stop.State, Terminated: true})
}

// propagationError explains a propagation that stopped early.
func propagationError(err error) error {
	var se *propagate.StepError
	if errors.As(err, &se) {
		if se.State == (orbit.State{}) {
			// integrators of other variables (mean elements) give no state
			return inputErrorf("check the orbit (does it hit the body?) or loosen --tolerance",
				"propagation stopped at t = %.3f s: %v", se.T, se.Err)
		}
		r := math.Sqrt(se.State.R[0]*se.State.R[0] + se.State.R[1]*se.State.R[1] + se.State.R[2]*se.State.R[2])
		return inputErrorf("check the orbit (does it hit the body?) or loosen --tolerance",
			"propagation stopped at t = %.3f s (radius %.6g km): %v", se.T, r, se.Err)
	}
	var ie *inputError
	if errors.As(err, &ie) {
		return err
	}
	var pe *os.PathError
	if errors.As(err, &pe) {
		// writing the rows failed (a full disk), not the propagation
		return inputErrorf("check the disk and the --out path", "writing the output failed: %v", pe.Err)
	}
	return inputErrorf("check the orbit and the model", "propagation failed: %v", err)
}

func frameName(f ephemerisFrame) string {
	switch f {
	case frameFixed:
		return "ITRF (Earth-fixed)"
	case frameGeodetic:
		return "WGS 84 geodetic"
	}
	return "GCRF (inertial)"
}

func appendFloat(b []byte, x float64) []byte { return strconv.AppendFloat(b, x, 'g', -1, 64) }

// csvRows writes the contract's CSV.
type csvRows struct {
	w     *bufio.Writer
	frame ephemerisFrame
	buf   []byte
}

func (cr *csvRows) begin() error {
	if cr.frame == frameGeodetic {
		_, err := cr.w.WriteString("utc,t_s,lat_deg,lon_deg,alt_km\n")
		return err
	}
	_, err := cr.w.WriteString("utc,t_s,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s\n")
	return err
}

func (cr *csvRows) row(r *ephemerisRow) error {
	b := append(cr.buf[:0], r.utc...)
	b = append(b, ',')
	b = appendFloat(b, r.t)
	if cr.frame == frameGeodetic {
		for _, x := range [3]float64{r.lat * rad2deg, r.lon * rad2deg, r.alt} {
			b = append(b, ',')
			b = appendFloat(b, x)
		}
	} else {
		for _, x := range r.r {
			b = append(b, ',')
			b = appendFloat(b, x)
		}
		for _, x := range r.v {
			b = append(b, ',')
			b = appendFloat(b, x)
		}
	}
	b = append(b, '\n')
	cr.buf = b
	_, err := cr.w.Write(b)
	return err
}

func (cr *csvRows) end(checks []orbit.Check) error {
	if len(checks) > 0 {
		// stdout stays one CSV document; the checks go to stderr.
		return nil
	}
	return nil
}

// jsonRows streams {"states":[...], "checks":[...]}.
type jsonRows struct {
	w     *bufio.Writer
	frame ephemerisFrame
	n     int
	buf   []byte
}

func (jr *jsonRows) begin() error {
	_, err := jr.w.WriteString("{\n  \"states\": [")
	return err
}

func (jr *jsonRows) row(r *ephemerisRow) error {
	b := jr.buf[:0]
	if jr.n > 0 {
		b = append(b, ',')
	}
	jr.n++
	b = append(b, "\n    {\"utc\": \""...)
	b = append(b, r.utc...)
	b = append(b, "\", \"t_s\": "...)
	b = appendFloat(b, r.t)
	if jr.frame == frameGeodetic {
		b = append(b, ", \"lat_deg\": "...)
		b = appendFloat(b, r.lat*rad2deg)
		b = append(b, ", \"lon_deg\": "...)
		b = appendFloat(b, r.lon*rad2deg)
		b = append(b, ", \"alt_km\": "...)
		b = appendFloat(b, r.alt)
	} else {
		b = append(b, ", \"position_km\": ["...)
		b = appendFloat(b, r.r[0])
		b = append(b, ", "...)
		b = appendFloat(b, r.r[1])
		b = append(b, ", "...)
		b = appendFloat(b, r.r[2])
		b = append(b, "], \"velocity_km_s\": ["...)
		b = appendFloat(b, r.v[0])
		b = append(b, ", "...)
		b = appendFloat(b, r.v[1])
		b = append(b, ", "...)
		b = appendFloat(b, r.v[2])
		b = append(b, ']')
	}
	b = append(b, '}')
	jr.buf = b
	_, err := jr.w.Write(b)
	return err
}

func (jr *jsonRows) end(checks []orbit.Check) error {
	jr.w.WriteString("\n  ]")
	if len(checks) > 0 {
		jr.w.WriteString(",\n  \"checks\": ")
		var sb strings.Builder
		if err := reports.WriteJSON(&sb, reports.Record{{Key: "checks", Value: checkRecords(checks)}}); err != nil {
			return err
		}
		// Re-indent the nested list produced for a one-key object.
		s := sb.String()
		s = strings.TrimPrefix(s, "{\n  \"checks\": ")
		s = strings.TrimSuffix(strings.TrimSpace(s), "}")
		jr.w.WriteString(strings.TrimSpace(s))
	}
	_, err := jr.w.WriteString("\n}\n")
	return err
}

// tableRows writes a fixed-width table that streams.
type tableRows struct {
	w     *bufio.Writer
	frame ephemerisFrame
	title string
	buf   []byte
	rule  string
}

func (tr *tableRows) begin() error {
	reports.WriteTitle(tr.w, tr.title)
	var head string
	if tr.frame == frameGeodetic {
		head = fmt.Sprintf("| %-24s | %12s | %12s | %13s | %12s |", "utc", "t_s", "lat_deg", "lon_deg", "alt_km")
	} else {
		head = fmt.Sprintf("| %-24s | %12s | %14s | %14s | %14s | %12s | %12s | %12s |", "utc", "t_s", "x_km", "y_km", "z_km", "vx_km_s", "vy_km_s", "vz_km_s")
	}
	tr.rule = "+" + strings.Repeat("-", len(head)-2) + "+"
	_, err := fmt.Fprintf(tr.w, "%s\n%s\n%s\n", tr.rule, head, tr.rule)
	return err
}

func (tr *tableRows) row(r *ephemerisRow) error {
	var err error
	if tr.frame == frameGeodetic {
		_, err = fmt.Fprintf(tr.w, "| %-24s | %12.3f | %12.6f | %13.6f | %12.6f |\n", r.utc, r.t, r.lat*rad2deg, r.lon*rad2deg, r.alt)
	} else {
		_, err = fmt.Fprintf(tr.w, "| %-24s | %12.3f | %14.6f | %14.6f | %14.6f | %12.9f | %12.9f | %12.9f |\n", r.utc, r.t, r.r[0], r.r[1], r.r[2], r.v[0], r.v[1], r.v[2])
	}
	return err
}

func (tr *tableRows) end(checks []orbit.Check) error {
	fmt.Fprintln(tr.w, tr.rule)
	if len(checks) > 0 {
		fmt.Fprintln(tr.w)
		reports.WriteTitle(tr.w, "Checks of the propagation against the conservation and Kepler laws")
		return reports.WriteListTable(tr.w, checkRecords(checks))
	}
	return nil
}

// oemRows writes a CCSDS Orbit Ephemeris Message, KVN form, version 2.0
// (CCSDS 502.0-B-2, section 5: header, metadata, data lines; the
// optional covariance is omitted).
type oemRows struct {
	w          *bufio.Writer
	spec       *orbitSpec
	frame      ephemerisFrame
	span, step float64
	name, id   string
	buf        []byte
}

// oemCreationDate is the CREATION_DATE of OEM headers; tests fix it.
var oemCreationDate = func() string { return time.Now().UTC().Format("2006-01-02T15:04:05") }

func oemTime(utc string) string { return strings.TrimSuffix(utc, "Z") }

func (or *oemRows) begin() error {
	start, stop := or.spec.Epoch, or.spec.Epoch.Add(math.Floor(math.Abs(or.span)/or.step+1e-9)*or.step*math.Copysign(1, or.span))
	if or.span < 0 {
		start, stop = stop, start
	}
	frame := "GCRF"
	if or.frame == frameFixed {
		frame = "ITRF"
	}
	center := strings.ToUpper(or.spec.Body.Name)
	fmt.Fprintf(or.w, "CCSDS_OEM_VERS = 2.0\nCREATION_DATE = %s\nORIGINATOR = CENTRA\n\nMETA_START\n", oemCreationDate())
	fmt.Fprintf(or.w, "OBJECT_NAME = %s\nOBJECT_ID = %s\nCENTER_NAME = %s\nREF_FRAME = %s\nTIME_SYSTEM = UTC\n", or.name, or.id, center, frame)
	fmt.Fprintf(or.w, "START_TIME = %s\nSTOP_TIME = %s\nMETA_STOP\n\n", oemTime(start.FormatUTC()), oemTime(stop.FormatUTC()))
	_, err := or.w.WriteString("COMMENT Units: km and km/s. Generated by centra as a planning estimate.\n")
	return err
}

func (or *oemRows) row(r *ephemerisRow) error {
	b := append(or.buf[:0], oemTime(r.utc)...)
	for _, x := range r.r {
		b = append(b, ' ')
		b = strconv.AppendFloat(b, x, 'f', 6, 64)
	}
	for _, x := range r.v {
		b = append(b, ' ')
		b = strconv.AppendFloat(b, x, 'f', 9, 64)
	}
	b = append(b, '\n')
	or.buf = b
	_, err := or.w.Write(b)
	return err
}

func (or *oemRows) end([]orbit.Check) error { return nil }

var _ io.Writer = (*bufio.Writer)(nil)

// ephemerisFinal writes the record of 'ephemeris --final': the state at
// the end of the span in the chosen frame, the work of the integrator and,
// with --checks, the conservation and Kepler-law checks (each also as a
// scalar NAME_relative_error key). It is one record, so --expect works on
// any of its keys and 'sweep' can read it; the option exists for sweeps.
func ephemerisFinal(o *output, spec *orbitSpec, ms *modelSpec, span float64, frame ephemerisFrame, dut1 float64, withChecks bool, exps []expectation) error {
	p, err := propagate.New(ms.Model, ms.Options)
	if err != nil {
		return inputErrorf("check --model and --tolerance", "%v", err)
	}
	surface, err := surfaceEvent(spec)
	if err != nil {
		return err
	}
	res, err := p.Run(spec.State, span, &propagate.Output{Events: []propagate.Event{surface}})
	if err != nil {
		return propagationError(err)
	}
	if res.Terminated {
		return impactError(spec, res)
	}
	end := spec.Epoch.Add(res.T)
	r, v := res.State.R, res.State.V
	if frame != frameInertial {
		rot := earthframe.NewRotation(end, dut1)
		r, v = rot.StateToITRF(r, v)
	}
	norm := func(x [3]float64) float64 { return math.Sqrt(x[0]*x[0] + x[1]*x[1] + x[2]*x[2]) }
	rec := reports.Record{
		{Key: "body", Label: "central body", Value: spec.Body.Name},
		{Key: "model", Label: "force model", Value: ms.Label},
		{Key: "frame", Label: "frame", Value: frameName(frame)},
		{Key: "epoch_utc", Label: "initial epoch", Value: formatEpoch(spec.Epoch)},
		{Key: "final_utc", Label: "final epoch", Value: formatEpoch(end)},
		reports.Num("span_s", "time propagated", res.T, 12),
	}
	if frame == frameGeodetic {
		lat, lon, alt := geodesy.WGS84.FromECEF(r)
		rec = append(rec,
			reports.Num("final_lat_deg", "final geodetic latitude", lat*rad2deg, 10),
			reports.Num("final_lon_deg", "final longitude", lon*rad2deg, 10),
			reports.Num("final_alt_km", "final altitude above WGS 84", alt, 10))
	} else {
		rec = append(rec,
			reports.Num("final_x_km", "final x", r[0], 12),
			reports.Num("final_y_km", "final y", r[1], 12),
			reports.Num("final_z_km", "final z", r[2], 12),
			reports.Num("final_vx_km_s", "final vx", v[0], 12),
			reports.Num("final_vy_km_s", "final vy", v[1], 12),
			reports.Num("final_vz_km_s", "final vz", v[2], 12))
	}
	rec = append(rec,
		reports.Num("final_radius_km", "final radius", norm(r), 12),
		reports.Num("final_speed_km_s", "final speed (in the frame)", norm(v), 12),
		reports.Field{Key: "steps", Label: "integration steps", Value: res.Stats.Steps},
		reports.Field{Key: "evaluations", Label: "evaluations of the equations of motion", Value: res.Stats.Evaluations})
	var checks []orbit.Check
	if withChecks {
		checks, err = propagate.Checks(ms.Model, spec.State, span, ms.Options)
		if err != nil {
			return propagationError(err)
		}
		for _, ch := range checks {
			rec = append(rec, reports.Num(ch.Name+"_relative_error", ch.Name+" relative error", ch.RelativeError, 6))
		}
		rec = append(rec, reports.Field{Key: "checks", Value: checkRecords(checks)})
	}
	title := fmt.Sprintf("Final state about %s after %s, %s", spec.Body.Name, strconv.FormatFloat(res.T, 'f', -1, 64)+" s", ms.Label)
	return o.emitWithExpectations(title, rec, exps, func() error {
		if o.Format != "table" || len(checks) == 0 {
			return nil
		}
		fmt.Fprintln(o.W)
		reports.WriteTitle(o.W, "Checks of the propagation against the conservation and Kepler laws")
		return reports.WriteListTable(o.W, checkRecords(checks))
	})
}
