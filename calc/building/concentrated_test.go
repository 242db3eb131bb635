package building

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// beamFactors of the contract building's subframe (common practice, no source): I of the
// 275 × 500 beams and the 350 × 450 columns bending about y; beams at half stiffness; E cancels
// (one concrete class).
var (
	iBeam  = 275 * math.Pow(500, 3) / 12
	iColY  = 350 * math.Pow(450, 3) / 12
	kBeamR = 0.5 * 4 * iBeam / 6600 // beam of 6.6 m at half stiffness
	kColR  = 4 * iColY / 3300       // the column below the roof, 3.3 m, far end fixed
)

// A point load on a beam adds the fixed-end moments of the handbook formulas, −P·a·b²/L² at the
// beam's start and +P·a²·b/L² at its end (clockwise positive), to the subframe's joint, factored
// as its span (loaded γG·Gk + γQ·Qk, EN 1990:2002 Table A1.2(B), γG = 1.35, γQ = 1.5), and the
// unbalanced moment is shared by stiffness, M = −M_unb·k_c/Σk (common practice; a hand
// calculation). The load stands on grid line 2 at the roof, 2.0 m from A: beam A2–B2 (6.6 m)
// carries it whole; slabs span y, so beam A2–B2 carries w = (7.8 + 5.7)/2 m of slab.
func TestPointLoadSubframeByHand(t *testing.T) {
	const pg, pq = 40e3, 30e3 // N, test input
	const a, L = 2000.0, 6600.0
	b := L - a
	in := contractBuilding()
	in.Building.PointLoads = []model.PointLoad{{Levels: []string{"R"}, X: a, Y: 7800, Gk: pg, Qk: pq}}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	p := 1.35*pg + 1.5*pq // the loaded span's factors, roof category H (ψ0 not used by Eq. (6.10))
	w := (7800 + 5700) / 2.0
	gk := 3.9e-3*w + 25e-6*275*500
	qk := 0.6e-3 * w
	// Edge column A2: the one beam, loaded, starts at the joint.
	a2 := lift(t, d, "A2", "R")
	near(t, "A2 FEM of the point load", stepValue(t, a2, "subx/R/A2–B2/FEM_loaded/point1"), -p*a*b*b/(L*L), 1e-12)
	femA := -(1.35*gk+1.5*qk)*L*L/12 - p*a*b*b/(L*L)
	near(t, "A2 FEM", stepValue(t, a2, "subx/R/A2–B2/FEM_loaded"), femA, 1e-12)
	near(t, "A2 M top about y", a2.MY.Top, -femA*kColR/(kColR+kBeamR), 1e-9)
	// Inner column B2: the beam on the left loaded with the point load, the one on the right
	// light (γG·Gk), the arrangement with the larger unbalanced moment by far.
	b2 := lift(t, d, "B2", "R")
	near(t, "B2 FEM of the point load", stepValue(t, b2, "subx/R/A2–B2/FEM_loaded/point1"), p*a*a*b/(L*L), 1e-12)
	unb := 1.5*qk*L*L/12 + p*a*a*b/(L*L)
	near(t, "B2 unbalanced", stepValue(t, b2, "subx/R/unbalanced"), unb, 1e-12)
	near(t, "B2 M top about y", b2.MY.Top, -unb*kColR/(kColR+2*kBeamR), 1e-9)
	s := stepOf(t, b2, "subx/R/A2–B2/FEM_loaded/point1")
	if !strings.Contains(s.Title, "point load 1") {
		t.Errorf("the step does not name its source: %q", s.Title)
	}
	recheckAll(t, d)
}

// A point load on a column's own grid point stands at a beam's end, a = 0 or b = 0, where both
// handbook fixed-end moments vanish: no column moment changes (common practice, no source).
func TestPointLoadOnColumnChangesNoMoment(t *testing.T) {
	for _, analysis := range []string{model.AnalysisSubframe, model.AnalysisFrame} {
		in := contractBuilding()
		in.Building.Analysis = analysis
		ref, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		in = contractBuilding()
		in.Building.Analysis = analysis
		in.Building.PointLoads = []model.PointLoad{{X: 6600, Y: 7800, Gk: 50e3, Qk: 20e3}}
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		sameEnds(t, analysis+", with the load / without", d, ref)
		recheckAll(t, d)
	}
}

