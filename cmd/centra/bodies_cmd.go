package main

import (
	"errors"
	"fmt"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/reports"
)

func init() { register(10, bodiesCommand) }

// catalogue returns the built-in bodies plus any from --bodies FILE.
func catalogue(c *cli.Context) (*bodies.Catalogue, error) {
	cat := bodies.NewCatalogue()
	path := lookupString(c, "bodies")
	if path == "" {
		return cat, nil
	}
	list, err := bodies.LoadFile(path)
	if err != nil {
		return nil, bodiesError("--bodies", err)
	}
	if err := cat.Merge(list...); err != nil {
		return nil, bodiesError("--bodies", err)
	}
	return cat, nil
}

// bodiesError turns a bodies error, which already says what and how to
// fix, into an input error.
func bodiesError(flag string, err error) error {
	msg := strings.TrimPrefix(err.Error(), "bodies: ")
	what, fix, ok := strings.Cut(msg, "; ")
	if !ok {
		fix = "see the README, 'Bodies file'"
	}
	if flag != "" {
		what = flag + ": " + what
	}
	return &inputError{What: what, Fix: fix}
}

func lookupBody(c *cli.Context, name string) (*bodies.Body, error) {
	cat, err := catalogue(c)
	if err != nil {
		return nil, err
	}
	b, err := cat.Lookup(name)
	if err != nil {
		var ue *bodies.UnknownBodyError
		if errors.As(err, &ue) {
			return nil, inputErrorf("use one of "+strings.Join(ue.Known, ", ")+", or define it with --bodies FILE", "unknown body %q", name)
		}
		return nil, bodiesError("", err)
	}
	return b, nil
}

func bodiesCommand() *cli.Command {
	return &cli.Command{
		Name:      "bodies",
		Usage:     "the catalogue of central bodies, or one body's constants with their sources",
		ArgsUsage: "[NAME]",
		UsageText: `centra bodies [NAME]

examples:
  centra bodies
  centra bodies earth
  centra --format json bodies mars
  centra --bodies my-bodies.toml bodies`,
		Action: func(c *cli.Context) error {
			cat, err := catalogue(c)
			if err != nil {
				return err
			}
			if c.NArg() == 0 {
				return bodiesList(c, cat)
			}
			b, err := lookupBody(c, c.Args().First())
			if err != nil {
				return err
			}
			o, err := openOutput(c)
			if err != nil {
				return err
			}
			rec := bodyRecord(b)
			if o.Format == "table" {
				err = o.emit("Body "+b.Name+": "+b.Description, rec)
				if err == nil {
					err = writeSources(o, b)
				}
			} else {
				err = o.emit("", rec)
			}
			return o.finish(err)
		},
	}
}

func bodyRecord(b *bodies.Body) reports.Record {
	rec := reports.Record{
		{Key: "name", Value: b.Name},
		{Key: "description", Value: b.Description},
		reports.Num("gm_km3_s2", "gravitational parameter GM", b.GM, 12),
		reports.Num("equatorial_radius_km", "equatorial radius", b.EquatorialRadius, 10),
		reports.Num("polar_radius_km", "polar radius", b.PolarRadius(), 10),
		reports.Opt("mean_radius_km", "mean radius", b.MeanRadius, b.MeanRadius > 0, 10),
		reports.Num("flattening", "flattening (a-b)/a", b.Flattening, 12),
		reports.Opt("j2", "zonal coefficient J2", b.Jn(2), b.Jn(2) != 0, 12),
	}
	for n := 3; n <= b.Degree(); n++ {
		rec = append(rec, reports.Num(fmt.Sprintf("j%d", n), fmt.Sprintf("zonal coefficient J%d", n), b.Jn(n), 12))
	}
	rec = append(rec,
		reports.Num("rotation_rate_rad_s", "rotation rate", b.RotationRate, 12),
		reports.Field{Key: "sources", Value: reports.Record{
			{Key: "gm", Value: string(b.GMSource)},
			{Key: "radius", Value: string(b.RadiusSource)},
			{Key: "flattening", Value: string(b.FlatteningSource)},
			{Key: "zonal", Value: string(b.JSource)},
			{Key: "rotation", Value: string(b.RotationSource)},
		}},
	)
	return rec
}

func writeSources(o *output, b *bodies.Body) error {
	fmt.Fprintln(o.W)
	reports.WriteTitle(o.W, "Sources")
	rows := []reports.Record{}
	for _, s := range []struct{ what, src string }{
		{"GM", string(b.GMSource)}, {"radius", string(b.RadiusSource)}, {"flattening", string(b.FlatteningSource)},
		{"zonal coefficients", string(b.JSource)}, {"rotation rate", string(b.RotationSource)},
	} {
		if s.src == "" {
			s.src = "-"
		}
		rows = append(rows, reports.Record{{Key: "constant", Value: s.what}, {Key: "source", Value: s.src}})
	}
	return reports.WriteListTable(o.W, rows)
}

func bodiesList(c *cli.Context, cat *bodies.Catalogue) error {
	o, err := openOutput(c)
	if err != nil {
		return err
	}
	var rows []reports.Record
	for _, name := range cat.Names() {
		b, _ := cat.Lookup(name)
		rows = append(rows, reports.Record{
			{Key: "name", Value: b.Name},
			reports.Num("gm_km3_s2", "", b.GM, 10),
			reports.Num("equatorial_radius_km", "", b.EquatorialRadius, 8),
			reports.Opt("j2", "", b.Jn(2), b.Jn(2) != 0, 6),
			reports.Num("rotation_rate_rad_s", "", b.RotationRate, 7),
			{Key: "description", Value: b.Description},
		})
	}
	switch o.Format {
	case "json":
		err = reports.WriteJSON(o.W, reports.Record{{Key: "bodies", Value: rows}})
	case "csv":
		err = reports.WriteCSVList(o.W, reports.CSVHeader(rows[0]), rows)
	default:
		reports.WriteTitle(o.W, "Central bodies (centra bodies NAME shows the sources)")
		err = reports.WriteListTable(o.W, rows)
	}
	return o.finish(err)
}
