package j0

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/internal/reftable"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

func relDiff(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

func mustModels(t testing.TB, f func() (Models, error)) Models {
	t.Helper()
	m, err := f()
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func defaultModels() (Models, error) { return DefaultModels(300) }

// emitter returns an erfc phosphorus emitter on a boron wafer.
func emitter(ns, l, nb float64) profile.Profile {
	return profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: ns, Length: l}, profile.Uniform{Dopant: silicon.Acceptor, N: nb}}
}

// TestUniformClosedForm checks Solve on a uniformly doped n-type region of width W against
// the textbook J0 of a uniform quasi-neutral region with surface recombination velocity S,
//
//	J0 = q (ni²/N) (D/L) (S L/D + tanh(W/L)) / (1 + (S L/D) tanh(W/L)),   L = sqrt(D τ),
//
// (M. A. Green, Solar Cells: Operating Principles, Technology and System Applications,
// Prentice-Hall 1982; S. M. Sze and K. K. Ng, Physics of Semiconductor Devices, 3rd ed.,
// Wiley 2007), for S from 1 to 1e7 cm/s and W/L from 0.01 to 10, with hand-calculation
// models: fixed ni, no narrowing, Boltzmann statistics, a constant mobility and SRH
// recombination through a mid-gap level, whose low-injection lifetime is
// τ = τ0 (n0 + p0 + 2 ni)/n0 (Shockley–Read–Hall with τn0 = τp0 = τ0, n1 = p1 = ni). The
// issue asks for 0.1 %; the scheme is exact for uniform coefficients, so the tolerance here
// is 1e-9 (rounding in the recursion and in the closed form).
func TestUniformClosedForm(t *testing.T) {
	base := mustModels(t, SimpleModels)
	mat := base.Material
	const nd, w = 1e17, 10e-4 // cm^-3, cm
	mob := silicon.ConstantMobility{Electron: 800, Hole: 300}
	eq, err := mat.Equilibrium(nd, 0)
	if err != nil {
		t.Fatal(err)
	}
	d := mob.Hole * mat.Vt()
	for _, wl := range []float64{0.01, 0.1, 0.3, 1, 3, 10} {
		l := w / wl
		tau := l * l / d
		ni := mat.Ni()
		tau0 := tau * eq.N0 / (eq.N0 + eq.P0 + 2*ni) // so that the SRH lifetime is tau
		m := base
		m.Mobility = mob
		m.Auger = nil
		m.SRH = recomb.SRH{Level: recomb.FromEi(0), TauN0: tau0, TauP0: tau0}
		for _, s := range []float64{0, 1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7} {
			r := Region{Profile: profile.Uniform{Dopant: silicon.Donor, N: nd}, Surface: FixedS(s), Depth: w}
			got, err := NewSolver(m).Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			sl := s * l / d
			th := math.Tanh(w / l)
			want := silicon.ElementaryCharge * eq.P0 * d / l * (sl + th) / (1 + sl*th)
			if e := relDiff(got.J0, want); e > 1e-9 {
				t.Errorf("W/L = %g, S = %g: J0 = %.12g A/cm^2, want %.12g (rel. error %.2g)", wl, s, got.J0, want, e)
			}
			if e := relDiff(got.JSurface+got.JSRH, got.J0); e > 1e-12 {
				t.Errorf("W/L = %g, S = %g: parts add up to %g, J0 %g", wl, s, got.JSurface+got.JSRH, got.J0)
			}
		}
	}
}

// TestUniformAugerHandCalculation checks the hand-calculation path with constant Auger
// coefficients: for a uniform n-type region with S = 0 and constant coefficients Cn, Cp, the
// lifetime is 1/(Cn n0² + Cp n0 p0) (definition of R = (Cn n + Cp p)(n p − ni²) in low
// injection) and the closed form of TestUniformClosedForm applies (Green 1982).
func TestUniformAugerHandCalculation(t *testing.T) {
	m := mustModels(t, SimpleModels)
	m.Mobility = silicon.ConstantMobility{Electron: 1000, Hole: 100}
	aug := recomb.ConstantAuger{Cn: 2e-31, Cp: 1e-31}
	m.Auger = aug
	const nd, w = 1e19, 2e-4
	eq, _ := m.Material.Equilibrium(nd, 0)
	tau := 1 / (aug.Cn*eq.N0*eq.N0 + aug.Cp*eq.N0*eq.P0)
	d := 100 * m.Material.Vt()
	l := math.Sqrt(d * tau)
	got, err := NewSolver(m).Solve(Region{Profile: profile.Uniform{Dopant: silicon.Donor, N: nd}, Surface: FixedS(0), Depth: w})
	if err != nil {
		t.Fatal(err)
	}
	want := silicon.ElementaryCharge * eq.P0 * d / l * math.Tanh(w/l)
	if relDiff(got.J0, want) > 1e-9 || relDiff(got.JAuger, want) > 1e-9 {
		t.Errorf("J0 = %g (Auger %g), want %g", got.J0, got.JAuger, want)
	}
	for _, n := range got.Nodes {
		if relDiff(n.Tau, tau) > 1e-12 || relDiff(n.D, d) > 1e-12 {
			t.Fatalf("node %+v: τ, D want %g, %g", n, tau, d)
		}
	}
}

