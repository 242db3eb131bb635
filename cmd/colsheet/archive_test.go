package main

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/trace"
	"colsheet/reports"
	"colsheet/reports/archive"
)

const demoInput = "../../testdata/columns.yaml"

// archiveDemo archives input into a new folder with a fixed date and returns the folder.
func archiveDemo(t *testing.T, input string) string {
	t.Helper()
	dir := filepath.Join(t.TempDir(), "bundle")
	code, stdout, stderr := runCLI("archive", input, "-o", dir, "--date", "2026-12-01")
	if code != 0 {
		t.Fatalf("archive: exit %d\n%s\n%s", code, stdout, stderr)
	}
	return dir
}

// tamperStep changes one number, the value of the first formula step of the second design, in the text of
// results.json in dir and returns the step's ID.
func tamperStep(t *testing.T, dir string) string {
	t.Helper()
	name := filepath.Join(dir, "results.json")
	b, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	res, err := reports.ReadSteps(b)
	if err != nil || len(res.Designs) < 2 {
		t.Fatalf("results.json: %v", err)
	}
	for _, s := range res.Designs[1].Steps {
		if s.Kind != trace.KindFormula {
			continue
		}
		at := bytes.Index(b, []byte(`"id":"`+s.ID+`"`))
		v := bytes.Index(b[at:], []byte(`"value":`))
		if at < 0 || v < 0 {
			t.Fatalf("step %s not found in the text", s.ID)
		}
		v += at + len(`"value":`)
		end := v + bytes.IndexAny(b[v:], ",}")
		out := append(append(append([]byte{}, b[:v]...), strconv.FormatFloat(s.Value*1.001, 'g', -1, 64)...), b[end:]...)
		if err := os.WriteFile(name, out, 0o644); err != nil {
			t.Fatal(err)
		}
		return s.ID
	}
	t.Fatal("no formula step")
	return ""
}

