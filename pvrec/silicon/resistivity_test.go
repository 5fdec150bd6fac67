package silicon

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// TestResistivityASTMOracleConsistency checks the test oracle itself (resistivity_astm_test.go):
// ASTM F723 gives separately fitted formulas for each direction, so composing them measures
// how well the coefficients were remembered. Boron: within 2.6 % over 1e12–3e20 cm^-3
// (tolerance 3 %); phosphorus: within 3.4 % over 1e13–3e17 and 6.3 % at 1e18–1e20 cm^-3
// (tolerances 3.5 % and 7 %). A wrong digit in a coefficient would show as a larger,
// systematic mismatch.
func TestResistivityASTMOracleConsistency(t *testing.T) {
	for _, n := range []float64{1e12, 1e13, 1e14, 1e15, 1e16, 3e16, 1e17, 3e17, 1e18, 3e18, 1e19, 3e19, 1e20, 3e20} {
		if d := mobRel(astmBoronDensity(astmBoronResistivity(n)), n); d > 0.03 {
			t.Errorf("boron N = %g: round trip off by %.3g", n, d)
		}
		if n < 1e13 || n > 1e20 {
			continue
		}
		tol := 0.035
		if n >= 1e18 {
			tol = 0.07
		}
		if d := mobRel(astmPhosphorusDensity(astmPhosphorusResistivity(n)), n); d > tol {
			t.Errorf("phosphorus N = %g: round trip off by %.3g > %g", n, d, tol)
		}
	}
	// Commonly quoted pairs (value from memory): 1 Ω·cm p-type ≈ 1.5e16 cm^-3 boron,
	// 1 Ω·cm n-type ≈ 4.9e15 cm^-3 phosphorus, 10 Ω·cm ≈ 1.3e15 and 4.4e14 cm^-3 (to 5 %).
	for _, c := range []struct{ got, want float64 }{
		{astmBoronDensity(1), 1.5e16}, {astmPhosphorusDensity(1), 4.9e15},
		{astmBoronDensity(10), 1.3e15}, {astmPhosphorusDensity(10), 4.4e14},
	} {
		if mobRel(c.got, c.want) > 0.05 {
			t.Errorf("ASTM oracle %g, commonly quoted %g", c.got, c.want)
		}
	}
}

// TestResistivityVsASTM compares ResistivityFromDoping at 300 K (default model set) with the
// conversion of ASTM F723 for boron- and phosphorus-doped silicon, based on W. R. Thurber,
// R. L. Mattis, Y. M. Liu and J. J. Filliben, J. Electrochem. Soc. 127, 1807 and 2291 (1980)
// (see resistivity_astm_test.go; coefficients are values from memory). Tolerances:
//   - boron up to 3e16 cm^-3: 3 %, the precision of the oracle;
//   - boron 1e17–1e19 cm^-3: 7 % for Klaassen1992 and 11 % for Masetti1983. In this range the
//     mobility data fitted by Masetti et al. (and adopted by Klaassen) give hole mobilities up
//     to 6 % (Klaassen) and 10 % (Masetti, with its Pc term) above Thurber's (our comparison;
//     the largest gap is at 1e18 cm^-3);
//   - phosphorus 1e13–3e17 cm^-3: 4.5 %: the oracle's electron mobility at low doping,
//     1/(q N ρ) ≈ 1460 cm²/(V·s), lies 3.3 % above Masetti's and Klaassen's μmax = 1414, plus
//     about 1 % oracle precision;
//   - phosphorus 1e18–1e19 cm^-3: 10 %: the oracle's two fits differ by up to 6.3 % here and
//     Masetti's fit lies up to 9 % below (our comparison, largest at 3e18 cm^-3).
func TestResistivityVsASTM(t *testing.T) {
	mat := mustAt(t, DefaultModelSet(), 300)
	type row struct {
		dop        Dopant
		n          float64 // dopant density, cm^-3
		tolK, tolM float64 // tolerance for Klaassen1992 and Masetti1983
	}
	var rows []row
	for _, n := range []float64{1e13, 1e14, 1e15, 1e16, 3e16} {
		rows = append(rows, row{Acceptor, n, 0.03, 0.03}) // ASTM F723 boron; oracle precision
	}
	for _, n := range []float64{1e17, 3e17, 1e18, 3e18, 1e19} {
		rows = append(rows, row{Acceptor, n, 0.07, 0.11}) // ASTM F723 boron; data sets differ
	}
	for _, n := range []float64{1e13, 1e14, 1e15, 1e16, 3e16, 1e17, 3e17} {
		rows = append(rows, row{Donor, n, 0.045, 0.045}) // ASTM F723 phosphorus; μmax 1414 vs ≈1460
	}
	for _, n := range []float64{1e18, 3e18, 1e19} {
		rows = append(rows, row{Donor, n, 0.10, 0.10}) // ASTM F723 phosphorus; oracle 6.3 %, data sets differ
	}
	for _, r := range rows {
		nd, na, want := r.n, 0.0, astmPhosphorusResistivity(r.n)
		if r.dop == Acceptor {
			nd, na, want = 0, r.n, astmBoronResistivity(r.n)
		}
		for _, c := range []struct {
			mob Mobility
			tol float64
		}{{NewKlaassen1992(), r.tolK}, {NewMasetti1983(), r.tolM}} {
			got, err := ResistivityFromDoping(mat, c.mob, nd, na)
			if err != nil {
				t.Fatal(err)
			}
			if d := mobRel(got, want); d > c.tol {
				t.Errorf("%s, %s %g cm^-3: ρ = %.4g Ω·cm, ASTM F723 %.4g (off by %.3g > %g)",
					modelName(c.mob), r.dop, r.n, got, want, d, c.tol)
			}
		}
	}
}

