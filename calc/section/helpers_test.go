package section

import (
	"math"
	"testing"

	"colsheet/calc/material"
)

// Design values used throughout the tests: fcd = αcc·fck/γc with αcc = 0.85, γc = 1.5
// (EN 1992-1-1:2004 3.1.6(1) Eq. (3.15); αcc = 0.85 is a common national choice, from memory),
// fyd = 500/1.15 (3.2.7(2), Table 2.1N), Es = 200 000 MPa (3.2.7(4)).
const (
	testFyd = 500 / 1.15
	testEs  = 200000
)

func testFcd(fck float64) float64 { return 0.85 * fck / 1.5 }

// concreteOf returns the Table 3.1 properties of class fck.
func concreteOf(t testing.TB, fck float64) material.Concrete {
	for _, c := range material.Classes {
		if c[0] == fck {
			return material.FromFck(c[0], c[1])
		}
	}
	t.Fatalf("no class with fck = %g", fck)
	return material.Concrete{}
}

func barArea(dia float64) float64 { return math.Pi * dia * dia / 4 }

// sym8 is a 300 × 500 section with eight 20 mm bars, 50 mm cover to the bar centres:
// three along each long face and one at the middle of each short face.
func sym8(t testing.TB, fck float64, block Block) *Section {
	a := barArea(20)
	bars := []Bar{
		{-100, 200, a}, {0, 200, a}, {100, 200, a},
		{-100, -200, a}, {0, -200, a}, {100, -200, a},
		{-100, 0, a}, {100, 0, a},
	}
	return &Section{B: 300, H: 500, Bars: bars, Concrete: concreteOf(t, fck),
		Fcd: testFcd(fck), Fyd: testFyd, Es: testEs, Block: block}
}

// sym12 is a 400 × 600 section with twelve 25 mm bars, four along each face.
func sym12(t testing.TB, fck float64, block Block) *Section {
	a := barArea(25)
	var bars []Bar
	for _, y := range []float64{-150, -50, 50, 150} {
		bars = append(bars, Bar{y, 250, a}, Bar{y, -250, a})
	}
	for _, z := range []float64{-250.0 / 3, 250.0 / 3} {
		bars = append(bars, Bar{-150, z, a}, Bar{150, z, a})
	}
	return &Section{B: 400, H: 600, Bars: bars, Concrete: concreteOf(t, fck),
		Fcd: testFcd(fck), Fyd: testFyd, Es: testEs, Block: block}
}

// asym is a 300 × 500 section with 4H25 near z = −200 and 2H12 near z = +200.
func asym(t testing.TB, fck float64, block Block) *Section {
	a25, a12 := barArea(25), barArea(12)
	bars := []Bar{
		{-105, -200, a25}, {-35, -200, a25}, {35, -200, a25}, {105, -200, a25},
		{-100, 200, a12}, {100, 200, a12},
	}
	return &Section{B: 300, H: 500, Bars: bars, Concrete: concreteOf(t, fck),
		Fcd: testFcd(fck), Fyd: testFyd, Es: testEs, Block: block}
}

// relClose reports whether a and b agree to relative tol, with an absolute floor.
func relClose(a, b, tol, floor float64) bool {
	return math.Abs(a-b) <= tol*math.Max(math.Abs(a), math.Abs(b))+floor
}
