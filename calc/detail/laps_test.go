package detail

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// near fails the test when got differs from want by more than tol (absolute).
func near(t *testing.T, name string, got, want, tol float64) {
	t.Helper()
	if math.Abs(got-want) > tol {
		t.Errorf("%s = %.6g, want %.6g ± %g", name, got, want, tol)
	}
}

// recheck fails the test when a step does not reproduce its value.
func recheck(t *testing.T, s trace.Step) {
	t.Helper()
	if err := trace.Recheck(s, 1e-9); err != nil {
		t.Error(err)
	}
}

func TestBondStrength(t *testing.T) {
	mpa := func(v float64) trace.Q { return trace.Const(v, "x", "MPa") }
	one := trace.Const(1, "α_ct", "")
	gc := trace.Const(1.5, "γ_c", "")

	// EN 1992-1-1:2004 Table 3.1, C30/37: fctm = 2.9 MPa, fctk,0.05 = 2.0 MPa. The table prints
	// 0.1 MPa steps; 0.7 × 2.9 = 2.03 by hand.
	fk := Fctk005("fk", mpa(2.9))
	recheck(t, fk)
	near(t, "fctk,0.05 C30/37 against Table 3.1", fk.Value, 2.0, 0.05)
	near(t, "fctk,0.05 C30/37 = 0.7 × 2.9", fk.Value, 2.03, 1e-9)

	// EN 1992-1-1:2004 3.1.6(2)P, Eq. (3.16), αct = 1.0 (recommended), γc = 1.5 (Table 2.1N):
	// fctd = 2.03 / 1.5 = 1.353333 MPa by hand.
	fctd := Fctd("fctd", one, fk.Q(), gc)
	recheck(t, fctd)
	near(t, "fctd C30/37", fctd.Value, 2.03/1.5, 1e-12)

	// EN 1992-1-1:2004 8.4.2(2), Eq. (8.2): fbd = 2.25·η1·η2·fctd; η1 = 1.0 good bond, 0.7 poor.
	// By hand: good 2.25 × 1.353333 = 3.045 MPa; poor 0.7 × 3.045 = 2.1315 MPa.
	eta2 := Eta2("eta2", trace.Const(20, "φ", "mm"))
	recheck(t, eta2)
	for _, c := range []struct {
		good bool
		want float64
	}{{true, 3.045}, {false, 2.1315}} {
		e1 := Eta1("eta1", c.good)
		fbd := Fbd("fbd", e1.Q(), eta2.Q(), fctd.Q())
		recheck(t, fbd)
		near(t, "fbd C30/37", fbd.Value, c.want, 1e-9)
	}
	// With the rounded Table 3.1 value fctk,0.05 = 2.0 MPa: fbd = 2.25 × 2.0 / 1.5 = 3.0 MPa good bond,
	// 2.1 MPa poor bond (EN 1992-1-1:2004 8.4.2(2), Eq. (8.2), by hand).
	near(t, "fbd good, table fctk", FbdValue(1, 1, FctdValue(1, 2.0, 1.5)), 3.0, 1e-12)
	near(t, "fbd poor, table fctk", FbdValue(0.7, 1, FctdValue(1, 2.0, 1.5)), 2.1, 1e-12)

	// EN 1992-1-1:2004 8.4.2(2): η2 = 1 for φ ≤ 32 mm, (132 − φ)/100 above.
	for _, c := range []struct{ phi, want float64 }{{12, 1}, {32, 1}, {40, 0.92}, {50, 0.82}} {
		s := Eta2("eta2", trace.Const(c.phi, "φ", "mm"))
		recheck(t, s)
		near(t, "η2", s.Value, c.want, 1e-12)
	}

	// EN 1992-1-1:2004 8.4.2(2): fctk,0.05 is limited to the value for C60/75. C70/85 has
	// fctm = 4.6 MPa (Table 3.1); the limit is 0.7 × 2.12·ln(1 + 68/10) = 3.048 MPa by the
	// Table 3.1 expression, where the table prints 3.1 for C60/75 from fctm rounded to 4.4:
	// tolerance 0.06 MPa against the table.
	capped := Fctk005("fk", mpa(2.12*math.Log(1+78.0/10)))
	recheck(t, capped)
	near(t, "fctk,0.05 capped at C60/75 (expression)", capped.Value, 0.7*2.12*math.Log(7.8), 1e-12)
	near(t, "fctk,0.05 capped at C60/75 (Table 3.1)", capped.Value, 3.1, 0.06)
	if len(capped.Notes()) == 0 {
		t.Error("the C60/75 limit is not noted")
	}
}

