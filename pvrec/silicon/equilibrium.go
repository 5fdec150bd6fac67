package silicon

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/pvrec/pvrec/pvrec/fermi"
	"github.com/pvrec/pvrec/pvrec/internal/roots"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Equilibrium is the thermal-equilibrium state of doped silicon returned by
// Material.Equilibrium. Band edges are the narrowed ones; see Material.Equilibrium for the
// split of the narrowing between the bands.
type Equilibrium struct {
	N0, P0       float64 // equilibrium electron and hole densities, cm^-3
	NdIon, NaIon float64 // ionised donor and acceptor densities, cm^-3
	DeltaEg      float64 // band-gap narrowing at the solution, eV
	NiEff        float64 // effective intrinsic density sqrt(N0 P0), cm^-3
	EFMinusEc    float64 // Fermi level above the narrowed conduction-band edge, EF − Ec, eV (< 0 unless degenerate)
	EvMinusEF    float64 // Fermi level below the narrowed valence-band edge, Ev − EF, eV (< 0 unless degenerate)
}

// Tolerances of the equilibrium solver.
const (
	etaTol      = 1e-14 // reduced Fermi level: relative accuracy of the carrier densities
	bgnTolEV    = 1e-13 // self-consistency of ΔEg, eV (about 4e-12 relative in ni,eff at 300 K)
	maxBGNIters = 50    // fixed-point iterations on ΔEg before the bracketed fallback
)

// carriers is a solution of charge neutrality at fixed ΔEg.
type carriers struct {
	n, p, ndIon, naIon, etaN, etaP float64
}

// Equilibrium returns the thermal-equilibrium carrier densities of silicon with donor density
// nd and acceptor density na in cm^-3 (finite, >= 0; compensation allowed), from charge
// neutrality
//
//	n0 − p0 = Nd⁺ − Na⁻,   n0 = Nc F(ηn),  p0 = Nv F(ηp),  ηn + ηp = −(Eg,stat − ΔEg)/kT,
//
// with F = exp (Boltzmann) or F_{1/2} (Fermi–Dirac), Eg,stat = kT ln(Nc Nv/ni²) the gap implied
// by the intrinsic-density model (see ModelSet) and ΔEg the BGN model evaluated at the
// solution, Point{T, Nd⁺, Na⁻, n0, p0}.
//
// Method. At fixed ΔEg, Boltzmann statistics with complete ionisation have the closed form
// n0 = N/2 + sqrt((N/2)² + ni,eff²), p0 = ni,eff²/n0 for N = Nd − Na >= 0 (mirrored for
// N < 0). Otherwise the reduced Fermi level of the majority carrier is found by Newton steps
// safeguarded by bisection in a bracket that is proven to hold the root (Fermi–Dirac,
// complete ionisation), or by Brent's method between the solutions for all donors and all
// acceptors ionised (other Ionization models). The minority density is always computed from
// its own reduced Fermi level, never as a difference of large numbers, so it keeps full
// relative accuracy (about 1e-14) at any doping. Carrier-dependent BGN (such as Schenk's) is made
// self-consistent by fixed-point iteration on ΔEg to 1e-13 eV, falling back on Brent's method
// for the fixed point (bracketed from the iterates, or by expanding steps up to 20 eV) when the
// iteration contracts slowly or diverges, so the solver always converges or returns an error.
//
// Band edges. The carrier densities depend only on the total narrowing ΔEg, not on how it is
// shared between the bands. For the reported Fermi level our documented choice is an equal
// split: the narrowed conduction-band edge lies ΔEg/2 below the unnarrowed one and the
// narrowed valence-band edge ΔEg/2 above it. EFMinusEc and EvMinusEF are relative to the
// narrowed edges.
//
// It returns an error for invalid nd or na, a range error (errors.Is(err,
// pvrec.ErrOutOfRange)) for nd + na above AtomDensity, an error from a model, a narrowing that
// closes the gap, or densities that are not representable (for instance a minority density
// below 1e-308 cm^-3).
func (m *Material) Equilibrium(nd, na float64) (Equilibrium, error) {
	if err := m.ready("Material.Equilibrium"); err != nil {
		return Equilibrium{}, err
	}
	if err := check.Density("silicon", "density nd", nd); err != nil {
		return Equilibrium{}, err
	}
	if err := check.Density("silicon", "density na", na); err != nil {
		return Equilibrium{}, err
	}
	if s := nd + na; s > AtomDensity {
		return Equilibrium{}, check.Rangef("Material", "Nd + Na", s, 0, AtomDensity,
			"silicon: Material.Equilibrium: Nd + Na = %g cm^-3 above the silicon atom density %g cm^-3", s, AtomDensity)
	}
	// Starting point: Boltzmann, complete ionisation, no narrowing.
	start := m.boltzmannComplete(nd, na, 0)
	d, err := m.deltaEg(start.n, start.p, start.ndIon, start.naIon)
	if err != nil {
		return Equilibrium{}, err
	}
	// Fixed-point iteration ΔEg ← BGN(carriers(ΔEg)); exact after one step for BGN models
	// that do not depend on the carriers, fast for physical carrier-dependent ones (whose
	// dependence on the minority density is weak), and abandoned for the bracketed fallback
	// as soon as the correction shrinks by less than half per step.
	hist := make([][2]float64, 0, 8) // (ΔEg, φ(ΔEg) = BGN(carriers(ΔEg)) − ΔEg)
	for k := 0; k < maxBGNIters; k++ {
		c, err := m.solveAt(nd, na, d)
		if err != nil {
			return Equilibrium{}, err
		}
		d2, err := m.deltaEg(c.n, c.p, c.ndIon, c.naIon)
		if err != nil {
			if k > 0 { // the iteration itself left the model's range: say so, keep the cause
				return Equilibrium{}, fmt.Errorf("silicon: BGN model %s: no self-consistent band-gap narrowing found (the iteration reached %w)", modelName(m.ms.BGN), err)
			}
			return Equilibrium{}, err
		}
		phi := d2 - d
		if math.Abs(phi) <= bgnTolEV {
			return m.result(c, d)
		}
		hist = append(hist, [2]float64{d, phi})
		if k > 0 && math.Abs(phi) > 0.5*math.Abs(hist[k-1][1]) {
			break // contracting slowly or diverging: bracket instead
		}
		d = d2
	}
	d, err = m.bgnFallback(nd, na, hist)
	if err != nil {
		if strings.HasPrefix(err.Error(), "silicon: BGN model") {
			return Equilibrium{}, err
		}
		return Equilibrium{}, fmt.Errorf("silicon: BGN model %s: no self-consistent band-gap narrowing found (the search reached %w)", modelName(m.ms.BGN), err)
	}
	c, err := m.solveAt(nd, na, d)
	if err != nil {
		return Equilibrium{}, err
	}
	return m.result(c, d)
}

