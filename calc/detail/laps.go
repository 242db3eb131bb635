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
		Alpha6Value(rho1.V), "min(max(sqrt(max(rho_1, 0) / 25), 1), 1.5)", trace.A("rho_1", rho1)).
		Shown("min(max(sqrt(rho_1 / 25), 1), 1.5)")
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
// a column whose bars are all lapped together) and α1 = α2 = α3 = α5 = 1, and returns l0 and the
// percentage ρ1 as recorded.
func Lap(l *trace.Log, prefix string, phi, fctm, gammaC, fyd trace.Q, goodBond bool, lappedPercent float64) (l0, rho1 trace.Q) {
	sigma := l.Add(FullStress(prefix+"sigma_sd", fyd))
	return LapAtStress(l, prefix, phi, fctm, gammaC, sigma, goodBond, lappedPercent)
}

// FullStress returns the design stress of a bar at a lap taken as its full design strength,
// σsd = fyd, EN 1992-1-1:2004 8.4.3(2).
func FullStress(id string, fyd trace.Q) trace.Step {
	return trace.Formula(id, "Design stress of the bar at the lap: its full design strength",
		ec2+"8.4.3(2)", "σ_sd", "MPa", fyd.V, "f_yd", trace.A("f_yd", fyd))
}

// LapAtStress records the lap length of compression bars at the design stress sigmaSd and returns l0
// and ρ1; see Lap.
func LapAtStress(l *trace.Log, prefix string, phi, fctm, gammaC, sigmaSd trace.Q, goodBond bool, lappedPercent float64) (l0, rho1 trace.Q) {
	b := LapBondSteps(l, prefix, fctm, gammaC, sigmaSd, goodBond, lappedPercent)
	return LapFor(l, prefix, phi, b), b.Rho1
}

// LapBond holds the quantities of a lap length that do not depend on the bar diameter: the same
// for every bar of a project, so that the project basis records them once.
type LapBond struct {
	SigmaSd trace.Q // design stress of the bar at the lap
	Fctd    trace.Q // design tensile strength of concrete
	Eta1    trace.Q // bond-condition coefficient
	Rho1    trace.Q // per cent of bars lapped at one section
	Alpha6  trace.Q // lap coefficient of Table 8.3
}

// LapBondSteps records fctk,0.05, fctd, η1, ρ1 and α6 under IDs prefix+"fctk005", "fctd", "eta1",
// "rho1" and "alpha6" (see Lap for goodBond and lappedPercent) and returns them with sigmaSd.
func LapBondSteps(l *trace.Log, prefix string, fctm, gammaC, sigmaSd trace.Q, goodBond bool, lappedPercent float64) LapBond {
	fctk := l.Add(Fctk005(prefix+"fctk005", fctm))
	alphaCt := trace.Const(AlphaCt, "α_ct", "")
	b := LapBond{SigmaSd: sigmaSd}
	b.Fctd = l.Add(Fctd(prefix+"fctd", alphaCt, fctk, gammaC).Note("αct = 1.0, the recommended value (3.1.6(2)P)."))
	b.Eta1 = l.Add(Eta1(prefix+"eta1", goodBond))
	b.Rho1 = l.Add(trace.Input(prefix+"rho1", "Percentage of bars lapped within 0.65·l0 of the lap centre",
		ec2+"8.7.3(1), Fig. 8.8", "ρ_1", "", math.Max(lappedPercent, 0)))
	b.Alpha6 = l.Add(Alpha6(prefix+"alpha6", b.Rho1))
	return b
}

// LapFor records η2, fbd, lb,rqd, l0,min and l0 of bars of diameter phi under IDs prefix+"eta2",
// "fbd", "lb_rqd", "l0_min" and "l0", with α1 = α2 = α3 = α5 = 1 (bars in compression), and
// returns l0.
func LapFor(l *trace.Log, prefix string, phi trace.Q, b LapBond) trace.Q {
	eta2 := l.Add(Eta2(prefix+"eta2", phi))
	fbd := l.Add(Fbd(prefix+"fbd", b.Eta1, eta2, b.Fctd))
	lb := l.Add(LbRqd(prefix+"lb_rqd", phi, b.SigmaSd, fbd))
	l0min := l.Add(LapMin(prefix+"l0_min", b.Alpha6, lb, phi))
	one := func(sym string) trace.Q { return trace.Const(1, sym, "") }
	return l.Add(LapLength(prefix+"l0", one("α_1"), one("α_2"), one("α_3"), one("α_5"), b.Alpha6, lb, l0min).
		Note("Bars in compression: α1 = α2 = α3 = α5 = 1 (Table 8.2)."))
}

