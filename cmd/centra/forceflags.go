package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/bodies/atmosphere"
	"centra/cmd/centra/internal/quantity"
	"centra/propagate"
	"centra/propagate/forces"
)

// The perturbation flags of every command that propagates (added to
// modelFlags): drag, Sun and Moon, solar radiation pressure, and the
// spacecraft properties they need. The spacecraft properties (--mass,
// --area, --cd, --ballistic-coefficient, --cr, --srp-area) are accepted
// without the force that uses them, so that a mission's spacecraft table
// can be handed to every command; --density-scale is not a property and
// needs --drag (or a command that always has drag, such as lifetime).

// dragCommands always have drag (they build it themselves), so
// --density-scale needs no --drag there.
var dragCommands = map[string]bool{"lifetime": true}

// Default coefficients, shown in every label that uses them.
const (
	defaultCd = 2.2 // drag coefficient of a compact satellite in free-molecular flow (common practice, no source)
	defaultCr = 1.3 // radiation pressure coefficient of a satellite with solar panels (common practice, no source)
)

func perturbationFlags() []cli.Flag {
	cat := "Perturbations"
	return []cli.Flag{
		&cli.BoolFlag{Name: "drag", Usage: "add atmospheric drag (Earth: US Standard Atmosphere 1976 below 86 km, exponential table above; atmosphere co-rotating)", Category: cat},
		&cli.StringFlag{Name: "mass", Usage: "spacecraft mass `KG` (drag with --area, radiation pressure)", Category: cat},
		&cli.StringFlag{Name: "area", Usage: "drag reference area `M2` (also the radiation pressure area unless --srp-area)", Category: cat},
		&cli.StringFlag{Name: "cd", Usage: "drag coefficient `CD` (default 2.2)", Category: cat},
		&cli.StringFlag{Name: "ballistic-coefficient", Usage: "ballistic coefficient `B` = m/(Cd A) in kg/m2, instead of --mass/--area/--cd for drag", Category: cat},
		&cli.StringFlag{Name: "density-scale", Usage: "multiply the model density by `F` (solar activity: about 0.5 at solar minimum, 2 or more at maximum)", Value: "1", Category: cat},
		&cli.StringFlag{Name: "third-body", Usage: "add the attraction of `BODIES`: sun, moon or sun,moon (Earth-centred orbits)", Category: cat},
		&cli.BoolFlag{Name: "srp", Usage: "add solar radiation pressure (cannonball, conical Earth shadow); needs --mass and --srp-area or --area", Category: cat},
		&cli.StringFlag{Name: "cr", Usage: "radiation pressure coefficient `CR`, 1 to 2 (default 1.3)", Category: cat},
		&cli.StringFlag{Name: "srp-area", Usage: "area facing the Sun `M2` for --srp (default: --area)", Category: cat},
	}
}

// forceSpec is what the perturbation flags built.
type forceSpec struct {
	Drag         *forces.Drag
	Extra        propagate.Perturbation // third bodies and radiation pressure
	MassKg       float64                // 0 when not given
	AreaM2       float64                // 0 when not given
	Cd           float64                // 0 when --ballistic-coefficient was given
	DensityScale float64
	ThirdBodies  []string
	SRP          *forces.RadiationPressure
	Labels       []string // one per force, for titles
	GravityLabel string   // the model's label without the forces
}

