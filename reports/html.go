package reports

import (
	"bytes"
	"errors"
	"html/template"
	"strconv"
	"strings"

	"github.com/yuin/goldmark"
	"github.com/yuin/goldmark/ast"
	"github.com/yuin/goldmark/extension"
	"github.com/yuin/goldmark/parser"
	ghtml "github.com/yuin/goldmark/renderer/html"
	"github.com/yuin/goldmark/text"
	"github.com/yuin/goldmark/util"

	"colsheet/calc/design"
	"colsheet/templates"
)

// verdictClasses marks the strong PASS and FAIL words, and the block quotes they open, with
// the classes "pass" and "fail" so that the page's style sheet can make a failure loud.
type verdictClasses struct{}

func strongWord(n ast.Node, src []byte) string {
	e, ok := n.(*ast.Emphasis)
	if !ok || e.Level != 2 || e.ChildCount() != 1 {
		return ""
	}
	t, ok := e.FirstChild().(*ast.Text)
	if !ok {
		return ""
	}
	switch w := string(t.Segment.Value(src)); w {
	case "PASS", "FAIL":
		return w
	}
	return ""
}

func (verdictClasses) Transform(doc *ast.Document, reader text.Reader, _ parser.Context) {
	src := reader.Source()
	_ = ast.Walk(doc, func(n ast.Node, entering bool) (ast.WalkStatus, error) {
		if !entering {
			return ast.WalkContinue, nil
		}
		switch n.Kind() {
		case ast.KindEmphasis:
			if w := strongWord(n, src); w != "" {
				n.SetAttributeString("class", []byte(strings.ToLower(w)))
			}
		case ast.KindBlockquote:
			if p := n.FirstChild(); p != nil && p.Kind() == ast.KindParagraph && strongWord(p.FirstChild(), src) == "FAIL" {
				n.SetAttributeString("class", []byte("fail"))
			}
		}
		return ast.WalkContinue, nil
	})
}

// plainTags parses, ahead of goldmark's own parser of inline raw HTML, the tags that this
// package writes in running text (<sub>, </sub>, <a id="…">, …): an open tag of a name and
// double-quoted attributes, or a close tag, on one line and without spaces around '=' or before
// '>'. It makes the same node as goldmark's parser does of such a tag (whose regular expression
// accepts it and ends at the same '>'), without the expression run over the rest of the
// paragraph; anything else is left to goldmark's parser.
type plainTags struct{}

func (plainTags) Trigger() []byte { return []byte{'<'} }

func (plainTags) Parse(_ ast.Node, block text.Reader, _ parser.Context) ast.Node {
	line, seg := block.PeekLine()
	n := plainTag(line)
	if n == 0 {
		return nil
	}
	node := ast.NewRawHTML()
	node.Segments.Append(seg.WithStop(seg.Start + n))
	block.Advance(n)
	return node
}

// plainTag returns the length of the tag of the form plainTags parses at the start of line, 0
// where there is none.
func plainTag(line []byte) int {
	i := 1
	closing := len(line) > 1 && line[1] == '/'
	if closing {
		i++
	}
	name := func(first func(byte) bool, rest func(byte) bool) bool {
		if i >= len(line) || !first(line[i]) {
			return false
		}
		for i++; i < len(line) && rest(line[i]); i++ {
		}
		return true
	}
	if !name(asciiLetter, tagNameChar) {
		return 0
	}
	for !closing && i < len(line) && line[i] == ' ' {
		i++ // the space before an attribute
		if !name(attrStart, attrChar) || i+1 >= len(line) || line[i] != '=' || line[i+1] != '"' {
			return 0
		}
		i += 2
		for i < len(line) && line[i] != '"' && line[i] != '\n' && line[i] != '\r' {
			i++
		}
		if i >= len(line) || line[i] != '"' {
			return 0
		}
		i++
	}
	if i < len(line) && line[i] == '>' {
		return i + 1
	}
	return 0
}

func asciiLetter(c byte) bool { return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }

func tagNameChar(c byte) bool { return asciiLetter(c) || c >= '0' && c <= '9' || c == '-' }

func attrStart(c byte) bool { return asciiLetter(c) || c == '_' || c == ':' }

func attrChar(c byte) bool { return attrStart(c) || c >= '0' && c <= '9' || c == '.' || c == '-' }

// converter renders the Markdown that this package writes. Raw HTML is let through because
// the only raw HTML in it is the <sub> and <sup> tags that the package itself writes: every
// user-supplied character that could start markup is escaped in the Markdown.
var converter = goldmark.New(
	goldmark.WithExtensions(extension.Table),
	goldmark.WithParserOptions(parser.WithASTTransformers(util.Prioritized(verdictClasses{}, 500)),
		parser.WithInlineParsers(util.Prioritized(plainTags{}, 350))),
	goldmark.WithRendererOptions(ghtml.WithUnsafe(), ghtml.WithXHTML()),
)