// The arrangement of the laps of a column, EN 1992-1-1:2004 8.7.2(3) and Fig. 8.7: all bars are
// lapped at one section, each bar of the lift above set beside its bar below.

// LapPairCheck checks the clear distance between the two bars of a lapped pair, which touch (8.2(4)),
// against the greatest distance min(4·φ, 50 mm) beyond which the lap length grows by the excess,
// EN 1992-1-1:2004 8.7.2(3), Fig. 8.7.
func LapPairCheck(id string, phi trace.Q) trace.Step {
	a := trace.Const(0, "a_pair", "mm")
	return trace.Check(id, "Clear distance between the two bars of a lapped pair", ec2+"8.7.2(3), Fig. 8.7", "a_pair ≤ min(4φ, 50 mm)",
		a.V/math.Min(4*phi.V, 50), "a / min(4 * phi, 50)", trace.A("a", a), trace.A("phi", phi)).
		Note("The bar of the lift above is set beside the bar below and touches it over the lap, as 8.2(4) allows: the lap length needs no increase for the distance between them.")
}

// LappedGapValue returns the clear distance between a lapped pair and the next bar, min(sb, sh) − φ; see LappedGap.
func LappedGapValue(gapB, gapH, phi float64) float64 { return math.Min(gapB, gapH) - phi }

// LappedGap returns the clear distance between a lapped pair and the next bar along a face: the least
// clear distance between the bars away from the laps less the diameter of the bar set beside, common practice.
func LappedGap(id string, gapB, gapH, phi trace.Q) trace.Step {
	return trace.Formula(id, "Clear distance between a lapped pair and the next bar", "common practice", "s_lap", "mm",
		LappedGapValue(gapB.V, gapH.V, phi.V), "min(s_b, s_h) - phi", trace.A("s_b", gapB), trace.A("s_h", gapH), trace.A("phi", phi)).
		Note("Every bar of the lift above lies beside its bar below on the same side along the face (at a corner, inside the corner), so that each clear distance along a face loses one bar diameter over the lap.").
		Note("All bars are lapped at one section, as 8.7.2(4) allows for bars in compression (and for bars in tension in one layer); the longitudinal distance of 0.3·l0 between adjacent laps concerns staggered laps and does not arise.")
}

// LappedGapMinValue returns the least clear distance between a lapped pair and the next bar,
// max(sMin, 2·φ, 20 mm); see LappedGapMin.
func LappedGapMinValue(phi, sMin float64) float64 { return math.Max(math.Max(sMin, 2*phi), 20) }

// LappedGapMin returns the least clear distance between a lapped pair and the next bar: the clear distance
// sMin between bars and, between adjacent laps, not less than 2·φ or 20 mm, EN 1992-1-1:2004 8.2(2); 8.7.2(3), Fig. 8.7.
func LappedGapMin(id string, phi, sMin trace.Q) trace.Step {
	return trace.Formula(id, "Minimum clear distance between a lapped pair and the next bar", ec2+"8.2(2); 8.7.2(3), Fig. 8.7", "s_lap,min", "mm",
		LappedGapMinValue(phi.V, sMin.V), "max(s_min, 2 * phi, 20)", trace.A("s_min", sMin), trace.A("phi", phi))
}

// LappedFitValue returns the least clear distance between the bars of a pattern, away from the laps,
// that leaves the clear distance of LappedGapMinValue beside each lapped pair: that distance plus one
// bar diameter. A pattern whose clear distances are smaller cannot be lapped (8.7.2(3)).
func LappedFitValue(phi, sMin float64) float64 { return LappedGapMinValue(phi, sMin) + phi }

// LappedGapCheck checks the clear distance between a lapped pair and the next bar, EN 1992-1-1:2004 8.7.2(3).
// The ratio compares centre distances, (s_lap,min + φ)/(s_lap + φ), so that it stays finite when bars overlap.
func LappedGapCheck(id string, gap, gapMin, phi trace.Q) trace.Step {
	s := trace.Check(id, "Clear distance between a lapped pair and the next bar", ec2+"8.2(2); 8.7.2(3)", "s_lap,min ≤ s_lap",
		(gapMin.V+phi.V)/math.Max(gap.V+phi.V, 1e-3), "(s_lap_min + phi) / max(s_lap + phi, 0.001)",
		trace.A("s_lap_min", gapMin), trace.A("s_lap", gap), trace.A("phi", phi))
	if gap.V+phi.V >= 1e-3 {
		return s.Shown("(s_lap_min + phi) / (s_lap + phi)")
	}
	return s
}

