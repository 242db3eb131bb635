package design

import (
	"colsheet/calc/actions"
	"colsheet/calc/building"
	"colsheet/calc/creep"
	"colsheet/calc/frame"
	"math"
	"slices"
	"strconv"
	"strings"

	"colsheet/calc/code"
	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
	"colsheet/calc/work"
)

// Version is the version Run writes into a result; the command replaces it with its build's
// version (module version and VCS revision), so no fixed number stands for the code that ran.
const Version = "devel"

// Run designs or checks every column and lift of the input.
// For the building form it first derives the actions of every column and lift; an error
// then names a fault of the building that the input reader could not see.
func Run(in *model.Input) (*Result, error) { return run(in, Hooks{}, true) }

// Stream designs or checks every column and lift of the input as Run does, adds each design's
// interaction data (AddInteraction) and hands each design to emit in input order as soon as it
// and every design before it are done; in the building form that is once every lift is
// designed, since the choice of typical bars may change any lift. Before the first design is
// handed on, start (when not nil) is given the result with its project basis and, for every
// design, its column and lift names (Design.Column, Design.Storey; nothing else of the designs
// is to be read until each is handed on). With keep false a design keeps its results but not
// its trace, section or interaction data once emit returns, so that the memory of a run does
// not grow with the traces of its lifts: the building form's first pass then also lets each
// lift's trace go as soon as the lift is designed and designs the lift again, the same, when
// its column is handed on. An error from start or emit stops the run and is returned.
func Stream(in *model.Input, keep bool, start func(r *Result) error, emit func(k int, d *Design) error) (*Result, error) {
	return StreamWith(in, keep, Hooks{Start: start, Emit: emit})
}

// Hooks are the calls a streamed run makes to its caller (StreamWith).
type Hooks struct {
	// Start, when not nil, is given the result before the first design is handed on, as
	// Stream's start.
	Start func(r *Result) error
	// Ready, when not nil, is given each design once it is whole (with its interaction data)
	// and before it is handed on, on the worker that made it: several at once and in any
	// order, so that work on a design that does not depend on the others (its text, say) is
	// spread over the workers. It may read the design but not change it.
	Ready func(k int, d *Design)
	// Emit is handed each design in input order, as Stream's emit.
	Emit func(k int, d *Design) error
}

// StreamWith is Stream with the calls of h; h.Emit must not be nil.
func StreamWith(in *model.Input, keep bool, h Hooks) (*Result, error) {
	emit := h.Emit
	h.Emit = func(k int, d *Design) error {
		if err := emit(k, d); err != nil {
			return err
		}
		if !keep {
			d.letGo()
		}
		return nil
	}
	return run(in, h, keep)
}