// result packs a solution, checking that it is representable and that the narrowing leaves
// a gap.
func (m *Material) result(c carriers, d float64) (Equilibrium, error) {
	if err := m.checkGap(d, c.n, c.p, c.ndIon, c.naIon); err != nil {
		return Equilibrium{}, err
	}
	for _, v := range [...]float64{c.n, c.p} {
		if !(v > 0) || math.IsInf(v, 0) {
			return Equilibrium{}, fmt.Errorf("silicon: equilibrium carrier densities n0 = %g, p0 = %g cm^-3 not representable at T = %g K",
				c.n, c.p, m.t)
		}
	}
	return Equilibrium{
		N0: c.n, P0: c.p, NdIon: c.ndIon, NaIon: c.naIon, DeltaEg: d,
		NiEff:     math.Sqrt(c.n) * math.Sqrt(c.p),
		EFMinusEc: c.etaN * m.vt,
		EvMinusEF: c.etaP * m.vt,
	}, nil
}

// bgnFallback solves φ(Δ) = BGN(carriers(Δ)) − Δ = 0 by Brent's method when fixed-point
// iteration has not converged. φ > 0 for Δ → −∞ and φ < 0 for Δ → +∞ (BGN grows more slowly
// than Δ), so a bracket is found from the iterates hist or by expanding from the last one.
func (m *Material) bgnFallback(nd, na float64, hist [][2]float64) (float64, error) {
	phi := func(x float64) (float64, error) {
		c, err := m.solveAt(nd, na, x)
		if err != nil {
			return 0, err
		}
		d, err := m.deltaEg(c.n, c.p, c.ndIon, c.naIon)
		return d - x, err
	}
	lo, hi := math.Inf(-1), math.Inf(1)
	var flo, fhi float64
	for _, h := range hist {
		if h[1] > 0 && (math.IsInf(lo, -1) || h[0] > lo) {
			lo, flo = h[0], h[1]
		}
		if h[1] < 0 && (math.IsInf(hi, 1) || h[0] < hi) {
			hi, fhi = h[0], h[1]
		}
	}
	if math.IsInf(lo, -1) && math.IsInf(hi, 1) { // every residual was exactly 0: converged
		return hist[len(hist)-1][0], nil
	}
	if math.IsInf(lo, -1) || math.IsInf(hi, 1) {
		// Only one side is known: expand from it, phi being decreasing, in steps growing from
		// twice the last residual up to 20 eV away.
		x0, f0 := hi, fhi
		if math.IsInf(hi, 1) {
			x0, f0 = lo, flo
		}
		step := math.Max(2*math.Abs(hist[len(hist)-1][1]), 1e-6)
		var err error
		lo, hi, flo, fhi, err = roots.Bracket(phi, x0, f0, step, 2, x0-20, x0+20, false)
		if errors.Is(err, roots.ErrNoBracket) {
			return 0, fmt.Errorf("silicon: BGN model %s: no self-consistent band-gap narrowing found", modelName(m.ms.BGN))
		}
		if err != nil {
			return 0, err
		}
	}
	return brentRoot(phi, lo, hi, flo, fhi, bgnTolEV)
}

