package cell

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// TestVocTemperatureTextbook checks dVoc/dT of a cell whose losses are J0s given as numbers
// (scaled by At as J0 ∝ ni²) against the textbook estimate
//
//	dVoc/dT = −(Eg0/q − Voc + γ kT/q)/T,
//
// M. A. Green, Solar Cells: Operating Principles, Technology and System Applications
// (Prentice-Hall, 1982), which follows from J0 = A T^γ exp(−Eg0/kT) with Jsc independent of T.
// Our J0 ∝ ni² with ni = A T^Exp exp(−Eg(T)/2kT) (Couderc2014, the default) is that form
// locally, with γ = 2·Exp = 3.424 (the value we use, read from the model: it is the T exponent
// of ni² in the default model set) and Eg0 = Eg(T) − T dEg/dT, the linear extrapolation to
// 0 K of the tangent of the gap (Pässler2002, inside Couderc2014) at T. The estimate is then
// exact up to Vt·J0/Jsc (1e-12) and the error h² Voc‴/6 of the central difference, where
// Voc‴ = 2·Exp·k/(qT²) + Eg‴/q ≈ 3.3e-9 + 2.5e-9 V/K³ (Couderc's T^Exp and the curvature of
// Pässler's gap): 5e-7 relative at h = 1 K, tolerance 1e-6. The error must also fall as h²:
// the 5 K error is 25 times the 1 K error (to 1 %).
func TestVocTemperatureTextbook(t *testing.T) {
	const temp = 298.15
	m := materialAt(t, temp)
	dev := mustDevice(t, j0Design(m, 150e-15, 0.04, 0))
	tc, err := dev.TemperatureCoefficients(1)
	if err != nil {
		t.Fatal(err)
	}
	coarse, err := dev.TemperatureCoefficients(5)
	if err != nil {
		t.Fatal(err)
	}
	ni, ok := m.Models().Intrinsic.(silicon.Couderc2014)
	if !ok {
		t.Fatalf("default intrinsic density is %T, not Couderc2014", m.Models().Intrinsic)
	}
	const h = 1e-2 // K, central difference of the smooth gap (error ~h² Eg‴/6 ~ 1e-14 eV/K)
	egHi, err1 := ni.Gap.Eg(temp + h)
	egLo, err2 := ni.Gap.Eg(temp - h)
	eg, err3 := ni.Gap.Eg(temp)
	if err := errors.Join(err1, err2, err3); err != nil {
		t.Fatal(err)
	}
	eg0 := eg - temp*(egHi-egLo)/(2*h)
	gamma := 2 * ni.Exp
	want := -(eg0 - tc.Voc + gamma*m.Vt()) / temp
	if e := relErr(tc.DVoc, want); e > 1e-6 {
		t.Errorf("dVoc/dT = %.8g V/K, textbook with Eg0 = %.4f eV, γ = %.3f: %.8g V/K (rel %g)", tc.DVoc, eg0, gamma, want, e)
	}
	if r := (coarse.DVoc - want) / (tc.DVoc - want); math.Abs(r/25-1) > 0.01 {
		t.Errorf("central-difference error at 5 K is %.3g times the one at 1 K, want 25 (second order)", r)
	}
	if !strings.Contains(strings.Join(tc.Notes, "\n"), "ni²(T)/ni²(T0)") {
		t.Errorf("notes do not state the ni² scaling: %q", tc.Notes)
	}
}

