package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/silicon"

	"fmt"
	"math"
)

// The defect catalogue: well-characterised recombination-active levels with their published
// parameters. Each function returns an SRHDefect with density nt in cm^-3 and the thermal
// velocities of silicon.NewGreen1990ThermalVelocity.

// InterstitialIron returns the donor level of interstitial iron Fe_i in silicon at density nt:
// Et = Ev + 0.38 eV, σn = 5.0e-14 cm², σp = 7.0e-17 cm², the set compiled by D. Macdonald,
// L. J. Geerligs and A. Azzizi, "Iron detection in crystalline silicon by carrier lifetime
// measurements for arbitrary injection and doping", J. Appl. Phys. 95, 1021 (2004), from
// A. A. Istratov, H. Hieslmair and E. R. Weber, "Iron and its complexes in silicon",
// Appl. Phys. A 69, 13 (1999) (value from memory; the level energy is certain, the cross
// sections should be checked against the paper before quantitative use).
func InterstitialIron(nt float64) SRHDefect {
	return SRHDefect{Name: "Fe_i", Level: AboveEv(0.38), SigmaN: 5.0e-14, SigmaP: 7.0e-17, Nt: nt,
		VTh: silicon.NewGreen1990ThermalVelocity()}
}

// IronBoronPair returns the acceptor level of the iron–boron pair FeB in boron-doped silicon
// at density nt: Et = Ec − 0.26 eV, σn = 5.0e-15 cm², σp = 3.0e-15 cm², as compiled by
// Macdonald, Geerligs and Azzizi (see InterstitialIron; value from memory, to be checked
// likewise). The pair's donor level near Ev + 0.1 eV is too shallow to matter for
// recombination and is left out.
func IronBoronPair(nt float64) SRHDefect {
	return SRHDefect{Name: "FeB", Level: BelowEc(0.26), SigmaN: 5.0e-15, SigmaP: 3.0e-15, Nt: nt,
		VTh: silicon.NewGreen1990ThermalVelocity()}
}

// IronBoron is the iron–boron dissociation method of measuring the iron concentration in
// boron-doped (p-type) silicon (G. Zoth and W. Bergholz, J. Appl. Phys. 67, 6764 (1990), for
// diffusion lengths; D. H. Macdonald, L. J. Geerligs and A. Azzizi, J. Appl. Phys. 95, 1021
// (2004), for lifetimes at arbitrary injection and doping). In the dark at room temperature
// the iron is paired with boron (FeB); strong illumination or a short anneal at about 200 °C
// dissociates the pairs into interstitial iron (Fe_i). With the lifetimes τ_before (paired)
// and τ_after (dissociated) measured at the same Δn, and all other recombination unchanged,
//
//	[Fe] = C(Δn, Na, T) (1/τ_after − 1/τ_before),
//	1/C = (R_Fei − R_FeB)/(Δn [Fe]),
//
// with R_Fei and R_FeB the SRH rates of the two defects at the same density. C diverges at the
// crossover Δn, where both defects give the same lifetime; below it τ_after < τ_before.
// The model is a value; NewIronBoron returns the catalogue's InterstitialIron and
// IronBoronPair (their densities are ignored).
type IronBoron struct {
	FeI SRHDefect // interstitial iron level (density ignored)
	FeB SRHDefect // iron–boron pair level (density ignored)
}

// NewIronBoron returns IronBoron{FeI: InterstitialIron(0), FeB: IronBoronPair(0)}.
func NewIronBoron() IronBoron {
	return IronBoron{FeI: InterstitialIron(0), FeB: IronBoronPair(0)}
}

// String returns "IronBoron(Fe_i, FeB)" with the defects' names or levels.
func (m IronBoron) String() string {
	n := func(d SRHDefect) string {
		if d.Name != "" {
			return d.Name
		}
		return d.Level.String()
	}
	return fmt.Sprintf("IronBoron(%s, %s)", n(m.FeI), n(m.FeB))
}

