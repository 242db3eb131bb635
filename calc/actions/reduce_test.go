package actions

import (
	"testing"

	"colsheet/calc/trace"
)

const m2 = 1e6 // mm² per m²

// αA of EN 1991-1-1:2002 6.3.1.2(10), Eq. (6.1) with A0 = 10 m², worked by hand.
func TestAlphaA(t *testing.T) {
	cases := []struct {
		cat  string
		a    float64 // m²
		want float64
	}{
		{"B", 20, 1.0},    // 5/7·0.7 + 10/20 = 0.5 + 0.5 = 1.0
		{"B", 40, 0.75},   // 0.5 + 0.25
		{"A", 100, 0.6},   // 0.5 + 0.1
		{"B", 10, 1.0},    // 0.5 + 1.0 = 1.5, limited to 1.0
		{"B", 1000, 0.51}, // 0.5 + 0.01
		{"C", 50, 0.7},    // 0.5 + 0.2
		{"C", 100, 0.6},   // 0.5 + 0.1 = 0.6, the bound for C and D
		{"D", 200, 0.6},   // 0.5 + 0.05 = 0.55, raised to 0.6 (C and D, note to 6.3.1.2(10))
		{"A", 200, 0.55},  // no bound for A and B
		{"E", 100, 1},     // storage: not reduced (categories A to D only, from memory)
		{"H", 100, 1},     // roofs: not reduced by 6.3.1.2(10)
		{"F", 100, 1},     // traffic areas: not reduced by 6.3.1.2(10)
	}
	for _, c := range cases {
		psi0 := PsiStep("psi0", 0, c.cat).Q()
		s := AlphaA("alphaA", c.cat, psi0, trace.Const(c.a*m2, "A", "mm2"))
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		// Tolerance: relative 1e-12.
		if !near(s.Value, c.want, 1e-12) {
			t.Errorf("αA, category %s, A = %g m²: %g, want %g", c.cat, c.a, s.Value, c.want)
		}
		if !reducible(c.cat) && len(s.Notes()) != 1 {
			t.Errorf("category %s: the unreduced factor should say why", c.cat)
		}
	}
	if s := AlphaA("a", "B", trace.Const(0.7, "ψ_0", ""), trace.Const(0, "A", "mm2")); s.Value != 1 || len(s.Cautions()) != 1 {
		t.Errorf("zero area: %+v", s)
	}
}

// αn of EN 1991-1-1:2002 6.3.1.2(11), Eq. (6.2), worked by hand; 1 for n ≤ 2.
func TestAlphaN(t *testing.T) {
	cases := []struct {
		cat  string
		n    float64
		want float64
	}{
		{"B", 1, 1},       // n ≤ 2: no reduction
		{"B", 2, 1},       // n ≤ 2: no reduction (Eq. (6.2) also gives 1 at n = 2)
		{"B", 3, 0.9},     // (2 + 0.7)/3
		{"A", 4, 0.85},    // (2 + 1.4)/4
		{"B", 5, 0.82},    // (2 + 2.1)/5
		{"D", 10, 0.76},   // (2 + 5.6)/10
		{"C", 100, 0.706}, // (2 + 68.6)/100, tending to ψ0 = 0.7
		{"E", 5, 1},       // storage: not reduced (categories A to D only, EN 1991-1-1:2002 6.3.1.2(11))
		{"H", 5, 1},       // roofs: not reduced
	}
	for _, c := range cases {
		psi0 := PsiStep("psi0", 0, c.cat).Q()
		s := AlphaN("alphan", c.cat, psi0, trace.Const(c.n, "n", ""))
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		// Tolerance: relative 1e-12.
		if !near(s.Value, c.want, 1e-12) {
			t.Errorf("αn, category %s, n = %g: %g, want %g", c.cat, c.n, s.Value, c.want)
		}
	}
	// The reduced load: 0.82 · 500 kN = 410 kN.
	r := Reduced("q", trace.Const(0.82, "α_n", ""), kN(500, "Q_k"))
	if err := trace.Recheck(r, 1e-9); err != nil || !near(r.Value, 410e3, 1e-12) || r.Symbol != "Q_k,red" {
		t.Errorf("reduced load %g %s (%v)", r.Value, r.Symbol, err)
	}
}

// Tributary areas of columns on the demo grid x 6.6, 6.6, 4.8 m and y 7.8, 5.7 m (common practice, no source).
func TestTributaryArea(t *testing.T) {
	cases := []struct {
		name               string
		lx1, lx2, ly1, ly2 float64 // m
		want               float64 // m²
	}{
		{"interior B2", 6.6, 6.6, 7.8, 5.7, 44.55}, // 6.6 · 6.75
		{"corner A1", 0, 6.6, 0, 7.8, 12.87},       // 3.3 · 3.9
		{"edge C1", 6.6, 4.8, 0, 7.8, 22.23},       // 5.7 · 3.9
		{"edge D2", 4.8, 0, 7.8, 5.7, 16.2},        // 2.4 · 6.75
	}
	for _, c := range cases {
		mm := func(v float64, s string) trace.Q { return trace.Const(v*1e3, s, "mm") }
		s := TributaryArea("A", mm(c.lx1, "L_x1"), mm(c.lx2, "L_x2"), mm(c.ly1, "L_y1"), mm(c.ly2, "L_y2"))
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		// Tolerance: relative 1e-12.
		if !near(s.Value/m2, c.want, 1e-12) || s.Unit != "mm2" {
			t.Errorf("%s: A = %g m², want %g", c.name, s.Value/m2, c.want)
		}
	}
}
