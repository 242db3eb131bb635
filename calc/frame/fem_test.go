package frame

import (
	"math"
	"testing"
)

// near reports whether got is within relative tol of want (absolute tol·1 for want = 0).
func near(got, want, tol float64) bool {
	return math.Abs(got-want) <= tol*math.Max(math.Abs(want), 1)
}

func TestFixedEnd(t *testing.T) {
	const w, l = 25.0, 7200.0 // N/mm, mm: test inputs
	const tol = 1e-12         // Simpson's rule is exact here, so only rounding remains
	a, c := 1800.0, 2400.0
	cases := []struct {
		name       string
		loads      []Piece
		start, end float64 // magnitudes; start is anticlockwise (negative), end clockwise
	}{
		// Roark's Formulas for Stress and Strain, Table 8.1, fixed–fixed beam under a
		// uniform load: M = wL²/12 at both ends (from memory).
		{"uniform", []Piece{Uniform(w, l)}, w * l * l / 12, w * l * l / 12},
		// Roark's Formulas for Stress and Strain, Table 8.1, fixed–fixed beam under a
		// triangle peaking at mid-span: M = 5wL²/96 at both ends (from memory).
		{"central triangle", Trapezoid(w, l, l/2), 5 * w * l * l / 96, 5 * w * l * l / 96},
		// Symmetric trapezoid with ramps a: M = (wL²/12)(1 − 2(a/L)² + (a/L)³), the
		// handbook formula for slabs' load shares on beams (common practice, from memory).
		{"trapezoid", Trapezoid(w, l, a), w * l * l / 12 * (1 - 2*math.Pow(a/l, 2) + math.Pow(a/l, 3)),
			w * l * l / 12 * (1 - 2*math.Pow(a/l, 2) + math.Pow(a/l, 3))},
		// Steel Designers' Manual, beam tables, fixed–fixed beam with a uniform load w over
		// the length c from end A: M_A = wc²(6L² − 8Lc + 3c²)/(12L²), M_B = wc³(4L − 3c)/(12L²)
		// (from memory).
		{"partial uniform from start", []Piece{{0, c, w, w}},
			w * c * c * (6*l*l - 8*l*c + 3*c*c) / (12 * l * l), w * c * c * c * (4*l - 3*c) / (12 * l * l)},
		{"partial uniform to end", []Piece{{l - c, l, w, w}},
			w * c * c * c * (4*l - 3*c) / (12 * l * l), w * c * c * (6*l*l - 8*l*c + 3*c*c) / (12 * l * l)},
		// Roark's Formulas for Stress and Strain, Table 8.1, fixed–fixed beam under a load
		// rising linearly from zero at A to w at B: M_A = wL²/30, M_B = wL²/20 (from memory).
		{"rising triangle", []Piece{{0, l, 0, w}}, w * l * l / 30, w * l * l / 20},
		// A load on nothing of the member gives nothing (common practice, no source).
		{"outside", []Piece{{l, l + c, w, w}}, 0, 0},
	}
	for _, tc := range cases {
		ms, me := FixedEnd(l, tc.loads)
		if !near(ms, -tc.start, tol) || !near(me, tc.end, tol) {
			t.Errorf("%s: FEM = (%.10g, %.10g), handbook (%.10g, %.10g)", tc.name, ms, me, -tc.start, tc.end)
		}
	}
	// A piece running past the end counts only within the member (common practice, no source):
	// the rising triangle cut at the member's end equals the triangle on the member alone.
	ms, me := FixedEnd(l/2, []Piece{{0, l, 0, w}})
	ws, we := FixedEnd(l/2, []Piece{{0, l / 2, 0, w / 2}})
	if !near(ms, ws, tol) || !near(me, we, tol) {
		t.Errorf("clipped piece: (%g, %g), want (%g, %g)", ms, me, ws, we)
	}
}

func TestSimpleReactions(t *testing.T) {
	const w, l = 12.5, 6600.0 // test inputs
	const tol = 1e-12
	cases := []struct {
		name       string
		loads      []Piece
		start, end float64
	}{
		// Statics of a simply supported span (any structural analysis textbook, from memory):
		// uniform load wL/2 at each support; rising triangle wL/6 and wL/3.
		{"uniform", []Piece{Uniform(w, l)}, w * l / 2, w * l / 2},
		{"rising triangle", []Piece{{0, l, 0, w}}, w * l / 6, w * l / 3},
		// Partial uniform load over [a, b]: R_B = w(b − a)(a + b)/(2L) by moments about A.
		{"partial", []Piece{{1000, 2500, w, w}}, w*1500 - w*1500*3500/(2*l), w * 1500 * 3500 / (2 * l)},
	}
	for _, tc := range cases {
		rs, re := SimpleReactions(l, tc.loads)
		if !near(rs, tc.start, tol) || !near(re, tc.end, tol) {
			t.Errorf("%s: reactions (%g, %g), want (%g, %g)", tc.name, rs, re, tc.start, tc.end)
		}
	}
	// The reactions sum to the total load (vertical equilibrium, common practice, no source).
	loads := append(Trapezoid(w, l, 1700), Piece{500, 4100, 3, 9}, Piece{2000, 2600, -4, 6})
	total := 0.0
	for _, p := range loads {
		total += p.Total()
	}
	rs, re := SimpleReactions(l, loads)
	if !near(rs+re, total, 1e-12) {
		t.Errorf("reactions sum to %g, total load %g", rs+re, total)
	}
}

func TestNoLength(t *testing.T) {
	// A member of no length carries nothing and gives finite zeros (common practice, no source).
	if a, b := FixedEnd(0, []Piece{Uniform(10, 5)}); a != 0 || b != 0 {
		t.Errorf("FixedEnd(0) = %g, %g", a, b)
	}
	if a, b := SimpleReactions(0, []Piece{Uniform(10, 5)}); a != 0 || b != 0 {
		t.Errorf("SimpleReactions(0) = %g, %g", a, b)
	}
}

// Merging pieces keeps the load: the same total and the same fixed-end moments
// (common practice, no source).
func TestMerge(t *testing.T) {
	l := 7000.0
	ps := append(Trapezoid(12, l, 2500), Uniform(3.4, l), Piece{X0: 1000, X1: 4000, W0: 2, W1: 2})
	m := Merge(ps)
	if len(m) >= len(ps)+1 {
		t.Errorf("merge gave %d pieces from %d", len(m), len(ps))
	}
	a0, a1 := FixedEnd(l, ps)
	b0, b1 := FixedEnd(l, m)
	tot := func(ps []Piece) (s float64) {
		for _, p := range ps {
			s += p.Total()
		}
		return
	}
	for _, c := range [][2]float64{{a0, b0}, {a1, b1}, {tot(ps), tot(m)}} {
		if math.Abs(c[0]-c[1]) > 1e-9*math.Abs(c[0]) {
			t.Errorf("merged %g, original %g", c[1], c[0])
		}
	}
}
