package building

import (
	"maps"
	"slices"
	"strings"

	"colsheet/calc/frame"
	"colsheet/calc/trace"
)

const en1991 = "EN 1991-1-1:2002 "

// end is one beam end that bears on a column.
type end struct {
	beam  int
	start bool // the beam's start bears on the column (else its end)
}

// endsAt returns the beam ends of a level that bear on the column at x line i, y line j.
func (lv *Level) endsAt(i, j int) []end {
	var out []end
	for k, b := range lv.Beams {
		switch {
		case b.Dir == DirX && b.Line == j && b.From == i, b.Dir == DirY && b.Line == i && b.From == j:
			out = append(out, end{k, true})
		case b.Dir == DirX && b.Line == j && b.To == i, b.Dir == DirY && b.Line == i && b.To == j:
			out = append(out, end{k, false})
		}
	}
	return out
}

// resultant returns the total of the pieces and the distance of its line of action from the start.
func resultant(ps []frame.Piece, l float64) (f, xbar float64) {
	m := 0.0
	for _, p := range ps {
		t := p.Total()
		if t == 0 {
			continue
		}
		// Centroid of a linearly varying load: x0 + Δ·(w0 + 2·w1)/(3·(w0 + w1)).
		xc := p.X0 + (p.X1-p.X0)*(p.W0+2*p.W1)/(3*(p.W0+p.W1))
		f += t
		m += t * xc
	}
	if f == 0 {
		return 0, l / 2
	}
	return f, m / f
}

// Reaction returns the reaction of a simply supported beam at one end from the resultant F of
// its loads acting at x̄ from its start: F·(L − x̄)/L at the start, F·x̄/L at the end (statics;
// common practice for the take-down of braced frames).
func Reaction(id, title string, f, xbar, l trace.Q, atStart bool) trace.Step {
	if atStart {
		return trace.Formula(id, title, "common practice (simply supported beam reaction)", "R", "N",
			f.V*(l.V-xbar.V)/l.V, "F * (L - xbar) / L", trace.A("F", f), trace.A("xbar", xbar), trace.A("L", l))
	}
	return trace.Formula(id, title, "common practice (simply supported beam reaction)", "R", "N",
		f.V*xbar.V/l.V, "F * xbar / L", trace.A("F", f), trace.A("xbar", xbar), trace.A("L", l))
}

// PiecesTotal returns the total of linearly varying pieces, Σ (x1 − x0)·(w0 + w1)/2 (statics):
// with unit pieces, the slab area that drains to a beam. Each piece's term is written in its
// simplest form: x1 for a piece from 0, w0 for a uniform piece, w/2 for a triangle.
func PiecesTotal(id, title, clause, symbol, unit, wUnit string, ps []frame.Piece) trace.Step {
	var terms []string
	var args []trace.Arg
	v := 0.0
	for k, p := range ps {
		n := itoa(k + 1)
		x0 := trace.A("x0_"+n, trace.Const(p.X0, "x_0,"+n, "mm"))
		x1 := trace.A("x1_"+n, trace.Const(p.X1, "x_1,"+n, "mm"))
		w0 := trace.A("w0_"+n, trace.Const(p.W0, "w_0,"+n, wUnit))
		w1 := trace.A("w1_"+n, trace.Const(p.W1, "w_1,"+n, wUnit))
		length, width := "(x1_"+n+" - x0_"+n+")", "(w0_"+n+" + w1_"+n+") / 2"
		if p.X0 == 0 {
			length = "x1_" + n
		} else {
			args = append(args, x0)
		}
		args = append(args, x1)
		switch {
		case p.W0 == p.W1:
			width = "w0_" + n
			args = append(args, w0)
		case p.W0 == 0:
			width = "w1_" + n + " / 2"
			args = append(args, w1)
		case p.W1 == 0:
			width = "w0_" + n + " / 2"
			args = append(args, w0)
		default:
			args = append(args, w0, w1)
		}
		terms = append(terms, length+" * "+width)
		v += (p.X1 - p.X0) * (p.W0 + p.W1) / 2
	}
	expr := strings.Join(terms, " + ")
	if expr == "" {
		expr = "0"
	}
	return trace.Formula(id, title, clause, symbol, unit, v, expr, args...).
		Note("Each piece runs from x_0 to x_1 along the beam with the intensity w_0 to w_1 (for the slab: the width that drains to the beam).")
}

// LoadOnBeam returns the load on a beam, F = w·A_slab + F_1 + F_2 + …: the area load w (none when
// w is nil) over the slab that drains to the beam, plus its other loads (self-weight, line loads),
// statics.
func LoadOnBeam(id, title, symbol string, w *trace.Q, area trace.Q, others ...trace.Q) trace.Step {
	var terms []string
	var args []trace.Arg
	v := 0.0
	if w != nil {
		terms = append(terms, "w * A_slab")
		args = append(args, trace.A("w", *w), trace.A("A_slab", area))
		v = w.V * area.V
	}
	for k, q := range others {
		n := "F_" + itoa(k+1)
		terms = append(terms, n)
		args = append(args, trace.A(n, q))
		v += q.V
	}
	expr := strings.Join(terms, " + ")
	if expr == "" {
		expr = "0"
	}
	return trace.Formula(id, title, "common practice", symbol, "N", v, expr, args...)
}

