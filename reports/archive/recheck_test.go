package archive

import (
	"bytes"
	"crypto/ed25519"
	"encoding/base64"
	"encoding/hex"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
	"colsheet/reports"
)

// forgeColumn is an actions-form column with 16 given bars; invented numbers, test input only.
const forgeColumn = `project: {title: Recheck test, job: R-1, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
columns:
  - id: K1
    b: 500 mm
    h: 500 mm
    cover: 35 mm
    bars: {count: 16, dia: 20 mm}
    storeys:
      - name: L1
        l0: {y: 3.0 m, z: 3.0 m}
        NEd: 2400 kN
        M: {y: {top: 120 kNm, bottom: -60 kNm}, z: {top: 40 kNm, bottom: -20 kNm}}
`

// engineBundle designs src and writes what an archive holds (results.json, the Markdown sheets
// and calc document, the input) with its manifest to a new folder.
func engineBundle(t *testing.T, name, src string) string {
	t.Helper()
	return engineBundleAt(t, name, src, reports.Brief)
}

// engineBundleAt is engineBundle with the sheets at the given detail.
func engineBundleAt(t *testing.T, name, src string, detail reports.Detail) string {
	t.Helper()
	in, err := yamlinput.Parse(name, []byte(src))
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
	pkg, docs, err := reports.Render(r, map[string]bool{"md": true}, reports.Options{Detail: detail})
	if err != nil {
		t.Fatal(err)
	}
	files := map[string][]byte{ResultsName: js, "input/" + name: []byte(src)}
	for _, s := range pkg["md"] {
		files["md/"+s.Name] = s.Data
	}
	for _, s := range docs {
		files["doc/"+s.Name] = s.Data
	}
	dir := filepath.Join(t.TempDir(), "bundle")
	for p, b := range files {
		f := filepath.Join(dir, filepath.FromSlash(p))
		if err := os.MkdirAll(filepath.Dir(f), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(f, b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	rehashAs(t, dir, name)
	return dir
}

// editDesign applies edit to design k of the results.json of dir (its trace packed as written).
func editDesign(t *testing.T, dir string, k int, edit func(d map[string]any)) {
	t.Helper()
	editPacked(t, dir, func(res map[string]any) { edit(res["designs"].([]any)[k].(map[string]any)) })
}

// keys returns "design key" of every problem of r beyond files and steps.
func keys(r *Report) []string {
	var out []string
	for _, p := range r.Problems {
		out = append(out, strings.TrimSpace(p.Design+" "+p.Key))
	}
	return out
}

// Each forgery of the issue, the manifest's hashes updated each time, fails recheck, which names
// the design, the key and both values. The values are the engine's own: the test holds recheck
// to them, no engineering reference is involved.
func TestRecheckForgeries(t *testing.T) {
	for _, tc := range []struct {
		name   string
		forge  func(t *testing.T, dir string)
		want   []string // "design key" of problems that must be among those reported
		text   []string // found in the text report
		noFile bool     // no file problem: the manifest covers the forgery
	}{
		{name: "fresh", forge: func(*testing.T, string) {}, noFile: true},
		{name: "utilisation set to 0.5", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["utilization"] = 0.5 })
		}, want: []string{"K1/L1 utilization"}, text: []string{"FAIL design K1/L1, utilization: results.json says 0.5, the governing check K1/L1/"}, noFile: true},
		{name: "NEd lowered", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["NEd_kN"] = 1200.0 })
		}, want: []string{"K1/L1 NEd_kN"}, text: []string{"FAIL design K1/L1, NEd_kN: results.json says 1200, its step K1/L1/act/NEd records 2400"}, noFile: true},
		{name: "MRd a thousandfold", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) {
				ax := d["axes"].(map[string]any)["y"].(map[string]any)
				ax["MRd_kNm"] = ax["MRd_kNm"].(float64) * 1000
			})
		}, want: []string{"K1/L1 axes.y.MRd_kNm"}, text: []string{"its step K1/L1/y/sec/M_Rd records"}, noFile: true},
		{name: "bars 16 to 4", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["bars"].(map[string]any)["count"] = 4.0 })
		}, want: []string{"K1/L1 bars.count"}, text: []string{"FAIL design K1/L1, bars.count: results.json says 4, its step K1/L1/bars/count records 16"}, noFile: true},
		{name: "bars and positions 16 to 4", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) {
				b := d["bars"].(map[string]any)
				b["count"] = 4.0
				b["positions_mm"] = b["positions_mm"].([]any)[:4]
			})
		}, want: []string{"K1/L1 bars.count", "K1/L1 bars.positions_mm"}, text: []string{"results.json lists 4 positions, the bar steps place 16 bars"}, noFile: true},
		{name: "a bar moved", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) {
				d["bars"].(map[string]any)["positions_mm"].([]any)[0] = []any{-100.0, -100.0}
			})
		}, want: []string{"K1/L1 bars.positions_mm[0]"}, noFile: true},
		{name: "links spread", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["links"].(map[string]any)["spacing_mm"] = 600.0 })
		}, want: []string{"K1/L1 links.spacing_mm"}, noFile: true},
		{name: "cover changed", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["cover_mm"] = 45.0 })
		}, want: []string{"K1/L1 cover_mm"}, text: []string{"FAIL design K1/L1, cover_mm: results.json says 45, the archived input gives 35"}, noFile: true},
		{name: "status flipped", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) { d["status"] = "fail" })
		}, want: []string{"K1/L1 status"}, text: []string{"results.json says fail, but no check step fails"}, noFile: true},
		{name: "governing moved to a check of lower ratio", forge: func(t *testing.T, dir string) {
			editDesign(t, dir, 0, func(d map[string]any) {
				d["governing"] = "Minimum reinforcement (EN 1992-1-1:2004 9.5.2(2))"
				d["utilization"] = 0.0 // set below from the step
			})
			// The utilisation of the forged governing check, so that the two agree.
			editPacked(t, dir, func(res map[string]any) {
				d := res["designs"].([]any)[0].(map[string]any)
				for _, s := range d["trace"].([]any) {
					if s.(map[string]any)["id"] == "K1/L1/bars/check_As_min" {
						d["utilization"] = s.(map[string]any)["value"]
					}
				}
			})
		}, want: []string{"K1/L1 utilization"}, text: []string{"the archived input designed again gives pass at"}, noFile: true},
		{name: "archived input changed, trace untouched", forge: func(t *testing.T, dir string) {
			name := filepath.Join(dir, "input", "forge.yaml")
			src := strings.Replace(forgeColumn, "NEd: 2400 kN", "NEd: 3400 kN", 1)
			if err := os.WriteFile(name, []byte(src), 0o644); err != nil {
				t.Fatal(err)
			}
			editPacked(t, dir, func(res map[string]any) { res["input_sha256"] = Sum([]byte(src)) })
		}, want: []string{"K1/L1 K1/L1/act/NEd"}, text: []string{"FAIL design K1/L1, K1/L1/act/NEd: results.json records 2400000, the archived input gives 3400000"}, noFile: true},
		{name: "a number changed on a sheet", forge: func(t *testing.T, dir string) {
			name := filepath.Join(dir, "md", "K1-L1.md")
			b, err := os.ReadFile(name)
			if err != nil {
				t.Fatal(err)
			}
			c := bytes.Replace(b, []byte("**N<sub>Ed</sub> = 2400\u00a0kN**"), []byte("**N<sub>Ed</sub> = 1400\u00a0kN**"), 1)
			if bytes.Equal(b, c) {
				t.Fatal("the sheet does not print NEd as expected")
			}
			if err := os.WriteFile(name, c, 0o644); err != nil {
				t.Fatal(err)
			}
		}, want: []string{"md/K1-L1.md"}, text: []string{"FAIL md/K1-L1.md: step K1/L1/act/NEd: the sheet prints 1400, its step records 2400"}, noFile: true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := engineBundle(t, "forge.yaml", forgeColumn)
			tc.forge(t, dir)
			rehashAs(t, dir, "forge.yaml")
			r, err := Verify(dir)
			if err != nil {
				t.Fatal(err)
			}
			var text bytes.Buffer
			if err := r.WriteText(&text); err != nil {
				t.Fatal(err)
			}
			if tc.noFile && len(r.FileProblems)+len(r.StepProblems) > 0 {
				t.Errorf("file or step problems where the manifest covers the forgery:\n%s", text.String())
			}
			if r.OK() != (len(tc.want) == 0) {
				t.Errorf("OK() = %v:\n%s", r.OK(), text.String())
			}
			got := strings.Join(keys(r), "\n")
			for _, w := range tc.want {
				if !strings.Contains("\n"+got+"\n", "\n"+w+"\n") {
					t.Errorf("no problem %q among:\n%s", w, got)
				}
			}
			for _, w := range tc.text {
				if !strings.Contains(text.String(), w) {
					t.Errorf("report lacks %q:\n%s", w, text.String())
				}
			}
			if tc.name == "fresh" && (r.Printed == 0 || !strings.Contains(text.String(), "not signed")) {
				t.Errorf("fresh bundle: %d printed values checked, report:\n%s", r.Printed, text.String())
			}
		})
	}
}

