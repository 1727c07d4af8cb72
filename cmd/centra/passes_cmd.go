package main

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies/sunmoon"
	"centra/propagate"
	"centra/propagate/trajectory"
	"centra/propagate/visibility"
	"centra/reports"
)

func init() { register(40, passesCommand) }

// maxPassSpan bounds --span of passes, s.
const maxPassSpan = 100 * 86400.0

const passesCaution = `Pass times are planning estimates: they are as good as the initial state and
the force model (no drag, no radiation pressure unless the model has them),
and without --dut1 the Earth's orientation may be off by up to 0.9 s of
rotation (400 m at the equator). Use a current state and licensed practice
for operations.`

func passesCommand() *cli.Command {
	flags := append(orbitFlags(), modelFlags()...)
	flags = append(flags, siteFlags()...)
	flags = append(flags,
		&cli.StringFlag{Name: "span", Value: "1d", Usage: "how long to look ahead from the epoch, `DURATION` (positive, at most 100d)"},
		&cli.StringFlag{Name: "frequency", Usage: "carrier `FREQ` (MHz by default; kHz, GHz) for the Doppler shifts at AOS, TCA and LOS"},
		expectFlag(),
	)
	return &cli.Command{
		Name:  "passes",
		Usage: "visibility windows over ground sites: AOS, TCA, LOS, look angles, Doppler",
		UsageText: `centra passes [orbit flags] --site [NAME=]LAT,LON[,ALT_M] [--site ...] [--min-elevation ANGLE] [--mask FILE] [--span D] [--frequency MHZ] [--refraction]

examples:
  centra passes --altitude 500 --inclination 97.4 --epoch 2027-04-13T00:00:00Z --site 47.412,8.917,612 --min-elevation 10
  centra --format json passes --periapsis-alt 524 --apoapsis-alt 541 --sun-synchronous --site ashgrove=47.412,8.917,612 --span 7d --frequency 437.5
  centra --format csv passes --altitude 550 --inclination 53 --site north=64.84,-147.72,200 --site south=-33.95,18.47,40 --out passes.csv
  centra passes --altitude 35786 --epoch 2027-04-13T00:00:00Z --site 0,150 --span 2d
  centra passes --altitude 500 --inclination 97.4 --epoch 2027-04-13T00:00:00Z --site 47.412,8.917,612 --mask hill.txt --refraction --expect pass_count=6±1`,
		Description: `Propagates the orbit once with the chosen force model, samples it with a
proven interpolation error (0.1 m by default), and finds every window in
which the spacecraft stands above each site's threshold: the larger of
--min-elevation and the terrain mask at the current azimuth. Sites are
computed in parallel. For each pass: AOS, TCA (greatest elevation), LOS,
duration, greatest elevation, azimuths at AOS, TCA and LOS, the least range,
range rates, and whether the spacecraft is sunlit (outside the umbra) and the
site dark (Sun below -6 deg) at TCA. Passes cut by the start or the end of the
span are partial; a spacecraft that never sets gives one window over the span.
With --frequency, Doppler shifts -f*range_rate/c (non-relativistic).
--refraction uses Saemundsson's formula (Meeus, Astronomical Algorithms, eq.
16.4) for standard air.

Mask file: one point per line, "AZIMUTH_DEG ELEVATION_DEG" (spaces, a tab or
one comma between); '#' starts a comment; azimuths from north through east,
increasing within 0..360; elevations within -5..90. The mask is linear in
azimuth between points and wraps from the last point through north to the
first; one point is a constant mask.

JSON: {"site": {...} (one site only), "sites": [...], "passes": [{"site",
"aos_utc", "tca_utc", "los_utc", "duration_s", "max_elevation_deg",
"aos_azimuth_deg", "los_azimuth_deg", "min_range_km", "sunlit", ...}],
"notes": [...]}: every pass carries its site's name, passes of all sites in
time order. CSV: one row per pass. --expect keys: pass_count,
first_aos_t_s, first_tca_t_s, first_los_t_s, first_duration_s,
first_max_elevation_deg, first_min_range_km, highest_elevation_deg,
total_contact_s (times in s from the epoch).

` + passesCaution,
		Flags:  flags,
		Action: passesAction,
	}
}

