package fire

import (
	"fmt"
	"strings"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// Column is what the fire checks need of one column and lift, as traced quantities in engine units.
type Column struct {
	B, H         trace.Q // section width along y and depth along z, mm; both the diameter of a circle
	Circle       bool    // a circular section of diameter B
	Ac           trace.Q // concrete area, mm²
	Fck          trace.Q // characteristic cylinder strength, MPa: Section 5 holds up to C50/60
	Cover        trace.Q // nominal cover to the links, mm
	LinkDia      trace.Q // link diameter, mm
	Dia          trace.Q // main bar diameter, mm
	Bars         trace.Q // number of main bars
	As           trace.Q // area of the main bars, mm²
	L0Fi         trace.Q // effective length in fire, mm (the larger of the two axes)
	NEd          trace.Q // design axial force at normal temperature, N
	M0EdY, M0EdZ trace.Q // first-order design moments about y (lever arm along h) and z (along b), N·mm
	EY, EZ       trace.Q // first-order eccentricities about y and z, as Eccentricities records them
	EMax         trace.Q // factor k of emax = k·h (or b); a zero value takes the recommended 0.15
	Omega        trace.Q // mechanical reinforcement ratio at normal temperature, for Eq. (5.7)
	AlphaCc      trace.Q // αcc of EN 1992-1-1 3.1.6(1), for Eq. (5.7)
	MuFixed      bool    // μfi does not depend on the bars (μfi = ηfi), so neither does the μfi limit of Table 5.2a
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
		s = s.Caution("μfi = NEd,fi/NRd was asked for but the column has no resistance at the eccentricity of NEd, or NEd is not a compression: μfi = ηfi is used.")
	}
	return l.Add(s)
}

// Eccentricities records the first-order eccentricities in fire e = M0Ed/NEd about y and z under
// IDs prefix+"e_y" and "e_z", EN 1992-1-2:2004 5.3.2(2), and returns them.
func Eccentricities(l *trace.Log, prefix string, c Column) (eY, eZ trace.Q) {
	eY = l.Add(Eccentricity(prefix+"e_y", c.M0EdY, c.NEd))
	eZ = l.Add(Eccentricity(prefix+"e_z", c.M0EdZ, c.NEd))
	return eY, eZ
}

// The parts of Method A that can show a rating.
const (
	RouteTable = "Method A, Table 5.2a"
	RouteEq57  = "Method A, Eq. (5.7)"
	// RouteElsewhere is a rating that the input says was verified by another method.
	RouteElsewhere = "verified elsewhere"
)

// Verdict names one check step that settles the fire verdict.
type Verdict struct {
	ID     string // the check step
	Reason string // where it fails, the reason to give, with values; empty for the usual wording
	Fixed  bool   // where it fails, no bar pattern can make it hold: more or other bars do not cure it
}

// Outcome is what Method A gives for one column and bar pattern.
type Outcome struct {
	OK     bool      // the rating is shown
	Route  string    // RouteTable or RouteEq57, the part that shows the rating; "" when none does
	Checks []Verdict // the checks that settle the verdict: those of the route shown or nearest to it
	Fixed  bool      // Method A does not apply for reasons that no bar pattern changes
	Mesh   bool      // a surface reinforcement is required against falling off of concrete, 4.5.2(2)
}

// cond is a condition of the scope of the method as recorded: its check, whether it holds, the
// reason to give where it does not, and whether bars could change it.
type cond struct {
	q      trace.Q
	ok     bool
	reason string
	fixed  bool
}

// scope records a condition of the method and returns it; reason and fixed apply where it fails.
func scope(l *trace.Log, s trace.Step, reason string, fixed bool) cond {
	return cond{q: l.Add(s), ok: s.Verdict != trace.Fail, reason: reason, fixed: fixed}
}

// failing returns the conditions of cs that do not hold.
func failing(cs ...cond) []cond {
	var out []cond
	for _, c := range cs {
		if !c.ok {
			out = append(out, c)
		}
	}
	return out
}

// worst returns the failed condition of largest ratio among cs (not empty).
func worst(cs []cond) cond {
	w := cs[0]
	for _, c := range cs[1:] {
		if c.q.V > w.q.V {
			w = c
		}
	}
	return w
}

// route is one part of Method A as recorded: its conditions and its checks.
type route struct {
	conds  []cond
	checks []trace.Q
	steady map[string]bool // checks whose ratio no bar pattern changes (the width of Table 5.2a at μfi = ηfi)
	passed bool            // every condition holds and every check passes
}

