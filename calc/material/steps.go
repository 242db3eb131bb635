package material

import (
	"math"

	"colsheet/calc/trace"
)

const ec2 = "EN 1992-1-1:2004 "

// FckStep returns the characteristic cylinder strength read from Table 3.1, EN 1992-1-1:2004 Table 3.1.
func FckStep(id string, c Concrete) trace.Step {
	s := trace.Table(id, "Characteristic cylinder strength", ec2+"3.1.2, Table 3.1", c.Class+", fck", "f_ck", "MPa", c.Fck)
	if !c.InTable31() {
		s = s.Caution(c.Class + " is not a class of EN 1992-1-1 Table 3.1; it is used by national standards, and its properties here follow from the expressions of Table 3.1. Confirm that the national annex allows it.")
	}
	return s
}

// EpsC2Step returns εc2, read from Table 3.1 up to C50/60 and from the table's expression above.
func EpsC2Step(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Strain at peak stress, parabola-rectangle", ec2+"Table 3.1", c.Class+", εc2 = 2.0 ‰", "ε_c2", "", c.EpsC2)
	}
	return trace.Formula(id, "Strain at peak stress, parabola-rectangle", ec2+"Table 3.1", "ε_c2", "", c.EpsC2,
		"min((2.0 + 0.085 * (f_ck - 50) ** 0.53) / 1000, (2.6 + 35 * ((90 - f_ck) / 100) ** 4) / 1000)", trace.A("f_ck", fck)).
		Note("Not above εcu2: at C90/105 the expression gives 2.6005 ‰ where Table 3.1 prints 2.6 ‰ for both.")
}

// EpsCu2Step returns εcu2, read from Table 3.1 up to C50/60 and from the table's expression above.
func EpsCu2Step(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Ultimate compressive strain, parabola-rectangle", ec2+"Table 3.1", c.Class+", εcu2 = 3.5 ‰", "ε_cu2", "", c.EpsCu2)
	}
	return trace.Formula(id, "Ultimate compressive strain, parabola-rectangle", ec2+"Table 3.1", "ε_cu2", "", c.EpsCu2,
		"(2.6 + 35 * ((90 - f_ck) / 100) ** 4) / 1000", trace.A("f_ck", fck))
}

// NStep returns the exponent n of the parabola, read from Table 3.1 up to C50/60 and from the table's expression above.
func NStep(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Exponent of the parabola", ec2+"Table 3.1", c.Class+", n = 2.0", "n", "", c.N)
	}
	return trace.Formula(id, "Exponent of the parabola", ec2+"Table 3.1", "n", "", c.N,
		"1.4 + 23.4 * ((90 - f_ck) / 100) ** 4", trace.A("f_ck", fck))
}

// EpsC3Step returns εc3 of the bilinear relation, which sets the uniform strain in pure compression
// for the rectangular block, EN 1992-1-1:2004 Table 3.1.
func EpsC3Step(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Strain at peak stress, bilinear", ec2+"Table 3.1", c.Class+", εc3 = 1.75 ‰", "ε_c3", "", c.EpsC3)
	}
	return trace.Formula(id, "Strain at peak stress, bilinear", ec2+"Table 3.1", "ε_c3", "", c.EpsC3,
		"(1.75 + 0.55 * (f_ck - 50) / 40) / 1000", trace.A("f_ck", fck))
}

// EpsCu3Step returns εcu3, the ultimate strain of the bilinear relation, which the rectangular
// block takes as the strain at the extreme compression fibre (Fig. 3.5), read from Table 3.1 up to
// C50/60 and from the table's expression above, EN 1992-1-1:2004 Table 3.1.
func EpsCu3Step(id string, c Concrete, fck trace.Q) trace.Step {
	const title = "Ultimate compressive strain, bilinear relation and rectangular block"
	if c.Fck <= 50 {
		return trace.Table(id, title, ec2+"Table 3.1", c.Class+", εcu3 = 3.5 ‰", "ε_cu3", "", c.EpsCu3)
	}
	return trace.Formula(id, title, ec2+"Table 3.1", "ε_cu3", "", c.EpsCu3,
		"(2.6 + 35 * ((90 - f_ck) / 100) ** 4) / 1000", trace.A("f_ck", fck))
}

// LambdaStep returns λ, the depth factor of the rectangular block, EN 1992-1-1:2004 3.1.7(3), Eq. (3.19)-(3.20).
func LambdaStep(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Depth factor of the rectangular block", ec2+"3.1.7(3), Eq. (3.19)", "fck ≤ 50 MPa", "λ", "", 0.8)
	}
	return trace.Formula(id, "Depth factor of the rectangular block", ec2+"3.1.7(3), Eq. (3.20)", "λ", "", c.Lambda,
		"0.8 - (f_ck - 50) / 400", trace.A("f_ck", fck))
}

// EtaStep returns η, the strength factor of the rectangular block, EN 1992-1-1:2004 3.1.7(3), Eq. (3.21)-(3.22).
func EtaStep(id string, c Concrete, fck trace.Q) trace.Step {
	if c.Fck <= 50 {
		return trace.Table(id, "Strength factor of the rectangular block", ec2+"3.1.7(3), Eq. (3.21)", "fck ≤ 50 MPa", "η", "", 1.0)
	}
	return trace.Formula(id, "Strength factor of the rectangular block", ec2+"3.1.7(3), Eq. (3.22)", "η", "", c.Eta,
		"1.0 - (f_ck - 50) / 200", trace.A("f_ck", fck))
}

// Fcd returns the design compressive strength fcd = αcc·fck/γc, EN 1992-1-1:2004 3.1.6(1), Eq. (3.15).
func Fcd(id string, alphaCC, fck, gammaC trace.Q) trace.Step {
	return trace.Formula(id, "Design compressive strength of concrete", ec2+"3.1.6(1), Eq. (3.15)", "f_cd", "MPa",
		alphaCC.V*fck.V/gammaC.V, "alpha_cc * f_ck / gamma_c",
		trace.A("alpha_cc", alphaCC), trace.A("f_ck", fck), trace.A("gamma_c", gammaC))
}

// Fyd returns the design yield strength fyd = fyk/γs, EN 1992-1-1:2004 3.2.7(2), Fig. 3.8.
func Fyd(id string, fyk, gammaS trace.Q) trace.Step {
	return trace.Formula(id, "Design yield strength of reinforcement", ec2+"3.2.7(2), Fig. 3.8", "f_yd", "MPa",
		fyk.V/gammaS.V, "f_yk / gamma_s", trace.A("f_yk", fyk), trace.A("gamma_s", gammaS))
}

// Ecm returns the secant modulus Ecm = 22·(fcm/10)^0.3 GPa, in MPa, EN 1992-1-1:2004 Table 3.1.
func Ecm(id string, fck trace.Q) trace.Step {
	return trace.Formula(id, "Secant modulus of elasticity of concrete", ec2+"Table 3.1", "E_cm", "MPa",
		22000*math.Pow((fck.V+8)/10, 0.3), "22000 * ((f_ck + 8) / 10) ** 0.3", trace.A("f_ck", fck))
}

// FctmStep returns the mean axial tensile strength fctm read from Table 3.1 up to C50/60 and from
// the table's expression above, EN 1992-1-1:2004 Table 3.1.
func FctmStep(id string, c Concrete) trace.Step {
	return trace.Table(id, "Mean axial tensile strength of concrete", ec2+"Table 3.1", c.Class+", fctm", "f_ctm", "MPa", c.Fctm)
}
