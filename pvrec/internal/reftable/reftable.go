// Package reftable reads the committed reference tables in testdata/reference for the tests of
// pvrec's packages. A table is a CSV file written by its generator script beside it: one header
// row of column names, then rows of values; blank lines and lines starting with '#' are skipped.
package reftable

import (
	"encoding/csv"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// Table is a reference table: its file name, column names and rows of fields.
type Table struct {
	Path   string     // file the table was read from
	Header []string   // column names
	Rows   [][]string // data rows, fields as written
}

// Load reads testdata/reference/NAME.csv of the repository that contains the working
// directory (found by walking up to go.mod), failing tb on any error or ragged row.
func Load(tb testing.TB, name string) Table {
	tb.Helper()
	dir, err := os.Getwd()
	if err != nil {
		tb.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			break
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			tb.Fatalf("reftable: no go.mod above the working directory")
		}
		dir = parent
	}
	path := filepath.Join(dir, "testdata", "reference", name+".csv")
	raw, err := os.ReadFile(path)
	if err != nil {
		tb.Fatal(err)
	}
	var lines []string
	for _, l := range strings.Split(string(raw), "\n") {
		if s := strings.TrimSpace(l); s != "" && !strings.HasPrefix(s, "#") {
			lines = append(lines, s)
		}
	}
	rows, err := csv.NewReader(strings.NewReader(strings.Join(lines, "\n"))).ReadAll()
	if err != nil {
		tb.Fatalf("reftable: %s: %v", path, err)
	}
	if len(rows) < 2 {
		tb.Fatalf("reftable: %s: want a header and at least one row, got %d lines", path, len(rows))
	}
	return Table{Path: path, Header: rows[0], Rows: rows[1:]}
}

// Col returns the index of the named column, failing tb if there is none.
func (t Table) Col(tb testing.TB, name string) int {
	tb.Helper()
	for i, h := range t.Header {
		if strings.TrimSpace(h) == name {
			return i
		}
	}
	tb.Fatalf("reftable: %s has no column %q (columns %v)", t.Path, name, t.Header)
	return -1
}

// Float parses a field of a table as a float64, failing tb if it is not a number.
func Float(tb testing.TB, s string) float64 {
	tb.Helper()
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		tb.Fatalf("reftable: %v", err)
	}
	return v
}
