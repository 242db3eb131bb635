// Package actions turns characteristic actions into design values for the columns of a
// building: ψ factors, the ULS combinations of EN 1990, the imposed-load reductions of
// EN 1991-1-1, the factored loads of the load arrangements of EN 1992-1-1 5.1.3, and the
// distribution of slab loads to beams and columns.
//
// Units: N, mm; area loads in N/mm² (1 kN/m² = 1e-3 N/mm²), line loads in N/mm (= kN/m).
// Every function is pure: traced quantities in, trace.Step out.
package actions

import (
	"strconv"
	"strings"

	"colsheet/calc/code"
	"colsheet/calc/quantity"
	"colsheet/calc/trace"
)

const (
	en1990 = "EN 1990:2002 "
	en1991 = "EN 1991-1-1:2002 "
	en1992 = "EN 1992-1-1:2004 "
)

// ParamStep returns an input step recording the catalogue parameter name in force in p,
// with a caution when the input overrode its EN recommended value. The step's title is the
// catalogue's description without the unit it ends with ("…, N/mm³"): the sheets show the
// value in their own unit (kN/m³), and the title must not name another.
func ParamStep(id string, p code.Params, name, unit string) trace.Step {
	c, _ := code.Lookup(name)
	title, catUnit := splitUnit(c.What)
	s := trace.Input(id, title, c.Clause, c.Symbol, unit, p.Get(name))
	if p.IsOverridden(name) {
		def := strconv.FormatFloat(c.Default, 'g', -1, 64)
		if catUnit != "" {
			def += " " + catUnit
		}
		s = s.Caution("Overridden in the input: the EN recommended value is " + def + ".")
	}
	return s
}

// splitUnit splits a catalogue description "Weight density of reinforced concrete, N/mm³" into
// the words and the unit it ends with; the unit is "" where the description names none.
func splitUnit(what string) (title, unit string) {
	i := strings.LastIndex(what, ", ")
	if i < 0 {
		return what, ""
	}
	u := what[i+2:]
	if q, ok := quantity.LookupUnit(u); ok && q.Dim != quantity.Number {
		return what[:i], u
	}
	return what, ""
}

// SelfWeight returns the self-weight per unit length ρ·b·h of a member of section b × h,
// N/mm, with the weight density ρ in N/mm³ (EN 1991-1-1:2002 Annex A, Table A.1).
func SelfWeight(id string, density, b, h trace.Q) trace.Step {
	return trace.Formula(id, "Self-weight per unit length", en1991+"Annex A, Table A.1", "g_sw", "N/mm",
		density.V*b.V*h.V, "rho * b * h", trace.A("rho", density), trace.A("b", b), trace.A("h", h))
}

// LoadedSpan returns the design load γG·Gk + γQ·Qk on a loaded span of the load arrangements,
// EN 1992-1-1:2004 5.1.3(1)P.
func LoadedSpan(id string, gammaG, g, gammaQ, q trace.Q) trace.Step {
	return trace.Formula(id, "Design load on a loaded span", en1992+"5.1.3(1)P", "w_Ed,max", g.Unit,
		gammaG.V*g.V+gammaQ.V*q.V, "gamma_G * G_k + gamma_Q * Q_k",
		trace.A("gamma_G", gammaG), trace.A("G_k", g), trace.A("gamma_Q", gammaQ), trace.A("Q_k", q))
}

// LightSpan returns the design load γG·Gk on a lightly loaded span of the load arrangements,
// EN 1992-1-1:2004 5.1.3(1)P.
func LightSpan(id string, gammaG, g trace.Q) trace.Step {
	return trace.Formula(id, "Design load on a lightly loaded span", en1992+"5.1.3(1)P", "w_Ed,min", g.Unit,
		gammaG.V*g.V, "gamma_G * G_k", trace.A("gamma_G", gammaG), trace.A("G_k", g))
}
