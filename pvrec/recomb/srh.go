package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"

	"fmt"
	"math"
)

// EnergyRef says from where the energy of a defect level is counted.
type EnergyRef uint8

const (
	// FromValence: E = Et − Ev, the level above the valence-band edge, eV.
	FromValence EnergyRef = iota + 1
	// FromConduction: E = Ec − Et, the level below the conduction-band edge, eV.
	FromConduction
	// FromIntrinsic: E = Et − Ei, the level above the intrinsic level (negative below it), eV.
	FromIntrinsic
)

// Level is the energy of a defect level in eV, counted as Ref says. The zero Level is invalid
// (Ref must be set). Levels are evaluated in a State, where they give the
// Shockley–Read–Hall densities n1 and p1:
//
//	FromConduction: n1 = Nc exp(−E/kT) · s,   p1 = ni,eff²/n1,
//	FromValence:    p1 = Nv exp(−E/kT) · s,   n1 = ni,eff²/p1,
//	FromIntrinsic:  n1 = ni,eff exp(E/kT),    p1 = ni,eff exp(−E/kT),
//
// with s = ni,eff/ni. Without narrowing these are the defining relations of W. Shockley and
// W. T. Read, Phys. Rev. 87, 835 (1952), n1 = Nc exp(−(Ec − Et)/kT), p1 = Nv exp(−(Et − Ev)/kT)
// (the form in which emission rates measure a level's depth), and always n1 p1 = ni,eff², which
// detailed balance needs. A level counted from a band edge keeps its depth below that edge as
// narrowing lowers the gap, the narrowing (and degeneracy) factor s being shared equally
// between the bands as silicon.Material.Equilibrium reports the band edges (common practice,
// no source).
//
// Band edges. The three references are made consistent by taking the band edges of the carrier
// statistics: Ec − Ev = Eg,stat = kT ln(Nc Nv/ni²) (silicon.Material.StatGap, within a few meV
// of the band-gap model's Eg), Ei − Ev = kT ln(Nv/ni) and Ec − Ei = kT ln(Nc/ni). A level
// outside [Ev, Ec] is an error (errors.Is(err, ErrOutOfRange)).
type Level struct {
	E   float64   // energy, eV
	Ref EnergyRef // reference of E
}

// AboveEv returns the Level at e eV above the valence-band edge, Et = Ev + e.
func AboveEv(e float64) Level { return Level{E: e, Ref: FromValence} }

// BelowEc returns the Level at e eV below the conduction-band edge, Et = Ec − e.
func BelowEc(e float64) Level { return Level{E: e, Ref: FromConduction} }

// FromEi returns the Level at e eV above the intrinsic level, Et = Ei + e (e < 0 below it).
func FromEi(e float64) Level { return Level{E: e, Ref: FromIntrinsic} }

// String returns "Ev+0.38 eV", "Ec−0.26 eV" or "Ei+0 eV".
func (l Level) String() string {
	switch l.Ref {
	case FromValence:
		return fmt.Sprintf("Ev+%g eV", l.E)
	case FromConduction:
		return fmt.Sprintf("Ec−%g eV", l.E)
	case FromIntrinsic:
		if l.E < 0 {
			return fmt.Sprintf("Ei−%g eV", -l.E)
		}
		return fmt.Sprintf("Ei+%g eV", l.E)
	}
	return fmt.Sprintf("Level(%g eV, ref %d)", l.E, l.Ref)
}

