package trace

import (
	"errors"
	"fmt"
	"math"

	"github.com/Knetic/govaluate"
)

// Functions are the functions that step expressions and input expressions may call.
var Functions = map[string]govaluate.ExpressionFunction{
	"min":   fold(math.Min),
	"max":   fold(math.Max),
	"sqrt":  unary(math.Sqrt),
	"abs":   unary(math.Abs),
	"floor": unary(math.Floor),
	"sin":   unary(math.Sin),
	"asin":  unary(math.Asin),
}

func unary(f func(float64) float64) govaluate.ExpressionFunction {
	return func(args ...interface{}) (interface{}, error) {
		if len(args) != 1 {
			return nil, errors.New("takes one argument")
		}
		x, ok := args[0].(float64)
		if !ok {
			return nil, errors.New("argument is not a number")
		}
		return f(x), nil
	}
}

func fold(f func(a, b float64) float64) govaluate.ExpressionFunction {
	return func(args ...interface{}) (interface{}, error) {
		if len(args) == 0 {
			return nil, errors.New("takes at least one argument")
		}
		var acc float64
		for i, a := range args {
			x, ok := a.(float64)
			if !ok {
				return nil, errors.New("argument is not a number")
			}
			if i == 0 {
				acc = x
			} else {
				acc = f(acc, x)
			}
		}
		return acc, nil
	}
}

// wholeTol is the tolerance within which the display functions take a quotient for the whole
// number it is meant to be, as the evaluation expressions do with their "+ 0.000000001".
const wholeTol = 1e-9

// ShowFunctions are the functions of the display syntax (Display.Expr): those of Functions,
// with floor and ceil taking a value within 1e-9 of a whole number for that number, and
// rounddown(x, step) and roundup(x, step), x rounded down or up to a multiple of step.
var ShowFunctions = func() map[string]govaluate.ExpressionFunction {
	m := make(map[string]govaluate.ExpressionFunction, len(Functions)+4)
	for k, f := range Functions {
		m[k] = f
	}
	m["floor"] = unary(func(x float64) float64 { return math.Floor(x + wholeTol) })
	m["ceil"] = unary(func(x float64) float64 { return math.Ceil(x - wholeTol) })
	round := func(f func(float64) float64) govaluate.ExpressionFunction {
		return func(args ...interface{}) (interface{}, error) {
			if len(args) != 2 {
				return nil, errors.New("takes two arguments")
			}
			x, ok1 := args[0].(float64)
			step, ok2 := args[1].(float64)
			if !ok1 || !ok2 {
				return nil, errors.New("argument is not a number")
			}
			return f(x/step) * step, nil
		}
	}
	m["rounddown"] = round(func(q float64) float64 { return math.Floor(q + wholeTol) })
	m["roundup"] = round(func(q float64) float64 { return math.Ceil(q - wholeTol) })
	return m
}()

// EvalShow evaluates the display form of step s (Show.Expr) over its args, with pi for π,
// and returns the number it gives (1 or 0 for a condition). The sheets never evaluate it;
// tests hold the display form to the step's value with it.
func EvalShow(s Step) (float64, error) {
	if s.Show == nil || s.Show.Expr == "" {
		return 0, fmt.Errorf("step %s: no display expression", s.ID)
	}
	args := append([]Arg{{Name: "pi", Value: math.Pi}}, s.Args...)
	return eval(s.Show.Expr, args, ShowFunctions)
}

// Eval evaluates expr over the named args and returns the number it gives.
func Eval(expr string, args []Arg) (float64, error) {
	return eval(expr, args, Functions)
}

