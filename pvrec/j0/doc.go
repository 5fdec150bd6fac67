// Package j0: saturation-current densities; the diffused-region solvers come later.
//
// For now it holds the saturation current density of a uniformly doped, quasi-neutral base
// (Base), in the general form with a rear surface recombination velocity and in its long-base
// and thin-base limits. The expressions are those of the textbook solution of the minority-
// carrier diffusion equation in a uniform region (e.g. M. A. Green, Solar Cells: Operating
// Principles, Technology and System Applications, Prentice-Hall 1982; J. L. Gray, "The
// Physics of the Solar Cell", in A. Luque and S. Hegedus (eds.), Handbook of Photovoltaic
// Science and Engineering, Wiley 2003).
//
// Units: A/cm^2, cm, s, cm^-3, cm/s, cm²/s.
package j0
