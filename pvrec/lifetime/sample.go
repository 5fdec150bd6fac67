package lifetime

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// Sample is a lifetime sample: a wafer of thickness W with bulk recombination and a front and
// a rear surface, the usual test structure of passivation work (symmetric, Rear nil, in the
// common case). It is a value; build it as a struct literal:
//
//	s := lifetime.Sample{Wafer: wafer, W: 180e-4, Bulk: recomb.NewIntrinsic(),
//		Front: surface.ConstantJ0s{J0s: 10e-15}} // symmetric: the rear is the front
//
// Every quantity is evaluated at the wafer's quasi-neutral state at the excess carrier
// density Δn (recomb.Bulk.State), the average Δn of the wafer that photoconductance measures.
// A surface given by its J0s is surface.ConstantJ0s; any surface.Model (ConstantSeff,
// ExtendedSRH, ...) serves. The zero Sample is not usable: its methods return an error naming
// the missing field. A Sample is safe for concurrent use when its parts are.
type Sample struct {
	Wafer *recomb.Bulk     // the wafer: material, dopant densities and equilibrium (recomb.NewBulk)
	W     float64          // thickness, cm (finite, > 0)
	Bulk  recomb.Mechanism // bulk recombination, e.g. recomb.NewIntrinsic(); recomb.Sum{} for none
	Front surface.Model    // front surface (x = 0)
	Rear  surface.Model    // rear surface (x = W); nil means the same as Front (symmetric sample)
}

// check returns an error naming the first missing or invalid field of s.
func (s Sample) check(ctx string) error {
	switch {
	case s.Wafer == nil || s.Wafer.Material() == nil:
		return fmt.Errorf("lifetime: %s: Sample.Wafer is not set (build it with recomb.NewBulk)", ctx)
	case s.Bulk == nil:
		return fmt.Errorf("lifetime: %s: Sample.Bulk is nil (use recomb.NewIntrinsic(), or recomb.Sum{} for no bulk recombination)", ctx)
	case s.Front == nil:
		return fmt.Errorf("lifetime: %s: Sample.Front is nil (a surface.Model, e.g. surface.ConstantJ0s{J0s: 10e-15})", ctx)
	}
	return check.Positive("lifetime: "+ctx, "Sample.W (thickness)", s.W, "cm")
}

// parts is the sample's recombination at one injection level.
type parts struct {
	state     recomb.State
	tauBulk   float64 // s, +Inf without bulk recombination
	sf, sr    float64 // front and rear Seff, cm/s
	diffusion float64 // ambipolar diffusivity, cm²/s (set only when asked for)
}

// eval evaluates the bulk, both surfaces and the ambipolar diffusivity at Δn = dn.
func (s Sample) eval(ctx string, dn float64, diffusivity bool) (parts, error) {
	if err := s.check(ctx); err != nil {
		return parts{}, err
	}
	if err := check.Positive("lifetime: "+ctx, "excess carrier density Δn", dn, "cm^-3"); err != nil {
		return parts{}, err
	}
	st, err := s.Wafer.State(dn)
	if err != nil {
		return parts{}, fmt.Errorf("lifetime: %s: %w", ctx, err)
	}
	p := parts{state: st}
	if p.tauBulk, err = recomb.Lifetime(s.Bulk, st); err != nil {
		return parts{}, fmt.Errorf("lifetime: %s: bulk at Δn = %g cm^-3: %w", ctx, dn, err)
	}
	if p.sf, err = s.Front.Seff(st); err != nil {
		return parts{}, fmt.Errorf("lifetime: %s: front surface at Δn = %g cm^-3: %w", ctx, dn, err)
	}
	p.sr = p.sf
	if s.Rear != nil {
		if p.sr, err = s.Rear.Seff(st); err != nil {
			return parts{}, fmt.Errorf("lifetime: %s: rear surface at Δn = %g cm^-3: %w", ctx, dn, err)
		}
	}
	if diffusivity {
		mat := s.Wafer.Material()
		dnD, dpD, err := silicon.Diffusivities(mat, mat.Models().Mobility, st.N, st.P, st.NdIon, st.NaIon)
		if err != nil {
			return parts{}, fmt.Errorf("lifetime: %s: at Δn = %g cm^-3: %w", ctx, dn, err)
		}
		if p.diffusion, err = silicon.AmbipolarDiffusivity(dnD, dpD, st.N, st.P); err != nil {
			return parts{}, fmt.Errorf("lifetime: %s: at Δn = %g cm^-3: %w", ctx, dn, err)
		}
	}
	return p, nil
}

