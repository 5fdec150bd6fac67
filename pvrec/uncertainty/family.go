package uncertainty

import (
	"fmt"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Member is one choice of published models: a material model set and the intrinsic
// (Auger and radiative) recombination that goes with it. A computation evaluated by Spread
// builds what it needs from it, e.g. a J0 solve:
//
//	mat, err := m.Set.At(t)
//	solver := j0.NewSolver(j0.Models{Material: mat, Auger: m.Auger, Radiative: m.Radiative})
//
// Auger and Radiative are nil in a family built with Case.SkipRecombination.
type Member struct {
	Name      string           // short description, e.g. "ni Couderc2014, BGN Schenk1998 (Fermi–Dirac), μ Klaassen1992, Richter2012 + Trupke2003"
	Set       silicon.ModelSet // material models (band gap, DOS, ni, BGN, statistics, ionisation, mobility)
	Auger     recomb.Mechanism // Auger recombination; nil: none
	Radiative recomb.Mechanism // radiative recombination; nil: none
	Default   bool             // the package defaults: silicon.DefaultModelSet with Richter2012 and Trupke2003, as j0.DefaultModels
	// Choice names the model chosen for each Role, e.g. Choice[RoleBGN] = "DelAlamoSwanson1987
	// (Boltzmann)"; "" for a role the member leaves open (RoleRecombination with
	// Case.SkipRecombination, every role of a hand-built member that does not set it).
	Choice [NumRoles]string
}

// Role is one of the model choices a Member combines.
type Role int

// The roles of a Member, in the order of its Name.
const (
	RoleNi            Role = iota // intrinsic carrier density ni
	RoleBGN                       // band-gap narrowing with its statistics
	RoleMobility                  // carrier mobility
	RoleRecombination             // intrinsic (Auger and radiative) recombination
	NumRoles                      // the number of roles
)

// String returns the role's name, e.g. "band-gap narrowing".
func (r Role) String() string {
	switch r {
	case RoleNi:
		return "intrinsic density"
	case RoleBGN:
		return "band-gap narrowing"
	case RoleMobility:
		return "mobility"
	case RoleRecombination:
		return "intrinsic recombination"
	}
	return fmt.Sprintf("Role(%d)", int(r))
}

// Swap is the group of members that differ from the default member in one role only.
type Swap struct {
	Role    Role     // the role varied
	Members []Member // the default member first, then each alternative in family order
}

// Swaps returns the one-at-a-time model spread of family: for each role in which some
// member differs from the default member alone, that role's group (the default first).
// Together they show which model choice moves a result most, with 1 + Σ(alternatives)
// evaluations instead of the whole family's product. Members are matched by Choice. It returns
// an error if family has no Default member or more than one, or if the default's Choice is
// empty (a hand-built family that does not name its choices).
func Swaps(family []Member) ([]Swap, error) {
	def := -1
	for i, m := range family {
		if m.Default {
			if def >= 0 {
				return nil, fmt.Errorf("uncertainty: Swaps: members %d and %d are both marked Default", def, i)
			}
			def = i
		}
	}
	if def < 0 {
		return nil, fmt.Errorf("uncertainty: Swaps: no member of the %d is marked Default", len(family))
	}
	d := family[def]
	if d.Choice == ([NumRoles]string{}) {
		return nil, fmt.Errorf("uncertainty: Swaps: the default member %q names no Choice", d.Name)
	}
	var out []Swap
	for r := Role(0); r < NumRoles; r++ {
		g := Swap{Role: r, Members: []Member{d}}
		for i, m := range family {
			if i != def && differsOnlyIn(m.Choice, d.Choice, r) {
				g.Members = append(g.Members, m)
			}
		}
		if len(g.Members) > 1 {
			out = append(out, g)
		}
	}
	return out, nil
}

// differsOnlyIn reports whether a and b differ in role r and agree in every other role.
func differsOnlyIn(a, b [NumRoles]string, r Role) bool {
	for k := Role(0); k < NumRoles; k++ {
		if (a[k] == b[k]) != (k != r) {
			return false
		}
	}
	return true
}

// Case is what the default family of models depends on: the temperature and the kind of the
// heavily doped region the computation is about.
type Case struct {
	T       float64        // temperature, K (finite and > 0; each model's own window applies)
	Dopant  silicon.Dopant // majority dopant of the heavily doped region: silicon.Donor (n+) or silicon.Acceptor (p+)
	Arsenic bool           // the donor is arsenic, not phosphorus (selects Masetti's arsenic electron set); only with Donor
	// SkipRecombination leaves the intrinsic recombination out of the family (Member.Auger and
	// Radiative nil), for computations of material quantities alone (ni,eff, sheet resistance)
	// at temperatures outside the recombination models' 290–310 K windows.
	SkipRecombination bool
	// Superseded adds the models that their authors' later fits supersede
	// (SlotboomDeGraaff1976), to show what an older analysis would have given.
	Superseded bool
}

// Members returns the default model family of case c: the combinations of the published
// models of packages silicon and recomb that are valid for c and meaningful together, the
// default member first (marked Default; it is the one of j0.DefaultModels). The choices are
//
//   - intrinsic density: Couderc2014 (default), MisiakosTsamakis1993, SproulGreen1991;
//   - band-gap narrowing with its statistics: Schenk1998 with Fermi–Dirac (default);
//     KlaassenSlotboomDeGraaff1992 and DelAlamoSwanson1987 (n+ only) with Boltzmann; and
//     SlotboomDeGraaff1976 with Boltzmann if c.Superseded;
//   - mobility: Klaassen1992 (default), Masetti1983 (NewMasetti1983, or
//     NewMasetti1983Arsenic for an arsenic donor);
//   - intrinsic recombination: Richter2012 Auger with Trupke2003 radiative (recomb.NewIntrinsic,
//     default), KerrCuevas2002 Auger with its constant radiative coefficient 9.5e-15 cm³/s
//     (recomb.NewKerrCuevas2002Intrinsic);
//
// with the band gap (Passler2002), densities of states (Green1990DOS) and ionisation
// (complete) of silicon.DefaultModelSet, which have no published alternative here. Schenk1998
// is combined with every intrinsic density, an apparent BGN with the default intrinsic density
// only (see below). At 300 K an n+ case has (3 + 2) × 2 × 2 = 20 members (24 with
// c.Superseded), a p+ case (3 + 1) × 2 × 2 = 16 (20).
//
// The rules (each documented in docs/model-catalogue.md, "Models that belong together", or in
// the model's own doc comment):
//   - an apparent BGN (KlaassenSlotboomDeGraaff1992, DelAlamoSwanson1987,
//     SlotboomDeGraaff1976) is never paired with Fermi–Dirac statistics, nor Schenk1998 (a
//     physical BGN) with Boltzmann statistics: the degeneracy would be counted twice or not at all;
//   - an apparent BGN is tied to the intrinsic density assumed when it was extracted: ni,eff²
//     = ni² exp(ΔEg,app/kT) is what was measured. pvrec does not record which ni each
//     extraction used, so rather than multiply an unknown, each apparent BGN appears once, with
//     the default intrinsic density (Couderc2014, or the first valid one at c.T); the spread
//     between the apparent models and Schenk1998 then includes that pairing's uncertainty;
//   - SlotboomDeGraaff1976 only if c.Superseded: its authors' re-fit,
//     KlaassenSlotboomDeGraaff1992, supersedes it (see its doc comment);
//   - DelAlamoSwanson1987 only for a donor (n+) case: it is a fit to n-type silicon (a
//     computation that also evaluates p-type silicon, such as a cell's base, fails with it,
//     and Spread reports those members as failed);
//   - Altermatt2003 is left out: at 300 K, its only temperature, it agrees with the default
//     Couderc2014 to 0.2 % (see Couderc2014's doc comment), so it would add near-duplicates of
//     every member and bias the default's rank;
//   - Masetti1983's arsenic electron set only for an arsenic donor, its phosphorus set
//     otherwise (for a p+ case it describes the minority electrons, as is common practice);
//   - Auger and radiative models only in their published pairs, never crossed;
//   - a model that returns an error at c.T (its temperature window: MisiakosTsamakis1993 up
//     to 340 K, SproulGreen1991 275–375 K, Masetti1983 295–305 K, Richter2012, Trupke2003 and
//     KerrCuevas2002 290–310 K) is left out, as is any model set whose ModelSet.At fails at c.T;
//   - the hand-calculation models (FixedGap, FixedNi, NoNarrowing, ConstantMobility,
//     ConstantAuger, ConstantRadiative other than Kerr and Cuevas's) are not members, nor are
//     DziewiorSchmid1977 and Altermatt1997 (Auger models without a published radiative partner
//     in the catalogue's pairings; Altermatt1997 also holds at low injection only) and SRH
//     defects (not intrinsic recombination).
//
// The apparent BGN models are evaluated at every doping a computation meets, also beyond the
// densities they were fitted to (their doc comments): in emitters above about 1e20 cm^-3
// their spread is one of extrapolations. A family of one's own is a []Member built by hand.
//
// Members returns an error naming the field for an invalid c (T not finite and > 0, Dopant
// not Donor or Acceptor, Arsenic with Acceptor), and an error listing the reasons when no
// combination is valid at c.T (for example no recombination pair outside 290–310 K unless
// SkipRecombination is set).
func Members(c Case) ([]Member, error) {
	if err := check.Temperature("uncertainty: Members: Case.T", c.T); err != nil {
		return nil, err
	}
	switch {
	case c.Dopant != silicon.Donor && c.Dopant != silicon.Acceptor:
		return nil, fmt.Errorf("uncertainty: Members: Case.Dopant must be silicon.Donor or silicon.Acceptor, got %v", c.Dopant)
	case c.Arsenic && c.Dopant != silicon.Donor:
		return nil, fmt.Errorf("uncertainty: Members: Case.Arsenic needs Case.Dopant = silicon.Donor, got %v", c.Dopant)
	}
	var why []string // reasons for exclusions, for the error when nothing is left
	// Each candidate list starts with the package default; def records whether it survived.
	var nis []silicon.IntrinsicDensity
	niDef := false
	for i, ni := range []silicon.IntrinsicDensity{silicon.NewCouderc2014(), silicon.NewMisiakosTsamakis1993(), silicon.NewSproulGreen1991()} {
		if _, err := ni.Ni(c.T); err != nil {
			why = append(why, err.Error())
			continue
		}
		niDef = niDef || i == 0
		nis = append(nis, ni)
	}
	type bgnStat struct {
		bgn  silicon.BandgapNarrowing
		stat silicon.Statistics
	}
	bgns := []bgnStat{
		{silicon.NewSchenk1998(), silicon.FermiDirac},
		{silicon.NewKlaassenSlotboomDeGraaff1992(), silicon.Boltzmann},
	}
	if c.Dopant == silicon.Donor {
		bgns = append(bgns, bgnStat{silicon.NewDelAlamoSwanson1987(), silicon.Boltzmann})
	}
	if c.Superseded {
		bgns = append(bgns, bgnStat{silicon.NewSlotboomDeGraaff1976(), silicon.Boltzmann})
	}
	masetti := silicon.NewMasetti1983()
	if c.Arsenic {
		masetti = silicon.NewMasetti1983Arsenic()
	}
	var mobs []silicon.Mobility
	mobDef := false
	for i, mob := range []silicon.Mobility{silicon.NewKlaassen1992(), masetti} {
		if _, _, err := mob.Mobilities(silicon.Point{T: c.T}); err != nil {
			why = append(why, err.Error())
			continue
		}
		mobDef = mobDef || i == 0
		mobs = append(mobs, mob)
	}
	var sets []Member // material members, recombination not yet chosen
	for j, b := range bgns {
		for i, ni := range nis {
			if b.stat == silicon.Boltzmann && i > 0 {
				break // an apparent BGN with the default (first valid) ni only
			}
			for k, mob := range mobs {
				ms := silicon.DefaultModelSet()
				ms.Intrinsic, ms.BGN, ms.Statistics, ms.Mobility = ni, b.bgn, b.stat, mob
				if _, err := ms.At(c.T); err != nil {
					why = append(why, err.Error())
					continue
				}
				m := Member{
					Name:    fmt.Sprintf("ni %s, BGN %s (%s), μ %s", ni, b.bgn, b.stat, mob),
					Set:     ms,
					Default: niDef && i == 0 && j == 0 && mobDef && k == 0,
				}
				m.Choice[RoleNi] = fmt.Sprint(ni)
				m.Choice[RoleBGN] = fmt.Sprintf("%s (%s)", b.bgn, b.stat)
				m.Choice[RoleMobility] = fmt.Sprint(mob)
				sets = append(sets, m)
			}
		}
	}
	if len(sets) == 0 {
		return nil, fmt.Errorf("uncertainty: Members: no material model set is valid at T = %g K: %s", c.T, strings.Join(dedupe(why), "; "))
	}
	if c.SkipRecombination {
		return sets, nil
	}
	pairs, pairDef, err := recombinationPairs(sets[0].Set, c, &why)
	if err != nil {
		return nil, err
	}
	if len(pairs) == 0 {
		return nil, fmt.Errorf("uncertainty: Members: no intrinsic-recombination pair is valid at T = %g K (set Case.SkipRecombination for material quantities alone): %s", c.T, strings.Join(dedupe(why), "; "))
	}
	out := make([]Member, 0, len(sets)*len(pairs))
	for _, s := range sets {
		for k, p := range pairs {
			m := s
			m.Name = fmt.Sprintf("%s, %s + %s", s.Name, p.Auger, p.Radiative)
			m.Auger, m.Radiative = p.Auger, p.Radiative
			m.Choice[RoleRecombination] = fmt.Sprintf("%s + %s", p.Auger, p.Radiative)
			m.Default = s.Default && pairDef && k == 0
			out = append(out, m)
		}
	}
	return out, nil
}

// recombinationPairs returns the published Auger–radiative pairs that evaluate without error
// at c.T in a heavily doped bulk of c's type (1e19 cm^-3, low injection) of model set ms;
// the reasons for the others are appended to why. def reports whether the default pair
// (recomb.NewIntrinsic) is the first.
func recombinationPairs(ms silicon.ModelSet, c Case, why *[]string) (pairs []recomb.Intrinsic, def bool, err error) {
	mat, err := ms.At(c.T)
	if err != nil {
		return nil, false, err
	}
	nd, na := 1e19, 0.0
	if c.Dopant == silicon.Acceptor {
		nd, na = 0, 1e19
	}
	bulk, err := recomb.NewBulk(mat, nd, na)
	if err != nil {
		return nil, false, fmt.Errorf("uncertainty: Members: %w", err)
	}
	st, err := bulk.State(1e10)
	if err != nil {
		return nil, false, fmt.Errorf("uncertainty: Members: %w", err)
	}
	for i, p := range []recomb.Intrinsic{recomb.NewIntrinsic(), recomb.NewKerrCuevas2002Intrinsic()} {
		if _, err := p.Rate(st); err != nil {
			*why = append(*why, err.Error())
			continue
		}
		def = def || i == 0
		pairs = append(pairs, p)
	}
	return pairs, def, nil
}

// dedupe returns the distinct strings of s in their first order.
func dedupe(s []string) []string {
	seen := map[string]bool{}
	var out []string
	for _, x := range s {
		if !seen[x] {
			seen[x] = true
			out = append(out, x)
		}
	}
	return out
}