// parseLookSpan reads --span: positive and at most limit seconds.
func parseLookSpan(c *cli.Context, limit float64) (float64, error) {
	span, err := parseDurationFlag(c, "span")
	if err != nil {
		return 0, err
	}
	if !(span > 0) {
		return 0, inputErrorf("give a positive span such as 1d or 12h", "--span %s is not positive", c.String("span"))
	}
	if span > limit {
		return 0, inputErrorf(fmt.Sprintf("give a span of at most %gd, or run several spans", limit/86400), "--span %s is too long for %s", c.String("span"), c.Command.Name)
	}
	return span, nil
}

// checkClearsSurface refuses orbits whose periapsis is below the
// equatorial radius: they end in the ground, not in passes.
func checkClearsSurface(spec *orbitSpec) error {
	rp := spec.Elements.P / (1 + spec.Elements.E)
	if re := spec.Body.EquatorialRadius; rp < re {
		return inputErrorf("raise the periapsis above the surface", "the orbit's periapsis altitude %.3f km is below the surface of %s", rp-re, spec.Body.Name)
	}
	return nil
}

// sampleOrbit propagates the orbit over span and samples it for the
// searches.
func sampleOrbit(spec *orbitSpec, ms *modelSpec, span, tolKm float64) (*trajectory.Trajectory, error) {
	p, err := propagate.New(ms.Model, ms.Options)
	if err != nil {
		return nil, inputErrorf("check the force model flags", "%v", err)
	}
	surface, err := surfaceEvent(spec)
	if err != nil {
		return nil, err
	}
	tr, err := trajectory.Sample(p, spec.State, span, trajectory.Options{PositionTol: tolKm, Stop: &surface})
	if err != nil {
		if ie := surfaceStop(spec, err); ie != nil {
			return nil, ie
		}
		var se *propagate.StepError
		switch {
		case errors.As(err, &se):
			return nil, inputErrorf("check the orbit: it cannot be propagated over the span", "the propagation stopped %.3f s after the epoch: %v", se.T, se.Err)
		case errors.Is(err, trajectory.ErrTrajectory):
			return nil, inputErrorf("shorten --span or check the orbit", "%v", err)
		}
		return nil, inputErrorf("check the orbit", "%v", err)
	}
	return tr, nil
}

type sitePasses struct {
	info   siteInfo
	site   visibility.Site
	result visibility.Result
}

func passesAction(c *cli.Context) error {
	spec, err := parseOrbit(c)
	if err != nil {
		return err
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return err
	}
	sites, infos, err := parseSites(c, spec.Body)
	if err != nil {
		return err
	}
	span, err := parseLookSpan(c, maxPassSpan)
	if err != nil {
		return err
	}
	freq, hasFreq, err := parseFrequency(c)
	if err != nil {
		return err
	}
	dut1, err := parseDUT1(c)
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
	tr, err := sampleOrbit(spec, ms, span, trajectory.DefaultPositionTol)
	if err != nil {
		return o.finish(err)
	}
	fr := visibility.NewEarthFrame(spec.Epoch, dut1, span)
	results := visibility.FindAll(tr, fr, sites, visibility.Options{})
	sun := func(t float64) [3]float64 { return sunmoon.Sun(spec.Epoch.Add(t)) }
	all := make([]sitePasses, len(sites))
	for i := range sites {
		visibility.Annotate(results[i].Passes, tr, fr, sites[i], sun, spec.Body.EquatorialRadius)
		all[i] = sitePasses{info: infos[i], site: sites[i], result: results[i]}
	}
	rec, rows, notes := passesRecord(spec, ms, span, tr, all, freq, hasFreq, c.Bool("refraction"))
	title := fmt.Sprintf("Passes over %s from %s (%s, %s)", siteList(infos), formatEpoch(spec.Epoch), formatSpan(span), ms.Label)
	header := reports.CSVHeader(passRecord(spec, "", &visibility.Pass{}, freq, hasFreq))
	for _, n := range notes {
		if o.Format == "csv" {
			o.warn("%s", n)
		}
	}
	err = o.emitRows(title, rec, header, rows, exps, func() error { return writePassTables(o, spec, all, freq, hasFreq, notes) })
	return o.finish(err)
}

func siteList(infos []siteInfo) string {
	if len(infos) == 1 {
		return infos[0].Name
	}
	return fmt.Sprintf("%d sites", len(infos))
}

// formatSpan writes a span in days, hours or seconds as it reads best.
func formatSpan(s float64) string {
	switch {
	case math.Mod(s, 86400) == 0:
		return fmt.Sprintf("%gd", s/86400)
	case math.Mod(s, 3600) == 0:
		return fmt.Sprintf("%gh", s/3600)
	}
	return fmt.Sprintf("%gs", s)
}

