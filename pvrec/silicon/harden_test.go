package silicon

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
)

// The tests of this file check the hardening of issue 12: zero values, overflow, unchecked
// hand-made states, pointer models and validity ranges. Each would have failed before the
// corresponding fix (a panic, or a number without an error).

// looseMobility is a test fake that validates nothing and returns its fields: it stands for a
// user model that trusts its input.
type looseMobility struct{ mun, mup float64 }

func (l looseMobility) Mobilities(Point) (float64, float64, error) { return l.mun, l.mup, nil }

// wideBGN is a test fake: a constant narrowing of D eV at every point, valid or not.
type wideBGN struct{ D float64 }

func (w wideBGN) DeltaEg(Point) (float64, error) { return w.D, nil }

// noPanic runs f and fails t if it panics.
func noPanic(t *testing.T, name string, f func()) {
	t.Helper()
	defer func() {
		if r := recover(); r != nil {
			t.Errorf("%s: panic %v", name, r)
		}
	}()
	f()
}

// TestZeroMaterial: the zero Material and a nil *Material return errors from every method
// with an error result (they panicked on the nil model set) and say what they are in String.
func TestZeroMaterial(t *testing.T) {
	for _, m := range []*Material{{}, nil} {
		calls := map[string]func() error{
			"DeltaEg":     func() error { _, err := m.DeltaEg(1e16, 1e4, 1e16, 0); return err },
			"NiEff":       func() error { _, err := m.NiEff(1e16, 1e4, 1e16, 0); return err },
			"Mobilities":  func() error { _, _, err := m.Mobilities(1e16, 1e4, 1e16, 0); return err },
			"Equilibrium": func() error { _, err := m.Equilibrium(1e16, 0); return err },
			"SumMobility": func() error { _, err := m.SumMobility(1e16, 0, 1e14); return err },
			"SumMobilityTable": func() error {
				_, err := m.SumMobilityTable(1e16, 0, 1e12, 1e16, 0)
				return err
			},
			"Material.Diffusivities": func() error { _, _, err := m.Diffusivities(1e16, 1e4, 1e16, 0); return err },
			"Diffusivities": func() error {
				_, _, err := Diffusivities(m, NewKlaassen1992(), 1e16, 1e4, 1e16, 0)
				return err
			},
			"ResistivityFromDoping": func() error {
				_, err := ResistivityFromDoping(m, NewKlaassen1992(), 1e16, 0)
				return err
			},
			"DopingFromResistivity": func() error {
				_, err := DopingFromResistivity(m, NewKlaassen1992(), 1, Donor, 0)
				return err
			},
		}
		for name, f := range calls {
			noPanic(t, name, func() {
				if err := f(); err == nil || !strings.Contains(err.Error(), "zero value") {
					t.Errorf("%s on %#v: err %v, want the zero-Material error", name, m, err)
				}
			})
		}
		noPanic(t, "String", func() {
			if s := m.String(); !strings.Contains(s, "zero Material") {
				t.Errorf("String() = %q", s)
			}
		})
	}
	var z Material
	if z.T() != 0 || z.Ni() != 0 || z.StatGap() != 0 {
		t.Errorf("zero Material accessors: T %g, Ni %g, StatGap %g; want 0", z.T(), z.Ni(), z.StatGap())
	}
}

// TestPointerModels: ModelSet.At refuses pointer models, which the caller could change after
// the material is fixed (and which panicked when nil).
func TestPointerModels(t *testing.T) {
	k := NewKlaassen1992()
	var nilGap *Passler2002
	for name, ms := range map[string]ModelSet{
		"Mobility": func() ModelSet { ms := DefaultModelSet(); ms.Mobility = &k; return ms }(),
		"Gap":      func() ModelSet { ms := DefaultModelSet(); ms.Gap = nilGap; return ms }(),
	} {
		noPanic(t, name, func() {
			m, err := ms.At(300)
			if err == nil || m != nil || !strings.Contains(err.Error(), "ModelSet."+name+" is a pointer") {
				t.Errorf("%s: At gives %v, %v; want the pointer error", name, m, err)
			}
		})
	}
}

// TestMeltingPoint: no temperature above the melting point of silicon, 1687 K (handbook
// value), is accepted, even by models whose editable range is wider or that have none. Before,
// ThermalVoltage(1e300) returned 8.6e295 V and At(2000) succeeded with widened ranges.
func TestMeltingPoint(t *testing.T) {
	ms := DefaultModelSet()
	gap := NewPassler2002()
	gap.TMax = 1e4
	dos := NewGreen1990DOS()
	dos.TMax = 1e4
	ni := NewCouderc2014()
	ni.TMax, ni.Gap = 1e4, gap
	mob := NewKlaassen1992()
	mob.TMax = 1e4
	ms.Gap, ms.DOS, ms.Intrinsic, ms.Mobility = gap, dos, ni, mob
	for name, f := range map[string]func(float64) error{
		"ModelSet.At":    func(t float64) error { _, err := ms.At(t); return err },
		"ThermalVoltage": func(t float64) error { _, err := ThermalVoltage(t); return err },
		"Diffusivity":    func(t float64) error { _, err := Diffusivity(1000, t); return err },
		"FixedGap":       func(t float64) error { _, err := NewFixedGap().Eg(t); return err },
		"FixedNi":        func(t float64) error { _, err := NewFixedNi().Ni(t); return err },
		"CompleteIonization": func(t float64) error {
			_, _, err := CompleteIonization{}.Ionized(t, 1e16, 0, 0, 0)
			return err
		},
	} {
		for _, tk := range []float64{2000, 1e300} {
			if err := f(tk); !errors.Is(err, pvrec.ErrOutOfRange) {
				t.Errorf("%s(%g K): err %v, want pvrec.ErrOutOfRange", name, tk, err)
			}
		}
		if err := f(math.NaN()); err == nil {
			t.Errorf("%s(NaN): no error", name)
		}
	}
}

