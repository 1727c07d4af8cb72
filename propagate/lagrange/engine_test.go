package lagrange

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/num/hyperdual"

	"centra/orbit"
	"centra/propagate/integrate"
)

// relErr returns |got-want| / max(|want|, floor).
func relErr(got, want, floor float64) float64 {
	return math.Abs(got-want) / math.Max(math.Abs(want), floor)
}

// TestPointMassPolarEquations compares the engine's accelerations with the
// hand-derived Euler-Lagrange equations of L = (rdot^2 + r^2 thetadot^2)/2
// + mu/r (kinematics of polar coordinates, closed form):
//
//	rddot = r thetadot^2 - mu/r^2,  thetaddot = -2 rdot thetadot / r.
func TestPointMassPolarEquations(t *testing.T) {
	const mu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	const tol = 4e-15      // relative to the largest term of each equation
	l, err := PointMassPolar(mu)
	if err != nil {
		t.Fatal(err)
	}
	sys, _ := New(2, l, nil)
	rng := rand.New(rand.NewPCG(1, 1))
	var got [2]float64
	for range 10000 {
		r := 6400 + 60000*rng.Float64()
		th := 2 * math.Pi * rng.Float64()
		rd := 10 * (rng.Float64() - 0.5)
		thd := 2e-3 * (rng.Float64() - 0.5)
		if err := sys.Accelerations(got[:], 0, []float64{r, th}, []float64{rd, thd}); err != nil {
			t.Fatal(err)
		}
		wr := r*thd*thd - mu/(r*r)
		wt := -2 * rd * thd / r
		sr := math.Max(r*thd*thd, mu/(r*r))
		if math.Abs(got[0]-wr) > tol*sr || math.Abs(got[1]-wt) > tol*math.Abs(wt)+1e-300 {
			t.Fatalf("q = (%g, %g), qdot = (%g, %g): qddot = %v, want (%g, %g)", r, th, rd, thd, got, wr, wt)
		}
	}
	// Jacobi integral and momenta of the same Lagrangian: E = v^2/2 - mu/r,
	// p = (rdot, r^2 thetadot).
	q, qd := []float64{7000, 1}, []float64{0.3, 1e-3}
	wantE := (0.3*0.3+7000*7000*1e-6)/2 - mu/7000
	if e := sys.Energy(0, q, qd); relErr(e, wantE, 0) > 1e-15 {
		t.Errorf("Energy = %.17g, want %.17g", e, wantE)
	}
	var p [2]float64
	sys.Momenta(p[:], 0, q, qd)
	if relErr(p[0], 0.3, 0) > 1e-15 || relErr(p[1], 7000*7000*1e-3, 0) > 1e-15 {
		t.Errorf("Momenta = %v, want (0.3, 49000)", p)
	}
	if lv := sys.Lagrangian(0, q, qd); relErr(lv, (0.3*0.3+49)/2+mu/7000, 0) > 1e-15 {
		t.Errorf("Lagrangian = %.17g", lv)
	}
}

// dampedOscillator returns the closed-form solution of q” + gamma q' +
// omega^2 q = 0 with q(0) = 1, q'(0) = 0 (underdamped).
func dampedOscillator(t, gamma, omega float64) (q, qd float64) {
	wd := math.Sqrt(omega*omega - gamma*gamma/4)
	e := math.Exp(-gamma * t / 2)
	sn, cs := math.Sincos(wd * t)
	q = e * (cs + gamma/(2*wd)*sn)
	qd = -e * (omega * omega / wd) * sn
	return q, qd
}

