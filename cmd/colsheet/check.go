package main

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/reports"
)

// checkOptions are the flags of check.
type checkOptions struct {
	input string
	only  selection
}

// checkFlags returns the flags of check, setting o.
func checkFlags(o *checkOptions) *flagSet {
	f := newFlagSet("check")
	f.Var(onlyFlag{&o.only}, "only", "print only these `IDS`: columns (B2,C3) or lifts (B2/L1), comma-separated")
	return f
}

// runCheck designs an input and prints the table of its lifts, writing no file.
func runCheck(args []string, stdout, stderr io.Writer) int {
	var o checkOptions
	rest, code, done := parseCommand("check", checkFlags(&o), args, stdout, stderr)
	if done {
		return code
	}
	switch {
	case len(rest) == 0:
		return failUsage(stderr, "check", usagef("no input file given"))
	case len(rest) > 1:
		return failUsage(stderr, "check", usagef("one input file only (got %s and %s)", rest[0], rest[1]))
	}
	o.input = rest[0]
	in, _, err := loadInput(o.input, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	return checkInput("check", in, o.only, stdout, stderr)
}

// checkInput designs in, keeps the designs that only names, prints their table to stdout and
// returns the exit status, as check does.
func checkInput(cmd string, in *model.Input, only selection, stdout, stderr io.Writer) int {
	if err := checkOnly(in, only); err != nil {
		return failUsage(stderr, cmd, err)
	}
	// Each design's trace let go once made: the table needs the results only.
	res, err := design.Stream(in, false, nil, func(int, *design.Design) error { return nil })
	if err != nil {
		fmt.Fprintf(stderr, "colsheet %s: %v\n", cmd, err) // a fault of the building, named by the engine
		return 2
	}
	if err := only.apply(res); err != nil {
		return failUsage(stderr, cmd, err)
	}
	if err := writeTable(stdout, res.Designs); err != nil {
		fmt.Fprintf(stderr, "colsheet %s: %v\n", cmd, err)
		return 2
	}
	return tally(res, "nothing written", stdout, stderr)
}

// tableHead names the columns of the table of check and column.
var tableHead = []string{"column", "lift", "section (mm)", "bars", "NEd (kN)", "MEd,y (kNm)", "MEd,z (kNm)", "utilisation", "verdict", "governing check"}

// writeTable prints one row per design: column, lift, section, bars, NEd, the design moments
// about y and z, utilisation, verdict and governing check, in the trade's units to four
// significant figures, as the sheets print them.
func writeTable(w io.Writer, ds []design.Design) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, strings.Join(tableHead, "\t"))
	for _, d := range ds {
		bars := "–"
		if d.Bars.Count > 0 {
			bars = fmt.Sprintf("%d Ø%s", d.Bars.Count, sig4(d.Bars.Dia))
		}
		verdict := "PASS"
		if d.Status != design.StatusPass {
			verdict = "FAIL"
		}
		section := sig4(d.B) + " × " + sig4(d.H)
		if d.Shape == model.ShapeCircle {
			section = "Ø" + sig4(d.B)
		}
		cells := []string{oneLine(d.Column), oneLine(d.Storey), section, bars,
			display(d.NEd, "N"), display(d.Y.MEd, "Nmm"), display(d.Z.MEd, "Nmm"), sig4(d.Utilization), verdict, oneLine(d.Governing)}
		fmt.Fprintln(tw, strings.Join(cells, "\t"))
	}
	return tw.Flush()
}

// display returns v, in the engine unit engine, in the trade's unit to four significant figures.
func display(v float64, engine string) string {
	scale, _ := reports.DisplayUnit(engine)
	return sig4(v * scale)
}

// sig4 formats v to four significant figures without an exponent (2150, 162.5, 0.7704).
func sig4(v float64) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'f', -1, 64)
	}
	dec := 3 - int(math.Floor(math.Log10(math.Abs(v))))
	if dec < 0 {
		p := math.Pow(10, float64(-dec))
		return strconv.FormatFloat(math.Round(v/p)*p, 'f', 0, 64)
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

// oneLine returns s with its line breaks and tabs as spaces, for a cell of the table.
func oneLine(s string) string {
	return strings.Map(func(r rune) rune {
		if r == '\n' || r == '\r' || r == '\t' {
			return ' '
		}
		return r
	}, s)
}
