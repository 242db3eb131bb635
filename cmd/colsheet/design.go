package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"runtime/debug"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/calc/model"
	"colsheet/reports"
	"colsheet/reports/archive"
)

// options are the flags of the design command (and of archive, column and watch).
type options struct {
	command string // design or archive
	input   string
	out     string
	formats map[string]bool
	date    string
	replace bool // replace an earlier output folder
	pdf     bool // run pdflatex over the calc document
	detail  reports.Detail
	against string    // a previous package to mark the changes against
	only    selection // the designs to write, all when empty
	sign    string    // archive: the private key file to sign the manifest with
	extra   []string  // top-level entries of the output besides those of the design (the archive's)
	quiet   bool      // no progress line
}

// newOptions returns the defaults of the command cmd (design or archive).
func newOptions(cmd string) options {
	return options{command: cmd, formats: map[string]bool{"md": true, "tex": true, "html": true}, detail: reports.Brief}
}

// designFlags returns the flags of design and archive (o.command), setting o.
func designFlags(o *options) *flagSet {
	f := newFlagSet(o.command)
	outputFlags(f, o, "write the package into the folder `DIR` (required)", true)
	if o.command == "archive" {
		f.Var(fileFlag(&o.sign), "sign", "sign the manifest with the Ed25519 private key in `KEYFILE` (manifest.sig)")
	} else {
		f.Var(formatsFlag{&o.formats}, "formats", "the sheet `FORMATS`, a comma-separated list of md, tex and html; '' for results.json and the CSV files only")
		f.Var(onlyFlag{&o.only}, "only", "write only these `IDS`: columns (B2,C3) or lifts (B2/L1), comma-separated")
	}
	f.StringVar(&o.against, "against", "", "mark every value that changed since the earlier output folder or archive `PREVIOUS`")
	f.BoolVar(&o.pdf, "pdf", false, "run pdflatex over the calc document: doc/calc.pdf")
	return f
}

// outputFlags adds to f the flags of every command that writes a package: -o with the usage
// out, --detail and --date; with replace also --replace and -q.
func outputFlags(f *flagSet, o *options, out string, replace bool) {
	f.StringVar(&o.out, "out", "", out)
	f.aka("out", "o")
	f.Var(detailFlag{&o.detail}, "detail", "how much of the trace the sheets print, `brief|full` (results.json holds it all)")
	f.Var(dateFlag(&o.date), "date", "the date `YYYY-MM-DD` on the sheets, instead of the input's project.date")
	if replace {
		f.BoolVar(&o.replace, "replace", false, "replace an earlier output of colsheet in the folder")
		f.BoolVar(&o.quiet, "quiet", false, "no progress line on the terminal")
		f.aka("quiet", "q")
	}
}

// inputAndOut takes the input file from the arguments rest and checks that -o was given.
func (o *options) inputAndOut(rest []string) error {
	switch {
	case len(rest) == 0:
		return usagef("no input file given")
	case len(rest) > 1:
		return usagef("one input file only (got %s and %s)", rest[0], rest[1])
	case o.out == "":
		return usagef("no output folder given (-o DIR)")
	}
	o.input = rest[0]
	return nil
}

