package quantity

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Quantity is a value in engine units with its dimension.
type Quantity struct {
	Value float64
	Dim   Dim
}

// tokens

type tokKind int

const (
	tEnd tokKind = iota
	tNum
	tName
	tOp // + - * / ** ( ) ,
)

type token struct {
	kind tokKind
	text string   // as written
	q    Quantity // value of a number with its unit
}

// reservedNames are words govaluate gives a meaning of their own.
var reservedNames = map[string]bool{"true": true, "false": true, "in": true, "IN": true}

// functions maps the allowed function names to their number of arguments (0: one or more).
var functions = map[string]int{"min": 0, "max": 0, "sqrt": 1}

func lex(s string) ([]token, error) {
	var out []token
	i := 0
	for i < len(s) {
		r, w := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && w == 1:
			return nil, errors.New("the text is not valid UTF-8")
		case unicode.IsSpace(r):
			i += w
		case r >= '0' && r <= '9' || r == '.':
			t, n, err := lexNumber(s[i:])
			if err != nil {
				return nil, err
			}
			out = append(out, t)
			i += n
		case unicode.IsLetter(r) || r == '_':
			j := i
			for j < len(s) {
				r2, w2 := utf8.DecodeRuneInString(s[j:])
				if !(unicode.IsLetter(r2) || unicode.IsDigit(r2) || r2 == '_') {
					break
				}
				j += w2
			}
			name := s[i:j]
			if reservedNames[name] {
				return nil, fmt.Errorf("%q is not allowed in a quantity", name)
			}
			if j < len(s) && s[j] == '.' {
				return nil, fmt.Errorf("%q is not allowed: names contain no dots", name+".")
			}
			out = append(out, token{kind: tName, text: name})
			i = j
		case strings.HasPrefix(s[i:], "**"):
			out = append(out, token{kind: tOp, text: "**"})
			i += 2
		case strings.ContainsRune("+-*/(),", r):
			out = append(out, token{kind: tOp, text: string(r)})
			i += w
		case r == '^':
			return nil, errors.New("^ is not a power here; use ** for powers (a ** 2)")
		default:
			op := string(r)
			for _, two := range []string{"==", "!=", ">=", "<=", "&&", "||", "??", "<<", ">>", "=~", "!~"} {
				if strings.HasPrefix(s[i:], two) {
					op = two
				}
			}
			return nil, fmt.Errorf("%q is not allowed (only numbers with units, names, + - * / **, parentheses, min, max and sqrt)", op)
		}
	}
	return append(out, token{kind: tEnd}), nil
}

// lexNumber reads a number literal with an optional exponent and an optional unit after it.
func lexNumber(s string) (token, int, error) {
	i := 0
	digits := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
		digits++
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
			digits++
		}
	}
	if digits == 0 {
		return token{}, 0, errors.New(`"." is not a number`)
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	if i < len(s) && s[i] == '.' {
		return token{}, 0, fmt.Errorf("%q is not a number", s[:i+1])
	}
	lit := s[:i]
	v, err := strconv.ParseFloat(lit, 64)
	if err != nil || math.IsInf(v, 0) {
		return token{}, 0, fmt.Errorf("number %s is out of range", lit)
	}
	t := token{kind: tNum, text: lit, q: Quantity{v, Number}}
	j := i
	for j < len(s) && s[j] == ' ' {
		j++
	}
	if u, n, ok := matchUnit(s[j:]); ok {
		t.q = Quantity{v * u.Scale, u.Dim}
		t.text = s[:j+n]
		i = j + n
	}
	return t, i, nil
}

// syntax tree

type node interface{}

type numNode struct{ q Quantity }
type nameNode struct{ name string }
type negNode struct{ x node }
type binNode struct {
	op   string
	l, r node
}
type callNode struct {
	fn   string
	args []node
}

type parser struct {
	toks  []token
	pos   int
	depth int // nesting of parentheses and signs
}

// maxDepth bounds the nesting of parentheses and signs.
const maxDepth = 100

// parse turns s into a syntax tree of the accepted govaluate subset.
func parse(s string) (node, error) {
	toks, err := lex(s)
	if err != nil {
		return nil, err
	}
	if len(toks) == 1 {
		return nil, errors.New("the text is empty")
	}
	p := &parser{toks: toks}
	n, err := p.sum()
	if err != nil {
		return nil, err
	}
	if t := p.peek(); t.kind != tEnd {
		return nil, p.unexpected(t)
	}
	return n, nil
}

