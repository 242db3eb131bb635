package design

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// This file chooses the bars of a designed lift: among the symmetric patterns that pass every
// check, the cheapest by detail.PatternCost that keeps the rules of practice (the least main bar,
// the gap for a poker vibrator where a pattern that keeps it passes, the bars of the lift above
// continued), and, in the typical-pattern pass, a pattern shared with other lifts of the section.

// neighbour is the bar pattern of another lift of the column with the geometry it sits in.
type neighbour struct {
	p   detail.Pattern
	g   detail.Geometry
	pos [][2]float64 // g.Positions(p), for the many comparisons with it
}

// neighbourOf returns the pattern of a design with its geometry.
func neighbourOf(d *Design) *neighbour {
	n := &neighbour{p: d.pattern, g: detail.Geometry{B: d.B, H: d.H, Cover: d.Cover, Link: d.Links.Dia, Circle: d.Shape == model.ShapeCircle}}
	if n.p.Count() > 0 {
		n.pos = n.g.Positions(n.p)
	}
	return n
}

// option is a candidate pattern with its cost and whether it keeps the vibrator gap.
type option struct {
	p     detail.Pattern
	roomy bool
	cost  detail.Cost
}

// rules are the rules of practice in force for one lift.
type rules struct {
	sel   model.Selection
	least float64   // least main bar of the section, mm
	dias  []float64 // the listed diameters not below least (all of them when none reaches it)
	lift  float64   // length of the lift for the cost, mm
	above *neighbour
	below *neighbour // the typical pass: the lift below keeps its bars, so this lift stays within them
}

// leastBar returns the least main bar of practice for the column's section.
func leastBar(sel model.Selection, col *model.Column) float64 {
	if math.Min(col.B, col.H) >= sel.WideFrom {
		return sel.LeastBarWide
	}
	return sel.LeastBar
}

// rulesFor returns the rules of practice for the lift of c.
func (c *common) rulesFor(dv *Derivation) rules {
	r := rules{sel: c.in.Options.Selection, lift: liftLength(c.st)}
	r.least = leastBar(r.sel, c.col)
	for _, d := range c.in.Options.BarDiameters {
		if d >= r.least-1e-9 {
			r.dias = append(r.dias, d)
		}
	}
	if len(r.dias) == 0 {
		r.dias = c.in.Options.BarDiameters // the check of the least bar fails, loudly
	}
	if dv != nil {
		r.above, r.below = dv.above, dv.below
	}
	return r
}

// liftLength returns the length of the lift for the cost: the member length, or the larger
// effective length where none is given.
func liftLength(st *model.Storey) float64 {
	if st.Length > 0 {
		return st.Length
	}
	return math.Max(st.L0Y, st.L0Z)
}

// geometry returns the room the section of c gives bars of pattern p.
func (c *common) geometry(p detail.Pattern) detail.Geometry {
	return c.geometryWith(c.linkFor(p.Dia))
}

// geometryWith returns the room the section of c gives its bars inside links of diameter link.
func (c *common) geometryWith(link float64) detail.Geometry {
	return detail.Geometry{B: c.col.B, H: c.col.H, Cover: c.col.Cover, Link: link, Circle: c.circle}
}

// costBasis returns what the cost of pattern p over the lift depends on besides the pattern:
// the lift, the lap of the project basis for the diameter and the general link spacing
// (EN 1992-1-1:2004 9.5.3(3), rounded down to the step of the input).
func (c *common) costBasis(p detail.Pattern, lift float64) detail.CostBasis {
	lap := 0.0
	if q, ok := c.bs.laps[p.Dia]; ok {
		lap = q.V
	} else {
		lap = detail.LapValue(p.Dia, c.bs.fctm.V, c.p.Get("gamma_c"), c.fyd.V, true, 100)
	}
	s := math.Min(math.Min(c.p.Get("link_spacing_bars")*p.Dia, math.Min(c.col.B, c.col.H)), c.p.Get("link_spacing_max"))
	if step := c.in.Options.LinkStep; step > 0 {
		s = math.Floor(s/step+1e-9) * step
	}
	return detail.CostBasis{Lift: lift, Lap: lap, Spacing: s}
}

// weights returns the labour terms of the cost.
func weights(sel model.Selection) detail.CostWeights {
	return detail.CostWeights{PerBar: sel.LabourBar, PerTie: sel.LabourTie}
}

