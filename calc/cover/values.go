package cover

import (
	"math"
	"strings"

	"colsheet/calc/model"
)

// Recommended values of EN 1992-1-1:2004 4.4.1, cited at the steps that use them.
const (
	BaseClass   = 4    // structural class for a 50-year design working life, Table 4.3N
	DeltaCdev   = 10.0 // allowance in design for deviation Δcdev, mm, 4.4.1.3(1)P
	DeltaCdevQA = 5.0  // least Δcdev under a quality assurance system that measures the cover, mm, 4.4.1.3(3)
	CminFloor   = 10.0 // lower bound of cmin, mm, Eq. (4.2)
	AggLimit    = 32.0 // nominal maximum aggregate size above which cmin,b grows, mm, Table 4.2
	AggExtra    = 5.0  // increase of cmin,b for the larger aggregate, mm, Table 4.2
	LongLife    = 50.0 // design working life, years, beyond which the class rises by 2 (Table 4.3N, 100 years)
	ClassFloor  = 1    // least structural class, S1
	ClassCeil   = 6    // greatest structural class, S6
)

// tableColumns are the exposure columns of Table 4.4N, in order of increasing cover.
var tableColumns = [7]string{"X0", "XC1", "XC2/XC3", "XC4", "XD1/XS1", "XD2/XS2", "XD3/XS3"}

// table44N holds cmin,dur in mm for reinforcing steel, rows S1 to S6, columns as tableColumns.
var table44N = [6][7]float64{
	{10, 10, 10, 15, 20, 25, 30},
	{10, 10, 15, 20, 25, 30, 35},
	{10, 10, 20, 25, 30, 35, 40},
	{10, 15, 25, 30, 35, 40, 45},
	{15, 20, 30, 35, 40, 45, 50},
	{20, 25, 35, 40, 45, 50, 55},
}

// exposure is what one exposure class of Table 4.1 means for the cover.
type exposure struct {
	column int     // column of Table 4.4N
	fck    float64 // fck of the strength class that reduces the structural class by 1, Table 4.3N
}

var exposures = map[string]exposure{
	"X0":  {0, 30},
	"XC1": {1, 30},
	"XC2": {2, 35}, "XC3": {2, 35},
	"XC4": {3, 40},
	"XD1": {4, 40}, "XS1": {4, 40},
	"XD2": {5, 40}, "XS2": {5, 45},
	"XD3": {6, 45}, "XS3": {6, 45},
}

// concreteOnly are the classes of Table 4.1 (freeze/thaw, chemical attack) that do not change cmin,dur.
var concreteOnly = map[string]bool{
	"XF1": true, "XF2": true, "XF3": true, "XF4": true,
	"XA1": true, "XA2": true, "XA3": true,
}

// Known reports whether name is an exposure class of EN 1992-1-1:2004 Table 4.1.
func Known(name string) bool {
	n := norm(name)
	_, ok := exposures[n]
	return ok || concreteOnly[n]
}

func norm(s string) string { return strings.ToUpper(strings.TrimSpace(s)) }

// reading is what a list of exposure classes gives for Tables 4.3N and 4.4N.
type reading struct {
	column  int      // the most onerous column of Table 4.4N
	fck     float64  // the most demanding strength class for the reduction of Table 4.3N
	cover   bool     // whether any class of the list is in Table 4.4N
	other   []string // XF and XA classes
	unknown []string // names that are not classes of Table 4.1
}

func read(list []string) reading {
	r := reading{fck: exposures["X0"].fck}
	for _, name := range list {
		n := norm(name)
		e, ok := exposures[n]
		switch {
		case ok:
			r.cover = true
			r.column = max(r.column, e.column)
			r.fck = math.Max(r.fck, e.fck)
		case concreteOnly[n]:
			r.other = append(r.other, n)
		default:
			r.unknown = append(r.unknown, name)
		}
	}
	return r
}

func baseOf(base int) int {
	if base == 0 {
		return BaseClass
	}
	return base
}

func boolNum(b bool) float64 {
	if b {
		return 1
	}
	return 0
}

// StructuralClassValue returns the structural class after the modifications of Table 4.3N; see StructuralClass.
func StructuralClassValue(base int, life, fck float64, exposure []string, specialQC bool) int {
	return min(max(rawClass(base, life, fck, read(exposure), specialQC), ClassFloor), ClassCeil)
}

// rawClass is the structural class before it is kept within S1 to S6.
func rawClass(base int, life, fck float64, r reading, specialQC bool) int {
	s := baseOf(base)
	if life > LongLife {
		s += 2
	}
	if fck >= r.fck {
		s--
	}
	if specialQC {
		s--
	}
	return s
}

// CminDurValue returns cmin,dur of Table 4.4N for the most onerous of the exposure classes; see CminDur.
func CminDurValue(class int, exposure []string) float64 {
	return table44N[min(max(class, ClassFloor), ClassCeil)-1][read(exposure).column]
}

// CminBValue returns cmin,b = φ, plus 5 mm where dg > 32 mm; see CminB.
func CminBValue(dia, dg float64) float64 {
	if dg > AggLimit {
		return dia + AggExtra
	}
	return dia
}

// CminValue returns cmin = max{cmin,b; cmin,dur + Δcdur,γ; 10 mm}; see Cmin.
func CminValue(cminb, cmindur, dGamma float64) float64 {
	return math.Max(math.Max(cminb, cmindur+dGamma), CminFloor)
}

// CnomValue returns cnom = cmin + Δcdev; see Cnom.
func CnomValue(cmin, dev float64) float64 { return cmin + dev }

// NominalValue returns the nominal covers for the link and for the main bars that Nominal records.
func NominalValue(d model.Durability, fck, dia, linkDia, dg float64) (cnomLink, cnomBar float64) {
	class := StructuralClassValue(d.StructuralClass, d.DesignLife, fck, d.Exposure, d.SpecialQC)
	dur := CminDurValue(class, d.Exposure)
	dev := deviation(d)
	cnomLink = CnomValue(CminValue(CminBValue(linkDia, dg), dur, d.DeltaCdurGamma), dev)
	cnomBar = CnomValue(CminValue(CminBValue(dia, dg), dur, d.DeltaCdurGamma), dev)
	return cnomLink, cnomBar
}

// deviation returns Δcdev: the given value, or the recommended 10 mm where none is given; see DeviationInput.
func deviation(d model.Durability) float64 {
	if d.DeltaCdev == nil {
		return DeltaCdev
	}
	return *d.DeltaCdev
}
