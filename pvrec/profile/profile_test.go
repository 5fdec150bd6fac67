package profile

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

func relDiff(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// TestAnalyticDensities checks the analytic profiles against their defining formulas
// (textbook solutions of Fick's second law, S. M. Sze and K. K. Ng, Physics of Semiconductor
// Devices, 3rd ed., Wiley 2007) at chosen depths; the tolerance is rounding.
func TestAnalyticDensities(t *testing.T) {
	e := Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}
	g := Gaussian{Dopant: silicon.Acceptor, Peak: 5e19, Center: 0.1e-4, Length: 0.2e-4}
	u := Uniform{Dopant: silicon.Acceptor, N: 1.5e16}
	for _, tc := range []struct {
		p      Profile
		x      float64
		nd, na float64
	}{
		{e, 0, 1e20, 0}, // erfc(0) = 1
		{e, 0.3e-4, 1e20 * 0.15729920705028513, 0},              // erfc(1), value from memory (Abramowitz & Stegun table 7.1)
		{g, 0.1e-4, 0, 5e19},                                    // at the peak
		{g, 0.3e-4, 0, 5e19 * math.Exp(-1)},                     // one length beyond the peak
		{u, 7, 0, 1.5e16},                                       // uniform
		{Sum{e, u}, 0.3e-4, 1e20 * 0.15729920705028513, 1.5e16}, // sums add
		{Sum{}, 1e-4, 0, 0},                                     // undoped
	} {
		nd, na, err := tc.p.Dopants(tc.x)
		if err != nil {
			t.Fatalf("%v at %g: %v", tc.p, tc.x, err)
		}
		if relDiff(nd, tc.nd) > 1e-14 || relDiff(na, tc.na) > 1e-14 {
			t.Errorf("%v at %g cm: (%g, %g), want (%g, %g)", tc.p, tc.x, nd, na, tc.nd, tc.na)
		}
	}
}

// TestDose checks the numerical Dose against the closed forms of the erfc and Gaussian
// profiles (∫ erfc = L/sqrt(π); ∫ exp(−z²) over the silicon = L sqrt(π)/2 (1 + erf(x0/L)),
// textbook integrals) and NetDose against ∫_0^xj (Ns erfc(x/L) − NB) dx =
// Ns L (z erfc z + (1 − e^{−z²})/sqrt(π)) − NB xj, z = xj/L. The quadrature is accurate to
// about 1e-12 (see Dose).
func TestDose(t *testing.T) {
	e := Erfc{Dopant: silicon.Donor, Surface: 2e20, Length: 0.25e-4}
	g := Gaussian{Dopant: silicon.Acceptor, Peak: 1e19, Center: 0.05e-4, Length: 0.4e-4}
	for _, tc := range []struct {
		p    Profile
		d    silicon.Dopant
		want func() (float64, error)
	}{
		{e, silicon.Donor, e.Dose},
		{g, silicon.Acceptor, g.Dose},
		{Sum{e, g}, silicon.Acceptor, g.Dose},
	} {
		want, err := tc.want()
		if err != nil {
			t.Fatal(err)
		}
		got, err := Dose(tc.p, tc.d, 0, tc.p.Extent())
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(got, want) > 1e-11 {
			t.Errorf("Dose(%v) = %.15g cm^-2, want %.15g", tc.p, got, want)
		}
	}
	if want := e.Surface * e.Length / math.SqrtPi; relDiff(func() float64 { v, _ := e.Dose(); return v }(), want) > 1e-15 {
		t.Errorf("Erfc.Dose")
	}
	nb := 1.5e16
	p := Sum{e, Uniform{Dopant: silicon.Acceptor, N: nb}}
	xj, err := JunctionDepth(p)
	if err != nil {
		t.Fatal(err)
	}
	z := xj / e.Length
	want := e.Surface*e.Length*(z*math.Erfc(z)+(1-math.Exp(-z*z))/math.SqrtPi) - nb*xj
	got, err := NetDose(p)
	if err != nil {
		t.Fatal(err)
	}
	if relDiff(got, want) > 1e-10 {
		t.Errorf("NetDose = %.15g cm^-2, want %.15g", got, want)
	}
}

// TestJunctionDepth checks JunctionDepth against the closed forms xj = L erfcinv(NB/Ns) and
// xj = x0 + L sqrt(ln(Np/NB)) (solving the defining formulas for N(xj) = NB), for either
// dopant type; the tolerance is the float64 resolution of the bracket (plus erfcinv's).
func TestJunctionDepth(t *testing.T) {
	for _, tc := range []struct {
		p    Profile
		want float64
	}{
		{Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}, Uniform{Dopant: silicon.Acceptor, N: 1e16}}, 0.3e-4 * math.Erfcinv(1e-4)},
		{Sum{Uniform{Dopant: silicon.Donor, N: 2e15}, Erfc{Dopant: silicon.Acceptor, Surface: 5e19, Length: 1e-4}}, 1e-4 * math.Erfcinv(2e15/5e19)},
		{Sum{Gaussian{Dopant: silicon.Donor, Peak: 3e19, Center: 0.1e-4, Length: 0.5e-4}, Uniform{Dopant: silicon.Acceptor, N: 1e15}}, 0.1e-4 + 0.5e-4*math.Sqrt(math.Log(3e4))},
	} {
		got, err := JunctionDepth(tc.p)
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(got, tc.want) > 1e-13 {
			t.Errorf("JunctionDepth(%v) = %.16g cm, want %.16g", tc.p, got, tc.want)
		}
	}
	// High–low junction and uniform wafer: no junction.
	for _, p := range []Profile{
		Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}, Uniform{Dopant: silicon.Donor, N: 1e15}},
		Uniform{Dopant: silicon.Acceptor, N: 1e16},
	} {
		if _, err := JunctionDepth(p); !errors.Is(err, ErrNoJunction) {
			t.Errorf("JunctionDepth(%v): err %v, want ErrNoJunction", p, err)
		}
	}
}

