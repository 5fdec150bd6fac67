package silicon

import (
	"math"
	"testing"
)

var sinkMobility float64

// BenchmarkKlaassen1992 measures one evaluation of both mobilities at a general point
// (compensated, with excess carriers, so that every term of the model is computed).
func BenchmarkKlaassen1992(b *testing.B) {
	m := NewKlaassen1992()
	pt := Point{T: 300, Nd: 1e15, Na: 1e16, N: 1e14, P: 9.1e15}
	for b.Loop() {
		mun, mup, _ := m.Mobilities(pt)
		sinkMobility += mun + mup
	}
}

// BenchmarkKlaassen1992At310K is BenchmarkKlaassen1992 away from 300 K, where the
// temperature factors must be computed.
func BenchmarkKlaassen1992At310K(b *testing.B) {
	m := NewKlaassen1992()
	pt := Point{T: 310, Nd: 1e15, Na: 1e16, N: 1e14, P: 9.1e15}
	for b.Loop() {
		mun, mup, _ := m.Mobilities(pt)
		sinkMobility += mun + mup
	}
}

// BenchmarkKlaassen1992Majority measures a point of one dopant type in low injection, as in
// a diffused region.
func BenchmarkKlaassen1992Majority(b *testing.B) {
	m := NewKlaassen1992()
	pt := Point{T: 300, Nd: 1e19, N: 1e19, P: 1e2}
	for b.Loop() {
		mun, mup, _ := m.Mobilities(pt)
		sinkMobility += mun + mup
	}
}

// sumBenchGrid returns 1,000 excess carrier densities, logarithmically spaced over
// 1e12–1e17 cm^-3, as in a photoconductance decay.
func sumBenchGrid() []float64 {
	dn := make([]float64, 1000)
	for i := range dn {
		dn[i] = 1e12 * math.Pow(1e5, float64(i)/999)
	}
	return dn
}

// BenchmarkSumMobilities1000 measures μn + μp at 1,000 excess carrier densities by direct
// evaluation of Klaassen1992 (p-type 1e15 cm^-3 wafer).
func BenchmarkSumMobilities1000(b *testing.B) {
	m := NewKlaassen1992()
	eq := Point{T: 300, Na: 1e15, P: 1e15, N: 9.3e4}
	dn := sumBenchGrid()
	dst := make([]float64, len(dn))
	for b.Loop() {
		if _, err := SumMobilities(m, eq, dn, dst); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSumMobilityTable1000 measures the same 1,000 points from a SumMobilityTable
// (tolerance 1e-6), excluding its construction.
func BenchmarkSumMobilityTable1000(b *testing.B) {
	m := NewKlaassen1992()
	eq := Point{T: 300, Na: 1e15, P: 1e15, N: 9.3e4}
	tab, err := NewSumMobilityTable(m, eq, 1e12, 1e17, 1e-6)
	if err != nil {
		b.Fatal(err)
	}
	dn := sumBenchGrid()
	dst := make([]float64, len(dn))
	for b.Loop() {
		if _, err := tab.Eval(dn, dst); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkNewSumMobilityTable measures the construction of the table of
// BenchmarkSumMobilityTable1000.
func BenchmarkNewSumMobilityTable(b *testing.B) {
	m := NewKlaassen1992()
	eq := Point{T: 300, Na: 1e15, P: 1e15, N: 9.3e4}
	for b.Loop() {
		if _, err := NewSumMobilityTable(m, eq, 1e12, 1e17, 1e-6); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkMasetti1983 measures one evaluation of both mobilities.
func BenchmarkMasetti1983(b *testing.B) {
	m := NewMasetti1983()
	pt := Point{T: 300, Nd: 1e15, Na: 1e16, N: 1e14, P: 9.1e15}
	for b.Loop() {
		mun, mup, _ := m.Mobilities(pt)
		sinkMobility += mun + mup
	}
}

// BenchmarkDopingFromResistivity measures one inversion (1 Ω·cm p-type, default model set).
func BenchmarkDopingFromResistivity(b *testing.B) {
	mat, err := DefaultModelSet().At(300)
	if err != nil {
		b.Fatal(err)
	}
	m := NewKlaassen1992()
	for b.Loop() {
		n, err := DopingFromResistivity(mat, m, 1, Acceptor, 0)
		if err != nil {
			b.Fatal(err)
		}
		sinkMobility += n
	}
}