// TestIndependentReference checks Solve against an independent numerical solution of the same
// problem (a Riccati initial-value problem integrated by scipy's DOP853 at rtol 1e-12, see
// testdata/reference/j0_emitter.py) for erfc and Gaussian emitters of both types with the
// SimpleModels. With RelTol 1e-6 the solver's estimated error is below 1e-6 of J0; the
// reference is good to 1e-10, so the tolerance is 2e-6.
func TestIndependentReference(t *testing.T) {
	m := mustModels(t, SimpleModels)
	s := Solver{Models: m, RelTol: 1e-6}
	for _, row := range reftable.Load(t, "j0_emitter").Rows {
		var v [6]float64
		for i, c := range append(row[2:7:7], row[7]) {
			v[i] = reftable.Float(t, c) // "inf" parses as +Inf
		}
		ns, l, bg, w, sv, want := v[0], v[1], v[2], v[3], v[4], v[5]
		maj, other := silicon.Donor, silicon.Acceptor
		if row[0] == "p" {
			maj, other = silicon.Acceptor, silicon.Donor
		}
		var layer profile.Profile = profile.Erfc{Dopant: maj, Surface: ns, Length: l}
		if row[1] == "gauss" {
			layer = profile.Gaussian{Dopant: maj, Peak: ns, Length: l}
		}
		r := Region{Profile: profile.Sum{layer, profile.Uniform{Dopant: other, N: bg}}, Surface: FixedS(sv), Depth: w}
		got, err := s.Solve(r)
		if err != nil {
			t.Fatal(err)
		}
		if e := relDiff(got.J0, want); e > 2e-6 {
			t.Errorf("%v: J0 = %.10g A/cm^2, reference %.10g (rel. error %.2g, estimate %.2g)", row[:7], got.J0, want, e, got.ErrEst/got.J0)
		}
	}
}

// TestMeshConvergence checks the mesh control: at the default tolerance the estimated error
// is below RelTol and bounds the actual error (measured against a run at RelTol 1e-8), and
// the successive meshes converge at second order (differences falling by 4 per bisection,
// the order of the scheme; 3.5–4.5 allows for the higher-order terms).
func TestMeshConvergence(t *testing.T) {
	for _, mf := range []func() (Models, error){defaultModels, SimpleModels} {
		m := mustModels(t, mf)
		for _, r := range []Region{
			{Profile: emitter(1e20, 0.36e-4, 1.5e16), Surface: FixedS(1e4)},
			{Profile: emitter(3e20, 0.1e-4, 1e16), Surface: FixedS(math.Inf(1))},
			{Profile: profile.Sum{profile.Gaussian{Dopant: silicon.Acceptor, Peak: 1e19, Length: 0.5e-4}, profile.Uniform{Dopant: silicon.Donor, N: 1e15}}, Surface: FixedS(30)},
		} {
			coarse, err := NewSolver(m).Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			fine, err := Solver{Models: m, RelTol: 1e-8, MaxNodes: 1 << 16}.Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			if !(coarse.ErrEst <= 1e-3*coarse.J0) {
				t.Errorf("%v: estimated error %g exceeds RelTol·J0", r.Profile, coarse.ErrEst/coarse.J0)
			}
			if e := math.Abs(coarse.J0 - fine.J0); e > coarse.ErrEst {
				t.Errorf("%v: actual error %g not bounded by the estimate %g", r.Profile, e/fine.J0, coarse.ErrEst/fine.J0)
			}
			// Observed order on successive bisections of one mesh.
			st, err := NewSolver(m).prepare(r)
			if err != nil {
				t.Fatal(err)
			}
			xs, _ := initialMesh(r.Profile, st.w, st.step)
			nodes := make([]local, len(xs))
			for i, x := range xs {
				nodes[i], _ = st.ev.eval(x)
			}
			var ws work
			var js []float64
			for k := 0; k < 6; k++ {
				j, err := ws.solve(nodes, st.s)
				if err != nil {
					t.Fatal(err)
				}
				js = append(js, j)
				nodes, _ = st.bisect(nodes, nil)
			}
			for k := 3; k < len(js); k++ {
				if rho := (js[k-1] - js[k-2]) / (js[k] - js[k-1]); !(rho > 3.5 && rho < 4.5) {
					t.Errorf("%v: convergence ratio %g at mesh %d, want about 4", r.Profile, rho, k)
				}
			}
		}
	}
}

