package profile

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// TestTabulated checks the interpolation in log density (definition): exact at the data,
// the geometric mean halfway between two rows, the end values held beyond the data.
func TestTabulated(t *testing.T) {
	depth := []float64{0.1e-4, 0.2e-4, 0.4e-4}
	dens := []float64{1e20, 1e18, 4e18} // non-monotonic, as measured profiles may be
	p, err := NewTabulated(silicon.Donor, depth, dens)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct{ x, want float64 }{
		{0, 1e20}, {0.1e-4, 1e20}, {0.2e-4, 1e18}, {0.4e-4, 4e18}, {1, 4e18},
		{0.15e-4, 1e19}, // sqrt(1e20 · 1e18)
		{0.3e-4, 2e18},  // sqrt(1e18 · 4e18)
	} {
		got, err := p.Density(tc.x)
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(got, tc.want) > 1e-13 {
			t.Errorf("Density(%g) = %g, want %g", tc.x, got, tc.want)
		}
	}
	// An exponential tail is reproduced exactly between rows.
	e, err := NewTabulated(silicon.Acceptor, []float64{0, 1e-4}, []float64{1e19, 1e15})
	if err != nil {
		t.Fatal(err)
	}
	if _, na, _ := e.Dopants(0.25e-4); relDiff(na, 1e18) > 1e-13 {
		t.Errorf("exponential tail: %g at 0.25 µm, want 1e18", na)
	}
	// Junction of a tabulated layer on a background, between data rows, exact under the
	// log-linear interpolation: N(x) = 1e19·10^{-4x/1µm} = 1e16 at x = 0.75 µm.
	xj, err := JunctionDepth(Sum{e, Uniform{Dopant: silicon.Donor, N: 1e16}})
	if err != nil {
		t.Fatal(err)
	}
	if relDiff(xj, 0.75e-4) > 1e-13 {
		t.Errorf("JunctionDepth of tabulated layer = %.16g, want 0.75e-4", xj)
	}
	for _, tc := range []struct {
		d, n []float64
		want string
	}{
		{[]float64{0}, []float64{1}, "at least 2"},
		{[]float64{0, 1}, []float64{1}, "1 densities"},
		{[]float64{0, 0}, []float64{1, 1}, "row 1: depth must increase"},
		{[]float64{-1, 0}, []float64{1, 1}, "row 0: depth"},
		{[]float64{0, 1}, []float64{1, 0}, "row 1: density"},
		{[]float64{0, 1}, []float64{math.NaN(), 1}, "row 0: density"},
	} {
		if _, err := NewTabulated(silicon.Donor, tc.d, tc.n); err == nil || !strings.Contains(err.Error(), tc.want) || !strings.HasPrefix(err.Error(), "profile: ") {
			t.Errorf("NewTabulated(%v, %v): err %v, want %q", tc.d, tc.n, err, tc.want)
		}
	}
}

const goodCSV = `# demo profile, invented
# second comment

depth (um), density (cm^-3)
0, 2e20
0.05 ,1.5e20
0.1, 8e19
`

// TestReadCSV checks the reader on a good file: units converted, comments kept.
func TestReadCSV(t *testing.T) {
	m, err := ReadCSV(strings.NewReader(goodCSV))
	if err != nil {
		t.Fatal(err)
	}
	if m.Unit != "um" || len(m.Depth) != 3 || len(m.Comments) != 2 || m.Comments[0] != "demo profile, invented" {
		t.Fatalf("ReadCSV = %+v", m)
	}
	if relDiff(m.Depth[1], 0.05e-4) > 1e-15 || m.Density[2] != 8e19 {
		t.Errorf("rows: %v %v", m.Depth, m.Density)
	}
	for unit, scale := range map[string]float64{"nm": 1e-7, "µm": 1e-4, "μm": 1e-4, "mm": 0.1, "cm": 1} {
		m, err := ReadCSV(strings.NewReader("Depth (" + unit + "),DENSITY (cm-3)\r\n1,1e18\r\n2,1e17\r\n"))
		if err != nil {
			t.Fatalf("unit %s: %v", unit, err)
		}
		if relDiff(m.Depth[1], 2*scale) > 1e-15 {
			t.Errorf("unit %s: depth %g cm, want %g", unit, m.Depth[1], 2*scale)
		}
	}
	tab, err := m.Profile(silicon.Donor)
	if err != nil {
		t.Fatal(err)
	}
	if nd, _, _ := tab.Dopants(0); nd != 2e20 {
		t.Errorf("Profile: surface %g", nd)
	}
}