// options returns the patterns that fit with the clear distances of 8.2(2) and 8.7.2(3), keep the
// rules of practice and lie within the steel limits, split into those that keep the vibrator gap
// and those that do not, each in order of cost, then of area and of bar count.
func (c *common) options(r rules) (roomy, tight []option) {
	asLo := c.asMin.V
	if c.dv != nil && c.dv.AsAbove > asLo {
		asLo = c.dv.AsAbove
	}
	it := detail.NewIterIn(c.geometryWith(0), r.dias, c.linkFor, c.lappedFit, asLo, c.asMax.V)
	w := weights(r.sel)
	for p, ok := it.Next(); ok; p, ok = it.Next() {
		g := c.geometry(p)
		if r.above != nil && !detail.ContinuesOK(r.above.g, r.above.p, r.above.pos, g, p, nil) {
			continue
		}
		if r.below != nil && !detail.ContinuesOK(g, p, nil, r.below.g, r.below.p, r.below.pos) {
			continue
		}
		o := option{p: p, roomy: r.sel.VibratorGap <= 0 || g.Roomy(p, r.sel.VibratorGap),
			cost: detail.PatternCost(g, p, c.costBasis(p, r.lift), w)}
		if o.roomy {
			roomy = append(roomy, o)
		} else {
			tight = append(tight, o)
		}
	}
	order := func(x, y option) int {
		if d := x.cost.Total - y.cost.Total; math.Abs(d) > 1e-9 {
			return cmp.Compare(x.cost.Total, y.cost.Total)
		}
		if d := x.p.Area() - y.p.Area(); math.Abs(d) > 1e-6 {
			return cmp.Compare(x.p.Area(), y.p.Area())
		}
		if x.p.Count() != y.p.Count() {
			return cmp.Compare(x.p.Count(), y.p.Count())
		}
		return cmp.Compare(x.p.NB, y.p.NB)
	}
	slices.SortStableFunc(roomy, order)
	slices.SortStableFunc(tight, order)
	return roomy, tight
}

// trial is the outcome of trying one pattern: the design it gives without its trace and whether
// it is a design to keep (it passes, or fails only where no bar pattern helps).
type trial struct {
	d    Design
	keep bool
	ran  bool // evaluated (not skipped by the quick bounds)
}

// try evaluates pattern p as a trial, after the quick bounds that reject it for certain.
func (c *common) try(p detail.Pattern, floor float64, dv *Derivation) trial {
	if p.Area() < floor*(1-1e-6) {
		return trial{}
	}
	if c.nEd.V > c.section([][2]float64{{0, 0}}, p.Area()).nRdMax() {
		return trial{}
	}
	no, q := c.cannotPass(p)
	if no {
		return trial{}
	}
	d := c.trial(p, q)
	t := trial{d: d, ran: true}
	if c.cases != nil {
		t.keep = c.cases.trial(&t.d, p)
		return t
	}
	if d.Status == StatusPass || d.failsOnlyOnFixed() {
		c.withArrangements(&t.d, dv)
		t.keep = t.d.Status == StatusPass || t.d.failsOnlyOnFixed()
	}
	return t
}

// choice is the pattern chosen for a lift with what the sheet says of the choice.
type choice struct {
	o       option
	roomy   bool     // a pattern that keeps the vibrator gap passes
	alts    []option // the next passing patterns by cost, at most two
	costed  int      // patterns tried beyond the chosen one for alts
	typical *option  // the cheapest pattern, where a typical pattern was chosen instead
	tol     float64
}

