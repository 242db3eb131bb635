// Package input reads an input file (YAML, the actions form or the building form) into a
// validated model.Input.
//
// Every numeric field takes a plain number in its documented unit or a text with a unit or
// an expression over the names under vars (see package quantity). Plain numbers are in these
// units: all lengths, covers, effective lengths and diameters mm; forces kN; moments kNm;
// stresses MPa; area loads kN/m2; line loads kN/m; weight densities kN/m3; code overrides in
// the unit their catalogue entry states (a pure number if none).
// Each quantity lies within its range of plausibility (Limits, listed in the README).
// Unknown keys are faults, and all faults of a file are reported together as Errors.
//
// The keys, with their defaults where optional:
//
//	project:   {title, job, revision, designer, checker, date}      texts, all optional
//	code:      {annex: recommended, overrides: {NAME: value}}       names from code.Catalogue
//	materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}  concrete required (Table 3.1)
//	design:    {stress_block: parabola-rectangle, imperfection: inclination, members: 1,
//	            bar_diameters: [12, 16, 20, 25, 32, 40], link_diameters: [8, 10, 12],
//	            link_spacing_step: 25 mm, lap_step: 25 mm, lap_above_floor: 0 mm, second_order: nominal-curvature (or nominal-stiffness,
//	            both), biaxial: "5.39" (or exact), cracked_stiffness: 0.5 (0.1 to 1), size_search,
//	            durability, fire, selection, typical}
//	selection: {least_bar: 12 mm, least_bar_wide: 16 mm (where min(b, h) ≥ wide_from), wide_from:
//	            300 mm, vibrator_gap: 75 mm (0 to 150; 0: none), labour_per_bar: 2 (kg of steel),
//	            labour_per_tie: 1 (kg of steel per tie piece), costed: 12 (2 to 100)}
//	typical:   {on: true, tolerance: 10 % (0 to 100)}; applies to the building form
//	size_search: {sizes: [[b, h], ...]} tried in order, or {step, min, max, square: false};
//	            either way steel_ratio_max: 0.04 (0.002 to 0.08)
//	vars:      {NAME: quantity or expression}
//	durability: {exposure: a class or a list of EN 1992-1-1 Table 4.1 (X0 alone), required;
//	            structural_class: 4 (1 to 6 or S1 to S6), design_life: 50 (10 to 200 years),
//	            special_qc: false, delta_cdev: 10 mm (0 to 20), delta_cdur_gamma: 0 mm (0 to 20)}
//	fire:      {rating: R30, R60, R90, R120, R180 or R240 (or the minutes; none for no check),
//	            required; eta_fi: 0 (the engine's 0.7; else 0.3 to 1), mu_fi: eta_fi (or computed),
//	            method: A (EN 1992-1-2 5.3.2, checked here) or elsewhere (verified by another
//	            method: recorded, not checked), note: text, required with method: elsewhere only}
//	columns:   list of {id, b, h, cover, bars: {count, dia}, link_dia, durability, fire, storeys};
//	            a column's durability and fire override design.durability and design.fire key
//	            by key, so that what the column leaves out (the exposure, the rating) is inherited;
//	            a circular column gives D (its diameter) instead of b and h, with shape: circle
//	            or alone (shape: rectangle, the default, takes b and h), helix: false (true: the
//	            bars are bound by a helix; circles only), and given bars of at least
//	            six, evenly on its circle
//	storeys:   list of {name, l0: {y, z} or one value, length, NEd,
//	            M: {y: {top, bottom}, z: {top, bottom}}, cases, phi_ef or creep};
//	            NEd and M are the one case "1" of the lift; or instead
//	cases:     list of {name, NEd, M: {y: {top, bottom}, z: {top, bottom}}, V: {y, z}}, the load
//	            cases of the lift in order, names unique in the lift; M optional (0), V optional
//	            (each of y and z), V.y the shear that goes with bending about y
//	moment_signs: face (the default: equal signs are tension on the same face) or member-ends
//	            (clockwise positive at both ends, the column's bottom the start of the member, as
//	            analysis programs export them); for every end moment of the YAML file and the
//	            actions table alike, held in the model in the face convention (see FaceEnds)
//	actions:   FILE.csv, a table of the cases of every lift of columns:, relative to the folder
//	            of the input file; its lifts then give no NEd, M or cases. The header names the
//	            columns in any order: column, lift, case, NEd_kN, My_top_kNm, My_bottom_kNm,
//	            Mz_top_kNm, Mz_bottom_kNm (required), Vy_kN, Vz_kN (optional; empty: not given);
//	            others are warned of and left unread. Cells are separated by "," or ";" (with ";",
//	            decimal commas are read); a UTF-8 byte order mark, CRLF and quoted cells too.
//
// NEd is compression positive; a negative NEd is tension.
//
//	creep:     {rh (%, 10 to 100), t0 (days: 28, "28 d" or "28 days"), cement: N (S, N or R),
//	            ratio (M0Eqp/M0Ed, 0 to 1; 0 when not given)}
//
// A file gives either columns (the actions form) or building (the building form), not both:
//
//	building:  {storeys, grid, columns, beams, column_sizes, beam_sizes, floors, line_loads,
//	            omit, base: fixed, analysis: subframe, beam_stiffness: half, combination: 6.10,
//	            imposed_reduction: none, density: code density_rc or 25 kN/m3, l0_factor: 1,
//	            effective_length: factor (l0_factor × height; or frame, Eq. (5.15) without
//	            l0_factor), creep: {rh, t0, cement} (the ratio is derived), bars, fire_levels}
//	fire_levels: list of {levels, rating, eta_fi, mu_fi, method, note} over design.fire, key by key; levels
//	           required, no level in two entries. The durability is design.durability.
//	storeys:   list of {name, height}, lowest first, names unique
//	grid:      {x: [bay widths], y: [bay widths]}; lettered lines A, B, ..., Z, AA, ... at the x
//	           positions, numbered lines 1, 2, ... at the y positions; column ids such as B2
//	columns:   {b, h, cover: 40 mm}, h along building x, b along y, or for circular columns
//	           {D, cover} (shape and helix as under the actions form's columns); beams: {b, h}
//	column_sizes: list of {columns, levels, b, h} (or D, shape, helix as under columns: a
//	           building may mix circular and rectangular columns); beam_sizes: list of
//	           {levels, dir, lines, b, h}
//	floors:    list of {levels, gk, qk, category, spans}; every level in exactly one entry
//	line_loads: list of {levels, line, from, to, gk, qk, category}; with one end given the
//	           other is the end of the line, so from and to are both set or both empty
//
// A missing levels, columns or lines list means all of them; a single name may stand for a
// list of one. Where size overrides overlap, the later entry holds.
// Grid names are read without regard to case and stored upper-case and without leading zeros.
package input

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"time"

	"colsheet/calc/code"
	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/quantity"

	"gopkg.in/yaml.v3"
)

