package input

import (
	"math"
	"strconv"
	"testing"

	"colsheet/calc/model"
)

// sameCase reports whether two cases agree, numbers to relative 1e-9 (the unit conversions are
// common practice, SI prefixes, no source).
func sameCase(a, b model.Case) bool {
	return a.Name == b.Name && a.File == b.File && a.Line == b.Line && a.HasV == b.HasV &&
		near(a.NEd, b.NEd) && near(a.V[0], b.V[0]) && near(a.V[1], b.V[1]) && sameEnds(a.MY, b.MY) && sameEnds(a.MZ, b.MZ)
}

func sameEnds(a, b model.Ends) bool { return near(a.Top, b.Top) && near(a.Bottom, b.Bottom) }

// checkCases fails t unless got holds want, in order.
func checkCases(t *testing.T, what string, got, want []model.Case) {
	t.Helper()
	if len(got) != len(want) {
		t.Errorf("%s: %d cases, want %d:\n got %+v\nwant %+v", what, len(got), len(want), got, want)
		return
	}
	for i := range got {
		if !sameCase(got[i], want[i]) {
			t.Errorf("%s: case %d\n got %+v\nwant %+v", what, i, got[i], want[i])
		}
	}
}

// Cases in the YAML file, and NEd and M as the one case "1": names, order, optional M and V,
// tension. The conversions kN → N and kNm → N·mm are common practice (SI prefixes), no source.
func TestCasesInYAML(t *testing.T) {
	tests := []struct {
		name, lift string // lift: the lines after head (lines 10 on)
		want       []model.Case
	}{
		{"cases in order, V optional", "" +
			"        cases:\n" +
			"          - {name: ULS-1, NEd: 2150 kN, M: {y: {top: 85 kNm, bottom: -40 kNm}, z: {top: 10 kNm, bottom: 10 kNm}}, V: {y: 38 kN, z: 6 kN}}\n" +
			"          - name: ULS-2\n" +
			"            NEd: 1800\n" +
			"            M: {y: {top: 60}}\n" +
			"            V: {z: 4 kN}\n" +
			"          - {name: A, NEd: 900 kN}\n",
			[]model.Case{
				{Name: "ULS-1", File: "in.yaml", Line: 11, NEd: 2150e3, MY: model.Ends{Top: 85e6, Bottom: -40e6}, MZ: model.Ends{Top: 10e6, Bottom: 10e6},
					V: [2]float64{38e3, 6e3}, HasV: [2]bool{true, true}},
				{Name: "ULS-2", File: "in.yaml", Line: 12, NEd: 1800e3, MY: model.Ends{Top: 60e6}, V: [2]float64{0, 4e3}, HasV: [2]bool{false, true}},
				{Name: "A", File: "in.yaml", Line: 16, NEd: 900e3},
			}},
		{"NEd and M are the case 1", "        NEd: 2150 kN\n        M: {y: {top: 85 kNm, bottom: -40 kNm}, z: {top: 10 kNm}}\n",
			[]model.Case{{Name: "1", File: "in.yaml", Line: 10, NEd: 2150e3, MY: model.Ends{Top: 85e6, Bottom: -40e6}, MZ: model.Ends{Top: 10e6}}}},
		{"NEd alone", "        NEd: 700\n",
			[]model.Case{{Name: "1", File: "in.yaml", Line: 10, NEd: 700e3}}},
		{"tension as NEd", "        NEd: -150 kN\n        M: {y: {top: 5 kNm, bottom: 5 kNm}}\n",
			[]model.Case{{Name: "1", File: "in.yaml", Line: 10, NEd: -150e3, MY: model.Ends{Top: 5e6, Bottom: 5e6}}}},
		{"tension in a case", "        cases: [{name: up, NEd: -80 kN, V: {y: -3 kN}}, {name: down, NEd: 1200 kN}]\n",
			[]model.Case{{Name: "up", File: "in.yaml", Line: 10, NEd: -80e3, V: [2]float64{-3e3, 0}, HasV: [2]bool{true, false}},
				{Name: "down", File: "in.yaml", Line: 10, NEd: 1200e3}}},
		{"case names are trimmed", "        cases:\n          - {name: ' W 1 ', NEd: 10}\n",
			[]model.Case{{Name: "W 1", File: "in.yaml", Line: 11, NEd: 10e3}}},
	}
	for _, c := range tests {
		in, err := Parse("in.yaml", []byte(head+c.lift))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		s := in.Columns[0].Storeys[0]
		checkCases(t, c.name, s.Cases, c.want)
		if len(s.Cases) > 0 && (s.NEd != s.Cases[0].NEd || s.MY != s.Cases[0].MY || s.MZ != s.Cases[0].MZ) {
			t.Errorf("%s: the storey's NEd and M %g %+v %+v are not those of its first case", c.name, s.NEd, s.MY, s.MZ)
		}
		if in.MomentSigns != model.SignsFace || in.Actions != nil {
			t.Errorf("%s: moment signs %q, actions %+v", c.name, in.MomentSigns, in.Actions)
		}
	}
}

