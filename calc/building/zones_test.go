package building

import (
	"math"
	"testing"

	"colsheet/calc/frame"
	"colsheet/calc/model"
)

// featureBuilding is the contract building with a fourth bay, zoned area loads, point loads
// (inside bays, on a grid line, on a grid point), cantilever slabs on two edges and a column
// stopping on the beams of L1; invented numbers, test input only.
func featureBuilding(spans string) *model.Input {
	in := contractBuilding()
	b := in.Building
	b.GridX = append(b.GridX, 5000)
	for k := range b.Floors {
		b.Floors[k].Spans = spans
	}
	b.Lines = []model.LineLoad{{Levels: []string{"L1", "L2"}, GridLine: "A", Gk: 8.5}}
	b.AreaLoads = []model.AreaLoad{
		// Across four bays and two grid lines, category E (storage).
		{Levels: []string{"L1"}, X: [2]float64{3000, 15000}, Y: [2]float64{2000, 10000}, Gk: 1.2e-3, Qk: 7.5e-3, Category: "E"},
		// Within one bay, the floor's category.
		{Levels: []string{"L1", "L2"}, X: [2]float64{14000, 16500}, Y: [2]float64{500, 3500}, Gk: 0.8e-3, Qk: 1.5e-3},
		// Partly beyond the grid: only the part on the floor counts.
		{Levels: []string{"R"}, X: [2]float64{20000, 25000}, Y: [2]float64{9000, 15000}, Gk: 0.5e-3, Qk: 1e-3, Category: "H"},
	}
	b.PointLoads = []model.PointLoad{
		{Levels: []string{"L1", "L2"}, X: 2500, Y: 5200, Gk: 40e3, Qk: 25e3, Category: "E"}, // inside bay A1–B2
		{Levels: []string{"L1"}, X: 9100, Y: 7800, Gk: 30e3},                                // on grid line 2
		{Levels: []string{"R"}, X: 13200, Y: 13500, Gk: 12e3, Qk: 6e3},                      // on grid point C3
		{Levels: []string{"L2"}, X: 6600, Y: 7800, Gk: 20e3, Qk: 10e3, Category: "C"},       // on B2, absent at L1 only
	}
	b.Cantilevers = []model.Cantilever{
		{Levels: []string{"L1", "L2"}, GridLine: "A", Length: 1500},
		{GridLine: "3", From: "B", To: "D", Length: 2000},
	}
	b.OmitAt = []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1"}}}
	return in
}

// overlap returns the length of [a0, a1] ∩ [b0, b1].
func overlap(a0, a1, b0, b1 float64) float64 { return math.Max(0, math.Min(a1, b1)-math.Max(a0, b0)) }

