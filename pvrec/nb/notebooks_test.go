package nb

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestNotebooksCommittedClean checks the repository's notebook conventions (DEVELOPERS.md):
// outputs stripped, the GoNB kernel named, and the first cell making the local module
// importable.
func TestNotebooksCommittedClean(t *testing.T) {
	paths, err := filepath.Glob("../../notebooks/*.ipynb")
	if err != nil {
		t.Fatal(err)
	}
	if len(paths) == 0 {
		t.Fatal("no notebooks found in notebooks/")
	}
	for _, path := range paths {
		raw, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		var doc struct {
			Metadata struct {
				Kernelspec struct {
					Name string `json:"name"`
				} `json:"kernelspec"`
			} `json:"metadata"`
			Cells []struct {
				CellType       string            `json:"cell_type"`
				Source         json.RawMessage   `json:"source"`
				Outputs        []json.RawMessage `json:"outputs"`
				ExecutionCount *int              `json:"execution_count"`
			} `json:"cells"`
		}
		if err := json.Unmarshal(raw, &doc); err != nil {
			t.Errorf("%s: not a notebook: %v", path, err)
			continue
		}
		if doc.Metadata.Kernelspec.Name != "gonb" {
			t.Errorf("%s: kernel %q, want gonb", path, doc.Metadata.Kernelspec.Name)
		}
		first := true
		for i, c := range doc.Cells {
			if len(c.Outputs) > 0 || c.ExecutionCount != nil {
				t.Errorf("%s: cell %d has outputs; run `make strip` before committing", path, i)
			}
			if c.CellType != "code" || !first {
				continue
			}
			first = false
			src := sourceText(c.Source)
			if !strings.Contains(src, "go work use . ${GONB_DIR}/..") || !strings.Contains(src, "%goworkfix") {
				t.Errorf("%s: first code cell must set up go.work and run %%goworkfix, got:\n%s", path, src)
			}
		}
	}
}

// sourceText joins a notebook cell source, stored either as a string or a list of lines.
func sourceText(raw json.RawMessage) string {
	var s string
	if json.Unmarshal(raw, &s) == nil {
		return s
	}
	var lines []string
	_ = json.Unmarshal(raw, &lines)
	return strings.Join(lines, "")
}
