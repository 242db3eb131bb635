package input

import (
	"bytes"
	"crypto/sha256"
	"encoding/csv"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"regexp"
	"strconv"
	"strings"
	"unicode/utf8"

	"colsheet/calc/model"
	"colsheet/calc/quantity"
)

// tableColumn is a column of the actions table that colsheet reads.
type tableColumn struct {
	name     string
	required bool
	what     string // the quantity, for messages
}

// tableColumns are the columns of the actions table (actions: FILE.csv), which gives the load
// cases of every lift of columns:, one row a case. Its first line names the columns, in any
// order and without regard to case, each with its unit in the name: column, lift and case (the
// column's id, the lift's name and the case's name), NEd_kN (compression positive), My_top_kNm,
// My_bottom_kNm, Mz_top_kNm and Mz_bottom_kNm (in the convention of moment_signs), all required;
// Vy_kN and Vz_kN optional, an empty cell: not given. Cells are separated by "," or ";" (the
// header line says which); with ";" a number may have a decimal comma (1234,5). A UTF-8 byte
// order mark, CRLF line ends and quoted cells are read; blank rows are skipped; other columns
// are left unread with a warning.
var tableColumns = []tableColumn{
	{"column", true, "the column's id"},
	{"lift", true, "the lift's name"},
	{"case", true, "the case's name"},
	{"NEd_kN", true, "design axial force"},
	{"My_top_kNm", true, "end moment about y at the top"},
	{"My_bottom_kNm", true, "end moment about y at the bottom"},
	{"Mz_top_kNm", true, "end moment about z at the top"},
	{"Mz_bottom_kNm", true, "end moment about z at the bottom"},
	{"Vy_kN", false, "shear force with bending about y"},
	{"Vz_kN", false, "shear force with bending about z"},
}

// tableRow is one case of the actions table with where it stands.
type tableRow struct {
	column, lift string
	c            model.Case
	ok           bool // the row has no fault
}

// table reads one actions table and collects its faults and warnings.
type table struct {
	name  string
	sep   rune
	errs  Errors
	warns []Warning
}

func (t *table) fail(line int, field, format string, args ...any) {
	t.errs = append(t.errs, Error{File: t.name, Line: line, Field: field, Msg: fmt.Sprintf(format, args...)})
}

// tableRead is what readTable finds in an actions table.
type tableRead struct {
	rows     []tableRow // every row that names its column and lift, in row order, with or without faults
	complete bool       // every row was read: the header is sound and the CSV syntax too
	errs     Errors
	warns    []Warning
}

// readTable reads the actions table called name with contents data, its moments given in the
// convention signs: the cases in row order with their faults and warnings. A (column, lift,
// case) given twice is a fault; whether the columns and lifts exist is the caller's to check.
func readTable(name string, data []byte, signs string) tableRead {
	t := &table{name: name}
	data = bytes.TrimPrefix(data, []byte("\uFEFF"))
	if len(bytes.TrimSpace(data)) == 0 {
		t.fail(1, "", "the table is empty; expected a header line such as %s", headerExample())
		return tableRead{errs: t.errs}
	}
	t.sep = separator(data)
	cr := csv.NewReader(bytes.NewReader(data))
	cr.Comma = t.sep
	cr.FieldsPerRecord = -1
	header, err := cr.Read()
	if err != nil {
		t.syntax(err)
		return tableRead{errs: t.errs}
	}
	headerLine, _ := cr.FieldPos(0)
	at, ok := t.header(header, headerLine)
	if !ok {
		return tableRead{errs: t.errs, warns: t.warns}
	}
	out := tableRead{complete: true}
	first := map[[3]string]int{}
	for {
		rec, err := cr.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			t.syntax(err)
			out.complete = false
			break
		}
		line, _ := cr.FieldPos(0)
		row, named := t.row(rec, line, len(header), at, signs)
		if !named {
			continue
		}
		key := [3]string{row.column, row.lift, row.c.Name}
		if prev, dup := first[key]; dup && row.c.Name != "" {
			t.fail(line, "case", "case %q of column %s, lift %s is given twice (first on line %d)", row.c.Name, row.column, row.lift, prev)
			row.ok = false
		} else if row.c.Name != "" {
			first[key] = line
		}
		out.rows = append(out.rows, row)
	}
	out.errs, out.warns = t.errs, t.warns
	return out
}

