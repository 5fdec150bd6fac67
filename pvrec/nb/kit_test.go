package nb

import (
	"encoding/base64"
	"errors"
	"math"
	"regexp"
	"strings"
	"testing"
)

func TestColumns(t *testing.T) {
	cols := []Column{
		{Name: "sample", Text: []string{"A, front", "B"}},
		{Name: "J0s", Unit: "fA/cm²", Scale: FemtoAmpPerCm2, Format: "%.1f", Values: []float64{12.34e-15, 5e-15}},
		{Name: "ratio", Values: []float64{0.5, 2}},
	}
	csv, err := ColumnsCSV(cols...)
	if err != nil {
		t.Fatal(err)
	}
	if want := "sample,J0s (fA/cm²),ratio\n\"A, front\",12.3,0.5\nB,5.0,2\n"; csv != want {
		t.Errorf("CSV:\n%s\nwant\n%s", csv, want)
	}
	h, err := ColumnsHTML("J0s per side", cols...)
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`download="J0s-per-side.csv" href="data:text/csv;base64,([^"]+)"`).FindStringSubmatch(h)
	if m == nil {
		t.Fatalf("no CSV link in %s", h)
	}
	if b, _ := base64.StdEncoding.DecodeString(m[1]); string(b) != csv {
		t.Errorf("linked CSV %q differs from ColumnsCSV", b)
	}
	for _, bad := range [][]Column{
		nil,
		{{Name: "a"}},
		{{Name: "a", Values: []float64{1}, Text: []string{"x"}}},
		{{Name: "a", Values: []float64{1}}, {Name: "b", Values: []float64{1, 2}}},
	} {
		if _, err := ColumnsHTML("bad", bad...); err == nil {
			t.Errorf("%+v accepted", bad)
		}
	}
}

func TestSpansAndStops(t *testing.T) {
	// gonum's LogSpan exponentiates a linear span of ln x: its error is a few ulp times
	// |ln x| ≈ 35, below 35·4·2⁻⁵² ≈ 3e-14.
	if x := LogSpan(1e13, 1e17, 5); len(x) != 5 || math.Abs(x[2]/1e15-1) > 35*4*0x1p-52 {
		t.Errorf("LogSpan = %v", x)
	}
	if x := LinSpan(0, 1, 3); x[1] != 0.5 {
		t.Errorf("LinSpan = %v", x)
	}
	if s := Scaled([]float64{1e-3, 2e-3}, MilliVolt); s[0] != 1 || s[1] != 2 {
		t.Errorf("Scaled = %v", s)
	}
	stops := func(f func()) (err error) {
		defer func() {
			if p := recover(); p != nil {
				err, _ = p.(error)
			}
		}()
		f()
		return nil
	}
	for name, f := range map[string]func(){
		"LogSpan 0":  func() { LogSpan(0, 1, 3) },
		"LinSpan n":  func() { LinSpan(0, 1, 1) },
		"Must error": func() { Must(0, errors.New("boom")) },
		"Check":      func() { Check(errors.New("boom")) },
	} {
		if err := stops(f); err == nil {
			t.Errorf("%s: did not stop with an error", name)
		}
	}
	if v := Must(3, nil); v != 3 {
		t.Errorf("Must = %d", v)
	}
	if h := ErrorHTML(errors.New("a < b")); !strings.Contains(h, "a &lt; b") {
		t.Errorf("ErrorHTML %q", h)
	}
}
