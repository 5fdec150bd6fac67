package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Schenk1998 is the injection-dependent band-gap narrowing of A. Schenk, "Finite-temperature
// full random-phase approximation model of band gap narrowing for silicon device simulation",
// J. Appl. Phys. 84, 3684 (1998): an analytic fit to the real part of the quasi-particle
// self-energies of electrons and holes in silicon computed in the finite-temperature full
// random-phase approximation, for any electron, hole and ionised-dopant densities and
// temperatures. It is the package's default BGN.
//
// It is a physical BGN (a shift of the band edges themselves): use it with Fermi–Dirac
// statistics. It depends on the electron and hole densities n and p as well as on the ionised
// dopant density, so it grows with injection, and it applies to undoped silicon under high
// injection too.
//
// In excitonic units, energies in Ry_ex = 16.55 meV and lengths in a_ex = 3.719 nm (so that
// densities are n·a_ex³ and the temperature is kT/Ry_ex), with n_Σ = n + p,
// n_P = α_e n + α_h p, N_i = Nd + Na and U = n_Σ²/T³, the shift of the band edge of carrier
// a ∈ {e, h} (density n_a = n or p) is the sum of an exchange–correlation and an ionic part,
//
//	Δ_a^xc = −{(4π)³ n_Σ² [(48 n_a/(π g_a))^{1/3} + c_a ln(1 + d_a n_P^{p_a})]
//	           + (8π α_a/g_a) n_a T² + sqrt(8π n_Σ) T^{5/2}}
//	         / {(4π)³ n_Σ² + T³ + b_a sqrt(n_Σ) T² + 40 n_Σ^{3/2} T},
//
//	Δ_a^i  = −N_i (1 + U) / {sqrt(T n_Σ/(2π)) [1 + h_a ln(1 + sqrt(n_Σ)/T)]
//	           + j_a U N_i^{3/4} (1 + k_a N_i^{q_a})},
//
// and ΔEg = −(Δ_e^xc + Δ_e^i + Δ_h^xc + Δ_h^i) Ry_ex, of which the electron terms lower the
// conduction-band edge and the hole terms raise the valence-band edge (BandEdgeShifts). At low
// density the fit reduces to the Debye–Hückel shifts, so ΔEg → 0 like sqrt(n_Σ); at T → 0 it
// reduces to the exchange energy (48 n_a/(π g_a))^{1/3} of a degenerate gas plus correlation.
//
// Domain. The fit is built on exact low-density and zero-temperature limits and is evaluated
// for any 0 < T <= 1687 K (the melting point of silicon) and densities up to the silicon atom
// density 5e22 cm^-3. It describes ionised dopants screened by free carriers, so it needs
// enough of them; these points return an error (errors.Is(err, pvrec.ErrOutOfRange)):
//   - n + p = 0 with Nd + Na > 0 (the free-carrier densities were not supplied);
//   - n + p < |Nd − Na|/2: plainly not quasi-neutral, a space-charge region, where the ionic
//     term would grow like N_i/sqrt(n + p) and lose its meaning (quasi-neutral points have
//     n + p >= |Nd − Na|; the factor 1/2 leaves room for solver iterates);
//   - n + p < (Nd + Na)/100: compensation so strong that the few carriers cannot screen the
//     ions (compensation ratios (Nd + Na)/|Nd − Na| up to 100 are accepted).
//
// Both thresholds are this package's choice (common practice, no source), not the paper's.
type Schenk1998 struct {
	Rydberg  float64           // excitonic Rydberg Ry_ex, eV
	Bohr     float64           // excitonic Bohr radius a_ex, cm
	Electron Schenk1998Carrier // fit parameters of the electron (conduction-band) shift
	Hole     Schenk1998Carrier // fit parameters of the hole (valence-band) shift
}

// Schenk1998Carrier holds the fit parameters of Schenk1998 for one kind of carrier (electrons
// or holes); all are dimensionless. See Schenk1998 for the formula they enter.
type Schenk1998Carrier struct {
	Alpha float64 // α = μ/m of the carrier: reduced mass over the carrier's mass (α_e + α_h = 1)
	B     float64 // b, exchange–correlation denominator coefficient
	C     float64 // c, correlation amplitude
	D     float64 // d, correlation density coefficient
	G     float64 // g, spin–valley degeneracy (12 for electrons, 4 for holes)
	H     float64 // h, ionic-term logarithm coefficient
	J     float64 // j, ionic-term degenerate-limit coefficient
	K     float64 // k, ionic-term high-density correction coefficient
	P     float64 // p, exponent of n_P in the correlation term
	Q     float64 // q, exponent of N_i in the ionic high-density correction
}

