package transfer

import "math"

// twoBurn backs the slices of a two-burn plan with one allocation.
type twoBurn struct {
	burns [2]Burn
	legs  [1]Leg
}

// Hohmann returns the two-burn Hohmann transfer between coplanar circular
// orbits of radii r1 and r2 (km) about a body of gravitational parameter mu
// (km^3/s^2): a tangential burn onto the ellipse with apses r1 and r2, half
// a revolution on it, and a tangential burn onto the final circle. It works
// inward (r2 < r1) as well; then both burns brake. r1 == r2 gives a plan
// with zero burns half a revolution apart. [HohmannDV] returns the same
// numbers without building a Plan (and without allocating).
func Hohmann(mu, r1, r2 float64) (Plan, error) {
	sc1, sc2, tof, err := hohmann("Hohmann", mu, r1, r2)
	if err != nil {
		return Plan{}, err
	}
	nu1, nu2 := 0.0, math.Pi
	if r1 > r2 {
		nu1, nu2 = math.Pi, 0
	}
	lo, hi := math.Min(r1, r2), math.Max(r1, r2)
	dv1, dv2 := math.Abs(sc1), math.Abs(sc2)
	s := new(twoBurn)
	s.burns[0] = Burn{Label: "departure", Radius: r1, TrueAnomaly: nu1, DeltaV: dv1, SpeedChange: sc1, Cumulative: dv1}
	s.burns[1] = Burn{Label: "arrival", Radius: r2, TrueAnomaly: nu2, DeltaV: dv2, SpeedChange: sc2, Cumulative: dv1 + dv2, Time: tof}
	s.legs[0] = Leg{Label: "transfer", Periapsis: lo, Apoapsis: hi, SemiMajorAxis: 0.5 * (r1 + r2),
		Eccentricity: (hi - lo) / (hi + lo), Period: 2 * tof, Duration: tof}
	return Plan{Method: MethodHohmann, Burns: s.burns[:], DVTotal: dv1 + dv2, TransferTime: tof, Legs: s.legs[:]}, nil
}

// HohmannDV returns the two burn magnitudes (km/s) and the transfer time (s)
// of [Hohmann] without building a Plan. It does not allocate.
func HohmannDV(mu, r1, r2 float64) (dv1, dv2, tof float64, err error) {
	sc1, sc2, tof, err := hohmann("HohmannDV", mu, r1, r2)
	return math.Abs(sc1), math.Abs(sc2), tof, err
}

// hohmann returns the signed speed changes of the two burns and the time.
func hohmann(fn string, mu, r1, r2 float64) (sc1, sc2, tof float64, err error) {
	if err := checkMu(fn, mu); err != nil {
		return 0, 0, 0, err
	}
	if err := checkRadius(fn, "r1", r1); err != nil {
		return 0, 0, 0, err
	}
	if err := checkRadius(fn, "r2", r2); err != nil {
		return 0, 0, 0, err
	}
	at := 0.5 * (r1 + r2)
	v1 := math.Sqrt(mu / r1)
	v2 := math.Sqrt(mu / r2)
	// Speeds on the transfer ellipse at r1 and r2 (vis-viva with a = at).
	vt1 := math.Sqrt(2 * mu * r2 / (r1 * (r1 + r2)))
	vt2 := math.Sqrt(2 * mu * r1 / (r2 * (r1 + r2)))
	tof = math.Pi * math.Sqrt(at*at*at/mu)
	sc1, sc2 = vt1-v1, v2-vt2
	if !finite(sc1) || !finite(sc2) || !finite(tof) || !finite(at) {
		return 0, 0, 0, &InputError{Func: fn, Param: "result", Value: sc1 + sc2 + tof + at, Err: ErrRange}
	}
	return sc1, sc2, tof, nil
}

// BiElliptic returns the three-burn bi-elliptic transfer between coplanar
// circular orbits of radii r1 and r2 (km): a burn at r1 onto the ellipse
// with apses r1 and rb, a burn at its apoapsis rb onto the ellipse with
// apses r2 and rb, and a burn at r2 onto the final circle. rb must be at
// least max(r1, r2) (ErrIntermediate). With rb equal to the larger radius
// the burns are those of a Hohmann transfer (one of them zero), with an
// extra half revolution on the larger circle.
func BiElliptic(mu, r1, r2, rb float64) (Plan, error) {
	const fn = "BiElliptic"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r1", r1); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r2", r2); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "rb", rb); err != nil {
		return Plan{}, err
	}
	if rb < math.Max(r1, r2) {
		return Plan{}, &InputError{Func: fn, Param: "rb", Value: rb, Err: ErrIntermediate}
	}
	a1 := 0.5 * (r1 + rb)
	a2 := 0.5 * (r2 + rb)
	v1 := math.Sqrt(mu / r1)
	v2 := math.Sqrt(mu / r2)
	va1 := math.Sqrt(2 * mu * rb / (r1 * (r1 + rb))) // leg 1 at r1
	vb1 := math.Sqrt(2 * mu * r1 / (rb * (r1 + rb))) // leg 1 at rb
	vb2 := math.Sqrt(2 * mu * r2 / (rb * (r2 + rb))) // leg 2 at rb
	va2 := math.Sqrt(2 * mu * rb / (r2 * (r2 + rb))) // leg 2 at r2
	t1 := 0.5 * period(mu, a1)
	t2 := 0.5 * period(mu, a2)
	p := Plan{
		Method: MethodBiElliptic,
		Burns: []Burn{
			{Label: "departure", Radius: r1, TrueAnomaly: 0, DeltaV: math.Abs(va1 - v1), SpeedChange: va1 - v1},
			{Label: "intermediate", Radius: rb, TrueAnomaly: math.Pi, DeltaV: math.Abs(vb2 - vb1), SpeedChange: vb2 - vb1, Time: t1},
			{Label: "arrival", Radius: r2, TrueAnomaly: 0, DeltaV: math.Abs(v2 - va2), SpeedChange: v2 - va2, Time: t1 + t2},
		},
		Legs: []Leg{leg(mu, "transfer 1", r1, rb, t1), leg(mu, "transfer 2", rb, r2, t2)},
	}
	if err := finish(fn, &p); err != nil {
		return Plan{}, err
	}
	return p, nil
}

