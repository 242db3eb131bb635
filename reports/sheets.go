package reports

import (
	"bytes"
	"fmt"
	"io/fs"
	"sort"
	"strings"
	"text/template"
	"unicode"

	"colsheet/calc/code"
	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/calc/trace"
	"colsheet/templates"
)

// Sheet is one output file: its safe base name, with extension, and its contents.
type Sheet struct {
	Name string // file base name with extension, e.g. "index.md" or "K1-L1.md"; never a path
	Data []byte
}

// Cautions are printed on every sheet.
var Cautions = []string{
	"These results must be checked by a competent engineer before use.",
	"The national annex and local regulations of the place of construction govern; parameters shown are EN recommended values unless listed as overridden.",
	"Every number on this sheet is taken from a recorded calculation step; the step list is also in results.json.",
}

// ---- view model: every string is already escaped for the format ----

type projectView struct {
	Title, Job, Revision, Designer, Checker, Date string
	Short                                         string // the title cut to fit a running head
	// The title, designer and checker for the PDF's metadata: plain ASCII, no markup.
	PlainTitle, PlainDesigner, PlainChecker string
}

// pdfText keeps the characters of s that a PDF information string takes safely in LaTeX
// (ASCII letters, digits, spaces and plain punctuation); others become spaces.
func pdfText(s string) string {
	var b strings.Builder
	for _, r := range oneLine(s) {
		switch {
		case r >= 'a' && r <= 'z', r >= 'A' && r <= 'Z', r >= '0' && r <= '9', strings.ContainsRune(" .,:;()/'+-", r):
			b.WriteRune(r)
		case r == '–' || r == '—':
			b.WriteByte('-')
		default:
			b.WriteByte(' ')
		}
	}
	return strings.Join(strings.Fields(b.String()), " ")
}

type overrideView struct {
	Name, Symbol, Value, Default, Clause, What string
}

type basisView struct {
	Standard, Annex string
	Overrides       []overrideView
	Choices         []kv   // method choices
	Input, SHA      string // input file and its hash
	Tool            string // tool name and version
}

type kv struct{ Label, Value string }

type axisRow struct{ Label, Y, Z string }

type stepView struct {
	Prefix   string // "B." for a step of the project basis
	Number   int
	Anchor   string // the link target of the step, already marked up for the format
	ID       string
	Title    string
	Clause   string
	Kind     string // the kind, escaped for display
	Type     string // the kind as recorded: input, formula, table, solve or check
	Formula  string // the expression in symbols, with the result symbol: "f_cd = α_cc · f_ck / γ_c"
	Values   string // the expression with the values: "1 · 32 MPa / 1.5"
	Result   string // "f_cd = 21.33 MPa"
	Value    string // the result without its symbol: "21.33 MPa"
	Row      string
	Method   string
	Verify   string // verification expression in symbols
	Residual string
	Relation string
	Verdict  string // PASS or FAIL for a check step
	Failed   bool
	Uses     string // the steps whose results this step uses, linked: "steps 3, 5" or "B2/L2 step 57"
	Notes    []string
	Cautions []string
	Changed  bool // the value differs from the previous revision's (or the step is new)
	// Folding of the sub-steps in full detail for HTML: the first step of a folded run opens it
	// (FoldOpen, with the run's length in FoldCount), the last closes it.
	FoldOpen, FoldClose bool
	FoldCount           int
}

// figureView is one drawn diagram with its caption, both marked up.
type figureView struct{ Body, Caption string }

type groupView struct {
	Title string
	Steps []stepView
}

// A run of sub-steps is folded in HTML: FoldOpen marks its first step, FoldClose its last,
// Folded the count.

// sizeRow is one line of the section-size finder's table.
type sizeRow struct {
	Column, Given, Found, Steel, Utilization string
}

type designRow struct {
	Sheet       string // "2"
	Link        string // relative link target, safe
	Column      string
	Storey      string
	Section     string
	NEd         string // kN
	MEdY, MEdZ  string // kNm
	Bars        string
	Links       string
	Utilization string
	Status      string // PASS or FAIL
	Failed      bool
}

