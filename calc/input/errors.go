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
	Field string // YAML keys joined by dots, list items as [i]; empty for faults of the whole file
	Msg   string
}

// Error formats the fault as FILE:LINE: field: message.
func (e Error) Error() string {
	if e.Field == "" {
		return fmt.Sprintf("%s:%d: %s", e.File, e.Line, e.Msg)
	}
	return fmt.Sprintf("%s:%d: %s: %s", e.File, e.Line, e.Field, e.Msg)
}

// Errors is every fault found in one input file, in line order.
type Errors []Error

// Error returns the faults one to a line.
func (es Errors) Error() string {
	lines := make([]string, len(es))
	for i, e := range es {
		lines[i] = e.Error()
	}
	return strings.Join(lines, "\n")
}

func (es Errors) sort() {
	sort.SliceStable(es, func(i, j int) bool { return es[i].Line < es[j].Line })
}
