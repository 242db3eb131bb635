package main

import (
	"bytes"
	"crypto/ed25519"
	"encoding/hex"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/reports/archive"
)

// archive --sign writes manifest.sig; recheck --key checks it (exit 0 with the right key, 1 with
// another or after the manifest changed); a forged utilisation with the manifest rehashed
// exits 1 and names the design and the key.
func TestRecheckKeyAndForgery(t *testing.T) {
	keys := t.TempDir()
	seed := bytes.Repeat([]byte{3}, ed25519.SeedSize) // a test key, never a real one
	pub := ed25519.NewKeyFromSeed(seed).Public().(ed25519.PublicKey)
	other := ed25519.NewKeyFromSeed(bytes.Repeat([]byte{4}, ed25519.SeedSize)).Public().(ed25519.PublicKey)
	os.WriteFile(filepath.Join(keys, "seed"), seed, 0o600)
	os.WriteFile(filepath.Join(keys, "pub.hex"), []byte(hex.EncodeToString(pub)+"\n"), 0o644)
	os.WriteFile(filepath.Join(keys, "other.hex"), []byte(hex.EncodeToString(other)), 0o644)

	dir := filepath.Join(t.TempDir(), "bundle")
	if code, out, errs := runCLI("archive", demoInput, "-o", dir, "--date", "2026-12-01", "--sign", filepath.Join(keys, "seed")); code != 0 {
		t.Fatalf("archive --sign: exit %d\n%s\n%s", code, out, errs)
	}
	if code, out, _ := runCLI("recheck", dir, "--key", filepath.Join(keys, "pub.hex")); code != 0 || !strings.Contains(out, "signature holds") {
		t.Errorf("recheck --key, right key: exit %d\n%s", code, out)
	}
	if code, out, _ := runCLI("recheck", "--key="+filepath.Join(keys, "other.hex"), dir); code != 1 || !strings.Contains(out, "FAIL manifest.sig") {
		t.Errorf("recheck --key, another key: exit %d\n%s", code, out)
	}
	if code, _, errs := runCLI("recheck", dir, "--key"); code != 2 || !strings.Contains(errs, "--key needs a value (PUBFILE)") {
		t.Errorf("recheck --key without a file: exit %d\n%s", code, errs)
	}

	// The utilisation of the first design set to 0.5 in the text of results.json, the manifest
	// rehashed as someone covering the forgery would (the signature no longer holds then).
	name := filepath.Join(dir, archive.ResultsName)
	b, _ := os.ReadFile(name)
	i := bytes.Index(b, []byte(`"utilization":`))
	j := i + bytes.IndexAny(b[i:], ",}")
	b = append(append(append([]byte{}, b[:i]...), `"utilization":0.5`...), b[j:]...)
	os.WriteFile(name, b, 0o644)
	m, err := archive.ReadManifest(filepath.Join(dir, archive.ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	for k, f := range m.Files {
		if f.Path == archive.ResultsName {
			m.Files[k].Size, m.Files[k].SHA256 = int64(len(b)), archive.Sum(b)
		}
	}
	mj, _ := m.JSON()
	os.WriteFile(filepath.Join(dir, archive.ManifestName), mj, 0o644)
	code, out, _ := runCLI("recheck", dir)
	if code != 1 || !strings.Contains(out, ", utilization: results.json says 0.5, the governing check") || strings.Contains(out, "FAIL file") {
		t.Errorf("forged utilisation: exit %d\n%s", code, out)
	}
	if code, out, _ := runCLI("recheck", dir, "--key", filepath.Join(keys, "pub.hex")); code != 1 || !strings.Contains(out, "FAIL manifest.sig: does not hold") {
		t.Errorf("forged utilisation, signed manifest rehashed: exit %d\n%s", code, out)
	}
}

// Recheck says whether the package was made by the program that rechecks it (common practice,
// no source: an archived calculation names the program that produced it).
func TestProvenanceNote(t *testing.T) {
	same := provenanceNote(archive.Tool{Name: "colsheet", Version: "v1", Executable: "ab"}, "v1", "ab")
	if !strings.Contains(same, "made by this program") {
		t.Errorf("same program: %q", same)
	}
	other := provenanceNote(archive.Tool{Name: "colsheet", Version: "v1", Executable: "ab"}, "v2", "cd")
	for _, want := range []string{"different program", "version v1, rechecked with v2", "executable SHA-256 ab, rechecked with cd"} {
		if !strings.Contains(other, want) {
			t.Errorf("different program: %q lacks %q", other, want)
		}
	}
	if old := provenanceNote(archive.Tool{Name: "colsheet", Version: "v1"}, "v1", "cd"); !strings.Contains(old, "not recorded") {
		t.Errorf("an older package: %q", old)
	}
}
