package nb

import (
	"bytes"
	_ "embed"
	"encoding/json"
	"fmt"
	"html"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"text/template"
	"time"

	"github.com/janpfeifer/gonb/gonbui"
	"github.com/janpfeifer/gonb/gonbui/comms"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/plot"

	"github.com/pvrec/pvrec/pvrec/plots"
)

// Interactive exploration: controls (sliders, selectors) bound to a computation whose figure
// redraws in place.
//
// Why not gonbui/widgets: in GoNB v0.11.1 every widget's Done() ends in firstUpdate.Wait(),
// which returns only when a browser has answered, so a headless run hangs there. And any call
// of gonbui/comms (Subscribe, Send, Listen, ReadValue) makes the kernel bootstrap its browser
// connection (internal/comms.State.InstallWebSocket): it waits up to 3 s for an answer and
// publishes its bootstrap <script> as an ordinary display_data output, which a headless run
// keeps in the saved notebook (the page then fails to connect when the HTML is opened). So
// Explore touches comms only when the kernel was started by a Jupyter server, builds its own
// controls, and bounds every wait by a timeout.

// Control is one input of an Explore: a Slider, a LogSlider or a Select.
type Control interface {
	spec() (control, error)
}

// Slider is a control for a number on a linear scale, from Min to Max (finite, Min < Max) in
// Steps equal steps (0 means 100; at most 1000). Value, between Min and Max, is the initial
// value; it is rounded to the nearest step, so that the first figure is one the slider can
// show again. Values reach Draw in the field's unit (the one named by Unit).
type Slider struct {
	Name   string  // the name Draw reads the value by, and the label, e.g. "Qf"
	Unit   string  // the unit shown after the value, e.g. "cm⁻²"; empty for none
	Min    float64 // lowest value, in Unit
	Max    float64 // highest value, in Unit
	Value  float64 // initial value, in Unit
	Steps  int     // number of steps from Min to Max; 0 means 100
	Format string  // fmt verb for the shown value, e.g. "%.2g"; empty means "%.3g"
}

// LogSlider is a control for a positive number on a logarithmic scale, for quantities that span
// decades (Dit, Δn): from Min to Max (finite, 0 < Min < Max) in Steps steps of equal ratio (0
// means 100; at most 1000). Value, between Min and Max, is the initial value, rounded to the
// nearest step in log. Values reach Draw in the field's unit.
type LogSlider struct {
	Name   string  // the name Draw reads the value by, and the label, e.g. "Dit"
	Unit   string  // the unit shown after the value, e.g. "cm⁻² eV⁻¹"
	Min    float64 // lowest value, > 0, in Unit
	Max    float64 // highest value, in Unit
	Value  float64 // initial value, in Unit
	Steps  int     // number of steps from Min to Max; 0 means 100
	Format string  // fmt verb for the shown value; empty means "%.2g"
}

// Select is a control that picks one of Options (at least one, all different); Value is the
// index of the initial option. Draw reads the index (Values.Index) or the option (Values.Choice).
type Select struct {
	Name    string   // the name Draw reads the choice by, and the label
	Options []string // the options shown, e.g. {"1e14 cm⁻³", "1e15 cm⁻³"}
	Value   int      // index of the initial option
}

// maxSteps bounds the steps of a slider: every step's label travels to the browser.
const maxSteps = 1000

// control is a validated control: positions 0..len(labels)-1, each with its value (sliders)
// or option (selects) and the label shown.
type control struct {
	name, unit string
	values     []float64 // value at each position; nil for a select
	labels     []string  // label at each position
	initial    int       // initial position
}

func (c control) isSelect() bool { return c.values == nil }