type sheetView struct {
	H       string // Markdown: extra '#' that push the design's headings one level down in the calc document
	Sec1    string // LaTeX: the sectioning command of the design's parts ("section*", or "subsection*" in the calc document)
	Sec2    string // LaTeX: the sectioning command one level below
	Anchor  string // link target of the design's section, marked up (calc document only)
	Project projectView
	Sheet   string // "sheet 3 of 12"
	SheetNo string // "3 of 12"
	Number  int
	Total   int
	Subject string // "column K1, lift L1"
	// The subject and the program for the PDF's metadata: plain ASCII, no markup.
	PlainSubject, PlainTool string
	Cautions                []string
	Basis                   basisView

	// design sheets only
	Status         string // PASS or FAIL
	Failed         bool
	Reasons        []string
	DesignCautions []string
	Utilization    string
	Governing      string
	Summary        []kv
	Axes           []axisRow
	Diagrams       []figureView // interaction diagrams, when the result holds their data
	Groups         []groupView
	Brief          bool        // the steps one line each (the chain); else every step in full
	BasisSteps     []groupView // index and calc document: the steps of the project basis
	ScheduleLast   bool        // LaTeX: the schedule ends the document (its last page is labelled there)
	Margin         []stepView  // brief: the checks that hold with a wide margin, listed in one table

	// index only
	Designs  []designRow
	Sizes    []sizeRow  // the section-size finder, when asked for
	Schedule [][]string // the column schedule, one row per design, cells already marked up
	Failures string     // sentence on the count of failing designs
	AnyFail  bool
}

// names returns the safe, unique base names (without extension) of the designs' sheets.
func names(r *design.Result) []string {
	out := make([]string, len(r.Designs))
	used := map[string]bool{"index": true, "all": true}
	for i, d := range r.Designs {
		base := safeName(d.Column) + "-" + safeName(d.Storey)
		name := base
		for k := 2; used[strings.ToLower(name)]; k++ {
			name = fmt.Sprintf("%s-%d", base, k)
		}
		used[strings.ToLower(name)] = true
		out[i] = name
	}
	return out
}

// safeName keeps ASCII letters, digits, '_' and '-' of s, replacing every other character by '_'.
func safeName(s string) string {
	var b strings.Builder
	n := 0
	for _, r := range s {
		if n == 60 {
			break
		}
		if r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '_' || r == '-' {
			b.WriteRune(r)
		} else {
			b.WriteByte('_')
		}
		n++
	}
	if b.Len() == 0 {
		return "_"
	}
	return b.String()
}

func input(r *design.Result) *model.Input {
	if r.Input != nil {
		return r.Input
	}
	return &model.Input{Code: code.Recommended()}
}

func dash(m markup, s string) string {
	if strings.TrimSpace(s) == "" {
		return "—"
	}
	return m.text(s)
}

func project(m markup, in *model.Input) projectView {
	p := in.Project
	return projectView{Title: dash(m, p.Title), Short: dash(m, shorten(p.Title, 56)), Job: dash(m, p.Job), Revision: dash(m, p.Revision),
		Designer: dash(m, p.Designer), Checker: dash(m, p.Checker), Date: dash(m, p.Date),
		PlainTitle: pdfText(p.Title), PlainDesigner: pdfText(p.Designer), PlainChecker: pdfText(p.Checker)}
}

// toolName is the program's name as the result gives it, "colsheet" when it gives none.
func toolName(r *design.Result) string {
	if r.ToolName == "" {
		return "colsheet"
	}
	return r.ToolName
}

// program is the program's name and version, as the sheets show it.
func program(r *design.Result) string { return strings.TrimSpace(toolName(r) + " " + r.ToolVersion) }

func basis(m markup, r *design.Result) basisView {
	in := input(r)
	b := basisView{Standard: m.text(code.Standard), Annex: dash(m, in.Code.Annex),
		Input: dash(m, in.File), SHA: dash(m, in.SHA256)}
	b.Tool = m.text(program(r))
	for _, o := range in.Code.Overrides() {
		b.Overrides = append(b.Overrides, overrideView{Name: m.text(o.Name), Symbol: m.sym(o.Symbol),
			Value: m.num(fmtNum(o.Value)), Default: m.num(fmtNum(o.Default)), Clause: m.text(o.Clause), What: m.rich(o.What)})
	}
	if c := in.Materials.Concrete.Class; c != "" {
		b.Choices = append(b.Choices, kv{m.text("Concrete"), m.text(c)})
	}
	for _, me := range r.Methods {
		b.Choices = append(b.Choices, kv{m.text(me.Topic), m.text(me.Choice + " (" + me.Clause + ")")})
	}
	return b
}

