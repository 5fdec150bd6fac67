package lifetime_test

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
)

const goodTrace = "\ufeff# invented trace\r\n" +
	"# second comment\r\n" +
	"\r\n" +
	"time (us), photoconductance (mS), illumination (suns)\r\n" +
	"0, 12.5, 1.0\r\n" +
	"2, 12.25, 0.98\r\n" +
	"4 ,12.0 , 0.96\r\n" +
	"6, 11.75, 0.94\r\n" +
	"8, -0.01, 0\r\n"

// TestReadTrace checks the reader on a good file with a byte-order mark and CRLF line ends:
// units converted to s and S, comments and lines kept, negative photoconductance kept.
func TestReadTrace(t *testing.T) {
	tr, err := lifetime.ReadTrace(strings.NewReader(goodTrace))
	if err != nil {
		t.Fatal(err)
	}
	if len(tr.Time) != 5 || tr.Time[1] != 2e-6 || tr.Conductance[2] != 12e-3 || tr.Conductance[4] != -1e-5 ||
		tr.Illumination[1] != 0.98 || tr.Unit != lifetime.Suns {
		t.Errorf("trace %+v", tr)
	}
	if len(tr.Comments) != 2 || tr.Comments[0] != "invented trace" || tr.Lines[0] != 5 || tr.Lines[4] != 9 {
		t.Errorf("comments %q, lines %v", tr.Comments, tr.Lines)
	}
	// A detector signal with a calibration, and a photon-flux illumination column.
	sig := "calibration = 0.001, 0.02, 0.003\n" +
		"time (ms), signal (V), illumination (cm^-2 s^-1)\n" +
		"0, 1, 2.5e17\n1, 2, 2.5e17\n2, 3, 2e17\n3, 4, 1e17\n4, 0.5, 0\n"
	tr, err = lifetime.ReadTrace(strings.NewReader(sig))
	if err != nil {
		t.Fatal(err)
	}
	// Δσ = c0 + c1 u + c2 u² (definition of the format): u = 2 V gives 0.001 + 0.04 + 0.012.
	if math.Abs(tr.Conductance[1]-0.053) > 1e-15 || tr.Time[3] != 3e-3 || tr.Unit != lifetime.PhotonFlux {
		t.Errorf("calibrated trace %+v", tr)
	}
	// Two columns: no illumination.
	tr, err = lifetime.ReadTrace(strings.NewReader("time (s), photoconductance (S)\n0, 1\n1, 0.5\n2, 0.25\n3, 0.125\n4, 0.0625\n"))
	if err != nil || tr.Illumination != nil {
		t.Errorf("two columns: %+v, %v", tr, err)
	}
}

// TestWriteTrace: WriteTrace output reads back exactly.
func TestWriteTrace(t *testing.T) {
	tr, err := lifetime.ReadTrace(strings.NewReader(goodTrace))
	if err != nil {
		t.Fatal(err)
	}
	tr.Time[1] = tr.Time[2] / 3 // a value without a short decimal form
	var buf bytes.Buffer
	if err := lifetime.WriteTrace(&buf, tr); err != nil {
		t.Fatal(err)
	}
	back, err := lifetime.ReadTrace(&buf)
	if err != nil {
		t.Fatal(err)
	}
	for i := range tr.Time {
		if back.Time[i] != tr.Time[i] || back.Conductance[i] != tr.Conductance[i] || back.Illumination[i] != tr.Illumination[i] {
			t.Fatalf("point %d: %v, %v, %v read back as %v, %v, %v", i, tr.Time[i], tr.Conductance[i], tr.Illumination[i],
				back.Time[i], back.Conductance[i], back.Illumination[i])
		}
	}
	if err := lifetime.WriteTrace(&buf, lifetime.Trace{Time: []float64{1}, Conductance: nil}); err == nil {
		t.Errorf("lengths that differ accepted")
	}
	if err := lifetime.WriteTrace(&buf, lifetime.Trace{Comments: []string{"a\nb"}}); err == nil {
		t.Errorf("multi-line comment accepted")
	}
	if err := lifetime.WriteTrace(&buf, lifetime.Trace{Time: []float64{0}, Conductance: []float64{1}, Illumination: []float64{1}}); err == nil {
		t.Errorf("illumination without a unit accepted")
	}
}

// TestReadTable checks the table reader: units, aliases, any row order.
func TestReadTable(t *testing.T) {
	tb, err := lifetime.ReadTable(strings.NewReader("# τeff of an invented sample\ndn (cm-3), tau_eff (us)\n1e15, 1320\n1e14, 1510\n"))
	if err != nil {
		t.Fatal(err)
	}
	if tb.Dn[1] != 1e14 || math.Abs(tb.TauEff[0]-1.32e-3) > 1e-18 || tb.Lines[1] != 4 {
		t.Errorf("table %+v", tb)
	}
	var buf bytes.Buffer
	if err := lifetime.WriteTable(&buf, tb); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "Δn (cm^-3), τeff (s)\n1e+15, 0.00132\n") {
		t.Errorf("WriteTable wrote %q", buf.String())
	}
	back, err := lifetime.ReadTable(&buf)
	if err != nil || back.TauEff[1] != tb.TauEff[1] || back.Comments[0] != tb.Comments[0] {
		t.Errorf("read back %+v, %v", back, err)
	}
	if err := lifetime.WriteTable(&buf, lifetime.Table{Dn: []float64{1}}); err == nil {
		t.Errorf("lengths that differ accepted")
	}
}

