package building

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// deriveEnds derives the building as Derive does, with the end moments by columnEnds (the
// analysis the input asks for, both included).
func deriveEnds(t *testing.T, in *model.Input) *Derived {
	t.Helper()
	b := in.Building
	g, err := NewGrid(b)
	if err != nil {
		t.Fatal(err)
	}
	levels := Levels(b, g, panel)
	d := &Derived{Grid: g, Levels: levels}
	var order [][2]int
	for i := 0; i < g.NX; i++ {
		for j := 0; j < g.NY; j++ {
			if g.Has[i][j] {
				order = append(order, [2]int{i, j})
			}
		}
	}
	lifts := make([][]Lift, len(order))
	for k, at := range order {
		lifts[k] = columnLifts(in, g, levels, at[0], at[1])
	}
	ends, err := columnEnds(in, g, levels, order, lifts)
	if err != nil {
		t.Fatal(err)
	}
	for k := range order {
		assembleMoments(lifts[k], ends[k])
		d.Lifts = append(d.Lifts, lifts[k]...)
	}
	return d
}

// The larger of two end moments by magnitude, the subframe's where they are equal, each
// recorded and the governing analysis named (the rule of analysis: both, common practice, no
// source; the moments are invented test input).
func TestLargerOfTwo(t *testing.T) {
	for _, c := range []struct {
		sub, frm, want float64
		governs        string
	}{
		{-120e6, 150e6, 150e6, "the frame governs"},
		{-150e6, 120e6, -150e6, "the subframe governs"},
		{80e6, -80e6, 80e6, "the subframe governs"},
		{0, -1e6, -1e6, "the frame governs"},
	} {
		l := &trace.Log{}
		sub := trace.Q{V: c.sub, Symbol: "M_col", Unit: "Nmm", From: "subx/L1/m_below"}
		frm := trace.Q{V: c.frm, Symbol: "M_t,y", Unit: "Nmm", From: "frm/x/top"}
		q, byFrame := larger(l, "both/y/top", "at the top of the lift", "y", "M_t,y", sub, frm)
		if q.V != c.want || byFrame != (c.governs == "the frame governs") {
			t.Errorf("sub %g, frame %g: %g (frame %v), want %g", c.sub, c.frm, q.V, byFrame, c.want)
		}
		if len(l.Steps) != 3 {
			t.Fatalf("%d steps, want subframe, frame and larger", len(l.Steps))
		}
		for k, prefix := range []string{"Subframe: ", "Frame: ", "Larger: "} {
			if !strings.HasPrefix(l.Steps[k].Title, prefix) {
				t.Errorf("step %d: %q", k, l.Steps[k].Title)
			}
		}
		if !strings.Contains(l.Steps[2].Title, c.governs) {
			t.Errorf("larger step %q does not say %q", l.Steps[2].Title, c.governs)
		}
		for _, s := range l.Steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
		}
	}
}

// analysis: both designs each column end for the larger in magnitude of the subframe's and the
// frame's moment, per axis, for the governing arrangement and the least axial force alike; in a
// building of unequal spans each analysis governs somewhere (common practice, no source).
func TestBothTakesTheLarger(t *testing.T) {
	sub, err := Derive(unequalSpans(model.AnalysisSubframe, model.Comb610), panel)
	if err != nil {
		t.Fatal(err)
	}
	frm, err := Derive(unequalSpans(model.AnalysisFrame, model.Comb610), panel)
	if err != nil {
		t.Fatal(err)
	}
	both := deriveEnds(t, unequalSpans(model.AnalysisBoth, model.Comb610))
	pick := func(a, b float64) float64 {
		if math.Abs(b) > math.Abs(a) {
			return b
		}
		return a
	}
	governs := map[string]int{}
	for k, lf := range both.Lifts {
		s, f := sub.Lifts[k], frm.Lifts[k]
		name := lf.Column + "/" + lf.Name
		for _, c := range []struct {
			what          string
			got, sub, frm float64
		}{
			{"top y", lf.MY.Top, s.MY.Top, f.MY.Top}, {"bottom y", lf.MY.Bottom, s.MY.Bottom, f.MY.Bottom},
			{"top z", lf.MZ.Top, s.MZ.Top, f.MZ.Top}, {"bottom z", lf.MZ.Bottom, s.MZ.Bottom, f.MZ.Bottom},
			{"top y, least N", lf.Src.Min[0].Top.V, s.Src.Min[0].Top.V, f.Src.Min[0].Top.V},
			{"bottom y, least N", lf.Src.Min[0].Bot.V, s.Src.Min[0].Bot.V, f.Src.Min[0].Bot.V},
		} {
			if c.got != pick(c.sub, c.frm) {
				t.Errorf("%s %s: %g, subframe %g, frame %g", name, c.what, c.got, c.sub, c.frm)
			}
		}
		for _, st := range lf.Steps {
			if err := trace.Recheck(st, 1e-9); err != nil {
				t.Error(err)
			}
			if strings.HasPrefix(st.Title, "Larger: ") {
				for _, g := range []string{"the subframe governs", "the frame governs"} {
					if strings.Contains(st.Title, g) {
						governs[g]++
					}
				}
			}
		}
		if findStep(lf, "both/y/top") == nil || findStep(lf, "both/z/top/sub") == nil || findStep(lf, "both/z/top/frame") == nil {
			t.Errorf("%s: the comparison is not on the sheet", name)
		}
	}
	if governs["the subframe governs"] == 0 || governs["the frame governs"] == 0 {
		t.Errorf("governing: %v, want each analysis somewhere", governs)
	}
	// The subframe and the frame alone give what Derive gives.
	for _, a := range []string{model.AnalysisSubframe, model.AnalysisFrame} {
		one := deriveEnds(t, unequalSpans(a, model.Comb610))
		ref := sub
		if a == model.AnalysisFrame {
			ref = frm
		}
		for k := range one.Lifts {
			if one.Lifts[k].MY != ref.Lifts[k].MY || one.Lifts[k].MZ != ref.Lifts[k].MZ {
				t.Errorf("%s: %s/%s differs from Derive", a, one.Lifts[k].Column, one.Lifts[k].Name)
			}
		}
	}
}

// Of the bottom moments of the other arrangements, only one that bends the lift in single
// curvature with the top moment counts (clockwise end moments of opposite sign), the larger
// where both do (common practice, no source; invented moments).
func TestSingleCurvatureAlt(t *testing.T) {
	top := trace.Q{V: 100, From: "both/y/top"}
	q := func(v float64) trace.Q { return trace.Q{V: v, Unit: "Nmm", From: "x"} }
	for _, c := range []struct {
		sub, frm trace.Q
		want     float64
		found    bool
	}{
		{q(-40), q(-60), -60, true},
		{q(-40), q(30), -40, true},
		{q(20), q(-30), -30, true},
		{q(20), q(30), 0, false},
		{trace.Q{}, q(-30), -30, true},
		{trace.Q{}, trace.Q{}, 0, false},
	} {
		got := singleCurvatureAlt(&trace.Log{}, "both/y/bot_alt", "y", top, c.sub, c.frm)
		if (got.From != "") != c.found || got.V != c.want {
			t.Errorf("sub %g, frame %g: %+v, want %g", c.sub.V, c.frm.V, got, c.want)
		}
	}
}
