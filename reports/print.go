package reports

import (
	"fmt"
	"reflect"
	"text/template"

	"colsheet/calc/design"
	"colsheet/templates"
)

// format is one printer of the document tree: the markup of its leaves and its templates,
// one named template per node kind (step, step line, table, group, summary, …).
type format struct {
	m        markup
	delims   [2]string
	common   string // the templates of the node kinds
	index    string // the index sheet's page
	sheet    string // a lift's sheet page
	doc      string // the calc document
	ext      string // the extension of its files
	sheetExt string // the extension of a sheet as another sheet links it; "" where sheets are not linked
	docDir   string // the calc document's way to the per-lift sheets ("../md/"); "" for no link
	fold     bool   // folded sub-steps are printed folded (HTML)
}

var (
	mdFormat   = format{m: md{}, delims: [2]string{"{{", "}}"}, common: "md/common.md.tmpl", index: "md/index.md.tmpl", sheet: "md/sheet.md.tmpl", doc: "md/doc.md.tmpl", ext: ".md", sheetExt: ".md", docDir: sheetDir}
	htmlFormat = format{m: md{}, delims: [2]string{"{{", "}}"}, common: "md/common.md.tmpl", index: "md/index.md.tmpl", sheet: "md/sheet.md.tmpl", doc: "md/doc.md.tmpl", ext: ".md", sheetExt: ".html", docDir: "../html/", fold: true}
	texFormat  = format{m: tex{}, delims: templates.TeXDelims, common: "tex/common.tex.tmpl", index: "tex/index.tex.tmpl", sheet: "tex/sheet.tex.tmpl", doc: "tex/doc.tex.tmpl", ext: ".tex", sheetExt: ".pdf"}
)

// sheetDir is where the calc document finds the per-lift Markdown sheets.
const sheetDir = "../md/"

// onSheet returns the links of the page cur of the set of sheets: an anchor on the same page,
// another sheet's file (and anchor) where the format links files, nothing where it does not.
func (f format) onSheet(cur string) func(target) string {
	return func(t target) string {
		switch {
		case t.anchor == "" && t.sheet != "" && f.sheetExt != "":
			return t.sheet + f.sheetExt
		case t.anchor == "":
			return ""
		case t.sheet == "" || t.sheet == cur:
			return "#" + t.anchor
		case f.sheetExt != "" && f.sheetExt != ".pdf":
			return t.sheet + f.sheetExt + "#" + t.anchor
		}
		return ""
	}
}

// inDocument returns the links of the calc document: every step on the one page, and the
// per-lift sheets in the folder beside it where the format links them.
func (f format) inDocument(t target) string {
	switch {
	case t.file != "" && f.docDir != "":
		return f.docDir + t.file + f.sheetExt
	case t.file != "":
		return ""
	}
	return "#" + t.anchor
}

// printer runs the format's templates over trees.
type treePrinter struct {
	f   format
	t   *template.Template
	cur printer // the printer of the page being printed
}

func (f format) printer(files ...string) (*treePrinter, error) {
	tp := &treePrinter{f: f}
	t := template.New(files[0]).Delims(f.delims[0], f.delims[1]).Option("missingkey=error").Funcs(template.FuncMap{
		"fold": func() bool { return f.fold },
	})
	for _, name := range files {
		b, err := templates.FS.ReadFile(name)
		if err != nil {
			return nil, err
		}
		if _, err := t.New(name).Parse(string(b)); err != nil {
			return nil, err
		}
	}
	tp.t = t
	return tp, nil
}

// print prints the tree v with the page template name, links resolved by link.
func (tp *treePrinter) print(name string, v any, link func(target) string) ([]byte, error) {
	tp.cur = printer{m: tp.f.m, link: link}
	return execute(tp.t, name, tp.cur.tree(reflect.ValueOf(v)))
}

var (
	inlineType = reflect.TypeOf(inline(nil))
	targetType = reflect.TypeOf(target{})
)

// tree turns a node of the document tree into what the templates read: each inline leaf
// printed, each link target resolved, each struct a map of its fields (embedded ones merged).
func (p printer) tree(v reflect.Value) any {
	switch {
	case v.Type() == inlineType:
		return p.inline(v.Interface().(inline))
	case v.Type() == targetType:
		return p.link(v.Interface().(target))
	}
	switch v.Kind() {
	case reflect.Pointer:
		if v.IsNil() {
			return nil
		}
		return p.tree(v.Elem())
	case reflect.Struct:
		out := map[string]any{}
		p.fields(v, out)
		return out
	case reflect.Slice:
		out := make([]any, v.Len())
		for i := range out {
			out[i] = p.tree(v.Index(i))
		}
		return out
	}
	return v.Interface()
}

func (p printer) fields(v reflect.Value, out map[string]any) {
	for i := 0; i < v.NumField(); i++ {
		f := v.Type().Field(i)
		switch {
		case f.Anonymous:
			p.fields(v.Field(i), out)
		case f.IsExported():
			out[f.Name] = p.tree(v.Field(i))
		}
	}
}

// sheetSet is the tree of the per-lift output: the index and one sheet per design.
type sheetSet struct {
	index  sheetView
	sheets []sheetView
	names  []string
}

