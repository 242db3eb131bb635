package creep

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// q is a test input that no step produced.
func q(x float64) trace.Q { return trace.Const(x, "x", "") }

// relErr returns |got/want − 1|, or |got| when want is 0.
func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// Each case is evaluated by hand (to seven significant figures, hence the tolerance 1e-6)
// from the equation it names; every step must also reproduce itself through its expression.
func TestClauseFormulas(t *testing.T) {
	const fcm = 38.0 // C30/37, EN 1992-1-1:2004 Table 3.1
	cases := []struct {
		name string
		step trace.Step
		want float64
	}{
		// EN 1992-1-1:2004 Annex B, Eq. (B.6): h0 = 2Ac/u; 350 × 500 on all faces: 2·175000/1700.
		{"h0", NotionalSize("h", q(175000), q(1700)), 205.8824},
		{"h0 rect", NotionalSizeRect("h", q(350), q(500)), 205.8824},
		// EN 1992-1-1:2004 Annex B, Eq. (B.8c): α = (35/38)^0.7, ^0.2, ^0.5.
		{"alpha1", Alpha1("a", q(fcm)), 0.9440589},
		{"alpha2", Alpha2("a", q(fcm)), 0.9836869},
		{"alpha3", Alpha3("a", q(fcm)), 0.9597149},
		// EN 1992-1-1:2004 Annex B, Eq. (B.3a), fcm = 33: 1 + 0.5/(0.1·300^(1/3)) = 1 + 0.5/0.6694330.
		{"phiRH B.3a", PhiRH("p", q(50), q(300), q(33), q(0.5), q(0.5)), 1.746901},
		// EN 1992-1-1:2004 Annex B, Eq. (B.3b), fcm = 38: (1 + 0.7469008·0.9440589)·0.9836869.
		{"phiRH B.3b", PhiRH("p", q(50), q(300), q(fcm), q(0.9440589490), q(0.9836869039)), 1.677303},
		// Same at RH 80 % and h0 = 205.88 mm: (1 + 0.3387066·0.9440589)·0.9836869.
		{"phiRH B.3b 80", PhiRH("p", q(80), q(205.8823529411765), q(fcm), q(0.9440589490), q(0.9836869039)), 1.298230},
		// EN 1992-1-1:2004 Annex B, Eq. (B.4): 16.8/√38.
		{"beta fcm", BetaFcm("b", q(fcm)), 2.725320},
		// EN 1992-1-1:2004 Annex B, Eq. (B.5): 1/(0.1 + 28^0.2) = 1/(0.1 + 1.946745).
		{"beta t0 28", BetaT0("b", q(28)), 0.4884495},
		{"beta t0 1", BetaT0("b", q(1)), 1 / 1.1},
		// EN 1992-1-1:2004 Annex B, Eq. (B.9): class N (α = 0) leaves t0 unchanged.
		{"t0 N", AdjustedAge("t", q(28), q(0)), 28},
		// Class S (α = −1) at 7 days: 7/(9/(2 + 7^1.2) + 1) = 7/1.729936.
		{"t0 S", AdjustedAge("t", q(7), q(-1)), 4.046471},
		// Class R (α = 1) at 7 days: 7·1.729936.
		{"t0 R", AdjustedAge("t", q(7), q(1)), 12.10932},
		// The lower bound of 0.5 days: class S at 2 days gives 0.6463516; at 0.1 days, 0.0186 → 0.5.
		{"t0 S 2", AdjustedAge("t", q(2), q(-1)), 0.6463516},
		{"t0 floor", AdjustedAge("t", q(0.1), q(-1)), 0.5},
		// EN 1992-1-1:2004 Annex B, Eq. (B.1), (B.2): φ0 = φRH·β(fcm)·β(t0) = 1.677303·2.725320·0.4884495.
		{"phi0", Notional("p", q(1.677303), q(2.725320), q(0.4884495)), 2.232794},
		// EN 1992-1-1:2004 Annex B, Eq. (B.8a), fcm = 33, RH 50, h0 = 300:
		// 1.5·(1 + 0.6^18)·300 + 250 = 700.0457.
		{"betaH B.8a", BetaH("b", q(50), q(300), q(33), q(1)), 700.0457},
		// Eq. (B.8b), fcm = 38: 1.5·(1 + 0.6^18)·300 + 250·0.9597149 = 689.9744.
		{"betaH B.8b", BetaH("b", q(50), q(300), q(fcm), q(0.9597148699)), 689.9744},
		// The caps: 1500 for fcm ≤ 35 and 1500·α3 above (RH 95 %, h0 = 1500 mm).
		{"betaH cap a", BetaH("b", q(95), q(1500), q(33), q(1)), 1500},
		{"betaH cap b", BetaH("b", q(95), q(1500), q(58), q(math.Sqrt(35.0/58))), 1500 * 0.7768193},
		// EN 1992-1-1:2004 Annex B, Eq. (B.7): ((10000 − 28)/(600 + 10000 − 28))^0.3.
		{"betaC", BetaC("b", q(10000), q(28), q(600)), 0.9826244},
		{"betaC before loading", BetaC("b", q(20), q(28), q(600)), 0},
		// EN 1992-1-1:2004 Annex B, Eq. (B.1).
		{"phi(t)", AtTime("p", q(2.5), q(0.8)), 2},
		// EN 1992-1-1:2004 5.8.4(2), Eq. (5.19): φef = 2.4·0.65.
		{"phi_ef", EffectiveRatio("p", q(2.4), q(0.65)), 1.56},
		// EN 1992-1-1:2004 5.8.4(4).
		{"ignore yes", MayIgnoreStep("c", q(1.9), q(60), q(200e6), q(1e6), q(180)), 1},
		{"ignore phi", MayIgnoreStep("c", q(2.1), q(60), q(200e6), q(1e6), q(180)), 0},
		{"ignore lambda", MayIgnoreStep("c", q(1.9), q(76), q(200e6), q(1e6), q(180)), 0},
		{"ignore e", MayIgnoreStep("c", q(1.9), q(60), q(170e6), q(1e6), q(180)), 0},
		{"ignore bounds", MayIgnoreStep("c", q(2), q(75), q(180e6), q(1e6), q(180)), 1},
	}
	for _, c := range cases {
		if e := relErr(c.step.Value, c.want); e > 1e-6 {
			t.Errorf("%s = %.9g, want %.9g (rel tol 1e-6)", c.name, c.step.Value, c.want)
		}
		if err := trace.Recheck(c.step, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}

func TestCementExponent(t *testing.T) {
	// EN 1992-1-1:2004 Annex B, Eq. (B.9): α = −1 for class S, 0 for N, 1 for R.
	for class, want := range map[string]float64{"S": -1, "N": 0, "R": 1} {
		s, ok := CementExponentStep("a", class)
		if !ok || s.Value != want || s.Kind != trace.KindTable {
			t.Errorf("class %s: got %v %v, want %v", class, s.Value, ok, want)
		}
	}
	if _, ok := CementExponentStep("a", "X"); ok {
		t.Error("class X accepted")
	}
}

func TestMayIgnore(t *testing.T) {
	// EN 1992-1-1:2004 5.8.4(4): all three conditions together.
	cases := []struct {
		phi, lambda, m, n, h float64
		want                 bool
	}{
		{1.8, 50, 100e6, 500e3, 200, true},    // e = 200 mm = h
		{1.8, 50, 99e6, 500e3, 200, false},    // e = 198 mm < h
		{2.01, 50, 100e6, 500e3, 200, false},  // φ > 2
		{1.8, 75.5, 100e6, 500e3, 200, false}, // λ > 75
		{1.8, 50, 10e6, 0, 200, true},         // no axial force: e infinite
	}
	for _, c := range cases {
		if got := MayIgnore(c.phi, c.lambda, c.m, c.n, c.h); got != c.want {
			t.Errorf("MayIgnore(%v, %v, %v, %v, %v) = %v", c.phi, c.lambda, c.m, c.n, c.h, got)
		}
	}
}

// The chain recorded by Coefficient reproduces itself, agrees with FinalValue and with the hand
// evaluation of C30/37, RH 50 %, h0 = 300 mm, t0 = 28 days, class N (2.232794, see above).
func TestCoefficient(t *testing.T) {
	var l trace.Log
	got := Coefficient(&l, "creep/", trace.Const(38, "f_cm", "MPa"), trace.Const(50, "RH", "%"),
		trace.Const(300, "h_0", "mm"), trace.Const(28, "t_0,T", "d"), trace.Const(0, "α", ""))
	if relErr(got.V, 2.232794) > 1e-6 {
		t.Errorf("phi_inf = %.9g, want %.9g", got.V, 2.232794)
	}
	if f := FinalValue(38, 50, 300, 28, 0); relErr(f, got.V) > 1e-12 {
		t.Errorf("FinalValue = %.12g, traced %.12g", f, got.V)
	}
	if len(l.Steps) != 7 {
		t.Errorf("%d steps, want 7 (α1, α2, φRH, β(fcm), t0, β(t0), φ)", len(l.Steps))
	}
	for _, s := range l.Steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
	// fcm ≤ 35 MPa: no α steps, Eq. (B.3a); C25/30 (fcm = 33), RH 80 %, h0 = 205.88 mm, t0 = 28 d:
	// 1.338707·2.924505·0.4884495 = 1.912306 (hand evaluation).
	l = trace.Log{}
	got = Coefficient(&l, "creep/", trace.Const(33, "f_cm", "MPa"), trace.Const(80, "RH", "%"),
		trace.Const(205.8823529411765, "h_0", "mm"), trace.Const(28, "t_0,T", "d"), trace.Const(0, "α", ""))
	if relErr(got.V, 1.912306) > 1e-6 {
		t.Errorf("phi_inf B.3a = %.9g, want %.9g", got.V, 1.912306)
	}
	if len(l.Steps) != 5 {
		t.Errorf("%d steps, want 5", len(l.Steps))
	}
	for _, s := range l.Steps {
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
}

// Readings of EN 1992-1-1:2004 Figure 3.1 (φ(∞, t0) for cement class N), from memory, to the
// nearest 0.1. The nomogram is drawn from Annex B, so these readings are not independent of the
// formulas; they guard against gross errors (a wrong exponent, a unit slip), hence the wide
// tolerance of ±0.2.
func TestFigure31(t *testing.T) {
	cases := []struct {
		fck, rh, h0, t0, read float64
	}{
		{20, 50, 100, 1, 6.0},   // Figure 3.1 a), inside conditions, top of the scale
		{25, 50, 300, 28, 2.5},  // Figure 3.1 a)
		{30, 50, 500, 28, 2.1},  // Figure 3.1 a)
		{50, 50, 100, 1, 3.2},   // Figure 3.1 a)
		{30, 80, 300, 28, 1.7},  // Figure 3.1 b), outside conditions
		{40, 80, 500, 7, 1.7},   // Figure 3.1 b)
		{20, 80, 100, 100, 1.7}, // Figure 3.1 b)
	}
	for _, c := range cases {
		got := FinalValue(c.fck+8, c.rh, c.h0, c.t0, 0)
		if math.Abs(got-c.read) > 0.2 {
			t.Errorf("C%g RH %g h0 %g t0 %g: φ = %.2f, Figure 3.1 reads %.1f (±0.2)", c.fck, c.rh, c.h0, c.t0, got, c.read)
		}
	}
}

// Drying less (higher RH, larger h0) and loading later give less creep; stronger concrete creeps less.
// Common practice, no source: the trends Figure 3.1 shows.
func TestTrends(t *testing.T) {
	base := FinalValue(38, 50, 300, 28, 0)
	for name, v := range map[string]float64{
		"RH 80":  FinalValue(38, 80, 300, 28, 0),
		"h0 600": FinalValue(38, 50, 600, 28, 0),
		"t0 90":  FinalValue(38, 50, 300, 90, 0),
		"C40/50": FinalValue(48, 50, 300, 28, 0),
		"R":      FinalValue(38, 50, 300, 28, 1),
	} {
		if !(v < base) {
			t.Errorf("%s: φ = %g not below %g", name, v, base)
		}
	}
	if !(FinalValue(38, 50, 300, 28, -1) > base) {
		t.Error("class S should creep more than class N")
	}
}
