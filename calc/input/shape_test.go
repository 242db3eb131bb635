package input

import (
	"strings"
	"testing"

	"colsheet/calc/model"
)

// checkShape fails t when an accepted column section breaks what the parser promises: a circle
// has B = H = D, only a circle has a helix.
func checkShape(t *testing.T, what string, s model.Size) {
	t.Helper()
	switch s.Shape {
	case model.ShapeCircle:
		if s.B != s.H {
			t.Fatalf("%s: circle with B %g ≠ H %g accepted", what, s.B, s.H)
		}
	case model.ShapeRect:
		if s.Helix {
			t.Fatalf("%s: rectangle with a helix accepted", what)
		}
	default:
		t.Fatalf("%s: unknown shape %q accepted", what, s.Shape)
	}
}

// sizeOf returns the section of an actions-form column.
func sizeOf(c model.Column) model.Size {
	return model.Size{B: c.B, H: c.H, Shape: c.Shape, Helix: c.Helix}
}

// Circular columns of the actions form: D alone or with shape: circle, B = H = D. The
// conversions (0.6 m = 600 mm) are common practice (SI prefixes), no source; the sizes are
// invented test inputs.
func TestParseCircles(t *testing.T) {
	in, err := parseFile(t, "testdata/circle.yaml")
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		id    string
		want  model.Size
		cover float64
		bars  int
	}{
		{"R1", model.Size{B: 450, H: 450, Shape: model.ShapeCircle}, 35, 7},
		{"R2", model.Size{B: 600, H: 600, Shape: model.ShapeCircle, Helix: true}, 40, 0},
		{"K1", model.Size{B: 350, H: 500}, 40, 0},
	}
	if len(in.Columns) != len(cases) {
		t.Fatalf("%d columns, want %d", len(in.Columns), len(cases))
	}
	for i, c := range cases {
		col := in.Columns[i]
		got := sizeOf(col)
		if col.ID != c.id || !near(got.B, c.want.B) || !near(got.H, c.want.H) || got.Shape != c.want.Shape || got.Helix != c.want.Helix || !near(col.Cover, c.cover) {
			t.Errorf("%s: got %s %+v cover %g, want %+v cover %g", c.id, col.ID, got, col.Cover, c.want, c.cover)
		}
		if count := 0; col.Bars != nil && col.Bars.Count != c.bars || col.Bars == nil && c.bars != count {
			t.Errorf("%s: bars %+v, want %d", c.id, col.Bars, c.bars)
		}
		checkShape(t, c.id, got)
	}
	// The lifts read as those of a rectangle: l0 ≥ D holds.
	if s := in.Columns[1].Storeys[0]; !near(s.L0Y, 4000) || !near(s.L0Z, 3600) || !near(s.NEd, 3100e3) {
		t.Errorf("R2/L1: %+v", s)
	}
}

// Circular columns of the building form: the default and the overrides, mixed with rectangles.
// Sizes invented (test inputs); mm as written, no conversion.
func TestParseBuildingCircles(t *testing.T) {
	in, err := parseFile(t, "testdata/building_circle.yaml")
	if err != nil {
		t.Fatal(err)
	}
	b := in.Building
	circle := func(d float64, helix bool) model.Size {
		return model.Size{B: d, H: d, Shape: model.ShapeCircle, Helix: helix}
	}
	cases := []struct {
		what      string
		got, want model.Size
	}{
		{"default", b.Column, circle(450, false)},
		{"column_sizes[0]", b.Columns[0].Size, circle(500, true)},
		{"column_sizes[1]", b.Columns[1].Size, model.Size{B: 350, H: 450}},
		{"column_sizes[2]", b.Columns[2].Size, model.Size{B: 300, H: 300}},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("%s: %+v, want %+v", c.what, c.got, c.want)
		}
		checkShape(t, c.what, c.got)
	}
	if !near(b.Cover, 35) || b.Bars == nil || b.Bars.Count != 8 {
		t.Errorf("cover %g, bars %+v", b.Cover, b.Bars)
	}
}

// circleColumn is the head of an actions-form input whose one column's section keys follow
// from line 4 on; circleTail ends it.
const (
	circleColumn = "materials: {concrete: C30/37}\ncolumns:\n  - id: R1\n"
	circleTail   = "    cover: 40 mm\n    storeys: [{name: L1, l0: 3 m, NEd: 1000 kN}]\n"
)

