package silicon

import (
	"math"
)

// Klaassen1992 is the unified mobility model of D. B. M. Klaassen, "A unified mobility model
// for device simulation — I. Model equations and concentration dependence", Solid-State
// Electron. 35, 953 (1992), and "— II. Temperature dependence of carrier mobility and
// lifetime", Solid-State Electron. 35, 961 (1992). It treats majority and minority carriers
// alike: lattice scattering, scattering by ionised donors and acceptors (with the reduced
// scattering of minority carriers by repulsive ions), electron–hole scattering, screening,
// and the clustering of dopants at very high densities. For electrons (holes: exchange
// n ↔ p, Nd ↔ Na, and the parameter sets),
//
//	1/μn = 1/μL + 1/μDAeh
//	μL = μmax (300/T)^θ
//	μDAeh = μN (Nsc/Nsc,eff) (Nref/Nsc)^α + μc (n + p)/Nsc,eff
//	μN = μmax²/(μmax − μmin) (T/300)^(3α − 1.5),   μc = μmin μmax/(μmax − μmin) (300/T)^0.5
//	Nsc = Nd* + Na* + p,   Nsc,eff = Nd* + G(P) Na* + p/F(P)
//	Nd* = Nd (1 + 1/(cD + (Nref,D/Nd)²)),   Na* = Na (1 + 1/(cA + (Nref,A/Na)²))   (clustering)
//	P = 1/(fCW/PCW + fBH/PBH),   PCW = 3.97e13 (T/300)² Nsc^(−2/3),
//	PBH = 1.36e20 cm^-3/(n + p) · (m/m0) (T/300)²
//	G(P) = 1 − s1/(s2 + ((T/300)/(m/m0))^s4 P)^s3 + s5/(((m/m0)(300/T))^s7 P)^s6
//	F(P) = (r1 P^r6 + r2 + r3 m/m') / (P^r6 + r4 + r5 m/m')
//
// with m the carrier's mass and m' the other carrier's. PCW, the Conwell–Weisskopf term, is
// written for singly charged dopants (ion charge Z = 1). At 300 K for majority carriers
// without clustering the model reduces exactly to the form of Masetti et al. (see Masetti1983)
// without its high-density term: μ = μmin + (μmax − μmin)/(1 + (N/Nref)^α).
//
// G clamp (our choice, ClampG): the fit G(P) has a minimum near P ≈ 0.3 and rises below it,
// without bound (G > 1, minority carriers scattered more than majority carriers, for
// P < 0.05). We could not establish whether the fit is meant to be used below its minimum.
// With ClampG (the default), P is raised to the position of the minimum of G before G is
// evaluated, so that G never increases as the screening strengthens; without it the fit is
// used as written. P falls below the minimum only for Nsc above about 7e19 cm^-3: at
// 1e20 cm^-3 the clamp raises the minority-electron mobility by 5 %, at 3e20 cm^-3 by a
// factor of two.
//
// Validity: TMin <= T <= TMax and all densities <= NMax. The defaults, 200–500 K (the range
// of the package's default model set) and 1e21 cm^-3, are our choice, not limits stated in
// the papers.
//
// The model is a value and safe for concurrent use.
type Klaassen1992 struct {
	Electron KlaassenCarrier // parameters for electrons
	Hole     KlaassenCarrier // parameters for holes
	Donor    KlaassenCluster // clustering of donors
	Acceptor KlaassenCluster // clustering of acceptors

	FCW  float64    // weight f_CW of the Conwell–Weisskopf screening term, dimensionless
	FBH  float64    // weight f_BH of the Brooks–Herring screening term, dimensionless
	PCW0 float64    // prefactor of PCW, 3.97e13 (cm^-3)^(2/3)
	PBH0 float64    // prefactor of PBH, 1.36e20 cm^-3
	S    [7]float64 // s1 … s7 of the fit G(P) (minority-ion scattering), dimensionless
	R    [6]float64 // r1 … r6 of the fit F(P) (electron–hole scattering), dimensionless

	ClampG bool // hold G at its minimum for P below the minimum (see the type's doc)

	TMin, TMax float64 // validity range of T, K
	NMax       float64 // largest dopant or carrier density accepted, cm^-3
}

