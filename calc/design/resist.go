package design

import (
	"fmt"
	"math"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/section"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// resist is the section of one bar pattern with the traced inputs it was built from.
type resist struct {
	c    *common
	sec  section.Section
	circ *section.Circle // the circular section; nil for a rectangle

	minN  float64           // the NEd of min
	min   section.CircleMin // the least resistance over the directions at minN
	minOK int               // 0: not computed, 1: min holds, -1: no resistance at minN
}

// section builds the section with equal bars of area barArea at the positions pos.
func (c *common) section(pos [][2]float64, barArea float64) *resist {
	bars := make([]section.Bar, len(pos))
	for i, p := range pos {
		bars[i] = section.Bar{Y: p[0], Z: p[1], Area: barArea}
	}
	block := section.ParabolaRectangle
	if c.in.Options.StressBlock == model.Rectangular {
		block = section.Rectangular
	}
	if c.circle {
		return &resist{c: c, circ: &section.Circle{D: c.col.B, Bars: bars, Concrete: c.in.Materials.Concrete,
			Fcd: c.fcd.V, Fyd: c.fyd.V, Es: c.es.V, Block: block}}
	}
	return &resist{c: c, sec: section.Section{B: c.col.B, H: c.col.H, Bars: bars, Concrete: c.in.Materials.Concrete,
		Fcd: c.fcd.V, Fyd: c.fyd.V, Es: c.es.V, Block: block}}
}

// area returns the steel area of the section.
func (r *resist) area() float64 {
	if r.circ != nil {
		return r.circ.Area()
	}
	return r.sec.Area()
}

// least returns the least resistance of the circle over the directions of bending at nEd
// (section.Circle.MRdMin), computed once per axial force.
func (r *resist) least(nEd float64) (section.CircleMin, bool) {
	if r.minOK == 0 || r.minN != nEd {
		m, err := r.circ.MRdMin(nEd)
		r.minN, r.min, r.minOK = nEd, m, 1
		if err != nil {
			r.minOK = -1
		}
	}
	return r.min, r.minOK == 1
}

// circleAngle is the direction θ of bending about axis k of a circle: about y the +z side
// compressed (θ = 0), about z the +y side (θ = π/2), as section.CircleState.Theta.
func circleAngle(k int) float64 { return float64(k) * math.Pi / 2 }

// mRdAlong returns the moment resistance for bending about axis k alone (not the least over
// the directions, for a circle), fast.
func (r *resist) mRdAlong(k int, nEd float64) (float64, bool) {
	if r.circ == nil {
		return r.mRd(k, nEd)
	}
	m, err := r.circ.Resistance(circleAngle(k), nEd)
	if err != nil {
		return 0, false
	}
	return math.Abs(m), true
}

func axisOf(k int) section.Axis {
	if k == 1 {
		return section.AxisZ
	}
	return section.AxisY
}

// nRdMax returns the resistance to pure compression.
func (r *resist) nRdMax() float64 {
	if r.circ != nil {
		return r.circ.NRdMax()
	}
	return r.sec.NRdMax()
}

// nRdMaxStep returns the traced resistance to pure compression at uniform strain,
// EN 1992-1-1:2004 6.1(5), Fig. 6.1 (pivot C with zero curvature).
func (r *resist) nRdMaxStep(id string) trace.Step {
	c := r.c
	as := trace.Q{V: r.area(), Symbol: "A_s,prov", Unit: "mm2", From: "bars/As"}
	if r.circ != nil {
		args := []trace.Arg{trace.A("f_cd", c.fcd), trace.A("A_c", c.ac), trace.A("A_s", as), trace.A("E_s", c.es), trace.A("eps", c.epsC2), trace.A("f_yd", c.fyd)}
		expr := "f_cd * (A_c - A_s) + A_s * min(E_s * eps, f_yd)"
		if r.circ.Block == section.Rectangular {
			// The block's stress in a compression zone that narrows towards the extreme fibre,
			// 3.1.7(3) Note, as the moment resistance takes it.
			expr = "k * eta * " + expr
			args = append(args, trace.A("eta", c.eta), trace.A("k", trace.Const(section.BlockReduction, "k_w", "")))
		}
		return trace.Formula(id, "Resistance to pure compression of the circle (uniform strain)", "EN 1992-1-1:2004 6.1(5), Fig. 6.1",
			"N_Rd,max", "N", r.circ.NRdMax(), expr, args...)
	}
	args := []trace.Arg{trace.A("f_cd", c.fcd), trace.A("b", c.b), trace.A("h", c.h), trace.A("A_s", as),
		trace.A("E_s", c.es), trace.A("eps", c.epsC2), trace.A("f_yd", c.fyd)}
	expr := "f_cd * (b * h - A_s) + A_s * min(E_s * eps, f_yd)"
	if r.sec.Block == section.Rectangular {
		expr = "eta * " + expr // η multiplies the concrete term only
		args = append(args, trace.A("eta", c.eta))
	}
	return trace.Formula(id, "Resistance to pure compression (uniform strain)", "EN 1992-1-1:2004 6.1(5), Fig. 6.1",
		"N_Rd,max", "N", r.sec.NRdMax(), expr, args...)
}

// mRd returns the moment resistance about axis k at nEd, fast. The bar patterns are
// symmetric about both axes (detail.Geometry.Positions), so either face gives it.
//
// A circle gives its least resistance over the directions of bending, about either axis.
func (r *resist) mRd(k int, nEd float64) (float64, bool) {
	if r.circ != nil {
		m, ok := r.least(nEd)
		if !ok || !(m.State.M > 0) {
			return 0, false
		}
		return m.State.M, true
	}
	m, err := r.sec.Resistance(axisOf(k), section.Positive, nEd)
	if err != nil {
		return 0, false
	}
	return math.Abs(m), true
}

// mRdSteps records the equilibrium at nEd about axis k (the governing face) and returns MRd.
func (r *resist) mRdSteps(l *trace.Log, n string, k int, nEd trace.Q, full bool) (trace.Q, bool) {
	if !full {
		m, ok := r.mRd(k, nEd.V)
		if !ok {
			return trace.Q{}, false
		}
		return l.Add(trace.Input(n+"/sec/M_Rd", "Design moment of resistance about "+n+" at N_Ed (candidate)", "EN 1992-1-1:2004 6.1", "M_Rd,"+n, "Nmm", m)), true
	}
	// The patterns are symmetric about both axes, so the positive face gives the resistance.
	st, err := r.sec.MRdAt(axisOf(k), section.Positive, nEd.V)
	if err != nil {
		return trace.Q{}, false
	}
	c := r.c
	refs := section.Refs{Fcd: c.fcd.From, Fyd: c.fyd.From, Es: c.es.From, B: c.b.From, H: c.h.From,
		EpsPeak: c.epsC2.From, EpsUlt: c.epsCu.From, N: c.nExp.From, Lambda: c.lam.From, Eta: c.eta.From}
	q := r.sec.Trace(l, n+"/sec/", nEd, st, refs)
	if q.V < 0 {
		q = l.Add(trace.Formula(n+"/MRd", "Moment resistance about "+n+" (magnitude)", "common practice", "M_Rd,"+n, "Nmm",
			-q.V, "abs(M)", trace.A("M", q)))
	}
	return q, true
}

// resistanceRatio returns the largest resistance ratio of the design's actions for the bar
// positions pos with each bar of area barArea: NEd/NRd,max, MEd/MRd about y and z, and the
// biaxial ratio where (5.38) calls for it.
func (c *common) resistanceRatio(sec *section.Section, d *Design) (float64, error) {
	return c.ratioOf(&resist{c: c, sec: *sec}, d)
}

// circleRatio is resistanceRatio for a circular section: NEd/NRd,max and the resultant design
// moment over the least resistance over the directions (5.8.9(4) with a = 2).
func (c *common) circleRatio(circ *section.Circle, d *Design) (float64, error) {
	return c.ratioOf(&resist{c: c, circ: circ}, d)
}

// ratioOf is resistanceRatio for the section of r.
func (c *common) ratioOf(r *resist, d *Design) (float64, error) {
	nMax := r.nRdMax()
	ratio := c.nEd.V / nMax
	if ratio > 1 {
		return ratio, nil
	}
	my, okY := r.mRd(0, c.nEd.V)
	mz, okZ := r.mRd(1, c.nEd.V)
	if !okY || !okZ || my <= 0 || mz <= 0 {
		return math.Inf(1), nil
	}
	ratio = math.Max(ratio, math.Max(d.Y.MEd/my, d.Z.MEd/mz))
	switch {
	case r.circ != nil:
		ratio = math.Max(ratio, math.Hypot(d.Y.MEd, d.Z.MEd)/my)
	case d.Biaxial.Checked:
		ratio = math.Max(ratio, c.biaxial(r.area(), d.Y.MEd, my, d.Z.MEd, mz))
	}
	return ratio, nil
}

// quick holds the resistance checks of a pattern at one axial force, without a trace.
type quick struct {
	nEd, nRdMax float64
	mEd, mRd    [2]float64
	biaxial     bool    // (5.38) calls for (5.39)
	ratioB      float64 // (5.39), 0 when not called for
	ok          bool    // the section has a moment resistance about both axes
	nRdT        float64 // in tension, the resistance As·fyd

	pos [][2]float64 // the bar positions of the pattern
	sec *resist      // its section
}

// ratio returns the largest ratio of action to resistance of the checks.
func (q quick) ratio() float64 {
	if !q.ok {
		return math.Inf(1)
	}
	r := math.Max(math.Max(q.nEd/q.nRdMax, q.ratioB), math.Max(q.mEd[0]/q.mRd[0], q.mEd[1]/q.mRd[1]))
	if q.nEd < 0 {
		r = math.Max(r, -q.nEd/q.nRdT)
	}
	return r
}

// quickResist evaluates the resistance checks of the pattern at the axial force nEd by the same
// value functions as the traced steps (imperfection, slenderness limit, nominal curvature,
// design moment, resistance, biaxial check), without a trace.
func (c *common) quickResist(p detail.Pattern, nEd float64) quick {
	return c.quickUpTo(p, nEd, math.Inf(1))
}

// quickUpTo is quickResist that gives up, with ok false, as soon as one ratio exceeds stop.
func (c *common) quickUpTo(p detail.Pattern, nEd, stop float64) quick {
	g := c.geometry(p)
	pos := g.Positions(p)
	r := c.section(pos, p.BarArea())
	q := quick{nEd: nEd, nRdMax: r.nRdMax(), pos: pos, sec: r}
	if nEd > q.nRdMax {
		return q
	}
	as := p.Area()
	if nEd < 0 {
		// In tension: the bars alone, as the traced check sec/check_Nt.
		if q.nRdT = as * c.fyd.V; -nEd >= q.nRdT {
			return q
		}
	}
	n := nEd / (c.ac.V * c.fcd.V) // as slender.RelativeForce
	omega := slender.MechanicalRatioValue(as, c.fyd.V, c.ac.V, c.fcd.V)
	bFac := slender.FactorBValue(omega)
	k := c.p.Get("lambda_lim_k")
	for ax := 0; ax < 2; ax++ {
		a := &c.ax[ax]
		m01i, m02i := a.m01.V+nEd*a.ei.V, a.m02.V+nEd*a.ei.V // as slender.WithImperfection
		lim := slender.LambdaLimValue(k, a.factorA.V, bFac, a.factorC.V, n)
		if a.lambda.V > lim {
			is := slender.GyrationValue(layersOf(pos, ax))
			m0e := slender.EquivalentMomentValue(m01i, m02i)
			method := c.in.Options.SecondOrder
			mCurv, mStiff := 0.0, 0.0
			if method != model.SecondOrderStiffness {
				d := slender.EffectiveDepthValue(a.depth.V, is)
				r0 := slender.BaseCurvatureValue(c.fyd.V/c.es.V, d)
				kphi := slender.KphiValue(slender.BetaValue(c.fck.V, a.lambda.V), a.phiEf.V)
				curv := slender.CurvatureValue(slender.KrValue(n, omega), kphi, r0)
				m2 := nEd * slender.SecondOrderEccentricityValue(curv, a.l0.V, c.p.Get("c_curv"))
				mCurv = slender.DesignMomentSlenderValue(m01i, m02i, m0e, m2, nEd, a.e0.V)
			}
			if method == model.SecondOrderStiffness || method == model.SecondOrderBoth {
				m, _, ok := c.stiffnessValues(ax, as, is, m0e, m02i, nEd, n)
				if !ok {
					return q
				}
				mStiff = m
			}
			q.mEd[ax] = math.Max(mCurv, mStiff)
		} else {
			q.mEd[ax] = slender.DesignMomentStockyValue(m02i, nEd, a.e0.V)
		}
		m, ok := r.mRd(ax, nEd)
		if !ok || !(m > 0) || q.mEd[ax]/m > stop {
			return q
		}
		q.mRd[ax] = m
	}
	q.ok = true
	if c.circle {
		// The resultant design moment over the least resistance, as the traced check bi/check.
		q.biaxial = true
		q.ratioB = math.Hypot(q.mEd[0], q.mEd[1]) / math.Max(q.mRd[0], 1)
		return q
	}
	q.biaxial = !(slender.SlendernessRatiosCloseValue(c.ax[0].lambda.V, c.ax[1].lambda.V) &&
		slender.EccentricitiesApartValue(q.mEd[0], q.mEd[1], c.b.V, c.h.V))
	if c.in.Options.Biaxial == model.BiaxialExact || nEd < 0 {
		// The exact resistance along the resultant moment is the check, as in evaluate.
		st, err := r.sec.Biaxial(nEd, math.Atan2(q.mEd[1], q.mEd[0]))
		if err != nil {
			q.ok = false
			return q
		}
		q.ratioB = math.Hypot(q.mEd[0], q.mEd[1]) / math.Max(st.MRd, 1)
		return q
	}
	if q.biaxial {
		a := slender.ExponentAValue(nEd, slender.NRdBiaxialValue(c.ac.V, c.fcd.V, as, c.fyd.V))
		q.ratioB = slender.BiaxialRatioValue(q.mEd[0], q.mRd[0], q.mEd[1], q.mRd[1], a)
	}
	return q
}

// stiffnessValues returns the design moment about axis k by the nominal stiffness method of
// EN 1992-1-1:2004 5.8.7 (the value functions of its steps, Ks = 1) for the steel area as with the
// radius of gyration is, the equivalent moment m0e, the larger end moment with its imperfection
// m02i, the axial force nEd and the relative force n; and the buckling load NB, with false where
// the column buckles (the magnification then 0, as the trace records it).
func (c *common) stiffnessValues(k int, as, is, m0e, m02i, nEd, n float64) (mEd, nb float64, ok bool) {
	a := &c.ax[k]
	width := c.b.V
	if k == 1 {
		width = c.h.V
	}
	ic := slender.ConcreteInertiaValue(width, a.depth.V)
	if c.circle {
		ic = slender.CircleInertiaValue(c.b.V)
	}
	kc := slender.KcValue(slender.K1Value(c.fck.V), slender.K2Value(n, a.lambda.V), a.phiEf.V)
	ei := slender.NominalStiffnessValue(kc, slender.EcdValue(c.ecm.V, slender.GammaCE),
		ic, 1, c.es.V, slender.SteelInertiaValue(as, is))
	nb = slender.BucklingLoadValue(ei, a.l0.V)
	km, ok := slender.MagnificationValue(slender.MomentBetaValue(slender.C0Value(slender.ShapeConstant)), nb, nEd)
	return slender.DesignMomentStiffnessValue(slender.MagnifiedMomentValue(m0e, km), m02i, nEd, a.e0.V), nb, ok
}

// cannotPass reports whether the pattern fails a resistance check for certain at NEd; a margin
// of 1e-6 leaves the verdict on the edge to the traced evaluation. It returns the quick checks
// it made, whose section and resistances a trial of the pattern takes over.
func (c *common) cannotPass(p detail.Pattern) (bool, *quick) {
	const stop = 1 + 1e-6
	q := c.quickUpTo(p, c.nEd.V, stop)
	return q.ratio() > stop, &q
}

// areaFloor returns a steel area below which no pattern resists the least design moments,
// max(M02 + NEd·ei, NEd·e0) about each axis, which second-order effects can only raise. The
// bound puts the steel in the two outermost layers at the edge distance of the smallest bars:
// of all symmetric patterns of one area, steel there has the largest lever arm and strain, so
// its resistance at NEd bounds theirs from above (common practice, no source). The resistance
// grows with the area, which is found by bisection.
func (c *common) areaFloor(dMin float64) float64 {
	edge := c.col.Cover + c.linkFor(dMin) + dMin/2
	lo, hi := c.asMin.V, c.asMax.V
	enough := func(as float64) bool {
		for k := 0; k < 2; k++ {
			a := &c.ax[k]
			least := math.Max(a.m02i.V, c.nEd.V*a.e0.V)
			pos := [][2]float64{{0, c.col.H/2 - edge}, {0, -(c.col.H/2 - edge)}}
			if k == 1 {
				pos = [][2]float64{{c.col.B/2 - edge, 0}, {-(c.col.B/2 - edge), 0}}
			}
			r := c.section(pos, as/2)
			if c.nEd.V > r.nRdMax() {
				return false
			}
			if m, ok := r.mRdAlong(k, c.nEd.V); !ok || m < least {
				return false
			}
		}
		return true
	}
	if !enough(hi) {
		return hi
	}
	if enough(lo) {
		return lo
	}
	for hi-lo > 1e-3*hi {
		mid := (lo + hi) / 2
		if enough(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return lo
}

// circleSteps records the least moment resistance of the circle over the directions of
// bending at nEd, the equilibrium in the worst direction (section.Circle.Trace), and returns
// MRd; a trial records the value alone.
func (r *resist) circleSteps(l *trace.Log, nEd trace.Q, full bool) (trace.Q, bool) {
	m, ok := r.least(nEd.V)
	if !ok || !(m.State.M > 0) {
		return trace.Q{}, false
	}
	if !full {
		return l.Add(trace.Input("sec/M_Rd", "Least moment of resistance over the directions of bending at N_Ed (candidate)", "EN 1992-1-1:2004 6.1", "M_Rd", "Nmm", m.State.M)), true
	}
	c := r.c
	l.Group = "Moment resistance of the circular section at N_Ed: the least over the directions of bending"
	how := "the direction of least resistance, scanned round the circle and refined by golden-section search"
	if m.HalfPitch {
		how = "the direction of least resistance, scanned over half a bar pitch (the ring's symmetry) and refined by golden-section search"
	}
	th := trace.Input("sec/theta", "Direction of bending with the least resistance, from the +z axis towards +y", trace.ClauseChosen+how, "θ", "deg", m.State.Theta*180/math.Pi)
	if m.Matters {
		th = th.Note(fmt.Sprintf("The bar positions make the resistance depend on the direction of bending: over the directions tried it ranges from %.1f kNm to %.1f kNm (%.1f %%); the least is used for bending in any direction.", m.State.M/1e6, m.MMax/1e6, 100*m.Spread))
	} else {
		th = th.Note("The resistance is the same in every direction within 0.1 % for these bars.")
	}
	thQ := l.Add(th)
	refs := section.CircleRefs{D: c.b.From, Theta: thQ.From, Fcd: c.fcd.From, Fyd: c.fyd.From, Es: c.es.From,
		EpsPeak: c.epsC2.From, EpsUlt: c.epsCu.From, N: c.nExp.From, Eta: c.eta.From}
	q := r.circ.Trace(l, "sec/", nEd, m.State, refs)
	return q, true
}

// circleBiaxial records the biaxial check of a circular section: the resultant of the design
// moments about y and z against the least resistance over the directions,
// EN 1992-1-1:2004 5.8.9(4) with a = 2 for circular sections.
func (c *common) circleBiaxial(l *trace.Log, d *Design, mEds, mRd [2]trace.Q, resistance func(trace.Step)) {
	l.Group = "Biaxial bending of the circular section"
	med := l.Add(trace.Formula("bi/M_Ed", "Resultant design moment", "EN 1992-1-1:2004 5.8.9(4)", "M_Ed", "Nmm",
		math.Hypot(mEds[0].V, mEds[1].V), "sqrt(M_y ** 2 + M_z ** 2)", trace.A("M_y", mEds[0]), trace.A("M_z", mEds[1])))
	d.Biaxial.Checked, d.Biaxial.A, d.Biaxial.Resultant = true, 2, med.V
	if !(mRd[0].V > 0) {
		d.Biaxial.Ratio = 0
		l.Add(trace.Input("bi/ratio", "Biaxial ratio: not computed, the section has no moment resistance", "EN 1992-1-1:2004 5.8.9(4)", "ratio", "", 0))
		return
	}
	s := trace.Check("bi/check", "Biaxial bending: the resultant moment against the least resistance over the directions", "EN 1992-1-1:2004 5.8.9(4)", "M_Ed ≤ M_Rd",
		med.V/math.Max(mRd[0].V, 1), "M_Ed / max(M_Rd, 1)", trace.A("M_Ed", med), trace.A("M_Rd", mRd[0])).
		Note("For a circular section a = 2 in (5.39) and MRd,y = MRd,z = MRd, so (5.39) reads (MEd,y² + MEd,z²)/MRd² ≤ 1: the resultant moment not above MRd. MRd is the least over the directions of bending, so the check holds whatever the direction of the resultant. The imperfection is included about both axes, which is on the safe side (5.8.9(2) would allow it in the most unfavourable direction only).")
	d.Biaxial.Ratio = s.Value
	resistance(shownRatio(s, mRd[0].V))
}
