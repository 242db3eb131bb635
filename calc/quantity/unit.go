package quantity

import (
	"sort"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Unit is a unit the texts may use: one engine-unit worth of it is Scale, of dimension Dim.
type Unit struct {
	Name  string  // as written, e.g. "kN/m2"
	Dim   Dim     // dimension
	Scale float64 // value of 1 Name in engine units (N, mm)
}

// units lists every recognised unit; a space in a name stands for one or more spaces.
var units = []Unit{
	{"mm", Length, 1}, {"cm", Length, 10}, {"m", Length, 1e3},
	{"mm2", Area, 1}, {"mm²", Area, 1}, {"cm2", Area, 1e2}, {"cm²", Area, 1e2}, {"m2", Area, 1e6}, {"m²", Area, 1e6},
	{"mm3", Volume, 1}, {"mm³", Volume, 1}, {"m3", Volume, 1e9}, {"m³", Volume, 1e9},
	{"N", Force, 1}, {"kN", Force, 1e3}, {"MN", Force, 1e6},
	{"Nmm", Moment, 1}, {"N·mm", Moment, 1}, {"N mm", Moment, 1},
	{"Nm", Moment, 1e3}, {"N·m", Moment, 1e3}, {"N m", Moment, 1e3},
	{"kNm", Moment, 1e6}, {"kN·m", Moment, 1e6}, {"kN m", Moment, 1e6},
	{"MNm", Moment, 1e9}, {"MN·m", Moment, 1e9}, {"MN m", Moment, 1e9},
	{"N/mm2", Stress, 1}, {"N/mm²", Stress, 1}, {"MPa", Stress, 1}, {"GPa", Stress, 1e3},
	{"kPa", Stress, 1e-3}, {"Pa", Stress, 1e-6}, {"kN/m2", Stress, 1e-3}, {"kN/m²", Stress, 1e-3},
	{"N/m2", Stress, 1e-6}, {"N/m²", Stress, 1e-6}, {"kN/mm2", Stress, 1e3}, {"kN/mm²", Stress, 1e3},
	{"N/mm", LineLoad, 1}, {"kN/m", LineLoad, 1}, {"N/m", LineLoad, 1e-3},
	{"kN/m3", Density, 1e-6}, {"kN/m³", Density, 1e-6}, {"N/mm3", Density, 1}, {"N/mm³", Density, 1},
	{"%", Number, 0.01}, {"‰", Number, 0.001},
}

// unitsByLength holds units longest name first, so that the longest match wins.
var unitsByLength = func() []Unit {
	u := append([]Unit(nil), units...)
	sort.SliceStable(u, func(i, j int) bool { return len(u[i].Name) > len(u[j].Name) })
	return u
}()

// LookupUnit returns the unit written name ("kNm", "MPa"); the empty name is the pure number 1.
func LookupUnit(name string) (Unit, bool) {
	if name == "" {
		return Unit{"", Number, 1}, true
	}
	for _, u := range units {
		if u.Name == name {
			return u, true
		}
	}
	return Unit{}, false
}

// matchUnit returns the longest unit at the start of s that ends at a word boundary,
// and the number of bytes it takes.
func matchUnit(s string) (Unit, int, bool) {
	for _, u := range unitsByLength {
		n, ok := matchName(s, u.Name)
		if !ok {
			continue
		}
		if r, _ := utf8.DecodeRuneInString(s[n:]); n < len(s) && wordRune(r) {
			continue
		}
		return u, n, true
	}
	return Unit{}, 0, false
}

// matchName matches name at the start of s, a space in name matching one or more spaces.
func matchName(s, name string) (int, bool) {
	i := 0
	for {
		word, rest, space := strings.Cut(name, " ")
		if !strings.HasPrefix(s[i:], word) {
			return 0, false
		}
		i += len(word)
		if !space {
			return i, true
		}
		j := i
		for j < len(s) && s[j] == ' ' {
			j++
		}
		if j == i {
			return 0, false
		}
		i, name = j, rest
	}
}

// wordRune reports whether r may continue a name or a unit.
func wordRune(r rune) bool {
	return unicode.IsLetter(r) || unicode.IsDigit(r) || r == '_' || r == '²' || r == '³' || r == '·'
}
