package lifetime

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

func TestGenerationRate(t *testing.T) {
	// G = J/(qW): 0.04 A/cm^2 in 0.018 cm (definition).
	g, err := GenerationRate(0.04, 0.018)
	want := 0.04 / (1.602176634e-19 * 0.018)
	if err != nil || math.Abs(g/want-1) > 1e-15 {
		t.Errorf("GenerationRate = %g, %v; want %g", g, err, want)
	}
	for _, c := range []struct{ j, w float64 }{{-1, 0.01}, {math.NaN(), 0.01}, {0.04, 0}, {0.04, math.Inf(1)}} {
		if _, err := GenerationRate(c.j, c.w); err == nil {
			t.Errorf("GenerationRate(%g, %g) accepted", c.j, c.w)
		}
	}
}

func TestSteadyStateExcessClosedForms(t *testing.T) {
	// Constant lifetime: Δn = g τ exactly (definition).
	tau := func(float64) (float64, error) { return 1e-3, nil }
	dn, err := SteadyStateExcess(1e18, tau)
	if err != nil || math.Abs(dn/1e15-1) > 1e-12 {
		t.Errorf("constant τ: Δn = %g, %v; want 1e15", dn, err)
	}
	// Pure quadratic recombination R = B Δn² (lifetime 1/(BΔn)): Δn = sqrt(g/B) (definition).
	b := 1e-14
	quad := func(x float64) (float64, error) { return 1 / (b * x), nil }
	dn, err = SteadyStateExcess(1e20, quad)
	if err != nil || math.Abs(dn/math.Sqrt(1e20/b)-1) > 1e-12 {
		t.Errorf("quadratic: Δn = %g, %v; want %g", dn, err, math.Sqrt(1e20/b))
	}
	if dn, err := SteadyStateExcess(0, tau); dn != 0 || err != nil {
		t.Errorf("g = 0: %g, %v", dn, err)
	}
}

func TestSteadyStateExcessWafer(t *testing.T) {
	// Round trip and monotonicity with the default intrinsic model: the balance holds and Δn
	// grows with g (property).
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	b, err := recomb.NewBulk(si, 0, 1e16)
	if err != nil {
		t.Fatal(err)
	}
	m := recomb.NewIntrinsic()
	tau := func(x float64) (float64, error) { return b.Lifetime(m, x) }
	prev := 0.0
	for _, g := range []float64{1e15, 1e17, 1e19, 1e21} {
		dn, err := SteadyStateExcess(g, tau)
		if err != nil {
			t.Fatalf("g = %g: %v", g, err)
		}
		tt, _ := tau(dn)
		if r := dn / tt; math.Abs(r/g-1) > 1e-10 {
			t.Errorf("g = %g: R(Δn) = %g", g, r)
		}
		if dn <= prev {
			t.Errorf("g = %g: Δn = %g not above %g", g, dn, prev)
		}
		prev = dn
	}
}

func TestSteadyStateExcessErrors(t *testing.T) {
	tau := func(float64) (float64, error) { return 1e-3, nil }
	for _, g := range []float64{-1, math.NaN(), math.Inf(1)} {
		if _, err := SteadyStateExcess(g, tau); err == nil || !strings.Contains(err.Error(), "generation rate g") {
			t.Errorf("g = %g: %v", g, err)
		}
	}
	if _, err := SteadyStateExcess(1, nil); err == nil {
		t.Errorf("nil tau accepted")
	}
	if _, err := SteadyStateExcess(1e30, tau); err == nil || !strings.Contains(err.Error(), "above") {
		t.Errorf("too much generation: %v", err)
	}
	if _, err := SteadyStateExcess(1e-20, tau); err == nil || !strings.Contains(err.Error(), "below") {
		t.Errorf("too little generation: %v", err)
	}
	boom := errors.New("boom")
	if _, err := SteadyStateExcess(1e18, func(float64) (float64, error) { return 0, boom }); !errors.Is(err, boom) {
		t.Errorf("tau error not passed on: %v", err)
	}
	if _, err := SteadyStateExcess(1e18, func(float64) (float64, error) { return math.NaN(), nil }); err == nil {
		t.Errorf("NaN lifetime accepted")
	}
}

// FuzzSteadyStateExcess: for a lifetime τ0/(1 + Δn/Nsat) and any g, the result balances
// generation or the function returns an error; never NaN or a panic.
func FuzzSteadyStateExcess(f *testing.F) {
	f.Add(1e18, 1e-3, 1e16)
	f.Add(1e10, 1e-6, 1e12)
	f.Add(1e24, 1e-2, 1e20)
	f.Fuzz(func(t *testing.T, g, tau0, nsat float64) {
		if !(tau0 > 0) || !(nsat > 0) || math.IsInf(tau0, 0) || math.IsInf(nsat, 0) {
			return
		}
		tau := func(x float64) (float64, error) { return tau0 / (1 + x/nsat), nil }
		dn, err := SteadyStateExcess(g, tau)
		if err != nil {
			return
		}
		if math.IsNaN(dn) || dn < 0 {
			t.Fatalf("g = %g: Δn = %g", g, dn)
		}
		if g > 0 {
			tt, _ := tau(dn)
			if r := dn / tt; math.Abs(r/g-1) > 1e-9 {
				t.Fatalf("g = %g, τ0 = %g, Nsat = %g: R(Δn = %g) = %g", g, tau0, nsat, dn, r)
			}
		}
	})
}

// TestSteadyStateExcessStaysNearAnswer: a lifetime model valid only for 1e10 <= Δn <= 1e18
// (like the surface model) is never asked outside that range when the answer lies well inside.
func TestSteadyStateExcessStaysNearAnswer(t *testing.T) {
	tau := func(x float64) (float64, error) {
		if x < 1e10 || x > 1e18 {
			return 0, errors.New("outside the model's range")
		}
		return 1e-3, nil
	}
	for _, want := range []float64{1e11, 1e13, 1e15, 1e16, 1e17} {
		dn, err := SteadyStateExcess(want/1e-3, tau)
		if err != nil || math.Abs(dn/want-1) > 1e-12 {
			t.Errorf("Δn = %g, %v; want %g", dn, err, want)
		}
	}
}
