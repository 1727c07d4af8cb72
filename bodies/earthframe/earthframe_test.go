package earthframe_test

import (
	"math"
	"testing"

	"centra/bodies/earthframe"
	"centra/bodies/internal/frametest"
	"centra/bodies/timescale"
)

const (
	mas = earthframe.ArcsecToRad / 1000
	deg = math.Pi / 180
)

// angDiff returns a-b wrapped to (-pi, pi].
func angDiff(a, b float64) float64 {
	d := math.Mod(a-b, 2*math.Pi)
	if d > math.Pi {
		d -= 2 * math.Pi
	} else if d <= -math.Pi {
		d += 2 * math.Pi
	}
	return d
}

// rotAngle returns the angle of the rotation a*b^T (a and b nearly
// equal), from its antisymmetric part; accurate for small angles.
func rotAngle(a, b earthframe.Mat) float64 {
	m := earthframe.MatMul(a, earthframe.Transpose(b))
	x := (m[1][2] - m[2][1]) / 2
	y := (m[2][0] - m[0][2]) / 2
	z := (m[0][1] - m[1][0]) / 2
	return math.Asin(math.Min(1, math.Sqrt(x*x+y*y+z*z)))
}

type erfaRow struct {
	utc                  string
	e                    timescale.Epoch
	dut1                 float64
	era, gmst, gast, eo  float64
	dpsi, deps           float64
	m                    earthframe.Mat
	tt1, tt2, ut11, ut12 float64
}

func readERFA(t *testing.T) []erfaRow {
	t.Helper()
	var out []erfaRow
	for _, r := range frametest.Read(t, "earth_rotation.csv") {
		e, err := timescale.ParseUTC(r["utc"])
		if err != nil {
			t.Fatal(err)
		}
		x := erfaRow{utc: r["utc"], e: e, dut1: r.F(t, "dut1_s"),
			era: r.F(t, "era"), gmst: r.F(t, "gmst06"), gast: r.F(t, "gst06a"), eo: r.F(t, "eo06a"),
			dpsi: r.F(t, "dpsi00b"), deps: r.F(t, "deps00b")}
		for i := range 3 {
			for j := range 3 {
				x.m[i][j] = r.F(t, "m"+string(rune('1'+i))+string(rune('1'+j)))
			}
		}
		x.tt1, x.tt2 = e.JDTT()
		x.ut11, x.ut12 = e.JDUT1(x.dut1)
		out = append(out, x)
	}
	return out
}

// TestAgainstERFA compares with ERFA 2.0.0 (pyerfa 2.0.0.1) at 60 epochs
// 1980-2060 (testdata/frames/earth_rotation.csv):
//   - ERA vs erfa.era00 and GMST vs erfa.gmst06: the same formulas, so
//     only rounding separates them: 1e-12 rad;
//   - nutation vs erfa.nut00b: the same IAU 2000B series: 1e-14 rad;
//   - GAST vs erfa.gst06a, EO vs erfa.eo06a, and the GCRF->ITRF matrix vs
//     erfa.c2t06a (xp = yp = 0): these use IAU 2000A nutation, which IAU
//     2000B follows to 1 mas in the pole (X, Y) over 1995-2050 (McCarthy
//     & Luzum 2003): tolerance 1 mas for the matrix, whose CIO-based
//     rotation about the pole does not involve the equinox; for GAST and
//     EO the pole error maps into dpsi cos(eps) as 1 mas / tan(eps) =
//     2.3 mas, tolerance 2.5 mas. The requirement is 0.1 arcsec.
func TestAgainstERFA(t *testing.T) {
	const (
		tolSame  = 1e-12 // rad
		tolNut   = 1e-14 // rad
		tolModel = 1 * mas
		tolEqx   = 2.5 * mas
	)
	var worst float64
	for _, x := range readERFA(t) {
		if d := angDiff(earthframe.ERA(x.ut11, x.ut12), x.era); math.Abs(d) > tolSame {
			t.Errorf("%s: ERA off by %.3g rad from erfa.era00", x.utc, d)
		}
		if d := angDiff(earthframe.GMST(x.ut11, x.ut12, x.tt1, x.tt2), x.gmst); math.Abs(d) > tolSame {
			t.Errorf("%s: GMST off by %.3g rad from erfa.gmst06", x.utc, d)
		}
		dp, de := earthframe.Nutation(x.tt1, x.tt2)
		if math.Abs(dp-x.dpsi) > tolNut || math.Abs(de-x.deps) > tolNut {
			t.Errorf("%s: nutation (%.15g, %.15g), erfa.nut00b (%.15g, %.15g)", x.utc, dp, de, x.dpsi, x.deps)
		}
		if d := angDiff(earthframe.GAST(x.ut11, x.ut12, x.tt1, x.tt2), x.gast); math.Abs(d) > tolEqx {
			t.Errorf("%s: GAST off by %.3g mas from erfa.gst06a", x.utc, d/mas)
		}
		if d := angDiff(earthframe.EquationOfOrigins(x.tt1, x.tt2), x.eo); math.Abs(d) > tolEqx {
			t.Errorf("%s: EO off by %.3g mas from erfa.eo06a", x.utc, d/mas)
		}
		rot := earthframe.NewRotation(x.e, x.dut1)
		a := rotAngle(rot.M, x.m)
		worst = math.Max(worst, a)
		if a > tolModel {
			t.Errorf("%s: GCRF->ITRF differs from erfa.c2t06a by %.3g mas", x.utc, a/mas)
		}
	}
	t.Logf("largest difference from erfa.c2t06a: %.3f mas", worst/mas)
}

