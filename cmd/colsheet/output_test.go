package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"runtime/debug"
	"strings"
	"syscall"
	"testing"
	"time"

	"colsheet/reports/archive"
)

// TestMain runs the command itself when asked by TestSignalDuringWrite, with slow writes.
func TestMain(m *testing.M) {
	if args := os.Getenv("COLSHEET_TEST_CHILD"); args != "" {
		writeHook = func(string) error { time.Sleep(20 * time.Millisecond); return nil }
		os.Args = append([]string{"colsheet"}, strings.Split(args, "\x1f")...)
		main()
	}
	os.Exit(m.Run())
}

// snapshot is every file below dir, the hidden ones included, by slash path.
func snapshot(t *testing.T, dir string) map[string][]byte { return readTree(t, dir) }

// sameTree reports the first difference between two snapshots.
func sameTree(t *testing.T, what string, a, b map[string][]byte) {
	t.Helper()
	if len(a) != len(b) {
		t.Errorf("%s: %d files, were %d", what, len(b), len(a))
	}
	for name, x := range a {
		if y, ok := b[name]; !ok || !bytes.Equal(x, y) {
			t.Errorf("%s: %s changed or gone", what, name)
			return
		}
	}
}

// The input beside its output survives --replace (the data loss of issue 13), as do the user's
// other files; only colsheet's entries are replaced (common practice, no source).
func TestReplaceBesideInput(t *testing.T) {
	proj := t.TempDir()
	in, _ := os.ReadFile("../../testdata/columns.yaml")
	os.WriteFile(filepath.Join(proj, "in.yaml"), in, 0o644)
	os.WriteFile(filepath.Join(proj, "notes.txt"), []byte("mine"), 0o644)
	if code, _, stderr := runCLI("design", filepath.Join(proj, "in.yaml"), "-o", proj, "--date", "2026-12-01"); code != 0 {
		t.Fatalf("first run: exit %d %s", code, stderr)
	}
	if code, _, stderr := runCLI("design", filepath.Join(proj, "in.yaml"), "-o", proj, "--date", "2026-12-01"); code != 2 || !strings.Contains(stderr, "--replace") {
		t.Errorf("second run without --replace: exit %d %s", code, stderr)
	}
	if code, _, stderr := runCLI("design", filepath.Join(proj, "in.yaml"), "-o", proj, "--replace", "--date", "2027-01-01", "--formats", "md"); code != 0 {
		t.Fatalf("--replace: exit %d %s", code, stderr)
	}
	if b, _ := os.ReadFile(filepath.Join(proj, "in.yaml")); !bytes.Equal(b, in) {
		t.Error("the input file was changed or deleted")
	}
	if b, _ := os.ReadFile(filepath.Join(proj, "notes.txt")); string(b) != "mine" {
		t.Error("the user's other file was changed or deleted")
	}
	if again, _ := os.ReadFile(filepath.Join(proj, "doc", "calc.md")); !bytes.Contains(again, []byte("2027-01-01")) {
		t.Error("doc/calc.md was not replaced")
	}
	if mk, err := readMarker(proj); err != nil || mk == nil || mk.Date != "2027-01-01" {
		t.Errorf("marker %+v %v", mk, err)
	}
	// The entries of the earlier output that this one does not have (html, tex) are gone, and
	// nothing is left aside.
	names, _ := dirNames(proj)
	want := ".colsheet-output doc in.yaml md notes.txt quantities.csv results.json schedule.csv summary.csv"
	if got := strings.Join(names, " "); got != want {
		t.Errorf("folder holds %s, want %s", got, want)
	}
}

// A folder holding another tool's results.json and manifest.json is never wiped, with or
// without --replace (common practice, no source).
func TestForeignResultsKept(t *testing.T) {
	dir := t.TempDir()
	os.WriteFile(filepath.Join(dir, "results.json"), []byte(`{"theirs": 1}`), 0o644)
	os.WriteFile(filepath.Join(dir, "index.html"), []byte("<p>app</p>"), 0o644)
	before := snapshot(t, dir)
	for _, extra := range []string{"--date=2026-12-01", "--replace"} {
		code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", dir, extra)
		if code != 2 || !strings.Contains(stderr, "already holds results.json") {
			t.Errorf("%s: exit %d %s", extra, code, stderr)
		}
		sameTree(t, extra, before, snapshot(t, dir))
	}
	// A forged marker that names another program is refused too.
	os.WriteFile(filepath.Join(dir, markerName), []byte(`{"program": "other"}`), 0o644)
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", dir, "--replace"); code != 2 || !strings.Contains(stderr, "is not colsheet") {
		t.Errorf("foreign marker: exit %d %s", code, stderr)
	}
}

// A changed file of colsheet's own output stops --replace, which then changes nothing.
func TestReplaceRefusesChangedFile(t *testing.T) {
	out := filepath.Join(t.TempDir(), "out")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	os.WriteFile(filepath.Join(out, "summary.csv"), []byte("edited by hand"), 0o644)
	before := snapshot(t, out)
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace")
	if code != 2 || !strings.Contains(stderr, "summary.csv changed since colsheet wrote it") {
		t.Errorf("exit %d %s", code, stderr)
	}
	sameTree(t, "after a refused --replace", before, snapshot(t, out))
}

