package frame

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// subframeCase is a subframe given by its members' sizes and the beams' loads (test inputs:
// C32/40 with E = 33 GPa, columns 350×450 mm, beams 275×500 mm).
type subframeCase struct {
	name                string
	above, below        bool
	left, right         []Piece // nil when the beam is absent
	factor              float64 // Subframe.BeamFactor; 0 means the default 0.5
	hAbove, hBelow      float64
	spanLeft, spanRight float64
}

const (
	testE  = 33000.0
	testIc = 350 * 450 * 450 * 450 / 12.0
	testIb = 275 * 500 * 500 * 500 / 12.0
)

func subframeCases() []subframeCase {
	l1, l2 := 6600.0, 4800.0
	return []subframeCase{
		{"interior", true, true, []Piece{Uniform(38, l1)}, Trapezoid(30, l2, 1500), 0, 3300, 3800, l1, l2},
		{"interior, full stiffness", true, true, []Piece{Uniform(38, l1)}, []Piece{Uniform(12, l2)}, 1, 3300, 3800, l1, l2},
		{"edge", true, true, nil, append(Trapezoid(30, l2, 2400), Piece{0, 1200, 5, 5}), 0, 3300, 3800, 0, l2},
		{"top lift", false, true, []Piece{{0, l1, 10, 40}}, []Piece{Uniform(38, l2)}, 0, 0, 3300, l1, l2},
		{"top lift, edge", false, true, []Piece{Uniform(22, l1)}, nil, 0.5, 0, 3300, l1, 0},
	}
}

// subframe returns the Subframe and the equivalent Frame: node 0 the joint, nodes 1–4 the
// fixed far ends above, below, left and right; members above (0→1), below (2→0), left
// (3→0) and right (0→4), each −1 when absent.
func (c subframeCase) subframe() (Subframe, Frame, [4]int) {
	factor := c.factor
	if factor == 0 {
		factor = 0.5
	}
	s := Subframe{BeamFactor: c.factor}
	f := Frame{Nodes: []Node{{}, {Fixed: true}, {Fixed: true}, {Fixed: true}, {Fixed: true}}}
	idx := [4]int{-1, -1, -1, -1}
	add := func(slot int, m Member) { idx[slot] = len(f.Members); f.Members = append(f.Members, m) }
	if c.above {
		s.ColAbove = &Stiff{EI: testE * testIc, L: c.hAbove}
		add(0, Member{I: 0, J: 1, EI: testE * testIc, L: c.hAbove})
	}
	if c.below {
		s.ColBelow = &Stiff{EI: testE * testIc, L: c.hBelow}
		add(1, Member{I: 2, J: 0, EI: testE * testIc, L: c.hBelow})
	}
	if c.left != nil {
		_, atJoint := FixedEnd(c.spanLeft, c.left)
		s.BeamLeft = &Beam{EI: testE * testIb, L: c.spanLeft, FEMAtJoint: atJoint}
		add(2, Member{I: 3, J: 0, EI: testE * testIb, L: c.spanLeft, Loads: c.left, StiffnessFactor: factor})
	}
	if c.right != nil {
		atJoint, _ := FixedEnd(c.spanRight, c.right)
		s.BeamRight = &Beam{EI: testE * testIb, L: c.spanRight, FEMAtJoint: atJoint}
		add(3, Member{I: 0, J: 4, EI: testE * testIb, L: c.spanRight, Loads: c.right, StiffnessFactor: factor})
	}
	return s, f, idx
}

