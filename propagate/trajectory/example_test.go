package trajectory_test

import (
	"fmt"

	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
)

func ExampleSample() {
	// One day of a 500 km circular orbit with J2, sampled so that the
	// interpolated position is within 0.1 m of the propagated one.
	const mu, re, j2 = 398600.4418, 6378.137, 1.0826266835531513e-3
	s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: re + 500, P: re + 500, I: 1.7})
	p, _ := propagate.New(propagate.J2(mu, re, j2), propagate.Options{})
	tr, _ := trajectory.Sample(p, s0, 86400, trajectory.Options{PositionTol: 1e-4})
	r, _ := tr.At(3600.5)
	b := tr.Bound()
	fmt.Printf("%d samples, step %.2f s, bound %.3f m\n", tr.Len(), tr.Step(), b.Position*1e3)
	fmt.Printf("r(3600.5 s) = %.3f %.3f %.3f km\n", r[0], r[1], r[2])
	// Output:
	// 5198 samples, step 16.62 s, bound 0.092 m
	// r(3600.5 s) = -4549.488 661.100 -5106.297 km
}
