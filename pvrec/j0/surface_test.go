package j0

import (
	"errors"
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// TestModelSurface: the adapter from package surface's models to a region's front surface.
// A ConstantSeff must give the J0 of the same FixedS bit for bit (identity); a ConstantJ0s
// must give S = J0s (ns + Δn)/(q ni,eff²) (the relation of surface.SeffFromJ0s with
// n0 = ns, p0 = ni,eff²/ns, to rounding); an ExtendedSRH on a degenerate surface is outside
// its validity (pvrec.ErrOutOfRange).
func TestModelSurface(t *testing.T) {
	models := mustModels(t, SimpleModels)
	s := NewSolver(models)
	prof := emitter(1e19, 0.3e-4, 1e16)
	want, err := s.Solve(Region{Profile: prof, Surface: FixedS(3e3)})
	if err != nil {
		t.Fatal(err)
	}
	ms := ModelSurface{Model: surface.ConstantSeff{S: 3e3}, Material: models.Material, Dopant: silicon.Donor}
	got, err := s.Solve(Region{Profile: prof, Surface: ms})
	if err != nil {
		t.Fatal(err)
	}
	if got.J0 != want.J0 {
		t.Errorf("ConstantSeff via ModelSurface: J0 %g, FixedS %g", got.J0, want.J0)
	}

	const ns, j0s = 1e18, 1e-14
	v, err := ModelSurface{Model: surface.ConstantJ0s{J0s: j0s}, Material: models.Material, Dopant: silicon.Donor}.Velocity(ns)
	if err != nil {
		t.Fatal(err)
	}
	ni := models.Material.Ni() // SimpleModels: no narrowing, Boltzmann, so ni,eff = ni
	p0 := ni * ni / ns
	wantS := j0s * (ns + p0 + LowInjection*ns) / (silicon.ElementaryCharge * ni * ni)
	if e := math.Abs(v/wantS - 1); e > 1e-12 {
		t.Errorf("ConstantJ0s: S = %g, want %g (rel. err %.1e)", v, wantS, e)
	}

	esrh := surface.NewExtendedSRH(surface.ConstantDit{D: 1e11}, surface.ConstantSigma(1e-16), surface.ConstantSigma(1e-16), 1e12)
	if _, err := (ModelSurface{Model: esrh, Material: models.Material, Dopant: silicon.Donor}).Velocity(1e20); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("ExtendedSRH at 1e20 cm^-3: err = %v, want ErrOutOfRange", err)
	}
	if v, err := (ModelSurface{Model: esrh, Material: models.Material, Dopant: silicon.Acceptor}).Velocity(1e17); err != nil || !(v > 0) {
		t.Errorf("ExtendedSRH at 1e17 cm^-3: S = %g, err %v", v, err)
	}

	for name, m := range map[string]ModelSurface{
		"zero":        {},
		"no material": {Model: surface.ConstantSeff{S: 1}, Dopant: silicon.Donor},
		"no dopant":   {Model: surface.ConstantSeff{S: 1}, Material: models.Material},
	} {
		if _, err := m.Velocity(1e19); err == nil {
			t.Errorf("%s: no error", name)
		}
	}
	if _, err := ms.Velocity(math.NaN()); err == nil {
		t.Error("NaN ns: no error")
	}
}