// NewSchenk1998 returns the parameters of A. Schenk, J. Appl. Phys. 84, 3684 (1998):
// Ry_ex = 16.55 meV, a_ex = 3.719 nm and
//
//	      α       b   c       d      g   h     j       k      p     q
//	e     0.5187  8   1.3346  0.893  12  3.91  2.8585  0.012  7/30  3/4
//	h     0.4813  1   1.2365  1.153   4  4.20  2.9307  0.19   7/30  1/4
//
// The tests check the exchange–correlation parameters against the Debye–Hückel shift at low
// density and the electron–hole-plasma exchange–correlation energy of P. Vashishta and
// R. K. Kalia, Phys. Rev. B 25, 6492 (1982) at T → 0; the ionic parameters h, j, k, q enter
// neither limit and rest on the paper's table alone.
func NewSchenk1998() Schenk1998 {
	return Schenk1998{
		Rydberg: 16.55e-3,
		Bohr:    3.719e-7,
		Electron: Schenk1998Carrier{
			Alpha: 0.5187, B: 8, C: 1.3346, D: 0.893, G: 12,
			H: 3.91, J: 2.8585, K: 0.012, P: 7.0 / 30, Q: 3.0 / 4,
		},
		Hole: Schenk1998Carrier{
			Alpha: 0.4813, B: 1, C: 1.2365, D: 1.153, G: 4,
			H: 4.20, J: 2.9307, K: 0.19, P: 7.0 / 30, Q: 1.0 / 4,
		},
	}
}

// String returns "Schenk1998".
func (Schenk1998) String() string { return "Schenk1998" }

// schenkMinScreening is the smallest ratio (n + p)/(Nd + Na) at which Schenk1998 is
// evaluated (see its doc comment; this package's choice).
const schenkMinScreening = 0.01

// DeltaEg returns the physical band-gap narrowing in eV at pt (all fields used), the sum of the
// two shifts of BandEdgeShifts. Errors are those of BandEdgeShifts.
func (m Schenk1998) DeltaEg(pt Point) (float64, error) {
	dEc, dEv, err := m.BandEdgeShifts(pt)
	return dEc + dEv, err
}

