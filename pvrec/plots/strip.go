package plots

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	stdfont "golang.org/x/image/font"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// StripMember is one member of a model spread: a model set (or any variant) and the result
// it gives, in the unit of Axes.XLabel.
type StripMember struct {
	Label   string  // the member, e.g. "BGN Schenk1998 + FD, μ Klaassen1992, Auger Richter2012"
	Value   float64 // the result with this member, finite
	Default bool    // the default member, highlighted (at most one per group)
}

// StripGroup is a set of members drawn together in one colour and marker of the house cycle,
// e.g. the model sets that vary one model.
type StripGroup struct {
	Label   string        // heading above the group's rows, e.g. "BGN varied"; needed when there are several groups
	Members []StripMember // the group's rows, from top to bottom; at least one
}

// stripLabelWidth is the width beyond which Strip breaks a plain member label into lines,
// pt at the design size (our choice: about half a journal column).
const stripLabelWidth = 120

// Strip returns a strip (dot) chart of a model spread in the house style: one row per
// member, listed from top to bottom in the order given with a gap between groups, its label
// on the left and its value a marker on the horizontal axis, linear or logarithmic if
// ax.LogX, in the unit ax.XLabel names. Each row has a light guide line from its label; each
// group's range, from its smallest to its largest value, is a light band of its colour
// behind its rows; a default member is a black diamond with a dashed line at its value
// across its group's rows. Groups take the colours and markers of the house cycle. A group's
// label is a heading on a row of its own above the group's rows, at the left of the data
// area; the key of the default marker has a row of its own at the top, at the right. Headings
// and key take rows that hold no marker, so that they cover nothing at any figure size at
// which the member labels do not overlap; ax.Legend is not used (a legend box in a corner
// would cover rows).
//
// Plain member labels wider than about half a journal column (120 pt at the print size) are
// broken into lines after ", " or "; ", and rows with more lines stand further apart, so that
// long model-set names fit; a label with its own line breaks ("\n") or a markup label keeps
// them as written.
//
// It returns an error for no groups, a group without members or without a label when there
// are several, an empty member label, a value that is not finite (or not > 0 on a logarithmic
// axis), values spanning more than a float64 holds, more than one default in a group, a label
// that is markup and does not parse, or axes options a strip chart cannot honour (LogY, a
// YLabel, a RightLabel or LogRight).
func Strip(ax Axes, groups ...StripGroup) (*plot.Plot, error) {
	if ax.LogY || ax.YLabel != "" || ax.RightLabel != "" || ax.LogRight {
		return nil, fmt.Errorf("plots: Strip: a strip chart has its members on the vertical axis and no right-hand scale (LogY %v, YLabel %q, RightLabel %q, LogRight %v)",
			ax.LogY, ax.YLabel, ax.RightLabel, ax.LogRight)
	}
	if err := checkAxes(ax); err != nil {
		return nil, err
	}
	if len(groups) == 0 {
		return nil, fmt.Errorf("plots: Strip: no groups to draw")
	}
	xs := newSpan()
	s := &stripPlotter{}
	var ticks []plot.Tick
	for _, gr := range groups {
		for _, mb := range gr.Members {
			s.key = s.key || mb.Default
		}
	}
	pos := 0.0 // from the top
	prevLines := 0
	first := !s.key // the next row is the chart's first (the key's row, if any, is at 0)
	if s.key {
		prevLines = 1
	}
	gap := 0.0 // extra distance before the next group: none after the key's row
	for g, gr := range groups {
		if len(groups) > 1 && gr.Label == "" {
			return nil, fmt.Errorf("plots: Strip: group %d has no label", g)
		}
		if err := checkLabel(fmt.Sprintf("Strip: group %d label", g), gr.Label); err != nil {
			return nil, err
		}
		if len(gr.Members) == 0 {
			return nil, fmt.Errorf("plots: Strip: group %d (%q) has no members", g, gr.Label)
		}
		sg := stripGroup{def: -1, label: gr.Label}
		if gr.Label != "" { // a heading row
			if !first {
				pos += rowStep(prevLines, 1) + gap
			}
			sg.head, prevLines, first = pos, 1, false
		} else {
			sg.head = math.NaN()
		}
		for m, mb := range gr.Members {
			if mb.Label == "" {
				return nil, fmt.Errorf("plots: Strip: group %d (%q) member %d has no label", g, gr.Label, m)
			}
			if err := checkLabel(fmt.Sprintf("Strip: group %d member %d label", g, m), mb.Label); err != nil {
				return nil, err
			}
			if v := mb.Value; math.IsNaN(v) || math.IsInf(v, 0) || ax.LogX && v <= 0 {
				return nil, fmt.Errorf("plots: Strip: group %d (%q) member %d (%q): value %g must be finite%s", g, gr.Label, m, mb.Label, v, positive(ax.LogX))
			}
			if mb.Default {
				if sg.def >= 0 {
					return nil, fmt.Errorf("plots: Strip: group %d (%q) has two defaults, members %d and %d", g, gr.Label, sg.def, m)
				}
				sg.def = m
			}
			label := wrapLabel(mb.Label, vg.Points(stripLabelWidth))
			lines := strings.Count(label, "\n") + 1
			switch {
			case first:
				first = false
			case m == 0 && math.IsNaN(sg.head):
				pos += rowStep(prevLines, lines) + gap
			default:
				pos += rowStep(prevLines, lines)
			}
			prevLines = lines
			sg.pos = append(sg.pos, pos)
			sg.values = append(sg.values, mb.Value)
			ticks = append(ticks, plot.Tick{Value: pos, Label: label})
			xs.add(mb.Value)
		}
		s.groups = append(s.groups, sg)
		gap = stripGap
	}
	p := newPlot(ax)
	var err error
	if p.X.Min, p.X.Max, err = xs.axis("x", ax.LogX); err != nil {
		return nil, err
	}
	// The vertical axis runs downwards: row positions are negated.
	for i := range ticks {
		ticks[i].Value = -ticks[i].Value
	}
	p.Y.Min, p.Y.Max = -pos-0.6, 0.6
	p.Y.Tick.Width, p.Y.Tick.Length, p.Y.Width = 0, 0, 0
	p.Y.Tick.Marker = plot.ConstantTicks(ticks)
	p.X.Padding = p.Y.Tick.Label.Height("0") / 2
	p.Add(&gridLines{sty: draw.LineStyle{Color: gridColor, Width: vg.Points(gridWidth)}, vertical: true})
	p.Add(s)
	return p, nil
}