// TestTimeDependentAndForces: the Caldirola-Kanai Lagrangian
// L = exp(gamma t)(qdot^2 - omega^2 q^2)/2 (explicitly time dependent, so
// it exercises the d2L/dqdot dt term) and the plain oscillator with the
// generalized force Q = -gamma qdot both give the damped oscillator
// q” + gamma q' + omega^2 q = 0, whose closed form is the reference.
func TestTimeDependentAndForces(t *testing.T) {
	const gamma, omega = 0.3, 2.0
	const tolAcc = 1e-14 // relative, pointwise equations
	const tolQ = 1e-9    // absolute on q(t) after 10 time units at rtol 1e-13
	ck := func(tt hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		e := hyperdual.Exp(hyperdual.Scale(gamma, tt))
		return hyperdual.Scale(0.5, hyperdual.Mul(e, hyperdual.Sub(hyperdual.Mul(qd[0], qd[0]), hyperdual.Scale(omega*omega, hyperdual.Mul(q[0], q[0])))))
	}
	plain := func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		return hyperdual.Scale(0.5, hyperdual.Sub(hyperdual.Mul(qd[0], qd[0]), hyperdual.Scale(omega*omega, hyperdual.Mul(q[0], q[0]))))
	}
	drag := func(dst []float64, _ float64, _, qd []float64) error { dst[0] = -gamma * qd[0]; return nil }
	for _, tc := range []struct {
		name string
		l    Func
		f    Force
	}{
		{"time-dependent Lagrangian", ck, nil},
		{"generalized force", plain, drag},
	} {
		t.Run(tc.name, func(t *testing.T) {
			sys, err := New(1, tc.l, tc.f)
			if err != nil {
				t.Fatal(err)
			}
			var a [1]float64
			for _, st := range [][3]float64{{0, 1, 0}, {1.5, -0.3, 2}, {7, 0.25, -0.8}} {
				if err := sys.Accelerations(a[:], st[0], st[1:2], st[2:3]); err != nil {
					t.Fatal(err)
				}
				want := -gamma*st[2] - omega*omega*st[1]
				if relErr(a[0], want, 1) > tolAcc {
					t.Errorf("t = %g: qddot = %.17g, want %.17g", st[0], a[0], want)
				}
			}
			s, _ := integrate.New(2, sys.Derivative, integrate.Settings{RelTol: 1e-13, AbsTol: 1e-13})
			y := make([]float64, 2)
			if _, err := s.Integrate(y, 0, []float64{1, 0}, 10, nil); err != nil {
				t.Fatal(err)
			}
			q, qd := dampedOscillator(10, gamma, omega)
			if math.Abs(y[0]-q) > tolQ || math.Abs(y[1]-qd) > tolQ {
				t.Errorf("y(10) = %v, want (%.12g, %.12g)", y, q, qd)
			}
		})
	}
}

// threeBodyRotating is the Lagrangian of the restricted three-body problem
// in the rotating frame (unit angular rate, masses 1-mu at (-mu, 0) and mu
// at (1-mu, 0)): L = ((xdot-y)^2 + (ydot+x)^2)/2 + (1-mu)/r1 + mu/r2. Its
// velocity-dependent (gyroscopic) terms exercise C = d2L/dqdot dq.
func threeBodyRotating(mu float64) Func {
	return func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		x, y := q[0], q[1]
		u := sub(qd[0], y)
		v := add(qd[1], x)
		t := scale(0.5, add(mul(u, u), mul(v, v)))
		d1 := add(x, num(mu))
		d2 := sub(x, num(1-mu))
		r1 := Sqrt(add(mul(d1, d1), mul(y, y)))
		r2 := Sqrt(add(mul(d2, d2), mul(y, y)))
		return add(t, add(scale(1-mu, hyperdual.Inv(r1)), scale(mu, hyperdual.Inv(r2))))
	}
}

// TestArenstorfEngine: the engine-derived equations of the rotating-frame
// Lagrangian are those of Hairer, Norsett & Wanner, Solving ODEs I, 2nd
// ed., Section II.0, eq. (0.1), and their Arenstorf orbit (eq. (0.2), period
// T = 17.0652165601579625588917206249) closes after one period.
func TestArenstorfEngine(t *testing.T) {
	const mu = 0.012277471 // HNW II.0
	const mup = 1 - mu
	sys, _ := New(2, threeBodyRotating(mu), nil)
	rng := rand.New(rand.NewPCG(1, 1))
	var got [2]float64
	for range 1000 {
		x, y := 3*(rng.Float64()-0.5), 3*(rng.Float64()-0.5)
		vx, vy := 4*(rng.Float64()-0.5), 4*(rng.Float64()-0.5)
		if err := sys.Accelerations(got[:], 0, []float64{x, y}, []float64{vx, vy}); err != nil {
			t.Fatal(err)
		}
		d1 := math.Pow((x+mu)*(x+mu)+y*y, 1.5)
		d2 := math.Pow((x-mup)*(x-mup)+y*y, 1.5)
		wx := x + 2*vy - mup*(x+mu)/d1 - mu*(x-mup)/d2
		wy := y - 2*vx - mup*y/d1 - mu*y/d2
		sc := math.Abs(x) + 2*math.Abs(vy) + 2*math.Abs(vx) + math.Abs(y) + mup*math.Abs(x+mu)/d1 + mu*math.Abs(x-mup)/d2 + (mup/d1+mu/d2)*math.Abs(y)
		if math.Abs(got[0]-wx) > 1e-14*sc || math.Abs(got[1]-wy) > 1e-14*sc {
			t.Fatalf("(%g, %g, %g, %g): qddot = %v, want (%g, %g)", x, y, vx, vy, got, wx, wy)
		}
	}
	y0 := []float64{0.994, 0, 0, -2.00158510637908252240537862224} // HNW (0.2)
	const period = 17.0652165601579625588917206249                 // HNW II.0
	s, _ := integrate.New(4, sys.Derivative, integrate.Settings{RelTol: 1e-12, AbsTol: 1e-12})
	y := make([]float64, 4)
	if _, err := s.Integrate(y, 0, y0, period, nil); err != nil {
		t.Fatal(err)
	}
	for i := range y {
		if math.Abs(y[i]-y0[i]) > 1e-6 { // brief: within 1e-6 after one period at tol 1e-12
			t.Errorf("y(T)[%d] = %.12g, want %.12g", i, y[i], y0[i])
		}
	}
	t.Logf("engine Arenstorf: y(T) - y0 = %.3g, evaluations %d", []float64{y[0] - y0[0], y[1] - y0[1], y[2] - y0[2], y[3] - y0[3]}, s.Stats().Evaluations)
}