// The building form passes recheck as written (NEd from the take-down, td/NEd), and a lowered
// NEd of one lift is caught there too.
func TestRecheckBuilding(t *testing.T) {
	src := strings.NewReplacer("FACADE", "9.5 kN/m", "BARS", "16, 20").Replace(compareBuilding)
	dir := engineBundle(t, "compare.yaml", src)
	r, err := Verify(dir)
	if err != nil {
		t.Fatal(err)
	}
	var text bytes.Buffer
	r.WriteText(&text)
	if !r.OK() {
		t.Fatalf("fresh building bundle:\n%s", text.String())
	}
	editDesign(t, dir, 0, func(d map[string]any) { d["NEd_kN"] = d["NEd_kN"].(float64) - 1 })
	rehashAs(t, dir, "compare.yaml")
	if r, _ = Verify(dir); r.OK() || !strings.Contains(strings.Join(keys(r), ","), "NEd_kN") {
		t.Errorf("lowered NEd passes: %v", keys(r))
	}
}

// A symbolic link in a bundle is refused, listed or not, and never read through; so is a
// listed file beyond the size cap.
func TestRecheckHostileBundle(t *testing.T) {
	outside := filepath.Join(t.TempDir(), "secret.txt")
	if err := os.WriteFile(outside, []byte("secret\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	t.Run("unlisted symlink", func(t *testing.T) {
		dir := engineBundle(t, "forge.yaml", forgeColumn)
		if err := os.Symlink(outside, filepath.Join(dir, "md", "extra.md")); err != nil {
			t.Skip("no symbolic links here:", err)
		}
		r, err := Verify(dir)
		if err != nil {
			t.Fatal(err)
		}
		if r.OK() || len(r.FileProblems) != 1 || r.FileProblems[0].Path != "md/extra.md" || !strings.Contains(r.FileProblems[0].Problem, "symbolic link") {
			t.Errorf("file problems %+v", r.FileProblems)
		}
	})
	t.Run("listed file replaced by a symlink with the same content", func(t *testing.T) {
		dir := engineBundle(t, "forge.yaml", forgeColumn)
		name := filepath.Join(dir, "md", "K1-L1.md")
		b, _ := os.ReadFile(name)
		copyOut := filepath.Join(t.TempDir(), "K1-L1.md")
		os.WriteFile(copyOut, b, 0o644)
		os.Remove(name)
		if err := os.Symlink(copyOut, name); err != nil {
			t.Skip("no symbolic links here:", err)
		}
		r, _ := Verify(dir)
		var text bytes.Buffer
		r.WriteText(&text)
		if r.OK() || !strings.Contains(text.String(), "FAIL file md/K1-L1.md: cannot be read: md/K1-L1.md is a symbolic link: refused") {
			t.Errorf("report:\n%s", text.String())
		}
	})
	t.Run("symlinked folder", func(t *testing.T) {
		dir := engineBundle(t, "forge.yaml", forgeColumn)
		moved := filepath.Join(t.TempDir(), "md")
		if err := os.Rename(filepath.Join(dir, "md"), moved); err != nil {
			t.Fatal(err)
		}
		if err := os.Symlink(moved, filepath.Join(dir, "md")); err != nil {
			t.Skip("no symbolic links here:", err)
		}
		r, _ := Verify(dir)
		var text bytes.Buffer
		r.WriteText(&text)
		if r.OK() || !strings.Contains(text.String(), "md is a symbolic link: refused") {
			t.Errorf("report:\n%s", text.String())
		}
	})
	t.Run("file above the cap", func(t *testing.T) {
		dir := t.TempDir()
		big := filepath.Join(dir, "big.csv")
		f, err := os.Create(big)
		if err != nil {
			t.Fatal(err)
		}
		f.Close()
		if err := os.Truncate(big, MaxFileSize+1); err != nil { // sparse: nothing written
			t.Skip("cannot make a sparse file:", err)
		}
		if _, err := readInside(dir, "big.csv"); err == nil || !strings.Contains(err.Error(), "above the limit") {
			t.Errorf("file above the cap read: %v", err)
		}
	})
}

