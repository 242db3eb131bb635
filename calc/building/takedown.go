package building

import (
	"maps"
	"math"
	"slices"
	"strings"

	"colsheet/calc/frame"
	"colsheet/calc/model"
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

// resultant returns the total of the pieces and point loads and the distance of its line of
// action from the start.
func resultant(ps []frame.Piece, pts []Point, l float64) (f, xbar float64) {
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
	for _, p := range pts {
		f += p.P
		m += p.P * p.X
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

// BeamDownstandWeight returns the weight of the part of a beam below a slab of thickness t,
// ρ·b·max(h − t, 0)·L: the slab's own weight is in the floor's g_k (EN 1991-1-1:2002 Annex A,
// Table A.1).
func BeamDownstandWeight(id, name string, rho, b, h, t, l trace.Q) trace.Step {
	return trace.Formula(id, "Self-weight of beam "+name+" below the slab (its downstand)", en1991+"Annex A, Table A.1", "G_beam,"+name, "N",
		rho.V*b.V*max(h.V-t.V, 0)*l.V, "rho * b * max(h - t, 0) * L", trace.A("rho", rho), trace.A("b", b), trace.A("h", h), trace.A("t", t), trace.A("L", l)).
		Note("The slab of thickness t is in the floor's g_k: the beam's self-weight counts only its depth below the slab, h − t.")
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

// CircularColumnSelfWeight returns the weight of one lift of a circular column of diameter d,
// ρ·π·D²/4·H, EN 1991-1-1:2002 Annex A, Table A.1.
func CircularColumnSelfWeight(id string, rho, d, height trace.Q) trace.Step {
	return trace.Formula(id, "Self-weight of the circular column over the lift", en1991+"Annex A, Table A.1", "G_col", "N",
		rho.V*math.Pi*d.V*d.V/4*height.V, "rho * pi * D ** 2 / 4 * H",
		trace.A("rho", rho), trace.A("pi", piConst), trace.A("D", d), trace.A("H", height))
}

// piConst is π as an argument of an expression.
var piConst = trace.Const(math.Pi, "π", "")

// memberWeight returns the weight ρ·b·h·l of a member of section b × h and length l (named ln in
// the expression), EN 1991-1-1:2002 Annex A, Table A.1.
func memberWeight(id, title, symbol string, rho, b, h trace.Q, ln string, l trace.Q) trace.Step {
	return trace.Formula(id, title, en1991+"Annex A, Table A.1", symbol, "N",
		rho.V*b.V*h.V*l.V, "rho * b * h * "+ln, trace.A("rho", rho), trace.A("b", b), trace.A("h", h), trace.A(ln, l))
}

// reactions holds the traced characteristic reactions of one beam at the column.
type reactions struct {
	g  trace.Q
	qs map[string]trace.Q // by category
}

// foot is the cumulative characteristic load at the foot of a column's lift, referred to across
// sheets, with the storeys whose imposed loads it holds (by category, for αn).
type foot struct {
	g       trace.Q
	q       map[string]trace.Q
	storeys map[string]map[int]bool
}

// levelLoads is what one level delivers to a column.
type levelLoads struct {
	g, xferG trace.Q            // the beams' own loads, and the loads of columns standing on them (zero From: none)
	q, xferQ map[string]trace.Q // the same, imposed, by category
	area     float64            // the floor area that drains to the column (the floor's own and cantilevers), mm², for αA
	zoneArea map[string]float64 // the area of zones that drains to the column, by category other than the floor's, mm²
	byBeam   map[int]reactions  // the reactions of each beam from its own loads (not the transfers)
	counted  map[string]bool    // categories of zones and point loads that reach the column, for αn
	areal    map[string]bool    // categories that reach the column by some load over an area or a line, not by point loads alone
	storeys  map[string]map[int]bool
	edge     [2]EdgeMoment // by frame direction
}

// levelTakeDown records, for the column at (i, j), the characteristic reactions of the beams
// that bear on it at one level and returns what the level delivers: the beams' own loads (slab,
// self-weight, line loads, zoned area loads, cantilever slabs, point loads), the loads of the
// columns that stand on the beams (transfers, whose loads above the level footAt gives), and the
// moments of the cantilever slabs on the joint.
func levelTakeDown(l *trace.Log, b *model.Building, lv *Level, i, j int, rho trace.Q, footAt func(i, j int) foot) levelLoads {
	r := &atColumn{l: l, b: b, lv: lv, pre: "td/" + lv.Name + "/", rho: rho, footAt: footAt, qs: map[string][]trace.Q{}, xq: map[string][]trace.Q{},
		out: levelLoads{byBeam: map[int]reactions{}, zoneArea: map[string]float64{}, counted: map[string]bool{}, areal: map[string]bool{}}}
	ends := lv.endsAt(i, j)
	if len(ends) > 0 {
		r.inputs()
	}
	r.given = givenOnce(l, r.pre)
	for _, e := range ends {
		r.beam(e)
	}
	return r.totals(i, j)
}

// atColumn records the take-down of one level at one column, beam end by beam end.
type atColumn struct {
	l        *trace.Log
	b        *model.Building
	lv       *Level
	pre      string
	rho      trace.Q
	gkQ, qkQ trace.Q // the floor's area loads
	tQ       trace.Q // the slab thickness; zero From when not given
	footAt   func(i, j int) foot
	given    func(id, title, symbol, unit string, v float64) trace.Q
	gs, xg   []trace.Q            // the beams' permanent reactions, and those of the transfers
	qs, xq   map[string][]trace.Q // the same, imposed, by category
	mg       [2][]trace.Q         // the cantilever slabs' moments by frame direction, permanent
	mq       [2]map[string][]trace.Q
	out      levelLoads
}

// inputs records the floor's loads and slab thickness as the input gives them.
func (r *atColumn) inputs() {
	f, l, pre, name := r.lv.Floor, r.l, r.pre, r.lv.Name
	r.gkQ = l.Add(trace.Input(pre+"g_k", "Permanent area load of the floor at level "+name+" (without beams and columns)", "input", "g_k", "N/mm2", f.Gk))
	if f.Qk > 0 {
		r.qkQ = l.Add(trace.Input(pre+"q_k", "Imposed area load of the floor at level "+name+" (category "+f.Category+")", "input", "q_k", "N/mm2", f.Qk))
	}
	if f.Thickness > 0 {
		r.tQ = l.Add(trace.Input(pre+"t", "Slab thickness at level "+name, "input", "t", "mm", f.Thickness))
	}
}

// totals records the sums of what the level delivers to the column at (i, j) and returns them.
func (r *atColumn) totals(i, j int) levelLoads {
	l, pre, name := r.l, r.pre, r.lv.Name
	out := r.out
	out.g = l.Add(Sum(pre+"G", "Permanent load delivered at level "+name, "common practice", "G_"+name, "N", r.gs))
	out.q = map[string]trace.Q{}
	for _, cat := range keys(r.qs) {
		out.q[cat] = l.Add(Sum(pre+"Q"+cat, "Imposed load (category "+cat+") delivered at level "+name, "common practice", "Q_"+cat+","+name, "N", r.qs[cat]))
	}
	if len(r.xg) > 0 {
		out.xferG = l.Add(Sum(pre+"xfer/G", "Permanent load transferred at level "+name+" from the columns standing on the beams", "common practice", "G_xfer,"+name, "N", r.xg))
	}
	out.xferQ = map[string]trace.Q{}
	for _, cat := range keys(r.xq) {
		out.xferQ[cat] = l.Add(Sum(pre+"xfer/Q"+cat, "Imposed load (category "+cat+") transferred at level "+name+" from the columns standing on the beams", "common practice", "Q_xfer,"+cat+","+name, "N", r.xq[cat]))
	}
	out.edge = edgeMoments(l, pre, name, i, j, r.mg, r.mq)
	return out
}

// beam records the reactions at the column of the beam whose end e bears on it: its own loads,
// the areas for αA, the cantilever slabs' moments and the columns standing on it.
func (r *atColumn) beam(e end) {
	l, lv, pre := r.l, r.lv, r.pre
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
	gPts, qPts := ld.pointLoads()
	_, xb := resultant(ld.G, gPts, bm.L)
	aSlab := l.Add(PiecesTotal(pre+name+"/A_slab", "Slab area that drains to beam "+name, "common practice (tributary areas)", "A_slab,"+name, "mm2", "mm", ld.Slab))
	var gBeam trace.Q
	if r.tQ.From != "" {
		gBeam = l.Add(BeamDownstandWeight(pre+name+"/G_beam", name, r.rho, bB, hB, r.tQ, L))
	} else {
		gBeam = l.Add(BeamSelfWeight(pre+name+"/G_beam", name, r.rho, bB, hB, L))
	}
	var others []trace.Q
	others = append(others, gBeam)
	if len(ld.LineG) > 0 {
		lls := lineLoads(l, pre+name+"/g_line", "Permanent", "g_line", ld.LineG)
		others = append(others, l.Add(LineLoadTotal(pre+name+"/G_line", "Permanent line loads on beam "+name, "G_line,"+name, lls)))
	}
	zoneA, more := r.otherPermanent(name, ld)
	others = append(others, more...)
	F := l.Add(LoadOnBeam(pre+name+"/F_G", "Permanent load on beam "+name, "F_G,"+name, &r.gkQ, aSlab, others...))
	X := trace.Const(xb, "x_R,G,"+name, "mm")
	s := Reaction(pre+name+"/G", "Permanent load from beam "+name+" at level "+lv.Name+" ("+which+")", F, X, L, e.start)
	s.Symbol = "R_G," + name
	s = s.Note("F: slab, self-weight of the beam and line loads on the beam; x_R (the line of action of F) from the beam's " + which + " of span.")
	if len(ld.Zones)+len(ld.Cants)+len(gPts) > 0 {
		s = s.Note("F holds as well the zoned area loads, cantilever slabs and point loads on the beam; x_R is the line of action of them all.")
	}
	rg := l.Add(s)
	r.gs = append(r.gs, rg)
	r.out.byBeam[e.beam] = reactions{g: rg, qs: r.imposed(e, L, aSlab, zoneA, qPts)}
	r.areas(e)
	r.torsion(e, L)
	r.transfers(e, L, which)
}

// imposed records the imposed reactions, by category, at the column of the beam whose end e
// bears on it, and returns them.
func (r *atColumn) imposed(e end, L, aSlab trace.Q, zoneA map[int]trace.Q, qPts map[string][]Point) map[string]trace.Q {
	l, lv, pre := r.l, r.lv, r.pre
	bm := lv.Beams[e.beam]
	ld := lv.Loads[e.beam]
	name := bm.Name()
	out := map[string]trace.Q{}
	cats := map[string]bool{}
	for c := range ld.Q {
		cats[c] = true
	}
	for c := range qPts {
		cats[c] = true
	}
	for _, cat := range keys(cats) {
		f, xb := resultant(ld.Q[cat], qPts[cat], bm.L)
		if f == 0 {
			continue
		}
		var w *trace.Q // the floor's imposed area load, when of this category
		if cat == lv.Floor.Category && lv.Floor.Qk > 0 {
			w = &r.qkQ
		}
		var others []trace.Q
		if len(ld.LineQ[cat]) > 0 {
			lls := lineLoads(l, pre+name+"/q_line"+cat+"_", "Imposed (category "+cat+")", "q_line,"+cat, ld.LineQ[cat])
			others = append(others, l.Add(LineLoadTotal(pre+name+"/Q_line"+cat, "Imposed line loads (category "+cat+") on beam "+name, "Q_line,"+cat+","+name, lls)))
		}
		others = append(others, r.otherImposed(name, ld, cat, zoneA)...)
		if w != nil || len(ld.LineQ[cat]) > 0 || len(ld.Q[cat]) > 0 {
			r.out.areal[cat] = true
		}
		F := l.Add(LoadOnBeam(pre+name+"/F_Q"+cat, "Imposed load (category "+cat+") on beam "+name, "F_Q"+cat+","+name, w, aSlab, others...))
		X := trace.Const(xb, "x_R,Q"+cat+","+name, "mm")
		s := Reaction(pre+name+"/Q"+cat, "Imposed load (category "+cat+") from beam "+name+" at level "+lv.Name, F, X, L, e.start)
		s.Symbol = "R_Q" + cat + "," + name
		rq := l.Add(s)
		r.qs[cat] = append(r.qs[cat], rq)
		out[cat] = rq
	}
	return out
}

// otherPermanent records the permanent loads on a beam besides its slab, self-weight and line
// loads: zones, cantilever slabs and point loads; it returns the zones' areas on the beam too.
func (r *atColumn) otherPermanent(name string, ld BeamLoad) (map[int]trace.Q, []trace.Q) {
	l, pre, b, level := r.l, r.pre, r.b, r.lv.Name
	var out []trace.Q
	zoneA := map[int]trace.Q{}
	for _, z := range ld.Zones {
		n := itoa(z.Load + 1)
		zoneA[z.Load] = l.Add(PiecesTotal(pre+name+"/zone"+n+"/A", "Share of the area of zone "+n+" carried by beam "+name, "common practice (panel shares)", "A_zone"+n+","+name, "mm2", "mm", z.Slab).
			Note("Panel shares of the floor's span direction: one way by the lever rule across the span, two way by the 45° lines from the corners."))
		if gz := b.AreaLoads[z.Load].Gk; gz != 0 {
			w := r.given("zone"+n+"/g_k", "Permanent area load of zone "+n+" at level "+level, "g_k,zone"+n, "N/mm2", gz)
			out = append(out, l.Add(areaLoad(pre+name+"/zone"+n+"/G", "Permanent load of zone "+n+" on beam "+name, "G_zone"+n+","+name, w, zoneA[z.Load])))
		}
	}
	for _, c := range ld.Cants {
		n := itoa(c.Load + 1)
		out = append(out, l.Add(CantileverLoad(pre+name+"/cant"+n+"/G", "Permanent load of cantilever slab "+n+" on beam "+name, "G_cant"+n+","+name, r.gkQ, r.cantLength(c), c.X0, c.X1)))
	}
	for _, p := range ld.Points {
		if b.PointLoads[p.Load].Gk == 0 {
			continue
		}
		n := itoa(p.Load + 1)
		pq := r.given("point"+n+"/G_k", "Permanent point load "+n+" at level "+level, "G_k,point"+n, "N", b.PointLoads[p.Load].Gk)
		st := PointShare(pre+name+"/point"+n+"/G", "Permanent point load "+n+" on beam "+name, pq, p)
		st.Symbol = "P_G,point" + n + "," + name
		out = append(out, l.Add(st))
	}
	return zoneA, out
}

// otherImposed records the imposed loads of category cat on a beam besides the floor's slab and
// the line loads: zones, cantilever slabs and point loads of that category; it marks the
// categories of zones and point loads that reach the column.
func (r *atColumn) otherImposed(name string, ld BeamLoad, cat string, zoneA map[int]trace.Q) []trace.Q {
	l, pre, b, f, level := r.l, r.pre, r.b, r.lv.Floor, r.lv.Name
	var out []trace.Q
	for _, z := range ld.Zones {
		zl := b.AreaLoads[z.Load]
		if zl.Qk <= 0 || zoneCategory(zl, f) != cat {
			continue
		}
		n := itoa(z.Load + 1)
		w := r.given("zone"+n+"/q_k", "Imposed area load of zone "+n+" at level "+level+" (category "+cat+")", "q_k,zone"+n, "N/mm2", zl.Qk)
		out = append(out, l.Add(areaLoad(pre+name+"/zone"+n+"/Q", "Imposed load (category "+cat+") of zone "+n+" on beam "+name, "Q_zone"+n+","+name, w, zoneA[z.Load])))
		r.out.counted[cat] = true
	}
	if cat == f.Category && f.Qk > 0 {
		for _, c := range ld.Cants {
			n := itoa(c.Load + 1)
			out = append(out, l.Add(CantileverLoad(pre+name+"/cant"+n+"/Q", "Imposed load (category "+cat+") of cantilever slab "+n+" on beam "+name, "Q_cant"+n+","+name, r.qkQ, r.cantLength(c), c.X0, c.X1)))
		}
	}
	for _, p := range ld.Points {
		if p.Q == 0 || p.Cat != cat {
			continue
		}
		n := itoa(p.Load + 1)
		pq := r.given("point"+n+"/Q_k", "Imposed point load "+n+" at level "+level+" (category "+cat+")", "Q_k,point"+n, "N", b.PointLoads[p.Load].Qk)
		st := PointShare(pre+name+"/point"+n+"/Q", "Imposed point load "+n+" (category "+cat+") on beam "+name, pq, p)
		st.Symbol = "P_Q,point" + n + "," + name
		out = append(out, l.Add(st))
		r.out.counted[cat] = true
	}
	return out
}

// cantLength returns the length of a cantilever slab as an input step, recorded once.
func (r *atColumn) cantLength(c CantOn) trace.Q {
	n := itoa(c.Load + 1)
	return r.given("cant"+n+"/l_c", "Length of cantilever slab "+n+" beyond grid line "+c.Line, "l_c,"+n, "mm", c.Length)
}

// areas adds the areas that drain to the column through beam end e, for the reduction αA: the
// floor's own slab and cantilever slabs, and by category the zones of categories other than the
// floor's.
func (r *atColumn) areas(e end) {
	bm := r.lv.Beams[e.beam]
	ld := r.lv.Loads[e.beam]
	f := r.lv.Floor
	share := func(ps []frame.Piece) float64 {
		a, xa := resultant(ps, nil, bm.L)
		if e.start {
			return a * (bm.L - xa) / bm.L
		}
		return a * xa / bm.L
	}
	r.out.area += share(ld.Slab)
	for _, c := range ld.Cants {
		r.out.area += share([]frame.Piece{{X0: c.X0, X1: c.X1, W0: c.Length, W1: c.Length}})
	}
	for _, z := range ld.Zones {
		if zc := zoneCategory(r.b.AreaLoads[z.Load], f); zc != f.Category && r.b.AreaLoads[z.Load].Qk > 0 {
			r.out.zoneArea[zc] += share(z.Slab)
		}
	}
}

// torsion records the moments that the cantilever slabs on the beam of end e put on the column
// through the beam's torsion, permanent and imposed.
func (r *atColumn) torsion(e end, L trace.Q) {
	bm := r.lv.Beams[e.beam]
	ld := r.lv.Loads[e.beam]
	if len(ld.Cants) == 0 {
		return
	}
	f, name := r.lv.Floor, bm.Name()
	d := DirX // a beam along y carries its torsion into the frames along x
	if bm.Dir == DirX {
		d = DirY
	}
	if r.mq[d] == nil {
		r.mq[d] = map[string][]trace.Q{}
	}
	for _, c := range ld.Cants {
		n := itoa(c.Load + 1)
		lc := r.cantLength(c)
		id := r.pre + name + "/cant" + n + "/T_"
		title := "Moment of cantilever slab " + n + " carried by beam " + name + " in torsion to the column ("
		r.mg[d] = append(r.mg[d], r.l.Add(CantileverTorsion(id+"G", title+"permanent)", "T_G,cant"+n+","+name, r.gkQ, lc, L, c.X0, c.X1, e.start)))
		if f.Qk > 0 {
			r.mq[d][f.Category] = append(r.mq[d][f.Category], r.l.Add(CantileverTorsion(id+"Q"+f.Category, title+"imposed, category "+f.Category+")", "T_Q,cant"+n+","+name, r.qkQ, lc, L, c.X0, c.X1, e.start)))
		}
	}
}

// transfers records the loads that the columns standing on the beam of end e put on the column,
// by the reactions of the simply supported beam, and gathers the storeys of their imposed loads.
func (r *atColumn) transfers(e end, L trace.Q, which string) {
	ld := r.lv.Loads[e.beam]
	name := r.lv.Beams[e.beam].Name()
	for _, t := range ld.Transfers {
		src := r.footAt(t.I, t.J)
		title := " transferred from column " + t.Column + " above level " + r.lv.Name + ", by beam " + name + " (" + which + ")"
		k := trace.Const(t.K, "K", "")
		a := trace.Const(t.X, "a", "mm")
		id := r.pre + "xfer/" + t.Column + "/" + name + "/"
		note := "The column stands at a from the beam's start; the beam takes the share K of its load (half each where two beams cross under it), simply supported."
		if src.g.From != "" {
			r.xg = append(r.xg, r.l.Add(TransferReaction(id+"G", "Permanent load"+title, src.g, k, a, L, e.start).Note(note).Caution(transferCaution)))
		}
		for _, c := range keys(src.q) {
			r.xq[c] = append(r.xq[c], r.l.Add(TransferReaction(id+"Q"+c, "Imposed load (category "+c+")"+title, src.q[c], k, a, L, e.start).Note(note).Caution(transferCaution)))
		}
		for c, set := range src.storeys {
			if r.out.storeys == nil {
				r.out.storeys = map[string]map[int]bool{}
			}
			if r.out.storeys[c] == nil {
				r.out.storeys[c] = map[int]bool{}
			}
			for m := range set {
				r.out.storeys[c][m] = true
			}
		}
	}
}

// givenOnce returns a recorder of input steps under pre that records each ID once per log and
// hands back its quantity on later calls.
func givenOnce(l *trace.Log, pre string) func(id, title, symbol, unit string, v float64) trace.Q {
	seen := map[string]trace.Q{}
	return func(id, title, symbol, unit string, v float64) trace.Q {
		if q, ok := seen[id]; ok {
			return q
		}
		q := l.Add(trace.Input(pre+id, title, "input", symbol, unit, v))
		seen[id] = q
		return q
	}
}

// areaLoad returns the load of an area load w over the area A, F = w·A (statics).
func areaLoad(id, title, symbol string, w, a trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice (statics)", symbol, "N", w.V*a.V, "w * A", trace.A("w", w), trace.A("A", a))
}

// edgeMoments records, for each frame direction, the sum of the cantilever slabs' moments on the
// joint of the column at (i, j), permanent and imposed by category (EdgeMoment).
func edgeMoments(l *trace.Log, pre, level string, i, j int, mg [2][]trace.Q, mq [2]map[string][]trace.Q) [2]EdgeMoment {
	var out [2]EdgeMoment
	for d := DirX; d <= DirY; d++ {
		if len(mg[d]) == 0 {
			continue
		}
		axis := d.Axis()
		side := 1.0 // beyond the first line
		if (d == DirX && i > 0) || (d == DirY && j > 0) {
			side = -1
		}
		what := "Moment of the cantilever slabs on the joint at level " + level + ", about " + axis + " (frames along " + d.String() + "), "
		note := "Tension on the column's inner face (away from the cantilever) at the top of the lift below the joint, on its outer face at the bottom of the lift above; the column-moment analysis shares it between them."
		e := EdgeMoment{Clockwise: side, Q: map[string]trace.Q{}}
		e.G = l.Add(Sum(pre+"cant/"+axis+"/M_G", what+"permanent", "common practice (statics)", "M_cant,G,"+axis, "Nmm", mg[d]).Note(note))
		for _, c := range keys(mq[d]) {
			e.Q[c] = l.Add(Sum(pre+"cant/"+axis+"/M_Q"+c, what+"imposed, category "+c, "common practice (statics)", "M_cant,Q"+c+","+axis, "Nmm", mq[d][c]).Note(note))
		}
		out[d] = e
	}
	return out
}

// keys returns the keys of a map, sorted.
func keys[V any](m map[string]V) []string { return slices.Sorted(maps.Keys(m)) }