// TestReaderErrors: every bad input gives an error naming its line (or, at the end, the line
// after the last).
func TestReaderErrors(t *testing.T) {
	const h = "time (s), photoconductance (S), illumination (suns)\n"
	rows := "0, 1, 1\n1, 1, 1\n2, 1, 1\n3, 1, 1\n"
	for _, c := range []struct {
		name, in, want string
	}{
		{"empty", "", "line 1: end of file before the header"},
		{"comments only", "# a\n# b\n", "line 3: end of file before the header"},
		{"no unit", "time, photoconductance (S)\n", "line 1: header column 1"},
		{"one column", "time (s)\n", "line 1: header has 1 columns"},
		{"bad name", "t (s), photoconductance (S)\n", `line 1: header column 1 is "t"`},
		{"bad time unit", "time (h), photoconductance (S)\n", `unknown time unit "h"`},
		{"bad conductance unit", "time (s), photoconductance (ohm)\n", `unknown photoconductance unit`},
		{"bad column 2", "time (s), voltage (V)\n", `header column 2 is "voltage"`},
		{"bad column 3", "time (s), photoconductance (S), light (suns)\n", `header column 3 is "light"`},
		{"bad light unit", "time (s), photoconductance (S), illumination (W/m2)\n", "unknown illumination unit"},
		{"signal without calibration", "time (s), signal (V)\n" + "0, 1\n", "line 1: a signal column needs"},
		{"calibration without signal", "calibration = 0, 1\n" + h, "line 1: a calibration is given"},
		{"bad calibration", "calibration = 0\n", "line 1: calibration has 1 coefficients"},
		{"hex calibration", "calibration = 0x1p3, 1\n", "line 1: calibration coefficient c0"},
		{"two calibrations", "calibration = 0, 1\ncalibration = 0, 2\n", "line 2: second calibration line"},
		{"unknown setting", "gain = 3\n", `line 1: unknown setting "gain"`},
		{"short", h + "0, 1, 1\n1, 1, 1\n", "line 4: end of file after 2 data row(s)"},
		{"fields", h + "0, 1\n", "line 2: 2 fields, want 3"},
		{"hex float", h + "0x1p-2, 1, 1\n", `line 2: column 1 (time): "0x1p-2": not a decimal number`},
		{"NaN", h + rows + "4, NaN, 1\n", `line 6: column 2 (photoconductance): "NaN"`},
		{"Inf", h + rows + "4, 1, Inf\n", `line 6: column 3 (illumination): "Inf"`},
		{"underscore", h + "1_000, 1, 1\n", "line 2: column 1"},
		{"empty field", h + "0, , 1\n", "line 2: column 2"},
		{"overflow", h + "1e999, 1, 1\n", "line 2: column 1 (time): \"1e999\" is outside the range"},
		{"time order", h + rows + "3, 1, 1\n", "line 6: time must increase (3 s after 3 s)"},
		{"negative light", h + rows + "4, 1, -0.1\n", "line 6: illumination must be >= 0"},
		{"long line", h + strings.Repeat("1", 70000) + "\n", "line 2"},
	} {
		_, err := lifetime.ReadTrace(strings.NewReader(c.in))
		if err == nil || !strings.Contains(err.Error(), c.want) || !strings.HasPrefix(err.Error(), "lifetime: ") {
			t.Errorf("%s: error %v, want one containing %q", c.name, err, c.want)
		}
	}
	const th = "Δn (cm^-3), τeff (s)\n"
	for _, c := range []struct {
		name, in, want string
	}{
		{"empty", "", "line 1: end of file before the header"},
		{"no rows", th, "line 2: end of file without data rows"},
		{"settings", "calibration = 0, 1\n", "line 1: \"calibration = 0, 1\": this format has no settings"},
		{"columns", "Δn (cm^-3)\n", "header has 1 columns"},
		{"bad dn", "n (cm^-3), τeff (s)\n", `header column 1 is "n"`},
		{"bad dn unit", "Δn (m^-3), τeff (s)\n", "unknown Δn unit"},
		{"bad tau", "Δn (cm^-3), tau (s)\n", `header column 2 is "tau"`},
		{"bad tau unit", "Δn (cm^-3), τeff (min)\n", "unknown τeff unit"},
		{"zero dn", th + "0, 1\n", "line 2: Δn must be > 0"},
		{"negative tau", th + "1e15, -1\n", "line 2: τeff must be > 0"},
		{"hex", th + "0x1p50, 1\n", "line 2: column 1"},
	} {
		_, err := lifetime.ReadTable(strings.NewReader(c.in))
		if err == nil || !strings.Contains(err.Error(), c.want) || !strings.HasPrefix(err.Error(), "lifetime: ") {
			t.Errorf("table %s: error %v, want one containing %q", c.name, err, c.want)
		}
	}
	if _, err := lifetime.ReadTraceFile("no/such/file.csv"); err == nil {
		t.Errorf("missing file accepted")
	}
}
