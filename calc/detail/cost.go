package detail

import (
	"math"

	"colsheet/calc/trace"
)

// This file holds the cost by which the design chooses among the bar patterns that pass, and the
// rules of practice the choice keeps to: the least main bar, the gap a poker vibrator needs and
// the continuity of the bars from one lift to the next. None of these is a rule of EN 1992-1-1;
// each is common practice, no source, with its default weights stated as parameters.

// densityMM is SteelDensity in kg/mm³.
const densityMM = SteelDensity * 1e-9

// CostWeights are the labour terms of the cost, in kilograms of steel that a bar or a tie piece
// is taken to be worth (common practice, no source).
type CostWeights struct {
	PerBar float64 // kg-equivalent per main bar of the lift
	PerTie float64 // kg-equivalent per tie piece fixed over the lift
}

// CostBasis is what the cost of a pattern over one lift depends on besides the pattern.
type CostBasis struct {
	Lift    float64 // length of the lift, mm
	Lap     float64 // lap length of the bars above the floor, mm
	Spacing float64 // general link spacing provided, mm
}

// Cost is the cost of one bar pattern over one lift, in kg-equivalent: the steel of the main bars
// over the lift with their lap, of the links and the extra ties at the general spacing, and the
// labour terms per bar and per tie piece.
type Cost struct {
	Bars      int     // main bars
	Sets      float64 // link sets over the lift, floor(L/s) + 1
	Perimeter float64 // centre-line length of one perimeter link, mm
	Ties      int     // extra ties in each set (9.5.3(6))
	TieLength float64 // centre-line length of the extra ties of one set, mm
	MainMass  float64 // kg
	LinkMass  float64 // kg, links and extra ties
	Labour    float64 // kg-equivalent
	Total     float64 // kg-equivalent
}

// Mass returns the steel mass of the cost, main bars, links and ties, kg.
func (c Cost) Mass() float64 { return c.MainMass + c.LinkMass }

// PatternCost returns the cost of pattern p in geometry g over one lift (common practice, no source).
// The perimeter link and the extra ties run on the centre line of the link bar, (w − 2·c − φt);
// each extra tie crosses the section between two opposite intermediate bars.
//
// A ring's link is a circle of centre-line diameter D − 2·c − φt, with no extra ties.
func PatternCost(g Geometry, p Pattern, cb CostBasis, w CostWeights) Cost {
	if p.Ring > 0 {
		c := Cost{Bars: p.Count()}
		c.Sets = math.Floor(cb.Lift/cb.Spacing+1e-9) + 1
		c.Perimeter = math.Pi * (g.B - 2*g.Cover - g.Link)
		n := float64(c.Bars)
		c.MainMass = densityMM * (n * math.Pi * p.Dia * p.Dia / 4 * (cb.Lift + cb.Lap))
		c.LinkMass = densityMM * (c.Sets * c.Perimeter * math.Pi * g.Link * g.Link / 4)
		c.Labour = w.PerBar * n
		c.Total = c.MainMass + c.LinkMass + c.Labour
		return c
	}
	plan := g.Restraint(p, RestraintLimit)
	lb, lh := g.B-2*g.Cover-g.Link, g.H-2*g.Cover-g.Link
	c := Cost{Bars: p.Count(), Ties: plan.Ties}
	c.Sets = math.Floor(cb.Lift/cb.Spacing+1e-9) + 1
	c.Perimeter = 2*lb + 2*lh
	// Ties holding the bars of the b-faces run along h, those of the h-faces along b.
	c.TieLength = float64(plan.AlongB.Extra)*lh + float64(plan.AlongH.Extra)*lb
	n := float64(c.Bars)
	c.MainMass = densityMM * (n * math.Pi * p.Dia * p.Dia / 4 * (cb.Lift + cb.Lap))
	c.LinkMass = densityMM * (c.Sets * (c.Perimeter + c.TieLength) * math.Pi * g.Link * g.Link / 4)
	c.Labour = w.PerBar*n + w.PerTie*c.Sets*float64(c.Ties)
	c.Total = c.MainMass + c.LinkMass + c.Labour
	return c
}