func sliderSpec(kind, name, unit string, lo, hi, v float64, steps int, format string, log bool) (control, error) {
	where := fmt.Sprintf("nb: %s %q", kind, name)
	switch {
	case strings.TrimSpace(name) == "":
		return control{}, fmt.Errorf("nb: %s: Name must not be empty", kind)
	case math.IsNaN(lo) || math.IsInf(lo, 0) || math.IsNaN(hi) || math.IsInf(hi, 0):
		return control{}, fmt.Errorf("%s: Min and Max must be finite, got %g and %g", where, lo, hi)
	case log && !(lo > 0):
		return control{}, fmt.Errorf("%s: Min must be > 0 on a log scale, got %g", where, lo)
	case !(lo < hi):
		return control{}, fmt.Errorf("%s: Min must be < Max, got %g and %g", where, lo, hi)
	case !(v >= lo && v <= hi):
		return control{}, fmt.Errorf("%s: Value must be within [Min, Max] = [%g, %g], got %g", where, lo, hi, v)
	case steps < 0 || steps > maxSteps:
		return control{}, fmt.Errorf("%s: Steps must be within [0, %d] (0 means 100), got %d", where, maxSteps, steps)
	}
	if steps == 0 {
		steps = 100
	}
	c := control{name: name, unit: unit, values: make([]float64, steps+1)}
	x := v
	if log {
		floats.LogSpan(c.values, lo, hi)
		x = math.Log(v)
	} else {
		floats.Span(c.values, lo, hi)
	}
	// The initial position is the step nearest to Value (in log for a log scale).
	best := math.Inf(1)
	for i, g := range c.values {
		if log {
			g = math.Log(g)
		}
		if d := math.Abs(g - x); d < best {
			best, c.initial = d, i
		}
	}
	// gonum's spans carry a few ulp (LogSpan exponentiates a span of ln x: 1e10..1e13 gives
	// 1.0000000000000004e10): round every step to 12 significant digits, so that the ends and
	// round values such as 10 or 1e11 reach Draw exactly; a step is far coarser than that.
	for i, g := range c.values {
		c.values[i], _ = strconv.ParseFloat(strconv.FormatFloat(g, 'g', 12, 64), 64)
	}
	c.labels = make([]string, len(c.values))
	for i, g := range c.values {
		c.labels[i] = fmt.Sprintf(format, g)
	}
	return c, nil
}

func (s Slider) spec() (control, error) {
	f := s.Format
	if f == "" {
		f = "%.3g"
	}
	return sliderSpec("Slider", s.Name, s.Unit, s.Min, s.Max, s.Value, s.Steps, f, false)
}

func (s LogSlider) spec() (control, error) {
	f := s.Format
	if f == "" {
		f = "%.2g"
	}
	return sliderSpec("LogSlider", s.Name, s.Unit, s.Min, s.Max, s.Value, s.Steps, f, true)
}

func (s Select) spec() (control, error) {
	if strings.TrimSpace(s.Name) == "" {
		return control{}, fmt.Errorf("nb: Select: Name must not be empty")
	}
	if len(s.Options) == 0 || len(s.Options) > maxSteps {
		return control{}, fmt.Errorf("nb: Select %q: want 1 to %d Options, got %d", s.Name, maxSteps, len(s.Options))
	}
	seen := make(map[string]bool, len(s.Options))
	for _, o := range s.Options {
		if seen[o] {
			return control{}, fmt.Errorf("nb: Select %q: option %q appears twice", s.Name, o)
		}
		seen[o] = true
	}
	if s.Value < 0 || s.Value >= len(s.Options) {
		return control{}, fmt.Errorf("nb: Select %q: Value must be an option index within [0, %d], got %d", s.Name, len(s.Options)-1, s.Value)
	}
	return control{name: s.Name, labels: append([]string(nil), s.Options...), initial: s.Value}, nil
}

// Values holds the controls' current values, as Draw receives them. Reading a name that is not
// a control's (or a slider's name with Index or Choice, a select's with Get) returns the zero
// value and makes the exploration show an error naming it instead of the figure, never a
// silent wrong figure. The zero Values has no controls.
type Values struct {
	controls []control
	pos      []int
	misses   *[]string
}

