// Package profile: doping profiles; for now sheet resistance of depth/density arrays or a
// function. A later version adds the profile types (analytic and tabulated), their reader,
// junction depth and dose.
//
// # Sheet resistance
//
// SheetResistance and SheetResistanceFunc integrate the conductivity of a diffused layer of
// one dopant type over depth, from the surface to the first junction with a uniform
// background of the other type,
//
//	1/Rsh = ∫_0^xj q μmaj(x) (N(x) − Nbg) dx,
//
// (the definition of the sheet resistance of a layer, for example S. M. Sze and K. K. Ng,
// Physics of Semiconductor Devices, 3rd ed., Wiley 2007), with complete ionisation and the
// majority-carrier density equal to the net doping. The majority-carrier mobility comes from
// any silicon.Mobility, for example silicon.Klaassen1992 (D. B. M. Klaassen, Solid-State
// Electron. 35, 953 and 961 (1992)) or silicon.Masetti1983 (G. Masetti, M. Severi and
// S. Solmi, IEEE Trans. Electron Devices 30, 764 (1983)), evaluated with both dopant densities
// (the background also scatters).
//
// The integral is computed by adaptive Gauss–Legendre quadrature (see SheetRelTol): nodes
// and weights from gonum.org/v1/gonum/integrate/quad.Legendre, with panels bisected until the
// 8- and 16-point rules agree (P. J. Davis and P. Rabinowitz, Methods of Numerical
// Integration, 2nd ed., Academic Press 1984, chapter 6). gonum's quad offers only fixed
// rules, hence the hand-written adaptive driver.
package profile