// n1p1 returns the SRH densities n1, p1 in cm^-3 of the level at s.
func (l Level) n1p1(s State) (n1, p1 float64, err error) {
	if math.IsNaN(l.E) || math.IsInf(l.E, 0) {
		return 0, 0, fmt.Errorf("recomb: defect level energy E must be finite, got %g eV", l.E)
	}
	if !(s.Vt > 0) || !(s.Nc > 0) || !(s.Nv > 0) || !(s.Ni > 0) || !(s.NiEff > 0) ||
		math.IsInf(s.Nc+s.Nv+s.Ni+s.NiEff+s.Vt, 0) {
		return 0, 0, fmt.Errorf("recomb: State Vt, Nc, Nv, Ni and NiEff must be finite and > 0 for a defect level")
	}
	eiv := s.Vt * math.Log(s.Nv/s.Ni)    // Ei − Ev
	eg := eiv + s.Vt*math.Log(s.Nc/s.Ni) // Ec − Ev of the statistics
	var etv float64                      // Et − Ev
	switch l.Ref {
	case FromValence:
		etv = l.E
	case FromConduction:
		etv = eg - l.E
	case FromIntrinsic:
		etv = eiv + l.E
	default:
		return 0, 0, fmt.Errorf("recomb: defect level %v: reference Ref not set (use AboveEv, BelowEc or FromEi)", l)
	}
	if !(etv >= 0 && etv <= eg) {
		return 0, 0, check.Rangef("SRH", "defect level Et − Ev", etv, 0, eg,
			"recomb: defect level %v lies outside the gap (Et − Ev = %g eV, Ec − Ev = %g eV)", l, etv, eg)
	}
	shift := s.NiEff / s.Ni
	switch l.Ref {
	case FromValence:
		p1 = s.Nv * math.Exp(-l.E/s.Vt) * shift
		n1 = s.NiEff * (s.NiEff / p1)
	case FromConduction:
		n1 = s.Nc * math.Exp(-l.E/s.Vt) * shift
		p1 = s.NiEff * (s.NiEff / n1)
	default:
		x := math.Exp(l.E / s.Vt)
		n1, p1 = s.NiEff*x, s.NiEff/x
	}
	if !(n1 > 0 && p1 > 0) || math.IsInf(n1+p1, 0) {
		return 0, 0, fmt.Errorf("recomb: defect level %v: n1 = %g, p1 = %g cm^-3 not representable at T = %g K", l, n1, p1, s.T)
	}
	return n1, p1, nil
}

// SRH is Shockley–Read–Hall recombination through a single defect level given by its energy
// and its capture time constants (W. Shockley and W. T. Read, Phys. Rev. 87, 835 (1952);
// R. N. Hall, Phys. Rev. 87, 387 (1952)):
//
//	R = (n p − ni,eff²) / (τp0 (n + n1) + τn0 (p + p1)),
//
// with n1, p1 from the Level (see Level), τn0 = 1/(σn vth,n Nt) the electron and τp0 the hole
// capture time constant. In p-type low injection R/Δn → 1/τn0 for a level near mid-gap, and
// in high injection τ → τn0 + τp0. It holds for a defect density small enough that trapping is
// negligible (steady state with Δn = Δp). For cross sections and a density, use SRHDefect.
type SRH struct {
	Level Level   // defect level
	TauN0 float64 // electron capture time constant τn0, s, finite and > 0
	TauP0 float64 // hole capture time constant τp0, s, finite and > 0
}

// String returns "SRH(Ec−0.26 eV, τn0=1e-05 s, τp0=2e-05 s)" with the model's values.
func (m SRH) String() string {
	return fmt.Sprintf("SRH(%v, τn0=%g s, τp0=%g s)", m.Level, m.TauN0, m.TauP0)
}

// Rate returns the net SRH rate in cm^-3 s^-1 at s (see SRH), or an error for an invalid state,
// a level outside the gap or capture time constants that are not finite and > 0.
func (m SRH) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if err := check.Positive("recomb: SRH", "TauN0", m.TauN0, "s"); err != nil {
		return 0, err
	}
	if err := check.Positive("recomb: SRH", "TauP0", m.TauP0, "s"); err != nil {
		return 0, err
	}
	n1, p1, err := m.Level.n1p1(s)
	if err != nil {
		return 0, err
	}
	return rate("SRH", s.Excess/(m.TauP0*(s.N+n1)+m.TauN0*(s.P+p1)))
}

