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

// BenchmarkRate is one rate of each mechanism family at a fixed state (5e15 cm^-3 n-type,
// Δn = 1e15 cm^-3, default model set at 300 K). Every Rate must report 0 allocs/op: validation
// formats nothing on the success path.
func BenchmarkRate(b *testing.B) {
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
	for _, c := range []struct {
		name string
		m    Mechanism
	}{
		{"Richter2012", NewRichter2012()},
		{"KerrCuevas2002", NewKerrCuevas2002()},
		{"DziewiorSchmid1977", NewDziewiorSchmid1977()},
		{"Trupke2003", NewTrupke2003()},
		{"ConstantRadiative", ConstantRadiative{B: 9.5e-15, EscapeFraction: 1}},
		{"SRH", SRH{Level: FromEi(0), TauN0: 1e-3, TauP0: 1e-3}},
		{"SRHDefect", InterstitialIron(1e11)},
		{"Amphoteric", Amphoteric{Level1: AboveEv(0.3), Level2: BelowEc(0.35), TauN1: 1e-6, TauP1: 5e-5, TauN2: 7e-5, TauP2: 2e-6}},
		{"Intrinsic", NewIntrinsic()},
		{"Sum", Sum{NewIntrinsic(), InterstitialIron(1e11)}},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := c.m.Rate(s); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
