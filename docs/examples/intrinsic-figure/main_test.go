package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestRun regenerates the figure into a temporary folder, as the guide tells a user to.
func TestRun(t *testing.T) {
	path := filepath.Join(t.TempDir(), "intrinsic.pdf")
	caption, err := run(path)
	if err != nil {
		t.Fatal(err)
	}
	b, err := os.ReadFile(path)
	if err != nil || len(b) < 1000 || !strings.HasPrefix(string(b), "%PDF") {
		t.Fatalf("no PDF written (%d bytes, %v)", len(b), err)
	}
	if !strings.Contains(caption, "Richter2012") || !strings.Contains(caption, "Si 300.00 K") {
		t.Errorf("caption %q lacks the provenance", caption)
	}
}
