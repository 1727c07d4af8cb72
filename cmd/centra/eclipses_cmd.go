package main

import (
	"fmt"
	"math"

	"github.com/urfave/cli/v2"

	"centra/bodies/sunmoon"
	"centra/orbit"
	"centra/propagate/shadow"
	"centra/propagate/trajectory"
	"centra/reports"
)

func init() { register(45, eclipsesCommand) }

// maxEclipseSpan bounds --span of eclipses, s.
const maxEclipseSpan = 366 * 86400.0

// eclipseTolKm is the interpolation bound of the trajectory behind the
// eclipse search: 1 m moves a LEO shadow boundary crossing by 0.4 ms.
const eclipseTolKm = 1e-3

func eclipsesCommand() *cli.Command {
	flags := append(orbitFlags(), modelFlags()...)
	flags = append(flags,
		&cli.StringFlag{Name: "span", Value: "1d", Usage: "how long to look ahead from the epoch, `DURATION` (positive, at most 366d)"},
		expectFlag(),
	)
	return &cli.Command{
		Name:  "eclipses",
		Usage: "umbra and penumbra entries and exits, beta angle, eclipse fraction per orbit",
		UsageText: `centra eclipses [orbit flags] [--span D] [--model point|j2|zonal]

examples:
  centra eclipses --altitude 500 --inclination 51.6 --epoch 2027-04-13T00:00:00Z
  centra --format json eclipses --periapsis-alt 524 --apoapsis-alt 541 --sun-synchronous --raan 112.5 --span 7d
  centra --format csv eclipses --altitude 35786 --epoch 2027-03-20T00:00:00Z --span 3d --out geo-eclipses.csv
  centra eclipses --altitude 420 --inclination 51.6 --span 30d --expect max_duration_s=36min±2min`,
		Description: `Propagates the orbit with the chosen force model and finds the shadow of the
Earth in the conical model: the Earth a sphere of its equatorial radius, the
Sun a sphere of 695700 km (IAU 2015 nominal radius) at its position from
centra's analytic series (10 arcsec). Each shadow passage gives two windows:
kind "penumbra" from the first contact to the last (any part of the Sun
hidden; it contains the umbra) and kind "umbra" from the second contact to
the third (all of it hidden). beta_deg is the beta angle (the Sun's angle
above the orbit plane, positive on the side of the angular momentum) at the
entry. The beta list gives the beta angle at the start of the span and every
24 h after. The orbits list gives the time in umbra and penumbra of each
complete orbit, from ascending node to ascending node (for an equatorial
orbit: successive osculating periods from the epoch).

JSON: {"eclipses": [{"kind", "entry_utc", "exit_utc", "duration_s",
"beta_deg", ...}], "beta": [...], "orbits": [...], "notes": [...]}.
CSV: one row per window. --expect keys: eclipse_count (shadow passages),
umbra_count, max_duration_s (longest umbra), max_penumbra_duration_s,
total_umbra_s, eclipse_fraction (umbra time over the span),
max_orbit_eclipse_fraction, first_entry_t_s (first umbra entry), beta_start_deg,
beta_min_deg, beta_max_deg. Eclipse times are planning estimates, as good as
the initial state and the force model.`,
		Flags:  flags,
		Action: eclipsesAction,
	}
}

// eclipseRow is one window with what the report says about it.
type eclipseRow struct {
	shadow.Eclipse
	Beta float64 // rad, at the entry
}

type orbitSpan struct {
	Start, End        float64 // s
	Umbra, Penumbra   float64 // s in each (penumbra includes umbra)
	FromNodes         bool
	UmbraFraction     float64
	PenumbraFraction  float64
	umbraCount, index int
}

