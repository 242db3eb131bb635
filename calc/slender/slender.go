// Package slender holds the design-action clauses of EN 1992-1-1 for isolated braced
// columns: geometric imperfections (5.2), minimum eccentricity (6.1(4)), end moments
// (5.8.8.2), slenderness and its limit (5.8.3), second-order moments by nominal
// curvature (5.8.8) and the biaxial check (5.8.9).
//
// Every function takes traced quantities and returns one trace step; its value is the
// step's Value and the step's expression reproduces it.
package slender

import (
	"math"

	"colsheet/calc/trace"
)

const ec2 = "EN 1992-1-1:2004 "

// AlphaH returns the reduction factor for length αh = 2/√l with 2/3 ≤ αh ≤ 1, l in metres,
// EN 1992-1-1:2004 5.2(5).
func AlphaH(id string, l trace.Q) trace.Step {
	v := math.Min(math.Max(2/math.Sqrt(l.V/1000), 2.0/3), 1)
	return trace.Formula(id, "Reduction factor for length", ec2+"5.2(5)", "α_h", "", v,
		"min(max(2 / sqrt(l / 1000), 2 / 3), 1)", trace.A("l", l))
}

// AlphaM returns the reduction factor for the number of members αm = √(0.5·(1 + 1/m)),
// EN 1992-1-1:2004 5.2(5).
func AlphaM(id string, m trace.Q) trace.Step {
	v := math.Sqrt(0.5 * (1 + 1/m.V))
	return trace.Formula(id, "Reduction factor for number of members", ec2+"5.2(5)", "α_m", "", v,
		"sqrt(0.5 * (1 + 1 / m))", trace.A("m", m))
}

// ThetaI returns the inclination θi = θ0·αh·αm, EN 1992-1-1:2004 5.2(5), Eq. (5.1).
func ThetaI(id string, theta0, alphaH, alphaM trace.Q) trace.Step {
	v := theta0.V * alphaH.V * alphaM.V
	return trace.Formula(id, "Inclination imperfection", ec2+"5.2(5), Eq. (5.1)", "θ_i", "", v,
		"theta_0 * alpha_h * alpha_m", trace.A("theta_0", theta0), trace.A("alpha_h", alphaH), trace.A("alpha_m", alphaM))
}

// EccentricityFromInclination returns ei = θi·l0/2 for an isolated member, EN 1992-1-1:2004 5.2(7), Eq. (5.2).
func EccentricityFromInclination(id string, thetaI, l0 trace.Q) trace.Step {
	return trace.Formula(id, "Eccentricity from the imperfection", ec2+"5.2(7), Eq. (5.2)", "e_i", "mm",
		thetaI.V*l0.V/2, "theta_i * l0 / 2", trace.A("theta_i", thetaI), trace.A("l0", l0))
}

// EccentricityL0Over400 returns the simplified ei = l0/400 for isolated members in braced systems,
// EN 1992-1-1:2004 5.2(9).
func EccentricityL0Over400(id string, l0 trace.Q) trace.Step {
	return trace.Formula(id, "Eccentricity from the imperfection (simplified)", ec2+"5.2(9)", "e_i", "mm",
		l0.V/400, "l0 / 400", trace.A("l0", l0))
}

// MinEccentricity returns e0 = max(h/30, 20 mm), EN 1992-1-1:2004 6.1(4).
func MinEccentricity(id string, depth trace.Q) trace.Step {
	return trace.Formula(id, "Minimum eccentricity", ec2+"6.1(4)", "e_0", "mm",
		math.Max(depth.V/30, 20), "max(h / 30, 20)", trace.A("h", depth))
}

// M02 returns the larger end moment in magnitude, taken positive, EN 1992-1-1:2004 5.8.8.2(2).
func M02(id string, top, bottom trace.Q) trace.Step {
	v := math.Max(math.Abs(top.V), math.Abs(bottom.V))
	return trace.Formula(id, "Larger first-order end moment", ec2+"5.8.8.2(2)", "M_02", "Nmm", v,
		"max(abs(M_top), abs(M_bot))", trace.A("M_top", top), trace.A("M_bot", bottom))
}

