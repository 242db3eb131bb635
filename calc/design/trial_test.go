package design

import (
	"testing"

	"colsheet/calc/building"
	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// trialInputs returns inputs that together take every branch of the trial path: stocky and
// slender lifts, tension, shear with and without links (from the end moments and as given), the
// load cases of one lift, rectangles and circles (links and helix), both stress blocks, both
// imperfection methods, fck ≤ 50 and > 50, the exact biaxial check, durability, fire, the lap
// step, the nominal stiffness method (alone and with nominal curvature, buckling or not) and the
// bars of a lift above. The actions
// are test data.
func trialInputs() map[string]*model.Input {
	out := map[string]*model.Input{}
	rect := func(b, h float64, st model.Storey) model.Column {
		return model.Column{ID: "T", B: b, H: h, Cover: 35, Storeys: []model.Storey{st}}
	}
	lifts := map[string]model.Storey{
		"stocky":       lift(3000, 3000, 2000, 60, -30, 10, 5),
		"slender":      lift(6500, 6000, 900, 40, 35, 25, 20),
		"slender-z":    lift(3500, 7000, 1500, 0, 0, 0, 0),
		"shear":        lift(2800, 2800, 600, 260, -240, 120, -110),
		"light":        lift(3000, 3000, 150, 5, 2, 3, 1),
		"tension":      lift(3000, 3000, -400, 30, -20, 10, 5),
		"tension-zero": lift(3000, 3000, -50, 0, 0, 0, 0),
		"heavy":        lift(3200, 3200, 5200, 120, -80, 60, -40),
	}
	given := lift(3000, 3000, 800, 50, -40, 20, 10)
	given.Cases = []model.Case{{Name: "V", NEd: given.NEd, MY: given.MY, MZ: given.MZ, V: [2]float64{350e3, 80e3}, HasV: [2]bool{true, true}}}
	lifts["shear-given"] = given
	cases := lift(3000, 3000, 1800, 60, -40, 20, 10)
	cases.Cases = []model.Case{
		{Name: "A", NEd: 1800e3, MY: model.Ends{Top: 60e6, Bottom: -40e6}, MZ: model.Ends{Top: 20e6, Bottom: 10e6}},
		{Name: "B", NEd: 700e3, MY: model.Ends{Top: 180e6, Bottom: -170e6}, MZ: model.Ends{Top: 5e6, Bottom: 5e6}, V: [2]float64{280e3, 0}, HasV: [2]bool{true, false}},
		{Name: "C", NEd: -150e3, MY: model.Ends{Top: 20e6, Bottom: -10e6}, MZ: model.Ends{Top: 5e6, Bottom: 5e6}},
	}
	lifts["cases"] = cases
	for name, st := range lifts {
		out["rect/"+name] = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(350, 450, st))
		out["circle/"+name] = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination,
			model.Column{ID: "R", B: 450, H: 450, Shape: model.ShapeCircle, Cover: 35, Storeys: []model.Storey{st}})
	}
	st := lifts["slender"]
	in := newInput("C70/85", model.Rectangular, model.ImperfL0Over400, rect(300, 500, st))
	out["rect/high-strength-rectangular"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(350, 450, lifts["stocky"]))
	in.Options.Biaxial = model.BiaxialExact
	out["rect/exact"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(400, 400, lifts["slender"]))
	in.Options.Durability = &model.Durability{Exposure: []string{"XC3"}, StructuralClass: 4, DesignLife: 50}
	in.Options.Fire = &model.Fire{Rating: 90}
	in.Options.LapStep = 25
	out["rect/durability-fire"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(400, 400, lifts["stocky"]))
	in.Options.Durability = &model.Durability{Exposure: []string{"XD3"}, DesignLife: 100}
	in.Options.Fire = &model.Fire{Rating: 60, UseMuFi: true}
	out["rect/durability-fire-mu"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination,
		model.Column{ID: "H", B: 400, H: 400, Shape: model.ShapeCircle, Helix: true, Cover: 35, Storeys: []model.Storey{lifts["slender"]}})
	in.Options.Fire = &model.Fire{Rating: 60}
	out["circle/helix-fire"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(350, 450, lifts["slender"]))
	in.Options.SecondOrder = model.SecondOrderBoth
	out["rect/stiffness"] = in
	for _, method := range []string{model.SecondOrderStiffness, model.SecondOrderBoth} {
		long := lift(9000, 8500, 2600, 60, 40, 30, 20) // buckles with the fewer bars
		in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(300, 350, long))
		in.Options.SecondOrder = method
		out["rect/buckling-"+method] = in
		in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination,
			model.Column{ID: "R", B: 400, H: 400, Shape: model.ShapeCircle, Cover: 35, Storeys: []model.Storey{long}})
		in.Options.SecondOrder = method
		out["circle/buckling-"+method] = in
	}
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(250, 250, lifts["shear"]))
	in.Options.LinkStep = 25
	out["rect/link-step"] = in
	in = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(350, 350, lifts["slender"]))
	in.Options.LinkStep = 500
	out["rect/huge-step"] = in
	for _, block := range []string{model.Rectangular, model.ParabolaRectangle} {
		in = newInput("C50/60", block, model.ImperfInclination, rect(300, 600, lifts["heavy"]))
		in.Options.Biaxial = model.BiaxialExact
		out["rect/exact-heavy-"+block] = in
	}
	st = lifts["shear"]
	st.Clear = 2400
	out["rect/clear"] = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(300, 400, st))
	st.Clear, st.Length = 0, 3300
	out["rect/length"] = newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, rect(300, 400, st))
	// Fire: every part of Method A (Table 5.2a, Eq. (5.7), neither, out of scope) and a rating
	// verified elsewhere.
	fires := map[string]struct {
		class string
		st    model.Storey
		b, h  float64
		f     model.Fire
	}{
		"table":        {"C30/37", lift(2800, 2800, 1500, 40, -20, 10, 5), 400, 400, model.Fire{Rating: 60}},
		"eq57":         {"C30/37", lift(4500, 4500, 1500, 40, -20, 10, 5), 350, 400, model.Fire{Rating: 90}},
		"eq57-mu":      {"C30/37", lift(4500, 4500, 1200, 40, -20, 10, 5), 350, 400, model.Fire{Rating: 120, UseMuFi: true}},
		"neither":      {"C30/37", lift(7000, 7000, 900, 40, -20, 10, 5), 300, 500, model.Fire{Rating: 180}},
		"r240":         {"C30/37", lift(2800, 2800, 800, 20, -10, 5, 5), 450, 450, model.Fire{Rating: 240}},
		"r300":         {"C30/37", lift(2800, 2800, 800, 20, -10, 5, 5), 450, 450, model.Fire{Rating: 300}},
		"eccentric":    {"C30/37", lift(2800, 2800, 300, 150, -140, 60, 50), 350, 350, model.Fire{Rating: 60}},
		"high-fck":     {"C60/75", lift(2800, 2800, 1500, 40, -20, 10, 5), 350, 350, model.Fire{Rating: 60}},
		"elsewhere":    {"C30/37", lift(2800, 2800, 1500, 40, -20, 10, 5), 350, 350, model.Fire{Rating: 90, Method: model.FireElsewhere, Note: "test"}},
		"tension":      {"C30/37", lift(2800, 2800, -300, 40, -20, 10, 5), 350, 350, model.Fire{Rating: 60}},
		"heavy-mu":     {"C30/37", lift(3200, 3200, 3200, 80, -40, 30, 10), 400, 400, model.Fire{Rating: 90, UseMuFi: true, EtaFi: 0.6}},
		"slender-both": {"C30/37", lift(6000, 5800, 1000, 60, 30, 20, 10), 300, 300, model.Fire{Rating: 30}},
		"both-short":   {"C30/37", lift(2800, 2800, 900, 30, -20, 10, 5), 250, 250, model.Fire{Rating: 120}},
		"table-short":  {"C30/37", lift(2800, 2800, 900, 30, -20, 10, 5), 250, 400, model.Fire{Rating: 120}},
		"eq57-short":   {"C30/37", lift(4500, 4500, 900, 30, -20, 10, 5), 250, 250, model.Fire{Rating: 180}},
		"eq57-shows":   {"C30/37", lift(2800, 2800, 900, 30, -20, 10, 5), 300, 300, model.Fire{Rating: 90}},
	}
	for name, fc := range fires {
		f := fc.f
		in = newInput(fc.class, model.ParabolaRectangle, model.ImperfInclination, rect(fc.b, fc.h, fc.st))
		in.Options.Fire = &f
		out["rect/fire-"+name] = in
		in = newInput(fc.class, model.ParabolaRectangle, model.ImperfInclination,
			model.Column{ID: "R", B: fc.b, H: fc.b, Shape: model.ShapeCircle, Cover: 35, Fire: &f, Storeys: []model.Storey{fc.st}})
		out["circle/fire-"+name] = in
	}
	return out
}