// search designs the bars of the lift of c: the cheapest passing pattern within the rules, or
// a failed design that says why.
func (c *common) search(dv *Derivation) Design {
	r := c.rulesFor(dv)
	roomy, tight := c.options(r)
	if len(roomy)+len(tight) == 0 {
		d := c.noArrangement()
		if r.above != nil {
			d.Reasons = append([]string{"No pattern of the listed diameters continues the bars of the lift above (the same or more bars on each face, the same or a larger diameter, each bar above beside a bar below) within the steel limits."}, d.Reasons...)
		}
		return d
	}
	floor := c.areaFloor(r.dias[0])
	var best Design
	found := false
	most := roomy
	if len(tight) > 0 {
		most = tight // the tight patterns include the most bars
	}
	for tier, list := range [][]option{roomy, tight} {
		for i, o := range list {
			t := c.try(o.p, floor, dv)
			if t.keep {
				ch := choice{o: o, roomy: tier == 0}
				ch.alts, ch.costed = c.runnersUp(list[i+1:], floor, dv, r.sel.Costed)
				if dv != nil && len(dv.prefer) > 0 {
					c.preferTypical(&ch, list, floor, dv)
				}
				return c.chosen(ch, r, dv)
			}
			if t.ran && (!found || t.d.Utilization < best.Utilization) {
				best, found = t.d, true
			}
		}
	}
	if !found {
		// Every pattern fails for certain: show the one with the most steel, which fails loudly.
		last := slices.MaxFunc(most, func(x, y option) int { return cmp.Compare(x.p.Area(), y.p.Area()) })
		d := c.evaluate(last.p, false, true)
		if c.cases != nil {
			d = c.settleCases(d, last.p, false, nil)
		}
		if c.nEd.V > d.NRdMax {
			d.Reasons = append([]string{"NEd exceeds the resistance to pure compression even with the most steel that fits: enlarge the section or raise the concrete class."}, d.Reasons...)
		} else {
			d.Reasons = append([]string{"No bar arrangement from the listed diameters passes every check; the arrangement with the most steel is shown."}, d.Reasons...)
		}
		if r.above != nil {
			d.Reasons = append(d.Reasons, "The patterns tried continue the bars of the lift above.")
		}
		if c.cases != nil {
			return d
		}
		return c.finish(d)
	}
	d := c.evaluate(best.pattern, false, true)
	if c.cases != nil {
		d = c.settleCases(d, best.pattern, false, nil)
		d.Reasons = append([]string{"No bar arrangement from the listed diameters passes every check of every load case; the arrangement with the lowest utilisation is shown."}, d.Reasons...)
		return d
	}
	c.withArrangements(&d, dv)
	d.Reasons = append([]string{"No bar arrangement from the listed diameters passes every check; the arrangement with the lowest utilisation is shown."}, d.Reasons...)
	if r.above != nil {
		d.Reasons = append(d.Reasons, "The patterns tried continue the bars of the lift above.")
	}
	return c.finish(d)
}

// defaultCosted is the cap on the patterns tried for the comparison when the options give none.
const defaultCosted = 12

// runnersUp returns the first two patterns of list, in order of cost, that pass, trying at most
// costed of them past the quick bounds, and how many it tried.
func (c *common) runnersUp(list []option, floor float64, dv *Derivation, costed int) ([]option, int) {
	if costed <= 0 {
		costed = defaultCosted
	}
	var out []option
	tried := 0
	for _, o := range list {
		if len(out) == 2 || tried >= costed {
			break
		}
		t := c.try(o.p, floor, dv)
		if !t.ran {
			continue
		}
		tried++
		if t.keep && t.d.Status == StatusPass {
			out = append(out, o)
		}
	}
	return out, tried
}

// preferTypical replaces the chosen pattern by the first typical pattern of dv.prefer that is
// among the options of the same tier, costs at most the tolerance more steel and passes.
func (c *common) preferTypical(ch *choice, list []option, floor float64, dv *Derivation) {
	limit := ch.o.cost.Mass() * (1 + dv.tolerance)
	for _, p := range dv.prefer {
		if p == ch.o.p {
			return // the chosen pattern is the most used one that fits
		}
		k := slices.IndexFunc(list, func(o option) bool { return o.p == p })
		if k < 0 || list[k].cost.Mass() > limit*(1+1e-12) {
			continue
		}
		if t := c.try(p, floor, dv); t.keep && t.d.Status == StatusPass {
			own := ch.o
			ch.o, ch.typical, ch.tol = list[k], &own, dv.tolerance
			return
		}
	}
}

// chosen evaluates the chosen pattern with its full trace, records the rules of practice, the
// continuity of the bars and the costs behind the choice, and settles the design.
func (c *common) chosen(ch choice, r rules, dv *Derivation) Design {
	d := c.evaluate(ch.o.p, false, true)
	if c.cases != nil {
		return c.settleCases(d, ch.o.p, false, func(g *common, d *Design) { g.practice(d, ch, r) })
	}
	c.withArrangements(&d, dv)
	c.practice(&d, ch, r)
	return c.finish(d)
}

