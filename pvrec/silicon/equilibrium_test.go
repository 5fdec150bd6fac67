package silicon

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/fermi"

	"github.com/pvrec/pvrec/pvrec"
)

// residual returns |n0 − p0 − Nd⁺ + Na⁻| relative to the sum of the magnitudes.
func residual(e Equilibrium) float64 {
	return math.Abs(e.N0-e.P0-e.NdIon+e.NaIon) / (e.N0 + e.P0 + e.NdIon + e.NaIon)
}

// neutralityTol is the test tolerance on residual: the solver stops when the Newton step in
// the reduced Fermi level is below 1e-14·max(1, |η|) (|η| < 100), after which one quadratic
// step leaves rounding only; subtracting densities of 1e20 leaves a few ulp, 1e-15.
const neutralityTol = 1e-13

func TestEquilibriumReference(t *testing.T) {
	// Charge neutrality solved with mpmath at 40 digits (testdata/reference/silicon_statistics.py), Couderc2014
	// ni, Green1990 DOS, no BGN. Both the majority and the minority density must match to
	// 1e-13 relative: the minority density is computed from its own Fermi level, without
	// cancellation, even at 3e20 cm^-3 (fermi's F_{1/2} is accurate to ~1e-15).
	for _, r := range readReference(t, "eq") {
		st := FermiDirac
		if r.stat == "B" {
			st = Boltzmann
		}
		m := mustAt(t, testSet(st), r.t)
		e, err := m.Equilibrium(r.a, r.b)
		if err != nil {
			t.Fatal(err)
		}
		if relErr(e.N0, r.x) > 1e-13 || relErr(e.P0, r.y) > 1e-13 {
			t.Errorf("%s T = %g Nd = %g Na = %g: n0 = %.17g p0 = %.17g, mpmath %.17g %.17g (rel %.2g %.2g)",
				r.stat, r.t, r.a, r.b, e.N0, e.P0, r.x, r.y, relErr(e.N0, r.x), relErr(e.P0, r.y))
		}
	}
}

// grid of (Nd, Na) pairs spanning intrinsic, moderate, degenerate and compensated silicon.
func grid() [][2]float64 {
	var g [][2]float64
	for _, d := range []float64{0, 1e10, 1e13, 1e15, 1e16, 1e17, 1e18, 1e19, 5e19, 1e20, 3e20, 1e21} {
		g = append(g, [2]float64{d, 0}, [2]float64{0, d}, [2]float64{d, d / 3}, [2]float64{d, d})
	}
	return g
}

func TestEquilibriumProperties(t *testing.T) {
	sets := map[string]ModelSet{
		"FD, no BGN":        testSet(FermiDirac),
		"Boltzmann, no BGN": testSet(Boltzmann),
		"default":           DefaultModelSet(),
		"Boltzmann, Klaassen": func() ModelSet {
			ms := testSet(Boltzmann)
			ms.BGN = NewKlaassenSlotboomDeGraaff1992()
			return ms
		}(),
	}
	for name, ms := range sets {
		for _, tk := range []float64{200, 300, 400} {
			m := mustAt(t, ms, tk)
			for _, c := range grid() {
				e, err := m.Equilibrium(c[0], c[1])
				if name == "default" && c[0] == c[1] && errors.Is(err, pvrec.ErrOutOfRange) {
					// Schenk1998 refuses strongly compensated points (too few carriers to
					// screen the ions): an pvrec.ErrOutOfRange from the BGN model is correct.
					continue
				}
				if err != nil {
					t.Fatalf("%s T = %g %v: %v", name, tk, c, err)
				}
				if r := residual(e); !(r <= neutralityTol) {
					t.Errorf("%s T = %g %v: neutrality residual %g", name, tk, c, r)
				}
				// n0 p0 = ni,eff² by construction; NiEff = sqrt(n0) sqrt(p0) to rounding.
				if relErr(e.NiEff*e.NiEff, e.N0*e.P0) > 1e-14 {
					t.Errorf("%s %v: NiEff² %g vs n0 p0 %g", name, c, e.NiEff*e.NiEff, e.N0*e.P0)
				}
				// The reported Fermi level reproduces the densities (round trip) and the band
				// edges are Eg,stat − ΔEg apart.
				f := math.Exp
				if ms.Statistics == FermiDirac {
					f = fermi.Half
				}
				if relErr(m.Nc()*f(e.EFMinusEc/m.Vt()), e.N0) > 1e-13 || relErr(m.Nv()*f(e.EvMinusEF/m.Vt()), e.P0) > 1e-13 {
					t.Errorf("%s %v: Fermi level does not reproduce n0, p0", name, c)
				}
				if math.Abs(e.EFMinusEc+e.EvMinusEF+m.StatGap()-e.DeltaEg) > 1e-13 {
					t.Errorf("%s %v: EF − Ec + Ev − EF = %g, want −(Eg,stat − ΔEg) = %g", name, c,
						e.EFMinusEc+e.EvMinusEF, e.DeltaEg-m.StatGap())
				}
				// ΔEg is self-consistent: the BGN model at the solution returns it.
				d, err := m.DeltaEg(e.N0, e.P0, e.NdIon, e.NaIon)
				if err != nil || math.Abs(d-e.DeltaEg) > 1e-13 {
					t.Errorf("%s %v: ΔEg %g vs BGN at solution %g (%v)", name, c, e.DeltaEg, d, err)
				}
			}
		}
	}
}