// Lifetime returns the effective lifetime τeff in s of the sample at the excess carrier
// density dn in cm^-3 (finite, 0 < dn <= recomb.MaxExcess, and within the range of the
// surface models, e.g. surface.MaxExcess for ExtendedSRH), from the exact fundamental mode of
// the decay for unequal surfaces (A. B. Sproul, J. Appl. Phys. 76, 2851 (1994); see
// surface.Lifetime):
//
//	1/τeff = 1/τbulk + D α²,   tan(α W) = α D (Sf + Sr)/(α² D² − Sf Sr),
//
// with τbulk of s.Bulk, Sf and Sr the Seff of the surfaces and D the ambipolar diffusivity
// (silicon.AmbipolarDiffusivity of the material's mobility model, which is the minority
// diffusivity in low injection), all at the state of the wafer at Δn. It treats D, Sf and Sr as
// constant across the wafer at their values at Δn; it is the lifetime of a transient decay
// after the higher modes have died out, and of a quasi-steady state under uniform generation
// to within the difference between the two, which is small when (Sf + Sr) W/D is small
// (Sproul 1994). It returns an error naming the missing field of s, for invalid dn, or an
// error of a model (wrapped; range errors match pvrec.ErrOutOfRange).
func (s Sample) Lifetime(dn float64) (float64, error) {
	p, err := s.eval("Sample.Lifetime", dn, true)
	if err != nil {
		return 0, err
	}
	t, err := surface.EffectiveLifetime(p.tauBulk, s.W, p.diffusion, p.sf, p.sr)
	if err != nil {
		return 0, fmt.Errorf("lifetime: Sample.Lifetime at Δn = %g cm^-3: %w", dn, err)
	}
	return t, nil
}

// LifetimeJ0s returns the effective lifetime τeff in s of the sample at excess carrier
// density dn in cm^-3 (as for Lifetime) in the J0s form, which takes Δn uniform across the
// wafer (the small-S limit of Lifetime, surface.LifetimeLowS):
//
//	1/τeff = 1/τbulk + (Sf + Sr)/W = 1/τbulk + (J0s,f + J0s,r)(n p − ni,eff²)/(q ni,eff² Δn W),
//
// with Sf and Sr of the surfaces at the state at Δn, related to J0s by surface.SeffFromJ0s. For
// an injection-independent ni,eff, (n p − ni,eff²)/Δn = N + Δn with N = n0 + p0 (the majority
// density), so this is 1/τeff = 1/τbulk + (J0s,f + J0s,r)(N + Δn)/(q ni,eff² W), the
// relation Seff = J0s (N + Δn)/(q ni²) of A. Cuevas and D. Macdonald, Solar Energy 76, 255
// (2004) with ni,eff at the injected state
// (which carries injection-dependent band-gap narrowing); the slope method of D. E. Kane and
// R. M. Swanson (see J0sFit) rests on it. It agrees with Lifetime to better
// than 1 % when (Sf + Sr) W/D < 0.03 (see surface.LifetimeLowS) and overestimates the
// surface recombination rate beyond. Errors as for Lifetime.
func (s Sample) LifetimeJ0s(dn float64) (float64, error) {
	p, err := s.eval("Sample.LifetimeJ0s", dn, false)
	if err != nil {
		return 0, err
	}
	rate := 1/p.tauBulk + (p.sf+p.sr)/s.W
	if rate == 0 {
		return math.Inf(1), nil
	}
	return 1 / rate, nil
}

// Lifetimes returns Lifetime at each excess carrier density of dn (cm^-3), in dst if it has
// the length of dn (otherwise in a new slice). It stops at the first error, naming the point.
func (s Sample) Lifetimes(dn, dst []float64) ([]float64, error) {
	if len(dst) != len(dn) {
		dst = make([]float64, len(dn))
	}
	for i, d := range dn {
		t, err := s.Lifetime(d)
		if err != nil {
			return nil, fmt.Errorf("%w (point %d)", err, i)
		}
		dst[i] = t
	}
	return dst, nil
}

// SteadyState returns the excess carrier density Δn in cm^-3 of the sample under the uniform
// generation rate g in cm^-3 s^-1 (finite, >= 0): the Δn at which Δn/τeff(Δn) = g, with τeff
// from Lifetime, by SteadyStateExcess. It returns 0 for g = 0 and the errors of
// SteadyStateExcess and Lifetime.
func (s Sample) SteadyState(g float64) (float64, error) {
	if err := s.check("Sample.SteadyState"); err != nil {
		return 0, err
	}
	return SteadyStateExcess(g, s.Lifetime)
}

