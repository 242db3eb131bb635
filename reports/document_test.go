package reports

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
)

// A small invented building: two lifts, so that the take-down of the lower lift uses steps
// of the sheet above and the links must cross sheets.
const linkBuilding = `project: {title: Link test, job: T-1, revision: A, designer: A. Berg, checker: C. Dahl, date: 2026-01-05}
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
  base: fixed
`

func buildingResult(t testing.TB) *design.Result {
	t.Helper()
	in, err := yamlinput.Parse("links.yaml", []byte(linkBuilding))
	if err != nil {
		t.Fatal(err)
	}
	r, err := design.Run(in)
	if err != nil {
		t.Fatal(err)
	}
	design.AddInteraction(r)
	return r
}

var (
	hrefRE = regexp.MustCompile(`href="([^"]*)"`)
	idRE   = regexp.MustCompile(`id="([^"]*)"`)
)

// ids returns the set of id attributes in an HTML text.
func ids(html []byte) map[string]bool {
	out := map[string]bool{}
	for _, m := range idRE.FindAllSubmatch(html, -1) {
		out[string(m[1])] = true
	}
	return out
}

// Every link of the calc document and of the HTML sheets lands on an anchor that exists: in the
// same page, or in the named page of the same set (common practice, no source).
func TestLinksResolve(t *testing.T) {
	r := buildingResult(t)
	for _, o := range []Options{{}, {Detail: Full}} {
		linksResolve(t, r, o)
	}
}

func linksResolve(t *testing.T, r *design.Result, o Options) {
	doc, err := DocumentHTML(r, o)
	if err != nil {
		t.Fatal(err)
	}
	pages := map[string][]byte{doc.Name: doc.Data}
	sheets, err := HTML(r, o)
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range sheets {
		pages[s.Name] = s.Data
	}
	cross := 0
	for name, page := range pages {
		have := ids(page)
		links := hrefRE.FindAllSubmatch(page, -1)
		if name == doc.Name && len(links) < 40 {
			t.Errorf("%s: only %d links", name, len(links))
		}
		for _, m := range links {
			href := string(m[1])
			file, frag, _ := strings.Cut(href, "#")
			file = strings.TrimPrefix(file, "../html/") // the calc document's links to the sheets
			target := have
			if file != "" {
				p, ok := pages[file]
				if !ok {
					t.Errorf("%s: link %q to a page not in the set", name, href)
					continue
				}
				target = ids(p)
				if frag != "" {
					cross++
				}
			}
			if frag != "" && !target[frag] {
				t.Errorf("%s: link %q has no target", name, href)
			}
		}
	}
	if cross == 0 && o.full() {
		t.Error("no step links across sheets: the lower lifts should use steps of the lifts above")
	}
	// The document links every lift of a group to its own sheet.
	for _, d := range r.Designs {
		if !bytes.Contains(doc.Data, []byte(`href="../html/`+d.Column+"-"+d.Storey+`.html"`)) && !bytes.Contains(doc.Data, []byte(`href="#`+anchorName("d-", d.Column+"-"+d.Storey)+`"`)) {
			t.Errorf("the calc document does not link %s/%s", d.Column, d.Storey)
		}
	}
}

// The calc document holds the parts the submission needs, in every format.
func TestDocumentParts(t *testing.T) {
	r := buildingResult(t)
	mdDoc, err := DocumentMarkdown(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	texDoc, err := DocumentLaTeX(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"# Calculation package: Link test", "| Revision | A |", "Input SHA-256", r.Input.SHA256,
		"## Contents", "## Basis of design", "## The input as read", "  12  ", "## Column groups", "## Group 1: ", "governing lift: Column ",
		"## Column schedule", "## Failures and warnings", "competent engineer", "#### Section and interaction diagrams"} {
		if !strings.Contains(string(mdDoc.Data), want) {
			t.Errorf("calc.md lacks %q", want)
		}
	}
	groups := len(columnGroups(r))
	if groups < 1 || groups >= len(r.Designs) {
		t.Errorf("%d groups of %d lifts: the test building should group some lifts", groups, len(r.Designs))
	}
	// Per group: the section sketch beside its table and the three interaction diagrams.
	if n, want := strings.Count(string(mdDoc.Data), "<svg "), 4*groups; n != want {
		t.Errorf("calc.md: %d SVG pictures, want %d", n, want)
	}
	for _, want := range []string{`\tableofcontents`, `\section{Column groups}`, `\subsection{Group 1: `, `\hypertarget{s-`, `\hyperlink{s-`, `\section{Failures and warnings}`} {
		if !strings.Contains(string(texDoc.Data), want) {
			t.Errorf("calc.tex lacks %q", want)
		}
	}
	if n, want := strings.Count(string(texDoc.Data), `\begin{tikzpicture}`), 4*groups; n != want {
		t.Errorf("calc.tex: %d pictures, want %d", n, want)
	}
}

// The calc document compiles with pdflatex and leaves no link or reference undefined.
func TestDocumentCompiles(t *testing.T) {
	bin, err := exec.LookPath("pdflatex")
	if err != nil {
		t.Skip("pdflatex not installed; .ci/run installs TeX Live")
	}
	if testing.Short() {
		t.Skip("short")
	}
	// The document with revision marks (one value changed, one step new): the margin bars and
	// the revision table compile too.
	r := buildingResult(t)
	doc, err := DocumentLaTeX(r, Options{Detail: Full, Revision: revisionOf(r)})
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(doc.Data, []byte(`\csrev{`)) || !bytes.Contains(doc.Data, []byte(`\csrevbar`)) {
		t.Error("calc.tex marks no changed value")
	}
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "calc.tex"), doc.Data, 0o644); err != nil {
		t.Fatal(err)
	}
	for run := 0; run < 2; run++ {
		cmd := exec.Command(bin, "-interaction=nonstopmode", "-halt-on-error", "calc.tex")
		cmd.Dir = dir
		if out, err := cmd.CombinedOutput(); err != nil {
			t.Fatalf("pdflatex: %v\n%s", err, tailText(out, 30))
		}
	}
	log, _ := os.ReadFile(filepath.Join(dir, "calc.log"))
	for _, bad := range []string{"undefined", "Undefined"} {
		if bytes.Contains(log, []byte(bad)) {
			t.Errorf("calc.log reports something %s:\n%s", bad, grepLines(log, bad))
		}
	}
}

