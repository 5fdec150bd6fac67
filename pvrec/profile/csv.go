package profile

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/pvrec/pvrec/pvrec/internal/csvtext"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Measured is a measured profile as read by ReadCSV from the package's CSV format (described
// in docs/profile-csv.md): the depths converted to cm, the densities in cm^-3, the depth unit
// of the file and the comment lines.
type Measured struct {
	Depth    []float64 // depths, cm, strictly increasing
	Density  []float64 // dopant densities, cm^-3, > 0
	Unit     string    // depth unit of the file: "nm", "um", "mm" or "cm" ("um" if empty when writing)
	Comments []string  // comment lines without the leading '#' and one following space
}

// Profile returns the Tabulated profile of dopant d with m's depths and densities (see
// NewTabulated).
func (m Measured) Profile(d silicon.Dopant) (*Tabulated, error) {
	return NewTabulated(d, m.Depth, m.Density)
}

// depthUnits maps the accepted depth units, in lower case, to their length in cm.
var depthUnits = map[string]float64{
	"nm": 1e-7, "um": 1e-4, "µm": 1e-4, "μm": 1e-4, "mm": 0.1, "cm": 1,
}

// densityUnits are the accepted spellings, in lower case, of the density unit cm^-3.
var densityUnits = map[string]bool{
	"cm^-3": true, "cm-3": true, "cm⁻³": true, "cm^−3": true, "1/cm^3": true, "1/cm3": true,
	"atoms/cm^3": true, "atoms/cm3": true,
}

// maxLine is the longest line ReadCSV accepts, in bytes.
const maxLine = 1 << 16

// maxEcho is the longest text, in characters, that an error message quotes from the file.
const maxEcho = 40

