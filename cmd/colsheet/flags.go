package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"strings"
	"time"

	"colsheet/calc/design"
	"colsheet/reports"
)

// flagSet is the flags of one command: a flag.FlagSet whose flags may stand before or after the
// command's arguments, each with one short name at most (-o for --out).
type flagSet struct {
	*flag.FlagSet
	alias map[string]string // short name → the flag's name
	short map[string]string // the flag's name → its short name
}

// newFlagSet returns the empty flags of the command cmd.
func newFlagSet(cmd string) *flagSet {
	fs := flag.NewFlagSet(cmd, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	return &flagSet{FlagSet: fs, alias: map[string]string{}, short: map[string]string{}}
}

// aka gives the flag name the short name s as well.
func (f *flagSet) aka(name, s string) {
	f.alias[s], f.short[name] = name, s
}

// errHelp says that -h or --help was given.
var errHelp = errors.New("help asked for")

// usageError is a fault of the command line, printed as one line with a pointer to the usage.
type usageError struct{ msg string }

func (e usageError) Error() string { return e.msg }

// usagef returns a usageError with the formatted message.
func usagef(format string, a ...any) error { return usageError{fmt.Sprintf(format, a...)} }

// lookup returns the flag called name (its name or its short name), nil when there is none.
func (f *flagSet) lookup(name string) *flag.Flag {
	if long, ok := f.alias[name]; ok {
		name = long
	}
	return f.Lookup(name)
}

// parse sets the flags given in args and returns the other arguments in order. A flag is -name
// or --name, its value the next argument or after "=" (--out=DIR); a bool flag takes no value
// unless after "=". "--" ends the flags. -h, -help and --help (and --h where the command has no
// flag h) return errHelp; a fault returns a usageError.
func (f *flagSet) parse(args []string) ([]string, error) {
	var rest []string
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "--" {
			return append(rest, args[i+1:]...), nil
		}
		if len(a) < 2 || a[0] != '-' {
			rest = append(rest, a)
			continue
		}
		dashes := 1
		if a[1] == '-' {
			dashes = 2
		}
		name, value, hasValue := strings.Cut(a[dashes:], "=")
		written := a[:dashes] + name
		switch {
		case name == "" || name[0] == '-':
			return nil, usagef("%s is not a flag", a)
		case name == "help" || name == "h" && (dashes == 1 || f.Lookup("h") == nil):
			return nil, errHelp
		}
		fl := f.lookup(name)
		if fl == nil {
			return nil, usagef("unknown flag %s", written)
		}
		isBool := false
		if b, ok := fl.Value.(interface{ IsBoolFlag() bool }); ok && b.IsBoolFlag() {
			isBool = true
			if !hasValue {
				value = "true"
			}
		} else if !hasValue {
			if i+1 >= len(args) {
				typ, _ := flag.UnquoteUsage(fl)
				return nil, usagef("%s needs a value (%s)", written, typ)
			}
			i++
			value = args[i]
		}
		if err := f.Set(fl.Name, value); err != nil {
			if isBool {
				return nil, usagef("%s: %q is neither true nor false", written, value)
			}
			return nil, usagef("%s: %v", written, err)
		}
	}
	return rest, nil
}

// writeFlags writes every flag of f as Go's flag.PrintDefaults does: its names and value name on
// one line, its usage and, unless it is the zero value, its default on the next.
func (f *flagSet) writeFlags(w io.Writer) {
	f.VisitAll(func(fl *flag.Flag) {
		names := "--" + fl.Name
		if s, ok := f.short[fl.Name]; ok {
			names = "-" + s + ", " + names
		}
		typ, usage := flag.UnquoteUsage(fl)
		line := "  " + names
		if typ != "" {
			line += " " + typ
		}
		fmt.Fprintf(w, "%s\n    \t%s", line, strings.ReplaceAll(usage, "\n", "\n    \t"))
		if d := fl.DefValue; d != "" && d != "false" && d != "0" {
			fmt.Fprintf(w, " (default %q)", d)
		}
		fmt.Fprintln(w)
	})
}

// formatsFlag is --formats: the sheet formats, a comma-separated list of md, tex and html.
type formatsFlag struct{ m *map[string]bool }

func (f formatsFlag) String() string {
	if f.m == nil {
		return ""
	}
	var out []string
	for _, k := range []string{"md", "tex", "html"} {
		if (*f.m)[k] {
			out = append(out, k)
		}
	}
	return strings.Join(out, ",")
}

func (f formatsFlag) Set(s string) error {
	m := map[string]bool{}
	for _, v := range strings.Split(s, ",") {
		switch v = strings.TrimSpace(v); v {
		case "md", "tex", "html":
			m[v] = true
		case "":
		case "pdf":
			return errors.New("pdf is not a sheet format: give --pdf for doc/calc.pdf, made from the LaTeX (tex)")
		default:
			return fmt.Errorf("unknown format %q (md, tex, html)", v)
		}
	}
	*f.m = m
	return nil
}

