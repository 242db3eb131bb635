package frame

import "math"

// FixedEnd returns the fixed-end moments of a prismatic member of length l under the line
// loads, clockwise positive on the member ends: mStart = −∫w·x·(l−x)²/l² dx (anticlockwise
// under downward load) and mEnd = +∫w·x²·(l−x)/l² dx. Parts of pieces outside [0, l] are
// ignored; a member of no length carries nothing.
func FixedEnd(l float64, loads []Piece) (mStart, mEnd float64) {
	if !(l > 0) {
		return 0, 0
	}
	for _, p := range loads {
		p, ok := clip(p, l)
		if !ok {
			continue
		}
		mStart -= exact(p, func(x float64) float64 { return x * (l - x) * (l - x) }, 1)
		mEnd += exact(p, func(x float64) float64 { return x * x * (l - x) }, -1)
	}
	return mStart / (l * l), mEnd / (l * l)
}

// SimpleReactions returns the upward support reactions of a simply supported member of
// length l under the line loads, by statics (moments about each support); parts of pieces
// outside [0, l] are ignored; a member of no length carries nothing.
func SimpleReactions(l float64, loads []Piece) (rStart, rEnd float64) {
	if !(l > 0) {
		return 0, 0
	}
	for _, p := range loads {
		p, ok := clip(p, l)
		if !ok {
			continue
		}
		rStart += exact(p, func(x float64) float64 { return l - x }, 0)
		rEnd += exact(p, func(x float64) float64 { return x }, 0)
	}
	return rStart / l, rEnd / l
}

// exact integrates w(x)·g(x) over the piece in closed form, for g a polynomial of degree
// three or less whose x³ coefficient is cubic. The load is linear, so the integrand is a
// polynomial of degree four at most: Simpson's rule integrates it exactly up to degree three,
// and its error on the x⁴ term, c⁵·f⁗/2880 with f⁗ = 24·cubic·(W1 − W0)/c over the piece's
// length c, is subtracted, which makes the result exact.
func exact(p Piece, g func(x float64) float64, cubic float64) float64 {
	c := p.X1 - p.X0
	xm := (p.X0 + p.X1) / 2
	simpson := c / 6 * (p.W0*g(p.X0) + 2*(p.W0+p.W1)*g(xm) + p.W1*g(p.X1))
	return simpson - cubic*c*c*c*c*(p.W1-p.W0)/120
}

// clip returns the part of the piece that lies on [0, l], with its intensities interpolated
// at the cut, and false when nothing of it is left.
func clip(p Piece, l float64) (Piece, bool) {
	x0, x1 := math.Max(p.X0, 0), math.Min(p.X1, l)
	if !(x1 > x0) {
		return Piece{}, false
	}
	if x0 == p.X0 && x1 == p.X1 {
		return p, true
	}
	at := func(x float64) float64 { return p.W0 + (p.W1-p.W0)*(x-p.X0)/(p.X1-p.X0) }
	return Piece{X0: x0, X1: x1, W0: at(x0), W1: at(x1)}, true
}