// A manifest signed with Ed25519 verifies with its public key, in every key file form; a
// signature of another key, or of a manifest changed since, fails.
func TestRecheckSignature(t *testing.T) {
	seed := bytes.Repeat([]byte{7}, ed25519.SeedSize) // a test key, never a real one
	priv := ed25519.NewKeyFromSeed(seed)
	pub := priv.Public().(ed25519.PublicKey)
	other := ed25519.NewKeyFromSeed(bytes.Repeat([]byte{9}, ed25519.SeedSize)).Public().(ed25519.PublicKey)
	keys := t.TempDir()
	for name, data := range map[string][]byte{
		"seed.raw": seed, "priv.hex": []byte(hex.EncodeToString(priv) + "\n"), "seed.b64": []byte(base64.StdEncoding.EncodeToString(seed)),
		"pub.raw": pub, "pub.hex": []byte(hex.EncodeToString(pub)), "pub.b64": []byte(base64.StdEncoding.EncodeToString(pub) + "\n"),
		"bad.key": []byte("not a key"),
	} {
		os.WriteFile(filepath.Join(keys, name), data, 0o600)
	}
	for _, n := range []string{"seed.raw", "priv.hex", "seed.b64"} {
		k, err := ReadPrivateKey(filepath.Join(keys, n))
		if err != nil || !k.Equal(priv) {
			t.Errorf("%s: %v", n, err)
		}
	}
	for _, n := range []string{"pub.raw", "pub.hex", "pub.b64"} {
		k, err := ReadPublicKey(filepath.Join(keys, n))
		if err != nil || !k.Equal(pub) {
			t.Errorf("%s: %v", n, err)
		}
	}
	if _, err := ReadPublicKey(filepath.Join(keys, "bad.key")); err == nil {
		t.Error("bad.key read as a public key")
	}
	if _, err := ReadPrivateKey(filepath.Join(keys, "bad.key")); err == nil {
		t.Error("bad.key read as a private key")
	}

	dir := engineBundle(t, "forge.yaml", forgeColumn)
	m, err := os.ReadFile(filepath.Join(dir, ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, SignatureName), Sign(m, priv), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name string
		pub  ed25519.PublicKey
		edit func()
		ok   bool
		text string
	}{
		{name: "signed, right key", pub: pub, ok: true, text: "OK: the manifest's signature holds"},
		{name: "signed, unchecked", pub: nil, ok: true, text: "not signed"},
		{name: "another key", pub: other, text: "FAIL manifest.sig: does not hold"},
		{name: "manifest changed after signing", pub: pub, edit: func() {
			editDesign(t, dir, 0, func(d map[string]any) { d["cover_mm"] = 35.0 }) // the same value, rewritten
			rehashAs(t, dir, "forge.yaml")
		}, text: "FAIL manifest.sig: does not hold"},
	} {
		if tc.edit != nil {
			tc.edit()
		}
		r, err := VerifyKey(dir, tc.pub)
		if err != nil {
			t.Fatal(err)
		}
		var text bytes.Buffer
		r.WriteText(&text)
		if r.OK() != tc.ok || !strings.Contains(text.String(), tc.text) {
			t.Errorf("%s: OK() = %v:\n%s", tc.name, r.OK(), text.String())
		}
	}
}