func eclipsesAction(c *cli.Context) error {
	spec, err := parseOrbit(c)
	if err != nil {
		return err
	}
	if spec.Body.Name != "earth" {
		return inputErrorf("use --body earth", "eclipses need the Sun's position relative to the central body, which centra has for the Earth only (not %s)", spec.Body.Name)
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return err
	}
	span, err := parseLookSpan(c, maxEclipseSpan)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	if err := checkClearsSurface(spec); err != nil {
		return err
	}
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	tr, err := sampleOrbit(spec, ms, span, eclipseTolKm)
	if err != nil {
		return o.finish(err)
	}
	re := spec.Body.EquatorialRadius
	sun := shadow.NewSunTrack(func(t float64) [3]float64 { return sunmoon.Sun(spec.Epoch.Add(t)) }, span)
	var rows []eclipseRow
	for _, e := range shadow.Find(tr, sun.At, re, shadow.SunRadius, 1e-4) {
		r, v := tr.At(e.Entry)
		rows = append(rows, eclipseRow{Eclipse: e, Beta: shadow.Beta(orbit.State{R: r, V: v}, sun.At(e.Entry))})
	}
	orbits := splitOrbits(spec, tr, rows)
	rec, list, notes := eclipsesRecord(spec, ms, span, tr, sun, rows, orbits)
	header := reports.CSVHeader(eclipseRecord(spec, &eclipseRow{}))
	for _, n := range notes {
		if o.Format == "csv" {
			o.warn("%s", n)
		}
	}
	title := fmt.Sprintf("Eclipses from %s (%s, %s; conical shadow)", formatEpoch(spec.Epoch), formatSpan(span), ms.Label)
	err = o.emitRows(title, rec, header, list, exps, func() error {
		return writeEclipseTables(o, spec, rec, rows, orbits, notes)
	})
	return o.finish(err)
}

// splitOrbits cuts the span into complete orbits from ascending node to
// ascending node (z crossing zero upwards), or into osculating periods
// from the epoch when there are fewer than two nodes, and measures the
// shadow in each.
func splitOrbits(spec *orbitSpec, tr *trajectory.Trajectory, rows []eclipseRow) []orbitSpan {
	n := tr.Len()
	ts, zs := make([]float64, n), make([]float64, n)
	for k := range n {
		ts[k], zs[k] = tr.Time(k), tr.Sample(k).R[2]
	}
	z := func(t float64) float64 { return tr.Position(t)[2] }
	var nodes []float64
	for _, w := range trajectory.WindowsAt(z, ts, zs, 1e-4) {
		if !w.FromStart {
			nodes = append(nodes, w.Start)
		}
	}
	var out []orbitSpan
	if len(nodes) >= 2 {
		for i := 0; i+1 < len(nodes); i++ {
			out = append(out, orbitSpan{Start: nodes[i], End: nodes[i+1], FromNodes: true})
		}
	} else if spec.Elements.E < 1 {
		a := spec.Elements.P / (1 - spec.Elements.E*spec.Elements.E)
		period := 2 * math.Pi * math.Sqrt(a*a*a/spec.Body.GM)
		for t := 0.0; t+period <= tr.Span()*(1+1e-12); t += period {
			out = append(out, orbitSpan{Start: t, End: t + period})
		}
	}
	for i := range out {
		o := &out[i]
		o.index = i + 1
		for _, r := range rows {
			ov := math.Max(0, math.Min(o.End, r.Exit)-math.Max(o.Start, r.Entry))
			if r.Kind == shadow.Umbra {
				o.Umbra += ov
			} else {
				o.Penumbra += ov
			}
		}
		o.UmbraFraction = o.Umbra / (o.End - o.Start)
		o.PenumbraFraction = o.Penumbra / (o.End - o.Start)
	}
	return out
}

// eclipseRecord is one window in the contract's keys.
func eclipseRecord(spec *orbitSpec, r *eclipseRow) reports.Record {
	utc := func(t float64) string { return formatEpoch(spec.Epoch.Add(t)) }
	return reports.Record{
		{Key: "kind", Value: r.Kind.String()},
		{Key: "entry_utc", Value: utc(r.Entry)},
		{Key: "exit_utc", Value: utc(r.Exit)},
		reports.Num("entry_t_s", "", r.Entry, 10),
		reports.Num("exit_t_s", "", r.Exit, 10),
		reports.Num("duration_s", "", r.Duration(), 8),
		reports.Num("beta_deg", "", r.Beta*rad2deg, 6),
		{Key: "partial", Value: r.FromStart || r.ToEnd},
	}
}

