package input

import (
	"errors"
	"math"
	"regexp"
	"strconv"
	"strings"

	"colsheet/calc/model"
	"colsheet/calc/quantity"

	"gopkg.in/yaml.v3"
)

// Defaults and limits of the method choices and the size finder.
const (
	DefaultCrackedK   = 0.5   // factor on the stiffness of restraining members, EN 1992-1-1 5.8.3.2(3)
	CrackedKMin       = 0.1   // smallest accepted cracked-stiffness factor
	CrackedKMax       = 1.0   // largest accepted cracked-stiffness factor
	DefaultRhoMax     = 0.04  // largest steel ratio As/Ac the size finder accepts by default
	RhoMaxMin         = 0.002 // smallest accepted steel_ratio_max
	RhoMaxMax         = 0.08  // largest accepted steel_ratio_max
	MaxSizeCandidates = 10000 // most sections the size finder may be asked to try
	DefaultCement     = "N"   // cement class when creep data name none, EN 1992-1-1 3.1.2(6)
	RHMin             = 10    // smallest accepted relative humidity, %
	RHMax             = 100   // largest accepted relative humidity, %
)

// cements are the cement classes of EN 1992-1-1 3.1.2(6).
var cements = []string{"S", "N", "R"}

var designKeys = []string{"stress_block", "imperfection", "members", "bar_diameters", "link_diameters",
	"link_spacing_step", "lap_step", "lap_above_floor", "second_order", "biaxial", "cracked_stiffness", "size_search", "durability", "fire",
	"selection", "typical"}

// methods reads the second-order, biaxial and cracked-stiffness choices, the size finder and the
// durability and fire data of the design block's fields f into o.
func (r *reader) methods(f map[string]pair, o *model.Options) {
	if e, ok := f["second_order"]; ok {
		if s, ok := r.oneOf(e.val, "design.second_order", model.SecondOrderCurvature, model.SecondOrderStiffness, model.SecondOrderBoth); ok {
			o.SecondOrder = s
		}
	}
	if e, ok := f["biaxial"]; ok {
		if s, ok := r.clauseOf(e.val, "design.biaxial", 5.39, model.BiaxialRule, model.BiaxialExact); ok {
			o.Biaxial = s
		}
	}
	if e, ok := f["cracked_stiffness"]; ok {
		if v, ok := r.within(e.val, "design.cracked_stiffness", CrackedKMin, CrackedKMax,
			"the factor on the stiffness of restraining members for cracking (EN 1992-1-1 5.8.3.2(3))"); ok {
			o.CrackedK = v
		}
	}
	if e, ok := f["size_search"]; ok {
		o.Sizes = r.sizeSearch(e.key, e.val, "design.size_search")
	}
	if e, ok := f["durability"]; ok {
		o.Durability = r.durability(e.val, "design.durability", nil)
	}
	if e, ok := f["fire"]; ok {
		o.Fire = r.fire(e.val, "design.fire", nil)
	}
	if e, ok := f["selection"]; ok {
		r.selection(e.val, "design.selection", &o.Selection)
	}
	if e, ok := f["typical"]; ok {
		r.typical(e.val, "design.typical", &o.Typical)
	}
}

// within reads a pure number that must lie between lo and hi; what names it in the message.
func (r *reader) within(n *yaml.Node, path string, lo, hi float64, what string) (float64, bool) {
	v, ok := r.number(n, path, "")
	if !ok {
		return 0, false
	}
	if v < lo || v > hi {
		r.fail(n, path, "%s must lie between %s and %s, found %s", what, show(lo, ""), show(hi, ""), show(v, ""))
		return 0, false
	}
	return v, true
}

// boolean reads true or false.
func (r *reader) boolean(n *yaml.Node, path string) (bool, bool) {
	v := resolve(n)
	var b bool
	if v.Kind != yaml.ScalarNode || v.ShortTag() != "!!bool" || v.Decode(&b) != nil {
		r.fail(v, path, "expected true or false, found %s", kindName(v))
		return false, false
	}
	return b, true
}

