package reports

import (
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/trace"
)

// The calc document lays out the take-down and the column moments of the building form as
// tables, the way a hand calculation does: one row per lift, one cell per traced step. Each
// cell carries its step's anchor, so that the lifts' steps link to it.

// column is one column of the building with its designs, lowest lift first.
type column struct {
	id      string
	designs []int
}

// columnsOf returns the columns of r in the order of the result.
func columnsOf(r *design.Result) []column {
	var out []column
	at := map[string]int{}
	for i, d := range r.Designs {
		n, ok := at[d.Column]
		if !ok {
			n = len(out)
			at[d.Column] = n
			out = append(out, column{id: d.Column})
		}
		out[n].designs = append(out[n].designs, i)
	}
	return out
}

// cells finds the steps of design i by their own IDs and marks up table cells of their values.
type cells struct {
	b       *book
	printed map[string]bool // the steps the document prints, where links may land
	opt     Options         // for the revision marks
}

// find returns the step of design i with the own ID local.
func (c cells) find(i int, local string) (trace.Step, bool) {
	for s := range c.b.steps(i) {
		if s.ID == local {
			return design.WholeStep(c.b.prefix(i), s), true
		}
	}
	return trace.Step{}, false
}

// cell returns the value of the step of design i with the own ID local in display units,
// with the step's anchor, and records the step as printed; "–" where there is none.
func (c cells) cell(i int, local string) inline {
	return c.matching(i, func(id string) bool { return id == local })
}

// value marks up one step's value as a table cell: its anchor, its value in display units,
// marked where it changed since the previous revision; the step counts as printed.
func (c cells) value(s trace.Step) inline {
	c.printed[s.ID] = true
	v, _ := quantityOf(s.Value, s.Unit, s.Symbol)
	out := numv(v)
	if c.opt.changed(s.ID, s.Value) {
		out = changed(out)
	}
	return cat(anchor(anchorName("s-", s.ID)), out)
}

// matching returns the cells of the steps of design i whose own IDs match the pattern, joined.
func (c cells) matching(i int, pattern func(id string) bool) inline {
	return c.joined(i, pattern, c.value)
}

// joined marks up each step of design i whose own ID matches the pattern with mark, joined by
// " + "; "–" where none matches.
func (c cells) joined(i int, pattern func(id string) bool, mark func(trace.Step) inline) inline {
	var parts []inline
	prefix := c.b.prefix(i)
	for s := range c.b.steps(i) {
		if pattern(s.ID) {
			parts = append(parts, mark(design.WholeStep(prefix, s)))
		}
	}
	if len(parts) == 0 {
		return txt("–")
	}
	return join(parts, txt(" + "))
}

// tableStep reports whether the step of own ID id is one the tables below read: of the
// take-down (td/) or of the column moments (subx/, suby/: subframe; frm/: frame line). A design
// let go by SheetStream keeps these steps for them.
func tableStep(id string) bool {
	for _, p := range [...]string{"td/", "subx/", "suby/", "frm/"} {
		if strings.HasPrefix(id, p) {
			return true
		}
	}
	return false
}

// takeDownTables returns, for the building form, one take-down table per column (top lift
// first, as the loads come down) and the building's summary.
func takeDownTables(c cells) []tableView {
	r := c.b.r
	if r.Building == nil {
		return nil
	}
	var out []tableView
	summary := tableView{Title: txt("Take-down summary: the loads at the foot of each column"),
		Head:  []inline{txt("Column"), rich("ΣG_k (kN)"), rich("ΣQ_k (kN)"), rich("N_Ed (kN)")},
		Align: "lrrr"}
	for _, col := range columnsOf(r) {
		t := tableView{Title: txt("Column " + col.id),
			Head: []inline{txt("Lift"), rich("G_level (kN)"), rich("Q_level (kN)"), rich("G_col (kN)"),
				rich("ΣG_k (kN)"), rich("ΣQ_k (kN)"), rich("α (αA, αn)"), rich("N_Ed (kN)")},
			Align:   "lrrrrrrr",
			Formula: rich("Per lift, top down: ΣG_k = G_level + G_col + ΣG_k of the lift above; ΣQ_k = Q_level + ΣQ_k of the lift above (by category); N_Ed by the combination of the design basis, with the reduction α where asked."),
		}
		// A column that receives the load of a column stopping on its beams: the transferred loads
		// in columns of their own.
		xfer := false
		for _, i := range col.designs {
			for st := range c.b.steps(i) {
				if strings.HasPrefix(st.ID, "td/"+r.Designs[i].Storey+"/xfer/") {
					xfer = true
				}
			}
		}
		if xfer {
			t.Head = append(t.Head[:3:3], append([]inline{rich("G_xfer (kN)"), rich("Q_xfer (kN)")}, t.Head[3:]...)...)
			t.Align = "lrrrrrrrrr"
			t.Formula = rich("Per lift, top down: ΣG_k = G_level + G_xfer + G_col + ΣG_k of the lift above; ΣQ_k = Q_level + Q_xfer + ΣQ_k of the lift above (by category), xfer the loads of columns stopping on the beams of the level; N_Ed by the combination of the design basis, with the reduction α where asked.")
		}
		for k := len(col.designs) - 1; k >= 0; k-- {
			i := col.designs[k]
			d := r.Designs[i]
			lv := "td/" + d.Storey + "/"
			row := []inline{txt(d.Storey),
				c.cell(i, lv+"G"),
				c.matching(i, func(id string) bool { return strings.HasPrefix(id, lv+"Q") && !strings.HasPrefix(id, lv+"Q_") })}
			if xfer {
				row = append(row, c.matching(i, func(id string) bool { return id == lv+"xfer/G" }),
					c.matching(i, func(id string) bool { return strings.HasPrefix(id, lv+"xfer/Q") }))
			}
			t.Rows = append(t.Rows, append(row,
				c.cell(i, "td/G_col"),
				c.cell(i, "td/G_cum"),
				c.matching(i, func(id string) bool { return strings.HasPrefix(id, "td/Q_cum_") }),
				c.matching(i, func(id string) bool {
					return strings.HasPrefix(id, lv+"alpha_A_") || strings.HasPrefix(id, "td/alpha_n_")
				}),
				c.cell(i, "td/NEd")))
		}
		out = append(out, t)
		foot := col.designs[0]
		summary.Rows = append(summary.Rows, []inline{txt(col.id), c.plain(foot, "td/G_cum"),
			c.plainMatching(foot, func(id string) bool { return strings.HasPrefix(id, "td/Q_cum_") }), c.plain(foot, "td/NEd")})
	}
	return append([]tableView{summary}, out...)
}

