package design

import (
	"math"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/section"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// resist is the section of one bar pattern with the traced inputs it was built from.
type resist struct {
	c   *common
	sec section.Section
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
	return &resist{c: c, sec: section.Section{B: c.col.B, H: c.col.H, Bars: bars, Concrete: c.in.Materials.Concrete,
		Fcd: c.fcd.V, Fyd: c.fyd.V, Es: c.es.V, Block: block}}
}

func axisOf(k int) section.Axis {
	if k == 1 {
		return section.AxisZ
	}
	return section.AxisY
}

// nRdMax returns the resistance to pure compression.
func (r *resist) nRdMax() float64 { return r.sec.NRdMax() }

// nRdMaxStep returns the traced resistance to pure compression at uniform strain,
// EN 1992-1-1:2004 6.1(5), Fig. 6.1 (pivot C with zero curvature).
func (r *resist) nRdMaxStep(id string) trace.Step {
	c := r.c
	as := trace.Q{V: r.sec.Area(), Symbol: "A_s,prov", Unit: "mm2", From: "bars/As"}
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
func (r *resist) mRd(k int, nEd float64) (float64, bool) {
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
	r := &resist{c: c, sec: *sec}
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
	if d.Biaxial.Checked {
		ratio = math.Max(ratio, c.biaxial(sec.Area(), d.Y.MEd, my, d.Z.MEd, mz))
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
	g := detail.Geometry{B: c.col.B, H: c.col.H, Cover: c.col.Cover, Link: c.linkFor(p.Dia)}
	pos := g.Positions(p)
	r := c.section(pos, p.BarArea())
	q := quick{nEd: nEd, nRdMax: r.nRdMax()}
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
				width := c.b.V
				if ax == 1 {
					width = c.h.V
				}
				kc := slender.KcValue(slender.K1Value(c.fck.V), slender.K2Value(n, a.lambda.V), a.phiEf.V)
				ei := slender.NominalStiffnessValue(kc, slender.EcdValue(c.ecm.V, slender.GammaCE),
					slender.ConcreteInertiaValue(width, a.depth.V), 1, c.es.V, slender.SteelInertiaValue(as, is))
				nb := slender.BucklingLoadValue(ei, a.l0.V)
				km, ok := slender.MagnificationValue(slender.MomentBetaValue(slender.C0Value(slender.ShapeConstant)), nb, nEd)
				if !ok {
					return q
				}
				mStiff = slender.DesignMomentStiffnessValue(slender.MagnifiedMomentValue(m0e, km), m02i, nEd, a.e0.V)
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

// cannotPass reports whether the pattern fails a resistance check for certain at NEd; a margin
// of 1e-6 leaves the verdict on the edge to the traced evaluation.
func (c *common) cannotPass(p detail.Pattern) bool {
	const stop = 1 + 1e-6
	return c.quickUpTo(p, c.nEd.V, stop).ratio() > stop
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
			if m, ok := r.mRd(k, c.nEd.V); !ok || m < least {
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