// BeamSelfWeight returns the weight of a beam, ρ·b·h·L.
func BeamSelfWeight(id, name string, rho, b, h, l trace.Q) trace.Step {
	return memberWeight(id, "Self-weight of beam "+name, "G_beam,"+name, rho, b, h, "L", l)
}

// LineLoad is the stretch of a given line load w that lies on a beam, from x0 to x1 along it.
type LineLoad struct {
	X0, X1 float64 // mm from the beam's start
	W      trace.Q // the line load as given, N/mm
}

// LineLoadTotal returns the total of uniform line loads on a beam, F = Σ w·(x1 − x0) (statics).
func LineLoadTotal(id, title, symbol string, ls []LineLoad) trace.Step {
	var terms []string
	var args []trace.Arg
	v := 0.0
	for k, ll := range ls {
		n := itoa(k + 1)
		terms = append(terms, "w_"+n+" * (x1_"+n+" - x0_"+n+")")
		args = append(args, trace.A("w_"+n, ll.W), trace.A("x0_"+n, trace.Const(ll.X0, "x_0,"+n, "mm")), trace.A("x1_"+n, trace.Const(ll.X1, "x_1,"+n, "mm")))
		v += ll.W.V * (ll.X1 - ll.X0)
	}
	expr := strings.Join(terms, " + ")
	if expr == "" {
		expr = "0"
	}
	return trace.Formula(id, title, "common practice (statics)", symbol, "N", v, expr, args...).
		Note("Each line load w runs from x_0 to x_1 along the beam, measured from its start.")
}

// lineLoads records each line load of the input that lies on a beam as an input step, id followed
// by the load's number in the input, and returns the stretches with their traced intensities.
func lineLoads(l *trace.Log, id, what, symbol string, ps []LinePiece) []LineLoad {
	out := make([]LineLoad, len(ps))
	for k, p := range ps {
		n := itoa(p.Load + 1)
		w := l.Add(trace.Input(id+n, what+" line load "+n+" of the input, on grid line "+p.Line, "input", symbol+","+n, "N/mm", p.W))
		out[k] = LineLoad{X0: p.X0, X1: p.X1, W: w}
	}
	return out
}

// Sum returns a formula step adding the given quantities, which are named q1, q2, ….
func Sum(id, title, clause, symbol, unit string, qs []trace.Q) trace.Step {
	expr := ""
	v := 0.0
	args := make([]trace.Arg, len(qs))
	for k, q := range qs {
		name := "q" + itoa(k+1)
		if k > 0 {
			expr += " + "
		}
		expr += name
		v += q.V
		args[k] = trace.A(name, q)
	}
	if len(qs) == 0 {
		expr = "0"
	}
	return trace.Formula(id, title, clause, symbol, unit, v, expr, args...)
}

// ColumnSelfWeight returns the weight of one lift of a column, ρ·b·h·H.
func ColumnSelfWeight(id string, rho, b, h, height trace.Q) trace.Step {
	return memberWeight(id, "Self-weight of the column over the lift", "G_col", rho, b, h, "H", height)
}

// memberWeight returns the weight ρ·b·h·l of a member of section b × h and length l (named ln in
// the expression), EN 1991-1-1:2002 Annex A, Table A.1.
func memberWeight(id, title, symbol string, rho, b, h trace.Q, ln string, l trace.Q) trace.Step {
	return trace.Formula(id, title, en1991+"Annex A, Table A.1", symbol, "N",
		rho.V*b.V*h.V*l.V, "rho * b * h * "+ln, trace.A("rho", rho), trace.A("b", b), trace.A("h", h), trace.A(ln, l))
}

// levelTakeDown records, for the column at (i, j), the characteristic reactions of the beams
// that bear on it at one level, and returns the level's permanent load and imposed loads by category.
// reactions holds the traced characteristic reactions of one beam at the column.
type reactions struct {
	g  trace.Q
	qs map[string]trace.Q // by category
}