// TestResistivityClosedForm checks Resistivity against 1/(q (n μn + p μp)) with the constant
// mobility (textbook definition).
func TestResistivityClosedForm(t *testing.T) {
	m := NewConstantMobility()
	pt := Point{T: 300, Nd: 1e16, Na: 1e15, N: 9e15, P: 2e4}
	got, err := Resistivity(m, pt)
	if err != nil {
		t.Fatal(err)
	}
	want := 1 / (1.602176634e-19 * (9e15*1414 + 2e4*470.5))
	if mobRel(got, want) > 1e-12 {
		t.Errorf("ρ = %g, want %g", got, want)
	}
	if _, err := Resistivity(m, Point{T: 300}); err == nil {
		t.Error("no carriers: no error")
	}
	if _, err := Conductivity(nil, pt); err == nil {
		t.Error("nil Mobility: no error")
	}
	if _, err := ResistivityFromDoping(nil, m, 1e15, 0); err == nil {
		t.Error("nil Material: no error")
	}
	if _, err := ResistivityFromDoping(mustAt(t, DefaultModelSet(), 300), m, -1e15, 0); err == nil {
		t.Error("negative nd: no error")
	}
}

// TestResistivityRoundTrip checks DopingFromResistivity ∘ ResistivityFromDoping = identity to
// 1e-9 relative (the inversion's tolerance is 1e-12 in ln of the net doping), for both dopant
// types, with and without compensation, over 1e11–5e20 cm^-3 and at 300 and 400 K.
func TestResistivityRoundTrip(t *testing.T) {
	for _, tk := range []float64{300, 400} {
		mat := mustAt(t, DefaultModelSet(), tk)
		for _, mob := range []Mobility{NewKlaassen1992(), NewMasetti1983()} {
			if _, ok := mob.(Masetti1983); ok && tk != 300 {
				continue
			}
			for _, dop := range []Dopant{Donor, Acceptor} {
				for _, n := range []float64{1e11, 1e13, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 5e20} {
					for _, compRel := range []float64{0, 0.1, 0.9} {
						comp := compRel * n
						nd, na := n, comp
						if dop == Acceptor {
							nd, na = comp, n
						}
						rho, err := ResistivityFromDoping(mat, mob, nd, na)
						if err != nil {
							t.Fatal(err)
						}
						got, err := DopingFromResistivity(mat, mob, rho, dop, comp)
						if err != nil {
							t.Errorf("%s %g K %s N = %g comp = %g: %v", modelName(mob), tk, dop, n, comp, err)
							continue
						}
						if d := mobRel(got, n); d > 1e-9 {
							// Allowed only for p-type silicon with net doping below the
							// maximum of ρ (about 1.15 ni), where ρ is reached twice: then
							// the higher-doping root, with the same ρ.
							back, err := ResistivityFromDoping(mat, mob, comp, got)
							if dop != Acceptor || n-comp > 1.2*mat.Ni() || !(got > n) || err != nil || mobRel(back, rho) > 1e-9 {
								t.Errorf("%s %g K %s N = %g comp = %g: got %g (rel. %.2g), ρ %g vs %g",
									modelName(mob), tk, dop, n, comp, got, d, back, rho)
							}
						}
					}
				}
			}
		}
	}
}

