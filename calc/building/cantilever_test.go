package building

import (
	"strings"
	"testing"

	"colsheet/calc/model"
)

// A cantilever slab of length l_c beyond an edge beam carries the floor's loads: a line load
// w·l_c on the beam, and a moment w·l_c²/2 per unit length that the beam carries in torsion to
// its end columns by the lever rule (statics, hand calculation). Contract building, g_k =
// 5.8 kN/m², q_k = 2.5 kN/m² at L1; l_c = 1.5 m beyond line A (beams of 7.8 m and 5.7 m) and
// 2.0 m beyond line 3 from B to D (beams of 6.6 m and 4.8 m).
func TestCantileverByHand(t *testing.T) {
	in := contractBuilding()
	in.Building.Cantilevers = []model.Cantilever{
		{GridLine: "A", Length: 1500},
		{Levels: []string{"L1"}, GridLine: "3", From: "B", To: "D", Length: 2000},
	}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	base, err := Derive(contractBuilding(), panel)
	if err != nil {
		t.Fatal(err)
	}
	const gk, qk = 5.8e-3, 2.5e-3
	cases := []struct {
		col        string
		dir        Dir
		clockwise  float64
		lc, length float64 // the cantilever's length and the length of edge whose moment reaches the column, mm
	}{
		{"A2", DirX, 1, 1500, (7800 + 5700) / 2},
		{"A1", DirX, 1, 1500, 7800 / 2},
		{"C3", DirY, -1, 2000, (6600 + 4800) / 2},
		{"B3", DirY, -1, 2000, 6600 / 2},
	}
	for _, c := range cases {
		l := lift(t, d, c.col, "L1")
		e := l.Cantilever[c.dir]
		near(t, c.col+" M_cant,G", e.G.V, gk*c.lc*c.lc/2*c.length, 1e-12)
		near(t, c.col+" M_cant,Q", e.Q["B"].V, qk*c.lc*c.lc/2*c.length, 1e-12)
		if e.Clockwise != c.clockwise {
			t.Errorf("%s: clockwise %g, want %g", c.col, e.Clockwise, c.clockwise)
		}
		if other := l.Cantilever[1-c.dir]; other.G.From != "" {
			t.Errorf("%s: a cantilever moment in the other direction", c.col)
		}
		s := stepOf(t, l, e.G.From)
		if !strings.Contains(s.Notes()[0], "inner face") {
			t.Errorf("%s: the step does not say which face: %v", c.col, s.Notes())
		}
		// The vertical load: w·l_c over the edge's length that reaches the column.
		near(t, c.col+" ΔG", stepValue(t, l, "td/L1/G")-stepValue(t, lift(t, base, c.col, "L1"), "td/L1/G"), gk*c.lc*c.length, 1e-9)
	}
	// L2 has the cantilever beyond line A only.
	if e := lift(t, d, "C3", "L2").Cantilever[DirY]; e.G.From != "" {
		t.Error("C3/L2 carries the cantilever of L1")
	}
	if e := lift(t, d, "D2", "L1").Cantilever; e[0].G.From != "" || e[1].G.From != "" {
		t.Error("D2 carries a cantilever moment")
	}
	recheckAll(t, d)
	// A line inside the grid is no edge.
	in = contractBuilding()
	in.Building.Cantilevers = []model.Cantilever{{GridLine: "B", Length: 1000, Line: 12}}
	if _, err := Derive(in, panel); err == nil || !strings.Contains(err.Error(), "contract.yaml:12") {
		t.Errorf("cantilever on an inner line: %v", err)
	}
}

// Where a floor gives the slab thickness t, a beam's self-weight counts its downstand only:
// ρ·b·(h − t)·L with ρ = 25 kN/m³ (EN 1991-1-1:2002 Annex A, Table A.1), by hand for beam A1–B1
// (275 × 500, 6.6 m) under a 200 mm slab at L1; L2, without t, keeps the whole depth.
func TestSlabThicknessDownstand(t *testing.T) {
	in := contractBuilding()
	in.Building.Floors = []model.Floor{
		{Levels: []string{"L1"}, Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanY, Thickness: 200},
		{Levels: []string{"L2"}, Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanY},
		{Levels: []string{"R"}, Gk: 3.9e-3, Qk: 0.6e-3, Category: "H", Spans: model.SpanY},
	}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	l1, l2 := lift(t, d, "A1", "L1"), lift(t, d, "A1", "L2")
	s := stepOf(t, l1, "td/L1/A1–B1/G_beam")
	near(t, "G_beam L1", s.Value, 25e-6*275*(500-200)*6600, 1e-12)
	if !strings.Contains(s.Title, "downstand") || len(s.Notes()) == 0 {
		t.Errorf("the step does not say it counts the downstand: %q %v", s.Title, s.Notes())
	}
	near(t, "t", stepValue(t, l1, "td/L1/t"), 200, 0)
	near(t, "G_beam L2", stepValue(t, l2, "td/L2/A1–B1/G_beam"), 25e-6*275*500*6600, 1e-12)
	// The beam's load pieces, which the column moments take, carry the downstand too.
	for k, bm := range d.Levels[0].Beams {
		f, _ := resultant(d.Levels[0].Loads[k].G, nil, bm.L)
		slab := 0.0
		for _, p := range d.Levels[0].Loads[k].Slab {
			slab += p.Total()
		}
		near(t, bm.Name()+" pieces", f, 5.8e-3*slab+25e-6*bm.Size.B*(bm.Size.H-200)*bm.L, 1e-12)
	}
	recheckAll(t, d)
}

