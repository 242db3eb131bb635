// Package shear holds the shear resistance of a rectangular column about one axis by
// EN 1992-1-1:2004 6.2: the resistance without shear reinforcement VRd,c (6.2.2), the links by the
// variable strut inclination method (6.2.3) and the checks of 6.2.1.
//
// Every step function takes traced quantities in engine units (N, mm, MPa) and returns one trace
// step whose expression reproduces its value; Axis records the whole chain of one axis in a log.
// The nationally determined parameters (CRd,c, k1, the factor of vmin, ν1, the limits of cot θ)
// are arguments, so that a caller may pass national values; Recommended records the EN ones.
package shear

import (
	"colsheet/calc/trace"
)

const ec2 = "EN 1992-1-1:2004 "

// rhoMax is the upper limit ρl ≤ 0.02 of EN 1992-1-1:2004 6.2.2(1).
const rhoMax = 0.02

// K returns the size factor k = 1 + √(200/d) ≤ 2.0, d in mm, EN 1992-1-1:2004 6.2.2(1).
func K(id string, d trace.Q) trace.Step {
	return trace.Formula(id, "Size factor for shear", ec2+"6.2.2(1)", "k", "",
		KValue(d.V), "min(1 + sqrt(200 / d), 2)", trace.A("d", d))
}

// RhoL returns the longitudinal tension steel ratio ρl = Asl/(bw·d) ≤ 0.02, EN 1992-1-1:2004 6.2.2(1).
func RhoL(id string, asl, bw, d trace.Q) trace.Step {
	v := RhoLValue(asl.V, bw.V, d.V)
	s := trace.Formula(id, "Ratio of longitudinal tension reinforcement", ec2+"6.2.2(1)", "ρ_l", "", v,
		"min(A_sl / (b_w * d), 0.02)", trace.A("A_sl", asl), trace.A("b_w", bw), trace.A("d", d)).
		Note("Asl: the bars in the tension half of the section; they count where they run on beyond the section considered by at least lbd + d (Fig. 6.3), as continuous column bars are taken to do.")
	if v == rhoMax {
		return s.Note("ρl is limited to 0.02.")
	}
	return s
}

// SigmaCp returns the axial stress σcp = NEd/Ac < 0.2·fcd (compression positive, capped at
// 0.2·fcd, negative in tension), EN 1992-1-1:2004 6.2.2(1).
func SigmaCp(id string, nEd, ac, fcd trace.Q) trace.Step {
	v := SigmaCpValue(nEd.V, ac.V, fcd.V)
	s := trace.Formula(id, "Axial stress for the shear resistance", ec2+"6.2.2(1)", "σ_cp", "MPa", v,
		"min(N_Ed / A_c, 0.2 * f_cd)", trace.A("N_Ed", nEd), trace.A("A_c", ac), trace.A("f_cd", fcd))
	switch {
	case nEd.V/ac.V > 0.2*fcd.V:
		return s.Note("NEd/Ac exceeds 0.2·fcd: σcp is taken as 0.2·fcd.")
	case nEd.V < 0:
		return s.Note("Axial tension: σcp is negative (NEd > 0 for compression in 6.2.2(1)) and lowers the resistance.")
	}
	return s
}

// CRdc returns the recommended CRd,c = 0.18/γc, EN 1992-1-1:2004 6.2.2(1).
func CRdc(id string, gammaC trace.Q) trace.Step {
	return trace.Formula(id, "Coefficient of the shear resistance without shear reinforcement (recommended value)",
		ec2+"6.2.2(1)", "C_Rd,c", "", 0.18/gammaC.V, "0.18 / gamma_c", trace.A("gamma_c", gammaC))
}

// VMin returns vmin = c·k^(3/2)·fck^(1/2) with c = 0.035 recommended, EN 1992-1-1:2004 6.2.2(1), Eq. (6.3N).
func VMin(id string, c, k, fck trace.Q) trace.Step {
	return trace.Formula(id, "Minimum shear stress of the concrete", ec2+"6.2.2(1), Eq. (6.3N)", "v_min", "MPa",
		VMinValue(c.V, k.V, fck.V), "c_v * k ** 1.5 * sqrt(f_ck)",
		trace.A("c_v", c), trace.A("k", k), trace.A("f_ck", fck))
}