// TestBreakdown checks the consistency of the output: the parts add up to J0, the cells and
// surface part of the finest mesh add up to JFinest, every part is >= 0, u runs from its
// surface value to 1 at the far boundary, and the nodes span [0, Depth].
func TestBreakdown(t *testing.T) {
	m := mustModels(t, defaultModels)
	m.SRH = recomb.SRH{Level: recomb.FromEi(0), TauN0: 1e-6, TauP0: 1e-6}
	r := Region{Profile: emitter(2e20, 0.3e-4, 1e16), Surface: DefaultSurface()}
	res, err := NewSolver(m).Solve(r)
	if err != nil {
		t.Fatal(err)
	}
	if e := relDiff(res.JSurface+res.JAuger+res.JSRH+res.JRadiative, res.J0); e > 1e-12 {
		t.Errorf("parts add up to %g of J0", e)
	}
	for _, p := range []float64{res.JSurface, res.JAuger, res.JSRH, res.JRadiative} {
		if !(p > 0) {
			t.Errorf("part %g not > 0: %+v", p, res)
		}
	}
	var cells float64
	for _, c := range res.Cells {
		if c.Auger < 0 || c.SRH < 0 || c.Radiative < 0 || !(c.X1 > c.X0) {
			t.Fatalf("cell %+v", c)
		}
		cells += c.Total()
	}
	// The surface part of the finest mesh is S n_min0(0) u(0).
	surf := silicon.ElementaryCharge * res.S * res.Nodes[0].Minority * res.Nodes[0].U
	if e := relDiff(cells+surf, res.JFinest); e > 1e-12 {
		t.Errorf("cells + surface = %g, JFinest %g", cells+surf, res.JFinest)
	}
	n := len(res.Nodes)
	if res.Nodes[0].X != 0 || res.Nodes[n-1].X != res.Depth || res.Nodes[n-1].U != 1 || !(res.Nodes[0].U > 0 && res.Nodes[0].U < 1) {
		t.Errorf("nodes from %+v to %+v, depth %g", res.Nodes[0], res.Nodes[n-1], res.Depth)
	}
	if res.Majority != silicon.Donor || !(res.Junction > res.Depth) {
		t.Errorf("majority %v, junction %g, depth %g", res.Majority, res.Junction, res.Depth)
	}
	if want, _ := DefaultSurface().Velocity(2e20); res.S != want || res.SurfaceDensity != 2e20 {
		t.Errorf("S = %g at %g, want %g at 2e20", res.S, res.SurfaceDensity, want)
	}
}

// TestTransparentLimit checks Solve against the transparent-region integral (Transparent) for
// short regions behind well-passivated surfaces, where u ≈ 1 throughout: within 1 % (the
// issue's requirement; the neglected transport term is of order (W/L)² and S W/D, here below
// 0.5 %). The integral form always overestimates, since u <= 1 in the region.
func TestTransparentLimit(t *testing.T) {
	for _, mf := range []func() (Models, error){defaultModels, SimpleModels} {
		m := mustModels(t, mf)
		s := NewSolver(m)
		for _, r := range []Region{
			{Profile: emitter(1e19, 0.1e-4, 1e16), Surface: FixedS(100)},
			{Profile: emitter(2e19, 0.05e-4, 1e16), Surface: FixedS(10)},
			{Profile: profile.Sum{profile.Gaussian{Dopant: silicon.Acceptor, Peak: 5e18, Length: 0.2e-4}, profile.Uniform{Dopant: silicon.Donor, N: 1e15}}, Surface: FixedS(10)},
			{Profile: profile.Uniform{Dopant: silicon.Donor, N: 1e18}, Surface: FixedS(1), Depth: 0.5e-4},
		} {
			got, err := s.Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			tr, err := s.Transparent(r)
			if err != nil {
				t.Fatal(err)
			}
			if e := relDiff(got.J0, tr.J0); e > 0.01 || tr.J0 < got.J0*(1-1e-4) {
				t.Errorf("%v: Solve %g, Transparent %g A/cm^2 (rel. diff %.2g)", r.Profile, got.J0, tr.J0, e)
			}
			if relDiff(tr.JSurface+tr.JAuger+tr.JSRH+tr.JRadiative, tr.J0) > 1e-14 || tr.Depth != got.Depth {
				t.Errorf("Transparent breakdown %+v", tr)
			}
		}
	}
}

