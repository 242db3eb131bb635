package detail

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// The cost of a pattern over a lift, worked by hand (common practice, no source; the weights are
// the defaults: 2 kg of steel per bar, 1 per tie piece; ρs = 7850 kg/m³).
func TestPatternCostByHand(t *testing.T) {
	w := CostWeights{PerBar: 2, PerTie: 1}
	cases := []struct {
		name        string
		g           Geometry
		p           Pattern
		cb          CostBasis
		main, links float64 // kg, by hand
		ties        int
		total       float64
	}{
		// 300 × 300, cover 30, links 8, 4 Ø16 over 3000 mm with an 800 mm lap, links at 240 mm:
		// main 7.85e-6·4·(π·16²/4)·3800 = 23.9906 kg; ⌊3000/240⌋ + 1 = 13 links of
		// 4·(300 − 60 − 8) = 928 mm: 7.85e-6·13·928·(π·8²/4) = 4.7603 kg; labour 2·4 = 8.
		{"4 Ø16", Geometry{B: 300, H: 300, Cover: 30, Link: 8}, Pattern{Dia: 16, NB: 2, NH: 2},
			CostBasis{Lift: 3000, Lap: 800, Spacing: 240}, 23.9906, 4.7603, 0, 36.7509},
		// 500 × 500, cover 40, links 8, 16 Ø16 (5 a face) over 3000 mm, lap 800, links at 300 mm:
		// bar centres 500 − 2·56 = 388 apart at the corners, 97 mm between neighbours: one bar
		// in three restrained (reach ⌊150/97⌋ = 1), so one extra tie each way, each 500 − 80 − 8 = 412 mm.
		// main 7.85e-6·16·201.062·3800 = 95.9625 kg; 11 sets of (1648 + 2·412) mm:
		// 7.85e-6·11·2472·50.2655 = 10.7295 kg; labour 2·16 + 1·11·2 = 54.
		{"16 Ø16 with ties", Geometry{B: 500, H: 500, Cover: 40, Link: 8}, Pattern{Dia: 16, NB: 5, NH: 5},
			CostBasis{Lift: 3000, Lap: 800, Spacing: 300}, 95.9625, 10.7295, 2, 160.6920},
	}
	for _, c := range cases {
		got := PatternCost(c.g, c.p, c.cb, w)
		rel := func(what string, g, want float64) {
			if math.Abs(g-want) > 1e-4*want {
				t.Errorf("%s: %s = %.4f, want %.4f (by hand)", c.name, what, g, want)
			}
		}
		rel("main", got.MainMass, c.main)
		rel("links", got.LinkMass, c.links)
		rel("total", got.Total, c.total)
		if got.Ties != c.ties {
			t.Errorf("%s: %d ties, want %d", c.name, got.Ties, c.ties)
		}
		s := CostStep("c", "t", ArgsOf(c.g, c.p, c.cb, w, got))
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
		if math.Abs(s.Value-got.Total) > 1e-9*got.Total {
			t.Errorf("%s: the step gives %g, the cost %g", c.name, s.Value, got.Total)
		}
	}
}

