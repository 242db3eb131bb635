package building

import (
	"testing"

	"colsheet/calc/frame"
	"colsheet/calc/trace"
)

// The slab area that drains to a beam, Σ (x1 − x0)·(w0 + w1)/2 (statics), written in its simplest
// form for each piece: span × width for a uniform strip from the support, half the base times
// the height for a triangle; the general trapezoid only where needed.
func TestPiecesTotalSimplest(t *testing.T) {
	cases := []struct {
		name string
		ps   []frame.Piece
		expr string
		want float64 // m² × 1e6, by hand
	}{
		// A one-way slab: 7.2 m × 3.45 m = 24.84 m².
		{"strip", []frame.Piece{{X0: 0, X1: 7200, W0: 3450, W1: 3450}}, "x1_1 * w0_1", 24.84e6},
		// Two-way: triangles of 3.45 m rise on both ends of a 7.2 m span with a 0.3 m uniform middle:
		// 3.45²/2 + 0.3·3.45 + 3.45²/2 = 12.9375 m².
		{"trapezoid", []frame.Piece{{X0: 0, X1: 3450, W0: 0, W1: 3450}, {X0: 3450, X1: 3750, W0: 3450, W1: 3450}, {X0: 3750, X1: 7200, W0: 3450, W1: 0}},
			"x1_1 * w1_1 / 2 + (x1_2 - x0_2) * w0_2 + (x1_3 - x0_3) * w0_3 / 2", 12.9375e6},
		// A piece that neither starts at the support nor is uniform or a triangle: (4 − 1)·(1 + 2)/2 = 4.5 m².
		{"general", []frame.Piece{{X0: 1000, X1: 4000, W0: 1000, W1: 2000}}, "(x1_1 - x0_1) * (w0_1 + w1_1) / 2", 4.5e6},
	}
	for _, c := range cases {
		s := PiecesTotal("A_slab", "Slab area that drains to the beam", "common practice (tributary areas)", "A_slab", "mm2", "mm", c.ps)
		if s.Expr != c.expr {
			t.Errorf("%s: %q, want %q", c.name, s.Expr, c.expr)
		}
		if d := s.Value - c.want; d > 1e-6 || d < -1e-6 {
			t.Errorf("%s: %g mm², want %g", c.name, s.Value, c.want)
		}
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}
