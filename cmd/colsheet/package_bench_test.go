package main

import (
	"fmt"
	"io"
	"path/filepath"
	"runtime"
	"strings"
	"testing"

	"colsheet/calc/design"
	"colsheet/reports"
)

// BenchmarkDemoPackage renders the shipped demo building's package in every format and reports
// its size: the targets are a results.json of at most 15 MB and at most 25 MB of other output
// (the calc document's page count, at most 250, is measured with pdflatex in the closing notes).
func BenchmarkDemoPackage(b *testing.B) {
	in := parseFile(b, filepath.Join("..", "..", "testdata", "demo.yaml"))
	in.Project.Date = "2026-12-01"
	res, err := design.Run(in)
	if err != nil {
		b.Fatal(err)
	}
	design.AddInteraction(res)
	formats := map[string]bool{"md": true, "tex": true, "html": true}
	for _, workers := range []int{1, runtime.GOMAXPROCS(0)} {
		b.Run(fmt.Sprintf("workers=%d", workers), func(b *testing.B) {
			b.ReportAllocs()
			var results, other, doc int64
			for i := 0; i < b.N; i++ {
				st, err := newStage(b.TempDir(), "out")
				if err != nil {
					b.Fatal(err)
				}
				if err := st.create("results.json", func(w io.Writer) error { return reports.WriteJSON(w, res) }); err != nil {
					b.Fatal(err)
				}
				if err := render(st, res, nil, formats, reports.Options{}, workers); err != nil {
					b.Fatal(err)
				}
				results, other, doc = 0, 0, 0
				for path, f := range st.files {
					switch {
					case path == "results.json":
						results = f.size
					default:
						other += f.size
					}
					if strings.HasPrefix(path, "doc/") {
						doc += f.size
					}
				}
				st.discard()
			}
			b.ReportMetric(float64(results)/1e6, "MB-results.json")
			b.ReportMetric(float64(other)/1e6, "MB-other")
			b.ReportMetric(float64(doc)/1e6, "MB-calc-document")
		})
	}
}
