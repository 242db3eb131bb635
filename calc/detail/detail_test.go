package detail

import (
	"math"
	"testing"
	"time"

	"colsheet/calc/trace"
)

func q(v float64) trace.Q { return trace.Const(v, "x", "") }

func TestRules(t *testing.T) {
	cases := []struct {
		name string
		s    trace.Step
		want float64
	}{
		// EN 1992-1-1:2004 9.5.2(2) Eq. (9.12N): As,min = max(0.10 NEd/fyd, 0.002 Ac).
		// 2000 kN, fyd = 500/1.15: 0.1·2e6/434.78 = 460 mm²; Ac = 300·300: 0.002·9e4 = 180 mm².
		{"AsMin force", AsMin("a", q(2e6), q(500/1.15), q(90000), q(0.1), q(0.002)), 0.1 * 2e6 / (500 / 1.15)},
		{"AsMin area", AsMin("a", q(2e5), q(500/1.15), q(250000), q(0.1), q(0.002)), 500},
		// EN 1992-1-1:2004 9.5.2(3): As,max = 0.04 Ac.
		{"AsMax", AsMax("a", q(350*500), q(0.04)), 7000},
		// EN 1992-1-1:2004 8.2(2): max(k1 φ, dg + k2, 20) with k1 = 1, k2 = 5 mm.
		{"smin dg", MinClearSpacing("s", q(16), q(20), q(1), q(5), q(20)), 25},
		{"smin phi", MinClearSpacing("s", q(32), q(20), q(1), q(5), q(20)), 32},
		{"smin 20", MinClearSpacing("s", q(12), q(10), q(1), q(5), q(20)), 20},
		// EN 1992-1-1:2004 9.5.3(1): max(6 mm, φmax/4).
		{"link 6", MinLinkDia("l", q(20), q(6), q(0.25)), 6},
		{"link 10", MinLinkDia("l", q(40), q(6), q(0.25)), 10},
		// EN 1992-1-1:2004 9.5.3(3): min(20 φmin, lesser dimension, 400 mm).
		{"spacing 20phi", MaxLinkSpacing("s", q(12), q(300), q(20), q(400)), 240},
		{"spacing b", MaxLinkSpacing("s", q(20), q(350), q(20), q(400)), 350},
		{"spacing 400", MaxLinkSpacing("s", q(25), q(600), q(20), q(400)), 400},
		// EN 1992-1-1:2004 9.5.3(4): 0.6 × scl,tmax.
		{"reduced", ReducedLinkSpacing("s", q(300), q(0.6)), 180},
		// Rounding down to a practical step, common practice, no source.
		{"round", RoundDown("r", "t", "s", q(144), q(25)), 125},
		{"round exact", RoundDown("r", "t", "s", q(150), q(25)), 150},
	}
	for _, c := range cases {
		if math.Abs(c.s.Value-c.want) > 1e-9*c.want {
			t.Errorf("%s = %g, want %g", c.name, c.s.Value, c.want)
		}
		if err := trace.Recheck(c.s, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}

func TestPositionsAndSpacing(t *testing.T) {
	g := Geometry{B: 300, H: 400, Cover: 35, Link: 8}
	p := Pattern{Dia: 20, NB: 3, NH: 2}
	pos := g.Positions(p)
	if len(pos) != p.Count() || p.Count() != 6 {
		t.Fatalf("got %d positions for %d bars", len(pos), p.Count())
	}
	// Edge distance = cover + link + φ/2 = 53 mm, common practice, no source.
	e := 35 + 8 + 10.0
	for _, xy := range pos {
		if math.Abs(math.Abs(xy[1])-(200-e)) > 1e-9 {
			t.Errorf("bar %v not on a b-face", xy)
		}
	}
	gb, gh := g.ClearGaps(p)
	if want := (300-2*e)/2 - 20; math.Abs(gb-want) > 1e-9 {
		t.Errorf("gap along b = %g, want %g", gb, want)
	}
	if want := 400 - 2*e - 20; math.Abs(gh-want) > 1e-9 {
		t.Errorf("gap along h = %g, want %g", gh, want)
	}
	// Symmetry about both axes (common practice, no source): the centroid of the bars is at the origin.
	var sy, sz float64
	for _, xy := range pos {
		sy += xy[0]
		sz += xy[1]
	}
	if math.Abs(sy) > 1e-9 || math.Abs(sz) > 1e-9 {
		t.Errorf("bars not symmetric: Σy=%g Σz=%g", sy, sz)
	}
}

func TestForCountAndCandidates(t *testing.T) {
	g := Geometry{B: 350, H: 500, Cover: 40, Link: 8}
	p, ok := g.ForCount(8, 20, 25)
	if !ok || p.Count() != 8 {
		t.Fatalf("no pattern for 8 bars: %+v", p)
	}
	if _, ok := g.ForCount(7, 20, 25); ok {
		t.Error("odd count accepted")
	}
	if _, ok := g.ForCount(40, 40, 40); ok {
		t.Error("40 H40 bars should not fit 350 × 500")
	}
	cs := Candidates(350, 500, 40, []float64{12, 16, 20, 25, 32, 40},
		func(d float64) float64 { return 8 }, func(d float64) float64 { return math.Max(d, 25) }, 0, 1e9)
	if len(cs) == 0 {
		t.Fatal("no candidates")
	}
	for i := 1; i < len(cs); i++ {
		if cs[i].Area() < cs[i-1].Area()-1e-6 {
			t.Fatalf("candidates not ordered by area at %d", i)
		}
	}
	if cs[0].Count() != 4 || cs[0].Dia != 12 {
		t.Errorf("least steel should be 4 × 12, got %d × %g", cs[0].Count(), cs[0].Dia)
	}
}

// The pattern search ends whatever the section size: with a section of 1e12 mm every pattern
// fits and 4 % of Ac (EN 1992-1-1:2004 9.5.2(3)) never binds, so only MaxBars stops it. And the
// cap never binds within the input's limits: the largest section (3 m × 3 m) holds no MaxBars
// bars of the smallest diameter (8 mm, 9.5.2(1)) at the least clear spacing of 20 mm (8.2(2)).
func TestSearchBounded(t *testing.T) {
	start := time.Now()
	huge := 1e12
	it := NewIter(huge, huge, 40, []float64{12, 16, 20, 25, 32, 40},
		func(float64) float64 { return 8 }, func(float64) float64 { return 20 }, 0, 0.04*huge*huge)
	n, most := 0, 0
	for p, ok := it.Next(); ok; p, ok = it.Next() {
		n++
		most = max(most, p.Count())
	}
	if most > MaxBars || most < MaxBars-2 || n == 0 {
		t.Errorf("the search gave %d patterns of up to %d bars, want up to the cap of %d", n, most, MaxBars)
	}
	if d := time.Since(start); d > 10*time.Second {
		t.Errorf("the search over a section of 1e12 mm took %v", d)
	}
	g := Geometry{B: 3000, H: 3000, Cover: 10, Link: 6}
	if _, fits := g.ForCount(MaxBars, 8, 20); fits {
		t.Errorf("%d bars of 8 mm fit a 3 m × 3 m section: the cap binds within the input limits", MaxBars)
	}
}