// rehashManifest rewrites the manifest of dir for the files now there.
func rehashManifest(t *testing.T, dir string) {
	t.Helper()
	m, err := archive.ReadManifest(filepath.Join(dir, archive.ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	for i, f := range m.Files {
		b, err := os.ReadFile(filepath.Join(dir, filepath.FromSlash(f.Path)))
		if err != nil {
			t.Fatal(err)
		}
		m.Files[i].Size, m.Files[i].SHA256 = int64(len(b)), archive.Sum(b)
	}
	b, _ := m.JSON()
	if err := os.WriteFile(filepath.Join(dir, archive.ManifestName), b, 0o644); err != nil {
		t.Fatal(err)
	}
}

// The archive of the demo holds the input and a manifest, rechecks clean, and every tampering is named.
func TestArchiveRecheck(t *testing.T) {
	fresh := archiveDemo(t, demoInput)
	in, _ := os.ReadFile(demoInput)
	if b, err := os.ReadFile(filepath.Join(fresh, "input", "columns.yaml")); err != nil || !bytes.Equal(b, in) {
		t.Fatalf("input not archived: %v", err)
	}
	m, err := archive.ReadManifest(filepath.Join(fresh, archive.ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	if m.Date != "2026-12-01" || m.Input.Name != "columns.yaml" || m.Input.SHA256 != archive.Sum(in) || m.Tool.Name != "colsheet" || len(m.Files) < 10 {
		t.Errorf("manifest: %+v", m)
	}
	for _, tc := range []struct {
		name   string
		tamper func(t *testing.T, dir string) string // returns what the report must name
		code   int
	}{
		{"fresh", func(*testing.T, string) string { return "OK: every file" }, 0},
		{"step value", func(t *testing.T, dir string) string { return "FAIL step " + tamperStep(t, dir) + " " }, 1},
		{"step value, manifest rehashed", func(t *testing.T, dir string) string {
			id := tamperStep(t, dir)
			rehashManifest(t, dir)
			return "FAIL step " + id + " "
		}, 1},
		{"content", func(t *testing.T, dir string) string {
			os.WriteFile(filepath.Join(dir, "md", "D1-GF.md"), []byte("changed"), 0o644)
			return "FAIL file md/D1-GF.md: "
		}, 1},
		{"extra", func(t *testing.T, dir string) string {
			os.WriteFile(filepath.Join(dir, "tex", "extra.tex"), []byte("x"), 0o644)
			return "FAIL file tex/extra.tex: present but not listed"
		}, 1},
		{"missing", func(t *testing.T, dir string) string {
			os.Remove(filepath.Join(dir, "summary.csv"))
			return "FAIL file summary.csv: missing"
		}, 1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := filepath.Join(t.TempDir(), "copy")
			if err := os.CopyFS(dir, os.DirFS(fresh)); err != nil {
				t.Fatal(err)
			}
			want := tc.tamper(t, dir)
			code, stdout, stderr := runCLI("recheck", dir)
			if code != tc.code {
				t.Errorf("exit %d, want %d\n%s%s", code, tc.code, stdout, stderr)
			}
			if !strings.Contains(stdout, want) {
				t.Errorf("report lacks %q:\n%s", want, stdout)
			}
		})
	}
	// Two archives of the same input give the same manifest, byte for byte.
	a, _ := os.ReadFile(filepath.Join(fresh, archive.ManifestName))
	b, _ := os.ReadFile(filepath.Join(archiveDemo(t, demoInput), archive.ManifestName))
	if !bytes.Equal(a, b) {
		t.Error("two archives of one input give different manifests")
	}
}

// Compare lists the changed load and the results of exactly the column whose load changed; equal bundles say no changes.
func TestArchiveCompare(t *testing.T) {
	old := archiveDemo(t, demoInput)
	in, _ := os.ReadFile(demoInput)
	changed := bytes.Replace(in, []byte("NEd: 1460 kN"), []byte("NEd: 1520 kN"), 1)
	if bytes.Equal(changed, in) {
		t.Fatal("the demo no longer holds D1's load")
	}
	input := filepath.Join(t.TempDir(), "columns.yaml")
	os.WriteFile(input, changed, 0o644)
	revised := archiveDemo(t, input)
	code, stdout, stderr := runCLI("compare", old, revised)
	if code != 1 {
		t.Fatalf("exit %d, want 1 (the packages differ)\n%s", code, stderr)
	}
	for _, w := range []string{"| D1 | GF | input `act/NEd`: Design axial force (compression positive), N\\_Ed | 1460 kN | 1520 kN |",
		"| D1 | GF | result N\\_Ed | 1460 kN | 1520 kN |", "| D1 | GF | result utilization |",
		"- Input SHA-256: `" + archive.Sum(in) + "` → `" + archive.Sum(changed) + "`"} {
		if !strings.Contains(stdout, w) {
			t.Errorf("compare lacks %q:\n%s", w, stdout)
		}
	}
	for _, line := range strings.Split(stdout, "\n") {
		if strings.HasPrefix(line, "| ") && !strings.HasPrefix(line, "| D1 | GF |") && !strings.HasPrefix(line, "| Column |") && !strings.HasPrefix(line, "| --- |") {
			t.Errorf("a row for another design: %s", line)
		}
	}
	code, stdout, _ = runCLI("compare", old, old)
	if code != 0 || !strings.Contains(stdout, "No changes") {
		t.Errorf("equal bundles: exit %d\n%s", code, stdout)
	}
	// -o writes a new file and refuses an existing one.
	note := filepath.Join(t.TempDir(), "rev.md")
	if code, _, stderr := runCLI("compare", old, revised, "-o", note); code != 1 {
		t.Fatalf("compare -o: exit %d %s", code, stderr)
	}
	first, _ := os.ReadFile(note)
	if !bytes.Contains(first, []byte("| D1 | GF |")) {
		t.Errorf("note: %s", first)
	}
	if code, _, stderr := runCLI("compare", old, old, "-o", note); code != 2 || !strings.Contains(stderr, "exists") {
		t.Errorf("existing note: exit %d %s", code, stderr)
	}
	if again, _ := os.ReadFile(note); !bytes.Equal(again, first) {
		t.Error("an existing note was overwritten")
	}
}

// Archive refuses a folder holding a manifest.json that colsheet did not write (no marker lists
// it), with or without --replace, and leaves it untouched; its own bundle it replaces with --replace.
func TestArchiveRefusesExisting(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "bundle")
	os.MkdirAll(dir, 0o755)
	os.WriteFile(filepath.Join(dir, "manifest.json"), []byte("earlier"), 0o644)
	for _, extra := range [][]string{nil, {"--replace"}} {
		args := append([]string{"archive", demoInput, "-o", dir, "--date", "2026-12-01"}, extra...)
		code, _, stderr := runCLI(args...)
		if code != 2 || !strings.Contains(stderr, "already holds manifest.json") {
			t.Errorf("%v: exit %d, want 2: %s", extra, code, stderr)
		}
		if es, _ := os.ReadDir(dir); len(es) != 1 {
			t.Errorf("%v: the existing folder was changed: %v", extra, es)
		}
		if b, _ := os.ReadFile(filepath.Join(dir, "manifest.json")); string(b) != "earlier" {
			t.Errorf("%v: the existing manifest was overwritten", extra)
		}
	}
	os.Remove(filepath.Join(dir, "manifest.json"))
	for _, extra := range [][]string{nil, {"--replace"}} {
		args := append([]string{"archive", demoInput, "-o", dir, "--date", "2026-12-01"}, extra...)
		if code, _, stderr := runCLI(args...); code != 0 {
			t.Fatalf("%v: exit %d %s", extra, code, stderr)
		}
	}
	if code, stdout, _ := runCLI("recheck", dir); code != 0 {
		t.Errorf("replaced bundle: exit %d\n%s", code, stdout)
	}
}

// Usage errors and unreadable bundles exit 2.
func TestArchiveUsage(t *testing.T) {
	empty := t.TempDir()
	for _, args := range [][]string{
		{"archive"}, {"archive", demoInput}, {"archive", demoInput, "-o", filepath.Join(empty, "b"), "--formats", "md"},
		{"archive", "no-such.yaml", "-o", filepath.Join(empty, "c")},
		{"recheck"}, {"recheck", empty, empty}, {"recheck", "--all"}, {"recheck", empty}, {"recheck", filepath.Join(empty, "none")},
		{"compare"}, {"compare", empty}, {"compare", empty, empty}, {"compare", empty, empty, "-o"}, {"compare", empty, empty, "--frob"},
	} {
		if code, _, _ := runCLI(args...); code != 2 {
			t.Errorf("%v: exit %d, want 2", args, code)
		}
	}
	if es, _ := os.ReadDir(empty); len(es) != 0 {
		t.Errorf("usage errors wrote files: %v", es)
	}
}

// With --pdf the calc document's PDF is part of the bundle and listed in its manifest.
func TestArchivePDF(t *testing.T) {
	if _, err := exec.LookPath("pdflatex"); err != nil {
		t.Skip("pdflatex not installed")
	}
	dir := filepath.Join(t.TempDir(), "bundle")
	if code, stdout, stderr := runCLI("archive", demoInput, "-o", dir, "--date", "2026-12-01", "--pdf"); code != 0 {
		t.Fatalf("exit %d\n%s\n%s", code, stdout, stderr)
	}
	m, err := archive.ReadManifest(filepath.Join(dir, archive.ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	listed := false
	for _, f := range m.Files {
		listed = listed || f.Path == "doc/calc.pdf" && f.Size > 0
	}
	if !listed {
		t.Error("doc/calc.pdf is not listed")
	}
	if code, stdout, _ := runCLI("recheck", dir); code != 0 {
		t.Errorf("recheck: exit %d\n%s", code, stdout)
	}
}
