package lifetime

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Integration steps of Sample.Simulate.
const (
	// simStepFraction is the largest Runge–Kutta step as a fraction of the current effective
	// lifetime: the local error of the fourth-order step is then (0.1)^5/120 ≈ 1e-7 relative,
	// and errors are damped on the time scale of the lifetime.
	simStepFraction = 0.1
	// simStiff is the number of Runge–Kutta steps to the next sample time above which, under
	// light, the interval counts as stiff (the lifetime far shorter than the time scale of
	// the light) and exponential steps are taken instead.
	simStiff = 20
	// simLightChange is the largest relative change of the generation rate over one exponential
	// step. In the stiff limit the step is a Newton step towards the new steady state, whose
	// error is about c (ΔG/G)²/2 with c = d ln R'/d ln Δn (at most 2, for Auger recombination):
	// below 4e-6 relative.
	simLightChange = 0.002
)

// Simulate returns the noise-free trace that a photoconductance measurement of the sample
// records at the times t (s, strictly increasing, at least two) under the light intensity
// suns(t) in suns (finite, >= 0; nil for darkness, a free decay) with optics o, starting from
// the excess carrier density dn0 in cm^-3 (finite, >= 0) at t[0]. It integrates the
// continuity equation of the wafer-averaged excess density,
//
//	dΔn/dt = G(t) − Δn/τeff(Δn),   G = o.Generation(suns(t), W),
//
// with τeff from Lifetime (uniform Δn; the equation the analyses of Nagel, Berge and Aberle
// (1999) invert), by the classical fourth-order Runge–Kutta method with steps of at most a
// tenth of τeff, or, where the light changes far more slowly than τeff (a stiff interval, such
// as a quasi-steady-state flash lasting hundreds of lifetimes), by the second-order
// exponential time-differencing method ETD2RK of S. M. Cox and P. C. Matthews, J. Comput.
// Phys. 176, 430 (2002), linearised about the start of each step and with steps over which
// the generation changes by at most 0.2 % (gonum has no solver of ordinary differential
// equations). It records
// the photoconductance of Conductance and the illumination (Unit Suns; nil for suns = nil).
// It is the forward model behind the package's round-trip tests and demo data. It returns an
// error naming the argument, or an error of Lifetime (e.g. a Δn outside a surface model's
// range).
func (s Sample) Simulate(o Optics, t []float64, suns func(t float64) float64, dn0 float64) (Trace, error) {
	const ctx = "Sample.Simulate"
	if err := s.check(ctx); err != nil {
		return Trace{}, err
	}
	if len(t) < 2 {
		return Trace{}, fmt.Errorf("lifetime: %s: need at least 2 times, got %d", ctx, len(t))
	}
	for i, ti := range t {
		if err := check.Finite("lifetime: "+ctx, fmt.Sprintf("time t[%d]", i), ti, "s"); err != nil {
			return Trace{}, err
		}
		if i > 0 && !(ti > t[i-1]) {
			return Trace{}, fmt.Errorf("lifetime: %s: times must increase: t[%d] = %g s after %g s", ctx, i, ti, t[i-1])
		}
	}
	if err := check.Density("lifetime: "+ctx, "initial excess density dn0", dn0); err != nil {
		return Trace{}, err
	}
	perSun := 0.0
	if suns != nil {
		g, err := o.Generation(1, s.W)
		if err != nil {
			return Trace{}, err
		}
		perSun = g
	}
	light := func(tt float64) (float64, error) {
		if suns == nil {
			return 0, nil
		}
		v := suns(tt)
		if !(v >= 0) || math.IsInf(v, 0) {
			return 0, fmt.Errorf("lifetime: %s: suns(%g s) = %g, want finite and >= 0", ctx, tt, v)
		}
		return v, nil
	}
	// rate returns dΔn/dt at time tt and density dn, and τeff there (+Inf at dn <= 0).
	rate := func(tt, dn float64) (float64, float64, error) {
		l, err := light(tt)
		if err != nil {
			return 0, 0, err
		}
		if dn <= 0 {
			return l * perSun, math.Inf(1), nil
		}
		tau, err := s.Lifetime(dn)
		if err != nil {
			return 0, 0, err
		}
		return l*perSun - dn/tau, tau, nil
	}
	tr := Trace{Time: append([]float64(nil), t...), Conductance: make([]float64, len(t))}
	if suns != nil {
		tr.Illumination, tr.Unit = make([]float64, len(t)), Suns
	}
	dn := dn0
	for i := range t {
		if i > 0 {
			for tt := t[i-1]; tt < t[i]; {
				k1, tau, err := rate(tt, dn)
				if err != nil {
					return Trace{}, err
				}
				h := math.Min(t[i]-tt, simStepFraction*tau)
				if suns != nil && t[i]-tt > simStiff*h {
					next, hs, err := s.etdStep(tt, t[i]-tt, dn, tau, simStiff*h, light, perSun)
					if err != nil {
						return Trace{}, err
					}
					if hs > 0 {
						dn, tt = next, tt+hs
						if t[i]-tt < 1e-9*hs {
							tt = t[i]
						}
						continue
					}
				}
				if t[i]-(tt+h) < 1e-9*h { // land on t[i] without a sliver step
					h = t[i] - tt
				}
				k2, _, err := rate(tt+h/2, dn+h/2*k1)
				if err != nil {
					return Trace{}, err
				}
				k3, _, err := rate(tt+h/2, dn+h/2*k2)
				if err != nil {
					return Trace{}, err
				}
				k4, _, err := rate(tt+h, dn+h*k3)
				if err != nil {
					return Trace{}, err
				}
				dn += h / 6 * (k1 + 2*k2 + 2*k3 + k4)
				if h == t[i]-tt {
					tt = t[i]
				} else {
					tt += h
				}
			}
		}
		c, err := Conductance(s.Wafer, s.W, math.Max(dn, 0))
		if err != nil {
			return Trace{}, fmt.Errorf("lifetime: %s: at t = %g s: %w", ctx, t[i], err)
		}
		tr.Conductance[i] = c
		if suns != nil {
			if tr.Illumination[i], err = light(t[i]); err != nil {
				return Trace{}, err
			}
		}
	}
	return tr, nil
}