// run is Run, handing each design to h.Emit (when not nil) in input order as Stream says,
// each with its interaction data and once h.Ready (when not nil) has seen it, after h.Start
// (when not nil); with keep false, the building form's first pass keeps no trace.
func run(in *model.Input, h Hooks, keep bool) (*Result, error) {
	start, emit := h.Start, h.Emit
	r := &Result{ToolName: "colsheet", ToolVersion: Version, Input: in, Methods: methods(in), bs: newBasis(in), curves: &curveMemo{}}
	r.Basis = r.bs.public() // the basis is whole before any lift is designed
	if in.Building != nil {
		d, err := building.Derive(in, func(lx, ly float64, spans string) (s, n, w, e []frame.Piece) {
			return actions.PanelLoads(lx, ly, 1, spans)
		})
		if err != nil {
			return nil, err
		}
		r.Building = d
		b := in.Building
		r.Designs = make([]Design, len(d.Lifts))
		r.cases = make([]liftCase, len(d.Lifts))
		dvs := make([]*Derivation, len(d.Lifts))
		cols := columnSpans(d.Lifts)
		// The columns are independent: each on a worker, each column from its top lift down, so
		// that a lift's bars are not less than those of the lift above (the bars do not grow up
		// the building, common practice) and the lap above a lift can be checked. A lift refers
		// only to steps of its own column, so each column has its own hoister: the take-down's
		// steps that repeat a basis step (code parameters, ψ factors) are the basis's, and each
		// lift refers to them.
		work.Each(len(cols), func(ci int) {
			h := r.bs.hoister()
			for k := cols[ci].hi - 1; k >= cols[ci].lo; k-- {
				lf := &d.Lifts[k]
				l0y, l0z := b.Options.L0Factor*lf.Height, b.Options.L0Factor*lf.Height
				if b.Options.L0FromFrame {
					l0y, l0z = lf.Src.L0[0].V, lf.Src.L0[1].V
				}
				col := &model.Column{ID: lf.Column, B: lf.Size.B, H: lf.Size.H, Shape: lf.Size.Shape, Helix: lf.Size.Helix, Cover: b.Cover, Bars: b.Bars,
					Storeys: []model.Storey{{Name: lf.Name, L0Y: l0y, L0Z: l0z, Length: lf.Height, Clear: math.Max(lf.Height-building.BeamDepthAt(b, lf.Name, lf.I, lf.J), 0), NEd: lf.NEd, MY: lf.MY, MZ: lf.MZ, Creep: b.Options.Creep}}}
				dv := &Derivation{Steps: lf.Steps, hoist: h, NEd: lf.Src.NEd, NArr: lf.Src.NArr, L0: lf.Src.L0, RatioQP: lf.Src.RatioQP, BottomAlt: lf.Src.BotAlt, Min: lf.Src.Min,
					Top: [2]trace.Q{lf.Src.MYTop, lf.Src.MZTop}, Bottom: [2]trace.Q{lf.Src.MYBot, lf.Src.MZBot}}
				if k+1 < cols[ci].hi {
					above := &r.Designs[k+1]
					dv.AsAbove, dv.AcAbove, dv.NameAbove = above.AsProv, above.Ac(), above.Storey
					if above.pattern.Count() > 0 {
						dv.above = neighbourOf(above)
					}
				}
				// Without keep the first pass designs each lift without its trace (its results
				// are the same: nothing of a design is read from its trace but checks, which a
				// trial keeps); the lift is designed again, with its trace, when its column is
				// handed on.
				dv.trial = !keep
				r.Designs[k] = design(in, col, &col.Storeys[0], dv, r.bs)
				if !keep {
					dv.trial = false
					r.Designs[k].letGo()
				}
				r.cases[k] = liftCase{col, &col.Storeys[0]}
				dvs[k] = dv
			}
		})
		var typical *typicalUses
		if in.Options.Typical.On && b.Bars == nil {
			typical = r.typicalUses()
		}
		// Each column's typical pass, then its lifts handed on in order, column after column
		// (the lifts of a column are contiguous and the columns in order).
		finish := func(ci int) {
			if typical != nil {
				r.typicalColumn(in, dvs, typical, cols[ci])
			}
			// The lifts whose traces the first pass let go, and the typical pass did not
			// design again, designed again with the same actions and neighbours: the same
			// design, with its trace.
			for k := cols[ci].lo; k < cols[ci].hi; k++ {
				if r.Designs[k].Steps == nil {
					r.Designs[k] = design(in, r.cases[k].col, r.cases[k].st, dvs[k], r.bs)
				}
			}
			// References to another lift's step taken out after them: the design's trace begins
			// with its derivation's steps.
			for k := cols[ci].lo; k < cols[ci].hi; k++ {
				for _, i := range dvs[k].across {
					dvs[k].hoist.redirect(&r.Designs[k].Steps[i], nil)
				}
				if emit != nil {
					addInteraction(&r.Designs[k], r.curves)
					if h.Ready != nil {
						h.Ready(k, &r.Designs[k])
					}
				}
			}
		}
		if start != nil {
			if err := start(r); err != nil {
				return nil, err
			}
		}
		// Each design holds its derivation's steps now: the lifts' own copies are let go.
		release := func(ci int) {
			for k := cols[ci].lo; k < cols[ci].hi; k++ {
				d.Lifts[k].Steps, dvs[k] = nil, nil
			}
		}
		// Handed on: one column ahead per worker, since a column's traces are large.
		if emit == nil {
			work.Each(len(cols), func(ci int) { finish(ci); release(ci) })
		} else if err := work.EachInOrder(len(cols), 1, finish, func(ci int) error {
			release(ci)
			for k := cols[ci].lo; k < cols[ci].hi; k++ {
				if err := emit(k, &r.Designs[k]); err != nil {
					return err
				}
			}
			return nil
		}); err != nil {
			return nil, err
		}
	} else {
		for ci := range in.Columns {
			col := &in.Columns[ci]
			for si := range col.Storeys {
				r.cases = append(r.cases, liftCase{col, &col.Storeys[si]})
			}
		}
		// The lifts of the actions form are independent.
		r.Designs = make([]Design, len(r.cases))
		if start != nil {
			for k, c := range r.cases {
				r.Designs[k].Column, r.Designs[k].Storey = c.col.ID, c.st.Name
			}
			if err := start(r); err != nil {
				return nil, err
			}
		}
		one := func(k int) {
			r.Designs[k] = design(in, r.cases[k].col, r.cases[k].st, nil, r.bs)
			if emit != nil {
				addInteraction(&r.Designs[k], r.curves)
				if h.Ready != nil {
					h.Ready(k, &r.Designs[k])
				}
			}
		}
		if emit == nil {
			work.Each(len(r.cases), one)
		} else if err := work.EachInOrder(len(r.cases), 8, one, func(k int) error { return emit(k, &r.Designs[k]) }); err != nil {
			return nil, err
		}
	}
	if in.Options.Sizes != nil {
		r.Sizes = findSizes(in, r)
	}
	return r, nil
}

// letGo drops the design's trace, sections and interaction data, keeping its results.
func (d *Design) letGo() { d.Steps, d.sec, d.circ, d.Interaction = nil, nil, nil, nil }

// span is the lifts [lo, hi) of one column in the derived lifts, lowest first.
type span struct{ lo, hi int }

// columnSpans returns the runs of lifts that stand one on another, in order: the lifts of one
// column at consecutive levels (a column absent at some levels, standing on a transfer beam
// above them, starts a run of its own).
func columnSpans(lifts []building.Lift) []span {
	var out []span
	for lo := 0; lo < len(lifts); {
		hi := lo + 1
		for hi < len(lifts) && lifts[hi].Column == lifts[lo].Column && lifts[hi].Level == lifts[hi-1].Level+1 {
			hi++
		}
		out = append(out, span{lo, hi})
		lo = hi
	}
	return out
}

// Derivation is the traced origin of a lift's actions when they come from the building form:
// the steps of the take-down and the moments, and the quantities the design takes from them.
type Derivation struct {
	Steps     []trace.Step
	RatioQP   trace.Q    // NEd,qp/NEd from the take-down, standing for M0Eqp/M0Ed in (5.19); zero when not derived
	BottomAlt [2]trace.Q // bottom moments about y and z of an arrangement with single curvature; zero when none
	AsAbove   float64    // mm², the bars of the lift above (0 at the top); the lift takes no less
	AcAbove   float64    // mm², the section of the lift above, for the lap
	NameAbove string     // the lift above
	NEd       trace.Q
	NArr      [2]trace.Q // NEd that accompanies the moment arrangements about y and about z
	// Min holds, about y and z, the least axial force of the moment arrangement (permanent
	// actions favourable, γG,inf) with its end moments; zero N.From when not derived.
	Min         [2]building.MinCase
	L0          [2]trace.Q // effective lengths about y and z, when derived
	Top, Bottom [2]trace.Q // end moments about y and z

	trial  bool     // the actions of a check by quick evaluation only, whose steps are not kept
	hoist  *hoister // takes the steps that repeat a basis step out of Steps; nil: none
	across []int    // places of the steps that refer to another lift, once hoisted

	above     *neighbour       // the bars of the lift above, which this lift's bars continue; nil at the top
	below     *neighbour       // the typical pass: the bars of the lift below, within which this lift's stay; nil: none
	prefer    []detail.Pattern // the typical pass: the patterns of the section in order of use, to prefer
	tolerance float64          // the typical pass: the most extra steel accepted for a preferred pattern, as a fraction
}

