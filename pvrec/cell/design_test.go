package cell

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// TestDesignBadInput checks that every bad design gives an error starting with "cell:" that
// names the part and the value (issue 10), never a panic or a NaN.
func TestDesignBadInput(t *testing.T) {
	m := fixedMaterial(t)
	good := func() Design { return j0Design(m, 100e-15, 0.04, 0.5) }
	emitter := &j0.Region{Profile: profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.2e-4}, Surface: j0.FixedS(1e4)}
	other := materialAt(t, 300)
	for _, tc := range []struct {
		name string
		edit func(d *Design)
		want []string
	}{
		{"nil material", func(d *Design) { d.Material = nil }, []string{"Material is nil"}},
		{"zero thickness", func(d *Design) { d.Base.Thickness = 0 }, []string{"Thickness", "got 0"}},
		{"NaN thickness", func(d *Design) { d.Base.Thickness = math.NaN() }, []string{"Thickness", "NaN"}},
		{"negative doping", func(d *Design) { d.Base.Na = -1 }, []string{"acceptor density", "-1"}},
		{"front fractions", func(d *Design) { d.Front[1].Fraction = 0.2 }, []string{"front", "add up to 0.9"}},
		{"rear fractions", func(d *Design) { d.Rear[0].Fraction = 1; d.Rear[1].Fraction = 0.05 }, []string{"rear", "add up to 1.05"}},
		{"fraction zero", func(d *Design) { d.Front[0].Fraction = 0 }, []string{`front part "a"`, "(0, 1]", "got 0"}},
		{"fraction above 1", func(d *Design) { d.Rear[1].Fraction = 1.5 }, []string{`rear part "d"`, "got 1.5"}},
		{"negative J0", func(d *Design) { d.Front[1].J0 = -1e-15 }, []string{`front part "b"`, "J0", "-1e-15"}},
		{"NaN J0", func(d *Design) { d.Rear[0].J0 = math.NaN() }, []string{`rear part "c"`, "J0", "NaN"}},
		{"J0 and surface", func(d *Design) { d.Rear[0].Surface = surface.ConstantSeff{S: 1} }, []string{`rear part "c"`, "one of J0"}},
		{"region and surface", func(d *Design) {
			d.Front[0] = Part{Name: "x", Fraction: 0.7, Region: emitter, Surface: surface.ConstantSeff{S: 1}}
		}, []string{`front part "x"`, "one of J0"}},
		{"surface with depth", func(d *Design) { d.Rear[0] = Part{Fraction: 0.95, Surface: surface.ConstantSeff{S: 1}, Depth: 1e-4} }, []string{`rear part "part 1"`, "Depth = 0.0001"}},
		{"negative depth", func(d *Design) { d.Front[0].Depth = -1e-4 }, []string{`front part "a"`, "Depth", "-0.0001"}},
		{"base thinner than its parts", func(d *Design) { d.Front[0].Depth = 100e-4; d.Rear[1].Depth = 80e-4 }, []string{"thickness W = 0.018", "0.01", "0.008"}},
		{"negative J02", func(d *Design) { d.J02 = -1e-9 }, []string{"J02", "-1e-09"}},
		{"negative Rs", func(d *Design) { d.Rs = -0.1 }, []string{"series resistance Rs", "-0.1"}},
		{"infinite Rs", func(d *Design) { d.Rs = math.Inf(1) }, []string{"series resistance Rs", "+Inf"}},
		{"negative Rsh", func(d *Design) { d.Rsh = -100 }, []string{"shunt resistance Rsh", "-100"}},
		{"NaN Rsh", func(d *Design) { d.Rsh = math.NaN() }, []string{"shunt resistance Rsh", "NaN"}},
		{"Jsc zero", func(d *Design) { d.Jsc = 0 }, []string{"Jsc", "> 0", "got 0"}},
		{"Jsc negative", func(d *Design) { d.Jsc = -0.04 }, []string{"Jsc", "-0.04"}},
		{"Pin negative", func(d *Design) { d.Pin = -0.1 }, []string{"incident power Pin", "-0.1"}},
		{"nil mechanism", func(d *Design) { d.Base.Mechanisms = []recomb.Mechanism{nil} }, []string{"mechanism 0 is nil"}},
		{"solver in another material", func(d *Design) {
			d.Solver = j0.NewSolver(j0.Models{Material: other})
			d.Front[0] = Part{Name: "e", Fraction: 0.7, Region: emitter}
		}, []string{"Solver's material", "300.00 K", "is not the cell's material"}},
		{"region the solver rejects", func(d *Design) {
			d.Front[0] = Part{Name: "e", Fraction: 0.7, Region: &j0.Region{Profile: emitter.Profile}}
		}, []string{`front part "e"`, "Region.Surface is nil"}},
	} {
		d := good()
		d.Front = append([]Part(nil), d.Front...)
		d.Rear = append([]Part(nil), d.Rear...)
		tc.edit(&d)
		dev, err := New(d)
		if err == nil {
			t.Errorf("%s: no error (device %v)", tc.name, dev != nil)
			continue
		}
		msg := err.Error()
		if !strings.HasPrefix(msg, "cell: ") {
			t.Errorf("%s: error %q does not start with \"cell: \"", tc.name, msg)
		}
		for _, w := range tc.want {
			if !strings.Contains(msg, w) {
				t.Errorf("%s: error %q does not contain %q", tc.name, msg, w)
			}
		}
	}
}

