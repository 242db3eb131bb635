package building

import (
	"testing"

	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// levelG returns, by column, the permanent load delivered at a level.
func levelG(t *testing.T, d *Derived, level string) map[string]float64 {
	t.Helper()
	out := map[string]float64{}
	for _, l := range d.Lifts {
		if l.Name == level {
			out[l.Column] = stepValue(t, l, "td/"+level+"/G")
		}
	}
	return out
}

// A point load reaches the columns by the lever rule (common practice, statics, hand
// calculation): inside a bay, across the span onto the beams it spans onto and along each beam to
// its ends, which gives the corner columns (1 − ξ)(1 − η), ξ(1 − η), (1 − ξ)η and ξη of it for
// every span direction (two way: half each way); on a grid line, along that line's beam; on a
// grid point, all to the column there.
func TestPointLoadLeverRule(t *testing.T) {
	const pIn, pLine, pGrid = 40e3, 30e3, 12e3 // N, test input
	for _, spans := range []string{model.SpanX, model.SpanY, model.SpanTwoWay} {
		mk := func(points []model.PointLoad) *Derived {
			in := contractBuilding()
			for k := range in.Building.Floors {
				in.Building.Floors[k].Spans = spans
			}
			in.Building.PointLoads = points
			d, err := Derive(in, panel)
			if err != nil {
				t.Fatal(err)
			}
			return d
		}
		base := levelG(t, mk(nil), "L1")
		d := mk([]model.PointLoad{
			{Levels: []string{"L1"}, X: 2500, Y: 5200, Gk: pIn},
			{Levels: []string{"L1"}, X: 9100, Y: 7800, Gk: pLine},
			{Levels: []string{"L1"}, X: 13200, Y: 13500, Gk: pGrid},
		})
		got := levelG(t, d, "L1")
		xi, eta := 2500/6600.0, 5200/7800.0
		want := map[string]float64{
			"A1": pIn * (1 - xi) * (1 - eta), "B1": pIn * xi * (1 - eta), "A2": pIn * (1 - xi) * eta,
			"B2": pIn*xi*eta + pLine*(13200-9100)/6600, "C2": pLine * (9100 - 6600) / 6600,
			"C3": pGrid,
		}
		for col, g := range got {
			near(t, spans+" ΔG "+col, g-base[col]+1, want[col]+1, 1e-9)
		}
		// The share on each beam, by the lever rule across the span.
		a1 := lift(t, d, "A1", "L1")
		switch spans {
		case model.SpanY:
			near(t, "south beam share", stepValue(t, a1, "td/L1/A1–B1/point1/G"), pIn*(1-eta), 1e-12)
		case model.SpanX:
			near(t, "west beam share", stepValue(t, a1, "td/L1/A1–A2/point1/G"), pIn*(1-xi), 1e-12)
		default:
			near(t, "south beam share", stepValue(t, a1, "td/L1/A1–B1/point1/G"), pIn/2*(1-eta), 1e-12)
			near(t, "west beam share", stepValue(t, a1, "td/L1/A1–A2/point1/G"), pIn/2*(1-xi), 1e-12)
		}
		recheckAll(t, d)
	}
}

// The fixed-end moments of a point load P at a from the start of a span L are −P·a·b²/L² and
// +P·a²·b/L² (handbook formula): a 60 kN load at 2 m on 6 m, 53.333 kNm and 26.667 kNm; the
// traced step gives the same.
func TestPointFixedEnd(t *testing.T) {
	ps := []Point{{X: 2000, P: 60e3}}
	m0, m1 := PointFixedEnd(6000, ps)
	near(t, "M_start", m0, -60e3*2000*4000*4000/36e6, 1e-12)
	near(t, "M_end", m1, 60e3*2000*2000*4000/36e6, 1e-12)
	near(t, "M_start kNm", -m0/1e6, 53.3333333333, 1e-9)
	l := trace.Const(6000, "L", "mm")
	s0 := PointFEMStep("fem0", "Fixed-end moment at the start", frame.AtStart, l, ps)
	s1 := PointFEMStep("fem1", "Fixed-end moment at the end", frame.AtEnd, l, ps)
	near(t, "step start", s0.Value, m0, 1e-12)
	near(t, "step end", s1.Value, m1, 1e-12)
	recheckSteps(t, s0, s1)
}

// recheckSteps rechecks each step to 1e-9.
func recheckSteps(t *testing.T, ss ...trace.Step) {
	t.Helper()
	for _, s := range ss {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
}

// A point load keeps its own category: ψ0 = 1.0 for category E (storage), EN 1990:2002 Table
// A1.1 (from memory), and no reduction for the loaded area where a category reaches the column
// by point loads only (αA of EN 1991-1-1:2002 6.3.1.2(10) needs a loaded area: none, so 1,
// conservative); the floor's category B keeps its αA over the 36 m² that drains to a corner of
// a bay 12 × 12 m, 5/7·0.7 + 10/36 (Eq. (6.1)).
func TestPointCategory(t *testing.T) {
	in := contractBuilding()
	b := in.Building
	b.Storeys = b.Storeys[:1]
	b.GridX, b.GridY = []float64{12000}, []float64{12000}
	b.Floors = []model.Floor{{Gk: 5e-3, Qk: 3e-3, Category: "B", Spans: model.SpanTwoWay}}
	b.PointLoads = []model.PointLoad{{X: 3000, Y: 4000, Gk: 20e3, Qk: 50e3, Category: "E"}}
	b.Options.Reduction = model.ReduceArea
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	recheckAll(t, d)
	l := lift(t, d, "A1", "L1")
	near(t, "alpha_A,E", stepValue(t, l, "td/L1/alpha_A_E"), 1, 0)
	near(t, "alpha_A,B", stepValue(t, l, "td/L1/alpha_A_B"), 5.0/7*0.7+10.0/36, 1e-12)
	near(t, "psi0_E", stepValue(t, l, "td/NEd/psi0_E"), 1.0, 0)
	// The corner's share of the point, (1 − ξ)(1 − η) with ξ = 3/12, η = 4/12 (lever rule).
	near(t, "Q_E at A1", stepValue(t, l, "td/Q_cum_E"), 50e3*(1-0.25)*(1-1.0/3), 1e-12)
}
