// Package profile describes doping profiles below the front surface of a silicon wafer:
// analytic diffusion profiles, measured (tabulated) profiles read from the package's CSV
// format, their junction depth, dose and sheet resistance.
//
// Depths are in cm (x = 0 at the front surface, increasing into the wafer), densities in
// cm^-3, doses in cm^-2, sheet resistances in Ω/sq. Convert µm only at the edges.
//
// # Profiles
//
// A Profile gives the donor and acceptor densities at a depth. The package provides
//
//   - Uniform: a constant density of one type (a wafer's background doping);
//   - Erfc: N = Ns erfc(x/L), diffusion from a constant surface source;
//   - Gaussian: N = Np exp(−((x − x0)/L)²), diffusion from a limited source or an implant;
//     both are the textbook solutions of Fick's second law with a constant diffusivity
//     (for example S. M. Sze and K. K. Ng, Physics of Semiconductor Devices, 3rd ed., Wiley
//     2007), L = 2 sqrt(D t);
//   - Sum: a superposition, e.g. Sum{Erfc{...}, Uniform{...}} for a diffusion on a wafer of
//     either type;
//   - Scaled: a profile with recalibrated density and depth scales (a calibration factor, a
//     depth-scale error, a shift or an etch-back), for the uncertainty of a measured profile;
//   - Tabulated: measured densities interpolated linearly in log density (gonum
//     interp.PiecewiseLinear), noise and non-monotonic values kept as measured.
//
// ReadCSV reads a measured profile in the package's own CSV format, documented in
// docs/profile-csv.md: comment lines starting with '#', a header "depth (unit), density
// (cm^-3)" with the depth unit nm, um, mm or cm, and one depth and density per line, as plain
// decimal numbers. It reads what spreadsheet programs write (a byte-order mark, CR-only line
// ends, quoted fields, upper-case units). Bad input (an empty file, a missing or unknown unit,
// depths not increasing, negative, zero or non-decimal values, fewer than two rows) gives a
// short error naming the line. WriteCSV writes the format.
//
// # Bounds and zero values
//
// Densities may not exceed the silicon atom density (silicon.AtomDensity, 5e22 cm^-3) and
// depths and lengths not MaxDepthCm (10 cm): beyond them the functions return range errors
// (errors.Is(err, pvrec.ErrOutOfRange)), so that doses, extents and sheet resistances are
// always finite. The zero values of Erfc and Gaussian (zero Length) and of Uniform (no
// Dopant) return errors; a zero Tabulated holds no data and returns errors; an empty Sum is
// undoped silicon.
//
// # Junction depth, dose
//
// JunctionDepth finds the first depth where the net doping nd − na changes sign (a grid
// search refined by Brent's method, R. P. Brent, Algorithms for Minimization without
// Derivatives, Prentice-Hall 1973);
// ErrNoJunction marks high–low junctions and uniform wafers. Dose integrates one dopant's
// density over a depth range and NetDose the net doping over the surface layer, by
// Gauss–Legendre quadrature (gonum integrate/quad); Erfc.Dose and Gaussian.Dose give the
// closed forms.
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
// majority-carrier density equal to the net doping. The temperature and the majority-carrier
// mobility come from the *silicon.Material passed in (Material.Mobilities, its model set's
// Mobility), for example silicon.Klaassen1992 (D. B. M. Klaassen, Solid-State Electron. 35, 953
// and 961 (1992)) or silicon.Masetti1983 (G. Masetti, M. Severi and S. Solmi, IEEE Trans.
// Electron Devices 30, 764 (1983)), evaluated with both dopant densities (the background also
// scatters). SheetOf applies SheetResistanceFunc to a Profile made of a layer on a uniform
// background.
//
// The integral is computed by adaptive Gauss–Legendre quadrature (see SheetRelTol): nodes
// and weights from gonum.org/v1/gonum/integrate/quad.Legendre, with panels bisected until the
// 8- and 16-point rules agree (P. J. Davis and P. Rabinowitz, Methods of Numerical
// Integration, 2nd ed., Academic Press 1984, chapter 6). gonum's quad offers only fixed
// rules, hence the hand-written adaptive driver.
//
// Every type is a value (Tabulated is immutable behind its pointer: its data are copied in and
// out) and safe for concurrent use. Tabulated evaluations cost O(log n) in the n rows, and the
// junction search, Dose and SheetOf O(n): a million-row profile works, at a cost of seconds
// (see Tabulated).
package profile
