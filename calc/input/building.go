package input

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"colsheet/calc/code"
	"colsheet/calc/material"
	"colsheet/calc/model"

	"gopkg.in/yaml.v3"
)

// Limits of the building form that keep a file within the size of a braced building.
const (
	MaxBays    = 100 // bays along each grid direction
	MaxStoreys = 100 // storeys
)

// Defaults of the building form.
const (
	DefaultBuildingCover = 40     // nominal cover to the links of the columns, mm
	DefaultDensity       = 2.5e-5 // weight density of reinforced concrete, N/mm³ (25 kN/m³)
	DefaultL0Factor      = 1.0    // effective length over storey height
	DefaultSpanRatio     = 1.5    // adjacent spans' ratio above which the subframe is cautioned, common practice
)

// Plausibility limits of quantities only the building form takes.
var (
	limitPointLoad = Limit{"point load", "kN", 0, 1e7,
		"common practice: a concentrated load of more than 10 000 kN on a floor (a tank, a transfer) needs a structure of its own"}
	limitCantilever = Limit{"cantilever length", "mm", 300, 5000,
		"common practice: a slab cantilever shorter than 0.3 m is a nib; over 5 m it needs a structure of its own"}
	limitSlab = Limit{"slab thickness", "mm", 50, 1000,
		"common practice: a cast floor slab is 50 mm (a topping) to 1000 mm (a transfer slab) thick"}
)

// densityParam is the code parameter of the weight density of reinforced concrete, when catalogued.
const densityParam = "density_rc"

// densityInForce returns the weight density of reinforced concrete the code parameters give,
// or DefaultDensity when the catalogue has no such parameter.
func densityInForce(p code.Params) float64 {
	if _, ok := code.Lookup(densityParam); ok {
		return p.Get(densityParam)
	}
	return DefaultDensity
}

// Imposed-load categories of EN 1991-1-1 Table 6.1 the building form accepts.
var categories = []string{"A", "B", "C", "D", "E", "F", "G", "H"}

var buildingKeys = []string{"storeys", "grid", "columns", "beams", "column_sizes", "beam_sizes", "floors",
	"line_loads", "point_loads", "area_loads", "cantilevers", "omit", "concrete", "beam_concrete", "base",
	"analysis", "beam_stiffness", "span_ratio", "combination", "imposed_reduction", "density", "l0_factor",
	"effective_length", "creep", "bars", "fire_levels"}

// buildingMisplaced answers keys that belong elsewhere than under building.
var buildingMisplaced = map[string]string{
	"durability": "the durability of the building's columns is given under design.durability; move it there",
	"fire":       "the fire resistance is given under design.fire (every level) and building.fire_levels (some levels)",
}

// site holds what the entries of a building refer to: its levels and its grid.
type site struct {
	levels   []string       // storey names, lowest first
	level    map[string]int // index of each storey name
	levelsOK bool           // every storey name was read, so references can be checked
	nx, ny   int            // grid lines: lettered (at x positions) and numbered (at y positions)
	gridOK   bool           // both directions were read, so grid names can be checked
	lengths  [2]float64     // the grid's length along x and along y, mm, when gridOK
	omitted  map[string]bool
}

// letters names lettered grid line i (from 0): A to Z, then AA, AB, ...
func letters(i int) string {
	var b []byte
	for i++; i > 0; i = (i - 1) / 26 {
		b = append([]byte{byte('A' + (i-1)%26)}, b...)
	}
	return string(b)
}

// lineKind tells the lettered grid lines (they run along y) from the numbered ones (along x).
type lineKind int

const (
	lettered lineKind = iota + 1
	numbered
)

// parseLine reads a grid line name ("B", "b", "2", "02") and returns its kind, its index from
// 0 and its canonical name; it does not check the name against the grid.
func parseLine(s string) (lineKind, int, string, bool) {
	s = strings.ToUpper(strings.TrimSpace(s))
	switch {
	case s == "" || len(s) > 4:
		return 0, 0, "", false
	case strings.Trim(s, "ABCDEFGHIJKLMNOPQRSTUVWXYZ") == "":
		i := 0
		for _, c := range s {
			i = i*26 + int(c-'A') + 1
		}
		return lettered, i - 1, s, true
	case strings.Trim(s, "0123456789") == "":
		n, _ := strconv.Atoi(s)
		if n < 1 {
			return 0, 0, "", false
		}
		return numbered, n - 1, strconv.Itoa(n), true
	}
	return 0, 0, "", false
}

// extent describes the grid's lines for messages.
func (s *site) extent() string {
	return fmt.Sprintf("lettered lines A to %s, numbered lines 1 to %d", letters(s.nx-1), s.ny)
}

// inGrid reports whether line index i of kind k exists.
func (s *site) inGrid(k lineKind, i int) bool {
	if k == lettered {
		return i < s.nx
	}
	return i < s.ny
}

// gridLine reads the name of a grid line at n and returns its kind, index and canonical name.
func (r *reader) gridLine(s *site, n *yaml.Node, path string) (lineKind, int, string, bool) {
	text, ok := r.str(n, path)
	if !ok {
		return 0, 0, "", false
	}
	k, i, name, ok := parseLine(text)
	if !ok {
		r.fail(n, path, "%q is not a grid line name (lettered lines A, B, ... run along y, numbered lines 1, 2, ... along x)", text)
		return 0, 0, "", false
	}
	if s.gridOK && !s.inGrid(k, i) {
		r.fail(n, path, "line %s is not on the grid (%s)", name, s.extent())
		return 0, 0, "", false
	}
	return k, i, name, true
}

// point reads a grid point id such as "B2" (lettered line B, numbered line 2) and returns it
// upper-cased and without leading zeros.
func (r *reader) point(s *site, n *yaml.Node, path string) (string, bool) {
	text, ok := r.str(n, path)
	if !ok {
		return "", false
	}
	t := strings.ToUpper(strings.TrimSpace(text))
	cut := strings.IndexAny(t, "0123456789")
	if cut <= 0 {
		r.fail(n, path, "%q is not a column id; give a lettered and a numbered grid line, e.g. B2", text)
		return "", false
	}
	kx, ix, x, okx := parseLine(t[:cut])
	ky, iy, y, oky := parseLine(t[cut:])
	if !okx || !oky || kx != lettered || ky != numbered {
		r.fail(n, path, "%q is not a column id; give a lettered and a numbered grid line, e.g. B2", text)
		return "", false
	}
	id := x + y
	if s.gridOK && (!s.inGrid(kx, ix) || !s.inGrid(ky, iy)) {
		r.fail(n, path, "%s is not a grid point (%s)", id, s.extent())
		return "", false
	}
	return id, true
}

