package building

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/actions"
	"colsheet/calc/code"
	"colsheet/calc/frame"
	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

func panel(lx, ly float64, spans string) (s, n, w, e []frame.Piece) {
	return actions.PanelLoads(lx, ly, 1, spans)
}

// contractBuilding is the building form of ../shared/DESIGN.md (its invented numbers are test input).
func contractBuilding() *model.Input {
	c, _ := material.Lookup("C32/40")
	b := &model.Building{
		Storeys: []model.Level{{Name: "L1", Height: 3800}, {Name: "L2", Height: 3300}, {Name: "R", Height: 3300}},
		GridX:   []float64{6600, 6600, 4800}, GridY: []float64{7800, 5700},
		Column: model.Size{B: 350, H: 450}, Cover: 40, Beam: model.Size{B: 275, H: 500},
		Floors: []model.Floor{{Levels: []string{"L1", "L2"}, Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanY},
			{Levels: []string{"R"}, Gk: 3.9e-3, Qk: 0.6e-3, Category: "H", Spans: model.SpanY}},
		Base: model.BaseFixed, Analysis: model.AnalysisSubframe,
		Options: model.BuildingOptions{BeamStiffness: "half", Combination: model.Comb610, Reduction: model.ReduceNone, Density: 2.5e-5, L0Factor: 1},
	}
	return &model.Input{File: "contract.yaml", Code: code.Recommended(), Materials: model.Materials{Concrete: c, Fyk: 500, Aggregate: 20}, Building: b}
}

func lift(t *testing.T, d *Derived, col, level string) Lift {
	t.Helper()
	for _, l := range d.Lifts {
		if l.Column == col && l.Name == level {
			return l
		}
	}
	t.Fatalf("no lift %s/%s", col, level)
	return Lift{}
}

func stepValue(t *testing.T, l Lift, id string) float64 {
	t.Helper()
	for _, s := range l.Steps {
		if s.ID == id {
			return s.Value
		}
	}
	t.Fatalf("%s/%s: no step %s", l.Column, l.Name, id)
	return 0
}

func near(t *testing.T, name string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Abs(want) {
		t.Errorf("%s = %.6g, want %.6g (rel %g)", name, got, want, rel)
	}
}

// The take-down of the contract building by tributary areas, worked by hand (common practice):
// one-way slabs spanning y deliver to each column the slab of half the bays either side, the beams
// framing in give half their self-weight, the columns their own; EN 1990:2002 Eq. (6.10) with
// γG = 1.35, γQ = 1.5 (Table A1.2(B)) and ψ0 = 0 for roofs (Table A1.1), offices leading.
func TestTakeDownByHand(t *testing.T) {
	d, err := Derive(contractBuilding(), panel)
	if err != nil {
		t.Fatal(err)
	}
	const rho = 25e-6       // N/mm³
	beam := rho * 275 * 500 // N/mm
	colW := rho * 350 * 450 // N/mm
	cases := []struct {
		col     string
		ax, ay  float64 // tributary widths, mm
		beamLen float64 // half lengths of the beams framing in, summed, mm
	}{
		{"B2", (6600 + 6600) / 2, (7800 + 5700) / 2, 6600 + (7800+5700)/2},
		{"A1", 6600 / 2, 7800 / 2, 6600/2 + 7800/2},
		{"D2", 4800 / 2, (7800 + 5700) / 2, 4800/2 + (7800+5700)/2},
	}
	for _, c := range cases {
		a := c.ax * c.ay
		gLevel := func(gk float64) float64 { return gk*a + beam*c.beamLen }
		// Bottom of L1: levels L1, L2 (offices) and R (roof), three column lifts.
		g := gLevel(5.8e-3)*2 + gLevel(3.9e-3) + colW*(3800+3300+3300)
		qB := 2 * 2.5e-3 * a
		want := 1.35*g + 1.5*qB
		near(t, c.col+" NEd at L1", lift(t, d, c.col, "L1").NEd, want, 1e-9)
		// Bottom of R: the roof only; roof imposed load leads.
		gR := gLevel(3.9e-3) + colW*3300
		near(t, c.col+" NEd at R", lift(t, d, c.col, "R").NEd, 1.35*gR+1.5*0.6e-3*a, 1e-9)
	}
}

