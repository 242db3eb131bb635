package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"

	"colsheet/calc/trace"
	"colsheet/reports"
)

func runCLI(args ...string) (int, string, string) {
	var out, errb bytes.Buffer
	code := run(args, &out, &errb)
	return code, out.String(), errb.String()
}

func keys(m map[string]any) []string {
	var k []string
	for key := range m {
		k = append(k, key)
	}
	sort.Strings(k)
	return k
}

func hasAll(t *testing.T, what string, m map[string]any, want ...string) {
	t.Helper()
	for _, w := range want {
		if _, ok := m[w]; !ok {
			t.Errorf("%s: key %q missing (have %v)", what, w, keys(m))
		}
	}
}

// The demo runs, passes, writes every format, and results.json holds the contract keys
// of ../shared/DESIGN.md with a trace that reproduces itself.
func TestDemo(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "out")
	code, stdout, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", dir, "--date", "2026-12-01")
	if code != 0 {
		t.Fatalf("exit %d\n%s\n%s", code, stdout, stderr)
	}
	for _, f := range []string{"results.json", "summary.csv", "md/index.md", "md/C4-GF.md", "html/index.html", "html/E2-L3.html", "tex/index.tex", "tex/D1-GF.tex"} {
		if st, err := os.Stat(filepath.Join(dir, f)); err != nil || st.Size() == 0 {
			t.Errorf("%s not written: %v", f, err)
		}
	}
	data, err := os.ReadFile(filepath.Join(dir, "results.json"))
	if err != nil {
		t.Fatal(err)
	}
	var res map[string]any
	if err := json.Unmarshal(data, &res); err != nil {
		t.Fatal(err)
	}
	hasAll(t, "top", res, "tool", "input_sha256", "code", "designs")
	hasAll(t, "code", res["code"].(map[string]any), "standard", "annex", "overrides")
	designs := res["designs"].([]any)
	if len(designs) != 4 {
		t.Fatalf("%d designs, want 4", len(designs))
	}
	back, err := reports.ReadSteps(data)
	if err != nil {
		t.Fatal(err)
	}
	for k, x := range designs {
		d := x.(map[string]any)
		hasAll(t, "design", d, "column", "storey", "b_mm", "h_mm", "cover_mm", "fck_MPa", "fyk_MPa", "NEd_kN",
			"axes", "biaxial", "As_req_mm2", "As_min_mm2", "As_max_mm2", "As_prov_mm2", "bars", "links",
			"utilization", "status", "governing", "steps")
		axes := d["axes"].(map[string]any)
		for _, a := range []string{"y", "z"} {
			hasAll(t, "axis "+a, axes[a].(map[string]any), "l0_m", "lambda", "lambda_lim", "slender", "M01_kNm",
				"M02_kNm", "ei_mm", "M0Ed_kNm", "M2_kNm", "phi_ef", "MEd_kNm", "MRd_kNm")
		}
		hasAll(t, "biaxial", d["biaxial"].(map[string]any), "checked", "a", "ratio")
		hasAll(t, "bars", d["bars"].(map[string]any), "count", "dia_mm", "positions_mm")
		hasAll(t, "links", d["links"].(map[string]any), "dia_mm", "spacing_mm", "spacing_reduced_mm")
		// The trace read back from results.json reproduces every step (the archive's recheck).
		steps := back.Designs[k].Steps
		if n := int(d["steps"].(float64)); n != len(steps) || n == 0 {
			t.Errorf("steps = %d, trace has %d", n, len(steps))
		}
		for _, s := range steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
		}
	}
	// Cautions on every sheet.
	for _, f := range []string{"md/C4-GF.md", "html/C4-GF.html", "tex/C4-GF.tex"} {
		b, _ := os.ReadFile(filepath.Join(dir, f))
		if !strings.Contains(string(b), "competent engineer") || !strings.Contains(string(b), "national annex") {
			t.Errorf("%s lacks the cautions", f)
		}
	}
}

