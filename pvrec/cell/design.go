package cell

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// DefaultIncidentPower is the incident power density in W/cm^2 that a Design with Pin = 0
// uses: 0.1 W/cm^2 (100 mW/cm^2), the standard test condition for terrestrial cells (common
// practice, no source).
const DefaultIncidentPower = 0.1

// FractionTol is the tolerance on the sum of the area fractions of one side of a Design:
// |Σ f − 1| <= FractionTol, or New returns an error naming the side and the sum. It allows the
// rounding of fractions typed as decimals (0.97 + 0.03), nothing more.
const FractionTol = 1e-9

// Design describes a cell as a value built from parts: the base, the parts that cover its
// front and its rear (each with the area fraction of its side it covers), an optional second
// diode, the lumped series and shunt resistances, the photogenerated current and the incident
// power. New checks it and prepares it for evaluation (a Device).
//
// The cell is described in the usual lumped, one-dimensional J0-budget picture (common
// practice, no source): the base is quasi-neutral with a uniform excess carrier density Δn
// (its diffusion length much longer than its thickness), the quasi-Fermi level separation qV
// in the base is the internal voltage, and every part recombines in proportion to its area
// fraction at that Δn and V:
//
//	J_rec(V) = Σ_parts f_i J_i(Δn) + q W_b R_bulk(Δn) + J02 (exp(qV/2kT) − 1) + V/Rsh,
//	n p = ni,eff² exp(qV/kT) in the base (its band-gap narrowing and degeneracy included),
//
// with J_i = J0_i (n p/ni,eff² − 1) for a part with a saturation current density (a number or
// a solved j0.Region) and J_i = q Seff(Δn) Δn for a surface model. The terminal current is
// J = Jsc − J_rec(V) and the terminal voltage V − J Rs.
//
// The temperature and the model set come from Material. The zero Design is not usable: New
// returns an error naming what is missing.
type Design struct {
	// Material is silicon at the cell's temperature (required): the base, the regions and
	// the surfaces are evaluated in it.
	Material *silicon.Material
	// Solver solves the parts given as a j0.Region, always in Material: a Models.Material
	// that is set must describe the same material (same String(), i.e. temperature and model
	// names), and is replaced by Material. A Solver whose Models are all unset (no material,
	// mobility or mechanisms) means the mechanisms of j0.DefaultModels (Richter2012 Auger,
	// Trupke2003 radiative) in Material.
	Solver j0.Solver
	Base   Base   // the wafer
	Front  []Part // parts covering the front; their fractions add up to 1 (no parts: an ideal front)
	Rear   []Part // parts covering the rear; their fractions add up to 1 (no parts: an ideal rear)
	// J02 is the saturation current density of a second diode of ideality 2, A/cm^2 (finite,
	// >= 0; 0: none), a lumped description of space-charge-region and edge recombination.
	J02 float64
	Rs  float64 // lumped series resistance, Ω·cm² (finite, >= 0)
	// Rsh is the shunt resistance, Ω·cm² (> 0, or +Inf); 0 means no shunt (+Inf).
	Rsh float64
	// Jsc is the photogenerated current density, A/cm^2 (finite, > 0): the current the cell
	// delivers at short circuit without series resistance (no optics here; it is an input).
	Jsc float64
	// Pin is the incident power density, W/cm^2 (finite, >= 0); 0 means DefaultIncidentPower.
	Pin float64
}

// Base is the wafer: its thickness, doping and bulk recombination.
type Base struct {
	Thickness float64 // wafer thickness W, cm (finite, > 0)
	Nd, Na    float64 // donor and acceptor densities, cm^-3 (finite, >= 0; the larger sets the type)
	// Mechanisms are the bulk recombination mechanisms (recomb.NewIntrinsic(), an SRH
	// defect, iron, ...), each a term of the budget, evaluated at the base's state. None: a
	// perfect bulk.
	Mechanisms []recomb.Mechanism
}

