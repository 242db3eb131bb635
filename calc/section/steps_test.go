package section

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

// traceState records the steps of st and checks them: every step rechecks to relative
// 1e-9 (the trace contract in DESIGN.md), IDs are unique, every argument's producing step
// exists, and the traced MRd and residual agree with the engine's state.
func traceState(t *testing.T, s *Section, st State, ned float64, what string) []trace.Step {
	t.Helper()
	log := &trace.Log{Prefix: "K1/L1/", Group: "section"}
	refs := Refs{Fcd: "K1/mat/fcd", Fyd: "K1/mat/fyd", Es: "K1/mat/Es", B: "K1/b", H: "K1/h", EpsPeak: "K1/mat/eps_c2", EpsUlt: "K1/mat/eps_cu2", N: "K1/mat/n", Lambda: "K1/mat/lambda", Eta: "K1/mat/eta"}
	nq := trace.Q{V: ned, Symbol: "N_Ed", Unit: "N", From: "K1/L1/NEd"}
	id := "sec/" + st.Axis.String() + "/"
	m := s.Trace(log, id, nq, st, refs)
	known := map[string]bool{nq.From: true}
	for _, r := range []string{refs.Fcd, refs.Fyd, refs.Es, refs.B, refs.H, refs.EpsPeak, refs.EpsUlt, refs.N, refs.Lambda, refs.Eta} {
		known[r] = true
	}
	for _, step := range log.Steps {
		if known[step.ID] {
			t.Fatalf("%s: duplicate step ID %s", what, step.ID)
		}
		known[step.ID] = true
	}
	for _, step := range log.Steps {
		if err := trace.Recheck(step, 1e-9); err != nil {
			t.Errorf("%s: %v", what, err)
		}
		if !strings.HasPrefix(step.Clause, "EN 1992-1-1:2004 ") && step.Clause != "common practice" {
			t.Errorf("%s: step %s has clause %q", what, step.ID, step.Clause)
		}
		for _, a := range step.Args {
			if a.From != "" && !known[a.From] {
				t.Errorf("%s: step %s argument %s from unknown step %s", what, step.ID, a.Name, a.From)
			}
		}
	}
	if m.Symbol != "M_Rd,"+st.Axis.String() || !relClose(m.V, st.M, 1e-9, 1e-9*s.NRdMax()*math.Max(s.B, s.H)) {
		t.Errorf("%s: traced %s = %.12g, state M = %.12g", what, m.Symbol, m.V, st.M)
	}
	solve := log.Steps[0]
	if solve.Kind != trace.KindSolve || math.Abs(solve.Residual()-(st.N-ned)) > 1e-9*math.Max(s.NRdMax(), 1) {
		t.Errorf("%s: solve step %+v, state residual %g", what, solve, st.N-ned)
	}
	return log.Steps
}

// Every traced step reproduces its value from its expression, for states on both pivots,
// both axes and faces, both blocks, fck 30 and 70, symmetric and asymmetric layouts.
// The invariant is the trace contract of DESIGN.md; common practice, no source.
func TestTraceRechecks(t *testing.T) {
	count := 0
	for _, fck := range []float64{30, 70} {
		for _, block := range []Block{ParabolaRectangle, Rectangular} {
			for _, mk := range []func(testing.TB, float64, Block) *Section{sym8, sym12, asym} {
				s := mk(t, fck, block)
				for _, axis := range []Axis{AxisY, AxisZ} {
					d := s.H
					if axis == AxisZ {
						d = s.B
					}
					for _, face := range []Face{Positive, Negative} {
						for _, k := range []float64{0.03, 0.1, 0.4, 0.8, 1, 1.3, 3, 50, math.Inf(1)} {
							st := s.StateAt(axis, face, k*d*1.0001)
							traceState(t, s, st, st.N, "state")
							count++
						}
					}
					nmax, nmin := s.NRdMax(), s.NRdMin()
					for k := 1; k <= 10; k++ {
						ned := nmin + (nmax-nmin)*float64(k)/10
						st, err := s.MRdBoth(axis, ned)
						if err != nil {
							t.Fatal(err)
						}
						traceState(t, s, st, ned, "MRd")
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

// The traced parabola-rectangle block for fck ≤ 50 on pivot B reduces to α_R·fcd·b·x with
// α_R = 17/21 and k_a = 99/238 (The Concrete Centre, "How to design concrete structures
// using Eurocode 2": 0.8095 and 0.416; from memory). Tolerance relative 1e-12.
func TestTraceFamiliarBlock(t *testing.T) {
	s := sym8(t, 30, ParabolaRectangle)
	st, err := s.MRd(AxisY, 1000e3)
	if err != nil {
		t.Fatal(err)
	}
	steps := traceState(t, s, st, 1000e3, "familiar")
	byID := map[string]trace.Step{}
	for _, step := range steps {
		byID[strings.TrimPrefix(step.ID, "K1/L1/sec/y/")] = step
	}
	if a := byID["alpha_R"]; !relClose(a.Value, 17.0/21, 1e-12, 0) || len(a.Notes()) == 0 {
		t.Errorf("α_R = %.15g, notes %v", a.Value, a.Notes())
	}
	if k := byID["k_a"]; !relClose(k.Value, 99.0/238, 1e-12, 0) {
		t.Errorf("k_a = %.15g", k.Value)
	}
	if f := byID["F_c"]; f.Expr != "alpha_R * fcd * b * x" {
		t.Errorf("F_c expression %q", f.Expr)
	}
	if x := byID["x"]; x.Kind != trace.KindSolve || x.Method() == "" || x.Verify() != "F_c + F_s1 + F_s2 + F_s3 - N_Ed" {
		t.Errorf("solve step %+v", x)
	}
	if m := byID["M_Rd"]; m.Expr != "F_c * z_c + F_s1 * z_s1 + F_s2 * z_s2 + F_s3 * z_s3" || m.Unit != "Nmm" {
		t.Errorf("M_Rd step %+v", m)
	}
}