// items returns the entries of a list, or a single scalar as a list of one, with their paths.
func (r *reader) items(n *yaml.Node, path, what string) ([]*yaml.Node, []string, bool) {
	n = resolve(n)
	if n.Kind == yaml.ScalarNode {
		return []*yaml.Node{n}, []string{path}, true
	}
	its, ok := r.list(n, path, what)
	paths := make([]string, len(its))
	for i := range its {
		paths[i] = index(path, i)
	}
	return its, paths, ok
}

// levelRefs reads a list of storey names, each known and given once.
func (r *reader) levelRefs(s *site, n *yaml.Node, path string) ([]string, bool) {
	return r.refs(n, path, "storey levels", "level %s is listed twice", func(it *yaml.Node, p string) (string, bool) {
		name, ok := r.name(it, p)
		if ok && s.levelsOK && !has(s.level, name) {
			r.fail(it, p, "%q is not a storey level (levels: %s)", name, strings.Join(s.levels, ", "))
			return "", false
		}
		return name, ok
	})
}

// refs reads a list of names: each read and checked by one, which reports its own faults, and
// none given twice (twice formats that fault with the name).
func (r *reader) refs(n *yaml.Node, path, what, twice string, one func(it *yaml.Node, p string) (string, bool)) ([]string, bool) {
	its, paths, ok := r.items(n, path, what)
	if !ok {
		return nil, false
	}
	var out []string
	seen := map[string]bool{}
	good := true
	for i, it := range its {
		name, ok := one(it, paths[i])
		switch {
		case !ok:
			good = false
		case seen[name]:
			r.fail(it, paths[i], twice, name)
			good = false
		default:
			seen[name] = true
			out = append(out, name)
		}
	}
	return out, good
}

// has reports whether m holds key k.
func has[V any](m map[string]V, k string) bool {
	_, ok := m[k]
	return ok
}

// building reads the building form under key, the building: entry.
func (r *reader) building(key, n *yaml.Node, in *model.Input) *model.Building {
	opt := in.Options
	const top = "building"
	b := &model.Building{
		Line:     key.Line,
		Cover:    DefaultBuildingCover,
		Base:     model.BaseFixed,
		Analysis: model.AnalysisSubframe,
		Options: model.BuildingOptions{
			BeamStiffness: "half",
			SpanRatio:     DefaultSpanRatio,
			Combination:   model.Comb610,
			Reduction:     model.ReduceNone,
			Density:       densityInForce(in.Code),
			L0Factor:      DefaultL0Factor,
		},
	}
	n = resolve(n)
	f := r.fieldsHinted(n, top, buildingMisplaced, buildingKeys...)
	if f == nil {
		return b
	}
	required := func(k, what string) (pair, bool) {
		e, ok := f[k]
		if !ok {
			r.fail(n, join(top, k), "is required but missing (%s)", what)
		}
		return e, ok
	}
	s := &site{level: map[string]int{}, omitted: map[string]bool{}}

	if e, ok := required("storeys", "the levels lowest first, e.g. storeys: [{name: L1, height: 3.8 m}]"); ok {
		b.Storeys, s.levelsOK = r.levels(e.val, join(top, "storeys"))
		for i, l := range b.Storeys {
			s.levels = append(s.levels, l.Name)
			s.level[l.Name] = i
		}
	}
	if e, ok := required("grid", "the bay widths, e.g. grid: {x: [6.6 m, 6.6 m], y: [7.8 m]}"); ok {
		b.GridX, b.GridY, s.gridOK = r.grid(e.val, join(top, "grid"))
		s.nx, s.ny = len(b.GridX)+1, len(b.GridY)+1
		s.lengths = [2]float64{sum(b.GridX), sum(b.GridY)}
	}

	// Method choices and the given bars come first: the room check of the columns uses the bars.
	r.buildingChoices(f, b, in)
	barsOK := true
	if e, ok := f["bars"]; ok {
		b.Bars, barsOK = r.bars(e.val, join(top, "bars"), false)
		if !barsOK {
			b.Bars = nil
		}
	}

	if e, ok := f["omit"]; ok {
		b.Omit, b.OmitAt = r.omit(s, e.val, join(top, "omit"))
	}
	if e, ok := required("columns", "the default column size, e.g. columns: {b: 350 mm, h: 450 mm}"); ok {
		path := join(top, "columns")
		g := r.fields(e.val, path, "shape", "b", "h", "D", "helix", "cover")
		if g != nil {
			var sizeOK bool
			b.Column, sizeOK = r.columnSection(g, e.val, path, columnMissing)
			coverOK := true
			coverAt := e.val
			if c, ok := g["cover"]; ok {
				b.Cover, coverOK = r.plausible(c.val, join(path, "cover"), LimitCover)
				coverAt = c.val
			}
			if sizeOK && coverOK && barsOK {
				r.room(coverAt, join(path, "cover"), b.Column, b.Cover, b.Bars, opt)
			}
			if !coverOK {
				b.Cover = 0
			}
		}
	}
	if e, ok := required("beams", "the default beam size, e.g. beams: {b: 275 mm, h: 500 mm}"); ok {
		path := join(top, "beams")
		if g := r.fields(e.val, path, "b", "h"); g != nil {
			b.Beam, _ = r.size(g, e.val, path)
		}
	}
	if e, ok := f["column_sizes"]; ok {
		b.Columns = r.columnSizes(s, e.val, join(top, "column_sizes"), b, barsOK, opt)
	}
	if e, ok := f["bars"]; ok && b.Bars != nil {
		r.ringBars(e.val, join(top, "bars.count"), b)
	}
	if e, ok := f["beam_sizes"]; ok {
		b.Beams = r.beamSizes(s, e.val, join(top, "beam_sizes"))
	}
	r.concretes(s, f, b)
	if e, ok := required("floors", "the area loads of every level, e.g. floors: [{gk: 5.8 kN/m2, qk: 2.5 kN/m2, category: B, spans: y}]"); ok {
		b.Floors = r.floors(s, b, e.key, e.val, join(top, "floors"))
	}
	r.buildingLoads(s, f, b)
	if e, ok := f["fire_levels"]; ok {
		b.Fires = r.fireLevels(s, e.val, join(top, "fire_levels"), opt.Fire)
	}
	return b
}

