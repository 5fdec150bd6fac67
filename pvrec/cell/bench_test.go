package cell

import (
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// benchDevice is the benchmark cell of issue 10: five parts given as J0s (invented values) on
// an intrinsic p-type base (Na = 1.5e16 cm^-3, 180 µm), with Rs and the default model set at
// 298.15 K.
func benchDevice(b *testing.B) *Device {
	b.Helper()
	d, err := New(Design{
		Material: materialAt(b, 298.15),
		Base:     Base{Thickness: 180e-4, Na: 1.5e16, Mechanisms: []recomb.Mechanism{recomb.NewIntrinsic()}},
		Front: []Part{
			{Name: "emitter, passivated", Fraction: 0.96, J0: 30e-15},
			{Name: "emitter, under fingers", Fraction: 0.03, J0: 800e-15, Contact: true},
			{Name: "emitter, under busbars", Fraction: 0.01, J0: 800e-15, Contact: true},
		},
		Rear: []Part{
			{Name: "passivated", Fraction: 0.98, J0: 8e-15},
			{Name: "contacts", Fraction: 0.02, J0: 400e-15, Contact: true},
		},
		Rs:  0.5,
		Jsc: 40e-3,
	})
	if err != nil {
		b.Fatal(err)
	}
	return d
}

// BenchmarkCurveMPP is a 200-point J–V curve and its maximum-power point (target: < 1 ms).
func BenchmarkCurveMPP(b *testing.B) {
	d := benchDevice(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := d.Curve(200); err != nil {
			b.Fatal(err)
		}
		if _, err := d.MaxPower(); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkVoc is one open-circuit voltage (target: < 20 µs).
func BenchmarkVoc(b *testing.B) {
	d := benchDevice(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := d.Voc(); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkCurveAt is a 200-point J–V curve at caller-chosen terminal voltages, each point a
// bracketed root in ln Δn (warm-started from the previous point), with Rs.
func BenchmarkCurveAt(b *testing.B) {
	d := benchDevice(b)
	v := make([]float64, 200)
	for i := range v {
		v[i] = 0.7 * float64(i) / float64(len(v)-1)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := d.CurveAt(v); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSolve is a full Result (Voc, Jsc, MPP, pseudo FF, budgets at Voc and MPP).
func BenchmarkSolve(b *testing.B) {
	d := benchDevice(b)
	b.ReportAllocs()
	for b.Loop() {
		if _, err := d.Solve(); err != nil {
			b.Fatal(err)
		}
	}
}