func writeFile(t *testing.T, name, text string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(p, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

const failing = `materials: {concrete: C30/37}
columns:
  - id: F1
    b: 250
    h: 250
    cover: 30
    bars: {count: 4, dia: 12}
    storeys:
      - {name: L1, l0: 3 m, NEd: 2500 kN}
`

// A failing design exits 1 and still writes everything, with the reason on stderr.
func TestFailingDesignExitsOne(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "out")
	code, _, stderr := runCLI("design", writeFile(t, "f.yaml", failing), "-o", dir)
	if code != 1 {
		t.Fatalf("exit %d, want 1", code)
	}
	if !strings.Contains(stderr, "FAIL F1/L1") {
		t.Errorf("stderr does not name the failure: %s", stderr)
	}
	b, err := os.ReadFile(filepath.Join(dir, "results.json"))
	if err != nil || !bytes.Contains(b, []byte(`"status":"fail"`)) {
		t.Errorf("results.json missing or without the failure: %v", err)
	}
	md, _ := os.ReadFile(filepath.Join(dir, "md", "F1-L1.md"))
	if !bytes.Contains(md, []byte("FAIL")) {
		t.Error("the sheet does not say FAIL")
	}
}

// Bad input exits 2 with FILE:LINE: field: message for every fault, and writes nothing;
// what an earlier run wrote stays as it was.
func TestBadInputWritesNothing(t *testing.T) {
	bad := `materials: {concrete: C30/37}
columns:
  - id: B1
    b: 3.6 kN
    h: 300
    cover: 30
    storeys:
      - {name: L1, l0: 3 m, NEd: -2e5 kN}
`
	path := writeFile(t, "bad.yaml", bad)
	dir := filepath.Join(t.TempDir(), "out")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	keep := filepath.Join(dir, "results.json")
	os.WriteFile(keep, []byte("earlier"), 0o644)
	code, _, stderr := runCLI("design", path, "-o", dir)
	if code != 2 {
		t.Fatalf("exit %d, want 2", code)
	}
	for _, want := range []string{path + ":4: columns[0].b:", path + ":8: columns[0].storeys[0].NEd:"} {
		if !strings.Contains(stderr, want) {
			t.Errorf("stderr lacks %q:\n%s", want, stderr)
		}
	}
	if b, _ := os.ReadFile(keep); string(b) != "earlier" {
		t.Error("an earlier result was overwritten by a bad run")
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("bad input wrote files: %v", entries)
	}
}

func TestUsage(t *testing.T) {
	for _, args := range [][]string{{}, {"frobnicate"}, {"design"}, {"design", "x.yaml"}, {"design", "x.yaml", "-o"},
		{"design", "x.yaml", "-o", "d", "--formats", "pdfx"}, {"design", "x.yaml", "-o", "d", "--date", "yesterday"}} {
		if code, _, _ := runCLI(args...); code != 2 {
			t.Errorf("%v: exit %d, want 2", args, code)
		}
	}
	if code, out, _ := runCLI("version"); code != 0 || !strings.Contains(out, "colsheet") {
		t.Errorf("version: %d %q", code, out)
	}
	if code, _, _ := runCLI("design", "no-such-file.yaml", "-o", t.TempDir()); code != 2 {
		t.Error("a missing input file should exit 2")
	}
}

// The demo building runs, passes, has one design per column and lift, and every reference
// of its trace, within a sheet or to the lift above, names a step of results.json.
func TestBuildingDemo(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "out")
	code, stdout, stderr := runCLI("design", "../../testdata/demo.yaml", "-o", dir, "--formats", "md")
	if code != 0 {
		t.Fatalf("exit %d\n%s\n%s", code, stdout, stderr)
	}
	data, err := os.ReadFile(filepath.Join(dir, "results.json"))
	if err != nil {
		t.Fatal(err)
	}
	// results.json of the demo, compact with the project basis and the forms stored once, at most
	// 15 MB (issue 11).
	if len(data) > 15e6 {
		t.Errorf("results.json of the demo holds %d bytes, more than 15 MB", len(data))
	}
	res, err := reports.ReadSteps(data)
	if err != nil {
		t.Fatal(err)
	}
	// 5 × 5 grid points less the void at C3, six lifts each, less the lift of B2 below the
	// transfer at L1.
	if len(res.Designs) != 24*6-1 {
		t.Fatalf("%d designs, want 143", len(res.Designs))
	}
	ids := map[string]bool{}
	for _, s := range res.Basis {
		ids[s.ID] = true
	}
	for _, d := range res.Designs {
		for _, s := range d.Steps {
			ids[s.ID] = true
		}
	}
	for _, d := range append([]reports.DesignSteps{{Column: "basis", Steps: res.Basis}}, res.Designs...) {
		if d.Column == "C3" {
			t.Fatal("the void C3 has a design")
		}
		for _, s := range d.Steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
			if !trace.ClauseForm(s.Clause) {
				t.Errorf("step %s: clause %q is not in the one form", s.ID, s.Clause)
			}
			for _, a := range s.Args {
				if a.From != "" && !ids[a.From] {
					t.Errorf("%s: argument %s refers to %s, which results.json does not hold", s.ID, a.Name, a.From)
				}
			}
		}
	}
}

// A revision designed --against the previous package marks what changed and opens the calc
// document with the revision table; an unreadable previous package is refused before anything
// is written (common practice, no source).
func TestAgainstPrevious(t *testing.T) {
	dir := t.TempDir()
	src, err := os.ReadFile(filepath.Join("..", "..", "testdata", "columns.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	first := writeFile(t, "cols.yaml", string(src))
	if code, _, errOut := runCLI("design", first, "-o", filepath.Join(dir, "rev-a"), "--date", "2026-12-01"); code != 0 {
		t.Fatalf("first revision: exit %d\n%s", code, errOut)
	}
	changed := strings.Replace(string(src), "NEd: 3380 kN", "NEd: 3480 kN", 1)
	if changed == string(src) {
		t.Fatal("the demo no longer has the NEd this test changes")
	}
	second := writeFile(t, "cols.yaml", changed)
	out := filepath.Join(dir, "rev-b")
	if code, _, errOut := runCLI("design", second, "-o", out, "--date", "2026-12-02", "--against", filepath.Join(dir, "rev-a")); code != 0 {
		t.Fatalf("second revision: exit %d\n%s", code, errOut)
	}
	doc, err := os.ReadFile(filepath.Join(out, "doc", "calc.md"))
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(doc), "## Revision") || !strings.Contains(string(doc), "<mark>") || !strings.Contains(string(doc), "3480 kN") {
		t.Error("the revised calc document lacks its revision table or marks")
	}
	code, _, errOut := runCLI("design", second, "-o", filepath.Join(dir, "rev-c"), "--against", filepath.Join(dir, "missing"))
	if code != 2 || !strings.Contains(errOut, "--against") {
		t.Errorf("a missing previous package: exit %d, %q", code, errOut)
	}
	if _, err := os.Stat(filepath.Join(dir, "rev-c")); !os.IsNotExist(err) {
		t.Error("output written although the previous package could not be read")
	}
}
