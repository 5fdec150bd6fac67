package j0

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/internal/reftable"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

func relErr(got, want float64) float64 { return math.Abs(got/want - 1) }

// TestBaseReference checks J0 against testdata/reference/j0_base.csv (the textbook general form,
// M. A. Green, Solar Cells, Prentice-Hall 1982, evaluated with mpmath). Tolerance 1e-14: a
// sqrt, a tanh and a few products.
func TestBaseReference(t *testing.T) {
	for _, r := range reftable.Load(t, "j0_base").Rows {
		var v [7]float64
		for i := range v {
			v[i] = reftable.Float(t, r[i])
		}
		b := Base{NiEff: v[0], Doping: v[1], Width: v[2], Tau: v[3], D: v[4], S: v[5]}
		got, err := b.J0()
		if err != nil {
			t.Fatal(err)
		}
		if e := relErr(got, v[6]); e > 1e-14 {
			t.Errorf("%v: J0 = %.16g A/cm², want %.16g (rel err %g)", b, got, v[6], e)
		}
	}
}

// TestBaseLimits checks the general form against its limits (textbook results, Green 1982):
// W/L → ∞ gives the long-base J0 for any S; W/L → 0 gives the thin-base J0 to first order
// (relative error of order (W/L)²); S = D/L gives the long-base J0 for any W; J0 rises with S.
func TestBaseLimits(t *testing.T) {
	base := Base{NiEff: 1e10, Doping: 1e16, Tau: 1e-3, D: 30}
	l := math.Sqrt(base.D * base.Tau)
	for _, s := range []float64{0, 1, 100, 1e5, math.Inf(1)} {
		b := base
		b.S = s
		b.Width = 40 * l // tanh(40) = 1 − 4e-35
		g, _ := b.J0()
		lb, _ := b.J0LongBase()
		if relErr(g, lb) > 1e-15 {
			t.Errorf("S=%g, W=40L: J0 = %g, long-base %g", s, g, lb)
		}
		b.Width = 1e-4 * l
		g, _ = b.J0()
		tb, _ := b.J0ThinBase()
		if relErr(g, tb) > 1e-7 { // (W/L)² = 1e-8, with coefficients of order 1
			t.Errorf("S=%g, W=1e-4 L: J0 = %g, thin-base %g", s, g, tb)
		}
	}
	// Thin-base closed forms: S = 0 gives q n0 W/τ, S = ∞ gives q n0 D/W.
	b := base
	b.Width = 0.018
	b.S = 0
	tb, _ := b.J0ThinBase()
	if want := q * 1e4 * 0.018 / 1e-3; relErr(tb, want) > 1e-15 {
		t.Errorf("thin base S=0: %g, want %g", tb, want)
	}
	b.S = math.Inf(1)
	tb, _ = b.J0ThinBase()
	if want := q * 1e4 * 30 / 0.018; relErr(tb, want) > 1e-15 {
		t.Errorf("thin base S=∞: %g, want %g", tb, want)
	}
	// S = D/L: the rear looks like an infinite base.
	for _, w := range []float64{1e-3, 0.018, 0.5} {
		b := base
		b.Width, b.S = w, base.D/l
		g, _ := b.J0()
		lb, _ := b.J0LongBase()
		if relErr(g, lb) > 1e-15 {
			t.Errorf("S=D/L, W=%g: J0 = %g, long-base %g", w, g, lb)
		}
	}
	// Monotonic in S up to the largest accepted S (check.MaxMagnitude = 1e100) and S = +Inf;
	// an absurd finite S such as 1e300 is refused (pvrec.ErrOutOfRange).
	b300 := base
	b300.Width, b300.S = 0.018, 1e300
	if _, err := b300.J0(); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("S = 1e300: err = %v, want ErrOutOfRange", err)
	}
	last := 0.0
	for _, s := range []float64{0, 1, 10, 100, 1e3, 1e4, 1e6, 1e100, math.Inf(1)} {
		b := base
		b.Width, b.S = 0.018, s
		g, err := b.J0()
		if err != nil || !(g >= last) {
			t.Errorf("S=%g: J0 = %g, err %v, not >= %g", s, g, err, last)
		}
		last = g
	}
}

// TestNewBase checks that NewBase takes the equilibrium minority density of the bulk:
// NiEff²/Doping = p0 for n-type silicon (definition).
func TestNewBase(t *testing.T) {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	bulk, err := recomb.NewBulk(m, 1e16, 0)
	if err != nil {
		t.Fatal(err)
	}
	b, err := NewBase(bulk, 0.018, 1e-3, 12, 10)
	if err != nil {
		t.Fatal(err)
	}
	if eq := bulk.Equilibrium(); relErr(b.minority(), eq.P0) > 1e-12 {
		t.Errorf("minority density %g, want p0 = %g", b.minority(), eq.P0)
	}
}

// TestBadInput checks errors that start with "j0:" and name the field (house rule 5).
func TestBadInput(t *testing.T) {
	good := Base{NiEff: 1e10, Doping: 1e16, Width: 0.018, Tau: 1e-3, D: 30, S: 10}
	nan := math.NaN()
	for _, tc := range []struct {
		modif func(*Base)
		want  string
	}{
		{func(b *Base) { b.NiEff = 0 }, "NiEff"},
		{func(b *Base) { b.Doping = -1 }, "Doping"},
		{func(b *Base) { b.Width = nan }, "Width"},
		{func(b *Base) { b.Tau = math.Inf(1) }, "Tau"},
		{func(b *Base) { b.D = 0 }, "D"},
		{func(b *Base) { b.S = -1 }, "S"},
		{func(b *Base) { b.S = nan }, "S"},
	} {
		b := good
		tc.modif(&b)
		for name, fn := range map[string]func() (float64, error){"J0": b.J0, "J0ThinBase": b.J0ThinBase, "J0LongBase": b.J0LongBase} {
			if name == "J0LongBase" && tc.want == "S" {
				continue // S is not used by the long-base limit
			}
			_, err := fn()
			if err == nil {
				t.Errorf("%s with bad %s: no error", name, tc.want)
				continue
			}
			if msg := err.Error(); !strings.HasPrefix(msg, "j0: ") || !strings.Contains(msg, tc.want) {
				t.Errorf("%s: error %q, want prefix \"j0: \" and %q", name, msg, tc.want)
			}
		}
	}
	if _, err := NewBase(nil, 0.018, 1e-3, 30, 10); err == nil || !strings.HasPrefix(err.Error(), "j0: ") {
		t.Errorf("NewBase(nil): err %v", err)
	}
}