// TestGummelLimit checks Solve without bulk recombination against the transparent-emitter
// formula with the Gummel-number integral (Gummel), which is then exact (flux conservation):
// within 2e-5, the quadrature and solver tolerances. With recombination, Gummel
// underestimates J0 (it neglects the bulk).
func TestGummelLimit(t *testing.T) {
	for _, mf := range []func() (Models, error){defaultModels, SimpleModels} {
		m := mustModels(t, mf)
		noBulk := m
		noBulk.Auger, noBulk.Radiative, noBulk.SRH = nil, nil, nil
		for _, r := range []Region{
			{Profile: emitter(1e20, 0.3e-4, 1e16), Surface: FixedS(1e4)},
			{Profile: emitter(3e20, 0.1e-4, 1e15), Surface: FixedS(math.Inf(1))},
			{Profile: profile.Sum{profile.Erfc{Dopant: silicon.Acceptor, Surface: 1e19, Length: 0.5e-4}, profile.Uniform{Dopant: silicon.Donor, N: 1e15}}, Surface: FixedS(100)},
		} {
			got, err := Solver{Models: noBulk, RelTol: 1e-6}.Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			g, err := NewSolver(noBulk).Gummel(r)
			if err != nil {
				t.Fatal(err)
			}
			if e := relDiff(got.J0, g.J0); e > 2e-5 {
				t.Errorf("%v: Solve %.8g, Gummel %.8g A/cm^2 (rel. diff %.2g)", r.Profile, got.J0, g.J0, e)
			}
			withBulk, err := NewSolver(m).Solve(r)
			if err != nil {
				t.Fatal(err)
			}
			if g2, _ := NewSolver(m).Gummel(r); !(g2.J0 < withBulk.J0) {
				t.Errorf("%v: Gummel %g not below Solve %g with bulk recombination", r.Profile, g2.J0, withBulk.J0)
			}
		}
	}
}

// TestMonotonic checks that J0 grows with S (more surface recombination; physics) from 0 to
// +Inf, and with the surface concentration of an erfc emitter at fixed, low S, where Auger
// recombination limits J0 (common practice, no source). At high S the opposite holds over
// part of the range (heavier doping shields the surface), which the test does not claim.
func TestMonotonic(t *testing.T) {
	for _, mf := range []func() (Models, error){defaultModels, SimpleModels} {
		m := mustModels(t, mf)
		s := NewSolver(m)
		prev := 0.0
		for _, sv := range []float64{0, 1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, math.Inf(1)} {
			r, err := s.Solve(Region{Profile: emitter(1e20, 0.3e-4, 1e16), Surface: FixedS(sv)})
			if err != nil {
				t.Fatal(err)
			}
			if !(r.J0 > prev) {
				t.Errorf("S = %g: J0 = %g, not above %g", sv, r.J0, prev)
			}
			prev = r.J0
		}
		for _, sv := range []float64{0, 100} {
			prev = 0
			for _, ns := range []float64{3e18, 1e19, 3e19, 1e20, 2e20, 3e20} {
				r, err := s.Solve(Region{Profile: emitter(ns, 0.3e-4, 1e16), Surface: FixedS(sv)})
				if err != nil {
					t.Fatal(err)
				}
				if !(r.J0 > prev) {
					t.Errorf("S = %g, Ns = %g: J0 = %g, not above %g", sv, ns, r.J0, prev)
				}
				prev = r.J0
			}
		}
	}
}

