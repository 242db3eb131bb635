// Package trace holds the step list that records every number of a calculation.
//
// A calculation is a sequence of Steps. Each step names its clause, its kind and,
// for formulas, a govaluate expression over named arguments whose values and
// producing steps are recorded, so that any reader can re-evaluate the step.
// Engine functions build steps with Formula, Table, Input, Solve and Check and
// hand back the step; later steps take the step's result through Step.Q.
package trace

import (
	"encoding/json"
	"math"
	"slices"
)

// Kind says what sort of step a Step is.
type Kind string

// The kinds of step.
const (
	KindInput   Kind = "input"   // a value taken from the input file or a default
	KindFormula Kind = "formula" // a value computed by an expression over arguments
	KindTable   Kind = "table"   // a value read from a standard's table
	KindSolve   Kind = "solve"   // a value found by iteration, with a verification residual
	KindCheck   Kind = "check"   // a comparison of an action with a resistance, with a verdict
)

// Verdicts of a check step.
const (
	Pass = "pass"
	Fail = "fail"
)

// Q is a traced quantity: a value with its display symbol, unit and the step that produced it.
type Q struct {
	V      float64 // value in engine units (N, mm, MPa, N·mm)
	Symbol string  // display symbol, e.g. "f_cd"
	Unit   string  // engine unit, e.g. "MPa", "N", "mm", "Nmm", "mm2", "" for a pure number
	From   string  // ID of the producing step; empty for a constant
}

// Const returns a quantity that no step produced, such as a number fixed by a clause.
func Const(v float64, symbol, unit string) Q { return Q{V: v, Symbol: symbol, Unit: unit} }

// Arg is one named argument of a step's expression.
type Arg struct {
	Name   string  `json:"name"`           // identifier used in the expression
	Symbol string  `json:"symbol"`         // display symbol
	Value  float64 `json:"value"`          // value in engine units
	Unit   string  `json:"unit,omitempty"` // engine unit
	From   string  `json:"from,omitempty"` // ID of the step that produced the value
}

// A returns the argument called name that carries quantity q.
func A(name string, q Q) Arg {
	return Arg{Name: name, Symbol: q.Symbol, Value: q.V, Unit: q.Unit, From: q.From}
}

// Step is one recorded step of a calculation. Its JSON form (see MarshalJSON) has every part
// as a field of its own, as stepJSON lists them.
type Step struct {
	ID       string   // stable ID: column/storey/part/name
	Group    string   // heading of the sheet section the step belongs to
	Title    string   // what the step computes, in words
	Clause   string   // clause reference, or "common practice"
	Kind     Kind     // input, formula, table, solve or check
	Symbol   string   // display symbol of the result
	Expr     string   // govaluate expression over Args giving Value
	Args     []Arg    // arguments of Expr or of the solve step's verification
	Value    float64  // result in engine units (ratio for a check)
	Unit     string   // engine unit of Value
	Relation string   // the inequality checked, e.g. "M_Ed ≤ M_Rd"
	Verdict  string   // pass or fail, for a check step
	Show     *Display // how the sheets show the step, where Expr is written for the evaluator
	// more holds the parts that few steps have (a table's row, a solve step's method and
	// verification, notes, cautions); nil for none. Steps copied share it: it is changed only
	// by making a new one.
	more *stepMore
}

// stepMore is the parts of a step that few steps have.
type stepMore struct {
	row, method, verify string
	residual            float64
	notes, cautions     []string
}

// withNote is the rarer parts of a step with room for its first note, so that a step's first
// note takes one allocation.
type withNote struct {
	m    stepMore
	note [1]string
}

// Row returns the table row read, for a table step.
func (s Step) Row() string {
	if s.more == nil {
		return ""
	}
	return s.more.row
}

// Method returns the iteration method, for a solve step.
func (s Step) Method() string {
	if s.more == nil {
		return ""
	}
	return s.more.method
}

// Verify returns the residual expression over Args, for a solve step.
func (s Step) Verify() string {
	if s.more == nil {
		return ""
	}
	return s.more.verify
}

// Residual returns the recorded value of Verify, for a solve step.
func (s Step) Residual() float64 {
	if s.more == nil {
		return 0
	}
	return s.more.residual
}

// Notes returns the remarks for the reader (not to be changed: see Note).
func (s Step) Notes() []string {
	if s.more == nil {
		return nil
	}
	return s.more.notes
}

// Cautions returns the warnings the sheet must show (not to be changed: see Caution).
func (s Step) Cautions() []string {
	if s.more == nil {
		return nil
	}
	return s.more.cautions
}

