package plots

import (
	"context"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"testing"
	"time"

	"gonum.org/v1/plot"
)

// texSymbols is a label with every character and command that latexSource translates or
// passes on, so that the compiled document shows that pdfLaTeX takes them all.
const texSymbols = "µ Å ° · × ± − – — ≈ ≤ ≥ ≠ ≡ ∞ ∂ ′ → ← ↔ … • ℓ ↑ ↓ ΔΩαβγ cm⁻³ x₂ a^{1/2} b_{n} 50 % $ & # _ { }"

// TestTeXCompiles compiles the TeX export of every golden figure, and of a figure whose
// labels hold every character the export translates, with pdflatex inside a minimal
// document that loads pgf (what the export's header asks for). It fails on a LaTeX error
// and on a character missing from the document's fonts (\tracinglostchars). It is skipped,
// saying so, where pdflatex is not on PATH (make setup-tex installs it).
func TestTeXCompiles(t *testing.T) {
	pdflatex, err := exec.LookPath("pdflatex")
	if err != nil {
		t.Skip("pdflatex not on PATH: install Debian's texlive-latex-base and texlive-pictures (make setup-tex) to compile the TeX export")
	}
	figs := goldenFigures(t)
	sym, err := Lines(Axes{Title: texSymbols, XLabel: `$\Delta n\,\times\,10^{-3}\;\mathrm{cm}^{-3}\quad \% \$ \& \# \_ \{ \}$`, YLabel: texSymbols},
		Series{Label: texSymbols, X: []float64{1, 2}, Y: []float64{1, 2}})
	if err != nil {
		t.Fatal(err)
	}
	figs["symbols"] = Figure{Panels: []*plot.Plot{sym}, Preset: DoubleColumn}
	names := make([]string, 0, len(figs))
	for n := range figs {
		names = append(names, n)
	}
	slices.Sort(names)
	dir := t.TempDir()
	var doc strings.Builder
	doc.WriteString("\\documentclass{article}\n\\usepackage[paperwidth=30cm,paperheight=20cm,margin=1cm]{geometry}\n" +
		"\\usepackage{pgf}\n\\tracinglostchars=2\n\\pagestyle{empty}\n\\begin{document}\n")
	for _, n := range names {
		b, err := figs[n].Encode("tex")
		if err != nil {
			t.Fatalf("%s: %v", n, err)
		}
		if err := os.WriteFile(filepath.Join(dir, n+".tex"), b, 0o644); err != nil {
			t.Fatal(err)
		}
		fmt.Fprintf(&doc, "%% figure %s\n\\noindent\\input{%s.tex}\n\\newpage\n", n, n)
	}
	doc.WriteString("\\end{document}\n")
	if err := os.WriteFile(filepath.Join(dir, "doc.tex"), []byte(doc.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), 2*time.Minute)
	defer cancel()
	cmd := exec.CommandContext(ctx, pdflatex, "-no-shell-escape", "-interaction=nonstopmode", "-halt-on-error", "doc.tex")
	cmd.Dir = dir
	out, err := cmd.CombinedOutput()
	log, _ := os.ReadFile(filepath.Join(dir, "doc.log"))
	if err != nil {
		t.Fatalf("pdflatex: %v\n%s", err, tail(string(out), 40))
	}
	if m := regexp.MustCompile(`Missing character: .*`).FindAllString(string(log), -1); len(m) > 0 {
		t.Errorf("characters missing from the fonts:\n%s", strings.Join(slices.Compact(m), "\n"))
	}
	if fi, err := os.Stat(filepath.Join(dir, "doc.pdf")); err != nil || fi.Size() == 0 {
		t.Errorf("no PDF written: %v", err)
	}
	if !strings.Contains(string(log), fmt.Sprintf("(%d pages", len(names))) {
		t.Errorf("the PDF does not have one page per figure (%d):\n%s", len(names), tail(string(out), 5))
	}
}

// tail returns the last n lines of s.
func tail(s string, n int) string {
	lines := strings.Split(strings.TrimRight(s, "\n"), "\n")
	return strings.Join(lines[max(0, len(lines)-n):], "\n")
}
