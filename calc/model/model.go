// Package model holds the plain data read from an input file: the project, the code
// parameters in force, the materials, the design options and the columns with their actions.
//
// All quantities are in engine units: N, mm, MPa (N/mm²) and N·mm.
package model

import (
	"colsheet/calc/code"
	"colsheet/calc/material"
)

// Input is one whole input file, read and validated.
type Input struct {
	File      string      // path of the input file as given
	SHA256    string      // hex SHA-256 of the file's bytes
	Source    string      // the file's text as read, for the listing in the calc document
	Project   Project     // title block
	Code      code.Params // partial factors and nationally determined parameters in force
	Materials Materials   // concrete and steel
	Options   Options     // method choices
	Columns   []Column    // columns in input order (the actions form)
	Building  *Building   // the building form; nil for the actions form
	// MomentSigns is the sign convention of the end moments as given (SignsFace or
	// SignsMemberEnds); the model holds them in the face convention whatever it says.
	MomentSigns string
	Actions     *ActionsTable // the table of cases of the actions form; nil when the YAML gives them
}

// Project is the title block of every sheet.
type Project struct {
	Title, Job, Revision, Designer, Checker, Date string
}

// Materials holds the concrete class and the reinforcing steel.
type Materials struct {
	Concrete  material.Concrete // Table 3.1 properties of the class
	Fyk       float64           // characteristic yield strength of reinforcement, MPa
	Aggregate float64           // maximum aggregate size dg, mm
}

// Stress blocks for concrete in the section design.
const (
	ParabolaRectangle = "parabola-rectangle" // EN 1992-1-1 3.1.7(1)
	Rectangular       = "rectangular"        // EN 1992-1-1 3.1.7(3)
)

// Imperfection methods for isolated columns.
const (
	ImperfInclination = "inclination" // ei = θi·l0/2 with θi = θ0·αh·αm, 5.2(7)
	ImperfL0Over400   = "l0/400"      // ei = l0/400, 5.2(9)
)

// Options holds the method choices of a calculation.
type Options struct {
	StressBlock   string      // ParabolaRectangle or Rectangular
	Imperfection  string      // ImperfInclination or ImperfL0Over400
	Members       float64     // m, number of vertical members contributing to the imperfection, 5.2(5)
	BarDiameters  []float64   // longitudinal bar diameters to choose from, mm, ascending
	LinkDiameters []float64   // link diameters to choose from, mm, ascending
	LinkStep      float64     // link spacings are rounded down to a multiple of this, mm
	LapStep       float64     // lap lengths are rounded up to a multiple of this, mm
	LapStart      float64     // height of the start of the laps above the floor level at the bottom of a lift, mm
	SecondOrder   string      // SecondOrderCurvature (default), SecondOrderStiffness or SecondOrderBoth
	Biaxial       string      // BiaxialRule (5.39, default) or BiaxialExact (inclined neutral axis)
	CrackedK      float64     // factor on the stiffness of restraining members for cracking, 5.8.3.2(3); default 0.5
	Sizes         *SizeSearch // the section-size finder, when asked for
	Durability    *Durability // cover for durability, for every column unless a column gives its own
	Fire          *Fire       // fire resistance, for every column unless a column or level gives its own
	Selection     Selection   // the rules of practice and the cost by which designed bars are chosen
	Typical       Typical     // the pass that gives lifts of one section one pattern (building form)
}

// Selection holds the rules of practice that designed bars keep to and the labour terms of the
// cost by which the cheapest passing pattern is chosen (common practice, no source).
type Selection struct {
	LeastBar     float64 // least main bar where the smaller dimension is below WideFrom, mm (12)
	LeastBarWide float64 // least main bar where the smaller dimension is at least WideFrom, mm (16)
	WideFrom     float64 // smaller dimension from which LeastBarWide applies, mm (300)
	VibratorGap  float64 // clear gap between bars for a poker vibrator, where a pattern that keeps it passes, mm (75)
	LabourBar    float64 // labour per main bar, kg of steel (2)
	LabourTie    float64 // labour per tie piece, kg of steel (1)
	Costed       int     // most passing patterns costed beyond the chosen one (12)
}

