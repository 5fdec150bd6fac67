package surface

import (
	"math"
	"testing"
)

// benchModel is an invented dielectric: U-shaped Dit with 1e11 cm^-2 eV^-1 at midgap,
// σn = 1e-15, σp = 1e-16 cm^2, Qf = −1e12 cm^-2.
func benchModel(charged bool) ExtendedSRH {
	dit := UShapedDit{Mid: 1e11, TailC: 1e13, TailV: 1e13, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
	m := NewExtendedSRH(dit, ConstantSigma(1e-15), ConstantSigma(1e-16), -1e12)
	m.ChargedStates = charged
	return m
}

func logspace(lo, hi float64, n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = math.Pow(10, lo+(hi-lo)*float64(i)/float64(n-1))
	}
	return v
}

// BenchmarkSolve is one Seff(Δn) evaluation (bulk state given).
func BenchmarkSolve(b *testing.B) {
	for _, charged := range []bool{false, true} {
		name := "neutral"
		if charged {
			name = "charged"
		}
		b.Run(name, func(b *testing.B) {
			m := benchModel(charged)
			bk := mustBulk(b, defaultMaterial(b), 0, 1e16, 1e15)
			for b.Loop() {
				if _, err := m.Solve(bk); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkCurve100 is a 100-point Seff(Δn) curve, 1e12–1e17 cm^-3, including the bulk
// states (equilibrium and ni,eff of the default material).
func BenchmarkCurve100(b *testing.B) {
	w := mustWafer(b, defaultMaterial(b), 0, 1e16)
	dn := logspace(12, 17, 100)
	for _, charged := range []bool{false, true} {
		name := "neutral"
		if charged {
			name = "charged"
		}
		b.Run(name, func(b *testing.B) {
			m := benchModel(charged)
			for b.Loop() {
				if _, err := m.Curve(w, dn); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkMapQfDit40x40 is the map a notebook draws: 40 fixed charges (−1e13..−1e10 and
// 1e10..1e13 cm^-2) × 40 midgap Dit values (1e9..1e13 cm^-2 eV^-1) at one Δn.
func BenchmarkMapQfDit40x40(b *testing.B) {
	bk := mustBulk(b, defaultMaterial(b), 0, 1e16, 1e15)
	q := logspace(10, 13, 20)
	qfs := make([]float64, 0, 40)
	for _, x := range q {
		qfs = append(qfs, -x, x)
	}
	dits := logspace(9, 13, 40)
	for _, charged := range []bool{false, true} {
		name := "neutral"
		if charged {
			name = "charged"
		}
		b.Run(name, func(b *testing.B) {
			m := benchModel(charged)
			for b.Loop() {
				for _, qf := range qfs {
					for _, d := range dits {
						m.Qf = qf
						m.Dit = UShapedDit{Mid: d, TailC: 100 * d, TailV: 100 * d, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
						if _, err := m.Solve(bk); err != nil {
							b.Fatal(err)
						}
					}
				}
			}
		})
	}
}

func BenchmarkLifetime(b *testing.B) {
	for b.Loop() {
		if _, err := Lifetime(0.018, 30, 25, 3); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSeff is one Seff of each surface model family at the state of 1e16 cm^-3 p-type
// silicon at Δn = 1e15 cm^-3 (default model set, 300 K). ConstantSeff and ConstantJ0s must
// report 0 allocs/op; ExtendedSRH allocates its quadrature nodes once per call.
func BenchmarkSeff(b *testing.B) {
	s := mustBulk(b, defaultMaterial(b), 0, 1e16, 1e15)
	for _, c := range []struct {
		name string
		m    Model
	}{
		{"ConstantSeff", ConstantSeff{S: 10}},
		{"ConstantJ0s", ConstantJ0s{J0s: 10e-15}},
		{"ExtendedSRH", benchModel(false)},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := c.m.Seff(s); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
