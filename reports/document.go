package reports

import (
	"fmt"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/templates"
)

// docView is the calc document: the title sheet, contents, design basis, the input as read,
// one section per design, the schedule and the list of failures and warnings.
type docView struct {
	sheetView              // the title block, cautions, basis, schedule, sizes and the count of failures, as on the index
	Status    string       // PASS or FAIL for the whole package
	Contents  []contentRow // one per design
	Materials []kv
	Tables    []tableView // the input as read, with units
	Listing   []string    // the input file's lines, marked up
	Fence     string      // Markdown: a code fence longer than any run of '~' in the listing
	Sections  []sheetView // one per design
	Failing   []noteRow   // failing designs and their reasons
	Warnings  []noteRow   // designs with cautions
}

// contentRow is one design's line in the contents; Column and Storey are linked to its section.
type contentRow struct {
	Target, Column, Storey, Section, Utilization, Status string
	Failed                                               bool
}

// tableView is a table of the input as read: a title, the column heads and the rows, all marked up.
type tableView struct {
	Title string
	Head  []string
	Rows  [][]string
	Align string // LaTeX column specification
}

// noteRow is a design (Subject, linked to its section) with the reasons it fails or the cautions it carries.
type noteRow struct {
	Target, Subject string
	Items           []string
}

// document builds the view of the calc document for markup m.
func document(m markup, r *design.Result, b *book, p place) docView {
	in := input(r)
	idx := index(m, r, func(name string) string { return "#" + anchorName("d-", name) })
	idx.Subject = m.text("Calculation package")
	idx.Sheet, idx.SheetNo = m.text("calc document"), m.text("—")
	idx.Sec1, idx.Sec2 = "section", "subsection*"
	v := docView{sheetView: idx, Status: "PASS"}
	if idx.AnyFail {
		v.Status = "FAIL"
	}
	for i, d := range r.Designs {
		target := "#" + anchorName("d-", b.names[i])
		st, failed := status(d.Status)
		v.Contents = append(v.Contents, contentRow{Target: target, Column: m.link(m.text(d.Column), target), Storey: m.link(m.text(d.Storey), target),
			Section: m.text(fmtNum(d.B).plain() + " × " + fmtNum(d.H).plain()), Utilization: m.num(fmtNum(d.Utilization)),
			Status: st, Failed: failed})
		s := sheet(m, b, i, p)
		s.H, s.Sec1, s.Sec2 = "#", "subsection*", "subsubsection*"
		s.Anchor = m.anchor(anchorName("d-", b.names[i]))
		v.Sections = append(v.Sections, s)
		if failed {
			v.Failing = append(v.Failing, noteRow{Target: target, Subject: m.link(m.text(subject(d)), target), Items: texts(m, d.Reasons)})
		}
		if len(d.Cautions) > 0 {
			v.Warnings = append(v.Warnings, noteRow{Target: target, Subject: m.link(m.text(subject(d)), target), Items: texts(m, d.Cautions)})
		}
	}
	mat := in.Materials
	v.Materials = []kv{
		{m.text("Concrete"), dash(m, mat.Concrete.Class)},
		{m.rich("f_ck"), m.qty(mat.Concrete.Fck, "MPa")},
		{m.rich("f_yk"), m.qty(mat.Fyk, "MPa")},
		{m.rich("Aggregate d_g"), m.qty(mat.Aggregate, "mm")},
	}
	v.Tables = inputTables(m, in)
	v.Fence = "~~~"
	for strings.Contains(in.Source, v.Fence) {
		v.Fence += "~"
	}
	lines := strings.Split(strings.TrimRight(strings.ReplaceAll(in.Source, "\r\n", "\n"), "\n"), "\n")
	if in.Source == "" {
		lines = nil
	}
	for k, line := range lines {
		v.Listing = append(v.Listing, m.listing(fmt.Sprintf("%4d  %s", k+1, strings.ReplaceAll(line, "\t", "    "))))
	}
	return v
}