// TestERAAtJ2000: by IERS Conventions 2010 eq. 5.15, ERA at JD(UT1)
// 2451545.0 is 2pi * 0.7790572732640 rad = 280.46061837504 deg.
func TestERAAtJ2000(t *testing.T) {
	want := 2 * math.Pi * 0.7790572732640
	if got := earthframe.ERA(2451545.0, 0); math.Abs(got-want) > 1e-15 {
		t.Errorf("ERA(J2000) = %.17g, want %.17g", got, want)
	}
	// One sidereal rotation later the ERA is back (eq. 5.15 again).
	if got := earthframe.ERA(2451545.0, 1/1.00273781191135448); math.Abs(angDiff(got, want)) > 1e-12 {
		t.Errorf("ERA one rotation after J2000 = %.17g, want %.17g", got, want)
	}
}

// TestGMSTVallado: Vallado, Fundamentals of Astrodynamics and
// Applications, 4th ed., Example 3-5: 1992 August 20, 12:14 UT1,
// GMST = 152.578787810 deg (from memory; IAU 1982 model). Recomputed here
// with erfa.gmst82 (stored, examples.csv), which must reproduce it to the
// printed digits; this package's IAU 2006 GMST is compared with
// erfa.gmst06 (1e-12 rad) and with the book to the IAU 1982 - IAU 2006
// model difference at that date (0.035 arcsec per the two stored ERFA
// values; tolerance 0.05 arcsec).
func TestGMSTVallado(t *testing.T) {
	const valladoDeg = 152.578787810 // Vallado 4th ed. Example 3-5, from memory
	ref := frametest.Values(t, "examples.csv")
	if d := math.Abs(ref["vallado3_5_gmst82_deg"] - valladoDeg); d > 1e-7 {
		t.Errorf("erfa.gmst82 = %.9f deg, Vallado %.9f deg: memory value is off by %.2g deg",
			ref["vallado3_5_gmst82_deg"], valladoDeg, d)
	}
	// UT1 1992-08-20 12:14:00 as a two-part JD; TT = UT1 + 59.184 s
	// (TAI-UTC 27 s, IERS Bulletin C; DUT1 taken as 0).
	ut1a, ut1b := 2448854.5, (12*60+14)/1440.0
	got := earthframe.GMST(ut1a, ut1b, ut1a, ut1b+59.184/86400) / deg
	if d := math.Abs(got - ref["vallado3_5_gmst06_deg"]); d*deg > 1e-12 {
		t.Errorf("GMST = %.10f deg, erfa.gmst06 %.10f deg", got, ref["vallado3_5_gmst06_deg"])
	}
	if d := math.Abs(got - valladoDeg); d*3600 > 0.05 {
		t.Errorf("GMST = %.9f deg, Vallado Example 3-5 %.9f deg: %.3g arcsec apart", got, valladoDeg, d*3600)
	}
}