// methods returns the methods and assumptions in force for the input.
func methods(in *model.Input) []Method {
	block := Method{"Concrete stress block", "parabola-rectangle, integrated in closed form over the compressed depth", "EN 1992-1-1:2004 3.1.7(1)"}
	if in.Options.StressBlock == model.Rectangular {
		block = Method{"Concrete stress block", "rectangular, η·fcd over λ·x", "EN 1992-1-1:2004 3.1.7(3)"}
	}
	imp := Method{"Geometric imperfection", "inclination θi = θ0·αh·αm, ei = θi·l0/2 about each axis", "EN 1992-1-1:2004 5.2(5), (7)"}
	if in.Options.Imperfection == model.ImperfL0Over400 {
		imp = Method{"Geometric imperfection", "ei = l0/400 about each axis", "EN 1992-1-1:2004 5.2(9)"}
	}
	out := []Method{
		block,
		{"Reinforcing steel", "bilinear with a horizontal top branch at fyd, no strain limit", "EN 1992-1-1:2004 3.2.7(2)b"},
		{"Strain limits", "pivots: εcu at the compressed face, or εc2 at (1 − εc2/εcu2)·h when the whole section is compressed", "EN 1992-1-1:2004 6.1(5), Fig. 6.1"},
		{"Concrete displaced by bars", "deducted for bars in compression", "common practice"},
		imp,
		{"Minimum eccentricity", "e0 = max(h/30, 20 mm) about each axis", "EN 1992-1-1:2004 6.1(4)"},
		secondOrder(in),
		{"Design moment", "MEd = max{M02, M0e + M2, M01 + 0.5·M2, NEd·e0}, imperfections about both axes", "EN 1992-1-1:2004 5.8.8.2; common practice"},
		{"Biaxial bending", "criteria (5.38a/b), then (5.39) with a from NEd/NRd", "EN 1992-1-1:2004 5.8.9"},
		bars(in),
		{"Links", "diameter, spacing and reduced spacing", "EN 1992-1-1:2004 9.5.3"},
		{"Laps", "all bars lapped at one section above the floor, each bar of the lift above beside its bar below; the clear distance beside each lapped pair; links over the lap at the reduced spacing, for bars of 20 mm and over with ΣAst ≥ As of one bar in the outer thirds, one more beyond each end", "EN 1992-1-1:2004 8.7.2(3), (4); 8.7.4; 9.5.3(4)"},
		{"Scope", "isolated columns of braced frames under the given actions; tension columns excluded", "common practice"},
	}
	if anyCircle(in) {
		out = append(out, Method{"Circular columns", "bars evenly on one circle (at least six, the first on the +z axis); i = D/4; is = rs/√2 (5.8.8.3(2)), d = D/2 + is; Ic = π·D⁴/64; " +
			"the moment resistance by strain compatibility over the compressed circular segment (closed form, Gauss–Legendre for the parabola), the least over the directions of bending; " +
			"biaxial bending by the resultant moment against that least resistance ((5.39) with a = 2), the imperfection and e0 about both axes (on the safe side); " +
			"shear on bw = D and d = D/2 + 2·rs/π; fire with b = D (Table 5.2a) and b' = D (Eq. (5.7)); circular links or a helix at the spacings of 9.5.3 (the pitch of a helix)",
			"EN 1992-1-1:2004 5.8.3.2, 5.8.8.3, 5.8.9(4), 6.1, 6.2, 9.5.2, 9.5.3; EN 1992-1-2:2004 5.3.2; common practice"})
	}
	if b := in.Building; b != nil {
		analysis := Method{"Column moments", "simplified subframe at each level: the columns above and below with far ends fixed, the beams either side at " + b.Options.BeamStiffness + " stiffness with far ends fixed; the unbalanced beam moment shared by stiffness; a fixed base takes half the moment of the lift above it", "common practice"}
		if b.Analysis == model.AnalysisFrame {
			analysis = Method{"Column moments", "each frame line solved whole, braced (joint rotations only); at each column end the envelope of every arrangement of loaded (γG·Gk + γQ·Qk) and lightly loaded (γG,light·Gk) spans, by superposition of single-span load cases, with the spans that give it named on the sheet", "common practice; EN 1992-1-1:2004 5.1.3(1)P"}
		}
		if b.Analysis == model.AnalysisBoth {
			analysis = Method{"Column moments", "both the simplified subframe at each level (beams at " + b.Options.BeamStiffness + " stiffness) and each frame line solved whole (envelope of every arrangement of loaded and lightly loaded spans); at each column end, per axis, the larger end moment governs and both are on the sheet", "common practice; EN 1992-1-1:2004 5.1.3(1)P"}
		}
		comb := "Eq. (6.10)"
		if b.Options.Combination == model.Comb610ab {
			comb = "the less favourable of Eq. (6.10a) and (6.10b); the moment arrangements with the factors of the one that gives the larger moment, and their NEd by the same expression"
		}
		red := "none"
		switch b.Options.Reduction {
		case model.ReduceArea:
			red = "αA by the floor area draining to the column at each level, EN 1991-1-1:2002 6.3.1.2(10)"
		case model.ReduceStoreys:
			red = "αn by the storeys of the category above, EN 1991-1-1:2002 6.3.1.2(11)"
		}
		out = append(out,
			Method{"Take-down", "slabs to beams one way or by 45° lines (two way), beams to columns as simply supported; self-weight of beams (b·h) and columns from their sizes; NEd at the bottom of each lift", "common practice; EN 1991-1-1:2002 Annex A"},
			Method{"Combination", comb + ", each imposed-load category leading in turn, the others with ψ0; each moment arrangement is checked also with its least axial force, the permanent load favourable on every span (γG,inf)", "EN 1990:2002 6.4.3.2, Table A1.1, Table A1.2(B)"},
			Method{"Imposed-load reduction", red, "EN 1991-1-1:2002 6.3.1.2"},
			Method{"Load arrangements", "for the column moments, at each joint one side loaded (γG·Gk + γQ·Qk under Eq. (6.10)) and the other lightly loaded (γG,light·Gk), the side that gives the larger unbalanced moment (ties: the sense that bends the lifts in single curvature); all spans loaded for NEd", "EN 1992-1-1:2004 5.1.3"},
			analysis,
			Method{"Design cases", "the largest NEd (all spans loaded) with the largest end moments of the arrangements about both axes; checked again with the smaller NEd of each moment arrangement (by the same expression as its span loads), with the least axial force of the arrangement (γG,inf on every span) and its own end moments, and with the arrangement that bends a lift in single curvature where the governing one gives double curvature", "common practice; EN 1992-1-1:2004 5.1.3"},
			effectiveLength(in),
		)
	}
	return out
}

