package cover

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

func q(v float64, sym string) trace.Q { return trace.Const(v, sym, "mm") }

func near(t *testing.T, name string, got, want, tol float64) {
	t.Helper()
	if math.Abs(got-want) > tol {
		t.Errorf("%s = %.9g, want %.9g (abs tol %g)", name, got, want, tol)
	}
}

func recheck(t *testing.T, steps ...trace.Step) {
	t.Helper()
	for _, s := range steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
}

// EN 1992-1-1:2004 Table 4.4N, cmin,dur in mm for reinforcing steel, every row S1 to S6, from
// memory. Columns: X0, XC1, XC2/XC3, XC4, XD1/XS1, XD2/XS2, XD3/XS3.
func TestTable44N(t *testing.T) {
	rows := map[int][7]float64{
		1: {10, 10, 10, 15, 20, 25, 30}, // EN 1992-1-1:2004 Table 4.4N row S1, from memory
		2: {10, 10, 15, 20, 25, 30, 35}, // EN 1992-1-1:2004 Table 4.4N row S2, from memory
		3: {10, 10, 20, 25, 30, 35, 40}, // EN 1992-1-1:2004 Table 4.4N row S3, from memory
		4: {10, 15, 25, 30, 35, 40, 45}, // EN 1992-1-1:2004 Table 4.4N row S4, from memory
		5: {15, 20, 30, 35, 40, 45, 50}, // EN 1992-1-1:2004 Table 4.4N row S5, from memory
		6: {20, 25, 35, 40, 45, 50, 55}, // EN 1992-1-1:2004 Table 4.4N row S6, from memory
	}
	col := map[string]int{"X0": 0, "XC1": 1, "XC2": 2, "XC3": 2, "XC4": 3, "XD1": 4, "XS1": 4,
		"XD2": 5, "XS2": 5, "XD3": 6, "XS3": 6}
	for class, row := range rows {
		for name, c := range col {
			s := CminDur("d", class, []string{name})
			near(t, "S"+string(rune('0'+class))+" "+name, s.Value, row[c], 0)
			if s.Kind != trace.KindTable || !strings.HasPrefix(s.Row(), "S") {
				t.Errorf("S%d %s: kind %s row %q", class, name, s.Kind, s.Row())
			}
			recheck(t, s)
		}
	}
	// The most onerous of several classes governs: XC3 and XS1 at S4 give the XD1/XS1 column.
	// EN 1992-1-1:2004 4.4.1.2(5) with Table 4.4N, from memory.
	s := CminDur("d", 4, []string{"XC3", "xs1", "XF1"})
	near(t, "XC3+XS1+XF1", s.Value, 35, 0)
	if s.Row() != "S4, XD1/XS1" {
		t.Errorf("row %q", s.Row())
	}
	if !strings.Contains(strings.Join(s.Notes(), " "), "EN 206") {
		t.Errorf("XF class without the EN 206 note: %v", s.Notes())
	}
	// Freeze-thaw alone: the X0 column with a caution; an unknown name: a caution.
	s = CminDur("d", 4, []string{"XF3", "XQ9"})
	near(t, "XF3 alone", s.Value, 10, 0)
	if len(s.Cautions()) != 2 {
		t.Errorf("cautions %v", s.Cautions())
	}
	if !Known("xa2") || !Known("X0") || Known("XC5") {
		t.Error("Known")
	}
}

// EN 1992-1-1:2004 Table 4.3N, recommended structural classification, from memory: S4 for 50
// years; +2 for 100 years; −1 for a strength class at least C30/37 (X0, XC1), C35/45 (XC2, XC3),
// C40/50 (XC4, XD1, XD2, XS1), C45/55 (XD3, XS2, XS3); −1 for special quality control; S1 to S6.
func TestStructuralClass(t *testing.T) {
	cases := []struct {
		name     string
		base     int
		life     float64
		fck      float64
		exposure []string
		qc       bool
		want     int
	}{
		{"S4 default", 0, 0, 25, []string{"XC1"}, false, 4},
		{"100 years", 0, 100, 25, []string{"XC1"}, false, 6},
		{"XC1 at C30/37", 0, 50, 30, []string{"XC1"}, false, 3},
		{"X0 at C30/37", 0, 50, 30, []string{"X0"}, false, 3},
		{"XC3 at C30/37", 0, 50, 30, []string{"XC3"}, false, 4},
		{"XC2 at C35/45", 0, 50, 35, []string{"XC2"}, false, 3},
		{"XC4 at C35/45", 0, 50, 35, []string{"XC4"}, false, 4},
		{"XC4 at C40/50", 0, 50, 40, []string{"XC4"}, false, 3},
		{"XD1 at C40/50", 0, 50, 40, []string{"XD1"}, false, 3},
		{"XD2 at C40/50", 0, 50, 40, []string{"XD2"}, false, 3},
		{"XS1 at C40/50", 0, 50, 40, []string{"XS1"}, false, 3},
		{"XS2 at C40/50", 0, 50, 40, []string{"XS2"}, false, 4},
		{"XS2 at C45/55", 0, 50, 45, []string{"XS2"}, false, 3},
		{"XD3 at C45/55", 0, 50, 45, []string{"XD3"}, false, 3},
		{"XS3 at C45/55", 0, 50, 45, []string{"XS3"}, false, 3},
		{"most demanding of XC1 and XD1", 0, 50, 35, []string{"XC1", "XD1"}, false, 4},
		{"special QC", 0, 50, 25, []string{"XC3"}, true, 3},
		{"all reductions", 1, 50, 50, []string{"XC1"}, true, 1},
		{"100 years from S5", 5, 100, 25, []string{"XD3"}, false, 6},
		{"100 years, C40/50 and QC", 0, 100, 40, []string{"XC4"}, true, 4},
	}
	for _, c := range cases {
		fck := trace.Const(c.fck, "f_ck", "MPa")
		s := StructuralClass("s", c.base, c.life, fck, c.exposure, c.qc)
		near(t, c.name, s.Value, float64(c.want), 0)
		if v := StructuralClassValue(c.base, c.life, c.fck, c.exposure, c.qc); v != c.want {
			t.Errorf("%s: value function %d, want %d", c.name, v, c.want)
		}
		recheck(t, s)
	}
}