// TestZeroValues checks that the zero Design and the zero Device return errors, not panics or
// NaNs, and that an ideal side (no parts) and Rsh = 0 (no shunt) are accepted.
func TestZeroValues(t *testing.T) {
	if _, err := New(Design{}); err == nil {
		t.Errorf("New(Design{}): no error")
	}
	var z Device
	var nilDev *Device
	for name, d := range map[string]*Device{"zero": &z, "nil": nilDev} {
		checks := map[string]func() error{
			"Voc":                     func() error { _, err := d.Voc(); return err },
			"OpenCircuit":             func() error { _, err := d.OpenCircuit(); return err },
			"ShortCircuit":            func() error { _, err := d.ShortCircuit(); return err },
			"MaxPower":                func() error { _, err := d.MaxPower(); return err },
			"OperatingPoint":          func() error { _, err := d.OperatingPoint(0.5); return err },
			"Curve":                   func() error { _, err := d.Curve(10); return err },
			"CurveAt":                 func() error { _, err := d.CurveAt([]float64{0}); return err },
			"Solve":                   func() error { _, err := d.Solve(); return err },
			"Losses":                  func() error { _, err := d.Losses(); return err },
			"At":                      func() error { _, err := d.At(300); return err },
			"TemperatureCoefficients": func() error { _, err := d.TemperatureCoefficients(0); return err },
			"Recombination":           func() error { _, err := d.Recombination(0.5); return err },
			"RecombinationAtExcess":   func() error { _, err := d.RecombinationAtExcess(1e15); return err },
			"Implied().Voc": func() error {
				_, err := d.Implied().Voc()
				return err
			},
		}
		for m, f := range checks {
			if err := f(); err == nil {
				t.Errorf("%s Device: %s gave no error", name, m)
			}
		}
		if d.Material() != nil || d.Bulk() != nil || d.BaseThickness() != 0 {
			t.Errorf("%s Device: accessors not zero", name)
		}
	}
	m := fixedMaterial(t)
	dev, err := New(Design{Material: m, Base: Base{Thickness: 0.02, Na: 1e16, Mechanisms: []recomb.Mechanism{recomb.ConstantRadiative{B: 1e-14, EscapeFraction: 1}}}, Jsc: 0.04})
	if err != nil {
		t.Fatal(err)
	}
	r, err := dev.Solve()
	if err != nil {
		t.Fatal(err)
	}
	if !(r.Voc > 0 && r.FF > 0 && r.FF < 1) || len(r.AtVoc.Terms) != 1 || r.Pin != DefaultIncidentPower {
		t.Errorf("bulk-only cell: %+v", r)
	}
}

// TestOutOfRange checks the errors for operating points the models do not allow: a terminal
// voltage below −Jsc·Rs (reverse internal bias) or one that needs Δn above recomb.MaxExcess,
// Curve with fewer than two points, an internal voltage below 0, and a surface model outside
// its range (ExtendedSRH on a base above surface.MaxDopant): errors matching
// pvrec.ErrOutOfRange where a range is exceeded.
func TestOutOfRange(t *testing.T) {
	dev := mustDevice(t, j0Design(fixedMaterial(t), 100e-15, 0.04, 0.5))
	for _, tc := range []struct {
		name    string
		err     func() error
		want    string
		inRange bool
	}{
		{"reverse bias", func() error { _, err := dev.OperatingPoint(-0.03); return err }, "below −Jsc·Rs = -0.02 V", true},
		{"grid in reverse bias", func() error { _, err := dev.CurveAt([]float64{0, 0.5, -1}); return err }, "v = -1 V", true},
		{"beyond MaxExcess", func() error { _, err := dev.Implied().OperatingPoint(3); return err }, "terminal voltage v = 3 V needs a base excess density Δn above recomb.MaxExcess", true},
		{"NaN voltage", func() error { _, err := dev.OperatingPoint(math.NaN()); return err }, "terminal voltage v", false},
		{"one point", func() error { _, err := dev.Curve(1); return err }, "n must be >= 2", false},
		{"no voltages", func() error { _, err := dev.CurveAt(nil); return err }, "no voltages", false},
		{"negative internal voltage", func() error { _, err := dev.Recombination(-0.1); return err }, "voc", false},
		{"negative Δn", func() error { _, err := dev.RecombinationAtExcess(-1); return err }, "Δn", false},
		{"bad step", func() error { _, err := dev.TemperatureCoefficients(-1); return err }, "step", false},
	} {
		err := tc.err()
		if err == nil {
			t.Errorf("%s: no error", tc.name)
			continue
		}
		if !strings.HasPrefix(err.Error(), "cell: ") || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %q, want %q", tc.name, err, tc.want)
		}
		if tc.inRange && !errors.Is(err, pvrec.ErrOutOfRange) {
			t.Errorf("%s: error %q does not match pvrec.ErrOutOfRange", tc.name, err)
		}
	}
	d := fullDesign(t)
	d.Base.Na = 5e18 // above surface.MaxDopant for ExtendedSRH
	heavy := mustDevice(t, d)
	if _, err := heavy.Voc(); !errors.Is(err, pvrec.ErrOutOfRange) || !strings.Contains(err.Error(), "rear: dielectric") {
		t.Errorf("ExtendedSRH on a 5e18 cm^-3 base: error %v, want ErrOutOfRange naming the part", err)
	}
	// A cell without any recombination has no open circuit below recomb.MaxExcess.
	perfect := mustDevice(t, Design{Material: fixedMaterial(t), Base: Base{Thickness: 0.02, Na: 1e16}, Jsc: 0.04})
	if _, err := perfect.Voc(); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("cell without recombination: Voc error %v, want ErrOutOfRange", err)
	}
}

