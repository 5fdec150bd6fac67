package plots

import (
	"bytes"
	"fmt"
	"image/color"
	"math"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgeps"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgpdf"
	"gonum.org/v1/plot/vg/vgsvg"
	"gonum.org/v1/plot/vg/vgtex"
)

// Preset is a figure size together with the scale of its type and lines. The print presets
// draw at the house sizes (tick labels 8 pt, axis labels 9 pt, lines 1.2 pt); Notebook and
// Slide draw the same design enlarged, so that it reads on a screen and across a room.
// Sizes are common practice (no source).
type Preset uint8

// Presets.
const (
	Notebook     Preset = iota // 16 cm × 10 cm, type and lines 1.6 × the house sizes (tick labels 12.8 pt): inline in a notebook
	Column                     // 8.5 cm × 6.4 cm, a journal's single column, at the house sizes
	DoubleColumn               // 17 cm × 7.5 cm, a journal's full text width (two columns), at the house sizes
	Slide                      // 24 cm × 13.5 cm (16:9), type and lines 2 × the house sizes (tick labels 16 pt)
)

// Size returns the preset's width and height on paper and the factor by which it enlarges
// the house type and line sizes.
func (p Preset) Size() (w, h vg.Length, scale float64) {
	switch p {
	case Column:
		return 8.5 * vg.Centimeter, 6.4 * vg.Centimeter, 1
	case DoubleColumn:
		return 17 * vg.Centimeter, 7.5 * vg.Centimeter, 1
	case Slide:
		return 24 * vg.Centimeter, 13.5 * vg.Centimeter, 2
	default:
		return DefaultWidth, DefaultHeight, 1.6
	}
}

// String returns the preset's name.
func (p Preset) String() string {
	switch p {
	case Notebook:
		return "Notebook"
	case Column:
		return "Column"
	case DoubleColumn:
		return "DoubleColumn"
	case Slide:
		return "Slide"
	}
	return fmt.Sprintf("Preset(%d)", uint8(p))
}

// MaxPixels is the largest number of pixels of a PNG, JPEG or TIFF image (our choice: 40
// million, 160 MB in memory; a DoubleColumn figure at 1200 dpi has 28 million).
const MaxPixels = 40_000_000

// figureBorder is the white border around a figure, pt at the design size.
const figureBorder = 3

// maxPanels is the number of panel letters, (a) to (z).
const maxPanels = 26

// Figure is a figure ready for export: one or more panels (plots made by Lines, Bars,
// Grouped, Stacked, HeatMap, Histogram, Tornado, Strip or plot.New) at a preset size, laid out in a grid whose data
// areas line up (plot.Align), each panel lettered (a), (b), … at its top left when there are
// several.
//
// The zero Preset is Notebook; Width and Height override the preset's size, keeping its
// scale. Text is set in Liberation Sans, or Liberation Serif if Serif; both are embedded in
// gonum/plot, so a figure looks the same on every machine. Rendering never changes the
// panels.
type Figure struct {
	Panels        []*plot.Plot // the panels, left to right, then top to bottom; at most 26
	Cols          int          // panels per row; 0 puts all in one row
	Preset        Preset       // size and type scale; the zero value is Notebook
	Width, Height vg.Length    // size on paper when > 0 (e.g. 12*vg.Centimeter), at most MaxSize
	Serif         bool         // set text in Liberation Serif instead of Liberation Sans
	NoLetters     bool         // leave out the panel letters of a figure with several panels
	DPI           float64      // resolution of PNG, JPEG and TIFF output, dots per inch, at most 2400; 0 means 300
}

// Encode renders the figure in a format: "svg" (fonts embedded), "pdf", "eps", "png",
// "jpg" or "jpeg", "tif" or "tiff", or "tex" (a pgfpicture for \input in a LaTeX document
// that loads the pgf package: LaTeX typesets the labels in the document's fonts; the picture
// has the preset's unscaled design size, to be scaled in LaTeX if needed). PDF and EPS carry
// their text as glyph outlines, so that they print the same everywhere (the house text; a
// plot made with plot.New keeps its own text styles and gonum/plot's way of writing them).
// It returns an error for no panels, a nil panel, more than 26, a negative Cols or one above the number of
// panels, an unknown preset, a size or DPI out of bounds, an image of more than MaxPixels,
// an unknown format, or a panel gonum/plot cannot draw (a zero plot.Plot).
func (f Figure) Encode(format string) ([]byte, error) {
	return f.render(strings.ToLower(format), true)
}

// SVGInline renders the figure as a light SVG document without embedded fonts, for display
// in a notebook. Text is set in Liberation Sans with the metric-compatible Arial and
// Helvetica as fall-backs (Liberation Serif, Times New Roman and Times for a serif figure), so
// that the layout holds wherever one of them is installed.
func (f Figure) SVGInline() ([]byte, error) {
	b, err := f.render("svg", false)
	if err != nil {
		return nil, err
	}
	b = bytes.ReplaceAll(b, []byte("font-family:Liberation Sans;"),
		[]byte("font-family:'Liberation Sans',Arial,Helvetica,sans-serif;"))
	return bytes.ReplaceAll(b, []byte("font-family:Liberation Serif;"),
		[]byte("font-family:'Liberation Serif','Times New Roman',Times,serif;")), nil
}

