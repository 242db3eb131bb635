// Package design runs the whole calculation of each column and lift: materials,
// design actions, slenderness and second order, section resistance and detailing,
// and gathers the values and the trace of each design.
package design

import (
	"colsheet/calc/building"
	"math"
	"strings"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/section"
	"colsheet/calc/trace"
)

// Status words of a design.
const (
	StatusPass = "pass"
	StatusFail = "fail"
)

// Result is the outcome of one run over one input file.
type Result struct {
	ToolName    string            // "colsheet"
	ToolVersion string            // version of the engine
	Input       *model.Input      // the input as read
	Designs     []Design          // one per column and lift, in input order
	Methods     []Method          // the methods and assumptions of the calculation, for the design basis
	Building    *building.Derived // what was derived from the building form (its lifts without their steps, which the designs hold); nil for the actions form
	Sizes       []SizeResult      // the section-size finder, when asked for
	// Basis holds the steps that hold for the whole project, each once, with IDs of the form
	// basis/<part>/<name> (BasisPrefix): the code parameters, ψ factors, materials, cover
	// allowances, lap lengths by bar diameter and creep data. The designs' steps refer to them
	// (Design.Trace names them by these IDs).
	Basis []trace.Step

	cases []liftCase    // the column and lift of each design, for the size finder
	bs    *projectBasis // the basis with the quantities the designs take from it
	// curves holds the N–M diagrams made so far by section, shared by lifts of the same section
	curves *curveMemo
}

// Method is one method or assumption of the calculation with the clause behind it.
type Method struct {
	Topic  string // what it concerns, e.g. "Concrete stress block"
	Choice string // what is used
	Clause string // where the standard sets it, or "common practice"
}

// Failed returns how many designs do not pass.
func (r *Result) Failed() int {
	n := 0
	for _, d := range r.Designs {
		if d.Status != StatusPass {
			n++
		}
	}
	return n
}

// Design is the design or check of one column over one lift. Quantities in engine units.
type Design struct {
	Column, Storey string
	B, H, Cover    float64 // mm; B = H = D for a circle
	Shape          string  // model.ShapeRect or model.ShapeCircle
	Class          string  // concrete strength class of the lift, e.g. "C32/40"
	Fck, Fyk       float64 // MPa
	NEd            float64 // N
	Y, Z           Axis    // bending about y and about z
	Biaxial        Biaxial
	Exact          *Exact  // the exact biaxial resistance; nil where it was not found
	AsReq          float64 // mm², steel area needed for the chosen bar pattern
	AsMin, AsMax   float64 // mm², 9.5.2(2) and 9.5.2(3)
	AsProv         float64 // mm²
	NRdMax         float64 // N, resistance to pure compression with the provided bars
	Bars           Bars
	Links          Links
	Detailing      Detailing
	Schedule       Schedule     // the cage as built: cut lengths, bar marks and masses
	Utilization    float64      // largest ratio of action to resistance among all checks
	Status         string       // StatusPass or StatusFail
	Governing      string       // the check that sets Utilization, in words
	Reasons        []string     // why the design fails, in words; empty when it passes
	Cautions       []string     // cautions particular to this design
	Steps          []trace.Step // the full trace of this design; IDs relative to the design (see Trace)
	// Cases holds every load case of the lift in input order (one, named "1", for a lift given
	// by NEd and M, and in the building form); the design's own values are those of the
	// governing case, GoverningCase, the one of the highest utilisation.
	Cases         []CaseResult
	GoverningCase string

	Interaction *Interaction // curves for plotting, once AddInteraction has run

	bs      *projectBasis     // the project basis its steps refer to
	pattern detail.Pattern    // bar pattern evaluated
	sec     *section.Section  // the section with the bars provided
	circ    *section.Circle   // the circular section with the bars provided; nil for a rectangle
	theta   float64           // a circle's direction of least resistance at NEd (section.CircleState.Theta)
	checks  []checked         // its check steps
	reasons map[string]string // by check step ID, the reason to give where it fails, in its own words (the fire method's scope)
	fixed   map[string]bool   // check step IDs that no bar pattern can make hold (the fire method's scope)
	trial   bool              // a candidate pattern's trial (trial.go): its check steps carry no arguments and its reasons are not worded
}

