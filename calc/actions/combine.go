package actions

import (
	"strconv"
	"strings"

	"colsheet/calc/code"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// Variable is one variable action of a combination: its category and characteristic value.
type Variable struct {
	Category string  // imposed-load category A to H, or Snow, SnowHigh, Wind, Temperature
	Q        trace.Q // characteristic value (a force, a line load, ...), possibly reduced by αA or αn
	// Unreduced, when Q has been reduced by αn, is the value before the reduction: as an
	// accompanying action, and in Eq. (6.10a), ψ0 is applied to it instead of to Q, since ψ and
	// αn are not applied together (EN 1991-1-1:2002 3.3.1(2)P).
	Unreduced *trace.Q
}

// action is one variable action after variables of the same category have been summed.
type action struct {
	cat    string  // canonical category
	q      trace.Q // value as the leading action
	acc    trace.Q // value to which ψ0 applies
	hasAcc bool    // acc differs from q (an αn-reduced action)
	psi0   trace.Q
}

// expr accumulates the terms of a combination expression with its arguments and value.
type expr struct {
	text  []string
	args  []trace.Arg
	named map[string]bool
	v     float64
}

func (e *expr) arg(name string, q trace.Q) {
	if e.named == nil {
		e.named = map[string]bool{}
	}
	if !e.named[name] {
		e.named[name] = true
		e.args = append(e.args, trace.A(name, q))
	}
}

func (e *expr) term(text string, v float64) {
	e.text = append(e.text, text)
	e.v += v
}

func (e *expr) String() string { return strings.Join(e.text, " + ") }

func catLabel(cat string) string {
	if len(cat) == 1 {
		return "category " + cat
	}
	return cat
}

// apart reports whether two variable actions are not applied together: imposed load on roofs
// with snow or wind, EN 1991-1-1:2002 3.3.2(1).
func apart(a, b string) bool {
	roofShared := func(c string) bool { return c == Snow || c == SnowHigh || c == Wind }
	return (a == "H" && roofShared(b)) || (b == "H" && roofShared(a))
}

const roofNote = "Imposed load on roofs is not applied together with snow or wind (EN 1991-1-1:2002 3.3.2(1))."

// Combine returns the steps of the ULS combination of permanent action g with the variable
// actions qs by rule (model.Comb610: Eq. (6.10); model.Comb610ab: the less favourable of
// Eq. (6.10a) and (6.10b)), EN 1990:2002 6.4.3.2(3) with the factors of Table A1.2(B) from p,
// each variable action leading in turn, and the governing (largest) design value.
// All actions are taken as unfavourable and share one unit, which the result keeps.
func Combine(id, rule string, p code.Params, g trace.Q, qs []Variable) ([]trace.Step, trace.Q) {
	return CombineExpr(id, rule, ExprAll, p, g, qs)
}

// Expressions of EN 1990:2002 6.4.3.2(3) that CombineExpr may be restricted to.
const (
	ExprAll  = ""      // every expression of the rule: (6.10), or (6.10a) and (6.10b)
	Expr610  = "6.10"  // Eq. (6.10)
	Expr610a = "6.10a" // Eq. (6.10a) alone
	Expr610b = "6.10b" // Eq. (6.10b) alone
	// ExprInf is Eq. (6.10) with the permanent action favourable, γG,inf·Gk (Table A1.2(B)):
	// the least axial force that goes with the variable actions of a moment arrangement.
	ExprInf = "inf"
)

// CombineExpr returns the steps of Combine restricted to the expression expr (ExprAll: all
// that the rule has), and the governing (largest) design value among them.
func CombineExpr(id, rule, only string, p code.Params, g trace.Q, qs []Variable) ([]trace.Step, trace.Q) {
	var steps []trace.Step
	add := func(s trace.Step) trace.Q { steps = append(steps, s); return s.Q() }
	var cautions []string

	ab := rule == model.Comb610ab
	if only == Expr610a || only == Expr610b {
		ab = true
	}
	if only == Expr610 || only == ExprInf {
		ab = false
	}
	if !ab && rule != model.Comb610 && rule != model.Comb610ab && rule != "" {
		cautions = append(cautions, "Unknown combination rule "+strconv.Quote(rule)+": Eq. (6.10) is used, which is never less favourable than (6.10a)/(6.10b).")
	}

	// Sum the variables of each category into one action, keeping the order of first appearance.
	var acts []action
	groups := map[string][]Variable{}
	for _, v := range qs {
		c := canon(v.Category)
		if _, seen := groups[c]; !seen {
			acts = append(acts, action{cat: c})
		}
		groups[c] = append(groups[c], v)
		if v.Q.Unit != g.Unit {
			cautions = append(cautions, "The variable action of "+catLabel(c)+" is in "+strconv.Quote(v.Q.Unit)+", the permanent action in "+strconv.Quote(g.Unit)+".")
		}
		if v.Q.V < 0 {
			cautions = append(cautions, "The variable action of "+catLabel(c)+" is negative: it is combined as unfavourable; leave a favourable variable action out (γQ = 0, EN 1990 Table A1.2(B)).")
		}
	}
	for i := range acts {
		a := &acts[i]
		vs := groups[a.cat]
		a.q = vs[0].Q
		for _, v := range vs {
			if v.Unreduced != nil {
				a.hasAcc = true
			}
		}
		if len(vs) > 1 {
			a.q = add(sum(id+"/Q_"+a.cat, "Characteristic value of the variable action, "+catLabel(a.cat)+", summed", vs, false))
		}
		a.acc = a.q
		if a.hasAcc {
			if len(vs) > 1 {
				a.acc = add(sum(id+"/Q_"+a.cat+"_unreduced", "Characteristic value of the variable action without the reduction αn, "+catLabel(a.cat)+", summed", vs, true))
			} else {
				a.acc = *vs[0].Unreduced
			}
		}
	}

	gName := "gamma_G"
	if only == ExprInf {
		gName = "gamma_G_inf"
	}
	gammaG := add(ParamStep(id+"/"+gName, p, gName, ""))
	var gammaQ, xi trace.Q
	if len(acts) > 0 {
		gammaQ = add(ParamStep(id+"/gamma_Q", p, "gamma_Q", ""))
	}
	if ab && only != Expr610a {
		xi = add(ParamStep(id+"/xi", p, "xi", ""))
	}
	if ab || len(acts) > 1 {
		for i := range acts {
			acts[i].psi0 = add(PsiStep(id+"/psi0_"+acts[i].cat, 0, acts[i].cat))
		}
	}

	type candidate struct {
		label string
		step  trace.Step
	}
	var cands []candidate
	// build adds a candidate: the permanent action (times ξ when withXi), the leading action
	// lead (none when lead < 0) and the others accompanying with ψ0.
	build := func(name, eq, label string, withXi bool, lead int) {
		var e expr
		e.arg("G_k", g)
		e.arg(gName, gammaG)
		if withXi {
			e.arg("xi", xi)
			e.term("xi * gamma_G * G_k", xi.V*gammaG.V*g.V)
		} else {
			e.term(gName+" * G_k", gammaG.V*g.V)
		}
		if lead >= 0 {
			n := strconv.Itoa(lead + 1)
			e.arg("gamma_Q", gammaQ)
			e.arg("Q_"+n, acts[lead].q)
			e.term("gamma_Q * Q_"+n, gammaQ.V*acts[lead].q.V)
		}
		roofOut := false
		for j, a := range acts {
			if j == lead {
				continue
			}
			if lead >= 0 && apart(acts[lead].cat, a.cat) {
				roofOut = true
				continue
			}
			if lead < 0 && a.cat == "H" && anyRoofShared(acts) {
				roofOut = true
				continue
			}
			n := strconv.Itoa(j + 1)
			qn := "Q_" + n
			if a.hasAcc {
				qn = "Q_" + n + "_u"
			}
			e.arg("gamma_Q", gammaQ)
			e.arg("psi0_"+n, a.psi0)
			e.arg(qn, a.acc)
			e.term("gamma_Q * psi0_"+n+" * "+qn, gammaQ.V*a.psi0.V*a.acc.V)
		}
		s := trace.Formula(name, "Design value, "+label, en1990+"6.4.3.2(3), "+eq, "E_d,"+strconv.Itoa(len(cands)+1), g.Unit,
			e.v, e.String(), e.args...)
		if roofOut {
			s = s.Note(roofNote)
		}
		cands = append(cands, candidate{label, s})
	}

	withA, withB := only != Expr610b, only != Expr610a
	switch {
	case only == ExprInf && len(acts) == 0:
		build(id+"/inf", "Eq. (6.10)", "Eq. (6.10), permanent action favourable", false, -1)
	case only == ExprInf:
		for i, a := range acts {
			build(id+"/inf_"+a.cat, "Eq. (6.10)", "Eq. (6.10), permanent action favourable, "+catLabel(a.cat)+" leading", false, i)
		}
	case ab && len(acts) == 0:
		if withA {
			build(id+"/610a", "Eq. (6.10a)", "Eq. (6.10a)", false, -1)
		}
		if withB {
			build(id+"/610b", "Eq. (6.10b)", "Eq. (6.10b)", true, -1)
		}
	case ab:
		if withA {
			build(id+"/610a", "Eq. (6.10a)", "Eq. (6.10a)", false, -1)
		}
		if withB {
			for i, a := range acts {
				build(id+"/610b_"+a.cat, "Eq. (6.10b)", "Eq. (6.10b), "+catLabel(a.cat)+" leading", true, i)
			}
		}
	case len(acts) == 0:
		build(id+"/610", "Eq. (6.10)", "Eq. (6.10)", false, -1)
	default:
		for i, a := range acts {
			build(id+"/610_"+a.cat, "Eq. (6.10)", "Eq. (6.10), "+catLabel(a.cat)+" leading", false, i)
		}
	}

	if len(cands) == 1 {
		s := cands[0].step
		s.ID, s.Symbol = id, "E_d"
		for _, c := range cautions {
			s = s.Caution(c)
		}
		steps = append(steps, s)
		return steps, s.Q()
	}
	best := 0
	names := make([]string, len(cands))
	args := make([]trace.Arg, len(cands))
	for i, c := range cands {
		steps = append(steps, c.step)
		names[i] = "E_" + strconv.Itoa(i+1)
		args[i] = trace.A(names[i], c.step.Q())
		if c.step.Value > cands[best].step.Value {
			best = i
		}
	}
	title := "Design value: the least favourable combination"
	clause := en1990 + "6.4.3.2(3)"
	if ab && withA && withB {
		clause = en1990 + "6.4.3.2(3), Eq. (6.10a), (6.10b)"
	}
	s := trace.Formula(id, title, clause, "E_d", g.Unit, cands[best].step.Value,
		"max("+strings.Join(names, ", ")+")", args...).Note("Governed by " + cands[best].label + ".")
	for _, c := range cautions {
		s = s.Caution(c)
	}
	steps = append(steps, s)
	return steps, s.Q()
}

func anyRoofShared(acts []action) bool {
	for _, a := range acts {
		if apart("H", a.cat) {
			return true
		}
	}
	return false
}

// sum returns the step adding up variables of one category (their values before αn when unreduced).
func sum(id, title string, vs []Variable, unreduced bool) trace.Step {
	names := make([]string, len(vs))
	args := make([]trace.Arg, len(vs))
	v := 0.0
	for i, x := range vs {
		q := x.Q
		if unreduced && x.Unreduced != nil {
			q = *x.Unreduced
		}
		names[i] = "Q_" + strconv.Itoa(i+1)
		args[i] = trace.A(names[i], q)
		v += q.V
	}
	return trace.Formula(id, title, "common practice", vs[0].Q.Symbol, vs[0].Q.Unit, v, strings.Join(names, " + "), args...).
		Note("Loads of one category are combined as a single variable action.")
}
