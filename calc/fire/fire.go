// Package fire holds the fire resistance of braced columns by EN 1992-1-2:2004 5.3.2, Method A:
// the degree of utilisation μfi, the conditions of the method, Table 5.2a for columns exposed on
// more than one side (interpolated linearly between its μfi columns and between the alternatives
// of a row), the axis distance and the checks, and the resistance R of Eq. (5.7).
//
// Every step function takes traced quantities and returns one trace step whose value its
// expression reproduces; the value functions hold the same formulas untraced.
package fire

import (
	"fmt"
	"math"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

const en2 = "EN 1992-1-2:2004 "

const notApply = "Method A does not apply."

// scopeNote is the note of every check of the scope of Method A.
const scopeNote = "A condition of the scope of the method, not a resistance: where it does not hold, Method A does not apply."

// EtaFi returns the reduction factor ηfi for the design load in fire, the given value or the
// recommended 0.7, EN 1992-1-2:2004 2.4.2(3).
func EtaFi(id string, f model.Fire) trace.Step {
	if f.EtaFi == 0 {
		return trace.Input(id, "Reduction factor for the design load in fire", en2+"2.4.2(3)", "η_fi", "", EtaFiDefault).
			Note("Recommended simplified value.")
	}
	return trace.Input(id, "Reduction factor for the design load in fire", "input", "η_fi", "", f.EtaFi)
}

// NEdFi returns the design axial force in fire NEd,fi = ηfi·NEd, EN 1992-1-2:2004 2.4.2, Eq. (2.4).
func NEdFi(id string, etaFi, nEd trace.Q) trace.Step {
	return trace.Formula(id, "Design axial force in fire", en2+"2.4.2, Eq. (2.4)", "N_Ed,fi", "N",
		etaFi.V*nEd.V, "eta_fi * N_Ed", trace.A("eta_fi", etaFi), trace.A("N_Ed", nEd))
}

// MuFi returns the degree of utilisation in fire μfi = NEd,fi/NRd, EN 1992-1-2:2004 5.3.2(3).
func MuFi(id string, nEdFi, nRd trace.Q) trace.Step {
	return trace.Formula(id, "Degree of utilisation in fire", en2+"5.3.2(3)", "μ_fi", "", nEdFi.V/nRd.V,
		"N_Ed_fi / N_Rd", trace.A("N_Ed_fi", nEdFi), trace.A("N_Rd", nRd)).
		Note("NRd is the design resistance of the column at normal temperature (EN 1992-1-1) at the eccentricity of NEd, second-order effects and imperfections included (see its step).")
}

// Ratios are the resistance checks of a column at normal temperature under a trial axial force
// N whose first-order and imperfection eccentricities are those of NEd: what NRdAtEccentricity
// asks of the column at each trial.
type Ratios struct {
	N, NRdMax              float64 // the trial axial force and the resistance to pure compression, N
	MEdY, MRdY, MEdZ, MRdZ float64 // design moments (second order included) and resistances at N, N·mm
	Biaxial                float64 // ratio of the biaxial check where EN 1992-1-1 5.8.9 asks for it, else 0
	OK                     bool    // the section has a moment resistance about both axes at N
}

// Ratio returns the largest ratio of action to resistance of the checks; +Inf where the section
// has no moment resistance at N.
func (r Ratios) Ratio() float64 {
	if !r.OK || !(r.MRdY > 0) || !(r.MRdZ > 0) || !(r.NRdMax > 0) {
		return math.Inf(1)
	}
	return math.Max(math.Max(r.N/r.NRdMax, r.Biaxial), math.Max(r.MEdY/r.MRdY, r.MEdZ/r.MRdZ))
}

// Scan steps and tolerance of NRdAtEccentricity.
const (
	nRdScan = 16   // steps of the scan from 0 to NRd,max for the first failing force
	nRdTol  = 1e-7 // bracket width at which the bisection stops, relative to NRd,max
)

// NRdAtEccentricity returns the design resistance of the column at normal temperature NRd of
// μfi, with second-order effects and an initial eccentricity equal to that of NEd,fi (that of
// NEd), EN 1992-1-2:2004 5.3.2(3): the largest axial force N at which every resistance check of
// the column holds (at returns them at N, the first-order moments and the imperfection scaled
// with N so that their eccentricities eY and eZ are held), found by a scan and bisection on N
// between 0 and NRd,max. The value lies on the safe side of the root (the ratio at it is not
// above 1, the residual ratio − 1 not above 0).
func NRdAtEccentricity(id string, nRdMax, eY, eZ trace.Q, at func(n float64) Ratios) trace.Step {
	const title = "Resistance of the column at normal temperature at the eccentricity of N_Ed"
	method := fmt.Sprintf("scan of N from 0 to N_Rd,max in %d steps for the first force that fails a check, then bisection to %g·N_Rd,max; "+
		"at each N the checks about y and z (second order at N) and the biaxial check where 5.8.9 asks for it, the first-order and imperfection eccentricities held", nRdScan, nRdTol)
	lo, hi := 0.0, nRdMax.V
	var rlo Ratios
	for i := 1; i <= nRdScan; i++ {
		n := nRdMax.V * float64(i) / nRdScan
		if r := at(n); r.Ratio() > 1 {
			hi = n
			break
		} else {
			lo, rlo = n, r
		}
	}
	for hi-lo > nRdTol*nRdMax.V {
		mid := (lo + hi) / 2
		if r := at(mid); r.Ratio() <= 1 {
			lo, rlo = mid, r
		} else {
			hi = mid
		}
	}
	ecc := []trace.Arg{trace.A("e_y", eY), trace.A("e_z", eZ)}
	if lo == 0 {
		return trace.Solve(id, title, en2+"5.3.2(3)", "N_Rd", "N", 0, method, "N_Rd", 0,
			append([]trace.Arg{trace.A("N_Rd", trace.Const(0, "N_Rd", "N")), trace.A("N_Rd_max", nRdMax)}, ecc...)...).
			Caution("No axial force at the eccentricity of NEd passes the resistance checks of the column at normal temperature.")
	}
	q := func(v float64, sym, unit string) trace.Q { return trace.Const(v, sym, unit) }
	args := append([]trace.Arg{trace.A("N_Rd", q(lo, "N_Rd", "N")), trace.A("N_Rd_max", nRdMax),
		trace.A("M_Ed_y", q(rlo.MEdY, "M_Ed,y(N_Rd)", "Nmm")), trace.A("M_Rd_y", q(rlo.MRdY, "M_Rd,y(N_Rd)", "Nmm")),
		trace.A("M_Ed_z", q(rlo.MEdZ, "M_Ed,z(N_Rd)", "Nmm")), trace.A("M_Rd_z", q(rlo.MRdZ, "M_Rd,z(N_Rd)", "Nmm")),
		trace.A("r_b", q(rlo.Biaxial, "biaxial ratio(N_Rd)", ""))}, ecc...)
	return trace.Solve(id, title, en2+"5.3.2(3)", "N_Rd", "N", lo, method,
		"max(N_Rd / N_Rd_max, M_Ed_y / M_Rd_y, M_Ed_z / M_Rd_z, r_b) - 1", rlo.Ratio()-1, args...).
		Note("NRd of μfi is the design resistance of the column at normal temperature by EN 1992-1-1, with second-order effects and an initial eccentricity equal to that of NEd,fi, taken as that of NEd (5.3.2(3)): at each trial N the first-order end moments and the imperfection grow with N (e_y and e_z held), the minimum eccentricity and second-order effects are those at N.").
		Note("Both axes and the biaxial check are applied together, so NRd is the smaller of the resistances about y and z, and not above that of the biaxial check: the conservative choice, which gives the larger μfi.")
}

// MuFiFromEta returns μfi = ηfi, the simplification that assumes full utilisation at normal
// temperature, EN 1992-1-2:2004 5.3.2(3), note.
func MuFiFromEta(id string, etaFi trace.Q) trace.Step {
	return trace.Formula(id, "Degree of utilisation in fire (taken as ηfi)", en2+"5.3.2(3), note", "μ_fi", "",
		etaFi.V, "eta_fi", trace.A("eta_fi", etaFi)).
		Note("μfi = ηfi assumes full utilisation at normal temperature and is on the safe side.")
}

// condition returns the check of a condition of the scope of Method A with its ratio, noting
// that it is a condition of the method and cautioning that the method does not apply where it
// does not hold.
func condition(id, title, clause, relation string, ratio float64, expr string, args ...trace.Arg) trace.Step {
	s := trace.Check(id, title, clause, relation, ratio, expr, args...).Note(scopeNote)
	if s.Verdict == trace.Fail {
		s = s.Caution("Condition not met: " + notApply)
	}
	return s
}

// LengthCondition returns the check of the effective length in fire l0,fi ≤ 3 m of Table 5.2a,
// ratio l0,fi/3 m, EN 1992-1-2:2004 5.3.2(2).
func LengthCondition(id string, l0fi trace.Q) trace.Step {
	return condition(id, "Scope of Table 5.2a: effective length in fire", en2+"5.3.2(2)", "l_0,fi ≤ 3 m",
		l0fi.V/L0FiMax, "l0_fi / 3000", trace.A("l0_fi", l0fi))
}

// ConcreteScope returns the check that the concrete is not a high-strength class, fck ≤ 50 MPa,
// ratio fck/50 MPa: for C55/67 and above EN 1992-1-2:2004 Section 6 applies, whose increases of
// the section and axis distance for the tabulated data are not applied here, so Method A is
// refused for them.
func ConcreteScope(id string, fck trace.Q) trace.Step {
	s := condition(id, "Scope of the tabulated data of Section 5: concrete class not above C50/60", en2+"6", "f_ck ≤ 50 MPa",
		fck.V/FckMax, "f_ck / 50", trace.A("f_ck", fck))
	if s.Verdict == trace.Fail {
		s = s.Caution("EN 1992-1-2 Section 6 applies to C55/67 and above: the tabulated Method A is not applied here without the increases of the section and the axis distance that Section 6 asks for; verify the fire resistance another way.").
			Caution("High-strength concrete: EN 1992-1-2 6.2 sets rules against explosive spalling (for the highest classes, measures such as a mesh, a protective layer or polypropylene fibres); state them in the specification.")
	}
	return s
}

// L0FiCondition57 returns the check of the effective length in fire l0,fi ≤ 6 m of Eq. (5.7),
// ratio l0,fi/6 m, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func L0FiCondition57(id string, l0fi trace.Q) trace.Step {
	return condition(id, "Limit of Eq. (5.7): effective length in fire", en2+"5.3.2, Eq. (5.7)", "l_0,fi ≤ 6 m",
		l0fi.V/L0FiMax57, "l0_fi / 6000", trace.A("l0_fi", l0fi))
}

