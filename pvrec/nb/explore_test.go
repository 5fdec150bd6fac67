package nb

import (
	"encoding/gob"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"github.com/janpfeifer/gonb/gonbui"
	"github.com/janpfeifer/gonb/gonbui/protocol"

	"github.com/pvrec/pvrec/pvrec/plots"
)

// The expected behaviour here is the exploration's own design (common practice for notebook
// controls, no source): end points exact, steps of equal size (linear) or ratio (log), the
// initial value rounded to the nearest step.

func TestSliderSteps(t *testing.T) {
	c, err := Slider{Name: "Qf", Unit: "cm⁻²", Min: -4e12, Max: 4e12, Value: -2.04e12, Steps: 80}.spec()
	if err != nil {
		t.Fatal(err)
	}
	if len(c.values) != 81 || c.values[0] != -4e12 || c.values[80] != 4e12 {
		t.Fatalf("positions %d, ends %g %g", len(c.values), c.values[0], c.values[len(c.values)-1])
	}
	// -2.04e12 is nearest to the step -2e12 (position 20 of 80 steps of 1e11).
	if c.initial != 20 || c.values[20] != -2e12 {
		t.Errorf("initial position %d (value %g), want 20 (-2e12)", c.initial, c.values[c.initial])
	}
	for i := 1; i < len(c.values); i++ {
		if d := c.values[i] - c.values[i-1]; math.Abs(d/1e11-1) > 1e-9 {
			t.Fatalf("step %d is %g, want 1e11", i, d)
		}
	}

	l, err := LogSlider{Name: "Dit", Min: 1e10, Max: 1e13, Value: 1.3e11, Steps: 30}.spec()
	if err != nil {
		t.Fatal(err)
	}
	if l.values[0] != 1e10 || l.values[10] != 1e11 || l.values[20] != 1e12 || l.values[30] != 1e13 {
		t.Errorf("log decades %v", l.values)
	}
	// Ten steps per decade: the ratio of neighbours is 10^0.1, up to the rounding of each step
	// to 12 significant digits (at most 5e-12 relative each, so 1e-11 for a ratio).
	for i := 1; i < len(l.values); i++ {
		if r := l.values[i] / l.values[i-1]; math.Abs(r/math.Pow(10, 0.1)-1) > 1e-11 {
			t.Fatalf("ratio %d is %g", i, r)
		}
	}
	// 1.3e11 lies at 10^11.114: nearest in log is 10^11.1 (position 11), not 10^11.2.
	if l.initial != 11 {
		t.Errorf("log initial position %d, want 11", l.initial)
	}
	// Rounding in log: the midpoint between 1e11 and 10^11.1 is 10^11.05 = 1.122e11.
	for _, tc := range []struct {
		v    float64
		want int
	}{{1e10, 0}, {1e13, 30}, {1.12e11, 10}, {1.13e11, 11}} {
		s, err := LogSlider{Name: "Dit", Min: 1e10, Max: 1e13, Value: tc.v, Steps: 30}.spec()
		if err != nil || s.initial != tc.want {
			t.Errorf("Value %g: position %d (%v), want %d", tc.v, s.initial, err, tc.want)
		}
	}
	if d, _ := (Slider{Name: "x", Min: 0, Max: 1, Value: 0.5}).spec(); len(d.values) != 101 || d.labels[50] != "0.5" {
		t.Errorf("default steps: %d positions, label %q", len(d.values), d.labels[50])
	}
}

