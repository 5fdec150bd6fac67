// Command published-curves draws the curves of published parameterisations in the form their
// papers show them, from pvrec's models at 300 K, at a journal's column width (plots.Column,
// 8.5 cm × 6.4 cm), as PDF and as TikZ/pgf (.tex, for \input in a manuscript):
//
//   - intrinsic-lifetime: the intrinsic lifetime versus excess carrier density of n-type
//     silicon at three dopings on log–log axes, the form in which A. Richter, S. W. Glunz,
//     F. Werner, J. Schmidt and A. Cuevas, Phys. Rev. B 86, 165202 (2012) show it: their Auger
//     parameterisation with the radiative term B_low of T. Trupke et al., J. Appl. Phys. 94,
//     4930 (2003) (with B_rel = 1: pvrec ships no B_rel model), beside the earlier
//     parameterisation of M. J. Kerr and A. Cuevas, J. Appl. Phys. 91, 2473 (2002), in short
//     dashes;
//   - bandgap-narrowing: ΔEg versus dopant density for every BGN model in package silicon:
//     the physical BGN of A. Schenk, J. Appl. Phys. 84, 3684 (1998), at thermal equilibrium
//     with Fermi–Dirac statistics (n- and p-type), and the apparent BGN (fitted with Boltzmann
//     statistics) of J. W. Slotboom and H. C. de Graaff, Solid-State Electron. 19, 857 (1976),
//     D. B. M. Klaassen, J. W. Slotboom and H. C. de Graaff, Solid-State Electron. 35, 125
//     (1992), and J. A. del Alamo and R. M. Swanson, IEEE Trans. Electron Devices 34, 1580
//     (1987) (n-type only). Physical and apparent BGN are different quantities: the apparent
//     one also contains the degeneracy of the majority carriers;
//   - majority-mobility: electron (n-type) and hole (p-type) majority-carrier mobility versus
//     dopant density of D. B. M. Klaassen, Solid-State Electron. 35, 953 (1992), and
//     G. Masetti, M. Severi and S. Solmi, IEEE Trans. Electron Devices 30, 764 (1983)
//     (phosphorus and boron), in short dashes.
//
// The dopings, ranges and axis scales are our choice, not copied from the papers' figures.
// Run from the repository root:
//
//	go run ./docs/examples/published-curves -out out/published-curves
//
// It writes NAME.pdf and NAME.tex for each figure into the output folder (out/ is not
// tracked) and prints, per figure, a caption: what is drawn, and the provenance line (pvrec's
// version and the model sets).
package main

import (
	"flag"
	"fmt"
	"io"
	"log"
	"math"
	"os"
	"path/filepath"
	"strings"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/plots"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/plot"
)

// temperature is the temperature of every figure, K: the papers' 300 K.
const temperature = 300

// Dopings of the intrinsic-lifetime figure (n-type, cm^-3; our choice): lightly to moderately
// doped wafers, over which Auger recombination at low injection grows by orders of magnitude.
var intrinsicDopings = []float64{1e14, 1e15, 1e16}

func main() {
	out := flag.String("out", filepath.Join("out", "published-curves"), "output folder (created if missing)")
	flag.Parse()
	if err := run(*out, os.Stdout); err != nil {
		log.Fatal(err)
	}
}

// figure is one figure of the command: its file name (without extension), the figure, and
// its caption: what is drawn, then the provenance line.
type figure struct {
	name    string
	fig     plots.Figure
	caption string
}

