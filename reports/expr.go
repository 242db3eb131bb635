package reports

import (
	"errors"
	"strings"
	"sync"
	"sync/atomic"

	"colsheet/calc/trace"
)

// pieceKind says what a piece of a displayed formula is.
type pieceKind int8

const (
	pSym        pieceKind = iota // a display symbol such as "f_cd"
	pText                        // an identifier left as written
	pNum                         // a number, with an optional display unit
	pOp                          // an operator or punctuation, canonical form
	pFunc                        // a function name followed by "("
	pSupOpen                     // start of an exponent
	pSupClose                    // end of an exponent
	pSqrtOpen                    // start of a square root's argument
	pSqrtClose                   // end of a square root's argument
	pAbsOpen                     // start of an absolute value
	pAbsClose                    // end of an absolute value
	pWord                        // words within a formula: "if", ", otherwise", "rounded down to a", "yes"
	pFloorOpen                   // start of a rounding down to a whole number, ⌊
	pFloorClose                  // end of it, ⌋
	pCeilOpen                    // start of a rounding up to a whole number, ⌈
	pCeilClose                   // end of it, ⌉
)

// piece is one element of a formula laid out for display.
type piece struct {
	text  string // symbol, identifier, operator or function name; literal number text
	n     num    // formatted number, for a pNum from an argument value
	unit  string // display unit of a pNum, "" for none
	kind  pieceKind
	lit   bool // pNum written literally in the expression
	unary bool // pOp used as a unary sign
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
	tWord // words put in by the layout (a ternary read out), never from the expression
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
	ps, err := layoutTo(nil, readExpr(expr), args, values)
	if len(ps) == 0 {
		return nil, err // as for an expression of no tokens
	}
	return ps, err
}

