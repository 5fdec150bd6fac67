package plots

import "strings"

// gonum/plot v0.17 places the glyph box of an axis label at the axis's arithmetic midpoint,
// Norm((Min+Max)/2), which on a logarithmic axis lies near the top or right end: the box
// then pokes out of the data area and gonum/plot shrinks the data area by up to half the
// label's length (about 15 % of a log–log figure). A phantom axis label takes the label's
// height but no width and draws nothing, so that the label can be drawn by our own code.

// phantom marks each line of a phantom label.
const phantom = "\x00"

// phantomOf returns the phantom of label s ("" for none).
func phantomOf(s string) string {
	if s == "" || strings.HasPrefix(s, phantom) {
		return s
	}
	return phantom + strings.ReplaceAll(s, "\n", "\n"+phantom)
}

// realOf returns the label a phantom stands for, and whether s is a phantom.
func realOf(s string) (string, bool) {
	if !strings.HasPrefix(s, phantom) {
		return s, false
	}
	return strings.ReplaceAll(s, phantom, ""), true
}
