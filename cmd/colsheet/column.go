package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"regexp"
	"strconv"
	"strings"
	"time"

	"colsheet/calc/input"
	"colsheet/calc/material"
	"colsheet/calc/quantity"
)

// columnArgs are the values of one column given on the command line, as typed.
type columnArgs struct {
	id, lift, title      string
	b, h, d, cover       string
	helix                bool
	fck, concrete, fyk   string
	ned, my, mz          string
	l0, l0y, l0z         string
	bars, phiEf, command string
}

// columnFlags returns the flags of column, setting c and, for the package written with -o, o.
func columnFlags(c *columnArgs, o *options) *flagSet {
	f := newFlagSet("column")
	f.StringVar(&c.id, "id", "C1", "the column's `ID`")
	f.StringVar(&c.lift, "lift", "L1", "the lift's `NAME`")
	f.StringVar(&c.title, "title", "", "the project's `TITLE` on the sheets (default \"Column ID\")")
	f.StringVar(&c.b, "b", "", "the section's width b, along y, a `LENGTH` such as 350mm or 0.35m (a plain number is mm; required unless --D)")
	f.StringVar(&c.h, "h", "", "the section's depth h, along z, a `LENGTH` (required unless --D)")
	f.StringVar(&c.d, "D", "", "the `DIAMETER` of a circular column, a length, instead of --b and --h")
	f.BoolVar(&c.helix, "helix", false, "with --D, the bars are bound by a helix rather than circular links")
	f.StringVar(&c.cover, "cover", "", "the nominal cover to the links, a `LENGTH` (required)")
	f.StringVar(&c.fck, "fck", "", "the concrete's characteristic strength in `MPa`, naming its class: 32 for C32/40 (this or --concrete required)")
	f.StringVar(&c.concrete, "concrete", "", "the concrete's strength `CLASS` of EN 1992-1-1 Table 3.1, e.g. C32/40")
	f.StringVar(&c.fyk, "fyk", "500MPa", "the characteristic yield strength of the bars, a `STRESS` (a plain number is MPa)")
	f.StringVar(&c.ned, "NEd", "", "the design axial force, compression positive, a `FORCE` such as 2150kN (a plain number is kN; required)")
	f.StringVar(&c.my, "My", "0,0", "the first-order end moments about y at the top and the bottom, `TOP,BOTTOM` in kNm (the same sign: tension on the same face)")
	f.StringVar(&c.mz, "Mz", "0,0", "the first-order end moments about z, `TOP,BOTTOM` in kNm")
	f.StringVar(&c.l0, "l0", "", "the effective `LENGTH` about both axes (this or --l0y and --l0z required)")
	f.StringVar(&c.l0y, "l0y", "", "the effective `LENGTH` for buckling about y")
	f.StringVar(&c.l0z, "l0z", "", "the effective `LENGTH` for buckling about z")
	f.StringVar(&c.bars, "bars", "", "the bars to check, `COUNTxDIA` such as 8x20 (mm); without, the bars are designed")
	f.StringVar(&c.phiEf, "phi_ef", "", "the effective creep `RATIO` (without, the code parameter phi_ef_default)")
	outputFlags(f, o, "also write the package, as design does, into the folder `DIR`", true)
	f.Lookup("date").Usage = "the date `YYYY-MM-DD` on the sheets (without, today)"
	f.Var(formatsFlag{&o.formats}, "formats", "with -o, the sheet `FORMATS`, a comma-separated list of md, tex and html")
	f.StringVar(&o.against, "against", "", "with -o, mark every value that changed since the earlier output folder or archive `PREVIOUS`")
	f.BoolVar(&o.pdf, "pdf", false, "with -o, run pdflatex over the calc document: doc/calc.pdf")
	return f
}

// columnInputName is the name of the input that column builds, in messages and the package.
const columnInputName = "column.yaml"

