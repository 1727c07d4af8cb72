package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"
	"gonum.org/v1/plot/vg"

	"centra/bodies"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/suborbital"
	"centra/propagate/track"
	"centra/propagate/trajectory"
	"centra/propagate/visibility"
	"centra/reports"
	"centra/reports/plots"
)

func init() { register(90, plotCommand) }

var plotKinds = []string{"orbit", "groundtrack", "altitude", "sky", "dispersion"}

// plotBaseFlags are plot's flags without those it borrows from ballistic.
func plotBaseFlags() []cli.Flag {
	pic := "Picture"
	flags := []cli.Flag{
		&cli.StringFlag{Name: "kind", Usage: "what to draw, `KIND`: orbit, groundtrack, altitude, sky or dispersion", Category: pic},
		&cli.StringFlag{Name: "width", Value: "8in", Usage: "picture width `LENGTH` with its unit: in, cm, mm, pt or px (px at --dpi)", Category: pic},
		&cli.StringFlag{Name: "height", Value: "5in", Usage: "picture height `LENGTH` with its unit: in, cm, mm, pt or px", Category: pic},
		&cli.IntFlag{Name: "dpi", Value: plots.DefaultDPI, Usage: "resolution of a PNG in dots per inch, `N` from 36 to 600", Category: pic},
		&cli.BoolFlag{Name: "speed", Usage: "altitude: add a panel of the inertial speed", Category: pic},
		&cli.StringFlag{Name: "span", Usage: "how long to propagate, `DURATION` (default: one period for orbit, three for altitude and groundtrack, 1d for sky)"},
		&cli.StringFlag{Name: "step", Usage: "sampling step `DURATION` (default: chosen from the span and period)"},
	}
	flags = append(flags, orbitFlags()...)
	flags = append(flags, modelFlags()...)
	return append(flags, siteFlags()...)
}

func plotCommand() *cli.Command {
	flags := plotBaseFlags()
	flags = append(flags, plotBallisticFlags(flags)...)
	return &cli.Command{
		Name:  "plot",
		Usage: "SVG or PNG pictures: orbit, ground track, altitude, sky and dispersion plots",
		UsageText: `centra plot --kind KIND --out FILE.svg|FILE.png [orbit flags] [model flags] [--span D] [--step D]

examples:
  centra plot --kind orbit --periapsis-alt 300 --apoapsis-alt 3000 --inclination 63.4 --out orbit.svg
  centra plot --kind orbit --periapsis-alt 500 --apoapsis-alt 8000 --model zonal --span 20d --out drift.png
  centra plot --kind groundtrack --altitude 530 --sun-synchronous --site 47.412,8.917,612 --min-elevation 10 --out track.png
  centra plot --kind altitude --periapsis-alt 250 --apoapsis-alt 1200 --inclination 51.6 --span 1d --speed --out alt.svg
  centra plot --kind sky --altitude 530 --sun-synchronous --site ashgrove=47.412,8.917,612 --min-elevation 10 --out sky.png
  centra plot --kind dispersion --site 57.35,-7.33 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 84 --azimuth 290 \
    --mass 25 --area 0.02 --cd 0.9 --dispersions 1000 --sigma-speed 10m/s --sigma-flight-path-angle 0.5 --sigma-azimuth 1 --out impacts.svg`,
		Description: `Draws one picture; the format follows the extension of --out (.svg or .png)
and --out is required. --width and --height take a unit (8in, 20cm, 1200px);
a PNG is rendered at --dpi (default 150: 8in x 5in is 1200 x 750 px).

Kinds:
  orbit        the trajectory in the plane of the initial osculating orbit
               (perifocal frame), to scale, with the body as a disc, periapsis
               and apoapsis marked with their altitudes and the line of
               apsides; the track fades from pale (t = 0) to deep (end), so
               the drift of a perturbed orbit over many revolutions shows.
  groundtrack  latitude and longitude (WGS 84) on an equirectangular map
               with a 30 deg graticule, the track cut at the date line, each
               --site with its visibility circle at its lowest threshold, the
               segments in view highlighted and the ones in the Earth's
               umbra dashed (conical shadow). Earth only.
  altitude     altitude above the equatorial radius against time, with the
               periapsides and apoapsides located by the propagator;
               --speed adds the inertial speed.
  sky          azimuth and elevation of each pass over one --site (north
               up, east right, zenith at the centre), AOS and LOS labelled.
  dispersion   impact points of a ballistic dispersion run (the burnout,
               vehicle and --dispersions/--sigma-* flags of 'centra
               ballistic', --site being the launcher) with the 1-sigma and
               3-sigma ellipses, east and north of the mean impact point.

On success the command prints what it wrote (file, size, samples) in the
--format of the other commands.`,
		Flags:  flags,
		Action: plotAction,
	}
}