// layoutTo appends the display pieces of the expression pe (as layout lays them out) to out;
// nil on error.
func layoutTo(out []piece, pe parsedExpr, args []trace.Arg, values bool) ([]piece, error) {
	if pe.err != nil {
		return nil, pe.err
	}
	toks := pe.read
	if out == nil {
		out = make([]piece, 0, len(toks)+4)
	}
	type group struct {
		kind     pieceKind // pOp for plain parentheses, pSqrtOpen, pAbsOpen, pFloorOpen, pCeilOpen, pWord (rounddown)
		drop     bool      // parentheses not shown (exponent group)
		closeSup bool      // the group ends an exponent
		up       bool      // pWord: roundup rather than rounddown
	}
	var (
		stack []group
		sup   bool // the next operand is an exponent
		start = len(out)
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
		if len(out) == start {
			return false
		}
		p := out[len(out)-1]
		switch p.kind {
		case pSym, pText, pNum, pSupClose, pSqrtClose, pAbsClose, pFloorClose, pCeilClose:
			return true
		case pOp:
			return p.text == ")"
		}
		return false
	}
	afterOperator := func() bool { // a signed number here needs parentheses
		if len(out) == start {
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
				case "floor":
					out = append(out, piece{kind: pFloorOpen})
					stack = append(stack, group{kind: pFloorOpen, closeSup: opened})
				case "ceil":
					out = append(out, piece{kind: pCeilOpen})
					stack = append(stack, group{kind: pCeilOpen, closeSup: opened})
				case "rounddown":
					// rounddown(x, step): "x rounded down to a step of step", or with values
					// "240 mm rounded down to a 25 mm step".
					stack = append(stack, group{kind: pWord, closeSup: opened})
				case "roundup":
					// roundup(x, step): "x rounded up to a step of step", as rounddown.
					stack = append(stack, group{kind: pWord, closeSup: opened, up: true})
				default:
					out = append(out, piece{kind: pFunc, text: t.text})
					stack = append(stack, group{kind: pOp, closeSup: opened})
				}
				continue
			}
			opened := operandStart()
			a, ok := argNamed(args, t.text)
			switch {
			case !ok && t.text == "pi":
				out = append(out, piece{kind: pSym, text: "π"})
			case !ok:
				out = append(out, piece{kind: pText, text: t.text})
			case !values || a.Symbol == "π":
				out = append(out, piece{kind: pSym, text: a.Symbol})
			default:
				n, u := quantityOf(a.Value, a.Unit, a.Symbol)
				// A signed value after an operator, a value with a unit under a power and a value
				// in a scaled unit ("2133 × 10⁶ mm⁴") within a product are put in parentheses.
				scaled := strings.HasPrefix(u, "×") && (afterOperator() || next() != "" && next() != ")" && next() != ",")
				wrap := !opened && (strings.HasPrefix(n.m, "-") && afterOperator() || (u != "" || n.e != 0) && next() == "**" || scaled)
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
		case tWord:
			if sup {
				return nil, errExpr
			}
			out = append(out, piece{kind: pWord, text: t.text})
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
				case g.kind == pFloorOpen:
					out = append(out, piece{kind: pFloorClose})
				case g.kind == pCeilOpen:
					out = append(out, piece{kind: pCeilClose})
				case g.kind == pWord:
					if values {
						out = append(out, piece{kind: pWord, text: "step"})
					}
				case !g.drop:
					out = append(out, piece{kind: pOp, text: ")"})
				}
				if g.closeSup {
					out = append(out, piece{kind: pSupClose})
				}
			case ",":
				if len(stack) > 0 && stack[len(stack)-1].kind == pWord {
					if sup {
						return nil, errExpr
					}
					way := "rounded down to a"
					if stack[len(stack)-1].up {
						way = "rounded up to a"
					}
					if values {
						out = append(out, piece{kind: pWord, text: way})
					} else {
						out = append(out, piece{kind: pWord, text: way + " step of"})
					}
					continue
				}
				fallthrough
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

// argNamed returns the argument called name, the last of several.
func argNamed(args []trace.Arg, name string) (trace.Arg, bool) {
	for k := len(args) - 1; k >= 0; k-- {
		if args[k].Name == name {
			return args[k], true
		}
	}
	return trace.Arg{}, false
}

// parsedExpr is an expression split into tokens: as written, and with its ternaries read out
// (ternaries); never changed once made, as it is shared by every sheet.
type parsedExpr struct {
	toks []token // the tokens as written; nil where tokenize failed
	read []token // the tokens with the ternaries read out
	err  error   // why the expression could not be read, nil if it could
}

// maxParsed bounds the entries that each shared store (readExpr's, formBySymbols') keeps.
const maxParsed = 1 << 14

var (
	parsedExprs sync.Map     // expression text → parsedExpr
	parsedCount atomic.Int64 // entries in parsedExprs
)

// readExpr returns expr split into tokens and with its ternaries read out; each expression text
// is read once (up to maxParsed of them) and shared by every sheet, safe for concurrent use.
func readExpr(expr string) parsedExpr {
	if v, ok := parsedExprs.Load(expr); ok {
		return v.(parsedExpr)
	}
	var pe parsedExpr
	pe.toks, pe.err = tokenize(expr)
	if pe.err == nil {
		pe.read, pe.err = ternaries(pe.toks)
	}
	if parsedCount.Load() < maxParsed {
		if _, loaded := parsedExprs.LoadOrStore(expr, pe); !loaded {
			parsedCount.Add(1)
		}
	}
	return pe
}

// ternaries reads out every "c ? a : b" of the tokens as "a if c, otherwise b", the way a hand
// calculation states a case distinction. The ternary binds loosest in govaluate, so within a
// group (the whole expression, a pair of parentheses or one argument of a function) everything
// before its '?' is the condition; a ':' closes the innermost open '?'.
func ternaries(ts []token) ([]token, error) {
	isOp := func(t token, op string) bool { return t.kind == tOp && t.text == op }
	// matching returns the index of the ')' that closes the '(' at i.
	matching := func(ts []token, i int) (int, error) {
		depth := 0
		for j := i; j < len(ts); j++ {
			switch {
			case isOp(ts[j], "("):
				depth++
			case isOp(ts[j], ")"):
				depth--
				if depth == 0 {
					return j, nil
				}
			}
		}
		return 0, errExpr
	}
	var segment func(ts []token) ([]token, error)
	segment = func(ts []token) ([]token, error) {
		// The first '?' outside parentheses, and the ':' that answers it.
		q, c, nest := -1, -1, 0
		for i := 0; i < len(ts) && c < 0; i++ {
			switch {
			case isOp(ts[i], "("):
				j, err := matching(ts, i)
				if err != nil {
					return nil, err
				}
				i = j
			case isOp(ts[i], "?"):
				if q < 0 {
					q = i
				} else {
					nest++
				}
			case isOp(ts[i], ":") && q >= 0:
				if nest == 0 {
					c = i
				} else {
					nest--
				}
			}
		}
		if q >= 0 {
			if c < 0 || q == 0 || c == q+1 || c == len(ts)-1 {
				return nil, errExpr
			}
			cond, err := segment(ts[:q])
			if err != nil {
				return nil, err
			}
			a, err := segment(ts[q+1 : c])
			if err != nil {
				return nil, err
			}
			b, err := segment(ts[c+1:])
			if err != nil {
				return nil, err
			}
			out := append(append([]token{}, a...), token{tWord, "if"})
			out = append(append(out, cond...), token{tWord, ", otherwise"})
			return append(out, b...), nil
		}
		// No ternary at this level: read out those within each parenthesised group, argument
		// by argument.
		var out []token
		for i := 0; i < len(ts); i++ {
			if !isOp(ts[i], "(") {
				out = append(out, ts[i])
				continue
			}
			j, err := matching(ts, i)
			if err != nil {
				return nil, err
			}
			out = append(out, ts[i])
			start, depth := i+1, 0
			for k := i + 1; k <= j; k++ {
				switch {
				case isOp(ts[k], "("):
					depth++
				case isOp(ts[k], ")") && depth > 0:
					depth--
				case depth == 0 && (isOp(ts[k], ",") || k == j):
					part, err := segment(ts[start:k])
					if err != nil {
						return nil, err
					}
					out = append(append(out, part...), ts[k])
					start = k + 1
				}
			}
			i = j
		}
		return out, nil
	}
	return segment(ts)
}

// shown is a step's formula laid out for display.
type shown struct {
	Formula []piece // the formula by symbols, led by the result's symbol ("f_cd = α_cc·f_ck/γ_c"); nil when none is shown
	Values  []piece // the formula with the arguments' values ("1·32 MPa/1.5"), ending "→ yes" for a condition; nil when none is shown
	Result  []piece // the result: "f_cd = 21.33 MPa", "c_a = yes", or "not met" for a failed check without a ratio
	Text    string  // the formula as written, where it could not be laid out (shown as text); "" otherwise
}

// showStep lays out the formula of step s for the sheets: its display form (Step.Show) where
// the engine gave one, else its evaluation expression; input and table steps show no formula.
// Values are shown in the display unit of each quantity (DisplayQuantity).
func showStep(s trace.Step) shown {
	var out shown
	symbol := s.Symbol
	if s.Kind == trace.KindCheck && symbol == "" {
		symbol = "η"
	}
	expr, words := s.Expr, ""
	if s.Show != nil {
		expr, words = s.Show.Expr, s.Show.Result
	}
	switch {
	case words != "" && s.Kind == trace.KindCheck:
		out.Result = []piece{{kind: pWord, text: words}}
	case words != "":
		out.Result = led(symbol, 0, piece{kind: pWord, text: words})
	default:
		n, u := quantityOf(s.Value, s.Unit, s.Symbol)
		out.Result = led(symbol, 0, piece{kind: pNum, n: n, unit: u})
	}
	if expr == "" || s.Kind == trace.KindInput || s.Kind == trace.KindTable {
		return out
	}
	f := formBySymbols(expr, symbol, s.Args)
	switch {
	case f.failed:
		out.Text = expr
		return out
	case f.alone:
		return out // a number alone ("r_m = 1"): the result says it
	}
	out.Formula = f.formula
	if !f.usesArgs {
		return out // nothing to substitute: the values would repeat the formula
	}
	var scratch [64]piece // laid out here first, then kept at its own length
	vs, err := layoutTo(scratch[:0], f.pe, s.Args, true)
	if err != nil {
		return out
	}
	if words != "" {
		out.Values = led("", 2, vs...)
		out.Values = append(out.Values, piece{kind: pOp, text: "→"}, piece{kind: pWord, text: words})
	} else {
		out.Values = led("", 0, vs...)
	}
	return out
}

// led returns the pieces "symbol =" (none for no symbol) followed by ps, in a slice of its own
// with room for more pieces.
func led(symbol string, more int, ps ...piece) []piece {
	if symbol == "" {
		return append(make([]piece, 0, len(ps)+more), ps...)
	}
	out := append(make([]piece, 0, 2+len(ps)+more), piece{kind: pSym, text: symbol}, piece{kind: pOp, text: "="})
	return append(out, ps...)
}

// symbolForm is the formula of a step by symbols, laid out once for every step whose
// expression, result symbol and arguments' symbols are the same.
type symbolForm struct {
	pe       parsedExpr // the expression read
	uses     []argUse   // what each identifier of the expression stood for
	usesArgs bool       // some identifier is an argument (usesArgs)
	failed   bool       // the expression could not be laid out
	alone    bool       // the expression is a number alone
	formula  []piece    // led by the result's symbol; nil for none; shared, so never changed
}

// argUse is what an identifier of an expression stood for: the symbol of the argument of that
// name, or no argument.
type argUse struct {
	name, symbol string
	found        bool
}

// formKey names a symbolForm: the expression and the result's symbol.
type formKey struct{ expr, symbol string }

var (
	symbolForms    sync.Map     // formKey → *symbolForm, the first laid out for that key
	symbolFormSize atomic.Int64 // entries in symbolForms
)

// formBySymbols returns the formula by symbols of the expression expr of a step whose result is
// called symbol, with arguments args: the one laid out before for the same expression, symbol
// and argument symbols (up to maxParsed of them), else laid out now. Safe for concurrent use.
func formBySymbols(expr, symbol string, args []trace.Arg) *symbolForm {
	key := formKey{expr, symbol}
	if v, ok := symbolForms.Load(key); ok {
		if f := v.(*symbolForm); f.fits(args) {
			return f
		}
		return newSymbolForm(readExpr(expr), symbol, args)
	}
	f := newSymbolForm(readExpr(expr), symbol, args)
	if symbolFormSize.Load() < maxParsed {
		if _, loaded := symbolForms.LoadOrStore(key, f); !loaded {
			symbolFormSize.Add(1)
		}
	}
	return f
}

// newSymbolForm lays out the formula by symbols of the expression pe, led by symbol.
func newSymbolForm(pe parsedExpr, symbol string, args []trace.Arg) *symbolForm {
	f := &symbolForm{pe: pe, usesArgs: usesArgs(pe.toks, args)}
	for _, t := range pe.read {
		if t.kind == tIdent && !f.has(t.text) {
			a, ok := argNamed(args, t.text)
			f.uses = append(f.uses, argUse{name: t.text, symbol: a.Symbol, found: ok})
		}
	}
	var scratch [64]piece // laid out here first, then kept at its own length
	ps, err := layoutTo(scratch[:0], pe, args, false)
	switch {
	case err != nil:
		f.failed = true
	case len(ps) == 1 && ps[0].kind == pNum:
		f.alone = true
	case symbol != "" || len(ps) > 0: // else nil: nothing is shown
		f.formula = led(symbol, 0, ps...)
	}
	return f
}

// has reports whether the form records the identifier name.
func (f *symbolForm) has(name string) bool {
	for _, u := range f.uses {
		if u.name == name {
			return true
		}
	}
	return false
}

// fits reports whether every identifier stands in args for what it stood for when f was laid out.
func (f *symbolForm) fits(args []trace.Arg) bool {
	for _, u := range f.uses {
		a, ok := argNamed(args, u.name)
		if ok != u.found || ok && a.Symbol != u.symbol {
			return false
		}
	}
	return true
}

// usesArgs reports whether the tokens of an expression name any of the arguments.
func usesArgs(toks []token, args []trace.Arg) bool {
	for _, t := range toks {
		if t.kind != tIdent {
			continue
		}
		for _, a := range args {
			if a.Name == t.text {
				return true
			}
		}
	}
	return false
}
