// Package check holds the error vocabulary and the argument validators that every pvrec
// package shares, so that "outside the model's range" and "did not converge" are said one way
// and matched one way. Callers outside the module match these errors through the root package
// (pvrec.ErrOutOfRange, pvrec.RangeError, pvrec.ErrNoConvergence), which re-exports them.
//
// The validators return nil or an error whose message starts with the caller's context
// (package and function, e.g. "recomb: SRH") and names the argument, its unit and the value.
// They never allocate when the value is valid, so hot paths may call them on every evaluation.
package check

import (
	"errors"
	"fmt"
	"math"
)

// ErrOutOfRange is matched (errors.Is) by every error that reports an argument outside a
// model's validity range, as opposed to an argument that is invalid for any model (NaN,
// infinite, a negative density, T <= 0).
var ErrOutOfRange = errors.New("argument outside the model's validity range")

// ErrNoConvergence is matched (errors.Is) by every error of an iterative solver that could not
// meet its tolerance within its limits; the result is then withheld rather than returned
// inaccurate.
var ErrNoConvergence = errors.New("solver did not converge")

// RangeError reports an argument outside a model's validity range [Min, Max] (Min or Max is
// NaN where the range is not an interval of that argument, e.g. a level outside the gap).
// errors.Is(err, ErrOutOfRange) is true for it; errors.As gives the fields.
type RangeError struct {
	Model string  // short name of the model, e.g. "Couderc2014"
	Arg   string  // name of the argument, e.g. "temperature T"
	Unit  string  // unit of the argument, e.g. "K"
	Value float64 // offending value
	Min   float64 // lower end of the validity range
	Max   float64 // upper end of the validity range
	msg   string
}

// Error returns the message, e.g. "silicon: Couderc2014: temperature T = 900 K outside
// validity range [78, 500] K".
// A RangeError built as a literal (no message) reports its fields.
func (e *RangeError) Error() string {
	if e.msg == "" {
		return fmt.Sprintf("%s: %s = %g%s outside validity range [%g, %g]", e.Model, e.Arg, e.Value, spaced(e.Unit), e.Min, e.Max)
	}
	return e.msg
}

// Is reports whether target is ErrOutOfRange.
func (e *RangeError) Is(target error) bool { return target == ErrOutOfRange }

// Range returns the RangeError "pkg: model: arg = v unit outside validity range [lo, hi] unit".
func Range(pkg, model, arg, unit string, v, lo, hi float64) *RangeError {
	u := unit
	if u != "" {
		u = " " + u
	}
	return &RangeError{Model: model, Arg: arg, Unit: unit, Value: v, Min: lo, Max: hi,
		msg: fmt.Sprintf("%s: %s: %s = %g%s outside validity range [%g, %g]%s", pkg, model, arg, v, u, lo, hi, u)}
}

// Rangef returns a RangeError for argument arg of model with value v, range [lo, hi], and a
// message of its own (which should start with the package name, "recomb: ...").
func Rangef(model, arg string, v, lo, hi float64, format string, a ...any) *RangeError {
	return &RangeError{Model: model, Arg: arg, Value: v, Min: lo, Max: hi, msg: fmt.Sprintf(format, a...)}
}

// NoConvergence returns an error matching ErrNoConvergence with a formatted message (which
// should start with the package name).
func NoConvergence(format string, a ...any) error {
	return &convergenceError{msg: fmt.Sprintf(format, a...)}
}

type convergenceError struct{ msg string }

func (e *convergenceError) Error() string        { return e.msg }
func (e *convergenceError) Is(target error) bool { return target == ErrNoConvergence }

// Finite returns an error unless v is finite.
func Finite(ctx, name string, v float64, unit string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite%s, got %g", ctx, name, spaced(unit), v)
	}
	return nil
}

// Positive returns an error unless v is finite and > 0.
func Positive(ctx, name string, v float64, unit string) error {
	if !(v > 0) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite and > 0%s, got %g", ctx, name, spaced(unit), v)
	}
	return nil
}

// NonNegative returns an error unless v is finite and >= 0.
func NonNegative(ctx, name string, v float64, unit string) error {
	if !(v >= 0) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite and >= 0%s, got %g", ctx, name, spaced(unit), v)
	}
	return nil
}

// PositiveOrInf returns an error unless v > 0 (+Inf allowed, e.g. a perfect bulk lifetime).
func PositiveOrInf(ctx, name string, v float64, unit string) error {
	if !(v > 0) {
		return fmt.Errorf("%s: %s must be > 0%s (or +Inf), got %g", ctx, name, spaced(unit), v)
	}
	return nil
}

// NonNegativeOrInf returns an error unless v >= 0 (+Inf allowed, e.g. an ohmic contact's S).
func NonNegativeOrInf(ctx, name string, v float64, unit string) error {
	if !(v >= 0) {
		return fmt.Errorf("%s: %s must be >= 0%s (or +Inf), got %g", ctx, name, spaced(unit), v)
	}
	return nil
}

// Density returns an error unless v is a finite, non-negative density in cm^-3.
func Density(ctx, name string, v float64) error { return NonNegative(ctx, name, v, "cm^-3") }

// Temperature returns an error unless t is a finite, positive temperature in K.
func Temperature(ctx string, t float64) error { return Positive(ctx, "temperature T", t, "K") }

// Window returns a RangeError unless tmin <= t <= tmax: the temperature window of a model,
// "pkg: model: temperature T = 350 K outside the model's window [290, 310] K".
func Window(pkg, model string, t, tmin, tmax float64) error {
	if !(t >= tmin && t <= tmax) {
		e := Range(pkg, model, "temperature T", "K", t, tmin, tmax)
		e.msg = fmt.Sprintf("%s: %s: temperature T = %g K outside the model's window [%g, %g] K", pkg, model, t, tmin, tmax)
		return e
	}
	return nil
}

func spaced(unit string) string {
	if unit == "" {
		return ""
	}
	return " " + unit
}