// plotJob is a parsed plot: run computes the figure and the summary.
type plotJob struct {
	kind     string
	warnings []string
	run      func() (*plots.Figure, reports.Record, error)
}

func plotAction(c *cli.Context) error {
	kind := strings.ToLower(strings.TrimSpace(c.String("kind")))
	switch kind {
	case "":
		return inputErrorf("add --kind "+strings.Join(plotKinds, "|"), "plot needs --kind")
	case "ground-track", "ground":
		kind = "groundtrack"
	}
	path := c.String("out")
	if path == "" {
		return inputErrorf("add --out FILE.svg or --out FILE.png", "plot writes a picture file and needs --out")
	}
	format, err := plots.FormatOfPath(path)
	if err != nil {
		return inputErrorf("name the file .svg or .png", "--out %q is not a picture format centra writes", path)
	}
	size, err := parsePictureSize(c, format)
	if err != nil {
		return err
	}
	var job *plotJob
	switch kind {
	case "orbit", "altitude", "groundtrack", "sky":
		if err := rejectBallisticFlags(c, kind); err != nil {
			return err
		}
	}
	switch kind {
	case "orbit", "altitude":
		job, err = planeJob(c, kind)
	case "groundtrack":
		job, err = groundJob(c)
	case "sky":
		job, err = skyJob(c)
	case "dispersion":
		job, err = dispersionJob(c)
	default:
		return inputErrorf("use --kind "+strings.Join(plotKinds, ", "), "--kind %q is not a picture centra draws", c.String("kind"))
	}
	if err != nil {
		return err
	}
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	for _, w := range job.warnings {
		o.warn("%s", w)
	}
	fig, rec, err := job.run()
	if err == nil {
		err = fig.Render(o.W, format, size)
		if err != nil {
			err = inputErrorf("choose another --width, --height or --dpi", "rendering the picture: %v", err)
		}
	}
	if err := o.finish(err); err != nil {
		return err
	}
	head := reports.Record{
		{Key: "kind", Label: "picture", Value: job.kind},
		{Key: "file", Label: "file", Value: path},
		{Key: "format", Label: "format", Value: format.String()},
		reports.Num("width_in", "width (in)", float64(size.Width/vg.Inch), 4),
		reports.Num("height_in", "height (in)", float64(size.Height/vg.Inch), 4),
	}
	if format == plots.PNG {
		w, h := size.Pixels()
		head = append(head, reports.Field{Key: "width_px", Label: "width (px)", Value: w}, reports.Field{Key: "height_px", Label: "height (px)", Value: h})
	}
	rec = append(head, rec...)
	so := &output{Format: o.Format, W: c.App.Writer, Stderr: o.Stderr, Quiet: o.Quiet}
	return so.emit("Wrote "+job.kind+" picture", rec)
}

// parsePictureSize reads --width, --height and --dpi.
func parsePictureSize(c *cli.Context, f plots.Format) (plots.Size, error) {
	dpi := c.Int("dpi")
	if dpi < plots.MinDPI || dpi > plots.MaxDPI {
		return plots.Size{}, inputErrorf(fmt.Sprintf("give a resolution from %d to %d dpi", plots.MinDPI, plots.MaxDPI), "--dpi %d is out of range", dpi)
	}
	w, err := pictureLength(c, "width", dpi)
	if err != nil {
		return plots.Size{}, err
	}
	h, err := pictureLength(c, "height", dpi)
	if err != nil {
		return plots.Size{}, err
	}
	s := plots.Size{Width: w, Height: h, DPI: dpi}
	if err := s.Validate(f); err != nil {
		var fix string
		if errors.Is(err, plots.ErrSize) {
			fix = fmt.Sprintf("give each side from %g in to %g in (and a PNG of at most %.0f million pixels)", plots.MinSide/vg.Inch, plots.MaxSide/vg.Inch, plots.MaxPixels/1e6)
		}
		return plots.Size{}, inputErrorf(fix, "picture size: %v", strings.TrimPrefix(err.Error(), "plots: "))
	}
	return s, nil
}