func TestAnchorageAndLap(t *testing.T) {
	mm := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	num := func(v float64) trace.Q { return trace.Const(v, "x", "") }
	fyd := 500 / 1.15 // EN 1992-1-1:2004 3.2.7(2), fyk = 500 MPa, γs = 1.15 (Table 2.1N)

	// EN 1992-1-1:2004 8.4.3(2), Eq. (8.3): lb,rqd = (φ/4)(σsd/fbd). By hand, φ 20, σsd = fyd =
	// 434.783 MPa, fbd = 3.045 MPa (C30/37, good bond): 5 × 434.783 / 3.045 = 713.93 mm (35.7 φ).
	lb := LbRqd("lb", mm(20), trace.Const(fyd, "σ_sd", "MPa"), trace.Const(3.045, "f_bd", "MPa"))
	recheck(t, lb)
	near(t, "lb,rqd φ20 good bond", lb.Value, 713.93, 0.01)
	// Poor bond, fbd = 2.1315 MPa: 5 × 434.783 / 2.1315 = 1019.90 mm by hand.
	near(t, "lb,rqd φ20 poor bond", LbRqdValue(20, fyd, 2.1315), 1019.90, 0.01)

	// EN 1992-1-1:2004 8.7.3(1), Table 8.3: α6 = 1 below 25 %, 1.15 at 33 %, 1.4 at 50 %, 1.5 above
	// 50 %. The table prints two figures; (ρ1/25)^0.5 gives 1.149 and 1.414: tolerance 0.015.
	for _, c := range []struct{ rho, want, tol float64 }{
		{0, 1, 1e-12}, {20, 1, 1e-12}, {25, 1, 1e-12}, {33, 1.15, 0.015}, {50, 1.4, 0.015},
		{60, 1.5, 1e-12}, {100, 1.5, 1e-12},
	} {
		s := Alpha6("a6", num(c.rho))
		recheck(t, s)
		near(t, "α6", s.Value, c.want, c.tol)
	}
	// EN 1992-1-1:2004 8.7.3(1): α6 = (ρ1/25)^0.5 exactly between the limits, by hand √(36/25) = 1.2.
	near(t, "α6 at 36 %", Alpha6Value(36), 1.2, 1e-12)

	// EN 1992-1-1:2004 8.7.3(1), Eq. (8.11): l0,min = max(0.3·α6·lb,rqd, 15φ, 200 mm). By hand:
	cases := []struct {
		name            string
		a6, lb, phi, lo float64
	}{
		{"0.3·α6·lb governs", 1.5, 713.93, 20, 0.3 * 1.5 * 713.93}, // 321.27 > 300 > 200
		{"15φ governs", 1.0, 713.93, 20, 300},                      // 214.18 < 300
		{"200 mm governs", 1.0, 428.36, 12, 200},                   // 128.51, 180 < 200
		{"poor bond, all lapped", 1.5, 1019.90, 20, 458.955},       // 0.45 × 1019.90
	}
	for _, c := range cases {
		s := LapMin("l0min", num(c.a6), mm(c.lb), mm(c.phi))
		recheck(t, s)
		near(t, "l0,min "+c.name, s.Value, c.lo, 1e-9)
	}

	// EN 1992-1-1:2004 8.7.3(1), Eq. (8.10): l0 = α1·α2·α3·α5·α6·lb,rqd ≥ l0,min, compression bars
	// α1 = α2 = α3 = α5 = 1 (Table 8.2). By hand: 1.5 × 713.93 = 1070.90 mm.
	one := num(1)
	l0 := LapLength("l0", one, one, one, one, num(1.5), mm(713.93), mm(321.27))
	recheck(t, l0)
	near(t, "l0 φ20 all lapped", l0.Value, 1070.895, 1e-9)
	// l0,min governs at a low design stress: σsd = 100 MPa, φ16, fbd 3.045: lb,rqd = 4 × 100 / 3.045
	// = 131.36 mm, l0,min = max(39.4, 240, 200) = 240 mm (Eq. (8.10), (8.11), by hand).
	lbLow := LbRqdValue(16, 100, 3.045)
	near(t, "lb,rqd σsd 100", lbLow, 131.36, 0.01)
	low := LapLength("l0", one, one, one, one, one, mm(lbLow), mm(LapMinValue(1, lbLow, 16)))
	recheck(t, low)
	near(t, "l0 where l0,min governs", low.Value, 240, 1e-9)
	// EN 1992-1-1:2004 8.4.4(1), Eq. (8.5): α2·α3·α5 ≥ 0.7; 0.7 × 0.8 = 0.56 is raised to 0.7, so
	// l0 = 0.7 × 1.0 × 1000 = 700 mm by hand (test inputs, not a compression case).
	floor := LapLength("l0", one, num(0.7), num(0.8), one, one, mm(1000), mm(200))
	recheck(t, floor)
	near(t, "l0 with the (8.5) floor", floor.Value, 700, 1e-9)
	if len(floor.Notes()) == 0 {
		t.Error("the (8.5) floor is not noted")
	}
}