// apsides integrates a central-potential orbit in polar coordinates and
// returns the polar angles of the successive apsides (rdot = 0) of the
// given sense (+1 periapsis: rdot rising; -1 apoapsis).
func apsides(t *testing.T, l Func, y0 []float64, span float64, dir int) (angles []float64, final []float64) {
	t.Helper()
	sys, err := New(2, l, nil)
	if err != nil {
		t.Fatal(err)
	}
	s, _ := integrate.New(4, sys.Derivative, integrate.Settings{RelTol: 1e-13, AbsTol: 1e-13})
	obs := &integrate.Observer{
		Events:  []integrate.Event{{G: func(_ float64, y []float64) float64 { return y[2] }, Direction: dir}},
		OnEvent: func(h integrate.Hit) error { angles = append(angles, h.Y[1]); return nil },
	}
	final = make([]float64, 4)
	if _, err := s.Integrate(final, 0, y0, span, obs); err != nil {
		t.Fatal(err)
	}
	return angles, final
}

// TestBertrand: of the power-law central forces only the inverse-square and
// the linear one give closed orbits (Bertrand's theorem; Goldstein, Poole &
// Safko, Classical Mechanics, 3rd ed., Section 3.6, section number from
// memory). Closed forms used as references:
//   - U = omega^2 r^2/2 (isotropic oscillator): x = A cos(omega t),
//     y = B sin(omega t), an ellipse centred on the origin; apsides are pi/2
//     apart and the orbit closes after 2 pi/omega.
//   - U = -mu/r: periapsides 2 pi apart (Kepler ellipse).
//   - U = -mu/r - beta/(2 r^2) (an added r^-3 force): the Binet equation
//     u” + (1 - beta/h^2) u = mu/h^2 gives periapsides 2 pi/kappa apart,
//     kappa = sqrt(1 - beta/h^2), so the orbit does not close.
func TestBertrand(t *testing.T) {
	const tolAngle = 1e-9 // rad, at rtol 1e-13
	const omega = 1.0
	harmonic, _ := CentralPolar(func(r hyperdual.Number) hyperdual.Number {
		return scale(0.5*omega*omega, mul(r, r))
	})
	// start at apocentre r = A = 1 with tangential speed B omega = 0.5
	y0 := []float64{1, 0, 0, 0.5}
	peri, final := apsides(t, harmonic, y0, 2*math.Pi/omega*5, 1)
	apo, _ := apsides(t, harmonic, y0, 2*math.Pi/omega*5, -1)
	// periapsides at theta = pi/2 + k pi, apoapsides at k pi (unwrapped angle)
	for k, a := range peri {
		if want := math.Pi/2 + float64(k)*math.Pi; math.Abs(a-want) > tolAngle {
			t.Errorf("harmonic periapsis %d at theta = %.15g, want %.15g", k, a, want)
		}
	}
	for k, a := range apo {
		if want := float64(k+1) * math.Pi; math.Abs(a-want) > tolAngle {
			t.Errorf("harmonic apoapsis %d at theta = %.15g, want %.15g", k, a, want)
		}
	}
	if len(peri) != 10 {
		t.Errorf("harmonic: %d periapsides in 5 periods, want 10", len(peri))
	}
	// closure after 5 periods: back to r = 1, rdot = 0, thetadot = 0.5, theta = 10 pi
	if math.Abs(final[0]-1) > 1e-10 || math.Abs(final[2]) > 1e-10 || math.Abs(final[3]-0.5) > 1e-10 || math.Abs(final[1]-10*math.Pi) > 1e-9 {
		t.Errorf("harmonic orbit after 5 periods %v, want (1, 10pi, 0, 0.5)", final)
	}

	const mu, beta = 1.0, 0.05
	kepler, _ := CentralPolar(func(r hyperdual.Number) hyperdual.Number { return scale(-mu, hyperdual.Inv(r)) })
	perturbed, _ := CentralPolar(func(r hyperdual.Number) hyperdual.Number {
		inv := hyperdual.Inv(r)
		return sub(scale(-mu, inv), scale(beta/2, mul(inv, inv)))
	})
	// start at r = 1 with rdot = 0 and thetadot = 1.2 (h = 1.2): a periapsis
	y1 := []float64{1, 0, 0, 1.2}
	h := 1.2
	for _, tc := range []struct {
		name string
		l    Func
		want float64 // angle between successive periapsides
	}{
		{"inverse square closes", kepler, 2 * math.Pi},
		{"r^-3 perturbation precesses", perturbed, 2 * math.Pi / math.Sqrt(1-beta/(h*h))},
	} {
		t.Run(tc.name, func(t *testing.T) {
			angles, _ := apsides(t, tc.l, y1, 60, 1)
			if len(angles) < 3 {
				t.Fatalf("%d periapsides", len(angles))
			}
			for k := 1; k < len(angles); k++ {
				if d := angles[k] - angles[k-1]; math.Abs(d-tc.want) > tolAngle {
					t.Errorf("periapsis advance %d = %.15g rad, want %.15g", k, d, tc.want)
				}
			}
		})
	}
	if adv := 2*math.Pi/math.Sqrt(1-beta/(h*h)) - 2*math.Pi; adv < 1e3*tolAngle {
		t.Fatalf("test set-up: precession %g rad too small to distinguish", adv)
	}
}