func TestControlErrors(t *testing.T) {
	for _, tc := range []struct {
		c    Control
		want string
	}{
		{Slider{Min: 0, Max: 1}, "Name"},
		{Slider{Name: "a", Min: 1, Max: 1, Value: 1}, "Min must be < Max"},
		{Slider{Name: "a", Min: math.NaN(), Max: 1}, "finite"},
		{Slider{Name: "a", Min: 0, Max: math.Inf(1)}, "finite"},
		{Slider{Name: "a", Min: 0, Max: 1, Value: 2}, "Value"},
		{Slider{Name: "a", Min: 0, Max: 1, Value: math.NaN()}, "Value"},
		{Slider{Name: "a", Min: 0, Max: 1, Steps: -1}, "Steps"},
		{Slider{Name: "a", Min: 0, Max: 1, Steps: 1001}, "Steps"},
		{LogSlider{Name: "Dit", Min: 0, Max: 1e12, Value: 1e11}, "Min must be > 0"},
		{LogSlider{Name: "Dit", Min: -1, Max: 1e12, Value: 1e11}, "Min must be > 0"},
		{LogSlider{Name: "Dit", Min: 1e10, Max: 1e12}, "Value"},
		{Select{Name: "s"}, "Options"},
		{Select{Name: "s", Options: []string{"a", "a"}}, "twice"},
		{Select{Name: "s", Options: []string{"a"}, Value: 1}, "Value"},
		{Select{Options: []string{"a"}}, "Name"},
	} {
		_, err := tc.c.spec()
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%+v: error %v, want one about %s", tc.c, err, tc.want)
		}
	}
	draw := func(Values) (View, error) { return View{}, nil }
	for _, e := range []Explore{
		{},
		{Draw: draw},
		{Draw: draw, Controls: []Control{nil}},
		{Draw: draw, Controls: []Control{Slider{Name: "a", Max: 1}, Select{Name: "a", Options: []string{"x"}}}},
		{Draw: draw, Controls: []Control{Slider{Name: "a", Max: 1}}, Idle: -time.Second},
	} {
		if err := e.Run(); err == nil {
			t.Errorf("%+v accepted", e)
		}
	}
}

// testDraw draws a straight line whose slope is the slider "k", for the level chosen in "level".
func testDraw(calls *[]string) func(Values) (View, error) {
	return func(v Values) (View, error) {
		k, level := v.Get("k"), v.Choice("level")
		if calls != nil {
			*calls = append(*calls, fmt.Sprintf("k=%g level=%s index=%d", k, level, v.Index("level")))
		}
		s, err := plots.Func("line", []float64{0, 1}, func(x float64) (float64, error) { return k * x, nil })
		if err != nil {
			return View{}, err
		}
		p, err := plots.Lines(plots.Axes{Title: "k = " + fmt.Sprint(k), XLabel: "x", YLabel: "y"}, s)
		return View{Plot: p, Caption: "k", Table: []Column{{Name: "k", Values: []float64{k}}}}, err
	}
}

var testControls = []Control{
	LogSlider{Name: "k", Unit: "1/s", Min: 1, Max: 100, Value: 10, Steps: 20},
	Select{Name: "level", Options: []string{"low", "high"}, Value: 1},
}

func TestRenderErrors(t *testing.T) {
	e := Explore{Controls: testControls, Draw: testDraw(nil), Models: fakeModels{}}
	cs, err := e.controls()
	if err != nil {
		t.Fatal(err)
	}
	v := Values{controls: cs, pos: initialPositions(cs)}
	if got, want := v.String(), "k = 10 1/s, level = high"; got != want {
		t.Errorf("Values %q, want %q", got, want)
	}
	h, err := e.render(v)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []string{"<svg", "k = 10", "<table", "download as CSV", "Si 300.00 K"} {
		if !strings.Contains(h, w) {
			t.Errorf("view lacks %q", w)
		}
	}
	for name, draw := range map[string]func(Values) (View, error){
		`read "kk"`:    func(v Values) (View, error) { v.Get("kk"); return testDraw(nil)(v) },
		`read "level"`: func(v Values) (View, error) { v.Get("level"); return testDraw(nil)(v) },
		"panicked":     func(Values) (View, error) { panic("boom") },
		"at k = 10":    func(Values) (View, error) { return View{}, errors.New("no convergence") },
		"exactly one":  func(Values) (View, error) { return View{}, nil },
	} {
		_, err := Explore{Controls: testControls, Draw: draw}.render(v)
		if err == nil || !strings.Contains(err.Error(), name) {
			t.Errorf("%s: error %v", name, err)
		}
	}
	// The initial Draw's error is Run's.
	if err := (Explore{Controls: testControls, Draw: func(Values) (View, error) { panic("boom") }}).Run(); err == nil || !strings.Contains(err.Error(), "panicked") {
		t.Errorf("Run with a panicking Draw: %v", err)
	}
	var zero Values
	if zero.Get("x") != 0 || zero.Choice("x") != "" || zero.Index("x") != 0 || zero.String() != "" {
		t.Errorf("zero Values not empty")
	}
}

