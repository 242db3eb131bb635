package slender

import (
	"math"

	"colsheet/calc/trace"
)

// This file holds the second-order analysis by nominal stiffness, EN 1992-1-1:2004 5.8.7, as an
// alternative to nominal curvature: the stiffness EI of (5.21), the buckling load NB and the
// magnified design moment of (5.28). EI depends on the reinforcement, so a design that does not
// yet know its bars evaluates these steps for each candidate pattern (5.8.7.2(4)).

// GammaCE is the recommended partial factor γcE for the design modulus of concrete, EN 1992-1-1:2004 5.8.6(3).
const GammaCE = 1.2

// MomentShape names the distribution of the first-order moment along the member for c0 of 5.8.7.3(2).
type MomentShape int

// The moment distributions of EN 1992-1-1:2004 5.8.7.3(2) to (4).
const (
	ShapeConstant   MomentShape = iota // constant first-order moment, or M0e of (5.32) for differing end moments (5.8.7.3(3)): c0 = 8
	ShapeParabolic                     // parabolic: c0 = 9.6
	ShapeTriangular                    // symmetric triangular: c0 = 12
	ShapeOther                         // any other: β = 1 (c0 = π²), 5.8.7.3(4), Eq. (5.30)
)

// SteelRatio returns the geometric reinforcement ratio ρ = As/Ac, EN 1992-1-1:2004 5.8.7.2(1).
func SteelRatio(id string, as, ac trace.Q) trace.Step {
	return trace.Formula(id, "Geometric reinforcement ratio", ec2+"5.8.7.2(1)", "ρ", "", SteelRatioValue(as.V, ac.V),
		"A_s / A_c", trace.A("A_s", as), trace.A("A_c", ac))
}

// Ecd returns the design modulus of concrete Ecd = Ecm/γcE, EN 1992-1-1:2004 5.8.6(3), Eq. (5.20).
func Ecd(id string, ecm, gammaCE trace.Q) trace.Step {
	return trace.Formula(id, "Design modulus of elasticity of concrete", ec2+"5.8.6(3), Eq. (5.20)", "E_cd", "MPa",
		EcdValue(ecm.V, gammaCE.V), "E_cm / gamma_cE", trace.A("E_cm", ecm), trace.A("gamma_cE", gammaCE))
}

// K1 returns the factor for the concrete strength class k1 = √(fck/20), EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.23).
func K1(id string, fck trace.Q) trace.Step {
	return trace.Formula(id, "Factor for the concrete strength class", ec2+"5.8.7.2(2), Eq. (5.23)", "k_1", "",
		K1Value(fck.V), "sqrt(f_ck / 20)", trace.A("f_ck", fck))
}

// K2 returns the factor for axial force and slenderness k2 = n·λ/170 ≤ 0.20, EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.24).
func K2(id string, n, lambda trace.Q) trace.Step {
	return trace.Formula(id, "Factor for axial force and slenderness", ec2+"5.8.7.2(2), Eq. (5.24)", "k_2", "",
		K2Value(n.V, lambda.V), "min(n * lambda / 170, 0.2)", trace.A("n", n), trace.A("lambda", lambda))
}

// K2NoSlenderness returns k2 = n·0.30 ≤ 0.20 for use when λ is not defined, EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.25).
func K2NoSlenderness(id string, n trace.Q) trace.Step {
	return trace.Formula(id, "Factor for axial force (slenderness not defined)", ec2+"5.8.7.2(2), Eq. (5.25)", "k_2", "",
		K2NoSlendernessValue(n.V), "min(n * 0.3, 0.2)", trace.A("n", n))
}