// KlaassenCarrier holds the parameters of one carrier type in Klaassen1992.
type KlaassenCarrier struct {
	MuMax float64 // lattice mobility at 300 K, μmax, cm²/(V·s)
	Theta float64 // exponent θ of the lattice mobility, μL = μmax (300/T)^θ, dimensionless
	MuMin float64 // μmin, cm²/(V·s)
	Nref  float64 // Nref, cm^-3
	Alpha float64 // α, dimensionless
	Mass  float64 // mass m/m0 entering the screening parameters, dimensionless
}

// KlaassenCluster holds the clustering parameters of one dopant type in Klaassen1992:
// N* = N (1 + 1/(C + (Nref/N)²)).
type KlaassenCluster struct {
	C    float64 // c, dimensionless
	Nref float64 // Nref, cm^-3
}

// NewKlaassen1992 returns Klaassen1992 with the parameters of Klaassen's papers (see the
// type), value from memory, cross-checked: they give the lattice mobilities 1414 and
// 470.5 cm²/(V·s) at 300 K and Masetti's majority-electron mobilities at 300 K (see
// Masetti1983), and the resistivities of the conversion standard ASTM F723 (after Thurber et
// al., J. Electrochem. Soc. 127, 1807 and 2291 (1980)) to within 3 % for boron up to
// 1e17 cm^-3, 4.5 % for phosphorus up to 3e17 cm^-3 and 10 % for both up to 1e19 cm^-3.
// The parameters of G and F and the clustering parameters have no check beyond the
// plausibility of the resulting minority-carrier mobilities.
//
//	electrons: μmax 1414, μmin 68.5 cm²/(V·s), θ 2.285, Nref 9.20e16 cm^-3, α 0.711, m/m0 1
//	holes:     μmax 470.5, μmin 44.9 cm²/(V·s), θ 2.247, Nref 2.23e17 cm^-3, α 0.719, m/m0 1.258
//	clustering: cD 0.21, Nref,D 4.0e20 cm^-3; cA 0.50, Nref,A 7.2e20 cm^-3
//	screening: fCW 2.459, fBH 3.828
//	G: s1 0.89233, s2 0.41372, s3 0.19778, s4 0.28227, s5 0.005978, s6 1.80618, s7 0.72169
//	F: r1 0.7643, r2 2.2999, r3 6.5502, r4 2.3670, r5 −0.01552, r6 0.6478
func NewKlaassen1992() Klaassen1992 {
	return Klaassen1992{
		Electron: KlaassenCarrier{MuMax: 1414, Theta: 2.285, MuMin: 68.5, Nref: 9.20e16, Alpha: 0.711, Mass: 1},
		Hole:     KlaassenCarrier{MuMax: 470.5, Theta: 2.247, MuMin: 44.9, Nref: 2.23e17, Alpha: 0.719, Mass: 1.258},
		Donor:    KlaassenCluster{C: 0.21, Nref: 4.0e20},
		Acceptor: KlaassenCluster{C: 0.50, Nref: 7.2e20},
		FCW:      2.459,
		FBH:      3.828,
		PCW0:     3.97e13,
		PBH0:     1.36e20,
		S:        [7]float64{0.89233, 0.41372, 0.19778, 0.28227, 0.005978, 1.80618, 0.72169},
		R:        [6]float64{0.7643, 2.2999, 6.5502, 2.3670, -0.01552, 0.6478},
		ClampG:   true,
		TMin:     200,
		TMax:     500,
		NMax:     1e21,
	}
}

// String returns "Klaassen1992".
func (Klaassen1992) String() string { return "Klaassen1992" }