// solveAt solves charge neutrality at fixed narrowing d (eV).
func (m *Material) solveAt(nd, na, d float64) (carriers, error) {
	if m.complete {
		if m.ms.Statistics == Boltzmann {
			return m.boltzmannComplete(nd, na, d), nil
		}
		return m.fermiComplete(nd, na, d), nil
	}
	return m.solveIonization(nd, na, d)
}

// boltzmannComplete is the closed-form solution for Boltzmann statistics and complete
// ionisation at narrowing d (eV).
func (m *Material) boltzmannComplete(nd, na, d float64) carriers {
	nie := m.ni * math.Exp(d/(2*m.vt))
	net := nd - na
	var n, p float64
	if net >= 0 {
		n = 0.5*net + math.Hypot(0.5*net, nie)
		p = nie * (nie / n)
	} else {
		p = -0.5*net + math.Hypot(0.5*net, nie)
		n = nie * (nie / p)
	}
	return carriers{n: n, p: p, ndIon: nd, naIon: na, etaN: math.Log(n / m.nc), etaP: math.Log(p / m.nv)}
}

// fermiComplete solves neutrality under Fermi–Dirac statistics and complete ionisation at
// narrowing d (eV), for the majority carrier's reduced Fermi level.
func (m *Material) fermiComplete(nd, na, d float64) carriers {
	g := m.gap0 - d/m.vt // ηn + ηp = −g
	nie := m.ni * math.Exp(d/(2*m.vt))
	net := nd - na
	if net >= 0 {
		etaN := fermiMajority(net, m.nc, m.nv, g, nie)
		etaP := -g - etaN
		return carriers{n: m.nc * fermi.Half(etaN), p: m.nv * fermi.Half(etaP), ndIon: nd, naIon: na, etaN: etaN, etaP: etaP}
	}
	etaP := fermiMajority(-net, m.nv, m.nc, g, nie)
	etaN := -g - etaP
	return carriers{n: m.nc * fermi.Half(etaN), p: m.nv * fermi.Half(etaP), ndIon: nd, naIon: na, etaN: etaN, etaP: etaP}
}