// A write error (a full disk, simulated) at any point leaves the earlier output and the user's
// files exactly as they were and no temporary entry behind, whole folder and beside other files.
func TestWriteErrorChangesNothing(t *testing.T) {
	for _, mixed := range []bool{false, true} {
		base := t.TempDir()
		out := filepath.Join(base, "out")
		os.MkdirAll(out, 0o755)
		if mixed {
			os.WriteFile(filepath.Join(out, "in.yaml"), []byte("mine"), 0o644)
		}
		if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
			t.Fatalf("exit %d %s", code, stderr)
		}
		before := snapshot(t, base)
		for _, failAt := range []string{"results.json", "md/", "tex/index.tex", markerName} {
			writeHook = func(name string) error {
				if strings.HasPrefix(name, failAt) {
					return syscall.ENOSPC
				}
				return nil
			}
			code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace", "--date", "2027-01-01")
			writeHook = nil
			if code != 2 || !strings.Contains(stderr, "no space left on device") {
				t.Errorf("mixed %v, failing at %s: exit %d %s", mixed, failAt, code, stderr)
			}
			sameTree(t, fmt.Sprintf("mixed %v, failing at %s", mixed, failAt), before, snapshot(t, base))
			if es, _ := os.ReadDir(base); len(es) != 1 {
				t.Errorf("mixed %v: temporary folders left beside the output: %d entries", mixed, len(es))
			}
		}
	}
}

// A run stopped between moving the old output aside and renaming the new one in leaves the
// old one under .NAME.old-…; the next run puts it back, the whole folder and an entry alike.
func TestAsideRestored(t *testing.T) {
	base := t.TempDir()
	out := filepath.Join(base, "out")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	before := snapshot(t, out)
	if err := os.Rename(out, filepath.Join(base, ".out.old-123")); err != nil {
		t.Fatal(err)
	}
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out)
	if code != 2 || !strings.Contains(stderr, "restored") || !strings.Contains(stderr, "--replace") {
		t.Errorf("exit %d %s", code, stderr)
	}
	sameTree(t, "restored folder", before, snapshot(t, out))
	// An entry of a folder beside other files.
	os.WriteFile(filepath.Join(out, "in.yaml"), []byte("mine"), 0o644)
	if err := os.Rename(filepath.Join(out, "md"), filepath.Join(out, ".md.old-7")); err != nil {
		t.Fatal(err)
	}
	code, _, stderr = runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace")
	if code != 0 || !strings.Contains(stderr, "restored") {
		t.Errorf("entry: exit %d %s", code, stderr)
	}
	if names, _ := dirNames(out); strings.Contains(strings.Join(names, " "), ".old-") {
		t.Errorf("aside left: %v", names)
	}
}

// A symbolic link as the output folder is refused, and its target is not touched.
func TestSymlinkOutputRefused(t *testing.T) {
	base := t.TempDir()
	real := filepath.Join(base, "real")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", real); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	before := snapshot(t, real)
	link := filepath.Join(base, "link")
	if err := os.Symlink(real, link); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", link, "--replace")
	if code != 2 || !strings.Contains(stderr, "symbolic link") {
		t.Errorf("exit %d %s", code, stderr)
	}
	sameTree(t, "link target", before, snapshot(t, real))
	if st, err := os.Lstat(link); err != nil || st.Mode()&os.ModeSymlink == 0 {
		t.Error("the link was replaced")
	}
}

// A panic exits 4 with "internal error, please report", never 2, and leaves the earlier output whole.
func TestPanicExits4(t *testing.T) {
	base := t.TempDir()
	out := filepath.Join(base, "out")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	before := snapshot(t, out)
	writeHook = func(name string) error {
		if strings.HasPrefix(name, "md/") {
			panic("simulated fault")
		}
		return nil
	}
	code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out, "--replace", "--date", "2027-01-01")
	writeHook = nil
	if code != 4 || !strings.Contains(stderr, "colsheet: internal error, please report: simulated fault") {
		t.Errorf("exit %d, want 4: %.200s", code, stderr)
	}
	sameTree(t, "after a panic", before, snapshot(t, out))
	if es, _ := os.ReadDir(base); len(es) != 1 {
		t.Errorf("temporary folders left after a panic: %d entries", len(es))
	}
}

// The signal handler removes every temporary path and lets no new one be made.
func TestInterruptedRemovesTemps(t *testing.T) {
	s := newTempSet()
	dir := t.TempDir()
	p, err := s.mkdirTemp(dir, ".out.new-")
	if err != nil {
		t.Fatal(err)
	}
	os.WriteFile(filepath.Join(p, "results.json"), []byte("{}"), 0o644)
	var msg bytes.Buffer
	if code := interrupted(s, syscall.SIGINT, &msg); code != 130 {
		t.Errorf("exit %d, want 130 (128 + SIGINT, common practice, no source)", code)
	}
	if _, err := os.Stat(p); err == nil {
		t.Error("the temporary folder is still there")
	}
	if _, err := s.mkdirTemp(dir, ".x-"); err == nil {
		t.Error("a temporary folder was made after the signal")
	}
	if !strings.Contains(msg.String(), "temporary files removed") {
		t.Errorf("message %q", msg.String())
	}
}