// AxisCondition57 returns the check of the axis distance a ≥ 25 mm of Eq. (5.7), ratio 25 mm/a,
// EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func AxisCondition57(id string, a trace.Q) trace.Step {
	s := condition(id, "Limit of Eq. (5.7): axis distance", en2+"5.3.2, Eq. (5.7)", "25 mm ≤ a",
		AxisMin57/math.Max(a.V, 1e-3), "25 / max(a, 0.001)", trace.A("a", a))
	if a.V >= 1e-3 {
		return s.Shown("25 / a")
	}
	return s
}

// WidthCondition57 returns the check of the equivalent width b′ ≥ 200 mm of Eq. (5.7), ratio
// 200 mm/b′, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func WidthCondition57(id string, bEq trace.Q) trace.Step {
	s := condition(id, "Limit of Eq. (5.7): equivalent width", en2+"5.3.2, Eq. (5.7)", "200 mm ≤ b'",
		WidthMin57/math.Max(bEq.V, 1e-3), "200 / max(b_eq, 0.001)", trace.A("b_eq", bEq))
	if bEq.V >= 1e-3 {
		return s.Shown("200 / b_eq")
	}
	return s
}

// TableScope returns the check that Table 5.2a gives values at the rating and μfi: μfi not above
// the last column of the rating's row (0.7; 0.5 at R240, beyond which the table asks for a width
// above 600 mm and a particular assessment of buckling), ratio μfi/μfi,max; a rating above R240
// has ratio R/240. EN 1992-1-2:2004 5.3.2, Table 5.2a.
func TableScope(id string, rating int, muFi trace.Q) trace.Step {
	if rating > ratings[len(ratings)-1] {
		r := trace.Const(float64(rating), "R_req", "min")
		return condition(id, "Scope of Table 5.2a: rating within the table", en2+"5.3.2, Table 5.2a", "R_req ≤ R240",
			r.V/float64(ratings[len(ratings)-1]), "R_req / 240", trace.A("R_req", r))
	}
	mx := MuMaxValue(rating)
	s := condition(id, "Scope of Table 5.2a: degree of utilisation within the table", en2+"5.3.2, Table 5.2a", "μ_fi ≤ μ_fi,max",
		muFi.V/mx, "mu_fi / mu_max", trace.A("mu_fi", muFi), trace.A("mu_max", trace.Const(mx, "μ_fi,max", "")))
	return s.WithRow(fmt.Sprintf("R%d (exposed on more than one side)", ratings[locate(rating, 0).row]))
}

