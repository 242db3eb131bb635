// Command colsheet designs and checks reinforced-concrete columns to EN 1992-1-1 and
// writes traced calculation sheets (Markdown, LaTeX, HTML), results.json and a CSV summary.
//
// Usage:
//
//	colsheet design INPUT.yaml -o DIR [--formats md,tex,html] [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf]
//	colsheet archive INPUT.yaml -o BUNDLE [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf]
//	colsheet recheck BUNDLE
//	colsheet compare OLD NEW [-o FILE.md]
//	colsheet version
//
// Exit status: 0 every design passes, 1 some design fails, 2 bad input or usage, 3 pdflatex failed.
package main

import (
	"fmt"
	"io"
	"os"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

const usage = `colsheet: traced design of reinforced-concrete columns to EN 1992-1-1

usage:
  colsheet design INPUT.yaml -o DIR [--formats md,tex,html] [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf]
  colsheet archive INPUT.yaml -o BUNDLE [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf]
  colsheet recheck BUNDLE
  colsheet compare OLD NEW [-o FILE.md]
  colsheet version
  colsheet help

design writes DIR/results.json, DIR/summary.csv, DIR/schedule.csv,
DIR/quantities.csv (steel masses per column, level and building), the calc
document DIR/doc/calc.{md,tex,html} (calc.pdf with --pdf, which needs pdflatex)
and the calc sheets under DIR/md, DIR/tex and DIR/html. Sheets are brief by
default (the chain a checker follows; the calc document groups the lifts and
gives each group's governing lift in full); --detail full prints every step
(in HTML with the sub-steps folded); results.json always holds the whole
trace. --against PREVIOUS (an earlier output folder or archive bundle) marks
every value that changed since it (highlighted in HTML, a bar in the margin
of the PDF) and opens the calc document with the revision table. An earlier
output in
DIR is replaced only with --replace, as a whole (never half); other files in
DIR are never overwritten. Exit status: 0 every design passes, 1 some design
fails (everything is still written), 2 bad input or usage, 3 pdflatex failed
(without pdflatex, --pdf only says so).

archive writes the same files plus BUNDLE/input/ (the input file) and
BUNDLE/manifest.json (size and SHA-256 of every file). recheck verifies a
bundle against its manifest and re-evaluates every traced step (exit 0 all
reproduce, 1 something does not, 2 unreadable bundle or usage). compare
prints the changed inputs and results of two bundles as a Markdown table.
`

func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		fmt.Fprint(stderr, usage)
		return 2
	}
	switch args[0] {
	case "design":
		return runDesign(args[1:], stdout, stderr)
	case "archive":
		return runArchive(args[1:], stdout, stderr)
	case "recheck":
		return runRecheck(args[1:], stdout, stderr)
	case "compare":
		return runCompare(args[1:], stdout, stderr)
	case "version", "--version":
		fmt.Fprintln(stdout, "colsheet", version())
		return 0
	case "help", "-h", "--help":
		fmt.Fprint(stdout, usage)
		return 0
	}
	fmt.Fprintf(stderr, "colsheet: unknown command %q\n\n%s", args[0], usage)
	return 2
}