func TestServesBrowsers(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want bool
	}{
		{[]string{"/usr/bin/python3", "/usr/bin/jupyter-notebook", "--no-browser"}, true},
		{[]string{"/opt/conda/bin/python", "/opt/conda/bin/jupyter-lab"}, true},
		{[]string{"python3", "/usr/local/bin/jupyter-server"}, true},
		{[]string{"jupyter", "lab", "--port=8888"}, true},
		{[]string{"python", "-m", "jupyterlab"}, true},
		{[]string{"python", "-m", "notebook"}, true},
		{[]string{"/usr/bin/python3", "/usr/bin/jupyter-nbconvert", "--execute", "x.ipynb"}, false},
		{[]string{"jupyter", "nbconvert", "--execute", "jupyter-lab.ipynb"}, false},
		{[]string{"python", "-m", "nbclient"}, false},
		{[]string{"papermill", "in.ipynb", "out.ipynb"}, false},
		{[]string{"/usr/bin/python3", "/usr/bin/jupyter-execute", "x.ipynb"}, false},
		{nil, false},
	} {
		if got := servesBrowsers(tc.args); got != tc.want {
			t.Errorf("%q: %v, want %v", tc.args, got, tc.want)
		}
	}
}

func TestMessages(t *testing.T) {
	cs, _ := Explore{Controls: testControls, Draw: testDraw(nil)}.controls()
	if p, err := parsePositions("20,0", cs); err != nil || p[0] != 20 || p[1] != 0 {
		t.Errorf("parse: %v %v", p, err)
	}
	for _, bad := range []string{"", "1", "1,2,3", "21,0", "-1,0", "x,0", "1,2"} {
		if _, err := parsePositions(bad, cs); err == nil {
			t.Errorf("positions %q accepted", bad)
		}
	}
	// GoNB delivers each message in its own goroutine: an older one arriving late is dropped.
	m := &messages{ready: make(chan struct{}, 1)}
	m.put("2;5,1")
	m.put("1;3,0")
	m.put("garbage")
	if got := m.get(); got != "5,1" {
		t.Errorf("latest %q, want 5,1", got)
	}
}

// fakeKernel plays GoNB's side of the named pipes (gonbui's protocol): it records what the
// program displays, acknowledges gonbui.Sync and, as a browser would, answers a subscription
// with the messages of script.
type fakeKernel struct {
	mu     sync.Mutex
	enc    *gob.Encoder
	got    []protocol.DisplayData
	script []string // messages the "browser" sends after a subscription; nil: no browser
}

var (
	kernelOnce sync.Once
	kernel     *fakeKernel
	kernelErr  error
)

// startKernel makes gonbui talk to a fakeKernel for the rest of the test binary, and returns it.
// gonbui.IsNotebook is set for the calling test only.
func startKernel(t *testing.T) *fakeKernel {
	kernelOnce.Do(func() {
		dir, err := os.MkdirTemp("", "nbkernel")
		if err != nil {
			kernelErr = err
			return
		}
		toKernel, toProgram := filepath.Join(dir, "pipe"), filepath.Join(dir, "back")
		for _, p := range []string{toKernel, toProgram} {
			if err := syscall.Mkfifo(p, 0600); err != nil {
				kernelErr = err
				return
			}
		}
		os.Setenv(protocol.GONB_PIPE_ENV, toKernel)
		os.Setenv(protocol.GONB_PIPE_BACK_ENV, toProgram)
		kernel = &fakeKernel{}
		ready := make(chan struct{})
		go func() {
			w, err := os.OpenFile(toProgram, os.O_WRONLY, 0600)
			if err != nil {
				return
			}
			kernel.mu.Lock()
			kernel.enc = gob.NewEncoder(w)
			kernel.mu.Unlock()
			close(ready)
		}()
		go func() {
			r, err := os.Open(toKernel)
			if err != nil {
				return
			}
			<-ready
			dec := gob.NewDecoder(r)
			for {
				var d protocol.DisplayData
				if dec.Decode(&d) != nil {
					return
				}
				kernel.handle(d)
			}
		}()
	})
	if kernelErr != nil {
		t.Skipf("no named pipes here: %v", kernelErr)
	}
	gonbui.IsNotebook = true
	t.Cleanup(func() { gonbui.IsNotebook = false })
	kernel.mu.Lock()
	kernel.got, kernel.script = nil, nil
	kernel.mu.Unlock()
	return kernel
}

