package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
	"time"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/calc/model"
	"colsheet/reports"
	"colsheet/reports/archive"
)

// A refused output folder stops the run before the design: the note on the missing date, made
// just before designing, is never printed (common practice, no source: refuse before the work).
func TestRefusedBeforeDesign(t *testing.T) {
	dir := t.TempDir()
	src, _ := os.ReadFile("../../testdata/columns.yaml")
	in := filepath.Join(dir, "undated.yaml")
	var lines []string
	for _, l := range strings.Split(string(src), "\n") {
		if !strings.HasPrefix(strings.TrimSpace(l), "date:") {
			lines = append(lines, l)
		}
	}
	os.WriteFile(in, []byte(strings.Join(lines, "\n")), 0o644)
	out := filepath.Join(dir, "out")
	if code, _, stderr := runCLI("design", in, "-o", out); code != 0 || !strings.Contains(stderr, "no date given") {
		t.Fatalf("first run: exit %d %s", code, stderr)
	}
	code, _, stderr := runCLI("design", in, "-o", out)
	if code != 2 || !strings.Contains(stderr, "--replace") || strings.Contains(stderr, "no date given") {
		t.Errorf("refused run: exit %d, stderr %q (want the refusal only)", code, stderr)
	}
	// Another tool's file among the output's entries: refused up front too, nothing staged.
	other := filepath.Join(dir, "other")
	os.MkdirAll(filepath.Join(other, "md"), 0o755)
	code, _, stderr = runCLI("design", in, "-o", other)
	if code != 2 || !strings.Contains(stderr, "already holds md") || strings.Contains(stderr, "no date given") {
		t.Errorf("foreign entry: exit %d, stderr %q", code, stderr)
	}
	if names, _ := dirNames(other); len(names) != 1 {
		t.Errorf("foreign entry: the folder holds %v", names)
	}
}

// The stage takes each file's size and SHA-256 as it writes it, refuses a name twice or one
// outside the output, and the two runs of an input give the same bytes with the sheets printed
// concurrently (common practice, no source).
func TestStage(t *testing.T) {
	st, err := newStage(t.TempDir(), "out")
	if err != nil {
		t.Fatal(err)
	}
	defer st.discard()
	data := []byte("a,b\n1,2\n")
	if err := st.put("sub/x.csv", data); err != nil {
		t.Fatal(err)
	}
	back, _ := st.read("sub/x.csv")
	if f := st.files["sub/x.csv"]; f.size != int64(len(data)) || f.sum != archive.Sum(data) || string(back) != string(data) {
		t.Errorf("staged %+v, want size %d and %s", f, len(data), archive.Sum(data))
	}
	for _, bad := range []string{"sub/x.csv", "../x", "/x", "a/../b"} {
		if err := st.put(bad, data); err == nil {
			t.Errorf("%s: written", bad)
		}
	}
	base := t.TempDir()
	for _, o := range []string{"a", "b"} {
		if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", filepath.Join(base, o)); code != 0 {
			t.Fatalf("exit %d %s", code, stderr)
		}
	}
	sameTree(t, "rerun", snapshot(t, filepath.Join(base, "a")), snapshot(t, filepath.Join(base, "b")))
}

// The progress line is off when stderr is not a terminal (a buffer, a regular file) and with -q;
// when on, it shows nothing in the first second, then what the run does with the files written
// of their total, and clears its line at the end (common practice, no source).
func TestProgress(t *testing.T) {
	f, err := os.Create(filepath.Join(t.TempDir(), "stderr"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var buf strings.Builder
	if newProgress(f, false) != nil || newProgress(&buf, false) != nil || newProgress(os.Stderr, true) != nil {
		t.Error("a progress line on a file, a buffer or with -q")
	}
	var nilLine *progress // every method of the line not shown does nothing
	nilLine.phase("x", 1)
	nilLine.step()
	nilLine.end()
	start := time.Now()
	startProgress(&buf, start).end() // stopped before the first tick: nothing drawn
	p := progressLine(&buf, start)
	p.phase("writing files", 441)
	p.step()
	p.step()
	p.draw(start.Add(progressDelay / 2))
	if buf.Len() != 0 {
		t.Errorf("shown before the delay: %q", buf.String())
	}
	p.draw(start.Add(3 * time.Second))
	if got := buf.String(); !strings.Contains(got, "\rcolsheet: writing files 2 of 441 (3 s)") {
		t.Errorf("line %q", got)
	}
	p.end()
	if !strings.HasSuffix(buf.String(), "\r\x1b[K") {
		t.Errorf("line not cleared: %q", buf.String())
	}
	if code, _, stderr := runCLI("design", "../../testdata/columns.yaml", "-o", filepath.Join(t.TempDir(), "o"), "-q"); code != 0 {
		t.Errorf("-q: exit %d %s", code, stderr)
	}
}

// The design command's results.json, each design's text made on the worker that designed it and
// written in order, is byte-equal to the whole result encoded at once, on one worker and on
// several (common practice, no source: the order of the work must not show in the output).
func TestResultsTextInOrder(t *testing.T) {
	dir := t.TempDir()
	gen := filepath.Join(dir, "generated.yaml")
	if err := os.WriteFile(gen, []byte(generatedActions(300)), 0o644); err != nil {
		t.Fatal(err)
	}
	files := []string{"../../testdata/columns.yaml", gen}
	if !testing.Short() {
		files = append(files, "../../testdata/demo.yaml")
	}
	for _, file := range files {
		r, err := design.Run(parseFile(t, file))
		if err != nil {
			t.Fatal(err)
		}
		design.AddInteraction(r)
		r.ToolVersion = version()
		want, err := reports.JSON(r)
		if err != nil {
			t.Fatal(err)
		}
		for _, procs := range []int{1, 2, 5} {
			func() {
				defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(procs))
				out := filepath.Join(dir, fmt.Sprintf("out-%s-%d", filepath.Base(file), procs))
				if code, _, stderr := runCLI("design", file, "-o", out, "-q", "--formats", ""); code > 1 {
					t.Fatalf("%s: exit %d %s", file, code, stderr)
				}
				got, err := os.ReadFile(filepath.Join(out, "results.json"))
				if err != nil {
					t.Fatal(err)
				}
				if !bytes.Equal(got, want) {
					t.Errorf("%s on %d workers: results.json differs from the whole result encoded at once", file, procs)
				}
			}()
		}
	}
}

// parseFile reads and parses the input file.
func parseFile(t testing.TB, file string) *model.Input {
	t.Helper()
	data, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	in, err := input.Parse(file, data)
	if err != nil {
		t.Fatal(err)
	}
	return in
}
