package uncertainty_test

import (
	"reflect"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// TestMembers: the family's size, its default member and the exclusion rules hold for every
// member (the rules are those of Members' doc comment and docs/model-catalogue.md).
func TestMembers(t *testing.T) {
	for _, c := range []struct {
		c    uncertainty.Case
		want int
	}{
		// (3 ni with Schenk1998 + the apparent BGN models with the default ni) × mobility × pairs.
		{uncertainty.Case{T: 300, Dopant: silicon.Donor}, (3 + 2) * 2 * 2},
		{uncertainty.Case{T: 300, Dopant: silicon.Donor, Arsenic: true}, (3 + 2) * 2 * 2},
		{uncertainty.Case{T: 300, Dopant: silicon.Donor, Superseded: true}, (3 + 3) * 2 * 2},
		{uncertainty.Case{T: 300, Dopant: silicon.Acceptor}, (3 + 1) * 2 * 2},
		{uncertainty.Case{T: 300, Dopant: silicon.Acceptor, SkipRecombination: true}, (3 + 1) * 2},
		// 308 K: no Masetti1983 (295–305 K).
		{uncertainty.Case{T: 308, Dopant: silicon.Donor}, (3 + 2) * 1 * 2},
		// 350 K: Couderc2014 and SproulGreen1991 (275–375 K); Klaassen1992; no recombination.
		{uncertainty.Case{T: 350, Dopant: silicon.Donor, SkipRecombination: true}, (2 + 2) * 1},
	} {
		ms, err := uncertainty.Members(c.c)
		if err != nil {
			t.Fatalf("%+v: %v", c.c, err)
		}
		if len(ms) != c.want {
			t.Errorf("%+v: %d members, want %d", c.c, len(ms), c.want)
		}
		names := map[string]bool{}
		defaults := 0
		for i, m := range ms {
			if names[m.Name] {
				t.Errorf("%+v: name %q twice", c.c, m.Name)
			}
			names[m.Name] = true
			if m.Default {
				defaults++
				if i != 0 {
					t.Errorf("%+v: default member at %d, want 0", c.c, i)
				}
			}
			_, schenk := m.Set.BGN.(silicon.Schenk1998)
			if schenk != (m.Set.Statistics == silicon.FermiDirac) {
				t.Errorf("%+v: %s: BGN %T with %v statistics", c.c, m.Name, m.Set.BGN, m.Set.Statistics)
			}
			if _, ok := m.Set.BGN.(silicon.DelAlamoSwanson1987); ok && c.c.Dopant != silicon.Donor {
				t.Errorf("%+v: %s: n-type BGN for a p+ case", c.c, m.Name)
			}
			if _, ok := m.Set.BGN.(silicon.SlotboomDeGraaff1976); ok && !c.c.Superseded {
				t.Errorf("%+v: %s: superseded BGN without Case.Superseded", c.c, m.Name)
			}
			if !schenk && !reflect.DeepEqual(m.Set.Intrinsic, silicon.IntrinsicDensity(silicon.NewCouderc2014())) {
				t.Errorf("%+v: %s: apparent BGN with ni %v, want the default only", c.c, m.Name, m.Set.Intrinsic)
			}
			if _, ok := m.Set.Intrinsic.(silicon.Altermatt2003); ok {
				t.Errorf("%+v: %s: Altermatt2003, a near-duplicate of Couderc2014 at 300 K", c.c, m.Name)
			}
			for r := uncertainty.Role(0); r < uncertainty.NumRoles; r++ {
				if m.Choice[r] == "" && !(r == uncertainty.RoleRecombination && c.c.SkipRecombination) {
					t.Errorf("%+v: %s: no choice named for %v", c.c, m.Name, r)
				}
			}
			if mob, ok := m.Set.Mobility.(silicon.Masetti1983); ok && (mob == silicon.NewMasetti1983Arsenic()) != c.c.Arsenic {
				t.Errorf("%+v: %s: Masetti electron set %v", c.c, m.Name, mob)
			}
			pair := recomb.Intrinsic{Auger: m.Auger, Radiative: m.Radiative}
			if c.c.SkipRecombination {
				if m.Auger != nil || m.Radiative != nil {
					t.Errorf("%+v: %s: recombination set", c.c, m.Name)
				}
			} else if !reflect.DeepEqual(pair, recomb.NewIntrinsic()) && !reflect.DeepEqual(pair, recomb.NewKerrCuevas2002Intrinsic()) {
				t.Errorf("%+v: %s: unpublished pair %v", c.c, m.Name, pair)
			}
			if _, err := m.Set.At(c.c.T); err != nil {
				t.Errorf("%+v: %s: %v", c.c, m.Name, err)
			}
		}
		if defaults != 1 {
			t.Errorf("%+v: %d default members", c.c, defaults)
		}
		def := ms[0]
		if !reflect.DeepEqual(def.Set, silicon.DefaultModelSet()) {
			t.Errorf("%+v: default set %v", c.c, def.Set)
		}
		if !c.c.SkipRecombination && (!reflect.DeepEqual(def.Auger, recomb.Mechanism(recomb.NewRichter2012())) || !reflect.DeepEqual(def.Radiative, recomb.Mechanism(recomb.NewTrupke2003()))) {
			t.Errorf("%+v: default recombination %v + %v", c.c, def.Auger, def.Radiative)
		}
	}
}

// TestMembersErrors: an invalid case is an error naming the field; a temperature at which no
// recombination pair holds is an error that says why.
func TestMembersErrors(t *testing.T) {
	for _, c := range []struct {
		c    uncertainty.Case
		want string
	}{
		{uncertainty.Case{}, "Case.T"},
		{uncertainty.Case{T: 300}, "Case.Dopant"},
		{uncertainty.Case{T: 300, Dopant: silicon.Acceptor, Arsenic: true}, "Case.Arsenic"},
		{uncertainty.Case{T: 350, Dopant: silicon.Donor}, "no intrinsic-recombination pair"},
		{uncertainty.Case{T: 1000, Dopant: silicon.Donor}, "no material model set is valid"},
	} {
		if _, err := uncertainty.Members(c.c); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%+v: error %v, want %q", c.c, err, c.want)
		}
	}
}

