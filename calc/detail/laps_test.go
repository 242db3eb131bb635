package detail

import (
	"math"
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
	if len(capped.Notes) == 0 {
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
	if len(floor.Notes) == 0 {
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
		got := Lap(l, "lap/", phi, fctm, gc, fyd, c.good, c.rho)
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

func TestLapLinks(t *testing.T) {
	mm := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	cases := []struct {
		name               string
		phi, l0, s, sRed   float64
		reach, reduced, sl float64
		links              float64
		verdict            string
	}{
		// EN 1992-1-1:2004 8.7.4.2(1): one link within 4φ outside each lap end, 4 × 20 = 80 mm.
		// 9.5.3(4): φ 20 > 14 mm, spacing reduced to 0.6 × 300 = 180 mm at the lap;
		// floor(1071 / 180) = 5 links ≥ 3 (by hand).
		{"φ20", 20, 1071, 300, 180, 80, 1, 180, 5, trace.Pass},
		// φ 12 ≤ 14 mm: no reduction, spacing 240 mm; a 200 mm lap holds floor(200/240) = 0 links < 3.
		{"φ12 short lap", 12, 200, 240, 144, 48, 0, 240, 0, trace.Fail},
		// φ 14 is not above 14 mm: no reduction; floor(720/240) = 3 links, just enough.
		{"φ14", 14, 720, 240, 144, 56, 0, 240, 3, trace.Pass},
	}
	for _, c := range cases {
		l := &trace.Log{}
		sl := LapLinks(l, "lap/", mm(c.phi), mm(c.l0), mm(c.s), mm(c.sRed))
		for _, s := range l.Steps {
			recheck(t, s)
		}
		byID := map[string]trace.Step{}
		for _, s := range l.Steps {
			byID[s.ID] = s
		}
		near(t, c.name+" end link reach", byID["lap/end_link"].Value, c.reach, 1e-12)
		near(t, c.name+" reduced", byID["lap/reduced"].Value, c.reduced, 0)
		near(t, c.name+" spacing at laps", sl.V, c.sl, 0)
		near(t, c.name+" links in lap", byID["lap/n_links"].Value, c.links, 0)
		if v := byID["lap/links_check"].Verdict; v != c.verdict {
			t.Errorf("%s: verdict %s, want %s", c.name, v, c.verdict)
		}
	}
}