// runColumn designs one column given by its flags: it prints the table of check and, with -o,
// writes the package as design does.
func runColumn(args []string, stdout, stderr io.Writer) int {
	var c columnArgs
	o := newOptions("design")
	f := columnFlags(&c, &o)
	rest, code, done := parseCommand("column", f, args, stdout, stderr)
	if done {
		return code
	}
	if len(rest) > 0 {
		return failUsage(stderr, "column", usagef("takes no input file, only flags (got %s)", rest[0]))
	}
	c.command = "colsheet column " + strings.Join(args, " ")
	if o.date == "" {
		o.date = time.Now().Format("2006-01-02")
	}
	text, err := columnYAML(c, o.date)
	if err != nil {
		return failUsage(stderr, "column", err)
	}
	data := []byte(text)
	in, warns, err := input.ParseWarn(columnInputName, data, nil)
	printWarnings(stderr, warns, func(w input.Warning) string { return c.say(w.Field, w.Msg) })
	if err != nil {
		var es input.Errors
		if !errors.As(err, &es) {
			fmt.Fprintf(stderr, "colsheet column: %v\n", err)
			return 2
		}
		for _, e := range es {
			fmt.Fprintf(stderr, "colsheet column: %s\n", c.say(e.Field, e.Msg))
		}
		return 2
	}
	if o.out == "" {
		return checkInput("column", in, nil, stdout, stderr)
	}
	o.input = columnInputName
	j, err := produce(o, in, data, stderr)
	if err != nil {
		return failRun(stderr, "column", err)
	}
	if err := writeTable(stdout, j.res.Designs); err != nil {
		j.st.discard()
		j.progress.end()
		fmt.Fprintf(stderr, "colsheet column: %v\n", err)
		return 2
	}
	return deliver(o, j, nil, stdout, stderr)
}

// columnFields ties the fields of the input that column builds to the flags that give them.
var columnFields = []struct{ field, flag string }{
	{"project.date", "--date"},
	{"project.title", "--title"},
	{"materials.concrete", "--fck"},
	{"materials.fyk", "--fyk"},
	{"columns[0].id", "--id"},
	{"columns[0].b", "--b"},
	{"columns[0].h", "--h"},
	{"columns[0].D", "--D"},
	{"columns[0].shape", "--D"},
	{"columns[0].helix", "--helix"},
	{"columns[0].cover", "--cover"},
	{"columns[0].bars", "--bars"},
	{"columns[0].storeys[0].name", "--lift"},
	{"columns[0].storeys[0].l0.y", "--l0y"},
	{"columns[0].storeys[0].l0.z", "--l0z"},
	{"columns[0].storeys[0].l0", "--l0"},
	{"columns[0].storeys[0].NEd", "--NEd"},
	{"columns[0].storeys[0].M.y", "--My"},
	{"columns[0].storeys[0].M.z", "--Mz"},
	{"columns[0].storeys[0].phi_ef", "--phi_ef"},
}

// say returns the message msg on the field of the built input as one on the flag that gave it.
func (c columnArgs) say(field, msg string) string {
	for _, f := range columnFields {
		if field != f.field && !strings.HasPrefix(field, f.field+".") && !strings.HasPrefix(field, f.field+"[") {
			continue
		}
		flag := f.flag
		switch {
		case flag == "--fck" && c.concrete != "":
			flag = "--concrete"
		case (flag == "--l0y" || flag == "--l0z") && c.l0 != "":
			flag = "--l0"
		}
		return flag + ": " + msg
	}
	if field == "" {
		return msg
	}
	return field + ": " + msg
}

// plainScalar matches a value written into the built YAML as it is: a number with or without
// a unit; anything else is written as a quoted string.
var plainScalar = regexp.MustCompile(`^-?[0-9][0-9.]*( ?[A-Za-z][A-Za-z0-9/]*)?$`)

