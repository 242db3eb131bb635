// Package detail holds the detailing rules for columns: reinforcement limits (9.5.2),
// bar spacing (8.2), bar arrangements and links (9.5.3) of EN 1992-1-1.
package detail

import (
	"math"

	"colsheet/calc/trace"
)

const ec2 = "EN 1992-1-1:2004 "

// AsMin returns As,min = max(0.10·NEd/fyd, 0.002·Ac), EN 1992-1-1:2004 9.5.2(2), Eq. (9.12N).
func AsMin(id string, nEd, fyd, ac, kN, kA trace.Q) trace.Step {
	return trace.Formula(id, "Minimum longitudinal reinforcement", ec2+"9.5.2(2), Eq. (9.12N)", "A_s,min", "mm2",
		math.Max(kN.V*nEd.V/fyd.V, kA.V*ac.V), "max(k_N * N_Ed / f_yd, k_A * A_c)",
		trace.A("k_N", kN), trace.A("N_Ed", nEd), trace.A("f_yd", fyd), trace.A("k_A", kA), trace.A("A_c", ac))
}

// AsMax returns As,max = 0.04·Ac outside lap locations, EN 1992-1-1:2004 9.5.2(3).
func AsMax(id string, ac, k trace.Q) trace.Step {
	return trace.Formula(id, "Maximum longitudinal reinforcement outside laps", ec2+"9.5.2(3)", "A_s,max", "mm2",
		k.V*ac.V, "k_max * A_c", trace.A("k_max", k), trace.A("A_c", ac))
}

// MinClearSpacing returns the least clear distance between bars max(k1·φ, dg + k2, 20 mm),
// EN 1992-1-1:2004 8.2(2).
func MinClearSpacing(id string, phi, dg, k1, k2, smin trace.Q) trace.Step {
	return trace.Formula(id, "Minimum clear distance between bars", ec2+"8.2(2)", "s_min", "mm",
		math.Max(math.Max(k1.V*phi.V, dg.V+k2.V), smin.V), "max(k_1 * phi, d_g + k_2, s_0)",
		trace.A("k_1", k1), trace.A("phi", phi), trace.A("d_g", dg), trace.A("k_2", k2), trace.A("s_0", smin))
}

// MinLinkDia returns the least link diameter max(6 mm, φmax/4), EN 1992-1-1:2004 9.5.3(1).
func MinLinkDia(id string, phiMax, dmin, ratio trace.Q) trace.Step {
	return trace.Formula(id, "Minimum link diameter", ec2+"9.5.3(1)", "φ_t,min", "mm",
		math.Max(dmin.V, ratio.V*phiMax.V), "max(phi_t0, k_t * phi_max)",
		trace.A("phi_t0", dmin), trace.A("k_t", ratio), trace.A("phi_max", phiMax))
}

// MaxLinkSpacing returns scl,tmax = min(20·φmin, lesser column dimension, 400 mm), EN 1992-1-1:2004 9.5.3(3).
func MaxLinkSpacing(id string, phiMin, bMin, k, sMax trace.Q) trace.Step {
	return trace.Formula(id, "Maximum link spacing", ec2+"9.5.3(3)", "s_cl,tmax", "mm",
		math.Min(math.Min(k.V*phiMin.V, bMin.V), sMax.V), "min(k_s * phi_min, b_min, s_max)",
		trace.A("k_s", k), trace.A("phi_min", phiMin), trace.A("b_min", bMin), trace.A("s_max", sMax))
}

// ReducedLinkSpacing returns 0.6·scl,tmax for the zones next to beams and slabs and at laps,
// EN 1992-1-1:2004 9.5.3(4).
func ReducedLinkSpacing(id string, s, k trace.Q) trace.Step {
	return trace.Formula(id, "Maximum link spacing near beams, slabs and laps", ec2+"9.5.3(4)", "s_cl,t,red", "mm",
		k.V*s.V, "k_r * s", trace.A("k_r", k), trace.A("s", s))
}

// RoundDown returns the spacing s rounded down to a multiple of step, common practice.
func RoundDown(id, title, symbol string, s, step trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice", symbol, "mm", math.Floor(s.V/step.V+1e-9)*step.V,
		"floor(s / step + 0.000000001) * step", trace.A("s", s), trace.A("step", step)).
		Shown("rounddown(s, step)")
}