func (p *parser) peek() token { return p.toks[p.pos] }
func (p *parser) next() token {
	t := p.toks[p.pos]
	if p.pos < len(p.toks)-1 {
		p.pos++
	}
	return t
}
func (p *parser) isOp(op string) bool {
	t := p.peek()
	return t.kind == tOp && t.text == op
}

func (p *parser) unexpected(t token) error {
	switch t.kind {
	case tEnd:
		return errors.New("the expression ends too early")
	case tName:
		if _, ok := LookupUnit(t.text); ok {
			return fmt.Errorf("unexpected %s: a unit goes directly after a number", t.text)
		}
		return fmt.Errorf("unexpected name %s (an operator is missing?)", t.text)
	case tNum:
		return fmt.Errorf("unexpected number %s (an operator is missing?)", t.text)
	}
	return fmt.Errorf("unexpected %q", t.text)
}

// sum := product (("+"|"-") product)*
func (p *parser) sum() (node, error) {
	l, err := p.product()
	if err != nil {
		return nil, err
	}
	for p.isOp("+") || p.isOp("-") {
		op := p.next().text
		r, err := p.product()
		if err != nil {
			return nil, err
		}
		l = binNode{op, l, r}
	}
	return l, nil
}

// product := power (("*"|"/") power)*
func (p *parser) product() (node, error) {
	l, err := p.power()
	if err != nil {
		return nil, err
	}
	for p.isOp("*") || p.isOp("/") {
		op := p.next().text
		r, err := p.power()
		if err != nil {
			return nil, err
		}
		l = binNode{op, l, r}
	}
	return l, nil
}

// power := unary ["**" unary]; chains and a negated base are refused because govaluate
// reads them differently from common mathematical usage (2**3**2 is 64, -2**2 is 4).
func (p *parser) power() (node, error) {
	signed := p.isOp("-")
	l, err := p.unary()
	if err != nil {
		return nil, err
	}
	if !p.isOp("**") {
		return l, nil
	}
	if signed {
		return nil, errors.New("-a**b is ambiguous: write (-a)**b or -(a**b)")
	}
	p.next()
	r, err := p.unary()
	if err != nil {
		return nil, err
	}
	if p.isOp("**") {
		return nil, errors.New("a**b**c is ambiguous: write (a**b)**c or a**(b**c)")
	}
	return binNode{"**", l, r}, nil
}

// unary := "-" unary | primary
func (p *parser) unary() (node, error) {
	p.depth++
	defer func() { p.depth-- }()
	if p.depth > maxDepth {
		return nil, errors.New("the expression is nested too deeply")
	}
	if p.isOp("-") {
		p.next()
		x, err := p.unary()
		if err != nil {
			return nil, err
		}
		return negNode{x}, nil
	}
	return p.primary()
}

// primary := number | name | function "(" sum {"," sum} ")" | "(" sum ")"
func (p *parser) primary() (node, error) {
	t := p.next()
	switch {
	case t.kind == tNum:
		return numNode{t.q}, nil
	case t.kind == tName:
		if !p.isOp("(") {
			if _, ok := functions[t.text]; ok {
				return nil, fmt.Errorf("%s needs its arguments in parentheses", t.text)
			}
			return nameNode{t.text}, nil
		}
		want, ok := functions[t.text]
		if !ok {
			return nil, fmt.Errorf("unknown function %s (allowed: min, max, sqrt)", t.text)
		}
		p.next()
		var args []node
		for {
			a, err := p.sum()
			if err != nil {
				return nil, err
			}
			args = append(args, a)
			if p.isOp(",") {
				p.next()
				continue
			}
			if p.isOp(")") {
				p.next()
				break
			}
			return nil, p.unexpected(p.peek())
		}
		if want > 0 && len(args) != want {
			return nil, fmt.Errorf("%s takes %d argument, not %d", t.text, want, len(args))
		}
		return callNode{t.text, args}, nil
	case t.kind == tOp && t.text == "(":
		n, err := p.sum()
		if err != nil {
			return nil, err
		}
		if !p.isOp(")") {
			if p.peek().kind == tEnd {
				return nil, errors.New("a closing parenthesis is missing")
			}
			return nil, p.unexpected(p.peek())
		}
		p.next()
		return n, nil
	}
	return nil, p.unexpected(t)
}

// evaluation

// errUndefined marks an undefined name.
type errUndefined struct{ name string }

func (e errUndefined) Error() string {
	if _, ok := LookupUnit(e.name); ok {
		return fmt.Sprintf("undefined name %s (a unit goes directly after a number)", e.name)
	}
	return "undefined name " + e.name
}