// inverseDiff returns d = (R_Fei − R_FeB)/(Δn Nt) in cm³/s at Δn = dn for unit defect
// densities, and scale, the larger of the two unit rates over Δn.
func (m IronBoron) inverseDiff(b *Bulk, dn float64) (d, scale float64, err error) {
	if b == nil {
		return 0, 0, fmt.Errorf("recomb: IronBoron: Bulk is nil")
	}
	nd, na := b.Dopants()
	if !(na > nd) {
		return 0, 0, fmt.Errorf("recomb: IronBoron: needs boron-doped p-type silicon (na > nd), got nd = %g, na = %g cm^-3", nd, na)
	}
	if !(dn > 0) || math.IsInf(dn, 0) {
		return 0, 0, fmt.Errorf("recomb: IronBoron: excess carrier density Δn must be finite and > 0 cm^-3, got %g", dn)
	}
	s, err := b.State(dn)
	if err != nil {
		return 0, 0, err
	}
	ri, err := m.FeI.WithDensity(1).Rate(s)
	if err != nil {
		return 0, 0, err
	}
	rb, err := m.FeB.WithDensity(1).Rate(s)
	if err != nil {
		return 0, 0, err
	}
	return (ri - rb) / dn, math.Max(ri, rb) / dn, nil
}

// Prefactor returns C(Δn) in s·cm^-3 such that [Fe] = C (1/τ_after − 1/τ_before), at excess
// density dn in cm^-3 in the p-type Bulk b. C is negative above the crossover Δn. It returns
// an error for a Bulk that is not p-type, invalid dn, an error of a defect, or a Δn so close
// to the crossover (|1/C| below 1e-6 of the larger of the two unit rates) that C is
// meaningless.
func (m IronBoron) Prefactor(b *Bulk, dn float64) (float64, error) {
	d, scale, err := m.inverseDiff(b, dn)
	if err != nil {
		return 0, err
	}
	if math.Abs(d) <= 1e-6*scale {
		return 0, fmt.Errorf("recomb: IronBoron: Δn = %g cm^-3 is at the crossover point; the iron concentration cannot be measured there", dn)
	}
	return 1 / d, nil
}

// Concentration returns the iron concentration [Fe] in cm^-3 from the lifetimes tauBefore
// (iron paired, FeB) and tauAfter (iron dissociated, Fe_i) in s, both measured at the same
// excess density dn in cm^-3 in the p-type Bulk b (see IronBoron). It returns an error for
// lifetimes that are not finite and > 0, for the errors of Prefactor, and for a lifetime
// change of the wrong sign for dissociation at this Δn (which would give [Fe] < 0).
func (m IronBoron) Concentration(b *Bulk, dn, tauBefore, tauAfter float64) (float64, error) {
	if err := check.Positive("recomb: IronBoron", "lifetime tauBefore", tauBefore, "s"); err != nil {
		return 0, err
	}
	if err := check.Positive("recomb: IronBoron", "lifetime tauAfter", tauAfter, "s"); err != nil {
		return 0, err
	}
	c, err := m.Prefactor(b, dn)
	if err != nil {
		return 0, err
	}
	fe := c * (1/tauAfter - 1/tauBefore)
	if fe < 0 {
		return 0, fmt.Errorf("recomb: IronBoron: lifetimes τ_before = %g s, τ_after = %g s at Δn = %g cm^-3 change the wrong way for iron–boron dissociation ([Fe] would be %g cm^-3)",
			tauBefore, tauAfter, dn, fe)
	}
	return fe, nil
}

// Crossover returns the excess density Δn in cm^-3 at which interstitial iron and the
// iron–boron pair give the same lifetime in the p-type Bulk b, searched in [1e8, 1e19] cm^-3
// by Brent's method on ln Δn (internal/roots) to 1e-13 in ln Δn. It returns an error if there
// is no crossover in that range (errors.Is(err, pvrec.ErrOutOfRange)).
func (m IronBoron) Crossover(b *Bulk) (float64, error) {
	lo, hi := math.Log(1e8), math.Log(1e19)
	flo, _, err := m.inverseDiff(b, math.Exp(lo))
	if err != nil {
		return 0, err
	}
	fhi, _, err := m.inverseDiff(b, math.Exp(hi))
	if err != nil {
		return 0, err
	}
	if (flo > 0) == (fhi > 0) {
		return 0, check.Rangef("IronBoron", "crossover Δn", math.NaN(), 1e8, 1e19,
			"recomb: IronBoron: no crossover between Δn = 1e8 and 1e19 cm^-3")
	}
	f := func(x float64) (float64, error) {
		d, _, err := m.inverseDiff(b, math.Exp(x))
		return d, err
	}
	x, err := roots.Brent(f, lo, hi, flo, fhi, 1e-13, 200)
	if err != nil {
		return 0, fmt.Errorf("recomb: IronBoron.Crossover: %w", err)
	}
	return math.Exp(x), nil
}
