package plots

import (
	"fmt"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Labels come in two forms (see the package doc). A label with a pair of unescaped $ signs
// is markup, a small subset of LaTeX. Any other label is plain text, drawn as written, except
// that a caret followed by a signed number or a braced group, "_{...}", Unicode script digits
// and Greek letters are typeset as LaTeX would typeset them. toMarkup turns a plain label
// into the markup it stands for, so that one parser lays out every label and the TeX export
// hands LaTeX the same source.

// An atom is one element of a parsed label: a run of characters in one face, a space, or
// the scripts attached to the preceding atom.
type atom struct {
	text   string  // characters in one face (kind atomText)
	italic bool    // italic face
	bold   bool    // bold face
	em     float64 // width of a space in em of the current size (kind atomSpace)
	sup    []atom  // superscript (kind atomScripts)
	sub    []atom  // subscript (kind atomScripts)
	kind   atomKind
}

type atomKind uint8

const (
	atomText atomKind = iota
	atomSpace
	atomScripts
)

// greek maps the Greek-letter macros to their characters. Lower-case letters are italic in
// math, capitals upright, as in TeX. \epsilon and \phi are the lunate and stroked forms, as
// in TeX; \varepsilon and \varphi the others.
var greek = map[string]rune{
	"alpha": 'α', "beta": 'β', "gamma": 'γ', "delta": 'δ', "epsilon": 'ϵ', "varepsilon": 'ε',
	"zeta": 'ζ', "eta": 'η', "theta": 'θ', "vartheta": 'ϑ', "iota": 'ι', "kappa": 'κ',
	"lambda": 'λ', "mu": 'μ', "nu": 'ν', "xi": 'ξ', "pi": 'π', "rho": 'ρ', "sigma": 'σ',
	"varsigma": 'ς', "tau": 'τ', "upsilon": 'υ', "phi": 'ϕ', "varphi": 'φ', "chi": 'χ',
	"psi": 'ψ', "omega": 'ω',
	"Gamma": 'Γ', "Delta": 'Δ', "Theta": 'Θ', "Lambda": 'Λ', "Xi": 'Ξ', "Pi": 'Π',
	"Sigma": 'Σ', "Upsilon": 'Υ', "Phi": 'Φ', "Psi": 'Ψ', "Omega": 'Ω',
}

// mathSymbols maps the symbol macros allowed in math to their characters; only symbols the
// Liberation fonts have are listed (they lack ∝, ≪, ≫, ∓, ∘, ℏ, ∇).
var mathSymbols = map[string]rune{
	"times": '×', "cdot": '·', "pm": '±', "approx": '≈', "sim": '~', "equiv": '≡',
	"leq": '≤', "le": '≤', "geq": '≥', "ge": '≥', "neq": '≠', "ne": '≠',
	"infty": '∞', "partial": '∂', "prime": '′', "circ": '°', "ell": 'ℓ', "bullet": '•',
	"to": '→', "rightarrow": '→', "leftarrow": '←', "leftrightarrow": '↔',
	"uparrow": '↑', "downarrow": '↓', "ldots": '…', "dots": '…',
}

// textSymbols maps the macros allowed in text and math to their characters.
var textSymbols = map[string]rune{
	"textmu": 'µ', "AA": 'Å', "textdegree": '°', "textbackslash": '\\',
}

// escapes are the control symbols \% \$ ... that stand for their character.
const escapes = `%$&#_{}`

// spaces are the spacing macros and their widths in em (TeX's 3, 4, 5 mu and so on).
var spaces = map[string]float64{
	",": 1.0 / 6, ":": 2.0 / 9, ">": 2.0 / 9, ";": 5.0 / 18, "!": -1.0 / 6, " ": 1.0 / 3,
	"quad": 1, "qquad": 2,
}

// Binary operators and relations get thin spaces around them in math (at the top level, as
// in TeX's text style), unless they are unary (a leading minus).
const (
	binaryOps = "+−×·±"
	relations = "=<>≈≤≥≠≡~→←↔"
	binSpace  = 2.0 / 9  // TeX's medium space, em
	relSpace  = 5.0 / 18 // TeX's thick space, em
)

// isMarkup reports whether s is a markup label: it holds at least two unescaped $ signs.
func isMarkup(s string) bool {
	n := 0
	for i := 0; i < len(s); i++ {
		switch s[i] {
		case '\\':
			i++
		case '$':
			n++
		}
	}
	return n >= 2
}

// face is the font state of a group: roman letters in math, italic, bold.
type face struct {
	roman, italic, bold bool
}

type parser struct {
	src  string
	pos  int
	math bool
}

// parseMarkup parses a markup label into atoms, or returns an error saying what is wrong
// and where.
func parseMarkup(s string) ([]atom, error) {
	p := &parser{src: s}
	atoms, err := p.list(face{}, 0, false)
	if err != nil {
		return nil, fmt.Errorf("label %q: %v", s, err)
	}
	if p.math {
		return nil, fmt.Errorf("label %q: unclosed $", s)
	}
	return atoms, nil
}

func (p *parser) errorf(format string, args ...any) error {
	return fmt.Errorf("at byte %d: "+format, append([]any{p.pos}, args...)...)
}

// list parses atoms until the end of the source or, if group, the closing brace.
func (p *parser) list(f face, level int, group bool) ([]atom, error) {
	var out []atom
	operand := false // the previous math atom was an operand (so + or − after it is binary)
	startMath := p.math
	for p.pos < len(p.src) {
		r, n := utf8.DecodeRuneInString(p.src[p.pos:])
		if r == utf8.RuneError && n == 1 {
			return nil, p.errorf("invalid UTF-8")
		}
		switch r {
		case '}':
			if !group {
				return nil, p.errorf("unbalanced }")
			}
			if p.math != startMath {
				return nil, p.errorf("a group and a $ … $ overlap")
			}
			p.pos++
			return out, nil
		case '{':
			p.pos++
			inner, err := p.list(f, level, true)
			if err != nil {
				return nil, err
			}
			out = append(out, inner...)
			if len(out) > 0 && out[len(out)-1].kind == atomScripts {
				// Seal the group, so that scripts after it start afresh: {x^a}^b.
				out = append(out, atom{kind: atomSpace})
			}
			operand = true
			continue
		case '$':
			p.pos++
			p.math = !p.math
			operand = false
			continue
		case '^', '_':
			if !p.math {
				return nil, p.errorf("%c outside math (write \\%c or put it between $ signs)", r, r)
			}
			p.pos++
			arg, err := p.argument(f, level+1)
			if err != nil {
				return nil, err
			}
			var err2 error
			out, err2 = attach(out, r == '^', arg)
			if err2 != nil {
				return nil, p.errorf("%v", err2)
			}
			operand = true
			continue
		case '%', '&', '#':
			return nil, p.errorf("unescaped %c (write \\%c)", r, r)
		case '~':
			p.pos++
			out = append(out, atom{kind: atomSpace, em: 1.0 / 3})
			continue
		case '\\':
			a, nf, err := p.macro(f, level)
			if err != nil {
				return nil, err
			}
			if nf != nil { // a declaration: \rm, \it, \bf
				f = *nf
				continue
			}
			for _, x := range a {
				if x.kind == atomText && p.math {
					out, operand = addMathChar(out, x, operand, level)
				} else {
					out = appendAtom(out, x)
					operand = operand || x.kind != atomSpace
				}
			}
			continue
		}
		p.pos += n
		if p.math {
			if unicode.IsSpace(r) {
				continue
			}
			out, operand = addMathChar(out, mathAtom(r, f), operand, level)
			continue
		}
		out = appendAtom(out, atom{text: string(r), italic: f.italic, bold: f.bold})
	}
	if group {
		return nil, p.errorf("unclosed {")
	}
	return out, nil
}

// mathAtom is the atom of character r in math: Latin and lower-case Greek letters italic
// unless roman, '-' as a minus sign, ' as a prime.
func mathAtom(r rune, f face) atom {
	switch r {
	case '-':
		r = '−'
	case '\'':
		r = '′'
	}
	it := f.italic
	if !f.roman && (r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= 'α' && r <= 'ω' || r == 'ϵ' || r == 'ϑ' || r == 'ϕ') {
		it = true
	}
	return atom{text: string(r), italic: it, bold: f.bold}
}

// addMathChar appends the one-character atom a in math, with spaces around binary
// operators and relations at the top level.
func addMathChar(out []atom, a atom, operand bool, level int) ([]atom, bool) {
	r, _ := utf8.DecodeRuneInString(a.text)
	var sp float64
	switch {
	case strings.ContainsRune(relations, r):
		sp = relSpace
	case strings.ContainsRune(binaryOps, r) && operand:
		sp = binSpace
	}
	if sp == 0 || level > 0 {
		return appendAtom(out, a), !(strings.ContainsRune(binaryOps, r) || strings.ContainsRune(relations, r))
	}
	out = append(out, atom{kind: atomSpace, em: sp})
	out = append(out, a)
	out = append(out, atom{kind: atomSpace, em: sp})
	return out, false
}

// appendAtom appends a, merging it into the last atom when both are text in the same face.
func appendAtom(out []atom, a atom) []atom {
	if n := len(out); n > 0 && a.kind == atomText && out[n-1].kind == atomText &&
		out[n-1].italic == a.italic && out[n-1].bold == a.bold {
		out[n-1].text += a.text
		return out
	}
	return append(out, a)
}

// attach adds a superscript (sup) or subscript to the last atom of out.
func attach(out []atom, sup bool, arg []atom) ([]atom, error) {
	n := len(out)
	if n > 0 && out[n-1].kind == atomScripts {
		s := &out[n-1]
		switch {
		case sup && s.sup != nil:
			return nil, fmt.Errorf("double superscript (group it: {x^a}^b)")
		case !sup && s.sub != nil:
			return nil, fmt.Errorf("double subscript (group it: {x_a}_b)")
		}
		if arg == nil {
			arg = []atom{}
		}
		if sup {
			s.sup = arg
		} else {
			s.sub = arg
		}
		return out, nil
	}
	if arg == nil {
		arg = []atom{}
	}
	s := atom{kind: atomScripts}
	if sup {
		s.sup = arg
	} else {
		s.sub = arg
	}
	return append(out, s), nil
}

// argument parses the argument of a script or a command: a braced group, a macro or one
// character.
func (p *parser) argument(f face, level int) ([]atom, error) {
	for p.pos < len(p.src) && p.src[p.pos] == ' ' {
		p.pos++
	}
	if p.pos >= len(p.src) {
		return nil, p.errorf("missing argument")
	}
	switch p.src[p.pos] {
	case '{':
		p.pos++
		return p.list(f, level, true)
	case '}', '^', '_', '$':
		return nil, p.errorf("missing argument before %c", p.src[p.pos])
	case '\\':
		a, nf, err := p.macro(f, level)
		if err != nil {
			return nil, err
		}
		if nf != nil {
			return nil, p.errorf("a font declaration cannot be an argument (use \\mathrm{...})")
		}
		return a, nil
	}
	r, n := utf8.DecodeRuneInString(p.src[p.pos:])
	p.pos += n
	if p.math {
		return []atom{mathAtom(r, f)}, nil
	}
	return []atom{{text: string(r), italic: f.italic, bold: f.bold}}, nil
}

// macro parses the command at p.pos (a backslash). It returns the atoms it stands for, or
// the new face of a declaration (\rm, \it, \bf).
func (p *parser) macro(f face, level int) ([]atom, *face, error) {
	start := p.pos
	p.pos++ // the backslash
	if p.pos >= len(p.src) {
		return nil, nil, p.errorf("lone \\ at the end")
	}
	name := ""
	if c := p.src[p.pos]; c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' {
		e := p.pos
		for e < len(p.src) && (p.src[e] >= 'a' && p.src[e] <= 'z' || p.src[e] >= 'A' && p.src[e] <= 'Z') {
			e++
		}
		name, p.pos = p.src[p.pos:e], e
		for p.pos < len(p.src) && p.src[p.pos] == ' ' { // a space after a command word is eaten
			p.pos++
		}
	} else {
		r, n := utf8.DecodeRuneInString(p.src[p.pos:])
		name = string(r)
		p.pos += n
	}
	if w, ok := spaces[name]; ok {
		return []atom{{kind: atomSpace, em: w}}, nil, nil
	}
	if name == "^" || name == "~" { // the accents \^{} and \~{} on nothing: the characters
		if strings.HasPrefix(p.src[p.pos:], "{}") {
			p.pos += 2
		}
		return []atom{{text: name, italic: f.italic && !p.math, bold: f.bold}}, nil, nil
	}
	if len(name) == 1 && strings.Contains(escapes, name) {
		return []atom{{text: name, italic: f.italic && !p.math, bold: f.bold}}, nil, nil
	}
	if r, ok := textSymbols[name]; ok {
		return []atom{{text: string(r), bold: f.bold}}, nil, nil
	}
	nf := f
	switch name {
	case "rm":
		nf.roman, nf.italic, nf.bold = true, false, false
		return nil, &nf, nil
	case "it":
		nf.roman, nf.italic = false, true
		return nil, &nf, nil
	case "bf":
		nf.roman, nf.bold = true, true
		return nil, &nf, nil
	case "mathrm", "mathit", "mathbf", "textrm", "textit", "textbf":
		switch name[len(name)-2:] {
		case "rm":
			nf.roman, nf.italic, nf.bold = true, false, false
		case "it":
			nf.roman, nf.italic = false, true
		case "bf":
			nf.roman, nf.bold = true, true
		}
		wasMath := p.math
		if strings.HasPrefix(name, "text") {
			p.math = false
		}
		a, err := p.argument(nf, level)
		p.math = wasMath
		if err != nil {
			return nil, nil, err
		}
		return a, nil, nil
	}
	if p.math {
		if r, ok := greek[name]; ok {
			return []atom{mathAtom(r, f)}, nil, nil
		}
		if r, ok := mathSymbols[name]; ok {
			return []atom{{text: string(r), bold: f.bold}}, nil, nil
		}
	} else if _, ok := greek[name]; ok {
		return nil, nil, fmt.Errorf("at byte %d: \\%s outside math (write $\\%s$)", start, name, name)
	} else if _, ok := mathSymbols[name]; ok {
		return nil, nil, fmt.Errorf("at byte %d: \\%s outside math (write $\\%s$)", start, name, name)
	}
	return nil, nil, fmt.Errorf("at byte %d: unknown command \\%s", start, name)
}

