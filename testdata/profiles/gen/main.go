// Command gen writes the invented demo "measured" phosphorus profile of testdata/profiles,
// used by notebooks/03-emitter-j0.ipynb and the tests. It is NOT a measurement: the profile is
// a smooth model with invented noise, made to look like a secondary-ion mass spectrometry
// depth profile of a phosphorus emitter (a near-surface plateau and a diffusion tail).
//
// Run from the repository root:
//
//	go run ./testdata/profiles/gen
//
// which (re)writes testdata/profiles/demo-phosphorus.csv. The output is deterministic (a
// fixed PCG seed), so a rerun reproduces the committed file byte for byte.
//
// Model (invented): N(x) = 2.5e20 erfc(x / 0.09 µm) + 6e18 exp(−(x / 0.35 µm)²) cm^-3, sampled
// every 10 nm from 0 to 1.2 µm; each value is multiplied by exp(0.04 g) with g standard
// normal (4 % multiplicative noise) and a detection floor of 3e14 cm^-3 with 30 % noise is
// added, then rounded to four significant digits.
package main

import (
	"flag"
	"fmt"
	"log"
	"math"
	"math/rand/v2"
	"os"
	"strconv"

	"github.com/pvrec/pvrec/pvrec/profile"
)

func main() {
	out := flag.String("o", "testdata/profiles/demo-phosphorus.csv", "output file")
	flag.Parse()
	rng := rand.New(rand.NewPCG(20240601, 5))
	m := profile.Measured{
		Unit: "um",
		Comments: []string{
			"INVENTED demo profile of phosphorus (not a measurement), for pvrec notebooks and tests.",
			"Written by testdata/profiles/gen (go run ./testdata/profiles/gen); format: docs/profile-csv.md.",
			"Model: 2.5e20 erfc(x/0.09 um) + 6e18 exp(-(x/0.35 um)^2) cm^-3, 4 % noise, floor 3e14 cm^-3.",
			"Dopant: phosphorus (donor); the wafer's boron background is not part of the file.",
		},
	}
	for i := 0; i <= 120; i++ {
		xum := 0.01 * float64(i)
		n := 2.5e20*math.Erfc(xum/0.09) + 6e18*math.Exp(-(xum/0.35)*(xum/0.35))
		n *= math.Exp(0.04 * rng.NormFloat64())
		n += 3e14 * math.Max(0.1, 1+0.3*rng.NormFloat64())
		n, err := strconv.ParseFloat(strconv.FormatFloat(n, 'g', 4, 64), 64)
		if err != nil {
			log.Fatal(err)
		}
		m.Depth = append(m.Depth, xum*1e-4) // cm
		m.Density = append(m.Density, n)
	}
	f, err := os.Create(*out)
	if err != nil {
		log.Fatal(err)
	}
	if err := profile.WriteCSV(f, m); err != nil {
		log.Fatal(err)
	}
	if err := f.Close(); err != nil {
		log.Fatal(err)
	}
	fmt.Printf("gen: wrote %d rows to %s\n", len(m.Depth), *out)
}