// TestVelocity checks omega x r against a numerical derivative of the
// rotation matrix (central difference over +-1 s, truncation error
// ~1e-14 km/s), and against the closed form for a point fixed on the
// Earth (inertial speed omega * distance from the axis).
func TestVelocity(t *testing.T) {
	e := timescale.MustParseUTC("2024-03-20T03:06:00Z")
	const dut1 = 0.0
	rot := earthframe.NewRotation(e, dut1)
	r := earthframe.Vec{6524.834, 6862.875, 6448.296} // km; an arbitrary state, not a reference value
	v := earthframe.Vec{4.901327, 5.533756, -1.976341}
	rf, vf := rot.StateToITRF(r, v)

	rp := earthframe.NewRotation(e.Add(1), dut1)
	rm := earthframe.NewRotation(e.Add(-1), dut1)
	var num earthframe.Vec
	for i := range 3 {
		num[i] = rot.M[i][0]*v[0] + rot.M[i][1]*v[1] + rot.M[i][2]*v[2]
		for j := range 3 {
			num[i] += (rp.M[i][j] - rm.M[i][j]) / 2 * r[j]
		}
	}
	// Neglected precession rate: 50.3 arcsec/yr = 7.7e-12 rad/s, times
	// |r| = 11300 km: 9e-8 km/s.
	const tolV = 1e-7 // km/s
	for i := range 3 {
		if d := math.Abs(vf[i] - num[i]); d > tolV {
			t.Errorf("v_ITRF[%d] = %.12f, numerical %.12f km/s", i, vf[i], num[i])
		}
	}
	r2, v2 := rot.StateToGCRF(rf, vf)
	for i := range 3 {
		if math.Abs(r2[i]-r[i]) > 1e-11 || math.Abs(v2[i]-v[i]) > 1e-14 {
			t.Errorf("round trip: r %v v %v, want %v %v", r2, v2, r, v)
		}
	}
	// A site fixed on the Earth moves at omega * rho inertially.
	site := earthframe.Vec{4000, 3000, 3500}
	_, vi := rot.StateToGCRF(site, earthframe.Vec{})
	want := earthframe.OmegaEarth * 5000
	if got := math.Sqrt(vi[0]*vi[0] + vi[1]*vi[1] + vi[2]*vi[2]); math.Abs(got-want) > 1e-14 {
		t.Errorf("fixed site speed %.15g km/s, want omega*rho = %.15g", got, want)
	}
}

// TestPrecessionSanity checks orthonormality and a textbook number: the
// general precession in longitude is 5028.796 arcsec per Julian century
// at J2000 (IERS Conventions 2010, eq. 5.39, p_A linear term), which is
// the rate of the equinox of date along the ecliptic.
func TestPrecessionSanity(t *testing.T) {
	for _, tt := range []float64{-0.2, 0, 0.3, 0.6} {
		m := earthframe.BPN(2451545.0, tt*36525)
		p := earthframe.MatMul(m, earthframe.Transpose(m))
		for i := range 3 {
			for j := range 3 {
				want := 0.0
				if i == j {
					want = 1
				}
				if math.Abs(p[i][j]-want) > 1e-15 {
					t.Errorf("BPN(t=%g) not orthonormal: %v", tt, p)
				}
			}
		}
	}
	// Longitude of the J2000 ecliptic pole direction stays; the equinox of
	// date moves by p_A: project the GCRF x axis into the ecliptic of date.
	lonOfX := func(tcent float64) float64 {
		m := earthframe.EclipticOfDate(2451545.0, tcent*36525)
		return math.Atan2(m[1][0], m[0][0])
	}
	rate := (lonOfX(0.01) - lonOfX(-0.01)) / 0.02 / earthframe.ArcsecToRad
	if math.Abs(rate-5028.796) > 0.1 {
		t.Errorf("precession in longitude %.3f arcsec/cy, want 5028.796 (IERS 2010 eq. 5.39)", rate)
	}
}

func BenchmarkNewRotation(b *testing.B) {
	e := timescale.MustParseUTC("2024-03-20T03:06:00Z")
	var s float64
	for b.Loop() {
		r := earthframe.NewRotation(e, 0.1)
		s += r.M[0][0]
	}
	_ = s
}

func BenchmarkStateToITRF(b *testing.B) {
	rot := earthframe.NewRotation(timescale.MustParseUTC("2024-03-20T03:06:00Z"), 0)
	r := earthframe.Vec{6524.834, 6862.875, 6448.296}
	v := earthframe.Vec{4.901327, 5.533756, -1.976341}
	var s float64
	for b.Loop() {
		p, w := rot.StateToITRF(r, v)
		s += p[0] + w[0]
	}
	_ = s
}