// LapArrangement records the arrangement of the lapped bars of a column whose bars are all lapped at one
// section, from the clear distances gapB and gapH between the bars along the faces and the least clear
// distance sMin of 8.2(2), and returns the IDs of its check steps.
func LapArrangement(l *trace.Log, prefix string, phi, gapB, gapH, sMin trace.Q) []string {
	pair := l.Add(LapPairCheck(prefix+"check_pair", phi))
	g := l.Add(LappedGap(prefix+"gap", gapB, gapH, phi))
	m := l.Add(LappedGapMin(prefix+"gap_min", phi, sMin))
	gap := l.Add(LappedGapCheck(prefix+"check_gap", g, m, phi))
	return []string{pair.From, gap.From}
}

// The transverse reinforcement at the laps of a column, EN 1992-1-1:2004 8.7.4 and 9.5.3(4).

// LapEndLinkReach returns the greatest distance 4·φ beyond each end of a compression lap within which
// one transverse bar is placed outside the lap, EN 1992-1-1:2004 8.7.4.2(1), Fig. 8.9.
func LapEndLinkReach(id string, phi trace.Q) trace.Step {
	return trace.Formula(id, "Link outside each end of a compression lap: greatest distance from the lap end",
		ec2+"8.7.4.2(1), Fig. 8.9", "a_t", "mm", 4*phi.V, "4 * phi", trace.A("phi", phi)).
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
	s := trace.Formula(id, "Link spacing reduced at laps", ec2+"9.5.3(4)", "r_lap", "",
		LapZoneReducedValue(phi.V), "phi > 14 ? 1 : 0", trace.A("phi", phi)).Condition("phi > 14")
	if phi.V > 14 {
		return s.Note("The largest longitudinal bar exceeds 14 mm: the link spacing is reduced by 0.6 at laps, with at least three links evenly placed in the lap length.")
	}
	return s.Note("The longitudinal bars do not exceed 14 mm: no reduction of the link spacing at laps, and no least number of links in the lap length.")
}

// LapTransverseValue returns 1 when the links at a lap must provide the area of one lapped bar (φ ≥ 20 mm
// and at least 25 % of the bars lapped at one section) and 0 otherwise; see LapTransverse.
func LapTransverseValue(phi, rho1 float64) float64 {
	if phi >= 20 && rho1 >= 25 {
		return 1
	}
	return 0
}

// LapTransverse returns 1 when the transverse reinforcement at the laps must have a total area ΣAst not
// less than the area of one lapped bar (φ ≥ 20 mm and 25 % or more of the bars lapped at one section),
// and 0 when the links provided for other reasons suffice, EN 1992-1-1:2004 8.7.4.1(2), (3).
func LapTransverse(id string, phi, rho1 trace.Q) trace.Step {
	s := trace.Formula(id, "Transverse reinforcement at the laps to be shown", ec2+"8.7.4.1(2), (3)", "t_lap", "",
		LapTransverseValue(phi.V, rho1.V), "phi >= 20 && rho_1 >= 25 ? 1 : 0", trace.A("phi", phi), trace.A("rho_1", rho1)).
		Condition("phi >= 20 && rho_1 >= 25")
	switch {
	case phi.V < 20:
		return s.Note("The lapped bars are smaller than 20 mm: the links provided for other reasons suffice for the transverse tension at the laps (8.7.4.1(2)).")
	case rho1.V < 25:
		return s.Note("Less than 25 % of the bars are lapped at one section: the links provided for other reasons suffice for the transverse tension at the laps (8.7.4.1(2)).")
	}
	return s.Note("Bars of 20 mm and over: the links in the outer thirds of the lap provide together at least the area of one lapped bar (8.7.4.1(3), (4)).").
		Note("The links are closed round the bars, perpendicular to them and between them and the surface, as 8.7.4.1(3) asks where more than half the bars are lapped at one section.")
}

// LapBarArea returns the area π·φ²/4 of one lapped bar, EN 1992-1-1:2004 8.7.4.1(3).
func LapBarArea(id string, phi trace.Q) trace.Step {
	return trace.Formula(id, "Area of one lapped bar", ec2+"8.7.4.1(3)", "A_s", "mm2",
		math.Pi*phi.V*phi.V/4, "3.141592653589793 * phi ** 2 / 4", trace.A("phi", phi)).Shown("pi * phi ** 2 / 4")
}