// TestZonalPoles: on the polar axis (x = y = 0, sin(lat) = +-1) the zonal
// Lagrangian stays regular, and the acceleration along the axis is the
// closed form -mu/z^2 [1 - sum (n+1) J_n (Re/z)^n (+-1)^n] (derivative of
// U = -mu/z [1 - sum J_n (Re/z)^n P_n(+-1)], P_n(1) = 1, P_n(-1) = (-1)^n).
func TestZonalPoles(t *testing.T) {
	j := egm2008J()
	l, err := ZonalCartesian(earthMu, earthRe, j[:], 6)
	if err != nil {
		t.Fatal(err)
	}
	sys, _ := New(3, l, nil)
	var a [3]float64
	for _, z := range []float64{7000, -7000, 42164, -6400} {
		if err := sys.Accelerations(a[:], 0, []float64{0, 0, z}, []float64{1, 2, 3}); err != nil {
			t.Fatal(err)
		}
		sgn := math.Copysign(1, z)
		az := math.Abs(z)
		var sum float64
		for n := 2; n <= 6; n++ {
			sum += float64(n+1) * j[n] * math.Pow(earthRe/az, float64(n)) * math.Pow(sgn, float64(n))
		}
		want := -sgn * earthMu / (z * z) * (1 - sum)
		if relErr(a[2], want, 0) > 1e-14 || a[0] != 0 || a[1] != 0 {
			t.Errorf("z = %g: a = %v, want (0, 0, %.17g)", z, a, want)
		}
	}
}

const (
	earthMu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	earthRe = 6378.137    // km, WGS 84 semi-major axis (NIMA TR8350.2, Table 3.1)
)

// egm2008J returns J_n = -C_n0 sqrt(2n+1) from the fully normalized EGM2008
// zonal coefficients C20..C60 (Pavlis et al. 2012, EGM2008 coefficient file
// EGM2008_to2190_TideFree, n = 2..6, m = 0).
func egm2008J() [7]float64 {
	c := [7]float64{2: -0.484165143790815e-3, 3: 0.957161207093473e-6, 4: 0.539965866638991e-6, 5: 0.686702913736681e-7, 6: -0.149953927978527e-6}
	var j [7]float64
	for n := 2; n <= 6; n++ {
		j[n] = -c[n] * math.Sqrt(float64(2*n+1))
	}
	return j
}