// BandEdgeShifts returns the downward shift dEc of the conduction-band edge and the upward
// shift dEv of the valence-band edge in eV at pt (both >= 0 with the published parameters;
// ΔEg = dEc + dEv). It returns an error for an invalid pt (naming the field), for T above
// 1687 K, a density above 5e22 cm^-3 or a point without screening carriers (see Schenk1998;
// all errors.Is(err, pvrec.ErrOutOfRange)), for Rydberg or Bohr not finite and > 0, or if
// the parameters give a non-finite result.
func (m Schenk1998) BandEdgeShifts(pt Point) (dEc, dEv float64, err error) {
	const model = "Schenk1998"
	if err := bgnCheckDensities(model, pt); err != nil {
		return 0, 0, err
	}
	if pt.T > MeltingPoint {
		return 0, 0, check.Range("silicon", model, "temperature T", "K", pt.T, 0, MeltingPoint)
	}
	if err := check.Positive("silicon: "+model, "parameter Rydberg", m.Rydberg, "eV"); err != nil {
		return 0, 0, err
	}
	if err := check.Positive("silicon: "+model, "parameter Bohr", m.Bohr, "cm"); err != nil {
		return 0, 0, err
	}
	nSum := pt.N + pt.P
	nIon := pt.Nd + pt.Na
	if nSum == 0 {
		if nIon == 0 {
			return 0, 0, nil // no carriers, no ions: nothing to narrow the gap
		}
		return 0, 0, check.Rangef(model, "N + P", nSum, math.NaN(), math.NaN(),
			"silicon: %s: needs the free-carrier densities, got N + P = 0 with Nd + Na = %g cm^-3", model, nIon)
	}
	if net := math.Abs(pt.Nd - pt.Na); nSum < 0.5*net {
		return 0, 0, check.Rangef(model, "N + P", nSum, 0.5*net, math.Inf(1),
			"silicon: %s: N + P = %g cm^-3 below |Nd − Na|/2 = %g cm^-3: not quasi-neutral (space-charge region)", model, nSum, 0.5*net)
	}
	if nSum < schenkMinScreening*nIon {
		return 0, 0, check.Rangef(model, "N + P", nSum, schenkMinScreening*nIon, math.Inf(1),
			"silicon: %s: N + P = %g cm^-3 below (Nd + Na)/%g = %g cm^-3: too few carriers to screen the ions (strong compensation)",
			model, nSum, 1/schenkMinScreening, schenkMinScreening*nIon)
	}

	// Reduced (excitonic) variables.
	a3 := m.Bohr * m.Bohr * m.Bohr
	n, p, ni, ns := pt.N*a3, pt.P*a3, nIon*a3, nSum*a3
	t := BoltzmannEV * pt.T / m.Rydberg
	e, h := &m.Electron, &m.Hole

	const (
		fourPi3 = 64 * math.Pi * math.Pi * math.Pi // (4π)³
		eightPi = 8 * math.Pi
	)
	t2 := t * t
	t3 := t2 * t
	sqrtNs := math.Sqrt(ns)
	ns2 := fourPi3 * ns * ns                           // (4π)³ n_Σ²
	debye := math.Sqrt(eightPi*ns) * t2 * math.Sqrt(t) // sqrt(8π n_Σ) T^{5/2}
	denXC := ns2 + t3 + 40*ns*sqrtNs*t                 // shared part of the xc denominator
	nP := e.Alpha*n + h.Alpha*p                        // n_P
	nPe := math.Pow(nP, e.P)                           // n_P^{p_e}
	nPh := nPe                                         // n_P^{p_h}, equal with the published p
	if h.P != e.P {
		nPh = math.Pow(nP, h.P)
	}
	xcE := (ns2*(math.Cbrt(48*n/(math.Pi*e.G))+e.C*math.Log1p(e.D*nPe)) + eightPi*e.Alpha/e.G*n*t2 + debye) /
		(denXC + e.B*sqrtNs*t2)
	xcH := (ns2*(math.Cbrt(48*p/(math.Pi*h.G))+h.C*math.Log1p(h.D*nPh)) + eightPi*h.Alpha/h.G*p*t2 + debye) /
		(denXC + h.B*sqrtNs*t2)

	var ionE, ionH float64
	if ni > 0 {
		u := ns * ns / t3
		num := ni * (1 + u)
		sq := math.Sqrt(t * ns / (2 * math.Pi))
		lnT := math.Log1p(sqrtNs / t)
		ni14 := math.Sqrt(math.Sqrt(ni))
		ni34 := ni14 * ni14 * ni14
		ionE = num / (sq*(1+e.H*lnT) + e.J*u*ni34*(1+e.K*schenkPow(ni, e.Q, ni14, ni34)))
		ionH = num / (sq*(1+h.H*lnT) + h.J*u*ni34*(1+h.K*schenkPow(ni, h.Q, ni14, ni34)))
	}

	dEc = (xcE + ionE) * m.Rydberg
	dEv = (xcH + ionH) * m.Rydberg
	if math.IsNaN(dEc) || math.IsInf(dEc, 0) || math.IsNaN(dEv) || math.IsInf(dEv, 0) {
		return 0, 0, fmt.Errorf("silicon: %s: parameters give non-finite shifts dEc = %g, dEv = %g eV at T = %g K, Nd = %g, Na = %g, N = %g, P = %g cm^-3",
			model, dEc, dEv, pt.T, pt.Nd, pt.Na, pt.N, pt.P)
	}
	return dEc, dEv, nil
}

// schenkPow returns x^q, using the precomputed x^{1/4} and x^{3/4} for the published
// exponents 1/4 and 3/4 (math.Pow costs more than the two square roots it replaces).
func schenkPow(x, q, x14, x34 float64) float64 {
	switch q {
	case 0.25:
		return x14
	case 0.75:
		return x34
	}
	return math.Pow(x, q)
}