// SRHDefect is Shockley–Read–Hall recombination through a single defect level given by its
// energy, capture cross sections and density (see SRH for the rate):
//
//	τn0 = 1/(σn vth,n Nt),   τp0 = 1/(σp vth,p Nt),
//
// with the thermal velocities at the state's temperature. Nt = 0 gives R = 0.
type SRHDefect struct {
	Name   string                  // optional label used by String, e.g. "Fe_i"
	Level  Level                   // defect level
	SigmaN float64                 // electron capture cross section σn, cm², finite and > 0
	SigmaP float64                 // hole capture cross section σp, cm², finite and > 0
	Nt     float64                 // defect density, cm^-3, finite and >= 0
	VTh    silicon.ThermalVelocity // thermal velocities of electrons and holes
}

// WithDensity returns a copy of d with defect density nt in cm^-3.
func (d SRHDefect) WithDensity(nt float64) SRHDefect {
	d.Nt = nt
	return d
}

// String returns the Name and density, e.g. "Fe_i(1e+12 cm^-3)", or without a Name
// "SRHDefect(Ev+0.38 eV, σn=5e-14, σp=7e-17 cm², Nt=1e+12 cm^-3)".
func (d SRHDefect) String() string {
	if d.Name != "" {
		return fmt.Sprintf("%s(%g cm^-3)", d.Name, d.Nt)
	}
	return fmt.Sprintf("SRHDefect(%v, σn=%g, σp=%g cm², Nt=%g cm^-3)", d.Level, d.SigmaN, d.SigmaP, d.Nt)
}

// Taus returns the capture time constants τn0, τp0 in s of d in material m, at m's
// temperature (+Inf for Nt = 0), or an error for a nil m, invalid parameters or a temperature
// outside the thermal-velocity window.
func (d SRHDefect) Taus(m *silicon.Material) (tauN0, tauP0 float64, err error) {
	if m == nil {
		return 0, 0, fmt.Errorf("recomb: SRHDefect.Taus: material m is nil")
	}
	if err := d.validate(); err != nil {
		return 0, 0, err
	}
	ve, vh, err := d.VTh.At(m.T())
	if err != nil {
		return 0, 0, fmt.Errorf("recomb: SRHDefect %v: %w", d, err)
	}
	tn, tp := 1/(d.SigmaN*ve*d.Nt), 1/(d.SigmaP*vh*d.Nt)
	if d.Nt > 0 { // Nt = 0 gives +Inf, documented
		if err := check.Result("recomb: SRHDefect.Taus", "τn0", tn, "s"); err != nil {
			return 0, 0, err
		}
		if err := check.Result("recomb: SRHDefect.Taus", "τp0", tp, "s"); err != nil {
			return 0, 0, err
		}
	}
	return tn, tp, nil
}

// validate checks the parameters of d. It formats d's name only on the error path, so that
// Rate stays allocation-free.
func (d SRHDefect) validate() error {
	if d.SigmaN > 0 && d.SigmaP > 0 && d.Nt >= 0 && !math.IsInf(d.SigmaN+d.SigmaP+d.Nt, 0) {
		return nil
	}
	what := "recomb: SRHDefect " + d.String()
	if err := check.Positive(what, "electron cross section SigmaN", d.SigmaN, "cm²"); err != nil {
		return err
	}
	if err := check.Positive(what, "hole cross section SigmaP", d.SigmaP, "cm²"); err != nil {
		return err
	}
	return check.Density(what, "defect density Nt", d.Nt)
}

// Rate returns the net SRH rate in cm^-3 s^-1 at s, or an error for an invalid state or
// parameters or a level outside the gap.
func (d SRHDefect) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if err := d.validate(); err != nil {
		return 0, err
	}
	ve, vh, err := d.VTh.At(s.T)
	if err != nil {
		return 0, fmt.Errorf("recomb: SRHDefect %v: %w", d, err)
	}
	n1, p1, err := d.Level.n1p1(s)
	if err != nil {
		return 0, err
	}
	// R = Nt·Excess / ((n + n1)/(σp vp) + (p + p1)/(σn vn)): no division by Nt, so Nt = 0 is fine.
	return rate("SRHDefect", d.Nt*s.Excess/((s.N+n1)/(d.SigmaP*vh)+(s.P+p1)/(d.SigmaN*ve)))
}
