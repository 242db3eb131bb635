package shear

import (
	"math"

	"colsheet/calc/trace"
)

// LeverArm returns the inner lever arm z = 0.9·d, EN 1992-1-1:2004 6.2.3(1).
func LeverArm(id string, d trace.Q) trace.Step {
	return trace.Formula(id, "Inner lever arm for shear", ec2+"6.2.3(1)", "z", "mm", LeverArmValue(d.V), "0.9 * d", trace.A("d", d)).
		Note("6.2.3(1) gives z = 0.9·d for members without axial force; it is used with the column's axial force as well.")
}

// Nu1 returns the strength reduction factor for concrete cracked in shear ν1 = ν = 0.6·(1 − fck/250),
// the recommended value, EN 1992-1-1:2004 6.2.3(3), Eq. (6.6N).
func Nu1(id string, fck trace.Q) trace.Step {
	return trace.Formula(id, "Strength reduction factor for concrete cracked in shear", ec2+"6.2.3(3), Eq. (6.6N)", "ν_1", "",
		0.6*(1-fck.V/250), "0.6 * (1 - f_ck / 250)", trace.A("f_ck", fck)).
		Note("ν1 = ν of Eq. (6.6N), the recommended value where the links work at their design yield strength.")
}

// SigmaCpMean returns the mean axial stress σcp = NEd/Ac of the concrete that sets αcw, compression
// positive and not capped, EN 1992-1-1:2004 6.2.3(3).
func SigmaCpMean(id string, nEd, ac trace.Q) trace.Step {
	return trace.Formula(id, "Mean axial stress of the concrete for the strut resistance", ec2+"6.2.3(3)", "σ_cp,m", "MPa",
		nEd.V/ac.V, "N_Ed / A_c", trace.A("N_Ed", nEd), trace.A("A_c", ac)).
		Note("Averaged over the gross concrete area; unlike σcp of 6.2.2(1) it is not capped at 0.2·fcd.")
}

// AlphaCw returns the coefficient for the stress state of the compression chord αcw: 1 without
// compression, 1 + σcp/fcd up to 0.25·fcd, 1.25 up to 0.5·fcd, 2.5·(1 − σcp/fcd) above (the
// recommended values), EN 1992-1-1:2004 6.2.3(3), Eq. (6.11.aN)-(6.11.cN).
func AlphaCw(id string, sigma, fcd trace.Q) trace.Step {
	r := sigma.V / fcd.V
	v := alphaCwValue(r)
	s := trace.Formula(id, "Coefficient for the stress state in the compression chord", ec2+"6.2.3(3), Eq. (6.11.aN)-(6.11.cN)", "α_cw", "", v,
		"sigma <= 0 ? 1 : (sigma <= 0.25 * f_cd ? 1 + sigma / f_cd : (sigma <= 0.5 * f_cd ? 1.25 : max(2.5 * (1 - sigma / f_cd), 0)))",
		trace.A("sigma", sigma), trace.A("f_cd", fcd))
	switch {
	case r <= 0:
		return s.Shown("1")
	case r <= 0.25:
		return s.Shown("1 + sigma / f_cd")
	case r <= 0.5:
		return s.Shown("1.25")
	case r < 1:
		return s.Shown("2.5 * (1 - sigma / f_cd)")
	}
	return s.Shown("0").Caution("The mean axial stress reaches fcd: the struts have no strength left for shear.")
}

// alphaCwValue returns αcw for the ratio σcp/fcd, as AlphaCw writes it.
func alphaCwValue(r float64) float64 {
	switch {
	case r <= 0:
		return 1
	case r <= 0.25:
		return 1 + r
	case r <= 0.5:
		return 1.25
	}
	return math.Max(2.5*(1-r), 0)
}

