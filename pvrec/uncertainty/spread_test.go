package uncertainty_test

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// emitter is a heavily doped phosphorus emitter (erfc, 2e20 cm^-3 at the surface,
// L = 0.3 µm) on a 1.5e16 cm^-3 boron wafer behind S = 1e4 cm/s (invented test case).
func emitter(scale, shift float64) j0.Region {
	return j0.Region{
		Profile: profile.Sum{
			profile.Erfc{Dopant: silicon.Donor, Surface: 2e20 * scale, Length: 0.3e-4 + shift},
			profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16},
		},
		Surface: j0.FixedS(1e4),
	}
}

// memberJ0 is the J0 in A/cm^2 of the emitter with member m's models at 300 K.
func memberJ0(m uncertainty.Member) (float64, error) {
	mat, err := m.Set.At(300)
	if err != nil {
		return 0, err
	}
	r, err := j0.NewSolver(j0.Models{Material: mat, Auger: m.Auger, Radiative: m.Radiative}).Solve(emitter(1, 0))
	return r.J0, err
}

// TestSpreadJ0: the model spread of J0 reports, for every member, exactly the J0 of its own
// solve (bit for bit), on any number of workers, and the default member's J0 is that of
// j0.DefaultModels.
func TestSpreadJ0(t *testing.T) {
	members, err := uncertainty.Members(uncertainty.Case{T: 300, Dopant: silicon.Donor})
	if err != nil {
		t.Fatal(err)
	}
	for _, workers := range []int{1, 2, 7} {
		r, err := uncertainty.Spread(members, workers, memberJ0)
		if err != nil {
			t.Fatal(err)
		}
		if r.Failed != 0 || r.Succeeded != len(members) {
			t.Fatalf("workers %d: %d failed: %v", workers, r.Failed, r.Failures)
		}
		for i, m := range members {
			want, err := memberJ0(m)
			if err != nil {
				t.Fatal(err)
			}
			if got := r.Members[i].Value; got != want || r.Members[i].Name != m.Name {
				t.Errorf("workers %d: member %d (%s): Spread %v, own solve %v", workers, i, m.Name, got, want)
			}
			if v := r.Members[i].Value; v < r.Min || v > r.Max {
				t.Errorf("member %d: %g outside the range [%g, %g]", i, v, r.Min, r.Max)
			}
		}
		if r.Members[r.MinIndex].Value != r.Min || r.Members[r.MaxIndex].Value != r.Max {
			t.Errorf("Min/MaxIndex do not point at Min/Max")
		}
		models, err := j0.DefaultModels(300)
		if err != nil {
			t.Fatal(err)
		}
		def, err := j0.NewSolver(models).Solve(emitter(1, 0))
		if err != nil {
			t.Fatal(err)
		}
		if r.DefaultIndex != 0 || r.DefaultValue != def.J0 {
			t.Errorf("default member %d J0 %v, j0.DefaultModels %v", r.DefaultIndex, r.DefaultValue, def.J0)
		}
		if !(r.DefaultRank >= 1 && r.DefaultRank <= r.Succeeded && r.DefaultPosition >= 0 && r.DefaultPosition <= 1) {
			t.Errorf("default rank %d, position %g", r.DefaultRank, r.DefaultPosition)
		}
		if workers == 2 {
			t.Logf("J0 spread: %.1f … %.1f fA/cm², default %.1f (rank %d of %d)", r.Min*1e15, r.Max*1e15, r.DefaultValue*1e15, r.DefaultRank, r.Succeeded)
		}
	}
}

// TestSpreadFailures: failing members are counted and grouped by message with the first
// index, a panic and a NaN are failures too, and no success at all is ErrTooFewSuccesses.
func TestSpreadFailures(t *testing.T) {
	members := make([]uncertainty.Member, 10)
	for i := range members {
		members[i].Name = fmt.Sprint("m", i)
	}
	members[4].Default = true
	f := func(m uncertainty.Member) (float64, error) {
		switch m.Name {
		case "m1", "m3", "m8":
			return 0, errors.New("invalid member")
		case "m5":
			panic("boom")
		case "m6":
			return math.NaN(), nil
		}
		return float64(len(m.Name) + int(m.Name[1]-'0')), nil
	}
	for _, workers := range []int{1, 3} {
		r, err := uncertainty.Spread(members, workers, f)
		if err != nil {
			t.Fatal(err)
		}
		if r.Failed != 5 || r.Succeeded != 5 {
			t.Fatalf("failed %d, succeeded %d", r.Failed, r.Succeeded)
		}
		if len(r.Failures) != 3 || r.Failures[0].Message != "invalid member" || r.Failures[0].Count != 3 || r.Failures[0].First != 1 {
			t.Errorf("failures %v", r.Failures)
		}
		if r.Failures[1].First != 5 || !strings.Contains(r.Failures[1].Message, "panicked: boom") || r.Failures[2].First != 6 {
			t.Errorf("failures %v", r.Failures)
		}
		// Successes m0, m2, m4, m7, m9: values 2, 4, 6, 9, 11; the default m4 is third.
		if r.Min != 2 || r.Max != 11 || r.DefaultIndex != 4 || r.DefaultValue != 6 || r.DefaultRank != 3 || r.DefaultPosition != 4.0/9 {
			t.Errorf("range %g … %g, default %d = %g rank %d position %g", r.Min, r.Max, r.DefaultIndex, r.DefaultValue, r.DefaultRank, r.DefaultPosition)
		}
		if s := r.String(); !strings.Contains(s, "default") || !strings.Contains(s, "3 × (first at 1): invalid member") {
			t.Errorf("String:\n%s", s)
		}
	}
	_, err := uncertainty.Spread(members, 0, func(uncertainty.Member) (float64, error) { return 0, errors.New("no") })
	if !errors.Is(err, uncertainty.ErrTooFewSuccesses) {
		t.Errorf("all failing: %v", err)
	}
	if _, err := uncertainty.Spread(nil, 0, f); err == nil || !strings.Contains(err.Error(), "empty") {
		t.Errorf("empty family: %v", err)
	}
	if _, err := uncertainty.Spread(members, 0, nil); err == nil {
		t.Errorf("nil f: no error")
	}
}
