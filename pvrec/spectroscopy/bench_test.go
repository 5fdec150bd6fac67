package spectroscopy

import (
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// benchCurves returns three invented FeB curves of 50 points (Na = 1e16 cm^-3 at 300, 350 and
// 400 K, 2 % seeded noise).
func benchCurves(b *testing.B) []Curve {
	dn := logspace(1e13, 3e16, 50)
	var cs []Curve
	for i, temp := range []float64{300, 350, 400} {
		cs = append(cs, synthetic(b, bulk(b, material(b, temp), 0, 1e16), recomb.IronBoronPair(1e12), dn, 0.02, uint64(i+1)))
	}
	return cs
}

// One defect fit on three curves of 50 points (issue 14: under 100 ms).
func BenchmarkFit(b *testing.B) {
	cs := benchCurves(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Fit(cs, Options{Ref: recomb.FromConduction}); err != nil {
			b.Fatal(err)
		}
	}
}

// The 200 × 200 solution surface of three curves of 50 points on two goroutines (issue 14:
// under 1 s on two cores).
func BenchmarkSolutionSurface(b *testing.B) {
	cs := benchCurves(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := SolutionSurface(cs, Options{EtPoints: 200, KPoints: 200, Workers: 2}); err != nil {
			b.Fatal(err)
		}
	}
}

// The linearised form of one curve of 50 points.
func BenchmarkLinearise(b *testing.B) {
	c := benchCurves(b)[0]
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Linearise(c, recomb.IronBoronPair(0).VTh); err != nil {
			b.Fatal(err)
		}
	}
}
