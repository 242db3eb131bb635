package archive

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
	"colsheet/reports"
)

// basisBundle designs compareBuilding (façade 9.5 kN/m, bars 16 and 20, with the extra input
// lines) and writes results.json, the input and the manifest to a new folder.
func basisBundle(t *testing.T, extra string) string {
	t.Helper()
	src := strings.NewReplacer("FACADE", "9.5 kN/m", "BARS", "16, 20").Replace(compareBuilding) + extra
	in, err := yamlinput.Parse("compare.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	r, err := design.Run(in)
	if err != nil {
		t.Fatal(err)
	}
	js, err := reports.JSON(r)
	if err != nil {
		t.Fatal(err)
	}
	dir := filepath.Join(t.TempDir(), "bundle")
	files := map[string][]byte{ResultsName: js, "input/compare.yaml": []byte(src)}
	for p, b := range files {
		name := filepath.Join(dir, filepath.FromSlash(p))
		if err := os.MkdirAll(filepath.Dir(name), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(name, b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	rehashAs(t, dir, "compare.yaml")
	return dir
}

// rehashAs writes the manifest of the files now in dir, the input being input/name.
func rehashAs(t *testing.T, dir, name string) {
	t.Helper()
	files := readTree(t, dir)
	delete(files, ManifestName)
	m := NewManifest(files, Meta{ToolName: "colsheet", ToolVersion: "0.1.0", Date: "undated", InputName: name, Input: files["input/"+name]})
	b, err := m.JSON()
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, ManifestName), b, 0o644); err != nil {
		t.Fatal(err)
	}
}

// editPacked applies edit to the decoded results.json of dir (packed steps) and writes it back
// with the manifest rehashed, as someone covering a tampering would.
func editPacked(t *testing.T, dir string, edit func(res map[string]any)) {
	t.Helper()
	name := filepath.Join(dir, ResultsName)
	b, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	var res map[string]any
	if err := json.Unmarshal(b, &res); err != nil {
		t.Fatal(err)
	}
	edit(res)
	if b, err = json.Marshal(res); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(name, b, 0o644); err != nil {
		t.Fatal(err)
	}
	rehashAs(t, dir, "compare.yaml")
}

// basisEntry returns the packed basis step with the given ID.
func basisEntry(t *testing.T, res map[string]any, id string) map[string]any {
	t.Helper()
	for _, s := range res["basis"].([]any) {
		if m := s.(map[string]any); m["id"] == id {
			return m
		}
	}
	t.Fatalf("no basis step %s", id)
	return nil
}

// recheck resolves the project basis: it re-evaluates the basis steps, resolves the designs'
// references to them, and catches a tampered basis value (a changed γc, with fcd left as it was:
// the argument of fcd no longer carries its source's value; a changed fcd: fcd no longer
// reproduces, and every argument taken from it differs from its source).
func TestVerifyBasis(t *testing.T) {
	fresh := basisBundle(t, "")
	r, err := Verify(fresh)
	if err != nil {
		t.Fatal(err)
	}
	if !r.OK() {
		var b strings.Builder
		r.WriteText(&b)
		t.Fatalf("fresh bundle:\n%s", b.String())
	}
	res, err := readResults(filepath.Join(fresh, ResultsName))
	if err != nil {
		t.Fatal(err)
	}
	n := len(res.Basis)
	for _, d := range res.Designs {
		n += len(d.Trace)
	}
	if n == 0 || len(res.Basis) == 0 || r.Steps != n {
		t.Errorf("rechecked %d steps, results.json holds %d (basis %d)", r.Steps, n, len(res.Basis))
	}
	toBasis := 0
	for _, d := range res.Designs {
		for _, s := range d.Trace {
			for _, a := range s.Args {
				if strings.HasPrefix(a.From, design.BasisPrefix) {
					toBasis++
				}
			}
		}
	}
	if toBasis == 0 {
		t.Fatal("no design refers to the basis")
	}

	for _, tc := range []struct {
		name  string
		edit  func(t *testing.T, res map[string]any)
		first string // the first step problem
		text  string
	}{
		{"γc tampered", func(t *testing.T, res map[string]any) { basisEntry(t, res, "basis/code/gamma_c")["value"] = 1.4 },
			"basis/mat/C30-37/f_cd", "argument gamma_c does not carry the value of its source step basis/code/gamma_c: recorded 1.5, the source step records 1.4"},
		{"fcd tampered", func(t *testing.T, res map[string]any) { basisEntry(t, res, "basis/mat/C30-37/f_cd")["value"] = 21.0 },
			"basis/mat/C30-37/f_cd", "value does not reproduce from alpha_cc * f_ck / gamma_c: recorded 21, recomputed 20"},
		{"form out of range", func(t *testing.T, res map[string]any) { basisEntry(t, res, "basis/code/gamma_c")["form"] = 1e6 },
			"", "FAIL file results.json: cannot be read"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := basisBundle(t, "")
			editPacked(t, dir, func(res map[string]any) { tc.edit(t, res) })
			r, err := Verify(dir)
			if err != nil {
				t.Fatal(err)
			}
			var text strings.Builder
			r.WriteText(&text)
			if r.OK() || !strings.Contains(text.String(), tc.text) {
				t.Errorf("report lacks %q:\n%.3000s", tc.text, text.String())
			}
			if tc.first != "" && (len(r.StepProblems) == 0 || r.StepProblems[0].ID != tc.first) {
				t.Errorf("first step problem %+v, want %s", r.StepProblems, tc.first)
			}
			if tc.name == "fcd tampered" {
				downstream := 0
				for _, p := range r.StepProblems {
					if p.Source && p.Column != "(project basis)" {
						downstream++
					}
				}
				if downstream == 0 {
					t.Error("no design's argument from fcd caught")
				}
			}
		})
	}
}

// compare lists a changed value of the project basis (an overridden γc) once, as a changed input
// of the project, never as an input of each design that uses it; the designs' results follow.
func TestCompareBasisOnce(t *testing.T) {
	c, err := Compare(basisBundle(t, ""), basisBundle(t, "code: {overrides: {gamma_c: 1.4}}\n"))
	if err != nil {
		t.Fatal(err)
	}
	var inputs []Change
	results := 0
	for _, r := range c.Rows {
		switch {
		case strings.HasPrefix(r.Item, "input "):
			inputs = append(inputs, r)
		case strings.HasPrefix(r.Item, "result "):
			results++
		}
	}
	want := Change{ProjectColumn, none, "input `basis/code/gamma_c`: Partial factor for concrete, persistent and transient, γ\\_c", "1.5", "1.4"}
	if len(inputs) != 1 || inputs[0] != want || c.Rows[0] != want {
		t.Errorf("changed inputs %+v, want the one row %+v first", inputs, want)
	}
	if results == 0 {
		t.Error("no design's result follows the changed γc")
	}
	if md := string(c.Markdown()); !strings.Contains(md, "| project | — | input `basis/code/gamma_c`") {
		t.Errorf("Markdown lacks the project row:\n%s", md)
	}
}

// A value that one package records on a lift and the other once in its project basis (a package
// written before the basis existed) moved, and is no change; with another value it is listed,
// on both sides.
func TestCompareMovedToBasis(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	dg := func(v float64) map[string]any {
		return map[string]any{"title": "Maximum aggregate size", "clause": "input", "kind": "input", "symbol": "d_g", "unit": "mm", "value": v}
	}
	for _, tc := range []struct {
		basis float64
		rows  int
	}{{20, 0}, {25, 2}} {
		a, b := writeBundle(t, small), writeBundle(t, small)
		editResults(t, a, func(d []any) {
			s := dg(20)
			s["id"] = "K1/L2/space/dg"
			d[0].(map[string]any)["trace"] = append(d[0].(map[string]any)["trace"].([]any), s)
		})
		name := filepath.Join(b, ResultsName)
		raw, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		var res map[string]any
		if err := json.Unmarshal(raw, &res); err != nil {
			t.Fatal(err)
		}
		s := dg(tc.basis)
		s["id"] = "basis/mat/d_g"
		res["basis"] = []any{s}
		if raw, err = json.Marshal(res); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(name, raw, 0o644); err != nil {
			t.Fatal(err)
		}
		c, err := Compare(a, b)
		if err != nil {
			t.Fatal(err)
		}
		if len(c.Rows) != tc.rows {
			t.Errorf("d_g 20 mm on the lift, %g mm in the basis: rows %+v, want %d", tc.basis, c.Rows, tc.rows)
		}
	}
}
