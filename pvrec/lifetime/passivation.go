package lifetime

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/optimize"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// PassivationOptions configures FitPassivation.
type PassivationOptions struct {
	// Start is the extended-SRH model to fit: its Dit gives the shape of the interface-state
	// distribution (scaled by the fit), its cross sections and Qf the starting point. Its Dit,
	// SigmaN and SigmaP must be set.
	Start surface.ExtendedSRH
	// FreeSigmaRatio also fits k = σn/σp (keeping sqrt(σn σp) fixed, since only the product
	// Dit·σ is set by the data where one carrier limits); it needs ConstantSigma cross sections.
	FreeSigmaRatio bool
	// DnMin, DnMax bound the points used, cm^-3; zero means 1e12 and surface.MaxExcess.
	DnMin, DnMax float64
}

// PassivationFit is the result of FitPassivation. Uncertainties are one standard error from
// the Jacobian of the log residuals at the optimum (covariance s² (JᵀJ)⁻¹, s² the residual
// variance): meaningful when Reliable is true; 0 where the covariance could not be formed.
type PassivationFit struct {
	Model          surface.ExtendedSRH // the fitted interface: Start with the fitted Qf, scaled Dit (and σ ratio)
	Qf, QfErr      float64             // fixed charge and its standard error, cm^-2
	DitFactor      float64             // fitted scale of Start's Dit, dimensionless
	DitFactorErr   float64             // its standard error
	SigmaRatio     float64             // k = σn/σp of the fitted model (of Start if not free)
	SigmaRatioErr  float64             // its standard error (0 if not free)
	RMS            float64             // root-mean-square residual of ln τeff
	N              int                 // points used
	CorrQfDit      float64             // correlation of the Qf and ln DitFactor estimates, in [−1, 1]
	Response       float64             // rms change of ln τeff for a unit step along the parameters' weakest combination
	OtherSignRatio float64             // cost of the best fit with Qf of the other sign over this one's (>= 1, at most 1e100)
	Reliable       bool                // false when a warning below means the numbers are not determined
	Warnings       []string            // degeneracies and other reasons to distrust the fit
}

// Thresholds of FitPassivation's warnings (our choices). MinResponse: the data must change by
// at least this rms in ln τeff for a unit step of the parameters along their weakest
// combination (1e12 cm^-2 of Qf, a factor e of Dit); below it only a combination is
// determined, however small the noise. DegenerateCorrelation with MaxRelErr: correlated
// estimates whose standard errors exceed MaxRelErr of the values. SignAmbiguity: a fixed
// charge of the other sign fitting within this cost ratio.
const (
	MinResponse           = 0.01
	DegenerateCorrelation = 0.95
	MaxRelErr             = 0.1
	SignAmbiguity         = 2.0
)