// anyCircle reports whether the input has a circular column.
func anyCircle(in *model.Input) bool {
	for _, c := range in.Columns {
		if c.Shape == model.ShapeCircle {
			return true
		}
	}
	if b := in.Building; b != nil {
		if b.Column.Shape == model.ShapeCircle {
			return true
		}
		for _, c := range b.Columns {
			if c.Shape == model.ShapeCircle {
				return true
			}
		}
	}
	return false
}

// effectiveLength returns the way the effective lengths of the building's lifts are set.
func effectiveLength(in *model.Input) Method {
	b := in.Building
	if b.Options.L0FromFrame {
		k := in.Options.CrackedK
		if !(k > 0) {
			k = 0.5
		}
		return Method{"Effective length", "Eq. (5.15) from the relative flexibilities k = ΣEI/l of the columns over Σ k_cr·2EI/l of the beams at each end (k ≥ 0.1; fixed base 0.1), k_cr = " + strconv.FormatFloat(k, 'g', -1, 64) + " for cracking, l the clear height", "EN 1992-1-1:2004 5.8.3.2(3); common practice"}
	}
	return Method{"Effective length", "l0 = " + strconv.FormatFloat(b.Options.L0Factor, 'g', -1, 64) + " × storey height", "EN 1992-1-1:2004 5.8.3.2"}
}

// secondOrder returns the method of second-order analysis in force.
func secondOrder(in *model.Input) Method {
	switch in.Options.SecondOrder {
	case model.SecondOrderStiffness:
		return Method{"Second-order effects", "nominal stiffness, EI = Kc·Ecd·Ic + Ks·Es·Is and the magnification 1 + β/(NB/NEd − 1) with β = π²/8 on M0e, for lifts with λ > λlim", "EN 1992-1-1:2004 5.8.3.1, 5.8.7"}
	case model.SecondOrderBoth:
		return Method{"Second-order effects", "both nominal curvature and nominal stiffness for lifts with λ > λlim; the larger design moment governs", "EN 1992-1-1:2004 5.8.3.1, 5.8.7, 5.8.8"}
	}
	return Method{"Second-order effects", "nominal curvature for lifts with λ > λlim", "EN 1992-1-1:2004 5.8.3.1, 5.8.8"}
}

// common holds the traced quantities of a lift that do not depend on the bars.
type common struct {
	in          *model.Input
	col         *model.Column
	st          *model.Storey
	p           code.Params
	steps       []trace.Step
	trialSteps  []trace.Step // the buffer of the trials' check steps
	trialChecks []checked    // the buffer of the trials' checks (trial.go)
	derived     int          // the steps of the derivation at the head of steps
	// lean is set for a derivation's trial (Derivation.trial): every log of the design keeps
	// only its check steps, whose results are the same.
	lean bool
	// arrangements holds the commons of the trial derivations of withArrangements, made once
	// per lift (they do not depend on the bars): about y and z, the arrangement in single
	// curvature and that of the least axial force; nil where not yet made.
	arrangements *[2][2]*common
	cases        *caseSet  // the lift's load cases when it has several; nil for one
	tension      bool      // NEd < 0: no imperfection, e0, slenderness or second order
	circle       bool      // a circular section: b and h are both its diameter D
	shearCap     *shearCap // the link spacing that another load case's shear allows; nil: none
	cautions     []string
	fck, fcd     trace.Q
	fyd, es      trace.Q
	ecm          trace.Q // for the nominal stiffness method
	bs           *projectBasis
	phiInf       trace.Q // φ(∞, t0) by Annex B, when the lift has creep data
	dv           *Derivation
	epsC2, epsCu trace.Q
	nExp         trace.Q
	lam, eta     trace.Q // rectangular block factors (zero value for parabola-rectangle)
	b, h, ac     trace.Q
	nEd          trace.Q
	nRel         trace.Q
	asMin, asMax trace.Q
	sMinFor      func(dia float64) float64
	ax           [2]axisCommon
}

// axisCommon holds the bar-independent quantities for bending about one axis.
type axisCommon struct {
	name     string  // "y" or "z"
	depth    trace.Q // section dimension along the lever arm
	top, bot trace.Q // first-order end moments, face convention
	l0       trace.Q
	m01, m02 trace.Q
	ei       trace.Q
	m01i     trace.Q
	m02i     trace.Q
	e0       trace.Q
	lambda   trace.Q
	factorA  trace.Q
	factorC  trace.Q
	phiEf    trace.Q
	phiGiven bool
}

// param returns the code parameter name in force, as its step of the project basis records it.
func param(p code.Params, name, unit string) trace.Q {
	cat, _ := code.Lookup(name)
	return trace.Q{V: p.Get(name), Symbol: cat.Symbol, Unit: unit, From: paramFrom[name]}
}

// paramFrom holds the ID of each code parameter's basis step, from the root: "/basis/code/NAME".
var paramFrom = func() map[string]string {
	m := make(map[string]string, len(code.Catalogue))
	for _, c := range code.Catalogue {
		m[c.Name] = "/" + BasisPrefix + "code/" + c.Name
	}
	return m
}()

// log returns a log that appends to steps under group, keeping only the check steps where the
// design is lean.
func (c *common) log(steps []trace.Step, group string) *trace.Log {
	return &trace.Log{Steps: steps, Group: group, Trial: c.lean}
}

