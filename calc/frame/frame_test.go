package frame

import (
	"math"
	"math/rand"
	"strings"
	"testing"
)

// solved solves the frame and checks joint equilibrium: every residual within
// 1e-9·max|M| (common practice, no source).
func solved(t *testing.T, f Frame) Result {
	t.Helper()
	r, err := f.Solve()
	if err != nil {
		t.Fatal(err)
	}
	checkEquilibrium(t, r)
	return r
}

func checkEquilibrium(t *testing.T, r Result) {
	t.Helper()
	biggest := 0.0
	for _, e := range r.End {
		biggest = math.Max(biggest, math.Max(math.Abs(e[0]), math.Abs(e[1])))
	}
	if r.MaxResidual > 1e-9*biggest {
		t.Errorf("joint residual %g exceeds 1e-9 of the largest moment %g", r.MaxResidual, biggest)
	}
}

func TestSingleSpans(t *testing.T) {
	const w, l, ei = 30.0, 6000.0, 2.5e13 // test inputs
	const tol = 1e-10
	beam := []Member{{I: 0, J: 1, EI: ei, L: l, Loads: []Piece{Uniform(w, l)}}}

	// Roark's Formulas for Stress and Strain, Table 8.1, fixed–fixed beam under a uniform
	// load: end moments wL²/12, hogging (from memory).
	r := solved(t, Frame{Nodes: []Node{{Fixed: true}, {Fixed: true}}, Members: beam})
	if !near(r.End[0][0], -w*l*l/12, tol) || !near(r.End[0][1], w*l*l/12, tol) || r.Theta[0] != 0 || r.Theta[1] != 0 {
		t.Errorf("fixed-fixed: %v, θ %v", r.End, r.Theta)
	}

	// Roark's Formulas for Stress and Strain, Table 8.1, propped cantilever under a uniform
	// load: moment wL²/8 at the fixed end, slope wL³/(48EI) at the prop (from memory).
	r = solved(t, Frame{Nodes: []Node{{Fixed: true}, {}}, Members: beam})
	if !near(r.End[0][0], -w*l*l/8, tol) || !near(r.End[0][1], 0, tol*w*l*l) {
		t.Errorf("propped cantilever: end moments %v, want (%g, 0)", r.End[0], -w*l*l/8)
	}
	if !near(r.Theta[1], -w*l*l*l/(48*ei), tol) {
		t.Errorf("propped cantilever: θ at the prop %g, want %g", r.Theta[1], -w*l*l*l/(48*ei))
	}

	// Roark's Formulas for Stress and Strain, Table 8.1, simply supported beam under a
	// uniform load: end slopes wL³/(24EI), no end moments (from memory).
	r = solved(t, Frame{Nodes: []Node{{}, {}}, Members: beam})
	if !near(r.Theta[0], w*l*l*l/(24*ei), tol) || !near(r.Theta[1], -w*l*l*l/(24*ei), tol) ||
		!near(r.End[0][0], 0, tol*w*l*l) || !near(r.End[0][1], 0, tol*w*l*l) {
		t.Errorf("simple span: θ %v, moments %v", r.Theta, r.End)
	}
}

func TestContinuousBeams(t *testing.T) {
	const w, ei = 22.0, 4e13 // test inputs
	const tol = 1e-10
	two := func(l1, l2 float64) Frame {
		return Frame{Nodes: make([]Node, 3), Members: []Member{
			{I: 0, J: 1, EI: ei, L: l1, Loads: []Piece{Uniform(w, l1)}},
			{I: 1, J: 2, EI: ei, L: l2, Loads: []Piece{Uniform(w, l2)}},
		}}
	}
	// Two equal spans on pin supports, uniform load on both: interior support moment wL²/8
	// (Hibbeler, Structural Analysis, continuous beams; from memory).
	const l = 7500.0
	r := solved(t, two(l, l))
	if !near(r.End[0][1], w*l*l/8, tol) || !near(r.End[1][0], -w*l*l/8, tol) {
		t.Errorf("equal spans: support moments %g, %g; want ±%g", r.End[0][1], r.End[1][0], w*l*l/8)
	}
	// Unequal spans, same uniform load: Clapeyron's three-moment equation gives
	// M_B = w(L1³ + L2³)/(8(L1 + L2)) (Hibbeler, Structural Analysis; from memory).
	l1, l2 := 6600.0, 4800.0
	r = solved(t, two(l1, l2))
	mb := w * (l1*l1*l1 + l2*l2*l2) / (8 * (l1 + l2))
	if !near(r.End[0][1], mb, tol) || !near(r.End[1][0], -mb, tol) {
		t.Errorf("unequal spans: support moment %g, want %g", r.End[0][1], mb)
	}
	for _, n := range []int{0, 2} {
		if math.Abs(r.Residual[n]) > 1e-9*mb {
			t.Errorf("pinned end %d carries %g", n, r.Residual[n])
		}
	}
}

