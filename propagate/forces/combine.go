package forces

import (
	"centra/orbit"
	"centra/propagate"
)

// Combine returns the sum of the perturbations, skipping nil ones: nil
// when none is left, the perturbation itself when one is. The first error
// returned by a term stops the sum and is returned. The list is copied.
func Combine(ps ...propagate.Perturbation) propagate.Perturbation {
	var list []propagate.Perturbation
	for _, p := range ps {
		if p != nil {
			list = append(list, p)
		}
	}
	switch len(list) {
	case 0:
		return nil
	case 1:
		return list[0]
	}
	return func(t float64, s orbit.State) ([3]float64, error) {
		var a [3]float64
		for _, p := range list {
			ai, err := p(t, s)
			if err != nil {
				return a, err
			}
			a[0] += ai[0]
			a[1] += ai[1]
			a[2] += ai[2]
		}
		return a, nil
	}
}