// leanRoom is the room for the check steps of a lean design (common.lean).
const leanRoom = 96

func newCommon(in *model.Input, col *model.Column, st *model.Storey, dv *Derivation, bs *projectBasis) *common {
	in, bs = bs.forLift(in, col, st) // the lift's concrete class and the basis of that class
	c := &common{in: in, col: col, st: st, p: in.Code, dv: dv, bs: bs}
	// Room for every step of the design, so that evaluate and finish append in place, allocated
	// once; a trial derivation (withArrangements) keeps no trace: its log keeps no step.
	var l *trace.Log
	switch {
	case dv != nil && dv.trial:
		// Only check steps are kept (evaluate makes room for them).
		c.lean = true
		l = &trace.Log{Trial: true}
	case dv == nil:
		l = &trace.Log{Steps: make([]trace.Step, 0, bs.room(0))}
	default:
		l = &trace.Log{Steps: make([]trace.Step, 0, bs.room(len(dv.Steps)))}
		if dv.hoist != nil {
			l.Steps, dv.across = dv.hoist.filter(l.Steps, dv.Steps, col.ID+"/"+st.Name+"/")
		} else {
			l.Steps = append(l.Steps, dv.Steps...)
		}
		c.derived = len(l.Steps)
	}
	p := in.Code

	// The materials (of the lift's class) and the code parameters are the project basis's.
	c.fck, c.fcd, c.lam, c.eta = bs.fck, bs.fcd, bs.lam, bs.eta
	c.epsC2, c.epsCu, c.nExp = bs.epsC2, bs.epsCu, bs.nExp
	c.fyd, c.es, c.ecm = bs.fyd, bs.es, bs.ecm

	l.Group = "Section and actions"
	c.circle = col.Shape == model.ShapeCircle
	if c.circle {
		c.b = l.Add(trace.Input("geo/D", "Diameter of the circular section", "input", "D", "mm", col.B))
		c.h = c.b
		c.ac = l.Add(trace.Formula("geo/Ac", "Gross concrete area of the circle", "common practice", "A_c", "mm2", circleArea(col.B),
			"3.141592653589793 * D ** 2 / 4", trace.A("D", c.b)).Shown("pi * D ** 2 / 4"))
	} else {
		c.b = l.Add(trace.Input("geo/b", "Section width (along y)", "input", "b", "mm", col.B))
		c.h = l.Add(trace.Input("geo/h", "Section depth (along z)", "input", "h", "mm", col.H))
		c.ac = l.Add(trace.Formula("geo/Ac", "Gross concrete area", "common practice", "A_c", "mm2", col.B*col.H,
			"b * h", trace.A("b", c.b), trace.A("h", c.h)))
	}
	if dv != nil {
		c.nEd = dv.NEd
	} else {
		c.nEd = l.Add(trace.Input("act/NEd", "Design axial force (compression positive)", "input", "N_Ed", "N", st.NEd))
	}
	c.nRel = l.Add(slender.RelativeForce("act/n", c.nEd, c.ac, c.fcd))
	c.tension = c.nEd.V < 0
	var phiCreep trace.Q
	hasCreep := false
	if !c.tension {
		phiCreep, hasCreep = c.creepRatio(l, dv)
	}

	theta0 := bs.param["theta_0"]
	ends := [2]model.Ends{st.MY, st.MZ}
	l0s := [2]float64{st.L0Y, st.L0Z}
	depths := [2]trace.Q{c.h, c.b}
	for k := 0; k < 2; k++ {
		a := &c.ax[k]
		a.name = []string{"y", "z"}[k]
		n := a.name
		a.depth = depths[k]
		l.Group = "First-order moments and imperfection about " + n
		var top, bot trace.Q
		if dv != nil {
			top, bot = dv.Top[k], dv.Bottom[k]
		} else {
			top = l.Add(trace.Input(n+"/M_top", "First-order moment at the top about "+n, "input", "M_top,"+n, "Nmm", ends[k].Top))
			bot = l.Add(trace.Input(n+"/M_bot", "First-order moment at the bottom about "+n, "input", "M_bot,"+n, "Nmm", ends[k].Bottom))
		}
		a.top, a.bot = top, bot
		a.m02 = l.Add(onAxis(n, slender.M02(n+"/M02", top, bot)))
		a.m01 = l.Add(onAxis(n, slender.M01(n+"/M01", top, bot, a.m02)))
		if dv != nil && dv.L0[k].From != "" {
			a.l0 = dv.L0[k]
		} else {
			a.l0 = l.Add(trace.Input(n+"/l0", "Effective length for buckling about "+n, "input", "l_0,"+n, "mm", l0s[k]))
		}
		if c.tension {
			// In tension the member does not buckle: no imperfection (5.2 concerns members in
			// compression), no minimum eccentricity (6.1(4) concerns compression) and no
			// second order; λ is recorded for the biaxial rule only.
			a.m02i, a.m01i = a.m02, a.m01
			a.ei, a.e0 = trace.Const(0, "e_i", "mm"), trace.Const(0, "e_0", "mm")
			l.Group = "Slenderness about " + n
			i := l.Add(onAxis(n, c.gyration(n+"/i", a.depth)))
			a.lambda = l.Add(onAxis(n, slender.Slenderness(n+"/lambda", a.l0, i)))
			a.phiEf = trace.Const(0, "φ_ef", "")
			continue
		}
		if in.Options.Imperfection == model.ImperfL0Over400 {
			a.ei = l.Add(onAxis(n, slender.EccentricityL0Over400(n+"/ei", a.l0)))
		} else {
			var lq trace.Q
			if st.Length > 0 {
				lq = l.Add(trace.Input(n+"/l", "Member length", "input", "l", "mm", st.Length))
			} else {
				lq = l.Add(trace.Input(n+"/l", "Member length (taken as l0: not given)", "EN 1992-1-1:2004 5.2(5)", "l", "mm", l0s[k]).
					Note("The member length is not given; l = l0 is used for αh, which is conservative for braced members (l0 ≤ l)."))
			}
			ah := l.Add(slender.AlphaH(n+"/alpha_h", lq))
			th := l.Add(slender.ThetaI(n+"/theta_i", theta0, ah, bs.alphaM))
			a.ei = l.Add(onAxis(n, slender.EccentricityFromInclination(n+"/ei", th, a.l0)))
		}
		a.m02i = l.Add(slender.WithImperfection(n+"/M02i", "Larger end moment with imperfection (M0Ed)", "M_02,"+n, a.m02, c.nEd, a.ei))
		a.m01i = l.Add(slender.WithImperfection(n+"/M01i", "Smaller end moment with imperfection", "M_01,"+n, a.m01, c.nEd, a.ei))
		a.e0 = l.Add(onAxis(n, slender.MinEccentricity(n+"/e0", a.depth)))

		l.Group = "Slenderness about " + n
		i := l.Add(onAxis(n, c.gyration(n+"/i", a.depth)))
		a.lambda = l.Add(onAxis(n, slender.Slenderness(n+"/lambda", a.l0, i)))
		switch {
		case hasCreep:
			a.phiEf = phiCreep
			a.factorA = l.Add(onAxis(n, slender.FactorA(n+"/A", a.phiEf)))
			a.phiGiven = true
			// 5.8.4(4) would allow φef = 0 here; the sheet records it and keeps φef, which is conservative.
			if st := creep.MayIgnoreStep(n+"/creep_ignorable", c.phiInf, a.lambda, a.m02i, c.nEd, a.depth); st.Value == 1 {
				l.Add(st.Note("colsheet keeps the computed φef all the same, which is on the safe side."))
			} else {
				l.Add(st)
			}
		case st.HasPhi:
			a.phiEf = l.Add(trace.Input(n+"/phi_ef", "Effective creep ratio", "EN 1992-1-1:2004 5.8.4(2)", "φ_ef", "", st.PhiEf))
			a.factorA = l.Add(onAxis(n, slender.FactorA(n+"/A", a.phiEf)))
			a.phiGiven = true
		default:
			a.factorA = l.Add(onAxis(n, slender.FactorADefault(n+"/A")))
			// The default enters Kφ of the nominal curvature method and Kc of the nominal stiffness
			// method, whichever the design uses; its caution goes on the design as well.
			uses := "Kφ of 5.8.8.3"
			switch in.Options.SecondOrder {
			case model.SecondOrderStiffness:
				uses = "Kc of 5.8.7.2"
			case model.SecondOrderBoth:
				uses = "Kφ of 5.8.8.3 and Kc of 5.8.7.2"
			}
			caution := "φef is not given: the default value is used for " + uses + " where the column is slender. Give phi_ef from 5.8.4 for the actual loading history."
			a.phiEf = l.Add(trace.Input(n+"/phi_ef", "Effective creep ratio for "+uses+" (not given)", "common practice", "φ_ef", "", p.Get("phi_ef_default")).
				Caution(caution))
			if !slices.Contains(c.cautions, caution) {
				c.cautions = append(c.cautions, caution)
			}
		}
		rm := l.Add(onAxis(n, slender.MomentRatio(n+"/rm", a.m01, a.m02)))
		a.factorC = l.Add(onAxis(n, slender.FactorC(n+"/C", rm)))
	}

	l.Group = "Reinforcement limits"
	c.asMin = l.Add(detail.AsMin("det/As_min", c.nEd, c.fyd, c.ac, param(p, "As_min_N", ""), param(p, "As_min_Ac", "")))
	c.asMax = l.Add(detail.AsMax("det/As_max", c.ac, param(p, "As_max_Ac", "")))

	k1, k2, s0 := p.Get("spacing_k1"), p.Get("spacing_k2"), p.Get("spacing_min")
	dg := in.Materials.Aggregate
	c.sMinFor = func(dia float64) float64 { return math.Max(math.Max(k1*dia, dg+k2), s0) }
	c.steps = l.Steps
	return c
}

