package plots

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/plot"
)

func labelsOf(ticks []plot.Tick) (labels []string, minor int) {
	for _, t := range ticks {
		if t.IsMinor() {
			minor++
		} else {
			labels = append(labels, t.Label)
		}
	}
	return labels, minor
}

// TestLogTicks checks the ticks of logarithmic axes (common practice): decades labelled as
// powers of ten with minor ticks at 2…9, every k-th decade over many, mantissas within less
// than two decades, and only ticks inside the range.
func TestLogTicks(t *testing.T) {
	for _, c := range []struct {
		name     string
		lo, hi   float64
		labels   string
		minor    int // number of minor ticks, -1 to skip
		positive bool
	}{
		{"six decades", 0.6e12, 1.7e18, "$10^{12}$ $10^{13}$ $10^{14}$ $10^{15}$ $10^{16}$ $10^{17}$ $10^{18}$", 6*8 + 4, true},
		{"exact decades", 1e-5, 1e-3, "$10^{-5}$ $10^{-4}$ $10^{-3}$", 16, true},
		{"one decade", 3e-4, 2.3e-3, `$5\times10^{-4}$ $10^{-3}$ $2\times10^{-3}$`, 6, true},
		{"plain mantissas", 0.15, 0.9, "$0.2$ $0.5$", 6, true},
		{"all mantissas", 1.1e15, 1.9e15, "", -1, true}, // no 1, 2, 5 inside: linear ticks
		{"many decades", 1e-300, 1e300, "$10^{-300}$ $10^{-200}$ $10^{-100}$ $10^{0}$ $10^{100}$ $10^{200}$ $10^{300}$", -1, true},
	} {
		ticks := logTicks{}.Ticks(c.lo, c.hi)
		labels, minor := labelsOf(ticks)
		if c.labels != "" && strings.Join(labels, " ") != c.labels {
			t.Errorf("%s: labels %q, want %q", c.name, strings.Join(labels, " "), c.labels)
		}
		if len(labels) < 2 {
			t.Errorf("%s: %d labels", c.name, len(labels))
		}
		if c.minor >= 0 && minor != c.minor {
			t.Errorf("%s: %d minor ticks, want %d", c.name, minor, c.minor)
		}
		for _, tk := range ticks {
			if tk.Value <= 0 || tk.Value < c.lo*(1-1e-9) || tk.Value > c.hi*(1+1e-9) {
				t.Errorf("%s: tick %g outside [%g, %g]", c.name, tk.Value, c.lo, c.hi)
			}
			if err := checkLabel("tick", tk.Label); err != nil {
				t.Errorf("%s: %v", c.name, err)
			}
		}
	}
	for _, r := range [][2]float64{{0, 1}, {-1, 10}, {10, 1}, {1, math.Inf(1)}, {math.NaN(), 1}, {1, 1}} {
		if ticks := (logTicks{}).Ticks(r[0], r[1]); ticks != nil {
			t.Errorf("logTicks(%g, %g) = %v, want none", r[0], r[1], ticks)
		}
	}
}

// TestLinTicks checks the labels of linear axes: every digit that tells the ticks apart
// (gonum/plot labels 1.05 as "1"), a minus sign, powers of ten for large and small values.
func TestLinTicks(t *testing.T) {
	for _, c := range []struct {
		lo, hi float64
		labels string
	}{
		{0.706, 1.093, "$0.75$ $0.90$ $1.05$"},
		{-1.2, 41, "$0$ $20$ $40$"},
		{1e6, 3.3e6, `$10^{6}$ $2\times10^{6}$ $3\times10^{6}$`},
		{-2e-5, 3e-5, `$-2\times10^{-5}$ $0$ $2\times10^{-5}$`},
		{-3, -2.999, "$-3.0000$ $-2.9995$ $-2.9990$"},
	} {
		labels, _ := labelsOf(linTicks{}.Ticks(c.lo, c.hi))
		if got := strings.Join(labels, " "); got != c.labels {
			t.Errorf("linTicks(%g, %g): %q, want %q", c.lo, c.hi, got, c.labels)
		}
	}
	for _, r := range [][2]float64{{1, 1}, {2, 1}, {-math.MaxFloat64, math.MaxFloat64}, {math.NaN(), 1}} {
		if ticks := (linTicks{}).Ticks(r[0], r[1]); ticks != nil {
			t.Errorf("linTicks(%g, %g) = %v, want none", r[0], r[1], ticks)
		}
	}
}