// fermiMajority returns the reduced Fermi level η of the majority band (effective density of
// states nMaj) solving nMaj F(η) − nMin F(−g − η) = net >= 0, with nie = sqrt(nMaj nMin) e^{−g/2}.
//
// Bracket: with Boltzmann statistics the majority density would be
// nB = net/2 + sqrt((net/2)² + nie²); since F_{1/2}(η) <= e^η, the Fermi–Dirac majority density
// is at most nB, so h(ηhi) >= 0 at ηhi = F⁻¹(nB/nMaj); and since the minority density falls as
// η rises, h(ηlo) <= 0 at ηlo = F⁻¹((net + pmin(ηhi))/nMaj) <= ηhi.
func fermiMajority(net, nMaj, nMin, g, nie float64) float64 {
	h := func(eta float64) (f, df float64) {
		etaM := -g - eta
		return nMaj*fermi.Half(eta) - nMin*fermi.Half(etaM) - net,
			nMaj*fermi.MinusHalf(eta) + nMin*fermi.MinusHalf(etaM)
	}
	nB := 0.5*net + math.Hypot(0.5*net, nie)
	hi := invHalf(nB / nMaj)
	lo := invHalf((net + nMin*fermi.Half(-g-hi)) / nMaj)
	// Guard the proven bracket against rounding in the inversions.
	// Guard the proven bracket against rounding in the inversions (bounded: a NaN residual,
	// possible only for unrepresentable densities, ends the loops and surfaces in the result).
	fhi, dhi := h(hi)
	w := 1e-14 * math.Max(1, math.Abs(hi))
	for i := 0; i < 60 && fhi < 0; i, w = i+1, 4*w {
		hi += w
		fhi, dhi = h(hi)
	}
	w = 1e-14 * math.Max(1, math.Abs(lo))
	for i := 0; i < 60; i, w = i+1, 4*w {
		if flo, _ := h(lo); !(flo > 0) {
			break
		}
		lo -= w
	}
	return newtonRoot(h, lo, hi, hi, fhi, dhi, etaTol)
}

// invHalf inverts F_{1/2} for y > 0 (the callers guarantee it).
func invHalf(y float64) float64 {
	eta, err := fermi.InvHalf(y)
	if err != nil {
		return math.Log(y) // y underflowed to 0: −Inf, caught later as an unrepresentable density
	}
	return eta
}

// stat returns the carrier-statistics function F (exp or F_{1/2}).
func (m *Material) stat(eta float64) float64 {
	if m.ms.Statistics == Boltzmann {
		return math.Exp(eta)
	}
	return fermi.Half(eta)
}

// solveIonization solves neutrality with a general Ionization model at narrowing d (eV):
// Brent's method on ηn between the solutions with all donors ionised and no acceptors
// (upper bound) and all acceptors ionised and no donors (lower bound). The residual
// n − p − Nd⁺ + Na⁻ increases with ηn because Nd⁺ falls and Na⁻ rises with the Fermi level.
func (m *Material) solveIonization(nd, na, d float64) (carriers, error) {
	g := m.gap0 - d/m.vt
	var upper, lower carriers
	if m.ms.Statistics == Boltzmann {
		upper, lower = m.boltzmannComplete(nd, 0, d), m.boltzmannComplete(0, na, d)
	} else {
		upper, lower = m.fermiComplete(nd, 0, d), m.fermiComplete(0, na, d)
	}
	var ndI, naI float64
	res := func(etaN float64) (float64, error) {
		etaP := -g - etaN
		var err error
		ndI, naI, err = m.ms.Ionization.Ionized(m.t, nd, na, etaN, etaP)
		if err != nil {
			return 0, err
		}
		if !(ndI >= 0 && ndI <= nd && naI >= 0 && naI <= na) {
			return 0, fmt.Errorf("silicon: Ionization model %s gives Nd+ = %g, Na- = %g cm^-3 outside [0, Nd = %g], [0, Na = %g]",
				modelName(m.ms.Ionization), ndI, naI, nd, na)
		}
		// Carriers and ions are differenced separately, so that in compensated silicon
		// the ionic charge cancels exactly instead of swamping the carrier densities.
		return (m.nc*m.stat(etaN) - m.nv*m.stat(etaP)) - (ndI - naI), nil
	}
	a, b := lower.etaN, upper.etaN
	fa, err := res(a)
	if err != nil {
		return carriers{}, err
	}
	fb, err := res(b)
	if err != nil {
		return carriers{}, err
	}
	// Rounding can leave an end point with the wrong sign when the root sits on it.
	if fa > 0 {
		fa = 0
	}
	if fb < 0 {
		fb = 0
	}
	eta, err := brentRoot(res, a, b, fa, fb, etaTol*math.Max(1, math.Abs(b)))
	if err != nil {
		return carriers{}, err
	}
	if _, err := res(eta); err != nil { // ionised densities at the root
		return carriers{}, err
	}
	etaP := -g - eta
	return carriers{n: m.nc * m.stat(eta), p: m.nv * m.stat(etaP), ndIon: ndI, naIon: naI, etaN: eta, etaP: etaP}, nil
}