func (k *fakeKernel) send(v protocol.CommValue) {
	k.mu.Lock()
	defer k.mu.Unlock()
	_ = k.enc.Encode(&v)
}

func (k *fakeKernel) handle(d protocol.DisplayData) {
	if v, ok := d.Data[protocol.MIMECommValue].(protocol.CommValue); ok && v.Address == protocol.GonbuiSyncAddress {
		k.send(protocol.CommValue{Address: protocol.GonbuiSyncAckAddress, Value: v.Value})
		return
	}
	k.mu.Lock()
	k.got = append(k.got, d)
	script := k.script
	k.mu.Unlock()
	if s, ok := d.Data[protocol.MIMECommSubscribe].(protocol.CommSubscription); ok && !s.Unsubscribe {
		go func() {
			for _, m := range script {
				time.Sleep(10 * time.Millisecond) // as from a browser: one at a time
				k.send(protocol.CommValue{Address: s.Address, Value: m})
			}
		}()
	}
}

// outputs returns what the program displayed: HTML per display id ("" for plain displays, in
// order), and whether it used the browser channel (comms) at all.
func (k *fakeKernel) outputs() (plain []string, byID map[string][]string, comms bool) {
	k.mu.Lock()
	defer k.mu.Unlock()
	byID = map[string][]string{}
	for _, d := range k.got {
		if _, ok := d.Data[protocol.MIMECommSubscribe]; ok {
			comms = true
		}
		if _, ok := d.Data[protocol.MIMECommValue]; ok {
			comms = true
		}
		h, ok := d.Data[protocol.MIMETextHTML].(string)
		if !ok {
			continue
		}
		if d.DisplayID == "" {
			plain = append(plain, h)
		} else {
			byID[d.DisplayID] = append(byID[d.DisplayID], h)
		}
	}
	return plain, byID, comms
}

// runBounded runs e.Run and fails the test if it has not returned within a minute: a guard
// against a hang, not a timing check.
func runBounded(t *testing.T, e Explore) error {
	t.Helper()
	done := make(chan error, 1)
	go func() { done <- e.Run() }()
	select {
	case err := <-done:
		return err
	case <-time.After(time.Minute):
		t.Fatal("Explore.Run did not return")
		return nil
	}
}

// TestExploreHeadless: under GoNB but not started by a Jupyter server (as in nbconvert), Run
// shows the note and the initial figure, returns, and never touches the browser channel (which
// would leave GoNB's connection script in the saved notebook).
func TestExploreHeadless(t *testing.T) {
	k := startKernel(t)
	t.Setenv("PVREC_LIVE", "")
	t.Setenv("JPY_PARENT_PID", fmt.Sprint(os.Getpid())) // the test binary: not a Jupyter server
	var calls []string
	if err := runBounded(t, Explore{Controls: testControls, Draw: testDraw(&calls)}); err != nil {
		t.Fatal(err)
	}
	plain, byID, comms := k.outputs()
	if comms || len(byID) > 0 {
		t.Errorf("headless run used the browser channel (%v) or display updates (%d)", comms, len(byID))
	}
	if len(plain) != 2 || !strings.Contains(plain[0], "k = 10 1/s, level = high") || !strings.Contains(plain[0], "live when") || !strings.Contains(plain[1], "<svg") {
		t.Errorf("headless outputs %d: %.200q", len(plain), plain)
	}
	if len(calls) != 1 || calls[0] != "k=10 level=high index=1" {
		t.Errorf("Draw calls %q", calls)
	}
	t.Setenv("PVREC_LIVE", "0")
	t.Setenv("JPY_PARENT_PID", "")
	if err := runBounded(t, Explore{Controls: testControls, Draw: testDraw(nil)}); err != nil {
		t.Fatal(err)
	}
	if _, _, comms := k.outputs(); comms {
		t.Errorf("PVREC_LIVE=0 used the browser channel")
	}
}

