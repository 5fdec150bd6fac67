package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"

	"fmt"
)

// Amphoteric is recombination through a defect with three charge states, positive, neutral
// and negative, and so two levels: Level1, the donor-like (+/0) transition, and Level2, the
// acceptor-like (0/−) transition. In steady state with Δn = Δp (no trapping) the occupation
// fractions f+, f0, f− follow from the balance of capture and emission between neighbouring
// charge states (C. T. Sah and W. Shockley, "Electron-hole recombination statistics in
// semiconductors through flaws with many charge conditions", Phys. Rev. 109, 1103 (1958)):
//
//	f0/f+ = (n/τn1 + p1₁/τp1) / (n1₁/τn1 + p/τp1),
//	f−/f0 = (n/τn2 + p1₂/τp2) / (n1₂/τn2 + p/τp2),   f+ + f0 + f− = 1,
//
// and the net rate is the sum over the two transitions,
//
//	R = (n p − ni,eff²) [ f+ / (τp1 n1₁ + τn1 p) + f0 / (τp2 n1₂ + τn2 p) ],
//
// with n1ᵢ, p1ᵢ the SRH densities of Level i (see Level; n1ᵢ p1ᵢ = ni,eff²) and the capture
// time constants τ = 1/(σ vth Nt) of the defect density Nt: τn1 for electron capture by D+,
// τp1 for hole capture by D0, τn2 for electron capture by D0 and τp2 for hole capture by D−.
// When one transition lies far outside the Fermi-level range (its level at a band edge), R
// reduces to single-level SRH through the other, which the tests check. No defect's published
// parameters are implied: supply the levels and time constants of the defect you study.
type Amphoteric struct {
	Level1 Level   // (+/0) transition level
	Level2 Level   // (0/−) transition level
	TauN1  float64 // electron capture by D+, τn1, s, finite and > 0
	TauP1  float64 // hole capture by D0, τp1, s, finite and > 0
	TauN2  float64 // electron capture by D0, τn2, s, finite and > 0
	TauP2  float64 // hole capture by D−, τp2, s, finite and > 0
}

// String returns e.g. "Amphoteric(Ev+0.3 eV, Ec−0.3 eV)".
func (m Amphoteric) String() string {
	return fmt.Sprintf("Amphoteric(%v, %v)", m.Level1, m.Level2)
}

// Rate returns the net rate in cm^-3 s^-1 at s (see Amphoteric), or an error for an invalid
// state, a level outside the gap or time constants that are not finite and > 0.
func (m Amphoteric) Rate(s State) (float64, error) {
	fp, f0, _, n11, n12, err := m.fractions(s)
	if err != nil {
		return 0, err
	}
	return rate("Amphoteric", s.Excess*(fp/(m.TauP1*n11+m.TauN1*s.P)+f0/(m.TauP2*n12+m.TauN2*s.P)))
}

// Fractions returns the steady-state fractions of the defect in its positive (f+), neutral
// (f0) and negative (f−) charge states at s, each computed directly (not as 1 minus the
// others, which would lose a small fraction to rounding); they sum to 1. In thermal
// equilibrium they are the Fermi–Dirac occupations of the two levels (f0/f+ = n/n1₁,
// f−/f0 = n/n1₂; degeneracy factors folded into the levels).
func (m Amphoteric) Fractions(s State) (fp, f0, fm float64, err error) {
	fp, f0, fm, _, _, err = m.fractions(s)
	return fp, f0, fm, err
}

// fractions returns the charge-state fractions and the SRH densities n1 of both levels, which
// Rate needs too (so that the levels are evaluated once per call).
func (m Amphoteric) fractions(s State) (fp, f0, fm, n11, n12 float64, err error) {
	if err := s.Validate(); err != nil {
		return 0, 0, 0, 0, 0, err
	}
	for _, t := range [...]struct {
		name string
		v    float64
	}{{"TauN1", m.TauN1}, {"TauP1", m.TauP1}, {"TauN2", m.TauN2}, {"TauP2", m.TauP2}} {
		if err := check.Positive("recomb: Amphoteric", t.name, t.v, "s"); err != nil {
			return 0, 0, 0, 0, 0, err
		}
	}
	n11, p11, err := m.Level1.n1p1(s)
	if err != nil {
		return 0, 0, 0, 0, 0, err
	}
	n12, p12, err := m.Level2.n1p1(s)
	if err != nil {
		return 0, 0, 0, 0, 0, err
	}
	// Ratios written as (capture + emission into the next state)/(the reverse), each a ratio
	// of sums of positive terms, so nothing cancels.
	r1 := (s.N/m.TauN1 + p11/m.TauP1) / (n11/m.TauN1 + s.P/m.TauP1) // f0/f+
	r2 := (s.N/m.TauN2 + p12/m.TauP2) / (n12/m.TauN2 + s.P/m.TauP2) // f−/f0
	// f+ = 1/(1 + r1 + r1 r2), f0 = r1 f+ and f− = r1 r2 f+, written with 1/r1 and 1/r2 so
	// that they stay exact when either ratio overflows (r1, r2 > 0 since p1 > 0).
	inv1, inv2 := 1/r1, 1/r2
	d := inv1 + 1 + r2
	return inv1 / d, 1 / d, 1 / (inv1*inv2 + inv2 + 1), n11, n12, nil
}
