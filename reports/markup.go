package reports

import (
	"regexp"
	"strconv"
	"strings"
	"unicode"
)

// markup escapes text and lays out symbols, numbers and formulas for one output format.
type markup interface {
	text(s string) string                    // plain text, user-supplied or not, escaped
	rich(s string) string                    // engine text in which symbols like "f_cd" are shown as symbols
	sym(s string) string                     // a display symbol such as "M_Ed,y"
	num(n num) string                        // a number in running text
	qty(v float64, engineUnit string) string // a value in engine units shown in display units
	formula(ps []piece) string               // a formula laid out from pieces
	link(label, target string) string        // label (already marked up) linked to target; the label alone when target is ""
	anchor(name string) string               // a link target named name (from anchorName)
	listing(line string) string              // one line of a verbatim listing (the input file)
	picture(g drawing) string                // a drawing for the format: SVG, or TikZ and pgfplots for LaTeX
	changed(s string) string                 // a value (already marked up) changed since the previous revision
}

// anchorName turns a step ID or sheet name into a link-target name of ASCII letters, digits,
// '.' and '-' only, the same in every format and distinct for distinct IDs: '/' becomes '.',
// any other character outside [A-Za-z0-9] becomes "-XX-" with its hex code.
func anchorName(prefix, id string) string {
	var b strings.Builder
	b.WriteString(prefix)
	for _, r := range id {
		switch {
		case r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9':
			b.WriteRune(r)
		case r == '/':
			b.WriteByte('.')
		default:
			b.WriteString("-" + strings.ToLower(strconv.FormatInt(int64(r), 16)) + "-")
		}
	}
	return b.String()
}

// symbolRE finds symbols with a subscript, such as "f_cd", "λ_lim", "M_Ed,y", in running text.
var symbolRE = regexp.MustCompile(`\pL[\pL\pN]*_[\pL\pN]+(?:,[\pL\pN]+)*`)

// richWith escapes s with text and shows every symbol in it with sym.
func richWith(s string, text, sym func(string) string) string {
	var b strings.Builder
	last := 0
	for _, m := range symbolRE.FindAllStringIndex(s, -1) {
		b.WriteString(text(s[last:m[0]]))
		b.WriteString(sym(s[m[0]:m[1]]))
		last = m[1]
	}
	b.WriteString(text(s[last:]))
	return b.String()
}

// splitSymbol splits a symbol at its first underscore into the base and the subscript.
func splitSymbol(s string) (base, sub string) {
	if i := strings.IndexByte(s, '_'); i >= 0 {
		return s[:i], s[i+1:]
	}
	return s, ""
}

// oneLine replaces line breaks, tabs and other control characters by spaces.
func oneLine(s string) string {
	return strings.Map(func(r rune) rune {
		if unicode.IsControl(r) || r == '\u2028' || r == '\u2029' {
			return ' '
		}
		return r
	}, s)
}

// ---- Markdown ----

// md lays text out as CommonMark with GFM tables. Symbols use inline <sub>/<sup> tags that
// the renderer writes itself; every text character that Markdown or HTML would interpret is
// backslash-escaped, so user text can never produce markup or raw HTML.
type md struct{}

// mdSpecial lists the characters escaped anywhere in Markdown text.
const mdSpecial = "\\`*_{}[]<>&|~$#!"

func (md) text(s string) string { return mdEscape(s, true) }

// mdEscape backslash-escapes the Markdown specials in s; with leading, also the characters
// that would start a list or heading at the start of a line.
func mdEscape(s string, leading bool) string {
	s = oneLine(s)
	var b strings.Builder
	for i, r := range s {
		if r < 0x80 && strings.ContainsRune(mdSpecial, r) {
			b.WriteByte('\\')
		} else if leading && i == 0 && (r == '-' || r == '+' || r == '=') {
			b.WriteByte('\\')
		}
		b.WriteRune(r)
	}
	out := b.String()
	// a leading "1." or "1)" would start an ordered list
	j := 0
	for j < len(out) && out[j] >= '0' && out[j] <= '9' {
		j++
	}
	if leading && j > 0 && j < len(out) && (out[j] == '.' || out[j] == ')') {
		out = out[:j] + "\\" + out[j:]
	}
	return out
}

