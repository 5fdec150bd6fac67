package nb

import (
	"strings"
	"testing"
)

type fakeModels struct{}

func (fakeModels) String() string { return "Si 300.00 K: <test>" }

func TestTableHTML(t *testing.T) {
	h, err := TableHTML("ni & BGN", []string{"N (cm⁻³)", "ni,eff (cm⁻³)"}, [][]string{{"1e19", "<2e10>"}})
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"ni &amp; BGN", "<th", "N (cm⁻³)", "&lt;2e10&gt;"} {
		if !strings.Contains(h, want) {
			t.Errorf("table HTML lacks %q:\n%s", want, h)
		}
	}
	if _, err := TableHTML("bad", []string{"a", "b"}, [][]string{{"1"}}); err == nil || !strings.Contains(err.Error(), "row 0 has 1 cells") {
		t.Errorf("ragged row: error %v", err)
	}
	if _, err := TableHTML("none", nil, nil); err == nil {
		t.Errorf("empty header accepted")
	}
}

func TestFooterHTML(t *testing.T) {
	f := FooterHTML(fakeModels{})
	if !strings.Contains(f, "pvrec ") || !strings.Contains(f, "Si 300.00 K: &lt;test&gt;") {
		t.Errorf("footer %q lacks version or escaped model set", f)
	}
	if !strings.Contains(FooterHTML(nil), "model set not given") {
		t.Errorf("nil model set not reported")
	}
}

// nilModels has a String method with a value receiver: calling it through a nil pointer
// panics.
type nilModels struct{ name string }

func (m nilModels) String() string { return m.name }

// TestFooterHTMLNilPointer: a nil pointer model set gives a footer, not a panic (it panicked
// through models.String()).
func TestFooterHTMLNilPointer(t *testing.T) {
	var p *nilModels
	f := FooterHTML(p)
	if !strings.Contains(f, "pvrec ") || !strings.Contains(f, "nil") {
		t.Errorf("footer %q", f)
	}
	if _, err := TableHTML("t", []string{"a"}, [][]string{{"1"}, nil}); err == nil {
		t.Errorf("nil row accepted")
	}
}

func TestFigureHTML(t *testing.T) {
	svg := []byte(`<?xml version="1.0"?><svg width="453.54pt" height="283.46pt" viewBox="0 0 453.54 283.46" xmlns="http://www.w3.org/2000/svg"><g/></svg>`)
	h := FigureHTML(svg)
	for _, w := range []string{`width="100%"`, `viewBox="0 0 453.54 283.46"`, `max-width:900px`} {
		if !strings.Contains(h, w) {
			t.Errorf("figure HTML lacks %q: %s", w, h)
		}
	}
	if strings.Contains(h, "height=") {
		t.Errorf("figure HTML keeps a fixed height: %s", h)
	}
	if got := string(scaleSVG([]byte("<p>no svg</p>"))); got != "<p>no svg</p>" {
		t.Errorf("non-SVG changed: %q", got)
	}
}