// Kc returns the factor for the effects of cracking and creep Kc = k1·k2/(1 + φef),
// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.22).
func Kc(id string, k1, k2, phiEf trace.Q) trace.Step {
	return trace.Formula(id, "Factor for the effects of cracking and creep", ec2+"5.8.7.2(2), Eq. (5.22)", "K_c", "",
		KcValue(k1.V, k2.V, phiEf.V), "k_1 * k_2 / (1 + phi_ef)", trace.A("k_1", k1), trace.A("k_2", k2), trace.A("phi_ef", phiEf))
}

// Ks returns the factor for the contribution of the reinforcement Ks = 1, with a caution when
// ρ < 0.002 lies outside the range of the equation, EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.22).
func Ks(id string, rho trace.Q) trace.Step {
	s := trace.Table(id, "Factor for the contribution of the reinforcement", ec2+"5.8.7.2(2), Eq. (5.22)", "ρ ≥ 0.002",
		"K_s", "", 1)
	if rho.V < 0.002 {
		s = s.Caution("The reinforcement ratio is below 0.002, outside the range of Eq. (5.22): the nominal stiffness does not apply.")
	}
	return s
}

// KcSimplified returns the simplified Kc = 0.3/(1 + 0.5·φef), to be used with Ks = 0 and ρ ≥ 0.01,
// EN 1992-1-1:2004 5.8.7.2(3), Eq. (5.26).
func KcSimplified(id string, rho, phiEf trace.Q) trace.Step {
	s := trace.Formula(id, "Factor for the effects of cracking and creep (simplified)", ec2+"5.8.7.2(3), Eq. (5.26)", "K_c", "",
		KcSimplifiedValue(phiEf.V), "0.3 / (1 + 0.5 * phi_ef)", trace.A("phi_ef", phiEf)).
		Note("The simplified factors take no account of the reinforcement: Ks = 0.")
	if rho.V < 0.01 {
		s = s.Caution("The reinforcement ratio is below 0.01: the simplification of Eq. (5.26) does not apply; use Eq. (5.22).")
	}
	return s
}

// KsSimplified returns Ks = 0, which goes with the simplified Kc of (5.26), EN 1992-1-1:2004 5.8.7.2(3), Eq. (5.26).
func KsSimplified(id string) trace.Step {
	return trace.Table(id, "Factor for the contribution of the reinforcement (simplified)", ec2+"5.8.7.2(3), Eq. (5.26)",
		"ρ ≥ 0.01, simplified", "K_s", "", 0)
}

// ConcreteInertia returns the second moment of area of the rectangular concrete section Ic = b·h³/12
// about the axis with lever arm along h, EN 1992-1-1:2004 5.8.7.2(1).
func ConcreteInertia(id string, b, depth trace.Q) trace.Step {
	return trace.Formula(id, "Second moment of area of the concrete section", ec2+"5.8.7.2(1)", "I_c", "mm4",
		ConcreteInertiaValue(b.V, depth.V), "b * h ** 3 / 12", trace.A("b", b), trace.A("h", depth))
}

// SteelInertia returns the second moment of area of the reinforcement about the centre of the
// concrete area Is = As·is², with is its radius of gyration, EN 1992-1-1:2004 5.8.7.2(1).
func SteelInertia(id string, as, is trace.Q) trace.Step {
	return trace.Formula(id, "Second moment of area of the reinforcement", ec2+"5.8.7.2(1)", "I_s", "mm4",
		SteelInertiaValue(as.V, is.V), "A_s * i_s ** 2", trace.A("A_s", as), trace.A("i_s", is))
}

// NominalStiffness returns EI = Kc·Ecd·Ic + Ks·Es·Is, EN 1992-1-1:2004 5.8.7.2(1), Eq. (5.21).
func NominalStiffness(id string, kc, ecd, ic, ks, es, is trace.Q) trace.Step {
	return trace.Formula(id, "Nominal stiffness", ec2+"5.8.7.2(1), Eq. (5.21)", "EI", "Nmm2",
		NominalStiffnessValue(kc.V, ecd.V, ic.V, ks.V, es.V, is.V), "K_c * E_cd * I_c + K_s * E_s * I_s",
		trace.A("K_c", kc), trace.A("E_cd", ecd), trace.A("I_c", ic), trace.A("K_s", ks), trace.A("E_s", es), trace.A("I_s", is))
}

