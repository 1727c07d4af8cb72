package main

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies/atmosphere"
	"centra/cmd/centra/internal/quantity"
	"centra/propagate"
	"centra/propagate/decay"
	"centra/propagate/forces"
	"centra/reports"
)

func init() { register(60, lifetimeCommand) }

func lifetimeCommand() *cli.Command {
	flags := append(orbitFlags(), modelFlags()...)
	flags = append(flags,
		&cli.StringFlag{Name: "reentry-alt", Value: "100km", Usage: "reentry is declared when the geodetic altitude falls below `H` (60..200 km)"},
		&cli.StringFlag{Name: "max-span", Value: "30y", Usage: "stop after `DURATION` without reentry (units s, min, h, d, or y = 365.25 d; at most 200y)"},
		&cli.StringFlag{Name: "method", Value: "averaged", Usage: "`METHOD`: averaged (orbit-averaged decay of the mean elements, fast) or full (integrate the equations of motion with every force given)"},
		&cli.BoolFlag{Name: "bracket", Value: true, Usage: "also compute the lifetime at half and at double the density (--bracket=false to skip)"},
		&cli.StringFlag{Name: "history", Usage: "add the mean perigee and apogee altitudes every `DURATION` (for example 30d)"},
		expectFlag(),
	)
	return &cli.Command{
		Name:  "lifetime",
		Usage: "orbital lifetime under drag: time until reentry, with the solar-activity bracket",
		UsageText: `centra lifetime [orbit flags] (--mass KG --area M2 [--cd C] | --ballistic-coefficient B) [--density-scale F] [--method averaged|full]

examples:
  centra lifetime --altitude 400 --inclination 51.6 --mass 4 --area 0.03
  centra lifetime --periapsis-alt 524 --apoapsis-alt 541 --sun-synchronous --mass 4.2 --area 0.034 --cd 2.2
  centra --format json lifetime --altitude 350 --ballistic-coefficient 50 --density-scale 2 --history 10d
  centra lifetime --altitude 300 --ballistic-coefficient 50 --method full --third-body sun,moon
  centra lifetime --altitude 450 --ballistic-coefficient 40 --expect lifetime_days=300d±10%`,
		Description: `Propagates the orbit with atmospheric drag until the geodetic altitude falls
below --reentry-alt, or --max-span ends. The atmosphere is the U.S. Standard
Atmosphere 1976 below 86 km and the exponential table of Vallado (4th ed.,
Table 8-4) above, co-rotating with the Earth; --density-scale multiplies it.

--method averaged (the default) integrates the orbit-averaged decay of the mean
elements (Gauss's equations averaged over each revolution with the same drag,
J2 short-period terms, J2 apsidal rotation and the J3 frozen-orbit term):
decades take well under a second. It agrees with --method full to better than
1% on the reference cases of the tests. --method full integrates the
equations of motion with every force given (--model, --third-body, --srp);
use it for high apogees, where the Sun and Moon move the perigee. Without
--model the gravity is the zonal field to J3.

The lifetime depends above all on the density of the upper atmosphere, which
changes tenfold over the solar cycle: the result is printed with the lifetimes
at half and double the density. It is a planning estimate; debris-mitigation
limits are set by the licensing authority.

JSON keys: reentry_utc, lifetime_days (null when no reentry within the span),
lifetime_half_density_days, lifetime_double_density_days, density_scale,
ballistic_coefficient_kg_m2, mass_kg, area_m2, cd, cautions, history.`,
		Flags:  flags,
		Action: lifetimeAction,
	}
}

// lifetimeCautions are printed with every lifetime result.
var lifetimeCautions = []string{
	"Planning estimate only: the density of the upper atmosphere changes about tenfold with solar activity, which dominates the uncertainty; compare the lifetimes at half and double density (--density-scale brackets it).",
	"The atmosphere is a static mean model (US Standard Atmosphere 1976 to 86 km, an exponential table above): no solar cycle, geomagnetic storms or day-night bulge.",
	"Debris-mitigation limits on orbital lifetime are set by the licensing authority; show compliance with the methods it accepts.",
}