// etdStep takes one exponential step of dΔn/dt = G − R(Δn), R = Δn/τeff(Δn), from time tt
// and density dn (lifetime tau there), as long as possible up to rem while the generation
// changes by at most simLightChange: ETD2RK (Cox and Matthews 2002) with the linear part
// −J Δn, J = R'(dn) (by a forward difference of R), so that the remainder
//
//	N(t, y) = G(t) − R(y) + J y
//
// is not stiff near dn (an exponential Rosenbrock form), z = −J h:
//
//	a = dn e^z + N(tt, dn) h φ1(z),   Δn(tt + h) = a + (N(tt + h, a) − N(tt, dn)) h φ2(z),
//
// φ1(z) = (e^z − 1)/z, φ2(z) = (e^z − 1 − z)/z². For h ≫ 1/J each stage is a Newton step
// towards the steady state of the current light. It returns the new density and the step, or
// a step of 0 if no step longer than minStep keeps the light change within bounds.
func (s Sample) etdStep(tt, rem, dn, tau, minStep float64, light func(float64) (float64, error), perSun float64) (float64, float64, error) {
	l0, err := light(tt)
	if err != nil {
		return 0, 0, err
	}
	h := rem
	var lh float64
	for {
		if lh, err = light(tt + h); err != nil {
			return 0, 0, err
		}
		if math.Abs(lh-l0) <= simLightChange*math.Max(l0, lh) {
			break
		}
		if h /= 2; h <= minStep {
			return 0, 0, nil
		}
	}
	const eps = 1e-6
	d1 := dn * (1 + eps)
	t1, err := s.Lifetime(d1)
	if err != nil {
		return 0, 0, err
	}
	r0 := dn / tau
	jac := (d1/t1 - r0) / (d1 - dn) // R'(dn), s^-1
	if !(jac > 0) {
		return 0, 0, nil // recombination not increasing here: leave the step to Runge–Kutta
	}
	n0 := l0*perSun - r0 + jac*dn
	z := -jac * h
	e := math.Exp(z)
	phi1 := math.Expm1(z) / z
	phi2 := (math.Expm1(z) - z) / (z * z)
	a := dn*e + n0*h*phi1
	ta, err := s.Lifetime(a)
	if err != nil {
		return 0, 0, err
	}
	n1 := lh*perSun - a/ta + jac*a
	return a + (n1-n0)*h*phi2, h, nil
}