// Global equilibrium: the characteristic loads at the bottom of the lowest lifts add up to every
// load applied to the building (slabs, beams, columns, line loads), common practice, no source.
func TestGlobalEquilibrium(t *testing.T) {
	for _, spans := range []string{model.SpanX, model.SpanY, model.SpanTwoWay} {
		in := contractBuilding()
		b := in.Building
		for k := range b.Floors {
			b.Floors[k].Spans = spans
		}
		b.GridX = append(b.GridX, 5000) // a fourth bay so that an inner point can be left out
		b.Omit = []string{"C2"}
		b.Lines = []model.LineLoad{{Levels: []string{"L1", "L2"}, GridLine: "A", Gk: 8.5, Qk: 0}, {Levels: []string{"R"}, GridLine: "3", From: "B", To: "D", Gk: 2, Qk: 1, Category: "H"}}
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		g := d.Grid
		lx, ly := g.X[len(g.X)-1], g.Y[len(g.Y)-1]
		want := 0.0
		for _, lv := range d.Levels {
			want += lv.Floor.Gk * lx * ly
			for _, bm := range lv.Beams {
				want += b.Options.Density * bm.Size.B * bm.Size.H * bm.L
			}
		}
		want += 8.5*ly*2 + 2*(g.X[3]-g.X[1])
		ncol := 0
		sum := 0.0
		for _, l := range d.Lifts {
			want += b.Options.Density * l.Size.B * l.Size.H * l.Height
			if l.Level == 0 {
				sum += stepValue(t, l, "td/G_cum")
				ncol++
			}
		}
		if ncol != 5*3-1 {
			t.Errorf("%d columns, want 14", ncol)
		}
		near(t, "ΣG at the base ("+spans+")", sum, want, 1e-12)
	}
}

// The subframe at the roof of the inner column B2 about y, worked by hand: beams either side
// at half stiffness, the column below with its far end fixed (common practice); FEM = wL²/12
// (handbook formula); EN 1992-1-1:2004 5.1.3 arrangement with one span γG·Gk + γQ·Qk, the other γG·Gk.
func TestSubframeByHand(t *testing.T) {
	d, err := Derive(contractBuilding(), panel)
	if err != nil {
		t.Fatal(err)
	}
	lf := lift(t, d, "B2", "R")
	w := (7800 + 5700) / 2.0
	gk := 3.9e-3*w + 25e-6*275*500
	qk := 0.6e-3 * w
	L := 6600.0
	unb := (1.35*gk + 1.5*qk - 1.35*gk) * L * L / 12
	kb := 0.5 * 4 * (275 * math.Pow(500, 3) / 12) / L
	kc := 4 * (350 * math.Pow(450, 3) / 12) / 3300
	m := unb * kc / (kc + 2*kb)
	near(t, "|M top R about y|", math.Abs(lf.MY.Top), m, 1e-9)
	// Every step of every lift reproduces itself.
	for _, l := range d.Lifts {
		for _, s := range l.Steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
		}
	}
}

// Edge columns of a regular building bend in double curvature in the frames perpendicular to
// their edge (the one beam pulls every joint the same way), common practice, no source.
func TestEdgeColumnCurvature(t *testing.T) {
	for _, analysis := range []string{model.AnalysisSubframe, model.AnalysisFrame} {
		in := contractBuilding()
		in.Building.Analysis = analysis
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		lf := lift(t, d, "A2", "L2")
		if lf.MY.Top*lf.MY.Bottom >= 0 {
			t.Errorf("%s: A2/L2 about y: top %g, bottom %g, want double curvature", analysis, lf.MY.Top, lf.MY.Bottom)
		}
	}
}

func TestOmitOnEdgeIsRefused(t *testing.T) {
	in := contractBuilding()
	in.Building.Omit = []string{"A1"}
	if _, err := Derive(in, panel); err == nil || !strings.Contains(err.Error(), "contract.yaml") {
		t.Errorf("omitting an edge point: %v", err)
	}
}

