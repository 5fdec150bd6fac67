// Package catalogue writes pvrec's model catalogue (docs/model-catalogue.md) from the source:
// every model type of the physics packages, recognised by the method of its role (Eg for a
// band gap, Rate for a recombination mechanism, ...), with its doc comment (formula, validity
// range and reference, as every model's doc comment must give them), its parameters (the
// exported fields and their comments), its constructors, and whether a default model set uses
// it; followed by the table of models that belong together. go generate ./pvrec/internal/catalogue
// rewrites the file, and a test fails when the committed file is not current.
package catalogue

import (
	"fmt"
	"go/ast"
	"go/token"
	"path/filepath"
	"sort"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/gosrc"
)

//go:generate go run ./gen

// Role is a kind of model, recognised by a method every model of the kind has.
type Role struct {
	Pkg       string // package, e.g. "silicon"
	Interface string // the role's interface, e.g. "Bandgap"
	Method    string // the method that identifies it, e.g. "Eg"
	Param     string // the type of that method's first parameter, e.g. "float64"
	Title     string // heading in the catalogue
}

// Roles are the model kinds of the catalogue, in the order of the floors.
var Roles = []Role{
	{"silicon", "Bandgap", "Eg", "float64", "Band gap of undoped silicon"},
	{"silicon", "DensityOfStates", "NcNv", "float64", "Effective densities of states"},
	{"silicon", "IntrinsicDensity", "Ni", "float64", "Intrinsic carrier density"},
	{"silicon", "BandgapNarrowing", "DeltaEg", "Point", "Band-gap narrowing"},
	{"silicon", "Ionization", "Ionized", "float64", "Dopant ionisation"},
	{"silicon", "Mobility", "Mobilities", "Point", "Carrier mobility"},
	{"recomb", "Mechanism", "Rate", "State", "Bulk recombination mechanisms"},
	{"surface", "Model", "Seff", "recomb.State", "Surface recombination models"},
	{"surface", "DitDistribution", "Density", "float64", "Interface-state distributions"},
	{"surface", "CrossSection", "Sigma", "float64", "Interface capture cross sections"},
	{"j0", "Surface", "Velocity", "float64", "Front surfaces of diffused regions"},
	{"profile", "Profile", "Dopants", "float64", "Doping profiles"},
}

// Defaults names the models a default constructor of the packages uses (the parsed bodies of
// silicon.DefaultModelSet, recomb.NewIntrinsic and j0.DefaultModels and DefaultSurface).
var defaultFuncs = map[string][]string{
	"silicon": {"DefaultModelSet", "defaultBGN"},
	"recomb":  {"NewIntrinsic"},
	"j0":      {"DefaultModels", "DefaultSurface"},
}

// Pairing is a rule of which models belong together, with its reason and source.
type Pairing struct {
	Models string // the models, e.g. "SlotboomDeGraaff1976, ... with Statistics = Boltzmann"
	Why    string // reason and source
}

// Pairings are the rules the catalogue states. Each names its source.
var Pairings = []Pairing{
	{"Apparent BGN models (SlotboomDeGraaff1976, KlaassenSlotboomDeGraaff1992, DelAlamoSwanson1987) with Statistics = Boltzmann",
		"they were extracted from device data interpreted with Boltzmann statistics, so their ΔEg contains the degeneracy that Fermi–Dirac statistics would add a second time (silicon package documentation; the papers' own analyses)"},
	{"Schenk1998 (a physical BGN, carrier-dependent) with Statistics = FermiDirac",
		"its ΔEg is the narrowing of the band edges alone; degeneracy must come from the statistics (A. Schenk, J. Appl. Phys. 84, 3684 (1998))"},
	{"Richter2012 Auger with Trupke2003 radiative (recomb.NewIntrinsic)",
		"the intrinsic-lifetime parameterisation of A. Richter et al., Phys. Rev. B 86, 165202 (2012), adds B_rel·B_low radiative recombination with B_low of Trupke et al. (2003)"},
	{"KerrCuevas2002 Auger with ConstantRadiative{B: 9.5e-15 cm³/s} (recomb.NewKerrCuevas2002Intrinsic)",
		"M. J. Kerr and A. Cuevas, J. Appl. Phys. 91, 2473 (2002) include that radiative coefficient in their intrinsic lifetime"},
	{"ExtendedSRH interface parameters (Dit, σ) with the thermal velocity they were extracted with (DefaultVth = 1e7 cm/s unless the source says otherwise)",
		"Dit·σ·vth enters as a product: changing vth without refitting changes Seff (common practice, no source)"},
}

type model struct {
	name, role, doc string
	fields          [][2]string // name, comment
	ctors           []string
	isDefault       bool
}

