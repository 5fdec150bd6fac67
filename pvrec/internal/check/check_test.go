package check

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

func TestRangeErrorMatches(t *testing.T) {
	err := fmt.Errorf("outer: %w", Range("silicon", "Couderc2014", "temperature T", "K", 900, 78, 500))
	if !errors.Is(err, ErrOutOfRange) {
		t.Fatal("errors.Is(ErrOutOfRange) false")
	}
	var re *RangeError
	if !errors.As(err, &re) || re.Value != 900 || re.Max != 500 || re.Model != "Couderc2014" {
		t.Fatalf("errors.As: %+v", re)
	}
	const want = "outer: silicon: Couderc2014: temperature T = 900 K outside validity range [78, 500] K"
	if err.Error() != want {
		t.Errorf("message %q, want %q", err.Error(), want)
	}
	if (&RangeError{Model: "M", Arg: "x", Value: 2, Min: 0, Max: 1}).Error() == "" {
		t.Error("literal RangeError has an empty message")
	}
	if !errors.Is(NoConvergence("x: %d", 1), ErrNoConvergence) || errors.Is(NoConvergence("x"), ErrOutOfRange) {
		t.Error("NoConvergence matching")
	}
}

func TestValidators(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	for _, c := range []struct {
		name string
		err  error
		ok   bool
	}{
		{"Positive 1", Positive("p", "x", 1, "cm"), true},
		{"Positive 0", Positive("p", "x", 0, "cm"), false},
		{"Positive NaN", Positive("p", "x", nan, "cm"), false},
		{"Positive Inf", Positive("p", "x", inf, "cm"), false},
		{"NonNegative 0", NonNegative("p", "x", 0, ""), true},
		{"NonNegative -1", NonNegative("p", "x", -1, ""), false},
		{"NonNegative Inf", NonNegative("p", "x", inf, ""), false},
		{"PositiveOrInf Inf", PositiveOrInf("p", "x", inf, "s"), true},
		{"PositiveOrInf NaN", PositiveOrInf("p", "x", nan, "s"), false},
		{"NonNegativeOrInf Inf", NonNegativeOrInf("p", "x", inf, "cm/s"), true},
		{"NonNegativeOrInf -Inf", NonNegativeOrInf("p", "x", -inf, "cm/s"), false},
		{"Finite -3", Finite("p", "x", -3, ""), true},
		{"Finite NaN", Finite("p", "x", nan, ""), false},
		{"Window in", Window("p", "m", 300, 200, 400), true},
		{"Window out", Window("p", "m", 500, 200, 400), false},
	} {
		if (c.err == nil) != c.ok {
			t.Errorf("%s: err = %v, want ok %v", c.name, c.err, c.ok)
		}
	}
	if got := Positive("recomb: SRH", "TauN0", 0, "s").Error(); got != "recomb: SRH: TauN0 must be finite and > 0 s, got 0" {
		t.Errorf("message %q", got)
	}
}

func TestValidatorsDoNotAllocate(t *testing.T) {
	if n := testing.AllocsPerRun(100, func() {
		_ = Positive("recomb: SRH", "TauN0", 1e-3, "s")
		_ = Density("recomb", "Nt", 1e12)
		_ = Window("recomb", "Richter2012", 300, 290, 310)
	}); n != 0 {
		t.Errorf("validators allocate %v times on valid input", n)
	}
}

func TestPhysicalBounds(t *testing.T) {
	for _, c := range []struct {
		name    string
		err     error
		ok, rng bool
	}{
		{"Positive 1e300", Positive("p", "x", 1e300, "s"), false, true},
		{"Positive 1e-300", Positive("p", "x", 1e-300, "s"), false, true},
		{"Positive 1e-99", Positive("p", "x", 1e-99, "s"), true, false},
		{"NonNegative 1e-300", NonNegative("p", "x", 1e-300, ""), true, false},
		{"NonNegative 1e101", NonNegative("p", "x", 1e101, ""), false, true},
		{"Finite -1e300", Finite("p", "x", -1e300, ""), false, true},
		{"Density 5e22", Density("p", "Nd", 5e22), true, false},
		{"Density 6e22", Density("p", "Nd", 6e22), false, true},
		{"PositiveOrInf 1e300", PositiveOrInf("p", "x", 1e300, "s"), false, true},
		{"NonNegativeOrInf Inf", NonNegativeOrInf("p", "x", math.Inf(1), ""), true, false},
		{"Result Inf", Result("p", "x", math.Inf(1), ""), false, false},
		{"Result 1e200", Result("p", "x", 1e200, ""), false, true},
		{"Result 1e40", Result("p", "x", 1e40, ""), true, false},
	} {
		if (c.err == nil) != c.ok || errors.Is(c.err, ErrOutOfRange) != c.rng {
			t.Errorf("%s: err = %v, want ok %v, range error %v", c.name, c.err, c.ok, c.rng)
		}
	}
}
