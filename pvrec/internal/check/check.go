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

// Physical bounds shared by every validator.
const (
	// MaxMagnitude bounds every quantity pvrec takes or returns, in the field's units: none comes
	// near it (the largest, n·p products at the highest injection, stay below 1e45 cm^-6), so a
	// value beyond it is an absurd input or an overflow and is refused with a RangeError.
	MaxMagnitude = 1e100
	// MinPositive is the smallest positive value Positive accepts, the reciprocal of
	// MaxMagnitude: a thickness, time constant or diffusivity below it makes results overflow.
	MinPositive = 1 / MaxMagnitude
	// MaxDensity is the largest carrier, dopant or defect density accepted, in cm^-3: the
	// atomic density of silicon, 5.0e22 cm^-3 (8 atoms per cubic cell of 5.431 Å; handbook
	// value), exported as silicon.AtomDensity. No density in the crystal can exceed it.
	MaxDensity = 5.0e22
)

// bound returns the RangeError of a physical bound (no model: it holds for every model) with
// a message of its own.
func bound(arg, unit string, v, lo, hi float64, format string, a ...any) *RangeError {
	return &RangeError{Arg: arg, Unit: unit, Value: v, Min: lo, Max: hi, msg: fmt.Sprintf(format, a...)}
}

// magnitude returns a RangeError if |v| > MaxMagnitude (v finite).
func magnitude(ctx, name string, v float64, unit string) error {
	if math.Abs(v) > MaxMagnitude {
		return bound(name, unit, v, -MaxMagnitude, MaxMagnitude,
			"%s: %s = %g%s is beyond any physical value (|v| > %g)", ctx, name, v, spaced(unit), float64(MaxMagnitude))
	}
	return nil
}

// Finite returns an error unless v is finite, with |v| <= MaxMagnitude.
func Finite(ctx, name string, v float64, unit string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite%s, got %g", ctx, name, spaced(unit), v)
	}
	return magnitude(ctx, name, v, unit)
}

// Positive returns an error unless v is finite and > 0, with MinPositive <= v <= MaxMagnitude.
func Positive(ctx, name string, v float64, unit string) error {
	if !(v > 0) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite and > 0%s, got %g", ctx, name, spaced(unit), v)
	}
	if v < MinPositive {
		return bound(name, unit, v, MinPositive, MaxMagnitude,
			"%s: %s = %g%s is below any physical value (< %g)", ctx, name, v, spaced(unit), float64(MinPositive))
	}
	return magnitude(ctx, name, v, unit)
}

// NonNegative returns an error unless v is finite and >= 0, with v <= MaxMagnitude.
func NonNegative(ctx, name string, v float64, unit string) error {
	if !(v >= 0) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s must be finite and >= 0%s, got %g", ctx, name, spaced(unit), v)
	}
	return magnitude(ctx, name, v, unit)
}

// PositiveOrInf returns an error unless v > 0 (+Inf allowed, e.g. a perfect bulk lifetime;
// a finite v must be in [MinPositive, MaxMagnitude]).
func PositiveOrInf(ctx, name string, v float64, unit string) error {
	if !(v > 0) {
		return fmt.Errorf("%s: %s must be > 0%s (or +Inf), got %g", ctx, name, spaced(unit), v)
	}
	if math.IsInf(v, 1) {
		return nil
	}
	return Positive(ctx, name, v, unit)
}

// NonNegativeOrInf returns an error unless v >= 0 (+Inf allowed, e.g. an ohmic contact's S;
// a finite v must be <= MaxMagnitude).
func NonNegativeOrInf(ctx, name string, v float64, unit string) error {
	if !(v >= 0) {
		return fmt.Errorf("%s: %s must be >= 0%s (or +Inf), got %g", ctx, name, spaced(unit), v)
	}
	if math.IsInf(v, 1) {
		return nil
	}
	return magnitude(ctx, name, v, unit)
}

// Density returns an error unless v is a finite, non-negative density in cm^-3 no larger
// than MaxDensity (a RangeError above it).
func Density(ctx, name string, v float64) error {
	if err := NonNegative(ctx, name, v, "cm^-3"); err != nil {
		return err
	}
	if v > MaxDensity {
		return bound(name, "cm^-3", v, 0, MaxDensity,
			"%s: %s = %g cm^-3 exceeds the atomic density of silicon, %g cm^-3", ctx, name, v, float64(MaxDensity))
	}
	return nil
}

// Temperature returns an error unless t is a finite, positive temperature in K. The upper
// bound is each model's window (and silicon.MeltingPoint for the material).
func Temperature(ctx string, t float64) error {
	if !(t > 0) || math.IsInf(t, 0) {
		return fmt.Errorf("%s: temperature T must be finite and > 0 K, got %g", ctx, t)
	}
	return nil
}

// Result returns an error unless a computed result v is finite with |v| <= MaxMagnitude: the
// last check of a function whose valid inputs could still overflow ("ctx: name = +Inf ...
// overflows"). It matches pvrec.ErrOutOfRange when v is finite but too large.
func Result(ctx, name string, v float64, unit string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Errorf("%s: %s = %g%s: the computation overflows for these inputs", ctx, name, v, spaced(unit))
	}
	return magnitude(ctx, name, v, unit)
}

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
