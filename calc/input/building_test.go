package input

import (
	"os"
	"reflect"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// The conversions are common practice (SI prefixes), no source: 1 kN/m² = 0.001 N/mm²,
// 1 kN/m = 1 N/mm, 1 kN/m³ = 1e-6 N/mm³.
func TestParseBuilding(t *testing.T) {
	// The file gives beam_stiffness with analysis: both, to which beam_stiffness applies.
	data, err := os.ReadFile("testdata/building.yaml")
	if err != nil {
		t.Fatal(err)
	}
	in, err := Parse("testdata/building.yaml", data)
	if err != nil {
		t.Fatal(err)
	}
	b := in.Building
	if b == nil || len(in.Columns) != 0 {
		t.Fatalf("building %v, columns %v", b, in.Columns)
	}
	if len(b.Storeys) != 3 || len(b.Floors) != 2 || len(b.Columns) != 3 || len(b.Beams) != 3 || len(b.Lines) != 3 {
		t.Fatalf("entries: %+v", b)
	}
	f0, f1 := b.Floors[0], b.Floors[1]
	nums := []numCheck{
		{"line", float64(b.Line), 8},
		{"L1 height (3.8 m)", b.Storeys[0].Height, 3800},
		{"L2 height (plain mm)", b.Storeys[1].Height, 3300},
		{"R height (expression)", b.Storeys[2].Height, 3300},
		{"L2 line", float64(b.Storeys[1].Line), 11},
		{"column b", b.Column.B, 350},
		{"column h", b.Column.H, 450},
		{"cover", b.Cover, 35},
		{"beam b", b.Beam.B, 275},
		{"beam h", b.Beam.H, 500},
		{"override b", b.Columns[0].B, 400},
		{"override h (0.3 m)", b.Columns[2].B, 300},
		{"override h (30 cm)", b.Columns[2].H, 300},
		{"override plain b", b.Columns[1].B, 300},
		{"override line", float64(b.Columns[1].Line), 18},
		{"beam override h", b.Beams[0].H, 600},
		{"beam override plain", b.Beams[1].H, 550},
		{"floor gk (4.7 kN/m2 + 0.05 m · 22 kN/m3)", f0.Gk, 0.0058},
		{"floor qk (2.5 kN/m2)", f0.Qk, 0.0025},
		{"roof gk (plain kN/m2)", f1.Gk, 0.0039},
		{"roof qk", f1.Qk, 0.0006},
		{"floor line", float64(f1.Line), 26},
		{"facade gk (8.5 kN/m = 8.5 N/mm)", b.Lines[0].Gk, 8.5},
		{"facade qk", b.Lines[0].Qk, 0},
		{"plain line load (kN/m)", b.Lines[1].Gk, 6},
		{"imposed line load", b.Lines[2].Qk, 1.5},
		{"density (24 kN/m3)", b.Options.Density, 2.4e-5},
		{"l0 factor", b.Options.L0Factor, 0.85},
		{"bars dia", b.Bars.Dia, 16},
		{"bars count", float64(b.Bars.Count), 8},
	}
	checkNums(t, nums)
	lists := []listCheck{
		{"grid x (var, 6.6 m, 4.8 m)", b.GridX, []float64{6600, 6600, 4800}},
		{"grid y (7.8 m, plain mm)", b.GridY, []float64{7800, 5700}},
		{"override ids upper-cased", b.Columns[0].IDs, []string{"B2", "C2"}},
		{"override levels", b.Columns[0].Levels, []string{"L1", "L2"}},
		{"single id", b.Columns[1].IDs, []string{"A1"}},
		{"all levels", b.Columns[1].Levels, []string(nil)},
		{"beam lines (YAML number 3)", b.Beams[0].Lines, []string{"1", "3"}},
		{"beam line letter", b.Beams[1].Lines, []string{"A"}},
		{"beam single line", b.Beams[2].Lines, []string{"2"}},
		{"single level", f1.Levels, []string{"R"}},
		{"omit", b.Omit, []string{"B3"}},
	}
	checkLists(t, lists)
	texts := []textCheck{
		{"category (b)", f0.Category, "B"},
		{"spans", f0.Spans, model.SpanY},
		{"two-way", f1.Spans, model.SpanTwoWay},
		{"beam dir", b.Beams[0].Dir, "x"},
		{"beam dir with a single line", b.Beams[2].Dir, "x"},
		{"facade line", b.Lines[0].GridLine, "A"},
		{"facade from", b.Lines[0].From, "1"},
		{"facade to", b.Lines[0].To, "3"},
		{"facade category", b.Lines[0].Category, "B"},
		{"numbered line", b.Lines[1].GridLine, "3"},
		{"from given, to the end", b.Lines[1].From + "-" + b.Lines[1].To, "B-D"},
		{"to given, from the start", b.Lines[2].From + "-" + b.Lines[2].To, "1-2"},
		{"lettered line upper-cased", b.Lines[2].GridLine, "D"},
		{"base", b.Base, model.BasePinned},
		{"analysis", b.Analysis, model.AnalysisBoth},
		{"beam stiffness", b.Options.BeamStiffness, "full"},
		{"combination (YAML number 6.10)", b.Options.Combination, model.Comb610},
		{"reduction", b.Options.Reduction, model.ReduceArea},
	}
	checkTexts(t, texts)
	if !b.Options.BeamStiffnessGiven {
		t.Error("beam_stiffness given but BeamStiffnessGiven not set")
	}
	if !equal(in.Options.LinkDiameters, []float64{8, 10}) {
		t.Errorf("design options %v", in.Options.LinkDiameters)
	}
}

// The building form of DESIGN.md parses as written, with its defaults.
func TestBuildingContract(t *testing.T) {
	in, err := parseFile(t, "testdata/building_contract.yaml")
	if err != nil {
		t.Fatal(err)
	}
	want := &model.Building{
		Line: 4,
		Storeys: []model.Level{
			{Name: "L1", Height: 3800, Line: 6},
			{Name: "L2", Height: 3300, Line: 7},
			{Name: "R", Height: 3300, Line: 8},
		},
		GridX:  []float64{6600, 6600, 4800},
		GridY:  []float64{7800, 5700},
		Column: model.Size{B: 350, H: 450},
		Cover:  40,
		Beam:   model.Size{B: 275, H: 500},
		Floors: []model.Floor{
			{Levels: []string{"L1", "L2"}, Gk: 0.0058, Qk: 0.0025, Category: "B", Spans: model.SpanY, Line: 14},
			{Levels: []string{"R"}, Gk: 0.0039, Qk: 0.0006, Category: "H", Spans: model.SpanY, Line: 15},
		},
		Base:     model.BaseFixed,
		Analysis: model.AnalysisSubframe,
		Options: model.BuildingOptions{BeamStiffness: "half", SpanRatio: 1.5, Combination: model.Comb610,
			Reduction: model.ReduceNone, Density: 2.5e-5, L0Factor: 1},
	}
	got := in.Building
	// Area loads are products of a decimal and 1e-3: compare them within rounding.
	for i := range got.Floors {
		if near(got.Floors[i].Gk, want.Floors[i].Gk) && near(got.Floors[i].Qk, want.Floors[i].Qk) {
			got.Floors[i].Gk, got.Floors[i].Qk = want.Floors[i].Gk, want.Floors[i].Qk
		}
	}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("got  %+v\nwant %+v", got, want)
	}
}