// CotTheta returns the largest cot θ within [cot θmin, cot θmax] for which VRd,max ≥ VEd, the
// larger root of cot θ + tan θ = αcw·bw·z·ν1·fcd/VEd (Eq. (6.9) solved for cot θ), or cot θmin
// where no angle gives enough strut resistance, EN 1992-1-1:2004 6.2.3(2), Eq. (6.7N); 6.2.3(3), Eq. (6.9).
func CotTheta(id string, alphaCw, bw, z, nu1, fcd, vEd, cotMin, cotMax trace.Q) trace.Step {
	c := alphaCw.V * bw.V * z.V * nu1.V * fcd.V
	v := cotThetaValue(c, vEd.V, cotMin.V, cotMax.V)
	s := trace.Formula(id, "Strut inclination: the largest cot θ for which VRd,max ≥ VEd", ec2+"6.2.3(2), Eq. (6.7N); 6.2.3(3), Eq. (6.9)",
		"cot θ", "", v,
		"V_Ed > 0 ? min(max(("+ratioExpr+" + sqrt(max(("+ratioExpr+") ** 2 - 4, 0))) / 2, cot_min), cot_max) : cot_max",
		trace.A("alpha_cw", alphaCw), trace.A("b_w", bw), trace.A("z", z), trace.A("nu_1", nu1), trace.A("f_cd", fcd),
		trace.A("V_Ed", vEd), trace.A("cot_min", cotMin), trace.A("cot_max", cotMax)).
		Note("From Eq. (6.9) with VRd,max = VEd: cot θ + tan θ = αcw·bw·z·ν1·fcd/VEd, whose larger root is the flattest strut, so the fewest links; kept within Eq. (6.7N).")
	switch {
	case v == cotMax.V:
		s = s.Shown("cot_max").Note("VRd,max at the largest cot θ is not less than VEd: cot θ takes its upper limit.")
	case v == cotMin.V:
		s = s.Shown("cot_min")
	case c/vEd.V >= 2:
		s = s.Shown("(" + ratioExpr + " + sqrt((" + ratioExpr + ") ** 2 - 4)) / 2")
	default:
		s = s.Shown("(" + ratioExpr + ") / 2")
	}
	if vEd.V > 0 && c/vEd.V < (v+1/v)*(1-1e-9) {
		return s.Caution("VRd,max is below VEd at every strut inclination allowed: the section must be enlarged or the concrete strength raised.")
	}
	return s
}

// ratioExpr is αcw·bw·z·ν1·fcd/VEd, the value of cot θ + tan θ at which VRd,max = VEd.
const ratioExpr = "alpha_cw * b_w * z * nu_1 * f_cd / V_Ed"

// cotThetaValue returns cot θ for the strut capacity c = αcw·bw·z·ν1·fcd as CotTheta writes it.
func cotThetaValue(c, vEd, cotMin, cotMax float64) float64 {
	if !(vEd > 0) {
		return cotMax
	}
	r := c / vEd
	root := (r + math.Sqrt(math.Max(math.Pow(r, 2)-4, 0))) / 2
	return math.Min(math.Max(root, cotMin), cotMax)
}

// VRdMax returns the strut resistance VRd,max = αcw·bw·z·ν1·fcd/(cot θ + tan θ), EN 1992-1-1:2004 6.2.3(3), Eq. (6.9).
func VRdMax(id string, alphaCw, bw, z, nu1, fcd, cot trace.Q) trace.Step {
	return trace.Formula(id, "Shear resistance of the concrete struts", ec2+"6.2.3(3), Eq. (6.9)", "V_Rd,max", "N",
		VRdMaxValue(alphaCw.V, bw.V, z.V, nu1.V, fcd.V, cot.V), "alpha_cw * b_w * z * nu_1 * f_cd / (cot_theta + 1 / cot_theta)",
		trace.A("alpha_cw", alphaCw), trace.A("b_w", bw), trace.A("z", z), trace.A("nu_1", nu1), trace.A("f_cd", fcd),
		trace.A("cot_theta", cot))
}

