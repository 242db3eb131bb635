package input

import (
	"errors"
	"math"
	"reflect"
	"slices"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// more is the building block with every key of buildings as they are (invented values, test
// input only): the slab on the floor, then the keys from line 11.
var more = strings.Replace(building, "spans: y}", "spans: y, slab: {thickness: 225 mm}}", 1) +
	`  omit: [C2, {columns: [B2], levels: [L1]}, {columns: [a1, B1], levels: R}]
  concrete:
    - {levels: [L1], columns: [A1, B2], class: C45/55}
    - {class: c40/50}
  beam_concrete: C35/45
  point_loads:
    - {levels: [R], at: {x: 9.6 m, y: 3.0 m}, gk: 45 kN, qk: 10 kN, category: E}
    - {at: {x: 13.2 m, y: 0}, gk: 20}
  area_loads:
    - {levels: [L1], x: [6.6 m, 13.2 m], y: [0, 7.8 m], gk: 2.0 kN/m2, qk: 5.0 kN/m2, category: e}
    - {x: [1000, 2 m], y: ["1 m", 2500], qk: 1, category: A}
  cantilevers:
    - {levels: [L1, R], line: A, from: "1", to: "2", length: 1.5 m}
    - {line: "2", length: 800}
    - {line: c, to: 2, length: 2 m}
  analysis: both
  span_ratio: 2
`

// The conversions are common practice (SI prefixes), no source: 1 kN = 1000 N,
// 1 kN/m² = 0.001 N/mm², 1 m = 1000 mm. Concrete strengths: EN 1992-1-1:2004 Table 3.1.
// Tolerance: relative 1e-9 (near).
func TestBuildingAsItIs(t *testing.T) {
	in, err := Parse("in.yaml", []byte(more))
	if err != nil {
		t.Fatal(err)
	}
	b := in.Building
	if len(b.PointLoads) != 2 || len(b.AreaLoads) != 2 || len(b.Cantilevers) != 3 || len(b.Concrete) != 2 || b.BeamConcrete == nil {
		t.Fatalf("entries: %+v", b)
	}
	p0, p1, a0, a1 := b.PointLoads[0], b.PointLoads[1], b.AreaLoads[0], b.AreaLoads[1]
	nums := []numCheck{
		{"slab thickness (225 mm)", b.Floors[0].Thickness, 225},
		{"point x (9.6 m)", p0.X, 9600},
		{"point y (3.0 m)", p0.Y, 3000},
		{"point gk (45 kN)", p0.Gk, 45e3},
		{"point qk (10 kN)", p0.Qk, 10e3},
		{"point line", float64(p0.Line), 17},
		{"point on the far edge x (13.2 m, the grid's length)", p1.X, 13200},
		{"point on line 1 (y 0)", p1.Y, 0},
		{"point gk plain (kN)", p1.Gk, 20e3},
		{"point qk absent", p1.Qk, 0},
		{"zone x from (6.6 m)", a0.X[0], 6600},
		{"zone x to (13.2 m)", a0.X[1], 13200},
		{"zone y from (0)", a0.Y[0], 0},
		{"zone y to (7.8 m)", a0.Y[1], 7800},
		{"zone gk (2.0 kN/m2)", a0.Gk, 0.002},
		{"zone qk (5.0 kN/m2)", a0.Qk, 0.005},
		{"zone plain x (mm)", a1.X[0], 1000},
		{"zone x to (2 m)", a1.X[1], 2000},
		{"zone quoted y (1 m)", a1.Y[0], 1000},
		{"zone plain y (mm)", a1.Y[1], 2500},
		{"zone plain qk (kN/m2)", a1.Qk, 0.001},
		{"zone gk absent", a1.Gk, 0},
		{"cantilever length (1.5 m)", b.Cantilevers[0].Length, 1500},
		{"cantilever plain length (mm)", b.Cantilevers[1].Length, 800},
		{"cantilever length (2 m)", b.Cantilevers[2].Length, 2000},
		{"zone fck C45/55", b.Concrete[0].Class.Fck, 45},
		{"zone fck c40/50", b.Concrete[1].Class.Fck, 40},
		{"beam fck C35/45", b.BeamConcrete.Fck, 35},
		{"span ratio", b.Options.SpanRatio, 2},
	}
	checkNums(t, nums)
	lists := []listCheck{
		{"plain omit", b.Omit, []string{"C2"}},
		{"omit at levels", b.OmitAt, []model.OmitLevels{
			{Columns: []string{"B2"}, Levels: []string{"L1"}, Line: 11},
			{Columns: []string{"A1", "B1"}, Levels: []string{"R"}, Line: 11}}},
		{"zone levels", b.Concrete[0].Levels, []string{"L1"}},
		{"zone columns", b.Concrete[0].Columns, []string{"A1", "B2"}},
		{"zone of all levels", b.Concrete[1].Levels, []string(nil)},
		{"zone of all columns", b.Concrete[1].Columns, []string(nil)},
		{"point levels", p0.Levels, []string{"R"}},
		{"point of all levels", p1.Levels, []string(nil)},
		{"zone load levels", a0.Levels, []string{"L1"}},
		{"cantilever levels", b.Cantilevers[0].Levels, []string{"L1", "R"}},
	}
	checkLists(t, lists)
	c0, c1, c2 := b.Cantilevers[0], b.Cantilevers[1], b.Cantilevers[2]
	texts := []textCheck{
		{"zone class", b.Concrete[0].Class.Class, "C45/55"},
		{"zone class upper-cased", b.Concrete[1].Class.Class, "C40/50"},
		{"beam class", b.BeamConcrete.Class, "C35/45"},
		{"point category", p0.Category, "E"},
		{"point without qk, no category", p1.Category, ""},
		{"zone category upper-cased", a0.Category, "E"},
		{"cantilever on A from 1 to 2", c0.GridLine + c0.From + c0.To, "A12"},
		{"cantilever on the whole of line 2", c1.GridLine + "|" + c1.From + "|" + c1.To, "2||"},
		{"cantilever on C, from the start", c2.GridLine + c2.From + c2.To, "C12"},
		{"analysis", b.Analysis, model.AnalysisBoth},
		{"beam stiffness default", b.Options.BeamStiffness, "half"},
	}
	checkTexts(t, texts)
	if b.Options.BeamStiffnessGiven {
		t.Error("BeamStiffnessGiven set without beam_stiffness")
	}
}

// The new keys' defaults and the forms they take besides the full one.
func TestBuildingAsItIsCases(t *testing.T) {
	onL1 := strings.Replace(building, "{gk:", "{levels: [L1], gk:", 1) + "    - {levels: [R], gk: 1, qk: 0, spans: x}\n"
	cases := []struct {
		name, text string
		check      func(*model.Building) string
	}{
		{"defaults", building, func(b *model.Building) string {
			if b.OmitAt != nil || b.Concrete != nil || b.BeamConcrete != nil || b.PointLoads != nil || b.AreaLoads != nil ||
				b.Cantilevers != nil || b.Floors[0].Thickness != 0 || b.Options.SpanRatio != DefaultSpanRatio || b.Options.BeamStiffnessGiven {
				return "defaults wrong"
			}
			return ""
		}},
		{"beam stiffness given with the subframe", building + "  beam_stiffness: full\n", func(b *model.Building) string {
			return want(b.Options.BeamStiffness+" "+yes(b.Options.BeamStiffnessGiven), "full given")
		}},
		{"beam stiffness given at its default", building + "  analysis: subframe\n  beam_stiffness: half\n", func(b *model.Building) string {
			return want(b.Options.BeamStiffness+" "+yes(b.Options.BeamStiffnessGiven), "half given")
		}},
		{"beam stiffness with both", building + "  analysis: both\n  beam_stiffness: full\n", func(b *model.Building) string {
			return want(b.Analysis+" "+b.Options.BeamStiffness+" "+yes(b.Options.BeamStiffnessGiven), "both full given")
		}},
		{"frame without beam stiffness", building + "  analysis: frame\n", func(b *model.Building) string {
			return want(b.Analysis+" "+yes(b.Options.BeamStiffnessGiven), "frame not given")
		}},
		{"span ratio just above 1", building + "  span_ratio: 1.01\n", func(b *model.Building) string {
			return want(show(b.Options.SpanRatio, ""), "1.01")
		}},
		{"omit as one entry", building + "  omit: {columns: B2, levels: L1}\n", func(b *model.Building) string {
			if len(b.Omit) != 0 || !reflect.DeepEqual(b.OmitAt, []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1"}, Line: 11}}) {
				return "one entry not read as a list of one"
			}
			return ""
		}},
		// A column absent below and present above stands on the beams (a transfer); absent
		// above and present below, it stops; absent at every level but in two entries is refused
		// (TestBuildingAsItIsErrors).
		{"omit at the top and at the bottom", building + "  omit:\n    - {columns: [A1], levels: [R]}\n    - {columns: [B1, C1], levels: [L1]}\n", func(b *model.Building) string {
			if len(b.OmitAt) != 2 || b.OmitAt[1].Line != 13 || !slices.Equal(b.OmitAt[1].Columns, []string{"B1", "C1"}) {
				return "entries wrong"
			}
			return ""
		}},
		{"slab thinner than a deeper override of every beam at its level",
			strings.Replace(onL1, "spans: y}", "spans: y, slab: {thickness: 600}}", 1) + "  beam_sizes: [{levels: [L1], b: 300, h: 700}]\n",
			func(b *model.Building) string { return want(show(b.Floors[0].Thickness, "mm"), "600 mm") }},
		{"slab just thinner than the beams", strings.Replace(building, "spans: y}", "spans: y, slab: {thickness: 499 mm}}", 1), func(b *model.Building) string {
			return want(show(b.Floors[0].Thickness, "mm"), "499 mm")
		}},
		{"point load on the grid's corner", building + "  point_loads: [{at: {x: 13200, y: 7800}, qk: 5, category: g}]\n", func(b *model.Building) string {
			p := b.PointLoads[0]
			return want(show(p.X, "mm")+" "+show(p.Y, "mm")+" "+show(p.Qk, "kN")+" "+p.Category, "13200 mm 7800 mm 5 kN G")
		}},
		{"area load over the whole grid", building + "  area_loads: [{x: [0, 13.2 m], y: [0 m, 7800 mm], gk: 0.5}]\n", func(b *model.Building) string {
			a := b.AreaLoads[0]
			return want(show(a.X[1], "mm")+" "+show(a.Y[1], "mm")+" "+show(a.Gk, "kN/m2"), "13200 mm 7800 mm 0.5 kN/m2")
		}},
		{"cantilever lengths at the limits", building + "  cantilevers: [{line: a, length: 0.3 m}, {line: \"1\", length: 5 m}]\n", func(b *model.Building) string {
			return want(show(b.Cantilevers[0].Length, "mm")+" "+show(b.Cantilevers[1].Length, "mm"), "300 mm 5000 mm")
		}},
	}
	for _, c := range cases {
		in, err := Parse("in.yaml", []byte(c.text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if msg := c.check(in.Building); msg != "" {
			t.Errorf("%s: %s", c.name, msg)
		}
	}
}

// numCheck, listCheck and textCheck are one value read, with the value it should have.
type (
	numCheck struct {
		name      string
		got, want float64
	}
	listCheck struct {
		name      string
		got, want any
	}
	textCheck struct{ name, got, want string }
)

// checkNums fails t for each number not near (relative 1e-9) the one it should be.
func checkNums(t *testing.T, cs []numCheck) {
	t.Helper()
	for _, c := range cs {
		if !near(c.got, c.want) {
			t.Errorf("%s = %g, want %g", c.name, c.got, c.want)
		}
	}
}

// checkLists fails t for each value not deeply equal to the one it should be.
func checkLists(t *testing.T, cs []listCheck) {
	t.Helper()
	for _, c := range cs {
		if !reflect.DeepEqual(c.got, c.want) {
			t.Errorf("%s = %+v, want %+v", c.name, c.got, c.want)
		}
	}
}

// checkTexts fails t for each text not the one it should be.
func checkTexts(t *testing.T, cs []textCheck) {
	t.Helper()
	for _, c := range cs {
		if c.got != c.want {
			t.Errorf("%s = %q, want %q", c.name, c.got, c.want)
		}
	}
}

// yes names a flag for the checks.
func yes(v bool) string {
	if v {
		return "given"
	}
	return "not given"
}

func TestBuildingAsItIsErrors(t *testing.T) {
	const grid = "(lettered lines A to C, numbered lines 1 to 2)"
	slab := func(thickness string) string {
		return strings.Replace(building, "spans: y}", "spans: y, slab: "+thickness+"}", 1)
	}
	cases := []struct {
		name, text string
		want       []string
	}{
		{"omit entries", building + "  omit:\n    - C2\n    - {columns: [C2, B1], levels: [L1]}\n    - {levels: [L3]}\n    - {columns: [D1]}\n    - [A1]\n", []string{
			"in.yaml:13: building.omit[1].columns[0]: C2 is in the plain list of omit, absent at every level already; give it once",
			"in.yaml:14: building.omit[2].columns: is required but missing (the columns absent at these levels, e.g. columns: [B2])",
			"in.yaml:14: building.omit[2].levels[0]: \"L3\" is not a storey level (levels: L1, R)",
			"in.yaml:15: building.omit[3].columns[0]: D1 is not a grid point " + grid,
			"in.yaml:15: building.omit[3].levels: is required but missing (the levels without these columns, e.g. levels: [L1]; a column absent at every level goes in the plain list, e.g. omit: [B2])",
			"in.yaml:16: building.omit[4]: expected a column id such as B2 or an entry {columns: [B2], levels: [L1]}, found a list"}},
		{"omit at every level by entries", building + "  omit:\n    - {columns: [B1, A2], levels: [L1]}\n    - {columns: [b1], levels: [R, L1]}\n", []string{
			"in.yaml:13: building.omit[1].columns: B1 is absent at every level (L1, R); use the plain list, e.g. omit: [B1]"}},
		{"omit every point of a level", building + "  omit: [A1, B1, C1, {columns: [A2, B2, C2], levels: R}]\n", []string{
			"in.yaml:11: building.omit: every grid point is omitted at level R; at least one column must remain"}},
		{"concrete zones", building + "  omit: [C2]\n  concrete:\n    - {levels: [L2], columns: [C2, A1, A1], class: C45/55}\n    - {columns: A1}\n    - {class: C45}\n    - {class: [C30/37]}\n    - C30/37\n  beam_concrete: C70/80\n", []string{
			"in.yaml:13: building.concrete[0].levels[0]: \"L2\" is not a storey level (levels: L1, R)",
			"in.yaml:13: building.concrete[0].columns[0]: C2 is omitted, so it has no column",
			"in.yaml:13: building.concrete[0].columns[2]: column A1 is listed twice",
			"in.yaml:14: building.concrete[1].class: is required but missing (the strength class of EN 1992-1-1 Table 3.1, e.g. class: C45/55)",
			"in.yaml:15: building.concrete[2].class: \"C45\" is not a strength class of EN 1992-1-1 Table 3.1 (classes: " + classNames() + ")",
			"in.yaml:16: building.concrete[3].class: expected a text, found a list",
			"in.yaml:17: building.concrete[4]: expected a mapping with the keys levels, columns, class, found \"C30/37\"",
			"in.yaml:18: building.beam_concrete: \"C70/80\" is not a strength class of EN 1992-1-1 Table 3.1 (classes: " + classNames() + ")"}},
		{"point loads", building + "  point_loads:\n    - {levels: [R], at: {x: 14 m, y: -1 m}, gk: 45 kN, qk: 10 kN}\n    - {at: {x: 1 m}, gk: 12000 kN, qk: -1}\n" +
			"    - {gk: 5 kN/m}\n    - {at: [1 m, 2 m], category: E}\n    - {at: {x: 1 m, y: 1 m, z: 0}, gk: 1}\n", []string{
			"in.yaml:12: building.point_loads[0].at.x: 14000 mm lies off the grid, which runs from 0 to 13200 mm along x (from line A)",
			"in.yaml:12: building.point_loads[0].at.y: -1000 mm lies off the grid, which runs from 0 to 7800 mm along y (from line 1)",
			"in.yaml:12: building.point_loads[0].category: is required but missing with an imposed load (the category of EN 1991-1-1 Table 6.1, e.g. category: B)",
			"in.yaml:13: building.point_loads[1].at.y: is required but missing (the distance along y from line 1, e.g. y: 3.0 m)",
			"in.yaml:13: building.point_loads[1].gk: 12000 kN is outside the plausible range of the point load, 0 kN to 10000 kN (see the input limits in the README)",
			"in.yaml:13: building.point_loads[1].qk: -1 kN is outside the plausible range of the point load, 0 kN to 10000 kN (see the input limits in the README)",
			"in.yaml:14: building.point_loads[2].at: is required but missing (the point from grid lines A and 1, e.g. at: {x: 9.6 m, y: 3.0 m})",
			"in.yaml:14: building.point_loads[2].gk: \"5 kN/m\" is a line load, expected a force",
			"in.yaml:15: building.point_loads[3].at: expected a mapping with the keys x, y, found a list",
			"in.yaml:15: building.point_loads[3]: give the load: gk, qk or both (e.g. gk: 45 kN)",
			"in.yaml:16: building.point_loads[4].at.z: unknown key (known here: x, y)"}},
		{"area loads", building + "  area_loads:\n    - {x: [13.2 m, 6.6 m], y: [0, 7.8 m, 1 m], gk: 2.0 kN/m2, qk: 5.0 kN/m2}\n" +
			"    - {levels: [L3], x: [0, 14 m], y: 2 m, gk: 200 kN/m2}\n    - {x: [1 m, 1 m], y: [], qk: 2 kN/m}\n    - {gk: 1}\n", []string{
			"in.yaml:12: building.area_loads[0].x: the zone from 13200 mm to 6600 mm along x is empty; give from before to",
			"in.yaml:12: building.area_loads[0].y: expected the two ends of the zone, [from, to], found 3 values",
			"in.yaml:12: building.area_loads[0].category: is required but missing with an imposed load (the category of EN 1991-1-1 Table 6.1, e.g. category: B)",
			"in.yaml:13: building.area_loads[1].levels[0]: \"L3\" is not a storey level (levels: L1, R)",
			"in.yaml:13: building.area_loads[1].x[1]: 14000 mm lies off the grid, which runs from 0 to 13200 mm along x (from line A)",
			"in.yaml:13: building.area_loads[1].y: expected a list of zone ends, found \"2 m\"",
			"in.yaml:13: building.area_loads[1].gk: 200 kN/m2 is outside the plausible range of the area load, 0 kN/m2 to 100 kN/m2 (see the input limits in the README)",
			"in.yaml:14: building.area_loads[2].x: the zone from 1000 mm to 1000 mm along x is empty; give from before to",
			"in.yaml:14: building.area_loads[2].y: the list is empty; give at least one of the zone ends",
			"in.yaml:14: building.area_loads[2].qk: \"2 kN/m\" is a line load, expected a stress",
			"in.yaml:15: building.area_loads[3].x: is required but missing (the zone's extent along x from line A, e.g. x: [6.6 m, 13.2 m])",
			"in.yaml:15: building.area_loads[3].y: is required but missing (the zone's extent along y from line 1, e.g. y: [6.6 m, 13.2 m])"}},
		{"cantilevers", building + "  cantilevers:\n    - {line: B, from: \"2\", to: \"1\", length: 1.5 m}\n    - {line: \"1\", from: A, to: \"2\", length: 0.2 m}\n" +
			"    - {line: C, length: 6 m}\n    - {line: \"3\", length: 1.5}\n    - {levels: R, from: \"1\"}\n", []string{
			"in.yaml:12: building.cantilevers[0].line: line B is not an edge of the grid; a cantilever continues beyond an edge line (A or C, 1 or 2)",
			"in.yaml:12: building.cantilevers[0].to: the range from line 2 to line 1 along line B is empty; give from before to",
			"in.yaml:13: building.cantilevers[1].to: line 2 runs parallel to line 1 and does not cross it; give a lettered line",
			"in.yaml:13: building.cantilevers[1].length: 200 mm is outside the plausible range of the cantilever length, 300 mm to 5000 mm (see the input limits in the README)",
			"in.yaml:14: building.cantilevers[2].length: 6000 mm is outside the plausible range of the cantilever length, 300 mm to 5000 mm (see the input limits in the README)",
			"in.yaml:15: building.cantilevers[3].line: line 3 is not on the grid " + grid,
			"in.yaml:15: building.cantilevers[3].length: 1.5 is read as 1.5 mm, less than the least plausible cantilever length of 300 mm; for metres write the unit: \"1.5 m\"",
			"in.yaml:16: building.cantilevers[4].line: is required but missing (the edge grid line the slab continues beyond, e.g. line: A)",
			"in.yaml:16: building.cantilevers[4].length: is required but missing (how far the slab continues beyond the line, e.g. length: 1.5 m)"}},
		{"slab as thick as the beams", slab("{thickness: 0.5 m}"), []string{
			"in.yaml:10: building.floors[0].slab.thickness: 500 mm is not less than the depth of the shallowest beam at level L1, 500 mm (building.beams.h); the beams must reach below the slab"}},
		{"slab thicker than a shallower override", slab("{thickness: 350 mm}") + "  beam_sizes:\n    - {levels: [R], dir: x, lines: [\"2\"], b: 250, h: 340}\n    - {levels: [R], b: 300, h: 600}\n    - {dir: x, lines: [\"1\"], b: 250, h: 300}\n", []string{
			"in.yaml:10: building.floors[0].slab.thickness: 350 mm is not less than the depth of the shallowest beam at level L1, 300 mm (building.beam_sizes[2].h); the beams must reach below the slab"}},
		{"slab keys", strings.Replace(slab("{depth: 200}"), "{gk:", "{levels: [L1], gk:", 1) + "    - {levels: [R], gk: 1, qk: 0, spans: x, slab: {thickness: 0.2}}\n", []string{
			"in.yaml:10: building.floors[0].slab.depth: unknown key (known here: thickness)",
			"in.yaml:10: building.floors[0].slab.thickness: is required but missing (the slab thickness, e.g. slab: {thickness: 225 mm})",
			"in.yaml:11: building.floors[1].slab.thickness: 0.2 is read as 0.2 mm, less than the least plausible slab thickness of 50 mm; for metres write the unit: \"0.2 m\""}},
		{"beam stiffness with the frame analysis", building + "  analysis: frame\n  beam_stiffness: half\n", []string{
			"in.yaml:12: building.beam_stiffness: the frame analysis takes each beam's own stiffness; beam_stiffness applies to the subframe only (analysis: subframe or both)"}},
		{"span ratio", building + "  span_ratio: 1\n", []string{
			"in.yaml:11: building.span_ratio: the ratio of adjacent spans that draws a caution must be greater than 1, found 1"}},
		{"span ratio with a unit", building + "  span_ratio: 1.5 m\n", []string{
			"in.yaml:11: building.span_ratio: \"1.5 m\" is a length, expected a pure number"}},
	}
	for _, c := range cases {
		expectErrors(t, c.name, c.text, c.want)
	}
}

// classNames is the list of strength classes the messages give.
func classNames() string {
	_, err := Parse("in.yaml", []byte(building+"  beam_concrete: C1/2\n"))
	msg := err.Error()
	return msg[strings.Index(msg, "(classes: ")+len("(classes: ") : len(msg)-1]
}

// FuzzBuildingKeys reads generated buildings with the keys of buildings as they are; whatever
// it accepts keeps what the parser promises of them.
func FuzzBuildingKeys(f *testing.F) {
	f.Add([]byte(more))
	f.Add([]byte(building + "  omit: [{columns: [A1], levels: [L1]}, {columns: [A1], levels: [R]}]\n"))
	f.Add([]byte(building + "  analysis: frame\n  beam_stiffness: full\n  span_ratio: 0.5\n"))
	f.Add([]byte(building + "  cantilevers: [{line: B, from: 2, length: 1.5}]\n  point_loads: [{at: {x: 1e9, y: 0}, qk: 1}]\n"))
	f.Add([]byte(building + "  area_loads: [{x: [0, 1e-9], y: [7799.99999, 7800.000001], gk: 1}]\n  beam_concrete: c50/60\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		in, err := Parse("f.yaml", data)
		if err != nil {
			var es Errors
			if !errors.As(err, &es) || len(es) == 0 {
				t.Fatalf("error %v is not a non-empty Errors", err)
			}
			return
		}
		if in.Building != nil {
			checkAsItIs(t, in.Building)
		}
	})
}

// checkAsItIs fails t when an accepted building breaks what the parser promises of the keys of
// buildings as they are.
func checkAsItIs(t *testing.T, b *model.Building) {
	t.Helper()
	size := [2]float64{}
	for i, bays := range [][]float64{b.GridX, b.GridY} {
		for _, w := range bays {
			size[i] += w
		}
	}
	onGrid := func(v float64, i int) bool { return v >= 0 && v <= size[i] }
	o := b.Options
	if !(o.SpanRatio > 1) || math.IsInf(o.SpanRatio, 0) || o.BeamStiffnessGiven && b.Analysis == model.AnalysisFrame {
		t.Fatalf("invalid options accepted: %+v with %s", o, b.Analysis)
	}
	for _, x := range b.OmitAt {
		if len(x.Columns) == 0 || len(x.Levels) == 0 {
			t.Fatalf("empty omit entry accepted: %+v", x)
		}
		for _, id := range x.Columns {
			if slices.Contains(b.Omit, id) {
				t.Fatalf("%s omitted both ways", id)
			}
		}
	}
	for _, z := range b.Concrete {
		if z.Class.Class == "" || !(z.Class.Fck > 0) {
			t.Fatalf("zone without a class accepted: %+v", z)
		}
	}
	for _, p := range b.PointLoads {
		if !onGrid(p.X, 0) || !onGrid(p.Y, 1) || !(p.Gk >= 0 && p.Qk >= 0) || p.Qk > 0 && p.Category == "" {
			t.Fatalf("invalid point load accepted: %+v", p)
		}
	}
	for _, a := range b.AreaLoads {
		if !onGrid(a.X[0], 0) || !onGrid(a.X[1], 0) || !onGrid(a.Y[0], 1) || !onGrid(a.Y[1], 1) ||
			!(a.X[0] < a.X[1] && a.Y[0] < a.Y[1]) || !(a.Gk >= 0 && a.Qk >= 0) || a.Qk > 0 && a.Category == "" {
			t.Fatalf("invalid area load accepted: %+v", a)
		}
	}
	for _, c := range b.Cantilevers {
		first, last := "A", letters(len(b.GridX))
		if c.GridLine[0] <= '9' {
			first, last = "1", show(float64(len(b.GridY)+1), "")
		}
		if c.GridLine != first && c.GridLine != last || !(c.Length >= 300 && c.Length <= 5000) || (c.From == "") != (c.To == "") {
			t.Fatalf("invalid cantilever accepted: %+v", c)
		}
	}
	for _, f := range b.Floors {
		if f.Thickness != 0 && !(f.Thickness < b.Beam.H || len(b.Beams) > 0) {
			t.Fatalf("slab of %g mm accepted under beams of %g mm", f.Thickness, b.Beam.H)
		}
	}
}
