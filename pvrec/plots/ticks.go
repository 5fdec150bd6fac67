package plots

import (
	"math"
	"strconv"

	"gonum.org/v1/plot"
)

// maxDecadeLabels is the largest number of labelled decades on a logarithmic axis; wider
// ranges label every second, third, fifth ... decade.
const maxDecadeLabels = 8

// logTicks is the house ticker of logarithmic axes: decades labelled as powers of ten
// ($10^{19}$) with minor ticks at 2…9 times each decade; over many decades every k-th decade
// is labelled and the others ticked; within less than two decades 1, 2 and 5 (or 1…9) times
// a power of ten are labelled. It returns no ticks for a range it cannot tick (not positive,
// not finite or empty).
type logTicks struct{}

// Ticks returns the ticks between min and max.
func (logTicks) Ticks(vmin, vmax float64) []plot.Tick {
	if !(vmin > 0 && vmax > vmin) || math.IsInf(vmax, 0) {
		return nil
	}
	in := func(v float64) bool { // in the range, allowing for rounding; never 0 or +Inf
		return v > 0 && !math.IsInf(v, 0) && v >= vmin*(1-1e-12) && v <= vmax*(1+1e-12)
	}
	lo, hi := int(math.Floor(math.Log10(vmin))), int(math.Ceil(math.Log10(vmax)))
	var decades []int
	for n := lo; n <= hi; n++ {
		if in(math.Pow10(n)) {
			decades = append(decades, n)
		}
	}
	var ticks []plot.Tick
	if len(decades) >= 2 {
		step := 1
		for _, s := range []int{1, 2, 3, 5, 10, 20, 50, 100} {
			step = s
			if (len(decades)+s-1)/s <= maxDecadeLabels {
				break
			}
		}
		for n := lo; n <= hi; n++ {
			v := math.Pow10(n)
			if in(v) {
				t := plot.Tick{Value: v}
				switch {
				case mod(n, step) == 0:
					t.Label = "$10^{" + strconv.Itoa(n) + "}$"
					ticks = append(ticks, t)
				case mod(n, max(1, step/5)) == 0: // unlabelled decades, not too dense
					ticks = append(ticks, t)
				}
			}
			if step == 1 {
				for m := 2; m <= 9; m++ {
					if w := float64(m) * v; in(w) {
						ticks = append(ticks, plot.Tick{Value: w})
					}
				}
			}
		}
		return ticks
	}
	// Less than two decades: label mantissas 1, 2, 5, or all of 1…9 if that gives fewer than
	// two labels; fall back to linear ticks within a factor of 2.
	for _, labelled := range [][]int{{1, 2, 5}, {1, 2, 3, 4, 5, 6, 7, 8, 9}} {
		ticks = ticks[:0]
		nl := 0
		for n := lo; n <= hi; n++ {
			for m := 1; m <= 9; m++ {
				v := float64(m) * math.Pow10(n)
				if !in(v) {
					continue
				}
				t := plot.Tick{Value: v}
				for _, l := range labelled {
					if m == l {
						t.Label, nl = mantissaLabel(m, n), nl+1
					}
				}
				ticks = append(ticks, t)
			}
		}
		if nl >= 2 {
			return ticks
		}
	}
	// Within less than a factor of about 2: linear ticks (all positive, since they lie in
	// the range).
	return linTicks{}.Ticks(vmin, vmax)
}

// mod is n mod k, in [0, k).
func mod(n, k int) int {
	return ((n % k) + k) % k
}

// mantissaLabel is the label of m × 10^n: a plain number for 10^-2 … 10^3, else
// $m\times10^{n}$.
func mantissaLabel(m, n int) string {
	if n >= -2 && n <= 3 {
		return "$" + strconv.FormatFloat(float64(m)*math.Pow10(n), 'f', max(0, -n), 64) + "$"
	}
	if m == 1 {
		return "$10^{" + strconv.Itoa(n) + "}$"
	}
	return "$" + strconv.Itoa(m) + `\times10^{` + strconv.Itoa(n) + "}$"
}

// linTicks is the house ticker of linear axes: gonum/plot's choice of tick positions, with
// labels of our own (gonum/plot's drop digits: it labels 1.05 as "1" with its 'g' format), set
// as math (a minus sign, not a hyphen), with powers of ten outside 10^-3 … 10^5
// ($2.5\times10^{6}$, not 2.5e+06). It returns no ticks for a range it cannot tick.
type linTicks struct{}

// Ticks returns the ticks between min and max.
func (linTicks) Ticks(vmin, vmax float64) []plot.Tick {
	if !(vmax > vmin) || math.IsInf(vmax-vmin, 0) {
		return nil
	}
	var ticks []plot.Tick
	var labelled []float64
	tol := 1e-9 * (vmax - vmin)
	for _, t := range (plot.DefaultTicks{}).Ticks(vmin, vmax) {
		if t.Value < vmin-tol || t.Value > vmax+tol {
			continue // gonum/plot lists minor ticks beyond the range
		}
		if t.Label != "" {
			labelled = append(labelled, t.Value)
		}
		ticks = append(ticks, t)
	}
	labels := numberLabels(labelled)
	for i, k := 0, 0; i < len(ticks); i++ {
		if ticks[i].Label != "" {
			ticks[i].Label, k = labels[k], k+1
		}
	}
	return ticks
}

// numberLabels returns labels for evenly spaced tick values vs, with as few digits as show
// them apart: plain decimals for magnitudes from 10^-3 to 10^5, else m×10^n.
func numberLabels(vs []float64) []string {
	labels := make([]string, len(vs))
	if len(vs) == 0 {
		return labels
	}
	step, top := math.Inf(1), 0.0
	for i, v := range vs {
		top = math.Max(top, math.Abs(v))
		if i > 0 {
			step = math.Min(step, math.Abs(v-vs[i-1]))
		}
	}
	if len(vs) == 1 || step == 0 {
		step = math.Max(top, math.SmallestNonzeroFloat64)
	}
	// digits is the number of decimals that shows x to within a thousandth of the step.
	digits := func(x, unit float64) int {
		for k := 0; k < 16; k++ {
			r, _ := strconv.ParseFloat(strconv.FormatFloat(x/unit, 'f', k, 64), 64)
			if math.Abs(r*unit-x) <= 1e-3*step {
				return k
			}
		}
		return 16
	}
	e := math.Floor(math.Log10(top))
	if top == 0 || e >= -3 && e <= 5 {
		k := 0
		for _, v := range vs {
			k = max(k, digits(v, 1))
		}
		for i, v := range vs {
			labels[i] = "$" + strconv.FormatFloat(v, 'f', k, 64) + "$"
			if math.Abs(v) <= 1e-3*step {
				labels[i] = "$0$"
			}
		}
		return labels
	}
	for i, v := range vs {
		if math.Abs(v) <= 1e-3*step {
			labels[i] = "$0$"
			continue
		}
		n := math.Floor(math.Log10(math.Abs(v)))
		unit := math.Pow(10, n)
		m := strconv.FormatFloat(v/unit, 'f', digits(v, unit), 64)
		switch m {
		case "1":
			labels[i] = "$10^{" + strconv.Itoa(int(n)) + "}$"
		case "-1":
			labels[i] = "$-10^{" + strconv.Itoa(int(n)) + "}$"
		default:
			labels[i] = "$" + m + `\times10^{` + strconv.Itoa(int(n)) + "}$"
		}
	}
	return labels
}
