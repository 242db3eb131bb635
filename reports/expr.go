package reports

import (
	"errors"
	"strings"

	"colsheet/calc/trace"
)

// pieceKind says what a piece of a displayed formula is.
type pieceKind int

const (
	pSym       pieceKind = iota // a display symbol such as "f_cd"
	pText                       // an identifier left as written
	pNum                        // a number, with an optional display unit
	pOp                         // an operator or punctuation, canonical form
	pFunc                       // a function name followed by "("
	pSupOpen                    // start of an exponent
	pSupClose                   // end of an exponent
	pSqrtOpen                   // start of a square root's argument
	pSqrtClose                  // end of a square root's argument
	pAbsOpen                    // start of an absolute value
	pAbsClose                   // end of an absolute value
)

// piece is one element of a formula laid out for display.
type piece struct {
	kind  pieceKind
	text  string // symbol, identifier, operator or function name; literal number text
	n     num    // formatted number, for a pNum from an argument value
	lit   bool   // pNum written literally in the expression
	unit  string // display unit of a pNum, "" for none
	unary bool   // pOp used as a unary sign
}

type token struct {
	kind int // tIdent, tNum, tOp, tStr
	text string
}

const (
	tIdent = iota
	tNum
	tOp
	tStr
)

var errExpr = errors.New("expression not understood")

// operators of govaluate, longest first.
var operators = []string{"**", "<=", ">=", "==", "!=", "&&", "||", "??", "=~", "!~", "<<", ">>",
	"*", "/", "%", "+", "-", "(", ")", ",", "<", ">", "!", "?", ":", "&", "|", "^", "~"}

func isIdentStart(c byte) bool { return c == '_' || c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }
func isDigit(c byte) bool      { return c >= '0' && c <= '9' }

// tokenize splits a govaluate expression into tokens.
func tokenize(expr string) ([]token, error) {
	var out []token
	for i := 0; i < len(expr); {
		c := expr[i]
		switch {
		case c == ' ' || c == '\t' || c == '\n' || c == '\r':
			i++
		case isIdentStart(c):
			j := i + 1
			for j < len(expr) && (isIdentStart(expr[j]) || isDigit(expr[j]) || expr[j] == '.') {
				j++
			}
			out = append(out, token{tIdent, expr[i:j]})
			i = j
		case c == '[':
			j := strings.IndexByte(expr[i:], ']')
			if j < 0 {
				return nil, errExpr
			}
			out = append(out, token{tIdent, expr[i+1 : i+j]})
			i += j + 1
		case isDigit(c) || c == '.':
			j := i + 1
			for j < len(expr) && (isDigit(expr[j]) || expr[j] == '.') {
				j++
			}
			if j < len(expr) && (expr[j] == 'e' || expr[j] == 'E') {
				k := j + 1
				if k < len(expr) && (expr[k] == '+' || expr[k] == '-') {
					k++
				}
				if k < len(expr) && isDigit(expr[k]) {
					for k < len(expr) && isDigit(expr[k]) {
						k++
					}
					j = k
				}
			}
			out = append(out, token{tNum, expr[i:j]})
			i = j
		case c == '\'' || c == '"':
			j := strings.IndexByte(expr[i+1:], c)
			if j < 0 {
				return nil, errExpr
			}
			out = append(out, token{tStr, expr[i+1 : i+1+j]})
			i += j + 2
		default:
			found := false
			for _, op := range operators {
				if strings.HasPrefix(expr[i:], op) {
					out = append(out, token{tOp, op})
					i += len(op)
					found = true
					break
				}
			}
			if !found {
				return nil, errExpr
			}
		}
	}
	return out, nil
}

// opDisplay gives the canonical display form of a govaluate operator.
var opDisplay = map[string]string{
	"*": "·", "-": "−", "<=": "≤", ">=": "≥", "!=": "≠", "==": "=", "&&": "and", "||": "or",
	"!": "not", "**": "^",
}

