package building

import (
	"math"

	"colsheet/calc/actions"
	"colsheet/calc/code"
	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// jointResult is the traced outcome of the subframe at one joint and direction.
type jointResult struct {
	set          int               // the main load set (index into loadSets) whose arrangement governs
	below, above frame.JointColumn // the columns below and above the joint
	aboveAlt     frame.JointColumn // the column above under the other side's arrangement, when both sides carry load
	// The columns below and above with the least-axial-force set (γG,inf on every span).
	minBelow, minAbove frame.JointColumn
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
// of direction d: frames along x bend it about section axis y (lever arm h, along x); a circle
// has π·D⁴/64 about every axis.
func inPlaneI(s model.Size, d Dir) float64 {
	if s.Shape == model.ShapeCircle {
		return math.Pi * s.B * s.B * s.B * s.B / 64
	}
	if d == DirX {
		return s.B * s.H * s.H * s.H / 12
	}
	return s.H * s.B * s.B * s.B / 12
}

// jointFEMs returns the fixed-end moments at the joint (left, right; 0 where there is none) of
// the beams of direction d at the column (i, j), loaded and light under set s: of their
// distributed and concentrated loads, and on the side beyond the edge the moment of cantilever
// slabs there, which acts as a beam on that side would.
func jointFEMs(lv *Level, d Dir, i, j int, s loadSet) (loaded, light [2]float64, ok [2]bool) {
	left, right := lv.beamsAt(d, i, j)
	for side, k := range []int{left, right} {
		if k < 0 {
			continue
		}
		bm := lv.Beams[k]
		a0, a1 := s.beamFixedEnd(bm.L, lv.Loads[k], true)
		b0, b1 := s.beamFixedEnd(bm.L, lv.Loads[k], false)
		ok[side] = true
		if side == 0 { // the joint is at the left beam's end
			loaded[side], light[side] = a1, b1
		} else {
			loaded[side], light[side] = a0, b0
		}
	}
	if e := levelEdge(lv, d, i, j); e.clockwise != 0 {
		side := cantileverSide(e.clockwise)
		loaded[side] += e.moment(s, true)
		light[side] += e.moment(s, false)
		ok[side] = true
	}
	return
}

// cantileverSide returns the side of the joint (0 left, 1 right) that a cantilever of the given
// sense (EdgeMoment.Clockwise) lies on.
func cantileverSide(clockwise float64) int {
	if clockwise < 0 {
		return 1
	}
	return 0
}

// governingSet returns the index of the main load set whose arrangement gives the largest
// unbalanced moment at the joint of the column at (i, j) on level m in the frames of direction d,
// and the side it loads (0 left, 1 right).
func governingSet(lv *Level, d Dir, i, j, m int, sets []loadSet) (set, side int) {
	best := -1.0
	for k, s := range mainSets(sets) {
		loaded, light, _ := jointFEMs(lv, d, i, j, s)
		c := chooseLoaded(loaded, light, m)
		unb := [2]float64{loaded[0] + light[1], light[0] + loaded[1]}[c]
		if v := math.Abs(unb); v > best*(1+1e-12) {
			best, set, side = v, k, c
		}
	}
	return set, side
}

// joint records the simplified subframe (common practice) at the joint of the column at
// (i, j) on level m for the frames of direction d, under the load arrangement of
// EN 1992-1-1:2004 5.1.3 that gives the larger unbalanced moment: the span on one side loaded,
// the other lightly loaded, with the factors of the expression of the combination rule that
// gives the larger unbalanced moment. Where both sides give the same, the sense that bends the
// lifts in single curvature is taken (alternating up the column, conservative). It records the
// same joint with γG,inf on every span as well (the least axial force with these moments).
func joint(l *trace.Log, in *model.Input, levels []Level, lifts []Lift, m int, d Dir, i, j int, e stiffness, sets []loadSet) jointResult {
	b := in.Building
	p := in.Code
	lv := &levels[m]
	pre := "sub" + d.String() + "/" + lv.Name + "/"
	axis := d.Axis()
	l.Group = "Column moments about " + axis + ": subframe at level " + lv.Name + " (frame along " + d.String() + ")"
	left, right := lv.beamsAt(d, i, j)
	kBeam := e.kBeam
	var sides [2]*jointSide
	for s, k := range []int{left, right} {
		if k < 0 {
			continue
		}
		bm := lv.Beams[k]
		name := bm.Name()
		end := frame.AtEnd
		if s == 1 {
			end = frame.AtStart
		}
		L := l.Add(trace.Input(pre+name+"/L", "Span of beam "+name, "input", "L_"+name, "mm", bm.L))
		ib := l.Add(trace.Formula(pre+name+"/I", "Second moment of area of beam "+name, "common practice", "I_"+name, "mm4",
			bm.Size.B*math.Pow(bm.Size.H, 3)/12, "b * h ** 3 / 12", trace.A("b", trace.Const(bm.Size.B, "b_b", "mm")), trace.A("h", trace.Const(bm.Size.H, "h_b", "mm"))))
		ks := frame.StiffnessStep(pre+name+"/k", "Stiffness of beam "+name+" at the joint", kBeam, e.beam, ib, L)
		ks.Symbol = "k_" + name
		sides[s] = &jointSide{k: l.Add(ks), L: L, end: end, beam: k, label: name}
	}
	if sides[0] != nil && sides[1] != nil {
		spanRatioCaution(l, pre, in.Building.Options.SpanRatio, sides[0].L, sides[1].L)
	}
	// Cantilever slabs beyond the edge act on the joint as a beam on their side, without stiffness.
	if cant := lifts[m].Cantilever[d]; cant.Clockwise != 0 && cant.G.From != "" {
		s := cantileverSide(cant.Clockwise)
		if sides[s] == nil {
			sides[s] = &jointSide{k: trace.Const(0, "k_cant", "Nmm"), beam: -1, label: "cant"}
		}
		sides[s].cant = &cant
	}
	// Columns above and below the joint.
	colK := func(lift int, name string, pinnedFar bool, e trace.Q) *trace.Q {
		lf := lifts[lift]
		iq := l.Add(columnI(pre+name+"/I", name, lf.Size, d))
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
	var above, below *trace.Q
	if m+1 < len(lifts) {
		above = colK(m+1, "above", false, e.above)
	}
	below = colK(m, "below", m == 0 && b.Base == model.BasePinned, e.below)
	factorSteps(l, pre, p, sets)

	// solve records the fixed-end moments of set s and the distribution at the joint under the
	// arrangement that loads side choice (the other lightly loaded), with step IDs under sub.
	solve := func(s loadSet, sub string, choice int, why string) frame.JointSteps {
		var fem [2]trace.Q
		for k, sd := range sides {
			if sd == nil {
				continue
			}
			loaded := k == choice || sides[1-k] == nil
			fem[k] = sideFEM(l, lv, pre+sub, sd, s, loaded)
		}
		jt := frame.Joint{Above: above, Below: below}
		for k, sd := range sides {
			if sd == nil {
				continue
			}
			jb := &frame.JointBeam{K: sd.k, FEM: fem[k]}
			if k == 0 {
				jt.Left = jb
			} else {
				jt.Right = jb
			}
		}
		js := jt.Steps(pre + sub)
		for idx := range js.Steps {
			if idx == 0 {
				js.Steps[idx] = js.Steps[idx].Note(sidesNote(choice, sides) + " Factors of " + s.label + why)
			}
			l.Add(js.Steps[idx])
		}
		return js
	}

	set, choice := governingSet(lv, d, i, j, m, sets)
	why := "."
	if len(mainSets(sets)) > 1 {
		why = ": of the expressions of the combination rule, the one that gives the larger unbalanced moment at this joint."
	}
	res := jointResult{set: set}
	js := solve(sets[set], "", choice, why)
	res.below, res.above = js.Below, js.Above
	// The other side loaded: with unequal spans the two arrangements turn the joint the same way
	// or not; the lift above may be bent in single curvature by this one (see assembleMoments).
	if sides[0] != nil && sides[1] != nil && above != nil {
		l.Group = "Column moments about " + axis + ": subframe at level " + lv.Name + ", the other side loaded"
		ja := solve(sets[set], "alt/", 1-choice, ".")
		res.aboveAlt = ja.Above
	}
	// The least axial force: every span's permanent load favourable, γG,inf, with the imposed
	// load on the side that gives the larger unbalanced moment.
	inf := sets[len(sets)-1]
	loaded, light, _ := jointFEMs(lv, d, i, j, inf)
	l.Group = "Column moments about " + axis + ": subframe at level " + lv.Name + ", permanent load favourable (γG,inf, least axial force)"
	jm := solve(inf, "inf/", chooseLoaded(loaded, light, m), ": the permanent load favourable on every span (EN 1990 Table A1.2(B), Note 3), for the least axial force with these moments.")
	res.minBelow, res.minAbove = jm.Below, jm.Above
	return res
}

// factorSteps records the partial factors that the load sets of the arrangements use.
func factorSteps(l *trace.Log, pre string, p code.Params, sets []loadSet) {
	names := []string{"gamma_G", "gamma_Q", "gamma_G_light", "gamma_G_inf"}
	for _, s := range sets {
		if s.expr == actions.Expr610b {
			names = append(names, "xi")
			break
		}
	}
	for _, n := range names {
		l.Add(actions.ParamStep(pre+n, p, n, ""))
	}
}

// columnI returns the step of the second moment of area of the column called name, of section
// s, in the plane of the frames of direction d: b·h³/12 of a rectangle, π·D⁴/64 of a circle
// (geometry, common practice).
func columnI(id, name string, s model.Size, d Dir) trace.Step {
	if s.Shape == model.ShapeCircle {
		return trace.Formula(id, "Second moment of area of the circular column "+name, "common practice", "I_c,"+name, "mm4",
			inPlaneI(s, d), "pi * D ** 4 / 64", trace.A("pi", piConst), trace.A("D", trace.Const(s.B, "D", "mm")))
	}
	return trace.Formula(id, "Second moment of area of the column "+name+" in the frame's plane", "common practice", "I_c,"+name, "mm4",
		inPlaneI(s, d), iExpr(d), trace.A("b", trace.Const(s.B, "b", "mm")), trace.A("h", trace.Const(s.H, "h", "mm")))
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
type endQ struct {
	top, bot, botAlt trace.Q
	set              int     // the main load set of the arrangement at the top
	minTop, minBot   trace.Q // with the least-axial-force set (γG,inf on every span)
}

// subframeEnds records the simplified subframe at each level of one column and returns the
// clockwise end moments of each lift's column in each direction. The moment at the bottom of a
// lift comes from the joint below, recorded on the lower lift's sheet, or from the base.
func subframeEnds(in *model.Input, levels []Level, lifts []Lift) [][2]endQ {
	b := in.Building
	id := lifts[0].Column
	i, j := lifts[0].I, lifts[0].J
	sets := loadSets(in)
	results := make([][2]jointResult, len(lifts))
	for m := range lifts {
		l := &trace.Log{Steps: lifts[m].Steps}
		e := moduliSteps(l, in, lifts, m)
		e.kBeam = beamFactor(l, in)
		for d := DirX; d <= DirY; d++ {
			results[m][d] = joint(l, in, levels, lifts, m, d, i, j, e, sets)
		}
		lifts[m].Steps = l.Steps
	}
	out := make([][2]endQ, len(lifts))
	for m := range lifts {
		for d := DirX; d <= DirY; d++ {
			r := results[m][d]
			e := endQ{top: r.below.AtJoint, minTop: r.minBelow.AtJoint, set: r.set}
			switch {
			case m > 0:
				rb := results[m-1][d]
				e.bot = absolute(rb.above.AtJoint, id, lifts[m-1].Name)
				e.minBot = absolute(rb.minAbove.AtJoint, id, lifts[m-1].Name)
				if alt := rb.aboveAlt; alt.Present {
					e.botAlt = absolute(alt.AtJoint, id, lifts[m-1].Name)
				}
			case b.Base == model.BasePinned:
				e.bot = trace.Const(0, "M_base", "Nmm")
				e.minBot = e.bot
			default:
				e.bot, e.minBot = r.below.FarEnd, r.minBelow.FarEnd
			}
			out[m][d] = e
		}
	}
	return out
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
					"EN 1992-1-1:2004 5.1.3(1)P", "M_bot,"+axis+",alt", "Nmm", -alt.V, "-M_i", trace.A("M_i", alt)).
					Note("With this arrangement the lift bends in single curvature; the design is checked for it as well."))
			}
			// The arrangement's axial force under the same expression as its moments, and the
			// least axial force (γG,inf) with the moments of the same arrangement.
			if narr := lifts[m].narr[d]; len(narr) > 0 {
				lifts[m].Src.NArr[d] = narr[ends[m][d].set]
				if mt, mb := ends[m][d].minTop, ends[m][d].minBot; mt.From != "" {
					l.Group = "First-order end moments about " + axis + " of lift " + lifts[m].Name + ", permanent load favourable (least axial force)"
					tq := l.Add(trace.Formula("mom/"+axis+"/top_min", "Moment at the top of the lift about "+axis+", permanent load favourable",
						"common practice", "M_top,"+axis+",inf", "Nmm", mt.V, "M_j", trace.A("M_j", mt)).
						Note("The column's clockwise end moment at its top under the arrangement with γG,inf on every span."))
					bq := tq
					if mb.From != "" || mb.V != 0 {
						bq = l.Add(trace.Formula("mom/"+axis+"/bot_min", "Moment at the bottom of the lift about "+axis+", permanent load favourable",
							"common practice", "M_bot,"+axis+",inf", "Nmm", -mb.V, "-M_i", trace.A("M_i", mb)).
							Note("Minus the column's clockwise end moment at its bottom."))
					} else {
						bq = l.Add(trace.Input("mom/"+axis+"/bot_min", "Moment at the bottom of the lift about "+axis+", permanent load favourable (pinned base)", "common practice", "M_bot,"+axis+",inf", "Nmm", 0))
					}
					lifts[m].Src.Min[d] = MinCase{N: narr[len(narr)-1], Top: tq, Bot: bq}
				}
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
// arrangement of set s leaves lightly loaded, or -1 when the column has a beam on one side only
// and no cantilever slabs beyond it (then that beam is loaded), none, or when the arrangement
// leaves the cantilever slabs lightly loaded (their load reaches the column through the beams of
// the other direction and stays in the axial force).
func lightBeam(lv *Level, d Dir, i, j, m int, s loadSet) int {
	left, right := lv.beamsAt(d, i, j)
	loaded, light, ok := jointFEMs(lv, d, i, j, s)
	if !ok[0] || !ok[1] {
		return -1
	}
	if chooseLoaded(loaded, light, m) == 0 {
		return right
	}
	return left
}

// jointSide is one side of a subframe joint: a beam, or cantilever slabs beyond the edge (beam
// −1), which act as a beam there without stiffness; or both.
type jointSide struct {
	k, L  trace.Q
	end   frame.Side
	beam  int // index of the beam in the level, −1 where only cantilever slabs lie on this side
	label string
	cant  *EdgeMoment // the cantilever slabs on this side; nil where none
}

// sideFEM records the fixed-end moment at the joint of one side under set s, loaded or lightly
// loaded, with step IDs under pre: the beam's distributed loads, and where the side carries
// more, each concentrated load and the cantilever's moment with their sum.
func sideFEM(l *trace.Log, lv *Level, pre string, sd *jointSide, s loadSet, loaded bool) trace.Q {
	var parts []trace.Q
	id, title, sym := pre+sd.label+"/FEM_loaded", "Fixed-end moment at the column, beam "+sd.label+" loaded ("+s.loaded+")", "M_F,"+sd.label+",max"
	if !loaded {
		id, title, sym = pre+sd.label+"/FEM_light", "Fixed-end moment at the column, beam "+sd.label+" lightly loaded ("+s.light+")", "M_F,"+sd.label+",min"
	}
	if sd.beam >= 0 {
		ld := lv.Loads[sd.beam]
		st := frame.FEMStep(id, title, sd.end, sd.L, s.pieces(ld, loaded))
		st.Symbol = sym
		st = st.Note("Loads: slab, self-weight and line loads on the beam, factored; clockwise positive.")
		conc := concentratedFEMs(id, sd.label, sd.end, sd.L, ld, s, loaded)
		if len(conc) == 0 && sd.cant == nil {
			return l.Add(st)
		}
		st.ID, st.Title, st.Symbol = id+"/lines", title+": distributed loads", sym+",line"
		parts = append(parts, l.Add(st))
		for _, c := range conc {
			parts = append(parts, l.Add(c))
		}
	}
	if sd.cant != nil {
		cid, ctitle := pre+"cant/M_loaded", "Moment of the cantilever slabs on the joint, loaded ("+s.loaded+")"
		if !loaded {
			cid, ctitle = pre+"cant/M_light", "Moment of the cantilever slabs on the joint, lightly loaded ("+s.light+")"
		}
		parts = append(parts, l.Add(cantileverJointMoment(cid, ctitle, *sd.cant, s, loaded)))
		if sd.beam < 0 {
			return parts[0]
		}
	}
	return l.Add(Sum(id, title, "common practice", sym, "Nmm", parts).
		Note("The fixed-end moments of the distributed loads and of each concentrated load (and the cantilever's moment on this side) added: superposition."))
}

// sidesNote describes the arrangement at a joint that loads side choice: arrangementNote where
// only beams frame in, otherwise naming the cantilever slabs.
func sidesNote(choice int, sides [2]*jointSide) string {
	cantOnly := func(sd *jointSide) bool { return sd != nil && sd.beam < 0 }
	if !cantOnly(sides[0]) && !cantOnly(sides[1]) {
		return arrangementNote(choice, sides[0] != nil, sides[1] != nil)
	}
	if sides[0] == nil || sides[1] == nil {
		return "Cantilever slabs only: loaded."
	}
	if cantOnly(sides[choice]) {
		return "Arrangement (EN 1992-1-1 5.1.3): the cantilever slabs beyond the edge loaded, the beam lightly loaded."
	}
	return "Arrangement (EN 1992-1-1 5.1.3): the beam loaded, the cantilever slabs beyond the edge lightly loaded."
}