// Pattern is a symmetric arrangement of equal bars on the four faces of a rectangle:
// NB bars along each face of width b (at z = ±) and NH bars along each face of depth h
// (at y = ±), both counts including the corner bars.
//
// In a circular section the pattern is Ring bars evenly spaced on one circle, the first on
// the +z axis, and NB, NH are zero.
type Pattern struct {
	Dia    float64 // bar diameter, mm
	NB, NH int     // bars along a b-face and along an h-face, corners included; each ≥ 2
	Ring   int     // bars on the circle of a circular section; 0 for the four faces
}

// RingMin is the least number of bars colsheet puts in a circular column: six, common practice
// (EN 1992-1-1:2004 9.5.2(4) asks at least four; with four the resistance varies with the
// direction of bending by some 14 %, with six by some 6 %, section.DirectionTol's measure).
const RingMin = 6

// Count returns the number of bars of the pattern.
func (p Pattern) Count() int {
	if p.Ring > 0 {
		return p.Ring
	}
	return 2*p.NB + 2*p.NH - 4
}

// BarArea returns the area of one bar, π·φ²/4.
func (p Pattern) BarArea() float64 { return math.Pi * p.Dia * p.Dia / 4 }

// Area returns the total steel area of the pattern.
func (p Pattern) Area() float64 { return float64(p.Count()) * p.BarArea() }

// Geometry is the room a section gives its bars.
type Geometry struct {
	B, H   float64 // section width (along y) and depth (along z), mm; both the diameter of a circle
	Cover  float64 // nominal cover to the links, mm
	Link   float64 // link diameter, mm
	Circle bool    // the section is a circle of diameter B (= H), its bars on one circle
}

// RingRadius returns the radius of the circle through the centres of bars of diameter dia in
// a circular section, D/2 − c_nom − φt − φ/2.
func (g Geometry) RingRadius(dia float64) float64 { return g.B/2 - g.Edge(dia) }

// RingGap returns the clear distance between neighbouring bars of n on a circle of radius rs,
// measured along the chord, 2·rs·sin(π/n) − φ (geometry).
func RingGap(rs float64, n int, dia float64) float64 {
	return 2*rs*math.Sin(math.Pi/float64(n)) - dia
}

// Edge returns the distance from a face to the centre of the bars of diameter dia.
func (g Geometry) Edge(dia float64) float64 { return g.Cover + g.Link + dia/2 }

// Positions returns the bar centres (y, z) from the centroid, corners first, then the
// intermediate bars of the b-faces and of the h-faces.
//
// The bars of a ring go round from the +z axis towards +y, at (rs·sin a, rs·cos a).
func (g Geometry) Positions(p Pattern) [][2]float64 {
	if p.Ring > 0 {
		rs := g.RingRadius(p.Dia)
		pos := make([][2]float64, p.Ring)
		for k := range pos {
			a := 2 * math.Pi * float64(k) / float64(p.Ring)
			sn, cs := math.Sincos(a)
			// Exact zeros on the axes, so that the layout is symmetric to the last bit.
			if 4*k%p.Ring == 0 {
				sn, cs = math.Round(sn), math.Round(cs)
			}
			pos[k] = [2]float64{rs * sn, rs * cs}
		}
		return pos
	}
	e := g.Edge(p.Dia)
	yc, zc := g.B/2-e, g.H/2-e
	pos := make([][2]float64, 0, p.Count())
	pos = append(pos, [2]float64{-yc, -zc}, [2]float64{yc, -zc}, [2]float64{yc, zc}, [2]float64{-yc, zc})
	for i := 1; i < p.NB-1; i++ {
		y := -yc + 2*yc*float64(i)/float64(p.NB-1)
		pos = append(pos, [2]float64{y, -zc}, [2]float64{y, zc})
	}
	for i := 1; i < p.NH-1; i++ {
		z := -zc + 2*zc*float64(i)/float64(p.NH-1)
		pos = append(pos, [2]float64{-yc, z}, [2]float64{yc, z})
	}
	return pos
}