type htmlSheet struct {
	ID     string
	Failed bool
	Body   template.HTML
}

type htmlPage struct {
	Title, Tool string
	Sheets      []htmlSheet
}

// html prints the set as HTML pages: each sheet printed as Markdown with HTML's links and its
// folded sub-steps, converted by goldmark once, in the page template.
func (s *sheetSet) html(r *design.Result) ([]Sheet, error) {
	tp, err := htmlFormat.printer(htmlFormat.common, htmlFormat.index, htmlFormat.sheet)
	if err != nil {
		return nil, err
	}
	h, err := newHTMLPages(r, newBook(r))
	if err != nil {
		return nil, err
	}
	out := make([]Sheet, 0, len(s.names)+1)
	for i := 0; i <= len(s.names); i++ {
		single, err := s.page(tp, i)
		if err != nil {
			return nil, err
		}
		page, err := h.page(i, single, nil, nil)
		if err != nil {
			return nil, err
		}
		out = append(out, page)
	}
	return out, nil
}

// htmlPages turns the pages of a set of sheets, printed as Markdown with HTML's links, into
// HTML pages; page may run on several goroutines at once.
type htmlPages struct {
	r             *design.Result
	bk            *book // the designs, as the sheets read them
	t             *template.Template
	tool, project string
}

func newHTMLPages(r *design.Result, bk *book) (*htmlPages, error) {
	t, err := template.ParseFS(templates.FS, "html/page.html.tmpl")
	if err != nil {
		return nil, err
	}
	return &htmlPages{r: r, bk: bk, t: t, tool: program(r), project: oneLine(input(r).Project.Title)}, nil
}

// page returns page i of the set (0 the index, then the designs in order) from its Markdown
// single, printed with the marks of the figures svgs (again prints it with the pictures, see htmlOf).
func (h *htmlPages) page(i int, single Sheet, svgs []string, again func(*bytes.Buffer) error) (Sheet, error) {
	b := getBuffer()
	defer putBuffer(b)
	name, err := h.pageInto(b, i, single, svgs, again)
	if err != nil {
		return Sheet{}, err
	}
	return Sheet{Name: name, Data: bytes.Clone(b.Bytes())}, nil
}

// pageInto prints page i as page does, into dst, and returns its file name.
func (h *htmlPages) pageInto(dst *bytes.Buffer, i int, single Sheet, svgs []string, again func(*bytes.Buffer) error) (string, error) {
	title := "Index of calculation sheets"
	if i > 0 {
		title = subject(*h.bk.design(i - 1))
	}
	if strings.TrimSpace(h.project) != "" {
		title = h.project + ": " + title
	}
	failed := i > 0 && h.bk.design(i-1).Status != design.StatusPass
	id := strings.TrimSuffix(single.Name, ".md")
	err := htmlInto(dst, h.t, single.Data, svgs, again, htmlPage{Title: oneLine(title), Tool: h.tool,
		Sheets: []htmlSheet{{ID: id, Failed: failed}}})
	if err != nil {
		return "", err
	}
	return id + ".html", nil
}

// htmlOf converts the Markdown mdText by goldmark into the body of the one sheet of p and returns
// the page of the template t. The HTML is made in reused buffers; only the page is new. Where
// the Markdown was printed with its pictures as the marks of figures (svgs, see mdFigures), they
// are put back in the HTML; again prints the Markdown with the pictures themselves, for a page
// where a mark is not where a picture can stand as it is.
func htmlOf(t *template.Template, mdText []byte, svgs []string, again func(*bytes.Buffer) error, p htmlPage) ([]byte, error) {
	page := getBuffer()
	defer putBuffer(page)
	if err := htmlInto(page, t, mdText, svgs, again, p); err != nil {
		return nil, err
	}
	return bytes.Clone(page.Bytes()), nil
}

// htmlInto prints the page of htmlOf into dst.
func htmlInto(dst *bytes.Buffer, t *template.Template, mdText []byte, svgs []string, again func(*bytes.Buffer) error, p htmlPage) error {
	body := getBuffer()
	defer putBuffer(body)
	if err := convertFigures(body, mdText, svgs); errors.Is(err, errFigures) {
		whole := getBuffer()
		defer putBuffer(whole)
		body.Reset()
		if err := again(whole); err != nil {
			return err
		}
		if err := converter.Convert(whole.Bytes(), body); err != nil {
			return err
		}
	} else if err != nil {
		return err
	}
	// The body is read only while the page is printed, before its buffer is reused.
	p.Sheets[0].Body = template.HTML(bufferString(body)) // #nosec: escaped at the Markdown stage
	return t.Execute(dst, p)
}

