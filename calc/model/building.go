package model

import "colsheet/calc/material"

// Building is the building form of the input: storeys, grid, member sizes, floors and
// loads, from which the engine derives the actions on every column and lift.
// Lengths in mm, area loads in N/mm² (1 kN/m² = 0.001 N/mm²), line loads in N/mm (= kN/m).
type Building struct {
	Line    int          // input line of the building block
	Storeys []Level      // lowest first; lift i runs from level i-1 (the base for i = 0) up to level i
	GridX   []float64    // bay widths along x, mm; x lines lettered A, B, ...
	GridY   []float64    // bay widths along y, mm; y lines numbered 1, 2, ...
	Column  Size         // default column section: H along building x, B along building y
	Cover   float64      // nominal cover to the links of the columns, mm
	Beam    Size         // default beam section (B wide, H deep), both directions
	Columns []ColumnSize // column size overrides
	Beams   []BeamSize   // beam size overrides
	Floors  []Floor      // area loads per level
	Lines   []LineLoad   // line loads on beams (façades)
	Omit    []string     // grid points without a column at any level, e.g. "B2"
	// OmitAt lists columns absent at some levels only: a column absent below a level where it
	// exists stands on the beams of that level (a transfer), which carry its load to their
	// supports.
	OmitAt []OmitLevels
	// Concrete gives the concrete class of some columns at some levels; later entries win and
	// Materials.Concrete is the default. BeamConcrete is the class of the beams (nil: the default).
	Concrete     []ConcreteZone
	BeamConcrete *material.Concrete
	PointLoads   []PointLoad  // concentrated loads on the floors (plant, tanks)
	AreaLoads    []AreaLoad   // area loads over rectangular zones of some floors, added to their floor loads
	Cantilevers  []Cantilever // slabs continuing beyond an edge beam
	Bars         *BarSpec     // given bars for every column to check; nil to design them
	Base         string       // BaseFixed or BasePinned
	Analysis     string       // AnalysisSubframe or AnalysisFrame
	Options      BuildingOptions
	Fires        []FireLevels // fire ratings by level, overriding Options.Fire there
}

// OmitLevels is a set of columns absent at some levels (lifts named by their top).
type OmitLevels struct {
	Columns []string
	Levels  []string
	Line    int
}

// ConcreteZone gives the concrete class of some columns (empty: all) at some levels (lifts
// named by their top; empty: all).
type ConcreteZone struct {
	Levels  []string
	Columns []string
	Class   material.Concrete
	Line    int
}

// PointLoad is a characteristic load at a point of some floors, carried by the beams of the bay
// it stands in (lever rule along the beam).
type PointLoad struct {
	Levels   []string
	X, Y     float64 // mm from grid line A and grid line 1
	Gk, Qk   float64 // N
	Category string  // imposed-load category of Qk
	Line     int
}

// AreaLoad is an area load added to the floor load of some levels within a rectangular zone.
type AreaLoad struct {
	Levels   []string
	X, Y     [2]float64 // mm, the zone's extent from grid line A and grid line 1
	Gk, Qk   float64    // N/mm²
	Category string     // imposed-load category of Qk, for ψ and for the reductions
	Line     int
}

// Cantilever is a slab continuing beyond the edge beam on a grid line between two cross lines,
// over a length measured from the line; it carries the floor loads of its level.
type Cantilever struct {
	Levels   []string
	GridLine string // the edge line, "A" or "1"
	From, To string // the cross lines it runs between; empty for the whole line
	Length   float64
	Line     int
}

// FireLevels gives the fire resistance of the columns at some levels (lifts named by their top).
type FireLevels struct {
	Levels []string
	Fire   Fire
	Line   int
}

// Base fixities.
const (
	BaseFixed  = "fixed"
	BasePinned = "pinned"
)

// Analysis methods for the column moments.
const (
	AnalysisSubframe = "subframe" // column above and below with far ends fixed, beams either side
	AnalysisFrame    = "frame"    // direct-stiffness analysis of each braced frame line
	AnalysisBoth     = "both"     // both, the larger end moment governing, both on the sheet
)

