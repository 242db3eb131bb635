package slender

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// Each case is evaluated by hand from the equation it names (to seven significant figures where
// the result is not exact, hence the tolerance 1e-6); every step must reproduce itself.
// The chain follows one column, an invented test input: 350 × 500 mm bent about y (h = 500),
// C30/37, fcd = 17 MPa, l0 = 6 m, NEd = 2150 kN, φef = 0.8, eight 20 mm bars, three on each
// face at ±190 mm and two on the axis, M0Ed = 100 kNm.
func TestStiffnessFormulas(t *testing.T) {
	pi2 := math.Pi * math.Pi
	cases := []struct {
		name string
		step trace.Step
		want float64
	}{
		// EN 1992-1-1:2004 5.8.7.2(1): ρ = As/Ac = 2513.274/175000.
		{"rho", SteelRatio("r", q(2513.274123), q(175000)), 0.01436157},
		// EN 1992-1-1:2004 5.8.6(3), Eq. (5.20): Ecd = Ecm/1.2 with Ecm = 32836.57 MPa (Table 3.1 expression).
		{"Ecd", Ecd("e", q(32836.56803), q(GammaCE)), 27363.81},
		// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.23): k1 = √(30/20).
		{"k1", K1("k", q(30)), 1.224745},
		// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.24): n = 2150e3/(175000·17) = 0.7226891,
		// λ = 6000/144.3376 = 41.56922, k2 = 0.7226891·41.56922/170 = 0.1767154 ≤ 0.20.
		{"k2", K2("k", q(0.7226890756), q(41.56921938)), 0.1767154},
		{"k2 capped", K2("k", q(0.9), q(60)), 0.2},
		// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.25): k2 = n·0.30 ≤ 0.20.
		{"k2 no lambda", K2NoSlenderness("k", q(0.5)), 0.15},
		{"k2 no lambda capped", K2NoSlenderness("k", q(0.8)), 0.2},
		// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.22): Kc = 1.224745·0.1767154/1.8.
		{"Kc", Kc("k", q(1.224744871), q(0.1767154161), q(0.8)), 0.1202396},
		// EN 1992-1-1:2004 5.8.7.2(2), Eq. (5.22): Ks = 1.
		{"Ks", Ks("k", q(0.0144)), 1},
		// EN 1992-1-1:2004 5.8.7.2(3), Eq. (5.26): Kc = 0.3/(1 + 0.5·0.8), Ks = 0.
		{"Kc simplified", KcSimplified("k", q(0.0144), q(0.8)), 0.3 / 1.4},
		{"Ks simplified", KsSimplified("k"), 0},
		// Ic = b·h³/12 = 350·500³/12 (common practice, no source: second moment of a rectangle).
		{"Ic", ConcreteInertia("i", q(350), q(500)), 3.645833e9},
		// Is = As·is² with is² = 6·190²/8: 2513.274·27075 = 100π·6·190² (common practice, no source).
		{"Is", SteelInertia("i", q(2513.274123), q(164.5448267)), 6.804690e7},
		// EN 1992-1-1:2004 5.8.7.2(1), Eq. (5.21): EI = 0.1202396·27363.81·3.645833e9 + 1·200000·6.804690e7.
		{"EI", NominalStiffness("ei", q(0.1202396108), q(27363.80669), q(3.645833333e9), q(1), q(200000), q(6.804689688e7)), 2.560495e13},
		// EN 1992-1-1:2004 5.8.7.3(1): NB = π²·2.560495e13/6000².
		{"NB", BucklingLoad("nb", q(2.560494931e13), q(6000)), 7.019742e6},
		// EN 1992-1-1:2004 5.8.7.3(2)-(4): c0 = 8, 9.6, 12; π² gives β = 1.
		{"c0 constant", C0("c", ShapeConstant), 8},
		{"c0 parabolic", C0("c", ShapeParabolic), 9.6},
		{"c0 triangular", C0("c", ShapeTriangular), 12},
		{"c0 other", C0("c", ShapeOther), pi2},
		// EN 1992-1-1:2004 5.8.7.3(2), Eq. (5.29): β = π²/c0.
		{"beta 8", MomentBeta("b", q(8)), 1.233701},
		{"beta 9.6", MomentBeta("b", q(9.6)), 1.028084},
		{"beta 12", MomentBeta("b", q(12)), 0.8224670},
		{"beta 1", MomentBeta("b", q(pi2)), 1},
		// EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28): 1 + 1.233701/(7019.742/2150 − 1).
		{"factor", Magnification("m", q(1.23370055), q(7.019742233e6), q(2.15e6)), 1.544681},
		// EN 1992-1-1:2004 5.8.7.3(4), Eq. (5.30): β = 1 gives 1/(1 − NEd/NB) = 1/(1 − 0.25).
		{"factor 5.30", Magnification("m", q(1), q(4e6), q(1e6)), 4.0 / 3},
		// No compression: no magnification (common practice, no source: (5.28) tends to 1 as NEd → 0).
		{"factor N=0", Magnification("m", q(1.2337), q(7e6), q(0)), 1},
		{"factor tension", Magnification("m", q(1.2337), q(7e6), q(-5e5)), 1},
		// EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28): MEd = 100 kNm·1.544681.
		{"MEd", MagnifiedMoment("m", q(100e6), q(1.544681023)), 154.4681e6},
		// The design moment of the method: the magnified moment, not less than the end moment with
		// its imperfection (5.8.8.2(2): M0e stands for the end moments only between the ends) nor
		// NEd·e0 (6.1(4)). Magnified 154.4681 kNm governs; end moment 160 kNm governs; NEd·e0 =
		// 2150 kN · 20 mm = 43 kNm governs.
		{"MEd stiffness mid", DesignMomentStiffness("m", q(154.4681e6), q(120e6), q(2.15e6), q(20)), 154.4681e6},
		{"MEd stiffness end", DesignMomentStiffness("m", q(154.4681e6), q(160e6), q(2.15e6), q(20)), 160e6},
		{"MEd stiffness e0", DesignMomentStiffness("m", q(30e6), q(25e6), q(2.15e6), q(20)), 43e6},
	}
	for _, c := range cases {
		near(t, c.name, c.step.Value, c.want, 1e-6)
		if err := trace.Recheck(c.step, 1e-9); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
	}
}

