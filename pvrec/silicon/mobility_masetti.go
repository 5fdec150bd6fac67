package silicon

import (
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Masetti1983 is the empirical dependence of the carrier mobilities on dopant density at
// room temperature of G. Masetti, M. Severi and S. Solmi, "Modeling of carrier mobility
// against carrier concentration in arsenic-, phosphorus-, and boron-doped silicon", IEEE
// Trans. Electron Devices 30, 764 (1983):
//
//	μ(N) = μmin1 exp(−Pc/N) + (μmax − μmin2)/(1 + (N/Cr)^α) − μ1/(1 + (Cs/N)^β),
//
// fitted to majority-carrier mobilities, with separate parameter sets for phosphorus- and
// arsenic-doped (electrons) and boron-doped (holes) silicon. As is common practice (no
// source), N is the total ionised dopant density Nd + Na for both carriers, and the formula is
// used for minority carriers too; the model ignores the free-carrier densities and the
// temperature.
//
// Validity: TMin <= T <= TMax and Nd + Na <= NMax. The fits are for 300 K; the default
// window 295–305 K is our choice, within which the ignored lattice temperature dependence
// (about (300/T)^2.3, see Klaassen1992) changes the mobility by at most 4 %. NMax = 1e21 cm^-3
// is our choice.
//
// The model is a value and safe for concurrent use.
type Masetti1983 struct {
	Electron MasettiParams // electrons: phosphorus or arsenic set
	Hole     MasettiParams // holes: boron set

	TMin, TMax float64 // validity range of T, K
	NMax       float64 // largest total dopant density Nd + Na accepted, cm^-3
}

// MasettiParams is one parameter set of Masetti1983.
type MasettiParams struct {
	MuMin1 float64 // μmin1, cm²/(V·s)
	MuMin2 float64 // μmin2, cm²/(V·s)
	Mu1    float64 // μ1, cm²/(V·s)
	MuMax  float64 // μmax, cm²/(V·s)
	Cr     float64 // Cr, cm^-3
	Cs     float64 // Cs, cm^-3
	Alpha  float64 // α, dimensionless
	Beta   float64 // β, dimensionless
	Pc     float64 // Pc, cm^-3
}

// MasettiPhosphorus returns Masetti's parameters for electrons in phosphorus-doped silicon:
// μmin1 = μmin2 = 68.5, μ1 = 56.1, μmax = 1414 cm²/(V·s), Cr = 9.20e16, Cs = 3.41e20 cm^-3,
// α = 0.711, β = 1.98, Pc = 0. Value from memory, cross-checked: the same μmax, μmin, Cr
// and α are Klaassen's electron parameters (Solid-State Electron. 35, 953 (1992)), and the
// resistivities agree with the conversion standard ASTM F723 for phosphorus to within 4.5 %
// up to 3e17 cm^-3 and 10 % up to 1e19 cm^-3.
func MasettiPhosphorus() MasettiParams {
	return MasettiParams{MuMin1: 68.5, MuMin2: 68.5, Mu1: 56.1, MuMax: 1414,
		Cr: 9.20e16, Cs: 3.41e20, Alpha: 0.711, Beta: 1.98, Pc: 0}
}

// MasettiArsenic returns Masetti's parameters for electrons in arsenic-doped silicon:
// μmin1 = μmin2 = 52.2, μ1 = 43.4, μmax = 1417 cm²/(V·s), Cr = 9.68e16, Cs = 3.43e20 cm^-3,
// α = 0.680, β = 2.00, Pc = 0. Value from memory; no independent check beyond agreement with
// the phosphorus set to 1 % up to 1e16 cm^-3 and a lower mobility at 1e20 cm^-3, as Masetti et
// al. report.
func MasettiArsenic() MasettiParams {
	return MasettiParams{MuMin1: 52.2, MuMin2: 52.2, Mu1: 43.4, MuMax: 1417,
		Cr: 9.68e16, Cs: 3.43e20, Alpha: 0.680, Beta: 2.00, Pc: 0}
}

// MasettiBoron returns Masetti's parameters for holes in boron-doped silicon:
// μmin1 = 44.9, μmin2 = 0, μ1 = 29.0, μmax = 470.5 cm²/(V·s), Cr = 2.23e17, Cs = 6.10e20,
// Pc = 9.23e16 cm^-3, α = 0.719, β = 2.00. Value from memory, cross-checked: the same μmax,
// μmin1, Cr and α are Klaassen's hole parameters, and the resistivities agree with the
// conversion standard ASTM F723 for boron to within 2 % up to 3e16 cm^-3 and 11 % up to
// 1e19 cm^-3 (the largest gap, 10.6 % at 1e18 cm^-3, we could not explain; see the tests).
func MasettiBoron() MasettiParams {
	return MasettiParams{MuMin1: 44.9, MuMin2: 0, Mu1: 29.0, MuMax: 470.5,
		Cr: 2.23e17, Cs: 6.10e20, Alpha: 0.719, Beta: 2.00, Pc: 9.23e16}
}

// NewMasetti1983 returns Masetti1983 with the phosphorus set for electrons and the boron set
// for holes, valid 295–305 K and up to 1e21 cm^-3 (see the type).
func NewMasetti1983() Masetti1983 {
	return Masetti1983{Electron: MasettiPhosphorus(), Hole: MasettiBoron(), TMin: 295, TMax: 305, NMax: 1e21}
}

// NewMasetti1983Arsenic returns Masetti1983 with the arsenic set for electrons and the boron
// set for holes, valid 295–305 K and up to 1e21 cm^-3 (see the type).
func NewMasetti1983Arsenic() Masetti1983 {
	m := NewMasetti1983()
	m.Electron = MasettiArsenic()
	return m
}

// String returns "Masetti1983" for the phosphorus electron set, "Masetti1983(As)" for the
// arsenic set and "Masetti1983(modified)" when either set differs from Masetti's.
func (m Masetti1983) String() string {
	switch {
	case m.Hole != MasettiBoron():
		return "Masetti1983(modified)"
	case m.Electron == MasettiPhosphorus():
		return "Masetti1983"
	case m.Electron == MasettiArsenic():
		return "Masetti1983(As)"
	}
	return "Masetti1983(modified)"
}

// Mobilities returns the electron and hole mobilities in cm²/(V·s) at total ionised dopant
// density pt.Nd + pt.Na (see the type); pt.N and pt.P are validated but ignored. It returns
// an error for an invalid pt, for T or Nd + Na outside the validity range (errors.Is(err,
// pvrec.ErrOutOfRange)), or if edited parameters give a non-finite or non-positive mobility.
func (m Masetti1983) Mobilities(pt Point) (mun, mup float64, err error) {
	name := m.String()
	if err := checkMobilityPoint(name, pt, m.TMin, m.TMax, math.Inf(1)); err != nil {
		return 0, 0, err
	}
	n := pt.Nd + pt.Na
	if !(n <= m.NMax) {
		return 0, 0, check.Range("silicon", name, "total dopant density Nd+Na", "cm^-3", n, 0, m.NMax)
	}
	mun, mup = m.Electron.Mu(n), m.Hole.Mu(n)
	if err := checkMobilityResult(name, pt, mun, mup); err != nil {
		return 0, 0, err
	}
	return mun, mup, nil
}

// Mu returns Masetti's mobility in cm²/(V·s) at total dopant density n in cm^-3 (n >= 0, not
// checked; Masetti1983.Mobilities checks it). At n = 0 it returns the limit μmax − μmin2
// (plus μmin1 if Pc = 0).
func (p MasettiParams) Mu(n float64) float64 {
	if n == 0 {
		if p.Pc == 0 {
			return p.MuMin1 + p.MuMax - p.MuMin2
		}
		return p.MuMax - p.MuMin2
	}
	mu := p.MuMin1
	if p.Pc != 0 {
		mu *= math.Exp(-p.Pc / n)
	}
	return mu + (p.MuMax-p.MuMin2)/(1+math.Pow(n/p.Cr, p.Alpha)) - p.Mu1/(1+math.Pow(p.Cs/n, p.Beta))
}