type flatPass struct {
	site int
	p    *visibility.Pass
}

// passesRecord lays out the result: the summary, the sites, the passes of
// all sites in time order, and the notes.
func passesRecord(spec *orbitSpec, ms *modelSpec, span float64, tr *trajectory.Trajectory, all []sitePasses, freq float64, hasFreq, refraction bool) (reports.Record, []reports.Record, []string) {
	var flat []flatPass
	for i := range all {
		for j := range all[i].result.Passes {
			flat = append(flat, flatPass{i, &all[i].result.Passes[j]})
		}
	}
	sort.SliceStable(flat, func(a, b int) bool {
		if flat[a].p.AOS != flat[b].p.AOS {
			return flat[a].p.AOS < flat[b].p.AOS
		}
		return flat[a].site < flat[b].site
	})
	var rows []reports.Record
	total := 0.0
	for _, f := range flat {
		rows = append(rows, passRecord(spec, all[f.site].info.Name, f.p, freq, hasFreq))
		total += f.p.Duration()
	}
	highest := math.Inf(-1)
	var siteRecs []reports.Record
	var notes []string
	for _, sp := range all {
		highest = math.Max(highest, sp.result.Highest)
		siteRecs = append(siteRecs, siteRecord(sp))
		notes = append(notes, siteNotes(spec, sp)...)
	}
	if refraction {
		notes = append(notes, "elevations are apparent (refraction by Saemundsson's formula, standard air)")
	}
	var first *visibility.Pass
	if len(flat) > 0 {
		first = flat[0].p
	}
	has := first != nil
	get := func(f func(p *visibility.Pass) float64) float64 {
		if first == nil {
			return 0
		}
		return f(first)
	}
	firstAOS := any(nil)
	if has {
		firstAOS = formatEpoch(spec.Epoch.Add(first.AOS))
	}
	rec := reports.Record{}
	if len(all) == 1 {
		rec = append(rec, reports.Field{Key: "site", Value: siteRecords(all)[0]})
	}
	rec = append(rec,
		reports.Field{Key: "epoch_utc", Label: "start of the span (epoch)", Value: formatEpoch(spec.Epoch)},
		reports.Field{Key: "end_utc", Label: "end of the span", Value: formatEpoch(spec.Epoch.Add(span))},
		reports.Num("span_s", "span", span, 7),
		reports.Field{Key: "model", Label: "force model", Value: ms.Label},
		reports.Field{Key: "site_count", Label: "sites", Value: len(all)},
		reports.Field{Key: "pass_count", Label: "passes (all sites)", Value: len(flat)},
		reports.Num("total_contact_s", "total time in view (all sites)", total, 8),
		reports.Num("highest_elevation_deg", "highest elevation reached", highest*rad2deg, 6),
		reports.Field{Key: "first_aos_utc", Label: "first AOS", Value: firstAOS},
		reports.Opt("first_aos_t_s", "first AOS after the epoch", get(func(p *visibility.Pass) float64 { return p.AOS }), has, 10),
		reports.Opt("first_tca_t_s", "first TCA after the epoch", get(func(p *visibility.Pass) float64 { return p.TCA }), has, 10),
		reports.Opt("first_los_t_s", "first LOS after the epoch", get(func(p *visibility.Pass) float64 { return p.LOS }), has, 10),
		reports.Opt("first_duration_s", "first pass duration", get(func(p *visibility.Pass) float64 { return p.Duration() }), has, 8),
		reports.Opt("first_max_elevation_deg", "first pass greatest elevation", get(func(p *visibility.Pass) float64 { return p.MaxElevation() * rad2deg }), has, 6),
		reports.Opt("first_min_range_km", "first pass least range", get(func(p *visibility.Pass) float64 { return p.MinRange }), has, 8),
		reports.Field{Key: "refraction", Label: "refraction applied", Value: refraction},
		reports.Opt("frequency_mhz", "carrier frequency", freq/1e6, hasFreq, 10),
		reports.Num("sample_step_s", "trajectory sampling step", tr.Step(), 6),
		reports.Num("interpolation_bound_m", "interpolation error bound (position)", tr.Bound().Position*1e3, 3),
		reports.Field{Key: "sites", Value: siteRecords(all)},
		reports.Field{Key: "passes", Value: rows},
		reports.Field{Key: "notes", Value: nonNil(notes)},
	)
	return rec, rows, notes
}

func nonNil(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}

