package building

import (
	"math"

	"colsheet/calc/actions"
	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// jointResult is the traced outcome of the subframe at one joint and direction.
type jointResult struct {
	below, above frame.JointColumn // the columns below and above the joint
	aboveAlt     frame.JointColumn // the column above under the other side's arrangement, when both sides have a beam
}

// beamsAt returns the indices of the beams of direction d on the left (ending at the column)
// and on the right (starting at it) of the column at (i, j); -1 where there is none.
func (lv *Level) beamsAt(d Dir, i, j int) (left, right int) {
	left, right = -1, -1
	line, at := j, i
	if d == DirY {
		line, at = i, j
	}
	for k, b := range lv.Beams {
		if b.Dir != d || b.Line != line {
			continue
		}
		if b.To == at {
			left = k
		}
		if b.From == at {
			right = k
		}
	}
	return
}

// inPlaneI returns the second moment of area of a column section for bending in the frames
// of direction d: frames along x bend it about section axis y (lever arm h, along x).
func inPlaneI(s model.Size, d Dir) float64 {
	if d == DirX {
		return s.B * s.H * s.H * s.H / 12
	}
	return s.H * s.B * s.B * s.B / 12
}

// factored returns the pieces of γG·G + γQ·ΣQ (loaded) or γG,light·G (light) of a beam.
func factored(ld BeamLoad, gammaG, gammaQ float64, loaded bool) []frame.Piece {
	var out []frame.Piece
	for _, p := range ld.G {
		out = append(out, p.Scale(gammaG))
	}
	if loaded {
		for _, c := range keys(ld.Q) {
			for _, p := range ld.Q[c] {
				out = append(out, p.Scale(gammaQ))
			}
		}
	}
	return frame.Merge(out)
}

// joint records the simplified subframe (common practice) at the joint of the column at
// (i, j) on level m for the frames of direction d, under the load arrangement of
// EN 1992-1-1:2004 5.1.3 that gives the larger unbalanced moment: the span on one side with
// γG·Gk + γQ·Qk, the other with γG,light·Gk. Where both sides give the same, the sense that
// bends the lifts in single curvature is taken (alternating up the column, conservative).
func joint(l *trace.Log, in *model.Input, levels []Level, lifts []Lift, m int, d Dir, i, j int, e trace.Q) jointResult {
	b := in.Building
	p := in.Code
	lv := &levels[m]
	pre := "sub" + d.String() + "/" + lv.Name + "/"
	axis := d.Axis()
	l.Group = "Column moments about " + axis + ": subframe at level " + lv.Name + " (frame along " + d.String() + ")"
	gG := l.Add(actions.ParamStep(pre+"gamma_G", p, "gamma_G", ""))
	gQ := l.Add(actions.ParamStep(pre+"gamma_Q", p, "gamma_Q", ""))
	gL := l.Add(actions.ParamStep(pre+"gamma_G_light", p, "gamma_G_light", ""))
	left, right := lv.beamsAt(d, i, j)
	factor := 0.5
	if b.Options.BeamStiffness == "full" {
		factor = 1
	}
	kBeam := trace.Const(factor, "k_b", "")
	var jt frame.Joint
	type side struct {
		loaded, light trace.Q
		k             trace.Q
	}
	var sides [2]*side
	for s, k := range []int{left, right} {
		if k < 0 {
			continue
		}
		bm := lv.Beams[k]
		ld := lv.Loads[k]
		name := bm.Name()
		end := frame.AtEnd
		if s == 1 {
			end = frame.AtStart
		}
		L := l.Add(trace.Input(pre+name+"/L", "Span of beam "+name, "input", "L_"+name, "mm", bm.L))
		st := frame.FEMStep(pre+name+"/FEM_loaded", "Fixed-end moment at the column, beam "+name+" loaded (γG·Gk + γQ·Qk)", end, L, factored(ld, gG.V, gQ.V, true))
		st.Symbol = "M_F," + name + ",max"
		loaded := l.Add(st.Note("Loads: slab, self-weight and line loads on the beam, factored; clockwise positive."))
		st = frame.FEMStep(pre+name+"/FEM_light", "Fixed-end moment at the column, beam "+name+" lightly loaded (γG,light·Gk)", end, L, factored(ld, gL.V, 0, false))
		st.Symbol = "M_F," + name + ",min"
		light := l.Add(st)
		ib := l.Add(trace.Formula(pre+name+"/I", "Second moment of area of beam "+name, "common practice", "I_"+name, "mm4",
			bm.Size.B*math.Pow(bm.Size.H, 3)/12, "b * h ** 3 / 12", trace.A("b", trace.Const(bm.Size.B, "b_b", "mm")), trace.A("h", trace.Const(bm.Size.H, "h_b", "mm"))))
		ks := frame.StiffnessStep(pre+name+"/k", "Stiffness of beam "+name+" at the joint", kBeam, e, ib, L)
		ks.Symbol = "k_" + name
		kq := l.Add(ks)
		sides[s] = &side{loaded, light, kq}
	}
	var loadedFEM, lightFEM [2]float64
	for s := 0; s < 2; s++ {
		if sides[s] != nil {
			loadedFEM[s], lightFEM[s] = sides[s].loaded.V, sides[s].light.V
		}
	}
	choice := chooseLoaded(loadedFEM, lightFEM, m)
	for s := 0; s < 2; s++ {
		if sides[s] == nil {
			continue
		}
		fem := sides[s].light
		if s == choice {
			fem = sides[s].loaded
		}
		jb := &frame.JointBeam{K: sides[s].k, FEM: fem}
		if s == 0 {
			jt.Left = jb
		} else {
			jt.Right = jb
		}
	}
	// Columns above and below the joint.
	colK := func(lift int, name string, pinnedFar bool) *trace.Q {
		lf := lifts[lift]
		iq := l.Add(trace.Formula(pre+name+"/I", "Second moment of area of the column "+name+" in the frame's plane", "common practice", "I_c,"+name, "mm4",
			inPlaneI(lf.Size, d), iExpr(d), trace.A("b", trace.Const(lf.Size.B, "b", "mm")), trace.A("h", trace.Const(lf.Size.H, "h", "mm"))))
		lq := l.Add(trace.Input(pre+name+"/L", "Height of the column "+name, "input", "L_c,"+name, "mm", lf.Height))
		k := trace.Const(1, "k_c", "")
		if pinnedFar {
			k = trace.Const(0.75, "k_c", "")
		}
		ks := frame.StiffnessStep(pre+name+"/k", "Stiffness of the column "+name, k, e, iq, lq)
		ks.Symbol = "k_c," + name
		if pinnedFar {
			ks = ks.Note("Pinned base: far end pinned, stiffness 3EI/L.")
		}
		q := l.Add(ks)
		return &q
	}
	if m+1 < len(lifts) {
		jt.Above = colK(m+1, "above", false)
	}
	jt.Below = colK(m, "below", m == 0 && b.Base == model.BasePinned)
	js := jt.Steps(pre)
	for idx := range js.Steps {
		l.Add(js.Steps[idx])
	}
	if last := js.Steps; len(last) > 0 {
		l.Steps[len(l.Steps)-len(last)] = l.Steps[len(l.Steps)-len(last)].Note(arrangementNote(choice, sides[0] != nil, sides[1] != nil))
	}
	res := jointResult{below: js.Below, above: js.Above}
	// The other side loaded: with unequal spans the two arrangements turn the joint the same way
	// or not; the lift above may be bent in single curvature by this one (see assembleMoments).
	if sides[0] != nil && sides[1] != nil && jt.Above != nil {
		alt := jt
		other := 1 - choice
		l0 := &frame.JointBeam{K: sides[0].k, FEM: sides[0].light}
		r0 := &frame.JointBeam{K: sides[1].k, FEM: sides[1].light}
		if other == 0 {
			l0.FEM = sides[0].loaded
		} else {
			r0.FEM = sides[1].loaded
		}
		alt.Left, alt.Right, alt.Below = l0, r0, jt.Below
		l.Group = "Column moments about " + axis + ": subframe at level " + lv.Name + ", the other side loaded"
		ja := alt.Steps(pre + "alt/")
		for idx := range ja.Steps {
			l.Add(ja.Steps[idx])
		}
		res.aboveAlt = ja.Above
	}
	return res
}

func iExpr(d Dir) string {
	if d == DirX {
		return "b * h ** 3 / 12"
	}
	return "h * b ** 3 / 12"
}

func arrangementNote(choice int, hasLeft, hasRight bool) string {
	switch {
	case hasLeft && hasRight && choice == 0:
		return "Arrangement (EN 1992-1-1 5.1.3): the beam on the left (lower coordinate) loaded, the one on the right lightly loaded."
	case hasLeft && hasRight:
		return "Arrangement (EN 1992-1-1 5.1.3): the beam on the right (higher coordinate) loaded, the one on the left lightly loaded."
	case hasLeft || hasRight:
		return "Edge column: the one beam loaded."
	}
	return "No beam frames into the column in this direction."
}

// endQ holds the clockwise end moments of the column of one lift in one direction, and a
// bottom moment of another arrangement that may bend the lift in single curvature.
type endQ struct{ top, bot, botAlt trace.Q }

// subframeEnds records the simplified subframe at each level of one column and returns the
// clockwise end moments of each lift's column in each direction. The moment at the bottom of a
// lift comes from the joint below, recorded on the lower lift's sheet, or from the base.
func subframeEnds(in *model.Input, levels []Level, lifts []Lift) [][2]endQ {
	b := in.Building
	id := lifts[0].Column
	i, j := lifts[0].I, lifts[0].J
	results := make([][2]jointResult, len(lifts))
	for m := range lifts {
		l := &trace.Log{Steps: lifts[m].Steps}
		e := modulusStep(l, in)
		for d := DirX; d <= DirY; d++ {
			results[m][d] = joint(l, in, levels, lifts, m, d, i, j, e)
		}
		lifts[m].Steps = l.Steps
	}
	out := make([][2]endQ, len(lifts))
	for m := range lifts {
		for d := DirX; d <= DirY; d++ {
			e := endQ{top: results[m][d].below.AtJoint}
			switch {
			case m > 0:
				e.bot = absolute(results[m-1][d].above.AtJoint, id, lifts[m-1].Name)
				if alt := results[m-1][d].aboveAlt; alt.Present {
					e.botAlt = absolute(alt.AtJoint, id, lifts[m-1].Name)
				}
			case b.Base == model.BasePinned:
				e.bot = trace.Const(0, "M_base", "Nmm")
			default:
				e.bot = results[m][d].below.FarEnd
			}
			out[m][d] = e
		}
	}
	return out
}

// modulusStep records the modulus of elasticity used for the member stiffnesses.
func modulusStep(l *trace.Log, in *model.Input) trace.Q {
	l.Group = "Column moments: stiffness"
	return l.Add(trace.Input("sub/E", "Modulus of elasticity for the member stiffnesses (Ecm)", "EN 1992-1-1:2004 Table 3.1", "E", "MPa", in.Materials.Concrete.Ecm).
		Note("The same modulus for beams and columns: the distribution depends only on I/L."))
}

// assembleMoments records the first-order end moments of every lift of one column in the
// input's convention: top and bottom of the same sign bend the lift in single curvature.
func assembleMoments(lifts []Lift, ends [][2]endQ) {
	for m := range lifts {
		l := &trace.Log{Steps: lifts[m].Steps}
		for d := DirX; d <= DirY; d++ {
			axis := d.Axis()
			l.Group = "First-order end moments about " + axis + " of lift " + lifts[m].Name
			top, bot := ends[m][d].top, ends[m][d].bot
			topS := trace.Formula("mom/"+axis+"/top", "Moment at the top of the lift about "+axis+" (same sign at both ends: single curvature)",
				"common practice", "M_top,"+axis, "Nmm", top.V, "M_j", trace.A("M_j", top)).
				Note("The column's clockwise end moment at its top.")
			botS := trace.Formula("mom/"+axis+"/bot", "Moment at the bottom of the lift about "+axis, "common practice", "M_bot,"+axis, "Nmm",
				-bot.V, "-M_i", trace.A("M_i", bot)).
				Note("Minus the column's clockwise end moment at its bottom.")
			tq, bq := l.Add(topS), l.Add(botS)
			me := model.Ends{Top: tq.V, Bottom: bq.V}
			// Where the arrangements bend the lift in double curvature, the other arrangement at the
			// joint below may bend it in single curvature, which the design checks too.
			if alt := ends[m][d].botAlt; alt.From != "" && tq.V*bq.V < 0 && tq.V*alt.V < 0 {
				lifts[m].Src.BotAlt[d] = l.Add(trace.Formula("mom/"+axis+"/bot_alt", "Moment at the bottom of the lift about "+axis+", the other side loaded at the joint below (single curvature)",
					"common practice; EN 1992-1-1:2004 5.1.3", "M_bot,"+axis+",alt", "Nmm", -alt.V, "-M_i", trace.A("M_i", alt)).
					Note("With this arrangement the lift bends in single curvature; the design is checked for it as well."))
			}
			if d == DirX {
				lifts[m].MY = me
				lifts[m].Src.MYTop, lifts[m].Src.MYBot = tq, bq
			} else {
				lifts[m].MZ = me
				lifts[m].Src.MZTop, lifts[m].Src.MZBot = tq, bq
			}
		}
		lifts[m].Steps = l.Steps
	}
}

// chooseLoaded returns the side (0 left, 1 right) to load at a joint on level m, given the
// fixed-end moments at the joint of each side's beam loaded and lightly loaded (0 where there
// is no beam): the side whose arrangement gives the larger unbalanced moment; where both give
// the same, the one whose sense alternates up the column, so that the lifts bend in single
// curvature (conservative).
func chooseLoaded(loaded, light [2]float64, m int) int {
	unb := [2]float64{loaded[0] + light[1], light[0] + loaded[1]}
	switch {
	case math.Abs(math.Abs(unb[0])-math.Abs(unb[1])) <= 1e-9*math.Max(math.Abs(unb[0]), 1):
		want := 1.0
		if m%2 == 1 {
			want = -1
		}
		if unb[0]*want < 0 {
			return 1
		}
		return 0
	case math.Abs(unb[1]) > math.Abs(unb[0]):
		return 1
	}
	return 0
}

// lightBeam returns the beam of direction d at the column (i, j) on level m that the moment
// arrangement loads lightly, or -1 when the column has a beam on one side only (then that beam
// is loaded) or none.
func lightBeam(lv *Level, d Dir, i, j, m int, gG, gQ, gL float64) int {
	left, right := lv.beamsAt(d, i, j)
	if left < 0 || right < 0 {
		return -1
	}
	var loaded, light [2]float64
	for s, k := range []int{left, right} {
		bm := lv.Beams[k]
		a0, a1 := frame.FixedEnd(bm.L, factored(lv.Loads[k], gG, gQ, true))
		b0, b1 := frame.FixedEnd(bm.L, factored(lv.Loads[k], gL, 0, false))
		if s == 0 { // the joint is at the left beam's end
			loaded[s], light[s] = a1, b1
		} else {
			loaded[s], light[s] = a0, b0
		}
	}
	if chooseLoaded(loaded, light, m) == 0 {
		return right
	}
	return left
}