func TestLapConvenience(t *testing.T) {
	gc := trace.Const(1.5, "γ_c", "")
	fctm := trace.Const(2.9, "f_ctm", "MPa") // EN 1992-1-1:2004 Table 3.1, C30/37
	fyd := trace.Const(500/1.15, "f_yd", "MPa")
	// EN 1992-1-1:2004 8.4.2(2), 8.4.3(2), 8.7.3(1), by hand from the values of TestAnchorageAndLap:
	// good bond, all bars lapped (α6 = 1.5): φ20 1.5 × 713.929 = 1070.89 mm; poor bond
	// 1.5 × 1019.898 = 1529.85 mm; φ40 (η2 = 0.92) 1.5 × 1427.857 / 0.92 = 2328.03 mm; half the bars
	// lapped (α6 = √2) φ20: 1.41421 × 713.929 = 1009.64 mm.
	for _, c := range []struct {
		phi  float64
		good bool
		rho  float64
		want float64
	}{
		{20, true, 100, 1070.89}, {20, false, 100, 1529.85}, {40, true, 100, 2328.03}, {20, true, 50, 1009.64},
	} {
		l := &trace.Log{Prefix: "K1/L1/"}
		phi := trace.Const(c.phi, "φ", "mm")
		got, rho := Lap(l, "lap/", phi, fctm, gc, fyd, c.good, c.rho)
		near(t, "Lap ρ1", rho.V, c.rho, 0)
		if rho.From != "K1/L1/lap/rho1" {
			t.Errorf("ρ1 from %q", rho.From)
		}
		near(t, "Lap l0", got.V, c.want, 0.01)
		near(t, "LapValue", LapValue(c.phi, 2.9, 1.5, 500/1.15, c.good, c.rho), got.V, 1e-9*got.V)
		if len(l.Steps) != 11 {
			t.Errorf("Lap recorded %d steps, want 11", len(l.Steps))
		}
		for _, s := range l.Steps {
			recheck(t, s)
			if !strings.HasPrefix(s.ID, "K1/L1/lap/") {
				t.Errorf("step %s without the prefix", s.ID)
			}
		}
		if l.Last().ID != "K1/L1/lap/l0" || got.From != "K1/L1/lap/l0" {
			t.Errorf("l0 from %q, last step %q", got.From, l.Last().ID)
		}
	}
}

