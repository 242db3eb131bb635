package main

import (
	"encoding/json"
	"flag"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/input"
	"colsheet/calc/model"
)

// Help, help COMMAND, COMMAND -h and COMMAND --help print the usage to stdout and exit 0; every
// usage lists every flag of its command, the defaults as Go's flag package gives them.
func TestHelp(t *testing.T) {
	code, out, errs := runCLI("help")
	if code != 0 || errs != "" {
		t.Fatalf("help: exit %d, stderr %q", code, errs)
	}
	for _, c := range commands {
		if !strings.Contains(out, "\n  "+c.name+" ") {
			t.Errorf("help does not list %s", c.name)
		}
	}
	for _, w := range []string{"exit status:", "  0  every design passes", "  1  some design fails", "  2  bad input or usage", "  3  an outside program failed", "  4  internal error"} {
		if !strings.Contains(out, w) {
			t.Errorf("help lacks %q", w)
		}
	}
	if code, alt, _ := runCLI("--help"); code != 0 || alt != out {
		t.Errorf("--help: exit %d, or not the text of help", code)
	}
	for _, c := range commands {
		forms := [][]string{{"help", c.name}, {c.name, "-h"}, {c.name, "--help"}}
		var first string
		for _, args := range forms {
			code, out, errs := runCLI(args...)
			if code != 0 || errs != "" || !strings.HasPrefix(out, "usage: colsheet "+c.name) {
				t.Errorf("%v: exit %d, stderr %q, stdout starts %.40q", args, code, errs, out)
				continue
			}
			if first == "" {
				first = out
			} else if out != first {
				t.Errorf("%v: a usage other than that of help %s", args, c.name)
			}
		}
		if c.flags == nil {
			continue
		}
		c.flags().VisitAll(func(f *flag.Flag) {
			if !strings.Contains(first, "--"+f.Name) {
				t.Errorf("%s -h does not list --%s", c.name, f.Name)
			}
		})
	}
	_, out, _ = runCLI("design", "-h")
	for _, w := range []string{"-o, --out DIR", "-q, --quiet", `(default "md,tex,html")`, `(default "brief")`, "Exit status: 0 every design passes"} {
		if !strings.Contains(out, w) {
			t.Errorf("design -h lacks %q", w)
		}
	}
	// For column, --h is the section's depth; -h is help.
	if _, out, _ := runCLI("column", "-h"); !strings.Contains(out, "--h LENGTH") || !strings.Contains(out, `(default "0,0")`) {
		t.Error("column -h does not list --h with its value name, or --My with its default")
	}
}

