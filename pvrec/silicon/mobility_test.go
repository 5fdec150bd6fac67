package silicon

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
)

// mobRel returns |got − want|/|want|.
func mobRel(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

// mobMajorityN and mobMajorityP are points of n- and p-type silicon in equilibrium at 300 K
// with minority densities low enough not to matter.
func mobMajorityN(nd float64) Point { return Point{T: 300, Nd: nd, N: nd, P: 1e20 / nd} }
func mobMajorityP(na float64) Point { return Point{T: 300, Na: na, P: na, N: 1e20 / na} }

// allMobilities returns the package's mobility models with their default parameters.
func allMobilities() []Mobility {
	return []Mobility{NewKlaassen1992(), NewMasetti1983(), NewMasetti1983Arsenic(), NewConstantMobility()}
}

func TestMobilityString(t *testing.T) {
	for _, c := range []struct {
		m    Mobility
		want string
	}{
		{NewKlaassen1992(), "Klaassen1992"},
		{NewMasetti1983(), "Masetti1983"},
		{NewMasetti1983Arsenic(), "Masetti1983(As)"},
		{Masetti1983{Electron: MasettiPhosphorus(), Hole: MasettiPhosphorus()}, "Masetti1983(modified)"},
		{NewConstantMobility(), "ConstantMobility(1414, 470.5 cm²/Vs)"},
	} {
		if got := modelName(c.m); got != c.want {
			t.Errorf("String() = %q, want %q", got, c.want)
		}
	}
}

// TestKlaassenLattice checks the lattice-limited mobilities, μmax (300/T)^θ, against the
// parameters tabulated by D. B. M. Klaassen, Solid-State Electron. 35, 953 (1992), Table 1
// (value from memory): 1414 and 470.5 cm²/(V·s) at 300 K, θ = 2.285 and 2.247. At 1e6 cm^-3
// of dopants impurity scattering changes the mobility by less than 1e-7 relative (it scales as
// N^α, α ≈ 0.7), hence the tolerance 1e-6.
func TestKlaassenLattice(t *testing.T) {
	m := NewKlaassen1992()
	for _, c := range []struct {
		tk, mun, mup float64
	}{
		{300, 1414, 470.5}, // Klaassen 1992, Table 1
		{400, 1414 * math.Pow(0.75, 2.285), 470.5 * math.Pow(0.75, 2.247)}, // μmax (300/T)^θ with Table 1's θ
		{200, 1414 * math.Pow(1.5, 2.285), 470.5 * math.Pow(1.5, 2.247)},   // likewise
	} {
		mun, mup, err := m.Mobilities(Point{T: c.tk, Nd: 1e6, N: 1e6, P: 1})
		if err != nil {
			t.Fatal(err)
		}
		if mobRel(mun, c.mun) > 1e-6 || mobRel(mup, c.mup) > 1e-6 {
			t.Errorf("T = %g K: lattice mobilities %g, %g, want %g, %g cm²/Vs", c.tk, mun, mup, c.mun, c.mup)
		}
	}
	// No dopants and no carriers at all: exactly the lattice mobility.
	mun, mup, err := m.Mobilities(Point{T: 300})
	if err != nil || mun != 1414 || mup != 470.5 {
		t.Errorf("empty point: %g, %g, %v; want 1414, 470.5", mun, mup, err)
	}
	if mun, mup, _ := NewConstantMobility().Mobilities(Point{T: 250, Nd: 1e19}); mun != 1414 || mup != 470.5 {
		t.Errorf("ConstantMobility = %g, %g; want 1414, 470.5", mun, mup)
	}
}

// TestKlaassenMasettiMajority checks that the majority-carrier mobilities of the two models
// agree at 300 K and low doping. Klaassen (Solid-State Electron. 35, 953 (1992)) took μmax,
// μmin, Nref and α from Masetti et al. (IEEE Trans. Electron Devices 30, 764 (1983)), and his
// majority-carrier limit reduces algebraically to μmin + (μmax − μmin)/(1 + (N/Nref)^α), which
// is Masetti's phosphorus formula without its high-density term (below 1e-5 relative up to
// 1e18 cm^-3, as is Klaassen's clustering there): tolerance 1e-4 for electrons. Masetti's boron
// formula has in addition the factor exp(−Pc/N) on μmin1 and μmin2 = 0, so that the hole
// mobilities differ by up to 1.71 % below 1e17 cm^-3 (at 2.8e16; from the two closed forms,
// by a dense scan): tolerance 1.8 % for holes.
func TestKlaassenMasettiMajority(t *testing.T) {
	k, ms := NewKlaassen1992(), NewMasetti1983()
	for _, n := range []float64{1e12, 1e13, 1e14, 1e15, 1e16, 3e16, 1e17, 3e17, 1e18} {
		kn, _, err := k.Mobilities(mobMajorityN(n))
		if err != nil {
			t.Fatal(err)
		}
		mn, _, err := ms.Mobilities(mobMajorityN(n))
		if err != nil {
			t.Fatal(err)
		}
		if d := mobRel(kn, mn); d > 1e-4 {
			t.Errorf("Nd = %g: Klaassen μn %g, Masetti %g (rel. diff. %.2g > 1e-4)", n, kn, mn, d)
		}
		if n > 1e17 {
			continue
		}
		_, kp, err := k.Mobilities(mobMajorityP(n))
		if err != nil {
			t.Fatal(err)
		}
		_, mp, err := ms.Mobilities(mobMajorityP(n))
		if err != nil {
			t.Fatal(err)
		}
		if d := mobRel(kp, mp); d > 0.018 {
			t.Errorf("Na = %g: Klaassen μp %g, Masetti %g (rel. diff. %.3g > 1.8 %%)", n, kp, mp, d)
		}
	}
}

// TestKlaassenFallsWithTemperature checks that lattice scattering dominates at low doping:
// the majority mobilities fall as T rises from 200 to 500 K (Klaassen, Solid-State Electron.
// 35, 961 (1992); common knowledge).
func TestKlaassenFallsWithTemperature(t *testing.T) {
	m := NewKlaassen1992()
	for _, n := range []float64{1e13, 1e14, 1e15, 1e16} {
		prevN, prevP := math.Inf(1), math.Inf(1)
		for tk := 200.0; tk <= 500; tk += 25 {
			mun, _, err := m.Mobilities(Point{T: tk, Nd: n, N: n})
			if err != nil {
				t.Fatal(err)
			}
			_, mup, err := m.Mobilities(Point{T: tk, Na: n, P: n})
			if err != nil {
				t.Fatal(err)
			}
			if !(mun < prevN && mup < prevP) {
				t.Errorf("N = %g, T = %g K: μn %g, μp %g not below %g, %g at T − 25 K", n, tk, mun, mup, prevN, prevP)
			}
			prevN, prevP = mun, mup
		}
	}
}

// TestKlaassenMinorityExceedsMajority checks the central result of Klaassen's model
// (Solid-State Electron. 35, 953 (1992)): at high doping the minority-carrier mobility exceeds
// the majority-carrier mobility at the same dopant density, because repulsive ions scatter
// less than attractive ones; at low doping the two are close (within 10 %, the electron–hole
// scattering by the majority carriers).
func TestKlaassenMinorityExceedsMajority(t *testing.T) {
	m := NewKlaassen1992()
	for _, n := range []float64{1e18, 1e19, 1e20} {
		majN, _, _ := m.Mobilities(mobMajorityN(n))
		minN, _, _ := m.Mobilities(mobMajorityP(n))
		_, majP, _ := m.Mobilities(mobMajorityP(n))
		_, minP, _ := m.Mobilities(mobMajorityN(n))
		if !(minN > majN && minP > majP) {
			t.Errorf("N = %g: minority μn %g (majority %g), minority μp %g (majority %g)", n, minN, majN, minP, majP)
		}
	}
	for _, n := range []float64{1e14, 1e15, 1e16} {
		majN, _, _ := m.Mobilities(mobMajorityN(n))
		minN, _, _ := m.Mobilities(mobMajorityP(n))
		if d := mobRel(minN, majN); d > 0.1 {
			t.Errorf("N = %g: minority μn %g differs from majority %g by %.2g", n, minN, majN, d)
		}
	}
}

// TestKlaassenElectronHoleScattering checks that injected carriers lower the mobilities of
// lightly doped silicon (electron–hole scattering, Klaassen 1992), monotonically, and that
// they change little while Δn << doping.
func TestKlaassenElectronHoleScattering(t *testing.T) {
	m := NewKlaassen1992()
	eq := mobMajorityP(1e15)
	prev := math.Inf(1)
	for _, dn := range []float64{0, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17} {
		s, err := SumMobility(m, eq, dn)
		if err != nil {
			t.Fatal(err)
		}
		if !(s < prev) {
			t.Errorf("Δn = %g: μn+μp = %g not below %g", dn, s, prev)
		}
		prev = s
	}
	s0, _ := SumMobility(m, eq, 0)
	s12, _ := SumMobility(m, eq, 1e12)
	if d := mobRel(s12, s0); d > 1e-3 {
		t.Errorf("Δn = 1e12 in 1e15 p-type changes μn+μp by %.2g", d)
	}
}

// TestKlaassenClampG checks that the G clamp changes nothing below 5e19 cm^-3 and keeps the
// minority mobility falling with doping above.
func TestKlaassenClampG(t *testing.T) {
	on, off := NewKlaassen1992(), NewKlaassen1992()
	off.ClampG = false
	prev := math.Inf(1)
	for _, n := range []float64{1e15, 1e17, 1e19, 5e19, 1e20, 3e20, 1e21} {
		a, _, err := on.Mobilities(mobMajorityP(n))
		if err != nil {
			t.Fatal(err)
		}
		b, _, err := off.Mobilities(mobMajorityP(n))
		if err != nil {
			t.Fatal(err)
		}
		if n <= 5e19 && a != b {
			t.Errorf("Na = %g: clamp changes minority μn from %g to %g", n, b, a)
		}
		if !(a < prev) {
			t.Errorf("Na = %g: clamped minority μn %g not below %g", n, a, prev)
		}
		prev = a
	}
}

// TestKlaassenGMin checks the Newton solution for the minimum of G against a dense scan.
func TestKlaassenGMin(t *testing.T) {
	m := NewKlaassen1992()
	for _, tk := range []float64{200, 300, 500} {
		for _, mass := range []float64{m.Electron.Mass, m.Hole.Mass} {
			lt, lnMass := math.Log(tk/300), math.Log(mass)
			a := math.Exp(m.S[3] * (lt - lnMass))
			lnB := m.S[6] * (lnMass - lt)
			pm := m.gMin(a, lnB)
			gOf := func(p float64) float64 {
				mm := m
				mm.ClampG = false
				return mm.g(p, math.Log(p), lnMass, lt)
			}
			best, bestG := 0.0, math.Inf(1)
			for p := 0.05; p < 2; p *= 1.0001 {
				if g := gOf(p); g < bestG {
					best, bestG = p, g
				}
			}
			if mobRel(pm, best) > 2e-3 || pm >= gClampBelow {
				t.Errorf("T = %g, m = %g: gMin = %g, scan %g", tk, mass, pm, best)
			}
		}
	}
}

// TestMasettiArsenic checks Masetti et al.'s finding (IEEE Trans. Electron Devices 30, 764
// (1983)) that arsenic- and phosphorus-doped silicon differ only at high doping: within 1 %
// up to 1e16 cm^-3, arsenic lower at 1e20 cm^-3.
func TestMasettiArsenic(t *testing.T) {
	p, as := NewMasetti1983(), NewMasetti1983Arsenic()
	for _, n := range []float64{0, 1e13, 1e15, 1e16} {
		a, _, _ := p.Mobilities(mobMajorityN(math.Max(n, 1)))
		b, _, _ := as.Mobilities(mobMajorityN(math.Max(n, 1)))
		if d := mobRel(b, a); d > 0.01 {
			t.Errorf("Nd = %g: As %g, P %g", n, b, a)
		}
	}
	a, _, _ := p.Mobilities(mobMajorityN(1e20))
	b, _, _ := as.Mobilities(mobMajorityN(1e20))
	if !(b < a) {
		t.Errorf("Nd = 1e20: As %g not below P %g", b, a)
	}
	// The limit at N = 0 is μmax (closed form).
	if got := MasettiBoron().Mu(0); got != 470.5 {
		t.Errorf("boron μ(0) = %g, want 470.5", got)
	}
	if got := MasettiPhosphorus().Mu(0); got != 1414 {
		t.Errorf("phosphorus μ(0) = %g, want 1414", got)
	}
}

// TestMobilityBadInput checks that every model rejects invalid points with an error naming
// the argument, and out-of-range points with pvrec.ErrOutOfRange.
func TestMobilityBadInput(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	for _, c := range []struct {
		pt       Point
		word     string // expected in the message
		outRange bool   // errors.Is(err, pvrec.ErrOutOfRange) expected (Klaassen and Masetti only)
	}{
		{Point{T: nan, Nd: 1e15, N: 1e15}, "temperature", false},
		{Point{T: 0, Nd: 1e15, N: 1e15}, "temperature", false},
		{Point{T: -300, Nd: 1e15, N: 1e15}, "temperature", false},
		{Point{T: inf, Nd: 1e15, N: 1e15}, "temperature", false},
		{Point{T: 300, Nd: -1, N: 1e15}, "Nd", false},
		{Point{T: 300, Na: nan}, "Na", false},
		{Point{T: 300, N: inf}, "N", false},
		{Point{T: 300, P: -1e10}, "P", false},
		{Point{T: 600, Nd: 1e15, N: 1e15}, "temperature", true},
		{Point{T: 100, Nd: 1e15, N: 1e15}, "temperature", true},
		{Point{T: 300, Nd: 2e21, N: 2e21}, "density", true},
	} {
		for _, m := range allMobilities() {
			_, isConst := m.(ConstantMobility)
			_, isMasetti := m.(Masetti1983)
			if isConst && c.outRange {
				continue // the constant has no validity range
			}
			if isMasetti && c.pt.T == 100 {
				continue // also out of range, checked through 600 K
			}
			mun, mup, err := m.Mobilities(c.pt)
			if err == nil {
				t.Errorf("%s at %+v: no error (got %g, %g)", modelName(m), c.pt, mun, mup)
				continue
			}
			if !strings.HasPrefix(err.Error(), "silicon: ") || !strings.Contains(err.Error(), c.word) {
				t.Errorf("%s at %+v: error %q lacks prefix or %q", modelName(m), c.pt, err, c.word)
			}
			if c.outRange != errors.Is(err, pvrec.ErrOutOfRange) {
				t.Errorf("%s at %+v: errors.Is(pvrec.ErrOutOfRange) = %v, want %v", modelName(m), c.pt, !c.outRange, c.outRange)
			}
		}
	}
	// Masetti is a 300 K model.
	if _, _, err := NewMasetti1983().Mobilities(Point{T: 350, Nd: 1e15, N: 1e15}); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Masetti at 350 K: %v, want pvrec.ErrOutOfRange", err)
	}
	// Parameters edited into nonsense give an error, not NaN.
	bad := NewKlaassen1992()
	bad.Electron.MuMax = math.NaN()
	if _, _, err := bad.Mobilities(mobMajorityN(1e16)); err == nil {
		t.Error("Klaassen with NaN μmax: no error")
	}
	if _, _, err := (ConstantMobility{Electron: 0, Hole: 1}).Mobilities(Point{T: 300}); err == nil {
		t.Error("ConstantMobility with 0: no error")
	}
}

