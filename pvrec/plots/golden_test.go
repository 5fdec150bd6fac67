package plots

// Golden-image tests: every figure kind is rendered to PNG at a fixed size and resolution and
// compared with the reference image committed in testdata/golden/.
//
// Regenerate the references after a deliberate change of the house style, and look at every
// image before committing it:
//
//	go test ./pvrec/plots -run TestGolden -update
//
// (The -update flag exists only in this package's tests; do not pass it to go test ./...)
//
// The rendering is pure Go (gonum/plot's vgimg and the Liberation fonts it embeds, no system
// fonts), so it is identical from run to run on one machine. To allow for rounding in the
// rasteriser's anti-aliasing on another machine of the same kind, a pixel matches if every
// channel is within goldenTolerance of the reference, and the test fails if more than
// goldenFraction of the pixels do not match. A failing test writes the image it got and a
// difference image (mismatching pixels in red) to $TMPDIR/pvrec-golden/ and names them.

import (
	"bytes"
	"flag"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

var update = flag.Bool("update", false, "rewrite the golden images in testdata/golden")

const (
	goldenDPI       = 150
	goldenTolerance = 8    // largest difference of a channel (of 255) for matching pixels
	goldenFraction  = 2e-4 // largest fraction of pixels that may not match (0.02 %)
	goldenDir       = "testdata/golden"
)

// goldenFigures returns the figures of the golden tests, one per kind (invented data).
func goldenFigures(t *testing.T) map[string]Figure {
	t.Helper()
	must := func(p *plot.Plot, err error) *plot.Plot {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
		return p
	}
	dn := logspace(1e12, 1e18, 41)
	// τ with a bulk lifetime tb and an Auger-like fall at high injection, n² / k (invented).
	curve := func(tb, k float64) []float64 {
		y := make([]float64, len(dn))
		for i, n := range dn {
			y[i] = 1 / (1/tb + n*n/k)
		}
		return y
	}
	// Five curves: the colour, dash and (for points) marker cycles.
	var cycle []Series
	for i, tb := range []float64{3e-3, 2e-3, 1e-3, 5e-4, 2e-4} {
		cycle = append(cycle, Series{Label: fmt.Sprintf("τ_{b} = %g ms", tb*1e3), X: dn, Y: curve(tb, 1e31*float64(i+1))})
	}
	lines := must(Lines(Axes{XLabel: "Δn (cm^-3)", YLabel: `$\tau_{\rm eff}$ (s)`, LogX: true, LogY: true, Legend: BottomLeft}, cycle...))

	model := curve(2e-3, 1e31)
	lo, hi := make([]float64, len(model)), make([]float64, len(model))
	for i, v := range model {
		lo[i], hi[i] = 0.8*v, 1.25*v
	}
	mx := []float64{3e12, 1e13, 1e14, 1e15, 1e16, 1e17, 5e17}
	my := make([]float64, len(mx))
	me := make([]float64, len(mx))
	for i, x := range mx {
		my[i] = (1 + 0.08*math.Sin(float64(3*i))) / (1/2e-3 + x*x/1e31)
		me[i] = 0.1 * my[i]
	}
	points := must(Lines(Axes{XLabel: "Δn (cm^-3)", YLabel: "τ (s)", LogX: true, LogY: true, Legend: BottomLeft},
		Series{Label: "model, ±25 %", X: dn, Y: model, Lo: lo, Hi: hi},
		Series{Label: "measured", X: mx, Y: my, YErr: me, Points: true},
		Series{Label: "intrinsic limit", X: dn, Y: curve(2e-2, 1e31), Dashed: true}))

	ivoc := make([]float64, len(dn))
	for i, n := range dn {
		ivoc[i] = 0.0258 * math.Log(n*(n+1.5e16)/1e20)
	}
	twin := must(Lines(Axes{XLabel: "Δn (cm^-3)", YLabel: "τ (s)", RightLabel: "iVoc (V)", LogX: true, LogY: true, Legend: TopRight},
		Series{Label: "τ (left)", X: dn, Y: model},
		Series{Label: "iVoc (right)", X: dn, Y: ivoc, Right: true}))

	cats := []string{"front: emitter", "rear: contacts", "base"}
	bars := must(Bars(Axes{XLabel: "J0 (fA/cm^2)"}, Bar{cats[0], 34}, Bar{cats[1], 10.5}, Bar{cats[2], 4.1}))
	stacked := must(Stacked(Axes{XLabel: "J0 (fA/cm^2)", Legend: BottomRight}, []string{"front", "rear", "base"},
		BarSet{"passivated", []float64{20, 6, 4}}, BarSet{"contacts", []float64{14, 10, 0}}, BarSet{"edge", []float64{2, 1, 0.5}}))
	grouped := must(Grouped(Axes{XLabel: "J0 (fA/cm^2)", Legend: BottomRight}, []string{"front", "rear", "base"},
		BarSet{"design A", []float64{34, 16, 4}}, BarSet{"design B", []float64{25, 19, 4}}))

	qf := make([]float64, 31)
	for i := range qf {
		qf[i] = 1e11 * float64(i)
	}
	g, err := GridFunc(qf, logspace(1e9, 1e12, 25), func(q, d float64) (float64, error) {
		return d / 1e8 / (1 + q*q/1e24), nil
	})
	if err != nil {
		t.Fatal(err)
	}
	heat := must(HeatMap(Axes{XLabel: "Qf (cm^-2)", YLabel: "Dit (cm^-2 eV^-1)", LogY: true, RightLabel: "Seff (cm/s)", LogRight: true}, g, 1, 10, 100))

	// An uncertainty analysis (invented): Voc over 4000 draws, normal about 0.712 V; J0
	// over the same draws, log-normal, on a log axis.
	rng := rand.New(rand.NewPCG(15, 1))
	voc, j0 := make([]float64, 4000), make([]float64, 4000)
	for i := range voc {
		voc[i] = 0.712 + 0.004*rng.NormFloat64()
		j0[i] = 30e-15 * math.Exp(0.35*rng.NormFloat64())
	}
	hist := must(Histogram(Axes{XLabel: "Voc (V)", YLabel: "draws", Legend: TopRight}, voc,
		HistogramOptions{Label: "4000 draws", Mean: true, Percentiles: []float64{50}, Interval: [2]float64{2.5, 97.5}}))
	histLog := must(Histogram(Axes{XLabel: "J0 (A/cm^2)", YLabel: "density (per decade)", LogX: true, Legend: TopRight}, j0,
		HistogramOptions{Density: true, Percentiles: []float64{2.5, 97.5}}))
	tornado := must(Tornado(Axes{XLabel: "Voc (mV)", Legend: BottomLeft}, 712, []TornadoBar{
		{"Qf ± 30 %", 710.5, 713.1}, {"τ_{bulk} ± 50 %", 704, 716}, {"W 160–200 µm", 713, 711}, {"Dit ×3", 708.8, 713}}))
	strip := must(Strip(Axes{XLabel: "J0 (fA/cm^2)"},
		StripGroup{Label: "BGN varied", Members: []StripMember{
			{Label: "BGN model A + FD, μ model M1, Auger model X1", Value: 31.5, Default: true},
			{Label: "BGN model B + FD, μ model M1, Auger model X1", Value: 29.2},
			{Label: "BGN model C, μ model M1, Auger model X1", Value: 36.8}}},
		StripGroup{Label: "mobility varied", Members: []StripMember{
			{Label: "μ model M1", Value: 31.5, Default: true}, {Label: "μ model M2", Value: 33.0}}}))

	one := func(p *plot.Plot) Figure { return Figure{Panels: []*plot.Plot{p}, Preset: Column, DPI: goldenDPI} }
	return map[string]Figure{
		"lines":     one(lines),
		"points":    one(points),
		"twin":      one(twin),
		"bars":      one(bars),
		"stacked":   one(stacked),
		"grouped":   one(grouped),
		"heatmap":   one(heat),
		"histogram": one(hist),
		"histlog":   one(histLog),
		"tornado":   one(tornado),
		"strip":     one(strip),
		"panels":    {Panels: []*plot.Plot{points, stacked}, Preset: DoubleColumn, DPI: goldenDPI},
		"notebook":  {Panels: []*plot.Plot{lines}, DPI: 96},
		"serif":     {Panels: []*plot.Plot{twin}, Preset: Column, Serif: true, DPI: goldenDPI},
		"slide":     {Panels: []*plot.Plot{points}, Preset: Slide, Height: 12 * vg.Centimeter, DPI: 60},
	}
}

// logspace returns n values from a to b, evenly spaced in their logarithms.
func logspace(a, b float64, n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = a * math.Pow(b/a, float64(i)/float64(n-1))
	}
	return v
}