// Cantilever slabs beyond line A act on the roof joint of A2 as a beam on its left whose end
// moment is +M (clockwise): M_G = g_k·l_c²/2 times the edge length that reaches A2, (7.8 +
// 5.7)/2 m (statics, as TestCantileverByHand). The subframe takes the arrangement of EN
// 1992-1-1:2004 5.1.3 with the larger unbalanced moment, the cantilever loaded and the beam
// light or the other way round, and shares it between the column (4EI/L) and the beam (half
// stiffness); the cantilever has no stiffness (common practice; a hand calculation). A short
// cantilever leaves the beam governing, a long one turns the joint the other way.
func TestCantileverSharedAtJoint(t *testing.T) {
	const L = 6600.0
	w := (7800 + 5700) / 2.0
	gk := 3.9e-3*w + 25e-6*275*500 // beam A2–B2 at the roof
	qk := 0.6e-3 * w
	for _, c := range []struct {
		lc         float64
		cantLoaded bool // the arrangement that governs, by the hand calculation below
	}{{1500, false}, {3000, true}} {
		in := contractBuilding()
		in.Building.Cantilevers = []model.Cantilever{{Levels: []string{"R"}, GridLine: "A", Length: c.lc}}
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		mg := 3.9e-3 * c.lc * c.lc / 2 * w
		mq := 0.6e-3 * c.lc * c.lc / 2 * w
		fb := -(1.35*gk + 1.5*qk) * L * L / 12 // beam loaded, at its start
		fbl := -1.35 * gk * L * L / 12         // beam light
		unbCant := 1.35*mg + 1.5*mq + fbl
		unbBeam := 1.35*mg + fb
		unb := unbBeam
		if math.Abs(unbCant) > math.Abs(unbBeam) {
			unb = unbCant
		}
		if (unb == unbCant) != c.cantLoaded {
			t.Fatalf("l_c %g: the hand calculation does not give the expected arrangement", c.lc)
		}
		a2 := lift(t, d, "A2", "R")
		near(t, "M_cant,G", a2.Cantilever[DirX].G.V, mg, 1e-12)
		near(t, "unbalanced", stepValue(t, a2, "subx/R/unbalanced"), unb, 1e-12)
		near(t, "A2 M top about y", a2.MY.Top, -unb*kColR/(kColR+kBeamR), 1e-9)
		id := "subx/R/cant/M_light"
		if c.cantLoaded {
			id = "subx/R/cant/M_loaded"
		}
		if !hasStep(a2, id) {
			t.Errorf("l_c %g: no step %s", c.lc, id)
		}
		// The axial force of the arrangement leaves off the beam's imposed load where the beam is light.
		if c.cantLoaded != (a2.Src.NArr[DirX].V < a2.Src.NEd.V) {
			t.Errorf("l_c %g: N of the arrangement %g, NEd %g", c.lc, a2.Src.NArr[DirX].V, a2.Src.NEd.V)
		}
		recheckAll(t, d)
	}
}

// A column that stops on a beam (B2 of the contract building, absent over lift L1) loads the
// beam A2–C2 (13.2 m) with half its load at the foot of its lift L2 at mid-span, a = b = 6.6 m:
// the fixed-end moment at A2 is −P·a·b²/L² (handbook formula), with P factored γG·Gk + γQ·Qk on
// loaded and lightly loaded spans alike (EN 1990:2002 Table A1.2(B); the conservative choice).
func TestTransferFixedEnd(t *testing.T) {
	in := contractBuilding()
	in.Building.OmitAt = []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1"}}}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	src := lift(t, d, "B2", "L2")
	p := 1.35 * stepValue(t, src, "td/G_cum")
	for _, s := range src.Steps {
		if strings.HasPrefix(s.ID, "td/Q_cum_") {
			p += 1.5 * s.Value
		}
	}
	p *= 0.5
	const a, L = 6600.0, 13200.0
	a2 := lift(t, d, "A2", "L1")
	st := stepOf(t, a2, "subx/L1/A2–C2/FEM_loaded/xfer/B2")
	near(t, "FEM of the transfer at A2", st.Value, -p*a*(L-a)*(L-a)/(L*L), 1e-12)
	if !strings.Contains(st.Title, "column B2 stopping on this beam") || !strings.Contains(strings.Join(st.Notes(), " "), "conservative") {
		t.Errorf("the step does not name its source or its factors: %q %v", st.Title, st.Notes())
	}
	// C2, between the two beams A2–C2 and C2–D2: the transfer is on the left beam, the same
	// whether that beam is loaded or light.
	c2 := lift(t, d, "C2", "L1")
	for _, id := range []string{"subx/L1/A2–C2/FEM_loaded/xfer/B2", "subx/L1/A2–C2/FEM_light/xfer/B2"} {
		if hasStep(c2, id) {
			near(t, id, stepValue(t, c2, id), p*a*a*(L-a)/(L*L), 1e-12)
		}
	}
	if !hasStep(c2, "subx/L1/alt/A2–C2/FEM_loaded/xfer/B2") && !hasStep(c2, "subx/L1/alt/A2–C2/FEM_light/xfer/B2") {
		t.Error("C2: no transfer in the other arrangement")
	}
	recheckAll(t, d)
}