// scalar returns s as a YAML scalar that reads back as s.
func scalar(s string) string {
	s = strings.TrimSpace(s)
	if plainScalar.MatchString(s) {
		return s
	}
	b, _ := json.Marshal(s) // a JSON string is a YAML double-quoted scalar
	return string(b)
}

// columnYAML returns the input of the actions form that the values of c give, dated date; an
// error is a usage error naming the flag.
func columnYAML(c columnArgs, date string) (string, error) {
	section, err := sectionYAML(c)
	if err != nil {
		return "", err
	}
	for _, r := range []struct{ v, flag string }{{c.cover, "--cover"}, {c.ned, "--NEd"}} {
		if strings.TrimSpace(r.v) == "" {
			return "", usagef("%s is required", r.flag)
		}
	}
	class, err := concreteClass(c.fck, c.concrete)
	if err != nil {
		return "", err
	}
	l0, err := effectiveLengths(c.l0, c.l0y, c.l0z)
	if err != nil {
		return "", err
	}
	my, err := endMoments("--My", c.my)
	if err != nil {
		return "", err
	}
	mz, err := endMoments("--Mz", c.mz)
	if err != nil {
		return "", err
	}
	title := c.title
	if title == "" {
		title = "Column " + c.id
	}
	var b strings.Builder
	fmt.Fprintf(&b, "# The input of one column, built from the command line:\n# %s\n", oneLine(c.command))
	fmt.Fprintf(&b, "project: {title: %s, date: %s}\n", scalar(title), scalar(date))
	fmt.Fprintf(&b, "materials: {concrete: %s, fyk: %s}\n", scalar(class), scalar(c.fyk))
	fmt.Fprintf(&b, "columns:\n  - id: %s\n%s    cover: %s\n", scalar(c.id), section, scalar(c.cover))
	if c.bars != "" {
		count, dia, err := barsOf(c.bars)
		if err != nil {
			return "", err
		}
		fmt.Fprintf(&b, "    bars: {count: %d, dia: %s}\n", count, scalar(dia))
	}
	fmt.Fprintf(&b, "    storeys:\n      - name: %s\n        l0: %s\n        NEd: %s\n", scalar(c.lift), l0, scalar(c.ned))
	fmt.Fprintf(&b, "        M: {y: {top: %s, bottom: %s}, z: {top: %s, bottom: %s}}\n", scalar(my[0]), scalar(my[1]), scalar(mz[0]), scalar(mz[1]))
	if c.phiEf != "" {
		fmt.Fprintf(&b, "        phi_ef: %s\n", scalar(c.phiEf))
	}
	return b.String(), nil
}

// sectionYAML returns the lines of the built input that give the section: b and h, or for a
// circle (--D) the shape, D and the helix.
func sectionYAML(c columnArgs) (string, error) {
	circle := strings.TrimSpace(c.d) != ""
	switch {
	case circle && (strings.TrimSpace(c.b) != "" || strings.TrimSpace(c.h) != ""):
		return "", usagef("give --D for a circular column or --b and --h for a rectangular one, not both")
	case circle && c.helix:
		return fmt.Sprintf("    shape: circle\n    D: %s\n    helix: true\n", scalar(c.d)), nil
	case circle:
		return fmt.Sprintf("    shape: circle\n    D: %s\n", scalar(c.d)), nil
	case c.helix:
		return "", usagef("--helix binds the bars of a circular column: give its diameter with --D")
	}
	for _, r := range []struct{ v, flag string }{{c.b, "--b"}, {c.h, "--h"}} {
		if strings.TrimSpace(r.v) == "" {
			return "", usagef("%s is required (or --D for a circular column)", r.flag)
		}
	}
	return fmt.Sprintf("    b: %s\n    h: %s\n", scalar(c.b), scalar(c.h)), nil
}

