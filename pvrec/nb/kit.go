package nb

import (
	"encoding/base64"
	"fmt"
	"html"
	"math"
	"strings"

	"github.com/janpfeifer/gonb/gonbui"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/plot"
)

// The notebook kit: what every notebook needs once, so that no cell redefines a helper.

// Unit factors for display, applied at the edges (a figure label, a table column), never
// inside a formula: multiply a value in the field's unit by the factor to get the display
// unit. For example 1e15·J0 is J0 in fA/cm².
const (
	FemtoAmpPerCm2  = 1e15 // A/cm² → fA/cm²
	MilliAmpPerCm2  = 1e3  // A/cm² → mA/cm²
	MilliVolt       = 1e3  // V → mV
	Microsecond     = 1e6  // s → µs
	Millisecond     = 1e3  // s → ms
	Micrometre      = 1e4  // cm → µm
	Percent         = 1e2  // fraction → %
	MilliWattPerCm2 = 1e3  // W/cm² → mW/cm²
)

// Must returns v if err is nil; otherwise it displays err in the cell, readably (not as a Go
// stack), and stops the cell's program by panicking with err. It is the notebook's one way
// to stop on an error: m := nb.Must(silicon.DefaultModelSet().At(300)).
func Must[T any](v T, err error) T {
	if err != nil {
		stop(err)
	}
	return v
}

// Check stops the cell like Must if err is not nil; it serves calls that return only an
// error, such as nb.Show and nb.Table: nb.Check(nb.Show(p)).
func Check(err error) {
	if err != nil {
		stop(err)
	}
}

// ErrorHTML returns the HTML box in which Must and Check show an error.
func ErrorHTML(err error) string {
	return fmt.Sprintf(`<pre style="color:#a00;background:#fff4f4;border-left:3px solid #a00;padding:4px 8px;white-space:pre-wrap">%s</pre>`,
		html.EscapeString(err.Error()))
}

func stop(err error) {
	gonbui.DisplayHTML(ErrorHTML(err))
	gonbui.Sync()
	panic(err)
}

// LogSpan returns n points from lo to hi (both finite and > 0) evenly spaced in log, the
// usual injection or doping axis: nb.LogSpan(1e13, 1e17, 50). Bad arguments stop the cell
// (see Must).
func LogSpan(lo, hi float64, n int) []float64 {
	if !(lo > 0) || !(hi > 0) || math.IsInf(lo, 0) || math.IsInf(hi, 0) || n < 2 {
		stop(fmt.Errorf("nb: LogSpan(%g, %g, %d): want finite lo, hi > 0 and n >= 2", lo, hi, n))
	}
	return floats.LogSpan(make([]float64, n), lo, hi)
}

// LinSpan returns n points from lo to hi (finite) evenly spaced. Bad arguments stop the cell.
func LinSpan(lo, hi float64, n int) []float64 {
	if math.IsNaN(lo) || math.IsNaN(hi) || math.IsInf(lo, 0) || math.IsInf(hi, 0) || n < 2 {
		stop(fmt.Errorf("nb: LinSpan(%g, %g, %d): want finite lo, hi and n >= 2", lo, hi, n))
	}
	return floats.Span(make([]float64, n), lo, hi)
}

// Scaled returns a new slice of xs times factor, for a display unit (e.g. Scaled(j, MilliAmpPerCm2)).
func Scaled(xs []float64, factor float64) []float64 {
	return floats.ScaleTo(make([]float64, len(xs)), factor, xs)
}

// Column is one column of a table built from typed values: a name, a unit, a display scale
// and a format for numbers, or text cells. Exactly one of Values and Text is set.
type Column struct {
	Name   string    // header, e.g. "Δn"
	Unit   string    // display unit, e.g. "cm⁻³"; empty for a dimensionless or text column
	Scale  float64   // factor from the values' unit to the display unit (0 means 1), e.g. FemtoAmpPerCm2
	Format string    // fmt verb for one number, e.g. "%.3g"; empty means "%.4g"
	Values []float64 // numbers, in the field's unit
	Text   []string  // text cells, instead of Values
}

