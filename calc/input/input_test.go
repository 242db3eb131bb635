package input

import (
	"errors"
	"flag"
	"math"
	"os"
	"strings"
	"testing"

	"colsheet/calc/code"
	"colsheet/calc/material"
	"colsheet/calc/model"
)

var update = flag.Bool("update", false, "rewrite the golden error lists under testdata")

func near(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*math.Max(math.Abs(a), math.Abs(b))
}

func parseFile(t *testing.T, path string) (*model.Input, error) {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return Parse(path, data)
}

// The conversions are common practice (SI prefixes), no source.
func TestParseGood(t *testing.T) {
	in, err := parseFile(t, "testdata/good.yaml")
	if err != nil {
		t.Fatal(err)
	}
	if len(in.Columns) != 2 || len(in.Columns[0].Storeys) != 2 || len(in.Columns[1].Storeys) != 1 {
		t.Fatalf("columns/storeys: got %+v", in.Columns)
	}
	k1, k2 := in.Columns[0], in.Columns[1]
	l1, l2 := k1.Storeys[0], k1.Storeys[1]
	// gk_slab = 0.25 m · 25 kN/m³ + 1.5 kN/m² = 7.75 kN/m² = 0.00775 N/mm²; NEd = gk · 3.3 m · 6.6 m · 1.35.
	nedL2 := 0.00775 * 3300 * 6600 * 1.35
	nums := []struct {
		name      string
		got, want float64
	}{
		{"alpha_cc", in.Code.Get("alpha_cc"), 0.85},
		{"Es (195 GPa)", in.Code.Get("Es"), 195000},
		{"link_spacing_max (0.3 m)", in.Code.Get("link_spacing_max"), 300},
		{"gamma_c untouched", in.Code.Get("gamma_c"), 1.5},
		{"fck", in.Materials.Concrete.Fck, 30},
		{"fyk", in.Materials.Fyk, 500},
		{"aggregate", in.Materials.Aggregate, 20},
		{"members", in.Options.Members, 2},
		{"link step", in.Options.LinkStep, 25},
		{"K1 b", k1.B, 350},
		{"K1 h (plain mm)", k1.H, 500},
		{"K1 cover", k1.Cover, 40},
		{"K1 bars dia", k1.Bars.Dia, 20},
		{"K1 bars count", float64(k1.Bars.Count), 8},
		{"K1 link", k1.LinkDia, 8},
		{"K1 line", float64(k1.Line), 32},
		{"L1 line", float64(l1.Line), 39},
		{"L1 l0y", l1.L0Y, 2900},
		{"L1 l0z (expression)", l1.L0Z, 3100},
		{"L1 length (var)", l1.Length, 3400},
		{"L1 NEd", l1.NEd, 2150e3},
		{"L1 My top", l1.MY.Top, 85e6},
		{"L1 My bottom", l1.MY.Bottom, -40e6},
		{"L1 Mz top", l1.MZ.Top, 10e6},
		{"L1 Mz bottom (plain kNm)", l1.MZ.Bottom, 10e6},
		{"L1 phi_ef", l1.PhiEf, 0.8},
		{"L2 l0 single value", l2.L0Y, 3000},
		{"L2 l0 single value z", l2.L0Z, 3000},
		{"L2 NEd (expression over vars)", l2.NEd, nedL2},
		{"L2 moments absent", l2.MY.Top + l2.MY.Bottom + l2.MZ.Top + l2.MZ.Bottom, 0},
		{"K2 b (0.3 m)", k2.B, 300},
		{"K2 h (30 cm)", k2.H, 300},
		{"K2 cover (plain)", k2.Cover, 35},
		{"K2 NEd (plain kN)", k2.Storeys[0].NEd, 900e3},
		{"K2 My top (plain kNm)", k2.Storeys[0].MY.Top, 20e6},
		{"K2 My bottom (absent)", k2.Storeys[0].MY.Bottom, 0},
	}
	for _, c := range nums {
		if !near(c.got, c.want) {
			t.Errorf("%s = %g, want %g", c.name, c.got, c.want)
		}
	}
	texts := []struct{ name, got, want string }{
		{"title", in.Project.Title, "Office block, ground floor columns"},
		{"job", in.Project.Job, "2417"},
		{"date", in.Project.Date, "2026-12-01"},
		{"annex", in.Code.Annex, "recommended"},
		{"class", in.Materials.Concrete.Class, "C30/37"},
		{"stress block", in.Options.StressBlock, model.Rectangular},
		{"imperfection", in.Options.Imperfection, model.ImperfL0Over400},
		{"K1", k1.ID, "K1"},
		{"L2", l2.Name, "L2"},
		{"file", in.File, "testdata/good.yaml"},
	}
	for _, c := range texts {
		if c.got != c.want {
			t.Errorf("%s = %q, want %q", c.name, c.got, c.want)
		}
	}
	if !l1.HasPhi || l2.HasPhi || k2.Bars != nil || k2.LinkDia != 0 || k2.Storeys[0].Length != 0 {
		t.Errorf("optional fields: L1 HasPhi %v, L2 HasPhi %v, K2 bars %v, K2 link %g", l1.HasPhi, l2.HasPhi, k2.Bars, k2.LinkDia)
	}
	if got := in.Options.BarDiameters; !equal(got, []float64{16, 20, 25}) {
		t.Errorf("bar diameters %v, want sorted without repeats", got)
	}
	if got := in.Options.LinkDiameters; !equal(got, []float64{8, 10}) {
		t.Errorf("link diameters %v", got)
	}
	if n := len(in.Code.Overrides()); n != 3 {
		t.Errorf("%d overrides, want 3", n)
	}
}