// Save writes the figure to path in the format its extension names (.svg, .pdf, .eps, .png,
// .jpg, .jpeg, .tif, .tiff, .tex), as Encode renders it.
func (f Figure) Save(path string) error {
	ext := strings.TrimPrefix(strings.ToLower(filepath.Ext(path)), ".")
	if !knownFormat(ext) {
		return fmt.Errorf("plots: unsupported file extension %q in %s (want .svg, .pdf, .eps, .png, .jpg, .tif or .tex)", ext, path)
	}
	b, err := f.Encode(ext)
	if err != nil {
		return err
	}
	if err := os.WriteFile(path, b, 0o644); err != nil {
		return fmt.Errorf("plots: %v", err)
	}
	return nil
}

func knownFormat(f string) bool {
	switch f {
	case "svg", "pdf", "eps", "png", "jpg", "jpeg", "tif", "tiff", "tex":
		return true
	}
	return false
}

// size returns the figure's size on paper and its scale, or an error.
func (f Figure) size() (w, h vg.Length, scale float64, err error) {
	if f.Preset > Slide {
		return 0, 0, 0, fmt.Errorf("plots: unknown preset %v", f.Preset)
	}
	w, h, scale = f.Preset.Size()
	if f.Width != 0 {
		w = f.Width
	}
	if f.Height != 0 {
		h = f.Height
	}
	if !(w > 0 && h > 0 && w <= MaxSize && h <= MaxSize) {
		return 0, 0, 0, fmt.Errorf("plots: figure size must be positive and at most %v cm per side, got %v × %v cm",
			float64(MaxSize/vg.Centimeter), float64(w/vg.Centimeter), float64(h/vg.Centimeter))
	}
	return w, h, scale, nil
}

// check returns an error for a figure that cannot be rendered (other than its size).
func (f Figure) check() error {
	n := len(f.Panels)
	switch {
	case n == 0:
		return fmt.Errorf("plots: a figure needs at least one panel")
	case n > maxPanels:
		return fmt.Errorf("plots: a figure holds at most %d panels, got %d", maxPanels, n)
	case f.Cols < 0 || f.Cols > n:
		return fmt.Errorf("plots: Cols must be between 0 and the %d panels, got %d", n, f.Cols)
	case !(f.DPI >= 0 && f.DPI <= 2400):
		return fmt.Errorf("plots: DPI must be between 0 (300) and 2400, got %g", f.DPI)
	}
	for i, p := range f.Panels {
		if p == nil {
			return fmt.Errorf("plots: panel %d is nil", i)
		}
	}
	return nil
}

// recoverDraw turns a panic of gonum/plot while drawing into the error *err.
func recoverDraw(err *error) {
	if r := recover(); r != nil {
		*err = fmt.Errorf("plots: gonum/plot cannot draw this plot (make it with Lines or plot.New): %v", r)
	}
}

// render draws the figure in format (lower case); embed embeds the fonts of an SVG.
func (f Figure) render(format string, embed bool) (b []byte, err error) {
	defer recoverDraw(&err)
	if err := f.check(); err != nil {
		return nil, err
	}
	w, h, scale, err := f.size()
	if err != nil {
		return nil, err
	}
	if !knownFormat(format) {
		return nil, fmt.Errorf("plots: unknown format %q (want svg, pdf, eps, png, jpg, tif or tex)", format)
	}
	mode := drawText
	var c vg.CanvasWriterTo
	var canvas vg.CanvasSizer
	switch format {
	case "svg":
		s := vgsvg.NewWith(vgsvg.UseWH(w, h), vgsvg.EmbedFonts(embed))
		c, canvas = s, s
	case "pdf":
		p := vgpdf.New(w, h)
		c, canvas, mode = p, p, drawOutlines
	case "eps":
		e := vgeps.New(w, h)
		c, canvas, mode = e, e, drawOutlines
	case "tex":
		t := vgtex.New(w/vg.Length(scale), h/vg.Length(scale))
		c, canvas, mode, scale = t, t, drawLaTeX, 1
	default: // raster: draw the design size at a higher resolution rather than scale bitmaps
		dpi := f.DPI
		if dpi == 0 {
			dpi = 300
		}
		if px := (w.Dots(dpi) + 1) * (h.Dots(dpi) + 1); px > MaxPixels {
			return nil, fmt.Errorf("plots: a %v × %v cm image at %g dpi has %.3g pixels, more than MaxPixels (%d)",
				float64(w/vg.Centimeter), float64(h/vg.Centimeter), dpi, px, MaxPixels)
		}
		img := vgimg.NewWith(vgimg.UseWH(w/vg.Length(scale), h/vg.Length(scale)), vgimg.UseDPI(int(math.Round(dpi*scale))))
		canvas = img
		switch format {
		case "png":
			c = vgimg.PngCanvas{Canvas: img}
		case "jpg", "jpeg":
			c = vgimg.JpegCanvas{Canvas: img}
		default:
			c = vgimg.TiffCanvas{Canvas: img}
		}
		scale = 1
	}
	dc := draw.New(canvas)
	if scale != 1 {
		canvas.Push()
		canvas.Scale(scale, scale)
		dc = draw.NewCanvas(canvas, w/vg.Length(scale), h/vg.Length(scale))
	}
	f.draw(dc, mode)
	if scale != 1 {
		canvas.Pop()
	}
	var buf bytes.Buffer
	if _, err := c.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("plots: rendering %s: %v", format, err)
	}
	b = buf.Bytes()
	if format == "eps" {
		// vgeps (v0.17) begins with "%%!PS-Adobe", which PostScript readers take for a
		// comment rather than the "%!PS-Adobe" magic of an EPS file, and writes its
		// %%Creator comment without the colon.
		b = bytes.Replace(b, []byte("%%!PS-Adobe"), []byte("%!PS-Adobe"), 1)
		b = bytes.Replace(b, []byte("%%Creator gonum"), []byte("%%Creator: gonum"), 1)
	}
	return b, nil
}

