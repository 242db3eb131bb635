package design

import (
	"testing"

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
