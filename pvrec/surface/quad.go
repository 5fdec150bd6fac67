package surface

import "gonum.org/v1/gonum/integrate/quad"

// glRule is a Gauss–Legendre rule on [−1, 1].
type glRule struct{ x, w []float64 }

// Read-only rules, computed once by gonum's quad.Legendre. The composite rule of
// ExtendedSRH.grid is built by hand from these nodes (rather than by calling quad.Fixed per
// panel) because the nodes are reused for two integrands and many band bendings, with the
// band-bending-independent factors evaluated once per node.
var (
	gl8  = newLegendre(8)
	gl16 = newLegendre(16)
)

func newLegendre(n int) glRule {
	r := glRule{x: make([]float64, n), w: make([]float64, n)}
	quad.Legendre{}.FixedLocations(r.x, r.w, -1, 1)
	return r
}

// legendreRule returns the n-point rule (8 or 16; others are computed).
func legendreRule(n int) glRule {
	switch n {
	case 8:
		return gl8
	case 16:
		return gl16
	}
	return newLegendre(n)
}