// Where the two analyses model the same thing they agree: in a symmetric one-bay, one-storey
// building with a fixed base, the far end of each beam turns as much as the near end the other
// way, so the whole frame behaves as the subframe with beams at half stiffness and the base
// taking the carry-over (slope-deflection equations, common practice, no source).
func TestFrameAgreesWithSubframe(t *testing.T) {
	mk := func(analysis string) *Derived {
		in := contractBuilding()
		b := in.Building
		b.Storeys = b.Storeys[:1]
		b.GridX, b.GridY = []float64{6600}, []float64{5400}
		b.Floors = []model.Floor{{Levels: []string{"L1"}, Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanTwoWay}}
		b.Analysis = analysis
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		return d
	}
	sub, frm := mk(model.AnalysisSubframe), mk(model.AnalysisFrame)
	for k := range sub.Lifts {
		a, b := sub.Lifts[k], frm.Lifts[k]
		for _, c := range [][2]float64{{a.MY.Top, b.MY.Top}, {a.MY.Bottom, b.MY.Bottom}, {a.MZ.Top, b.MZ.Top}, {a.MZ.Bottom, b.MZ.Bottom}} {
			if math.Abs(c[0]-c[1]) > 1e-9*math.Max(math.Abs(c[0]), 1) {
				t.Errorf("%s: subframe %.9g, frame %.9g", a.Column, c[0], c[1])
			}
		}
		if a.MY.Top == 0 || a.MZ.Top == 0 {
			t.Errorf("%s: no moment", a.Column)
		}
	}
}

// Effective lengths from the frame by EN 1992-1-1:2004 Eq. (5.15) lie between half the clear
// height and the clear height, and the lowest lift of a fixed base is the shortest relative to
// its height (k = 0.1 at the base, 5.8.3.2(3) note).
func TestEffectiveLengthsFromFrame(t *testing.T) {
	in := contractBuilding()
	in.Building.Options.L0FromFrame = true
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	for _, lf := range d.Lifts {
		for k, q := range lf.Src.L0 {
			if q.From == "" {
				t.Fatalf("%s/%s: no effective length about axis %d", lf.Column, lf.Name, k)
			}
			clear := lf.Height - 500 // the beams are 500 mm deep
			if q.V < 0.5*clear-1e-9 || q.V > clear+1e-9 {
				t.Errorf("%s/%s: l0 = %g outside [%g, %g]", lf.Column, lf.Name, q.V, 0.5*clear, clear)
			}
		}
		for _, s := range lf.Steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
		}
	}
	// By hand for B2, lift L2, about y: columns 350 × 450 (I = 350·450³/12 about y), beams
	// 275 × 500 of 6.6 m either side, cracked at 0.5 and in single curvature (2EI/l); clear
	// heights: L1 3.3 m, L2 and R 2.8 m. The top joint joins L2 and R, the bottom one L1 and L2.
	lf := lift(t, d, "B2", "L2")
	ic := 350 * math.Pow(450, 3) / 12
	ib := 275 * math.Pow(500, 3) / 12
	sb := 2 * 0.5 * 2 * ib / 6600
	kTop := (ic/2800 + ic/2800) / sb
	kBot := (ic/3300 + ic/2800) / sb
	want := 0.5 * 2800 * math.Sqrt((1+kTop/(0.45+kTop))*(1+kBot/(0.45+kBot)))
	near(t, "l0,y of B2/L2", lf.Src.L0[0].V, want, 1e-9)
}

// The load on each beam is traced from the input: F_G = g_k·A_slab + ρ·b·h·L, the slab area by
// tributary widths (common practice, no source). Beam A1–B1 of the contract building at L1 spans
// 6.6 m along x on line 1; the slab spans y, so half of the 7.8 m bay drains to it.
func TestBeamLoadTraced(t *testing.T) {
	d, err := Derive(contractBuilding(), panel)
	if err != nil {
		t.Fatal(err)
	}
	l := lift(t, d, "A1", "L1")
	near(t, "g_k", stepValue(t, l, "td/L1/g_k"), 5.8e-3, 1e-12)
	near(t, "q_k", stepValue(t, l, "td/L1/q_k"), 2.5e-3, 1e-12)
	area := 6600.0 * 7800 / 2
	near(t, "A_slab", stepValue(t, l, "td/L1/A1–B1/A_slab"), area, 1e-12)
	gBeam := 25e-6 * 275 * 500 * 6600
	near(t, "G_beam", stepValue(t, l, "td/L1/A1–B1/G_beam"), gBeam, 1e-12)
	near(t, "F_G", stepValue(t, l, "td/L1/A1–B1/F_G"), 5.8e-3*area+gBeam, 1e-12)
	near(t, "F_QB", stepValue(t, l, "td/L1/A1–B1/F_QB"), 2.5e-3*area, 1e-12)
	for _, s := range l.Steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
}

