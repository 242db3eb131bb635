package main

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"time"
)

// errNoTeX says that pdflatex is not installed.
var errNoTeX = errors.New("pdflatex not found on PATH: the calc document is written as doc/calc.tex only; install TeX Live (Debian: texlive-latex-base texlive-latex-recommended texlive-pictures) to get doc/calc.pdf")

// makePDF runs pdflatex over doc/calc.tex of the stage st in a temporary folder and adds
// doc/calc.pdf. The PDF's dates come from the project date (SOURCE_DATE_EPOCH), so that reruns match.
func makePDF(st *stage, date string) error {
	if !st.has("doc/calc.tex") {
		return errors.New("--pdf needs the LaTeX format (--formats with tex)")
	}
	src, err := st.read("doc/calc.tex")
	if err != nil {
		return err
	}
	bin, err := exec.LookPath("pdflatex")
	if err != nil {
		return errNoTeX
	}
	dir, err := temps.mkdirTemp("", "colsheet-pdf-")
	if err != nil {
		return err
	}
	defer temps.discard(dir)
	if err := os.WriteFile(filepath.Join(dir, "calc.tex"), src, 0o644); err != nil {
		return err
	}
	epoch := int64(0)
	if t, err := time.Parse("2006-01-02", date); err == nil {
		epoch = t.Unix()
	}
	ctx, cancel := context.WithTimeout(context.Background(), 30*time.Minute)
	defer cancel()
	// Three runs: the contents, then the page references, then settled.
	for run := 0; run < 3; run++ {
		cmd := exec.CommandContext(ctx, bin, "-interaction=nonstopmode", "-halt-on-error", "-no-shell-escape", "calc.tex")
		cmd.Dir = dir
		cmd.Env = append(os.Environ(), "SOURCE_DATE_EPOCH="+strconv.FormatInt(epoch, 10), "FORCE_SOURCE_DATE=1")
		var out bytes.Buffer
		cmd.Stdout, cmd.Stderr = &out, &out
		if err := cmd.Run(); err != nil {
			log, _ := os.ReadFile(filepath.Join(dir, "calc.log"))
			return fmt.Errorf("pdflatex failed on doc/calc.tex (%v); the end of its log:\n%s", err, tail(log, 25))
		}
	}
	pdf, err := os.ReadFile(filepath.Join(dir, "calc.pdf"))
	if err != nil {
		return fmt.Errorf("pdflatex wrote no PDF: %v", err)
	}
	return st.put("doc/calc.pdf", pdf)
}

// tail returns the last n lines of b.
func tail(b []byte, n int) string {
	lines := bytes.Split(bytes.TrimRight(b, "\n"), []byte("\n"))
	if len(lines) > n {
		lines = lines[len(lines)-n:]
	}
	return string(bytes.Join(lines, []byte("\n")))
}