// LinkLegArea returns the area π·φt²/4 of one link leg, common practice.
func LinkLegArea(id string, phiT trace.Q) trace.Step {
	return trace.Formula(id, "Area of one link leg", "common practice", "A_st", "mm2",
		math.Pi*phiT.V*phiT.V/4, "3.141592653589793 * phi_t ** 2 / 4", trace.A("phi_t", phiT)).Shown("pi * phi_t ** 2 / 4")
}

// LapLegs is the number of link legs at each link that lie parallel to the layer of a lapped pair: the one
// leg of the perimeter link along the face. Extra ties cross the section at right angles to the layer.
const LapLegs = 1

// LapLinksPerThirdValue returns ceil(As/2/(nLegs·Ast)), the links needed within each outer third; see LapLinksPerThird.
func LapLinksPerThirdValue(as, ast, legs float64) float64 {
	return -math.Floor(-as/2/(legs*ast) + 1e-9)
}

// LapLinksPerThird returns the links needed within each outer third of the lap so that each third holds
// ΣAst/2 ≥ As/2, ceil(As/(2·nlegs·Ast)), EN 1992-1-1:2004 8.7.4.1(3), (4), Fig. 8.9.
func LapLinksPerThird(id string, as, ast, legs trace.Q) trace.Step {
	return trace.Formula(id, "Links needed within each outer third of the lap length", ec2+"8.7.4.1(3), (4), Fig. 8.9", "n_t,3,req", "",
		LapLinksPerThirdValue(as.V, ast.V, legs.V), "-floor(-A_s / 2 / (n_legs * A_st) + 0.000000001)",
		trace.A("A_s", as), trace.A("n_legs", legs), trace.A("A_st", ast)).
		Shown("ceil(A_s / 2 / (n_legs * A_st))").
		Note("ΣAst counts the legs parallel to the layer of the lapped bars: at each link the one leg of the perimeter link along the face where the pair lies. Extra ties cross the section at right angles to the layer and are not counted.")
}

// LapFigSpacing is the greatest spacing, mm, of the transverse bars at a lap that Fig. 8.9 of
// EN 1992-1-1:2004 shows.
const LapFigSpacing = 150.0

// LapSpacingMaxValue returns the greatest link spacing over a lap: s where the spacing is not reduced,
// min(sRed, l0/3) where it is (three links in the lap), and also not above l0/(3·n) and the spacing of
// Fig. 8.9 where the links carry the transverse tension; see LapSpacingMax.
func LapSpacingMaxValue(reduced, transverse bool, s, sRed, l0, n float64) float64 {
	switch {
	case transverse:
		return math.Min(math.Min(sRed, l0/(3*n)), LapFigSpacing)
	case reduced:
		return math.Min(sRed, l0/3)
	}
	return s
}

// LapSpacingMax returns the greatest link spacing over a lap: the general spacing s where the bars do not
// exceed 14 mm; else the reduced spacing sRed with at least three links in the lap length l0,
// EN 1992-1-1:2004 9.5.3(4); and where the links carry the transverse tension (transverse), n links within
// each outer third l0/3 at no more than the spacing of Fig. 8.9, 8.7.4.1(4). n is unused otherwise.
func LapSpacingMax(id string, reduced, transverse bool, s, sRed, l0, n trace.Q) trace.Step {
	v := LapSpacingMaxValue(reduced, transverse, s.V, sRed.V, l0.V, n.V)
	const title = "Greatest link spacing over the laps"
	switch {
	case transverse:
		return trace.Formula(id, title, ec2+"9.5.3(4); 8.7.4.1(4), Fig. 8.9", "s_t,lap,max", "mm", v,
			"min(s_red, l_0 / (3 * n), s_fig)", trace.A("s_red", sRed), trace.A("l_0", l0), trace.A("n", n),
			trace.A("s_fig", trace.Const(LapFigSpacing, "s_t,Fig.8.9", "mm"))).
			Note("n links within each outer third of the lap wherever they fall, at no more than the spacing shown in Fig. 8.9; n ≥ 1, so at least three links lie in the lap length (9.5.3(4)).")
	case reduced:
		return trace.Formula(id, title, ec2+"9.5.3(4)", "s_t,lap,max", "mm", v, "min(s_red, l_0 / 3)",
			trace.A("s_red", sRed), trace.A("l_0", l0)).
			Note("The reduced spacing, with at least three links evenly placed in the lap length.")
	}
	return trace.Formula(id, title, ec2+"9.5.3(4)", "s_t,lap,max", "mm", v, "s", trace.A("s", s)).
		Note("The general spacing: the bars do not exceed 14 mm.")
}

