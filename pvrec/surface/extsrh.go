package surface

import (
	"fmt"
	"math"
	"sort"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Validity range of ExtendedSRH (ErrOutOfRange outside it).
const (
	// MaxFixedCharge is the largest |Qf| accepted by ExtendedSRH, cm^-2 (elementary charges
	// per cm²). Beyond about 1e12 cm^-2 the accumulated or inverted surface is degenerate and
	// the Boltzmann statistics of the model overestimate its carrier density; the range is
	// that of the dielectrics of the trade.
	MaxFixedCharge = 1e13
	// MaxDopant is the largest donor or acceptor density accepted by ExtendedSRH, cm^-3: the
	// bulk must be non-degenerate for the Boltzmann space-charge solution.
	MaxDopant = 1e18
	// MaxExcess is the largest excess carrier density accepted by ExtendedSRH, cm^-3.
	MaxExcess = 1e18
)

// Numerical parameters of ExtendedSRH.
const (
	// ResidualTol is the charge-neutrality tolerance at the solution: |Qf + Qit + Qs| <=
	// ResidualTol·(|Qf| + |Qit| + |Qs|), or ErrNoConvergence.
	ResidualTol = 1e-10
	maxBend     = 300.0 // largest |ψs|/Vt searched; |Qf| <= 1e13 cm^-2 needs < 70
	maxSolveIt  = 300   // Brent iterations on the surface potential
	glOrder     = 8     // Gauss–Legendre points per panel
	maxPanelKT  = 1.0   // largest panel width in units of kT
	flatBandY   = 1e-6  // |ψs|/Vt below which the regime is FlatBand
)

// ExtendedSRH is the extended Shockley–Read–Hall model of the recombination at a
// dielectric–silicon interface of R. B. M. Girisch, R. P. Mertens and R. F. De Keersmaecker,
// "Determination of Si–SiO2 interface recombination parameters using a gate-controlled
// point-junction diode under illumination", IEEE Trans. Electron Devices 35, 203 (1988), in the
// form used by A. G. Aberle, S. Glunz and W. Warta, "Impact of illumination level and oxide
// parameters on Shockley–Read–Hall recombination at the Si–SiO2 interface", J. Appl. Phys. 71,
// 4422 (1992).
//
// Recombination through interface states of density Dit(E) with capture cross sections
// σn(E), σp(E), at the surface carrier densities ns, ps:
//
//	Us = ∫ Dit(E) (ns ps − ni,eff²) / [ (ns + n1(E))/(σp vth,p) + (ps + p1(E))/(σn vth,n) ] dE,
//	n1 = ni,eff exp((E − Ei)/kT),  p1 = ni,eff exp((Ei − E)/kT),
//
// integrated from the valence- to the conduction-band edge. With quasi-Fermi levels flat
// across the space-charge region (Boltzmann statistics), ns = n exp(y), ps = p exp(−y), where
// n, p are the densities at its edge (the recomb.State) and y = ψs/Vt the band bending (> 0: bands bend
// down, electrons are attracted), so ns ps = n p. The band bending follows from charge
// neutrality, Qf + Qit(y) + Qs(y) = 0 (all in elementary charges per cm²), with the exact
// one-dimensional Poisson solution for the space charge (e.g. S. M. Sze and K. K. Ng, Physics
// of Semiconductor Devices, 3rd ed., Wiley, 2007, ch. 4, generalised to flat quasi-Fermi
// levels as in Girisch et al. and Aberle et al.):
//
//	Qs = −sign(y) sqrt(2 εSi Vt/q) sqrt( p (e^−y + y − 1) + n (e^y − y − 1) ),
//
// and, when ChargedStates is set, the charge of the interface states under steady-state SRH
// occupancy f = (σn vn ns + σp vp p1)/(σn vn (ns + n1) + σp vp (ps + p1)): states above
// NeutralLevel are acceptor-like (charge −f), states below it donor-like (charge 1 − f).
// Outputs are referred to the edge of the space-charge region: Seff = Us/Δn and
// J0s = q Us ni,eff²/(n p − ni,eff²) (see SeffFromJ0s).
//
// Assumptions: Boltzmann statistics in the space-charge region (the surface densities are
// overestimated once they approach Nc or Nv, i.e. |Qf| above about 1e12 cm^-2 in
// accumulation or inversion); no recombination inside the space-charge region; ni,eff uniform
// across it (its value at the injected bulk state); complete ionisation there.
//
// Validity: |Qf| <= MaxFixedCharge, Nd, Na <= MaxDopant, 0 < Δn <= MaxExcess, either wafer
// polarity; the solver is a bracketed one and returns an error (check.ErrNoConvergence) rather
// than an inaccurate result. The fields are the user's: no parameters of a particular
// dielectric are implied by the model's authors. ExtendedSRH is a value and safe for
// concurrent use; the package's distributions are values too (the tabulated ones copy their
// tables in and out), so no later change by the caller reaches a model already built. A
// distribution of your own behind a pointer would be shared: prefer values.
type ExtendedSRH struct {
	Dit    DitDistribution // interface-state density versus E − Ei, cm^-2 eV^-1
	SigmaN CrossSection    // electron capture cross section versus E − Ei, cm^2
	SigmaP CrossSection    // hole capture cross section versus E − Ei, cm^2
	Qf     float64         // fixed charge density, elementary charges per cm² (cm^-2), either sign
	// Vth gives the electron and hole thermal velocities at the state's temperature, cm/s.
	// Interface parameters (Dit, σ) are commonly extracted with 1e7 cm/s for both carriers,
	// which NewExtendedSRH sets (DefaultVth); use the same convention as the source of your
	// Dit and σ, e.g. silicon.NewGreen1990ThermalVelocity() for the bulk defects' values.
	Vth  silicon.ThermalVelocity
	EpsR float64 // relative permittivity of silicon, dimensionless
	// ChargedStates includes the charge of the interface states, Qit, in charge neutrality.
	// When false (the default of NewExtendedSRH) the states are taken as neutral, the usual
	// simplification when |Qf| is much larger than the charge the states can hold.
	ChargedStates bool
	// NeutralLevel is the energy E − Ei (eV) above which interface states are acceptor-like
	// and below which they are donor-like (used only with ChargedStates). NewExtendedSRH sets
	// 0 (Ei), the common choice (no source).
	NeutralLevel float64
}

// Defaults of NewExtendedSRH.
const (
	// DefaultVth is the thermal velocity at 300 K used for electrons and holes by
	// NewExtendedSRH, 1e7 cm/s (common practice, no source); it scales as sqrt(T/300 K) like
	// every silicon.ThermalVelocity.
	DefaultVth = 1e7
)

// NewExtendedSRH returns the model for interface states dit with capture cross sections
// sigmaN, sigmaP and fixed charge qf (cm^-2, either sign), with thermal velocities
// DefaultVth at 300 K, the permittivity silicon.RelativePermittivity and neutral interface
// states (ChargedStates false).
func NewExtendedSRH(dit DitDistribution, sigmaN, sigmaP CrossSection, qf float64) ExtendedSRH {
	return ExtendedSRH{
		Dit: dit, SigmaN: sigmaN, SigmaP: sigmaP, Qf: qf,
		Vth:  silicon.ThermalVelocity{Electron300: DefaultVth, Hole300: DefaultVth},
		EpsR: silicon.RelativePermittivity,
	}
}

// String returns e.g. "ExtendedSRH(Qf -1e+12 cm^-2, ConstantDit(1e+11 cm^-2 eV^-1),
// σn 1e-16 cm^2, σp 1e-16 cm^2)".
func (m ExtendedSRH) String() string {
	q := ""
	if m.ChargedStates {
		q = ", charged states"
	}
	return fmt.Sprintf("ExtendedSRH(Qf %g cm^-2, %v, σn %v, σp %v%s)", m.Qf, m.Dit, m.SigmaN, m.SigmaP, q)
}

// Regime is the state of the surface space-charge region.
type Regime uint8

const (
	// FlatBand: |ψs| < 1e-6 Vt.
	FlatBand Regime = iota + 1
	// Accumulation: the bands bend towards the majority carriers, which accumulate at the
	// surface (ps > p for p-type).
	Accumulation
	// Depletion: the bands bend against the majority carriers, whose surface density falls
	// below that of the bulk but stays at least that of the minority carriers (ns <= ps for
	// p-type).
	Depletion
	// Inversion: the minority carriers outnumber the majority carriers at the surface
	// (ns > ps for p-type).
	Inversion
)

// String returns "flat band", "accumulation", "depletion" or "inversion".
func (r Regime) String() string {
	switch r {
	case FlatBand:
		return "flat band"
	case Accumulation:
		return "accumulation"
	case Depletion:
		return "depletion"
	case Inversion:
		return "inversion"
	}
	return fmt.Sprintf("Regime(%d)", uint8(r))
}

// Result is the solution of ExtendedSRH at one bulk state.
type Result struct {
	State    recomb.State // quasi-neutral bulk state at the edge of the space-charge region
	Psi      float64      // band bending ψs (surface potential relative to the bulk), V; > 0: bands bend down
	Ns, Ps   float64      // electron and hole densities at the surface, cm^-3
	Qf       float64      // fixed charge, cm^-2 (elementary charges per cm²)
	Qit      float64      // charge in interface states, cm^-2 (0 unless ChargedStates)
	Qs       float64      // charge in the silicon space-charge region, cm^-2
	Residual float64      // charge-neutrality residual Qf + Qit + Qs at the solution, cm^-2
	Us       float64      // surface recombination rate, cm^-2 s^-1
	Seff     float64      // effective surface recombination velocity Us/Δn, cm/s
	J0s      float64      // surface saturation current density, A/cm^2
	Regime   Regime       // accumulation, depletion, inversion or flat band
}

// Solve returns the band bending, surface densities, charges, recombination rate, Seff and
// J0s of the interface at the quasi-neutral bulk state s (see the type's doc comment). It
// returns an error for an invalid model or s, an argument outside the validity range (ErrOutOfRange), or a solve
// that does not meet its tolerances (check.ErrNoConvergence).
func (m ExtendedSRH) Solve(s recomb.State) (Result, error) {
	return m.solve(s, maxPanelKT, glOrder)
}

// Seff returns Solve(s).Seff in cm/s, so that ExtendedSRH is a Model.
func (m ExtendedSRH) Seff(s recomb.State) (float64, error) {
	r, err := m.Solve(s)
	if err != nil {
		return 0, err
	}
	return r.Seff, nil
}

// Curve returns Solve at the states of wafer b at each excess density in dn (cm^-3), e.g. an
// Seff(Δn) or J0s(Δn) curve. It stops at the first error, naming the Δn.
func (m ExtendedSRH) Curve(b *recomb.Bulk, dn []float64) ([]Result, error) {
	out := make([]Result, len(dn))
	for i, x := range dn {
		s, err := b.State(x)
		if err != nil {
			return nil, fmt.Errorf("surface: ExtendedSRH.Curve: %w", err)
		}
		if out[i], err = m.Solve(s); err != nil {
			return nil, fmt.Errorf("surface: at Δn = %g cm^-3: %w", x, err)
		}
	}
	return out, nil
}

// validate checks the model's fields and s against the validity range.
func (m ExtendedSRH) validate(s recomb.State) error {
	switch {
	case m.Dit == nil:
		return fmt.Errorf("surface: ExtendedSRH.Dit is nil")
	case m.SigmaN == nil:
		return fmt.Errorf("surface: ExtendedSRH.SigmaN is nil")
	case m.SigmaP == nil:
		return fmt.Errorf("surface: ExtendedSRH.SigmaP is nil")
	}
	for _, v := range []any{m.Dit, m.SigmaN, m.SigmaP} {
		if c, ok := v.(interface{ Validate() error }); ok {
			if err := c.Validate(); err != nil {
				return err
			}
		}
	}

	if err := check.Positive("surface", "ExtendedSRH.EpsR", m.EpsR, ""); err != nil {
		return err
	}
	if err := check.Finite("surface", "ExtendedSRH.NeutralLevel", m.NeutralLevel, "eV"); err != nil {
		return err
	}
	if err := check.Finite("surface", "ExtendedSRH.Qf", m.Qf, "cm^-2"); err != nil {
		return err
	}
	if math.Abs(m.Qf) > MaxFixedCharge {
		return check.Range("surface", "ExtendedSRH", "fixed charge Qf", "cm^-2", m.Qf, -MaxFixedCharge, MaxFixedCharge)
	}
	if _, err := excess(s); err != nil {
		return err
	}
	if s.NdIon > MaxDopant {
		return check.Range("surface", "ExtendedSRH", "donor density Nd", "cm^-3", s.NdIon, 0, MaxDopant)
	}
	if s.NaIon > MaxDopant {
		return check.Range("surface", "ExtendedSRH", "acceptor density Na", "cm^-3", s.NaIon, 0, MaxDopant)
	}
	if s.Dn > MaxExcess {
		return check.Range("surface", "ExtendedSRH", "excess density Δn", "cm^-3", s.Dn, 0, MaxExcess)
	}
	return nil
}

// node is one quadrature node of the energy integral, with everything that does not depend
// on the band bending.
type node struct {
	w        float64 // quadrature weight times Dit, cm^-2
	cn, cp   float64 // σn vth,n and σp vth,p, cm^3/s
	n1, p1   float64 // SRH emission densities, cm^-3
	acceptor bool    // state above NeutralLevel
}

// grid returns the quadrature nodes over the gap: composite Gauss–Legendre with order points
// per panel, panels no wider than maxPanel·kT, with panel ends at every breakpoint of Dit and
// the cross sections (and NeutralLevel if the states are charged). Nodes where Dit = 0 are
// dropped.
//
// Error control: the integrands (recombination rate and occupancy) are analytic in E, with
// the poles of their Fermi-like factors at least π kT from the real axis, and the
// distributions put kinks, steps and narrow features on breakpoints. On a panel of width kT
// the 8-point rule then converges like ρ^−16 with ρ ≈ 12.6 (Bernstein ellipse through the
// nearest pole), below 1e-16 relative; the tests confirm 1e-12 against panels 8 times
// narrower with 16 points.
func (m ExtendedSRH) grid(s recomb.State, ve, vh, maxPanel float64, order int) ([]node, error) {
	vt := s.Vt
	eLo := -vt * math.Log(s.Nv/s.NiEff)
	eHi := vt * math.Log(s.Nc/s.NiEff)
	if !(eHi > eLo) {
		return nil, fmt.Errorf("surface: empty gap: band edges at %g and %g eV from Ei (ni,eff = %g cm^-3 >= Nc or Nv)", eLo, eHi, s.NiEff)
	}
	breaks := []float64{eLo, eHi}
	add := func(bs []float64) {
		for _, e := range bs {
			if e > eLo && e < eHi {
				breaks = append(breaks, e)
			}
		}
	}
	add(m.Dit.Breakpoints())
	add(m.SigmaN.Breakpoints())
	add(m.SigmaP.Breakpoints())
	if m.ChargedStates {
		add([]float64{m.NeutralLevel})
	}
	sort.Float64s(breaks)
	rule := legendreRule(order)
	nodes := make([]node, 0, int((eHi-eLo)/(maxPanel*vt)+float64(len(breaks)))*order)
	for i := 0; i+1 < len(breaks); i++ {
		a, c := breaks[i], breaks[i+1]
		if !(c > a) {
			continue
		}
		np := int(math.Ceil((c - a) / (maxPanel * vt)))
		h := (c - a) / float64(np)
		for k := 0; k < np; k++ {
			lo := a + float64(k)*h
			for j := range rule.x {
				e := lo + 0.5*h*(rule.x[j]+1)
				d := m.Dit.Density(e)
				if math.IsNaN(d) || math.IsInf(d, 0) || d < 0 {
					return nil, fmt.Errorf("surface: ExtendedSRH.Dit %v gives Dit = %g cm^-2 eV^-1 at E − Ei = %g eV; want finite >= 0", m.Dit, d, e)
				}
				if d == 0 {
					continue
				}
				sn, sp := m.SigmaN.Sigma(e), m.SigmaP.Sigma(e)
				if !(sn > 0) || math.IsInf(sn, 0) {
					return nil, fmt.Errorf("surface: ExtendedSRH.SigmaN %v gives σn = %g cm^2 at E − Ei = %g eV; want finite > 0", m.SigmaN, sn, e)
				}
				if !(sp > 0) || math.IsInf(sp, 0) {
					return nil, fmt.Errorf("surface: ExtendedSRH.SigmaP %v gives σp = %g cm^2 at E − Ei = %g eV; want finite > 0", m.SigmaP, sp, e)
				}
				x := math.Exp(e / vt)
				nodes = append(nodes, node{
					w: 0.5 * h * rule.w[j] * d, cn: sn * ve, cp: sp * vh,
					n1: s.NiEff * x, p1: s.NiEff / x, acceptor: e > m.NeutralLevel,
				})
			}
		}
	}
	return nodes, nil
}

// chargeQit returns the interface-state charge in cm^-2 at surface densities ns, ps.
func chargeQit(nodes []node, ns, ps float64) float64 {
	var q float64
	for i := range nodes {
		nd := &nodes[i]
		den := nd.cn*(ns+nd.n1) + nd.cp*(ps+nd.p1)
		if nd.acceptor {
			q -= nd.w * (nd.cn*ns + nd.cp*nd.p1) / den
		} else {
			q += nd.w * (nd.cn*nd.n1 + nd.cp*ps) / den
		}
	}
	return q
}

// rateUs returns the surface recombination rate in cm^-2 s^-1 at surface densities ns, ps,
// with np = ns ps − ni,eff² in cm^-6.
func rateUs(nodes []node, ns, ps, np float64) float64 {
	var u float64
	for i := range nodes {
		nd := &nodes[i]
		u += nd.w / ((ns+nd.n1)/nd.cp + (ps+nd.p1)/nd.cn)
	}
	return u * np
}

// phi2 returns (e^y − 1 − y)/y², accurate to a few ulp for all y (1/2 at y = 0).
func phi2(y float64) float64 {
	if math.Abs(y) < 1e-3 {
		return 0.5 + y*(1.0/6+y*(1.0/24+y*(1.0/120+y*(1.0/720))))
	}
	return (math.Expm1(y) - y) / (y * y)
}

// spaceCharge returns the space-charge density Qs in cm^-2 at band bending y = ψs/Vt for
// edge densities n, p (cm^-3), with k2 = 2 εSi Vt / q in cm^-1: Qs = −y sqrt(k2 (n φ(y) + p φ(−y)))
// with φ(y) = (e^y − 1 − y)/y², the exact Poisson solution written without a sign function.
func spaceCharge(y, n, p, k2 float64) float64 {
	return -y * math.Sqrt(k2*(n*phi2(y)+p*phi2(-y)))
}

func (m ExtendedSRH) solve(s recomb.State, maxPanel float64, order int) (Result, error) {
	if err := m.validate(s); err != nil {
		return Result{}, err
	}
	np := s.Excess // validated (positive) by m.validate
	ve, vh, err := m.Vth.At(s.T)
	if err != nil {
		return Result{}, fmt.Errorf("surface: ExtendedSRH.Vth: %w", err)
	}
	nodes, err := m.grid(s, ve, vh, maxPanel, order)
	if err != nil {
		return Result{}, err
	}
	n, p := s.N, s.P
	k2 := 2 * m.EpsR * silicon.VacuumPermittivity * s.Vt / silicon.ElementaryCharge
	surf := func(y float64) (float64, float64) { return n * math.Exp(y), p * math.Exp(-y) }
	qit := func(y float64) float64 {
		if !m.ChargedStates {
			return 0
		}
		ns, ps := surf(y)
		return chargeQit(nodes, ns, ps)
	}
	// F(y) = Qf + Qit(y) + Qs(y) decreases strictly with y (Qs strictly, Qit weakly: the
	// occupancy f grows with ns and falls with ps), so its root is unique.
	F := func(y float64) (float64, error) { return m.Qf + qit(y) + spaceCharge(y, n, p, k2), nil }
	f0, _ := F(0)
	y := 0.0
	if f0 != 0 {
		// Expand a bracket away from 0 in the direction of the root.
		dir := 1.0
		if f0 < 0 {
			dir = -1
		}
		lo, flo := 0.0, f0
		hi := dir
		fhi, _ := F(hi)
		for (fhi > 0) == (f0 > 0) && fhi != 0 {
			if math.Abs(hi) >= maxBend {
				return Result{}, fmt.Errorf("surface: no band bending within ±%g Vt balances Qf = %g cm^-2 (n = %g, p = %g cm^-3): %w",
					maxBend, m.Qf, n, p, check.ErrNoConvergence)
			}
			lo, flo = hi, fhi
			hi = math.Max(-maxBend, math.Min(maxBend, 2*hi))
			fhi, _ = F(hi)
		}
		if y, err = roots.Solve(F, lo, hi, flo, fhi, 0, maxSolveIt); err != nil {
			return Result{}, fmt.Errorf("surface: surface-potential solve at Qf = %g cm^-2, Δn = %g cm^-3: %w", m.Qf, s.Dn, err)
		}
	}
	ns, ps := surf(y)
	r := Result{
		State: s, Psi: y * s.Vt, Ns: ns, Ps: ps,
		Qf: m.Qf, Qit: qit(y), Qs: spaceCharge(y, n, p, k2),
	}
	r.Residual = r.Qf + r.Qit + r.Qs
	if scale := math.Abs(r.Qf) + math.Abs(r.Qit) + math.Abs(r.Qs); !(math.Abs(r.Residual) <= ResidualTol*scale) {
		return Result{}, fmt.Errorf("surface: charge-neutrality residual %g cm^-2 exceeds %g of %g cm^-2 at Qf = %g cm^-2, Δn = %g cm^-3: %w",
			r.Residual, ResidualTol, scale, m.Qf, s.Dn, check.ErrNoConvergence)
	}
	r.Us = rateUs(nodes, ns, ps, np)
	r.Seff = r.Us / s.Dn
	r.J0s = silicon.ElementaryCharge * r.Us * s.NiEff * s.NiEff / np
	r.Regime = regime(y, ns, ps, s.PType())
	for _, v := range [...]float64{r.Us, r.Seff, r.J0s, r.Ns, r.Ps} {
		if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > check.MaxMagnitude {
			return Result{}, fmt.Errorf("surface: non-finite result (Us = %g cm^-2 s^-1, ns = %g, ps = %g cm^-3) at Qf = %g cm^-2, Δn = %g cm^-3: %w",
				r.Us, r.Ns, r.Ps, m.Qf, s.Dn, check.ErrNoConvergence)
		}
	}
	return r, nil
}

// regime classifies the band bending y = ψs/Vt for surface densities ns, ps.
func regime(y, ns, ps float64, pType bool) Regime {
	if math.Abs(y) < flatBandY {
		return FlatBand
	}
	if !pType { // n-type: mirror
		y, ns, ps = -y, ps, ns
	}
	switch {
	case y < 0:
		return Accumulation
	case ns > ps:
		return Inversion
	}
	return Depletion
}