func eclipsesRecord(spec *orbitSpec, ms *modelSpec, span float64, tr *trajectory.Trajectory, sun *shadow.SunTrack, rows []eclipseRow, orbits []orbitSpan) (reports.Record, []reports.Record, []string) {
	var list []reports.Record
	var passages, umbrae int
	var maxU, maxP, totU, totP float64
	var first *eclipseRow
	partial := false
	for i := range rows {
		r := &rows[i]
		list = append(list, eclipseRecord(spec, r))
		d := r.Duration()
		partial = partial || r.FromStart || r.ToEnd
		if r.Kind == shadow.Umbra {
			umbrae++
			totU += d
			if !(r.FromStart || r.ToEnd) {
				maxU = math.Max(maxU, d)
			}
			if first == nil {
				first = r
			}
		} else {
			passages++
			totP += d
			if !(r.FromStart || r.ToEnd) {
				maxP = math.Max(maxP, d)
			}
		}
	}
	beta := func(t float64) float64 {
		r, v := tr.At(t)
		return shadow.Beta(orbit.State{R: r, V: v}, sun.At(t)) * rad2deg
	}
	var betaRows []reports.Record
	for t := 0.0; t <= span; t += 86400 {
		betaRows = append(betaRows, reports.Record{
			{Key: "utc", Value: formatEpoch(spec.Epoch.Add(t))},
			reports.Num("t_s", "", t, 10),
			reports.Num("beta_deg", "", beta(t), 6),
		})
	}
	bmin, bmax := math.Inf(1), math.Inf(-1)
	for t := 0.0; ; t += 3600 {
		t = math.Min(t, span)
		b := beta(t)
		bmin, bmax = math.Min(bmin, b), math.Max(bmax, b)
		if t == span {
			break
		}
	}
	var orbitRows []reports.Record
	maxFrac, hasFrac := 0.0, false
	for _, o := range orbits {
		orbitRows = append(orbitRows, reports.Record{
			{Key: "orbit", Value: o.index},
			{Key: "start_utc", Value: formatEpoch(spec.Epoch.Add(o.Start))},
			reports.Num("start_t_s", "", o.Start, 10),
			reports.Num("duration_s", "", o.End-o.Start, 8),
			reports.Num("umbra_s", "", o.Umbra, 7),
			reports.Num("penumbra_s", "", o.Penumbra, 7),
			reports.Num("umbra_fraction", "", o.UmbraFraction, 5),
			reports.Num("penumbra_fraction", "", o.PenumbraFraction, 5),
		})
		maxFrac, hasFrac = math.Max(maxFrac, o.UmbraFraction), true
	}
	var notes []string
	if len(rows) == 0 {
		notes = append(notes, fmt.Sprintf("no eclipse over the span: the spacecraft stays in full sunlight (beta from %.3f to %.3f deg)", bmin, bmax))
	}
	if partial {
		notes = append(notes, "windows marked partial are cut by the start or the end of the span; the longest durations leave them out")
	}
	if len(orbits) > 0 && !orbits[0].FromNodes {
		notes = append(notes, "fewer than two ascending nodes in the span: orbits are osculating periods from the epoch")
	}
	if len(orbits) == 0 {
		notes = append(notes, "no complete orbit in the span: no eclipse fraction per orbit")
	}
	firstT, firstUTC := any(nil), any(nil)
	if first != nil {
		firstT, firstUTC = first.Entry, formatEpoch(spec.Epoch.Add(first.Entry))
	}
	rec := reports.Record{
		{Key: "epoch_utc", Label: "start of the span (epoch)", Value: formatEpoch(spec.Epoch)},
		{Key: "end_utc", Label: "end of the span", Value: formatEpoch(spec.Epoch.Add(span))},
		reports.Num("span_s", "span", span, 7),
		{Key: "model", Label: "force model", Value: ms.Label},
		reports.Num("shadow_radius_km", "radius of the Earth's shadow-casting sphere", spec.Body.EquatorialRadius, 10),
		reports.Num("sun_radius_km", "radius of the Sun (IAU 2015 nominal)", shadow.SunRadius, 10),
		{Key: "eclipse_count", Label: "shadow passages", Value: passages},
		{Key: "umbra_count", Label: "umbra windows", Value: umbrae},
		reports.Num("max_duration_s", "longest umbra (complete windows)", maxU, 8),
		reports.Num("max_penumbra_duration_s", "longest penumbra window, first to last contact", maxP, 8),
		reports.Num("total_umbra_s", "time in umbra", totU, 8),
		reports.Num("total_penumbra_s", "time in penumbra or umbra", totP, 8),
		reports.Num("eclipse_fraction", "fraction of the span in umbra", totU/span, 6),
		reports.Opt("max_orbit_eclipse_fraction", "largest umbra fraction of a complete orbit", maxFrac, hasFrac, 6),
		{Key: "orbit_count", Label: "complete orbits", Value: len(orbits)},
		{Key: "first_entry_utc", Label: "first umbra entry", Value: firstUTC},
		{Key: "first_entry_t_s", Label: "first umbra entry after the epoch", Value: firstT, Digits: 10},
		reports.Num("beta_start_deg", "beta angle at the epoch", beta(0), 6),
		reports.Num("beta_min_deg", "least beta angle (hourly)", bmin, 6),
		reports.Num("beta_max_deg", "greatest beta angle (hourly)", bmax, 6),
		reports.Num("sample_step_s", "trajectory sampling step", tr.Step(), 6),
		reports.Num("interpolation_bound_m", "interpolation error bound (position)", tr.Bound().Position*1e3, 3),
		{Key: "eclipses", Value: list},
		{Key: "beta", Value: betaRows},
		{Key: "orbits", Value: orbitRows},
		{Key: "notes", Value: nonNil(notes)},
	}
	return rec, list, notes
}

