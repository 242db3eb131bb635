package main

import (
	"fmt"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"sync/atomic"
	"testing"
	"time"
)

// generatedInput returns the input text of an invented building (test data only) of the given
// storeys on a grid of nx × ny bays of 6 m, so (nx+1)·(ny+1) columns, with the columns growing
// by 150 mm every ten storeys towards the base, as a designer would size them.
func generatedInput(storeys, nx, ny int) string {
	var b strings.Builder
	b.WriteString("project: {title: Generated building, date: 2026-12-01}\nmaterials: {concrete: C40/50, fyk: 500 MPa, aggregate: 20 mm}\nbuilding:\n  storeys:\n")
	var all []string
	for s := 0; s < storeys; s++ {
		all = append(all, fmt.Sprintf("L%d", s+1))
		fmt.Fprintf(&b, "    - {name: L%d, height: 3.3 m}\n", s+1)
	}
	bays := func(n int) string { return strings.TrimSuffix(strings.Repeat("6 m, ", n), ", ") }
	fmt.Fprintf(&b, "  grid: {x: [%s], y: [%s]}\n  columns: {b: 450 mm, h: 450 mm, cover: 40 mm}\n  column_sizes:\n", bays(nx), bays(ny))
	for s := 0; s < storeys; s++ {
		size := 450 + 150*((storeys-1-s)/10)
		fmt.Fprintf(&b, "    - {levels: [%s], b: %d mm, h: %d mm}\n", all[s], size, size)
	}
	fmt.Fprintf(&b, "  beams: {b: 300 mm, h: 600 mm}\n  floors:\n    - {levels: [%s], gk: 6 kN/m2, qk: 2.5 kN/m2, category: B, spans: two-way}\n  base: fixed\n", strings.Join(all, ", "))
	return b.String()
}

// generatedActions returns the input text of n invented lifts (test data only) in the actions
// form: columns of ten lifts of 400 × 400, NEd from 500 to 4400 kN, moments about both axes.
func generatedActions(n int) string {
	var b strings.Builder
	b.WriteString("project: {title: Generated columns, date: 2026-12-01}\nmaterials: {concrete: C32/40, fyk: 500 MPa, aggregate: 20 mm}\ncolumns:\n")
	for c := 0; c < (n+9)/10; c++ {
		fmt.Fprintf(&b, "  - {id: C%d, b: 400 mm, h: 400 mm, cover: 35 mm, storeys: [\n", c)
		for s := 0; s < 10 && c*10+s < n; s++ {
			if s > 0 {
				b.WriteString(",\n")
			}
			fmt.Fprintf(&b, "      {name: L%d, l0: {y: 3.0 m, z: 3.0 m}, NEd: %d kN, M: {y: {top: 60 kNm, bottom: -30 kNm}, z: {top: 25 kNm, bottom: -10 kNm}}}",
				s+1, 500+((c*10+s)%40)*100)
		}
		b.WriteString("]}\n")
	}
	return b.String()
}

// outputCase is one run of the design command measured by BenchmarkOutput.
type outputCase struct {
	name    string
	lifts   int
	input   func() string
	formats string // --formats; "" for results.json and the CSV files only
	big     bool   // only with COLSHEET_BENCH_BIG=1 (minutes)
}

// BenchmarkOutput runs the design command on generated inputs (test data only) and reports
// the lifts, the bytes written and the peak Go heap in use (sampled every 20 ms): a 12-storey
// building of 200 columns with every default output (results.json, the CSV files, the sheets
// and the calc document in Markdown, LaTeX and HTML); 40 storeys of 100 columns with
// results.json only and with every default output; 5,000 lifts of the actions form with
// results.json (50,000 and 60 storeys × 200 columns with COLSHEET_BENCH_BIG=1). Targets
// (issue 14): 40 × 100 with results.json ≤ 2 s, with every output ≤ 10 s and 1 GiB; 50,000
// lifts ≤ 10 s and < 1 GiB; 60 × 200 runs to the end.
func BenchmarkOutput(b *testing.B) {
	all := "md,tex,html"
	for _, c := range []outputCase{
		{"building-12x200-all", 2400, func() string { return generatedInput(12, 19, 9) }, all, false},
		{"building-40x100-json", 4000, func() string { return generatedInput(40, 9, 9) }, "", false},
		{"actions-5000-json", 5000, func() string { return generatedActions(5000) }, "", false},
		{"building-40x100-all", 4000, func() string { return generatedInput(40, 9, 9) }, all, true},
		{"actions-50000-json", 50000, func() string { return generatedActions(50000) }, "", true},
		{"building-60x200-all", 12000, func() string { return generatedInput(60, 19, 9) }, all, true},
	} {
		if c.big && os.Getenv("COLSHEET_BENCH_BIG") == "" {
			continue
		}
		b.Run(c.name, func(b *testing.B) {
			dir := b.TempDir()
			in := filepath.Join(dir, "in.yaml")
			if err := os.WriteFile(in, []byte(c.input()), 0o644); err != nil {
				b.Fatal(err)
			}
			runtime.GC()
			var peak atomic.Uint64
			stop := make(chan struct{})
			go func() {
				var m runtime.MemStats
				for {
					select {
					case <-stop:
						return
					case <-time.After(20 * time.Millisecond):
						runtime.ReadMemStats(&m)
						if m.HeapInuse > peak.Load() {
							peak.Store(m.HeapInuse)
						}
					}
				}
			}()
			var written int64
			b.ResetTimer()
			for i := 0; i < b.N; i++ {
				out := filepath.Join(dir, fmt.Sprint("out", i))
				code, stdout, stderr := runCLI("design", in, "-o", out, "-q", "--formats", c.formats)
				if code > 1 || !strings.Contains(stdout, fmt.Sprintf("%d designs", c.lifts)) {
					b.Fatalf("exit %d %s %.500s", code, stdout, stderr)
				}
				b.StopTimer()
				written = 0
				filepath.Walk(out, func(_ string, info os.FileInfo, err error) error {
					if err == nil && info.Mode().IsRegular() {
						written += info.Size()
					}
					return nil
				})
				os.RemoveAll(out)
				b.StartTimer()
			}
			close(stop)
			b.ReportMetric(float64(c.lifts), "lifts")
			b.ReportMetric(float64(written)/1e6, "MB-written")
			b.ReportMetric(float64(peak.Load())/(1<<20), "MiB-peak-heap")
		})
	}
}
