package building

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// circular returns the size of a circular column of diameter d.
func circular(d float64) model.Size { return model.Size{B: d, H: d, Shape: model.ShapeCircle} }

// circleBuilding is the contract building with circular columns of 450 mm by default and
// B2 of 500 mm at L1 (invented sizes, test input); analysis and l0 as asked.
func circleBuilding(analysis string, l0FromFrame bool) *model.Input {
	in := contractBuilding()
	b := in.Building
	b.Column = circular(450)
	b.Columns = []model.ColumnSize{{IDs: []string{"B2"}, Levels: []string{"L1"}, Size: circular(500)},
		{IDs: []string{"A1"}, Size: model.Size{B: 350, H: 450}}}
	b.Analysis = analysis
	b.Options.L0FromFrame = l0FromFrame
	return in
}

// The self-weight of a circular column over a lift is ρ·π·D²/4·H (the area of a circle πD²/4,
// geometry; ρ = 25 kN/m³ for reinforced concrete, EN 1991-1-1:2002 Table A.1, and the code's
// density_rc); a rectangular column of the same building keeps ρ·b·h·H. Hand values from
// these formulas, common practice.
func TestCircularColumnSelfWeight(t *testing.T) {
	d, err := Derive(circleBuilding(model.AnalysisSubframe, false), panel)
	if err != nil {
		t.Fatal(err)
	}
	const rho = 25e-6 // N/mm³, EN 1991-1-1:2002 Table A.1
	cases := []struct {
		col, level string
		want       float64 // N
	}{
		{"B1", "L1", rho * math.Pi * 450 * 450 / 4 * 3800}, // 15.11 kN
		{"B1", "R", rho * math.Pi * 450 * 450 / 4 * 3300},
		{"B2", "L1", rho * math.Pi * 500 * 500 / 4 * 3800}, // the override
		{"B2", "L2", rho * math.Pi * 450 * 450 / 4 * 3300},
		{"A1", "L1", rho * 350 * 450 * 3800}, // rectangular
	}
	for _, c := range cases {
		l := lift(t, d, c.col, c.level)
		s := stepOf(t, l, "td/G_col")
		near(t, c.col+"/"+c.level+" G_col", s.Value, c.want, 1e-12)
		circle := l.Size.Shape == model.ShapeCircle
		if got := strings.Contains(s.Expr, "pi"); got != circle || circle && !strings.Contains(s.Title, "circular") {
			t.Errorf("%s/%s: self-weight %q, %q for a circle %v", c.col, c.level, s.Title, s.Expr, circle)
		}
		if circle {
			near(t, c.col+"/"+c.level+" D", stepOf(t, l, "td/D").Value, l.Size.B, 0)
		}
	}
	// A round number by hand: D = 400 mm, H = 4 m: 25 · π · 0.4² / 4 · 4 = 12.566 kN.
	st := CircularColumnSelfWeight("w", trace.Const(rho, "ρ", "N/mm3"), trace.Const(400, "D", "mm"), trace.Const(4000, "H", "mm"))
	near(t, "G_col of D 400 mm over 4 m", st.Value, 12566.370614359172, 1e-12)
	if err := trace.Recheck(st, 1e-9); err != nil {
		t.Error(err)
	}
}

// The second moment of area of a circle is π·D⁴/64 about every axis; of a rectangle b·h³/12
// about the axis parallel to b (geometry, common practice).
func TestColumnSecondMoment(t *testing.T) {
	cases := []struct {
		name string
		s    model.Size
		d    Dir
		want float64 // mm⁴
	}{
		{"circle 450 in x", circular(450), DirX, math.Pi * math.Pow(450, 4) / 64}, // 2.013e9
		{"circle 450 in y", circular(450), DirY, math.Pi * math.Pow(450, 4) / 64},
		{"circle 600 in x", circular(600), DirX, 6.361725123519331e9},
		{"rectangle 350 × 450 in x", model.Size{B: 350, H: 450}, DirX, 350 * math.Pow(450, 3) / 12},
		{"rectangle 350 × 450 in y", model.Size{B: 350, H: 450}, DirY, 450 * math.Pow(350, 3) / 12},
	}
	for _, c := range cases {
		near(t, c.name, inPlaneI(c.s, c.d), c.want, 1e-12)
		st := columnI("I", "above", c.s, c.d)
		near(t, c.name+" step", st.Value, c.want, 1e-12)
		if err := trace.Recheck(st, 1e-9); err != nil {
			t.Error(err)
		}
		if c.s.Shape == model.ShapeCircle && (st.Expr != "pi * D ** 4 / 64" || !strings.Contains(st.Title, "circular")) {
			t.Errorf("%s: %q %q", c.name, st.Title, st.Expr)
		}
	}
}

