package orbit

// Summary is everything derived from one state: its elements, the conic
// [Geometry] (embedded, with its Has* flags), the state's own radius,
// speed, flight-path angle and mean anomaly, and the secular J2 rates.
// No field is NaN or infinite; quantities an orbit does not have are
// zero and flagged false.
type Summary struct {
	State    State
	Elements Elements
	Geometry

	// MeanAnomaly is the mean anomaly at the state in rad, in the
	// conventions of [MeanFromTrue]: in [0, 2pi) for an ellipse, the
	// hyperbolic mean anomaly for a hyperbola and Barker's for a parabola.
	MeanAnomaly float64
	Radius      float64 // |r|, km
	Speed       float64 // |v|, km/s
	FlightPath  float64 // flight-path angle above the local horizontal, rad ([FlightPathAngle])

	// Secular J2 rates in rad/s ([J2Rates]); HasJ2Rates is true only for
	// an ellipse when j2 != 0.
	RAANRate, ArgPeriapsisRate, MeanAnomalyRate float64
	HasJ2Rates                                  bool
}

// Summarize derives the [Summary] of the state s about a body with
// gravitational parameter mu (km^3/s^2), reference radius re (km) and
// zonal coefficient j2 (0 for none, in which case re is not used).
// Errors are those of [ElementsFromState], [GeometryOf] and [J2Rates].
func Summarize(mu, re, j2 float64, s State) (Summary, error) {
	el, err := ElementsFromState(mu, s)
	if err != nil {
		return Summary{}, err
	}
	g, err := GeometryOf(mu, el)
	if err != nil {
		return Summary{}, err
	}
	m, err := MeanFromTrue(el.Nu, el.E)
	if err != nil {
		return Summary{}, err
	}
	out := Summary{
		State: s, Elements: el, Geometry: g,
		MeanAnomaly: m,
		Radius:      norm(s.R), Speed: norm(s.V),
		FlightPath: FlightPathAngle(s),
	}
	if g.Conic == Ellipse && j2 != 0 {
		out.RAANRate, out.ArgPeriapsisRate, out.MeanAnomalyRate, err = J2Rates(mu, re, j2, g.SemiMajorAxis, el.E, el.I)
		if err != nil {
			return Summary{}, err
		}
		out.HasJ2Rates = true
	}
	return out, nil
}
