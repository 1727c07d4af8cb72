package bodies_test

import (
	"fmt"

	"centra/bodies"
)

func ExampleLookup() {
	earth, err := bodies.Lookup(" Earth ")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: GM = %.10g km^3/s^2, a = %.3f km, 1/f = %.9f, J2 = %.9e\n",
		earth.Name, earth.GM, earth.EquatorialRadius, 1/earth.Flattening, earth.Jn(2))
	fmt.Println("GM source:", earth.GMSource)

	_, err = bodies.Lookup("pluto")
	fmt.Println(err)
	// Output:
	// earth: GM = 398600.4418 km^3/s^2, a = 6378.137 km, 1/f = 298.257223563, J2 = 1.082626174e-03
	// GM source: WGS 84, NIMA TR8350.2 3rd ed. (2000), Table 3.1 (GM = 3986004.418e8 m^3/s^2; same in IERS Conventions 2010 Table 1.1)
	// bodies: unknown body "pluto"; use one of earth, jupiter, mars, mercury, moon, neptune, saturn, sun, uranus, venus, or define it in a bodies file
}

func ExampleParse() {
	const file = `
[body.trainer]
source = "invented for this example"
gm_km3_s2 = 3500.5
equatorial_radius_km = 600

[body.earth]   # override one constant, keep the others
j2 = 1.08262668e-3
`
	bs, err := bodies.Parse([]byte(file), "example.toml")
	if err != nil {
		fmt.Println(err)
		return
	}
	cat := bodies.NewCatalogue()
	if err := cat.Merge(bs...); err != nil {
		fmt.Println(err)
		return
	}
	tr, _ := cat.Lookup("trainer")
	earth, _ := cat.Lookup("earth")
	fmt.Printf("%s: GM = %g km^3/s^2 (%s)\n", tr.Name, tr.GM, tr.GMSource)
	fmt.Printf("%s: GM = %.10g km^3/s^2, J2 = %.9e\n", earth.Name, earth.GM, earth.Jn(2))

	_, err = bodies.Parse([]byte("[body.trainer]\ngm_km3_s2 = -1\nequatorial_radius_km = 600\n"), "bad.toml")
	fmt.Println(err)
	// Output:
	// trainer: GM = 3500.5 km^3/s^2 (invented for this example (bodies file example.toml))
	// earth: GM = 398600.4418 km^3/s^2, J2 = 1.082626680e-03
	// bodies: bad.toml:2: body "trainer": key "gm_km3_s2": -1 is not greater than 0; give the gravitational parameter GM in km^3/s^2, a number greater than 0
}