func TestMassAction(t *testing.T) {
	// Non-degenerate silicon without BGN: n0 p0 = ni² (mass-action law, textbook). Exact
	// under Boltzmann statistics (closed form, rounding 1e-15); under Fermi–Dirac
	// n0 p0 = ni² γn γp with γ = 1 − y/2^{3/2} + O(y²), y = n0/Nc (series of F_{1/2}).
	mb := mustAt(t, testSet(Boltzmann), 300)
	mf := mustAt(t, testSet(FermiDirac), 300)
	ni2 := mb.Ni() * mb.Ni()
	for _, nd := range []float64{0, 1e8, 1e12, 1e14, 1e15, 1e16} {
		for _, c := range [][2]float64{{nd, 0}, {0, nd}} {
			b, err := mb.Equilibrium(c[0], c[1])
			if err != nil {
				t.Fatal(err)
			}
			if relErr(b.N0*b.P0, ni2) > 4e-15 {
				t.Errorf("Boltzmann %v: n0 p0 = %.17g, ni² = %.17g", c, b.N0*b.P0, ni2)
			}
			f, err := mf.Equilibrium(c[0], c[1])
			if err != nil {
				t.Fatal(err)
			}
			yn, yp := f.N0/mf.Nc(), f.P0/mf.Nv()
			want := ni2 * (1 - yn/math.Sqrt(8)) * (1 - yp/math.Sqrt(8))
			if relErr(f.N0*f.P0, want) > yn*yn+yp*yp+1e-14 {
				t.Errorf("FD %v: n0 p0 = %.17g, ni² γn γp = %.17g", c, f.N0*f.P0, want)
			}
			// Fermi–Dirac reduces to Boltzmann at low doping: majority densities agree to
			// the first-order degeneracy term, minority densities to it as well.
			if relErr(f.N0, b.N0) > yn+yp+1e-14 || relErr(f.P0, b.P0) > yn+yp+1e-14 {
				t.Errorf("%v: FD (%g, %g) vs Boltzmann (%g, %g)", c, f.N0, f.P0, b.N0, b.P0)
			}
		}
	}
}

func TestEquilibriumMonotone(t *testing.T) {
	// More donors, more electrons and fewer holes (property of neutrality with a BGN that
	// increases with doping).
	m := mustAt(t, DefaultModelSet(), 300)
	prev := Equilibrium{N0: 0, P0: math.Inf(1)}
	for nd := 1e12; nd <= 1e21; nd *= 1.5 {
		e, err := m.Equilibrium(nd, 0)
		if err != nil {
			t.Fatal(err)
		}
		if !(e.N0 > prev.N0) {
			t.Errorf("Nd = %g: n0 = %g not above %g", nd, e.N0, prev.N0)
		}
		prev = e
	}
}

