// Package plots builds pvrec's figures on gonum.org/v1/plot with one house style: line plots
// of curves versus doping, injection or depth, with optional logarithmic axes (Lines),
// horizontal bar charts of named parts such as a J0 budget (Bars, and Grouped and Stacked for
// several sets), maps of a grid with a colour bar and contour lines (HeatMap), and export to
// SVG, PDF, EPS, PNG and TeX (Figure).
//
// The package holds no physics: callers compute curves with the pvrec packages and pass them
// here as Series (or Bar values). Every builder validates its input and returns an error (never panics), for
// example for a non-positive value on a logarithmic axis, which gonum/plot would otherwise
// reject with a panic, or for values spanning more than a float64 holds, on which its tick
// search would not end; axes whose values are all equal are padded. Rendering a plot that
// gonum/plot cannot draw (a zero plot.Plot) is an error too, and figure sizes are bounded by
// MaxSize, so that a notebook loses a figure, never its kernel.
//
// Labels are typeset: "cm^-3" and "cm⁻³" come out as superscripts, and a label with a pair of
// $ signs is LaTeX-style markup (`$\tau_{\rm eff}$ (s)`). SVG embeds the fonts for files that
// travel; SVGInline is the light form the notebooks display; Figure sets sizes, panels and
// formats.
//
// Nothing inside pvrec imports this package except nb; notebooks and scripts use both.
package plots