// TestMobilityFiniteEverywhere scans the validity ranges for errors and for non-finite or
// non-positive mobilities.
func TestMobilityFiniteEverywhere(t *testing.T) {
	for _, m := range []Mobility{NewKlaassen1992(), NewMasetti1983(), NewMasetti1983Arsenic()} {
		temps := []float64{200, 250, 300, 400, 500}
		if _, ok := m.(Masetti1983); ok {
			temps = []float64{295, 300, 305}
		}
		for _, tk := range temps {
			for nd := 0.0; nd <= 1e21; nd = math.Max(10*nd, 1e10) {
				for na := 0.0; na <= 1e21-nd; na = math.Max(10*na, 1e10) {
					for _, inj := range []float64{0, 1e10, 1e15, 1e18} {
						pt := Point{T: tk, Nd: nd, Na: na, N: math.Max(nd-na, 0) + inj, P: math.Max(na-nd, 0) + inj}
						if pt.N > 1e21 || pt.P > 1e21 {
							continue
						}
						mun, mup, err := m.Mobilities(pt)
						if err != nil || !(mun > 0 && mup > 0) || math.IsInf(mun+mup, 0) {
							t.Errorf("%s at %+v: %g, %g, %v", modelName(m), pt, mun, mup, err)
						}
					}
				}
			}
		}
	}
}
