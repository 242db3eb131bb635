package building

import (
	"math"

	"colsheet/calc/model"
	"colsheet/calc/trace"
	"colsheet/calc/work"
)

// columnEnds returns, for the columns at the grid points of order (lifts[k] the lifts of the
// column at order[k]), the clockwise end moments of every lift in each direction by the
// analysis the building asks for: the simplified subframe, the frame lines, or both with the
// larger end moment governing at each end.
func columnEnds(in *model.Input, g *Grid, levels []Level, order [][2]int, lifts [][]Lift) ([][][2]endQ, error) {
	b := in.Building
	var sub [][][2]endQ
	if b.Analysis != model.AnalysisFrame {
		sub = make([][][2]endQ, len(order))
		work.Each(len(order), func(k int) { sub[k] = subframeEnds(in, levels, lifts[k]) })
		if b.Analysis != model.AnalysisBoth {
			return sub, nil
		}
	}
	cols := make(map[[2]int][]Lift, len(order))
	for k, at := range order {
		cols[at] = lifts[k]
	}
	byCol, err := frameEnds(in, g, levels, cols)
	if err != nil {
		return nil, err
	}
	frm := make([][][2]endQ, len(order))
	for k, at := range order {
		frm[k] = byCol[at]
	}
	if sub == nil {
		return frm, nil
	}
	ends := make([][][2]endQ, len(order))
	work.Each(len(order), func(k int) { ends[k] = largerEnds(lifts[k], sub[k], frm[k]) })
	return ends, nil
}

// largerEnds records, for every lift of one column and each direction, the larger in magnitude
// of the subframe's and the frame's end moment at each end (common practice: each analysis
// models the same braced frame; the larger governs), for the governing arrangement and for the
// least axial force alike, and returns them.
func largerEnds(lifts []Lift, sub, frm [][2]endQ) [][2]endQ {
	out := make([][2]endQ, len(lifts))
	for m := range lifts {
		l := &trace.Log{Steps: lifts[m].Steps}
		for d := DirX; d <= DirY; d++ {
			axis := d.Axis()
			pre := "both/" + axis + "/"
			s, f := sub[m][d], frm[m][d]
			l.Group = "Column moments about " + axis + ": the larger of the subframe and the frame"
			var e endQ
			var topFrame bool
			e.top, topFrame = larger(l, pre+"top", "at the top of the lift", axis, "M_t,"+axis, s.top, f.top)
			e.bot = largerBottom(l, pre+"bot", "at the bottom of the lift", axis, "M_b,"+axis, s.bot, f.bot)
			e.set = s.set
			if topFrame {
				e.set = f.set
			}
			e.botAlt = singleCurvatureAlt(l, pre+"bot_alt", axis, e.top, s.botAlt, f.botAlt)
			if s.minTop.From != "" && f.minTop.From != "" {
				l.Group = "Column moments about " + axis + ": the larger of the subframe and the frame, permanent load favourable (least axial force)"
				e.minTop, _ = larger(l, pre+"top_inf", "at the top of the lift", axis, "M_t,"+axis+",inf", s.minTop, f.minTop)
				e.minBot = largerBottom(l, pre+"bot_inf", "at the bottom of the lift", axis, "M_b,"+axis+",inf", s.minBot, f.minBot)
			}
			out[m][d] = e
		}
		lifts[m].Steps = l.Steps
	}
	return out
}

// larger records the subframe's and the frame's clockwise moment at one end of the lift and the
// larger of the two in magnitude (the subframe's where they are equal), with the governing
// analysis named, and returns it and whether the frame governs.
func larger(l *trace.Log, id, where, axis, sym string, sub, frm trace.Q) (trace.Q, bool) {
	title := "column moment " + where + " about " + axis + ", clockwise"
	s := l.Add(trace.Formula(id+"/sub", "Subframe: "+title, "common practice", sym+",sub", "Nmm", sub.V, "M", trace.A("M", sub)))
	f := l.Add(trace.Formula(id+"/frame", "Frame: "+title, "common practice (braced frame analysis)", sym+",frame", "Nmm", frm.V, "M", trace.A("M", frm)))
	useFrame := math.Abs(frm.V) > math.Abs(sub.V)
	v, gov := sub.V, "the subframe governs"
	if useFrame {
		v, gov = frm.V, "the frame governs"
	}
	q := l.Add(trace.Formula(id, "Larger: "+title+" ("+gov+")", "common practice", sym, "Nmm", v,
		"abs(M_sub) >= abs(M_frame) ? M_sub : M_frame", trace.A("M_sub", s), trace.A("M_frame", f)).
		Note("analysis: both. The simplified subframe and the frame model the same braced frame; the end moment larger in magnitude is designed for."))
	return q, useFrame
}

// largerBottom is larger at the bottom of a lift; at a pinned base, where both analyses give
// no moment, it keeps the subframe's zero and records nothing.
func largerBottom(l *trace.Log, id, where, axis, sym string, sub, frm trace.Q) trace.Q {
	if sub.From == "" && sub.V == 0 {
		return sub
	}
	q, _ := larger(l, id, where, axis, sym, sub, frm)
	return q
}

// singleCurvatureAlt returns the bottom moment of another arrangement that bends the lift in
// single curvature with the top moment top (clockwise at both ends of the same sign is double
// curvature, so single curvature wants the opposite sign to top): of the subframe's and the
// frame's, those that do, the larger in magnitude, recorded with both where both do; a zero
// quantity where neither does.
func singleCurvatureAlt(l *trace.Log, id, axis string, top, sub, frm trace.Q) trace.Q {
	single := func(q trace.Q) bool { return q.From != "" && top.V*q.V < 0 }
	switch {
	case single(sub) && single(frm):
		q, _ := larger(l, id, "at the bottom of the lift under the arrangement that bends it in single curvature", axis, "M_b,"+axis+",alt", sub, frm)
		return q
	case single(sub):
		return sub
	case single(frm):
		return frm
	}
	return trace.Q{}
}
