package pvrec

import "github.com/pvrec/pvrec/pvrec/internal/check"

// ErrOutOfRange is matched (errors.Is) by every pvrec error that reports an argument outside a
// model's validity range (a temperature outside a model's window, a density beyond a model's
// fit, a defect level outside the gap), as opposed to an argument that is invalid for any
// model (NaN, infinite, a negative density). One sentinel serves every package.
var ErrOutOfRange = check.ErrOutOfRange

// ErrNoConvergence is matched (errors.Is) by every pvrec error of an iterative solver (a
// bracketed root, the surface band-bending solve, the J0 mesh refinement) that could not meet
// its tolerance within its limits: the result is withheld, never returned inaccurate.
var ErrNoConvergence = check.ErrNoConvergence

// RangeError is the error value behind ErrOutOfRange where the offending argument is known:
// errors.As(err, &re) with re of type *pvrec.RangeError gives the model, the argument, its
// unit, its value and the validity range [Min, Max] (NaN where the range is not an interval).
type RangeError = check.RangeError
