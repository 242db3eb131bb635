package building

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

func class(t *testing.T, name string) material.Concrete {
	t.Helper()
	c, ok := material.Lookup(name)
	if !ok {
		t.Fatalf("no class %s", name)
	}
	return c
}

// Ecm of the classes the members take their stiffness from: EN 1992-1-1:2004 Table 3.1 prints
// Ecm = 22·(fcm/10)^0.3 GPa rounded to whole GPa (the table's values from memory), so the
// computed value lies within 0.5 GPa of the printed one.
func TestEcmTable31(t *testing.T) {
	for _, c := range []struct {
		class string
		gpa   float64 // EN 1992-1-1:2004 Table 3.1, from memory
	}{
		{"C20/25", 30}, {"C25/30", 31}, {"C30/37", 33}, {"C35/45", 34}, {"C40/50", 35}, {"C45/55", 36}, {"C50/60", 37},
	} {
		got := class(t, c.class).Ecm / 1000
		if math.Abs(got-c.gpa) > 0.5 {
			t.Errorf("%s: Ecm = %.3f GPa, Table 3.1 prints %g", c.class, got, c.gpa)
		}
		fcm := class(t, c.class).Fck + 8 // EN 1992-1-1:2004 Table 3.1: fcm = fck + 8 MPa
		near(t, c.class+" Ecm by the expression", got, 22*math.Pow(fcm/10, 0.3), 1e-12)
	}
}

// The class of a column over a lift: the last concrete zone naming the column (or none) and the
// level (or none), else the project's class (the rule of model.Building.Concrete, common
// practice, no source).
func TestClassOf(t *testing.T) {
	def := class(t, "C32/40")
	b := &model.Building{
		Concrete: []model.ConcreteZone{
			{Levels: []string{"L2"}, Class: class(t, "C40/50")},                                // every column at L2
			{Columns: []string{"B2"}, Class: class(t, "C45/55")},                               // B2 at every level
			{Columns: []string{"B2", "C1"}, Levels: []string{"L2"}, Class: class(t, "C30/37")}, // later: wins at B2/L2
		},
	}
	for _, c := range []struct{ col, level, want string }{
		{"A1", "L1", "C32/40"}, // no zone: the project's class
		{"A1", "L2", "C40/50"},
		{"B2", "L1", "C45/55"},
		{"B2", "L2", "C30/37"}, // the last matching zone wins
		{"B2", "R", "C45/55"},
		{"C1", "L2", "C30/37"},
		{"C1", "R", "C32/40"},
	} {
		if got := ClassOf(b, def, c.col, c.level).Class; got != c.want {
			t.Errorf("%s/%s: %s, want %s", c.col, c.level, got, c.want)
		}
	}
	if got := ClassOf(nil, def, "A1", "L1").Class; got != "C32/40" {
		t.Errorf("no building: %s", got)
	}
	if got := BeamClass(b, def).Class; got != "C32/40" {
		t.Errorf("beams without a class: %s, want the project's", got)
	}
	bc := class(t, "C35/45")
	b.BeamConcrete = &bc
	if got := BeamClass(b, def).Class; got != "C35/45" {
		t.Errorf("beams: %s, want C35/45", got)
	}
	// The classes in use: the project's first, then in the order the grid meets them (A1, A2, B1,
	// B2, …, each lowest lift first): C40/50 at A1/L2, C45/55 at B2/L1, C30/37 at B2/L2.
	b.GridX, b.GridY = []float64{6000, 6000}, []float64{6000}
	b.Storeys = []model.Level{{Name: "L1"}, {Name: "L2"}, {Name: "R"}}
	var got []string
	for _, c := range ClassesInUse(b, def) {
		got = append(got, c.Class)
	}
	if want := "C32/40 C40/50 C45/55 C30/37"; strings.Join(got, " ") != want {
		t.Errorf("classes in use: %v, want %s", got, want)
	}
}

