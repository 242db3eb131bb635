package main

import (
	"bytes"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// readTree returns every file below dir by its slash path.
func readTree(t *testing.T, dir string) map[string][]byte {
	t.Helper()
	out := map[string][]byte{}
	err := filepath.WalkDir(dir, func(p string, e fs.DirEntry, err error) error {
		if err != nil || e.IsDir() {
			return err
		}
		b, err := os.ReadFile(p)
		rel, _ := filepath.Rel(dir, p)
		out[filepath.ToSlash(rel)] = b
		return err
	})
	if err != nil {
		t.Fatal(err)
	}
	return out
}

// Two runs of the same input give byte-identical files in every format (no clock, no map order).
func TestRerunIsByteIdentical(t *testing.T) {
	base := t.TempDir()
	var trees []map[string][]byte
	for _, name := range []string{"a", "b"} {
		dir := filepath.Join(base, name)
		if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", dir); code != 0 {
			t.Fatalf("exit %d: %s", code, stderr)
		}
		trees = append(trees, readTree(t, dir))
	}
	if len(trees[0]) < 20 {
		t.Fatalf("only %d files written", len(trees[0]))
	}
	for name, a := range trees[0] {
		if b, ok := trees[1][name]; !ok || !bytes.Equal(a, b) {
			t.Errorf("%s differs between two runs", name)
		}
	}
	for _, want := range []string{"doc/calc.md", "doc/calc.tex", "doc/calc.html", "results.json", "schedule.csv"} {
		if len(trees[0][want]) == 0 {
			t.Errorf("%s not written", want)
		}
	}
}

// An existing output is never replaced without --replace, nor a file in it that colsheet did
// not write, and a folder that is not an earlier output takes the output beside its files only.
func TestOutputFolderSafety(t *testing.T) {
	base := t.TempDir()
	out := filepath.Join(base, "out")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	mine := filepath.Join(out, "md", "mine.txt")
	if err := os.WriteFile(mine, []byte("kept"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--date", "2027-01-01")
	if code != 2 || !strings.Contains(stderr, "--replace") {
		t.Errorf("second run without --replace: exit %d, %q", code, stderr)
	}
	// A file added inside one of colsheet's entries stops --replace: it is never deleted.
	code, _, stderr = runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace", "--date", "2027-01-01")
	if code != 2 || !strings.Contains(stderr, "md/mine.txt was not written by colsheet") {
		t.Errorf("--replace over a file of the user's: exit %d, %q", code, stderr)
	}
	if b, err := os.ReadFile(mine); err != nil || string(b) != "kept" {
		t.Error("the user's file inside the output was touched")
	}
	if err := os.Remove(mine); err != nil {
		t.Fatal(err)
	}
	// --replace swaps the whole folder.
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace", "--date", "2027-01-01"); code != 0 {
		t.Fatalf("--replace: exit %d: %s", code, stderr)
	}
	if es, _ := os.ReadDir(base); len(es) != 1 {
		t.Errorf("temporary folders left beside the output: %d entries", len(es))
	}

	// A folder with an md/ of its own is refused, and nothing is written into it.
	other := filepath.Join(base, "other")
	if err := os.MkdirAll(filepath.Join(other, "md"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(other, "md", "notes.md"), []byte("mine"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, stderr = runCLI("design", "../../testdata/columns.yaml", "-o", other, "--replace")
	if code != 2 || !strings.Contains(stderr, "already holds md") {
		t.Errorf("folder with an md/ of its own: exit %d, %q", code, stderr)
	}
	if es, _ := os.ReadDir(other); len(es) != 1 {
		t.Errorf("files written into a refused folder: %d entries", len(es))
	}
}

// Without pdflatex, --pdf says so and still writes the LaTeX; the exit status is the design's.
func TestPDFWithoutTeX(t *testing.T) {
	t.Setenv("PATH", t.TempDir())
	out := filepath.Join(t.TempDir(), "out")
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--pdf")
	if code != 0 || !strings.Contains(stderr, "pdflatex not found") {
		t.Errorf("exit %d, %q", code, stderr)
	}
	if st, err := os.Stat(filepath.Join(out, "doc", "calc.tex")); err != nil || st.Size() == 0 {
		t.Error("doc/calc.tex not written")
	}
}

// Compare finds a changed floor load of the building form as a changed input on the sheets of
// the lifts it loads, beside the changed results (common practice, no source).
func TestCompareFindsChangedFloorLoad(t *testing.T) {
	a := smallBuilding
	b := strings.Replace(a, "gk: 4 kN/m2", "gk: 4.5 kN/m2", 1)
	base := t.TempDir()
	for _, c := range []struct{ name, text string }{{"a", a}, {"b", b}} {
		in := writeFile(t, c.name+".yaml", c.text)
		if code, _, stderr := runCLI("archive", in, "-o", filepath.Join(base, c.name)); code > 1 {
			t.Fatalf("archive %s: exit %d: %s", c.name, code, stderr)
		}
	}
	code, out, stderr := runCLI("compare", filepath.Join(base, "a"), filepath.Join(base, "b"))
	if code != 1 {
		t.Fatalf("compare: exit %d: %s", code, stderr)
	}
	for _, want := range []string{"| A1 | R | input `td/R/g_k`", "| 4 kN/m² | 4.5 kN/m² |", "| A1 | L1 | result N\\_Ed"} {
		if !strings.Contains(out, want) {
			t.Errorf("compare output lacks %q:\n%s", want, out)
		}
	}
	if strings.Contains(out, "td/L1/g_k") {
		t.Error("compare lists the unchanged L1 floor load")
	}
}

// A fresh bundle of failing designs (no pattern between As,min and As,max, NEd above NRd,max,
// a slender column short of resistance, a nearly unloaded column in bending) rechecks clean:
// every contract value, the utilisation of a failure included, is a traced value.
func TestRecheckOfFailingDesigns(t *testing.T) {
	const failing = `project: {title: Edge cases, job: E-1, revision: A, designer: A. Berg, checker: C. Dahl, date: 2026-01-05}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
columns:
  - {id: RANGE, b: 150 mm, h: 150 mm, cover: 35 mm, storeys: [{name: L1, l0: 3 m, NEd: 10000 kN}]}
  - {id: TINY, b: 200 mm, h: 200 mm, cover: 30 mm, storeys: [{name: L1, l0: 3 m, NEd: 4000 kN}]}
  - {id: OVER, b: 250 mm, h: 250 mm, cover: 30 mm, bars: {count: 4, dia: 12 mm}, storeys: [{name: L1, l0: 3 m, NEd: 2500 kN}]}
  - {id: SLEND, b: 250 mm, h: 250 mm, cover: 30 mm, storeys: [{name: L1, l0: 9 m, NEd: 300 kN, M: {y: {top: 30 kNm, bottom: 30 kNm}}}]}
  - {id: TENS, b: 300 mm, h: 300 mm, cover: 30 mm, storeys: [{name: L1, l0: 3 m, NEd: 10 kN, M: {y: {top: 120 kNm, bottom: -60 kNm}, z: {top: 40 kNm, bottom: 40 kNm}}}]}
`
	dir := filepath.Join(t.TempDir(), "pkg")
	if code, _, stderr := runCLI("archive", writeFile(t, "failing.yaml", failing), "-o", dir); code != 1 {
		t.Fatalf("archive of failing designs: exit %d, want 1: %s", code, stderr)
	}
	code, out, stderr := runCLI("recheck", dir)
	if code != 0 {
		t.Errorf("recheck: exit %d\n%s%s", code, out, stderr)
	}
}
