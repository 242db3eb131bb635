package fire

import (
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// Column is what the fire checks need of one column and lift, as traced quantities in engine units.
type Column struct {
	B, H         trace.Q // section width along y and depth along z, mm
	Ac           trace.Q // concrete area, mm²
	Cover        trace.Q // nominal cover to the links, mm
	LinkDia      trace.Q // link diameter, mm
	Dia          trace.Q // main bar diameter, mm
	Bars         trace.Q // number of main bars
	As           trace.Q // area of the main bars, mm²
	L0Fi         trace.Q // effective length in fire, mm (the larger of the two axes)
	NEd          trace.Q // design axial force at normal temperature, N
	M0EdY, M0EdZ trace.Q // first-order design moments about y (lever arm along h) and z (along b), N·mm
	EMax         trace.Q // factor k of emax = k·h (or b); a zero value takes the recommended 0.15
	Omega        trace.Q // mechanical reinforcement ratio at normal temperature, for Eq. (5.7)
	AlphaCc      trace.Q // αcc of EN 1992-1-1 3.1.6(1), for Eq. (5.7)
}

// Utilisation records ηfi and μfi under IDs prefix+"eta_fi", "N_Ed_fi", "mu_fi": μfi = NEd,fi/NRd
// when the fire data ask for it and NRd > 0, otherwise μfi = ηfi; it returns μfi.
func Utilisation(l *trace.Log, prefix string, f model.Fire, nEd, nRd trace.Q) trace.Q {
	eta := l.Add(EtaFi(prefix+"eta_fi", f))
	if f.UseMuFi && nRd.V > 0 {
		nfi := l.Add(NEdFi(prefix+"N_Ed_fi", eta, nEd))
		return l.Add(MuFi(prefix+"mu_fi", nfi, nRd))
	}
	s := MuFiFromEta(prefix+"mu_fi", eta)
	if f.UseMuFi {
		s = s.Caution("μfi = NEd,fi/NRd was asked for but NRd is not known: μfi = ηfi is used.")
	}
	return l.Add(s)
}

// recorder adds steps to a log and remembers whether every condition was met and every check passed.
type recorder struct {
	l  *trace.Log
	ok bool
}

func (r *recorder) add(s trace.Step) trace.Q {
	if len(s.Cautions) > 0 || s.Verdict == trace.Fail {
		r.ok = false
	}
	return r.l.Add(s)
}

// governing returns the check of largest ratio among qs.
func governing(qs ...trace.Q) trace.Q {
	g := qs[0]
	for _, q := range qs[1:] {
		if q.V > g.V {
			g = q
		}
	}
	return g
}

// common records the conditions of 5.3.2(2) on the eccentricity and the steel, and the axis distance.
func common(r *recorder, prefix string, c Column) (a trace.Q) {
	k := c.EMax
	if k.V == 0 {
		k = trace.Const(EMaxFactor, "k_e", "")
	}
	for _, ax := range []struct {
		name string
		m    trace.Q
		dim  trace.Q
	}{{"y", c.M0EdY, c.H}, {"z", c.M0EdZ, c.B}} {
		e := r.add(Eccentricity(prefix+"e_"+ax.name, ax.m, c.NEd))
		eMax := r.add(EMax(prefix+"e_max_"+ax.name, k, ax.dim))
		r.add(EccentricityCondition(prefix+"cond_e_"+ax.name, e, eMax))
	}
	r.add(SteelCondition(prefix+"cond_As", c.As, c.Ac))
	return r.add(AxisDistance(prefix+"a", c.Cover, c.LinkDia, c.Dia))
}

// MethodA records the tabulated method of EN 1992-1-2:2004 5.3.2 for a column exposed on more
// than one side: its conditions, Table 5.2a at the rating and μfi, and the checks of width, axis
// distance and number of bars; ok is false when a condition is not met, the table does not cover
// the case or a check fails, and ratio is the governing check.
func MethodA(l *trace.Log, prefix string, rating int, muFi trace.Q, c Column) (ok bool, ratio trace.Q) {
	r := &recorder{l: l, ok: true}
	r.add(RatingInput(prefix+"R_req", rating))
	r.add(LengthCondition(prefix+"cond_l0", c.L0Fi))
	a := common(r, prefix, c)
	b := r.add(LeastWidth(prefix+"b", c.B, c.H))
	b1 := r.add(AlternativeWidth(prefix+"b_1", rating, 0, muFi))
	a1 := r.add(AlternativeAxis(prefix+"a_1", rating, 0, muFi))
	b2 := r.add(AlternativeWidth(prefix+"b_2", rating, 1, muFi))
	a2 := r.add(AlternativeAxis(prefix+"a_2", rating, 1, muFi))
	aReq := r.add(RequiredAxis(prefix+"a_req", b, b1, a1, b2, a2))
	cb := r.add(WidthCheck(prefix+"check_b", b1, b))
	ca := r.add(AxisCheck(prefix+"check_a", aReq, a))
	cn := r.add(MinBars(prefix+"check_bars", rating, muFi, b, c.Bars))
	return r.ok, governing(cb, ca, cn)
}

// MethodAEq57 records the fire resistance of Eq. (5.7) of EN 1992-1-2:2004 5.3.2 with its limits
// and the conditions of the method on eccentricity and steel, and the check against the rating;
// ok is false when a limit or condition is not met or the check fails, and ratio is the check.
func MethodAEq57(l *trace.Log, prefix string, rating int, muFi trace.Q, c Column) (ok bool, ratio trace.Q) {
	r := &recorder{l: l, ok: true}
	req := r.add(RatingInput(prefix+"R_req", rating))
	a := common(r, prefix, c)
	rEta := r.add(REta(prefix+"R_eta", muFi, c.Omega, c.AlphaCc))
	ra := r.add(RA(prefix+"R_a", a))
	rl := r.add(RL(prefix+"R_l", c.L0Fi))
	bEq := r.add(EquivalentWidth(prefix+"b_eq", c.Ac, c.B, c.H))
	rb := r.add(RB(prefix+"R_b", bEq))
	rn := r.add(RN(prefix+"R_n", c.Bars))
	r.add(AspectCondition(prefix+"cond_h", c.B, c.H))
	res := r.add(Eq57(prefix+"R", rEta, ra, rl, rb, rn))
	ratio = r.add(RatingCheck(prefix+"check_R", req, res))
	return r.ok, ratio
}

// MethodAValue returns what MethodA gives, without a trace.
func MethodAValue(rating int, mu float64, c Column) (ok bool, ratio float64) {
	ok, q := MethodA(&trace.Log{Trial: true}, "", rating, trace.Const(mu, "μ_fi", ""), c)
	return ok, q.V
}

// MethodAEq57Value returns what MethodAEq57 gives, without a trace.
func MethodAEq57Value(rating int, mu float64, c Column) (ok bool, ratio float64) {
	ok, q := MethodAEq57(&trace.Log{Trial: true}, "", rating, trace.Const(mu, "μ_fi", ""), c)
	return ok, q.V
}
