package fermi

import "testing"

// benchEtas spreads the benchmark over all methods (series, each Chebyshev interval
// region, Sommerfeld), in an order that defeats branch prediction: common practice.
var benchEtas = func() []float64 {
	var e []float64
	for k := 0; k < 256; k++ {
		// η = −50 + 150·frac(k·0.618...), a low-discrepancy sweep of [−50, 100].
		f := float64(k) * 0.6180339887498949
		e = append(e, -50+150*(f-float64(int(f))))
	}
	return e
}()

// benchYs are F_{1/2} at benchEtas, the arguments for BenchmarkInvHalf.
var benchYs = func() []float64 {
	y := make([]float64, len(benchEtas))
	for i, e := range benchEtas {
		y[i] = Half(e)
	}
	return y
}()

var sink float64

func benchForward(b *testing.B, f func(float64) float64) {
	var s float64
	for i := 0; b.Loop(); i++ {
		s += f(benchEtas[i&255])
	}
	sink = s
}

func BenchmarkHalf(b *testing.B)      { benchForward(b, Half) }
func BenchmarkMinusHalf(b *testing.B) { benchForward(b, MinusHalf) }
func BenchmarkThreeHalf(b *testing.B) { benchForward(b, ThreeHalf) }
func BenchmarkZero(b *testing.B)      { benchForward(b, Zero) }

func BenchmarkInvHalf(b *testing.B) {
	var s float64
	for i := 0; b.Loop(); i++ {
		eta, _ := InvHalf(benchYs[i&255])
		s += eta
	}
	sink = s
}

// Per-region benchmarks, to show the cost of each method.
func benchAt(b *testing.B, f func(float64) float64, eta float64) {
	var s float64
	for b.Loop() {
		s += f(eta)
	}
	sink = s
}

func BenchmarkHalfSeries(b *testing.B)     { benchAt(b, Half, -10) }
func BenchmarkHalfChebyshev(b *testing.B)  { benchAt(b, Half, 1.3) }
func BenchmarkHalfSommerfeld(b *testing.B) { benchAt(b, Half, 60) }
