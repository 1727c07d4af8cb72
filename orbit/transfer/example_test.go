package transfer_test

import (
	"fmt"
	"math"

	"centra/orbit/transfer"
)

// The Hohmann transfer of Vallado, Fundamentals of Astrodynamics and
// Applications, 4th ed., Example 6-1: from 191.34411 km to 35781.34857 km
// altitude. The printed digits match the book's answer.
func ExampleHohmann() {
	const mu, re = 398600.4418, 6378.137 // km^3/s^2, km
	p, err := transfer.Hohmann(mu, re+191.34411, re+35781.34857)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, b := range p.Burns {
		fmt.Printf("%-9s dv = %.7g km/s at t = %.7g h\n", b.Label, b.DeltaV, b.Time/3600)
	}
	fmt.Printf("total     dv = %.7g km/s, transfer time %.7g h\n", p.DVTotal, p.TransferTime/3600)
	// Output:
	// departure dv = 2.457038 km/s at t = 0 h
	// arrival   dv = 1.478187 km/s at t = 5.256713 h
	// total     dv = 3.935224 km/s, transfer time 5.256713 h
}

// A Hohmann transfer from a 28.5 deg low orbit to an equatorial one at
// geostationary radius, with the plane change split optimally between the
// two burns, and its propellant for a 1500 kg spacecraft with Isp 320 s.
func ExampleHohmannPlaneChange() {
	const mu, re = 398600.4418, 6378.137 // km^3/s^2, km
	p, err := transfer.HohmannPlaneChange(mu, re+191.34411, re+35781.34857, 28.5*math.Pi/180)
	if err != nil {
		fmt.Println(err)
		return
	}
	steps, err := transfer.PropellantBudget(p.Burns, 320, 1500)
	if err != nil {
		fmt.Println(err)
		return
	}
	for i, b := range p.Burns {
		fmt.Printf("%-9s dv = %.5f km/s, plane change %.4f deg, propellant %.1f kg\n",
			b.Label, b.DeltaV, b.PlaneChange*180/math.Pi, steps[i].Propellant)
	}
	fmt.Printf("total     dv = %.5f km/s\n", p.DVTotal)
	// Output:
	// departure dv = 2.48015 km/s, plane change 2.1667 deg, propellant 819.5 kg
	// arrival   dv = 1.78996 km/s, plane change 26.3333 deg, propellant 295.8 kg
	// total     dv = 4.27011 km/s
}

// Catching up with a target 20 deg ahead in a circular orbit of two Earth
// radii, in one or in two revolutions of the phasing orbit.
func ExamplePhasing() {
	const mu, re = 398600.4418, 6378.137 // km^3/s^2, km
	for _, revs := range []int{1, 2} {
		p, err := transfer.Phasing(mu, 2*re, 20*math.Pi/180, revs, re+200)
		if err != nil {
			fmt.Println(err)
			return
		}
		l := p.Legs[0]
		fmt.Printf("%d rev: perigee %.1f km, period %.1f s, dv %.4f km/s, %.1f s\n",
			revs, l.Periapsis, l.Period, p.DVTotal, p.TransferTime)
	}
	// Output:
	// 1 rev: perigee 11802.4 km, period 13541.7 s, dv 0.2193 km/s, 13541.7 s
	// 2 rev: perigee 12281.6 km, period 13940.0 s, dv 0.1065 km/s, 27880.0 s
}