// parseYears reads a duration that may be given in years (y, yr, years;
// 365.25 d), otherwise as a quantity duration.
func parseYears(c *cli.Context, name string) (float64, error) {
	text := strings.TrimSpace(c.String(name))
	low := strings.ToLower(text)
	for _, suf := range []string{"years", "year", "yr", "y"} {
		if num, ok := strings.CutSuffix(low, suf); ok {
			v, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
			if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
				return 0, inputErrorf("give a duration such as 25y, 400d or 1e6s", "--%s %q is not a duration", name, text)
			}
			return v * 365.25 * 86400, nil
		}
	}
	v, err := quantity.Parse(quantity.Duration, text)
	if err != nil {
		return 0, flagError(name, err)
	}
	return v, nil
}

func lifetimeAction(c *cli.Context) error {
	spec, err := parseOrbit(c)
	if err != nil {
		return err
	}
	body := spec.Body
	if body.Name != "earth" {
		return inputErrorf("use --body earth", "lifetime needs an atmosphere model, and centra has Earth's only (not %s)", body.Name)
	}
	if spec.Elements.E >= 1 {
		return inputErrorf("give a closed orbit", "an open orbit (e = %g) leaves and never decays", spec.Elements.E)
	}
	ms, err := parseModel(c, body, spec.Epoch)
	if err != nil {
		return err
	}
	fs := &ms.Forces
	if fs.Drag == nil {
		d, err := parseDrag(c, body, fs)
		if err != nil {
			return err
		}
		fs.Drag = d
	}
	gravity := ms.Model
	gravity.Perturbation = nil
	gravityLabel := fs.GravityLabel
	if !c.IsSet("model") && body.Degree() >= 3 {
		gravity = propagate.Zonal(body.GM, body.EquatorialRadius, []float64{0, 0, body.Jn(2), body.Jn(3)}, 3)
		gravityLabel = "zonal J2..J3"
	}
	modelLabel := gravityLabel + " + " + strings.Join(fs.Labels, " + ")

	reentry, _, err := quantityFlag(c, "reentry-alt", quantity.Length)
	if err != nil {
		return err
	}
	if !c.IsSet("reentry-alt") {
		reentry = decay.DefaultReentryAltitude
	}
	if !(reentry >= 60 && reentry <= 200) {
		return inputErrorf("give a reentry altitude from 60 to 200 km (100 km is usual)", "--reentry-alt %g km is outside 60..200 km", reentry)
	}
	maxSpan, err := parseYears(c, "max-span")
	if err != nil {
		return err
	}
	if !(maxSpan > 0) || maxSpan > 200*365.25*86400 {
		return inputErrorf("give a span above zero and at most 200y", "--max-span %s is not usable", c.String("max-span"))
	}
	var method decay.Method
	switch strings.ToLower(strings.TrimSpace(c.String("method"))) {
	case "averaged", "average", "":
		method = decay.Averaged
	case "full":
		method = decay.Full
	default:
		return inputErrorf("use --method averaged or full", "--method %q is not known", c.String("method"))
	}
	var historyStep float64
	if c.IsSet("history") {
		historyStep, err = parseYears(c, "history")
		if err != nil {
			return err
		}
		if !(historyStep > 0) {
			return inputErrorf("give a positive step such as 30d", "--history %s is not positive", c.String("history"))
		}
		if maxSpan/historyStep > 100000 {
			return inputErrorf("lengthen --history", "--history %s gives more than 100000 rows over --max-span %s", c.String("history"), c.String("max-span"))
		}
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	for _, w := range spec.Warnings {
		o.warn("%s", w)
	}
	if method == decay.Averaged && fs.Extra != nil {
		o.warn("the averaged method models drag and the zonal field to J3 only; --third-body and --srp are used by --method full")
	}

	cfg := decay.Config{Gravity: gravity, Drag: fs.Drag, Extra: fs.Extra, ReentryAltitude: reentry, MaxSpan: maxSpan,
		Method: method, Options: ms.Options, HistoryStep: historyStep}
	prog := newProgress(o, maxSpan)
	cfg.Progress = prog.report
	prog.label = "nominal density"
	res, err := decay.Lifetime(cfg, spec.State)
	if err != nil {
		prog.clear()
		var se *propagate.StepError
		if method == decay.Averaged && errors.As(err, &se) {
			return o.finish(inputErrorf("use --method full, which integrates every revolution",
				"the orbit-averaged decay stopped at t = %.3f s (%v): the orbit is too low for orbit averaging, it reenters within a revolution or two", se.T, se.Err))
		}
		return o.finish(lifetimeError(err))
	}
	if method == decay.Averaged && res.Reentered {
		// Orbit averaging assumes the orbit changes little per revolution;
		// against --method full it is within 1% from about 20
		// revolutions of lifetime (measured at 220 km, B = 50 kg/m2) and
		// off by a factor of 10 within one.
		if a := spec.Elements.A; a > 0 {
			if revs := res.T / (2 * math.Pi * math.Sqrt(a*a*a/body.GM)); revs < minAveragedRevs {
				o.warn("the orbit reenters within %.1f revolutions, too few for the orbit-averaged method (it assumes many); use --method full", revs)
			}
		}
	}
	var brackets [2]*decay.Result
	if c.Bool("bracket") {
		for k, f := range [2]float64{0.5, 2} {
			scaled := fs.DensityScale * f
			if err := atmosphere.DensityScale(scaled).Validate(); err != nil {
				continue
			}
			d, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: fs.Drag.BallisticCoefficient(), DensityScale: atmosphere.DensityScale(scaled), RotationRate: fs.Drag.RotationRate()})
			if err != nil {
				return o.finish(inputErrorf("check the drag flags", "%v", err))
			}
			bc := cfg
			bc.Drag, bc.HistoryStep = d, 0
			prog.label = fmt.Sprintf("density x%s", trimFloat(scaled, 4))
			r, err := decay.Lifetime(bc, spec.State)
			if err != nil {
				prog.clear()
				return o.finish(lifetimeError(err))
			}
			brackets[k] = &r
		}
	}
	prog.clear()

	rec := lifetimeRecord(spec, fs, modelLabel, reentry, maxSpan, res, brackets, o.Format)
	title := fmt.Sprintf("Orbital lifetime about %s from %s (%s method, %s)", body.Name, formatEpoch(spec.Epoch), method, modelLabel)
	err = o.emitWithExpectations(title, rec, exps, func() error {
		switch o.Format {
		case "table":
			fmt.Fprintln(o.W)
			reports.WriteTitle(o.W, "Cautions")
			for _, s := range lifetimeCautions {
				fmt.Fprintf(o.W, "- %s\n", s)
			}
			if len(res.History) > 0 {
				fmt.Fprintln(o.W)
				reports.WriteTitle(o.W, "Decay history (mean altitudes above the equatorial radius)")
				if err := reports.WriteListTable(o.W, historyRecords(spec, res.History)); err != nil {
					return err
				}
			}
		case "csv":
			if !o.Quiet {
				for _, s := range lifetimeCautions {
					fmt.Fprintf(o.Stderr, "centra: caution: %s\n", s)
				}
			}
		}
		return nil
	})
	return o.finish(err)
}