// The trial path gives every candidate pattern the same check steps (ID, title, clause,
// relation, ratio, verdict, in the same order), the same checks and the same status,
// utilisation and governing check as the traced evaluation it stands for, exactly (common
// practice, no source: the two paths compute one set of formulas).
func TestTrialMatchesEvaluate(t *testing.T) {
	total := 0
	for name, in := range trialInputs() {
		st := &in.Columns[0].Storeys[0]
		var commons []*common
		if len(st.Cases) > 1 {
			commons = newCaseSet(in, &in.Columns[0], st, newBasis(in)).all
		} else {
			commons = []*common{newCommon(in, &in.Columns[0], st, nil, newBasis(in))}
		}
		for ci, c := range commons {
			patterns := candidatesFor(c)
			patterns = append(patterns, detail.Pattern{Dia: 12, NB: 2, NH: 2}, detail.Pattern{Dia: 40, NB: 2, NH: 2})
			if c.circle {
				patterns = append(patterns, detail.Pattern{Dia: 12, Ring: 4}, detail.Pattern{Dia: 40, Ring: 6})
			}
			for v, above := range []*Derivation{nil, {AsAbove: 2500, AcAbove: 0.8 * c.ac.V, NameAbove: "L2"}} {
				c.dv = above
				c.shearCap = nil
				if v == 1 {
					c.shearCap = &shearCap{s: 90, name: "B"} // the spacing another case's shear allows
				}
				for _, p := range patterns {
					if p.Ring > 0 != c.circle {
						continue
					}
					total++
					want := c.evaluate(p, false, false)
					wantSteps := checkSteps(want.Steps)
					wantFixed := want.failsOnlyOnFixed()
					at := name + "/" + string(rune('0'+ci)) + "/" + patternName(p)
					compareTrial(t, at, c.trial(p, nil), want, wantSteps, wantFixed)
					// With the section and resistances of the quick bound, as the search tries it.
					_, q := c.cannotPass(p)
					compareTrial(t, at+"/bound", c.trial(p, q), want, wantSteps, wantFixed)
				}
			}
			c.dv, c.shearCap = nil, nil
		}
	}
	t.Logf("%d trials compared", total)
	if total < 500 {
		t.Errorf("only %d trials compared", total)
	}
}