// TestRegionParts checks parts given as a j0.Region: their J0 is the solver's (exactly: the
// same solve), the zero Solver means j0.DefaultModels' mechanisms in the cell's material, the
// depth taken from the base is the junction depth, and a j0.ModelSurface follows the cell's
// material.
func TestRegionParts(t *testing.T) {
	models, err := j0.DefaultModels(300)
	if err != nil {
		t.Fatal(err)
	}
	wafer := profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}
	emitter := j0.Region{Profile: profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.15e-4}, wafer}, Surface: j0.DefaultSurface()}
	want, err := j0.NewSolver(models).Solve(emitter)
	if err != nil {
		t.Fatal(err)
	}
	passivated := j0.Region{Profile: emitter.Profile, Surface: j0.ModelSurface{Model: surface.ConstantSeff{S: 2e3}, Dopant: silicon.Donor}}
	wantPass, err := j0.NewSolver(models).Solve(j0.Region{Profile: emitter.Profile, Surface: j0.FixedS(2e3)})
	if err != nil {
		t.Fatal(err)
	}
	for _, solver := range []j0.Solver{{}, j0.NewSolver(models)} {
		d := Design{
			Material: models.Material, Solver: solver,
			Base:  Base{Thickness: 180e-4, Na: 1.5e16},
			Front: []Part{{Name: "emitter", Fraction: 0.6, Region: &emitter}, {Name: "passivated", Fraction: 0.4, Region: &passivated}},
			Jsc:   0.04,
		}
		dev := mustDevice(t, d)
		b, err := dev.Recombination(0.6)
		if err != nil {
			t.Fatal(err)
		}
		if e := relErr(b.Terms[0].J0, 0.6*want.J0); e > 1e-12 {
			t.Errorf("region J0 at 0.6 V: %g, want 0.6 × %g", b.Terms[0].J0, want.J0)
		}
		if e := relErr(b.Terms[1].J0, 0.4*wantPass.J0); e > 1e-12 {
			t.Errorf("ModelSurface region J0: %g, want 0.4 × %g", b.Terms[1].J0, wantPass.J0)
		}
		if e := relErr(dev.BaseThickness(), 180e-4-want.Junction); e > 1e-12 {
			t.Errorf("base thickness %g cm, want W − junction depth %g cm", dev.BaseThickness(), want.Junction)
		}
	}
}

// TestStrings checks that the printed tables carry their units, every term and the material's
// model set (provenance), and that Metallised sums the contacted fractions.
func TestStrings(t *testing.T) {
	dev := mustDevice(t, fullDesign(t))
	front, rear := dev.Metallised()
	if front != 0.04 || rear != 0.03 {
		t.Errorf("metallised fractions %g, %g, want 0.04, 0.03", front, rear)
	}
	l, err := dev.Losses()
	if err != nil {
		t.Fatal(err)
	}
	tc, err := dev.TemperatureCoefficients(0)
	if err != nil {
		t.Fatal(err)
	}
	model := dev.Material().String()
	for name, s := range map[string]string{"Result": l.Cell.String(), "Losses": l.String()} {
		for _, w := range []string{model, "mV", "fA/cm²", "%", "front: emitter", "rear: dielectric", "base: SRH", "second diode J02", "shunt Rsh"} {
			if !strings.Contains(s, w) {
				t.Errorf("%s.String() lacks %q:\n%s", name, w, s)
			}
		}
	}
	if s := l.String(); !strings.Contains(s, "series Rs") || !strings.Contains(s, "ΔVoc (mV)") {
		t.Errorf("Losses.String() lacks the Rs row or the ΔVoc column:\n%s", s)
	}
	if s := tc.String(); !strings.Contains(s, "mV/K") || !strings.Contains(s, "note: ") {
		t.Errorf("TempCoefficients.String():\n%s", s)
	}
	for k, want := range map[Kind]string{KindRegion: "region", KindSurface: "surface", KindBulk: "bulk", KindSecondDiode: "second diode", KindShunt: "shunt", KindSeries: "series resistance", 0: "Kind(0)"} {
		if k.String() != want {
			t.Errorf("Kind(%d).String() = %q, want %q", k, k, want)
		}
	}
}
