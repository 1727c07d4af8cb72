package main

import (
	"errors"
	"fmt"
	"math"

	"github.com/urfave/cli/v2"

	"centra/cmd/centra/internal/quantity"
)

// quantityFlag reads flag name as a quantity of kind k. ok is false when
// the flag was not given.
func quantityFlag(c *cli.Context, name string, k quantity.Kind) (v float64, ok bool, err error) {
	if !c.IsSet(name) {
		return 0, false, nil
	}
	v, err = quantity.Parse(k, c.String(name))
	if err != nil {
		return 0, true, flagError(name, err)
	}
	return v, true, nil
}

// vectorFlag reads flag name as a vector x,y,z of kind k.
func vectorFlag(c *cli.Context, name string, k quantity.Kind) (v [3]float64, ok bool, err error) {
	if !c.IsSet(name) {
		return v, false, nil
	}
	v, err = quantity.Vector(k, c.String(name))
	if err != nil {
		return v, true, flagError(name, err)
	}
	return v, true, nil
}

// flagError names the flag and the bad text, and says how to fix it.
func flagError(name string, err error) error {
	var qe *quantity.Error
	if errors.As(err, &qe) {
		fix := qe.Hint
		if fix == "" {
			fix = "give a number" + unitExample(qe.Kind)
		}
		return &inputError{What: fmt.Sprintf("--%s %q is not a valid %s: %v", name, qe.Input, qe.Kind, qe.Err), Fix: fix}
	}
	return &inputError{What: fmt.Sprintf("--%s: %v", name, err), Fix: "run with --help for the expected form"}
}

func unitExample(k quantity.Kind) string {
	switch k {
	case quantity.Length:
		return ", for example 400km"
	case quantity.Speed:
		return ", for example 7.6km/s"
	case quantity.Angle:
		return ", for example 51.6deg"
	case quantity.Duration:
		return ", for example 90min or 1d6h"
	}
	return ""
}

// positive, nonNegative and inRange validate parsed values.
func requirePositive(name string, v float64, unit string) error {
	if !(v > 0) || math.IsInf(v, 0) {
		return inputErrorf("give a positive value", "--%s must be positive, got %g %s", name, v, unit)
	}
	return nil
}

// parseDurationFlag reads a duration flag that has a default.
func parseDurationFlag(c *cli.Context, name string) (float64, error) {
	v, err := quantity.Parse(quantity.Duration, c.String(name))
	if err != nil {
		return 0, flagError(name, err)
	}
	return v, nil
}