// sizeSearch reads the size finder under key: a list of sizes, or a step with min and max.
// It returns nil when the entry has a fault.
func (r *reader) sizeSearch(key, n *yaml.Node, path string) *model.SizeSearch {
	f := r.fields(n, path, "sizes", "step", "min", "max", "square", "steel_ratio_max")
	if f == nil {
		return nil
	}
	before := len(r.errs)
	s := &model.SizeSearch{RhoMax: DefaultRhoMax}
	if e, ok := f["steel_ratio_max"]; ok {
		s.RhoMax, _ = r.within(e.val, join(path, "steel_ratio_max"), RhoMaxMin, RhoMaxMax, "the largest steel ratio As/Ac")
	}
	sq, hasSquare := f["square"]
	if hasSquare {
		s.Square, _ = r.boolean(sq.val, join(path, "square"))
	}
	list, hasSizes := f["sizes"]
	var ranged []pair
	for _, k := range []string{"step", "min", "max"} {
		if e, ok := f[k]; ok {
			ranged = append(ranged, e)
		}
	}
	switch {
	case hasSizes && len(ranged) > 0:
		r.fail(ranged[0].key, path, "give either sizes (a list of [b, h]) or step, min and max, not both")
	case hasSizes:
		if hasSquare {
			r.fail(sq.key, join(path, "square"), "applies to step, min and max only; list the sections wanted under sizes instead")
		}
		s.Sizes = r.sizeList(list.val, join(path, "sizes"))
	case len(ranged) > 0:
		r.sizeRange(f, n, path, s)
	default:
		r.fail(key, path, "give the candidate sections, as sizes: [[300 mm, 300 mm], [350 mm, 350 mm]] or as step, min and max")
	}
	if len(r.errs) > before {
		return nil
	}
	return s
}

// sizeList reads a list of sections, each a pair [b, h] or a mapping {b, h}, kept in order.
func (r *reader) sizeList(n *yaml.Node, path string) []model.Size {
	items, ok := r.list(n, path, "sections [b, h]")
	if !ok {
		return nil
	}
	if len(items) > MaxSizeCandidates {
		r.fail(n, path, "%d sections are more than the %d the size finder takes", len(items), MaxSizeCandidates)
		return nil
	}
	var out []model.Size
	seen := map[model.Size]int{}
	for i, it := range items {
		p := index(path, i)
		sz, ok := r.pairSize(it, p)
		if !ok {
			continue
		}
		if first, dup := seen[sz]; dup {
			r.fail(it, p, "the section %s × %s is listed twice (first at %s)", show(sz.B, ""), show(sz.H, "mm"), index(path, first))
			continue
		}
		seen[sz] = i
		out = append(out, sz)
	}
	return out
}

// pairSize reads one section: a list [b, h] of two lengths or a mapping {b, h}.
func (r *reader) pairSize(n *yaml.Node, path string) (model.Size, bool) {
	v := resolve(n)
	var at [2]*yaml.Node
	var paths [2]string
	switch {
	case v.Kind == yaml.MappingNode:
		f := r.fields(v, path, "b", "h")
		ok := true
		for i, k := range []string{"b", "h"} {
			e, has := f[k]
			if !has {
				r.fail(v, join(path, k), "is required but missing (give the section as [b, h] or {b: 350 mm, h: 450 mm})")
				ok = false
			}
			at[i], paths[i] = e.val, join(path, k)
		}
		if !ok {
			return model.Size{}, false
		}
	case v.Kind == yaml.SequenceNode && len(v.Content) == 2:
		at = [2]*yaml.Node{v.Content[0], v.Content[1]}
		paths = [2]string{index(path, 0), index(path, 1)}
	default:
		r.fail(v, path, "expected a section [b, h] of two lengths, e.g. [350 mm, 450 mm], found %s", describeItems(v))
		return model.Size{}, false
	}
	b, okb := r.plausible(at[0], paths[0], LimitSide)
	h, okh := r.plausible(at[1], paths[1], LimitSide)
	return model.Size{B: b, H: h}, okb && okh
}

// describeItems names what n holds for messages, counting the items of a list.
func describeItems(n *yaml.Node) string {
	if n.Kind == yaml.SequenceNode {
		if len(n.Content) == 1 {
			return "a list of 1 item"
		}
		return "a list of " + strconv.Itoa(len(n.Content)) + " items"
	}
	return kindName(n)
}

// sizeRange reads step, min and max of the size finder's fields f into s.
func (r *reader) sizeRange(f map[string]pair, n *yaml.Node, path string, s *model.SizeSearch) {
	hint := map[string]string{
		"step": "the step of b and h, e.g. step: 25 mm",
		"min":  "the smallest b and h, e.g. min: 250 mm",
		"max":  "the largest b and h, e.g. max: 800 mm",
	}
	vals := map[string]float64{}
	good := true
	for _, k := range []string{"step", "min", "max"} {
		e, ok := f[k]
		if !ok {
			r.fail(n, join(path, k), "is required but missing with a step, min and max search (%s)", hint[k])
			good = false
			continue
		}
		var v float64
		if k == "step" {
			v, ok = r.positive(e.val, join(path, k), "mm")
		} else {
			v, ok = r.plausible(e.val, join(path, k), LimitSide)
		}
		good = good && ok
		vals[k] = v
	}
	if !good {
		return
	}
	s.Step, s.Min, s.Max = vals["step"], vals["min"], vals["max"]
	if s.Min > s.Max {
		r.fail(f["min"].val, join(path, "min"), "min = %s is greater than max = %s", show(s.Min, "mm"), show(s.Max, "mm"))
		return
	}
	steps := math.Floor((s.Max-s.Min)/s.Step+1e-9) + 1
	count := steps
	if !s.Square {
		count = steps * steps
	}
	if count > MaxSizeCandidates {
		r.fail(f["step"].val, join(path, "step"), "%s from %s to %s gives %s sections, more than the %d the size finder takes; give a larger step",
			show(s.Step, "mm"), show(s.Min, "mm"), show(s.Max, "mm"), show(count, ""), MaxSizeCandidates)
	}
}