// A usage error prints one line on stderr, naming the fault and pointing to the command's usage,
// and exits 2, writing nothing.
func TestUsageErrorsOneLine(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "out")
	col := []string{"column", "--b", "350mm", "--h", "500mm", "--cover", "40mm", "--fck", "32", "--NEd", "2150kN", "--l0", "3.1m"}
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"design"}, "colsheet design: no input file given"},
		{[]string{"design", demoInput}, "no output folder given (-o DIR)"},
		{[]string{"design", demoInput, "-o"}, "-o needs a value (DIR)"},
		{[]string{"design", demoInput, "-o", out, "--frob"}, "unknown flag --frob"},
		{[]string{"design", "-o", out, demoInput, "a.yaml"}, "one input file only"},
		{[]string{"design", demoInput, "-o", out, "--formats", "pdf"}, "--formats: pdf is not a sheet format: give --pdf"},
		{[]string{"design", demoInput, "-o", out, "--formats", "pdfx"}, `--formats: unknown format "pdfx"`},
		{[]string{"design", demoInput, "-o", out, "--date", "yesterday"}, `--date: "yesterday" is not a date`},
		{[]string{"design", demoInput, "-o", out, "--detail", "some"}, "neither brief nor full"},
		{[]string{"design", demoInput, "-o", out, "--replace=maybe"}, "neither true nor false"},
		{[]string{"design", demoInput, "-o", out, "--only", "C4,Z9/L1"}, "--only: no column or lift Z9/L1 in the input"},
		{[]string{"archive", demoInput, "-o", out, "--formats", "md"}, "--formats is not taken"},
		{[]string{"archive", demoInput, "-o", out, "--only", "C4"}, "--only is not taken"},
		{[]string{"check"}, "colsheet check: no input file given"},
		{[]string{"check", demoInput, "--only", ""}, "--only"},
		{[]string{"recheck"}, "give one package folder"},
		{[]string{"recheck", dir, "--key"}, "--key needs a value (PUBFILE)"},
		{[]string{"compare", dir}, "give two package folders"},
		{[]string{"column", "--b", "350mm"}, "--h is required"},
		{[]string{"column", "x.yaml"}, "takes no input file"},
		{append(col, "--My", "85"), `--My: "85" is not TOP,BOTTOM`},
		{append(col, "--bars", "8 bars"), `--bars: "8 bars" is not COUNTxDIA`},
		{append(col[:len(col)-2:len(col)-2], "--l0y", "3m"), "give both --l0y and --l0z"},
		{append(col, "--concrete", "C32/40"), "give --fck or --concrete, not both"},
		{append(col[:8:8], "33", "--NEd", "2150kN", "--l0", "3.1m"), "--fck: 33 MPa is the fck of no strength class"},
		{[]string{"watch", demoInput, "-o", out, "--addr", "0.0.0.0:8080"}, "is not a loopback address"},
		{[]string{"watch", demoInput, "-o", out, "--addr", ":8080"}, "is not a loopback address"},
		{[]string{"watch", demoInput, "-o", out, "--addr", "192.168.1.2:80"}, "is not a loopback address"},
		{[]string{"watch", demoInput}, "no output folder given"},
		{[]string{"help", "frob"}, `colsheet help: unknown command "frob"`},
		{[]string{"version", "x"}, "takes no arguments"},
	} {
		code, stdout, stderr := runCLI(c.args...)
		cmd := c.args[0]
		if code != 2 || stdout != "" || strings.Count(stderr, "\n") != 1 || !strings.Contains(stderr, c.want) ||
			!strings.HasSuffix(stderr, "; run 'colsheet "+cmd+" -h' for usage\n") {
			t.Errorf("%q: exit %d, stdout %q, stderr %q; want one line with %q", c.args, code, stdout, stderr, c.want)
		}
	}
	for _, args := range [][]string{{}, {"frob"}} {
		code, _, stderr := runCLI(args...)
		if code != 2 || strings.Count(stderr, "\n") != 1 || !strings.Contains(stderr, "run 'colsheet help'") {
			t.Errorf("%q: exit %d, stderr %q", args, code, stderr)
		}
	}
	if es, _ := os.ReadDir(dir); len(es) != 0 {
		t.Errorf("usage errors wrote files: %v", es)
	}
}

// version and --version print the build's version.
func TestVersionCommand(t *testing.T) {
	for _, args := range [][]string{{"version"}, {"--version"}} {
		code, out, errs := runCLI(args...)
		if code != 0 || errs != "" || out != "colsheet "+version()+"\n" {
			t.Errorf("%v: exit %d, %q, %q", args, code, out, errs)
		}
	}
}

// Messages on files name the file and what it is, not the system call.
func TestFileMessages(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"design", filepath.Join(dir, "none.yaml"), "-o", filepath.Join(dir, "o")}, "the input file " + filepath.Join(dir, "none.yaml") + " does not exist"},
		{[]string{"check", dir}, "the input file " + dir + " is a folder, not a file"},
		{[]string{"recheck", filepath.Join(dir, "none")}, "the package " + filepath.Join(dir, "none") + " does not exist"},
		{[]string{"compare", dir, dir}, dir + " holds no results.json"},
		{[]string{"archive", demoInput, "-o", filepath.Join(dir, "b"), "--sign", filepath.Join(dir, "key")}, "--sign: the key file " + filepath.Join(dir, "key") + " does not exist"},
	} {
		code, _, stderr := runCLI(c.args...)
		if code != 2 || !strings.Contains(stderr, c.want) || strings.Contains(stderr, "no such file") || strings.Contains(stderr, "open ") {
			t.Errorf("%q: exit %d, stderr %q; want %q", c.args, code, stderr, c.want)
		}
	}
}