// stepQ returns the result of the design's step id, or the constant v where the trace has no such step.
func stepQ(d *Design, id string, v float64, symbol, unit string) trace.Q {
	for i := len(d.Steps) - 1; i >= 0; i-- {
		if d.Steps[i].ID == id {
			return d.Steps[i].Q()
		}
	}
	return trace.Const(v, symbol, unit)
}

// practice records the rules of practice of the chosen pattern, the continuity of its bars with
// the lift above and the costs that made it win, adds its checks and settles the design again.
func (c *common) practice(d *Design, ch choice, r rules) {
	l := c.log(d.Steps, "Choice of the bars (common practice)")
	p, g := ch.o.p, c.geometry(ch.o.p)
	phi := stepQ(d, "bars/phi", p.Dia, "φ", "mm")
	phiT := stepQ(d, "links/phi_t", g.Link, "φ_t", "mm")
	nb := stepQ(d, "bars/nb", float64(p.NB), "n_b", "")
	nh := stepQ(d, "bars/nh", float64(p.NH), "n_h", "")
	cnom := stepQ(d, "space/c_nom", c.col.Cover, "c_nom", "mm")
	k := func(v float64, s, u string) trace.Q { return trace.Const(v, s, u) }

	least := l.Add(detail.LeastBar("sel/phi_least", c.b, c.h, k(r.sel.WideFrom, "w_0", "mm"), k(r.sel.LeastBar, "φ_narrow", "mm"), k(r.sel.LeastBarWide, "φ_wide", "mm")).
		Note("The parameters are design.selection.least_bar, least_bar_wide and wide_from."))
	d.checks = append(d.checks, checked{l.Add(trace.Check("sel/check_phi_least", "Main bars not below the least bar of practice", "common practice",
		"φ_least ≤ φ", least.V/p.Dia, "phi_least / phi", trace.A("phi_least", least), trace.A("phi", phi))).From, false})

	if gap := r.sel.VibratorGap; gap > 0 {
		sv := l.Add(trace.Input("sel/s_vib", "Clear gap between bars for a poker vibrator", "common practice", "s_vib", "mm", gap).
			Note("design.selection.vibrator_gap; a pattern that keeps it on every face is chosen where one passes."))
		gb, gh := g.ClearGaps(p)
		kept := 0.0
		if ch.o.roomy {
			kept = 1
		}
		var s trace.Step
		if c.circle {
			rs := stepQ(d, "bars/r_s", g.RingRadius(p.Dia), "r_s", "mm")
			l.Add(detail.RingMaxBars("sel/n_max", rs, phi, sv))
			sc := stepQ(d, "space/gap_c", gb, "s_c", "mm")
			s = trace.Formula("sel/roomy", "Vibrator gap kept between the bars", "common practice", "kept", "", kept,
				"s_c >= s_vib - 0.000000001 ? 1 : 0", trace.A("s_c", sc), trace.A("s_vib", sv)).
				Condition("s_c >= s_vib")
		} else {
			l.Add(detail.MaxBarsPerFace("sel/n_b_max", "Most bars along a b-face that keep the vibrator gap", "n_b,max", c.b, cnom, phiT, phi, sv))
			l.Add(detail.MaxBarsPerFace("sel/n_h_max", "Most bars along an h-face that keep the vibrator gap", "n_h,max", c.h, cnom, phiT, phi, sv))
			sb := stepQ(d, "space/gap_b", gb, "s_b", "mm")
			sh := stepQ(d, "space/gap_h", gh, "s_h", "mm")
			s = trace.Formula("sel/roomy", "Vibrator gap kept on every face", "common practice", "kept", "", kept,
				"min(s_b, s_h) >= s_vib - 0.000000001 ? 1 : 0", trace.A("s_b", sb), trace.A("s_h", sh), trace.A("s_vib", sv)).
				Condition("min(s_b, s_h) >= s_vib")
		}
		if !ch.roomy {
			msg := "No pattern that keeps the vibrator gap on every face passes: the bars are spaced by the clear distances of EN 1992-1-1 8.2(2) and 8.7.2(3) only; leave a gap for the vibrator or enlarge the section."
			s = s.Caution(msg)
			d.Cautions = append(d.Cautions, msg)
		}
		l.Add(s)
	}

	if a := r.above; a != nil {
		l.Group = "Continuity of the bars with the lift above (common practice)"
		cont := detail.Continues(a.g, a.p, g, p)
		phiA := l.Add(trace.Input("cont/phi_above", "Bar diameter of the lift above", trace.ClauseAbove, "φ_above", "mm", a.p.Dia))
		if c.circle || a.p.Ring > 0 {
			nA := l.Add(trace.Input("cont/n_above", "Bars of the lift above", trace.ClauseAbove, "n_above", "", float64(a.p.Count())))
			n := stepQ(d, "bars/count", float64(p.Count()), "n_bars", "")
			d.checks = append(d.checks, checked{l.Add(detail.RingContinuityCheck("cont/check", cont, nA, phiA, n, phi)).From, false})
			if !cont.SameSection && cont.Offset > 1e-9 && a.p.Ring > 0 && p.Ring > 0 {
				ra := l.Add(trace.Input("cont/r_s_above", "Radius of the circle of the bars of the lift above", trace.ClauseAbove, "r_s,above", "mm", a.g.RingRadius(a.p.Dia)))
				rs := stepQ(d, "bars/r_s", g.RingRadius(p.Dia), "r_s", "mm")
				off := l.Add(trace.Formula("cont/e_crank", "Offset of the bars cranked at the top of this lift into the section above", "common practice", "e_crank", "mm",
					cont.Offset, "abs(r_s - r_a)", trace.A("r_s", rs), trace.A("r_a", ra)).
					Note("The section changes at the level above this lift: the bars of this lift are cranked into the section of the lift above and lapped there with its bars."))
				cr := l.Add(detail.CrankLength("cont/l_crank", off, k(12, "k", "")))
				d.Detailing.Crank, d.Detailing.CrankLength = off.V, cr.V
			}
		} else {
			nbA := l.Add(trace.Input("cont/nb_above", "Bars along each b-face of the lift above", trace.ClauseAbove, "n_b,above", "", float64(a.p.NB)))
			nhA := l.Add(trace.Input("cont/nh_above", "Bars along each h-face of the lift above", trace.ClauseAbove, "n_h,above", "", float64(a.p.NH)))
			d.checks = append(d.checks, checked{l.Add(detail.ContinuityCheck("cont/check", cont, nbA, nhA, phiA, nb, nh, phi)).From, false})
		}
		if !c.circle && a.p.Ring == 0 && !cont.SameSection && cont.Offset > 1e-9 {
			ea := a.g.Edge(a.p.Dia)
			ya := l.Add(trace.Input("cont/y_c_above", "Distance of the outer bars' centres from the centroid along y in the lift above", trace.ClauseAbove, "y_c,above", "mm", a.g.B/2-ea))
			za := l.Add(trace.Input("cont/z_c_above", "Distance of the outer bars' centres from the centroid along z in the lift above", trace.ClauseAbove, "z_c,above", "mm", a.g.H/2-ea))
			e := g.Edge(p.Dia)
			yc := stepQ(d, "bars/y_c", c.col.B/2-e, "y_c", "mm")
			zc := stepQ(d, "bars/z_c", c.col.H/2-e, "z_c", "mm")
			off := l.Add(trace.Formula("cont/e_crank", "Offset of the bars cranked at the top of this lift into the section above", "common practice", "e_crank", "mm",
				cont.Offset, "max(abs(y_c - y_a), abs(z_c - z_a))", trace.A("y_c", yc), trace.A("y_a", ya), trace.A("z_c", zc), trace.A("z_a", za)).
				Note("The section changes at the level above this lift: the bars of this lift are cranked into the section of the lift above and lapped there with its bars."))
			cr := l.Add(detail.CrankLength("cont/l_crank", off, k(12, "k", "")))
			d.Detailing.Crank, d.Detailing.CrankLength = off.V, cr.V
		}
	}

	l.Group = "Cost of the chosen bars beside the next candidates that pass (common practice)"
	w := weights(r.sel)
	cb := c.costBasis(p, r.lift)
	lift := l.Add(trace.Input("sel/L", "Length of the lift for the cost", lengthSource(c.st), "L", "mm", r.lift))
	args := detail.ArgsOf(g, p, cb, w, ch.o.cost)
	args.NB, args.NH, args.Dia, args.Link, args.Lift = nb, nh, phi, phiT, lift
	if c.circle {
		args.Ring = stepQ(d, "bars/count", float64(p.Count()), "n", "")
	}
	if q, ok := c.bs.laps[p.Dia]; ok {
		args.Lap = q
	}
	title := "Cost of the chosen bars over the lift"
	if ch.typical != nil {
		title = "Cost of the chosen bars over the lift: the typical pattern of the section"
	}
	l.Add(detail.CostStep("sel/cost", title, args))
	for i, o := range ch.alts {
		og := c.geometry(o.p)
		a := detail.ArgsOf(og, o.p, c.costBasis(o.p, r.lift), w, o.cost)
		a.Lift = lift
		l.Add(detail.CostStep(fmt.Sprintf("sel/cost_next%d", i+1), []string{"Cost of the next cheapest pattern that passes", "Cost of the second next cheapest pattern that passes"}[i], a))
	}
	l.Add(trace.Input("sel/costed", "Patterns tried after the chosen one, in order of cost, for the comparison", "common practice", "n_tried", "", float64(ch.costed)))
	if len(ch.alts) < 2 {
		l.NoteLast([]string{
			"None of them passes: the chosen pattern is the only one that passes among those tried.",
			"Only one of them passes.",
		}[len(ch.alts)])
	}
	if t := ch.typical; t != nil {
		l.Group = "Typical pattern of the section (common practice)"
		a := detail.ArgsOf(c.geometry(t.p), t.p, c.costBasis(t.p, r.lift), w, t.cost)
		a.Lift = lift
		l.Add(detail.CostStep("sel/cost_own", "Cost of the cheapest pattern of this lift alone", a))
		mOwn := l.Add(trace.Input("sel/m_own", "Steel of the cheapest pattern of this lift alone, bars, links and ties", "common practice", "m_own", "kg", t.cost.Mass()))
		mTyp := l.Add(trace.Input("sel/m_typ", "Steel of the typical pattern, bars, links and ties", "common practice", "m_typ", "kg", ch.o.cost.Mass()))
		l.Add(trace.Input("sel/tolerance", "Most extra steel accepted for a typical pattern", "common practice", "t_typ", "", ch.tol).
			Note("design.typical.tolerance"))
		l.Add(trace.Formula("sel/typical_ratio", "Steel of the typical pattern over that of the cheapest", "common practice", "m_typ/m_own", "",
			mTyp.V/mOwn.V, "m_typ / m_own", trace.A("m_typ", mTyp), trace.A("m_own", mOwn)).
			Note("Not above 1 + t_typ: the lifts of this section share the pattern used most in the building, so that it has few distinct cages."))
	}
	c.settle(d, l, d.checks)
}

