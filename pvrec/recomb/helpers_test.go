package recomb

import (
	"math"
	"sync"
	"testing"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// newFixed returns the test material with Boltzmann statistics, no band-gap narrowing,
// complete ionisation and constant ni = 1e10 cm^-3 at 300 K, so that every rate has a closed
// form (testdata/reference/recomb.py uses the same numbers). ni = 1e10 cm^-3 is a round value
// (common practice, no source); Nc = 2.86e19 and Nv = 3.10e19 cm^-3 at 300 K are those of the
// Green1990 densities of states, M. A. Green, J. Appl. Phys. 67, 2944 (1990) (value from
// memory).
func newFixed() *silicon.Material {
	m, err := silicon.SimpleModelSet().At(300)
	if err != nil {
		panic(err) // the default model set at 300 K is valid: a failure here is a bug
	}
	return m
}

// defaultMaterial returns silicon's default model set at 300 K (Schenk1998 BGN, Fermi–Dirac).
var defaultMaterial = sync.OnceValues(func() (*silicon.Material, error) {
	return silicon.DefaultModelSet().At(300)
})

func mustDefault(t testing.TB) *silicon.Material {
	t.Helper()
	m, err := defaultMaterial()
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func mustBulk(t testing.TB, m *silicon.Material, nd, na float64) *Bulk {
	t.Helper()
	b, err := NewBulk(m, nd, na)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

func mustState(t testing.TB, b *Bulk, dn float64) State {
	t.Helper()
	s, err := b.State(dn)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// allMechanisms returns one instance of every mechanism of the package, each valid at 300 K
// and (except Altermatt1997) at any injection.
func allMechanisms() []Mechanism {
	return []Mechanism{
		NewTrupke2003(),
		Trupke2003{BLow: 4.73e-15, EscapeFraction: 0.3, TMin: 290, TMax: 310},
		ConstantRadiative{B: 9.5e-15, EscapeFraction: 1},
		NewRichter2012(),
		NewKerrCuevas2002(),
		NewDziewiorSchmid1977(),
		ConstantAuger{Cn: 1e-31, Cp: 2e-31},
		SRH{Level: FromEi(0), TauN0: 1e-3, TauP0: 1e-3},
		SRH{Level: AboveEv(0.38), TauN0: 1e-4, TauP0: 1e-2},
		SRH{Level: BelowEc(0.26), TauN0: 1e-5, TauP0: 3e-5},
		InterstitialIron(1e11),
		IronBoronPair(1e11),
		SRHDefect{Level: FromEi(-0.1), SigmaN: 1e-15, SigmaP: 1e-16, Nt: 1e12, VTh: silicon.NewGreen1990ThermalVelocity()},
		NewIntrinsic(),
		NewKerrCuevas2002Intrinsic(),
		Sum{NewIntrinsic(), InterstitialIron(1e10), SRH{Level: FromEi(0), TauN0: 1e-3, TauP0: 1e-3}},
	}
}

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// logspace returns n points from 10^a to 10^b.
func logspace(a, b float64, n int) []float64 {
	out := make([]float64, n)
	for i := range out {
		out[i] = math.Pow(10, a+(b-a)*float64(i)/float64(n-1))
	}
	return out
}
