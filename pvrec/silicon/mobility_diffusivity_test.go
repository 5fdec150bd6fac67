package silicon

import (
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/fermi"
)

// TestEinsteinNonDegenerate checks D = μ kT/q: kT/q = 25.852 mV at 300 K (CODATA 2018
// exact k and q), so μ = 1414 cm²/(V·s) gives 36.555 cm²/s; tolerance 1e-4 for the five
// digits of kT/q.
func TestEinsteinNonDegenerate(t *testing.T) {
	d, err := Diffusivity(1414, 300)
	if err != nil {
		t.Fatal(err)
	}
	if mobRel(d, 1414*0.025852) > 1e-4 {
		t.Errorf("D = %g cm²/s, want %g", d, 1414*0.025852)
	}
	for _, c := range []struct{ mu, tk float64 }{{math.NaN(), 300}, {-1, 300}, {math.Inf(1), 300}, {100, 0}, {100, math.NaN()}} {
		if _, err := Diffusivity(c.mu, c.tk); err == nil || !strings.HasPrefix(err.Error(), "silicon: ") {
			t.Errorf("Diffusivity(%g, %g): error %v", c.mu, c.tk, err)
		}
	}
}

// TestEinsteinFermiDirac checks the degeneracy factor F_{1/2}/F_{−1/2} of DiffusivityFD
// against two independent closed forms:
//   - for y = n/Nc <= 0.3, the series 1 + Σ k A_k y^k that follows from the expansion
//     η = ln y + Σ A_k y^k of W. B. Joyce and R. W. Dixon, Appl. Phys. Lett. 31, 354 (1977),
//     with A1 = 1/√8 and A2 = 3/16 − √3/9 (both from inverting the series of F_{1/2}) and
//     A3 = 1.48386e-4 (value from memory); the neglected term 4 A4 y⁴ (A4 ≈ −4.4e-6) is below
//     2e-7 at y = 0.3: tolerance 1e-6;
//   - for η = 30, the Sommerfeld expansion (2/3) η (1 + π²/(6η²)), whose next term is of
//     order η^-4 ≈ 1e-6: tolerance 1e-5.
func TestEinsteinFermiDirac(t *testing.T) {
	a1 := 1 / math.Sqrt(8)
	a2 := 3.0/16 - math.Sqrt(3)/9
	a3 := 1.48386e-4
	for _, y := range []float64{1e-14, 1e-6, 1e-3, 0.01, 0.1, 0.3} {
		want := 1 + a1*y + 2*a2*y*y + 3*a3*y*y*y
		got, err := DiffusivityFD(1, 300, y*2.8e19, 2.8e19)
		if err != nil {
			t.Fatal(err)
		}
		got /= 300 * BoltzmannEV
		if mobRel(got, want) > 1e-6 {
			t.Errorf("y = %g: factor %.10g, Joyce–Dixon %.10g", y, got, want)
		}
	}
	eta := 30.0
	y := fermi.Half(eta)
	want := 2.0 / 3 * eta * (1 + math.Pi*math.Pi/(6*eta*eta))
	if got := degeneracyFactor(y); mobRel(got, want) > 1e-5 {
		t.Errorf("η = 30: factor %g, Sommerfeld %g", got, want)
	}
	if f := degeneracyFactor(1); !(f > 1.3 && f < 1.4) {
		t.Errorf("factor at n = Nc is %g, want about 1.34", f)
	}
	for _, c := range [][2]float64{{-1, 2.8e19}, {math.NaN(), 2.8e19}, {1e19, 0}, {1e19, math.Inf(1)}} {
		if _, err := DiffusivityFD(100, 300, c[0], c[1]); err == nil {
			t.Errorf("DiffusivityFD(n = %g, nEff = %g): no error", c[0], c[1])
		}
	}
}