func (v Values) find(name string, wantSelect bool) (control, int, bool) {
	for i, c := range v.controls {
		if c.name == name && c.isSelect() == wantSelect {
			return c, v.pos[i], true
		}
	}
	if v.misses != nil {
		*v.misses = append(*v.misses, name)
	}
	return control{}, 0, false
}

// Get returns the value of the slider (Slider or LogSlider) named name, in its unit.
func (v Values) Get(name string) float64 {
	c, p, ok := v.find(name, false)
	if !ok {
		return 0
	}
	return c.values[p]
}

// Index returns the index of the option chosen in the Select named name.
func (v Values) Index(name string) int {
	_, p, _ := v.find(name, true)
	return p
}

// Choice returns the option chosen in the Select named name.
func (v Values) Choice(name string) string {
	c, p, ok := v.find(name, true)
	if !ok {
		return ""
	}
	return c.labels[p]
}

// String returns the values as shown, e.g. "Qf = -2e+12 cm⁻², Dit = 1e+11 cm⁻² eV⁻¹".
func (v Values) String() string {
	parts := make([]string, len(v.controls))
	for i, c := range v.controls {
		parts[i] = c.name + " = " + c.labels[v.pos[i]]
		if c.unit != "" {
			parts[i] += " " + c.unit
		}
	}
	return strings.Join(parts, ", ")
}

// View is what Draw returns for one set of values: a plot or a figure of panels, and optionally
// a small table under it.
type View struct {
	Plot    *plot.Plot    // a single plot, shown like Show; or
	Figure  *plots.Figure // panels, shown like ShowFigure (set exactly one of Plot and Figure)
	Caption string        // caption of Table
	Table   []Column      // optional table under the figure, shown like Columns
}

// Explore binds controls to a figure that redraws when they move. Draw computes the View for
// the controls' values; Models, if set, adds the provenance footer under it (see FooterHTML).
//
// In a notebook open in a browser (JupyterLab or Notebook), Run shows the controls above the
// figure; moving one calls Draw again and replaces the figure in place, and an error from Draw
// (or a panic in it) shows in the figure's place while the controls stay live. The cell keeps
// running while the controls are live, as every GoNB cell that listens to the browser does:
// other cells wait until the Done button is pressed, the controls have been idle for Idle, or
// the kernel is interrupted; the figure of the last values stays.
//
// Headless (jupyter nbconvert --execute, a test, go run), Run shows the figure at the initial
// values with a one-line note that the controls are live in an interactive session, and
// returns at once: it sends nothing to the browser side, so no wait and no browser script are
// left in the saved notebook. Run decides which case it is in from the process that started
// the GoNB kernel (the environment variable JPY_PARENT_PID, its command line read from /proc,
// so on systems without /proc set PVREC_LIVE=1 for live controls): a Jupyter server (jupyter-lab,
// jupyter-notebook, jupyter-server, jupyter-nbclassic, jupyterhub-singleuser) serves
// browsers; anything else (nbconvert, nbclient, papermill) does not. The environment variable
// PVREC_LIVE=0 forces the headless rendering, PVREC_LIVE=1 the interactive one. Even in a
// Jupyter server, if no browser answers within a few seconds Run falls back to the headless
// rendering and returns.
type Explore struct {
	Controls []Control
	Draw     func(Values) (View, error)
	Models   fmt.Stringer  // model set named in the footer under the figure; nil for no footer
	Idle     time.Duration // interactive: the controls freeze after this long without a change; 0 means 15 min
}

// Run shows the exploration (see Explore). It returns an error, and shows nothing, if a control
// is invalid, two controls share a name, Draw is nil, or Draw fails at the initial values;
// errors of Draw at later values show in the figure's place instead.
func (e Explore) Run() error {
	cs, err := e.controls()
	if err != nil {
		return err
	}
	first := Values{controls: cs, pos: initialPositions(cs)}
	area, err := e.render(first)
	if err != nil {
		return err
	}
	if !liveSession() {
		gonbui.DisplayHTML(noteHTML(first, staticNote))
		gonbui.DisplayHTML(area)
		gonbui.Sync()
		return nil
	}
	e.interact(first, area)
	return nil
}

