package silicon

import "testing"

var sinkF float64
var sinkE Equilibrium

// BenchmarkNiEff: default models (Schenk1998 BGN, Fermi–Dirac) at 300 K, n-type 1e16 cm^-3
// under injection Δn = 1e15 cm^-3, the call recombination models make per point.
func BenchmarkNiEff(b *testing.B) {
	m := mustAt(b, DefaultModelSet(), 300)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		v, err := m.NiEff(1.1e16, 1e15, 1e16, 0)
		if err != nil {
			b.Fatal(err)
		}
		sinkF = v
	}
}

// BenchmarkNiEffDegenerate: as BenchmarkNiEff in an emitter, n = 1e20 cm^-3.
func BenchmarkNiEffDegenerate(b *testing.B) {
	m := mustAt(b, DefaultModelSet(), 300)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		v, err := m.NiEff(1e20, 1e3, 1e20, 0)
		if err != nil {
			b.Fatal(err)
		}
		sinkF = v
	}
}

func benchEquilibrium(b *testing.B, ms ModelSet, nd, na float64) {
	m := mustAt(b, ms, 300)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		e, err := m.Equilibrium(nd, na)
		if err != nil {
			b.Fatal(err)
		}
		sinkE = e
	}
}

// BenchmarkEquilibrium: default models at 300 K, p-type 1e16 cm^-3 (a wafer).
func BenchmarkEquilibrium(b *testing.B) { benchEquilibrium(b, DefaultModelSet(), 0, 1e16) }

// BenchmarkEquilibriumDegenerate: default models at 300 K, n-type 1e20 cm^-3 (an emitter).
func BenchmarkEquilibriumDegenerate(b *testing.B) { benchEquilibrium(b, DefaultModelSet(), 1e20, 0) }

// BenchmarkEquilibriumBoltzmann: Boltzmann statistics, Klaassen BGN (closed form).
func BenchmarkEquilibriumBoltzmann(b *testing.B) {
	ms := DefaultModelSet()
	ms.Statistics = Boltzmann
	ms.BGN = NewKlaassenSlotboomDeGraaff1992()
	benchEquilibrium(b, ms, 1e20, 0)
}

// BenchmarkModelSetAt: fixing the default models at a temperature.
func BenchmarkModelSetAt(b *testing.B) {
	ms := DefaultModelSet()
	for i := 0; i < b.N; i++ {
		m, err := ms.At(300)
		if err != nil {
			b.Fatal(err)
		}
		sinkF = m.Ni()
	}
}

// BenchmarkPassler2002Eg: the default band gap at temperatures spread over 200–500 K.
func BenchmarkPassler2002Eg(b *testing.B) {
	m := NewPassler2002()
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		v, err := m.Eg(200 + float64(i&255))
		if err != nil {
			b.Fatal(err)
		}
		sinkF += v
	}
}

// BenchmarkGreen1990NcNv: the default effective densities of states over 200–455 K.
func BenchmarkGreen1990NcNv(b *testing.B) {
	m := NewGreen1990DOS()
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		nc, nv, err := m.NcNv(200 + float64(i&255))
		if err != nil {
			b.Fatal(err)
		}
		sinkF += nc + nv
	}
}

// BenchmarkCouderc2014Ni: the default intrinsic density (with its Pässler gap) over 200–455 K.
func BenchmarkCouderc2014Ni(b *testing.B) {
	m := NewCouderc2014()
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		v, err := m.Ni(200 + float64(i&255))
		if err != nil {
			b.Fatal(err)
		}
		sinkF += v
	}
}

// BenchmarkMaterialMobilities: Klaassen's mobilities through the default material, the call
// of profile's sheet resistance and of the J0 solver.
func BenchmarkMaterialMobilities(b *testing.B) {
	m := mustAt(b, DefaultModelSet(), 300)
	b.ReportAllocs()
	for b.Loop() {
		mun, mup, err := m.Mobilities(1e14, 9.1e15, 1e15, 1e16)
		if err != nil {
			b.Fatal(err)
		}
		sinkF += mun + mup
	}
}

// BenchmarkMaterialSumMobility: μn + μp of a 1e16 cm^-3 p-type wafer at Δn = 1e15 cm^-3,
// equilibrium included.
func BenchmarkMaterialSumMobility(b *testing.B) {
	m := mustAt(b, DefaultModelSet(), 300)
	b.ReportAllocs()
	for b.Loop() {
		v, err := m.SumMobility(0, 1e16, 1e15)
		if err != nil {
			b.Fatal(err)
		}
		sinkF += v
	}
}

// BenchmarkDiffusivities: Fermi–Dirac diffusivities in an n+ region of the default material.
func BenchmarkDiffusivities(b *testing.B) {
	m := mustAt(b, DefaultModelSet(), 300)
	b.ReportAllocs()
	for b.Loop() {
		dn, dp, err := m.Diffusivities(1e20, 1e3, 1e20, 0)
		if err != nil {
			b.Fatal(err)
		}
		sinkF += dn + dp
	}
}