// costExpr is the expression of PatternCost over the arguments of CostStep.
// The number of bars is 2·n_b + 2·n_h − 4.
const costExpr = "rho * ((2 * n_b + 2 * n_h - 4) * 3.141592653589793 * phi ** 2 / 4 * (L + l_0) + (floor(L / s + 0.000000001) + 1) * (p_t + l_ties) * 3.141592653589793 * phi_t ** 2 / 4) + w_bar * (2 * n_b + 2 * n_h - 4) + w_tie * (floor(L / s + 0.000000001) + 1) * k"

// CostArgs are the quantities of one pattern's cost, traced or constant.
type CostArgs struct {
	NB, NH, Dia, Link    trace.Q // bars along a b-face and an h-face, bar and link diameters
	Ring                 trace.Q // bars on the circle of a circular section; zero value for a rectangle
	Lift, Lap, Spacing   trace.Q // mm
	Perimeter, TieLength trace.Q // mm, one link set
	Ties                 trace.Q // extra ties in one set
	Density              trace.Q // kg/mm³
	PerBar, PerTie       trace.Q // kg-equivalent
}

// ArgsOf returns the cost's arguments as constants, for a pattern that is not itself traced.
func ArgsOf(g Geometry, p Pattern, cb CostBasis, w CostWeights, c Cost) CostArgs {
	k := func(v float64, s, u string) trace.Q { return trace.Const(v, s, u) }
	ring := trace.Q{}
	if p.Ring > 0 {
		ring = k(float64(p.Ring), "n", "")
	}
	return CostArgs{NB: k(float64(p.NB), "n_b", ""), NH: k(float64(p.NH), "n_h", ""), Ring: ring,
		Dia: k(p.Dia, "φ", "mm"), Link: k(g.Link, "φ_t", "mm"), Lift: k(cb.Lift, "L", "mm"), Lap: k(cb.Lap, "l_0", "mm"),
		Spacing: k(cb.Spacing, "s_t", "mm"), Perimeter: k(c.Perimeter, "p_t", "mm"), TieLength: k(c.TieLength, "l_ties", "mm"),
		Ties: k(float64(c.Ties), "n_ties", ""), Density: k(densityMM, "ρ_s", "kg/mm3"),
		PerBar: k(w.PerBar, "w_bar", "kg"), PerTie: k(w.PerTie, "w_tie", "kg")}
}

