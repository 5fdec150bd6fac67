// Package j0 computes saturation-current densities J0 (A/cm^2): of a uniformly doped base in
// closed form, and of heavily doped regions — diffused emitters, front and back surface
// fields, the diffusion under a doped contact — from their doping profile and their surface,
// by integral forms and by a numerical solver of minority-carrier transport.
//
// # Uniform base
//
// Base holds the saturation current density of a uniformly doped, quasi-neutral base, in the
// general form with a rear surface recombination velocity and in its long-base and thin-base
// limits. The expressions are those of the textbook solution of the minority-carrier
// diffusion equation in a uniform region (e.g. M. A. Green, Solar Cells: Operating
// Principles, Technology and System Applications, Prentice-Hall 1982; J. L. Gray, "The
// Physics of the Solar Cell", in A. Luque and S. Hegedus (eds.), Handbook of Photovoltaic
// Science and Engineering, Wiley 2003).
//
// # Doped regions
//
// A Region is a doping profile (package profile) below a front surface (a Surface model: S
// in cm/s as a function of the surface dopant density; FixedS, PowerLawS, SurfaceFunc, and
// DefaultSurface, the package's own default, not a paper's), bounded at depth by the edge of
// the junction's space-charge region at zero bias (SpaceChargeRegion, the depletion
// approximation for any profile; S. M. Sze and K. K. Ng, Physics of Semiconductor Devices,
// 3rd ed., Wiley 2007) or, for a high–low junction, by a given depth. Models chooses the
// material (silicon.Material: ni, band-gap narrowing, statistics), the mobility and the
// Auger, SRH and radiative mechanisms (package recomb); DefaultModels and SimpleModels fill
// it. A Solver holds the Models and the mesh tolerance:
//
//   - Solver.Solve: the numerical solution of low-injection minority-carrier transport in
//     the quasi-neutral region with position-dependent doping, narrowing, degeneracy,
//     mobility and recombination; J0 with its breakdown into surface, Auger, SRH and
//     radiative parts, the depth distribution of recombination, the mesh and the estimated
//     discretisation error. Method: a locally exact (exponentially fitted) finite-volume
//     scheme in u = Δn_min/n_min0 that reduces to the fluxes of D. L. Scharfetter and H. K.
//     Gummel, IEEE Trans. Electron Devices 16, 64 (1969), without recombination, solved by a
//     subtraction-free Thomas algorithm; a profile-adapted mesh bisected until the Richardson
//     extrapolations (L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)) of successive
//     meshes agree to RelTol (default 1e-3).
//   - Solver.Transparent: the transparent-region limit, q ∫R dx in thermal-equilibrium
//     densities plus the surface term.
//   - Solver.Gummel: the transparent-emitter formula with the Gummel-number integral
//     ∫ N/(ni,eff² D) dx (M. A. Shibib, F. A. Lindholm and F. Therez, IEEE Trans. Electron
//     Devices 26, 959 (1979); reference from memory).
//   - Sweep and Solver.SolveAll: concurrent evaluation over profiles or parameter sets on all
//     cores, with the results in input order.
//
// Models used through Models (see their packages for the full references): silicon's model
// set (default: Pässler 2002 gap, Couderc 2014 ni, Schenk 1998 BGN, Fermi–Dirac statistics),
// Klaassen 1992 or Masetti 1983 mobility, Richter 2012 or Dziewior–Schmid 1977 or constant
// Auger coefficients, Trupke 2003 or constant radiative recombination, Shockley–Read–Hall.
//
// Units: A/cm^2, cm, s, cm^-3, cm/s, cm²/s, V, K.
package j0