// The HTML calc document renders in headless Chromium without a script or console error.
func TestHTMLInChromium(t *testing.T) {
	var bin string
	for _, b := range []string{"chromium", "chromium-browser", "google-chrome"} {
		if p, err := exec.LookPath(b); err == nil {
			bin = p
			break
		}
	}
	if bin == "" {
		t.Skip("chromium not installed; .ci/run installs it")
	}
	r := buildingResult(t)
	doc, err := DocumentHTML(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	page := filepath.Join(dir, "calc.html")
	if err := os.WriteFile(page, doc.Data, 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(bin, "--headless", "--no-sandbox", "--disable-gpu", "--user-data-dir="+filepath.Join(dir, "profile"),
		"--enable-logging=stderr", "--v=0", "--dump-dom", "file://"+page)
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	if err := cmd.Run(); err != nil {
		t.Fatalf("chromium: %v\n%s", err, tailText(stderr.Bytes(), 20))
	}
	dom := stdout.String()
	if !strings.Contains(dom, "Calculation package") || !strings.Contains(dom, "Group 1: ") {
		t.Errorf("the rendered page lacks its headings (%d bytes of DOM)", len(dom))
	}
	if n, want := strings.Count(dom, "<svg "), 4*len(columnGroups(r)); n != want {
		t.Errorf("rendered DOM holds %d SVG pictures, want %d", n, want)
	}
	for _, line := range strings.Split(stderr.String(), "\n") {
		if strings.Contains(line, "CONSOLE") || strings.Contains(line, "Uncaught") {
			t.Errorf("chromium: %s", line)
		}
	}
}

func tailText(b []byte, n int) string {
	lines := strings.Split(strings.TrimRight(string(b), "\n"), "\n")
	if len(lines) > n {
		lines = lines[len(lines)-n:]
	}
	return strings.Join(lines, "\n")
}

func grepLines(b []byte, s string) string {
	var out []string
	for _, l := range strings.Split(string(b), "\n") {
		if strings.Contains(l, s) {
			out = append(out, l)
		}
	}
	return strings.Join(out, "\n")
}

// The calc document of a small building (eight lifts), Markdown and LaTeX.
func BenchmarkDocument(b *testing.B) {
	r := buildingResult(b)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := DocumentMarkdown(r, Options{}); err != nil {
			b.Fatal(err)
		}
		if _, err := DocumentLaTeX(r, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// revisionOf returns a previous revision of r in which the NEd of the first design's take-down
// was 10 % smaller and its last step did not exist.
func revisionOf(r *design.Result) *Revision {
	old := map[string]float64{}
	for _, s := range r.Basis {
		old[s.ID] = s.Value
	}
	for _, d := range r.Designs {
		for _, s := range d.Trace() {
			old[s.ID] = s.Value
		}
	}
	tr := r.Designs[0].Trace()
	delete(old, tr[len(tr)-1].ID)
	id := r.Designs[0].Column + "/" + r.Designs[0].Storey + "/td/NEd"
	old[id] *= 0.9
	return &Revision{Against: "rev-A", Old: old, Rows: []RevisionRow{{Column: r.Designs[0].Column, Lift: r.Designs[0].Storey, Item: "result N_Ed", Old: "1.0 kN", New: "1.1 kN"}}}
}

// Revision marks (common practice, no source: a revised calculation shows its checker what
// changed): changed values are marked, unchanged ones are not, and the document opens with the
// revision table.
func TestRevisionMarks(t *testing.T) {
	r := buildingResult(t)
	rv := revisionOf(r)
	doc, err := DocumentMarkdown(r, Options{Revision: rv})
	if err != nil {
		t.Fatal(err)
	}
	md := string(doc.Data)
	rev, contents := strings.Index(md, "## Revision"), strings.Index(md, "## Contents")
	if rev < 0 || contents < rev || !strings.Contains(md[rev:contents], "rev-A") || !strings.Contains(md[rev:contents], "N<sub>Ed</sub>") {
		t.Errorf("the document does not open with the revision table")
	}
	id := anchorName("s-", r.Designs[0].Column+"/"+r.Designs[0].Storey+"/td/NEd")
	at := strings.Index(md, `<a id="`+id+`"></a>`)
	if at < 0 || !strings.HasPrefix(md[at+len(`<a id="`+id+`"></a>`):], "<mark>") {
		t.Errorf("the changed NEd of %s is not marked", id)
	}
	if n := strings.Count(md, "<mark>"); n < 1 || n > 20 {
		t.Errorf("%d marks: only the changed values should be marked", n)
	}
	plainDoc, err := DocumentMarkdown(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if bytes.Contains(plainDoc.Data, []byte("<mark>")) || bytes.Contains(plainDoc.Data, []byte("## Revision")) {
		t.Error("marks without a previous revision")
	}
}