// concreteClass returns the class that --fck (its fck) or --concrete names.
func concreteClass(fck, class string) (string, error) {
	switch {
	case fck != "" && class != "":
		return "", usagef("give --fck or --concrete, not both")
	case class != "":
		return class, nil // the input reader checks it against Table 3.1
	case fck == "":
		return "", usagef("--fck is required (or --concrete)")
	}
	v, err := quantity.Parse(strings.TrimSpace(fck), "MPa")
	if err != nil {
		return "", usagef("--fck: %v", err)
	}
	var fcks []string
	for _, c := range append(append([][2]float64{}, material.Classes...), material.ExtraClasses...) {
		if c[0] == v {
			return fmt.Sprintf("C%g/%g", c[0], c[1]), nil
		}
		fcks = append(fcks, strconv.FormatFloat(c[0], 'g', -1, 64))
	}
	return "", usagef("--fck: %s MPa is the fck of no strength class of EN 1992-1-1 Table 3.1 (%s)", strconv.FormatFloat(v, 'g', -1, 64), strings.Join(fcks, ", "))
}

// effectiveLengths returns the l0 of the built input: one value, or {y, z}.
func effectiveLengths(l0, y, z string) (string, error) {
	switch {
	case l0 != "" && (y != "" || z != ""):
		return "", usagef("give --l0 or --l0y and --l0z, not both")
	case l0 != "":
		return scalar(l0), nil
	case y == "" && z == "":
		return "", usagef("--l0 is required (or --l0y and --l0z)")
	case y == "" || z == "":
		return "", usagef("give both --l0y and --l0z (or --l0 for both)")
	}
	return fmt.Sprintf("{y: %s, z: %s}", scalar(y), scalar(z)), nil
}

// endMoments splits the value of the flag name, "TOP,BOTTOM", into its two moments.
func endMoments(name, v string) ([2]string, error) {
	parts := strings.Split(v, ",")
	if len(parts) != 2 || strings.TrimSpace(parts[0]) == "" || strings.TrimSpace(parts[1]) == "" {
		return [2]string{}, usagef("%s: %q is not TOP,BOTTOM: give the moments at the top and the bottom in kNm, e.g. %s 85,-40", name, v, name)
	}
	return [2]string{strings.TrimSpace(parts[0]), strings.TrimSpace(parts[1])}, nil
}

// barsPattern matches --bars: a count, x (or ×), a diameter with or without a unit.
var barsPattern = regexp.MustCompile(`^\s*([0-9]+)\s*[xX×]\s*([0-9][0-9.]*\s*(mm)?)\s*$`)

// barsOf splits --bars, "8x20", into the count and the diameter.
func barsOf(v string) (int, string, error) {
	m := barsPattern.FindStringSubmatch(v)
	if m == nil {
		return 0, "", usagef("--bars: %q is not COUNTxDIA: give the count and the diameter in mm, e.g. --bars 8x20", v)
	}
	n, err := strconv.Atoi(m[1])
	if err != nil {
		return 0, "", usagef("--bars: %q: the count is too large", v)
	}
	return n, strings.TrimSpace(m[2]), nil
}

const columnLong = `Column designs one column over one lift from values given as flags: it builds the input of
the actions form (a YAML text read by the same input reader as a file, so the same checks and
limits apply), dated today unless --date, designs it and prints the table of check. With -o it
also writes the package as design does, the trace and sheets included.

Lengths take a unit (350mm, 0.35m) or are mm; forces kN (2150kN or 2150); moments kNm, as
TOP,BOTTOM (85,-40: the same sign is tension on the same face). For example:

  colsheet column --b 350mm --h 500mm --cover 40mm --fck 32 --NEd 2150kN --My 85,-40 --Mz 10,10 --l0 3.1m

A circular column gives its diameter with --D instead of --b and --h (--helix for a helix
rather than circular links; --bars then counts at least 6 bars, evenly on the circle):

  colsheet column --D 450mm --cover 40mm --fck 32 --NEd 2150kN --My 85,-40 --l0 3.1m --bars 8x20
`