// Defaults of the design block.
var (
	DefaultBarDiameters  = []float64{12, 16, 20, 25, 32, 40} // mm
	DefaultLinkDiameters = []float64{8, 10, 12}              // mm: links of at least 8 mm, common practice
)

// Limits of the characteristic yield strength of reinforcement, EN 1992-1-1:2004 3.2.2(3)P, MPa.
const (
	FykMin = 400
	FykMax = 600
)

var yamlLine = regexp.MustCompile(`^yaml: line (\d+): (.*)$`)

// Parse reads the input file called file with contents data. On any fault it returns nil and
// Errors listing every fault found, in line order. It reads no other file: an input that names
// an actions table (actions: FILE.csv) is refused with a fault at that key; use ParseWith.
func Parse(file string, data []byte) (*model.Input, error) {
	return ParseWith(file, data, nil)
}

// ParseWith reads the input file called file with contents data, and the actions table it
// names, if any, through read; it drops the warnings (see ParseWarn).
func ParseWith(file string, data []byte, read func(name string) ([]byte, error)) (*model.Input, error) {
	in, _, err := ParseWarn(file, data, read)
	return in, err
}

// ParseWarn reads the input file called file with contents data, and the actions table it
// names, if any, through read; it returns the input, the warnings and, on any fault, a nil input
// and Errors listing every fault of both files (the input file's first, each in line order).
//
// read is given the table's name as written under actions: (a path relative to the folder of
// the input file) and returns the file's bytes; calc/ opens no files, so the caller decides how.
// The command line passes os.ReadFile(filepath.Join(filepath.Dir(inputPath), name)). A nil read
// reads nothing: an input with an actions table is then refused with a fault at actions.
func ParseWarn(file string, data []byte, read func(name string) ([]byte, error)) (*model.Input, []Warning, error) {
	sum := sha256.Sum256(data)
	if read == nil {
		read = readNothing
	}
	r := &reader{file: file, read: read, signs: model.SignsFace}
	in := r.parse(data)
	sortWarnings(r.warns, file)
	if len(r.errs) > 0 {
		r.errs.sortFrom(file)
		return nil, r.warns, r.errs
	}
	in.File = file
	in.SHA256 = hex.EncodeToString(sum[:])
	in.Source = string(data)
	return in, r.warns, nil
}