// controls validates the controls and Draw.
func (e Explore) controls() ([]control, error) {
	if e.Draw == nil {
		return nil, fmt.Errorf("nb: Explore: Draw must be set")
	}
	if len(e.Controls) == 0 {
		return nil, fmt.Errorf("nb: Explore: want at least one control")
	}
	if e.Idle < 0 {
		return nil, fmt.Errorf("nb: Explore: Idle must be >= 0, got %v", e.Idle)
	}
	cs := make([]control, len(e.Controls))
	seen := make(map[string]bool)
	for i, c := range e.Controls {
		if c == nil {
			return nil, fmt.Errorf("nb: Explore: control %d is nil", i)
		}
		s, err := c.spec()
		if err != nil {
			return nil, err
		}
		if seen[s.name] {
			return nil, fmt.Errorf("nb: Explore: two controls are named %q", s.name)
		}
		seen[s.name] = true
		cs[i] = s
	}
	return cs, nil
}

func initialPositions(cs []control) []int {
	p := make([]int, len(cs))
	for i, c := range cs {
		p[i] = c.initial
	}
	return p
}

// render calls Draw for v and returns the HTML of its view: the figure, the table and the
// footer. A panic in Draw, a name Draw read that no control has, and a view without exactly
// one of Plot and Figure are errors.
func (e Explore) render(v Values) (h string, err error) {
	var misses []string
	v.misses = &misses
	defer func() {
		if p := recover(); p != nil {
			h, err = "", fmt.Errorf("nb: Explore: Draw panicked at %v: %v", v, p)
		}
	}()
	view, err := e.Draw(v)
	if err != nil {
		return "", fmt.Errorf("nb: Explore: Draw at %v: %w", v, err)
	}
	if len(misses) > 0 {
		names := make([]string, len(v.controls))
		for i, c := range v.controls {
			names[i] = fmt.Sprintf("%q", c.name)
		}
		return "", fmt.Errorf("nb: Explore: Draw read %q, which is not the name of a control of that kind (the controls are %s)", misses[0], strings.Join(names, ", "))
	}
	var svg []byte
	switch {
	case (view.Plot == nil) == (view.Figure == nil):
		return "", fmt.Errorf("nb: Explore: Draw must return a View with exactly one of Plot and Figure")
	case view.Plot != nil:
		svg, err = plots.SVGInline(view.Plot)
	default:
		svg, err = view.Figure.SVGInline()
	}
	if err != nil {
		return "", fmt.Errorf("nb: Explore: %v", err)
	}
	h = FigureHTML(svg)
	if view.Table != nil {
		t, err := ColumnsHTML(view.Caption, view.Table...)
		if err != nil {
			return "", fmt.Errorf("nb: Explore: table: %w", err)
		}
		h += t
	}
	if e.Models != nil {
		h += FooterHTML(e.Models)
	}
	return h, nil
}

const (
	staticNote = "The controls are live when this notebook runs in Jupyter with a browser; this is the figure at their initial values."
	noAnswer   = "No browser answered, so the controls are not live; this is the figure at their initial values."
)

// noteHTML returns the one-line note shown in place of the controls: the values and a remark.
func noteHTML(v Values, remark string) string {
	return fmt.Sprintf(`<p style="font-family:sans-serif;font-size:0.9em;color:#333"><b>%s</b> · <span style="color:#666">%s</span></p>`,
		html.EscapeString(v.String()), html.EscapeString(remark))
}

// liveSession reports whether a browser may answer: the program runs under GoNB and the kernel
// was started by a Jupyter server (or PVREC_LIVE says so).
func liveSession() bool {
	if !gonbui.IsNotebook {
		return false
	}
	switch os.Getenv("PVREC_LIVE") {
	case "0":
		return false
	case "1":
		return true
	}
	pid, err := strconv.Atoi(os.Getenv("JPY_PARENT_PID"))
	if err != nil || pid <= 0 {
		return false
	}
	b, err := os.ReadFile(fmt.Sprintf("/proc/%d/cmdline", pid))
	if err != nil {
		return false
	}
	return servesBrowsers(strings.Split(strings.TrimRight(string(b), "\x00"), "\x00"))
}

