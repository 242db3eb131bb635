package main

import (
	"errors"
	"fmt"
	"io"
	"strings"
)

// commandSpec is one command of colsheet: how it is called, what it does and its flags.
type commandSpec struct {
	name  string
	args  string // what follows the name in the synopsis, e.g. "INPUT.yaml -o DIR [flags]"
	short string // one line for the list of commands
	long  string // the text of its usage after the synopsis
	exit  string // its exit status in one paragraph
	flags func() *flagSet
	run   func(args []string, stdout, stderr io.Writer) int
}

// commands are colsheet's commands in the order the help lists them.
var commands []*commandSpec

func init() {
	commands = []*commandSpec{
		{name: "design", args: "INPUT.yaml -o DIR [flags]", short: "design every column and lift of an input and write the calc package",
			long: designLong, exit: designExit, flags: func() *flagSet { o := newOptions("design"); return designFlags(&o) }, run: runDesign},
		{name: "check", args: "INPUT.yaml [--only IDS]", short: "design an input and print a table of the lifts; writes no file",
			long: checkLong, exit: checkExit, flags: func() *flagSet { var o checkOptions; return checkFlags(&o) }, run: runCheck},
		{name: "column", args: "--b B --h H --cover C --fck FCK --NEd N --l0 L0 [--My TOP,BOTTOM] [--Mz TOP,BOTTOM] [-o DIR] [flags]",
			short: "design one column given on the command line", long: columnLong, exit: checkExit + " With -o, as design.",
			flags: func() *flagSet { var c columnArgs; o := newOptions("design"); return columnFlags(&c, &o) }, run: runColumn},
		{name: "watch", args: "INPUT.yaml -o DIR [--addr 127.0.0.1:8080] [flags]", short: "design again whenever the input changes and serve the package's HTML",
			long: watchLong, exit: watchExit, flags: func() *flagSet { o := newOptions("design"); addr := ""; return watchFlags(&o, &addr) }, run: runWatch},
		{name: "archive", args: "INPUT.yaml -o BUNDLE [flags]", short: "write the package with the input and a manifest, for recheck",
			long: archiveLong, exit: designExit, flags: func() *flagSet { o := newOptions("archive"); return designFlags(&o) }, run: runArchive},
		{name: "recheck", args: "BUNDLE [--key PUBFILE]", short: "verify an archive and design its input again",
			long: recheckLong, exit: recheckExit, flags: func() *flagSet { key := ""; return recheckFlags(&key) }, run: runRecheck},
		{name: "compare", args: "OLD NEW [-o FILE.md]", short: "list the changed inputs and results of two packages",
			long: compareLong, exit: compareExit, flags: func() *flagSet { out := ""; return compareFlags(&out) }, run: runCompare},
		{name: "version", args: "", short: "print colsheet's version (also colsheet --version)",
			long: "Version prints the version of this build: the module version and VCS revision, with +dirty for a modified tree, or devel.\n",
			exit: "Exit status: 0.", run: runVersion},
		{name: "help", args: "[COMMAND]", short: "print this text, or a command's usage",
			long: "Help prints the list of commands and the exit status, or with COMMAND that command's usage, flags and exit status.\n",
			exit: "Exit status: 0; 2 for an unknown command.", run: runHelp},
	}
}

// commandNamed returns the command called name, nil when there is none.
func commandNamed(name string) *commandSpec {
	for _, c := range commands {
		if c.name == name {
			return c
		}
	}
	return nil
}

// exitTable is the exit status of every command, one table.
const exitTable = `exit status:
  0  every design passes; compare: the packages are identical; recheck: everything reproduces
  1  some design fails (design and archive still write everything); compare: the packages
     differ; recheck: something does not reproduce
  2  bad input or usage (nothing written)
  3  an outside program failed: pdflatex, with --pdf (everything else is written)
  4  internal error, a fault of colsheet: please report it (an earlier output is left as it was)
`

// writeOverview writes the list of commands and the exit status.
func writeOverview(w io.Writer) {
	fmt.Fprint(w, "colsheet: traced design of reinforced-concrete columns to EN 1992-1-1\n\nusage: colsheet COMMAND [arguments] [flags]\n\ncommands:\n")
	for _, c := range commands {
		fmt.Fprintf(w, "  %-8s  %s\n", c.name, c.short)
	}
	fmt.Fprint(w, "\nRun 'colsheet help COMMAND' or 'colsheet COMMAND -h' for a command's usage and flags.\nFlags may stand before or after the input; --name=value works too.\n\n")
	fmt.Fprint(w, exitTable)
}

// writeUsage writes the usage of the command c: the synopsis, what it does, its flags with their
// defaults and its exit status.
func writeUsage(w io.Writer, c *commandSpec) {
	fmt.Fprintf(w, "usage: colsheet %s %s\n\n%s", c.name, c.args, c.long)
	if c.flags != nil {
		fmt.Fprint(w, "\nflags:\n")
		c.flags().writeFlags(w)
	}
	fmt.Fprintf(w, "\n%s\n", c.exit)
}

