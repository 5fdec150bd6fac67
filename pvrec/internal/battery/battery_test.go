package battery

import (
	"errors"
	"fmt"
	"io"
	"math"
	"math/rand/v2"
	"reflect"
	"sort"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/pvrec/pvrec/pvrec/cell"
	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/spectroscopy"
	"github.com/pvrec/pvrec/pvrec/surface"
	"github.com/pvrec/pvrec/pvrec/uncertainty"

	"gonum.org/v1/gonum/stat/distuv"
)

// entry is a registered entry point with its function value (nil if Skip is set).
type entry struct {
	Entry
	fn any
}

const (
	callTimeout = 10 * time.Second // a call longer than this is a hang
	randomCalls = 48               // random argument combinations per entry point
	maxCalls    = 600              // at most this many calls per entry point
	absurd      = 1e100            // no pvrec quantity in its units is this large
)

// badFloats are the hostile values; ordinary values let calls reach deeper code.
var (
	badFloats      = []float64{math.NaN(), math.Inf(1), math.Inf(-1), 0, -1, 1e-300, 1e300, -1e300, math.MaxFloat64}
	ordinaryFloats = []float64{300, 1e15, 1e16, 0.018, 1e-14, 0.7, 1, 10}
)

// TestRegistryComplete fails when the generated registry misses an exported function or
// method, or lists one that no longer exists.
func TestRegistryComplete(t *testing.T) {
	want, err := List("../..")
	if err != nil {
		t.Fatal(err)
	}
	var got, exp []string
	for _, e := range registry {
		got = append(got, e.Name)
	}
	for _, e := range want {
		exp = append(exp, e.Name)
	}
	if strings.Join(got, "\n") != strings.Join(exp, "\n") {
		t.Fatalf("registry_test.go is stale: run go generate ./pvrec/internal/battery\n got %d entries, want %d", len(got), len(exp))
	}
}

type stats struct {
	mu                  sync.Mutex
	calls, errs, values int
	failures            []string
	failuresPerEntry    map[string]int
	skipped             []string
}

func (s *stats) fail(name, msg string) {
	s.mu.Lock()
	defer s.mu.Unlock()
	s.failuresPerEntry[name]++
	if s.failuresPerEntry[name] == 1 {
		s.failures = append(s.failures, name+": "+msg)
	}
}

// TestBattery calls every entry point with hostile arguments (see the package doc) and prints
// one summary line, "battery: N calls, N errors, N values checked, N failures".
func TestBattery(t *testing.T) {
	fx := fixtures(t)
	st := &stats{failuresPerEntry: map[string]int{}}
	for _, e := range registry {
		if e.Skip != "" {
			st.skipped = append(st.skipped, e.Name+" ("+e.Skip+")")
			continue
		}
		runEntry(t, e, fx, st)
	}
	fails := 0
	for _, n := range st.failuresPerEntry {
		fails += n
	}
	fmt.Printf("battery: %d calls, %d errors, %d values checked, %d failures (%d entry points, %d skipped: %s)\n",
		st.calls, st.errs, st.values, fails, len(registry)-len(st.skipped), len(st.skipped), strings.Join(st.skipped, ", "))
	sort.Strings(st.failures)
	for _, f := range st.failures {
		t.Error(f)
	}
}

// runEntry builds argument lists for e and checks each call.
func runEntry(t *testing.T, e entry, fx []any, st *stats) {
	fv := reflect.ValueOf(e.fn)
	ft := fv.Type()
	pools := make([][]func() reflect.Value, ft.NumIn())
	method := strings.HasPrefix(e.Expr, "(")
	for i := range pools {
		pt := ft.In(i)
		if ft.IsVariadic() && i == ft.NumIn()-1 {
			pools[i] = slicePool(pt, fx)
		} else {
			pools[i] = pool(pt, fx)
		}
		if i == 0 && method && pt.Kind() == reflect.Pointer {
			pools[i] = pools[i][:len(pools[i])-1] // a method called on a nil pointer is a caller's bug, as in Go generally
		}
		if len(pools[i]) == 0 {
			t.Errorf("%s: no values for parameter %d of type %v", e.Name, i, pt)
			return
		}
	}
	rng := rand.New(rand.NewPCG(1, uint64(len(e.Name))))
	var combos [][]int
	base := make([]int, len(pools))
	combos = append(combos, append([]int(nil), base...))
	for i := range pools {
		for j := range pools[i] {
			if j == 0 {
				continue
			}
			c := append([]int(nil), base...)
			c[i] = j
			combos = append(combos, c)
		}
	}
	for k := 0; k < randomCalls; k++ {
		c := make([]int, len(pools))
		for i := range c {
			c[i] = rng.IntN(len(pools[i]))
		}
		combos = append(combos, c)
	}
	if len(combos) > maxCalls {
		combos = combos[:maxCalls]
	}
	for _, c := range combos {
		args := make([]reflect.Value, len(c))
		for i, j := range c {
			args[i] = pools[i][j]()
		}
		call(e, fv, args, st)
	}
}

