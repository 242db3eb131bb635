package design

import (
	"strings"
	"testing"

	"colsheet/calc/model"
)

// withCases returns lift st with the given cases (NEd kN, moments kNm), the first one's actions
// also in NEd and M, as the input reader leaves them.
func withCases(st model.Storey, cases ...[5]float64) model.Storey {
	for k, c := range cases {
		st.Cases = append(st.Cases, model.Case{Name: "C" + string(rune('1'+k)), File: "test.yaml", Line: 10 + k, NEd: c[0] * 1e3,
			MY: model.Ends{Top: c[1] * 1e6, Bottom: c[2] * 1e6}, MZ: model.Ends{Top: c[3] * 1e6, Bottom: c[4] * 1e6}})
	}
	st.NEd, st.MY, st.MZ = st.Cases[0].NEd, st.Cases[0].MY, st.Cases[0].MZ
	return st
}

// A lift of several load cases is designed for their envelope: where one case is the worst in
// every respect (more axial force and larger moments of the same shape), the design is that of
// the worst case alone, which governs; each other case is evaluated with the same bars and gives
// what a check of those bars under that case alone gives (common practice, no source).
func TestCasesEnvelope(t *testing.T) {
	base := lift(3400, 3600, 0, 0, 0, 0, 0)
	light, worst, mid := [5]float64{1500, 60, -30, 8, 8}, [5]float64{2600, 110, -50, 20, 15}, [5]float64{2000, 80, -40, 10, 10}
	st := withCases(base, light, worst, mid)
	col := model.Column{ID: "K", B: 350, H: 500, Cover: 40, Storeys: []model.Storey{st}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	checkTrace(t, d)

	alone := func(c [5]float64, bars *model.BarSpec) Design {
		one := withCases(base, c)
		one.Cases = nil
		cc := model.Column{ID: "K", B: 350, H: 500, Cover: 40, Bars: bars, Storeys: []model.Storey{one}}
		return mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, cc)).Designs[0]
	}
	w := alone(worst, nil)
	if d.GoverningCase != "C2" || d.Bars.Count != w.Bars.Count || d.Bars.Dia != w.Bars.Dia {
		t.Fatalf("governing %s with %d Ø%g, the worst case alone %d Ø%g", d.GoverningCase, d.Bars.Count, d.Bars.Dia, w.Bars.Count, w.Bars.Dia)
	}
	near(t, "utilisation", d.Utilization, w.Utilization, 1e-12)
	near(t, "MEd,y", d.Y.MEd, w.Y.MEd, 1e-12)
	if len(d.Cases) != 3 || d.Cases[1].Prefix != "" || d.Cases[0].Prefix != "case/1/" || d.Cases[2].Prefix != "case/3/" {
		t.Fatalf("cases %+v", d.Cases)
	}
	bars := &model.BarSpec{Count: d.Bars.Count, Dia: d.Bars.Dia}
	for k, c := range [][5]float64{light, worst, mid} {
		a := alone(c, bars)
		got := d.Cases[k]
		near(t, got.Name+" utilisation", got.Utilization, a.Utilization, 1e-9)
		near(t, got.Name+" MEd,y", got.Y.MEd, a.Y.MEd, 1e-12)
		near(t, got.Name+" MRd,z", got.Z.MRd, a.Z.MRd, 1e-9)
		near(t, got.Name+" NEd", got.NEd, c[0]*1e3, 1e-15)
		if got.Utilization > d.Utilization {
			t.Errorf("case %s utilisation %g above the governing %g", got.Name, got.Utilization, d.Utilization)
		}
		// The case's steps are in the trace under its prefix, the contract values among them.
		found := false
		for _, s := range d.Steps {
			if (s.ID == got.Prefix+"y/MEd_curv" || s.ID == got.Prefix+"y/MEd") && s.Value == got.Y.MEd {
				found = true
			}
		}
		if !found {
			t.Errorf("case %s: MEd,y %g not in its steps", got.Name, got.Y.MEd)
		}
	}
	if v := stepValue(t, d, "cases/As_min"); v != d.AsMin || v < d.Cases[1].NEd*0.1/(500/1.15)-1e-9 {
		t.Errorf("As,min %g (step %g) is not the largest of the cases", d.AsMin, v)
	}
}