// TestLightEmitterSanity checks that a lightly diffused, well-passivated phosphorus emitter
// (erfc, 1e19–5e19 cm^-3 at the surface, junction 0.25–0.8 µm, the package's default surface)
// has J0 in the tens of fA/cm² with the default models: a rule of thumb (common practice, no
// source), a sanity check only.
func TestLightEmitterSanity(t *testing.T) {
	s := NewSolver(mustModels(t, defaultModels))
	for _, ns := range []float64{1e19, 2e19, 5e19} {
		for _, l := range []float64{0.1e-4, 0.3e-4} {
			r, err := s.Solve(Region{Profile: emitter(ns, l, 1e16), Surface: DefaultSurface()})
			if err != nil {
				t.Fatal(err)
			}
			if fa := r.J0 * 1e15; !(fa >= 8 && fa <= 100) {
				t.Errorf("Ns = %g, L = %g: J0 = %.3g fA/cm², outside the tens of fA/cm²", ns, l, fa)
			}
		}
	}
}

// TestSwappableModels runs the solver with every simple replacement of each model
// (issue requirement): each combination solves, and the BGN-free Boltzmann set gives a lower
// J0 than the default set (band-gap narrowing raises ni,eff; physics).
func TestSwappableModels(t *testing.T) {
	def := mustModels(t, defaultModels)
	r := Region{Profile: emitter(1e20, 0.3e-4, 1e16), Surface: FixedS(1e4)}
	ref, err := NewSolver(def).Solve(r)
	if err != nil {
		t.Fatal(err)
	}
	ms := silicon.DefaultModelSet()
	ms.Intrinsic, ms.BGN, ms.Statistics, ms.Gap = silicon.NewFixedNi(), silicon.NoNarrowing{}, silicon.Boltzmann, silicon.NewFixedGap()
	simpleMat, err := ms.At(300)
	if err != nil {
		t.Fatal(err)
	}
	apparent := silicon.DefaultModelSet()
	apparent.BGN, apparent.Statistics = silicon.NewKlaassenSlotboomDeGraaff1992(), silicon.Boltzmann
	apparentMat, err := apparent.At(300)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name string
		m    func(Models) Models
	}{
		{"simple material", func(m Models) Models { m.Material = simpleMat; return m }},
		{"apparent BGN", func(m Models) Models { m.Material = apparentMat; return m }},
		{"constant mobility", func(m Models) Models { m.Mobility = silicon.NewConstantMobility(); return m }},
		{"Masetti", func(m Models) Models { m.Mobility = silicon.NewMasetti1983(); return m }},
		{"constant Auger", func(m Models) Models { m.Auger = recomb.ConstantAuger{Cn: 2.8e-31, Cp: 9.9e-32}; return m }},
		{"no radiative", func(m Models) Models { m.Radiative = nil; return m }},
		{"constant radiative", func(m Models) Models { m.Radiative = recomb.ConstantRadiative{B: 9.5e-15, EscapeFraction: 1}; return m }},
		{"SRH", func(m Models) Models { m.SRH = recomb.SRH{Level: recomb.FromEi(0), TauN0: 1e-5, TauP0: 1e-5}; return m }},
	} {
		m := tc.m(def)
		res, err := NewSolver(m).Solve(r)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if !(res.J0 > 0) || res.ErrEst > 1e-3*res.J0 {
			t.Errorf("%s: J0 = %g ± %g", tc.name, res.J0, res.ErrEst)
		}
		if tc.name == "simple material" && !(res.J0 < ref.J0) {
			t.Errorf("no BGN: J0 = %g not below the default %g", res.J0, ref.J0)
		}
	}
}

// TestHighLowJunction checks a surface-field region (n+ on n): it needs a given depth, its
// J0 falls as the surface is passivated better and rises with the region's depth at S = 0
// (more Auger volume; physics).
func TestHighLowJunction(t *testing.T) {
	s := NewSolver(mustModels(t, defaultModels))
	bsf := profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: 5e19, Length: 0.4e-4}, profile.Uniform{Dopant: silicon.Donor, N: 1e15}}
	if _, err := s.Solve(Region{Profile: bsf, Surface: FixedS(100)}); !errors.Is(err, profile.ErrNoJunction) {
		t.Errorf("high–low junction at Depth 0: err %v, want ErrNoJunction", err)
	}
	prev := 0.0
	for _, w := range []float64{0.5e-4, 1e-4, 1.5e-4} {
		r, err := s.Solve(Region{Profile: bsf, Surface: FixedS(0), Depth: w})
		if err != nil {
			t.Fatal(err)
		}
		if !(r.J0 > prev) || r.Junction != 0 || r.Depth != w {
			t.Errorf("depth %g: J0 = %g (prev %g), junction %g", w, r.J0, prev, r.Junction)
		}
		prev = r.J0
	}
}

