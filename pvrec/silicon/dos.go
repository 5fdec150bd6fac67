package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Green1990DOS is the effective densities of states of the conduction and valence bands of
// silicon of M. A. Green, "Intrinsic concentration, effective densities of states, and
// effective mass in silicon", J. Appl. Phys. 67, 2944 (1990), as power laws in temperature:
//
//	Nc(T) = Nc300 (T/300 K)^ExpC,   Nv(T) = Nv300 (T/300 K)^ExpV.
//
// NewGreen1990DOS returns Nc300 = 2.86e19 cm^-3 and Nv300 = 3.10e19 cm^-3 (Green 1990;
// cross-check: with Green's Eg = 1.1242 eV they give sqrt(Nc Nv) exp(−Eg/2kT) = 1.07e10 cm^-3
// at 300 K, against Green's 1.08e10 cm^-3), and ExpC = 1.58, ExpV = 1.85 (value from memory:
// the exponents commonly quoted with Green 1990, not checked against the paper).
//
// Valid for TMin <= T <= TMax, by default 200–500 K (our choice: the power laws are a
// description around room temperature, not a statement of the paper). The model is a value
// and safe for concurrent use.
type Green1990DOS struct {
	Nc300 float64 // conduction-band effective density of states at 300 K, cm^-3
	Nv300 float64 // valence-band effective density of states at 300 K, cm^-3
	ExpC  float64 // temperature exponent of Nc, dimensionless
	ExpV  float64 // temperature exponent of Nv, dimensionless
	TMin  float64 // lower end of the validity range, K
	TMax  float64 // upper end of the validity range, K
}

// NewGreen1990DOS returns Green1990DOS with the parameters given in the type's comment.
func NewGreen1990DOS() Green1990DOS {
	return Green1990DOS{Nc300: 2.86e19, Nv300: 3.10e19, ExpC: 1.58, ExpV: 1.85, TMin: 200, TMax: 500}
}

// String returns "Green1990".
func (Green1990DOS) String() string { return "Green1990" }

// NcNv returns Nc and Nv in cm^-3 at temperature t in K, or an error for invalid t or t
// outside [TMin, TMax].
func (m Green1990DOS) NcNv(t float64) (nc, nv float64, err error) {
	if err := check.Temperature("silicon", t); err != nil {
		return 0, 0, err
	}
	if err := check.Window("silicon", m.String(), t, m.TMin, m.TMax); err != nil {
		return 0, 0, err
	}
	r := t / 300
	nc = m.Nc300 * math.Pow(r, m.ExpC)
	nv = m.Nv300 * math.Pow(r, m.ExpV)
	if !(nc > 0 && nv > 0) || math.IsInf(nc, 0) || math.IsInf(nv, 0) {
		return 0, 0, fmt.Errorf("silicon: %s: parameters give Nc = %g, Nv = %g cm^-3 at T = %g K; want finite > 0", m, nc, nv, t)
	}
	return nc, nv, nil
}
