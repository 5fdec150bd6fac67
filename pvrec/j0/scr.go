package j0

import (
	"fmt"
	"math"
	"sort"

	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// eps0 is the vacuum permittivity in F/cm.
const eps0 = silicon.VacuumPermittivity

// SpaceCharge is the space-charge region of a junction at zero bias in the depletion
// approximation (see SpaceChargeRegion).
type SpaceCharge struct {
	Junction float64 // metallurgical junction depth xj, where the net doping changes sign, cm
	Front    float64 // edge of the space-charge region on the surface side, xn < xj, cm
	Back     float64 // edge on the substrate side, xp > xj, cm
	Charge   float64 // depleted charge per area on each side, ∫|nd − na| dx, cm^-2
	Vbi      float64 // built-in voltage Vt ln(|N(xn)| |N(xp)| / ni²), V
}

// SpaceChargeRegion returns the space-charge region at zero bias of the first junction of
// profile p (see profile.JunctionDepth) in material m.
//
// Method: the depletion approximation for an arbitrary profile (for example S. M. Sze and
// K. K. Ng, Physics of Semiconductor Devices, 3rd ed., Wiley 2007, chapter 2): the net doping
// N(x) = nd − na is fully ionised and uncompensated by free carriers between the edges
// xn < xj < xp and neutral outside, so that the charges on the two sides balance and
// Poisson's equation gives the potential drop,
//
//	∫_xn^xj |N| dx = ∫_xj^xp |N| dx = Q,
//	(q/ε) [∫_xn^xj (xj − x)|N| dx + ∫_xj^xp (x − xj)|N| dx] = Vbi = Vt ln(|N(xn)| |N(xp)| / ni²),
//
// with ε = silicon.RelativePermittivity·ε0 and ni = m.Ni(): the built-in voltage of Boltzmann statistics
// without band-gap narrowing at the edges (our simplification; the edges lie at moderate
// doping, and the width depends on Vbi only through its square or cube root). The cumulative
// charge and moment are tabulated on geometric grids on both sides of xj (ratio 2, from
// 1e-3 xj; Simpson's rule; beyond p.Extent() the profile keeps its value there) and
// interpolated with |N| linear between grid points; the largest root Q of the potential
// balance is found in ln Q to 1e-10 by stepping down from the full charge of the surface
// layer in factors of 4 and Brent's method (R. P. Brent, Algorithms for Minimization
// without Derivatives, Prentice-Hall 1973; pvrec's shared root finder). Abrupt and
// linearly graded junctions reproduce the textbook formulas to 1e-4 and 1e-6 (see the
// tests).
//
// It returns an error wrapping profile.ErrNoJunction for a profile without junction, an error
// if the surface layer is depleted entirely or the substrate side cannot balance its charge,
// or an error of p or m.
func SpaceChargeRegion(p profile.Profile, m *silicon.Material) (SpaceCharge, error) {
	if p == nil {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: profile p is nil")
	}
	if m == nil {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: material m is nil")
	}
	xj, err := profile.JunctionDepth(p)
	if err != nil {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: %w", err)
	}
	return spaceCharge(p, m, xj)
}

// spaceCharge is SpaceChargeRegion with the junction depth xj already known.
func spaceCharge(p profile.Profile, m *silicon.Material, xj float64) (SpaceCharge, error) {
	if !(xj > 0) {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: junction at the surface")
	}
	absNet := func(x float64) (float64, error) {
		n, err := profile.Net(p, x)
		return math.Abs(n), err
	}
	dmin := 1e-3 * xj
	front, err := newSide(absNet, xj, -1, dmin, xj)
	if err != nil {
		return SpaceCharge{}, err
	}
	back, err := newSide(absNet, xj, +1, dmin, math.Max(p.Extent()-xj, xj))
	if err != nil {
		return SpaceCharge{}, err
	}
	vt, ni := m.Vt(), m.Ni()
	qe := silicon.ElementaryCharge / (silicon.RelativePermittivity * eps0) // V·cm per (cm^-2 · cm) of charge moment
	f := func(q float64) float64 {
		_, mn, nn, ok1 := front.at(q)
		_, mp, np, ok2 := back.at(q)
		if !ok1 || !ok2 {
			return math.Inf(1)
		}
		return qe*(mn+mp) - vt*math.Log(nn/ni*(np/ni))
	}
	qmax := front.c[len(front.c)-1]
	if !(f(qmax) > 0) {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: the surface layer above xj = %g cm is depleted entirely at zero bias", xj)
	}
	// Step down from the full charge of the surface layer by factors of 4 to the first Q with
	// f <= 0, then narrow the bracket in ln Q with Brent's method.
	hi, lo := qmax, qmax
	flo := 0.0
	for {
		lo = hi / 4
		if lo < 1e-12*qmax {
			return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: no depletion charge balances the built-in voltage at xj = %g cm", xj)
		}
		if flo = f(lo); flo <= 0 {
			break
		}
		hi = lo
	}
	g := func(lq float64) (float64, error) { return f(math.Exp(lq)), nil }
	lq, err := roots.Brent(g, math.Log(lo), math.Log(hi), flo, f(hi), 1e-10, 200)
	if err != nil {
		return SpaceCharge{}, fmt.Errorf("j0: SpaceChargeRegion: %w", err)
	}
	q := math.Exp(lq)
	sn, _, nn, _ := front.at(q)
	sp, _, np, _ := back.at(q)
	return SpaceCharge{Junction: xj, Front: xj - sn, Back: xj + sp, Charge: q, Vbi: vt * math.Log(nn/ni*(np/ni))}, nil
}

// side tabulates, at distances s from the junction on one side, |N|, the cumulative charge
// C(s) = ∫_0^s |N| dt and the moment M(s) = ∫_0^s t |N| dt; beyond the table (substrate side
// only) |N| keeps its last value.
type side struct {
	s, n, c, mo []float64
	tail        bool // extend beyond the table with constant |N|
}

func newSide(absNet func(float64) (float64, error), xj, dir, dmin, dmax float64) (*side, error) {
	sd := &side{tail: dir > 0}
	at := func(s float64) (float64, error) {
		x := xj + dir*s
		if x < 0 {
			x = 0
		}
		return absNet(x)
	}
	// |N| at the junction itself is taken on this side, just off xj, so that an abrupt step
	// is resolved by the first interval.
	n0, err := at(1e-6 * dmin)
	if err != nil {
		return nil, err
	}
	// One backing array for the four columns: about log2(dmax/dmin) + 2 rows.
	rows := 2
	if dmax > dmin {
		rows += int(math.Ceil(math.Log2(dmax / dmin)))
	}
	buf := make([]float64, 4*rows)
	sd.s, sd.n, sd.c, sd.mo = buf[0:1:rows], buf[rows:rows+1:2*rows], buf[2*rows:2*rows+1:3*rows], buf[3*rows:3*rows+1:4*rows]
	sd.s[0], sd.n[0] = 0, n0
	s := 0.0
	next := dmin
	for s < dmax {
		if next > dmax {
			next = dmax
		}
		h := next - s
		mid, err := at(s + h/2)
		if err != nil {
			return nil, err
		}
		end, err := at(next)
		if err != nil {
			return nil, err
		}
		k := len(sd.s) - 1
		// Simpson's rule for the charge and the moment over [s, next].
		dc := h / 6 * (sd.n[k] + 4*mid + end)
		dm := h / 6 * (s*sd.n[k] + 4*(s+h/2)*mid + next*end)
		sd.s = append(sd.s, next)
		sd.n = append(sd.n, end)
		sd.c = append(sd.c, sd.c[k]+dc)
		sd.mo = append(sd.mo, sd.mo[k]+dm)
		s = next
		next = s * 2
	}
	return sd, nil
}

// at returns the distance s at which C(s) = q, the moment M(s) and |N(s)|; ok is false if the
// side cannot hold the charge q.
func (sd *side) at(q float64) (s, m, n float64, ok bool) {
	last := len(sd.c) - 1
	if q > sd.c[last] {
		if !sd.tail || !(sd.n[last] > 0) {
			return 0, 0, 0, false
		}
		nl, sl := sd.n[last], sd.s[last]
		ds := (q - sd.c[last]) / nl
		s = sl + ds
		return s, sd.mo[last] + nl*(s*s-sl*sl)/2, nl, true
	}
	k := sort.SearchFloat64s(sd.c, q) // c[k-1] < q <= c[k]
	if k == 0 {
		return 0, 0, sd.n[0], true
	}
	// Within [s0, s1], |N| is taken as linear, n(σ) = n0 + (n1 − n0) σ/h, so that the charge
	// grows quadratically in σ = s − s0; the increments of this model are scaled to the
	// tabulated (Simpson) ones at s1, so that the interpolation is continuous.
	s0, s1 := sd.s[k-1], sd.s[k]
	n0, n1 := sd.n[k-1], sd.n[k]
	h := s1 - s0
	slope := (n1 - n0) / h
	cModel := h * (n0 + n1) / 2
	mModel := n0*(s0*h+h*h/2) + slope*(s0*h*h/2+h*h*h/3)
	dc := sd.c[k] - sd.c[k-1]
	dq := (q - sd.c[k-1]) * cModel / dc // target increment of the model
	a, b := slope/2, n0
	var sigma float64
	if disc := b*b + 4*a*dq; disc > 0 && b+math.Sqrt(disc) > 0 {
		sigma = 2 * dq / (b + math.Sqrt(disc))
	} else {
		sigma = h * (q - sd.c[k-1]) / dc
	}
	sigma = math.Min(math.Max(sigma, 0), h)
	dm := n0*(s0*sigma+sigma*sigma/2) + slope*(s0*sigma*sigma/2+sigma*sigma*sigma/3)
	if mModel > 0 {
		dm *= (sd.mo[k] - sd.mo[k-1]) / mModel
	}
	return s0 + sigma, sd.mo[k-1] + dm, n0 + slope*sigma, true
}
