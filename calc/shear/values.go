package shear

import "math"

// The value functions below hold the formulas of the step functions without a trace; the step
// functions call them, so that a trial without a trace gets the very same numbers.

// KValue returns k = 1 + √(200/d) ≤ 2.0; see K.
func KValue(d float64) float64 { return math.Min(1+math.Sqrt(200/d), 2) }

// RhoLValue returns ρl = Asl/(bw·d) ≤ 0.02; see RhoL.
func RhoLValue(asl, bw, d float64) float64 { return math.Min(asl/(bw*d), rhoMax) }

// SigmaCpValue returns σcp = NEd/Ac < 0.2·fcd; see SigmaCp.
func SigmaCpValue(nEd, ac, fcd float64) float64 { return math.Min(nEd/ac, 0.2*fcd) }

// VMinValue returns vmin = c·k^(3/2)·fck^(1/2); see VMin.
func VMinValue(c, k, fck float64) float64 { return c * math.Pow(k, 1.5) * math.Sqrt(fck) }

// VRdcAValue returns VRd,c of Eq. (6.2a); see VRdcA.
func VRdcAValue(cRdc, k, rhoL, fck, k1, sigmaCp, bw, d float64) float64 {
	return (cRdc*k*math.Pow(100*rhoL*fck, 1.0/3) + k1*sigmaCp) * bw * d
}

// VRdcMinValue returns the minimum VRd,c of Eq. (6.2b); see VRdcMin.
func VRdcMinValue(vMin, k1, sigmaCp, bw, d float64) float64 { return (vMin + k1*sigmaCp) * bw * d }

// VRdcValue returns VRd,c, the larger of Eq. (6.2a) and (6.2b), not below zero; see VRdc.
func VRdcValue(a, min float64) float64 { return math.Max(math.Max(a, min), 0) }

// ConcreteCheckValue returns the ratio VEd/VRd,c of ConcreteCheck.
func ConcreteCheckValue(vEd, vRdc float64) float64 { return vEd / math.Max(vRdc, guard) }

// LeverArmValue returns z = 0.9·d; see LeverArm.
func LeverArmValue(d float64) float64 { return 0.9 * d }

// VRdMaxValue returns VRd,max = αcw·bw·z·ν1·fcd/(cot θ + tan θ); see VRdMax.
func VRdMaxValue(alphaCw, bw, z, nu1, fcd, cot float64) float64 {
	return alphaCw * bw * z * nu1 * fcd / (cot + 1/cot)
}

// MaxCheckValue returns the ratio VEd/VRd,max of MaxCheck.
func MaxCheckValue(vEd, vRdMax float64) float64 { return vEd / math.Max(vRdMax, guard) }

// SpacingRequiredValue returns s = Asw·z·fywd·cot θ/VEd; see SpacingRequired.
func SpacingRequiredValue(asw, z, fywd, cot, vEd float64) float64 {
	return asw * z * fywd * cot / math.Max(vEd, guard)
}

// VRdsValue returns VRd,s = Asw/s·z·fywd·cot θ; see VRds.
func VRdsValue(asw, s, z, fywd, cot float64) float64 {
	return asw / math.Max(s, guard) * z * fywd * cot
}

// LinksCheckValue returns the ratio VEd/max(VRd,c, VRd,s) of LinksCheck.
func LinksCheckValue(vEd, vRdc, vRds float64) float64 {
	return vEd / math.Max(math.Max(vRdc, vRds), guard)
}

// Values is what the shear design of one axis takes, as numbers in engine units (see Input).
type Values struct {
	BW, D, Asl, NEd, Ac, Fck, Fcd, Fywd, Asw, VEd float64
}

// AxisResult holds the values that Axis records for an axis without a spacing given.
type AxisResult struct {
	VRdc   float64 // resistance without shear reinforcement, N
	Needed bool    // VEd > VRd,c: links designed by 6.2.3
	// Check is the ratio VEd/VRd,c of the check of Axis where no links are needed.
	Check float64
	// Where links are needed: the lever arm, cot θ, VRd,max, the ratio VEd/VRd,max and the
	// largest link spacing.
	Z, CotTheta, VRdMax, MaxCheck, SReq float64
}

// AxisValue returns the values of Axis for in with no spacing given, without a trace.
func AxisValue(in Values, p Params) AxisResult {
	k := KValue(in.D)
	rho := RhoLValue(in.Asl, in.BW, in.D)
	sig := SigmaCpValue(in.NEd, in.Ac, in.Fcd)
	vmin := VMinValue(p.VMinC.V, k, in.Fck)
	a := VRdcAValue(p.CRdc.V, k, rho, in.Fck, p.K1.V, sig, in.BW, in.D)
	m := VRdcMinValue(vmin, p.K1.V, sig, in.BW, in.D)
	r := AxisResult{VRdc: VRdcValue(a, m)}
	r.Needed = in.VEd > r.VRdc
	if !r.Needed {
		r.Check = ConcreteCheckValue(in.VEd, r.VRdc)
		return r
	}
	r.Z = LeverArmValue(in.D)
	acw := 1.0
	if p.AxialStress {
		acw = alphaCwValue(in.NEd / in.Ac / in.Fcd)
	}
	r.CotTheta = cotThetaValue(acw*in.BW*r.Z*p.Nu1.V*in.Fcd, in.VEd, p.CotMin.V, p.CotMax.V)
	r.VRdMax = VRdMaxValue(acw, in.BW, r.Z, p.Nu1.V, in.Fcd, r.CotTheta)
	r.MaxCheck = MaxCheckValue(in.VEd, r.VRdMax)
	r.SReq = SpacingRequiredValue(in.Asw, r.Z, in.Fywd, r.CotTheta, in.VEd)
	return r
}
