// Package lifetime models lifetime samples and analyses their measurements: a wafer with its
// bulk recombination and two surfaces, its effective lifetime τeff(Δn), its steady state and
// implied voltage under light, and the inverse, from a measured photoconductance trace to
// τeff, iVoc, J0s and Seff. It builds on the one wafer state of pvrec (recomb.Bulk and
// recomb.State), the surface models of package surface and the mobility of package silicon.
//
// Forward model
//
//   - Sample: wafer, thickness, bulk mechanisms, front and rear surfaces (any surface.Model;
//     surface.ConstantJ0s for a J0s per side; Rear nil for a symmetric sample).
//   - Sample.Lifetime: the exact fundamental mode for unequal surfaces of A. B. Sproul,
//     J. Appl. Phys. 76, 2851 (1994) (surface.EffectiveLifetime), with the ambipolar
//     diffusivity at Δn. Sample.LifetimeJ0s: the uniform-Δn (J0s) form
//     1/τeff = 1/τbulk + (J0s,f + J0s,r)(N + Δn)/(q ni,eff² W), Seff from J0s as in
//     A. Cuevas and D. Macdonald, Solar Energy 76, 255 (2004), with ni,eff at the injected state.
//   - Optics: photon flux of one sun and absorbed fraction (inputs; OneSunFlux is a common
//     round value, not a default). GenerationRate, SteadyStateExcess, Sample.SteadyState and
//     SteadyStateSuns: the steady state under uniform generation. Sample.ImpliedVoc: iVoc(suns).
//   - Sample.ImpliedJV and JV.MaxPower: the implied J–V curve by superposition and the implied
//     fill factor (local diode fit around the maximum power point).
//   - Sample.Simulate: the noise-free photoconductance trace of a measurement, from the
//     continuity equation (fourth-order Runge–Kutta; ETD2RK of S. M. Cox and P. C. Matthews,
//     J. Comput. Phys. 176, 430 (2002) where the light changes slowly).
//
// Measurements
//
//   - Trace, Table and their CSV formats (ReadTrace, ReadTable, WriteTrace, WriteTable; see
//     docs/lifetime-csv.md).
//   - Conductance and ExcessFromConductance: Δσ W = q (μn + μp)(Δn) Δn W, solved
//     self-consistently with the injection-dependent mobility sum.
//   - Analysis.Analyze: τeff by the quasi-steady-state, transient or generalised analysis of
//     H. Nagel, C. Berge and A. G. Aberle, J. Appl. Phys. 86, 6218 (1999), with dΔn/dt by a
//     local least-squares parabola (Savitzky–Golay; A. Savitzky and M. J. E. Golay, Anal.
//     Chem. 36, 1627 (1964)) over a window adapted to the local time scale; iVoc and implied
//     suns per point. Analysis.AnalyzeTable does the same for a processed τeff(Δn) table.
//   - Result.J0s: the slope method of D. E. Kane and R. M. Swanson, 18th IEEE PVSC, 578 (1985)
//     on 1/τeff − 1/τintrinsic against (n p − ni,eff²)/(q ni,eff² Δn W), with the standard
//     error of the slope, the bulk-SRH intercept and a correction, derived from Sproul's
//     relation, for the non-uniform Δn that recombining surfaces cause.
//   - SeffFromLifetime and Result.Seff: Seff of a symmetric sample from τeff with an assumed
//     bulk lifetime (recomb.Sum{} for the upper bound with an infinite one).
//   - Result.LifetimeAt, Result.ImpliedVoc, Result.ImpliedJV: τeff at a reporting level, iVoc at
//     a light intensity and the implied J–V curve, read from the data by local fits.
//   - Warnings (returned as data, never printed): a lifetime rising towards low injection
//     (trapping, depletion-region modulation), τeff above the intrinsic limit, points outside
//     the analysis range, coarse sampling, fitting windows with few points or not covered.
//     Excluded points are counted by reason.
//
// Our own choices where the methods leave them open (smoothing window, fitting window, local
// fits, warning thresholds, the analysis range) are documented where they are defined and
// marked "our choice, no source". Units: cm, cm^-3, s, A/cm^2, V, S (siemens), suns.
package lifetime