// edit returns a copy of the step's rarer parts for a change, the step's own left as they are.
func (s *Step) edit() *stepMore {
	m := &stepMore{}
	if s.more != nil {
		*m = *s.more
		m.notes, m.cautions = slices.Clip(m.notes), slices.Clip(m.cautions)
	}
	return m
}

// set gives the step the rarer parts m, none where m holds nothing.
func (s *Step) set(m *stepMore) {
	if m.row == "" && m.method == "" && m.verify == "" && m.residual == 0 && len(m.notes) == 0 && len(m.cautions) == 0 {
		m = nil
	}
	s.more = m
}

// WithRow returns a copy of the step reading row of its table.
func (s Step) WithRow(row string) Step {
	m := s.edit()
	m.row = row
	s.set(m)
	return s
}

// WithResidual returns a copy of the step with the recorded value r of its verification.
func (s Step) WithResidual(r float64) Step {
	m := s.edit()
	m.residual = r
	s.set(m)
	return s
}

// Display is how a step reads on a sheet where its evaluation expression carries what the
// clause does not write: a guard on a divisor, a tolerance on a rounding, a 1 or 0 for a
// condition, a number that only marks a failure. The evaluation expression stays as it is
// (recheck re-evaluates Expr); the sheets show Display instead.
type Display struct {
	// Expr is the formula as a hand calculation writes it, in the display syntax: govaluate
	// over the step's Args with the functions of ShowFunctions (ceil, floor, rounddown and roundup
	// besides those of Functions) and the name pi for π. A condition is written as the
	// comparison itself, without "? 1 : 0". Empty: no formula is shown.
	Expr string `json:"expr,omitempty"`
	// Result is the result in words where a number would mislead: "yes" or "no" for a
	// condition, "not met" for a failed check without a ratio. Empty: the value is shown.
	Result string `json:"result,omitempty"`
}

// Shown returns a copy of the step shown on the sheets as expr, the formula as the clause
// writes it (display syntax, see Display), instead of its evaluation expression.
func (s Step) Shown(expr string) Step {
	d := Display{Expr: expr}
	if s.Show != nil {
		d.Result = s.Show.Result
	}
	s.Show = &d
	return s
}

// Condition returns a copy of a yes/no step (value 1 for yes, 0 for no) shown on the sheets as
// the condition cond (display syntax, see Display) with the result "yes" or "no".
func (s Step) Condition(cond string) Step {
	r := "no"
	if s.Value != 0 {
		r = "yes"
	}
	s.Show = &Display{Expr: cond, Result: r}
	return s
}

// Unmet returns a copy of a failed check that has no ratio to give (its value only marks the
// failure), shown on the sheets as "not met" without a formula.
func (s Step) Unmet() Step {
	s.Show = &Display{Result: "not met"}
	return s
}

// Q returns the step's result as a quantity for use in later steps.
func (s Step) Q() Q { return Q{V: s.Value, Symbol: s.Symbol, Unit: s.Unit, From: s.ID} }

// Formula returns a formula step whose value v is given by expr over args.
func Formula(id, title, clause, symbol, unit string, v float64, expr string, args ...Arg) Step {
	return Step{ID: id, Title: title, Clause: clause, Kind: KindFormula, Symbol: symbol,
		Unit: unit, Value: v, Expr: expr, Args: args}
}

// Input returns a step recording a value taken from the input or from a stated default.
func Input(id, title, clause, symbol, unit string, v float64) Step {
	return Step{ID: id, Title: title, Clause: clause, Kind: KindInput, Symbol: symbol, Unit: unit, Value: v}
}

// Table returns a step recording value v read from row of a standard's table.
func Table(id, title, clause, row, symbol, unit string, v float64) Step {
	s := Step{ID: id, Title: title, Clause: clause, Kind: KindTable, Symbol: symbol, Unit: unit, Value: v}
	s.set(&stepMore{row: row})
	return s
}

// Solve returns a step recording value v found by method, with the residual of verify over args.
func Solve(id, title, clause, symbol, unit string, v float64, method, verify string, residual float64, args ...Arg) Step {
	s := Step{ID: id, Title: title, Clause: clause, Kind: KindSolve, Symbol: symbol, Unit: unit, Value: v, Args: args}
	s.set(&stepMore{method: method, verify: verify, residual: residual})
	return s
}

// Check returns a check step whose ratio of action to resistance is expr over args.
// The verdict is pass when the ratio does not exceed 1 (within 1e-9).
func Check(id, title, clause, relation string, ratio float64, expr string, args ...Arg) Step {
	verdict := Pass
	if !(ratio <= 1+1e-9) {
		verdict = Fail
	}
	return Step{ID: id, Title: title, Clause: clause, Kind: KindCheck, Symbol: "η", Value: ratio,
		Expr: expr, Args: args, Relation: relation, Verdict: verdict}
}

