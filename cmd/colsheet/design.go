package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"time"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/reports"
)

func version() string { return design.Version }

// options are the flags of the design command.
type options struct {
	input   string
	out     string
	formats map[string]bool
	date    string
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
	data, err := os.ReadFile(o.input)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet: %v\n", err)
		return 2
	}
	in, err := input.Parse(o.input, data)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	switch {
	case o.date != "":
		in.Project.Date = o.date
	case in.Project.Date == "":
		in.Project.Date = time.Now().Format("2006-01-02")
	}
	res, err := design.Run(in)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	design.AddInteraction(res)

	files, err := render(res, o.formats)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet: rendering failed, nothing written: %v\n", err)
		return 2
	}
	if err := writeAll(o.out, files); err != nil {
		fmt.Fprintf(stderr, "colsheet: %v\n", err)
		return 2
	}
	failed := res.Failed()
	fmt.Fprintf(stdout, "colsheet: %d designs, %d pass, %d fail; written to %s\n", len(res.Designs), len(res.Designs)-failed, failed, o.out)
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
func render(res *design.Result, formats map[string]bool) (map[string][]byte, error) {
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
	type maker func(*design.Result) ([]reports.Sheet, error)
	for _, f := range []struct {
		name string
		make maker
	}{{"md", reports.Markdown}, {"tex", reports.LaTeX}, {"html", reports.HTML}} {
		if !formats[f.name] {
			continue
		}
		sheets, err := f.make(res)
		if err != nil {
			return nil, fmt.Errorf("%s: %v", f.name, err)
		}
		for _, s := range sheets {
			files[filepath.Join(f.name, s.Name)] = s.Data
		}
	}
	return files, nil
}

// writeAll writes every file below dir, each to a temporary file renamed into place,
// so that an interrupted run never leaves a half-written file.
func writeAll(dir string, files map[string][]byte) error {
	for name, data := range files {
		path := filepath.Join(dir, name)
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			return err
		}
		tmp, err := os.CreateTemp(filepath.Dir(path), ".colsheet-*")
		if err != nil {
			return err
		}
		if _, err := tmp.Write(data); err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
			return err
		}
		if err := tmp.Close(); err != nil {
			os.Remove(tmp.Name())
			return err
		}
		if err := os.Chmod(tmp.Name(), 0o644); err != nil {
			os.Remove(tmp.Name())
			return err
		}
		if err := os.Rename(tmp.Name(), path); err != nil {
			os.Remove(tmp.Name())
			return err
		}
	}
	return nil
}
