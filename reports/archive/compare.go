package archive

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"colsheet/calc/trace"
	"colsheet/reports"
)

// Side is what Compare reads of one package besides its designs.
type Side struct {
	Tool        Tool
	InputName   string // base name of the input file, empty when the package has no manifest
	InputSHA256 string
}

// Change is one row of the revision table: an input or result of a design that differs.
type Change struct {
	Column, Lift string
	Item         string // Markdown text naming the input or result
	Old, New     string // values in the trade's units; "—" where there is none
}

// Changes is the outcome of Compare: both packages' inputs and every changed design, input and result.
type Changes struct {
	Old, New Side
	Rows     []Change
}

// Empty reports whether no design, input or result differs.
func (c *Changes) Empty() bool { return len(c.Rows) == 0 }

const none = "—"

// Compare reads the packages in oldDir and newDir (results.json and, where present, manifest.json)
// and lists the changed values of the project basis (column ProjectColumn), then the designs added
// and removed and, per column and lift, the changed inputs and results.
func Compare(oldDir, newDir string) (*Changes, error) {
	oldRes, oldSide, err := readSide(oldDir)
	if err != nil {
		return nil, err
	}
	newRes, newSide, err := readSide(newDir)
	if err != nil {
		return nil, err
	}
	return compare(oldRes, newRes, oldSide, newSide), nil
}

// Against compares the package in oldDir with the results.json data of a run not yet written
// (name and sha256 are its input's), for the revision marks of the new package.
func Against(oldDir string, data []byte, name, sha256 string) (*Changes, map[string]float64, error) {
	oldRes, oldSide, err := readSide(oldDir)
	if err != nil {
		return nil, nil, err
	}
	newRes, err := parseResults(ResultsName, data)
	if err != nil {
		return nil, nil, err
	}
	old := map[string]float64{}
	for _, s := range oldRes.Basis {
		old[s.ID] = s.Value
	}
	for _, d := range oldRes.Designs {
		for _, s := range d.Trace {
			old[s.ID] = s.Value
		}
	}
	return compare(oldRes, newRes, oldSide, Side{Tool: newRes.Tool, InputName: name, InputSHA256: sha256}), old, nil
}

// compare lists the changes from the old results to the new.
func compare(oldRes, newRes *results, oldSide, newSide Side) *Changes {
	c := &Changes{Old: oldSide, New: newSide}
	c.project(oldRes, newRes)
	oldBasis, newBasis := givenValues(oldRes.Basis), givenValues(newRes.Basis)
	olds := map[string]*resultsCase{}
	for i := range oldRes.Designs {
		d := &oldRes.Designs[i]
		olds[d.Column+"/"+d.Lift] = d
	}
	seen := map[string]bool{}
	for i := range newRes.Designs {
		n := &newRes.Designs[i]
		key := n.Column + "/" + n.Lift
		seen[key] = true
		o, ok := olds[key]
		if !ok {
			c.add(n, "design added", none, outcome(n))
			continue
		}
		c.inputs(o, n, oldBasis, newBasis)
		c.results(o, n)
		c.choices(o, n)
	}
	for i := range oldRes.Designs {
		o := &oldRes.Designs[i]
		if !seen[o.Column+"/"+o.Lift] {
			c.add(o, "design removed", outcome(o), none)
		}
	}
	return c
}

// readSide reads the results and, when there is one, the manifest of the package in dir.
func readSide(dir string) (*results, Side, error) {
	res, err := readResults(filepath.Join(dir, ResultsName))
	if err != nil {
		return nil, Side{}, err
	}
	seen := map[string]bool{}
	for i, d := range res.Designs {
		key := d.Column + "/" + d.Lift
		if seen[key] {
			return nil, Side{}, fmt.Errorf("%s: designs[%d]: column %s, lift %s listed twice", filepath.Join(dir, ResultsName), i, d.Column, d.Lift)
		}
		seen[key] = true
	}
	side := Side{Tool: res.Tool, InputSHA256: res.InputSHA256}
	name := filepath.Join(dir, ManifestName)
	if _, err := os.Stat(name); err == nil {
		m, err := ReadManifest(name)
		if err != nil {
			return nil, Side{}, err
		}
		side.InputName, side.InputSHA256 = m.Input.Name, m.Input.SHA256
	} else if !os.IsNotExist(err) {
		return nil, Side{}, err
	}
	return res, side, nil
}

