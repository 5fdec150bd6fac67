package profile

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/internal/csvtext"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The tests of this file check the hardening of issue 12: zero values, shared slices, physical
// bounds and the CSV reader. Each would have failed before the corresponding fix.

// nanProfile is a user Profile that breaks the interface's contract: NaN densities.
type nanProfile struct{}

func (nanProfile) Dopants(float64) (float64, float64, error) { return math.NaN(), 0, nil }
func (nanProfile) Extent() float64                           { return 1e-4 }

// TestZeroTabulated: the zero Tabulated and a nil *Tabulated return errors and zeros; they
// panicked with an index out of range.
func TestZeroTabulated(t *testing.T) {
	for _, tab := range []*Tabulated{{}, nil} {
		func() {
			defer func() {
				if r := recover(); r != nil {
					t.Errorf("%#v: panic %v", tab, r)
				}
			}()
			if _, err := tab.Density(0); err == nil {
				t.Errorf("Density: no error")
			}
			if _, _, err := tab.Dopants(0); err == nil {
				t.Errorf("Dopants: no error")
			}
			if d, n := tab.Data(); d != nil || n != nil || tab.Extent() != 0 || tab.Dopant() != 0 {
				t.Errorf("Data %v %v, Extent %g, Dopant %v", d, n, tab.Extent(), tab.Dopant())
			}
			if !strings.Contains(tab.String(), "no data") {
				t.Errorf("String %q", tab.String())
			}
			if _, err := JunctionDepth(Sum{tab, Uniform{Dopant: silicon.Acceptor, N: 1e16}}); err == nil {
				t.Errorf("JunctionDepth of a Sum with a zero Tabulated: no error")
			}
		}()
	}
}

// TestTabulatedImmutable: a Tabulated is immune to the caller's slices, in and out, and to the
// package's own searches; JunctionDepth of a bare Tabulated used to sort the depth 0 into its
// data (33 rows starting below the surface: the copy had room for two more).
func TestTabulatedImmutable(t *testing.T) {
	for n := 2; n < 70; n++ {
		d, v := make([]float64, n), make([]float64, n)
		for i := range d {
			d[i], v[i] = float64(i+1)*1e-6, 1e20/float64(i+1)
		}
		tab, err := NewTabulated(silicon.Donor, d, v)
		if err != nil {
			t.Fatal(err)
		}
		d[0], v[0] = 5, 5 // the caller's slices change after construction
		before, bv := tab.Data()
		before[1], bv[1] = 7, 7 // and the copies handed out
		if _, err := JunctionDepth(tab); !errors.Is(err, ErrNoJunction) {
			t.Fatalf("n = %d: JunctionDepth: %v", n, err)
		}
		if _, err := Dose(tab, silicon.Donor, 0, tab.Extent()); err != nil {
			t.Fatal(err)
		}
		after, av := tab.Data()
		if after[0] != 1e-6 || after[1] != 2e-6 || av[0] != 1e20 || av[1] != 5e19 || !reflect.DeepEqual(after[2:], func() []float64 {
			w := make([]float64, n-2)
			for i := range w {
				w[i] = float64(i+3) * 1e-6
			}
			return w
		}()) {
			t.Fatalf("n = %d: data changed: %v", n, after[:3])
		}
	}
}