// layout turns a govaluate expression into display pieces. With values false each argument
// is shown by its symbol; with values true by its value in display units. Identifiers that
// are not arguments are left as written.
func layout(expr string, args []trace.Arg, values bool) ([]piece, error) {
	toks, err := tokenize(expr)
	if err != nil {
		return nil, err
	}
	byName := make(map[string]trace.Arg, len(args))
	for _, a := range args {
		byName[a.Name] = a
	}
	type group struct {
		kind     pieceKind // pOp for plain parentheses, pSqrtOpen, pAbsOpen
		drop     bool      // parentheses not shown (exponent group)
		closeSup bool      // the group ends an exponent
	}
	var (
		out   []piece
		stack []group
		sup   bool // the next operand is an exponent
	)
	operandStart := func() bool { // emits pSupOpen when an exponent starts here; reports whether one did
		if sup {
			sup = false
			out = append(out, piece{kind: pSupOpen})
			return true
		}
		return false
	}
	prevIsOperand := func() bool {
		if len(out) == 0 {
			return false
		}
		p := out[len(out)-1]
		switch p.kind {
		case pSym, pText, pNum, pSupClose, pSqrtClose, pAbsClose:
			return true
		case pOp:
			return p.text == ")"
		}
		return false
	}
	afterOperator := func() bool { // a signed number here needs parentheses
		if len(out) == 0 {
			return false
		}
		p := out[len(out)-1]
		return p.kind == pOp && p.text != "(" && p.text != ","
	}
	for i := 0; i < len(toks); i++ {
		t := toks[i]
		next := func() string {
			if i+1 < len(toks) && toks[i+1].kind == tOp {
				return toks[i+1].text
			}
			return ""
		}
		switch t.kind {
		case tIdent:
			if next() == "(" {
				opened := operandStart()
				i++
				switch t.text {
				case "sqrt":
					out = append(out, piece{kind: pSqrtOpen})
					stack = append(stack, group{kind: pSqrtOpen, closeSup: opened})
				case "abs":
					out = append(out, piece{kind: pAbsOpen})
					stack = append(stack, group{kind: pAbsOpen, closeSup: opened})
				default:
					out = append(out, piece{kind: pFunc, text: t.text})
					stack = append(stack, group{kind: pOp, closeSup: opened})
				}
				continue
			}
			opened := operandStart()
			a, ok := byName[t.text]
			switch {
			case !ok:
				out = append(out, piece{kind: pText, text: t.text})
			case !values:
				out = append(out, piece{kind: pSym, text: a.Symbol})
			default:
				n, u := quantity(a.Value, a.Unit)
				wrap := !opened && (strings.HasPrefix(n.m, "-") && afterOperator() || (u != "" || n.e != 0) && next() == "**")
				if wrap {
					out = append(out, piece{kind: pOp, text: "("})
				}
				out = append(out, piece{kind: pNum, n: n, unit: u})
				if wrap {
					out = append(out, piece{kind: pOp, text: ")"})
				}
			}
			if opened {
				out = append(out, piece{kind: pSupClose})
			}
		case tNum, tStr:
			opened := operandStart()
			if t.kind == tNum {
				out = append(out, piece{kind: pNum, text: t.text, lit: true})
			} else {
				out = append(out, piece{kind: pText, text: t.text})
			}
			if opened {
				out = append(out, piece{kind: pSupClose})
			}
		case tOp:
			switch t.text {
			case "**":
				if !prevIsOperand() || sup {
					return nil, errExpr
				}
				sup = true
			case "(":
				if sup {
					sup = false
					out = append(out, piece{kind: pSupOpen})
					stack = append(stack, group{kind: pOp, drop: true, closeSup: true})
				} else {
					out = append(out, piece{kind: pOp, text: "("})
					stack = append(stack, group{kind: pOp})
				}
			case ")":
				if len(stack) == 0 || sup {
					return nil, errExpr
				}
				g := stack[len(stack)-1]
				stack = stack[:len(stack)-1]
				switch {
				case g.kind == pSqrtOpen:
					out = append(out, piece{kind: pSqrtClose})
				case g.kind == pAbsOpen:
					out = append(out, piece{kind: pAbsClose})
				case !g.drop:
					out = append(out, piece{kind: pOp, text: ")"})
				}
				if g.closeSup {
					out = append(out, piece{kind: pSupClose})
				}
			default:
				if sup {
					return nil, errExpr // a signed exponent is shown as written
				}
				unary := (t.text == "-" || t.text == "+" || t.text == "!") && !prevIsOperand()
				d, ok := opDisplay[t.text]
				if !ok {
					d = t.text
				}
				out = append(out, piece{kind: pOp, text: d, unary: unary})
			}
		}
	}
	if len(stack) != 0 || sup {
		return nil, errExpr
	}
	return out, nil
}
