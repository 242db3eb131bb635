package design

import (
	"strconv"
	"testing"

	"colsheet/calc/detail"
	"colsheet/calc/model"
)

// continuous asserts that, up every column, no bar of a lift lacks a bar of the lift below to lap
// onto: the same or more bars on each face, the same or a larger diameter and, in the same
// section, each bar above within one bar diameter of a bar below (common practice, no source;
// laps beside the bar below, EN 1992-1-1:2004 8.7.2(3)); and that no bar is below the least bar.
func continuous(t *testing.T, name string, r *Result) (cranks int) {
	t.Helper()
	sel := r.Input.Options.Selection
	for k := range r.Designs {
		d := &r.Designs[k]
		if d.Bars.Dia < leastBar(sel, &model.Column{B: d.B, H: d.H})-1e-9 {
			t.Errorf("%s %s/%s: Ø%g below the least bar", name, d.Column, d.Storey, d.Bars.Dia)
		}
		if k+1 >= len(r.Designs) || r.Designs[k+1].Column != d.Column {
			continue
		}
		a := &r.Designs[k+1]
		c := detail.Continues(neighbourOf(a).g, a.pattern, neighbourOf(d).g, d.pattern)
		if !c.OK() {
			t.Errorf("%s %s: %s (%d × %g, %d by %d) is not continued by %s (%d × %g, %d by %d): ratio %g",
				name, d.Column, a.Storey, a.Bars.Count, a.Bars.Dia, a.pattern.NB, a.pattern.NH, d.Storey, d.Bars.Count, d.Bars.Dia, d.pattern.NB, d.pattern.NH, c.Ratio)
		}
		if !c.SameSection {
			cranks++
			if d.Detailing.Crank <= 0 || d.Detailing.CrankLength != 12*d.Detailing.Crank {
				t.Errorf("%s %s/%s: the section changes above, but the crank is %g over %g mm", name, d.Column, d.Storey, d.Detailing.Crank, d.Detailing.CrankLength)
			}
		} else if d.Detailing.Crank != 0 {
			t.Errorf("%s %s/%s: a crank where the section continues", name, d.Column, d.Storey)
		}
	}
	return cranks
}

// The shipped demo building: every lift passes and its bars continue up every column.
func TestContinuityInDemo(t *testing.T) {
	in := parseFile(t, "../../testdata/demo.yaml")
	r := mustRun(t, in)
	if n := r.Failed(); n > 0 {
		t.Errorf("%d lifts of the demo fail", n)
	}
	// Columns B4, D2 and D4 are 450 mm square at L1 and L2 and 400 mm above: cranked where the
	// section changes; so is B2, which stops on the transfer beams of L1 and is 450 mm at L2;
	// and A2 (700 mm), B1 and B3 (600 mm), larger at L1 and L2 beside the transfer.
	if cranks := continuous(t, "demo", r); cranks != 7 {
		t.Errorf("demo: %d cranks, want 7 (B4, D2, D4, B2, A2, B1, B3)", cranks)
	}
	// With a tolerance of 60 % the typical pass gives some 500 mm lifts the pattern used most in
	// their section (invented tolerance, a test input): continuity holds, no lift fails, the
	// cages are no more, and each typical pattern costs at most 60 % more steel.
	in.Options.Typical.Tolerance = 0.6
	wide := mustRun(t, in)
	continuous(t, "demo, 60 %", wide)
	if n := wide.Failed(); n > 0 {
		t.Errorf("%d lifts fail with the typical pass at 60 %%", n)
	}
	adopted := 0
	for _, d := range wide.Designs {
		for _, s := range d.Steps {
			if s.ID == "sel/typical_ratio" {
				adopted++
				if s.Value > 1.6+1e-9 {
					t.Errorf("%s/%s: the typical pattern costs %g times the steel of the cheapest", d.Column, d.Storey, s.Value)
				}
			}
		}
		checkTrace(t, d)
	}
	if adopted == 0 {
		t.Error("the typical pass at 60 % gives no lift a typical pattern")
	}
	if cagesOf(wide) > cagesOf(r) {
		t.Errorf("the typical pass gives %d cages, more than %d", cagesOf(wide), cagesOf(r))
	}
}

// cagesOf counts the distinct cages of a run: section and bar pattern.
func cagesOf(r *Result) int {
	seen := map[string]bool{}
	for _, d := range r.Designs {
		seen[strconv.FormatFloat(d.B, 'g', -1, 64)+"x"+strconv.FormatFloat(d.H, 'g', -1, 64)+" "+strconv.Itoa(d.pattern.NB)+"/"+strconv.Itoa(d.pattern.NH)+"/"+strconv.Itoa(d.pattern.Ring)+"/"+strconv.FormatFloat(d.pattern.Dia, 'g', -1, 64)] = true
	}
	return len(seen)
}

// A generated building of 3 × 3 columns over 8 storeys, the loads growing downwards and the
// columns 550 mm square below L5, 450 mm above: every column continuous, with and without the
// typical-pattern pass; the pass leaves no more distinct cages, and each typical pattern costs at
// most the tolerance more steel than the cheapest of its lift (common practice, no source).
func TestContinuityInGeneratedBuilding(t *testing.T) {
	build := func(typical bool) *Result {
		in := generatedBuilding(8, 2, model.AnalysisSubframe)
		in.Options.Selection = model.DefaultSelection()
		in.Options.Typical = model.Typical{On: typical, Tolerance: 0.10}
		for s := range in.Building.Columns {
			if s < 4 {
				in.Building.Columns[s].Size = model.Size{B: 550, H: 550}
			}
		}
		// Heavier floors below L4: the loads grow faster down the building.
		var low, high []string
		for s, lv := range in.Building.Storeys {
			if s < 4 {
				low = append(low, lv.Name)
			} else {
				high = append(high, lv.Name)
			}
		}
		in.Building.Floors = []model.Floor{{Levels: low, Gk: 0.009, Qk: 0.005, Category: "C", Spans: model.SpanTwoWay},
			{Levels: high, Gk: 0.006, Qk: 0.0025, Category: "B", Spans: model.SpanTwoWay}}
		return mustRun(t, in)
	}
	cages := cagesOf
	off, on := build(false), build(true)
	for _, r := range []*Result{off, on} {
		if n := r.Failed(); n > 0 {
			t.Errorf("%d lifts fail", n)
		}
		if cranks := continuous(t, "generated", r); cranks != 9 {
			t.Errorf("%d cranks, want 9 (every column at L4)", cranks)
		}
		for _, d := range r.Designs {
			checkTrace(t, d)
		}
	}
	if cages(on) > cages(off) {
		t.Errorf("the typical pass gives %d distinct cages, more than the %d without it", cages(on), cages(off))
	}
	for _, d := range on.Designs {
		for _, s := range d.Steps {
			if s.ID == "sel/typical_ratio" && s.Value > 1.10+1e-9 {
				t.Errorf("%s/%s: the typical pattern costs %g times the steel of the cheapest", d.Column, d.Storey, s.Value)
			}
		}
	}
	t.Logf("distinct cages: %d without the typical pass, %d with it", cages(off), cages(on))
}
