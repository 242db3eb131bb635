package creep

import "math"

// The value functions below hold the formulas of the step functions of this package, which call
// them and record the same formula as an expression; each cites its clause at its step function.

// NotionalSizeValue returns h0 = 2Ac/u; see NotionalSize.
func NotionalSizeValue(ac, u float64) float64 { return 2 * ac / u }

// NotionalSizeRectValue returns h0 = 2bh/(2(b + h)) of a rectangle drying on all faces; see NotionalSizeRect.
func NotionalSizeRectValue(b, h float64) float64 { return 2 * b * h / (2 * (b + h)) }

// Alpha1Value returns α1 = (35/fcm)^0.7; see Alpha1.
func Alpha1Value(fcm float64) float64 { return math.Pow(35/fcm, 0.7) }

// Alpha2Value returns α2 = (35/fcm)^0.2; see Alpha2.
func Alpha2Value(fcm float64) float64 { return math.Pow(35/fcm, 0.2) }

// Alpha3Value returns α3 = (35/fcm)^0.5; see Alpha3.
func Alpha3Value(fcm float64) float64 { return math.Pow(35/fcm, 0.5) }

// PhiRHValue returns φRH by (B.3a) for fcm ≤ 35 MPa and (B.3b) above; see PhiRH.
func PhiRHValue(rh, h0, fcm, alpha1, alpha2 float64) float64 {
	d := (1 - rh/100) / (0.1 * math.Pow(h0, 1.0/3))
	if fcm <= 35 {
		return 1 + d
	}
	return (1 + d*alpha1) * alpha2
}

// BetaFcmValue returns β(fcm) = 16.8/√fcm; see BetaFcm.
func BetaFcmValue(fcm float64) float64 { return 16.8 / math.Sqrt(fcm) }

// CementExponent returns the exponent α of (B.9): −1 for class S, 0 for N, 1 for R; false for another class.
func CementExponent(class string) (float64, bool) {
	switch class {
	case CementS:
		return -1, true
	case CementN:
		return 0, true
	case CementR:
		return 1, true
	}
	return 0, false
}

// AdjustedAgeValue returns t0 = t0,T·(9/(2 + t0,T^1.2) + 1)^α, not less than 0.5 days; see AdjustedAge.
func AdjustedAgeValue(t0T, alpha float64) float64 {
	return math.Max(t0T*math.Pow(9/(2+math.Pow(t0T, 1.2))+1, alpha), 0.5)
}

// BetaT0Value returns β(t0) = 1/(0.1 + t0^0.20); see BetaT0.
func BetaT0Value(t0 float64) float64 { return 1 / (0.1 + math.Pow(t0, 0.2)) }

// NotionalValue returns φ0 = φRH·β(fcm)·β(t0); see Notional.
func NotionalValue(phiRH, betaFcm, betaT0 float64) float64 { return phiRH * betaFcm * betaT0 }

// BetaHValue returns βH by (B.8a) for fcm ≤ 35 MPa and (B.8b) above; see BetaH.
func BetaHValue(rh, h0, fcm, alpha3 float64) float64 {
	b := 1.5 * (1 + math.Pow(0.012*rh, 18)) * h0
	if fcm <= 35 {
		return math.Min(b+250, 1500)
	}
	return math.Min(b+250*alpha3, 1500*alpha3)
}

// BetaCValue returns βc(t, t0) = [(t − t0)/(βH + t − t0)]^0.3, and 0 for t ≤ t0; see BetaC.
func BetaCValue(t, t0, betaH float64) float64 {
	if t <= t0 {
		return 0
	}
	return math.Pow((t-t0)/(betaH+t-t0), 0.3)
}

// EffectiveRatioValue returns φef = φ(∞, t0)·M0Eqp/M0Ed; see EffectiveRatio.
func EffectiveRatioValue(phiInf, ratio float64) float64 { return phiInf * ratio }

// FinalValue returns φ(∞, t0) by Annex B from fcm (MPa), RH (%), h0 (mm), the age at loading t0T
// (days, at 20 °C) and the cement exponent alpha; see Coefficient.
func FinalValue(fcm, rh, h0, t0T, alpha float64) float64 {
	phiRH := PhiRHValue(rh, h0, fcm, Alpha1Value(fcm), Alpha2Value(fcm))
	return NotionalValue(phiRH, BetaFcmValue(fcm), BetaT0Value(AdjustedAgeValue(t0T, alpha)))
}