func (m md) rich(s string) string { return richWith(s, m.text, m.sym) }

func (md) link(label, target string) string {
	if target == "" {
		return label
	}
	return "[" + label + "](" + target + ")"
}

func (md) anchor(name string) string { return `<a id="` + name + `"></a>` }

// listing keeps the line as it is: it goes inside a fenced code block, where nothing is markup.
func (md) listing(line string) string { return oneLine(line) }

// picture is the inline SVG, a raw HTML block (it holds no blank line) that goldmark passes on.
func (md) picture(g drawing) string { return g.SVG() }

// changed highlights a changed value; the HTML renders <mark> as a highlight.
func (md) changed(s string) string { return "<mark>" + s + "</mark>" }

func (m md) sym(s string) string {
	base, sub := splitSymbol(oneLine(s))
	if sub == "" {
		return m.text(base)
	}
	return m.text(base) + "<sub>" + m.text(sub) + "</sub>"
}

func (md) num(n num) string {
	s := strings.Replace(n.m, "-", "−", 1)
	if n.e != 0 {
		s += "×10<sup>" + strings.Replace(itoa(n.e), "-", "−", 1) + "</sup>"
	}
	return s
}

func (m md) qty(v float64, u string) string {
	n, du := quantity(v, u)
	if du == "" {
		return m.num(n)
	}
	return m.num(n) + "\u00a0" + m.text(du)
}

func (m md) formula(ps []piece) string {
	var b strings.Builder
	sup := 0
	for _, p := range ps {
		switch p.kind {
		case pWord:
			// Words stand apart from what is around them; ", otherwise" follows its clause.
			if b.Len() > 0 && !strings.HasSuffix(b.String(), " ") && !strings.HasPrefix(p.text, ",") {
				b.WriteString(" ")
			}
			b.WriteString(m.text(p.text) + " ")
		case pFloorOpen:
			b.WriteString("⌊")
		case pFloorClose:
			b.WriteString("⌋")
		case pCeilOpen:
			b.WriteString("⌈")
		case pCeilClose:
			b.WriteString("⌉")
		case pSym:
			b.WriteString(m.sym(p.text))
		case pText:
			b.WriteString(mdEscape(p.text, false))
		case pNum:
			if p.lit {
				b.WriteString(mdEscape(p.text, false))
			} else {
				b.WriteString(m.num(p.n))
			}
			if p.unit != "" {
				b.WriteString("\u00a0" + m.text(p.unit))
			}
		case pOp:
			op := mdEscape(p.text, false)
			switch {
			case p.unary || p.text == "(" || p.text == ")" || sup > 0 && p.text != ",":
				b.WriteString(op)
			case p.text == ",":
				b.WriteString(", ")
			case strings.HasSuffix(b.String(), " "):
				b.WriteString(op + " ")
			default:
				b.WriteString(" " + op + " ")
			}
		case pFunc:
			b.WriteString(m.text(p.text) + "(")
		case pSupOpen:
			sup++
			b.WriteString("<sup>")
		case pSupClose:
			sup--
			b.WriteString("</sup>")
		case pSqrtOpen:
			b.WriteString("√(")
		case pSqrtClose:
			b.WriteString(")")
		case pAbsOpen, pAbsClose:
			b.WriteString("\\|")
		}
	}
	return strings.TrimRight(b.String(), " ")
}

func itoa(i int) string {
	if i == 0 {
		return "0"
	}
	neg := i < 0
	if neg {
		i = -i
	}
	var d []byte
	for i > 0 {
		d = append([]byte{byte('0' + i%10)}, d...)
		i /= 10
	}
	if neg {
		return "-" + string(d)
	}
	return string(d)
}

// ---- LaTeX ----