// The value functions chained as a design would chain them reproduce the hand evaluation above.
func TestStiffnessValues(t *testing.T) {
	ecd := EcdValue(22000*math.Pow(3.8, 0.3), GammaCE) // Ecm of C30/37 by the expression of Table 3.1
	n := 2150e3 / (175000 * 17.0)
	lambda := 6000 / (500 / math.Sqrt(12))
	kc := KcValue(K1Value(30), K2Value(n, lambda), 0.8)
	as := 8 * math.Pi * 100
	is := GyrationValue([]Layer{{190, 3}, {0, 2}, {-190, 3}})
	ei := NominalStiffnessValue(kc, ecd, ConcreteInertiaValue(350, 500), 1, 200000, SteelInertiaValue(as, is))
	near(t, "EI", ei, 2.560495e13, 1e-6)
	nB := BucklingLoadValue(ei, 6000)
	near(t, "NB", nB, 7.019742e6, 1e-6)
	f, ok := MagnificationValue(MomentBetaValue(C0Value(ShapeConstant)), nB, 2150e3)
	near(t, "factor", f, 1.544681, 1e-6)
	if !ok {
		t.Error("NEd < NB reported as buckling")
	}
	near(t, "MEd", MagnifiedMomentValue(100e6, f), 154.4681e6, 1e-6)
	// EN 1992-1-1:2004 5.8.7.2(3), Eq. (5.26): EI = 0.3/1.4·Ecd·Ic = 2.137797e13 N·mm².
	near(t, "EI simplified", NominalStiffnessValue(KcSimplifiedValue(0.8), ecd, ConcreteInertiaValue(350, 500), 0, 200000, 6.8e7), 2.137797e13, 1e-6)
}