// catalogue lists the code parameters as the message of an unknown one does.
func catalogue() string {
	var names []string
	for _, c := range code.Catalogue {
		names = append(names, c.Name)
	}
	return strings.Join(names, ", ")
}

func equal(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

func TestDefaultsAndHash(t *testing.T) {
	in, err := parseFile(t, "testdata/minimal.yaml")
	if err != nil {
		t.Fatal(err)
	}
	o := in.Options
	if o.StressBlock != model.ParabolaRectangle || o.Imperfection != model.ImperfInclination || o.Members != 1 || o.LinkStep != 25 || o.LapStep != 25 || o.LapStart != 0 ||
		!equal(o.BarDiameters, []float64{12, 16, 20, 25, 32, 40}) || !equal(o.LinkDiameters, []float64{8, 10, 12}) || o.Selection != model.DefaultSelection() || o.Typical != model.DefaultTypical() {
		t.Errorf("default options %+v", o)
	}
	if in.Materials.Fyk != 500 || in.Materials.Aggregate != 20 || in.Code.Annex != "recommended" || len(in.Code.Overrides()) != 0 {
		t.Errorf("defaults: %+v, annex %q", in.Materials, in.Code.Annex)
	}
	// sha256sum testdata/minimal.yaml
	if want := "c02effd2f33c416f243ec3cc90bb566c2075da601ef9570261018dacc4f65f0a"; in.SHA256 != want {
		t.Errorf("SHA256 = %s, want %s", in.SHA256, want)
	}
	s := in.Columns[0].Storeys[0]
	if s.NEd != 1e6 || s.L0Y != 3000 || s.L0Z != 3000 {
		t.Errorf("storey %+v", s)
	}
}

// The actions form of DESIGN.md parses as written once the material table knows its class.
func TestContractForm(t *testing.T) {
	if _, ok := material.Lookup("C32/40"); !ok {
		t.Skip("C32/40 is not a class of EN 1992-1-1 Table 3.1; the contract example needs calc/material to accept it")
	}
	in, err := parseFile(t, "testdata/contract.yaml")
	if err != nil {
		t.Fatal(err)
	}
	if s := in.Columns[0].Storeys[0]; s.NEd != 2150e3 || s.MY.Top != 85e6 || s.L0Z != 3100 {
		t.Errorf("storey %+v", s)
	}
}

// head is a valid start of a file; cases add lines after it, from line 10 on.
const head = `materials: {concrete: C30/37}
columns:
  - id: K1
    b: 350 mm
    h: 500 mm
    cover: 40 mm
    storeys:
      - name: L1
        l0: {y: 2.9 m, z: 3.1 m}
`

func TestParseErrors(t *testing.T) {
	cases := []struct {
		name, text string
		want       []string
	}{
		{"empty", "", []string{"in.yaml:1: the file is empty; expected a mapping with at least materials and columns or building"}},
		{"comments only", "# nothing\n", []string{"in.yaml:1: the file is empty; expected a mapping with at least materials and columns or building"}},
		{"null document", "---\n", []string{"in.yaml:1: the file is empty; expected a mapping with at least materials and columns or building"}},
		{"top-level list", "- a\n- b\n", []string{"in.yaml:1: the top level must be a mapping with the keys project, code, materials, design, vars, moment_signs, actions, columns, building, found a list"}},
		{"tab in the indentation", "materials: {concrete: C30/37}\ncolumns:\n\t- id: K1\n", []string{"in.yaml:3: tab character: use spaces"}},
		{"two documents", head + "        NEd: 10\n---\nx: 1\n", []string{"in.yaml:11: the file holds more than one YAML document; give one per file"}},
		{"NEd with a length", head + "        NEd: 10\n      - name: L2\n        l0: 3 m\n        NEd: 3.6 m\n",
			[]string{`in.yaml:13: columns[0].storeys[1].NEd: "3.6 m" is a length, expected a force`}},
		{"tension beyond the limit", head + "        NEd: -150000 kN\n",
			[]string{"in.yaml:10: columns[0].storeys[0].NEd: -150000 kN is outside the plausible range of the design axial force, -100000 kN to 100000 kN (see the input limits in the README)"}},
		{"NEd missing", head, []string{"in.yaml:8: columns[0].storeys[0].NEd: is required but missing (the design axial force, e.g. NEd: 2150 kN)"}},
		{"NEd not finite", head + "        NEd: .inf\n", []string{"in.yaml:10: columns[0].storeys[0].NEd: +Inf is not a finite number"}},
		{"NEd boolean", head + "        NEd: yes\n", []string{`in.yaml:10: columns[0].storeys[0].NEd: "yes": undefined name yes`}},
		{"NEd true", head + "        NEd: true\n", []string{`in.yaml:10: columns[0].storeys[0].NEd: expected a number or a quantity such as "2150 kN", found "true"`}},
		{"NEd list", head + "        NEd: [1, 2]\n", []string{`in.yaml:10: columns[0].storeys[0].NEd: expected a number or a quantity such as "2150 kN", found a list`}},
		{"power with ^", head + "        NEd: 2 ^ 10\n",
			[]string{`in.yaml:10: columns[0].storeys[0].NEd: "2 ^ 10": ^ is not a power here; use ** for powers (a ** 2)`}},
		{"division by zero", head + "        NEd: 10 kN / 0\n", []string{`in.yaml:10: columns[0].storeys[0].NEd: "10 kN / 0": division by zero`}},
		{"unknown key", head + "        NEd: 10\n        Ned: 10\n",
			[]string{"in.yaml:11: columns[0].storeys[0].Ned: unknown key (known here: name, l0, length, NEd, M, cases, phi_ef, creep)"}},
		{"repeated key", head + "        NEd: 10\n        NEd: 20\n", []string{"in.yaml:11: columns[0].storeys[0].NEd: the key is given twice"}},
		{"unknown top key", "materials: {concrete: C30/37}\ncolums: []\n", []string{
			"in.yaml:1: columns: is required but missing (give the columns with their actions under columns, or the building form under building)",
			"in.yaml:2: colums: unknown key (known here: project, code, materials, design, vars, moment_signs, actions, columns, building)"}},
		{"columns and building", head + "        NEd: 10\nbuilding:\n  storeys: []\n",
			[]string{"in.yaml:11: building: a file gives either columns (the actions form, line 2) or building (the building form, line 11), not both"}},
		{"materials missing", "columns:\n  - {id: K1, b: 300, h: 300, cover: 30, storeys: [{name: L1, l0: 3000, NEd: 1}]}\n",
			[]string{"in.yaml:1: materials: is required but missing (e.g. materials: {concrete: C30/37})"}},
		{"not a class", "materials: {concrete: C32/41}\ncolumns:\n  - {id: K1, b: 300, h: 300, cover: 30, storeys: [{name: L1, l0: 3000, NEd: 1}]}\n",
			[]string{`in.yaml:1: materials.concrete: "C32/41" is not a strength class of EN 1992-1-1 Table 3.1 (classes: ` + material.ClassNames() + ")"}},
		{"fyk and aggregate", "materials:\n  concrete: C30/37\n  fyk: 350\n  aggregate: 0 mm\ncolumns:\n  - {id: K1, b: 300, h: 300, cover: 30, storeys: [{name: L1, l0: 3000, NEd: 1}]}\n",
			[]string{"in.yaml:3: materials.fyk: 350 MPa is outside 400 to 600 MPa (EN 1992-1-1 3.2.2(3)P)",
				"in.yaml:4: materials.aggregate: 0 mm is outside the plausible range of the aggregate size, 4 mm to 63 mm (see the input limits in the README)"}},
		{"code", "code:\n  annex: UK\n  overrides:\n    gamma_c: 3\n    Es: 200 mm\n    gamma: 1\n" + head + "        NEd: 10\n", []string{
			`in.yaml:2: code.annex: annex "UK" is not supported (supported: recommended)`,
			"in.yaml:4: code.overrides.gamma_c: gamma_c = 3 is outside the accepted range 1 to 2",
			`in.yaml:5: code.overrides.Es: "200 mm" is a length, expected a stress`,
			`in.yaml:6: code.overrides.gamma: unknown parameter "gamma" (known: ` + catalogue() + ")"}},
		{"design block", "design:\n  stress_block: parabolic\n  imperfection: none\n  members: 1.5\n  bar_diameters: []\n  link_diameters: [8, -1]\n  link_spacing_step: 0\n  lap_step: 0\n  lap_above_floor: -75 mm\n" + head + "        NEd: 10\n", []string{
			`in.yaml:2: design.stress_block: "parabolic" is not one of parabola-rectangle, rectangular`,
			`in.yaml:3: design.imperfection: "none" is not one of inclination, l0/400`,
			"in.yaml:4: design.members: the number of members m must be a whole number of at least 1, found 1.5",
			"in.yaml:5: design.bar_diameters: the list is empty; give at least one of the diameters in mm",
			"in.yaml:6: design.link_diameters[1]: -1 mm is outside the plausible range of the link diameter, 6 mm to 20 mm (see the input limits in the README)",
			"in.yaml:7: design.link_spacing_step: 0 mm is outside the plausible range of the rounding step, 5 mm to 100 mm (see the input limits in the README)",
			"in.yaml:8: design.lap_step: 0 mm is outside the plausible range of the rounding step, 5 mm to 100 mm (see the input limits in the README)",
			"in.yaml:9: design.lap_above_floor: -75 mm is outside the plausible range of the start of the laps above the floor, 0 mm to 12000 mm (see the input limits in the README)"}},
		{"selection and typical", "design:\n  selection:\n    least_bar: 20 mm\n    least_bar_wide: 16 mm\n    vibrator_gap: 200 mm\n    labour_per_bar: -1\n    costed: 1\n    vibrator: 75\n  typical: {on: yes please, tolerance: \"150 %\"}\n" + head + "        NEd: 10\n", []string{
			"in.yaml:3: design.selection.least_bar: least_bar = 20 mm is greater than least_bar_wide = 16 mm",
			"in.yaml:5: design.selection.vibrator_gap: the clear gap for a poker vibrator must lie between 0 and 150 mm (0: no such gap asked), found 200 mm",
			"in.yaml:6: design.selection.labour_per_bar: the labour term in kilograms of steel must lie between 0 and 100, found -1",
			"in.yaml:7: design.selection.costed: the number of passing patterns costed must be a whole number from 2 to 100, found 1",
			"in.yaml:8: design.selection.vibrator: unknown key (known here: least_bar, least_bar_wide, wide_from, vibrator_gap, labour_per_bar, labour_per_tie, costed)",
			`in.yaml:9: design.typical.on: expected true or false, found "yes please"`,
			"in.yaml:9: design.typical.tolerance: the tolerance must lie between 0 and 100 %, found 150 %"}},
		{"section", "materials: {concrete: C30/37}\ncolumns:\n  - id: K1/2\n    b: -350\n    h: 2 m2\n    cover: 40 mm\n    bars: {count: 7}\n    link_dia: 0\n    storeys: [{name: L1, l0: 3000, NEd: 1}]\n", []string{
			`in.yaml:3: columns[0].id: "K1/2" must not contain a slash`,
			"in.yaml:4: columns[0].b: -350 mm is outside the plausible range of the section side, 150 mm to 3000 mm (see the input limits in the README)",
			`in.yaml:5: columns[0].h: "2 m2" is an area, expected a length`,
			"in.yaml:7: columns[0].bars.count: the bar count must be an even whole number of at least 4, found 7",
			"in.yaml:7: columns[0].bars.dia: is required but missing (e.g. bars: {count: 8, dia: 20 mm})",
			"in.yaml:8: columns[0].link_dia: 0 mm is outside the plausible range of the link diameter, 6 mm to 20 mm (see the input limits in the README)"}},
		{"cover too large", "materials: {concrete: C30/37}\ncolumns:\n  - id: K1\n    b: 200\n    h: 300\n    cover: 80 mm\n    bars: {count: 4, dia: 16}\n    storeys: [{name: L1, l0: 3000, NEd: 1}]\n", []string{
			"in.yaml:6: columns[0].cover: no room for links and bars: 2·(cover + link + bar) = 2·(80 + 8 + 16) = 208 mm is not less than min(b, h) = 200 mm"}},
		{"cover with the smallest sizes", "materials: {concrete: C30/37}\ndesign: {bar_diameters: [20, 16], link_diameters: [10]}\ncolumns:\n  - {id: K1, b: 200, h: 300, cover: 74, storeys: [{name: L1, l0: 3000, NEd: 1}]}\n", []string{
			"in.yaml:4: columns[0].cover: no room for links and bars: 2·(cover + link + bar) = 2·(74 + 10 + 16) = 200 mm is not less than min(b, h) = 200 mm"}},
		{"missing column keys", "materials: {concrete: C30/37}\ncolumns:\n  - b: 300\n", []string{
			"in.yaml:3: columns[0].id: is required but missing (the column's name, e.g. id: K1)",
			"in.yaml:3: columns[0].h: is required but missing (the depth along z, e.g. h: 500 mm)",
			"in.yaml:3: columns[0].cover: is required but missing (the nominal cover to the links, e.g. cover: 40 mm)",
			"in.yaml:3: columns[0].storeys: is required but missing (the lifts with their actions)"}},
		{"duplicates", "materials: {concrete: C30/37}\ncolumns:\n  - {id: K1, b: 300, h: 300, cover: 30, storeys: [{name: L1, l0: 3000, NEd: 1}, {name: L1, l0: 3000, NEd: 1}]}\n  - {id: K1, b: 300, h: 300, cover: 30, storeys: [{name: L1, l0: 3000, NEd: 1}]}\n", []string{
			`in.yaml:3: columns[0].storeys[1].name: storey name "L1" is used twice in this column (first at columns[0].storeys[0])`,
			`in.yaml:4: columns[1].id: column id "K1" is used twice (first at columns[0])`}},
		{"columns empty", "materials: {concrete: C30/37}\ncolumns: []\n", []string{"in.yaml:2: columns: the list is empty; give at least one of the columns"}},
		{"storey fields", head + "        NEd: 10\n        length: 0\n        phi_ef: 3 m\n      - name: L2\n        l0: {y: 3 m, x: 2 m}\n        NEd: 1\n        phi_ef: -1\n", []string{
			"in.yaml:11: columns[0].storeys[0].length: 0 mm is outside the plausible range of the storey height, 2000 mm to 12000 mm (see the input limits in the README)",
			`in.yaml:12: columns[0].storeys[0].phi_ef: "3 m" is a length, expected a pure number`,
			"in.yaml:14: columns[0].storeys[1].l0.x: unknown key (known here: y, z)",
			"in.yaml:14: columns[0].storeys[1].l0.z: is required but missing (the effective length for buckling about z)",
			"in.yaml:16: columns[0].storeys[1].phi_ef: the effective creep ratio must lie between 0 and 10, found -1",
		}},
		{"moments", head + "        NEd: 10\n        M:\n          y: 5\n          z: {top: 3 kN, middle: 2}\n          x: {}\n", []string{
			"in.yaml:12: columns[0].storeys[0].M.y: expected a mapping with the keys top, bottom, found \"5\"",
			"in.yaml:13: columns[0].storeys[0].M.z.middle: unknown key (known here: top, bottom)",
			`in.yaml:13: columns[0].storeys[0].M.z.top: "3 kN" is a force, expected a moment`,
			"in.yaml:14: columns[0].storeys[0].M.x: unknown key (known here: y, z)"}},
		{"vars", "vars:\n  m: 3\n  a: \"b * 2\"\n  c: \"1 m / 0\"\n  d: \"c + 1 m\"\n" + head + "        NEd: \"d / 1 m * 1 kN\"\n        length: c\n        phi_ef: load\n", []string{
			"in.yaml:2: vars.m: m is a unit and cannot be defined",
			`in.yaml:3: vars.a: "b * 2": undefined name b`,
			`in.yaml:4: vars.c: "1 m / 0": division by zero`,
			`in.yaml:17: columns[0].storeys[0].phi_ef: "load": undefined name load`}},
		{"var cycle", "vars:\n  x: y\n  y: \"2 * x\"\n" + head + "        NEd: 10\n", []string{
			"in.yaml:2: vars.x: the definitions form a cycle: x -> y -> x"}},
		{"project", "project:\n  title: [a]\n  client: X\n" + head + "        NEd: 10\n", []string{
			"in.yaml:2: project.title: expected a text, found a list",
			"in.yaml:3: project.client: unknown key (known here: title, job, revision, designer, checker, date)"}},
	}
	for _, c := range cases {
		_, err := Parse("in.yaml", []byte(c.text))
		checkErrors(t, c.name, err, c.want)
	}
}

// checkErrors fails t unless err is Errors reading want, one fault a line.
func checkErrors(t *testing.T, name string, err error, want []string) {
	t.Helper()
	if err == nil {
		t.Errorf("%s: no error, want %q", name, want)
		return
	}
	var es Errors
	if !errors.As(err, &es) {
		t.Errorf("%s: error %T is not Errors", name, err)
		return
	}
	if got := err.Error(); got != strings.Join(want, "\n") {
		t.Errorf("%s:\n got: %s\nwant: %s", name, strings.ReplaceAll(got, "\n", "\n      "), strings.Join(want, "\n      "))
	}
}

func TestMergeAndAlias(t *testing.T) {
	text := `materials: {concrete: C30/37}
columns:
  - id: K1
    b: 350
    h: 350
    cover: 30
    storeys:
      - &lift {name: L1, l0: 3 m, NEd: 1200 kN}
      - <<: *lift
        name: L2
        NEd: 800 kN
  - &col
    id: K2
    b: 300
    h: 300
    cover: 30
    storeys: [{name: L1, l0: 3000, NEd: 100}]
`
	in, err := Parse("in.yaml", []byte(text))
	if err != nil {
		t.Fatal(err)
	}
	s := in.Columns[0].Storeys[1]
	if s.Name != "L2" || s.NEd != 800e3 || s.L0Y != 3000 || s.Line != 9 {
		t.Errorf("merged storey %+v", s)
	}
}

// The golden lists hold every fault of files with many faults; go test -update rewrites them.
// The list of code parameters is written <catalogue> so that adding one keeps the lists valid.
func TestManyErrors(t *testing.T) {
	for _, name := range []string{"bad", "building_bad", "building_refs", "limits_bad"} {
		t.Run(name, func(t *testing.T) {
			_, err := parseFile(t, "testdata/"+name+".yaml")
			if err == nil {
				t.Fatal("no error")
			}
			got := strings.ReplaceAll(err.Error(), catalogue(), "<catalogue>") + "\n"
			golden := "testdata/" + name + ".errors"
			if *update {
				if err := os.WriteFile(golden, []byte(got), 0o644); err != nil {
					t.Fatal(err)
				}
			}
			want, rerr := os.ReadFile(golden)
			if rerr != nil {
				t.Fatal(rerr)
			}
			if got != string(want) {
				t.Errorf("errors:\n%s\nwant:\n%s", got, want)
			}
		})
	}
}

func TestErrorFormat(t *testing.T) {
	cases := []struct {
		err  error
		want string
	}{
		{Error{"in.yaml", 14, "columns[0].storeys[1].NEd", `"3.6 m" is a length, expected a force`},
			`in.yaml:14: columns[0].storeys[1].NEd: "3.6 m" is a length, expected a force`},
		{Error{"in.yaml", 1, "", "the file is empty"}, "in.yaml:1: the file is empty"},
		{Errors{{"a.yaml", 1, "x", "m1"}, {"a.yaml", 2, "y", "m2"}}, "a.yaml:1: x: m1\na.yaml:2: y: m2"},
	}
	for _, c := range cases {
		if got := c.err.Error(); got != c.want {
			t.Errorf("got %q, want %q", got, c.want)
		}
	}
}

func FuzzParse(f *testing.F) {
	for _, p := range []string{"testdata/good.yaml", "testdata/bad.yaml", "testdata/minimal.yaml",
		"testdata/building.yaml", "testdata/building_bad.yaml", "testdata/building_refs.yaml", "testdata/building_contract.yaml",
		"testdata/circle.yaml", "testdata/building_circle.yaml"} {
		data, err := os.ReadFile(p)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	f.Add([]byte(head + "        NEd: 10\n"))
	f.Add([]byte("a: &a {<<: *a}\n"))
	f.Add([]byte("vars: {x: y, y: x}\n"))
	f.Add([]byte(building))
	f.Add([]byte("design: {durability: {exposure: [XC3, XD1], structural_class: S4}, fire: {rating: R90, mu_fi: computed}}\n" +
		head + "        NEd: 10\n    durability: {special_qc: true}\n    fire: {eta_fi: 0.6}\n"))
	f.Add([]byte(building + "  fire_levels: [{levels: [L1], rating: 120}, {levels: R, rating: none}]\n"))
	f.Add([]byte(building + "  omit: [a1]\n  line_loads: [{line: B, from: 2, gk: 1}]\n  column_sizes: [{levels: R, b: 300, h: 300}]\n"))
	f.Add([]byte(head + "        NEd: 10\n        creep: {rh: 50 %, t0: 28 d, cement: r, ratio: 0.5}\n" +
		"design: {second_order: both, biaxial: 5.39, size_search: {step: 25, min: 250, max: 500, square: true}}\n"))
	f.Add([]byte(building + "  effective_length: frame\n  creep: {rh: 60, t0: 7 days}\n"))
	f.Add([]byte("moment_signs: member-ends\n" + head + "        cases: [{name: A, NEd: -10, M: {y: {top: 1, bottom: 2}}, V: {y: 3}}, {name: B, NEd: 20}]\n"))
	f.Add([]byte("actions: t.csv\n" + head))
	f.Add([]byte(circleColumn + "    shape: circle\n    D: 450 mm\n    helix: true\n    bars: {count: 7, dia: 20}\n" + circleTail))
	f.Add([]byte(building + "  bars: {count: 6, dia: 16}\n  column_sizes: [{columns: B1, D: 500, helix: true}, {levels: R, shape: circle}]\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		in, err := Parse("f.yaml", data)
		if err != nil {
			var es Errors
			if !errors.As(err, &es) || len(es) == 0 {
				t.Fatalf("error %v is not a non-empty Errors", err)
			}
			for _, e := range es {
				if e.Line < 1 || e.File != "f.yaml" {
					t.Fatalf("bad position in %v", e)
				}
			}
			return
		}
		checkOptions(t, in.Options)
		if in.Building != nil {
			checkBuilding(t, in.Building)
			checkCreep(t, in.Building.Options.Creep)
			return
		}
		if len(in.Columns) == 0 {
			t.Fatal("no columns without an error")
		}
		for _, c := range in.Columns {
			if len(c.Storeys) == 0 || !(c.B > 0 && c.H > 0 && c.Cover > 0) {
				t.Fatalf("invalid column accepted: %+v", c)
			}
			checkShape(t, c.ID, sizeOf(c))
			if c.Shape == model.ShapeCircle && c.Bars != nil && c.Bars.Count < ringMin {
				t.Fatalf("circle with %d bars accepted", c.Bars.Count)
			}
			for _, s := range c.Storeys {
				for _, v := range []float64{s.L0Y, s.L0Z, s.Length, s.NEd, s.MY.Top, s.MY.Bottom, s.MZ.Top, s.MZ.Bottom, s.PhiEf} {
					if math.IsNaN(v) || math.IsInf(v, 0) {
						t.Fatalf("non-finite value accepted: %+v", s)
					}
				}
				if !(s.L0Y > 0 && s.L0Z > 0) || s.HasPhi && s.Creep != nil || len(s.Cases) == 0 {
					t.Fatalf("invalid storey accepted: %+v", s)
				}
				if first := s.Cases[0]; s.NEd != first.NEd || s.MY != first.MY || s.MZ != first.MZ {
					t.Fatalf("the storey's actions are not those of its first case: %+v", s)
				}
				names := map[string]bool{}
				for _, c := range s.Cases {
					for _, v := range []float64{c.NEd, c.MY.Top, c.MY.Bottom, c.MZ.Top, c.MZ.Bottom, c.V[0], c.V[1]} {
						if math.IsNaN(v) || math.IsInf(v, 0) {
							t.Fatalf("non-finite value accepted: %+v", c)
						}
					}
					if c.Name == "" || names[c.Name] || c.File != "f.yaml" || c.Line < 1 {
						t.Fatalf("invalid case accepted: %+v", c)
					}
					names[c.Name] = true
				}
				checkCreep(t, s.Creep)
			}
		}
	})
}

// checkBuilding fails t when an accepted building breaks what the parser promises.
func checkBuilding(t *testing.T, b *model.Building) {
	t.Helper()
	positive := func(what string, vs ...float64) {
		for _, v := range vs {
			if !(v > 0) || math.IsInf(v, 0) {
				t.Fatalf("%s %g accepted in %+v", what, v, b)
			}
		}
	}
	if len(b.Storeys) == 0 || len(b.GridX) == 0 || len(b.GridY) == 0 {
		t.Fatalf("building without storeys or bays accepted: %+v", b)
	}
	levels := map[string]int{}
	for _, l := range b.Storeys {
		positive("storey height", l.Height)
		levels[l.Name] = 0
	}
	positive("bay", b.GridX...)
	positive("bay", b.GridY...)
	positive("member size", b.Column.B, b.Column.H, b.Beam.B, b.Beam.H, b.Cover, b.Options.Density, b.Options.L0Factor)
	checkShape(t, "default column", b.Column)
	circle := b.Column.Shape == model.ShapeCircle
	for _, c := range b.Columns {
		positive("column size", c.B, c.H)
		checkShape(t, "column size", c.Size)
		circle = circle || c.Shape == model.ShapeCircle
	}
	if circle && b.Bars != nil && b.Bars.Count < ringMin {
		t.Fatalf("circular columns with %d bars accepted", b.Bars.Count)
	}
	for _, c := range b.Beams {
		positive("beam size", c.B, c.H)
	}
	for _, f := range b.Floors {
		ls := f.Levels
		if len(ls) == 0 {
			for _, l := range b.Storeys {
				ls = append(ls, l.Name)
			}
		}
		for _, l := range ls {
			levels[l]++
		}
		if !(f.Gk >= 0 && f.Qk >= 0) || math.IsInf(f.Gk+f.Qk, 0) || f.Spans == "" || f.Qk > 0 && f.Category == "" {
			t.Fatalf("invalid floor accepted: %+v", f)
		}
	}
	for l, n := range levels {
		if n != 1 {
			t.Fatalf("level %s has %d floors", l, n)
		}
	}
	for _, l := range b.Lines {
		if !(l.Gk >= 0 && l.Qk >= 0) || math.IsInf(l.Gk+l.Qk, 0) || l.GridLine == "" || (l.From == "") != (l.To == "") {
			t.Fatalf("invalid line load accepted: %+v", l)
		}
	}
	if len(b.Omit) >= (len(b.GridX)+1)*(len(b.GridY)+1) {
		t.Fatalf("every column omitted: %+v", b.Omit)
	}
}

// checkOptions fails t when accepted method choices or a size finder break what the parser promises.
func checkOptions(t *testing.T, o model.Options) {
	t.Helper()
	if o.SecondOrder == "" || o.Biaxial == "" || !(o.CrackedK >= 0.1 && o.CrackedK <= 1) {
		t.Fatalf("invalid options accepted: %+v", o)
	}
	s := o.Sizes
	if s == nil {
		return
	}
	if !(s.RhoMax >= 0.002 && s.RhoMax <= 0.08) || (len(s.Sizes) > 0) == (s.Step > 0) {
		t.Fatalf("invalid size search accepted: %+v", s)
	}
	for _, z := range s.Sizes {
		if !(z.B > 0 && z.H > 0) || math.IsInf(z.B+z.H, 0) {
			t.Fatalf("invalid size accepted: %+v", s)
		}
	}
	if s.Step > 0 && !(s.Min > 0 && s.Min <= s.Max && !math.IsInf(s.Max, 0)) {
		t.Fatalf("invalid size range accepted: %+v", s)
	}
}

// checkCreep fails t when accepted creep data break what the parser promises.
func checkCreep(t *testing.T, c *model.Creep) {
	t.Helper()
	if c == nil {
		return
	}
	if !(c.RH >= 10 && c.RH <= 100 && c.T0 > 0 && !math.IsInf(c.T0, 0) && c.Ratio >= 0 && c.Ratio <= 1) ||
		c.Cement != "S" && c.Cement != "N" && c.Cement != "R" {
		t.Fatalf("invalid creep data accepted: %+v", c)
	}
}
