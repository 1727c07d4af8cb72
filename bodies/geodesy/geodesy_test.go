package geodesy_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"centra/bodies/earthframe"
	"centra/bodies/geodesy"
	"centra/bodies/internal/frametest"
	"centra/bodies/timescale"
)

const deg = math.Pi / 180

func dist(a, b [3]float64) float64 {
	return math.Sqrt((a[0]-b[0])*(a[0]-b[0]) + (a[1]-b[1])*(a[1]-b[1]) + (a[2]-b[2])*(a[2]-b[2]))
}

func angDiff(a, b float64) float64 {
	d := math.Mod(a-b, 2*math.Pi)
	if d > math.Pi {
		d -= 2 * math.Pi
	} else if d <= -math.Pi {
		d += 2 * math.Pi
	}
	return d
}

// geodeticErr returns the distance (km) between two geodetic points at
// nearly the same place, measured along the meridian, the parallel and
// the normal.
func geodeticErr(lat1, lon1, h1, lat2, lon2, h2 float64) float64 {
	r := geodesy.WGS84A + math.Max(h1, 0)
	dn := angDiff(lat1, lat2) * r
	de := angDiff(lon1, lon2) * r * math.Cos(lat1)
	dh := h1 - h2
	return math.Sqrt(dn*dn + de*de + dh*dh)
}

// tolKm is the 0.1 mm accuracy required of the conversions.
const tolKm = 1e-7

// TestAgainstERFA: 204 points from 1 km below the ellipsoid to 400000 km,
// poles and equator included (testdata/frames/geodesy.csv): erfa.gd2gc
// (ERFA 2.0.0, WGS 84) gives the Cartesian position of the stored
// geodetic point; erfa.gc2gd converts it back (Fukushima's method).
func TestAgainstERFA(t *testing.T) {
	var worstTo, worstFrom, erfaWorst float64
	for _, r := range frametest.Read(t, "geodesy.csv") {
		lat, lon, h := r.F(t, "lat_deg")*deg, r.F(t, "lon_deg")*deg, r.F(t, "h_km")
		want := [3]float64{r.F(t, "x_km"), r.F(t, "y_km"), r.F(t, "z_km")}
		got := geodesy.WGS84.ToECEF(lat, lon, h)
		if d := dist(got, want); d > tolKm {
			t.Errorf("ToECEF(%g, %g, %g) = %v, erfa.gd2gc %v: %.3g mm apart", lat/deg, lon/deg, h, got, want, d*1e6)
		} else {
			worstTo = math.Max(worstTo, d)
		}
		glat, glon, gh := geodesy.WGS84.FromECEF(want)
		// Against the stored geodetic input (the truth for want, which
		// erfa.gd2gc computed in closed form): 0.1 mm.
		lonRef := lon
		if math.Abs(lat) == math.Pi/2 {
			lonRef = glon // longitude is undefined on the axis
		}
		if d := geodeticErr(glat, glon, gh, lat, lonRef, h); d > tolKm {
			t.Errorf("FromECEF(%v) = (%.12f, %.12f, %.10f), want (%.12f, %.12f, %.10f): %.3g mm apart",
				want, glat/deg, glon/deg, gh, lat/deg, lon/deg, h, d*1e6)
		} else {
			worstFrom = math.Max(worstFrom, d)
		}
		// Against erfa.gc2gd, whose single Halley step (Fukushima 2006)
		// loses accuracy far from the ellipsoid: its own error is its
		// distance from the input, measured from the stored columns alone.
		lat2, lon2, h2 := r.F(t, "lat2_deg")*deg, r.F(t, "lon2_deg")*deg, r.F(t, "h2_km")
		if math.Abs(lat) == math.Pi/2 {
			lon2 = glon
		}
		erfaOwn := geodeticErr(lat2, lon2, h2, lat, lonRef, h)
		if d := geodeticErr(glat, glon, gh, lat2, lon2, h2); d > tolKm+erfaOwn {
			t.Errorf("FromECEF(%v) = (%.12f, %.12f, %.10f), erfa.gc2gd (%.12f, %.12f, %.10f): %.3g mm apart",
				want, glat/deg, glon/deg, gh, lat2/deg, lon2/deg, h2, d*1e6)
		}
		erfaWorst = math.Max(erfaWorst, erfaOwn)
		// Geocentric latitude of the erfa position.
		if d := geodesy.WGS84.GeocentricLatitude(lat, h) - math.Atan2(want[2], math.Hypot(want[0], want[1])); math.Abs(d) > 1e-14 {
			t.Errorf("GeocentricLatitude(%g deg, %g km) off by %.3g rad from the erfa.gd2gc position", lat/deg, h, d)
		}
	}
	t.Logf("erfa.gc2gd's own largest error: %.3g mm", erfaWorst*1e6)
	t.Logf("largest differences: ToECEF %.3g mm, FromECEF %.3g mm", worstTo*1e6, worstFrom*1e6)
}