var pictureUnits = []struct {
	suffix string
	pt     float64 // points per unit; 0 for px
}{{"in", 72}, {"cm", 72 / 2.54}, {"mm", 72 / 25.4}, {"pt", 1}, {"px", 0}}

func pictureLength(c *cli.Context, name string, dpi int) (vg.Length, error) {
	text := strings.TrimSpace(c.String(name))
	fix := "give a length with its unit, for example 8in, 20cm, 160mm, 576pt or 1200px"
	for _, u := range pictureUnits {
		num, ok := strings.CutSuffix(strings.ToLower(text), u.suffix)
		if !ok {
			continue
		}
		v, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
		if err != nil || !(v > 0) || math.IsInf(v, 0) {
			return 0, inputErrorf(fix, "--%s %q is not a positive length", name, text)
		}
		if u.pt == 0 {
			return vg.Length(v / float64(dpi) * 72), nil
		}
		return vg.Length(v * u.pt), nil
	}
	return 0, inputErrorf(fix, "--%s %q has no unit", name, text)
}

// pictureSpan returns --span and --step, or the defaults of the kind
// (set on c so that parseSpanStep validates them like the other
// commands').
func pictureSpan(c *cli.Context, defSpan, period float64, maxSamples float64) (span, step float64, err error) {
	if !c.IsSet("span") {
		if err := c.Set("span", strconv.FormatFloat(defSpan, 'g', -1, 64)+"s"); err != nil {
			return 0, 0, err
		}
	}
	if !c.IsSet("step") {
		s, err := parseDurationFlag(c, "span")
		if err != nil {
			return 0, 0, err
		}
		st := math.Abs(s) / 720
		if period > 0 {
			st = math.Max(period/360, math.Abs(s)/maxSamples)
		}
		if err := c.Set("step", strconv.FormatFloat(st, 'g', -1, 64)+"s"); err != nil {
			return 0, 0, err
		}
	}
	span, step, err = parseSpanStep(c)
	if err != nil {
		return 0, 0, err
	}
	if n := math.Abs(span)/step + 1; n > track.MaxSamples {
		return 0, 0, inputErrorf("lengthen --step or shorten --span", "--span %s at --step %s gives %.3g samples; a picture takes at most %d", c.String("span"), c.String("step"), n, track.MaxSamples)
	}
	return span, step, nil
}

// propagateTrack runs the model of the command over the span, stopping
// at the body's surface.
func propagateTrack(spec *orbitSpec, ms *modelSpec, span, step float64) (*track.Trajectory, error) {
	p, err := propagate.New(ms.Model, ms.Options)
	if err != nil {
		return nil, inputErrorf("check --model and --tolerance", "%v", err)
	}
	surface, err := surfaceEvent(spec)
	if err != nil {
		return nil, err
	}
	tr, err := track.PropagateUntil(p, spec.State, span, step, &surface)
	if err != nil {
		if ie := surfaceStop(spec, err); ie != nil {
			return nil, ie
		}
		if errors.Is(err, track.ErrSamples) {
			return nil, inputErrorf("lengthen --step or shorten --span", "%v", err)
		}
		return nil, propagationError(err)
	}
	return tr, nil
}