// detailFlag is --detail: brief or full.
type detailFlag struct{ d *reports.Detail }

func (f detailFlag) String() string {
	if f.d == nil {
		return ""
	}
	return string(*f.d)
}

func (f detailFlag) Set(s string) error {
	switch reports.Detail(s) {
	case reports.Brief, reports.Full:
		*f.d = reports.Detail(s)
		return nil
	}
	return fmt.Errorf("%q is neither brief nor full", s)
}

// checkedFlag is a string flag whose values check accepts or refuses.
type checkedFlag struct {
	s     *string
	check func(string) error
}

func (f checkedFlag) String() string {
	if f.s == nil {
		return ""
	}
	return *f.s
}

func (f checkedFlag) Set(s string) error {
	if err := f.check(s); err != nil {
		return err
	}
	*f.s = s
	return nil
}

// dateFlag is --date, setting s: a date of the form 2026-12-01.
func dateFlag(s *string) checkedFlag {
	return checkedFlag{s, func(v string) error {
		if _, err := time.Parse("2006-01-02", v); err != nil {
			return fmt.Errorf("%q is not a date of the form 2026-12-01", v)
		}
		return nil
	}}
}

// fileFlag is a flag naming a file, setting s; the name may not be empty.
func fileFlag(s *string) checkedFlag {
	return checkedFlag{s, func(v string) error {
		if v == "" {
			return errors.New("needs a file name")
		}
		return nil
	}}
}

// selection is the designs that --only names: whole columns ("B2") or lifts ("B2/L1"); empty,
// every design.
type selection []string

// onlyFlag is --only: a comma-separated list of columns and lifts, added to on each use.
type onlyFlag struct{ sel *selection }

func (f onlyFlag) String() string {
	if f.sel == nil {
		return ""
	}
	return strings.Join(*f.sel, ",")
}

func (f onlyFlag) Set(s string) error {
	for _, id := range strings.Split(s, ",") {
		id = strings.TrimSpace(id)
		if id == "" {
			return fmt.Errorf("%q names no column: give ids such as B2,C3 or B2/L1", s)
		}
		*f.sel = append(*f.sel, id)
	}
	return nil
}

// has reports whether the selection holds the design d.
func (s selection) has(d *design.Design) bool {
	if len(s) == 0 {
		return true
	}
	for _, id := range s {
		if id == d.Column || id == d.Column+"/"+d.Storey {
			return true
		}
	}
	return false
}

// unknown returns the ids of the selection that name none of the columns and lifts given, each
// as column and lift.
func (s selection) unknown(lifts [][2]string) []string {
	var out []string
	for _, id := range s {
		found := false
		for _, l := range lifts {
			if id == l[0] || id == l[0]+"/"+l[1] {
				found = true
				break
			}
		}
		if !found {
			out = append(out, id)
		}
	}
	return out
}

// check returns the usage error naming the ids of the selection that name none of lifts.
func (s selection) check(lifts [][2]string) error {
	miss := s.unknown(lifts)
	if len(miss) == 0 {
		return nil
	}
	var cols []string
	seen := map[string]bool{}
	for _, l := range lifts {
		if !seen[l[0]] {
			seen[l[0]] = true
			cols = append(cols, l[0])
		}
	}
	if len(cols) > 30 {
		cols = append(cols[:30], "…")
	}
	what := "column or lift"
	if len(miss) > 1 {
		what = "columns or lifts"
	}
	return usagef("--only: no %s %s in the input (its columns: %s; a lift is COLUMN/LIFT)", what, strings.Join(miss, ", "), strings.Join(cols, ", "))
}

// apply keeps the designs of res that the selection holds (and their size searches), or
// returns the usage error naming the ids that hold no design.
func (s selection) apply(res *design.Result) error {
	if len(s) == 0 {
		return nil
	}
	lifts := make([][2]string, len(res.Designs))
	for i, d := range res.Designs {
		lifts[i] = [2]string{d.Column, d.Storey}
	}
	if err := s.check(lifts); err != nil {
		return err
	}
	kept := res.Designs[:0:0]
	cols := map[string]bool{}
	for i := range res.Designs {
		if s.has(&res.Designs[i]) {
			kept = append(kept, res.Designs[i])
			cols[res.Designs[i].Column] = true
		}
	}
	res.Designs = kept
	sizes := res.Sizes[:0:0]
	for _, z := range res.Sizes {
		if cols[z.Column] {
			sizes = append(sizes, z)
		}
	}
	res.Sizes = sizes
	return nil
}
