// Package lifetime models lifetime samples: a wafer with its bulk recombination and two
// surfaces, its effective lifetime τeff(Δn), and its steady state and implied voltage under
// light. It builds on the one wafer state of pvrec (recomb.Bulk and recomb.State), the surface models of package surface and the mobility of package silicon.
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
//
// Measurements
//
//   - Trace, Table and their CSV formats (ReadTrace, ReadTable, WriteTrace, WriteTable; see
//     docs/lifetime-csv.md).
//
// Units: cm, cm^-3, s, A/cm^2, V, S (siemens), suns.
package lifetime