// run writes every figure as PDF and TeX into dir and prints each file and caption line to w.
func run(dir string, w io.Writer) error {
	figs, err := figures()
	if err != nil {
		return err
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	for _, f := range figs {
		for _, ext := range []string{".pdf", ".tex"} {
			path := filepath.Join(dir, f.name+ext)
			if err := f.fig.Save(path); err != nil {
				return err
			}
			fmt.Fprintln(w, path)
		}
		fmt.Fprintf(w, "  %s\n", strings.ReplaceAll(f.caption, "\n", "\n  "))
	}
	return nil
}

// figures builds the three figures at their default grids.
func figures() ([]figure, error) {
	var figs []figure
	for _, build := range []func() (figure, error){intrinsicFigure, bgnFigure, mobilityFigure} {
		f, err := build()
		if err != nil {
			return nil, err
		}
		figs = append(figs, f)
	}
	return figs, nil
}

// column wraps one plot as a figure at the journal column width, with a caption of the note
// and a provenance line naming pvrec's version and the models.
func column(name string, p *plot.Plot, note string, models ...fmt.Stringer) figure {
	parts := []string{"pvrec " + pvrec.Version}
	for _, m := range models {
		parts = append(parts, m.String())
	}
	return figure{name: name, fig: plots.Figure{Panels: []*plot.Plot{p}, Preset: plots.Column}, caption: note + "\n" + strings.Join(parts, " · ")}
}

// material returns the default model set at 300 K with the given changes applied.
func material(change func(*silicon.ModelSet)) (*silicon.Material, error) {
	ms := silicon.DefaultModelSet()
	if change != nil {
		change(&ms)
	}
	return ms.At(temperature)
}

// logSpan returns n points from lo to hi evenly spaced in log.
func logSpan(lo, hi float64, n int) []float64 { return floats.LogSpan(make([]float64, n), lo, hi) }

// intrinsicCurves returns the intrinsic lifetime τ (s) versus the excess carrier densities dn
// (cm^-3) of n-type silicon at each of intrinsicDopings: first the Richter 2012 curves
// (recomb.NewIntrinsic) in the order of the dopings, then the Kerr–Cuevas 2002 curves
// (recomb.NewKerrCuevas2002Intrinsic), dashed, in the same order. Both use the default
// model set's ni,eff (Schenk 1998 BGN, Fermi–Dirac statistics).
func intrinsicCurves(si *silicon.Material, dn []float64) ([]plots.Series, error) {
	var richter, kerr []plots.Series
	for _, nd := range intrinsicDopings {
		b, err := recomb.NewBulk(si, nd, 0)
		if err != nil {
			return nil, err
		}
		doping := fmt.Sprintf("10^%.0f cm^-3", math.Log10(nd))
		for _, c := range []struct {
			mech   recomb.Mechanism
			label  string
			dashed bool
			dst    *[]plots.Series
		}{
			{recomb.NewIntrinsic(), "Richter 2012, " + doping, false, &richter},
			{recomb.NewKerrCuevas2002Intrinsic(), "Kerr–Cuevas 2002, " + doping, true, &kerr},
		} {
			taus, err := b.Lifetimes(c.mech, dn)
			if err != nil {
				return nil, fmt.Errorf("%v at Nd = %g cm^-3: %w", c.mech, nd, err)
			}
			*c.dst = append(*c.dst, plots.Series{Label: c.label, X: dn, Y: taus, Dashed: c.dashed})
		}
	}
	return append(richter, kerr...), nil
}

// intrinsicFigure is the intrinsic-lifetime figure: Δn from 1e13 to 1e18 cm^-3, 10 points a decade.
func intrinsicFigure() (figure, error) {
	si, err := material(nil)
	if err != nil {
		return figure{}, err
	}
	curves, err := intrinsicCurves(si, logSpan(1e13, 1e18, 51))
	if err != nil {
		return figure{}, err
	}
	p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "τ intrinsic (s)", LogX: true, LogY: true, Legend: plots.BottomLeft}, curves...)
	if err != nil {
		return figure{}, err
	}
	note := "Intrinsic lifetime of n-type Si at 300 K: Richter et al. 2012 with Trupke's B_low (B_rel = 1), and Kerr and Cuevas 2002 in short dashes."
	return column("intrinsic-lifetime", p, note, si, recomb.NewIntrinsic(), recomb.NewKerrCuevas2002Intrinsic()), nil
}

// bgnModel is one curve of the BGN figure: a model set's BGN and statistics, and the doping type.
type bgnModel struct {
	label string
	bgn   silicon.BandgapNarrowing
	stat  silicon.Statistics
	pType bool
}

// bgnModels lists the curves of the BGN figure: each model with the statistics it belongs
// with (physical BGN with Fermi–Dirac, apparent BGN with Boltzmann; see package silicon).
var bgnModels = []bgnModel{
	{"Schenk 1998, n-type (physical)", silicon.NewSchenk1998(), silicon.FermiDirac, false},
	{"Schenk 1998, p-type (physical)", silicon.NewSchenk1998(), silicon.FermiDirac, true},
	{"Slotboom–de Graaff 1976", silicon.NewSlotboomDeGraaff1976(), silicon.Boltzmann, false},
	{"Klaassen et al. 1992", silicon.NewKlaassenSlotboomDeGraaff1992(), silicon.Boltzmann, false},
	{"del Alamo–Swanson 1987", silicon.NewDelAlamoSwanson1987(), silicon.Boltzmann, false},
}