// SteadyStateSuns returns the excess carrier density Δn in cm^-3 of the sample under a light
// intensity of suns suns (finite, >= 0) with optics o: SteadyState at the generation rate
// o.Generation(suns, s.W).
func (s Sample) SteadyStateSuns(suns float64, o Optics) (float64, error) {
	if err := s.check("Sample.SteadyStateSuns"); err != nil {
		return 0, err
	}
	g, err := o.Generation(suns, s.W)
	if err != nil {
		return 0, err
	}
	return s.SteadyState(g)
}

// ImpliedVoc returns the implied open-circuit voltage in V of the sample under a light
// intensity of suns suns (finite, >= 0) with optics o: recomb.State.ImpliedVoc (q iVoc =
// kT ln(n p/ni,eff²)) at the steady-state Δn of SteadyStateSuns. It returns 0 for suns = 0.
func (s Sample) ImpliedVoc(suns float64, o Optics) (float64, error) {
	dn, err := s.SteadyStateSuns(suns, o)
	if err != nil {
		return 0, err
	}
	st, err := s.Wafer.State(dn)
	if err != nil {
		return 0, fmt.Errorf("lifetime: Sample.ImpliedVoc: %w", err)
	}
	return st.ImpliedVoc()
}

// Limits of Sample.ImpliedJV.
const (
	// MinJVPoints is the fewest points Sample.ImpliedJV accepts.
	MinJVPoints = 10
	// JVLowSuns is the lowest light intensity, in suns, of the curve of Sample.ImpliedJV: its
	// first point carries a recombination current of 1e-4 of the one-sun photocurrent, well
	// below the maximum power point of any silicon device.
	JVLowSuns = 1e-4
)

// MaxJVPoints is the largest number of points ImpliedJV computes: more is far beyond any use,
// and is refused rather than run for minutes.
const MaxJVPoints = 100000

// ImpliedJV returns the implied current–voltage curve of the sample at one sun with optics o,
// sampled at n points (n >= MinJVPoints) spaced evenly in ln Δn from the steady state at
// JVLowSuns suns to the steady state at one sun (the implied open circuit):
//
//	V = iVoc(Δn),   J = Jph − q W Δn/τeff(Δn),   Jph = o.Photocurrent(),
//
// the photogenerated current less the recombination current of the sample at the
// quasi-Fermi-level separation V (by superposition, the sample's recombination being the
// same in the dark and under light at equal Δn; uniform Δn assumed). τeff is Lifetime. The
// curve's Voc is the one-sun iVoc and its Jsc is Jph; JV.MaxPower gives the implied fill
// factor. Errors are those of SteadyStateSuns and Lifetime, or an invalid n.
func (s Sample) ImpliedJV(o Optics, n int) (JV, error) {
	if n < MinJVPoints || n > MaxJVPoints {
		return JV{}, fmt.Errorf("lifetime: Sample.ImpliedJV: number of points n must be in [%d, %d], got %d", MinJVPoints, MaxJVPoints, n)
	}
	jph, err := o.Photocurrent()
	if err != nil {
		return JV{}, err
	}
	hi, err := s.SteadyStateSuns(1, o)
	if err != nil {
		return JV{}, err
	}
	lo, err := s.SteadyStateSuns(JVLowSuns, o)
	if err != nil {
		return JV{}, err
	}
	c := JV{V: make([]float64, n), J: make([]float64, n), Jsc: jph}
	step := math.Log(hi/lo) / float64(n-1)
	for i := range n {
		dn := lo * math.Exp(float64(i)*step)
		if i == n-1 {
			dn = hi
		}
		tau, err := s.Lifetime(dn)
		if err != nil {
			return JV{}, err
		}
		st, err := s.Wafer.State(dn)
		if err != nil {
			return JV{}, fmt.Errorf("lifetime: Sample.ImpliedJV: %w", err)
		}
		if c.V[i], err = st.ImpliedVoc(); err != nil {
			return JV{}, fmt.Errorf("lifetime: Sample.ImpliedJV: %w", err)
		}
		c.J[i] = jph - silicon.ElementaryCharge*s.W*dn/tau
	}
	c.Voc = c.V[n-1]
	return c, nil
}
