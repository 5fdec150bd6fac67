package lifetime_test

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
)

// addDemoFiles adds the invented demo files of testdata/lifetime to a fuzz corpus.
func addDemoFiles(f *testing.F, pattern string) {
	paths, err := filepath.Glob(filepath.Join("..", "..", "testdata", "lifetime", pattern))
	if err != nil {
		f.Fatal(err)
	}
	for _, p := range paths {
		raw, err := os.ReadFile(p)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(raw)
	}
}

// FuzzReadTrace: any input gives an error naming a line, or a trace that keeps the format's
// rules and survives WriteTrace and ReadTrace unchanged.
func FuzzReadTrace(f *testing.F) {
	f.Add([]byte(goodTrace))
	f.Add([]byte("calibration = 0, 1, 0.5\ntime (ms), signal (mV)\n0, 1\n1, 2\n2, 3\n3, 4\n4, 5\n"))
	f.Add([]byte("time (s), photoconductance (S), illumination (cm^-2 s^-1)\n0,1,1e17\n1,1,0\n2,0,0\n3,-1,0\n4,.5,2.\n"))
	f.Add([]byte("time (s), photoconductance (S)\n0, 0x1p3\n"))
	addDemoFiles(f, "*.csv")
	f.Fuzz(func(t *testing.T, data []byte) {
		tr, err := lifetime.ReadTrace(bytes.NewReader(data))
		if err != nil {
			if !strings.HasPrefix(err.Error(), "lifetime: line ") {
				t.Fatalf("error without a line: %v", err)
			}
			return
		}
		if len(tr.Time) < lifetime.MinTracePoints || len(tr.Conductance) != len(tr.Time) || len(tr.Lines) != len(tr.Time) {
			t.Fatalf("trace of %d points, %d photoconductances, %d lines", len(tr.Time), len(tr.Conductance), len(tr.Lines))
		}
		for i := range tr.Time {
			if math.IsNaN(tr.Time[i]) || math.IsInf(tr.Time[i], 0) || math.IsNaN(tr.Conductance[i]) || math.IsInf(tr.Conductance[i], 0) ||
				(i > 0 && !(tr.Time[i] > tr.Time[i-1])) || (tr.Illumination != nil && !(tr.Illumination[i] >= 0)) {
				t.Fatalf("point %d breaks the rules: %v, %v", i, tr.Time[i], tr.Conductance[i])
			}
		}
		var buf bytes.Buffer
		if err := lifetime.WriteTrace(&buf, tr); err != nil {
			return // a comment WriteTrace cannot write (it spans lines after the BOM is kept, say)
		}
		back, err := lifetime.ReadTrace(&buf)
		if err != nil {
			t.Fatalf("written trace does not read back: %v", err)
		}
		for i := range tr.Time {
			if back.Time[i] != tr.Time[i] || back.Conductance[i] != tr.Conductance[i] {
				t.Fatalf("point %d changed on writing", i)
			}
		}
	})
}

// FuzzReadTable: any input gives an error naming a line, or a table of positive, finite values.
func FuzzReadTable(f *testing.F) {
	f.Add([]byte("Δn (cm^-3), τeff (us)\n1e15, 100\n"))
	f.Add([]byte("\ufeffdn (cm-3), tau_eff (ms)\r\n1e14, 1\r\n1e16, .5\r\n"))
	f.Add([]byte("Δn (cm^-3), τeff (s)\n1e15, -0\n"))
	addDemoFiles(f, "*table*.csv")
	f.Fuzz(func(t *testing.T, data []byte) {
		tb, err := lifetime.ReadTable(bytes.NewReader(data))
		if err != nil {
			if !strings.HasPrefix(err.Error(), "lifetime: line ") {
				t.Fatalf("error without a line: %v", err)
			}
			return
		}
		if len(tb.Dn) == 0 || len(tb.TauEff) != len(tb.Dn) {
			t.Fatalf("table of %d Δn and %d τeff", len(tb.Dn), len(tb.TauEff))
		}
		for i := range tb.Dn {
			if !(tb.Dn[i] > 0) || math.IsInf(tb.Dn[i], 0) || !(tb.TauEff[i] > 0) || math.IsInf(tb.TauEff[i], 0) {
				t.Fatalf("row %d: Δn %g, τeff %g", i, tb.Dn[i], tb.TauEff[i])
			}
		}
	})
}
