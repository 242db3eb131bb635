package actions

import (
	"math"
	"testing"

	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

func total(ps []frame.Piece) float64 {
	s := 0.0
	for _, p := range ps {
		s += p.Total()
	}
	return s
}

func peak(ps []frame.Piece) float64 {
	w := 0.0
	for _, p := range ps {
		w = math.Max(w, math.Max(p.W0, p.W1))
	}
	return w
}

// contiguous reports whether the pieces cover 0 to l without gaps or overlaps.
func contiguous(ps []frame.Piece, l float64) bool {
	x := 0.0
	for _, p := range ps {
		if p.X0 != x || !(p.X1 > p.X0) {
			return false
		}
		x = p.X1
	}
	return len(ps) == 0 || x == l
}

// Slab loads to the edge beams (common practice, no source): one way to the two supporting beams,
// two way by 45° lines from the corners; every panel's load reaches its beams in full.
func TestPanelLoads(t *testing.T) {
	const q = 7.5e-3 // 7.5 kN/m² in N/mm²
	cases := []struct {
		lx, ly float64 // mm
		spans  string
		// expected share of q·lx·ly on south, north, west, east (by hand)
		share [4]float64
	}{
		{6600, 7800, model.SpanX, [4]float64{0, 0, 0.5, 0.5}},
		{6600, 7800, model.SpanY, [4]float64{0.5, 0.5, 0, 0}},
		{6000, 6000, model.SpanTwoWay, [4]float64{0.25, 0.25, 0.25, 0.25}}, // square: a quarter each
		// lx > ly: triangles on west/east, each q·ly²/4; trapezia on south/north, each q·ly/2·(lx − ly/2)
		{6600, 5700, model.SpanTwoWay, [4]float64{
			5700.0 / 2 * (6600 - 5700.0/2) / (6600 * 5700), 5700.0 / 2 * (6600 - 5700.0/2) / (6600 * 5700),
			5700.0 * 5700 / 4 / (6600 * 5700), 5700.0 * 5700 / 4 / (6600 * 5700)}},
		// ly > lx: the other way round
		{4800, 7800, model.SpanTwoWay, [4]float64{
			4800.0 * 4800 / 4 / (4800 * 7800), 4800.0 * 4800 / 4 / (4800 * 7800),
			4800.0 / 2 * (7800 - 4800.0/2) / (4800 * 7800), 4800.0 / 2 * (7800 - 4800.0/2) / (4800 * 7800)}},
	}
	for _, c := range cases {
		s, n, w, e := PanelLoads(c.lx, c.ly, q, c.spans)
		beams := [4][]frame.Piece{s, n, w, e}
		lengths := [4]float64{c.lx, c.lx, c.ly, c.ly}
		whole := q * c.lx * c.ly
		sum := 0.0
		for i, b := range beams {
			sum += total(b)
			// Tolerance: relative 1e-12 (rounding of a few products).
			if !near(total(b), c.share[i]*whole, 1e-12) {
				t.Errorf("%g × %g %s, edge %d: %g N, want %g N", c.lx, c.ly, c.spans, i, total(b), c.share[i]*whole)
			}
			if !contiguous(b, lengths[i]) {
				t.Errorf("%g × %g %s, edge %d: pieces %v do not cover the beam", c.lx, c.ly, c.spans, i, b)
			}
		}
		if !near(sum, whole, 1e-12) {
			t.Errorf("%g × %g %s: beams carry %g N of %g N", c.lx, c.ly, c.spans, sum, whole)
		}
		// The traced peak equals the distributed peak on every edge.
		for i, edge := range []string{South, North, West, East} {
			st := EdgePeak("w", edge, c.spans, trace.Const(c.lx, "L_x", "mm"), trace.Const(c.ly, "L_y", "mm"), trace.Const(q, "q", "MPa"))
			if err := trace.Recheck(st, 1e-9); err != nil {
				t.Error(err)
			}
			if !near(st.Value, peak(beams[i]), 1e-12) {
				t.Errorf("%g × %g %s %s: traced peak %g, pieces %g", c.lx, c.ly, c.spans, edge, st.Value, peak(beams[i]))
			}
		}
	}
	if s, n, w, e := PanelLoads(0, 5000, q, model.SpanY); s != nil || n != nil || w != nil || e != nil {
		t.Error("a panel without area should give no loads")
	}
}

// An unknown span direction is a programming error upstream of PanelLoads (input validation).
func TestPanelLoadsUnknownSpans(t *testing.T) {
	defer func() {
		if recover() == nil {
			t.Error("unknown span direction should panic")
		}
	}()
	PanelLoads(5000, 5000, 1e-3, "diagonal")
}