// minAveragedRevs is the lifetime in revolutions below which lifetime
// warns that orbit averaging does not hold.
const minAveragedRevs = 20

// lifetimeError explains a lifetime computation that failed.
func lifetimeError(err error) error {
	switch {
	case errors.Is(err, decay.ErrBelowReentry):
		return inputErrorf("raise the orbit or lower --reentry-alt", "%v", err)
	case errors.Is(err, decay.ErrConfig):
		return inputErrorf("check the lifetime flags", "%v", err)
	}
	return propagationError(err)
}

func lifetimeRecord(spec *orbitSpec, fs *forceSpec, model string, reentry, maxSpan float64, res decay.Result, brackets [2]*decay.Result, format string) reports.Record {
	re := spec.Body.EquatorialRadius
	a0, e0 := res.Initial.A, res.Initial.E
	optPos := func(key, label string, v float64, digits int) reports.Field {
		return reports.Opt(key, label, v, v > 0, digits)
	}
	rec := reports.Record{
		{Key: "body", Label: "central body", Value: spec.Body.Name},
		{Key: "epoch_utc", Label: "epoch", Value: formatEpoch(spec.Epoch)},
		{Key: "method", Label: "method", Value: res.Method.String()},
		{Key: "model", Label: "force model", Value: model},
		optPos("mass_kg", "mass", fs.MassKg, 5),
		optPos("area_m2", "drag area", fs.AreaM2, 4),
		optPos("cd", "drag coefficient", fs.Cd, 4),
		reports.Num("ballistic_coefficient_kg_m2", "ballistic coefficient m/(Cd A)", fs.Drag.BallisticCoefficient(), 6),
		reports.Num("density_scale", "density scale (solar activity)", fs.DensityScale, 4),
		reports.Num("reentry_alt_km", "reentry altitude (geodetic)", reentry, 6),
		reports.Num("max_span_days", "longest span computed", maxSpan/86400, 8),
		reports.Num("perigee_alt_km", "mean perigee altitude at epoch", a0*(1-e0)-re, 8),
		reports.Num("apogee_alt_km", "mean apogee altitude at epoch", a0*(1+e0)-re, 8),
		{Key: "reentered", Label: "reentry within the span", Value: res.Reentered},
	}
	rec = append(rec, lifetimeFields("", "", spec, res)...)
	names := [2]string{"half", "double"}
	for k, b := range brackets {
		if b == nil {
			continue
		}
		rec = append(rec, lifetimeFields("_"+names[k]+"_density", " at "+names[k]+" density", spec, *b)...)
	}
	if !res.Reentered && res.Final.A > 0 {
		rec = append(rec, reports.Num("final_perigee_alt_km", "mean perigee altitude at the end of the span", res.Final.A*(1-res.Final.E)-re, 8))
	}
	rec = append(rec, reports.Field{Key: "steps", Label: "integration steps", Value: res.Steps})
	if format == "csv" {
		rec = append(rec, reports.Field{Key: "caution", Value: strings.Join(lifetimeCautions, " ")})
	} else {
		rec = append(rec, reports.Field{Key: "cautions", Value: lifetimeCautions})
	}
	if len(res.History) > 0 {
		rec = append(rec, reports.Field{Key: "history", Value: historyRecords(spec, res.History)})
	}
	if len(spec.Warnings) > 0 {
		rec = append(rec, reports.Field{Key: "warnings", Value: spec.Warnings})
	}
	return rec
}

