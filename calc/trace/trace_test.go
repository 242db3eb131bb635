package trace

import "testing"

func TestRecheck(t *testing.T) {
	fck := Const(30, "f_ck", "MPa")
	// EN 1992-1-1:2004 3.1.6(1) Eq. (3.15) with alpha_cc = 1, gamma_c = 1.5: fcd = 20 MPa.
	good := Formula("fcd", "design strength", "EN 1992-1-1:2004 3.1.6(1)", "f_cd", "MPa", 20,
		"alpha_cc * fck / gamma_c", A("alpha_cc", Const(1, "α_cc", "")), A("fck", fck), A("gamma_c", Const(1.5, "γ_c", "")))
	if err := Recheck(good, 1e-9); err != nil {
		t.Fatal(err)
	}
	bad := good
	bad.Value = 20.001
	if err := Recheck(bad, 1e-9); err == nil {
		t.Fatal("tampered value not caught")
	}
	s := Formula("m", "min", "", "m", "", 2, "max(min(x, 3), 2)", A("x", Const(1, "x", "")))
	if err := Recheck(s, 1e-9); err != nil {
		t.Fatal(err)
	}
	c := Check("c", "check", "", "a ≤ b", 1.2, "a / b", A("a", Const(1.2, "a", "")), A("b", Const(1, "b", "")))
	if c.Verdict != Fail {
		t.Fatal("ratio 1.2 should fail")
	}
}

// The one form of clause references (DESIGN.md, the trace contract).
func TestClauseForm(t *testing.T) {
	for _, c := range []struct {
		c  string
		ok bool
	}{
		{"EN 1992-1-1:2004 5.8.3.1(1), Eq. (5.13N)", true},
		{"EN 1992-1-1:2004 3.1.6(1)P, Eq. (3.15)", true},
		{"EN 1992-1-1:2004 Annex B, Eq. (B.1), (B.2)", true},
		{"EN 1990:2002 A1.2.2(1), Table A1.1", true},
		{"EN 1990:2002 A1.3.1(4), Table A1.2(B)", true},
		{"EN 1992-1-2:2004 5.3.2(2), note", true},
		{"EN 1992-1-2:2004 5.3.2, Table 5.2a", true},
		{"EN 1992-1-1:2004 5.8.8.2(1)-(2), Fig. 5.7; 6.1(4)", true},
		{"EN 1992-1-1:2004 5.8.7.2(1), Eq. (5.22)-(5.23)", true},
		{"common practice", true},
		{"common practice (simply supported beam reaction)", true},
		{"input", true},
		{"chosen: the least steel that passes every check", true},
		{"EN 1992-1-2:2004 Figure 5.2", false}, // "Fig." is the one form
		{"EC2 5.8.3", false},
		{"EN 1992-1-1 5.8.3", false}, // edition missing
		{"5.8.3.1", false},
		{"", false},
		{"common practice, no source", false},
	} {
		if got := ClauseForm(c.c); got != c.ok {
			t.Errorf("ClauseForm(%q) = %v, want %v", c.c, got, c.ok)
		}
	}
}

// A value given to the calculation (an input or a standard's table value) and a value the design
// chose or took over from another design are told apart by the clause (DESIGN.md, the trace
// contract): the revision compare lists the first as inputs and the second as results.
func TestGivenAndChosen(t *testing.T) {
	for _, c := range []struct {
		s             Step
		given, chosen bool
	}{
		{Input("g", "Façade line load", "input", "g", "N/mm", 9.5), true, false},
		{Table("f", "fck", "EN 1992-1-1:2004 Table 3.1", "C30/37", "f_ck", "MPa", 30), true, false},
		{Input("n", "Number of bars", ClauseChosen+"the least steel that passes every check", "n", "", 8), false, true},
		{Input("a", "Bars of the lift above", ClauseAbove, "A_s", "mm2", 1257), false, true},
		{Formula("F", "Load", "common practice", "F", "N", 1, "w", A("w", Const(1, "w", ""))), false, false},
		{Check("c", "Check", "EN 1992-1-1:2004 6.1", "a ≤ b", 0.5, "a", A("a", Const(0.5, "a", ""))), false, false},
	} {
		if Given(c.s) != c.given || Chosen(c.s) != c.chosen {
			t.Errorf("%s (%s, %q): Given %v, Chosen %v; want %v, %v", c.s.ID, c.s.Kind, c.s.Clause, Given(c.s), Chosen(c.s), c.given, c.chosen)
		}
	}
}
