// Package material holds the concrete and reinforcing steel properties of EN 1992-1-1 section 3.
package material

import (
	"fmt"
	"math"
	"strings"
)

// Concrete holds the strength and deformation characteristics of one strength class,
// EN 1992-1-1:2004 Table 3.1. Stresses in MPa, strains as pure numbers (0.0035, not 3.5 ‰).
type Concrete struct {
	Class  string  // e.g. "C32/40"
	Fck    float64 // characteristic cylinder strength
	FckCub float64 // characteristic cube strength
	Fcm    float64 // mean cylinder strength, fck + 8
	Fctm   float64 // mean axial tensile strength
	Ecm    float64 // secant modulus, MPa
	EpsC2  float64 // εc2, strain at peak stress, parabola-rectangle
	EpsCu2 float64 // εcu2, ultimate strain, parabola-rectangle
	N      float64 // exponent n of the parabola
	EpsC3  float64 // εc3, bilinear
	EpsCu3 float64 // εcu3, bilinear (equal to εcu2)
	Lambda float64 // λ, depth factor of the rectangular block, 3.1.7(3)
	Eta    float64 // η, strength factor of the rectangular block, 3.1.7(3)
}

// Classes lists the strength classes of EN 1992-1-1:2004 Table 3.1 as fck/fck,cube.
var Classes = [][2]float64{
	{12, 15}, {16, 20}, {20, 25}, {25, 30}, {30, 37}, {35, 45}, {40, 50}, {45, 55},
	{50, 60}, {55, 67}, {60, 75}, {70, 85}, {80, 95}, {90, 105},
}

// ExtraClasses lists strength classes outside Table 3.1 that national standards use; their
// properties follow from the Table 3.1 expressions.
var ExtraClasses = [][2]float64{{28, 35}, {32, 40}}

// ClassNames returns the class names of Table 3.1 joined for an error message.
func ClassNames() string {
	s := make([]string, len(Classes))
	for i, c := range Classes {
		s[i] = fmt.Sprintf("C%g/%g", c[0], c[1])
	}
	for _, c := range ExtraClasses {
		s = append(s, fmt.Sprintf("C%g/%g", c[0], c[1]))
	}
	return strings.Join(s, ", ")
}

// InTable31 reports whether the class is one of EN 1992-1-1:2004 Table 3.1.
func (c Concrete) InTable31() bool {
	for _, t := range Classes {
		if t[0] == c.Fck && t[1] == c.FckCub {
			return true
		}
	}
	return false
}

// Lookup returns the properties of the named class ("C32/40"), or false when Table 3.1 has no such class.
func Lookup(class string) (Concrete, bool) {
	name := strings.ToUpper(strings.TrimSpace(class))
	for _, list := range [][][2]float64{Classes, ExtraClasses} {
		for _, c := range list {
			if name == fmt.Sprintf("C%g/%g", c[0], c[1]) {
				return FromFck(c[0], c[1]), true
			}
		}
	}
	return Concrete{}, false
}

// FromFck returns the Table 3.1 properties computed from fck by the table's expressions.
func FromFck(fck, fckCube float64) Concrete {
	c := Concrete{Class: fmt.Sprintf("C%g/%g", fck, fckCube), Fck: fck, FckCub: fckCube, Fcm: fck + 8}
	if fck <= 50 {
		c.Fctm = 0.30 * math.Pow(fck, 2.0/3)
		c.EpsC2, c.EpsCu2, c.N = 0.0020, 0.0035, 2.0
		c.EpsC3, c.EpsCu3 = 0.00175, 0.0035
		c.Lambda, c.Eta = 0.8, 1.0
	} else {
		c.Fctm = 2.12 * math.Log(1+c.Fcm/10)
		c.EpsCu2 = (2.6 + 35*math.Pow((90-fck)/100, 4)) / 1000
		// The expression gives 2.6005 ‰ at C90/105, where Table 3.1 prints 2.6 for both strains:
		// εc2 is kept not above εcu2.
		c.EpsC2 = math.Min((2.0+0.085*math.Pow(fck-50, 0.53))/1000, c.EpsCu2)
		c.N = 1.4 + 23.4*math.Pow((90-fck)/100, 4)
		c.EpsC3 = (1.75 + 0.55*(fck-50)/40) / 1000
		c.EpsCu3 = c.EpsCu2
		c.Lambda = 0.8 - (fck-50)/400
		c.Eta = 1.0 - (fck-50)/200
	}
	c.Ecm = 22000 * math.Pow(c.Fcm/10, 0.3)
	return c
}