// Faults of circular sections name the file, the line and the field. The least count of bars
// on a circle, 6, is detail.RingMin, which the engine cites as EN 1992-1-1:2004 9.5.2(4); from
// memory that clause asks for four, and six is the trade's habit for circular columns (common
// practice, no source). The room check 2·(cover + link + bar) < D is that of the rectangle with
// D for min(b, h), common practice, no source.
func TestCircleErrors(t *testing.T) {
	cases := []struct {
		name, text string
		want       []string
	}{
		{"shape circle without D", circleColumn + "    shape: circle\n" + circleTail, []string{
			"in.yaml:4: columns[0].D: is required but missing (shape: circle takes the diameter, e.g. D: 450 mm)"}},
		{"D with b", circleColumn + "    D: 450 mm\n    b: 450 mm\n" + circleTail, []string{
			"in.yaml:5: columns[0].b: a circular column gives its diameter D, not b and h"}},
		{"shape circle with b and h", circleColumn + "    shape: circle\n    b: 400\n    h: 400\n" + circleTail, []string{
			"in.yaml:4: columns[0].D: is required but missing (shape: circle takes the diameter, e.g. D: 450 mm)",
			"in.yaml:5: columns[0].b: a circular column gives its diameter D, not b and h",
			"in.yaml:6: columns[0].h: a circular column gives its diameter D, not b and h"}},
		{"shape rectangle with D", circleColumn + "    shape: rectangle\n    D: 450\n" + circleTail, []string{
			"in.yaml:3: columns[0].b: is required but missing (the width along y, e.g. b: 350 mm)",
			"in.yaml:3: columns[0].h: is required but missing (the depth along z, e.g. h: 500 mm)",
			"in.yaml:5: columns[0].D: D is the diameter of a circular column; shape: rectangle gives b and h (leave shape out, or write shape: circle, for a circle)"}},
		{"unknown shape", circleColumn + "    shape: square\n    D: 450\n" + circleTail, []string{
			`in.yaml:4: columns[0].shape: "square" is not one of rectangle, circle`}},
		{"fewer than six bars on a circle", circleColumn + "    D: 450 mm\n    bars: {count: 4, dia: 20}\n" + circleTail, []string{
			"in.yaml:5: columns[0].bars.count: a circular column takes at least 6 bars evenly on its circle, found 4"}},
		{"a fraction of a bar", circleColumn + "    D: 450 mm\n    bars:\n      count: 6.5\n      dia: 20\n" + circleTail, []string{
			"in.yaml:6: columns[0].bars.count: the bar count must be a whole number of at least 6, found 6.5"}},
		{"helix on a rectangle", circleColumn + "    b: 350\n    h: 500\n    helix: true\n" + circleTail, []string{
			"in.yaml:6: columns[0].helix: a helix binds the bars of a circular column, and this column is rectangular (give D, or shape: circle with D, for a circle)"}},
		{"helix not a yes or no", circleColumn + "    D: 450\n    helix: spiral\n" + circleTail, []string{
			`in.yaml:5: columns[0].helix: expected true or false, found "spiral"`}},
		{"D implausible", circleColumn + "    D: 100\n" + circleTail, []string{
			"in.yaml:4: columns[0].D: 100 mm is outside the plausible range of the section side, 150 mm to 3000 mm (see the input limits in the README)"}},
		{"D in metres without the unit", circleColumn + "    D: 0.45\n" + circleTail, []string{
			`in.yaml:4: columns[0].D: 0.45 is read as 0.45 mm, less than the least plausible section side of 150 mm; for metres write the unit: "0.45 m"`}},
		{"no room in the circle", circleColumn + "    D: 200\n    cover: 80\n    storeys: [{name: L1, l0: 3 m, NEd: 1000 kN}]\n", []string{
			"in.yaml:5: columns[0].cover: no room for links and bars: 2·(cover + link + bar) = 2·(80 + 8 + 12) = 200 mm is not less than D = 200 mm"}},
		{"l0 shorter than D", circleColumn + "    D: 600\n    cover: 40 mm\n    storeys: [{name: L1, l0: 500, NEd: 1000 kN}]\n", []string{
			"in.yaml:6: columns[0].storeys[0].l0: l0 = 500 mm is shorter than the section's smaller side 600 mm: not a column"}},
		{"default column shape circle without D", strings.Replace(building, "b: 350 mm, h: 450 mm", "shape: circle", 1), []string{
			"in.yaml:7: building.columns.D: is required but missing (shape: circle takes the diameter, e.g. D: 450 mm)"}},
		{"default column D with h", strings.Replace(building, "b: 350 mm, h: 450 mm", "D: 450 mm, h: 450 mm", 1), []string{
			"in.yaml:7: building.columns.h: a circular column gives its diameter D, not b and h"}},
		{"default column helix on a rectangle", strings.Replace(building, "h: 450 mm}", "h: 450 mm, helix: true}", 1), []string{
			"in.yaml:7: building.columns.helix: a helix binds the bars of a circular column, and this column is rectangular (give D, or shape: circle with D, for a circle)"}},
		{"size override D with b", building + "  column_sizes: [{columns: B1, D: 500, b: 500}]\n", []string{
			"in.yaml:11: building.column_sizes[0].b: a circular column gives its diameter D, not b and h"}},
		{"size override shape circle without D", building + "  column_sizes:\n    - {columns: B1, shape: circle}\n", []string{
			"in.yaml:12: building.column_sizes[0].D: is required but missing (shape: circle takes the diameter, e.g. D: 450 mm)"}},
		{"size override helix on a rectangle", building + "  column_sizes: [{columns: B1, b: 400, h: 400, helix: true}]\n", []string{
			"in.yaml:11: building.column_sizes[0].helix: a helix binds the bars of a circular column, and this column is rectangular (give D, or shape: circle with D, for a circle)"}},
		{"four bars for every column, one circular", building + "  bars:\n    count: 4\n    dia: 16\n  column_sizes: [{columns: B1, D: 500}]\n", []string{
			"in.yaml:12: building.bars.count: a circular column takes at least 6 bars evenly on its circle (column_sizes[0], line 14, is circular), found 4"}},
		{"four bars, the default circular", strings.Replace(building, "b: 350 mm, h: 450 mm", "D: 450 mm", 1) + "  bars: {count: 4, dia: 16}\n", []string{
			"in.yaml:11: building.bars.count: a circular column takes at least 6 bars evenly on its circle (the default column is circular), found 4"}},
		{"no room in a circular override", building + "  bars: {count: 6, dia: 40}\n  column_sizes: [{columns: B1, D: 170}]\n", []string{
			"in.yaml:12: building.column_sizes[0].D: no room for links and bars: 2·(cover + link + bar) = 2·(40 + 8 + 40) = 176 mm is not less than D = 170 mm"}},
	}
	for _, c := range cases {
		_, err := Parse("in.yaml", []byte(c.text))
		checkErrors(t, c.name, err, c.want)
	}
}