func TestErrors(t *testing.T) {
	lin := func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number { return add(qd[0], q[0]) }
	sys, _ := New(1, lin, nil)
	var a [1]float64
	err := sys.Accelerations(a[:], 0, []float64{1}, []float64{1})
	var se *StateError
	if !errors.Is(err, ErrSingular) || !errors.As(err, &se) || se.Q[0] != 1 {
		t.Errorf("linear Lagrangian: err = %v, want ErrSingular in a StateError", err)
	}
	for _, n := range []int{0, 7} {
		if _, err := New(n, lin, nil); !errors.Is(err, ErrDim) {
			t.Errorf("New(%d): err = %v, want ErrDim", n, err)
		}
	}
	if _, err := PointMassPolar(-1); !errors.Is(err, ErrParameter) {
		t.Errorf("PointMassPolar(-1): err = %v", err)
	}
	if _, err := CentralPolar(nil); !errors.Is(err, ErrParameter) {
		t.Errorf("CentralPolar(nil): err = %v", err)
	}
	for _, tc := range []struct {
		mu, re float64
		j      []float64
		deg    int
	}{
		{0, 6378, nil, 0}, {398600, 0, []float64{0, 0, 1e-3}, 2}, {398600, 6378, []float64{0, 0, 1e-3}, 3},
		{398600, 6378, []float64{0, 0, math.NaN()}, 2}, {398600, 6378, nil, 7}, {398600, 6378, nil, -1},
	} {
		if _, err := ZonalCartesian(tc.mu, tc.re, tc.j, tc.deg); !errors.Is(err, ErrParameter) {
			t.Errorf("ZonalCartesian(%v): err = %v, want ErrParameter", tc, err)
		}
	}
	if _, _, err := ToPolar(orbit.State{V: [3]float64{1, 0, 0}}); !errors.Is(err, ErrState) {
		t.Errorf("ToPolar at origin: err = %v", err)
	}
	if _, _, err := ToPolar(orbit.State{R: [3]float64{math.NaN(), 1, 0}}); !errors.Is(err, ErrState) {
		t.Errorf("ToPolar NaN: err = %v", err)
	}
}

func TestPolarRoundTrip(t *testing.T) {
	const tol = 1e-15 // relative, round trip through the plane
	rng := rand.New(rand.NewPCG(1, 1))
	for k := range 1000 {
		var s orbit.State
		for i := range 3 {
			s.R[i] = 20000 * (rng.Float64() - 0.5)
			s.V[i] = 10 * (rng.Float64() - 0.5)
		}
		if k%100 == 0 { // rectilinear motion
			s.V = scale3(rng.Float64()-0.5, s.R)
		}
		pl, p, err := ToPolar(s)
		if err != nil {
			t.Fatal(err)
		}
		back := pl.State(p)
		rn, vn := norm(s.R), norm(s.V)
		for i := range 3 {
			if math.Abs(back.R[i]-s.R[i]) > 4*tol*rn || math.Abs(back.V[i]-s.V[i]) > 8*tol*(vn+1e-300) {
				t.Fatalf("round trip %v -> %v", s, back)
			}
		}
		if d := dot(pl.P, pl.Q); math.Abs(d) > 1e-15 || math.Abs(norm(pl.W)-1) > 1e-15 || math.Abs(dot(cross(pl.P, pl.Q), pl.W)-1) > 1e-15 {
			t.Fatalf("basis not orthonormal right-handed: %+v", pl)
		}
		p2 := pl.Polar(back)
		if math.Abs(p2.R-p.R) > tol*p.R*4 || math.Abs(p2.Theta) > 1e-15 {
			t.Fatalf("Polar(State(p)) = %+v, want %+v", p2, p)
		}
	}
}

func BenchmarkEngine(b *testing.B) {
	j := egm2008J()
	pm, _ := PointMassPolar(earthMu)
	z2, _ := ZonalCartesian(earthMu, earthRe, j[:], 2)
	z6, _ := ZonalCartesian(earthMu, earthRe, j[:], 6)
	z0, _ := ZonalCartesian(earthMu, earthRe, nil, 0)
	for _, bc := range []struct {
		name string
		n    int
		l    Func
	}{
		{"polar-point-mass", 2, pm},
		{"cartesian-point-mass", 3, z0},
		{"cartesian-J2", 3, z2},
		{"cartesian-zonal6", 3, z6},
	} {
		b.Run(bc.name, func(b *testing.B) {
			sys, _ := New(bc.n, bc.l, nil)
			rng := rand.New(rand.NewPCG(1, 1))
			const m = 1024
			ys := make([][]float64, m)
			for i := range ys {
				ys[i] = make([]float64, 2*bc.n)
				for k := range ys[i] {
					ys[i][k] = 7000*(rng.Float64()+0.5)*float64(1-k/bc.n) + float64(k/bc.n)*(rng.Float64()-0.5)
				}
			}
			dst := make([]float64, 2*bc.n)
			b.ReportAllocs()
			i := 0
			for b.Loop() {
				if err := sys.Derivative(dst, 0, ys[i%m]); err != nil {
					b.Fatal(err)
				}
				i++
			}
		})
	}
}
