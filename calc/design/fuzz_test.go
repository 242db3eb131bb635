package design

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"
	"time"

	"colsheet/calc/input"
	"colsheet/calc/trace"
)

// fuzzInput writes a small input file of either form from the fuzzer's numbers: one column and
// two lifts (the actions form) or a building of one or two bays and one or two storeys. The
// numbers are used as written, in the fields' plain units, so that the limits of the parser see
// every kind of value; the text is test input only.
func fuzzInput(building bool, b, h, cover, l0, nEd, my, mz, bay, height, gk, qk float64, bars uint8) string {
	num := func(v float64) string { return fmt.Sprintf("%g", v) }
	var sb strings.Builder
	sb.WriteString("materials: {concrete: C30/37}\n")
	if !building {
		fmt.Fprintf(&sb, "columns:\n  - id: K1\n    b: %s\n    h: %s\n    cover: %s\n", num(b), num(h), num(cover))
		if bars%3 == 1 {
			fmt.Fprintf(&sb, "    bars: {count: %d, dia: %d}\n", 4+2*int(bars%8), []int{12, 16, 20, 25, 32}[int(bars)%5])
		}
		sb.WriteString("    storeys:\n")
		fmt.Fprintf(&sb, "      - {name: L1, l0: %s, NEd: %s, M: {y: {top: %s, bottom: %s}, z: {top: %s}}}\n", num(l0), num(nEd), num(my), num(-my/2), num(mz))
		fmt.Fprintf(&sb, "      - {name: L2, l0: {y: %s, z: %s}, NEd: %s, phi_ef: 1.5}\n", num(l0), num(l0*0.8), num(nEd/2))
		return sb.String()
	}
	storeys := "[{name: L1, height: " + num(height) + "}]"
	if bars%2 == 0 {
		storeys = "[{name: L1, height: " + num(height) + "}, {name: R, height: 3000}]"
	}
	x := "[" + num(bay) + "]"
	if bars%4 < 2 {
		x = "[" + num(bay) + ", 5000]"
	}
	fmt.Fprintf(&sb, "building:\n  storeys: %s\n  grid: {x: %s, y: [%s]}\n", storeys, x, num(bay*0.9))
	fmt.Fprintf(&sb, "  columns: {b: %s, h: %s, cover: %s}\n  beams: {b: 250, h: 500}\n", num(b), num(h), num(cover))
	fmt.Fprintf(&sb, "  floors: [{gk: %s, qk: %s, category: B, spans: %s}]\n", num(gk), num(qk), []string{"x", "y", "two-way"}[int(bars)%3])
	if bars%5 == 0 {
		sb.WriteString("  analysis: frame\n")
	}
	return sb.String()
}

// FuzzDesign runs parse → design → trace re-evaluation on small generated inputs of both forms:
// the input is refused with Errors, or it designs without a panic, every step (project basis
// and every design's) re-evaluates to its value (trace.Recheck), and every design says pass or
// fail with a finite utilisation.
func FuzzDesign(f *testing.F) {
	// Seeds: plausible columns and buildings (test inputs only), and a few the limits refuse.
	f.Add(false, 350.0, 500.0, 40.0, 3000.0, 2150.0, 85.0, 20.0, 6000.0, 3500.0, 5.0, 2.5, uint8(0))
	f.Add(false, 300.0, 300.0, 30.0, 4500.0, 900.0, 0.0, 0.0, 6000.0, 3500.0, 5.0, 2.5, uint8(1))
	f.Add(false, 250.0, 600.0, 35.0, 8000.0, 3000.0, -120.0, 60.0, 6000.0, 3500.0, 5.0, 2.5, uint8(4))
	f.Add(true, 350.0, 450.0, 40.0, 3000.0, 0.0, 0.0, 0.0, 6600.0, 3800.0, 5.8, 2.5, uint8(0))
	f.Add(true, 300.0, 300.0, 35.0, 3000.0, 0.0, 0.0, 0.0, 4800.0, 3300.0, 3.9, 0.6, uint8(3))
	f.Add(true, 400.0, 400.0, 40.0, 3000.0, 0.0, 0.0, 0.0, 7500.0, 4000.0, 6.0, 5.0, uint8(5))
	f.Add(false, 350.0, 500.0, 40.0, 3.0, 2150.0, 85.0, 20.0, 6000.0, 3500.0, 5.0, 2.5, uint8(0))
	f.Add(false, 1e12, 500.0, 40.0, 3000.0, 1e300, 85.0, 20.0, 6000.0, 3500.0, 5.0, 2.5, uint8(0))
	f.Fuzz(func(t *testing.T, building bool, b, h, cover, l0, nEd, my, mz, bay, height, gk, qk float64, bars uint8) {
		text := fuzzInput(building, b, h, cover, l0, nEd, my, mz, bay, height, gk, qk, bars)
		in, err := input.Parse("f.yaml", []byte(text))
		if err != nil {
			var es input.Errors
			if !errors.As(err, &es) || len(es) == 0 {
				t.Fatalf("%s: error %v is not a non-empty input.Errors", text, err)
			}
			return
		}
		start := time.Now()
		res, err := Run(in)
		if d := time.Since(start); d > 60*time.Second {
			t.Errorf("%s: the design took %v", text, d)
		}
		if err != nil {
			// A refusal of the whole run is allowed when it says why.
			if strings.TrimSpace(err.Error()) == "" {
				t.Fatalf("%s: an empty error", text)
			}
			return
		}
		for _, s := range res.Basis {
			if err := trace.Recheck(s, 1e-9); err != nil {
				t.Errorf("%s: basis: %v", text, err)
			}
		}
		if len(res.Designs) == 0 {
			t.Fatalf("%s: no designs", text)
		}
		for _, d := range res.Designs {
			for _, s := range d.Steps {
				if err := trace.Recheck(s, 1e-9); err != nil {
					t.Errorf("%s: %s/%s: %v", text, d.Column, d.Storey, err)
				}
			}
			if d.Status != StatusPass && d.Status != StatusFail || math.IsNaN(d.Utilization) || math.IsInf(d.Utilization, 0) {
				t.Errorf("%s: %s/%s: status %q, utilisation %g", text, d.Column, d.Storey, d.Status, d.Utilization)
			}
			if d.Status == StatusFail && len(d.Reasons) == 0 {
				t.Errorf("%s: %s/%s fails without a reason", text, d.Column, d.Storey)
			}
		}
	})
}