// TestGolden renders every figure kind and compares it with its reference image.
func TestGolden(t *testing.T) {
	for name, f := range goldenFigures(t) {
		t.Run(name, func(t *testing.T) {
			b, err := f.Encode("png")
			if err != nil {
				t.Fatal(err)
			}
			path := filepath.Join(goldenDir, name+".png")
			if *update {
				if err := os.MkdirAll(goldenDir, 0o755); err != nil {
					t.Fatal(err)
				}
				if err := os.WriteFile(path, b, 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test ./pvrec/plots -run TestGolden -update to create it)", err)
			}
			if msg := compareImages(b, want, name); msg != "" {
				t.Error(msg)
			}
		})
	}
}

// compareImages compares two PNG images and returns "" if they match within the tolerance,
// else what differs (writing the image got and a difference image for a look).
func compareImages(got, want []byte, name string) string {
	g, err := png.Decode(bytes.NewReader(got))
	if err != nil {
		return fmt.Sprintf("decoding the image got: %v", err)
	}
	w, err := png.Decode(bytes.NewReader(want))
	if err != nil {
		return fmt.Sprintf("decoding the reference: %v", err)
	}
	if g.Bounds() != w.Bounds() {
		return fmt.Sprintf("size %v, reference %v", g.Bounds().Size(), w.Bounds().Size()) + keep(got, nil, name)
	}
	r := g.Bounds()
	diff := image.NewRGBA(r)
	bad := 0
	for y := r.Min.Y; y < r.Max.Y; y++ {
		for x := r.Min.X; x < r.Max.X; x++ {
			a := color.RGBAModel.Convert(g.At(x, y)).(color.RGBA)
			b := color.RGBAModel.Convert(w.At(x, y)).(color.RGBA)
			d := max(absDiff(a.R, b.R), absDiff(a.G, b.G), absDiff(a.B, b.B), absDiff(a.A, b.A))
			if d > goldenTolerance {
				bad++
				diff.Set(x, y, color.RGBA{R: 255, A: 255})
			} else {
				v := 255 - (255-uint8((int(b.R)+int(b.G)+int(b.B))/3))/4 // the reference, faint
				diff.Set(x, y, color.RGBA{R: v, G: v, B: v, A: 255})
			}
		}
	}
	n := r.Dx() * r.Dy()
	if float64(bad) <= goldenFraction*float64(n) {
		return ""
	}
	return fmt.Sprintf("%d of %d pixels (%.3f %%) differ by more than %d, allowed %.3f %%", bad, n,
		100*float64(bad)/float64(n), goldenTolerance, 100*goldenFraction) + keep(got, diff, name)
}

