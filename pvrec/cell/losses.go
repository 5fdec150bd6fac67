package cell

import (
	"fmt"
	"sort"
	"strings"
	"text/tabwriter"
)

// Loss is one row of the loss ranking: a term of the cell, its share of the recombination
// current, and what the cell would gain if that term alone were perfect.
type Loss struct {
	Name     string  // the term's name, as in Budget
	Kind     Kind    // region, surface, bulk, second diode, shunt or series resistance
	J0Voc    float64 // the term's J0 equivalent at Voc, A/cm^2 (0 for the series resistance)
	ShareVoc float64 // share of the recombination current at Voc, dimensionless (0 for the series resistance)
	ShareMPP float64 // share of the recombination current at the maximum-power point, dimensionless
	DVoc     float64 // gain in Voc if the term were perfect, V
	DFF      float64 // change of FF if the term were perfect, dimensionless (may be negative)
	DEta     float64 // gain in efficiency if the term were perfect, absolute (0.01 is one percentage point)
}

// Losses is the loss ranking of a cell: the cell's Result, every term made perfect in turn
// (sorted by the efficiency it would gain, largest first), and the fill-factor losses.
type Losses struct {
	Cell  Result // the cell as designed
	Terms []Loss // one row per term and one for the series resistance, sorted by DEta, largest first
	// FFIdeal is the fill factor of an ideal diode (ideality 1, no resistances) with the
	// cell's Voc, IdealDiodeFF(Voc, 1).
	FFIdeal float64
	// FFLossRs is the fill factor lost to series resistance, PFF − FF.
	FFLossRs float64
	// FFLossInjection is the fill factor lost to recombination that is not ideal-diode-like
	// (injection-dependent surfaces and bulk, the second diode, the shunt), FFIdeal − PFF;
	// negative when Auger recombination (ideality below 1) raises the pseudo fill factor.
	FFLossInjection float64
}

// without returns a copy of d with term i removed.
func (d *Device) without(i int) *Device {
	c := *d
	c.terms = append(append([]term(nil), d.terms[:i]...), d.terms[i+1:]...)
	return &c
}

// Losses returns the loss ranking of the cell: for every term of the recombination budget
// (each part, each bulk mechanism, the second diode and the shunt) and for the series
// resistance, the cell is solved again with that one term perfect (removed; Rs = 0), and its
// gain in Voc, FF and efficiency is reported beside the term's share of the recombination
// current at Voc and at the maximum-power point; rows are sorted by the efficiency gain.
// The gains do not add up: removing one term raises Voc, which raises every other term's
// current. It returns an error for the zero Device or an error of Solve.
func (d *Device) Losses() (Losses, error) {
	if d == nil || d.bulk == nil {
		return Losses{}, errZeroDevice
	}
	res, err := d.Solve()
	if err != nil {
		return Losses{}, err
	}
	ffi, err := IdealDiodeFF(res.Voc, 1, d.mat)
	if err != nil {
		return Losses{}, err
	}
	l := Losses{Cell: res, FFIdeal: ffi, FFLossRs: res.PFF - res.FF, FFLossInjection: ffi - res.PFF}
	gain := func(v *Device, row Loss) (Loss, error) {
		oc, sc, mp, err := v.headline()
		if err != nil {
			return Loss{}, fmt.Errorf("cell: Losses: with %s perfect: %w", row.Name, err)
		}
		row.DVoc = oc.V - res.Voc
		row.DFF = mp.P/(oc.V*sc.J) - res.FF
		row.DEta = mp.P/d.pin - res.Efficiency
		return row, nil
	}
	for i, t := range d.terms {
		row, err := gain(d.without(i), Loss{Name: t.name, Kind: t.kind, J0Voc: res.AtVoc.Terms[i].J0,
			ShareVoc: res.AtVoc.Share(i), ShareMPP: res.AtMPP.Share(i)})
		if err != nil {
			return Losses{}, err
		}
		l.Terms = append(l.Terms, row)
	}
	if d.rs > 0 {
		row, err := gain(d.Implied(), Loss{Name: "series Rs", Kind: KindSeries})
		if err != nil {
			return Losses{}, err
		}
		l.Terms = append(l.Terms, row)
	}
	sort.SliceStable(l.Terms, func(a, b int) bool { return l.Terms[a].DEta > l.Terms[b].DEta })
	return l, nil
}

// String returns the loss ranking as a table with units (fA/cm², %, mV, percentage points),
// followed by the fill-factor losses and the model set.
func (l Losses) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "what if this part were perfect: Voc %.2f mV, FF %.2f %%, efficiency %.2f %% at %.2f K\n",
		1e3*l.Cell.Voc, 100*l.Cell.FF, 100*l.Cell.Efficiency, l.Cell.T)
	w := tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(w, "  term\tJ0 at Voc (fA/cm²)\tshare at Voc\tshare at MPP\tΔVoc (mV)\tΔFF (%%abs)\tΔη (%%abs)\t\n")
	for _, t := range l.Terms {
		j0, sv, sm := fmt.Sprintf("%.2f", 1e15*t.J0Voc), fmt.Sprintf("%.1f %%", 100*t.ShareVoc), fmt.Sprintf("%.1f %%", 100*t.ShareMPP)
		if t.Kind == KindSeries {
			j0, sv, sm = "–", "–", "–"
		}
		fmt.Fprintf(w, "  %s\t%s\t%s\t%s\t%.2f\t%.2f\t%.2f\t\n", t.Name, j0, sv, sm, 1e3*t.DVoc, 100*t.DFF, 100*t.DEta)
	}
	w.Flush()
	fmt.Fprintf(&b, "FF: ideal diode at this Voc %.2f %%, lost to injection-dependent recombination %.2f %%abs, pFF %.2f %%, lost to Rs %.2f %%abs, FF %.2f %%\n",
		100*l.FFIdeal, 100*l.FFLossInjection, 100*l.Cell.PFF, 100*l.FFLossRs, 100*l.Cell.FF)
	fmt.Fprintf(&b, "models: %s\n", l.Cell.Model)
	return b.String()
}