func siteRecords(all []sitePasses) []reports.Record {
	var out []reports.Record
	for _, sp := range all {
		out = append(out, siteRecord(sp))
	}
	return out
}

func siteRecord(sp sitePasses) reports.Record {
	mask := any(nil)
	if sp.info.Mask != "" {
		mask = sp.info.Mask
	}
	return reports.Record{
		{Key: "name", Value: sp.info.Name},
		reports.Num("lat_deg", "", sp.info.Lat, 10),
		reports.Num("lon_deg", "", sp.info.Lon, 10),
		reports.Num("alt_m", "", sp.info.Alt, 10),
		reports.Num("min_elevation_deg", "", sp.info.MinElevation, 10),
		{Key: "mask", Value: mask},
		{Key: "pass_count", Value: len(sp.result.Passes)},
		reports.Num("highest_elevation_deg", "", sp.result.Highest*rad2deg, 6),
	}
}

// siteNotes says what a planner must know about a site's result.
func siteNotes(spec *orbitSpec, sp sitePasses) []string {
	var notes []string
	ps := sp.result.Passes
	thr := fmt.Sprintf("%g deg", sp.info.MinElevation)
	if sp.info.Mask != "" {
		thr += " and the mask " + sp.info.Mask
	}
	switch {
	case len(ps) == 0:
		notes = append(notes, fmt.Sprintf("%s: no pass above %s over the span; the highest elevation reached is %.3f deg at %s",
			sp.info.Name, thr, sp.result.Highest*rad2deg, formatEpoch(spec.Epoch.Add(sp.result.HighestTime))))
	case len(ps) == 1 && ps[0].PartialStart && ps[0].PartialEnd:
		notes = append(notes, fmt.Sprintf("%s: the spacecraft stays above %s for the whole span (one window, cut at both ends)", sp.info.Name, thr))
	default:
		for _, p := range ps {
			if p.Partial() {
				notes = append(notes, fmt.Sprintf("%s: passes marked partial are cut by the start or the end of the span", sp.info.Name))
				break
			}
		}
	}
	return notes
}

// passRecord is one pass in the contract's keys.
func passRecord(spec *orbitSpec, site string, p *visibility.Pass, freq float64, hasFreq bool) reports.Record {
	utc := func(t float64) string { return formatEpoch(spec.Epoch.Add(t)) }
	r := reports.Record{
		{Key: "site", Value: site},
		{Key: "aos_utc", Value: utc(p.AOS)},
		{Key: "tca_utc", Value: utc(p.TCA)},
		{Key: "los_utc", Value: utc(p.LOS)},
		reports.Num("aos_t_s", "", p.AOS, 10),
		reports.Num("tca_t_s", "", p.TCA, 10),
		reports.Num("los_t_s", "", p.LOS, 10),
		reports.Num("duration_s", "", p.Duration(), 8),
		reports.Num("max_elevation_deg", "", p.MaxElevation()*rad2deg, 8),
		reports.Num("aos_azimuth_deg", "", p.AOSLook.Az*rad2deg, 8),
		reports.Num("tca_azimuth_deg", "", p.TCALook.Az*rad2deg, 8),
		reports.Num("los_azimuth_deg", "", p.LOSLook.Az*rad2deg, 8),
		reports.Num("aos_elevation_deg", "", p.AOSLook.El*rad2deg, 8),
		reports.Num("los_elevation_deg", "", p.LOSLook.El*rad2deg, 8),
		reports.Num("min_range_km", "", p.MinRange, 10),
		reports.Num("aos_range_km", "", p.AOSLook.Range, 10),
		reports.Num("los_range_km", "", p.LOSLook.Range, 10),
		reports.Num("range_rate_aos_km_s", "", p.AOSLook.RangeRate, 10),
		reports.Num("range_rate_tca_km_s", "", p.TCALook.RangeRate, 10),
		reports.Num("range_rate_los_km_s", "", p.LOSLook.RangeRate, 10),
		{Key: "sunlit", Value: p.Sunlit},
		{Key: "site_dark", Value: p.SiteDark},
		reports.Num("sun_elevation_deg", "", p.SunElevation*rad2deg, 8),
		{Key: "partial", Value: p.Partial()},
	}
	if hasFreq {
		r = append(r,
			reports.Num("doppler_aos_hz", "", visibility.Doppler(freq, p.AOSLook.RangeRate), 10),
			reports.Num("doppler_tca_hz", "", visibility.Doppler(freq, p.TCALook.RangeRate), 10),
			reports.Num("doppler_los_hz", "", visibility.Doppler(freq, p.LOSLook.RangeRate), 10),
		)
	}
	return r
}