// TestVallado71Site: Vallado, Fundamentals of Astrodynamics and
// Applications, 4th ed., Example 7-1: the site at 39.007 deg N, 104.883
// deg W, 2187 m has r_ECEF = (-1275.1219, -4797.9890, 3994.2975) km (from
// memory; printed to 0.1 m, so +-0.05 m). Recomputed with erfa.gd2gc
// (examples.csv), which must also agree with the book.
func TestVallado71Site(t *testing.T) {
	book := [3]float64{-1275.1219, -4797.9890, 3994.2975} // Vallado 4th ed. Ex. 7-1, from memory
	ref := frametest.Values(t, "examples.csv")
	erfaXYZ := [3]float64{ref["vallado7_1_site_x_km"], ref["vallado7_1_site_y_km"], ref["vallado7_1_site_z_km"]}
	got := geodesy.Site{Lat: 39.007 * deg, Lon: -104.883 * deg, Alt: 2.187}.ECEF()
	const tolBook = 0.05e-3 + 1e-9 // km: half the last printed digit
	for i := range 3 {
		if d := math.Abs(got[i] - book[i]); d > tolBook {
			t.Errorf("site[%d] = %.7f km, Vallado Example 7-1 %.4f km", i, got[i], book[i])
		}
		if d := math.Abs(erfaXYZ[i] - book[i]); d > tolBook {
			t.Errorf("erfa.gd2gc[%d] = %.7f km disagrees with the remembered %.4f km", i, erfaXYZ[i], book[i])
		}
	}
	if d := dist(got, erfaXYZ); d > tolKm {
		t.Errorf("site %v, erfa.gd2gc %v", got, erfaXYZ)
	}
}

// TestRoundTripEverywhere: FromECEF inverts ToECEF to 1e-9 km at random
// points from the centre to 1e6 km, including the evolute region near the
// centre, the axis and the equatorial plane.
func TestRoundTripEverywhere(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	pts := [][3]float64{{0, 0, 0}, {0, 0, 1e-3}, {10, 0, 0}, {40, 1, 0}, {0, 0, -6356.752}, {6378.137, 0, 0},
		{1e6, 0, 0}, {0, 0, 1e6}, {3, 4, 2}, {30, 0, 0.5}}
	for range 5000 {
		u := [3]float64{rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()}
		n := math.Sqrt(u[0]*u[0] + u[1]*u[1] + u[2]*u[2])
		s := math.Pow(10, rng.Float64()*6)
		pts = append(pts, [3]float64{u[0] / n * s, u[1] / n * s, u[2] / n * s})
	}
	for _, p := range pts {
		lat, lon, h := geodesy.WGS84.FromECEF(p)
		if math.IsNaN(lat+lon+h) || lat < -math.Pi/2 || lat > math.Pi/2 {
			t.Fatalf("FromECEF(%v) = %g, %g, %g", p, lat, lon, h)
		}
		back := geodesy.WGS84.ToECEF(lat, lon, h)
		if d := dist(back, p); d > 1e-9*math.Max(1, math.Sqrt(p[0]*p[0]+p[1]*p[1]+p[2]*p[2])/1e4) {
			t.Errorf("ToECEF(FromECEF(%v)) = %v: %.3g km off", p, back, d)
		}
	}
	// The centre is b below the pole (closed form).
	if lat, _, h := geodesy.WGS84.FromECEF([3]float64{}); lat != math.Pi/2 || math.Abs(h+geodesy.WGS84.B) > 1e-9 {
		t.Errorf("FromECEF(0) = lat %g, h %g; want pi/2, -b", lat, h)
	}
}