// Ac returns the gross concrete area of the design's section, mm².
func (d *Design) Ac() float64 { return sizeArea(model.Size{B: d.B, H: d.H, Shape: d.Shape}) }

// Axis holds the slenderness, actions and resistance for bending about one axis.
type Axis struct {
	L0        float64 // mm
	Lambda    float64
	LambdaLim float64
	Slender   bool
	M01, M02  float64 // N·mm, first-order end moments per 5.8.8.2, without imperfections
	Ei        float64 // mm, eccentricity of the geometric imperfection
	M0Ed      float64 // N·mm, first-order design moment including the imperfection
	M2        float64 // N·mm, nominal second-order moment
	PhiEf     float64 // effective creep ratio used
	MEd       float64 // N·mm, design moment
	MRd       float64 // N·mm, resistance at NEd with the provided bars
	// Shear along the lever arm of this bending (EN 1992-1-1:2004 6.2): VEd, VRd,c and, where
	// VEd > VRd,c and links are designed for it (6.2.3), VRd,max; Shear false where not checked.
	Shear      bool
	VEd, VRdc  float64 // N
	VRdMax     float64 // N
	LinksShear bool    // VEd > VRd,c: VRdMax holds
}

// Biaxial holds the check of EN 1992-1-1 5.8.9.
type Biaxial struct {
	Checked bool    // whether (5.38a/b) call for the check (5.39)
	A       float64 // exponent a of (5.39)
	Ratio   float64 // left-hand side of (5.39)
	// Resultant is the resultant design moment √(MEd,y² + MEd,z²) that a circular section is
	// checked with (bi/M_Ed), N·mm; 0 for a rectangle.
	Resultant float64
}

// Interaction holds the interaction data of a design's section with the bars provided.
type Interaction struct {
	NMY, NMZ []section.NMPoint   // N–M diagrams about y and about z
	Contour  []section.MyMzPoint // the My–Mz contour at NEd
}

// Exact is the resistance along the resultant design moment with an inclined neutral axis.
type Exact struct {
	MRd    float64 // N·mm, along the direction of (MEd,y, MEd,z)
	Ratio  float64 // √(MEdy² + MEdz²)/MRd
	Angle  float64 // neutral-axis angle, rad
	My, Mz float64 // components of the resistance, N·mm
}

// Bars is the longitudinal reinforcement provided.
type Bars struct {
	Count     int
	Dia       float64      // mm
	Positions [][2]float64 // (y, z) of each bar centre from the centroid, mm
	Given     bool         // true when the input fixed the bars
}

// Detailing holds what the column schedule gives beside bars and links.
type Detailing struct {
	ZoneLength     float64 // mm, length of the zones with the reduced link spacing above and below beams and slabs, 9.5.3(4)
	LapLength      float64 // mm, lap length of the bars, 8.7.3; 0 when not computed
	LapZone        bool    // the reduced spacing also applies over the laps (φ > 14 mm), 9.5.3(4)
	LapLinks       int     // links within the lap length at LapLinkSpacing (one more beyond each end, 8.7.4.2(1)); 0 when not computed
	LapLinkSpacing float64 // mm, link spacing over the laps, 9.5.3(4) and 8.7.4.1(3), (4); 0 when not computed
	ExtraTies      int     // ties needed besides the perimeter link so that no bar is more than 150 mm from a restrained one, 9.5.3(6)
	CoverRequired  float64 // mm, nominal cover to the links required for durability and bond, 4.4.1; 0 when not computed
	FireRating     int     // minutes; 0 when no fire check
	FireOK         bool    // the fire check passes (or the rating is verified elsewhere)
	FireMethod     string  // how the rating is shown: "Method A, Table 5.2a", "Method A, Eq. (5.7)" or "verified elsewhere"; empty when not shown
	SurfaceMesh    bool    // a surface reinforcement mesh is required against falling off of concrete in fire (a ≥ 70 mm), EN 1992-1-2 4.5.2(2)

	BarsB, BarsH  int           // bars along each b-face and along each h-face, corners included
	LapBuilt      float64       // mm, the lap length as built: LapLength rounded up to design.lap_step; 0 when not computed
	LapStart      float64       // mm, start of the laps above the floor level at the foot of the lift
	LapTransverse bool          // the links over the laps provide the area of one lapped bar, 8.7.4.1(3)
	Zones         *detail.Zones // the link zones of the lift as built; nil where the lift's length is not known
	TiesB, TiesH  int           // extra ties on the b-faces (each across h) and on the h-faces (each across b), 9.5.3(6)
	TieBars       string        // which bars the extra ties hold, counted from a corner along each face; empty when none

	// Crank is the offset, mm, by which the bars of this lift are cranked at its top into the section
	// of the lift above where the section changes (0: the bars run straight on), and CrankLength
	// the length of the crank at 1 in 12, EN 1992-1-1:2004 9.5.3(5).
	Crank, CrankLength float64
}

