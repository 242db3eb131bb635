package design

import (
	"math"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/shear"
	"colsheet/calc/trace"
)

// shearCap is the link spacing that the shear of another load case of the lift allows, below
// this case's own: the lift's links serve every case.
type shearCap struct {
	s    float64 // mm
	name string  // the case that sets it
}

// shearPlan is the shear design of a lift about both axes for one bar pattern.
type shearPlan struct {
	in    [2]shear.Input
	res   [2]shear.Result
	sReq  trace.Q // the largest spacing the shear allows, the least of the axes (and cases); zero From: none
	limit bool    // sReq holds
}

// shearSteps records the shear design of the lift about y and z (EN 1992-1-1:2004 6.2) for the
// bars of diameter phi with links phiT at the nominal cover cnom, the bars in the tension half
// of the section per axis given by tension: VEd from the case or from the end moments over the
// length, VRd,c and, where VEd exceeds it, the links that 6.2.3 needs. It returns the plan, whose
// checks with the links provided are made by shearChecks.
func (c *common) shearSteps(l *trace.Log, tension [2]int, phi, phiT, cnom trace.Q) shearPlan {
	var plan shearPlan
	st := c.st
	cs := model.Case{}
	if len(st.Cases) == 1 {
		cs = st.Cases[0]
	}
	// The length over which the end moments change: the clear height, or the member length, or
	// (not given) the effective length, which is not longer for a braced member.
	var length trace.Q
	switch {
	case st.Clear > 0:
		length = l.Add(trace.Formula("shear/l", "Clear height below the beams at the top of the lift (the deeper of the two directions), over which the end moments change", "common practice", "l_v", "mm",
			st.Clear, "l_clear", trace.A("l_clear", trace.Const(st.Clear, "l_clear", "mm"))))
	case st.Length > 0:
		length = l.Add(trace.Formula("shear/l", "Member length, over which the end moments change", "common practice", "l_v", "mm",
			st.Length, "l", trace.A("l", trace.Const(st.Length, "l", "mm"))))
	default:
		lv := math.Min(st.L0Y, st.L0Z)
		length = l.Add(trace.Formula("shear/l", "Length over which the end moments change (member length not given: the lesser effective length)", "common practice", "l_v", "mm",
			lv, "min(l_0y, l_0z)", trace.A("l_0y", c.ax[0].l0), trace.A("l_0z", c.ax[1].l0)).
			Note("Without the member length the lesser effective length is taken; for a braced column l0 ≤ l, so VEd is not underestimated."))
	}
	asw := l.Add(trace.Formula("shear/A_sw", "Area of the link legs across the shear, the two legs of the perimeter link", "common practice", "A_sw", "mm2",
		2*math.Pi*phiT.V*phiT.V/4, "2 * 3.141592653589793 * phi_t ** 2 / 4", trace.A("phi_t", phiT)).Shown("2 * pi * phi_t ** 2 / 4"))
	widths := [2]trace.Q{c.b, c.h}
	for k := 0; k < 2; k++ {
		a := &c.ax[k]
		n := a.name
		l.Group = "Shear along the lever arm of bending about " + n + " (EN 1992-1-1 6.2)"
		var vEd trace.Q
		if cs.HasV[k] {
			vEd = l.Add(trace.Input(n+"/shear/V_Ed_given", "Design shear force accompanying bending about "+n+" (as given)", "input", "V_Ed,"+n, "N", cs.V[k]))
			vEd = l.Add(trace.Formula(n+"/shear/V_Ed", "Design shear force accompanying bending about "+n+" (its magnitude)", "common practice", "V_Ed,"+n, "N",
				math.Abs(vEd.V), "abs(V)", trace.A("V", vEd)))
		} else {
			vEd = l.Add(trace.Formula(n+"/shear/V_Ed", "Design shear force from the end moments about "+n, "common practice", "V_Ed,"+n, "N",
				math.Abs(a.top.V-a.bot.V)/length.V, "abs(M_top - M_bot) / l_v", trace.A("M_top", a.top), trace.A("M_bot", a.bot), trace.A("l_v", length)).
				Note("The end moments in the face convention: opposite signs (double curvature) add."))
		}
		var d trace.Q
		if c.circle {
			rs := a.depth.V/2 - cnom.V - phiT.V - phi.V/2 // in the order of the step's expression
			d = l.Add(trace.Formula(n+"/shear/d", "Effective depth for the shear about "+n+" of the circle: to the centroid of the bars of the tension half", "common practice", "d", "mm",
				a.depth.V/2+2*rs/math.Pi, "D / 2 + 2 * (D / 2 - c_nom - phi_t - phi / 2) / 3.141592653589793",
				trace.A("D", a.depth), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi)).
				Shown("D / 2 + 2 * (D / 2 - c_nom - phi_t - phi / 2) / pi").
				Note("A circular section is taken for the shear as a rectangle of width bw = D and effective depth d = D/2 + 2·rs/π, the centroid of the bars of the tension half on their circle of radius rs (common practice, from memory); the two legs of a circular link or helix crossing the section count at their full area."))
		} else {
			d = l.Add(trace.Formula(n+"/shear/d", "Effective depth of the outer bars for the shear about "+n, "common practice", "d", "mm",
				a.depth.V-cnom.V-phiT.V-phi.V/2, "h - c_nom - phi_t - phi / 2", trace.A("h", a.depth), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi)))
		}
		nt := trace.Const(float64(tension[k]), "n_t", "")
		asl := l.Add(trace.Formula(n+"/shear/A_sl", "Longitudinal bars in the tension half of the section", "common practice", "A_sl", "mm2",
			float64(tension[k])*math.Pi*phi.V*phi.V/4, "n_t * 3.141592653589793 * phi ** 2 / 4", trace.A("n_t", nt), trace.A("phi", phi)).Shown("n_t * pi * phi ** 2 / 4"))
		in := shear.Input{BW: widths[k], D: d, Asl: asl, NEd: c.nEd, Ac: c.ac, Fck: c.fck, Fcd: c.fcd, Fywd: c.fyd, Asw: asw, VEd: vEd}
		plan.in[k] = in
		plan.res[k] = shear.Axis(l, n+"/shear/", in, c.bs.shear)
	}
	// The spacing the shear allows: the least of the axes that need links, and of the other
	// load cases of the lift.
	var args []trace.Arg
	for k := 0; k < 2; k++ {
		if r := plan.res[k]; r.Needed {
			args = append(args, trace.A("s_"+c.ax[k].name, r.SReq))
		}
	}
	if cp := c.shearCap; cp != nil {
		q := l.Add(trace.Input("links/s_cases", "Largest link spacing for the shear of load case "+cp.name, trace.ClauseCases, "s_cases", "mm", cp.s))
		args = append(args, trace.A("s_cases", q))
	}
	if len(args) == 0 {
		return plan
	}
	l.Group = "Links"
	plan.sReq = l.Add(extremeStep("links/s_shear", "Largest link spacing for the shear", "EN 1992-1-1:2004 6.2.3(3), Eq. (6.8)", "s_V", "mm", false, args))
	plan.limit = true
	return plan
}