// CostStep records the cost of one pattern over the lift, in kg-equivalent (common practice, no
// source): with n = 2·n_b + 2·n_h − 4 bars, ρs·(n·π·φ²/4·(L + l0) + (⌊L/s⌋ + 1)·(pt + lties)·π·φt²/4) + wbar·n + wtie·(⌊L/s⌋ + 1)·k.
// The pattern is named by its arguments: the bars along each face and their diameter.
//
// For a ring of n bars: ρs·(n·π·φ²/4·(L + l0) + (⌊L/s⌋ + 1)·pt·π·φt²/4) + wbar·n.
func CostStep(id, title string, a CostArgs) trace.Step {
	sets := math.Floor(a.Lift.V/a.Spacing.V+1e-9) + 1
	if a.Ring.V > 0 {
		n := a.Ring.V
		v := a.Density.V*(n*math.Pi*a.Dia.V*a.Dia.V/4*(a.Lift.V+a.Lap.V)+sets*a.Perimeter.V*math.Pi*a.Link.V*a.Link.V/4) + a.PerBar.V*n
		return trace.Formula(id, title, "common practice", "C", "kg", v,
			"rho * (n * 3.141592653589793 * phi ** 2 / 4 * (L + l_0) + (floor(L / s + 0.000000001) + 1) * p_t * 3.141592653589793 * phi_t ** 2 / 4) + w_bar * n",
			trace.A("n", a.Ring), trace.A("phi", a.Dia), trace.A("L", a.Lift), trace.A("l_0", a.Lap),
			trace.A("s", a.Spacing), trace.A("p_t", a.Perimeter), trace.A("phi_t", a.Link), trace.A("rho", a.Density), trace.A("w_bar", a.PerBar)).
			Shown("rho * (n * pi * phi ** 2 / 4 * (L + l_0) + (floor(L / s) + 1) * p_t * pi * phi_t ** 2 / 4) + w_bar * n").
			Note("Steel of the main bars over the lift with their lap and of the circular links at the general spacing, and a labour term per bar, all in kilograms of steel.")
	}
	n := 2*a.NB.V + 2*a.NH.V - 4
	v := a.Density.V*(n*math.Pi*a.Dia.V*a.Dia.V/4*(a.Lift.V+a.Lap.V)+sets*(a.Perimeter.V+a.TieLength.V)*math.Pi*a.Link.V*a.Link.V/4) +
		a.PerBar.V*n + a.PerTie.V*sets*a.Ties.V
	return trace.Formula(id, title, "common practice", "C", "kg", v, costExpr,
		trace.A("n_b", a.NB), trace.A("n_h", a.NH), trace.A("phi", a.Dia), trace.A("L", a.Lift), trace.A("l_0", a.Lap),
		trace.A("s", a.Spacing), trace.A("p_t", a.Perimeter), trace.A("l_ties", a.TieLength), trace.A("phi_t", a.Link),
		trace.A("k", a.Ties), trace.A("rho", a.Density), trace.A("w_bar", a.PerBar), trace.A("w_tie", a.PerTie)).
		Shown(costShown).
		Note("Steel of the main bars over the lift with their lap, of the perimeter links and the extra ties at the general spacing, and a labour term per bar and per tie piece, all in kilograms of steel.")
}

// costShown is the expression of CostStep as the sheets show it.
const costShown = "rho * ((2 * n_b + 2 * n_h - 4) * pi * phi ** 2 / 4 * (L + l_0) + (floor(L / s) + 1) * (p_t + l_ties) * pi * phi_t ** 2 / 4) + w_bar * (2 * n_b + 2 * n_h - 4) + w_tie * (floor(L / s) + 1) * k"

// LeastBar returns the least main bar diameter of practice: phiWide where the smaller dimension of
// the section is at least from, else phiNarrow (common practice, no source).
func LeastBar(id string, b, h, from, phiNarrow, phiWide trace.Q) trace.Step {
	v := phiNarrow.V
	if math.Min(b.V, h.V) >= from.V {
		v = phiWide.V
	}
	return trace.Formula(id, "Least main bar of practice", "common practice", "φ_least", "mm", v,
		"min(b, h) >= w_0 ? phi_wide : phi_narrow", trace.A("b", b), trace.A("h", h), trace.A("w_0", from),
		trace.A("phi_wide", phiWide), trace.A("phi_narrow", phiNarrow))
}

// MaxBarsPerFaceValue returns the most bars of diameter dia along a face of width w that keep the
// clear gap gap between them: ⌊(w − 2·e)/(φ + gap)⌋ + 1 with e the edge distance of the bars' centres.
func MaxBarsPerFaceValue(w, edge, dia, gap float64) float64 {
	return math.Floor((w-2*edge)/(dia+gap)+1e-9) + 1
}

// MaxBarsPerFace records the most bars along a face of width w that keep a poker vibrator's gap
// between them (common practice, no source).
func MaxBarsPerFace(id, title, symbol string, w, cnom, phiT, phi, gap trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice", symbol, "",
		MaxBarsPerFaceValue(w.V, cnom.V+phiT.V+phi.V/2, phi.V, gap.V),
		"floor((w - 2 * (c_nom + phi_t + phi / 2)) / (phi + s_vib) + 0.000000001) + 1",
		trace.A("w", w), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi), trace.A("s_vib", gap)).
		Shown("floor((w - 2 * (c_nom + phi_t + phi / 2)) / (phi + s_vib)) + 1")
}