func TestEquilibriumSelfConsistentBGN(t *testing.T) {
	mb := mustAt(t, testSet(Boltzmann), 300)
	vt, ni := mb.Vt(), mb.Ni()
	// Intrinsic Boltzmann silicon with the fake ΔEg = A + B·2kT ln(sqrt(np)/ni): the fixed
	// point is ΔEg = A/(1 − B) (closed form). B = 0.5 converges by fixed-point iteration;
	// B = −1.5 makes it oscillate and diverge, so the bracketed fallback must find the root.
	for _, b := range []float64{0.5, -1.5, 0.99} {
		ms := testSet(Boltzmann)
		ms.BGN = carrierBGN{A: 0.01, B: b, Vt: vt, Ni0: ni}
		m := mustAt(t, ms, 300)
		e, err := m.Equilibrium(0, 0)
		if err != nil {
			t.Fatalf("B = %g: %v", b, err)
		}
		want := 0.01 / (1 - b)
		if math.Abs(e.DeltaEg-want) > 1e-12 {
			t.Errorf("B = %g: ΔEg = %.15g, want %.15g", b, e.DeltaEg, want)
		}
		if relErr(e.N0, ni*math.Exp(want/(2*vt))) > 1e-10 {
			t.Errorf("B = %g: n0 = %g, want %g", b, e.N0, ni*math.Exp(want/(2*vt)))
		}
	}
	// A map with no fixed point (ΔEg grows faster than itself) is an error, not a hang.
	ms := testSet(Boltzmann)
	ms.BGN = carrierBGN{A: 0.01, B: 1.2, Vt: vt, Ni0: ni}
	m := mustAt(t, ms, 300)
	if _, err := m.Equilibrium(0, 0); err == nil || !strings.HasPrefix(err.Error(), "silicon: BGN model") {
		t.Errorf("divergent BGN: err = %v", err)
	}
}

// hydrogenicIonization is a test fake: one donor and one acceptor level with ionisation
// energies Ed, Ea (eV) and degeneracy factors 2 and 4, the textbook occupation
// Nd⁺ = Nd/(1 + 2 exp(ηn + Ed/kT)), Na⁻ = Na/(1 + 4 exp(ηp + Ea/kT)).
type hydrogenicIonization struct{ Ed, Ea float64 }

func (h hydrogenicIonization) Ionized(t, nd, na, etaN, etaP float64) (float64, float64, error) {
	kt := BoltzmannEV * t
	return nd / (1 + 2*math.Exp(etaN+h.Ed/kt)), na / (1 + 4*math.Exp(etaP+h.Ea/kt)), nil
}

type failingIonization struct{}

func (failingIonization) Ionized(t, nd, na, etaN, etaP float64) (float64, float64, error) {
	return 0, 0, errors.New("silicon: failingIonization: test error")
}

func TestEquilibriumIonizationHook(t *testing.T) {
	for _, st := range []Statistics{Boltzmann, FermiDirac} {
		ms := testSet(st)
		ms.Ionization = hydrogenicIonization{Ed: 0.045, Ea: 0.045}
		m := mustAt(t, ms, 300)
		for _, c := range grid() {
			e, err := m.Equilibrium(c[0], c[1])
			if err != nil {
				t.Fatalf("%v %v: %v", st, c, err)
			}
			if r := residual(e); !(r <= neutralityTol) {
				t.Errorf("%v %v: residual %g", st, c, r)
			}
			if !(e.NdIon <= c[0] && e.NaIon <= c[1]) {
				t.Errorf("%v %v: ionised %g %g above totals", st, c, e.NdIon, e.NaIon)
			}
		}
		// Textbook closed form for one donor species, Boltzmann, holes negligible:
		// n = Nd/(1 + 2 (n/Nc) e^{Ed/kT})  ⇒  n = (√(1 + 8 Nd e^{Ed/kT}/Nc) − 1) / (4 e^{Ed/kT}/Nc).
		if st == Boltzmann {
			for _, nd := range []float64{1e16, 1e17, 1e18} {
				e, err := m.Equilibrium(nd, 0)
				if err != nil {
					t.Fatal(err)
				}
				k := math.Exp(0.045/m.Vt()) / m.Nc()
				want := 2 * nd / (1 + math.Sqrt(1+8*nd*k)) // same root, free of cancellation
				if relErr(e.N0, want) > 1e-12 {
					t.Errorf("Nd = %g: n0 = %.15g, closed form %.15g", nd, e.N0, want)
				}
			}
		}
	}
	ms := testSet(FermiDirac)
	ms.Ionization = failingIonization{}
	m := mustAt(t, ms, 300)
	if _, err := m.Equilibrium(1e16, 0); err == nil {
		t.Error("failing ionisation: no error")
	}
	// Complete ionisation through the general path equals the fast path.
	ms = testSet(FermiDirac)
	ms.Ionization = hydrogenicIonization{Ed: -10, Ea: -10} // exp(−10/kT) = 0: all ionised
	mg := mustAt(t, ms, 300)
	mc := mustAt(t, testSet(FermiDirac), 300)
	for _, c := range grid() {
		a, _ := mg.Equilibrium(c[0], c[1])
		b, _ := mc.Equilibrium(c[0], c[1])
		if relErr(a.N0, b.N0) > 1e-13 || relErr(a.P0, b.P0) > 1e-13 {
			t.Errorf("%v: general path (%g, %g) vs complete (%g, %g)", c, a.N0, a.P0, b.N0, b.P0)
		}
	}
}