// Global equilibrium at every level (statics, common practice, no source): what the take-down
// puts on a level (the floor's slab, the beams' self-weight, line loads, zones within the grid,
// point loads, cantilever slabs and the columns that stop on its beams) equals the sum of the
// reactions the columns that stand there receive, permanent and imposed by category; and the
// cantilevers' moment per unit length w·l_c/2 over their edges equals the sum of the moments
// the edge columns receive. Each for one-way slabs both ways and two-way slabs, to 1e-9.
func TestLevelEquilibrium(t *testing.T) {
	for _, spans := range []string{model.SpanX, model.SpanY, model.SpanTwoWay} {
		in := featureBuilding(spans)
		b := in.Building
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		recheckAll(t, d)
		g := d.Grid
		lx, ly := g.X[g.NX-1], g.Y[g.NY-1]
		for m, lv := range d.Levels {
			f := lv.Floor
			wantG := f.Gk * lx * ly
			wantQ := map[string]float64{f.Category: f.Qk * lx * ly}
			wantM := [2]float64{}
			for _, bm := range lv.Beams {
				wantG += b.Options.Density * bm.Size.B * bm.Size.H * bm.L
			}
			for _, ll := range b.Lines {
				if contains(ll.Levels, lv.Name) {
					wantG += ll.Gk * ly
				}
			}
			for _, z := range b.AreaLoads {
				if !contains(z.Levels, lv.Name) {
					continue
				}
				a := overlap(z.X[0], z.X[1], 0, lx) * overlap(z.Y[0], z.Y[1], 0, ly)
				wantG += z.Gk * a
				wantQ[zoneCategory(z, f)] += z.Qk * a
			}
			for _, p := range b.PointLoads {
				if contains(p.Levels, lv.Name) {
					wantG += p.Gk
					wantQ[pointCategory(p, f)] += p.Qk
				}
			}
			for _, c := range b.Cantilevers {
				if !contains(c.Levels, lv.Name) {
					continue
				}
				length, dir := ly, DirX // line A runs along y; its torsion acts in the frames along x
				if c.GridLine == "3" {
					length, dir = g.X[3]-g.X[1], DirY
				}
				wantG += f.Gk * c.Length * length
				wantQ[f.Category] += f.Qk * c.Length * length
				wantM[dir] += f.Gk * c.Length * c.Length / 2 * length
			}
			// The columns that stop on the level's beams.
			for _, l := range d.Lifts {
				if l.Level == m+1 && !g.Stands(l.I, l.J, m) {
					wantG += stepValue(t, l, "td/G_cum")
					for c := range l.qCum {
						wantQ[c] += l.qCum[c].V
					}
				}
			}
			gotG, gotQ, gotM := 0.0, map[string]float64{}, [2]float64{}
			for _, l := range d.Lifts {
				if l.Level != m {
					continue
				}
				pre := "td/" + lv.Name + "/"
				gotG += stepValue(t, l, pre+"G")
				for _, s := range l.Steps {
					switch {
					case s.ID == pre+"xfer/G":
						gotG += s.Value
					case len(s.ID) > len(pre)+1 && s.ID[:len(pre)+1] == pre+"Q" && s.ID[len(pre)+1] != '_':
						gotQ[s.ID[len(pre)+1:]] += s.Value
					case len(s.ID) > len(pre)+6 && s.ID[:len(pre)+6] == pre+"xfer/Q":
						gotQ[s.ID[len(pre)+6:]] += s.Value
					}
				}
				for dir, e := range l.Cantilever {
					gotM[dir] += e.G.V
				}
			}
			near(t, spans+" "+lv.Name+" ΣG", gotG, wantG, 1e-9)
			for c, w := range wantQ {
				if w != 0 {
					near(t, spans+" "+lv.Name+" ΣQ "+c, gotQ[c], w, 1e-9)
				}
			}
			for c := range gotQ {
				if wantQ[c] == 0 {
					t.Errorf("%s %s: imposed load of category %s delivered, none applied", spans, lv.Name, c)
				}
			}
			for dir := range wantM {
				if wantM[dir] != 0 || gotM[dir] != 0 {
					near(t, spans+" "+lv.Name+" ΣM_cant", gotM[dir], wantM[dir], 1e-9)
				}
			}
		}
	}
}

// The panel shares of a zone add up to its area and those of a whole panel are what the slab
// gives its beams (actions.PanelLoads, common practice): one way by the lever rule across the
// span, two way by the 45° lines; by hand, a zone [2, 8] × [1, 7] m in a bay 10 × 8 m spanning y
// gives the south beam (7 − 1)·(1 − 4/8) = 3 m per metre over [2, 8] and the north beam 3 m.
func TestZonePieces(t *testing.T) {
	total := func(ps []frame.Piece) float64 {
		s := 0.0
		for _, p := range ps {
			s += p.Total()
		}
		return s
	}
	for _, spans := range []string{model.SpanX, model.SpanY, model.SpanTwoWay} {
		for _, c := range []struct{ lx, ly, x0, x1, y0, y1 float64 }{
			{10000, 8000, 2000, 8000, 1000, 7000},
			{6000, 9000, 0, 6000, 0, 9000},
			{9000, 6000, 500, 2500, 4000, 6000},
			{7000, 7000, 3000, 4000, 0, 1000},
		} {
			s, n, w, e := zonePieces(c.lx, c.ly, c.x0, c.x1, c.y0, c.y1, spans)
			got := total(s) + total(n) + total(w) + total(e)
			near(t, spans+" zone area", got, (c.x1-c.x0)*(c.y1-c.y0), 1e-12)
			if c.x0 == 0 && c.y0 == 0 && c.x1 == c.lx && c.y1 == c.ly {
				ps, pn, pw, pe := panel(c.lx, c.ly, spans)
				for k, pair := range [][2][]frame.Piece{{s, ps}, {n, pn}, {w, pw}, {e, pe}} {
					near(t, spans+" whole panel edge "+itoa(k), total(pair[0])+1, total(pair[1])+1, 1e-12)
					a0, a1 := frame.FixedEnd(10000, pair[0])
					b0, b1 := frame.FixedEnd(10000, pair[1])
					near(t, spans+" whole panel FEM "+itoa(k), a0-a1+1, b0-b1+1, 1e-9)
				}
			}
		}
	}
	s, n, _, _ := zonePieces(10000, 8000, 2000, 8000, 1000, 7000, model.SpanY)
	if len(s) != 1 || s[0] != (frame.Piece{X0: 2000, X1: 8000, W0: 3000, W1: 3000}) || len(n) != 1 || n[0].W0 != 3000 {
		t.Errorf("one way: south %v, north %v", s, n)
	}
}
