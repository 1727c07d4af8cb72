package suborbital_test

import (
	"errors"
	"math"
	"testing"

	"centra/propagate"
	"centra/propagate/suborbital"
)

func TestErrors(t *testing.T) {
	b := earth()
	cfg := suborbital.Config{Gravity: propagate.J2(b.GM, b.EquatorialRadius, b.Jn(2)), Omega: b.RotationRate, Above: 100}
	f, err := suborbital.New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	ok := suborbital.Burnout{Lat: 0.5, Lon: 0.1, Alt: 10, Speed: 1.5, FlightPath: 80 * deg, Azimuth: 1}
	tests := []struct {
		name string
		b    suborbital.Burnout
		v    suborbital.Vehicle
		want error
	}{
		{"latitude", func() suborbital.Burnout { x := ok; x.Lat = 2; return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"nan latitude", func() suborbital.Burnout { x := ok; x.Lat = math.NaN(); return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"below impact surface", func() suborbital.Burnout { x := ok; x.Alt = -1; return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"zero speed", func() suborbital.Burnout { x := ok; x.Speed = 0; return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"flight path", func() suborbital.Burnout { x := ok; x.FlightPath = 2; return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"descending from the surface", func() suborbital.Burnout { x := ok; x.Alt = 0; x.FlightPath = -0.1; return x }(), suborbital.Vehicle{}, suborbital.ErrBurnout},
		{"escape", func() suborbital.Burnout { x := ok; x.Speed = 11.5; return x }(), suborbital.Vehicle{}, suborbital.ErrEscape},
		{"orbit", func() suborbital.Burnout {
			x := ok
			x.Alt = 300
			x.Speed = 7.8
			x.FlightPath = 0
			x.Azimuth = math.Pi / 2
			return x
		}(), suborbital.Vehicle{}, suborbital.ErrOrbit},
		{"partial vehicle", ok, suborbital.Vehicle{Mass: 10}, suborbital.ErrVehicle},
		{"negative area", ok, suborbital.Vehicle{Mass: 10, Area: -1, Cd: 1}, suborbital.ErrVehicle},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := f.Fly(tt.b, tt.v, nil)
			if !errors.Is(err, tt.want) {
				t.Errorf("Fly(%+v, %+v) error %v, want %v", tt.b, tt.v, err, tt.want)
			}
		})
	}
	// An orbit with drag is flown until MaxTime and reported as no impact.
	cfg.MaxTime = 600
	g, _ := suborbital.New(cfg)
	_, err = g.Fly(suborbital.Burnout{Alt: 400, Speed: 7.67, Azimuth: math.Pi / 2}, suborbital.Vehicle{Mass: 100, Area: 1, Cd: 2.2}, nil)
	if !errors.Is(err, suborbital.ErrNoImpact) {
		t.Errorf("orbit with drag: %v, want ErrNoImpact", err)
	}
	for _, bad := range []suborbital.Config{
		{},
		{Gravity: propagate.PointMass(b.GM), Above: math.NaN()},
		{Gravity: propagate.PointMass(b.GM), MaxTime: -1},
		{Gravity: propagate.PointMass(b.GM), ImpactAlt: -5000},
	} {
		if _, err := suborbital.New(bad); !errors.Is(err, suborbital.ErrConfig) {
			t.Errorf("New(%+v) = %v, want ErrConfig", bad, err)
		}
	}
}
