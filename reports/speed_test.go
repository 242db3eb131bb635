package reports

import (
	"bytes"
	"fmt"
	"html/template"
	"math"
	"math/rand"
	"path"
	"reflect"
	"regexp"
	"strconv"
	"strings"
	"sync"
	"testing"
	"unicode"

	"colsheet/calc/design"

	"github.com/yuin/goldmark"
	"github.com/yuin/goldmark/extension"
	"github.com/yuin/goldmark/parser"
	ghtml "github.com/yuin/goldmark/renderer/html"
	"github.com/yuin/goldmark/util"

	"colsheet/calc/trace"
)

// briefByPath is briefStep as path.Match reads the chain, pattern by pattern.
func briefByPath(s trace.Step) bool {
	if s.Kind == trace.KindCheck {
		return true
	}
	for _, p := range chain {
		if ok, _ := path.Match(p, s.ID); ok {
			return true
		}
	}
	return false
}

// The compiled chain picks the steps path.Match picks, for every step of the shipped inputs and
// the small building and for IDs made to sit at the edges of the patterns (common practice, no
// source: the brief sheets must print the same steps).
func TestBriefStepIsPathMatch(t *testing.T) {
	ids := []string{"", "/", "//", "M02", "/M02", "M02/", "a/M02", "a//M02", "a/b/M02", "td/NEd", "td/NEd/",
		"/td/NEd", "td//NEd", "mom//top", "mom/y/top", "mom/y/z/top", "mom/top", "x/sec/M_Rd", "sec/M_Rd",
		"x/y/sec/M_Rd", "x/sec/x", "bi/exact/check", "bi/exact", "fire/eq57/R", "fire/eq57/R/x", "*/M02",
		"creep/phi_ef", "y/phi_ef", "y/creep/phi_ef", "l0/y/l0", "y/l0", "l0", "a/b/c/d", "ünï/M01", "y/M0e"}
	for _, r := range results(t) {
		for _, d := range r.Designs {
			for _, s := range d.Steps {
				ids = append(ids, s.ID)
			}
		}
		for _, s := range r.Basis {
			ids = append(ids, s.ID, localID(s.ID))
		}
	}
	for _, id := range ids {
		for _, k := range []trace.Kind{trace.KindCheck, trace.KindFormula, trace.KindInput} {
			s := trace.Step{ID: id, Kind: k}
			if got, want := briefStep(s), briefByPath(s); got != want {
				t.Errorf("briefStep(%q, %s) = %v, path.Match gives %v", id, k, got, want)
			}
		}
	}
}

// A laid-out formula read from the shared store of parsed expressions is the same on every call
// and on every goroutine, and a caller that appends to one does not change the next (common
// practice, no source).
func TestLayoutShared(t *testing.T) {
	args := []trace.Arg{{Name: "a", Symbol: "f_ck", Value: 32, Unit: "N/mm2"}, {Name: "b", Symbol: "γ_c", Value: 1.5}}
	exprs := []string{"a / b", "a > b ? a : b", "sqrt(a) ** 2 + abs(-b)", "rounddown(a, 5)", "a ? b", "(a"}
	want := map[string][2][]piece{}
	for _, e := range exprs {
		f, _ := layout(e, args, false)
		v, _ := layout(e, args, true)
		want[e] = [2][]piece{f, v}
	}
	var wg sync.WaitGroup
	for g := 0; g < 4; g++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for range 50 {
				for _, e := range exprs {
					for k, values := range []bool{false, true} {
						got, _ := layout(e, args, values)
						if !reflect.DeepEqual(got, want[e][k]) {
							t.Errorf("layout(%q, %v) = %v, want %v", e, values, got, want[e][k])
							return
						}
						if got != nil {
							_ = append(got, piece{kind: pWord, text: "changed"})
							got[0].text = "changed"
						}
					}
				}
			}
		}()
	}
	wg.Wait()
}

// The escapes as first written, one rune at a time, for the checks below.
var refSymbolRE = regexp.MustCompile(`\pL[\pL\pN]*_[\pL\pN]+(?:,[\pL\pN]+)*`)

func refRichWith(s string, text, sym func(string) string) string {
	var b strings.Builder
	last := 0
	for _, m := range refSymbolRE.FindAllStringIndex(s, -1) {
		b.WriteString(text(s[last:m[0]]))
		b.WriteString(sym(s[m[0]:m[1]]))
		last = m[1]
	}
	b.WriteString(text(s[last:]))
	return b.String()
}

