package frame

import "math"

// Stiff is a column of a subframe: its flexural stiffness and length.
type Stiff struct {
	EI float64 // N·mm²
	L  float64 // mm
}

// Beam is a beam of a subframe: its flexural stiffness, length and fixed-end moment at the joint.
type Beam struct {
	EI float64 // N·mm²
	L  float64 // mm
	// FEMAtJoint is the beam's fixed-end moment at the joint, N·mm, clockwise positive on
	// the beam end (negative for a downward-loaded beam on the joint's right, positive on its left).
	FEMAtJoint float64
}

// Subframe is the simplified subframe of one joint of a column line in a braced frame
// (common practice): the columns above and below and the beams on each side, with the far
// ends of all members taken as fixed.
type Subframe struct {
	ColAbove, ColBelow  *Stiff // nil when absent (top lift, or no column below)
	BeamLeft, BeamRight *Beam  // nil when absent (edge column)
	// BeamFactor scales the beams' stiffness: 0.5 for half stiffness (the default, taken
	// when the factor is not positive), 1 for full stiffness.
	BeamFactor float64
}

// SubframeMember is what the distribution at a subframe joint gives one member.
type SubframeMember struct {
	Present bool    // the member exists
	K       float64 // stiffness at the joint: 4EI/L, times BeamFactor for a beam, N·mm
	DF      float64 // distribution factor K/ΣK
	// AtJoint is the member's moment at the joint, N·mm, clockwise positive on the member end:
	// its fixed-end moment (beams) less DF times the unbalanced moment.
	AtJoint float64
	// CarryOver is the moment carried to the far end, half the distributed moment; for a
	// column it is the far-end moment, for a beam it adds to the beam's far-end fixed-end moment.
	CarryOver float64
}

// SubframeResult is the one-step moment distribution at a subframe joint.
type SubframeResult struct {
	Unbalanced                float64 // sum of the beams' fixed-end moments at the joint, N·mm
	SumK                      float64 // sum of the members' stiffnesses at the joint, N·mm
	Rotation                  float64 // joint rotation −Unbalanced/SumK, rad, clockwise positive
	Above, Below, Left, Right SubframeMember
}

// Distribute balances the subframe joint (common practice, simplified subframe; one release
// of moment distribution, exact since every far end is fixed). Members whose EI or L is not
// positive and finite count as absent; with no stiffness at all nothing is distributed.
func (s Subframe) Distribute() SubframeResult {
	factor := s.BeamFactor
	if !(factor > 0) || math.IsInf(factor, 0) {
		factor = 0.5
	}
	var r SubframeResult
	col := func(c *Stiff) SubframeMember {
		if c == nil || !usable(c.EI, c.L) {
			return SubframeMember{}
		}
		return SubframeMember{Present: true, K: 4 * c.EI / c.L}
	}
	beam := func(b *Beam) (SubframeMember, float64) {
		if b == nil || !usable(b.EI, b.L) || !finite(b.FEMAtJoint) {
			return SubframeMember{}, 0
		}
		return SubframeMember{Present: true, K: factor * 4 * b.EI / b.L}, b.FEMAtJoint
	}
	r.Above, r.Below = col(s.ColAbove), col(s.ColBelow)
	var femL, femR float64
	r.Left, femL = beam(s.BeamLeft)
	r.Right, femR = beam(s.BeamRight)
	r.Unbalanced = femL + femR
	r.SumK = r.Above.K + r.Below.K + r.Left.K + r.Right.K
	if !(r.SumK > 0) || math.IsInf(r.SumK, 0) {
		r.SumK = 0
		r.Left.AtJoint, r.Right.AtJoint = femL, femR
		return r
	}
	r.Rotation = -r.Unbalanced / r.SumK
	for _, m := range []struct {
		p   *SubframeMember
		fem float64
	}{{&r.Above, 0}, {&r.Below, 0}, {&r.Left, femL}, {&r.Right, femR}} {
		if !m.p.Present {
			continue
		}
		m.p.DF = m.p.K / r.SumK
		distributed := -r.Unbalanced * m.p.DF
		m.p.AtJoint = m.fem + distributed
		m.p.CarryOver = distributed / 2
	}
	return r
}

func usable(ei, l float64) bool {
	return ei > 0 && l > 0 && finite(ei, l, ei/l)
}