// Schedule is the cage of a lift as built: the bar marks with their counts, cut lengths and
// masses, and the anchorage of the bars into the foundation (the bottom lift's starter bars) and
// into the roof (the top lift). Lengths in mm, masses in kg; zero where not known (the lift's
// length not given).
type Schedule struct {
	Known     bool    // the lift's length is known: lengths, counts and masses are given
	Bottom    bool    // the lift stands on the foundation: starter bars are cast into it
	Top       bool    // the lift ends at the roof: its bars are anchored into the roof construction
	Anchorage float64 // mm, lbd of the bars in compression (8.4.4), where Bottom or Top; 0 otherwise
	Marks     []Mark  // main bars, links, ties and starter bars, in that order (those that exist)
	MainMass  float64 // kg, main bars of the lift (starter bars included)
	LinkMass  float64 // kg, links and ties of the lift
	TotalMass float64 // kg, MainMass + LinkMass
}

// Mark is one bar mark of the schedule: COLUMN-LIFT-index.
type Mark struct {
	Mark   string  // e.g. "B2-L1-01"
	What   string  // "main bars", "links", "circular links", "helix", "ties", "starter bars"
	Count  int     // pieces in the lift
	Dia    float64 // mm
	Length float64 // mm, cut length of one piece
	Mass   float64 // kg, all pieces
}

// Links is the transverse reinforcement provided.
type Links struct {
	Type           string  // LinksRect, LinksCircular or LinksHelix
	Dia            float64 // mm
	Spacing        float64 // mm, general spacing
	SpacingReduced float64 // mm, within the zones of 9.5.3(4)
	SpacingShear   float64 // mm, the largest spacing the shear allows where it is below that of 9.5.3; 0 where shear does not govern
}

// Kinds of transverse reinforcement.
const (
	LinksRect     = "rectangular" // closed rectangular links round the bars of the faces
	LinksCircular = "circular"    // closed circular links
	LinksHelix    = "helix"       // a continuous helix whose pitch is the spacing
)

// linkType returns the kind of transverse reinforcement of the column.
func linkType(col *model.Column) string {
	switch {
	case col.Shape != model.ShapeCircle:
		return LinksRect
	case col.Helix:
		return LinksHelix
	}
	return LinksCircular
}

// Trace returns the design's steps with their IDs and references made whole,
// column/lift/part/name, as results.json and the sheets print them. A reference that
// starts with "/" already names a step from the root, of another design (the take-down
// refers to the lift above) or of the project basis (basis/…, Result.Basis), and only
// loses its slash.
func (d *Design) Trace() []trace.Step {
	prefix := d.Prefix()
	out := make([]trace.Step, len(d.Steps))
	for i, s := range d.Steps {
		out[i] = WholeStep(prefix, s)
	}
	return out
}

// Prefix returns the start of the whole IDs of the design's steps, "COLUMN/LIFT/".
func (d *Design) Prefix() string { return d.Column + "/" + d.Storey + "/" }

// WholeStep returns step s of the design whose IDs start with prefix ("COLUMN/LIFT/") as Trace
// gives it: its ID and its arguments' sources as whole IDs.
func WholeStep(prefix string, s trace.Step) trace.Step { return underPrefix(s, prefix, true) }