// The subframe takes each member's stiffness with Ecm of its own class (EN 1992-1-1:2004 Table
// 3.1), worked by hand for the inner column B2 of the contract building about y: beams 275 × 500
// of 6.6 m either side at half stiffness, columns 350 × 450 of 3.3 m above and below with far
// ends fixed; FEM = wL²/12 (handbook formula); one span γG·Gk + γQ·Qk, the other γG·Gk
// (EN 1992-1-1:2004 5.1.3, EN 1990:2002 Table A1.2(B)); the column below takes
// k_below/Σk of the unbalanced moment (common practice).
func TestSubframeStiffnessByClass(t *testing.T) {
	ib := 275 * math.Pow(500, 3) / 12
	ic := 350 * math.Pow(450, 3) / 12
	w := (7800 + 5700) / 2.0 // the slab spans y: half of each bay drains to the beams on line 2
	c32, c45 := class(t, "C32/40"), class(t, "C45/55")
	cases := []struct {
		name           string
		zones          []model.ConcreteZone
		beams          *material.Concrete
		level          string
		eBelow, eAbove float64 // Ecm of the columns below and above, MPa (0: no column above)
		eBeam          float64
		qk             float64  // imposed floor load, N/mm² (the permanent load cancels in the unbalanced moment)
		classSteps     []string // the modulus steps recorded on the lift
	}{
		{"one class", nil, nil, "L2", c32.Ecm, c32.Ecm, c32.Ecm, 2.5e-3, []string{"sub/E"}},
		{"column below C45/55", []model.ConcreteZone{{Columns: []string{"B2"}, Levels: []string{"L2"}, Class: c45}}, nil,
			"L2", c45.Ecm, c32.Ecm, c32.Ecm, 2.5e-3, []string{"sub/E_C45-55", "sub/E_C32-40"}},
		{"column above C45/55", []model.ConcreteZone{{Columns: []string{"B2"}, Levels: []string{"R"}, Class: c45}}, nil,
			"L2", c32.Ecm, c45.Ecm, c32.Ecm, 2.5e-3, []string{"sub/E_C32-40", "sub/E_C45-55"}},
		{"roof column C45/55, beams C32/40", []model.ConcreteZone{{Levels: []string{"R"}, Class: c45}}, nil,
			"R", c45.Ecm, 0, c32.Ecm, 0.6e-3, []string{"sub/E_C45-55", "sub/E_C32-40"}},
		{"all C45/55: the ratio of the default", []model.ConcreteZone{{Class: c45}}, &c45,
			"R", c45.Ecm, 0, c45.Ecm, 0.6e-3, []string{"sub/E_C45-55"}},
	}
	for _, c := range cases {
		in := contractBuilding()
		in.Building.Concrete, in.Building.BeamConcrete = c.zones, c.beams
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		lf := lift(t, d, "B2", c.level)
		L := 6600.0
		unb := 1.5 * c.qk * w * L * L / 12 // γG·Gk on both sides cancels
		kb := 0.5 * 4 * c.eBeam * ib / L
		kBelow := 4 * c.eBelow * ic / 3300
		kAbove := 4 * c.eAbove * ic / 3300
		want := unb * kBelow / (kBelow + kAbove + 2*kb)
		near(t, c.name+": |M top of B2/"+c.level+" about y|", math.Abs(lf.MY.Top), want, 1e-9)
		for _, id := range c.classSteps {
			s := findStep(lf, id)
			if s == nil {
				t.Errorf("%s: no step %s", c.name, id)
				continue
			}
			if id != "sub/E" && !strings.Contains(s.Title, strings.ReplaceAll(strings.TrimPrefix(id, "sub/E_"), "-", "/")) {
				t.Errorf("%s: step %s does not name its class: %q", c.name, id, s.Title)
			}
		}
		for _, l := range d.Lifts {
			for _, s := range l.Steps {
				if err := trace.Recheck(s, 1e-9); err != nil {
					t.Error(err)
				}
			}
		}
	}
}

// The frame analysis takes each member's stiffness with Ecm of its own class too: with every
// member of one class (whatever the class) the moments are those of the project's class, since
// only the ratios of EI/L enter a braced frame (slope-deflection equations, common practice, no
// source); a stiffer column draws more moment.
func TestFrameStiffnessByClass(t *testing.T) {
	run := func(zones []model.ConcreteZone, beams *material.Concrete) *Derived {
		in := contractBuilding()
		in.Building.Analysis = model.AnalysisFrame
		in.Building.Concrete, in.Building.BeamConcrete = zones, beams
		d, err := Derive(in, panel)
		if err != nil {
			t.Fatal(err)
		}
		return d
	}
	c45 := class(t, "C45/55")
	base := run(nil, nil)
	same := run([]model.ConcreteZone{{Class: c45}}, &c45)
	stiff := run([]model.ConcreteZone{{Columns: []string{"B2"}, Class: c45}}, nil)
	for k := range base.Lifts {
		near(t, base.Lifts[k].Column+"/"+base.Lifts[k].Name+" all C45/55", same.Lifts[k].MY.Top, base.Lifts[k].MY.Top, 1e-9)
	}
	a, b := lift(t, base, "B2", "L2"), lift(t, stiff, "B2", "L2")
	if !(math.Abs(b.MY.Top) > math.Abs(a.MY.Top)) {
		t.Errorf("B2/L2 of C45/55 among C32/40: |M| %g, not above %g", b.MY.Top, a.MY.Top)
	}
	if s := findStep(b, "frm/x/top"); s == nil || !strings.Contains(strings.Join(s.Notes(), " "), "this lift C45/55, the beams C32/40") {
		t.Errorf("frame step of B2/L2 does not name the classes: %+v", s)
	}
}

// The frame analysis never takes beam_stiffness: its moments are the same whatever the option
// says, and an explicit beam_stiffness with analysis: frame is refused (common practice, no
// source: the frame models the beams themselves).
func TestFrameIgnoresBeamStiffness(t *testing.T) {
	run := func(stiffness string, given bool) (*Derived, error) {
		in := contractBuilding()
		in.Building.Analysis = model.AnalysisFrame
		in.Building.Options.BeamStiffness, in.Building.Options.BeamStiffnessGiven = stiffness, given
		return Derive(in, panel)
	}
	half, err := run("half", false)
	if err != nil {
		t.Fatal(err)
	}
	full, err := run("full", false)
	if err != nil {
		t.Fatal(err)
	}
	for k := range half.Lifts {
		if half.Lifts[k].MY != full.Lifts[k].MY || half.Lifts[k].MZ != full.Lifts[k].MZ {
			t.Errorf("%s/%s: the frame's moments change with beam_stiffness", half.Lifts[k].Column, half.Lifts[k].Name)
		}
		for _, s := range full.Lifts[k].Steps {
			if strings.HasPrefix(s.ID, "sub") {
				t.Fatalf("frame analysis records subframe step %s", s.ID)
			}
		}
	}
	if _, err := run("full", true); err == nil || !strings.Contains(err.Error(), "beam_stiffness") {
		t.Errorf("beam_stiffness given with analysis: frame: %v", err)
	}
}

func findStep(l Lift, id string) *trace.Step {
	for k := range l.Steps {
		if l.Steps[k].ID == id {
			return &l.Steps[k]
		}
	}
	return nil
}