// NEd ≥ NB: the column buckles (EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28) has no finite positive
// value). The steps report it with a caution and a failed check, never NaN or a negative factor.
func TestBuckling(t *testing.T) {
	for _, nEd := range []float64{7e6, 9e6, 70e6} { // at, above and far above NB = 7000 kN
		nB, ned, beta := q(7e6), q(nEd), q(math.Pi*math.Pi/8)
		m := Magnification("m", beta, nB, ned)
		med := MagnifiedMoment("med", q(100e6), m.Q())
		chk := BucklingCheck("b", ned, nB)
		for _, s := range []trace.Step{m, med, chk} {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Errorf("NEd %g: %v", nEd, err)
			}
			if s.Value < 0 || !trace.Finite(s.Value) {
				t.Errorf("NEd %g: step %s value %g", nEd, s.ID, s.Value)
			}
			if len(s.Cautions()) == 0 {
				t.Errorf("NEd %g: step %s has no caution", nEd, s.ID)
			}
		}
		if m.Value != 0 || med.Value != 0 {
			t.Errorf("NEd %g: factor %g, MEd %g; want 0 for a buckled column", nEd, m.Value, med.Value)
		}
		if chk.Verdict != trace.Fail {
			t.Errorf("NEd %g: buckling check %s, want fail", nEd, chk.Verdict)
		}
		if _, ok := MagnificationValue(beta.V, nB.V, nEd); ok || !Buckles(nEd, nB.V) {
			t.Errorf("NEd %g: value functions do not report buckling", nEd)
		}
	}
	// Below NB the check passes with ratio NEd/NB and carries no caution.
	chk := BucklingCheck("b", q(2.15e6), q(7.019742e6))
	near(t, "ratio", chk.Value, 2.15/7.019742, 1e-9)
	if chk.Verdict != trace.Pass || len(chk.Cautions()) != 0 || trace.Recheck(chk, 1e-9) != nil {
		t.Errorf("NEd < NB: verdict %s, cautions %v", chk.Verdict, chk.Cautions())
	}
	// A zero stiffness under compression buckles; without compression it does not.
	if c := BucklingCheck("b", q(1e3), q(0)); c.Verdict != trace.Fail || trace.Recheck(c, 1e-9) != nil {
		t.Error("NB = 0 under compression should fail")
	}
	if c := BucklingCheck("b", q(0), q(0)); c.Verdict != trace.Pass || trace.Recheck(c, 1e-9) != nil {
		t.Error("NB = 0 without compression should pass")
	}
}

// The range cautions of EN 1992-1-1:2004 5.8.7.2(2) (ρ ≥ 0.002) and (3) (ρ ≥ 0.01).
func TestStiffnessRange(t *testing.T) {
	if len(Ks("k", q(0.0015)).Cautions()) == 0 || len(Ks("k", q(0.002)).Cautions()) != 0 {
		t.Error("Ks caution should mark ρ < 0.002 only")
	}
	if len(KcSimplified("k", q(0.009), q(1)).Cautions()) == 0 || len(KcSimplified("k", q(0.01), q(1)).Cautions()) != 0 {
		t.Error("simplified Kc caution should mark ρ < 0.01 only")
	}
}

// The arguments of the design moment of the nominal stiffness method are named for what they
// carry: the magnified moment is M_mag, the end moment with its imperfection M_0Ed
// (EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28); 5.8.8.2(2)).
func TestDesignMomentStiffnessArgs(t *testing.T) {
	mag := trace.Step{ID: "y/M_mag", Symbol: "M_Ed", Unit: "Nmm", Value: 154.4681e6}.Q()
	end := trace.Step{ID: "y/M02i", Symbol: "M_02,y", Unit: "Nmm", Value: 120e6}.Q()
	s := DesignMomentStiffness("y/MEd_stiff", mag, end, q(2.15e6), q(20))
	from := map[string]string{}
	for _, a := range s.Args {
		from[a.Name] = a.From
	}
	if from["M_mag"] != "y/M_mag" || from["M_0Ed"] != "y/M02i" || len(s.Args) != 4 {
		t.Errorf("arguments %+v: the magnified moment must be M_mag, the end moment M_0Ed", s.Args)
	}
	if !trace.ClauseForm(s.Clause) {
		t.Errorf("clause %q", s.Clause)
	}
}
