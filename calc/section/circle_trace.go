package section

// The traced equilibrium state of a circular section.
//
// The steps mirror Section.Trace in the frame turned by θ (see circle.go): the solve step
// for the neutral axis with its residual N − NEd, the concrete resultant and its lever arm
// along the direction θ, each bar's coordinate, strain, stresses and force, N and M as sums
// and MRd = |M|. The evaluator has no trigonometric function, so two values are not closed
// forms of it and are recorded as solve steps with a verification residual the evaluator
// can check: the half-angle α of the rectangular block's segment (residual: the Taylor
// series of cos α less 1 − 2·d_c/D), and the concrete force and moment of the
// parabola-rectangle block, integrated by Gauss–Legendre quadrature (residual: the
// difference from the same integral by a rule of twice the points). Every other step is a
// formula whose value mirrors its expression operation for operation (float64()
// conversions keep the compiler from fusing multiply-adds), so the recheck is exact.

import (
	"math"
	"strconv"
	"strings"

	"colsheet/calc/trace"
)

// Method strings of the circle's trace.
const (
	methodCircleGL = "plateau over the compressed segment in closed form, less the parabola's correction by 20-point Gauss–Legendre quadrature in the angle φ from the normal (φ = φp + (φe − φp)·v²); verified by the same integral with two panels of 20 points"
	methodAlpha    = "closed form α = 2·atan2(√d_c, √(D − d_c)), evaluated in floating point (the half-angle with cos α = 1 − 2·d_c/D); verified by the Taylor series of cos α to the term α³²/32!"
	cosSeriesTerms = 16 // terms of the Taylor series of cos α after the first
)

// circleGLCheck is the rule that verifies the parabola's correction: two panels of circleGL.
var circleGLCheck = panels(circleGL, 2)

// panels returns the rule base repeated on k equal panels of [0, 1].
func panels(base glRule, k int) glRule {
	r := glRule{}
	for p := 0; p < k; p++ {
		for i, x := range base.x {
			r.x = append(r.x, (float64(p)+x)/float64(k))
			r.w = append(r.w, base.w[i]/float64(k))
		}
	}
	return r
}

// CircleRefs names the steps that produced a circular section's inputs, so that trace
// arguments can point at them; empty fields leave the arguments without a producing step.
type CircleRefs struct {
	D, Theta     string // steps giving the diameter and the direction θ (without Theta, Trace records θ as an input)
	Fcd, Fyd, Es string // steps giving fcd, fyd and Es
	EpsPeak      string // step giving εc2 (or εc3 for the rectangular block)
	EpsUlt       string // step giving εcu2 (or εcu3)
	N            string // step giving the exponent n of the parabola
	Eta          string // step giving η of the rectangular block
}

// circleTrace holds the values of one traced state, computed before any step is added.
type circleTrace struct {
	pivotC           bool
	x, etop, ebot    float64
	dc, sig, cosA    float64 // rectangular block: depth, stress k·η·fcd, cos α
	sinA, alpha      float64 // rectangular block: sin α and α
	cosRes           float64 // rectangular block: Taylor series of cos α less cos α
	area, moment     float64 // rectangular block: segment area and first moment about the centre
	fc, mc, sc       float64 // concrete force, its moment about the centre and lever arm s_c
	fcRef, mcRef     float64 // parabola-rectangle: force and moment by the check rule
	bars             []circleBarTrace
	n, m, mrd, resid float64 // N, M, |M| and N − NEd
}

// circleBarTrace holds the traced values of one bar.
type circleBarTrace struct {
	s, eps, ss, sc, force float64
	inBlock               bool // rectangular block: the bar's concrete lies in the block
}