// SIGINT to a running command (slow writes) removes its temporary folder and leaves the earlier output whole.
func TestSignalDuringWrite(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the command in a child process")
	}
	base := t.TempDir()
	out := filepath.Join(base, "out")
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", out); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	before := snapshot(t, out)
	cmd := exec.Command(os.Args[0], "-test.run=^$")
	cmd.Env = append(os.Environ(), "COLSHEET_TEST_CHILD="+strings.Join([]string{"design", "../../testdata/columns.yaml", "-o", out, "--replace", "--date", "2027-01-01"}, "\x1f"))
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	seen := false
	for deadline := time.Now().Add(60 * time.Second); time.Now().Before(deadline) && !seen; time.Sleep(10 * time.Millisecond) {
		names, _ := dirNames(base)
		for _, n := range names {
			if strings.HasPrefix(n, ".out.new-") {
				if es, _ := os.ReadDir(filepath.Join(base, n)); len(es) > 0 {
					seen = true
				}
			}
		}
	}
	if !seen {
		cmd.Process.Kill()
		cmd.Wait()
		t.Fatalf("no temporary folder appeared: %s", stderr.String())
	}
	cmd.Process.Signal(os.Interrupt)
	cmd.Wait()
	if code := cmd.ProcessState.ExitCode(); code != 130 || !strings.Contains(stderr.String(), "temporary files removed") {
		t.Errorf("exit %d, want 130: %s", code, stderr.String())
	}
	if names, _ := dirNames(base); len(names) != 1 {
		t.Errorf("left beside the output: %v", names)
	}
	sameTree(t, "after SIGINT", before, snapshot(t, out))
}

// The version comes from the build info: module version, revision, +dirty, or devel.
func TestVersionOf(t *testing.T) {
	vcs := func(rev, modified string) []debug.BuildSetting {
		return []debug.BuildSetting{{Key: "vcs", Value: "git"}, {Key: "vcs.revision", Value: rev}, {Key: "vcs.modified", Value: modified}}
	}
	const rev = "0123456789abcdef0123456789abcdef01234567"
	for _, c := range []struct {
		mod      string
		settings []debug.BuildSetting
		want     string
	}{
		{"(devel)", nil, "devel"},
		{"", nil, "devel"},
		{"(devel)", vcs(rev, "false"), "devel-0123456789ab"},
		{"(devel)", vcs(rev, "true"), "devel-0123456789ab+dirty"},
		{"v0.0.0-20260101120000-0123456789ab", vcs(rev, "false"), "v0.0.0-20260101120000-0123456789ab"},
		{"v0.0.0-20260101120000-0123456789ab+dirty", vcs(rev, "true"), "v0.0.0-20260101120000-0123456789ab+dirty"},
		{"v1.2.0", vcs(rev, "true"), "v1.2.0-0123456789ab+dirty"},
		{"v1.2.0", nil, "v1.2.0"},
	} {
		info := &debug.BuildInfo{Main: debug.Module{Path: "colsheet", Version: c.mod}, Settings: c.settings}
		if got := versionOf(info); got != c.want {
			t.Errorf("%q %v: %q, want %q", c.mod, c.settings, got, c.want)
		}
	}
}

// The version of the build is in results.json, the marker and the manifest, and the manifest
// records the SHA-256 of the running executable.
func TestProvenance(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "pkg")
	if code, _, stderr := runCLI("archive", "../../testdata/columns.yaml", "-o", dir, "--date", "2026-12-01"); code != 0 {
		t.Fatalf("exit %d %s", code, stderr)
	}
	m, err := archive.ReadManifest(filepath.Join(dir, archive.ManifestName))
	if err != nil {
		t.Fatal(err)
	}
	exe, _ := os.Executable()
	data, _ := os.ReadFile(exe)
	if m.Tool.Executable != archive.Sum(data) || m.Tool.Version != version() {
		t.Errorf("manifest tool %+v, want version %s and the executable's SHA-256", m.Tool, version())
	}
	var res struct {
		Tool struct{ Version string } `json:"tool"`
	}
	js, _ := os.ReadFile(filepath.Join(dir, "results.json"))
	json.Unmarshal(js, &res)
	if res.Tool.Version != version() || version() == "0.1.0" {
		t.Errorf("results.json tool.version %q, build %q", res.Tool.Version, version())
	}
	mk, err := readMarker(dir)
	if err != nil || mk == nil || mk.Version != version() || mk.Command != "archive" {
		t.Fatalf("marker %+v %v", mk, err)
	}
	if strings.Join(mk.Entries, " ") != "doc html input manifest.json md quantities.csv results.json schedule.csv summary.csv tex" {
		t.Errorf("marker entries %v", mk.Entries)
	}
	if _, out, _ := runCLI("version"); strings.TrimSpace(out) != "colsheet "+version() {
		t.Errorf("version prints %q", out)
	}
}