// Recheck of an output of design (no manifest) says that it wants an archive, and exits 2.
func TestRecheckPlainFolder(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "out")
	if code, _, stderr := runCLI("design", demoInput, "-o", dir, "--formats", ""); code != 0 {
		t.Fatalf("design: exit %d %s", code, stderr)
	}
	code, stdout, stderr := runCLI("recheck", dir)
	if code != 2 || stdout != "" || !strings.Contains(stderr, "an output of 'colsheet design' without manifest.json: recheck wants a package written by 'colsheet archive") ||
		strings.Contains(stderr, "no such file") {
		t.Errorf("exit %d, stderr %q", code, stderr)
	}
}

// tableRows returns the rows of the table of check, each cell trimmed, the header first.
func tableRows(t *testing.T, out string) [][]string {
	t.Helper()
	var rows [][]string
	for _, line := range strings.Split(out, "\n") {
		if line == "" || strings.HasPrefix(line, "colsheet:") {
			continue
		}
		rows = append(rows, regexp.MustCompile(`\s{2,}`).Split(strings.TrimSpace(line), -1))
	}
	if len(rows) == 0 || strings.Join(rows[0], "|") != strings.Join(tableHead, "|") {
		t.Fatalf("no table header in:\n%s", out)
	}
	return rows
}

// resultsOf reads the designs of results.json in dir: per "COLUMN/LIFT" its NEd_kN, the MEd_kNm
// about y and z and the utilization.
func resultsOf(t *testing.T, dir string) map[string][4]float64 {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(dir, "results.json"))
	if err != nil {
		t.Fatal(err)
	}
	var res struct {
		Designs []struct {
			Column, Storey string
			NEd            float64 `json:"NEd_kN"`
			Axes           map[string]struct {
				MEd float64 `json:"MEd_kNm"`
			}
			Utilization float64
		}
	}
	if err := json.Unmarshal(data, &res); err != nil {
		t.Fatal(err)
	}
	out := map[string][4]float64{}
	for _, d := range res.Designs {
		out[d.Column+"/"+d.Storey] = [4]float64{d.NEd, d.Axes["y"].MEd, d.Axes["z"].MEd, d.Utilization}
	}
	return out
}

// sameAs4 reports whether the printed text s is v to four significant figures (common practice,
// no source: the sheets' precision).
func sameAs4(s string, v float64) bool {
	p, err := strconv.ParseFloat(s, 64)
	return err == nil && math.Abs(p-v) <= 5e-4*math.Abs(v)+1e-12
}

