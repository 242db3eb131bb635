package building

import (
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// spanPair is a two-storey building of two bays along x, the first of span a, the second 4.0 m,
// and one bay of 6.0 m along y; invented numbers, test input only. Column B1 stands between the
// two spans along x, with one beam along y.
func spanPair(a float64, analysis string) *model.Input {
	in := contractBuilding()
	b := in.Building
	b.Storeys = b.Storeys[:2]
	b.GridX, b.GridY = []float64{a, 4000}, []float64{6000}
	b.Floors = []model.Floor{{Levels: []string{"L1", "L2"}, Gk: 5.8e-3, Qk: 2.5e-3, Category: "B", Spans: model.SpanTwoWay}}
	b.Analysis = analysis
	return in
}

// The subframe cautions where the spans either side of a joint differ by more than the span
// ratio, longer over shorter (default 1.5, at the limit no caution): next to long spans the
// simplified subframe may be far from the frame solution (common practice, no source).
func TestSpanRatioCaution(t *testing.T) {
	for _, c := range []struct {
		a, ratio float64 // the first span, mm; the span ratio of the input (0: the default 1.5)
		analysis string
		want     bool
	}{
		{5900, 0, model.AnalysisSubframe, false},
		{6000, 0, model.AnalysisSubframe, false}, // 1.5 exactly: not more than the ratio
		{6100, 0, model.AnalysisSubframe, true},
		{6100, 1.6, model.AnalysisSubframe, false},
		{6500, 1.6, model.AnalysisSubframe, true},
		{3000, 0, model.AnalysisSubframe, false}, // 4.0/3.0: the longer over the shorter
		{2600, 0, model.AnalysisSubframe, true},  // 4.0/2.6
		{6100, 0, model.AnalysisFrame, false},    // no subframe, no caution
	} {
		in := spanPair(c.a, c.analysis)
		in.Building.Options.SpanRatio = c.ratio
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		for _, lv := range []string{"L1", "L2"} {
			lf := lift(t, d, "B1", lv)
			s := findStep(lf, "subx/"+lv+"/span_ratio")
			if got := s != nil; got != c.want {
				t.Errorf("span %g, ratio %g, %s: caution at B1/%s %v, want %v", c.a, c.ratio, c.analysis, lv, got, c.want)
				continue
			}
			if s == nil {
				continue
			}
			if len(s.Cautions()) != 1 || !strings.Contains(s.Cautions()[0], "consider analysis: frame or both") {
				t.Errorf("B1/%s: cautions %q", lv, s.Cautions())
			}
			if err := trace.Recheck(*s, 1e-9); err != nil {
				t.Error(err)
			}
			// Edge columns have one beam along x: nothing to compare.
			if findStep(lift(t, d, "A1", lv), "subx/"+lv+"/span_ratio") != nil {
				t.Errorf("A1/%s: span ratio of an edge column", lv)
			}
		}
	}
}

// With beams at full stiffness the subframe records the factor with a caution on every lift; at
// half stiffness (common practice) it records none.
func TestFullStiffnessCaution(t *testing.T) {
	for _, stiffness := range []string{"half", "full"} {
		in := contractBuilding()
		in.Building.Options.BeamStiffness = stiffness
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		for _, lf := range d.Lifts {
			s := findStep(lf, "sub/k_b")
			if got := s != nil; got != (stiffness == "full") {
				t.Fatalf("%s/%s, %s stiffness: factor step %v", lf.Column, lf.Name, stiffness, got)
			}
			if s != nil && (s.Value != 1 || len(s.Cautions()) != 1 || !strings.Contains(s.Cautions()[0], "full stiffness")) {
				t.Errorf("%s/%s: %+v", lf.Column, lf.Name, *s)
			}
		}
	}
}