// plain returns the value of a step as a link to its cell elsewhere in the document.
func (c cells) plain(i int, local string) inline {
	return c.plainMatching(i, func(id string) bool { return id == local })
}

// plainMatching is plain for the sum of the steps matching a pattern, each linked to its cell.
func (c cells) plainMatching(i int, pattern func(id string) bool) inline {
	return c.joined(i, pattern, func(s trace.Step) inline {
		v, _ := quantityOf(s.Value, s.Unit, s.Symbol)
		return link(numv(v), target{anchor: anchorName("s-", s.ID)})
	})
}

// momentTables returns, for the building form, the column moments of each column and
// direction: for the subframe the joint's stiffnesses, fixed-end moments, unbalanced moment and
// the columns' shares; for the frame analysis the end moments of each lift.
func momentTables(c cells) []tableView {
	r := c.b.r
	if r.Building == nil {
		return nil
	}
	var out []tableView
	for _, col := range columnsOf(r) {
		for _, d := range []struct{ dir, axis string }{{"x", "y"}, {"y", "z"}} {
			sub := "sub" + d.dir + "/"
			t := tableView{Title: txt("Column " + col.id + ", bending about " + d.axis + " (frames along " + d.dir + ")")}
			frame := false
			if _, ok := c.find(col.designs[0], "frm/"+d.dir+"/top"); ok {
				frame = true
			}
			if frame {
				t.Head = []inline{txt("Lift"), rich("M_top (kNm)"), rich("M_bottom (kNm)"), rich("M_top,inf (kNm)"), rich("M_bottom,inf (kNm)")}
				t.Align = "lrrrr"
				t.Formula = rich("Clockwise end moments of the lift's column from the frame line solved whole: at each end the envelope of every arrangement of the spans (superposition); ,inf with γ_G,inf on every span. The spans each arrangement loads are named on the governing lift's sheet.")
			} else {
				t.Head = []inline{txt("Level"), txt("Beams 1, 2"), rich("k_b,1"), rich("k_b,2"), rich("k_above"), rich("k_below"),
					rich("M_F,1 (kNm)"), rich("M_F,2 (kNm)"), rich("M_unb (kNm)"), rich("M_above (kNm)"), rich("M_below (kNm)")}
				t.Align = "llrrrrrrrrr"
				t.Formula = rich("Subframe at each level (common practice): stiffnesses k = 4EI/L (kNm per radian; beams at the stiffness factor of the basis); M_unb = ΣM_F of the arrangement that loads one side (the governing lift's sheet names it); each column takes M_unb·k/Σk at the joint and half of it at its far end.")
			}
			for k := len(col.designs) - 1; k >= 0; k-- {
				i := col.designs[k]
				lift := r.Designs[i].Storey
				if frame {
					p := "frm/" + d.dir + "/"
					t.Rows = append(t.Rows, []inline{txt(lift), c.cell(i, p+"top"), c.cell(i, p+"bottom"), c.cell(i, p+"top_inf"), c.cell(i, p+"bottom_inf")})
					continue
				}
				p := sub + lift + "/"
				beams := c.beamsAt(i, p)
				ks := [2]inline{txt("–"), txt("–")}
				fems := [2]inline{txt("–"), txt("–")}
				for s, name := range beams {
					ks[s] = c.cell(i, p+name+"/k")
					fems[s] = c.matching(i, func(id string) bool {
						return id == p+name+"/FEM_loaded" || id == p+name+"/FEM_light"
					})
				}
				t.Rows = append(t.Rows, []inline{txt(lift), txt(strings.Join(beams, ", ")), ks[0], ks[1], c.cell(i, p+"above/k"), c.cell(i, p+"below/k"),
					fems[0], fems[1], c.cell(i, p+"unbalanced"), c.cell(i, p+"m_above"), c.cell(i, p+"m_below")})
			}
			out = append(out, t)
		}
	}
	return out
}

// beamsAt returns the names of the beams at a subframe joint of design i (step IDs under p),
// left first; a column at an edge has one.
func (c cells) beamsAt(i int, p string) []string {
	var names []string
	for s := range c.b.steps(i) {
		if !strings.HasPrefix(s.ID, p) || !strings.HasSuffix(s.ID, "/k") {
			continue
		}
		name := strings.TrimSuffix(strings.TrimPrefix(s.ID, p), "/k")
		if name == "above" || name == "below" || strings.Contains(name, "/") {
			continue
		}
		names = append(names, name)
	}
	if len(names) > 2 {
		names = names[:2]
	}
	return names
}