func refOneLine(s string) string {
	return strings.Map(func(r rune) rune {
		if unicode.IsControl(r) || r == '\u2028' || r == '\u2029' {
			return ' '
		}
		return r
	}, s)
}

func refAnchorName(prefix, id string) string {
	var b strings.Builder
	b.WriteString(prefix)
	for _, r := range id {
		switch {
		case r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9':
			b.WriteRune(r)
		case r == '/':
			b.WriteByte('.')
		default:
			b.WriteString("-" + strings.ToLower(strconv.FormatInt(int64(r), 16)) + "-")
		}
	}
	return b.String()
}

func refMdEscape(s string, leading bool) string {
	s = refOneLine(s)
	var b strings.Builder
	for i, r := range s {
		if r < 0x80 && strings.ContainsRune(mdSpecial, r) {
			b.WriteByte('\\')
		} else if leading && i == 0 && (r == '-' || r == '+' || r == '=') {
			b.WriteByte('\\')
		}
		b.WriteRune(r)
	}
	out := b.String()
	j := 0
	for j < len(out) && out[j] >= '0' && out[j] <= '9' {
		j++
	}
	if leading && j > 0 && j < len(out) && (out[j] == '.' || out[j] == ')') {
		out = out[:j] + "\\" + out[j:]
	}
	return out
}

// refTex escapes s one rune at a time with write (texTextRune or texMathRune).
func refTex(s string, write func(*strings.Builder, rune)) string {
	var b strings.Builder
	for _, r := range refOneLine(s) {
		write(&b, r)
	}
	return b.String()
}

// escapeCorpus returns the texts of the shipped demo's steps and random strings of the
// characters the escapes treat apart, invalid UTF-8 included.
func escapeCorpus(t testing.TB) []string {
	var out []string
	r := runFile(t, "../testdata/demo.yaml", "")
	for _, s := range append(append([]trace.Step{}, r.Basis...), r.Designs[0].Trace()...) {
		out = append(out, s.ID, s.Title, s.Clause, s.Symbol, s.Expr, s.Relation, s.Row(), s.Method(), s.Unit)
		out = append(out, s.Notes()...)
		out = append(out, s.Cautions()...)
	}
	alphabet := []string{"a", "Z", "f", "_", ",", " ", "1", "9", "²", "½", "λ", "Ø", "é", "ħ", "–", "—", "·", "×", "→", "≤",
		"\\", "`", "*", "{", "}", "[", "]", "<", ">", "&", "|", "~", "$", "#", "!", "%", "^", "\"", "'", "-", "+", "=",
		".", ")", "(", "/", "\n", "\t", "\x7f", "\u2028", "\xff", "\xe2\x82", "\u00a0", "\u2009", "€", "日", "\u0301"}
	rnd := rand.New(rand.NewSource(1))
	for range 20000 {
		var b strings.Builder
		for range rnd.Intn(12) {
			b.WriteString(alphabet[rnd.Intn(len(alphabet))])
		}
		out = append(out, b.String())
	}
	return out
}

// The escapes and the finding of symbols give, byte for byte, what the rune-by-rune escapes
// and the regular expression gave, on the demo's texts and on random strings (common practice,
// no source: the sheets must not change).
func TestEscapesAsBefore(t *testing.T) {
	brackets := func(s string) string { return "[" + s + "]" }
	for _, s := range escapeCorpus(t) {
		checks := []struct{ name, got, want string }{
			{"oneLine", oneLine(s), refOneLine(s)},
			{"anchorName", anchorName("s-", s), refAnchorName("s-", s)},
			{"mdEscape", mdEscape(s, true), refMdEscape(s, true)},
			{"mdEscape inner", mdEscape(s, false), refMdEscape(s, false)},
			{"tex text", tex{}.text(s), refTex(s, texTextRune)},
			{"tex mathText", tex{}.mathText(s), refTex(s, texMathRune)},
			{"richWith", richWith(s, strings.ToUpper, brackets), refRichWith(s, strings.ToUpper, brackets)},
			{"md rich", md{}.rich(s), refRichWith(s, md{}.text, md{}.sym)},
			{"tex rich", tex{}.rich(s), refRichWith(s, tex{}.text, tex{}.sym)},
		}
		for _, c := range checks {
			if c.got != c.want {
				t.Fatalf("%s(%q) = %q, want %q", c.name, s, c.got, c.want)
			}
		}
	}
}

