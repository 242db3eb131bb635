package design

import (
	"fmt"
	"math"

	"colsheet/calc/section"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
	"colsheet/calc/work"
)

// areaBound is the largest steel area, as a fraction of Ac, searched for the required area.
const areaBound = 0.2

// finish adds the steel area that the chosen bar pattern needs to resist the design actions.
func (c *common) finish(d Design) Design {
	d.bs = c.bs
	if d.pattern.Count() == 0 {
		return d
	}
	r := c.section(d.Bars.Positions, d.pattern.BarArea())
	if r.circ != nil {
		d.circ = r.circ
	} else {
		d.sec = &r.sec
	}
	l := c.log(d.Steps, "Steel area required")
	sec := r // the searches scale copies of its bars and leave it as provided
	bound := areaBound * c.ac.V
	var as float64
	var err error
	if sec.circ != nil {
		as, err = sec.circ.AreaWhere(bound, func(s *section.Circle) (float64, error) { return c.circleRatio(s, &d) })
	} else {
		as, err = sec.sec.AreaWhere(bound, func(s *section.Section) (float64, error) { return c.resistanceRatio(s, &d) })
	}
	if err != nil {
		l.Add(trace.Input("req/As", "Steel area needed for resistance: more than the search bound", "common practice", "A_s,res", "mm2", bound).
			Caution(fmt.Sprintf("No area of this bar pattern up to %.0f %% of Ac resists the actions: enlarge the section.", 100*areaBound)))
		d.AsReq = bound
		d.Reasons = append(d.Reasons, fmt.Sprintf("The bar pattern would need more than %.0f mm² of steel; enlarge the section.", bound))
		d.Status = StatusFail
		d.Steps = l.Steps
		return d
	}
	eta := 0.0
	switch {
	case as > 0 && sec.circ != nil:
		t := sec.circ.Scaled(as)
		eta, _ = c.circleRatio(&t, &d)
	case as > 0:
		t := sec.sec.Scaled(as)
		eta, _ = c.resistanceRatio(&t, &d)
	}
	etaQ := trace.Const(eta, "η_res", "")
	res := l.Add(trace.Solve("req/As_res", "Steel area of the bar pattern needed for resistance", "EN 1992-1-1:2004 6.1; 5.8.9",
		"A_s,res", "mm2", as, "regula falsi (Illinois) on the area of the bar pattern, the actions held",
		"eta - 1", eta-1, trace.A("eta", etaQ)).
		Note("η_res is the largest of NEd/NRd,max, MEd/MRd about y and z and, where required, the biaxial ratio, at the area found; the actions are those of the bars provided."))
	req := l.Add(trace.Formula("req/As_req", "Steel area required", "EN 1992-1-1:2004 9.5.2(2)", "A_s,req", "mm2",
		math.Max(res.V, c.asMin.V), "max(A_s_res, A_s_min)", trace.A("A_s_res", res), trace.A("A_s_min", c.asMin)))
	d.AsReq = req.V
	d.Steps = l.Steps
	return d
}

// biaxial returns the ratio of (5.39) for steel area as with the given actions and resistances.
func (c *common) biaxial(as, mEdY, mRdY, mEdZ, mRdZ float64) float64 {
	q := func(v float64) trace.Q { return trace.Const(v, "", "") }
	nRd := slender.NRdBiaxial("", c.ac, c.fcd, q(as), c.fyd).Value
	a := slender.ExponentA("", c.nEd, q(nRd)).Value
	return slender.BiaxialRatio("", q(mEdY), q(mRdY), q(mEdZ), q(mRdZ), q(a)).Value
}