// Check prints a row per lift with the values results.json of design holds, writes no file, and
// exits as design does; --only keeps the columns and lifts named.
func TestCheck(t *testing.T) {
	dir := t.TempDir()
	src, _ := os.ReadFile(demoInput)
	in := filepath.Join(dir, "cols.yaml")
	os.WriteFile(in, src, 0o644)
	code, out, errs := runCLI("check", in)
	if code != 0 || strings.Contains(errs, "no date") {
		t.Fatalf("exit %d\n%s", code, errs)
	}
	if es, _ := os.ReadDir(dir); len(es) != 1 {
		t.Errorf("check wrote files: %v", es)
	}
	rows := tableRows(t, out)
	if len(rows) != 5 || !strings.Contains(out, "colsheet: 4 designs, 4 pass, 0 fail; nothing written") {
		t.Fatalf("%d rows, want a header and 4:\n%s", len(rows), out)
	}
	pkg := filepath.Join(dir, "out")
	if code, _, errs := runCLI("design", in, "-o", pkg, "--formats", ""); code != 0 {
		t.Fatalf("design: exit %d %s", code, errs)
	}
	want := resultsOf(t, pkg)
	for _, r := range rows[1:] {
		v, ok := want[r[0]+"/"+r[1]]
		if !ok || len(r) != len(tableHead) {
			t.Errorf("row %q: no such design or not %d cells", r, len(tableHead))
			continue
		}
		for k, cell := range []string{r[4], r[5], r[6], r[7]} {
			if !sameAs4(cell, v[k]) {
				t.Errorf("%s/%s: %s = %s, results.json %g", r[0], r[1], tableHead[4+k], cell, v[k])
			}
		}
		if r[8] != "PASS" {
			t.Errorf("%s/%s: verdict %s", r[0], r[1], r[8])
		}
	}
	for _, c := range []struct {
		only string
		want []string
	}{{"C4", []string{"C4/GF", "C4/L1"}}, {"D1/GF", []string{"D1/GF"}}, {"E2/L3,C4/L1", []string{"C4/L1", "E2/L3"}}} {
		code, out, errs := runCLI("check", "--only", c.only, in)
		if code != 0 {
			t.Errorf("--only %s: exit %d %s", c.only, code, errs)
			continue
		}
		var got []string
		for _, r := range tableRows(t, out)[1:] {
			got = append(got, r[0]+"/"+r[1])
		}
		if strings.Join(got, " ") != strings.Join(c.want, " ") {
			t.Errorf("--only %s: rows %v, want %v", c.only, got, c.want)
		}
	}
	// A failing design: exit 1, the row says FAIL and stderr the reasons.
	code, out, errs = runCLI("check", writeFile(t, "f.yaml", failing))
	if code != 1 || !strings.Contains(out, "FAIL") || !strings.Contains(errs, "FAIL F1/L1") {
		t.Errorf("failing design: exit %d\n%s%s", code, out, errs)
	}
	// Bad input: its faults, exit 2.
	code, _, errs = runCLI("check", writeFile(t, "b.yaml", strings.Replace(failing, "b: 250", "b: 3.6 kN", 1)))
	if code != 2 || !strings.Contains(errs, "b.yaml:4: columns[0].b:") {
		t.Errorf("bad input: exit %d %s", code, errs)
	}
}

// The input reader's warnings are printed as "colsheet: warning: ...".
func TestWarningsPrinted(t *testing.T) {
	dir := t.TempDir()
	yml, _ := os.ReadFile("../../testdata/cases.yaml")
	csv, _ := os.ReadFile("../../testdata/cases.csv")
	// A column the table does not use: "note" after the last.
	lines := strings.Split(strings.TrimRight(string(csv), "\n"), "\n")
	lines[0] += ",note"
	for i := 1; i < len(lines); i++ {
		lines[i] += ",x"
	}
	os.WriteFile(filepath.Join(dir, "cases.yaml"), yml, 0o644)
	os.WriteFile(filepath.Join(dir, "cases.csv"), []byte(strings.Join(lines, "\n")+"\n"), 0o644)
	code, _, errs := runCLI("check", filepath.Join(dir, "cases.yaml"), "--only", "P1/GF")
	if code > 1 || !strings.Contains(errs, "colsheet: warning: ") || !strings.Contains(errs, "note is not used") {
		t.Errorf("exit %d, stderr %q", code, errs)
	}
}

// smallBuilding is a building of four columns and two lifts (invented, no source).
const smallBuilding = `project: {title: Only, job: T-2, revision: A, designer: A. Berg, checker: C. Dahl, date: 2026-01-05}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
building:
  storeys:
    - {name: L1, height: 3.5 m}
    - {name: R, height: 3.2 m}
  grid: {x: [6 m], y: [5 m]}
  columns: {b: 300 mm, h: 300 mm, cover: 35 mm}
  beams: {b: 300 mm, h: 500 mm}
  floors:
    - {levels: [L1], gk: 5 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}
    - {levels: [R], gk: 4 kN/m2, qk: 0.6 kN/m2, category: H, spans: y}
`

