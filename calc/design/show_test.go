package design

import (
	"regexp"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// layerStress finds the steps of the stress of a bar layer and of the concrete it displaces.
var layerStress = regexp.MustCompile(`/sigma_[sc][0-9]+$`)

// guarded finds what an evaluation expression carries for the evaluator and a hand calculation
// does not write: a 1 or 0 for a condition, a tolerance on a rounding, π as digits, a floor on a
// divisor or under a root.
var guarded = regexp.MustCompile(`\? 1 : 0|0\.000000001|3\.141592653589793|, 0\.001\)|max\((M_Rd|N|n), 1\)|sqrt\(max\(`)

// checkShown asserts that every step whose evaluation expression needs guards has a display
// form, that the display form reproduces the step's value, and that a failed check without a
// ratio reads "not met" (the sheets' notation; common practice, no source).
func checkShown(t *testing.T, d Design) {
	t.Helper()
	for _, s := range d.Steps {
		if err := trace.RecheckShow(s, 1e-9); err != nil {
			t.Errorf("%s/%s: %v", d.Column, d.Storey, err)
		}
		if guarded.MatchString(s.Expr) && (s.Show == nil || guarded.MatchString(s.Show.Expr)) {
			t.Errorf("step %s: %q needs a display form without its guards", s.ID, s.Expr)
		}
		if s.Kind == trace.KindCheck && s.Verdict == trace.Fail && (s.Expr == "2" || s.Expr == "r") &&
			(s.Show == nil || s.Show.Result != "not met") {
			t.Errorf("step %s: a failed check without a ratio shows its marker value", s.ID)
		}
	}
}

func TestDisplayFormsAcrossCases(t *testing.T) {
	lifts := []model.Storey{
		lift(3000, 3000, 2000, 60, -30, 10, 5),  // stocky, double curvature
		lift(6500, 6000, 900, 40, 35, 25, 20),   // slender both ways, single curvature
		lift(3500, 7000, 1500, 0, 0, 0, 0),      // moments from imperfections only
		lift(3000, 3000, 0, 80, -80, 0, 0),      // no axial force
		lift(3000, 3000, 9000, 50, -20, 20, 10), // beyond any arrangement: fails
	}
	for _, class := range []string{"C30/37", "C70/85"} {
		for _, bl := range []string{model.ParabolaRectangle, model.Rectangular} {
			for i, st := range lifts {
				for _, given := range []*model.BarSpec{nil, {Count: 8, Dia: 20}} {
					col := model.Column{ID: "T" + string(rune('A'+i)), B: 350, H: 450, Cover: 35, Bars: given, Storeys: []model.Storey{st}}
					in := newInput(class, bl, model.ImperfInclination, col)
					in.Options.SecondOrder = model.SecondOrderBoth
					in.Options.Fire = &model.Fire{Rating: 90}
					in.Options.Durability = &model.Durability{Exposure: []string{"XC3"}, StructuralClass: 4, DesignLife: 50}
					for _, d := range mustRun(t, in).Designs {
						checkShown(t, d)
					}
				}
			}
		}
	}
	// No bar pattern fits: the failed check reads "not met" (EN 1992-1-1:2004 8.2(2)).
	col := model.Column{ID: "N", B: 200, H: 200, Cover: 35, Storeys: []model.Storey{lift(3000, 3000, 500, 10, 10, 0, 0)}}
	in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
	in.Options.BarDiameters = []float64{40}
	for _, d := range mustRun(t, in).Designs {
		checkShown(t, d)
	}
}

func TestDisplayFormsInBuildings(t *testing.T) {
	for _, set := range []func(in *model.Input){
		func(in *model.Input) {},
		func(in *model.Input) {
			in.Building.Floors[0].Spans = model.SpanTwoWay
			in.Building.Options.Reduction, in.Building.Options.Combination = model.ReduceArea, model.Comb610ab
			in.Options.SecondOrder, in.Options.Biaxial = model.SecondOrderStiffness, model.BiaxialExact
		},
		func(in *model.Input) {
			in.Building.Bars = &model.BarSpec{Count: 8, Dia: 20}
			in.Building.Options.Creep = &model.Creep{RH: 60, T0: 14, Cement: "R"}
			in.Options.Fire = &model.Fire{Rating: 60}
			in.Options.Durability = &model.Durability{Exposure: []string{"XC2"}, StructuralClass: 4, DesignLife: 50}
		},
	} {
		in := generatedBuilding(3, 2, model.AnalysisSubframe)
		set(in)
		for _, d := range mustRun(t, in).Designs {
			checkShown(t, d)
		}
	}
}

// Known display forms on a design's sheet: the bar area n·π·φ²/4 (common practice), the bending
// check M_Ed/M_Rd (EN 1992-1-1:2004 6.1), the stress of a bar by the branch of the steel's line
// that applies and of the concrete it displaces by the branch of the parabola-rectangle diagram
// (EN 1992-1-1:2004 3.2.7(2), 3.1.7(1)), the spacing of the links rounded down (common practice).
func TestDisplayFormsOnASheet(t *testing.T) {
	col := model.Column{ID: "K", B: 400, H: 400, Cover: 35, Bars: &model.BarSpec{Count: 8, Dia: 20}, Storeys: []model.Storey{lift(3000, 3000, 1500, 120, -60, 20, 10)}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	want := map[string]string{
		"bars/As":   "n * pi * phi ** 2 / 4",
		"y/check_M": "M_Ed / M_Rd",
		"z/check_M": "M_Ed / M_Rd",
		"links/s":   "rounddown(s, step)",
	}
	branches := map[string]bool{"fyd": true, "-fyd": true, "Es * eps": true, "0": true, "fcd": true, "fcd * (1 - (1 - eps / eps_c2) ** n)": true}
	seen := 0
	for _, s := range d.Steps {
		id := strings.TrimPrefix(s.ID, "K/L1/")
		if w, ok := want[id]; ok {
			seen++
			if s.Show == nil || s.Show.Expr != w {
				t.Errorf("%s: shown as %+v, want %q", id, s.Show, w)
			}
		}
		if layerStress.MatchString(id) && (s.Show == nil || !branches[s.Show.Expr]) {
			t.Errorf("%s: shown as %+v, want one branch of the stress-strain line", id, s.Show)
		}
	}
	if seen != len(want) {
		t.Errorf("%d of the %d steps found", seen, len(want))
	}
	checkShown(t, d)
}
