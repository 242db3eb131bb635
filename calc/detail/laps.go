package detail

import (
	"math"

	"colsheet/calc/material"
	"colsheet/calc/trace"
)

// This file holds the anchorage and lap lengths of straight bars, EN 1992-1-1:2004 8.4 and 8.7,
// with the recommended values, and the transverse reinforcement at laps of column bars
// (8.7.4.2, 9.5.3(4)). The value functions hold the formulas of the step functions, which call
// them and record the same formula as an expression; each cites its clause at its step function.

// AlphaCt is the recommended coefficient αct for long-term effects on the tensile strength,
// EN 1992-1-1:2004 3.1.6(2)P.
const AlphaCt = 1.0

// FctmC60 is the mean tensile strength of C60/75 by the expression of EN 1992-1-1:2004 Table 3.1,
// the bond-strength limit of 8.4.2(2).
var FctmC60 = material.FromFck(60, 75).Fctm

// Fctk005Value returns fctk,0.05 = 0.7·min(fctm, fctm of C60/75); see Fctk005.
func Fctk005Value(fctm float64) float64 { return 0.7 * math.Min(fctm, FctmC60) }

// Fctk005 returns the 5 % fractile of the tensile strength for bond, fctk,0.05 = 0.7·fctm
// (EN 1992-1-1:2004 Table 3.1) limited to the value of C60/75 (8.4.2(2)).
func Fctk005(id string, fctm trace.Q) trace.Step {
	s := trace.Formula(id, "Characteristic tensile strength of concrete for bond (5 % fractile)",
		ec2+"Table 3.1, 8.4.2(2)", "f_ctk,0.05", "MPa", Fctk005Value(fctm.V),
		"0.7 * min(f_ctm, f_ctm_C60)", trace.A("f_ctm", fctm), trace.A("f_ctm_C60", trace.Const(FctmC60, "f_ctm,C60/75", "MPa")))
	if fctm.V > FctmC60 {
		s = s.Note("For bond, fctk,0.05 is limited to the value for C60/75 (8.4.2(2)), unless a higher average bond strength is shown.")
	}
	return s
}

// FctdValue returns fctd = αct·fctk,0.05/γc; see Fctd.
func FctdValue(alphaCt, fctk005, gammaC float64) float64 { return alphaCt * fctk005 / gammaC }

// Fctd returns the design tensile strength fctd = αct·fctk,0.05/γc, EN 1992-1-1:2004 3.1.6(2)P, Eq. (3.16).
func Fctd(id string, alphaCt, fctk005, gammaC trace.Q) trace.Step {
	return trace.Formula(id, "Design tensile strength of concrete", ec2+"3.1.6(2)P, Eq. (3.16)", "f_ctd", "MPa",
		FctdValue(alphaCt.V, fctk005.V, gammaC.V), "alpha_ct * f_ctk005 / gamma_c",
		trace.A("alpha_ct", alphaCt), trace.A("f_ctk005", fctk005), trace.A("gamma_c", gammaC))
}

// Eta1Value returns η1: 1.0 in good bond conditions and 0.7 otherwise; see Eta1.
func Eta1Value(goodBond bool) float64 {
	if goodBond {
		return 1.0
	}
	return 0.7
}

// Eta1 returns the bond-condition coefficient η1 (1.0 good, 0.7 poor), EN 1992-1-1:2004 8.4.2(2), Fig. 8.2.
func Eta1(id string, goodBond bool) trace.Step {
	s := trace.Input(id, "Coefficient for the bond conditions", ec2+"8.4.2(2), Fig. 8.2", "η_1", "", Eta1Value(goodBond))
	if goodBond {
		return s.Note("Good bond: the vertical bars of a column cast in lifts are commonly in good bond conditions (Fig. 8.2 a).")
	}
	return s.Note("Poor bond conditions.")
}

// Eta2Value returns η2 = 1 for φ ≤ 32 mm and (132 − φ)/100 above; see Eta2.
func Eta2Value(phi float64) float64 {
	if phi <= 32 {
		return 1
	}
	return (132 - phi) / 100
}

// Eta2 returns the bar-diameter coefficient η2 = 1 for φ ≤ 32 mm, (132 − φ)/100 above, EN 1992-1-1:2004 8.4.2(2).
func Eta2(id string, phi trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient for the bar diameter", ec2+"8.4.2(2)", "η_2", "", Eta2Value(phi.V),
		"phi <= 32 ? 1 : (132 - phi) / 100", trace.A("phi", phi))
}