// buildSheets builds the tree of the index and the sheets once, for every format.
func buildSheets(r *design.Result, o Options) (*sheetSet, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	bk := newBook(r)
	p := place{opt: o}
	set := &sheetSet{names: bk.names, index: index(r, func(name string) target { return target{sheet: name} }, bk, p)}
	for i := range bk.names {
		set.sheets = append(set.sheets, sheet(bk, i, p))
	}
	return set, nil
}

// print prints the set in format f.
func (s *sheetSet) print(f format) ([]Sheet, error) {
	tp, err := f.printer(f.common, f.index, f.sheet)
	if err != nil {
		return nil, err
	}
	b, err := tp.print(f.index, s.index, f.onSheet("index"))
	if err != nil {
		return nil, err
	}
	out := []Sheet{{Name: "index" + f.ext, Data: b}}
	for i, name := range s.names {
		b, err := tp.print(f.sheet, s.sheets[i], f.onSheet(name))
		if err != nil {
			return nil, err
		}
		out = append(out, Sheet{Name: name + f.ext, Data: b})
	}
	return out, nil
}

// buildDocument builds the tree of the calc document once, for every format.
func buildDocument(r *design.Result, o Options) (*docView, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	v := document(r, newBook(r), place{onePage: true, opt: o})
	return &v, nil
}

// printDocument prints the calc document in format f.
func printDocument(v *docView, f format) ([]byte, error) {
	tp, err := f.printer(f.common, f.doc)
	if err != nil {
		return nil, err
	}
	return tp.print(f.doc, *v, f.inDocument)
}

// Markdown returns the calc sheets in CommonMark with GFM tables: index.md first, then one sheet per design.
func Markdown(r *design.Result, o Options) ([]Sheet, error) {
	set, err := buildSheets(r, o)
	if err != nil {
		return nil, err
	}
	return set.print(mdFormat)
}

// LaTeX returns the calc sheets as standalone pdflatex documents: index.tex first, then one per design.
func LaTeX(r *design.Result, o Options) ([]Sheet, error) {
	set, err := buildSheets(r, o)
	if err != nil {
		return nil, err
	}
	return set.print(texFormat)
}

// HTML returns the calc sheets as self-contained HTML pages: index.html first, then one page
// per design, each printed as Markdown and converted by goldmark once.
func HTML(r *design.Result, o Options) ([]Sheet, error) {
	set, err := buildSheets(r, o)
	if err != nil {
		return nil, err
	}
	return set.html(r)
}

// DocumentMarkdown returns the calc document in one Markdown file (calc.md); the lifts that a
// group's calculation covers link to their own sheets in ../md/.
func DocumentMarkdown(r *design.Result, o Options) (Sheet, error) {
	v, err := buildDocument(r, o)
	if err != nil {
		return Sheet{}, err
	}
	b, err := printDocument(v, mdFormat)
	return Sheet{Name: "calc.md", Data: b}, err
}

// DocumentLaTeX returns the calc document as one pdflatex document (calc.tex) with a table of
// contents and hyperlinks from every step to the steps it uses.
func DocumentLaTeX(r *design.Result, o Options) (Sheet, error) {
	v, err := buildDocument(r, o)
	if err != nil {
		return Sheet{}, err
	}
	b, err := printDocument(v, texFormat)
	return Sheet{Name: "calc.tex", Data: b}, err
}

// DocumentHTML returns the calc document as one self-contained HTML page (calc.html).
func DocumentHTML(r *design.Result, o Options) (Sheet, error) {
	v, err := buildDocument(r, o)
	if err != nil {
		return Sheet{}, err
	}
	return documentHTML(r, v)
}

// Package holds every rendered file of the calc package by format ("md", "tex", "html"):
// the sheets, then the calc document.
type Package map[string][]Sheet

// Render builds the trees of the sheets and the calc document once and prints them in each
// format asked for (md, tex, html).
func Render(r *design.Result, formats map[string]bool, o Options) (Package, []Sheet, error) {
	set, err := buildSheets(r, o)
	if err != nil {
		return nil, nil, err
	}
	doc, err := buildDocument(r, o)
	if err != nil {
		return nil, nil, err
	}
	out := Package{}
	var docs []Sheet
	for _, f := range []struct {
		name string
		f    format
	}{{"md", mdFormat}, {"tex", texFormat}} {
		if !formats[f.name] {
			continue
		}
		sheets, err := set.print(f.f)
		if err != nil {
			return nil, nil, fmt.Errorf("%s: %v", f.name, err)
		}
		out[f.name] = sheets
		b, err := printDocument(doc, f.f)
		if err != nil {
			return nil, nil, fmt.Errorf("%s calc document: %v", f.name, err)
		}
		docs = append(docs, Sheet{Name: "calc" + f.f.ext, Data: b})
	}
	if formats["html"] {
		sheets, err := set.html(r)
		if err != nil {
			return nil, nil, fmt.Errorf("html: %v", err)
		}
		out["html"] = sheets
		d, err := documentHTML(r, doc)
		if err != nil {
			return nil, nil, fmt.Errorf("html calc document: %v", err)
		}
		docs = append(docs, d)
	}
	return out, docs, nil
}
