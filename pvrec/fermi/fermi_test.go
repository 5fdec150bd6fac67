package fermi

import (
	"encoding/csv"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"
)

const eps = 0x1p-52 // float64 machine epsilon

// forwardTol is the documented relative accuracy of Half, MinusHalf, ThreeHalf and Zero:
// the Chebyshev truncation is below 2e-17 relative (gen_tables.py) and the float64
// evaluation adds a few ulp; 2e-15 is 9 ulp.
const forwardTol = 2e-15

func relErr(got, want float64) float64 {
	if got == want {
		return 0
	}
	return math.Abs(got-want) / math.Abs(want)
}

type refRow struct {
	eta                   float64
	mHalf, zero, half, th float64
}

// readReference reads the table written by testdata/reference/fermi_dirac.py
// (mpmath polylog at 50 digits, every 10th row cross-checked against quadrature of the
// defining integral to 1e-25; values printed with 30 significant digits).
func readReference(t testing.TB) []refRow {
	t.Helper()
	f, err := os.Open("../../testdata/reference/fermi_dirac.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	r := csv.NewReader(f)
	r.Comment = '#'
	recs, err := r.ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if got := strings.Join(recs[0], ","); got != "eta,F_mhalf,F_0,F_half,F_3half" {
		t.Fatalf("unexpected header %q", got)
	}
	var rows []refRow
	for i, rec := range recs[1:] {
		var v [5]float64
		for j := range v {
			if v[j], err = strconv.ParseFloat(rec[j], 64); err != nil {
				t.Fatalf("row %d: %v", i+2, err)
			}
		}
		rows = append(rows, refRow{v[0], v[1], v[2], v[3], v[4]})
	}
	if len(rows) < 1000 {
		t.Fatalf("only %d reference rows", len(rows))
	}
	return rows
}

var forward = []struct {
	name string
	f    func(float64) float64
	j    float64                // order
	ref  func(r refRow) float64 // column of the reference table
}{
	{"MinusHalf", MinusHalf, -0.5, func(r refRow) float64 { return r.mHalf }},
	{"Zero", Zero, 0, func(r refRow) float64 { return r.zero }},
	{"Half", Half, 0.5, func(r refRow) float64 { return r.half }},
	{"ThreeHalf", ThreeHalf, 1.5, func(r refRow) float64 { return r.th }},
}

// TestReference compares every function with the mpmath table over η ∈ [−50, 100].
func TestReference(t *testing.T) {
	rows := readReference(t)
	for _, fn := range forward {
		t.Run(fn.name, func(t *testing.T) {
			worst, at := 0.0, 0.0
			for _, r := range rows {
				// Source: mpmath polylog, testdata/reference/fermi_dirac.py.
				if e := relErr(fn.f(r.eta), fn.ref(r)); e > worst {
					worst, at = e, r.eta
				}
			}
			if worst > forwardTol {
				t.Errorf("max relative error %.3g at η = %g, want <= %g", worst, at, forwardTol)
			}
			t.Logf("max relative error %.3g at η = %g over %d points", worst, at, len(rows))
		})
	}
}

// TestBoltzmannLimit checks F_j(η) = e^η (1 − e^η/2^{j+1} + O(e^{2η})) as η → −∞, the
// first two terms of the series −Li_{j+1}(−z) = z − z²/2^{j+1} + z³/3^{j+1} − ...
// (textbook closed form, e.g. NIST DLMF §25.12(ii)). The neglected term is below e^{2η}.
func TestBoltzmannLimit(t *testing.T) {
	for _, fn := range forward {
		for _, eta := range []float64{-700, -300, -100, -50, -40, -30, -20, -15} {
			x := math.Exp(eta)
			want := 1 - x/math.Pow(2, fn.j+1)
			got := fn.f(eta) / x
			if e := math.Abs(got - want); e > 4*eps+x*x {
				t.Errorf("%s(%g)/e^η = %.17g, want %.17g (diff %.3g)", fn.name, eta, got, want, e)
			}
		}
	}
}

// TestDegenerateLimit checks the Sommerfeld expansion for large η,
// F_j(η) = η^{j+1}/Γ(j+2) (1 + (π²/6)(j+1)j η^{−2} + a_2 η^{−4} + ...),
// A. Sommerfeld, Z. Phys. 47, 1-32 (1928). The first correction terms (π²/8 for j = 1/2,
// −π²/24 for j = −1/2, 5π²/8 for j = 3/2) are included; the tolerance is twice the next
// term, a_2 = t_2 Γ(j+2)/Γ(j−2) with t_2 = 7π⁴/360 (7π⁴/640, −7π⁴/384, −7π⁴/384), plus
// rounding. At η = 60 this tests the expansion to ~1e-7, at η >= 1e4 to rounding.
func TestDegenerateLimit(t *testing.T) {
	pi2, pi4 := math.Pi*math.Pi, math.Pi*math.Pi*math.Pi*math.Pi
	cases := []struct {
		name   string
		f      func(float64) float64
		j      float64
		c1, c2 float64
	}{
		{"Half", Half, 0.5, pi2 / 8, 7 * pi4 / 640},
		{"MinusHalf", MinusHalf, -0.5, -pi2 / 24, -7 * pi4 / 384},
		{"ThreeHalf", ThreeHalf, 1.5, 5 * pi2 / 8, -7 * pi4 / 384},
	}
	for _, c := range cases {
		for _, eta := range []float64{20, 40, 60, 100, 1e3, 1e4, 1e8, 1e20, 1e100} {
			lead := math.Exp((c.j+1)*math.Log(eta) - lgamma(c.j+2))
			got := c.f(eta) / lead
			want := 1 + c.c1/(eta*eta)
			tol := 2*math.Abs(c.c2)/(eta*eta*eta*eta) + 8*eps*math.Max(1, math.Log(eta))
			if e := math.Abs(got - want); e > tol {
				t.Errorf("%s(%g)/(η^%g/Γ(%g)) = %.17g, want %.17g ± %.3g", c.name, eta, c.j+1, c.j+2, got, want, tol)
			}
		}
	}
}

func lgamma(x float64) float64 { v, _ := math.Lgamma(x); return v }

// TestZeroClosedForm checks F_0 against its closed form ln(1+e^η) and the identity
// F_0(η) − F_0(−η) = η (from ln(1+e^η) = η + ln(1+e^−η); textbook algebra).
func TestZeroClosedForm(t *testing.T) {
	if got, want := Zero(0), math.Ln2; got != want { // F_0(0) = ln 2, closed form
		t.Errorf("Zero(0) = %.17g, want ln 2 = %.17g", got, want)
	}
	for eta := -1.0; eta <= 700; eta += 0.731 {
		// Direct evaluation is accurate here: the rounding of 1+e^η is magnified at most
		// 1/ln(1+e^−1) ≈ 3.2 times by the logarithm, so 16 ulp is generous.
		if e := relErr(Zero(eta), math.Log(1+math.Exp(eta))); e > 16*eps {
			t.Errorf("Zero(%g): relative difference %.3g from ln(1+e^η)", eta, e)
		}
	}
	for eta := 0.0; eta <= 800; eta += 0.917 {
		if d := Zero(eta) - Zero(-eta); math.Abs(d-eta) > 4*eps*math.Max(1, eta) {
			t.Errorf("Zero(%g) − Zero(%g) = %.17g, want η", eta, -eta, d)
		}
	}
}

// TestDerivative checks dF_j/dη = F_{j−1} (differentiate under the integral and
// integrate by parts; NIST DLMF §25.12(iii)) with the fourth-order central difference
// [f(η−2h) − 8f(η−h) + 8f(η+h) − f(η+2h)]/(12h), h = 1e-3·max(1, η) (the
// scale on which F_j varies is 1 for η < 1 and η above). Its truncation
// error is h⁴ f⁽⁵⁾/30 ≲ 1e-13 relative and its rounding error ≈ 1.5 ε |f|/(h |f'|) ≲ 5e-13
// relative over this range (observed: 2.7e-13), so 1e-11 is a safe bound. The grid straddles every
// switch point between methods, so this also checks that they join smoothly.
func TestDerivative(t *testing.T) {
	logistic := func(eta float64) float64 { return 1 / (1 + math.Exp(-eta)) } // F_{−1}, closed form
	pairs := []struct {
		name string
		f, d func(float64) float64
	}{
		{"Half'=MinusHalf", Half, MinusHalf},
		{"ThreeHalf'=Half", ThreeHalf, Half},
		{"Zero'=logistic", Zero, logistic},
	}
	for _, p := range pairs {
		worst := 0.0
		for eta := -50.0; eta <= 100; eta += 0.173 {
			h := 1e-3 * math.Max(1, eta)
			h = (eta + h) - eta // make η ± h, η ± 2h exact; otherwise their rounding, ulp(η)/h ≈ 7e-12, dominates
			num := (p.f(eta-2*h) - 8*p.f(eta-h) + 8*p.f(eta+h) - p.f(eta+2*h)) / (12 * h)
			e := relErr(num, p.d(eta))
			worst = math.Max(worst, e)
			if e > 1e-11 {
				t.Errorf("%s at η = %g: numerical derivative %.15g vs %.15g (rel %.3g)", p.name, eta, num, p.d(eta), e)
			}
		}
		t.Logf("%s: max relative difference %.3g", p.name, worst)
	}
}

// TestContinuity checks that adjacent methods agree at every switch point: the value
// just below an edge and at the edge differ by at most the two methods' errors
// (2·forwardTol; the true change over one ulp is far smaller). Common practice.
func TestContinuity(t *testing.T) {
	for edge := float64(chebLo); edge <= chebHi; edge += chebWidth {
		below := math.Nextafter(edge, math.Inf(-1))
		for _, fn := range forward {
			if e := relErr(fn.f(below), fn.f(edge)); e > 2*forwardTol {
				t.Errorf("%s jumps by %.3g relative at η = %g", fn.name, e, edge)
			}
		}
	}
}

// TestMonotone checks that every F_j is strictly increasing (its derivative F_{j−1} is
// positive). Over the step 1e-3 the true increase is at least 5e-6 relative, far above
// the error. Common practice.
func TestMonotone(t *testing.T) {
	for _, fn := range forward {
		prev := fn.f(-50)
		for k := 1; k <= 150000; k++ {
			eta := -50 + 1e-3*float64(k)
			v := fn.f(eta)
			if !(v > prev) {
				t.Fatalf("%s not increasing at η = %g: %.17g after %.17g", fn.name, eta, v, prev)
			}
			prev = v
		}
	}
}

func TestSpecialCases(t *testing.T) {
	inf, nan := math.Inf(1), math.NaN()
	for _, fn := range forward {
		for _, c := range []struct{ in, want float64 }{
			{math.Inf(-1), 0}, // limit e^η → 0
			{inf, inf},        // limit η^{j+1}/Γ(j+2) → ∞
			{nan, nan},        // as math.Erf
		} {
			got := fn.f(c.in)
			if !(got == c.want || math.IsNaN(got) && math.IsNaN(c.want)) {
				t.Errorf("%s(%g) = %g, want %g", fn.name, c.in, got, c.want)
			}
		}
	}
	// Huge finite arguments stay finite or overflow to +Inf, never NaN.
	for _, eta := range []float64{1e150, 1e200, 1e300, math.MaxFloat64, -math.MaxFloat64} {
		for _, fn := range forward {
			if v := fn.f(eta); math.IsNaN(v) || v < 0 {
				t.Errorf("%s(%g) = %g", fn.name, eta, v)
			}
		}
	}
}

// roundTripTol bounds |Half(InvHalf(y))/y − 1| for y = F_{1/2}(η): the forward error plus
// the conditioning of F_{1/2} (d ln F = (F_{−1/2}/F_{1/2}) dη) applied to a few ulp of η.
func roundTripTol(eta float64) float64 {
	return forwardTol + 4*eps*math.Max(1, math.Abs(eta))*MinusHalf(eta)/Half(eta)
}

// TestInvHalfRoundTrip checks InvHalf(Half(η)) = η at the reference η ∈ [−50, 100] and
// Half(InvHalf(y)) = y. The η tolerance is the forward error mapped through
// dη = d ln F · F_{1/2}/F_{−1/2} (F_{1/2}/F_{−1/2} <= max(1, 2|η|/3)), plus rounding.
func TestInvHalfRoundTrip(t *testing.T) {
	for _, r := range readReference(t) {
		eta, err := InvHalf(r.half) // r.half: mpmath F_{1/2}(η), fermi_dirac.py
		if err != nil {
			t.Fatalf("InvHalf(%g): %v", r.half, err)
		}
		if d := math.Abs(eta - r.eta); d > 4e-15*math.Max(1, math.Abs(r.eta)) {
			t.Errorf("InvHalf(F(%g)) = %.17g, off by %.3g", r.eta, eta, d)
		}
		y := Half(r.eta)
		back, _ := InvHalf(y)
		if e := relErr(Half(back), y); e > roundTripTol(r.eta) {
			t.Errorf("Half(InvHalf(%g)) off by %.3g relative (η = %g)", y, e, r.eta)
		}
	}
}

// TestInvHalfWideRange checks the round trip over y = 1e-300 ... 1e300, far beyond the
// range of interest, where InvHalf works in logarithms to avoid under- and overflow.
func TestInvHalfWideRange(t *testing.T) {
	for k := -300; k <= 300; k++ {
		for _, m := range []float64{1, 3.7} {
			y := m * math.Pow(10, float64(k))
			eta, err := InvHalf(y)
			if err != nil || math.IsNaN(eta) || math.IsInf(eta, 0) {
				t.Fatalf("InvHalf(%g) = %g, %v", y, eta, err)
			}
			if e := relErr(Half(eta), y); e > roundTripTol(eta) {
				t.Errorf("Half(InvHalf(%g)) off by %.3g relative (η = %g)", y, e, eta)
			}
		}
	}
	// Extremes: both finite results, no error.
	for _, y := range []float64{math.SmallestNonzeroFloat64, 0x1p-1022, math.MaxFloat64} {
		if eta, err := InvHalf(y); err != nil || math.IsNaN(eta) || math.IsInf(eta, 0) {
			t.Errorf("InvHalf(%g) = %g, %v", y, eta, err)
		}
	}
	if eta, _ := InvHalf(math.MaxFloat64); relErr(Half(eta), math.MaxFloat64) > roundTripTol(eta) {
		t.Errorf("Half(InvHalf(MaxFloat64)) = %g", Half(eta))
	}
}

// TestInvHalfSteps checks the claim in invHalf's comments that the Newton iteration from
// the documented starts converges in at most 4 steps, over y = F_{1/2}(η), η ∈ [−60, 200].
func TestInvHalfSteps(t *testing.T) {
	for eta := -60.0; eta <= 200; eta += 0.0371 {
		if _, n := invHalf(Half(eta)); n > 4 {
			t.Errorf("InvHalf(F(%g)) took %d Newton steps", eta, n)
		}
	}
}

func TestInvHalfErrors(t *testing.T) {
	for _, y := range []float64{0, math.Copysign(0, -1), -1, -math.MaxFloat64, math.Inf(-1), math.Inf(1), math.NaN()} {
		eta, err := InvHalf(y)
		switch {
		case err == nil:
			t.Errorf("InvHalf(%g) = %g, want an error", y, eta)
		case !strings.HasPrefix(err.Error(), "fermi: InvHalf: y must be finite and > 0"):
			t.Errorf("InvHalf(%g): error %q must start with the package and name y", y, err)
		case !math.IsNaN(eta):
			t.Errorf("InvHalf(%g) returned %g with its error, want NaN", y, eta)
		}
	}
}

// FuzzInvHalf: for any float64, InvHalf never panics, returns an error exactly for
// invalid input and otherwise a finite η with Half(η) = y (for normal y; a subnormal y
// carries fewer significant bits than the tolerance assumes).
func FuzzInvHalf(f *testing.F) {
	for _, y := range []float64{0, -1, 5e-324, 1e-300, 1e-22, 0.1, 0.765, 1, 7.999999, 8, 8.000001,
		24.08, 752.3, 1e10, 1e300, math.MaxFloat64, math.Inf(1), math.NaN()} {
		f.Add(y)
	}
	f.Fuzz(func(t *testing.T, y float64) {
		eta, err := InvHalf(y)
		valid := y > 0 && !math.IsInf(y, 0) && !math.IsNaN(y)
		if valid != (err == nil) {
			t.Fatalf("InvHalf(%g): err = %v", y, err)
		}
		if !valid {
			return
		}
		if math.IsNaN(eta) || math.IsInf(eta, 0) {
			t.Fatalf("InvHalf(%g) = %g", y, eta)
		}
		if y >= 0x1p-1022 {
			if e := relErr(Half(eta), y); e > roundTripTol(eta) {
				t.Fatalf("Half(InvHalf(%g)) off by %.3g relative (η = %g)", y, e, eta)
			}
		}
	})
}

// TestOverflowThresholds checks the documented ends of the finite range of the forward
// functions for large η: F_{1/2} overflows between 3.8e205 and 3.9e205 (η^{3/2}/Γ(5/2) =
// MaxFloat64 at 3.85e205), F_{3/2} above 1.2e123 (η^{5/2}/Γ(7/2)), and F_{−1/2} stays finite.
func TestOverflowThresholds(t *testing.T) {
	if v := Half(3.8e205); math.IsInf(v, 0) {
		t.Errorf("Half(3.8e205) = %g", v)
	}
	if v := Half(3.9e205); !math.IsInf(v, 1) {
		t.Errorf("Half(3.9e205) = %g, want +Inf", v)
	}
	if v := ThreeHalf(1.2e123); math.IsInf(v, 0) {
		t.Errorf("ThreeHalf(1.2e123) = %g", v)
	}
	if v := MinusHalf(math.MaxFloat64); math.IsInf(v, 0) || !(v > 0) {
		t.Errorf("MinusHalf(MaxFloat64) = %g", v)
	}
}