// applies reports whether every condition of the route holds.
func (r route) applies() bool { return len(failing(r.conds...)) == 0 }

// fixed reports whether the route fails for a reason that no bar pattern changes: a failed
// condition, or a failed check whose ratio does not depend on the bars.
func (r route) fixed() bool {
	for _, c := range failing(r.conds...) {
		if c.fixed {
			return true
		}
	}
	for _, q := range r.checks {
		if q.V > 1+1e-9 && r.steady[q.From] {
			return true
		}
	}
	return false
}

// governing returns the largest ratio among the route's checks.
func (r route) governing() float64 {
	g := 0.0
	for _, q := range r.checks {
		g = max(g, q.V)
	}
	return g
}

// verdicts returns the route's conditions and checks as verdicts with the usual wording; where
// the other part of the method cannot be brought to show the rating either (other), a check
// whose ratio no bar pattern changes is marked fixed.
func (r route) verdicts(other bool) []Verdict {
	var out []Verdict
	for _, c := range r.conds {
		out = append(out, Verdict{ID: c.q.From})
	}
	for _, q := range r.checks {
		out = append(out, Verdict{ID: q.From, Fixed: other && r.steady[q.From]})
	}
	return out
}

// notApplicable words the failed conditions as the reason of a failed design.
func notApplicable(cs []cond) string {
	parts := make([]string, len(cs))
	for i, c := range cs {
		parts[i] = c.reason
	}
	return "Method A not applicable: " + strings.Join(parts, "; ") + ". Verify the fire resistance another way and record it with fire: {method: elsewhere, note: ...}."
}

// Assess records Method A of EN 1992-1-2:2004 5.3.2 for a braced column exposed on more than one
// side: the rating asked, the axis distance and the surface reinforcement of 4.5.2(2), the scope
// (the concrete class, Section 6; e ≤ emax about each axis and As < 0.04·Ac, 5.3.2(2)), then
// Table 5.2a within its scope (l0,fi ≤ 3 m, μfi within the table) with its checks of width,
// axis distance and number of bars, and where the table does not show the rating, Eq. (5.7)
// within its limits and its check against the rating. c.EY and c.EZ must hold the recorded
// eccentricities (Eccentricities). Step IDs start with prefix; those of Eq. (5.7) with
// prefix+"eq57/".
//
// Where neither part applies the outcome's one verdict names every failed condition of the
// part nearest to applying, with its values, and its ratio is that of the worst of them, so
// that the utilisation comes from the conditions themselves; Fixed says whether bars could
// change that.
func Assess(l *trace.Log, prefix string, rating int, muFi trace.Q, c Column) Outcome {
	var out Outcome
	req := l.Add(RatingInput(prefix+"R_req", rating))
	a := l.Add(AxisDistance(prefix+"a", c.Cover, c.LinkDia, c.Dia))
	out.Mesh = l.Add(SurfaceMesh(prefix+"mesh", a)).V == 1

	// Section 6 for high-strength concrete: Method A is refused, not guessed.
	hsc := scope(l, ConcreteScope(prefix+"scope_fck", c.Fck),
		fmt.Sprintf("fck = %g MPa is above C50/60, and EN 1992-1-2 Section 6 applies to C55/67 and above: the tabulated Method A is not applied without the increases of the section and the axis distance that Section 6 asks for", c.Fck.V), true)
	if !hsc.ok {
		out.Fixed = true
		out.Checks = []Verdict{{ID: hsc.q.From, Reason: notApplicable([]cond{hsc}), Fixed: true}}
		return out
	}

	// The conditions of 5.3.2(2) that both parts share.
	k := c.EMax
	if k.V == 0 {
		k = trace.Const(EMaxFactor, "k_e", "")
	}
	var common []cond
	for _, ax := range []struct {
		name   string
		e, dim trace.Q
	}{{"y", c.EY, c.H}, {"z", c.EZ, c.B}} {
		eMax := l.Add(EMax(prefix+"e_max_"+ax.name, k, ax.dim))
		common = append(common, scope(l, EccentricityCondition(prefix+"cond_e_"+ax.name, ax.name, ax.e, eMax),
			fmt.Sprintf("e = %.1f mm > emax = %.1f mm about %s", ax.e.V, eMax.V, ax.name), true))
	}
	// More steel does not cure As ≥ 0.04·Ac, and the bar patterns come in order of area.
	common = append(common, scope(l, SteelCondition(prefix+"cond_As", c.As, c.Ac),
		fmt.Sprintf("As = %.0f mm² is not below 0.04·Ac = %.0f mm²", c.As.V, SteelMax*c.Ac.V), true))
	if bad := failing(common...); len(bad) > 0 {
		// Each failed condition counts, under one reason that names them all.
		out.Fixed = true
		for _, f := range bad {
			out.Checks = append(out.Checks, Verdict{ID: f.q.From, Reason: notApplicable(bad), Fixed: true})
		}
		return out
	}

	// Table 5.2a within its scope.
	var tab route
	tab.conds = []cond{
		scope(l, LengthCondition(prefix+"cond_l0", c.L0Fi), fmt.Sprintf("Table 5.2a needs l0,fi ≤ 3 m (l0,fi = %.2f m)", c.L0Fi.V/1000), true),
		scope(l, TableScope(prefix+"scope_mu", rating, muFi), fmt.Sprintf("Table 5.2a at R%d stops at μfi = %g (μfi = %.3f)", rating, MuMaxValue(rating), muFi.V), c.MuFixed),
	}
	if tab.applies() {
		var b trace.Q
		if c.Circle {
			b = l.Add(CircleWidth(prefix+"b", "Width of the circular column for Table 5.2a: its diameter", "5.3.2, Table 5.2a", "b", c.B))
		} else {
			b = l.Add(LeastWidth(prefix+"b", c.B, c.H))
		}
		b1 := l.Add(AlternativeWidth(prefix+"b_1", rating, 0, muFi))
		a1 := l.Add(AlternativeAxis(prefix+"a_1", rating, 0, muFi))
		b2 := l.Add(AlternativeWidth(prefix+"b_2", rating, 1, muFi))
		a2 := l.Add(AlternativeAxis(prefix+"a_2", rating, 1, muFi))
		aReq := l.Add(RequiredAxis(prefix+"a_req", b, b1, a1, b2, a2))
		cb := l.Add(WidthCheck(prefix+"check_b", b1, b))
		tab.checks = []trace.Q{cb, l.Add(AxisCheck(prefix+"check_a", aReq, a)), l.Add(MinBars(prefix+"check_bars", rating, muFi, b, c.Bars))}
		// The least width depends on μfi alone, and with μfi = ηfi not on the bars.
		tab.steady = map[string]bool{cb.From: c.MuFixed}
		tab.passed = tab.governing() <= 1+1e-9
	}
	if tab.passed {
		out.OK, out.Route, out.Checks = true, RouteTable, append(verdictsOf(common), tab.verdicts(false)...)
		return out
	}
	return out.settle(l, prefix+"eq57/", common, tab, eq57(l, prefix+"eq57/", req, a, muFi, c))
}

