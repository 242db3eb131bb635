package quantity

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"unicode"
)

// ErrBadVar is wrapped by errors that come from using a defined name whose own definition
// failed; the definition's error has been reported by NewEnv already.
var ErrBadVar = errors.New("its definition is in error")

// Def is one named definition: Text is a number, a number with a unit or an expression.
type Def struct {
	Name, Text string
}

// DefError is the error of one definition given to NewEnv.
type DefError struct {
	Index  int    // position of the definition in the list given to NewEnv
	Name   string // the name defined
	InName bool   // the fault lies in the name (bad or repeated), not in the text
	Err    error
}

// Error returns the definition's name and the fault.
func (e *DefError) Error() string { return e.Name + ": " + e.Err.Error() }

// Unwrap returns the underlying fault.
func (e *DefError) Unwrap() error { return e.Err }

// Env holds named quantities that expressions may use.
type Env struct {
	vals map[string]Quantity
	bad  map[string]bool
}

type defState int

const (
	unseen defState = iota
	visiting
	done
	failed
)

type def struct {
	index int
	text  string
	tree  node
	state defState
	q     Quantity
}

// NewEnv evaluates the definitions, which may refer to each other in any order, and returns
// the environment with every definition that succeeded and one error per faulty definition:
// a bad name, a syntax or dimension fault, an undefined name or a cycle (named once, on its
// first definition in list order). Definitions that fail only because they use a faulty one
// are left out without an error of their own.
func NewEnv(defs []Def) (*Env, []error) {
	env := &Env{vals: map[string]Quantity{}, bad: map[string]bool{}}
	var errs []error
	report := func(i int, err error) {
		errs = append(errs, &DefError{Index: i, Name: defs[i].Name, Err: err})
	}
	reportName := func(i int, err error) {
		errs = append(errs, &DefError{Index: i, Name: defs[i].Name, InName: true, Err: err})
	}
	table := map[string]*def{}
	for i, d := range defs {
		if err := checkName(d.Name); err != nil {
			reportName(i, err)
			continue
		}
		if _, dup := table[d.Name]; dup {
			reportName(i, errors.New("defined twice"))
			continue
		}
		x := &def{index: i, text: d.Text}
		table[d.Name] = x
		t, err := parse(d.Text)
		if err != nil {
			report(i, fmt.Errorf("%q: %v", d.Text, err))
			x.state = failed
			continue
		}
		x.tree = t
	}
	var stack []string
	var resolve func(name string) (Quantity, error)
	resolve = func(name string) (Quantity, error) {
		x, ok := table[name]
		if !ok {
			return Quantity{}, errUndefined{name}
		}
		switch x.state {
		case done:
			return x.q, nil
		case failed:
			return Quantity{}, ErrBadVar
		case visiting:
			i := len(stack) - 1
			for stack[i] != name {
				i--
			}
			cycle := stack[i:]
			first := 0
			for k, n := range cycle {
				if table[n].index < table[cycle[first]].index {
					first = k
				}
			}
			path := append(append(append([]string{}, cycle[first:]...), cycle[:first]...), cycle[first])
			report(table[cycle[first]].index, fmt.Errorf("the definitions form a cycle: %s", strings.Join(path, " -> ")))
			for _, n := range cycle {
				table[n].state = failed
			}
			return Quantity{}, ErrBadVar
		}
		x.state = visiting
		stack = append(stack, name)
		q, err := eval(x.tree, resolve)
		stack = stack[:len(stack)-1]
		if err != nil {
			if x.state != failed && !errors.Is(err, ErrBadVar) {
				report(x.index, fmt.Errorf("%q: %v", x.text, err))
			}
			x.state = failed
			return Quantity{}, ErrBadVar
		}
		x.state, x.q = done, q
		return q, nil
	}
	for _, d := range defs {
		if x, ok := table[d.Name]; ok && x.state == unseen {
			resolve(d.Name)
		}
	}
	for n, x := range table {
		if x.state == done {
			env.vals[n] = x.q
		} else {
			env.bad[n] = true
		}
	}
	sortErrors(errs)
	return env, errs
}

func sortErrors(errs []error) {
	for i := 1; i < len(errs); i++ {
		for j := i; j > 0 && errs[j].(*DefError).Index < errs[j-1].(*DefError).Index; j-- {
			errs[j], errs[j-1] = errs[j-1], errs[j]
		}
	}
}

// checkName reports why name cannot be defined, or nil when it can.
func checkName(name string) error {
	if name == "" {
		return errors.New("a name must not be empty")
	}
	for i, r := range name {
		if !(unicode.IsLetter(r) || r == '_' || i > 0 && unicode.IsDigit(r)) {
			return fmt.Errorf("%q is not a name: use letters, digits and _, starting with a letter or _", name)
		}
	}
	if _, ok := functions[name]; ok {
		return fmt.Errorf("%s is a function and cannot be defined", name)
	}
	if reservedNames[name] {
		return fmt.Errorf("%s is reserved and cannot be defined", name)
	}
	if _, ok := LookupUnit(name); ok {
		return fmt.Errorf("%s is a unit and cannot be defined", name)
	}
	return nil
}

// Lookup returns the defined quantity called name.
func (e *Env) Lookup(name string) (Quantity, bool) {
	if e == nil {
		return Quantity{}, false
	}
	q, ok := e.vals[name]
	return q, ok
}

func (e *Env) get(name string) (Quantity, error) {
	if e != nil {
		if q, ok := e.vals[name]; ok {
			return q, nil
		}
		if e.bad[name] {
			return Quantity{}, fmt.Errorf("cannot use %s: %w", name, ErrBadVar)
		}
	}
	return Quantity{}, errUndefined{name}
}

// Quantity evaluates text over the environment's names and returns its value in engine
// units with its dimension; a nil Env has no names.
func (e *Env) Quantity(text string) (Quantity, error) {
	t, err := parse(text)
	if err != nil {
		return Quantity{}, fmt.Errorf("%q: %v", text, err)
	}
	q, err := eval(t, e.get)
	if err != nil {
		return Quantity{}, fmt.Errorf("%q: %w", text, err)
	}
	return q, nil
}

// Eval evaluates text for a field whose documented unit is unit ("mm", "kN", "kNm", "MPa",
// "" for a pure number) and returns the value in engine units. A pure-number result is taken
// in the field's unit; any other result must have the unit's dimension (a zero fits any).
func (e *Env) Eval(text, unit string) (float64, error) {
	u, ok := LookupUnit(unit)
	if !ok || u.Dim == Number && unit != "" {
		return 0, fmt.Errorf("unknown field unit %q", unit)
	}
	q, err := e.Quantity(text)
	if err != nil {
		return 0, err
	}
	switch {
	case q.Dim == u.Dim:
		return q.Value, nil
	case q.Dim == Number:
		return Convert(q.Value, unit)
	case q.Value == 0:
		return 0, nil
	}
	return 0, fmt.Errorf("%q is %s, expected %s", text, q.Dim.Describe(), u.Dim.Describe())
}

// Parse evaluates text as Eval does, with no names defined.
func Parse(text, unit string) (float64, error) {
	var e *Env
	return e.Eval(text, unit)
}

// Convert returns v, a number in unit, in engine units; it refuses NaN and infinities.
func Convert(v float64, unit string) (float64, error) {
	u, ok := LookupUnit(unit)
	if !ok {
		return 0, fmt.Errorf("unknown unit %q", unit)
	}
	x := v * u.Scale
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return 0, fmt.Errorf("%g is not a finite number", v)
	}
	return x, nil
}