// planeJob is --kind orbit and --kind altitude.
func planeJob(c *cli.Context, kind string) (*plotJob, error) {
	if c.Bool("speed") && kind != "altitude" {
		return nil, inputErrorf("drop --speed or use --kind altitude", "--speed applies to --kind altitude only")
	}
	if err := rejectFlags(c, kind, "site", "min-elevation", "dut1"); err != nil {
		return nil, err
	}
	spec, err := parseOrbit(c)
	if err != nil {
		return nil, err
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return nil, err
	}
	b := spec.Body
	geo, err := orbit.GeometryOf(b.GM, spec.Elements)
	if err != nil {
		return nil, inputErrorf("check the orbit", "%v", err)
	}
	defSpan, err := track.DefaultSpan(b.GM, spec.Elements)
	if err != nil {
		return nil, inputErrorf("give --span", "no default span for this orbit: %v", err)
	}
	period := 0.0
	if geo.HasPeriod {
		period = geo.Period
		if kind == "altitude" {
			defSpan = 3 * period
		}
	}
	span, step, err := pictureSpan(c, defSpan, period, 1e5)
	if err != nil {
		return nil, err
	}
	head := plots.Header{Body: b.Name, Epoch: formatEpoch(spec.Epoch), Model: ms.Label, Span: span}
	job := &plotJob{kind: kind, warnings: spec.Warnings}
	job.run = func() (*plots.Figure, reports.Record, error) {
		tr, err := propagateTrack(spec, ms, span, step)
		if err != nil {
			return nil, nil, err
		}
		rec := reports.Record{
			{Key: "samples", Label: "samples", Value: len(tr.T)},
			reports.Num("span_s", "span (s)", span, 10),
			reports.Num("step_s", "step (s)", step, 10),
		}
		var fig *plots.Figure
		if kind == "orbit" {
			pts, aps := tr.InPlane(track.PerifocalOf(spec.Elements))
			d := plots.OrbitData{
				Header: head, BodyRadius: b.EquatorialRadius, Points: pts, Apsides: aps,
				Eccentricity:    geo.Eccentricity,
				PeriapsisRadius: geo.PeriapsisRadius, PeriapsisAlt: geo.PeriapsisRadius - b.EquatorialRadius,
			}
			if geo.HasApoapsis {
				d.ApoapsisRadius, d.ApoapsisAlt = geo.ApoapsisRadius, geo.ApoapsisRadius-b.EquatorialRadius
			}
			fig, err = plots.Orbit(d)
		} else {
			samples, aps := tr.Profile(b.EquatorialRadius)
			fig, err = plots.Altitude(plots.AltitudeData{Header: head, Samples: samples, Apsides: aps, Eccentricity: geo.Eccentricity, Speed: c.Bool("speed")})
		}
		if err != nil {
			return nil, nil, inputErrorf("check the orbit and the span", "drawing: %v", err)
		}
		return fig, rec, nil
	}
	return job, nil
}

// rejectFlags refuses flags that the kind does not use.
func rejectFlags(c *cli.Context, kind string, names ...string) error {
	for _, n := range names {
		if c.IsSet(n) {
			return inputErrorf("drop --"+n+" or choose a kind that uses it", "--%s does not apply to --kind %s", n, kind)
		}
	}
	return nil
}

// plotSites reads the site flags of passes (siteflags.go) and names
// each site for the picture: its given name, or its coordinates.
func plotSites(c *cli.Context, body *bodies.Body) ([]visibility.Site, []string, error) {
	sites, infos, err := parseSites(c, body)
	if err != nil {
		return nil, nil, err
	}
	names := make([]string, len(sites))
	for i, in := range infos {
		names[i] = in.Name
		if !in.Named {
			names[i] = siteName(in.Lat, in.Lon)
		}
	}
	return sites, names, nil
}

// siteName writes a site's coordinates (deg) as 47.41°N 8.92°E.
func siteName(lat, lon float64) string {
	ns, ew := "N", "E"
	if lat < 0 {
		ns, lat = "S", -lat
	}
	lon = math.Remainder(lon, 360)
	if lon < 0 {
		ew, lon = "W", -lon
	}
	return fmt.Sprintf("%.2f°%s %.2f°%s", lat, ns, lon, ew)
}