// errReadNothing is what readNothing answers.
var errReadNothing = errors.New("this program reads no file beside the input file (the command line does)")

// readNothing is the reader of Parse: it reads no file.
func readNothing(string) ([]byte, error) { return nil, errReadNothing }

func (r *reader) yamlError(err error) {
	line, msg := 1, strings.TrimPrefix(err.Error(), "yaml: ")
	if m := yamlLine.FindStringSubmatch(err.Error()); m != nil {
		line, _ = strconv.Atoi(m[1])
		msg = m[2]
	}
	r.errs = append(r.errs, Error{File: r.file, Line: line, Msg: "the file is not valid YAML: " + msg})
}

var topKeys = []string{"project", "code", "materials", "design", "vars", "moment_signs", "actions", "columns", "building"}

// tabs reports the lines of data that indent with a tab, which YAML does not allow and its
// parser reports at a later line; where tabs stand elsewhere, only when the parse fails. It
// reports whether it found any.
func (r *reader) tabs(data []byte, anywhere bool) bool {
	found := false
	for i, line := range bytes.Split(data, []byte("\n")) {
		indent := line[:len(line)-len(bytes.TrimLeft(line, " \t-"))]
		if bytes.IndexByte(indent, '\t') >= 0 || anywhere && bytes.IndexByte(line, '\t') >= 0 {
			r.errs = append(r.errs, Error{File: r.file, Line: i + 1, Msg: "tab character: use spaces"})
			found = true
		}
	}
	return found
}

func (r *reader) parse(data []byte) *model.Input {
	if r.tabs(data, false) {
		return nil
	}
	dec := yaml.NewDecoder(bytes.NewReader(data))
	var doc yaml.Node
	if err := dec.Decode(&doc); err != nil {
		if errors.Is(err, io.EOF) {
			r.fail(nil, "", "the file is empty; expected a mapping with at least materials and columns or building")
		} else if !r.tabs(data, true) {
			r.yamlError(err)
		}
		return nil
	}
	var second yaml.Node
	if err := dec.Decode(&second); err == nil {
		r.fail(&second, "", "the file holds more than one YAML document; give one per file")
	} else if !errors.Is(err, io.EOF) {
		r.yamlError(err)
	}
	if len(doc.Content) == 0 || isNull(doc.Content[0]) {
		r.fail(nil, "", "the file is empty; expected a mapping with at least materials and columns or building")
		return nil
	}
	root := resolve(doc.Content[0])
	if root.Kind != yaml.MappingNode {
		r.fail(root, "", "the top level must be a mapping with the keys %s, found %s", strings.Join(topKeys, ", "), kindName(root))
		return nil
	}
	top := r.fields(root, "", topKeys...)
	in := &model.Input{Code: code.Recommended()}

	defs, defNodes := r.vars(top)
	env, errs := quantity.NewEnv(defs)
	r.env = env
	for _, e := range errs {
		var de *quantity.DefError
		if errors.As(e, &de) {
			p := defNodes[de.Index]
			at := p.val
			if de.InName {
				at = p.key
			}
			r.fail(at, "vars."+de.Name, "%s", de.Err)
		}
	}

	if p, ok := top["project"]; ok {
		in.Project = r.project(p.val)
	}
	if p, ok := top["code"]; ok {
		in.Code = r.code(p.val)
	}
	if p, ok := top["materials"]; ok {
		in.Materials = r.materials(p.val)
	} else {
		r.fail(root, "materials", "is required but missing (e.g. materials: {concrete: C30/37})")
	}
	in.Options = r.design(top)
	bp, hasBuilding := top["building"]
	cp, hasColumns := top["columns"]
	in.MomentSigns = r.momentSigns(top, hasBuilding && !hasColumns)
	ap, hasTable := top["actions"]
	if hasTable && hasColumns {
		r.tableAsked, r.tableLine = true, ap.key.Line
		r.tableName, hasTable = r.tableNameOf(ap)
	} else if hasTable && hasBuilding {
		r.fail(ap.key, "actions", "an actions table gives the cases of the actions form (columns:); the building form derives its actions")
	}
	switch {
	case hasBuilding && hasColumns:
		r.fail(bp.key, "building", "a file gives either columns (the actions form, line %d) or building (the building form, line %d), not both", cp.key.Line, bp.key.Line)
	case hasBuilding:
		in.Building = r.building(bp.key, bp.val, in)
	case hasColumns:
		in.Columns = r.columns(cp.val, in.Options)
		if hasTable {
			in.Actions = r.actionsTable(ap, in.Columns)
		}
	default:
		r.fail(root, "columns", "is required but missing (give the columns with their actions under columns, or the building form under building)")
	}
	return in
}