// inputTables lays out the quantities of the input as read, in the trade's units.
func inputTables(m markup, in *model.Input) []tableView {
	q := func(v float64, u string) string {
		if v == 0 {
			return m.text("–")
		}
		return m.qty(v, u)
	}
	heads := func(hs ...string) []string {
		var out []string
		for _, h := range hs {
			out = append(out, m.rich(h))
		}
		return out
	}
	var out []tableView
	if b := in.Building; b != nil {
		t := tableView{Title: m.text("Storeys (lowest first; a lift is named by the level at its top)"), Head: heads("Level", "Height of the lift"), Align: "lr"}
		for _, l := range b.Storeys {
			t.Rows = append(t.Rows, []string{m.text(l.Name), m.qty(l.Height, "mm")})
		}
		out = append(out, t)
		bays := func(ws []float64) string {
			var s []string
			for _, w := range ws {
				s = append(s, m.qty(w, "mm"))
			}
			return strings.Join(s, ", ")
		}
		g := tableView{Title: m.text("Grid, members and analysis"), Head: heads("Item", "As read"), Align: "ll"}
		g.Rows = [][]string{
			{m.text("Bays along x"), bays(b.GridX)},
			{m.text("Bays along y"), bays(b.GridY)},
			{m.text("Columns b × h (default)"), m.qty(b.Column.B, "mm") + " × " + m.qty(b.Column.H, "mm")},
			{m.text("Cover to the links"), m.qty(b.Cover, "mm")},
			{m.text("Beams b × h (default)"), m.qty(b.Beam.B, "mm") + " × " + m.qty(b.Beam.H, "mm")},
			{m.text("Grid points without a column"), dash(m, strings.Join(b.Omit, ", "))},
			{m.text("Base"), dash(m, b.Base)},
			{m.text("Column moments"), dash(m, b.Analysis)},
		}
		for _, c := range b.Columns {
			g.Rows = append(g.Rows, []string{m.text("Columns " + all(c.IDs) + " at " + all(c.Levels)), m.qty(c.B, "mm") + " × " + m.qty(c.H, "mm")})
		}
		for _, c := range b.Beams {
			dir := c.Dir
			if dir == "" {
				dir = "x and y"
			}
			g.Rows = append(g.Rows, []string{m.text("Beams along " + dir + " on lines " + all(c.Lines) + " at " + all(c.Levels)), m.qty(c.B, "mm") + " × " + m.qty(c.H, "mm")})
		}
		for _, x := range b.Fires {
			r := m.text("none")
			if x.Fire.Rating > 0 {
				r = m.text(fmt.Sprintf("R%d", x.Fire.Rating))
			}
			g.Rows = append(g.Rows, []string{m.text("Fire resistance at " + all(x.Levels)), r})
		}
		out = append(out, g)
		f := tableView{Title: m.text("Floor loads (gk without the self-weight of beams and columns)"),
			Head: heads("Levels", "g_k", "q_k", "Category", "Spans"), Align: "lrrll"}
		for _, x := range b.Floors {
			f.Rows = append(f.Rows, []string{m.text(all(x.Levels)), m.qty(x.Gk, "N/mm2"), m.qty(x.Qk, "N/mm2"), m.text(x.Category), m.text(x.Spans)})
		}
		out = append(out, f)
		if len(b.Lines) > 0 {
			l := tableView{Title: m.text("Line loads"), Head: heads("Levels", "Line", "g_k", "q_k"), Align: "llrr"}
			for _, x := range b.Lines {
				l.Rows = append(l.Rows, []string{m.text(all(x.Levels)), m.text(x.GridLine), m.qty(x.Gk, "N/mm"), q(x.Qk, "N/mm")})
			}
			out = append(out, l)
		}
		return out
	}
	t := tableView{Title: m.text("Columns and their actions (first-order end moments, top and bottom)"),
		Head:  heads("Column", "Lift", "b × h", "Cover", "Bars given", "l_0,y", "l_0,z", "N_Ed", "M_y top", "M_y bottom", "M_z top", "M_z bottom", "φ_ef"),
		Align: "llllrrrrrrrrr"}
	for _, c := range in.Columns {
		bars := m.text("–")
		if c.Bars != nil {
			bars = m.text(fmt.Sprintf("%d Ø%s", c.Bars.Count, fmtNum(c.Bars.Dia).plain()))
		}
		for _, s := range c.Storeys {
			phi := m.text("–")
			if s.HasPhi {
				phi = m.num(fmtNum(s.PhiEf))
			}
			t.Rows = append(t.Rows, []string{m.text(c.ID), m.text(s.Name), m.qty(c.B, "mm") + " × " + m.qty(c.H, "mm"), m.qty(c.Cover, "mm"), bars,
				m.qty(s.L0Y, "mm"), m.qty(s.L0Z, "mm"), m.qty(s.NEd, "N"), m.qty(s.MY.Top, "Nmm"), m.qty(s.MY.Bottom, "Nmm"),
				m.qty(s.MZ.Top, "Nmm"), m.qty(s.MZ.Bottom, "Nmm"), phi})
		}
	}
	if len(t.Rows) == 0 {
		return out
	}
	return append(out, t)
}

// all joins names, or says "all" for none.
func all(names []string) string {
	if len(names) == 0 {
		return "all"
	}
	return strings.Join(names, ", ")
}

// docParts renders the calc document with the given templates.
func docParts(m markup, r *design.Result, delims [2]string, common, docT string, p place) ([]byte, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	t, err := parse(delims, common, docT)
	if err != nil {
		return nil, err
	}
	return execute(t, docT, document(m, r, newBook(r), p))
}

// DocumentMarkdown returns the calc document, every design in one Markdown file (calc.md).
func DocumentMarkdown(r *design.Result) (Sheet, error) {
	b, err := docParts(md{}, r, [2]string{"{{", "}}"}, "md/common.md.tmpl", "md/doc.md.tmpl", place{onePage: true})
	return Sheet{Name: "calc.md", Data: b}, err
}

// DocumentLaTeX returns the calc document as one pdflatex document (calc.tex) with a table of
// contents and hyperlinks from every step to the steps it uses.
func DocumentLaTeX(r *design.Result) (Sheet, error) {
	b, err := docParts(tex{}, r, templates.TeXDelims, "tex/common.tex.tmpl", "tex/doc.tex.tmpl", place{onePage: true})
	return Sheet{Name: "calc.tex", Data: b}, err
}

// Documents returns the calc document in each format asked for (md, tex, html), keyed by the
// format; the Markdown is rendered once and serves the HTML too.
func Documents(r *design.Result, formats map[string]bool) (map[string]Sheet, error) {
	out := map[string]Sheet{}
	if formats["md"] || formats["html"] {
		doc, err := DocumentMarkdown(r)
		if err != nil {
			return nil, fmt.Errorf("md: %v", err)
		}
		if formats["md"] {
			out["md"] = doc
		}
		if formats["html"] {
			if out["html"], err = documentHTML(r, doc); err != nil {
				return nil, fmt.Errorf("html: %v", err)
			}
		}
	}
	if formats["tex"] {
		doc, err := DocumentLaTeX(r)
		if err != nil {
			return nil, fmt.Errorf("tex: %v", err)
		}
		out["tex"] = doc
	}
	return out, nil
}