// sum returns the sum of vs.
func sum(vs []float64) float64 {
	t := 0.0
	for _, v := range vs {
		t += v
	}
	return t
}

// buildingChoices reads the method choices of the building form into b: base, analysis and the
// options, the density also into the code parameters of in.
func (r *reader) buildingChoices(f map[string]pair, b *model.Building, in *model.Input) {
	const top = "building"
	if e, ok := f["base"]; ok {
		if v, ok := r.oneOf(e.val, join(top, "base"), model.BaseFixed, model.BasePinned); ok {
			b.Base = v
		}
	}
	analysisOK := true
	if e, ok := f["analysis"]; ok {
		var v string
		if v, analysisOK = r.oneOf(e.val, join(top, "analysis"), model.AnalysisSubframe, model.AnalysisFrame, model.AnalysisBoth); analysisOK {
			b.Analysis = v
		}
	}
	if e, ok := f["beam_stiffness"]; ok {
		path := join(top, "beam_stiffness")
		if v, ok := r.oneOf(e.val, path, "half", "full"); ok {
			b.Options.BeamStiffness, b.Options.BeamStiffnessGiven = v, true
			if analysisOK && b.Analysis == model.AnalysisFrame {
				r.fail(e.val, path, "the frame analysis takes each beam's own stiffness; beam_stiffness applies to the subframe only (analysis: subframe or both)")
			}
		}
	}
	if e, ok := f["span_ratio"]; ok {
		path := join(top, "span_ratio")
		if v, ok := r.number(e.val, path, ""); ok {
			if v > 1 {
				b.Options.SpanRatio = v
			} else {
				r.fail(e.val, path, "the ratio of adjacent spans that draws a caution must be greater than 1, found %s", show(v, ""))
			}
		}
	}
	if e, ok := f["combination"]; ok {
		if v, ok := r.combination(e.val, join(top, "combination")); ok {
			b.Options.Combination = v
		}
	}
	if e, ok := f["imposed_reduction"]; ok {
		if v, ok := r.oneOf(e.val, join(top, "imposed_reduction"), model.ReduceNone, model.ReduceArea, model.ReduceStoreys); ok {
			b.Options.Reduction = v
		}
	}
	if e, ok := f["density"]; ok {
		r.density(e.val, join(top, "density"), b, in)
	}
	if e, ok := f["effective_length"]; ok {
		if v, ok := r.oneOf(e.val, join(top, "effective_length"), "frame", "factor"); ok {
			b.Options.L0FromFrame = v == "frame"
		}
	}
	if e, ok := f["l0_factor"]; ok {
		if v, ok := r.number(e.val, join(top, "l0_factor"), ""); ok {
			if b.Options.L0FromFrame {
				r.fail(e.key, join(top, "l0_factor"), "applies to effective_length: factor; with frame the effective lengths come from EN 1992-1-1 Eq. (5.15)")
			} else if v < 0.5 || v > 2 {
				r.fail(e.val, join(top, "l0_factor"), "the effective length factor must lie between 0.5 and 2, found %s", show(v, ""))
			} else {
				b.Options.L0Factor = v
			}
		}
	}
	if e, ok := f["creep"]; ok {
		b.Options.Creep = r.creep(e.val, join(top, "creep"), false)
	}
}

// density reads the weight density of reinforced concrete at n into b and, where the code
// catalogues it, into the code parameters of in, so that beams and columns take the same one.
func (r *reader) density(n *yaml.Node, path string, b *model.Building, in *model.Input) {
	v, ok := r.positive(n, path, "kN/m3")
	if !ok {
		return
	}
	c, catalogued := code.Lookup(densityParam)
	switch {
	case catalogued && in.Code.IsOverridden(densityParam):
		r.fail(n, path, "the density is also given as code.overrides.%s; give it once", densityParam)
	case catalogued && (v < c.Min || v > c.Max):
		r.fail(n, path, "%s is outside the accepted range %s to %s", show(v, "kN/m3"), show(c.Min, "kN/m3"), show(c.Max, "kN/m3"))
	default:
		b.Options.Density = v
		if catalogued {
			if pc, err := in.Code.Override(densityParam, v); err == nil {
				in.Code = pc
			}
		}
	}
}

// concretes reads the concrete classes of the building: by level and column, and of the beams.
func (r *reader) concretes(s *site, f map[string]pair, b *model.Building) {
	const top = "building"
	if e, ok := f["concrete"]; ok {
		b.Concrete = r.concreteZones(s, e.val, join(top, "concrete"))
	}
	if e, ok := f["beam_concrete"]; ok {
		if c, ok := r.concreteClass(e.val, join(top, "beam_concrete")); ok {
			b.BeamConcrete = &c
		}
	}
}

// buildingLoads reads the loads of the building besides its floors: line loads, point loads,
// zoned area loads and cantilevers.
func (r *reader) buildingLoads(s *site, f map[string]pair, b *model.Building) {
	const top = "building"
	if e, ok := f["line_loads"]; ok {
		b.Lines = r.lineLoads(s, e.val, join(top, "line_loads"))
	}
	if e, ok := f["point_loads"]; ok {
		b.PointLoads = r.pointLoads(s, e.val, join(top, "point_loads"))
	}
	if e, ok := f["area_loads"]; ok {
		b.AreaLoads = r.areaLoads(s, e.val, join(top, "area_loads"))
	}
	if e, ok := f["cantilevers"]; ok {
		b.Cantilevers = r.cantilevers(s, e.val, join(top, "cantilevers"))
	}
}