// Trace records in log the steps of the equilibrium state st of the circle (from MRdAt,
// MRdMin or StateAt) at axial force NEd: the solve step for the neutral axis with its
// equilibrium residual, the concrete resultant and its lever arm along θ, the coordinate,
// strain, stresses and force of each bar, N and M as sums and the moment of resistance
// MRd = |M|, which it returns. Step IDs are id followed by a short name.
func (c *Circle) Trace(log *trace.Log, id string, NEd trace.Q, st CircleState, refs CircleRefs) trace.Q {
	var buf [maxPoints]cbar
	g := c.ring(st.Theta, buf[:])
	pr := g.f.profile(math.Max(math.Min(st.P, 2), 1e-12))
	v := c.traceValues(&g, &pr, st, NEd.V)
	t := c.tracer(log, id, st, refs)
	t.solveStep(&v, st.P, NEd)
	fcQ, scQ := t.concreteSteps(&v)
	return t.sumSteps(&v, fcQ, scQ)
}

// traceValues computes every traced value of the state, mirroring the expressions.
func (c *Circle) traceValues(g *ring, pr *profile, st CircleState, ned float64) circleTrace {
	f := &g.f
	D := c.D
	v := circleTrace{pivotC: pr.pivotC, x: pr.x, etop: f.eult}
	if pr.pivotC {
		v.ebot = pr.ebot
		v.etop = f.epk + float64((f.epk-v.ebot)*(f.eult-f.epk))/f.epk
	}
	if f.rect {
		c.rectValues(&v, D)
	} else {
		v.fc, v.mc = g.concrete(pr)
		v.fcRef, v.mcRef = g.concreteRule(pr, circleGLCheck)
		if v.fc > 0 {
			v.sc = v.mc / v.fc
		}
	}
	v.n, v.m = v.fc, float64(v.fc*v.sc)
	for _, b := range st.Bars {
		bt := c.barValues(&v, b, g.ny, g.nz)
		v.bars = append(v.bars, bt)
		v.n += bt.force
		v.m = v.m + float64(bt.force*bt.s)
	}
	v.mrd = math.Abs(v.m)
	v.resid = v.n - ned
	return v
}

// rectValues computes the rectangular block's depth, segment and resultant.
func (c *Circle) rectValues(v *circleTrace, D float64) {
	lam := c.Concrete.Lambda
	if !v.pivotC {
		v.dc = math.Min(float64(lam*v.x), D)
	} else {
		v.dc = math.Min(float64(float64(D*lam)*v.etop)/math.Max(v.etop-v.ebot, float64(lam*v.etop)), D)
	}
	v.sig = float64(BlockReduction*c.Concrete.Eta) * c.Fcd
	v.cosA = 1 - float64(2*v.dc)/D
	v.sinA = float64(2*math.Sqrt(float64(v.dc*(D-v.dc)))) / D
	v.alpha = segmentAngle(v.dc, D)
	_, cs := cosSeries(v.alpha)
	v.cosRes = cs - v.cosA
	v.area = float64(math.Pow(D/2, 2)) * (v.alpha - float64(v.sinA*v.cosA))
	v.moment = float64(float64(2.0/3)*math.Pow(D/2, 3)) * math.Pow(v.sinA, 3)
	v.fc = float64(v.sig * v.area)
	if v.area > 0 {
		v.sc = v.moment / v.area
	}
}

// barValues computes one bar's coordinate, strain, stresses and force.
func (c *Circle) barValues(v *circleTrace, b CircleBar, ny, nz float64) circleBarTrace {
	D := c.D
	var bt circleBarTrace
	bt.s = float64(b.Y*ny) + float64(b.Z*nz)
	t := D/2 - bt.s
	if !v.pivotC {
		bt.eps = float64(c.eult()*(v.x-t)) / v.x
	} else {
		bt.eps = v.etop - float64((v.etop-v.ebot)*t)/D
	}
	bt.ss = math.Max(-c.Fyd, math.Min(c.Fyd, float64(c.Es*bt.eps)))
	if c.Block == Rectangular {
		bt.inBlock = b.SigmaC != 0
		if bt.inBlock {
			bt.sc = v.sig
		}
	} else {
		epk := c.Concrete.EpsC2
		bt.sc = c.Fcd * (1 - math.Pow(1-math.Min(math.Max(bt.eps, 0), epk)/epk, c.Concrete.N))
	}
	bt.force = float64(b.Area * (bt.ss - bt.sc))
	return bt
}