func status(s string) (string, bool) {
	if s == design.StatusPass {
		return "PASS", false
	}
	return "FAIL", true
}

func texts(m markup, ss []string) []string {
	var out []string
	for _, s := range ss {
		out = append(out, m.rich(s))
	}
	return out
}

func subject(d design.Design) string {
	return "Column " + d.Column + ", lift " + d.Storey
}

// shorten cuts s to at most n characters, ending it with "…" when cut.
func shorten(s string, n int) string {
	r := []rune(strings.TrimSpace(oneLine(s)))
	if len(r) <= n {
		return string(r)
	}
	return strings.TrimSpace(string(r[:n-1])) + "…"
}

// upperFirst capitalises the first letter of s.
func upperFirst(s string) string {
	for i, r := range s {
		return string(unicode.ToUpper(r)) + s[i+len(string(r)):]
	}
	return s
}

func barsText(d design.Design) string {
	s := fmt.Sprintf("%d Ø%s", d.Bars.Count, fmtNum(d.Bars.Dia).plain())
	return s
}

func linksText(d design.Design) string {
	return fmt.Sprintf("Ø%s @ %s", fmtNum(d.Links.Dia).plain(), fmtNum(d.Links.Spacing).plain())
}

// index builds the view of the index sheet, with the steps of the project basis; link gives
// the target of a design's sheet.
func index(m markup, r *design.Result, link func(name string) string, b *book, p place) sheetView {
	in := input(r)
	total := len(r.Designs) + 1
	v := sheetView{Sec1: "section*", Sec2: "subsection*", Project: project(m, in), Number: 1, Total: total, Sheet: m.text(fmt.Sprintf("sheet 1 of %d", total)),
		SheetNo: m.text(fmt.Sprintf("1 of %d", total)),
		Subject: m.text("Index of calculation sheets"), Cautions: texts(m, Cautions), Basis: basis(m, r),
		PlainSubject: "Index of calculation sheets", PlainTool: pdfText(program(r))}
	nm := names(r)
	groupOf := groupNames(r)
	for i, d := range r.Designs {
		v.Schedule = append(v.Schedule, scheduleRow(d, groupOf[i], m.text))
	}
	for _, z := range r.Sizes {
		row := sizeRow{Column: m.text(z.Column), Given: m.text(fmtNum(z.Given.B).plain() + " × " + fmtNum(z.Given.H).plain()),
			Found: m.text("none of the sizes passes"), Steel: m.text("–"), Utilization: m.text("–")}
		if z.Found {
			row.Found = m.text(fmtNum(z.Size.B).plain() + " × " + fmtNum(z.Size.H).plain())
			row.Steel = m.text(fmtNum(z.AsProv).plain() + " mm² (" + fmtNum(100*z.Rho).plain() + " %)")
			row.Utilization = m.num(fmtNum(z.Utilization))
		}
		v.Sizes = append(v.Sizes, row)
	}
	for i, d := range r.Designs {
		st, failed := status(d.Status)
		v.Designs = append(v.Designs, designRow{
			Sheet: fmt.Sprint(i + 2), Link: link(nm[i]), Column: m.text(d.Column), Storey: m.text(d.Storey),
			Section: m.text(fmt.Sprintf("%s × %s", fmtNum(d.B).plain(), fmtNum(d.H).plain())),
			NEd:     m.num(fmtNum(d.NEd / 1e3)), MEdY: m.num(fmtNum(d.Y.MEd / 1e6)), MEdZ: m.num(fmtNum(d.Z.MEd / 1e6)),
			Bars: m.text(barsText(d)), Links: m.text(linksText(d)),
			Utilization: m.num(fmtNum(d.Utilization)), Status: st, Failed: failed})
	}
	v.BasisSteps = basisGroups(m, b, p)
	v.ScheduleLast = true
	n := r.Failed()
	v.AnyFail = n > 0
	switch {
	case len(r.Designs) == 0:
		v.Failures = m.text("The input holds no designs.")
	case n == 0:
		v.Failures = m.text(fmt.Sprintf("All %d designs pass.", len(r.Designs)))
	default:
		v.Failures = m.text(fmt.Sprintf("%d of %d designs FAIL.", n, len(r.Designs)))
	}
	return v
}

