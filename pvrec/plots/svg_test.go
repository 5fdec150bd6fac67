package plots

import (
	"encoding/xml"
	"io"
	"math"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/plot"
)

// svgText is a <text> element of a gonum/plot SVG: its baseline origin (the y attribute is
// negated: vgsvg flips the page with scale(1, -1)), size and face.
type svgText struct {
	s       string
	x, y    float64 // y up
	size    float64 // px = pt
	italic  bool
	family  string
	rotated bool
}

// svgTexts returns the texts of an SVG document in document order.
func svgTexts(t *testing.T, b []byte) []svgText {
	t.Helper()
	dec := xml.NewDecoder(strings.NewReader(string(b)))
	var out []svgText
	var stack []bool // whether each open <g> rotates
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		switch e := tok.(type) {
		case xml.StartElement:
			switch e.Name.Local {
			case "g":
				rot := false
				for _, a := range e.Attr {
					if a.Name.Local == "transform" && strings.Contains(a.Value, "rotate") {
						rot = true
					}
				}
				stack = append(stack, rot)
			case "text":
				var st svgText
				for _, a := range e.Attr {
					switch a.Name.Local {
					case "x":
						st.x, _ = strconv.ParseFloat(a.Value, 64)
					case "y":
						st.y, _ = strconv.ParseFloat(a.Value, 64)
						st.y = -st.y
					case "style":
						for _, kv := range strings.Split(a.Value, ";") {
							k, v, _ := strings.Cut(kv, ":")
							switch k {
							case "font-size":
								st.size, _ = strconv.ParseFloat(strings.TrimSuffix(v, "px"), 64)
							case "font-style":
								st.italic = v == "italic"
							case "font-family":
								st.family = v
							}
						}
					}
				}
				for _, r := range stack {
					st.rotated = st.rotated || r
				}
				var body string
				if err := dec.DecodeElement(&body, &e); err != nil {
					t.Fatal(err)
				}
				st.s = body
				out = append(out, st)
			}
		case xml.EndElement:
			if e.Name.Local == "g" && len(stack) > 0 {
				stack = stack[:len(stack)-1]
			}
		}
	}
	return out
}

// TestSVGStructure checks the typography in the SVG of a log–log figure at print scale:
// decade ticks as 10 with a raised exponent at 70 % (a minus sign, U+2212, for negative
// ones), plain units with a raised exponent, markup with an italic τ and a lowered roman
// "eff", all in Liberation Sans; tick labels in order and apart.
func TestSVGStructure(t *testing.T) {
	p, err := Lines(Axes{XLabel: "Δn (cm^-3)", YLabel: `$\tau_{\rm eff}$ (s)`, LogX: true, LogY: true},
		Series{Label: "curve", X: []float64{1e13, 1e17}, Y: []float64{1e-2, 1e-5}})
	if err != nil {
		t.Fatal(err)
	}
	b, err := Figure{Panels: []*plot.Plot{p}, Preset: Column}.Encode("svg")
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, b)
	for _, x := range texts {
		if x.family != "Liberation Sans" {
			t.Errorf("%q set in %q", x.s, x.family)
		}
	}
	raised := func(base, sup svgText, scale, rise float64) bool {
		return math.Abs(sup.size-scale*base.size) < 1e-3 && math.Abs(sup.y-base.y-rise*base.size) < 1e-2
	}
	// Decade ticks: "10" then its exponent, raised 0.38 em at 0.7 of the size, right after
	// it. Those of the x axis share a baseline, those of the y axis a left edge.
	type pair struct{ base, sup svgText }
	var pairs []pair
	for i := 0; i+1 < len(texts); i++ {
		if base, sup := texts[i], texts[i+1]; base.s == "10" && !base.rotated {
			if !raised(base, sup, scriptScale, supRise) || sup.x <= base.x || base.size != tickSize {
				t.Errorf("tick 10^%s: exponent %+v after %+v", sup.s, sup, base)
			}
			pairs = append(pairs, pair{base, sup})
		}
	}
	xdec, ydec := map[string]float64{}, map[string]float64{}
	for _, q := range pairs {
		sameY, sameX := 0, 0
		for _, r := range pairs {
			if r.base.y == q.base.y {
				sameY++
			}
			if r.base.x == q.base.x {
				sameX++
			}
		}
		switch {
		case sameY >= 3:
			xdec[q.sup.s] = q.base.x
		case sameX >= 3:
			ydec[q.sup.s] = q.base.y
		}
	}
	t.Logf("x decades %v, y decades %v", xdec, ydec)
	for n := 13; n <= 17; n++ {
		if _, ok := xdec[strconv.Itoa(n)]; !ok {
			t.Errorf("x axis lacks the decade tick 10^%d (has %v)", n, xdec)
		}
	}
	for n := -5; n <= -2; n++ {
		if _, ok := ydec["−"+strconv.Itoa(-n)]; !ok {
			t.Errorf("y axis lacks the decade tick 10^%d with a minus sign (has %v)", n, ydec)
		}
	}
	for n := 14; n <= 17; n++ {
		if xdec[strconv.Itoa(n)] <= xdec[strconv.Itoa(n-1)]+10 {
			t.Errorf("x ticks 10^%d and 10^%d not in order and apart", n-1, n)
		}
	}
	// The unit of the x label: "Δn (cm", "−3" raised at 70 %, ")".
	found := false
	for i := 0; i+2 < len(texts); i++ {
		if texts[i].s == "Δn (cm" {
			found = true
			if !raised(texts[i], texts[i+1], scriptScale, supRise) || texts[i+1].s != "−3" || texts[i+2].s != ")" ||
				texts[i+2].y != texts[i].y || texts[i].size != labelSize {
				t.Errorf("x label: %+v %+v %+v", texts[i], texts[i+1], texts[i+2])
			}
		}
	}
	if !found {
		t.Errorf("no x label Δn (cm^-3)")
	}
	// The markup y label, rotated: an italic τ, a roman "eff" lowered 0.16 em, " (s)".
	found = false
	for i := 0; i+2 < len(texts); i++ {
		if texts[i].s == "τ" {
			found = true
			tau, eff, s := texts[i], texts[i+1], texts[i+2]
			if !tau.italic || !tau.rotated || eff.s != "eff" || eff.italic || s.s != " (s)" ||
				!raised(tau, eff, scriptScale, -subDrop) {
				t.Errorf("y label: %+v %+v %+v", tau, eff, s)
			}
		}
	}
	if !found {
		t.Errorf("no y label τ_eff")
	}
}
