package reports

import (
	"fmt"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/calc/trace"
	"colsheet/templates"
)

// docView is the calc document: the title sheet, contents, design basis, the input as read,
// one section per design, the schedule and the list of failures and warnings.
type docView struct {
	sheetView              // the title block, cautions, basis, schedule, sizes and the count of failures, as on the index
	Status    string       // PASS or FAIL for the whole package
	Contents  []contentRow // one per design
	Materials []kv
	Tables    []tableView    // the input as read, with units
	Listing   []string       // the input file's lines, marked up
	Fence     string         // Markdown: a code fence longer than any run of '~' in the listing
	Revision  *tableView     // the changes since the previous revision (--against), read first
	TakeDown  []tableView    // building form: the summary, then one take-down table per column
	Moments   []tableView    // building form: the column moments per column and direction
	Groups    []groupSection // the column groups, each with its governing lift in full
	Failing   []noteRow      // failing designs and their reasons
	Warnings  []noteRow      // designs with cautions
}

// groupSection is one column group of the calc document: its heading, a row per lift and the
// sheet of its governing lift.
type groupSection struct {
	Anchor, Target string // the group's link target, marked up, and the link to it
	Title          string // "Group 3: 450 × 450, 8 Ø20, links Ø8 @ 300; 23 lifts"
	Name           string // "Group 3"
	Governing      string // the governing lift, "B2/L1"
	Rows           []groupRow
	Sheet          sheetView // the governing lift
}

// groupRow is one lift of a group: its values and a link to its own sheet.
type groupRow struct {
	Lift, NEd, MEdY, MEdZ, MRdY, MRdZ, Utilization, Governing, Status string
	Failed                                                            bool
}

// contentRow is one group's line in the contents, linked to its section.
type contentRow struct {
	Group, Section, Bars, Lifts, Governing, Utilization, Status string
	Failed                                                      bool
}

// tableView is a table of the input as read: a title, the column heads and the rows, all marked up.
type tableView struct {
	Title   string
	Head    []string
	Rows    [][]string
	Align   string // LaTeX column specification
	Formula string // the rule of the rows, shown once above the table
}

// noteRow is a design (Subject, linked to its section) with the reasons it fails or the cautions it carries.
type noteRow struct {
	Target, Subject string
	Items           []string
}

