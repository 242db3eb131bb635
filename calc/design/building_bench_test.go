package design

import (
	"strconv"
	"testing"

	"colsheet/calc/code"
	"colsheet/calc/material"
	"colsheet/calc/model"
)

// generatedBuilding returns an invented building of the given storeys on a square grid of
// bays × bays bays (test data only).
func generatedBuilding(storeys, bays int, analysis string) *model.Input {
	c, _ := material.Lookup("C40/50")
	b := &model.Building{Column: model.Size{B: 500, H: 500}, Cover: 40, Beam: model.Size{B: 300, H: 600},
		Base: model.BaseFixed, Analysis: analysis,
		Options: model.BuildingOptions{BeamStiffness: "half", Combination: model.Comb610, Reduction: model.ReduceNone, Density: 2.5e-5, L0Factor: 1}}
	var all []string
	for s := 0; s < storeys; s++ {
		name := "L" + strconv.Itoa(s+1)
		b.Storeys = append(b.Storeys, model.Level{Name: name, Height: 3300})
		all = append(all, name)
	}
	for i := 0; i < bays; i++ {
		b.GridX = append(b.GridX, 6000)
		b.GridY = append(b.GridY, 6000)
	}
	b.Floors = []model.Floor{{Levels: all, Gk: 0.006, Qk: 0.0025, Category: "B", Spans: model.SpanTwoWay}}
	// Columns grow towards the base, as a designer would size them.
	for s := 0; s < storeys; s++ {
		size := 450 + 150*float64((storeys-1-s)/10)
		b.Columns = append(b.Columns, model.ColumnSize{Levels: []string{all[s]}, Size: model.Size{B: size, H: size}})
	}
	return &model.Input{File: "generated.yaml", Code: code.Recommended(), Building: b,
		Materials: model.Materials{Concrete: c, Fyk: 500, Aggregate: 20},
		Options: model.Options{StressBlock: model.ParabolaRectangle, Imperfection: model.ImperfInclination, Members: 1,
			BarDiameters: []float64{12, 16, 20, 25, 32, 40}, LinkDiameters: []float64{8, 10, 12}, LinkStep: 1}}
}

// BenchmarkBuilding40x100 measures take-down, moments and column design of a 40-storey building
// of 100 columns (9 × 9 bays), reports excluded (target ≤ 1 s on one core).
func BenchmarkBuilding40x100(b *testing.B) {
	in := generatedBuilding(40, 9, model.AnalysisSubframe)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Run(in); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuilding40x100Stream measures the same as the design command runs it: streamed,
// each design handed on with its interaction data and then let go (Stream with keep false: the
// first pass designs each lift without its trace, the second with it).
func BenchmarkBuilding40x100Stream(b *testing.B) {
	in := generatedBuilding(40, 9, model.AnalysisSubframe)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Stream(in, false, nil, func(int, *Design) error { return nil }); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuilding40x100Frame is the same with the full-frame analysis.
func BenchmarkBuilding40x100Frame(b *testing.B) {
	in := generatedBuilding(40, 9, model.AnalysisFrame)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Run(in); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSizeSearch1000 measures the size finder for 1000 columns of one lift each, square
// sizes from 250 to 800 mm in steps of 25 mm (target ≤ 2 s).
func BenchmarkSizeSearch1000(b *testing.B) {
	c, _ := material.Lookup("C32/40")
	in := &model.Input{File: "generated.yaml", Code: code.Recommended(),
		Materials: model.Materials{Concrete: c, Fyk: 500, Aggregate: 20},
		Options: model.Options{StressBlock: model.ParabolaRectangle, Imperfection: model.ImperfInclination, Members: 1,
			BarDiameters: []float64{12, 16, 20, 25, 32, 40}, LinkDiameters: []float64{8, 10, 12}, LinkStep: 1,
			Sizes: &model.SizeSearch{Step: 25, Min: 250, Max: 800, Square: true, RhoMax: 0.03}}}
	for k := 0; k < 1000; k++ {
		n := 500 + float64(k%40)*150 // 500 to 6350 kN
		in.Columns = append(in.Columns, model.Column{ID: "C" + strconv.Itoa(k), B: 400, H: 400, Cover: 35,
			Storeys: []model.Storey{{Name: "L1", L0Y: 3000, L0Z: 3000, NEd: n * 1e3,
				MY: model.Ends{Top: 60e6, Bottom: -30e6}, MZ: model.Ends{Top: 25e6, Bottom: -10e6}}}})
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		r, err := Run(in)
		if err != nil || len(r.Sizes) != 1000 {
			b.Fatal(err)
		}
	}
}
