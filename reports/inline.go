package reports

import (
	"strings"
	"sync"
)

// The document tree. Each output (a sheet, the index, the calc document) is built once as a
// format-neutral tree: the views (sheetView, docView and the node kinds they hold: groups of
// steps, steps, tables, figures, notes) whose leaves are inline runs. The printers of the
// formats walk the same tree: the templates of each format print one node kind per named
// template, and printer.inline prints the leaves with the format's markup. Nothing in the tree
// is escaped or laid out for a format, and no engineering value is computed here.

// inline is a run of content: text, symbols, numbers, formulas, links, anchors, pictures.
type inline []span

type spanKind uint8

const (
	sText    spanKind = iota // plain text, escaped by the printer
	sRich                    // engine text in which symbols like "f_cd" are set as symbols
	sSym                     // a symbol such as "M_Ed,y"
	sNum                     // a number in running text
	sQty                     // a value in engine units, shown in display units
	sFormula                 // a formula laid out from pieces
	sLink                    // inner linked to a target
	sAnchor                  // a link target (text: its name)
	sChanged                 // inner, changed since the previous revision
	sPicture                 // a drawing: a diagram or a section sketch
	sListing                 // one line of a verbatim listing
)

type span struct {
	kind   spanKind
	text   string  // the text; for sNum the mantissa (num.m), for sQty the engine unit
	e      int     // sNum: the power of ten (num.e)
	v      float64 // sQty: the value in engine units
	pieces []piece // sFormula
	inner  inline  // sLink, sChanged
	to     *target // sLink
	fig    drawing // sPicture
}

// drawing is a picture that prints itself for each format: an inline SVG element, or TikZ
// (pgfplots for a diagram) for LaTeX. An interaction diagram and a section sketch are drawings.
type drawing interface {
	SVG() string
	PGF() string
}

// drawn is a drawing printed once per form: the tree of a page is printed in every format,
// and Markdown and HTML both show the SVG. It may be printed on several goroutines at once.
type drawn struct {
	g        drawing
	svg, pgf sync.Once
	s, p     string
}

func (d *drawn) SVG() string {
	d.svg.Do(func() { d.s = d.g.SVG() })
	return d.s
}

func (d *drawn) PGF() string {
	d.pgf.Do(func() { d.p = d.g.PGF() })
	return d.p
}

// target is where a link leads: an anchor on a sheet of the same set ("" for the page being
// printed, "index" for the index sheet) or, with file set, a per-lift sheet that the calc
// document names (printed per format: ../md/X.md, ../html/X.html, or no link in LaTeX).
type target struct {
	sheet, anchor string
	file          string
}

func txt(s string) inline     { return inline{{kind: sText, text: s}} }
func rich(s string) inline    { return inline{{kind: sRich, text: s}} }
func sym(s string) inline     { return inline{{kind: sSym, text: s}} }
func numv(n num) inline       { return inline{{kind: sNum, text: n.m, e: n.e}} }
func listing(s string) inline { return inline{{kind: sListing, text: s}} }
func anchor(name string) inline {
	return inline{{kind: sAnchor, text: name}}
}
func qty(v float64, u string) inline      { return inline{{kind: sQty, v: v, text: u}} }
func formula(ps []piece) inline           { return inline{{kind: sFormula, pieces: ps}} }
func link(label inline, to target) inline { return inline{{kind: sLink, inner: label, to: &to}} }
func changed(in inline) inline            { return inline{{kind: sChanged, inner: in}} }
func picture(g drawing) inline            { return inline{{kind: sPicture, fig: &drawn{g: g}}} }

// cat joins runs.
func cat(parts ...inline) inline {
	n := 0
	for _, p := range parts {
		n += len(p)
	}
	if n == 0 {
		return nil
	}
	out := make(inline, 0, n)
	for _, p := range parts {
		out = append(out, p...)
	}
	return out
}

// join joins runs with a separator.
func join(parts []inline, sep inline) inline {
	n := 0
	for i, p := range parts {
		if i > 0 {
			n += len(sep)
		}
		n += len(p)
	}
	if n == 0 {
		return nil
	}
	out := make(inline, 0, n)
	for i, p := range parts {
		if i > 0 {
			out = append(out, sep...)
		}
		out = append(out, p...)
	}
	return out
}

// times writes two quantities as a section is written, "400 mm × 600 mm".
func times(a, b inline) inline { return cat(a, txt(" × "), b) }

// empty reports whether the run holds nothing.
func (in inline) empty() bool { return len(in) == 0 }

// printer prints the leaves of the document tree in one format.
type printer struct {
	m    markup
	link func(target) string // a link's target as the format writes it; "" for none
}

// inline prints a run.
func (p printer) inline(in inline) string {
	switch len(in) {
	case 0:
		return ""
	case 1:
		return p.printSpan(in[0])
	}
	var b strings.Builder
	for _, s := range in {
		b.WriteString(p.printSpan(s))
	}
	return b.String()
}

// printSpan prints one span of a run.
func (p printer) printSpan(s span) string {
	switch s.kind {
	case sText:
		return p.m.text(s.text)
	case sRich:
		return p.m.rich(s.text)
	case sSym:
		return p.m.sym(s.text)
	case sNum:
		return p.m.num(num{m: s.text, e: s.e})
	case sQty:
		return p.m.qty(s.v, s.text)
	case sFormula:
		return p.m.formula(s.pieces)
	case sLink:
		return p.m.link(p.inline(s.inner), p.link(*s.to))
	case sAnchor:
		return p.m.anchor(s.text)
	case sChanged:
		return p.m.changed(p.inline(s.inner))
	case sPicture:
		return p.m.picture(s.fig)
	case sListing:
		return p.m.listing(s.text)
	}
	return ""
}

// inlines prints a list of runs.
func (p printer) inlines(ins []inline) []string {
	out := make([]string, len(ins))
	for i, in := range ins {
		out[i] = p.inline(in)
	}
	return out
}
