package trace

import (
	"regexp"
	"strings"
)

// Clause references take one form throughout (DESIGN.md, the trace contract):
//
//	EN 1992-1-1:2004 5.8.3.1(1), Eq. (5.13N)   a standard with its edition, then clauses,
//	                                           equations, tables, figures or notes, joined
//	                                           by ", " (the same clause) or "; " (another)
//	common practice                            a fact of the trade, optionally "(…)"-qualified
//	input                                      a value from the input file
//	chosen: …                                  a choice the design made among candidates
//	design of the lift above                   a value taken over from another sheet
var (
	clauseStd  = regexp.MustCompile(`^EN 199[0-9](-[0-9]-[0-9])?:[0-9]{4} `)
	clausePart = regexp.MustCompile(`^(Annex [A-Z]|[A-Z]?[0-9]+(\.[0-9]+)*(\([0-9]+\)(-\([0-9]+\))?)?P?[a-z]?(-\([0-9]+\))?|\([A-Z]?[0-9.]+[a-zN]*\)|Eq\. \([A-Z]?[0-9.]+[a-zN]*\)(-\([0-9.]+[a-zN]*\))?(, \([A-Z]?[0-9.]+[a-zN]*\))?|Table [A-Z]?[0-9.]+[a-zN]*(\([A-Z]\))?|Fig\. [A-Z]?[0-9.]+[a-z]?|note|common practice)$`)
)

// The clauses of values a calculation found rather than was given.
const (
	ClauseChosen = "chosen: "                   // prefix: a choice the design made among candidates
	ClauseAbove  = "design of the lift above"   // a value taken over from another sheet
	ClauseCases  = "the load cases of the lift" // a value taken over from another load case of the same lift
)

// Given reports whether s is a value given to the calculation (an input or a table value), not
// one the calculation chose or took over from another design.
func Given(s Step) bool {
	return (s.Kind == KindInput || s.Kind == KindTable) && !strings.HasPrefix(s.Clause, ClauseChosen) && s.Clause != ClauseAbove && s.Clause != ClauseCases
}

// Chosen reports whether s records a value the design chose among candidates or took over from
// another design (an input or table step marked so): a result of the calculation, not an input.
func Chosen(s Step) bool {
	return (s.Kind == KindInput || s.Kind == KindTable) && (strings.HasPrefix(s.Clause, ClauseChosen) || s.Clause == ClauseAbove || s.Clause == ClauseCases)
}

// ClauseForm reports whether c is a clause reference in the one form the sheets use.
func ClauseForm(c string) bool {
	switch {
	case c == "input", c == ClauseAbove, c == ClauseCases:
		return true
	case strings.HasPrefix(c, "common practice"):
		rest := strings.TrimPrefix(c, "common practice")
		return rest == "" || strings.HasPrefix(rest, " (") && strings.HasSuffix(rest, ")")
	case strings.HasPrefix(c, ClauseChosen):
		return len(c) > len(ClauseChosen)
	}
	loc := clauseStd.FindStringIndex(c)
	if loc == nil {
		return false
	}
	for _, group := range strings.Split(c[loc[1]:], "; ") {
		for _, part := range strings.Split(group, ", ") {
			if !clausePart.MatchString(part) {
				return false
			}
		}
	}
	return true
}