// ReadCSV reads a measured profile in the package's CSV format (docs/profile-csv.md):
//
//	# comment lines start with '#'; blank lines are ignored
//	depth (um), density (cm^-3)
//	0.000, 2.1e20
//	0.010, 1.9e20
//
// The first line that is neither blank nor a comment is the header: two comma-separated
// columns named depth and density, each followed by its unit in parentheses; names and units
// are case-insensitive. The depth unit is one of nm, um (or µm), mm, cm and the density unit
// cm^-3 (or cm-3, cm⁻³, 1/cm^3, atoms/cm^3). Each following line holds a depth and a density,
// plain decimal numbers with an optional exponent (2.5e20). Depths are converted to cm.
//
// What spreadsheet programs write is accepted: a UTF-8 byte-order mark, line ends \n, \r\n or
// \r alone, and fields in double quotes. Anything that is not a plain decimal number is
// refused (hexadecimal floats, digit separators, Inf, NaN), and so are depths beyond
// MaxDepthCm and densities above the silicon atom density (silicon.AtomDensity), which
// usually betray a wrong unit.
//
// It returns an error that names the line (1-based) for: an empty file or one without data
// rows, a UTF-16 file, a header without a unit or with an unknown one, a line without exactly
// two fields, a field that is not a plain decimal number, a depth that is negative, beyond
// MaxDepthCm or does not increase, a density that is not > 0 (the profile is interpolated in
// log density) or above the atom density, fewer than two data rows, or a line longer than
// 64 kB. Errors quote at most 40 characters of the file.
//
// Cost: time and memory grow linearly with the rows (about 50 bytes per row); a file of a
// million rows (20 MB) is read in about 0.2 s.
func ReadCSV(r io.Reader) (Measured, error) {
	var m Measured
	if r == nil {
		return Measured{}, fmt.Errorf("profile: ReadCSV: reader r is nil")
	}
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), maxLine)
	sc.Split(scanLines)
	line := 0
	scale := 0.0 // cm per depth unit; 0 until the header is read
	for sc.Scan() {
		line++
		raw := sc.Text()
		if line == 1 {
			if strings.HasPrefix(raw, "\xff\xfe") || strings.HasPrefix(raw, "\xfe\xff") {
				return Measured{}, fmt.Errorf("profile: line 1: the file is UTF-16 text; save it as UTF-8 CSV")
			}
			raw = strings.TrimPrefix(raw, "\ufeff") // byte-order mark
		}
		text := strings.TrimSpace(raw)
		if text == "" {
			continue
		}
		if strings.HasPrefix(text, "#") {
			m.Comments = append(m.Comments, strings.TrimPrefix(strings.TrimPrefix(text, "#"), " "))
			continue
		}
		fields := strings.Split(text, ",")
		for i := range fields {
			fields[i] = unquote(fields[i])
		}
		if scale == 0 {
			if len(fields) == 1 && strings.Contains(text, ";") {
				return Measured{}, fmt.Errorf("profile: line %d: columns separated by ';': the format separates them by ',' and writes numbers with a decimal point", line)
			}
			unit, s, err := parseHeader(line, fields)
			if err != nil {
				return Measured{}, err
			}
			m.Unit, scale = unit, s
			continue
		}
		if len(fields) != 2 {
			return Measured{}, fmt.Errorf("profile: line %d: %d fields, want 2 (depth, density)", line, len(fields))
		}
		x, err := parseNumber(line, "depth", fields[0])
		if err != nil {
			return Measured{}, err
		}
		n, err := parseNumber(line, "density", fields[1])
		if err != nil {
			return Measured{}, err
		}
		if x < 0 {
			return Measured{}, fmt.Errorf("profile: line %d: depth must be finite and >= 0, got %g %s", line, x, m.Unit)
		}
		xcm := x * scale
		if xcm > MaxDepthCm {
			return Measured{}, fmt.Errorf("profile: line %d: depth %g %s beyond %g cm, the deepest the package accepts (MaxDepthCm)", line, x, m.Unit, MaxDepthCm)
		}
		if k := len(m.Depth); k > 0 && !(xcm > m.Depth[k-1]) {
			return Measured{}, fmt.Errorf("profile: line %d: depth must increase (%g %s after %g %s)",
				line, x, m.Unit, m.Depth[k-1]/scale, m.Unit)
		}
		if n <= 0 {
			return Measured{}, fmt.Errorf("profile: line %d: density must be finite and > 0 cm^-3, got %g", line, n)
		}
		if n > silicon.AtomDensity {
			return Measured{}, fmt.Errorf("profile: line %d: density %g cm^-3 above the silicon atom density %g cm^-3 (is the unit right?)", line, n, silicon.AtomDensity)
		}
		m.Depth = append(m.Depth, xcm)
		m.Density = append(m.Density, n)
	}
	if err := sc.Err(); err != nil {
		if errors.Is(err, bufio.ErrTooLong) {
			return Measured{}, fmt.Errorf("profile: line %d: longer than %d kB", line+1, maxLine>>10)
		}
		return Measured{}, fmt.Errorf("profile: line %d: %w", line+1, err)
	}
	switch {
	case line == 0:
		return Measured{}, fmt.Errorf("profile: line 1: empty file, want a header such as \"depth (um), density (cm^-3)\"")
	case scale == 0:
		return Measured{}, fmt.Errorf("profile: line %d: end of file before the header line \"depth (unit), density (cm^-3)\"", line+1)
	case len(m.Depth) < 2:
		return Measured{}, fmt.Errorf("profile: line %d: end of file after %d data row(s), want at least 2", line+1, len(m.Depth))
	}
	return m, nil
}

// ReadCSVFile reads the file at path with ReadCSV; errors also name the file.
func ReadCSVFile(path string) (Measured, error) {
	f, err := os.Open(path)
	if err != nil {
		if len(path) > 200 { // keep the message short; the os error repeats the path
			return Measured{}, fmt.Errorf("profile: cannot open %s: %w", echo(path), errors.Unwrap(err))
		}
		return Measured{}, fmt.Errorf("profile: %w", err)
	}
	defer f.Close()
	m, err := ReadCSV(f)
	if err != nil {
		return Measured{}, fmt.Errorf("%s: %w", echo(path), err)
	}
	return m, nil
}

// parseHeader parses the header fields and returns the depth unit (in lower case, "um" for
// the micrometre) and its length in cm.
func parseHeader(line int, fields []string) (string, float64, error) {
	if len(fields) != 2 {
		return "", 0, fmt.Errorf("profile: line %d: header has %d columns, want 2: \"depth (unit), density (cm^-3)\"", line, len(fields))
	}
	var unit string
	for i, want := range [2]string{"depth", "density"} {
		name, u, ok := csvtext.SplitUnit(fields[i])
		if !strings.EqualFold(name, want) {
			return "", 0, fmt.Errorf("profile: line %d: header column %d is %s, want %q with its unit", line, i+1, echo(fields[i]), want)
		}
		if !ok || u == "" {
			return "", 0, fmt.Errorf("profile: line %d: header column %s has no unit, want e.g. \"%s (%s)\"",
				line, echo(fields[i]), want, [2]string{"um", "cm^-3"}[i])
		}
		lu := strings.ToLower(u)
		if i == 0 {
			if _, known := depthUnits[lu]; !known {
				return "", 0, fmt.Errorf("profile: line %d: unknown depth unit %s, want nm, um, mm or cm", line, echo(u))
			}
			unit = lu
		} else if !densityUnits[lu] {
			return "", 0, fmt.Errorf("profile: line %d: unknown density unit %s, want cm^-3", line, echo(u))
		}
	}
	if unit == "µm" || unit == "μm" {
		unit = "um"
	}
	return unit, depthUnits[unit], nil
}