// M01 returns the smaller end moment in magnitude, negative in double curvature,
// EN 1992-1-1:2004 5.8.8.2(2).
func M01(id string, top, bottom, m02 trace.Q) trace.Step {
	v := 0.0
	if m02.V > 0 {
		v = top.V * bottom.V / m02.V
	}
	s := trace.Formula(id, "Smaller first-order end moment (negative in double curvature)", ec2+"5.8.8.2(2)",
		"M_01", "Nmm", v, "M_02 > 0 ? M_top * M_bot / M_02 : 0",
		trace.A("M_top", top), trace.A("M_bot", bottom), trace.A("M_02", m02))
	if m02.V > 0 {
		return s.Shown("M_top * M_bot / M_02")
	}
	return s.Shown("0")
}

// WithImperfection returns an end moment increased by the imperfection, M + NEd·ei,
// EN 1992-1-1:2004 5.2(7) and 5.8.8.2(1).
func WithImperfection(id, title, symbol string, m, nEd, ei trace.Q) trace.Step {
	return trace.Formula(id, title, ec2+"5.2(7), 5.8.8.2(1)", symbol, "Nmm", m.V+nEd.V*ei.V,
		"M + N_Ed * e_i", trace.A("M", m), trace.A("N_Ed", nEd), trace.A("e_i", ei))
}

// RadiusOfGyration returns i = h/√12 of the uncracked rectangle for bending with lever arm along h,
// EN 1992-1-1:2004 5.8.3.2(1).
func RadiusOfGyration(id string, depth trace.Q) trace.Step {
	return trace.Formula(id, "Radius of gyration of the concrete section", ec2+"5.8.3.2(1)", "i", "mm",
		depth.V/math.Sqrt(12), "h / sqrt(12)", trace.A("h", depth))
}

// RadiusOfGyrationCircle returns i = √(Ic/Ac) = D/4 of a circular section,
// EN 1992-1-1:2004 5.8.3.2(1) (geometry of the circle).
func RadiusOfGyrationCircle(id string, d trace.Q) trace.Step {
	return trace.Formula(id, "Radius of gyration of the circular concrete section", ec2+"5.8.3.2(1)", "i", "mm",
		d.V/4, "D / 4", trace.A("D", d))
}

// RingGyration returns the radius of gyration of n ≥ 3 equal bars evenly spaced on a circle of
// radius rs about any axis through its centre, is = rs/√2, EN 1992-1-1:2004 5.8.8.3(2): with the
// bars at angles ψk, Σ cos²ψk = n/2 for n ≥ 3 (geometry).
func RingGyration(id string, rs trace.Q) trace.Step {
	return trace.Formula(id, "Radius of gyration of the reinforcement on the circle", ec2+"5.8.8.3(2)", "i_s", "mm",
		rs.V/math.Sqrt2, "r_s / sqrt(2)", trace.A("r_s", rs)).
		Note("n ≥ 3 equal bars evenly on a circle have the same radius of gyration about every axis through the centre.")
}

// Slenderness returns λ = l0/i, EN 1992-1-1:2004 5.8.3.2(1), Eq. (5.14).
func Slenderness(id string, l0, i trace.Q) trace.Step {
	return trace.Formula(id, "Slenderness ratio", ec2+"5.8.3.2(1), Eq. (5.14)", "λ", "", l0.V/i.V,
		"l0 / i", trace.A("l0", l0), trace.A("i", i))
}

// RelativeForce returns n = NEd/(Ac·fcd), EN 1992-1-1:2004 5.8.3.1(1).
func RelativeForce(id string, nEd, ac, fcd trace.Q) trace.Step {
	return trace.Formula(id, "Relative normal force", ec2+"5.8.3.1(1)", "n", "", nEd.V/(ac.V*fcd.V),
		"N_Ed / (A_c * f_cd)", trace.A("N_Ed", nEd), trace.A("A_c", ac), trace.A("f_cd", fcd))
}

