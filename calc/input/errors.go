package input

import (
	"fmt"
	"sort"
	"strings"
)

// Error is one fault of an input file, at a line and a field path such as columns[0].storeys[1].NEd.
type Error struct {
	File  string
	Line  int
	Field string // YAML keys joined by dots, list items as [i], or a column of the actions table; empty for faults of the whole file
	Msg   string
}

// Error formats the fault as FILE:LINE: field: message.
func (e Error) Error() string { return position(e.File, e.Line, e.Field, e.Msg) }

// Errors is every fault found in one input file and its actions table: the input file's in
// line order, then the table's.
type Errors []Error

// Error returns the faults one to a line.
func (es Errors) Error() string {
	lines := make([]string, len(es))
	for i, e := range es {
		lines[i] = e.Error()
	}
	return strings.Join(lines, "\n")
}

// sortFrom orders the faults by file, those of main (the input file) first, then by line.
func (es Errors) sortFrom(main string) {
	sort.SliceStable(es, func(i, j int) bool {
		return before(main, es[i].File, es[i].Line, es[j].File, es[j].Line)
	})
}

// Warning is a remark on an input that is read all the same, such as a column of the actions
// table that is not used.
type Warning struct {
	File  string
	Line  int
	Field string // as Error's
	Msg   string
}

// String formats the warning as FILE:LINE: field: message.
func (w Warning) String() string { return position(w.File, w.Line, w.Field, w.Msg) }

// sortWarnings orders warnings as sortFrom orders faults.
func sortWarnings(ws []Warning, main string) {
	sort.SliceStable(ws, func(i, j int) bool {
		return before(main, ws[i].File, ws[i].Line, ws[j].File, ws[j].Line)
	})
}

// before reports whether a remark at (fa, la) comes before one at (fb, lb): main first, then
// the other files by name, each in line order.
func before(main, fa string, la int, fb string, lb int) bool {
	if (fa == main) != (fb == main) {
		return fa == main
	}
	if fa != fb {
		return fa < fb
	}
	return la < lb
}

// position formats FILE:LINE: field: message, leaving out an empty field.
func position(file string, line int, field, msg string) string {
	if field == "" {
		return fmt.Sprintf("%s:%d: %s", file, line, msg)
	}
	return fmt.Sprintf("%s:%d: %s: %s", file, line, field, msg)
}
