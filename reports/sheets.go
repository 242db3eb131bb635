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

// ---- the document tree: views whose leaves are inline runs, printed per format ----

type projectView struct {
	Title, Job, Revision, Designer, Checker, Date inline
	Short                                         inline // the title cut to fit a running head
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
	Name, Symbol, Value, Default, Clause, What inline
}

type basisView struct {
	Standard, Annex inline
	Overrides       []overrideView
	Choices         []kv   // method choices
	Input, SHA      inline // input file and its hash
	Tool            inline // tool name and version
}

type kv struct{ Label, Value inline }

type axisRow struct{ Label, Y, Z inline }

type stepView struct {
	Prefix   string // "B." for a step of the project basis
	Number   int
	Anchor   inline // the link target of the step
	ID       inline
	Title    inline
	Clause   inline
	Kind     inline // the kind, for display
	Type     string // the kind as recorded: input, formula, table, solve or check
	Formula  inline // the expression in symbols, with the result symbol: "f_cd = α_cc · f_ck / γ_c"
	Values   inline // the expression with the values: "1 · 32 MPa / 1.5"
	Result   inline // "f_cd = 21.33 MPa"
	Value    inline // the result without its symbol: "21.33 MPa"
	Row      inline
	Method   inline
	Verify   inline // verification expression in symbols
	Residual inline
	Relation inline
	Verdict  string // PASS or FAIL for a check step
	Failed   bool
	Uses     inline // the steps whose results this step uses, linked: "steps 3, 5" or "B2/L2 step 57"
	Notes    []inline
	Cautions []inline
	Changed  bool // the value differs from the previous revision's (or the step is new)
	// Folding of the sub-steps in full detail (printed as such in HTML): the first step of a
	// folded run opens it (FoldOpen, with the run's length in FoldCount), the last closes it.
	FoldOpen, FoldClose bool
	FoldCount           int
}

// figureView is one drawn diagram with its caption.
type figureView struct{ Body, Caption inline }

type groupView struct {
	Title inline
	Steps []stepView
}

// sizeRow is one line of the section-size finder's table.
type sizeRow struct {
	Column, Given, Found, Steel, Utilization inline
}

type designRow struct {
	Sheet       string // "2"
	Link        target // the design's sheet
	Column      inline
	Storey      inline
	Section     inline
	NEd         inline // kN
	MEdY, MEdZ  inline // kNm
	Bars        inline
	Links       inline
	Utilization inline
	Status      string // PASS or FAIL
	Failed      bool
}

