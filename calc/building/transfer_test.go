package building

import (
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// stepOf returns the step of a lift by its ID.
func stepOf(t *testing.T, l Lift, id string) trace.Step {
	t.Helper()
	for _, s := range l.Steps {
		if s.ID == id {
			return s
		}
	}
	t.Fatalf("%s/%s: no step %s", l.Column, l.Name, id)
	return trace.Step{}
}

// hasStep reports whether the lift records a step with the ID.
func hasStep(l Lift, id string) bool {
	for _, s := range l.Steps {
		if s.ID == id {
			return true
		}
	}
	return false
}

// recheckAll rechecks every step of every lift and the form of its clause.
func recheckAll(t *testing.T, d *Derived) {
	t.Helper()
	for _, l := range d.Lifts {
		for _, s := range l.Steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
			if !trace.ClauseForm(s.Clause) {
				t.Errorf("%s/%s %s: clause %q", l.Column, l.Name, s.ID, s.Clause)
			}
		}
	}
}

// A column that stops on the beams of level L1 (B2 of the contract building, absent over lift
// L1) hands the load at the foot of its lift L2 to the two beams that cross under it, half each,
// and each beam to its end columns as a simply supported beam with a point load: R = P·b/L and
// P·a/L (statics, hand calculation). Beam A2–C2 spans 13.2 m with B2 at 6.6 m; beam B1–B3 spans
// 13.5 m with B2 at 7.8 m.
func TestTransferByStatics(t *testing.T) {
	in := contractBuilding()
	in.Building.OmitAt = []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1"}}}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	for _, l := range d.Lifts {
		if l.Column == "B2" && l.Name == "L1" {
			t.Fatal("the absent lift B2/L1 is derived")
		}
	}
	src := lift(t, d, "B2", "L2")
	pg := stepValue(t, src, "td/G_cum")
	pq := stepValue(t, src, "td/Q_cum_B")
	pH := stepValue(t, src, "td/Q_cum_H")
	cases := []struct {
		col, beam string
		share     float64 // K·b/L, by hand
	}{
		{"A2", "A2–C2", 0.5 * 6600 / 13200},
		{"C2", "A2–C2", 0.5 * 6600 / 13200},
		{"B1", "B1–B3", 0.5 * (13500 - 7800) / 13500},
		{"B3", "B1–B3", 0.5 * 7800 / 13500},
	}
	sum := 0.0
	for _, c := range cases {
		l := lift(t, d, c.col, "L1")
		id := "td/L1/xfer/B2/" + c.beam + "/"
		s := stepOf(t, l, id+"G")
		near(t, c.col+" R_G", s.Value, c.share*pg, 1e-12)
		near(t, c.col+" R_QB", stepValue(t, l, id+"QB"), c.share*pq, 1e-12)
		near(t, c.col+" R_QH", stepValue(t, l, id+"QH"), c.share*pH, 1e-12)
		if !strings.Contains(s.Title, "transferred from column B2 above level L1") {
			t.Errorf("%s: title %q does not name the column it comes from", c.col, s.Title)
		}
		if len(s.Cautions()) == 0 || !strings.Contains(s.Cautions()[0], "outside colsheet's scope") {
			t.Errorf("%s: no caution on the transfer beam: %v", c.col, s.Cautions())
		}
		from := ""
		for _, a := range s.Args {
			if a.Name == "P" {
				from = a.From
			}
		}
		if from != "/B2/L2/td/G_cum" {
			t.Errorf("%s: the transferred load comes from %q, want /B2/L2/td/G_cum", c.col, from)
		}
		// The lift's cumulative load holds the transfer.
		want := stepValue(t, l, "td/L1/G") + stepValue(t, l, "td/G_col") + stepValue(t, lift(t, d, c.col, "L2"), "td/G_cum") + stepValue(t, l, "td/L1/xfer/G")
		near(t, c.col+" G_cum", stepValue(t, l, "td/G_cum"), want, 1e-12)
		sum += s.Value
	}
	near(t, "ΣR_G of the transfer", sum, pg, 1e-12)
	// The beams of L1 on line 2 and line B span across B2; the level above keeps B2 as a support.
	var spans []string
	for _, bm := range d.Levels[0].Beams {
		if bm.Name() == "A2–C2" || bm.Name() == "B1–B3" {
			spans = append(spans, bm.Name())
		}
	}
	if len(spans) != 2 {
		t.Errorf("level L1 beams across B2: %v", spans)
	}
	// The column-moment analysis finds the column's load on the beams as concentrated loads.
	for k, bm := range d.Levels[0].Beams {
		if bm.Name() != "A2–C2" {
			continue
		}
		g, q := d.Levels[0].Loads[k].Concentrated()
		if len(g) != 1 || g[0].X != 6600 || len(q["B"]) != 1 {
			t.Fatalf("A2–C2 concentrated loads: %v %v", g, q)
		}
		near(t, "P_G on A2–C2", g[0].P, pg/2, 1e-12)
		near(t, "P_QB on A2–C2", q["B"][0].P, pq/2, 1e-12)
	}
	if hasStep(lift(t, d, "A2", "L2"), "td/L2/xfer/G") {
		t.Error("A2/L2 carries a transfer")
	}
	recheckAll(t, d)
}

