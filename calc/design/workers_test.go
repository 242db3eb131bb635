package design_test

import (
	"bytes"
	"errors"
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

// TestStreamSameBytes writes results.json through design.Stream (each design written as it is
// emitted, its trace let go after; in the building form each lift designed without keeping its
// trace, then again when its column is handed on) on one worker and on several: the bytes are
// those of Run followed by AddInteraction, the designs emitted once each in input order, without
// traces after (common practice, no source: the package does not depend on how it was made).
func TestStreamSameBytes(t *testing.T) {
	for _, file := range []string{"../../testdata/columns.yaml", "../../testdata/demo.yaml"} {
		if testing.Short() && file != "../../testdata/columns.yaml" {
			continue
		}
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		in, err := input.Parse(file, data)
		if err != nil {
			t.Fatal(err)
		}
		r, err := design.Run(in)
		if err != nil {
			t.Fatal(err)
		}
		design.AddInteraction(r)
		want, err := reports.JSON(r)
		if err != nil {
			t.Fatal(err)
		}
		for _, procs := range []int{1, 2, 5} {
			func() {
				defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(procs))
				in, err := input.Parse(file, data)
				if err != nil {
					t.Fatal(err)
				}
				var b bytes.Buffer
				js, err := reports.NewJSONStream(&b, r.ToolName, r.ToolVersion, in)
				if err != nil {
					t.Fatal(err)
				}
				next := 0
				res, err := design.Stream(in, false, nil, func(k int, d *design.Design) error {
					if k != next {
						t.Fatalf("emitted design %d, want %d", k, next)
					}
					next++
					return js.Design(d)
				})
				if err != nil {
					t.Fatal(err)
				}
				if err := js.End(res); err != nil {
					t.Fatal(err)
				}
				if !bytes.Equal(b.Bytes(), want) {
					t.Errorf("%s on %d workers: streamed results.json differs from Run's", file, procs)
				}
				if next != len(res.Designs) || len(res.Designs[0].Steps) != 0 || res.Designs[0].Interaction != nil {
					t.Errorf("%s: %d emitted of %d; traces kept: %d steps", file, next, len(res.Designs), len(res.Designs[0].Steps))
				}
			}()
		}
	}
}

// TestStreamStopsOnError: an error from emit stops the run and comes back.
func TestStreamStopsOnError(t *testing.T) {
	file := "../../testdata/columns.yaml"
	data, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	in, err := input.Parse(file, data)
	if err != nil {
		t.Fatal(err)
	}
	stop := errors.New("disk full")
	calls := 0
	_, err = design.Stream(in, true, nil, func(k int, d *design.Design) error {
		calls++
		if k == 1 {
			return stop
		}
		return nil
	})
	if !errors.Is(err, stop) || calls != 2 {
		t.Errorf("error %v after %d calls, want the emit error after 2", err, calls)
	}
}
