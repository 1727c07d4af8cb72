package main

import (
	"errors"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"

	"github.com/urfave/cli/v2"

	"centra/bodies"
	"centra/bodies/geodesy"
	"centra/cmd/centra/internal/quantity"
	"centra/propagate/visibility"
)

// siteFlags are the ground-site flags of the commands that look from
// the ground.
func siteFlags() []cli.Flag {
	cat := "Ground sites"
	return []cli.Flag{
		&cli.StringSliceFlag{Name: "site", Usage: "ground site `[NAME=]LAT,LON[,ALT_M]`: geodetic latitude and longitude in degrees (WGS 84, east positive), height above the ellipsoid in metres (default 0); repeat for several sites", Category: cat},
		&cli.StringSliceFlag{Name: "min-elevation", Usage: "least elevation `ANGLE` of a pass, -5..90 deg (default 0); one for all sites or one per --site, in order", Category: cat},
		&cli.StringSliceFlag{Name: "mask", Usage: "terrain mask `FILE` (lines 'AZIMUTH_DEG ELEVATION_DEG', see the description); one for all sites or one per --site, in order", Category: cat},
		&cli.BoolFlag{Name: "refraction", Usage: "compare and report apparent elevations (Saemundsson's refraction formula, standard atmosphere)", Category: cat},
		&cli.StringFlag{Name: "dut1", Value: "0", Usage: "UT1-UTC in `SECONDS` at the epoch (IERS Bulletin A), |DUT1| <= 0.9", Category: cat},
	}
}

// Site height limits, m.
const (
	minSiteAltM = -1000.0
	maxSiteAltM = 100000.0
)

const siteFix = "give --site [NAME=]LAT,LON[,ALT_M] in degrees and metres, for example --site 47.412,8.917,612 or --site ashgrove=47.412,8.917,612"

// siteInfo is what the report says about a site.
type siteInfo struct {
	Name          string
	Named         bool    // the name was given (not the coordinates)
	Lat, Lon, Alt float64 // deg, deg, m
	MinElevation  float64 // deg
	Mask          string  // file, or ""
}

// parseSiteSpec reads one --site value.
func parseSiteSpec(text string) (name string, lat, lon, altM float64, err error) {
	name = strings.TrimSpace(text)
	coords := name
	if n, rest, ok := strings.Cut(text, "="); ok {
		name, coords = strings.TrimSpace(n), rest
		if name == "" {
			return "", 0, 0, 0, inputErrorf(siteFix, "--site %q has an empty name before '='", text)
		}
	}
	parts := strings.Split(coords, ",")
	if len(parts) < 2 || len(parts) > 3 {
		return "", 0, 0, 0, inputErrorf(siteFix, "--site %q is not LAT,LON[,ALT_M]", text)
	}
	var v [3]float64
	for i, p := range parts {
		x, perr := strconv.ParseFloat(strings.TrimSpace(p), 64)
		if perr != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return "", 0, 0, 0, inputErrorf(siteFix, "--site %q is not LAT,LON[,ALT_M]: %q is not a number", text, strings.TrimSpace(p))
		}
		v[i] = x
	}
	lat, lon, altM = v[0], v[1], v[2]
	switch {
	case lat < -90 || lat > 90:
		return "", 0, 0, 0, inputErrorf("give a geodetic latitude from -90 to 90 deg", "--site %q: latitude %g deg is beyond ±90 deg", text, lat)
	case lon < -360 || lon > 360:
		return "", 0, 0, 0, inputErrorf("give a longitude from -180 to 180 deg, east positive", "--site %q: longitude %g deg is outside ±360 deg", text, lon)
	case altM < minSiteAltM || altM > maxSiteAltM:
		return "", 0, 0, 0, inputErrorf(fmt.Sprintf("give the height above the WGS 84 ellipsoid in metres, from %g to %g", minSiteAltM, maxSiteAltM), "--site %q: height %g m is out of range", text, altM)
	}
	return name, lat, lon, altM, nil
}

// perSite spreads a repeatable flag over n sites: none, one for all, or
// one per site.
func perSite(c *cli.Context, flag string, n int) ([]string, error) {
	vals := c.StringSlice(flag)
	switch len(vals) {
	case 0:
		return make([]string, n), nil
	case 1:
		out := make([]string, n)
		for i := range out {
			out[i] = vals[0]
		}
		return out, nil
	case n:
		return vals, nil
	}
	return nil, inputErrorf(fmt.Sprintf("give one --%s for all sites or one per --site, in the same order", flag), "%d --%s values for %d sites", len(vals), flag, n)
}