// The bond quantities recorded once serve the lap length of every diameter (the project basis):
// the same l0 as Lap, by hand as in TestLapConvenience (EN 1992-1-1:2004 8.4.2(2), 8.4.3(2),
// 8.7.3(1)): φ20 1070.89 mm, φ40 2328.03 mm, good bond, all bars lapped.
func TestLapBondOnce(t *testing.T) {
	gc := trace.Const(1.5, "γ_c", "")
	fctm := trace.Const(2.9, "f_ctm", "MPa") // EN 1992-1-1:2004 Table 3.1, C30/37
	fyd := trace.Const(500/1.15, "f_yd", "MPa")
	l := &trace.Log{Prefix: "basis/"}
	sigma := l.Add(FullStress("lap/sigma_sd", fyd))
	b := LapBondSteps(l, "lap/", fctm, gc, sigma, true, 100)
	if len(l.Steps) != 6 || b.Rho1.V != 100 || b.Alpha6.V != 1.5 || b.Eta1.V != 1 {
		t.Fatalf("bond: %d steps, ρ1 %g, α6 %g, η1 %g", len(l.Steps), b.Rho1.V, b.Alpha6.V, b.Eta1.V)
	}
	for _, c := range []struct{ phi, want float64 }{{20, 1070.89}, {40, 2328.03}} {
		n := len(l.Steps)
		pre := "lap/phi" + strconv.FormatFloat(c.phi, 'g', -1, 64) + "/"
		phi := trace.Const(c.phi, "φ", "mm")
		got := LapFor(l, pre, phi, b)
		near(t, "LapFor l0", got.V, c.want, 0.01)
		again, _ := Lap(&trace.Log{}, "lap/", phi, fctm, gc, fyd, true, 100)
		near(t, "LapFor against Lap", got.V, again.V, 1e-12*again.V)
		if len(l.Steps)-n != 5 {
			t.Errorf("φ%g: LapFor recorded %d steps, want 5", c.phi, len(l.Steps)-n)
		}
	}
	for _, s := range l.Steps {
		recheck(t, s)
	}
}