// call runs one call with a timeout and checks its results.
func call(e entry, fv reflect.Value, args []reflect.Value, st *stats) {
	type outcome struct {
		res   []reflect.Value
		panic any
	}
	done := make(chan outcome, 1)
	go func() {
		defer func() {
			if p := recover(); p != nil {
				done <- outcome{panic: p}
			}
		}()
		var res []reflect.Value
		if fv.Type().IsVariadic() {
			res = fv.CallSlice(args)
		} else {
			res = fv.Call(args)
		}
		done <- outcome{res: res}
	}()
	st.mu.Lock()
	st.calls++
	st.mu.Unlock()
	select {
	case o := <-done:
		if o.panic != nil {
			st.fail(e.Name, fmt.Sprintf("panic %v with %s", o.panic, describe(args)))
			return
		}
		res := o.res
		hasErr := len(res) > 0 && res[len(res)-1].Type() == errorType
		if !hasErr && !clean(args) {
			// A function without an error result cannot refuse garbage: it may pass it on
			// (a value constructor, an accessor); the error comes where the value is used.
			return
		}
		if n := len(res); hasErr {
			if !res[n-1].IsNil() {
				err := res[n-1].Interface().(error)
				st.mu.Lock()
				st.errs++
				st.mu.Unlock()
				if msg := err.Error(); msg == "" || len(msg) > 2000 {
					st.fail(e.Name, fmt.Sprintf("error message of length %d", len(msg)))
				}
				return
			}
			res = res[:n-1]
		}
		for i, r := range res {
			var bad string
			n := walk(r, 0, func(path string, x float64) {
				switch {
				case math.IsNaN(x):
					bad = fmt.Sprintf("result %d%s is NaN", i, path)
				case math.IsInf(x, 0) && !e.AllowInf:
					bad = fmt.Sprintf("result %d%s is %g", i, path, x)
				case !math.IsInf(x, 0) && math.Abs(x) > absurd && e.Pkg != "fermi": // fermi is pure mathematics
					bad = fmt.Sprintf("result %d%s = %g is absurd", i, path, x)
				}
			})
			st.mu.Lock()
			st.values += n
			st.mu.Unlock()
			if bad != "" {
				st.fail(e.Name, bad+" without an error, with "+describe(args))
				return
			}
		}
	case <-time.After(callTimeout):
		st.fail(e.Name, fmt.Sprintf("no return within %v with %s", callTimeout, describe(args)))
	}
}

var errorType = reflect.TypeFor[error]()

// clean reports whether every float reachable from args is finite and not absurd.
func clean(args []reflect.Value) bool {
	ok := true
	for _, a := range args {
		walk(a, 0, func(_ string, x float64) {
			if math.IsNaN(x) || math.IsInf(x, 0) || math.Abs(x) > absurd {
				ok = false
			}
		})
	}
	return ok
}

// walk calls f on every float reachable from v through exported struct fields, slices,
// arrays and pointers (to depth 4) and returns how many it visited.
func walk(v reflect.Value, depth int, f func(path string, x float64)) int {
	if depth > 4 || !v.IsValid() {
		return 0
	}
	switch v.Kind() {
	case reflect.Float32, reflect.Float64:
		f("", v.Float())
		return 1
	case reflect.Pointer, reflect.Interface:
		if v.IsNil() {
			return 0
		}
		return walk(v.Elem(), depth+1, f)
	case reflect.Struct:
		n := 0
		for i := 0; i < v.NumField(); i++ {
			if !v.Type().Field(i).IsExported() {
				continue
			}
			name := v.Type().Field(i).Name
			n += walk(v.Field(i), depth+1, func(p string, x float64) { f("."+name+p, x) })
		}
		return n
	case reflect.Slice, reflect.Array:
		n := 0
		for i := 0; i < v.Len() && i < 4096; i++ {
			k := i
			n += walk(v.Index(i), depth+1, func(p string, x float64) { f(fmt.Sprintf("[%d]%s", k, p), x) })
		}
		return n
	}
	return 0
}

