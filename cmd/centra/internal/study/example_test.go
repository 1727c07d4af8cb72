package study_test

import (
	"fmt"

	"centra/cmd/centra/internal/study"
)

// A grid of two dimensions, the first the outer loop, split in two shards.
func ExampleNewPlan() {
	incl, _ := study.ParseVary("inclination=40:50:10")
	alt, _ := study.ParseVary("altitude=400km:600km:100km")
	p, _ := study.NewPlan([]study.Vary{incl, alt}, nil, 0, 0)
	for k := 1; k <= 2; k++ {
		sh := study.Shard{K: k, N: 2}
		lo, hi := sh.Range(p.Len())
		for i := lo; i < hi; i++ {
			c := p.Case(i)
			fmt.Printf("shard %d/2 case %d: --%s %s --%s %s\n", k, i, c[0].Name, c[0].Text, c[1].Name, c[1].Text)
		}
	}
	// Output:
	// shard 1/2 case 0: --inclination 40 --altitude 400km
	// shard 1/2 case 1: --inclination 40 --altitude 500km
	// shard 1/2 case 2: --inclination 40 --altitude 600km
	// shard 2/2 case 3: --inclination 50 --altitude 400km
	// shard 2/2 case 4: --inclination 50 --altitude 500km
	// shard 2/2 case 5: --inclination 50 --altitude 600km
}

// Monte Carlo draws: case i always gets the same values for a seed.
func ExampleParseDraw() {
	d, err := study.ParseDraw("speed=normal(2.1km/s,0.02km/s)")
	if err != nil {
		fmt.Println(err)
		return
	}
	p, _ := study.NewPlan(nil, []study.Draw{d}, 1000, 42)
	again, _ := study.NewPlan(nil, []study.Draw{d}, 1000, 42)
	v := p.Case(7)[0]
	fmt.Printf("--%s VALUE%s, nominal %s, case 7 reproducible: %v\n", v.Name, v.Unit, d.Nominal().Text, v == again.Case(7)[0])
	_, err = study.ParseDraw("speed=normal(2.1km/s,20m/s)")
	fmt.Println(err)
	// Output:
	// --speed VALUEkm/s, nominal 2.1km/s, case 7 reproducible: true
	// "speed=normal(2.1km/s,20m/s)": study: mixed units: units "km/s" and "m/s" differ; write every part in one unit
}