// levels reads the storeys; it reports whether every name was read.
func (r *reader) levels(n *yaml.Node, path string) ([]model.Level, bool) {
	items, ok := r.list(n, path, "storeys")
	if !ok {
		return nil, false
	}
	if len(items) > MaxStoreys {
		r.fail(n, path, "%d storeys are more than the %d the building form takes", len(items), MaxStoreys)
		return nil, false
	}
	var out []model.Level
	seen := map[string]int{}
	good := true
	for i, it := range items {
		p := index(path, i)
		l := model.Level{Line: it.Line}
		f := r.fields(it, p, "name", "height")
		if f == nil {
			good = false
			continue
		}
		if e, ok := f["name"]; ok {
			if v, ok := r.name(e.val, join(p, "name")); !ok {
				good = false
			} else if first, dup := seen[v]; dup {
				r.fail(e.val, join(p, "name"), "storey name %q is used twice (first at %s)", v, index(path, first))
				good = false
			} else {
				seen[v] = i
				l.Name = v
			}
		} else {
			r.fail(it, join(p, "name"), "is required but missing (the level at the top of the lift, e.g. name: L1)")
			good = false
		}
		if e, ok := f["height"]; ok {
			l.Height, _ = r.plausible(e.val, join(p, "height"), LimitHeight)
		} else {
			r.fail(it, join(p, "height"), "is required but missing (the height from the level below, e.g. height: 3.8 m)")
		}
		if l.Name != "" {
			out = append(out, l)
		}
	}
	return out, good
}

// grid reads the bay widths along x and y; it reports whether both were read whole.
func (r *reader) grid(n *yaml.Node, path string) (x, y []float64, ok bool) {
	f := r.fields(n, path, "x", "y")
	if f == nil {
		return nil, nil, false
	}
	bays := func(axis string) ([]float64, bool) {
		p := join(path, axis)
		e, ok := f[axis]
		if !ok {
			r.fail(n, p, "is required but missing (the bay widths along %s, e.g. %s: [6.6 m, 6.6 m])", axis, axis)
			return nil, false
		}
		items, ok := r.list(e.val, p, "bay widths")
		if !ok {
			return nil, false
		}
		if len(items) > MaxBays {
			r.fail(e.val, p, "%d bays are more than the %d the building form takes", len(items), MaxBays)
			return nil, false
		}
		var out []float64
		good := true
		for i, it := range items {
			v, ok := r.plausible(it, index(p, i), LimitBay)
			good = good && ok
			out = append(out, v)
		}
		return out, good
	}
	x, okx := bays("x")
	y, oky := bays("y")
	return x, y, okx && oky
}

// size reads the required b and h of a beam from fields f of mapping n (a column's section:
// columnSection).
func (r *reader) size(f map[string]pair, n *yaml.Node, path string) (model.Size, bool) {
	return r.sides(f, n, path, [2]string{"the width, e.g. b: 275 mm", "the depth, e.g. h: 500 mm"})
}

// sides reads the required b and h of a rectangular section from fields f of mapping n;
// missing holds the hints of a missing b and h.
func (r *reader) sides(f map[string]pair, n *yaml.Node, path string, missing [2]string) (model.Size, bool) {
	var s model.Size
	ok := true
	for i, k := range []string{"b", "h"} {
		e, has := f[k]
		if !has {
			r.fail(n, join(path, k), "is required but missing (%s)", missing[i])
			ok = false
			continue
		}
		v, good := r.plausible(e.val, join(path, k), LimitSide)
		ok = ok && good
		if k == "b" {
			s.B = v
		} else {
			s.H = v
		}
	}
	return s, ok
}

// room reports a column section too small for its cover, links and bars.
func (r *reader) room(at *yaml.Node, path string, s model.Size, cover float64, bars *model.BarSpec, opt model.Options) {
	link := 0.0
	if len(opt.LinkDiameters) > 0 {
		link = opt.LinkDiameters[0]
	}
	bar := 0.0
	if bars != nil {
		bar = bars.Dia
	} else if len(opt.BarDiameters) > 0 {
		bar = opt.BarDiameters[0]
	}
	r.roomFault(at, path, s, cover, link, bar)
}

// columnMissing are the hints of a missing b and h of a column of the building form.
var columnMissing = [2]string{"the width along building y, e.g. b: 350 mm", "the depth along building x, e.g. h: 450 mm"}

// ringBars reports the bars given for every column of the building (under bars, mapping n)
// when some column is circular and the count is below the least of a circle.
func (r *reader) ringBars(n *yaml.Node, path string, b *model.Building) {
	where := ""
	switch {
	case b.Column.Shape == model.ShapeCircle:
		where = " (the default column is circular)"
	default:
		for i, o := range b.Columns {
			if o.Shape == model.ShapeCircle {
				where = fmt.Sprintf(" (column_sizes[%d], line %d, is circular)", i, o.Line)
				break
			}
		}
	}
	if where == "" {
		return
	}
	at := n
	if v := valueOf(n, "count"); v != nil {
		at = v
	}
	r.ringCount(at, path, b.Bars.Count, where)
}

// combination reads 6.10 or 6.10ab; the YAML number 6.10 (or 6.1) counts as "6.10".
func (r *reader) combination(n *yaml.Node, path string) (string, bool) {
	return r.clauseOf(n, path, 6.1, model.Comb610, model.Comb610ab)
}

// clauseOf reads a text that must be one of choices, the first of them a clause number that
// YAML may have read as the number x (6.10 as 6.1).
func (r *reader) clauseOf(n *yaml.Node, path string, x float64, choices ...string) (string, bool) {
	v := resolve(n)
	if v.Kind == yaml.ScalarNode && v.ShortTag() == "!!float" {
		if y, err := strconv.ParseFloat(v.Value, 64); err == nil && y == x {
			return choices[0], true
		}
	}
	return r.oneOf(n, path, choices...)
}

// omit reads the grid points without a column: a plain id is absent at every level, an entry
// {columns, levels} names columns absent at those levels only (mixed in the one list).
func (r *reader) omit(s *site, n *yaml.Node, path string) ([]string, []model.OmitLevels) {
	var its []*yaml.Node
	var paths []string
	if rn := resolve(n); rn.Kind == yaml.MappingNode {
		its, paths = []*yaml.Node{rn}, []string{path}
	} else {
		var ok bool
		if its, paths, ok = r.items(n, path, "grid points"); !ok {
			return nil, nil
		}
	}
	// The plain ids first, so that an entry with levels can be checked against them all.
	var out []string
	for i, it := range its {
		switch resolve(it).Kind {
		case yaml.MappingNode:
			continue
		case yaml.SequenceNode:
			r.fail(it, paths[i], "expected a column id such as B2 or an entry {columns: [B2], levels: [L1]}, found a list")
			continue
		}
		id, ok := r.point(s, it, paths[i])
		switch {
		case !ok:
		case s.omitted[id]:
			r.fail(it, paths[i], "%s is omitted twice", id)
		default:
			s.omitted[id] = true
			out = append(out, id)
		}
	}
	var at []model.OmitLevels
	absent := map[string]map[string]bool{} // levels at which each column of the entries is absent
	for i, it := range its {
		if resolve(it).Kind != yaml.MappingNode {
			continue
		}
		o, ok := r.omitLevels(s, it, paths[i])
		if !ok {
			continue
		}
		at = append(at, o)
		r.omitEverywhere(s, absent, o, it, join(paths[i], "columns"))
	}
	switch {
	case !s.gridOK:
	case len(s.omitted) == s.nx*s.ny:
		r.fail(n, path, "every grid point is omitted; at least one column must remain")
	case s.levelsOK:
		r.omitLevelWhole(s, absent, n, path)
	}
	return out, at
}