// ProjectColumn is the column of a row that concerns the whole project: a value of the project
// basis (results.json "basis"), listed once however many designs use it.
const ProjectColumn = "project"

// project adds a row for every input or table value of the project basis that differs between
// the packages, or that only one of them holds and that comes from the input file (a bar
// diameter added to the list), each once for the project.
//
// A value that only one package records in its basis while the other records the same value in
// its designs (a package written before the basis existed) moved, and is no change.
func (c *Changes) project(o, n *results) {
	var od, nd []trace.Step
	for _, d := range o.Designs {
		od = append(od, d.Trace...)
	}
	for _, d := range n.Designs {
		nd = append(nd, d.Trace...)
	}
	ob := &resultsCase{Column: ProjectColumn, Lift: none, Trace: o.Basis}
	nb := &resultsCase{Column: ProjectColumn, Lift: none, Trace: n.Basis}
	c.inputs(ob, nb, givenValues(od), givenValues(nd))
}

// givenValues returns the given values (trace.Given) of steps, each named by what it is and
// what it holds whatever its ID: title, symbol, unit and value.
func givenValues(steps []trace.Step) map[string]bool {
	out := map[string]bool{}
	for _, s := range steps {
		if trace.Given(s) {
			out[givenValue(s)] = true
		}
	}
	return out
}

func givenValue(s trace.Step) string {
	return s.Title + "\x00" + s.Symbol + "\x00" + s.Unit + "\x00" + strconv.FormatFloat(s.Value, 'g', -1, 64)
}

func (c *Changes) add(d *resultsCase, item, old, new string) {
	c.Rows = append(c.Rows, Change{Column: d.Column, Lift: d.Lift, Item: item, Old: old, New: new})
}

// outcome describes a design in a few words for a row that adds or removes it.
func outcome(d *resultsCase) string {
	return "status " + d.Status + ", utilization " + number(d.Utilization, 4)
}

// inputs adds a row for every input or table step of o and n whose value differs, matched by step
// ID: the values given to the calculation (trace.Given). A step that only one of them holds is
// listed when it comes from the input file (clause "input"), unless the other package holds the
// same value elsewhere (oldElse, newElse: the same value moved to or from the project basis); a
// value of a standard that the other package does not record (a factor of a check that its design
// did not need) follows from the design, not from a changed input.
func (c *Changes) inputs(o, n *resultsCase, oldElse, newElse map[string]bool) {
	c.steps(o, n, "input", trace.Given,
		func(s trace.Step) bool { return s.Clause == "input" && !newElse[givenValue(s)] },
		func(s trace.Step) bool { return s.Clause == "input" && !oldElse[givenValue(s)] })
}

// choices adds a row for every value the design chose or took over from another design
// (trace.Chosen) that differs or that only one of them holds: results of the calculation, never
// listed as inputs. The bar diameter and count and the link diameter have their rows already
// (results "bars" and "links").
func (c *Changes) choices(o, n *resultsCase) {
	prefix := n.Column + "/" + n.Lift + "/"
	shown := map[string]bool{prefix + "bars/phi": true, prefix + "bars/count": true, prefix + "links/phi_t": true}
	all := func(trace.Step) bool { return true }
	c.steps(o, n, "result", func(s trace.Step) bool { return trace.Chosen(s) && !shown[s.ID] }, all, all)
}