// underPrefix returns step s with its ID and the sources of its arguments within the design put
// under prefix; a source from the root ("/…") keeps its "/" unless whole, which drops it.
func underPrefix(s trace.Step, prefix string, whole bool) trace.Step {
	s.ID = prefix + s.ID
	if len(s.Args) == 0 {
		return s
	}
	args := make([]trace.Arg, len(s.Args))
	for j, a := range s.Args {
		switch {
		case strings.HasPrefix(a.From, "/"):
			if whole {
				a.From = a.From[1:]
			}
		case a.From != "":
			a.From = prefix + a.From
		}
		args[j] = a
	}
	s.Args = args
	return s
}

// extremeStep returns the formula step whose value is the largest (most) or least of args, as
// max(…) or min(…) over them; one argument stands alone.
func extremeStep(id, title, clause, symbol, unit string, most bool, args []trace.Arg) trace.Step {
	fn, pick := "min", math.Min
	if most {
		fn, pick = "max", math.Max
	}
	v := args[0].Value
	names := make([]string, len(args))
	for i, a := range args {
		v, names[i] = pick(v, a.Value), a.Name
	}
	expr := names[0]
	if len(args) > 1 {
		expr = fn + "(" + strings.Join(names, ", ") + ")"
	}
	return trace.Formula(id, title, clause, symbol, unit, v, expr, args...)
}

// LiftLevel is the level of the foot and of the top of a lift, mm above the base of its column.
type LiftLevel struct {
	Bottom, Top float64
	Known       bool // false where a length of the lift or of a lift below is not given
}

// Levels returns the levels of each design's lift: from the building form's storey heights, or,
// in the actions form, from the lengths l of the column's lifts summed in input order from its
// first lift (unknown above a lift whose length is not given).
func (r *Result) Levels() []LiftLevel {
	out := make([]LiftLevel, len(r.Designs))
	if r.Input == nil {
		return out
	}
	at := map[string]LiftLevel{} // "column\x00lift"
	if b := r.Input.Building; b != nil {
		z := 0.0
		for _, s := range b.Storeys {
			at["\x00"+s.Name] = LiftLevel{Bottom: z, Top: z + s.Height, Known: s.Height > 0}
			z += s.Height
		}
		for i, d := range r.Designs {
			out[i] = at["\x00"+d.Storey]
		}
		return out
	}
	for _, c := range r.Input.Columns {
		z, known := 0.0, true
		for _, s := range c.Storeys {
			known = known && s.Length > 0
			at[c.ID+"\x00"+s.Name] = LiftLevel{Bottom: z, Top: z + s.Length, Known: known}
			z += s.Length
		}
	}
	for i, d := range r.Designs {
		out[i] = at[d.Column+"\x00"+d.Storey]
	}
	return out
}

// Total is the steel of a column, of a level or of the building, kg.
type Total struct {
	Name           string
	Main, Links    float64 // main bars (starter bars included), links and ties
	Total          float64
	Lifts, Unknown int // lifts counted, and lifts whose masses are not known (left out of the sums)
}

// Quantities is the quantity take-off of the run: the steel per column, per level (lifts
// named by the level at their top) and for the building.
type Quantities struct {
	Columns, Levels []Total // in order of first appearance
	Building        Total
}

// Quantities sums the masses of the designs' schedules per column, per level and for the building.
func (r *Result) Quantities() Quantities {
	var q Quantities
	q.Building.Name = "building"
	add := func(list *[]Total, name string, s Schedule) {
		k := -1
		for i := range *list {
			if (*list)[i].Name == name {
				k = i
			}
		}
		if k < 0 {
			*list = append(*list, Total{Name: name})
			k = len(*list) - 1
		}
		(*list)[k].add(s)
	}
	for _, d := range r.Designs {
		add(&q.Columns, d.Column, d.Schedule)
		add(&q.Levels, d.Storey, d.Schedule)
		q.Building.add(d.Schedule)
	}
	return q
}

func (t *Total) add(s Schedule) {
	t.Lifts++
	if !s.Known {
		t.Unknown++
		return
	}
	t.Main += s.MainMass
	t.Links += s.LinkMass
	t.Total += s.TotalMass
}