// FitPassivation fits the extended-SRH interface of a symmetric sample to its measured
// effective lifetime: the fixed charge Qf, a scale factor of the interface-state density
// (Start's Dit shape times DitFactor), and optionally the capture-cross-section ratio, by least
// squares on ln τeff with gonum's Nelder–Mead simplex. s gives the wafer, thickness and bulk
// mechanisms (known or fitted elsewhere); its Front and Rear are replaced by the model being
// fitted (both sides, a symmetric sample). dn and tau are the measured Δn (cm^-3) and τeff (s).
//
// The minimisation runs twice, once with Qf kept to the sign of Start.Qf (negative for a start
// of 0) and once to the other sign, starting from ±Start.Qf (the cost has one valley per sign:
// accumulation and inversion of the same wafer can give similar τeff), and keeps the better;
// OtherSignRatio says how much worse the other sign fits. The fit warns, and clears Reliable, when the data barely respond along some combination of the parameters
// (Response below MinResponse: only a combination is determined, typically with data in low
// injection only, where the Seff of a strongly accumulated surface scales as Dit/Qf²; add
// high-injection points), when correlated estimates (|CorrQfDit| > DegenerateCorrelation) have
// standard errors above MaxRelErr, when the other sign fits within SignAmbiguity, or when
// the covariance is singular.
//
// Deterministic: the same inputs give the same fit. It returns an error for an invalid s (other
// than its surfaces), fewer than 5 points in the window, NaN or non-positive data, a Start
// without Dit or cross sections, FreeSigmaRatio with non-constant cross sections, or a model
// error at the starting point.
func FitPassivation(s Sample, dn, tau []float64, o PassivationOptions) (PassivationFit, error) {
	if s.Wafer == nil || s.Wafer.Material() == nil || s.Bulk == nil {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: sample needs Wafer and Bulk")
	}
	if err := check.Positive("lifetime: FitPassivation", "thickness W", s.W, "cm"); err != nil {
		return PassivationFit{}, err
	}
	st := o.Start
	if st.Dit == nil || st.SigmaN == nil || st.SigmaP == nil {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: Start needs Dit, SigmaN and SigmaP")
	}
	if err := check.Finite("lifetime: FitPassivation", "Start.Qf", st.Qf, "cm^-2"); err != nil {
		return PassivationFit{}, err
	}
	var sn, sp surface.ConstantSigma
	if o.FreeSigmaRatio {
		var ok1, ok2 bool
		sn, ok1 = st.SigmaN.(surface.ConstantSigma)
		sp, ok2 = st.SigmaP.(surface.ConstantSigma)
		if !ok1 || !ok2 || !(sn > 0) || !(sp > 0) {
			return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: FreeSigmaRatio needs ConstantSigma cross sections > 0")
		}
	}
	lo, hi := o.DnMin, o.DnMax
	if lo == 0 {
		lo = 1e12
	}
	if hi == 0 {
		hi = surface.MaxExcess
	}
	if err := check.Positive("lifetime: FitPassivation", "DnMin", lo, "cm^-3"); err != nil {
		return PassivationFit{}, err
	}
	if !(hi > lo) || hi > surface.MaxExcess {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: window [%g, %g] cm^-3 must be increasing and end at most at surface.MaxExcess = %g", lo, hi, float64(surface.MaxExcess))
	}
	if len(dn) != len(tau) {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: %d Δn but %d τeff values", len(dn), len(tau))
	}
	var xs, lt []float64
	for i := range dn {
		if err := check.Positive("lifetime: FitPassivation", fmt.Sprintf("Δn[%d]", i), dn[i], "cm^-3"); err != nil {
			return PassivationFit{}, err
		}
		if err := check.Positive("lifetime: FitPassivation", fmt.Sprintf("τeff[%d]", i), tau[i], "s"); err != nil {
			return PassivationFit{}, err
		}
		if dn[i] >= lo && dn[i] <= hi {
			xs, lt = append(xs, dn[i]), append(lt, math.Log(tau[i]))
		}
	}
	const minPoints = 5
	if len(xs) < minPoints {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: %d points in [%g, %g] cm^-3, need at least %d", len(xs), lo, hi, minPoints)
	}
	np := 2
	if o.FreeSigmaRatio {
		np = 3
	}
	// The parameters: p[0] = Qf/1e12 cm^-2, p[1] = ln DitFactor, p[2] = ln(k/k_start)/2.
	model := func(p []float64) surface.ExtendedSRH {
		m := st
		m.Qf = 1e12 * p[0]
		m.Dit = surface.ScaledDit{Of: st.Dit, Factor: math.Exp(p[1])}
		if o.FreeSigmaRatio {
			f := math.Exp(p[2])
			m.SigmaN, m.SigmaP = surface.ConstantSigma(float64(sn)*f), surface.ConstantSigma(float64(sp)/f)
		}
		return m
	}
	var modelErr error
	residuals := func(p, r []float64) bool {
		t := s
		t.Front, t.Rear = model(p), nil
		for i, x := range xs {
			v, err := t.Lifetime(x)
			if err != nil {
				modelErr = err
				return false
			}
			r[i] = math.Log(v) - lt[i]
		}
		return true
	}
	r := make([]float64, len(xs))
	sign := 1.0 // the half-plane of Qf a run keeps to
	cost := func(p []float64) float64 {
		if math.Abs(p[0]) > surface.MaxFixedCharge/1e12 || math.Abs(p[1]) > 50 || (np == 3 && math.Abs(p[2]) > 20) || p[0]*sign < 0 {
			return math.Inf(1) // outside the model's range or the run's sign: the simplex turns back
		}
		if !residuals(p, r) {
			return math.Inf(1)
		}
		var c float64
		for _, v := range r {
			c += v * v
		}
		return c
	}
	start := make([]float64, np)
	start[0] = st.Qf / 1e12
	if !residuals(start, r) {
		return PassivationFit{}, fmt.Errorf("lifetime: FitPassivation: at the starting point: %w", modelErr)
	}
	run := func(x0 []float64) (*optimize.Result, error) {
		return optimize.Minimize(optimize.Problem{Func: cost}, x0,
			&optimize.Settings{FuncEvaluations: 4000, Converger: &optimize.FunctionConverge{Absolute: 1e-12, Relative: 1e-10, Iterations: 60}},
			&optimize.NelderMead{SimplexSize: 0.5})
	}
	if start[0] == 0 {
		start[0] = -1 // a neutral start: begin with negative charge, the other run takes positive
	}
	sign = math.Copysign(1, start[0])
	best, err := run(start)
	if err != nil && best == nil {
		return PassivationFit{}, check.NoConvergence("lifetime: FitPassivation: %v", err)
	}
	other := append([]float64(nil), start...)
	other[0] = -other[0]
	sign = -sign
	alt, _ := run(other)
	if alt != nil && alt.F < best.F && !math.IsInf(alt.F, 0) {
		best, alt = alt, best
	}
	if math.IsInf(best.F, 0) || math.IsNaN(best.F) {
		return PassivationFit{}, check.NoConvergence("lifetime: FitPassivation: no fit found (the model fails everywhere the simplex went: %v)", modelErr)
	}
	p := best.X
	fit := PassivationFit{Model: model(p), Qf: 1e12 * p[0], DitFactor: math.Exp(p[1]), N: len(xs), Reliable: true}
	fit.SigmaRatio = float64(ratio(fit.Model))
	fit.RMS = math.Sqrt(best.F / float64(len(xs)))
	// The other sign's cost over this one's, at most 1e100 (no fit of the other sign, or a
	// perfect fit of this one).
	fit.OtherSignRatio = 1e100
	if alt != nil && !math.IsInf(alt.F, 0) && alt.F < 1e100*best.F {
		fit.OtherSignRatio = alt.F / best.F
	}
	if fit.OtherSignRatio < SignAmbiguity {
		fit.Reliable = false
		fit.Warnings = append(fit.Warnings, fmt.Sprintf("a fixed charge of the other sign fits nearly as well (cost ratio %.3g < %g): the sign of Qf is not determined by these data", fit.OtherSignRatio, SignAmbiguity))
	}
	if math.Abs(fit.Qf) > 0.99*surface.MaxFixedCharge || math.Abs(p[1]) > 0.99*50 {
		fit.Reliable = false
		fit.Warnings = append(fit.Warnings, fmt.Sprintf("the fit ran to the edge of the searched range (Qf = %.3g cm^-2, Dit factor %.3g): the data set only a combination of the parameters, such as Dit/Qf² for a strongly accumulated surface", fit.Qf, fit.DitFactor))
	}
	if err := fit.uncertainty(p, residuals, len(xs), np); err != nil {
		fit.Reliable = false
		fit.Warnings = append(fit.Warnings, err.Error())
	}
	return fit, nil
}