// The frame analysis does not model a column absent at some levels: refused with the input's
// file; an edge column cannot be left out (its beams need their supports).
func TestTransferRefusals(t *testing.T) {
	in := contractBuilding()
	in.Building.OmitAt = []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1"}}}
	in.Building.Analysis = model.AnalysisFrame
	if _, err := Derive(in, panel); err == nil || !strings.Contains(err.Error(), "contract.yaml") {
		t.Errorf("frame analysis with a transfer: %v", err)
	}
	in = contractBuilding()
	in.Building.OmitAt = []model.OmitLevels{{Columns: []string{"A2"}, Levels: []string{"L1"}, Line: 7}}
	if _, err := Derive(in, panel); err == nil || !strings.Contains(err.Error(), "contract.yaml:7: building: column A2") || !strings.Contains(err.Error(), "edge") {
		t.Errorf("edge column absent: %v", err)
	}
}

// A column absent at the two lower levels and a column that stops below the roof: every lift
// that stands is derived, the columns carrying the transfer get the column's whole load
// (statics), and every step rechecks.
func TestTransferChains(t *testing.T) {
	in := contractBuilding()
	b := in.Building
	b.GridX = append(b.GridX, 5000) // inner points B2 and C2
	b.OmitAt = []model.OmitLevels{{Columns: []string{"B2"}, Levels: []string{"L1", "L2"}}, {Columns: []string{"C2"}, Levels: []string{"R"}}}
	d, err := Derive(in, panel)
	if err != nil {
		t.Fatal(err)
	}
	count := map[string]int{}
	for _, l := range d.Lifts {
		count[l.Column]++
	}
	if count["B2"] != 1 || count["C2"] != 2 || count["A1"] != 3 {
		t.Errorf("lifts per column: %v", count)
	}
	// B2 stands on the beams of L2, spanning A2–C2 (C2 stands at L2) and B1–B3.
	pg := stepValue(t, lift(t, d, "B2", "R"), "td/G_cum")
	sum := 0.0
	for _, col := range []string{"A2", "C2", "B1", "B3"} {
		l := lift(t, d, col, "L2")
		sum += stepValue(t, l, "td/L2/xfer/G")
	}
	near(t, "transfer at L2", sum, pg, 1e-12)
	// B2's only lift R rests on the beams: the subframe takes its foot as the building's base.
	r := lift(t, d, "B2", "R")
	if r.MY.Top == 0 || r.MZ.Top == 0 {
		t.Errorf("B2/R has no end moments: %+v %+v", r.MY, r.MZ)
	}
	recheckAll(t, d)
}
