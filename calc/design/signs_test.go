package design_test

import (
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/input"
)

// The same physical end moments given in the face convention and as member-end moments
// (clockwise positive at both ends, the bottom's sign changed on reading) give the same design:
// bars, links, utilisation and every case's design moments (common practice, no source; the
// conversion itself is checked against slope-deflection in calc/input).
func TestMomentSignConventions(t *testing.T) {
	const head = "project: {title: Signs, date: 2026-12-01}\nmaterials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}\n"
	body := func(bot1, bot2 string) string {
		return "columns:\n  - id: S1\n    b: 350 mm\n    h: 350 mm\n    cover: 35 mm\n    storeys:\n      - name: L1\n        l0: 3.2 m\n        length: 3.5 m\n        cases:\n" +
			"          - {name: A, NEd: 1800 kN, M: {y: {top: 70 kNm, bottom: " + bot1 + "}, z: {top: 15 kNm, bottom: 0}}}\n" +
			"          - {name: B, NEd: 900 kN, M: {y: {top: 95 kNm, bottom: " + bot2 + "}, z: {top: 0, bottom: 0}}, V: {y: 60 kN}}\n"
	}
	face := head + body("-35 kNm", "50 kNm")
	ends := head + "moment_signs: member-ends\n" + body("35 kNm", "-50 kNm")
	run := func(src string) design.Design {
		in, err := input.Parse("signs.yaml", []byte(src))
		if err != nil {
			t.Fatal(err)
		}
		r, err := design.Run(in)
		if err != nil {
			t.Fatal(err)
		}
		return r.Designs[0]
	}
	a, b := run(face), run(ends)
	if a.Bars.Count != b.Bars.Count || a.Bars.Dia != b.Bars.Dia || a.Links != b.Links || a.Utilization != b.Utilization || a.GoverningCase != b.GoverningCase {
		t.Fatalf("face: %d Ø%g %+v %g %s; member ends: %d Ø%g %+v %g %s", a.Bars.Count, a.Bars.Dia, a.Links, a.Utilization, a.GoverningCase,
			b.Bars.Count, b.Bars.Dia, b.Links, b.Utilization, b.GoverningCase)
	}
	for k := range a.Cases {
		if a.Cases[k].Y.MEd != b.Cases[k].Y.MEd || a.Cases[k].Y.M01 != b.Cases[k].Y.M01 {
			t.Errorf("case %s: MEd,y %g / %g, M01 %g / %g", a.Cases[k].Name, a.Cases[k].Y.MEd, b.Cases[k].Y.MEd, a.Cases[k].Y.M01, b.Cases[k].Y.M01)
		}
	}
	if a.Cases[0].Y.M01 >= 0 {
		t.Errorf("case A is in double curvature: M01 = %g", a.Cases[0].Y.M01)
	}
}