// rowStep is the distance, in row units, between the centres of adjacent rows whose labels
// have a and b lines: stripRow for single-line labels, more for wrapped ones.
func rowStep(a, b int) float64 { return 0.3 + 0.35*float64(a+b) }

// stripGap is the extra distance, in row units, between the last row of a group and the next
// group's first row (its heading, if it has one).
const stripGap = 0.6

// The default member's marker and its radius, pt.
var defaultMarker = marker{shape: diamond}

const defaultSize = 1.3 * markerSize

// rangeTint is the weight of a group's colour in the band of its range, lighter than an
// uncertainty band's: the band spans rows of labels.
const rangeTint = 0.18

// wrapLabel breaks a plain label wider than width (set at the tick size) into lines after
// ", " or "; ", filling each line as far as it goes. Markup labels and labels with line
// breaks are returned as they are.
func wrapLabel(s string, width vg.Length) string {
	if strings.Contains(s, "\n") || isMarkup(s) {
		return s
	}
	fnt := houseFont(tickSize, false)
	wd := func(x string) vg.Length { w, _, _ := typesetter{}.Box(x, fnt); return w }
	if wd(s) <= width {
		return s
	}
	var parts []string
	start := 0
	for i := 0; i+1 < len(s); i++ {
		if (s[i] == ',' || s[i] == ';') && s[i+1] == ' ' {
			parts = append(parts, s[start:i+1])
			start = i + 2
		}
	}
	parts = append(parts, s[start:])
	var lines []string
	cur := parts[0]
	for _, q := range parts[1:] {
		if wd(cur+" "+q) > width {
			lines = append(lines, cur)
			cur = q
		} else {
			cur += " " + q
		}
	}
	return strings.Join(append(lines, cur), "\n")
}