// vars returns the definitions under vars with the entries they came from.
func (r *reader) vars(top map[string]pair) ([]quantity.Def, []pair) {
	p, ok := top["vars"]
	if !ok {
		return nil, nil
	}
	n := resolve(p.val)
	if n.Kind != yaml.MappingNode {
		r.fail(n, "vars", "expected a mapping of names to quantities, found %s", kindName(n))
		return nil, nil
	}
	var defs []quantity.Def
	var from []pair
	for _, e := range r.entries(n, "vars", true) {
		path := "vars." + e.name
		if isNull(e.val) {
			r.fail(e.key, path, "has no value (give a number or a quantity, e.g. %s: 350 mm)", e.name)
			continue
		}
		v := resolve(e.val)
		if v.Kind != yaml.ScalarNode {
			r.fail(v, path, "expected a number or a quantity, found %s", kindName(v))
			continue
		}
		text := v.Value
		switch v.ShortTag() {
		case "!!int", "!!float":
			var x float64
			if err := v.Decode(&x); err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
				r.fail(v, path, "%q is not a finite number", v.Value)
				continue
			}
			text = strconv.FormatFloat(x, 'g', -1, 64)
		case "!!str":
		default:
			r.fail(v, path, "expected a number or a quantity, found %q", v.Value)
			continue
		}
		defs = append(defs, quantity.Def{Name: e.name, Text: text})
		from = append(from, e)
	}
	return defs, from
}

func (r *reader) project(n *yaml.Node) model.Project {
	var p model.Project
	f := r.fields(n, "project", "title", "job", "revision", "designer", "checker", "date")
	set := func(key string, dst *string) {
		if e, ok := f[key]; ok {
			if s, ok := r.str(e.val, "project."+key); ok {
				*dst = s
			}
		}
	}
	set("title", &p.Title)
	set("job", &p.Job)
	set("revision", &p.Revision)
	set("designer", &p.Designer)
	set("checker", &p.Checker)
	set("date", &p.Date)
	if e, ok := f["date"]; ok && p.Date != "" {
		if _, err := time.Parse("2006-01-02", p.Date); err != nil {
			r.fail(e.val, "project.date", "%q is not a date of the form 2026-12-01", p.Date)
			p.Date = ""
		}
	}
	return p
}

// overrideUnit returns the documented unit of a code parameter, taken from the end of its
// description ("..., mm", "..., N/mm³"); a pure number when it names none.
func overrideUnit(c code.Param) string {
	i := strings.LastIndex(c.What, ", ")
	if i < 0 {
		return ""
	}
	u := c.What[i+2:]
	if q, ok := quantity.LookupUnit(u); ok && q.Dim != quantity.Number {
		return u
	}
	return ""
}