// BucklingLoad returns the buckling load based on the nominal stiffness NB = π²·EI/l0²,
// EN 1992-1-1:2004 5.8.7.3(1).
func BucklingLoad(id string, ei, l0 trace.Q) trace.Step {
	return trace.Formula(id, "Buckling load based on the nominal stiffness", ec2+"5.8.7.3(1)", "N_B", "N",
		BucklingLoadValue(ei.V, l0.V), "pi ** 2 * EI / l0 ** 2",
		trace.A("pi", trace.Const(math.Pi, "π", "")), trace.A("EI", ei), trace.A("l0", l0))
}

// C0 returns the coefficient c0 for the distribution of the first-order moment (8 constant or M0e,
// 9.6 parabolic, 12 symmetric triangular, π² otherwise so that β = 1), EN 1992-1-1:2004 5.8.7.3(2)-(4).
func C0(id string, shape MomentShape) trace.Step {
	row := map[MomentShape]string{
		ShapeConstant:   "constant first-order moment (or M0e, Eq. (5.32))",
		ShapeParabolic:  "parabolic first-order moment",
		ShapeTriangular: "symmetric triangular first-order moment",
		ShapeOther:      "other distribution: β = 1",
	}[shape]
	clause := ec2 + "5.8.7.3(2)"
	switch shape {
	case ShapeConstant:
		clause = ec2 + "5.8.7.3(2), (3)"
	case ShapeOther:
		clause = ec2 + "5.8.7.3(4), Eq. (5.30)"
	}
	s := trace.Table(id, "Coefficient for the distribution of the first-order moment", clause, row, "c_0", "", C0Value(shape))
	if shape == ShapeConstant {
		s = s.Note("For a member without transverse load, differing end moments are replaced by the equivalent constant moment M0e of Eq. (5.32), with c0 = 8, 5.8.7.3(3).")
	}
	return s
}

// MomentBeta returns the factor β = π²/c0 of the magnification, EN 1992-1-1:2004 5.8.7.3(2), Eq. (5.29).
func MomentBeta(id string, c0 trace.Q) trace.Step {
	return trace.Formula(id, "Factor for the distribution of first- and second-order moments", ec2+"5.8.7.3(2), Eq. (5.29)", "β", "",
		MomentBetaValue(c0.V), "pi ** 2 / c_0", trace.A("pi", trace.Const(math.Pi, "π", "")), trace.A("c_0", c0))
}

// Magnification returns the factor 1 + β/(NB/NEd − 1) on the first-order moment, written as
// 1 + β·NEd/(NB − NEd), 1 without axial compression, and 0 with a caution when NEd ≥ NB and the
// column buckles (see BucklingCheck), EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28).
func Magnification(id string, beta, nB, nEd trace.Q) trace.Step {
	v, ok := MagnificationValue(beta.V, nB.V, nEd.V)
	s := trace.Formula(id, "Moment magnification factor", ec2+"5.8.7.3(1), Eq. (5.28)", "k_M", "", v,
		"N_Ed <= 0 ? 1 : (N_Ed < N_B ? 1 + beta * N_Ed / (N_B - N_Ed) : 0)",
		trace.A("beta", beta), trace.A("N_B", nB), trace.A("N_Ed", nEd))
	if !ok {
		return s.Shown("0").Caution("NEd ≥ NB: the column buckles and no second-order design moment exists; the factor is recorded as 0. Enlarge the section or its reinforcement.")
	}
	if nEd.V <= 0 {
		return s.Shown("1").Note("No axial compression: nothing to magnify.")
	}
	return s.Shown("1 + beta / (N_B / N_Ed - 1)")
}

