package fire

import (
	"testing"

	"colsheet/calc/trace"
)

// AssessTrial keeps the same check steps (ID, title, clause, relation, ratio, verdict) and gives
// the same outcome (route, checks, what bars cannot cure, mesh) as Assess in a trial log, for
// columns that take every part of Method A (common practice, no source: both run one set of
// formulas). The columns are test data.
func TestAssessTrialMatchesAssess(t *testing.T) {
	q := func(v float64) trace.Q { return trace.Q{V: v} }
	n := 0
	for _, circle := range []bool{false, true} {
		for _, size := range [][2]float64{{250, 250}, {300, 300}, {250, 400}, {400, 400}, {450, 600}} {
			b, h := size[0], size[1]
			if circle {
				h = b
			}
			ac := b * h
			if circle {
				ac = 3.141592653589793 * b * b / 4
			}
			for _, fck := range []float64{30, 60} {
				for _, l0 := range []float64{2800, 4500, 7000} {
					for _, e := range []float64{10, 60, 200} {
						for _, bars := range [][2]float64{{4, 16}, {8, 20}, {12, 32}} {
							for _, rating := range []int{30, 60, 90, 120, 180, 240, 300} {
								for _, mu := range []float64{0.2, 0.5, 0.7, 0.9} {
									for _, fixed := range []bool{false, true} {
										k := 0.5 // an override; the recommended 0.15 where none is given
										if fixed {
											k = 0
										}
										c := Column{B: q(b), H: q(h), Circle: circle, Ac: q(ac), Fck: q(fck), Cover: q(30), LinkDia: q(8), Dia: q(bars[1]),
											Bars: q(bars[0]), As: q(bars[0] * 3.141592653589793 * bars[1] * bars[1] / 4), L0Fi: q(l0),
											NEd: q(1e6), EY: q(e), EZ: q(e / 2), EMax: q(k), Omega: q(0.2), AlphaCc: q(1), MuFixed: fixed}
										lw := &trace.Log{Trial: true}
										want := Assess(lw, "fire/", rating, q(mu), c)
										lg := &trace.Log{Trial: true}
										got := AssessTrial(lg, "fire/", rating, q(mu), c)
										n++
										compareAssess(t, got, want, lg.Steps, lw.Steps)
									}
								}
							}
						}
					}
				}
			}
		}
	}
	t.Logf("%d assessments compared", n)
}

func compareAssess(t *testing.T, got, want Outcome, gs, ws []trace.Step) {
	t.Helper()
	if got.OK != want.OK || got.Route != want.Route || got.Fixed != want.Fixed || got.Mesh != want.Mesh || len(got.Checks) != len(want.Checks) {
		t.Fatalf("outcome %+v, want %+v", got, want)
	}
	for i := range got.Checks {
		if got.Checks[i].ID != want.Checks[i].ID || got.Checks[i].Fixed != want.Checks[i].Fixed {
			t.Fatalf("verdict %d %+v, want %+v", i, got.Checks[i], want.Checks[i])
		}
	}
	var wc []trace.Step
	for _, s := range ws {
		if s.Kind == trace.KindCheck {
			wc = append(wc, s)
		}
	}
	var gc []trace.Step
	for _, s := range gs {
		if s.Kind == trace.KindCheck {
			gc = append(gc, s)
		}
	}
	if len(gc) != len(wc) {
		t.Fatalf("%d check steps, want %d", len(gc), len(wc))
	}
	for i, w := range wc {
		g := gc[i]
		if g.ID != w.ID || g.Title != w.Title || g.Clause != w.Clause || g.Relation != w.Relation || g.Value != w.Value || g.Verdict != w.Verdict {
			t.Fatalf("step %d: %s %q %q %q %v %s, want %s %q %q %q %v %s", i, g.ID, g.Title, g.Clause, g.Relation, g.Value, g.Verdict,
				w.ID, w.Title, w.Clause, w.Relation, w.Value, w.Verdict)
		}
	}
}