// headerExample returns the required header line.
func headerExample() string {
	var names []string
	for _, c := range tableColumns {
		if c.required {
			names = append(names, c.name)
		}
	}
	return strings.Join(names, ",")
}

// separator returns the cell separator the header line uses: ";" where it has more of them than
// of ",", else ",".
func separator(data []byte) rune {
	head := data
	if i := bytes.IndexByte(data, '\n'); i >= 0 {
		head = data[:i]
	}
	if bytes.Count(head, []byte(";")) > bytes.Count(head, []byte(",")) {
		return ';'
	}
	return ','
}

// syntax records a fault of the CSV syntax.
func (t *table) syntax(err error) {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		t.fail(max(pe.Line, 1), "", "the table is not valid CSV: %s", pe.Err)
		return
	}
	t.fail(1, "", "the table cannot be read: %s", err)
}

// header maps each column colsheet reads to its index in the header, reporting a missing
// required column or one given twice, and warning of columns it does not read.
func (t *table) header(header []string, line int) (map[string]int, bool) {
	at := map[string]int{}
	ok := true
	for i, h := range header {
		name := strings.TrimSpace(h)
		col, known := lookupColumn(name)
		switch {
		case name == "":
			t.warns = append(t.warns, Warning{File: t.name, Line: line, Msg: fmt.Sprintf("column %d has no name and is not used", i+1)})
		case !known:
			t.warns = append(t.warns, Warning{File: t.name, Line: line, Field: name, Msg: fmt.Sprintf("column %s is not used", name)})
		default:
			if j, dup := at[col.name]; dup {
				t.fail(line, name, "the column is given twice (columns %d and %d of the header)", j+1, i+1)
				ok = false
				continue
			}
			at[col.name] = i
		}
	}
	for _, c := range tableColumns {
		if _, has := at[c.name]; c.required && !has {
			t.fail(line, c.name, "is required but missing from the header (%s; the header needs %s, and may have Vy_kN and Vz_kN)", c.what, headerExample())
			ok = false
		}
	}
	return at, ok
}

// lookupColumn returns the column of the table called name, without regard to case.
func lookupColumn(name string) (tableColumn, bool) {
	for _, c := range tableColumns {
		if strings.EqualFold(c.name, name) {
			return c, true
		}
	}
	return tableColumn{}, false
}

// row reads one row of cells at line into a case (row.ok when it has no fault); it reports
// false when the row is blank or does not name its column and lift.
func (t *table) row(rec []string, line, width int, at map[string]int, signs string) (tableRow, bool) {
	blank := true
	for _, c := range rec {
		blank = blank && strings.TrimSpace(c) == ""
	}
	if blank {
		return tableRow{}, false
	}
	if len(rec) != width {
		t.fail(line, "", "the row has %d cells, the header %d", len(rec), width)
		return tableRow{}, false
	}
	before := len(t.errs)
	cell := func(name string) string { return strings.TrimSpace(rec[at[name]]) }
	row := tableRow{column: t.text(cell("column"), line, "column"), lift: t.text(cell("lift"), line, "lift")}
	c := model.Case{Name: t.text(cell("case"), line, "case"), File: t.name, Line: line}
	c.NEd, _ = t.number(cell("NEd_kN"), line, "NEd_kN", limitAxial)
	var my, mz model.Ends
	my.Top, _ = t.number(cell("My_top_kNm"), line, "My_top_kNm", LimitMoment)
	my.Bottom, _ = t.number(cell("My_bottom_kNm"), line, "My_bottom_kNm", LimitMoment)
	mz.Top, _ = t.number(cell("Mz_top_kNm"), line, "Mz_top_kNm", LimitMoment)
	mz.Bottom, _ = t.number(cell("Mz_bottom_kNm"), line, "Mz_bottom_kNm", LimitMoment)
	c.MY, c.MZ = FaceEnds(my, signs), FaceEnds(mz, signs)
	for i, name := range []string{"Vy_kN", "Vz_kN"} {
		if j, has := at[name]; has && strings.TrimSpace(rec[j]) != "" {
			c.V[i], c.HasV[i] = t.number(strings.TrimSpace(rec[j]), line, name, LimitShear)
		}
	}
	row.c = c
	row.ok = len(t.errs) == before
	return row, row.column != "" && row.lift != ""
}