// SurfaceMesh returns 1 where the axis distance a is 70 mm or more, so that a surface
// reinforcement is required against falling off of concrete, and 0 otherwise,
// EN 1992-1-2:2004 4.5.2(2).
func SurfaceMesh(id string, a trace.Q) trace.Step {
	need := a.V >= MeshAxis
	s := trace.Formula(id, "Surface reinforcement against falling off of concrete required", en2+"4.5.2(2)", "mesh", "",
		boolNum(need), "a >= 70 ? 1 : 0", trace.A("a", a)).Condition("a >= 70")
	if need {
		s = s.Note("Axis distance 70 mm or more: a surface reinforcement mesh is required in the cover, with a spacing not above 100 mm and bars not below 4 mm, unless tests show that the concrete does not fall off. A detailing requirement for the drawings.")
	}
	return s
}

// EMax returns the greatest first-order eccentricity of the method emax = k·h (or b), k = 0.15
// recommended, EN 1992-1-2:2004 5.3.2(2), note.
func EMax(id string, k, dim trace.Q) trace.Step {
	return trace.Formula(id, "Greatest first-order eccentricity for Table 5.2a", en2+"5.3.2(2), note", "e_max", "mm",
		k.V*dim.V, "k * h", trace.A("k", k), trace.A("h", dim))
}