// checkSteps returns a copy of the check steps of a trial's trace (a trial's steps live in a
// buffer that the next trial reuses).
func checkSteps(steps []trace.Step) []trace.Step {
	var out []trace.Step
	for _, s := range steps {
		if s.Kind == trace.KindCheck {
			out = append(out, s)
		}
	}
	return out
}

func patternName(p detail.Pattern) string {
	return string(rune('0'+p.NB)) + "x" + string(rune('0'+p.NH)) + "r" + string(rune('0'+p.Ring)) + "d" + string(rune('0'+int(p.Dia)/2))
}

func compareTrial(t *testing.T, at string, got, want Design, wantSteps []trace.Step, wantFixed bool) {
	t.Helper()
	gotSteps := checkSteps(got.Steps)
	if len(gotSteps) != len(wantSteps) {
		t.Errorf("%s: %d check steps, want %d", at, len(gotSteps), len(wantSteps))
		for _, s := range wantSteps {
			t.Logf("  want %s", s.ID)
		}
		for _, s := range gotSteps {
			t.Logf("  got  %s", s.ID)
		}
		return
	}
	for i, w := range wantSteps {
		g := gotSteps[i]
		if g.ID != w.ID || g.Title != w.Title || g.Clause != w.Clause || g.Relation != w.Relation || g.Verdict != w.Verdict || g.Value != w.Value {
			t.Errorf("%s: step %d\n got  %s %q %q %q %v %s\n want %s %q %q %q %v %s", at, i,
				g.ID, g.Title, g.Clause, g.Relation, g.Value, g.Verdict, w.ID, w.Title, w.Clause, w.Relation, w.Value, w.Verdict)
		}
	}
	if len(got.checks) != len(want.checks) {
		t.Errorf("%s: checks %v, want %v", at, got.checks, want.checks)
	} else {
		for i := range got.checks {
			if got.checks[i] != want.checks[i] {
				t.Errorf("%s: check %d %v, want %v", at, i, got.checks[i], want.checks[i])
			}
		}
	}
	if got.Status != want.Status || got.Utilization != want.Utilization || got.Governing != want.Governing {
		t.Errorf("%s: %s %v %q, want %s %v %q", at, got.Status, got.Utilization, got.Governing, want.Status, want.Utilization, want.Governing)
	}
	if f := got.failsOnlyOnFixed(); f != wantFixed {
		t.Errorf("%s: fails only on fixed %v, want %v", at, f, wantFixed)
	}
}