// MechanicalRatio returns ω = As·fyd/(Ac·fcd), EN 1992-1-1:2004 5.8.3.1(1).
func MechanicalRatio(id string, as, fyd, ac, fcd trace.Q) trace.Step {
	return trace.Formula(id, "Mechanical reinforcement ratio", ec2+"5.8.3.1(1)", "ω", "",
		MechanicalRatioValue(as.V, fyd.V, ac.V, fcd.V), "A_s * f_yd / (A_c * f_cd)",
		trace.A("A_s", as), trace.A("f_yd", fyd), trace.A("A_c", ac), trace.A("f_cd", fcd))
}

// FactorA returns A = 1/(1 + 0.2·φef), EN 1992-1-1:2004 5.8.3.1(1).
func FactorA(id string, phiEf trace.Q) trace.Step {
	return trace.Formula(id, "Factor A for creep", ec2+"5.8.3.1(1)", "A", "", 1/(1+0.2*phiEf.V),
		"1 / (1 + 0.2 * phi_ef)", trace.A("phi_ef", phiEf))
}

// FactorADefault returns the value A = 0.7 the clause allows when φef is not known, EN 1992-1-1:2004 5.8.3.1(1).
func FactorADefault(id string) trace.Step {
	return trace.Input(id, "Factor A for creep (φef not given)", ec2+"5.8.3.1(1)", "A", "", 0.7).
		Note("φef is not given, so the value A = 0.7 that the clause allows is used.")
}

// FactorB returns B = √(1 + 2ω), EN 1992-1-1:2004 5.8.3.1(1).
func FactorB(id string, omega trace.Q) trace.Step {
	return trace.Formula(id, "Factor B for reinforcement", ec2+"5.8.3.1(1)", "B", "", FactorBValue(omega.V),
		"sqrt(1 + 2 * omega)", trace.A("omega", omega))
}

// MomentRatio returns rm = M01/M02, taken as 1 when M02 is zero (moments from imperfections
// only), EN 1992-1-1:2004 5.8.3.1(1).
func MomentRatio(id string, m01, m02 trace.Q) trace.Step {
	v := 1.0
	if m02.V > 0 {
		v = m01.V / m02.V
	}
	s := trace.Formula(id, "Moment ratio", ec2+"5.8.3.1(1)", "r_m", "", v,
		"M_02 > 0 ? M_01 / M_02 : 1", trace.A("M_01", m01), trace.A("M_02", m02))
	if m02.V <= 0 {
		return s.Shown("1").Note("No first-order end moments: rm = 1 as for moments from imperfections only.")
	}
	return s.Shown("M_01 / M_02")
}

// FactorC returns C = 1.7 − rm, EN 1992-1-1:2004 5.8.3.1(1).
func FactorC(id string, rm trace.Q) trace.Step {
	return trace.Formula(id, "Factor C for the moment distribution", ec2+"5.8.3.1(1)", "C", "", 1.7-rm.V,
		"1.7 - r_m", trace.A("r_m", rm))
}

// nFloor keeps λlim finite when NEd is zero: below it second-order effects are nil in practice.
const nFloor = 1e-4

// LambdaLim returns λlim = k·A·B·C/√n with k = 20 recommended, EN 1992-1-1:2004 5.8.3.1(1), Eq. (5.13N).
// n is taken not less than 1e-4 so that the limit stays finite for a column without axial force.
func LambdaLim(id string, k, a, b, c, n trace.Q) trace.Step {
	v := LambdaLimValue(k.V, a.V, b.V, c.V, n.V)
	s := trace.Formula(id, "Slenderness limit", ec2+"5.8.3.1(1), Eq. (5.13N)", "λ_lim", "", v,
		"k * A * B * C / sqrt(max(n, 0.0001))", trace.A("k", k), trace.A("A", a), trace.A("B", b),
		trace.A("C", c), trace.A("n", n))
	if n.V < nFloor {
		return s.Shown("k * A * B * C / sqrt(0.0001)").Note("n is taken as 0.0001 at least, so that the limit is finite without axial force.")
	}
	return s.Shown("k * A * B * C / sqrt(n)")
}