// Note returns a copy of the step with a note for the reader added.
func (s Step) Note(text string) Step {
	if s.more == nil || len(s.more.notes) == 0 {
		x := &withNote{note: [1]string{text}}
		if s.more != nil {
			x.m = *s.more
			x.m.cautions = slices.Clip(x.m.cautions)
		}
		x.m.notes = x.note[:1:1]
		s.more = &x.m
		return s
	}
	m := s.edit()
	m.notes = append(m.notes, text)
	s.set(m)
	return s
}

// Caution returns a copy of the step with a caution added.
func (s Step) Caution(text string) Step {
	m := s.edit()
	m.cautions = append(m.cautions, text)
	s.set(m)
	return s
}

// Finite reports whether v is neither NaN nor infinite.
func Finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// Log collects the steps of one calculation in order.
type Log struct {
	Prefix string // prepended to every step ID, e.g. "K1/L1/"
	Group  string // sheet section given to steps added from now on
	Steps  []Step
	// Trial, when set, keeps only check steps, for a trial whose trace is not wanted;
	// the results of the other steps are returned all the same.
	Trial bool
	// dropped is set when the last Add kept no step (Trial), so that Last does not give an
	// earlier one.
	dropped bool
}

// Add appends the step, giving it the log's prefix and current group, and returns its result.
func (l *Log) Add(s Step) Q {
	l.dropped = l.Trial && s.Kind != KindCheck
	if l.dropped {
		return Q{V: s.Value, Symbol: s.Symbol, Unit: s.Unit, From: s.ID}
	}
	s.ID = l.Prefix + s.ID
	if s.Group == "" {
		s.Group = l.Group
	}
	l.Steps = append(l.Steps, s)
	return s.Q()
}

// Last returns a pointer to the most recent step, or nil when the log is empty or a trial's
// log kept none of the last step added.
func (l *Log) Last() *Step {
	if len(l.Steps) == 0 || l.dropped {
		return nil
	}
	return &l.Steps[len(l.Steps)-1]
}

// NoteLast adds a note for the reader to the most recent step, where Last gives one.
func (l *Log) NoteLast(text string) {
	if s := l.Last(); s != nil {
		*s = s.Note(text)
	}
}

// stepJSON is the JSON form of a step: every part a field of its own.
type stepJSON struct {
	ID       string   `json:"id"`
	Group    string   `json:"group,omitempty"`
	Title    string   `json:"title"`
	Clause   string   `json:"clause"`
	Kind     Kind     `json:"kind"`
	Symbol   string   `json:"symbol,omitempty"`
	Expr     string   `json:"expr,omitempty"`
	Args     []Arg    `json:"args,omitempty"`
	Value    float64  `json:"value"`
	Unit     string   `json:"unit,omitempty"`
	Row      string   `json:"row,omitempty"`
	Method   string   `json:"method,omitempty"`
	Verify   string   `json:"verify,omitempty"`
	Residual float64  `json:"residual,omitempty"`
	Relation string   `json:"relation,omitempty"`
	Verdict  string   `json:"verdict,omitempty"`
	Notes    []string `json:"notes,omitempty"`
	Cautions []string `json:"cautions,omitempty"`
	Show     *Display `json:"show,omitempty"`
}

// MarshalJSON writes the step with every part a field of its own (see stepJSON).
func (s Step) MarshalJSON() ([]byte, error) {
	return json.Marshal(stepJSON{ID: s.ID, Group: s.Group, Title: s.Title, Clause: s.Clause, Kind: s.Kind, Symbol: s.Symbol,
		Expr: s.Expr, Args: s.Args, Value: s.Value, Unit: s.Unit, Row: s.Row(), Method: s.Method(), Verify: s.Verify(),
		Residual: s.Residual(), Relation: s.Relation, Verdict: s.Verdict, Notes: s.Notes(), Cautions: s.Cautions(), Show: s.Show})
}

// UnmarshalJSON reads the step as MarshalJSON writes it.
func (s *Step) UnmarshalJSON(data []byte) error {
	var j stepJSON
	if err := json.Unmarshal(data, &j); err != nil {
		return err
	}
	*s = Step{ID: j.ID, Group: j.Group, Title: j.Title, Clause: j.Clause, Kind: j.Kind, Symbol: j.Symbol, Expr: j.Expr,
		Args: j.Args, Value: j.Value, Unit: j.Unit, Relation: j.Relation, Verdict: j.Verdict, Show: j.Show}
	s.set(&stepMore{row: j.Row, method: j.Method, verify: j.Verify, residual: j.Residual, notes: j.Notes, cautions: j.Cautions})
	return nil
}
