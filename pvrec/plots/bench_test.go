package plots

import (
	"math"
	"testing"

	"gonum.org/v1/plot"
)

// BenchmarkSVGInline measures what nb.Show costs for a log–log figure of two series.
func BenchmarkSVGInline(b *testing.B) {
	p := demoLines(b)
	for b.Loop() {
		if _, err := SVGInline(p); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkHeatMapPNG measures a 31 × 25 map with contours at print size and 300 dpi.
func BenchmarkHeatMapPNG(b *testing.B) {
	g, err := GridFunc(logspace(1e11, 3e12, 31), logspace(1e9, 1e12, 25), func(q, d float64) (float64, error) {
		return d / 1e8 / (1 + q*q/1e24), nil
	})
	if err != nil {
		b.Fatal(err)
	}
	p, err := HeatMap(Axes{LogX: true, LogY: true, LogRight: true, RightLabel: "Seff (cm/s)"}, g, 10, 100)
	if err != nil {
		b.Fatal(err)
	}
	f := Figure{Panels: []*plot.Plot{p}, Preset: Column}
	for b.Loop() {
		if _, err := f.Encode("png"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkHistogram measures a histogram of 100 000 samples with its markers, built and
// rendered as nb.Show does.
func BenchmarkHistogram(b *testing.B) {
	x := make([]float64, 100_000)
	for i := range x {
		x[i] = math.Sin(float64(i)*0.7) + math.Cos(float64(i)*1.3)
	}
	for b.Loop() {
		p, err := Histogram(Axes{XLabel: "Voc (V)", YLabel: "draws"}, x,
			HistogramOptions{Mean: true, Percentiles: []float64{50}, Interval: [2]float64{2.5, 97.5}})
		if err != nil {
			b.Fatal(err)
		}
		if _, err := SVGInline(p); err != nil {
			b.Fatal(err)
		}
	}
}