func (r *reader) code(n *yaml.Node) code.Params {
	params := code.Recommended()
	f := r.fields(n, "code", "annex", "overrides")
	if e, ok := f["annex"]; ok {
		if s, ok := r.str(e.val, "code.annex"); ok && s != params.Annex {
			r.fail(e.val, "code.annex", "annex %q is not supported (supported: %s)", s, params.Annex)
		}
	}
	e, ok := f["overrides"]
	if !ok {
		return params
	}
	m := resolve(e.val)
	if m.Kind != yaml.MappingNode {
		r.fail(m, "code.overrides", "expected a mapping of parameter names to values, found %s", kindName(m))
		return params
	}
	for _, o := range r.entries(m, "code.overrides", true) {
		path := "code.overrides." + o.name
		if isNull(o.val) {
			r.fail(o.key, path, "has no value (give the parameter's value, or leave the key out for the recommended one)")
			continue
		}
		c, known := code.Lookup(o.name)
		if !known {
			_, err := params.Override(o.name, 0)
			r.fail(o.key, path, "%s", err)
			continue
		}
		v, ok := r.number(o.val, path, overrideUnit(c))
		if !ok {
			continue
		}
		q, err := params.Override(o.name, v)
		if err != nil {
			r.fail(o.val, path, "%s", err)
			continue
		}
		params = q
	}
	return params
}

func (r *reader) materials(n *yaml.Node) model.Materials {
	m := model.Materials{Fyk: 500, Aggregate: 20}
	f := r.fields(n, "materials", "concrete", "fyk", "aggregate")
	if f == nil {
		return m
	}
	if e, ok := f["concrete"]; ok {
		if s, ok := r.str(e.val, "materials.concrete"); ok {
			c, found := material.Lookup(s)
			if found {
				m.Concrete = c
			} else {
				r.fail(e.val, "materials.concrete", "%q is not a strength class of EN 1992-1-1 Table 3.1 (classes: %s)", s, material.ClassNames())
			}
		}
	} else {
		r.fail(n, "materials.concrete", "is required but missing (e.g. concrete: C30/37)")
	}
	if e, ok := f["fyk"]; ok {
		if v, ok := r.number(e.val, "materials.fyk", "MPa"); ok {
			if v < FykMin || v > FykMax {
				r.fail(e.val, "materials.fyk", "%s is outside %d to %d MPa (EN 1992-1-1 3.2.2(3)P)", show(v, "MPa"), FykMin, FykMax)
			} else {
				m.Fyk = v
			}
		}
	}
	if e, ok := f["aggregate"]; ok {
		if v, ok := r.plausible(e.val, "materials.aggregate", LimitAggregate); ok {
			m.Aggregate = v
		}
	}
	return m
}

// positive reads a number that must be greater than zero.
func (r *reader) positive(n *yaml.Node, path, unit string) (float64, bool) {
	v, ok := r.number(n, path, unit)
	if !ok {
		return 0, false
	}
	if !(v > 0) {
		r.fail(n, path, "must be greater than 0, found %s", show(v, unit))
		return 0, false
	}
	return v, true
}

// oneOf reads a text that must be one of choices.
func (r *reader) oneOf(n *yaml.Node, path string, choices ...string) (string, bool) {
	s, ok := r.str(n, path)
	if !ok {
		return "", false
	}
	for _, c := range choices {
		if s == c {
			return s, true
		}
	}
	r.fail(n, path, "%q is not one of %s", s, strings.Join(choices, ", "))
	return "", false
}

