package catalogue

import (
	"os"
	"strings"
	"testing"
)

// TestCatalogueCurrent fails when docs/model-catalogue.md differs from what the source gives.
func TestCatalogueCurrent(t *testing.T) {
	want, err := Generate("../..")
	if err != nil {
		t.Fatal(err)
	}
	got, err := os.ReadFile("../../../docs/model-catalogue.md")
	if err != nil {
		t.Fatal(err)
	}
	if string(got) != want {
		t.Fatal("docs/model-catalogue.md is stale: run go generate ./pvrec/internal/catalogue")
	}
	// Every role has models, and the defaults are marked.
	for _, w := range []string{"`silicon.Passler2002` | `NewPassler2002` | yes", "`recomb.Richter2012`", "`surface.ExtendedSRH`", "`silicon.Schenk1998`"} {
		if !strings.Contains(want, w) {
			t.Errorf("catalogue lacks %q", w)
		}
	}
}
