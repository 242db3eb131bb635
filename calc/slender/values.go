package slender

import "math"

// The value functions below hold the formulas of the step functions of this package, which
// call them and record the same formula as an expression; they serve also to try candidate
// bar patterns without a trace. Each cites its clause at its step function.

// MechanicalRatioValue returns ω = As·fyd/(Ac·fcd); see MechanicalRatio.
func MechanicalRatioValue(as, fyd, ac, fcd float64) float64 { return as * fyd / (ac * fcd) }

// FactorBValue returns B = √(1 + 2ω); see FactorB.
func FactorBValue(omega float64) float64 { return math.Sqrt(1 + 2*omega) }

// LambdaLimValue returns λlim = k·A·B·C/√n with n not below 1e-4; see LambdaLim.
func LambdaLimValue(k, a, b, c, n float64) float64 {
	return k * a * b * c / math.Sqrt(math.Max(n, nFloor))
}

// EffectiveDepthValue returns d = h/2 + is; see EffectiveDepth.
func EffectiveDepthValue(depth, is float64) float64 { return depth/2 + is }

// BaseCurvatureValue returns 1/r0 = εyd/(0.45·d); see BaseCurvature.
func BaseCurvatureValue(epsYd, d float64) float64 { return epsYd / (0.45 * d) }

// KrValue returns Kr = (1 + ω − n)/(1 + ω − 0.4) kept within [0, 1]; see Kr.
func KrValue(n, omega float64) float64 {
	nu := 1 + omega
	return math.Max(math.Min((nu-n)/(nu-0.4), 1), 0)
}

// BetaValue returns β = 0.35 + fck/200 − λ/150; see Beta.
func BetaValue(fck, lambda float64) float64 { return 0.35 + fck/200 - lambda/150 }

// KphiValue returns Kφ = max(1 + β·φef, 1); see Kphi.
func KphiValue(beta, phiEf float64) float64 { return math.Max(1+beta*phiEf, 1) }

// CurvatureValue returns 1/r = Kr·Kφ·1/r0; see Curvature.
func CurvatureValue(kr, kphi, r0 float64) float64 { return kr * kphi * r0 }

// SecondOrderEccentricityValue returns e2 = (1/r)·l0²/c; see SecondOrderEccentricity.
func SecondOrderEccentricityValue(curv, l0, c float64) float64 { return curv * l0 * l0 / c }

// EquivalentMomentValue returns M0e = max(0.6·M02 + 0.4·M01, 0.4·M02); see EquivalentMoment.
func EquivalentMomentValue(m01, m02 float64) float64 { return math.Max(0.6*m02+0.4*m01, 0.4*m02) }

// DesignMomentSlenderValue returns max{M02, M0e + M2, M01 + 0.5·M2, NEd·e0}; see DesignMomentSlender.
func DesignMomentSlenderValue(m01, m02, m0e, m2, nEd, e0 float64) float64 {
	return math.Max(math.Max(m02, m0e+m2), math.Max(m01+0.5*m2, nEd*e0))
}

// DesignMomentStockyValue returns max{M02, NEd·e0}; see DesignMomentStocky.
func DesignMomentStockyValue(m02, nEd, e0 float64) float64 { return math.Max(m02, nEd*e0) }

// SlendernessRatiosCloseValue reports λy/λz ≤ 2 and λz/λy ≤ 2; see SlendernessRatiosClose.
func SlendernessRatiosCloseValue(lambdaY, lambdaZ float64) bool {
	return lambdaY <= 2*lambdaZ && lambdaZ <= 2*lambdaY
}

// EccentricitiesApartValue reports one relative eccentricity at most 0.2 times the other; see EccentricitiesApart.
func EccentricitiesApartValue(mEdY, mEdZ, b, h float64) bool {
	ry, rz := mEdZ/b, mEdY/h
	return math.Min(ry, rz) <= 0.2*math.Max(ry, rz)
}

// NRdBiaxialValue returns NRd = Ac·fcd + As·fyd; see NRdBiaxial.
func NRdBiaxialValue(ac, fcd, as, fyd float64) float64 { return ac*fcd + as*fyd }

// ExponentAValue returns the exponent a of (5.39) from NEd/NRd; see ExponentA.
func ExponentAValue(nEd, nRd float64) float64 {
	r := nEd / nRd
	var v float64
	if r <= 0.7 {
		v = 1 + (r-0.1)*0.5/0.6
	} else {
		v = 1.5 + (r-0.7)*0.5/0.3
	}
	return math.Min(math.Max(v, 1), 2)
}

// BiaxialRatioValue returns (MEdz/MRdz)^a + (MEdy/MRdy)^a; see BiaxialRatio.
func BiaxialRatioValue(mEdY, mRdY, mEdZ, mRdZ, a float64) float64 {
	return math.Pow(mEdZ/mRdZ, a) + math.Pow(mEdY/mRdY, a)
}

// SymmetricGyrationValue returns is of m evenly spaced rows, n_o bars in each outer row at ±c and
// two in each row between; see ReinforcementGyration.
func SymmetricGyrationValue(c, nOuter, m float64) float64 {
	return c * math.Sqrt((nOuter+m*(m+1)/(3*(m-1))-2)/(nOuter+m-2))
}

// GyrationValue returns is = √(Σ n·c²/Σ n) of rows of equal bars; see ReinforcementGyration.
func GyrationValue(layers []Layer) float64 {
	num, den := 0.0, 0.0
	for _, l := range layers {
		num += float64(l.Count) * l.Coord * l.Coord
		den += float64(l.Count)
	}
	return math.Sqrt(num / den)
}
