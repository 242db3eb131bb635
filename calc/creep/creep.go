// Package creep holds the creep coefficient of EN 1992-1-1:2004 Annex B and the effective
// creep ratio of 5.8.4 used by the slenderness and second-order clauses.
//
// Units: stresses in MPa, lengths in mm, time in days, relative humidity in %. The ambient
// temperature is taken as 20 °C, so the temperature-adjusted age of (B.10) equals the age.
// Every step function takes traced quantities and returns one trace step whose expression
// reproduces its value; the value functions in values.go hold the same formulas without a trace.
package creep

import (
	"colsheet/calc/trace"
)

const annexB = "EN 1992-1-1:2004 Annex B, "

// Cement classes of EN 1992-1-1:2004 3.1.2(6).
const (
	CementS = "S" // slow hardening
	CementN = "N" // normal hardening
	CementR = "R" // rapid hardening
)

// NotionalSize returns h0 = 2Ac/u, EN 1992-1-1:2004 3.1.4(5) and Annex B, Eq. (B.6).
func NotionalSize(id string, ac, u trace.Q) trace.Step {
	return trace.Formula(id, "Notional size of the member", annexB+"Eq. (B.6)", "h_0", "mm",
		NotionalSizeValue(ac.V, u.V), "2 * A_c / u", trace.A("A_c", ac), trace.A("u", u))
}

// NotionalSizeRect returns h0 = 2·b·h/(2(b + h)) of a rectangle drying on all four faces,
// EN 1992-1-1:2004 Annex B, Eq. (B.6).
func NotionalSizeRect(id string, b, h trace.Q) trace.Step {
	return trace.Formula(id, "Notional size of the member", annexB+"Eq. (B.6)", "h_0", "mm",
		NotionalSizeRectValue(b.V, h.V), "2 * b * h / (2 * (b + h))", trace.A("b", b), trace.A("h", h)).
		Note("The perimeter exposed to drying is taken as the whole perimeter, u = 2(b + h).")
}

// NotionalSizeCircle returns h0 = 2·Ac/u = D/2 of a circular member drying all round,
// EN 1992-1-1:2004 Annex B, Eq. (B.6).
func NotionalSizeCircle(id string, d trace.Q) trace.Step {
	return trace.Formula(id, "Notional size of the circular member", annexB+"Eq. (B.6)", "h_0", "mm",
		d.V/2, "2 * (3.141592653589793 * D ** 2 / 4) / (3.141592653589793 * D)", trace.A("D", d)).
		Shown("2 * (pi * D ** 2 / 4) / (pi * D)").
		Note("The perimeter exposed to drying is taken as the whole perimeter, u = π·D.")
}

// Alpha1 returns α1 = (35/fcm)^0.7, EN 1992-1-1:2004 Annex B, Eq. (B.8c).
func Alpha1(id string, fcm trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient for the concrete strength", annexB+"Eq. (B.8c)", "α_1", "",
		Alpha1Value(fcm.V), "(35 / f_cm) ** 0.7", trace.A("f_cm", fcm))
}

// Alpha2 returns α2 = (35/fcm)^0.2, EN 1992-1-1:2004 Annex B, Eq. (B.8c).
func Alpha2(id string, fcm trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient for the concrete strength", annexB+"Eq. (B.8c)", "α_2", "",
		Alpha2Value(fcm.V), "(35 / f_cm) ** 0.2", trace.A("f_cm", fcm))
}

// Alpha3 returns α3 = (35/fcm)^0.5, EN 1992-1-1:2004 Annex B, Eq. (B.8c).
func Alpha3(id string, fcm trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient for the concrete strength", annexB+"Eq. (B.8c)", "α_3", "",
		Alpha3Value(fcm.V), "(35 / f_cm) ** 0.5", trace.A("f_cm", fcm))
}