// Every value the take-down takes from the input is an input step that the steps using it name,
// so that a revision compare sees a changed façade load or beam size (the trace contract of
// ../shared/DESIGN.md). The façade and the imposed line load are invented test input; the totals
// are statics, w·L (common practice).
func TestTakeDownInputsTraced(t *testing.T) {
	in := contractBuilding()
	in.Building.Lines = []model.LineLoad{
		{Levels: []string{"L1", "L2"}, GridLine: "A", Gk: 9.5},
		{Levels: []string{"L1"}, GridLine: "1", From: "A", To: "B", Qk: 3, Category: "B"},
	}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	l := lift(t, d, "A1", "L1")
	byID := map[string]trace.Step{}
	for _, s := range l.Steps {
		byID[s.ID] = s
	}
	for _, tc := range []struct {
		id    string
		value float64
	}{
		{"td/L1/A1–A2/g_line1", 9.5},
		{"td/L1/A1–B1/q_lineB_2", 3},
		{"td/L1/A1–A2/L", 7800},
		{"td/L1/A1–B1/L", 6600},
		{"td/L1/A1–B1/b", 275},
		{"td/L1/A1–B1/h", 500},
	} {
		s, ok := byID[tc.id]
		if !ok || s.Kind != trace.KindInput || s.Clause != "input" || !trace.Given(s) {
			t.Errorf("%s: %+v, want an input step from the input file", tc.id, s)
			continue
		}
		near(t, tc.id, s.Value, tc.value, 1e-12)
	}
	near(t, "G_line", stepValue(t, l, "td/L1/A1–A2/G_line"), 9.5*7800, 1e-12)
	near(t, "Q_lineB", stepValue(t, l, "td/L1/A1–B1/Q_lineB"), 3*6600, 1e-12)
	// The steps that use them name them; no intensity or beam size enters as a bare number.
	uses := map[string][]string{
		"td/L1/A1–A2/G_line":  {"w_1"},
		"td/L1/A1–B1/Q_lineB": {"w_1"},
		"td/L1/A1–B1/G_beam":  {"b", "h", "L"},
	}
	for id, names := range uses {
		s := byID[id]
		for _, name := range names {
			found := false
			for _, a := range s.Args {
				if a.Name == name {
					found = true
					if src, ok := byID[a.From]; !ok || !trace.Given(src) || src.Value != a.Value {
						t.Errorf("%s: argument %s comes from %q, not from an input step", id, name, a.From)
					}
				}
			}
			if !found {
				t.Errorf("%s: no argument %s", id, name)
			}
		}
	}
	for _, s := range l.Steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		if !trace.ClauseForm(s.Clause) {
			t.Errorf("%s: clause %q", s.ID, s.Clause)
		}
	}
	// The lift above the façade's levels carries none of it.
	for _, s := range lift(t, d, "A1", "R").Steps {
		if strings.Contains(s.ID, "line") {
			t.Errorf("roof lift holds %s", s.ID)
		}
	}
}

// A floor entry without levels gives every level (the input form documents a missing levels
// list as all of them): the take-down by hand, tributary area × area load + beams + column
// self-weight with 1.35 and 1.5 (EN 1990:2002 Eq. (6.10), Table A1.2(B)), as TestTakeDownByHand.
func TestFloorWithoutLevelsGivesAllLevels(t *testing.T) {
	in := contractBuilding()
	in.Building.Floors = []model.Floor{{Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanY}}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	const rho = 25e-6
	beam := rho * 275 * 500
	colW := rho * 350 * 450
	a := (6600 + 6600) / 2.0 * (7800 + 5700) / 2
	g := 3*(5.8e-3*a+beam*(6600+(7800+5700)/2)) + colW*(3800+3300+3300)
	// Three levels of category B: the leading imposed load is the sum, no αn (imposed_reduction: none).
	want := 1.35*g + 1.5*3*2.5e-3*a
	near(t, "B2 NEd at L1", lift(t, d, "B2", "L1").NEd, want, 1e-9)
}