// groundJob is --kind groundtrack.
func groundJob(c *cli.Context) (*plotJob, error) {
	if err := rejectFlags(c, "groundtrack", "speed"); err != nil {
		return nil, err
	}
	spec, err := parseOrbit(c)
	if err != nil {
		return nil, err
	}
	if spec.Body.Name != "earth" {
		return nil, inputErrorf("use --body earth, or --kind orbit or altitude", "--kind groundtrack needs the Earth's rotation and ellipsoid, which centra has for Earth only")
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return nil, err
	}
	var sites []visibility.Site
	var names []string
	if len(c.StringSlice("site")) > 0 {
		if sites, names, err = plotSites(c, spec.Body); err != nil {
			return nil, err
		}
	} else if err := rejectFlags(c, "groundtrack without --site", "min-elevation", "mask", "refraction"); err != nil {
		return nil, err
	}
	dut1, err := parseDUT1(c)
	if err != nil {
		return nil, err
	}
	b := spec.Body
	geo, err := orbit.GeometryOf(b.GM, spec.Elements)
	if err != nil {
		return nil, inputErrorf("check the orbit", "%v", err)
	}
	defSpan, err := track.DefaultSpan(b.GM, spec.Elements)
	if err != nil {
		return nil, inputErrorf("give --span", "no default span for this orbit: %v", err)
	}
	if geo.HasPeriod {
		defSpan = math.Min(3*geo.Period, 2*86400)
	}
	if !c.IsSet("step") {
		s := defSpan
		if c.IsSet("span") {
			if s, err = parseDurationFlag(c, "span"); err != nil {
				return nil, err
			}
		}
		c.Set("step", strconv.FormatFloat(math.Max(30, math.Abs(s)/20000), 'g', -1, 64)+"s")
	}
	span, step, err := pictureSpan(c, defSpan, 0, 0)
	if err != nil {
		return nil, err
	}
	head := plots.Header{Body: b.Name, Epoch: formatEpoch(spec.Epoch), Model: ms.Label, Span: span}
	job := &plotJob{kind: "groundtrack", warnings: spec.Warnings}
	job.run = func() (*plots.Figure, reports.Record, error) {
		tr, err := propagateTrack(spec, ms, span, step)
		if err != nil {
			return nil, nil, err
		}
		gt, err := track.Ground(tr, spec.Epoch, dut1, b.EquatorialRadius, sites)
		if err != nil {
			return nil, nil, inputErrorf("check --site and --min-elevation", "%v", err)
		}
		d := plots.GroundData{Header: head, Track: gt}
		for k := range sites {
			s := &sites[k]
			low := track.LowestThreshold(s)
			gs := plots.GroundSite{Name: names[k], Lat: s.Station.Site.Lat, Lon: s.Station.Site.Lon, MinElevation: low}
			if gt.MeanAlt > 0 {
				lambda, err := track.CentralAngle(b.EquatorialRadius, gt.MeanAlt, math.Max(low, -10*math.Pi/180))
				if err == nil {
					gs.Circle, _ = track.VisibilityCircle(gs.Lat, gs.Lon, lambda, 360)
					gs.CircleAlt = gt.MeanAlt
				}
			}
			d.Sites = append(d.Sites, gs)
		}
		fig, err := plots.GroundTrack(d)
		if err != nil {
			return nil, nil, inputErrorf("check the orbit and the span", "drawing: %v", err)
		}
		rec := reports.Record{
			{Key: "samples", Label: "samples", Value: len(tr.T)},
			reports.Num("span_s", "span (s)", span, 10),
			reports.Num("step_s", "step (s)", step, 10),
			reports.Num("mean_alt_km", "mean altitude above WGS 84 (km)", gt.MeanAlt, 8),
			{Key: "sites", Label: "sites", Value: len(sites)},
		}
		return fig, rec, nil
	}
	return job, nil
}

