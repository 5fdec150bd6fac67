package spectroscopy

import (
	"math"
	"math/rand/v2"
	"sync"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// materials caches silicon's default model set at a few temperatures.
var materials sync.Map

func material(t testing.TB, temp float64) *silicon.Material {
	t.Helper()
	if m, ok := materials.Load(temp); ok {
		return m.(*silicon.Material)
	}
	m, err := silicon.DefaultModelSet().At(temp)
	if err != nil {
		t.Fatal(err)
	}
	materials.Store(temp, m)
	return m
}

func bulk(t testing.TB, m *silicon.Material, nd, na float64) *recomb.Bulk {
	t.Helper()
	b, err := recomb.NewBulk(m, nd, na)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// logspace returns n points from lo to hi, evenly spaced in ln.
func logspace(lo, hi float64, n int) []float64 {
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo * math.Pow(hi/lo, float64(i)/float64(n-1))
	}
	return xs
}

// synthetic returns the curve of mechanism m in b at dn, each lifetime multiplied by
// exp(noise·N(0, 1)) with a generator seeded by seed: invented data.
func synthetic(t testing.TB, b *recomb.Bulk, m recomb.Mechanism, dn []float64, noise float64, seed uint64) Curve {
	t.Helper()
	tau, err := b.Lifetimes(m, dn)
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(seed, 0x5eed))
	for i := range tau {
		tau[i] *= math.Exp(noise * rng.NormFloat64())
	}
	return Curve{Bulk: b, Dn: dn, Tau: tau}
}

// simple returns silicon.SimpleModelSet at 300 K: Boltzmann statistics, ni = 1e10 cm^-3, no
// band-gap narrowing, so that every SRH lifetime has a closed form (common practice, no
// source).
func simple(t testing.TB) *silicon.Material {
	t.Helper()
	m, err := silicon.SimpleModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// closedForm returns the SRH lifetime of W. Shockley and W. T. Read, Phys. Rev. 87, 835
// (1952) and R. N. Hall, Phys. Rev. 87, 387 (1952) without band-gap narrowing,
//
//	τ = (τp0 (n0 + n1 + Δn) + τn0 (p0 + p1 + Δn)) / (n0 + p0 + Δn),
//
// for a level e eV above Ei: n1 = ni exp(e/kT), p1 = ni exp(−e/kT).
func closedForm(b *recomb.Bulk, e, tauN0, tauP0, dn float64) float64 {
	m := b.Material()
	eq := b.Equilibrium()
	n1 := m.Ni() * math.Exp(e/m.Vt())
	p1 := m.Ni() * math.Exp(-e/m.Vt())
	return (tauP0*(eq.N0+n1+dn) + tauN0*(eq.P0+p1+dn)) / (eq.N0 + eq.P0 + dn)
}

func near(got, want, rel float64) bool {
	return math.Abs(got-want) <= rel*math.Abs(want)
}
