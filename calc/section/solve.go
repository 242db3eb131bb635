package section

import (
	"errors"
	"fmt"
	"math"
)

// MaxIter bounds the iterations of every root search in this package.
const MaxIter = 200

// MRd returns the state in equilibrium with NEd (N, compression positive) with the
// compressed face on the positive side; its M is the design moment of resistance.
func (s *Section) MRd(axis Axis, NEd float64) (State, error) { return s.MRdAt(axis, Positive, NEd) }

// MRdAt returns the state in equilibrium with NEd with the compressed face on the given side.
func (s *Section) MRdAt(axis Axis, face Face, NEd float64) (State, error) {
	var buf [maxPoints]point
	p, f, _, err := s.solve(axis, face, NEd, buf[:])
	if err != nil {
		return State{}, err
	}
	return s.state(axis, face, &f, p), nil
}

// MRdBoth returns, of the two equilibrium states at NEd (compressed face on either side),
// the one with the smaller |M|: the governing one for an asymmetric bar layout.
func (s *Section) MRdBoth(axis Axis, NEd float64) (State, error) {
	pos, err := s.MRdAt(axis, Positive, NEd)
	if err != nil {
		return State{}, err
	}
	neg, err := s.MRdAt(axis, Negative, NEd)
	if err != nil {
		return State{}, err
	}
	if math.Abs(neg.M) < math.Abs(pos.M) {
		return neg, nil
	}
	return pos, nil
}

// Resistance returns the moment M (N·mm, signed as State.M) of the equilibrium state at
// NEd for the given compressed face, without building the layers: the fast path.
func (s *Section) Resistance(axis Axis, face Face, NEd float64) (float64, error) {
	var buf [maxPoints]point
	p, f, ps, err := s.solve(axis, face, NEd, buf[:])
	if err != nil {
		return 0, err
	}
	_, m := f.nm(ps, p)
	return m, nil
}

// solve finds the profile parameter p in [0, 2] with N(p) = NEd.
//
// N(p) runs from the tension capacity −As·fyd (p → 0) to NRd,max (p = 2); the root is
// bracketed by these ends and found by Brent's method. N rises with p on pivot B. On
// pivot C the bars between the compressed face and the pivot point lose strain as the
// profile turns towards uniform strain, so heavy unyielded steel there can make N peak
// above NRd,max before falling back to it; NEd above NRd,max is refused, which leaves one
// root below it. The rectangular block can step down, by As·η·fcd, where its edge passes
// a layer, but N has no upward jumps: every bracket the method keeps has N < NEd on its
// left and N > NEd on its right, and so it closes on a true, continuous root.
// The bars are grouped into layers in buf, which is returned resliced.
func (s *Section) solve(axis Axis, face Face, NEd float64, buf []point) (float64, frame, []point, error) {
	if (axis != AxisY && axis != AxisZ) || (face != Positive && face != Negative) {
		return 0, frame{}, nil, errAxis
	}
	if err := s.Validate(); err != nil {
		return 0, frame{}, nil, err
	}
	f := s.frame(axis, face)
	if math.IsNaN(NEd) || math.IsInf(NEd, 0) {
		return 0, f, nil, fmt.Errorf("section: NEd = %g N is not a finite number", NEd)
	}
	ps := s.points(axis, &f, buf)
	nmax, nmin := s.NRdMax(), s.NRdMin()
	ftol := 1e-9 * math.Max(nmax, 1)
	switch {
	case NEd > nmax+ftol:
		return 0, f, ps, fmt.Errorf("section: NEd = %.6g N exceeds the pure compression resistance NRd,max = %.6g N", NEd, nmax)
	case NEd >= nmax-ftol:
		return 2, f, ps, nil
	case NEd <= nmin:
		return 0, f, ps, fmt.Errorf("section: NEd = %.6g N is at or beyond the tension resistance −As·fyd = %.6g N", NEd, nmin)
	}
	n2, _ := f.nm(ps, 2)
	g := func(p float64) float64 {
		n, _ := f.nm(ps, p)
		return n - NEd
	}
	p, ok := brent(g, 0, 2, nmin-NEd, n2-NEd, 1e-15, ftol)
	if !ok {
		return 0, f, ps, fmt.Errorf("section: neutral-axis search did not converge in %d iterations at NEd = %.6g N", MaxIter, NEd)
	}
	return p, f, ps, nil
}

