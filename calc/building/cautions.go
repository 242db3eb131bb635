package building

import (
	"math"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// DefaultSpanRatio is the ratio of the longer to the shorter span at a joint above which the
// sheet cautions that the simplified subframe may be far from the frame solution.
const DefaultSpanRatio = 1.5

// Cautions of the simplified subframe, shown on the steps where they apply.
const (
	spanRatioWarning = "The spans either side of this joint differ by more than the span ratio: the simplified subframe " +
		"(far ends fixed, one release) may be far from the frame solution next to long spans; consider analysis: frame or both."
	fullStiffnessWarning = "The subframe takes the beams at full stiffness (4EI/L with their far ends fixed): this overstates " +
		"their restraint and may understate the column moments, which half stiffness allows for (common practice); " +
		"consider analysis: frame or both."
)

// spanRatio returns the span ratio in force: the building's, or DefaultSpanRatio where none
// is set.
func spanRatio(given float64) float64 {
	if given > 0 && !math.IsInf(given, 0) {
		return given
	}
	return DefaultSpanRatio
}

// spanRatioCaution records, where the spans l1 and l2 either side of a subframe joint differ by
// more than the span ratio limit (longer over shorter), their ratio with a caution that the
// simplified subframe may be far from the frame solution (common practice); it records nothing
// where they do not.
func spanRatioCaution(l *trace.Log, pre string, limit float64, l1, l2 trace.Q) {
	limit = spanRatio(limit)
	if !(l1.V > 0 && l2.V > 0) {
		return
	}
	r := math.Max(l1.V, l2.V) / math.Min(l1.V, l2.V)
	if r <= limit*(1+1e-12) {
		return
	}
	l.Add(trace.Formula(pre+"span_ratio", "Ratio of the longer to the shorter span at the joint", "common practice", "L_max/L_min", "",
		r, "max(L_1, L_2) / min(L_1, L_2)", trace.A("L_1", l1), trace.A("L_2", l2)).
		Note("Above the span ratio of the input (building.options.span_ratio, default 1.5).").
		Caution(spanRatioWarning))
}

// beamFactor returns the factor on the beams' stiffness in the subframe: 0.5 (half stiffness,
// common practice) as a constant, or 1 recorded as an input step with a caution where the input
// asks for full stiffness.
func beamFactor(l *trace.Log, in *model.Input) trace.Q {
	if in.Building.Options.BeamStiffness != "full" {
		return trace.Const(0.5, "k_b", "")
	}
	return l.Add(trace.Input("sub/k_b", "Factor on the beams' stiffness in the subframe: full stiffness", "input", "k_b", "", 1).
		Caution(fullStiffnessWarning))
}