// TestZeroModels: zero model values return errors, not a number (FixedGap{} gave 0 eV).
func TestZeroModels(t *testing.T) {
	if eg, err := (FixedGap{}).Eg(300); err == nil {
		t.Errorf("FixedGap{}.Eg = %g, no error", eg)
	}
	if _, _, err := (ConstantMobility{}).Mobilities(Point{T: 300}); err == nil {
		t.Errorf("ConstantMobility{}: no error")
	}
	var tab SumMobilityTable
	for _, tb := range []*SumMobilityTable{&tab, nil} {
		noPanic(t, "SumMobilityTable", func() {
			if _, err := tb.At(0); err == nil {
				t.Errorf("zero SumMobilityTable.At(0): no error")
			}
			if _, err := tb.Eval([]float64{1}, nil); err == nil {
				t.Errorf("zero SumMobilityTable.Eval: no error")
			}
			_ = tb.String()
			_, _ = tb.Range()
			_ = tb.RelErr()
		})
	}
}

// TestAtomDensity: densities above the silicon atom density 5e22 cm^-3 (handbook value) are
// range errors, also with models that would evaluate them. Before, Equilibrium(1e300, 0) with
// Boltzmann statistics and no narrowing returned n0 = 1e300 cm^-3.
func TestAtomDensity(t *testing.T) {
	ms := DefaultModelSet()
	ms.BGN, ms.Statistics, ms.Mobility = NoNarrowing{}, Boltzmann, NewConstantMobility()
	m := mustAt(t, ms, 300)
	for name, f := range map[string]func(v float64) error{
		"Equilibrium": func(v float64) error { _, err := m.Equilibrium(v, 0); return err },
		"NiEff":       func(v float64) error { _, err := m.NiEff(v, 1, v, 0); return err },
		"DeltaEg":     func(v float64) error { _, err := m.DeltaEg(v, 1, v, 0); return err },
		"Mobilities":  func(v float64) error { _, _, err := m.Mobilities(v, 1, v, 0); return err },
		"Conductivity": func(v float64) error {
			_, err := Conductivity(NewConstantMobility(), Point{T: 300, Nd: 1e16, N: v})
			return err
		},
		"SumMobility": func(v float64) error {
			_, err := SumMobility(NewConstantMobility(), Point{T: 300, Na: 1e16, P: 1e16}, v)
			return err
		},
		"Ionized": func(v float64) error { _, _, err := CompleteIonization{}.Ionized(300, v, 0, 0, 0); return err },
	} {
		for _, v := range []float64{6e22, 1e300} {
			if err := f(v); !errors.Is(err, pvrec.ErrOutOfRange) {
				t.Errorf("%s(%g cm^-3): err %v, want pvrec.ErrOutOfRange", name, v, err)
			}
		}
		if err := f(1e19); err != nil {
			t.Errorf("%s(1e19 cm^-3): %v", name, err)
		}
	}
}

