package reports

import (
	"fmt"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// docView is the calc document: the title sheet, contents, design basis, the input as read,
// one section per design, the schedule and the list of failures and warnings.
type docView struct {
	sheetView              // the title block, cautions, basis, schedule, sizes and the count of failures, as on the index
	Status    string       // PASS or FAIL for the whole package
	Contents  []contentRow // one per group
	Materials []kv
	Tables    []tableView    // the input as read, with units
	Listing   []inline       // the input file's lines
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
	Anchor    inline // the group's link target
	Title     inline // "Group 3: 450 × 450, 8 Ø20, links Ø8 @ 300; 23 lifts"
	Name      inline // "Group 3"
	Governing inline // the governing lift, "B2/L1"
	Rows      []groupRow
	Sketch    []figureView // the section sketch of the group's cage, printed beside its table (the governing lift's)
	Sheet     sheetView    // the governing lift
}

// groupRow is one lift of a group: its values and a link to its own sheet.
type groupRow struct {
	Lift, NEd, MEdY, MEdZ, MRdY, MRdZ, Utilization, Governing inline
	Status                                                    string
	Failed                                                    bool
}

// contentRow is one group's line in the contents, linked to its section.
type contentRow struct {
	Group, Section, Bars, Lifts, Governing, Utilization inline
	Status                                              string
	Failed                                              bool
}

// tableView is a table: a title, the column heads and the rows.
type tableView struct {
	Title   inline
	Head    []inline
	Rows    [][]inline
	Align   string // LaTeX column specification
	Formula inline // the rule of the rows, shown once above the table
}

// noteRow is a design (Subject, linked to its section) with the reasons it fails or the cautions it carries.
type noteRow struct {
	Subject inline
	Items   []inline
}

// document builds the tree of the calc document: the lifts in their column groups, each
// group's governing lift in full and the others as a row each.
func document(r *design.Result, b *book, p place) docView {
	in := input(r)
	idx := index(r, func(name string) target { return target{anchor: anchorName("d-", name)} }, b, p)
	idx.Subject, idx.PlainSubject = txt("Calculation package"), "Calculation package"
	idx.Sheet, idx.SheetNo = txt("calc document"), txt("—")
	idx.Sec1, idx.Sec2 = "section", "subsection*"
	idx.ScheduleLast = false
	v := docView{sheetView: idx, Status: "PASS"}
	if idx.AnyFail {
		v.Status = "FAIL"
	}
	if rv := p.opt.Revision; rv != nil {
		t := tableView{Title: txt("Changes since the previous revision, " + rv.Against),
			Head: []inline{txt("Column"), txt("Lift"), txt("Item"), txt("Previous"), txt("This revision")}, Align: "llp{0.4\\linewidth}ll",
			Formula: txt("Every value that changed is marked where it stands: highlighted in HTML, with a bar in the margin in the PDF.")}
		for _, row := range rv.Rows {
			t.Rows = append(t.Rows, []inline{txt(row.Column), txt(row.Lift), rich(row.Item), txt(row.Old), txt(row.New)})
		}
		if len(rv.Rows) == 0 {
			t.Rows = [][]inline{{txt("—"), txt("—"), txt("no change: the same designs, inputs and results"), txt("—"), txt("—")}}
		}
		v.Revision = &t
	}
	gs := columnGroups(r)
	// The document prints the steps of each governing lift (brief or full) and links only to those.
	printed := map[string]bool{}
	for _, g := range gs {
		i := g.governing
		prefix := b.prefix(i)
		for _, s := range b.design(i).Steps {
			if p.opt.full() || briefStep(s) {
				printed[prefix+s.ID] = true
			}
		}
	}
	// The take-down and the column moments as tables, whose cells are the steps' anchors.
	c := cells{b: b, printed: printed, opt: p.opt}
	v.TakeDown, v.Moments = takeDownTables(c), momentTables(c)
	p.printed = func(id string, _ trace.Step) bool { return printed[id] }
	governing := map[int]bool{}
	for _, g := range gs {
		governing[g.governing] = true
	}
	for n, g := range gs {
		gov := r.Designs[g.governing]
		to := target{anchor: anchorName("g-", itoa(n+1))}
		sec := groupSection{Anchor: anchor(anchorName("g-", itoa(n+1))), Name: txt(g.name(n)), Title: txt(g.title(n)),
			Governing: txt(gov.Column + "/" + gov.Storey)}
		worst := design.StatusPass
		for _, i := range g.lifts {
			d := r.Designs[i]
			rs, rf := status(d.Status)
			if rf {
				worst = d.Status
			}
			label := link(txt(d.Column+"/"+d.Storey), target{file: b.names[i]})
			if i == g.governing {
				label = link(txt(d.Column+"/"+d.Storey), target{anchor: anchorName("d-", b.names[i])})
			}
			sec.Rows = append(sec.Rows, groupRow{Lift: label, NEd: numv(fmtNum(d.NEd / 1e3)), MEdY: numv(fmtNum(d.Y.MEd / 1e6)), MEdZ: numv(fmtNum(d.Z.MEd / 1e6)),
				MRdY: numv(fmtNum(d.Y.MRd / 1e6)), MRdZ: numv(fmtNum(d.Z.MRd / 1e6)), Utilization: numv(fmtNum(d.Utilization)),
				Governing: dash(d.Governing), Status: rs, Failed: rf})
		}
		s := sheet(b, g.governing, p)
		s.H, s.Sec1, s.Sec2 = "##", "subsubsection*", "paragraph*"
		s.Anchor = anchor(anchorName("d-", b.names[g.governing]))
		sec.Sketch, s.Sketch = s.Sketch, nil // the group's cage is drawn once, beside its table
		sec.Sheet = s
		v.Groups = append(v.Groups, sec)
		gst, gfailed := status(worst)
		v.Contents = append(v.Contents, contentRow{Group: link(txt(g.name(n)), to), Section: txt(g.section()), Bars: txt(g.cage()),
			Lifts: txt(itoa(len(g.lifts))), Governing: link(txt(gov.Column+"/"+gov.Storey), target{anchor: anchorName("d-", b.names[g.governing])}),
			Utilization: numv(fmtNum(gov.Utilization)), Status: gst, Failed: gfailed})
	}
	for i, d := range r.Designs {
		_, failed := status(d.Status)
		// A lift that is not its group's governing one is named by its group.
		to := target{anchor: anchorName("d-", b.names[i])}
		if !governing[i] {
			to = target{anchor: anchorName("g-", itoa(groupOf(gs, i)+1))}
		}
		if failed {
			v.Failing = append(v.Failing, noteRow{Subject: link(txt(subject(d)), to), Items: texts(d.Reasons)})
		}
		if len(d.Cautions) > 0 {
			v.Warnings = append(v.Warnings, noteRow{Subject: link(txt(subject(d)), to), Items: texts(d.Cautions)})
		}
	}
	mat := in.Materials
	v.Materials = []kv{
		{txt("Concrete"), dash(mat.Concrete.Class)},
		{rich("f_ck"), qty(mat.Concrete.Fck, "MPa")},
		{rich("f_yk"), qty(mat.Fyk, "MPa")},
		{rich("Aggregate d_g"), qty(mat.Aggregate, "mm")},
	}
	v.Tables = inputTables(in)
	v.Fence = "~~~"
	for strings.Contains(in.Source, v.Fence) {
		v.Fence += "~"
	}
	lines := strings.Split(strings.TrimRight(strings.ReplaceAll(in.Source, "\r\n", "\n"), "\n"), "\n")
	if in.Source == "" {
		lines = nil
	}
	for k, line := range lines {
		v.Listing = append(v.Listing, listing(fmt.Sprintf("%4d  %s", k+1, strings.ReplaceAll(line, "\t", "    "))))
	}
	return v
}

// inputTables lays out the quantities of the input as read, in the trade's units.
func inputTables(in *model.Input) []tableView {
	q := func(v float64, u string) inline {
		if v == 0 {
			return txt("–")
		}
		return qty(v, u)
	}
	heads := func(hs ...string) []inline {
		var out []inline
		for _, h := range hs {
			out = append(out, rich(h))
		}
		return out
	}
	var out []tableView
	if b := in.Building; b != nil {
		t := tableView{Title: txt("Storeys (lowest first; a lift is named by the level at its top)"), Head: heads("Level", "Height of the lift"), Align: "lr"}
		for _, l := range b.Storeys {
			t.Rows = append(t.Rows, []inline{txt(l.Name), qty(l.Height, "mm")})
		}
		out = append(out, t)
		bays := func(ws []float64) inline {
			var s []inline
			for _, w := range ws {
				s = append(s, qty(w, "mm"))
			}
			return join(s, txt(", "))
		}
		g := tableView{Title: txt("Grid, members and analysis"), Head: heads("Item", "As read"), Align: "ll"}
		g.Rows = [][]inline{
			{txt("Bays along x"), bays(b.GridX)},
			{txt("Bays along y"), bays(b.GridY)},
			{txt("Columns b × h (default)"), sizeInline(b.Column)},
			{txt("Cover to the links"), qty(b.Cover, "mm")},
			{txt("Beams b × h (default)"), times(qty(b.Beam.B, "mm"), qty(b.Beam.H, "mm"))},
			{txt("Grid points without a column"), dash(strings.Join(b.Omit, ", "))},
			{txt("Base"), dash(b.Base)},
			{txt("Column moments"), dash(b.Analysis)},
		}
		for _, c := range b.Columns {
			g.Rows = append(g.Rows, []inline{txt("Columns " + all(c.IDs) + " at " + all(c.Levels)), sizeInline(c.Size)})
		}
		for _, c := range b.Beams {
			dir := c.Dir
			if dir == "" {
				dir = "x and y"
			}
			g.Rows = append(g.Rows, []inline{txt("Beams along " + dir + " on lines " + all(c.Lines) + " at " + all(c.Levels)), times(qty(c.B, "mm"), qty(c.H, "mm"))})
		}
		for _, x := range b.Fires {
			r := txt("none")
			if x.Fire.Rating > 0 {
				r = txt(fmt.Sprintf("R%d", x.Fire.Rating))
			}
			g.Rows = append(g.Rows, []inline{txt("Fire resistance at " + all(x.Levels)), r})
		}
		out = append(out, g)
		f := tableView{Title: txt("Floor loads (gk without the self-weight of beams and columns)"),
			Head: heads("Levels", "g_k", "q_k", "Category", "Spans"), Align: "lrrll"}
		for _, x := range b.Floors {
			f.Rows = append(f.Rows, []inline{txt(all(x.Levels)), qty(x.Gk, "N/mm2"), qty(x.Qk, "N/mm2"), txt(x.Category), txt(x.Spans)})
		}
		out = append(out, f)
		if len(b.Lines) > 0 {
			l := tableView{Title: txt("Line loads"), Head: heads("Levels", "Line", "g_k", "q_k"), Align: "llrr"}
			for _, x := range b.Lines {
				l.Rows = append(l.Rows, []inline{txt(all(x.Levels)), txt(x.GridLine), qty(x.Gk, "N/mm"), q(x.Qk, "N/mm")})
			}
			out = append(out, l)
		}
		return out
	}
	t := tableView{Title: txt("Columns and their actions (first-order end moments, top and bottom)"),
		Head:  heads("Column", "Lift", "b × h", "Cover", "Bars given", "l_0,y", "l_0,z", "N_Ed", "M_y top", "M_y bottom", "M_z top", "M_z bottom", "φ_ef"),
		Align: "llllrrrrrrrrr"}
	for _, c := range in.Columns {
		bars := txt("–")
		if c.Bars != nil {
			bars = txt(fmt.Sprintf("%d Ø%s", c.Bars.Count, fmtNum(c.Bars.Dia).plain()))
		}
		for _, s := range c.Storeys {
			phi := txt("–")
			if s.HasPhi {
				phi = numv(fmtNum(s.PhiEf))
			}
			t.Rows = append(t.Rows, []inline{txt(c.ID), txt(s.Name), sizeInline(model.Size{B: c.B, H: c.H, Shape: c.Shape}), qty(c.Cover, "mm"), bars,
				qty(s.L0Y, "mm"), qty(s.L0Z, "mm"), qty(s.NEd, "N"), qty(s.MY.Top, "Nmm"), qty(s.MY.Bottom, "Nmm"),
				qty(s.MZ.Top, "Nmm"), qty(s.MZ.Bottom, "Nmm"), phi})
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
