package design

import (
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// stepByID returns the step of d with the given ID, or fails the test.
func stepByID(t *testing.T, d Design, id string) trace.Step {
	t.Helper()
	for _, s := range d.Steps {
		if s.ID == id {
			return s
		}
	}
	t.Fatalf("%s/%s: no step %s", d.Column, d.Storey, id)
	return trace.Step{}
}

// basisStep returns the step of the project basis of r with the given ID, or fails the test.
func basisStep(t *testing.T, r *Result, id string) trace.Step {
	t.Helper()
	for _, s := range r.Basis {
		if s.ID == id {
			return s
		}
	}
	t.Fatalf("no basis step %s", id)
	return trace.Step{}
}

// Without a given φef the default enters Kφ of the nominal curvature method (EN 1992-1-1:2004
// 5.8.8.3(4), Eq. (5.37): Kφ = 1 + β·φef) and Kc of the nominal stiffness method (5.8.7.2(2),
// Eq. (5.22): Kc = k1·k2/(1 + φef)); the step says which, and its caution reaches the design's
// cautions (results.json), once however many axes use it.
func TestDefaultCreepRatio(t *testing.T) {
	for _, tc := range []struct {
		method string
		says   []string
		uses   []string // steps that take φef from the default
	}{
		{model.SecondOrderCurvature, []string{"Kφ of 5.8.8.3"}, []string{"y/Kphi"}},
		{model.SecondOrderStiffness, []string{"Kc of 5.8.7.2"}, []string{"y/Kc"}},
		{model.SecondOrderBoth, []string{"Kφ of 5.8.8.3", "Kc of 5.8.7.2"}, []string{"y/Kphi", "y/Kc"}},
	} {
		col := model.Column{ID: "P", B: 350, H: 450, Cover: 35, Storeys: []model.Storey{lift(6500, 6000, 900, 40, 35, 25, 20)}}
		in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
		in.Options.SecondOrder = tc.method
		d := mustRun(t, in).Designs[0]
		if !d.Y.Slender {
			t.Fatalf("%s: the test column should be slender about y", tc.method)
		}
		phi := stepByID(t, d, "y/phi_ef")
		for _, w := range tc.says {
			if !strings.Contains(phi.Title, w) {
				t.Errorf("%s: title %q does not name %s", tc.method, phi.Title, w)
			}
		}
		if tc.method != model.SecondOrderBoth && strings.Contains(phi.Title, " and ") {
			t.Errorf("%s: title %q names a factor the method does not use", tc.method, phi.Title)
		}
		for _, id := range tc.uses {
			found := false
			for _, a := range stepByID(t, d, id).Args {
				found = found || a.From == "y/phi_ef"
			}
			if !found {
				t.Errorf("%s: step %s does not take the default φef", tc.method, id)
			}
		}
		if len(phi.Cautions()) != 1 {
			t.Fatalf("%s: φef step cautions %v", tc.method, phi.Cautions())
		}
		n := 0
		for _, c := range d.Cautions {
			if c == phi.Cautions()[0] {
				n++
			}
		}
		if n != 1 {
			t.Errorf("%s: the caution of the default φef is %d times in the design's cautions %v", tc.method, n, d.Cautions)
		}
		checkTrace(t, d)
	}
}

// The design moment of the nominal stiffness method names its arguments for what they carry: the
// magnified moment of EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28) is not called M_02, and the end
// moment with its imperfection (5.8.8.2(2)) is the step M02i.
func TestStiffnessDesignMomentArgs(t *testing.T) {
	col := model.Column{ID: "S", B: 350, H: 450, Cover: 35, Storeys: []model.Storey{lift(6500, 6000, 900, 40, 35, 25, 20)}}
	in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
	in.Options.SecondOrder = model.SecondOrderStiffness
	d := mustRun(t, in).Designs[0]
	for _, n := range []string{"y", "z"} {
		med := stepByID(t, d, n+"/MEd_stiff")
		from := map[string]string{}
		for _, a := range med.Args {
			from[a.Name] = a.From
		}
		if from["M_mag"] != n+"/M_mag" || from["M_0Ed"] != n+"/M02i" {
			t.Errorf("%s: arguments %+v", med.ID, med.Args)
		}
		want := d.Y.MEd
		if n == "z" {
			want = d.Z.MEd
		}
		near(t, med.ID, med.Value, want, 1e-12)
	}
	for _, s := range d.Steps {
		for _, a := range s.Args {
			if strings.HasSuffix(a.From, "/M_mag") && a.Name != "M_mag" {
				t.Errorf("step %s: the magnified moment is called %s", s.ID, a.Name)
			}
		}
	}
	checkTrace(t, d)
}

// With the rectangular block the ultimate strain is εcu3 of the bilinear relation (EN 1992-1-1:2004
// 3.1.7(3), Fig. 3.5; Table 3.1), and the sheet says so.
func TestRectangularBlockStrain(t *testing.T) {
	col := model.Column{ID: "R", B: 350, H: 450, Cover: 35, Storeys: []model.Storey{lift(3000, 3000, 2000, 60, -30, 10, 5)}}
	for _, class := range []string{"C30/37", "C70/85"} {
		r := mustRun(t, newInput(class, model.Rectangular, model.ImperfInclination, col))
		s := basisStep(t, r, "basis/mat/"+strings.ReplaceAll(class, "/", "-")+"/eps_cu3")
		if s.Symbol != "ε_cu3" || strings.Contains(s.Title, "parabola") {
			t.Errorf("%s: εcu3 step %q, %q", class, s.Symbol, s.Title)
		}
	}
}

// A failure reason names its axis and is given once, however many times its check is listed
// (common practice, no source: a reason the reader cannot place, or reads twice, misleads).
func TestReasonsNameAxisOnce(t *testing.T) {
	fail := func(id string) trace.Step {
		return trace.Check(id, "Axial force below the buckling load", "EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28)", "N_Ed < N_B",
			1.2, "N_Ed / N_B", trace.A("N_Ed", trace.Const(1.2, "N_Ed", "N")), trace.A("N_B", trace.Const(1, "N_B", "N")))
	}
	l := &trace.Log{}
	l.Add(fail("y/check_NB"))
	l.Add(fail("z/check_NB"))
	l.Add(trace.Check("y/check_M", "Bending about y", "EN 1992-1-1:2004 6.1", "M_Ed,y ≤ M_Rd,y", 1.1, "a",
		trace.A("a", trace.Const(1.1, "a", ""))))
	var d Design
	(&common{}).settle(&d, l, []checked{{"y/check_NB", true}, {"z/check_NB", true}, {"y/check_NB", true}, {"y/check_M", true}})
	want := []string{
		"Axial force below the buckling load about y: N_Ed < N_B does not hold (ratio 1.200, EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28))",
		"Axial force below the buckling load about z: N_Ed < N_B does not hold (ratio 1.200, EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28))",
		"Bending about y: M_Ed,y ≤ M_Rd,y does not hold (ratio 1.100, EN 1992-1-1:2004 6.1)",
	}
	if len(d.Reasons) != len(want) {
		t.Fatalf("reasons %q, want %q", d.Reasons, want)
	}
	for i, w := range want {
		if d.Reasons[i] != w {
			t.Errorf("reason %d = %q, want %q", i, d.Reasons[i], w)
		}
	}
	if d.Status != StatusFail || d.Utilization != 1.2 || !strings.HasPrefix(d.Governing, "Axial force below the buckling load about y") {
		t.Errorf("status %s, utilisation %g, governing %q", d.Status, d.Utilization, d.Governing)
	}
}

// A very slender column under the nominal stiffness method buckles about both axes: the sheet's
// reasons say so once per axis, each naming it (EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28)).
func TestBucklingReasonsPerAxis(t *testing.T) {
	col := model.Column{ID: "B", B: 250, H: 250, Cover: 30, Bars: &model.BarSpec{Count: 4, Dia: 16},
		Storeys: []model.Storey{lift(9000, 9000, 1000, 10, 10, 10, 10)}}
	in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
	in.Options.SecondOrder = model.SecondOrderStiffness
	d := mustRun(t, in).Designs[0]
	if d.Status != StatusFail {
		t.Fatalf("status %s, utilisation %g", d.Status, d.Utilization)
	}
	seen := map[string]bool{}
	axes := map[string]bool{}
	for _, r := range d.Reasons {
		if seen[r] {
			t.Errorf("reason twice: %q", r)
		}
		seen[r] = true
		if strings.HasPrefix(r, "Axial force below the buckling load") {
			switch {
			case strings.HasPrefix(r, "Axial force below the buckling load about y:"):
				axes["y"] = true
			case strings.HasPrefix(r, "Axial force below the buckling load about z:"):
				axes["z"] = true
			default:
				t.Errorf("reason without its axis: %q", r)
			}
		}
	}
	if !axes["y"] || !axes["z"] {
		t.Errorf("buckling reasons %q, want one about y and one about z", d.Reasons)
	}
	checkTrace(t, d)
}

// The radius of gyration of the bars takes the outer rows' distance and the bar counts from their
// steps (EN 1992-1-1:2004 5.8.8.3(2)), so no bar position enters the sheet as a bare number.
func TestGyrationFromSteps(t *testing.T) {
	col := model.Column{ID: "G", B: 350, H: 450, Cover: 35, Storeys: []model.Storey{lift(6500, 6000, 900, 40, 35, 25, 20)}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	for _, n := range []string{"y", "z"} {
		s := stepByID(t, d, n+"/i_s")
		for _, a := range s.Args {
			if a.From == "" {
				t.Errorf("%s: argument %s enters as a bare number", s.ID, a.Name)
			}
		}
	}
	// The outer rows lie at h/2 − c_nom − φt − φ/2 (and b/2 − … along y), as the bars are placed.
	e := 35 + d.Links.Dia + d.Bars.Dia/2
	near(t, "z_c", stepByID(t, d, "bars/z_c").Value, 450/2-e, 1e-12)
	near(t, "y_c", stepByID(t, d, "bars/y_c").Value, 350/2-e, 1e-12)
	checkTrace(t, d)
}
