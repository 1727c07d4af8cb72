package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/propagate"
)

// modelFlags select the force model and integrator settings of every
// command that propagates.
func modelFlags() []cli.Flag {
	cat := "Force model"
	return append([]cli.Flag{
		&cli.StringFlag{Name: "model", Usage: "gravity `MODEL`: point, j2 or zonal (default j2, or point for a body without J2)", Category: cat},
		&cli.StringFlag{Name: "degree", Usage: "highest zonal degree `N` for --model zonal, 2..6 (default: the body's highest published, at most 6)", Category: cat},
		&cli.StringFlag{Name: "tolerance", Usage: "relative local error `TOL` of the integrator, 1e-15..1e-3", Value: "1e-10", Category: cat},
		&cli.StringFlag{Name: "equations", Usage: "`HOW` the equations of motion are evaluated: fast (closed-form accelerations, proven equal to the engine's), engine (Euler-Lagrange equations derived by the Lagrangian engine) or polar (engine in plane polar coordinates; point mass only)", Value: "fast", Category: cat},
	}, perturbationFlags()...)
}

// modelSpec is a parsed model: what to build and how to describe it.
type modelSpec struct {
	Model   propagate.Model
	Options propagate.Options
	Name    string // "point", "j2", "zonal"
	Degree  int
	Label   string    // for titles: "J2", "zonal degree 4"
	Forces  forceSpec // drag, third bodies, radiation pressure (forceflags.go)
}

// parseModel reads the model flags for body b; ep is the epoch of the
// initial state (t = 0 of the propagation).
func parseModel(c *cli.Context, b *bodies.Body, ep epoch) (*modelSpec, error) {
	name := strings.ToLower(strings.TrimSpace(c.String("model")))
	if name == "" {
		name = "point"
		if b.Jn(2) != 0 {
			name = "j2"
		}
	}
	ms := &modelSpec{Name: name}
	switch name {
	case "point":
		if c.IsSet("degree") {
			return nil, inputErrorf("use --model zonal --degree N", "--degree applies to --model zonal only")
		}
		ms.Model = propagate.PointMass(b.GM)
		ms.Label = "point mass"
	case "j2":
		if c.IsSet("degree") {
			return nil, inputErrorf("use --model zonal --degree N", "--degree applies to --model zonal only")
		}
		if b.Jn(2) == 0 {
			return nil, inputErrorf("use --model point, or give J2 in a bodies file", "%s has no J2 in the catalogue", b.Name)
		}
		ms.Model = propagate.J2(b.GM, b.EquatorialRadius, b.Jn(2))
		ms.Degree, ms.Label = 2, "point mass + J2"
	case "zonal":
		maxDeg := b.Degree()
		if maxDeg > 6 {
			maxDeg = 6
		}
		if maxDeg < 2 {
			return nil, inputErrorf("use --model point, or give zonal coefficients in a bodies file", "%s has no zonal coefficients in the catalogue", b.Name)
		}
		deg := maxDeg
		if c.IsSet("degree") {
			d, err := strconv.Atoi(strings.TrimSpace(c.String("degree")))
			if err != nil || d < 2 || d > 6 {
				return nil, inputErrorf("give a whole number from 2 to 6", "--degree %q is not a zonal degree", c.String("degree"))
			}
			if d > b.Degree() {
				return nil, inputErrorf(fmt.Sprintf("use --degree %d or less", b.Degree()), "%s has zonal coefficients only to degree %d", b.Name, b.Degree())
			}
			deg = d
		}
		j := make([]float64, deg+1)
		for n := 2; n <= deg; n++ {
			j[n] = b.Jn(n)
		}
		ms.Model = propagate.Zonal(b.GM, b.EquatorialRadius, j, deg)
		ms.Degree, ms.Label = deg, fmt.Sprintf("zonal J2..J%d", deg)
	default:
		return nil, inputErrorf("use --model point, j2 or zonal", "--model %q is not a force model", c.String("model"))
	}
	tol, err := strconv.ParseFloat(strings.TrimSpace(c.String("tolerance")), 64)
	if err != nil || !(tol >= 1e-15 && tol <= 1e-3) {
		return nil, inputErrorf("give a relative tolerance from 1e-15 to 1e-3, for example 1e-10", "--tolerance %q is not usable", c.String("tolerance"))
	}
	ms.Options.RelTol = tol
	switch strings.ToLower(c.String("equations")) {
	case "fast", "":
		ms.Options.Equations = propagate.FastPath
	case "engine":
		ms.Options.Equations = propagate.Engine
	case "polar":
		if ms.Name != "point" {
			return nil, inputErrorf("use --equations engine with zonal models", "--equations polar needs --model point (the plane of a point-mass orbit is fixed)")
		}
		ms.Options.Equations = propagate.EnginePolar
	default:
		return nil, inputErrorf("use --equations fast, engine or polar", "--equations %q is not known", c.String("equations"))
	}
	if err := parsePerturbations(c, b, ep, ms); err != nil {
		return nil, err
	}
	return ms, nil
}

// spanFlags are the span and step of tabulated output.
func spanFlags(defSpan, defStep string) []cli.Flag {
	return []cli.Flag{
		&cli.StringFlag{Name: "span", Value: defSpan, Usage: "how long to propagate, `DURATION` (negative: backwards in time)"},
		&cli.StringFlag{Name: "step", Value: defStep, Usage: "output step `DURATION`"},
	}
}

// maxRows bounds tabulated output unless --force is given.
const maxRows = 1e9

// parseSpanStep reads --span and --step: span nonzero and finite, step
// positive, at least 1 ms, and not more rows than maxRows without --force.
func parseSpanStep(c *cli.Context) (span, step float64, err error) {
	span, err = parseDurationFlag(c, "span")
	if err != nil {
		return 0, 0, err
	}
	step, err = parseDurationFlag(c, "step")
	if err != nil {
		return 0, 0, err
	}
	if span == 0 {
		return 0, 0, inputErrorf("give a nonzero span such as 1d or 90min", "--span is zero")
	}
	if math.Abs(span) > 200*365.25*86400 {
		return 0, 0, inputErrorf("give a span of at most 200 years", "--span %s is absurdly long", c.String("span"))
	}
	if step <= 0 {
		return 0, 0, inputErrorf("give a positive step such as 60s or 10min (a negative --span runs backwards)", "--step %s is not positive", c.String("step"))
	}
	if step < 1e-3 {
		return 0, 0, inputErrorf("give a step of 1 ms or more", "--step %s is below the 1 ms resolution of the output times", c.String("step"))
	}
	if rows := math.Abs(span)/step + 1; rows > maxRows && !c.Bool("force") {
		return 0, 0, inputErrorf("lengthen --step, shorten --span, or add --force", "--span %s at --step %s gives %.3g rows", c.String("span"), c.String("step"), rows)
	}
	return span, step, nil
}
