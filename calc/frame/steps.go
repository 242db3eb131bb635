package frame

import (
	"math"
	"strconv"
	"strings"

	"colsheet/calc/trace"
)

// Citations of the traced steps.
const (
	femClause      = "common practice (fixed-end moment, handbook formula)"
	subframeClause = "common practice"
)

// Side names an end of a member.
type Side int

// The ends of a member.
const (
	AtStart Side = iota // the end at node I, x = 0
	AtEnd               // the end at node J, x = L
)

// FEMUniformStep records the magnitude of the fixed-end moment w·L²/12 of a member of
// length l under a uniform load w over its whole length.
func FEMUniformStep(id, title string, w, l trace.Q) trace.Step {
	return trace.Formula(id, title, femClause, "M_F", "Nmm", w.V*l.V*l.V/12,
		"w * L ** 2 / 12", trace.A("w", w), trace.A("L", l))
}

// FEMTrapezoidStep records the magnitude of the fixed-end moment
// w·L²/12·(1 − 2(a/L)² + (a/L)³) of a member of length l under a symmetric trapezoid of peak
// w rising from zero over the length a at each end (a = L/2 gives the triangle's 5wL²/96).
func FEMTrapezoidStep(id, title string, w, l, a trace.Q) trace.Step {
	r := a.V / l.V
	return trace.Formula(id, title, femClause, "M_F", "Nmm", w.V*l.V*l.V/12*(1-2*r*r+r*r*r),
		"w * L ** 2 / 12 * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)", trace.A("w", w), trace.A("L", l), trace.A("a", a))
}

// FEMStep records the fixed-end moment at one end of a member of length l under the line
// loads, clockwise positive, by the simplest formula that fits the load: w·L²/12 for one
// uniform load over the whole span; L²/12·[w_e + (w − w_e)·(1 − 2(a/L)² + (a/L)³)] for a load
// symmetric about mid-span that rises linearly from w_e at each end to w over the length a
// (a triangle when a = L/2, with w_e = 0 a pure trapezoid); otherwise the sum over the pieces
// of the exact integral of the linear load against the fixed-end influence x·(L−x)²/L² (start)
// or x²·(L−x)/L² (end): Simpson's rule over the piece plus the closed-form correction
// ∓(x1 − x0)⁴·(w1 − w0)/120 of its error on the quartic term, which makes it exact, with the
// terms that vanish for the piece (at x = 0 or L, or the correction of a uniform piece) left
// out. Parts of pieces outside [0, l] are left out, as in FixedEnd.
func FEMStep(id, title string, side Side, l trace.Q, loads []Piece) trace.Step {
	var ps []Piece
	v := 0.0
	for _, p := range loads {
		p, ok := clip(p, l.V)
		if !ok {
			continue
		}
		ps = append(ps, p)
		if side == AtEnd {
			v += exact(p, func(x float64) float64 { return x * x * (l.V - x) }, -1)
		} else {
			v += exact(p, func(x float64) float64 { return x * (l.V - x) * (l.V - x) }, 1)
		}
	}
	v /= l.V * l.V
	sign := ""
	if side == AtStart {
		v, sign = -v, "-"
	}
	if len(ps) == 0 {
		return trace.Formula(id, title, femClause, "M_F", "Nmm", v, "0 * L", trace.A("L", l))
	}
	if we, w, a, ok := symmetric(ps, l.V); ok {
		args := []trace.Arg{trace.A("L", l), trace.A("w", trace.Const(w, "w", "N/mm"))}
		shape := " * (1 - 2 * (a / L) ** 2 + (a / L) ** 3)"
		if a > 0 {
			args = append(args, trace.A("a", trace.Const(a, "a", "mm")))
		} else {
			shape = ""
		}
		if we == 0 {
			return trace.Formula(id, title, femClause, "M_F", "Nmm", v, sign+"w * L ** 2 / 12"+shape, args...)
		}
		args = append(args, trace.A("w_e", trace.Const(we, "w_e", "N/mm")))
		return trace.Formula(id, title, femClause, "M_F", "Nmm", v,
			sign+"(w_e + (w - w_e)"+shape+") * L ** 2 / 12", args...)
	}
	args := make([]trace.Arg, 1, 1+4*len(ps))
	args[0] = trace.A("L", l)
	var expr strings.Builder
	for n, p := range ps {
		k := strconv.Itoa(n + 1)
		x0, x1, w0, w1 := "x0_"+k, "x1_"+k, "w0_"+k, "w1_"+k
		args = append(args,
			trace.A(x0, trace.Const(p.X0, "x_0,"+k, "mm")),
			trace.A(x1, trace.Const(p.X1, "x_1,"+k, "mm")),
			trace.A(w0, trace.Const(p.W0, "w_0,"+k, "N/mm")),
			trace.A(w1, trace.Const(p.W1, "w_1,"+k, "N/mm")))
		if n > 0 {
			expr.WriteString(" + ")
		}
		writeFEMTerm(&expr, side, p, l.V, x0, x1, w0, w1)
	}
	return trace.Formula(id, title, femClause, "M_F", "Nmm", v, sign+"("+expr.String()+") / L ** 2", args...)
}