// IsSlender returns 1 when λ > λlim (second-order effects to be considered) and 0 otherwise,
// EN 1992-1-1:2004 5.8.3.1(1).
func IsSlender(id string, lambda, lambdaLim trace.Q) trace.Step {
	v := 0.0
	if lambda.V > lambdaLim.V {
		v = 1
	}
	s := trace.Formula(id, "Second-order effects to be considered", ec2+"5.8.3.1(1)", "slender", "", v,
		"lambda > lambda_lim ? 1 : 0", trace.A("lambda", lambda), trace.A("lambda_lim", lambdaLim)).
		Condition("lambda > lambda_lim")
	if v == 0 {
		return s.Note("λ ≤ λlim: second-order effects may be ignored, M2 = 0.")
	}
	return s.Note("λ > λlim: second-order moment by nominal curvature, 5.8.8.")
}

// YieldStrain returns εyd = fyd/Es, EN 1992-1-1:2004 5.8.8.3(1).
func YieldStrain(id string, fyd, es trace.Q) trace.Step {
	return trace.Formula(id, "Design yield strain of reinforcement", ec2+"5.8.8.3(1)", "ε_yd", "", fyd.V/es.V,
		"f_yd / E_s", trace.A("f_yd", fyd), trace.A("E_s", es))
}

// EffectiveDepth returns d = h/2 + is for reinforcement spread over the section,
// EN 1992-1-1:2004 5.8.8.3(2), Eq. (5.35).
func EffectiveDepth(id string, depth, is trace.Q) trace.Step {
	return trace.Formula(id, "Effective depth for the curvature", ec2+"5.8.8.3(2), Eq. (5.35)", "d", "mm",
		EffectiveDepthValue(depth.V, is.V), "h / 2 + i_s", trace.A("h", depth), trace.A("i_s", is))
}

// BaseCurvature returns 1/r0 = εyd/(0.45·d), EN 1992-1-1:2004 5.8.8.3(1).
func BaseCurvature(id string, epsYd, d trace.Q) trace.Step {
	return trace.Formula(id, "Basic curvature", ec2+"5.8.8.3(1)", "1/r_0", "1/mm", BaseCurvatureValue(epsYd.V, d.V),
		"eps_yd / (0.45 * d)", trace.A("eps_yd", epsYd), trace.A("d", d))
}

// Kr returns the correction for axial load Kr = (nu − n)/(nu − nbal) ≤ 1 with nu = 1 + ω and
// nbal = 0.4, EN 1992-1-1:2004 5.8.8.3(3), Eq. (5.36). It is kept at 0 or more: a negative value
// means NEd is beyond the section's capacity, which the resistance checks report.
func Kr(id string, n, omega trace.Q) trace.Step {
	v := KrValue(n.V, omega.V)
	s := trace.Formula(id, "Correction factor for axial load", ec2+"5.8.8.3(3), Eq. (5.36)", "K_r", "", v,
		"max(min((1 + omega - n) / (1 + omega - 0.4), 1), 0)", trace.A("n", n), trace.A("omega", omega))
	if v > 0 {
		return s.Shown("min((1 + omega - n) / (1 + omega - 0.4), 1)")
	}
	return s.Shown("0").Note("n exceeds nu = 1 + ω: Kr is kept at 0; the resistance checks report the axial force.")
}