// MagnifiedMoment returns the design moment MEd = M0Ed·[1 + β/(NB/NEd − 1)] from the magnification
// factor, EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28); a factor of 0 marks a buckled column.
func MagnifiedMoment(id string, m0Ed, factor trace.Q) trace.Step {
	s := trace.Formula(id, "Design moment including second-order effects (nominal stiffness)", ec2+"5.8.7.3(1), Eq. (5.28)",
		"M_Ed", "Nmm", MagnifiedMomentValue(m0Ed.V, factor.V), "M_0Ed * k_M", trace.A("M_0Ed", m0Ed), trace.A("k_M", factor))
	if factor.V <= 0 {
		s = s.Caution("The column buckles (NEd ≥ NB): the design moment is not defined and is recorded as 0.")
	}
	return s
}

// DesignMomentStiffness returns the design moment of the nominal stiffness method, the magnified
// moment of (5.28) but not less than the larger end moment with its imperfection nor NEd·e0:
// MEd = max{M_mag, M0Ed, NEd·e0}, EN 1992-1-1:2004 5.8.7.3(1)-(2); 5.8.8.2(2); 6.1(4).
func DesignMomentStiffness(id string, mMag, m0Ed, nEd, e0 trace.Q) trace.Step {
	return trace.Formula(id, "Design moment (nominal stiffness), not less than the end moment nor N_Ed·e_0", ec2+"5.8.7.3(1)-(2); 5.8.8.2(2); 6.1(4)",
		"M_Ed", "Nmm", DesignMomentStiffnessValue(mMag.V, m0Ed.V, nEd.V, e0.V), "max(M_mag, M_0Ed, N_Ed * e_0)",
		trace.A("M_mag", mMag), trace.A("M_0Ed", m0Ed), trace.A("N_Ed", nEd), trace.A("e_0", e0)).
		Note("M_mag: the magnified equivalent moment of (5.28); M_0Ed: the larger end moment with the imperfection, which the second-order moment at mid-height does not reduce.")
}

// BucklingCheck returns the check NEd < NB with the ratio NEd/NB; it fails when NEd ≥ NB, since the
// magnification of (5.28) is then unbounded, EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28).
func BucklingCheck(id string, nEd, nB trace.Q) trace.Step {
	r := BucklingRatioValue(nEd.V, nB.V)
	s := trace.Check(id, "Axial force below the buckling load", ec2+"5.8.7.3(1), Eq. (5.28)", "N_Ed < N_B", r,
		"N_B > 0 ? N_Ed / N_B : (N_Ed > 0 ? 1 : 0)", trace.A("N_Ed", nEd), trace.A("N_B", nB))
	if Buckles(nEd.V, nB.V) {
		s.Verdict = trace.Fail
		s = s.Caution("NEd ≥ NB: the column buckles.")
	}
	if nB.V > 0 {
		return s.Shown("N_Ed / N_B")
	}
	return s
}

// SteelRatioValue returns ρ = As/Ac; see SteelRatio.
func SteelRatioValue(as, ac float64) float64 { return as / ac }

// EcdValue returns Ecd = Ecm/γcE; see Ecd.
func EcdValue(ecm, gammaCE float64) float64 { return ecm / gammaCE }

// K1Value returns k1 = √(fck/20); see K1.
func K1Value(fck float64) float64 { return math.Sqrt(fck / 20) }

// K2Value returns k2 = min(n·λ/170, 0.20); see K2.
func K2Value(n, lambda float64) float64 { return math.Min(n*lambda/170, 0.2) }

// K2NoSlendernessValue returns k2 = min(n·0.30, 0.20); see K2NoSlenderness.
func K2NoSlendernessValue(n float64) float64 { return math.Min(n*0.3, 0.2) }

// KcValue returns Kc = k1·k2/(1 + φef); see Kc.
func KcValue(k1, k2, phiEf float64) float64 { return k1 * k2 / (1 + phiEf) }