// refFmtNum is fmtNum as first written, with a string for each formatting.
func refFmtNum(v float64) num {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return num{m: "?"}
	}
	trim := func(s string) string {
		if !strings.Contains(s, ".") {
			return s
		}
		return strings.TrimSuffix(strings.TrimRight(s, "0"), ".")
	}
	a := math.Abs(v)
	if a == 0 {
		return num{m: "0"}
	}
	if a >= 1e-4 && a < 1e12 {
		var s string
		if a >= 1000 {
			p := math.Pow(10, math.Floor(math.Log10(a))-(sigFigs-1))
			if p < 1 {
				p = 1
			}
			s = strconv.FormatFloat(math.Round(v/p)*p, 'f', 0, 64)
		} else {
			dec := sigFigs - 1 - int(math.Floor(math.Log10(a)))
			if dec < 0 {
				dec = 0
			}
			s = trim(strconv.FormatFloat(v, 'f', dec, 64))
		}
		if s == "-0" {
			s = "0"
		}
		return num{m: s}
	}
	s := strconv.FormatFloat(v, 'e', sigFigs-1, 64)
	i := strings.IndexByte(s, 'e')
	e, _ := strconv.Atoi(s[i+1:])
	return num{m: trim(s[:i]), e: e}
}

// fmtNum formats every number as it was formatted with a string per step: values at the edges
// of each range, rounding to zero, and random magnitudes (common practice, no source).
func TestFmtNumAsBefore(t *testing.T) {
	vs := []float64{0, math.Copysign(0, -1), math.NaN(), math.Inf(1), math.Inf(-1), 1e-4, 9.99999e-5, 1e12, 999999999999.9,
		1000, 999.95, 999.94999, 9999.5, 12345.5, 123456.7, -0.00001, -0.000049999, 1.5, -21.333333, 5e-324, math.MaxFloat64}
	rnd := rand.New(rand.NewSource(2))
	for range 200000 {
		vs = append(vs, (rnd.Float64()*2-1)*math.Pow(10, float64(rnd.Intn(40)-20)))
	}
	for _, v := range vs {
		if got, want := fmtNum(v), refFmtNum(v); got != want {
			t.Fatalf("fmtNum(%v) = %+v, want %+v", v, got, want)
		}
	}
}

// refShowStep is showStep as first written: both forms laid out afresh for every step.
func refShowStep(s trace.Step) shown {
	var out shown
	symbol := s.Symbol
	if s.Kind == trace.KindCheck && symbol == "" {
		symbol = "η"
	}
	lead := func() []piece {
		if symbol == "" {
			return nil
		}
		return []piece{{kind: pSym, text: symbol}, {kind: pOp, text: "="}}
	}
	expr, words := s.Expr, ""
	if s.Show != nil {
		expr, words = s.Show.Expr, s.Show.Result
	}
	switch {
	case words != "" && s.Kind == trace.KindCheck:
		out.Result = []piece{{kind: pWord, text: words}}
	case words != "":
		out.Result = append(lead(), piece{kind: pWord, text: words})
	default:
		n, u := quantityOf(s.Value, s.Unit, s.Symbol)
		out.Result = append(lead(), piece{kind: pNum, n: n, unit: u})
	}
	if expr == "" || s.Kind == trace.KindInput || s.Kind == trace.KindTable {
		return out
	}
	ps, err := layout(expr, s.Args, false)
	if err != nil {
		out.Text = expr
		return out
	}
	if len(ps) == 1 && ps[0].kind == pNum {
		return out
	}
	out.Formula = append(lead(), ps...)
	vs, err := layout(expr, s.Args, true)
	if err != nil || !usesArgs(readExpr(expr).toks, s.Args) {
		return out
	}
	if words != "" {
		vs = append(vs, piece{kind: pOp, text: "→"}, piece{kind: pWord, text: words})
	}
	out.Values = vs
	return out
}