// Beta returns β = 0.35 + fck/200 − λ/150, EN 1992-1-1:2004 5.8.8.3(4).
func Beta(id string, fck, lambda trace.Q) trace.Step {
	return trace.Formula(id, "Creep coefficient factor", ec2+"5.8.8.3(4)", "β", "", BetaValue(fck.V, lambda.V),
		"0.35 + f_ck / 200 - lambda / 150", trace.A("f_ck", fck), trace.A("lambda", lambda))
}

// Kphi returns the creep factor Kφ = 1 + β·φef ≥ 1, EN 1992-1-1:2004 5.8.8.3(4), Eq. (5.37).
func Kphi(id string, beta, phiEf trace.Q) trace.Step {
	return trace.Formula(id, "Factor for creep", ec2+"5.8.8.3(4), Eq. (5.37)", "K_φ", "", KphiValue(beta.V, phiEf.V),
		"max(1 + beta * phi_ef, 1)", trace.A("beta", beta), trace.A("phi_ef", phiEf))
}

// Curvature returns 1/r = Kr·Kφ·1/r0, EN 1992-1-1:2004 5.8.8.3(1), Eq. (5.34).
func Curvature(id string, kr, kphi, r0 trace.Q) trace.Step {
	return trace.Formula(id, "Design curvature", ec2+"5.8.8.3(1), Eq. (5.34)", "1/r", "1/mm", CurvatureValue(kr.V, kphi.V, r0.V),
		"K_r * K_phi * inv_r0", trace.A("K_r", kr), trace.A("K_phi", kphi), trace.A("inv_r0", r0))
}

// SecondOrderEccentricity returns e2 = (1/r)·l0²/c, EN 1992-1-1:2004 5.8.8.2(3)-(4).
func SecondOrderEccentricity(id string, curv, l0, c trace.Q) trace.Step {
	return trace.Formula(id, "Deflection (second-order eccentricity)", ec2+"5.8.8.2(3), (4)", "e_2", "mm",
		SecondOrderEccentricityValue(curv.V, l0.V, c.V), "inv_r * l0 ** 2 / c", trace.A("inv_r", curv), trace.A("l0", l0), trace.A("c", c))
}

// SecondOrderMoment returns M2 = NEd·e2, EN 1992-1-1:2004 5.8.8.2(3), Eq. (5.33).
func SecondOrderMoment(id string, nEd, e2 trace.Q) trace.Step {
	return trace.Formula(id, "Nominal second-order moment", ec2+"5.8.8.2(3), Eq. (5.33)", "M_2", "Nmm",
		nEd.V*e2.V, "N_Ed * e_2", trace.A("N_Ed", nEd), trace.A("e_2", e2))
}

// EquivalentMoment returns M0e = 0.6·M02 + 0.4·M01 ≥ 0.4·M02, EN 1992-1-1:2004 5.8.8.2(2), Eq. (5.32).
func EquivalentMoment(id string, m01, m02 trace.Q) trace.Step {
	v := EquivalentMomentValue(m01.V, m02.V)
	return trace.Formula(id, "Equivalent first-order moment", ec2+"5.8.8.2(2), Eq. (5.32)", "M_0e", "Nmm", v,
		"max(0.6 * M_02 + 0.4 * M_01, 0.4 * M_02)", trace.A("M_01", m01), trace.A("M_02", m02))
}

// DesignMomentSlender returns MEd = max{M02, M0e + M2, M01 + 0.5·M2, NEd·e0}, the end and mid-height
// envelope of EN 1992-1-1:2004 5.8.8.2 with the minimum of 6.1(4), as commonly applied.
func DesignMomentSlender(id string, m01, m02, m0e, m2, nEd, e0 trace.Q) trace.Step {
	v := DesignMomentSlenderValue(m01.V, m02.V, m0e.V, m2.V, nEd.V, e0.V)
	return trace.Formula(id, "Design moment", ec2+"5.8.8.2(1)-(3), Fig. 5.2; 6.1(4)", "M_Ed", "Nmm", v,
		"max(M_02, M_0e + M_2, M_01 + 0.5 * M_2, N_Ed * e_0)",
		trace.A("M_02", m02), trace.A("M_0e", m0e), trace.A("M_2", m2), trace.A("M_01", m01),
		trace.A("N_Ed", nEd), trace.A("e_0", e0))
}