// PhiRH returns the factor for relative humidity φRH by Eq. (B.3a) for fcm ≤ 35 MPa and (B.3b)
// above, EN 1992-1-1:2004 Annex B; α1 and α2 enter only above 35 MPa.
func PhiRH(id string, rh, h0, fcm, alpha1, alpha2 trace.Q) trace.Step {
	clause := annexB + "Eq. (B.3a)"
	if fcm.V > 35 {
		clause = annexB + "Eq. (B.3b)"
	}
	s := trace.Formula(id, "Factor for the relative humidity", clause, "φ_RH", "",
		PhiRHValue(rh.V, h0.V, fcm.V, alpha1.V, alpha2.V),
		"f_cm <= 35 ? 1 + (1 - RH / 100) / (0.1 * h_0 ** (1 / 3)) : (1 + (1 - RH / 100) / (0.1 * h_0 ** (1 / 3)) * alpha_1) * alpha_2",
		trace.A("RH", rh), trace.A("h_0", h0), trace.A("f_cm", fcm), trace.A("alpha_1", alpha1), trace.A("alpha_2", alpha2))
	if fcm.V > 35 {
		return s.Shown("(1 + (1 - RH / 100) / (0.1 * h_0 ** (1 / 3)) * alpha_1) * alpha_2")
	}
	return s.Shown("1 + (1 - RH / 100) / (0.1 * h_0 ** (1 / 3))")
}

// BetaFcm returns the factor for the concrete strength β(fcm) = 16.8/√fcm, EN 1992-1-1:2004 Annex B, Eq. (B.4).
func BetaFcm(id string, fcm trace.Q) trace.Step {
	return trace.Formula(id, "Factor for the concrete strength", annexB+"Eq. (B.4)", "β(fcm)", "",
		BetaFcmValue(fcm.V), "16.8 / sqrt(f_cm)", trace.A("f_cm", fcm))
}

// CementExponentStep returns the exponent α of Eq. (B.9) for the cement class (−1 for S, 0 for N,
// 1 for R), or false for another class, EN 1992-1-1:2004 Annex B, Eq. (B.9) and 3.1.2(6).
func CementExponentStep(id, class string) (trace.Step, bool) {
	v, ok := CementExponent(class)
	if !ok {
		return trace.Step{}, false
	}
	return trace.Table(id, "Exponent for the type of cement", annexB+"Eq. (B.9); 3.1.2(6)",
		"cement class "+class, "α", "", v), true
}

// AdjustedAge returns the age at loading adjusted for the type of cement,
// t0 = t0,T·(9/(2 + t0,T^1.2) + 1)^α ≥ 0.5 days, with t0,T of (B.10) taken as the age at loading
// (curing at 20 °C), EN 1992-1-1:2004 Annex B, Eq. (B.9).
func AdjustedAge(id string, t0T, alpha trace.Q) trace.Step {
	return trace.Formula(id, "Age at loading adjusted for the type of cement", annexB+"Eq. (B.9)", "t_0", "d",
		AdjustedAgeValue(t0T.V, alpha.V), "max(t_0T * (9 / (2 + t_0T ** 1.2) + 1) ** alpha, 0.5)",
		trace.A("t_0T", t0T), trace.A("alpha", alpha)).
		Note("The concrete is taken to cure at 20 °C, so the temperature-adjusted age of Eq. (B.10) equals the actual age.")
}

// BetaT0 returns the factor for the age at loading β(t0) = 1/(0.1 + t0^0.20), EN 1992-1-1:2004 Annex B, Eq. (B.5).
func BetaT0(id string, t0 trace.Q) trace.Step {
	return trace.Formula(id, "Factor for the age at loading", annexB+"Eq. (B.5)", "β(t0)", "",
		BetaT0Value(t0.V), "1 / (0.1 + t_0 ** 0.2)", trace.A("t_0", t0))
}