// superscripts and subscripts are the Unicode script characters a plain label may hold,
// with the characters they raise or lower.
var (
	superscripts = map[rune]rune{'⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5',
		'⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁺': '+', '⁻': '-'}
	subscripts = map[rune]rune{'₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5',
		'₆': '6', '₇': '7', '₈': '8', '₉': '9', '₊': '+', '₋': '-'}
)

// greekName is the macro name of each Greek character (the inverse of greek, with the
// stroked ε and φ and the increment sign ∆ as their usual letters).
var greekName = func() map[rune]string {
	m := make(map[rune]string, len(greek))
	for name, r := range greek {
		m[r] = name
	}
	m['ε'], m['φ'], m['∆'] = "varepsilon", "varphi", "Delta"
	return m
}()

// toMarkup returns the markup that a label stands for: markup labels unchanged, plain
// labels with their LaTeX specials escaped, carets before a signed integer or a braced group
// and Unicode script digits as scripts, and Greek letters as math (so that lower-case
// Greek is italic, as LaTeX sets it).
func toMarkup(s string) string {
	if isMarkup(s) {
		return s
	}
	return plainToMarkup(s)
}

// plainToMarkup returns the markup of plain text s.
func plainToMarkup(s string) string {
	var b texBuilder
	for i := 0; i < len(s); {
		r, n := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == '^' || r == '_':
			if arg, m := scriptArg(s[i+1:]); m > 0 && (r == '^' || s[i+1] == '{') {
				b.math(string(r) + "{" + arg + "}")
				i += 1 + m
				continue
			}
			b.text(escapeText(string(r)))
		case superscripts[r] != 0 || subscripts[r] != 0:
			table, op := superscripts, "^"
			if subscripts[r] != 0 {
				table, op = subscripts, "_"
			}
			var digits strings.Builder
			for i < len(s) {
				r, n := utf8.DecodeRuneInString(s[i:])
				d := table[r]
				if d == 0 {
					break
				}
				digits.WriteRune(d)
				i += n
			}
			b.math(op + "{" + digits.String() + "}")
			continue
		case greekName[r] != "":
			b.math(`\` + greekName[r])
		default:
			b.text(escapeText(s[i : i+n]))
		}
		i += n
	}
	return b.String()
}

// texBuilder builds LaTeX source from text and math pieces, joining adjacent math pieces
// into one $ … $ (two pieces written one after the other would make $$, display math).
type texBuilder struct {
	b       []byte
	mathEnd int // length of b just after the closing $ of the last math piece, or -1
}

// text appends text-mode source.
func (t *texBuilder) text(s string) {
	t.b = append(t.b, s...)
	t.mathEnd = -1
}

// math appends math-mode source, between $ signs.
func (t *texBuilder) math(s string) {
	t.open()
	t.b = append(t.b, s...)
	t.close()
}

// open opens math, or reopens the math piece that just closed.
func (t *texBuilder) open() {
	if len(t.b) > 0 && t.mathEnd == len(t.b) {
		t.b = t.b[:len(t.b)-1]
	} else {
		t.b = append(t.b, '$')
	}
	t.mathEnd = -1
}

// close closes math.
func (t *texBuilder) close() {
	t.b = append(t.b, '$')
	t.mathEnd = len(t.b)
}

// String returns the source.
func (t *texBuilder) String() string { return string(t.b) }

// scriptArg reads the argument of a caret in a plain label: a signed integer or decimal
// ("-3", "2", "0.92"), or a braced group without nested braces or $ ("{1/2}"). It returns
// the argument as markup and the number of bytes it took, or 0 if there is none.
func scriptArg(s string) (string, int) {
	if strings.HasPrefix(s, "{") {
		end := strings.IndexByte(s, '}')
		inner := ""
		if end > 0 {
			inner = s[1:end]
		}
		if end <= 1 || strings.ContainsAny(inner, "{$\\") {
			return "", 0
		}
		if arg, m := scriptArg(inner); m == len(inner) {
			return arg, end + 1
		}
		return `\textrm{` + escapeText(inner) + `}`, end + 1
	}
	i := 0
	sign := ""
	switch {
	case strings.HasPrefix(s, "-"), strings.HasPrefix(s, "+"):
		sign, i = s[:1], 1
	case strings.HasPrefix(s, "−"):
		sign, i = "-", len("−")
	}
	j := i
	for j < len(s) && (s[j] >= '0' && s[j] <= '9' || s[j] == '.' && j > i && j+1 < len(s) && s[j+1] >= '0' && s[j+1] <= '9') {
		j++
	}
	if j == i {
		return "", 0
	}
	return sign + s[i:j], j
}

// escapeText escapes the LaTeX specials of plain text.
func escapeText(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r == '\\':
			b.WriteString(`\textbackslash{}`)
		case r == '~':
			b.WriteString(`\~{}`)
		case r == '^':
			b.WriteString(`\^{}`)
		case strings.ContainsRune(escapes, r):
			b.WriteString(`\` + string(r))
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}

// Unit returns the markup for a unit written the plain way, for building markup labels:
// Unit("cm^-3") is "cm$^{-3}$", Unit("A/cm^2") is "A/cm$^{2}$", Unit("µm") is "µm", so that
//
//	`$\tau_{\rm eff}$ (` + plots.Unit("µs") + `)`
//	`$\Delta n$ (` + plots.Unit("cm^-3") + `)`
//
// typeset as τ_eff (µs) and Δn (cm⁻³). Plain labels ("Δn (cm^-3)") need no Unit: they are
// converted in the same way when drawn.
func Unit(u string) string {
	return plainToMarkup(u)
}

// checkLabel returns an error if the label s, named what, is markup that does not parse.
func checkLabel(what, s string) error {
	if _, err := parseMarkup(toMarkup(s)); err != nil {
		return fmt.Errorf("plots: %s: %v", what, err)
	}
	return nil
}
