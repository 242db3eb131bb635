package design

import (
	"reflect"
	"testing"

	"colsheet/calc/material"
	"colsheet/calc/section"
)

// TestCurveMemoSame holds the N–M diagrams that lifts share through the run's memo equal to the
// diagrams made afresh from each design's own section, on the demo (rectangles and circles),
// and checks that lifts did share them (common practice, no source: a memo must not change
// what it returns).
func TestCurveMemoSame(t *testing.T) {
	r := mustRun(t, parseFile(t, "../../testdata/demo.yaml"))
	AddInteraction(r)
	with, circles := 0, 0
	for k := range r.Designs {
		d := &r.Designs[k]
		var y, z []section.NMPoint
		switch {
		case d.circ != nil:
			circles++
			y = d.circ.CurveNM(d.theta, curvePoints)
			z = y
		case d.sec != nil:
			y, z = d.sec.CurveNM(section.AxisY, curvePoints), d.sec.CurveNM(section.AxisZ, curvePoints)
		default:
			continue
		}
		with++
		if d.Interaction == nil || !reflect.DeepEqual(d.Interaction.NMY, y) || !reflect.DeepEqual(d.Interaction.NMZ, z) {
			t.Fatalf("%s/%s: the shared N–M diagrams differ from the section's own", d.Column, d.Storey)
		}
	}
	if with == 0 || circles == 0 {
		t.Fatalf("%d designs with bars, %d circular: the demo should have both", with, circles)
	}
	if held := len(r.curves.m); held == 0 || held >= 2*(with-circles)+circles {
		t.Errorf("%d diagrams held for %d designs: no lift shared one", held, with)
	}
}

// TestCurveKeyDistinct checks that sections differing in one bar, the class or the axis get
// different keys (common practice, no source).
func TestCurveKeyDistinct(t *testing.T) {
	bars := []section.Bar{{Y: -100, Z: -100, Area: 314}, {Y: 100, Z: 100, Area: 314}}
	moved := []section.Bar{{Y: -100, Z: -100, Area: 314}, {Y: 100, Z: 101, Area: 314}}
	c, _ := material.Lookup("C30/37")
	c2 := c
	c2.Class, c2.Fck = "other", c.Fck+5
	base := string(curveKey(nil, 'r', [2]float64{400, 400}, bars, 20, 435, 200000, section.ParabolaRectangle, c, 0))
	for name, k := range map[string][]byte{
		"bar":   curveKey(nil, 'r', [2]float64{400, 400}, moved, 20, 435, 200000, section.ParabolaRectangle, c, 0),
		"class": curveKey(nil, 'r', [2]float64{400, 400}, bars, 20, 435, 200000, section.ParabolaRectangle, c2, 0),
		"axis":  curveKey(nil, 'r', [2]float64{400, 400}, bars, 20, 435, 200000, section.ParabolaRectangle, c, 1),
		"size":  curveKey(nil, 'r', [2]float64{400, 450}, bars, 20, 435, 200000, section.ParabolaRectangle, c, 0),
		"block": curveKey(nil, 'r', [2]float64{400, 400}, bars, 20, 435, 200000, section.Rectangular, c, 0),
		"shape": curveKey(nil, 'o', [2]float64{400, 400}, bars, 20, 435, 200000, section.ParabolaRectangle, c, 0),
	} {
		if string(k) == base {
			t.Errorf("a different %s gives the same key", name)
		}
	}
}
