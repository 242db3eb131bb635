package material

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// Rows of EN 1992-1-1:2004 Table 3.1 as printed (rounded as in the table).
func TestTable31(t *testing.T) {
	rows := []struct {
		class                           string
		fck, fcm, fctm, ecm             float64 // MPa, MPa, MPa, GPa
		epsC2, epsCu2, n, epsC3, epsCu3 float64 // ‰, ‰, -, ‰, ‰
	}{
		{"C12/15", 12, 20, 1.6, 27, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C20/25", 20, 28, 2.2, 30, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C25/30", 25, 33, 2.6, 31, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C30/37", 30, 38, 2.9, 33, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C35/45", 35, 43, 3.2, 34, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C40/50", 40, 48, 3.5, 35, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C50/60", 50, 58, 4.1, 37, 2.0, 3.5, 2.0, 1.75, 3.5},
		{"C55/67", 55, 63, 4.2, 38, 2.2, 3.1, 1.75, 1.8, 3.1},
		{"C60/75", 60, 68, 4.4, 39, 2.3, 2.9, 1.6, 1.9, 2.9},
		{"C70/85", 70, 78, 4.6, 41, 2.4, 2.7, 1.45, 2.0, 2.7},
		{"C80/95", 80, 88, 4.8, 42, 2.5, 2.6, 1.4, 2.2, 2.6},
		{"C90/105", 90, 98, 5.0, 44, 2.6, 2.6, 1.4, 2.3, 2.6},
	}
	for _, r := range rows {
		c, ok := Lookup(r.class)
		if !ok {
			t.Fatalf("%s not found", r.class)
		}
		// The table prints fctm to 0.1 MPa, Ecm to 1 GPa, strains to 0.1 ‰ (εc3 to 0.05 ‰), n to 0.05.
		check := func(name string, got, want, tol float64) {
			if math.Abs(got-want) > tol {
				t.Errorf("%s %s = %.4g, table %.4g", r.class, name, got, want)
			}
		}
		check("fck", c.Fck, r.fck, 0)
		check("fcm", c.Fcm, r.fcm, 0)
		check("fctm", c.Fctm, r.fctm, 0.05+1e-9)
		check("Ecm", c.Ecm/1000, r.ecm, 0.5+1e-9)
		check("εc2", c.EpsC2*1000, r.epsC2, 0.05+1e-9)
		check("εcu2", c.EpsCu2*1000, r.epsCu2, 0.05+1e-9)
		check("n", c.N, r.n, 0.025+1e-9)
		check("εc3", c.EpsC3*1000, r.epsC3, 0.05+1e-9)
		check("εcu3", c.EpsCu3*1000, r.epsCu3, 0.05+1e-9)
	}
	// C32/40 is outside Table 3.1 but used by national standards (BS 8500-1, from memory).
	if c, ok := Lookup("C32/40"); !ok || c.InTable31() || c.Fcm != 40 {
		t.Error("C32/40 should be accepted as an extra class outside Table 3.1")
	}
	if _, ok := Lookup("C33/41"); ok {
		t.Error("C33/41 is not a Table 3.1 class")
	}
}

func TestSteps(t *testing.T) {
	for _, class := range []string{"C30/37", "C70/85", "C90/105"} {
		c, _ := Lookup(class)
		fck := FckStep("fck", c).Q()
		steps := []trace.Step{EpsC2Step("a", c, fck), EpsCu2Step("b", c, fck), NStep("n", c, fck),
			EpsC3Step("c", c, fck), LambdaStep("l", c, fck), EtaStep("e", c, fck), Ecm("E", fck),
			Fcd("fcd", trace.Const(1, "α", ""), fck, trace.Const(1.5, "γ", "")),
			Fyd("fyd", trace.Const(500, "f", "MPa"), trace.Const(1.15, "γ", ""))}
		want := []float64{c.EpsC2, c.EpsCu2, c.N, c.EpsC3, c.Lambda, c.Eta, c.Ecm, c.Fck / 1.5, 500 / 1.15}
		for i, s := range steps {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Error(err)
			}
			if math.Abs(s.Value-want[i]) > 1e-12*math.Max(1, want[i]) {
				t.Errorf("%s step %s = %g, want %g", class, s.ID, s.Value, want[i])
			}
		}
	}
}

// εcu3 is the ultimate strain of the bilinear relation that the rectangular block of 3.1.7(3)
// uses (Fig. 3.5); Table 3.1 prints it beside εc3, not among the parabola-rectangle strains.
func TestEpsCu3Step(t *testing.T) {
	for _, tc := range []struct {
		class string
		want  float64 // ‰
	}{
		{"C30/37", 3.5}, // EN 1992-1-1:2004 Table 3.1
		{"C70/85", 2.7}, // EN 1992-1-1:2004 Table 3.1 (printed to 0.1 ‰)
		{"C90/105", 2.6},
	} {
		c, _ := Lookup(tc.class)
		s := EpsCu3Step("eps_cu3", c, FckStep("fck", c).Q())
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		if math.Abs(s.Value*1000-tc.want) > 0.05+1e-9 {
			t.Errorf("%s: εcu3 = %.4g ‰, Table 3.1 %.4g ‰", tc.class, s.Value*1000, tc.want)
		}
		if s.Symbol != "ε_cu3" || strings.Contains(s.Title, "parabola") || !strings.Contains(s.Title, "rectangular") {
			t.Errorf("%s: step %q, %q does not name εcu3 of the bilinear relation and rectangular block", tc.class, s.Symbol, s.Title)
		}
	}
}

// fctm as a table step: the row of Table 3.1 for each class, printed to 0.1 MPa.
func TestFctmStep(t *testing.T) {
	for _, tc := range []struct {
		class string
		want  float64 // MPa
	}{
		{"C30/37", 2.9}, // EN 1992-1-1:2004 Table 3.1
		{"C50/60", 4.1}, // EN 1992-1-1:2004 Table 3.1
		{"C70/85", 4.6}, // EN 1992-1-1:2004 Table 3.1
	} {
		c, _ := Lookup(tc.class)
		s := FctmStep("fctm", c)
		if s.Kind != trace.KindTable || s.Unit != "MPa" || s.Symbol != "f_ctm" || !strings.HasPrefix(s.Row(), tc.class) {
			t.Errorf("%s: step %+v is not the fctm row of Table 3.1", tc.class, s)
		}
		if math.Abs(s.Value-tc.want) > 0.05+1e-9 {
			t.Errorf("%s: fctm = %.4g MPa, Table 3.1 %.4g MPa", tc.class, s.Value, tc.want)
		}
	}
}