// eult returns the strain at the extreme compressed fibre on pivot B, εcu2 or εcu3.
func (c *Circle) eult() float64 {
	if c.Block == Rectangular {
		return c.Concrete.EpsCu3
	}
	return c.Concrete.EpsCu2
}

// cosSeries returns the Taylor series of cos α to the term α^(2·cosSeriesTerms) in Horner's
// form, as an expression over alpha, and its value, computed as the evaluator does.
func cosSeries(alpha float64) (string, float64) {
	a2 := math.Pow(alpha, 2)
	expr, val := "1", 1.0
	for k := cosSeriesTerms; k >= 1; k-- {
		d := float64((2*k - 1) * 2 * k)
		expr = "1 - alpha ** 2 / " + strconv.Itoa(int(d)) + " * (" + expr + ")"
		val = 1 - float64(float64(a2/d)*val)
	}
	return expr, val
}

// circleTracer adds the steps of one traced state to a log.
type circleTracer struct {
	c                 *Circle
	log               *trace.Log
	id                string
	st                CircleState
	d, theta          trace.Q
	fcd, fyd, es      trace.Q
	epk, eult, n, eta trace.Q
	pkn, ultn         string
	xq, etq, ebq      trace.Q // depth (pivot B) or strains (pivot C) of the profile
}

// tracer returns the step builder of state st with the section's input quantities.
func (c *Circle) tracer(log *trace.Log, id string, st CircleState, refs CircleRefs) *circleTracer {
	con := func(v float64, sym, from string) trace.Q { return trace.Q{V: v, Symbol: sym, From: from} }
	t := &circleTracer{c: c, log: log, id: id, st: st,
		d:     trace.Q{V: c.D, Symbol: "D", Unit: "mm", From: refs.D},
		theta: trace.Q{V: st.Theta * 180 / math.Pi, Symbol: "θ", Unit: "deg", From: refs.Theta},
		fcd:   trace.Q{V: c.Fcd, Symbol: "f_cd", Unit: "MPa", From: refs.Fcd},
		fyd:   trace.Q{V: c.Fyd, Symbol: "f_yd", Unit: "MPa", From: refs.Fyd},
		es:    trace.Q{V: c.Es, Symbol: "E_s", Unit: "MPa", From: refs.Es},
		n:     con(c.Concrete.N, "n", refs.N), eta: con(c.Concrete.Eta, "η", refs.Eta)}
	k := c.Concrete
	if c.Block == Rectangular {
		t.epk, t.eult = con(k.EpsC3, "ε_c3", refs.EpsPeak), con(k.EpsCu3, "ε_cu3", refs.EpsUlt)
		t.pkn, t.ultn = "eps_c3", "eps_cu3"
	} else {
		t.epk, t.eult = con(k.EpsC2, "ε_c2", refs.EpsPeak), con(k.EpsCu2, "ε_cu2", refs.EpsUlt)
		t.pkn, t.ultn = "eps_c2", "eps_cu2"
	}
	if refs.Theta == "" {
		t.theta = log.Add(trace.Input(id+"theta", "Direction of bending: normal to the neutral axis towards the compressed side, from +z towards +y",
			"input", "θ", "deg", t.theta.V))
	}
	return t
}

// full returns the ID the log gives to the step named name.
func (t *circleTracer) full(name string) string { return t.log.Prefix + t.id + name }

// barName returns the name of bar i's quantity.
func barName(name string, i int) string { return name + strconv.Itoa(i+1) }