// design --only writes the package of the columns and lifts named, with the values of the whole
// building's run (the take-down covers every column); unknown ids write nothing.
func TestDesignOnly(t *testing.T) {
	dir := t.TempDir()
	in := writeFile(t, "b.yaml", smallBuilding)
	all, some := filepath.Join(dir, "all"), filepath.Join(dir, "some")
	if code, _, errs := runCLI("design", in, "-o", all, "--formats", ""); code != 0 {
		t.Fatalf("whole building: exit %d %s", code, errs)
	}
	code, out, errs := runCLI("design", "--only", "A1,B2/R", in, "-o", some, "--formats", "md")
	if code != 0 || !strings.Contains(out, "3 designs") {
		t.Fatalf("--only: exit %d %s%s", code, out, errs)
	}
	whole, part := resultsOf(t, all), resultsOf(t, some)
	if len(part) != 3 {
		t.Errorf("results.json holds %v, want A1/L1, A1/R, B2/R", part)
	}
	for _, k := range []string{"A1/L1", "A1/R", "B2/R"} {
		if p, ok := part[k]; !ok || p != whole[k] {
			t.Errorf("%s: %v with --only, %v in the whole run", k, p, whole[k])
		}
	}
	sheets, _ := os.ReadDir(filepath.Join(some, "md"))
	var names []string
	for _, e := range sheets {
		names = append(names, e.Name())
	}
	if strings.Join(names, " ") != "A1-L1.md A1-R.md B2-R.md index.md" {
		t.Errorf("sheets %v", names)
	}
	csv, _ := os.ReadFile(filepath.Join(some, "summary.csv"))
	if n := strings.Count(string(csv), "\n"); n != 4 || strings.Contains(string(csv), "\nB1,") {
		t.Errorf("summary.csv has %d lines:\n%s", n, csv)
	}
	none := filepath.Join(dir, "none")
	code, _, errs = runCLI("design", in, "-o", none, "--only", "A1,Z9")
	if code != 2 || !strings.Contains(errs, "--only: no column or lift Z9 in the input (its columns: A1, A2, B1, B2;") {
		t.Errorf("unknown id: exit %d %s", code, errs)
	}
	if _, err := os.Stat(none); !os.IsNotExist(err) {
		t.Error("unknown id: output written")
	}
}

