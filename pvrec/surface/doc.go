// Package surface describes recombination at the surfaces of a silicon wafer: the relations
// between the effective surface recombination velocity Seff and the surface saturation
// current density J0s, the effective lifetime of a wafer with two recombining surfaces, and
// the extended Shockley–Read–Hall model of a dielectric–silicon interface with fixed charge
// and an energy distribution of interface defects.
//
// Every quantity is referred to the edge of the surface space-charge region, described by the
// quasi-neutral state of the wafer there: a recomb.State, from recomb.Bulk.State (the wafer's
// material, dopants and equilibrium, at an excess carrier density Δn), the one wafer state
// that bulk mechanisms, surfaces, lifetime samples and cells share. A Model serves as the
// front surface of a J0 region through j0.ModelSurface (see there for where that is
// physically meaningful). Units are cm, cm^-3, cm^-2 (charges in elementary charges per
// cm², "q/cm²"), cm/s, s, A/cm^2, V, eV; interface-state energies are E − Ei in eV.
//
// Relations
//
//   - SeffFromJ0s, J0sFromSeff: Seff = J0s (n p − ni,eff²)/(q ni,eff² Δn), which is
//     Seff = J0s (N + Δn)/(q ni²) of A. Cuevas and D. Macdonald, "Measuring and interpreting
//     the lifetime of silicon wafers", Solar Energy 76, 255 (2004), with both equilibrium
//     densities and the injected-state ni,eff kept, and both parameters referred to the edge of
//     the space-charge region as discussed by K. R. McIntosh and L. E. Black, "On effective
//     surface recombination parameters", J. Appl. Phys. 116, 014503 (2014).
//   - Model, ConstantSeff, ConstantJ0s: surfaces as interchangeable values.
//
// Wafer lifetime
//
//   - Lifetime, EffectiveLifetime: the exact fundamental mode of the decay in a wafer
//     with surface recombination velocities S1, S2 (symmetric or not) of A. B. Sproul,
//     "Dimensionless solution of the equation describing the effect of surface recombination
//     on carrier decay in semiconductors", J. Appl. Phys. 76, 2851 (1994), by bracketed root
//     finding.
//   - LifetimeSproul: Sproul's approximation W/(2S) + W²/(π² D), within 5.06 % for all S.
//   - LifetimeLowS: W/(S1+S2), within 1 % for (S1+S2) W/D < 0.03.
//   - LifetimeDiffusionLimit: W²/(π² D), the limit of infinite S.
//
// Interface model
//
//   - ExtendedSRH: the extended SRH model of R. B. M. Girisch, R. P. Mertens and
//     R. F. De Keersmaecker, IEEE Trans. Electron Devices 35, 203 (1988), and A. G. Aberle,
//     S. Glunz and W. Warta, J. Appl. Phys. 71, 4422 (1992): SRH recombination integrated over
//     Dit(E) with σn(E), σp(E); fixed charge Qf of either sign and optionally the charge of the
//     interface states; the band bending from charge neutrality with the exact one-dimensional
//     Poisson solution of the space charge (Boltzmann statistics, flat quasi-Fermi levels);
//     outputs in Result: surface densities, band bending, Regime, charges, Us, Seff, J0s.
//     Valid for |Qf| <= 1e13 cm^-2, dopants <= 1e18 cm^-3 and Δn <= 1e18 cm^-3 for either
//     polarity; it always converges there (bracketed Brent root finding, charge neutrality to
//     ResidualTol) or returns an error matching pvrec.ErrNoConvergence. Fermi–Dirac statistics in the space-charge
//     region are not implemented.
//   - Interface-state distributions (DitDistribution): ConstantDit, UShapedDit, GaussianDit,
//     TabulatedDit, DitSum. Cross sections (CrossSection): ConstantSigma, TabulatedSigma.
//     The shapes are descriptions; their parameters are the user's, not those of any paper.
//
// Constants: ε0 and q from gonum.org/v1/gonum/unit/constant; the relative permittivity of
// silicon (silicon.RelativePermittivity, 11.9, Sze & Ng 2007, value from memory) and the
// thermal velocities (a silicon.ThermalVelocity with DefaultVth = 1e7 cm/s at 300 K, common
// practice) are fields of ExtendedSRH that the user may change. Range errors match
// pvrec.ErrOutOfRange.
//
// The integral over Dit(E) uses composite 8-point Gauss–Legendre quadrature (nodes from gonum's
// quad.Legendre) on panels no wider than kT, with panel ends at the distributions' kinks and
// narrow features, for a relative error below 1e-12.
package surface