// solveStep adds the solve step of the neutral axis with its residual N − NEd and, on
// pivot C, the strain at the extreme compressed fibre.
func (t *circleTracer) solveStep(v *circleTrace, p float64, NEd trace.Q) {
	verify := []string{"F_c"}
	args := []trace.Arg{trace.A("F_c", trace.Q{V: v.fc, Symbol: "F_c", Unit: "N", From: t.full("F_c")})}
	for i, b := range v.bars {
		name := barName("F_s", i)
		verify = append(verify, name)
		args = append(args, trace.A(name, trace.Q{V: b.force, Symbol: name, Unit: "N", From: t.full(name)}))
	}
	args = append(args, trace.A("N_Ed", NEd))
	vexpr := strings.Join(verify, " + ") + " - N_Ed"
	method := methodBrent
	if p >= 2 {
		method = methodUniform
	}
	choices := "Concrete: " + t.c.Block.String() + " block, no tension; steel: horizontal top branch, no strain limit; concrete displaced by bars in compression deducted. Depths are measured from the extreme compressed fibre along the direction θ, over the diameter D."
	t.etq = t.eult
	if !v.pivotC {
		t.xq = trace.Q{V: v.x, Symbol: "x", Unit: "mm", From: t.full("x")}
		t.log.Add(trace.Solve(t.id+"x", "Neutral-axis depth for equilibrium with N_Ed (pivot B: ε at the extreme compressed fibre = "+t.eult.Symbol+")",
			clausePivots, "x", "mm", v.x, method, vexpr, v.resid, args...).Note(choices))
		return
	}
	t.ebq = trace.Q{V: v.ebot, Symbol: "ε_bot", From: t.full("eps_bot")}
	step := trace.Solve(t.id+"eps_bot", "Strain at the opposite fibre for equilibrium with N_Ed (pivot C: whole section compressed)",
		clausePivots, "ε_bot", "", v.ebot, method, vexpr, v.resid, args...).Note(choices)
	if trace.Finite(v.x) {
		step = step.Note("The neutral axis lies beyond the diameter D, outside the section.")
	} else {
		step = step.Note("Uniform strain: the neutral axis is at infinity.")
	}
	t.log.Add(step)
	t.etq = t.log.Add(trace.Formula(t.id+"eps_top", "Strain at the extreme compressed fibre (pivot C)", clausePivots, "ε_top", "", v.etop,
		t.pkn+" + ("+t.pkn+" - eps_bot) * ("+t.ultn+" - "+t.pkn+") / "+t.pkn,
		trace.A(t.pkn, t.epk), trace.A(t.ultn, t.eult), trace.A("eps_bot", t.ebq)))
}

// concreteSteps adds the steps of the concrete resultant and returns it and its lever arm.
func (t *circleTracer) concreteSteps(v *circleTrace) (fcQ, scQ trace.Q) {
	if t.c.Block == Rectangular {
		return t.rectSteps(v)
	}
	return t.parabolaSteps(v)
}

