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
