package section

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// traceCircle records the steps of st and checks them: every step rechecks to relative
// 1e-9 (the trace contract in DESIGN.md), IDs are unique, clauses are in the sheets' form,
// every argument's producing step exists, the traced MRd equals |M| of the state to relative
// 1e-12 and the solve residual is the state's N − NEd. Common practice, no source.
func traceCircle(t *testing.T, c *Circle, st CircleState, ned float64, what string) map[string]trace.Step {
	t.Helper()
	log := &trace.Log{Prefix: "K1/L1/", Group: "section"}
	refs := CircleRefs{D: "K1/D", Fcd: "K1/mat/fcd", Fyd: "K1/mat/fyd", Es: "K1/mat/Es", EpsPeak: "K1/mat/eps_c2",
		EpsUlt: "K1/mat/eps_cu2", N: "K1/mat/n", Eta: "K1/mat/eta"}
	nq := trace.Q{V: ned, Symbol: "N_Ed", Unit: "N", From: "K1/L1/NEd"}
	m := c.Trace(log, "circ/", nq, st, refs)
	known := map[string]bool{nq.From: true}
	for _, r := range []string{refs.D, refs.Fcd, refs.Fyd, refs.Es, refs.EpsPeak, refs.EpsUlt, refs.N, refs.Eta} {
		known[r] = true
	}
	byID := map[string]trace.Step{}
	for _, step := range log.Steps {
		if known[step.ID] {
			t.Fatalf("%s: duplicate step ID %s", what, step.ID)
		}
		known[step.ID] = true
		byID[strings.TrimPrefix(step.ID, "K1/L1/circ/")] = step
	}
	for _, step := range log.Steps {
		if err := trace.Recheck(step, 1e-9); err != nil {
			t.Errorf("%s: %v", what, err)
		}
		if err := trace.RecheckShow(step, 1e-9); err != nil {
			t.Errorf("%s: %v", what, err)
		}
		if !trace.ClauseForm(step.Clause) {
			t.Errorf("%s: step %s has clause %q", what, step.ID, step.Clause)
		}
		for _, a := range step.Args {
			if a.From != "" && !known[a.From] {
				t.Errorf("%s: step %s argument %s from unknown step %s", what, step.ID, a.Name, a.From)
			}
		}
	}
	if m.Symbol != "M_Rd" || !relClose(m.V, math.Abs(st.M), 1e-12, 1e-12*c.NRdMax()*c.D) {
		t.Errorf("%s: traced %s = %.15g, state |M| = %.15g", what, m.Symbol, m.V, math.Abs(st.M))
	}
	solve := log.Steps[1] // after the input step of θ
	if solve.Kind != trace.KindSolve || math.Abs(solve.Residual()-(st.N-ned)) > 1e-9*math.Max(c.NRdMax(), 1) {
		t.Errorf("%s: solve step %+v, state residual %g", what, solve, st.N-ned)
	}
	return byID
}

// Every traced step reproduces its value, for both stress blocks, fck 30 and 70, an even
// ring and an uneven layout, several directions, NEd from near tension yield to NRd,max and
// states on both pivots. The invariant is the trace contract of DESIGN.md; common practice,
// no source.
func TestCircleTraceRechecks(t *testing.T) {
	count := 0
	for _, fck := range []float64{30, 70} {
		for _, block := range []Block{ParabolaRectangle, Rectangular} {
			for _, mk := range []func(testing.TB, float64, Block) *Circle{ring8, ringUneven} {
				c := mk(t, fck, block)
				nmin, nmax := c.NRdMin(), c.NRdMax()
				for _, theta := range []float64{0, 0.3, math.Pi/2 + 0.1, -2.5} {
					for _, k := range []float64{0.001, 0.05, 0.2, 0.4, 0.6, 0.8, 0.95, 0.999, 1} {
						ned := nmin + (nmax-nmin)*k
						st, err := c.MRdAt(theta, ned)
						if err != nil {
							t.Fatal(err)
						}
						traceCircle(t, c, st, ned, "MRdAt")
						count++
					}
					for _, k := range []float64{1e-6, 0.1, 0.5, 1, 1.2, 3, math.Inf(1)} {
						st := c.StateAt(theta, k*c.D*1.0001)
						traceCircle(t, c, st, st.N, "StateAt")
						count++
					}
				}
			}
		}
	}
	if count < 500 {
		t.Fatalf("only %d states traced", count)
	}
}

