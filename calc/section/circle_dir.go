package section

// The least resistance of a circular section over the directions of bending.
//
// The resistance in direction θ is the moment M along θ of the plane whose neutral axis is
// perpendicular to θ (Circle.MRdAt). MRdMin returns its least value over θ. Each plane
// reaches a point P(θ) = (M, M⊥) of the My–Mz contour at NEd, and M = P·(cos θ, sin θ)
// is at most the largest projection of the contour on θ; where the contour is convex the
// least of those projections is the least distance from zero moment to the contour. So
// the least M over θ is a lower bound of the least resistance to a design moment of any
// direction, equal to it where the least M falls on a direction of symmetry (M⊥ = 0).
// Measured (TestCircleDirection): below the least |P(θ)| of a scan of 1440 directions by
// at most 1.1 % (even rings of 4 and 6 bars, and an uneven layout).
//
// The concrete is polar-symmetric, so only the bars make the direction matter. n equal bars
// evenly spaced on one circle have the symmetry of the regular n-gon: M(θ) has period 2π/n
// and is symmetric about each bar's direction, so half a bar pitch from a bar holds every
// value; any other layout is scanned round the whole circle. The scan steps by at most
// 2.5° (8 steps at least); golden-section search (J. Kiefer, Proc. AMS 4, 1953) then
// refines the least value between the neighbours of the least scanned direction, to
// circleAngleTol, and the better of the two is kept. Where the edge of the rectangular
// block crosses a bar, M jumps; the search then returns the least value met.
//
// How much the direction matters. Bars that have all yielded give Σ As·fyd·|s|, and
// Σ|cos ψk| over n evenly spaced directions varies with the direction by
// 1/cos(π/n) − 1 ≈ π²/(2n²) for even n. Measured (TestCircleDirection; D = 500 mm, bars on
// a radius of 190 mm, 1 % steel, C30/37, NEd from 5 % to 95 % of the range from −As·fyd
// to NRd,max): the largest spread of M over the directions is about 2/n², 14 % with 4
// bars, 6 % with 6, 3 % with 8, 1 % with 12, and falls below 0.1 % only from about 48
// bars. So the direction matters, at the 0.1 % of DirectionTol, for every practical layout,
// by more than 5 % for fewer than 6 bars, and most for uneven layouts.

import (
	"math"
	"sort"
)

// DirectionTol is the relative spread of the resistance over the directions beyond which
// CircleMin reports that the direction matters.
const DirectionTol = 1e-3

// Scan and refinement of the direction search.
const (
	circleScanStep = math.Pi / 72 // largest step of the scan, rad (2.5°)
	circleScanMin  = 8            // fewest steps of the scan
	circleAngleTol = 1e-7         // width of the golden-section bracket at which it stops, rad
	circleEvenTol  = 1e-9         // relative tolerance on the radii, areas and angles of an even ring
)

// CircleMin is the least resistance of a circular section over the directions of bending.
type CircleMin struct {
	State     CircleState // equilibrium state in the worst direction; State.M is MRd,min
	MMax      float64     // largest M along θ over the directions tried, N·mm
	Spread    float64     // (MMax − State.M)/|MMax|: how much the direction matters (0 when MMax is 0)
	Matters   bool        // Spread > DirectionTol: the bars make the resistance depend on the direction
	HalfPitch bool        // only half a bar pitch was scanned, by the symmetry of an even ring
	Tried     int         // directions tried, scan and refinement
}