func absDiff(a, b uint8) uint8 {
	if a > b {
		return a - b
	}
	return b - a
}

// keep writes the image got (and the difference image) for a look and says where.
func keep(got []byte, diff image.Image, name string) string {
	dir := filepath.Join(os.TempDir(), "pvrec-golden")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return ""
	}
	p := filepath.Join(dir, name+".png")
	if os.WriteFile(p, got, 0o644) != nil {
		return ""
	}
	msg := "; got " + p
	if diff != nil {
		var b bytes.Buffer
		if png.Encode(&b, diff) == nil && os.WriteFile(filepath.Join(dir, name+"-diff.png"), b.Bytes(), 0o644) == nil {
			msg += ", differences in " + filepath.Join(dir, name+"-diff.png")
		}
	}
	return msg
}

// TestCompareImages checks the comparison itself: equal images match, one changed pixel is
// within the allowed fraction of a large image, a changed region is not.
func TestCompareImages(t *testing.T) {
	img := image.NewRGBA(image.Rect(0, 0, 200, 100))
	for i := range img.Pix {
		img.Pix[i] = 255
	}
	enc := func() []byte {
		var b bytes.Buffer
		if err := png.Encode(&b, img); err != nil {
			t.Fatal(err)
		}
		return b.Bytes()
	}
	ref := enc()
	if msg := compareImages(ref, ref, "same"); msg != "" {
		t.Errorf("equal images: %s", msg)
	}
	img.Set(3, 3, color.RGBA{A: 255})
	if msg := compareImages(enc(), ref, "one-pixel"); msg != "" {
		t.Errorf("one pixel of 20000: %s", msg)
	}
	for x := 0; x < 20; x++ {
		img.Set(x, 10, color.RGBA{A: 255})
	}
	if msg := compareImages(enc(), ref, "twenty-pixels"); msg == "" {
		t.Errorf("twenty changed pixels matched")
	}
}