// emitRows writes rec, with rows as the CSV body (one row per item under
// header), and evaluates the expectations on rec's numbers.
func (o *output) emitRows(title string, rec reports.Record, header []string, rows []reports.Record, exps []expectation, extra func() error) error {
	if o.Format != "csv" {
		return o.emitWithExpectations(title, rec, exps, extra)
	}
	checks, failed, err := checkExpectations(exps, rec)
	if err != nil {
		return err
	}
	if err := reports.WriteCSVList(o.W, header, rows); err != nil {
		return err
	}
	if len(checks) > 0 {
		reports.WriteListTable(o.Stderr, checks)
	}
	if failed > 0 {
		return &expectationError{Failed: failed, Total: len(checks)}
	}
	return nil
}

// tableTime formats t (s from the epoch) to the second for tables, with
// the date or the time of day only.
func tableTime(spec *orbitSpec, t float64, date bool) string {
	s := formatEpoch(spec.Epoch.Add(t + 0.0005).Add(0.5 - 0.0005)) // round to the second
	s = strings.Replace(s[:19], "T", " ", 1)
	if !date {
		return s[11:]
	}
	return s
}

// writeNotes prints the notes and a caution under a table.
func writeNotes(o *output, notes []string, caution string) {
	if len(notes) > 0 {
		fmt.Fprintln(o.W)
		for _, n := range notes {
			fmt.Fprintf(o.W, "NOTE: %s\n", n)
		}
	}
	if caution != "" {
		fmt.Fprintf(o.W, "\n%s\n", caution)
	}
}

// writePassTables prints, for tables, one table of passes per site, the
// notes and the caution.
func writePassTables(o *output, spec *orbitSpec, all []sitePasses, freq float64, hasFreq bool, notes []string) error {
	if o.Format != "table" {
		return nil
	}
	for _, sp := range all {
		in := sp.info
		fmt.Fprintln(o.W)
		head := fmt.Sprintf("Site %s: lat %.6g deg, lon %.6g deg, %g m; minimum elevation %g deg", in.Name, in.Lat, in.Lon, in.Alt, in.MinElevation)
		if !in.Named {
			head = fmt.Sprintf("Site at lat %.6g deg, lon %.6g deg, %g m; minimum elevation %g deg", in.Lat, in.Lon, in.Alt, in.MinElevation)
		}
		if in.Mask != "" {
			head += ", mask " + in.Mask
		}
		reports.WriteTitle(o.W, head)
		if len(sp.result.Passes) == 0 {
			fmt.Fprintln(o.W, "no passes")
			continue
		}
		var rows []reports.Record
		partial := false
		for i := range sp.result.Passes {
			p := &sp.result.Passes[i]
			aos, los := tableTime(spec, p.AOS, true), tableTime(spec, p.LOS, false)
			if p.PartialStart {
				aos += "*"
			}
			if p.PartialEnd {
				los += "*"
			}
			partial = partial || p.Partial()
			r := reports.Record{
				{Key: "aos_utc", Value: aos},
				{Key: "tca_utc", Value: tableTime(spec, p.TCA, false)},
				{Key: "los_utc", Value: los},
				reports.Num("duration_s", "", p.Duration(), 5),
				reports.Num("max_el_deg", "", p.MaxElevation()*rad2deg, 4),
				{Key: "az_aos/tca/los_deg", Value: fmt.Sprintf("%.0f/%.0f/%.0f", p.AOSLook.Az*rad2deg, p.TCALook.Az*rad2deg, p.LOSLook.Az*rad2deg)},
				reports.Num("min_range_km", "", p.MinRange, 6),
				{Key: "sunlit", Value: p.Sunlit},
				{Key: "site_dark", Value: p.SiteDark},
			}
			if hasFreq {
				r = append(r,
					reports.Field{Key: "doppler_aos_hz", Value: int(math.Round(visibility.Doppler(freq, p.AOSLook.RangeRate)))},
					reports.Field{Key: "doppler_los_hz", Value: int(math.Round(visibility.Doppler(freq, p.LOSLook.RangeRate)))},
				)
			}
			rows = append(rows, r)
		}
		if err := reports.WriteListTable(o.W, rows); err != nil {
			return err
		}
		if partial {
			fmt.Fprintln(o.W, "* cut by the start or the end of the span (partial pass)")
		}
	}
	writeNotes(o, notes, passesCaution)
	return nil
}
