package building

import (
	"maps"
	"slices"

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

// ColumnSelfWeight returns the weight of one lift of a column, ρ·b·h·H, EN 1991-1-1:2002 Annex A, Table A.1.
func ColumnSelfWeight(id string, rho, b, h, height trace.Q) trace.Step {
	return trace.Formula(id, "Self-weight of the column over the lift", en1991+"Annex A, Table A.1", "G_col", "N",
		rho.V*b.V*h.V*height.V, "rho * b * h * H", trace.A("rho", rho), trace.A("b", b), trace.A("h", h), trace.A("H", height))
}

// levelTakeDown records, for the column at (i, j), the characteristic reactions of the beams
// that bear on it at one level, and returns the level's permanent load and imposed loads by category.
// reactions holds the traced characteristic reactions of one beam at the column.
type reactions struct {
	g  trace.Q
	qs []trace.Q
}

func levelTakeDown(l *trace.Log, lv *Level, i, j int) (g trace.Q, q map[string]trace.Q, area float64, byBeam map[int]reactions) {
	byBeam = map[int]reactions{}
	ends := lv.endsAt(i, j)
	var gs []trace.Q
	qs := map[string][]trace.Q{}
	pre := "td/" + lv.Name + "/"
	for _, e := range ends {
		bm := lv.Beams[e.beam]
		ld := lv.Loads[e.beam]
		name := bm.Name()
		L := trace.Const(bm.L, "L_"+name, "mm")
		which := "end"
		if e.start {
			which = "start"
		}
		f, xb := resultant(ld.G, bm.L)
		F := trace.Const(f, "F_G,"+name, "N")
		X := trace.Const(xb, "x_R,G,"+name, "mm")
		s := Reaction(pre+name+"/G", "Permanent load from beam "+name+" at level "+lv.Name+" ("+which+")", F, X, L, e.start)
		s.Symbol = "R_G," + name
		s = s.Note("F: slab, self-weight of the beam and line loads on the beam; x_R (the line of action of F) from the beam's " + which + " of span.")
		rg := l.Add(s)
		gs = append(gs, rg)
		re := reactions{g: rg}
		for _, cat := range keys(ld.Q) {
			f, xb := resultant(ld.Q[cat], bm.L)
			if f == 0 {
				continue
			}
			F := trace.Const(f, "F_Q"+cat+","+name, "N")
			X := trace.Const(xb, "x_R,Q"+cat+","+name, "mm")
			s := Reaction(pre+name+"/Q"+cat, "Imposed load (category "+cat+") from beam "+name+" at level "+lv.Name, F, X, L, e.start)
			s.Symbol = "R_Q" + cat + "," + name
			rq := l.Add(s)
			qs[cat] = append(qs[cat], rq)
			re.qs = append(re.qs, rq)
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
