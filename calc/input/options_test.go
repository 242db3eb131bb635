package input

import (
	"errors"
	"reflect"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// lift is head with the axial force of its lift; cases add lines after it, from line 11 on.
const lift = head + "        NEd: 10\n"

// The method choices, the size finder and the creep data parse into the model; unit conversions
// are common practice (SI prefixes), no source.
func TestParseOptions(t *testing.T) {
	defaults := model.Options{
		SecondOrder: model.SecondOrderCurvature,
		Biaxial:     model.BiaxialRule,
		CrackedK:    0.5,
	}
	type methods struct {
		SecondOrder, Biaxial string
		CrackedK             float64
		Sizes                *model.SizeSearch
	}
	of := func(o model.Options) methods { return methods{o.SecondOrder, o.Biaxial, o.CrackedK, o.Sizes} }
	with := func(edit func(*model.Options)) methods {
		o := defaults
		edit(&o)
		return of(o)
	}
	cases := []struct {
		name, extra string
		want        methods
	}{
		{"defaults", "", of(defaults)},
		{"nominal stiffness", "design: {second_order: nominal-stiffness}\n", with(func(o *model.Options) { o.SecondOrder = model.SecondOrderStiffness })},
		{"both methods", "design: {second_order: both}\n", with(func(o *model.Options) { o.SecondOrder = model.SecondOrderBoth })},
		{"nominal curvature", "design: {second_order: nominal-curvature}\n", of(defaults)},
		{"biaxial quoted", "design: {biaxial: \"5.39\"}\n", of(defaults)},
		{"biaxial as a YAML number", "design: {biaxial: 5.39}\n", of(defaults)},
		{"biaxial exact", "design: {biaxial: exact}\n", with(func(o *model.Options) { o.Biaxial = model.BiaxialExact })},
		{"cracked stiffness", "design: {cracked_stiffness: 0.7}\n", with(func(o *model.Options) { o.CrackedK = 0.7 })},
		{"cracked stiffness in per cent", "design: {cracked_stiffness: 40 %}\n", with(func(o *model.Options) { o.CrackedK = 0.4 })},
		{"cracked stiffness at the limits", "design: {cracked_stiffness: 1}\n", with(func(o *model.Options) { o.CrackedK = 1 })},
		{"sizes", "design:\n  size_search:\n    sizes: [[300 mm, 300 mm], [350 mm, 350 mm], [350 mm, 450 mm]]\n",
			with(func(o *model.Options) {
				o.Sizes = &model.SizeSearch{Sizes: []model.Size{{B: 300, H: 300}, {B: 350, H: 350}, {B: 350, H: 450}}, RhoMax: 0.04}
			})},
		{"sizes in order, plain mm, metres and mappings", "design:\n  size_search:\n    sizes: [[400, 0.3 m], {b: 250, h: 250 mm}]\n    steel_ratio_max: 2 %\n",
			with(func(o *model.Options) {
				o.Sizes = &model.SizeSearch{Sizes: []model.Size{{B: 400, H: 300}, {B: 250, H: 250}}, RhoMax: 0.02}
			})},
		{"step", "design:\n  size_search: {step: 25 mm, min: 250 mm, max: 0.8 m, square: true, steel_ratio_max: 0.02}\n",
			with(func(o *model.Options) {
				o.Sizes = &model.SizeSearch{Step: 25, Min: 250, Max: 800, Square: true, RhoMax: 0.02}
			})},
		{"step, one size, not square", "design:\n  size_search: {step: 50, min: 300, max: 300, square: false}\n",
			with(func(o *model.Options) { o.Sizes = &model.SizeSearch{Step: 50, Min: 300, Max: 300, RhoMax: 0.04} })},
		{"steel ratio at the limits", "design:\n  size_search: {step: 50, min: 300, max: 400, steel_ratio_max: 0.08}\n",
			with(func(o *model.Options) { o.Sizes = &model.SizeSearch{Step: 50, Min: 300, Max: 400, RhoMax: 0.08} })},
	}
	for _, c := range cases {
		in, err := Parse("in.yaml", []byte(lift+c.extra))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if got := of(in.Options); !reflect.DeepEqual(got, c.want) {
			t.Errorf("%s: got %+v (sizes %+v), want %+v (sizes %+v)", c.name, got, got.Sizes, c.want, c.want.Sizes)
		}
	}
}

func TestParseCreep(t *testing.T) {
	cases := []struct {
		name, extra string
		want        *model.Creep
	}{
		{"not given", "", nil},
		{"all keys", "        creep: {rh: 50, t0: 28 d, cement: N, ratio: 0.6}\n", &model.Creep{RH: 50, T0: 28, Cement: "N", Ratio: 0.6}},
		{"days spelled out, default cement", "        creep: {rh: 80, t0: 28 days}\n", &model.Creep{RH: 80, T0: 28, Cement: "N"}},
		{"plain days, lower-case cement", "        creep: {rh: 65, t0: 7, cement: r}\n", &model.Creep{RH: 65, T0: 7, Cement: "R"}},
		{"one day, no space", "        creep: {rh: 40, t0: 1day, cement: S}\n", &model.Creep{RH: 40, T0: 1, Cement: "S"}},
		{"fraction of a day", "        creep: {rh: 100, t0: 0.5d}\n", &model.Creep{RH: 100, T0: 0.5, Cement: "N"}},
		{"humidity and ratio in per cent", "        creep: {rh: 55 %, t0: 14 d, ratio: 70 %}\n", &model.Creep{RH: 55, T0: 14, Cement: "N", Ratio: 0.7}},
		{"expressions over vars", "vars: {age: 28, rh0: 60}\n", &model.Creep{RH: 70, T0: 56, Cement: "N", Ratio: 0}},
		{"ratio 0 is not given", "        creep: {rh: 10, t0: 90, ratio: 0}\n", &model.Creep{RH: 10, T0: 90, Cement: "N"}},
		{"a mapping on lines", "        creep:\n          rh: 50\n          t0: 28 d\n", &model.Creep{RH: 50, T0: 28, Cement: "N"}},
	}
	for _, c := range cases {
		text := lift + c.extra
		if strings.HasPrefix(c.extra, "vars:") {
			text = c.extra + lift + "        creep: {rh: \"rh0 + 10\", t0: \"2 * age\"}\n"
		}
		in, err := Parse("in.yaml", []byte(text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		s := in.Columns[0].Storeys[0]
		if !sameCreep(s.Creep, c.want) {
			t.Errorf("%s: got %+v, want %+v", c.name, s.Creep, c.want)
		}
		if s.HasPhi {
			t.Errorf("%s: phi_ef set", c.name)
		}
	}
}

// sameCreep reports whether a and b hold the same data, numbers within rounding.
func sameCreep(a, b *model.Creep) bool {
	if a == nil || b == nil {
		return a == b
	}
	return near(a.RH, b.RH) && near(a.T0, b.T0) && a.Cement == b.Cement && near(a.Ratio, b.Ratio)
}

func TestParseBuildingMethods(t *testing.T) {
	cases := []struct {
		name, extra string
		frame       bool
		creep       *model.Creep
	}{
		{"defaults", "", false, nil},
		{"effective length from the frame", "  effective_length: frame\n", true, nil},
		{"effective length by factor", "  effective_length: factor\n  l0_factor: 0.9\n", false, nil},
		{"creep", "  creep: {rh: 50, t0: 28, cement: N}\n", false, &model.Creep{RH: 50, T0: 28, Cement: "N"}},
		{"frame with creep", "  effective_length: frame\n  creep: {rh: 75 %, t0: 10 days, cement: s}\n", true, &model.Creep{RH: 75, T0: 10, Cement: "S"}},
	}
	for _, c := range cases {
		in, err := Parse("in.yaml", []byte(building+c.extra))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		o := in.Building.Options
		if o.L0FromFrame != c.frame || !sameCreep(o.Creep, c.creep) {
			t.Errorf("%s: L0FromFrame %v, creep %+v; want %v, %+v", c.name, o.L0FromFrame, o.Creep, c.frame, c.creep)
		}
	}
}

func TestOptionErrors(t *testing.T) {
	const ss = "in.yaml:12: design.size_search"
	const creep = "in.yaml:11: columns[0].storeys[0].creep"
	cases := []struct {
		name, text string
		want       []string
	}{
		{"second order", lift + "design: {second_order: exact}\n", []string{
			`in.yaml:11: design.second_order: "exact" is not one of nominal-curvature, nominal-stiffness, both`}},
		{"biaxial number", lift + "design: {biaxial: 5.38}\n", []string{
			`in.yaml:11: design.biaxial: "5.38" is not one of 5.39, exact`}},
		{"biaxial list", lift + "design: {biaxial: [5.39]}\n", []string{
			`in.yaml:11: design.biaxial: expected a text, found a list`}},
		{"cracked stiffness low", lift + "design: {cracked_stiffness: 0.05}\n", []string{
			"in.yaml:11: design.cracked_stiffness: the factor on the stiffness of restraining members for cracking (EN 1992-1-1 5.8.3.2(3)) must lie between 0.1 and 1, found 0.05"}},
		{"cracked stiffness high", lift + "design: {cracked_stiffness: 1.5}\n", []string{
			"in.yaml:11: design.cracked_stiffness: the factor on the stiffness of restraining members for cracking (EN 1992-1-1 5.8.3.2(3)) must lie between 0.1 and 1, found 1.5"}},
		{"cracked stiffness with a unit", lift + "design: {cracked_stiffness: 3 m}\n", []string{
			`in.yaml:11: design.cracked_stiffness: "3 m" is a length, expected a pure number`}},
		{"unknown design key", lift + "design: {second_oder: both}\n", []string{
			"in.yaml:11: design.second_oder: unknown key (known here: " + strings.Join(designKeys, ", ") + ")"}},
		{"size search: sizes and step", lift + "design:\n  size_search: {sizes: [[300, 300]], step: 25}\n", []string{
			ss + ": give either sizes (a list of [b, h]) or step, min and max, not both"}},
		{"size search: sizes and min, max", lift + "design:\n  size_search:\n    sizes: [[300, 300]]\n    min: 250\n    max: 300\n", []string{
			"in.yaml:14: design.size_search: give either sizes (a list of [b, h]) or step, min and max, not both"}},
		{"size search: min above max", lift + "design:\n  size_search: {step: 25 mm, min: 800 mm, max: 250 mm}\n", []string{
			ss + ".min: min = 800 mm is greater than max = 250 mm"}},
		{"size search: step without min and max", lift + "design:\n  size_search: {step: 25 mm}\n", []string{
			ss + ".min: is required but missing with a step, min and max search (the smallest b and h, e.g. min: 250 mm)",
			ss + ".max: is required but missing with a step, min and max search (the largest b and h, e.g. max: 800 mm)"}},
		{"size search: min and max without step", lift + "design:\n  size_search: {min: 250, max: 800}\n", []string{
			ss + ".step: is required but missing with a step, min and max search (the step of b and h, e.g. step: 25 mm)"}},
		{"size search: nothing to try", lift + "design:\n  size_search: {steel_ratio_max: 0.03}\n", []string{
			ss + ": give the candidate sections, as sizes: [[300 mm, 300 mm], [350 mm, 350 mm]] or as step, min and max"}},
		{"size search: not positive", lift + "design:\n  size_search: {step: 0, min: -250, max: 800 kN}\n", []string{
			ss + ".step: must be greater than 0, found 0 mm",
			ss + ".min: -250 mm is outside the plausible range of the section side, 150 mm to 3000 mm (see the input limits in the README)",
			ss + `.max: "800 kN" is a force, expected a length`}},
		{"size search: too many sections", lift + "design:\n  size_search: {step: 1, min: 200, max: 400}\n", []string{
			ss + ".step: 1 mm from 200 mm to 400 mm gives 40401 sections, more than the 10000 the size finder takes; give a larger step"}},
		{"size search: square with sizes", lift + "design:\n  size_search: {sizes: [[300, 300]], square: true}\n", []string{
			ss + ".square: applies to step, min and max only; list the sections wanted under sizes instead"}},
		{"size search: square not a boolean", lift + "design:\n  size_search: {step: 25, min: 250, max: 500, square: yes}\n", []string{
			ss + `.square: expected true or false, found "yes"`}},
		{"size search: steel ratio", lift + "design:\n  size_search: {step: 25, min: 250, max: 500, steel_ratio_max: 0.1}\n", []string{
			ss + ".steel_ratio_max: the largest steel ratio As/Ac must lie between 0.002 and 0.08, found 0.1"}},
		{"size search: bad sizes", lift + "design:\n  size_search:\n    sizes:\n      - [300]\n      - 300\n      - [300, 0]\n      - {b: 300}\n      - [300 mm, 350]\n      - [0.3 m, 350 mm]\n", []string{
			"in.yaml:14: design.size_search.sizes[0]: expected a section [b, h] of two lengths, e.g. [350 mm, 450 mm], found a list of 1 item",
			`in.yaml:15: design.size_search.sizes[1]: expected a section [b, h] of two lengths, e.g. [350 mm, 450 mm], found "300"`,
			"in.yaml:16: design.size_search.sizes[2][1]: 0 mm is outside the plausible range of the section side, 150 mm to 3000 mm (see the input limits in the README)",
			"in.yaml:17: design.size_search.sizes[3].h: is required but missing (give the section as [b, h] or {b: 350 mm, h: 450 mm})",
			"in.yaml:19: design.size_search.sizes[5]: the section 300 × 350 mm is listed twice (first at design.size_search.sizes[4])"}},
		{"size search: empty sizes", lift + "design:\n  size_search: {sizes: []}\n", []string{
			ss + ".sizes: the list is empty; give at least one of the sections [b, h]"}},
		{"size search: not a mapping", lift + "design:\n  size_search: [300, 300]\n", []string{
			ss + ": expected a mapping with the keys sizes, step, min, max, square, steel_ratio_max, found a list"}},
		{"size search: unknown key", lift + "design:\n  size_search: {step: 25, min: 250, max: 500, rho_max: 0.02}\n", []string{
			ss + ".rho_max: unknown key (known here: sizes, step, min, max, square, steel_ratio_max)"}},
		{"creep: humidity", lift + "        creep: {rh: 5, t0: 28}\n      - name: L2\n        l0: 3 m\n        NEd: 10\n        creep: {rh: 101, t0: 28}\n", []string{
			creep + ".rh: the relative humidity must lie between 10 and 100 %, found 5",
			"in.yaml:15: columns[0].storeys[1].creep.rh: the relative humidity must lie between 10 and 100 %, found 101"}},
		{"creep: humidity as a fraction", lift + "        creep: {rh: 0.5, t0: 28}\n", []string{
			creep + ".rh: the relative humidity must lie between 10 and 100 %, found 0.5"}},
		{"creep: humidity per cent not a number", lift + "        creep: {rh: \"5 m %\", t0: 28}\n", []string{
			creep + `.rh: "5 m %": give the relative humidity in %, e.g. 50 or "50 %"`}},
		{"creep: age zero", lift + "        creep: {rh: 50, t0: 0 days}\n", []string{
			creep + ".t0: the age at loading must be greater than 0 days, found 0"}},
		{"creep: age negative", lift + "        creep: {rh: 50, t0: -3 d}\n", []string{
			creep + ".t0: the age at loading must be greater than 0 days, found -3"}},
		{"creep: age negative plain", lift + "        creep: {rh: 50, t0: -3}\n", []string{
			creep + ".t0: the age at loading must be greater than 0 days, found -3"}},
		{"creep: age in hours", lift + "        creep: {rh: 50, t0: 28 h}\n", []string{
			creep + `.t0: "28 h": unexpected name h (an operator is missing?); give the age in days: 28, "28 d" or "28 days"`}},
		{"creep: age as a length", lift + "        creep: {rh: 50, t0: 28 mm}\n", []string{
			creep + `.t0: "28 mm" is a length, expected a pure number; give the age in days: 28, "28 d" or "28 days"`}},
		{"creep: age not finite", lift + "        creep: {rh: 50, t0: 1e999 d}\n", []string{
			creep + `.t0: "1e999 d" is not a finite number of days`}},
		{"creep: age a list", lift + "        creep: {rh: 50, t0: [28]}\n", []string{
			creep + `.t0: expected an age in days such as 28 or "28 d", found a list`}},
		{"creep: cement", lift + "        creep: {rh: 50, t0: 28, cement: CEM I}\n", []string{
			creep + `.cement: "CEM I" is not a cement class of EN 1992-1-1 3.1.2(6) (one of S, N, R)`}},
		{"creep: ratio", lift + "        creep: {rh: 50, t0: 28, ratio: 1.5}\n      - name: L2\n        l0: 3 m\n        NEd: 10\n        creep: {rh: 50, t0: 28, ratio: -0.1}\n", []string{
			creep + ".ratio: the ratio M0Eqp/M0Ed must lie between 0 and 1, found 1.5",
			"in.yaml:15: columns[0].storeys[1].creep.ratio: the ratio M0Eqp/M0Ed must lie between 0 and 1, found -0.1"}},
		{"creep: required keys", lift + "        creep: {cement: N}\n", []string{
			creep + ".rh: is required but missing (the relative humidity of the ambient environment in %, e.g. rh: 50)",
			creep + ".t0: is required but missing (the age of the concrete at loading in days, e.g. t0: 28 d)"}},
		{"creep: unknown key", lift + "        creep: {rh: 50, t0: 28, h0: 200}\n", []string{
			creep + ".h0: unknown key (known here: rh, t0, cement, ratio)"}},
		{"creep: not a mapping", lift + "        creep: 1.2\n", []string{
			creep + `: expected a mapping with the keys rh, t0, cement, ratio, found "1.2"`}},
		{"creep and phi_ef", lift + "        phi_ef: 0.8\n        creep: {rh: 50, t0: 28}\n", []string{
			"in.yaml:12: columns[0].storeys[0].creep: give phi_ef or creep, not both"}},
		{"building: effective length", building + "  effective_length: eq-5.15\n", []string{
			`in.yaml:11: building.effective_length: "eq-5.15" is not one of frame, factor`}},
		{"building: l0_factor with frame", building + "  effective_length: frame\n  l0_factor: 0.85\n", []string{
			"in.yaml:12: building.l0_factor: applies to effective_length: factor; with frame the effective lengths come from EN 1992-1-1 Eq. (5.15)"}},
		{"building: creep ratio", building + "  creep: {rh: 50, t0: 28, ratio: 0.6}\n", []string{
			"in.yaml:11: building.creep.ratio: is derived from the quasi-permanent combination in the building form; leave it out"}},
		{"building: creep faults", building + "  creep: {rh: 200, cement: X}\n", []string{
			"in.yaml:11: building.creep.rh: the relative humidity must lie between 10 and 100 %, found 200",
			"in.yaml:11: building.creep.t0: is required but missing (the age of the concrete at loading in days, e.g. t0: 28 d)",
			`in.yaml:11: building.creep.cement: "X" is not a cement class of EN 1992-1-1 3.1.2(6) (one of S, N, R)`}},
	}
	for _, c := range cases {
		expectErrors(t, c.name, c.text, c.want)
	}
}

// expectErrors fails t unless text, read as in.yaml, gives exactly the faults want, in order.
func expectErrors(t *testing.T, name, text string, want []string) {
	t.Helper()
	_, err := Parse("in.yaml", []byte(text))
	var es Errors
	if !errors.As(err, &es) {
		t.Errorf("%s: error %v is not Errors", name, err)
		return
	}
	if got := err.Error(); got != strings.Join(want, "\n") {
		t.Errorf("%s:\n got: %s\nwant: %s", name, strings.ReplaceAll(got, "\n", "\n      "), strings.Join(want, "\n      "))
	}
}