// gyration returns the radius of gyration of the concrete section for bending with the lever
// arm along depth: h/√12, or D/4 for a circle.
func (c *common) gyration(id string, depth trace.Q) trace.Step {
	if c.circle {
		return slender.RadiusOfGyrationCircle(id, depth)
	}
	return slender.RadiusOfGyration(id, depth)
}

// circleArea returns the area of a circle of diameter d, π·d²/4.
func circleArea(d float64) float64 { return math.Pi * d * d / 4 }

// linkFor returns the link diameter for bars of diameter dia: the given one, or the smallest
// listed size not below max(6 mm, φ/4) of EN 1992-1-1:2004 9.5.3(1).
func (c *common) linkFor(dia float64) float64 { return linkDiaFor(c.in, c.col, dia) }

// linkDiaFor returns the link diameter of the column's bars of diameter dia, as (*common).linkFor.
func linkDiaFor(in *model.Input, col *model.Column, dia float64) float64 {
	if col.LinkDia > 0 {
		return col.LinkDia
	}
	need := math.Max(in.Code.Get("link_dia_min"), in.Code.Get("link_dia_ratio")*dia)
	sizes := in.Options.LinkDiameters
	for _, d := range sizes {
		if d >= need-1e-9 {
			return d
		}
	}
	return sizes[len(sizes)-1]
}

// One designs or checks one column over one lift. Its steps refer to the project basis of
// the input (Result.Basis of Run), which it does not return.
func One(in *model.Input, col *model.Column, st *model.Storey) Design {
	return design(in, col, st, nil, newBasis(in))
}

// design designs or checks one column over one lift whose actions may come from a derivation.
func design(in *model.Input, col *model.Column, st *model.Storey, dv *Derivation, bs *projectBasis) Design {
	if len(st.Cases) > 1 && dv == nil {
		// Several load cases: one bar pattern for all, led by the case of the largest NEd.
		cs := newCaseSet(in, col, st, bs)
		c := cs.all[cs.lead]
		if col.Bars != nil {
			p := c.givenPattern()
			return c.settleCases(c.evaluate(p, true, true), p, true, nil)
		}
		d := c.search(nil)
		if d.Cases == nil {
			d = oneCase(d, &cs.storeys[cs.lead]) // no pattern fits the section at all
		}
		return d
	}
	c := newCommon(in, col, st, dv, bs)
	var d Design
	if col.Bars != nil {
		d = c.evaluate(c.givenPattern(), true, true)
		c.withArrangements(&d, dv)
		d = c.finish(d)
	} else {
		d = c.search(dv)
	}
	c.bs.noteTail(len(d.Steps) - c.derived)
	return oneCase(d, st)
}

