// Package plots builds pvrec's figures on gonum.org/v1/plot in one house style, fit for a
// paper draft, a notebook or a slide.
//
// # Design note
//
// Kinds (each builder returns a *plot.Plot, so every kind goes through the same export and
// nb.Show):
//
//   - Lines: curves versus doping, injection or depth on linear or logarithmic axes; per
//     Series, markers instead of a line (Points), error bars (YErr), an uncertainty band
//     (Lo, Hi), the right-hand y axis of a twin-axis figure (Right, with Axes.RightLabel
//     and LogRight). Func evaluates a model into a Series.
//   - Bars, Grouped, Stacked: horizontal bar charts of named parts: one set (a J0 budget),
//     sets side by side (designs compared), sets end to end (a budget by region and
//     mechanism).
//   - HeatMap: a map of a Grid (GridFunc evaluates a model over xs × ys), e.g. Seff over
//     Qf × Dit, with a colour bar and contour lines at chosen levels, labelled with their
//     values.
//   - Histogram, Tornado, Strip: the figures of an uncertainty analysis, from plain numbers:
//     the distribution of a result over draws (bins by the Freedman–Diaconis rule, on a
//     linear or logarithmic axis, counts or density, lines at the mean and percentiles, an
//     interval highlighted); the result's swing as each input goes from its low to its high
//     value, largest on top; the spread of a result over model sets, one row per member with
//     the default highlighted, long member names broken into lines.
//   - Figure: one or more panels in a grid with aligned data areas and panel letters (a),
//     (b), … at a Preset size; Encode and Save by format name or file extension: SVG, PDF,
//     EPS, PNG, JPEG, TIFF (at a chosen dpi) and TeX (a pgfpicture whose labels LaTeX sets
//     in the manuscript's fonts).
//
// Presets (common practice, no source): Column, 8.5 cm × 6.4 cm, a journal's single column;
// DoubleColumn, 17 cm × 7.5 cm; both at the house sizes (tick labels 8 pt, axis labels 9 pt,
// legend 8 pt, lines 1.2 pt). Notebook, 16 cm × 10 cm (DefaultWidth × DefaultHeight), the
// same design drawn 1.6 times larger; Slide, 24 cm × 13.5 cm (16:9), drawn twice as large.
// Width and Height override a preset's size, keeping its scale. SVG, SVGInline and Save draw
// the Notebook preset; Encode(p, w, h, format) draws at w × h at the house sizes.
//
// The house style: text in Liberation Sans (Figure.Serif for Liberation Serif), both
// embedded in gonum/plot, so that a figure looks the same on every machine; the Okabe–Ito
// colours for colour-blind readers, with dash patterns and marker shapes cycling alongside,
// so that curves stay apart in greyscale; axes that hold every value, error bar, band and
// marker with a margin of 4 % of their span (of their decades on a logarithmic axis);
// decades labelled as powers of ten with minor ticks at 2…9; the legend in a corner of the
// data area on a white ground.
//
// # Labels
//
// Titles, axis labels, legend entries and bar labels are typeset. A plain label is drawn as
// written, except that a caret before a signed number or a braced group ("cm^-3", "cm^2",
// "m^{1/2}") and Unicode script digits ("cm⁻³") become superscripts, "_{...}" a subscript,
// and Greek letters are set as LaTeX sets them (lower case italic). A label with a pair of $
// signs is LaTeX-style markup: math between $ signs with ^ and _ scripts, the Greek letters
// and a few symbols (\times, \cdot, \pm, \approx, \leq, \geq, \infty, \to, …) as commands,
// \rm, \mathrm{...}, \textrm{...} and their italic and bold kin, the spaces \, \; \! \quad,
// and the escapes \% \$ \& \# \_ \{ \}: `$\tau_{\rm eff}$ (s)`, `$\Delta n$ (cm$^{-3}$)`.
// Unit turns a plain unit into markup for building such labels. Markup that does not parse
// is an error of the builder, naming the label and the byte where it fails.
//
// gonum/plot's own LaTeX handler (text.Latex, on go-latex v0.2.0) cannot set superscripts or
// subscripts (it panics on ^ and _) and always uses the serif face, so the package has its
// own small typesetter. PDF and EPS carry text as filled glyph outlines: gonum/plot's PDF
// backend writes text in code page 1252, which lacks Δ, τ and superscripts, and its EPS
// backend embeds no fonts.
//
// # Errors
//
// The package holds no physics: callers compute curves with the pvrec packages and pass them
// here. Every builder validates its input and returns an error (never panics), for example
// for a non-positive value on a logarithmic axis, which gonum/plot would otherwise reject
// with a panic, or for values spanning more than a float64 holds, on which its tick search
// would not end; axes whose values are all equal are padded. Rendering a plot that
// gonum/plot cannot draw (a zero plot.Plot) is an error too, and figure sizes are bounded by
// MaxSize, raster images by MaxPixels and maps by MaxNodes, so that a notebook loses a
// figure, never its kernel.
//
// Nothing inside pvrec imports this package except nb; notebooks and scripts use both.
package plots