// TestExploreLive: with a browser answering, moves redraw the figure in place, a bad message
// shows an error there, an error of Draw too, and Done ends the session with the last values.
func TestExploreLive(t *testing.T) {
	k := startKernel(t)
	t.Setenv("PVREC_LIVE", "1")
	k.script = []string{"1;10,1", "2;20,0", "3;99,0", "4;0,0", "5;done"}
	var calls []string
	draw := testDraw(&calls)
	e := Explore{Controls: testControls, Draw: func(v Values) (View, error) {
		if v.Get("k") == 1 {
			return View{}, errors.New("k = 1 is not allowed here")
		}
		return draw(v)
	}}
	if err := runBounded(t, e); err != nil {
		t.Fatal(err)
	}
	_, byID, comms := k.outputs()
	if !comms {
		t.Fatal("live run did not subscribe")
	}
	var ctl, fig []string
	for id, hs := range byID {
		switch {
		case strings.HasPrefix(id, "pvrec_explore_ctl_"):
			ctl = hs
		case strings.HasPrefix(id, "pvrec_explore_fig_"):
			fig = hs
		}
	}
	if len(ctl) != 2 || !strings.Contains(ctl[0], `type="range"`) || !strings.Contains(ctl[0], "<select") || !strings.Contains(ctl[0], "gonb_comm") {
		t.Fatalf("controls %d: %.300q", len(ctl), ctl)
	}
	if !strings.Contains(ctl[1], "Done") || !strings.Contains(ctl[1], "k = 1 1/s, level = low") {
		t.Errorf("final note %q", ctl[1])
	}
	// Initial figure; "1;10,1" is the initial state (no redraw); 20,0 redraws; 99 is out of
	// range; 0,0 is Draw's error.
	if len(fig) != 4 || !strings.Contains(fig[0], "k = 10") || !strings.Contains(fig[1], "k = 100") ||
		!strings.Contains(fig[2], "position") || !strings.Contains(fig[3], "not allowed") {
		t.Errorf("figure updates %d: %.120q", len(fig), fig)
	}
	if want := []string{"k=10 level=high index=1", "k=100 level=low index=0"}; fmt.Sprint(calls) != fmt.Sprint(want) {
		t.Errorf("Draw calls %q, want %q", calls, want)
	}
}

// TestExploreNoAnswer: a Jupyter server but no browser answering: Run falls back to the note
// and returns.
func TestExploreNoAnswer(t *testing.T) {
	k := startKernel(t)
	t.Setenv("PVREC_LIVE", "1")
	defer func(w time.Duration) { answerWait = w }(answerWait)
	answerWait = 50 * time.Millisecond
	if err := runBounded(t, Explore{Controls: testControls, Draw: testDraw(nil)}); err != nil {
		t.Fatal(err)
	}
	_, byID, _ := k.outputs()
	found := false
	for id, hs := range byID {
		if strings.HasPrefix(id, "pvrec_explore_ctl_") {
			found = strings.Contains(hs[len(hs)-1], "No browser answered")
		}
	}
	if !found {
		t.Errorf("no fallback note: %v", byID)
	}
}

// FuzzParsePositions: whatever the browser side sends, positions are either refused or within
// the controls' ranges.
func FuzzParsePositions(f *testing.F) {
	for _, s := range []string{"20,0", "0,1", "", ",", "1,2,3", "-1,0", "999999999999999999999,0", "+3,1", " 2,1"} {
		f.Add(s)
	}
	cs, err := Explore{Controls: testControls, Draw: testDraw(nil)}.controls()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, msg string) {
		p, err := parsePositions(msg, cs)
		if err != nil {
			return
		}
		for i, k := range p {
			if k < 0 || k >= len(cs[i].labels) {
				t.Fatalf("%q: position %d of control %d out of range", msg, k, i)
			}
		}
	})
}
