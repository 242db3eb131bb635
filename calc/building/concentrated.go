package building

import (
	"colsheet/calc/frame"
	"colsheet/calc/trace"
)

// transferNote says how the column-moment analyses factor the load of a column that stops on a beam.
const transferNote = "The column's load (permanent, and the imposed load of the levels it carries) is factored with the loaded span's factors on loaded and lightly loaded spans alike: the arrangement of this level's spans does not relieve it (conservative)."

// pointLoad returns the factored load of one point load of the input on a beam under set s:
// fG·G + fQ·Q on a loaded span, fL·G on a lightly loaded one, as the span's distributed loads.
func (s loadSet) pointLoad(p PointOn, loaded bool) float64 {
	if !loaded {
		return s.fL * p.G
	}
	v := s.fG * p.G
	if p.Q != 0 {
		v += s.q(p.Cat) * p.Q
	}
	return v
}

// pointExtra returns what loading the span adds to the light load of one point load of the
// input: (fG − fL)·G + fQ·Q.
func (s loadSet) pointExtra(p PointOn) float64 {
	v := (s.fG - s.fL) * p.G
	if p.Q != 0 {
		v += s.q(p.Cat) * p.Q
	}
	return v
}

// transferLoad returns the factored load of a column that stops on a beam under set s,
// fG·G + ΣfQ·Q, the same on loaded and lightly loaded spans (transferNote).
func (s loadSet) transferLoad(t TransferOn) float64 {
	v := s.fG * t.G
	for _, c := range keys(t.Q) {
		if t.Q[c] != 0 {
			v += s.q(c) * t.Q[c]
		}
	}
	return v
}

// points returns the factored concentrated loads on a beam under set s, loaded or lightly
// loaded: the point loads of the input as the span, the transfers at their loaded value.
func (s loadSet) points(ld BeamLoad, loaded bool) []Point {
	var out []Point
	for _, p := range ld.Points {
		if v := s.pointLoad(p, loaded); v != 0 {
			out = append(out, Point{p.X, v})
		}
	}
	for _, t := range ld.Transfers {
		if v := s.transferLoad(t); v != 0 {
			out = append(out, Point{t.X, v})
		}
	}
	return out
}

// extraPoints returns the concentrated loads that loading a beam adds to its light load: those
// of the point loads of the input (the transfers are the same either way).
func (s loadSet) extraPoints(ld BeamLoad) []Point {
	var out []Point
	for _, p := range ld.Points {
		if v := s.pointExtra(p); v != 0 {
			out = append(out, Point{p.X, v})
		}
	}
	return out
}

// hasConcentrated reports whether a beam carries point loads of the input or columns stopping on it.
func (ld BeamLoad) hasConcentrated() bool { return len(ld.Points)+len(ld.Transfers) > 0 }

// beamFixedEnd returns the fixed-end moments of a beam under set s, loaded or lightly loaded:
// of its load pieces and of its concentrated loads.
func (s loadSet) beamFixedEnd(l float64, ld BeamLoad, loaded bool) (mStart, mEnd float64) {
	a0, a1 := frame.FixedEnd(l, s.pieces(ld, loaded))
	if !ld.hasConcentrated() {
		return a0, a1
	}
	p0, p1 := PointFixedEnd(l, s.points(ld, loaded))
	return a0 + p0, a1 + p1
}

// edgeLoad is a cantilever moment on a joint as numbers: permanent, imposed by category and its
// sense (EdgeMoment).
type edgeLoad struct {
	g         float64
	q         map[string]float64
	clockwise float64 // 0: no cantilever bears on the joint
}

// edgeOf returns the numbers of a traced cantilever moment.
func edgeOf(e EdgeMoment) edgeLoad {
	out := edgeLoad{g: e.G.V, clockwise: e.Clockwise, q: map[string]float64{}}
	for c, q := range e.Q {
		out.q[c] = q.V
	}
	return out
}

// levelEdge returns the moment that the cantilever slabs on the edge beams of level lv put on
// the joint of the column at (i, j) in the frames of direction d, as the take-down records it
// (CantileverTorsion of each slab on each beam that bears on the column, the take-down's order).
func levelEdge(lv *Level, d Dir, i, j int) edgeLoad {
	var out edgeLoad
	f := lv.Floor
	for _, e := range lv.endsAt(i, j) {
		bm := lv.Beams[e.beam]
		if bm.Dir == d { // a beam along y carries its torsion into the frames along x
			continue
		}
		for _, c := range lv.Loads[e.beam].Cants {
			if out.q == nil {
				out.q = map[string]float64{}
				out.clockwise = -1
				if (d == DirX && i == 0) || (d == DirY && j == 0) {
					out.clockwise = 1
				}
			}
			lc, l := trace.Const(c.Length, "l_c", "mm"), trace.Const(bm.L, "L", "mm")
			out.g += CantileverTorsion("", "", "", trace.Const(f.Gk, "g_k", "N/mm2"), lc, l, c.X0, c.X1, e.start).Value
			if f.Qk > 0 {
				out.q[f.Category] += CantileverTorsion("", "", "", trace.Const(f.Qk, "q_k", "N/mm2"), lc, l, c.X0, c.X1, e.start).Value
			}
		}
	}
	return out
}

