package actions

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/code"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// recheckAll fails the test for any step that does not reproduce its value to 1e-9 or repeats an ID.
func recheckAll(t *testing.T, steps []trace.Step) {
	t.Helper()
	seen := map[string]bool{}
	for _, s := range steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		if seen[s.ID] {
			t.Errorf("step ID %s repeated", s.ID)
		}
		seen[s.ID] = true
	}
}

func near(got, want, rel float64) bool {
	return math.Abs(got-want) <= rel*math.Max(1, math.Abs(want))
}

// The combination parameters added to the catalogue carry the EN recommended values.
func TestCatalogue(t *testing.T) {
	cases := []struct {
		name string
		want float64
	}{
		{"gamma_G", 1.35},       // EN 1990:2002 Table A1.2(B), γGj,sup
		{"gamma_G_inf", 1.0},    // EN 1990:2002 Table A1.2(B), γGj,inf
		{"gamma_Q", 1.5},        // EN 1990:2002 Table A1.2(B), γQ,1 and γQ,i
		{"xi", 0.85},            // EN 1990:2002 Table A1.2(B), ξ in Eq. (6.10b)
		{"gamma_G_light", 1.35}, // EN 1992-1-1:2004 5.1.3(1)P: the same γG as on the loaded spans (from memory)
		{"density_rc", 25e-6},   // EN 1991-1-1:2002 Table A.1: 24 kN/m³ plus 1 kN/m³ for normal reinforcement, in N/mm³
	}
	p := code.Recommended()
	for _, c := range cases {
		if got := p.Get(c.name); got != c.want {
			t.Errorf("%s = %g, want %g", c.name, got, c.want)
		}
		s := ParamStep("code/"+c.name, p, c.name, "")
		if s.Value != c.want || s.Clause == "" || len(s.Cautions()) > 0 {
			t.Errorf("%s step: %+v", c.name, s)
		}
	}
	q, err := p.Override("gamma_G", 1.2)
	if err != nil {
		t.Fatal(err)
	}
	if s := ParamStep("g", q, "gamma_G", ""); s.Value != 1.2 || len(s.Cautions()) != 1 {
		t.Errorf("overridden gamma_G step: %+v", s)
	}
}

func kN(v float64, sym string) trace.Q {
	return trace.Q{V: v * 1e3, Symbol: sym, Unit: "N", From: "in/" + sym}
}

