package section

import (
	"math"

	"colsheet/calc/trace"
)

// Clause and method strings of the biaxial trace.
const (
	clauseBiax      = "EN 1992-1-1:2004 6.1(2)P, 6.1(5), Fig. 6.1"
	clauseRectNote  = "EN 1992-1-1:2004 3.1.7(3), note"
	methodBiaxAngle = "Brent's method (Brent 1973, zeroin) on the neutral-axis angle until the direction of (M_R,y, M_R,z) is within 1e-9 rad of that of (M_Ed,y, M_Ed,z), the depth at each trial angle solved for N = N_Ed"
	methodBiaxDepth = "Brent's method (Brent 1973, zeroin) on the strain-profile parameter at the angle found, |N − N_Ed| ≤ 1e-11·N_Rd,max"
)

// BiaxialStep records in log the steps of the exact biaxial resistance st (from Biaxial)
// against the design moments mEdY and mEdZ at axial force nEd: where st.Reduced, the reduced
// stress of the rectangular block (ReducedStressStep); a solve step for the
// neutral-axis angle (residual: the sine of the angle between the resisting and the design
// moment, (M_R,y·M_Ed,z − M_R,z·M_Ed,y)/(M_Rd·M_Ed)), a solve step for its depth (residual
// N − N_Ed), the formulas for M_Ed = √(M_Ed,y² + M_Ed,z²) and M_Rd = √(M_R,y² + M_R,z²), and
// the check M_Ed/M_Rd; it returns M_Rd and the ratio. Step IDs are id followed by a short
// name; every expression reproduces its value. refs names the steps of η and fcd.
func (s *Section) BiaxialStep(log *trace.Log, id string, nEd, mEdY, mEdZ trace.Q, st BiaxialState, refs Refs) (mRd, ratio trace.Q) {
	my, mz := st.My, st.Mz
	mey, mez := mEdY.V, mEdZ.V
	// Values mirror their expressions operation for operation (float64() conversions keep
	// the compiler from fusing multiply-adds), so that the recheck is exact.
	mrdV := math.Sqrt(float64(my*my) + float64(mz*mz))
	medV := math.Sqrt(float64(mey*mey) + float64(mez*mez))
	sinRes := (float64(my*mez) - float64(mz*mey)) / math.Max(float64(mrdV*medV), 1)

	myQ := trace.Q{V: my, Symbol: "M_R,y", Unit: "Nmm"}
	mzQ := trace.Q{V: mz, Symbol: "M_R,z", Unit: "Nmm"}
	nQ := trace.Q{V: st.N, Symbol: "N_R", Unit: "N"}
	choices := "Concrete: " + s.Block.String() + " block, no tension, integrated in closed form over the compressed polygon; steel: horizontal top branch, no strain limit; concrete displaced by bars in compression deducted."
	var red trace.Q
	if st.Reduced {
		red = log.Add(s.ReducedStressStep(id+"sigma_c", refs))
		choices += " The block's stress is the reduced stress of step " + red.From + ", over the compressed polygon and for the displaced concrete."
	}
	resultants := "N_R, M_R,y = Σ F·z and M_R,z = Σ F·y are the resultants of the concrete and the bars for the strain plane found."

	angle := trace.Solve(id+"beta", "Inclination of the neutral axis for a resisting moment parallel to the design moment",
		clauseBiax, "β", "deg", st.Angle*180/math.Pi, methodBiaxAngle,
		"(M_Ry * M_Edz - M_Rz * M_Edy) / max(sqrt(M_Ry ** 2 + M_Rz ** 2) * sqrt(M_Edy ** 2 + M_Edz ** 2), 1)", sinRes,
		trace.A("M_Ry", myQ), trace.A("M_Rz", mzQ), trace.A("M_Edy", mEdY), trace.A("M_Edz", mEdZ)).
		Note("β = 0: neutral axis parallel to y with the +z side compressed; β = 90°: parallel to z with the +y side compressed.").
		Note("The pivots are measured perpendicular to the neutral axis, over the depth b·|sin β| + h·|cos β| of the section.").
		Note(resultants).Note(choices)
	angleQ := log.Add(angle)

	var depth trace.Step
	if st.Pivot != "C" {
		depth = trace.Solve(id+"x", "Neutral-axis depth from the most compressed corner for equilibrium with N_Ed (pivot B: ε_cu at that corner)",
			clausePivots, "x", "mm", st.Depth, methodBiaxDepth, "N_R - N_Ed", st.N-nEd.V,
			trace.A("N_R", nQ), trace.A("N_Ed", nEd))
	} else {
		depth = trace.Solve(id+"eps_bot", "Strain at the least compressed corner for equilibrium with N_Ed (pivot C: whole section compressed)",
			clausePivots, "ε_bot", "", st.EpsBottom, methodBiaxDepth, "N_R - N_Ed", st.N-nEd.V,
			trace.A("N_R", nQ), trace.A("N_Ed", nEd))
		if math.IsInf(st.Depth, 1) {
			depth = depth.Note("Uniform strain: the neutral axis is at infinity and the section has no moment resistance.")
		} else {
			depth = depth.Note("The neutral axis lies outside the section.")
		}
	}
	log.Add(depth.Note(resultants))

	med := log.Add(trace.Formula(id+"M_Ed", "Resultant design moment", clauseCommon, "M_Ed", "Nmm", medV,
		"sqrt(M_Edy ** 2 + M_Edz ** 2)", trace.A("M_Edy", mEdY), trace.A("M_Edz", mEdZ)))
	mRd = log.Add(trace.Formula(id+"M_Rd", "Design moment of resistance in the direction of the design moment", clauseBiax, "M_Rd", "Nmm", mrdV,
		"sqrt(M_Ry ** 2 + M_Rz ** 2)", trace.A("M_Ry", myQ), trace.A("M_Rz", mzQ)).
		Note("M_R,y and M_R,z are the resultants at the neutral axis of step " + angleQ.From + " (and its depth), integrated over the section."))
	ratioV := medV / math.Max(mrdV, 1)
	check := trace.Check(id+"check", "Biaxial bending, exact section resistance", clauseBiax, "M_Ed ≤ M_Rd", ratioV,
		"M_Ed / max(M_Rd, 1)", trace.A("M_Ed", med), trace.A("M_Rd", mRd)).
		Note("An accurate section design for biaxial bending; EN 1992-1-1:2004 5.8.9(4) offers the simplified criterion, Eq. (5.39), as the alternative.")
	if mrdV >= 1 {
		check = check.Shown("M_Ed / M_Rd")
	}
	ratio = log.Add(check)
	return mRd, ratio
}

// ReducedStressStep returns the stress of the rectangular block where the width of the
// compression zone decreases towards the extreme compression fibre, as it does whenever the
// neutral axis is inclined: η·fcd reduced by 10 %, EN 1992-1-1:2004 3.1.7(3), Note.
func (s *Section) ReducedStressStep(id string, refs Refs) trace.Step {
	k := trace.Const(BlockReduction, "k", "")
	eta := trace.Q{V: s.Concrete.Eta, Symbol: "η", Unit: "", From: refs.Eta}
	fcd := trace.Q{V: s.Fcd, Symbol: "f_cd", Unit: "MPa", From: refs.Fcd}
	return trace.Formula(id, "Stress of the rectangular block, reduced because the compression zone narrows towards the most compressed corner",
		clauseRectNote, "σ_c,red", "MPa", s.ReducedStress(), "k * eta * f_cd", trace.A("k", k), trace.A("eta", eta), trace.A("f_cd", fcd)).
		Note("The neutral axis is inclined, so the width of the compressed zone decreases towards the most compressed corner; on the axes, where the width is constant, the block keeps η·f_cd.")
}
