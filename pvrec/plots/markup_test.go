package plots

import (
	"image/color"
	"math"
	"strings"
	"testing"

	stdfont "golang.org/x/image/font"
	"golang.org/x/image/font/sfnt"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/recorder"
)

func sans(size vg.Length) font.Font {
	return font.Font{Typeface: "Liberation", Variant: "Sans", Size: size}
}

// TestToMarkup checks how plain labels become markup (our convention, written to give what
// a LaTeX user would type): carets before signed numbers or braces and Unicode script digits
// become scripts, Greek becomes math, specials are escaped, markup is left alone.
func TestToMarkup(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"Δn (cm^-3)", `$\Delta$n (cm$^{-3}$)`},
		{"J0 (fA/cm^2)", `J0 (fA/cm$^{2}$)`},
		{"μ (cm²/Vs)", `$\mu$ (cm$^{2}$/Vs)`},
		{"Dit (cm⁻² eV⁻¹)", `Dit (cm$^{-2}$ eV$^{-1}$)`},
		{"m^{1/2}", `m$^{\textrm{1/2}}$`},
		{"x^0.92", `x$^{0.92}$`},
		{"cm^−3", `cm$^{-3}$`},
		{"τ_{eff} (s)", `$\tau_{\textrm{eff}}$ (s)`}, // adjacent math pieces join: no $$
		{"sample_2", `sample\_2`},                    // a bare underscore stays
		{"x^y", `x\^{}y`},                            // a caret before a letter stays
		{"100 % & #1", `100 \% \& \#1`},
		{`a\b {c} ~`, `a\textbackslash{}b \{c\} \~{}`},
		{"cost $5", `cost \$5`}, // one $ is not markup
		{"depth (µm)", "depth (µm)"},
		{`$\tau_{\rm eff}$ (s)`, `$\tau_{\rm eff}$ (s)`},
		{"", ""},
	} {
		if got := toMarkup(c.in); got != c.want {
			t.Errorf("toMarkup(%q) = %q, want %q", c.in, got, c.want)
		}
		if _, err := parseMarkup(toMarkup(c.in)); err != nil {
			t.Errorf("toMarkup(%q) does not parse: %v", c.in, err)
		}
	}
	if got := Unit("cm^-3"); got != `cm$^{-3}$` {
		t.Errorf("Unit(cm^-3) = %q", got)
	}
	if got := Unit("A/cm^2 $"); got != `A/cm$^{2}$ \$` {
		t.Errorf("Unit(A/cm^2 $) = %q", got)
	}
}

