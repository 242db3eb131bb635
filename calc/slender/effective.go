package slender

import (
	"math"

	"colsheet/calc/trace"
)

// KMin is the least relative flexibility of a rotational restraint, the recommended minimum of
// EN 1992-1-1:2004 5.8.3.2(3), note (rigid restraint is rare in practice).
const KMin = 0.1

// FlexibilityValue returns k = Σ(EI/l) of the columns at a joint over Σ(k_cr·2EI/l) of the
// restraining beams, at least KMin; see Flexibility.
func FlexibilityValue(cols, beams float64) float64 { return math.Max(cols/beams, KMin) }

// Flexibility returns the relative flexibility of the rotational restraint at a column end,
// k = (θ/M)·(EI/l), as Σ(EI/l) of the columns meeting at the joint over Σ(k_cr·2EI/l) of the
// beams (a braced frame's beams bend in single curvature in the buckling mode; k_cr allows for
// cracking), not less than 0.1, EN 1992-1-1:2004 5.8.3.2(3); the sharing of the joint's
// restraint between the columns above and below is common practice.
func Flexibility(id string, cols, beams trace.Q) trace.Step {
	s := trace.Formula(id, "Relative flexibility of the restraint", ec2+"5.8.3.2(3)", "k", "",
		FlexibilityValue(cols.V, beams.V), "max(S_c / S_b, 0.1)", trace.A("S_c", cols), trace.A("S_b", beams))
	if cols.V/beams.V < KMin {
		s = s.Note("The recommended minimum k = 0.1 governs (5.8.3.2(3), note).")
	}
	return s
}

// EffectiveLengthBracedValue returns l0 = 0.5·l·√((1 + k1/(0.45 + k1))·(1 + k2/(0.45 + k2))); see EffectiveLengthBraced.
func EffectiveLengthBracedValue(l, k1, k2 float64) float64 {
	return 0.5 * l * math.Sqrt((1+k1/(0.45+k1))*(1+k2/(0.45+k2)))
}

// EffectiveLengthBraced returns the effective length of a braced member,
// l0 = 0.5·l·√((1 + k1/(0.45 + k1))·(1 + k2/(0.45 + k2))), EN 1992-1-1:2004 5.8.3.2(3), Eq. (5.15).
func EffectiveLengthBraced(id string, l, k1, k2 trace.Q) trace.Step {
	return trace.Formula(id, "Effective length of the braced column", ec2+"5.8.3.2(3), Eq. (5.15)", "l_0", "mm",
		EffectiveLengthBracedValue(l.V, k1.V, k2.V), "0.5 * l * sqrt((1 + k_1 / (0.45 + k_1)) * (1 + k_2 / (0.45 + k_2)))",
		trace.A("l", l), trace.A("k_1", k1), trace.A("k_2", k2))
}