// TestResistivityInverseVsASTM compares DopingFromResistivity (Klaassen1992, 300 K) with the
// resistivity-to-density formulas of ASTM F723 (value from memory, see
// resistivity_astm_test.go) at resistivities common for wafers. The density error is about
// twice the resistivity error (μ falls with N), so the tolerances are twice those of
// TestResistivityVsASTM's low-doping rows: 6 % for boron, 9 % for phosphorus (where the
// oracle's electron mobility is 3.3 % above 1414 at low doping).
func TestResistivityInverseVsASTM(t *testing.T) {
	mat := mustAt(t, DefaultModelSet(), 300)
	mob := NewKlaassen1992()
	for _, c := range []struct {
		dop  Dopant
		rho  float64 // Ω·cm
		want float64 // cm^-3
		tol  float64
	}{
		{Acceptor, 1000, astmBoronDensity(1000), 0.06}, // ASTM F723 boron
		{Acceptor, 10, astmBoronDensity(10), 0.06},     // ASTM F723 boron
		{Acceptor, 1, astmBoronDensity(1), 0.06},       // ASTM F723 boron
		{Donor, 100, astmPhosphorusDensity(100), 0.09}, // ASTM F723 phosphorus
		{Donor, 10, astmPhosphorusDensity(10), 0.09},   // ASTM F723 phosphorus
		{Donor, 1, astmPhosphorusDensity(1), 0.09},     // ASTM F723 phosphorus
		{Donor, 0.1, astmPhosphorusDensity(0.1), 0.09}, // ASTM F723 phosphorus
	} {
		got, err := DopingFromResistivity(mat, mob, c.rho, c.dop, 0)
		if err != nil {
			t.Fatal(err)
		}
		if d := mobRel(got, c.want); d > c.tol {
			t.Errorf("%s ρ = %g Ω·cm: N = %.4g, ASTM F723 %.4g (off by %.3g > %g)", c.dop, c.rho, got, c.want, d, c.tol)
		}
	}
}