// skyJob is --kind sky.
func skyJob(c *cli.Context) (*plotJob, error) {
	if err := rejectFlags(c, "sky", "speed"); err != nil {
		return nil, err
	}
	spec, err := parseOrbit(c)
	if err != nil {
		return nil, err
	}
	if spec.Body.Name != "earth" {
		return nil, inputErrorf("use --body earth", "--kind sky needs the Earth's rotation and ellipsoid, which centra has for Earth only")
	}
	ms, err := parseModel(c, spec.Body, spec.Epoch)
	if err != nil {
		return nil, err
	}
	if n := len(c.StringSlice("site")); n != 1 {
		return nil, inputErrorf("give one --site [NAME=]LAT,LON[,ALT_M]; draw one picture per site", "--kind sky shows the passes over one site, got %d", n)
	}
	sites, names, err := plotSites(c, spec.Body)
	if err != nil {
		return nil, err
	}
	dut1, err := parseDUT1(c)
	if err != nil {
		return nil, err
	}
	if !c.IsSet("step") {
		c.Set("step", "10s")
	}
	span, step, err := pictureSpan(c, 86400, 0, 0)
	if err != nil {
		return nil, err
	}
	if span < 0 {
		return nil, inputErrorf("give a positive --span", "--kind sky searches passes forward in time, --span %s is negative", c.String("span"))
	}
	site := sites[0]
	b := spec.Body
	head := plots.Header{Body: b.Name, Epoch: formatEpoch(spec.Epoch), Model: ms.Label, Span: span}
	job := &plotJob{kind: "sky", warnings: spec.Warnings}
	job.run = func() (*plots.Figure, reports.Record, error) {
		p, err := propagate.New(ms.Model, ms.Options)
		if err != nil {
			return nil, nil, inputErrorf("check --model and --tolerance", "%v", err)
		}
		surface, err := surfaceEvent(spec)
		if err != nil {
			return nil, nil, err
		}
		passes, err := track.SkyUntil(p, spec.State, spec.Epoch, dut1, span, step, b.EquatorialRadius, site, &surface)
		if err != nil {
			if ie := surfaceStop(spec, err); ie != nil {
				return nil, nil, ie
			}
			if errors.Is(err, trajectory.ErrTrajectory) {
				return nil, nil, inputErrorf("shorten --span", "%v", err)
			}
			return nil, nil, propagationError(err)
		}
		d := plots.SkyData{Header: head, Site: names[0], MinElevation: site.MinElevation, Refraction: site.Refraction}
		if site.Mask != nil {
			d.Threshold = track.ThresholdProfile(&site, 720)
		}
		for _, ps := range passes {
			d.Passes = append(d.Passes, plots.SkyPass{
				AOS: formatEpoch(spec.Epoch.Add(ps.AOS)), LOS: formatEpoch(spec.Epoch.Add(ps.LOS)),
				MaxElevation: ps.MaxElevation(), Sunlit: ps.Sunlit, Partial: ps.Partial(), Path: ps.Path,
			})
		}
		fig, err := plots.Sky(d)
		if err != nil {
			return nil, nil, inputErrorf("check the orbit and the span", "drawing: %v", err)
		}
		rec := reports.Record{
			{Key: "passes", Label: "passes drawn", Value: len(passes)},
			reports.Num("span_s", "span (s)", span, 10),
			reports.Num("step_s", "path step (s)", step, 10),
		}
		return fig, rec, nil
	}
	return job, nil
}

// plotBallisticFlags are the flags of the ballistic command that plot
// lacks (--kind dispersion reads them through parseBallistic); --site,
// --epoch and the model flags are shared, --step is plot's own.
func plotBallisticFlags(have []cli.Flag) []cli.Flag {
	names := map[string]bool{"expect": true, "dispersions-out": true}
	for _, f := range have {
		for _, n := range flagNames(f) {
			names[n] = true
		}
	}
	var out []cli.Flag
	for _, f := range ballisticCommand().Flags {
		if !names[flagNames(f)[0]] {
			out = append(out, f)
		}
	}
	return out
}

// rejectBallisticFlags refuses the burnout and dispersion flags outside
// --kind dispersion.
func rejectBallisticFlags(c *cli.Context, kind string) error {
	for _, f := range plotBallisticFlags(plotBaseFlags()) {
		if n := f.Names()[0]; c.IsSet(n) {
			return inputErrorf("drop --"+n+" or use --kind dispersion", "--%s does not apply to --kind %s", n, kind)
		}
	}
	return nil
}

// ballisticContext copies the flags of plot's context c that the
// ballistic command knows into a context of that command, so that
// parseBallistic reads them as 'centra ballistic' would. --site is the
// launcher (one); plot's --step is not the arc's tabulation step.
func ballisticContext(c *cli.Context) (*cli.Context, error) {
	cmd := ballisticCommand()
	set := flag.NewFlagSet("ballistic", flag.ContinueOnError)
	set.SetOutput(io.Discard)
	for _, f := range cmd.Flags {
		if err := f.Apply(set); err != nil {
			return nil, err
		}
	}
	for _, f := range cmd.Flags {
		name := f.Names()[0]
		if name == "step" || !c.IsSet(name) {
			continue
		}
		var vals []string
		switch f.(type) {
		case *cli.BoolFlag:
			vals = []string{strconv.FormatBool(c.Bool(name))}
		case *cli.StringSliceFlag:
			vals = c.StringSlice(name)
		default:
			if name == "site" {
				vals = c.StringSlice(name)
				if len(vals) != 1 {
					return nil, inputErrorf("give one --site, the launcher", "--kind dispersion flies from one launcher, got %d --site", len(vals))
				}
			} else {
				vals = []string{c.String(name)}
			}
		}
		for _, v := range vals {
			if err := set.Set(name, v); err != nil {
				return nil, inputErrorf("run 'centra ballistic --help' for the flag's form", "--%s %q: %v", name, v, err)
			}
		}
	}
	ctx := cli.NewContext(c.App, set, c)
	ctx.Command = cmd
	return ctx, nil
}

