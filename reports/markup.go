package reports

import (
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
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
	n := len(prefix) // the length of the name, to make it in one piece
	for i := 0; i < len(id); {
		r, w := anchorRune(id, i)
		i += w
		if anchorKept(r) {
			n++
		} else {
			n += anchorHexLen(r)
		}
	}
	var b strings.Builder
	b.Grow(n)
	b.WriteString(prefix)
	for i := 0; i < len(id); {
		r, w := anchorRune(id, i)
		i += w
		switch {
		case r == '/':
			b.WriteByte('.')
		case anchorKept(r):
			b.WriteByte(byte(r))
		default:
			var hex [16]byte
			b.WriteByte('-')
			b.Write(strconv.AppendInt(hex[:0], int64(r), 16)) // lower case already
			b.WriteByte('-')
		}
	}
	return b.String()
}

// anchorRune returns the character at byte i of id and its width, as ranging over id gives it.
func anchorRune(id string, i int) (rune, int) {
	if id[i] < utf8.RuneSelf {
		return rune(id[i]), 1
	}
	return utf8.DecodeRuneInString(id[i:])
}

// anchorKept reports whether anchorName writes r as one byte: an ASCII letter or digit, or '/'.
func anchorKept(r rune) bool {
	return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '/'
}

// anchorHexLen is the length of "-XX-", the hex code of r between dashes.
func anchorHexLen(r rune) int {
	n := 3
	for r >= 16 {
		r >>= 4
		n++
	}
	return n
}

// nextSymbol returns the byte range [i, j) of the first symbol with a subscript, such as
// "f_cd", "λ_lim" or "M_Ed,y", in s at or after byte from: a letter and letters or digits, '_',
// letters or digits, then any number of ',' and letters or digits, each run as long as it goes
// (the regular expression \pL[\pL\pN]*_[\pL\pN]+(?:,[\pL\pN]+)* finds the same); i < 0 for none.
func nextSymbol(s string, from int) (i, j int) {
	for k := from; k < len(s); {
		end, start := symbolRun(s, k)
		if end == k { // not a letter or digit
			_, w := utf8.DecodeRuneInString(s[k:])
			k += w
			continue
		}
		if start >= 0 && end < len(s) && s[end] == '_' {
			if e, _ := symbolRun(s, end+1); e > end+1 {
				for e < len(s) && s[e] == ',' {
					f, _ := symbolRun(s, e+1)
					if f == e+1 {
						break
					}
					e = f
				}
				return start, e
			}
		}
		k = end
	}
	return -1, -1
}

// symbolRun returns the end of the run of letters and digits that starts at byte k of s, and
// where its first letter is (-1 for none).
func symbolRun(s string, k int) (end, letter int) {
	letter = -1
	for k < len(s) {
		if c := s[k]; c < utf8.RuneSelf { // ASCII: the letters and digits are the only ones
			switch {
			case c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z':
				if letter < 0 {
					letter = k
				}
			case c < '0' || c > '9':
				return k, letter
			}
			k++
			continue
		}
		r, w := utf8.DecodeRuneInString(s[k:])
		switch {
		case unicode.IsLetter(r):
			if letter < 0 {
				letter = k
			}
		case !unicode.IsNumber(r):
			return k, letter
		}
		k += w
	}
	return k, letter
}