// arrWord is the ID, title, clause and relation of the check of one moment arrangement about one axis.
type arrWord struct{ id, title, clause, relation string }

// axisName names the axes of bending.
var axisName = [2]string{"y", "z"}

// arrWords are the words of the checks of withArrangements: at the NEd of the arrangement, in
// single curvature and at the least axial force (the first index), about y and z (the second).
var arrWords = func() (w [3][2]arrWord) {
	for k, n := range axisName {
		w[0][k] = arrWord{"arr/" + n + "/check", "Resistance with the NEd of the moment arrangement about " + n, "EN 1992-1-1:2004 5.1.3; 6.1; 5.8.9",
			"η ≤ 1 at N_Ed,arr," + n}
		w[1][k] = arrWord{"arr/" + n + "/single", "Resistance with the arrangement that bends the lift in single curvature about " + n, "EN 1992-1-1:2004 5.1.3; 5.8.8; 6.1; 5.8.9",
			"η ≤ 1 in single curvature about " + n}
		w[2][k] = arrWord{"arr/" + n + "/min", "Resistance with the least axial force of the moment arrangement about " + n + " (permanent load favourable)",
			"EN 1992-1-1:2004 5.1.3; 6.1; 5.8.9", "η ≤ 1 at N_Ed,inf," + n}
	}
	return w
}()

// arrRatio returns the largest ratio of action to resistance of the checks qr at the axial force
// n, not below 2 where noResistance is set and the section has no moment resistance.
func arrRatio(n float64, qr quick, noResistance bool) float64 {
	ratio := math.Max(math.Max(n/qr.nRdMax, qr.mEd[0]/math.Max(qr.mRd[0], 1)), math.Max(qr.mEd[1]/math.Max(qr.mRd[1], 1), qr.ratioB))
	if noResistance && !qr.ok {
		ratio = math.Max(ratio, 2)
	}
	return ratio
}

// withArrangements checks the design's bars once more for each moment arrangement with the
// smaller NEd that accompanies it (the building form: the largest moment with its NEd,
// EN 1992-1-1:2004 5.1.3), adds the checks to the trace and settles the design again. A trial's
// checks are recorded without their arguments and notes (trial.go).
func (c *common) withArrangements(d *Design, dv *Derivation) {
	if dv == nil {
		return
	}
	l := c.log(d.Steps, "Resistance with the NEd of the moment arrangements")
	added := false
	// lean records the check w of a trial without its arguments and note; it reports whether d is one.
	lean := func(w *arrWord, ratio float64) bool {
		if d.trial {
			d.checks = append(d.checks, checked{l.Add(trace.Check(w.id, w.title, w.clause, w.relation, ratio, "")).From, true})
			added = true
		}
		return d.trial
	}
	for k := 0; k < 2; k++ {
		nq := dv.NArr[k]
		if nq.From == "" || nq.V >= c.nEd.V*(1-1e-12) {
			continue
		}
		qr := c.quickResist(d.pattern, nq.V)
		ratio, w := arrRatio(nq.V, qr, false), &arrWords[0][k]
		if lean(w, ratio) {
			continue
		}
		args := quickArgs(qr, trace.A("N", nq))
		s := trace.Check(w.id, w.title, w.clause, w.relation, ratio, "max(N / N_Rd, M_y / M_Rd_y, M_z / M_Rd_z, r_b)", args...).
			Note("The checks above (imperfection, slenderness, second order, resistance, biaxial) evaluated again by the same formulas at the smaller NEd; their values are shown here.")
		d.checks = append(d.checks, checked{l.Add(s).From, true})
		added = true
	}
	// An arrangement that bends the lift in single curvature where the governing one bends it in
	// double curvature: the same NEd, the other bottom moment.
	for k := 0; k < 2; k++ {
		alt := dv.BottomAlt[k]
		if alt.From == "" {
			continue
		}
		c2 := c.arrangement(0, k, func() *Derivation {
			bottom := dv.Bottom
			bottom[k] = alt
			return &Derivation{NEd: dv.NEd, Top: dv.Top, Bottom: bottom, L0: dv.L0, RatioQP: dv.RatioQP, trial: true}
		})
		qr := c2.quickResist(d.pattern, c.nEd.V)
		ratio, w := arrRatio(c.nEd.V, qr, true), &arrWords[1][k]
		if lean(w, ratio) {
			continue
		}
		args := quickArgs(qr, trace.A("M_bot", alt), trace.A("N", c.nEd))
		s := trace.Check(w.id, w.title, w.clause, w.relation, ratio, "max(0 * M_bot + N / N_Rd, M_y / M_Rd_y, M_z / M_Rd_z, r_b)", args...).
			Note("The checks above (imperfection, slenderness with C from the new end moments, second order, resistance, biaxial) evaluated again by the same formulas with this bottom moment.")
		d.checks = append(d.checks, checked{l.Add(s).From, true})
		added = true
	}
	// The least axial force with the moments of the same arrangement (γG,inf on every span):
	// below the balance point a smaller NEd lowers the moment resistance.
	for k := 0; k < 2; k++ {
		mc := dv.Min[k]
		if mc.N.From == "" {
			continue
		}
		c2 := c.arrangement(1, k, func() *Derivation {
			top, bottom := dv.Top, dv.Bottom
			top[k], bottom[k] = mc.Top, mc.Bot
			return &Derivation{NEd: mc.N, Top: top, Bottom: bottom, L0: dv.L0, RatioQP: dv.RatioQP, trial: true}
		})
		qr := c2.quickResist(d.pattern, mc.N.V)
		ratio, w := arrRatio(mc.N.V, qr, true), &arrWords[2][k]
		if lean(w, ratio) {
			continue
		}
		args := quickArgs(qr, trace.A("N", mc.N), trace.A("M_top", mc.Top), trace.A("M_bot", mc.Bot))
		s := trace.Check(w.id, w.title, w.clause, w.relation, ratio, "max(0 * M_top + 0 * M_bot + N / N_Rd, M_y / M_Rd_y, M_z / M_Rd_z, r_b)", args...).
			Note("The checks above (imperfection, slenderness, second order, resistance, biaxial) evaluated again by the same formulas with this NEd and these end moments about " + axisName[k] + "; the moments about the other axis as in the main case (conservative). Permanent actions favourable: γG,inf, EN 1990:2002 Table A1.2(B).")
		d.checks = append(d.checks, checked{l.Add(s).From, true})
		added = true
	}
	if added {
		c.settle(d, l, d.checks)
	}
}

