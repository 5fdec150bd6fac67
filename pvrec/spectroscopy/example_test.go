package spectroscopy_test

import (
	"fmt"
	"log"
	"math"
	"math/rand/v2"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/spectroscopy"
)

// measure returns an invented lifetime curve of mechanism m in b: 30 injection levels from
// 1e13 to 3e16 cm^-3, each lifetime with 2 % noise from a generator seeded by seed.
func measure(b *recomb.Bulk, m recomb.Mechanism, seed uint64) spectroscopy.Curve {
	dn := make([]float64, 30)
	for i := range dn {
		dn[i] = 1e13 * math.Pow(3e3, float64(i)/29)
	}
	tau, err := b.Lifetimes(m, dn)
	if err != nil {
		log.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(seed, 1))
	for i := range tau {
		tau[i] *= math.Exp(0.02 * rng.NormFloat64())
	}
	return spectroscopy.Curve{Bulk: b, Dn: dn, Tau: tau}
}

// wafer returns boron-doped silicon (Na = 1e16 cm^-3) at temperature temp in K.
func wafer(temp float64) *recomb.Bulk {
	m, err := silicon.DefaultModelSet().At(temp)
	if err != nil {
		log.Fatal(err)
	}
	b, err := recomb.NewBulk(m, 0, 1e16)
	if err != nil {
		log.Fatal(err)
	}
	return b
}

// An invented contamination study: one boron-doped wafer with iron–boron pairs (the
// catalogue's FeB level, Ec − 0.26 eV, k = 1.67), its SRH lifetime measured at three
// temperatures. The fit finds the level and its capture-cross-section ratio with 95 %
// intervals, and flags nothing: the data determine both.
func ExampleFit() {
	feB := recomb.IronBoronPair(1e12)
	var curves []spectroscopy.Curve
	for i, temp := range []float64{300, 350, 400} {
		curves = append(curves, measure(wafer(temp), feB, uint64(i)))
	}
	r, err := spectroscopy.Fit(curves, spectroscopy.Options{Ref: recomb.FromConduction})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Ec − Et = %.3f eV (95 %%: %.3f to %.3f eV)\n", r.Et, r.EtLow, r.EtHigh)
	fmt.Printf("k = σn/σp = %.2f (95 %%: %.2f to %.2f)\n", r.K, r.KLow, r.KHigh)
	fmt.Printf("σn·Nt at 300 K = %.2g cm^-1\n", r.Samples[0].SigmaNNt)
	fmt.Println("flags:", r.Flags)
	// Output:
	// Ec − Et = 0.260 eV (95 %: 0.259 to 0.261 eV)
	// k = σn/σp = 1.72 (95 %: 1.62 to 1.83)
	// σn·Nt at 300 K = 0.0051 cm^-1
	// flags: none
}

// One temperature cannot tell the upper half of the gap from the lower: the mirror level
// across Ei fits as well, and the fit says so. Curves at two dopings of the same invented
// FeB contamination.
func ExampleFit_branches() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	feB := recomb.IronBoronPair(1e12)
	var curves []spectroscopy.Curve
	for i, na := range []float64{1e15, 1e16} {
		b, err := recomb.NewBulk(m, 0, na)
		if err != nil {
			log.Fatal(err)
		}
		curves = append(curves, measure(b, feB, uint64(i)))
	}
	r, err := spectroscopy.Fit(curves, spectroscopy.Options{})
	if err != nil {
		log.Fatal(err)
	}
	for _, et := range []float64{r.Et, r.Alternative.Et} {
		l, err := spectroscopy.ConvertLevel(recomb.FromEi(et), m, recomb.FromConduction)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Et − Ei = %+.3f eV, that is Ec − Et = %.3f eV\n", et, l.E)
	}
	fmt.Println("flags:", r.Flags, "reliable:", r.Reliable())
	// Output:
	// Et − Ei = -0.321 eV, that is Ec − Et = 0.885 eV
	// Et − Ei = +0.303 eV, that is Ec − Et = 0.260 eV
	// flags: BranchesNotSeparated reliable: false
}

// The defect parameter solution surface of the FeB curves at two temperatures: the locus
// (Et, k) of each curve, and their intersection, the grid minimum of the joint cost map.
func ExampleSolutionSurface() {
	feB := recomb.IronBoronPair(1e12)
	curves := []spectroscopy.Curve{measure(wafer(300), feB, 0), measure(wafer(400), feB, 1)}
	s, err := spectroscopy.SolutionSurface(curves, spectroscopy.Options{Ref: recomb.FromConduction})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("grid %d × %d, %d loci\n", len(s.Et), len(s.LogK), len(s.Loci))
	fmt.Printf("intersection: Ec − Et = %.3f eV, k = %.2f\n", s.BestEt, s.BestK)
	for i, et := range s.Et {
		if et == s.BestEt {
			fmt.Printf("there the loci give k = %.2f (300 K) and %.2f (400 K)\n", s.Loci[0].K[i], s.Loci[1].K[i])
		}
	}
	// Output:
	// grid 200 × 200, 2 loci
	// intersection: Ec − Et = 0.261 eV, k = 1.68
	// there the loci give k = 1.70 (300 K) and 1.89 (400 K)
}

// The linearised form of one curve: τSRH against X = n/p is a line. An invented deep level
// (Ei − 0.1 eV, τn0 = 20 µs, τp0 = 200 µs) in boron-doped silicon: the intercept is τn0, the
// slope τp0, and their ratio gives k.
func ExampleLinearise() {
	deep := recomb.SRH{Level: recomb.FromEi(-0.1), TauN0: 20e-6, TauP0: 200e-6}
	l, err := spectroscopy.Linearise(measure(wafer(300), deep, 0), silicon.ThermalVelocity{})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("τ = %.1f µs + %.0f µs · X (±%.1f, ±%.0f µs)\n", l.Intercept*1e6, l.Slope*1e6, l.InterceptErr*1e6, l.SlopeErr*1e6)
	fmt.Printf("deep level: τn0 = %.1f µs, τp0 = %.0f µs, k = %.1f\n", l.DeepTauN0*1e6, l.DeepTauP0*1e6, l.DeepK)
	fmt.Println("flags:", l.Flags)
	// Output:
	// τ = 19.8 µs + 202 µs · X (±0.1, ±2 µs)
	// deep level: τn0 = 19.8 µs, τp0 = 202 µs, k = 8.4
	// flags: none
}

// The catalogue's iron–boron level counted from each reference at 300 K.
func ExampleConvertLevel() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	for _, ref := range []recomb.EnergyRef{recomb.FromConduction, recomb.FromIntrinsic, recomb.FromValence} {
		l, err := spectroscopy.ConvertLevel(recomb.BelowEc(0.26), m, ref)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("%.3f eV from reference %d\n", l.E, l.Ref)
	}
	// Output:
	// 0.260 eV from reference 2
	// 0.304 eV from reference 3
	// 0.870 eV from reference 1
}
