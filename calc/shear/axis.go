package shear

import "colsheet/calc/trace"

// Params holds the nationally determined parameters of EN 1992-1-1:2004 6.2.2 and 6.2.3 in force.
type Params struct {
	CRdc   trace.Q // C_Rd,c of Eq. (6.2a), recommended 0.18/γc
	K1     trace.Q // k_1 of Eq. (6.2a), (6.2b), recommended 0.15
	VMinC  trace.Q // factor c of vmin = c·k^(3/2)·fck^(1/2), recommended 0.035 (Eq. (6.3N))
	Nu1    trace.Q // ν_1 of Eq. (6.9), recommended ν of Eq. (6.6N)
	CotMin trace.Q // least cot θ, recommended 1 (Eq. (6.7N))
	CotMax trace.Q // largest cot θ, recommended 2.5 (Eq. (6.7N))
	// AxialStress takes αcw from the mean axial stress by (6.11.aN)-(6.11.cN); false takes
	// αcw = 1, the recommended value for non-prestressed structures (6.2.3(3), Note 3).
	AxialStress bool
}

// Recommended records the EN recommended values of the shear parameters for the concrete of
// strength fck with the partial factor γc, and returns them.
func Recommended(l *trace.Log, prefix string, gammaC, fck trace.Q) Params {
	input := func(name, title, clause, symbol string, v float64) trace.Q {
		return l.Add(trace.Input(prefix+name, title+" (recommended value)", clause, symbol, "", v))
	}
	return Params{
		CRdc:   l.Add(CRdc(prefix+"C_Rdc", gammaC)),
		K1:     input("k_1", "Factor on the axial stress in the shear resistance", ec2+"6.2.2(1)", "k_1", 0.15),
		VMinC:  input("c_vmin", "Factor of the minimum shear stress", ec2+"6.2.2(1), Eq. (6.3N)", "c_v", 0.035),
		Nu1:    l.Add(Nu1(prefix+"nu_1", fck)),
		CotMin: input("cot_min", "Least cot θ", ec2+"6.2.3(2), Eq. (6.7N)", "cot θ_min", 1),
		CotMax: input("cot_max", "Largest cot θ", ec2+"6.2.3(2), Eq. (6.7N)", "cot θ_max", 2.5),
	}
}

// Input is what the shear design of a column about one axis takes, in engine units.
type Input struct {
	BW   trace.Q // width of the section perpendicular to the shear, mm
	D    trace.Q // effective depth in the direction of the shear, mm
	Asl  trace.Q // longitudinal tension steel: the bars in the tension half, mm²
	NEd  trace.Q // axial force, compression positive, N
	Ac   trace.Q // area of the concrete section, mm²
	Fck  trace.Q // characteristic cylinder strength, MPa
	Fcd  trace.Q // design compressive strength, MPa
	Fywd trace.Q // design yield strength of the links, MPa
	Asw  trace.Q // area of the link legs across the shear direction, mm²
	VEd  trace.Q // design shear force (its magnitude), N
	S    trace.Q // link spacing provided, mm; V = 0 when the spacing is to be designed only
}

// Result holds the quantities of the shear design of one axis; those of 6.2.3 only where VEd > VRd,c.
type Result struct {
	VRdc     trace.Q // resistance without shear reinforcement, N
	Needed   bool    // VEd > VRd,c: links designed by 6.2.3
	Z        trace.Q // inner lever arm, mm
	CotTheta trace.Q // strut inclination chosen
	VRdMax   trace.Q // strut resistance at that inclination, N
	MaxCheck trace.Q // ratio VEd/VRd,max
	SReq     trace.Q // largest link spacing for the shear, mm
	VRds     trace.Q // resistance of the links provided, N (when a spacing was given)
	Check    trace.Q // ratio of VEd to the resistance (set when VEd ≤ VRd,c or a spacing was given)
}

// Axis records the shear design of one axis of a column: VRd,c (6.2.2), and where VEd exceeds
// it the strut inclination, VRd,max with its check and the largest link spacing (6.2.3); then the
// check of VEd against VRd,c, or against the links provided when in.S is given.
func Axis(l *trace.Log, prefix string, in Input, p Params) Result {
	r := Result{VRdc: Concrete(l, prefix, in, p)}
	r.Needed = in.VEd.V > r.VRdc.V
	if r.Needed {
		r.Z, r.CotTheta, r.VRdMax, r.MaxCheck, r.SReq = Links(l, prefix, in, p)
	}
	switch {
	case !r.Needed:
		r.Check = l.Add(ConcreteCheck(prefix+"check", in.VEd, r.VRdc))
	case in.S.V > 0:
		r.VRds, r.Check = WithLinks(l, prefix, in, r, in.S)
	}
	return r
}

// Concrete records the steps of VRd,c, EN 1992-1-1:2004 6.2.2(1), and returns it.
func Concrete(l *trace.Log, prefix string, in Input, p Params) trace.Q {
	k := l.Add(K(prefix+"k", in.D))
	rho := l.Add(RhoL(prefix+"rho_l", in.Asl, in.BW, in.D))
	sig := l.Add(SigmaCp(prefix+"sigma_cp", in.NEd, in.Ac, in.Fcd))
	vmin := l.Add(VMin(prefix+"v_min", p.VMinC, k, in.Fck))
	a := l.Add(VRdcA(prefix+"V_Rdc_a", p.CRdc, k, rho, in.Fck, p.K1, sig, in.BW, in.D))
	m := l.Add(VRdcMin(prefix+"V_Rdc_min", vmin, p.K1, sig, in.BW, in.D))
	return l.Add(VRdc(prefix+"V_Rdc", a, m))
}

// Links records the design of the links by EN 1992-1-1:2004 6.2.3: z, αcw, cot θ, VRd,max and its
// check, and the largest spacing; it returns z, cot θ, VRd,max, the check ratio and the spacing.
func Links(l *trace.Log, prefix string, in Input, p Params) (z, cot, vRdMax, check, sReq trace.Q) {
	z = l.Add(LeverArm(prefix+"z", in.D))
	var acw trace.Q
	if p.AxialStress {
		sig := l.Add(SigmaCpMean(prefix+"sigma_cp_m", in.NEd, in.Ac))
		acw = l.Add(AlphaCw(prefix+"alpha_cw", sig, in.Fcd))
	} else {
		acw = l.Add(trace.Input(prefix+"alpha_cw", "Coefficient for the state of stress in the compression chord (non-prestressed member)",
			ec2+"6.2.3(3), note", "α_cw", "", 1))
	}
	cot = l.Add(CotTheta(prefix+"cot_theta", acw, in.BW, z, p.Nu1, in.Fcd, in.VEd, p.CotMin, p.CotMax))
	vRdMax = l.Add(VRdMax(prefix+"V_Rdmax", acw, in.BW, z, p.Nu1, in.Fcd, cot))
	check = l.Add(MaxCheck(prefix+"check_V_Rdmax", in.VEd, vRdMax))
	sReq = l.Add(SpacingRequired(prefix+"s_req", in.Asw, z, in.Fywd, cot, in.VEd))
	return
}

// WithLinks records VRd,s of the links at spacing s and the check of VEd against it, for a result
// of Axis where links are needed, EN 1992-1-1:2004 6.2.3(3), Eq. (6.8).
func WithLinks(l *trace.Log, prefix string, in Input, r Result, s trace.Q) (vRds, check trace.Q) {
	vRds = l.Add(VRds(prefix+"V_Rds", in.Asw, s, r.Z, in.Fywd, r.CotTheta))
	check = l.Add(LinksCheck(prefix+"check", in.VEd, r.VRdc, vRds))
	return
}