// Roomy reports whether every clear gap of the pattern is at least gap, room for a poker vibrator.
func (g Geometry) Roomy(p Pattern, gap float64) bool {
	gb, gh := g.ClearGaps(p)
	return gb >= gap-1e-9 && gh >= gap-1e-9
}

// Continuity is how the bars of a lift continue those of the lift above it.
type Continuity struct {
	SameSection bool    // the two lifts have the same section and cover: bars compared by position
	Farthest    float64 // greatest distance from a bar above to the nearest bar below, mm (same section)
	Reach       float64 // the distance within which a bar above laps beside a bar below: the larger diameter, mm
	Offset      float64 // the largest shift of the outer bars' centres between the lifts, mm (a crank where the section changes)
	Ratio       float64 // ≤ 1 when the bars continue: max(n_b,above/n_b, n_h,above/n_h, φ_above/φ, Farthest/Reach)
}

// OK reports whether every bar of the lift above has a bar of this lift to lap onto.
func (c Continuity) OK() bool { return c.Ratio <= 1+1e-9 }

// Continues returns how pattern p in geometry g continues pattern a in geometry ga of the lift
// above (common practice, no source): the same or more bars along each face and the same or a
// larger diameter; where the section is the same, every bar above lies within one bar diameter
// (the larger) of a bar below, so that it laps beside it (EN 1992-1-1:2004 8.7.2(3)); where the
// section changes, the bars below are cranked into the section above and the positions are not
// compared; nor are they where the counts or the diameter already fail (Farthest is then 0).
//
// Rings compare their counts and, in the same section, their positions; the offset of a ring
// is the change of its radius. Between a ring and the faces of a rectangle only the counts and
// the diameters are compared.
func Continues(ga Geometry, a Pattern, g Geometry, p Pattern) Continuity {
	return ContinuesAt(ga, a, nil, g, p, nil)
}

// ContinuesAt is Continues with the bar positions of the lift above, posA (ga.Positions(a)),
// and of this lift, pos (g.Positions(p)), where the caller holds them; nil: worked out here.
func ContinuesAt(ga Geometry, a Pattern, posA [][2]float64, g Geometry, p Pattern, pos [][2]float64) Continuity {
	return continues(ga, a, posA, g, p, pos, false)
}

// ContinuesOK reports ContinuesAt(ga, a, posA, g, p, pos).OK(), comparing the positions only
// until a bar above is found out of reach.
func ContinuesOK(ga Geometry, a Pattern, posA [][2]float64, g Geometry, p Pattern, pos [][2]float64) bool {
	return continues(ga, a, posA, g, p, pos, true).OK()
}

// continues is ContinuesAt; with stop, Farthest is that of the bars up to the first one out of
// reach, which is enough for OK.
func continues(ga Geometry, a Pattern, posA [][2]float64, g Geometry, p Pattern, pos [][2]float64, stop bool) Continuity {
	positions := func() ([][2]float64, [][2]float64) {
		if posA == nil {
			posA = ga.Positions(a)
		}
		if pos == nil {
			pos = g.Positions(p)
		}
		return posA, pos
	}
	if a.Ring > 0 || p.Ring > 0 {
		c := Continuity{SameSection: a.Ring > 0 && p.Ring > 0 && ga.B == g.B && ga.Cover == g.Cover, Reach: math.Max(a.Dia, p.Dia)}
		c.Ratio = math.Max(float64(a.Count())/float64(p.Count()), a.Dia/p.Dia)
		if a.Ring > 0 && p.Ring > 0 {
			c.Offset = math.Abs(ga.RingRadius(a.Dia) - g.RingRadius(p.Dia))
		}
		if c.SameSection && c.Ratio <= 1+1e-9 {
			above, below := positions()
			c.Farthest = farthestBar(above, below, c.Reach, stop)
			c.Ratio = math.Max(c.Ratio, c.Farthest/c.Reach)
		}
		return c
	}
	c := Continuity{SameSection: ga.B == g.B && ga.H == g.H && ga.Cover == g.Cover, Reach: math.Max(a.Dia, p.Dia)}
	c.Ratio = math.Max(math.Max(float64(a.NB)/float64(p.NB), float64(a.NH)/float64(p.NH)), a.Dia/p.Dia)
	ea, e := ga.Edge(a.Dia), g.Edge(p.Dia)
	c.Offset = math.Max(math.Abs((ga.B/2-ea)-(g.B/2-e)), math.Abs((ga.H/2-ea)-(g.H/2-e)))
	if !c.SameSection || c.Ratio > 1+1e-9 {
		return c // cranked, or too few bars or too small: the positions need no comparing
	}
	above, below := positions()
	c.Farthest = farthestBar(above, below, c.Reach, stop)
	c.Ratio = math.Max(c.Ratio, c.Farthest/c.Reach)
	return c
}

