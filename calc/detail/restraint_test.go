package detail

import (
	"math"
	"reflect"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// EN 1992-1-1:2004 9.5.3(6): corner bars are held by the perimeter link, and no bar in a compression
// zone lies further than 150 mm from a restrained bar; distances between bar centres along the face,
// as the package states. Every expected value below is worked by hand; the edge distance is
// cover + link + φ/2 (common practice, no source), 35 + 10 + 10 = 55 mm for φ20 with a 10 mm link.
func TestRestraintByHand(t *testing.T) {
	cases := []struct {
		name         string
		g            Geometry
		p            Pattern
		sB, sH       float64 // centre spacing along each face, mm
		restB, restH []int   // restrained bars from one corner
		dB, dH       float64 // farthest bar from a restrained bar, mm
		ties         int
	}{
		// Four corner bars only: all held by the link, 208 mm apart but nothing to restrain.
		{"4 bars", Geometry{B: 300, H: 300, Cover: 30, Link: 8}, Pattern{Dia: 16, NB: 2, NH: 2},
			208, 208, []int{0, 1}, []int{0, 1}, 0, 0, 0},
		// 8 bars, 400 × 400: middle bars 145 mm from the corners, within 150: no ties.
		{"8 bars 400", Geometry{B: 400, H: 400, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 3, NH: 3},
			145, 145, []int{0, 2}, []int{0, 2}, 145, 145, 0},
		// 8 bars, 450 × 450: middle bars 170 mm from the corners: each held, one tie each way.
		{"8 bars 450", Geometry{B: 450, H: 450, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 3, NH: 3},
			170, 170, []int{0, 1, 2}, []int{0, 1, 2}, 0, 0, 2},
		// 5 bars on 600 at 122.5 mm: the middle bar held (bars 2 and 4 are 245 mm from a corner).
		{"5 on b", Geometry{B: 600, H: 400, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 5, NH: 3},
			122.5, 145, []int{0, 2, 4}, []int{0, 2}, 122.5, 145, 1},
		// 6 bars on 700 at 118 mm: one tie on the fourth bar serves the second, third and fifth;
		// 3 bars on 450 at 170 mm need their middle bar held.
		{"6 on b", Geometry{B: 700, H: 450, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 6, NH: 3},
			118, 170, []int{0, 3, 5}, []int{0, 1, 2}, 118, 0, 2},
		// 7 bars on 590 at 80 mm: the middle bar held; the third bar is 160 mm from the corner,
		// 80 mm from the middle.
		{"7 on b", Geometry{B: 590, H: 400, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 7, NH: 2},
			80, 290, []int{0, 3, 6}, []int{0, 1}, 80, 0, 1},
		// 4 bars on 710 at 200 mm: every bar beyond 150 mm of the next, both intermediate bars held.
		{"4 on b", Geometry{B: 710, H: 400, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 4, NH: 3},
			200, 145, []int{0, 1, 2, 3}, []int{0, 2}, 0, 145, 2},
		// 12 bars on 1210 at 100 mm: a held bar serves one neighbour each way (200 > 150), so two
		// extra held bars cover 2 + 3 + 3 + 2 = 10 < 12 bars: three are needed.
		{"12 on b", Geometry{B: 1210, H: 400, Cover: 35, Link: 10}, Pattern{Dia: 20, NB: 12, NH: 3},
			100, 145, []int{0, 3, 6, 8, 11}, []int{0, 2}, 100, 145, 3},
	}
	for _, c := range cases {
		r := c.g.Restraint(c.p, RestraintLimit)
		near(t, c.name+" spacing b", r.AlongB.Spacing, c.sB, 1e-9)
		near(t, c.name+" spacing h", r.AlongH.Spacing, c.sH, 1e-9)
		if !reflect.DeepEqual(r.AlongB.Restrained(), c.restB) || !reflect.DeepEqual(r.AlongH.Restrained(), c.restH) {
			t.Errorf("%s: restrained %v / %v, want %v / %v", c.name, r.AlongB.Restrained(), r.AlongH.Restrained(), c.restB, c.restH)
		}
		near(t, c.name+" farthest b", r.AlongB.Farthest, c.dB, 1e-9)
		near(t, c.name+" farthest h", r.AlongH.Farthest, c.dH, 1e-9)
		if r.Ties != c.ties || !r.OK() {
			t.Errorf("%s: %d ties (ok %v), want %d", c.name, r.Ties, r.OK(), c.ties)
		}

		l := &trace.Log{Prefix: "K1/L1/"}
		if n := RestraintSteps(l, "restraint/", c.g, c.p, Traced{}); n != c.ties {
			t.Errorf("%s: RestraintSteps gives %d ties, want %d", c.name, n, c.ties)
		}
		ties := 0
		for _, s := range l.Steps {
			recheck(t, s)
			if s.Kind == trace.KindCheck && s.Verdict != trace.Pass {
				t.Errorf("%s: %s fails", c.name, s.ID)
			}
			if strings.Contains(s.ID, "/tie") && !strings.HasSuffix(s.ID, "/ties") {
				ties++
			}
		}
		if want := r.AlongB.Extra + r.AlongH.Extra; ties != want {
			t.Errorf("%s: %d tie-position steps, want %d", c.name, ties, want)
		}
		if l.Last().Value != float64(c.ties) {
			t.Errorf("%s: ties step %g, want %d", c.name, l.Last().Value, c.ties)
		}
	}
}

// The fewest restrained bars, checked against an exhaustive search over every choice of held
// intermediate bars (no outside source: the rule of 9.5.3(6) applied literally).
func TestRestraintFewest(t *testing.T) {
	for n := 2; n <= 14; n++ {
		for _, s := range []float64{40, 75, 100, 145, 150, 151, 200, 300} {
			f := restrainFace(n, s, RestraintLimit)
			if got := farthest(f.Restrained(), n, s); f.Farthest != got || got > RestraintLimit {
				t.Errorf("n %d s %g: farthest %g recorded, %g actual", n, s, f.Farthest, got)
			}
			if len(f.Restrained()) != f.Extra+2 || f.Restrained()[0] != 0 || f.Restrained()[len(f.Restrained())-1] != n-1 {
				t.Errorf("n %d s %g: restrained %v, extra %d", n, s, f.Restrained(), f.Extra)
			}
			best := n
			for mask := 0; mask < 1<<(n-2); mask++ {
				held := []int{0}
				for i := 1; i < n-1; i++ {
					if mask&(1<<(i-1)) != 0 {
						held = append(held, i)
					}
				}
				held = append(held, n-1)
				if farthest(held, n, s) <= RestraintLimit && len(held)-2 < best {
					best = len(held) - 2
				}
			}
			if n == 2 {
				best = 0
			}
			if f.Extra != best {
				t.Errorf("n %d s %g: %d extra held bars, fewest is %d", n, s, f.Extra, best)
			}
		}
	}
}

// farthest returns the greatest distance of any of n bars at spacing s from the nearest held bar.
func farthest(held []int, n int, s float64) float64 {
	worst := 0.0
	for i := 0; i < n; i++ {
		d := math.Inf(1)
		for _, j := range held {
			d = math.Min(d, math.Abs(float64(i-j))*s)
		}
		worst = math.Max(worst, d)
	}
	return worst
}
