package spectroscopy

import (
	"errors"
	"math"
	"reflect"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The locus of one noise-free curve passes through the true point (S. Rein et al., J. Appl.
// Phys. 91, 2059 (2002): the true defect lies on the solution curve of every sample): at the
// true Et, interpolated between the two nearest grid energies, the best k is the true k to
// 1 % (the interpolation over a 5.6 meV step) and the cost is that of noise-free data.
func TestSurfaceLocusThroughTruth(t *testing.T) {
	d := recomb.IronBoronPair(1e12)
	k := d.SigmaN / d.SigmaP
	cs := curvesOf(t, d, sample{300, 0, 1e16})
	cs[0] = synthetic(t, cs[0].Bulk, d, cs[0].Dn, 0, 1)
	s, err := SolutionSurface(cs, Options{Ref: recomb.FromConduction})
	if err != nil {
		t.Fatal(err)
	}
	const et = 0.26
	j := 0
	for s.Et[j+1] < et {
		j++
	}
	f := (et - s.Et[j]) / (s.Et[j+1] - s.Et[j])
	l := s.Loci[0]
	got := math.Exp((1-f)*math.Log(l.K[j]) + f*math.Log(l.K[j+1]))
	if !near(got, k, 0.01) {
		t.Errorf("locus k at Ec − Et = %g eV: %g (grid %g, %g), want %g", et, got, l.K[j], l.K[j+1], k)
	}
	for _, i := range []int{j, j + 1} {
		if l.Cost[i] > 1e-4 || l.AtEdge[i] {
			t.Errorf("locus at %g eV: cost %g, at edge %v", s.Et[i], l.Cost[i], l.AtEdge[i])
		}
	}
}

// For one curve in silicon without band-gap narrowing, τ(X) is exactly linear for every
// level (Line), so the locus of the solution surface is the solution curve of the line
// (Line.At) wherever the latter exists: the same k and a vanishing cost. Derived here (no
// source). Tolerances from the golden-section tolerance 1e-4 of ln k: k to 2e-4, and, since
// |∂ ln τ/∂ ln k| <= 1, a cost of at most N·(1e-4)².
func TestSurfaceMatchesLine(t *testing.T) {
	b := bulk(t, simple(t), 0, 1e16)
	c := synthetic(t, b, recomb.SRH{Level: recomb.FromEi(0.3), TauN0: 2e-5, TauP0: 1e-4}, logspace(1e13, 3e16, 30), 0, 1)
	s, err := SolutionSurface([]Curve{c}, Options{EtPoints: 60, KPoints: 60})
	if err != nil {
		t.Fatal(err)
	}
	l, err := Linearise(c, silicon.ThermalVelocity{})
	if err != nil {
		t.Fatal(err)
	}
	compared := 0
	for i, e := range s.Et {
		_, k, err := l.At(recomb.FromEi(e))
		if errors.Is(err, pvrec.ErrOutOfRange) || k < 1e-5 || k > 1e5 {
			continue // no solution of the line at this level, or outside the k range
		}
		if err != nil {
			t.Fatal(err)
		}
		compared++
		loc := s.Loci[0]
		if !near(loc.K[i], k, 2e-4) || loc.Cost[i] > float64(len(c.Dn))*1e-8 {
			t.Errorf("Et − Ei = %.3f eV: locus k = %g (cost %g), line k = %g", e, loc.K[i], loc.Cost[i], k)
		}
	}
	if compared < 20 {
		t.Errorf("only %d grid energies compared", compared)
	}
}

// The joint map is the sum of the curves' maps; its grid minimum is BestEt, BestK, next to
// the Fit; the grid spans the gap and [KMin, KMax]; results do not depend on the workers.
func TestSurfaceJoint(t *testing.T) {
	cs := curvesOf(t, recomb.IronBoronPair(1e12), sample{300, 0, 1e16}, sample{350, 0, 1e16}, sample{400, 0, 1e16})
	opt := Options{Ref: recomb.FromConduction, EtPoints: 120, KPoints: 90, KMin: 1e-3, KMax: 1e3, Workers: 1}
	s, err := SolutionSurface(cs, opt)
	if err != nil {
		t.Fatal(err)
	}
	if len(s.Et) != 120 || len(s.LogK) != 90 || len(s.Joint) != 90 || len(s.Joint[0]) != 120 || len(s.Loci) != 3 {
		t.Fatalf("grid %d × %d, joint %d × %d, %d loci", len(s.Et), len(s.LogK), len(s.Joint), len(s.Joint[0]), len(s.Loci))
	}
	if !near(s.LogK[0], -3, 1e-12) || !near(s.LogK[89], 3, 1e-12) || s.Et[0] < 0 || s.Et[0] > 1e-5 {
		t.Errorf("grid from (%g, %g) to (%g, %g)", s.Et[0], s.LogK[0], s.Et[119], s.LogK[89])
	}
	best := math.Inf(1)
	var be, bk float64
	for q := range s.LogK {
		for i := range s.Et {
			sum := 0.0
			for _, l := range s.Loci {
				sum += l.Map[q][i]
			}
			if !near(s.Joint[q][i], sum, 1e-12) {
				t.Fatalf("Joint[%d][%d] = %g, sum of maps %g", q, i, s.Joint[q][i], sum)
			}
			if sum < best {
				best, be, bk = sum, s.Et[i], math.Pow(10, s.LogK[q])
			}
		}
		if q > 0 && !(s.LogK[q] > s.LogK[q-1]) {
			t.Fatal("LogK not increasing")
		}
	}
	if be != s.BestEt || !near(bk, s.BestK, 1e-12) {
		t.Errorf("best (%g, %g), Surface says (%g, %g)", be, bk, s.BestEt, s.BestK)
	}
	r, err := Fit(cs, opt)
	if err != nil {
		t.Fatal(err)
	}
	step := s.Et[1] - s.Et[0]
	if math.Abs(s.BestEt-r.Et) > step || math.Abs(math.Log10(s.BestK/r.K)) > s.LogK[1]-s.LogK[0] {
		t.Errorf("grid best (%g eV, %g), Fit (%g eV, %g)", s.BestEt, s.BestK, r.Et, r.K)
	}
	opt.Workers = 2
	s2, err := SolutionSurface(cs, opt)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(s, s2) {
		t.Error("surfaces differ with 1 and 2 workers")
	}
}

func TestSurfaceGrid(t *testing.T) {
	cs := curvesOf(t, recomb.IronBoronPair(1e12), sample{300, 0, 1e16})
	for _, opt := range []Options{{EtPoints: 1}, {KPoints: -3}, {EtPoints: MaxGridPoints + 1}} {
		if _, err := SolutionSurface(cs, opt); !errors.Is(err, pvrec.ErrOutOfRange) {
			t.Errorf("%+v: got %v, want a range error", opt, err)
		}
	}
}
