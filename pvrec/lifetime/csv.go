package lifetime

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/csvtext"
)

// The two CSV formats of the package, a time-resolved trace and a processed τeff(Δn) table,
// are described in docs/lifetime-csv.md. They share one syntax: '#' comment lines, blank
// lines, a header of "name (unit)" columns, comma-separated decimal numbers; a UTF-8 byte-order
// mark and CRLF line ends are accepted.

// MinTracePoints is the fewest points of a trace that ReadTrace and Analysis.Analyze accept:
// the smoothing derivative fits a parabola (three coefficients) to at least this many points.
const MinTracePoints = 5

// maxLine is the longest line the readers accept, in bytes.
const maxLine = 1 << 16

// LightUnit is the unit of the illumination column of a Trace.
type LightUnit uint8

const (
	// Suns: light intensity in suns, converted to a photon flux by Optics.FluxPerSun.
	Suns LightUnit = iota + 1
	// PhotonFlux: incident photon flux in cm^-2 s^-1.
	PhotonFlux
)

// String returns "suns" or "cm^-2 s^-1" (the unit as written in a header).
func (u LightUnit) String() string {
	switch u {
	case Suns:
		return "suns"
	case PhotonFlux:
		return "cm^-2 s^-1"
	}
	return fmt.Sprintf("LightUnit(%d)", uint8(u))
}

// Trace is a time-resolved photoconductance measurement of a lifetime sample, as read by
// ReadTrace (format: docs/lifetime-csv.md) or made in code: the time, the excess sheet
// photoconductance of the wafer and, if recorded, the illumination, point by point.
type Trace struct {
	Time         []float64 // time, s, strictly increasing
	Conductance  []float64 // excess sheet photoconductance Δσ·W, S (finite; noise may make it <= 0)
	Illumination []float64 // illumination in Unit, >= 0, one per point; nil if not recorded
	Unit         LightUnit // unit of Illumination (Suns or PhotonFlux); ignored when Illumination is nil
	Comments     []string  // comment lines without the leading '#' and one following space
	Lines        []int     // 1-based file line of each point (set by ReadTrace; nil for a trace made in code)
}

// Table is a processed effective-lifetime curve τeff(Δn), as read by ReadTable (format:
// docs/lifetime-csv.md) or written by WriteTable.
type Table struct {
	Dn       []float64 // excess carrier density, cm^-3, > 0
	TauEff   []float64 // effective lifetime, s, > 0
	Comments []string  // comment lines without the leading '#' and one following space
	Lines    []int     // 1-based file line of each point (set by ReadTable)
}

// column is one header column: its name and unit as written.
type column struct{ name, unit string }

// document is a file of the shared syntax, before the format's own rules.
type document struct {
	comments    []string
	calibration []float64 // coefficients of the "calibration =" setting, nil if absent
	calLine     int
	header      []column
	headerLine  int
	rows        [][]float64
	lines       []int
}

// readDocument reads the shared syntax; settings ("name = value" lines before the header) are
// accepted only if settings is true, and "calibration" is the only one defined.
func readDocument(r io.Reader, settings bool, want string) (document, error) {
	var d document
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), maxLine)
	line := 0
	for sc.Scan() {
		line++
		text := sc.Text() // bufio.ScanLines strips "\n" and a "\r" before it
		if line == 1 {
			text = strings.TrimPrefix(text, "\ufeff")
		}
		text = strings.TrimSpace(text)
		switch {
		case text == "":
			continue
		case strings.HasPrefix(text, "#"):
			d.comments = append(d.comments, strings.TrimPrefix(strings.TrimPrefix(text, "#"), " "))
			continue
		}
		fields := strings.Split(text, ",")
		if d.header == nil {
			if key, value, ok := strings.Cut(text, "="); ok {
				if !settings {
					return document{}, fmt.Errorf("lifetime: line %d: %q: this format has no settings lines, want the header %s", line, text, want)
				}
				if err := d.setting(line, strings.TrimSpace(key), value); err != nil {
					return document{}, err
				}
				continue
			}
			d.headerLine = line
			for i, f := range fields {
				name, unit, ok := csvtext.SplitUnit(f)
				if !ok || unit == "" {
					return document{}, fmt.Errorf("lifetime: line %d: header column %d %q has no unit in parentheses, want the header %s", line, i+1, strings.TrimSpace(f), want)
				}
				d.header = append(d.header, column{name: name, unit: unit})
			}
			continue
		}
		if len(fields) != len(d.header) {
			return document{}, fmt.Errorf("lifetime: line %d: %d fields, want %d as in the header (line %d)", line, len(fields), len(d.header), d.headerLine)
		}
		row := make([]float64, len(fields))
		for i, f := range fields {
			v, err := parseDecimal(f)
			if err != nil {
				return document{}, fmt.Errorf("lifetime: line %d: column %d (%s): %w", line, i+1, d.header[i].name, err)
			}
			row[i] = v
		}
		d.rows = append(d.rows, row)
		d.lines = append(d.lines, line)
	}
	if err := sc.Err(); err != nil {
		return document{}, fmt.Errorf("lifetime: line %d: %w", line+1, err)
	}
	if d.header == nil {
		return document{}, fmt.Errorf("lifetime: line %d: end of file before the header %s", line+1, want)
	}
	return d, nil
}