// moment returns the clockwise moment of the cantilever on the joint under set s, the slab
// loaded (fG·M_G + ΣfQ·M_Q) or lightly loaded (fL·M_G), as a beam on its side.
func (e edgeLoad) moment(s loadSet, loaded bool) float64 {
	if e.clockwise == 0 {
		return 0
	}
	if !loaded {
		return e.clockwise * (s.fL * e.g)
	}
	v := s.fG * e.g
	for _, c := range keys(e.q) {
		v += s.q(c) * e.q[c]
	}
	return e.clockwise * v
}

// extra returns what loading the cantilever adds to its light moment on the joint,
// clockwise·((fG − fL)·M_G + ΣfQ·M_Q).
func (e edgeLoad) extra(s loadSet) float64 {
	if e.clockwise == 0 {
		return 0
	}
	v := (s.fG - s.fL) * e.g
	for _, c := range keys(e.q) {
		v += s.q(c) * e.q[c]
	}
	return e.clockwise * v
}

// cantileverJointMoment returns the moment that cantilever slabs put on a column's joint in a
// frame, as the end moment of a beam on their side, clockwise positive: c·(f_G·M_G + Σ f_Q·M_Q)
// on a loaded cantilever, c·f_L·M_G on a lightly loaded one, with c = +1 for a cantilever on
// the low-coordinate side and −1 on the high side (statics; common practice).
func cantileverJointMoment(id, title string, e EdgeMoment, s loadSet, loaded bool) trace.Step {
	fg, name := s.fL, "f_L"
	if loaded {
		fg, name = s.fG, "f_G"
	}
	args := []trace.Arg{trace.A("c", trace.Const(e.Clockwise, "c", "")), trace.A(name, trace.Const(fg, name, "")), trace.A("M_G", e.G)}
	expr := name + " * M_G"
	v := fg * e.G.V
	if loaded {
		for k, c := range keys(e.Q) {
			n := itoa(k + 1)
			f := s.q(c)
			args = append(args, trace.A("f_Q"+n, trace.Const(f, "f_Q,"+c, "")), trace.A("M_Q"+n, e.Q[c]))
			expr += " + f_Q" + n + " * M_Q" + n
			v += f * e.Q[c].V
		}
	}
	return trace.Formula(id, title, "common practice (statics)", "M_cant", "Nmm", e.Clockwise*v, "c * ("+expr+")", args...).
		Note("The cantilever slabs act on the joint as a beam on their side whose end moment is c·M (c = +1 beyond the first grid line, −1 beyond the last), without stiffness of their own; clockwise positive.")
}

// concentratedFEMs returns the steps of the fixed-end moments at one end of a beam of its
// concentrated loads under set s, one per source: each point load of the input (factored as
// the span, loaded or lightly loaded) and each column that stops on the beam (at its loaded
// value, transferNote); the handbook formulas P·a·b²/L² and P·a²·b/L².
func concentratedFEMs(id, beam string, side frame.Side, l trace.Q, ld BeamLoad, s loadSet, loaded bool) []trace.Step {
	var out []trace.Step
	how := ", loaded (" + s.loaded + ")"
	if !loaded {
		how = ", lightly loaded (" + s.light + ")"
	}
	for _, p := range ld.Points {
		v := s.pointLoad(p, loaded)
		if v == 0 {
			continue
		}
		n := itoa(p.Load + 1)
		st := PointFEMStep(id+"/point"+n, "Fixed-end moment at the column of point load "+n+" on beam "+beam+how, side, l, []Point{{p.X, v}})
		st.Symbol = "M_F,point" + n
		out = append(out, st.Note("Point load "+n+" of the input: the share the beam carries (lever rule, as in the take-down), factored as the span's distributed loads."))
	}
	for _, t := range ld.Transfers {
		v := s.transferLoad(t)
		if v == 0 {
			continue
		}
		st := PointFEMStep(id+"/xfer/"+t.Column, "Fixed-end moment at the column of column "+t.Column+" stopping on this beam ("+s.loaded+")", side, l, []Point{{t.X, v}})
		st.Symbol = "M_F," + t.Column
		out = append(out, st.Note("The beam's share of the load at the foot of column "+t.Column+" (as in the take-down). "+transferNote))
	}
	return out
}