func levelTakeDown(l *trace.Log, lv *Level, i, j int, rho trace.Q) (g trace.Q, q map[string]trace.Q, area float64, byBeam map[int]reactions) {
	byBeam = map[int]reactions{}
	ends := lv.endsAt(i, j)
	var gs []trace.Q
	qs := map[string][]trace.Q{}
	pre := "td/" + lv.Name + "/"
	var gkQ, qkQ trace.Q
	if len(ends) > 0 {
		gkQ = l.Add(trace.Input(pre+"g_k", "Permanent area load of the floor at level "+lv.Name+" (without beams and columns)", "input", "g_k", "N/mm2", lv.Floor.Gk))
		if lv.Floor.Qk > 0 {
			qkQ = l.Add(trace.Input(pre+"q_k", "Imposed area load of the floor at level "+lv.Name+" (category "+lv.Floor.Category+")", "input", "q_k", "N/mm2", lv.Floor.Qk))
		}
	}
	for _, e := range ends {
		bm := lv.Beams[e.beam]
		ld := lv.Loads[e.beam]
		name := bm.Name()
		// The beam's span and section as the input gives them (grid and beam sizes).
		L := l.Add(trace.Input(pre+name+"/L", "Span of beam "+name, "input", "L_"+name, "mm", bm.L))
		bB := l.Add(trace.Input(pre+name+"/b", "Width of beam "+name, "input", "b_"+name, "mm", bm.Size.B))
		hB := l.Add(trace.Input(pre+name+"/h", "Depth of beam "+name, "input", "h_"+name, "mm", bm.Size.H))
		which := "end"
		if e.start {
			which = "start"
		}
		_, xb := resultant(ld.G, bm.L)
		aSlab := l.Add(PiecesTotal(pre+name+"/A_slab", "Slab area that drains to beam "+name, "common practice (tributary areas)", "A_slab,"+name, "mm2", "mm", ld.Slab))
		gBeam := l.Add(BeamSelfWeight(pre+name+"/G_beam", name, rho, bB, hB, L))
		var others []trace.Q
		others = append(others, gBeam)
		if len(ld.LineG) > 0 {
			lls := lineLoads(l, pre+name+"/g_line", "Permanent", "g_line", ld.LineG)
			others = append(others, l.Add(LineLoadTotal(pre+name+"/G_line", "Permanent line loads on beam "+name, "G_line,"+name, lls)))
		}
		F := l.Add(LoadOnBeam(pre+name+"/F_G", "Permanent load on beam "+name, "F_G,"+name, &gkQ, aSlab, others...))
		X := trace.Const(xb, "x_R,G,"+name, "mm")
		s := Reaction(pre+name+"/G", "Permanent load from beam "+name+" at level "+lv.Name+" ("+which+")", F, X, L, e.start)
		s.Symbol = "R_G," + name
		s = s.Note("F: slab, self-weight of the beam and line loads on the beam; x_R (the line of action of F) from the beam's " + which + " of span.")
		rg := l.Add(s)
		gs = append(gs, rg)
		re := reactions{g: rg, qs: map[string]trace.Q{}}
		for _, cat := range keys(ld.Q) {
			f, xb := resultant(ld.Q[cat], bm.L)
			if f == 0 {
				continue
			}
			var w *trace.Q // the floor's imposed area load, when of this category
			if cat == lv.Floor.Category && lv.Floor.Qk > 0 {
				w = &qkQ
			}
			var others []trace.Q
			if len(ld.LineQ[cat]) > 0 {
				lls := lineLoads(l, pre+name+"/q_line"+cat+"_", "Imposed (category "+cat+")", "q_line,"+cat, ld.LineQ[cat])
				others = append(others, l.Add(LineLoadTotal(pre+name+"/Q_line"+cat, "Imposed line loads (category "+cat+") on beam "+name, "Q_line,"+cat+","+name, lls)))
			}
			F := l.Add(LoadOnBeam(pre+name+"/F_Q"+cat, "Imposed load (category "+cat+") on beam "+name, "F_Q"+cat+","+name, w, aSlab, others...))
			X := trace.Const(xb, "x_R,Q"+cat+","+name, "mm")
			s := Reaction(pre+name+"/Q"+cat, "Imposed load (category "+cat+") from beam "+name+" at level "+lv.Name, F, X, L, e.start)
			s.Symbol = "R_Q" + cat + "," + name
			rq := l.Add(s)
			qs[cat] = append(qs[cat], rq)
			re.qs[cat] = rq
		}
		byBeam[e.beam] = re
		// The slab area that drains to this end, for the reduction αA.
		a, xa := resultant(ld.Slab, bm.L)
		if e.start {
			area += a * (bm.L - xa) / bm.L
		} else {
			area += a * xa / bm.L
		}
	}
	g = l.Add(Sum(pre+"G", "Permanent load delivered at level "+lv.Name, "common practice", "G_"+lv.Name, "N", gs))
	q = map[string]trace.Q{}
	for _, cat := range keys(qs) {
		q[cat] = l.Add(Sum(pre+"Q"+cat, "Imposed load (category "+cat+") delivered at level "+lv.Name, "common practice", "Q_"+cat+","+lv.Name, "N", qs[cat]))
	}
	return g, q, area, byBeam
}

// keys returns the keys of a map, sorted.
func keys[V any](m map[string]V) []string { return slices.Sorted(maps.Keys(m)) }