// draw draws the panels on dc, inside a thin white border.
func (f Figure) draw(dc draw.Canvas, mode drawMode) {
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	b := vg.Points(figureBorder)
	dc = draw.Crop(dc, b, -b, b, -b)
	panels := make([]*plot.Plot, len(f.Panels))
	for i, p := range f.Panels {
		panels[i] = restyled(p, f.Serif, mode)
	}
	if len(panels) == 1 {
		panels[0].Draw(dc)
		return
	}
	cols := f.Cols
	if cols == 0 {
		cols = len(panels)
	}
	rows := (len(panels) + cols - 1) / cols
	grid := make([][]*plot.Plot, rows)
	for j := range grid {
		grid[j] = make([]*plot.Plot, cols)
		for i := range grid[j] {
			if k := j*cols + i; k < len(panels) {
				grid[j][i] = panels[k]
			}
		}
	}
	tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: vg.Points(8), PadY: vg.Points(6)}
	aligned := plot.Align(grid, tiles, dc)
	lsty := letterStyle(f.Serif, mode)
	strip := vg.Length(0)
	if !f.NoLetters {
		strip = lsty.Height("(a)") + vg.Points(2)
	}
	for k, p := range panels {
		j, i := k/cols, k%cols
		c := aligned[j][i]
		c.Max.Y -= strip
		p.Draw(c)
		if !f.NoLetters {
			t := tiles.At(dc, i, j)
			dc.FillText(lsty, vg.Point{X: t.Min.X, Y: t.Max.Y}, "("+string(rune('a'+k))+")")
		}
	}
}

// Encode renders p in the given format ("svg", "pdf", "eps", "png", "jpg", "tif", "tex", as
// Figure.Encode) at width w and height h (each > 0 and at most MaxSize) at the house type
// sizes, the print scale (tick labels 8 pt); raster formats at 96 dpi, and SVG without
// embedded fonts. A plot that gonum/plot cannot draw (such as a zero plot.Plot, not made by
// plot.New or Lines) is an error, not a panic.
func Encode(p *plot.Plot, w, h vg.Length, format string) (b []byte, err error) {
	if p == nil {
		return nil, fmt.Errorf("plots: nil plot")
	}
	if !(w > 0 && h > 0) { // zero would mean the preset's size
		return nil, fmt.Errorf("plots: figure size must be positive and at most %v cm per side, got %v × %v cm",
			float64(MaxSize/vg.Centimeter), float64(w/vg.Centimeter), float64(h/vg.Centimeter))
	}
	return Figure{Panels: []*plot.Plot{p}, Preset: Column, Width: w, Height: h, DPI: 96}.render(strings.ToLower(format), false)
}

// SVG renders p as a self-contained SVG document at the default size (the Notebook preset),
// with its fonts embedded (about 0.5 MB per face, regular and italic: 1 MB), so that text is measured and drawn alike in every
// viewer: this is the form for files that travel (Save uses it). Like Encode it returns an
// error for a plot gonum/plot cannot draw.
func SVG(p *plot.Plot) ([]byte, error) {
	if p == nil {
		return nil, fmt.Errorf("plots: nil plot")
	}
	return Figure{Panels: []*plot.Plot{p}}.Encode("svg")
}

// SVGInline renders p as a light SVG document (a few tens of kB) without embedded fonts, at
// the default size (the Notebook preset), for display in a notebook, as Figure.SVGInline.
func SVGInline(p *plot.Plot) ([]byte, error) {
	if p == nil {
		return nil, fmt.Errorf("plots: nil plot")
	}
	return Figure{Panels: []*plot.Plot{p}}.SVGInline()
}

// Save writes p to path at the default size (the Notebook preset); the extension (.svg,
// .pdf, .eps, .png, .jpg, .tif, .tex) picks the format, as for Figure.Save. PNG, JPEG and
// TIFF are written at 96 dpi.
func Save(p *plot.Plot, path string) error {
	if p == nil {
		return fmt.Errorf("plots: nil plot")
	}
	return Figure{Panels: []*plot.Plot{p}, DPI: 96}.Save(path)
}