// bgnCurves returns, for each of bgnModels in order, the band-gap narrowing ΔEg in meV of
// silicon in thermal equilibrium (low injection) at 300 K versus the dopant densities n
// (cm^-3; donors, or acceptors for the p-type curve), from silicon.Material.Equilibrium of
// the default model set with the model's BGN and statistics. The apparent models depend
// on the doping alone and are the same for either type (del Alamo–Swanson: n-type only).
// The second result holds the materials, for the caption.
func bgnCurves(n []float64) ([]plots.Series, []*silicon.Material, error) {
	var curves []plots.Series
	var mats []*silicon.Material
	for _, c := range bgnModels {
		si, err := material(func(ms *silicon.ModelSet) { ms.BGN, ms.Statistics = c.bgn, c.stat })
		if err != nil {
			return nil, nil, err
		}
		s, err := plots.Func(c.label, n, func(x float64) (float64, error) {
			nd, na := x, 0.0
			if c.pType {
				nd, na = 0, x
			}
			e, err := si.Equilibrium(nd, na)
			return 1e3 * e.DeltaEg, err
		})
		if err != nil {
			return nil, nil, err
		}
		s.Dashed = c.pType
		curves = append(curves, s)
		if !c.pType {
			mats = append(mats, si)
		}
	}
	return curves, mats, nil
}

// bgnFigure is the BGN figure: dopant densities from 1e16 to 1e20 cm^-3, the range of the
// apparent-BGN fits' data.
func bgnFigure() (figure, error) {
	curves, mats, err := bgnCurves(logSpan(1e16, 1e20, 60))
	if err != nil {
		return figure{}, err
	}
	p, err := plots.Lines(plots.Axes{XLabel: "dopant density (cm^-3)", YLabel: "ΔEg (meV)", LogX: true, Legend: plots.TopLeft}, curves...)
	if err != nil {
		return figure{}, err
	}
	models := make([]fmt.Stringer, len(mats))
	for i, m := range mats {
		models[i] = m
	}
	note := "Band-gap narrowing at 300 K, thermal equilibrium: Schenk 1998 is a physical BGN (with Fermi–Dirac statistics; p-type in short dashes); " +
		"Slotboom–de Graaff 1976, Klaassen et al. 1992 and del Alamo–Swanson 1987 (n-type) are apparent BGN (with Boltzmann statistics), which include the majority carriers' degeneracy."
	return column("bandgap-narrowing", p, note, models...), nil
}

// mobilityModels lists the mobility models of the mobility figure, Klaassen first.
var mobilityModels = []struct {
	name string
	mob  silicon.Mobility
}{
	{"Klaassen 1992", silicon.NewKlaassen1992()},
	{"Masetti 1983", silicon.NewMasetti1983()},
}

// mobilityCurves returns the majority-carrier mobilities in cm²/(V·s) at 300 K versus the
// dopant densities n (cm^-3), in the order: electrons in n-type silicon and holes in p-type
// silicon for Klaassen 1992, then the same for Masetti 1983 (dashed). Each is evaluated at
// the equilibrium carrier densities of the default model set with that mobility model.
func mobilityCurves(n []float64) ([]plots.Series, []*silicon.Material, error) {
	var curves []plots.Series
	var mats []*silicon.Material
	for i, m := range mobilityModels {
		si, err := material(func(ms *silicon.ModelSet) { ms.Mobility = m.mob })
		if err != nil {
			return nil, nil, err
		}
		mats = append(mats, si)
		for _, electrons := range []bool{true, false} {
			label := "electrons, " + m.name
			if !electrons {
				label = "holes, " + m.name
			}
			s, err := plots.Func(label, n, func(x float64) (float64, error) {
				nd, na := x, 0.0
				if !electrons {
					nd, na = 0, x
				}
				e, err := si.Equilibrium(nd, na)
				if err != nil {
					return 0, err
				}
				mun, mup, err := si.Mobilities(e.N0, e.P0, e.NdIon, e.NaIon)
				if electrons {
					return mun, err
				}
				return mup, err
			})
			if err != nil {
				return nil, nil, err
			}
			s.Dashed = i > 0
			curves = append(curves, s)
		}
	}
	return curves, mats, nil
}

// mobilityFigure is the mobility figure: dopant densities from 1e13 to 1e21 cm^-3 (the models'
// upper bound).
func mobilityFigure() (figure, error) {
	curves, mats, err := mobilityCurves(logSpan(1e13, 1e21, 81))
	if err != nil {
		return figure{}, err
	}
	p, err := plots.Lines(plots.Axes{XLabel: "dopant density (cm^-3)", YLabel: "μ (cm²/Vs)", LogX: true, LogY: true, Legend: plots.BottomLeft}, curves...)
	if err != nil {
		return figure{}, err
	}
	note := "Majority-carrier mobility at 300 K: electrons in n-type, holes in p-type Si; Klaassen 1992, and Masetti et al. 1983 in short dashes."
	return column("majority-mobility", p, note, mats[0], mats[1]), nil
}
