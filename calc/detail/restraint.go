package detail

import (
	"math"
	"strconv"

	"colsheet/calc/trace"
)

// This file holds the restraint of the longitudinal bars by transverse reinforcement,
// EN 1992-1-1:2004 9.5.3(6): the perimeter link holds the corner bars, and extra ties hold
// enough intermediate bars that no bar lies further than the limit from a restrained bar.
// Distances are between bar centres along the face; every face is taken as in compression.

// RestraintLimit is the greatest distance, mm, of a bar in a compression zone from a restrained bar,
// EN 1992-1-1:2004 9.5.3(6).
const RestraintLimit = 150.0

// FaceRestraint is the restraint of the bars along one face of a pattern.
type FaceRestraint struct {
	Bars     int     // bars along the face, corners included
	Spacing  float64 // centre distance between neighbouring bars, mm
	Reach    int     // neighbours a restrained bar reaches each way within the limit
	Extra    int     // intermediate bars of the face held by an extra tie
	Farthest float64 // greatest centre distance of a bar from its nearest restrained bar, mm
}

// Restrained returns the indices from one corner (0 … Bars−1) of the restrained bars, corners
// included, spread as evenly as the places allow; nil for a face of fewer than two bars.
func (f FaceRestraint) Restrained() []int {
	n, k := f.Bars, f.Extra
	if n < 2 {
		return nil
	}
	r := make([]int, k+2)
	for i := range r {
		// round(i·(n − 1)/(k + 1)) in integers, halves up.
		r[i] = (2*i*(n-1) + k + 1) / (2 * (k + 1))
	}
	return r
}

// RestraintPlan is the restraint of a pattern's bars by the perimeter link and extra ties.
type RestraintPlan struct {
	Limit  float64       // greatest distance from a restrained bar, mm
	AlongB FaceRestraint // each face of width b (bars along y)
	AlongH FaceRestraint // each face of depth h (bars along z)
	// Ties is the number of extra ties (link legs), each running across the section between a pair of
	// opposite intermediate bars: AlongB.Extra + AlongH.Extra.
	Ties int
}

// OK reports whether every bar lies within the limit of a restrained bar.
func (r RestraintPlan) OK() bool {
	return r.AlongB.Farthest <= r.Limit+1e-9 && r.AlongH.Farthest <= r.Limit+1e-9
}

// reachValue returns how many neighbours a restrained bar reaches each way, floor(limit/s).
func reachValue(limit, s float64) float64 { return math.Floor(limit/s + 1e-9) }

// extraValue returns the fewest intermediate bars to restrain among n with reach m,
// ceil((n − 1)/(2m + 1)) − 1 written as floor((n − 1 + 2m)/(2m + 1)) − 1.
func extraValue(n, m float64) float64 { return math.Floor((n-1+2*m)/(2*m+1)) - 1 }

// farthestValue returns the greatest distance of a bar from a restrained bar when k intermediate
// bars of n at spacing s are restrained as evenly as possible: floor(ceil((n − 1)/(k + 1))/2)·s.
func farthestValue(n, k, s float64) float64 { return math.Floor(math.Floor((n-1+k)/(k+1))/2) * s }

// restrainFace returns the fewest restrained bars along a face of n bars at centre spacing s.
//
// A restrained bar holds the bars within m = floor(limit/s) places each way, so between two
// restrained bars at most 2m bars may lie: the n − 1 places between the corners split into at
// least ceil((n − 1)/(2m + 1)) gaps. The restrained bars are spread as evenly as the places allow.
func restrainFace(n int, s, limit float64) FaceRestraint {
	f := FaceRestraint{Bars: n, Spacing: s}
	if n < 2 {
		return f
	}
	m := reachValue(limit, s)
	k := int(extraValue(float64(n), m))
	f.Reach, f.Extra = int(m), k
	f.Farthest = farthestValue(float64(n), float64(k), s)
	return f
}

// Restraint returns the fewest extra ties that keep every bar of the pattern within limit (centre
// distance along the face) of a restrained bar, the corners being held by the perimeter link,
// EN 1992-1-1:2004 9.5.3(6). The pattern is taken to fit the geometry.
//
// A ring's bars are all held by its circular link or helix: no extra ties.
func (g Geometry) Restraint(p Pattern, limit float64) RestraintPlan {
	if p.Ring > 0 {
		return RestraintPlan{Limit: limit}
	}
	e := g.Edge(p.Dia)
	r := RestraintPlan{Limit: limit,
		AlongB: restrainFace(p.NB, (g.B-2*e)/float64(p.NB-1), limit),
		AlongH: restrainFace(p.NH, (g.H-2*e)/float64(p.NH-1), limit),
	}
	r.Ties = r.AlongB.Extra + r.AlongH.Extra
	return r
}

// Traced holds the steps that give the section, the cover, the link and the bars, so that the
// restraint steps name them instead of repeating their values; a field without a step (From
// empty) is taken from the geometry and the pattern as a number.
type Traced struct {
	B, H, Cover, Link, Dia trace.Q // mm
	NB, NH                 trace.Q // bars along each b-face and each h-face, corners included
}

