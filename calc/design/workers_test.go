package design_test

import (
	"bytes"
	"os"
	"runtime"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/input"
	"colsheet/reports"
)

// TestWorkersSameBytes designs the shipped inputs (the building form with the typical pass, and
// the actions form) on one worker and on several: results.json must be the same bytes, the
// designs in input order whatever order the workers finish in.
func TestWorkersSameBytes(t *testing.T) {
	if testing.Short() {
		t.Skip("designs the demo building three times")
	}
	for _, file := range []string{"../../testdata/demo.yaml", "../../testdata/columns.yaml"} {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		run := func(procs int) []byte {
			t.Helper()
			defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(procs))
			in, err := input.Parse(file, data)
			if err != nil {
				t.Fatal(err)
			}
			r, err := design.Run(in)
			if err != nil {
				t.Fatal(err)
			}
			b, err := reports.JSON(r)
			if err != nil {
				t.Fatal(err)
			}
			return b
		}
		one := run(1)
		for _, procs := range []int{2, 5} {
			if many := run(procs); !bytes.Equal(one, many) {
				i := 0
				for i < len(one) && i < len(many) && one[i] == many[i] {
					i++
				}
				t.Errorf("%s: results.json on %d workers differs from one worker at byte %d of %d", file, procs, i, len(one))
			}
		}
	}
}
