package main

import (
	"fmt"
	"math"

	"github.com/urfave/cli/v2"

	"centra/bodies/atmosphere"
	"centra/cmd/centra/internal/quantity"
	"centra/reports"
)

func init() { register(65, atmosphereCommand) }

// maxLevels bounds an atmosphere table unless --force is given.
const maxLevels = 100000

func atmosphereCommand() *cli.Command {
	return &cli.Command{
		Name:  "atmosphere",
		Usage: "density, temperature and pressure of the Earth's atmosphere model at altitudes",
		UsageText: `centra atmosphere (--alt H [--alt H ...] | --from H --to H --step H) [--density-scale F]

examples:
  centra atmosphere --alt 0 --alt 11km --alt 400
  centra atmosphere --from 100 --to 1000 --step 100
  centra --format csv atmosphere --from 0 --to 86 --step 2 --out ussa.csv
  centra --format json atmosphere --alt 400 --density-scale 2
  centra atmosphere --alt 0 --expect density_kg_m3=1.225±0.001`,
		Description: `Prints the density model that drag uses: the U.S. Standard Atmosphere 1976
(NOAA-S/T 76-1562) from -5 to 86 km, with its temperature and pressure, and
above 86 km the exponential density table of Vallado, Fundamentals of
Astrodynamics and Applications, 4th ed., Table 8-4 (density only: temperature
and pressure are null there). Altitudes are geometric heights above sea level
(drag takes them above the WGS 84 ellipsoid). The model is static: real
densities above about 200 km vary tenfold with solar activity, which
--density-scale F represents (the density column is scaled, the temperature
and pressure are not; model_density_kg_m3 keeps the unscaled value).

JSON: {"density_scale": F, "levels": [{"altitude_km", "density_kg_m3",
"temperature_k", "pressure_pa", "model"}]}. --expect needs a single --alt.`,
		Flags: []cli.Flag{
			&cli.StringSliceFlag{Name: "alt", Usage: "altitude `H` (repeatable; units km, m)"},
			&cli.StringFlag{Name: "from", Usage: "first altitude `H` of a table"},
			&cli.StringFlag{Name: "to", Usage: "last altitude `H` of a table (included when on the step)"},
			&cli.StringFlag{Name: "step", Usage: "altitude step `H` of a table"},
			&cli.StringFlag{Name: "density-scale", Value: "1", Usage: "multiply the density by `F` (solar activity: about 0.5 at minimum, 2 or more at maximum)"},
			expectFlag(),
		},
		Action: atmosphereAction,
	}
}

func atmosphereAction(c *cli.Context) error {
	alts, err := parseAltitudes(c)
	if err != nil {
		return err
	}
	scale, err := parseDensityScale(c)
	if err != nil {
		return err
	}
	exps, err := parseExpectations(c)
	if err != nil {
		return err
	}
	if len(exps) > 0 && len(alts) != 1 {
		return inputErrorf("give a single --alt H with --expect", "--expect applies to one altitude, and %d are given", len(alts))
	}
	levels := make([]reports.Record, 0, len(alts))
	for _, h := range alts {
		cond, err := atmosphere.Properties(h)
		if err != nil {
			return inputErrorf(fmt.Sprintf("give altitudes of %g km or more", atmosphere.MinAltitudeKm), "altitude %g km is below the model's lowest altitude %g km", h, atmosphere.MinAltitudeKm)
		}
		lvl := reports.Record{
			reports.Num("altitude_km", "", h, 8),
			reports.Num("density_kg_m3", "", scale*cond.DensityKgM3, 6),
			reports.Opt("temperature_k", "", cond.TemperatureK, cond.HasTemperature, 6),
			reports.Opt("pressure_pa", "", cond.PressurePa, cond.HasPressure, 6),
		}
		if scale != 1 {
			lvl = append(lvl, reports.Num("model_density_kg_m3", "", cond.DensityKgM3, 6))
		}
		lvl = append(lvl, reports.Field{Key: "model", Value: cond.Model})
		levels = append(levels, lvl)
	}
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	err = writeAtmosphere(o, scale, levels, exps)
	return o.finish(err)
}

