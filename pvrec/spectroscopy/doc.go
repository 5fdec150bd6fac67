// Package spectroscopy reads defect parameters back from lifetime curves: injection-dependent
// lifetime spectroscopy of a single Shockley–Read–Hall level in crystalline silicon. Given one
// or more SRH-limited lifetime curves τ(Δn), each with its wafer (a *recomb.Bulk: material,
// temperature, dopants), it finds the level energy Et, the ratio k = σn/σp of the capture
// cross sections and the capture time constant τn0 of each curve, with their uncertainty and
// with what the data cannot tell.
//
//   - Fit: the single-level least-squares fit on ln τ (Et and k shared, τn0 per curve), with
//     the 95 % profile-likelihood region of Et, covariance-based errors of k and τn0, the best
//     level in the other half of the gap (Result.Alternative), and Flags when the branches are
//     not separated, Et or k is not determined, a curve is not described by one level
//     (Durbin–Watson test of the residuals) or the curves do not share one (F test).
//   - SolutionSurface: the defect parameter solution surface (DPSS): per curve, the best k and
//     τn0 at every Et over the gap (both branches) and the cost map over (Et, log10 k); the sum
//     of the maps, whose minimum is the intersection of the curves' loci.
//   - Linearise: τSRH against X = n/p (p-type) or p/n (n-type), a straight line for one
//     level; its slope, intercept and what they imply (Line, Line.At).
//   - ConvertLevel: a level's energy from another reference (Ev, Ec, Ei) at a material.
//
// Curves may still contain known recombination (Curve.Subtract, e.g. recomb.NewIntrinsic()),
// which is removed first; points where that removes more than MaxSubtractedShare of 1/τ are
// left out and reported. The model is recomb.SRH evaluated at the curves' recomb.State, with
// τp0 = k (vth,n/vth,p) τn0 and the thermal velocities of silicon.ThermalVelocity, so the
// fit inverts exactly the forward model of pvrec (band-gap narrowing included).
//
// Methods and sources:
//
//   - SRH recombination: W. Shockley and W. T. Read, Phys. Rev. 87, 835 (1952);
//     R. N. Hall, Phys. Rev. 87, 387 (1952) (through package recomb).
//   - Lifetime spectroscopy and the defect parameter solution surface: S. Rein, T. Rehrl,
//     W. Warta and S. W. Glunz, J. Appl. Phys. 91, 2059 (2002); S. Rein, Lifetime
//     Spectroscopy (Springer, 2005). The closed-form τn0, the profile over Et and the
//     statistics are derived here, not taken from them.
//   - The linearised form: J. D. Murphy, K. Bothe, R. Krain, V. V. Voronkov and
//     R. J. Falster, J. Appl. Phys. 111, 113709 (2012); the n-type form and the reading of
//     slope and intercept are derived here.
//   - Nelder–Mead simplex: J. A. Nelder and R. Mead, Comput. J. 7, 308 (1965), with the rules
//     of J. C. Lagarias, J. A. Reeds, M. H. Wright and P. E. Wright, SIAM J. Optim. 9, 112
//     (1998). Durbin–Watson statistic: J. Durbin and G. S. Watson, Biometrika 37, 409 (1950).
//     Likelihood-ratio intervals, the F test and the covariance s² (JᵀJ)⁻¹: common practice
//     (no source); quantiles from gonum/stat/distuv, differences from gonum/diff/fd.
//
// What the data determine. At one temperature, a level in the upper half of the gap with n1
// (its p1 negligible) and the level in the lower half with p1' = (τp0/τn0) n1 (its n1'
// negligible), with the same τn0 and τp0, give the same lifetime at every injection and
// every doping of either type: in τ (n0 + p0 + Δn) = τp0 (n + n1) + τn0 (p + p1) both add
// τp0 n1 to the same terms (derived here). So curves at one temperature fix k and the pair of
// mirror levels but not the half, and Fit flags BranchesNotSeparated; curves at several
// temperatures separate the halves, since n1 and p1' change differently with T. A deep level
// (n1, p1 ≪ the majority density) fixes only k.
//
// The tests check synthetic round trips (curves from recomb's catalogue levels and invented
// ones at several dopings and temperatures, with invented seeded noise), the coverage of the
// 95 % intervals, the SRH closed forms at low and high injection, the mirror symmetry above,
// the linear form against its closed form, the solution surface against the linear form, and
// the flags on curves that no single level describes.
//
// Units: eV, cm^-3, s, cm/s, cm^-1 (σn·Nt); k and X are dimensionless.
package spectroscopy