// steps adds a row, labelled with kind, for every step of o and n that keep selects and whose
// value or unit differs, or that only one of them holds and aloneOld (a step of o) or aloneNew
// (a step of n) accepts, matched by step ID.
func (c *Changes) steps(o, n *resultsCase, kind string, keep, aloneOld, aloneNew func(trace.Step) bool) {
	prefix := n.Column + "/" + n.Lift + "/"
	olds := map[string]trace.Step{}
	for _, s := range o.Trace {
		if keep(s) {
			olds[s.ID] = s
		}
	}
	news := map[string]bool{}
	item := func(s trace.Step) string {
		label := kind + " " + code(strings.TrimPrefix(s.ID, prefix)) + ": " + escape(s.Title)
		if s.Symbol != "" {
			label += ", " + escape(s.Symbol)
		}
		return label
	}
	for _, s := range n.Trace {
		if !keep(s) {
			continue
		}
		news[s.ID] = true
		p, ok := olds[s.ID]
		switch {
		case !ok:
			if aloneNew(s) {
				c.add(n, item(s), none, quantity(s.Value, s.Unit))
			}
		case !near(p.Value, s.Value) || p.Unit != s.Unit:
			ov, nv := pair(p.Value, s.Value, p.Unit, s.Unit)
			c.add(n, item(s), ov, nv)
		}
	}
	for _, s := range o.Trace {
		if keep(s) && !news[s.ID] && aloneOld(s) {
			c.add(n, item(s), quantity(s.Value, s.Unit), none)
		}
	}
}

// results adds a row for every contract value of o and n that differs.
func (c *Changes) results(o, n *resultsCase) {
	nums := []struct {
		item     string
		old, new float64
		unit     string
	}{
		{"N_Ed", o.NEd, n.NEd, "kN"},
		{"M_Ed about y", o.Axes.Y.MEd, n.Axes.Y.MEd, "kNm"},
		{"M_Rd about y", o.Axes.Y.MRd, n.Axes.Y.MRd, "kNm"},
		{"M_Ed about z", o.Axes.Z.MEd, n.Axes.Z.MEd, "kNm"},
		{"M_Rd about z", o.Axes.Z.MRd, n.Axes.Z.MRd, "kNm"},
		{"A_s,prov", o.AsProv, n.AsProv, "mm²"},
	}
	for _, x := range nums {
		if !near(x.old, x.new) {
			ov, nv := pairIn(x.old, x.new, x.unit, x.unit)
			c.add(n, "result "+escape(x.item), ov, nv)
		}
	}
	bars := func(d *resultsCase) string {
		return strconv.Itoa(d.Bars.Count) + " × " + number(d.Bars.Dia, 4) + " mm"
	}
	links := func(d *resultsCase) string {
		return number(d.Links.Dia, 4) + " mm @ " + number(d.Links.Spacing, 4) + " mm"
	}
	words := []struct{ item, old, new string }{
		{"bars", bars(o), bars(n)},
		{"links", links(o), links(n)},
	}
	for _, x := range words {
		if x.old != x.new {
			c.add(n, "result "+x.item, x.old, x.new)
		}
	}
	if !near(o.Utilization, n.Utilization) {
		ov, nv := pairIn(o.Utilization, n.Utilization, "", "")
		c.add(n, "result utilization", ov, nv)
	}
	for _, x := range []struct{ item, old, new string }{
		{"status", o.Status, n.Status},
		{"governing", o.Governing, n.Governing},
	} {
		if x.old != x.new {
			c.add(n, "result "+x.item, escape(x.old), escape(x.new))
		}
	}
}

// Markdown returns the revision note: the input files' SHA-256 old → new and a table
// (Column | Lift | Item | Old | New) of the changes, or a line saying there are none.
func (c *Changes) Markdown() []byte {
	var b bytes.Buffer
	b.WriteString("# Changes between two calculation packages\n\n")
	name := func(s Side) string {
		if s.InputName == "" {
			return "(name not recorded)"
		}
		return code(s.InputName)
	}
	if o, n := name(c.Old), name(c.New); o == n {
		fmt.Fprintf(&b, "- Input file: %s\n", n)
	} else {
		fmt.Fprintf(&b, "- Input file: %s → %s\n", o, n)
	}
	if c.Old.InputSHA256 == c.New.InputSHA256 {
		fmt.Fprintf(&b, "- Input SHA-256 unchanged: %s\n", code(c.New.InputSHA256))
	} else {
		fmt.Fprintf(&b, "- Input SHA-256: %s → %s\n", code(c.Old.InputSHA256), code(c.New.InputSHA256))
	}
	if c.Old.Tool != c.New.Tool {
		fmt.Fprintf(&b, "- Tool: %s %s → %s %s\n", escape(c.Old.Tool.Name), escape(c.Old.Tool.Version), escape(c.New.Tool.Name), escape(c.New.Tool.Version))
	}
	b.WriteByte('\n')
	if c.Empty() {
		b.WriteString("No changes: the same designs, with the same inputs and results.\n")
		return b.Bytes()
	}
	b.WriteString("| Column | Lift | Item | Old | New |\n| --- | --- | --- | --- | --- |\n")
	for _, r := range c.Rows {
		fmt.Fprintf(&b, "| %s | %s | %s | %s | %s |\n", escape(r.Column), escape(r.Lift), r.Item, r.Old, r.New)
	}
	return b.Bytes()
}

