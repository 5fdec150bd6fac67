package cell

import (
	"fmt"
	"strings"
	"text/tabwriter"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// Result is the performance of a cell at its material's temperature: the open-circuit,
// short-circuit and maximum-power points, the fill factors and the efficiency, with the
// recombination budget at Voc and at the maximum-power point. String prints it as a table
// with units and the material's model set (provenance).
type Result struct {
	Model string  // the material's String(): temperature and model set
	T     float64 // temperature, K
	Jph   float64 // photogenerated current density (Design.Jsc), A/cm^2
	Pin   float64 // incident power density, W/cm^2

	Voc float64 // open-circuit voltage, V
	Jsc float64 // short-circuit current density at V = 0, A/cm^2 (Jph less the recombination at the short-circuit point)
	Vmp float64 // voltage at the maximum-power point, V
	Jmp float64 // current density at the maximum-power point, A/cm^2
	Pmp float64 // maximum power density, W/cm^2
	// FF is the fill factor Pmp/(Voc Jsc), dimensionless.
	FF float64
	// PFF is the pseudo fill factor, the FF of the implied J–V curve: the same cell without
	// series resistance (its shunt and second diode kept), dimensionless.
	PFF float64
	// Efficiency is Pmp/Pin, dimensionless (0.2 for 20 %).
	Efficiency float64

	DnOC float64 // base excess carrier density at open circuit, cm^-3
	DnMP float64 // base excess carrier density at the maximum-power point, cm^-3
	ViMP float64 // internal voltage at the maximum-power point, V (Vmp + Jmp Rs)

	AtVoc Budget // recombination budget at open circuit (its total is Jph)
	AtMPP Budget // recombination budget at the maximum-power point

	// Notes say how parts given as numbers were carried to this temperature (see Device.At);
	// empty at the design's own temperature.
	Notes []string
}

// headline returns the open-circuit, short-circuit and maximum-power points of d.
func (d *Device) headline() (oc, sc, mp Point, err error) {
	if oc, err = d.OpenCircuit(); err != nil {
		return
	}
	if sc, err = d.ShortCircuit(); err != nil {
		return
	}
	mp, err = d.maxPower(oc)
	return
}

// Solve returns the cell's Result: Voc (OpenCircuit), Jsc (ShortCircuit), the maximum-power
// point (MaxPower), FF = Pmp/(Voc Jsc), the pseudo fill factor of the implied curve
// (Implied), the efficiency Pmp/Pin and the budgets at Voc and at the maximum-power point. It
// returns an error for the zero Device or an error of the solvers or models (see the methods
// named).
func (d *Device) Solve() (Result, error) {
	if d == nil || d.bulk == nil {
		return Result{}, errZeroDevice
	}
	oc, sc, mp, err := d.headline()
	if err != nil {
		return Result{}, err
	}
	imp := mp
	if d.rs > 0 {
		if imp, err = d.Implied().maxPower(oc); err != nil {
			return Result{}, err
		}
	}
	atVoc, err := d.RecombinationAtExcess(oc.Dn)
	if err != nil {
		return Result{}, err
	}
	atMPP, err := d.RecombinationAtExcess(mp.Dn)
	if err != nil {
		return Result{}, err
	}
	return Result{
		Model: d.mat.String(), T: d.mat.T(), Jph: d.jsc, Pin: d.pin,
		Voc: oc.V, Jsc: sc.J, Vmp: mp.V, Jmp: mp.J, Pmp: mp.P,
		FF: mp.P / (oc.V * sc.J), PFF: imp.P / (oc.V * d.jsc), Efficiency: mp.P / d.pin,
		DnOC: oc.Dn, DnMP: mp.Dn, ViMP: mp.Vi,
		AtVoc: atVoc, AtMPP: atMPP,
		Notes: append([]string(nil), d.notes...),
	}, nil
}

// String returns the result as a table with units (mV, mA/cm², fA/cm², %), the budget at Voc
// and at the maximum-power point, the notes and the model set.
func (r Result) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "cell at %.2f K (%s)\n", r.T, r.Model)
	w := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	for _, row := range [][2]string{
		{"Jph (input)", fmt.Sprintf("%.3f mA/cm²", 1e3*r.Jph)},
		{"Pin", fmt.Sprintf("%.1f mW/cm²", 1e3*r.Pin)},
		{"Voc", fmt.Sprintf("%.2f mV", 1e3*r.Voc)},
		{"Jsc", fmt.Sprintf("%.3f mA/cm²", 1e3*r.Jsc)},
		{"Vmp", fmt.Sprintf("%.2f mV", 1e3*r.Vmp)},
		{"Jmp", fmt.Sprintf("%.3f mA/cm²", 1e3*r.Jmp)},
		{"FF", fmt.Sprintf("%.2f %%", 100*r.FF)},
		{"pFF", fmt.Sprintf("%.2f %%", 100*r.PFF)},
		{"efficiency", fmt.Sprintf("%.2f %%", 100*r.Efficiency)},
		{"Δn at Voc", fmt.Sprintf("%.3g cm^-3", r.DnOC)},
		{"Δn at MPP", fmt.Sprintf("%.3g cm^-3", r.DnMP)},
	} {
		fmt.Fprintf(w, "  %s\t%s\n", row[0], row[1])
	}
	w.Flush()
	b.WriteString("recombination\n")
	w = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(w, "  term\tJ0 at Voc (fA/cm²)\tshare at Voc\tshare at MPP\t\n")
	for i, t := range r.AtVoc.Terms {
		mpp := 0.0
		if i < len(r.AtMPP.Terms) {
			mpp = r.AtMPP.Share(i)
		}
		fmt.Fprintf(w, "  %s\t%.2f\t%.1f %%\t%.1f %%\t\n", t.Name, 1e15*t.J0, 100*r.AtVoc.Share(i), 100*mpp)
	}
	w.Flush()
	for _, n := range r.Notes {
		fmt.Fprintf(&b, "note: %s\n", n)
	}
	return b.String()
}

// IntrinsicLimit returns the design of the intrinsic limit of d: the same material, base
// thickness, doping, Jsc and Pin, with the intrinsic recombination of the base
// (recomb.NewIntrinsic: Richter2012 Auger with Trupke2003 radiative, 290–310 K) as its only
// loss: ideal front and rear (no parts), no second diode, no series resistance, no shunt.
// This is the limit of A. Richter, M. Hermle and S. W. Glunz, "Reassessment of the limiting
// efficiency for crystalline silicon solar cells", IEEE J. Photovolt. 3, 1184 (2013), for
// the given Jsc (their light trapping is not modelled: Jsc is an input), without photon
// recycling (Trupke2003 with escape fraction 1).
func (d Design) IntrinsicLimit() Design {
	return Design{
		Material: d.Material,
		Base:     Base{Thickness: d.Base.Thickness, Nd: d.Base.Nd, Na: d.Base.Na, Mechanisms: []recomb.Mechanism{recomb.NewIntrinsic()}},
		Jsc:      d.Jsc,
		Pin:      d.Pin,
	}
}
