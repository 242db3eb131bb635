package fire

import (
	"math"

	"colsheet/calc/trace"
)

// AssessTrial records in the trial log l (trace.Log.Trial) the check steps that Assess keeps
// there, with the same IDs, titles, clauses, relations, ratios and verdicts, by the value
// functions of the step functions and without building any other step, and returns the same
// outcome without its reasons: for a candidate bar pattern that is tried, not shown. Only the
// values of c and muFi are read.
func AssessTrial(l *trace.Log, prefix string, rating int, muFi trace.Q, c Column) Outcome {
	var out Outcome
	// check records a check step and returns it as a condition; fixed applies where it fails.
	check := func(id, title, clause, relation string, ratio float64, fixed bool) cond {
		s := trace.Check(id, title, clause, relation, ratio, "")
		return cond{q: l.Add(s), ok: s.Verdict != trace.Fail, fixed: fixed}
	}
	a := AxisDistanceValue(c.Cover.V, c.LinkDia.V, c.Dia.V)
	out.Mesh = a >= MeshAxis

	hsc := check(prefix+"scope_fck", "Scope of the tabulated data of Section 5: concrete class not above C50/60", en2+"6", "f_ck ≤ 50 MPa", c.Fck.V/FckMax, true)
	if !hsc.ok {
		out.Fixed = true
		out.Checks = []Verdict{{ID: hsc.q.From, Fixed: true}}
		return out
	}

	k := c.EMax.V
	if k == 0 {
		k = EMaxFactor
	}
	common := []cond{
		check(prefix+"cond_e_y", "Scope of Method A: first-order eccentricity about y", en2+"5.3.2(2)", "e ≤ e_max", c.EY.V/math.Max(k*c.H.V, 1e-3), true),
		check(prefix+"cond_e_z", "Scope of Method A: first-order eccentricity about z", en2+"5.3.2(2)", "e ≤ e_max", c.EZ.V/math.Max(k*c.B.V, 1e-3), true),
		check(prefix+"cond_As", "Scope of Method A: amount of reinforcement", en2+"5.3.2(2)", "A_s < 0.04·A_c", c.As.V/(SteelMax*c.Ac.V), true),
	}
	if bad := failing(common...); len(bad) > 0 {
		out.Fixed = true
		for _, f := range bad {
			out.Checks = append(out.Checks, Verdict{ID: f.q.From, Fixed: true})
		}
		return out
	}

	// Table 5.2a within its scope.
	var tab route
	length := check(prefix+"cond_l0", "Scope of Table 5.2a: effective length in fire", en2+"5.3.2(2)", "l_0,fi ≤ 3 m", c.L0Fi.V/L0FiMax, true)
	var mu cond
	if last := ratings[len(ratings)-1]; rating > last {
		mu = check(prefix+"scope_mu", "Scope of Table 5.2a: rating within the table", en2+"5.3.2, Table 5.2a", "R_req ≤ R240",
			float64(rating)/float64(last), c.MuFixed)
	} else {
		mu = check(prefix+"scope_mu", "Scope of Table 5.2a: degree of utilisation within the table", en2+"5.3.2, Table 5.2a", "μ_fi ≤ μ_fi,max",
			muFi.V/MuMaxValue(rating), c.MuFixed)
	}
	tab.conds = []cond{length, mu}
	if tab.applies() {
		b := math.Min(c.B.V, c.H.V)
		if c.Circle {
			b = c.B.V
		}
		b1, a1 := AlternativeValue(rating, muFi.V, 0)
		b2, a2 := AlternativeValue(rating, muFi.V, 1)
		cb := l.Add(trace.Check(prefix+"check_b", "Least column width in fire", en2+"5.3.2, Table 5.2a", "b_min ≤ b", b1/b, ""))
		tab.checks = []trace.Q{cb,
			l.Add(trace.Check(prefix+"check_a", "Axis distance in fire", en2+"5.3.2, Table 5.2a", "a_req ≤ a", RequiredAxisValue(b, b1, a1, b2, a2)/a, "")),
			l.Add(trace.Check(prefix+"check_bars", "Number of bars in fire", en2+"5.3.2, Table 5.2a", "n_min ≤ n", float64(MinBarsValue(rating, muFi.V, b))/c.Bars.V, ""))}
		tab.steady = map[string]bool{cb.From: c.MuFixed}
		tab.passed = tab.governing() <= 1+1e-9
	}
	if tab.passed {
		out.OK, out.Route, out.Checks = true, RouteTable, append(verdictsOf(common), tab.verdicts(false)...)
		return out
	}

	// Eq. (5.7) of the same method, within its limits.
	p57 := prefix + "eq57/"
	var eq route
	bEq := c.B.V
	if !c.Circle {
		bEq = EquivalentWidthValue(c.Ac.V, c.B.V, c.H.V)
	}
	eq.conds = []cond{
		check(p57+"cond_l0", "Limit of Eq. (5.7): effective length in fire", en2+"5.3.2, Eq. (5.7)", "l_0,fi ≤ 6 m", c.L0Fi.V/L0FiMax57, true),
		check(p57+"cond_a", "Limit of Eq. (5.7): axis distance", en2+"5.3.2, Eq. (5.7)", "25 mm ≤ a", AxisMin57/math.Max(a, 1e-3), false),
		check(p57+"cond_b", "Limit of Eq. (5.7): equivalent width", en2+"5.3.2, Eq. (5.7)", "200 mm ≤ b'", WidthMin57/math.Max(bEq, 1e-3), true),
	}
	if !c.Circle {
		eq.conds = append(eq.conds, check(p57+"cond_h", "Limit of Eq. (5.7): proportion of the section", en2+"5.3.2, Eq. (5.7)", "h ≤ 1.5·b",
			max(c.B.V, c.H.V)/(Aspect57*min(c.B.V, c.H.V)), true))
	}
	if eq.applies() {
		r := Eq57Value(REtaValue(muFi.V, c.Omega.V, c.AlphaCc.V), RAValue(a), RLValue(c.L0Fi.V), RBValue(bEq), RNValue(c.Bars.V))
		eq.checks = []trace.Q{l.Add(trace.Check(p57+"check_R", "Fire resistance", en2+"5.3.2, Eq. (5.7)", "R_req ≤ R", float64(rating)/max(r, 1e-3), ""))}
		eq.passed = eq.governing() <= 1+1e-9
	}
	return out.settle(l, p57, common, tab, eq)
}