func runDesign(args []string, stdout, stderr io.Writer) int {
	o := newOptions("design")
	rest, code, done := parseCommand("design", designFlags(&o), args, stdout, stderr)
	if done {
		return code
	}
	if err := o.inputAndOut(rest); err != nil {
		return failUsage(stderr, "design", err)
	}
	in, data, err := loadInput(o.input, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	job, err := produce(o, in, data, stderr)
	if err != nil {
		return failRun(stderr, "design", err)
	}
	return deliver(o, job, nil, stdout, stderr)
}

// failRun prints the error of a run of the command cmd, a usage error as one line with the
// pointer to the usage, and returns 2.
func failRun(stderr io.Writer, cmd string, err error) int {
	var ue usageError
	if errors.As(err, &ue) {
		return failUsage(stderr, cmd, err)
	}
	fmt.Fprintln(stderr, err)
	return 2
}

// loadInput reads the input file name and the actions table it names, and prints the input's
// warnings; the error lists the input's faults, or says why the file cannot be read.
func loadInput(name string, stderr io.Writer) (*model.Input, []byte, error) {
	data, err := readFileAs("the input file", name)
	if err != nil {
		return nil, nil, fmt.Errorf("colsheet: %v", err)
	}
	in, warns, err := input.ParseWarn(name, data, func(table string) ([]byte, error) {
		return os.ReadFile(filepath.Join(filepath.Dir(name), filepath.FromSlash(table)))
	})
	printWarnings(stderr, warns, nil)
	return in, data, err
}

// printWarnings prints the input's warnings, each as "colsheet: warning: ..." (with its text
// from say when given).
func printWarnings(stderr io.Writer, warns []input.Warning, say func(input.Warning) string) {
	for _, w := range warns {
		text := w.String()
		if say != nil {
			text = say(w)
		}
		fmt.Fprintf(stderr, "colsheet: warning: %s\n", text)
	}
}

// inputLifts lists the column and lift of every lift of the actions form of in; nil for the
// building form, whose lifts the take-down finds.
func inputLifts(in *model.Input) [][2]string {
	var out [][2]string
	for _, c := range in.Columns {
		for _, st := range c.Storeys {
			out = append(out, [2]string{c.ID, st.Name})
		}
	}
	return out
}

// checkOnly refuses, before the design, the ids of --only that name no lift of the actions form
// of in; those of the building form are checked once the take-down has found its lifts.
func checkOnly(in *model.Input, only selection) error {
	if len(only) == 0 || in.Building != nil {
		return nil
	}
	return only.check(inputLifts(in))
}

// deliver makes the PDF when asked, adds the marker, lets seal add the archive's manifest,
// puts the output folder in place and reports; it returns the exit status.
func deliver(o options, j *job, seal func(st *stage) error, stdout, stderr io.Writer) int {
	defer j.st.discard()
	defer j.progress.end()
	pdfErr := error(nil)
	if o.pdf {
		j.progress.phase("running pdflatex over doc/calc.tex", 0)
		pdfErr = makePDF(j.st, j.res.Input.Project.Date)
	}
	// The marker names the run and lists every file, the manifest that seal adds without its SHA-256.
	var later []string
	if seal != nil {
		later = []string{archive.ManifestName}
	}
	mark, err := newMarker(marker{Program: j.res.ToolName, Version: j.res.ToolVersion, Command: o.command,
		Date: j.res.Input.Project.Date, Input: filepath.Base(o.input), InputSHA256: archive.Sum(j.input)}, j.st, later...)
	if err == nil {
		err = j.st.put(markerName, mark)
	}
	if err != nil {
		fmt.Fprintf(stderr, "colsheet: %s: %v; nothing written\n", markerName, plainErr(err))
		return 2
	}
	if seal != nil {
		if err := seal(j.st); err != nil {
			fmt.Fprintf(stderr, "colsheet: %v; nothing written\n", err)
			return 2
		}
	}
	j.progress.end()
	if err := publish(o.out, j.st, o.replace, stderr); err != nil {
		fmt.Fprintf(stderr, "colsheet: %v\n", outputProblem(o.out, err))
		return 2
	}
	code := j.report(o.out, stdout, stderr)
	switch {
	case errors.Is(pdfErr, errNoTeX):
		// Not installed: the LaTeX is written and the run stands; the message says how to get the PDF.
		fmt.Fprintf(stderr, "colsheet: no PDF: %v\n", pdfErr)
	case pdfErr != nil:
		fmt.Fprintf(stderr, "colsheet: no PDF: %v\n", pdfErr)
		return 3
	}
	return code
}

// job is one run of the design: the result and the output written so far, in a stage.
type job struct {
	input    []byte // the input file as read
	res      *design.Result
	st       *stage
	progress *progress // the progress line, nil when not shown
}

// outputTops lists the top-level entries of the output of o besides the marker, those of extra
// (the archive's) among them.
func outputTops(o options) []string {
	tops := []string{"results.json", "summary.csv", "schedule.csv", "quantities.csv", "doc"}
	for _, f := range []string{"md", "tex", "html"} {
		if o.formats[f] {
			tops = append(tops, f)
		}
	}
	return append(tops, o.extra...)
}

// produce reads and designs the input of o and writes every output file into a stage; nothing
// is put in place. It checks the output folder first, as publish will, so that a refusal comes
// before the work.
func produce(o options, in *model.Input, data []byte, stderr io.Writer) (j *job, err error) {
	if err := checkOnly(in, o.only); err != nil {
		return nil, err
	}
	sheets := o.formats["md"] || o.formats["tex"] || o.formats["html"]
	streamed := sheets && o.against == "" && len(o.only) == 0
	heapLimit(in, sheets && !streamed)
	prog := newProgress(stderr, o.quiet)
	defer func() {
		if err != nil {
			prog.end()
		}
	}()
	where, err := checkOut(o.out, o.replace, outputTops(o), stderr)
	if err != nil {
		return nil, fmt.Errorf("colsheet: %v", outputProblem(o.out, err))
	}
	if o.date != "" {
		in.Project.Date = o.date
	}
	if in.Project.Date == "" {
		// No clock in the output: reruns stay byte-identical.
		fmt.Fprintln(stderr, "colsheet: no date given (project.date or --date): the sheets say \"undated\"")
		in.Project.Date = "undated"
	}
	if err := os.MkdirAll(where, 0o755); err != nil {
		return nil, fmt.Errorf("colsheet: the output folder %s cannot be made: %v", where, plainErr(err))
	}
	name := filepath.Base(o.out)
	if abs, err := filepath.Abs(o.out); err == nil && abs == where {
		name = "colsheet-output" // staged inside the output folder, beside other files
	}
	st, err := newStage(where, name)
	if err != nil {
		return nil, fmt.Errorf("colsheet: no temporary folder for the output in %s: %v", where, plainErr(err))
	}
	defer func() {
		if err != nil {
			st.discard()
		}
	}()
	// The designs, each written into results.json as soon as it and those before it are done,
	// and its sheets printed once its column is done; each design lets go of its trace once
	// written. With --against (the revision marks need the whole of results.json) or --only,
	// the sheets are printed after the designs, which then keep their traces.
	opt := reports.Options{Detail: o.detail}
	var sheetStream *reports.SheetStream
	prog.phase("designing", lifts(in))
	var res *design.Result
	var runErr, onlyErr, printErr error
	err = st.create("results.json", func(w io.Writer) error {
		js, err := reports.NewJSONStream(w, "colsheet", version(), in)
		if err != nil {
			return err
		}
		// Each design's text for results.json is made on the worker that designed it, and
		// written in order (the forms of its steps depend on the designs before it).
		var texts []*reports.EncodedDesign
		start := func(r *design.Result) error {
			texts = make([]*reports.EncodedDesign, len(r.Designs))
			// The build's own version, in results.json, the manifest and every title block.
			r.ToolVersion = version()
			if !streamed {
				return nil
			}
			sheetStream, printErr = reports.NewSheetStream(r, o.formats, opt, runtime.GOMAXPROCS(0), st.put)
			return printErr
		}
		// With --only, the designs of the others are made (the take-down and the typical bars
		// need the whole building) but neither written nor kept.
		ready := func(k int, d *design.Design) {
			if o.only.has(d) {
				texts[k] = reports.EncodeDesign(d)
			}
		}
		res, runErr = design.StreamWith(in, sheets && !streamed, design.Hooks{Start: start, Ready: ready, Emit: func(k int, d *design.Design) error {
			prog.step()
			if !o.only.has(d) {
				return nil
			}
			text := texts[k]
			texts[k] = nil
			if err := js.Write(text); err != nil {
				return err
			}
			if sheetStream != nil {
				printErr = sheetStream.Design(k, d)
			}
			return printErr
		}})
		if printErr != nil {
			return printErr
		}
		if runErr != nil {
			return runErr
		}
		if onlyErr = o.only.apply(res); onlyErr != nil {
			return onlyErr
		}
		return js.End(res)
	})
	switch {
	case printErr != nil:
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", printErr)
	case runErr != nil:
		return nil, runErr // a fault of the building, named by the engine
	case onlyErr != nil:
		return nil, onlyErr
	case err != nil:
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
	}
	if o.against != "" {
		// The revision marks: every value compared with the previous package's.
		js, err := st.read("results.json")
		if err != nil {
			return nil, fmt.Errorf("colsheet: results.json written a moment ago cannot be read back: %v", plainErr(err))
		}
		changes, old, err := archive.Against(o.against, js, filepath.Base(o.input), in.SHA256)
		if err != nil {
			return nil, fmt.Errorf("colsheet: --against %s: %v", o.against, err)
		}
		opt.Revision = changes.Revision(o.against, old)
	}
	// The other files: three CSV, and per format the index, a sheet per design and the calc
	// document.
	if sheetStream != nil {
		// The sheets are written: the CSV files, then the index and the calc documents.
		prog.phase("writing files", 3+2*len(o.formats))
	} else {
		prog.phase("writing files", 3+len(o.formats)*(len(res.Designs)+2))
	}
	st.written = prog.step
	if err := render(st, res, sheetStream, o.formats, opt, runtime.GOMAXPROCS(0)); err != nil {
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
	}
	st.written = nil
	return &job{input: data, res: res, st: st, progress: prog}, nil
}

// heapLimit sets the Go runtime's soft limit of memory (runtime/debug.SetMemoryLimit) for the
// run of in, unless the environment's GOMEMLIMIT sets one: 768 MiB, or 192 KiB per lift for
// inputs of more than 4,096 lifts (1 MiB per lift where every trace is held until the sheets
// are printed: --against, --only). Below the limit the collector runs as GOGC says; near it,
// sooner, so that a run holding a few hundred megabytes does not take twice that (the 40-storey
// building of 4,000 lifts holds some 480 MB at most when streamed; see BenchmarkOutput). Where
// the limit is the 768 MiB floor, and GOGC is not set, the collector waits for the heap to
// triple rather than double (GOGC 200): fewer collections for runs that hold little, the limit
// bounding the heap of those that hold more.
func heapLimit(in *model.Input, traces bool) {
	if os.Getenv("GOMEMLIMIT") != "" {
		return
	}
	n := lifts(in)
	if b := in.Building; b != nil {
		n = len(b.Storeys) * (len(b.GridX) + 1) * (len(b.GridY) + 1)
	}
	per := int64(192 << 10)
	if traces {
		per = 1 << 20
	}
	limit := max(768<<20, int64(n)*per)
	debug.SetMemoryLimit(limit)
	if limit == 768<<20 && os.Getenv("GOGC") == "" {
		debug.SetGCPercent(200)
	}
}

// lifts returns the number of lifts of the actions form of in, 0 for the building form (whose
// lifts the take-down finds).
func lifts(in *model.Input) int {
	n := 0
	for _, c := range in.Columns {
		n += len(c.Storeys)
	}
	return n
}

// report prints the count of passing and failing designs and returns the exit status.
func (j *job) report(out string, stdout, stderr io.Writer) int {
	return tally(j.res, "written to "+out, stdout, stderr)
}

// tally prints the count of passing and failing designs of res and then where, names each
// failure with its reasons on stderr and returns the exit status (0 all pass, 1 some fail).
func tally(res *design.Result, where string, stdout, stderr io.Writer) int {
	failed := res.Failed()
	fmt.Fprintf(stdout, "colsheet: %d designs, %d pass, %d fail; %s\n", len(res.Designs), len(res.Designs)-failed, failed, where)
	for _, d := range res.Designs {
		if d.Status != design.StatusPass {
			fmt.Fprintf(stderr, "FAIL %s/%s: %s\n", d.Column, d.Storey, strings.Join(d.Reasons, "; "))
		}
	}
	if failed > 0 {
		return 1
	}
	return 0
}

// render writes the CSV files into the stage st, then the sheets (printed by up to workers
// goroutines) and the calc document of each format, each file as soon as it is made; with ss,
// whose sheets are written, the index and the calc documents that ss ends with.
func render(st *stage, res *design.Result, ss *reports.SheetStream, formats map[string]bool, opt reports.Options, workers int) error {
	for _, c := range []struct {
		name string
		make func(*design.Result) ([]byte, error)
	}{{"summary.csv", reports.CSV}, {"schedule.csv", reports.Schedule}, {"quantities.csv", reports.QuantitiesCSV}} {
		data, err := c.make(res)
		if err != nil {
			return err
		}
		if err := st.put(c.name, data); err != nil {
			return err
		}
	}
	if ss != nil {
		return ss.End()
	}
	// The sheets and the calc document: each tree built once, printed in every format.
	return reports.RenderTo(res, formats, opt, workers, st.put)
}