// The steps that are not closed forms of the evaluator are solve steps that name their
// method, with a residual far below the values: the half-angle of the rectangular block's
// segment (closed form checked by the series of cos α, residual below 1e-14) and the
// quadrature of the parabola-rectangle block (checked by a rule of twice the points,
// residual below 1e-11 relative). Tolerances are common practice, no source.
func TestCircleTraceSteps(t *testing.T) {
	for _, block := range []Block{ParabolaRectangle, Rectangular} {
		for _, fck := range []float64{30, 70} {
			c := ring8(t, fck, block)
			st, err := c.MRdAt(0.2, 1000e3)
			if err != nil {
				t.Fatal(err)
			}
			steps := traceCircle(t, c, st, 1000e3, block.String())
			if x := steps["x"]; x.Kind != trace.KindSolve || !strings.HasPrefix(x.Verify(), "F_c + F_s1 + ") || !strings.HasSuffix(x.Verify(), "F_s8 - N_Ed") {
				t.Errorf("%s: solve step %+v", block, x)
			}
			if th := steps["theta"]; th.Kind != trace.KindInput || !relClose(th.Value, 0.2*180/math.Pi, 1e-15, 0) {
				t.Errorf("%s: θ step %+v", block, th)
			}
			fc := steps["F_c"]
			if block == Rectangular {
				a := steps["alpha"]
				if a.Kind != trace.KindSolve || a.Method() == "" || math.Abs(a.Residual()) > 1e-14 || !(a.Value > 0 && a.Value < math.Pi) {
					t.Errorf("%s: α step %+v", block, a)
				}
				if fc.Expr != "sigma_cd * A_c" || steps["A_c"].Expr != "(D / 2) ** 2 * (alpha - sin_a * cos_a)" {
					t.Errorf("%s: F_c %q, A_c %q", block, fc.Expr, steps["A_c"].Expr)
				}
			} else {
				mc := steps["M_c"]
				for _, s := range []trace.Step{fc, mc} {
					if s.Kind != trace.KindSolve || !strings.Contains(s.Method(), "Gauss–Legendre") || math.Abs(s.Residual()) > 1e-11*math.Abs(s.Value) {
						t.Errorf("%s fck %g: step %s kind %s residual %g of %g", block, fck, s.ID, s.Kind, s.Residual(), s.Value)
					}
				}
			}
			if !relClose(fc.Value, st.Fc, 1e-12, 0) {
				t.Errorf("%s: traced F_c = %.15g, state %.15g", block, fc.Value, st.Fc)
			}
			if m := steps["M_R"]; !strings.HasPrefix(m.Expr, "F_c * s_c + F_s1 * s_s1 + ") || m.Unit != "Nmm" {
				t.Errorf("%s: M_R step %+v", block, m)
			}
			if m := steps["M_Rd"]; m.Expr != "abs(M_R)" {
				t.Errorf("%s: M_Rd step %+v", block, m)
			}
		}
	}
}

// The diagram runs from −As·fyd to NRd,max, its moments match MRdAt at the same N in
// either direction (relative 1e-9, floor 1e-9·NRd,max·D; at the tension end MRdAt is taken
// at 1e-12 of the range above −As·fyd, where every bar yields), and its inner points are
// evenly spaced. Common practice, no source.
func TestCircleCurveNM(t *testing.T) {
	for _, block := range []Block{ParabolaRectangle, Rectangular} {
		for _, mk := range []func(testing.TB, float64, Block) *Circle{ring8, ringUneven} {
			c := mk(t, 30, block)
			nmin, nmax := c.NRdMin(), c.NRdMax()
			floor := 1e-9 * nmax * c.D
			for _, theta := range []float64{0, 0.4, -2} {
				pts := c.CurveNM(theta, 21)
				if len(pts) != 21 || pts[0].N != nmin || pts[20].N != nmax {
					t.Fatalf("%s θ %g: %d points from %g to %g", block, theta, len(pts), pts[0].N, pts[len(pts)-1].N)
				}
				opp := normAngle(theta + math.Pi)
				at := func(th, n float64) float64 {
					st, err := c.MRdAt(th, n)
					if err != nil {
						t.Fatal(err)
					}
					return st.M
				}
				ends := []struct {
					p NMPoint
					n float64
				}{{pts[0], nmin + 1e-12*(nmax-nmin)}, {pts[20], nmax}, {pts[7], pts[7].N}}
				for _, e := range ends {
					if m := at(theta, e.n); !relClose(e.p.M, m, 1e-9, floor) {
						t.Errorf("%s θ %g N %g: M %.12g, MRdAt %.12g", block, theta, e.p.N, e.p.M, m)
					}
					if m := -at(opp, e.n); !relClose(e.p.MNeg, m, 1e-9, floor) {
						t.Errorf("%s θ %g N %g: MNeg %.12g, −MRdAt(θ + π) %.12g", block, theta, e.p.N, e.p.MNeg, m)
					}
				}
				if want := nmin + (nmax-nmin)*7/20; !relClose(pts[7].N, want, 1e-15, 0) {
					t.Errorf("point 7 at N = %g, want %g", pts[7].N, want)
				}
			}
		}
	}
	if c := ring8(t, 30, ParabolaRectangle); c.CurveNM(math.NaN(), 5) != nil {
		t.Error("a NaN direction gives a diagram")
	}
}
