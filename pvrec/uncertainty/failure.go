package uncertainty

import (
	"errors"
	"fmt"
	"math"
	"runtime/debug"
	"sort"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// ErrTooFewSuccesses is matched (errors.Is) by the error of Spread when no member succeeded
// and of MonteCarlo.Run when too few samples succeeded (see MonteCarlo.MinSuccess); the
// result returned with it still lists every failure.
var ErrTooFewSuccesses = errors.New("uncertainty: too few evaluations succeeded")

// Failure is a group of failed evaluations (model-family members or Monte Carlo samples) that
// returned the same error message.
type Failure struct {
	Message string // the error message shared by the group
	Count   int    // number of evaluations that failed with it
	First   int    // index of the first of them (the member's index, or the sample's index: MonteCarlo.Draw(First) gives its inputs)
	Err     error  // the error of the first of them (for errors.Is and errors.As; for a panic it carries the stack)
}

// String returns e.g. `3 × (first at 17): j0: ...`.
func (f Failure) String() string {
	return fmt.Sprintf("%d × (first at %d): %s", f.Count, f.First, f.Message)
}

// panicError is a panic in the caller's function, recovered by evaluate.
type panicError struct {
	value any
	stack []byte
}

func (e *panicError) Error() string {
	return fmt.Sprintf("uncertainty: the function panicked: %v\n%s", e.value, e.stack)
}

// key is the message panics are grouped by: the panic value without the stack, which
// differs from goroutine to goroutine.
func (e *panicError) key() string {
	return fmt.Sprintf("uncertainty: the function panicked: %v", e.value)
}

// evaluate returns f(), turning a panic into an error and a result that is not finite or
// beyond check.MaxMagnitude into an error.
func evaluate(f func() (float64, error)) (v float64, err error) {
	defer func() {
		if p := recover(); p != nil {
			v, err = 0, &panicError{value: p, stack: debug.Stack()}
		}
	}()
	v, err = f()
	if err != nil {
		return 0, err
	}
	if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > check.MaxMagnitude {
		return 0, fmt.Errorf("uncertainty: the function returned %g without an error; want a finite result of magnitude <= %g", v, float64(check.MaxMagnitude))
	}
	return v, nil
}

// groupFailures adds the non-nil errors of errs (index i is evaluation offset+i) to the groups
// into, by message, in the order of first occurrence, and returns the groups.
func groupFailures(errs []error, offset int, into []Failure) []Failure {
	at := make(map[string]int, len(into))
	for i, f := range into {
		at[f.Message] = i
	}
	for i, err := range errs {
		if err == nil {
			continue
		}
		msg := err.Error()
		if pe, ok := err.(*panicError); ok {
			msg = pe.key()
		}
		if k, ok := at[msg]; ok {
			into[k].Count++
			continue
		}
		at[msg] = len(into)
		into = append(into, Failure{Message: msg, Count: 1, First: offset + i, Err: err})
	}
	return into
}

// sortFailures orders groups most frequent first, ties by the first index.
func sortFailures(g []Failure) {
	sort.SliceStable(g, func(i, j int) bool {
		if g[i].Count != g[j].Count {
			return g[i].Count > g[j].Count
		}
		return g[i].First < g[j].First
	})
}
