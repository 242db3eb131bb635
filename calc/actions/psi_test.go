package actions

import (
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// Every row of EN 1990:2002 Table A1.1 (recommended values).
func TestPsiTableA11(t *testing.T) {
	rows := []struct {
		cat              string
		psi0, psi1, psi2 float64
	}{
		{"A", 0.7, 0.5, 0.3},       // EN 1990:2002 Table A1.1, Category A: domestic, residential areas
		{"B", 0.7, 0.5, 0.3},       // EN 1990:2002 Table A1.1, Category B: office areas
		{"C", 0.7, 0.7, 0.6},       // EN 1990:2002 Table A1.1, Category C: congregation areas
		{"D", 0.7, 0.7, 0.6},       // EN 1990:2002 Table A1.1, Category D: shopping areas
		{"E", 1.0, 0.9, 0.8},       // EN 1990:2002 Table A1.1, Category E: storage areas
		{"F", 0.7, 0.7, 0.6},       // EN 1990:2002 Table A1.1, Category F: vehicle weight ≤ 30 kN
		{"G", 0.7, 0.5, 0.3},       // EN 1990:2002 Table A1.1, Category G: 30 kN < vehicle weight ≤ 160 kN
		{"H", 0, 0, 0},             // EN 1990:2002 Table A1.1, Category H: roofs
		{Snow, 0.5, 0.2, 0},        // EN 1990:2002 Table A1.1, snow, remainder of CEN member states, H ≤ 1000 m a.s.l.
		{SnowHigh, 0.7, 0.5, 0.2},  // EN 1990:2002 Table A1.1, snow, Finland, Iceland, Norway, Sweden, and H > 1000 m a.s.l.
		{Wind, 0.6, 0.2, 0},        // EN 1990:2002 Table A1.1, wind loads on buildings
		{Temperature, 0.6, 0.5, 0}, // EN 1990:2002 Table A1.1, temperature (non-fire) in buildings
	}
	for _, r := range rows {
		p0, p1, p2, ok := Psi(r.cat)
		if !ok {
			t.Fatalf("category %s not found", r.cat)
		}
		// Table values are exact decimals: tolerance 0.
		if p0 != r.psi0 || p1 != r.psi1 || p2 != r.psi2 {
			t.Errorf("%s: ψ = %g, %g, %g; table %g, %g, %g", r.cat, p0, p1, p2, r.psi0, r.psi1, r.psi2)
		}
		want := []float64{r.psi0, r.psi1, r.psi2}
		for which := 0; which < 3; which++ {
			s := PsiStep("psi", which, r.cat)
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
			if s.Kind != trace.KindTable || s.Value != want[which] || s.Row() == "" || len(s.Cautions()) > 0 {
				t.Errorf("%s ψ%d step: kind %s value %g row %q cautions %v", r.cat, which, s.Kind, s.Value, s.Row(), s.Cautions())
			}
			if !strings.Contains(s.Clause, "Table A1.1") {
				t.Errorf("%s ψ%d step cites %q", r.cat, which, s.Clause)
			}
		}
	}
	if s := PsiStep("psi", 0, "B"); s.Row() != "Category B: office areas, ψ0 = 0.7" {
		t.Errorf("row %q", s.Row())
	}
	// Spelling: lower-case letters and capitalised names are accepted (common practice, no source).
	if p0, _, _, ok := Psi("b"); !ok || p0 != 0.7 {
		t.Error("category b not accepted")
	}
	if _, _, _, ok := Psi("Wind"); !ok {
		t.Error("category Wind not accepted")
	}
	// An unknown category is not in the table: ψ = 1 (never reduces) with a caution.
	if _, _, _, ok := Psi("K"); ok {
		t.Error("category K should be unknown")
	}
	s := PsiStep("psi", 2, "K")
	if s.Value != 1 || len(s.Cautions()) != 1 {
		t.Errorf("unknown category step: value %g cautions %v", s.Value, s.Cautions())
	}
}
