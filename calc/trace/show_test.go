package trace

import (
	"math"
	"strings"
	"testing"
)

// The display functions: floor and ceil take a quotient within 1e-9 of a whole number for that
// number, as the evaluation expressions do with "+ 0.000000001", and rounddown(x, step) is
// x rounded down to a multiple of step, roundup(x, step) up (common practice, no source).
func TestShowFunctions(t *testing.T) {
	for _, c := range []struct {
		expr string
		want float64
	}{
		{"floor(7 / 2)", 3},
		{"floor(0.3 / 0.1)", 3}, // 2.9999999999999996 in floating point
		{"ceil(7 / 2)", 4},
		{"ceil(0.7 / 0.1)", 7}, // 7.000000000000001 in floating point
		{"ceil(6)", 6},
		{"rounddown(243, 25)", 225},
		{"rounddown(300, 25)", 300},
		{"rounddown(0.3, 0.1)", 0.30000000000000004},
		{"roundup(616.2, 25)", 625},
		{"roundup(600, 25)", 600},
		{"roundup(0.7, 0.1)", 0.7000000000000001}, // 7.000000000000001 steps taken for 7
		{"pi * 20 ** 2 / 4", math.Pi * 100},       // the area of a 20 mm bar, π·φ²/4
	} {
		s := Formula("x", "x", "common practice", "x", "", c.want, "x", A("x", Const(c.want, "x", ""))).Shown(c.expr)
		got, err := EvalShow(s)
		if err != nil {
			t.Errorf("%s: %v", c.expr, err)
			continue
		}
		if math.Abs(got-c.want) > 1e-12*math.Max(1, math.Abs(c.want)) {
			t.Errorf("%s = %.17g, want %.17g", c.expr, got, c.want)
		}
	}
}

// A display form is held to the step's value; a result in words to its meaning.
func TestRecheckShow(t *testing.T) {
	lam := func(y, z float64) []Arg {
		return []Arg{A("lambda_y", Const(y, "λ_y", "")), A("lambda_z", Const(z, "λ_z", ""))}
	}
	cond := "lambda_y / lambda_z <= 2 && lambda_z / lambda_y <= 2"
	// EN 1992-1-1:2004 5.8.9(3), Eq. (5.38a): λy/λz = 60/40 = 1.5 ≤ 2 and 40/60 ≤ 2: met.
	met := Formula("c_a", "Slenderness ratios within a factor 2", "EN 1992-1-1:2004 5.8.9(3), Eq. (5.38a)", "c_a", "", 1,
		"lambda_y <= 2 * lambda_z && lambda_z <= 2 * lambda_y ? 1 : 0", lam(60, 40)...).Condition(cond)
	// λy/λz = 90/40 = 2.25 > 2: not met.
	apart := Formula("c_a", "Slenderness ratios within a factor 2", "EN 1992-1-1:2004 5.8.9(3), Eq. (5.38a)", "c_a", "", 0,
		"lambda_y <= 2 * lambda_z && lambda_z <= 2 * lambda_y ? 1 : 0", lam(90, 40)...).Condition(cond)
	if met.Show.Result != "yes" || apart.Show.Result != "no" {
		t.Errorf("results %q and %q, want yes and no", met.Show.Result, apart.Show.Result)
	}
	for _, s := range []Step{met, apart} {
		if err := Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		if err := RecheckShow(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
	// A display form that disagrees with the value is caught: yes on a 0, a formula off the value.
	wrong := apart
	wrong.Show = &Display{Expr: cond, Result: "yes"}
	if RecheckShow(wrong, 1e-9) == nil {
		t.Error("yes on a value of 0 not caught")
	}
	off := Formula("f", "f", "common practice", "f", "", 21.25, "alpha * f / gamma",
		A("alpha", Const(0.85, "α", "")), A("f", Const(37.5, "f", "")), A("gamma", Const(1.5, "γ", ""))).Shown("f / gamma")
	if err := RecheckShow(off, 1e-9); err == nil || !strings.Contains(err.Error(), "display form") {
		t.Errorf("a display form off the value: %v", err)
	}
	// A failed check without a ratio reads "not met" and carries no formula; on a passed check
	// "not met" is caught.
	un := Check("bars/none", "A bar pattern that fits", "EN 1992-1-1:2004 8.2(2)", "a pattern fits", 2, "2").Unmet()
	if un.Show.Result != "not met" || un.Show.Expr != "" || RecheckShow(un, 1e-9) != nil || Recheck(un, 1e-9) != nil {
		t.Errorf("unmet check: %+v", un.Show)
	}
	passed := Check("c", "c", "common practice", "a ≤ b", 0.5, "a", A("a", Const(0.5, "a", ""))).Unmet()
	if RecheckShow(passed, 1e-9) == nil {
		t.Error("not met on a passed check not caught")
	}
	// Shown keeps a result in words already given.
	if s := met.Shown("lambda_y <= 2 * lambda_z && lambda_z <= 2 * lambda_y"); s.Show.Result != "yes" || RecheckShow(s, 1e-9) != nil {
		t.Errorf("Shown after Condition: %+v", s.Show)
	}
}
