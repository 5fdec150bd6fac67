// Package nb holds the display helpers for pvrec's GoNB notebooks: figures shown inline as SVG,
// HTML tables whose column headers carry units, and a provenance footer naming the pvrec
// version and the model set behind the numbers; and the notebook kit, so that no notebook
// redefines a helper: Must and Check (stop a cell with a readable error), LogSpan and LinSpan,
// unit factors for display (FemtoAmpPerCm2, MilliVolt, Microsecond, ...) and Scaled, tables
// from typed columns with units and a CSV download (Column, Columns), and ShowFooted (a figure
// with its provenance footer).
//
// It is the only pvrec package that imports gonbui (github.com/janpfeifer/gonb/gonbui). The
// HTML builders (TableHTML, FooterHTML) are pure functions, so they can be tested and reused
// outside a notebook; Show, Table, Footer and Markdown send their output to the notebook and
// do nothing visible when the program does not run under GoNB. Each of them waits until GoNB
// has the content (gonbui.Sync): without that, a cell whose program ends right after its last
// display can lose the output.
package nb