// TestSwaps: the one-at-a-time groups of the 300 K n+ family have the default first and
// exactly the alternatives of each role (2 other ni models, 2 other BGN, 1 other mobility,
// 1 other recombination pair; Members' doc), each differing from the default in that role only.
func TestSwaps(t *testing.T) {
	family, err := uncertainty.Members(uncertainty.Case{T: 300, Dopant: silicon.Donor})
	if err != nil {
		t.Fatal(err)
	}
	swaps, err := uncertainty.Swaps(family)
	if err != nil {
		t.Fatal(err)
	}
	want := []int{3, 3, 2, 2}
	if len(swaps) != len(want) {
		t.Fatalf("%d groups, want %d", len(swaps), len(want))
	}
	for i, g := range swaps {
		if g.Role != uncertainty.Role(i) || len(g.Members) != want[i] {
			t.Errorf("group %d: role %v with %d members, want %v with %d", i, g.Role, len(g.Members), uncertainty.Role(i), want[i])
		}
		if !g.Members[0].Default {
			t.Errorf("group %v does not start with the default member", g.Role)
		}
		for _, m := range g.Members[1:] {
			for r := uncertainty.Role(0); r < uncertainty.NumRoles; r++ {
				same := m.Choice[r] == g.Members[0].Choice[r]
				if same == (r == g.Role) {
					t.Errorf("group %v: member %q vs default in role %v: same = %v", g.Role, m.Name, r, same)
				}
			}
		}
	}
	if swaps[1].Members[1].Choice[uncertainty.RoleBGN] != "KlaassenSlotboomDeGraaff1992 (Boltzmann)" {
		t.Errorf("first BGN alternative %q", swaps[1].Members[1].Choice[uncertainty.RoleBGN])
	}
	// Without recombination the family has three roles.
	mat, err := uncertainty.Members(uncertainty.Case{T: 300, Dopant: silicon.Donor, SkipRecombination: true})
	if err != nil {
		t.Fatal(err)
	}
	if s, err := uncertainty.Swaps(mat); err != nil || len(s) != 3 {
		t.Errorf("material-only family: %d groups, err %v; want 3", len(s), err)
	}
	// Errors: no default, two defaults, a default without choices.
	two := append([]uncertainty.Member(nil), family[:2]...)
	two[1].Default = true
	for name, f := range map[string][]uncertainty.Member{
		"empty": nil, "no default": family[1:], "two defaults": two,
		"no choices": {{Name: "hand-built", Default: true}},
	} {
		if _, err := uncertainty.Swaps(f); err == nil {
			t.Errorf("%s: no error", name)
		}
	}
}
