// Package recomb computes bulk recombination in crystalline silicon: the net rate of each
// mechanism (cm^-3 s^-1), its lifetime τ = Δn/R, sums of mechanisms (effective bulk
// lifetime), a small defect catalogue with the iron–boron dissociation method, and diffusion
// lengths.
//
// Every mechanism is a value implementing Mechanism, a one-method interface evaluated at a
// State: the quasi-neutral carrier state of a Bulk (a *silicon.Material from
// silicon.ModelSet.At, its dopants and its thermal equilibrium) at an excess carrier density
// Δn. Bulk and State are the one wafer description of pvrec: the surface models, lifetime
// samples and cells are evaluated at the same State. All rates are proportional to
// n p − ni,eff², which Bulk.State computes without cancellation near equilibrium (the one
// implementation of that product), so detailed balance (R = 0 at n p = ni,eff²) holds exactly;
// State.ImpliedVoc gives the quasi-Fermi-level separation. Range errors match
// pvrec.ErrOutOfRange.
//
// Models and sources:
//
//   - Richter2012 (default Auger): A. Richter, S. W. Glunz, F. Werner, J. Schmidt and
//     A. Cuevas, Phys. Rev. B 86, 165202 (2012).
//   - KerrCuevas2002: M. J. Kerr and A. Cuevas, J. Appl. Phys. 91, 2473 (2002).
//   - Altermatt1997 (300 K, low injection): P. P. Altermatt, J. Schmidt, G. Heiser and
//     A. G. Aberle, J. Appl. Phys. 82, 4938 (1997).
//   - DziewiorSchmid1977: J. Dziewior and W. Schmid, Appl. Phys. Lett. 31, 346 (1977).
//   - ConstantAuger: user-chosen Cn, Cp.
//   - Trupke2003 (default radiative, B_low = 4.73e-15 cm³/s at 300 K, photon-recycling
//     factor): T. Trupke et al., J. Appl. Phys. 94, 4930 (2003).
//   - ConstantRadiative: user-chosen B (9.5e-15 cm³/s of H. Schlangenotto, H. Maeder and
//     W. Gerlach, Phys. Status Solidi A 21, 357 (1974), in NewKerrCuevas2002Intrinsic).
//   - SRH and SRHDefect (Shockley–Read–Hall, one level): W. Shockley and W. T. Read,
//     Phys. Rev. 87, 835 (1952); R. N. Hall, Phys. Rev. 87, 387 (1952); thermal velocities
//     (silicon.ThermalVelocity) at 300 K of M. A. Green, J. Appl. Phys. 67, 2944 (1990).
//   - Amphoteric (three charge states, two levels, steady state): C. T. Sah and
//     W. Shockley, Phys. Rev. 109, 1103 (1958).
//   - InterstitialIron, IronBoronPair and IronBoron: D. Macdonald, L. J. Geerligs and
//     A. Azzizi, J. Appl. Phys. 95, 1021 (2004); A. A. Istratov, H. Hieslmair and E. R. Weber,
//     Appl. Phys. A 69, 13 (1999); G. Zoth and W. Bergholz, J. Appl. Phys. 67, 6764 (1990).
//   - Intrinsic (Auger + radiative as one named mechanism), Sum (any sum).
//   - DiffusionLength: L = sqrt(D τ), S. M. Sze and K. K. Ng, Physics of Semiconductor
//     Devices, 3rd ed. (Wiley, 2007); the ambipolar diffusivity for it is
//     silicon.AmbipolarDiffusivity.
//
// Left out, because their parameters could not be reproduced with confidence: the
// relative radiative coefficient B_rel of P. P. Altermatt et al. (NUSOD 2005; a
// RelativeRadiative can be supplied to Trupke2003), the temperature dependence of B_low
// (Trupke et al. 2003; H. T. Nguyen et al., J. Appl. Phys. 115, 043710 (2014)), the
// parameterisation of T. Niewelt et al., Sol. Energy Mater. Sol. Cells 235, 111467 (2022),
// and the temperature dependence of Altermatt1997. The models fitted at 300 K therefore
// accept a window of 290–310 K by default (a field of each model).
package recomb
