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

// BenchmarkBuildingOutput runs the design command with every default output (results.json, the
// CSV files, the sheets and the calc document in Markdown, LaTeX and HTML) on generated
// buildings of 200 columns, and reports the lifts, the bytes written and the peak Go heap in use
// (sampled every 20 ms). 60 storeys run only with COLSHEET_BENCH_BIG=1 (minutes on two cores).
func BenchmarkBuildingOutput(b *testing.B) {
	sizes := []int{12}
	if os.Getenv("COLSHEET_BENCH_BIG") != "" {
		sizes = append(sizes, 60)
	}
	for _, storeys := range sizes {
		b.Run(fmt.Sprintf("%dx200", storeys), func(b *testing.B) {
			dir := b.TempDir()
			in := filepath.Join(dir, "in.yaml")
			if err := os.WriteFile(in, []byte(generatedInput(storeys, 19, 9)), 0o644); err != nil {
				b.Fatal(err)
			}
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
			for i := 0; i < b.N; i++ {
				out := filepath.Join(dir, fmt.Sprint("out", i))
				code, stdout, stderr := runCLI("design", in, "-o", out)
				if code > 1 || !strings.Contains(stdout, fmt.Sprintf("%d designs", 200*storeys)) {
					b.Fatalf("exit %d %s %.500s", code, stdout, stderr)
				}
				written = 0
				filepath.Walk(out, func(_ string, info os.FileInfo, err error) error {
					if err == nil && info.Mode().IsRegular() {
						written += info.Size()
					}
					return nil
				})
				os.RemoveAll(out)
			}
			close(stop)
			b.ReportMetric(float64(200*storeys), "lifts")
			b.ReportMetric(float64(written)/1e6, "MB-written")
			b.ReportMetric(float64(peak.Load())/(1<<20), "MiB-peak-heap")
		})
	}
}