// TestUncheckedModelResults: a user model that validates nothing cannot push NaN or infinite
// values through the package's functions (before, Conductivity returned NaN for N = NaN and
// Material.Mobilities passed a NaN mobility on).
func TestUncheckedModelResults(t *testing.T) {
	nanMob := looseMobility{math.NaN(), 1}
	ms := DefaultModelSet()
	ms.Mobility = looseMobility{1000, 400}
	loose := mustAt(t, ms, 300)
	for name, f := range map[string]func() error{
		"Conductivity NaN N": func() error {
			_, err := Conductivity(looseMobility{1000, 400}, Point{T: 300, N: math.NaN()})
			return err
		},
		"Conductivity NaN mobility": func() error {
			_, err := Conductivity(nanMob, Point{T: 300, N: 1e16})
			return err
		},
		"Conductivity overflow": func() error {
			_, err := Conductivity(looseMobility{math.MaxFloat64, 1}, Point{T: 300, N: 1e20})
			return err
		},
		"Resistivity of 1e-300 carriers": func() error {
			_, err := Resistivity(looseMobility{1000, 400}, Point{T: 300, N: 1e-300})
			return err
		},
		"SumMobility Inf eq": func() error {
			_, err := SumMobility(looseMobility{1000, 400}, Point{T: 300, N: math.Inf(1)}, 0)
			return err
		},
		"SumMobility NaN mobility": func() error {
			_, err := SumMobility(nanMob, Point{T: 300}, 0)
			return err
		},
		"Material.Mobilities NaN density": func() error {
			_, _, err := loose.Mobilities(math.NaN(), 0, 0, 0)
			return err
		},
		"Diffusivities NaN mobility": func() error {
			_, _, err := Diffusivities(loose, nanMob, 1e16, 1e4, 1e16, 0)
			return err
		},
		"DiffusivityFD overflow": func() error {
			_, err := DiffusivityFD(math.MaxFloat64, 300, 1e22, 1)
			return err
		},
	} {
		noPanic(t, name, func() {
			if err := f(); err == nil {
				t.Errorf("%s: no error", name)
			}
		})
	}
	// A narrowing that closes the gap is an error, not a number.
	ms = DefaultModelSet()
	ms.BGN = wideBGN{2}
	wide := mustAt(t, ms, 300)
	if d, err := wide.DeltaEg(1e16, 1e4, 1e16, 0); err == nil {
		t.Errorf("DeltaEg of 2 eV: %g, no error", d)
	}
	if v, err := wide.NiEff(1e16, 1e4, 1e16, 0); err == nil {
		t.Errorf("NiEff with 2 eV narrowing: %g, no error", v)
	}
	if e, err := wide.Equilibrium(1e16, 0); err == nil {
		t.Errorf("Equilibrium with 2 eV narrowing: %+v, no error", e)
	}
}

// TestAmbipolarNoOverflow: the ambipolar diffusivity, a weighted harmonic mean of Dn and Dp
// (van Roosbroeck, Phys. Rev. 91, 282 (1953)), lies between them for any valid input; before,
// (n + p) Dn Dp overflowed to NaN for values near 1e300.
func TestAmbipolarNoOverflow(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for i := 0; i < 20000; i++ {
		// Over the whole accepted range: diffusivities 1e-100..1e100 cm²/s (the validators'
		// bounds), densities 1e-300..1e22 cm^-3 (below the atom density).
		dn, dp := math.Pow(10, 200*r.Float64()-100), math.Pow(10, 200*r.Float64()-100)
		n, p := math.Pow(10, 322*r.Float64()-300), math.Pow(10, 322*r.Float64()-300)
		if i%7 == 0 {
			p = 0
		}
		d, err := AmbipolarDiffusivity(dn, dp, n, p)
		lo, hi := math.Min(dn, dp), math.Max(dn, dp)
		if err != nil || !(d >= lo*(1-1e-15) && d <= hi*(1+1e-15)) {
			t.Fatalf("AmbipolarDiffusivity(%g, %g, %g, %g) = %g, %v; want within [%g, %g]", dn, dp, n, p, d, err, lo, hi)
		}
	}
	// Beyond the bounds: a range error, never NaN.
	if _, err := AmbipolarDiffusivity(1e300, 1, 1e10, 1e10); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Dn = 1e300: err = %v, want ErrOutOfRange", err)
	}
}

// TestHotPathsAllocationFree: the evaluations that later packages make per point allocate
// nothing (validation builds no message on the success path; issue 9). Allocation counts are
// deterministic, unlike times.
func TestHotPathsAllocationFree(t *testing.T) {
	m := mustAt(t, DefaultModelSet(), 300)
	k, s, g, c := NewKlaassen1992(), NewSchenk1998(), NewPassler2002(), NewCouderc2014()
	pt := Point{T: 300, Nd: 1e19, N: 1.001e19, P: 1e16}
	for name, f := range map[string]func(){
		"Material.NiEff":       func() { _, _ = m.NiEff(1.1e16, 1e15, 1e16, 0) },
		"Material.NiEff (FD)":  func() { _, _ = m.NiEff(1e20, 1e3, 1e20, 0) },
		"Material.Equilibrium": func() { _, _ = m.Equilibrium(0, 1e16) },
		"Material.Mobilities":  func() { _, _, _ = m.Mobilities(1e14, 9.1e15, 1e15, 1e16) },
		"Material.SumMobility": func() { _, _ = m.SumMobility(0, 1e16, 1e15) },
		"Klaassen1992":         func() { _, _, _ = k.Mobilities(pt) },
		"Masetti1983":          func() { _, _, _ = NewMasetti1983().Mobilities(pt) },
		"Schenk1998":           func() { _, _ = s.DeltaEg(pt) },
		"Slotboom":             func() { _, _ = NewKlaassenSlotboomDeGraaff1992().DeltaEg(pt) },
		"Passler2002":          func() { _, _ = g.Eg(300) },
		"Couderc2014":          func() { _, _ = c.Ni(300) },
		"Green1990DOS":         func() { _, _, _ = NewGreen1990DOS().NcNv(300) },
		"Diffusivities":        func() { _, _, _ = m.Diffusivities(1e20, 1e3, 1e20, 0) },
	} {
		if a := testing.AllocsPerRun(100, f); a != 0 {
			t.Errorf("%s: %g allocations per call, want 0", name, a)
		}
	}
}
