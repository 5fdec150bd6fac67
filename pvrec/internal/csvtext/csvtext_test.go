package csvtext

import "testing"

func TestPlainDecimal(t *testing.T) {
	for s, want := range map[string]bool{
		"1": true, "-1.5e-3": true, ".5": true, "2.": true, "+3E+2": true,
		"": false, ".": false, "1e": false, "0x1p3": false, "Inf": false, "NaN": false, "1_000": false, "1,5": false, " 1": false,
	} {
		if got := PlainDecimal(s); got != want {
			t.Errorf("PlainDecimal(%q) = %v, want %v", s, got, want)
		}
	}
}

func TestSplitUnit(t *testing.T) {
	if n, u, ok := SplitUnit(" depth (um) "); n != "depth" || u != "um" || !ok {
		t.Errorf("SplitUnit = %q, %q, %v", n, u, ok)
	}
	if n, _, ok := SplitUnit("depth"); n != "depth" || ok {
		t.Errorf("SplitUnit without unit = %q, %v", n, ok)
	}
}
