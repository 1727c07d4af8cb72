package track_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"centra/bodies/earthframe"
	"centra/bodies/geodesy"
	"centra/bodies/sunmoon"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/track"
	"centra/propagate/visibility"
)

const (
	earthMu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, 3rd ed., Table 3.1)
	earthRe = 6378.137    // km, WGS 84 semi-major axis (same table)
	deg     = math.Pi / 180
)

func norm(a [3]float64) float64 { return math.Sqrt(a[0]*a[0] + a[1]*a[1] + a[2]*a[2]) }

// TestPerifocalCurtis checks the frame against Curtis, Orbital Mechanics
// for Engineering Students, Example 4.7 (values from memory, edition not
// checked): h = 80000 km^2/s, e = 1.4, i = 30 deg, RAAN = 40 deg,
// argp = 60 deg, theta = 30 deg, mu = 398600 km^3/s^2 give the perifocal
// position (6285.0, 3628.6, 0) km and the geocentric position
// (-4040, 4815, 3629) km. The perifocal position is recomputed here in
// closed form, r = (h^2/mu)/(1 + e cos theta) (cos theta, sin theta), and
// the geocentric one by orbit.StateFromElements (independent code).
func TestPerifocalCurtis(t *testing.T) {
	const mu, h, e = 398600.0, 80000.0, 1.4
	el := orbit.Elements{P: h * h / mu, E: e, I: 30 * deg, RAAN: 40 * deg, ArgP: 60 * deg, Nu: 30 * deg}
	r := el.P / (1 + e*math.Cos(el.Nu))
	xWant, yWant := r*math.Cos(el.Nu), r*math.Sin(el.Nu)
	const tolBook = 0.1 // km: Curtis prints 0.1 km in the perifocal frame
	if math.Abs(xWant-6285.0) > tolBook || math.Abs(yWant-3628.6) > tolBook {
		t.Fatalf("closed form (%.2f, %.2f) km disagrees with Curtis Example 4.7 (6285.0, 3628.6) km", xWant, yWant)
	}
	st, err := orbit.StateFromElements(mu, el)
	if err != nil {
		t.Fatal(err)
	}
	f := track.PerifocalOf(el)
	x, y, z := f.Project(st.R)
	const tolKm = 1e-6
	if math.Abs(x-xWant) > tolKm || math.Abs(y-yWant) > tolKm || math.Abs(z) > tolKm {
		t.Errorf("Project(r) = (%.9f, %.9f, %.9f) km, want (%.9f, %.9f, 0)", x, y, z, xWant, yWant)
	}
	// Back to the geocentric frame: x P + y Q against the book, which
	// prints whole km.
	want := [3]float64{-4040, 4815, 3629}
	for i := range 3 {
		g := xWant*f.P[i] + yWant*f.Q[i]
		if math.Abs(g-want[i]) > 0.5 {
			t.Errorf("geocentric r[%d] = %.3f km, want %.0f km (Curtis Example 4.7)", i, g, want[i])
		}
	}
}