// A zone's imposed load keeps its own category: ψ0 and ψ2 of category C (congregation areas)
// beside the floor's category B, EN 1990:2002 Table A1.1 recommended values (from memory:
// B ψ0 = 0.7, ψ2 = 0.3; C ψ0 = 0.7, ψ2 = 0.6); NEd by Eq. (6.10) with each leading in turn,
// γG = 1.35, γQ = 1.5 (Table A1.2(B)); and αA of EN 1991-1-1:2002 6.3.1.2(10), Eq. (6.1), over the
// zone's own area that drains to the column. One storey, one bay 12 × 12 m spanning y; the
// zone covers the south half, [0, 12] × [0, 6] m: the south beam takes 6·(1 − 3/12) = 4.5 m per
// metre, so column A1 gets 4.5·12/2 = 27 m² of it and A2, from the north beam's 1.5 m, 9 m².
func TestZoneCategory(t *testing.T) {
	in := contractBuilding()
	b := in.Building
	b.Storeys = b.Storeys[:1]
	b.GridX, b.GridY = []float64{12000}, []float64{12000}
	b.Floors = []model.Floor{{Gk: 5e-3, Qk: 3e-3, Category: "B", Spans: model.SpanY}}
	b.AreaLoads = []model.AreaLoad{{X: [2]float64{0, 12000}, Y: [2]float64{0, 6000}, Qk: 4e-3, Category: "C"}}
	b.Options.Reduction = model.ReduceArea
	b.Options.Creep = &model.Creep{RH: 50, T0: 28, Cement: "N"}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	recheckAll(t, d)
	for _, c := range []struct {
		col    string
		zoneA  float64 // mm², by hand
		alphaC float64 // EN 1991-1-1 Eq. (6.1), at least 0.6 for C, at most 1
	}{
		{"A1", 27e6, 5.0/7*0.7 + 10.0/27},
		{"A2", 9e6, 1},
	} {
		l := lift(t, d, c.col, "L1")
		near(t, c.col+" A_C", stepValue(t, l, "td/L1/A_C"), c.zoneA, 1e-12)
		near(t, c.col+" alpha_A,C", stepValue(t, l, "td/L1/alpha_A_C"), c.alphaC, 1e-12)
		// The floor's category B keeps the floor's area, 36 m² a corner: αA = 5/7·0.7 + 10/36.
		near(t, c.col+" alpha_A,B", stepValue(t, l, "td/L1/alpha_A_B"), 5.0/7*0.7+10.0/36, 1e-12)
		near(t, c.col+" psi0_C", stepValue(t, l, "td/NEd/psi0_C"), 0.7, 0)
		near(t, c.col+" psi2_C", stepValue(t, l, "qp/psi2_C"), 0.6, 0)
		near(t, c.col+" psi2_B", stepValue(t, l, "qp/psi2_B"), 0.3, 0)
		g := stepValue(t, l, "td/G_cum")
		qb, qc := stepValue(t, l, "td/Q_cum_B"), stepValue(t, l, "td/Q_cum_C")
		near(t, c.col+" Q_C reduced", qc, c.alphaC*4e-3*c.zoneA, 1e-12)
		want := 1.35*g + 1.5*max(qb, qc) + 1.5*0.7*min(qb, qc)
		near(t, c.col+" NEd", l.NEd, want, 1e-12)
		near(t, c.col+" N_qp", stepValue(t, l, "qp/N"), g+0.3*qb+0.6*qc, 1e-12)
	}
}

// αn counts the storeys whose imposed load of the category the column carries, zones included:
// a zone of category C at every level of the contract building reaching column B2 gives n = 3 at
// the foot of L1, αn = (2 + (n − 2)·ψ0)/n = (2 + 0.7)/3 (EN 1991-1-1:2002 6.3.1.2(11), Eq. (6.2);
// ψ0 = 0.7, EN 1990:2002 Table A1.1, from memory); one level fewer gives n = 2, no reduction.
func TestZoneStoreys(t *testing.T) {
	for _, c := range []struct {
		levels []string
		n      float64
	}{{nil, 3}, {[]string{"L1", "L2"}, 2}} {
		in := contractBuilding()
		in.Building.Options.Reduction = model.ReduceStoreys
		in.Building.AreaLoads = []model.AreaLoad{{Levels: c.levels, X: [2]float64{5000, 8000}, Y: [2]float64{6000, 9000}, Qk: 4e-3, Category: "C"}}
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		l := lift(t, d, "B2", "L1")
		near(t, "n_C", stepValue(t, l, "td/n_C"), c.n, 0)
		want := 1.0
		if c.n > 2 {
			want = (2 + (c.n-2)*0.7) / c.n
		}
		near(t, "alpha_n,C", stepValue(t, l, "td/alpha_n_C"), want, 1e-12)
		// Category B: the floors of L1 and L2.
		near(t, "n_B", stepValue(t, l, "td/n_B"), 2, 0)
		recheckAll(t, d)
	}
}
