package archive

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A manifest lists every file but itself, sorted by path, and gives the same bytes each time.
func TestNewManifest(t *testing.T) {
	files := map[string][]byte{
		"results.json":     []byte("{}\n"),
		"md/K1-L1.md":      []byte("# K1\n"),
		"input/small.yaml": []byte("columns: []\n"),
		"html/index.html":  []byte("<p>"),
		ManifestName:       []byte("stale"),
	}
	meta := Meta{ToolName: "colsheet", ToolVersion: "0.1.0", Date: "2026-12-01", InputName: "small.yaml", Input: files["input/small.yaml"]}
	first, err := NewManifest(files, meta).JSON()
	if err != nil {
		t.Fatal(err)
	}
	for i := 0; i < 20; i++ {
		again, err := NewManifest(files, meta).JSON()
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(first, again) {
			t.Fatalf("run %d gave other bytes:\n%s\n%s", i, first, again)
		}
	}
	m, err := ParseManifest("m.json", first)
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"html/index.html", "input/small.yaml", "md/K1-L1.md", "results.json"}
	if len(m.Files) != len(want) {
		t.Fatalf("%d files listed, want %d", len(m.Files), len(want))
	}
	for i, f := range m.Files {
		if f.Path != want[i] || f.Size != int64(len(files[f.Path])) || f.SHA256 != Sum(files[f.Path]) {
			t.Errorf("files[%d] = %+v, want %s with its size and hash", i, f, want[i])
		}
	}
	// SHA-256 of "columns: []\n", by sha256sum.
	if m.Input.SHA256 != Sum([]byte("columns: []\n")) || m.Input.Name != "small.yaml" || m.Date != "2026-12-01" || m.Tool.Version != "0.1.0" {
		t.Errorf("meta not recorded: %+v", m)
	}
	if Sum([]byte("abc")) != "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad" {
		t.Error("Sum is not SHA-256") // FIPS 180-2 example "abc"
	}
}

const goodManifest = `{"format": 1, "tool": {"name": "colsheet", "version": "0.1.0"}, "date": "undated",
 "input": {"name": "a.yaml", "sha256": "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"},
 "files": [{"path": "input/a.yaml", "size": 3, "sha256": "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"}]}`

// Every fault of a manifest is an error naming the file and the field.
func TestParseManifestErrors(t *testing.T) {
	sum := "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"
	for _, tc := range []struct {
		name, old, new, want string
	}{
		{"bad JSON", `"format": 1,`, `"format": 1`, "m.json: "},
		{"unknown key", `"date"`, `"extra": 1, "date"`, `unknown field "extra"`},
		{"format", `"format": 1`, `"format": 2`, "m.json: format:"},
		{"tool", `"name": "colsheet"`, `"name": ""`, "m.json: tool.name:"},
		{"input name", `"name": "a.yaml"`, `"name": "x/a.yaml"`, "m.json: input.name:"},
		{"input hash", `"input": {"name": "a.yaml", "sha256": "` + sum, `"input": {"name": "a.yaml", "sha256": "` + strings.ToUpper(sum), "m.json: input.sha256:"},
		{"no files", `"files": [`, `"filez": [`, `unknown field "filez"`},
		{"dot dot", `"path": "input/a.yaml"`, `"path": "../a.yaml"`, "m.json: files[0].path:"},
		{"absolute", `"path": "input/a.yaml"`, `"path": "/etc/a.yaml"`, "m.json: files[0].path:"},
		{"unclean", `"path": "input/a.yaml"`, `"path": "input//a.yaml"`, "m.json: files[0].path:"},
		{"itself", `"path": "input/a.yaml"`, `"path": "manifest.json"`, "m.json: files[0].path:"},
		{"size", `"size": 3`, `"size": -3`, "m.json: files[0].size:"},
		{"hash", `"size": 3, "sha256": "ba`, `"size": 3, "sha256": "zz`, "m.json: files[0].sha256:"},
		{"twice", `"files": [{"path": "input/a.yaml", "size": 3, "sha256": "` + sum + `"}`,
			`"files": [{"path": "input/a.yaml", "size": 3, "sha256": "` + sum + `"}, {"path": "input/a.yaml", "size": 3, "sha256": "` + sum + `"}`, "m.json: files[1].path:"},
		{"trailing data", `}]}`, `}]} {}`, "m.json: data after"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			text := strings.Replace(goodManifest, tc.old, tc.new, 1)
			if text == goodManifest {
				t.Fatalf("case does not change the manifest")
			}
			_, err := ParseManifest("m.json", []byte(text))
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error %v, want one containing %q", err, tc.want)
			}
		})
	}
	if _, err := ParseManifest("m.json", []byte(goodManifest)); err != nil {
		t.Errorf("good manifest refused: %v", err)
	}
	if _, err := ReadManifest(filepath.Join(t.TempDir(), "none.json")); err == nil || !strings.Contains(err.Error(), "none.json") {
		t.Errorf("missing manifest: %v", err)
	}
}

// Reading any bytes as a manifest gives a manifest or an error, never a panic, and a manifest read writes back to one that reads the same.
func FuzzParseManifest(f *testing.F) {
	f.Add([]byte(goodManifest))
	f.Add([]byte(`{"format": 1, "files": null}`))
	f.Add([]byte(`[`))
	f.Add([]byte(``))
	if b, err := os.ReadFile(filepath.Join("testdata", "small", "results.json")); err == nil {
		f.Add(b)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		m, err := ParseManifest("fuzz.json", data)
		if err != nil {
			if !strings.HasPrefix(err.Error(), "fuzz.json: ") {
				t.Errorf("error does not name the file: %v", err)
			}
			return
		}
		b, err := m.JSON()
		if err != nil {
			t.Fatal(err)
		}
		if _, err := ParseManifest("again.json", b); err != nil {
			t.Errorf("a manifest that was read does not read back: %v", err)
		}
	})
}