// An actions table gives the cases of circular columns as of rectangular ones. kN → N is
// common practice (SI prefixes), no source; the loads are invented test inputs.
func TestActionsTableCircle(t *testing.T) {
	text := "materials: {concrete: C30/37}\nactions: t.csv\ncolumns:\n" +
		"  - {id: R1, D: 450 mm, cover: 35 mm, bars: {count: 6, dia: 20}, storeys: [{name: L1, l0: 3 m}, {name: L2, l0: 3 m}]}\n" +
		"  - {id: K1, b: 300 mm, h: 300 mm, cover: 30 mm, storeys: [{name: L1, l0: 3 m}]}\n"
	table := rowsOf(header, "R1,L1,A,2150,85,-40,10,10", "R1,L1,B,1800,0,0,0,0", "R1,L2,A,1000,0,0,0,0", "K1,L1,A,500,0,0,0,0")
	in, err := ParseWith("in.yaml", []byte(text), files(map[string]string{"t.csv": table}))
	if err != nil {
		t.Fatal(err)
	}
	r1 := in.Columns[0]
	if r1.Shape != model.ShapeCircle || !near(r1.B, 450) || !near(r1.H, 450) || r1.Bars == nil || r1.Bars.Count != 6 {
		t.Errorf("R1 %+v", r1)
	}
	cases := []struct {
		col, lift int
		names     string
		ned       float64
	}{
		{0, 0, "A,B", 2150e3},
		{0, 1, "A", 1000e3},
		{1, 0, "A", 500e3},
	}
	for _, c := range cases {
		s := in.Columns[c.col].Storeys[c.lift]
		var names []string
		for _, k := range s.Cases {
			names = append(names, k.Name)
		}
		if strings.Join(names, ",") != c.names || !near(s.NEd, c.ned) {
			t.Errorf("%s/%s: cases %v NEd %g, want %s %g", in.Columns[c.col].ID, s.Name, names, s.NEd, c.names, c.ned)
		}
	}
}