// A trial checked again with the moment arrangements of a derived lift (withArrangements)
// gives the same check steps, status and utilisation as the traced trial so checked (common
// practice, no source). The derivation is test data: smaller NEd of the arrangements, single
// curvature and the least axial force about each axis.
func TestTrialArrangementsMatch(t *testing.T) {
	total := 0
	for _, name := range []string{"rect/stocky", "rect/slender", "rect/shear", "circle/slender", "rect/exact", "rect/stiffness"} {
		in := trialInputs()[name]
		st := &in.Columns[0].Storeys[0]
		q := func(v float64, from string) trace.Q { return trace.Q{V: v, From: from} }
		ends := [2]model.Ends{st.MY, st.MZ}
		dv := &Derivation{NEd: q(st.NEd, "/dv/N")}
		for k := 0; k < 2; k++ {
			dv.Top[k], dv.Bottom[k] = q(ends[k].Top, "/dv/top"), q(ends[k].Bottom, "/dv/bot")
			dv.NArr[k] = q(st.NEd*(0.6+0.2*float64(k)), "/dv/n_arr")
			dv.BottomAlt[k] = q(-ends[k].Bottom+1e6, "/dv/bot_alt")
			dv.Min[k] = building.MinCase{N: q(st.NEd*0.45, "/dv/n_min"), Top: q(ends[k].Top*1.1, "/dv/top_min"), Bot: q(ends[k].Bottom*0.9, "/dv/bot_min")}
		}
		c := newCommon(in, &in.Columns[0], st, dv, newBasis(in))
		for _, p := range candidatesFor(c) {
			total++
			want := c.evaluate(p, false, false)
			c.withArrangements(&want, dv)
			wantSteps := checkSteps(want.Steps)
			wantFixed := want.failsOnlyOnFixed()
			_, q := c.cannotPass(p)
			got := c.trial(p, q)
			c.withArrangements(&got, dv)
			compareTrial(t, name+"/"+patternName(p), got, want, wantSteps, wantFixed)
		}
	}
	t.Logf("%d trials compared", total)
}