// Mobilities returns the electron and hole mobilities in cm²/(V·s) at pt (see the type). It
// returns an error for an invalid pt, for T or a density outside the validity range
// (errors.Is(err, pvrec.ErrOutOfRange)), or if edited parameters give a non-finite or non-positive
// mobility.
func (m Klaassen1992) Mobilities(pt Point) (mun, mup float64, err error) {
	if err := checkMobilityPoint("Klaassen1992", pt, m.TMin, m.TMax, m.NMax); err != nil {
		return 0, 0, err
	}
	// Powers are computed as exp(a·ln x) with shared logarithms: math.Pow costs about seven
	// times math.Exp, and this model is evaluated in hot loops (profiles, lifetime analysis).
	tr := pt.T / 300
	k := klaassenPoint{tr2: tr * tr, ntot: pt.N + pt.P, rsqrt: 1}
	if tr != 1 { // at 300 K every temperature factor is 1: skip their exponentials
		k.lt = math.Log(tr)
		k.rsqrt = math.Exp(-0.5 * k.lt) // (300/T)^0.5 of μc
	}
	ndc := cluster(pt.Nd, m.Donor)
	nac := cluster(pt.Na, m.Acceptor)
	mun = m.carrier(&m.Electron, m.Electron.Mass/m.Hole.Mass, &k, ndc, nac, pt.P)
	mup = m.carrier(&m.Hole, m.Hole.Mass/m.Electron.Mass, &k, nac, ndc, pt.N)
	if err := checkMobilityResult("Klaassen1992", pt, mun, mup); err != nil {
		return 0, 0, err
	}
	return mun, mup, nil
}

// klaassenPoint holds the quantities shared by both carriers at one Point.
type klaassenPoint struct {
	lt    float64 // ln(T/300), exactly 0 at 300 K
	tr2   float64 // (T/300)²
	rsqrt float64 // (300/T)^0.5
	ntot  float64 // n + p, cm^-3
}

// cluster returns the clustering-enhanced density N* = N (1 + 1/(c + (Nref/N)²)).
func cluster(n float64, c KlaassenCluster) float64 {
	if n == 0 {
		return 0
	}
	r := c.Nref / n
	return n * (1 + 1/(c.C+r*r))
}

// carrier returns the mobility of one carrier type: c its parameters, mr = m/m' its mass over
// the other carrier's, k the shared quantities, nMaj and nMin the clustered densities of the
// ions that attract and repel it, and other the density of the other carrier type (cm^-3).
func (m *Klaassen1992) carrier(c *KlaassenCarrier, mr float64, k *klaassenPoint, nMaj, nMin, other float64) float64 {
	muL := c.MuMax
	if k.lt != 0 {
		muL *= math.Exp(-c.Theta * k.lt)
	}
	nsc := nMaj + nMin + other
	if nsc == 0 {
		return muL
	}
	d := c.MuMax - c.MuMin
	// μN (Nref/Nsc)^α with μN = μmax²/(μmax − μmin) (T/300)^(3α−1.5).
	muNR := c.MuMax * c.MuMax / d * math.Exp((3*c.Alpha-1.5)*k.lt+c.Alpha*math.Log(c.Nref/nsc))
	muC := c.MuMin * c.MuMax / d * k.rsqrt

	// Nsc,eff = nMaj + G nMin + other/F. A term below 1e-20 nMaj is dropped: it changes
	// Nsc,eff by less than 1e-16 unless G > 1e4 or F < 1e-4, which the fits never give in
	// their range, and dropping it spares the exponentials of G or F in low injection.
	nscEff := nMaj
	needG := nMin > 0 && !(nMin <= klaassenNegligible*nMaj)
	needF := other > 0 && !(other <= klaassenNegligible*nMaj)
	if needG || needF {
		// Screening parameter P (only minority ions and carriers need it):
		// 1/P = fCW/PCW + fBH/PBH.
		cb := math.Cbrt(nsc)
		invP := m.FCW*cb*cb/(m.PCW0*k.tr2) + m.FBH*k.ntot/(m.PBH0*k.tr2*c.Mass)
		lnP := -math.Log(invP)
		if needG {
			lnMass := 0.0 // ln(m/m0), exactly 0 for the electrons' m = m0 without a call
			if c.Mass != 1 {
				lnMass = math.Log(c.Mass)
			}
			nscEff += m.g(1/invP, lnP, lnMass, k.lt) * nMin
		}
		if needF {
			nscEff += other / m.f(lnP, mr)
		}
	}
	muDA := (muNR*nsc + muC*k.ntot) / nscEff
	return 1 / (1/muL + 1/muDA)
}