// KcSimplifiedValue returns Kc = 0.3/(1 + 0.5·φef); see KcSimplified.
func KcSimplifiedValue(phiEf float64) float64 { return 0.3 / (1 + 0.5*phiEf) }

// ConcreteInertiaValue returns Ic = b·h³/12; see ConcreteInertia.
func ConcreteInertiaValue(b, depth float64) float64 { return b * math.Pow(depth, 3) / 12 }

// SteelInertiaValue returns Is = As·is²; see SteelInertia.
func SteelInertiaValue(as, is float64) float64 { return as * math.Pow(is, 2) }

// NominalStiffnessValue returns EI = Kc·Ecd·Ic + Ks·Es·Is; see NominalStiffness.
func NominalStiffnessValue(kc, ecd, ic, ks, es, is float64) float64 { return kc*ecd*ic + ks*es*is }

// BucklingLoadValue returns NB = π²·EI/l0²; see BucklingLoad.
func BucklingLoadValue(ei, l0 float64) float64 { return math.Pow(math.Pi, 2) * ei / math.Pow(l0, 2) }

// C0Value returns c0 for the moment distribution: 8, 9.6, 12, or π² for ShapeOther; see C0.
func C0Value(shape MomentShape) float64 {
	switch shape {
	case ShapeParabolic:
		return 9.6
	case ShapeTriangular:
		return 12
	case ShapeOther:
		return math.Pi * math.Pi
	}
	return 8
}

// MomentBetaValue returns β = π²/c0; see MomentBeta.
func MomentBetaValue(c0 float64) float64 { return math.Pow(math.Pi, 2) / c0 }

// Buckles reports whether the column buckles under NEd, NEd ≥ NB with NEd > 0; see BucklingCheck.
func Buckles(nEd, nB float64) bool { return nEd > 0 && nEd >= nB }

// MagnificationValue returns 1 + β·NEd/(NB − NEd), 1 when NEd ≤ 0, and (0, false) when the column
// buckles; see Magnification.
func MagnificationValue(beta, nB, nEd float64) (float64, bool) {
	if nEd <= 0 {
		return 1, true
	}
	if nEd >= nB {
		return 0, false
	}
	return 1 + beta*nEd/(nB-nEd), true
}

// MagnifiedMomentValue returns MEd = M0Ed·factor; see MagnifiedMoment.
func MagnifiedMomentValue(m0Ed, factor float64) float64 { return m0Ed * factor }

// DesignMomentStiffnessValue returns max{M_mag, M0Ed, NEd·e0}; see DesignMomentStiffness.
func DesignMomentStiffnessValue(mMag, m0Ed, nEd, e0 float64) float64 {
	return math.Max(math.Max(mMag, m0Ed), nEd*e0)
}

// BucklingRatioValue returns NEd/NB, or 1 when NB ≤ 0 < NEd and 0 when NB ≤ 0 and NEd ≤ 0; see BucklingCheck.
func BucklingRatioValue(nEd, nB float64) float64 {
	if nB > 0 {
		return nEd / nB
	}
	if nEd > 0 {
		return 1
	}
	return 0
}

// CircleInertiaValue returns the second moment of area of a circle of diameter d, π·d⁴/64.
func CircleInertiaValue(d float64) float64 { return math.Pi * math.Pow(d, 4) / 64 }

// CircleInertia returns Ic = π·D⁴/64 of a circular section for the nominal stiffness,
// EN 1992-1-1:2004 5.8.7.2(1) (geometry of the circle).
func CircleInertia(id string, d trace.Q) trace.Step {
	return trace.Formula(id, "Second moment of area of the circular concrete section", ec2+"5.8.7.2(1)", "I_c", "mm4",
		CircleInertiaValue(d.V), "3.141592653589793 * D ** 4 / 64", trace.A("D", d)).Shown("pi * D ** 4 / 64")
}
