package silicon

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"sync"
	"testing"

	"github.com/pvrec/pvrec/pvrec/fermi"

	"github.com/pvrec/pvrec/pvrec"
)

// carrierBGN is a test fake: a carrier-dependent narrowing ΔEg = A + B·2kT·ln(sqrt(n p)/ni0),
// chosen so that in intrinsic Boltzmann silicon, where sqrt(n p) = ni0 exp(ΔEg/2kT), the map
// ΔEg ← BGN(carriers(ΔEg)) is the line A + B·ΔEg with fixed point A/(1 − B).
type carrierBGN struct{ A, B, Vt, Ni0 float64 }

func (f carrierBGN) DeltaEg(pt Point) (float64, error) {
	if err := pt.Validate(); err != nil {
		return 0, err
	}
	return f.A + f.B*f.Vt*(math.Log(pt.N/f.Ni0)+math.Log(pt.P/f.Ni0)), nil
}

// zeroBGN is a private zero narrowing, so that the tests of the statistics do not depend on
// the BGN models.
type zeroBGN struct{}

func (zeroBGN) DeltaEg(pt Point) (float64, error) { return 0, pt.Validate() }

// failingBGN always fails.
type failingBGN struct{}

func (failingBGN) DeltaEg(Point) (float64, error) {
	return 0, errors.New("silicon: failingBGN: test error")
}

// testSet returns the default models with zero BGN and the given statistics.
func testSet(st Statistics) ModelSet {
	ms := DefaultModelSet()
	ms.BGN = zeroBGN{}
	ms.Statistics = st
	return ms
}

func mustAt(t testing.TB, ms ModelSet, tk float64) *Material {
	t.Helper()
	m, err := ms.At(tk)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func TestModelSetAt(t *testing.T) {
	m := mustAt(t, DefaultModelSet(), 300)
	want := "Si 300.00 K: Eg Pässler2002, DOS Green1990, ni Couderc2014, BGN Schenk1998, Fermi–Dirac, complete ionisation, μ Klaassen1992"
	if m.String() != want {
		t.Errorf("String() = %q\nwant       %q", m.String(), want)
	}
	eg, _ := NewPassler2002().Eg(300)
	nc, nv, _ := NewGreen1990DOS().NcNv(300)
	ni, _ := NewCouderc2014().Ni(300)
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"T", m.T(), 300}, {"Vt", m.Vt(), BoltzmannEV * 300}, {"Eg", m.Eg(), eg},
		{"Nc", m.Nc(), nc}, {"Nv", m.Nv(), nv}, {"Ni", m.Ni(), ni},
		{"StatGap", m.StatGap(), BoltzmannEV * 300 * math.Log(nc*nv/(ni*ni))},
	} {
		if relErr(c.got, c.want) > 1e-15 {
			t.Errorf("%s() = %.17g, want %.17g", c.name, c.got, c.want)
		}
	}
	if m.Models().String() != DefaultModelSet().String() {
		t.Errorf("Models() = %v", m.Models())
	}
	// The statistical gap of the default pairing lies within 10 meV of Pässler's gap (the
	// models come from different papers; common practice, no source).
	if math.Abs(m.StatGap()-m.Eg()) > 0.01 {
		t.Errorf("StatGap %g vs Eg %g", m.StatGap(), m.Eg())
	}
}

func TestModelSetAtErrors(t *testing.T) {
	def := DefaultModelSet()
	edit := func(f func(*ModelSet)) ModelSet { ms := def; f(&ms); return ms }
	tests := []struct {
		name   string
		ms     ModelSet
		t      float64
		want   string // prefix of the error message
		range_ bool   // errors.Is(err, pvrec.ErrOutOfRange)
	}{
		{"T=0", def, 0, "silicon: temperature T", false},
		{"T<0", def, -1, "silicon: temperature T", false},
		{"T=NaN", def, math.NaN(), "silicon: temperature T", false},
		{"T=Inf", def, math.Inf(1), "silicon: temperature T", false},
		{"T below DOS range", def, 150, "silicon: Green1990: temperature T", true},
		{"T above range", def, 600, "silicon: Pässler2002: temperature T", true},
		{"nil Gap", edit(func(m *ModelSet) { m.Gap = nil }), 300, "silicon: ModelSet.Gap", false},
		{"nil DOS", edit(func(m *ModelSet) { m.DOS = nil }), 300, "silicon: ModelSet.DOS", false},
		{"nil Intrinsic", edit(func(m *ModelSet) { m.Intrinsic = nil }), 300, "silicon: ModelSet.Intrinsic", false},
		{"nil BGN", edit(func(m *ModelSet) { m.BGN = nil }), 300, "silicon: ModelSet.BGN", false},
		{"nil Ionization", edit(func(m *ModelSet) { m.Ionization = nil }), 300, "silicon: ModelSet.Ionization", false},
		{"zero Statistics", edit(func(m *ModelSet) { m.Statistics = 0 }), 300, "silicon: ModelSet.Statistics", false},
		{"Altermatt off 300 K", edit(func(m *ModelSet) { m.Intrinsic = NewAltermatt2003() }), 310, "silicon: Altermatt2003: temperature T", true},
		{"ni above sqrt(NcNv)", edit(func(m *ModelSet) { m.Intrinsic = FixedNi{Value: 1e20} }), 300, "silicon: models give ni", false},
	}
	for _, tc := range tests {
		m, err := tc.ms.At(tc.t)
		if err == nil || m != nil || !strings.HasPrefix(err.Error(), tc.want) || errors.Is(err, pvrec.ErrOutOfRange) != tc.range_ {
			t.Errorf("%s: At(%g) = %v, %v; want error %q (out of range %v)", tc.name, tc.t, m, err, tc.want, tc.range_)
		}
	}
}