// EN 1992-1-1:2004 4.4.1.2(3), Table 4.2 (cmin,b = φ, +5 mm for dg > 32 mm); Eq. (4.2) and
// Eq. (4.1) with Δcdev = 10 mm (4.4.1.3(1)P), evaluated by hand.
func TestCminCnom(t *testing.T) {
	b := CminB("b", q(20, "φ"), q(20, "d_g"))
	near(t, "cmin,b dg 20", b.Value, 20, 0)
	b2 := CminB("b", q(32, "φ"), q(40, "d_g"))
	near(t, "cmin,b dg 40", b2.Value, 37, 0)
	cases := []struct{ cminb, dur, gamma, want float64 }{
		{20, 25, 0, 25}, // durability governs
		{32, 25, 0, 32}, // bond governs
		{8, 5, 0, 10},   // the 10 mm floor governs (a value below every row of Table 4.4N, test input only)
		{20, 25, 5, 30}, // additive safety element
	}
	for _, c := range cases {
		m := Cmin("m", q(c.cminb, "c_min,b"), q(c.dur, "c_min,dur"), q(c.gamma, "Δc"))
		near(t, "cmin", m.Value, c.want, 0)
		n := Cnom("n", m.Q(), q(10, "Δc_dev"))
		near(t, "cnom", n.Value, c.want+10, 0)
		recheck(t, m, n)
	}
	recheck(t, b, b2)
	ck := CoverCheck("c", q(40, "c"), q(45, "c_nom"))
	near(t, "check", ck.Value, 45.0/40, 1e-12)
	if ck.Verdict != trace.Fail {
		t.Error("40 mm against 45 mm should fail")
	}
	recheck(t, ck)
}

// The whole chain for a column: XC3 + XD1, C32/40, H20 bars, H8 links, 20 mm aggregate, 40 mm to
// the links. Table 4.3N: S4 (C32/40 is below C40/50 for XD1); Table 4.4N S4/XD1: 35 mm; link:
// cmin = max(8, 35, 10) = 35, cnom = 45; bars: cmin = max(20, 35, 10) = 35, cnom = 45; cover to
// bars 48 mm. EN 1992-1-1:2004 4.4.1, Tables 4.3N and 4.4N from memory, by hand.
func TestNominal(t *testing.T) {
	d := model.Durability{Exposure: []string{"XC3", "XD1"}}
	var l trace.Log
	l.Prefix = "K1/L1/"
	link, bar := Nominal(&l, "cover/", d, trace.Const(32, "f_ck", "MPa"), q(20, "φ"), q(8, "φ_t"), q(20, "d_g"), q(40, "c"))
	near(t, "cnom link", link.V, 45, 0)
	near(t, "cnom bar", bar.V, 45, 0)
	got := map[string]trace.Step{}
	for _, s := range l.Steps {
		got[s.ID] = s
		recheck(t, s)
	}
	for id, want := range map[string]float64{"class": 4, "c_min_dur": 35, "dc_dev": 10, "c_bar": 48,
		"check_link": 45.0 / 40, "check_bar": 45.0 / 48, "link/c_min": 35, "bar/c_min_b": 20} {
		s, ok := got["K1/L1/cover/"+id]
		if !ok {
			t.Errorf("no step %s", id)
			continue
		}
		near(t, id, s.Value, want, 1e-12)
	}
	if got["K1/L1/cover/check_link"].Verdict != trace.Fail || got["K1/L1/cover/check_bar"].Verdict != trace.Pass {
		t.Error("verdicts")
	}
	vl, vb := NominalValue(d, 32, 20, 8, 20)
	near(t, "value link", vl, link.V, 0)
	near(t, "value bar", vb, bar.V, 0)

	// Large bars, large aggregate, X0 and a given Δcdev: the bond cover governs for the bars.
	d = model.Durability{Exposure: []string{"X0"}, DeltaCdev: mmPtr(5)}
	l = trace.Log{}
	link, bar = Nominal(&l, "", d, trace.Const(30, "f_ck", "MPa"), q(32, "φ"), q(10, "φ_t"), q(40, "d_g"), q(35, "c"))
	near(t, "cnom link X0", link.V, 20, 0) // max(10 + 5, 10, 10) + 5
	near(t, "cnom bar X0", bar.V, 42, 0)   // max(32 + 5, 10, 10) + 5
	for _, s := range l.Steps {
		recheck(t, s)
	}
}