// stripGroup is a group of a strip chart: its heading, its rows' positions (from the top)
// and values.
type stripGroup struct {
	label       string  // heading
	head        float64 // position of the heading row; NaN for none
	pos, values []float64
	def         int // index of the default member, -1 for none
}

// stripPlotter draws the rows of a strip chart.
type stripPlotter struct {
	groups []stripGroup
	key    bool // some group has a default: its key has the top row, at position 0
}

// stripInset is the distance of headings and key from the data area's sides, pt.
const stripInset = 3

// Plot draws the guide lines, the groups' ranges, the defaults' lines and the markers.
func (s *stripPlotter) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	at := func(pos float64) vg.Length { return trY(-pos) }
	unit := abs(at(1) - at(0))
	guide := draw.LineStyle{Color: gridColor, Width: vg.Points(gridWidth)}
	for _, g := range s.groups {
		for _, p := range g.pos {
			c.StrokeLine2(guide, c.Min.X, at(p), c.Max.X, at(p))
		}
	}
	for i, g := range s.groups {
		col, _, _ := styleOf(i)
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, v := range g.values {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
		top, bottom := at(g.pos[0])+0.35*unit, at(g.pos[len(g.pos)-1])-0.35*unit
		x0, x1 := trX(lo), trX(hi)
		if x1-x0 < vg.Points(1) { // a range of one value: a thin band still shows it
			x0, x1 = (x0+x1)/2-vg.Points(0.5), (x0+x1)/2+vg.Points(0.5)
		}
		c.SetColor(tint(col, rangeTint))
		c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: bottom}, Max: vg.Point{X: x1, Y: top}}.Path())
		if g.def >= 0 {
			x := trX(g.values[g.def])
			c.StrokeLine2(draw.LineStyle{Color: inkColor, Width: vg.Points(errWidth), Dashes: referenceDash}, x, bottom, x, top)
		}
	}
	sty := plt.Legend.TextStyle // the house legend text, restyled with the figure (serif, mode)
	sty.YAlign = draw.YCenter
	in := vg.Points(stripInset)
	for _, g := range s.groups {
		if !math.IsNaN(g.head) && g.label != "" {
			h := sty
			h.XAlign = draw.XLeft
			h.Font.Style = stdfont.StyleItalic
			c.FillText(h, vg.Point{X: c.Min.X + in, Y: at(g.head)}, g.label)
		}
	}
	if s.key {
		k := sty
		k.XAlign = draw.XRight
		y := at(0)
		const label = "default"
		c.FillText(k, vg.Point{X: c.Max.X - in, Y: y}, label)
		r := vg.Points(defaultSize)
		x := c.Max.X - in - k.Width(label) - k.Width(" ") - r
		c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Shape: defaultMarker, Radius: r}, vg.Point{X: x, Y: y})
	}
	for i, g := range s.groups {
		col, _, m := styleOf(i)
		for k, v := range g.values {
			pt := vg.Point{X: trX(v), Y: at(g.pos[k])}
			if k == g.def {
				c.DrawGlyph(draw.GlyphStyle{Color: color.Black, Shape: defaultMarker, Radius: vg.Points(defaultSize)}, pt)
				continue
			}
			c.DrawGlyph(draw.GlyphStyle{Color: col, Shape: m, Radius: vg.Points(markerSize)}, pt)
		}
	}
}

// GlyphBoxes returns the markers' boxes, so that gonum/plot keeps them inside the figure.
func (s *stripPlotter) GlyphBoxes(plt *plot.Plot) []plot.GlyphBox {
	var b []plot.GlyphBox
	for _, g := range s.groups {
		for k, v := range g.values {
			r := vg.Points(defaultSize)
			b = append(b, plot.GlyphBox{X: plt.X.Norm(v), Y: plt.Y.Norm(-g.pos[k]),
				Rectangle: vg.Rectangle{Min: vg.Point{X: -r, Y: -r}, Max: vg.Point{X: r, Y: r}}})
		}
	}
	return b
}
