package atmosphere

import (
	"bufio"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// halfUnit returns half a unit in the last place of a value printed with
// sig significant digits, relative to the value: the tolerance such a
// printed value allows.
func halfUnit(v float64, sig int) float64 {
	e := math.Floor(math.Log10(math.Abs(v)))
	return 0.5 * math.Pow(10, e-float64(sig-1))
}

// TestUSSA1976TableI compares with U.S. Standard Atmosphere 1976
// (NOAA-S/T 76-1562), Table I (SI units, geometric altitude), values as
// printed: temperature to 0.001 K, pressure and density to 5 significant
// digits; from memory. The same values are recomputed independently below
// (python3-fluids and a numerical integration of the hydrostatic equation).
func TestUSSA1976TableI(t *testing.T) {
	tests := []struct {
		altKm          float64
		tK, pPa, rhoKg float64
	}{
		{0, 288.150, 1.01325e5, 1.2250},
		{1, 281.651, 8.9876e4, 1.1117},
		{5, 255.676, 5.4048e4, 7.3643e-1},
		{11, 216.774, 2.2700e4, 3.6480e-1},
		{20, 216.650, 5.5293e3, 8.8910e-2},
		{32, 228.490, 8.8906e2, 1.3555e-2},
		{51, 270.650, 7.0458e1, 9.0690e-4},
	}
	for _, tc := range tests {
		p, err := Properties(tc.altKm)
		if err != nil {
			t.Fatal(err)
		}
		if !scalar.EqualWithinAbs(p.TemperatureK, tc.tK, 0.0005) {
			t.Errorf("T(%g km) = %.4f K, want %.3f K", tc.altKm, p.TemperatureK, tc.tK)
		}
		if !scalar.EqualWithinAbs(p.PressurePa, tc.pPa, halfUnit(tc.pPa, 5)) {
			t.Errorf("P(%g km) = %.6g Pa, want %.5g Pa", tc.altKm, p.PressurePa, tc.pPa)
		}
		if !scalar.EqualWithinAbs(p.DensityKgM3, tc.rhoKg, halfUnit(tc.rhoKg, 5)) {
			t.Errorf("rho(%g km) = %.6g kg/m^3, want %.5g kg/m^3", tc.altKm, p.DensityKgM3, tc.rhoKg)
		}
		if !p.HasTemperature || !p.HasPressure || p.Model != ModelUSSA1976 {
			t.Errorf("Properties(%g) = %+v, want USSA 1976 with temperature and pressure", tc.altKm, p)
		}
	}

	// 86 km: Table I prints the kinetic temperature 186.87 K, pressure
	// 3.7338e-1 Pa and density 6.958e-6 kg/m^3 (from memory). The package
	// returns the molecular-scale temperature T_M = 186.946 K (Table 4, base
	// b = 7, from memory), which exceeds the kinetic temperature by the
	// factor 1/(M/M0) = 1/0.999579 (Table 8, from memory): 0.079 K.
	p, err := Properties(86)
	if err != nil {
		t.Fatal(err)
	}
	if !scalar.EqualWithinAbs(p.TemperatureK, 186.946, 0.0005) {
		t.Errorf("T_M(86 km) = %.4f K, want 186.946 K", p.TemperatureK)
	}
	if !scalar.EqualWithinAbs(p.TemperatureK*0.999579, 186.87, 0.005) {
		t.Errorf("T_M(86 km) M/M0 = %.4f K, want kinetic 186.87 K", p.TemperatureK*0.999579)
	}
	if !scalar.EqualWithinAbs(p.PressurePa, 3.7338e-1, halfUnit(3.7338e-1, 5)) {
		t.Errorf("P(86 km) = %.6g Pa, want 3.7338e-1 Pa", p.PressurePa)
	}
	if !scalar.EqualWithinAbs(p.DensityKgM3, 6.958e-6, halfUnit(6.958e-6, 4)) {
		t.Errorf("rho(86 km) = %.6g kg/m^3, want 6.958e-6 kg/m^3", p.DensityKgM3)
	}
}

// TestUSSA1976Table4 compares with the standard's Table 4: molecular-scale
// temperature and pressure at the layer bases (geopotential altitude),
// pressure printed to 7 significant digits (from memory).
func TestUSSA1976Table4(t *testing.T) {
	tests := []struct {
		hKm  float64 // geopotential altitude, km'
		tK   float64
		pPa  float64
		pSig int
	}{
		{0, 288.150, 101325.0, 6},
		{11, 216.650, 22632.06, 7},
		{20, 216.650, 5474.889, 7},
		{32, 228.650, 868.0187, 7},
		{47, 270.650, 110.9063, 7},
		{51, 270.650, 66.93887, 7},
		{71, 214.650, 3.956420, 7},
		{84.852, 186.946, 0.3733836, 7},
	}
	for _, tc := range tests {
		z := 6356.766 * tc.hKm / (6356.766 - tc.hKm) // inverse of H = r0 Z / (r0 + Z), standard eq. 18
		p, err := Properties(z)
		if err != nil {
			t.Fatal(err)
		}
		if !scalar.EqualWithinAbs(p.TemperatureK, tc.tK, 0.0005) {
			t.Errorf("T_M(H = %g km') = %.4f K, want %.3f K", tc.hKm, p.TemperatureK, tc.tK)
		}
		if !scalar.EqualWithinAbs(p.PressurePa, tc.pPa, halfUnit(tc.pPa, tc.pSig)) {
			t.Errorf("P(H = %g km') = %.8g Pa, want %.7g Pa", tc.hKm, p.PressurePa, tc.pPa)
		}
	}
}

// TestUSSA1976AgainstFluids compares with an independent implementation,
// fluids.atmosphere.ATMOSPHERE_1976 (Debian python3-fluids 1.0.22), values
// stored in testdata/atmosphere/ussa1976_fluids.csv by ussa1976_fluids.py.
// Both evaluate the same closed forms in float64, so they agree to rounding;
// 1e-12 relative allows for a different order of operations.
func TestUSSA1976AgainstFluids(t *testing.T) {
	f, err := os.Open(filepath.Join("..", "..", "testdata", "atmosphere", "ussa1976_fluids.csv"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	const rel = 1e-12
	rows := 0
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.HasPrefix(line, "alt_km") {
			continue
		}
		var v [4]float64
		fields := strings.Split(line, ",")
		if len(fields) != 4 {
			t.Fatalf("bad line %q", line)
		}
		for i, s := range fields {
			if v[i], err = strconv.ParseFloat(s, 64); err != nil {
				t.Fatalf("bad line %q: %v", line, err)
			}
		}
		p, err := Properties(v[0])
		if err != nil {
			t.Fatal(err)
		}
		if !scalar.EqualWithinRel(p.TemperatureK, v[1], rel) ||
			!scalar.EqualWithinRel(p.PressurePa, v[2], rel) ||
			!scalar.EqualWithinRel(p.DensityKgM3, v[3], rel) {
			t.Errorf("Properties(%g km) = T %.15g, P %.15g, rho %.15g; fluids T %.15g, P %.15g, rho %.15g",
				v[0], p.TemperatureK, p.PressurePa, p.DensityKgM3, v[1], v[2], v[3])
		}
		rows++
	}
	if err := sc.Err(); err != nil {
		t.Fatal(err)
	}
	if rows < 20 {
		t.Fatalf("read %d rows, want at least 20", rows)
	}
}

// TestUSSA1976Hydrostatic integrates the hydrostatic equation
// dP/dZ = -rho g with rho = P M0 / (R* T_M) and g = g0 (r0/(r0+Z))^2
// (the standard's equations 2, 17 and 42) numerically in geometric altitude
// from sea level, with the temperature profile defined by Table 4, and
// compares pressure and density with the closed forms. RK4 with steps of
// about 10 m, breaking at the layer bases; the truncation error, estimated
// by halving the step, is asserted below 1e-11, and the comparison
// tolerance is 1e-10 relative.
func TestUSSA1976Hydrostatic(t *testing.T) {
	const (
		g0    = 9.80665   // m/s^2 (standard)
		rStar = 8314.32   // J/(kmol K) (standard)
		m0    = 28.9644   // kg/kmol (standard)
		r0    = 6356766.0 // m (standard)
	)
	// Table 4: base geopotential altitude (m') and gradient (K/m').
	hb := []float64{0, 11000, 20000, 32000, 47000, 51000, 71000, 84852}
	lb := []float64{-6.5e-3, 0, 1.0e-3, 2.8e-3, 0, -2.8e-3, -2.0e-3, 0}
	tb := []float64{288.15}
	for i := 1; i < len(hb); i++ {
		tb = append(tb, tb[i-1]+lb[i-1]*(hb[i]-hb[i-1]))
	}
	tM := func(z float64) float64 { // z geometric, m
		h := r0 * z / (r0 + z)
		i := len(hb) - 1
		for i > 0 && h < hb[i] {
			i--
		}
		return tb[i] + lb[i]*(h-hb[i])
	}
	dPdZ := func(z, p float64) float64 {
		g := g0 * (r0 / (r0 + z)) * (r0 / (r0 + z))
		return -p * m0 / (rStar * tM(z)) * g
	}
	// Geometric altitudes (m) of the layer bases, where T_M has kinks.
	var breaks []float64
	for _, h := range hb[1:] {
		breaks = append(breaks, r0*h/(r0-h))
	}
	integrate := func(zEnd, step float64) float64 {
		z, p := 0.0, 101325.0
		for _, zb := range append(append([]float64(nil), breaks...), math.Inf(1)) {
			stop := math.Min(zb, zEnd)
			if stop <= z {
				continue
			}
			n := int(math.Ceil((stop - z) / step))
			dz := (stop - z) / float64(n)
			for range n {
				k1 := dPdZ(z, p)
				k2 := dPdZ(z+dz/2, p+dz/2*k1)
				k3 := dPdZ(z+dz/2, p+dz/2*k2)
				k4 := dPdZ(z+dz, p+dz*k3)
				p += dz / 6 * (k1 + 2*k2 + 2*k3 + k4)
				z += dz
			}
			if stop == zEnd {
				break
			}
		}
		return p
	}
	for _, zKm := range []float64{1, 5, 11, 20, 32, 47, 51, 71, 80, 86} {
		z := zKm * 1000
		p10 := integrate(z, 10)
		p5 := integrate(z, 5)
		if est := math.Abs(p10-p5) / p5; est > 1e-11 {
			t.Errorf("Z = %g km: RK4 step-halving estimate %g exceeds 1e-11", zKm, est)
		}
		got, err := Properties(zKm)
		if err != nil {
			t.Fatal(err)
		}
		if !scalar.EqualWithinRel(got.PressurePa, p5, 1e-10) {
			t.Errorf("P(%g km) = %.15g Pa, integrated %.15g Pa (rel %g)", zKm, got.PressurePa, p5, math.Abs(got.PressurePa/p5-1))
		}
		rho := p5 * m0 / (rStar * tM(z))
		if !scalar.EqualWithinRel(got.DensityKgM3, rho, 1e-10) {
			t.Errorf("rho(%g km) = %.15g, from integrated P %.15g", zKm, got.DensityKgM3, rho)
		}
	}
}

// vallado is Vallado, Fundamentals of Astrodynamics and Applications, 4th
// ed. (2013), Table 8-4 (base altitude km, nominal density kg/m^3, scale
// height km), all rows as printed; from memory, typed here independently
// of exponential.go and cross-checked by TestExponentialTableConsistency.
var vallado = []struct{ h0, rho0, h float64 }{
	{0, 1.225, 7.249}, {25, 3.899e-2, 6.349}, {30, 1.774e-2, 6.682}, {40, 3.972e-3, 7.554},
	{50, 1.057e-3, 8.382}, {60, 3.206e-4, 7.714}, {70, 8.770e-5, 6.549}, {80, 1.905e-5, 5.799},
	{90, 3.396e-6, 5.382}, {100, 5.297e-7, 5.877}, {110, 9.661e-8, 7.263}, {120, 2.438e-8, 9.473},
	{130, 8.484e-9, 12.636}, {140, 3.845e-9, 16.149}, {150, 2.070e-9, 22.523}, {180, 5.464e-10, 29.740},
	{200, 2.789e-10, 37.105}, {250, 7.248e-11, 45.546}, {300, 2.418e-11, 53.628}, {350, 9.518e-12, 53.298},
	{400, 3.725e-12, 58.515}, {450, 1.585e-12, 60.828}, {500, 6.967e-13, 63.822}, {600, 1.454e-13, 71.835},
	{700, 3.614e-14, 88.667}, {800, 1.170e-14, 124.64}, {900, 5.245e-15, 181.05}, {1000, 3.019e-15, 268.00},
}

// TestExponentialTableConsistency checks the remembered table against
// itself: each scale height must carry the base density to the next base,
// rho0 exp(-(h1-h0)/H) = rho1, within the printed precision (half a unit
// of the 4th digit of both densities, and of the last printed decimal of H
// times (h1-h0)/H). The first row (0-25 km) is known to miss by 0.14% and
// is held to 0.2%; the model does not use it.
func TestExponentialTableConsistency(t *testing.T) {
	for i := 0; i+1 < len(vallado); i++ {
		r0, r1 := vallado[i], vallado[i+1]
		dh := r1.h0 - r0.h0
		pred := r0.rho0 * math.Exp(-dh/r0.h)
		hDecimals := 0.0005
		if r0.h >= 100 {
			hDecimals = 0.005 // printed with two decimals
		}
		budget := halfUnit(r0.rho0, 4)/r0.rho0 + halfUnit(r1.rho0, 4)/r1.rho0 + dh/r0.h*hDecimals/r0.h
		if i == 0 {
			budget = 2e-3
		}
		if rel := math.Abs(pred/r1.rho0 - 1); rel > budget {
			t.Errorf("row %g km: rho0 exp(-%g/H) = %.5g, next base %.4g: rel %.3g > %.3g", r0.h0, dh, pred, r1.rho0, rel, budget)
		}
	}
}

// TestExponential checks the model above 86 km against the table: the
// base values and values between bases, rho0 exp(-(h - h0)/H).
func TestExponential(t *testing.T) {
	const rel = 1e-14
	for i, r := range vallado {
		if r.h0 < 90 {
			continue // rows below 90 km are replaced by USSA 1976 (the 80 km row serves 86-90 km)
		}
		if got := Density(r.h0); !scalar.EqualWithinRel(got, r.rho0, rel) {
			t.Errorf("Density(%g) = %.15g, want table %.4g", r.h0, got, r.rho0)
		}
		var mid float64
		if i+1 < len(vallado) {
			mid = (r.h0 + vallado[i+1].h0) / 2
		} else {
			mid = r.h0 + 500 // above 1000 km the last row continues
		}
		want := r.rho0 * math.Exp(-(mid-r.h0)/r.h)
		if got := Density(mid); !scalar.EqualWithinRel(got, want, rel) {
			t.Errorf("Density(%g) = %.15g, want %.15g", mid, got, want)
		}
		p, err := Properties(mid)
		if err != nil || p.DensityKgM3 != Density(mid) || p.HasTemperature || p.HasPressure ||
			p.TemperatureK != 0 || p.PressurePa != 0 || p.Model != ModelExponential {
			t.Errorf("Properties(%g) = %+v, %v", mid, p, err)
		}
	}
	// 86 to 90 km uses the 80 km row.
	if got, want := Density(88), 1.905e-5*math.Exp(-8/5.799); !scalar.EqualWithinRel(got, want, rel) {
		t.Errorf("Density(88) = %.15g, want %.15g", got, want)
	}
	// Far above, density falls to 0 without NaN.
	if got := Density(1e6); got != 0 {
		t.Errorf("Density(1e6 km) = %g, want 0 (underflow)", got)
	}
}

// TestJoinAt86km checks the documented step between the two models:
// density steps down by 2.7% (never up) across 86 km.
func TestJoinAt86km(t *testing.T) {
	below, above := Density(86), Density(math.Nextafter(86, 100))
	step := above/below - 1
	if step > 0 || step < -0.0275 || step > -0.0265 {
		t.Errorf("density step across 86 km = %.4f, want -2.7%%", step)
	}
}

func TestMonotonic(t *testing.T) {
	prev := Density(MinAltitudeKm)
	for h := MinAltitudeKm + 0.01; h < 2000; h += 0.01 {
		d := Density(h)
		if !(d < prev) || d <= 0 {
			t.Fatalf("Density(%.2f) = %g, not below Density(%.2f) = %g", h, d, h-0.01, prev)
		}
		prev = d
	}
}

func TestAltitudeRange(t *testing.T) {
	tests := []struct {
		alt     float64
		wantErr bool
	}{
		{MinAltitudeKm, false},
		{-4.999, false},
		{-5.0001, true},
		{-100, true},
		{math.NaN(), true},
		{math.Inf(1), true},
		{math.Inf(-1), true},
		{1e5, false},
	}
	for _, tc := range tests {
		p, err := Properties(tc.alt)
		if tc.wantErr {
			var ae *AltitudeError
			if !errors.Is(err, ErrAltitude) || !errors.As(err, &ae) || !strings.Contains(err.Error(), "; give") {
				t.Errorf("Properties(%g) = %+v, %v; want an AltitudeError", tc.alt, p, err)
			}
			continue
		}
		if err != nil || !(p.DensityKgM3 > 0) {
			t.Errorf("Properties(%g) = %+v, %v", tc.alt, p, err)
		}
	}
	if Density(-10) != Density(MinAltitudeKm) {
		t.Errorf("Density(-10) = %g, want the -5 km value %g", Density(-10), Density(MinAltitudeKm))
	}
	if Density(math.Inf(1)) != 0 || !math.IsNaN(Density(math.NaN())) {
		t.Errorf("Density(+Inf) = %g, Density(NaN) = %g; want 0 and NaN", Density(math.Inf(1)), Density(math.NaN()))
	}
}

func TestDensityScale(t *testing.T) {
	tests := []struct {
		s  DensityScale
		ok bool
	}{
		{NominalDensityScale, true}, {0.5, true}, {3, true}, {MaxDensityScale, true},
		{0, false}, {-1, false}, {MaxDensityScale * 1.0001, false},
		{DensityScale(math.NaN()), false}, {DensityScale(math.Inf(1)), false},
	}
	for _, tc := range tests {
		err := tc.s.Validate()
		if tc.ok != (err == nil) || (err != nil && !errors.Is(err, ErrDensityScale)) {
			t.Errorf("DensityScale(%g).Validate() = %v", float64(tc.s), err)
		}
	}
	if got, want := DensityScale(2.5).Density(400), 2.5*Density(400); got != want {
		t.Errorf("DensityScale(2.5).Density(400) = %g, want %g", got, want)
	}
}

func TestDensityDoesNotAllocate(t *testing.T) {
	h := 0.0
	allocs := testing.AllocsPerRun(1000, func() {
		_ = Density(h)
		h += 1.3
	})
	if allocs != 0 {
		t.Errorf("Density allocates %g times per call, want 0", allocs)
	}
}

func benchmarkDensity(b *testing.B, lo, hi float64) {
	const n = 1024
	alts := make([]float64, n)
	for i := range alts {
		alts[i] = lo + (hi-lo)*float64(i)/n
	}
	var sink float64
	i := 0
	for b.Loop() {
		sink += Density(alts[i%n])
		i++
	}
	_ = sink
}

func BenchmarkDensityUSSA(b *testing.B)        { benchmarkDensity(b, 0, 86) }
func BenchmarkDensityExponential(b *testing.B) { benchmarkDensity(b, 86, 1000) }