// TestProfileBounds: densities above the silicon atom density (5e22 cm^-3, silicon.AtomDensity)
// and lengths beyond MaxDepthCm are range errors, so that doses and sheet resistances stay
// finite. Before, the dose of Erfc{Surface: 1e300, Length: 1e300} was +Inf, without error.
func TestProfileBounds(t *testing.T) {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	dose := func(p Profile) error { _, err := Dose(p, silicon.Donor, 0, 1e-4); return err }
	for name, f := range map[string]func() error{
		"Uniform N":       func() error { return dose(Uniform{Dopant: silicon.Donor, N: 1e300}) },
		"Erfc Surface":    func() error { return dose(Erfc{Dopant: silicon.Donor, Surface: 1e300, Length: 1e-5}) },
		"Erfc Length":     func() error { return dose(Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e300}) },
		"Gaussian Peak":   func() error { return dose(Gaussian{Dopant: silicon.Donor, Peak: 6e22, Length: 1e-5}) },
		"Gaussian Length": func() error { return dose(Gaussian{Dopant: silicon.Donor, Peak: 1e20, Length: 11}) },
		"Gaussian Center": func() error { return dose(Gaussian{Dopant: silicon.Donor, Peak: 1e20, Center: -1e300, Length: 1e-5}) },
		"Sum over the atoms": func() error {
			e := Erfc{Dopant: silicon.Donor, Surface: 4e22, Length: 1e-5}
			return dose(Sum{e, e})
		},
		"Dose x1": func() error {
			_, err := Dose(Uniform{Dopant: silicon.Donor, N: 1e22}, silicon.Donor, 0, 1e300)
			return err
		},
		"NewTabulated density": func() error {
			_, err := NewTabulated(silicon.Donor, []float64{0, 1e-4}, []float64{1e300, 1e19})
			return err
		},
		"NewTabulated depth": func() error {
			_, err := NewTabulated(silicon.Donor, []float64{0, 1e300}, []float64{1e20, 1e19})
			return err
		},
		"SheetResistance density": func() error {
			_, err := SheetResistance(mat, silicon.Donor, []float64{0, 1e-4}, []float64{1e300, 1e19}, 0)
			return err
		},
		"SheetResistance depth": func() error {
			_, err := SheetResistance(mat, silicon.Donor, []float64{0, 1e300}, []float64{1e20, 1e19}, 0)
			return err
		},
		"SheetResistance background": func() error {
			_, err := SheetResistance(mat, silicon.Donor, []float64{0, 1e-4}, []float64{1e20, 1e19}, 1e300)
			return err
		},
		"SheetResistanceFunc depth": func() error {
			_, err := SheetResistanceFunc(mat, silicon.Donor, func(float64) float64 { return 1e19 }, 1e300, 0)
			return err
		},
		"SheetResistanceFunc density": func() error {
			_, err := SheetResistanceFunc(mat, silicon.Donor, func(float64) float64 { return 1e300 }, 1e-4, 0)
			return err
		},
	} {
		if err := f(); !errors.Is(err, pvrec.ErrOutOfRange) || !strings.HasPrefix(err.Error(), "profile: ") {
			t.Errorf("%s: err %v, want a profile range error", name, err)
		}
	}
	// A user profile that returns NaN gives an error, not a NaN dose.
	if d, err := Dose(nanProfile{}, silicon.Donor, 0, 1e-4); err == nil {
		t.Errorf("Dose of a NaN profile = %g, no error", d)
	}
	if _, err := SheetOf(Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}, Uniform{Dopant: silicon.Acceptor, N: 1e16}}, nil); err == nil {
		t.Errorf("SheetOf with a nil Material: no error")
	}
	if _, err := SheetOf(Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 1e-5}, Uniform{Dopant: silicon.Acceptor, N: 1e16}}, &silicon.Material{}); err == nil {
		t.Errorf("SheetOf with a zero Material: no error")
	}
}

// TestReadCSVSpreadsheet: what spreadsheet programs write is read (byte-order mark, upper-case
// units, CR-only or mixed line ends, quoted fields); before, each gave an error.
func TestReadCSVSpreadsheet(t *testing.T) {
	for name, in := range map[string]string{
		"BOM":             "\ufeffdepth (um), density (cm^-3)\n0,1e20\n0.1,1e19\n",
		"upper-case unit": "DEPTH (UM), DENSITY (CM^-3)\n0,1e20\n0.1,1e19\n",
		"CR only":         "# note\rdepth (um), density (cm^-3)\r0,1e20\r0.1,1e19\r",
		"mixed line ends": "depth (um), density (cm^-3)\r\n0,1e20\r0.1,1e19\n",
		"quoted":          "\"depth (um)\",\"density (cm^-3)\"\n\"0\",\"1e20\"\n0.1,1e19\n",
		"superscript":     "depth (µm), density (cm⁻³)\n0,1e20\n0.1,1e19",
	} {
		m, err := ReadCSV(strings.NewReader(in))
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if m.Unit != "um" || len(m.Depth) != 2 || relDiff(m.Depth[1], 0.1e-4) > 1e-15 || m.Density[1] != 1e19 {
			t.Errorf("%s: %+v", name, m)
		}
	}
	// CR-only files count their lines: the error names the right one.
	_, err := ReadCSV(strings.NewReader("depth (um), density (cm^-3)\r0,1e20\r0.1,-1\r"))
	if err == nil || !strings.HasPrefix(err.Error(), "profile: line 3: density") {
		t.Errorf("CR-only error: %v", err)
	}
}