// rectSteps adds the rectangular block over the circular segment of depth d_c.
func (t *circleTracer) rectSteps(v *circleTrace) (fcQ, scQ trace.Q) {
	id, log, D := t.id, t.log, t.d
	lam := trace.Q{V: t.c.Concrete.Lambda, Symbol: "λ"}
	var dcStep trace.Step
	if !v.pivotC {
		dcStep = trace.Formula(id+"d_c", "Depth of the rectangular stress block λ·x, at most the diameter", clauseRect, "d_c", "mm", v.dc,
			"min(lambda * x, D)", trace.A("lambda", lam), trace.A("x", t.xq), trace.A("D", D))
	} else {
		dcStep = trace.Formula(id+"d_c", "Depth of the rectangular stress block min(λ·x, D), with x = D·ε_top/(ε_top − ε_bot)", clauseRect, "d_c", "mm", v.dc,
			"min(D * lambda * eps_top / max(eps_top - eps_bot, lambda * eps_top), D)",
			trace.A("D", D), trace.A("lambda", lam), trace.A("eps_top", t.etq), trace.A("eps_bot", t.ebq))
	}
	dcQ := log.Add(dcStep)
	sigQ := log.Add(trace.Formula(id+"sigma_cd", "Stress of the rectangular block, reduced because the compression zone of a circle narrows towards the extreme fibre",
		clauseRectNote, "σ_c,red", "MPa", v.sig, "k * eta * fcd",
		trace.A("k", trace.Const(BlockReduction, "k", "")), trace.A("eta", t.eta), trace.A("fcd", t.fcd)))
	cosQ := log.Add(trace.Formula(id+"cos_alpha", "Cosine of the half-angle α of the compressed segment", clauseCommon, "cos α", "", v.cosA,
		"1 - 2 * d_c / D", trace.A("d_c", dcQ), trace.A("D", D)))
	sinQ := log.Add(trace.Formula(id+"sin_alpha", "Sine of the half-angle α of the compressed segment", clauseCommon, "sin α", "", v.sinA,
		"2 * sqrt(d_c * (D - d_c)) / D", trace.A("d_c", dcQ), trace.A("D", D)))
	expr, _ := cosSeries(v.alpha)
	aQ := log.Add(trace.Solve(id+"alpha", "Half-angle of the compressed circular segment of depth d_c", clauseCommon, "α", "", v.alpha,
		methodAlpha, expr+" - cos_alpha", v.cosRes,
		trace.A("alpha", trace.Q{V: v.alpha, Symbol: "α", From: t.full("alpha")}), trace.A("cos_alpha", cosQ)).
		Note("α is in radians; the segment is the part of the circle within d_c of the extreme compressed fibre."))
	areaQ := log.Add(trace.Formula(id+"A_c", "Area of the compressed segment, R²·(α − sin α·cos α) with R = D/2", clauseCommon, "A_c", "mm2", v.area,
		"(D / 2) ** 2 * (alpha - sin_a * cos_a)", trace.A("D", D), trace.A("alpha", aQ), trace.A("sin_a", sinQ), trace.A("cos_a", cosQ)))
	momQ := log.Add(trace.Formula(id+"Q_c", "First moment of the segment about the centre along θ, (2/3)·R³·sin³α", clauseCommon, "Q_c", "mm3", v.moment,
		"2 / 3 * (D / 2) ** 3 * sin_a ** 3", trace.A("D", D), trace.A("sin_a", sinQ)))
	fcQ = log.Add(trace.Formula(id+"F_c", "Concrete compression resultant, the block's stress over the segment", clauseRect, "F_c", "N", v.fc,
		"sigma_cd * A_c", trace.A("sigma_cd", sigQ), trace.A("A_c", areaQ)))
	var sc trace.Step
	if v.area > 0 {
		sc = trace.Formula(id+"s_c", "Coordinate of F_c from the centre along θ (centroid of the segment)", clauseCommon, "s_c", "mm", v.sc,
			"Q_c / A_c", trace.A("Q_c", momQ), trace.A("A_c", areaQ))
	} else {
		sc = trace.Formula(id+"s_c", "Coordinate of F_c from the centre along θ (no compressed segment)", clauseCommon, "s_c", "mm", 0, "0")
	}
	return fcQ, log.Add(sc)
}

