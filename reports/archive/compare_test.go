package archive

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
	"colsheet/reports"
)

// Compare lists the changed input and results of exactly the design whose load changed, and the input hashes.
func TestCompareChangedLoad(t *testing.T) {
	old := writeBundle(t, readTree(t, filepath.Join("testdata", "small")))
	revised := readTree(t, filepath.Join("testdata", "revised"))
	c, err := Compare(old, writeBundle(t, revised))
	if err != nil {
		t.Fatal(err)
	}
	// K1/L1: NEd 1200 kN → 1300 kN; η = N/(17 MPa · 90000 mm²): 1200000/1530000 → 1300000/1530000.
	want := []Change{
		{"K1", "L1", "input `act/NEd`: Design axial force, N\\_Ed", "1200 kN", "1300 kN"},
		{"K1", "L1", "result N\\_Ed", "1200 kN", "1300 kN"},
		{"K1", "L1", "result utilization", "0.7843", "0.8497"},
	}
	if len(c.Rows) != len(want) {
		t.Fatalf("%d rows, want %d: %+v", len(c.Rows), len(want), c.Rows)
	}
	for i, w := range want {
		if c.Rows[i] != w {
			t.Errorf("row %d = %+v, want %+v", i, c.Rows[i], w)
		}
	}
	md := string(c.Markdown())
	for _, w := range []string{
		"| Column | Lift | Item | Old | New |\n| --- | --- | --- | --- | --- |\n",
		"| K1 | L1 | input `act/NEd`: Design axial force, N\\_Ed | 1200 kN | 1300 kN |\n",
		"- Input SHA-256: `" + Sum(readTree(t, filepath.Join("testdata", "small"))["input/small.yaml"]) + "` → `" + Sum(revised["input/small.yaml"]) + "`",
		"- Input file: `small.yaml`\n",
	} {
		if !strings.Contains(md, w) {
			t.Errorf("Markdown lacks %q:\n%s", w, md)
		}
	}
	if strings.Contains(md, "K3") || strings.Contains(md, "L2") {
		t.Errorf("designs that did not change are listed:\n%s", md)
	}
	if again := string(c.Markdown()); again != md {
		t.Error("Markdown is not deterministic")
	}
}

// Equal bundles say no changes; a bundle with a design more or less lists it as added or removed.
func TestCompareDesigns(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	a, b := writeBundle(t, small), writeBundle(t, small)
	c, err := Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Empty() || !strings.Contains(string(c.Markdown()), "No changes") || strings.Contains(string(c.Markdown()), "| Column |") {
		t.Errorf("equal bundles:\n%s", c.Markdown())
	}
	editResults(t, b, func(d []any) {
		d[2].(map[string]any)["column"] = "K4"
	})
	c, err = Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	md := string(c.Markdown())
	for _, w := range []string{"| K4 | L1 | design added | — | status pass, utilization 0.6536 |", "| K3 | L1 | design removed | status pass, utilization 0.6536 | — |"} {
		if !strings.Contains(md, w) {
			t.Errorf("Markdown lacks %q:\n%s", w, md)
		}
	}
	// A bundle written by design, without a manifest, compares on results.json alone.
	os.Remove(filepath.Join(b, ManifestName))
	if c, err = Compare(a, b); err != nil || c.New.InputName != "" || c.New.InputSHA256 != c.Old.InputSHA256 {
		t.Errorf("without a manifest: %v %+v", err, c)
	}
	if _, err := Compare(a, filepath.Join(b, "none")); err == nil || !strings.Contains(err.Error(), "results.json") {
		t.Errorf("no results: %v", err)
	}
	os.WriteFile(filepath.Join(b, ResultsName), []byte(`{"designs": [{"column": "K1", "storey": "L1"}, {"column": "K1", "storey": "L1"}]}`), 0o644)
	if _, err := Compare(a, b); err == nil || !strings.Contains(err.Error(), "designs[1]") {
		t.Errorf("a design listed twice: %v", err)
	}
}

