package lifetime_test

import (
	"bytes"
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/cell"
	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// TestModesAgree: the QSS analysis of a slow flash, the transient analysis of a free decay and
// the generalised analysis of both and of a fast flash read the same τeff at 5e14, 1e15 and
// 2e15 cm^-3 from traces of one sample (Nagel, Berge and Aberle 1999: the three are limits of
// one continuity equation), within 1 % of each other and of the model.
func TestModesAgree(t *testing.T) {
	b := wafer(t, 0, 2e15)
	s := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.Sum{recomb.NewIntrinsic(), recomb.SRH{Level: recomb.FromEi(0), TauN0: 2e-3, TauP0: 2e-3}},
		Front: surface.ConstantJ0s{J0s: 20e-15}, Rear: surface.ConstantSeff{S: 5}}
	qss, dark, flash := qssTrace(t, s, 2000), transientTrace(t, s, 5000), flashTrace(t, s, 7500)
	lit := dark // the decay with its (dark) illumination recorded, for the generalised analysis
	lit.Illumination, lit.Unit = make([]float64, len(dark.Time)), lifetime.Suns
	results := map[string]*lifetime.Result{
		"QSS":                     analyse(t, analysis(b, lifetime.QSS), qss),
		"transient":               analyse(t, analysis(b, lifetime.Transient), dark),
		"generalised, slow flash": analyse(t, analysis(b, lifetime.Generalised), qss),
		"generalised, decay":      analyse(t, analysis(b, lifetime.Generalised), lit),
		"generalised, fast flash": analyse(t, analysis(b, lifetime.Generalised), flash),
	}
	for _, dn := range []float64{5e14, 1e15, 2e15} {
		want := mustLifetime(t, s, dn)
		for name, r := range results {
			got, err := r.LifetimeAt(dn)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			if relErr(got, want) > 0.01 {
				t.Errorf("%s at %g cm^-3: τeff %.5g s, model %.5g s", name, dn, got, want)
			}
		}
	}
}

// TestImpliedVocFromTrace: the iVoc of every analysed point is cell.ImpliedVoc at its Δn (to
// the 1e-7 of the wafer table); iVoc at one sun read from a slow flash (generalised analysis)
// matches the forward model's steady state, and so does the implied FF (definition; the
// local fits of ImpliedVoc and MaxPower are exact for a straight line in ln suns and an
// exponential current, so the tolerances, 0.05 mV and 2e-4, cover their second-order terms).
func TestImpliedVocFromTrace(t *testing.T) {
	b := wafer(t, 0, 1.5e16)
	s := j0sSample(b, 15e-15)
	r := analyse(t, analysis(b, lifetime.Generalised), qssTrace(t, s, 3000))
	for i, d := range r.Dn {
		want, err := cell.ImpliedVoc(b, d)
		if err != nil {
			t.Fatal(err)
		}
		if relErr(r.IVoc[i], want) > 1e-6 {
			t.Fatalf("point %d: iVoc %.9f V, cell.ImpliedVoc %.9f V", i, r.IVoc[i], want)
		}
	}
	got, err := r.ImpliedVoc(1)
	if err != nil {
		t.Fatal(err)
	}
	want, err := s.ImpliedVoc(1, optics)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(got-want) > 5e-5 {
		t.Errorf("iVoc at one sun: %.6f V from the trace, %.6f V from the model", got, want)
	}
	jv, err := r.ImpliedJV()
	if err != nil {
		t.Fatal(err)
	}
	mt, err := jv.MaxPower()
	if err != nil {
		t.Fatal(err)
	}
	fwd, err := s.ImpliedJV(optics, 200)
	if err != nil {
		t.Fatal(err)
	}
	mf, err := fwd.MaxPower()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(mt.FF-mf.FF) > 2e-4 {
		t.Errorf("implied FF %.5f from the trace, %.5f from the model", mt.FF, mf.FF)
	}
}