// servesBrowsers reports whether the command line args is that of a Jupyter server, which
// serves notebooks to browsers: jupyter-lab, jupyter-notebook, jupyter-server,
// jupyter-nbclassic or jupyterhub-singleuser, run directly, as "jupyter lab" (and so on) or
// as "python -m jupyterlab" (and so on).
func servesBrowsers(args []string) bool {
	for i, a := range args {
		switch filepath.Base(a) {
		case "jupyter-lab", "jupyter-notebook", "jupyter-server", "jupyter-nbclassic", "jupyterhub-singleuser":
			return true
		case "jupyter":
			if i+1 < len(args) {
				switch args[i+1] {
				case "lab", "notebook", "server", "nbclassic":
					return true
				}
			}
			return false
		case "-m":
			if i+1 < len(args) {
				switch args[i+1] {
				case "jupyterlab", "notebook", "jupyter_server", "nbclassic":
					return true
				}
			}
			return false
		}
	}
	return false
}

//go:embed explore.js
var exploreJS string

var exploreTmpl = template.Must(template.New("explore").Parse(exploreJS))

// answerWait is how long Run waits, after the controls reached the kernel, for the browser's
// first message before it falls back to the headless rendering. The kernel itself waits up to
// 3 s for the browser connection before it passes the controls on.
var answerWait = 10 * time.Second

// messages collects the browser's messages "seq;p0,p1,..." (positions) or "seq;done", keeping
// the newest: GoNB delivers each message in its own goroutine, so they may arrive out of order.
type messages struct {
	mu     sync.Mutex
	seq    int
	latest string
	ready  chan struct{}
}

func (m *messages) put(msg string) {
	i := strings.IndexByte(msg, ';')
	if i < 0 {
		return
	}
	seq, err := strconv.Atoi(msg[:i])
	if err != nil {
		return
	}
	m.mu.Lock()
	if seq > m.seq {
		m.seq, m.latest = seq, msg[i+1:]
	}
	m.mu.Unlock()
	select {
	case m.ready <- struct{}{}:
	default:
	}
}

func (m *messages) get() string {
	m.mu.Lock()
	defer m.mu.Unlock()
	return m.latest
}

// parsePositions reads "p0,p1,..." into positions for cs, checking count and range.
func parsePositions(msg string, cs []control) ([]int, error) {
	f := strings.Split(msg, ",")
	if len(f) != len(cs) {
		return nil, fmt.Errorf("nb: Explore: the browser sent %d positions for %d controls (%q)", len(f), len(cs), msg)
	}
	p := make([]int, len(cs))
	for i, s := range f {
		k, err := strconv.Atoi(s)
		if err != nil || k < 0 || k >= len(cs[i].labels) {
			return nil, fmt.Errorf("nb: Explore: the browser sent position %q for control %q, which has %d positions", s, cs[i].name, len(cs[i].labels))
		}
		p[i] = k
	}
	return p, nil
}