// symmetric reports whether the pieces, in order along the member of length l, make a load
// symmetric about mid-span that rises linearly from we at each end to w over the length a and
// stays at w between (a = 0: uniform; a = l/2: a triangle on we), and returns we, w and a.
// Intensities agree within 1e-9 of the largest, positions within 1e-9·l; we is returned as 0
// where it is nil within that.
func symmetric(ps []Piece, l float64) (we, w, a float64, ok bool) {
	big := 0.0
	for _, p := range ps {
		big = math.Max(big, math.Max(math.Abs(p.W0), math.Abs(p.W1)))
	}
	sameW := func(x, y float64) bool { return math.Abs(x-y) <= 1e-9*big }
	sameX := func(x, y float64) bool { return math.Abs(x-y) <= 1e-9*l }
	first, last := ps[0], ps[len(ps)-1]
	if !sameX(first.X0, 0) || !sameX(last.X1, l) {
		return 0, 0, 0, false
	}
	for k := 1; k < len(ps); k++ {
		if !sameX(ps[k].X0, ps[k-1].X1) || !sameW(ps[k].W0, ps[k-1].W1) {
			return 0, 0, 0, false
		}
	}
	switch len(ps) {
	case 1: // uniform over the span
		if !sameW(first.W0, first.W1) {
			return 0, 0, 0, false
		}
		we, w = first.W0, first.W0
	case 2: // a triangle on a uniform load, peak at mid-span
		if !sameX(first.X1, l/2) || !sameW(first.W0, last.W1) {
			return 0, 0, 0, false
		}
		we, w, a = first.W0, first.W1, l/2
	case 3: // a trapezoid on a uniform load
		mid := ps[1]
		if !sameW(mid.W0, mid.W1) || !sameX(first.X1, l-mid.X1) || !sameW(first.W0, last.W1) {
			return 0, 0, 0, false
		}
		we, w, a = first.W0, mid.W0, first.X1
	default:
		return 0, 0, 0, false
	}
	if sameW(we, 0) {
		we = 0
	}
	if len(ps) == 1 {
		we = 0
	}
	return we, w, a, true
}

// writeFEMTerm writes one piece's term of FEMStep's general expression: Simpson's rule on the
// influence x·(L−x)² (start) or x²·(L−x) (end), which vanishes at x = 0 and x = L, with the
// correction of exact, which vanishes for a uniform piece; vanishing terms are left out.
func writeFEMTerm(b *strings.Builder, side Side, p Piece, l float64, x0, x1, w0, w1 string) {
	g := func(x string) string {
		if side == AtEnd {
			return x + " ** 2 * (L - " + x + ")"
		}
		return x + " * (L - " + x + ") ** 2"
	}
	xm := "((" + x0 + " + " + x1 + ") / 2)"
	var terms []string
	if p.X0 != 0 && p.X0 != l {
		terms = append(terms, w0+" * "+g(x0))
	}
	terms = append(terms, "2 * ("+w0+" + "+w1+") * "+g(xm))
	if p.X1 != 0 && p.X1 != l {
		terms = append(terms, w1+" * "+g(x1))
	}
	b.WriteString("(" + x1 + " - " + x0 + ") / 6 * (" + strings.Join(terms, " + ") + ")")
	if p.W1 != p.W0 {
		corr := " - "
		if side == AtEnd {
			corr = " + "
		}
		b.WriteString(corr + "(" + x1 + " - " + x0 + ") ** 4 * (" + w1 + " - " + w0 + ") / 120")
	}
}

// StiffnessStep records the stiffness k·4·E·I/L of a member end (slope-deflection equations,
// far end fixed), with k the stiffness factor (1 full, 0.5 half stiffness).
func StiffnessStep(id, title string, k, e, i, l trace.Q) trace.Step {
	return trace.Formula(id, title, subframeClause, "k", "Nmm", k.V*4*e.V*i.V/l.V,
		"k * 4 * E * I / L", trace.A("k", k), trace.A("E", e), trace.A("I", i), trace.A("L", l))
}

// UnbalancedStep records the unbalanced moment at a joint, the sum of the fixed-end moments
// of the member ends there (clockwise positive).
func UnbalancedStep(id, title string, fems ...trace.Q) trace.Step {
	expr, args, v := sum("M", fems)
	return trace.Formula(id, title, subframeClause, "M_unb", "Nmm", v, expr, args...)
}

// DistributionFactorStep records the distribution factor k/Σk of a member end among the
// stiffnesses of all the member ends at the joint (zero, with a caution, when Σk is zero).
func DistributionFactorStep(id, title string, k trace.Q, all ...trace.Q) trace.Step {
	total, args, v := sumAfter("k", all, trace.A("k", k))
	if !(v > 0) {
		return trace.Formula(id, title, subframeClause, "D", "", 0, "0 * k", args...).
			Caution("The joint has no stiffness: nothing is distributed.")
	}
	return trace.Formula(id, title, subframeClause, "D", "", k.V/v, "k / ("+total+")", args...)
}

