package reports

import (
	"bytes"
	"html/template"
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

// converter renders the Markdown that this package writes. Raw HTML is let through because
// the only raw HTML in it is the <sub> and <sup> tags that the package itself writes: every
// user-supplied character that could start markup is escaped in the Markdown.
var converter = goldmark.New(
	goldmark.WithExtensions(extension.Table),
	goldmark.WithParserOptions(parser.WithASTTransformers(util.Prioritized(verdictClasses{}, 500))),
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
	h, err := newHTMLPages(r)
	if err != nil {
		return nil, err
	}
	out := make([]Sheet, 0, len(s.names)+1)
	for i := 0; i <= len(s.names); i++ {
		single, err := s.page(tp, i)
		if err != nil {
			return nil, err
		}
		page, err := h.page(i, single)
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
	t             *template.Template
	tool, project string
}

func newHTMLPages(r *design.Result) (*htmlPages, error) {
	t, err := template.ParseFS(templates.FS, "html/page.html.tmpl")
	if err != nil {
		return nil, err
	}
	return &htmlPages{r: r, t: t, tool: program(r), project: oneLine(input(r).Project.Title)}, nil
}

// page returns page i of the set (0 the index, then the designs in order) from its Markdown single.
func (h *htmlPages) page(i int, single Sheet) (Sheet, error) {
	title := "Index of calculation sheets"
	if i > 0 {
		title = subject(h.r.Designs[i-1])
	}
	if strings.TrimSpace(h.project) != "" {
		title = h.project + ": " + title
	}
	failed := i > 0 && h.r.Designs[i-1].Status != design.StatusPass
	id := strings.TrimSuffix(single.Name, ".md")
	body, err := toHTML(single.Data)
	if err != nil {
		return Sheet{}, err
	}
	page, err := execPage(h.t, htmlPage{Title: oneLine(title), Tool: h.tool,
		Sheets: []htmlSheet{{ID: id, Failed: failed, Body: body}}})
	if err != nil {
		return Sheet{}, err
	}
	return Sheet{Name: id + ".html", Data: page}, nil
}

func toHTML(mdText []byte) (template.HTML, error) {
	var b bytes.Buffer
	if err := converter.Convert(mdText, &b); err != nil {
		return "", err
	}
	return template.HTML(b.String()), nil // #nosec: escaped at the Markdown stage
}

func execPage(t *template.Template, p htmlPage) ([]byte, error) {
	var b bytes.Buffer
	if err := t.Execute(&b, p); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// documentHTML prints the calc document v as one self-contained HTML page, from its Markdown
// with HTML's links, converted by goldmark once.
func documentHTML(r *design.Result, v *docView) (Sheet, error) {
	t, err := template.ParseFS(templates.FS, "html/page.html.tmpl")
	if err != nil {
		return Sheet{}, err
	}
	data, err := printDocument(v, htmlFormat)
	if err != nil {
		return Sheet{}, err
	}
	body, err := toHTML(data)
	if err != nil {
		return Sheet{}, err
	}
	tool := program(r)
	title := oneLine(strings.TrimSpace(input(r).Project.Title + " calculation package"))
	page, err := execPage(t, htmlPage{Title: title, Tool: tool,
		Sheets: []htmlSheet{{ID: "calc", Failed: r.Failed() > 0, Body: body}}})
	return Sheet{Name: "calc.html", Data: page}, err
}
