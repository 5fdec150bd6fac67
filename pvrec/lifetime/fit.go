package lifetime

import "math"

// quadFit accumulates the normal equations of the least-squares parabola
// y ≈ c0 + c1 u + c2 u² through points (u, y), with u scaled by the caller to about [−1, 1]
// so that the 3×3 system is well conditioned. It is hand-written rather than built on
// gonum/mat because the smoothing derivative solves one such system per trace point, and a
// closed-form 3×3 solve without allocation keeps a 10,000-point analysis within its budget.
type quadFit struct {
	s0, s1, s2, s3, s4 float64 // Σ u^k
	y0, y1, y2         float64 // Σ y u^k
}

// add adds the point (u, y).
func (q *quadFit) add(u, y float64) {
	u2 := u * u
	q.s0++
	q.s1 += u
	q.s2 += u2
	q.s3 += u2 * u
	q.s4 += u2 * u2
	q.y0 += y
	q.y1 += y * u
	q.y2 += y * u2
}

// solve returns the coefficients of the parabola by Cramer's rule on the symmetric normal
// equations; ok is false if the system is singular (fewer than three distinct u).
func (q *quadFit) solve() (c0, c1, c2 float64, ok bool) {
	a, b, c, d, e := q.s0, q.s1, q.s2, q.s3, q.s4
	// Cofactors of [[a b c] [b c d] [c d e]].
	m00 := c*e - d*d
	m01 := b*e - c*d
	m02 := b*d - c*c
	det := a*m00 - b*m01 + c*m02
	if !(math.Abs(det) > 1e-12*a*c*e) {
		return 0, 0, 0, false
	}
	m11 := a*e - c*c
	m12 := a*d - b*c
	m22 := a*c - b*b
	y0, y1, y2 := q.y0, q.y1, q.y2
	c0 = (m00*y0 - m01*y1 + m02*y2) / det
	c1 = (-m01*y0 + m11*y1 - m12*y2) / det
	c2 = (m02*y0 - m12*y1 + m22*y2) / det
	return c0, c1, c2, true
}