// DesignMomentStocky returns MEd = max{M02, NEd·e0} for a column whose second-order effects may be
// ignored, EN 1992-1-1:2004 5.8.3.1(1) and 6.1(4).
func DesignMomentStocky(id string, m02, nEd, e0 trace.Q) trace.Step {
	return trace.Formula(id, "Design moment", ec2+"5.8.3.1(1); 6.1(4)", "M_Ed", "Nmm", DesignMomentStockyValue(m02.V, nEd.V, e0.V),
		"max(M_02, N_Ed * e_0)", trace.A("M_02", m02), trace.A("N_Ed", nEd), trace.A("e_0", e0))
}

// SlendernessRatiosClose returns 1 when λy/λz ≤ 2 and λz/λy ≤ 2, EN 1992-1-1:2004 5.8.9(3), Eq. (5.38a).
func SlendernessRatiosClose(id string, lambdaY, lambdaZ trace.Q) trace.Step {
	v := 0.0
	if SlendernessRatiosCloseValue(lambdaY.V, lambdaZ.V) {
		v = 1
	}
	return trace.Formula(id, "Slenderness ratios within a factor 2", ec2+"5.8.9(3), Eq. (5.38a)", "c_a", "", v,
		"lambda_y <= 2 * lambda_z && lambda_z <= 2 * lambda_y ? 1 : 0", trace.A("lambda_y", lambdaY), trace.A("lambda_z", lambdaZ)).
		Condition("lambda_y / lambda_z <= 2 && lambda_z / lambda_y <= 2")
}

// EccentricitiesApart returns 1 when one relative eccentricity is at most 0.2 times the other,
// (ey/b)/(ez/h) ≤ 0.2 or (ez/h)/(ey/b) ≤ 0.2 with ey = MEdz/NEd and ez = MEdy/NEd,
// EN 1992-1-1:2004 5.8.9(3), Eq. (5.38b). NEd cancels, so the moments are compared directly.
func EccentricitiesApart(id string, mEdY, mEdZ, b, h trace.Q) trace.Step {
	v := 0.0
	if EccentricitiesApartValue(mEdY.V, mEdZ.V, b.V, h.V) {
		v = 1
	}
	s := trace.Formula(id, "Relative eccentricities apart by a factor 5", ec2+"5.8.9(3), Eq. (5.38b)", "c_b", "", v,
		"min(M_Edz / b, M_Edy / h) <= 0.2 * max(M_Edz / b, M_Edy / h) ? 1 : 0",
		trace.A("M_Edy", mEdY), trace.A("M_Edz", mEdZ), trace.A("b", b), trace.A("h", h))
	if mEdY.V > 0 && mEdZ.V > 0 {
		return s.Condition("(M_Edz / b) / (M_Edy / h) <= 0.2 || (M_Edy / h) / (M_Edz / b) <= 0.2")
	}
	return s.Condition("min(M_Edz / b, M_Edy / h) <= 0.2 * max(M_Edz / b, M_Edy / h)")
}

// NRdBiaxial returns NRd = Ac·fcd + As·fyd for the exponent of (5.39), EN 1992-1-1:2004 5.8.9(4).
func NRdBiaxial(id string, ac, fcd, as, fyd trace.Q) trace.Step {
	return trace.Formula(id, "Design axial resistance for the biaxial exponent", ec2+"5.8.9(4)", "N_Rd", "N",
		NRdBiaxialValue(ac.V, fcd.V, as.V, fyd.V), "A_c * f_cd + A_s * f_yd",
		trace.A("A_c", ac), trace.A("f_cd", fcd), trace.A("A_s", as), trace.A("f_yd", fyd))
}