// FbdValue returns fbd = 2.25·η1·η2·fctd; see Fbd.
func FbdValue(eta1, eta2, fctd float64) float64 { return 2.25 * eta1 * eta2 * fctd }

// Fbd returns the design ultimate bond stress fbd = 2.25·η1·η2·fctd, EN 1992-1-1:2004 8.4.2(2), Eq. (8.2).
func Fbd(id string, eta1, eta2, fctd trace.Q) trace.Step {
	return trace.Formula(id, "Design ultimate bond stress", ec2+"8.4.2(2), Eq. (8.2)", "f_bd", "MPa",
		FbdValue(eta1.V, eta2.V, fctd.V), "2.25 * eta_1 * eta_2 * f_ctd",
		trace.A("eta_1", eta1), trace.A("eta_2", eta2), trace.A("f_ctd", fctd))
}

// LbRqdValue returns lb,rqd = (φ/4)·(σsd/fbd); see LbRqd.
func LbRqdValue(phi, sigmaSd, fbd float64) float64 { return phi / 4 * sigmaSd / fbd }

// LbRqd returns the basic required anchorage length lb,rqd = (φ/4)·(σsd/fbd), EN 1992-1-1:2004 8.4.3(2), Eq. (8.3).
func LbRqd(id string, phi, sigmaSd, fbd trace.Q) trace.Step {
	return trace.Formula(id, "Basic required anchorage length", ec2+"8.4.3(2), Eq. (8.3)", "l_b,rqd", "mm",
		LbRqdValue(phi.V, sigmaSd.V, fbd.V), "phi / 4 * sigma_sd / f_bd",
		trace.A("phi", phi), trace.A("sigma_sd", sigmaSd), trace.A("f_bd", fbd))
}

// Alpha6Value returns α6 = (ρ1/25)^0.5 kept within [1, 1.5], ρ1 in per cent; see Alpha6.
func Alpha6Value(rho1 float64) float64 {
	return math.Min(math.Max(math.Sqrt(math.Max(rho1, 0)/25), 1), 1.5)
}

// Alpha6 returns the lap coefficient α6 = (ρ1/25)^0.5 within 1 ≤ α6 ≤ 1.5, from the percentage ρ1 of
// bars lapped within 0.65·l0 of the lap centre, EN 1992-1-1:2004 8.7.3(1), Table 8.3.
func Alpha6(id string, rho1 trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient for the share of bars lapped at one section", ec2+"8.7.3(1), Table 8.3", "α_6", "",
		Alpha6Value(rho1.V), "min(max(sqrt(max(rho_1, 0) / 25), 1), 1.5)", trace.A("rho_1", rho1))
}

// LapMinValue returns l0,min = max(0.3·α6·lb,rqd, 15·φ, 200 mm); see LapMin.
func LapMinValue(alpha6, lbRqd, phi float64) float64 {
	return math.Max(math.Max(0.3*alpha6*lbRqd, 15*phi), 200)
}

// LapMin returns the least lap length l0,min = max(0.3·α6·lb,rqd, 15·φ, 200 mm), EN 1992-1-1:2004 8.7.3(1), Eq. (8.11).
func LapMin(id string, alpha6, lbRqd, phi trace.Q) trace.Step {
	return trace.Formula(id, "Minimum lap length", ec2+"8.7.3(1), Eq. (8.11)", "l_0,min", "mm",
		LapMinValue(alpha6.V, lbRqd.V, phi.V), "max(0.3 * alpha_6 * l_brqd, 15 * phi, 200)",
		trace.A("alpha_6", alpha6), trace.A("l_brqd", lbRqd), trace.A("phi", phi))
}

// LapLengthValue returns l0 = max(α1·max(α2·α3·α5, 0.7)·α6·lb,rqd, l0,min); see LapLength.
func LapLengthValue(alpha1, alpha2, alpha3, alpha5, alpha6, lbRqd, l0min float64) float64 {
	return math.Max(alpha1*math.Max(alpha2*alpha3*alpha5, 0.7)*alpha6*lbRqd, l0min)
}

