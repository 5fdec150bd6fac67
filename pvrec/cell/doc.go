// Package cell answers "what does this region, surface or defect cost my cell in voltage and
// efficiency?": from a cell described by its parts, the recombination budget, Voc, the
// implied and full J–V curves, fill factor, efficiency, the ranking of losses, temperature
// coefficients and the intrinsic limit; and the implied and ideal-diode voltage relations
// under them.
//
// A cell is a Design: a Base (thickness, doping, bulk mechanisms of package recomb), Parts
// covering the front and the rear with their area fractions (a J0 given as a number, a
// j0.Region solved with a j0.Solver, or a surface.Model evaluated at the operating point),
// an optional second diode J02, series and shunt resistances, the photogenerated current
// Jsc (an input: no optics) and the incident power. New checks it and returns a Device, the
// prepared form on which everything is evaluated:
//
//   - Budget (RecombinationAtExcess, Recombination): J_rec with each term's current, share
//     and J0 equivalent, in the lumped one-dimensional J0-budget picture (common practice):
//     uniform Δn in a quasi-neutral base whose n p = ni,eff² exp(qV/kT) sets the internal
//     voltage V (band-gap narrowing and degeneracy of the base included),
//     J_rec = Σ f J0 (n p/ni,eff² − 1) + Σ f q Seff(Δn) Δn + q W_b R_bulk(Δn) + J02 (e^(qV/2kT) − 1) + V/Rsh.
//   - Operating points (OpenCircuit, Voc, ShortCircuit, MaxPower, OperatingPoint) and J–V
//     curves (Curve, CurveAt; Implied for the curve without series resistance), all
//     parameterised by the base's Δn so that no voltage has to be inverted twice: each
//     point at a given terminal voltage is a bracketed Brent root in ln Δn (package
//     internal/roots), never an unconverged point.
//   - Result (Solve): Voc, Jsc, Vmp, Jmp, FF, pseudo FF, efficiency, the Δn of the open
//     circuit and of the maximum-power point, the budgets there, the material's model set.
//   - Losses: each term (and Rs) made perfect in turn, with its ΔVoc, ΔFF and Δη, sorted;
//     the FF lost to Rs (pFF − FF) and to non-ideal-diode recombination (ideal FF at the
//     same Voc − pFF).
//   - Temperature (At, TemperatureCoefficients): the model set re-evaluated at T, regions
//     re-solved, J0s given as numbers scaled as ni²(T) and J02 as ni(T) (stated in the
//     result's notes), central differences for dVoc/dT, dFF/dT, dη/dT.
//   - Design.IntrinsicLimit: the cell whose only loss is intrinsic recombination of the base
//     (A. Richter, M. Hermle and S. W. Glunz, IEEE J. Photovolt. 3, 1184 (2013), for a given
//     Jsc).
//
// The voltage relations of a uniform bulk and of an ideal diode:
//
//   - ImpliedVoc, ExcessFromImpliedVoc: q iVoc = kT ln(n p / ni,eff²), the separation of the
//     quasi-Fermi levels in a uniform, quasi-neutral region (the definition used to turn
//     photoconductance data into a voltage, Appl. Phys. Lett. 69, 2510 (1996)).
//   - IdealDiodeVoc, J0FromVoc: Voc = n_id (kT/q) ln(1 + Jsc/J0), the open-circuit condition of
//     the ideal-diode equation J = Jsc − J0 (exp(qV/(n_id kT)) − 1) (W. Shockley, Bell Syst.
//     Tech. J. 28, 435 (1949); e.g. M. A. Green, Solar Cells: Operating Principles, Technology
//     and System Applications, Prentice-Hall 1982).
//   - IdealDiodeFF: the exact fill factor of that diode, through (1 + v_mp) e^v_mp = e^v_oc.
//
// The tests check the package against the ideal-diode closed forms and exact single-diode
// fill factors with series resistance (mpmath tables in testdata/reference/cell_ff.py),
// Green's empirical fill-factor expressions (Solid-State Electronics 24, 788 (1981)), the
// textbook dVoc/dT = −(Eg0/q − Voc + γkT/q)/T, detailed balance and round trips, and Richter et
// al.'s intrinsic limit.
//
// Units: V, A/cm^2, W/cm^2, Ω·cm², cm, cm^-3, K; fA/cm², mA/cm², mV and % only in the String
// tables.
package cell