// Typical is the pass that gives the lifts of one section the same bar pattern where it costs at
// most Tolerance more steel (building form).
type Typical struct {
	On        bool
	Tolerance float64 // fraction: 0.10 for 10 %
}

// Second-order methods of EN 1992-1-1 5.8.5.
const (
	SecondOrderCurvature = "nominal-curvature" // 5.8.8
	SecondOrderStiffness = "nominal-stiffness" // 5.8.7
	SecondOrderBoth      = "both"              // both shown; the larger design moment governs
)

// Biaxial checks.
const (
	BiaxialRule  = "5.39"  // EN 1992-1-1 5.8.9(4), Eq. (5.39)
	BiaxialExact = "exact" // resistance along the resultant moment with an inclined neutral axis
)

// SizeSearch asks for the smallest section of each column that passes every check.
type SizeSearch struct {
	Sizes    []Size  // candidate sections, in the order to try (smallest first); or
	Step     float64 // a step for b and h, mm, from Min to Max
	Min, Max float64 // mm
	Square   bool    // b = h only
	RhoMax   float64 // largest steel ratio As/Ac accepted, e.g. 0.02
}

// Creep holds the data of EN 1992-1-1 Annex B for the creep coefficient φ(∞, t0).
type Creep struct {
	RH     float64 // relative humidity of the ambient environment, %
	T0     float64 // age of concrete at loading, days
	Cement string  // cement class: "S", "N" or "R" (3.1.2(6))
	Ratio  float64 // M0Eqp/M0Ed, the quasi-permanent over the design first-order moment; 0 when not given
}

// Column is one column with its section and its lifts.
type Column struct {
	ID         string
	Line       int         // input line of the column entry
	B, H       float64     // section width along y and depth along z, mm; both the diameter D for a circle
	Shape      string      // ShapeRect (the zero value) or ShapeCircle
	Cover      float64     // nominal cover to the links, mm
	Helix      bool        // a circle's transverse bars are a helix rather than circular links
	Bars       *BarSpec    // given bars to check; nil to design them
	LinkDia    float64     // given link diameter, mm; 0 to choose
	Durability *Durability // overrides Options.Durability; nil to inherit
	Fire       *Fire       // overrides Options.Fire; nil to inherit
	Storeys    []Storey
}

// Section shapes of a column.
const (
	ShapeRect   = ""       // rectangular b × h, bars on the four faces
	ShapeCircle = "circle" // circular of diameter D (B = H = D), bars evenly on a circle
)

// BarSpec is a given set of longitudinal bars: a count of one diameter, laid out symmetrically.
type BarSpec struct {
	Count int
	Dia   float64 // mm
}

// Storey is one lift of a column with its design actions.
type Storey struct {
	Name   string
	Line   int     // input line of the storey entry
	L0Y    float64 // effective length for buckling about y, mm
	L0Z    float64 // effective length for buckling about z, mm
	Length float64 // member length l for αh, mm; 0 when not given
	Clear  float64 // clear height between the beams, mm, for the shear from the end moments; 0 when not known
	NEd    float64 // design axial force, N, compression positive
	MY     Ends    // first-order end moments about y, N·mm
	MZ     Ends    // first-order end moments about z, N·mm
	PhiEf  float64 // effective creep ratio
	HasPhi bool    // whether PhiEf was given
	Creep  *Creep  // data to compute φef by Annex B and (5.19); nil when not given
	// Cases are the sets of design actions of the lift (the load combinations of an analysis),
	// in input order: those of `cases:` or of the actions table, or the one case "1" of NEd and
	// M. NEd, MY and MZ above are those of the first case.
	Cases []Case
}