func TestSubframe(t *testing.T) {
	for _, c := range subframeCases() {
		s, f, idx := c.subframe()
		d := s.Distribute()
		r := solved(t, f)
		// The subframe's one distribution, the stiffness solution and Hardy Cross moment
		// distribution solve the same slope-deflection equations (common practice, no
		// source): they agree to 1e-6 relative.
		md, err := MomentDistribution(f, 1e-12)
		if err != nil {
			t.Fatal(err)
		}
		scale := math.Abs(d.Unbalanced) + math.Abs(r.End[len(r.End)-1][0])
		members := [4]SubframeMember{d.Above, d.Below, d.Left, d.Right}
		joint := [4]int{0, 1, 1, 0} // the side of each slot's member at the joint
		sumDF := 0.0
		for slot, m := range idx {
			sm := members[slot]
			if (m >= 0) != sm.Present {
				t.Fatalf("%s slot %d: present %v, member %d", c.name, slot, sm.Present, m)
			}
			if m < 0 {
				continue
			}
			sumDF += sm.DF
			at, far := r.End[m][joint[slot]], r.End[m][1-joint[slot]]
			if math.Abs(sm.AtJoint-at) > 1e-9*scale || math.Abs(md.End[m][joint[slot]]-at) > 1e-6*scale {
				t.Errorf("%s slot %d: at joint %g (subframe), %g (distribution), %g (stiffness)",
					c.name, slot, sm.AtJoint, md.End[m][joint[slot]], at)
			}
			if slot < 2 && math.Abs(sm.CarryOver-far) > 1e-9*scale {
				t.Errorf("%s slot %d: far end %g (subframe), %g (stiffness)", c.name, slot, sm.CarryOver, far)
			}
			if slot >= 2 {
				fs, fe := FixedEnd(f.Members[m].L, f.Members[m].Loads)
				ffar := [2]float64{fs, fe}[1-joint[slot]]
				if math.Abs(ffar+sm.CarryOver-far) > 1e-9*scale {
					t.Errorf("%s slot %d: far end FEM + carry-over %g, stiffness %g", c.name, slot, ffar+sm.CarryOver, far)
				}
			}
		}
		if !near(sumDF, 1, 1e-12) {
			t.Errorf("%s: distribution factors sum to %g", c.name, sumDF)
		}
		if !near(d.Rotation, r.Theta[0], 1e-9) {
			t.Errorf("%s: rotation %g, stiffness %g", c.name, d.Rotation, r.Theta[0])
		}
	}
}

func TestSubframeDegenerate(t *testing.T) {
	// No members: nothing to distribute, and nothing that is not finite (common practice, no source).
	d := Subframe{}.Distribute()
	if d.SumK != 0 || d.Rotation != 0 || d.Above.Present {
		t.Errorf("empty subframe: %+v", d)
	}
	// A beam whose length is zero counts as absent, but its moment stays unbalanced.
	d = Subframe{BeamLeft: &Beam{EI: 1e13, L: 0, FEMAtJoint: 5e7}, ColBelow: &Stiff{EI: 1e13, L: 3000}}.Distribute()
	if d.Left.Present || d.Unbalanced != 0 || !d.Below.Present || d.Below.DF != 1 {
		t.Errorf("zero-length beam: %+v", d)
	}
	// Beams only, no columns: the joint rotates, the beam moments balance each other.
	d = Subframe{BeamLeft: &Beam{EI: 1e13, L: 6000, FEMAtJoint: 5e7}, BeamRight: &Beam{EI: 1e13, L: 6000, FEMAtJoint: -2e7}}.Distribute()
	if !near(d.Left.AtJoint+d.Right.AtJoint, 0, 1e-12) || !near(d.Left.AtJoint, 3.5e7, 1e-12) {
		t.Errorf("beams only: %+v", d)
	}
}

func TestJointSteps(t *testing.T) {
	e := trace.Const(testE, "E", "MPa")
	ic, ib := trace.Const(testIc, "I_c", "mm4"), trace.Const(testIb, "I_b", "mm4")
	for _, c := range subframeCases() {
		s, _, _ := c.subframe()
		d := s.Distribute()
		factor := c.factor
		if factor == 0 {
			factor = 0.5
		}
		var steps []trace.Step
		keep := func(st trace.Step) trace.Q { steps = append(steps, st); return st.Q() }
		one, half := trace.Const(1, "k", ""), trace.Const(factor, "k", "")
		var j Joint
		if c.above {
			k := keep(StiffnessStep("k_above", "Stiffness of the column above", one, e, ic, trace.Const(c.hAbove, "L", "mm")))
			j.Above = &k
		}
		if c.below {
			k := keep(StiffnessStep("k_below", "Stiffness of the column below", one, e, ic, trace.Const(c.hBelow, "L", "mm")))
			j.Below = &k
		}
		if c.left != nil {
			l := trace.Const(c.spanLeft, "L", "mm")
			j.Left = &JointBeam{
				K:   keep(StiffnessStep("k_left", "Stiffness of the beam on the left", half, e, ib, l)),
				FEM: keep(FEMStep("fem_left", "Fixed-end moment of the beam on the left", AtEnd, l, c.left)),
			}
		}
		if c.right != nil {
			l := trace.Const(c.spanRight, "L", "mm")
			j.Right = &JointBeam{
				K:   keep(StiffnessStep("k_right", "Stiffness of the beam on the right", half, e, ib, l)),
				FEM: keep(FEMStep("fem_right", "Fixed-end moment of the beam on the right", AtStart, l, c.right)),
			}
		}
		js := j.Steps("j/")
		steps = append(steps, js.Steps...)
		for _, st := range steps {
			if err := trace.Recheck(st, 1e-9); err != nil {
				t.Errorf("%s: %v", c.name, err)
			}
		}
		if js.Steps[0].ID != "j/unbalanced" || !near(js.Steps[0].Value, d.Unbalanced, 1e-12) {
			t.Errorf("%s: unbalanced step %+v, subframe %g", c.name, js.Steps[0], d.Unbalanced)
		}
		for _, col := range []struct {
			traced JointColumn
			plain  SubframeMember
		}{{js.Above, d.Above}, {js.Below, d.Below}} {
			if col.traced.Present != col.plain.Present {
				t.Fatalf("%s: column presence differs", c.name)
			}
			tol := 1e-12 * math.Abs(d.Unbalanced)
			if math.Abs(col.traced.AtJoint.V-col.plain.AtJoint) > tol || math.Abs(col.traced.FarEnd.V-col.plain.CarryOver) > tol {
				t.Errorf("%s: traced column (%g, %g), subframe (%g, %g)", c.name,
					col.traced.AtJoint.V, col.traced.FarEnd.V, col.plain.AtJoint, col.plain.CarryOver)
			}
		}
	}
}