// ClearGaps returns the clear distance between neighbouring bars along a b-face and along an h-face.
// On a ring both are the gap between neighbours along the chord.
func (g Geometry) ClearGaps(p Pattern) (alongB, alongH float64) {
	if p.Ring > 0 {
		gap := RingGap(g.RingRadius(p.Dia), p.Ring, p.Dia)
		return gap, gap
	}
	e := g.Edge(p.Dia)
	alongB = (g.B-2*e)/float64(p.NB-1) - p.Dia
	alongH = (g.H-2*e)/float64(p.NH-1) - p.Dia
	return
}

// Fits reports whether the pattern's bars sit inside the links with at least sMin clear between them.
func (g Geometry) Fits(p Pattern, sMin float64) bool {
	if g.Circle || p.Ring > 0 {
		if !g.Circle || p.Ring < RingMin || g.RingRadius(p.Dia) <= 0 {
			return false
		}
		gap, _ := g.ClearGaps(p)
		return gap >= sMin-1e-9
	}
	if p.NB < 2 || p.NH < 2 || g.B-2*g.Edge(p.Dia) <= 0 || g.H-2*g.Edge(p.Dia) <= 0 {
		return false
	}
	gb, gh := g.ClearGaps(p)
	return gb >= sMin-1e-9 && gh >= sMin-1e-9
}

// spread returns the larger centre-to-centre distance of the pattern, used to prefer even layouts.
func (g Geometry) spread(p Pattern) float64 {
	gb, gh := g.ClearGaps(p)
	return math.Max(gb, gh)
}

// ForCount returns the most even pattern of count bars of diameter dia that fits with sMin clear,
// or false when count is odd, below 4, or no pattern fits.
//
// In a circle the pattern is count bars on the ring, of at least RingMin.
func (g Geometry) ForCount(count int, dia, sMin float64) (Pattern, bool) {
	if g.Circle {
		p := Pattern{Dia: dia, Ring: count}
		return p, g.Fits(p, sMin)
	}
	if count < 4 || count%2 != 0 {
		return Pattern{}, false
	}
	best, found := Pattern{}, false
	half := count/2 + 2 // NB + NH
	for nb := 2; nb <= half-2; nb++ {
		p := Pattern{Dia: dia, NB: nb, NH: half - nb}
		if !g.Fits(p, sMin) {
			continue
		}
		if !found || g.spread(p) < g.spread(best) {
			best, found = p, true
		}
	}
	return best, found
}

// Candidates returns every pattern of the given diameters that fits, with sMinFor giving the least
// clear spacing for a diameter and linkFor the link diameter that goes with it, ordered by steel
// area, then by number of bars, then by evenness. Patterns outside [asLo, asHi] and of more than
// MaxBars bars are left out.
func Candidates(b, h, cover float64, dias []float64, linkFor, sMinFor func(dia float64) float64, asLo, asHi float64) []Pattern {
	return CandidatesIn(Geometry{B: b, H: h, Cover: cover}, dias, linkFor, sMinFor, asLo, asHi)
}

// CandidatesIn is Candidates for the section of g (its Link is set per diameter by linkFor),
// which may be a circle: its patterns are rings of RingMin bars or more.
func CandidatesIn(g Geometry, dias []float64, linkFor, sMinFor func(dia float64) float64, asLo, asHi float64) []Pattern {
	var out []Pattern
	it := NewIterIn(g, dias, linkFor, sMinFor, asLo, asHi)
	for p, ok := it.Next(); ok; p, ok = it.Next() {
		out = append(out, p)
	}
	return out
}

// MaxBars is the largest bar count the pattern search tries, whatever the section size, so
// that its work is bounded: more than the perimeter of the largest section the input takes
// (3 m × 3 m, 12 m) holds of the smallest bars at the least spacing (8 mm at 20 mm clear, about
// 430 bars); common practice, no source.
const MaxBars = 1000

// Iter yields the patterns of Candidates one at a time, in the same order, making each only
// when it is asked for.
//
// For one diameter the patterns come out in order of count, and for one count in order of
// evenness; the diameters' streams are merged by area. A count that does not fit means that
// no larger count fits either (taking a bar off a face widens the gaps).
type Iter struct {
	streams    []stream
	asLo, asHi float64
}