func TestPortal(t *testing.T) {
	// Braced portal A–B–C–D, columns of height h, beam B–C of span l under a uniform load w.
	const w, h, l = 40.0, 4200.0, 8400.0 // test inputs
	const eic, eib = 3.2e13, 9.6e13
	const tol = 1e-10
	k := (eib / l) / (eic / h) // beam-to-column stiffness ratio (I_b·h)/(I_c·L)
	portal := func(fixed bool) Frame {
		return Frame{Nodes: []Node{{Fixed: fixed}, {}, {}, {Fixed: fixed}}, Members: []Member{
			{I: 0, J: 1, EI: eic, L: h},
			{I: 1, J: 2, EI: eib, L: l, Loads: []Piece{Uniform(w, l)}},
			{I: 3, J: 2, EI: eic, L: h},
		}}
	}
	// Fixed bases. By the slope-deflection equations, by hand: at B, 4kc·θB + (−wL²/12 +
	// 2kb·θB) = 0 with θC = −θB by symmetry, so M_BA = wL²/(6(k + 2)) and M_AB = M_BA/2;
	// the same as the fixed-base portal in Kleinlogel's frame formulas (from memory).
	r := solved(t, portal(true))
	mb := w * l * l / (6 * (k + 2))
	want := [][2]float64{{mb / 2, mb}, {-mb, mb}, {-mb / 2, -mb}}
	for m := range want {
		if !near(r.End[m][0], want[m][0], tol) || !near(r.End[m][1], want[m][1], tol) {
			t.Errorf("fixed portal member %d: %v, want %v", m, r.End[m], want[m])
		}
	}
	// Pinned bases, by hand the same way with the column ends free: 3kc·θB + (−wL²/12 +
	// 2kb·θB) = 0, so M_BA = wL²/(4(2k + 3)); Kleinlogel's hinged-base portal (from memory).
	r = solved(t, portal(false))
	mb = w * l * l / (4 * (2*k + 3))
	want = [][2]float64{{0, mb}, {-mb, mb}, {0, -mb}}
	for m := range want {
		if !near(r.End[m][0], want[m][0], tol) || !near(r.End[m][1], want[m][1], tol) {
			t.Errorf("pinned portal member %d: %v, want %v", m, r.End[m], want[m])
		}
	}
}

// frameLine builds a braced frame line of the storeys and bays: node (level, line) is
// level·(bays+1) + line, level 0 the fixed bases; columns of 350×450 mm and beams of
// 275×500 mm in C32/40 (E = 33 GPa), storeys 3.3 m, bays 6.6 m, beams under a uniform 35 N/mm
// and some under a trapezoid so the load is not symmetric (test inputs).
func frameLine(storeys, bays int) Frame {
	const e = 33000.0
	eic := e * 350 * 450 * 450 * 450 / 12
	eib := e * 275 * 500 * 500 * 500 / 12
	const h, l = 3300.0, 6600.0
	var f Frame
	for level := 0; level <= storeys; level++ {
		for range bays + 1 {
			f.Nodes = append(f.Nodes, Node{Fixed: level == 0})
		}
	}
	at := func(level, line int) int { return level*(bays+1) + line }
	for level := 1; level <= storeys; level++ {
		for line := 0; line <= bays; line++ {
			f.Members = append(f.Members, Member{I: at(level-1, line), J: at(level, line), EI: eic, L: h})
		}
		for bay := 0; bay < bays; bay++ {
			loads := []Piece{Uniform(35, l)}
			if (level+bay)%3 == 0 {
				loads = append(loads, Trapezoid(12, l, 1800)...)
			}
			f.Members = append(f.Members, Member{I: at(level, bay), J: at(level, bay+1), EI: eib, L: l, Loads: loads})
		}
	}
	return f
}

