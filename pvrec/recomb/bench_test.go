package recomb

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// BenchmarkIntrinsicLifetimeCurve computes the intrinsic lifetime (NewIntrinsic: Richter2012 +
// Trupke2003) of 1 Ω·cm-like n-type silicon (Nd = 5e15 cm^-3) at 1,000 Δn points from 1e12 to
// 1e18 cm^-3, with the default model set (Schenk1998 BGN, Fermi–Dirac statistics) at 300 K.
// One op is the whole curve.
func BenchmarkIntrinsicLifetimeCurve(b *testing.B) {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		b.Fatal(err)
	}
	bulk, err := NewBulk(m, 5e15, 0)
	if err != nil {
		b.Fatal(err)
	}
	dn := make([]float64, 1000)
	for i := range dn {
		dn[i] = math.Pow(10, 12+6*float64(i)/float64(len(dn)-1))
	}
	var in Mechanism = NewIntrinsic() // boxed once, as a caller holding a model set would
	out := make([]float64, len(dn))
	b.ReportAllocs()
	for b.Loop() {
		for i, d := range dn {
			s, err := bulk.State(d)
			if err != nil {
				b.Fatal(err)
			}
			if out[i], err = Lifetime(in, s); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkState is one Bulk.State evaluation (one ni,eff with Schenk1998 BGN and
// Fermi–Dirac degeneracy), the dominant cost of a lifetime.
func BenchmarkState(b *testing.B) {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		b.Fatal(err)
	}
	bulk, err := NewBulk(m, 5e15, 0)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if _, err := bulk.State(1e15); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkRichter2012Rate is one Richter2012 rate at a fixed state.
func BenchmarkRichter2012Rate(b *testing.B) {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		b.Fatal(err)
	}
	bulk, err := NewBulk(m, 5e15, 0)
	if err != nil {
		b.Fatal(err)
	}
	s, err := bulk.State(1e15)
	if err != nil {
		b.Fatal(err)
	}
	r := NewRichter2012()
	for b.Loop() {
		if _, err := r.Rate(s); err != nil {
			b.Fatal(err)
		}
	}
}