// building is a valid building block; cases replace or add keys with edits.
const building = `materials: {concrete: C30/37}
building:
  storeys:
    - {name: L1, height: 3.8 m}
    - {name: R, height: 3.3 m}
  grid: {x: [6.6 m, 6.6 m], y: [7.8 m]}
  columns: {b: 350 mm, h: 450 mm}
  beams: {b: 275 mm, h: 500 mm}
  floors:
    - {gk: 5.8 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}
`

func TestBuildingCases(t *testing.T) {
	cases := []struct {
		name, extra string
		check       func(*model.Input) string
	}{
		{"defaults", "", func(in *model.Input) string {
			b := in.Building
			if b.Cover != 40 || b.Bars != nil || b.Base != model.BaseFixed || b.Analysis != model.AnalysisSubframe ||
				b.Options != (model.BuildingOptions{BeamStiffness: "half", SpanRatio: 1.5, Combination: model.Comb610, Reduction: model.ReduceNone, Density: 2.5e-5, L0Factor: 1}) {
				return "defaults wrong"
			}
			if !reflect.DeepEqual(b.Floors[0].Levels, []string(nil)) {
				return "levels of a floor without levels should be empty (all)"
			}
			return ""
		}},
		{"combination text", "  combination: 6.10ab\n", func(in *model.Input) string {
			return want(in.Building.Options.Combination, model.Comb610ab)
		}},
		{"combination quoted", "  combination: \"6.10\"\n", func(in *model.Input) string {
			return want(in.Building.Options.Combination, model.Comb610)
		}},
		{"density from the code", "code: {overrides: {density_rc: 24 kN/m3}}\n", func(in *model.Input) string {
			if !near(in.Building.Options.Density, 2.4e-5) {
				return "density not taken from code.overrides.density_rc"
			}
			return ""
		}},
		{"density plain kN/m3", "  density: 24\n", func(in *model.Input) string {
			if !near(in.Building.Options.Density, 2.4e-5) {
				return "plain density not in kN/m3"
			}
			// The columns' self-weight takes the same density, through the parameter.
			if !near(in.Code.Get("density_rc"), 2.4e-5) || !in.Code.IsOverridden("density_rc") {
				return "building.density does not set density_rc"
			}
			return ""
		}},
		{"line along the whole line", "  line_loads: [{line: \"1\", gk: 8}]\n", func(in *model.Input) string {
			l := in.Building.Lines[0]
			return want(l.GridLine+"|"+l.From+"|"+l.To, "1||")
		}},
		{"overlapping overrides kept in order", "  column_sizes:\n    - {levels: [L1], b: 400, h: 400}\n    - {columns: [C2], b: 300, h: 300}\n" +
			"  beam_sizes:\n    - {b: 300, h: 600}\n    - {dir: y, lines: [b], b: 250, h: 500}\n", func(in *model.Input) string {
			b := in.Building
			if len(b.Columns) != 2 || b.Columns[1].IDs[0] != "C2" || len(b.Beams) != 2 || b.Beams[1].Lines[0] != "B" {
				return "overrides not kept in input order"
			}
			return ""
		}},
		{"leading zeros and case", "  omit: [c01]\n  line_loads: [{line: b, from: 01, gk: 1}]\n", func(in *model.Input) string {
			l := in.Building.Lines[0]
			return want(in.Building.Omit[0]+" "+l.GridLine+l.From+l.To, "C1 B12")
		}},
	}
	for _, c := range cases {
		text := building + c.extra
		if strings.HasPrefix(c.extra, "code:") {
			text = c.extra + building
		}
		in, err := Parse("in.yaml", []byte(text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if msg := c.check(in); msg != "" {
			t.Errorf("%s: %s", c.name, msg)
		}
	}
}

func want(got, want string) string {
	if got != want {
		return "got " + got + ", want " + want
	}
	return ""
}

func TestBuildingErrors(t *testing.T) {
	cases := []struct {
		name, text string
		want       []string
	}{
		{"both forms", building + "columns: []\n", []string{
			"in.yaml:2: building: a file gives either columns (the actions form, line 11) or building (the building form, line 2), not both"}},
		{"not a mapping", "materials: {concrete: C30/37}\nbuilding: [1]\n", []string{
			"in.yaml:2: building: expected a mapping with the keys " + strings.Join(buildingKeys, ", ") + `, found a list`}},
		{"required keys", "materials: {concrete: C30/37}\nbuilding:\n  base: fixed\n", []string{
			"in.yaml:3: building.storeys: is required but missing (the levels lowest first, e.g. storeys: [{name: L1, height: 3.8 m}])",
			"in.yaml:3: building.grid: is required but missing (the bay widths, e.g. grid: {x: [6.6 m, 6.6 m], y: [7.8 m]})",
			"in.yaml:3: building.columns: is required but missing (the default column size, e.g. columns: {b: 350 mm, h: 450 mm})",
			"in.yaml:3: building.beams: is required but missing (the default beam size, e.g. beams: {b: 275 mm, h: 500 mm})",
			"in.yaml:3: building.floors: is required but missing (the area loads of every level, e.g. floors: [{gk: 5.8 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}])"}},
		{"grid without bays", strings.Replace(building, "y: [7.8 m]", "y: []", 1), []string{
			"in.yaml:6: building.grid.y: the list is empty; give at least one of the bay widths"}},
		{"grid missing a direction", strings.Replace(building, ", y: [7.8 m]", "", 1), []string{
			"in.yaml:6: building.grid.y: is required but missing (the bay widths along y, e.g. y: [6.6 m, 6.6 m])"}},
		{"too many bays", strings.Replace(building, "y: [7.8 m]", "y: ["+strings.Repeat("1 m, ", MaxBays)+"1 m]", 1), []string{
			"in.yaml:6: building.grid.y: 101 bays are more than the 100 the building form takes"}},
		{"every point omitted", building + "  omit: [A1, B1, C1, A2, B2, C2]\n", []string{
			"in.yaml:11: building.omit: every grid point is omitted; at least one column must remain"}},
		{"omitted point not on the grid", building + "  omit: [D1, A3, AA1, A0, 1]\n", []string{
			"in.yaml:11: building.omit[0]: D1 is not a grid point (lettered lines A to C, numbered lines 1 to 2)",
			"in.yaml:11: building.omit[1]: A3 is not a grid point (lettered lines A to C, numbered lines 1 to 2)",
			"in.yaml:11: building.omit[2]: AA1 is not a grid point (lettered lines A to C, numbered lines 1 to 2)",
			`in.yaml:11: building.omit[3]: "A0" is not a column id; give a lettered and a numbered grid line, e.g. B2`,
			`in.yaml:11: building.omit[4]: "1" is not a column id; give a lettered and a numbered grid line, e.g. B2`}},
		{"wrong dimensions", strings.NewReplacer("5.8 kN/m2", "5.8 kN/m", "350 mm", "350 kN", "3.3 m", "3.3 m2").Replace(building) +
			"  density: 25 kN/m2\n  line_loads: [{line: A, gk: 2 kN/m2}]\n  l0_factor: 1 m\n", []string{
			`in.yaml:5: building.storeys[1].height: "3.3 m2" is an area, expected a length`,
			`in.yaml:7: building.columns.b: "350 kN" is a force, expected a length`,
			`in.yaml:10: building.floors[0].gk: "5.8 kN/m" is a line load, expected a stress`,
			`in.yaml:11: building.density: "25 kN/m2" is a stress, expected a weight density`,
			`in.yaml:12: building.line_loads[0].gk: "2 kN/m2" is a stress, expected a line load`,
			`in.yaml:13: building.l0_factor: "1 m" is a length, expected a pure number`}},
		{"unknown keys", strings.Replace(building, "spans: y}", "spans: y, span: x}", 1) + "  roof: flat\n", []string{
			"in.yaml:10: building.floors[0].span: unknown key (known here: levels, gk, qk, category, spans, slab)",
			"in.yaml:11: building.roof: unknown key (known here: " + strings.Join(buildingKeys, ", ") + ")"}},
		{"floors missing a level", strings.Replace(building, "{gk:", "{levels: [L1], gk:", 1), []string{
			"in.yaml:9: building.floors: level R has no floor"}},
		{"overlapping floors", building + "    - {levels: [R, L1], gk: 1, qk: 0, spans: x}\n", []string{
			"in.yaml:11: building.floors[1].levels: level R is given by building.floors[0] and building.floors[1]",
			"in.yaml:11: building.floors[1].levels: level L1 is given by building.floors[0] and building.floors[1]"}},
		{"floor keys", strings.Replace(building, "{gk: 5.8 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}", "{levels: [], category: b2}", 1), []string{
			"in.yaml:10: building.floors[0].levels: the list is empty; give at least one of the storey levels",
			"in.yaml:10: building.floors[0].gk: is required but missing (the permanent area load besides beams and columns, e.g. gk: 5.8 kN/m2)",
			"in.yaml:10: building.floors[0].qk: is required but missing (the imposed area load, e.g. qk: 2.5 kN/m2; 0 for none)",
			`in.yaml:10: building.floors[0].category: "b2" is not an imposed-load category of EN 1991-1-1 Table 6.1 (one of A, B, C, D, E, F, G, H)`,
			"in.yaml:10: building.floors[0].spans: is required but missing (how the slab carries its load: x, y or two-way)"}},
		{"unknown level", building + "  column_sizes: [{levels: [L2, L1, L1], b: 400, h: 400}]\n", []string{
			`in.yaml:11: building.column_sizes[0].levels[0]: "L2" is not a storey level (levels: L1, R)`,
			"in.yaml:11: building.column_sizes[0].levels[2]: level L1 is listed twice"}},
		{"column size needs b and h", building + "  column_sizes: [{columns: B1, h: 400}]\n", []string{
			"in.yaml:11: building.column_sizes[0].b: is required but missing (the width along building y, e.g. b: 350 mm)"}},
		{"no room in the default column", strings.Replace(building, "b: 350 mm, h: 450 mm", "b: 200 mm, h: 450 mm, cover: 80 mm", 1), []string{
			"in.yaml:7: building.columns.cover: no room for links and bars: 2·(cover + link + bar) = 2·(80 + 8 + 12) = 200 mm is not less than min(b, h) = 200 mm"}},
		{"no room with the given bars", building + "  bars: {count: 4, dia: 40}\n  column_sizes: [{columns: B1, b: 170, h: 400}]\n", []string{
			"in.yaml:12: building.column_sizes[0].b: no room for links and bars: 2·(cover + link + bar) = 2·(40 + 8 + 40) = 176 mm is not less than min(b, h) = 170 mm"}},
		{"beam lines", building + "  beam_sizes:\n    - {dir: x, lines: [A, 3, \"?\"], b: 300, h: 600}\n    - {dir: y, lines: [\"1\"], b: 300, h: 600}\n    - {lines: [C, C], b: 300, h: 600}\n", []string{
			"in.yaml:12: building.beam_sizes[0].lines[0]: line A is a lettered line, which runs along y; beams along x (dir x) lie on numbered lines",
			"in.yaml:12: building.beam_sizes[0].lines[1]: line 3 is not on the grid (lettered lines A to C, numbered lines 1 to 2)",
			`in.yaml:12: building.beam_sizes[0].lines[2]: "?" is not a grid line name (lettered lines A, B, ... run along y, numbered lines 1, 2, ... along x)`,
			"in.yaml:13: building.beam_sizes[1].lines[0]: line 1 is a numbered line, which runs along x; beams along y (dir y) lie on lettered lines",
			"in.yaml:14: building.beam_sizes[2].lines[1]: line C is listed twice"}},
		{"line loads", building + "  line_loads:\n    - {line: A, from: \"2\", to: \"1\", gk: 1}\n    - {line: \"1\", from: A, to: D, qk: 2}\n    - {line: B, from: C, gk: -1}\n    - {from: \"1\", gk: 1}\n", []string{
			"in.yaml:12: building.line_loads[0].to: the range from line 2 to line 1 along line A is empty; give from before to",
			"in.yaml:13: building.line_loads[1].to: line D is not on the grid (lettered lines A to C, numbered lines 1 to 2)",
			"in.yaml:13: building.line_loads[1].category: is required but missing with an imposed load (the category of EN 1991-1-1 Table 6.1, e.g. category: B)",
			"in.yaml:14: building.line_loads[2].from: line C runs parallel to line B and does not cross it; give a numbered line",
			"in.yaml:14: building.line_loads[2].gk: -1 kN/m is outside the plausible range of the line load, 0 kN/m to 1000 kN/m (see the input limits in the README)",
			"in.yaml:15: building.line_loads[3].line: is required but missing (the grid line of the beams, e.g. line: A)"}},
		{"options", building + "  analysis: exact\n  beam_stiffness: 0.5\n  imposed_reduction: both\n  combination: 6.1a\n  l0_factor: 0.4\n  base: [fixed]\n", []string{
			`in.yaml:11: building.analysis: "exact" is not one of subframe, frame, both`,
			`in.yaml:12: building.beam_stiffness: "0.5" is not one of half, full`,
			`in.yaml:13: building.imposed_reduction: "both" is not one of none, area, storeys`,
			`in.yaml:14: building.combination: "6.1a" is not one of 6.10, 6.10ab`,
			"in.yaml:15: building.l0_factor: the effective length factor must lie between 0.5 and 2, found 0.4",
			"in.yaml:16: building.base: expected a text, found a list"}},
		{"storeys", strings.Replace(building, "{name: R, height: 3.3 m}", "{name: L1, height: -3.3 m}\n    - {name: \"\", height: 3 m}\n    - L3", 1), []string{
			`in.yaml:5: building.storeys[1].name: storey name "L1" is used twice (first at building.storeys[0])`,
			"in.yaml:5: building.storeys[1].height: -3300 mm is outside the plausible range of the storey height, 2000 mm to 12000 mm (see the input limits in the README)",
			"in.yaml:6: building.storeys[2].name: must not be empty",
			`in.yaml:7: building.storeys[3]: expected a mapping with the keys name, height, found "L3"`}},
	}
	for _, c := range cases {
		expectErrors(t, c.name, c.text, c.want)
	}
}

func TestGridNames(t *testing.T) {
	cases := []struct {
		i    int
		name string
	}{{0, "A"}, {1, "B"}, {25, "Z"}, {26, "AA"}, {27, "AB"}, {51, "AZ"}, {52, "BA"}, {701, "ZZ"}, {702, "AAA"}}
	for _, c := range cases {
		if got := letters(c.i); got != c.name {
			t.Errorf("letters(%d) = %s, want %s", c.i, got, c.name)
		}
		if k, i, name, ok := parseLine(strings.ToLower(c.name)); !ok || k != lettered || i != c.i || name != c.name {
			t.Errorf("parseLine(%s) = %v %d %s %v", c.name, k, i, name, ok)
		}
	}
	for _, s := range []string{"", "0", "-1", "A1", "1A", "ÄB", "12345", "AAAAA", " "} {
		if _, _, _, ok := parseLine(s); ok {
			t.Errorf("parseLine(%q) accepted", s)
		}
	}
	if k, i, name, ok := parseLine(" 007 "); !ok || k != numbered || i != 6 || name != "7" {
		t.Errorf("parseLine(007) = %v %d %s %v", k, i, name, ok)
	}
}