// ratio returns σn/σp of m at E = Ei.
func ratio(m surface.ExtendedSRH) float64 { return m.SigmaN.Sigma(0) / m.SigmaP.Sigma(0) }

// uncertainty fills the standard errors and the correlation from the Jacobian of the residuals
// at p (central differences of step 1e-4 in each parameter).
func (f *PassivationFit) uncertainty(p []float64, residuals func(p, r []float64) bool, n, np int) error {
	if n <= np {
		return errors.New("as many parameters as points: no uncertainty")
	}
	const h = 1e-4
	jac := mat.NewDense(n, np, nil)
	rp, rm := make([]float64, n), make([]float64, n)
	for j := 0; j < np; j++ {
		q := append([]float64(nil), p...)
		q[j] = p[j] + h
		okp := residuals(q, rp)
		q[j] = p[j] - h
		okm := residuals(q, rm)
		if !okp || !okm {
			return errors.New("the model fails next to the optimum: no uncertainty")
		}
		for i := 0; i < n; i++ {
			jac.Set(i, j, (rp[i]-rm[i])/(2*h))
		}
	}
	var svd mat.SVD
	if !svd.Factorize(jac, mat.SVDNone) {
		return errors.New("no singular values of the Jacobian: no uncertainty")
	}
	sv := svd.Values(nil)
	f.Response = sv[len(sv)-1] / math.Sqrt(float64(n))
	if f.Response < MinResponse {
		return fmt.Errorf("the data barely respond to one combination of the parameters (ln τeff changes by %.2g rms for a unit step along it, below %g): only a combination of Qf and Dit is determined; add high-injection points or a second sample", f.Response, MinResponse)
	}
	var jtj mat.SymDense
	jtj.SymOuterK(1, jac.T())
	var chol mat.Cholesky
	if ok := chol.Factorize(&jtj); !ok {
		return fmt.Errorf("the normal matrix is singular: Qf and Dit are not separated by these data, only a combination is determined")
	}
	var cov mat.SymDense
	if err := chol.InverseTo(&cov); err != nil {
		return fmt.Errorf("no covariance: %v", err)
	}
	s2 := f.RMS * f.RMS * float64(n) / float64(n-np)
	cov.ScaleSym(s2, &cov)
	f.QfErr = 1e12 * math.Sqrt(cov.At(0, 0))
	f.DitFactorErr = f.DitFactor * math.Sqrt(cov.At(1, 1))
	if np == 3 {
		f.SigmaRatioErr = f.SigmaRatio * 2 * math.Sqrt(cov.At(2, 2))
	}
	if d := math.Sqrt(cov.At(0, 0) * cov.At(1, 1)); d > 0 {
		f.CorrQfDit = cov.At(0, 1) / d
	}
	if math.Abs(f.CorrQfDit) > DegenerateCorrelation && (f.QfErr > MaxRelErr*math.Abs(f.Qf) || f.DitFactorErr > MaxRelErr*f.DitFactor) {
		return fmt.Errorf("the estimates of Qf and Dit are strongly correlated (ρ = %.3f) and uncertain (Qf ± %.2g cm^-2, Dit factor ± %.2g): only a combination of them is determined; add high-injection points or a second sample",
			f.CorrQfDit, f.QfErr, f.DitFactorErr)
	}
	return nil
}
