package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"time"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/calc/model"
	"colsheet/reports"
	"colsheet/reports/archive"
)

// options are the flags of the design command.
type options struct {
	command string // design or archive
	input   string
	out     string
	formats map[string]bool
	date    string
	replace bool // replace an earlier output folder
	pdf     bool // run pdflatex over the calc document
	detail  reports.Detail
	against string   // a previous package to mark the changes against
	extra   []string // top-level entries of the output besides those of the design (the archive's)
	quiet   bool     // no progress line
}

func parseDesignArgs(args []string) (options, error) {
	o := options{formats: map[string]bool{"md": true, "tex": true, "html": true}}
	for i := 0; i < len(args); i++ {
		a := args[i]
		val := func() (string, error) {
			if k := strings.IndexByte(a, '='); k >= 0 {
				return a[k+1:], nil
			}
			if i+1 >= len(args) {
				return "", fmt.Errorf("%s needs a value", a)
			}
			i++
			return args[i], nil
		}
		name := a
		if k := strings.IndexByte(a, '='); k >= 0 {
			name = a[:k]
		}
		switch name {
		case "-o", "--out":
			v, err := val()
			if err != nil {
				return o, err
			}
			o.out = v
		case "--formats":
			v, err := val()
			if err != nil {
				return o, err
			}
			o.formats = map[string]bool{}
			for _, f := range strings.Split(v, ",") {
				f = strings.TrimSpace(f)
				switch f {
				case "md", "tex", "html":
					o.formats[f] = true
				case "":
				default:
					return o, fmt.Errorf("--formats: unknown format %q (md, tex, html)", f)
				}
			}
		case "--detail":
			v, err := val()
			if err != nil {
				return o, err
			}
			switch reports.Detail(v) {
			case reports.Brief, reports.Full:
				o.detail = reports.Detail(v)
			default:
				return o, fmt.Errorf("--detail: %q is neither brief nor full", v)
			}
		case "--against":
			v, err := val()
			if err != nil {
				return o, err
			}
			o.against = v
		case "--replace":
			o.replace = true
		case "-q", "--quiet":
			o.quiet = true
		case "--pdf":
			o.pdf = true
		case "--date":
			v, err := val()
			if err != nil {
				return o, err
			}
			if _, err := time.Parse("2006-01-02", v); err != nil {
				return o, fmt.Errorf("--date: %q is not a date of the form 2026-12-01", v)
			}
			o.date = v
		default:
			if strings.HasPrefix(a, "-") {
				return o, fmt.Errorf("unknown option %s", a)
			}
			if o.input != "" {
				return o, fmt.Errorf("one input file only (got %s and %s)", o.input, a)
			}
			o.input = a
		}
	}
	if o.input == "" {
		return o, fmt.Errorf("no input file given")
	}
	if o.out == "" {
		return o, fmt.Errorf("no output folder given (-o DIR)")
	}
	return o, nil
}

func runDesign(args []string, stdout, stderr io.Writer) int {
	o, err := parseDesignArgs(args)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet design: %v\n\n%s", err, usage)
		return 2
	}
	o.command = "design"
	job, err := produce(o, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	return deliver(o, job, nil, stdout, stderr)
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
		fmt.Fprintf(stderr, "colsheet: %s: %v; nothing written\n", markerName, err)
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
		fmt.Fprintf(stderr, "colsheet: %v\n", err)
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
func produce(o options, stderr io.Writer) (j *job, err error) {
	prog := newProgress(stderr, o.quiet)
	defer func() {
		if err != nil {
			prog.end()
		}
	}()
	data, err := os.ReadFile(o.input)
	if err != nil {
		return nil, fmt.Errorf("colsheet: %v", err)
	}
	in, warns, err := input.ParseWarn(o.input, data, func(name string) ([]byte, error) {
		return os.ReadFile(filepath.Join(filepath.Dir(o.input), filepath.FromSlash(name)))
	})
	for _, w := range warns {
		fmt.Fprintf(stderr, "colsheet: warning: %s\n", w)
	}
	if err != nil {
		return nil, err
	}
	where, err := checkOut(o.out, o.replace, outputTops(o), stderr)
	if err != nil {
		return nil, fmt.Errorf("colsheet: %v", err)
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
		return nil, fmt.Errorf("colsheet: %v", err)
	}
	name := filepath.Base(o.out)
	if abs, err := filepath.Abs(o.out); err == nil && abs == where {
		name = "colsheet-output" // staged inside the output folder, beside other files
	}
	st, err := newStage(where, name)
	if err != nil {
		return nil, fmt.Errorf("colsheet: %v", err)
	}
	defer func() {
		if err != nil {
			st.discard()
		}
	}()
	// The designs, each written into results.json as soon as it and those before it are done;
	// without sheets a design lets go of its trace once written.
	sheets := o.formats["md"] || o.formats["tex"] || o.formats["html"]
	prog.phase("designing", lifts(in))
	var res *design.Result
	var runErr error
	err = st.create("results.json", func(w io.Writer) error {
		js, err := reports.NewJSONStream(w, "colsheet", version(), in)
		if err != nil {
			return err
		}
		res, runErr = design.Stream(in, sheets, func(_ int, d *design.Design) error {
			prog.step()
			return js.Design(d)
		})
		if runErr != nil {
			return runErr
		}
		// The build's own version, in results.json, the manifest and every title block.
		res.ToolVersion = version()
		return js.End(res)
	})
	switch {
	case runErr != nil:
		return nil, runErr // a fault of the building, named by the engine
	case err != nil:
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
	}
	opt := reports.Options{Detail: o.detail}
	if o.against != "" {
		// The revision marks: every value compared with the previous package's.
		js, err := os.ReadFile(filepath.Join(st.dir, "results.json"))
		if err != nil {
			return nil, fmt.Errorf("colsheet: %v", err)
		}
		changes, old, err := archive.Against(o.against, js, filepath.Base(o.input), in.SHA256)
		if err != nil {
			return nil, fmt.Errorf("colsheet: --against %s: %v", o.against, err)
		}
		opt.Revision = changes.Revision(o.against, old)
	}
	// The other files: three CSV, and per format the index, a sheet per design and the calc
	// document.
	prog.phase("writing files", 3+len(o.formats)*(len(res.Designs)+2))
	st.written = prog.step
	if err := render(st, res, o.formats, opt, runtime.GOMAXPROCS(0)); err != nil {
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
	}
	st.written = nil
	return &job{input: data, res: res, st: st, progress: prog}, nil
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
	res := j.res
	failed := res.Failed()
	fmt.Fprintf(stdout, "colsheet: %d designs, %d pass, %d fail; written to %s\n", len(res.Designs), len(res.Designs)-failed, failed, out)
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
// goroutines) and the calc document of each format, each file as soon as it is made.
func render(st *stage, res *design.Result, formats map[string]bool, opt reports.Options, workers int) error {
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
	// The sheets and the calc document: each tree built once, printed in every format.
	return reports.RenderTo(res, formats, opt, workers, st.put)
}
