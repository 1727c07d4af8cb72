package transfer

import "math"

// G0 is standard gravity, 9.80665 m/s^2 exactly, in km/s^2: the value
// declared by the 3rd General Conference on Weights and Measures (CGPM,
// 1901). Exhaust velocity is Isp * G0.
const G0 = 9.80665e-3 // km/s^2

// The rocket equation (Tsiolkovsky): dv = Isp G0 ln(m0 / mf), with dv in
// km/s, Isp in s and masses in kg.

func checkDV(fn string, dv float64) error {
	if !(dv >= 0) || !finite(dv) {
		return &InputError{Func: fn, Param: "dv", Value: dv, Err: ErrDeltaV}
	}
	return nil
}

func checkIsp(fn string, isp float64) error {
	if !finite(isp) || isp <= 0 {
		return &InputError{Func: fn, Param: "isp", Value: isp, Err: ErrIsp}
	}
	return nil
}

func checkMass(fn, name string, m float64) error {
	if !finite(m) || m <= 0 {
		return &InputError{Func: fn, Param: name, Value: m, Err: ErrMass}
	}
	return nil
}

// Propellant returns the propellant mass (kg) burnt to give delta-v dv
// (km/s) with specific impulse isp (s), starting from massInitial (kg):
// m0 (1 - exp(-dv / (isp G0))).
func Propellant(dv, isp, massInitial float64) (float64, error) {
	const fn = "Propellant"
	if err := checkDV(fn, dv); err != nil {
		return 0, err
	}
	if err := checkIsp(fn, isp); err != nil {
		return 0, err
	}
	if err := checkMass(fn, "massInitial", massInitial); err != nil {
		return 0, err
	}
	return -massInitial * math.Expm1(-dv/(isp*G0)), nil
}

// PropellantFromDry returns the propellant mass (kg) needed to give delta-v
// dv (km/s) with specific impulse isp (s) so that massFinal (kg) remains
// after the burn: mf (exp(dv / (isp G0)) - 1). It returns ErrMassRatio if
// the mass ratio overflows.
func PropellantFromDry(dv, isp, massFinal float64) (float64, error) {
	const fn = "PropellantFromDry"
	if err := checkDV(fn, dv); err != nil {
		return 0, err
	}
	if err := checkIsp(fn, isp); err != nil {
		return 0, err
	}
	if err := checkMass(fn, "massFinal", massFinal); err != nil {
		return 0, err
	}
	m := massFinal * math.Expm1(dv/(isp*G0))
	if !finite(m) {
		return 0, &InputError{Func: fn, Param: "dv", Value: dv, Err: ErrMassRatio}
	}
	return m, nil
}

// DeltaV returns the delta-v (km/s) that specific impulse isp (s) gives when
// the mass falls from massInitial to massFinal (kg): isp G0 ln(m0 / mf).
// It is the inverse of Propellant and PropellantFromDry.
func DeltaV(isp, massInitial, massFinal float64) (float64, error) {
	const fn = "DeltaV"
	if err := checkIsp(fn, isp); err != nil {
		return 0, err
	}
	if err := checkMass(fn, "massInitial", massInitial); err != nil {
		return 0, err
	}
	if err := checkMass(fn, "massFinal", massFinal); err != nil {
		return 0, err
	}
	if massFinal > massInitial {
		return 0, &InputError{Func: fn, Param: "massFinal", Value: massFinal, Err: ErrMassOrder}
	}
	// ln(m0/mf) = log1p((m0 - mf) / mf), exact for small propellant fractions.
	dv := isp * G0 * math.Log1p((massInitial-massFinal)/massFinal)
	if err := checkResult(fn, dv); err != nil {
		return 0, err
	}
	return dv, nil
}

// RequiredIsp returns the specific impulse (s) that gives delta-v dv (km/s,
// > 0) when the mass falls from massInitial to massFinal (kg, massFinal <
// massInitial).
func RequiredIsp(dv, massInitial, massFinal float64) (float64, error) {
	const fn = "RequiredIsp"
	if err := checkDV(fn, dv); err != nil {
		return 0, err
	}
	if dv == 0 {
		return 0, &InputError{Func: fn, Param: "dv", Value: dv, Err: ErrDeltaV}
	}
	if err := checkMass(fn, "massInitial", massInitial); err != nil {
		return 0, err
	}
	if err := checkMass(fn, "massFinal", massFinal); err != nil {
		return 0, err
	}
	if massFinal >= massInitial {
		return 0, &InputError{Func: fn, Param: "massFinal", Value: massFinal, Err: ErrMassOrder}
	}
	isp := dv / (G0 * math.Log1p((massInitial-massFinal)/massFinal))
	if err := checkResult(fn, isp); err != nil {
		return 0, err
	}
	return isp, nil
}

// MassStep is the mass budget of one burn.
type MassStep struct {
	Label                string  // the burn's label
	DeltaV               float64 // km/s
	MassBefore           float64 // kg
	Propellant           float64 // kg burnt in this burn
	MassAfter            float64 // kg
	CumulativePropellant float64 // kg burnt up to and including this burn
}

// PropellantBudget applies the rocket equation burn by burn, in order,
// starting from massInitial (kg) with specific impulse isp (s), and returns
// one MassStep per burn. The total propellant equals Propellant of the
// summed delta-v (the mass ratios multiply).
func PropellantBudget(burns []Burn, isp, massInitial float64) ([]MassStep, error) {
	const fn = "PropellantBudget"
	if err := checkIsp(fn, isp); err != nil {
		return nil, err
	}
	if err := checkMass(fn, "massInitial", massInitial); err != nil {
		return nil, err
	}
	steps := make([]MassStep, len(burns))
	m := massInitial
	total := 0.0
	for i, b := range burns {
		if err := checkDV(fn, b.DeltaV); err != nil {
			return nil, err
		}
		dm := -m * math.Expm1(-b.DeltaV/(isp*G0))
		total += dm
		steps[i] = MassStep{Label: b.Label, DeltaV: b.DeltaV, MassBefore: m, Propellant: dm, MassAfter: m - dm, CumulativePropellant: total}
		m -= dm
	}
	return steps, nil
}