// failUsage prints the fault err of the command line of cmd as one line, with where to read its
// usage, and returns 2.
func failUsage(stderr io.Writer, cmd string, err error) int {
	msg := strings.ReplaceAll(err.Error(), "\n", "; ")
	fmt.Fprintf(stderr, "colsheet %s: %s; run 'colsheet %s -h' for usage\n", cmd, msg, cmd)
	return 2
}

// parseCommand parses args by the flags f of the command cmd. On -h it prints the usage to
// stdout, on a fault one line to stderr; done then says to return code.
func parseCommand(cmd string, f *flagSet, args []string, stdout, stderr io.Writer) (rest []string, code int, done bool) {
	rest, err := f.parse(args)
	switch {
	case errors.Is(err, errHelp):
		writeUsage(stdout, commandNamed(cmd))
		return nil, 0, true
	case err != nil:
		return nil, failUsage(stderr, cmd, err), true
	}
	return rest, 0, false
}

// runHelp prints the overview, or the usage of the command named in args.
func runHelp(args []string, stdout, stderr io.Writer) int {
	args, code, done := parseCommand("help", newFlagSet("help"), args, stdout, stderr)
	if done {
		return code
	}
	switch {
	case len(args) == 0:
		writeOverview(stdout)
		return 0
	case len(args) > 1:
		return failUsage(stderr, "help", usagef("give one command at most"))
	}
	c := commandNamed(args[0])
	if c == nil {
		return failUsage(stderr, "help", usagef("unknown command %q", args[0]))
	}
	writeUsage(stdout, c)
	return 0
}

// runVersion prints the version of this build.
func runVersion(args []string, stdout, stderr io.Writer) int {
	rest, code, done := parseCommand("version", newFlagSet("version"), args, stdout, stderr)
	if done {
		return code
	}
	if len(rest) > 0 {
		return failUsage(stderr, "version", usagef("takes no arguments (got %s)", rest[0]))
	}
	fmt.Fprintln(stdout, "colsheet", version())
	return 0
}

const designLong = `Design reads INPUT.yaml (the building form or the actions form), designs or checks
every column and lift and writes DIR/results.json, DIR/summary.csv, DIR/schedule.csv,
DIR/quantities.csv (steel masses per column, level and building), the calc document
DIR/doc/calc.{md,tex,html} (calc.pdf with --pdf, which needs pdflatex) and the calc sheets
under DIR/md, DIR/tex and DIR/html.

Sheets are brief by default (the chain a checker follows; the calc document groups the lifts
and gives each group's governing lift in full); --detail full prints every step (in HTML with
the sub-steps folded); results.json always holds the whole trace. --only B2,C3/L1 writes the
package of those columns and lifts only (the take-down still covers the whole building).

DIR/.colsheet-output marks the entries colsheet wrote; an earlier output is replaced only with
--replace, never half, and only the entries it lists, unchanged since: a file colsheet did not
write is never deleted or overwritten, and a symbolic link as DIR is refused. The output folder
is checked before the design, so a refusal comes before the work. On a terminal, a run over a
second shows its progress on one line of stderr; -q turns it off.
`

const designExit = `Exit status: 0 every design passes, 1 some design fails (everything is still written),
2 bad input or usage (nothing written), 3 pdflatex failed (without pdflatex, --pdf only says
so), 4 internal error.`

const checkLong = `Check reads INPUT.yaml, designs it as design does and prints one row per lift: column,
lift, section, bars, NEd, MEd,y, MEd,z, the utilisation, PASS or FAIL and the governing check.
It writes no file. --only B2,C3 or --only B2/L1 prints those columns and lifts only (the
take-down still covers the whole building).
`

const checkExit = `Exit status: 0 every design passes, 1 some design fails, 2 bad input or usage, 4 internal error.`

const archiveLong = `Archive writes what design writes, in every format, plus BUNDLE/input/ (the input file and
its actions table) and BUNDLE/manifest.json (size and SHA-256 of every file and of the
program); --sign KEYFILE signs the manifest with an Ed25519 key (manifest.sig). Recheck
verifies such a bundle. An archive holds every design: --formats and --only are not taken.
`

const recheckLong = `Recheck verifies a bundle written by 'colsheet archive' against its manifest (and with --key
its signature), re-evaluates every traced step, ties every value of results.json and of the
sheets to its step, designs the archived input again and names the program that made the
bundle.
`

const recheckExit = `Exit status: 0 everything reproduces, 1 something does not, 2 not an archive, unreadable or
usage, 4 internal error.`

const compareLong = `Compare prints the changed inputs and results of two packages (output folders or archives,
the old one first) as a Markdown table, or writes it to a new file with -o.
`

const compareExit = `Exit status: 0 the packages are identical (no changed input or result), 1 they differ,
2 unreadable package or usage, 4 internal error.`
