// Command gen writes the invented demo data of testdata/lifetime: the photoconductance traces
// of a made-up passivation trial, used by notebooks/06-lifetime-sample.ipynb and the tests. It
// is NOT a measurement: every file is the forward model of package lifetime (Sample.Simulate)
// plus invented noise, and describes no real sample, laboratory or instrument.
//
// Run from the repository root:
//
//	go run ./testdata/lifetime/gen
//
// which (re)writes the files listed in testdata/lifetime/README.md. The output is
// deterministic (fixed PCG seeds), so a rerun reproduces the committed files byte for byte.
//
// The invented trial: four symmetric lifetime samples, 180 µm of 1.5e16 cm^-3 p-type silicon
// at 300 K (the wafer of notebook 04), both sides coated with the invented dielectric of
// notebook 04 (constant Dit over the gap, σn = 1e-14 cm², σp = 1e-16 cm²) after four invented
// process variants that leave it with different fixed charge and interface-defect density:
//
//	A1 as deposited          Qf = −1.0e12 cm^-2, Dit = 5e11 cm^-2 eV^-1
//	A2 short anneal          Qf = −1.6e12 cm^-2, Dit = 2e11 cm^-2 eV^-1
//	A3 long anneal           Qf = −2.2e12 cm^-2, Dit = 1e11 cm^-2 eV^-1
//	A4 long anneal, capped   Qf = −2.5e12 cm^-2, Dit = 1.5e11 cm^-2 eV^-1
//
// The bulk has intrinsic recombination (recomb.NewIntrinsic) and an invented midgap defect
// with τn0 = τp0 = 10 ms. The optics are lifetime.OneSunFlux per sun with 92 % absorbed.
//
// Each sample is measured with a flash, 150 suns · (1 − exp(−t/0.1 ms)) · exp(−t/2 ms),
// recorded every 2.5 µs for 20 ms (trial-A*.csv); sample A3 also as a free decay from the
// steady state at 30 suns, every 1 µs for 4 ms (trial-A3-decay.csv); and sample A4 as a
// processed table of τeff at 60 injection levels (trial-A4-table.csv). Invented noise: 0.2 %
// Gaussian on the photoconductance plus a Gaussian floor of 2e-6 S, 0.3 % on the illumination;
// 1.5 % on the tabulated lifetimes. Values are rounded to five significant digits.
package main