// A full sheet (each step under a heading, its result on a line of its own) is checked as well:
// it passes as written, and a result changed on it fails.
func TestRecheckFullSheet(t *testing.T) {
	dir := engineBundleAt(t, "forge.yaml", forgeColumn, reports.Full)
	r, err := Verify(dir)
	if err != nil {
		t.Fatal(err)
	}
	if !r.OK() || r.Printed < 200 {
		t.Fatalf("fresh full bundle: OK() = %v, %d printed values checked: %v", r.OK(), r.Printed, keys(r))
	}
	name := filepath.Join(dir, "md", "K1-L1.md")
	b, _ := os.ReadFile(name)
	c := bytes.Replace(b, []byte("**N<sub>Ed</sub> = 2400\u00a0kN**"), []byte("**N<sub>Ed</sub> = 1400\u00a0kN**"), 1)
	if bytes.Equal(b, c) {
		t.Fatal("the full sheet does not print NEd as expected")
	}
	os.WriteFile(name, c, 0o644)
	rehashAs(t, dir, "forge.yaml")
	r, _ = Verify(dir)
	var text bytes.Buffer
	r.WriteText(&text)
	if r.OK() || !strings.Contains(text.String(), "FAIL md/K1-L1.md: step K1/L1/act/NEd: the sheet prints 1400, its step records 2400") {
		t.Errorf("report:\n%s", text.String())
	}
}