// Cost ordering worked by hand for a 400 × 400 column (cover 40, links 8 mm at 240 mm, lift
// 3000 mm, laps 800 mm for Ø16 and 1250 mm for Ø25; invented test inputs): 8 Ø16 (3 a face, bar
// centres 144 mm apart, no ties) costs 7.85e-6·8·201.06·3800 + 13 links of 1248 mm (6.40 kg) + 16 = 47.98 + 6.40 + 16
// = 70.38 kg, 4 Ø25 costs 7.85e-6·4·490.87·4250 + 6.58 + 8 = 65.51 + 6.40 + 8 = 79.91 kg: the
// eight smaller bars are the cheaper pattern though they are more (common practice, no source).
func TestCostOrderingByHand(t *testing.T) {
	g := Geometry{B: 400, H: 400, Cover: 40, Link: 8}
	w := CostWeights{PerBar: 2, PerTie: 1}
	small := PatternCost(g, Pattern{Dia: 16, NB: 3, NH: 3}, CostBasis{Lift: 3000, Lap: 800, Spacing: 240}, w)
	large := PatternCost(g, Pattern{Dia: 25, NB: 2, NH: 2}, CostBasis{Lift: 3000, Lap: 1250, Spacing: 240}, w)
	if math.Abs(small.Total-70.38) > 0.01 || math.Abs(large.Total-79.91) > 0.01 {
		t.Errorf("8 Ø16 %.2f kg (by hand 70.38), 4 Ø25 %.2f kg (by hand 79.91)", small.Total, large.Total)
	}
	if !(small.Total < large.Total) {
		t.Error("8 Ø16 should cost less than 4 Ø25")
	}
	// Without the labour terms the order holds by steel alone: 54.38 < 71.91 kg.
	if s, l := PatternCost(g, Pattern{Dia: 16, NB: 3, NH: 3}, CostBasis{Lift: 3000, Lap: 800, Spacing: 240}, CostWeights{}),
		PatternCost(g, Pattern{Dia: 25, NB: 2, NH: 2}, CostBasis{Lift: 3000, Lap: 1250, Spacing: 240}, CostWeights{}); !(s.Total < l.Total) {
		t.Errorf("by steel alone 8 Ø16 %.2f kg, 4 Ø25 %.2f kg", s.Total, l.Total)
	}
}

