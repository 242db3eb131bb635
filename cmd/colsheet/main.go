// Command colsheet designs and checks reinforced-concrete columns to EN 1992-1-1 and
// writes traced calculation sheets (Markdown, LaTeX, HTML), results.json and a CSV summary.
//
// Usage:
//
//	colsheet design INPUT.yaml -o DIR [--formats md,tex,html] [--detail brief|full] [--only IDS] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q]
//	colsheet check INPUT.yaml [--only B2,C3 | --only B2/L1]
//	colsheet column --b 350mm --h 500mm --cover 40mm --fck 32 --NEd 2150kN --My 85,-40 --Mz 10,10 --l0 3.1m [--bars 8x20] [-o DIR]
//	colsheet watch INPUT.yaml -o DIR [--addr 127.0.0.1:8080]
//	colsheet archive INPUT.yaml -o BUNDLE [--detail brief|full] [--against PREVIOUS] [--date YYYY-MM-DD] [--replace] [--pdf] [-q] [--sign KEYFILE]
//	colsheet recheck BUNDLE [--key PUBFILE]
//	colsheet compare OLD NEW [-o FILE.md]
//	colsheet version
//	colsheet help [COMMAND]
//
// Exit status: 0 every design passes (compare: identical; recheck: reproduces), 1 some design
// fails (compare: the packages differ; recheck: something does not reproduce), 2 bad input or
// usage, 3 an outside program failed (pdflatex), 4 internal error.
package main

import (
	"fmt"
	"io"
	"os"
	"os/signal"
	"runtime/debug"
	"sync"
	"syscall"
)

func main() {
	// SIGINT and SIGTERM remove the temporary files and folders; an earlier output stays whole.
	// While watch runs, the first signal stops it cleanly and a second one ends the process.
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, os.Interrupt, syscall.SIGTERM)
	go func() {
		for s := range sig {
			if !stopWatch() {
				os.Exit(interrupted(temps, s, os.Stderr))
			}
		}
	}()
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// stopper is what a signal calls instead of ending the process, while set (by watch).
var stopper struct {
	sync.Mutex
	stop func()
}

// setStopper makes f what the next signal calls; nil restores the default.
func setStopper(f func()) {
	stopper.Lock()
	defer stopper.Unlock()
	stopper.stop = f
}

// stopWatch calls the stopper, once, and reports whether there was one.
func stopWatch() bool {
	stopper.Lock()
	f := stopper.stop
	stopper.stop = nil
	stopper.Unlock()
	if f == nil {
		return false
	}
	f()
	return true
}

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
		fmt.Fprintln(stderr, "colsheet: no command given; run 'colsheet help' for the commands")
		return 2
	}
	switch args[0] {
	case "-h", "-help", "--help":
		return runHelp(args[1:], stdout, stderr)
	case "-version", "--version":
		return runVersion(args[1:], stdout, stderr)
	}
	c := commandNamed(args[0])
	if c == nil {
		fmt.Fprintf(stderr, "colsheet: unknown command %q; run 'colsheet help' for the commands\n", args[0])
		return 2
	}
	return c.run(args[1:], stdout, stderr)
}