// or returns q when a step gives it, else the number v.
func or(q trace.Q, v float64, symbol, unit string) trace.Q {
	if q.From != "" {
		return q
	}
	return trace.Const(v, symbol, unit)
}

// RestraintSteps records the restraint of the pattern's bars for the limit of 9.5.3(6) face by face
// (bars, spacing, reach, the bars held by extra ties, the farthest bar and its check) and returns
// the number of extra ties.
func RestraintSteps(l *trace.Log, prefix string, g Geometry, p Pattern, in Traced) int {
	plan := g.Restraint(p, RestraintLimit)
	lim := l.Add(trace.Input(prefix+"limit", "Greatest distance of a bar in a compression zone from a restrained bar",
		ec2+"9.5.3(6)", "s_lim", "mm", RestraintLimit).
		Note("Measured between bar centres along the face; every face of the column is taken as in compression."))
	b := or(in.B, g.B, "b", "mm")
	h := or(in.H, g.H, "h", "mm")
	cnom := or(in.Cover, g.Cover, "c_nom", "mm")
	phiT := or(in.Link, g.Link, "φ_t", "mm")
	phi := or(in.Dia, p.Dia, "φ", "mm")
	nB := or(in.NB, float64(p.NB), "n_b", "")
	nH := or(in.NH, float64(p.NH), "n_h", "")
	kB := faceSteps(l, prefix+"b/", "b", "each b-face", plan.AlongB, b, cnom, phiT, phi, nB, lim)
	kH := faceSteps(l, prefix+"h/", "h", "each h-face", plan.AlongH, h, cnom, phiT, phi, nH, lim)
	l.Add(trace.Formula(prefix+"ties", "Extra ties, each across the section between a pair of opposite bars",
		ec2+"9.5.3(6)", "n_ties", "", float64(plan.Ties), "k_b + k_h", trace.A("k_b", kB), trace.A("k_h", kH)).
		Note("The perimeter link holds every corner bar; each extra tie holds two opposite intermediate bars."))
	return plan.Ties
}

// faceSteps records the restraint of the bars along one pair of faces and returns the number of
// intermediate bars held by extra ties on each face.
func faceSteps(l *trace.Log, prefix, side, faces string, f FaceRestraint, width, cnom, phiT, phi, n, lim trace.Q) trace.Q {
	s := l.Add(trace.Formula(prefix+"s", "Centre distance between the bars along "+faces, "common practice", "s_"+side, "mm",
		f.Spacing, "(w - 2 * (c_nom + phi_t + phi / 2)) / (n - 1)",
		trace.A("w", width), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi), trace.A("n", n)))
	m := l.Add(trace.Formula(prefix+"reach", "Neighbours within reach of a restrained bar each way along "+faces,
		ec2+"9.5.3(6)", "m_"+side, "", float64(f.Reach), "floor(s_lim / s + 0.000000001)", trace.A("s_lim", lim), trace.A("s", s)).
		Shown("floor(s_lim / s)"))
	k := l.Add(trace.Formula(prefix+"extra", "Intermediate bars held by extra ties on "+faces+" (fewest)",
		ec2+"9.5.3(6)", "k_"+side, "", float64(f.Extra), "floor((n - 1 + 2 * m) / (2 * m + 1)) - 1",
		trace.A("n", n), trace.A("m", m)).
		Shown("ceil((n - 1) / (2 * m + 1)) - 1").
		Note("Between two restrained bars at most 2·m bars may lie; the restrained bars are spread as evenly as the bars allow."))
	rs := f.Restrained()
	for j := 1; j < len(rs)-1; j++ {
		i := rs[j]
		idx := trace.Const(float64(i), "i", "")
		l.Add(trace.Formula(prefix+"tie"+strconv.Itoa(j), "Bar held by an extra tie on "+faces+": distance from the corner bar",
			ec2+"9.5.3(6)", "a_"+side+","+strconv.Itoa(j), "mm", float64(i)*f.Spacing, "i * s", trace.A("i", idx), trace.A("s", s)))
	}
	d := l.Add(trace.Formula(prefix+"d_max", "Greatest distance of a bar from a restrained bar along "+faces,
		ec2+"9.5.3(6)", "d_max,"+side, "mm", f.Farthest, "floor(floor((n - 1 + k) / (k + 1)) / 2) * s",
		trace.A("n", n), trace.A("k", k), trace.A("s", s)).
		Shown("floor(ceil((n - 1) / (k + 1)) / 2) * s"))
	l.Add(trace.Check(prefix+"check", "Every bar along "+faces+" near enough to a restrained bar", ec2+"9.5.3(6)",
		"d_max ≤ s_lim", f.Farthest/lim.V, "d_max / s_lim", trace.A("d_max", d), trace.A("s_lim", lim)))
	return k
}