// TestSolveBadInput checks that invalid models, regions and options give errors starting with
// "j0: " and naming the culprit (house rule).
func TestSolveBadInput(t *testing.T) {
	m := mustModels(t, SimpleModels)
	good := Region{Profile: emitter(1e20, 0.3e-4, 1e16), Surface: FixedS(100)}
	for _, tc := range []struct {
		name string
		s    Solver
		r    Region
		want string
	}{
		{"no material", Solver{Models: Models{Mobility: m.Mobility}}, good, "Material"},
		{"no profile", NewSolver(m), Region{Surface: FixedS(1)}, "Profile"},
		{"no surface", NewSolver(m), Region{Profile: good.Profile}, "Surface"},
		{"negative depth", NewSolver(m), Region{Profile: good.Profile, Surface: FixedS(1), Depth: -1}, "Depth"},
		{"NaN depth", NewSolver(m), Region{Profile: good.Profile, Surface: FixedS(1), Depth: math.NaN()}, "Depth"},
		{"depth beyond junction", NewSolver(m), Region{Profile: good.Profile, Surface: FixedS(1), Depth: 2e-4}, "junction"},
		{"negative S", NewSolver(m), Region{Profile: good.Profile, Surface: FixedS(-1)}, "FixedS"},
		{"bad power law", NewSolver(m), Region{Profile: good.Profile, Surface: PowerLawS{S1: 1, N1: 0}}, "N1"},
		{"RelTol", Solver{Models: m, RelTol: 2}, good, "RelTol"},
		{"MaxNodes", Solver{Models: m, MaxNodes: 2}, good, "MaxNodes"},
		{"InitialStep", Solver{Models: m, InitialStep: -1}, good, "InitialStep"},
		{"bad profile", NewSolver(m), Region{Profile: profile.Erfc{Dopant: silicon.Donor, Surface: -1, Length: 1e-5}, Surface: FixedS(1)}, "Surface"},
		{"undoped", NewSolver(m), Region{Profile: profile.Sum{}, Surface: FixedS(1), Depth: 1e-4}, "zero"},
		{"temperature window", Solver{Models: func() Models {
			mm := mustModels(t, func() (Models, error) { return DefaultModels(350) })
			return mm
		}()}, good, "window"},
	} {
		_, err := tc.s.Solve(tc.r)
		if err == nil || !strings.HasPrefix(err.Error(), "j0: ") || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: err %v, want prefix \"j0: \" and %q", tc.name, err, tc.want)
		}
	}
	if _, err := NewSolver(m).Transparent(Region{Profile: good.Profile, Surface: FixedS(math.Inf(1))}); err == nil {
		t.Errorf("Transparent with S = Inf: no error")
	}
	// MaxNodes reached: the result comes with an error matching pvrec.ErrNoConvergence.
	r, err := Solver{Models: m, RelTol: 1e-12, MaxNodes: 40}.Solve(good)
	if !errors.Is(err, pvrec.ErrNoConvergence) || !(r.J0 > 0) || !(r.ErrEst > 0) {
		t.Errorf("MaxNodes: J0 %g ± %g, err %v", r.J0, r.ErrEst, err)
	}
}

// TestPhi checks the cancellation-free φ(t, X, K) = t + X coth X − e^t X/sinh X against
// testdata/reference/j0_phi.csv (mpmath at 50 digits, j0_phi.py) over the
// regimes of the series and of the closed forms; the tolerance 1e-13 allows the factor of
// about ten lost near the switch at X = 1.
func TestPhi(t *testing.T) {
	for _, row := range reftable.Load(t, "j0_phi").Rows {
		var v [3]float64
		for i := range v {
			v[i] = reftable.Float(t, row[i])
		}
		tt, k, want := v[0], v[1], v[2]
		got := phi(tt, math.Sqrt(tt*tt+k), k)
		if e := relDiff(got, want); e > 1e-13 {
			t.Errorf("φ(t=%g, K=%g) = %.16g, want %.16g (rel. error %.2g)", tt, k, got, want, e)
		}
	}
}

