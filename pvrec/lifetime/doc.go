// Package lifetime models lifetime samples and will analyse their measurements: a wafer with
// its bulk mechanisms and two surfaces, its effective lifetime τeff(Δn), and its steady state
// under illumination.
//
// For now it holds the steady state of a sample under uniform generation:
//
//   - GenerationRate: G = Jph/(q W), the volume-averaged generation rate of a wafer that
//     collects a photocurrent density Jph (definition).
//   - SteadyStateExcess: the Δn at which Δn/τ(Δn) = G, for any lifetime function.
//
// Units: cm, cm^-3, s, A/cm^2.
package lifetime
