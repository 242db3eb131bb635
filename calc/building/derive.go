package building

import (
	"colsheet/calc/work"
	"fmt"
	"slices"
	"strings"

	"colsheet/calc/actions"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// Lift is the derived design data of one column over one lift, with the trace of its derivation.
type Lift struct {
	Column string     // column id, e.g. "B2"
	I, J   int        // grid line indices
	Level  int        // index of the storey
	Name   string     // name of the level at its top
	Size   model.Size // B along building y, H along building x
	Height float64    // storey height, mm
	NEd    float64    // design axial force at the bottom of the lift, N
	MY, MZ model.Ends // first-order end moments about section axes y and z, N·mm (same sign: single curvature)
	Src    Sources    // the steps that give NEd and the end moments
	Steps  []trace.Step
	// Cantilever holds, for the frames along x and y (about section axes y and z), the moment
	// that cantilever slabs beyond edge beams apply to the joint at the top of the lift (see
	// EdgeMoment for its sign), for the column-moment analysis to add.
	Cantilever [2]EdgeMoment
	narr       [2][]trace.Q       // the axial force of the moment arrangements about y and z, by load set
	alphaN     map[string]trace.Q // αn applied to NEd, by category
	gCum       trace.Q            // the cumulative characteristic loads at the foot of the lift
	qCum       map[string]trace.Q
	run        int // the index of the lift within its run of lifts that stand one on another, from the lowest
}

// Sources names the traced quantities that the column design takes from the derivation.
type Sources struct {
	NEd                        trace.Q
	NArr                       [2]trace.Q // NEd of the moment arrangements in the frames along x and y
	L0                         [2]trace.Q // effective lengths about y and z by Eq. (5.15); zero when not derived
	RatioQP                    trace.Q    // NEd,qp/NEd, standing for M0Eqp/M0Ed in Eq. (5.19); zero when not derived
	BotAlt                     [2]trace.Q // bottom moments about y and z of an arrangement that bends the lift in single curvature; zero when none
	MYTop, MYBot, MZTop, MZBot trace.Q
	// Min holds, about y and z, the least axial force that goes with the moment arrangement
	// (permanent actions favourable, γG,inf) and the end moments of that arrangement.
	Min [2]MinCase
}

// MinCase is the least axial force of a moment arrangement with its end moments about one axis.
type MinCase struct{ N, Top, Bot trace.Q }

// Derived is everything derived from the building form.
type Derived struct {
	Grid   *Grid
	Levels []Level
	Lifts  []Lift // by column (A1, A2, …, B1, …), each lowest lift first
}

// columnSize returns the section of a column over a lift, the last matching override winning.
func columnSize(b *model.Building, id, level string) model.Size {
	s := b.Column
	for _, o := range b.Columns {
		if contains(o.IDs, id) && contains(o.Levels, level) {
			s = o.Size
		}
	}
	return s
}

// columnWeight records the section of a column over a lift, the storey height and the
// self-weight of the lift, and returns the self-weight.
func columnWeight(l *trace.Log, size model.Size, rho trace.Q, height float64) trace.Q {
	if size.Shape == model.ShapeCircle {
		dq := l.Add(trace.Input("td/D", "Column diameter (circular column)", "input", "D", "mm", size.B))
		hgt := l.Add(trace.Input("td/H", "Storey height", "input", "H", "mm", height))
		return l.Add(CircularColumnSelfWeight("td/G_col", rho, dq, hgt))
	}
	bq := l.Add(trace.Input("td/b", "Column width (along building y)", "input", "b", "mm", size.B))
	hq := l.Add(trace.Input("td/h", "Column depth (along building x)", "input", "h", "mm", size.H))
	hgt := l.Add(trace.Input("td/H", "Storey height", "input", "H", "mm", height))
	return l.Add(ColumnSelfWeight("td/G_col", rho, bq, hq, hgt))
}

// Derive derives the design actions of every column and lift of the building form.
func Derive(in *model.Input, panel panelLoader) (*Derived, error) {
	b := in.Building
	g, err := NewGrid(b)
	if err == nil {
		err = checkLoads(b, g)
	}
	if le, ok := err.(lineError); ok {
		return nil, fmt.Errorf("%s:%d: building: %v", in.File, le.line, le)
	}
	if err != nil {
		return nil, fmt.Errorf("%s:%d: %v", in.File, b.Line, err)
	}
	if g.Partial() && (b.Analysis == model.AnalysisFrame || b.Analysis == model.AnalysisBoth) {
		return nil, fmt.Errorf("%s:%d: building: the frame analysis does not model columns absent at some levels yet: use analysis: subframe", in.File, b.Line)
	}
	levels := Levels(b, g, panel)
	d := &Derived{Grid: g, Levels: levels}
	var order [][2]int
	for i := 0; i < g.NX; i++ {
		for j := 0; j < g.NY; j++ {
			if g.Has[i][j] {
				order = append(order, [2]int{i, j})
			}
		}
	}
	lifts := takeDown(in, g, levels, order)
	fillTransfers(levels, order, lifts)
	if !g.Partial() {
		ends, err := columnEnds(in, g, levels, order, lifts)
		if err != nil {
			return nil, fmt.Errorf("%s:%d: building: %v", in.File, b.Line, err)
		}
		work.Each(len(order), func(k int) {
			assembleMoments(lifts[k], ends[k])
			if b.Options.L0FromFrame {
				effectiveLengths(in, levels, lifts[k])
			}
			fit(lifts[k])
		})
		for k := range order {
			d.Lifts = append(d.Lifts, lifts[k]...)
		}
		return d, nil
	}
	// Columns absent at some levels: each run of lifts that stand one on another is a column of
	// its own for the subframe, whose foot is the base or the beams it stands on.
	work.Each(len(order), func(k int) {
		for _, r := range runs(g, order[k][0], order[k][1], len(levels)) {
			ends := subframeEnds(in, levels[r[0]:r[1]], lifts[k][r[0]:r[1]])
			assembleMoments(lifts[k][r[0]:r[1]], ends)
			if b.Options.L0FromFrame {
				effectiveLengths(in, levels[r[0]:r[1]], lifts[k][r[0]:r[1]])
			}
		}
		fit(lifts[k])
	})
	for k, at := range order {
		for m := range lifts[k] {
			if g.Stands(at[0], at[1], m) {
				d.Lifts = append(d.Lifts, lifts[k][m])
			}
		}
	}
	return d, nil
}

// fit gives the steps of each of lifts, whole now, a slice of their own size: the lifts are held
// until their columns are designed, and a take-down reserves room for more steps than most use.
func fit(lifts []Lift) {
	for m := range lifts {
		if s := lifts[m].Steps; cap(s)-len(s) > len(s)/8 {
			lifts[m].Steps = slices.Clone(s)
		}
	}
}

// runs returns the runs [lo, hi) of the lifts of the column at (i, j) that stand one on another,
// lowest first.
func runs(g *Grid, i, j, n int) [][2]int {
	var out [][2]int
	for m := 0; m < n; m++ {
		if !g.Stands(i, j, m) {
			continue
		}
		if len(out) > 0 && out[len(out)-1][1] == m {
			out[len(out)-1][1] = m + 1
		} else {
			out = append(out, [2]int{m, m + 1})
		}
	}
	return out
}

// runIndex returns the index of lift m of the column at (i, j) within its run of lifts that
// stand one on another, counted from the run's lowest lift.
func runIndex(g *Grid, i, j, m int) int {
	lo := m
	for lo > 0 && g.Stands(i, j, lo-1) {
		lo--
	}
	return m - lo
}

// columnState is the take-down of one column between its lifts: the cumulative loads at the
// foot of the lift above, and what the moment arrangements leave off above.
type columnState struct {
	i, j  int
	id    string
	lifts []Lift // by level; Column empty where the column is absent
	above foot   // zero g.From where no lift stands above
	arr   [2][]arrAbove
}

// takeDown derives the take-down of the columns at the grid points of order, level by level from
// the top, so that a column that stops on the beams of a level hands its load to the columns
// that carry those beams before they are derived; the columns of one level are independent and
// each is derived on a worker. It returns the lifts of each column by level, with an empty
// Column where the column is absent.
func takeDown(in *model.Input, g *Grid, levels []Level, order [][2]int) [][]Lift {
	n := len(in.Building.Storeys)
	sets := loadSets(in)
	cols := make([]columnState, len(order))
	index := make(map[[2]int]int, len(order))
	for k, at := range order {
		cols[k] = columnState{i: at[0], j: at[1], id: ColumnID(at[0], at[1]), lifts: make([]Lift, n)}
		index[at] = k
	}
	// footAt gives the load at the foot of the lowest lift above of a column absent at the level
	// being derived: it stands on the level's beams.
	footAt := func(i, j int) foot {
		if k, ok := index[[2]int{i, j}]; ok {
			return cols[k].above
		}
		return foot{}
	}
	all := make([][]Lift, len(cols)) // the lifts as they are derived, for the transfers
	for k := range cols {
		all[k] = cols[k].lifts
	}
	for m := n - 1; m >= 0; m-- {
		// The loads of the columns that stop on this level's beams are known (their lifts above
		// are derived): on the beams before the arrangements of this level are chosen.
		fillLevel(&levels[m], m, index, all)
		work.Each(len(cols), func(k int) {
			if c := &cols[k]; g.Stands(c.i, c.j, m) {
				c.lift(in, g, levels, m, sets, footAt)
			}
		})
		for k := range cols {
			if c := &cols[k]; !g.Stands(c.i, c.j, m) {
				c.above, c.arr = foot{}, [2][]arrAbove{}
			}
		}
	}
	out := make([][]Lift, len(cols))
	for k := range cols {
		out[k] = cols[k].lifts
	}
	return out
}

// columnLifts derives the lifts of the column at (i, j) alone, from the top down: for a column
// on which no other column stops (takeDown derives them all together).
func columnLifts(in *model.Input, g *Grid, levels []Level, i, j int) []Lift {
	return takeDown(in, g, levels, [][2]int{{i, j}})[0]
}

// fillTransfers records on the beams that carry a column absent below their level the loads the
// column puts on them, from the cumulative loads at the foot of its lowest lift above, for the
// column-moment analysis (BeamLoad.Concentrated).
func fillTransfers(levels []Level, order [][2]int, lifts [][]Lift) {
	index := make(map[[2]int]int, len(order))
	for k, at := range order {
		index[at] = k
	}
	for m := range levels {
		fillLevel(&levels[m], m, index, lifts)
	}
}

// fillLevel is fillTransfers for the beams of level m, whose columns above are derived.
func fillLevel(lv *Level, m int, index map[[2]int]int, lifts [][]Lift) {
	for bk := range lv.Loads {
		ts := lv.Loads[bk].Transfers
		for x := range ts {
			k, ok := index[[2]int{ts[x].I, ts[x].J}]
			if !ok || m+1 >= len(lifts[k]) {
				continue
			}
			src := lifts[k][m+1]
			ts[x].G = ts[x].K * src.gCum.V
			ts[x].Q = map[string]float64{}
			for c, q := range src.qCum {
				ts[x].Q[c] = ts[x].K * q.V
			}
		}
	}
}

// lift derives lift k of the column: the reactions of the beams of its level, its self-weight
// and the cumulative loads of the lift above and of the columns standing on its beams, their
// combination and the axial forces of the moment arrangements.
func (c *columnState) lift(in *model.Input, g *Grid, levels []Level, k int, sets []loadSet, footAt func(i, j int) foot) {
	b := in.Building
	p := in.Code
	i, j, id := c.i, c.j, c.id
	st := b.Storeys[k]
	lv := &levels[k]
	size := columnSize(b, id, st.Name)
	l := &trace.Log{Group: "Load take-down at level " + st.Name, Steps: make([]trace.Step, 0, 192)}
	rho := l.Add(actions.ParamStep("td/rho", p, "density_rc", "N/mm3"))
	ll := levelTakeDown(l, b, lv, i, j, rho, footAt)
	qk, alphaA := ll.q, map[string]trace.Q{}
	if b.Options.Reduction == model.ReduceArea && len(qk) > 0 {
		alphaA = reduceForArea(l, st.Name, ll, qk)
	}
	sw := columnWeight(l, size, rho, st.Height)
	l.Group = "Cumulative characteristic loads at the bottom of lift " + st.Name
	parts := []trace.Q{ll.g, sw}
	if c.above.g.From != "" {
		parts = append(parts, c.above.g)
	}
	if ll.xferG.From != "" {
		parts = append(parts, ll.xferG)
	}
	gCum := l.Add(Sum("td/G_cum", "Permanent load at the bottom of the lift", "common practice", "G_k", "N", parts))
	qCum := map[string]trace.Q{}
	cats := map[string]bool{}
	for _, m := range []map[string]trace.Q{qk, c.above.q, ll.xferQ} {
		for c := range m {
			cats[c] = true
		}
	}
	for _, cat := range keys(cats) {
		var ps []trace.Q
		for _, m := range []map[string]trace.Q{qk, c.above.q, ll.xferQ} {
			if q, ok := m[cat]; ok {
				ps = append(ps, q)
			}
		}
		qCum[cat] = l.Add(Sum("td/Q_cum_"+cat, "Imposed load (category "+cat+") at the bottom of the lift", "common practice", "Q_k,"+cat, "N", ps))
	}
	storeys := c.storeys(k, lv, ll)
	lf := Lift{Column: id, I: i, J: j, Level: k, Name: st.Name, Size: size, Height: st.Height, Cantilever: ll.edge, gCum: gCum, qCum: qCum, run: runIndex(g, i, j, k)}
	lf.combine(in, l, storeys, qCum, gCum)
	for d := DirX; d <= DirY; d++ {
		c.arr[d] = lf.arrangementForce(in, l, lv, d, sets, ll.byBeam, alphaA, gCum, qCum, c.arr[d])
	}
	lf.Steps = l.Steps
	c.lifts[k] = lf
	// Cumulative values for the lift below, referred to across sheets.
	c.above.g = absolute(gCum, id, st.Name)
	c.above.g.Symbol = "G_k,above"
	next := map[string]trace.Q{}
	for cat, q := range qCum {
		a := absolute(q, id, st.Name)
		a.Symbol = "Q_k," + cat + ",above"
		next[cat] = a
	}
	c.above.q = next
	c.above.storeys = storeys
}

// reduceForArea records the reduction factor αA of each category of imposed load that the level
// delivers to the column (EN 1991-1-1:2002 6.3.1.2(10)), over the area of the floor that drains
// to the column, or of the category's zones where its zones are of a category other than the
// floor's, and none where the category comes by point loads alone; it reduces qk in place and
// returns the factors below 1 by category.
func reduceForArea(l *trace.Log, level string, ll levelLoads, qk map[string]trace.Q) map[string]trace.Q {
	alphaA := map[string]trace.Q{}
	pre := "td/" + level + "/"
	aq := l.Add(trace.Input(pre+"A", "Floor area at level "+level+" that drains to the column", "common practice", "A", "mm2", ll.area).
		Note("The slab areas of the beams' panels, shared between the beam ends as their loads are."))
	for _, c := range keys(qk) {
		if !ll.areal[c] {
			l.Add(trace.Input(pre+"alpha_A_"+c, "Reduction factor of the imposed load for the loaded area", en1991+"6.3.1.2(10)", "α_A", "", 1).
				Note("Category " + c + " reaches the column at this level by point loads only, which load no area: no reduction (conservative)."))
			continue
		}
		a := aq
		if za, ok := ll.zoneArea[c]; ok {
			a = l.Add(trace.Input(pre+"A_"+c, "Area of the zones of category "+c+" at level "+level+" that drains to the column", "common practice", "A_"+c, "mm2", za).
				Note("The zoned area loads of the category, shared between the beam ends as their loads are: the loaded area of the category."))
		}
		psi0 := l.Add(actions.PsiStep(pre+"psi0_"+c, 0, c))
		aa := l.Add(actions.AlphaA(pre+"alpha_A_"+c, c, psi0, a))
		if aa.V < 1 {
			qk[c] = l.Add(actions.Reduced(pre+"Q_red_"+c, aa, qk[c]))
			alphaA[c] = aa
		}
	}
	return alphaA
}

// storeys returns, by category, the storeys from level k up whose imposed loads the column
// carries at the foot of lift k, for αn: those of the lift above, level k where its floor is of
// the category or where zones or point loads of the category reach the column, and those of the
// columns standing on its beams.
func (c *columnState) storeys(k int, lv *Level, ll levelLoads) map[string]map[int]bool {
	out := map[string]map[int]bool{}
	add := func(cat string, m int) {
		if out[cat] == nil {
			out[cat] = map[int]bool{}
		}
		out[cat][m] = true
	}
	for _, from := range []map[string]map[int]bool{c.above.storeys, ll.storeys} {
		for cat, set := range from {
			for m := range set {
				add(cat, m)
			}
		}
	}
	if lv.Floor.Qk > 0 {
		add(lv.Floor.Category, k)
	}
	for cat := range ll.counted {
		add(cat, k)
	}
	return out
}

// absolute returns q with its producing step named from the building's root, so that a step of
// another lift's sheet can refer to it.
func absolute(q trace.Q, column, lift string) trace.Q {
	q.From = "/" + column + "/" + lift + "/" + q.From
	return q
}

// combine records the design axial force of the lift from its cumulative characteristic
// loads, EN 1990:2002 6.4.3.2, with the imposed-load reduction by the number of storeys
// where the input asks for it.
func (lf *Lift) combine(in *model.Input, l *trace.Log, storeys map[string]map[int]bool, q map[string]trace.Q, g trace.Q) {
	b := in.Building
	l.Group = "Design axial force at the bottom of lift " + lf.Name
	var vs []actions.Variable
	for _, c := range keys(q) {
		v := actions.Variable{Category: c, Q: q[c]}
		if b.Options.Reduction == model.ReduceStoreys {
			n := len(storeys[c])
			psi0 := l.Add(actions.PsiStep("td/psi0_"+c, 0, c))
			nq := l.Add(trace.Input("td/n_"+c, "Storeys of category "+c+" above the lift's bottom", "EN 1991-1-1:2002 6.3.1.2(11)", "n", "", float64(n)))
			an := l.Add(actions.AlphaN("td/alpha_n_"+c, c, psi0, nq))
			if an.V < 1 {
				if lf.alphaN == nil {
					lf.alphaN = map[string]trace.Q{}
				}
				lf.alphaN[c] = an
				un := q[c]
				v.Q = l.Add(actions.Reduced("td/Q_red_"+c, an, q[c]))
				v.Unreduced = &un
			}
		}
		vs = append(vs, v)
	}
	steps, nEd := actions.Combine("td/NEd", b.Options.Combination, in.Code, g, vs)
	for _, s := range steps {
		nEd = l.Add(s)
	}
	if last := l.Last(); last != nil {
		last.Symbol = "N_Ed"
	}
	nEd.Symbol = "N_Ed"
	lf.NEd = nEd.V
	lf.Src.NEd = nEd
	if b.Options.Creep != nil {
		lf.quasiPermanent(l, q, g)
	}
}

// arrAbove is the cumulative load that a moment arrangement leaves off at the levels above a
// lift: permanent (zero From when none) and imposed by category, referred to across sheets.
type arrAbove struct {
	g trace.Q
	q map[string]trace.Q
}

// arrangementForce records, for each load set, the design axial force that accompanies the
// moment arrangements in the frames of direction d (EN 1992-1-1:2004 5.1.3): the combination of
// the set's expression (EN 1990:2002 6.4.3.2(3)) over the cumulative loads less what the
// arrangement leaves off at this level and every level above, the imposed load of the lightly
// loaded beam (reduced as the floor's load is) and, where γG,light < γG, the part
// (1 − γG,light/γG)·R_G of its permanent load. It returns the cumulative loads left off, by
// set, for the lift below.
func (lf *Lift) arrangementForce(in *model.Input, l *trace.Log, lv *Level, d Dir, sets []loadSet, byBeam map[int]reactions,
	alphaA map[string]trace.Q, g trace.Q, q map[string]trace.Q, above []arrAbove) []arrAbove {
	p := in.Code
	b := in.Building
	axis := d.Axis()
	out := make([]arrAbove, len(sets))
	lf.narr[d] = make([]trace.Q, len(sets))
	for si, s := range sets {
		pre := "arr/" + d.String() + "/" + strings.ReplaceAll(s.expr, ".", "") + "/"
		l.Group = "Design axial force with the moment arrangement about " + axis + ", " + s.label
		k := lightBeam(lv, d, lf.I, lf.J, lf.run, s)
		var ab arrAbove
		if si < len(above) {
			ab = above[si]
		}
		cum := arrAbove{q: map[string]trace.Q{}}
		var re reactions
		if k >= 0 {
			re = byBeam[k]
		}
		// Imposed loads left off, by category.
		cats := map[string]bool{}
		for c := range re.qs {
			cats[c] = true
		}
		for c := range ab.q {
			cats[c] = true
		}
		for _, c := range keys(cats) {
			var parts []trace.Q
			if r, ok := re.qs[c]; ok {
				if a, ok := alphaA[c]; ok {
					r = l.Add(actions.Reduced(pre+"R_Q_red_"+c, a, r))
				}
				parts = append(parts, r)
			}
			if r, ok := ab.q[c]; ok {
				parts = append(parts, r)
			}
			title := "Imposed load (category " + c + ") the arrangement leaves off, this level and above"
			if k >= 0 {
				title += " (beam " + lv.Beams[k].Name() + " lightly loaded at " + lv.Name + ")"
			}
			cum.q[c] = l.Add(Sum(pre+"dQ_"+c, title, "EN 1992-1-1:2004 5.1.3(1)P", "ΔQ_k,"+c, "N", parts))
		}
		// Permanent load left off where the light spans carry less than γG·Gk.
		var gParts []trace.Q
		if k >= 0 && s.fG != s.fL {
			gq := l.Add(actions.ParamStep(pre+"gamma_G", p, "gamma_G", ""))
			gl := l.Add(actions.ParamStep(pre+"gamma_G_light", p, "gamma_G_light", ""))
			gParts = append(gParts, l.Add(trace.Formula(pre+"dG_level", "Permanent load the arrangement leaves off at level "+lv.Name, "EN 1992-1-1:2004 5.1.3(1)P", "ΔG_"+lv.Name, "N",
				(1-gl.V/gq.V)*re.g.V, "(1 - gamma_G_light / gamma_G) * R_G", trace.A("gamma_G_light", gl), trace.A("gamma_G", gq), trace.A("R_G", re.g))))
		}
		if ab.g.From != "" {
			gParts = append(gParts, ab.g)
		}
		gArr := g
		if len(gParts) > 0 {
			cum.g = l.Add(Sum(pre+"dG", "Permanent load the arrangement leaves off, this level and above", "EN 1992-1-1:2004 5.1.3(1)P", "ΔG_k", "N", gParts))
			gArr = l.Add(trace.Formula(pre+"G", "Permanent load with the arrangement", "EN 1992-1-1:2004 5.1.3(1)P", "G_k,arr", "N",
				g.V-cum.g.V, "G_k - dG", trace.A("G_k", g), trace.A("dG", cum.g)))
		}
		var vs []actions.Variable
		for _, c := range keys(q) {
			qa := q[c]
			if dq, ok := cum.q[c]; ok {
				qa = l.Add(trace.Formula(pre+"Q_"+c, "Imposed load (category "+c+") with the arrangement", "EN 1992-1-1:2004 5.1.3(1)P", "Q_k,"+c+",arr", "N",
					q[c].V-dq.V, "Q_k - dQ", trace.A("Q_k", q[c]), trace.A("dQ", dq)))
			}
			v := actions.Variable{Category: c, Q: qa}
			if an, ok := lf.alphaN[c]; ok && b.Options.Reduction == model.ReduceStoreys {
				un := qa
				v.Q = l.Add(actions.Reduced(pre+"Q_red_"+c, an, qa))
				v.Unreduced = &un
			}
			vs = append(vs, v)
		}
		steps, n := actions.CombineExpr(pre+"NEd", b.Options.Combination, s.expr, p, gArr, vs)
		for _, st := range steps {
			n = l.Add(st)
		}
		if last := l.Last(); last != nil {
			last.Symbol = "N_Ed,arr," + axis
			if s.expr == actions.ExprInf {
				last.Symbol = "N_Ed,inf," + axis
			}
			n.Symbol = last.Symbol
		}
		lf.narr[d][si] = n
		// Cumulative values for the lift below, referred to across sheets.
		if cum.g.From != "" {
			cum.g = absolute(cum.g, lf.Column, lf.Name)
			cum.g.Symbol = "ΔG_k,above"
		}
		for c, v := range cum.q {
			a := absolute(v, lf.Column, lf.Name)
			a.Symbol = "ΔQ_k," + c + ",above"
			cum.q[c] = a
		}
		out[si] = cum
	}
	return out
}

// quasiPermanent records the quasi-permanent axial force Gk + Σψ2·Qk (EN 1990:2002 6.5.3,
// Eq. (6.16)) and its ratio to NEd, which stands for M0Eqp/M0Ed in EN 1992-1-1 Eq. (5.19): the
// moments of a braced column follow the same loads (common practice).
func (lf *Lift) quasiPermanent(l *trace.Log, q map[string]trace.Q, g trace.Q) {
	l.Group = "Quasi-permanent axial force at the bottom of lift " + lf.Name
	expr := "G_k"
	args := []trace.Arg{trace.A("G_k", g)}
	v := g.V
	for k, c := range keys(q) {
		psi := l.Add(actions.PsiStep("qp/psi2_"+c, 2, c))
		n := itoa(k + 1)
		expr += " + psi_" + n + " * Q_" + n
		args = append(args, trace.A("psi_"+n, psi), trace.A("Q_"+n, q[c]))
		v += psi.V * q[c].V
	}
	nqp := l.Add(trace.Formula("qp/N", "Quasi-permanent axial force", "EN 1990:2002 6.5.3, Eq. (6.16)", "N_Ed,qp", "N", v, expr, args...))
	lf.Src.RatioQP = l.Add(trace.Formula("qp/ratio", "Ratio of the quasi-permanent to the design load, for M0Eqp/M0Ed", "EN 1992-1-1:2004 5.8.4(2); common practice", "r_qp", "",
		nqp.V/lf.Src.NEd.V, "N_qp / N_Ed", trace.A("N_qp", nqp), trace.A("N_Ed", lf.Src.NEd)))
}
