package silicon

import (
	"errors"
	"fmt"
)

// ErrOutOfRange is reported (through errors.Is) by every error of this package for an
// argument outside a model's validity range, as opposed to an argument that is invalid
// for any model (NaN, infinite, negative density, T <= 0).
var ErrOutOfRange = errors.New("silicon: argument outside the model's validity range")

// RangeError reports an argument outside a model's validity range [Min, Max].
// errors.Is(err, ErrOutOfRange) is true for it.
type RangeError struct {
	Model string  // short name of the model, e.g. "Couderc2014"
	Arg   string  // name of the argument, e.g. "temperature T"
	Unit  string  // unit of the argument, e.g. "K"
	Value float64 // offending value
	Min   float64 // lower end of the validity range
	Max   float64 // upper end of the validity range
}

// Error implements the error interface.
func (e *RangeError) Error() string {
	return fmt.Sprintf("silicon: %s: %s = %g %s outside validity range [%g, %g] %s",
		e.Model, e.Arg, e.Value, e.Unit, e.Min, e.Max, e.Unit)
}

// Is reports whether target is ErrOutOfRange.
func (e *RangeError) Is(target error) bool { return target == ErrOutOfRange }

// checkTRange returns an error unless t is a valid temperature within [tmin, tmax] K.
func checkTRange(model string, t, tmin, tmax float64) error {
	if err := checkTemperature(t); err != nil {
		return err
	}
	if !(t >= tmin && t <= tmax) { // also rejects NaN limits set by a user
		return &RangeError{Model: model, Arg: "temperature T", Unit: "K", Value: t, Min: tmin, Max: tmax}
	}
	return nil
}