// Eccentricity returns the first-order eccentricity e = M0Ed/NEd, equal in fire and at normal
// temperature since Efi,d = ηfi·Ed scales both alike, EN 1992-1-2:2004 5.3.2(2) and 2.4.2.
func Eccentricity(id string, m, n trace.Q) trace.Step {
	s := trace.Formula(id, "First-order eccentricity in fire", en2+"5.3.2(2); 2.4.2", "e", "mm",
		EccentricityValue(m.V, n.V), "abs(M) / max(N, 1)", trace.A("M", m), trace.A("N", n))
	if n.V >= 1 {
		return s.Shown("abs(M) / N")
	}
	return s.Shown("abs(M) / 1").Note("No axial compression: N is taken as 1 N so that the eccentricity is finite; it exceeds any limit of the method.")
}

// EccentricityCondition returns the check of the first-order eccentricity in fire e ≤ emax
// about axis n, ratio e/emax, EN 1992-1-2:2004 5.3.2(2).
func EccentricityCondition(id, n string, e, eMax trace.Q) trace.Step {
	s := condition(id, "Scope of Method A: first-order eccentricity about "+n, en2+"5.3.2(2)", "e ≤ e_max",
		e.V/math.Max(eMax.V, 1e-3), "e / max(e_max, 0.001)", trace.A("e", e), trace.A("e_max", eMax))
	if eMax.V >= 1e-3 {
		return s.Shown("e / e_max")
	}
	return s
}

// SteelCondition returns the check of the steel As < 0.04·Ac, ratio As/(0.04·Ac),
// EN 1992-1-2:2004 5.3.2(2).
func SteelCondition(id string, as, ac trace.Q) trace.Step {
	return condition(id, "Scope of Method A: amount of reinforcement", en2+"5.3.2(2)", "A_s < 0.04·A_c",
		as.V/(SteelMax*ac.V), "A_s / (0.04 * A_c)", trace.A("A_s", as), trace.A("A_c", ac))
}

// LeastWidth returns the least dimension of the section, the width b of Table 5.2a, EN 1992-1-2:2004 5.3.2, Table 5.2a.
func LeastWidth(id string, b, h trace.Q) trace.Step {
	return trace.Formula(id, "Least dimension of the column", en2+"5.3.2, Table 5.2a", "b", "mm",
		min(b.V, h.V), "min(b, h)", trace.A("b", b), trace.A("h", h))
}

// CircleWidth returns the width of a circular column that EN 1992-1-2:2004 5.3.2 takes: its
// diameter, for bmin of Table 5.2a and for b' of Eq. (5.7) ("the diameter for circular sections").
func CircleWidth(id, title, clause, symbol string, d trace.Q) trace.Step {
	return trace.Formula(id, title, en2+clause, symbol, "mm", d.V, "D", trace.A("D", d))
}