import (
	"flag"
	"fmt"
	"log"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// sample is one invented sample of the trial.
type sample struct {
	name, process string
	qf, dit       float64 // fixed charge, cm^-2; interface-defect density, cm^-2 eV^-1
}

var trial = []sample{
	{"A1", "as deposited", -1.0e12, 5e11},
	{"A2", "short anneal", -1.6e12, 2e11},
	{"A3", "long anneal", -2.2e12, 1e11},
	{"A4", "long anneal, capped", -2.5e12, 1.5e11},
}

const (
	width    = 180e-4 // cm
	acceptor = 1.5e16 // cm^-3
	absorbed = 0.92
)

func main() {
	dir := flag.String("o", "testdata/lifetime", "output directory")
	flag.Parse()
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 0, acceptor)
	if err != nil {
		log.Fatal(err)
	}
	bulk := recomb.Sum{recomb.NewIntrinsic(), recomb.SRH{Level: recomb.FromEi(0), TauN0: 10e-3, TauP0: 10e-3}}
	optics := lifetime.Optics{FluxPerSun: lifetime.OneSunFlux, Absorbed: absorbed}
	flash := func(t float64) float64 { return 150 * -math.Expm1(-t/1e-4) * math.Exp(-t/2e-3) }
	for k, smp := range trial {
		dielectric := surface.NewExtendedSRH(surface.ConstantDit{D: smp.dit}, surface.ConstantSigma(1e-14), surface.ConstantSigma(1e-16), smp.qf)
		s := lifetime.Sample{Wafer: wafer, W: width, Bulk: bulk, Front: dielectric}
		rng := rand.New(rand.NewPCG(20261203, uint64(k)))
		tr, err := s.Simulate(optics, times(8001, 2500), flash, 0)
		if err != nil {
			log.Fatal(err)
		}
		addNoise(tr, rng)
		tr.Comments = header(smp, "flash 150 suns x (1 - exp(-t/0.1 ms)) x exp(-t/2 ms), every 2.5 us for 20 ms")
		write(filepath.Join(*dir, "trial-"+smp.name+".csv"), func(f *os.File) error { return lifetime.WriteTrace(f, tr) })

		switch smp.name {
		case "A3":
			dn0, err := s.SteadyStateSuns(30, optics)
			if err != nil {
				log.Fatal(err)
			}
			tr, err := s.Simulate(optics, times(4001, 1000), func(float64) float64 { return 0 }, dn0)
			if err != nil {
				log.Fatal(err)
			}
			addNoise(tr, rng)
			tr.Comments = header(smp, "free decay from the steady state at 30 suns (light off at t = 0), every 1 us for 4 ms")
			write(filepath.Join(*dir, "trial-A3-decay.csv"), func(f *os.File) error { return lifetime.WriteTrace(f, tr) })
		case "A4":
			var tb lifetime.Table
			for i := range 60 {
				dn := math.Pow(10, 13.5+3.5*float64(i)/59)
				tau, err := s.Lifetime(dn)
				if err != nil {
					log.Fatal(err)
				}
				tb.Dn = append(tb.Dn, round5(dn))
				tb.TauEff = append(tb.TauEff, round5(tau*(1+0.015*rng.NormFloat64())))
			}
			tb.Comments = header(smp, "processed tau_eff(dn) table, 60 levels")
			write(filepath.Join(*dir, "trial-A4-table.csv"), func(f *os.File) error { return lifetime.WriteTable(f, tb) })
		}
	}
}

// times returns n times from 0 in steps of dtNs nanoseconds, in s (each the correctly rounded
// quotient of an exact integer by 1e9, so that the file holds short decimals).
func times(n, dtNs int) []float64 {
	t := make([]float64, n)
	for i := range t {
		t[i] = float64(i*dtNs) / 1e9
	}
	return t
}

// addNoise adds the invented noise to tr and rounds its values.
func addNoise(tr lifetime.Trace, rng *rand.Rand) {
	for i := range tr.Conductance {
		tr.Conductance[i] = round5(tr.Conductance[i]*(1+0.002*rng.NormFloat64()) + 2e-6*rng.NormFloat64())
		tr.Illumination[i] = round5(tr.Illumination[i] * (1 + 0.003*rng.NormFloat64()))
	}
}

// header returns the comment lines of a file of sample smp.
func header(smp sample, what string) []string {
	return []string{
		"INVENTED demo data (not a measurement) for pvrec notebooks and tests: a made-up passivation trial.",
		"Written by testdata/lifetime/gen (go run ./testdata/lifetime/gen); format: docs/lifetime-csv.md.",
		fmt.Sprintf("Sample %s (%s): symmetric, 180 um p-type 1.5e16 cm^-3 at 300 K, invented dielectric of notebook 04 on both sides.", smp.name, smp.process),
		fmt.Sprintf("Measurement (simulated): %s.", what),
		"Optics for the analysis: lifetime.OneSunFlux photons per sun, absorbed fraction 0.92.",
	}
}

// round5 rounds v to five significant digits.
func round5(v float64) float64 {
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 5, 64), 64)
	if err != nil {
		log.Fatal(err)
	}
	return r
}

// write creates path and writes it with fn.
func write(path string, fn func(*os.File) error) {
	f, err := os.Create(path)
	if err != nil {
		log.Fatal(err)
	}
	if err := fn(f); err != nil {
		log.Fatal(err)
	}
	if err := f.Close(); err != nil {
		log.Fatal(err)
	}
	fmt.Printf("gen: wrote %s\n", path)
}