// TestPerifocalProjects checks, at random elements of every conic, that
// the frame is orthonormal and right-handed and that the state of
// orbit.StateFromElements projects to r (cos nu, sin nu, 0) with
// r = p/(1 + e cos nu) (the conic equation, Kepler's first law), and its
// velocity to sqrt(mu/p) (-sin nu, e + cos nu, 0).
func TestPerifocalProjects(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for k := range 2000 {
		e := []float64{0, 1e-3, 0.3, 0.95, 1, 1.7}[k%6]
		el := orbit.Elements{P: 7000 + 30000*rng.Float64(), E: e, I: math.Pi * rng.Float64(),
			RAAN: 2 * math.Pi * rng.Float64(), ArgP: 2 * math.Pi * rng.Float64(), Nu: (2*rng.Float64() - 1) * 2.0}
		if k%50 == 0 {
			el.I = 0
		}
		if k%51 == 0 {
			el.I = math.Pi
		}
		f := track.PerifocalOf(el)
		c := [3]float64{f.P[1]*f.Q[2] - f.P[2]*f.Q[1], f.P[2]*f.Q[0] - f.P[0]*f.Q[2], f.P[0]*f.Q[1] - f.P[1]*f.Q[0]}
		for i := range 3 {
			if math.Abs(c[i]-f.W[i]) > 1e-14 {
				t.Fatalf("P x Q = %v, W = %v", c, f.W)
			}
		}
		if d := f.P[0]*f.Q[0] + f.P[1]*f.Q[1] + f.P[2]*f.Q[2]; math.Abs(d) > 1e-15 || math.Abs(norm(f.P)-1) > 1e-15 {
			t.Fatalf("P.Q = %g, |P| = %v", d, norm(f.P))
		}
		st, err := orbit.StateFromElements(earthMu, el)
		if err != nil {
			t.Fatal(err)
		}
		// Canonicalise as orbit.ElementsFromState does, so that the
		// circular and equatorial conventions are the ones tested.
		el2, err := orbit.ElementsFromState(earthMu, st)
		if err != nil {
			t.Fatal(err)
		}
		f = track.PerifocalOf(el2)
		r := el2.P / (1 + el2.E*math.Cos(el2.Nu))
		x, y, z := f.Project(st.R)
		tol := 1e-9 * r
		if math.Abs(x-r*math.Cos(el2.Nu)) > tol || math.Abs(y-r*math.Sin(el2.Nu)) > tol || math.Abs(z) > tol {
			t.Fatalf("elements %+v: Project(r) = (%g, %g, %g), want r (cos nu, sin nu, 0) with r = %g km", el2, x, y, z, r)
		}
		vs := math.Sqrt(earthMu / el2.P)
		vx, vy, vz := f.Project(st.V)
		if math.Abs(vx+vs*math.Sin(el2.Nu)) > 1e-9*vs || math.Abs(vy-vs*(el2.E+math.Cos(el2.Nu))) > 1e-9*vs || math.Abs(vz) > 1e-9*vs {
			t.Fatalf("elements %+v: Project(v) = (%g, %g, %g)", el2, vx, vy, vz)
		}
	}
}

// TestCentralAngle checks lambda = acos(Re cos el/(Re+h)) - el against
// the triangle centre-site-satellite solved another way: put the site at
// (Re, 0) and the satellite at (Re+h)(cos lambda, sin lambda) and measure
// the elevation of the line of sight above the site's horizontal.
func TestCentralAngle(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 2))
	for range 1000 {
		h := 150 + 40000*rng.Float64()
		el := 89 * deg * rng.Float64()
		lambda, err := track.CentralAngle(earthRe, h, el)
		if err != nil {
			t.Fatal(err)
		}
		sx, sy := (earthRe+h)*math.Cos(lambda), (earthRe+h)*math.Sin(lambda)
		got := math.Atan2(sx-earthRe, sy) // up component over horizontal component
		if math.Abs(got-el) > 1e-12 {
			t.Fatalf("CentralAngle(%g km, %g deg) = %g deg: the satellite is seen at %.12f deg", h, el/deg, lambda/deg, got/deg)
		}
	}
	// The horizon of a geostationary satellite: about 81.3 deg of central
	// angle (common practice, no source; from memory), recomputed from the
	// right triangle cos(lambda) = Re/(Re+h) with h = 35786 km.
	lambda, err := track.CentralAngle(earthRe, 35786, 0)
	if err != nil {
		t.Fatal(err)
	}
	if want := math.Acos(earthRe / (earthRe + 35786)); math.Abs(lambda-want) > 1e-15 || math.Abs(lambda/deg-81.3) > 0.05 {
		t.Errorf("GEO horizon central angle %.6f deg, want %.6f deg (about 81.3)", lambda/deg, want/deg)
	}
	if l, _ := track.CentralAngle(earthRe, 500, math.Pi/2); l != 0 {
		t.Errorf("central angle at the zenith = %g, want 0", l)
	}
	for _, bad := range [][3]float64{{earthRe, 0, 0}, {earthRe, -5, 0}, {0, 500, 0}, {earthRe, 500, -0.2}, {earthRe, 500, 2}, {earthRe, math.NaN(), 0}} {
		if _, err := track.CentralAngle(bad[0], bad[1], bad[2]); !errors.Is(err, track.ErrGeometry) {
			t.Errorf("CentralAngle(%v) error %v, want ErrGeometry", bad, err)
		}
	}
}

// haversine is the great-circle angle between two points (another
// formula than the one under test).
func haversine(lat1, lon1, lat2, lon2 float64) float64 {
	s1, s2 := math.Sin((lat2-lat1)/2), math.Sin((lon2-lon1)/2)
	return 2 * math.Asin(math.Sqrt(s1*s1+math.Cos(lat1)*math.Cos(lat2)*s2*s2))
}

