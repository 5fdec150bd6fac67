package cell

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Term is one term of the recombination budget at an operating point.
type Term struct {
	Name string  // e.g. "front: emitter, passivated", "base: Intrinsic(Richter2012 + Trupke2003)"
	Kind Kind    // region, surface, bulk, second diode or shunt
	J    float64 // recombination current density of the term in the cell (area fraction included), A/cm^2
	// J0 is the term's saturation current density equivalent at this point,
	// J/(n p/ni,eff² − 1), A/cm^2: f·J0 for a region, injection-dependent for the others;
	// 0 at V = 0.
	J0 float64
}

// Budget is the recombination current of the cell at one operating point, term by term.
type Budget struct {
	Dn    float64 // base excess carrier density Δn, cm^-3
	V     float64 // internal voltage (quasi-Fermi level separation in the base), V
	Total float64 // J_rec, the sum of the terms' J, A/cm^2
	Terms []Term  // in the order of the design: front parts, rear parts, bulk mechanisms, J02, shunt
}

// Share returns the fraction of the total recombination current carried by term i
// (dimensionless; 0 if the total is 0 or i is not an index of Terms).
func (b Budget) Share(i int) float64 {
	if b.Total == 0 || i < 0 || i >= len(b.Terms) {
		return 0
	}
	return b.Terms[i].J / b.Total
}

// state returns the base's state at dn with the device's context on errors.
func (d *Device) state(dn float64) (recomb.State, error) {
	s, err := d.bulk.State(dn)
	if err != nil {
		return recomb.State{}, fmt.Errorf("cell: base at Δn = %g cm^-3: %w", dn, err)
	}
	return s, nil
}

// eval returns the internal voltage vi in V and the recombination current density jrec in
// A/cm^2 at base excess density dn (cm^-3, >= 0). If parts is not nil it receives each term's
// current density (len(parts) == len(d.terms)). It does not allocate unless it fails.
func (d *Device) eval(dn float64, parts []float64) (vi, jrec float64, err error) {
	s, err := d.state(dn)
	if err != nil {
		return 0, 0, err
	}
	vi, err = s.ImpliedVoc()
	if err != nil {
		return 0, 0, fmt.Errorf("cell: base at Δn = %g cm^-3: %w", dn, err)
	}
	// n p/ni,eff² − 1 = Excess/ni,eff², the common factor of every J0 term (detailed balance:
	// exactly 0 at Δn = 0).
	e := s.Excess / (s.NiEff * s.NiEff)
	for i := range d.terms {
		t := &d.terms[i]
		var j float64
		switch t.kind {
		case KindRegion:
			j = t.frac * t.j0 * e
		case KindSurface:
			// q Seff Δn → 0 as Δn → 0; Seff itself is not defined at Δn = 0.
			if dn > 0 {
				seff, err := t.surf.Seff(s)
				if err != nil {
					return 0, 0, fmt.Errorf("cell: %s at Δn = %g cm^-3: %w", t.name, dn, err)
				}
				j = t.frac * silicon.ElementaryCharge * seff * dn
			}
		case KindBulk:
			r, err := t.mech.Rate(s)
			if err != nil {
				return 0, 0, fmt.Errorf("cell: %s at Δn = %g cm^-3: %w", t.name, dn, err)
			}
			j = silicon.ElementaryCharge * d.wb * r
		case KindSecondDiode:
			j = t.j0 * math.Expm1(vi/(2*s.Vt))
		case KindShunt:
			j = t.j0 * vi
		}
		if parts != nil {
			parts[i] = j
		}
		jrec += j
	}
	if math.IsNaN(jrec) || math.IsInf(jrec, 0) {
		return 0, 0, fmt.Errorf("cell: recombination current density %g A/cm^2 at Δn = %g cm^-3 is not finite", jrec, dn)
	}
	return vi, jrec, nil
}

// RecombinationAtExcess returns the recombination budget at base excess carrier density dn
// in cm^-3 (finite, 0 <= dn <= recomb.MaxExcess): each term's current density and J0
// equivalent, their total J_rec and the internal voltage V = kT/q ln(n p/ni,eff²). J_rec
// vanishes at dn = 0 (detailed balance) and rises with dn. It returns an error for the zero
// Device, an invalid dn, or an error of a model (wrapped, naming the term; a model's
// validity range gives an error matching pvrec.ErrOutOfRange).
func (d *Device) RecombinationAtExcess(dn float64) (Budget, error) {
	if d == nil || d.bulk == nil {
		return Budget{}, errZeroDevice
	}
	if err := check.Density("cell: RecombinationAtExcess", "excess carrier density Δn", dn); err != nil {
		return Budget{}, err
	}
	parts := make([]float64, len(d.terms))
	vi, total, err := d.eval(dn, parts)
	if err != nil {
		return Budget{}, err
	}
	b := Budget{Dn: dn, V: vi, Total: total, Terms: make([]Term, len(d.terms))}
	e := math.Expm1(vi / d.mat.Vt())
	for i, t := range d.terms {
		b.Terms[i] = Term{Name: t.name, Kind: t.kind, J: parts[i]}
		if e > 0 {
			b.Terms[i].J0 = parts[i] / e
		}
	}
	return b, nil
}

// Recombination returns the recombination budget at internal voltage v in V (finite, >= 0;
// the quasi-Fermi level separation in the base, which is the terminal voltage when no current
// flows through Rs), with the base's Δn from ExcessFromImpliedVoc. See RecombinationAtExcess.
func (d *Device) Recombination(v float64) (Budget, error) {
	if d == nil || d.bulk == nil {
		return Budget{}, errZeroDevice
	}
	dn, err := ExcessFromImpliedVoc(d.bulk, v)
	if err != nil {
		return Budget{}, err
	}
	return d.RecombinationAtExcess(dn)
}
