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
	"centra/orbit/transfer"
	"centra/reports"
)

func init() { register(50, transferCommand) }

// The Hohmann/bi-elliptic crossover ratios (larger over smaller circular
// radius) stated in the doc of transfer.Compare and recomputed in
// testdata/transfer/reference.json ("crossover": rb_infinite,
// rb_equal_r2). They only choose the wording of a note; which transfer is
// cheaper is always computed.
const (
	transferCrossoverLow  = 11.938765472645922 // below: Hohmann cheaper for every rb
	transferCrossoverHigh = 15.581718730951497 // above: bi-elliptic cheaper for every rb above the larger radius
)

func transferFlags() []cli.Flag {
	orb, man, prop := "Orbits (altitudes above the equatorial radius, radii from the centre)", "Manoeuvre", "Propellant (Tsiolkovsky)"
	return []cli.Flag{
		&cli.StringFlag{Name: "body", Value: "earth", Usage: "central `NAME` (see 'centra bodies')", Category: orb},
		&cli.StringFlag{Name: "from-alt", Usage: "initial circular orbit at altitude `H`", Category: orb},
		&cli.StringFlag{Name: "from-radius", Usage: "initial circular orbit of radius `R`", Category: orb},
		&cli.StringFlag{Name: "from-periapsis-alt", Usage: "initial elliptic orbit: periapsis altitude `H` (with --from-apoapsis-alt)", Category: orb},
		&cli.StringFlag{Name: "from-apoapsis-alt", Usage: "initial elliptic orbit: apoapsis altitude `H` (with --from-periapsis-alt)", Category: orb},
		&cli.StringFlag{Name: "depart", Usage: "burn at this `APSIS` of an elliptic initial orbit: periapsis or apoapsis", Category: orb},
		&cli.StringFlag{Name: "to-alt", Usage: "final circular orbit at altitude `H`", Category: orb},
		&cli.StringFlag{Name: "to-radius", Usage: "final circular orbit of radius `R`", Category: orb},
		&cli.StringFlag{Name: "to-periapsis-alt", Usage: "final elliptic orbit: periapsis altitude `H` (with --to-apoapsis-alt)", Category: orb},
		&cli.StringFlag{Name: "to-apoapsis-alt", Usage: "final elliptic orbit: apoapsis altitude `H` (with --to-periapsis-alt)", Category: orb},
		&cli.StringFlag{Name: "arrive", Usage: "arrive at this `APSIS` of an elliptic final orbit: periapsis or apoapsis", Category: orb},
		&cli.StringFlag{Name: "method", Value: "hohmann", Usage: "`METHOD`: hohmann, bielliptic, all (both, compared), plane (a plane change alone) or phasing (implied by --phase)", Category: man},
		&cli.StringFlag{Name: "intermediate-alt", Usage: "bi-elliptic: apoapsis altitude `H` of the two transfer ellipses (at least the higher orbit)", Category: man},
		&cli.StringFlag{Name: "intermediate-radius", Usage: "bi-elliptic: apoapsis radius `R` of the two transfer ellipses", Category: man},
		&cli.StringFlag{Name: "plane-change", Usage: "turn the orbit plane by `ANGLE` (0..180 deg): alone with --method plane, or split optimally between the two Hohmann burns", Category: man},
		&cli.StringFlag{Name: "phase", Usage: "phasing: the target's position minus ours along the motion, `ANGLE` strictly between -360 and 360 deg (positive: target ahead)", Category: man},
		&cli.StringFlag{Name: "phasing-revs", Value: "1", Usage: "phasing: `N` revolutions on the phasing orbit (1 or more)", Category: man},
		&cli.StringFlag{Name: "min-alt", Value: "0", Usage: "phasing: lowest periapsis altitude `H` the phasing orbit may have", Category: man},
		&cli.StringFlag{Name: "isp", Usage: "specific impulse `S` (seconds); with --mass or --dry-mass adds the propellant", Category: prop},
		&cli.StringFlag{Name: "mass", Usage: "mass `KG` before the first burn (with --isp)", Category: prop},
		&cli.StringFlag{Name: "dry-mass", Usage: "mass `KG` left after the last burn (with --isp; instead of --mass)", Category: prop},
		expectFlag(),
	}
}