// Part is one area of a side of the cell: a region or contact with a saturation current
// density J0, or a surface described by a surface model. Exactly one of J0 (a number), Region
// and Surface describes it: when Region or Surface is set, J0 must be 0.
type Part struct {
	Name     string  // label in budgets and loss tables, e.g. "emitter, passivated"
	Fraction float64 // area fraction of its side, in (0, 1]
	// J0 is the part's saturation current density in A/cm^2 at Material's temperature
	// (finite, >= 0), used when Region and Surface are nil.
	J0 float64
	// Region is a doped region whose J0 the Design's Solver computes (in Material).
	Region *j0.Region
	// Surface is an undiffused, passivated surface: its recombination current density is
	// q Seff Δn with Seff evaluated at the base's state at each operating point.
	Surface surface.Model
	// Depth is the depth in cm the part takes from the base (finite, >= 0). For a J0 given
	// as a number: its depth (0: negligible). For a Region: 0 means the solved region's
	// junction depth (its far boundary for a high–low junction), a positive value overrides
	// it. A surface takes none (0).
	Depth float64
	// Contact marks a part under the metal contacts; the contacted parts' fractions are the
	// side's metallised fraction, reported by Device.Metallised.
	Contact bool
}

// Kind is the kind of a term of the recombination budget.
type Kind uint8

// Kinds of terms.
const (
	KindRegion      Kind = iota + 1 // a part with a saturation current density (number or j0.Region)
	KindSurface                     // a part described by a surface model
	KindBulk                        // a bulk mechanism of the base
	KindSecondDiode                 // the second diode J02
	KindShunt                       // the shunt resistance
	KindSeries                      // the series resistance (loss tables only: it does not recombine)
)

// String returns "region", "surface", "bulk", "second diode", "shunt" or "series resistance".
func (k Kind) String() string {
	switch k {
	case KindRegion:
		return "region"
	case KindSurface:
		return "surface"
	case KindBulk:
		return "bulk"
	case KindSecondDiode:
		return "second diode"
	case KindShunt:
		return "shunt"
	case KindSeries:
		return "series resistance"
	}
	return fmt.Sprintf("Kind(%d)", uint8(k))
}

// term is one term of J_rec in a Device.
type term struct {
	name string
	kind Kind
	frac float64          // area fraction (KindRegion, KindSurface)
	j0   float64          // KindRegion: J0 of the part, A/cm^2; KindSecondDiode: J02, A/cm^2; KindShunt: 1/Rsh, S/cm²
	surf surface.Model    // KindSurface
	mech recomb.Mechanism // KindBulk
}

var errZeroDevice = errors.New("cell: Device is not initialised (build it with New)")

// Device is a Design checked and prepared for evaluation: its regions solved, its base built.
// It is immutable and safe for concurrent use (provided the models in its Design are values,
// as all pvrec models are). The zero Device is not usable: its methods return an error.
type Device struct {
	design Design // as given (the reference for At)
	mat    *silicon.Material
	bulk   *recomb.Bulk
	wb     float64 // base thickness that recombines, cm
	terms  []term
	rs     float64 // series resistance, Ω·cm²
	jsc    float64 // photogenerated current density, A/cm^2
	pin    float64 // incident power, W/cm^2
	metal  [2]float64
	notes  []string // how parts were scaled from the design's temperature
}

// New checks the design d and prepares it for evaluation: it builds the base's recomb.Bulk,
// solves every Region part with d.Solver in d.Material and fixes the base thickness that
// recombines,
//
//	W_b = W − Σ_front f_i d_i − Σ_rear f_i d_i,
//
// with d_i the depth of each part (Part.Depth). It returns an error naming the part and the
// value for a nil Material, a base thickness that is not > 0 or that the deepest front and
// rear parts together reach, fractions outside (0, 1] or that do not add up to 1 on a side
// (naming the side and the sum), a part with none or more than one of J0, Region and Surface,
// a negative J0, J02, Rs or Rsh, Jsc <= 0, a negative Pin, or an error of the base or of a
// region's solver (wrapped, naming the part).
func New(d Design) (*Device, error) {
	return build(d, d.Material, nil)
}