// describe prints arguments briefly for a failure message.
func describe(args []reflect.Value) string {
	parts := make([]string, len(args))
	for i, a := range args {
		s := fmt.Sprintf("%+v", safeInterface(a))
		if len(s) > 120 {
			s = s[:120] + "…"
		}
		parts[i] = s
	}
	return "(" + strings.Join(parts, ", ") + ")"
}

func safeInterface(v reflect.Value) any {
	if !v.IsValid() {
		return "<invalid>"
	}
	if (v.Kind() == reflect.Pointer || v.Kind() == reflect.Interface || v.Kind() == reflect.Func || v.Kind() == reflect.Slice || v.Kind() == reflect.Map) && v.IsNil() {
		return "nil " + v.Type().String()
	}
	if v.Kind() == reflect.Func {
		return v.Type().String()
	}
	return v.Interface()
}

// pool returns generators of the argument values tried for a parameter of type t; the first
// is the default used while other parameters vary.
func pool(t reflect.Type, fx []any) []func() reflect.Value {
	var p []func() reflect.Value
	add := func(v reflect.Value) {
		p = append(p, func() reflect.Value { return v })
	}
	// Fixtures of exactly this type first (good values), then the hostile values.
	for _, x := range fx {
		if reflect.TypeOf(x) == t {
			add(reflect.ValueOf(x))
		}
	}
	switch t.Kind() {
	case reflect.Float32, reflect.Float64:
		for _, x := range append(append([]float64(nil), ordinaryFloats...), badFloats...) {
			add(reflect.ValueOf(x).Convert(t))
		}
	case reflect.Int, reflect.Int64, reflect.Int32:
		for _, x := range []int64{4, 0, -1, 1, 3, 1 << 20, math.MaxInt32} {
			add(reflect.ValueOf(x).Convert(t))
		}
	case reflect.Uint8, reflect.Uint, reflect.Uint16, reflect.Uint32, reflect.Uint64:
		for _, x := range []uint64{1, 0, 2, 3, 255} {
			add(reflect.ValueOf(x).Convert(t))
		}
	case reflect.Bool:
		add(reflect.ValueOf(false).Convert(t))
		add(reflect.ValueOf(true).Convert(t))
	case reflect.String:
		for _, s := range []string{"x", "", "\x00\xff", strings.Repeat("é", 70000)} {
			add(reflect.ValueOf(s).Convert(t))
		}
	case reflect.Slice:
		p = append(p, slicePool(t, fx)...)
	case reflect.Pointer:
		if t.Elem().Kind() == reflect.Struct {
			p = append(p, func() reflect.Value { return reflect.New(t.Elem()) }) // zero value
		}
		add(reflect.Zero(t)) // nil
	case reflect.Struct:
		p = append(p, structPool(t, fx)...)
	case reflect.Interface:
		switch t {
		case reflect.TypeFor[io.Reader]():
			for _, s := range readerInputs {
				p = append(p, func() reflect.Value { return reflect.ValueOf(io.Reader(strings.NewReader(s))) })
			}
		case reflect.TypeFor[io.Writer]():
			add(reflect.ValueOf(io.Writer(io.Discard)))
		}
		for _, x := range fx {
			if xt := reflect.TypeOf(x); xt != t && xt.Implements(t) {
				v := reflect.New(t).Elem()
				v.Set(reflect.ValueOf(x))
				add(v)
			}
		}
		add(reflect.Zero(t)) // nil interface
	case reflect.Func:
		p = append(p, funcPool(t)...)
	case reflect.Map, reflect.Chan:
		add(reflect.Zero(t))
	}
	return p
}

// readerInputs are file contents for readers: empty, garbage, and small plausible tables.
var readerInputs = []string{
	"",
	"\xef\xbb\xbfdepth_um,N_cm-3\n0,1e20\n0.1,1e19\n0.2,1e17\n",
	"depth_um,N_cm-3\r\n0,1e20\r\n0.1,1e19\r\n",
	"x,y\nNaN,Inf\n0x1p3,1_000\n",
	"\x00\x01\x02",
	strings.Repeat("a", 100000),
}

