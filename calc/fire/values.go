package fire

import (
	"math"

	"colsheet/calc/model"
)

// Recommended values and limits of EN 1992-1-2:2004, cited at the steps that use them.
const (
	EtaFiDefault = 0.7    // reduction factor ηfi, 2.4.2(3)
	EMaxFactor   = 0.15   // emax/h (or b), 5.3.2(2), note
	L0FiMax      = 3000.0 // greatest effective length in fire of Table 5.2a, mm, 5.3.2(2)
	SteelMax     = 0.04   // As/Ac below which Table 5.2a applies, 5.3.2(2)
	FckMax       = 50.0   // fck of C50/60, the highest class of Section 5; Section 6 applies above, MPa
	MeshAxis     = 70.0   // axis distance from which a surface reinforcement is required, mm, 4.5.2(2)
)

// Limits of Eq. (5.7) of EN 1992-1-2:2004 5.3.2.
const (
	AxisMin57, AxisMax57   = 25.0, 80.0     // axis distance a, mm
	L0FiMin57, L0FiMax57   = 2000.0, 6000.0 // effective length in fire l0,fi, mm
	WidthMin57, WidthMax57 = 200.0, 450.0   // equivalent width b′, mm
	Aspect57               = 1.5            // h ≤ 1.5·b
)

func boolNum(b bool) float64 {
	if b {
		return 1
	}
	return 0
}

// EtaFiValue returns ηfi of the fire data, 0.7 when none is given; see EtaFi.
func EtaFiValue(f model.Fire) float64 {
	if f.EtaFi == 0 {
		return EtaFiDefault
	}
	return f.EtaFi
}

// UtilisationValue returns μfi as Utilisation records it: ηfi·NEd/NRd when asked for and NRd > 0, else ηfi.
func UtilisationValue(f model.Fire, nEd, nRd float64) float64 {
	eta := EtaFiValue(f)
	if f.UseMuFi && nRd > 0 {
		return eta * nEd / nRd
	}
	return eta
}

// MuMaxValue returns the largest μfi for which Table 5.2a gives values at the rating: 0.7, or
// 0.5 where the row's last column asks for a width above 600 mm (R240); see TableScope.
func MuMaxValue(rating int) float64 {
	if table52a[locate(rating, 0).row][2] == nil {
		return muColumns[1]
	}
	return muColumns[2]
}

// AxisDistanceValue returns a = c + φt + φ/2; see AxisDistance.
func AxisDistanceValue(cover, link, dia float64) float64 { return cover + link + dia/2 }

// EccentricityValue returns e = |M|/N with N not below 1 N; see Eccentricity.
func EccentricityValue(m, n float64) float64 { return math.Abs(m) / math.Max(n, 1) }

// REtaValue returns Rηfi = 83·(1 − μfi·(1 + ω)/(0.85/αcc + ω)); see REta.
func REtaValue(mu, omega, alphaCc float64) float64 {
	return 83 * (1 - mu*(1+omega)/(0.85/alphaCc+omega))
}

// RAValue returns Ra = 1.60·(a − 30) with a not above 80 mm; see RA.
func RAValue(a float64) float64 { return 1.6 * (math.Min(a, AxisMax57) - 30) }

// RLValue returns Rl = 9.60·(5 − l0,fi) with l0,fi in m, not below 2 m; see RL.
func RLValue(l0fi float64) float64 { return 9.6 * (5 - math.Max(l0fi, L0FiMin57)/1000) }

// EquivalentWidthValue returns b′ = 2·Ac/(b + h); see EquivalentWidth.
func EquivalentWidthValue(ac, b, h float64) float64 { return 2 * ac / (b + h) }

// RBValue returns Rb = 0.09·b′ with b′ not above 450 mm; see RB.
func RBValue(bEq float64) float64 { return 0.09 * math.Min(bEq, WidthMax57) }

// RNValue returns Rn = 0 for 4 bars (corner bars only) and 12 for more; see RN.
func RNValue(n float64) float64 {
	if n > 4 {
		return 12
	}
	return 0
}

// Eq57Value returns R = 120·((Rηfi + Ra + Rl + Rb + Rn)/120)^1.8 with a negative sum taken as 0; see Eq57.
func Eq57Value(rEta, ra, rl, rb, rn float64) float64 {
	return 120 * math.Pow(math.Max(rEta+ra+rl+rb+rn, 0)/120, 1.8)
}
