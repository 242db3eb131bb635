package frame

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// FEMStep records the simplest formula that fits the load: wL²/12 for a uniform load over the
// span (Roark's Formulas for Stress and Strain, Table 8.1, from memory), the trapezoid's
// handbook formula wL²/12·(1 − 2(a/L)² + (a/L)³) for a symmetric trapezoid or triangle (a = L/2
// gives 5wL²/96, Roark Table 8.1, from memory), by superposition on a uniform part; the general
// exact integral only for other loads, without its vanishing terms. Every form gives FixedEnd's
// value and re-evaluates to it.
func TestFEMStepSimplestFormula(t *testing.T) {
	const w, we, l, a = 27.5, 4.125, 7800.0, 2100.0 // test inputs
	lq := trace.Const(l, "L", "mm")
	rho := func(a float64) float64 { return 1 - 2*math.Pow(a/l, 2) + math.Pow(a/l, 3) }
	cases := []struct {
		name  string
		loads []Piece
		expr  string // at the end; the start's is the same with a leading minus
		want  float64
	}{
		{"uniform", []Piece{Uniform(w, l)}, "w * L ** 2 / 12", w * l * l / 12},
		{"uniform from parts", Merge([]Piece{Uniform(w, l), Uniform(we, l)}), "w * L ** 2 / 12", (w + we) * l * l / 12},
		{"trapezoid", Trapezoid(w, l, a), "w * L ** 2 / 12 * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)", w * l * l / 12 * rho(a)},
		{"triangle", Trapezoid(w, l, l/2), "w * L ** 2 / 12 * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)", 5 * w * l * l / 96},
		{"trapezoid on a uniform load", Merge(append(Trapezoid(w, l, a), Uniform(we, l))),
			"(w_e + (w - w_e) * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)) * L ** 2 / 12", we*l*l/12 + w*l*l/12*rho(a)},
		{"triangle on a uniform load", Merge(append(Trapezoid(w, l, l/2), Uniform(we, l))),
			"(w_e + (w - w_e) * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)) * L ** 2 / 12", we*l*l/12 + 5*w*l*l/96},
		// Steel Designers' Manual, fixed–fixed beam with a uniform load over c from the start,
		// M_B = wc³(4L − 3c)/(12L²) (from memory): a uniform piece from 0 has no correction term
		// and no term at x = 0.
		{"partial uniform", []Piece{{0, 2400, w, w}},
			"((x1_1 - x0_1) / 6 * (2 * (w0_1 + w1_1) * ((x0_1 + x1_1) / 2) ** 2 * (L - ((x0_1 + x1_1) / 2)) + w1_1 * x1_1 ** 2 * (L - x1_1))) / L ** 2",
			w * 2400 * 2400 * 2400 * (4*l - 3*2400) / (12 * l * l)},
	}
	for _, c := range cases {
		_, me := FixedEnd(l, c.loads)
		if !near(me, c.want, 1e-12) {
			t.Errorf("%s: FixedEnd %g, handbook %g", c.name, me, c.want)
		}
		for _, side := range []Side{AtStart, AtEnd} {
			s := FEMStep("fem", "Fixed-end moment", side, lq, c.loads)
			want, expr := c.want, c.expr
			if side == AtStart {
				want, expr = -want, "-"+expr
			}
			if c.name == "partial uniform" && side == AtStart {
				// The start's influence x·(L − x)² vanishes at x = 0 as well.
				expr = "-((x1_1 - x0_1) / 6 * (2 * (w0_1 + w1_1) * ((x0_1 + x1_1) / 2) * (L - ((x0_1 + x1_1) / 2)) ** 2 + w1_1 * x1_1 * (L - x1_1) ** 2)) / L ** 2"
				want = -w * 2400 * 2400 * (6*l*l - 8*l*2400 + 3*2400*2400) / (12 * l * l)
			}
			if s.Expr != expr {
				t.Errorf("%s, side %d: %q, want %q", c.name, side, s.Expr, expr)
			}
			if !near(s.Value, want, 1e-12) {
				t.Errorf("%s, side %d: %g, want %g", c.name, side, s.Value, want)
			}
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Errorf("%s: %v", c.name, err)
			}
		}
	}
}