func TestNumberingAndDistribution(t *testing.T) {
	f := frameLine(4, 3)
	r := solved(t, f)

	// The same frame with its nodes numbered at random solves the same (common practice,
	// no source): the reverse Cuthill–McKee renumbering changes only the band.
	rng := rand.New(rand.NewSource(1))
	perm := rng.Perm(len(f.Nodes))
	g := Frame{Nodes: make([]Node, len(f.Nodes))}
	for i, nd := range f.Nodes {
		g.Nodes[perm[i]] = nd
	}
	for _, m := range f.Members {
		m.I, m.J = perm[m.I], perm[m.J]
		g.Members = append(g.Members, m)
	}
	rg := solved(t, g)
	scale := 0.0
	for m := range r.End {
		scale = math.Max(scale, math.Abs(r.End[m][0]))
	}
	for m := range r.End {
		for s := range 2 {
			if math.Abs(r.End[m][s]-rg.End[m][s]) > 1e-9*scale {
				t.Fatalf("renumbered member %d end %d: %g, %g", m, s, rg.End[m][s], r.End[m][s])
			}
		}
	}

	// Hardy Cross moment distribution converges to the stiffness solution (both solve the
	// slope-deflection equations; common practice, no source): agreement to 1e-6 relative.
	md, err := MomentDistribution(f, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	checkEquilibrium(t, md)
	for m := range r.End {
		for s := range 2 {
			if math.Abs(md.End[m][s]-r.End[m][s]) > 1e-6*scale {
				t.Fatalf("member %d end %d: distribution %g, stiffness %g", m, s, md.End[m][s], r.End[m][s])
			}
		}
	}
	for n := range r.Theta {
		if !near(md.Theta[n], r.Theta[n], 1e-6) && math.Abs(md.Theta[n]-r.Theta[n]) > 1e-12 {
			t.Errorf("node %d: θ %g by distribution, %g by stiffness", n, md.Theta[n], r.Theta[n])
		}
	}
}

func TestErrors(t *testing.T) {
	beam := Member{I: 0, J: 1, EI: 1e13, L: 5000, Loads: []Piece{Uniform(10, 5000)}}
	cases := []struct {
		name string
		f    Frame
		want string
	}{
		{"no nodes", Frame{}, "no nodes"},
		{"free node without members", Frame{Nodes: []Node{{Fixed: true}, {}, {}}, Members: []Member{beam}}, "node 2"},
		{"same node twice", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 1, J: 1, EI: 1, L: 1}}}, "member 0"},
		{"node out of range", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 2, EI: 1, L: 1}}}, "member 0"},
		{"zero EI", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, L: 1}}}, "EI"},
		{"NaN length", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, EI: 1, L: math.NaN()}}}, "L must"},
		{"negative factor", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, EI: 1, L: 1, StiffnessFactor: -1}}}, "factor"},
		{"load past the end", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, EI: 1, L: 10, Loads: []Piece{{0, 11, 1, 1}}}}}, "load 0"},
		{"NaN load", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, EI: 1, L: 10, Loads: []Piece{{0, 10, math.NaN(), 1}}}}}, "not finite"},
		{"infinite FEM", Frame{Nodes: make([]Node, 2), Members: []Member{{I: 0, J: 1, EI: 1, L: 10, FEM: [2]float64{math.Inf(1), 0}}}}, "not finite"},
	}
	for _, tc := range cases {
		if _, err := tc.f.Solve(); err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: Solve error %v, want one mentioning %q", tc.name, err, tc.want)
		}
		if _, err := MomentDistribution(tc.f, 1e-9); err == nil {
			t.Errorf("%s: MomentDistribution gave no error", tc.name)
		}
	}
	if _, err := MomentDistribution(Frame{Nodes: make([]Node, 2), Members: []Member{beam}}, 0); err == nil {
		t.Error("zero tolerance accepted")
	}
}

func TestStiffnessFactorAndAddedFEM(t *testing.T) {
	// Two equal spans with fixed far ends, the load on the first span only and the second at
	// half stiffness: one distribution gives the joint moment FEM·(1 − k1/(k1 + k2)) with
	// k2 = k1/2, carried over by half to the far end (common practice, no source).
	const w, l, ei = 18.0, 6000.0, 3e13 // test inputs
	f := Frame{Nodes: []Node{{Fixed: true}, {}, {Fixed: true}}, Members: []Member{
		{I: 0, J: 1, EI: ei, L: l, Loads: []Piece{Uniform(w, l)}},
		{I: 1, J: 2, EI: ei, L: l, StiffnessFactor: 0.5},
	}}
	r := solved(t, f)
	fem := w * l * l / 12
	want := fem * (1 - 1/1.5)
	if !near(r.End[0][1], want, 1e-12) || !near(r.End[1][0], -want, 1e-12) || !near(r.End[1][1], -want/2, 1e-12) {
		t.Errorf("half-stiffness span: %v, want joint moment %g", r.End, want)
	}
	// The same load given as added fixed-end moments gives the same answer.
	f.Members[0].Loads, f.Members[0].FEM = nil, [2]float64{-fem, fem}
	r2 := solved(t, f)
	for m := range r.End {
		if !near(r2.End[m][0], r.End[m][0], 1e-12) || !near(r2.End[m][1], r.End[m][1], 1e-12) {
			t.Errorf("added FEM: member %d %v, loads %v", m, r2.End[m], r.End[m])
		}
	}
}

func BenchmarkSolveFrameLine(b *testing.B) {
	f := frameLine(40, 10) // 440 free rotations
	for b.Loop() {
		if _, err := f.Solve(); err != nil {
			b.Fatal(err)
		}
	}
}

func TestLargeFrameLine(t *testing.T) {
	// 40 storeys × 10 bays: joint equilibrium to 1e-9 of the largest moment, and the
	// stiffness solution equal to moment distribution to 1e-6 (common practice, no source).
	f := frameLine(40, 10)
	r := solved(t, f)
	md, err := MomentDistribution(f, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	scale := 0.0
	for _, e := range r.End {
		scale = math.Max(scale, math.Max(math.Abs(e[0]), math.Abs(e[1])))
	}
	for m := range r.End {
		for s := range 2 {
			if math.Abs(md.End[m][s]-r.End[m][s]) > 1e-6*scale {
				t.Fatalf("member %d end %d: distribution %g, stiffness %g", m, s, md.End[m][s], r.End[m][s])
			}
		}
	}
}

func BenchmarkMomentDistributionFrameLine(b *testing.B) {
	f := frameLine(40, 10)
	for b.Loop() {
		if _, err := MomentDistribution(f, 1e-9); err != nil {
			b.Fatal(err)
		}
	}
}
