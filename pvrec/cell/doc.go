// Package cell holds device-level voltages. For now it holds the implied open-circuit voltage of a quasi-neutral bulk and its inverse,
// and the ideal-diode relations between Voc, J0 and Jsc:
//
//   - ImpliedVoc, ExcessFromImpliedVoc: q iVoc = kT ln(n p / ni,eff²), the separation of the
//     quasi-Fermi levels in a uniform, quasi-neutral region (the definition used to turn
//     photoconductance data into a voltage, Appl. Phys. Lett. 69, 2510 (1996)).
//   - IdealDiodeVoc, J0FromVoc: Voc = n_id (kT/q) ln(1 + Jsc/J0), the open-circuit condition of
//     the ideal-diode equation J = Jsc − J0 (exp(qV/(n_id kT)) − 1) (W. Shockley, Bell Syst.
//     Tech. J. 28, 435 (1949); e.g. M. A. Green, Solar Cells: Operating Principles, Technology
//     and System Applications, Prentice-Hall 1982).
//
// Units: V, A/cm^2, cm^-3, K.
package cell
