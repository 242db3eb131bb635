package design

import (
	"testing"

	"colsheet/calc/detail"
	"colsheet/calc/model"
)

func benchInput() *model.Input {
	st := lift(3400, 3600, 2150, 85, -40, 10, 10)
	col := model.Column{ID: "B", B: 350, H: 500, Cover: 40, Bars: &model.BarSpec{Count: 8, Dia: 20}, Storeys: []model.Storey{st}}
	return newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
}

func BenchmarkPartCommon(b *testing.B) {
	in := benchInput()
	for i := 0; i < b.N; i++ {
		newCommon(in, &in.Columns[0], &in.Columns[0].Storeys[0], nil, newBasis(in))
	}
}

func BenchmarkPartEvaluate(b *testing.B) {
	in := benchInput()
	c := newCommon(in, &in.Columns[0], &in.Columns[0].Storeys[0], nil, newBasis(in))
	p := candidatesFor(c)[0]
	for i := 0; i < b.N; i++ {
		c.evaluate(p, true, true)
	}
}

func BenchmarkPartFinish(b *testing.B) {
	in := benchInput()
	c := newCommon(in, &in.Columns[0], &in.Columns[0].Storeys[0], nil, newBasis(in))
	p := candidatesFor(c)[0]
	d := c.evaluate(p, true, true)
	steps := d.Steps
	for i := 0; i < b.N; i++ {
		d.Steps = steps[:len(steps):len(steps)]
		c.finish(d)
	}
}

// benchTrial measures one way of trying the first candidate pattern of the bench input.
func benchTrial(b *testing.B, try func(c *common, p detail.Pattern) Design) {
	in := benchInput()
	c := newCommon(in, &in.Columns[0], &in.Columns[0].Storeys[0], nil, newBasis(in))
	p := candidatesFor(c)[0]
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		try(c, p)
	}
}

// BenchmarkPartTrial measures the trial of one candidate pattern (trial.go), as the search makes it.
func BenchmarkPartTrial(b *testing.B) {
	benchTrial(b, func(c *common, p detail.Pattern) Design { _, q := c.cannotPass(p); return c.trial(p, q) })
}

// BenchmarkPartTrialTraced measures the traced trial of the same pattern, evaluate(p, false, false).
func BenchmarkPartTrialTraced(b *testing.B) {
	benchTrial(b, func(c *common, p detail.Pattern) Design { return c.evaluate(p, false, false) })
}