func TestVisibilityCircle(t *testing.T) {
	cases := []struct {
		name             string
		lat, lon, lambda float64
		aroundPole       bool
	}{
		{"mid-latitude", 47.4 * deg, 8.9 * deg, 20 * deg, false},
		{"date line", -10 * deg, 178 * deg, 15 * deg, false},
		{"north pole inside", 80 * deg, 30 * deg, 20 * deg, true},
		{"south pole inside", -77.8 * deg, 166.7 * deg, 14.7 * deg, true},
		{"at the pole", 90 * deg, 0, 10 * deg, true},
		{"geostationary horizon", 0, -75 * deg, 81.3 * deg, false},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			ring, err := track.VisibilityCircle(c.lat, c.lon, c.lambda, 360)
			if err != nil {
				t.Fatal(err)
			}
			if len(ring) != 361 || ring[0] != ring[360] {
				t.Fatalf("ring of %d points, first %v last %v", len(ring), ring[0], ring[len(ring)-1])
			}
			turn := 0.0
			for i, q := range ring {
				if !(q.Lon > -math.Pi && q.Lon <= math.Pi) {
					t.Fatalf("point %d longitude %g rad outside (-pi, pi]", i, q.Lon)
				}
				if d := haversine(c.lat, c.lon, q.Lat, q.Lon); math.Abs(d-c.lambda) > 1e-9 {
					t.Fatalf("point %d (%g, %g) deg is %.12f deg from the centre, want %g", i, q.Lat/deg, q.Lon/deg, d/deg, c.lambda/deg)
				}
				if i > 0 {
					turn += math.Remainder(q.Lon-ring[i-1].Lon, 2*math.Pi)
				}
			}
			if around := math.Abs(turn) > math.Pi; around != c.aroundPole {
				t.Errorf("ring turns %g deg in longitude; around a pole = %v, want %v", turn/deg, around, c.aroundPole)
			}
		})
	}
	// A circle of 20 deg about 80 deg N reaches 60 deg N on its own
	// meridian and, over the pole, 80 deg N on the opposite one (plain
	// spherical geometry: 10 deg to the pole and 10 deg beyond).
	ring, _ := track.VisibilityCircle(80*deg, 30*deg, 20*deg, 4)
	if math.Abs(ring[0].Lat-80*deg) > 1e-12 || math.Abs(ring[0].Lon-(-150*deg)) > 1e-12 {
		t.Errorf("due north of (80N, 30E) by 20 deg: %v deg, want (80, -150)", [2]float64{ring[0].Lat / deg, ring[0].Lon / deg})
	}
	if math.Abs(ring[2].Lat-60*deg) > 1e-12 || math.Abs(ring[2].Lon-30*deg) > 1e-12 {
		t.Errorf("due south: %v deg, want (60, 30)", [2]float64{ring[2].Lat / deg, ring[2].Lon / deg})
	}
	if _, err := track.VisibilityCircle(2, 0, 0.1, 10); !errors.Is(err, track.ErrGeometry) {
		t.Errorf("latitude 2 rad: error %v, want ErrGeometry", err)
	}
}