// TestGeocentricLatitude: on the ellipsoid tan(psi) = (1-e^2) tan(phi)
// (closed form from the meridian ellipse: z/rho = (1-e^2) tan(phi) for a surface point), zero at the equator, pi/2 at
// the pole; e^2 = f(2-f) from the defining constants.
func TestGeocentricLatitude(t *testing.T) {
	f := 1 / geodesy.WGS84InvF
	e2 := f * (2 - f)
	for _, phi := range []float64{0, 10, 45, 60, 89.9} {
		want := math.Atan((1 - e2) * math.Tan(phi*deg))
		if got := geodesy.WGS84.GeocentricLatitude(phi*deg, 0); math.Abs(got-want) > 1e-15 {
			t.Errorf("GeocentricLatitude(%g deg) = %.17g, want %.17g", phi, got, want)
		}
	}
}

// TestENU: the up vector is the ellipsoid normal, the gradient of
// x^2/a^2 + y^2/a^2 + z^2/b^2, and the frame is right-handed orthonormal.
func TestENU(t *testing.T) {
	a, b := geodesy.WGS84.A, geodesy.WGS84.B
	for _, ll := range [][2]float64{{0, 0}, {39.007, -104.883}, {-60, 170}, {89, 45}} {
		m := geodesy.ENU(ll[0]*deg, ll[1]*deg)
		p := geodesy.WGS84.ToECEF(ll[0]*deg, ll[1]*deg, 0)
		g := [3]float64{p[0] / (a * a), p[1] / (a * a), p[2] / (b * b)}
		n := math.Sqrt(g[0]*g[0] + g[1]*g[1] + g[2]*g[2])
		for i := range 3 {
			if math.Abs(m[2][i]-g[i]/n) > 1e-15 {
				t.Errorf("ENU(%v) up = %v, normal %v", ll, m[2], g)
			}
		}
		e, nn, u := m[0], m[1], m[2]
		cross := [3]float64{e[1]*nn[2] - e[2]*nn[1], e[2]*nn[0] - e[0]*nn[2], e[0]*nn[1] - e[1]*nn[0]}
		if dist(cross, u) > 1e-15 {
			t.Errorf("ENU(%v): east x north = %v, up %v", ll, cross, u)
		}
	}
}

// TestLookERFA: azimuth and elevation against erfa.hd2ae (ERFA 2.0.0)
// for 60 random sites and targets (testdata/frames/topocentric.csv), both
// from the same geometry: the local vertical is the ellipsoid normal.
// hd2ae is a closed-form spherical rotation; tolerance 1e-11 rad (the
// rounding of a 42000 km vector is ~1e-12 relative).
func TestLookERFA(t *testing.T) {
	for _, r := range frametest.Read(t, "topocentric.csv") {
		st, err := geodesy.NewStation(geodesy.Site{Lat: r.F(t, "lat_deg") * deg, Lon: r.F(t, "lon_deg") * deg, Alt: r.F(t, "alt_km")})
		if err != nil {
			t.Fatal(err)
		}
		l := st.Look([3]float64{r.F(t, "tx_km"), r.F(t, "ty_km"), r.F(t, "tz_km")}, [3]float64{})
		if d := angDiff(l.Az, r.F(t, "az_deg")*deg); math.Abs(d) > 1e-11 || l.Az < 0 || l.Az >= 2*math.Pi {
			t.Errorf("site %v: Az = %.12f deg, erfa.hd2ae %.12f deg", st.Site, l.Az/deg, r.F(t, "az_deg"))
		}
		if d := l.El - r.F(t, "el_deg")*deg; math.Abs(d) > 1e-11 {
			t.Errorf("site %v: El = %.12f deg, erfa.hd2ae %.12f deg", st.Site, l.El/deg, r.F(t, "el_deg"))
		}
		if d := l.Range - r.F(t, "range_km"); math.Abs(d) > 1e-8 {
			t.Errorf("site %v: Range = %.9f km, want %.9f km", st.Site, l.Range, r.F(t, "range_km"))
		}
	}
}