// scanLines is bufio.ScanLines with the line ends of every spreadsheet program: \n, \r\n
// and \r alone (classic Mac OS).
func scanLines(data []byte, atEOF bool) (advance int, token []byte, err error) {
	i := bytes.IndexAny(data, "\r\n")
	switch {
	case i < 0:
		if atEOF && len(data) > 0 {
			return len(data), data, nil
		}
		return 0, nil, nil // need more data (or done)
	case data[i] == '\n':
		return i + 1, data[:i], nil
	case i+1 < len(data): // '\r', followed by the next byte
		if data[i+1] == '\n' {
			return i + 2, data[:i], nil
		}
		return i + 1, data[:i], nil
	case atEOF: // '\r' at the end of the file
		return i + 1, data[:i], nil
	}
	return 0, nil, nil // '\r' at the end of the buffer: is '\n' next?
}

// unquote trims f and removes one pair of enclosing double quotes, as spreadsheet programs
// write around text fields.
func unquote(f string) string {
	f = strings.TrimSpace(f)
	if len(f) >= 2 && f[0] == '"' && f[len(f)-1] == '"' {
		f = strings.TrimSpace(f[1 : len(f)-1])
	}
	return f
}

// echo returns f quoted for an error message, cut to maxEcho characters.
func echo(f string) string {
	f = strings.TrimSpace(f)
	if utf8.RuneCountInString(f) <= maxEcho {
		return strconv.Quote(f)
	}
	n := 0
	for i := range f {
		if n == maxEcho {
			return strconv.Quote(f[:i]) + "…"
		}
		n++
	}
	return strconv.Quote(f)
}

// parseNumber parses a field, a plain decimal number, as a finite float64.
func parseNumber(line int, what, f string) (float64, error) {
	s := strings.TrimSpace(f)
	if !csvtext.PlainDecimal(s) {
		return 0, fmt.Errorf("profile: line %d: %s %s is not a number (plain decimal, such as 2.5e20)", line, what, echo(s))
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil { // the syntax is checked: the value overflows
		return 0, fmt.Errorf("profile: line %d: %s %s is too large for a float64", line, what, echo(s))
	}
	return v, nil
}

// WriteCSV writes m in the package's CSV format (see ReadCSV), its comments first and the
// depths in m.Unit ("um" if empty) to 15 significant digits (so that the unit conversion
// leaves no rounding tail such as 0.30000000000000004), the densities with the shortest
// decimal representation that reads back exactly.
// It returns an error for an unknown unit, mismatched lengths or a write error; it does not
// otherwise validate the data (ReadCSV does).
func WriteCSV(w io.Writer, m Measured) error {
	if w == nil {
		return fmt.Errorf("profile: WriteCSV: writer w is nil")
	}
	unit := m.Unit
	if unit == "" {
		unit = "um"
	}
	scale, ok := depthUnits[unit]
	if !ok {
		return fmt.Errorf("profile: WriteCSV: unknown depth unit %s, want nm, um, mm or cm", echo(unit))
	}
	if len(m.Depth) != len(m.Density) {
		return fmt.Errorf("profile: WriteCSV: %d depths but %d densities", len(m.Depth), len(m.Density))
	}
	bw := bufio.NewWriter(w)
	for _, c := range m.Comments {
		if strings.ContainsAny(c, "\r\n") {
			return fmt.Errorf("profile: WriteCSV: comment %s spans lines", echo(c))
		}
		fmt.Fprintf(bw, "# %s\n", c)
	}
	fmt.Fprintf(bw, "depth (%s), density (cm^-3)\n", unit)
	for i := range m.Depth {
		fmt.Fprintf(bw, "%s, %s\n", strconv.FormatFloat(m.Depth[i]/scale, 'g', 15, 64), strconv.FormatFloat(m.Density[i], 'g', -1, 64))
	}
	return bw.Flush()
}