// parabolaSteps adds the parabola-rectangle block, integrated by quadrature.
func (t *circleTracer) parabolaSteps(v *circleTrace) (fcQ, scQ trace.Q) {
	id, log := t.id, t.log
	fcQ = log.Add(trace.Solve(id+"F_c", "Concrete compression resultant, parabola-rectangle block integrated over the compressed part of the circle", clausePR, "F_c", "N", v.fc,
		methodCircleGL, "F_c - F_c_check", v.fc-v.fcRef,
		trace.A("F_c", trace.Q{V: v.fc, Symbol: "F_c", Unit: "N", From: t.full("F_c")}),
		trace.A("F_c_check", trace.Const(v.fcRef, "F_c (40-point rule)", "N"))).
		Note("σ_c = f_cd·(1 − (1 − ε/" + t.epk.Symbol + ")^n) for 0 ≤ ε ≤ " + t.epk.Symbol + ", f_cd beyond, over chords 2·R·sin φ at depth R·(1 − cos φ); the integral has no closed form over a circle."))
	mcQ := log.Add(trace.Solve(id+"M_c", "Moment of the concrete stresses about the centre along θ", clausePR, "M_c", "Nmm", v.mc,
		methodCircleGL, "M_c - M_c_check", v.mc-v.mcRef,
		trace.A("M_c", trace.Q{V: v.mc, Symbol: "M_c", Unit: "Nmm", From: t.full("M_c")}),
		trace.A("M_c_check", trace.Const(v.mcRef, "M_c (40-point rule)", "Nmm"))))
	var sc trace.Step
	if v.fc > 0 {
		sc = trace.Formula(id+"s_c", "Coordinate of F_c from the centre along θ", clauseCommon, "s_c", "mm", v.sc,
			"M_c / F_c", trace.A("M_c", mcQ), trace.A("F_c", fcQ))
	} else {
		sc = trace.Formula(id+"s_c", "Coordinate of F_c from the centre along θ (no compressed concrete)", clauseCommon, "s_c", "mm", 0, "0")
	}
	return fcQ, log.Add(sc)
}

// sumSteps adds each bar's steps, N and M as sums and MRd = |M|, which it returns.
func (t *circleTracer) sumSteps(v *circleTrace, fcQ, scQ trace.Q) trace.Q {
	nexpr, margs := []string{"F_c"}, []trace.Arg{trace.A("F_c", fcQ), trace.A("s_c", scQ)}
	nargs := []trace.Arg{trace.A("F_c", fcQ)}
	mexpr := []string{"F_c * s_c"}
	for i := range v.bars {
		fQ, sQ := t.barSteps(v, i)
		fn, sn := barName("F_s", i), barName("s_s", i)
		nexpr, nargs = append(nexpr, fn), append(nargs, trace.A(fn, fQ))
		mexpr = append(mexpr, fn+" * "+sn)
		margs = append(margs, trace.A(fn, fQ), trace.A(sn, sQ))
	}
	t.log.Add(trace.Formula(t.id+"N_R", "Axial force of the stresses, compression positive", clausePlane, "N_R", "N", v.n,
		strings.Join(nexpr, " + "), nargs...))
	mQ := t.log.Add(trace.Formula(t.id+"M_R", "Moment of the stresses about the centre along θ", clausePlane, "M_R", "Nmm", v.m,
		strings.Join(mexpr, " + "), margs...).
		Note("Σ F·s, with s the coordinate along θ from the centre; positive when the compressed side resists the moment."))
	return t.log.Add(trace.Formula(t.id+"M_Rd", "Design moment of resistance in the direction θ at N_Ed", clausePlane, "M_Rd", "Nmm", v.mrd,
		"abs(M_R)", trace.A("M_R", mQ)))
}

