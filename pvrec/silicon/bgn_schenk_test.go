package silicon

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/fermi"
	"gonum.org/v1/gonum/unit/constant"

	"github.com/pvrec/pvrec/pvrec"
)

// TestSchenkParameters pins NewSchenk1998 to the parameter table of A. Schenk, J. Appl. Phys.
// 84, 3684 (1998) (value from memory, cross-checked by the limit tests below), and checks two
// relations among them: α_e + α_h = 1 (α = μ/m), and the static dielectric constant implied by
// the excitonic units, ε = e²/(8π ε0 Ry_ex a_ex) = 11.70, against the handbook 11.7 (common
// value for silicon at 300 K; 1e-3 relative, the precision of 16.55 meV and 3.719 nm).
func TestSchenkParameters(t *testing.T) {
	m := NewSchenk1998()
	want := Schenk1998{
		Rydberg: 16.55e-3, Bohr: 3.719e-7,
		Electron: Schenk1998Carrier{Alpha: 0.5187, B: 8, C: 1.3346, D: 0.893, G: 12, H: 3.91, J: 2.8585, K: 0.012, P: 7.0 / 30, Q: 0.75},
		Hole:     Schenk1998Carrier{Alpha: 0.4813, B: 1, C: 1.2365, D: 1.153, G: 4, H: 4.20, J: 2.9307, K: 0.19, P: 7.0 / 30, Q: 0.25},
	}
	if m != want {
		t.Errorf("NewSchenk1998() = %+v\nwant %+v", m, want)
	}
	if s := m.Electron.Alpha + m.Hole.Alpha; math.Abs(s-1) > 1e-12 {
		t.Errorf("α_e + α_h = %g, want 1", s)
	}
	q, e0 := float64(constant.ElementaryCharge), float64(constant.ElectricConstant)
	eps := q / (8 * math.Pi * e0 * m.Rydberg * m.Bohr * 1e-2) // Ry in eV, a_ex in m
	if math.Abs(eps/11.7-1) > 1e-3 {
		t.Errorf("dielectric constant implied by Ry_ex, a_ex = %.4f, want 11.7", eps)
	}
}

// TestSchenkDebyeHuckelLimit checks the low-density limit of an undoped electron–hole plasma
// against the Debye–Hückel shift (textbook closed form, e.g. any plasma-physics text): each
// carrier's band edge moves by q²κ/(8π ε0 εr), so ΔEg = q κ/(4π ε0 εr) eV with
// κ² = q² (n + p)/(ε0 εr kT), εr = 11.7 (handbook value for silicon). Tolerance 1e-3
// relative: the fit's next-order terms, b_e sqrt(n_Σ)/T ≈ 2e-4 at n = p = 1e10 cm^-3, and the
// 2e-4 difference between 11.7 and the ε implied by Ry_ex and a_ex (raised to the power 3/2).
func TestSchenkDebyeHuckelLimit(t *testing.T) {
	q, e0, kb := float64(constant.ElementaryCharge), float64(constant.ElectricConstant), float64(constant.Boltzmann)
	const epsR = 11.7
	m := NewSchenk1998()
	for _, tc := range []struct{ T, n float64 }{{300, 1e10}, {200, 1e10}, {400, 3e9}} {
		kappa := math.Sqrt(q * q * 2 * tc.n * 1e6 / (e0 * epsR * kb * tc.T)) // 1/m
		want := q * kappa / (4 * math.Pi * e0 * epsR)                        // eV
		got, err := m.DeltaEg(Point{T: tc.T, N: tc.n, P: tc.n})
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got/want-1) > 1e-3 {
			t.Errorf("T = %g K, n = p = %g: ΔEg = %.6g eV, Debye–Hückel %.6g eV", tc.T, tc.n, got, want)
		}
	}
}

// TestSchenkLowDensityScaling checks that in doped silicon the narrowing vanishes like sqrt(N)
// at low doping (the Debye–Hückel limit of both the exchange–correlation and the ionic terms):
// ΔEg(1e8)/ΔEg(1e6) = 10 to 1e-3 (next-order terms ∝ sqrt(N) are below 1e-4 there). The
// points carry majority carriers only (n = Nd or p = Na), so that the intrinsic carriers of
// 300 K do not mask the limit.
func TestSchenkLowDensityScaling(t *testing.T) {
	m := NewSchenk1998()
	for _, pt := range []func(float64) Point{
		func(n float64) Point { return Point{T: 300, Nd: n, N: n} },
		func(n float64) Point { return Point{T: 300, Na: n, P: n} },
	} {
		lo, err1 := m.DeltaEg(pt(1e6))
		hi, err2 := m.DeltaEg(pt(1e8))
		if err1 != nil || err2 != nil {
			t.Fatal(err1, err2)
		}
		if r := hi / lo; math.Abs(r/10-1) > 1e-3 {
			t.Errorf("%+v: ΔEg(1e8)/ΔEg(1e6) = %g, want 10 (sqrt scaling)", pt(1e6), r)
		}
	}
}