// dispersionJob is --kind dispersion: the ballistic flags, with
// --dispersions N.
func dispersionJob(c *cli.Context) (*plotJob, error) {
	for _, n := range []string{"speed", "span", "step", "min-elevation", "mask", "refraction", "dut1"} {
		if c.IsSet(n) {
			return nil, inputErrorf("drop --"+n+": the dispersion picture takes the flags of 'centra ballistic'", "--%s does not apply to --kind dispersion", n)
		}
	}
	for _, f := range orbitFlags() {
		if n := f.Names()[0]; n != "epoch" && n != "body" && c.IsSet(n) {
			return nil, inputErrorf("drop --"+n+": the dispersion picture takes the flags of 'centra ballistic'", "--%s does not apply to --kind dispersion", n)
		}
	}
	bc, err := ballisticContext(c)
	if err != nil {
		return nil, err
	}
	spec, err := parseBallistic(bc)
	if err != nil {
		return nil, err
	}
	if spec.disp == nil {
		return nil, inputErrorf("add --dispersions N with --sigma-speed, --sigma-flight-path-angle, --sigma-azimuth or --sigma-cd", "--kind dispersion draws a dispersion run")
	}
	head := plots.Header{Body: "earth", Epoch: formatEpoch(spec.ep), Model: spec.model}
	job := &plotJob{kind: "dispersion"}
	job.run = func() (*plots.Figure, reports.Record, error) {
		f, err := suborbital.New(spec.cfg)
		if err != nil {
			return nil, nil, inputErrorf("check --model, --tolerance and --impact-alt", "%v", err)
		}
		arc, err := f.Fly(spec.burnout, spec.vehicle, nil)
		if err != nil {
			return nil, nil, ballisticError(err)
		}
		res, err := suborbital.Disperse(spec.cfg, spec.burnout, spec.vehicle, *spec.disp)
		if err != nil {
			return nil, nil, ballisticError(err)
		}
		im := track.LayOutImpacts(&res, f.Ellipsoid(), spec.cfg.ImpactAlt, arc.Impact.Lat, arc.Impact.Lon)
		ell := func(e suborbital.Ellipse) plots.Ellipse {
			return plots.Ellipse{SemiMajor: e.SemiMajor, SemiMinor: e.SemiMinor, Azimuth: e.Azimuth}
		}
		fig, err := plots.Dispersion(plots.DispersionData{
			Header: head, East: im.East, North: im.North, MeanLat: res.MeanLat, MeanLon: res.MeanLon,
			CentreEast: im.CentreEast, CentreNorth: im.CentreNorth, Sigma1: ell(res.Sigma1), Sigma3: ell(res.Sigma3),
			NominalEast: im.NominalEast, NominalNorth: im.NominalNorth, HasNominal: true,
		})
		if err != nil {
			return nil, nil, inputErrorf("check the burnout and the dispersion flags", "drawing: %v", err)
		}
		rec := reports.Record{
			{Key: "cases", Label: "cases", Value: len(res.Cases)},
			reports.Num("mean_impact_lat_deg", "mean impact latitude", res.MeanLat*rad2deg, 10),
			reports.Num("mean_impact_lon_deg", "mean impact longitude", res.MeanLon*rad2deg, 10),
			reports.Num("ellipse_3sigma_major_km", "3-sigma ellipse semi-major axis", res.Sigma3.SemiMajor, 6),
			reports.Num("ellipse_3sigma_minor_km", "3-sigma ellipse semi-minor axis", res.Sigma3.SemiMinor, 6),
		}
		return fig, rec, nil
	}
	return job, nil
}