// LapLength returns the design lap length l0 = α1·α2·α3·α5·α6·lb,rqd ≥ l0,min, EN 1992-1-1:2004 8.7.3(1),
// Eq. (8.10), with the product α2·α3·α5 not below 0.7 (8.4.4(1), Eq. (8.5)).
func LapLength(id string, alpha1, alpha2, alpha3, alpha5, alpha6, lbRqd, l0min trace.Q) trace.Step {
	s := trace.Formula(id, "Design lap length", ec2+"8.7.3(1), Eq. (8.10)", "l_0", "mm",
		LapLengthValue(alpha1.V, alpha2.V, alpha3.V, alpha5.V, alpha6.V, lbRqd.V, l0min.V),
		"max(alpha_1 * max(alpha_2 * alpha_3 * alpha_5, 0.7) * alpha_6 * l_brqd, l_0min)",
		trace.A("alpha_1", alpha1), trace.A("alpha_2", alpha2), trace.A("alpha_3", alpha3), trace.A("alpha_5", alpha5),
		trace.A("alpha_6", alpha6), trace.A("l_brqd", lbRqd), trace.A("l_0min", l0min))
	if alpha2.V*alpha3.V*alpha5.V < 0.7 {
		s = s.Note("The product α2·α3·α5 is taken as 0.7, its lower limit (8.4.4(1), Eq. (8.5)).")
	}
	return s
}

// LapValue returns the lap length l0 of Lap without a trace, with σsd the design stress of the bar.
func LapValue(phi, fctm, gammaC, sigmaSd float64, goodBond bool, lappedPercent float64) float64 {
	fbd := FbdValue(Eta1Value(goodBond), Eta2Value(phi), FctdValue(AlphaCt, Fctk005Value(fctm), gammaC))
	lb := LbRqdValue(phi, sigmaSd, fbd)
	a6 := Alpha6Value(lappedPercent)
	return LapLengthValue(1, 1, 1, 1, a6, lb, LapMinValue(a6, lb, phi))
}

// Lap records the lap length of compression bars at their full design strength (σsd = fyd), in good
// bond unless goodBond is false, with lappedPercent the per cent of bars lapped at one section (100 in
// a column whose bars are all lapped together) and α1 = α2 = α3 = α5 = 1, and returns l0.
func Lap(l *trace.Log, prefix string, phi, fctm, gammaC, fyd trace.Q, goodBond bool, lappedPercent float64) trace.Q {
	sigma := l.Add(trace.Formula(prefix+"sigma_sd", "Design stress of the bar at the lap: its full design strength",
		ec2+"8.4.3(2)", "σ_sd", "MPa", fyd.V, "f_yd", trace.A("f_yd", fyd)))
	return LapAtStress(l, prefix, phi, fctm, gammaC, sigma, goodBond, lappedPercent)
}

// LapAtStress records the lap length of compression bars at the design stress sigmaSd and returns l0; see Lap.
func LapAtStress(l *trace.Log, prefix string, phi, fctm, gammaC, sigmaSd trace.Q, goodBond bool, lappedPercent float64) trace.Q {
	fctk := l.Add(Fctk005(prefix+"fctk005", fctm))
	alphaCt := trace.Const(AlphaCt, "α_ct", "")
	fctd := l.Add(Fctd(prefix+"fctd", alphaCt, fctk, gammaC).Note("αct = 1.0, the recommended value (3.1.6(2)P)."))
	eta1 := l.Add(Eta1(prefix+"eta1", goodBond))
	eta2 := l.Add(Eta2(prefix+"eta2", phi))
	fbd := l.Add(Fbd(prefix+"fbd", eta1, eta2, fctd))
	lb := l.Add(LbRqd(prefix+"lb_rqd", phi, sigmaSd, fbd))
	rho := l.Add(trace.Input(prefix+"rho1", "Percentage of bars lapped within 0.65·l0 of the lap centre",
		ec2+"8.7.3(1), Fig. 8.8", "ρ_1", "", math.Max(lappedPercent, 0)))
	a6 := l.Add(Alpha6(prefix+"alpha6", rho))
	l0min := l.Add(LapMin(prefix+"l0_min", a6, lb, phi))
	one := func(sym string) trace.Q { return trace.Const(1, sym, "") }
	return l.Add(LapLength(prefix+"l0", one("α_1"), one("α_2"), one("α_3"), one("α_5"), a6, lb, l0min).
		Note("Bars in compression: α1 = α2 = α3 = α5 = 1 (Table 8.2)."))
}

