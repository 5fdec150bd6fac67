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
//
// Explore binds controls (Slider, LogSlider for quantities spanning decades, Select) to a Draw
// function: in JupyterLab or Notebook with a browser, moving a control redraws the figure (and
// an optional small table) in place, and an error of Draw shows in the figure's place. Headless
// (nbconvert --execute, as notebooks/run.sh and CI run the notebooks; a test; go run) it shows
// the figure at the initial values with a one-line note that the controls are live in an
// interactive session, and returns at once. It tells the two apart by the process that started
// the kernel (a Jupyter server or not; PVREC_LIVE=0 or 1 overrides), because any use of GoNB's
// browser channel makes the kernel wait for a browser and leave its connection script in a
// headless run's saved notebook; it does not use gonbui/widgets, whose Done waits for a browser
// without a timeout.
package nb
