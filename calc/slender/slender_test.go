package slender

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

func q(v float64) trace.Q { return trace.Const(v, "x", "") }

func near(t *testing.T, name string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Max(math.Abs(want), 1e-12) {
		t.Errorf("%s = %.9g, want %.9g (rel tol %g)", name, got, want, rel)
	}
}

// Each case is evaluated by hand from the clause formula it names; every step must
// also reproduce itself through its recorded expression.
func TestClauseFormulas(t *testing.T) {
	cases := []struct {
		name string
		step trace.Step
		want float64
	}{
		// EN 1992-1-1:2004 5.2(5): αh = 2/√l within [2/3, 1].
		{"alphaH l=3m", AlphaH("a", q(3000)), 1},
		{"alphaH l=6.25m", AlphaH("a", q(6250)), 2 / 2.5},
		{"alphaH l=16m", AlphaH("a", q(16000)), 2.0 / 3},
		// EN 1992-1-1:2004 5.2(5): αm = √(0.5(1+1/m)); m = 1 gives 1, m = 4 gives √0.625.
		{"alphaM m=1", AlphaM("a", q(1)), 1},
		{"alphaM m=4", AlphaM("a", q(4)), math.Sqrt(0.625)},
		// EN 1992-1-1:2004 5.2(7) Eq. (5.2): ei = θi·l0/2; θi = 1/200, l0 = 4000 → 10 mm.
		{"ei", EccentricityFromInclination("e", q(0.005), q(4000)), 10},
		// EN 1992-1-1:2004 5.2(9): ei = l0/400.
		{"ei 400", EccentricityL0Over400("e", q(3600)), 9},
		// EN 1992-1-1:2004 6.1(4): e0 = max(h/30, 20 mm).
		{"e0 small", MinEccentricity("e", q(450)), 20},
		{"e0 deep", MinEccentricity("e", q(900)), 30},
		// EN 1992-1-1:2004 5.8.8.2(2): |M02| ≥ |M01|, M01 negative in double curvature.
		{"M02", M02("m", q(-80e6), q(50e6)), 80e6},
		{"M01 double", M01("m", q(-80e6), q(50e6), q(80e6)), -50e6},
		{"M01 single", M01("m", q(30e6), q(50e6), q(50e6)), 30e6},
		{"M01 zero", M01("m", q(0), q(0), q(0)), 0},
		// EN 1992-1-1:2004 5.8.3.2(1): i = h/√12; λ = l0/i.
		{"i", RadiusOfGyration("i", q(300)), 300 / math.Sqrt(12)},
		{"lambda", Slenderness("l", q(3000), q(100)), 30},
		// EN 1992-1-1:2004 5.8.3.1(1): A, B, C, λlim = 20ABC/√n.
		{"A", FactorA("a", q(2)), 1 / 1.4},
		{"B", FactorB("b", q(0.5)), math.Sqrt(2)},
		{"rm zero", MomentRatio("r", q(0), q(0)), 1},
		{"rm", MomentRatio("r", q(-20e6), q(40e6)), -0.5},
		{"C", FactorC("c", q(-0.5)), 2.2},
		{"lambdaLim", LambdaLim("l", q(20), q(0.7), q(1.1), q(0.7), q(0.49)), 20 * 0.7 * 1.1 * 0.7 / 0.7},
		{"slender yes", IsSlender("s", q(40), q(30)), 1},
		{"slender no", IsSlender("s", q(30), q(30)), 0},
		// EN 1992-1-1:2004 5.8.8.3: εyd, d, 1/r0, Kr, β, Kφ, 1/r.
		{"eps_yd", YieldStrain("e", q(434.78), q(200000)), 434.78 / 200000},
		{"d", EffectiveDepth("d", q(400), q(140)), 340},
		{"1/r0", BaseCurvature("r", q(0.002174), q(340)), 0.002174 / (0.45 * 340)},
		{"Kr", Kr("k", q(0.6), q(0.3)), (1.3 - 0.6) / (1.3 - 0.4)},
		{"Kr capped", Kr("k", q(0.2), q(0.3)), 1},
		{"Kr overloaded", Kr("k", q(1.5), q(0.3)), 0},
		{"beta", Beta("b", q(30), q(60)), 0.35 + 0.15 - 0.4},
		{"Kphi", Kphi("k", q(0.1), q(2)), 1.2},
		{"Kphi floor", Kphi("k", q(-0.2), q(2)), 1},
		{"1/r", Curvature("c", q(0.8), q(1.2), q(1e-5)), 0.96e-5},
		// EN 1992-1-1:2004 5.8.8.2(3)-(4): e2 = (1/r)l0²/c, M2 = NEd·e2.
		{"e2", SecondOrderEccentricity("e", q(1e-5), q(5000), q(10)), 25},
		{"M2", SecondOrderMoment("m", q(1e6), q(25)), 25e6},
		// EN 1992-1-1:2004 5.8.8.2(2) Eq. (5.32).
		{"M0e", EquivalentMoment("m", q(-50), q(100)), 40},
		{"M0e single", EquivalentMoment("m", q(50), q(100)), 80},
		// Design moment envelope, 5.8.8.2 with 6.1(4).
		{"MEd mid", DesignMomentSlender("m", q(50), q(100), q(80), q(30), q(1000), q(0.02)), 110},
		{"MEd end", DesignMomentSlender("m", q(50), q(100), q(80), q(10), q(1000), q(0.02)), 100},
		{"MEd e0", DesignMomentSlender("m", q(5), q(10), q(8), q(1), q(1000), q(20)), 20000},
		{"MEd stocky", DesignMomentStocky("m", q(100), q(1000), q(0.02)), 100},
		// EN 1992-1-1:2004 5.8.9(3) Eq. (5.38a), (5.38b).
		{"5.38a yes", SlendernessRatiosClose("c", q(30), q(50)), 1},
		{"5.38a no", SlendernessRatiosClose("c", q(30), q(70)), 0},
		{"5.38b yes", EccentricitiesApart("c", q(100), q(5), q(300), q(300)), 1},
		{"5.38b no", EccentricitiesApart("c", q(100), q(50), q(300), q(300)), 0},
		{"5.38b one zero", EccentricitiesApart("c", q(100), q(0), q(300), q(300)), 1},
		// EN 1992-1-1:2004 5.8.9(4): a = 1.0, 1.5, 2.0 at NEd/NRd = 0.1, 0.7, 1.0, linear between.
		{"a 0.05", ExponentA("a", q(5), q(100)), 1},
		{"a 0.4", ExponentA("a", q(40), q(100)), 1.25},
		{"a 0.7", ExponentA("a", q(70), q(100)), 1.5},
		{"a 0.85", ExponentA("a", q(85), q(100)), 1.75},
		{"a 1.2", ExponentA("a", q(120), q(100)), 2},
		// EN 1992-1-1:2004 5.8.9(4) Eq. (5.39).
		{"5.39", BiaxialRatio("r", q(50), q(100), q(30), q(60), q(1.5)), 2 * math.Pow(0.5, 1.5)},
	}
	for _, c := range cases {
		near(t, c.name, c.step.Value, c.want, 1e-9)
		if err := trace.Recheck(c.step, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}

// EN 1992-1-1:2004 5.8.8.3(2): is = √(Σ n·c²/Σ n) over the rows of equal bars. The traced step
// takes the outer rows' distance and the bar counts from their steps and sums the evenly spaced
// rows in closed form; it must equal the row-by-row sum for every symmetric pattern.
func TestReinforcementGyration(t *testing.T) {
	// Eight bars, three on each face at ±190 mm and two on the axis: is² = 6·190²/8 (by hand).
	s := ReinforcementGyration("i_s", trace.Step{ID: "bars/z_c", Unit: "mm", Value: 190}.Q(),
		trace.Step{ID: "bars/nb", Value: 3}.Q(), trace.Step{ID: "bars/nh", Value: 3}.Q())
	near(t, "is 8 bars", s.Value, math.Sqrt(6*190*190/8.0), 1e-12)
	if err := trace.Recheck(s, 1e-9); err != nil {
		t.Error(err)
	}
	for _, a := range s.Args {
		if a.From == "" {
			t.Errorf("argument %s enters as a bare number", a.Name)
		}
	}
	for m := 2; m <= 9; m++ {
		for no := 2; no <= 7; no++ {
			const c = 157.0
			layers := []Layer{{c, no}, {-c, no}}
			for i := 1; i < m-1; i++ {
				layers = append(layers, Layer{-c + 2*c*float64(i)/float64(m-1), 2})
			}
			near(t, "is m="+itoa(m)+" n_o="+itoa(no), SymmetricGyrationValue(c, float64(no), float64(m)), GyrationValue(layers), 1e-12)
		}
	}
}