// sheet builds the view of the sheet of design i, its step links laid out for p.
func sheet(m markup, b *book, i int, p place) sheetView {
	r := b.r
	in := input(r)
	d := r.Designs[i]
	total := len(r.Designs) + 1
	st, failed := status(d.Status)
	v := sheetView{Sec1: "section*", Sec2: "subsection*", Project: project(m, in), Number: i + 2, Total: total,
		Sheet:   m.text(fmt.Sprintf("sheet %d of %d", i+2, total)),
		SheetNo: m.text(fmt.Sprintf("%d of %d", i+2, total)),
		Subject: m.text(subject(d)), Cautions: texts(m, Cautions), Basis: basis(m, r),
		PlainSubject: pdfText(subject(d)), PlainTool: pdfText(program(r)),
		Status: st, Failed: failed, Reasons: texts(m, d.Reasons), DesignCautions: texts(m, d.Cautions),
		Utilization: m.num(fmtNum(d.Utilization)), Governing: dash(m, d.Governing)}
	given := "chosen by the design"
	if d.Bars.Given {
		given = "given in the input"
	}
	v.Summary = []kv{
		{m.text("Section b × h"), m.qty(d.B, "mm") + " × " + m.qty(d.H, "mm")},
		{m.text("Nominal cover to links"), m.qty(d.Cover, "mm")},
		{m.rich("Concrete f_ck"), m.qty(d.Fck, "MPa")},
		{m.rich("Reinforcement f_yk"), m.qty(d.Fyk, "MPa")},
		{m.rich("Design axial force N_Ed"), m.qty(d.NEd, "N")},
		{m.rich("Axial resistance N_Rd,max"), m.qty(d.NRdMax, "N")},
		{m.text("Longitudinal bars"), m.text(barsText(d) + ", " + given)},
		{m.rich("A_s,prov"), m.qty(d.AsProv, "mm2")},
		{m.rich("A_s,req"), m.qty(d.AsReq, "mm2")},
		{m.rich("A_s,min / A_s,max"), m.qty(d.AsMin, "mm2") + " / " + m.qty(d.AsMax, "mm2")},
		{m.text("Links"), m.text("Ø"+fmtNum(d.Links.Dia).plain()+" mm at ") + m.qty(d.Links.Spacing, "mm") +
			m.text(", ") + m.qty(d.Links.SpacingReduced, "mm") + m.text(" in the zones of 9.5.3(4)")},
	}
	if d.Biaxial.Checked {
		v.Summary = append(v.Summary, kv{m.text("Biaxial bending (5.39)"),
			m.text("checked, a = ") + m.num(fmtNum(d.Biaxial.A)) + m.text(", ratio ") + m.num(fmtNum(d.Biaxial.Ratio))})
	} else {
		v.Summary = append(v.Summary, kv{m.text("Biaxial bending (5.39)"), m.text("not required by (5.38a/b)")})
	}
	yes := func(b bool) string {
		if b {
			return m.text("yes")
		}
		return m.text("no")
	}
	ax := func(label string, f func(a design.Axis) string) axisRow {
		return axisRow{m.rich(label), f(d.Y), f(d.Z)}
	}
	v.Axes = []axisRow{
		ax("Effective length l_0", func(a design.Axis) string { return m.qty(a.L0, "mm") }),
		ax("Slenderness λ", func(a design.Axis) string { return m.num(fmtNum(a.Lambda)) }),
		ax("Limit λ_lim", func(a design.Axis) string { return m.num(fmtNum(a.LambdaLim)) }),
		ax("Slender", func(a design.Axis) string { return yes(a.Slender) }),
		ax("End moment M_01", func(a design.Axis) string { return m.qty(a.M01, "Nmm") }),
		ax("End moment M_02", func(a design.Axis) string { return m.qty(a.M02, "Nmm") }),
		ax("Imperfection e_i", func(a design.Axis) string { return m.qty(a.Ei, "mm") }),
		ax("First order M_0Ed", func(a design.Axis) string { return m.qty(a.M0Ed, "Nmm") }),
		ax("Second order M_2", func(a design.Axis) string { return m.qty(a.M2, "Nmm") }),
		ax("Creep ratio φ_ef", func(a design.Axis) string { return m.num(fmtNum(a.PhiEf)) }),
		ax("Design moment M_Ed", func(a design.Axis) string { return m.qty(a.MEd, "Nmm") }),
		ax("Resistance M_Rd", func(a design.Axis) string { return m.qty(a.MRd, "Nmm") }),
	}
	for _, g := range diagrams(d) {
		v.Diagrams = append(v.Diagrams, figureView{Body: m.picture(g), Caption: m.text(g.Caption())})
	}
	v.Brief = !p.opt.full()
	v.Groups, v.Margin = groups(m, b, i, p)
	return v
}