// build prepares design d in material m (m is d.Material, or the material at another
// temperature for At, in which case scale gives the factors for J0s given as numbers and J02).
func build(d Design, m *silicon.Material, scale *scaling) (*Device, error) {
	if m == nil {
		return nil, fmt.Errorf("cell: Design.Material is nil (use silicon.ModelSet.At)")
	}
	b := d.Base
	if err := check.Positive("cell: Base", "Thickness", b.Thickness, "cm"); err != nil {
		return nil, err
	}
	bulk, err := recomb.NewBulk(m, b.Nd, b.Na)
	if err != nil {
		return nil, fmt.Errorf("cell: Base: %w", err)
	}
	if err := check.NonNegative("cell: Design", "second-diode saturation current density J02", d.J02, "A/cm^2"); err != nil {
		return nil, err
	}
	if err := check.NonNegative("cell: Design", "series resistance Rs", d.Rs, "Ω·cm²"); err != nil {
		return nil, err
	}
	if !(d.Rsh >= 0) {
		return nil, fmt.Errorf("cell: Design: shunt resistance Rsh must be > 0 Ω·cm² (or +Inf; 0 means no shunt), got %g", d.Rsh)
	}
	if err := check.Positive("cell: Design", "photogenerated current density Jsc", d.Jsc, "A/cm^2"); err != nil {
		return nil, err
	}
	if err := check.NonNegative("cell: Design", "incident power Pin", d.Pin, "W/cm^2"); err != nil {
		return nil, err
	}
	// The device keeps its own copy of the design's slices (At rebuilds from it).
	d.Front, d.Rear = append([]Part(nil), d.Front...), append([]Part(nil), d.Rear...)
	d.Base.Mechanisms = append([]recomb.Mechanism(nil), d.Base.Mechanisms...)
	dev := &Device{design: d, mat: m, bulk: bulk, rs: d.Rs, jsc: d.Jsc, pin: d.Pin}
	if dev.pin == 0 {
		dev.pin = DefaultIncidentPower
	}
	solver, err := d.solver(m)
	if err != nil {
		return nil, err
	}
	var deepest [2]float64
	var taken float64 // Σ f d over both sides, cm
	for side, parts := range [2][]Part{d.Front, d.Rear} {
		name := sideName(side)
		if len(parts) == 0 {
			continue
		}
		var sum float64
		for i, p := range parts {
			t, depth, err := p.compile(name, i, solver, scale)
			if err != nil {
				return nil, err
			}
			sum += p.Fraction
			if p.Contact {
				dev.metal[side] += p.Fraction
			}
			deepest[side] = math.Max(deepest[side], depth)
			taken += p.Fraction * depth
			dev.terms = append(dev.terms, t)
		}
		if math.Abs(sum-1) > FractionTol {
			return nil, fmt.Errorf("cell: %s: the area fractions of the %s parts add up to %.12g, not 1", name, name, sum)
		}
	}
	if deepest[0]+deepest[1] >= b.Thickness {
		return nil, fmt.Errorf("cell: Base: thickness W = %g cm is not more than the deepest front part (%g cm) and rear part (%g cm) together",
			b.Thickness, deepest[0], deepest[1])
	}
	dev.wb = b.Thickness - taken
	for i, mech := range b.Mechanisms {
		if mech == nil {
			return nil, fmt.Errorf("cell: Base: mechanism %d is nil", i)
		}
		dev.terms = append(dev.terms, term{name: "base: " + mechName(mech), kind: KindBulk, mech: mech})
	}
	j02 := d.J02
	if scale != nil {
		j02 *= scale.ni
	}
	if j02 > 0 {
		dev.terms = append(dev.terms, term{name: "second diode J02", kind: KindSecondDiode, j0: j02})
	}
	if d.Rsh > 0 && !math.IsInf(d.Rsh, 1) {
		dev.terms = append(dev.terms, term{name: "shunt Rsh", kind: KindShunt, j0: 1 / d.Rsh})
	}
	if scale != nil {
		dev.notes = scale.notes(d)
	}
	return dev, nil
}

// solver returns the Design's solver with its material set to m.
func (d Design) solver(m *silicon.Material) (j0.Solver, error) {
	s := d.Solver
	md := s.Models
	if md.Material == nil && md.Mobility == nil && md.Auger == nil && md.SRH == nil && md.Radiative == nil {
		md.Auger, md.Radiative = recomb.NewRichter2012(), recomb.NewTrupke2003()
	} else if md.Material != nil && md.Material != d.Material && md.Material.String() != d.Material.String() {
		return j0.Solver{}, fmt.Errorf("cell: Design.Solver's material (%v) is not the cell's material (%v): the temperature and model set come from Design.Material",
			md.Material, d.Material)
	}
	md.Material = m
	s.Models = md
	return s, nil
}