func (r *reader) design(top map[string]pair) model.Options {
	o := model.Options{
		StressBlock:   model.ParabolaRectangle,
		Imperfection:  model.ImperfInclination,
		Members:       1,
		BarDiameters:  append([]float64(nil), DefaultBarDiameters...),
		LinkDiameters: append([]float64(nil), DefaultLinkDiameters...),
		LinkStep:      25,
		LapStep:       25,
		SecondOrder:   model.SecondOrderCurvature,
		Biaxial:       model.BiaxialRule,
		CrackedK:      DefaultCrackedK,
		Selection:     model.DefaultSelection(),
		Typical:       model.DefaultTypical(),
	}
	p, ok := top["design"]
	if !ok {
		return o
	}
	f := r.fields(p.val, "design", designKeys...)
	if e, ok := f["stress_block"]; ok {
		if s, ok := r.oneOf(e.val, "design.stress_block", model.ParabolaRectangle, model.Rectangular); ok {
			o.StressBlock = s
		}
	}
	if e, ok := f["imperfection"]; ok {
		if s, ok := r.oneOf(e.val, "design.imperfection", model.ImperfInclination, model.ImperfL0Over400); ok {
			o.Imperfection = s
		}
	}
	if e, ok := f["members"]; ok {
		if v, ok := r.number(e.val, "design.members", ""); ok {
			if !whole(v) || v < 1 {
				r.fail(e.val, "design.members", "the number of members m must be a whole number of at least 1, found %s", show(v, ""))
			} else {
				o.Members = v
			}
		}
	}
	if e, ok := f["bar_diameters"]; ok {
		if d, ok := r.diameters(e.val, "design.bar_diameters", LimitBar); ok {
			o.BarDiameters = d
		}
	}
	if e, ok := f["link_diameters"]; ok {
		if d, ok := r.diameters(e.val, "design.link_diameters", LimitLink); ok {
			o.LinkDiameters = d
		}
	}
	if e, ok := f["link_spacing_step"]; ok {
		if v, ok := r.plausible(e.val, "design.link_spacing_step", LimitStep); ok {
			o.LinkStep = v
		}
	}
	if e, ok := f["lap_step"]; ok {
		if v, ok := r.plausible(e.val, "design.lap_step", LimitStep); ok {
			o.LapStep = v
		}
	}
	if e, ok := f["lap_above_floor"]; ok {
		if v, ok := r.plausible(e.val, "design.lap_above_floor", LimitLapStart); ok {
			o.LapStart = v
		}
	}
	r.methods(f, &o)
	return o
}

// diameters reads a non-empty list of diameters and returns them ascending without repeats.
func (r *reader) diameters(n *yaml.Node, path string, l Limit) ([]float64, bool) {
	items, ok := r.list(n, path, "diameters in mm")
	if !ok {
		return nil, false
	}
	var out []float64
	good := true
	for i, it := range items {
		v, ok := r.plausible(it, index(path, i), l)
		if !ok {
			good = false
			continue
		}
		out = append(out, v)
	}
	if !good {
		return nil, false
	}
	sort.Float64s(out)
	k := 0
	for i, v := range out {
		if i == 0 || v != out[k-1] {
			out[k] = v
			k++
		}
	}
	return out[:k], true
}

func (r *reader) columns(n *yaml.Node, opt model.Options) []model.Column {
	items, ok := r.list(n, "columns", "columns")
	if !ok {
		return nil
	}
	var out []model.Column
	ids := map[string]int{}
	for i, it := range items {
		path := index("columns", i)
		c, ok := r.column(it, path, opt)
		r.declare(c, path)
		if c.ID != "" {
			if first, dup := ids[c.ID]; dup {
				r.fail(it, path+".id", "column id %q is used twice (first at columns[%d])", c.ID, first)
				ok = false
			} else {
				ids[c.ID] = i
			}
		}
		if ok {
			out = append(out, c)
		}
	}
	return out
}

