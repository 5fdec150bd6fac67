package profile_test

import (
	"fmt"
	"strings"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// A phosphorus diffusion (erfc, surface density 1e20 cm^-3, characteristic length 0.3 µm) into
// a 1.5e16 cm^-3 boron-doped wafer: junction depth, phosphorus dose and sheet resistance with
// the default model set's (Klaassen's) mobilities at 300 K.
func ExampleJunctionDepth() {
	emitter := profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}
	p := profile.Sum{emitter, profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}}
	xj, err := profile.JunctionDepth(p)
	if err != nil {
		fmt.Println(err)
		return
	}
	dose, _ := emitter.Dose()
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	sheet, err := profile.SheetOf(p, si)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("xj = %.3f µm, dose = %.3g cm^-2, Rsh = %.1f Ω/sq\n", xj*1e4, dose, sheet.Rsh)
	// Output:
	// xj = 0.804 µm, dose = 1.69e+15 cm^-2, Rsh = 42.7 Ω/sq
}

// Reading a measured profile in the package's CSV format and interpolating it.
func ExampleReadCSV() {
	const file = `# invented SIMS profile
depth (nm), density (cm^-3)
0, 2.0e20
50, 1.2e20
100, 3.0e19
200, 1.0e18
`
	m, err := profile.ReadCSV(strings.NewReader(file))
	if err != nil {
		fmt.Println(err)
		return
	}
	p, err := m.Profile(silicon.Donor)
	if err != nil {
		fmt.Println(err)
		return
	}
	n, _ := p.Density(150e-7) // halfway between 100 and 200 nm: the geometric mean
	fmt.Printf("%d rows to %.2f µm; N(150 nm) = %.3g cm^-3\n", len(m.Depth), p.Extent()*1e4, n)
	_, err = profile.ReadCSV(strings.NewReader("depth (nm), density (cm^-3)\n0, 1e20\n0, 1e19\n"))
	fmt.Println(err)
	// Output:
	// 4 rows to 0.20 µm; N(150 nm) = 5.48e+18 cm^-3
	// profile: line 3: depth must increase (0 nm after 0 nm)
}
