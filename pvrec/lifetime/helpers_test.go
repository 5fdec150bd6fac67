package lifetime_test

import (
	"math"
	"sync"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// defaultMaterial is silicon at 300 K with the default model set (Schenk1998 BGN, Fermi–Dirac
// statistics, Klaassen1992 mobility).
var defaultMaterial = sync.OnceValues(func() (*silicon.Material, error) {
	return silicon.DefaultModelSet().At(300)
})

// wafer returns the wafer of the default material with donor and acceptor densities nd, na.
func wafer(t testing.TB, nd, na float64) *recomb.Bulk {
	t.Helper()
	m, err := defaultMaterial()
	if err != nil {
		t.Fatal(err)
	}
	b, err := recomb.NewBulk(m, nd, na)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// width is the thickness of the test wafers, 180 µm (common practice, no source).
const width = 180e-4

// optics is the test optics: OneSunFlux per sun, 90 % absorbed (invented).
var optics = lifetime.Optics{FluxPerSun: lifetime.OneSunFlux, Absorbed: 0.9}

// j0sSample returns the symmetric sample of wafer b with intrinsic bulk and a J0s of j0s
// (A/cm^2) on each surface.
func j0sSample(b *recomb.Bulk, j0s float64) lifetime.Sample {
	return lifetime.Sample{Wafer: b, W: width, Bulk: recomb.NewIntrinsic(), Front: surface.ConstantJ0s{J0s: j0s}}
}

func mustLifetime(t testing.TB, s lifetime.Sample, dn float64) float64 {
	t.Helper()
	tau, err := s.Lifetime(dn)
	if err != nil {
		t.Fatal(err)
	}
	return tau
}

func relErr(got, want float64) float64 { return math.Abs(got/want - 1) }