// mdFigures is the Markdown of a page to be converted to HTML with each picture left out of
// goldmark's way: in its place a mark of one line, <svg data-colsheet-figure="N">, that goldmark
// takes as it takes the SVG's first line (a complete open tag alone on its line); the SVG's own
// lines, none of them blank, would have been passed on as they are within the same HTML block.
// Each printing of a page has its own.
type mdFigures struct {
	md
	svgs *[]string
}

var figureMark = []byte(`<svg data-colsheet-figure="`)

func (m mdFigures) picture(g drawing) string {
	svg := g.SVG()
	*m.svgs = append(*m.svgs, svg)
	return figureMarkOf(len(*m.svgs)-1, svg)
}

// figureMarkOf is the mark of figure n, of the SVG svg, in the Markdown of an HTML page.
func figureMarkOf(n int, svg string) string {
	mark := string(figureMark) + strconv.Itoa(n) + `">`
	if strings.HasSuffix(svg, "\n") {
		mark += "\n"
	}
	return mark
}

// errFigures says that the marks of the figures are not each a line of an HTML block.
var errFigures = errors.New("figure marks not in HTML blocks")

// convertFigures converts the Markdown src, with the marks of the figures svgs, to HTML in w, each
// mark replaced by its SVG. It returns errFigures, w partly written, where a mark is not a line of
// its own in an HTML block of type 6 or 7 at the top of the document (which goldmark writes out
// as it is, as it would the SVG's lines), or is not there exactly once.
func convertFigures(w *bytes.Buffer, src []byte, svgs []string) error {
	if len(svgs) == 0 {
		return converter.Convert(src, w)
	}
	if bytes.Count(src, figureMark) != len(svgs) {
		return errFigures
	}
	doc := converter.Parser().Parse(text.NewReader(src))
	n := 0
	for c := doc.FirstChild(); c != nil; c = c.NextSibling() {
		hb, ok := c.(*ast.HTMLBlock)
		if !ok || hb.HTMLBlockType != ast.HTMLBlockType6 && hb.HTMLBlockType != ast.HTMLBlockType7 {
			continue
		}
		lines := hb.Lines()
		for i := 0; i < lines.Len(); i++ {
			seg := lines.At(i)
			if bytes.HasPrefix(seg.Value(src), figureMark) {
				n++
			}
		}
	}
	if n != len(svgs) {
		return errFigures
	}
	out := getBuffer()
	defer putBuffer(out)
	if err := converter.Renderer().Render(out, src, doc); err != nil {
		return err
	}
	// Each mark, a whole line of the HTML, replaced by its SVG without the SVG's last line end.
	h := out.Bytes()
	next := 0
	for len(h) > 0 {
		i := bytes.Index(h, figureMark)
		if i < 0 {
			w.Write(h)
			break
		}
		rest := h[i+len(figureMark):]
		j := bytes.IndexByte(rest, '"')
		k, err := strconv.Atoi(string(rest[:max(j, 0)]))
		if j < 0 || err != nil || k != next || !bytes.HasPrefix(rest[j:], []byte("\">\n")) || i > 0 && h[i-1] != '\n' {
			return errFigures
		}
		w.Write(h[:i])
		w.WriteString(strings.TrimSuffix(svgs[k], "\n"))
		h = rest[j+2:]
		next++
	}
	if next != len(svgs) {
		return errFigures
	}
	return nil
}

// documentHTML prints the calc document v as one self-contained HTML page, from its Markdown
// with HTML's links, converted by goldmark once.
func documentHTML(r *design.Result, v *docView) (Sheet, error) {
	t, err := template.ParseFS(templates.FS, "html/page.html.tmpl")
	if err != nil {
		return Sheet{}, err
	}
	tp, err := htmlFormat.printer(htmlFormat.common, htmlFormat.doc)
	if err != nil {
		return Sheet{}, err
	}
	data := getBuffer()
	defer putBuffer(data)
	var svgs []string
	if err := tp.printWith(data, htmlFormat.doc, *v, htmlFormat.inDocument, mdFigures{svgs: &svgs}); err != nil {
		return Sheet{}, err
	}
	again := func(b *bytes.Buffer) error { return tp.printInto(b, htmlFormat.doc, *v, htmlFormat.inDocument) }
	tool := program(r)
	title := oneLine(strings.TrimSpace(input(r).Project.Title + " calculation package"))
	page, err := htmlOf(t, data.Bytes(), svgs, again, htmlPage{Title: title, Tool: tool,
		Sheets: []htmlSheet{{ID: "calc", Failed: r.Failed() > 0}}})
	return Sheet{Name: "calc.html", Data: page}, err
}
