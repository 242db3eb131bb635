package actions

import (
	"strconv"
	"strings"

	"colsheet/calc/trace"
)

// Categories of variable action known to Psi, besides the imposed-load categories A to H.
const (
	Snow        = "snow"        // snow loads, sites at altitude H ≤ 1000 m a.s.l.
	SnowHigh    = "snow-high"   // snow loads in Finland, Iceland, Norway, Sweden and at altitude H > 1000 m
	Wind        = "wind"        // wind loads on buildings
	Temperature = "temperature" // temperature (non-fire) in buildings
)

// psiRow is one row of EN 1990:2002 Table A1.1.
type psiRow struct {
	cat  string
	name string
	psi  [3]float64
}

// psiTable holds the recommended values of EN 1990:2002 Table A1.1.
var psiTable = []psiRow{
	{"A", "Category A: domestic, residential areas", [3]float64{0.7, 0.5, 0.3}},
	{"B", "Category B: office areas", [3]float64{0.7, 0.5, 0.3}},
	{"C", "Category C: congregation areas", [3]float64{0.7, 0.7, 0.6}},
	{"D", "Category D: shopping areas", [3]float64{0.7, 0.7, 0.6}},
	{"E", "Category E: storage areas", [3]float64{1.0, 0.9, 0.8}},
	{"F", "Category F: traffic area, vehicle weight ≤ 30 kN", [3]float64{0.7, 0.7, 0.6}},
	{"G", "Category G: traffic area, 30 kN < vehicle weight ≤ 160 kN", [3]float64{0.7, 0.5, 0.3}},
	{"H", "Category H: roofs", [3]float64{0, 0, 0}},
	{Snow, "Snow loads on buildings, sites at altitude H ≤ 1000 m a.s.l. (outside Finland, Iceland, Norway, Sweden)", [3]float64{0.5, 0.2, 0}},
	{SnowHigh, "Snow loads on buildings, Finland, Iceland, Norway, Sweden, and sites at altitude H > 1000 m a.s.l.", [3]float64{0.7, 0.5, 0.2}},
	{Wind, "Wind loads on buildings", [3]float64{0.6, 0.2, 0}},
	{Temperature, "Temperature (non-fire) in buildings", [3]float64{0.6, 0.5, 0}},
}

// canon returns the category in the spelling of psiTable: one letter upper case, names lower case.
func canon(category string) string {
	c := strings.TrimSpace(category)
	if len(c) == 1 {
		return strings.ToUpper(c)
	}
	return strings.ToLower(c)
}

func psiLookup(category string) (psiRow, bool) {
	c := canon(category)
	for _, r := range psiTable {
		if r.cat == c {
			return r, true
		}
	}
	return psiRow{}, false
}

// Psi returns the recommended factors ψ0, ψ1, ψ2 of a category of variable action
// (A to H, Snow, SnowHigh, Wind, Temperature), EN 1990:2002 Table A1.1.
func Psi(category string) (psi0, psi1, psi2 float64, ok bool) {
	r, ok := psiLookup(category)
	if !ok {
		return 0, 0, 0, false
	}
	return r.psi[0], r.psi[1], r.psi[2], true
}

var psiTitles = [3]string{
	"Combination factor of the variable action",
	"Frequent factor of the variable action",
	"Quasi-permanent factor of the variable action",
}

// PsiStep returns the table step of ψ0, ψ1 or ψ2 (which = 0, 1 or 2) of a category,
// EN 1990:2002 A1.2.2(1), Table A1.1; an unknown category gives ψ = 1 with a caution.
func PsiStep(id string, which int, category string) trace.Step {
	if which < 0 || which > 2 {
		panic("actions: PsiStep which must be 0, 1 or 2, not " + strconv.Itoa(which))
	}
	w := strconv.Itoa(which)
	sym := "ψ_" + w
	clause := en1990 + "A1.2.2(1), Table A1.1"
	r, ok := psiLookup(category)
	if !ok {
		return trace.Table(id, psiTitles[which], clause, "Category "+category+" (not in the table), ψ"+w+" = 1", sym, "", 1).
			Caution("Category " + strconv.Quote(category) + " is not a row of EN 1990 Table A1.1: ψ" + w + " = 1 is taken, which never reduces the action.")
	}
	v := r.psi[which]
	return trace.Table(id, psiTitles[which], clause, r.name+", ψ"+w+" = "+strconv.FormatFloat(v, 'f', 1, 64), sym, "", v)
}
