package uncertainty

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"runtime/debug"
	"sort"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// ErrTooFewSuccesses is matched (errors.Is) by the error of Spread when no member succeeded
// and of MonteCarlo.Run when too few samples succeeded (see MonteCarlo.MinSuccess); the
// result returned with it still lists every failure.
var ErrTooFewSuccesses = errors.New("uncertainty: too few evaluations succeeded")

// Failure is a group of failed evaluations (model-family members or Monte Carlo samples) whose
// error messages are the same but for their numbers: "thickness W = -3e-05 cm must be > 0" and
// "thickness W = -1.2e-05 cm must be > 0" form one group, so that a distribution with mass
// where an input is invalid gives one line with a count, not one line per sample.
type Failure struct {
	Message string // the error message of the first evaluation of the group
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

// number matches a decimal number in an error message (an offending value, an index), which
// the grouping of failures ignores.
var number = regexp.MustCompile(`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`)

// groupFailures adds the non-nil errors of errs (index i is evaluation offset+i) to the groups
// into, by message with its numbers masked, in the order of first occurrence, and returns the
// groups.
func groupFailures(errs []error, offset int, into []Failure) []Failure {
	at := make(map[string]int, len(into))
	for i, f := range into {
		at[number.ReplaceAllString(f.Message, "#")] = i
	}
	for i, err := range errs {
		if err == nil {
			continue
		}
		msg := err.Error()
		if pe, ok := err.(*panicError); ok {
			msg = pe.key()
		}
		key := number.ReplaceAllString(msg, "#")
		if k, ok := at[key]; ok {
			into[k].Count++
			continue
		}
		at[key] = len(into)
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