// Numbers are shown in the trade's units with four significant figures, or as many as it takes to tell two apart.
func TestPairFormats(t *testing.T) {
	for _, tc := range []struct {
		old, new float64
		ou, nu   string
		wo, wn   string
	}{
		{1200e3, 1300e3, "N", "N", "1200 kN", "1300 kN"},
		{85e6, 85.25e6, "Nmm", "Nmm", "85 kNm", "85.25 kNm"},
		{3380e3, 3380.4e3, "N", "N", "3380 kN", "3380.4 kN"},
		{0.95, 0.9500001, "", "", "0.95", "0.9500001"},
		{1256.637, 1256.6, "mm2", "mm2", "1256.64 mm²", "1256.6 mm²"},
		{-0.00001234, 2e20, "", "", "-1.234e-05", "2e+20"},
		{20, 20, "mm", "MPa", "20 mm", "20 MPa"},
	} {
		if o, n := pair(tc.old, tc.new, tc.ou, tc.nu); o != tc.wo || n != tc.wn {
			t.Errorf("pair(%g, %g, %q, %q) = %q, %q; want %q, %q", tc.old, tc.new, tc.ou, tc.nu, o, n, tc.wo, tc.wn)
		}
	}
	if got := escape("a|b_c*d"); got != `a\|b\_c\*d` {
		t.Errorf("escape = %q", got)
	}
}

// compareBuilding is a small building form with a façade load on grid line A at level L1; every
// number is invented test input.
const compareBuilding = `project: {title: Compare test, job: C-1, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
design: {bar_diameters: [BARS]}
building:
  storeys:
    - {name: L1, height: 3.5 m}
    - {name: R, height: 3.2 m}
  grid: {x: [6.0 m, 6.0 m], y: [5.0 m]}
  columns: {b: 300 mm, h: 300 mm, cover: 35 mm}
  beams: {b: 300 mm, h: 500 mm}
  floors:
    - {levels: [L1], gk: 6.0 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}
    - {levels: [R], gk: 4.0 kN/m2, qk: 0.6 kN/m2, category: H, spans: y}
  line_loads:
    - {levels: [L1], line: A, gk: FACADE}
  base: fixed
`

// designBundle designs the building with the given façade load and bar diameters and writes
// its results.json to a new folder (a package written by design, without a manifest).
func designBundle(t *testing.T, facade, bars string) string {
	t.Helper()
	src := strings.NewReplacer("FACADE", facade, "BARS", bars).Replace(compareBuilding)
	in, err := yamlinput.Parse("compare.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	r, err := design.Run(in)
	if err != nil {
		t.Fatal(err)
	}
	b, err := reports.JSON(r)
	if err != nil {
		t.Fatal(err)
	}
	dir := filepath.Join(t.TempDir(), "bundle")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, ResultsName), b, 0o644); err != nil {
		t.Fatal(err)
	}
	return dir
}

// A changed façade load is a changed input of exactly the lifts whose beams carry it (the beam
// A1–A2 on line A at level L1 bears on A1 and A2), and the designs it changes show it in their
// results; values chosen by the design are never listed as inputs (DESIGN.md, the trace contract).
func TestCompareFacadeLoad(t *testing.T) {
	c, err := Compare(designBundle(t, "9.5 kN/m", "16, 20"), designBundle(t, "14 kN/m", "16, 20"))
	if err != nil {
		t.Fatal(err)
	}
	got := map[string]Change{}
	for _, r := range c.Rows {
		if strings.HasPrefix(r.Item, "input ") {
			if _, dup := got[r.Column+"/"+r.Lift]; dup {
				t.Errorf("%s/%s: more than one changed input: %+v", r.Column, r.Lift, r)
			}
			got[r.Column+"/"+r.Lift] = r
		}
	}
	for _, key := range []string{"A1/L1", "A2/L1"} {
		r, ok := got[key]
		want := "input `td/L1/A1–A2/g_line1`: Permanent line load 1 of the input, on grid line A, g\\_line,1"
		if !ok || r.Item != want || r.Old != "9.5 kN/m" || r.New != "14 kN/m" {
			t.Errorf("%s: changed input %+v, want %q 9.5 kN/m → 14 kN/m", key, r, want)
		}
	}
	if len(got) != 2 {
		t.Errorf("changed inputs on %d lifts, want 2 (A1/L1, A2/L1): %+v", len(got), got)
	}
	// The heavier façade raises NEd of the lifts below it.
	for _, key := range []string{"A1/L1", "A2/L1"} {
		found := false
		for _, r := range c.Rows {
			found = found || (r.Column+"/"+r.Lift == key && r.Item == "result N\\_Ed")
		}
		if !found {
			t.Errorf("%s: NEd not listed as a changed result", key)
		}
	}
}