// parsePerturbations reads the perturbation flags, builds the forces for
// body b with t = 0 at ep, and adds them to ms (Model.Perturbation, Label,
// Forces).
func parsePerturbations(c *cli.Context, b *bodies.Body, ep epoch, ms *modelSpec) error {
	fs := &ms.Forces
	fs.GravityLabel = ms.Label
	mass, okMass, err := quantityFlag(c, "mass", quantity.Mass)
	if err != nil {
		return err
	}
	if okMass {
		if err := requirePositive("mass", mass, "kg"); err != nil {
			return err
		}
		fs.MassKg = mass
	}
	area, okArea, err := quantityFlag(c, "area", quantity.Area)
	if err != nil {
		return err
	}
	if okArea {
		if err := requirePositive("area", area, "m2"); err != nil {
			return err
		}
		fs.AreaM2 = area
	}
	// The other properties are checked here when no force of this run
	// uses them (the force checks them otherwise), so that a bad value is
	// not ignored without a word.
	dragOn := c.Bool("drag") || dragCommands[c.Command.Name] || c.Command.Name == "ballistic"
	for _, p := range []struct {
		name, unit string
		kind       quantity.Kind
		used       bool
	}{{"cd", "", quantity.Scalar, dragOn}, {"ballistic-coefficient", "kg/m2", quantity.Scalar, dragOn}, {"cr", "", quantity.Scalar, c.Bool("srp")}, {"srp-area", "m2", quantity.Area, c.Bool("srp")}} {
		if p.used {
			continue
		}
		v, ok, err := quantityFlag(c, p.name, p.kind)
		if err != nil {
			return err
		}
		if ok {
			if err := requirePositive(p.name, v, p.unit); err != nil {
				return err
			}
		}
	}
	scale, err := parseDensityScale(c)
	if err != nil {
		return err
	}
	fs.DensityScale = scale
	if c.Bool("drag") {
		d, err := parseDrag(c, b, fs)
		if err != nil {
			return err
		}
		fs.Drag = d
	} else if c.IsSet("density-scale") && !dragCommands[c.Command.Name] {
		return inputErrorf("add --drag, or drop --density-scale", "--density-scale scales the density of drag, which is off")
	}
	var extra []propagate.Perturbation
	if c.IsSet("third-body") {
		names, tbs, err := parseThirdBodies(c, b, ep)
		if err != nil {
			return err
		}
		fs.ThirdBodies = names
		for _, tb := range tbs {
			extra = append(extra, tb.Perturbation())
		}
		fs.Labels = append(fs.Labels, thirdBodyLabel(names))
	}
	if c.Bool("srp") {
		p, label, err := parseSRP(c, b, ep, fs)
		if err != nil {
			return err
		}
		fs.SRP = p
		extra = append(extra, p.Perturbation())
		fs.Labels = append(fs.Labels, label)
	}
	fs.Extra = forces.Combine(extra...)
	var dragP propagate.Perturbation
	if fs.Drag != nil {
		dragP = fs.Drag.Perturbation()
	}
	ms.Model.Perturbation = forces.Combine(dragP, fs.Extra)
	if ms.Model.Perturbation != nil {
		if c.Bool("checks") {
			return inputErrorf("drop --checks, or drop --drag, --third-body and --srp",
				"--checks compares the propagation with conservation laws, which drag, third bodies and radiation pressure break")
		}
		if ms.Options.Equations == propagate.EnginePolar {
			return inputErrorf("use --equations fast or engine with perturbations", "--equations polar carries a point mass only")
		}
		ms.Label += " + " + strings.Join(fs.Labels, " + ")
	}
	return nil
}

// parseDensityScale reads --density-scale.
func parseDensityScale(c *cli.Context) (float64, error) {
	text := strings.TrimSpace(c.String("density-scale"))
	v, err := strconv.ParseFloat(strings.TrimPrefix(strings.ToLower(text), "x"), 64)
	if err != nil {
		return 0, inputErrorf("give a positive factor such as 0.5, 1 or 2", "--density-scale %q is not a number", c.String("density-scale"))
	}
	if err := atmosphere.DensityScale(v).Validate(); err != nil {
		return 0, inputErrorf(fmt.Sprintf("give a factor above 0 and at most %d (1 is the model as published)", atmosphere.MaxDensityScale), "--density-scale %s is not usable", text)
	}
	return v, nil
}

// parseDrag builds the drag force of body b from the spacecraft flags
// (fs carries mass, area and density scale already read).
func parseDrag(c *cli.Context, b *bodies.Body, fs *forceSpec) (*forces.Drag, error) {
	if b.Name != "earth" {
		return nil, inputErrorf("use --body earth, or drop --drag", "drag needs an atmosphere model, and centra has Earth's only (not %s)", b.Name)
	}
	var bc float64
	cd, okCd, err := quantityFlag(c, "cd", quantity.Scalar)
	if err != nil {
		return nil, err
	}
	if okCd && !(cd >= 0.5 && cd <= 5) {
		return nil, inputErrorf("give a drag coefficient from 0.5 to 5 (2.2 is usual for a compact satellite)", "--cd %g is not a drag coefficient", cd)
	}
	if c.IsSet("ballistic-coefficient") {
		v, _, err := quantityFlag(c, "ballistic-coefficient", quantity.Scalar)
		if err != nil {
			return nil, err
		}
		if okCd {
			return nil, inputErrorf("give --ballistic-coefficient alone, or --mass, --area and --cd", "--ballistic-coefficient and --cd both set the drag")
		}
		if !(v >= forces.MinBallistic && v <= forces.MaxBallistic) {
			return nil, inputErrorf(fmt.Sprintf("give B = m/(Cd A) from %g to %g kg/m2 (a 3U CubeSat has about 50)", float64(forces.MinBallistic), float64(forces.MaxBallistic)), "--ballistic-coefficient %g kg/m2 is not usable", v)
		}
		bc = v
	} else {
		if fs.MassKg == 0 || fs.AreaM2 == 0 {
			return nil, inputErrorf("give --mass KG and --area M2 (and --cd, default 2.2), or --ballistic-coefficient KG/M2", "drag needs the spacecraft's mass and area or its ballistic coefficient")
		}
		if !okCd {
			cd = defaultCd
		}
		fs.Cd = cd
		bc = forces.BallisticCoefficient(fs.MassKg, cd, fs.AreaM2)
		if !(bc >= forces.MinBallistic && bc <= forces.MaxBallistic) {
			return nil, inputErrorf("check --mass, --area and --cd", "the ballistic coefficient m/(Cd A) = %g kg/m2 is outside %g..%g kg/m2", bc, float64(forces.MinBallistic), float64(forces.MaxBallistic))
		}
	}
	d, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: bc, DensityScale: atmosphere.DensityScale(fs.DensityScale), RotationRate: b.RotationRate})
	if err != nil {
		return nil, inputErrorf("check the drag flags", "%v", err)
	}
	label := fmt.Sprintf("drag (B %s kg/m^2", trimFloat(bc, 4))
	if fs.DensityScale != 1 {
		label += ", density x" + trimFloat(fs.DensityScale, 4)
	}
	fs.Labels = append(fs.Labels, label+")")
	return d, nil
}