func (r *reader) column(item *yaml.Node, path string, opt model.Options) (model.Column, bool) {
	n := resolve(item)
	c := model.Column{Line: item.Line}
	before := len(r.errs)
	f := r.fields(n, path, "id", "shape", "b", "h", "D", "helix", "cover", "bars", "link_dia", "durability", "fire", "storeys")
	if f == nil {
		return c, false
	}
	required := func(key, what string) (pair, bool) {
		e, ok := f[key]
		if !ok {
			r.fail(n, join(path, key), "is required but missing (%s)", what)
		}
		return e, ok
	}
	if e, ok := required("id", "the column's name, e.g. id: K1"); ok {
		if s, ok := r.name(e.val, join(path, "id")); ok {
			c.ID = s
		}
	}
	var coverOK bool
	size, sizeOK := r.columnSection(f, n, path, [2]string{"the width along y, e.g. b: 350 mm", "the depth along z, e.g. h: 500 mm"})
	c.B, c.H, c.Shape, c.Helix = size.B, size.H, size.Shape, size.Helix
	circle := size.Shape == model.ShapeCircle
	coverEntry, hasCover := required("cover", "the nominal cover to the links, e.g. cover: 40 mm")
	if hasCover {
		c.Cover, coverOK = r.plausible(coverEntry.val, join(path, "cover"), LimitCover)
	}
	barsOK := true
	if e, ok := f["bars"]; ok {
		c.Bars, barsOK = r.bars(e.val, join(path, "bars"), circle)
	}
	linkOK := true
	if e, ok := f["link_dia"]; ok {
		c.LinkDia, linkOK = r.plausible(e.val, join(path, "link_dia"), LimitLink)
	}
	if sizeOK && coverOK && barsOK && linkOK {
		link := c.LinkDia
		if link == 0 && len(opt.LinkDiameters) > 0 {
			link = opt.LinkDiameters[0]
		}
		bar := 0.0
		if c.Bars != nil {
			bar = c.Bars.Dia
		} else if len(opt.BarDiameters) > 0 {
			bar = opt.BarDiameters[0]
		}
		r.roomFault(coverEntry.val, join(path, "cover"), size, c.Cover, link, bar)
	}
	if e, ok := f["durability"]; ok {
		c.Durability = r.durability(e.val, join(path, "durability"), opt.Durability)
	}
	if e, ok := f["fire"]; ok {
		c.Fire = r.fire(e.val, join(path, "fire"), opt.Fire)
	}
	if e, ok := required("storeys", "the lifts with their actions"); ok {
		side := 0.0
		if sizeOK {
			side, _ = least(size)
		}
		c.Storeys = r.storeys(e.val, join(path, "storeys"), side)
	}
	return c, len(r.errs) == before
}

// bars reads given bars {count, dia}: on the four faces of a rectangle an even count of at
// least 4, evenly on the circle of a circular section (ring) any whole count of at least
// ringMin.
func (r *reader) bars(n *yaml.Node, path string, ring bool) (*model.BarSpec, bool) {
	f := r.fields(n, path, "count", "dia")
	if f == nil {
		return nil, false
	}
	b := &model.BarSpec{}
	ok := true
	if e, has := f["count"]; has {
		if v, good := r.number(e.val, join(path, "count"), ""); good {
			if ring && !whole(v) {
				r.fail(e.val, join(path, "count"), "the bar count must be a whole number of at least %d, found %s", ringMin, show(v, ""))
				ok = false
			} else if ring {
				b.Count = int(v)
				ok = r.ringCount(e.val, join(path, "count"), b.Count, "")
			} else if !whole(v) || v < 4 || int(v)%2 != 0 {
				r.fail(e.val, join(path, "count"), "the bar count must be an even whole number of at least 4, found %s", show(v, ""))
				ok = false
			} else {
				b.Count = int(v)
			}
		} else {
			ok = false
		}
	} else {
		r.fail(n, join(path, "count"), "is required but missing (e.g. bars: {count: 8, dia: 20 mm})")
		ok = false
	}
	if e, has := f["dia"]; has {
		var good bool
		b.Dia, good = r.plausible(e.val, join(path, "dia"), LimitBar)
		ok = ok && good
	} else {
		r.fail(n, join(path, "dia"), "is required but missing (e.g. bars: {count: 8, dia: 20 mm})")
		ok = false
	}
	return b, ok
}

// storeys reads the lifts of a column whose smaller section side is side (0 if unknown).
func (r *reader) storeys(n *yaml.Node, path string, side float64) []model.Storey {
	items, ok := r.list(n, path, "storeys")
	if !ok {
		return nil
	}
	var out []model.Storey
	names := map[string]int{}
	for i, it := range items {
		s := r.storey(it, index(path, i), side)
		r.unique(names, s.Name, it, path, i, "storey name", "column")
		out = append(out, s)
	}
	return out
}