func transferCommand() *cli.Command {
	return &cli.Command{
		Name:  "transfer",
		Usage: "delta-v budgets: Hohmann, bi-elliptic, apsis-to-apsis, plane changes, phasing, propellant",
		UsageText: `centra transfer (--from-alt H | --from-radius R | --from-periapsis-alt H --from-apoapsis-alt H --depart APSIS)
    [--to-alt H | --to-radius R | --to-periapsis-alt H --to-apoapsis-alt H --arrive APSIS]
    [--method hohmann|bielliptic|all|plane] [--intermediate-alt H] [--plane-change ANGLE]
    [--phase ANGLE --phasing-revs N] [--isp S (--mass KG | --dry-mass KG)] [--expect NAME=VALUE±TOL ...]

examples:
  centra transfer --from-alt 191.34411 --to-alt 35781.34857
  centra transfer --from-alt 300 --to-alt 35786 --plane-change 28.5
  centra transfer --from-alt 500 --to-alt 384000 --method all --intermediate-alt 500000
  centra transfer --from-periapsis-alt 480 --from-apoapsis-alt 800 --depart periapsis --to-alt 16000 --isp 300 --mass 2000
  centra transfer --method plane --from-alt 500 --plane-change 10
  centra transfer --from-alt 35786 --phase -12 --phasing-revs 3
  centra --format json transfer --from-alt 532 --to-alt 560 --isp 220 --mass 4.2
  centra transfer --from-radius 6569.48111 --to-radius 42159.48557 --expect dv_total_km_s=3.935224±5e-7`,
		Description: `Impulsive manoeuvre budgets between orbits about one body (--body). Burns are
instantaneous and, except plane changes, tangential at an apsis; the orbits
are coplanar unless --plane-change is given, and the apse lines of elliptic
orbits are aligned so that the arrival apsis lies 180 deg from the burn.

Methods:
  hohmann     two burns along the ellipse tangent to both orbits (default). With
              an elliptic initial or final orbit it is the apsis-to-apsis
              transfer: --depart and --arrive name the apses joined. With
              --plane-change (circular orbits) the plane change is split between
              the two burns so that the total is least; the split is found
              numerically and reported in deg at each burn.
  bielliptic  three burns via two half ellipses whose common apoapsis is
              --intermediate-alt (or --intermediate-radius); circular orbits.
  all         Hohmann and bi-elliptic side by side: which is cheaper, by how much.
  plane       a plane change alone, at a node of the two planes: on a circular
              --from orbit, or at the --depart apsis of an elliptic one (cheapest
              at apoapsis, where the orbit is slowest).
  phasing     (--phase ANGLE, --phasing-revs N) on the circular --from orbit: a
              burn onto a phasing ellipse with one apsis on the circle, N
              revolutions on it while the target makes N revolutions of the
              circle, and a burn back. A target ahead needs a lower, faster
              phasing orbit; one behind a higher, slower one. The phasing orbit
              must not reach below --min-alt (default the surface).

Hohmann or bi-elliptic: between circular orbits whose radii differ by a ratio
(larger over smaller) below 11.94 the Hohmann transfer is cheaper than every
bi-elliptic one; above 15.58 a bi-elliptic transfer is cheaper for every
intermediate radius above the larger orbit; in between it depends on the
intermediate radius. Bi-elliptic transfers take far longer.

Each burn is a row: label, where (altitude_km, and true_anomaly_deg on the
transfer orbit the burn starts, or for the last burn ends: 0 periapsis, 180
apoapsis), dv_km_s, speed_change_km_s (negative when braking),
cumulative_dv_km_s, time_s from the first burn and plane_change_deg. With
--isp and --mass (mass before the first burn) or --dry-mass (mass after the
last burn) the rocket equation gives propellant_kg and mass_after_kg per
burn, and the total.

JSON: method, dv1_km_s, dv2_km_s, dv3_km_s (null without a third burn),
dv_total_km_s, transfer_time_s, propellant_kg (null without --isp), the
"burns" and "legs" (orbits flown) lists and method-specific keys; with
--method all a "cases" list (one object per method), cheaper and saving_km_s.
CSV: one row per burn (every case's with --method all). --expect works on
every numeric key of the summary.`,
		Flags:  transferFlags(),
		Action: transferAction,
	}
}

// transferEnd is one end orbit as given on the command line.
type transferEnd struct {
	set      bool
	ellipse  transfer.Ellipse // radii, km
	circular bool
	flags    string // the flags that gave it, for messages
}

// transferSpec is the parsed command line, in internal units.
type transferSpec struct {
	body           *bodies.Body
	method         string // hohmann, bielliptic, all, plane, phasing
	from, to       transferEnd
	depart, arrive transfer.Apsis
	rb             float64 // bi-elliptic intermediate radius, km
	hasRB          bool
	di             float64 // plane change, rad
	hasDI          bool
	phase          float64 // rad
	revs           int
	minRadius      float64 // km
	isp            float64 // s
	hasIsp         bool
	mass, dry      float64 // kg
	hasMass        bool
	hasDry         bool
}