// text reads a name cell (column id, lift or case): not empty, without slashes or control characters.
func (t *table) text(s string, line int, field string) string {
	switch {
	case s == "":
		t.fail(line, field, "the cell is empty (give %s)", columnWhat(field))
	case !utf8.ValidString(s):
		t.fail(line, field, "%q is not UTF-8 text", s)
	case strings.ContainsAny(s, "/\\"):
		t.fail(line, field, "%q must not contain a slash", s)
	case strings.IndexFunc(s, func(c rune) bool { return c < ' ' || c == 0x7f }) >= 0:
		t.fail(line, field, "%q must not contain control characters", s)
	default:
		return s
	}
	return ""
}

// columnWhat returns the description of the table's column called name.
func columnWhat(name string) string {
	c, _ := lookupColumn(name)
	return c.what
}

// plainNumber is a decimal number with an optional sign and exponent, and no unit.
var plainNumber = regexp.MustCompile(`^[+-]?([0-9]+\.?[0-9]*|\.[0-9]+)([eE][+-]?[0-9]+)?$`)

// number reads a number cell in the unit of its column, within l, in engine units.
func (t *table) number(s string, line int, field string, l Limit) (float64, bool) {
	if s == "" {
		t.fail(line, field, "the cell is empty (give the %s in %s)", columnWhat(field), l.Unit)
		return 0, false
	}
	text := s
	if t.sep == ';' && strings.Count(text, ",") == 1 && !strings.Contains(text, ".") {
		text = strings.Replace(text, ",", ".", 1)
	}
	if !plainNumber.MatchString(text) {
		hint := "give a plain number, in the unit the column's name says (" + l.Unit + ")"
		if t.sep == ',' && strings.Contains(s, ",") {
			hint = "with \",\" between the cells write a decimal point, or separate the cells with \";\""
		}
		t.fail(line, field, "%q is not a number; %s", s, hint)
		return 0, false
	}
	v, _ := strconv.ParseFloat(text, 64) // the pattern holds; out of range gives ±Inf, refused below
	x, err := quantity.Convert(v, l.Unit)
	if err != nil || !finite(x) {
		t.fail(line, field, "%q is not a finite number", s)
		return 0, false
	}
	if !l.within(x) {
		t.fail(line, field, "%s", l.outside(x))
		return 0, false
	}
	return x, true
}

// declared is a column of columns: as written, even one with faults, with its lifts.
type declared struct {
	id        string
	path      string
	lifts     []declaredLift
	liftsRead bool // the list of lifts was read, so the table's lifts can be checked against it
}

// declaredLift is a lift of a declared column with where it stands in the input file.
type declaredLift struct {
	name, path string
	line       int
}

// declare records column c, read at path, for the actions table; a repeated id is left out.
func (r *reader) declare(c model.Column, path string) {
	if c.ID == "" {
		r.unnamed = true
		return
	}
	if r.declaredColumn(c.ID) != nil {
		return
	}
	d := declared{id: c.ID, path: path, liftsRead: c.Storeys != nil}
	seen := map[string]bool{}
	for i, s := range c.Storeys {
		if s.Name == "" || seen[s.Name] {
			continue
		}
		seen[s.Name] = true
		d.lifts = append(d.lifts, declaredLift{s.Name, index(join(path, "storeys"), i), s.Line})
	}
	r.declared = append(r.declared, d)
}

// declaredColumn returns the declared column called id, or nil.
func (r *reader) declaredColumn(id string) *declared {
	for i := range r.declared {
		if r.declared[i].id == id {
			return &r.declared[i]
		}
	}
	return nil
}

