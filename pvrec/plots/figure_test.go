package plots

import (
	"bytes"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

func demoLines(t testing.TB) *plot.Plot {
	t.Helper()
	p, err := Lines(Axes{Title: "τ at 300 K", XLabel: "Δn (cm^-3)", YLabel: `$\tau_{\rm eff}$ (s)`, LogX: true, LogY: true, Legend: BottomLeft},
		Series{Label: "model", X: []float64{1e13, 1e15, 1e17}, Y: []float64{2e-3, 1e-3, 1e-5}},
		Series{Label: "measured", X: []float64{1e14, 1e16}, Y: []float64{1.5e-3, 2e-4}, YErr: []float64{2e-4, 5e-5}, Points: true})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestPresets checks the preset sizes (common practice) and that a figure's size follows
// its preset and overrides.
func TestPresets(t *testing.T) {
	for _, c := range []struct {
		p     Preset
		w, h  float64 // cm
		scale float64
	}{{Notebook, 16, 10, 1.6}, {Column, 8.5, 6.4, 1}, {DoubleColumn, 17, 7.5, 1}, {Slide, 24, 13.5, 2}} {
		w, h, s := c.p.Size()
		if math.Abs(float64(w/vg.Centimeter)-c.w) > 1e-9 || math.Abs(float64(h/vg.Centimeter)-c.h) > 1e-9 || s != c.scale {
			t.Errorf("%v: %v × %v cm at %g", c.p, w/vg.Centimeter, h/vg.Centimeter, s)
		}
	}
	if s := Preset(9).String(); s != "Preset(9)" {
		t.Errorf("String of an unknown preset: %q", s)
	}
	p := demoLines(t)
	b, err := Figure{Panels: []*plot.Plot{p}, Preset: Column, Height: 5 * vg.Centimeter, DPI: 254}.Encode("png")
	if err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		t.Fatal(err)
	}
	// 8.5 cm × 5 cm at 254 dpi (100 dots per cm) is 850 × 500 pixels.
	if r := img.Bounds(); r.Dx() != 850 || r.Dy() != 500 {
		t.Errorf("PNG of 8.5 × 5 cm at 254 dpi: %v", r)
	}
	// The Notebook preset draws at 1.6 × the house sizes: 16 × 10 cm at 254 dpi.
	b, err = Figure{Panels: []*plot.Plot{p}, DPI: 254}.Encode("png")
	if err != nil {
		t.Fatal(err)
	}
	if img, err = png.Decode(bytes.NewReader(b)); err != nil || img.Bounds().Dx() < 1598 || img.Bounds().Dx() > 1602 {
		t.Errorf("Notebook PNG at 254 dpi: %v, %v", img.Bounds(), err)
	}
}

// TestFigureRejects checks the errors of Figure for bad input.
func TestFigureRejects(t *testing.T) {
	p := demoLines(t)
	many := make([]*plot.Plot, 27)
	for i := range many {
		many[i] = p
	}
	for _, c := range []struct {
		name   string
		f      Figure
		format string
		want   string
	}{
		{"no panels", Figure{}, "svg", "at least one panel"},
		{"nil panel", Figure{Panels: []*plot.Plot{p, nil}}, "svg", "panel 1 is nil"},
		{"27 panels", Figure{Panels: many}, "svg", "at most 26"},
		{"negative cols", Figure{Panels: []*plot.Plot{p}, Cols: -1}, "svg", "Cols"},
		{"too many cols", Figure{Panels: []*plot.Plot{p}, Cols: 2}, "svg", "Cols"},
		{"preset", Figure{Panels: []*plot.Plot{p}, Preset: 7}, "svg", "unknown preset"},
		{"huge", Figure{Panels: []*plot.Plot{p}, Width: MaxSize + 1}, "svg", "at most 100 cm"},
		{"negative", Figure{Panels: []*plot.Plot{p}, Height: -1}, "svg", "positive"},
		{"NaN", Figure{Panels: []*plot.Plot{p}, Width: vg.Length(math.NaN())}, "svg", "positive"},
		{"dpi", Figure{Panels: []*plot.Plot{p}, DPI: -3}, "png", "DPI"},
		{"dpi NaN", Figure{Panels: []*plot.Plot{p}, DPI: math.NaN()}, "png", "DPI"},
		{"pixels", Figure{Panels: []*plot.Plot{p}, Width: MaxSize, Height: MaxSize, DPI: 2400}, "png", "MaxPixels"},
		{"format", Figure{Panels: []*plot.Plot{p}}, "bmp", "unknown format"},
		{"zero plot", Figure{Panels: []*plot.Plot{{}}}, "svg", "cannot draw"},
	} {
		if _, err := c.f.Encode(c.format); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
	if err := (Figure{Panels: []*plot.Plot{p}}).Save(filepath.Join(t.TempDir(), "f.bmp")); err == nil {
		t.Errorf("Save accepted .bmp")
	}
	if _, err := (Figure{}).SVGInline(); err == nil {
		t.Errorf("SVGInline of no panels: no error")
	}
	if _, err := Encode(p, 0, DefaultHeight, "png"); err == nil {
		t.Errorf("Encode at width 0: no error")
	}
}

// TestExportFormats checks every format's signature, that PDF and EPS carry no text (only
// glyph outlines) and embed no font, that TeX holds the labels as LaTeX, that Serif
// switches the face, and that rendering leaves the panel as it was.
func TestExportFormats(t *testing.T) {
	p := demoLines(t)
	before := *p
	f := Figure{Panels: []*plot.Plot{p, p}, Preset: DoubleColumn}
	for _, c := range []struct{ format, sig string }{
		{"svg", "<?xml"}, {"pdf", "%PDF-"}, {"eps", "%!PS-Adobe"}, {"png", "\x89PNG"}, {"jpg", "\xff\xd8"},
		{"tif", "II*\x00"}, {"tex", `\begin{pgfpicture}`},
	} {
		b, err := f.Encode(c.format)
		if err != nil {
			t.Fatalf("%s: %v", c.format, err)
		}
		if c.format != "tex" && !bytes.HasPrefix(b, []byte(c.sig)) || !bytes.Contains(b[:min(len(b), 200)], []byte(c.sig)) {
			t.Errorf("%s: output does not start with %q", c.format, c.sig)
		}
		switch c.format {
		case "pdf":
			if bytes.Contains(b, []byte("/FontFile")) || bytes.Contains(b, []byte("/BaseFont")) {
				t.Errorf("PDF embeds a font")
			}
		case "eps":
			if bytes.Contains(b, []byte("findfont")) || bytes.Contains(b, []byte(") show")) {
				t.Errorf("EPS shows text")
			}
		case "tex":
			for _, w := range []string{`$\Delta$n (cm$^{-3}$)`, `$\tau_{\rm eff}$ (s)`, `$10^{15}$`, `(a)`, `(b)`, `\fontsize{8pt}`} {
				if !bytes.Contains(b, []byte(w)) {
					t.Errorf("TeX lacks %q", w)
				}
			}
		}
	}
	svg, err := Figure{Panels: []*plot.Plot{p}, Serif: true}.SVGInline()
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(svg, []byte("'Liberation Serif','Times New Roman'")) || bytes.Contains(svg, []byte("Liberation Sans")) {
		t.Errorf("Serif figure: not all text in Liberation Serif")
	}
	if p.X.Label.Text != before.X.Label.Text || p.Y.Label.Text != before.Y.Label.Text || p.Title.TextStyle != before.Title.TextStyle {
		t.Errorf("rendering changed the panel")
	}
	dir := t.TempDir()
	for _, name := range []string{"f.svg", "f.pdf", "f.eps", "f.png", "f.tex"} {
		if err := f.Save(filepath.Join(dir, name)); err != nil {
			t.Errorf("Save(%s): %v", name, err)
		} else if fi, err := os.Stat(filepath.Join(dir, name)); err != nil || fi.Size() == 0 {
			t.Errorf("Save(%s) wrote nothing", name)
		}
	}
	// A plot made with plot.New keeps its own text styles.
	q := plot.New()
	q.X.Label.Text = "plain gonum"
	q.X.Min, q.X.Max, q.Y.Min, q.Y.Max = 0, 1, 0, 1
	b, err := Figure{Panels: []*plot.Plot{q}}.Encode("svg")
	if err != nil || !bytes.Contains(b, []byte(">plain gonum<")) || !bytes.Contains(b, []byte("Liberation Serif")) {
		t.Errorf("foreign plot: %v", err)
	}
}

// TestRenderConcurrently renders one plot from several goroutines (run with -race): a
// figure copies what it changes.
func TestRenderConcurrently(t *testing.T) {
	p := demoLines(t)
	var wg sync.WaitGroup
	for i := range 4 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			f := Figure{Panels: []*plot.Plot{p}, Serif: i%2 == 0}
			if _, err := f.Encode([]string{"svg", "pdf", "png", "tex"}[i]); err != nil {
				t.Error(err)
			}
		}()
	}
	wg.Wait()
}