// Two cases that each need something the other does not (a large axial force; a large moment
// at a small one) are both resisted by the one pattern chosen, and the pattern chosen for the
// pair is not cheaper than either alone would need (common practice, no source).
func TestCasesBothResisted(t *testing.T) {
	st := withCases(lift(3000, 3000, 0, 0, 0, 0, 0), [5]float64{3400, 20, -10, 5, 5}, [5]float64{600, 190, 150, 10, -10})
	col := model.Column{ID: "K", B: 400, H: 400, Cover: 35, Storeys: []model.Storey{st}}
	d := mustRun(t, newInput("C32/40", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	checkTrace(t, d)
	if d.Status != StatusPass {
		t.Fatalf("status %s: %v", d.Status, d.Reasons)
	}
	for _, c := range d.Cases {
		if c.Status != StatusPass || c.Utilization > 1+1e-9 || c.Utilization <= 0 {
			t.Errorf("case %s: %s at %g", c.Name, c.Status, c.Utilization)
		}
	}
	for k := range st.Cases {
		one := caseStorey(&st, k)
		one.Cases = nil
		cc := model.Column{ID: "K", B: 400, H: 400, Cover: 35, Storeys: []model.Storey{one}}
		a := mustRun(t, newInput("C32/40", model.ParabolaRectangle, model.ImperfInclination, cc)).Designs[0]
		if a.AsProv > d.AsProv+1e-9 {
			t.Errorf("case %s alone needs %g mm², the pair's design gives %g", st.Cases[k].Name, a.AsProv, d.AsProv)
		}
	}
	if !strings.Contains(d.Steps[len(d.Steps)-1].ID, "cases/As_min") {
		t.Errorf("last step %s", d.Steps[len(d.Steps)-1].ID)
	}
}

// A lift given by NEd and M has one case, "1", whose values are the design's.
func TestOneCase(t *testing.T) {
	col := model.Column{ID: "K", B: 350, H: 500, Cover: 40, Storeys: []model.Storey{lift(3400, 3600, 2150, 85, -40, 10, 10)}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	if d.GoverningCase != "1" || len(d.Cases) != 1 || d.Cases[0].Utilization != d.Utilization || d.Cases[0].Y.MEd != d.Y.MEd || d.Cases[0].Prefix != "" {
		t.Errorf("cases %+v, governing %q", d.Cases, d.GoverningCase)
	}
}

// A lift in tension is checked by strain compatibility: no imperfection, minimum eccentricity
// or second order, the design moment the larger end moment, |NEd| ≤ As·fyd, biaxial bending by
// the exact resistance; the moment resistance at NEd lies on the tension side of the
// interaction diagram, below that at NEd = 0 (common practice, no source). Pure tension by hand:
// N = −As·fyd with every bar yielding (EN 1992-1-1:2004 3.2.7, horizontal top branch).
func TestTensionCase(t *testing.T) {
	st := lift(3400, 3400, -400, 40, -25, 15, 10)
	col := model.Column{ID: "T", B: 400, H: 400, Cover: 35, Storeys: []model.Storey{st}}
	d := mustRun(t, newInput("C32/40", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	checkTrace(t, d)
	if d.Status != StatusPass {
		t.Fatalf("status %s: %v", d.Status, d.Reasons)
	}
	near(t, "MEd,y", d.Y.MEd, 40e6, 1e-12)
	near(t, "MEd,z", d.Z.MEd, 15e6, 1e-12)
	if d.Y.Slender || d.Y.Ei != 0 || d.Y.M2 != 0 {
		t.Errorf("tension: slender %v, ei %g, M2 %g", d.Y.Slender, d.Y.Ei, d.Y.M2)
	}
	fyd := 500 / 1.15
	near(t, "NRd,t", stepValue(t, d, "sec/NRd_t"), d.AsProv*fyd, 1e-12)
	near(t, "tension ratio", stepValue(t, d, "sec/check_Nt"), 400e3/(d.AsProv*fyd), 1e-12)
	if d.Exact == nil || stepValue(t, d, "bi/exact/check") <= 0 {
		t.Errorf("the exact biaxial resistance is not the check in tension")
	}
	// The resistance at NEd < 0 lies below the one at NEd = 0 (tension side of the diagram).
	zero := lift(3400, 3400, 1e-6, 40, -25, 15, 10)
	cz := model.Column{ID: "T", B: 400, H: 400, Cover: 35, Bars: &model.BarSpec{Count: d.Bars.Count, Dia: d.Bars.Dia}, Storeys: []model.Storey{zero}}
	dz := mustRun(t, newInput("C32/40", model.ParabolaRectangle, model.ImperfInclination, cz)).Designs[0]
	if !(d.Y.MRd < dz.Y.MRd) {
		t.Errorf("MRd,y at NEd = −400 kN %g not below %g at NEd = 0", d.Y.MRd, dz.Y.MRd)
	}
}

// Shear: VEd from the end moments over the length is |M_top − M_bot|/l (face convention,
// double curvature adds); a case with a large given V needs links closer than 9.5.3, and the
// lift's links serve every case: each case's provided spacing is the same, within the spacing
// that Eq. (6.8) allows, and a case that needs none of its own takes it over from the other
// (EN 1992-1-1:2004 6.2.3; the resistances themselves are checked by hand in calc/shear).
func TestCasesShear(t *testing.T) {
	st := withCases(lift(3000, 3000, 0, 0, 0, 0, 0), [5]float64{1800, 60, -30, 10, 10}, [5]float64{1500, 50, 40, 5, 5})
	st.Length = 3000
	st.Cases[1].V, st.Cases[1].HasV = [2]float64{300e3, 0}, [2]bool{true, false}
	col := model.Column{ID: "V", B: 350, H: 350, Cover: 35, Storeys: []model.Storey{st}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	checkTrace(t, d)
	if d.Status != StatusPass {
		t.Fatalf("status %s: %v", d.Status, d.Reasons)
	}
	// Case C1 (no V given): VEd,y = |60 − (−30)| kNm / 3 m = 30 kN.
	c1 := d.Cases[0]
	pre := c1.Prefix
	near(t, "VEd,y of C1", stepValue(t, d, pre+"y/shear/V_Ed"), 90e6/3000, 1e-12)
	near(t, "VEd,y of C2", stepValue(t, d, d.Cases[1].Prefix+"y/shear/V_Ed"), 300e3, 1e-12)
	sReq := stepValue(t, d, d.Cases[1].Prefix+"y/shear/s_req")
	if d.Links.SpacingShear != sReq || d.Links.Spacing > sReq+1e-9 {
		t.Errorf("links at %g, shear spacing %g, s_req %g", d.Links.Spacing, d.Links.SpacingShear, sReq)
	}
	s1 := stepValue(t, d, pre+"links/s")
	s2 := stepValue(t, d, d.Cases[1].Prefix+"links/s")
	if s1 != s2 || s1 != d.Links.Spacing {
		t.Errorf("case spacings %g and %g, design %g", s1, s2, d.Links.Spacing)
	}
	if stepValue(t, d, pre+"links/s_cases") != sReq {
		t.Errorf("C1 does not take over the spacing of C2")
	}
	if !d.Cases[1].Y.LinksShear || d.Cases[1].Y.VRdMax <= 300e3 || d.Cases[0].Y.LinksShear {
		t.Errorf("shear results %+v / %+v", d.Cases[1].Y, d.Cases[0].Y)
	}
}