// column builds the input of one column from its flags: its table is that of check on the same
// input written as a file, and with -o it writes the package with the trace.
func TestColumn(t *testing.T) {
	args := []string{"column", "--b", "350mm", "--h", "0.5m", "--cover", "40mm", "--fck", "32", "--NEd", "2150kN",
		"--My", "85,-40", "--Mz", "10,10", "--l0", "3.1m", "--bars", "8x20", "--date", "2026-12-01"}
	code, out, errs := runCLI(args...)
	if code != 0 {
		t.Fatalf("exit %d %s", code, errs)
	}
	same := `project: {title: Column C1, date: 2026-12-01}
materials: {concrete: C32/40, fyk: 500 MPa}
columns:
  - id: C1
    b: 350 mm
    h: 500 mm
    cover: 40 mm
    bars: {count: 8, dia: 20 mm}
    storeys:
      - name: L1
        l0: 3.1 m
        NEd: 2150 kN
        M: {y: {top: 85 kNm, bottom: -40 kNm}, z: {top: 10 kNm, bottom: 10 kNm}}
`
	_, want, _ := runCLI("check", writeFile(t, "same.yaml", same))
	if out != want {
		t.Errorf("column prints\n%s\ncheck of the same input prints\n%s", out, want)
	}
	rows := tableRows(t, out)
	if len(rows) != 2 || rows[1][0] != "C1" || rows[1][1] != "L1" || rows[1][2] != "350 × 500" || rows[1][3] != "8 Ø20" || rows[1][4] != "2150" {
		t.Errorf("rows %q", rows)
	}
	// A plain number is in the field's unit: mm, kN, kNm.
	_, plain, _ := runCLI("column", "--b", "350", "--h", "500", "--cover", "40", "--concrete", "C32/40", "--NEd", "2150",
		"--My", "85,-40", "--Mz", "10,10", "--l0y", "3100", "--l0z", "3.1m", "--bars", "8 x 20mm", "--date", "2026-12-01")
	if plain != want {
		t.Errorf("plain numbers print\n%s\nwant\n%s", plain, want)
	}
	dir := filepath.Join(t.TempDir(), "pkg")
	code, pkgOut, errs := runCLI(append(args, "-o", dir)...)
	if code != 0 || !strings.HasPrefix(pkgOut, want[:strings.Index(want, "colsheet:")]) {
		t.Fatalf("-o: exit %d\n%s%s", code, pkgOut, errs)
	}
	md, err := os.ReadFile(filepath.Join(dir, "md", "C1-L1.md"))
	if err != nil || !strings.Contains(string(md), "N<sub>Ed</sub> | 2150\u00a0kN") {
		t.Errorf("the sheet: %v", err)
	}
	if r := resultsOf(t, dir)["C1/L1"]; r[0] != 2150 {
		t.Errorf("results.json: NEd %g kN", r[0])
	}
	// Values the input reader refuses are named by their flag, exit 2.
	code, _, errs = runCLI("column", "--b", "3.6kN", "--h", "500", "--cover", "40", "--fck", "32", "--NEd", "2150", "--l0", "9000km")
	if code != 2 || !strings.Contains(errs, "colsheet column: --b: ") || !strings.Contains(errs, "colsheet column: --l0: ") || strings.Contains(errs, "columns[0]") {
		t.Errorf("bad values: exit %d %s", code, errs)
	}
	// Date today when not given.
	if _, err := columnYAML(columnArgs{b: "350", h: "500", cover: "40", fck: "32", ned: "1", l0: "3m", my: "0,0", mz: "0,0"}, "2026-01-02"); err != nil {
		t.Error(err)
	}
}

// The selection keeps whole columns and single lifts, and names the ids that hold no lift.
func TestSelection(t *testing.T) {
	lifts := [][2]string{{"B2", "L1"}, {"B2", "L2"}, {"C3", "L1"}}
	s := selection{"B2/L2", "C3", "D4", "C3/L9"}
	if got := s.unknown(lifts); strings.Join(got, " ") != "D4 C3/L9" {
		t.Errorf("unknown %v", got)
	}
	if err := (selection{"B2"}).check(lifts); err != nil {
		t.Error(err)
	}
	if err := (selection{"X"}).check(lifts); err == nil || !strings.Contains(err.Error(), "no column or lift X in the input (its columns: B2, C3;") {
		t.Errorf("check: %v", err)
	}
}

// sig4 prints four significant figures without an exponent (common practice, no source: the
// sheets' precision).
func TestSig4(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{{2150, "2150"}, {162.54, "162.5"}, {0.77036, "0.7704"}, {0.5, "0.5"}, {12345.6, "12350"}, {-40, "-40"}, {0, "0"}, {-0.00001, "-0.00001"}} {
		if got := sig4(c.v); got != c.want {
			t.Errorf("sig4(%g) = %s, want %s", c.v, got, c.want)
		}
	}
}