// TestReadCSVErrors checks that each bad input gives an error naming its line.
func TestReadCSVErrors(t *testing.T) {
	hdr := "depth (um), density (cm^-3)\n"
	for _, tc := range []struct {
		name, in, want string
	}{
		{"empty", "", "line 1: empty file"},
		{"comments only", "# a\n# b\n", "line 3: end of file before the header"},
		{"no unit", "depth, density (cm^-3)\n0,1\n1,1\n", "line 1: header column \"depth\" has no unit"},
		{"no density unit", "depth (um), density\n", "line 1: header column \"density\" has no unit"},
		{"unknown unit", "# x\ndepth (inch), density (cm^-3)\n", "line 2: unknown depth unit \"inch\""},
		{"unknown density unit", "depth (um), density (m^-3)\n", "line 1: unknown density unit"},
		{"wrong column", "x (um), density (cm^-3)\n", "line 1: header column 1"},
		{"three columns", "depth (um), density (cm^-3), err\n", "line 1: header has 3 columns"},
		{"not increasing", hdr + "0,1e20\n0.1,1e19\n0.1,1e18\n", "line 4: depth must increase"},
		{"decreasing", hdr + "0.2,1e20\n0.1,1e19\n", "line 3: depth must increase"},
		{"negative depth", hdr + "-0.1,1e20\n", "line 2: depth must be finite and >= 0"},
		{"negative density", hdr + "0,1e20\n0.1,-5\n", "line 3: density must be finite and > 0"},
		{"zero density", hdr + "0,0\n", "line 2: density"},
		{"NaN density", hdr + "0,NaN\n", "line 2: density"},
		{"NaN depth", hdr + "NaN,1\n", "line 2: depth"},
		{"Inf density", hdr + "0,+Inf\n", "line 2: density"},
		{"not a number", hdr + "0,1e20\nabc,1\n", "line 3: depth \"abc\" is not a number"},
		{"one field", hdr + "0\n", "line 2: 1 fields"},
		{"one row", hdr + "0,1e20\n", "line 3: end of file after 1 data row(s)"},
		{"no rows", "# c\n" + hdr, "line 3: end of file after 0 data row(s)"},
		{"long line", hdr + strings.Repeat("1", maxLine+10) + "\n", "line 2:"},
	} {
		_, err := ReadCSV(strings.NewReader(tc.in))
		if err == nil || !strings.HasPrefix(err.Error(), "profile: ") || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: err %v, want %q", tc.name, err, tc.want)
		}
	}
}

// TestWriteCSVRoundTrip checks that WriteCSV and ReadCSV are inverse (to the 15 significant
// digits of the written depths).
func TestWriteCSVRoundTrip(t *testing.T) {
	m, err := ReadCSV(strings.NewReader(goodCSV))
	if err != nil {
		t.Fatal(err)
	}
	for _, unit := range []string{"nm", "um", "cm"} {
		m.Unit = unit
		var buf bytes.Buffer
		if err := WriteCSV(&buf, m); err != nil {
			t.Fatal(err)
		}
		back, err := ReadCSV(&buf)
		if err != nil {
			t.Fatal(err)
		}
		checkSame(t, m, back)
	}
	if err := WriteCSV(&bytes.Buffer{}, Measured{Unit: "ft"}); err == nil {
		t.Errorf("WriteCSV with unknown unit: no error")
	}
}

func checkSame(t *testing.T, a, b Measured) {
	t.Helper()
	if len(a.Depth) != len(b.Depth) || len(a.Comments) != len(b.Comments) || a.Unit != b.Unit {
		t.Fatalf("round trip: %+v -> %+v", a, b)
	}
	for i := range a.Depth {
		if relDiff(b.Depth[i], a.Depth[i]) > 1e-14 || b.Density[i] != a.Density[i] { // 15 digits
			t.Errorf("row %d: (%g, %g) -> (%g, %g)", i, a.Depth[i], a.Density[i], b.Depth[i], b.Density[i])
		}
	}
}

