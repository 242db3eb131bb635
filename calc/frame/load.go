// Package frame analyses braced (no-sway) plane frames and subframes of beams and columns:
// fixed-end moments of beam loads, member stiffness, joint equilibrium and member end moments.
//
// Units: N, mm, N/mm (= kN/m) for line loads, N·mm for moments. Member end moments are
// clockwise positive on the member end (the slope-deflection convention).
package frame

import "sort"

// Piece is a linearly varying line load on part of a member: intensity W0 at X0 rising or
// falling linearly to W1 at X1, with 0 ≤ X0 < X1 ≤ L measured from the member's start.
type Piece struct {
	X0, X1 float64 // mm from the start of the member
	W0, W1 float64 // N/mm at X0 and X1, downward positive
}

// Uniform returns a uniform load w over the whole of a member of length l.
func Uniform(w, l float64) Piece { return Piece{X0: 0, X1: l, W0: w, W1: w} }

// Trapezoid returns the symmetric trapezoid of peak w over a member of length l whose
// intensity rises from zero at each end over the length a (a = l/2 gives a triangle,
// a = 0 a uniform load), as the pieces that make it up.
func Trapezoid(w, l, a float64) []Piece {
	switch {
	case a <= 0:
		return []Piece{Uniform(w, l)}
	case 2*a >= l:
		return []Piece{{0, l / 2, 0, w}, {l / 2, l, w, 0}}
	}
	return []Piece{{0, a, 0, w}, {a, l - a, w, w}, {l - a, l, w, 0}}
}

// Shift returns the piece moved by d along the member, for a load given on part of a longer member.
func (p Piece) Shift(d float64) Piece { return Piece{p.X0 + d, p.X1 + d, p.W0, p.W1} }

// Scale returns the piece with its intensities multiplied by k.
func (p Piece) Scale(k float64) Piece { return Piece{p.X0, p.X1, k * p.W0, k * p.W1} }

// Total returns the resultant of the piece, N.
func (p Piece) Total() float64 { return (p.W0 + p.W1) / 2 * (p.X1 - p.X0) }

// Merge returns the pieces summed into one piecewise-linear load: one piece between each pair
// of neighbouring break points, none where the load is nil. The load is the same.
func Merge(ps []Piece) []Piece {
	if len(ps) < 2 {
		return ps
	}
	xs := make([]float64, 0, 2*len(ps))
	for _, p := range ps {
		xs = append(xs, p.X0, p.X1)
	}
	sort.Float64s(xs)
	at := func(x float64, right bool) float64 {
		w := 0.0
		for _, p := range ps {
			// Inside the piece, or at its end from the side the interval lies on.
			if (right && x >= p.X0 && x < p.X1) || (!right && x > p.X0 && x <= p.X1) {
				w += p.W0 + (p.W1-p.W0)*(x-p.X0)/(p.X1-p.X0)
			}
		}
		return w
	}
	var out []Piece
	for k := 0; k+1 < len(xs); k++ {
		a, b := xs[k], xs[k+1]
		if b-a <= 1e-9 {
			continue
		}
		w0, w1 := at(a, true), at(b, false)
		if w0 == 0 && w1 == 0 {
			continue
		}
		out = append(out, Piece{X0: a, X1: b, W0: w0, W1: w1})
	}
	return out
}