// ApsisTransfer returns the two-burn tangent transfer from an apsis of orbit
// from (the one named by at) to an apsis of orbit to (the one named by
// arrive), along the transfer ellipse whose apses are those two radii. Both
// orbits are coplanar and their apse lines are aligned so that the arrival
// apsis lies 180 degrees from the departure point. Circular orbits are
// Circular(r); then the apsis names make no difference.
//
// Examples: an ellipse to a circle, burning at apoapsis:
// ApsisTransfer(mu, e, Apoapsis, Circular(r), Periapsis); a Hohmann transfer
// is ApsisTransfer(mu, Circular(r1), Periapsis, Circular(r2), Periapsis).
func ApsisTransfer(mu float64, from Ellipse, at Apsis, to Ellipse, arrive Apsis) (Plan, error) {
	const fn = "ApsisTransfer"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkEllipse(fn, "from", from); err != nil {
		return Plan{}, err
	}
	if err := checkEllipse(fn, "to", to); err != nil {
		return Plan{}, err
	}
	apsis := func(e Ellipse, a Apsis, name string) (float64, error) {
		switch a {
		case Periapsis:
			return e.Periapsis, nil
		case Apoapsis:
			return e.Apoapsis, nil
		}
		return 0, &InputError{Func: fn, Param: name, Value: float64(a), Err: ErrApsis}
	}
	rd, err := apsis(from, at, "at")
	if err != nil {
		return Plan{}, err
	}
	ra, err := apsis(to, arrive, "arrive")
	if err != nil {
		return Plan{}, err
	}
	at1 := from.SemiMajorAxis()
	at2 := to.SemiMajorAxis()
	att := 0.5 * (rd + ra)
	v1 := visViva(mu, rd, at1)
	vt1 := math.Sqrt(2 * mu * ra / (rd * (rd + ra)))
	vt2 := math.Sqrt(2 * mu * rd / (ra * (rd + ra)))
	v2 := visViva(mu, ra, at2)
	tof := math.Pi * math.Sqrt(att*att*att/mu)
	p := Plan{
		Method: MethodApsis,
		Burns: []Burn{
			{Label: "departure", Radius: rd, TrueAnomaly: anomalyAt(rd, ra), DeltaV: math.Abs(vt1 - v1), SpeedChange: vt1 - v1},
			{Label: "arrival", Radius: ra, TrueAnomaly: anomalyAt(ra, rd), DeltaV: math.Abs(v2 - vt2), SpeedChange: v2 - vt2, Time: tof},
		},
		Legs: []Leg{leg(mu, "transfer", rd, ra, tof)},
	}
	if err := finish(fn, &p); err != nil {
		return Plan{}, err
	}
	return p, nil
}

// Comparison sets a Hohmann and a bi-elliptic transfer between the same
// circular orbits side by side.
type Comparison struct {
	Hohmann    Plan
	BiElliptic Plan
	// Cheaper is MethodHohmann or MethodBiElliptic: the plan with the
	// smaller DVTotal (Hohmann on a tie, since it is also faster).
	Cheaper string
	// Saving is the dearer plan's DVTotal minus the cheaper one's, km/s.
	Saving float64
}

// Compare computes the Hohmann transfer from r1 to r2 and the bi-elliptic one
// via rb (km) and says which needs less delta-v. For r2/r1 (or r1/r2) below
// about 11.94 the Hohmann transfer is cheaper for every rb; above about 15.58
// the bi-elliptic one is cheaper for every rb above the larger radius;
// between, it depends on rb.
func Compare(mu, r1, r2, rb float64) (Comparison, error) {
	h, err := Hohmann(mu, r1, r2)
	if err != nil {
		return Comparison{}, err
	}
	b, err := BiElliptic(mu, r1, r2, rb)
	if err != nil {
		return Comparison{}, err
	}
	c := Comparison{Hohmann: h, BiElliptic: b, Cheaper: MethodHohmann, Saving: b.DVTotal - h.DVTotal}
	if b.DVTotal < h.DVTotal {
		c.Cheaper = MethodBiElliptic
		c.Saving = h.DVTotal - b.DVTotal
	}
	return c, nil
}
