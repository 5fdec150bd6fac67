package lifetime_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/cell"
	"github.com/pvrec/pvrec/pvrec/internal/reftable"
	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// ambipolar returns the ambipolar diffusivity of wafer b at Δn (silicon.AmbipolarDiffusivity
// with the material's mobility), cm²/s.
func ambipolar(t *testing.T, b *recomb.Bulk, dn float64) float64 {
	t.Helper()
	st, err := b.State(dn)
	if err != nil {
		t.Fatal(err)
	}
	m := b.Material()
	dnD, dpD, err := silicon.Diffusivities(m, m.Models().Mobility, st.N, st.P, st.NdIon, st.NaIon)
	if err != nil {
		t.Fatal(err)
	}
	d, err := silicon.AmbipolarDiffusivity(dnD, dpD, st.N, st.P)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

// TestSampleSmallS compares the exact fundamental mode (Lifetime) with the J0s form
// (LifetimeJ0s, uniform Δn) for J0s surfaces. For small h = S W/D the surface recombination
// rate of the uniform form exceeds the exact one by h/6 + O(h²) (expansion of the
// fundamental-mode equation of A. B. Sproul, J. Appl. Phys. 76, 2851 (1994), as in
// surface.LifetimeLowS); the test checks the first-order term to within h².
func TestSampleSmallS(t *testing.T) {
	for _, c := range []struct{ nd, na, j0s, dn float64 }{
		{1e15, 0, 1e-15, 1e15},     // h = 1.5e-4
		{1e15, 0, 10e-15, 1e16},    // h = 0.007
		{0, 1.5e16, 30e-15, 1e15},  // p-type, h = 0.02
		{0, 1.5e16, 100e-15, 1e17}, // h = 0.7
	} {
		b := wafer(t, c.nd, c.na)
		s := j0sSample(b, c.j0s)
		exact := mustLifetime(t, s, c.dn)
		uniform, err := s.LifetimeJ0s(c.dn)
		if err != nil {
			t.Fatal(err)
		}
		st, err := b.State(c.dn)
		if err != nil {
			t.Fatal(err)
		}
		tb, err := recomb.Lifetime(recomb.NewIntrinsic(), st)
		if err != nil {
			t.Fatal(err)
		}
		seff, err := surface.SeffFromJ0s(c.j0s, st)
		if err != nil {
			t.Fatal(err)
		}
		h := seff * width / ambipolar(t, b, c.dn)
		ratio := (1/uniform - 1/tb) / (1/exact - 1/tb)
		if d := ratio - 1 - h/6; math.Abs(d) > h*h {
			t.Errorf("Nd %g, Na %g, J0s %g, Δn %g: rate ratio − 1 = %.4g, want h/6 = %.4g within h² = %.2g", c.nd, c.na, c.j0s, c.dn, ratio-1, h/6, h*h)
		}
		if math.Abs(2*seff/width-(1/uniform-1/tb)) > 1e-12*(1/uniform) {
			t.Errorf("J0s form is not 1/τb + 2 Seff/W")
		}
	}
}

// TestSampleDiffusionLimit: with ideal sinks on both sides and no bulk recombination τeff
// tends to W²/(π² D) (Sproul 1994; surface.LifetimeDiffusionLimit); for h = S W/D the
// surface lifetime exceeds the limit by about 4/h (expansion of tan(αW/2) = S/(αD) near π).
func TestSampleDiffusionLimit(t *testing.T) {
	b := wafer(t, 1e15, 0)
	for _, dn := range []float64{1e13, 1e15, 1e17} {
		s := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{}, Front: surface.ConstantSeff{S: 1e9}}
		got := mustLifetime(t, s, dn)
		d := ambipolar(t, b, dn)
		lim, err := surface.LifetimeDiffusionLimit(width, d)
		if err != nil {
			t.Fatal(err)
		}
		h := 1e9 * width / d
		if r := got/lim - 1; r < 0 || r > 5/h {
			t.Errorf("Δn %g: τeff/limit − 1 = %.3g, want in [0, 5/h = %.2g]", dn, r, 5/h)
		}
	}
}

// TestSampleAsymmetric: Rear nil is the symmetric sample; a wafer with one passivated
// (S = 0) surface is half of a symmetric wafer of twice the thickness (mirror symmetry), for
// which Sproul's approximation W/(2S) + W²/(π² D) holds within 5.06 % (Sproul 1994, see
// surface.LifetimeSproul), and the sample's lifetime does not depend on which side is which.
func TestSampleAsymmetric(t *testing.T) {
	b := wafer(t, 0, 1e16)
	front := surface.ConstantSeff{S: 300}
	sym := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{}, Front: front}
	both := sym
	both.Rear = front
	if a, c := mustLifetime(t, sym, 1e15), mustLifetime(t, both, 1e15); a != c {
		t.Errorf("Rear nil: %g s, Rear = Front: %g s", a, c)
	}
	one := sym
	one.Rear = surface.ConstantSeff{S: 0}
	flipped := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{}, Front: surface.ConstantSeff{S: 0}, Rear: front}
	got := mustLifetime(t, one, 1e15)
	if f := mustLifetime(t, flipped, 1e15); relErr(f, got) > 1e-13 {
		t.Errorf("front/rear swapped: %g s vs %g s", f, got)
	}
	approx, err := surface.LifetimeSproul(2*width, ambipolar(t, b, 1e15), front.S)
	if err != nil {
		t.Fatal(err)
	}
	if relErr(got, approx) > 0.0506 {
		t.Errorf("one-sided: %g s, Sproul's approximation for 2W: %g s", got, approx)
	}
}