// TestExcessFromConductance: the inversion returns the Δn that Conductance maps to the given
// photoconductance (round trip), and the analysis, through its table, agrees with it.
func TestExcessFromConductance(t *testing.T) {
	for _, b := range []*recomb.Bulk{wafer(t, 1e15, 0), wafer(t, 0, 1e17)} {
		for _, dn := range []float64{1e9, 1e12, 1e15, 3e16, 1e18, 1e20} {
			c, err := lifetime.Conductance(b, width, dn)
			if err != nil {
				t.Fatal(err)
			}
			got, err := lifetime.ExcessFromConductance(b, width, c)
			if err != nil {
				t.Fatal(err)
			}
			if relErr(got, dn) > 1e-12 {
				t.Errorf("Δn %g: round trip %g", dn, got)
			}
		}
	}
	b := wafer(t, 1e15, 0)
	r := analyse(t, analysis(b, lifetime.Transient), transientTrace(t, j0sSample(b, 5e-15), 2000))
	tr := transientTrace(t, j0sSample(b, 5e-15), 2000)
	for i, d := range r.Dn {
		want, err := lifetime.ExcessFromConductance(b, width, tr.Conductance[r.Index[i]])
		if err != nil {
			t.Fatal(err)
		}
		if relErr(d, want) > 1e-6 {
			t.Fatalf("point %d: Δn %g from the table, %g directly", i, d, want)
		}
	}
	if d, err := lifetime.ExcessFromConductance(b, width, 0); d != 0 || err != nil {
		t.Errorf("zero photoconductance: %g, %v", d, err)
	}
	for _, c := range []float64{-1e-3, math.NaN(), math.Inf(1)} {
		if _, err := lifetime.ExcessFromConductance(b, width, c); err == nil {
			t.Errorf("photoconductance %g accepted", c)
		}
	}
	if _, err := lifetime.ExcessFromConductance(b, width, 1e6); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("1e6 S: %v, want ErrOutOfRange", err)
	}
	if _, err := lifetime.ExcessFromConductance(nil, width, 1e-3); err == nil {
		t.Errorf("nil wafer accepted")
	}
}

// TestSeff: for a sample of known Seff and bulk the analysis returns the Seff (exact inverse
// of Sproul's relation), and the infinite-bulk bound lies above it.
func TestSeff(t *testing.T) {
	b := wafer(t, 0, 1e16)
	s := lifetime.Sample{Wafer: b, W: width, Bulk: recomb.NewIntrinsic(), Front: surface.ConstantSeff{S: 20}}
	r := analyse(t, analysis(b, lifetime.Transient), transientTrace(t, s, 4000))
	c, err := r.Seff(recomb.NewIntrinsic())
	if err != nil {
		t.Fatal(err)
	}
	up, err := r.Seff(recomb.Sum{})
	if err != nil {
		t.Fatal(err)
	}
	for i, d := range c.Dn {
		if decade(d) && relErr(c.Seff[i], 20) > 0.01 {
			t.Errorf("Δn %g: Seff %g cm/s, want 20", d, c.Seff[i])
		}
	}
	if len(up.Seff) != len(r.Dn) {
		t.Fatalf("upper bound for %d of %d points (%v)", len(up.Seff), len(r.Dn), up.Excluded)
	}
	for i, k := range c.Index {
		if !(up.Seff[k] > c.Seff[i]) {
			t.Fatalf("point %d: upper bound %g below %g cm/s", k, up.Seff[k], c.Seff[i])
		}
	}
	// SeffFromLifetime inverts surface.EffectiveLifetime (symmetric) exactly.
	for _, sv := range []float64{0.1, 10, 1e3, 1e5} {
		tau, err := surface.EffectiveLifetime(2e-3, width, 25, sv, sv)
		if err != nil {
			t.Fatal(err)
		}
		got, err := lifetime.SeffFromLifetime(tau, 2e-3, width, 25)
		if err != nil || relErr(got, sv) > 1e-9 {
			t.Errorf("S = %g cm/s: inverted %g, %v", sv, got, err)
		}
	}
	if _, err := lifetime.SeffFromLifetime(3e-3, 2e-3, width, 25); err == nil {
		t.Errorf("τeff above τbulk accepted")
	}
	if _, err := lifetime.SeffFromLifetime(1e-7, math.Inf(1), width, 25); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("below the diffusion limit: %v", err)
	}
}