func TestLapLinks(t *testing.T) {
	mm := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	sMinT := func() trace.Q { return mm(25) } // EN 1992-1-1:2004 8.2(2) for φt 8, dg 20: max(1 × 8, 20 + 5, 20) = 25 mm
	type want struct {
		reduced, transverse float64
		nReq, sMax, s       float64 // links needed per outer third (0: not computed), greatest and provided spacing
		links, third        float64 // links in the lap, in each outer third (0: not computed)
		ratioAst            float64 // As/ΣAst (0: not computed)
		checks              []string
		verdict             string // of every check
	}
	cases := []struct {
		name                        string
		phi, phiT, l0, rho, s, sRed float64
		step                        float64
		w                           want
	}{
		// EN 1992-1-1:2004 9.5.3(4): φ20 > 14 mm, the spacing is reduced (0.6 × 300 = 180 mm). 8.7.4.1(3):
		// φ ≥ 20 mm, all bars lapped: ΣAst ≥ As = π·20²/4 = 314.16 mm²; one leg of φ8 (50.27 mm²) per link
		// parallel to the layer; 8.7.4.1(4), Fig. 8.9: ΣAst/2 in each outer third, 157.08/50.27 = 3.125 → 4
		// links. l0 = 1070.895 mm (C30/37, TestAnchorageAndLap): s ≤ 1070.895/12 = 89.24 mm, below 150 mm and
		// 180 mm; rounded down to 5 mm: 85 mm. floor(1070.895/85) = 12 links in the lap ≥ 3;
		// floor(356.965/85) = 4 per third, ΣAst = 8 × 50.27 = 402.12 mm², As/ΣAst = 400/512 = 0.78125 (by hand).
		{"φ20, links φ8", 20, 8, 1070.895, 100, 300, 180, 5,
			want{1, 1, 4, 1070.895 / 12, 85, 12, 4, 0.78125, []string{"links_check", "check_s_t", "check_Ast"}, trace.Pass}},
		// φ20 with links φ10 (78.54 mm²): 157.08/78.54 = 2 links per third exactly; l0/6 = 178.5 mm, so the
		// 150 mm of Fig. 8.9 governs (from memory of the figure). floor(1070.895/150) = 7 in the lap,
		// floor(356.965/150) = 2 per third: ΣAst = 4 × 78.54 = 314.16 mm² = As, ratio 1 (by hand).
		{"φ20, links φ10", 20, 10, 1070.895, 100, 300, 240, 1,
			want{1, 1, 2, 150, 150, 7, 2, 1, []string{"links_check", "check_s_t", "check_Ast"}, trace.Pass}},
		// EN 1992-1-1:2004 8.7.4.1(2): fewer than 25 % of the bars lapped at one section, the links for
		// other reasons suffice; 9.5.3(4) still reduces the spacing: min(180, 1070.895/3) = 180 mm, 5 links.
		{"φ20, 20 % lapped", 20, 8, 1070.895, 20, 300, 180, 1,
			want{1, 0, 0, 180, 180, 5, 0, 0, []string{"links_check"}, trace.Pass}},
		// φ16: 8.7.4.1(2), φ < 20 mm; 9.5.3(4) reduced spacing 192 mm (test input), a 500 mm lap (test input)
		// needs three links: min(192, 500/3 = 166.7) rounded down to 5 mm = 165 mm, floor(500/165) = 3.
		{"φ16 short lap", 16, 6, 500, 100, 320, 192, 5,
			want{1, 0, 0, 500.0 / 3, 165, 3, 0, 0, []string{"links_check"}, trace.Pass}},
		// φ12 ≤ 14 mm: 9.5.3(4) neither reduces the spacing nor asks for three links; floor(616/240) = 2.
		{"φ12", 12, 6, 616, 100, 240, 144, 1,
			want{0, 0, 0, 240, 240, 2, 0, 0, nil, trace.Pass}},
		// The step of the spacings (100 mm, test input) leaves no spacing below 89.24 mm: the links cannot be
		// detailed and the design fails loudly (common practice, no source).
		{"step too coarse", 20, 8, 1070.895, 100, 300, 180, 100,
			want{1, 1, 4, 1070.895 / 12, 0, 0, 0, 0, []string{"check_s"}, trace.Fail}},
	}
	for _, c := range cases {
		l := &trace.Log{}
		plan := LapLinks(l, "lap/", LapLinkInput{Phi: mm(c.phi), PhiT: mm(c.phiT), L0: mm(c.l0), Rho1: trace.Const(c.rho, "ρ_1", ""),
			S: mm(c.s), SRed: mm(c.sRed), Step: mm(c.step), SMinT: sMinT})
		byID := map[string]trace.Step{}
		for _, s := range l.Steps {
			recheck(t, s)
			if !trace.ClauseForm(s.Clause) {
				t.Errorf("%s: clause %q", s.ID, s.Clause)
			}
			byID[s.ID] = s
		}
		val := func(id string) float64 { return byID["lap/"+id].Value }
		w := c.w
		near(t, c.name+" reduced", val("zone"), w.reduced, 0)
		near(t, c.name+" transverse", val("transverse"), w.transverse, 0)
		near(t, c.name+" links needed per third", val("n_third_req"), w.nReq, 0)
		near(t, c.name+" greatest spacing", val("s_max"), w.sMax, 1e-9)
		near(t, c.name+" spacing", val("s"), w.s, 0)
		near(t, c.name+" plan spacing", plan.Spacing, w.s, 0)
		near(t, c.name+" links in lap", val("n_links"), w.links, 0)
		near(t, c.name+" plan count", float64(plan.Count), w.links, 0)
		near(t, c.name+" links per third", val("n_third"), w.third, 0)
		near(t, c.name+" As/ΣAst", val("check_Ast"), w.ratioAst, 1e-9)
		if w.s > 0 {
			// EN 1992-1-1:2004 8.7.4.2(1): one link within 4φ beyond each end of a compression lap.
			near(t, c.name+" end link reach", val("end_link"), 4*c.phi, 1e-12)
		}
		if plan.Reduced != (w.reduced == 1) || plan.Transverse != (w.transverse == 1) {
			t.Errorf("%s: plan %+v", c.name, plan)
		}
		if len(plan.Checks) != len(w.checks) {
			t.Errorf("%s: checks %v, want %v", c.name, plan.Checks, w.checks)
			continue
		}
		for i, id := range plan.Checks {
			if id != "lap/"+w.checks[i] {
				t.Errorf("%s: check %s, want lap/%s", c.name, id, w.checks[i])
			}
			if v := byID[id].Verdict; v != w.verdict {
				t.Errorf("%s: %s verdict %s, want %s", c.name, id, v, w.verdict)
			}
		}
	}
	// EN 1992-1-1:2004 8.7.4.1(3): the area of one lapped bar governs the links; ceil(As/2/Ast) by hand for
	// φ25 with φ8 links, 245.44/50.27 = 4.88 → 5, and φ32 with φ8, 402.12/50.27 = 8 exactly.
	near(t, "links per third φ25/φ8", LapLinksPerThirdValue(math.Pi*625/4, math.Pi*64/4, 1), 5, 0)
	near(t, "links per third φ32/φ8", LapLinksPerThirdValue(math.Pi*1024/4, math.Pi*64/4, 1), 8, 0)
}