// eval computes n, looking names up with get.
func eval(n node, get func(string) (Quantity, error)) (Quantity, error) {
	switch n := n.(type) {
	case numNode:
		return n.q, nil
	case nameNode:
		return get(n.name)
	case negNode:
		x, err := eval(n.x, get)
		if err != nil {
			return x, err
		}
		return Quantity{-x.Value, x.Dim}, nil
	case binNode:
		l, err := eval(n.l, get)
		if err != nil {
			return l, err
		}
		r, err := eval(n.r, get)
		if err != nil {
			return r, err
		}
		return binary(n.op, l, r)
	case callNode:
		args := make([]Quantity, len(n.args))
		for i, a := range n.args {
			q, err := eval(a, get)
			if err != nil {
				return q, err
			}
			args[i] = q
		}
		return call(n.fn, args)
	}
	panic("quantity: unknown node")
}

// common returns the dimension two operands of + - min max share; a zero fits any dimension.
func common(verb string, a, b Quantity) (Dim, error) {
	switch {
	case a.Dim == b.Dim, b.Value == 0:
		return a.Dim, nil
	case a.Value == 0:
		return b.Dim, nil
	}
	hint := ""
	if a.Dim == Number || b.Dim == Number {
		hint = " (give the number a unit)"
	}
	return Dim{}, fmt.Errorf("cannot %s %s and %s%s", verb, a.Dim.Describe(), b.Dim.Describe(), hint)
}

func binary(op string, l, r Quantity) (Quantity, error) {
	var q Quantity
	switch op {
	case "+", "-":
		verb := map[string]string{"+": "add", "-": "subtract"}[op]
		d, err := common(verb, l, r)
		if err != nil {
			return q, err
		}
		q = Quantity{l.Value + r.Value, d}
		if op == "-" {
			q.Value = l.Value - r.Value
		}
	case "*":
		q = Quantity{l.Value * r.Value, l.Dim.mul(r.Dim)}
	case "/":
		if r.Value == 0 {
			return q, errors.New("division by zero")
		}
		q = Quantity{l.Value / r.Value, l.Dim.div(r.Dim)}
	case "**":
		return power(l, r)
	}
	return finite(q)
}

func power(b, e Quantity) (Quantity, error) {
	if e.Dim != Number && e.Value != 0 {
		return Quantity{}, fmt.Errorf("an exponent must be a pure number, not %s", e.Dim.Describe())
	}
	d := Number
	if b.Dim != Number {
		f, l := float64(b.Dim.Force)*e.Value, float64(b.Dim.Length)*e.Value
		if math.Abs(f) > 64 || math.Abs(l) > 64 || f != math.Trunc(f) || l != math.Trunc(l) {
			return Quantity{}, fmt.Errorf("%s to the power %g has no whole-numbered dimension", b.Dim.Describe(), e.Value)
		}
		d = Dim{int(f), int(l)}
	}
	if b.Value == 0 && e.Value < 0 {
		return Quantity{}, errors.New("division by zero (zero to a negative power)")
	}
	v := math.Pow(b.Value, e.Value)
	if math.IsNaN(v) {
		return Quantity{}, fmt.Errorf("%g to the power %g is not a real number", b.Value, e.Value)
	}
	return finite(Quantity{v, d})
}

func call(fn string, args []Quantity) (Quantity, error) {
	switch fn {
	case "sqrt":
		x := args[0]
		if x.Dim.Force%2 != 0 || x.Dim.Length%2 != 0 {
			return Quantity{}, fmt.Errorf("the square root of %s has no whole-numbered dimension", x.Dim.Describe())
		}
		if x.Value < 0 {
			return Quantity{}, fmt.Errorf("sqrt of a negative number (%g)", x.Value)
		}
		return Quantity{math.Sqrt(x.Value), Dim{x.Dim.Force / 2, x.Dim.Length / 2}}, nil
	default: // min, max
		acc := args[0]
		for _, a := range args[1:] {
			d, err := common("compare", acc, a)
			if err != nil {
				return Quantity{}, fmt.Errorf("%s: %v", fn, err)
			}
			if fn == "min" {
				acc = Quantity{math.Min(acc.Value, a.Value), d}
			} else {
				acc = Quantity{math.Max(acc.Value, a.Value), d}
			}
		}
		return acc, nil
	}
}

func finite(q Quantity) (Quantity, error) {
	if math.IsInf(q.Value, 0) || math.IsNaN(q.Value) {
		return Quantity{}, errors.New("the result is too large to be a finite number")
	}
	return q, nil
}