// Generate returns the catalogue in Markdown for the pvrec folder root.
func Generate(root string) (string, error) {
	var b strings.Builder
	b.WriteString("# Model catalogue\n\n")
	b.WriteString("Generated from the source by `go generate ./pvrec/internal/catalogue`; do not edit. Every model of the\n")
	b.WriteString("physics packages, by role, with its doc comment (formula, validity range, reference), its parameters\n")
	b.WriteString("(exported fields, units in their comments), its constructors and whether a default uses it. Values\n")
	b.WriteString("labelled \"value from memory\" in a doc comment are recalled, not checked against the paper here.\n\n")
	pkgs := map[string]*pkgFiles{}
	for _, r := range Roles {
		if pkgs[r.Pkg] != nil {
			continue
		}
		p, err := parsePkg(filepath.Join(root, r.Pkg), r.Pkg)
		if err != nil {
			return "", err
		}
		pkgs[r.Pkg] = p
	}
	for _, r := range Roles {
		ms := models(pkgs[r.Pkg], r)
		fmt.Fprintf(&b, "## %s (`%s.%s`)\n\n", r.Title, r.Pkg, r.Interface)
		if len(ms) == 0 {
			b.WriteString("(none)\n\n")
			continue
		}
		b.WriteString("| model | constructors | default |\n|---|---|---|\n")
		for _, m := range ms {
			def := ""
			if m.isDefault {
				def = "yes"
			}
			fmt.Fprintf(&b, "| `%s.%s` | %s | %s |\n", r.Pkg, m.name, strings.Join(m.ctors, ", "), def)
		}
		b.WriteString("\n")
		for _, m := range ms {
			fmt.Fprintf(&b, "### %s.%s\n\n", r.Pkg, m.name)
			b.WriteString(strings.TrimSpace(m.doc) + "\n\n")
			if len(m.fields) > 0 {
				b.WriteString("| parameter | meaning and unit |\n|---|---|\n")
				for _, f := range m.fields {
					fmt.Fprintf(&b, "| `%s` | %s |\n", f[0], strings.ReplaceAll(f[1], "|", "\\|"))
				}
				b.WriteString("\n")
			}
		}
	}
	b.WriteString("## Models that belong together\n\n| models | why |\n|---|---|\n")
	for _, p := range Pairings {
		fmt.Fprintf(&b, "| %s | %s |\n", p.Models, p.Why)
	}
	return b.String(), nil
}

// pkgFiles is a package's parsed source files (go/ast.Package is deprecated).
type pkgFiles struct {
	Name  string
	Files []*ast.File
}

func parsePkg(dir, name string) (*pkgFiles, error) {
	files, err := gosrc.Files(dir, name)
	if err != nil {
		return nil, err
	}
	return &pkgFiles{Name: name, Files: files}, nil
}

// models returns the exported types of p with the role's method, with their documentation.
func models(p *pkgFiles, r Role) []model {
	hasMethod := map[string]bool{}
	docs := map[string]string{}
	fields := map[string][][2]string{}
	ctors := map[string][]string{}
	defaults := map[string]bool{}
	for _, f := range p.Files {
		for _, d := range f.Decls {
			switch d := d.(type) {
			case *ast.FuncDecl:
				if d.Recv != nil && d.Name.Name == r.Method && firstParam(d.Type) == r.Param {
					hasMethod[recvName(d.Recv.List[0].Type)] = true
				}
				if d.Recv == nil && d.Name.IsExported() && d.Type.Results != nil && len(d.Type.Results.List) > 0 {
					if id, ok := d.Type.Results.List[0].Type.(*ast.Ident); ok {
						ctors[id.Name] = append(ctors[id.Name], "`"+d.Name.Name+"`")
					}
				}
				for _, fn := range defaultFuncs[p.Name] {
					if d.Recv == nil && d.Name.Name == fn && d.Body != nil {
						ast.Inspect(d.Body, func(n ast.Node) bool {
							switch x := n.(type) {
							case *ast.CallExpr:
								if id, ok := x.Fun.(*ast.Ident); ok && strings.HasPrefix(id.Name, "New") {
									defaults[strings.TrimPrefix(id.Name, "New")] = true
								}
							case *ast.CompositeLit:
								if id, ok := x.Type.(*ast.Ident); ok {
									defaults[id.Name] = true
								}
							}
							return true
						})
					}
				}
			case *ast.GenDecl:
				if d.Tok != token.TYPE {
					continue
				}
				for _, s := range d.Specs {
					ts := s.(*ast.TypeSpec)
					if !ts.Name.IsExported() {
						continue
					}
					text := ts.Doc.Text()
					if text == "" {
						text = d.Doc.Text()
					}
					docs[ts.Name.Name] = text
					if st, ok := ts.Type.(*ast.StructType); ok {
						for _, fl := range st.Fields.List {
							c := strings.TrimSpace(fl.Comment.Text() + " " + fl.Doc.Text())
							for _, n := range fl.Names {
								if n.IsExported() {
									fields[ts.Name.Name] = append(fields[ts.Name.Name], [2]string{n.Name, strings.Join(strings.Fields(c), " ")})
								}
							}
						}
					}
				}
			}
		}
	}
	var out []model
	for name := range hasMethod {
		if !ast.IsExported(name) || docs[name] == "" && fields[name] == nil {
			continue
		}
		sort.Strings(ctors[name])
		out = append(out, model{name: name, role: r.Interface, doc: docs[name], fields: fields[name], ctors: ctors[name],
			isDefault: defaults[name] || defaults[strings.TrimSuffix(name, "DOS")] || defaults[name+"DOS"]})
	}
	sort.Slice(out, func(i, j int) bool { return out[i].name < out[j].name })
	return out
}

// firstParam returns the type of the first parameter of ft as written ("float64", "Point",
// "recomb.State"), or "" if it has none.
func firstParam(ft *ast.FuncType) string {
	if ft.Params == nil || len(ft.Params.List) == 0 {
		return ""
	}
	switch t := ft.Params.List[0].Type.(type) {
	case *ast.Ident:
		return t.Name
	case *ast.SelectorExpr:
		if x, ok := t.X.(*ast.Ident); ok {
			return x.Name + "." + t.Sel.Name
		}
	}
	return ""
}

func recvName(e ast.Expr) string {
	if s, ok := e.(*ast.StarExpr); ok {
		e = s.X
	}
	if id, ok := e.(*ast.Ident); ok {
		return id.Name
	}
	return ""
}