// slicePool returns nil, empty and a few filled slices of type t.
func slicePool(t reflect.Type, fx []any) []func() reflect.Value {
	var p []func() reflect.Value
	mk := func(vals []reflect.Value) func() reflect.Value {
		return func() reflect.Value {
			s := reflect.MakeSlice(t, len(vals), len(vals))
			for i, v := range vals {
				s.Index(i).Set(v)
			}
			return s
		}
	}
	et := t.Elem()
	if et.Kind() == reflect.Float64 {
		for _, xs := range [][]float64{
			{1e13, 1e14, 1e15, 1e16}, {0, 1e-5, 2e-5, 3e-5}, {300, 310},
			{}, {math.NaN()}, {3, 2, 1}, {1e300, 1e-300}, {math.Inf(1), 1}, {-1, 1}, {1, 1, 1},
		} {
			vals := make([]reflect.Value, len(xs))
			for i, x := range xs {
				vals[i] = reflect.ValueOf(x).Convert(et)
			}
			p = append(p, mk(vals))
		}
	} else {
		elems := pool(et, fx)
		var vals []reflect.Value
		for i, g := range elems {
			if i >= 3 {
				break
			}
			vals = append(vals, g())
		}
		p = append(p, mk(vals), mk(nil))
		if len(elems) > 0 {
			p = append(p, mk([]reflect.Value{elems[len(elems)-1]()})) // the last (nil/zero-like) element
		}
	}
	p = append(p, func() reflect.Value { return reflect.Zero(t) }) // nil slice
	return p
}

// structPool returns the fixtures of type t (or its zero value) and variations in which one
// exported float field at a time holds each hostile value.
func structPool(t reflect.Type, fx []any) []func() reflect.Value {
	var bases []reflect.Value
	for _, x := range fx {
		if reflect.TypeOf(x) == t {
			bases = append(bases, reflect.ValueOf(x))
		}
	}
	var p []func() reflect.Value
	zero := reflect.Zero(t)
	p = append(p, func() reflect.Value { return zero })
	if len(bases) == 0 {
		bases = append(bases, zero)
	}
	b := bases[0]
	for i := 0; i < t.NumField(); i++ {
		f := t.Field(i)
		if !f.IsExported() {
			continue
		}
		switch f.Type.Kind() {
		case reflect.Float64, reflect.Float32:
			for _, x := range badFloats {
				k, x := i, x
				p = append(p, func() reflect.Value {
					v := reflect.New(t).Elem()
					v.Set(b)
					v.Field(k).Set(reflect.ValueOf(x).Convert(f.Type))
					return v
				})
			}
		case reflect.Interface, reflect.Pointer, reflect.Slice, reflect.Func, reflect.Map:
			k := i
			p = append(p, func() reflect.Value {
				v := reflect.New(t).Elem()
				v.Set(b)
				v.Field(k).Set(reflect.Zero(f.Type))
				return v
			})
		case reflect.Int, reflect.Uint8:
			k := i
			p = append(p, func() reflect.Value {
				v := reflect.New(t).Elem()
				v.Set(b)
				v.Field(k).Set(reflect.ValueOf(int64(-1)).Convert(f.Type))
				return v
			})
		}
	}
	return p
}

// funcPool returns nil and functions that return hostile values (NaN, +Inf, 0, -1 for their
// float results, zero values otherwise, nil error) and one that returns an error.
func funcPool(t reflect.Type) []func() reflect.Value {
	p := []func() reflect.Value{}
	mk := func(x float64, err error) func() reflect.Value {
		fn := reflect.MakeFunc(t, func(args []reflect.Value) []reflect.Value {
			out := make([]reflect.Value, t.NumOut())
			for i := range out {
				ot := t.Out(i)
				switch {
				case ot == errorType && err != nil:
					out[i] = reflect.ValueOf(&err).Elem()
				case ot.Kind() == reflect.Float64:
					out[i] = reflect.ValueOf(x).Convert(ot)
				default:
					out[i] = reflect.Zero(ot)
				}
			}
			return out
		})
		return func() reflect.Value { return fn }
	}
	// A callback that panics is not offered: a panic in the caller's own function propagates,
	// as everywhere in Go (package sweep alone turns it into an item's error, and tests that).
	p = append(p, mk(1e-3, nil), mk(math.NaN(), nil), mk(math.Inf(1), nil), mk(0, nil), mk(-1, nil),
		mk(0, errors.New("battery: callback error")), func() reflect.Value { return reflect.Zero(t) })
	return p
}

