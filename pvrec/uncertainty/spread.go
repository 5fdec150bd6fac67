package uncertainty

import (
	"errors"
	"fmt"
	"strings"

	"github.com/pvrec/pvrec/pvrec/sweep"
)

// MemberResult is the outcome of one member of a model family.
type MemberResult struct {
	Name    string  // the member's name
	Default bool    // the member is the package default
	Value   float64 // the computation's result, in its unit; 0 if Err is set
	Err     error   // the member's error; nil if it succeeded
}

// SpreadResult is the outcome of Spread: every member's result, the range of the successful
// ones and where the default lies in it. Values are in the unit of the computation.
type SpreadResult struct {
	Members         []MemberResult // one per member, in the order of the members
	Succeeded       int            // members that returned a result
	Min, Max        float64        // smallest and largest result of the successful members
	MinIndex        int            // index of the (first) member with Min
	MaxIndex        int            // index of the (first) member with Max
	DefaultIndex    int            // index of the default member (the first with Member.Default); −1 if there is none or it failed
	DefaultValue    float64        // the default member's result; 0 if DefaultIndex is −1
	DefaultRank     int            // 1 + the number of successful members with a smaller result (1: the default is the smallest); 0 if DefaultIndex is −1
	DefaultPosition float64        // (DefaultValue − Min)/(Max − Min), in [0, 1]; 0 if Max = Min or Default is −1
	Failed          int            // members that returned an error
	Failures        []Failure      // the failed members grouped by message (numbers aside), most frequent first
}

// errNoMembers is returned by Spread for an empty family.
var errNoMembers = errors.New("uncertainty: Spread: members is empty (no model to evaluate)")

// Spread evaluates f for every member of a model family, concurrently on workers goroutines
// (all cores if workers <= 0, via sweep.Run), and reports each member's result, the range and
// the default member's position in it. The result does not depend on workers. f must be safe
// for concurrent use. A member fails when f returns an error, panics (the panic becomes its
// error) or returns a value that is not finite or beyond 1e100 in magnitude; failures are
// counted and grouped in SpreadResult.Failures, never dropped.
//
// Spread returns an error for an empty members or a nil f, and, with the result, an error
// matching ErrTooFewSuccesses when no member succeeded.
func Spread(members []Member, workers int, f func(Member) (float64, error)) (SpreadResult, error) {
	if len(members) == 0 {
		return SpreadResult{}, errNoMembers
	}
	if f == nil {
		return SpreadResult{}, fmt.Errorf("uncertainty: Spread: function f is nil")
	}
	vals, errs := sweep.Run(len(members), workers, func(i int) (float64, error) {
		return evaluate(func() (float64, error) { return f(members[i]) })
	})
	r := SpreadResult{Members: make([]MemberResult, len(members)), DefaultIndex: -1, MinIndex: -1, MaxIndex: -1}
	def := -1
	for i, m := range members {
		mr := MemberResult{Name: m.Name, Default: m.Default, Value: vals[i]}
		if errs != nil && errs[i] != nil {
			mr.Value, mr.Err = 0, errs[i]
			r.Failed++
		} else {
			r.Succeeded++
			if r.MinIndex < 0 || mr.Value < r.Min {
				r.Min, r.MinIndex = mr.Value, i
			}
			if r.MaxIndex < 0 || mr.Value > r.Max {
				r.Max, r.MaxIndex = mr.Value, i
			}
		}
		if m.Default && def < 0 {
			def = i
		}
		r.Members[i] = mr
	}
	if errs != nil {
		r.Failures = groupFailures(errs, 0, nil)
		sortFailures(r.Failures)
	}
	if r.Succeeded == 0 {
		return r, fmt.Errorf("%w: all %d members of the model family failed (first: %s)", ErrTooFewSuccesses, len(members), r.Failures[0].Message)
	}
	if def >= 0 && r.Members[def].Err == nil {
		r.DefaultIndex, r.DefaultValue, r.DefaultRank = def, r.Members[def].Value, 1
		for _, m := range r.Members {
			if m.Err == nil && m.Value < r.DefaultValue {
				r.DefaultRank++
			}
		}
		if r.Max > r.Min {
			r.DefaultPosition = (r.DefaultValue - r.Min) / (r.Max - r.Min)
		}
	}
	return r, nil
}

// String returns a plain-text table: a summary line, the range and the default's position,
// one line per member (its result with %.6g, marked "default", "min" or "max") and the
// failure groups.
func (r SpreadResult) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "model spread: %d members, %d succeeded, %d failed\n", len(r.Members), r.Succeeded, r.Failed)
	if r.Succeeded > 0 {
		fmt.Fprintf(&b, "range %.6g … %.6g", r.Min, r.Max)
		if r.DefaultIndex >= 0 {
			fmt.Fprintf(&b, "; default %.6g, rank %d of %d, position %.2f", r.DefaultValue, r.DefaultRank, r.Succeeded, r.DefaultPosition)
		}
		b.WriteString("\n")
	}
	for i, m := range r.Members {
		var marks []string
		if i == r.DefaultIndex {
			marks = append(marks, "default")
		}
		if i == r.MinIndex {
			marks = append(marks, "min")
		}
		if i == r.MaxIndex {
			marks = append(marks, "max")
		}
		v := fmt.Sprintf("%-12.6g", m.Value)
		if m.Err != nil {
			v = fmt.Sprintf("%-12s", "failed")
		}
		fmt.Fprintf(&b, "%3d  %s %-12s %s\n", i, v, strings.Join(marks, ","), m.Name)
	}
	for _, f := range r.Failures {
		fmt.Fprintf(&b, "failed: %s\n", f)
	}
	return b.String()
}