// TestSchenkVashishtaKalia checks the zero-temperature limit of an undoped electron–hole
// plasma against the universal exchange–correlation energy of P. Vashishta and R. K. Kalia,
// Phys. Rev. B 25, 6492 (1982),
//
//	E_xc(r_s) = (a + b r_s)/(c + d r_s + r_s²) Ry_ex,  a = −4.8316, b = −5.0879, c = 0.0152, d = 3.0426
//
// (parameters value from memory), with r_s a_ex the radius of the sphere holding one pair. In the
// rigid-shift approximation the gap narrows by −μ_xc = −d(n E_xc)/dn = −(E_xc − (r_s/3) dE_xc/dr_s).
// Schenk's T → 0 form was fitted to RPA-type self-energies, Vashishta and Kalia's to
// ground-state energies of several semiconductors; many-body approximations of this kind differ
// by up to about 10% for r_s up to 4 (value from memory), the tolerance used for
// 1e17–1e20 cm^-3 (r_s = 3.6 to 0.36).
func TestSchenkVashishtaKalia(t *testing.T) {
	const a, b, c, d = -4.8316, -5.0879, 0.0152, 3.0426
	m := NewSchenk1998()
	for _, n := range []float64{1e17, 3e17, 1e18, 1e19, 1e20} {
		rs := math.Cbrt(3 / (4 * math.Pi * n * m.Bohr * m.Bohr * m.Bohr))
		den := c + d*rs + rs*rs
		exc := (a + b*rs) / den
		dexc := (b*den - (a+b*rs)*(d+2*rs)) / (den * den)
		want := -(exc - rs/3*dexc) * m.Rydberg
		got, err := m.DeltaEg(Point{T: 1, N: n, P: n}) // 1 K: kT/Ry_ex = 5e-3, the T → 0 limit
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got/want-1) > 0.10 {
			t.Errorf("n = p = %g (r_s = %.2f): Schenk ΔEg(1 K) = %.2f meV, Vashishta–Kalia %.2f meV", n, rs, 1e3*got, 1e3*want)
		}
	}
}

// TestSchenkInjection checks the sign of the injection dependence: at fixed doping the
// narrowing grows as electron–hole pairs are injected (more carriers, more exchange and
// correlation; A. Schenk, J. Appl. Phys. 84, 3684 (1998), the point of an injection-dependent
// model), in p-type, n-type and undoped silicon, and tends to the equilibrium value as Δn → 0
// (within 0.01 meV at Δn = 1e8 cm^-3: the minority carriers' exchange term of the fit grows
// like their density^{1/3}, a few µeV at 1e8 cm^-3).
func TestSchenkInjection(t *testing.T) {
	m := NewSchenk1998()
	for _, base := range []Point{bgnPType(1e16), bgnNType(1e16), bgnNType(1e19), {T: 300, N: 1e10, P: 1e10}} {
		eq, err := m.DeltaEg(base)
		if err != nil {
			t.Fatal(err)
		}
		prev := eq
		for _, dn := range []float64{1e8, 1e12, 1e14, 1e15, 1e16, 1e17, 1e18} {
			pt := base
			pt.N += dn
			pt.P += dn
			got, err := m.DeltaEg(pt)
			if err != nil {
				t.Fatal(err)
			}
			if dn == 1e8 && math.Abs(got-eq) > 1e-5 {
				t.Errorf("%+v: ΔEg at Δn = 1e8 is %g, not the equilibrium %g", base, got, eq)
			}
			if !(got > prev) {
				t.Errorf("%+v: ΔEg at Δn = %g is %.6g eV, not above %.6g eV at the smaller Δn", base, dn, got, prev)
			}
			prev = got
		}
	}
}

// TestSchenkBandEdgeShifts checks that the two band-edge shifts are non-negative and sum to
// DeltaEg over n- and p-type doping.
func TestSchenkBandEdgeShifts(t *testing.T) {
	m := NewSchenk1998()
	for _, n := range bgnDopingGrid() {
		for _, pt := range []Point{bgnNType(n), bgnPType(n)} {
			dEc, dEv, err := m.BandEdgeShifts(pt)
			d, err2 := m.DeltaEg(pt)
			if err != nil || err2 != nil {
				t.Fatal(err, err2)
			}
			if dEc < 0 || dEv < 0 || dEc+dEv != d {
				t.Errorf("%+v: dEc = %g, dEv = %g, DeltaEg = %g", pt, dEc, dEv, d)
			}
		}
	}
}

