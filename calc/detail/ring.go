package detail

import (
	"math"

	"colsheet/calc/trace"
)

// This file holds the detailing of circular columns: bars evenly on one circle inside circular
// links or a helix.

// RingRadiusStep records the radius of the circle through the bars' centres,
// rs = D/2 − c_nom − φt − φ/2 (geometry).
func RingRadiusStep(id string, d, cnom, phiT, phi trace.Q) trace.Step {
	return trace.Formula(id, "Radius of the circle through the centres of the bars", "common practice", "r_s", "mm",
		d.V/2-cnom.V-phiT.V-phi.V/2, "D / 2 - c_nom - phi_t - phi / 2",
		trace.A("D", d), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi))
}

// RingGapStep records the clear distance between neighbouring bars of n on the circle of radius
// rs, along the chord, 2·rs·sin(π/n) − φ (geometry).
func RingGapStep(id string, rs, n, phi trace.Q) trace.Step {
	return trace.Formula(id, "Clear distance between neighbouring bars on the circle (along the chord)", "common practice", "s_c", "mm",
		RingGap(rs.V, int(n.V), phi.V), "2 * r_s * sin(3.141592653589793 / n) - phi",
		trace.A("r_s", rs), trace.A("n", n), trace.A("phi", phi)).Shown("2 * r_s * sin(pi / n) - phi")
}

// RingMaxBarsValue returns the most bars of diameter dia on a circle of radius rs that keep the
// clear gap gap along the chord: ⌊π / asin((φ + gap)/(2·rs))⌋ (geometry); 0 when none fit.
func RingMaxBarsValue(rs, dia, gap float64) float64 {
	s := (dia + gap) / (2 * rs)
	if !(rs > 0) || s > 1 {
		return 0
	}
	return math.Floor(math.Pi/math.Asin(s) + 1e-9)
}

// RingMaxBars records the most bars on the circle that keep a poker vibrator's gap between them
// (common practice, no source).
func RingMaxBars(id string, rs, phi, gap trace.Q) trace.Step {
	return trace.Formula(id, "Most bars on the circle that keep the vibrator gap", "common practice", "n_max", "",
		RingMaxBarsValue(rs.V, phi.V, gap.V), "floor(3.141592653589793 / asin((phi + s_vib) / (2 * r_s)) + 0.000000001)",
		trace.A("r_s", rs), trace.A("phi", phi), trace.A("s_vib", gap)).Shown("floor(pi / asin((phi + s_vib) / (2 * r_s)))")
}

// RingRestraint records that a circular link or a helix holds every bar of a ring,
// EN 1992-1-1:2004 9.5.3(6): the bars lie on the transverse reinforcement all round.
func RingRestraint(id string, n trace.Q) trace.Step {
	return trace.Formula(id, "Bars held by the circular links or the helix", ec2+"9.5.3(6)", "n_held", "", n.V, "n", trace.A("n", n)).
		Note("Every bar of a ring lies against the circular link or the helix, which holds it: no extra ties are needed.")
}

// CircularLinkLengthValue returns the cut length of a closed circular link, π·(D − 2·c − φt) + lap;
// see CircularLinkLength.
func CircularLinkLengthValue(d, c, phiT, lap float64) float64 { return math.Pi*(d-2*c-phiT) + lap }

// CircularLinkLength returns the cut length of a closed circular link: its centre line round the
// section inside the cover, π·(D − 2·c − φt), and the overlap of its ends, common practice.
func CircularLinkLength(id string, d, c, phiT, lap trace.Q) trace.Step {
	return trace.Formula(id, "Cut length of a circular link", "common practice", "L_link", "mm",
		CircularLinkLengthValue(d.V, c.V, phiT.V, lap.V), "3.141592653589793 * (D - 2 * c_nom - phi_t) + l_ov",
		trace.A("D", d), trace.A("c_nom", c), trace.A("phi_t", phiT), trace.A("l_ov", lap)).Shown("pi * (D - 2 * c_nom - phi_t) + l_ov")
}

// HelixEndTurns is the number of extra turns of a helix, one and a half at each end, that
// anchor it (common practice, from memory).
const HelixEndTurns = 3

// HelixLengthValue returns the length of a helix of n turns and centre-line diameter dc with its
// end turns, (n + HelixEndTurns)·π·dc; see HelixLength.
func HelixLengthValue(n, dc float64) float64 { return (n + HelixEndTurns) * math.Pi * dc }

// HelixLength returns the length of a helix with n turns in the lift (one per link position)
// and one and a half extra turns at each end to anchor it, each turn π·(D − 2·c − φt) on its
// centre line (the pitch adds less than 0.5 % at the pitches of 9.5.3), common practice.
func HelixLength(id string, n, d, c, phiT trace.Q) trace.Step {
	return trace.Formula(id, "Length of the helix in the lift, with one and a half turns more at each end", "common practice", "L_helix", "mm",
		HelixLengthValue(n.V, d.V-2*c.V-phiT.V), "(n_t + 3) * 3.141592653589793 * (D - 2 * c_nom - phi_t)",
		trace.A("n_t", n), trace.A("D", d), trace.A("c_nom", c), trace.A("phi_t", phiT)).
		Shown("(n_t + 3) * pi * (D - 2 * c_nom - phi_t)")
}

// RingContinuityCheck records the check that the ring of bars of the lift continues that of the
// lift above: the same or more bars, the same or a larger diameter and, in the same section, each
// bar above beside a bar below (common practice, no source; laps beside the bar below,
// EN 1992-1-1:2004 8.7.2(3)).
func RingContinuityCheck(id string, c Continuity, nA, phiA, n, phi trace.Q) trace.Step {
	if !c.SameSection {
		return trace.Check(id, "Bars of the lift above continued by the bars of this lift, cranked into the section above", "common practice",
			"n_above ≤ n, φ_above ≤ φ", c.Ratio, "max(n_a / n, phi_a / phi)",
			trace.A("n_a", nA), trace.A("n", n), trace.A("phi_a", phiA), trace.A("phi", phi))
	}
	d := trace.Const(c.Farthest, "d_max", "mm")
	return trace.Check(id, "Each bar of the lift above beside a bar of this lift", "common practice",
		"n_above ≤ n, φ_above ≤ φ, d_max ≤ max(φ, φ_above)", c.Ratio,
		"max(n_a / n, phi_a / phi, d_max / max(phi, phi_a))",
		trace.A("n_a", nA), trace.A("n", n), trace.A("phi_a", phiA), trace.A("phi", phi), trace.A("d_max", d)).
		Note("d_max is the greatest distance from the centre of a bar of the lift above to the centre of the nearest bar of this lift, at the positions of both rings; within one bar diameter the bar above laps beside the bar below.")
}