// setting records the setting key = value of line.
func (d *document) setting(line int, key, value string) error {
	if !strings.EqualFold(key, "calibration") {
		return fmt.Errorf("lifetime: line %d: unknown setting %q, the only setting is \"calibration = c0, c1, c2\"", line, key)
	}
	if d.calibration != nil {
		return fmt.Errorf("lifetime: line %d: second calibration line (the first is line %d)", line, d.calLine)
	}
	parts := strings.Split(value, ",")
	if len(parts) < 2 || len(parts) > 3 {
		return fmt.Errorf("lifetime: line %d: calibration has %d coefficients, want 2 or 3 (c0, c1[, c2])", line, len(parts))
	}
	for i, p := range parts {
		v, err := parseDecimal(p)
		if err != nil {
			return fmt.Errorf("lifetime: line %d: calibration coefficient c%d: %w", line, i, err)
		}
		d.calibration = append(d.calibration, v)
	}
	d.calLine = line
	return nil
}

// errNotDecimal is wrapped by parseDecimal for a field that is not a decimal number.
var errNotDecimal = errors.New("not a decimal number")

// parseDecimal parses a decimal number with an optional sign, fraction and exponent
// ("-1.5e-3", ".5", "2."). It rejects everything else strconv.ParseFloat would accept —
// hexadecimal floats, "Inf", "NaN", digit separators — and values beyond the float64 range.
func parseDecimal(f string) (float64, error) {
	s := strings.TrimSpace(f)
	if !csvtext.PlainDecimal(s) {
		return 0, fmt.Errorf("%q: %w", s, errNotDecimal)
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsInf(v, 0) {
		return 0, fmt.Errorf("%q is outside the range of float64", s)
	}
	return v, nil
}

// Units of the columns: the number of file units per package unit, an exact power of ten, so
// that dividing by it gives the correctly rounded value ("40" µs is 4e-05 s exactly as
// written); signal: the accepted units.
var (
	timeUnits   = map[string]float64{"s": 1, "ms": 1e3, "us": 1e6, "µs": 1e6, "μs": 1e6, "ns": 1e9}
	condUnits   = map[string]float64{"S": 1, "mS": 1e3, "uS": 1e6, "µS": 1e6, "μS": 1e6}
	signalUnits = map[string]bool{"V": true, "mV": true} // the calibration is in the column's unit
	dnUnits     = map[string]float64{"cm^-3": 1, "cm-3": 1}
)

// lightUnit returns the LightUnit of a header unit.
func lightUnit(u string) (LightUnit, bool) {
	switch strings.ReplaceAll(u, " ", "") {
	case "suns":
		return Suns, true
	case "cm^-2s^-1", "cm-2s-1":
		return PhotonFlux, true
	}
	return 0, false
}

const traceHeader = `"time (s), photoconductance (S), illumination (suns)"`

// ReadTrace reads a time-resolved trace in the package's format (docs/lifetime-csv.md):
//
//	# comment lines start with '#'; blank lines are ignored
//	time (us), photoconductance (mS), illumination (suns)
//	0, 12.1, 0.98
//	2, 12.0, 0.97
//
// The header names two or three columns with their units: time (s, ms, us or µs, ns);
// photoconductance (S, mS, µS), the excess sheet photoconductance of the wafer, or signal
// (V, mV), a detector signal u converted by the setting line "calibration = c0, c1[, c2]"
// before the header into Δσ = c0 + c1 u + c2 u² in S (u in the column's unit); and,
// optionally, illumination in suns or as a photon flux in cm^-2 s^-1. Values are converted
// to s and S.
//
// It returns an error naming the line (1-based) for: a file without a header or with fewer
// than MinTracePoints data rows; an unknown column, unit or setting; a signal column
// without calibration or a calibration without a signal column; a row with the wrong number
// of fields; a field that is not a decimal number (hexadecimal floats, Inf and NaN are
// rejected); a time that does not increase; a negative illumination; or a line longer than
// 64 kB. Photoconductance values at or below zero (noise at the end of a decay) are kept: the
// analysis excludes them and reports how many.
func ReadTrace(r io.Reader) (Trace, error) {
	if r == nil {
		return Trace{}, fmt.Errorf("lifetime: ReadTrace: reader r is nil")
	}
	d, err := readDocument(r, true, traceHeader)
	if err != nil {
		return Trace{}, err
	}
	h, hl := d.header, d.headerLine
	if len(h) != 2 && len(h) != 3 {
		return Trace{}, fmt.Errorf("lifetime: line %d: header has %d columns, want 2 or 3: %s", hl, len(h), traceHeader)
	}
	if !strings.EqualFold(h[0].name, "time") {
		return Trace{}, fmt.Errorf("lifetime: line %d: header column 1 is %q, want \"time\"", hl, h[0].name)
	}
	tScale, ok := timeUnits[h[0].unit]
	if !ok {
		return Trace{}, fmt.Errorf("lifetime: line %d: unknown time unit %q, want s, ms, us or ns", hl, h[0].unit)
	}
	var cScale float64
	switch strings.ToLower(h[1].name) {
	case "photoconductance":
		if cScale, ok = condUnits[h[1].unit]; !ok {
			return Trace{}, fmt.Errorf("lifetime: line %d: unknown photoconductance unit %q, want S, mS or uS", hl, h[1].unit)
		}
		if d.calibration != nil {
			return Trace{}, fmt.Errorf("lifetime: line %d: a calibration is given but column 2 is photoconductance, not signal", d.calLine)
		}
	case "signal":
		if _, ok = signalUnits[h[1].unit]; !ok {
			return Trace{}, fmt.Errorf("lifetime: line %d: unknown signal unit %q, want V or mV", hl, h[1].unit)
		}
		if d.calibration == nil {
			return Trace{}, fmt.Errorf("lifetime: line %d: a signal column needs a line \"calibration = c0, c1, c2\" before the header", hl)
		}
	default:
		return Trace{}, fmt.Errorf("lifetime: line %d: header column 2 is %q, want \"photoconductance\" or \"signal\"", hl, h[1].name)
	}
	tr := Trace{Comments: d.comments, Lines: d.lines}
	if len(h) == 3 {
		if !strings.EqualFold(h[2].name, "illumination") {
			return Trace{}, fmt.Errorf("lifetime: line %d: header column 3 is %q, want \"illumination\"", hl, h[2].name)
		}
		if tr.Unit, ok = lightUnit(h[2].unit); !ok {
			return Trace{}, fmt.Errorf("lifetime: line %d: unknown illumination unit %q, want suns or cm^-2 s^-1", hl, h[2].unit)
		}
		tr.Illumination = make([]float64, 0, len(d.rows))
	}
	if len(d.rows) < MinTracePoints {
		return Trace{}, fmt.Errorf("lifetime: line %d: end of file after %d data row(s), a trace needs at least %d", d.headerLine+len(d.rows)+1, len(d.rows), MinTracePoints)
	}
	tr.Time = make([]float64, 0, len(d.rows))
	tr.Conductance = make([]float64, 0, len(d.rows))
	for i, row := range d.rows {
		t := row[0] / tScale
		if i > 0 && !(t > tr.Time[i-1]) {
			return Trace{}, fmt.Errorf("lifetime: line %d: time must increase (%g %s after %g %s)", d.lines[i], row[0], h[0].unit, d.rows[i-1][0], h[0].unit)
		}
		c := row[1] / cScale
		if d.calibration != nil { // the calibration is in the signal column's unit
			c = 0
			for k := len(d.calibration) - 1; k >= 0; k-- {
				c = c*row[1] + d.calibration[k]
			}
		}
		if math.IsInf(c, 0) {
			return Trace{}, fmt.Errorf("lifetime: line %d: calibrated photoconductance overflows", d.lines[i])
		}
		tr.Time = append(tr.Time, t)
		tr.Conductance = append(tr.Conductance, c)
		if tr.Illumination != nil {
			if row[2] < 0 {
				return Trace{}, fmt.Errorf("lifetime: line %d: illumination must be >= 0, got %g %s", d.lines[i], row[2], h[2].unit)
			}
			tr.Illumination = append(tr.Illumination, row[2])
		}
	}
	return tr, nil
}

const tableHeader = `"Δn (cm^-3), τeff (s)"`

// ReadTable reads a processed effective-lifetime table in the package's format
// (docs/lifetime-csv.md):
//
//	# comment lines start with '#'; blank lines are ignored
//	Δn (cm^-3), τeff (us)
//	1e14, 1510
//	1e15, 1320
//
// The header names two columns: Δn (or dn) in cm^-3 (or cm-3), and τeff (or tau_eff) in s,
// ms, us or µs, converted to s. Rows may come in any order. It returns an error naming the
// line (1-based) for: a file without a header or data rows, an unknown column or unit, a row
// with the wrong number of fields, a field that is not a decimal number (hexadecimal floats,
// Inf and NaN are rejected), a Δn or τeff that is not > 0, or a line longer than 64 kB.
func ReadTable(r io.Reader) (Table, error) {
	if r == nil {
		return Table{}, fmt.Errorf("lifetime: ReadTable: reader r is nil")
	}
	d, err := readDocument(r, false, tableHeader)
	if err != nil {
		return Table{}, err
	}
	h, hl := d.header, d.headerLine
	if len(h) != 2 {
		return Table{}, fmt.Errorf("lifetime: line %d: header has %d columns, want 2: %s", hl, len(h), tableHeader)
	}
	if !strings.EqualFold(h[0].name, "Δn") && !strings.EqualFold(h[0].name, "dn") {
		return Table{}, fmt.Errorf("lifetime: line %d: header column 1 is %q, want \"Δn\" (or \"dn\")", hl, h[0].name)
	}
	if _, ok := dnUnits[h[0].unit]; !ok {
		return Table{}, fmt.Errorf("lifetime: line %d: unknown Δn unit %q, want cm^-3", hl, h[0].unit)
	}
	if !strings.EqualFold(h[1].name, "τeff") && !strings.EqualFold(h[1].name, "tau_eff") {
		return Table{}, fmt.Errorf("lifetime: line %d: header column 2 is %q, want \"τeff\" (or \"tau_eff\")", hl, h[1].name)
	}
	tScale, ok := timeUnits[h[1].unit]
	if !ok {
		return Table{}, fmt.Errorf("lifetime: line %d: unknown τeff unit %q, want s, ms or us", hl, h[1].unit)
	}
	if len(d.rows) == 0 {
		return Table{}, fmt.Errorf("lifetime: line %d: end of file without data rows", hl+1)
	}
	tb := Table{Comments: d.comments, Lines: d.lines, Dn: make([]float64, len(d.rows)), TauEff: make([]float64, len(d.rows))}
	for i, row := range d.rows {
		if !(row[0] > 0) {
			return Table{}, fmt.Errorf("lifetime: line %d: Δn must be > 0 cm^-3, got %g", d.lines[i], row[0])
		}
		tau := row[1] / tScale
		if !(tau > 0) {
			return Table{}, fmt.Errorf("lifetime: line %d: τeff must be > 0, got %g %s", d.lines[i], row[1], h[1].unit)
		}
		tb.Dn[i], tb.TauEff[i] = row[0], tau
	}
	return tb, nil
}

// ReadTraceFile reads the file at path with ReadTrace; errors also name the file.
func ReadTraceFile(path string) (Trace, error) {
	f, err := os.Open(path)
	if err != nil {
		return Trace{}, openError(path, err)
	}
	defer f.Close()
	tr, err := ReadTrace(f)
	if err != nil {
		return Trace{}, fmt.Errorf("%s: %w", path, err)
	}
	return tr, nil
}

// ReadTableFile reads the file at path with ReadTable; errors also name the file.
func ReadTableFile(path string) (Table, error) {
	f, err := os.Open(path)
	if err != nil {
		return Table{}, openError(path, err)
	}
	defer f.Close()
	tb, err := ReadTable(f)
	if err != nil {
		return Table{}, fmt.Errorf("%s: %w", path, err)
	}
	return tb, nil
}

// WriteTrace writes tr in the trace format (see ReadTrace): its comments, the header
// "time (s), photoconductance (S)" and, if tr has illumination, "illumination (suns)" or
// "illumination (cm^-2 s^-1)", then the values in the shortest form that reads back exactly.
// It returns an error for lengths that differ, an illumination without a valid Unit, a
// comment that spans lines, or a write error; it does not otherwise validate the data
// (ReadTrace does).
func WriteTrace(w io.Writer, tr Trace) error {
	if w == nil {
		return fmt.Errorf("lifetime: WriteTrace: writer w is nil")
	}
	n := len(tr.Time)
	if len(tr.Conductance) != n || (tr.Illumination != nil && len(tr.Illumination) != n) {
		return fmt.Errorf("lifetime: WriteTrace: %d times, %d photoconductances and %d illuminations", n, len(tr.Conductance), len(tr.Illumination))
	}
	if tr.Illumination != nil && tr.Unit != Suns && tr.Unit != PhotonFlux {
		return fmt.Errorf("lifetime: WriteTrace: illumination unit %v is neither Suns nor PhotonFlux", tr.Unit)
	}
	bw := bufio.NewWriter(w)
	if err := writeComments(bw, "WriteTrace", tr.Comments); err != nil {
		return err
	}
	bw.WriteString("time (s), photoconductance (S)")
	if tr.Illumination != nil {
		fmt.Fprintf(bw, ", illumination (%v)", tr.Unit)
	}
	bw.WriteByte('\n')
	for i := range n {
		bw.WriteString(formatFloat(tr.Time[i]) + ", " + formatFloat(tr.Conductance[i]))
		if tr.Illumination != nil {
			bw.WriteString(", " + formatFloat(tr.Illumination[i]))
		}
		bw.WriteByte('\n')
	}
	return bw.Flush()
}

// WriteTable writes tb in the table format (see ReadTable): its comments, the header
// "Δn (cm^-3), τeff (s)" and the values in the shortest form that reads back exactly. It
// returns an error for lengths that differ, a comment that spans lines or a write error.
func WriteTable(w io.Writer, tb Table) error {
	if w == nil {
		return fmt.Errorf("lifetime: WriteTable: writer w is nil")
	}
	if len(tb.Dn) != len(tb.TauEff) {
		return fmt.Errorf("lifetime: WriteTable: %d Δn but %d τeff values", len(tb.Dn), len(tb.TauEff))
	}
	bw := bufio.NewWriter(w)
	if err := writeComments(bw, "WriteTable", tb.Comments); err != nil {
		return err
	}
	bw.WriteString("Δn (cm^-3), τeff (s)\n")
	for i := range tb.Dn {
		bw.WriteString(formatFloat(tb.Dn[i]) + ", " + formatFloat(tb.TauEff[i]) + "\n")
	}
	return bw.Flush()
}

func writeComments(bw *bufio.Writer, ctx string, comments []string) error {
	for _, c := range comments {
		if strings.ContainsAny(c, "\r\n") {
			return fmt.Errorf("lifetime: %s: comment %q spans lines", ctx, c)
		}
		bw.WriteString("# " + c + "\n")
	}
	return nil
}

// formatFloat writes v in the shortest decimal form that reads back exactly.
func formatFloat(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// openError reports a file that cannot be opened, quoting at most 80 characters of its path
// (the os error repeats the whole path, which may be long).
func openError(path string, err error) error {
	if len(path) <= 80 {
		return fmt.Errorf("lifetime: %w", err)
	}
	r := []rune(path)
	if len(r) > 80 {
		r = r[:80]
	}
	return fmt.Errorf("lifetime: cannot open %q…: %w", string(r), errors.Unwrap(err))
}