func TestLapArrangement(t *testing.T) {
	mm := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	cases := []struct {
		name              string
		b, cover, link    float64
		phi, n, sMin      float64
		gap, gapMin       float64
		verdict, verdict0 string // with the lap, and by 8.2(2) alone
	}{
		// 350 wide, cover 40, links φ8, three φ20 along the face: clear (350 − 2 × 58)/2 − 20 = 97 mm; the
		// lapped pair leaves 97 − 20 = 77 mm ≥ max(25, 2 × 20, 20) = 40 mm (EN 1992-1-1:2004 8.2(2),
		// 8.7.2(3), by hand).
		{"φ20 in 350", 350, 40, 8, 20, 3, 25, 77, 40, trace.Pass, trace.Pass},
		// 300 wide, three φ32: clear (300 − 2 × 64)/2 − 32 = 54 mm ≥ 32 mm of 8.2(2) (k1·φ), but the pair leaves
		// 54 − 32 = 22 mm < max(32, 64, 20) = 64 mm of 8.7.2(3): the pattern cannot be lapped (by hand).
		{"φ32 in 300", 300, 40, 8, 32, 3, 32, 22, 64, trace.Fail, trace.Pass},
	}
	for _, c := range cases {
		g := Geometry{B: c.b, H: c.b, Cover: c.cover, Link: c.link}
		p := Pattern{Dia: c.phi, NB: int(c.n), NH: int(c.n)}
		gb, gh := g.ClearGaps(p)
		if g.Fits(p, c.sMin) != (c.verdict0 == trace.Pass) {
			t.Errorf("%s: fits by 8.2(2) alone %v", c.name, g.Fits(p, c.sMin))
		}
		if g.Fits(p, LappedFitValue(c.phi, c.sMin)) != (c.verdict == trace.Pass) {
			t.Errorf("%s: fits with the laps %v", c.name, g.Fits(p, LappedFitValue(c.phi, c.sMin)))
		}
		l := &trace.Log{}
		checks := LapArrangement(l, "lap/", mm(c.phi), mm(gb), mm(gh), mm(c.sMin))
		byID := map[string]trace.Step{}
		for _, s := range l.Steps {
			recheck(t, s)
			if !trace.ClauseForm(s.Clause) {
				t.Errorf("%s: clause %q", s.ID, s.Clause)
			}
			byID[s.ID] = s
		}
		near(t, c.name+" gap at the lap", byID["lap/gap"].Value, c.gap, 1e-9)
		near(t, c.name+" least gap at the lap", byID["lap/gap_min"].Value, c.gapMin, 1e-12)
		if len(checks) != 2 || checks[0] != "lap/check_pair" || checks[1] != "lap/check_gap" {
			t.Fatalf("%s: checks %v", c.name, checks)
		}
		// EN 1992-1-1:2004 8.7.2(3): the bars of a pair touch (8.2(4)), 0 ≤ min(4φ, 50 mm).
		near(t, c.name+" pair", byID["lap/check_pair"].Value, 0, 0)
		if v := byID["lap/check_gap"].Verdict; v != c.verdict {
			t.Errorf("%s: gap verdict %s, want %s", c.name, v, c.verdict)
		}
	}
	// The candidate patterns leave out those that cannot be lapped: 300 × 300, cover 40, links φ8, φ32 with
	// sMin = 32 mm (8.2(2)); 6 and 8 bars (three along a face) fit by 8.2(2) but not with the laps (by
	// hand above); 4 bars leave
	// 300 − 128 − 32 = 140 mm, and 140 − 32 = 108 ≥ 64 mm.
	link := func(float64) float64 { return 8 }
	plain := Candidates(300, 300, 40, []float64{32}, link, func(d float64) float64 { return math.Max(d, 25) }, 0, 1e9)
	lapped := Candidates(300, 300, 40, []float64{32}, link, func(d float64) float64 { return LappedFitValue(d, math.Max(d, 25)) }, 0, 1e9)
	counts := func(ps []Pattern) []int {
		var out []int
		for _, p := range ps {
			out = append(out, p.Count())
		}
		return out
	}
	if got := counts(plain); len(got) != 4 || got[0] != 4 || got[3] != 8 {
		t.Errorf("patterns by 8.2(2): %v, want [4 6 6 8]", got)
	}
	if got := counts(lapped); len(got) != 1 || got[0] != 4 {
		t.Errorf("patterns with the laps: %v, want [4]", got)
	}
}