// lengthSource returns the source of the lift's length: given, or the larger effective length.
func lengthSource(st *model.Storey) string {
	if st.Length > 0 {
		return "input"
	}
	return "common practice (the larger effective length, the member length not given)"
}

// bars returns the method by which the bars are chosen.
func bars(in *model.Input) Method {
	s := in.Options.Selection
	text := fmt.Sprintf("symmetric patterns with a bar in each corner and one diameter on every face; of those that pass every check, "+
		"the cheapest by steel over the lift with the lap, links and ties, and %g kg of steel per bar and %g per tie piece; "+
		"main bars not below %g mm (%g mm where the smaller dimension is %g mm or more)", s.LabourBar, s.LabourTie, s.LeastBar, s.LeastBarWide, s.WideFrom)
	if s.VibratorGap > 0 {
		text += fmt.Sprintf("; clear gaps of %g mm for a poker vibrator on every face where such a pattern passes, else those of 8.2(2) and 8.7.2(3), which the sheet says", s.VibratorGap)
	}
	if in.Building != nil {
		text += "; up each column the bars of a lift continue those of the lift above (the same or more bars on each face, the same or a larger diameter, each bar above beside a bar below; cranked where the section changes)"
		if in.Options.Typical.On && in.Building.Bars == nil {
			text += fmt.Sprintf("; lifts of one section take the pattern used most in the building where it costs at most %g %% more steel", 100*in.Options.Typical.Tolerance)
		}
	}
	return Method{"Bars", text, "EN 1992-1-1:2004 9.5.2, 8.2; common practice"}
}