// LinksInLapValue returns floor(l0/s), the links that lie within a lap of length l0 at spacing s; see LinksInLap.
func LinksInLapValue(l0, s float64) float64 { return math.Floor(l0/s + 1e-9) }

// LinksInLap returns the number of links within the lap length at spacing s, floor(l0/s), which holds
// whatever their position along the lap, for the rule of EN 1992-1-1:2004 9.5.3(4).
func LinksInLap(id string, l0, s trace.Q) trace.Step {
	return trace.Formula(id, "Links within the lap length", ec2+"9.5.3(4)", "n_t,lap", "",
		LinksInLapValue(l0.V, s.V), "floor(l_0 / s + 0.000000001)", trace.A("l_0", l0), trace.A("s", s)).
		Shown("floor(l_0 / s)").
		Note("Counted as whole spacings within the lap, so that the count holds wherever the links fall; one more link lies beyond each end of the lap (8.7.4.2(1)).")
}

// LapLinksCheck checks that at least 3 links lie evenly in the lap length, EN 1992-1-1:2004 9.5.3(4).
func LapLinksCheck(id string, n trace.Q) trace.Step {
	s := trace.Check(id, "At least three links in the lap length", ec2+"9.5.3(4)", "3 ≤ n_t,lap",
		3/math.Max(n.V, 1), "3 / max(n, 1)", trace.A("n", n))
	if n.V >= 1 {
		return s.Shown("3 / n")
	}
	return s.Unmet()
}

// LinkClearCheck checks that the links over the lap leave the clear distance sMinT between them,
// s − φt ≥ sMinT, compared as centre distances (sMinT + φt)/s, EN 1992-1-1:2004 8.2(2).
func LinkClearCheck(id string, s, phiT, sMinT trace.Q) trace.Step {
	c := trace.Check(id, "Clear distance between the links over the laps", ec2+"8.2(2)", "s_min,t ≤ s_t,lap − φ_t",
		(sMinT.V+phiT.V)/math.Max(s.V, 1e-3), "(s_min_t + phi_t) / max(s, 0.001)",
		trace.A("s_min_t", sMinT), trace.A("phi_t", phiT), trace.A("s", s))
	if s.V >= 1e-3 {
		return c.Shown("(s_min_t + phi_t) / s")
	}
	return c
}

// LinksInThird returns the links within each outer third of the lap at spacing s, floor(l0/(3·s)),
// wherever they fall, EN 1992-1-1:2004 8.7.4.1(4), Fig. 8.9.
func LinksInThird(id string, l0, s trace.Q) trace.Step {
	return trace.Formula(id, "Links within each outer third of the lap length", ec2+"8.7.4.1(4), Fig. 8.9", "n_t,3", "",
		math.Floor(l0.V/(3*s.V)+1e-9), "floor(l_0 / (3 * s) + 0.000000001)", trace.A("l_0", l0), trace.A("s", s)).
		Shown("floor(l_0 / (3 * s))")
}

// LapTransverseArea returns ΣAst = 2·n·nlegs·Ast, the legs parallel to the layer of the lapped bars within
// the two outer thirds of the lap, EN 1992-1-1:2004 8.7.4.1(3), (4).
func LapTransverseArea(id string, n, legs, ast trace.Q) trace.Step {
	return trace.Formula(id, "Transverse reinforcement at the lap, in its two outer thirds", ec2+"8.7.4.1(3), (4)", "ΣA_st", "mm2",
		2*n.V*legs.V*ast.V, "2 * n * n_legs * A_st", trace.A("n", n), trace.A("n_legs", legs), trace.A("A_st", ast))
}

// LapTransverseCheck checks ΣAst ≥ As of one lapped bar, EN 1992-1-1:2004 8.7.4.1(3).
func LapTransverseCheck(id string, as, sum trace.Q) trace.Step {
	s := trace.Check(id, "Transverse reinforcement at the laps", ec2+"8.7.4.1(3)", "A_s ≤ ΣA_st",
		as.V/math.Max(sum.V, 1e-3), "A_s / max(sum, 0.001)", trace.A("A_s", as), trace.A("sum", sum))
	if sum.V >= 1e-3 {
		return s.Shown("A_s / sum")
	}
	return s
}