// TestDiffusivities checks the material-based diffusivities: Boltzmann statistics give μ kT/q
// exactly; Fermi–Dirac statistics add the degeneracy factor of the majority carriers of an
// n+ region, and leave the non-degenerate minority carriers at μ kT/q to 1e-9.
func TestDiffusivities(t *testing.T) {
	mob := NewKlaassen1992()
	fd := mustAt(t, DefaultModelSet(), 300)
	msB := DefaultModelSet()
	msB.Statistics = Boltzmann
	bz := mustAt(t, msB, 300)
	n, p, nd := 1e20, 1e3, 1e20
	mun, mup, err := mob.Mobilities(Point{T: 300, Nd: nd, N: n, P: p})
	if err != nil {
		t.Fatal(err)
	}
	dn, dp, err := Diffusivities(bz, mob, n, p, nd, 0)
	if err != nil {
		t.Fatal(err)
	}
	if dn != mun*bz.Vt() || dp != mup*bz.Vt() {
		t.Errorf("Boltzmann: D = %g, %g; want %g, %g", dn, dp, mun*bz.Vt(), mup*bz.Vt())
	}
	dn, dp, err = Diffusivities(fd, mob, n, p, nd, 0)
	if err != nil {
		t.Fatal(err)
	}
	if want := mun * fd.Vt() * degeneracyFactor(n/fd.Nc()); mobRel(dn, want) > 1e-12 || !(dn > 1.5*mun*fd.Vt()) {
		t.Errorf("Fermi–Dirac: Dn = %g, want %g (> 1.5 μn kT/q)", dn, want)
	}
	if mobRel(dp, mup*fd.Vt()) > 1e-9 {
		t.Errorf("Fermi–Dirac minority: Dp = %g, want %g", dp, mup*fd.Vt())
	}
	if _, _, err := Diffusivities(fd, mob, -1, p, nd, 0); err == nil {
		t.Error("negative n: no error")
	}
	if _, _, err := Diffusivities(nil, mob, n, p, nd, 0); err == nil {
		t.Error("nil Material: no error")
	}
}

// TestAmbipolarDiffusivity checks the limits of Da = (n + p)/(n/Dp + p/Dn) (van Roosbroeck
// 1953): the minority diffusivity in low injection, 2 Dn Dp/(Dn + Dp) at n = p.
func TestAmbipolarDiffusivity(t *testing.T) {
	dn, dp := 30.0, 10.0
	for _, c := range []struct{ n, p, want float64 }{
		{1e16, 0, dp},                  // n-type, no holes: Dp
		{0, 1e16, dn},                  // p-type: Dn
		{1e15, 1e15, 2 * dn * dp / 40}, // high injection
		{1e16, 1e6, dp},                // low injection, to 1e-9
	} {
		got, err := AmbipolarDiffusivity(dn, dp, c.n, c.p)
		if err != nil {
			t.Fatal(err)
		}
		if mobRel(got, c.want) > 1e-9 {
			t.Errorf("n = %g, p = %g: Da = %g, want %g", c.n, c.p, got, c.want)
		}
	}
	for _, c := range [][4]float64{{0, 10, 1, 1}, {30, math.NaN(), 1, 1}, {30, 10, -1, 1}, {30, 10, 0, 0}} {
		if _, err := AmbipolarDiffusivity(c[0], c[1], c[2], c[3]); err == nil {
			t.Errorf("AmbipolarDiffusivity%v: no error", c)
		}
	}
}

// TestSumMobilityTable checks the tabulated μn + μp against direct evaluation at points
// between the nodes and midpoints (where the construction checked it) and its range errors.
func TestSumMobilityTable(t *testing.T) {
	for _, c := range []struct {
		mob Mobility
		eq  Point
		tol float64
	}{
		{NewKlaassen1992(), mobMajorityP(1e15), 1e-6},
		{NewKlaassen1992(), mobMajorityN(5e15), 1e-8},
		{NewKlaassen1992(), Point{T: 350, Nd: 1e14, Na: 2e15, N: 1e5, P: 1.9e15}, 1e-6},
		{NewMasetti1983(), mobMajorityP(1e16), 1e-6},
	} {
		tab, err := NewSumMobilityTable(c.mob, c.eq, 1e12, 1e17, c.tol)
		if err != nil {
			t.Fatal(err)
		}
		if tab.RelErr() > c.tol {
			t.Errorf("%s: RelErr %g > %g", tab, tab.RelErr(), c.tol)
		}
		worst := 0.0
		for x := 12.0; x <= 17; x += 0.0137 {
			dn := math.Pow(10, x)
			if dn > 1e17 {
				dn = 1e17
			}
			got, err := tab.At(dn)
			if err != nil {
				t.Fatal(err)
			}
			want, err := SumMobility(c.mob, c.eq, dn)
			if err != nil {
				t.Fatal(err)
			}
			worst = math.Max(worst, mobRel(got, want))
		}
		// Between midpoints a smooth curve's error is of the order of the midpoint error;
		// allow a factor 2.
		if worst > 2*c.tol {
			t.Errorf("%s: worst relative error %g > 2·%g", tab, worst, c.tol)
		}
		lo, hi := tab.Range()
		for _, dn := range []float64{lo, hi} {
			got, _ := tab.At(dn)
			want, _ := SumMobility(c.mob, c.eq, dn)
			if mobRel(got, want) > 1e-12 {
				t.Errorf("%s at node %g: %g, want %g", tab, dn, got, want)
			}
		}
		for _, dn := range []float64{0, 1e11, 2e17, math.NaN()} {
			if _, err := tab.At(dn); err == nil {
				t.Errorf("At(%g): no error", dn)
			}
		}
	}
	for _, c := range [][3]float64{{0, 1e17, 0}, {1e17, 1e12, 0}, {1e12, math.Inf(1), 0}, {1e12, 1e17, 0.5}, {1e12, 1e17, -1}} {
		if _, err := NewSumMobilityTable(NewKlaassen1992(), mobMajorityP(1e15), c[0], c[1], c[2]); err == nil {
			t.Errorf("NewSumMobilityTable%v: no error", c)
		}
	}
	if _, err := NewSumMobilityTable(NewKlaassen1992(), Point{T: 300, Na: -1}, 1e12, 1e17, 0); err == nil {
		t.Error("invalid eq: no error")
	}
}