// quantity formats v in engine unit u in the trade's unit.
func quantity(v float64, u string) string {
	scale, du := reports.DisplayUnit(u)
	return withUnit(number(v*scale, 4), du)
}

// pair formats two values in engine units ou and nu in the trade's units, with enough figures to tell them apart.
func pair(o, n float64, ou, nu string) (string, string) {
	so, odu := reports.DisplayUnit(ou)
	sn, ndu := reports.DisplayUnit(nu)
	return pairIn(o*so, n*sn, odu, ndu)
}

// pairIn formats two values already in display units ou and nu, with enough figures to tell them apart.
func pairIn(o, n float64, ou, nu string) (string, string) {
	var a, b string
	for fig := 4; fig <= 17; fig++ {
		a, b = number(o, fig), number(n, fig)
		if a != b || ou != nu {
			break
		}
	}
	return withUnit(a, ou), withUnit(b, nu)
}

func withUnit(v, u string) string {
	if u == "" {
		return v
	}
	return v + " " + escape(u)
}

// number formats v with fig significant figures, trailing zeros trimmed, in plain decimals
// for magnitudes from 1e-4 below 1e15 and with an exponent otherwise.
func number(v float64, fig int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "?"
	}
	a := math.Abs(v)
	if a == 0 {
		return "0"
	}
	var s string
	if a >= 1e-4 && a < 1e15 {
		dec := fig - 1 - int(math.Floor(math.Log10(a)))
		if dec < 0 {
			dec = 0
		}
		s = strconv.FormatFloat(v, 'f', dec, 64)
		if strings.Contains(s, ".") {
			s = strings.TrimSuffix(strings.TrimRight(s, "0"), ".")
		}
	} else {
		s = strconv.FormatFloat(v, 'e', fig-1, 64)
		if i := strings.IndexByte(s, 'e'); i >= 0 && strings.Contains(s[:i], ".") {
			s = strings.TrimSuffix(strings.TrimRight(s[:i], "0"), ".") + s[i:]
		}
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

// escape makes text safe in a cell of a Markdown table.
func escape(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch r {
		case '\\', '|', '*', '_', '`', '[', ']', '<', '>', '#':
			b.WriteByte('\\')
		case '\n', '\r':
			r = ' '
		}
		b.WriteRune(r)
	}
	return b.String()
}

// code writes s as a Markdown code span, or as escaped text when s holds a backtick or a line break.
func code(s string) string {
	if s == "" || strings.ContainsAny(s, "`\n\r") {
		return escape(s)
	}
	return "`" + strings.ReplaceAll(s, "|", `\|`) + "`"
}

// Revision returns the changes as the revision table of a new package's documents, in plain
// text (the printers escape it), marking against the previous package's step values old.
func (c *Changes) Revision(against string, old map[string]float64) *reports.Revision {
	r := &reports.Revision{Against: against, Old: old}
	for _, x := range c.Rows {
		r.Rows = append(r.Rows, reports.RevisionRow{Column: plain(x.Column), Lift: plain(x.Lift), Item: plain(x.Item), Old: plain(x.Old), New: plain(x.New)})
	}
	return r
}

// plain undoes the Markdown of escape and code.
func plain(s string) string {
	var b strings.Builder
	esc := false
	for _, r := range s {
		switch {
		case esc:
			b.WriteRune(r)
			esc = false
		case r == '\\':
			esc = true
		case r == '`':
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}