// Design values of EN 1990:2002 6.4.3.2(3) Eq. (6.10), (6.10a), (6.10b) with the factors of
// Table A1.2(B) (γG = 1.35, γQ = 1.5, ξ = 0.85) and ψ0 of Table A1.1, worked by hand.
func TestCombine(t *testing.T) {
	unreduced := kN(500, "Q_k,B")
	cases := []struct {
		name      string
		rule      string
		g         float64 // kN
		qs        []Variable
		want      float64 // kN, by hand
		cands     int     // candidate combinations
		governing string  // label in the governing note ("" when a single candidate)
	}{
		// 1.35·1000 = 1350
		{"6.10 G only", model.Comb610, 1000, nil, 1350, 1, ""},
		// max(1.35·1000, 0.85·1.35·1000 = 1147.5) = 1350
		{"6.10ab G only", model.Comb610ab, 1000, nil, 1350, 2, "Eq. (6.10a)"},
		// 1.35·1000 + 1.5·500 = 2100
		{"6.10 offices", model.Comb610, 1000, []Variable{{"B", kN(500, "Q_k,B"), nil}}, 2100, 1, ""},
		// (6.10a) 1350 + 1.5·0.7·500 = 1875; (6.10b) 0.85·1350 + 1.5·500 = 1897.5
		{"6.10ab offices", model.Comb610ab, 1000, []Variable{{"B", kN(500, "Q_k,B"), nil}}, 1897.5, 2, "Eq. (6.10b), category B leading"},
		// B leading 1350 + 600 + 1.5·0·50 = 1950; H leading 1350 + 75 + 1.5·0.7·400 = 1845
		{"6.10 offices and roof", model.Comb610, 1000, []Variable{{"B", kN(400, "Q_k,B"), nil}, {"H", kN(50, "Q_k,H"), nil}}, 1950, 2, "Eq. (6.10), category B leading"},
		// B leading 1350 + 600 + 1.5·0.5·100 = 2025; snow leading 1350 + 150 + 1.5·0.7·400 = 1920
		{"6.10 offices and snow", model.Comb610, 1000, []Variable{{"B", kN(400, "Q_k,B"), nil}, {Snow, kN(100, "Q_k,s"), nil}}, 2025, 2, "Eq. (6.10), category B leading"},
		// storage leads: 1350 + 1.5·300 + 1.5·0.7·400 = 2220; B leads 1350 + 600 + 1.5·1.0·300 = 2400
		{"6.10 offices and storage", model.Comb610, 1000, []Variable{{"E", kN(300, "Q_k,E"), nil}, {"B", kN(400, "Q_k,B"), nil}}, 2400, 2, "Eq. (6.10), category B leading"},
		// (6.10a) 1350 + 1.5·0.7·400 + 1.5·0.5·100 = 1845; (6.10b) B: 1147.5 + 600 + 75 = 1822.5; snow: 1147.5 + 150 + 420 = 1717.5
		{"6.10ab offices and snow", model.Comb610ab, 1000, []Variable{{"B", kN(400, "Q_k,B"), nil}, {Snow, kN(100, "Q_k,s"), nil}}, 1845, 3, "Eq. (6.10a)"},
		// EN 1991-1-1:2002 3.3.2(1): roof imposed load and snow not together.
		// H leading 135 + 1.5·60 = 225 (snow left out); snow leading 135 + 1.5·50 = 210 (H left out)
		{"6.10 roof and snow apart", model.Comb610, 100, []Variable{{"H", kN(60, "Q_k,H"), nil}, {Snow, kN(50, "Q_k,s"), nil}}, 225, 2, "Eq. (6.10), category H leading"},
		// one category given twice is one action: 300 + 200 = 500, as the offices case: 2100
		{"6.10 one category summed", model.Comb610, 1000, []Variable{{"B", kN(300, "Q_k,B1"), nil}, {"b", kN(200, "Q_k,B2"), nil}}, 2100, 1, ""},
		// αn-reduced offices (410 of 500) with shops: B leading 1350 + 1.5·410 + 1.5·0.7·100 = 2070;
		// D leading 1350 + 150 + 1.5·0.7·500 (ψ0 on the unreduced value, EN 1991-1-1:2002 3.3.1(2)P) = 2025
		{"6.10 reduced offices", model.Comb610, 1000, []Variable{{"B", kN(410, "Q_k,B,red"), &unreduced}, {"D", kN(100, "Q_k,D"), nil}}, 2070, 2, "Eq. (6.10), category B leading"},
		// (6.10a) 1350 + 525 + 105 = 1980; (6.10b) B: 1147.5 + 615 + 105 = 1867.5; D: 1147.5 + 150 + 525 = 1822.5
		{"6.10ab reduced offices", model.Comb610ab, 1000, []Variable{{"B", kN(410, "Q_k,B,red"), &unreduced}, {"D", kN(100, "Q_k,D"), nil}}, 1980, 3, "Eq. (6.10a)"},
	}
	p := code.Recommended()
	for _, c := range cases {
		steps, ed := Combine("K1/L1/comb", c.rule, p, kN(c.g, "G_k"), c.qs)
		recheckAll(t, steps)
		// Tolerance: relative 1e-12 (sums of a few exact decimals).
		if !near(ed.V, c.want*1e3, 1e-12) {
			t.Errorf("%s: Ed = %.6g kN, want %.6g kN", c.name, ed.V/1e3, c.want)
		}
		last := steps[len(steps)-1]
		if last.ID != "K1/L1/comb" || ed.From != last.ID || ed.Unit != "N" || last.Kind != trace.KindFormula {
			t.Errorf("%s: final step %s (%s), result from %s in %q", c.name, last.ID, last.Kind, ed.From, ed.Unit)
		}
		n := 0
		for _, s := range steps {
			if strings.HasPrefix(s.Title, "Design value, Eq.") {
				n++
			}
		}
		if n != c.cands {
			t.Errorf("%s: %d candidate combinations, want %d", c.name, n, c.cands)
		}
		if c.governing != "" {
			if !strings.HasPrefix(last.Expr, "max(") || len(last.Notes()) != 1 || last.Notes()[0] != "Governed by "+c.governing+"." {
				t.Errorf("%s: final step %q notes %v, want governed by %s", c.name, last.Expr, last.Notes(), c.governing)
			}
		}
		if len(last.Cautions()) > 0 {
			t.Errorf("%s: cautions %v", c.name, last.Cautions())
		}
	}
}