// parseAltitudes reads --alt or --from/--to/--step.
func parseAltitudes(c *cli.Context) ([]float64, error) {
	list := c.StringSlice("alt")
	table := c.IsSet("from") || c.IsSet("to") || c.IsSet("step")
	const fix = "give --alt H (repeatable) or --from H --to H --step H"
	switch {
	case len(list) > 0 && table:
		return nil, inputErrorf(fix, "--alt and --from/--to/--step both give the altitudes")
	case len(list) > 0:
		out := make([]float64, 0, len(list))
		for _, text := range list {
			h, err := quantity.Parse(quantity.Length, text)
			if err != nil {
				return nil, flagError("alt", err)
			}
			out = append(out, h)
		}
		return out, nil
	case !table:
		return nil, inputErrorf(fix, "no altitude given")
	}
	if !c.IsSet("from") || !c.IsSet("to") || !c.IsSet("step") {
		return nil, inputErrorf("give all three of --from H --to H --step H", "an altitude table needs --from, --to and --step")
	}
	from, _, err := quantityFlag(c, "from", quantity.Length)
	if err != nil {
		return nil, err
	}
	to, _, err := quantityFlag(c, "to", quantity.Length)
	if err != nil {
		return nil, err
	}
	step, _, err := quantityFlag(c, "step", quantity.Length)
	if err != nil {
		return nil, err
	}
	if !(step > 0) {
		return nil, inputErrorf("give a positive step such as 10km", "--step %s is not positive", c.String("step"))
	}
	if to < from {
		return nil, inputErrorf("swap --from and --to", "--to %g km is below --from %g km", to, from)
	}
	n := math.Floor((to-from)/step*(1+1e-12)) + 1
	if n > maxLevels && !c.Bool("force") {
		return nil, inputErrorf("lengthen --step or add --force", "--from %s --to %s --step %s gives %.3g altitudes", c.String("from"), c.String("to"), c.String("step"), n)
	}
	out := make([]float64, 0, int(n))
	for k := 0; k < int(n); k++ {
		out = append(out, from+float64(k)*step)
	}
	return out, nil
}

// writeAtmosphere renders the levels; expectations (one level only) are
// checked against the fields of that level.
func writeAtmosphere(o *output, scale float64, levels []reports.Record, exps []expectation) error {
	var rows []reports.Record
	failed := 0
	if len(exps) > 0 {
		var err error
		rows, failed, err = checkExpectations(exps, levels[0])
		if err != nil {
			return err
		}
	}
	rec := reports.Record{
		{Key: "body", Label: "body", Value: "earth"},
		reports.Num("density_scale", "density scale (solar activity)", scale, 6),
		{Key: "levels", Value: levels},
	}
	switch o.Format {
	case "json":
		if len(rows) > 0 {
			rec = append(rec, reports.Field{Key: "expectations", Value: rows})
		}
		if err := reports.WriteJSON(o.W, rec); err != nil {
			return err
		}
	case "csv":
		header := reports.CSVHeader(levels[0])
		header = append(header, "density_scale")
		withScale := make([]reports.Record, len(levels))
		for i, l := range levels {
			withScale[i] = append(append(reports.Record(nil), l...), reports.Num("density_scale", "", scale, 6))
		}
		if err := reports.WriteCSVList(o.W, header, withScale); err != nil {
			return err
		}
		if len(rows) > 0 {
			reports.WriteListTable(o.Stderr, rows)
		}
	default:
		title := "Earth atmosphere model: U.S. Standard Atmosphere 1976 to 86 km, exponential table (Vallado 4th ed., Table 8-4) above"
		if scale != 1 {
			title += fmt.Sprintf("; density x%s", trimFloat(scale, 6))
		}
		if err := reports.WriteTitle(o.W, title); err != nil {
			return err
		}
		if err := reports.WriteListTable(o.W, levels); err != nil {
			return err
		}
		fmt.Fprintf(o.W, "density scale %s; temperature and pressure \"-\" above 86 km, where the model gives density only\n", trimFloat(scale, 6))
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