// shearChecks records, per axis where links are designed for the shear, VRd,s of the links at
// the spacing s provided and the check of VEd against it; it fills the design's shear results
// and returns the check steps that compare an action with a resistance.
func (c *common) shearChecks(l *trace.Log, plan shearPlan, s trace.Q, d *Design) []checked {
	var out []checked
	axes := [2]*Axis{&d.Y, &d.Z}
	for k := 0; k < 2; k++ {
		r := plan.res[k]
		a := axes[k]
		a.Shear, a.VEd, a.VRdc = true, plan.in[k].VEd.V, r.VRdc.V
		if !r.Needed {
			out = append(out, checked{r.Check.From, true})
			continue
		}
		a.LinksShear, a.VRdMax = true, r.VRdMax.V
		l.Group = "Shear along the lever arm of bending about " + c.ax[k].name + " (EN 1992-1-1 6.2)"
		_, check := shear.WithLinks(l, c.ax[k].name+"/shear/", plan.in[k], r, s)
		out = append(out, checked{r.MaxCheck.From, true}, checked{check.From, true})
	}
	return out
}

// tensionBars returns the number of bars of pattern p in the tension half of the section for
// bending about y (the bars below the centre along z) and about z (along y): a face's bars and
// the intermediate bars of the other faces on that side, those on the centre line left out.
func tensionBars(pos [][2]float64) [2]int {
	var n [2]int
	for _, q := range pos {
		if q[1] < -1e-9 {
			n[0]++
		}
		if q[0] < -1e-9 {
			n[1]++
		}
	}
	return n
}

// shearDemand returns the largest link spacing that the shear of the lift allows with pattern
// p, from the same steps as the design's (in a log that is dropped); +Inf where no links are
// needed for the shear.
func (c *common) shearDemand(p detail.Pattern) float64 {
	link := c.linkFor(p.Dia)
	g := c.geometryWith(link)
	saved := c.shearCap
	c.shearCap = nil
	plan := c.shearSteps(&trace.Log{}, tensionBars(g.Positions(p)), trace.Const(p.Dia, "φ", "mm"), trace.Const(link, "φ_t", "mm"), trace.Const(c.col.Cover, "c_nom", "mm"))
	c.shearCap = saved
	if !plan.limit {
		return math.Inf(1)
	}
	return plan.sReq.V
}