// Every step of the derivation of a building with circular columns rechecks, in the subframe,
// the frame lines and with the effective lengths of Eq. (5.15); the subframe's I of a circular
// column is π·D⁴/64 (geometry) and the columns' EI/l of Eq. (5.15) take it.
func TestCircleDerivationRechecks(t *testing.T) {
	for _, c := range []struct {
		analysis string
		l0       bool
	}{{model.AnalysisSubframe, false}, {model.AnalysisFrame, true}, {model.AnalysisBoth, true}} {
		d, err := Derive(circleBuilding(c.analysis, c.l0), panel)
		if err != nil {
			t.Fatalf("%s: %v", c.analysis, err)
		}
		circleI, colEI := 0, 0
		for _, l := range d.Lifts {
			for _, s := range l.Steps {
				if err := trace.Recheck(s, 1e-9); err != nil {
					t.Fatalf("%s: %s/%s: %v", c.analysis, l.Column, l.Name, err)
				}
				if strings.HasSuffix(s.ID, "/I") && strings.Contains(s.Title, "circular column") {
					circleI++
					var dia float64
					for _, a := range s.Args {
						if a.Name == "D" {
							dia = a.Value
						}
					}
					near(t, s.ID+" I", s.Value, math.Pi*math.Pow(dia, 4)/64, 1e-12)
				}
				if strings.Contains(s.Title, "EI/l of the circular column") {
					colEI++
				}
			}
		}
		if c.analysis != model.AnalysisFrame && circleI == 0 {
			t.Errorf("%s: no I step of a circular column", c.analysis)
		}
		if c.l0 && colEI == 0 {
			t.Errorf("%s: no EI/l step of a circular column for Eq. (5.15)", c.analysis)
		}
	}
}

// A circle and a square of the same second moment of area (a⁴/12 = π·D⁴/64, geometry) are
// equally stiff: the column end moments of the subframe and of the frame lines are the same,
// since the columns' self-weight loads no beam. Their effective lengths by Eq. (5.15) are equal
// too. The relation is exact; the tolerance covers rounding only.
func TestCircleAsStiffAsEqualSquare(t *testing.T) {
	const dia = 450.0
	a := dia * math.Pow(12*math.Pi/64, 0.25)
	for _, analysis := range []string{model.AnalysisSubframe, model.AnalysisFrame} {
		round, square := contractBuilding(), contractBuilding()
		round.Building.Column = circular(dia)
		square.Building.Column = model.Size{B: a, H: a}
		for _, in := range []*model.Input{round, square} {
			in.Building.Analysis = analysis
			in.Building.Options.L0FromFrame = true
		}
		dr, err := Derive(round, panel)
		if err != nil {
			t.Fatal(err)
		}
		ds, err := Derive(square, panel)
		if err != nil {
			t.Fatal(err)
		}
		for k := range dr.Lifts {
			r, s := dr.Lifts[k], ds.Lifts[k]
			name := analysis + " " + r.Column + "/" + r.Name
			for _, m := range [][2]float64{{r.MY.Top, s.MY.Top}, {r.MY.Bottom, s.MY.Bottom}, {r.MZ.Top, s.MZ.Top}, {r.MZ.Bottom, s.MZ.Bottom}} {
				if math.Abs(m[0]-m[1]) > 1e-9*math.Max(1, math.Abs(m[1])) {
					t.Errorf("%s: end moment %g, the equal square's %g", name, m[0], m[1])
				}
			}
			for ax := range r.Src.L0 {
				near(t, name+" l0", r.Src.L0[ax].V, s.Src.L0[ax].V, 1e-9)
			}
		}
	}
}
