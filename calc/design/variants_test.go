package design

import (
	"testing"

	"colsheet/calc/material"
	"colsheet/calc/model"
)

// Building variants run without a panic, every result finite and every step reproducing itself:
// bases, analyses, spans, reductions, combinations, blocks, imperfections, methods, given bars,
// creep, effective lengths from the frame, fire and durability (common practice, no source).
func TestBuildingVariants(t *testing.T) {
	type variant struct {
		name string
		set  func(in *model.Input)
	}
	variants := []variant{
		{"plain", func(in *model.Input) {}},
		{"pinned frame", func(in *model.Input) { in.Building.Base, in.Building.Analysis = model.BasePinned, model.AnalysisFrame }},
		{"one storey", func(in *model.Input) { in.Building.Storeys = in.Building.Storeys[:1] }},
		{"one bay", func(in *model.Input) { in.Building.GridX, in.Building.GridY = []float64{6000}, []float64{5000} }},
		{"two-way, αA, 6.10ab", func(in *model.Input) {
			in.Building.Floors[0].Spans = model.SpanTwoWay
			in.Building.Options.Reduction, in.Building.Options.Combination = model.ReduceArea, model.Comb610ab
		}},
		{"spans x, αn", func(in *model.Input) {
			in.Building.Floors[0].Spans = model.SpanX
			in.Building.Options.Reduction = model.ReduceStoreys
		}},
		{"rectangular, l0/400, stiffness, exact", func(in *model.Input) {
			in.Options.StressBlock, in.Options.Imperfection = model.Rectangular, model.ImperfL0Over400
			in.Options.SecondOrder, in.Options.Biaxial = model.SecondOrderStiffness, model.BiaxialExact
		}},
		{"given bars, creep, frame l0, fire, durability", func(in *model.Input) {
			in.Building.Bars = &model.BarSpec{Count: 8, Dia: 20}
			in.Building.Options.Creep = &model.Creep{RH: 60, T0: 14, Cement: "R"}
			in.Building.Options.L0FromFrame = true
			in.Options.Fire = &model.Fire{Rating: 60}
			in.Options.Durability = &model.Durability{Exposure: []string{"XC2"}, StructuralClass: 4, DesignLife: 50}
		}},
		{"omitted point, line loads, both methods", func(in *model.Input) {
			in.Building.GridX = []float64{6000, 6000, 6000}
			in.Building.GridY = []float64{5000, 5000, 5000}
			in.Building.Omit = []string{"B2"}
			in.Building.Lines = []model.LineLoad{{GridLine: "1", Gk: 9, Qk: 1, Category: "B"}}
			in.Options.SecondOrder = model.SecondOrderBoth
		}},
	}
	for _, v := range variants {
		for _, class := range []string{"C30/37", "C90/105"} {
			in := generatedBuilding(4, 2, model.AnalysisSubframe)
			c, _ := lookupClass(class)
			in.Materials.Concrete = c
			v.set(in)
			r, err := Run(in)
			if err != nil {
				t.Errorf("%s %s: %v", v.name, class, err)
				continue
			}
			AddInteraction(r)
			for _, d := range r.Designs {
				checkTrace(t, d)
			}
			checkBasis(t, r)
		}
	}
}

func lookupClass(name string) (material.Concrete, bool) { return material.Lookup(name) }

// A sweep of odd but valid columns: tiny and huge sections, no or huge axial force, long
// effective lengths, given bars that do not fit. Nothing panics, nothing is non-finite, a failure
// always has its reasons (common practice, no source).
func TestColumnSweep(t *testing.T) {
	sizes := []float64{150, 250, 400, 800, 1200}
	forces := []float64{0, 300, 3000, 20000}
	lengths := []float64{500, 3000, 9000, 15000}
	for _, b := range sizes {
		for _, h := range []float64{b, 2 * b} {
			for _, n := range forces {
				for _, l0 := range lengths {
					for _, bars := range []*model.BarSpec{nil, {Count: 4, Dia: 40}, {Count: 30, Dia: 32}} {
						col := model.Column{ID: "W", B: b, H: h, Cover: 25, Bars: bars, Storeys: []model.Storey{lift(l0, l0*0.8, n, 0.05*n, -0.02*n, 0.02*n, 0.01*n)}}
						in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
						in.Options.Fire = &model.Fire{Rating: 90}
						r, err := Run(in)
						if err != nil {
							t.Fatal(err)
						}
						checkTrace(t, r.Designs[0])
					}
				}
			}
		}
	}
}