// Case is one set of design actions of a lift: a load combination of the frame analysis.
type Case struct {
	Name string
	File string  // the file that gives it: the YAML file, or the actions table
	Line int     // its line in File
	NEd  float64 // design axial force, N, compression positive (negative: tension)
	MY   Ends    // first-order end moments about y, N·mm, face convention (equal signs: tension on the same face)
	MZ   Ends    // first-order end moments about z, N·mm, face convention
	// V holds the design shear forces that accompany bending about y (acting along h) and about
	// z (along b), N; HasV says which were given (without, VEd = |M_top − M_bottom|/l).
	V    [2]float64
	HasV [2]bool
}

// Moment sign conventions of the input (Input.MomentSigns).
const (
	SignsFace       = "face"        // the same sign is tension on the same face (the default)
	SignsMemberEnds = "member-ends" // clockwise positive at both ends, as analysis programs export them
)

// ActionsTable is the table of cases given by `actions: FILE.csv`.
type ActionsTable struct {
	Name   string // the path as given, relative to the YAML file
	Data   []byte // the file's bytes as read
	SHA256 string // hex SHA-256 of Data
}

// Ends holds the first-order moments at the two ends of a lift; equal signs mean single curvature.
type Ends struct {
	Top, Bottom float64
}

// Durability holds what EN 1992-1-1 4.4.1 needs for the nominal cover.
type Durability struct {
	Exposure        []string // exposure classes of Table 4.1, e.g. ["XC3", "XD1"]; the most onerous governs
	StructuralClass int      // recommended S4 for a 50-year design life, before the modifications of Table 4.3N; 0 = 4
	DesignLife      float64  // years; 100 raises the structural class by 2 (Table 4.3N); 0 = 50
	SpecialQC       bool     // special quality control of concrete production: class reduced by 1 (Table 4.3N)
	SlabGeometry    bool     // member with slab geometry: class reduced by 1 (Table 4.3N); never for columns, kept for completeness
	DeltaCdev       *float64 // allowance for deviation Δcdev, mm, as given (4.4.1.3(3) allows 0 to 10 mm); nil when not given: the recommended 10 mm of 4.4.1.3(1)P
	DeltaCdurGamma  float64  // additive safety element Δcdur,γ, mm (4.4.1.2(6)); recommended 0
}

// Fire holds what EN 1992-1-2 5.3.2 (Method A) needs for the fire resistance of a column.
type Fire struct {
	Rating  int     // standard fire resistance R in minutes: 30, 60, 90, 120, 180, 240; 0 = no fire check
	EtaFi   float64 // reduction factor ηfi for μfi = ηfi when NEd,fi/NRd is not computed; 0 = 0.7 (2.4.2(3))
	UseMuFi bool    // μfi = NEd,fi/NRd with NEd,fi = ηfi·NEd (5.3.2(3)); otherwise μfi = ηfi, conservative
	Method  string  // FireMethodA (or "": the default) or FireElsewhere
	Note    string  // with FireElsewhere: how and where the rating was verified
}

// Methods of verifying the fire resistance of a column.
const (
	FireMethodA   = "A"         // EN 1992-1-2 5.3.2, Method A: Table 5.2a, or Eq. (5.7)
	FireElsewhere = "elsewhere" // verified by another method outside this calculation, recorded as such
)

// DefaultSelection returns the rules of practice and the labour terms engineers expect
// (common practice, no source): least main bar 12 mm, 16 mm where the smaller dimension is at
// least 300 mm; a 75 mm gap for a poker vibrator; 2 kg of steel per bar and 1 per tie piece; 12
// passing patterns costed beyond the chosen one at most.
func DefaultSelection() Selection {
	return Selection{LeastBar: 12, LeastBarWide: 16, WideFrom: 300, VibratorGap: 75, LabourBar: 2, LabourTie: 1, Costed: 12}
}

// DefaultTypical returns the typical-pattern pass as the building form runs it by default: on,
// with a tolerance of 10 % more steel.
func DefaultTypical() Typical { return Typical{On: true, Tolerance: 0.10} }