// The least main bar and the vibrator gap (common practice, no source), beside the clear
// distance of EN 1992-1-1:2004 8.2(2).
func TestPracticeRules(t *testing.T) {
	for _, c := range []struct {
		b, h, want float64
	}{{300, 300, 16}, {250, 600, 12}, {299, 400, 12}, {400, 300, 16}} {
		s := LeastBar("l", q(c.b), q(c.h), q(300), q(12), q(16))
		if s.Value != c.want {
			t.Errorf("%g × %g: least bar %g, want %g", c.b, c.h, s.Value, c.want)
		}
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
	// 400 × 400, cover 40, links 8, Ø16: bar centres 400 − 2·56 = 288 mm apart at the corners.
	// With a 75 mm gap: ⌊288/(16 + 75)⌋ + 1 = 4 bars a face (clear gap 288/3 − 16 = 80 mm); five
	// would leave 288/4 − 16 = 56 mm, which meets 8.2(2) (max(16, 20 + 5, 20) = 25 mm) but not the gap.
	g := Geometry{B: 400, H: 400, Cover: 40, Link: 8}
	s := MaxBarsPerFace("n", "t", "n", q(400), q(40), q(8), q(16), q(75))
	if s.Value != 4 {
		t.Errorf("most bars a face %g, want 4", s.Value)
	}
	if err := trace.Recheck(s, 1e-9); err != nil {
		t.Error(err)
	}
	if !g.Roomy(Pattern{Dia: 16, NB: 4, NH: 4}, 75) || g.Roomy(Pattern{Dia: 16, NB: 5, NH: 4}, 75) {
		t.Error("4 bars a face keep the 75 mm gap, 5 do not")
	}
	smin := MinClearSpacing("s", q(16), q(20), q(1), q(5), q(20)).Value // EN 1992-1-1:2004 8.2(2): 25 mm
	if !g.Fits(Pattern{Dia: 16, NB: 5, NH: 5}, smin) {
		t.Error("5 bars a face meet 8.2(2)")
	}
}

// The bars of a lift continue those of the lift above (common practice, no source): the same or
// more bars on each face, the same or a larger diameter, each bar above within one bar diameter
// of a bar below (so that it laps beside it, EN 1992-1-1:2004 8.7.2(3)).
func TestContinues(t *testing.T) {
	g8 := Geometry{B: 400, H: 400, Cover: 40, Link: 8}
	g10 := Geometry{B: 400, H: 400, Cover: 40, Link: 10}
	cases := []struct {
		name       string
		ga         Geometry
		a          Pattern
		g          Geometry
		p          Pattern
		ok, crank  bool
		farthestAt float64 // greatest distance from a bar above to the nearest bar below, mm; -1: not compared
	}{
		{"same pattern", g8, Pattern{Dia: 16, NB: 3, NH: 3}, g8, Pattern{Dia: 16, NB: 3, NH: 3}, true, false, 0},
		// Corners move by (20 − 16)/2 = 2 mm each way: √8 = 2.83 mm ≤ 20.
		{"larger bars", g8, Pattern{Dia: 16, NB: 2, NH: 2}, g8, Pattern{Dia: 20, NB: 2, NH: 2}, true, false, math.Sqrt(8)},
		// 3 → 5 a face: the middle bar stays; 3 → 4: it sits 288/6 = 48 mm from the nearest bars below.
		{"3 to 5 a face", g8, Pattern{Dia: 16, NB: 3, NH: 3}, g8, Pattern{Dia: 16, NB: 5, NH: 3}, true, false, 0},
		{"3 to 4 a face", g8, Pattern{Dia: 16, NB: 3, NH: 3}, g8, Pattern{Dia: 16, NB: 4, NH: 3}, false, false, 48},
		{"fewer bars", g8, Pattern{Dia: 16, NB: 3, NH: 3}, g8, Pattern{Dia: 20, NB: 2, NH: 3}, false, false, -1},
		{"smaller bars", g8, Pattern{Dia: 20, NB: 2, NH: 2}, g8, Pattern{Dia: 16, NB: 2, NH: 2}, false, false, -1},
		// Ø32 needs 10 mm links: the corners move by 2 + 8 = 10 mm each way, 14.1 mm ≤ 32.
		{"links change", g8, Pattern{Dia: 16, NB: 2, NH: 2}, g10, Pattern{Dia: 32, NB: 2, NH: 2}, true, false, math.Sqrt(200)},
		// A smaller section above: the bars below are cranked in; counts and diameter compared.
		{"crank", Geometry{B: 400, H: 400, Cover: 40, Link: 8}, Pattern{Dia: 16, NB: 3, NH: 3}, Geometry{B: 450, H: 450, Cover: 40, Link: 8}, Pattern{Dia: 16, NB: 3, NH: 3}, true, true, -1},
	}
	for _, c := range cases {
		got := Continues(c.ga, c.a, c.g, c.p)
		if got.OK() != c.ok {
			t.Errorf("%s: continues %v, want %v (ratio %g)", c.name, got.OK(), c.ok, got.Ratio)
		}
		if got.SameSection == c.crank {
			t.Errorf("%s: same section %v", c.name, got.SameSection)
		}
		if c.farthestAt >= 0 && math.Abs(got.Farthest-c.farthestAt) > 1e-9 {
			t.Errorf("%s: farthest %g mm, want %g", c.name, got.Farthest, c.farthestAt)
		}
		s := ContinuityCheck("c", got, q(float64(c.a.NB)), q(float64(c.a.NH)), q(c.a.Dia), q(float64(c.p.NB)), q(float64(c.p.NH)), q(c.p.Dia))
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
		if (s.Verdict == trace.Pass) != c.ok {
			t.Errorf("%s: check verdict %s", c.name, s.Verdict)
		}
	}
	// 450 → 400 with the same cover and bars: the corner bars move in by 25 mm; at 1 in 12 the
	// crank runs over 300 mm, EN 1992-1-1:2004 9.5.3(5).
	c := Continues(Geometry{B: 400, H: 400, Cover: 40, Link: 8}, Pattern{Dia: 16, NB: 2, NH: 2}, Geometry{B: 450, H: 450, Cover: 40, Link: 8}, Pattern{Dia: 16, NB: 2, NH: 2})
	if math.Abs(c.Offset-25) > 1e-9 {
		t.Errorf("crank offset %g, want 25", c.Offset)
	}
	if s := CrankLength("l", q(c.Offset), q(12)); s.Value != 300 || trace.Recheck(s, 1e-9) != nil {
		t.Errorf("crank length %g, want 300", s.Value)
	}
}

// TestContinuesAtMatchesContinues holds the comparison with the positions given to that which
// works them out.
func TestContinuesAtMatchesContinues(t *testing.T) {
	rect := Geometry{B: 400, H: 500, Cover: 35, Link: 8}
	wide := Geometry{B: 450, H: 500, Cover: 35, Link: 10}
	ring := Geometry{B: 500, H: 500, Cover: 40, Link: 10, Circle: true}
	cases := []struct {
		ga, g Geometry
		a, p  Pattern
	}{
		{rect, rect, Pattern{Dia: 16, NB: 2, NH: 2}, Pattern{Dia: 16, NB: 3, NH: 3}},
		{rect, rect, Pattern{Dia: 20, NB: 3, NH: 4}, Pattern{Dia: 16, NB: 3, NH: 4}},
		{rect, wide, Pattern{Dia: 16, NB: 3, NH: 3}, Pattern{Dia: 20, NB: 3, NH: 3}},
		{ring, ring, Pattern{Dia: 16, Ring: 6}, Pattern{Dia: 16, Ring: 8}},
		{ring, ring, Pattern{Dia: 16, Ring: 8}, Pattern{Dia: 20, Ring: 8}},
	}
	for _, c := range cases {
		want := Continues(c.ga, c.a, c.g, c.p)
		for _, got := range []Continuity{
			ContinuesAt(c.ga, c.a, c.ga.Positions(c.a), c.g, c.p, nil),
			ContinuesAt(c.ga, c.a, nil, c.g, c.p, c.g.Positions(c.p)),
			ContinuesAt(c.ga, c.a, c.ga.Positions(c.a), c.g, c.p, c.g.Positions(c.p)),
		} {
			if got != want {
				t.Errorf("%v over %v: %+v, want %+v", c.a, c.p, got, want)
			}
		}
	}
}

// TestContinuesOKMatches holds ContinuesOK, which stops at the first bar out of reach, to the
// OK of the whole comparison for every pair of patterns of a section, the same and across
// sections and rings (common practice, no source).
func TestContinuesOKMatches(t *testing.T) {
	geoms := []Geometry{{B: 400, H: 500, Cover: 35, Link: 8}, {B: 450, H: 500, Cover: 35, Link: 10}, {B: 500, H: 500, Cover: 40, Link: 10, Circle: true}}
	var pats []Pattern
	for _, d := range []float64{12, 16, 20, 25} {
		for nb := 2; nb <= 5; nb++ {
			for nh := 2; nh <= 5; nh++ {
				pats = append(pats, Pattern{Dia: d, NB: nb, NH: nh})
			}
		}
		for n := 6; n <= 12; n += 2 {
			pats = append(pats, Pattern{Dia: d, Ring: n})
		}
	}
	oks, fails := 0, 0
	for _, ga := range geoms {
		for _, g := range geoms {
			for _, a := range pats {
				for _, p := range pats {
					if (a.Ring > 0) != ga.Circle || (p.Ring > 0) != g.Circle {
						continue
					}
					want := ContinuesAt(ga, a, nil, g, p, nil).OK()
					if got := ContinuesOK(ga, a, nil, g, p, nil); got != want {
						t.Fatalf("%v over %v: %v, want %v", a, p, got, want)
					}
					if want {
						oks++
					} else {
						fails++
					}
				}
			}
		}
	}
	if oks == 0 || fails == 0 {
		t.Errorf("%d pairs continue, %d do not: the cases should have both", oks, fails)
	}
}