// VRdcA returns VRd,c = [CRd,c·k·(100·ρl·fck)^(1/3) + k1·σcp]·bw·d, EN 1992-1-1:2004 6.2.2(1), Eq. (6.2a).
func VRdcA(id string, cRdc, k, rhoL, fck, k1, sigmaCp, bw, d trace.Q) trace.Step {
	v := VRdcAValue(cRdc.V, k.V, rhoL.V, fck.V, k1.V, sigmaCp.V, bw.V, d.V)
	return trace.Formula(id, "Shear resistance without shear reinforcement", ec2+"6.2.2(1), Eq. (6.2a)", "V_Rd,c,a", "N", v,
		"(C_Rdc * k * (100 * rho_l * f_ck) ** (1 / 3) + k_1 * sigma_cp) * b_w * d",
		trace.A("C_Rdc", cRdc), trace.A("k", k), trace.A("rho_l", rhoL), trace.A("f_ck", fck),
		trace.A("k_1", k1), trace.A("sigma_cp", sigmaCp), trace.A("b_w", bw), trace.A("d", d))
}

// VRdcMin returns the minimum VRd,c = (vmin + k1·σcp)·bw·d, EN 1992-1-1:2004 6.2.2(1), Eq. (6.2b).
func VRdcMin(id string, vMin, k1, sigmaCp, bw, d trace.Q) trace.Step {
	return trace.Formula(id, "Minimum shear resistance without shear reinforcement", ec2+"6.2.2(1), Eq. (6.2b)", "V_Rd,c,min", "N",
		VRdcMinValue(vMin.V, k1.V, sigmaCp.V, bw.V, d.V), "(v_min + k_1 * sigma_cp) * b_w * d",
		trace.A("v_min", vMin), trace.A("k_1", k1), trace.A("sigma_cp", sigmaCp), trace.A("b_w", bw), trace.A("d", d))
}

// VRdc returns VRd,c, the larger of Eq. (6.2a) and its minimum Eq. (6.2b), not taken below zero,
// EN 1992-1-1:2004 6.2.2(1), Eq. (6.2a), (6.2b).
func VRdc(id string, a, min trace.Q) trace.Step {
	v := VRdcValue(a.V, min.V)
	s := trace.Formula(id, "Design shear resistance without shear reinforcement", ec2+"6.2.2(1), Eq. (6.2a), (6.2b)", "V_Rd,c", "N", v,
		"max(V_a, V_min, 0)", trace.A("V_a", a), trace.A("V_min", min))
	switch {
	case v == 0:
		return s.Shown("0").
			Note("Axial tension makes both expressions negative: VRd,c is taken as 0, a resistance not being negative (common practice, no source); the links carry the whole shear.")
	case min.V > a.V:
		return s.Shown("V_min").Note("The minimum of Eq. (6.2b) governs.")
	}
	return s.Shown("V_a")
}

// ConcreteCheck checks VEd ≤ VRd,c, where no calculated shear reinforcement is needed,
// EN 1992-1-1:2004 6.2.1(3); 6.2.2(1).
func ConcreteCheck(id string, vEd, vRdc trace.Q) trace.Step {
	s := trace.Check(id, "Shear without calculated shear reinforcement", ec2+"6.2.1(3); 6.2.2(1)", "V_Ed ≤ V_Rd,c",
		ConcreteCheckValue(vEd.V, vRdc.V), "V_Ed / max(V_Rd_c, 0.001)", trace.A("V_Ed", vEd), trace.A("V_Rd_c", vRdc))
	if vRdc.V < guard {
		return s.Unmet().Caution("VRd,c is 0: the shear must be carried by links designed by 6.2.3.")
	}
	s = s.Shown("V_Ed / V_Rd_c")
	if s.Verdict == trace.Pass {
		return s.Note("No calculated shear reinforcement is needed; the column has the links of 9.5.3.")
	}
	return s
}

// guard keeps the divisors of the checks and spacings finite: 0.001 N or mm, far below any real value.
const guard = 1e-3