// header returns "Name (Unit)" or "Name".
func (c Column) header() string {
	if c.Unit == "" {
		return c.Name
	}
	return c.Name + " (" + c.Unit + ")"
}

// cells returns the formatted cells of c.
func (c Column) cells() ([]string, error) {
	if (c.Values == nil) == (c.Text == nil) {
		return nil, fmt.Errorf("nb: column %q: set exactly one of Values and Text", c.Name)
	}
	if c.Text != nil {
		return c.Text, nil
	}
	scale, format := c.Scale, c.Format
	if scale == 0 {
		scale = 1
	}
	if format == "" {
		format = "%.4g"
	}
	out := make([]string, len(c.Values))
	for i, v := range c.Values {
		out[i] = fmt.Sprintf(format, v*scale)
	}
	return out, nil
}

// grid returns the header and the rows of cols, or an error for columns of different lengths.
func grid(cols []Column) ([]string, [][]string, error) {
	if len(cols) == 0 {
		return nil, nil, fmt.Errorf("nb: a table needs at least one column")
	}
	header := make([]string, len(cols))
	var cells [][]string
	for j, c := range cols {
		header[j] = c.header()
		cs, err := c.cells()
		if err != nil {
			return nil, nil, err
		}
		if j > 0 && len(cs) != len(cells[0]) {
			return nil, nil, fmt.Errorf("nb: column %q has %d cells, column %q has %d", c.Name, len(cs), cols[0].Name, len(cells[0]))
		}
		cells = append(cells, cs)
	}
	rows := make([][]string, len(cells[0]))
	for i := range rows {
		rows[i] = make([]string, len(cols))
		for j := range cols {
			rows[i][j] = cells[j][i]
		}
	}
	return header, rows, nil
}

// ColumnsCSV returns the table of cols as CSV text: a header line "name (unit)" per column
// and one line per row, with the displayed (scaled, formatted) values; fields holding a comma,
// quote or line break are quoted.
func ColumnsCSV(cols ...Column) (string, error) {
	header, rows, err := grid(cols)
	if err != nil {
		return "", err
	}
	var b strings.Builder
	for _, r := range append([][]string{header}, rows...) {
		for j, f := range r {
			if j > 0 {
				b.WriteByte(',')
			}
			if strings.ContainsAny(f, ",\"\n\r") {
				f = `"` + strings.ReplaceAll(f, `"`, `""`) + `"`
			}
			b.WriteString(f)
		}
		b.WriteByte('\n')
	}
	return b.String(), nil
}

// ColumnsHTML returns the table of cols as HTML (see TableHTML) followed by a link that
// downloads the same table as CSV (ColumnsCSV), named after the caption.
func ColumnsHTML(caption string, cols ...Column) (string, error) {
	header, rows, err := grid(cols)
	if err != nil {
		return "", err
	}
	h, err := TableHTML(caption, header, rows)
	if err != nil {
		return "", err
	}
	csv, err := ColumnsCSV(cols...)
	if err != nil {
		return "", err
	}
	name := strings.Map(func(r rune) rune {
		if r == ' ' || r == '/' || r == '\\' {
			return '-'
		}
		return r
	}, strings.TrimSpace(caption))
	if name == "" {
		name = "table"
	}
	return h + fmt.Sprintf(`<p style="font-size:0.8em"><a download="%s.csv" href="data:text/csv;base64,%s">download as CSV</a></p>`,
		html.EscapeString(name), base64.StdEncoding.EncodeToString([]byte(csv))), nil
}

// Columns displays the table of ColumnsHTML in the notebook.
func Columns(caption string, cols ...Column) error {
	h, err := ColumnsHTML(caption, cols...)
	if err != nil {
		return err
	}
	gonbui.DisplayHTML(h)
	gonbui.Sync()
	return nil
}

// ShowFooted displays p like Show, followed by the provenance footer of models (see
// FooterHTML), so that a figure copied from the notebook says what produced it.
func ShowFooted(p *plot.Plot, models fmt.Stringer) error {
	if err := Show(p); err != nil {
		return err
	}
	Footer(models)
	return nil
}