// Every step of the shipped inputs and the small building, and the same steps with the symbols
// of their arguments and results changed, is shown as when each formula was laid out afresh,
// on several goroutines at once (common practice, no source: the sheets must not change).
func TestShowStepShared(t *testing.T) {
	var steps []trace.Step
	for _, r := range results(t) {
		steps = append(steps, r.Basis...)
		for _, d := range r.Designs {
			steps = append(steps, d.Steps...)
		}
	}
	for i, s := range steps[:len(steps)/10] {
		alt := s
		if i%2 == 0 {
			alt.Symbol += "x" // another result; otherwise the same result from other arguments
		}
		alt.Args = append([]trace.Arg{}, s.Args...)
		for k := range alt.Args {
			alt.Args[k].Symbol = "q_" + strconv.Itoa(k)
		}
		steps = append(steps, alt)
	}
	var wg sync.WaitGroup
	for g := 0; g < 3; g++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for k := range steps {
				s := steps[(k*(g+1))%len(steps)]
				if got, want := showStep(s), refShowStep(s); !reflect.DeepEqual(got, want) {
					t.Errorf("step %s: showStep = %+v, want %+v", s.ID, got, want)
					return
				}
			}
		}()
	}
	wg.Wait()
}

// BenchmarkSheetsPrint measures the Markdown and LaTeX printing of every brief sheet of the
// demo building, the tree built once.
func BenchmarkSheetsPrint(b *testing.B) {
	r := runFile(b, "../testdata/demo.yaml", "")
	set, err := buildSheets(r, Options{})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		for _, f := range []format{mdFormat, texFormat} {
			if _, err := set.print(f); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkLayout measures the display forms of every formula of the demo building's first sheet.
func BenchmarkLayout(b *testing.B) {
	r := runFile(b, "../testdata/demo.yaml", "")
	steps := r.Designs[0].Steps
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		for _, s := range steps {
			_ = showStep(s)
		}
	}
}

// goldmarkOnly is the converter without plainTags: goldmark's own parser of inline raw HTML.
var goldmarkOnly = goldmark.New(
	goldmark.WithExtensions(extension.Table),
	goldmark.WithParserOptions(parser.WithASTTransformers(util.Prioritized(verdictClasses{}, 500))),
	goldmark.WithRendererOptions(ghtml.WithUnsafe(), ghtml.WithXHTML()),
)

// The parser of the package's own tags makes the HTML goldmark's parser makes, for the tags the
// sheets hold and for tags at the edges of the form it takes (common practice, no source: the
// HTML must stay byte for byte what it was).
func TestPlainTagsAsGoldmark(t *testing.T) {
	for _, in := range []string{
		"M<sub>Ed,y</sub> = 3×10<sup>−4</sup> <mark>12 kN</mark>",
		`<a id="s-A1.L1.sec-2f-x"></a>**1.** text <small>(6.1)</small>\`,
		`<a id="s-A1"></a><a id="s-A2"></a>`,
		"<sub>a</sub><sup>b</sup>",
		`a <b class="x" id="y">c</b> d`,
		`a <b id='y'>c</b>`, `a <b id=y>c</b>`, `a <b id = "y">c</b>`, `a <b id>c</b>`,
		"a <b id=\"y\nz\">c</b>", "a <b\nid=\"y\">c</b>", "a <b >c</b >", "a <br/> <br /> c",
		`a <b id="y"x="z">c</b>`, `a <b id="y`, "a <b", "a </b", "a <", "a <1b>", "a <-b>", "a </1b>",
		`a <b data-x:y_z.w="v">c</b>`, `a <b _x="v">c</b>`, `a <b 1x="v">c</b>`,
		"| a <sub>b</sub> | c <sup>d</sup> |\n| --- | --- |\n| <mark>e</mark> | f |",
		"> **FAIL** <sub>x</sub>\n> <a id=\"q\"></a>",
		"<details><summary>3 steps</summary>\n\nx <sub>y</sub>\n\n</details>",
		"text\\<sub>escaped\\</sub> `<sub>code</sub>` <http://x.y/>",
		"<!-- c --> <?p?> <!X> <![CDATA[x]]>",
	} {
		var got, want bytes.Buffer
		if err := converter.Convert([]byte(in), &got); err != nil {
			t.Fatal(err)
		}
		if err := goldmarkOnly.Convert([]byte(in), &want); err != nil {
			t.Fatal(err)
		}
		if got.String() != want.String() {
			t.Errorf("%q:\n got %q\nwant %q", in, got.String(), want.String())
		}
	}
}

// demoSheets returns the result of the demo building and its sheets' trees.
func demoSheets(t *testing.T) (*design.Result, *sheetSet) {
	t.Helper()
	r := runFile(t, "../testdata/demo.yaml", "")
	set, err := buildSheets(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return r, set
}

// The HTML sheets and calc document of the demo building are the same with goldmark's own
// parser of inline raw HTML (common practice, no source).
func TestPlainTagsDemo(t *testing.T) {
	if testing.Short() {
		t.Skip("the demo building")
	}
	r, set := demoSheets(t)
	pages, err := set.print(htmlFormat)
	if err != nil {
		t.Fatal(err)
	}
	v, err := buildDocument(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	doc, err := printDocument(v, htmlFormat)
	if err != nil {
		t.Fatal(err)
	}
	pages = append(pages, Sheet{Name: "calc.md", Data: doc})
	for _, p := range pages {
		var got, want bytes.Buffer
		if err := converter.Convert(p.Data, &got); err != nil {
			t.Fatal(err)
		}
		if err := goldmarkOnly.Convert(p.Data, &want); err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(got.Bytes(), want.Bytes()) {
			t.Errorf("%s: the HTML differs from goldmark's own", p.Name)
		}
	}
}

// The pictures of the demo building's HTML sheets and calc document are left out of goldmark's
// way on every page, and the HTML is the same as goldmark makes of the pictures themselves
// (common practice, no source: the HTML must stay byte for byte what it was).
func TestFiguresDemo(t *testing.T) {
	if testing.Short() {
		t.Skip("the demo building")
	}
	r, set := demoSheets(t)
	tp, err := htmlFormat.printer(htmlFormat.common, htmlFormat.index, htmlFormat.sheet)
	if err != nil {
		t.Fatal(err)
	}
	figures := 0
	check := func(name string, print func(b *bytes.Buffer, m markup) error) {
		var plain, marked, want, got bytes.Buffer
		var svgs []string
		if err := print(&plain, md{}); err != nil {
			t.Fatal(err)
		}
		if err := print(&marked, mdFigures{svgs: &svgs}); err != nil {
			t.Fatal(err)
		}
		figures += len(svgs)
		if err := converter.Convert(plain.Bytes(), &want); err != nil {
			t.Fatal(err)
		}
		if err := convertFigures(&got, marked.Bytes(), svgs); err != nil {
			t.Errorf("%s: %v", name, err)
		} else if !bytes.Equal(got.Bytes(), want.Bytes()) {
			t.Errorf("%s: the HTML differs from goldmark's of the pictures", name)
		}
	}
	for i := 0; i <= len(set.names); i++ {
		v := set.index
		if i > 0 {
			v = set.sheets[i-1]
		}
		check(set.pageName(i), func(b *bytes.Buffer, m markup) error { return set.printPageWith(b, tp, i, v, m) })
	}
	v, err := buildDocument(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	dp, err := htmlFormat.printer(htmlFormat.common, htmlFormat.doc)
	if err != nil {
		t.Fatal(err)
	}
	check("calc", func(b *bytes.Buffer, m markup) error {
		return dp.printWith(b, htmlFormat.doc, *v, htmlFormat.inDocument, m)
	})
	if figures < len(set.names) {
		t.Errorf("%d figures in %d sheets, want one or more a sheet", figures, len(set.names))
	}
}

// A mark of a figure where a picture cannot stand as it is (inside a paragraph, a list or a block
// quote, or twice) is refused, and the page is then converted with the pictures themselves
// (common practice, no source).
func TestFiguresRefused(t *testing.T) {
	svg := "<svg xmlns=\"http://www.w3.org/2000/svg\">\n<text>a_b *c*</text>\n</svg>\n"
	for _, tmpl := range []string{
		"text\n%s\nmore\n", "- item\n\n  %s\n", "> %s\n", "%s\n%s\n", "text %s\n",
	} {
		var marked, got, want bytes.Buffer
		var svgs []string
		m := mdFigures{svgs: &svgs}
		n := strings.Count(tmpl, "%s")
		args := make([]any, n)
		plainArgs := make([]any, n)
		for k := range args {
			args[k] = strings.TrimSuffix(m.picture(fakeDrawing(svg)), "\n")
			plainArgs[k] = strings.TrimSuffix(svg, "\n")
		}
		if n == 2 {
			args[1] = args[0] // the same mark twice
			svgs = svgs[:1]
		}
		marked.WriteString(fmt.Sprintf(tmpl, args...))
		if err := convertFigures(&got, marked.Bytes(), svgs); err != errFigures {
			t.Errorf("%q: %v, want %v", tmpl, err, errFigures)
		}
		plain := fmt.Sprintf(tmpl, plainArgs...)
		if err := converter.Convert([]byte(plain), &want); err != nil {
			t.Fatal(err)
		}
		page, err := htmlOf(template.Must(template.New("p").Parse("{{range .Sheets}}{{.Body}}{{end}}")), marked.Bytes(), svgs,
			func(b *bytes.Buffer) error { b.WriteString(plain); return nil }, htmlPage{Sheets: []htmlSheet{{}}})
		if err != nil || string(page) != want.String() {
			t.Errorf("%q: page %q, %v; want %q", tmpl, page, err, want.String())
		}
	}
}

// fakeDrawing is a drawing of a fixed SVG, for tests.
type fakeDrawing string

func (f fakeDrawing) SVG() string { return string(f) }
func (f fakeDrawing) PGF() string { return "" }

// A page printed once for Markdown and HTML gives the bytes of each printed on its own, on every
// brief sheet of the demo building; full sheets, whose HTML folds sub-steps, are printed each on
// their own (common practice, no source: the files must stay byte for byte what they were).
func TestPrintShared(t *testing.T) {
	if testing.Short() {
		t.Skip("the demo building")
	}
	r := runFile(t, "../testdata/demo.yaml", "")
	mdTP, err := mdFormat.printer(mdFormat.common, mdFormat.index, mdFormat.sheet)
	if err != nil {
		t.Fatal(err)
	}
	htmlTP, err := htmlFormat.printer(htmlFormat.common, htmlFormat.index, htmlFormat.sheet)
	if err != nil {
		t.Fatal(err)
	}
	for _, detail := range []Detail{Brief, Full} {
		set, err := buildSheets(r, Options{Detail: detail})
		if err != nil {
			t.Fatal(err)
		}
		for i := 0; i <= len(set.names); i++ {
			v := set.index
			if i > 0 {
				v = set.sheets[i-1]
			}
			md, htmlMD, svgs, ok, err := set.printShared(mdTP, i, v)
			if err != nil {
				t.Fatal(err)
			}
			if want := detail == Brief || i == 0; ok != want {
				t.Errorf("%s %s: shared %v, want %v", detail, set.pageName(i), ok, want)
			}
			if !ok {
				continue
			}
			var wantMD, wantHTML bytes.Buffer
			var wantSVGs []string
			if err := set.printPageInto(&wantMD, mdTP, i, v); err != nil {
				t.Fatal(err)
			}
			if err := set.printPageWith(&wantHTML, htmlTP, i, v, mdFigures{svgs: &wantSVGs}); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(md.Bytes(), wantMD.Bytes()) || !bytes.Equal(htmlMD.Bytes(), wantHTML.Bytes()) || !reflect.DeepEqual(svgs, wantSVGs) {
				t.Errorf("%s %s: the shared printing differs from each format's own", detail, set.pageName(i))
			}
		}
	}
}

// The marks of a shared printing are filled in, and anything else that starts like them refused
// (common practice, no source).
func TestFillShared(t *testing.T) {
	pic := func(n int) string { return "<" + strconv.Itoa(n) + ">" }
	for _, c := range []struct {
		in, want string
		pictures int
		ok       bool
	}{
		{"a [x](B1" + sharedExt + "#s-1) " + sharedPicture + "0\x1a b " + sharedPicture + "1\x1a", "a [x](B1.html#s-1) <0> b <1>", 2, true},
		{"plain", "plain", 0, true},
		{sharedPicture + "1\x1a", "", 2, false}, // out of order
		{sharedPicture + "0\x1a", "", 2, false}, // one missing
		{sharedPicture + "x\x1a", "", 1, false}, // not a number
		{"a \x1a b", "", 0, false},              // a lone control character
		{sharedPicture + "0", "", 1, false},     // no end
		{"\x1aE", "", 0, false},                 // a cut extension mark
	} {
		var w bytes.Buffer
		ok := fillShared(&w, []byte(c.in), ".html", pic, c.pictures)
		if ok != c.ok || ok && w.String() != c.want {
			t.Errorf("%q: %q %v, want %q %v", c.in, w.String(), ok, c.want, c.ok)
		}
	}
}