// Notional returns the notional creep coefficient φ0 = φRH·β(fcm)·β(t0), which is also
// φ(∞, t0) since βc(∞, t0) = 1, EN 1992-1-1:2004 Annex B, Eq. (B.1) and (B.2).
func Notional(id string, phiRH, betaFcm, betaT0 trace.Q) trace.Step {
	return trace.Formula(id, "Final creep coefficient", annexB+"Eq. (B.1), (B.2)", "φ(∞,t0)", "",
		NotionalValue(phiRH.V, betaFcm.V, betaT0.V), "phi_RH * beta_fcm * beta_t0",
		trace.A("phi_RH", phiRH), trace.A("beta_fcm", betaFcm), trace.A("beta_t0", betaT0)).
		Note("φ(∞, t0) = φ0 because βc(t, t0) tends to 1 as t tends to infinity; valid for a compressive stress at loading not above 0.45·fck(t0), EN 1992-1-1:2004 3.1.4(2).")
}

// BetaH returns βH = 1.5·[1 + (0.012·RH)^18]·h0 + 250·α3 ≤ 1500·α3, with α3 = 1 for fcm ≤ 35 MPa,
// EN 1992-1-1:2004 Annex B, Eq. (B.8a) and (B.8b).
func BetaH(id string, rh, h0, fcm, alpha3 trace.Q) trace.Step {
	clause := annexB + "Eq. (B.8a)"
	if fcm.V > 35 {
		clause = annexB + "Eq. (B.8b)"
	}
	s := trace.Formula(id, "Coefficient for the development of creep with time", clause, "β_H", "",
		BetaHValue(rh.V, h0.V, fcm.V, alpha3.V),
		"f_cm <= 35 ? min(1.5 * (1 + (0.012 * RH) ** 18) * h_0 + 250, 1500) : min(1.5 * (1 + (0.012 * RH) ** 18) * h_0 + 250 * alpha_3, 1500 * alpha_3)",
		trace.A("RH", rh), trace.A("h_0", h0), trace.A("f_cm", fcm), trace.A("alpha_3", alpha3))
	if fcm.V > 35 {
		return s.Shown("min(1.5 * (1 + (0.012 * RH) ** 18) * h_0 + 250 * alpha_3, 1500 * alpha_3)")
	}
	return s.Shown("min(1.5 * (1 + (0.012 * RH) ** 18) * h_0 + 250, 1500)")
}

// BetaC returns βc(t, t0) = [(t − t0)/(βH + t − t0)]^0.3, 0 before loading, EN 1992-1-1:2004 Annex B, Eq. (B.7).
func BetaC(id string, t, t0, betaH trace.Q) trace.Step {
	s := trace.Formula(id, "Development of creep with time after loading", annexB+"Eq. (B.7)", "β_c(t,t0)", "",
		BetaCValue(t.V, t0.V, betaH.V), "t > t_0 ? ((t - t_0) / (beta_H + t - t_0)) ** 0.3 : 0",
		trace.A("t", t), trace.A("t_0", t0), trace.A("beta_H", betaH))
	if t.V > t0.V {
		return s.Shown("((t - t_0) / (beta_H + t - t_0)) ** 0.3")
	}
	return s.Shown("0").Note("Not yet loaded at the time t: no creep.")
}

// AtTime returns φ(t, t0) = φ0·βc(t, t0), EN 1992-1-1:2004 Annex B, Eq. (B.1).
func AtTime(id string, phi0, betaC trace.Q) trace.Step {
	return trace.Formula(id, "Creep coefficient at time t", annexB+"Eq. (B.1)", "φ(t,t0)", "",
		phi0.V*betaC.V, "phi_0 * beta_c", trace.A("phi_0", phi0), trace.A("beta_c", betaC))
}