type cand struct {
	p      Pattern
	area   float64
	spread float64
}

// stream makes the patterns of one diameter, a count at a time.
type stream struct {
	g       Geometry
	dia     float64
	sMin    float64
	count   int
	pending []cand
	store   []cand // the array pending is filled in again once taken
	done    bool
}

// NewIter returns an iterator over the patterns that Candidates lists.
func NewIter(b, h, cover float64, dias []float64, linkFor, sMinFor func(dia float64) float64, asLo, asHi float64) *Iter {
	return NewIterIn(Geometry{B: b, H: h, Cover: cover}, dias, linkFor, sMinFor, asLo, asHi)
}

// NewIterIn returns an iterator over the patterns that CandidatesIn lists.
func NewIterIn(g Geometry, dias []float64, linkFor, sMinFor func(dia float64) float64, asLo, asHi float64) *Iter {
	it := &Iter{asLo: asLo, asHi: asHi, streams: make([]stream, len(dias))}
	for k, d := range dias {
		gd := g
		gd.Link = linkFor(d)
		count := 4
		if g.Circle {
			count = RingMin
		}
		it.streams[k] = stream{g: gd, dia: d, sMin: sMinFor(d), count: count}
	}
	return it
}

// fill makes the next count's patterns of the stream that lie within the area limits.
func (s *stream) fill(asLo, asHi float64) {
	if len(s.pending) == 0 {
		s.pending = s.store[:0]
		defer func() { s.store = s.pending[:0] }()
	}
	if s.g.Circle {
		s.fillRing(asLo, asHi)
		return
	}
	for len(s.pending) == 0 && !s.done {
		half := s.count/2 + 2 // NB + NH
		fits := false
		for nb := 2; nb <= half-2; nb++ {
			p := Pattern{Dia: s.dia, NB: nb, NH: half - nb}
			if !s.g.Fits(p, s.sMin) {
				continue
			}
			fits = true
			if a := p.Area(); a >= asLo-1e-9 && a <= asHi+1e-9 {
				s.pending = append(s.pending, cand{p, a, s.g.spread(p)})
			}
		}
		if !fits || (Pattern{Dia: s.dia, NB: 2, NH: half - 2}).Area() > asHi+1e-9 || s.count >= MaxBars {
			s.done = true
		}
		s.count += 2
		// Order this count's distributions by evenness (a handful, insertion sort).
		for i := 1; i < len(s.pending); i++ {
			for j := i; j > 0 && s.pending[j].spread < s.pending[j-1].spread; j-- {
				s.pending[j], s.pending[j-1] = s.pending[j-1], s.pending[j]
			}
		}
	}
}

// fillRing makes the next ring of the stream within the area limits: one pattern per count,
// counts rising by one (a count that does not fit means that no larger count fits).
func (s *stream) fillRing(asLo, asHi float64) {
	for len(s.pending) == 0 && !s.done {
		p := Pattern{Dia: s.dia, Ring: s.count}
		a := p.Area()
		switch {
		case !s.g.Fits(p, s.sMin) || a > asHi+1e-9 || s.count >= MaxBars:
			s.done = true
		case a >= asLo-1e-9:
			gap, _ := s.g.ClearGaps(p)
			s.pending = append(s.pending, cand{p, a, gap})
		}
		s.count++
	}
}

func less(x, y cand) bool {
	switch {
	case math.Abs(x.area-y.area) > 1e-6:
		return x.area < y.area
	case x.p.Count() != y.p.Count():
		return x.p.Count() < y.p.Count()
	case x.spread != y.spread:
		return x.spread < y.spread
	}
	return x.p.Dia < y.p.Dia
}

// Next returns the next pattern, or false when there are no more.
func (it *Iter) Next() (Pattern, bool) {
	k := -1
	for i := range it.streams {
		s := &it.streams[i]
		s.fill(it.asLo, it.asHi)
		if len(s.pending) > 0 && (k < 0 || less(s.pending[0], it.streams[k].pending[0])) {
			k = i
		}
	}
	if k < 0 {
		return Pattern{}, false
	}
	s := &it.streams[k]
	p := s.pending[0].p
	s.pending = s.pending[1:]
	return p, true
}