// EvenRing reports whether the bars are n ≥ 1 equal bars evenly spaced on one circle about
// the centre, and returns n and the direction of one bar (rad, as CircleState.Theta).
func (c *Circle) EvenRing() (n int, first float64, ok bool) {
	n = len(c.Bars)
	if n == 0 {
		return 0, 0, false
	}
	b0 := c.Bars[0]
	r0 := math.Hypot(b0.Y, b0.Z)
	if !(r0 > 0) || !(b0.Area > 0) {
		return n, 0, false
	}
	angles := make([]float64, n)
	for i, b := range c.Bars {
		if math.Abs(math.Hypot(b.Y, b.Z)-r0) > circleEvenTol*r0 || math.Abs(b.Area-b0.Area) > circleEvenTol*b0.Area {
			return n, 0, false
		}
		angles[i] = math.Atan2(b.Y, b.Z)
	}
	sort.Float64s(angles)
	pitch := 2 * math.Pi / float64(n)
	for i := range angles {
		next := angles[0] + 2*math.Pi
		if i+1 < n {
			next = angles[i+1]
		}
		if math.Abs(next-angles[i]-pitch) > circleEvenTol*2*math.Pi {
			return n, 0, false
		}
	}
	return n, angles[0], true
}

// MRdMin returns the least design moment of resistance at NEd (N, compression positive)
// over the directions of bending, with the state of the worst direction and how much the
// direction matters (method in the comment at the top of this file). The least M is
// negative where bars off the centre leave a direction in which the section cannot carry
// NEd without a moment.
func (c *Circle) MRdMin(NEd float64) (CircleMin, error) {
	if _, err := c.Resistance(0, NEd); err != nil {
		return CircleMin{}, err
	}
	if c.Area() == 0 {
		st, err := c.MRdAt(0, NEd)
		return CircleMin{State: st, MMax: st.M, Tried: 1}, err
	}
	var out CircleMin
	var evalErr error
	h := func(theta float64) float64 {
		out.Tried++
		m, err := c.Resistance(theta, NEd)
		if err != nil && evalErr == nil {
			evalErr = err
		}
		return m
	}
	lo, width := 0.0, 2*math.Pi
	if n, first, ok := c.EvenRing(); ok {
		lo, width, out.HalfPitch = first, math.Pi/float64(n), true
	}
	steps := max(circleScanMin, int(math.Ceil(width/circleScanStep)))
	step := width / float64(steps)
	best, mBest, mMax := 0, math.Inf(1), math.Inf(-1)
	last := steps // the half-pitch scan includes both ends; the full circle closes on its start
	if !out.HalfPitch {
		last = steps - 1
	}
	for k := 0; k <= last; k++ {
		m := h(lo + step*float64(k))
		if m < mBest {
			best, mBest = k, m
		}
		mMax = math.Max(mMax, m)
	}
	a, b := lo+step*float64(best-1), lo+step*float64(best+1)
	if out.HalfPitch {
		a, b = math.Max(a, lo), math.Min(b, lo+width)
	}
	theta, m := goldenMin(h, a, b, circleAngleTol)
	if !(m < mBest) {
		theta, m = lo+step*float64(best), mBest
	}
	if evalErr != nil {
		return CircleMin{}, evalErr
	}
	st, err := c.MRdAt(normAngle(theta), NEd)
	if err != nil {
		return CircleMin{}, err
	}
	out.State, out.MMax = st, math.Max(mMax, m)
	if out.MMax != 0 {
		out.Spread = (out.MMax - st.M) / math.Abs(out.MMax)
	}
	out.Matters = out.Spread > DirectionTol
	return out, nil
}

// goldenMin returns the point of [a, b] where f is least and its value, by golden-section
// search (J. Kiefer, Proc. AMS 4, 1953) down to a bracket narrower than tol, for an f with
// one minimum in [a, b].
func goldenMin(f func(float64) float64, a, b, tol float64) (float64, float64) {
	invPhi := (math.Sqrt(5) - 1) / 2
	x1, x2 := b-invPhi*(b-a), a+invPhi*(b-a)
	f1, f2 := f(x1), f(x2)
	for it := 0; it < MaxIter && b-a > tol; it++ {
		if f1 <= f2 {
			b, x2, f2 = x2, x1, f1
			x1 = b - invPhi*(b-a)
			f1 = f(x1)
		} else {
			a, x1, f1 = x1, x2, f2
			x2 = a + invPhi*(b-a)
			f2 = f(x2)
		}
	}
	if f1 <= f2 {
		return x1, f1
	}
	return x2, f2
}
