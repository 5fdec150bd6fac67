package surface

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// refMaterial is the material of the mpmath reference tables: 300 K, Boltzmann statistics,
// ni = 1e10 cm^-3 (FixedNi), no band-gap narrowing, Green 1990 DOS, complete ionisation.
func refMaterial(tb testing.TB) *silicon.Material {
	tb.Helper()
	m, err := silicon.SimpleModelSet().At(300)
	if err != nil {
		tb.Fatal(err)
	}
	return m
}

// defaultMaterial is silicon.DefaultModelSet at 300 K (Fermi–Dirac, Schenk BGN).
func defaultMaterial(tb testing.TB) *silicon.Material {
	tb.Helper()
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		tb.Fatal(err)
	}
	return m
}

// mustWafer returns the wafer of m with dopants nd, na (cm^-3).
func mustWafer(tb testing.TB, m *silicon.Material, nd, na float64) *recomb.Bulk {
	tb.Helper()
	b, err := recomb.NewBulk(m, nd, na)
	if err != nil {
		tb.Fatal(err)
	}
	return b
}

// mustBulk returns the quasi-neutral state of a wafer of m with dopants nd, na at excess
// density dn (all cm^-3).
func mustBulk(tb testing.TB, m *silicon.Material, nd, na, dn float64) recomb.State {
	tb.Helper()
	b, err := recomb.NewBulk(m, nd, na)
	if err != nil {
		tb.Fatal(err)
	}
	s, err := b.State(dn)
	if err != nil {
		tb.Fatal(err)
	}
	return s
}

func relErr(got, want float64) float64 {
	if got == want {
		return 0
	}
	return math.Abs(got-want) / math.Max(math.Abs(want), math.SmallestNonzeroFloat64)
}
