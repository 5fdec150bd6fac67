package profile

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

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

// depthUnits maps the accepted depth units to their length in cm.
var depthUnits = map[string]float64{
	"nm": 1e-7, "um": 1e-4, "µm": 1e-4, "μm": 1e-4, "mm": 0.1, "cm": 1,
}

// maxLine is the longest line ReadCSV accepts, in bytes.
const maxLine = 1 << 16

// ReadCSV reads a measured profile in the package's CSV format (docs/profile-csv.md):
//
//	# comment lines start with '#'; blank lines are ignored
//	depth (um), density (cm^-3)
//	0.000, 2.1e20
//	0.010, 1.9e20
//
// The first line that is neither blank nor a comment is the header: two comma-separated
// columns named depth and density (case-insensitive), each followed by its unit in
// parentheses; the depth unit is one of nm, um (or µm), mm, cm and the density unit cm^-3 (or
// cm-3). Each following line holds a depth and a density. Depths are converted to cm.
//
// It returns an error that names the line (1-based) for: an empty file or one without data
// rows, a header without a unit or with an unknown one, a line without exactly two fields, a
// field that is not a number, a depth that is negative, NaN or infinite or does not increase,
// a density that is not finite and > 0 (the profile is interpolated in log density), fewer
// than two data rows, or a line longer than 64 kB.
func ReadCSV(r io.Reader) (Measured, error) {
	var m Measured
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), maxLine)
	line := 0
	scale := 0.0 // cm per depth unit; 0 until the header is read
	for sc.Scan() {
		line++
		text := strings.TrimSpace(strings.TrimSuffix(sc.Text(), "\r"))
		if text == "" {
			continue
		}
		if strings.HasPrefix(text, "#") {
			m.Comments = append(m.Comments, strings.TrimPrefix(strings.TrimPrefix(text, "#"), " "))
			continue
		}
		fields := strings.Split(text, ",")
		if scale == 0 {
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
		if math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
			return Measured{}, fmt.Errorf("profile: line %d: depth must be finite and >= 0, got %g %s", line, x, m.Unit)
		}
		xcm := x * scale
		if k := len(m.Depth); k > 0 && !(xcm > m.Depth[k-1]) {
			return Measured{}, fmt.Errorf("profile: line %d: depth must increase (%g %s after %g %s)",
				line, x, m.Unit, m.Depth[k-1]/scale, m.Unit)
		}
		if math.IsNaN(n) || math.IsInf(n, 0) || n <= 0 {
			return Measured{}, fmt.Errorf("profile: line %d: density must be finite and > 0 cm^-3, got %g", line, n)
		}
		m.Depth = append(m.Depth, xcm)
		m.Density = append(m.Density, n)
	}
	if err := sc.Err(); err != nil {
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
		return Measured{}, fmt.Errorf("profile: %w", err)
	}
	defer f.Close()
	m, err := ReadCSV(f)
	if err != nil {
		return Measured{}, fmt.Errorf("%s: %w", path, err)
	}
	return m, nil
}

// parseHeader parses the header fields and returns the depth unit and its length in cm.
func parseHeader(line int, fields []string) (string, float64, error) {
	if len(fields) != 2 {
		return "", 0, fmt.Errorf("profile: line %d: header has %d columns, want 2: \"depth (unit), density (cm^-3)\"", line, len(fields))
	}
	var unit string
	for i, want := range [2]string{"depth", "density"} {
		name, u, ok := splitUnit(fields[i])
		if !strings.EqualFold(name, want) {
			return "", 0, fmt.Errorf("profile: line %d: header column %d is %q, want %q with its unit", line, i+1, strings.TrimSpace(fields[i]), want)
		}
		if !ok || u == "" {
			return "", 0, fmt.Errorf("profile: line %d: header column %q has no unit, want e.g. \"%s (%s)\"",
				line, strings.TrimSpace(fields[i]), want, map[int]string{0: "um", 1: "cm^-3"}[i])
		}
		if i == 0 {
			if _, known := depthUnits[u]; !known {
				return "", 0, fmt.Errorf("profile: line %d: unknown depth unit %q, want nm, um, mm or cm", line, u)
			}
			unit = u
		} else if u != "cm^-3" && u != "cm-3" {
			return "", 0, fmt.Errorf("profile: line %d: unknown density unit %q, want cm^-3", line, u)
		}
	}
	if unit == "µm" || unit == "μm" {
		unit = "um"
	}
	return unit, depthUnits[unit], nil
}

// splitUnit splits "name (unit)" into name and unit; ok is false without parentheses.
func splitUnit(f string) (name, unit string, ok bool) {
	f = strings.TrimSpace(f)
	i := strings.IndexByte(f, '(')
	if i < 0 || !strings.HasSuffix(f, ")") {
		return f, "", false
	}
	return strings.TrimSpace(f[:i]), strings.TrimSpace(f[i+1 : len(f)-1]), true
}

// parseNumber parses a field as a float64.
func parseNumber(line int, what, f string) (float64, error) {
	s := strings.TrimSpace(f)
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return 0, fmt.Errorf("profile: line %d: %s %q is not a number", line, what, s)
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
	unit := m.Unit
	if unit == "" {
		unit = "um"
	}
	scale, ok := depthUnits[unit]
	if !ok {
		return fmt.Errorf("profile: WriteCSV: unknown depth unit %q, want nm, um, mm or cm", unit)
	}
	if len(m.Depth) != len(m.Density) {
		return fmt.Errorf("profile: WriteCSV: %d depths but %d densities", len(m.Depth), len(m.Density))
	}
	bw := bufio.NewWriter(w)
	for _, c := range m.Comments {
		if strings.Contains(c, "\n") {
			return fmt.Errorf("profile: WriteCSV: comment %q spans lines", c)
		}
		fmt.Fprintf(bw, "# %s\n", c)
	}
	fmt.Fprintf(bw, "depth (%s), density (cm^-3)\n", unit)
	for i := range m.Depth {
		fmt.Fprintf(bw, "%s, %s\n", strconv.FormatFloat(m.Depth[i]/scale, 'g', 15, 64), strconv.FormatFloat(m.Density[i], 'g', -1, 64))
	}
	return bw.Flush()
}