func TestFEMSteps(t *testing.T) {
	w, l, a := trace.Const(27.5, "w", "N/mm"), trace.Const(7800, "L", "mm"), trace.Const(2100, "a", "mm")
	// The closed forms against the exact integral of FixedEnd (Roark's Formulas for Stress
	// and Strain, Table 8.1, and the trapezoid's handbook formula; from memory).
	u := FEMUniformStep("fem_u", "Fixed-end moment under the uniform load", w, l)
	_, want := FixedEnd(l.V, []Piece{Uniform(w.V, l.V)})
	if !near(u.Value, want, 1e-12) {
		t.Errorf("uniform: %g, integral %g", u.Value, want)
	}
	tz := FEMTrapezoidStep("fem_t", "Fixed-end moment under the trapezoid", w, l, a)
	_, want = FixedEnd(l.V, Trapezoid(w.V, l.V, a.V))
	if !near(tz.Value, want, 1e-12) {
		t.Errorf("trapezoid: %g, integral %g", tz.Value, want)
	}
	tri := FEMTrapezoidStep("fem_tri", "Fixed-end moment under the triangle", w, l, trace.Const(l.V/2, "a", "mm"))
	if !near(tri.Value, 5*w.V*l.V*l.V/96, 1e-12) {
		t.Errorf("triangle: %g, want 5wL²/96", tri.Value)
	}
	steps := []trace.Step{u, tz, tri}
	loadSets := [][]Piece{
		{Uniform(w.V, l.V)},
		Trapezoid(w.V, l.V, a.V),
		{{0, l.V, 0, w.V}},
		{{1000, 3000, 5, 20}, {2500, 9000, 8, 8}}, // the second runs past the end
		nil,
	}
	for i, loads := range loadSets {
		ms, me := FixedEnd(l.V, loads)
		s := FEMStep("fem_s", "Fixed-end moment at the start", AtStart, l, loads)
		e := FEMStep("fem_e", "Fixed-end moment at the end", AtEnd, l, loads)
		if !near(s.Value, ms, 1e-12) || !near(e.Value, me, 1e-12) {
			t.Errorf("load set %d: steps (%g, %g), FixedEnd (%g, %g)", i, s.Value, e.Value, ms, me)
		}
		steps = append(steps, s, e)
	}
	for _, st := range steps {
		if err := trace.Recheck(st, 1e-9); err != nil {
			t.Error(err)
		}
	}
	// A joint with no stiffness gives zero factors with a caution, still finite.
	zero := trace.Const(0, "k", "Nmm")
	df := DistributionFactorStep("df", "Distribution factor", zero, zero)
	cm := ColumnMomentStep("m", "Column moment", trace.Const(1e7, "M_unb", "Nmm"), zero, zero)
	for _, st := range []trace.Step{df, cm} {
		if err := trace.Recheck(st, 1e-9); err != nil || st.Value != 0 || len(st.Cautions()) == 0 {
			t.Errorf("zero stiffness: %+v (%v)", st, err)
		}
	}
}
