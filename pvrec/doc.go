// Package pvrec is the root of a library for recombination analysis in crystalline-silicon
// solar cells: carrier statistics, intrinsic and defect recombination, surface and
// diffused-region saturation-current densities, and the voltages they allow.
//
// The physics lives in sub-packages, one concept each, ordered from the floor up:
//
//   - fermi: Fermi–Dirac integrals and their inverse (pure mathematics).
//   - silicon: the material model set at a temperature: band gap, densities of states,
//     intrinsic density, band-gap narrowing, statistics, equilibrium carriers, mobility and
//     resistivity.
//   - recomb: bulk recombination (radiative, Auger, Shockley–Read–Hall with a defect
//     catalogue), their sums and lifetimes.
//   - surface: Seff and J0s, wafer effective lifetime (Sproul 1994), and the extended SRH
//     interface model with fixed charge and interface defects, all evaluated at recomb's
//     wafer state.
//   - profile: doping profiles (analytic and measured, with a CSV reader), junction depth,
//     dose and sheet resistance.
//   - j0: saturation-current densities of bases and diffused regions: integral forms and the
//     numerical solver.
//   - lifetime: lifetime samples (bulk + surfaces → τeff(Δn), steady state, iVoc(suns),
//     implied J–V and FF, simulated traces) and the analysis of photoconductance traces and
//     τeff tables (QSS, transient, generalised; J0s by Kane–Swanson; Seff; CSV formats in
//     docs/lifetime-csv.md), and the fit of an interface's Qf and Dit to τeff (FitPassivation).
//   - spectroscopy: injection- and temperature-dependent lifetime spectroscopy of one SRH
//     level (fit with intervals and ambiguity flags, solution surface, linearised form).
//   - cell: a cell built from its parts: recombination budget, Voc, J–V curves, fill factor,
//     efficiency, loss ranking, temperature coefficients, intrinsic limit; implied and
//     ideal-diode voltages.
//   - sweep: concurrent evaluation over an index range, results in input order, panics
//     turned into errors (no physics; used by j0 and the notebooks).
//   - uncertainty: how sure a result is: its spread over the published model family, Monte
//     Carlo propagation of input distributions, elasticities and tornado data (beside sweep;
//     any computation from floor 4 up, as the caller's function).
//   - plots: figure builders on gonum/plot with one house style (lines, bar charts).
//   - nb: display helpers for GoNB notebooks.
//
// Units are the field's throughout: cm, cm^-3, s, A/cm^2, V, K, eV.
//
// Errors: every package reports an argument outside a model's validity range with an error
// matching ErrOutOfRange (errors.Is; errors.As with *RangeError gives the argument and the
// range) and a solver that could not meet its tolerance with one matching ErrNoConvergence.
package pvrec

// Version is the version of the pvrec library, stamped on results and figures.
const Version = "0.1.0-dev"