// noArrangement returns a failed design when no bar pattern fits the section at all.
func (c *common) noArrangement() Design {
	d := Design{Column: c.col.ID, Storey: c.st.Name, B: c.col.B, H: c.col.H, Cover: c.col.Cover, Shape: c.col.Shape,
		Class: c.in.Materials.Concrete.Class, Fck: c.fck.V, Fyk: c.in.Materials.Fyk, NEd: c.st.NEd, AsMin: c.asMin.V, AsMax: c.asMax.V,
		Status: StatusFail, Governing: "no bar arrangement fits", bs: c.bs, Links: Links{Type: linkType(c.col)}}
	axes := [2]*Axis{&d.Y, &d.Z}
	for k, a := range c.ax {
		axes[k].L0, axes[k].Lambda, axes[k].M01, axes[k].M02 = a.l0.V, a.lambda.V, a.m01.V, a.m02.V
		axes[k].Ei, axes[k].M0Ed, axes[k].PhiEf = a.ei.V, a.m02i.V, a.phiEf.V
	}
	// The failure is recorded as a check step, so that the utilisation is a traced value.
	l := c.log(c.steps, "Reinforcement limits")
	if c.asMin.V > c.asMax.V {
		d.Utilization = l.Add(trace.Check("lim/As_range", "Minimum steel within the maximum", "EN 1992-1-1:2004 9.5.2(2), (3)", "A_s,min ≤ A_s,max",
			c.asMin.V/c.asMax.V, "As_min / As_max", trace.A("As_min", c.asMin), trace.A("As_max", c.asMax))).V
		d.Reasons = append(d.Reasons, fmt.Sprintf("As,min = %.0f mm² exceeds As,max = %.0f mm²: the section is too small for the axial force.", c.asMin.V, c.asMax.V))
	} else {
		d.Utilization = l.Add(unmet("bars/none", "A symmetric bar pattern of the listed diameters that fits the section", "EN 1992-1-1:2004 8.2(2); 8.7.2(3); 9.5.2(2), (3)",
			"a pattern fits", "No pattern fits: the value 2 only marks the failure.")).V
	}
	d.Reasons = append(d.Reasons, "No symmetric pattern of the listed bar diameters between As,min and As,max fits the section with the clear spacing of 8.2(2) and, beside the lapped pairs, of 8.7.2(3); enlarge the section or widen the list of diameters.")
	d.Steps = l.Steps
	return d
}

// Interaction points per curve.
const (
	curvePoints   = 25
	contourPoints = 36
)

// AddInteraction computes, for every design with bars, the N–M diagrams about both axes and
// the My–Mz contour at NEd of its section (EN 1992-1-1:2004 6.1), for plotting.
func AddInteraction(r *Result) {
	m := r.curves
	if m == nil {
		m = &curveMemo{}
	}
	work.Each(len(r.Designs), func(k int) { addInteraction(&r.Designs[k], m) })
}

// addInteraction computes the interaction data of design d, as AddInteraction.
//
// For a circle both N–M diagrams are drawn in the direction of least resistance at NEd. The
// N–M diagrams are taken from m (when not nil) where a lift with the same section made them.
func addInteraction(d *Design, m *curveMemo) {
	var key [256]byte
	if c := d.circ; c != nil {
		k := curveKey(key[:0], 'o', [2]float64{c.D}, c.Bars, c.Fcd, c.Fyd, c.Es, c.Block, c.Concrete, d.theta)
		nm := m.nm(k, func() []section.NMPoint { return c.CurveNM(d.theta, curvePoints) })
		d.Interaction = &Interaction{NMY: nm, NMZ: nm, Contour: c.ContourMyMz(d.NEd, contourPoints)}
		return
	}
	s := d.sec
	if s == nil {
		return
	}
	on := func(axis section.Axis) []section.NMPoint {
		k := curveKey(key[:0], 'r', [2]float64{s.B, s.H}, s.Bars, s.Fcd, s.Fyd, s.Es, s.Block, s.Concrete, float64(axis))
		return m.nm(k, func() []section.NMPoint { return s.CurveNM(axis, curvePoints) })
	}
	d.Interaction = &Interaction{NMY: on(section.AxisY), NMZ: on(section.AxisZ), Contour: s.ContourMyMz(d.NEd, contourPoints)}
}