// lifetimeFields are reentry_utc<sfx> and lifetime<sfx>_days of one result.
func lifetimeFields(sfx, label string, spec *orbitSpec, r decay.Result) []reports.Field {
	var utc any
	if r.Reentered {
		utc = spec.Epoch.Add(r.T).FormatUTC()
	}
	return []reports.Field{
		{Key: "reentry" + sfx + "_utc", Label: "reentry" + label, Value: utc},
		reports.Opt("lifetime"+sfx+"_days", "lifetime"+label, r.T/86400, r.Reentered, 6),
		reports.Opt("lifetime"+sfx+"_years", "lifetime"+label+" (365.25 d years)", r.T/86400/365.25, r.Reentered, 4),
	}
}

func historyRecords(spec *orbitSpec, h []decay.Sample) []reports.Record {
	rows := make([]reports.Record, 0, len(h))
	for _, s := range h {
		rows = append(rows, reports.Record{
			{Key: "utc", Value: spec.Epoch.Add(s.T).FormatUTC()},
			{Key: "t_days", Value: s.T / 86400, Digits: 8},
			{Key: "perigee_alt_km", Value: s.PerigeeAltKm, Digits: 7},
			{Key: "apogee_alt_km", Value: s.ApogeeAltKm, Digits: 7},
		})
	}
	return rows
}

// progress prints a percentage line on a terminal's stderr (the shared
// progressBar of progress.go: after a second, never on pipes or with
// --quiet).
type progress struct {
	bar     *progressBar
	label   string
	t       float64
	perigee float64
}

func newProgress(o *output, maxSpan float64) *progress {
	p := &progress{bar: newProgressBar(o, "lifetime", maxSpan, false)}
	p.bar.NoETA = true
	p.bar.Detail = func() string {
		return fmt.Sprintf("%s, %.2f years, mean perigee %.1f km", p.label, p.t/86400/365.25, p.perigee)
	}
	return p
}

func (p *progress) report(t, perigee float64) {
	p.t, p.perigee = t, perigee
	p.bar.Update(t)
}

func (p *progress) clear() { p.bar.Clear() }