func mmPtr(v float64) *float64 { return &v }

// Δcdev as given, or the recommended 10 mm where none is given (EN 1992-1-1:2004 4.4.1.3(1)P);
// 4.4.1.3(3) allows a reduced Δcdev, 10 mm ≥ Δcdev ≥ 5 mm under a quality assurance system that
// measures the cover, 10 mm ≥ Δcdev ≥ 0 with a very accurate measuring device and rejection of
// non-conforming members (from memory). XC1 at S4, C30/37: Table 4.3N gives S3 (C30/37 for XC1),
// Table 4.4N S3/XC1 10 mm (from memory); H8 links: cmin = max(8, 10, 10) = 10 mm, cnom = 10 + Δcdev.
// A given 0 was once taken as "not given" and became 10 mm.
func TestDeviationGiven(t *testing.T) {
	cases := []struct {
		name      string
		dev       *float64
		want      float64
		clause    string
		cautioned bool
	}{
		{"not given: recommended 10 mm", nil, 10, ec2 + "4.4.1.3(1)P", false}, // EN 1992-1-1:2004 4.4.1.3(1)P
		{"given 0 (precast, measured)", mmPtr(0), 0, "input", true},           // EN 1992-1-1:2004 4.4.1.3(3)
		{"given 5 (quality assurance)", mmPtr(5), 5, "input", true},           // EN 1992-1-1:2004 4.4.1.3(3)
		{"given 10", mmPtr(10), 10, "input", false},                           // EN 1992-1-1:2004 4.4.1.3(1)P
		{"given 15 (a national value)", mmPtr(15), 15, "input", false},        // test input
	}
	for _, c := range cases {
		d := model.Durability{Exposure: []string{"XC1"}, DeltaCdev: c.dev}
		s := DeviationInput("dev", d)
		near(t, c.name, s.Value, c.want, 0)
		if s.Clause != c.clause || (len(s.Cautions()) > 0) != c.cautioned || len(s.Notes()) == 0 {
			t.Errorf("%s: clause %q, notes %q, cautions %q", c.name, s.Clause, s.Notes(), s.Cautions())
		}
		if c.dev != nil && *c.dev < 10 && !strings.Contains(strings.Join(s.Notes(), " "), "4.4.1.3(3)") {
			t.Errorf("%s: the note does not name 4.4.1.3(3): %q", c.name, s.Notes())
		}
		var l trace.Log
		link, _ := Nominal(&l, "", d, trace.Const(30, "f_ck", "MPa"), q(16, "φ"), q(8, "φ_t"), q(20, "d_g"), q(40, "c"))
		near(t, c.name+": cnom link", link.V, 10+c.want, 0)
		vl, _ := NominalValue(d, 30, 16, 8, 20)
		near(t, c.name+": value function", vl, 10+c.want, 0)
		for _, st := range l.Steps {
			recheck(t, st)
		}
	}
}

// The allowances of one set of durability data, recorded once (the project basis), give every
// member the nominal covers of Nominal: XC3 and XD1, C32/40, links φ8 and bars φ20 as in
// TestNominal (cnom 45 mm each, EN 1992-1-1:2004 4.4.1, Tables 4.3N and 4.4N from memory, by hand),
// and bars φ40: cmin = max(40, 35, 10) = 40, cnom = 50 mm.
func TestExposureOnce(t *testing.T) {
	d := model.Durability{Exposure: []string{"XC3", "XD1"}}
	var l trace.Log
	a := Exposure(&l, "basis/cover/XC3-XD1/", d, trace.Const(32, "f_ck", "MPa"))
	if len(l.Steps) != 4 || a.Class.V != 4 || a.Dur.V != 35 || a.Dev.V != 10 {
		t.Fatalf("allowances: %d steps, %+v", len(l.Steps), a)
	}
	for _, c := range []struct{ phi, link, bar float64 }{{20, 45, 45}, {40, 45, 50}} {
		var m trace.Log
		link, bar := NominalFor(&m, "cover/", a, q(c.phi, "φ"), q(8, "φ_t"), q(20, "d_g"), q(40, "c"))
		near(t, "cnom link", link.V, c.link, 0)
		near(t, "cnom bar", bar.V, c.bar, 0)
		for _, s := range m.Steps {
			recheck(t, s)
			if strings.HasSuffix(s.ID, "class") || strings.HasSuffix(s.ID, "c_min_dur") {
				t.Errorf("step %s recorded again beside the allowances", s.ID)
			}
		}
	}
}