// tex lays text out for pdflatex with fontenc T1 and inputenc utf8. Special characters are
// escaped; Greek letters and the symbols used in the trace are mapped to math; characters
// that the T1 fonts cannot show are replaced by "?".
type tex struct{}

// texMathRunes maps Unicode letters and symbols to LaTeX math.
var texMathRunes = map[rune]string{
	'α': `\alpha`, 'β': `\beta`, 'γ': `\gamma`, 'δ': `\delta`, 'ε': `\varepsilon`, 'ζ': `\zeta`,
	'η': `\eta`, 'θ': `\theta`, 'ι': `\iota`, 'κ': `\kappa`, 'λ': `\lambda`, 'μ': `\mu`, 'ν': `\nu`,
	'ξ': `\xi`, 'π': `\pi`, 'ρ': `\rho`, 'σ': `\sigma`, 'ς': `\varsigma`, 'τ': `\tau`, 'υ': `\upsilon`,
	'φ': `\varphi`, 'ϕ': `\phi`, 'χ': `\chi`, 'ψ': `\psi`, 'ω': `\omega`, 'ϑ': `\vartheta`,
	'Γ': `\Gamma`, 'Δ': `\Delta`, 'Θ': `\Theta`, 'Λ': `\Lambda`, 'Ξ': `\Xi`, 'Π': `\Pi`,
	'Σ': `\Sigma`, 'Υ': `\Upsilon`, 'Φ': `\Phi`, 'Ψ': `\Psi`, 'Ω': `\Omega`,
	'·': `\cdot`, '⋅': `\cdot`, '×': `\times`, '÷': `\div`, '±': `\pm`, '−': `-`, '∓': `\mp`,
	'≤': `\leq`, '≥': `\geq`, '≠': `\neq`, '≈': `\approx`, '∞': `\infty`, '√': `\surd`,
	'→': `\rightarrow`, '←': `\leftarrow`, '⇒': `\Rightarrow`, '∑': `\sum`, '∂': `\partial`,
	'′': `'`, '°': `^{\circ}`, '²': `^{2}`, '³': `^{3}`, '¹': `^{1}`, '⁴': `^{4}`,
	'⁰': `^{0}`, '⁵': `^{5}`, '⁶': `^{6}`, '⁷': `^{7}`, '⁸': `^{8}`, '⁹': `^{9}`,
	'⌊': `\lfloor`, '⌋': `\rfloor`, '⌈': `\lceil`, '⌉': `\rceil`,
	'‰': `\text{\textperthousand}`, 'µ': `\mu`, 'Ø': `\text{\O}`, 'ø': `\text{\o}`, '∅': `\emptyset`,
	'∈': `\in`, '∣': `\mid`, '‖': `\|`, '…': `\dots`, '⁻': `^{-}`,
}

// texTextRunes maps characters that text mode must spell out.
var texTextRunes = map[rune]string{
	'\\': `\textbackslash{}`, '{': `\{`, '}': `\}`, '$': `\$`, '&': `\&`, '%': `\%`, '#': `\#`,
	'_': `\_`, '~': `\textasciitilde{}`, '^': `\textasciicircum{}`, '<': `\textless{}`,
	'>': `\textgreater{}`, '|': `\textbar{}`, '"': `\textquotedbl{}`, '[': `{[}`, ']': `{]}`,
	'`': `\textasciigrave{}`, '\'': `\textquotesingle{}`, '–': `--`, '—': `---`, '‘': "`", '’': `'`,
	'“': "``", '”': `''`, '„': `\quotedblbase{}`, '•': `\textbullet{}`, '€': `\texteuro{}`,
	'²': `\textsuperscript{2}`, '³': `\textsuperscript{3}`, '¹': `\textsuperscript{1}`,
	'⁴': `\textsuperscript{4}`, '⁰': `\textsuperscript{0}`, '⁵': `\textsuperscript{5}`,
	'⁶': `\textsuperscript{6}`, '⁷': `\textsuperscript{7}`, '⁸': `\textsuperscript{8}`, '⁹': `\textsuperscript{9}`,
	'‰': `\textperthousand{}`, '°': `\textdegree{}`, '…': `\dots{}`,
	'\u00a0': `~`, '\u2009': `\,`, '\u202f': `\,`, '\u00ad': `\-`,
}

