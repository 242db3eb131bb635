package reports

import (
	"bytes"
	"fmt"
	"reflect"
	"strconv"
	"strings"
	"sync"
	"text/template"
	"unsafe"

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
	f format
	t *template.Template
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

// print prints the tree v with the page template name, links resolved by link; it may run on
// several goroutines at once.
func (tp *treePrinter) print(name string, v any, link func(target) string) ([]byte, error) {
	b := getBuffer()
	defer putBuffer(b)
	if err := tp.printInto(b, name, v, link); err != nil {
		return nil, err
	}
	return bytes.Clone(b.Bytes()), nil
}

// printInto prints as print does, into b.
func (tp *treePrinter) printInto(b *bytes.Buffer, name string, v any, link func(target) string) error {
	return tp.printWith(b, name, v, link, tp.f.m)
}

// printWith prints as printInto does, the leaves with the markup m.
func (tp *treePrinter) printWith(b *bytes.Buffer, name string, v any, link func(target) string, m markup) error {
	p := printer{m: m, link: link}
	return tp.t.ExecuteTemplate(b, name, p.tree(v))
}

// buffers holds the buffers that pages are printed into, reused from page to page.
var buffers = sync.Pool{New: func() any { return new(bytes.Buffer) }}

// maxBuffer is the largest buffer kept for reuse (the sheets' buffers stay well below it).
const maxBuffer = 16 << 20

func getBuffer() *bytes.Buffer { return buffers.Get().(*bytes.Buffer) }

// putBuffer hands b back for reuse; its bytes must no longer be read.
func putBuffer(b *bytes.Buffer) {
	if b.Cap() > maxBuffer {
		return
	}
	b.Reset()
	buffers.Put(b)
}

// bufferString returns the bytes of b as a string without copying them: valid only until b is
// written to or handed back.
func bufferString(b *bytes.Buffer) string {
	if b.Len() == 0 {
		return ""
	}
	return unsafe.String(&b.Bytes()[0], b.Len())
}

var (
	inlineType = reflect.TypeOf(inline(nil))
	targetType = reflect.TypeOf(target{})
)

// tree turns the document tree v into what the templates read: each inline leaf printed, each
// link target resolved, each struct a struct of its exported fields (embedded ones merged) of
// the same names, leaves as strings.
func (p printer) tree(v any) any {
	rv := reflect.ValueOf(v)
	if !rv.IsValid() {
		return nil
	}
	c := shapeOf(rv.Type())
	if c.kind == kCopy {
		return v
	}
	// An addressable copy, so that the leaves are read in place, without boxing.
	src := reflect.New(rv.Type()).Elem()
	src.Set(rv)
	dst := reflect.New(c.out).Elem()
	p.fill(c, src, dst)
	return dst.Interface()
}

// A shape is how one type of the document tree is printed for the templates: its printed type
// (out) and, for a struct, pointer or slice, how its parts are.
type shape struct {
	kind   shapeKind
	out    reflect.Type
	elem   *shape       // kPointer, kSlice
	fields []fieldShape // kStruct
}

type shapeKind uint8

const (
	kCopy    shapeKind = iota // taken as it is
	kInline                   // an inline run, printed as a string
	kTarget                   // a link target, resolved as a string
	kStruct                   // a struct of the printed exported fields
	kPointer                  // a pointer to the printed element; nil stays nil
	kSlice                    // a slice of the printed elements
)

// fieldShape is one exported field of a struct: where it is in the tree's struct (through
// embedded structs) and in the printed one.
type fieldShape struct {
	src []int
	dst int
	s   *shape
}

var shapes sync.Map // reflect.Type to *shape

// shapeOf returns the shape of the type t, made once.
func shapeOf(t reflect.Type) *shape {
	if s, ok := shapes.Load(t); ok {
		return s.(*shape)
	}
	s, _ := shapes.LoadOrStore(t, makeShape(t))
	return s.(*shape)
}

func makeShape(t reflect.Type) *shape {
	switch {
	case t == inlineType:
		return &shape{kind: kInline, out: reflect.TypeOf("")}
	case t == targetType:
		return &shape{kind: kTarget, out: reflect.TypeOf("")}
	}
	switch t.Kind() {
	case reflect.Pointer:
		e := shapeOf(t.Elem())
		if e.kind == kCopy {
			return &shape{kind: kCopy, out: t}
		}
		return &shape{kind: kPointer, out: reflect.PointerTo(e.out), elem: e}
	case reflect.Slice:
		e := shapeOf(t.Elem())
		if e.kind == kCopy {
			return &shape{kind: kCopy, out: t}
		}
		return &shape{kind: kSlice, out: reflect.SliceOf(e.out), elem: e}
	case reflect.Struct:
		s := &shape{kind: kStruct}
		var fields []reflect.StructField
		at := map[string]int{} // a later field of the same name replaces an earlier one, as in a map
		var walk func(t reflect.Type, path []int)
		walk = func(t reflect.Type, path []int) {
			for i := 0; i < t.NumField(); i++ {
				f := t.Field(i)
				p := append(append([]int(nil), path...), i)
				switch {
				case f.Anonymous && f.Type.Kind() == reflect.Struct:
					walk(f.Type, p)
				case f.IsExported():
					fs := shapeOf(f.Type)
					n, ok := at[f.Name]
					if !ok {
						n = len(fields)
						at[f.Name] = n
						fields = append(fields, reflect.StructField{Name: f.Name})
						s.fields = append(s.fields, fieldShape{})
					}
					fields[n].Type = fs.out
					s.fields[n] = fieldShape{src: p, dst: n, s: fs}
				}
			}
		}
		walk(t, nil)
		s.out = reflect.StructOf(fields)
		return s
	}
	return &shape{kind: kCopy, out: t}
}

// fill sets dst, of the printed type of c, from the addressable value v of the tree.
func (p printer) fill(c *shape, v, dst reflect.Value) {
	switch c.kind {
	case kCopy:
		dst.Set(v)
	case kInline:
		dst.SetString(p.inline(*v.Addr().Interface().(*inline)))
	case kTarget:
		dst.SetString(p.link(*v.Addr().Interface().(*target)))
	case kPointer:
		if !v.IsNil() {
			n := reflect.New(c.elem.out)
			p.fill(c.elem, v.Elem(), n.Elem())
			dst.Set(n)
		}
	case kSlice:
		n := v.Len()
		out := reflect.MakeSlice(c.out, n, n)
		for i := 0; i < n; i++ {
			p.fill(c.elem, v.Index(i), out.Index(i))
		}
		dst.Set(out)
	case kStruct:
		for _, f := range c.fields {
			fv := v.Field(f.src[0])
			for _, i := range f.src[1:] {
				fv = fv.Field(i)
			}
			p.fill(f.s, fv, dst.Field(f.dst))
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
	out := make([]Sheet, 0, len(s.names)+1)
	for i := 0; i <= len(s.names); i++ {
		sh, err := s.page(tp, i)
		if err != nil {
			return nil, err
		}
		out = append(out, sh)
	}
	return out, nil
}

// page prints page i of the set (0 the index, then the sheets in order) with tp.
func (s *sheetSet) page(tp *treePrinter, i int) (Sheet, error) {
	if i == 0 {
		return s.printPage(tp, 0, s.index)
	}
	return s.printPage(tp, i, s.sheets[i-1])
}

// printPage prints the tree v of page i of the set (0 the index, then the sheets in order) with tp.
func (s *sheetSet) printPage(tp *treePrinter, i int, v sheetView) (Sheet, error) {
	b := getBuffer()
	defer putBuffer(b)
	if err := s.printPageInto(b, tp, i, v); err != nil {
		return Sheet{}, err
	}
	return Sheet{Name: s.pageName(i) + tp.f.ext, Data: bytes.Clone(b.Bytes())}, nil
}

// printPageInto prints page i as printPage does, into b.
func (s *sheetSet) printPageInto(b *bytes.Buffer, tp *treePrinter, i int, v sheetView) error {
	return s.printPageWith(b, tp, i, v, tp.f.m)
}

// printPageWith prints page i as printPageInto does, the leaves with the markup m.
func (s *sheetSet) printPageWith(b *bytes.Buffer, tp *treePrinter, i int, v sheetView, m markup) error {
	f := tp.f
	if i == 0 {
		return tp.printWith(b, f.index, v, f.onSheet("index"), m)
	}
	return tp.printWith(b, f.sheet, v, f.onSheet(s.names[i-1]), m)
}

// pageName is the base name of page i of the set, without extension.
func (s *sheetSet) pageName(i int) string {
	if i == 0 {
		return "index"
	}
	return s.names[i-1]
}

// printShared prints page i of the set once for both Markdown and HTML with tp, the Markdown
// printer: the Markdown page, and the page's Markdown for HTML with its pictures as the marks of
// figures (svgs, see mdFigures), in buffers to hand back. The two differ only in the extension of
// the links to other sheets and in the pictures, which are printed as marks and then filled in
// for each. ok is false where the page folds sub-steps (HTML folds them, Markdown does not) or
// the marks cannot be read back; the formats are then printed each on its own.
func (s *sheetSet) printShared(tp *treePrinter, i int, v sheetView) (md, htmlMD *bytes.Buffer, svgs []string, ok bool, err error) {
	t, err := tp.t.Clone()
	if err != nil {
		return nil, nil, nil, false, err
	}
	folds := false
	t.Funcs(template.FuncMap{"fold": func() bool { folds = true; return false }})
	p := printer{m: mdShared{svgs: &svgs}, link: format{sheetExt: sharedExt}.onSheet(s.pageName(i))}
	name := tp.f.sheet
	if i == 0 {
		name = tp.f.index
	}
	b := getBuffer()
	defer putBuffer(b)
	if err := t.ExecuteTemplate(b, name, p.tree(v)); err != nil {
		return nil, nil, nil, false, err
	}
	if folds {
		return nil, nil, nil, false, nil
	}
	md, htmlMD = getBuffer(), getBuffer()
	okMD := fillShared(md, b.Bytes(), mdFormat.sheetExt, func(n int) string { return svgs[n] }, len(svgs))
	okHTML := fillShared(htmlMD, b.Bytes(), htmlFormat.sheetExt, func(n int) string { return figureMarkOf(n, svgs[n]) }, len(svgs))
	if !okMD || !okHTML {
		putBuffer(md)
		putBuffer(htmlMD)
		return nil, nil, nil, false, nil
	}
	return md, htmlMD, svgs, true, nil
}

// foldsSteps reports whether the page v has folded sub-steps, which HTML prints folded: its
// Markdown and HTML are then printed each on its own, not shared (printShared would find out).
func foldsSteps(v sheetView) bool {
	for _, g := range v.Groups {
		for _, st := range g.Steps {
			if st.FoldOpen || st.FoldClose {
				return true
			}
		}
	}
	return false
}

// The marks of a page printed once for Markdown and HTML: sharedExt in place of the extension of
// a linked sheet, sharedPicture, a number and sharedEnd in place of a picture. Every printed text
// goes through oneLine, so the control character that starts them is nowhere else.
const (
	sharedExt     = "\x1aE\x1a"
	sharedPicture = "\x1aP"
	sharedEnd     = '\x1a'
)

// mdShared is the Markdown markup of a page printed once for Markdown and HTML: each picture a
// numbered mark, its SVG kept in svgs.
type mdShared struct {
	md
	svgs *[]string
}

func (m mdShared) picture(g drawing) string {
	*m.svgs = append(*m.svgs, g.SVG())
	return sharedPicture + strconv.Itoa(len(*m.svgs)-1) + string(sharedEnd)
}

// fillShared writes src into w with each mark of the shared printing filled in: the extension
// ext, and picture n as pic(n), each of the n pictures once and in order. It reports false where
// a mark is not one of them.
func fillShared(w *bytes.Buffer, src []byte, ext string, pic func(n int) string, pictures int) bool {
	w.Grow(len(src))
	next := 0
	for {
		k := bytes.IndexByte(src, sharedEnd)
		if k < 0 {
			w.Write(src)
			return next == pictures
		}
		w.Write(src[:k])
		rest := src[k:]
		switch {
		case bytes.HasPrefix(rest, []byte(sharedExt)):
			w.WriteString(ext)
			src = rest[len(sharedExt):]
		case bytes.HasPrefix(rest, []byte(sharedPicture)):
			rest = rest[len(sharedPicture):]
			e := bytes.IndexByte(rest, sharedEnd)
			if e < 0 {
				return false
			}
			n, err := strconv.Atoi(string(rest[:e]))
			if err != nil || n != next {
				return false
			}
			w.WriteString(pic(n))
			next++
			src = rest[e+1:]
		default:
			return false
		}
	}
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
// format asked for (md, tex, html), in memory (see RenderTo).
func Render(r *design.Result, formats map[string]bool, o Options) (Package, []Sheet, error) {
	out := Package{}
	var docs []Sheet
	err := RenderTo(r, formats, o, 1, func(path string, data []byte) error {
		dir, name, _ := strings.Cut(path, "/")
		data = bytes.Clone(data) // valid only during the call
		if dir == "doc" {
			docs = append(docs, Sheet{Name: name, Data: data})
		} else {
			out[dir] = append(out[dir], Sheet{Name: name, Data: data})
		}
		return nil
	})
	if err != nil {
		return nil, nil, err
	}
	return out, docs, nil
}

// RenderTo builds the tree of each sheet and of the calc document once, prints it in each
// format asked for (md, tex, html) and hands each file to emit as soon as it is printed, by its
// slash path below the output folder ("md/index.md", …, "doc/calc.md"), its bytes valid only
// during the call (a caller that keeps them copies them): the index, then each
// design's sheet in every format, then the calc document of each format. Up to workers
// goroutines build and print the sheets and then the calc documents (one tree for every format,
// printed in the formats at once), each sheet's tree dropped once printed, so that the memory
// held does not grow with the number of designs beyond the result and its index (the book);
// emit runs on the caller's goroutine, and an error it returns stops the rendering and is
// returned as it is.
func RenderTo(r *design.Result, formats map[string]bool, o Options, workers int, emit func(path string, data []byte) error) error {
	if r == nil {
		return fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return err
	}
	x, err := newRenderer(r, formats, o)
	if x == nil || err != nil {
		return err // nil, nil: no sheets and no calc document asked for
	}
	pages := len(x.set.names) + 1
	item := func(i int) ([]file, error) {
		if i >= pages {
			return x.docFile(x.fs[i-pages])
		}
		return x.page(i)
	}
	return inOrder(pages+len(x.fs), workers, item, func(files []file) error { return emitFiles(files, emit) })
}

// emitFiles hands each of files to emit, stopping at the first error, and lets go of the
// buffers the files' bytes lie in once emitted.
func emitFiles(files []file, emit func(path string, data []byte) error) error {
	for _, f := range files {
		if err := emit(f.path, f.data); err != nil {
			return err
		}
		if f.buf != nil {
			putBuffer(f.buf)
		}
	}
	return nil
}

// file is one printed file by its slash path below the output folder.
type file struct {
	path string
	data []byte
	buf  *bytes.Buffer // the reused buffer data lies in, handed back once the file is emitted; nil: none
}

// printing is one format's printer of the sheets and the calc document.
type printing struct {
	name string
	tp   *treePrinter
	html *htmlPages
}

// renderer prints the pages (0 the index, then the designs in order) and the calc document of
// a result in the formats asked for; page and docFile may run on several goroutines at once.
type renderer struct {
	r          *design.Result
	bk         *book
	p          place // the sheets' place, with the options
	set        *sheetSet
	fs         []printing
	mdP, htmlP *printing
	docOnce    sync.Once
	doc        docView
}

// newRenderer returns the renderer of r in the formats asked for (md, tex, html); nil where
// none of them is asked for.
func newRenderer(r *design.Result, formats map[string]bool, o Options) (*renderer, error) {
	if !formats["md"] && !formats["tex"] && !formats["html"] {
		return nil, nil
	}
	bk := newBook(r)
	// The index's tree is built when its page is printed and let go after, as the sheets' are.
	x := &renderer{r: r, bk: bk, p: place{opt: o}, set: &sheetSet{names: bk.names}}
	for _, f := range []struct {
		name string
		f    format
	}{{"md", mdFormat}, {"tex", texFormat}, {"html", htmlFormat}} {
		if !formats[f.name] {
			continue
		}
		tp, err := f.f.printer(f.f.common, f.f.index, f.f.sheet)
		if err != nil {
			return nil, fmt.Errorf("%s: %v", f.name, err)
		}
		pr := printing{name: f.name, tp: tp}
		if f.name == "html" {
			if pr.html, err = newHTMLPages(r, bk); err != nil {
				return nil, fmt.Errorf("%s: %v", f.name, err)
			}
		}
		x.fs = append(x.fs, pr)
	}
	for k := range x.fs {
		switch x.fs[k].name {
		case "md":
			x.mdP = &x.fs[k]
		case "html":
			x.htmlP = &x.fs[k]
		}
	}
	return x, nil
}

// page prints page i (0 the index, then the designs in order): its tree built once, printed
// per format.
func (x *renderer) page(i int) ([]file, error) {
	set, fs := x.set, x.fs
	var v sheetView
	if i == 0 {
		v = index(x.r, func(name string) target { return target{sheet: name} }, x.bk, x.p)
	} else {
		v = sheet(x.bk, i-1, x.p)
	}
	// Markdown and HTML from one printing of the page where they differ only in the links'
	// extension and the pictures.
	var md, htmlMD *bytes.Buffer
	var svgs []string
	if x.mdP != nil && x.htmlP != nil && !foldsSteps(v) {
		var ok bool
		var err error
		if md, htmlMD, svgs, ok, err = set.printShared(x.mdP.tp, i, v); err != nil {
			return nil, fmt.Errorf("md: %v", err)
		} else if !ok {
			md, htmlMD = nil, nil
		}
		defer func() {
			if htmlMD != nil {
				putBuffer(htmlMD)
			}
			if md != nil {
				putBuffer(md)
			}
		}()
	}
	out := make([]file, 0, len(fs))
	for _, f := range fs {
		name := set.pageName(i) + f.tp.f.ext
		var b *bytes.Buffer
		var err error
		switch {
		case f.name == "md" && md != nil:
			b, md = md, nil // handed on with the file
		case f.html != nil:
			// The Markdown in a reused buffer, its pictures as marks; converted and let go.
			again := func(w *bytes.Buffer) error { return set.printPageInto(w, f.tp, i, v) }
			b = getBuffer()
			if htmlMD != nil {
				name, err = f.html.pageInto(b, i, Sheet{Name: name, Data: htmlMD.Bytes()}, svgs, again)
				break
			}
			m := getBuffer()
			var svgs []string
			if err = set.printPageWith(m, f.tp, i, v, mdFigures{svgs: &svgs}); err == nil {
				name, err = f.html.pageInto(b, i, Sheet{Name: name, Data: m.Bytes()}, svgs, again)
			}
			putBuffer(m)
		default:
			b = getBuffer()
			err = set.printPageInto(b, f.tp, i, v)
		}
		if err != nil {
			putBuffer(b)
			return nil, fmt.Errorf("%s: %v", f.name, err)
		}
		out = append(out, file{path: f.name + "/" + name, data: b.Bytes(), buf: b})
	}
	return out, nil
}

// docFile prints the calc document in the format of f: its tree built once, by the first
// printing that needs it, while the last sheets may still be printing.
func (x *renderer) docFile(f printing) ([]file, error) {
	x.docOnce.Do(func() { x.doc = document(x.r, x.bk, place{onePage: true, opt: x.p.opt}) })
	var d Sheet
	var err error
	if f.html != nil {
		d, err = documentHTML(x.r, &x.doc)
	} else {
		d.Name = "calc" + f.tp.f.ext
		d.Data, err = printDocument(&x.doc, f.tp.f)
	}
	if err != nil {
		return nil, fmt.Errorf("%s calc document: %v", f.name, err)
	}
	return []file{{path: "doc/" + d.Name, data: d.Data}}, nil
}

// inOrder makes the n pages page(0) … page(n-1) on up to workers goroutines and hands each to
// emit, on the caller's goroutine, in order; at most 2×workers pages wait in memory. The first
// error stops it; a panic in page is raised again on the caller's goroutine.
func inOrder[T any](n, workers int, page func(i int) (T, error), emit func(T) error) error {
	if workers < 2 {
		for i := 0; i < n; i++ {
			s, err := page(i)
			if err == nil {
				err = emit(s)
			}
			if err != nil {
				return err
			}
		}
		return nil
	}
	type made struct {
		s     T
		err   error
		fault any
	}
	queue := make(chan chan made, 2*workers) // the pages in order, each filled when made
	busy := make(chan struct{}, workers)
	done := make(chan struct{})
	defer close(done)
	go func() {
		defer close(queue)
		for i := 0; i < n; i++ {
			c := make(chan made, 1)
			select {
			case queue <- c:
			case <-done:
				return
			}
			select {
			case busy <- struct{}{}:
			case <-done:
				return
			}
			go func(i int) {
				defer func() { <-busy }()
				defer func() {
					if p := recover(); p != nil {
						c <- made{fault: p}
					}
				}()
				s, err := page(i)
				c <- made{s: s, err: err}
			}(i)
		}
	}()
	for c := range queue {
		m := <-c
		if m.fault != nil {
			panic(m.fault)
		}
		if m.err == nil {
			m.err = emit(m.s)
		}
		if m.err != nil {
			return m.err
		}
	}
	return nil
}
