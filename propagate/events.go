package propagate

import (
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate/integrate"
)

// EventKind names the orbital events a run can locate.
type EventKind int

const (
	// Custom events use Event.G.
	Custom EventKind = iota
	// Periapsis: the radial velocity r.v/|r| crosses zero rising.
	Periapsis
	// Apoapsis: the radial velocity crosses zero falling.
	Apoapsis
	// AscendingNode: z crosses zero rising (equatorial plane of the frame).
	AscendingNode
	// DescendingNode: z crosses zero falling.
	DescendingNode
	// Altitude: |r| - (Model.Re + Event.Altitude) crosses zero, in the
	// sense given by Event.Direction (+1 climbing, -1 descending, 0 both).
	// The altitude is above the sphere of radius Re, not an ellipsoid.
	Altitude
)

func (k EventKind) String() string {
	switch k {
	case Custom:
		return "custom"
	case Periapsis:
		return "periapsis"
	case Apoapsis:
		return "apoapsis"
	case AscendingNode:
		return "ascending_node"
	case DescendingNode:
		return "descending_node"
	case Altitude:
		return "altitude"
	}
	return fmt.Sprintf("EventKind(%d)", int(k))
}

// Event is an orbital event to locate: a sign change of a function of the
// state, found to Options.EventTol on the dense output.
type Event struct {
	Name     string    // reported in EventHit.Name; empty means the kind's name
	Kind     EventKind // which function; Custom uses G
	Altitude float64   // km above Model.Re, for Kind Altitude
	// Direction filters Custom and Altitude crossings by the sense in
	// which the function changes with increasing time: +1 rising, -1
	// falling, 0 both. The other kinds fix their own sense.
	Direction int
	// Terminal stops the run at the first crossing.
	Terminal bool
	// G is the event function of a Custom event, of time (s from the
	// initial state) and state. It is called at every step end.
	G func(t float64, s orbit.State) float64
}

func (e Event) name() string {
	if e.Name != "" {
		return e.Name
	}
	return e.Kind.String()
}

// EventHit is one located event.
type EventHit struct {
	Index     int         // index in Output.Events
	Name      string      // Event.Name or the kind's name
	Kind      EventKind   // kind of the event
	T         float64     // s from the initial state
	State     orbit.State // state at T (km, km/s)
	Direction int         // +1 the function rose through zero, -1 fell
}

// events translates orbital events into integrator events.
func (p *Propagator) events(list []Event) ([]integrate.Event, error) {
	out := make([]integrate.Event, len(list))
	for i, ev := range list {
		ie := integrate.Event{Terminal: ev.Terminal}
		switch ev.Kind {
		case Periapsis, Apoapsis:
			if p.polar {
				ie.G = func(_ float64, y []float64) float64 { return y[2] }
			} else {
				ie.G = func(_ float64, y []float64) float64 { return y[0]*y[3] + y[1]*y[4] + y[2]*y[5] }
			}
			ie.Direction = 1
			if ev.Kind == Apoapsis {
				ie.Direction = -1
			}
		case AscendingNode, DescendingNode:
			if p.polar {
				ie.G = func(_ float64, y []float64) float64 {
					sn, cs := math.Sincos(y[1])
					return y[0] * (cs*p.plane.P[2] + sn*p.plane.Q[2])
				}
			} else {
				ie.G = func(_ float64, y []float64) float64 { return y[2] }
			}
			ie.Direction = 1
			if ev.Kind == DescendingNode {
				ie.Direction = -1
			}
		case Altitude:
			if math.IsNaN(ev.Altitude) || math.IsInf(ev.Altitude, 0) {
				return nil, fmt.Errorf("%w: event %d altitude %g km", ErrOptions, i, ev.Altitude)
			}
			if !(p.model.Re > 0) {
				return nil, fmt.Errorf("%w: event %d: altitude events need Model.Re, the radius of the reference sphere", ErrOptions, i)
			}
			rr := p.model.Re + ev.Altitude
			if p.polar {
				ie.G = func(_ float64, y []float64) float64 { return y[0] - rr }
			} else {
				ie.G = func(_ float64, y []float64) float64 { return math.Sqrt(y[0]*y[0]+y[1]*y[1]+y[2]*y[2]) - rr }
			}
			ie.Direction = ev.Direction
		case Custom:
			if ev.G == nil {
				return nil, fmt.Errorf("%w: custom event %d has no function", ErrOptions, i)
			}
			g := ev.G
			ie.G = func(t float64, y []float64) float64 { return g(t, p.decode(y)) }
			ie.Direction = ev.Direction
		default:
			return nil, fmt.Errorf("%w: event %d has unknown kind %d", ErrOptions, i, int(ev.Kind))
		}
		if ev.Direction < -1 || ev.Direction > 1 {
			return nil, fmt.Errorf("%w: event %d direction %d, want -1, 0 or +1", ErrOptions, i, ev.Direction)
		}
		out[i] = ie
	}
	return out, nil
}
