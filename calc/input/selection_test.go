package input

import (
	"testing"

	"colsheet/calc/model"
)

// The rules of practice and the typical pass are read over their defaults (common practice, no source).
func TestSelectionOverrides(t *testing.T) {
	src := "design:\n  selection: {least_bar: 10 mm, least_bar_wide: 20 mm, wide_from: 400 mm, vibrator_gap: 0, labour_per_bar: 3, labour_per_tie: 0.5, costed: 4}\n  typical: {on: false, tolerance: \"5 %\"}\n" + head + "        NEd: 10\n"
	in, err := Parse("in.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	want := model.Selection{LeastBar: 10, LeastBarWide: 20, WideFrom: 400, VibratorGap: 0, LabourBar: 3, LabourTie: 0.5, Costed: 4}
	if in.Options.Selection != want {
		t.Errorf("selection %+v, want %+v", in.Options.Selection, want)
	}
	if in.Options.Typical != (model.Typical{On: false, Tolerance: 0.05}) {
		t.Errorf("typical %+v", in.Options.Typical)
	}
	in, err = Parse("in.yaml", []byte("design:\n  typical: {tolerance: 15}\n"+head+"        NEd: 10\n"))
	if err != nil {
		t.Fatal(err)
	}
	if in.Options.Typical != (model.Typical{On: true, Tolerance: 0.15}) || in.Options.Selection != model.DefaultSelection() {
		t.Errorf("typical %+v, selection %+v", in.Options.Typical, in.Options.Selection)
	}
}