// AxisDistance returns the axis distance of the main bars a = c + φt + φ/2 with c the cover to
// the links, EN 1992-1-2:2004 Figure 5.2.
func AxisDistance(id string, cover, link, dia trace.Q) trace.Step {
	return trace.Formula(id, "Axis distance of the main bars", en2+"Fig. 5.2", "a", "mm",
		AxisDistanceValue(cover.V, link.V, dia.V), "c + phi_t + phi / 2",
		trace.A("c", cover), trace.A("phi_t", link), trace.A("phi", dia))
}

// AlternativeWidth returns the column width of the i-th alternative (0 or 1) of the rating's row
// of Table 5.2a at μfi, interpolated linearly between the μfi columns (the first is bmin),
// EN 1992-1-2:2004 5.3.2, Table 5.2a.
func AlternativeWidth(id string, rating, i int, muFi trace.Q) trace.Step {
	b, _ := AlternativeValue(rating, muFi.V, i)
	return alternative(id, fmt.Sprintf("Column width of Table 5.2a, alternative %d", i+1), "b_min", rating, i, muFi, b,
		func(x alt) float64 { return x.b })
}

// AlternativeAxis returns the axis distance of the i-th alternative (0 or 1) of the rating's row
// of Table 5.2a at μfi, interpolated linearly between the μfi columns, EN 1992-1-2:2004 5.3.2, Table 5.2a.
func AlternativeAxis(id string, rating, i int, muFi trace.Q) trace.Step {
	_, a := AlternativeValue(rating, muFi.V, i)
	return alternative(id, fmt.Sprintf("Axis distance of Table 5.2a, alternative %d", i+1), "a_min", rating, i, muFi, a,
		func(x alt) float64 { return x.a })
}

func alternative(id, title, symbol string, rating, i int, muFi trace.Q, v float64, of func(alt) float64) trace.Step {
	lk := locate(rating, muFi.V)
	x1, x2 := lk.ends(i)
	mu1, mu2 := muColumns[lk.k1], muColumns[lk.k2]
	sym := fmt.Sprintf("%s,%d", symbol, i+1)
	s := trace.Formula(id, title, en2+"5.3.2, Table 5.2a", sym, "mm", v,
		"x_1 + (x_2 - x_1) * min(max((mu - mu_1) / (mu_2 - mu_1), 0), 1)",
		trace.A("x_1", trace.Const(of(x1), fmt.Sprintf("%s(μfi=%g)", sym, mu1), "mm")),
		trace.A("x_2", trace.Const(of(x2), fmt.Sprintf("%s(μfi=%g)", sym, mu2), "mm")),
		trace.A("mu", muFi),
		trace.A("mu_1", trace.Const(mu1, "μ_fi,1", "")),
		trace.A("mu_2", trace.Const(mu2, "μ_fi,2", "")))
	s = s.WithRow(fmt.Sprintf("R%d, columns μfi = %g and %g (exposed on more than one side)", ratings[lk.row], mu1, mu2))
	switch {
	case lk.t <= 0:
		s = s.Shown("x_1")
	case lk.t >= 1:
		s = s.Shown("x_2")
	default:
		s = s.Shown("x_1 + (x_2 - x_1) * (mu - mu_1) / (mu_2 - mu_1)").
			Note("Linear interpolation between the μfi columns, as 5.3.2 permits.")
	}
	if lk.belowMin {
		s = s.Note("μfi is below the first column of the table: that column is used.")
	}
	if !lk.exact && lk.covered {
		s = s.Note("The required rating is not a row of Table 5.2a: the next higher row is used.")
	}
	if r := table52a[lk.row]; i > 0 && (len(r[lk.k1]) == 1 || len(r[lk.k2]) == 1) {
		s = s.Note("Where a column of the row gives one alternative, it serves as both.")
	}
	if !lk.covered {
		s = s.Caution(uncovered(rating, muFi.V))
	}
	return s
}

func uncovered(rating int, mu float64) string {
	switch {
	case rating > ratings[len(ratings)-1]:
		return "Ratings above R240 are outside Table 5.2a: " + notApply
	case mu > muColumns[2]:
		return "μfi above 0.7 is outside Table 5.2a: " + notApply
	}
	return "At this rating and μfi Table 5.2a asks for a width above 600 mm and a particular assessment of buckling: " + notApply
}