// Span directions of a floor.
const (
	SpanX      = "x"       // one way, spanning along x onto beams that run along y
	SpanY      = "y"       // one way, spanning along y onto beams that run along x
	SpanTwoWay = "two-way" // two way, 45° triangles and trapezia onto all four beams
)

// Combination rules of EN 1990 6.4.3.2.
const (
	Comb610   = "6.10"   // Eq. (6.10)
	Comb610ab = "6.10ab" // the less favourable of Eq. (6.10a) and (6.10b)
)

// Imposed-load reductions of EN 1991-1-1 6.3.1.2.
const (
	ReduceNone    = "none"
	ReduceArea    = "area"    // αA, 6.3.1.2(10)
	ReduceStoreys = "storeys" // αn, 6.3.1.2(11)
)

// BuildingOptions holds the method choices of the building form.
type BuildingOptions struct {
	BeamStiffness string // "half" (common practice) or "full": beam stiffness in the subframe
	// BeamStiffnessGiven says the input gave beam_stiffness (the frame analysis refuses it: it
	// takes the beams' own stiffness).
	BeamStiffnessGiven bool
	// SpanRatio is the ratio of adjacent spans at a joint above which the sheet cautions that the
	// simplified subframe may be far from the frame solution (default 1.5).
	SpanRatio   float64
	Combination string  // Comb610 or Comb610ab
	Reduction   string  // ReduceNone, ReduceArea or ReduceStoreys
	Density     float64 // weight density of reinforced concrete, N/mm³ (25 kN/m³ = 2.5e-5)
	L0Factor    float64 // effective length as a fraction of the storey height (braced: ≤ 1)
	L0FromFrame bool    // effective lengths by EN 1992-1-1 Eq. (5.15) from the members at each end
	Creep       *Creep  // creep data for every lift; Ratio is then derived from the ψ2 combination
}

// Level is one storey: the level at its top and the height of the lift below it.
type Level struct {
	Name   string
	Height float64 // mm, from the level below (or the base) to this level
	Line   int
}

// Size is a member section: rectangular B × H, or for a column circular of diameter B = H
// with Shape ShapeCircle.
type Size struct {
	B, H  float64 // mm
	Shape string  // ShapeRect (the zero value) or ShapeCircle (columns only)
	Helix bool    // a circular column's transverse bars are a helix
}

// ColumnSize overrides the section of some columns over some lifts.
type ColumnSize struct {
	IDs    []string // column ids such as "B2"; empty for all
	Levels []string // lifts (named by their top level); empty for all
	Size
	Line int
}

// BeamSize overrides the section of some beams.
type BeamSize struct {
	Levels []string // levels; empty for all
	Dir    string   // "x" (beams running along x), "y", or "" for both
	Lines  []string // grid lines the beams run on, e.g. "A" or "2"; empty for all
	Size
	Line int
}

// Floor gives the area loads of some levels.
type Floor struct {
	Levels   []string
	Gk, Qk   float64 // N/mm²; Gk excludes the self-weight of beams and columns
	Category string  // imposed-load category of EN 1991-1-1 Table 6.1 / EN 1990 Table A1.1: A, B, C, D, E, F, G, H
	Spans    string  // SpanX, SpanY or SpanTwoWay
	// Thickness is the slab thickness, mm: the beams' self-weight then counts only their
	// downstand below it (0: the whole beam depth, as before).
	Thickness float64
	Line      int
}

// LineLoad is a load per unit length on the beams of one grid line, such as a façade.
type LineLoad struct {
	Levels   []string
	GridLine string  // "A" (a line along y at x of A) or "1" (a line along x at y of 1)
	From, To string  // optional: the range of cross lines it runs between, e.g. "1" to "3"; empty for the whole line
	Gk, Qk   float64 // N/mm (= kN/m)
	Category string  // category of Qk when Qk > 0
	Line     int
}
