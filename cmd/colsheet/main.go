// Command colsheet designs and checks reinforced-concrete columns to EN 1992-1-1 and
// writes traced calculation sheets (Markdown, LaTeX, HTML), results.json and a CSV summary.
//
// Usage:
//
//	colsheet design INPUT.yaml -o DIR [--formats md,tex,html] [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q]
//	colsheet archive INPUT.yaml -o BUNDLE [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q] [--sign KEYFILE]
//	colsheet recheck BUNDLE [--key PUBFILE]
//	colsheet compare OLD NEW [-o FILE.md]
//	colsheet version
//
// Exit status: 0 every design passes, 1 some design fails, 2 bad input or usage, 3 pdflatex failed,
// 4 internal error.
package main

import (
	"fmt"
	"io"
	"os"
	"os/signal"
	"runtime/debug"
	"syscall"
)

func main() {
	// SIGINT and SIGTERM remove the temporary files and folders; an earlier output stays whole.
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, os.Interrupt, syscall.SIGTERM)
	go func() { os.Exit(interrupted(temps, <-sig, os.Stderr)) }()
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

const usage = `colsheet: traced design of reinforced-concrete columns to EN 1992-1-1

usage:
  colsheet design INPUT.yaml -o DIR [--formats md,tex,html] [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q]
  colsheet archive INPUT.yaml -o BUNDLE [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q] [--sign KEYFILE]
  colsheet recheck BUNDLE [--key PUBFILE]
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
of the PDF) and opens the calc document with the revision table. DIR/.colsheet-output
marks the entries colsheet wrote; an earlier output is replaced only with
--replace, never half, and only the entries it lists, unchanged since: a
file colsheet did not write is never deleted or overwritten, and a symbolic
link as DIR is refused. Exit status: 0 every design passes, 1 some design
fails (everything is still written), 2 bad input or usage, 3 pdflatex failed
(without pdflatex, --pdf only says so), 4 internal error (please report).
On a terminal, a run over a second shows its progress on one line of
stderr (the files written of their total); -q turns it off. The output
folder is checked before the design, so a refusal comes before the work.

archive writes the same files plus BUNDLE/input/ (the input file) and
BUNDLE/manifest.json (size and SHA-256 of every file and of the program);
--sign KEYFILE signs the manifest with an Ed25519 key (manifest.sig). recheck
verifies a bundle against its manifest (and with --key PUBFILE its
signature), re-evaluates every traced step, ties every value of results.json
and of the sheets to its step, designs the archived input again and names the
program that made the bundle (exit 0 all reproduce, 1 something does not, 2
unreadable bundle or usage). compare prints the changed inputs and results of
two bundles as a Markdown table.
`

// run runs the command of args and returns its exit status; a panic is an internal error (4).
func run(args []string, stdout, stderr io.Writer) (code int) {
	defer func() {
		if p := recover(); p != nil {
			temps.removeAll(false)
			fmt.Fprintf(stderr, "colsheet: internal error, please report: %v\n(temporary files removed; an earlier output is left as it was)\n%s", p, debug.Stack())
			code = 4
		}
	}()
	return command(args, stdout, stderr)
}

// command dispatches args to their command.
func command(args []string, stdout, stderr io.Writer) int {
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