type sheetView struct {
	H       string // Markdown: extra '#' that push the design's headings one level down in the calc document
	Sec1    string // LaTeX: the sectioning command of the design's parts ("section*", or "subsection*" in the calc document)
	Sec2    string // LaTeX: the sectioning command one level below
	Anchor  inline // link target of the design's section (calc document only)
	Project projectView
	Sheet   inline // "sheet 3 of 12"
	SheetNo inline // "3 of 12"
	Number  int
	Total   int
	Subject inline // "column K1, lift L1"
	// The subject and the program for the PDF's metadata: plain ASCII, no markup.
	PlainSubject, PlainTool string
	Cautions                []inline
	Basis                   basisView

	// design sheets only
	Status         string // PASS or FAIL
	Failed         bool
	Reasons        []inline
	DesignCautions []inline
	Utilization    inline
	Governing      inline
	Summary        []kv
	Axes           []axisRow
	Cases          *tableView   // the load cases of the lift, one row each, where it has several
	Sketch         []figureView // the section sketch of the cage (none where the design holds no bars)
	Diagrams       []figureView // interaction diagrams, when the result holds their data
	Round          bool         // a circular section: one N–M diagram, in the direction of least resistance
	Groups         []groupView
	Brief          bool        // the steps one line each (the chain); else every step in full
	BasisSteps     []groupView // index and calc document: the steps of the project basis
	ScheduleLast   bool        // LaTeX: the schedule ends the document (its last page is labelled there)
	Margin         []stepView  // brief: the checks that hold with a wide margin, listed in one table

	// index only
	Designs  []designRow
	Sizes    []sizeRow  // the section-size finder, when asked for
	Schedule [][]inline // the column schedule, one row per design: the cage as built
	Marks    [][]inline // the schedule's bar marks, one row per mark of each design
	Totals   [][]inline // the quantity take-off: steel per column, per level and for the building
	Failures inline     // sentence on the count of failing designs
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

func dash(s string) inline {
	if strings.TrimSpace(s) == "" {
		return txt("—")
	}
	return txt(s)
}

func project(in *model.Input) projectView {
	p := in.Project
	return projectView{Title: dash(p.Title), Short: dash(shorten(p.Title, 56)), Job: dash(p.Job), Revision: dash(p.Revision),
		Designer: dash(p.Designer), Checker: dash(p.Checker), Date: dash(p.Date),
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

func basis(r *design.Result) basisView {
	in := input(r)
	b := basisView{Standard: txt(code.Standard), Annex: dash(in.Code.Annex),
		Input: dash(in.File), SHA: dash(in.SHA256)}
	b.Tool = txt(program(r))
	for _, o := range in.Code.Overrides() {
		b.Overrides = append(b.Overrides, overrideView{Name: txt(o.Name), Symbol: sym(o.Symbol),
			Value: numv(fmtNum(o.Value)), Default: numv(fmtNum(o.Default)), Clause: txt(o.Clause), What: rich(o.What)})
	}
	if c := in.Materials.Concrete.Class; c != "" {
		if in.Building != nil && len(in.Building.Concrete) > 0 {
			c += " (the default; building.concrete gives other classes by level and column, each sheet names its lift's)"
		}
		b.Choices = append(b.Choices, kv{txt("Concrete"), txt(c)})
	}
	for _, me := range r.Methods {
		b.Choices = append(b.Choices, kv{txt(me.Topic), txt(me.Choice + " (" + me.Clause + ")")})
	}
	return b
}

func status(s string) (string, bool) {
	if s == design.StatusPass {
		return "PASS", false
	}
	return "FAIL", true
}

func texts(ss []string) []inline {
	var out []inline
	for _, s := range ss {
		out = append(out, rich(s))
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
	return linkKind(d, "circular ", "helix ") + fmt.Sprintf("Ø%s @ %s", fmtNum(d.Links.Dia).plain(), fmtNum(d.Links.Spacing).plain())
}

// sectionRow is the summary row of the section: b × h, or the diameter of a circle.
func sectionRow(d design.Design) kv {
	if circular(d) {
		return kv{txt("Section: circular, diameter D"), qty(d.B, "mm")}
	}
	return kv{txt("Section b × h"), times(qty(d.B, "mm"), qty(d.H, "mm"))}
}

// linksRow is the summary row of the links: their kind, diameter and spacings (a helix's pitch).
func linksRow(d design.Design) kv {
	what, at := linkKind(d, "circular links ", "helix "), pitch(d, " mm at ", " mm, pitch ")
	return kv{txt("Links"), cat(txt(what+"Ø"+fmtNum(d.Links.Dia).plain()+at), qty(d.Links.Spacing, "mm"),
		txt(", "), qty(d.Links.SpacingReduced, "mm"), txt(" in the zones of 9.5.3(4)"))}
}

// sizeInline is a section's size as a quantity: b × h, or a circle's diameter "Ø 450 mm" (with
// ", helix" where its links are a helix).
func sizeInline(s model.Size) inline {
	if s.Shape != model.ShapeCircle {
		return times(qty(s.B, "mm"), qty(s.H, "mm"))
	}
	if s.Helix {
		return cat(txt("Ø "), qty(s.B, "mm"), txt(", helix"))
	}
	return cat(txt("Ø "), qty(s.B, "mm"))
}

// sizeText names a section in mm: "450 × 600", or "Ø450" for a circle.
func sizeText(b, h float64, shape string) string {
	if shape == model.ShapeCircle {
		return "Ø" + fmtNum(b).plain()
	}
	return fmtNum(b).plain() + " × " + fmtNum(h).plain()
}

// index builds the view of the index sheet, with the steps of the project basis; link gives
// the target of a design's sheet.
func index(r *design.Result, link func(name string) target, b *book, p place) sheetView {
	in := input(r)
	total := len(r.Designs) + 1
	v := sheetView{Sec1: "section*", Sec2: "subsection*", Project: project(in), Number: 1, Total: total, Sheet: txt(fmt.Sprintf("sheet 1 of %d", total)),
		SheetNo: txt(fmt.Sprintf("1 of %d", total)),
		Subject: txt("Index of calculation sheets"), Cautions: texts(Cautions), Basis: basis(r),
		PlainSubject: "Index of calculation sheets", PlainTool: pdfText(program(r))}
	nm := names(r)
	groupOf := groupNames(r)
	lv := r.Levels()
	for i, d := range r.Designs {
		v.Schedule = append(v.Schedule, scheduleCells(d, groupOf[i], lv[i]))
		v.Marks = append(v.Marks, markCells(d)...)
	}
	v.Totals = totalCells(r.Quantities())
	for _, z := range r.Sizes {
		row := sizeRow{Column: txt(z.Column), Given: txt(sizeText(z.Given.B, z.Given.H, z.Given.Shape)),
			Found: txt("none of the sizes passes"), Steel: txt("–"), Utilization: txt("–")}
		if z.Found {
			row.Found = txt(sizeText(z.Size.B, z.Size.H, z.Size.Shape))
			row.Steel = txt(fmtNum(z.AsProv).plain() + " mm² (" + fmtNum(100*z.Rho).plain() + " %)")
			row.Utilization = numv(fmtNum(z.Utilization))
		}
		v.Sizes = append(v.Sizes, row)
	}
	for i, d := range r.Designs {
		st, failed := status(d.Status)
		v.Designs = append(v.Designs, designRow{
			Sheet: fmt.Sprint(i + 2), Link: link(nm[i]), Column: txt(d.Column), Storey: txt(d.Storey),
			Section: txt(sizeText(d.B, d.H, d.Shape)),
			NEd:     numv(fmtNum(d.NEd / 1e3)), MEdY: numv(fmtNum(d.Y.MEd / 1e6)), MEdZ: numv(fmtNum(d.Z.MEd / 1e6)),
			Bars: txt(barsText(d)), Links: txt(linksText(d)),
			Utilization: numv(fmtNum(d.Utilization)), Status: st, Failed: failed})
	}
	v.BasisSteps = basisGroups(b, p)
	v.ScheduleLast = true
	n := r.Failed()
	v.AnyFail = n > 0
	switch {
	case len(r.Designs) == 0:
		v.Failures = txt("The input holds no designs.")
	case n == 0:
		v.Failures = txt(fmt.Sprintf("All %d designs pass.", len(r.Designs)))
	default:
		v.Failures = txt(fmt.Sprintf("%d of %d designs FAIL.", n, len(r.Designs)))
	}
	return v
}

// sheet builds the view of the sheet of design i, its step links laid out for p.
func sheet(b *book, i int, p place) sheetView {
	r := b.r
	in := input(r)
	d := *b.design(i)
	total := len(r.Designs) + 1
	st, failed := status(d.Status)
	v := sheetView{Sec1: "section*", Sec2: "subsection*", Project: project(in), Number: i + 2, Total: total,
		Sheet:   txt(fmt.Sprintf("sheet %d of %d", i+2, total)),
		SheetNo: txt(fmt.Sprintf("%d of %d", i+2, total)),
		Subject: txt(subject(d)), Cautions: texts(Cautions), Basis: basis(r),
		PlainSubject: pdfText(subject(d)), PlainTool: pdfText(program(r)),
		Status: st, Failed: failed, Reasons: texts(d.Reasons), DesignCautions: texts(d.Cautions),
		Utilization: numv(fmtNum(d.Utilization)), Governing: dash(d.Governing)}
	given := "chosen by the design"
	if d.Bars.Given {
		given = "given in the input"
	}
	v.Summary = []kv{
		sectionRow(d),
		{txt("Nominal cover to links"), qty(d.Cover, "mm")},
		{rich("Concrete f_ck"), cat(qty(d.Fck, "MPa"), txt(classNote(d.Class)))},
		{rich("Reinforcement f_yk"), qty(d.Fyk, "MPa")},
		{rich("Design axial force N_Ed"), qty(d.NEd, "N")},
		{rich("Axial resistance N_Rd,max"), qty(d.NRdMax, "N")},
		{txt("Longitudinal bars"), txt(barsText(d) + onCircle(d) + ", " + given)},
		{rich("A_s,prov"), qty(d.AsProv, "mm2")},
		{rich("A_s,req"), qty(d.AsReq, "mm2")},
		{rich("A_s,min / A_s,max"), cat(qty(d.AsMin, "mm2"), txt(" / "), qty(d.AsMax, "mm2"))},
		linksRow(d),
	}
	if in.MomentSigns == model.SignsMemberEnds {
		v.Summary = append(v.Summary, kv{txt("End moments as given"), txt("member ends, clockwise positive at both ends (moment_signs: member-ends); shown here with the sign changed at the bottom, so that equal signs mean tension on the same face")})
	}
	if len(d.Cases) > 1 {
		v.Summary = append(v.Summary, kv{txt("Load cases"), txt(fmt.Sprintf("%d; governing: %s (the values of this sheet)", len(d.Cases), d.GoverningCase))})
	}
	if circular(d) {
		v.Summary = append(v.Summary, kv{txt("Biaxial bending (5.8.9(4), a = 2)"),
			cat(txt("resultant, ratio "), numv(fmtNum(d.Biaxial.Ratio)))})
	} else if d.Biaxial.Checked {
		v.Summary = append(v.Summary, kv{txt("Biaxial bending (5.39)"),
			cat(txt("checked, a = "), numv(fmtNum(d.Biaxial.A)), txt(", ratio "), numv(fmtNum(d.Biaxial.Ratio)))})
	} else {
		v.Summary = append(v.Summary, kv{txt("Biaxial bending (5.39)"), txt("not required by (5.38a/b)")})
	}
	yes := func(b bool) inline {
		if b {
			return txt("yes")
		}
		return txt("no")
	}
	ax := func(label string, f func(a design.Axis) inline) axisRow {
		return axisRow{rich(label), f(d.Y), f(d.Z)}
	}
	v.Axes = []axisRow{
		ax("Effective length l_0", func(a design.Axis) inline { return qty(a.L0, "mm") }),
		ax("Slenderness λ", func(a design.Axis) inline { return numv(fmtNum(a.Lambda)) }),
		ax("Limit λ_lim", func(a design.Axis) inline { return numv(fmtNum(a.LambdaLim)) }),
		ax("Slender", func(a design.Axis) inline { return yes(a.Slender) }),
		ax("End moment M_01", func(a design.Axis) inline { return qty(a.M01, "Nmm") }),
		ax("End moment M_02", func(a design.Axis) inline { return qty(a.M02, "Nmm") }),
		ax("Imperfection e_i", func(a design.Axis) inline { return qty(a.Ei, "mm") }),
		ax("First order M_0Ed", func(a design.Axis) inline { return qty(a.M0Ed, "Nmm") }),
		ax("Second order M_2", func(a design.Axis) inline { return qty(a.M2, "Nmm") }),
		ax("Creep ratio φ_ef", func(a design.Axis) inline { return numv(fmtNum(a.PhiEf)) }),
		ax("Design moment M_Ed", func(a design.Axis) inline { return qty(a.MEd, "Nmm") }),
		ax("Resistance M_Rd", func(a design.Axis) inline { return qty(a.MRd, "Nmm") }),
	}
	v.Cases = casesTable(d, p.opt)
	if sk, ok := cageSketch(d); ok {
		v.Sketch = []figureView{{Body: picture(sk), Caption: txt(sk.Caption())}}
	}
	for _, g := range diagrams(d) {
		v.Diagrams = append(v.Diagrams, figureView{Body: picture(g), Caption: txt(g.Caption())})
		v.Round = circular(d)
	}
	v.Brief = !p.opt.full()
	v.Groups, v.Margin = groups(b, i, p)
	return v
}

// place says how one rendering links steps on other sheets and which steps it prints.
type place struct {
	onePage bool    // every design in one document
	opt     Options // brief or full, revision marks
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

// groups gathers the steps of design i under their Step.Group, groups in order of first
// appearance; each step keeps its number in the trace.
func groups(b *book, i int, p place) ([]groupView, []stepView) {
	own := b.design(i).Steps
	prefix := b.prefix(i)
	f := b.finder(i)
	var out []groupView
	var margin []stepView
	at := map[string]int{}
	var sub []bool // per group: whether its last step is a folded sub-step
	for k := range own {
		if !p.shows(prefix+own[k].ID, own[k]) {
			continue
		}
		s := design.WholeStep(prefix, own[k])
		n, added := groupIn(&out, at, s.Group, "Further steps")
		if added {
			sub = append(sub, false)
		}
		v := step(s, k+1, f, p)
		if wideMargin(s) && !p.opt.full() {
			margin = append(margin, v)
			continue
		}
		folded := p.opt.full() && !briefStep(own[k])
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

// step lays out step s (whole IDs), number n on the sheet that f links from.
func step(s trace.Step, n int, f finder, p place) stepView {
	b, from := f.b, f.from
	clause := s.Clause
	if !p.opt.full() {
		clause = shortClause(clause)
	}
	v := stepView{Number: n, Anchor: anchor(anchorName("s-", s.ID)), ID: txt(s.ID), Title: rich(upperFirst(s.Title)), Clause: dash(clause),
		Kind: txt(string(s.Kind)), Type: string(s.Kind), Notes: texts(s.Notes()), Cautions: texts(s.Cautions())}
	symbol := s.Symbol
	if s.Kind == trace.KindCheck && symbol == "" {
		symbol = "η"
	}
	sh := showStep(s)
	v.Result = formula(sh.Result)
	if len(sh.Result) > 0 && (s.Show == nil || s.Show.Result == "" || sh.Values == nil) {
		// A result in words ("yes") already ends the substituted values ("… → yes").
		v.Value = formula(sh.Result[len(sh.Result)-1:])
	}
	if v.Changed = p.opt.changed(s.ID, s.Value); v.Changed {
		v.Result = changed(v.Result)
		if !v.Value.empty() {
			v.Value = changed(v.Value)
		}
	}
	expr := func(e string, values bool) inline {
		ps, err := layout(e, s.Args, values)
		if err != nil {
			if values {
				return nil
			}
			return txt(e)
		}
		return formula(ps)
	}
	switch {
	case sh.Text != "" && symbol != "":
		v.Formula = formula([]piece{{kind: pSym, text: symbol}, {kind: pOp, text: "="}, {kind: pText, text: sh.Text}})
	case sh.Text != "":
		v.Formula = txt(sh.Text)
	case sh.Formula != nil:
		v.Formula = formula(sh.Formula)
		if sh.Values != nil {
			v.Values = formula(sh.Values)
		}
	}
	switch s.Kind {
	case trace.KindTable:
		v.Row = rich(s.Row())
		if strings.TrimSpace(s.Row()) == "" {
			v.Row = txt("—")
		}
	case trace.KindSolve:
		v.Method = rich(s.Method())
		if strings.TrimSpace(s.Method()) == "" {
			v.Method = txt("—")
		}
		if s.Verify() != "" {
			v.Verify = expr(s.Verify(), false)
		}
		v.Residual = numv(fmtNum(s.Residual()))
	case trace.KindCheck:
		v.Relation = rich(s.Relation)
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
		w, ok := f.at(a.From)
		if a.From == "" || !ok || seen[w] || w.design == from && w.number == n {
			continue
		}
		// A step the rendering does not print is not linked (its value stands in the formula).
		if !p.shows(a.From, b.stepAt(w)) {
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
	var uses []inline
	prefix := ""
	if from == basisDesign {
		prefix = "B."
	}
	for _, w := range here {
		uses = append(uses, link(txt(prefix+fmt.Sprint(w.number)), b.target(from, w, ids[w])))
	}
	var all []inline
	if len(here) == 1 {
		all = append(all, cat(txt("step "), uses[0]))
	} else if len(here) > 1 {
		all = append(all, cat(txt("steps "), join(uses, txt(", "))))
	}
	for _, w := range there {
		var label inline
		if w.design == basisDesign {
			label = txt("basis B." + fmt.Sprint(w.number))
		} else {
			d := b.design(w.design)
			label = txt(d.Column + "/" + d.Storey + " step " + fmt.Sprint(w.number))
		}
		all = append(all, link(label, b.target(from, w, ids[w])))
	}
	v.Uses = join(all, txt(", "))
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

// basisGroups lays out the steps of the project basis, numbered B.1, B.2, … under their groups.
func basisGroups(b *book, p place) []groupView {
	p.opt.Detail = Brief // one line a step, clauses without the edition of EN 1992-1-1
	var out []groupView
	at := map[string]int{}
	f := b.finder(basisDesign)
	for k, s := range b.r.Basis {
		n, _ := groupIn(&out, at, s.Group, "Project basis")
		v := step(s, k+1, f, p)
		v.Prefix = "B."
		out[n].Steps = append(out[n].Steps, v)
	}
	return out
}

// groupIn returns the index in out of the group titled g (fallback when g is blank), appending
// it in order of first appearance; added says whether it was new.
func groupIn(out *[]groupView, at map[string]int, g, fallback string) (n int, added bool) {
	if strings.TrimSpace(g) == "" {
		g = fallback
	}
	if n, ok := at[g]; ok {
		return n, false
	}
	n = len(*out)
	at[g] = n
	*out = append(*out, groupView{Title: rich(g)})
	return n, true
}

// casesTable returns the table of the load cases of design d, where it has several: per case its
// NEd, design moments and resistances about y and z, utilisation and governing check, each
// value marked where its step changed since the previous revision; nil for a lift of one case.
func casesTable(d design.Design, o Options) *tableView {
	if len(d.Cases) < 2 {
		return nil
	}
	prefix := d.Prefix()
	at := make(map[string]int, len(d.Steps)) // the design's steps by their own IDs
	for i := range d.Steps {
		at[d.Steps[i].ID] = i
	}
	cell := func(c design.CaseResult, ids []string, v float64, unit string) inline {
		out := qty(v, unit)
		for _, id := range ids {
			if i, ok := at[c.Prefix+id]; ok {
				// No anchor: the governing case's steps carry theirs below.
				if s := &d.Steps[i]; o.changed(prefix+s.ID, s.Value) {
					out = changed(out)
				}
				break
			}
		}
		return out
	}
	t := &tableView{Title: txt("Load cases"), Align: "llrrrrrrl",
		Head: []inline{txt("Case"), txt(""), rich("N_Ed"), rich("M_Ed,y"), rich("M_Rd,y"), rich("M_Ed,z"), rich("M_Rd,z"), txt("Utilisation"), txt("Governing check")}}
	for _, c := range d.Cases {
		mark := txt("")
		if c.Name == d.GoverningCase && c.Prefix == "" {
			mark = txt("governs")
		}
		status := numv(fmtNum(c.Utilization))
		if c.Status != design.StatusPass {
			status = cat(status, txt(" FAIL"))
		}
		t.Rows = append(t.Rows, []inline{txt(c.Name), mark,
			cell(c, []string{"act/NEd"}, c.NEd, "N"),
			cell(c, []string{"y/MEd", "y/MEd_curv", "y/MEd_stiff"}, c.Y.MEd, "Nmm"),
			cell(c, []string{"y/MRd", "y/sec/M_Rd"}, c.Y.MRd, "Nmm"),
			cell(c, []string{"z/MEd", "z/MEd_curv", "z/MEd_stiff"}, c.Z.MEd, "Nmm"),
			cell(c, []string{"z/MRd", "z/sec/M_Rd"}, c.Z.MRd, "Nmm"),
			status, dash(c.Governing)})
	}
	return t
}

// classNote returns " (C32/40)" for a design's concrete class, or "" where it is not known.
func classNote(class string) string {
	if class == "" {
		return ""
	}
	return " (" + class + ")"
}