// TestAnalyzeTable: a Result written as a table and read back gives the same J0s.
func TestAnalyzeTable(t *testing.T) {
	b := wafer(t, 1e15, 0)
	a := analysis(b, lifetime.Transient)
	r := analyse(t, a, transientTrace(t, j0sSample(b, 20e-15), 5000))
	var buf bytes.Buffer
	if err := lifetime.WriteTable(&buf, lifetime.Table{Dn: r.Dn, TauEff: r.TauEff, Comments: []string{"round trip"}}); err != nil {
		t.Fatal(err)
	}
	tb, err := lifetime.ReadTable(&buf)
	if err != nil {
		t.Fatal(err)
	}
	rt, err := a.AnalyzeTable(tb)
	if err != nil {
		t.Fatal(err)
	}
	f1, err := r.J0s(lifetime.J0sOptions{})
	if err != nil {
		t.Fatal(err)
	}
	f2, err := rt.J0s(lifetime.J0sOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if relErr(f2.J0s, f1.J0s) > 1e-12 || relErr(rt.IVoc[7], r.IVoc[7]) > 1e-12 {
		t.Errorf("table: J0s %g, iVoc %g; trace: %g, %g", f2.J0s, rt.IVoc[7], f1.J0s, r.IVoc[7])
	}
}

// TestNoisyTrace: with 0.3 % Gaussian noise on the photoconductance plus a noise floor of 1e-4
// of its largest value (invented levels), the adaptive smoothing keeps the transient J0s within
// 3 % and the lifetime read at 5e14, 1e15 and 2e15 cm^-3 (LifetimeAt, a local fit over
// ±0.1 decade) within 1 %.
func TestNoisyTrace(t *testing.T) {
	b := wafer(t, 1e15, 0)
	s := j0sSample(b, 20e-15)
	tr := transientTrace(t, s, 5000)
	rng := rand.New(rand.NewPCG(11, 1))
	floor := 1e-4 * tr.Conductance[0]
	for i, c := range tr.Conductance {
		tr.Conductance[i] = c*(1+0.003*rng.NormFloat64()) + floor*rng.NormFloat64()
	}
	r := analyse(t, analysis(b, lifetime.Transient), tr)
	f, err := r.J0s(lifetime.J0sOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if relErr(f.PerSide, 20e-15) > 0.03 {
		t.Errorf("J0s %.4g ± %.2g A/cm^2 per side, want 2e-14", f.PerSide, f.J0sErr/2)
	}
	for _, d := range []float64{5e14, 1e15, 2e15} {
		got, err := r.LifetimeAt(d)
		if err != nil {
			t.Fatal(err)
		}
		if want := mustLifetime(t, s, d); relErr(got, want) > 0.01 {
			t.Errorf("τeff at %g cm^-3: %.5g s, model %.5g s", d, got, want)
		}
	}
}

// TestWarnings: an apparent lifetime ∝ 1/Δn at low injection (the signature of trapping), a
// fitting window with few points and points outside the analysis range are reported.
func TestWarnings(t *testing.T) {
	b := wafer(t, 0, 1e16)
	a := analysis(b, lifetime.QSS)
	var tb lifetime.Table
	for x := 11.0; x <= 16.5; x += 0.05 {
		d := math.Pow(10, x)
		tb.Dn = append(tb.Dn, d)
		tb.TauEff = append(tb.TauEff, 1e-5*(1+1e13/d)) // invented: trapping below 1e13 cm^-3
	}
	tb.Dn = append(tb.Dn, 1e9, 1e19, 1e15)
	tb.TauEff = append(tb.TauEff, 1e-4, 1e-6, 1) // outside the range; 1 s, above the intrinsic limit
	r, err := a.AnalyzeTable(tb)
	if err != nil {
		t.Fatal(err)
	}
	kinds := map[lifetime.WarningKind]bool{}
	for _, w := range r.Warnings {
		kinds[w.Kind] = true
	}
	if !kinds[lifetime.RisingAtLowInjection] || !kinds[lifetime.OutsideRange] || !kinds[lifetime.AboveIntrinsicLimit] {
		t.Errorf("warnings %v, want rising-at-low-injection, outside-range and above-intrinsic", r.Warnings)
	}
	if n := len(r.Excluded); n != 2 || r.Excluded[0].Count != 1 {
		t.Errorf("exclusions %v, want one below and one above the range", r.Excluded)
	}
	f, err := r.J0s(lifetime.J0sOptions{DnMin: 2e15, DnMax: 3.3e15})
	if err != nil {
		t.Fatal(err)
	}
	few := false
	for _, w := range f.Warnings {
		few = few || w.Kind == lifetime.FewFitPoints
	}
	if !few {
		t.Errorf("J0s fit on %d points: warnings %v, want few-points", f.N, f.Warnings)
	}
	// A lifetime flat in injection raises no low-injection warning.
	flat := lifetime.Table{Dn: tb.Dn[:100], TauEff: make([]float64, 100)}
	for i := range flat.TauEff {
		flat.TauEff[i] = 1e-4
	}
	r, err = a.AnalyzeTable(flat)
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Warnings) != 0 {
		t.Errorf("flat lifetime: warnings %v", r.Warnings)
	}
}

// TestAnalyzeBadInput: invalid analyses and traces give errors naming the field, point or
// line; nothing is silently dropped.
func TestAnalyzeBadInput(t *testing.T) {
	b := wafer(t, 1e15, 0)
	good := qssTrace(t, j0sSample(b, 10e-15), 200)
	mod := func(f func(*lifetime.Trace)) lifetime.Trace {
		tr := lifetime.Trace{Time: append([]float64(nil), good.Time...), Conductance: append([]float64(nil), good.Conductance...),
			Illumination: append([]float64(nil), good.Illumination...), Unit: good.Unit}
		f(&tr)
		return tr
	}
	a := analysis(b, lifetime.QSS)
	for _, c := range []struct {
		name string
		a    lifetime.Analysis
		tr   lifetime.Trace
		want string
	}{
		{"zero analysis", lifetime.Analysis{}, good, "wafer"},
		{"zero thickness", func() lifetime.Analysis { x := a; x.W = 0; return x }(), good, "thickness"},
		{"no mode", func() lifetime.Analysis { x := a; x.Mode = 0; return x }(), good, "Analysis.Mode"},
		{"no optics", func() lifetime.Analysis { x := a; x.Optics = lifetime.Optics{}; return x }(), good, "Optics.FluxPerSun"},
		{"bad range", func() lifetime.Analysis { x := a; x.DnMin = 1e16; x.DnMax = 1e15; return x }(), good, "DnMin"},
		{"bad half-width", func() lifetime.Analysis { x := a; x.Mode = lifetime.Generalised; x.HalfWidth = 1; return x }(), good, "HalfWidth"},
		{"empty", a, lifetime.Trace{}, "0 points"},
		{"short", a, mod(func(tr *lifetime.Trace) {
			tr.Time, tr.Conductance, tr.Illumination = tr.Time[:4], tr.Conductance[:4], tr.Illumination[:4]
		}), "4 points"},
		{"lengths", a, mod(func(tr *lifetime.Trace) { tr.Conductance = tr.Conductance[:10] }), "photoconductances"},
		{"time order", a, mod(func(tr *lifetime.Trace) { tr.Time[50] = tr.Time[49] }), "point 50"},
		{"time NaN", a, mod(func(tr *lifetime.Trace) { tr.Time[3] = math.NaN() }), "point 3"},
		{"conductance NaN", a, mod(func(tr *lifetime.Trace) { tr.Conductance[7] = math.NaN() }), "photoconductance at point 7"},
		{"illumination negative", a, mod(func(tr *lifetime.Trace) { tr.Illumination[9] = -1 }), "illumination at point 9"},
		{"no illumination", a, mod(func(tr *lifetime.Trace) { tr.Illumination = nil }), "illumination column"},
		{"dark QSS", a, mod(func(tr *lifetime.Trace) { clear(tr.Illumination) }), "illumination is zero"},
		{"all negative", a, mod(func(tr *lifetime.Trace) {
			for i := range tr.Conductance {
				tr.Conductance[i] = -1e-3
			}
		}), "photoconductance > 0"},
	} {
		_, err := c.a.Analyze(c.tr)
		if err == nil || !strings.Contains(err.Error(), c.want) || !strings.HasPrefix(err.Error(), "lifetime: ") {
			t.Errorf("%s: error %v, want one naming %q", c.name, err, c.want)
		}
	}
	// Negative photoconductance and dark points are excluded and counted, not dropped silently.
	tr := mod(func(tr *lifetime.Trace) {
		tr.Conductance[190], tr.Conductance[191] = -1e-6, 0
		tr.Illumination[10] = 0
	})
	r, err := a.Analyze(tr)
	if err != nil {
		t.Fatal(err)
	}
	counts := map[string]int{}
	for _, e := range r.Excluded {
		counts[e.Reason] = e.Count
	}
	if len(r.Dn)+len(counts) > len(tr.Time) || counts["photoconductance <= 0"] != 2 || len(r.Dn)+sum(counts) != len(tr.Time) {
		t.Errorf("kept %d of %d points, exclusions %v", len(r.Dn), len(tr.Time), r.Excluded)
	}
	var zero lifetime.Result
	if _, err := zero.J0s(lifetime.J0sOptions{}); err == nil {
		t.Errorf("zero Result: J0s accepted")
	}
	if _, err := zero.ImpliedVoc(1); err == nil {
		t.Errorf("zero Result: ImpliedVoc accepted")
	}
	if _, err := a.AnalyzeTable(lifetime.Table{Dn: []float64{1e15}, TauEff: []float64{0}}); err == nil || !strings.Contains(err.Error(), "τeff at point 0") {
		t.Errorf("zero τeff in a table: %v", err)
	}
	noIntr := a
	noIntr.Intrinsic = nil
	r, err = noIntr.Analyze(good)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := r.J0s(lifetime.J0sOptions{}); err == nil || !strings.Contains(err.Error(), "Intrinsic") {
		t.Errorf("J0s without Intrinsic: %v", err)
	}
}

func sum(m map[string]int) int {
	n := 0
	for _, v := range m {
		n += v
	}
	return n
}

// TestDemoTrial: every invented demo file of testdata/lifetime reads, says it is invented, and
// analyses without error; the decay and the flash of sample A3 agree on τeff at 1e15 cm^-3 and
// on iVoc at one sun (two analyses of one sample, within the invented noise: 1 %, 0.5 mV).
func TestDemoTrial(t *testing.T) {
	p := wafer(t, 0, 1.5e16)
	a := lifetime.Analysis{Wafer: p, W: width, Mode: lifetime.Generalised,
		Optics: lifetime.Optics{FluxPerSun: lifetime.OneSunFlux, Absorbed: 0.92}, Intrinsic: recomb.NewIntrinsic()}
	results := map[string]*lifetime.Result{}
	for _, name := range []string{"A1", "A2", "A3", "A4", "A3-decay"} {
		tr, err := lifetime.ReadTraceFile("../../testdata/lifetime/trial-" + name + ".csv")
		if err != nil {
			t.Fatal(err)
		}
		if len(tr.Comments) == 0 || !strings.HasPrefix(tr.Comments[0], "INVENTED") {
			t.Errorf("%s: first comment %q does not say the data are invented", name, tr.Comments)
		}
		x := a
		if name == "A3-decay" {
			x.Mode = lifetime.Transient
		}
		r, err := x.Analyze(tr)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		results[name] = r
	}
	tb, err := lifetime.ReadTableFile("../../testdata/lifetime/trial-A4-table.csv")
	if err != nil {
		t.Fatal(err)
	}
	if _, err := a.AnalyzeTable(tb); err != nil {
		t.Fatal(err)
	}
	t1, err := results["A3"].LifetimeAt(1e15)
	if err != nil {
		t.Fatal(err)
	}
	t2, err := results["A3-decay"].LifetimeAt(1e15)
	if err != nil {
		t.Fatal(err)
	}
	v1, err := results["A3"].ImpliedVoc(1)
	if err != nil {
		t.Fatal(err)
	}
	v2, err := results["A3-decay"].ImpliedVoc(1)
	if err != nil {
		t.Fatal(err)
	}
	if relErr(t1, t2) > 0.01 || math.Abs(v1-v2) > 5e-4 {
		t.Errorf("A3: flash τeff %.4g s, iVoc %.5f V; decay %.4g s, %.5f V", t1, v1, t2, v2)
	}
}

// TestStrings: the names of modes, units, exclusions and warnings.
func TestStrings(t *testing.T) {
	for _, c := range []struct{ got, want string }{
		{lifetime.QSS.String(), "QSS"},
		{lifetime.Transient.String(), "transient"},
		{lifetime.Generalised.String(), "generalised"},
		{lifetime.Mode(9).String(), "Mode(9)"},
		{lifetime.Suns.String(), "suns"},
		{lifetime.PhotonFlux.String(), "cm^-2 s^-1"},
		{lifetime.LightUnit(0).String(), "LightUnit(0)"},
		{lifetime.Exclusion{Reason: "r", Count: 2, First: 5}.String(), "2 point(s) from index 5: r"},
		{lifetime.Exclusion{Reason: "r", Count: 1, First: 5, Line: 9}.String(), "1 point(s) from line 9: r"},
		{lifetime.Warning{Message: "m"}.String(), "m"},
	} {
		if c.got != c.want {
			t.Errorf("%q, want %q", c.got, c.want)
		}
	}
}