// TestDemoMeasuredProfile solves the invented noisy demo profile of testdata/profiles on a
// boron wafer: the kinks of the interpolated data slow the first meshes, but the refinement
// still converges, and the estimate at the default tolerance bounds the error measured
// against RelTol 1e-7.
func TestDemoMeasuredProfile(t *testing.T) {
	meas, err := profile.ReadCSVFile("../../testdata/profiles/demo-phosphorus.csv")
	if err != nil {
		t.Fatal(err)
	}
	tab, err := meas.Profile(silicon.Donor)
	if err != nil {
		t.Fatal(err)
	}
	r := Region{Profile: profile.Sum{tab, profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}}, Surface: DefaultSurface()}
	for _, mf := range []func() (Models, error){defaultModels, SimpleModels} {
		m := mustModels(t, mf)
		got, err := NewSolver(m).Solve(r)
		if err != nil {
			t.Fatal(err)
		}
		ref, err := Solver{Models: m, RelTol: 1e-7, MaxNodes: 1 << 17}.Solve(r)
		if err != nil {
			t.Fatal(err)
		}
		if e := math.Abs(got.J0 - ref.J0); e > got.ErrEst || got.ErrEst > 1e-3*got.J0 {
			t.Errorf("error %g, estimate %g (relative)", e/ref.J0, got.ErrEst/ref.J0)
		}
	}
}

// TestSolveBounded checks the limits of the solver (issue 12): an InitialStep too small for
// MaxNodes fails before any mesh is built (before, InitialStep 1e-9 asked for some 1e10 nodes
// and 1e-300 for int(+Inf) of them), a MaxNodes that leaves room for two meshes only gives a
// finite error estimate (it was +Inf), and nil models, a far boundary beyond
// profile.MaxDepthCm and typed nil pointers are errors, not panics.
func TestSolveBounded(t *testing.T) {
	m := mustModels(t, SimpleModels)
	good := Region{Profile: emitter(1e20, 0.3e-4, 1e16), Surface: FixedS(100)}
	for _, step := range []float64{1e-9, 1e-300, math.SmallestNonzeroFloat64} {
		r, err := Solver{Models: m, InitialStep: step}.Solve(good)
		if !errors.Is(err, pvrec.ErrNoConvergence) || !strings.Contains(err.Error(), "InitialStep") || r.Nodes != nil {
			t.Errorf("InitialStep %g: %d nodes, err %v", step, len(r.Nodes), err)
		}
		if _, err := (Solver{Models: m, InitialStep: step}).Transparent(good); err == nil {
			t.Errorf("Transparent with InitialStep %g: no error", step)
		}
	}
	// The initial mesh of this emitter has 9 nodes (observed): MaxNodes 10 leaves no room for
	// the second mesh of 17, MaxNodes 20 for a third of 33.
	if _, err := (Solver{Models: m, MaxNodes: 10}).Solve(good); !errors.Is(err, pvrec.ErrNoConvergence) || !strings.Contains(err.Error(), "second mesh") {
		t.Errorf("MaxNodes 10: err %v", err)
	}
	r, err := Solver{Models: m, RelTol: 1e-12, MaxNodes: 20}.Solve(good)
	if !errors.Is(err, pvrec.ErrNoConvergence) || r.Meshes != 2 || !(r.ErrEst > 0) || math.IsInf(r.ErrEst, 0) || !(r.J0 > 0) {
		t.Errorf("MaxNodes 20: %d meshes, J0 %g ± %g, err %v", r.Meshes, r.J0, r.ErrEst, err)
	}
	var nilSurface *PowerLawS
	var nilTab *profile.Tabulated
	for name, reg := range map[string]Region{
		"typed nil surface": {Profile: good.Profile, Surface: nilSurface},
		"typed nil profile": {Profile: nilTab, Surface: FixedS(1)},
		"deep":              {Profile: good.Profile, Surface: FixedS(1), Depth: 1e300},
	} {
		func() {
			defer func() {
				if p := recover(); p != nil {
					t.Errorf("%s: panic %v", name, p)
				}
			}()
			if _, err := NewSolver(m).Solve(reg); err == nil || !strings.HasPrefix(err.Error(), "j0: ") {
				t.Errorf("%s: err %v", name, err)
			}
		}()
	}
	if _, err := (Solver{}).Solve(good); err == nil {
		t.Errorf("zero Solver: no error")
	}
	if _, err := NewSolver(Models{Material: &silicon.Material{}}).Solve(good); err == nil {
		t.Errorf("zero Material: no error")
	}
}