// TestMajority checks the dopant type at the surface (definition).
func TestMajority(t *testing.T) {
	p := Sum{Erfc{Dopant: silicon.Acceptor, Surface: 1e19, Length: 1e-5}, Uniform{Dopant: silicon.Donor, N: 1e15}}
	if d, err := Majority(p); err != nil || d != silicon.Acceptor {
		t.Errorf("Majority = %v, %v; want acceptor", d, err)
	}
	if _, err := Majority(Sum{}); err == nil {
		t.Errorf("Majority of undoped silicon: no error")
	}
}

// TestSheetOf checks SheetOf against SheetResistanceFunc called directly on the same layer
// (consistency of the adapter; the integral itself is tested with SheetResistance).
func TestSheetOf(t *testing.T) {
	mat := materialWith(t, silicon.NewKlaassen1992())
	ns, l, nb := 2e20, 0.25e-4, 1.5e16
	p := Sum{Gaussian{Dopant: silicon.Donor, Peak: ns, Length: l}, Uniform{Dopant: silicon.Acceptor, N: nb}}
	got, err := SheetOf(p, mat)
	if err != nil {
		t.Fatal(err)
	}
	want, err := SheetResistanceFunc(mat, silicon.Donor, func(x float64) float64 { u := x / l; return ns * math.Exp(-u*u) }, p.Extent(), nb)
	if err != nil {
		t.Fatal(err)
	}
	if relDiff(got.Rsh, want.Rsh) > 1e-7 || relDiff(got.XjCm, want.XjCm) > 1e-12 {
		t.Errorf("SheetOf = %+v, want %+v", got, want)
	}
	// Deeper and heavier layers conduct better (monotonic, definition of Rsh).
	prev := math.Inf(1)
	for _, l := range []float64{0.1e-4, 0.2e-4, 0.4e-4} {
		s, err := SheetOf(Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: l}, Uniform{Dopant: silicon.Acceptor, N: nb}}, mat)
		if err != nil || !(s.Rsh < prev) {
			t.Errorf("L = %g: Rsh = %g, err %v, not below %g", l, s.Rsh, err, prev)
		}
		prev = s.Rsh
	}
	if _, err := SheetOf(Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}, Uniform{Dopant: silicon.Donor, N: 1e15}}, mat); !errors.Is(err, ErrNoJunction) {
		t.Errorf("SheetOf high–low: err %v, want ErrNoJunction", err)
	}
	if _, err := SheetOf(Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}, Erfc{Dopant: silicon.Acceptor, Surface: 1e18, Length: 1e-4}}, mat); err == nil || !strings.Contains(err.Error(), "not uniform") {
		t.Errorf("SheetOf with a graded background: err %v", err)
	}
}

// TestBadInput checks that invalid parameters and depths give errors starting with
// "profile: " and naming the argument (house rule).
func TestBadInput(t *testing.T) {
	nan := math.NaN()
	for _, tc := range []struct {
		p    Profile
		x    float64
		want string
	}{
		{Erfc{Dopant: silicon.Donor, Surface: -1, Length: 1e-5}, 0, "Surface"},
		{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0}, 0, "Length"},
		{Erfc{Dopant: 0, Surface: 1e20, Length: 1e-5}, 0, "Dopant"},
		{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}, -1, "depth x"},
		{Gaussian{Dopant: silicon.Donor, Peak: nan, Length: 1e-5}, 0, "Peak"},
		{Gaussian{Dopant: silicon.Donor, Peak: 1, Center: math.Inf(1), Length: 1e-5}, 0, "Center"},
		{Uniform{Dopant: silicon.Acceptor, N: math.Inf(1)}, 0, "density N"},
		{Uniform{Dopant: silicon.Acceptor, N: 1}, nan, "depth x"},
		{Sum{Uniform{Dopant: silicon.Acceptor, N: 1}, nil}, 0, "nil"},
	} {
		_, _, err := tc.p.Dopants(tc.x)
		if err == nil || !strings.HasPrefix(err.Error(), "profile: ") || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%v at %g: err %v, want prefix \"profile: \" and %q", tc.p, tc.x, err, tc.want)
		}
	}
	good := Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}
	for _, tc := range []struct {
		name string
		err  error
	}{
		{"Dose dopant", func() error { _, err := Dose(good, 0, 0, 1e-4); return err }()},
		{"Dose x1 < x0", func() error { _, err := Dose(good, silicon.Donor, 1e-4, 0); return err }()},
		{"Dose nil", func() error { _, err := Dose(nil, silicon.Donor, 0, 1e-4); return err }()},
		{"JunctionDepth nil", func() error { _, err := JunctionDepth(nil); return err }()},
	} {
		if tc.err == nil || !strings.HasPrefix(tc.err.Error(), "profile: ") {
			t.Errorf("%s: err %v", tc.name, tc.err)
		}
	}
}