// TestSampleSteadyState: the steady state balances generation (definition), its iVoc is
// cell.ImpliedVoc at that Δn, and iVoc rises with intensity (property).
func TestSampleSteadyState(t *testing.T) {
	b := wafer(t, 0, 1.5e16)
	s := j0sSample(b, 10e-15)
	prev := 0.0
	for _, suns := range []float64{0.01, 0.1, 1, 10} {
		dn, err := s.SteadyStateSuns(suns, optics)
		if err != nil {
			t.Fatal(err)
		}
		g, err := optics.Generation(suns, width)
		if err != nil {
			t.Fatal(err)
		}
		if r := dn / mustLifetime(t, s, dn); relErr(r, g) > 1e-10 {
			t.Errorf("%g suns: Δn/τ = %g, G = %g", suns, r, g)
		}
		v, err := s.ImpliedVoc(suns, optics)
		if err != nil {
			t.Fatal(err)
		}
		want, err := cell.ImpliedVoc(b, dn)
		if err != nil {
			t.Fatal(err)
		}
		if v != want || !(v > prev) {
			t.Errorf("%g suns: iVoc %g V, cell.ImpliedVoc %g V, previous %g V", suns, v, want, prev)
		}
		prev = v
	}
	if v, err := s.ImpliedVoc(0, optics); v != 0 || err != nil {
		t.Errorf("0 suns: %g, %v", v, err)
	}
}

// TestMaxPowerIdealDiode checks JV.MaxPower on sampled ideal-diode curves against the
// Lambert-W solution of testdata/reference/lifetime_ff.csv (generated with mpmath; the
// maximum-power condition of the ideal diode of W. Shockley, Bell Syst. Tech. J. 28, 435
// (1949)). The curves are sampled every 0.05 kT/q (1.3 mV). The local diode fit of MaxPower
// is exact for J0 exp(qV/kT) and misses the −J0 of the diode law, a relative change of
// exp(−vm) in the recombination current: the tolerance is 1e-6 plus 0.05 exp(−vm) (2e-5 at
// voc = 10 kT/q, negligible above).
func TestMaxPowerIdealDiode(t *testing.T) {
	const vt = 0.025852 // V; the fill factor of the ideal diode depends on voc/vt only
	for _, row := range reftable.Load(t, "lifetime_ff").Rows {
		voc, vm, ff := reftable.Float(t, row[0]), reftable.Float(t, row[1]), reftable.Float(t, row[2])
		jsc := 0.04
		j0 := jsc / math.Expm1(voc)
		var c lifetime.JV
		for v := 0.0; v <= voc; v += 0.05 {
			c.V = append(c.V, v*vt)
			c.J = append(c.J, jsc-j0*math.Expm1(v))
		}
		c.Jsc, c.Voc = jsc, voc*vt
		mp, err := c.MaxPower()
		if err != nil {
			t.Fatal(err)
		}
		if tol := 1e-6 + 0.05*math.Exp(-vm); math.Abs(mp.FF-ff) > tol || math.Abs(mp.V/vt-vm) > 1e-3 {
			t.Errorf("voc %g kT/q: FF %.8f at %.5f kT/q, want %.8f at %.5f", voc, mp.FF, mp.V/vt, ff, vm)
		}
	}
}