func TestEquilibriumErrors(t *testing.T) {
	m := mustAt(t, DefaultModelSet(), 300)
	for _, c := range []struct {
		nd, na float64
		arg    string
	}{
		{-1, 0, "nd"}, {0, -1e15, "na"}, {math.NaN(), 0, "nd"}, {0, math.NaN(), "na"},
		{math.Inf(1), 0, "nd"}, {0, math.Inf(1), "na"},
	} {
		_, err := m.Equilibrium(c.nd, c.na)
		if err == nil || !strings.HasPrefix(err.Error(), "silicon: density "+c.arg+" ") {
			t.Errorf("Equilibrium(%g, %g): err = %v, want a density error naming %s", c.nd, c.na, err, c.arg)
		}
	}
	// Errors of the BGN model are passed on: Schenk1998 refuses densities above the silicon
	// atom density, 5e22 cm^-3.
	if _, err := m.Equilibrium(1e23, 0); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Equilibrium(1e23, 0): err = %v, want pvrec.ErrOutOfRange", err)
	}
	mbad := mustAt(t, func() ModelSet { s := testSet(FermiDirac); s.BGN = failingBGN{}; return s }(), 300)
	if _, err := mbad.Equilibrium(1e16, 0); err == nil {
		t.Error("failing BGN: no error")
	}
}

// FuzzEquilibrium checks, for random dopant densities, that Equilibrium with the default
// models returns either an error or finite positive densities satisfying charge neutrality
// and n0 p0 = NiEff².
func FuzzEquilibrium(f *testing.F) {
	for _, s := range [][2]float64{
		{0, 0}, {1e15, 0}, {0, 1e16}, {1e20, 1e20}, {1e16, 1e16 - 1e6}, {3e20, 0}, {1e10, 1e21},
		{5e22, 0}, {1e-300, 0}, {math.NaN(), 1}, {-1, 1}, {math.Inf(1), 0}, {2e19, 1e19},
	} {
		f.Add(s[0], s[1])
	}
	m, err := DefaultModelSet().At(300)
	if err != nil {
		f.Fatal(err)
	}
	// toPhysical maps any finite x to a density 10^(|x| mod 22) in [1, 1e22) cm^-3, so that
	// the fuzzer also explores the physical range, not only the errors of absurd inputs.
	toPhysical := func(x float64) float64 {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return x
		}
		return math.Pow(10, math.Mod(math.Abs(x), 22))
	}
	f.Fuzz(func(t *testing.T, nd, na float64) {
		checkEquilibrium(t, m, nd, na)
		checkEquilibrium(t, m, toPhysical(nd), toPhysical(na))
	})
}

// checkEquilibrium is the property checked by FuzzEquilibrium.
func checkEquilibrium(t *testing.T, m *Material, nd, na float64) {
	t.Helper()
	e, err := m.Equilibrium(nd, na)
	if err != nil {
		if !strings.HasPrefix(err.Error(), "silicon: ") {
			t.Fatalf("error without package prefix: %v", err)
		}
		return
	}
	for _, v := range []float64{e.N0, e.P0, e.NiEff, e.DeltaEg, e.EFMinusEc, e.EvMinusEF} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("Equilibrium(%g, %g) = %+v: non-finite", nd, na, e)
		}
	}
	if !(e.N0 > 0 && e.P0 > 0) {
		t.Fatalf("Equilibrium(%g, %g) = %+v: non-positive density", nd, na, e)
	}
	if r := residual(e); !(r <= neutralityTol) {
		t.Fatalf("Equilibrium(%g, %g): residual %g", nd, na, r)
	}
	if relErr(e.NiEff*e.NiEff, e.N0*e.P0) > 1e-14 {
		t.Fatalf("Equilibrium(%g, %g): NiEff² %g vs n0 p0 %g", nd, na, e.NiEff*e.NiEff, e.N0*e.P0)
	}
}