// FuzzReadCSV checks that the reader never panics, that whatever it accepts satisfies the
// documented invariants (at least two rows, depths finite, >= 0, increasing and at most
// MaxDepthCm, densities finite, > 0 and at most the silicon atom density) and builds a
// Tabulated profile, and that writing and reading it back gives the same data.
func FuzzReadCSV(f *testing.F) {
	f.Add(goodCSV)
	f.Add("depth (nm), density (cm^-3)\n0,1e20\n10,1e19\n20,1e21\n")
	f.Add("# only\n")
	f.Add("#a\rb\n#\n#  two spaces\ndepth (mm), density (cm^-3)\n 1 , 2 \n3,4")
	f.Add("")
	f.Add("depth (cm), density (cm-3)\n1e-300,1e-300\n1e300,1e300\n")
	f.Add("depth (um), density (cm^-3)\n0,1\n0,1\n")
	f.Add("depth (µm),density (cm^-3)\r\n0x1p-3, 1_0\r\n1,2\r\n")
	f.Add("\ufeffDEPTH (UM), Density (CM^-3)\r0,1e20\r0.1,1e19\r")
	f.Add("\"depth (nm)\",\"density (cm⁻³)\"\n\"0\",\"1e20\"\n\"5\",\"1e19\"\n")
	f.Add("depth (um);density (cm^-3)\n0;1e20\n")
	f.Fuzz(func(t *testing.T, in string) {
		m, err := ReadCSV(strings.NewReader(in))
		if err != nil {
			if !strings.HasPrefix(err.Error(), "profile: line ") {
				t.Fatalf("error without line: %v", err)
			}
			return
		}
		if len(m.Depth) < 2 || len(m.Depth) != len(m.Density) {
			t.Fatalf("accepted %d/%d rows", len(m.Depth), len(m.Density))
		}
		for i := range m.Depth {
			x, n := m.Depth[i], m.Density[i]
			if math.IsNaN(x) || math.IsInf(x, 0) || x < 0 || x > MaxDepthCm || (i > 0 && !(x > m.Depth[i-1])) {
				t.Fatalf("accepted depth %g at row %d", x, i)
			}
			if math.IsNaN(n) || math.IsInf(n, 0) || n <= 0 || n > silicon.AtomDensity {
				t.Fatalf("accepted density %g at row %d", n, i)
			}
		}
		tab, err := m.Profile(silicon.Donor)
		if err != nil {
			t.Fatalf("accepted data rejected by NewTabulated: %v", err)
		}
		if v, err := tab.Density(m.Depth[len(m.Depth)-1] / 2); err != nil || !(v > 0) || math.IsInf(v, 0) {
			t.Fatalf("interpolated density %g, err %v", v, err)
		}
		var buf bytes.Buffer
		if err := WriteCSV(&buf, m); err != nil {
			t.Fatal(err)
		}
		back, err := ReadCSV(&buf)
		if err != nil {
			// Unit conversion may map two distinct tiny depths onto one or overflow.
			if strings.Contains(err.Error(), "depth") {
				return
			}
			t.Fatalf("round trip: %v\n%s", err, buf.String())
		}
		if len(back.Depth) != len(m.Depth) {
			t.Fatalf("round trip changed the row count")
		}
		for i := range m.Depth {
			if relDiff(back.Depth[i], m.Depth[i]) > 1e-14 || back.Density[i] != m.Density[i] { // depths written to 15 digits
				t.Fatalf("round trip row %d: (%g, %g) -> (%g, %g)", i, m.Depth[i], m.Density[i], back.Depth[i], back.Density[i])
			}
		}
	})
}

// TestDemoProfileFile checks the committed demo profile (testdata/profiles, written by
// testdata/profiles/gen): it reads, has the generator's 121 rows from 0 to 1.2 µm, and on a
// 1.5e16 cm^-3 boron wafer its junction lies where the generator's model
// 2.5e20 erfc(x/0.09 µm) + 6e18 exp(−(x/0.35 µm)²) meets the background, 0.86 µm, within the
// noise (4 % in density: a few nm at this slope; 0.01 µm tolerance).
func TestDemoProfileFile(t *testing.T) {
	m, err := ReadCSVFile("../../testdata/profiles/demo-phosphorus.csv")
	if err != nil {
		t.Fatal(err)
	}
	if len(m.Depth) != 121 || m.Depth[0] != 0 || relDiff(m.Depth[120], 1.2e-4) > 1e-14 || m.Unit != "um" {
		t.Fatalf("demo file: %d rows, %g–%g cm, unit %q", len(m.Depth), m.Depth[0], m.Depth[len(m.Depth)-1], m.Unit)
	}
	tab, err := m.Profile(silicon.Donor)
	if err != nil {
		t.Fatal(err)
	}
	xj, err := JunctionDepth(Sum{tab, Uniform{Dopant: silicon.Acceptor, N: 1.5e16}})
	if err != nil {
		t.Fatal(err)
	}
	// Model junction: solve 6e18 exp(−(x/0.35)²) = 1.5e16 (the erfc term is negligible there).
	want := 0.35e-4 * math.Sqrt(math.Log(6e18/1.5e16))
	if math.Abs(xj-want) > 0.01e-4 {
		t.Errorf("demo junction %g µm, model %g µm", xj*1e4, want*1e4)
	}
}