// parseSites reads --site, --min-elevation, --mask and --refraction.
func parseSites(c *cli.Context, body *bodies.Body) ([]visibility.Site, []siteInfo, error) {
	texts := c.StringSlice("site")
	if len(texts) == 0 {
		return nil, nil, inputErrorf(siteFix, "%s needs a ground site", c.Command.Name)
	}
	if body.Name != "earth" {
		return nil, nil, inputErrorf("use --body earth: sites are geodetic on WGS 84 and need the Earth's rotation model", "ground sites on %s are not supported", body.Name)
	}
	minEls, err := perSite(c, "min-elevation", len(texts))
	if err != nil {
		return nil, nil, err
	}
	masks, err := perSite(c, "mask", len(texts))
	if err != nil {
		return nil, nil, err
	}
	loaded := map[string]*visibility.Mask{}
	seen := map[string]bool{}
	var sites []visibility.Site
	var infos []siteInfo
	for i, text := range texts {
		name, lat, lon, altM, err := parseSiteSpec(text)
		if err != nil {
			return nil, nil, err
		}
		if seen[name] {
			return nil, nil, inputErrorf("give each site its own name: --site NAME=LAT,LON[,ALT_M]", "two sites are named %q", name)
		}
		seen[name] = true
		minEl := 0.0
		if minEls[i] != "" {
			v, err := quantity.Parse(quantity.Angle, minEls[i])
			if err != nil {
				return nil, nil, flagError("min-elevation", err)
			}
			if v < visibility.MinThreshold-1e-12 || v > visibility.MaxThreshold+1e-12 {
				return nil, nil, inputErrorf("give a minimum elevation from -5 to 90 deg", "--min-elevation %s is outside -5..90 deg", minEls[i])
			}
			minEl = math.Max(visibility.MinThreshold, math.Min(v, visibility.MaxThreshold))
		}
		var mask *visibility.Mask
		if masks[i] != "" {
			if m, ok := loaded[masks[i]]; ok {
				mask = m
			} else if mask, err = readMask(masks[i]); err != nil {
				return nil, nil, err
			}
			loaded[masks[i]] = mask
		}
		s, err := visibility.NewSite(name, geodesy.Site{Lat: lat * math.Pi / 180, Lon: lon * math.Pi / 180, Alt: altM / 1000}, minEl, mask, c.Bool("refraction"))
		if err != nil {
			return nil, nil, inputErrorf(siteFix, "--site %q: %v", text, err)
		}
		sites = append(sites, s)
		infos = append(infos, siteInfo{Name: name, Named: strings.Contains(text, "="), Lat: lat, Lon: lon, Alt: altM, MinElevation: minEl * 180 / math.Pi, Mask: masks[i]})
	}
	return sites, infos, nil
}

const maskFix = "write one 'AZIMUTH_DEG ELEVATION_DEG' pair per line, azimuths increasing within 0..360, elevations within -5..90 ('#' starts a comment; see 'centra passes --help')"

// readMask reads a terrain mask file.
func readMask(path string) (*visibility.Mask, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, inputErrorf("check the path of the mask file", "--mask %q cannot be read: %v", path, unwrapPathError(err))
	}
	defer f.Close()
	m, err := visibility.ParseMask(f)
	if err != nil {
		var me *visibility.MaskError
		if errors.As(err, &me) {
			if me.Line > 0 {
				return nil, inputErrorf(maskFix, "--mask %q line %d %q: %s", path, me.Line, strings.TrimSpace(me.Text), me.Why)
			}
			return nil, inputErrorf(maskFix, "--mask %q: %s", path, me.Why)
		}
		return nil, inputErrorf(maskFix, "--mask %q: %v", path, err)
	}
	return m, nil
}

// parseFrequency reads --frequency (MHz by default; kHz, MHz, GHz) and
// returns it in Hz.
func parseFrequency(c *cli.Context) (hz float64, ok bool, err error) {
	v, ok, err := quantityFlag(c, "frequency", quantity.Frequency)
	if err != nil || !ok {
		return 0, ok, err
	}
	if !(v > 0) {
		return 0, true, inputErrorf("give the carrier frequency in MHz, for example --frequency 437.5 (or 2.2GHz)", "--frequency %s is not positive", c.String("frequency"))
	}
	return v * 1e6, true, nil
}