// eq57 records Eq. (5.7) of Method A within its limits, for the rating req, the axis distance a
// and μfi, under IDs that start with p57, and returns it as a route.
func eq57(l *trace.Log, p57 string, req, a, muFi trace.Q, c Column) route {
	var eq route
	var bEq trace.Q
	if c.Circle {
		bEq = l.Add(CircleWidth(p57+"b_eq", "Equivalent width of the circular section: its diameter", "5.3.2(3), Eq. (5.7)", "b'", c.B))
	} else {
		bEq = l.Add(EquivalentWidth(p57+"b_eq", c.Ac, c.B, c.H))
	}
	eq.conds = []cond{
		scope(l, L0FiCondition57(p57+"cond_l0", c.L0Fi), fmt.Sprintf("Eq. (5.7) needs l0,fi ≤ 6 m (l0,fi = %.2f m)", c.L0Fi.V/1000), true),
		scope(l, AxisCondition57(p57+"cond_a", a), fmt.Sprintf("Eq. (5.7) needs a ≥ 25 mm (a = %.1f mm)", a.V), false),
		scope(l, WidthCondition57(p57+"cond_b", bEq), fmt.Sprintf("Eq. (5.7) needs b' ≥ 200 mm (b' = %.1f mm)", bEq.V), true),
	}
	if !c.Circle {
		eq.conds = append(eq.conds, scope(l, AspectCondition(p57+"cond_h", c.B, c.H), fmt.Sprintf("Eq. (5.7) needs h ≤ 1.5·b (%.0f mm > 1.5 × %.0f mm)", max(c.B.V, c.H.V), min(c.B.V, c.H.V)), true))
	}
	if eq.applies() {
		rEta := l.Add(REta(p57+"R_eta", muFi, c.Omega, c.AlphaCc))
		ra := l.Add(RA(p57+"R_a", a))
		rl := l.Add(RL(p57+"R_l", c.L0Fi))
		rb := l.Add(RB(p57+"R_b", bEq))
		rn := l.Add(RN(p57+"R_n", c.Bars))
		res := l.Add(Eq57(p57+"R", rEta, ra, rl, rb, rn))
		eq.checks = []trace.Q{l.Add(RatingCheck(p57+"check_R", req, res))}
		eq.passed = eq.governing() <= 1+1e-9
	}
	return eq
}