// creep reads the data of EN 1992-1-1 Annex B: rh, t0, cement and, where withRatio, ratio.
// It returns nil when the entry has a fault.
func (r *reader) creep(n *yaml.Node, path string, withRatio bool) *model.Creep {
	f := r.fields(n, path, "rh", "t0", "cement", "ratio")
	if f == nil {
		return nil
	}
	before := len(r.errs)
	c := &model.Creep{Cement: DefaultCement}
	at := resolve(n)
	if e, ok := f["rh"]; ok {
		c.RH, _ = r.humidity(e.val, join(path, "rh"))
	} else {
		r.fail(at, join(path, "rh"), "is required but missing (the relative humidity of the ambient environment in %%, e.g. rh: 50)")
	}
	if e, ok := f["t0"]; ok {
		c.T0, _ = r.age(e.val, join(path, "t0"))
	} else {
		r.fail(at, join(path, "t0"), "is required but missing (the age of the concrete at loading in days, e.g. t0: 28 d)")
	}
	if e, ok := f["cement"]; ok {
		c.Cement, _ = r.cement(e.val, join(path, "cement"))
	}
	if e, ok := f["ratio"]; ok {
		if withRatio {
			c.Ratio, _ = r.within(e.val, join(path, "ratio"), 0, 1, "the ratio M0Eqp/M0Ed")
		} else {
			r.fail(e.key, join(path, "ratio"), "is derived from the quasi-permanent combination in the building form; leave it out")
		}
	}
	if len(r.errs) > before {
		return nil
	}
	return c
}

// humidity reads a relative humidity in %: a plain number (50) or a percentage ("50 %").
func (r *reader) humidity(n *yaml.Node, path string) (float64, bool) {
	var v float64
	if t := resolve(n); t.Kind == yaml.ScalarNode && t.ShortTag() == "!!str" && strings.HasSuffix(strings.TrimSpace(t.Value), "%") {
		// "50 %" is the number 50 in the field's unit, %: read what stands before the sign.
		x, err := r.env.Eval(strings.TrimSuffix(strings.TrimSpace(t.Value), "%"), "")
		if errors.Is(err, quantity.ErrBadVar) {
			return 0, false
		}
		if err != nil {
			r.fail(t, path, "%q: give the relative humidity in %%, e.g. 50 or \"50 %%\"", t.Value)
			return 0, false
		}
		v = x
	} else {
		var ok bool
		if v, ok = r.number(n, path, ""); !ok {
			return 0, false
		}
	}
	if v < RHMin || v > RHMax {
		r.fail(n, path, "the relative humidity must lie between %d and %d %%, found %s", RHMin, RHMax, show(v, ""))
		return 0, false
	}
	return v, true
}

var daysText = regexp.MustCompile(`^\s*([-+]?[0-9]*\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\s*(?:d|day|days)\s*$`)

// age reads an age in days: a number, a number with d, day or days ("28 d"), or an expression
// over the vars that gives a pure number; it must be greater than zero.
func (r *reader) age(n *yaml.Node, path string) (float64, bool) {
	v := resolve(n)
	var x float64
	tag := v.ShortTag()
	switch m := daysText.FindStringSubmatch(v.Value); {
	case v.Kind != yaml.ScalarNode || tag != "!!str" && tag != "!!int" && tag != "!!float":
		r.fail(v, path, "expected an age in days such as 28 or \"28 d\", found %s", kindName(v))
		return 0, false
	case tag != "!!str":
		var ok bool
		if x, ok = r.number(v, path, ""); !ok {
			return 0, false
		}
	case m != nil:
		var err error
		x, err = strconv.ParseFloat(m[1], 64)
		if err != nil || math.IsInf(x, 0) {
			r.fail(v, path, "%q is not a finite number of days", v.Value)
			return 0, false
		}
	default:
		var err error
		x, err = r.env.Eval(v.Value, "")
		if errors.Is(err, quantity.ErrBadVar) {
			return 0, false
		}
		if err != nil {
			r.fail(v, path, "%s; give the age in days: 28, \"28 d\" or \"28 days\"", err)
			return 0, false
		}
	}
	if !(x > 0) {
		r.fail(v, path, "the age at loading must be greater than 0 days, found %s", show(x, ""))
		return 0, false
	}
	return x, true
}

// cement reads a cement class of EN 1992-1-1 3.1.2(6): S, N or R, upper-cased.
func (r *reader) cement(n *yaml.Node, path string) (string, bool) {
	return r.upperOf(n, path, "a cement class of EN 1992-1-1 3.1.2(6)", cements)
}
