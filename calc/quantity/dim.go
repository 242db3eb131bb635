// Package quantity reads numbers with units and small arithmetic expressions over named
// quantities, checks their dimensions and converts them to engine units (N, mm, MPa, N·mm).
//
// A text is either a number with an optional unit ("3.6 m", "85 kNm", "7.5 kN/m2") or an
// expression in a subset of govaluate syntax: numbers (each optionally followed by a unit),
// names defined in an Env, + - * / **, parentheses and the functions min, max and sqrt.
// A unit belongs to the number directly before it: "6 m / 2 m" is the pure number 3.
// Dimensions have whole exponents, so sqrt takes only even ones (the root of an area is a
// length), and a chain a**b**c or a signed base -a**b must be written with parentheses.
// Division by zero and any other non-finite result are errors.
package quantity

import (
	"fmt"
	"strings"
)

// Dim is the physical dimension of a quantity as exponents of force and length.
type Dim struct {
	Force, Length int
}

// The dimensions the input uses.
var (
	Number   = Dim{0, 0}  // pure number
	Length   = Dim{0, 1}  // mm
	Area     = Dim{0, 2}  // mm²
	Volume   = Dim{0, 3}  // mm³
	Force    = Dim{1, 0}  // N
	Moment   = Dim{1, 1}  // N·mm
	Stress   = Dim{1, -2} // N/mm², also area loads
	LineLoad = Dim{1, -1} // N/mm
	Density  = Dim{1, -3} // N/mm³, weight density
)

var dimNames = map[Dim]string{
	Number:   "pure number",
	Length:   "length",
	Area:     "area",
	Volume:   "volume",
	Force:    "force",
	Moment:   "moment",
	Stress:   "stress",
	LineLoad: "line load",
	Density:  "weight density",
}

// String names the dimension in words ("length", "line load") or, for a dimension without
// a name, by its engine unit ("N·mm^-4").
func (d Dim) String() string {
	if s, ok := dimNames[d]; ok {
		return s
	}
	return "quantity in " + d.Unit()
}

// Unit returns the engine unit of the dimension written with N and mm, e.g. "N·mm^-2".
func (d Dim) Unit() string {
	var parts []string
	add := func(sym string, e int) {
		switch e {
		case 0:
		case 1:
			parts = append(parts, sym)
		default:
			parts = append(parts, fmt.Sprintf("%s^%d", sym, e))
		}
	}
	add("N", d.Force)
	add("mm", d.Length)
	if len(parts) == 0 {
		return "1"
	}
	return strings.Join(parts, "·")
}

// Describe returns the dimension's name with its indefinite article, e.g. "an area".
func (d Dim) Describe() string {
	s := d.String()
	if strings.ContainsRune("aeiou", rune(s[0])) {
		return "an " + s
	}
	return "a " + s
}

func (d Dim) mul(e Dim) Dim { return Dim{d.Force + e.Force, d.Length + e.Length} }
func (d Dim) div(e Dim) Dim { return Dim{d.Force - e.Force, d.Length - e.Length} }