// arrangement returns the common of the trial derivation of withArrangements of kind i (0: the
// arrangement in single curvature, 1: that of the least axial force) about axis k, made from the
// derivation dv gives the first time and kept for the other bar patterns of the lift.
func (c *common) arrangement(i, k int, dv func() *Derivation) *common {
	if c.arrangements == nil {
		c.arrangements = new([2][2]*common)
	}
	a := &c.arrangements[i][k]
	if *a == nil {
		*a = newCommon(c.in, c.col, c.st, dv(), c.bs)
	}
	return *a
}

// quickArgs returns the arguments of a check by quick evaluation: lead, then NRd,max, MEd and
// MRd about y and z (MRd not below 1 N·mm) and the biaxial ratio of qr, as constants.
func quickArgs(qr quick, lead ...trace.Arg) []trace.Arg {
	q := func(v float64, sym, unit string) trace.Q { return trace.Const(v, sym, unit) }
	return append(lead, trace.A("N_Rd", q(qr.nRdMax, "N_Rd,max", "N")),
		trace.A("M_y", q(qr.mEd[0], "M_Ed,y", "Nmm")), trace.A("M_Rd_y", q(math.Max(qr.mRd[0], 1), "M_Rd,y", "Nmm")),
		trace.A("M_z", q(qr.mEd[1], "M_Ed,z", "Nmm")), trace.A("M_Rd_z", q(math.Max(qr.mRd[1], 1), "M_Rd,z", "Nmm")),
		trace.A("r_b", q(qr.ratioB, "biaxial ratio", "")))
}

// givenPattern lays out the given bars: the most even pattern that fits, or, when none fits,
// two bars on each b-face and the rest on the h-faces, which the spacing check then fails loudly.
func (c *common) givenPattern() detail.Pattern {
	col := c.col
	g := c.geometryWith(c.linkFor(col.Bars.Dia))
	if p, ok := g.ForCount(col.Bars.Count, col.Bars.Dia, 0); ok {
		return p
	}
	if c.circle {
		return detail.Pattern{Dia: col.Bars.Dia, Ring: col.Bars.Count} // does not fit: the spacing check fails loudly
	}
	return detail.Pattern{Dia: col.Bars.Dia, NB: 2, NH: col.Bars.Count / 2}
}

// candidatesFor returns the patterns to try: the given bars, or the patterns within the rules of
// practice in the order the design tries them: those that keep the vibrator gap by cost, then
// the others by cost.
func candidatesFor(c *common) []detail.Pattern {
	if c.col.Bars != nil {
		return []detail.Pattern{c.givenPattern()}
	}
	roomy, tight := c.options(c.rulesFor(c.dv))
	var out []detail.Pattern
	for _, o := range append(roomy, tight...) {
		out = append(out, o.p)
	}
	return out
}

// lappedFit returns the least clear distance between the bars of diameter dia, away from the laps, that
// leaves the clear distance of EN 1992-1-1:2004 8.2(2) and 8.7.2(3) beside each lapped pair: a pattern
// whose lapped bars do not fit is not a candidate.
func (c *common) lappedFit(dia float64) float64 { return detail.LappedFitValue(dia, c.sMinFor(dia)) }

// onAxis returns the step with its symbol marked for bending about axis n ("y" or "z").
func onAxis(n string, s trace.Step) trace.Step {
	if strings.Contains(s.Symbol, "_") {
		s.Symbol += "," + n
	} else {
		s.Symbol += "_" + n
	}
	return s
}

// creepRatio records the effective creep ratio by EN 1992-1-1:2004 Annex B and Eq. (5.19) when the
// lift has creep data, and reports whether it did.
func (c *common) creepRatio(l *trace.Log, dv *Derivation) (trace.Q, bool) {
	cr := c.st.Creep
	if cr == nil {
		return trace.Q{}, false
	}
	l.Group = "Creep (EN 1992-1-1 Annex B)"
	fcm, rh, t0, alpha := c.bs.creepOf(l, cr)
	var h0 trace.Q
	if c.circle {
		h0 = l.Add(creep.NotionalSizeCircle("creep/h0", c.b))
	} else {
		h0 = l.Add(creep.NotionalSizeRect("creep/h0", c.b, c.h))
	}
	from := len(l.Steps)
	phiInf := creep.Coefficient(l, "creep/", fcm, rh, h0, t0, alpha)
	c.bs.hoistTail(l, from) // the factors that depend on the creep data alone are the basis's
	var ratio trace.Q
	switch {
	case cr.Ratio > 0:
		ratio = l.Add(trace.Input("creep/r_qp", "Ratio of the quasi-permanent to the design first-order moment", "input", "M_0Eqp/M_0Ed", "", cr.Ratio))
	case dv != nil && dv.RatioQP.From != "":
		ratio = dv.RatioQP
	default:
		ratio = l.Add(trace.Input("creep/r_qp", "Ratio of the quasi-permanent to the design first-order moment (not given)", "common practice", "M_0Eqp/M_0Ed", "", 1).
			Caution("M0Eqp/M0Ed is not given: 1 is used, which overstates φef; give creep.ratio."))
	}
	c.phiInf = phiInf
	return l.Add(creep.EffectiveRatio("creep/phi_ef", phiInf, ratio)), true
}