// sectionKey names a section for the typical pass.
type sectionKey struct {
	b, h, cover float64
	shape       string
}

// typicalUses holds what the typical pass takes from the first pass over the whole building:
// how often each pattern is used per section, and each lift's design as first chosen.
type typicalUses struct {
	uses  map[sectionKey]map[detail.Pattern]int
	first []Design
}

// typicalUses counts the patterns of the designs per section, before the typical pass.
func (r *Result) typicalUses() *typicalUses {
	t := &typicalUses{uses: map[sectionKey]map[detail.Pattern]int{}, first: slices.Clone(r.Designs)}
	for k := range r.Designs {
		d := &r.Designs[k]
		if d.Bars.Given || d.Status != StatusPass || d.pattern.Count() == 0 {
			continue
		}
		key := sectionKey{d.B, d.H, d.Cover, d.Shape}
		if t.uses[key] == nil {
			t.uses[key] = map[detail.Pattern]int{}
		}
		t.uses[key][d.pattern]++
	}
	return t
}

// typicalColumn gives the lifts of one column (the lifts s) the pattern used most in the building
// for their section where it costs at most the tolerance more steel, keeping the bars of the column
// continuous: from its top lift down, a lift takes a pattern that continues the bars of the lift
// above (as finally chosen) and lies within those of the lift below (as first chosen), so that the
// lift below keeps a passing pattern. A lift whose lift above changed is designed again. The
// counts t are of the whole building; the columns are independent of each other.
func (r *Result) typicalColumn(in *model.Input, dvs []*Derivation, t *typicalUses, s span) {
	key := func(d *Design) sectionKey { return sectionKey{d.B, d.H, d.Cover, d.Shape} }
	first := t.first
	same := func(j int) bool { return j >= s.lo && j < s.hi }
	changed := make([]bool, s.hi-s.lo)
	tol := in.Options.Typical.Tolerance
	for k := s.hi - 1; k >= s.lo; k-- {
		d := &r.Designs[k]
		if d.Bars.Given || d.pattern.Count() == 0 {
			continue
		}
		aboveChanged := same(k+1) && changed[k+1-s.lo]
		var prefer []detail.Pattern
		if d.Status == StatusPass {
			m := t.uses[key(d)]
			for p, cnt := range m {
				if cnt > m[d.pattern] {
					prefer = append(prefer, p)
				}
			}
			slices.SortFunc(prefer, func(x, y detail.Pattern) int {
				if c := cmp.Compare(m[y], m[x]); c != 0 {
					return c
				}
				if c := cmp.Compare(x.Area(), y.Area()); c != 0 {
					return c
				}
				if c := cmp.Compare(x.Dia, y.Dia); c != 0 {
					return c
				}
				return cmp.Compare(x.NB, y.NB)
			})
		}
		dv, lc := dvs[k], r.cases[k]
		var above, below *neighbour
		if same(k + 1) {
			above = neighbourOf(&r.Designs[k+1])
		}
		if same(k-1) && first[k-1].pattern.Count() > 0 {
			below = neighbourOf(&first[k-1])
		}
		// Only the patterns that could replace this lift's: they continue the bars above, stay within
		// those below and cost little more steel; the costs and checks are the design's to find.
		prefer = slices.DeleteFunc(prefer, func(p detail.Pattern) bool {
			g := detail.Geometry{B: d.B, H: d.H, Cover: d.Cover, Link: linkDiaFor(in, lc.col, p.Dia), Circle: d.Shape == model.ShapeCircle}
			return (above != nil && !detail.Continues(above.g, above.p, g, p).OK()) ||
				(below != nil && !detail.Continues(g, p, below.g, below.p).OK()) ||
				p.Area() > (1+2*tol)*d.pattern.Area()
		})
		if len(prefer) == 0 && !aboveChanged {
			continue
		}
		dv.above, dv.below, dv.prefer, dv.tolerance = above, below, prefer, tol
		if above != nil {
			a := &r.Designs[k+1]
			dv.AsAbove, dv.AcAbove = a.AsProv, a.Ac()
		}
		nd := design(in, lc.col, lc.st, dv, r.bs)
		changed[k-s.lo] = nd.pattern != d.pattern
		r.Designs[k] = nd
	}
}