// Where the two analyses model the same thing they agree (as TestFrameAgreesWithSubframe): one
// bay, one storey, fixed base, no imposed load (so no arrangement), each beam with two equal
// point loads at a and L − a and cantilever slabs beyond all four edges: the frame is
// symmetric, the far end of each beam turns as much as the near end the other way, and the
// frame is the subframe with beams at half stiffness (slope-deflection equations, common
// practice, no source); analysis: both, the larger of the two, gives the same.
func TestFrameAgreesWithSubframeConcentrated(t *testing.T) {
	mk := func(analysis string) *Derived {
		in := contractBuilding()
		b := in.Building
		b.Storeys = b.Storeys[:1]
		b.GridX, b.GridY = []float64{6600}, []float64{5400}
		b.Floors = []model.Floor{{Levels: []string{"L1"}, Gk: 5.8e-3, Category: "B", Spans: model.SpanTwoWay}}
		b.Analysis = analysis
		for _, y := range []float64{0, 5400} {
			b.PointLoads = append(b.PointLoads, model.PointLoad{X: 1500, Y: y, Gk: 30e3}, model.PointLoad{X: 5100, Y: y, Gk: 30e3})
		}
		for _, x := range []float64{0, 6600} {
			b.PointLoads = append(b.PointLoads, model.PointLoad{X: x, Y: 2000, Gk: 20e3}, model.PointLoad{X: x, Y: 3400, Gk: 20e3})
		}
		for _, line := range []string{"A", "B", "1", "2"} {
			b.Cantilevers = append(b.Cantilevers, model.Cantilever{GridLine: line, Length: 1200})
		}
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		recheckAll(t, d)
		return d
	}
	sub, frm := mk(model.AnalysisSubframe), mk(model.AnalysisFrame)
	sameEnds(t, "subframe / frame", sub, frm)
	sameEnds(t, "both / subframe", mk(model.AnalysisBoth), sub)
	for _, a := range sub.Lifts {
		if a.MY.Top == 0 || a.MZ.Top == 0 || a.Cantilever[DirX].Clockwise == 0 || !(hasStep(a, "subx/L1/cant/M_loaded") || hasStep(a, "subx/L1/cant/M_light")) {
			t.Errorf("%s: no moment, or no cantilever", a.Column)
		}
	}
}

// sameEnds checks that two derivations of the same building give every lift the same end
// moments, within 1e-9 relative (numerical noise).
func sameEnds(t *testing.T, what string, got, want *Derived) {
	t.Helper()
	if len(got.Lifts) != len(want.Lifts) {
		t.Fatalf("%s: %d lifts, want %d", what, len(got.Lifts), len(want.Lifts))
	}
	ends := func(l Lift) [4]float64 { return [4]float64{l.MY.Top, l.MY.Bottom, l.MZ.Top, l.MZ.Bottom} }
	for k, lf := range got.Lifts {
		g, w := ends(lf), ends(want.Lifts[k])
		for e := range g {
			if math.Abs(g[e]-w[e]) > 1e-9*math.Max(math.Abs(w[e]), 1) {
				t.Errorf("%s: %s/%s end %d: %.9g, want %.9g", what, lf.Column, lf.Name, e, g[e], w[e])
			}
		}
	}
}
