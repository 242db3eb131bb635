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

// Eval evaluates expr over the named args and returns the number it gives.
func Eval(expr string, args []Arg) (float64, error) {
	e, err := govaluate.NewEvaluableExpressionWithFunctions(expr, Functions)
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
	if !Finite(s.Value) || !Finite(s.Residual) {
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
		if s.Verify == "" {
			return fmt.Errorf("step %s: solve step without a verification expression", s.ID)
		}
		got, err := Eval(s.Verify, s.Args)
		if err != nil {
			return fmt.Errorf("step %s: %v", s.ID, err)
		}
		scale := 0.0
		for _, a := range s.Args {
			scale = math.Max(scale, math.Abs(a.Value))
		}
		if math.Abs(got-s.Residual) > tol*math.Max(scale, 1) {
			return fmt.Errorf("step %s: residual %s evaluates to %.12g, recorded %.12g", s.ID, s.Verify, got, s.Residual)
		}
	}
	return nil
}

func close(a, b, tol float64) bool {
	d := math.Abs(a - b)
	return d <= tol*math.Max(math.Abs(a), math.Abs(b)) || d <= 1e-300
}
