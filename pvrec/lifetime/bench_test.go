package lifetime_test

import (
	"bytes"
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// benchAnalysis runs the whole analysis of a 10,000-point trace of an invented sample (1e15
// cm^-3 n-type, 10 fA/cm² per side): Δn of every point, τeff, iVoc, the implied suns and the
// J0s fit. One op is one trace, tables included.
func benchAnalysis(b *testing.B, mode lifetime.Mode, trace func(testing.TB, lifetime.Sample, int) lifetime.Trace) {
	w := wafer(b, 1e15, 0)
	tr := trace(b, j0sSample(w, 10e-15), 10000)
	a := analysis(w, mode)
	b.ReportAllocs()
	for b.Loop() {
		r, err := a.Analyze(tr)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := r.J0s(lifetime.J0sOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkAnalyzeGeneralised10000(b *testing.B) {
	benchAnalysis(b, lifetime.Generalised, flashTrace)
}
func BenchmarkAnalyzeTransient10000(b *testing.B) {
	benchAnalysis(b, lifetime.Transient, transientTrace)
}
func BenchmarkAnalyzeQSS10000(b *testing.B) { benchAnalysis(b, lifetime.QSS, qssTrace) }

// BenchmarkSampleLifetimeExtendedSRH100: τeff(Δn) of a sample with extended-SRH surfaces
// (different front and rear dielectrics, so two interface solves per level) at 100 injection
// levels from 1e13 to 1e17 cm^-3. One op is the whole curve.
func BenchmarkSampleLifetimeExtendedSRH100(b *testing.B) {
	w := wafer(b, 0, 1.5e16)
	front := surface.NewExtendedSRH(surface.ConstantDit{D: 1e11}, surface.ConstantSigma(1e-14), surface.ConstantSigma(1e-16), -2e12)
	rear := surface.NewExtendedSRH(surface.ConstantDit{D: 3e11}, surface.ConstantSigma(1e-15), surface.ConstantSigma(1e-16), -1e12)
	s := lifetime.Sample{Wafer: w, W: width, Bulk: recomb.NewIntrinsic(), Front: front, Rear: rear}
	dn := make([]float64, 100)
	for i := range dn {
		dn[i] = math.Pow(10, 13+4*float64(i)/99)
	}
	out := make([]float64, len(dn))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := s.Lifetimes(dn, out); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkReadTrace10000 reads a 10,000-point trace file.
func BenchmarkReadTrace10000(b *testing.B) {
	w := wafer(b, 1e15, 0)
	var buf bytes.Buffer
	if err := lifetime.WriteTrace(&buf, flashTrace(b, j0sSample(w, 10e-15), 10000)); err != nil {
		b.Fatal(err)
	}
	raw := buf.Bytes()
	b.SetBytes(int64(len(raw)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := lifetime.ReadTrace(bytes.NewReader(raw)); err != nil {
			b.Fatal(err)
		}
	}
}
