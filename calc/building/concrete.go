package building

import (
	"strings"

	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// ClassOf returns the concrete class of a column over a lift (named by the level at its top):
// the last concrete zone of the building that names the column (or names none) and the level
// (or names none), else def, the project's class.
func ClassOf(b *model.Building, def material.Concrete, column, level string) material.Concrete {
	c := def
	if b == nil {
		return c
	}
	for _, z := range b.Concrete {
		if contains(z.Columns, column) && contains(z.Levels, level) {
			c = z.Class
		}
	}
	return c
}

// BeamClass returns the concrete class of the building's beams: the one given, else def.
func BeamClass(b *model.Building, def material.Concrete) material.Concrete {
	if b != nil && b.BeamConcrete != nil {
		return *b.BeamConcrete
	}
	return def
}

// ClassesInUse returns the concrete classes of the building's columns: def first, then each
// other class some column has over some lift, in the order the grid (A1, A2, …, B1, …, each
// lowest lift first) first meets it. Grid points left out at every level are skipped.
func ClassesInUse(b *model.Building, def material.Concrete) []material.Concrete {
	out := []material.Concrete{def}
	if b == nil || len(b.Concrete) == 0 {
		return out
	}
	seen := map[string]bool{def.Class: true}
	for i := 0; i <= len(b.GridX); i++ {
		for j := 0; j <= len(b.GridY); j++ {
			id := ColumnID(i, j)
			if omitted(b.Omit, id) {
				continue
			}
			for _, st := range b.Storeys {
				if c := ClassOf(b, def, id, st.Name); !seen[c.Class] {
					seen[c.Class] = true
					out = append(out, c)
				}
			}
		}
	}
	return out
}

// omitted reports whether the column id is among the grid points left out.
func omitted(omit []string, id string) bool {
	for _, o := range omit {
		if strings.EqualFold(strings.TrimSpace(o), id) {
			return true
		}
	}
	return false
}

// ClassIDPart returns the class name as one part of a step ID: "C32/40" → "C32-40".
func ClassIDPart(class string) string {
	return strings.NewReplacer("/", "-", " ", "-").Replace(class)
}

// stiffness holds the moduli and the beam factor that the subframe of one joint takes: Ecm of
// the class of the column below (this lift), of the column above and of the beams, and the
// factor on the beams' stiffness (a constant for half stiffness, a step for full).
type stiffness struct {
	below, above, beam trace.Q
	kBeam              trace.Q
}

// uniformDefault reports whether every member of the building, columns and beams, is of the
// project's class: the subframe then records one modulus for all, as it always has.
func uniformDefault(b *model.Building, def material.Concrete) bool {
	if BeamClass(b, def).Class != def.Class {
		return false
	}
	for _, z := range b.Concrete {
		if z.Class.Class != def.Class {
			return false
		}
	}
	return true
}

// moduliSteps records the moduli of elasticity (Ecm, EN 1992-1-1:2004 Table 3.1) that the
// subframe at the top of lift m of one column takes: one step for every member where the whole
// building is of the project's class, else one step per class in use at the joint, named by
// the class and saying which members it serves.
func moduliSteps(l *trace.Log, in *model.Input, lifts []Lift, m int) stiffness {
	b := in.Building
	def := in.Materials.Concrete
	l.Group = "Column moments: stiffness"
	if uniformDefault(b, def) {
		e := l.Add(trace.Input("sub/E", "Modulus of elasticity for the member stiffnesses (Ecm)", "EN 1992-1-1:2004 Table 3.1", "E", "MPa", def.Ecm).
			Note("The same modulus for beams and columns: the distribution depends only on I/L."))
		return stiffness{below: e, above: e, beam: e}
	}
	below := ClassOf(b, def, lifts[m].Column, lifts[m].Name)
	above := below
	if m+1 < len(lifts) {
		above = ClassOf(b, def, lifts[m].Column, lifts[m+1].Name)
	}
	beam := BeamClass(b, def)
	type use struct {
		c       material.Concrete
		members []string
	}
	var uses []*use
	add := func(c material.Concrete, member string) {
		for _, u := range uses {
			if u.c.Class == c.Class {
				u.members = append(u.members, member)
				return
			}
		}
		uses = append(uses, &use{c: c, members: []string{member}})
	}
	add(below, "the column below (this lift, "+lifts[m].Name+")")
	if m+1 < len(lifts) {
		add(above, "the column above (lift "+lifts[m+1].Name+")")
	}
	add(beam, "the beams")
	q := map[string]trace.Q{}
	for _, u := range uses {
		q[u.c.Class] = l.Add(trace.Input("sub/E_"+ClassIDPart(u.c.Class), "Modulus of elasticity of concrete "+u.c.Class+" for the member stiffnesses (Ecm)",
			"EN 1992-1-1:2004 Table 3.1", "E_cm,"+u.c.Class, "MPa", u.c.Ecm).
			Note("Ecm = 22·(fcm/10)^0.3 GPa of " + u.c.Class + ", for " + strings.Join(u.members, ", ") + "."))
	}
	return stiffness{below: q[below.Class], above: q[above.Class], beam: q[beam.Class]}
}

// memberClasses returns the concrete class of each lift's column of one column line and that
// of the beams.
func memberClasses(in *model.Input, lifts []Lift) (cols []material.Concrete, beam material.Concrete) {
	b := in.Building
	def := in.Materials.Concrete
	cols = make([]material.Concrete, len(lifts))
	for m, lf := range lifts {
		cols[m] = ClassOf(b, def, lf.Column, lf.Name)
	}
	return cols, BeamClass(b, def)
}

// ecmConst returns Ecm of class c as a constant of a step's arguments, its symbol naming the
// class where the building's members are not all of the project's class.
func ecmConst(in *model.Input, c material.Concrete) trace.Q {
	if uniformDefault(in.Building, in.Materials.Concrete) {
		return trace.Const(c.Ecm, "E_cm", "MPa")
	}
	return trace.Const(c.Ecm, "E_cm,"+c.Class, "MPa")
}

// classesNote returns the note that names the concrete classes of the members of a frame line
// meeting at one lift, where the building's members are not all of the project's class; empty
// otherwise.
func classesNote(in *model.Input, lf Lift) string {
	b := in.Building
	def := in.Materials.Concrete
	if uniformDefault(b, def) {
		return ""
	}
	return "Member stiffnesses EI with Ecm (EN 1992-1-1 Table 3.1) of each member's own class: this lift " +
		ClassOf(b, def, lf.Column, lf.Name).Class + ", the beams " + BeamClass(b, def).Class + "."
}