// book holds what every sheet of a result needs to link its steps: the sheets' names, each
// design's trace with full step IDs, and where each step ID is.
type book struct {
	r      *design.Result
	names  []string       // sheet base names, one per design
	traces [][]trace.Step // each design's trace, IDs from the root
	at     map[string]where
}

// where is a step's design and its number on that design's sheet; design is basisDesign for
// a step of the project basis, numbered in the basis.
type where struct{ design, number int }

// basisDesign marks a step of the project basis in a where.
const basisDesign = -1

// stepAt returns the step (its own ID) at w.
func (b *book) stepAt(w where) trace.Step {
	if w.design == basisDesign {
		return b.r.Basis[w.number-1]
	}
	return b.r.Designs[w.design].Steps[w.number-1]
}

func newBook(r *design.Result) *book {
	b := &book{r: r, names: names(r), traces: make([][]trace.Step, len(r.Designs)), at: map[string]where{}}
	for k, s := range r.Basis {
		b.at[s.ID] = where{basisDesign, k + 1}
	}
	for i, d := range r.Designs {
		b.traces[i] = d.Trace()
		for k, s := range b.traces[i] {
			if _, ok := b.at[s.ID]; !ok {
				b.at[s.ID] = where{i, k + 1}
			}
		}
	}
	return b
}

// place says how one rendering links steps on other sheets and which steps it prints.
type place struct {
	onePage bool                     // every design in one document: anchors link directly
	file    func(name string) string // the file of another design's sheet; nil when files are not linked
	opt     Options                  // brief or full
	fold    bool                     // full detail with the sub-steps folded (HTML)
	// printed reports whether the rendering prints the step of the given full ID (s is the
	// step with its own ID); nil: as the detail says.
	printed func(id string, s trace.Step) bool
}

// shows reports whether the rendering prints step s (its own ID) whose full ID is id; the
// steps of the project basis are printed once, in the index sheet and the calc document.
func (p place) shows(id string, s trace.Step) bool {
	if strings.HasPrefix(id, design.BasisPrefix) {
		return true
	}
	if p.printed != nil {
		return p.printed(id, s)
	}
	return p.opt.full() || briefStep(s)
}

// target returns the link to step id (at w) from the sheet of design from, or "" for none.
func (b *book) target(p place, from int, w where, id string) string {
	a := "#" + anchorName("s-", id)
	switch {
	case p.onePage || w.design == from:
		return a
	case p.file != nil && w.design == basisDesign:
		return p.file("index") + a // the index sheet holds the project basis
	case p.file != nil:
		return p.file(b.names[w.design]) + a
	}
	return ""
}

// groups gathers the steps of design i under their Step.Group, groups in order of first
// appearance; each step keeps its number in the trace.
func groups(m markup, b *book, i int, p place) ([]groupView, []stepView) {
	steps := b.traces[i]
	own := b.r.Designs[i].Steps
	var out []groupView
	var margin []stepView
	at := map[string]int{}
	var sub []bool // per group: whether its last step is a folded sub-step
	for k, s := range steps {
		shown := p.shows(s.ID, own[k])
		if !shown && !p.fold {
			continue
		}
		g := s.Group
		if strings.TrimSpace(g) == "" {
			g = "Further steps"
		}
		n, ok := at[g]
		if !ok {
			n = len(out)
			at[g] = n
			out = append(out, groupView{Title: m.rich(g)})
			sub = append(sub, false)
		}
		v := step(m, s, k+1, b, i, p)
		if wideMargin(s) && !p.opt.full() {
			margin = append(margin, v)
			continue
		}
		folded := p.fold && !briefStep(own[k])
		steps := out[n].Steps
		switch {
		case folded && !sub[n]:
			v.FoldOpen = true
		case !folded && sub[n]:
			steps[len(steps)-1].FoldClose = true
		}
		sub[n] = folded
		out[n].Steps = append(steps, v)
	}
	for n := range out {
		if sub[n] {
			out[n].Steps[len(out[n].Steps)-1].FoldClose = true
		}
		// The count of each folded run, for its summary line.
		open := -1
		for k := range out[n].Steps {
			st := &out[n].Steps[k]
			if st.FoldOpen {
				open = k
			}
			if st.FoldClose && open >= 0 {
				out[n].Steps[open].FoldCount = k - open + 1
				open = -1
			}
		}
	}
	// A group whose steps all went to the table of wide margins is not printed.
	kept := out[:0]
	for _, g := range out {
		if len(g.Steps) > 0 {
			kept = append(kept, g)
		}
	}
	return kept, margin
}