// TestSchenkDomain checks the points the model refuses (see Schenk1998) and accepts.
func TestSchenkDomain(t *testing.T) {
	m := NewSchenk1998()
	refused := []struct {
		pt   Point
		name string // argument named in the error
	}{
		{Point{T: 300, Nd: 1e19}, "N + P"},                             // carriers not supplied
		{Point{T: 300, Nd: 1e16, N: 1e10, P: 1e10}, "N + P"},           // depletion region
		{Point{T: 300, Nd: 1e19, N: 1e17, P: 0}, "N + P"},              // edge of an emitter's space-charge region
		{Point{T: 300, Nd: 1e16, Na: 1e16, N: 1e10, P: 1e10}, "N + P"}, // fully compensated, no screening
		{Point{T: 300, Nd: 1.01e16, Na: 1e16, N: 1e14}, "N + P"},       // quasi-neutral, but compensation ratio 201
		{Point{T: 2000, Nd: 1e16, N: 1e16}, "temperature T"},           // liquid silicon
		{Point{T: 300, N: 1e23, P: 1e23}, "N"},                         // above the atom density
	}
	for _, tc := range refused {
		d, err := m.DeltaEg(tc.pt)
		if !errors.Is(err, pvrec.ErrOutOfRange) || !strings.HasPrefix(err.Error(), "silicon:") || !strings.Contains(err.Error(), tc.name) {
			t.Errorf("DeltaEg(%+v) = %g, %v; want pvrec.ErrOutOfRange naming %q", tc.pt, d, err, tc.name)
		}
	}
	accepted := []Point{
		{T: 300},                                // nothing at all: 0
		{T: 300, N: 1e15, P: 1e15},              // undoped, injected
		{T: 300, Nd: 2e16, Na: 1e16, N: 1e16},   // compensated n-type, ratio 3
		{T: 300, Nd: 1e19, N: 0.6e19, P: 0},     // solver iterate near neutrality
		{T: 1e-3, Nd: 1e19, N: 1e19},            // T → 0 limit
		{T: 1600, Nd: 1e16, N: 1e17, P: 0.9e17}, // near the melting point, intrinsic-like
		{T: 300, Nd: 4e22, N: 4e22, P: 0},       // extreme but below the atom density
		{T: 300, Na: 1e16, N: 1e-30, P: 1e16},   // vanishing minority carriers
	}
	for _, pt := range accepted {
		d, err := m.DeltaEg(pt)
		if err != nil || math.IsNaN(d) || d < 0 {
			t.Errorf("DeltaEg(%+v) = %g, %v; want a finite value >= 0", pt, d, err)
		}
	}
}

// TestSchenkApparentVsKlaassen compares the physical Schenk BGN, turned into the apparent BGN
// that Boltzmann analyses of ni,eff see, with the unified apparent BGN of Klaassen, Slotboom and
// de Graaff, Solid-State Electron. 35, 125 (1992). For Fermi–Dirac majority carriers in a
// parabolic band, n0 p0 = ni² exp(ΔEg/kT) γ with γ = F_{1/2}(η)/e^η, so
// ΔEg,app = ΔEg + kT ln γ (textbook; minority carriers are non-degenerate, γ = 1). Nc = 2.86e19
// and Nv = 3.10e19 cm^-3 at 300 K (M. A. Green, J. Appl. Phys. 67, 2944 (1990); value from
// memory). The spread allowed, 20 meV, is that of the apparent-BGN data (see
// TestBGNApparentSpread). Up to 1e19 cm^-3 the Fermi–Dirac correction is at most 3 meV and the
// comparison is robust. At 1e20 cm^-3 it is about −30 meV and depends on the band structure
// near the Fermi level (non-parabolicity, band tails) and on the ni behind the apparent data;
// there this conversion puts Schenk about 42 meV (n-type) and 26 meV (p-type) below Klaassen's
// apparent BGN, so 1e20 cm^-3 is not asserted (reported, not hidden).
func TestSchenkApparentVsKlaassen(t *testing.T) {
	const nc, nv, T = 2.86e19, 3.10e19, 300.0
	kT := BoltzmannEV * T
	lnGamma := func(y float64) float64 {
		eta, err := fermi.InvHalf(y)
		if err != nil {
			t.Fatal(err)
		}
		return math.Log(y) - eta
	}
	s, k := NewSchenk1998(), NewKlaassenSlotboomDeGraaff1992()
	for _, n := range []float64{1e18, 3e18, 1e19} {
		for _, tc := range []struct {
			pt   Point
			maj  float64 // majority reduced density
			kind string
		}{{bgnNType(n), n / nc, "n-type"}, {bgnPType(n), n / nv, "p-type"}} {
			phys, err1 := s.DeltaEg(tc.pt)
			app, err2 := k.DeltaEg(tc.pt)
			if err1 != nil || err2 != nil {
				t.Fatal(err1, err2)
			}
			schenkApp := phys + kT*lnGamma(tc.maj)
			if math.Abs(schenkApp-app) > 20e-3 {
				t.Errorf("%s %g: Schenk apparent %.1f meV (physical %.1f), Klaassen1992 %.1f meV: differ by more than 20 meV",
					tc.kind, n, 1e3*schenkApp, 1e3*phys, 1e3*app)
			}
		}
	}
}

func BenchmarkSchenk1998DeltaEg(b *testing.B) {
	bgnBench(b, NewSchenk1998(), Point{T: 300, Nd: 1e19, N: 1.001e19, P: 1e16})
}

func BenchmarkSchenk1998DeltaEgUndoped(b *testing.B) {
	bgnBench(b, NewSchenk1998(), Point{T: 300, N: 1e16, P: 1e16})
}