// omitLevels reads an entry {columns, levels} of omit: both required, the columns not in the
// plain list of omit.
func (r *reader) omitLevels(s *site, n *yaml.Node, path string) (model.OmitLevels, bool) {
	o := model.OmitLevels{Line: n.Line}
	f := r.fields(n, path, "columns", "levels")
	if f == nil {
		return o, false
	}
	colsOK, levelsOK := false, false
	if e, ok := f["columns"]; ok {
		o.Columns, colsOK = r.refs(e.val, join(path, "columns"), "column ids", "column %s is listed twice", func(it *yaml.Node, p string) (string, bool) {
			id, ok := r.point(s, it, p)
			if ok && s.omitted[id] {
				r.fail(it, p, "%s is in the plain list of omit, absent at every level already; give it once", id)
				return "", false
			}
			return id, ok
		})
	} else {
		r.fail(n, join(path, "columns"), "is required but missing (the columns absent at these levels, e.g. columns: [B2])")
	}
	if e, ok := f["levels"]; ok {
		o.Levels, levelsOK = r.levelRefs(s, e.val, join(path, "levels"))
	} else {
		r.fail(n, join(path, "levels"), "is required but missing (the levels without these columns, e.g. levels: [L1]; a column absent at every level goes in the plain list, e.g. omit: [B2])")
	}
	return o, colsOK && levelsOK
}

// omitEverywhere adds the levels of entry o to absent, the levels at which each column is
// absent, and refuses a column the entries so leave out at every level.
func (r *reader) omitEverywhere(s *site, absent map[string]map[string]bool, o model.OmitLevels, n *yaml.Node, path string) {
	for _, id := range o.Columns {
		if absent[id] == nil {
			absent[id] = map[string]bool{}
		}
		before := len(absent[id])
		for _, l := range o.Levels {
			absent[id][l] = true
		}
		if s.levelsOK && before < len(s.levels) && len(absent[id]) == len(s.levels) {
			r.fail(n, path, "%s is absent at every level (%s); use the plain list, e.g. omit: [%s]", id, strings.Join(s.levels, ", "), id)
		}
	}
}

// omitLevelWhole refuses a level at which the plain list and the entries of omit leave no column.
func (r *reader) omitLevelWhole(s *site, absent map[string]map[string]bool, n *yaml.Node, path string) {
	for _, l := range s.levels {
		gone := len(s.omitted)
		for _, ls := range absent {
			if ls[l] {
				gone++
			}
		}
		if gone == s.nx*s.ny {
			r.fail(n, path, "every grid point is omitted at level %s; at least one column must remain", l)
		}
	}
}

// columnSizes reads the column size overrides; where two cover a column and level, the later one holds.
func (r *reader) columnSizes(s *site, n *yaml.Node, path string, b *model.Building, barsOK bool, opt model.Options) []model.ColumnSize {
	return listOf(r, n, path, "column size overrides", []string{"columns", "levels", "shape", "b", "h", "D", "helix"}, func(f map[string]pair, it *yaml.Node, p string) (model.ColumnSize, bool) {
		c := model.ColumnSize{Line: it.Line}
		if e, ok := f["columns"]; ok {
			c.IDs, _ = r.columnRefs(s, e.val, join(p, "columns"))
		}
		c.Levels = r.levelsOf(s, f, p)
		var sizeOK bool
		c.Size, sizeOK = r.columnSection(f, it, p, columnMissing)
		if sizeOK && barsOK && b.Cover > 0 {
			at := "b"
			if c.Shape == model.ShapeCircle {
				at = "D"
			}
			r.room(f[at].val, join(p, at), c.Size, b.Cover, b.Bars, opt)
		}
		return c, true
	})
}

// columnRefs reads a list of column ids: grid points with a column, each given once.
func (r *reader) columnRefs(s *site, n *yaml.Node, path string) ([]string, bool) {
	return r.refs(n, path, "column ids", "column %s is listed twice", func(it *yaml.Node, p string) (string, bool) {
		id, ok := r.point(s, it, p)
		if ok && s.omitted[id] {
			r.fail(it, p, "%s is omitted, so it has no column", id)
			return "", false
		}
		return id, ok
	})
}

