package input

import (
	"colsheet/calc/detail"
	"colsheet/calc/model"

	"gopkg.in/yaml.v3"
)

// Shape names of the input (shape:); a rectangle is the default.
const (
	shapeRectangle = "rectangle"
	shapeCircle    = "circle"
)

// ringMin is the least number of given bars evenly on the circle of a circular column: the
// engine's least, whose clause is cited there.
const ringMin = detail.RingMin

// columnSection reads the section of a column from the fields f of mapping n at path: b and h
// of a rectangle (the default shape), or the diameter D of a circle (shape: circle, or D given
// alone), then stored as B = H = D with Shape model.ShapeCircle; helix: true binds a circle's
// bars with a helix and is refused on a rectangle. missing holds the hints of a missing b and h.
// It reports whether the section was read without a fault.
func (r *reader) columnSection(f map[string]pair, n *yaml.Node, path string, missing [2]string) (model.Size, bool) {
	var s model.Size
	ok := true
	shapeEntry, hasShape := f["shape"]
	dEntry, hasD := f["D"]
	circle := hasD
	if hasShape {
		v, good := r.oneOf(shapeEntry.val, join(path, "shape"), shapeRectangle, shapeCircle)
		if good {
			circle = v == shapeCircle
		}
		ok = good
	}
	if circle {
		for _, k := range []string{"b", "h"} {
			if e, has := f[k]; has {
				r.fail(e.key, join(path, k), "a circular column gives its diameter D, not b and h")
				ok = false
			}
		}
		if !hasD {
			r.fail(shapeEntry.val, join(path, "D"), "is required but missing (shape: circle takes the diameter, e.g. D: 450 mm)")
			return s, false
		}
		d, good := r.plausible(dEntry.val, join(path, "D"), LimitSide)
		s = model.Size{B: d, H: d, Shape: model.ShapeCircle}
		ok = ok && good
	} else {
		if hasD {
			r.fail(dEntry.key, join(path, "D"), "D is the diameter of a circular column; shape: rectangle gives b and h (leave shape out, or write shape: circle, for a circle)")
			ok = false
		}
		sides, good := r.sides(f, n, path, missing)
		s.B, s.H = sides.B, sides.H
		ok = ok && good
	}
	if e, has := f["helix"]; has {
		v, good := r.boolean(e.val, join(path, "helix"))
		switch {
		case !good:
			ok = false
		case v && !circle:
			r.fail(e.val, join(path, "helix"), "a helix binds the bars of a circular column, and this column is rectangular (give D, or shape: circle with D, for a circle)")
			ok = false
		default:
			s.Helix = v && circle
		}
	}
	return s, ok
}

// least returns the least width of a column section and its name in messages: D for a circle,
// min(b, h) for a rectangle.
func least(s model.Size) (float64, string) {
	if s.Shape == model.ShapeCircle {
		return s.B, "D"
	}
	return min(s.B, s.H), "min(b, h)"
}

// roomFault reports a column section s too small for its cover, links and bars at node at:
// 2·(cover + link + bar) must be less than its least width.
func (r *reader) roomFault(at *yaml.Node, path string, s model.Size, cover, link, bar float64) {
	need := 2 * (cover + link + bar)
	side, name := least(s)
	if !(need < side) {
		r.fail(at, path, "no room for links and bars: 2·(cover + link + bar) = 2·(%s + %s + %s) = %s is not less than %s = %s",
			show(cover, ""), show(link, ""), show(bar, ""), show(need, "mm"), name, show(side, "mm"))
	}
}

// ringCount reports a given bar count too small for a circular column (at node at, the count):
// bars evenly on a circle number at least ringMin.
func (r *reader) ringCount(at *yaml.Node, path string, count int, where string) bool {
	if count >= ringMin {
		return true
	}
	r.fail(at, path, "a circular column takes at least %d bars evenly on its circle%s, found %d", ringMin, where, count)
	return false
}

// valueOf returns the value of key in mapping n, or nil; it reports nothing (the mapping has
// been read with its faults already).
func valueOf(n *yaml.Node, key string) *yaml.Node {
	n = resolve(n)
	if n == nil || n.Kind != yaml.MappingNode {
		return nil
	}
	for i := 0; i+1 < len(n.Content); i += 2 {
		if k := resolve(n.Content[i]); k.Kind == yaml.ScalarNode && k.Value == key {
			return n.Content[i+1]
		}
	}
	return nil
}