// brent returns a zero of g in [a, b], given ga = g(a) and gb = g(b) of opposite signs,
// by Brent's method (R. P. Brent, Algorithms for Minimization without Derivatives, 1973,
// ch. 4, "zeroin": inverse quadratic interpolation and secant steps safeguarded by
// bisection). It stops when |g| ≤ ftol or the bracket is narrower than about xtol, and
// reports false when MaxIter iterations do not suffice.
func brent(g func(float64) float64, a, b, ga, gb, xtol, ftol float64) (float64, bool) {
	const eps = 2.220446049250313e-16
	if math.Abs(ga) <= ftol {
		return a, true
	}
	c, gc := a, ga
	d := b - a
	e := d
	for it := 0; it < MaxIter; it++ {
		if (gb > 0) == (gc > 0) {
			c, gc = a, ga
			d = b - a
			e = d
		}
		if math.Abs(gc) < math.Abs(gb) {
			a, b, c = b, c, b
			ga, gb, gc = gb, gc, gb
		}
		tol := 2*eps*math.Abs(b) + 0.5*xtol
		m := 0.5 * (c - b)
		if math.Abs(gb) <= ftol || math.Abs(m) <= tol {
			return b, true
		}
		if math.Abs(e) >= tol && math.Abs(ga) > math.Abs(gb) {
			var p, q float64
			s := gb / ga
			if a == c {
				p = 2 * m * s // secant step
				q = 1 - s
			} else { // inverse quadratic interpolation
				q0 := ga / gc
				r := gb / gc
				p = s * (2*m*q0*(q0-r) - (b-a)*(r-1))
				q = (q0 - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			if 2*p < math.Min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e, d = d, p/q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, ga = b, gb
		if math.Abs(d) > tol {
			b += d
		} else {
			b += math.Copysign(tol, m)
		}
		gb = g(b)
	}
	return b, false
}

// Scaled returns a copy of the section whose bar areas are scaled to total As (mm²),
// keeping their proportions; bars without area are copied unchanged.
func (s *Section) Scaled(As float64) Section {
	out := *s
	out.Bars = scaledBars(s.Bars, As)
	return out
}

// scaledBars returns a copy of bars whose areas are scaled to total As (mm²), keeping their
// proportions; bars without area, or bars of no total area, are copied unchanged.
func scaledBars(bars []Bar, As float64) []Bar {
	out := make([]Bar, len(bars))
	copy(out, bars)
	total := 0.0
	for _, b := range bars {
		total += b.Area
	}
	if total > 0 {
		scaleBars(out, bars, As/total)
	}
	return out
}

func scaleBars(dst, src []Bar, k float64) {
	for i, b := range src {
		b.Area *= k
		dst[i] = b
	}
}

// AreaFor returns the total steel area As (mm²), shared among the bars in proportion to
// their areas, at which the design moment of resistance about axis at NEd equals |MEd|
// (compressed face on the side of MEd's sign). It returns 0 when no steel is needed and
// an error when even AsMax does not suffice.
func (s *Section) AreaFor(axis Axis, NEd, MEd, AsMax float64) (float64, error) {
	face := Positive
	if MEd < 0 {
		face = Negative
	}
	med := math.Abs(MEd)
	return s.AreaWhere(AsMax, func(t *Section) (float64, error) {
		m, err := t.Resistance(axis, face, NEd)
		if err != nil {
			return 0, err
		}
		if m *= float64(face); !(m > 0) {
			if med == 0 {
				return 0, nil
			}
			return math.Inf(1), nil
		}
		return med / m, nil
	})
}

// AreaWhere returns the smallest total steel area As in [0, AsMax] (mm²), shared among
// the bars in proportion to their areas, at which ratio(section with As) ≤ 1, for a
// utilisation ratio that falls as As grows (a biaxial interaction ratio, say). An error
// from ratio counts as "not enough steel". The result lies on the safe side of the root
// (ratio ≤ 1) within 1e-9·AsMax; an error is returned when AsMax does not suffice.
//
// Method: regula falsi with the Illinois modification (Dowell and Jarratt 1971) on
// ratio − 1, falling back to bisection while the lower end has no finite ratio.
func (s *Section) AreaWhere(AsMax float64, ratio func(*Section) (float64, error)) (float64, error) {
	total := s.Area()
	if !(total > 0) || math.IsInf(total, 0) {
		return 0, errors.New("section: the bar pattern needs a positive total area to scale")
	}
	if !(AsMax > 0) || math.IsInf(AsMax, 0) {
		return 0, fmt.Errorf("section: upper area AsMax = %g mm² must be positive", AsMax)
	}
	trial := *s
	trial.Bars = make([]Bar, len(s.Bars))
	var lastErr error
	g := func(as float64) float64 {
		scaleBars(trial.Bars, s.Bars, as/total)
		r, err := ratio(&trial)
		if err != nil {
			lastErr = err
			return math.Inf(1)
		}
		if math.IsNaN(r) {
			return math.Inf(1)
		}
		return r - 1
	}
	hi, ghi := AsMax, g(AsMax)
	if !(ghi <= 0) {
		if lastErr != nil {
			return 0, fmt.Errorf("section: even As = %.6g mm² does not suffice: %v", AsMax, lastErr)
		}
		return 0, fmt.Errorf("section: even As = %.6g mm² does not suffice (ratio %.4g)", AsMax, ghi+1)
	}
	lo, glo := 0.0, g(0)
	if glo <= 0 {
		return 0, nil
	}
	xtol := 1e-9 * AsMax
	thi := ghi // true value of ratio − 1 at hi; ghi and glo carry the Illinois weights
	side := 0
	for it := 0; it < MaxIter; it++ {
		if thi >= -1e-12 || hi-lo <= xtol {
			return hi, nil
		}
		mid := 0.5 * (lo + hi)
		x := mid
		if !math.IsInf(glo, 1) {
			x = (lo*ghi - hi*glo) / (ghi - glo)
			if !(x > lo && x < hi) {
				x = mid
			}
		}
		gx := g(x)
		if gx <= 0 {
			hi, ghi, thi = x, gx, gx
			if side == -1 && !math.IsInf(glo, 1) {
				glo /= 2
			}
			side = -1
		} else {
			lo, glo = x, gx
			if side == 1 {
				ghi /= 2
			}
			side = 1
		}
	}
	return 0, fmt.Errorf("section: area search did not converge in %d iterations", MaxIter)
}