// RequiredAxis returns the axis distance needed at the least width b, interpolated linearly
// between the two alternatives (b1, a1) and (b2, a2) of the row and constant outside them,
// EN 1992-1-2:2004 5.3.2, Table 5.2a.
func RequiredAxis(id string, b, b1, a1, b2, a2 trace.Q) trace.Step {
	s := trace.Formula(id, "Axis distance required at the column's width", en2+"5.3.2, Table 5.2a", "a_req", "mm",
		RequiredAxisValue(b.V, b1.V, a1.V, b2.V, a2.V),
		"a_1 + (a_2 - a_1) * min(max((b - b_1) / max(b_2 - b_1, 0.001), 0), 1)",
		trace.A("b", b), trace.A("b_1", b1), trace.A("a_1", a1), trace.A("b_2", b2), trace.A("a_2", a2))
	switch {
	case b.V <= b1.V:
		return s.Shown("a_1")
	case b.V >= b2.V:
		return s.Shown("a_2")
	}
	return s.Shown("a_1 + (a_2 - a_1) * (b - b_1) / (b_2 - b_1)").Note("Linear interpolation between the alternatives of the row.")
}

// WidthCheck returns the check b ≥ bmin, ratio bmin/b, EN 1992-1-2:2004 5.3.2, Table 5.2a.
func WidthCheck(id string, bMin, b trace.Q) trace.Step {
	return trace.Check(id, "Least column width in fire", en2+"5.3.2, Table 5.2a", "b_min ≤ b",
		bMin.V/b.V, "b_min / b", trace.A("b_min", bMin), trace.A("b", b))
}

// AxisCheck returns the check a ≥ a_req, ratio a_req/a, EN 1992-1-2:2004 5.3.2, Table 5.2a.
func AxisCheck(id string, aReq, a trace.Q) trace.Step {
	return trace.Check(id, "Axis distance in fire", en2+"5.3.2, Table 5.2a", "a_req ≤ a",
		aReq.V/a.V, "a_req / a", trace.A("a_req", aReq), trace.A("a", a))
}

// MinBars returns the check of the number of bars against the 8 that Table 5.2a asks for where an
// alternative used carries its double asterisk (4 otherwise), EN 1992-1-2:2004 5.3.2, Table 5.2a.
func MinBars(id string, rating int, muFi, b, n trace.Q) trace.Step {
	need := float64(MinBarsValue(rating, muFi.V, b.V))
	s := trace.Check(id, "Number of bars in fire", en2+"5.3.2, Table 5.2a", "n_min ≤ n",
		need/n.V, "n_min / n", trace.A("n_min", trace.Const(need, "n_min", "")), trace.A("n", n))
	if need == 8 {
		s = s.Note("The table's entry carries the double asterisk: at least 8 bars.")
	}
	return s
}

// RatingInput returns the required standard fire resistance R in minutes.
func RatingInput(id string, rating int) trace.Step {
	return trace.Input(id, "Required standard fire resistance", "input", "R_req", "min", float64(rating))
}

// REta returns Rηfi = 83·(1 − μfi·(1 + ω)/(0.85/αcc + ω)), EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func REta(id string, muFi, omega, alphaCc trace.Q) trace.Step {
	return trace.Formula(id, "Term for the load level", en2+"5.3.2, Eq. (5.7)", "R_ηfi", "min",
		REtaValue(muFi.V, omega.V, alphaCc.V), "83 * (1 - mu_fi * (1 + omega) / (0.85 / alpha_cc + omega))",
		trace.A("mu_fi", muFi), trace.A("omega", omega), trace.A("alpha_cc", alphaCc))
}

// limits adds to a term of Eq. (5.7) a note where its variable v lies beyond the limit that is
// used on the safe side (above hi, or below lo when safeBelow); the other limit is a condition of
// the equation, checked on its own (L0FiCondition57, AxisCondition57, WidthCondition57).
func limits(s trace.Step, v, lo, hi float64, safeBelow bool, what string) trace.Step {
	safe := v > hi
	if safeBelow {
		safe = v < lo
	}
	if safe {
		s = s.Note("The " + what + " is outside the limits of Eq. (5.7): the limit is used, on the safe side.")
	}
	return s
}

// RA returns Ra = 1.60·(a − 30) for 25 ≤ a ≤ 80 mm, a above 80 mm taken as 80 (safe),
// EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func RA(id string, a trace.Q) trace.Step {
	return limits(trace.Formula(id, "Term for the axis distance", en2+"5.3.2, Eq. (5.7)", "R_a", "min",
		RAValue(a.V), "1.6 * (min(a, 80) - 30)", trace.A("a", a)), a.V, AxisMin57, AxisMax57, false, "axis distance")
}

