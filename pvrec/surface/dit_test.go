package surface

import (
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// totalDit integrates a distribution over the gap of b with the production quadrature.
func totalDit(t *testing.T, d DitDistribution, s recomb.State) float64 {
	t.Helper()
	m := NewExtendedSRH(d, ConstantSigma(1e-16), ConstantSigma(1e-16), 0)
	nodes, err := m.grid(s, 1e7, 1e7, maxPanelKT, glOrder)
	if err != nil {
		t.Fatal(err)
	}
	var sum float64
	for _, n := range nodes {
		sum += n.w
	}
	return sum
}

// TestDitIntegrals: the integral of each distribution over the gap against its closed form
// (elementary integrals of constants, exponentials, a Gaussian, and the trapezoid rule, exact
// for a piecewise-linear table). Tolerance 1e-13 relative.
func TestDitIntegrals(t *testing.T) {
	b := mustBulk(t, refMaterial(t), 0, 1e16, 1e15)
	eLo, eHi := -b.Vt*math.Log(b.Nv/b.NiEff), b.Vt*math.Log(b.Nc/b.NiEff)
	u := UShapedDit{Mid: 1e10, TailC: 1e13, TailV: 3e12, Ec: 0.55, Ev: -0.57, WidthC: 0.03, WidthV: 0.05}
	g := GaussianDit{Peak: 2e12, E0: -0.1, Width: 0.01}
	tab, err := NewTabulatedDit([]float64{-0.7, -0.2, 0, 0.1, 0.3}, []float64{1e11, 5e11, 2e10, 0, 4e11})
	if err != nil {
		t.Fatal(err)
	}
	// Trapezoid of the table, with the part below eLo (the table starts outside the gap) cut:
	// D(eLo) by linear interpolation between −0.7 and −0.2.
	dLo := 1e11 + (eLo+0.7)/0.5*(5e11-1e11)
	tabInt := 0.5*(dLo+5e11)*(-0.2-eLo) + 0.5*(5e11+2e10)*0.2 + 0.5*(2e10+0)*0.1 + 0.5*(0+4e11)*0.2
	for _, c := range []struct {
		name string
		d    DitDistribution
		want float64
	}{
		{"constant", ConstantDit{3e10}, 3e10 * (eHi - eLo)},
		{"U-shaped", u, u.Mid*(eHi-eLo) +
			u.TailC*u.WidthC*(math.Exp((eHi-u.Ec)/u.WidthC)-math.Exp((eLo-u.Ec)/u.WidthC)) +
			u.TailV*u.WidthV*(math.Exp((u.Ev-eLo)/u.WidthV)-math.Exp((u.Ev-eHi)/u.WidthV))},
		{"Gaussian", g, g.Peak * g.Width * math.Sqrt(2*math.Pi)},
		{"tabulated", tab, tabInt},
		{"sum", DitSum{ConstantDit{3e10}, g}, 3e10*(eHi-eLo) + g.Peak*g.Width*math.Sqrt(2*math.Pi)},
	} {
		if got := totalDit(t, c.d, b); relErr(got, c.want) > 1e-13 {
			t.Errorf("%s: ∫Dit = %.15g, want %.15g (%.2g)", c.name, got, c.want, relErr(got, c.want))
		}
	}
}

// TestTabulated: interpolation rules (definitions in the doc comments).
func TestTabulated(t *testing.T) {
	d, _ := NewTabulatedDit([]float64{0, 0.1, 0.3}, []float64{1, 3, 0})
	for _, c := range [][2]float64{{-0.01, 0}, {0, 1}, {0.05, 2}, {0.1, 3}, {0.2, 1.5}, {0.3, 0}, {0.31, 0}} {
		if got := d.Density(c[0]); math.Abs(got-c[1]) > 1e-15 {
			t.Errorf("Dit(%g) = %g, want %g", c[0], got, c[1])
		}
	}
	s, _ := NewTabulatedSigma([]float64{-0.2, 0.2}, []float64{1e-14, 1e-16})
	for _, c := range [][2]float64{{-1, 1e-14}, {-0.2, 1e-14}, {0, 1e-15}, {0.1, 1e-15 * math.Sqrt(0.1)}, {0.2, 1e-16}, {1, 1e-16}} {
		if got := s.Sigma(c[0]); relErr(got, c[1]) > 1e-14 {
			t.Errorf("σ(%g) = %g, want %g", c[0], got, c[1])
		}
	}
	// The constructors copy their arguments.
	e := []float64{0, 1}
	v := []float64{1, 1}
	d2, _ := NewTabulatedDit(e, v)
	v[0] = 5
	if d2.Densities()[0] != 1 {
		t.Error("NewTabulatedDit does not copy")
	}
	// Nor can a caller change the table through what it hands out.
	d2.Densities()[0], d2.Energies()[1], d2.Breakpoints()[0] = 7, 9, -3
	if d2.Density(0) != 1 || d2.Breakpoints()[1] != 1 {
		t.Error("TabulatedDit hands out its internal slices")
	}
	s2, _ := NewTabulatedSigma([]float64{0, 1}, []float64{1e-16, 1e-15})
	s2.Values()[0], s2.Breakpoints()[0] = 1, 5
	if s2.Sigma(-1) != 1e-16 || s2.Energies()[0] != 0 {
		t.Error("TabulatedSigma hands out its internal slices")
	}
}

func TestTableValidation(t *testing.T) {
	nan := math.NaN()
	for name, c := range map[string][2][]float64{
		"one point":      {{0}, {1}},
		"lengths":        {{0, 1}, {1}},
		"not increasing": {{0, 0}, {1, 1}},
		"decreasing":     {{1, 0}, {1, 1}},
		"NaN energy":     {{0, nan}, {1, 1}},
		"negative":       {{0, 1}, {1, -1}},
		"NaN value":      {{0, 1}, {nan, 1}},
		"Inf value":      {{0, 1}, {1, math.Inf(1)}},
	} {
		if _, err := NewTabulatedDit(c[0], c[1]); err == nil || !strings.HasPrefix(err.Error(), "surface: ") {
			t.Errorf("Dit %s: %v", name, err)
		}
		if _, err := NewTabulatedSigma(c[0], c[1]); err == nil {
			t.Errorf("Sigma %s: no error", name)
		}
	}
	if _, err := NewTabulatedSigma([]float64{0, 1}, []float64{1e-16, 0}); err == nil {
		t.Error("zero cross section accepted")
	}
	if _, err := NewTabulatedDit([]float64{0, 1}, []float64{0, 0}); err != nil {
		t.Errorf("zero Dit rejected: %v", err)
	}
	// Malformed distributions evaluate to 0 (never NaN) and their Validate reports them, which
	// ExtendedSRH calls before integrating.
	if (TabulatedDit{}).Density(0) != 0 || (TabulatedSigma{}).Sigma(0) != 0 {
		t.Error("empty tables must give 0")
	}
	if (UShapedDit{}).Density(0) != 0 || (DitSum{nil}).Density(0) != 0 || (GaussianDit{}).Density(0) != 0 {
		t.Error("zero widths or nil members must give 0")
	}
	for name, v := range map[string]interface{ Validate() error }{
		"empty TabulatedDit": TabulatedDit{}, "empty TabulatedSigma": TabulatedSigma{},
		"zero UShapedDit": UShapedDit{}, "nil DitSum member": DitSum{nil}, "zero GaussianDit": GaussianDit{},
		"tail of 0.1 meV": UShapedDit{Mid: 1e10, Ec: 0.56, Ev: -0.56, WidthC: 1e-4, WidthV: 0.1},
	} {
		if v.Validate() == nil {
			t.Errorf("%s: Validate accepts it", name)
		}
	}
	// Far outside the gap the U shape stops growing instead of overflowing.
	u := UShapedDit{Mid: 1e10, TailC: 1e13, TailV: 1e13, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
	if d := u.Density(300); math.IsInf(d, 0) || d != u.Density(0.56+ditEdgeMargin) {
		t.Errorf("U-shaped Dit at 300 eV = %g", d)
	}
}

func TestDitStrings(t *testing.T) {
	for _, c := range []struct {
		s    interface{ String() string }
		want string
	}{
		{ConstantDit{1e11}, "ConstantDit(1e+11 cm^-2 eV^-1)"},
		{ConstantSigma(1e-16), "1e-16 cm^2"},
		{GaussianDit{Peak: 1e12, E0: 0.25, Width: 0.1}, "GaussianDit(1e+12 cm^-2 eV^-1 at 0.25 eV, width 0.1 eV)"},
		{UShapedDit{Mid: 1e10, TailC: 1e13, TailV: 1e13}, "UShapedDit(mid 1e+10, tails 1e+13/1e+13 cm^-2 eV^-1)"},
		{TabulatedDit{e: []float64{-0.5, 0.5}, d: []float64{1, 1}}, "TabulatedDit(2 points, -0.5..0.5 eV)"},
		{TabulatedDit{}, "TabulatedDit(empty)"},
		{TabulatedSigma{e: []float64{0, 1}}, "TabulatedSigma(2 points)"},
		{DitSum{ConstantDit{1}, nil}, "ConstantDit(1 cm^-2 eV^-1) + <nil>"},
	} {
		if got := c.s.String(); got != c.want {
			t.Errorf("String() = %q, want %q", got, c.want)
		}
	}
}

// TestDitOkMatchesValidate: the cheap checks that Density makes at every node accept exactly
// what Validate accepts (derived: they are the same conditions without the error).
func TestDitOkMatchesValidate(t *testing.T) {
	vals := []float64{0.1, 0, -1, math.NaN(), math.Inf(1), 1e-300, 1e300, 5e-4, 0.56, -0.56}
	for _, v := range vals {
		for k := 0; k < 7; k++ {
			u := UShapedDit{Mid: 1e10, TailC: 1e13, TailV: 1e13, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
			switch k {
			case 0:
				u.Mid = v
			case 1:
				u.TailC = v
			case 2:
				u.TailV = v
			case 3:
				u.Ec = v
			case 4:
				u.Ev = v
			case 5:
				u.WidthC = v
			case 6:
				u.WidthV = v
			}
			if u.ok() != (u.Validate() == nil) {
				t.Errorf("%+v: ok %v, Validate %v", u, u.ok(), u.Validate())
			}
			if !u.ok() && u.Density(0) != 0 {
				t.Errorf("%+v: malformed but Density %g", u, u.Density(0))
			}
		}
		for k := 0; k < 3; k++ {
			g := GaussianDit{Peak: 1e12, E0: 0.1, Width: 0.05}
			switch k {
			case 0:
				g.Peak = v
			case 1:
				g.E0 = v
			case 2:
				g.Width = v
			}
			if (g.Validate() != nil) && g.Density(0.1) != 0 {
				t.Errorf("%+v: malformed but Density %g", g, g.Density(0.1))
			}
			if g.Validate() == nil && g.Density(g.E0) != g.Peak {
				t.Errorf("%+v: valid but Density at the peak %g", g, g.Density(g.E0))
			}
		}
	}
}