func TestNiEff(t *testing.T) {
	// No BGN, Boltzmann: ni,eff = ni exactly, whatever the densities.
	mb := mustAt(t, testSet(Boltzmann), 300)
	for _, d := range []float64{0, 1e10, 1e20} {
		if got, err := mb.NiEff(d, 1e5, d, 0); err != nil || got != mb.Ni() {
			t.Errorf("Boltzmann NiEff(n = %g) = %g, %v; want ni = %g", d, got, err, mb.Ni())
		}
	}
	// Fermi–Dirac, no BGN: ni sqrt(γn γp) against mpmath (testdata/reference/silicon_statistics.py); the inverse
	// F_{1/2} and F_{1/2} of package fermi are accurate to ~1e-15, tolerance 1e-13.
	mf := mustAt(t, testSet(FermiDirac), 300)
	for _, r := range readReference(t, "nieff") {
		got, err := mf.NiEff(r.a, r.b, 0, 0)
		if err != nil {
			t.Fatal(err)
		}
		if relErr(got, r.x) > 1e-13 {
			t.Errorf("FD NiEff(%g, %g) = %.17g, mpmath %.17g", r.a, r.b, got, r.x)
		}
	}
	// Degeneracy: γ(y) = 1 − y/2^{3/2} + O(y²) for small y = n/Nc (series of F_{1/2},
	// textbook closed form), and γ decreases with y. ln γ is computed as ln y − η, which
	// cancels to an absolute error of a few ulp of |ln y| <= 30, so 1e-14 on top of the y² term.
	for _, y := range []float64{1e-12, 1e-8, 1e-5, 1e-3} {
		g := math.Exp(logDegeneracy(y))
		if math.Abs(g-(1-y/math.Sqrt(8))) > y*y+1e-14 {
			t.Errorf("γ(%g) = %.17g, series %.17g", y, g, 1-y/math.Sqrt(8))
		}
	}
	// The series path (y < 1e-3) agrees with the general inversion, and γ is continuous at
	// the switch: both are accurate to ~1e-14 (see above).
	for _, y := range []float64{2e-17, 1e-10, 1e-6, 1e-4, 5e-4, 0.999e-3} {
		eta, _ := fermi.InvHalf(y)
		if d := math.Abs(logDegeneracy(y) - (math.Log(y) - eta)); d > 1e-14 {
			t.Errorf("ln γ(%g): series and inversion differ by %g", y, d)
		}
	}
	prev := 1.0
	for y := 1e-6; y < 1e3; y *= 1.1 {
		g := math.Exp(logDegeneracy(y))
		if !(g < prev && g > 0) {
			t.Fatalf("γ(%g) = %g not decreasing (prev %g)", y, g, prev)
		}
		prev = g
	}
	// With BGN, ni,eff > ni in doped silicon: the narrowing outweighs the degeneracy of the
	// majority band (Altermatt et al., J. Appl. Phys. 93, 1598 (2003), Fig. of ni,eff vs doping).
	ms := DefaultModelSet()
	md := mustAt(t, ms, 300)
	ms.BGN = NewKlaassenSlotboomDeGraaff1992()
	ms.Statistics = Boltzmann
	mk := mustAt(t, ms, 300)
	for _, nd := range []float64{1e17, 1e18, 1e19, 1e20} {
		for _, m := range []*Material{md, mk} {
			e, err := m.Equilibrium(nd, 0)
			if err != nil {
				t.Fatal(err)
			}
			got, err := m.NiEff(e.N0, e.P0, e.NdIon, e.NaIon)
			if err != nil {
				t.Fatal(err)
			}
			if !(got > m.Ni()) {
				t.Errorf("%v: NiEff at Nd = %g is %g, not above ni = %g", m, nd, got, m.Ni())
			}
			// Equilibrium's NiEff = sqrt(n0 p0) agrees with NiEff at the solution to the
			// self-consistency tolerance of ΔEg (1e-13 eV, i.e. 2e-12 relative) plus rounding.
			if relErr(e.NiEff, got) > 1e-11 {
				t.Errorf("%v: Equilibrium.NiEff %g vs NiEff %g", m, e.NiEff, got)
			}
		}
	}
	// Bad input.
	for _, a := range [][4]float64{{-1, 1, 0, 0}, {1, math.NaN(), 0, 0}, {1, 1, math.Inf(1), 0}, {1, 1, 0, -1e15}} {
		if _, err := md.NiEff(a[0], a[1], a[2], a[3]); err == nil || !strings.HasPrefix(err.Error(), "silicon: density") {
			t.Errorf("NiEff%v: err = %v, want a density error", a, err)
		}
	}
	mbad := mustAt(t, func() ModelSet { s := testSet(FermiDirac); s.BGN = failingBGN{}; return s }(), 300)
	if _, err := mbad.NiEff(1, 1, 0, 0); err == nil {
		t.Error("NiEff with failing BGN: no error")
	}
}

// TestConcurrent checks that a Material gives the same answers from many goroutines.
func TestConcurrent(t *testing.T) {
	m := mustAt(t, DefaultModelSet(), 300)
	want, err := m.Equilibrium(3e18, 1e16)
	if err != nil {
		t.Fatal(err)
	}
	var wg sync.WaitGroup
	errs := make(chan error, 8)
	for g := 0; g < 8; g++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := 0; i < 50; i++ {
				got, err := m.Equilibrium(3e18, 1e16)
				if err != nil || got != want {
					errs <- fmt.Errorf("got %+v, %v", got, err)
					return
				}
			}
		}()
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		t.Error(err)
	}
}