func (r *reader) storey(item *yaml.Node, path string, side float64) model.Storey {
	n := resolve(item)
	s := model.Storey{Line: item.Line}
	f := r.fields(n, path, "name", "l0", "length", "NEd", "M", "cases", "phi_ef", "creep")
	if f == nil {
		return s
	}
	if e, ok := f["name"]; ok {
		if v, ok := r.name(e.val, join(path, "name")); ok {
			s.Name = v
		}
	} else {
		r.fail(n, join(path, "name"), "is required but missing (e.g. name: L1)")
	}
	if e, ok := f["l0"]; ok {
		s.L0Y, s.L0Z = r.l0(e.val, join(path, "l0"), side)
	} else {
		r.fail(n, join(path, "l0"), "is required but missing (e.g. l0: {y: 2.9 m, z: 3.1 m} or l0: 3 m)")
	}
	if e, ok := f["length"]; ok {
		s.Length, _ = r.plausible(e.val, join(path, "length"), LimitHeight)
	}
	r.liftActions(n, f, path, &s)
	if e, ok := f["phi_ef"]; ok {
		if v, ok := r.number(e.val, join(path, "phi_ef"), ""); ok {
			if v < 0 || v > 10 {
				r.fail(e.val, join(path, "phi_ef"), "the effective creep ratio must lie between 0 and 10, found %s", show(v, ""))
			} else {
				s.PhiEf, s.HasPhi = v, true
			}
		}
	}
	if e, ok := f["creep"]; ok {
		s.Creep = r.creep(e.val, join(path, "creep"), true)
		if _, both := f["phi_ef"]; both {
			r.fail(e.key, join(path, "creep"), "give phi_ef or creep, not both")
			s.Creep = nil
		}
	}
	return s
}

// l0 reads the effective lengths: a mapping {y, z} or one value for both axes. Each lies
// within LimitL0 and is not shorter than the section's smaller side (when known, side > 0).
func (r *reader) l0(n *yaml.Node, path string, side float64) (y, z float64) {
	n = resolve(n)
	if n.Kind == yaml.ScalarNode {
		v := r.effectiveLength(n, path, side)
		return v, v
	}
	f := r.fields(n, path, "y", "z")
	if f == nil {
		return 0, 0
	}
	for _, axis := range []string{"y", "z"} {
		e, ok := f[axis]
		if !ok {
			r.fail(n, join(path, axis), "is required but missing (the effective length for buckling about %s)", axis)
			continue
		}
		v := r.effectiveLength(e.val, join(path, axis), side)
		if axis == "y" {
			y = v
		} else {
			z = v
		}
	}
	return y, z
}

// moments reads the first-order end moments {y: {top, bottom}, z: {top, bottom}}; missing ones
// are 0. They are returned in the face convention, converted from the input's moment_signs.
func (r *reader) moments(n *yaml.Node, path string) (my, mz model.Ends) {
	f := r.fields(n, path, "y", "z")
	ends := func(e pair, path string) model.Ends {
		var out model.Ends
		g := r.fields(e.val, path, "top", "bottom")
		if e, ok := g["top"]; ok {
			out.Top, _ = r.plausible(e.val, join(path, "top"), LimitMoment)
		}
		if e, ok := g["bottom"]; ok {
			out.Bottom, _ = r.plausible(e.val, join(path, "bottom"), LimitMoment)
		}
		return FaceEnds(out, r.signs)
	}
	if e, ok := f["y"]; ok {
		my = ends(e, join(path, "y"))
	}
	if e, ok := f["z"]; ok {
		mz = ends(e, join(path, "z"))
	}
	return my, mz
}

// effectiveLength reads one effective length: within LimitL0 and, where the section is known
// (side > 0), not shorter than its smaller side, common practice (a member shorter than its
// width is no column; EN 1992-1-1:2004 5.3.1(7) asks for a height of three depths).
func (r *reader) effectiveLength(n *yaml.Node, path string, side float64) float64 {
	v, ok := r.plausible(n, path, LimitL0)
	if !ok {
		return 0
	}
	if side > 0 && v < side {
		rn := resolve(n)
		hint := ""
		if (rn.ShortTag() == "!!int" || rn.ShortTag() == "!!float") && v*1000 <= LimitL0.Max {
			hint = fmt.Sprintf("; a plain number is in mm: for metres write the unit, \"%s m\"", rn.Value)
		}
		r.fail(n, path, "l0 = %s is shorter than the section's smaller side %s: not a column%s", show(v, "mm"), show(side, "mm"), hint)
		return 0
	}
	return v
}