// TestParseMarkup checks the structure of parsed labels and the errors for bad markup.
func TestParseMarkup(t *testing.T) {
	a, err := parseMarkup(`$\tau_{\rm eff}^{2}$ (s)`)
	if err != nil {
		t.Fatal(err)
	}
	if len(a) != 3 || a[0].text != "τ" || !a[0].italic || a[1].kind != atomScripts ||
		len(a[1].sub) != 1 || a[1].sub[0].text != "eff" || a[1].sub[0].italic || len(a[1].sup) != 1 || a[2].text != " (s)" {
		t.Errorf("parse of τ_eff^2 (s): %+v", a)
	}
	// Operators get spaces in math, a leading minus none, and the minus is U+2212.
	a, err = parseMarkup(`$-x + y = 1$`)
	if err != nil {
		t.Fatal(err)
	}
	var kinds []string
	for _, x := range a {
		if x.kind == atomSpace {
			kinds = append(kinds, "_")
		} else {
			kinds = append(kinds, x.text)
		}
	}
	if got := strings.Join(kinds, " "); got != "− x _ + _ y _ = _ 1" {
		t.Errorf("spacing of -x + y = 1: %q", got)
	}
	for _, c := range []struct{ in, want string }{
		{`$\foo$`, `unknown command \foo`},
		{`$x^2^3$`, "double superscript"},
		{`$x_a_b$`, "double subscript"},
		{`$x`, "unclosed $"},
		{`${x$}`, "overlap"},
		{`$x}$`, "unbalanced }"},
		{`${x$`, "unclosed {"},
		{`$x^$`, "missing argument"},
		{`a^2 $b$`, "^ outside math"},
		{`$\Delta$ and \tau $x$`, `\tau outside math`},
		{`$50%$`, "unescaped %"},
		{`$x$ \`, `lone \`},
		{"$\xff$", "invalid UTF-8"},
	} {
		_, err := parseMarkup(c.in)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("parseMarkup(%q): error %v, want %q", c.in, err, c.want)
		}
	}
	if err := checkLabel("x label", `$\tua$`); err == nil || !strings.HasPrefix(err.Error(), "plots: x label: ") || !strings.Contains(err.Error(), `unknown command \tua`) {
		t.Errorf("checkLabel: %v", err)
	}
}

// TestLatexSource checks the LaTeX handed to vgtex: characters pdfLaTeX lacks become
// commands, adjacent math joins (never $$), our commands pass through.
func TestLatexSource(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{toMarkup("Δn (cm^-3)"), `$\Delta$n (cm$^{-3}$)`},
		{toMarkup("Rs = 0.5 Ω·cm²"), `Rs = 0.5 $\Omega\cdot$cm$^{2}$`},
		{toMarkup("depth (µm) – T (°C)"), `depth (\textmu{}m) -- T (\textdegree{}C)`},
		{`$τ × 2$`, `$\tau  \times  2$`},
		{`$\tau_{\rm eff}$`, `$\tau_{\rm eff}$`},
		{`$10^{19}$`, `$10^{19}$`},
	} {
		got := latexSource(c.in)
		if got != c.want {
			t.Errorf("latexSource(%q) = %q, want %q", c.in, got, c.want)
		}
		if strings.Contains(got, "$$") {
			t.Errorf("latexSource(%q) = %q has $$", c.in, got)
		}
	}
}

// TestGlyphs checks that every character the markup can produce is in every Liberation Sans
// and Serif face that may set it, so that nothing prints as a missing-glyph box.
func TestGlyphs(t *testing.T) {
	var chars []rune
	for _, m := range []map[string]rune{greek, mathSymbols, textSymbols} {
		for _, r := range m {
			chars = append(chars, r)
		}
	}
	chars = append(chars, []rune("−′"+escapes)...)
	var buf sfnt.Buffer
	for _, v := range []font.Variant{"Sans", "Serif"} {
		for _, it := range []stdfont.Style{stdfont.StyleNormal, stdfont.StyleItalic} {
			for _, w := range []stdfont.Weight{stdfont.WeightNormal, stdfont.WeightBold} {
				f := font.Font{Typeface: "Liberation", Variant: v, Style: it, Weight: w, Size: 10}
				face := faceOf(f)
				for _, r := range chars {
					if i, err := face.Face.GlyphIndex(&buf, r); err != nil || i == 0 {
						t.Errorf("%s lacks %q (U+%04X)", face.Name(), r, r)
					}
				}
			}
		}
	}
}

// TestTypesetBox checks the metrics gonum/plot lays out with: plain text measures as
// text.Plain measures it (so gonum/plot's layout holds), a superscript raises the height
// and narrows nothing, a phantom has no width, and a broken markup label is drawn as it is.
func TestTypesetBox(t *testing.T) {
	f := sans(10)
	plain := text.Plain{Fonts: fonts()}
	for _, s := range []string{"front: emitter", "J0 budget", "Δn"} {
		w0, h0, d0 := plain.Box(s, f)
		w, h, d := typesetter{}.Box(s, f)
		if w != w0 || h != h0 || d != d0 {
			t.Errorf("Box(%q) = %v %v %v, text.Plain %v %v %v", s, w, h, d, w0, h0, d0)
		}
	}
	_, h0, _ := typesetter{}.Box("10", f)
	w, h, _ := typesetter{}.Box("$10^{19}$", f)
	w10, _, _ := typesetter{}.Box("10", f)
	w19, _, _ := typesetter{}.Box("19", sans(10*scriptScale))
	if h <= h0 || w < w10+w19-1e-9 || w > w10+w19+1e-9 {
		t.Errorf("Box(10^19): w=%v (want %v), h=%v (want > %v)", w, w10+w19, h, h0)
	}
	if w, h, _ := (typesetter{}).Box(phantomOf("$10^{19}$"), f); w != 0 || h <= h0 {
		t.Errorf("phantom box: w=%v h=%v", w, h)
	}
	if a := atomsOf(`$\foo$`); len(a) != 1 || a[0].text != `$\foo$` {
		t.Errorf("broken markup: %+v", a)
	}
}

// TestDrawModes checks what each mode puts on a canvas for "Δn (cm^-3)": text runs in the
// right faces and sizes, filled glyph outlines (one per visible glyph), or one LaTeX string.
func TestDrawModes(t *testing.T) {
	sty := text.Style{Color: color.Black, Font: sans(10), Handler: typesetter{}}
	draw := func(m drawMode) *recorder.Canvas {
		var c recorder.Canvas
		typesetter{mode: m}.Draw(&c, "Δn (cm^-3)", sty, vg.Point{})
		return &c
	}
	var texts []string
	for _, a := range draw(drawText).Actions {
		if fs, ok := a.(*recorder.FillString); ok {
			texts = append(texts, fs.String)
		}
	}
	if strings.Join(texts, "|") != "Δn (cm|−3|)" {
		t.Errorf("text runs %q", texts)
	}
	fills := 0
	for _, a := range draw(drawOutlines).Actions {
		switch a.(type) {
		case *recorder.Fill:
			fills++
		case *recorder.FillString:
			t.Errorf("outline mode drew text")
		}
	}
	if want := len([]rune("Δn(cm−3)")); fills != want {
		t.Errorf("outline mode filled %d glyphs, want %d", fills, want)
	}
	// LaTeX: one string, anchored at the edge the text is aligned to (vgtex centres what it
	// writes on X + Width/2), flush left or right of it in a zero-width box.
	w, _, _ := typesetter{}.Box("Δn (cm^-3)", sty.Font)
	for _, c := range []struct {
		align  text.XAlignment
		src    string
		anchor vg.Length
	}{
		{text.XLeft, `\makebox[0pt][l]{$\Delta$n (cm$^{-3}$)}`, 0},
		{text.XCenter, `$\Delta$n (cm$^{-3}$)`, 0},
		{text.XRight, `\makebox[0pt][r]{$\Delta$n (cm$^{-3}$)}`, 0},
	} {
		var rc recorder.Canvas
		s := sty
		s.XAlign = c.align
		typesetter{mode: drawLaTeX}.Draw(&rc, "Δn (cm^-3)", s, vg.Point{})
		var tex []*recorder.FillString
		for _, a := range rc.Actions {
			if fs, ok := a.(*recorder.FillString); ok {
				tex = append(tex, fs)
			}
		}
		if len(tex) != 1 || tex[0].String != c.src {
			t.Errorf("LaTeX mode, align %v: drew %+v, want %q", c.align, tex, c.src)
			continue
		}
		f := faceOf(sty.Font)
		if at := tex[0].Point.X + f.Width(c.src)/2; math.Abs(float64(at-c.anchor)) > 1e-9 {
			t.Errorf("LaTeX mode, align %v: anchored at %v, want %v (box width %v)", c.align, at, c.anchor, w)
		}
	}
	if n := len(draw(drawText).Actions); n == 0 {
		t.Errorf("nothing drawn")
	}
	var c recorder.Canvas
	typesetter{}.Draw(&c, phantomOf("x"), sty, vg.Point{})
	for _, a := range c.Actions {
		if _, ok := a.(*recorder.FillString); ok {
			t.Errorf("a phantom drew text")
		}
	}
}