// tableNameOf reads the name of the actions table under actions: a path relative to the folder
// of the input file. It returns the name as written even when it reports it as a fault.
func (r *reader) tableNameOf(e pair) (string, bool) {
	s, ok := r.str(e.val, "actions")
	if !ok {
		return "", false
	}
	s = strings.TrimSpace(s)
	switch {
	case s == "":
		r.fail(e.val, "actions", "must not be empty (the table of cases, e.g. actions: cases.csv)")
		return s, false
	case strings.HasPrefix(s, "/") || strings.HasPrefix(s, `\`) || len(s) > 1 && s[1] == ':':
		r.fail(e.val, "actions", "%q: give the path relative to the folder of the input file", s)
		return s, false
	}
	return s, true
}

// actionsTable reads the actions table named under actions: (entry e) through r.read, and gives
// every lift of cols its cases. It reports a case of a column or lift that columns: does not
// have, and a lift of columns: without a case.
func (r *reader) actionsTable(e pair, cols []model.Column) *model.ActionsTable {
	data, err := r.read(r.tableName)
	if err != nil {
		var pe *fs.PathError
		if errors.As(err, &pe) {
			err = pe.Err
		}
		r.fail(e.val, "actions", "cannot read the actions table %q: %s", r.tableName, err)
		return nil
	}
	t := readTable(r.tableName, data, r.signs)
	r.errs = append(r.errs, t.errs...)
	r.warns = append(r.warns, t.warns...)
	cases, named := r.match(t.rows)
	for _, d := range r.declared {
		for _, l := range d.lifts {
			if t.complete && !named[[2]string{d.id, l.name}] {
				r.errs = append(r.errs, Error{File: r.file, Line: l.line, Field: l.path,
					Msg: fmt.Sprintf("the actions table %q has no case of column %s, lift %s", r.tableName, d.id, l.name)})
			}
		}
	}
	for i := range cols {
		for j := range cols[i].Storeys {
			s := &cols[i].Storeys[j]
			s.Cases = cases[[2]string{cols[i].ID, s.Name}]
			if len(s.Cases) > 0 {
				s.NEd, s.MY, s.MZ = s.Cases[0].NEd, s.Cases[0].MY, s.Cases[0].MZ
			}
		}
	}
	sum := sha256.Sum256(data)
	return &model.ActionsTable{Name: r.tableName, Data: data, SHA256: hex.EncodeToString(sum[:])}
}

// match sorts the sound rows of the table to the lifts of columns:, by column id and lift name,
// in row order, reporting the rows whose column or lift is not there. It also returns the lifts
// that some row names, sound or not.
func (r *reader) match(rows []tableRow) (map[[2]string][]model.Case, map[[2]string]bool) {
	var ids []string
	for _, d := range r.declared {
		ids = append(ids, d.id)
	}
	out := map[[2]string][]model.Case{}
	named := map[[2]string]bool{}
	for _, row := range rows {
		d := r.declaredColumn(row.column)
		if d == nil {
			if !r.unnamed {
				r.errs = append(r.errs, Error{File: r.tableName, Line: row.c.Line, Field: "column",
					Msg: fmt.Sprintf("%q is not a column of columns: (columns: %s)", row.column, strings.Join(ids, ", "))})
			}
			continue
		}
		if !d.has(row.lift) {
			if d.liftsRead {
				r.errs = append(r.errs, Error{File: r.tableName, Line: row.c.Line, Field: "lift",
					Msg: fmt.Sprintf("column %s has no lift %q (lifts: %s)", d.id, row.lift, strings.Join(d.names(), ", "))})
			}
			continue
		}
		key := [2]string{row.column, row.lift}
		named[key] = true
		if row.ok {
			out[key] = append(out[key], row.c)
		}
	}
	return out, named
}

// has reports whether the column has a lift called name.
func (d *declared) has(name string) bool {
	for _, l := range d.lifts {
		if l.name == name {
			return true
		}
	}
	return false
}

// names returns the names of the column's lifts.
func (d *declared) names() []string {
	out := make([]string, len(d.lifts))
	for i, l := range d.lifts {
		out[i] = l.name
	}
	return out
}