// MaxCheck checks VEd ≤ VRd,max, EN 1992-1-1:2004 6.2.1(6); 6.2.3(3), Eq. (6.9).
func MaxCheck(id string, vEd, vRdMax trace.Q) trace.Step {
	s := trace.Check(id, "Shear within the resistance of the concrete struts", ec2+"6.2.1(6); 6.2.3(3), Eq. (6.9)", "V_Ed ≤ V_Rd,max",
		MaxCheckValue(vEd.V, vRdMax.V), "V_Ed / max(V_Rd_max, 0.001)", trace.A("V_Ed", vEd), trace.A("V_Rd_max", vRdMax))
	if vRdMax.V < guard {
		s = s.Unmet()
	} else {
		s = s.Shown("V_Ed / V_Rd_max")
	}
	if s.Verdict == trace.Fail {
		return s.Caution("The concrete struts cannot carry VEd at any strut inclination allowed: enlarge the section or raise the concrete strength.")
	}
	return s
}

// SpacingRequired returns the largest link spacing s = Asw·z·fywd·cot θ/VEd for which VRd,s ≥ VEd,
// EN 1992-1-1:2004 6.2.3(3), Eq. (6.8).
func SpacingRequired(id string, asw, z, fywd, cot, vEd trace.Q) trace.Step {
	s := trace.Formula(id, "Largest link spacing for the shear", ec2+"6.2.3(3), Eq. (6.8)", "s_req", "mm",
		SpacingRequiredValue(asw.V, z.V, fywd.V, cot.V, vEd.V), "A_sw * z * f_ywd * cot_theta / max(V_Ed, 0.001)",
		trace.A("A_sw", asw), trace.A("z", z), trace.A("f_ywd", fywd), trace.A("cot_theta", cot), trace.A("V_Ed", vEd))
	if vEd.V < guard {
		return s
	}
	return s.Shown("A_sw * z * f_ywd * cot_theta / V_Ed")
}

// VRds returns the resistance of the links VRd,s = Asw/s·z·fywd·cot θ, EN 1992-1-1:2004 6.2.3(3), Eq. (6.8).
func VRds(id string, asw, s, z, fywd, cot trace.Q) trace.Step {
	st := trace.Formula(id, "Shear resistance of the links", ec2+"6.2.3(3), Eq. (6.8)", "V_Rd,s", "N",
		VRdsValue(asw.V, s.V, z.V, fywd.V, cot.V), "A_sw / max(s, 0.001) * z * f_ywd * cot_theta",
		trace.A("A_sw", asw), trace.A("s", s), trace.A("z", z), trace.A("f_ywd", fywd), trace.A("cot_theta", cot))
	if s.V < guard {
		return st
	}
	return st.Shown("A_sw / s * z * f_ywd * cot_theta")
}

// LinksCheck checks VEd ≤ VRd, the larger of VRd,c and VRd,s with the links provided,
// EN 1992-1-1:2004 6.2.1(3), (5); 6.2.3(3), Eq. (6.8).
func LinksCheck(id string, vEd, vRdc, vRds trace.Q) trace.Step {
	r := math.Max(vRdc.V, vRds.V)
	s := trace.Check(id, "Shear with the links provided", ec2+"6.2.1(3), (5); 6.2.3(3), Eq. (6.8)", "V_Ed ≤ max(V_Rd,c, V_Rd,s)",
		LinksCheckValue(vEd.V, vRdc.V, vRds.V), "V_Ed / max(V_Rd_c, V_Rd_s, 0.001)",
		trace.A("V_Ed", vEd), trace.A("V_Rd_c", vRdc), trace.A("V_Rd_s", vRds))
	if r < guard {
		return s.Unmet()
	}
	return s.Shown("V_Ed / max(V_Rd_c, V_Rd_s)").
		Note("Where VEd ≤ VRd,c no calculated shear reinforcement is needed (6.2.1(3)); beyond it the links alone carry VEd (6.2.1(5)), VRd,c not being added.")
}