// TestLookGeometry covers the textbook cases: straight overhead is
// elevation 90 deg, due north on the horizon is azimuth 0, due east 90 deg,
// and the range rate is the derivative of the range (central difference,
// error ~1e-10 km/s for these speeds).
func TestLookGeometry(t *testing.T) {
	s := geodesy.Site{Lat: 39.007 * deg, Lon: -104.883 * deg, Alt: 2.187}
	st, err := geodesy.NewStation(s)
	if err != nil {
		t.Fatal(err)
	}
	add := func(a [3]float64, k float64, b [3]float64) [3]float64 {
		return [3]float64{a[0] + k*b[0], a[1] + k*b[1], a[2] + k*b[2]}
	}
	tests := []struct {
		name   string
		dir    [3]float64
		az, el float64
	}{
		{"zenith", st.ENU[2], 0, 90},
		{"north", st.ENU[1], 0, 0},
		{"east", st.ENU[0], 90, 0},
		{"south", add([3]float64{}, -1, st.ENU[1]), 180, 0},
		{"west-up", add(add([3]float64{}, -1, st.ENU[0]), 1, st.ENU[2]), 270, 45},
	}
	for _, tt := range tests {
		l := st.Look(add(st.R, 1000, tt.dir), [3]float64{})
		if math.Abs(angDiff(l.Az, tt.az*deg)) > 1e-12 && tt.el != 90 || math.Abs(l.El-tt.el*deg) > 1e-12 {
			t.Errorf("%s: az %g el %g, want %g %g", tt.name, l.Az/deg, l.El/deg, tt.az, tt.el)
		}
	}
	r0 := [3]float64{-1000, -5500, 4200}
	v := [3]float64{5.1, -2.2, 3.3}
	const h = 1e-3 // s
	rp := st.Look(add(r0, h, v), v).Range
	rm := st.Look(add(r0, -h, v), v).Range
	if got, want := st.Look(r0, v).RangeRate, (rp-rm)/(2*h); math.Abs(got-want) > 1e-9 {
		t.Errorf("RangeRate = %.12f, numerical %.12f km/s", got, want)
	}
	if l := st.Look(st.R, v); l != (geodesy.Look{}) {
		t.Errorf("Look at the station itself = %+v, want zero", l)
	}
	// Inertial: the same as rotating first.
	e := timescale.MustParseUTC("2024-03-20T03:06:00Z")
	rot := earthframe.NewRotation(e, 0)
	ri, vi := rot.StateToGCRF(r0, v)
	if got, want := st.LookInertial(&rot, ri, vi), st.Look(r0, v); math.Abs(got.Az-want.Az) > 1e-12 ||
		math.Abs(got.El-want.El) > 1e-12 || math.Abs(got.Range-want.Range) > 1e-9 || math.Abs(got.RangeRate-want.RangeRate) > 1e-12 {
		t.Errorf("LookInertial = %+v, Look = %+v", got, want)
	}
}

func TestSiteValidate(t *testing.T) {
	tests := []struct {
		name  string
		s     geodesy.Site
		field string
	}{
		{"ok", geodesy.Site{Lat: 0.5, Lon: -2, Alt: 0.1}, ""},
		{"pole", geodesy.Site{Lat: math.Pi / 2, Lon: 0, Alt: 0}, ""},
		{"lat>90", geodesy.Site{Lat: 1.6, Lon: 0, Alt: 0}, "latitude"},
		{"lat NaN", geodesy.Site{Lat: math.NaN(), Lon: 0, Alt: 0}, "latitude"},
		{"lon Inf", geodesy.Site{Lat: 0, Lon: math.Inf(1), Alt: 0}, "longitude"},
		{"deep", geodesy.Site{Lat: 0, Lon: 0, Alt: -200}, "altitude"},
		{"alt NaN", geodesy.Site{Lat: 0, Lon: 0, Alt: math.NaN()}, "altitude"},
	}
	for _, tt := range tests {
		_, err := geodesy.NewStation(tt.s)
		var se *geodesy.SiteError
		switch {
		case tt.field == "" && err != nil:
			t.Errorf("%s: NewStation error %v", tt.name, err)
		case tt.field != "" && (!errors.Is(err, geodesy.ErrSite) || !errors.As(err, &se) || se.Field != tt.field):
			t.Errorf("%s: NewStation error %v, want a %s error", tt.name, err, tt.field)
		}
	}
}

var sink float64

func BenchmarkFromECEF(b *testing.B) {
	r := geodesy.WGS84.ToECEF(39.007*deg, -104.883*deg, 400)
	for b.Loop() {
		lat, _, h := geodesy.WGS84.FromECEF(r)
		sink += lat + h
	}
}

func BenchmarkToECEF(b *testing.B) {
	for b.Loop() {
		r := geodesy.WGS84.ToECEF(39.007*deg, -104.883*deg, 400)
		sink += r[0]
	}
}

func BenchmarkLook(b *testing.B) {
	st, _ := geodesy.NewStation(geodesy.Site{Lat: 39.007 * deg, Lon: -104.883 * deg, Alt: 2.187})
	r := [3]float64{-1000, -5500, 4200}
	v := [3]float64{5.1, -2.2, 3.3}
	for b.Loop() {
		sink += st.Look(r, v).El
	}
}
