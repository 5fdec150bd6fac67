package nb

import (
	"fmt"
	"html"
	"strings"

	"github.com/janpfeifer/gonb/gonbui"
	"gonum.org/v1/plot"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/plots"
)

// Show displays p inline in the notebook as a light SVG (plots.SVGInline) at the house
// notebook size, scaled to the width of the page. Like every display function here it waits
// until GoNB has received the content (gonbui.Sync), so that output is not lost when the
// cell's program ends right after. For a figure in Liberation Serif (to match a serif
// manuscript), or at another preset size, show it as a plots.Figure:
// nb.ShowFigure(plots.Figure{Panels: []*plot.Plot{p}, Serif: true}).
func Show(p *plot.Plot) error {
	svg, err := plots.SVGInline(p)
	if err != nil {
		return fmt.Errorf("nb: %v", err)
	}
	displaySVG(svg)
	return nil
}

// ShowFigure displays a plots.Figure (several panels, a preset size, Serif for Liberation
// Serif type) like Show.
func ShowFigure(f plots.Figure) error {
	svg, err := f.SVGInline()
	if err != nil {
		return fmt.Errorf("nb: %v", err)
	}
	displaySVG(svg)
	return nil
}

// FigureHTML returns the HTML in which Show and ShowFigure display an SVG: the figure scaled
// to the page width (at most 900 px), keeping its aspect ratio.
func FigureHTML(svg []byte) string {
	return `<div style="width:100%;max-width:900px">` + string(scaleSVG(svg)) + `</div>`
}

func displaySVG(svg []byte) {
	gonbui.DisplayHTML(FigureHTML(svg))
	gonbui.Sync()
}

// scaleSVG makes the root <svg> element take the width of its container: its width becomes
// 100 % and its height attribute goes, the viewBox keeping the aspect ratio.
func scaleSVG(svg []byte) []byte {
	s := string(svg)
	i := strings.Index(s, "<svg")
	if i < 0 {
		return svg
	}
	j := strings.Index(s[i:], ">")
	if j < 0 {
		return svg
	}
	tag := s[i : i+j]
	if !strings.Contains(tag, "viewBox") {
		return svg
	}
	tag = replaceAttr(tag, "width", "100%")
	tag = removeAttr(tag, "height")
	return []byte(s[:i] + tag + s[i+j:])
}

// removeAttr deletes attribute name from the tag text.
func removeAttr(tag, name string) string {
	k := strings.Index(tag, " "+name+`="`)
	if k < 0 {
		return tag
	}
	end := strings.Index(tag[k+len(name)+3:], `"`)
	if end < 0 {
		return tag
	}
	return tag[:k] + tag[k+len(name)+3+end+1:]
}

// replaceAttr sets the value of attribute name in the tag text (which must contain it).
func replaceAttr(tag, name, value string) string {
	k := strings.Index(tag, " "+name+`="`)
	if k < 0 {
		return tag
	}
	start := k + len(name) + 3
	end := strings.Index(tag[start:], `"`)
	if end < 0 {
		return tag
	}
	return tag[:start] + value + tag[start+end:]
}

// Markdown displays a Markdown text in the notebook, e.g. a computed conclusion.
func Markdown(md string) {
	gonbui.DisplayMarkdown(md)
	gonbui.Sync()
}

// TableHTML returns an HTML table with a caption, a header row (put units in the headers,
// e.g. "ni (cm⁻³)") and rows of already formatted cells. All text is HTML-escaped. It returns
// an error if a row's length differs from the header's.
func TableHTML(caption string, header []string, rows [][]string) (string, error) {
	if len(header) == 0 {
		return "", fmt.Errorf("nb: table %q has no header", caption)
	}
	for i, r := range rows {
		if len(r) != len(header) {
			return "", fmt.Errorf("nb: table %q row %d has %d cells, header has %d", caption, i, len(r), len(header))
		}
	}
	var b strings.Builder
	b.WriteString(`<table style="border-collapse:collapse;font-family:sans-serif;font-size:0.9em">`)
	if caption != "" {
		fmt.Fprintf(&b, `<caption style="text-align:left;font-weight:bold">%s</caption>`, html.EscapeString(caption))
	}
	b.WriteString("<tr>")
	for _, h := range header {
		fmt.Fprintf(&b, `<th style="border-bottom:1px solid #888;padding:2px 8px">%s</th>`, html.EscapeString(h))
	}
	b.WriteString("</tr>")
	for _, r := range rows {
		b.WriteString("<tr>")
		for _, c := range r {
			fmt.Fprintf(&b, `<td style="padding:2px 8px;text-align:right">%s</td>`, html.EscapeString(c))
		}
		b.WriteString("</tr>")
	}
	b.WriteString("</table>")
	return b.String(), nil
}

// Table displays the table built by TableHTML in the notebook.
func Table(caption string, header []string, rows [][]string) error {
	h, err := TableHTML(caption, header, rows)
	if err != nil {
		return err
	}
	gonbui.DisplayHTML(h)
	gonbui.Sync()
	return nil
}

// FooterHTML returns the provenance footer for results computed with the given model set
// (anything with a String method, such as *silicon.Material): the pvrec version and the
// model set's description, so that a figure pasted into a report says what produced it. A nil
// models says "model set not given"; a nil pointer or a String method that panics is described
// as package fmt prints it ("<nil>", "%!v(PANIC=...)"), never a panic of the notebook.
func FooterHTML(models fmt.Stringer) string {
	desc := "model set not given"
	if models != nil {
		desc = fmt.Sprint(models)
	}
	return fmt.Sprintf(`<p style="font-size:0.8em;color:#555">pvrec %s · %s</p>`,
		html.EscapeString(pvrec.Version), html.EscapeString(desc))
}

// Footer displays the provenance footer of FooterHTML in the notebook.
func Footer(models fmt.Stringer) {
	gonbui.DisplayHTML(FooterHTML(models))
	gonbui.Sync()
}