// Bars designed from another list of diameters change what the design chose (the bars, their
// arrangement, the links and what follows from them), never an input of a design: the rows are
// results. The list itself is an input of the project: its diameters are rows of the basis's
// lap lengths, listed once for the project, each added or removed.
func TestCompareDesignedValues(t *testing.T) {
	c, err := Compare(designBundle(t, "9.5 kN/m", "12, 16, 20"), designBundle(t, "9.5 kN/m", "20, 25"))
	if err != nil {
		t.Fatal(err)
	}
	chosen, listed := 0, map[string]string{}
	for _, r := range c.Rows {
		if r.Column == ProjectColumn && strings.HasPrefix(r.Item, "input `basis/lap/phi") {
			listed[r.Old] = r.New
			continue
		}
		if strings.HasPrefix(r.Item, "input ") {
			t.Errorf("%s/%s: a designed value listed as a changed input: %+v", r.Column, r.Lift, r)
		}
		if strings.HasPrefix(r.Item, "result `bars/") || strings.HasPrefix(r.Item, "result `links/") {
			chosen++
		}
	}
	if chosen == 0 {
		t.Errorf("no changed choice of the design listed as a result:\n%s", c.Markdown())
	}
	if len(listed) != 3 || listed["12 mm"] != "—" || listed["16 mm"] != "—" || listed["—"] != "25 mm" {
		t.Errorf("the listed diameters 12, 16, 20 → 20, 25: rows %v", listed)
	}
}

// A value the design chose (clause "chosen: …") that differs between two packages is a result;
// the bar count, which the row "bars" shows, has no row of its own.
func TestCompareChosenIsResult(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	a, b := writeBundle(t, small), writeBundle(t, small)
	for _, dir := range []string{a, b} {
		nb, count := 3.0, 8.0
		if dir == b {
			nb, count = 4, 12
		}
		editResults(t, dir, func(d []any) {
			const chosen = "chosen: the least steel that passes every check"
			tr := d[0].(map[string]any)["trace"].([]any)
			d[0].(map[string]any)["trace"] = append(tr,
				map[string]any{"id": "K1/L2/bars/nb", "title": "Bars along each b-face, corners included", "clause": chosen, "kind": "input", "symbol": "n_b", "value": nb},
				map[string]any{"id": "K1/L2/bars/count", "title": "Number of bars", "clause": chosen, "kind": "input", "symbol": "n_bars", "value": count})
		})
	}
	c, err := Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	want := Change{"K1", "L2", "result `bars/nb`: Bars along each b-face, corners included, n\\_b", "3", "4"}
	if len(c.Rows) != 1 || c.Rows[0] != want {
		t.Errorf("rows %+v, want %+v", c.Rows, want)
	}
}

// A step that only the new package records is a changed input when it comes from the input file
// (a façade load added), and no row at all when it is a value of a standard that the other design
// did not need (Ks = 1 of EN 1992-1-1:2004 5.8.7.2(2), recorded only where the column is slender).
func TestCompareOneSided(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	a, b := writeBundle(t, small), writeBundle(t, small)
	editResults(t, b, func(d []any) {
		tr := d[0].(map[string]any)["trace"].([]any)
		d[0].(map[string]any)["trace"] = append(tr,
			map[string]any{"id": "K1/L2/td/L2/A1–A2/g_line1", "title": "Permanent line load 1 of the input, on grid line A",
				"clause": "input", "kind": "input", "symbol": "g_line,1", "unit": "N/mm", "value": 9.5},
			map[string]any{"id": "K1/L2/y/Ks", "title": "Factor for the contribution of the reinforcement",
				"clause": "EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.22)", "kind": "table", "symbol": "K_s", "value": 1})
	})
	c, err := Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	want := Change{"K1", "L2", "input `td/L2/A1–A2/g_line1`: Permanent line load 1 of the input, on grid line A, g\\_line,1", "—", "9.5 kN/m"}
	if len(c.Rows) != 1 || c.Rows[0] != want {
		t.Errorf("rows %+v, want %+v", c.Rows, want)
	}
}