// LapLinkInput is what the links over the laps of a column need.
type LapLinkInput struct {
	Phi, PhiT trace.Q // bar and link diameters, mm
	L0        trace.Q // lap length, mm
	Rho1      trace.Q // percentage of the bars lapped at one section
	S, SRed   trace.Q // link spacings provided: general, and reduced near beams, slabs and laps (9.5.3(4)), mm
	Step      trace.Q // spacings are rounded down to a multiple of this, mm
	// SMinT gives the least clear distance between the links (8.2(2) for the link diameter); it is called,
	// and its step recorded, only where the links carry the transverse tension at the lap.
	SMinT func() trace.Q
}

// LapLinkPlan is the links over a lap as detailed.
type LapLinkPlan struct {
	Reduced    bool     // the spacing is reduced at the laps (φ > 14 mm), 9.5.3(4)
	Transverse bool     // the links carry the transverse tension, ΣAst ≥ As (φ ≥ 20 mm), 8.7.4.1(3)
	Spacing    float64  // link spacing over the lap, mm
	S          trace.Q  // the step of that spacing; zero where it could not be detailed
	Count      int      // links within the lap length at that spacing, wherever they fall; one more lies beyond each end
	Checks     []string // IDs of the check steps
}

// LapLinks records the links over the laps of a column, EN 1992-1-1:2004 8.7.4 and 9.5.3(4): the
// spacing, reduced where the bars exceed 14 mm and reduced further where the links must provide the
// area of one lapped bar in the outer thirds of the lap, the links in the lap length and beyond its
// ends, and the checks. It returns the plan.
func LapLinks(l *trace.Log, prefix string, in LapLinkInput) LapLinkPlan {
	var plan LapLinkPlan
	r := l.Add(LapZoneReduced(prefix+"zone", in.Phi))
	t := l.Add(LapTransverse(prefix+"transverse", in.Phi, in.Rho1))
	plan.Reduced, plan.Transverse = r.V == 1, t.V == 1
	legs := trace.Const(LapLegs, "n_legs", "")
	var as, ast, nReq trace.Q
	if plan.Transverse {
		as = l.Add(LapBarArea(prefix+"As_bar", in.Phi))
		ast = l.Add(LinkLegArea(prefix+"A_leg", in.PhiT))
		nReq = l.Add(LapLinksPerThird(prefix+"n_third_req", as, ast, legs))
	}
	sMax := l.Add(LapSpacingMax(prefix+"s_max", plan.Reduced, plan.Transverse, in.S, in.SRed, in.L0, nReq))
	s := l.Add(RoundDown(prefix+"s", "Link spacing provided over the laps", "s_t,lap", sMax, in.Step))
	if !(s.V > 0) {
		// The step of the link spacings leaves no spacing below the greatest: the links cannot be detailed.
		cs := trace.Check(prefix+"check_s", "Link spacing over the laps on the step of the link spacings", "common practice",
			"Δs ≤ s_t,lap,max", in.Step.V/math.Max(sMax.V, 1e-3), "step / max(s_max, 0.001)",
			trace.A("step", in.Step), trace.A("s_max", sMax))
		if sMax.V >= 1e-3 {
			cs = cs.Shown("step / s_max")
		}
		c := l.Add(cs)
		plan.Checks = append(plan.Checks, c.From)
		return plan
	}
	plan.Spacing, plan.S = s.V, s
	n := l.Add(LinksInLap(prefix+"n_links", in.L0, s))
	plan.Count = int(n.V)
	if plan.Reduced {
		plan.Checks = append(plan.Checks, l.Add(LapLinksCheck(prefix+"links_check", n)).From)
	}
	l.Add(LapEndLinkReach(prefix+"end_link", in.Phi))
	if plan.Transverse {
		sMinT := in.SMinT()
		plan.Checks = append(plan.Checks, l.Add(LinkClearCheck(prefix+"check_s_t", s, in.PhiT, sMinT)).From)
		n3 := l.Add(LinksInThird(prefix+"n_third", in.L0, s))
		sum := l.Add(LapTransverseArea(prefix+"Ast", n3, legs, ast))
		plan.Checks = append(plan.Checks, l.Add(LapTransverseCheck(prefix+"check_Ast", as, sum)).From)
	}
	return plan
}