func TestCasesInYAMLErrors(t *testing.T) {
	tests := []struct {
		name, lift string
		want       []string
	}{
		{"both NEd and cases", "        NEd: 10\n        cases: [{name: A, NEd: 10}]\n", []string{
			"in.yaml:11: columns[0].storeys[0].cases: give either NEd and M (one case) or cases, not both (NEd at line 10)"}},
		{"both M and cases", "        M: {y: {top: 1}}\n        cases: [{name: A, NEd: 10}]\n", []string{
			"in.yaml:11: columns[0].storeys[0].cases: give either NEd and M (one case) or cases, not both (M at line 10)"}},
		{"neither", "        M: {y: {top: 1 kN}}\n", []string{
			"in.yaml:8: columns[0].storeys[0].NEd: is required but missing (the design axial force, e.g. NEd: 2150 kN)",
			`in.yaml:10: columns[0].storeys[0].M.y.top: "1 kN" is a force, expected a moment`}},
		{"empty list", "        cases: []\n", []string{
			"in.yaml:10: columns[0].storeys[0].cases: the list is empty; give at least one of the load cases"}},
		{"not a list", "        cases: {name: A}\n", []string{
			"in.yaml:10: columns[0].storeys[0].cases: expected a list of load cases, found a mapping"}},
		{"case faults", "" +
			"        cases:\n" +
			"          - {NEd: 10}\n" +
			"          - {name: A}\n" +
			"          - {name: A, NEd: 10, V: {x: 1, y: 3 m}, N: 1}\n" +
			"          - {name: B/1, NEd: -2e5, M: {y: {top: 1e9}}}\n", []string{
			"in.yaml:11: columns[0].storeys[0].cases[0].name: is required but missing (the case's name, e.g. name: ULS-1)",
			"in.yaml:12: columns[0].storeys[0].cases[1].NEd: is required but missing (the design axial force of the case, e.g. NEd: 2150 kN)",
			"in.yaml:13: columns[0].storeys[0].cases[2].N: unknown key (known here: name, NEd, M, V)",
			"in.yaml:13: columns[0].storeys[0].cases[2].V.x: unknown key (known here: y, z)",
			`in.yaml:13: columns[0].storeys[0].cases[2].V.y: "3 m" is a length, expected a force`,
			`in.yaml:13: columns[0].storeys[0].cases[2].name: case name "A" is used twice in this lift (first at columns[0].storeys[0].cases[1])`,
			`in.yaml:14: columns[0].storeys[0].cases[3].name: "B/1" must not contain a slash`,
			"in.yaml:14: columns[0].storeys[0].cases[3].NEd: -200000 kN is outside the plausible range of the design axial force, -100000 kN to 100000 kN (see the input limits in the README)",
			"in.yaml:14: columns[0].storeys[0].cases[3].M.y.top: 1e+09 kNm is outside the plausible range of the first-order end moment, -100000 kNm to 100000 kNm (see the input limits in the README)"}},
		{"shear beyond its limit", "        cases: [{name: A, NEd: 10, V: {z: -1e6 kN}}]\n", []string{
			"in.yaml:10: columns[0].storeys[0].cases[0].V.z: -1e+06 kN is outside the plausible range of the design shear force, -100000 kN to 100000 kN (see the input limits in the README)"}},
		{"moment_signs unknown", "        NEd: 10\nmoment_signs: anticlockwise\n", []string{
			`in.yaml:11: moment_signs: "anticlockwise" is not one of face, member-ends`}},
	}
	for _, c := range tests {
		_, err := Parse("in.yaml", []byte(head+c.lift))
		checkErrors(t, c.name, err, c.want)
	}
}

// memberEndsInternal returns the bending moments of a member at its two ends from its member-end
// moments (clockwise positive on the member, bottom the start), by the equilibrium of a free
// body cut next to each end: at the start the moment in the member is −M_start, at the end
// +M_end, both in one sign convention along the member (statics, common practice, no source).
func memberEndsInternal(mStart, mEnd float64) (bottom, top float64) { return -mStart, mEnd }

