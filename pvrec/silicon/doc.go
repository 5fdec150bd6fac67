// Package silicon describes crystalline silicon at a temperature: band gap, effective
// densities of states, intrinsic carrier density, band-gap narrowing (BGN), carrier
// statistics, dopant ionisation, equilibrium carrier densities and the effective intrinsic
// density ni,eff; and, in the files of their own, mobilities and resistivity.
//
// # Use
//
// A ModelSet is the user-editable choice of models, a plain value to copy and change;
// DefaultModelSet fills it. ModelSet.At fixes it at a temperature and returns an immutable
// *Material, safe for concurrent use, which caches every temperature-dependent quantity.
// Later packages take the *Material and call Material.NiEff and Material.Equilibrium in hot
// loops; Material.String stamps results with the temperature and the models' short names:
//
//	m, err := silicon.DefaultModelSet().At(300)
//	e, err := m.Equilibrium(1e19, 0)           // n0, p0, ionised dopants, ΔEg, ni,eff, EF
//	nie, err := m.NiEff(n, p, e.NdIon, e.NaIon) // at injection
//	fmt.Println(m) // Si 300.00 K: Eg Pässler2002, DOS Green1990, ni Couderc2014, BGN Schenk1998, Fermi–Dirac, complete ionisation, μ Klaassen1992
//
// Units are cm^-3, K, eV and V. Bad input (NaN, ±Inf, negative densities, T <= 0) returns an
// error naming the argument; a temperature or density outside a model's validity range returns
// an error for which errors.Is(err, pvrec.ErrOutOfRange) holds (a *pvrec.RangeError, from
// github.com/pvrec/pvrec/pvrec). Two physical bounds hold everywhere: no density above the
// silicon atom density AtomDensity (5e22 cm^-3) and no temperature above the melting point
// MeltingPoint (1687 K). Results that would not be finite are errors, never ±Inf or NaN.
//
// Zero values: only ModelSet.At makes a usable *Material; the methods of a zero or nil
// Material return an error. Models are values; ModelSet.At refuses pointer models, so a fixed
// Material cannot be changed by the caller afterwards. The zero values of the models carry no
// parameters and return errors (their validity ranges are empty).
//
// # How the models combine
//
// ni comes from the Intrinsic model alone. Nc and Nv enter only through the Fermi–Dirac
// degeneracy, and the statistics use the gap they imply with ni, Eg,stat = kT ln(Nc Nv/ni²),
// narrowed by ΔEg, so that n0 p0 = ni² exp(ΔEg/kT) for non-degenerate carriers whichever models
// are paired. Under Fermi–Dirac statistics
//
//	ni,eff² = ni² exp(ΔEg/kT) γn γp,   γ = F_{1/2}(η)/e^η,   n = Nc F_{1/2}(ηn), p = Nv F_{1/2}(ηp),
//
// and γ = 1 under Boltzmann statistics. The carrier densities depend only on the total ΔEg;
// for the reported Fermi level the narrowing is split equally between the bands (our
// documented choice). Apparent BGN models (fitted with Boltzmann statistics) belong with
// Statistics = Boltzmann, physical ones (Schenk1998) with FermiDirac.
//
// # Models and references
//
// Constants: k and q, exact SI values (CODATA 2018), from gonum.org/v1/gonum/unit/constant.
//
// Band gap (Bandgap):
//   - Passler2002: R. Pässler, "Dispersion-related description of temperature dependencies
//     of band gaps in semiconductors", Phys. Rev. B 66, 085201 (2002). Si parameters
//     Eg0 = 1.1701 eV, α = 3.23e-4 eV/K, Θ = 446 K, Δ = 0.51, from memory and cross-checked
//     (Eg(300 K) = 1.12426 eV against Green's 1.1242 eV; Couderc's ni(300 K) reproduced).
//   - FixedGap: a constant gap for hand calculations; default 1.1242 eV, the 300 K value of
//     M. A. Green, "Intrinsic concentration, effective densities of states, and effective mass
//     in silicon", J. Appl. Phys. 67, 2944 (1990).
//
// Effective densities of states (DensityOfStates):
//   - Green1990DOS: M. A. Green, J. Appl. Phys. 67, 2944 (1990): Nc = 2.86e19 cm^-3,
//     Nv = 3.10e19 cm^-3 at 300 K; temperature exponents 1.58 and 1.85 from memory.
//   - Not provided: the Nc(T), Nv(T) of R. Couderc, M. Amara and M. Lemiti, J. Appl. Phys. 115,
//     093705 (2014), which could not be stated with confidence.
//
// Intrinsic carrier density (IntrinsicDensity):
//   - Couderc2014 (default): R. Couderc, M. Amara and M. Lemiti, "Reassessment of the
//     intrinsic carrier density temperature dependence in crystalline silicon", J. Appl. Phys.
//     115, 093705 (2014); ni = 1.541e15 T^1.712 exp(−Eg(T)/2kT) with Pässler's Eg(T);
//     9.67e9 cm^-3 at 300 K. Default range 78–500 K (our choice).
//   - Altermatt2003: P. P. Altermatt, A. Schenk, F. Geelhaar and G. Heiser, "Reassessment of
//     the intrinsic carrier density in crystalline silicon in view of band-gap narrowing",
//     J. Appl. Phys. 93, 1598 (2003); 9.65e9 cm^-3 at 300 K only.
//   - MisiakosTsamakis1993: K. Misiakos and D. Tsamakis, "Accurate measurements of the
//     silicon intrinsic carrier density from 78 to 340 K", J. Appl. Phys. 74, 3293 (1993);
//     5.29e19 (T/300)^2.54 exp(−6726/T), 78–340 K.
//   - SproulGreen1991: A. B. Sproul and M. A. Green, "Improved value for the silicon
//     intrinsic carrier concentration from 275 to 375 K", J. Appl. Phys. 70, 846 (1991);
//     9.38e19 (T/300)^2 exp(−6884/T) (from memory), 275–375 K.
//   - FixedNi: a constant ni for hand calculations; default 1.00e10 cm^-3.
//
// Statistics: Boltzmann and FermiDirac, the Fermi–Dirac integrals from package
// github.com/pvrec/pvrec/pvrec/fermi.
//
// Ionisation (Ionization): CompleteIonization only. The incomplete-ionisation model of
// P. P. Altermatt, A. Schenk, B. Schmithüsen and G. Heiser, J. Appl. Phys. 100, 113714 and
// 113715 (2006), is left out because its parameters could not be reconstructed with
// confidence; Material.Equilibrium accepts any Ionization model through the interface.
//
// Equilibrium (Material.Equilibrium): charge neutrality solved for the majority carrier's
// reduced Fermi level by safeguarded Newton iteration in a proven bracket, the minority
// density from its own Fermi level (full relative accuracy at any doping), BGN made
// self-consistent by fixed-point iteration with a bracketed Brent fallback (R. P. Brent,
// "Algorithms for Minimization without Derivatives", Prentice-Hall, 1973).
//
// Band-gap narrowing (BandgapNarrowing):
//   - Schenk1998 (default, physical, injection-dependent): A. Schenk, "Finite-temperature
//     full random-phase approximation model of band gap narrowing for silicon device
//     simulation", J. Appl. Phys. 84, 3684 (1998).
//   - KlaassenSlotboomDeGraaff1992 (apparent): D. B. M. Klaassen, J. W. Slotboom and
//     H. C. de Graaff, "Unified apparent bandgap narrowing in n- and p-type silicon",
//     Solid-State Electron. 35, 125 (1992).
//   - SlotboomDeGraaff1976 (apparent): J. W. Slotboom and H. C. de Graaff, "Measurements of
//     bandgap narrowing in Si bipolar transistors", Solid-State Electron. 19, 857 (1976).
//   - DelAlamoSwanson1987 (apparent, n-type): J. A. del Alamo and R. M. Swanson, "Measurement
//     of steady-state minority-carrier transport parameters in heavily doped n-type silicon",
//     IEEE Trans. Electron Devices 34, 1580 (1987).
//   - NoNarrowing: ΔEg = 0.
//   - Not provided: the fits of D. Yan and A. Cuevas, J. Appl. Phys. 114, 044508 (2013) (P)
//     and 116, 194505 (2014) (B), whose parameters could not be stated with confidence.
//
// Mobility (Mobility), ModelSet.Mobility and Material.Mobilities:
//   - Klaassen1992 (default): D. B. M. Klaassen, "A unified mobility model for device simulation — I.
//     Model equations and concentration dependence", Solid-State Electron. 35, 953 (1992), and
//     "— II. Temperature dependence of carrier mobility and lifetime", Solid-State Electron.
//     35, 961 (1992).
//   - Masetti1983: G. Masetti, M. Severi and S. Solmi, "Modeling of carrier mobility against
//     carrier concentration in arsenic-, phosphorus-, and boron-doped silicon", IEEE Trans.
//     Electron Devices 30, 764 (1983).
//   - ConstantMobility: fixed mobilities for hand calculations.
//
// Derived transport quantities: Diffusivity and DiffusivityFD (Einstein relation, with the
// Fermi–Dirac factor F_{1/2}/F_{−1/2} where degenerate), Diffusivities (following the model
// set's statistics), AmbipolarDiffusivity (W. van Roosbroeck, Phys. Rev. 91, 282 (1953)), and
// the sum mobility μn + μp versus excess carrier density (SumMobility, SumMobilities and the
// interpolating SumMobilityTable) for photoconductance analysis. Where a *Material is at hand,
// its methods Material.Diffusivities, Material.SumMobility and Material.SumMobilityTable take
// the temperature, the mobility model and the wafer's equilibrium state from it.
//
// Resistivity: Conductivity, Resistivity, ResistivityFromDoping and the bracketed inversion
// DopingFromResistivity; checked against the conversion standard ASTM F723 and the NBS
// measurements it rests on (W. R. Thurber, R. L. Mattis, Y. M. Liu and J. J. Filliben,
// J. Electrochem. Soc. 127, 1807 and 2291 (1980)) within the stated, observed tolerances.
package silicon