// richWith escapes s with text and shows every symbol in it with sym.
func richWith(s string, text, sym func(string) string) string {
	if strings.IndexByte(s, '_') < 0 {
		return text(s) // no subscript, no symbol
	}
	i, j := nextSymbol(s, 0)
	if i < 0 {
		return text(s)
	}
	var b strings.Builder
	last := 0
	for i >= 0 {
		b.WriteString(text(s[last:i]))
		b.WriteString(sym(s[i:j]))
		last = j
		i, j = nextSymbol(s, j)
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
	for i := 0; i < len(s); i++ {
		if c := s[i]; c < 0x20 || c >= 0x7f {
			return strings.Map(oneLineRune, s)
		}
	}
	return s // printable ASCII only
}

// oneLineRune is the character oneLine puts for r.
func oneLineRune(r rune) rune {
	if unicode.IsControl(r) || r == '\u2028' || r == '\u2029' {
		return ' '
	}
	return r
}

// ---- Markdown ----

// md lays text out as CommonMark with GFM tables. Symbols use inline <sub>/<sup> tags that
// the renderer writes itself; every text character that Markdown or HTML would interpret is
// backslash-escaped, so user text can never produce markup or raw HTML.
type md struct{}

// mdSpecial lists the characters escaped anywhere in Markdown text.
const mdSpecial = "\\`*_{}[]<>&|~$#!"

// mdEscaped marks the characters of mdSpecial.
var mdEscaped = func() (t [utf8.RuneSelf]bool) {
	for _, c := range mdSpecial {
		t[c] = true
	}
	return t
}()

func (md) text(s string) string { return mdEscape(s, true) }

// mdEscape backslash-escapes the Markdown specials in s; with leading, also the characters
// that would start a list or heading at the start of a line.
func mdEscape(s string, leading bool) string {
	s = oneLine(s) // valid UTF-8 from here on: a byte below 0x80 is a character
	escape := func(i int) bool {
		c := s[i]
		return c < utf8.RuneSelf && mdEscaped[c] || leading && i == 0 && (c == '-' || c == '+' || c == '=')
	}
	n := 0
	for i := 0; i < len(s); i++ {
		if escape(i) {
			n++
		}
	}
	out := s
	if n > 0 {
		var b strings.Builder
		b.Grow(len(s) + n)
		for i := 0; i < len(s); i++ {
			if escape(i) {
				b.WriteByte('\\')
			}
			b.WriteByte(s[i])
		}
		out = b.String()
	}
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
	var b strings.Builder
	b.Grow(len(s) + len("<sub></sub>"))
	m.writeSym(&b, s)
	return b.String()
}

// writeSym writes the symbol s as sym returns it.
func (m md) writeSym(b *strings.Builder, s string) {
	base, sub := splitSymbol(oneLine(s))
	b.WriteString(m.text(base))
	if sub != "" {
		b.WriteString("<sub>")
		b.WriteString(m.text(sub))
		b.WriteString("</sub>")
	}
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
	b.Grow(12 * len(ps))
	sup := 0
	for _, p := range ps {
		switch p.kind {
		case pWord:
			// Words stand apart from what is around them; ", otherwise" follows its clause.
			if b.Len() > 0 && !strings.HasSuffix(b.String(), " ") && !strings.HasPrefix(p.text, ",") {
				b.WriteString(" ")
			}
			b.WriteString(m.text(p.text))
			b.WriteByte(' ')
		case pFloorOpen:
			b.WriteString("⌊")
		case pFloorClose:
			b.WriteString("⌋")
		case pCeilOpen:
			b.WriteString("⌈")
		case pCeilClose:
			b.WriteString("⌉")
		case pSym:
			m.writeSym(&b, p.text)
		case pText:
			b.WriteString(mdEscape(p.text, false))
		case pNum:
			if p.lit {
				b.WriteString(mdEscape(p.text, false))
			} else {
				b.WriteString(m.num(p.n))
			}
			if p.unit != "" {
				b.WriteString("\u00a0")
				b.WriteString(m.text(p.unit))
			}
		case pOp:
			op := mdEscape(p.text, false)
			switch {
			case p.unary || p.text == "(" || p.text == ")" || sup > 0 && p.text != ",":
				b.WriteString(op)
			case p.text == ",":
				b.WriteString(", ")
			case strings.HasSuffix(b.String(), " "):
				b.WriteString(op)
				b.WriteByte(' ')
			default:
				b.WriteByte(' ')
				b.WriteString(op)
				b.WriteByte(' ')
			}
		case pFunc:
			b.WriteString(m.text(p.text))
			b.WriteByte('(')
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

func (tex) text(s string) string { return texEscape(oneLine(s), &texTextASCII, texTextRune) }

// texTextRune writes r as text mode sets it.
func texTextRune(b *strings.Builder, r rune) {
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

// texASCII is what text or math mode writes for each ASCII character; plain marks those
// written as they are.
type texASCII struct {
	out   [utf8.RuneSelf]string
	plain [utf8.RuneSelf]bool
}

var (
	texTextASCII = asciiOf(texTextRune)
	texMathASCII = asciiOf(texMathRune)
)

// asciiOf tabulates what write writes for each ASCII character.
func asciiOf(write func(*strings.Builder, rune)) (t texASCII) {
	for c := range utf8.RuneSelf {
		var b strings.Builder
		write(&b, rune(c))
		t.out[c] = b.String()
		t.plain[c] = t.out[c] == string(rune(c))
	}
	return t
}

// texEscape writes every character of s (valid UTF-8) as write does, the ASCII ones from the
// table ascii; s itself where every character is written as it is.
func texEscape(s string, ascii *texASCII, write func(*strings.Builder, rune)) string {
	k := 0
	for k < len(s) && s[k] < utf8.RuneSelf && ascii.plain[s[k]] {
		k++
	}
	if k == len(s) {
		return s
	}
	var b strings.Builder
	b.Grow(len(s) + 16)
	b.WriteString(s[:k])
	for _, r := range s[k:] {
		if r < utf8.RuneSelf {
			b.WriteString(ascii.out[r])
		} else {
			write(&b, r)
		}
	}
	return b.String()
}

// mathText escapes s for math mode.
func (tex) mathText(s string) string { return texEscape(oneLine(s), &texMathASCII, texMathRune) }

// texMathRune writes r as math mode sets it.
func texMathRune(b *strings.Builder, r rune) {
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

// mathSym lays a symbol out for math mode: the base in math italic, the subscript upright.
func (t tex) mathSym(s string) string {
	base, sub := splitSymbol(s)
	if sub == "" {
		return t.mathText(base)
	}
	var b strings.Builder
	b.Grow(len(s) + len(`{}_{\mathrm{}}`))
	t.writeMathSym(&b, s)
	return b.String()
}

// writeMathSym writes the symbol s as mathSym returns it.
func (t tex) writeMathSym(b *strings.Builder, s string) {
	base, sub := splitSymbol(s)
	if sub == "" {
		b.WriteString(t.mathText(base))
		return
	}
	b.WriteString("{")
	b.WriteString(t.mathText(base))
	b.WriteString(`}_{\mathrm{`)
	b.WriteString(t.mathText(sub))
	b.WriteString("}}")
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
	b.Grow(16 * len(ps))
	b.WriteString("$")
	prev := pieceKind(-1)
	for _, p := range ps {
		switch p.kind {
		case pWord:
			// Words are spaced from their neighbours; an operator before them spaces itself.
			if !strings.HasPrefix(p.text, ",") && prev != pOp && prev != -1 {
				b.WriteString(`\ `)
			}
			b.WriteString(`\text{`)
			b.WriteString(t.text(p.text))
			b.WriteString(`}\ `)
		case pFloorOpen:
			b.WriteString(`\lfloor `)
		case pFloorClose:
			b.WriteString(`\rfloor `)
		case pCeilOpen:
			b.WriteString(`\lceil `)
		case pCeilClose:
			b.WriteString(`\rceil `)
		case pSym:
			t.writeMathSym(&b, p.text)
		case pText:
			b.WriteString(`\mathrm{`)
			b.WriteString(t.mathText(p.text))
			b.WriteByte('}')
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
				r, _ := utf8.DecodeRuneInString(p.text)
				b.WriteString(texMathRunes[r])
				b.WriteByte(' ')
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