// farthestBar returns the greatest distance from a bar of above to the nearest bar of below, mm;
// with stop, the greatest up to the first bar of above farther than reach (by the ratio OK
// tests), which it returns at once.
//
// The distance is taken by math.Hypot only for the bars that may be the nearest by squared
// distance; a bar at the same place ends the search.
func farthestBar(above, below [][2]float64, reach float64, stop bool) float64 {
	out := 0.0
	for _, q := range above {
		near, bd := math.Inf(1), math.Inf(1)
		for _, r := range below {
			dy, dz := q[0]-r[0], q[1]-r[1]
			d2 := dy*dy + dz*dz
			if d2 > bd*(1+1e-9) {
				continue
			}
			bd = math.Min(bd, d2)
			near = math.Min(near, math.Hypot(dy, dz))
			if d2 == 0 {
				break
			}
		}
		out = math.Max(out, near)
		if stop && out/reach > 1+1e-9 {
			return out
		}
	}
	return out
}

// ContinuityCheck records the check that the bars of the lift continue those of the lift above
// (common practice, no source; laps beside the bar below, EN 1992-1-1:2004 8.7.2(3)).
func ContinuityCheck(id string, c Continuity, nbA, nhA, phiA, nb, nh, phi trace.Q) trace.Step {
	if !c.SameSection {
		return trace.Check(id, "Bars of the lift above continued by the bars of this lift, cranked into the section above", "common practice",
			"n_b,above ≤ n_b, n_h,above ≤ n_h, φ_above ≤ φ", c.Ratio, "max(n_b_a / n_b, n_h_a / n_h, phi_a / phi)",
			trace.A("n_b_a", nbA), trace.A("n_b", nb), trace.A("n_h_a", nhA), trace.A("n_h", nh), trace.A("phi_a", phiA), trace.A("phi", phi))
	}
	d := trace.Const(c.Farthest, "d_max", "mm")
	return trace.Check(id, "Each bar of the lift above beside a bar of this lift", "common practice",
		"n_b,above ≤ n_b, n_h,above ≤ n_h, φ_above ≤ φ, d_max ≤ max(φ, φ_above)", c.Ratio,
		"max(n_b_a / n_b, n_h_a / n_h, phi_a / phi, d_max / max(phi, phi_a))",
		trace.A("n_b_a", nbA), trace.A("n_b", nb), trace.A("n_h_a", nhA), trace.A("n_h", nh), trace.A("phi_a", phiA), trace.A("phi", phi), trace.A("d_max", d)).
		Note("d_max is the greatest distance from the centre of a bar of the lift above to the centre of the nearest bar of this lift, at the positions of both patterns; within one bar diameter the bar above laps beside the bar below.")
}

// CrankLength returns the length over which the bars are cranked by offset at a slope of 1 in k,
// k = 12, at which the lateral forces of the change of direction may be ignored, EN 1992-1-1:2004 9.5.3(5).
func CrankLength(id string, offset, k trace.Q) trace.Step {
	return trace.Formula(id, "Length of the crank of the bars at the slope where its lateral forces may be ignored", ec2+"9.5.3(5)",
		"l_crank", "mm", k.V*offset.V, "k * e_crank", trace.A("k", k), trace.A("e_crank", offset))
}
