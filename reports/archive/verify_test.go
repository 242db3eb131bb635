package archive

import (
	"bytes"
	"encoding/json"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// readTree returns every file below dir keyed by its slash path.
func readTree(t *testing.T, dir string) map[string][]byte {
	t.Helper()
	files := map[string][]byte{}
	err := filepath.WalkDir(dir, func(p string, d fs.DirEntry, err error) error {
		if err != nil || d.IsDir() {
			return err
		}
		b, err := os.ReadFile(p)
		rel, _ := filepath.Rel(dir, p)
		files[filepath.ToSlash(rel)] = b
		return err
	})
	if err != nil {
		t.Fatal(err)
	}
	return files
}

// writeBundle writes files and their manifest to a new folder and returns it.
func writeBundle(t *testing.T, files map[string][]byte) string {
	t.Helper()
	dir := filepath.Join(t.TempDir(), "bundle")
	for p, b := range files {
		name := filepath.Join(dir, filepath.FromSlash(p))
		if err := os.MkdirAll(filepath.Dir(name), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(name, b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	rehash(t, dir)
	return dir
}

// rehash writes the manifest of the files now in dir, as someone covering a tampering would.
func rehash(t *testing.T, dir string) {
	t.Helper()
	files := readTree(t, dir)
	delete(files, ManifestName)
	m := NewManifest(files, Meta{ToolName: "colsheet", ToolVersion: "0.1.0", Date: "undated", InputName: "small.yaml", Input: files["input/small.yaml"]})
	b, err := m.JSON()
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, ManifestName), b, 0o644); err != nil {
		t.Fatal(err)
	}
}

// editResults applies edit to the decoded results.json of dir and writes it back.
func editResults(t *testing.T, dir string, edit func(designs []any)) {
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
	edit(res["designs"].([]any))
	out, err := json.MarshalIndent(res, "", "  ")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(name, out, 0o644); err != nil {
		t.Fatal(err)
	}
}

// step returns step i of design k, decoded as a map.
func step(designs []any, k, i int) map[string]any {
	return designs[k].(map[string]any)["trace"].([]any)[i].(map[string]any)
}

// Verify names every file and step of the shipped small bundle that was tampered with. The bundle
// is written by hand, not by the engine, so its contract values, sheets and input do not hold
// (TestRecheckForgeries checks those on packages the engine made): only the problems with files
// and steps are compared here.
func TestVerify(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	for _, tc := range []struct {
		name   string
		tamper func(t *testing.T, dir string)
		files  []string // paths of the file problems, in order
		steps  []string // IDs of the step problems, in order
		text   []string // found in the text report
	}{
		{name: "fresh", tamper: func(*testing.T, string) {}},
		{name: "value tampered", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) { step(d, 1, 2)["value"] = 17.5 })
		}, files: []string{ResultsName}, steps: []string{"K1/L1/mat/fcd", "K1/L1/chk/N"},
			text: []string{"FAIL file results.json: size", `FAIL step K1/L1/mat/fcd (column K1, lift L1) "Design compressive strength": value does not reproduce from alpha_cc * fck / gamma_c: recorded 17.5, recomputed 17`}},
		{name: "value tampered, manifest rehashed", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) { step(d, 1, 2)["value"] = 17.5 })
			rehash(t, dir)
		}, steps: []string{"K1/L1/mat/fcd", "K1/L1/chk/N"}},
		{name: "value and expression tampered, caught downstream", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) {
				s := step(d, 1, 3)
				s["value"], s["expr"] = 91000.0, "b * h + 1000"
			})
			rehash(t, dir)
		}, steps: []string{"K1/L1/chk/N"}, text: []string{"argument A_c does not carry the value of its source step K1/L1/geo/Ac: recorded 90000, the source step records 91000"}},
		{name: "input tampered, caught in the lift below", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) { step(d, 0, 0)["value"] = 950000.0 })
			rehash(t, dir)
		}, steps: []string{"K1/L2/chk/N", "K1/L1/act/N_above"}},
		{name: "verdict flipped", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) {
				s := step(d, 2, 4)
				s["value"], s["expr"], s["verdict"] = 1.5, "1.5", "pass"
			})
			rehash(t, dir)
		}, steps: []string{"K3/L1/chk/N"}, text: []string{"verdict pass with a ratio above 1"}},
		{name: "contract value tampered, manifest rehashed", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) {
				d[0].(map[string]any)["axes"].(map[string]any)["y"].(map[string]any)["MRd_kNm"] = 99.0
			})
			rehash(t, dir)
		}, text: []string{"FAIL design K1/L2, axes.y.MRd_kNm: results.json says 99,"}},
		{name: "dangling source", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) {
				step(d, 1, 5)["args"].([]any)[0].(map[string]any)["from"] = "/K1/L9/act/NEd"
			})
			rehash(t, dir)
		}, steps: []string{"K1/L1/act/N_above"}, text: []string{"names step /K1/L9/act/NEd, which results.json does not hold"}},
		{name: "unknown kind", tamper: func(t *testing.T, dir string) {
			editResults(t, dir, func(d []any) { step(d, 2, 2)["kind"] = "guess" })
			rehash(t, dir)
		}, steps: []string{"K3/L1/mat/fcd"}},
		{name: "content changed", tamper: func(t *testing.T, dir string) {
			os.WriteFile(filepath.Join(dir, "summary.csv"), bytes.Replace(small["summary.csv"], []byte("K3"), []byte("K4"), 1), 0o644)
		}, files: []string{"summary.csv"}, text: []string{"FAIL file summary.csv: content changed: SHA-256"}},
		{name: "extra file", tamper: func(t *testing.T, dir string) {
			os.WriteFile(filepath.Join(dir, "md", "notes.md"), []byte("x"), 0o644)
		}, files: []string{"md/notes.md"}, text: []string{"FAIL file md/notes.md: present but not listed"}},
		{name: "missing file", tamper: func(t *testing.T, dir string) {
			os.Remove(filepath.Join(dir, "summary.csv"))
		}, files: []string{"summary.csv"}, text: []string{"FAIL file summary.csv: missing"}},
		{name: "missing results", tamper: func(t *testing.T, dir string) {
			os.Remove(filepath.Join(dir, ResultsName))
		}, files: []string{ResultsName, ResultsName}},
		{name: "input replaced", tamper: func(t *testing.T, dir string) {
			os.WriteFile(filepath.Join(dir, "input", "small.yaml"), []byte("columns: []\n"), 0o644)
			rehash(t, dir)
		}, files: []string{ResultsName}, text: []string{"input_sha256"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			files := map[string][]byte{"md/K1-L1.md": []byte("# K1 L1\n")}
			for p, b := range small {
				files[p] = b
			}
			dir := writeBundle(t, files)
			tc.tamper(t, dir)
			r, err := Verify(dir)
			if err != nil {
				t.Fatal(err)
			}
			var gotFiles, gotSteps []string
			for _, p := range r.FileProblems {
				gotFiles = append(gotFiles, p.Path)
			}
			for _, p := range r.StepProblems {
				gotSteps = append(gotSteps, p.ID)
			}
			if strings.Join(gotFiles, ",") != strings.Join(tc.files, ",") {
				t.Errorf("file problems %v, want %v: %+v", gotFiles, tc.files, r.FileProblems)
			}
			if strings.Join(gotSteps, ",") != strings.Join(tc.steps, ",") {
				t.Errorf("step problems %v, want %v: %+v", gotSteps, tc.steps, r.StepProblems)
			}
			if r.OK() {
				t.Errorf("OK() = true for a bundle not made by the engine")
			}
			var text bytes.Buffer
			if err := r.WriteText(&text); err != nil {
				t.Fatal(err)
			}
			for _, want := range tc.text {
				if !strings.Contains(text.String(), want) {
					t.Errorf("report lacks %q:\n%s", want, text.String())
				}
			}
			if !strings.Contains(text.String(), "NOT OK") {
				t.Errorf("report does not end with the verdict:\n%s", text.String())
			}
			if tc.name == "fresh" && (r.Files != 4 || r.Steps != 31 || r.References != 13) {
				t.Errorf("checked %d files, %d steps, %d references; want 4, 31, 13", r.Files, r.Steps, r.References)
			}
		})
	}
}

// Verify gives an error, naming the file, when the manifest is missing or unreadable.
func TestVerifyNoManifest(t *testing.T) {
	dir := t.TempDir()
	if _, err := Verify(dir); err == nil || !strings.Contains(err.Error(), ManifestName) {
		t.Errorf("no manifest: %v", err)
	}
	os.WriteFile(filepath.Join(dir, ManifestName), []byte("{"), 0o644)
	if _, err := Verify(dir); err == nil || !strings.Contains(err.Error(), filepath.Join(dir, ManifestName)) {
		t.Errorf("bad manifest: %v", err)
	}
}
