package plots

import (
	"math"
	"strings"
	"sync"
	"unicode/utf8"

	stdfont "golang.org/x/image/font"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/font/liberation"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// gonum/plot's own LaTeX handler (text.Latex, on go-latex v0.2.0) cannot typeset the labels
// we need: it has no superscripts or subscripts (any ^ or _ panics with "unknown ast node
// *ast.Sup"), it rejects common characters (², –, &, ") and it always sets text in the serif
// face. typesetter is our own text.Handler for the markup of markup.go, on the Liberation
// fonts that gonum/plot embeds (no system fonts are read).

// fonts is the cache of the Liberation faces (sans, serif, mono), parsed on first use.
var fonts = sync.OnceValue(func() *font.Cache { return font.NewCache(liberation.Collection()) })

// faceOf returns the face of fnt at its size.
func faceOf(fnt font.Font) *font.Face {
	f := fonts().Lookup(fnt, fnt.Size)
	return &f
}

// drawMode is how a typesetter puts text on a canvas.
type drawMode uint8

const (
	// drawText draws text as text (vgsvg, vgimg): the canvas renders the glyphs.
	drawText drawMode = iota
	// drawOutlines fills the glyph outlines as paths (vgpdf, vgeps): vgpdf encodes text in
	// code page 1252, which lacks Δ, τ and most of what labels need, and vgeps embeds no
	// fonts, so both would print wrong glyphs.
	drawOutlines
	// drawLaTeX writes the label's LaTeX source (vgtex), so that LaTeX sets it in the
	// document's fonts. The layout is computed with the Liberation metrics.
	drawLaTeX
)

// Script sizes and shifts, relative to the size of the text they are attached to (common
// practice, close to TeX's: scripts at 70 %, script-scripts at 50 %).
const (
	scriptScale = 0.7
	supRise     = 0.38 // superscript baseline above the base's, em of the base
	subDrop     = 0.16 // subscript baseline below the base's, em of the base
	subDropBoth = 0.24 // the same with a superscript on the same base
)

// typesetter is the text.Handler of every text the house style draws.
type typesetter struct {
	mode drawMode
}

var _ text.Handler = typesetter{}

// Cache returns the cache of fonts used by the handler.
func (typesetter) Cache() *font.Cache { return fonts() }

// Extents returns the extents of fnt.
func (typesetter) Extents(fnt font.Font) font.Extents {
	return faceOf(fnt).Extents()
}

// Lines splits txt into lines.
func (typesetter) Lines(txt string) []string {
	return strings.Split(strings.TrimRight(txt, "\n"), "\n")
}

// placed is a run of characters in one font at its baseline origin, relative to the
// baseline origin of its line.
type placed struct {
	text string
	fnt  font.Font
	x, y vg.Length
}

// atomsOf parses one line of a label; a markup label that does not parse (which the
// builders refuse, but a caller may set a plot's texts directly) is drawn as written.
func atomsOf(line string) []atom {
	atoms, err := parseMarkup(toMarkup(line))
	if err != nil {
		return []atom{{text: line}}
	}
	return atoms
}

// layout places atoms set in base, scaled by scale, from x with its baseline at y. It
// returns the runs and the advance.
func layout(out []placed, atoms []atom, base font.Font, scale float64, x, y vg.Length) ([]placed, vg.Length) {
	size := base.Size * vg.Length(scale)
	for _, a := range atoms {
		switch a.kind {
		case atomText:
			f := base
			f.Size = size
			if a.italic {
				f.Style = stdfont.StyleItalic
			}
			if a.bold {
				f.Weight = stdfont.WeightBold
			}
			out = append(out, placed{text: a.text, fnt: f, x: x, y: y})
			x += faceOf(f).Width(a.text)
		case atomSpace:
			x += vg.Length(a.em) * size
		case atomScripts:
			s := scale * scriptScale
			if scale < 1 {
				s = math.Max(scale*scriptScale, 0.5)
			}
			end := x
			if a.sup != nil {
				var e vg.Length
				out, e = layout(out, a.sup, base, s, x, y+supRise*size)
				end = max(end, e)
			}
			if a.sub != nil {
				drop := subDrop
				if a.sup != nil {
					drop = subDropBoth
				}
				var e vg.Length
				out, e = layout(out, a.sub, base, s, x, y-vg.Length(drop)*size)
				end = max(end, e)
			}
			x = end
		}
	}
	return out, x
}

// lineBox lays out one line in fnt and returns its runs, width, height above the baseline
// and depth below it. Height and depth are at least those of the font, as for plain text.
func lineBox(line string, fnt font.Font) (runs []placed, w, h, d vg.Length) {
	runs, w = layout(nil, atomsOf(line), fnt, 1, 0, 0)
	e := faceOf(fnt).Extents()
	h, d = e.Ascent, e.Descent
	for _, r := range runs {
		re := faceOf(r.fnt).Extents()
		h = max(h, r.y+re.Ascent)
		d = max(d, re.Descent-r.y)
	}
	return runs, w, h, d
}

// Box returns the width, the height above the baseline and the depth below it of one line.
// A phantom line (see axislabels.go) has no width.
func (typesetter) Box(txt string, fnt font.Font) (width, height, depth vg.Length) {
	if s, ok := realOf(txt); ok {
		_, _, h, d := lineBox(s, fnt)
		return 0, h, d
	}
	_, w, h, d := lineBox(txt, fnt)
	return w, h, d
}

// Draw draws txt in sty at pt, aligned and rotated as text.Plain does, so that gonum/plot's
// layout holds.
func (t typesetter) Draw(c vg.Canvas, txt string, sty text.Style, pt vg.Point) {
	txt = strings.TrimRight(txt, "\n")
	if _, ok := realOf(txt); ok || txt == "" {
		return // a phantom draws nothing
	}
	c.SetColor(sty.Color)
	if sty.Rotation != 0 {
		c.Push()
		defer c.Pop()
		c.Rotate(sty.Rotation)
	}
	sin, cos := math.Sincos(sty.Rotation)
	pt.X, pt.Y = pt.Y*vg.Length(sin)+pt.X*vg.Length(cos), pt.Y*vg.Length(cos)-pt.X*vg.Length(sin)
	lines := t.Lines(txt)
	base := faceOf(sty.Font)
	pt.Y += sty.Height(txt)*vg.Length(sty.YAlign) - base.Extents().Ascent
	for i, line := range lines {
		runs, w, _, _ := lineBox(line, sty.Font)
		o := pt.Add(vg.Point{X: vg.Length(sty.XAlign) * w, Y: vg.Length(len(lines)-i) * sty.Font.Size})
		switch t.mode {
		case drawLaTeX:
			// LaTeX sets the text in the document's fonts, whose width differs from the
			// Liberation width w of the layout, so the text is anchored at the edge it is
			// aligned to: a zero-width \makebox holding it flush left or right of the anchor
			// (centred for centred text). vgtex centres what it writes on pt.X + Width/2.
			src, at := latexSource(toMarkup(line)), o.X+w/2
			switch sty.XAlign {
			case draw.XLeft:
				src, at = `\makebox[0pt][l]{`+src+`}`, o.X
			case draw.XRight:
				src, at = `\makebox[0pt][r]{`+src+`}`, o.X+w
			}
			c.FillString(*base, vg.Point{X: at - base.Width(src)/2, Y: o.Y}, src)
		case drawOutlines:
			for _, r := range runs {
				fillOutlines(c, *faceOf(r.fnt), o.Add(vg.Point{X: r.x, Y: r.y}), r.text)
			}
		default:
			for _, r := range runs {
				c.FillString(*faceOf(r.fnt), o.Add(vg.Point{X: r.x, Y: r.y}), r.text)
			}
		}
	}
}

// fillOutlines fills the outlines of the glyphs of s in face, from the baseline origin pt,
// advancing and kerning as font.Face.Width measures.
func fillOutlines(c vg.Canvas, face font.Face, pt vg.Point, s string) {
	f := face.Face
	if f == nil {
		return
	}
	var buf sfnt.Buffer
	upem := f.UnitsPerEm()
	ppem := fixed.Int26_6(upem) // coordinates come out in font units
	scale := face.Font.Size / vg.Length(upem)
	at := func(p fixed.Point26_6, x vg.Length) vg.Point {
		return vg.Point{X: x + vg.Length(p.X)*scale, Y: pt.Y - vg.Length(p.Y)*scale}
	}
	x := pt.X
	var prev sfnt.GlyphIndex
	hasPrev := false
	for _, r := range s {
		idx, err := f.GlyphIndex(&buf, r)
		if err != nil {
			continue
		}
		if hasPrev {
			if k, err := f.Kern(&buf, prev, idx, ppem, stdfont.HintingNone); err == nil {
				x += vg.Length(k) * scale
			}
		}
		if segs, err := f.LoadGlyph(&buf, idx, ppem, nil); err == nil && len(segs) > 0 {
			var p vg.Path
			var cur vg.Point
			for _, sg := range segs {
				switch sg.Op {
				case sfnt.SegmentOpMoveTo:
					if len(p) > 0 {
						p.Close()
					}
					cur = at(sg.Args[0], x)
					p.Move(cur)
				case sfnt.SegmentOpLineTo:
					cur = at(sg.Args[0], x)
					p.Line(cur)
				case sfnt.SegmentOpQuadTo:
					// As a cubic, since vgeps draws a quadratic's control point twice.
					q, end := at(sg.Args[0], x), at(sg.Args[1], x)
					p.CubeTo(lerp(cur, q, 2.0/3), lerp(end, q, 2.0/3), end)
					cur = end
				case sfnt.SegmentOpCubeTo:
					cur = at(sg.Args[2], x)
					p.CubeTo(at(sg.Args[0], x), at(sg.Args[1], x), cur)
				}
			}
			p.Close()
			c.Fill(p)
		}
		if adv, err := f.GlyphAdvance(&buf, idx, ppem, stdfont.HintingNone); err == nil {
			x += vg.Length(adv) * scale
		}
		prev, hasPrev = idx, true
	}
}

// lerp returns a + t (b − a).
func lerp(a, b vg.Point, t vg.Length) vg.Point {
	return vg.Point{X: a.X + t*(b.X-a.X), Y: a.Y + t*(b.Y-a.Y)}
}

// latexText and latexMath are the LaTeX forms of the characters pdfLaTeX does not take as
// they are, in text and in math.
var (
	latexText = map[rune]string{
		'µ': `\textmu{}`, 'Å': `\AA{}`, '°': `\textdegree{}`, '·': `$\cdot$`, '×': `$\times$`,
		'±': `$\pm$`, '−': `$-$`, '–': `--`, '—': `---`, '≈': `$\approx$`, '≤': `$\leq$`,
		'≥': `$\geq$`, '≠': `$\neq$`, '≡': `$\equiv$`, '∞': `$\infty$`, '∂': `$\partial$`,
		'′': `$'$`, '→': `$\to$`, '←': `$\leftarrow$`, '↔': `$\leftrightarrow$`, '…': `\ldots{}`,
		'•': `\textbullet{}`, 'ℓ': `$\ell$`, '↑': `$\uparrow$`, '↓': `$\downarrow$`,
	}
	latexMath = map[rune]string{
		'µ': `\mu `, 'Å': `\mathrm{\AA}`, '°': `^\circ `, '·': `\cdot `, '×': `\times `,
		'±': `\pm `, '−': `-`, '–': `-`, '≈': `\approx `, '≤': `\leq `, '≥': `\geq `,
		'≠': `\neq `, '≡': `\equiv `, '∞': `\infty `, '∂': `\partial `, '′': `'`, '→': `\to `,
		'←': `\leftarrow `, '↔': `\leftrightarrow `, '…': `\ldots `, '•': `\bullet `,
		'ℓ': `\ell `, '↑': `\uparrow `, '↓': `\downarrow `,
	}
)

// latexSource returns markup as LaTeX source for pdfLaTeX: characters it lacks become
// commands (Greek letters, µ, ×, –, script digits ...); our own commands become standard
// LaTeX (\textmu and \textdegree are in the LaTeX kernel since 2020).
func latexSource(markup string) string {
	var b texBuilder
	math := false
	for i := 0; i < len(markup); {
		r, n := utf8.DecodeRuneInString(markup[i:])
		switch {
		case r == '\\' && i+1 < len(markup):
			// Copy a command or control symbol as it is.
			j := i + 1
			for j < len(markup) && (markup[j] >= 'a' && markup[j] <= 'z' || markup[j] >= 'A' && markup[j] <= 'Z') {
				j++
			}
			if j == i+1 {
				_, m := utf8.DecodeRuneInString(markup[j:])
				j += m
			}
			b.text(markup[i:j])
			i = j
			continue
		case r == '$':
			if math = !math; math {
				b.open()
			} else {
				b.close()
			}
		case superscripts[r] != 0 || subscripts[r] != 0:
			op, d := "^", superscripts[r]
			if d == 0 {
				op, d = "_", subscripts[r]
			}
			if math {
				b.text(op + "{" + string(d) + "}")
			} else {
				b.math(op + "{" + string(d) + "}")
			}
		case greekName[r] != "":
			if math {
				b.text(`\` + greekName[r] + " ")
			} else {
				b.math(`\` + greekName[r])
			}
		case math && latexMath[r] != "":
			b.text(latexMath[r])
		case !math && latexText[r] != "":
			if t := latexText[r]; strings.HasPrefix(t, "$") {
				b.math(t[1 : len(t)-1])
			} else {
				b.text(t)
			}
		default:
			b.text(markup[i : i+n])
		}
		i += n
	}
	return b.String()
}