// column takes a circular section by --D (and --helix) instead of --b and --h: the built input
// reads back as a circle of B = H = D; the faults name their flags. The sizes are invented test
// inputs; 0.45 m = 450 mm is common practice (SI prefixes), no source.
func TestColumnCircle(t *testing.T) {
	base := columnArgs{id: "R1", lift: "L1", cover: "40mm", fck: "32", fyk: "500MPa", ned: "2150kN", l0: "3.1m", my: "0,0", mz: "0,0"}
	cases := []struct {
		name  string
		d     string
		helix bool
		bars  string
		want  string // the section's lines of the built input
		dia   float64
	}{
		{"diameter", "450mm", false, "", "    shape: circle\n    D: 450mm\n", 450},
		{"metres and a helix", "0.45 m", true, "7x20", "    shape: circle\n    D: 0.45 m\n    helix: true\n", 450},
	}
	for _, c := range cases {
		a := base
		a.d, a.helix, a.bars = c.d, c.helix, c.bars
		text, err := columnYAML(a, "2026-12-01")
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if !strings.Contains(text, "  - id: \"R1\"\n"+c.want+"    cover: 40mm\n") {
			t.Errorf("%s: built input\n%s", c.name, text)
		}
		in, err := input.Parse(columnInputName, []byte(text))
		if err != nil {
			t.Fatalf("%s: %v\n%s", c.name, err, text)
		}
		col := in.Columns[0]
		if col.Shape != model.ShapeCircle || math.Abs(col.B-c.dia) > 1e-9 || col.B != col.H || col.Helix != c.helix {
			t.Errorf("%s: column %+v", c.name, col)
		}
	}
	// Usage errors: one line, exit 2, nothing designed.
	circle := []string{"column", "--D", "450mm", "--cover", "40mm", "--fck", "32", "--NEd", "2150kN", "--l0", "3.1m"}
	for _, c := range []struct {
		args []string
		want string
	}{
		{append(circle, "--b", "450mm"), "give --D for a circular column or --b and --h for a rectangular one, not both"},
		{[]string{"column", "--b", "350mm", "--h", "500mm", "--helix", "--cover", "40mm", "--fck", "32", "--NEd", "2150kN", "--l0", "3.1m"},
			"--helix binds the bars of a circular column: give its diameter with --D"},
		{[]string{"column", "--cover", "40mm", "--fck", "32", "--NEd", "2150kN", "--l0", "3.1m"}, "--b is required (or --D for a circular column)"},
	} {
		code, stdout, stderr := runCLI(c.args...)
		if code != 2 || stdout != "" || strings.Count(stderr, "\n") != 1 || !strings.Contains(stderr, c.want) {
			t.Errorf("%q: exit %d, stdout %q, stderr %q; want %q", c.args, code, stdout, stderr, c.want)
		}
	}
	// Faults of the input reader name the flag. The least of six bars on a circle is the
	// reader's (see calc/input).
	for _, c := range []struct {
		args []string
		want string
	}{
		{append(circle, "--bars", "4x20"), "colsheet column: --bars: a circular column takes at least 6 bars evenly on its circle, found 4"},
		{append(circle[:1:1], append([]string{"--D", "100"}, circle[3:]...)...), "colsheet column: --D: 100 mm is outside the plausible range of the section side"},
		{[]string{"column", "--D", "200", "--cover", "80", "--fck", "32", "--NEd", "2150kN", "--l0", "3.1m"},
			"colsheet column: --cover: no room for links and bars: 2·(cover + link + bar) = 2·(80 + 8 + 12) = 200 mm is not less than D = 200 mm"},
	} {
		code, _, stderr := runCLI(c.args...)
		if code != 2 || !strings.Contains(stderr, c.want) || strings.Contains(stderr, "columns[0]") {
			t.Errorf("%q: exit %d, stderr %q; want %q", c.args, code, stderr, c.want)
		}
	}
	// The usage lists the flags.
	if _, out, _ := runCLI("column", "-h"); !strings.Contains(out, "--D DIAMETER") || !strings.Contains(out, "--helix") {
		t.Errorf("column -h lacks --D or --helix:\n%s", out)
	}
}