// TestSumMobilities checks the batch evaluation against single calls and its errors.
func TestSumMobilities(t *testing.T) {
	m := NewKlaassen1992()
	eq := mobMajorityP(1e15)
	dn := []float64{0, 1e13, 1e15, 1e17}
	got, err := SumMobilities(m, eq, dn, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, d := range dn {
		want, _ := SumMobility(m, eq, d)
		if got[i] != want {
			t.Errorf("dn = %g: %g, want %g", d, got[i], want)
		}
	}
	// Masetti ignores the carriers: the sum is constant.
	s0, _ := SumMobility(NewMasetti1983(), eq, 0)
	s1, _ := SumMobility(NewMasetti1983(), eq, 1e17)
	if s0 != s1 {
		t.Errorf("Masetti sum changes with Δn: %g, %g", s0, s1)
	}
	if _, err := SumMobilities(m, eq, []float64{1e15, -1}, nil); err == nil || !strings.Contains(err.Error(), "dn[1]") {
		t.Errorf("negative Δn: error %v", err)
	}
	if _, err := SumMobility(nil, eq, 0); err == nil {
		t.Error("nil Mobility: no error")
	}
}

// TestMaterialSumMobility checks that the Material forms of SumMobility, SumMobilityTable and
// Diffusivities equal the package functions called with the material's mobility model at the
// equilibrium state the caller would otherwise build by hand (consistency, common practice),
// and that μn + μp falls with injection in Klaassen's model, whose electron–hole scattering
// grows with the carrier densities (Klaassen, Solid-State Electron. 35, 953 (1992)).
func TestMaterialSumMobility(t *testing.T) {
	m, err := DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	const na = 1.5e16
	eq, err := m.Equilibrium(0, na)
	if err != nil {
		t.Fatal(err)
	}
	pt := Point{T: 300, Nd: eq.NdIon, Na: eq.NaIon, N: eq.N0, P: eq.P0}
	prev := math.Inf(1)
	for _, dn := range []float64{0, 1e13, 1e15, 1e16, 1e17} {
		got, err := m.SumMobility(0, na, dn)
		if err != nil {
			t.Fatal(err)
		}
		want, err := SumMobility(NewKlaassen1992(), pt, dn)
		if err != nil {
			t.Fatal(err)
		}
		if got != want {
			t.Errorf("Δn = %g: Material.SumMobility = %g, SumMobility = %g", dn, got, want)
		}
		if dn >= 1e15 && !(got < prev) {
			t.Errorf("Δn = %g: μn + μp = %g does not fall below %g", dn, got, prev)
		}
		prev = got
	}
	tab, err := m.SumMobilityTable(0, na, 1e12, 1e17, 1e-6)
	if err != nil {
		t.Fatal(err)
	}
	for _, dn := range []float64{1e12, 3.3e13, 2e16, 1e17} {
		got, err := tab.At(dn)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := m.SumMobility(0, na, dn)
		if mobRel(got, want) > 1e-6 { // the table's tolerance
			t.Errorf("table at Δn = %g: %g, want %g", dn, got, want)
		}
	}
	dn1, dp1, err := m.Diffusivities(1e5, 1e16, 0, 1e16)
	if err != nil {
		t.Fatal(err)
	}
	dn2, dp2, _ := Diffusivities(m, NewKlaassen1992(), 1e5, 1e16, 0, 1e16)
	if dn1 != dn2 || dp1 != dp2 {
		t.Errorf("Material.Diffusivities = %g, %g; Diffusivities = %g, %g", dn1, dp1, dn2, dp2)
	}
	if _, err := m.SumMobility(0, na, -1); err == nil {
		t.Errorf("SumMobility(Δn = -1): no error")
	}
	if _, err := m.SumMobility(math.NaN(), na, 0); err == nil {
		t.Errorf("SumMobility(nd = NaN): no error")
	}
}