// TestSampleImpliedFF: a sample whose only recombination is J0s surfaces, on a material
// without band-gap narrowing and with Boltzmann statistics, is an ideal diode with
// J0 = J0s,f + J0s,r exactly in the uniform-Δn form (J_rec = q W Δn (Sf + Sr)/W =
// 2 J0s (n p − ni²)/ni²; definition), so its implied Voc and FF are those of the ideal diode,
// computed here by MaxPower on the ideal-diode curve (checked against the reference table
// above). The exact fundamental mode lowers the recombination current by h/6 + O(h²) (h = S W/D,
// see TestSampleSmallS), so Voc rises by h/6 kT/q with h at open circuit (0.01 here), checked
// to within h²; h falls to half of it at the maximum power point, and FF, through the
// ideality this spread implies, moves by about 0.004 per kT/q · voc · 2e-4 ≈ 3e-5: the
// tolerance on FF is 1e-4.
func TestSampleImpliedFF(t *testing.T) {
	ms := silicon.DefaultModelSet()
	ms.Statistics = silicon.Boltzmann
	ms.BGN = silicon.NoNarrowing{}
	ms.Intrinsic = silicon.NewFixedNi()
	m, err := ms.At(300)
	if err != nil {
		t.Fatal(err)
	}
	b, err := recomb.NewBulk(m, 1e16, 0)
	if err != nil {
		t.Fatal(err)
	}
	const j0s = 5e-15
	s := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{}, Front: surface.ConstantJ0s{J0s: j0s}}
	c, err := s.ImpliedJV(optics, 400)
	if err != nil {
		t.Fatal(err)
	}
	got, err := c.MaxPower()
	if err != nil {
		t.Fatal(err)
	}
	jph, err := optics.Photocurrent()
	if err != nil {
		t.Fatal(err)
	}
	vt := m.Vt()
	ideal := lifetime.JV{Jsc: jph, Voc: vt * math.Log1p(jph/(2*j0s))}
	for v := 0.0; v <= ideal.Voc; v += 0.001 {
		ideal.V = append(ideal.V, v)
		ideal.J = append(ideal.J, jph-2*j0s*math.Expm1(v/vt))
	}
	want, err := ideal.MaxPower()
	if err != nil {
		t.Fatal(err)
	}
	dn, err := s.SteadyStateSuns(1, optics)
	if err != nil {
		t.Fatal(err)
	}
	st, err := b.State(dn)
	if err != nil {
		t.Fatal(err)
	}
	seff, err := surface.SeffFromJ0s(j0s, st)
	if err != nil {
		t.Fatal(err)
	}
	h := seff * width / ambipolar(t, b, dn)
	if d := (c.Voc - ideal.Voc) / vt; math.Abs(d-h/6) > h*h {
		t.Errorf("implied Voc %.6f V, ideal diode %.6f V: %.3g kT/q above it, want h/6 = %.3g", c.Voc, ideal.Voc, d, h/6)
	}
	if math.Abs(got.FF-want.FF) > 1e-4 {
		t.Errorf("implied FF %.6f, ideal diode %.6f", got.FF, want.FF)
	}
}

// TestSampleErrors: the zero Sample and missing or invalid fields give errors naming the field.
func TestSampleErrors(t *testing.T) {
	b := wafer(t, 1e15, 0)
	good := j0sSample(b, 1e-14)
	for _, c := range []struct {
		name string
		s    lifetime.Sample
		dn   float64
		want string
	}{
		{"zero", lifetime.Sample{}, 1e15, "Sample.Wafer"},
		{"no bulk", lifetime.Sample{Wafer: b, W: width, Front: good.Front}, 1e15, "Sample.Bulk"},
		{"no front", lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{}}, 1e15, "Sample.Front"},
		{"zero thickness", lifetime.Sample{Wafer: b, Bulk: recomb.Sum{}, Front: good.Front}, 1e15, "Sample.W"},
		{"dn 0", good, 0, "Δn"},
		{"dn NaN", good, math.NaN(), "Δn"},
		{"dn too high", good, 1e22, "Δn"},
	} {
		_, err := c.s.Lifetime(c.dn)
		if err == nil || !strings.Contains(err.Error(), c.want) || !strings.HasPrefix(err.Error(), "lifetime: ") {
			t.Errorf("%s: Lifetime error %v, want one naming %q", c.name, err, c.want)
		}
		if _, err := c.s.LifetimeJ0s(c.dn); err == nil {
			t.Errorf("%s: LifetimeJ0s accepted", c.name)
		}
	}
	if _, err := good.Lifetime(1e22); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Δn above recomb.MaxExcess: %v, want ErrOutOfRange", err)
	}
	if _, err := good.SteadyStateSuns(1, lifetime.Optics{}); err == nil || !strings.Contains(err.Error(), "Optics.FluxPerSun") {
		t.Errorf("zero Optics: %v", err)
	}
	if _, err := good.SteadyStateSuns(1, lifetime.Optics{FluxPerSun: 1e17, Absorbed: 1.5}); err == nil || !strings.Contains(err.Error(), "Optics.Absorbed") {
		t.Errorf("absorbed fraction 1.5: %v", err)
	}
	if _, err := good.ImpliedJV(optics, 3); err == nil {
		t.Errorf("ImpliedJV with 3 points accepted")
	}
	for _, c := range []lifetime.JV{
		{},
		{V: []float64{0, 1}, J: []float64{1, 0}, Jsc: 1, Voc: 1},
		{V: []float64{0, 0.5, 1}, J: []float64{1, 0.9, 0}, Jsc: 0, Voc: 1},
		{V: []float64{0, 0.5, math.NaN()}, J: []float64{1, 0.9, 0}, Jsc: 1, Voc: 1},
		{V: []float64{0, 0.5, 1}, J: []float64{-1, -1, -1}, Jsc: 1, Voc: 1},
		{V: []float64{0, 0.5, 1}, J: []float64{1, 1, 1}, Jsc: 1, Voc: 1}, // maximum at the end
	} {
		if _, err := c.MaxPower(); err == nil {
			t.Errorf("MaxPower(%v) accepted", c)
		}
	}
}