// RL returns Rl = 9.60·(5 − l0,fi) with l0,fi in m for 2 ≤ l0,fi ≤ 6 m, below 2 m taken as 2 m
// (safe, as the standard states), EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func RL(id string, l0fi trace.Q) trace.Step {
	return limits(trace.Formula(id, "Term for the effective length", en2+"5.3.2, Eq. (5.7)", "R_l", "min",
		RLValue(l0fi.V), "9.6 * (5 - max(l0_fi, 2000) / 1000)", trace.A("l0_fi", l0fi)),
		l0fi.V, L0FiMin57, L0FiMax57, true, "effective length in fire")
}

// EquivalentWidth returns b′ = 2·Ac/(b + h) of a rectangular section, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func EquivalentWidth(id string, ac, b, h trace.Q) trace.Step {
	return trace.Formula(id, "Equivalent width of the section", en2+"5.3.2, Eq. (5.7)", "b'", "mm",
		EquivalentWidthValue(ac.V, b.V, h.V), "2 * A_c / (b + h)", trace.A("A_c", ac), trace.A("b", b), trace.A("h", h))
}

// RB returns Rb = 0.09·b′ for 200 ≤ b′ ≤ 450 mm, b′ above 450 mm taken as 450 (safe),
// EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func RB(id string, bEq trace.Q) trace.Step {
	return limits(trace.Formula(id, "Term for the section size", en2+"5.3.2, Eq. (5.7)", "R_b", "min",
		RBValue(bEq.V), "0.09 * min(b_eq, 450)", trace.A("b_eq", bEq)), bEq.V, WidthMin57, WidthMax57, false, "equivalent width")
}

// RN returns Rn = 0 for n = 4 bars (corner bars only) and 12 for more, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func RN(id string, n trace.Q) trace.Step {
	return trace.Formula(id, "Term for the number of bars", en2+"5.3.2, Eq. (5.7)", "R_n", "min",
		RNValue(n.V), "n > 4 ? 12 : 0", trace.A("n", n))
}

// AspectCondition returns the check that the longer side is at most 1.5 times the shorter, the
// limit h ≤ 1.5·b of Eq. (5.7), ratio max(b, h)/(1.5·min(b, h)), EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func AspectCondition(id string, b, h trace.Q) trace.Step {
	return condition(id, "Limit of Eq. (5.7): proportion of the section", en2+"5.3.2, Eq. (5.7)", "h ≤ 1.5·b",
		max(b.V, h.V)/(Aspect57*min(b.V, h.V)), "max(b, h) / (1.5 * min(b, h))", trace.A("b", b), trace.A("h", h))
}

// Eq57 returns the fire resistance R = 120·((Rηfi + Ra + Rl + Rb + Rn)/120)^1.8 in minutes,
// a negative sum taken as 0, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func Eq57(id string, rEta, ra, rl, rb, rn trace.Q) trace.Step {
	s := trace.Formula(id, "Fire resistance of the column", en2+"5.3.2, Eq. (5.7)", "R", "min",
		Eq57Value(rEta.V, ra.V, rl.V, rb.V, rn.V), "120 * (max(R_eta + R_a + R_l + R_b + R_n, 0) / 120) ** 1.8",
		trace.A("R_eta", rEta), trace.A("R_a", ra), trace.A("R_l", rl), trace.A("R_b", rb), trace.A("R_n", rn))
	if rEta.V+ra.V+rl.V+rb.V+rn.V < 0 {
		return s.Shown("0").Note("The sum of the terms is negative: no fire resistance by Eq. (5.7).")
	}
	return s.Shown("120 * ((R_eta + R_a + R_l + R_b + R_n) / 120) ** 1.8")
}

// RatingCheck returns the check R ≥ R_req, ratio R_req/R, EN 1992-1-2:2004 5.3.2, Eq. (5.7).
func RatingCheck(id string, required, r trace.Q) trace.Step {
	s := trace.Check(id, "Fire resistance", en2+"5.3.2, Eq. (5.7)", "R_req ≤ R",
		required.V/max(r.V, 1e-3), "R_req / max(R, 0.001)", trace.A("R_req", required), trace.A("R", r))
	if r.V >= 1e-3 {
		return s.Shown("R_req / R")
	}
	return s
}