func transferAction(c *cli.Context) error {
	spec, err := parseTransfer(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	res, err := computeTransfer(spec)
	if err != nil {
		return err
	}
	rec, rows := transferRecords(res)
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	header := reports.CSVHeader(rows[0])
	err = o.emitRows(transferTitle(res), rec, header, rows, exps, func() error {
		if o.Format != "table" {
			return nil
		}
		return writeTransferTables(o, res)
	})
	return o.finish(err)
}

// transferLength reads a length flag; ok is false when it was not given.
func transferLength(c *cli.Context, name string) (float64, bool, error) {
	return quantityFlag(c, name, quantity.Length)
}

// parseEnd reads the --from-* or --to-* flags.
func parseEnd(c *cli.Context, side string, b *bodies.Body) (transferEnd, error) {
	alt, rad, peri, apo := side+"-alt", side+"-radius", side+"-periapsis-alt", side+"-apoapsis-alt"
	var forms []string
	if c.IsSet(alt) {
		forms = append(forms, "--"+alt)
	}
	if c.IsSet(rad) {
		forms = append(forms, "--"+rad)
	}
	if c.IsSet(peri) || c.IsSet(apo) {
		forms = append(forms, "--"+peri+"/--"+apo)
	}
	fix := fmt.Sprintf("give one of --%s H, --%s R or --%s H --%s H", alt, rad, peri, apo)
	switch len(forms) {
	case 0:
		return transferEnd{}, nil
	case 1:
	default:
		return transferEnd{}, inputErrorf(fix, "the %s orbit is given twice (%s)", transferSideName(side), strings.Join(forms, " and "))
	}
	re := b.EquatorialRadius
	end := transferEnd{set: true, flags: forms[0]}
	below := func(flag string, h float64) error {
		return inputErrorf("give an altitude of 0 km or more", "--%s %s km puts the orbit below the surface of %s", flag, strconv.FormatFloat(h, 'g', 10, 64), b.Name)
	}
	switch forms[0] {
	case "--" + alt:
		h, _, err := transferLength(c, alt)
		if err != nil {
			return end, err
		}
		if h < 0 {
			return end, below(alt, h)
		}
		end.ellipse, end.circular = transfer.Circular(re+h), true
	case "--" + rad:
		r, _, err := transferLength(c, rad)
		if err != nil {
			return end, err
		}
		if !(r >= re) {
			return end, inputErrorf(fmt.Sprintf("give a radius of at least %g km, or use --%s", re, alt),
				"--%s %s km is inside %s (equatorial radius %g km)", rad, strconv.FormatFloat(r, 'g', 10, 64), b.Name, re)
		}
		end.ellipse, end.circular = transfer.Circular(r), true
	default:
		if !c.IsSet(peri) || !c.IsSet(apo) {
			return end, inputErrorf(fmt.Sprintf("give both --%s and --%s (equal for a circle, or use --%s)", peri, apo, alt),
				"the elliptic %s orbit needs both altitudes", transferSideName(side))
		}
		hp, _, err := transferLength(c, peri)
		if err != nil {
			return end, err
		}
		ha, _, err := transferLength(c, apo)
		if err != nil {
			return end, err
		}
		if hp < 0 {
			return end, below(peri, hp)
		}
		if ha < hp {
			return end, inputErrorf("swap the two values", "--%s %g km is below --%s %g km", apo, ha, peri, hp)
		}
		end.ellipse = transfer.Ellipse{Periapsis: re + hp, Apoapsis: re + ha}
		end.circular = hp == ha
	}
	return end, nil
}

func transferSideName(side string) string {
	if side == "from" {
		return "initial"
	}
	return "final"
}

// parseApsis reads --depart or --arrive.
func parseApsis(c *cli.Context, name string) (transfer.Apsis, error) {
	switch strings.ToLower(strings.TrimSpace(c.String(name))) {
	case "periapsis":
		return transfer.Periapsis, nil
	case "apoapsis":
		return transfer.Apoapsis, nil
	}
	return 0, inputErrorf("write --"+name+" periapsis or --"+name+" apoapsis", "--%s %q is not an apsis", name, c.String(name))
}

func parseTransfer(c *cli.Context) (*transferSpec, error) {
	b, err := lookupBody(c, c.String("body"))
	if err != nil {
		return nil, err
	}
	s := &transferSpec{body: b}
	method := strings.ToLower(strings.TrimSpace(c.String("method")))
	switch method {
	case "hohmann", "bielliptic", "all", "plane", "phasing":
	case "bi-elliptic":
		method = "bielliptic"
	default:
		return nil, inputErrorf("use --method hohmann, bielliptic, all, plane or phasing", "unknown --method %q", c.String("method"))
	}
	if c.IsSet("phase") {
		if c.IsSet("method") && method != "phasing" {
			return nil, inputErrorf("drop --method (or write --method phasing) to phase", "--phase makes a phasing manoeuvre and cannot be combined with --method %s", method)
		}
		method = "phasing"
	} else if method == "phasing" {
		return nil, inputErrorf("give the angle to make up, for example --phase 20", "--method phasing needs --phase ANGLE")
	}
	s.method = method

	if s.from, err = parseEnd(c, "from", b); err != nil {
		return nil, err
	}
	if s.to, err = parseEnd(c, "to", b); err != nil {
		return nil, err
	}
	if !s.from.set {
		return nil, inputErrorf("give --from-alt H, --from-radius R or --from-periapsis-alt H --from-apoapsis-alt H", "no initial orbit given")
	}
	// Which flags each method takes.
	oneOrbit := method == "plane" || method == "phasing"
	switch {
	case oneOrbit && s.to.set:
		return nil, inputErrorf("drop "+s.to.flags, "--method %s works on the initial orbit alone; %s gives a final orbit", method, s.to.flags)
	case !oneOrbit && !s.to.set:
		return nil, inputErrorf("give --to-alt H, --to-radius R or --to-periapsis-alt H --to-apoapsis-alt H", "no final orbit given")
	}
	if method == "bielliptic" || method == "all" || method == "phasing" {
		if !s.from.circular || (s.to.set && !s.to.circular) {
			what := "bi-elliptic transfers"
			if method == "phasing" {
				what = "phasing"
			}
			return nil, inputErrorf("give circular orbits (--from-alt/--to-alt), or use --method hohmann for an apsis-to-apsis transfer", "%s need circular orbits in centra", what)
		}
	}
	// --depart and --arrive: needed exactly when the orbit is elliptic and
	// the method burns at one of its apses.
	if err := s.parseApses(c); err != nil {
		return nil, err
	}
	// Bi-elliptic intermediate apoapsis.
	bi := method == "bielliptic" || method == "all"
	ia, ir := c.IsSet("intermediate-alt"), c.IsSet("intermediate-radius")
	switch {
	case !bi && (ia || ir):
		return nil, inputErrorf("drop it, or use --method bielliptic or all", "--intermediate-alt/--intermediate-radius apply to bi-elliptic transfers only")
	case bi && ia && ir:
		return nil, inputErrorf("give one of them", "--intermediate-alt and --intermediate-radius both give the intermediate apoapsis")
	case bi && !ia && !ir:
		return nil, inputErrorf("give --intermediate-alt H (at least the higher orbit's altitude), for example twice the final altitude", "--method %s needs the intermediate apoapsis of the bi-elliptic transfer", method)
	case bi:
		name := "intermediate-alt"
		if ir {
			name = "intermediate-radius"
		}
		v, _, err := transferLength(c, name)
		if err != nil {
			return nil, err
		}
		if ia {
			v += b.EquatorialRadius
		}
		hi := math.Max(s.from.ellipse.Apoapsis, s.to.ellipse.Apoapsis)
		if !(v >= hi) {
			shown, unit := v, "radius"
			if ia {
				shown, unit = v-b.EquatorialRadius, "altitude"
			}
			return nil, inputErrorf(fmt.Sprintf("give an intermediate %s of at least %s km, the higher orbit's", unit, transferKm(transferShow(hi, ia, b))),
				"--%s %s km is below the higher of the two orbits", name, transferKm(shown))
		}
		s.rb, s.hasRB = v, true
	}
	// Plane change.
	if c.IsSet("plane-change") {
		di, _, err := quantityFlag(c, "plane-change", quantity.Angle)
		if err != nil {
			return nil, err
		}
		if !(di >= 0 && di <= math.Pi) {
			return nil, inputErrorf("give an angle from 0 to 180 deg (the angle between the two planes)", "--plane-change %g deg is outside 0..180 deg", di*rad2deg)
		}
		switch {
		case method == "bielliptic" || method == "all" || method == "phasing":
			return nil, inputErrorf("use --method hohmann or --method plane for a plane change", "--plane-change is not combined with %s in centra", transferMethodWords(method))
		case method == "hohmann" && !(s.from.circular && s.to.circular):
			return nil, inputErrorf("use circular orbits, or budget the plane change separately with --method plane", "--plane-change is combined with a Hohmann transfer between circular orbits only")
		}
		s.di, s.hasDI = di, true
	} else if method == "plane" {
		return nil, inputErrorf("give the angle, for example --plane-change 10", "--method plane needs --plane-change ANGLE")
	}
	// Phasing.
	if err := s.parsePhasing(c); err != nil {
		return nil, err
	}
	// Propellant.
	if err := s.parsePropellant(c); err != nil {
		return nil, err
	}
	return s, nil
}

func (s *transferSpec) parseApses(c *cli.Context) error {
	fromApsis := s.method == "hohmann" || s.method == "plane"
	switch {
	case c.IsSet("depart") && (s.from.circular || !fromApsis):
		return inputErrorf("drop --depart", "--depart names an apsis of an elliptic initial orbit (--from-periapsis-alt/--from-apoapsis-alt), and this initial orbit is circular")
	case !s.from.circular && !c.IsSet("depart"):
		return inputErrorf("add --depart periapsis or --depart apoapsis", "the initial orbit is elliptic: say at which apsis the burn is")
	case c.IsSet("depart"):
		a, err := parseApsis(c, "depart")
		if err != nil {
			return err
		}
		s.depart = a
	}
	switch {
	case c.IsSet("arrive") && (!s.to.set || s.to.circular):
		return inputErrorf("drop --arrive", "--arrive names an apsis of an elliptic final orbit (--to-periapsis-alt/--to-apoapsis-alt), and there is none")
	case s.to.set && !s.to.circular && !c.IsSet("arrive"):
		return inputErrorf("add --arrive periapsis or --arrive apoapsis", "the final orbit is elliptic: say at which of its apses the transfer arrives")
	case c.IsSet("arrive"):
		a, err := parseApsis(c, "arrive")
		if err != nil {
			return err
		}
		s.arrive = a
	}
	return nil
}

func (s *transferSpec) parsePhasing(c *cli.Context) error {
	if s.method != "phasing" {
		for _, f := range []string{"phasing-revs", "min-alt"} {
			if c.IsSet(f) {
				return inputErrorf("drop --"+f+", or give --phase ANGLE", "--%s applies to phasing (--phase) only", f)
			}
		}
		return nil
	}
	ph, _, err := quantityFlag(c, "phase", quantity.Angle)
	if err != nil {
		return err
	}
	if !(math.Abs(ph) < 2*math.Pi) {
		return inputErrorf("give an angle strictly between -360 and 360 deg", "--phase %g deg is a whole revolution or more", ph*rad2deg)
	}
	revs, err := strconv.Atoi(strings.TrimSpace(c.String("phasing-revs")))
	if err != nil || revs < 1 {
		return inputErrorf("give a whole number of revolutions, 1 or more", "--phasing-revs %q is not a whole number of 1 or more", c.String("phasing-revs"))
	}
	minAlt, err := quantity.Parse(quantity.Length, c.String("min-alt"))
	if err != nil {
		return flagError("min-alt", err)
	}
	r := s.from.ellipse.Periapsis
	re := s.body.EquatorialRadius
	if !(minAlt >= 0) || !(re+minAlt < r) {
		return inputErrorf(fmt.Sprintf("give --min-alt from 0 km up to below the orbit's altitude (%s km)", transferKm(r-re)),
			"--min-alt %s km is not below the orbit", transferKm(minAlt))
	}
	s.phase, s.revs, s.minRadius = ph, revs, re+minAlt
	return nil
}

func (s *transferSpec) parsePropellant(c *cli.Context) error {
	hasIsp, hasMass, hasDry := c.IsSet("isp"), c.IsSet("mass"), c.IsSet("dry-mass")
	switch {
	case !hasIsp && (hasMass || hasDry):
		return inputErrorf("add --isp S (seconds), for example --isp 220", "the propellant needs the specific impulse: --%s without --isp", map[bool]string{true: "mass", false: "dry-mass"}[hasMass])
	case hasIsp && hasMass && hasDry:
		return inputErrorf("give --mass (before the first burn) or --dry-mass (after the last), not both", "--mass and --dry-mass both fix the mass")
	case hasIsp && !hasMass && !hasDry:
		return inputErrorf("add --mass KG (before the first burn) or --dry-mass KG (after the last burn)", "--isp needs a mass")
	case !hasIsp:
		return nil
	}
	isp, err := quantity.Parse(quantity.Duration, c.String("isp"))
	if err != nil {
		return flagError("isp", err)
	}
	if err := requirePositive("isp", isp, "s"); err != nil {
		return err
	}
	name := "mass"
	if hasDry {
		name = "dry-mass"
	}
	m, _, err := quantityFlag(c, name, quantity.Mass)
	if err != nil {
		return err
	}
	if err := requirePositive(name, m, "kg"); err != nil {
		return err
	}
	s.isp, s.hasIsp = isp, true
	if hasDry {
		s.dry, s.hasDry = m, true
	} else {
		s.mass, s.hasMass = m, true
	}
	return nil
}

func transferMethodWords(m string) string {
	switch m {
	case "bielliptic":
		return "a bi-elliptic transfer"
	case "all":
		return "--method all"
	case "phasing":
		return "phasing"
	}
	return m
}

// transferCase is one computed plan with its mass budget.
type transferCase struct {
	plan  transfer.Plan
	steps []transfer.MassStep // nil without --isp
	m0    float64             // kg before the first burn (with --isp)
}

type transferResult struct {
	spec  *transferSpec
	cases []transferCase // one; two (Hohmann, bi-elliptic) for --method all
	cmp   *transfer.Comparison
	// For a combined plane change: the totals with all of it at one burn.
	allAtDeparture, allAtArrival float64
	notes                        []string
}

// computeTransfer calls the transfer package; it holds no physics.
func computeTransfer(s *transferSpec) (*transferResult, error) {
	mu := s.body.GM
	res := &transferResult{spec: s}
	from, to := s.from.ellipse, s.to.ellipse
	var plans []transfer.Plan
	var err error
	switch s.method {
	case "hohmann":
		var p transfer.Plan
		switch {
		case s.hasDI:
			p, err = transfer.HohmannPlaneChange(mu, from.Periapsis, to.Periapsis, s.di)
			if err == nil {
				var a, b transfer.Plan
				a, err = transfer.HohmannPlaneChangeSplit(mu, from.Periapsis, to.Periapsis, s.di, 0)
				if err == nil {
					b, err = transfer.HohmannPlaneChangeSplit(mu, from.Periapsis, to.Periapsis, 0, s.di)
				}
				res.allAtDeparture, res.allAtArrival = a.DVTotal, b.DVTotal
			}
		case s.from.circular && s.to.circular:
			p, err = transfer.Hohmann(mu, from.Periapsis, to.Periapsis)
		default:
			p, err = transfer.ApsisTransfer(mu, from, s.depart, to, s.arrive)
		}
		plans = append(plans, p)
	case "bielliptic":
		var p transfer.Plan
		p, err = transfer.BiElliptic(mu, from.Periapsis, to.Periapsis, s.rb)
		plans = append(plans, p)
	case "all":
		var cmp transfer.Comparison
		cmp, err = transfer.Compare(mu, from.Periapsis, to.Periapsis, s.rb)
		res.cmp = &cmp
		plans = append(plans, cmp.Hohmann, cmp.BiElliptic)
	case "plane":
		nu := 0.0
		if !s.from.circular && s.depart == transfer.Apoapsis {
			nu = math.Pi
		}
		var p transfer.Plan
		p, err = transfer.PlaneChange(mu, from, nu, s.di)
		plans = append(plans, p)
	case "phasing":
		var p transfer.Plan
		p, err = transfer.Phasing(mu, from.Periapsis, s.phase, s.revs, s.minRadius)
		plans = append(plans, p)
	}
	if err != nil {
		return nil, transferError(s, err)
	}
	for _, p := range plans {
		tc := transferCase{plan: p}
		if s.hasIsp {
			m0 := s.mass
			if s.hasDry {
				prop, err := transfer.PropellantFromDry(p.DVTotal, s.isp, s.dry)
				if err != nil {
					return nil, transferError(s, err)
				}
				m0 = s.dry + prop
			}
			steps, err := transfer.PropellantBudget(p.Burns, s.isp, m0)
			if err != nil {
				return nil, transferError(s, err)
			}
			tc.steps, tc.m0 = steps, m0
		}
		res.cases = append(res.cases, tc)
	}
	res.notes = transferNotes(res)
	return res, nil
}

// transferError turns a package error into the one-line input error.
func transferError(s *transferSpec, err error) error {
	re := s.body.EquatorialRadius
	var pe *transfer.PhasingError
	if errors.As(err, &pe) {
		other := s.phase*rad2deg - math.Copysign(360, s.phase)
		return inputErrorf(fmt.Sprintf("use more --phasing-revs, or phase the other way round (--phase %g)", other),
			"the phasing orbit would need a periapsis altitude of %s km, below the lowest allowed (%s km: --min-alt, default the surface of %s)",
			transferKm(pe.Periapsis-re), transferKm(pe.MinRadius-re), s.body.Name)
	}
	if errors.Is(err, transfer.ErrMassRatio) {
		return inputErrorf("check --isp and the delta-v: no rocket reaches it", "the mass ratio of this delta-v at --isp %g s is too large to represent", s.isp)
	}
	if errors.Is(err, transfer.ErrRange) {
		return inputErrorf("give orbits of a physical size", "the orbits are so large that the result is out of floating-point range")
	}
	msg := err.Error()
	msg = strings.TrimPrefix(msg, "transfer: ")
	return inputErrorf("check the orbits and the manoeuvre", "%s", msg)
}

// transferKm prints a length for messages and titles: at most 1 mm
// resolution, no trailing zeros.
func transferKm(x float64) string {
	s := strconv.FormatFloat(x, 'f', 6, 64)
	s = strings.TrimRight(s, "0")
	s = strings.TrimSuffix(s, ".")
	if s == "-0" {
		s = "0"
	}
	return s
}

// transferShow converts a radius to an altitude when alt is true.
func transferShow(r float64, alt bool, b *bodies.Body) float64 {
	if alt {
		return r - b.EquatorialRadius
	}
	return r
}

func transferNotes(res *transferResult) []string {
	s := res.spec
	var notes []string
	switch s.method {
	case "all":
		lo := math.Min(s.from.ellipse.Periapsis, s.to.ellipse.Periapsis)
		hi := math.Max(s.from.ellipse.Periapsis, s.to.ellipse.Periapsis)
		ratio := hi / lo
		switch {
		case ratio < transferCrossoverLow:
			notes = append(notes, fmt.Sprintf("The radius ratio %.6g is below 11.94: the Hohmann transfer is cheaper than every bi-elliptic one.", ratio))
		case ratio > transferCrossoverHigh:
			notes = append(notes, fmt.Sprintf("The radius ratio %.6g is above 15.58: a bi-elliptic transfer is cheaper for every intermediate radius above the larger orbit.", ratio))
		default:
			notes = append(notes, fmt.Sprintf("The radius ratio %.6g lies between 11.94 and 15.58: which transfer is cheaper depends on the intermediate radius.", ratio))
		}
		c := res.cmp
		h, b := c.Hohmann, c.BiElliptic
		cheaper := "Hohmann"
		if c.Cheaper == transfer.MethodBiElliptic {
			cheaper = "bi-elliptic"
		}
		notes = append(notes, fmt.Sprintf("With this intermediate apoapsis the %s transfer is cheaper by %.6f km/s; the bi-elliptic transfer takes %.3g times as long as the Hohmann one (%.6g h against %.6g h).",
			cheaper, c.Saving, b.TransferTime/h.TransferTime, b.TransferTime/3600, h.TransferTime/3600))
	case "hohmann":
		if s.hasDI {
			p := res.cases[0].plan
			notes = append(notes, fmt.Sprintf("The %.6g deg plane change is split %.6f deg at departure and %.6f deg at arrival, the split that minimises the total; all of it at departure would cost %.6f km/s in total, all of it at arrival %.6f km/s.",
				s.di*rad2deg, p.Burns[0].PlaneChange*rad2deg, p.Burns[1].PlaneChange*rad2deg, res.allAtDeparture, res.allAtArrival))
		}
	case "plane":
		n := "The burn must be at a node of the two planes (where the orbits cross)."
		if !s.from.circular && s.depart == transfer.Periapsis {
			n += " At apoapsis, where the orbit is slowest, the same plane change costs less."
		}
		notes = append(notes, n)
	case "phasing":
		p := res.cases[0].plan
		l := p.Legs[0]
		if s.phase > 0 {
			notes = append(notes, fmt.Sprintf("The target is %.6g deg ahead: the phasing orbit drops to a periapsis altitude of %s km and its shorter period gains the angle in %d revolution(s).", s.phase*rad2deg, transferKm(l.Periapsis-s.body.EquatorialRadius), s.revs))
		} else if s.phase < 0 {
			notes = append(notes, fmt.Sprintf("The target is %.6g deg behind: the phasing orbit rises to an apoapsis altitude of %s km and its longer period lets the target catch up in %d revolution(s).", -s.phase*rad2deg, transferKm(l.Apoapsis-s.body.EquatorialRadius), s.revs))
		}
	}
	return notes
}

func transferTitle(res *transferResult) string {
	s := res.spec
	desc := func(e transferEnd) string {
		re := s.body.EquatorialRadius
		if e.circular {
			return transferKm(e.ellipse.Periapsis-re) + " km circular"
		}
		return transferKm(e.ellipse.Periapsis-re) + " x " + transferKm(e.ellipse.Apoapsis-re) + " km"
	}
	var what string
	switch s.method {
	case "all":
		what = "Hohmann and bi-elliptic transfers compared"
	case "plane":
		what = "Plane change"
	case "phasing":
		what = "Phasing"
	default:
		what = transferMethodLabel(res.cases[0].plan.Method)
	}
	t := fmt.Sprintf("%s about %s: %s", what, s.body.Name, desc(s.from))
	if s.to.set {
		t += " -> " + desc(s.to)
	}
	return t
}

func transferMethodLabel(m string) string {
	switch m {
	case transfer.MethodHohmann:
		return "Hohmann transfer"
	case transfer.MethodBiElliptic:
		return "Bi-elliptic transfer"
	case transfer.MethodApsis:
		return "Apsis-to-apsis transfer"
	case transfer.MethodHohmannPlaneChange:
		return "Hohmann transfer with a plane change"
	case transfer.MethodPlaneChange:
		return "Plane change"
	case transfer.MethodPhasing:
		return "Phasing"
	}
	return m
}

// transferBurnRecords lays out the burns of one case.
func transferBurnRecords(s *transferSpec, tc transferCase) []reports.Record {
	re := s.body.EquatorialRadius
	rows := make([]reports.Record, 0, len(tc.plan.Burns))
	for i, b := range tc.plan.Burns {
		r := reports.Record{
			{Key: "burn", Value: i + 1},
			{Key: "label", Value: b.Label},
			reports.Num("altitude_km", "", b.Radius-re, 10),
			reports.Num("true_anomaly_deg", "", b.TrueAnomaly*rad2deg, 8),
			reports.Num("dv_km_s", "", b.DeltaV, 10),
			reports.Num("speed_change_km_s", "", b.SpeedChange, 10),
			reports.Num("cumulative_dv_km_s", "", b.Cumulative, 10),
			reports.Num("time_s", "", b.Time, 10),
			reports.Num("plane_change_deg", "", b.PlaneChange*rad2deg, 8),
		}
		if tc.steps != nil {
			st := tc.steps[i]
			r = append(r,
				reports.Num("propellant_kg", "", st.Propellant, 8),
				reports.Num("mass_after_kg", "", st.MassAfter, 8))
		}
		rows = append(rows, r)
	}
	return rows
}

func transferLegRecords(s *transferSpec, p transfer.Plan) []reports.Record {
	re := s.body.EquatorialRadius
	rows := make([]reports.Record, 0, len(p.Legs))
	for _, l := range p.Legs {
		rows = append(rows, reports.Record{
			{Key: "label", Value: l.Label},
			reports.Num("periapsis_alt_km", "", l.Periapsis-re, 10),
			reports.Num("apoapsis_alt_km", "", l.Apoapsis-re, 10),
			reports.Num("semi_major_axis_km", "", l.SemiMajorAxis, 10),
			reports.Num("eccentricity", "", l.Eccentricity, 10),
			reports.Num("period_s", "", l.Period, 10),
			reports.Num("duration_s", "", l.Duration, 10),
		})
	}
	return rows
}

// transferCaseRecord holds the contract's keys of one plan.
func transferCaseRecord(s *transferSpec, tc transferCase) reports.Record {
	p := tc.plan
	dv := func(i int) (float64, bool) {
		if i < len(p.Burns) {
			return p.Burns[i].DeltaV, true
		}
		return 0, false
	}
	d1, ok1 := dv(0)
	d2, ok2 := dv(1)
	d3, ok3 := dv(2)
	prop, hasProp := 0.0, tc.steps != nil
	if hasProp && len(tc.steps) > 0 {
		prop = tc.steps[len(tc.steps)-1].CumulativePropellant
	}
	return reports.Record{
		{Key: "method", Label: "method", Value: p.Method},
		reports.Opt("dv1_km_s", "first burn", d1, ok1, 10),
		reports.Opt("dv2_km_s", "second burn", d2, ok2, 10),
		reports.Opt("dv3_km_s", "third burn", d3, ok3, 10),
		reports.Num("dv_total_km_s", "total delta-v", p.DVTotal, 10),
		reports.Num("transfer_time_s", "time from first to last burn", p.TransferTime, 10),
		reports.Opt("propellant_kg", "propellant", prop, hasProp, 8),
	}
}

// transferRecords returns the summary record and the CSV rows (one per
// burn).
func transferRecords(res *transferResult) (reports.Record, []reports.Record) {
	s := res.spec
	re := s.body.EquatorialRadius
	rec := reports.Record{}
	if s.method == "all" {
		rec = append(rec, reports.Field{Key: "method", Label: "method", Value: "all"})
	} else {
		rec = append(rec, transferCaseRecord(s, res.cases[0])[:1]...)
	}
	rec = append(rec, reports.Field{Key: "body", Label: "central body", Value: s.body.Name})
	endFields := func(prefix, words string, e transferEnd) []reports.Field {
		return []reports.Field{
			reports.Num(prefix+"_periapsis_alt_km", words+" orbit periapsis altitude", e.ellipse.Periapsis-re, 10),
			reports.Num(prefix+"_apoapsis_alt_km", words+" orbit apoapsis altitude", e.ellipse.Apoapsis-re, 10),
		}
	}
	rec = append(rec, endFields("from", "initial", s.from)...)
	if !s.from.circular {
		rec = append(rec, reports.Field{Key: "depart", Label: "burn at", Value: s.depart.String()})
	}
	if s.to.set {
		rec = append(rec, endFields("to", "final", s.to)...)
		if !s.to.circular {
			rec = append(rec, reports.Field{Key: "arrive", Label: "arrive at", Value: s.arrive.String()})
		}
	}
	if s.hasRB {
		rec = append(rec,
			reports.Num("intermediate_alt_km", "intermediate apoapsis altitude", s.rb-re, 10),
			reports.Num("intermediate_radius_km", "intermediate apoapsis radius", s.rb, 10))
	}
	if s.hasDI {
		rec = append(rec, reports.Num("plane_change_deg", "plane change", s.di*rad2deg, 8))
	}
	switch s.method {
	case "hohmann":
		if s.hasDI {
			p := res.cases[0].plan
			rec = append(rec,
				reports.Num("plane_change_1_deg", "plane change at departure", p.Burns[0].PlaneChange*rad2deg, 8),
				reports.Num("plane_change_2_deg", "plane change at arrival", p.Burns[1].PlaneChange*rad2deg, 8),
				reports.Num("split", "fraction of the plane change at departure", p.Split, 10),
				reports.Num("dv_total_all_at_departure_km_s", "total with all the plane change at departure", res.allAtDeparture, 10),
				reports.Num("dv_total_all_at_arrival_km_s", "total with all the plane change at arrival", res.allAtArrival, 10))
		}
	case "phasing":
		l := res.cases[0].plan.Legs[0]
		rec = append(rec,
			reports.Num("phase_deg", "phase angle (target minus chaser)", s.phase*rad2deg, 8),
			reports.Field{Key: "phasing_revs", Label: "revolutions on the phasing orbit", Value: s.revs},
			reports.Num("phasing_periapsis_alt_km", "phasing orbit periapsis altitude", l.Periapsis-re, 10),
			reports.Num("phasing_apoapsis_alt_km", "phasing orbit apoapsis altitude", l.Apoapsis-re, 10),
			reports.Num("phasing_period_s", "phasing orbit period", l.Period, 10))
	}
	if s.hasIsp {
		rec = append(rec, reports.Num("isp_s", "specific impulse", s.isp, 8))
	}
	var rows []reports.Record
	if s.method == "all" {
		c := res.cmp
		lo := math.Min(s.from.ellipse.Periapsis, s.to.ellipse.Periapsis)
		hi := math.Max(s.from.ellipse.Periapsis, s.to.ellipse.Periapsis)
		rec = append(rec,
			reports.Num("radius_ratio", "radius ratio (larger over smaller)", hi/lo, 10),
			reports.Field{Key: "cheaper", Label: "cheaper method", Value: c.Cheaper},
			reports.Num("saving_km_s", "delta-v saved by the cheaper method", c.Saving, 10))
		var cases []reports.Record
		for _, tc := range res.cases {
			cr := transferCaseRecord(s, tc)
			prefix := strings.ReplaceAll(tc.plan.Method, "-", "_") + "_"
			for _, f := range cr[4:] {
				if f.Value == nil {
					continue
				}
				f.Key = prefix + f.Key
				f.Label = transferMethodLabel(tc.plan.Method) + ": " + f.Label
				rec = append(rec, f)
			}
			switch {
			case s.hasDry:
				rec = append(rec, reports.Num(prefix+"initial_mass_kg", transferMethodLabel(tc.plan.Method)+": mass before the first burn", tc.m0, 10))
			case s.hasMass:
				rec = append(rec, reports.Num(prefix+"final_mass_kg", transferMethodLabel(tc.plan.Method)+": mass after the last burn", tc.steps[len(tc.steps)-1].MassAfter, 10))
			}
			cr = append(cr,
				reports.Field{Key: "burns", Value: transferBurnRecords(s, tc)},
				reports.Field{Key: "legs", Value: transferLegRecords(s, tc.plan)})
			cases = append(cases, cr)
			rows = append(rows, transferCSVRows(s, tc)...)
		}
		if len(res.notes) > 0 {
			rec = append(rec, reports.Field{Key: "notes", Value: res.notes})
		}
		rec = append(rec, reports.Field{Key: "cases", Value: cases})
		return rec, rows
	}
	tc := res.cases[0]
	rec = append(rec, transferCaseRecord(s, tc)[1:]...)
	if tc.steps != nil {
		last := tc.steps[len(tc.steps)-1]
		rec = append(rec,
			reports.Num("initial_mass_kg", "mass before the first burn", tc.m0, 10),
			reports.Num("final_mass_kg", "mass after the last burn", last.MassAfter, 10))
	}
	rec = append(rec,
		reports.Field{Key: "burns", Value: transferBurnRecords(s, tc)},
		reports.Field{Key: "legs", Value: transferLegRecords(s, tc.plan)})
	if len(res.notes) > 0 {
		rec = append(rec, reports.Field{Key: "notes", Value: res.notes})
	}
	return rec, transferCSVRows(s, tc)
}

// transferCSVRows are the burns with the method in front.
func transferCSVRows(s *transferSpec, tc transferCase) []reports.Record {
	var rows []reports.Record
	for _, r := range transferBurnRecords(s, tc) {
		rows = append(rows, append(reports.Record{{Key: "method", Value: tc.plan.Method}}, r...))
	}
	return rows
}

func writeTransferTables(o *output, res *transferResult) error {
	s := res.spec
	if s.method == "all" {
		var cases []reports.Record
		for _, tc := range res.cases {
			cases = append(cases, transferCaseRecord(s, tc))
		}
		fmt.Fprintln(o.W)
		reports.WriteTitle(o.W, "Cases compared")
		if err := reports.WriteListTable(o.W, cases); err != nil {
			return err
		}
	}
	for _, tc := range res.cases {
		prefix := ""
		if s.method == "all" {
			prefix = transferMethodLabel(tc.plan.Method) + ": "
		}
		fmt.Fprintln(o.W)
		reports.WriteTitle(o.W, transferCap(prefix+"burns"))
		if err := reports.WriteListTable(o.W, transferBurnRecords(s, tc)); err != nil {
			return err
		}
		if len(tc.plan.Legs) > 0 {
			fmt.Fprintln(o.W)
			reports.WriteTitle(o.W, transferCap(prefix+"orbits flown between the burns"))
			if err := reports.WriteListTable(o.W, transferLegRecords(s, tc.plan)); err != nil {
				return err
			}
		}
	}
	if len(res.notes) > 0 {
		fmt.Fprintln(o.W)
		for _, n := range res.notes {
			fmt.Fprintf(o.W, "NOTE: %s\n", n)
		}
	}
	return nil
}

// transferCap capitalises the first letter of a heading.
func transferCap(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}