// barSteps adds bar i's coordinate, strain, stresses and force and returns its force and
// coordinate.
func (t *circleTracer) barSteps(v *circleTrace, i int) (fQ, sQ trace.Q) {
	id, log, b, bt := t.id, t.log, t.st.Bars[i], v.bars[i]
	ny, nz := snapUnit(t.st.Theta)
	num := strconv.Itoa(i + 1)
	yq := trace.Q{V: b.Y, Symbol: barName("y_s", i), Unit: "mm"}
	zq := trace.Q{V: b.Z, Symbol: barName("z_s", i), Unit: "mm"}
	sQ = log.Add(trace.Formula(id+barName("s_s", i), "Coordinate of bar "+num+" along θ from the centre", clauseCommon, barName("s_s", i), "mm", bt.s,
		"y * n_y + z * n_z", trace.A("y", yq), trace.A("z", zq),
		trace.A("n_y", trace.Const(ny, "sin θ", "")), trace.A("n_z", trace.Const(nz, "cos θ", "")), trace.A("theta", t.theta)))
	depth := "(D / 2 - s)"
	var e trace.Step
	title := "Strain of bar " + num + " from the plane of strain"
	if !v.pivotC {
		e = trace.Formula(id+barName("eps_s", i), title, clausePlane, barName("ε_s", i), "", bt.eps,
			t.ultn+" * (x - "+depth+") / x", trace.A(t.ultn, t.eult), trace.A("x", t.xq), trace.A("D", t.d), trace.A("s", sQ))
	} else {
		e = trace.Formula(id+barName("eps_s", i), title, clausePlane, barName("ε_s", i), "", bt.eps,
			"eps_top - (eps_top - eps_bot) * "+depth+" / D", trace.A("eps_top", t.etq), trace.A("eps_bot", t.ebq), trace.A("D", t.d), trace.A("s", sQ))
	}
	eQ := log.Add(e)
	ss := trace.Formula(id+barName("sigma_s", i), "Steel stress in bar "+num+", Es·ε limited to ±f_yd", clauseSteel, barName("σ_s", i), "MPa", bt.ss,
		"max(-fyd, min(fyd, Es * eps))", trace.A("fyd", t.fyd), trace.A("Es", t.es), trace.A("eps", eQ))
	switch {
	case bt.ss == t.fyd.V && t.es.V*bt.eps >= t.fyd.V:
		ss = ss.Shown("fyd")
	case bt.ss == -t.fyd.V && t.es.V*bt.eps <= -t.fyd.V:
		ss = ss.Shown("-fyd")
	default:
		ss = ss.Shown("Es * eps")
	}
	ssQ := log.Add(ss)
	scQ := log.Add(t.displacedStep(bt, i, eQ))
	fQ = log.Add(trace.Formula(id+barName("F_s", i), "Force in bar "+num+", displaced concrete deducted", clauseCommon, barName("F_s", i), "N", bt.force,
		"A * (sigma_s - sigma_c)", trace.A("A", trace.Q{V: b.Area, Symbol: barName("A_s", i), Unit: "mm2"}),
		trace.A("sigma_s", ssQ), trace.A("sigma_c", scQ)))
	return fQ, sQ
}

// displacedStep returns the step of the stress of the concrete displaced by bar i.
func (t *circleTracer) displacedStep(bt circleBarTrace, i int, eQ trace.Q) trace.Step {
	id := t.id + barName("sigma_c", i)
	title := "Stress of the concrete displaced by bar " + strconv.Itoa(i+1)
	if t.c.Block == Rectangular {
		if bt.inBlock {
			return trace.Formula(id, title, clauseRect, barName("σ_c", i), "MPa", bt.sc, "sigma_cd",
				trace.A("sigma_cd", trace.Q{V: bt.sc, Symbol: "σ_c,red", Unit: "MPa", From: t.full("sigma_cd")})).
				Note("The bar lies within the stress block (its depth is less than d_c).")
		}
		return trace.Formula(id, title, clauseRect, barName("σ_c", i), "MPa", 0, "0").
			Note("The bar lies outside the stress block (its depth is at least d_c).")
	}
	s := trace.Formula(id, title, clausePR, barName("σ_c", i), "MPa", bt.sc,
		"fcd * (1 - (1 - min(max(eps, 0), "+t.pkn+") / "+t.pkn+") ** n)",
		trace.A("fcd", t.fcd), trace.A("eps", eQ), trace.A(t.pkn, t.epk), trace.A("n", t.n))
	switch {
	case bt.eps <= 0:
		return s.Shown("0").Note("The bar is not in compression: the concrete it displaces carries no stress.")
	case bt.eps >= t.epk.V:
		return s.Shown("fcd")
	}
	return s.Shown("fcd * (1 - (1 - eps / " + t.pkn + ") ** n)")
}