// parseThirdBodies reads --third-body: a comma-separated list of sun and
// moon, for an Earth-centred orbit.
func parseThirdBodies(c *cli.Context, b *bodies.Body, ep epoch) ([]string, []*forces.ThirdBody, error) {
	text := strings.ToLower(strings.TrimSpace(c.String("third-body")))
	if b.Name != "earth" {
		return nil, nil, inputErrorf("use --body earth, or drop --third-body", "the Sun and Moon positions are geocentric: --third-body needs an Earth-centred orbit (not %s)", b.Name)
	}
	var names []string
	var tbs []*forces.ThirdBody
	seen := map[string]bool{}
	for _, part := range strings.Split(text, ",") {
		name := strings.TrimSpace(part)
		if name == "" {
			continue
		}
		if seen[name] {
			return nil, nil, inputErrorf("name each body once", "--third-body lists %s twice", name)
		}
		seen[name] = true
		var eph *forces.Ephemeris
		switch name {
		case "sun":
			eph = forces.NewSunEphemeris(ep)
		case "moon":
			eph = forces.NewMoonEphemeris(ep)
		default:
			return nil, nil, inputErrorf("use --third-body sun, moon or sun,moon", "--third-body %q: %q is not a body centra has positions for", c.String("third-body"), name)
		}
		tb, err := lookupBody(c, name)
		if err != nil {
			return nil, nil, err
		}
		t := &forces.ThirdBody{Name: name, GM: tb.GM, Position: eph.Position}
		if err := t.Validate(); err != nil {
			return nil, nil, inputErrorf("check the bodies file", "%v", err)
		}
		names = append(names, name)
		tbs = append(tbs, t)
	}
	if len(names) == 0 {
		return nil, nil, inputErrorf("use --third-body sun, moon or sun,moon", "--third-body %q names no body", c.String("third-body"))
	}
	return names, tbs, nil
}

// parseSRP builds the radiation pressure force.
func parseSRP(c *cli.Context, b *bodies.Body, ep epoch, fs *forceSpec) (*forces.RadiationPressure, string, error) {
	if b.Name != "earth" {
		return nil, "", inputErrorf("use --body earth, or drop --srp", "the Sun's position is geocentric: --srp needs an Earth-centred orbit (not %s)", b.Name)
	}
	cr, okCr, err := quantityFlag(c, "cr", quantity.Scalar)
	if err != nil {
		return nil, "", err
	}
	if !okCr {
		cr = defaultCr
	}
	if !(cr >= 1 && cr <= 2) {
		return nil, "", inputErrorf("give a radiation pressure coefficient from 1 (absorbing) to 2 (mirror)", "--cr %g is not usable", cr)
	}
	area, okArea, err := quantityFlag(c, "srp-area", quantity.Area)
	if err != nil {
		return nil, "", err
	}
	if okArea {
		if err := requirePositive("srp-area", area, "m2"); err != nil {
			return nil, "", err
		}
	} else {
		area = fs.AreaM2
	}
	if fs.MassKg == 0 || area == 0 {
		return nil, "", inputErrorf("give --mass KG and --srp-area M2 (or --area M2)", "radiation pressure needs the spacecraft's mass and the area facing the Sun")
	}
	p, err := forces.NewRadiationPressure(forces.RadiationPressureConfig{Cr: cr, AreaM2: area, MassKg: fs.MassKg,
		Sun: forces.NewSunEphemeris(ep).Position, ShadowRadius: b.EquatorialRadius})
	if err != nil {
		return nil, "", inputErrorf("check --mass, --srp-area and --cr", "%v", err)
	}
	return p, fmt.Sprintf("SRP (Cr %s, A/m %s m^2/kg)", trimFloat(cr, 4), trimFloat(p.AreaToMass(), 4)), nil
}

// trimFloat formats x with at most sig significant digits, no trailing
// zeros.
func trimFloat(x float64, sig int) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	return strconv.FormatFloat(x, 'g', sig, 64)
}

// thirdBodyLabel names the third bodies for titles: "Sun + Moon".
func thirdBodyLabel(names []string) string {
	out := make([]string, len(names))
	for i, n := range names {
		out[i] = strings.ToUpper(n[:1]) + n[1:]
	}
	return strings.Join(out, " + ")
}