// interact runs the live session: controls and figure in display blocks that update in place.
func (e Explore) interact(first Values, area string) {
	uid := gonbui.UniqueId()
	addr := "/pvrec/explore/" + uid
	ctlID, figID := "pvrec_explore_ctl_"+uid, "pvrec_explore_fig_"+uid
	m := &messages{seq: 0, ready: make(chan struct{}, 1)}
	// Never unsubscribed: the subscription ends with the cell's program. In GoNB v0.11.1 a value
	// arriving for an address without subscribers returns from comms.dispatchValueUpdates with
	// its lock held, which would block every later comms call of the cell.
	comms.Subscribe(addr, func(_ string, v string) { m.put(v) })
	js, err := controlsHTML(first, uid, addr)
	if err != nil { // a bug in the template: show the initial state
		gonbui.DisplayHTML(ErrorHTML(err))
		gonbui.DisplayHTML(area)
		gonbui.Sync()
		return
	}
	gonbui.UpdateHTML(ctlID, js)
	gonbui.UpdateHTML(figID, area)
	gonbui.Sync()

	idle := e.Idle
	if idle == 0 {
		idle = 15 * time.Minute
	}
	timer := time.NewTimer(answerWait)
	defer timer.Stop()
	answered := false
	cur := first
	for {
		select {
		case <-timer.C:
			if !answered {
				gonbui.UpdateHTML(ctlID, noteHTML(cur, noAnswer))
			} else {
				gonbui.UpdateHTML(ctlID, noteHTML(cur, fmt.Sprintf("The controls froze after %v without a change; run the cell again to explore further.", idle)))
			}
			gonbui.Sync()
			return
		case <-m.ready:
		}
		answered = true
		timer.Reset(idle)
		msg := m.get()
		if msg == "done" {
			gonbui.UpdateHTML(ctlID, noteHTML(cur, "Done: the figure shows these values; run the cell again to explore further."))
			gonbui.Sync()
			return
		}
		p, err := parsePositions(msg, first.controls)
		if err != nil {
			gonbui.UpdateHTML(figID, ErrorHTML(err))
			continue
		}
		if samePositions(cur.pos, p) { // the browser's first message, or a move back and forth
			continue
		}
		cur = Values{controls: first.controls, pos: p}
		h, err := e.render(cur)
		if err != nil {
			h = ErrorHTML(err)
		}
		gonbui.UpdateHTML(figID, h)
	}
}

func samePositions(a, b []int) bool {
	return slices.Equal(a, b)
}

// controlsHTML returns the HTML of the live controls and the script that sends their positions
// to addr.
func controlsHTML(v Values, uid, addr string) (string, error) {
	var b strings.Builder
	b.WriteString(`<table style="font-family:sans-serif;font-size:0.9em;border-collapse:collapse">`)
	type ctl struct {
		ID     string
		Out    string
		Labels []string
	}
	ctls := make([]ctl, len(v.controls))
	for i, c := range v.controls {
		id := fmt.Sprintf("pvrec_%s_%d", uid, i)
		ctls[i] = ctl{ID: id, Out: id + "_out", Labels: c.labels}
		fmt.Fprintf(&b, `<tr><td style="padding:2px 8px;text-align:right"><b>%s</b></td><td style="padding:2px 8px">`, html.EscapeString(c.name))
		if c.isSelect() {
			fmt.Fprintf(&b, `<select id="%s">`, id)
			for k, o := range c.labels {
				sel := ""
				if k == v.pos[i] {
					sel = " selected"
				}
				fmt.Fprintf(&b, `<option value="%d"%s>%s</option>`, k, sel, html.EscapeString(o))
			}
			b.WriteString(`</select></td><td></td></tr>`)
			ctls[i].Labels = nil
			continue
		}
		fmt.Fprintf(&b, `<input type="range" id="%s" min="0" max="%d" value="%d" style="width:320px"/></td>`, id, len(c.labels)-1, v.pos[i])
		fmt.Fprintf(&b, `<td style="padding:2px 8px"><span id="%s">%s</span> %s</td></tr>`, id+"_out", html.EscapeString(c.labels[v.pos[i]]), html.EscapeString(c.unit))
	}
	status := "pvrec_" + uid + "_status"
	done := "pvrec_" + uid + "_done"
	fmt.Fprintf(&b, `<tr><td></td><td style="padding:2px 8px"><button id="%s">Done</button> <span id="%s" style="color:#666"></span></td><td></td></tr></table>`, done, status)
	cfg, err := json.Marshal(struct {
		Address, Status, Done string
		Controls              []ctl
	}{addr, status, done, ctls})
	if err != nil {
		return "", err
	}
	var js bytes.Buffer
	if err := exploreTmpl.Execute(&js, struct{ Config string }{string(cfg)}); err != nil {
		return "", err
	}
	return b.String() + "<script>" + js.String() + "</script>", nil
}