// beamSizes reads the beam size overrides; where two cover a beam, the later one holds.
func (r *reader) beamSizes(s *site, n *yaml.Node, path string) []model.BeamSize {
	return listOf(r, n, path, "beam size overrides", []string{"levels", "dir", "lines", "b", "h"}, func(f map[string]pair, it *yaml.Node, p string) (model.BeamSize, bool) {
		c := model.BeamSize{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		if e, ok := f["dir"]; ok {
			c.Dir, _ = r.oneOf(e.val, join(p, "dir"), "x", "y")
		}
		if e, ok := f["lines"]; ok {
			c.Lines, _ = r.beamLines(s, e.val, join(p, "lines"), c.Dir)
		}
		c.Size, _ = r.size(f, it, p)
		return c, true
	})
}

// beamLines reads the grid lines of a beam override; with dir x only numbered lines fit, with dir y only lettered ones.
func (r *reader) beamLines(s *site, n *yaml.Node, path, dir string) ([]string, bool) {
	return r.refs(n, path, "grid lines", "line %s is listed twice", func(it *yaml.Node, p string) (string, bool) {
		k, _, name, ok := r.gridLine(s, it, p)
		switch {
		case !ok:
			return "", false
		case dir == "x" && k == lettered:
			r.fail(it, p, "line %s is a lettered line, which runs along y; beams along x (dir x) lie on numbered lines", name)
			return "", false
		case dir == "y" && k == numbered:
			r.fail(it, p, "line %s is a numbered line, which runs along x; beams along y (dir y) lie on lettered lines", name)
			return "", false
		}
		return name, true
	})
}

// category reads an imposed-load category of EN 1991-1-1 Table 6.1, upper-cased.
func (r *reader) category(n *yaml.Node, path string) (string, bool) {
	return r.upperOf(n, path, "an imposed-load category of EN 1991-1-1 Table 6.1", categories)
}

// upperOf reads a text that, upper-cased and trimmed, must be one of choices; what names the
// kind of text in the message.
func (r *reader) upperOf(n *yaml.Node, path, what string, choices []string) (string, bool) {
	v, ok := r.str(n, path)
	if !ok {
		return "", false
	}
	c := strings.ToUpper(strings.TrimSpace(v))
	for _, k := range choices {
		if c == k {
			return c, true
		}
	}
	r.fail(n, path, "%q is not %s (one of %s)", v, what, strings.Join(choices, ", "))
	return "", false
}

// nonNegative reads a number that must not be below zero.
func (r *reader) nonNegative(n *yaml.Node, path, unit string) (float64, bool) {
	v, ok := r.number(n, path, unit)
	if !ok {
		return 0, false
	}
	if v < 0 {
		r.fail(n, path, "must not be negative, found %s", show(v, unit))
		return 0, false
	}
	return v, true
}

// floors reads the area loads under key; every level must be covered by exactly one entry. A
// floor's slab must be thinner than the beams of b at its levels.
func (r *reader) floors(s *site, b *model.Building, key, n *yaml.Node, path string) []model.Floor {
	items, ok := r.list(n, path, "floors")
	if !ok {
		return nil
	}
	var out []model.Floor
	owner := map[string]int{}
	complete := true
	for i, it := range items {
		p := index(path, i)
		fl := model.Floor{Line: it.Line}
		f := r.fields(it, p, "levels", "gk", "qk", "category", "spans", "slab")
		if f == nil {
			complete = false
			continue
		}
		levels := s.levels
		levelsAt, levelsPath := it, p
		if e, ok := f["levels"]; ok {
			var good bool
			fl.Levels, good = r.levelRefs(s, e.val, join(p, "levels"))
			complete = complete && good
			levels, levelsAt, levelsPath = fl.Levels, e.val, join(p, "levels")
		}
		if s.levelsOK {
			for _, l := range levels {
				if first, dup := owner[l]; dup {
					r.fail(levelsAt, levelsPath, "level %s is given by %s and %s", l, index(path, first), p)
				} else {
					owner[l] = i
				}
			}
		}
		if e, ok := f["gk"]; ok {
			fl.Gk, _ = r.plausible(e.val, join(p, "gk"), LimitAreaLoad)
		} else {
			r.fail(it, join(p, "gk"), "is required but missing (the permanent area load besides beams and columns, e.g. gk: 5.8 kN/m2)")
		}
		qkOK := false
		if e, ok := f["qk"]; ok {
			fl.Qk, qkOK = r.plausible(e.val, join(p, "qk"), LimitAreaLoad)
		} else {
			r.fail(it, join(p, "qk"), "is required but missing (the imposed area load, e.g. qk: 2.5 kN/m2; 0 for none)")
		}
		if e, ok := f["category"]; ok {
			fl.Category, _ = r.category(e.val, join(p, "category"))
		} else if qkOK && fl.Qk > 0 {
			r.fail(it, join(p, "category"), "is required but missing with an imposed load (the category of EN 1991-1-1 Table 6.1, e.g. category: B)")
		}
		if e, ok := f["spans"]; ok {
			fl.Spans, _ = r.oneOf(e.val, join(p, "spans"), model.SpanX, model.SpanY, model.SpanTwoWay)
		} else {
			r.fail(it, join(p, "spans"), "is required but missing (how the slab carries its load: x, y or two-way)")
		}
		if e, ok := f["slab"]; ok {
			fl.Thickness = r.slab(s, b, e.val, join(p, "slab"), levels)
		}
		out = append(out, fl)
	}
	if s.levelsOK && complete {
		for _, l := range s.levels {
			if !has(owner, l) {
				r.fail(key, path, "level %s has no floor", l)
			}
		}
	}
	return out
}

// lineLoads reads the loads on the beams of grid lines.
func (r *reader) lineLoads(s *site, n *yaml.Node, path string) []model.LineLoad {
	return listOf(r, n, path, "line loads", []string{"levels", "line", "from", "to", "gk", "qk", "category"}, func(f map[string]pair, it *yaml.Node, p string) (model.LineLoad, bool) {
		ll := model.LineLoad{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		kind := lineKind(0)
		if e, ok := f["line"]; ok {
			var good bool
			kind, _, ll.GridLine, good = r.gridLine(s, e.val, join(p, "line"))
			if !good {
				kind = 0
			}
		} else {
			r.fail(it, join(p, "line"), "is required but missing (the grid line of the beams, e.g. line: A)")
		}
		ll.From, ll.To = r.crossRange(s, f, p, kind, ll.GridLine)
		ll.Gk, ll.Qk, ll.Category = r.loadPair(f, it, p, LimitLineLoad, "gk: 8.5 kN/m")
		return ll, true
	})
}

// crossRange reads the optional from and to of entry f at p: lines crossing grid line name of
// kind kind (0: the line is unread, and they are left unread). With one end given the other is
// the end of the line, so that both are set or both empty.
func (r *reader) crossRange(s *site, f map[string]pair, p string, kind lineKind, name string) (string, string) {
	from, to, bad := -1, -1, false
	var fromName, toName string
	for _, k := range []string{"from", "to"} {
		e, ok := f[k]
		if !ok || kind == 0 {
			continue
		}
		ck, ci, cname, good := r.gridLine(s, e.val, join(p, k))
		switch {
		case !good:
			bad = true
		case ck == kind:
			cross := "a numbered"
			if kind == numbered {
				cross = "a lettered"
			}
			r.fail(e.val, join(p, k), "line %s runs parallel to line %s and does not cross it; give %s line", cname, name, cross)
			bad = true
		case k == "from":
			from, fromName = ci, cname
		default:
			to, toName = ci, cname
		}
	}
	if kind == 0 || bad || !s.gridOK || from < 0 && to < 0 {
		return fromName, toName
	}
	last := s.ny - 1
	if kind == numbered {
		last = s.nx - 1
	}
	at, atPath := f["from"], join(p, "from")
	if from < 0 {
		from, fromName = 0, crossName(kind, 0)
	}
	if to < 0 {
		to, toName = last, crossName(kind, last)
	} else {
		at, atPath = f["to"], join(p, "to")
	}
	if from >= to {
		r.fail(at.val, atPath, "the range from line %s to line %s along line %s is empty; give from before to", fromName, toName, name)
	}
	return fromName, toName
}

// loadPair reads the gk and qk of load entry f (mapping n at p), each within l and at least one
// given, and the category that an imposed load needs; example is a load for the message.
func (r *reader) loadPair(f map[string]pair, n *yaml.Node, p string, l Limit, example string) (gk, qk float64, category string) {
	qOK := false
	eg, hasG := f["gk"]
	if hasG {
		gk, _ = r.plausible(eg.val, join(p, "gk"), l)
	}
	eq, hasQ := f["qk"]
	if hasQ {
		qk, qOK = r.plausible(eq.val, join(p, "qk"), l)
	}
	if !hasG && !hasQ {
		r.fail(n, p, "give the load: gk, qk or both (e.g. %s)", example)
	}
	if e, ok := f["category"]; ok {
		category, _ = r.category(e.val, join(p, "category"))
	} else if qOK && qk > 0 {
		r.fail(n, join(p, "category"), "is required but missing with an imposed load (the category of EN 1991-1-1 Table 6.1, e.g. category: B)")
	}
	return gk, qk, category
}

// The grid's axes for messages: their names and the grid line each is measured from.
var (
	axisNames = [2]string{"x", "y"}
	axisFrom  = [2]string{"A", "1"}
)

// pointLoads reads the concentrated loads on the floors, each at a point of the grid.
func (r *reader) pointLoads(s *site, n *yaml.Node, path string) []model.PointLoad {
	return listOf(r, n, path, "point loads", []string{"levels", "at", "gk", "qk", "category"}, func(f map[string]pair, it *yaml.Node, p string) (model.PointLoad, bool) {
		pl := model.PointLoad{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		if e, ok := f["at"]; ok {
			pl.X, pl.Y = r.at(s, e.val, join(p, "at"))
		} else {
			r.fail(it, join(p, "at"), "is required but missing (the point from grid lines A and 1, e.g. at: {x: 9.6 m, y: 3.0 m})")
		}
		pl.Gk, pl.Qk, pl.Category = r.loadPair(f, it, p, limitPointLoad, "gk: 45 kN")
		return pl, true
	})
}

// at reads a point {x, y} of the grid, mm from grid lines A and 1.
func (r *reader) at(s *site, n *yaml.Node, path string) (x, y float64) {
	f := r.fields(n, path, "x", "y")
	if f == nil {
		return 0, 0
	}
	var v [2]float64
	for i, axis := range axisNames {
		e, ok := f[axis]
		if !ok {
			r.fail(n, join(path, axis), "is required but missing (the distance along %s from line %s, e.g. %s: 3.0 m)", axis, axisFrom[i], axis)
			continue
		}
		v[i], _ = r.onGrid(s, e.val, join(path, axis), i)
	}
	return v[0], v[1]
}

// onGrid reads a distance along axis i of the grid (0: x from line A, 1: y from line 1), mm,
// that must lie on the grid.
func (r *reader) onGrid(s *site, n *yaml.Node, path string, i int) (float64, bool) {
	v, ok := r.number(n, path, "mm")
	if !ok || !s.gridOK {
		return v, ok
	}
	end := s.lengths[i]
	switch {
	case v < 0 || v > end*(1+1e-9): // the sum of the bays may round
		r.fail(n, path, "%s lies off the grid, which runs from 0 to %s along %s (from line %s)", show(v, "mm"), show(end, "mm"), axisNames[i], axisFrom[i])
		return 0, false
	case v > end:
		v = end
	}
	return v, true
}

// areaLoads reads the area loads over rectangular zones of some floors.
func (r *reader) areaLoads(s *site, n *yaml.Node, path string) []model.AreaLoad {
	return listOf(r, n, path, "area loads", []string{"levels", "x", "y", "gk", "qk", "category"}, func(f map[string]pair, it *yaml.Node, p string) (model.AreaLoad, bool) {
		al := model.AreaLoad{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		for j, axis := range axisNames {
			e, ok := f[axis]
			if !ok {
				r.fail(it, join(p, axis), "is required but missing (the zone's extent along %s from line %s, e.g. %s: [6.6 m, 13.2 m])", axis, axisFrom[j], axis)
				continue
			}
			ends := r.zone(s, e.val, join(p, axis), j)
			if j == 0 {
				al.X = ends
			} else {
				al.Y = ends
			}
		}
		al.Gk, al.Qk, al.Category = r.loadPair(f, it, p, LimitAreaLoad, "gk: 2.0 kN/m2")
		return al, true
	})
}

// zone reads the extent [from, to] of a zone along axis i of the grid: on the grid, ordered
// and not empty.
func (r *reader) zone(s *site, n *yaml.Node, path string, i int) [2]float64 {
	var v [2]float64
	its, ok := r.list(n, path, "zone ends")
	if !ok {
		return v
	}
	if len(its) != 2 {
		r.fail(n, path, "expected the two ends of the zone, [from, to], found %d values", len(its))
		return v
	}
	good := true
	for j, it := range its {
		var ok bool
		v[j], ok = r.onGrid(s, it, index(path, j), i)
		good = good && ok
	}
	if good && !(v[0] < v[1]) {
		r.fail(n, path, "the zone from %s to %s along %s is empty; give from before to", show(v[0], "mm"), show(v[1], "mm"), axisNames[i])
	}
	return v
}

// cantilevers reads the slabs that continue beyond an edge grid line.
func (r *reader) cantilevers(s *site, n *yaml.Node, path string) []model.Cantilever {
	return listOf(r, n, path, "cantilevers", []string{"levels", "line", "from", "to", "length"}, func(f map[string]pair, it *yaml.Node, p string) (model.Cantilever, bool) {
		c := model.Cantilever{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		kind := lineKind(0)
		if e, ok := f["line"]; ok {
			kind, c.GridLine = r.edgeLine(s, e.val, join(p, "line"))
		} else {
			r.fail(it, join(p, "line"), "is required but missing (the edge grid line the slab continues beyond, e.g. line: A)")
		}
		c.From, c.To = r.crossRange(s, f, p, kind, c.GridLine)
		if e, ok := f["length"]; ok {
			c.Length, _ = r.plausible(e.val, join(p, "length"), limitCantilever)
		} else {
			r.fail(it, join(p, "length"), "is required but missing (how far the slab continues beyond the line, e.g. length: 1.5 m)")
		}
		return c, true
	})
}

// edgeLine reads a grid line that must be an edge of the grid: the first or last lettered line
// or the first or last numbered one. It returns kind 0 when the name is unread.
func (r *reader) edgeLine(s *site, n *yaml.Node, path string) (lineKind, string) {
	k, i, name, ok := r.gridLine(s, n, path)
	if !ok {
		return 0, ""
	}
	last := s.nx - 1
	if k == numbered {
		last = s.ny - 1
	}
	if s.gridOK && i != 0 && i != last {
		r.fail(n, path, "line %s is not an edge of the grid; a cantilever continues beyond an edge line (A or %s, 1 or %d)", name, letters(s.nx-1), s.ny)
	}
	return k, name
}

// crossName names cross line i of a line of kind k: numbered lines cross lettered ones and back.
func crossName(k lineKind, i int) string {
	if k == lettered {
		return strconv.Itoa(i + 1)
	}
	return letters(i)
}

// slab reads a floor's slab {thickness}, which must be less than the depth of every beam at
// levels; it returns 0 when the thickness is not read.
func (r *reader) slab(s *site, b *model.Building, n *yaml.Node, path string, levels []string) float64 {
	f := r.fields(n, path, "thickness")
	if f == nil {
		return 0
	}
	p := join(path, "thickness")
	e, ok := f["thickness"]
	if !ok {
		r.fail(n, p, "is required but missing (the slab thickness, e.g. slab: {thickness: 225 mm})")
		return 0
	}
	t, ok := r.plausible(e.val, p, limitSlab)
	if !ok {
		return 0
	}
	least, level, from := 0.0, "", ""
	for _, l := range levels {
		if d, src := leastBeamDepth(s, b, l); d > 0 && (least == 0 || d < least) {
			least, level, from = d, l, src
		}
	}
	if least > 0 && !(t < least) {
		r.fail(e.val, p, "%s is not less than the depth of the shallowest beam at level %s, %s (%s); the beams must reach below the slab",
			show(t, "mm"), level, show(least, "mm"), from)
		return 0
	}
	return t
}

// leastBeamDepth returns the depth of the shallowest beams at level and the field that gives
// it, the beams of each grid line taking the last size override that covers them; 0 when a
// depth is unknown.
func leastBeamDepth(s *site, b *model.Building, level string) (float64, string) {
	if !s.gridOK {
		return 0, ""
	}
	least, from := 0.0, ""
	for _, dir := range []string{"x", "y"} {
		// Beams along x lie on the numbered lines, beams along y on the lettered ones.
		name, count := func(i int) string { return strconv.Itoa(i + 1) }, s.ny
		if dir == "y" {
			name, count = letters, s.nx
		}
		for i := range count {
			d, src := beamDepth(b, level, dir, name(i))
			if d <= 0 {
				return 0, ""
			}
			if least == 0 || d < least {
				least, from = d, src
			}
		}
	}
	return least, from
}

// beamDepth returns the depth of the beams along dir on grid line line at level, and the field
// that gives it.
func beamDepth(b *model.Building, level, dir, line string) (float64, string) {
	d, from := b.Beam.H, "building.beams.h"
	for i, o := range b.Beams {
		if covers(o.Levels, level) && (o.Dir == "" || o.Dir == dir) && covers(o.Lines, line) {
			d, from = o.H, index("building.beam_sizes", i)+".h"
		}
	}
	return d, from
}

// covers reports whether a list of names that is empty for all holds name.
func covers(names []string, name string) bool {
	return len(names) == 0 || slices.Contains(names, name)
}

// concreteZones reads the concrete classes of some columns at some levels; later entries win.
func (r *reader) concreteZones(s *site, n *yaml.Node, path string) []model.ConcreteZone {
	return listOf(r, n, path, "concrete zones", []string{"levels", "columns", "class"}, func(f map[string]pair, it *yaml.Node, p string) (model.ConcreteZone, bool) {
		z := model.ConcreteZone{Line: it.Line, Levels: r.levelsOf(s, f, p)}
		if e, ok := f["columns"]; ok {
			z.Columns, _ = r.columnRefs(s, e.val, join(p, "columns"))
		}
		e, ok := f["class"]
		if !ok {
			r.fail(it, join(p, "class"), "is required but missing (the strength class of EN 1992-1-1 Table 3.1, e.g. class: C45/55)")
			return z, false
		}
		z.Class, ok = r.concreteClass(e.val, join(p, "class"))
		return z, ok
	})
}

// listOf reads list n of mappings with the given keys, each by one from its fields, node and
// path, and keeps what one accepts; what names the entries in messages.
func listOf[T any](r *reader, n *yaml.Node, path, what string, keys []string, one func(f map[string]pair, it *yaml.Node, p string) (T, bool)) []T {
	items, ok := r.list(n, path, what)
	if !ok {
		return nil
	}
	var out []T
	for i, it := range items {
		p := index(path, i)
		if f := r.fields(it, p, keys...); f != nil {
			if v, ok := one(f, it, p); ok {
				out = append(out, v)
			}
		}
	}
	return out
}

// levelsOf reads the optional levels of entry f at p; nil stands for every level.
func (r *reader) levelsOf(s *site, f map[string]pair, p string) []string {
	e, ok := f["levels"]
	if !ok {
		return nil
	}
	levels, _ := r.levelRefs(s, e.val, join(p, "levels"))
	return levels
}

// concreteClass reads a strength class of EN 1992-1-1 Table 3.1 such as C30/37.
func (r *reader) concreteClass(n *yaml.Node, path string) (material.Concrete, bool) {
	s, ok := r.str(n, path)
	if !ok {
		return material.Concrete{}, false
	}
	c, found := material.Lookup(s)
	if !found {
		r.fail(n, path, "%q is not a strength class of EN 1992-1-1 Table 3.1 (classes: %s)", s, material.ClassNames())
	}
	return c, found
}