// marginRatio is the utilisation up to which a brief sheet lists a passing check in the table
// of checks with a wide margin instead of in its group.
const marginRatio = 0.5

// wideMargin reports whether s is a check that holds with a wide margin.
func wideMargin(s trace.Step) bool {
	return s.Kind == trace.KindCheck && s.Verdict == trace.Pass && len(s.Args) > 0 && s.Value <= marginRatio
}

func step(m markup, s trace.Step, n int, b *book, from int, p place) stepView {
	clause := s.Clause
	if !p.opt.full() {
		clause = shortClause(clause)
	}
	v := stepView{Number: n, Anchor: m.anchor(anchorName("s-", s.ID)), ID: m.text(s.ID), Title: m.rich(upperFirst(s.Title)), Clause: dash(m, clause),
		Kind: m.text(string(s.Kind)), Type: string(s.Kind), Notes: texts(m, s.Notes), Cautions: texts(m, s.Cautions)}
	symbol := s.Symbol
	if s.Kind == trace.KindCheck && symbol == "" {
		symbol = "η"
	}
	sh := showStep(s)
	v.Result = m.formula(sh.Result)
	if v.Changed = p.opt.changed(s.ID, s.Value); v.Changed {
		v.Result = m.changed(v.Result)
		if v.Value != "" {
			v.Value = m.changed(v.Value)
		}
	}
	if len(sh.Result) > 0 && (s.Show == nil || s.Show.Result == "" || sh.Values == nil) {
		// A result in words ("yes") already ends the substituted values ("… → yes").
		v.Value = m.formula(sh.Result[len(sh.Result)-1:])
	}
	expr := func(e string, values bool) string {
		ps, err := layout(e, s.Args, values)
		if err != nil {
			if values {
				return ""
			}
			return m.text(e)
		}
		return m.formula(ps)
	}
	switch {
	case sh.Text != "" && symbol != "":
		v.Formula = m.formula([]piece{{kind: pSym, text: symbol}, {kind: pOp, text: "="}, {kind: pText, text: sh.Text}})
	case sh.Text != "":
		v.Formula = m.text(sh.Text)
	case sh.Formula != nil:
		v.Formula = m.formula(sh.Formula)
		if sh.Values != nil {
			v.Values = m.formula(sh.Values)
		}
	}
	switch s.Kind {
	case trace.KindTable:
		v.Row = m.rich(s.Row)
		if strings.TrimSpace(s.Row) == "" {
			v.Row = "—"
		}
	case trace.KindSolve:
		v.Method = m.rich(s.Method)
		if strings.TrimSpace(s.Method) == "" {
			v.Method = "—"
		}
		if s.Verify != "" {
			v.Verify = expr(s.Verify, false)
		}
		v.Residual = m.num(fmtNum(s.Residual))
	case trace.KindCheck:
		v.Relation = m.rich(s.Relation)
		v.Verdict, v.Failed = "PASS", false
		if s.Verdict != trace.Pass {
			v.Verdict, v.Failed = "FAIL", true
		}
	}
	// The steps whose results this one uses: those on this sheet by number, then those on
	// other sheets by column, lift and number; each linked where the format can.
	var here, there []where
	seen := map[where]bool{}
	ids := map[where]string{}
	for _, a := range s.Args {
		w, ok := b.at[a.From]
		if a.From == "" || !ok || seen[w] || w.design == from && w.number == n {
			continue
		}
		// A step the rendering does not print is not linked (its value stands in the formula).
		if !p.shows(a.From, b.stepAt(w)) && !p.fold {
			continue
		}
		seen[w], ids[w] = true, a.From
		if w.design == from {
			here = append(here, w)
		} else {
			there = append(there, w)
		}
	}
	sort.Slice(here, func(x, y int) bool { return here[x].number < here[y].number })
	sort.Slice(there, func(x, y int) bool {
		if there[x].design != there[y].design {
			return there[x].design < there[y].design
		}
		return there[x].number < there[y].number
	})
	var uses []string
	prefix := ""
	if from == basisDesign {
		prefix = "B."
	}
	for _, w := range here {
		uses = append(uses, m.link(m.text(prefix+fmt.Sprint(w.number)), b.target(p, from, w, ids[w])))
	}
	if len(here) == 1 {
		v.Uses = "step " + uses[0]
	} else if len(here) > 1 {
		v.Uses = "steps " + strings.Join(uses, ", ")
	}
	for _, w := range there {
		var label string
		if w.design == basisDesign {
			label = m.text("basis B." + fmt.Sprint(w.number))
		} else {
			d := b.r.Designs[w.design]
			label = m.text(d.Column + "/" + d.Storey + " step " + fmt.Sprint(w.number))
		}
		if v.Uses != "" {
			v.Uses += ", "
		}
		v.Uses += m.link(label, b.target(p, from, w, ids[w]))
	}
	return v
}