// fixtures returns valid values of the package types, so that calls reach past the first
// check. Types without a fixture are tried as zero values and field variations.
func fixtures(t *testing.T) []any {
	t.Helper()
	must := func(v any, err error) any {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
		return v
	}
	si := must(silicon.DefaultModelSet().At(300)).(*silicon.Material)
	simple := must(silicon.SimpleModelSet().At(300)).(*silicon.Material)
	pbulk := must(recomb.NewBulk(si, 0, 1e16)).(*recomb.Bulk)
	nbulk := must(recomb.NewBulk(simple, 1e15, 0)).(*recomb.Bulk)
	state := must(pbulk.State(1e15)).(recomb.State)
	models := must(j0.DefaultModels(300)).(j0.Models)
	emitter := profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}, profile.Uniform{Dopant: silicon.Acceptor, N: 1e16}}
	tab := must(profile.NewTabulated(silicon.Donor, []float64{0, 1e-5, 2e-5, 4e-5}, []float64{1e20, 5e19, 1e18, 1e15})).(*profile.Tabulated)
	dit := surface.UShapedDit{Mid: 1e11, TailC: 1e13, TailV: 1e13, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
	esrh := surface.NewExtendedSRH(dit, surface.ConstantSigma(1e-15), surface.ConstantSigma(1e-16), -1e12)
	tdit := must(surface.NewTabulatedDit([]float64{-0.5, 0, 0.5}, []float64{1e12, 1e10, 1e12})).(surface.TabulatedDit)
	si298 := must(silicon.DefaultModelSet().At(298.15)).(*silicon.Material)
	design := cell.Design{
		Material: si298,
		Base:     cell.Base{Thickness: 160e-4, Na: 1.5e16, Mechanisms: []recomb.Mechanism{recomb.NewIntrinsic()}},
		Front: []cell.Part{
			{Name: "emitter", Fraction: 0.97, J0: 35e-15},
			{Name: "emitter, under metal", Fraction: 0.03, J0: 900e-15, Contact: true},
		},
		Rear: []cell.Part{{Name: "dielectric", Fraction: 1, Surface: surface.ConstantSeff{S: 5}}},
		Rs:   0.5, Jsc: 0.041,
	}
	device := must(cell.New(design)).(*cell.Device)
	sample := lifetime.Sample{Wafer: nbulk, W: 180e-4, Bulk: recomb.NewIntrinsic(), Front: surface.ConstantJ0s{J0s: 15e-15}}
	tgrid := make([]float64, 400)
	for i := range tgrid {
		tgrid[i] = 20e-3 * float64(i) / float64(len(tgrid)-1)
	}
	trace := must(sample.Simulate(lifetime.Optics{}, tgrid, nil, 3e16)).(lifetime.Trace)
	analysis := lifetime.Analysis{Wafer: nbulk, W: 180e-4, Mode: lifetime.Transient, Intrinsic: recomb.NewIntrinsic()}
	result := must(analysis.Analyze(trace)).(*lifetime.Result)
	table := lifetime.Table{Dn: []float64{5e14, 8e14, 1e15, 1.2e15, 2e15}, TauEff: []float64{655e-6, 652e-6, 650e-6, 648e-6, 640e-6}}
	optics := lifetime.Optics{FluxPerSun: lifetime.OneSunFlux, Absorbed: 0.95}
	jv := must(sample.ImpliedJV(optics, 50)).(lifetime.JV)
	specDn := []float64{1e13, 3e13, 1e14, 3e14, 1e15, 3e15, 1e16, 3e16}
	specCurve := spectroscopy.Curve{Bulk: pbulk, Dn: specDn, Tau: must(pbulk.Lifetimes(recomb.IronBoronPair(1e12), specDn)).([]float64)}
	specOpt := spectroscopy.Options{Ref: recomb.FromConduction, EtPoints: 20, KPoints: 20, Starts: []spectroscopy.Start{{Et: 0.3, K: 2}}}
	specResult := must(spectroscopy.Fit([]spectroscopy.Curve{specCurve}, specOpt)).(spectroscopy.Result)
	specLine := must(spectroscopy.Linearise(specCurve, silicon.NewGreen1990ThermalVelocity())).(spectroscopy.Line)
	uncCase := uncertainty.Case{T: 300, Dopant: silicon.Donor}
	members := must(uncertainty.Members(uncCase)).([]uncertainty.Member)
	uncInputs := []uncertainty.Input{{Name: "w", Unit: "cm", Dist: distuv.Normal{Mu: 180e-4, Sigma: 5e-4}}, {Name: "s", Unit: "cm/s", Dist: distuv.LogNormal{Mu: 2, Sigma: 0.2}}}
	mc := uncertainty.MonteCarlo{Inputs: uncInputs, Seed: 1, MaxSamples: 300}
	badInputs := []uncertainty.Input{{Name: "beta", Dist: distuv.Beta{Alpha: 0, Beta: 1}}, {Name: "gamma", Dist: distuv.Gamma{Alpha: -1, Beta: 1}}, {Name: "reversed", Dist: distuv.Uniform{Min: 2, Max: 1}}}
	mcResult := must(mc.Run(func(x []float64) (float64, error) { return x[0] / x[1], nil })).(uncertainty.MCResult)
	spreadResult := must(uncertainty.Spread(members[:4], 0, func(m uncertainty.Member) (float64, error) { return float64(len(m.Name)), nil })).(uncertainty.SpreadResult)
	return []any{
		uncCase, members, members[0], uncInputs, uncInputs[0], mc, mcResult, spreadResult,
		uncertainty.Sensitivity{Inputs: uncInputs}, distuv.Normal{Mu: 1, Sigma: 0.1},
		// Distributions with invalid parameters (gonum's distuv panics on the first two), after
		// the good fixtures of each type.
		uncertainty.MonteCarlo{Inputs: badInputs, MaxSamples: 300}, uncertainty.Sensitivity{Inputs: badInputs},
		uncertainty.MonteCarlo{Inputs: badInputs[1:], MaxSamples: 300}, uncertainty.Sensitivity{Inputs: badInputs[2:]},
		badInputs, distuv.Beta{Alpha: 0, Beta: 1}, distuv.Gamma{Alpha: -1, Beta: 1}, distuv.Uniform{Min: 2, Max: 1},
		sample, trace, analysis, result, table, optics, jv, lifetime.J0sOptions{},
		specCurve, []spectroscopy.Curve{specCurve}, specOpt, specResult, specLine, spectroscopy.Start{Et: 0.3, K: 2},
		design, device, design.Base, design.Front[0],
		si, simple, silicon.DefaultModelSet(), silicon.SimpleModelSet(),
		silicon.Point{T: 300, Nd: 1e16, Na: 0, N: 1e16, P: 1e4}, silicon.Donor, silicon.Acceptor,
		silicon.NewKlaassen1992(), silicon.NewMasetti1983(), silicon.NewConstantMobility(),
		silicon.NewGreen1990ThermalVelocity(),
		pbulk, nbulk, state, recomb.NewIntrinsic(), recomb.NewRichter2012(), recomb.InterstitialIron(1e11),
		recomb.SRH{Level: recomb.FromEi(0), TauN0: 1e-3, TauP0: 1e-3}, recomb.AboveEv(0.38),
		recomb.Sum{recomb.NewIntrinsic(), recomb.InterstitialIron(1e10)},
		surface.ConstantSeff{S: 10}, surface.ConstantJ0s{J0s: 1e-14}, esrh, dit, tdit, surface.ConstantSigma(1e-16),
		surface.ConstantDit{D: 1e11},
		emitter, profile.Uniform{Dopant: silicon.Acceptor, N: 1e16}, profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4},
		tab, profile.Gaussian{Dopant: silicon.Donor, Peak: 1e19, Center: 0, Length: 0.5e-4},
		models, j0.NewSolver(models), j0.FixedS(1e4), j0.DefaultSurface(),
		j0.Region{Profile: emitter, Surface: j0.FixedS(1e4)},
		j0.Base{NiEff: 1e10, Doping: 1e16, Width: 0.018, Tau: 1e-3, D: 30, S: 10},
	}
}