// compile checks part i of the named side and returns its term and the depth it takes from
// the base, cm.
func (p Part) compile(side string, i int, solver j0.Solver, scale *scaling) (term, float64, error) {
	label := p.Name
	if label == "" {
		label = fmt.Sprintf("part %d", i+1)
	}
	ctx := fmt.Sprintf("cell: %s part %q", side, label)
	t := term{name: side + ": " + label, frac: p.Fraction}
	if !(p.Fraction > 0 && p.Fraction <= 1) {
		return term{}, 0, fmt.Errorf("%s: area fraction must be in (0, 1], got %g", ctx, p.Fraction)
	}
	if err := check.NonNegative(ctx, "saturation current density J0", p.J0, "A/cm^2"); err != nil {
		return term{}, 0, err
	}
	if err := check.NonNegative(ctx, "Depth", p.Depth, "cm"); err != nil {
		return term{}, 0, err
	}
	set := 0
	for _, ok := range []bool{p.J0 != 0, p.Region != nil, p.Surface != nil} {
		if ok {
			set++
		}
	}
	if set > 1 {
		return term{}, 0, fmt.Errorf("%s: give one of J0 (%g A/cm^2), Region and Surface, not several", ctx, p.J0)
	}
	depth := p.Depth
	switch {
	case p.Surface != nil:
		if p.Depth != 0 {
			return term{}, 0, fmt.Errorf("%s: a surface takes no depth from the base, got Depth = %g cm", ctx, p.Depth)
		}
		t.kind, t.surf = KindSurface, p.Surface
	case p.Region != nil:
		r := *p.Region
		if ms, ok := r.Surface.(j0.ModelSurface); ok {
			ms.Material = solver.Material // the region's surface model follows the cell's temperature
			r.Surface = ms
		}
		res, err := solver.Solve(r)
		if err != nil {
			return term{}, 0, fmt.Errorf("%s: %w", ctx, err)
		}
		if depth == 0 {
			depth = res.Junction
			if depth == 0 {
				depth = res.Depth
			}
		}
		t.kind, t.j0 = KindRegion, res.J0
	default:
		t.kind, t.j0 = KindRegion, p.J0
		if scale != nil {
			t.j0 *= scale.ni2
		}
	}
	return t, depth, nil
}

func sideName(side int) string {
	if side == 0 {
		return "front"
	}
	return "rear"
}

// mechName returns the String of m if it has one, else its Go type.
func mechName(m recomb.Mechanism) string {
	if s, ok := m.(fmt.Stringer); ok {
		return s.String()
	}
	return strings.TrimPrefix(fmt.Sprintf("%T", m), "recomb.")
}

// Material returns the material of the device (nil for the zero Device).
func (d *Device) Material() *silicon.Material {
	if d == nil {
		return nil
	}
	return d.mat
}

// Bulk returns the base of the device as a recomb.Bulk (nil for the zero Device), e.g. for
// ImpliedVoc(d.Bulk(), dn).
func (d *Device) Bulk() *recomb.Bulk {
	if d == nil {
		return nil
	}
	return d.bulk
}

// Design returns the design the device was built from (the zero Design for the zero Device).
func (d *Device) Design() Design {
	if d == nil {
		return Design{}
	}
	return d.design
}

// BaseThickness returns the thickness of the base that recombines in cm, W minus the
// area-weighted depths of the parts (0 for the zero Device).
func (d *Device) BaseThickness() float64 {
	if d == nil {
		return 0
	}
	return d.wb
}

// Metallised returns the metallised (contacted) fractions of the front and the rear, the sums
// of the fractions of the parts marked Contact (0, 0 for the zero Device).
func (d *Device) Metallised() (front, rear float64) {
	if d == nil {
		return 0, 0
	}
	return d.metal[0], d.metal[1]
}

// Implied returns the device without series resistance, whose J–V curve is the implied
// (pseudo) J–V curve and whose fill factor is the pseudo fill factor.
func (d *Device) Implied() *Device {
	if d == nil {
		return nil
	}
	c := *d
	c.rs = 0
	return &c
}