// slopeDeflection returns the member-end moments (clockwise positive) of a prismatic member
// with end rotations thStart, thEnd (clockwise positive) and no load along it:
// M_ij = 2EI/L (2θi + θj), M_ji = 2EI/L (2θj + θi) (slope-deflection, common practice, no source).
func slopeDeflection(k, thStart, thEnd float64) (mStart, mEnd float64) {
	return k * (2*thStart + thEnd), k * (2*thEnd + thStart)
}

// The same physical moments give the same model in both conventions, in the YAML file (plain M
// and cases) and in the actions table. The physical moments come from the slope-deflection
// equations of a column with given end rotations: equal rotations bend it in double curvature,
// opposite ones in single curvature (common practice, no source).
func TestMomentSigns(t *testing.T) {
	const k = 2e7 // 2EI/L, N·mm per radian: test input only
	tests := []struct {
		name        string
		thBot, thTp float64 // end rotations, rad, clockwise positive
		single      bool    // single curvature: tension on one face all along
	}{
		{"double curvature", 1e-3, 1e-3, false},
		{"single curvature", 1e-3, -1e-3, true},
		{"one end fixed", 0, 2e-3, false},
		{"unequal single curvature", 2e-3, -1.5e-3, true},
	}
	for _, c := range tests {
		cwBot, cwTop := slopeDeflection(k, c.thBot, c.thTp)
		bot, top := memberEndsInternal(cwBot, cwTop)
		if (bot*top > 0) != c.single {
			t.Fatalf("%s: the internal moments %g, %g do not show the curvature of the case", c.name, bot, top)
		}
		want := model.Ends{Top: top, Bottom: bot}
		got := FaceEnds(model.Ends{Top: cwTop, Bottom: cwBot}, model.SignsMemberEnds)
		if !sameEnds(got, want) {
			t.Errorf("%s: FaceEnds gives %+v, want the internal moments %+v", c.name, got, want)
		}
		kNm := func(v float64) string { return strconv.FormatFloat(v/1e6, 'f', -1, 64) }
		face := "M: {y: {top: " + kNm(top) + ", bottom: " + kNm(bot) + "}, z: {top: " + kNm(-top) + ", bottom: " + kNm(-bot) + "}}"
		cw := "M: {y: {top: " + kNm(cwTop) + ", bottom: " + kNm(cwBot) + "}, z: {top: " + kNm(-cwTop) + ", bottom: " + kNm(-cwBot) + "}}"
		csvRow := func(t1, b1 float64) string {
			return "column,lift,case,NEd_kN,My_top_kNm,My_bottom_kNm,Mz_top_kNm,Mz_bottom_kNm\nK1,L1,A,100," +
				kNm(t1) + "," + kNm(b1) + "," + kNm(-t1) + "," + kNm(-b1) + "\n"
		}
		inputs := []struct {
			what, signs, lift, table string
		}{
			{"face, plain M", "face", "        NEd: 100\n        " + face + "\n", ""},
			{"member-ends, plain M", "member-ends", "        NEd: 100\n        " + cw + "\n", ""},
			{"member-ends, cases", "member-ends", "        cases: [{name: A, NEd: 100, " + cw + "}]\n", ""},
			{"face, table", "face", "", csvRow(top, bot)},
			{"member-ends, table", "member-ends", "", csvRow(cwTop, cwBot)},
		}
		for _, in := range inputs {
			text := "moment_signs: " + in.signs + "\n" + head + in.lift
			if in.table != "" {
				text = "moment_signs: " + in.signs + "\nactions: t.csv\n" + head
			}
			got, _, err := ParseWarn("in.yaml", []byte(text), files(map[string]string{"t.csv": in.table}))
			if err != nil {
				t.Errorf("%s, %s: %v", c.name, in.what, err)
				continue
			}
			s := got.Columns[0].Storeys[0]
			if !sameEnds(s.MY, want) || !sameEnds(s.MZ, model.Ends{Top: -want.Top, Bottom: -want.Bottom}) || got.MomentSigns != in.signs {
				t.Errorf("%s, %s: My %+v, Mz %+v (signs %q), want My %+v and Mz its opposite", c.name, in.what, s.MY, s.MZ, got.MomentSigns, want)
			}
		}
	}
	if e := FaceEnds(model.Ends{Top: 0, Bottom: 0}, model.SignsMemberEnds); math.Signbit(e.Bottom) {
		t.Error("a zero bottom moment becomes -0")
	}
}