// The factors cite Table A1.2(B), overrides are used, units pass through, and odd input is cautioned.
func TestCombineDetails(t *testing.T) {
	// Line loads in N/mm (= kN/m): 1.35·5.8 + 1.5·2.5 = 11.58 N/mm (EN 1990:2002 Eq. (6.10)).
	g := trace.Q{V: 5.8, Symbol: "g_k", Unit: "N/mm"}
	q := trace.Q{V: 2.5, Symbol: "q_k", Unit: "N/mm"}
	steps, ed := Combine("beam", model.Comb610, code.Recommended(), g, []Variable{{Category: "B", Q: q}})
	recheckAll(t, steps)
	if !near(ed.V, 11.58, 1e-12) || ed.Unit != "N/mm" {
		t.Errorf("line load Ed = %g %s, want 11.58 N/mm", ed.V, ed.Unit)
	}
	for _, s := range steps {
		if strings.HasSuffix(s.ID, "/gamma_G") || strings.HasSuffix(s.ID, "/gamma_Q") {
			if !strings.Contains(s.Clause, "Table A1.2(B)") {
				t.Errorf("%s cites %q", s.ID, s.Clause)
			}
		}
	}
	// ξ = 0.925 (an accepted override): (6.10b) 0.925·1.35·1000 + 750 = 1998.75 > (6.10a) 1875.
	p, err := code.Recommended().Override("xi", 0.925)
	if err != nil {
		t.Fatal(err)
	}
	steps, ed = Combine("c", model.Comb610ab, p, kN(1000, "G_k"), []Variable{{Category: "B", Q: kN(500, "Q_k")}})
	recheckAll(t, steps)
	if !near(ed.V, 1998.75e3, 1e-12) {
		t.Errorf("ξ = 0.925: Ed = %g kN, want 1998.75", ed.V/1e3)
	}
	// An unknown rule falls back to Eq. (6.10), with a caution.
	steps, ed = Combine("c", "6.99", code.Recommended(), kN(1000, "G_k"), []Variable{{Category: "B", Q: kN(500, "Q_k")}})
	recheckAll(t, steps)
	if !near(ed.V, 2100e3, 1e-12) || len(steps[len(steps)-1].Cautions()) != 1 {
		t.Errorf("unknown rule: Ed = %g kN, cautions %v", ed.V/1e3, steps[len(steps)-1].Cautions())
	}
	// Mixed units and a negative variable action are cautioned.
	steps, _ = Combine("c", model.Comb610, code.Recommended(), kN(1000, "G_k"), []Variable{{Category: "B", Q: q}, {Category: "C", Q: kN(-5, "Q")}})
	recheckAll(t, steps)
	if n := len(steps[len(steps)-1].Cautions()); n != 2 {
		t.Errorf("%d cautions, want 2 (unit, negative)", n)
	}
}

// Load-arrangement values of EN 1992-1-1:2004 5.1.3(1)P and self-weight from EN 1991-1-1 Table A.1.
func TestArrangementAndSelfWeight(t *testing.T) {
	gG := trace.Const(1.35, "γ_G", "")
	gQ := trace.Const(1.5, "γ_Q", "")
	g := trace.Q{V: 20, Symbol: "g_k", Unit: "N/mm"}
	q := trace.Q{V: 10, Symbol: "q_k", Unit: "N/mm"}
	rho := trace.Const(25e-6, "γ_rc", "N/mm3")
	cases := []struct {
		name string
		s    trace.Step
		want float64
	}{
		{"loaded span", LoadedSpan("w1", gG, g, gQ, q), 42},                                                         // 1.35·20 + 1.5·10 = 42 N/mm, EN 1992-1-1:2004 5.1.3(1)P
		{"light span", LightSpan("w0", gG, g), 27},                                                                  // 1.35·20 = 27 N/mm, EN 1992-1-1:2004 5.1.3(1)P
		{"beam 275 × 500", SelfWeight("sw", rho, trace.Const(275, "b", "mm"), trace.Const(500, "h", "mm")), 3.4375}, // 25 kN/m³ · 0.275 m · 0.5 m = 3.4375 kN/m
	}
	for _, c := range cases {
		if err := trace.Recheck(c.s, 1e-9); err != nil {
			t.Error(err)
		}
		if !near(c.s.Value, c.want, 1e-12) || c.s.Unit != "N/mm" {
			t.Errorf("%s = %g %s, want %g N/mm", c.name, c.s.Value, c.s.Unit, c.want)
		}
	}
}