// ---- templates ----

func parse(delims [2]string, files ...string) (*template.Template, error) {
	t := template.New(files[0]).Delims(delims[0], delims[1]).Option("missingkey=error")
	for _, f := range files {
		b, err := fs.ReadFile(templates.FS, f)
		if err != nil {
			return nil, err
		}
		if _, err := t.New(f).Parse(string(b)); err != nil {
			return nil, err
		}
	}
	return t, nil
}

func execute(t *template.Template, name string, v any) ([]byte, error) {
	var b bytes.Buffer
	if err := t.ExecuteTemplate(&b, name, v); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// render runs the index and sheet templates over r for markup m; link gives the target of a
// design's sheet from the index, p how steps link across sheets.
func render(m markup, r *design.Result, delims [2]string, common, indexT, sheetT, ext string, link func(string) string, p place) ([]Sheet, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	t, err := parse(delims, common, indexT, sheetT)
	if err != nil {
		return nil, err
	}
	bk := newBook(r)
	b, err := execute(t, indexT, index(m, r, link, bk, p))
	if err != nil {
		return nil, err
	}
	out := []Sheet{{Name: "index" + ext, Data: b}}
	for i, name := range bk.names {
		b, err := execute(t, sheetT, sheet(m, bk, i, p))
		if err != nil {
			return nil, err
		}
		out = append(out, Sheet{Name: name + ext, Data: b})
	}
	return out, nil
}

// Markdown returns the calc sheets in CommonMark with GFM tables: index.md first, then one sheet per design.
func Markdown(r *design.Result, o Options) ([]Sheet, error) {
	md := func(name string) string { return name + ".md" }
	return markdown(r, md, place{file: md, opt: o})
}

func markdown(r *design.Result, link func(string) string, p place) ([]Sheet, error) {
	return render(md{}, r, [2]string{"{{", "}}"}, "md/common.md.tmpl", "md/index.md.tmpl", "md/sheet.md.tmpl", ".md", link, p)
}

// LaTeX returns the calc sheets as standalone pdflatex documents: index.tex first, then one per design.
func LaTeX(r *design.Result, o Options) ([]Sheet, error) {
	return render(tex{}, r, templates.TeXDelims, "tex/common.tex.tmpl", "tex/index.tex.tmpl", "tex/sheet.tex.tmpl", ".tex",
		func(name string) string { return name + ".pdf" }, place{opt: o})
}

// basisGroups lays out the steps of the project basis, numbered B.1, B.2, … under their groups.
func basisGroups(m markup, b *book, p place) []groupView {
	p.opt.Detail = Brief // one line a step, clauses without the edition of EN 1992-1-1
	var out []groupView
	at := map[string]int{}
	for k, s := range b.r.Basis {
		g := s.Group
		if strings.TrimSpace(g) == "" {
			g = "Project basis"
		}
		n, ok := at[g]
		if !ok {
			n = len(out)
			at[g] = n
			out = append(out, groupView{Title: m.rich(g)})
		}
		v := step(m, s, k+1, b, basisDesign, p)
		v.Prefix = "B."
		out[n].Steps = append(out[n].Steps, v)
	}
	return out
}