// TestResistivityNearIntrinsic checks the two-root region of p-type silicon: resistivities
// between the intrinsic value and about 1.15 times it are reached twice; the higher-doping
// root is returned, and resistivities above the maximum give ErrNoDoping. n-type silicon never
// exceeds the intrinsic resistivity.
func TestResistivityNearIntrinsic(t *testing.T) {
	mat := mustAt(t, DefaultModelSet(), 300)
	mob := NewKlaassen1992()
	rhoI, err := ResistivityFromDoping(mat, mob, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	mun, mup, _ := mob.Mobilities(Point{T: 300})
	ratio := (mun + mup) / (2 * math.Sqrt(mun*mup)) // maximum of ρ/ρi for p-type (closed form)
	target := rhoI * (1 + 0.5*(ratio-1))
	na, err := DopingFromResistivity(mat, mob, target, Acceptor, 0)
	if err != nil {
		t.Fatal(err)
	}
	// The maximum lies at p0 = ni √(μn/μp), net doping ni (√(μn/μp) − √(μp/μn)) ≈ 1.15 ni.
	naMax := mat.Ni() * (math.Sqrt(mun/mup) - math.Sqrt(mup/mun))
	if !(na > naMax) {
		t.Errorf("p-type root %g not on the high-doping side of the maximum at %g", na, naMax)
	}
	if rho, _ := ResistivityFromDoping(mat, mob, 0, na); mobRel(rho, target) > 1e-9 {
		t.Errorf("ρ at root = %g, want %g", rho, target)
	}
	if _, err := DopingFromResistivity(mat, mob, rhoI*ratio*1.01, Acceptor, 0); !errors.Is(err, ErrNoDoping) {
		t.Errorf("above the p-type maximum: %v, want ErrNoDoping", err)
	}
	if _, err := DopingFromResistivity(mat, mob, rhoI*1.01, Donor, 0); !errors.Is(err, ErrNoDoping) {
		t.Errorf("n-type above intrinsic: %v, want ErrNoDoping", err)
	}
}

// TestResistivityBadInput checks the errors of DopingFromResistivity.
func TestResistivityBadInput(t *testing.T) {
	mat := mustAt(t, DefaultModelSet(), 300)
	mob := NewKlaassen1992()
	for _, c := range []struct {
		rho     float64
		dop     Dopant
		comp    float64
		word    string
		noDopng bool
	}{
		{0, Donor, 0, "rho", false},
		{-1, Donor, 0, "rho", false},
		{math.NaN(), Acceptor, 0, "rho", false},
		{math.Inf(1), Acceptor, 0, "rho", false},
		{1, 0, 0, "dop", false},
		{1, 7, 0, "dop", false},
		{1, Donor, -1, "comp", false},
		{1, Donor, math.NaN(), "comp", false},
		{1, Donor, 6e20, "comp", false},
		{1e-6, Donor, 0, "below", true},
		{1e-6, Acceptor, 1e18, "below", true},
		{1e7, Donor, 0, "above", true},
		{1e7, Acceptor, 0, "above", true},
	} {
		_, err := DopingFromResistivity(mat, mob, c.rho, c.dop, c.comp)
		if err == nil {
			t.Errorf("rho = %g, dop = %v, comp = %g: no error", c.rho, c.dop, c.comp)
			continue
		}
		if !strings.HasPrefix(err.Error(), "silicon: ") || !strings.Contains(err.Error(), c.word) || errors.Is(err, ErrNoDoping) != c.noDopng {
			t.Errorf("rho = %g, dop = %v, comp = %g: error %q (want %q, ErrNoDoping %v)", c.rho, c.dop, c.comp, err, c.word, c.noDopng)
		}
	}
	if _, err := DopingFromResistivity(nil, mob, 1, Donor, 0); err == nil {
		t.Error("nil Material: no error")
	}
	if Donor.String() != "donor" || Acceptor.String() != "acceptor" || Dopant(9).String() != "Dopant(9)" {
		t.Error("Dopant.String")
	}
}

// FuzzDopingFromResistivity checks that the inversion never panics, returns either an error
// starting with "silicon: " or a density that reproduces the resistivity to 1e-9, for any
// resistivity, dopant type and compensation.
func FuzzDopingFromResistivity(f *testing.F) {
	f.Add(1.0, true, 0.0)
	f.Add(10.0, false, 1e14)
	f.Add(1e-3, true, 1e19)
	f.Add(3.5e5, false, 0.0)
	f.Add(1e-9, true, 0.0)
	f.Add(2e5, true, 1e10)
	mat, err := DefaultModelSet().At(300)
	if err != nil {
		f.Fatal(err)
	}
	mob := NewKlaassen1992()
	check := func(t *testing.T, rho float64, dop Dopant, comp float64) {
		n, err := DopingFromResistivity(mat, mob, rho, dop, comp)
		if err != nil {
			if !strings.HasPrefix(err.Error(), "silicon: ") {
				t.Fatalf("rho = %g, comp = %g: error without prefix: %v", rho, comp, err)
			}
			return
		}
		if !(n > comp) || math.IsInf(n, 0) {
			t.Fatalf("rho = %g, comp = %g: density %g", rho, comp, n)
		}
		nd, na := n, comp
		if dop == Acceptor {
			nd, na = comp, n
		}
		back, err := ResistivityFromDoping(mat, mob, nd, na)
		if err != nil {
			t.Fatalf("rho = %g, comp = %g, N = %g: %v", rho, comp, n, err)
		}
		// When the net doping is far below comp, rounding of comp + net limits the
		// achievable accuracy; allow for it.
		tol := 1e-9 + 8*0x1p-52*comp/(n-comp)
		if d := mobRel(back, rho); d > tol {
			t.Fatalf("rho = %g, comp = %g: N = %g gives ρ = %g (rel. %.2g > %.2g)", rho, comp, n, back, d, tol)
		}
	}
	f.Fuzz(func(t *testing.T, rho float64, acceptor bool, comp float64) {
		dop := Donor
		if acceptor {
			dop = Acceptor
		}
		// The raw inputs (mostly invalid or unreachable values) ...
		check(t, rho, dop, comp)
		// ... and the same inputs mapped into the reachable range: 1e-5–1e7 Ω·cm and
		// compensation up to 1e20 cm^-3.
		if !math.IsNaN(rho) && !math.IsInf(rho, 0) && !math.IsNaN(comp) && !math.IsInf(comp, 0) {
			check(t, math.Pow(10, math.Mod(math.Abs(rho), 12)-5), dop, math.Mod(math.Abs(comp), 1e20))
		}
	})
}
