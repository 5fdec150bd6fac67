package plots

import (
	"math"
	"testing"
	"time"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

// hostile are the values of the hardening battery (DEVELOPERS.md).
var hostile = []float64{math.NaN(), math.Inf(1), math.Inf(-1), 0, -1, 1e-300, 1e300, -1e300,
	math.SmallestNonzeroFloat64, math.MaxFloat64, -math.MaxFloat64}

// call runs f, failing on a panic or if it does not return within 10 s, and renders the
// plot it returns (if any) to SVG and PDF, failing on a panic there too.
func call(t *testing.T, name string, f func() (*plot.Plot, error)) {
	t.Helper()
	done := make(chan string, 1)
	go func() {
		defer func() {
			if r := recover(); r != nil {
				done <- "panic: " + toString(r)
			}
		}()
		p, err := f()
		if err == nil && p != nil {
			for _, format := range []string{"svg", "pdf"} {
				if _, err := (Figure{Panels: []*plot.Plot{p}, Preset: Column}).Encode(format); err != nil {
					done <- "render " + format + ": " + err.Error()
					return
				}
			}
		}
		done <- ""
	}()
	select {
	case msg := <-done:
		if msg != "" {
			t.Errorf("%s: %s", name, msg)
		}
	case <-time.After(10 * time.Second):
		t.Errorf("%s: no return within 10 s", name)
	}
}

func toString(r any) string {
	if e, ok := r.(error); ok {
		return e.Error()
	}
	if s, ok := r.(string); ok {
		return s
	}
	return "non-string panic"
}

// TestHostile calls every builder with each hostile value in every numeric slot, on linear
// and logarithmic axes: an error or a drawable plot, never a panic or a hang (issue 12's
// hardening, for the new kinds of issue 13).
func TestHostile(t *testing.T) {
	for _, v := range hostile {
		for _, log := range []bool{false, true} {
			ax := Axes{LogX: log, LogY: log}
			for slot := range 5 {
				s := Series{X: []float64{1, 2, 3}, Y: []float64{1, 2, 3}, YErr: []float64{0.1, 0.1, 0.1},
					Lo: []float64{0.5, 1, 2}, Hi: []float64{2, 3, 4}}
				[][]float64{s.X, s.Y, s.YErr, s.Lo, s.Hi}[slot][1] = v
				call(t, "Lines", func() (*plot.Plot, error) { return Lines(ax, s) })
				r := s
				r.Right = true
				call(t, "Lines right", func() (*plot.Plot, error) {
					return Lines(Axes{LogX: log, LogRight: log}, Series{X: []float64{1, 3}, Y: []float64{1, 2}}, r)
				})
			}
			call(t, "Lines constant", func() (*plot.Plot, error) {
				return Lines(ax, Series{X: []float64{v, v}, Y: []float64{v, v}, Points: true, YErr: []float64{0, 0}})
			})
			g := Grid{X: []float64{1, 2, 3}, Y: []float64{1, 2}, Z: [][]float64{{1, 2, 3}, {4, 5, 6}}}
			for slot := range 3 {
				h := Grid{X: append([]float64(nil), g.X...), Y: append([]float64(nil), g.Y...),
					Z: [][]float64{append([]float64(nil), g.Z[0]...), append([]float64(nil), g.Z[1]...)}}
				[][]float64{h.X, h.Y, h.Z[1]}[slot][1] = v
				call(t, "HeatMap", func() (*plot.Plot, error) {
					return HeatMap(Axes{LogX: log, LogY: log, LogRight: log}, h, v, 2)
				})
			}
			call(t, "HeatMap constant", func() (*plot.Plot, error) {
				return HeatMap(Axes{LogRight: log}, Grid{X: []float64{1, 2}, Y: []float64{1, 2}, Z: [][]float64{{v, v}, {v, v}}})
			})
		}
		for _, log := range []bool{false, true} {
			for slot := range 3 {
				x := []float64{1, 2, 3, 5}
				opt := HistogramOptions{Mean: true, Percentiles: []float64{50}, Interval: [2]float64{2.5, 97.5}}
				switch slot {
				case 0:
					x[1] = v
				case 1:
					opt.Percentiles[0] = v
				default:
					opt.Interval[1] = v
				}
				call(t, "Histogram", func() (*plot.Plot, error) { return Histogram(Axes{LogX: log}, x, opt) })
			}
			call(t, "Histogram constant", func() (*plot.Plot, error) {
				return Histogram(Axes{LogX: log}, []float64{v, v, v}, HistogramOptions{Density: true, Mean: true})
			})
			call(t, "Histogram pair", func() (*plot.Plot, error) {
				return Histogram(Axes{LogX: log}, []float64{v, 1}, HistogramOptions{Density: true, Bins: 50})
			})
			for slot := range 3 {
				base, b := 1.0, TornadoBar{"a", 0.5, 2}
				*[]*float64{&base, &b.Low, &b.High}[slot] = v
				call(t, "Tornado", func() (*plot.Plot, error) { return Tornado(Axes{LogX: log}, base, []TornadoBar{b, {"b", 1, 1}}) })
			}
			call(t, "Strip", func() (*plot.Plot, error) {
				return Strip(Axes{LogX: log}, StripGroup{Label: "g", Members: []StripMember{{Label: "a", Value: v, Default: true}, {Label: "b", Value: 1}}},
					StripGroup{Label: "h", Members: []StripMember{{Label: "c", Value: -v}}})
			})
			call(t, "Strip constant", func() (*plot.Plot, error) {
				return Strip(Axes{LogX: log}, StripGroup{Members: []StripMember{{Label: "a", Value: v}, {Label: "b", Value: v}}})
			})
		}
		call(t, "Bars", func() (*plot.Plot, error) { return Bars(Axes{}, Bar{"a", v}, Bar{"b", 1}) })
		call(t, "Stacked", func() (*plot.Plot, error) {
			return Stacked(Axes{}, []string{"a", "b"}, BarSet{"x", []float64{v, 1}}, BarSet{"y", []float64{v, 2}})
		})
		call(t, "Grouped", func() (*plot.Plot, error) {
			return Grouped(Axes{}, []string{"a", "b"}, BarSet{"x", []float64{v, 1}}, BarSet{"y", []float64{-v, 2}})
		})
		call(t, "Figure", func() (*plot.Plot, error) {
			p, _ := Lines(Axes{}, Series{X: []float64{1, 2}, Y: []float64{1, 2}})
			for _, f := range []Figure{{Panels: []*plot.Plot{p}, Width: vgLen(v)}, {Panels: []*plot.Plot{p}, Height: vgLen(v)},
				{Panels: []*plot.Plot{p}, DPI: v}} {
				for _, format := range []string{"png", "svg"} {
					_, _ = f.Encode(format)
				}
			}
			return nil, nil
		})
	}
}

func vgLen(v float64) vg.Length { return vg.Length(v) }
