package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"time"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/reports"
	"colsheet/reports/archive"
)

func version() string { return design.Version }

// options are the flags of the design command.
type options struct {
	input   string
	out     string
	formats map[string]bool
	date    string
	replace bool // replace an earlier output folder
	pdf     bool // run pdflatex over the calc document
	detail  reports.Detail
	against string // a previous package to mark the changes against
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
	job, err := produce(o, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	return deliver(o, job, nil, stdout, stderr)
}

// deliver makes the PDF when asked, lets seal add its files (the archive's input copy and
// manifest), writes the output folder whole and reports; it returns the exit status.
func deliver(o options, j *job, seal func(files map[string][]byte) error, stdout, stderr io.Writer) int {
	pdfErr := error(nil)
	if o.pdf {
		pdfErr = makePDF(j.files, j.res.Input.Project.Date)
	}
	if seal != nil {
		if err := seal(j.files); err != nil {
			fmt.Fprintf(stderr, "colsheet: %v; nothing written\n", err)
			return 2
		}
	}
	if err := publish(o.out, j.files, o.replace); err != nil {
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

// job is one run of the design: the result and every output file, in memory.
type job struct {
	input []byte // the input file as read
	res   *design.Result
	files map[string][]byte // output files keyed by their slash-separated path below the output folder
}

// produce reads and designs the input of o and renders every output file in memory; nothing is written.
func produce(o options, stderr io.Writer) (*job, error) {
	data, err := os.ReadFile(o.input)
	if err != nil {
		return nil, fmt.Errorf("colsheet: %v", err)
	}
	in, err := input.Parse(o.input, data)
	if err != nil {
		return nil, err
	}
	if o.date != "" {
		in.Project.Date = o.date
	}
	if in.Project.Date == "" {
		// No clock in the output: reruns stay byte-identical.
		fmt.Fprintln(stderr, "colsheet: no date given (project.date or --date): the sheets say \"undated\"")
		in.Project.Date = "undated"
	}
	res, err := design.Run(in)
	if err != nil {
		return nil, err
	}
	design.AddInteraction(res)
	opt := reports.Options{Detail: o.detail}
	if o.against != "" {
		// The revision marks: every value compared with the previous package's.
		js, err := reports.JSON(res)
		if err != nil {
			return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
		}
		changes, old, err := archive.Against(o.against, js, filepath.Base(o.input), in.SHA256)
		if err != nil {
			return nil, fmt.Errorf("colsheet: --against %s: %v", o.against, err)
		}
		opt.Revision = changes.Revision(o.against, old)
	}
	files, err := render(res, o.formats, opt)
	if err != nil {
		return nil, fmt.Errorf("colsheet: rendering failed, nothing written: %v", err)
	}
	return &job{input: data, res: res, files: files}, nil
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

// render builds every output file in memory, keyed by its path below the output folder.
func render(res *design.Result, formats map[string]bool, opt reports.Options) (map[string][]byte, error) {
	files := map[string][]byte{}
	js, err := reports.JSON(res)
	if err != nil {
		return nil, err
	}
	files["results.json"] = js
	csv, err := reports.CSV(res)
	if err != nil {
		return nil, err
	}
	files["summary.csv"] = csv
	schedule, err := reports.Schedule(res)
	if err != nil {
		return nil, err
	}
	files["schedule.csv"] = schedule
	quantities, err := reports.QuantitiesCSV(res)
	if err != nil {
		return nil, err
	}
	files["quantities.csv"] = quantities
	// The sheets and the calc document: each tree built once, printed in every format.
	sheets, docs, err := reports.Render(res, formats, opt)
	if err != nil {
		return nil, err
	}
	for name, set := range sheets {
		for _, s := range set {
			files[name+"/"+s.Name] = s.Data
		}
	}
	for _, doc := range docs {
		files["doc/"+doc.Name] = doc.Data
	}
	return files, nil
}

// publish writes files as the folder dir. The files go to a new temporary folder beside dir,
// which is then renamed into place, so that an interrupted run leaves any previous dir whole.
// An existing dir is replaced only when replace is set and it holds an earlier colsheet output.
func publish(dir string, files map[string][]byte, replace bool) error {
	dir = filepath.Clean(dir)
	old, err := os.Stat(dir)
	exists := err == nil
	switch {
	case err != nil && !os.IsNotExist(err):
		return err
	case exists && !old.IsDir():
		return fmt.Errorf("%s exists and is not a folder; nothing written", dir)
	case exists && !emptyDir(dir) && !ownOutput(dir):
		// A folder of other files (the input beside it, say): add ours, overwriting nothing.
		return beside(dir, files)
	case exists && !replace && !emptyDir(dir):
		return fmt.Errorf("%s holds an earlier output; nothing written (give --replace to replace it)", dir)
	}
	parent := filepath.Dir(dir)
	if err := os.MkdirAll(parent, 0o755); err != nil {
		return err
	}
	tmp, err := os.MkdirTemp(parent, "."+filepath.Base(dir)+".new-")
	if err != nil {
		return err
	}
	if err := writeTree(tmp, files); err != nil {
		os.RemoveAll(tmp)
		return err
	}
	if err := os.Chmod(tmp, 0o755); err != nil {
		os.RemoveAll(tmp)
		return err
	}
	if !exists {
		if err := os.Rename(tmp, dir); err != nil {
			os.RemoveAll(tmp)
			return err
		}
		return nil
	}
	// Move the old folder aside, the new one in, then drop the old one.
	aside, err := os.MkdirTemp(parent, "."+filepath.Base(dir)+".old-")
	if err != nil {
		os.RemoveAll(tmp)
		return err
	}
	os.Remove(aside)
	if err := os.Rename(dir, aside); err != nil {
		os.RemoveAll(tmp)
		return err
	}
	if err := os.Rename(tmp, dir); err != nil {
		os.Rename(aside, dir) // put the previous output back
		os.RemoveAll(tmp)
		return err
	}
	return os.RemoveAll(aside)
}

// beside writes the output files into dir, a folder of other files, each to a temporary file
// renamed into place; it refuses, writing nothing, when any of the output's entries is there already.
func beside(dir string, files map[string][]byte) error {
	tops := map[string]bool{}
	for name := range files {
		top, _, _ := strings.Cut(name, "/")
		tops[top] = true
	}
	for top := range tops {
		if _, err := os.Lstat(filepath.Join(dir, top)); err == nil {
			return fmt.Errorf("%s already holds %s (but no earlier results.json); nothing written", dir, top)
		}
	}
	return writeTree(dir, files)
}

// writeTree writes every file below dir, which must exist, each through writeAtomic.
func writeTree(dir string, files map[string][]byte) error {
	names := make([]string, 0, len(files))
	for name := range files {
		names = append(names, name)
	}
	sort.Strings(names)
	for _, name := range names {
		path := filepath.Join(dir, filepath.FromSlash(name))
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			return err
		}
		if err := writeAtomic(path, files[name]); err != nil {
			return err
		}
	}
	return nil
}

// writeAtomic writes data as the file name through a temporary file beside it renamed into
// place, so that name is never seen half-written.
func writeAtomic(name string, data []byte) error {
	tmp, err := os.CreateTemp(filepath.Dir(name), "."+filepath.Base(name)+".new-")
	if err != nil {
		return err
	}
	_, err = tmp.Write(data)
	if e := tmp.Close(); err == nil {
		err = e
	}
	if err == nil {
		err = os.Chmod(tmp.Name(), 0o644)
	}
	if err == nil {
		err = os.Rename(tmp.Name(), name)
	}
	if err != nil {
		os.Remove(tmp.Name())
	}
	return err
}

// emptyDir reports whether dir holds no entries.
func emptyDir(dir string) bool {
	es, err := os.ReadDir(dir)
	return err == nil && len(es) == 0
}

// ownOutput reports whether dir looks like an earlier output of colsheet.
func ownOutput(dir string) bool {
	for _, f := range []string{"results.json", "manifest.json"} {
		if st, err := os.Stat(filepath.Join(dir, f)); err == nil && st.Mode().IsRegular() {
			return true
		}
	}
	return false
}