// TestReadCSVStrict: anything that is not a plain decimal number is refused (strconv.ParseFloat
// accepted hexadecimal floats, digit separators, Inf and NaN), error messages quote at most
// 40 characters of the file, and the remaining messages name what is wrong.
func TestReadCSVStrict(t *testing.T) {
	hdr := "depth (um), density (cm^-3)\n0,1e20\n"
	for _, f := range []string{"0x1p-3", "1_0", "1_000.5", "Inf", "infinity", "nan", "1e", "e5", ".", "1.2.3", "0x10", "1e+", "١٢", "1,5"} {
		_, err := ReadCSV(strings.NewReader(hdr + "0.1, " + f + "\n0.2, 1e18\n"))
		if err == nil || !strings.HasPrefix(err.Error(), "profile: line 3: ") {
			t.Errorf("%q: err %v, want an error on line 3", f, err)
		}
	}
	for _, f := range []string{"1", "+1", "-0", "1.", ".5", "2.5e20", "2.5E+20", "3e-3"} {
		if !csvtext.PlainDecimal(f) {
			t.Errorf("csvtext.PlainDecimal(%q) = false", f)
		}
	}
	long := strings.Repeat("x", 60000)
	for name, in := range map[string]string{
		"header":     long + " (um), density (cm^-3)\n0,1\n1,1\n",
		"unit":       "depth (" + long + "), density (cm^-3)\n",
		"field":      hdr + long + ", 1\n",
		"no unit":    "depth" + long + ", density (cm^-3)\n",
		"dens. unit": "depth (um), density (" + long + ")\n",
	} {
		_, err := ReadCSV(strings.NewReader(in))
		if err == nil || len(err.Error()) > 200 {
			t.Errorf("%s: error of %d bytes: %.100v", name, len(err.Error()), err)
		}
	}
	for name, c := range map[string]struct{ in, want string }{
		"overflow":   {hdr + "0.1, 1e400\n", "line 3: density \"1e400\" is too large"},
		"atoms":      {hdr + "0.1, 1e26\n", "line 3: density 1e+26 cm^-3 above the silicon atom density"},
		"depth":      {"depth (cm), density (cm^-3)\n0,1e20\n20,1e19\n", "line 3: depth 20 cm beyond"},
		"semicolons": {"depth (um);density (cm^-3)\n0;1e20\n", "line 1: columns separated by ';'"},
		"UTF-16":     {"\xff\xfed\x00e\x00p\x00", "line 1: the file is UTF-16"},
		"long line":  {hdr + strings.Repeat("1", maxLine+10) + "\n", "line 3: longer than 64 kB"},
	} {
		_, err := ReadCSV(strings.NewReader(c.in))
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: err %v, want %q", name, err, c.want)
		}
	}
	if err := WriteCSV(&strings.Builder{}, Measured{Comments: []string{"a\rb"}}); err == nil {
		t.Errorf("WriteCSV of a comment with a CR: no error")
	}
}

// TestDopantsAllocationFree: evaluating a profile, the J0 solver's inner call, allocates
// nothing (issue 9: validation builds no message on the success path).
func TestDopantsAllocationFree(t *testing.T) {
	tab, err := NewTabulated(silicon.Donor, []float64{0, 1e-5, 1e-4}, []float64{1e20, 1e19, 1e15})
	if err != nil {
		t.Fatal(err)
	}
	bg := Uniform{Dopant: silicon.Acceptor, N: 1.5e16}
	for name, p := range map[string]Profile{
		"Erfc on a wafer":      Sum{Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}, bg},
		"Gaussian":             Gaussian{Dopant: silicon.Donor, Peak: 1e19, Center: 1e-5, Length: 1e-5},
		"Tabulated on a wafer": Sum{tab, bg},
	} {
		if a := testing.AllocsPerRun(100, func() { _, _, _ = p.Dopants(3e-5) }); a != 0 {
			t.Errorf("%s: %g allocations per call, want 0", name, a)
		}
	}
}