// settle settles the outcome of Method A where Table 5.2a (tab) does not show the rating, with
// Eq. (5.7) (eq) recorded under IDs that start with p57 and the conditions common to both.
func (out Outcome) settle(l *trace.Log, p57 string, common []cond, tab, eq route) Outcome {
	if eq.passed {
		// The table's checks that fell short stay on the sheet for information, without a verdict.
		for _, q := range tab.checks {
			for i := len(l.Steps) - 1; i >= 0; i-- {
				if s := &l.Steps[i]; s.ID == q.From {
					s.Kind, s.Verdict, s.Relation = trace.KindFormula, "", ""
					s.Title += " (for information: Eq. (5.7) shows the rating)"
					break
				}
			}
		}
		if !l.Trial { // a trial keeps check steps only
			l.Add(trace.Input(p57+"route", "Fire resistance shown by Eq. (5.7), which the standard offers beside Table 5.2a (5.3.2(2))", trace.ClauseChosen+"Eq. (5.7) where Table 5.2a does not show the rating", "route", "", 57).
				Note("The steps of Table 5.2a above are for information; those of Eq. (5.7) govern."))
		}
		out.OK, out.Route, out.Checks = true, RouteEq57, append(verdictsOf(common), eq.verdicts(false)...)
		return out
	}

	// Neither part shows the rating.
	switch {
	case tab.applies() && eq.applies():
		// Both apply and fall short: the nearer settles the verdict.
		near, other := tab, eq
		if eq.governing() < tab.governing() {
			near, other = eq, tab
		}
		out.Checks = near.verdicts(other.fixed())
		out.Fixed = tab.fixed() && eq.fixed()
	case tab.applies():
		out.Checks = tab.verdicts(eq.fixed())
		out.Fixed = tab.fixed() && eq.fixed()
	case eq.applies():
		out.Checks = eq.verdicts(tab.fixed())
		out.Fixed = tab.fixed() && eq.fixed()
	default:
		// Method A does not apply: the part nearer to applying gives the ratio, and the reason names
		// the failed conditions of both.
		tb, eb := failing(tab.conds...), failing(eq.conds...)
		near := worst(tb)
		if w := worst(eb); w.q.V < near.q.V {
			near = w
		}
		out.Fixed = tab.fixed() && eq.fixed()
		out.Checks = []Verdict{{ID: near.q.From, Reason: notApplicable(append(tb, eb...)), Fixed: out.Fixed}}
	}
	return out
}

// verdictsOf returns conditions as verdicts with the usual wording (they hold).
func verdictsOf(cs []cond) []Verdict {
	out := make([]Verdict, len(cs))
	for i, c := range cs {
		out[i] = Verdict{ID: c.q.From}
	}
	return out
}

// Elsewhere records a rating verified by another method outside this calculation, as given: the
// rating, the method with the note, and a caution that the verification lies outside this
// calculation; no check of Method A. The axis distance and the surface reinforcement of
// 4.5.2(2), which hold whatever the method, are recorded too, and a caution against spalling for
// high-strength concrete (6.2). It returns whether the surface reinforcement is required.
func Elsewhere(l *trace.Log, prefix string, rating int, note string, c Column) (mesh bool) {
	l.Add(RatingInput(prefix+"R_req", rating))
	s := trace.Input(prefix+"method", "Fire resistance verified by another method (verified elsewhere)", "input", "R_verified", "min", float64(rating)).
		Note("As given: " + note).
		Caution("The fire resistance is verified outside this calculation: this sheet records the rating, the method and the note as given, and makes no check of EN 1992-1-2 Method A. Keep that verification with the calculations.")
	if c.Fck.V > FckMax {
		s = s.Caution("High-strength concrete: EN 1992-1-2 6.2 sets rules against explosive spalling; the verification elsewhere must cover them.")
	}
	l.Add(s)
	a := l.Add(AxisDistance(prefix+"a", c.Cover, c.LinkDia, c.Dia))
	return l.Add(SurfaceMesh(prefix+"mesh", a)).V == 1
}