// ColumnMomentStep records a member's share of the balancing moment at a joint,
// −M_unb·k/Σk, clockwise positive on the member end (the column's moment at the joint;
// zero, with a caution, when Σk is zero).
func ColumnMomentStep(id, title string, unbalanced, k trace.Q, all ...trace.Q) trace.Step {
	total, args, v := sumAfter("k", all, trace.A("M_unb", unbalanced), trace.A("k", k))
	if !(v > 0) {
		return trace.Formula(id, title, subframeClause, "M_col", "Nmm", 0, "0 * M_unb", args...).
			Caution("The joint has no stiffness: nothing is distributed.")
	}
	return trace.Formula(id, title, subframeClause, "M_col", "Nmm", -unbalanced.V*k.V/v,
		"-M_unb * k / ("+total+")", args...)
}

// CarryOverStep records the moment m/2 carried over to the fixed far end of a prismatic member.
func CarryOverStep(id, title string, m trace.Q) trace.Step {
	return trace.Formula(id, title, subframeClause, "M_far", "Nmm", m.V/2, "m / 2", trace.A("m", m))
}

// sum returns the expression name1 + name2 + … over the quantities, its arguments and value.
func sum(name string, qs []trace.Q) (string, []trace.Arg, float64) {
	return sumAfter(name, qs)
}

// sumAfter is sum with the arguments lead ahead of those of the terms.
func sumAfter(name string, qs []trace.Q, lead ...trace.Arg) (string, []trace.Arg, float64) {
	if len(qs) == 0 {
		if len(lead) == 0 {
			return "0", nil, 0
		}
		return "0", append([]trace.Arg(nil), lead...), 0
	}
	var expr strings.Builder
	args := make([]trace.Arg, len(lead), len(lead)+len(qs))
	copy(args, lead)
	v := 0.0
	for i, q := range qs {
		n := name + strconv.Itoa(i+1)
		if i > 0 {
			expr.WriteString(" + ")
		}
		expr.WriteString(n)
		args = append(args, trace.A(n, q))
		v += q.V
	}
	return expr.String(), args, v
}

// JointBeam is a traced beam at a subframe joint: its stiffness (with the beam factor
// applied) and its fixed-end moment at the joint, clockwise positive.
type JointBeam struct{ K, FEM trace.Q }

// Joint is the traced form of a Subframe: the stiffnesses and fixed-end moments of the
// members meeting at one joint, each nil when the member is absent.
type Joint struct {
	Above, Below *trace.Q // column stiffnesses 4EI/L
	Left, Right  *JointBeam
}

// JointColumn is a column's traced result at a subframe joint.
type JointColumn struct {
	Present bool
	AtJoint trace.Q // moment at the joint end, clockwise positive
	FarEnd  trace.Q // moment carried over to the far (fixed) end
}

// JointSteps is the traced distribution at a subframe joint: the steps in order and the
// column moments they give.
type JointSteps struct {
	Steps        []trace.Step
	Above, Below JointColumn
}

// Steps records the simplified-subframe distribution at the joint (common practice): the
// unbalanced moment, and for each column its distribution factor, its moment at the joint
// and the carry-over to its far end; step IDs start with prefix.
func (j Joint) Steps(prefix string) JointSteps {
	var out JointSteps
	n := 1 // the unbalanced moment, then three steps per column
	for _, c := range []*trace.Q{j.Above, j.Below} {
		if c != nil {
			n += 3
		}
	}
	out.Steps = make([]trace.Step, 0, n)
	add := func(s trace.Step) trace.Q { out.Steps = append(out.Steps, s); return s.Q() }
	fems, ks := make([]trace.Q, 0, 2), make([]trace.Q, 0, 4)
	for _, b := range []*JointBeam{j.Left, j.Right} {
		if b != nil {
			fems = append(fems, b.FEM)
		}
	}
	for _, c := range []*trace.Q{j.Above, j.Below} {
		if c != nil {
			ks = append(ks, *c)
		}
	}
	for _, b := range []*JointBeam{j.Left, j.Right} {
		if b != nil {
			ks = append(ks, b.K)
		}
	}
	unb := add(UnbalancedStep(prefix+"unbalanced", "Unbalanced moment at the joint", fems...))
	for _, c := range []struct {
		k    *trace.Q
		name string
		out  *JointColumn
	}{{j.Above, "above", &out.Above}, {j.Below, "below", &out.Below}} {
		if c.k == nil {
			continue
		}
		add(DistributionFactorStep(prefix+"df_"+c.name, "Distribution factor of the column "+c.name, *c.k, ks...))
		at := add(ColumnMomentStep(prefix+"m_"+c.name, "Moment of the column "+c.name+" at the joint", unb, *c.k, ks...))
		far := add(CarryOverStep(prefix+"m_"+c.name+"_far", "Moment carried over to the far end of the column "+c.name, at))
		*c.out = JointColumn{Present: true, AtJoint: at, FarEnd: far}
	}
	return out
}