func newProp(t testing.TB, m propagate.Model) *propagate.Propagator {
	t.Helper()
	p, err := propagate.New(m, propagate.Options{RelTol: 1e-12})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestPropagateApsides samples one period of a point-mass ellipse and
// checks the samples and the located apoapsis against Kepler: the
// apoapsis comes half a period after periapsis at radius a(1+e).
func TestPropagateApsides(t *testing.T) {
	a, e := 12000.0, 0.3
	el := orbit.Elements{P: a * (1 - e*e), E: e, I: 40 * deg, RAAN: 1, ArgP: 2, Nu: 0}
	s0, err := orbit.StateFromElements(earthMu, el)
	if err != nil {
		t.Fatal(err)
	}
	period := 2 * math.Pi * math.Sqrt(a*a*a/earthMu)
	tr, err := track.Propagate(newProp(t, propagate.PointMass(earthMu)), s0, period, period/360)
	if err != nil {
		t.Fatal(err)
	}
	if len(tr.T) != 361 || math.Abs(tr.T[360]-period) > 1e-6 {
		t.Fatalf("%d samples ending at %v s, want 361 ending at %v s", len(tr.T), tr.T[len(tr.T)-1], period)
	}
	var apo *track.Apsis
	for i := range tr.Apsides {
		if !tr.Apsides[i].Periapsis {
			apo = &tr.Apsides[i]
		}
	}
	if apo == nil {
		t.Fatalf("no apoapsis located among %v", tr.Apsides)
	}
	if math.Abs(apo.T-period/2) > 1e-5 || math.Abs(norm(apo.State.R)-a*(1+e)) > 1e-6 {
		t.Errorf("apoapsis at t = %.9f s, r = %.9f km; want %.9f s, %.9f km", apo.T, norm(apo.State.R), period/2, a*(1+e))
	}
	pts, aps := tr.InPlane(track.PerifocalOf(el))
	if x := pts[180].X; math.Abs(x+a*(1+e)) > 1e-6 {
		t.Errorf("sample at half a period at x = %.9f km in the plane, want -a(1+e) = %.9f", x, -a*(1+e))
	}
	if len(aps) != len(tr.Apsides) {
		t.Errorf("%d plane apsides for %d apsides", len(aps), len(tr.Apsides))
	}
	samples, sa := tr.Profile(earthRe)
	if got := samples[180].Alt; math.Abs(got-(a*(1+e)-earthRe)) > 1e-6 {
		t.Errorf("altitude at apoapsis %.9f km, want %.9f", got, a*(1+e)-earthRe)
	}
	// vis-viva at apoapsis: v^2 = mu (2/r - 1/a)
	for _, x := range sa {
		r := x.Alt + earthRe
		if want := math.Sqrt(earthMu * (2/r - 1/a)); math.Abs(x.Speed-want) > 1e-9 {
			t.Errorf("speed at the apsis at t = %g s: %.12f km/s, vis-viva %.12f", x.T, x.Speed, want)
		}
	}
	if _, err := track.Propagate(newProp(t, propagate.PointMass(earthMu)), s0, 1e9, 1); !errors.Is(err, track.ErrSamples) {
		t.Errorf("1e9 samples: error %v, want ErrSamples", err)
	}
}

// TestDefaultSpan: one period for an ellipse; for a hyperbola, the state
// propagated over the span by orbit.Propagate (universal variables,
// independent code) lies at the target radius max(4 r_p, 2 r).
func TestDefaultSpan(t *testing.T) {
	a, e := 8000.0, 0.1
	span, err := track.DefaultSpan(earthMu, orbit.Elements{P: a * (1 - e*e), E: e})
	if want := 2 * math.Pi * math.Sqrt(a*a*a/earthMu); err != nil || math.Abs(span-want) > 1e-9*want {
		t.Errorf("ellipse span %v s (%v), want the period %v s", span, err, want)
	}
	for _, c := range []struct{ e, nu float64 }{{1.5, -60 * deg}, {1.5, 0}, {1, -90 * deg}, {3, 50 * deg}} {
		el := orbit.Elements{P: 10000, E: c.e, Nu: c.nu}
		span, err := track.DefaultSpan(earthMu, el)
		if err != nil {
			t.Fatal(err)
		}
		s0, _ := orbit.StateFromElements(earthMu, el)
		s1, err := orbit.Propagate(earthMu, s0, span)
		if err != nil {
			t.Fatal(err)
		}
		rp := el.P / (1 + c.e)
		want := math.Max(4*rp, 2*norm(s0.R))
		if got := norm(s1.R); math.Abs(got-want) > 1e-6*want {
			t.Errorf("e = %g, nu = %g deg: r after the span %.6f km, want %.6f", c.e, c.nu/deg, got, want)
		}
		if s1.R[0]*s1.V[0]+s1.R[1]*s1.V[1]+s1.R[2]*s1.V[2] <= 0 {
			t.Errorf("e = %g, nu = %g deg: the span ends inbound", c.e, c.nu/deg)
		}
	}
}

// TestGround places states above known points and checks the ground
// point, the visibility and the light against geometry set up with
// earthframe.NewRotation (not the interpolated frame Ground uses) and
// sunmoon.Sun.
func TestGround(t *testing.T) {
	ep := timescale.MustParseUTC("2027-04-12T09:30:00Z")
	site := geodesy.Site{Lat: 47.412 * deg, Lon: 8.917 * deg, Alt: 0.612}
	above := func(tt, lat, lon, h float64) orbit.State {
		rot := earthframe.NewRotation(ep.Add(tt), 0)
		r, _ := rot.StateToGCRF(geodesy.WGS84.ToECEF(lat, lon, h), [3]float64{})
		return orbit.State{R: r, V: [3]float64{0, 0, 1e-3}}
	}
	sun := sunmoon.Sun(ep.Add(600))
	us := [3]float64{sun[0] / norm(sun), sun[1] / norm(sun), sun[2] / norm(sun)}
	tr := &track.Trajectory{
		T: []float64{0, 300, 600, 900},
		States: []orbit.State{
			above(0, site.Lat, site.Lon, 500),                            // at the zenith of the site
			above(300, -30*deg, 170*deg, 800),                            // far away
			{R: [3]float64{-7000 * us[0], -7000 * us[1], -7000 * us[2]}}, // behind the Earth
			{R: [3]float64{7000 * us[0], 7000 * us[1], 7000 * us[2]}},    // towards the Sun
		},
	}
	vs, err := visibility.NewSite("A", site, 10*deg, nil, false)
	if err != nil {
		t.Fatal(err)
	}
	g, err := track.Ground(tr, ep, 0, earthRe, []visibility.Site{vs})
	if err != nil {
		t.Fatal(err)
	}
	p := g.Points[0]
	const tolRad = 1e-9 // the hourly interpolated frame agrees with NewRotation to about 1e-9 rad
	if math.Abs(p.Lat-site.Lat) > tolRad || math.Abs(p.Lon-site.Lon) > tolRad || math.Abs(p.Alt-500) > 1e-5 {
		t.Errorf("point above the site at (%.9f, %.9f) deg, %.6f km; want (%.9f, %.9f), 500", p.Lat/deg, p.Lon/deg, p.Alt, site.Lat/deg, site.Lon/deg)
	}
	if q := g.Points[1]; math.Abs(q.Lat+30*deg) > tolRad || math.Abs(q.Lon-170*deg) > tolRad {
		t.Errorf("second point at (%g, %g) deg, want (-30, 170)", q.Lat/deg, q.Lon/deg)
	}
	if want := []bool{true, false}; g.InView[0][0] != want[0] || g.InView[0][1] != want[1] {
		t.Errorf("in view %v, want %v", g.InView[0][:2], want)
	}
	if !g.Points[3].Sunlit || g.Points[2].Sunlit {
		t.Errorf("sunlit towards the Sun %v (want true), behind the Earth %v (want false)", g.Points[3].Sunlit, g.Points[2].Sunlit)
	}
	if _, err := track.Ground(tr, ep, 2, earthRe, nil); err == nil {
		t.Error("DUT1 = 2 s accepted")
	}
	vs.MinElevation = 2
	if _, err := track.Ground(tr, ep, 0, earthRe, []visibility.Site{vs}); !errors.Is(err, track.ErrGeometry) {
		t.Errorf("minimum elevation 2 rad: error %v, want ErrGeometry", err)
	}
}

// TestSky checks that each pass's path starts and ends at the minimum
// elevation (where visibility.Find put AOS and LOS) and stays above it.
func TestSky(t *testing.T) {
	ep := timescale.MustParseUTC("2027-04-12T09:30:00Z")
	a := earthRe + 530
	el := orbit.Elements{P: a, E: 0, I: 97.5 * deg, RAAN: 0.3}
	s0, _ := orbit.StateFromElements(earthMu, el)
	site, err := visibility.NewSite("A", geodesy.Site{Lat: 47.4 * deg, Lon: 8.9 * deg, Alt: 0.6}, 10*deg, nil, false)
	if err != nil {
		t.Fatal(err)
	}
	passes, err := track.Sky(newProp(t, propagate.J2(earthMu, earthRe, 1.08262668e-3)), s0, ep, 0, 86400, 10, earthRe, site)
	if err != nil {
		t.Fatal(err)
	}
	if len(passes) < 2 {
		t.Fatalf("%d passes in a day over 47 deg N from a 530 km polar orbit, want several", len(passes))
	}
	for i, ps := range passes {
		first, last := ps.Path[0], ps.Path[len(ps.Path)-1]
		if first.T != ps.AOS || last.T != ps.LOS {
			t.Errorf("pass %d: path from %v to %v s, pass from %v to %v s", i, first.T, last.T, ps.AOS, ps.LOS)
		}
		if !ps.PartialStart && math.Abs(first.El-10*deg) > 1e-6 || !ps.PartialEnd && math.Abs(last.El-10*deg) > 1e-6 {
			t.Errorf("pass %d: elevation %.7f deg at AOS and %.7f deg at LOS, want 10", i, first.El/deg, last.El/deg)
		}
		for _, q := range ps.Path {
			if q.El < 10*deg-1e-6 || q.El > ps.MaxElevation()+1e-9 || !(q.Az >= 0 && q.Az < 2*math.Pi) {
				t.Fatalf("pass %d: point %+v outside the pass (max el %g deg)", i, q, ps.MaxElevation()/deg)
			}
		}
	}
	if _, err := track.Sky(newProp(t, propagate.PointMass(earthMu)), s0, ep, 0, -100, 10, earthRe, site); !errors.Is(err, track.ErrSamples) {
		t.Errorf("negative span: error %v, want ErrSamples", err)
	}
}