// EffectiveRatio returns φef = φ(∞, t0)·M0Eqp/M0Ed, EN 1992-1-1:2004 5.8.4(2), Eq. (5.19);
// ratio is M0Eqp/M0Ed.
func EffectiveRatio(id string, phiInf, ratio trace.Q) trace.Step {
	s := trace.Formula(id, "Effective creep ratio", "EN 1992-1-1:2004 5.8.4(2), Eq. (5.19)", "φ_ef", "",
		EffectiveRatioValue(phiInf.V, ratio.V), "phi_inf * r_qp", trace.A("phi_inf", phiInf), trace.A("r_qp", ratio))
	if ratio.V > 1 {
		s = s.Caution("The quasi-permanent first-order moment exceeds the design first-order moment (M0Eqp/M0Ed > 1); check the load combinations.")
	}
	if ratio.V < 0 {
		s = s.Caution("M0Eqp/M0Ed is negative: the quasi-permanent and design moments act in opposite senses; check the load combinations.")
	}
	return s
}

// MayIgnore reports whether φef may be taken as 0: φ(∞, t0) ≤ 2, λ ≤ 75 and M0Ed/NEd ≥ h,
// EN 1992-1-1:2004 5.8.4(4); the last condition is tested as M0Ed ≥ h·NEd, which holds without axial force.
func MayIgnore(phiInf, lambda, m0Ed, nEd, h float64) bool {
	return phiInf <= 2 && lambda <= 75 && m0Ed >= h*nEd
}

// MayIgnoreStep returns 1 when φef may be taken as 0 (φ(∞, t0) ≤ 2, λ ≤ 75 and M0Ed/NEd ≥ h)
// and 0 otherwise, EN 1992-1-1:2004 5.8.4(4).
func MayIgnoreStep(id string, phiInf, lambda, m0Ed, nEd, h trace.Q) trace.Step {
	v := 0.0
	if MayIgnore(phiInf.V, lambda.V, m0Ed.V, nEd.V, h.V) {
		v = 1
	}
	s := trace.Formula(id, "Creep may be ignored", "EN 1992-1-1:2004 5.8.4(4)", "c_φ", "", v,
		"phi_inf <= 2 && lambda <= 75 && M_0Ed >= h * N_Ed ? 1 : 0",
		trace.A("phi_inf", phiInf), trace.A("lambda", lambda), trace.A("M_0Ed", m0Ed), trace.A("N_Ed", nEd), trace.A("h", h))
	if nEd.V > 0 {
		s = s.Condition("phi_inf <= 2 && lambda <= 75 && M_0Ed / N_Ed >= h")
	} else {
		s = s.Condition("phi_inf <= 2 && lambda <= 75 && M_0Ed >= h * N_Ed")
	}
	if v == 1 {
		return s.Note("φ(∞, t0) ≤ 2, λ ≤ 75 and M0Ed/NEd ≥ h: the effects of creep may be ignored, φef = 0.")
	}
	return s.Note("The conditions of 5.8.4(4) are not all met: the effective creep ratio is used.")
}

// Coefficient records the steps of φ(∞, t0) by Annex B in the log, with IDs under base, and returns
// φ(∞, t0), from fcm in MPa, RH in %, h0 in mm, the age at loading t0T in days and the cement
// exponent alpha of Eq. (B.9), citing its clauses through the step functions above.
func Coefficient(l *trace.Log, base string, fcm, rh, h0, t0T, alpha trace.Q) trace.Q {
	a1, a2 := trace.Const(1, "α_1", ""), trace.Const(1, "α_2", "")
	if fcm.V > 35 {
		a1 = l.Add(Alpha1(base+"alpha_1", fcm))
		a2 = l.Add(Alpha2(base+"alpha_2", fcm))
	}
	phiRH := l.Add(PhiRH(base+"phi_RH", rh, h0, fcm, a1, a2))
	bf := l.Add(BetaFcm(base+"beta_fcm", fcm))
	t0 := l.Add(AdjustedAge(base+"t0", t0T, alpha))
	bt := l.Add(BetaT0(base+"beta_t0", t0))
	return l.Add(Notional(base+"phi_inf", phiRH, bf, bt))
}