// g returns Klaassen's G(P) (lnP = ln P) for a carrier of mass m/m0 = exp(lnMass) at
// ln(T/300) = lt,
//
//	G(P) = 1 − s1/(s2 + a P)^s3 + s5/(b P)^s6,   a = ((T/300)/(m/m0))^s4,  b = ((m/m0)(300/T))^s7,
//
// with P clamped at the minimum of G if m.ClampG.
func (m *Klaassen1992) g(p, lnP, lnMass, lt float64) float64 {
	s := &m.S
	a := 1.0 // ((T/300)/(m/m0))^s4, exactly 1 for electrons at 300 K without a call
	if e := s[3] * (lt - lnMass); e != 0 {
		a = math.Exp(e)
	}
	lnB := s[6] * (lnMass - lt)
	if m.ClampG && p < gClampBelow {
		if pm := m.gMin(a, lnB); p < pm {
			p, lnP = pm, math.Log(pm)
		}
	}
	return 1 - s[0]*math.Exp(-s[2]*math.Log(s[1]+a*p)) + s[4]*math.Exp(-s[5]*(lnB+lnP))
}

// klaassenNegligible is the relative size below which a minority-ion or other-carrier term
// of Nsc,eff is dropped (see carrier).
const klaassenNegligible = 1e-20

// gClampBelow is a value of P above the minimum of G for every carrier mass and temperature
// of the default parameters (the minimum lies between P = 0.24 at 200 K and 0.43 at 500 K),
// so that the minimum need only be sought when P is smaller.
const gClampBelow = 1.0

// gMin returns the position of the minimum of G(P) = 1 − s1/(s2 + a P)^s3 + s5/(b P)^s6
// (lnB = ln b). At the minimum dG/dP = 0, that is φ(u) = 0 with u = ln P and
//
//	φ(u) = ln(s1 s3 a) − (s3 + 1) ln(s2 + a e^u) − ln(s5 s6) + s6 ln b + (s6 + 1) u,
//
// which increases strictly with u (φ' >= s6 − s3 > 0), so Newton's method from u = ln 0.3,
// safeguarded by the bracket u ∈ [ln 1e-3, ln 1e3], converges to the unique root.
func (m *Klaassen1992) gMin(a, lnB float64) float64 {
	s := &m.S
	c0 := math.Log(s[0]*s[2]*a) - math.Log(s[4]*s[5]) + s[5]*lnB
	lo, hi := math.Log(1e-3), math.Log(1e3)
	u := math.Log(0.3)
	for iter := 0; iter < 50; iter++ {
		ap := a * math.Exp(u)
		phi := c0 - (s[2]+1)*math.Log(s[1]+ap) + (s[5]+1)*u
		if phi > 0 {
			hi = u
		} else {
			lo = u
		}
		dphi := (s[5] + 1) - (s[2]+1)*ap/(s[1]+ap)
		next := u - phi/dphi
		if !(next > lo && next < hi) {
			next = 0.5 * (lo + hi)
		}
		if math.Abs(next-u) < 1e-12 {
			u = next
			break
		}
		u = next
	}
	return math.Exp(u)
}

// f returns Klaassen's F(P) (lnP = ln P) for mass ratio mr = m/m' of the carrier over the
// other carrier.
func (m *Klaassen1992) f(lnP, mr float64) float64 {
	r := &m.R
	x := math.Exp(r[5] * lnP)
	return (r[0]*x + r[1] + r[2]*mr) / (x + r[3] + r[4]*mr)
}