// LapEndLinkReach returns the greatest distance 4·φ beyond each end of a compression lap within which
// one transverse bar is placed outside the lap, EN 1992-1-1:2004 8.7.4.2(1), Fig. 8.9 b).
func LapEndLinkReach(id string, phi trace.Q) trace.Step {
	return trace.Formula(id, "Link outside each end of a compression lap: greatest distance from the lap end",
		ec2+"8.7.4.2(1), Fig. 8.9 b)", "a_t", "mm", 4*phi.V, "4 * phi", trace.A("phi", phi)).
		Note("One link is placed outside each end of the lap length, within this distance of the end.")
}

// LapZoneReducedValue returns 1 when the link spacing is reduced at laps (φ > 14 mm) and 0 otherwise; see LapZoneReduced.
func LapZoneReducedValue(phi float64) float64 {
	if phi > 14 {
		return 1
	}
	return 0
}

// LapZoneReduced returns 1 when the link spacing is reduced by the factor 0.6 at laps, that is when the
// largest longitudinal bar exceeds 14 mm, and 0 otherwise, EN 1992-1-1:2004 9.5.3(4)(ii).
func LapZoneReduced(id string, phi trace.Q) trace.Step {
	s := trace.Formula(id, "Link spacing reduced at laps (1 yes, 0 no)", ec2+"9.5.3(4)", "r_lap", "",
		LapZoneReducedValue(phi.V), "phi > 14 ? 1 : 0", trace.A("phi", phi))
	if phi.V > 14 {
		return s.Note("The largest longitudinal bar exceeds 14 mm: the link spacing is reduced by 0.6 at laps.")
	}
	return s.Note("The longitudinal bars do not exceed 14 mm: no reduction of the link spacing at laps.")
}

// LapLinkSpacing returns the link spacing at the laps: the reduced spacing sRed when reduced is 1, else s, EN 1992-1-1:2004 9.5.3(4).
func LapLinkSpacing(id string, reduced, s, sRed trace.Q) trace.Step {
	v := s.V
	if reduced.V > 0.5 {
		v = sRed.V
	}
	return trace.Formula(id, "Link spacing at the laps", ec2+"9.5.3(4)", "s_t,lap", "mm", v,
		"r_lap > 0.5 ? s_red : s", trace.A("r_lap", reduced), trace.A("s_red", sRed), trace.A("s", s))
}

// LinksInLapValue returns floor(l0/s), the links that lie within a lap of length l0 at spacing s; see LinksInLap.
func LinksInLapValue(l0, s float64) float64 { return math.Floor(l0/s + 1e-9) }

// LinksInLap returns the number of links within the lap length at spacing s, floor(l0/s), which holds
// whatever their position along the lap, for the rule of EN 1992-1-1:2004 9.5.3(4).
func LinksInLap(id string, l0, s trace.Q) trace.Step {
	return trace.Formula(id, "Links within the lap length", ec2+"9.5.3(4)", "n_t,lap", "",
		LinksInLapValue(l0.V, s.V), "floor(l_0 / s + 0.000000001)", trace.A("l_0", l0), trace.A("s", s)).
		Note("Counted as whole spacings within the lap, so that the count holds wherever the links fall.")
}

// LapLinksCheck checks that at least 3 links lie evenly in the lap length, EN 1992-1-1:2004 9.5.3(4).
func LapLinksCheck(id string, n trace.Q) trace.Step {
	return trace.Check(id, "At least three links in the lap length", ec2+"9.5.3(4)", "3 ≤ n_t,lap",
		3/math.Max(n.V, 1), "3 / max(n, 1)", trace.A("n", n))
}

// LapLinks records the transverse reinforcement at the laps of compression bars of diameter phi and lap
// length l0, with link spacings s (general) and sRed (reduced), and returns the spacing at the laps.
func LapLinks(l *trace.Log, prefix string, phi, l0, s, sRed trace.Q) trace.Q {
	l.Add(LapEndLinkReach(prefix+"end_link", phi))
	r := l.Add(LapZoneReduced(prefix+"reduced", phi))
	sl := l.Add(LapLinkSpacing(prefix+"s_lap", r, s, sRed))
	n := l.Add(LinksInLap(prefix+"n_links", l0, sl))
	l.Add(LapLinksCheck(prefix+"links_check", n))
	return sl
}
