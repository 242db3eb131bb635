package input

import (
	"colsheet/calc/model"

	"gopkg.in/yaml.v3"
)

// FaceEnds returns end moments given in the sign convention signs in the face convention of the
// model (equal signs: tension on the same face). With model.SignsMemberEnds the moments are the
// member-end moments of an analysis program, clockwise positive at both ends, of the column
// drawn with its bottom as the start of the member; then M_face,top = M_cw,top and
// M_face,bottom = −M_cw,bottom (the bending moment of the member at each end, statics).
// With model.SignsFace (or "") they are returned as they are.
func FaceEnds(e model.Ends, signs string) model.Ends {
	if signs != model.SignsMemberEnds {
		return e
	}
	return model.Ends{Top: e.Top, Bottom: negate(e.Bottom)}
}

// negate returns −v, keeping a zero positive so that no −0 reaches a sheet.
func negate(v float64) float64 {
	if v == 0 {
		return 0
	}
	return -v
}

// momentSigns reads moment_signs: face (the default) or member-ends. The building form derives
// its moments, so there the key is only remarked on.
func (r *reader) momentSigns(top map[string]pair, building bool) string {
	e, ok := top["moment_signs"]
	if !ok {
		return r.signs
	}
	if s, ok := r.oneOf(e.val, "moment_signs", model.SignsFace, model.SignsMemberEnds); ok {
		r.signs = s
	}
	if building {
		r.warn(r.file, e.key.Line, "moment_signs", "not used: the building form derives its end moments")
	}
	return r.signs
}

// warn records a warning.
func (r *reader) warn(file string, line int, field, msg string) {
	r.warns = append(r.warns, Warning{File: file, Line: line, Field: field, Msg: msg})
}

// liftActions reads the actions of a lift from its fields f into s: NEd and M (the one case
// "1"), or cases:, or nothing where the actions table gives the cases of every lift. NEd, MY
// and MZ of s are those of its first case.
func (r *reader) liftActions(n *yaml.Node, f map[string]pair, path string, s *model.Storey) {
	ned, hasNEd := f["NEd"]
	m, hasM := f["M"]
	cs, hasCases := f["cases"]
	switch {
	case r.tableAsked:
		for _, k := range []string{"NEd", "M", "cases"} {
			if e, ok := f[k]; ok {
				r.fail(e.key, join(path, k), "the actions table %q gives the cases of every lift (actions: at line %d); leave %s out here", r.tableName, r.tableLine, k)
			}
		}
		return
	case hasCases:
		if hasNEd {
			r.fail(cs.key, join(path, "cases"), "give either NEd and M (one case) or cases, not both (NEd at line %d)", ned.key.Line)
		} else if hasM {
			r.fail(cs.key, join(path, "cases"), "give either NEd and M (one case) or cases, not both (M at line %d)", m.key.Line)
		}
		s.Cases = r.cases(cs.val, join(path, "cases"))
	case hasNEd:
		c := model.Case{Name: "1", File: r.file, Line: ned.val.Line}
		c.NEd, _ = r.axial(ned.val, join(path, "NEd"))
		if hasM {
			c.MY, c.MZ = r.moments(m.val, join(path, "M"))
		}
		s.Cases = []model.Case{c}
	default:
		r.fail(n, join(path, "NEd"), "is required but missing (the design axial force, e.g. NEd: 2150 kN)")
		if hasM {
			r.moments(m.val, join(path, "M"))
		}
	}
	if len(s.Cases) > 0 {
		first := s.Cases[0]
		s.NEd, s.MY, s.MZ = first.NEd, first.MY, first.MZ
	}
}

// axial reads a design axial force: compression positive, tension negative, within LimitNEd
// either way.
func (r *reader) axial(n *yaml.Node, path string) (float64, bool) {
	return r.plausible(n, path, limitAxial)
}

// cases reads the load cases of a lift: a list of {name, NEd, M, V}, names unique in the lift.
func (r *reader) cases(n *yaml.Node, path string) []model.Case {
	items, ok := r.list(n, path, "load cases")
	if !ok {
		return nil
	}
	var out []model.Case
	names := map[string]int{}
	for i, it := range items {
		c := r.loadCase(it, index(path, i))
		r.unique(names, c.Name, it, path, i, "case name", "lift")
		out = append(out, c)
	}
	return out
}

// unique records name, of item i of the list at path, and reports it when an earlier item of
// the list has it: the what (a storey name) is used twice in this within (a column).
func (r *reader) unique(seen map[string]int, name string, item *yaml.Node, path string, i int, what, within string) {
	if name == "" {
		return
	}
	if first, dup := seen[name]; dup {
		r.fail(item, index(path, i)+".name", "%s %q is used twice in this %s (first at %s)", what, name, within, index(path, first))
		return
	}
	seen[name] = i
}

// loadCase reads one load case {name, NEd, M: {y: {top, bottom}, z: {top, bottom}}, V: {y, z}};
// M and V are optional, and so are each of V's y and z.
func (r *reader) loadCase(item *yaml.Node, path string) model.Case {
	n := resolve(item)
	c := model.Case{File: r.file, Line: item.Line}
	f := r.fields(n, path, "name", "NEd", "M", "V")
	if f == nil {
		return c
	}
	if e, ok := f["name"]; ok {
		c.Name, _ = r.name(e.val, join(path, "name"))
	} else {
		r.fail(n, join(path, "name"), "is required but missing (the case's name, e.g. name: ULS-1)")
	}
	if e, ok := f["NEd"]; ok {
		c.NEd, _ = r.axial(e.val, join(path, "NEd"))
	} else {
		r.fail(n, join(path, "NEd"), "is required but missing (the design axial force of the case, e.g. NEd: 2150 kN)")
	}
	if e, ok := f["M"]; ok {
		c.MY, c.MZ = r.moments(e.val, join(path, "M"))
	}
	if e, ok := f["V"]; ok {
		g := r.fields(e.val, join(path, "V"), "y", "z")
		for i, axis := range []string{"y", "z"} {
			if v, ok := g[axis]; ok {
				c.V[i], c.HasV[i] = r.plausible(v.val, join(path, "V."+axis), LimitShear)
			}
		}
	}
	return c
}