func eval(expr string, args []Arg, functions map[string]govaluate.ExpressionFunction) (float64, error) {
	e, err := govaluate.NewEvaluableExpressionWithFunctions(expr, functions)
	if err != nil {
		return 0, fmt.Errorf("expression %q: %v", expr, err)
	}
	params := make(map[string]interface{}, len(args))
	for _, a := range args {
		params[a.Name] = a.Value
	}
	out, err := e.Evaluate(params)
	if err != nil {
		return 0, fmt.Errorf("expression %q: %v", expr, err)
	}
	switch v := out.(type) {
	case float64:
		return v, nil
	case bool:
		if v {
			return 1, nil
		}
		return 0, nil
	}
	return 0, fmt.Errorf("expression %q gives %T, not a number", expr, out)
}

// Recheck re-evaluates a step and reports an error when it does not reproduce its
// recorded value to relative tol (formula and check steps) or its recorded residual
// (solve steps), or when any recorded number is not finite.
func Recheck(s Step, tol float64) error {
	if !Finite(s.Value) || !Finite(s.Residual()) {
		return fmt.Errorf("step %s: value is not finite", s.ID)
	}
	for _, a := range s.Args {
		if !Finite(a.Value) {
			return fmt.Errorf("step %s: argument %s is not finite", s.ID, a.Name)
		}
	}
	switch s.Kind {
	case KindFormula, KindCheck:
		if s.Expr == "" {
			return fmt.Errorf("step %s: %s step without an expression", s.ID, s.Kind)
		}
		got, err := Eval(s.Expr, s.Args)
		if err != nil {
			return fmt.Errorf("step %s: %v", s.ID, err)
		}
		if !close(got, s.Value, tol) {
			return fmt.Errorf("step %s: %s evaluates to %.12g, recorded %.12g", s.ID, s.Expr, got, s.Value)
		}
	case KindSolve:
		if s.Verify() == "" {
			return fmt.Errorf("step %s: solve step without a verification expression", s.ID)
		}
		got, err := Eval(s.Verify(), s.Args)
		if err != nil {
			return fmt.Errorf("step %s: %v", s.ID, err)
		}
		scale := 0.0
		for _, a := range s.Args {
			scale = math.Max(scale, math.Abs(a.Value))
		}
		if math.Abs(got-s.Residual()) > tol*math.Max(scale, 1) {
			return fmt.Errorf("step %s: residual %s evaluates to %.12g, recorded %.12g", s.ID, s.Verify(), got, s.Residual())
		}
	}
	return nil
}

func close(a, b, tol float64) bool {
	d := math.Abs(a - b)
	return d <= tol*math.Max(math.Abs(a), math.Abs(b)) || d <= 1e-300
}

// RecheckShow reports an error when the display form of step s does not agree with its
// recorded value: Show.Expr must reproduce the value to relative tol, and a result in words
// must match it ("yes" for 1, "no" for 0, "not met" on a failed check). A step without a
// display form passes.
func RecheckShow(s Step, tol float64) error {
	if s.Show == nil {
		return nil
	}
	switch s.Show.Result {
	case "":
	case "yes", "no":
		if want := map[string]float64{"yes": 1, "no": 0}[s.Show.Result]; s.Value != want {
			return fmt.Errorf("step %s: shown as %q with the value %g", s.ID, s.Show.Result, s.Value)
		}
	case "not met":
		if s.Kind != KindCheck || s.Verdict != Fail {
			return fmt.Errorf("step %s: shown as not met but is no failed check", s.ID)
		}
	default:
		return fmt.Errorf("step %s: result %q is not one of yes, no, not met", s.ID, s.Show.Result)
	}
	if s.Show.Expr == "" {
		if s.Show.Result == "" {
			return fmt.Errorf("step %s: display form with neither formula nor result", s.ID)
		}
		return nil
	}
	got, err := EvalShow(s)
	if err != nil {
		return fmt.Errorf("step %s: display form: %v", s.ID, err)
	}
	if !close(got, s.Value, tol) {
		return fmt.Errorf("step %s: display form %s gives %.12g, recorded %.12g", s.ID, s.Show.Expr, got, s.Value)
	}
	return nil
}