// ExponentA returns the exponent a of (5.39), linear between NEd/NRd = 0.1, 0.7 and 1.0 where
// a = 1.0, 1.5 and 2.0, EN 1992-1-1:2004 5.8.9(4).
func ExponentA(id string, nEd, nRd trace.Q) trace.Step {
	v := ExponentAValue(nEd.V, nRd.V)
	s := trace.Formula(id, "Exponent for the biaxial check", ec2+"5.8.9(4)", "a", "", v,
		"min(max(N_Ed / N_Rd <= 0.7 ? 1 + (N_Ed / N_Rd - 0.1) * 0.5 / 0.6 : 1.5 + (N_Ed / N_Rd - 0.7) * 0.5 / 0.3, 1), 2)",
		trace.A("N_Ed", nEd), trace.A("N_Rd", nRd))
	// The line of the interpolation that applies, or the end value where N_Ed/N_Rd lies outside.
	switch r := nEd.V / nRd.V; {
	case r <= 0.1:
		return s.Shown("1").Note("N_Ed/N_Rd ≤ 0.1: a = 1.")
	case r <= 0.7:
		return s.Shown("1 + (N_Ed / N_Rd - 0.1) / 0.6 * 0.5")
	case r < 1:
		return s.Shown("1.5 + (N_Ed / N_Rd - 0.7) / 0.3 * 0.5")
	}
	return s.Shown("2").Note("N_Ed/N_Rd ≥ 1: a = 2.")
}

// BiaxialRatio returns (MEdz/MRdz)^a + (MEdy/MRdy)^a, EN 1992-1-1:2004 5.8.9(4), Eq. (5.39).
// The resistances must be positive.
func BiaxialRatio(id string, mEdY, mRdY, mEdZ, mRdZ, a trace.Q) trace.Step {
	v := BiaxialRatioValue(mEdY.V, mRdY.V, mEdZ.V, mRdZ.V, a.V)
	return trace.Check(id, "Biaxial bending", ec2+"5.8.9(4), Eq. (5.39)",
		"(M_Edz/M_Rdz)^a + (M_Edy/M_Rdy)^a ≤ 1", v,
		"(M_Edz / M_Rdz) ** a + (M_Edy / M_Rdy) ** a",
		trace.A("M_Edz", mEdZ), trace.A("M_Rdz", mRdZ), trace.A("M_Edy", mEdY), trace.A("M_Rdy", mRdY), trace.A("a", a))
}

// Layer is a row of equal bars at one coordinate along the bending direction.
type Layer struct {
	Coord float64 // mm from the centroid
	Count int     // bars in the row
}

// ReinforcementGyration returns is, the radius of gyration of the total reinforcement about the
// centroid, EN 1992-1-1:2004 5.8.8.3(2), for equal bars in m rows evenly spaced between the two
// outer rows at ±c, n_o bars in each outer row and two in each row between:
// is = c·√((n_o + m(m + 1)/(3(m − 1)) − 2)/(n_o + m − 2)), which is √(Σ n·c²/Σ n) summed in
// closed form (the mean square of m evenly spaced points on [−1, 1] is (m + 1)/(3(m − 1))).
func ReinforcementGyration(id string, edge, outer, rows trace.Q) trace.Step {
	return trace.Formula(id, "Radius of gyration of the reinforcement", ec2+"5.8.8.3(2)", "i_s", "mm",
		SymmetricGyrationValue(edge.V, outer.V, rows.V),
		"c * sqrt((n_o + m * (m + 1) / (3 * (m - 1)) - 2) / (n_o + m - 2))",
		trace.A("c", edge), trace.A("n_o", outer), trace.A("m", rows)).
		Note("c: distance of the outer rows of bars from the centroid; n_o: bars in each outer row; m: rows of bars, evenly spaced, two bars in each row between the outer ones.")
}

func itoa(i int) string {
	if i < 10 {
		return string(rune('0' + i))
	}
	return itoa(i/10) + string(rune('0'+i%10))
}