// texLatin reports whether inputenc's utf8 with T1 fonts sets r (Latin-1 and most of Latin Extended-A).
func texLatin(r rune) bool {
	if r < 0xa0 || r > 0x17e {
		return false
	}
	switch r {
	case 0x126, 0x127, 0x138, 0x13f, 0x140, 0x149, 0x166, 0x167:
		return false
	}
	return true
}

func (tex) text(s string) string {
	s = oneLine(s)
	var b strings.Builder
	for _, r := range s {
		switch {
		case texTextRunes[r] != "":
			b.WriteString(texTextRunes[r])
		case r >= 0x20 && r < 0x7f:
			b.WriteRune(r)
		case texMathRunes[r] != "":
			b.WriteString(`\ensuremath{` + texMathRunes[r] + `}`)
		case texLatin(r):
			b.WriteRune(r)
		default:
			b.WriteByte('?')
		}
	}
	return b.String()
}

// mathText escapes s for math mode.
func (tex) mathText(s string) string {
	s = oneLine(s)
	var b strings.Builder
	for _, r := range s {
		switch {
		case texMathRunes[r] != "":
			b.WriteString(texMathRunes[r])
			if strings.HasPrefix(texMathRunes[r], `\`) {
				b.WriteString("{}")
			}
		case r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9':
			b.WriteRune(r)
		case strings.ContainsRune(".,;:!?()[]/+-*=<>|' @", r):
			if r == ' ' {
				b.WriteString(`\ `)
			} else if r == '*' {
				b.WriteString(`\ast{}`)
			} else {
				b.WriteRune(r)
			}
		case strings.ContainsRune(`{}$&%#_`, r):
			b.WriteString(`\` + string(r))
		case r == '\\':
			b.WriteString(`\backslash{}`)
		case r == '~':
			b.WriteString(`\sim{}`)
		case r == '^':
			b.WriteString(`\wedge{}`)
		case r == '"':
			b.WriteString(`\text{\textquotedbl}`)
		case r == '`':
			b.WriteString(`\text{\textasciigrave}`)
		case r >= 0x80 && texTextRunes[r] != "":
			// A character that text mode spells out, such as the en dash of "A1–B1".
			b.WriteString(`\text{` + texTextRunes[r] + `}`)
		case texLatin(r):
			b.WriteString(`\text{` + string(r) + `}`)
		default:
			b.WriteByte('?')
		}
	}
	return b.String()
}

// mathSym lays a symbol out for math mode: the base in math italic, the subscript upright.
func (t tex) mathSym(s string) string {
	base, sub := splitSymbol(s)
	if sub == "" {
		return t.mathText(base)
	}
	return "{" + t.mathText(base) + `}_{\mathrm{` + t.mathText(sub) + "}}"
}

// mathNum lays a number out for math mode.
func (tex) mathNum(n num) string {
	if n.e == 0 {
		return n.m
	}
	return n.m + `\times 10^{` + itoa(n.e) + "}"
}

// mathUnit lays a display unit out upright in math mode, with superscript digits raised and
// a thin space for each space ("× 10⁶ mm⁴" as ×\,10⁶\,mm⁴).
func (t tex) mathUnit(u string) string {
	var b strings.Builder
	b.WriteString(`\,`)
	var word strings.Builder
	flush := func() {
		if word.Len() > 0 {
			b.WriteString(`\mathrm{` + t.mathText(word.String()) + "}")
			word.Reset()
		}
	}
	for _, r := range u {
		switch r {
		case '²', '³', '¹', '⁴', '⁰', '⁵', '⁶', '⁷', '⁸', '⁹', '°':
			flush()
			b.WriteString(texMathRunes[r])
		case '×':
			flush()
			b.WriteString(`\times`)
		case ' ':
			flush()
			b.WriteString(`\,`)
		default:
			word.WriteRune(r)
		}
	}
	flush()
	return b.String()
}

func (t tex) rich(s string) string { return richWith(s, t.text, t.sym) }

// link makes an internal hyperlink; targets are anchor names, or "" for none.
func (tex) link(label, target string) string {
	if target == "" {
		return label
	}
	return `\hyperlink{` + strings.TrimPrefix(target, "#") + "}{" + label + "}"
}

func (tex) anchor(name string) string { return `\hypertarget{` + name + `}{}` }

func (tex) picture(g drawing) string { return g.PGF() }

// changed marks a changed value (\csrev: a bar in the margin and the value highlighted).
func (tex) changed(s string) string { return `\csrev{` + s + `}` }

// listing sets the line in typewriter type, every space kept.
func (t tex) listing(line string) string {
	return `\texttt{` + strings.ReplaceAll(t.text(line), " ", "~") + `}`
}

func (t tex) sym(s string) string { return "$" + t.mathSym(s) + "$" }

func (t tex) num(n num) string { return "$" + t.mathNum(n) + "$" }

func (t tex) qty(v float64, u string) string {
	n, du := quantity(v, u)
	if du == "" {
		return t.num(n)
	}
	return "$" + t.mathNum(n) + t.mathUnit(du) + "$"
}

func (t tex) formula(ps []piece) string {
	var b strings.Builder
	b.WriteString("$")
	prev := pieceKind(-1)
	for _, p := range ps {
		switch p.kind {
		case pWord:
			// Words are spaced from their neighbours; an operator before them spaces itself.
			if strings.HasPrefix(p.text, ",") || prev == pOp || prev == -1 {
				b.WriteString(`\text{` + t.text(p.text) + `}\ `)
			} else {
				b.WriteString(`\ \text{` + t.text(p.text) + `}\ `)
			}
		case pFloorOpen:
			b.WriteString(`\lfloor `)
		case pFloorClose:
			b.WriteString(`\rfloor `)
		case pCeilOpen:
			b.WriteString(`\lceil `)
		case pCeilClose:
			b.WriteString(`\rceil `)
		case pSym:
			b.WriteString(t.mathSym(p.text))
		case pText:
			b.WriteString(`\mathrm{` + t.mathText(p.text) + "}")
		case pNum:
			if p.lit {
				b.WriteString(t.mathText(p.text))
			} else {
				b.WriteString(t.mathNum(p.n))
			}
			if p.unit != "" {
				b.WriteString(t.mathUnit(p.unit))
			}
		case pOp:
			switch p.text {
			case "·":
				b.WriteString(`\cdot `)
			case "−":
				if p.unary {
					b.WriteString("-{}") // a tight unary minus
				} else {
					b.WriteString("-")
				}
			case "≤", "≥", "≠", "→":
				b.WriteString(texMathRunes[[]rune(p.text)[0]] + " ")
			case "and", "or", "not":
				b.WriteString(`\ \text{` + p.text + `}\ `)
			case ",":
				b.WriteString(`,\allowbreak\ `) // a long argument list may break after a comma
			default:
				b.WriteString(t.mathText(p.text))
			}
		case pFunc:
			switch p.text {
			case "min", "max":
				b.WriteString(`\` + p.text + "(")
			default:
				b.WriteString(`\mathrm{` + t.mathText(p.text) + "}(")
			}
		case pSupOpen:
			if prev == pSupClose {
				b.WriteString("{}")
			}
			b.WriteString("^{")
		case pSupClose, pSqrtClose:
			b.WriteString("}")
		case pSqrtOpen:
			b.WriteString(`\sqrt{`)
		case pAbsOpen:
			b.WriteString(`\lvert `)
		case pAbsClose:
			b.WriteString(`\rvert `)
		}
		prev = p.kind
	}
	b.WriteString("$")
	return b.String()
}