// TestTemperatureFullModels checks the coefficients of the cell with every kind of term and
// default models (regions as numbers, intrinsic and SRH bulk, surfaces, J02, shunt): dVoc/dT
// lies within the textbook estimate (Green 1982, above) for γ between 1 and 4, the range
// Green gives for silicon (value from memory), with Eg0 = 1.206 eV, the linearly
// extrapolated 0-K gap of silicon he uses (value from memory); Voc, FF and η fall with T;
// At(T) at the design's own temperature reproduces the design (no notes, same Voc).
func TestTemperatureFullModels(t *testing.T) {
	dev := mustDevice(t, fullDesign(t))
	tc, err := dev.TemperatureCoefficients(0)
	if err != nil {
		t.Fatal(err)
	}
	if tc.Step != DefaultTempStep {
		t.Errorf("step %g, want the default %d K", tc.Step, DefaultTempStep)
	}
	bound := func(gamma float64) float64 { return -(1.206 - tc.Voc + gamma*8.617333e-5*tc.T) / tc.T }
	if !(tc.DVoc < bound(1) && tc.DVoc > bound(4)) {
		t.Errorf("dVoc/dT = %.4g V/K outside the textbook range [%.4g, %.4g] V/K", tc.DVoc, bound(4), bound(1))
	}
	if !(tc.DFF < 0 && tc.DEta < 0 && tc.RelEta < tc.RelVoc) {
		t.Errorf("coefficients %+v: want FF and η falling, η faster than Voc", tc)
	}
	same, err := dev.At(dev.Material().T())
	if err != nil {
		t.Fatal(err)
	}
	r0, err1 := dev.Solve()
	r1, err2 := same.Solve()
	if err := errors.Join(err1, err2); err != nil {
		t.Fatal(err)
	}
	if r0.Voc != r1.Voc || len(r1.Notes) != 0 {
		t.Errorf("At(own T): Voc %g vs %g, notes %q", r1.Voc, r0.Voc, r1.Notes)
	}
	warm, err := dev.At(305)
	if err != nil {
		t.Fatal(err)
	}
	rw, err := warm.Solve()
	if err != nil {
		t.Fatal(err)
	}
	notes := strings.Join(rw.Notes, "\n")
	for _, w := range []string{"front: emitter, front: contact, rear: contact", "J02 scaled", "surface models evaluated at 305.00 K as they model it (front: edge, rear: dielectric)", "Jsc, Rs, Rsh and Pin held"} {
		if !strings.Contains(notes, w) {
			t.Errorf("notes at 305 K lack %q:\n%s", w, notes)
		}
	}
}

// TestTemperatureWindow checks that a step leaving the 290–310 K window of Richter2012 and
// Trupke2003 gives an error matching pvrec.ErrOutOfRange (issue 10: "where the models allow").
func TestTemperatureWindow(t *testing.T) {
	dev := mustDevice(t, fullDesign(t))
	if _, err := dev.TemperatureCoefficients(15); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("±15 K around 300 K: error %v, want ErrOutOfRange", err)
	}
	hot, err := dev.At(320)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := hot.Voc(); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Voc at 320 K: error %v, want ErrOutOfRange", err)
	}
}

// TestIntrinsicLimitRichter2013 checks the intrinsic limit against A. Richter, M. Hermle and
// S. W. Glunz, "Reassessment of the limiting efficiency for crystalline silicon solar cells",
// IEEE J. Photovolt. 3, 1184 (2013): an undoped 110 µm cell at 25 °C under AM1.5G (100
// mW/cm^2) with Lambertian light trapping reaches η = 29.43 %, with Jsc = 43.31 mA/cm^2,
// Voc = 761.3 mV and FF = 89.26 % (values from memory). The paper includes photon recycling;
// how much of the radiative recombination it recycles is not recalled, so the check brackets
// it: our limit without recycling (Trupke2003 escape fraction 1, the default) must lie below
// each published value and the one with every photon recycled (escape fraction 0) above it.
// Jsc is our input (no optics), set to the published value.
func TestIntrinsicLimitRichter2013(t *testing.T) {
	m := materialAt(t, 298.15)
	lim := Design{Material: m, Base: Base{Thickness: 110e-4}, Jsc: 43.31e-3}.IntrinsicLimit()
	if len(lim.Base.Mechanisms) != 1 || lim.Front != nil || lim.Rear != nil || lim.Rs != 0 || lim.Pin != 0 {
		t.Fatalf("IntrinsicLimit design %+v", lim)
	}
	none, err := mustDevice(t, lim).Solve()
	if err != nil {
		t.Fatal(err)
	}
	tr := recomb.NewTrupke2003()
	tr.EscapeFraction = 0
	lim.Base.Mechanisms = []recomb.Mechanism{recomb.Intrinsic{Auger: recomb.NewRichter2012(), Radiative: tr}}
	all, err := mustDevice(t, lim).Solve()
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name          string
		lo, paper, hi float64
	}{
		{"Voc (V)", none.Voc, 0.7613, all.Voc},
		{"FF", none.FF, 0.8926, all.FF},
		{"efficiency", none.Efficiency, 0.2943, all.Efficiency},
	} {
		if !(c.lo < c.paper && c.paper < c.hi) {
			t.Errorf("%s: Richter et al. 2013 %.4f not between our limits without (%.4f) and with full photon recycling (%.4f)", c.name, c.paper, c.lo, c.hi)
		}
	}
	if math.Abs(none.Jsc-43.31e-3) != 0 || none.PFF != none.FF {
		t.Errorf("intrinsic limit: Jsc %g, FF %g, pFF %g", none.Jsc, none.FF, none.PFF)
	}
}