// writeEclipseTables prints the windows, the beta angles and the orbits.
func writeEclipseTables(o *output, spec *orbitSpec, rec reports.Record, rows []eclipseRow, orbits []orbitSpan, notes []string) error {
	if o.Format != "table" {
		return nil
	}
	fmt.Fprintln(o.W)
	reports.WriteTitle(o.W, "Shadow windows (penumbra: first to last contact; umbra: second to third)")
	if len(rows) == 0 {
		fmt.Fprintln(o.W, "none")
	} else {
		var t []reports.Record
		for i := range rows {
			r := &rows[i]
			entry, exit := tableTime(spec, r.Entry, true), tableTime(spec, r.Exit, false)
			if r.FromStart {
				entry += "*"
			}
			if r.ToEnd {
				exit += "*"
			}
			t = append(t, reports.Record{
				{Key: "kind", Value: r.Kind.String()},
				{Key: "entry_utc", Value: entry},
				{Key: "exit_utc", Value: exit},
				reports.Num("duration_s", "", r.Duration(), 6),
				reports.Num("beta_deg", "", r.Beta*rad2deg, 4),
			})
		}
		if err := reports.WriteListTable(o.W, t); err != nil {
			return err
		}
	}
	orbitTitle := "Shadow per orbit (ascending node to ascending node)"
	if len(orbits) > 0 && !orbits[0].FromNodes {
		orbitTitle = "Shadow per orbit (osculating periods from the epoch)"
	}
	for _, l := range []struct{ key, title string }{
		{"beta", "Beta angle at the start of the span and every 24 h"},
		{"orbits", orbitTitle},
	} {
		f, _ := rec.Get(l.key)
		list := f.Value.([]reports.Record)
		if len(list) == 0 {
			continue
		}
		fmt.Fprintln(o.W)
		reports.WriteTitle(o.W, l.title)
		var t []reports.Record
		for _, r := range list {
			var row reports.Record
			for _, fl := range r {
				if fl.Key == "start_t_s" || fl.Key == "t_s" {
					continue
				}
				row = append(row, fl)
			}
			t = append(t, row)
		}
		if err := reports.WriteListTable(o.W, t); err != nil {
			return err
		}
	}
	writeNotes(o, notes, "")
	return nil
}