// document builds the view of the calc document for markup m: the lifts in their column
// groups, each group's governing lift in full and the others as a row each.
func document(m markup, r *design.Result, b *book, p place) docView {
	in := input(r)
	idx := index(m, r, func(name string) string { return "#" + anchorName("d-", name) }, b, p)
	idx.Subject, idx.PlainSubject = m.text("Calculation package"), "Calculation package"
	idx.Sheet, idx.SheetNo = m.text("calc document"), m.text("—")
	idx.Sec1, idx.Sec2 = "section", "subsection*"
	idx.ScheduleLast = false
	v := docView{sheetView: idx, Status: "PASS"}
	if idx.AnyFail {
		v.Status = "FAIL"
	}
	if rv := p.opt.Revision; rv != nil {
		t := tableView{Title: m.text("Changes since the previous revision, " + rv.Against),
			Head: []string{m.text("Column"), m.text("Lift"), m.text("Item"), m.text("Previous"), m.text("This revision")}, Align: "llp{0.4\\linewidth}ll",
			Formula: m.text("Every value that changed is marked where it stands: highlighted in HTML, with a bar in the margin in the PDF.")}
		for _, row := range rv.Rows {
			t.Rows = append(t.Rows, []string{m.text(row.Column), m.text(row.Lift), m.rich(row.Item), m.text(row.Old), m.text(row.New)})
		}
		if len(rv.Rows) == 0 {
			t.Rows = [][]string{{m.text("—"), m.text("—"), m.text("no change: the same designs, inputs and results"), m.text("—"), m.text("—")}}
		}
		v.Revision = &t
	}
	gs := columnGroups(r)
	// The document prints the steps of each governing lift (brief or full) and links only to those.
	printed := map[string]bool{}
	for _, g := range gs {
		i := g.governing
		for k, s := range b.traces[i] {
			if p.opt.full() || briefStep(r.Designs[i].Steps[k]) {
				printed[s.ID] = true
			}
		}
	}
	// The take-down and the column moments as tables, whose cells are the steps' anchors.
	c := cells{m: m, b: b, printed: printed, opt: p.opt}
	v.TakeDown, v.Moments = takeDownTables(c), momentTables(c)
	p.printed = func(id string, _ trace.Step) bool { return printed[id] }
	governing := map[int]bool{}
	for _, g := range gs {
		governing[g.governing] = true
	}
	for n, g := range gs {
		gov := r.Designs[g.governing]
		target := "#" + anchorName("g-", itoa(n+1))
		sec := groupSection{Anchor: m.anchor(anchorName("g-", itoa(n+1))), Target: target, Name: m.text(g.name(n)), Title: m.text(g.title(n)),
			Governing: m.text(gov.Column + "/" + gov.Storey)}
		worst := design.StatusPass
		for _, i := range g.lifts {
			d := r.Designs[i]
			rs, rf := status(d.Status)
			if rf {
				worst = d.Status
			}
			label := m.text(d.Column + "/" + d.Storey)
			if p.file != nil {
				label = m.link(label, p.file(b.names[i]))
			}
			if i == g.governing {
				label = m.link(m.text(d.Column+"/"+d.Storey), "#"+anchorName("d-", b.names[i]))
			}
			sec.Rows = append(sec.Rows, groupRow{Lift: label, NEd: m.num(fmtNum(d.NEd / 1e3)), MEdY: m.num(fmtNum(d.Y.MEd / 1e6)), MEdZ: m.num(fmtNum(d.Z.MEd / 1e6)),
				MRdY: m.num(fmtNum(d.Y.MRd / 1e6)), MRdZ: m.num(fmtNum(d.Z.MRd / 1e6)), Utilization: m.num(fmtNum(d.Utilization)),
				Governing: dash(m, d.Governing), Status: rs, Failed: rf})
		}
		s := sheet(m, b, g.governing, p)
		s.H, s.Sec1, s.Sec2 = "##", "subsubsection*", "paragraph*"
		s.Anchor = m.anchor(anchorName("d-", b.names[g.governing]))
		sec.Sheet = s
		v.Groups = append(v.Groups, sec)
		gst, gfailed := status(worst)
		v.Contents = append(v.Contents, contentRow{Group: m.link(m.text(g.name(n)), target), Section: m.text(g.section()), Bars: m.text(g.cage()),
			Lifts: m.text(itoa(len(g.lifts))), Governing: m.link(m.text(gov.Column+"/"+gov.Storey), "#"+anchorName("d-", b.names[g.governing])),
			Utilization: m.num(fmtNum(gov.Utilization)), Status: gst, Failed: gfailed})
	}
	for i, d := range r.Designs {
		_, failed := status(d.Status)
		// A lift that is not its group's governing one is named by its group.
		target := "#" + anchorName("d-", b.names[i])
		if !governing[i] {
			target = "#" + anchorName("g-", itoa(groupOf(gs, i)+1))
		}
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

// DocumentMarkdown returns the calc document, every column group in one Markdown file (calc.md);
// the lifts that a group's calculation covers link to their own sheets in ../md/.
func DocumentMarkdown(r *design.Result, o Options) (Sheet, error) {
	b, err := docParts(md{}, r, [2]string{"{{", "}}"}, "md/common.md.tmpl", "md/doc.md.tmpl",
		place{onePage: true, opt: o, file: func(name string) string { return sheetDir + name + ".md" }})
	return Sheet{Name: "calc.md", Data: b}, err
}

// sheetDir is where the calc document finds the per-lift Markdown sheets.
const sheetDir = "../md/"

// DocumentLaTeX returns the calc document as one pdflatex document (calc.tex) with a table of
// contents and hyperlinks from every step to the steps it uses.
func DocumentLaTeX(r *design.Result, o Options) (Sheet, error) {
	b, err := docParts(tex{}, r, templates.TeXDelims, "tex/common.tex.tmpl", "tex/doc.tex.tmpl", place{onePage: true, opt: o})
	return Sheet{Name: "calc.tex", Data: b}, err
}

// Documents returns the calc document in each format asked for (md, tex, html), keyed by the
// format; the Markdown is rendered once and serves the HTML too.
func Documents(r *design.Result, formats map[string]bool, o Options) (map[string]Sheet, error) {
	out := map[string]Sheet{}
	if formats["md"] || formats["html"] {
		doc, err := DocumentMarkdown(r, o)
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
		doc, err := DocumentLaTeX(r, o)
		if err != nil {
			return nil, fmt.Errorf("tex: %v", err)
		}
		out["tex"] = doc
	}
	return out, nil
}
