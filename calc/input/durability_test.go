package input

import (
	"reflect"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// durable returns the default durability data with the exposure classes ex.
func durable(ex ...string) *model.Durability {
	return &model.Durability{Exposure: ex, StructuralClass: 4, DesignLife: 50}
}

func mmPtr(v float64) *float64 { return &v }

// The durability data parse into the model with the defaults of EN 1992-1-1 4.4.1 (structural
// class S4 for 50 years, Table 4.3N; Δcdur,γ = 0, 4.4.1.2(6)); Δcdev stays unset when not given
// (the engine takes the recommended 10 mm, 4.4.1.3(1)P) and a given value, 0 included, is kept
// as given (4.4.1.3(3) allows 0 to 10 mm); a column's entry overrides design.durability key by key.
func TestParseDurability(t *testing.T) {
	with := func(d *model.Durability, edit func(*model.Durability)) *model.Durability {
		edit(d)
		return d
	}
	cases := []struct {
		name, extra  string
		design, col  *model.Durability
		colInherits  bool // the column has no entry of its own
		columnsLevel bool // extra goes under the column, not at the top level
	}{
		{"not given", "", nil, nil, true, false},
		{"one class", "design: {durability: {exposure: XC3}}\n", durable("XC3"), nil, true, false},
		{"all keys", "design:\n  durability: {exposure: [XC3, XD1], structural_class: 4, design_life: 50, special_qc: false, delta_cdev: 10 mm, delta_cdur_gamma: 0 mm}\n",
			with(durable("XC3", "XD1"), func(d *model.Durability) { d.DeltaCdev = mmPtr(10) }), nil, true, false},
		{"other values, lower case, units", "design:\n  durability: {exposure: [xs1, xf3], structural_class: S5, design_life: 100 years, special_qc: true, delta_cdev: 0.5 cm, delta_cdur_gamma: 5}\n",
			with(durable("XS1", "XF3"), func(d *model.Durability) {
				d.StructuralClass, d.DesignLife, d.SpecialQC, d.DeltaCdev, d.DeltaCdurGamma = 5, 100, true, mmPtr(5), 5
			}), nil, true, false},
		{"limits", "design:\n  durability: {exposure: X0, structural_class: 1, design_life: 10, delta_cdev: 0, delta_cdur_gamma: 20 mm}\n",
			with(durable("X0"), func(d *model.Durability) {
				d.StructuralClass, d.DesignLife, d.DeltaCdev, d.DeltaCdurGamma = 1, 10, mmPtr(0), 20
			}), nil, true, false},
		{"design life over the vars", "vars: {life: 60}\ndesign: {durability: {exposure: XC1, design_life: \"life + 40\"}}\n",
			with(durable("XC1"), func(d *model.Durability) { d.DesignLife = 100 }), nil, true, false},
		{"every class of Table 4.1", "design:\n  durability: {exposure: [" + strings.Join(exposureClasses[1:], ", ") + "]}\n",
			durable(exposureClasses[1:]...), nil, true, false},
		{"column alone", "    durability: {exposure: XC4, design_life: 75 yr}\n", nil,
			with(durable("XC4"), func(d *model.Durability) { d.DesignLife = 75 }), false, true},
		{"column over design, key by key", "    durability: {exposure: [XD3], structural_class: 3}\ndesign:\n  durability: {exposure: XC1, special_qc: true, delta_cdev: 5 mm}\n",
			with(durable("XC1"), func(d *model.Durability) { d.SpecialQC, d.DeltaCdev = true, mmPtr(5) }),
			with(durable("XD3"), func(d *model.Durability) { d.SpecialQC, d.DeltaCdev, d.StructuralClass = true, mmPtr(5), 3 }), false, true},
		{"column without exposure inherits it", "    durability: {delta_cdur_gamma: 5 mm}\ndesign:\n  durability: {exposure: [XC3, XD1]}\n",
			durable("XC3", "XD1"), with(durable("XC3", "XD1"), func(d *model.Durability) { d.DeltaCdurGamma = 5 }), false, true},
	}
	for _, c := range cases {
		text := lift + c.extra
		if !c.columnsLevel && c.extra != "" {
			text = c.extra + lift
		}
		in, err := Parse("in.yaml", []byte(text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if got := in.Options.Durability; !reflect.DeepEqual(got, c.design) {
			t.Errorf("%s: design %+v, want %+v", c.name, got, c.design)
		}
		col := in.Columns[0].Durability
		switch {
		case c.colInherits && col != nil:
			t.Errorf("%s: column %+v, want none of its own", c.name, col)
		case !c.colInherits && !reflect.DeepEqual(col, c.col):
			t.Errorf("%s: column %+v, want %+v", c.name, col, c.col)
		}
	}
}

// The fire data parse into the model: the rating in minutes, ηfi 0 when not given (the engine
// takes 0.7, EN 1992-1-2 2.4.2(3)), μfi = ηfi unless mu_fi: computed.
func TestParseFire(t *testing.T) {
	cases := []struct {
		name, extra string
		design, col *model.Fire
	}{
		{"not given", "", nil, nil},
		{"the form of the brief", "design: {fire: {rating: R90, eta_fi: 0.7, mu_fi: computed}}\n", &model.Fire{Rating: 90, EtaFi: 0.7, UseMuFi: true}, nil},
		{"rating only", "design: {fire: {rating: R60}}\n", &model.Fire{Rating: 60}, nil},
		{"minutes, mu_fi eta_fi", "design: {fire: {rating: 120, eta_fi: 0.65, mu_fi: eta_fi}}\n", &model.Fire{Rating: 120, EtaFi: 0.65}, nil},
		{"quoted minutes", "design: {fire: {rating: \"240 min\"}}\n", &model.Fire{Rating: 240}, nil},
		{"lower case, a space", "design: {fire: {rating: r 30, eta_fi: 1}}\n", &model.Fire{Rating: 30, EtaFi: 1}, nil},
		{"R180, eta_fi in per cent", "design: {fire: {rating: R180, eta_fi: 30 %}}\n", &model.Fire{Rating: 180, EtaFi: 0.3}, nil},
		{"none", "design: {fire: {rating: none}}\n", &model.Fire{}, nil},
		{"column alone", "    fire: {rating: R120}\n", nil, &model.Fire{Rating: 120}},
		{"column over design", "    fire: {rating: R30}\ndesign: {fire: {rating: R90, eta_fi: 0.6, mu_fi: computed}}\n",
			&model.Fire{Rating: 90, EtaFi: 0.6, UseMuFi: true}, &model.Fire{Rating: 30, EtaFi: 0.6, UseMuFi: true}},
		{"column switches mu_fi back", "    fire: {mu_fi: eta_fi}\ndesign: {fire: {rating: R90, mu_fi: computed}}\n",
			&model.Fire{Rating: 90, UseMuFi: true}, &model.Fire{Rating: 90}},
		{"verified elsewhere", "design: {fire: {rating: R120, method: elsewhere, note: \" zone method, calc F-7 \"}}\n",
			&model.Fire{Rating: 120, Method: model.FireElsewhere, Note: "zone method, calc F-7"}, nil},
		{"column elsewhere over Method A", "    fire: {method: Elsewhere, note: tested}\ndesign: {fire: {rating: R90, method: method A}}\n",
			&model.Fire{Rating: 90, Method: model.FireMethodA}, &model.Fire{Rating: 90, Method: model.FireElsewhere, Note: "tested"}},
		{"column back to Method A drops the note", "    fire: {method: a}\ndesign: {fire: {rating: R90, method: elsewhere, note: tested}}\n",
			&model.Fire{Rating: 90, Method: model.FireElsewhere, Note: "tested"}, &model.Fire{Rating: 90, Method: model.FireMethodA}},
	}
	for _, c := range cases {
		text := lift + c.extra
		if strings.HasPrefix(c.extra, "design:") {
			text = c.extra + lift
		}
		in, err := Parse("in.yaml", []byte(text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if got := in.Options.Fire; !reflect.DeepEqual(got, c.design) {
			t.Errorf("%s: design %+v, want %+v", c.name, got, c.design)
		}
		if got := in.Columns[0].Fire; !reflect.DeepEqual(got, c.col) {
			t.Errorf("%s: column %+v, want %+v", c.name, got, c.col)
		}
	}
}

// building3 is building with a third storey, so that fire ratings can differ by level.
var building3 = strings.Replace(building, "    - {name: R, height: 3.3 m}\n", "    - {name: L2, height: 3.3 m}\n    - {name: R, height: 3.3 m}\n", 1)

// The fire ratings by level of the building form parse into Building.Fires over design.fire.
func TestParseFireLevels(t *testing.T) {
	cases := []struct {
		name, extra string
		want        []model.FireLevels
	}{
		{"not given", "", nil},
		{"the form of the brief", "  fire_levels:\n    - {levels: [L1, L2], rating: R120, eta_fi: 0.7, mu_fi: computed}\n",
			[]model.FireLevels{{Levels: []string{"L1", "L2"}, Fire: model.Fire{Rating: 120, EtaFi: 0.7, UseMuFi: true}, Line: 13}}},
		{"two entries, one level alone", "  fire_levels:\n    - {levels: L1, rating: 90}\n    - {levels: [R, L2], rating: R60}\n",
			[]model.FireLevels{
				{Levels: []string{"L1"}, Fire: model.Fire{Rating: 90}, Line: 13},
				{Levels: []string{"R", "L2"}, Fire: model.Fire{Rating: 60}, Line: 14}}},
		{"over design.fire", "design: {fire: {rating: R60, eta_fi: 0.5, mu_fi: computed}}\n",
			[]model.FireLevels{
				{Levels: []string{"L1"}, Fire: model.Fire{Rating: 120, EtaFi: 0.5, UseMuFi: true}, Line: 14},
				{Levels: []string{"R"}, Fire: model.Fire{EtaFi: 0.5, UseMuFi: true}, Line: 15}}},
	}
	for _, c := range cases {
		text := building3 + c.extra
		if strings.HasPrefix(c.extra, "design:") {
			text = c.extra + building3 + "  fire_levels:\n    - {levels: L1, rating: R120}\n    - {levels: R, rating: none}\n"
		}
		in, err := Parse("in.yaml", []byte(text))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if got := in.Building.Fires; !reflect.DeepEqual(got, c.want) {
			t.Errorf("%s:\n got %+v\nwant %+v", c.name, got, c.want)
		}
	}
}

func TestDurabilityFireErrors(t *testing.T) {
	const dur = "in.yaml:1: design.durability"
	const fire = "in.yaml:1: design.fire"
	const fl = "in.yaml:13: building.fire_levels"
	classes := strings.Join(exposureClasses, ", ")
	ratings := "(one of R30, R60, R90, R120, R180, R240, or the same in minutes; none for no fire check)"
	cases := []struct {
		name, text string
		want       []string
	}{
		{"unknown exposure class", "design: {durability: {exposure: [XC3, XC5]}}\n" + lift, []string{
			dur + `.exposure[1]: "XC5" is not an exposure class of EN 1992-1-1 Table 4.1 (one of ` + classes + ")"}},
		{"unknown single class", "design: {durability: {exposure: XF}}\n" + lift, []string{
			dur + `.exposure: "XF" is not an exposure class of EN 1992-1-1 Table 4.1 (one of ` + classes + ")"}},
		{"class twice", "design: {durability: {exposure: [XC3, xc3]}}\n" + lift, []string{
			dur + ".exposure[1]: XC3 is listed twice"}},
		{"X0 with others", "design: {durability: {exposure: [X0, XC1]}}\n" + lift, []string{
			dur + ".exposure: X0 (no risk of corrosion or attack) does not go with other classes; give X0 alone or leave it out"}},
		{"no classes", "design: {durability: {exposure: []}}\n" + lift, []string{
			dur + ".exposure: the list is empty; give at least one of the exposure classes"}},
		{"exposure missing", "design: {durability: {design_life: 50}}\n" + lift, []string{
			dur + ".exposure: is required but missing (the exposure classes of EN 1992-1-1 Table 4.1, e.g. exposure: [XC3, XD1])"}},
		{"exposure missing in a column without design.durability", lift + "    durability: {structural_class: 3}\n", []string{
			"in.yaml:11: columns[0].durability.exposure: is required but missing (the exposure classes of EN 1992-1-1 Table 4.1, e.g. exposure: [XC3, XD1])"}},
		{"durability values", "design:\n  durability:\n    exposure: XC1\n    structural_class: 0\n    design_life: 300\n    special_qc: 1\n    delta_cdev: 25 mm\n    delta_cdur_gamma: -5\n" + lift, []string{
			"in.yaml:4: design.durability.structural_class: the structural class must be a whole number from 1 to 6 (S1 to S6, EN 1992-1-1 4.4.1.2(5)), found 0",
			"in.yaml:5: design.durability.design_life: the design working life must lie between 10 and 200 years, found 300",
			`in.yaml:6: design.durability.special_qc: expected true or false, found "1"`,
			"in.yaml:7: design.durability.delta_cdev: the allowance for deviation Δcdev (EN 1992-1-1 4.4.1.3(1)P) must lie between 0 and 20 mm, found 25 mm",
			"in.yaml:8: design.durability.delta_cdur_gamma: the additive safety element Δcdur,γ (EN 1992-1-1 4.4.1.2(6)) must lie between 0 and 20 mm, found -5 mm"}},
		{"durability units", "design: {durability: {exposure: XC1, structural_class: S7, design_life: 50 d, delta_cdev: 10 kN}}\n" + lift, []string{
			dur + ".structural_class: the structural class must be a whole number from 1 to 6 (S1 to S6, EN 1992-1-1 4.4.1.2(5)), found 7",
			dur + `.design_life: "50 d": unexpected name d (an operator is missing?); give the design working life in years: 50 or "50 years"`,
			dur + `.delta_cdev: "10 kN" is a force, expected a length`}},
		{"structural class not whole", "design: {durability: {exposure: XC1, structural_class: 3.5}}\n" + lift, []string{
			dur + ".structural_class: the structural class must be a whole number from 1 to 6 (S1 to S6, EN 1992-1-1 4.4.1.2(5)), found 3.5"}},
		{"durability unknown key", "design: {durability: {exposure: XC1, cmin: 25 mm}}\n" + lift, []string{
			dur + ".cmin: unknown key (known here: " + strings.Join(durabilityKeys, ", ") + ")"}},
		{"durability not a mapping", "design: {durability: XC3}\n" + lift, []string{
			dur + `: expected a mapping with the keys ` + strings.Join(durabilityKeys, ", ") + `, found "XC3"`}},
		{"rating R75", "design: {fire: {rating: R75}}\n" + lift, []string{
			fire + `.rating: "R75" is not a standard fire resistance of EN 1992-1-2 Table 5.2a ` + ratings}},
		{"rating 45 minutes", "design: {fire: {rating: 45}}\n" + lift, []string{
			fire + `.rating: "45" is not a standard fire resistance of EN 1992-1-2 Table 5.2a ` + ratings}},
		{"rating REI90", "design: {fire: {rating: REI90}}\n" + lift, []string{
			fire + `.rating: "REI90" is not a standard fire resistance of EN 1992-1-2 Table 5.2a ` + ratings}},
		{"rating a list", "design: {fire: {rating: [R90]}}\n" + lift, []string{
			fire + ".rating: expected a standard fire resistance such as R90 or 90 (minutes), found a list"}},
		{"rating missing", "design: {fire: {eta_fi: 0.7}}\n" + lift, []string{
			fire + ".rating: is required but missing (the standard fire resistance, e.g. rating: R90)"}},
		{"eta_fi out of range", "design: {fire: {rating: R90, eta_fi: 0.2}}\n" + lift + "    fire: {eta_fi: 1.1}\n", []string{
			fire + ".eta_fi: the reduction factor ηfi (EN 1992-1-2 2.4.2) must lie between 0.3 and 1, found 0.2",
			"in.yaml:12: columns[0].fire.eta_fi: the reduction factor ηfi (EN 1992-1-2 2.4.2) must lie between 0.3 and 1, found 1.1"}},
		{"mu_fi", "design: {fire: {rating: R90, mu_fi: true}}\n" + lift + "    fire: {rating: R60, mu_fi: eta}\n", []string{
			fire + `.mu_fi: "true" is not one of computed, eta_fi`,
			`in.yaml:12: columns[0].fire.mu_fi: "eta" is not one of computed, eta_fi`}},
		{"fire unknown key", lift + "    fire: {rating: R60, exposure: 3}\n", []string{
			"in.yaml:11: columns[0].fire.exposure: unknown key (known here: rating, eta_fi, mu_fi, method, note)"}},
		{"method unknown", "design: {fire: {rating: R90, method: B}}\n" + lift, []string{
			fire + `.method: "B" is not a method of verifying the fire resistance (A: EN 1992-1-2 5.3.2 Method A, checked here, the default; elsewhere: verified by another method, recorded with a note)`}},
		{"elsewhere without a note", "design: {fire: {rating: R90, method: elsewhere}}\n" + lift, []string{
			fire + `.note: is required with method: elsewhere (how and where the fire resistance was verified, e.g. note: "zone method, calc F-7")`}},
		{"note empty", "design: {fire: {rating: R90, method: elsewhere, note: \" \"}}\n" + lift, []string{
			fire + ".note: is empty; say how and where the fire resistance was verified"}},
		{"note with Method A", "design: {fire: {rating: R90, note: tested}}\n" + lift + "    fire: {method: A, note: [x]}\n", []string{
			fire + ".note: goes with method: elsewhere only (Method A, the default, is checked here)",
			"in.yaml:12: columns[0].fire.note: expected a text, found a list"}},
		{"elsewhere in a fire level without a note", building3 + "  fire_levels:\n    - {levels: L1, rating: R60, method: elsewhere}\n", []string{
			fl + `[0].note: is required with method: elsewhere (how and where the fire resistance was verified, e.g. note: "zone method, calc F-7")`}},
		{"unknown level", building3 + "  fire_levels:\n    - {levels: [L1, L3], rating: R60}\n", []string{
			fl + `[0].levels[1]: "L3" is not a storey level (levels: L1, L2, R)`}},
		{"level in two entries", building3 + "  fire_levels:\n    - {levels: [L1, L2], rating: R60}\n    - {levels: [L2], rating: R90}\n    - {levels: [R, L1], rating: R30}\n", []string{
			"in.yaml:14: building.fire_levels[1].levels: level L2 is given by building.fire_levels[0] and building.fire_levels[1]",
			"in.yaml:15: building.fire_levels[2].levels: level L1 is given by building.fire_levels[0] and building.fire_levels[2]"}},
		{"level twice in an entry", building3 + "  fire_levels:\n    - {levels: [L1, L1], rating: R60}\n", []string{
			fl + "[0].levels[1]: level L1 is listed twice"}},
		{"fire level faults", building3 + "  fire_levels:\n    - {rating: R75, eta_fi: 2, mu_fi: computed, storeys: [L1]}\n", []string{
			fl + "[0].storeys: unknown key (known here: levels, rating, eta_fi, mu_fi, method, note)",
			fl + "[0].levels: is required but missing (the levels of this rating, e.g. levels: [L1, L2]; design.fire serves the others)",
			fl + `[0].rating: "R75" is not a standard fire resistance of EN 1992-1-2 Table 5.2a ` + ratings,
			fl + "[0].eta_fi: the reduction factor ηfi (EN 1992-1-2 2.4.2) must lie between 0.3 and 1, found 2"}},
		{"fire level without rating or design.fire", building3 + "  fire_levels: [{levels: R}]\n", []string{
			"in.yaml:12: building.fire_levels[0].rating: is required but missing (the standard fire resistance, e.g. rating: R90)"}},
		{"fire levels empty", building3 + "  fire_levels: []\n", []string{
			"in.yaml:12: building.fire_levels: the list is empty; give at least one of the fire ratings by level"}},
		{"building durability", building3 + "  durability: {exposure: XC1}\n", []string{
			"in.yaml:12: building.durability: the durability of the building's columns is given under design.durability; move it there"}},
		{"building fire", building3 + "  fire: {rating: R60}\n", []string{
			"in.yaml:12: building.fire: the fire resistance is given under design.fire (every level) and building.fire_levels (some levels)"}},
	}
	for _, c := range cases {
		expectErrors(t, c.name, c.text, c.want)
	}
}
