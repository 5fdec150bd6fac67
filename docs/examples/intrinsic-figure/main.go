// Command intrinsic-figure regenerates a figure from a script, the way a paper's figures should
// be made: the intrinsic lifetime (recomb.NewIntrinsic: Richter2012 Auger + Trupke2003
// radiative) of n- and p-type silicon at three dopings versus injection, with the default
// model set at 300 K, written as PDF (or SVG/PNG by the extension) with the model set's
// description printed beside it for the caption.
//
//	go run ./docs/examples/intrinsic-figure -o intrinsic.pdf
//
// The dopings are example values, not a published data set.
package main

import (
	"flag"
	"fmt"
	"log"

	"gonum.org/v1/gonum/floats"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/plots"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

func main() {
	out := flag.String("o", "intrinsic.pdf", "output file (.pdf, .svg or .png)")
	flag.Parse()
	caption, err := run(*out)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Println(caption)
}

// run writes the figure to path and returns the caption's provenance line.
func run(path string) (string, error) {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		return "", err
	}
	dn := floats.LogSpan(make([]float64, 60), 1e13, 1e18)
	intrinsic := recomb.NewIntrinsic()
	var curves []plots.Series
	for _, c := range []struct {
		label  string
		nd, na float64
	}{
		{"n-type 1e15 cm^-3", 1e15, 0}, {"n-type 1e16 cm^-3", 1e16, 0}, {"p-type 1e16 cm^-3", 0, 1e16},
	} {
		b, err := recomb.NewBulk(si, c.nd, c.na)
		if err != nil {
			return "", err
		}
		s, err := plots.Func(c.label, dn, func(x float64) (float64, error) { return b.Lifetime(intrinsic, x) })
		if err != nil {
			return "", err
		}
		curves = append(curves, s)
	}
	p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "τ intrinsic (s)", LogX: true, LogY: true, Legend: plots.BottomLeft}, curves...)
	if err != nil {
		return "", err
	}
	if err := plots.Save(p, path); err != nil {
		return "", err
	}
	return fmt.Sprintf("pvrec %s · %v · %v", pvrec.Version, si, intrinsic), nil
}
