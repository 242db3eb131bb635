package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/reports"
)

// BenchmarkDemoPackage renders the shipped demo building's package in every format and reports
// its size: the targets are a results.json of at most 15 MB and at most 25 MB of other output
// (the calc document's page count, at most 250, is measured with pdflatex in the closing notes).
func BenchmarkDemoPackage(b *testing.B) {
	name := filepath.Join("..", "..", "testdata", "demo.yaml")
	data, err := os.ReadFile(name)
	if err != nil {
		b.Fatal(err)
	}
	in, err := input.Parse(name, data)
	if err != nil {
		b.Fatal(err)
	}
	in.Project.Date = "2026-12-01"
	res, err := design.Run(in)
	if err != nil {
		b.Fatal(err)
	}
	design.AddInteraction(res)
	formats := map[string]bool{"md": true, "tex": true, "html": true}
	b.ResetTimer()
	var results, other, doc int
	for i := 0; i < b.N; i++ {
		files, err := render(res, formats, reports.Options{})
		if err != nil {
			b.Fatal(err)
		}
		results, other, doc = 0, 0, 0
		for path, f := range files {
			switch {
			case path == "results.json":
				results = len(f)
			default:
				other += len(f)
			}
			if strings.HasPrefix(path, "doc/") {
				doc += len(f)
			}
		}
	}
	b.ReportMetric(float64(results)/1e6, "MB-results.json")
	b.ReportMetric(float64(other)/1e6, "MB-other")
	b.ReportMetric(float64(doc)/1e6, "MB-calc-document")
}
