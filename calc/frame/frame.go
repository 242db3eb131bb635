package frame

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// Node is a joint of a braced plane frame; its only freedom is a rotation.
type Node struct {
	// Fixed restrains the rotation (a fixed base, or a far end held fixed). A node that is
	// not fixed rotates freely; one with a single member is a pin (its end moment is zero).
	Fixed bool
}

// Member is a prismatic member of a braced plane frame running from node I to node J.
type Member struct {
	I, J  int
	EI    float64 // flexural stiffness, N·mm²
	L     float64 // length, mm
	Loads []Piece // transverse line loads, positions measured from node I
	// FEM holds fixed-end moments added to those of Loads (at I, at J; clockwise positive),
	// for loads that are not line loads, such as point loads from secondary beams.
	FEM [2]float64
	// StiffnessFactor scales the member's stiffness terms (0.5 for "half stiffness");
	// zero means 1.
	StiffnessFactor float64
}

// Frame is a braced (no-sway) plane frame of nodes and members: joints do not translate
// and axial deformation is ignored, so each free node has one unknown rotation.
type Frame struct {
	Nodes   []Node
	Members []Member
}

// Result is the solution of a braced frame.
type Result struct {
	Theta []float64    // rotation of each node, rad, clockwise positive; zero at fixed nodes
	End   [][2]float64 // per member: the end moments at I and at J, N·mm, clockwise positive
	// Residual is, per node, the sum of the member end moments at a free node (zero in
	// equilibrium, so a measure of the solution's error); zero at fixed nodes.
	Residual    []float64
	MaxResidual float64 // largest |Residual|, N·mm
}

// system is a frame checked and reduced to member stiffnesses, fixed-end moments and the
// numbering of its free nodes.
type system struct {
	k     []float64    // factor·EI/L of each member, N·mm
	fem   [][2]float64 // fixed-end moments of each member
	free  []int        // equation number of each node, −1 when fixed
	nodes []int        // node of each equation
	sum   []float64    // Σ 4k at each equation
}

// prepare checks the frame and reduces it to a system.
func (f Frame) prepare() (system, error) {
	n := len(f.Nodes)
	if n == 0 {
		return system{}, errors.New("frame has no nodes")
	}
	s := system{k: make([]float64, len(f.Members)), fem: make([][2]float64, len(f.Members)), free: make([]int, n)}
	for i, nd := range f.Nodes {
		s.free[i] = -1
		if !nd.Fixed {
			s.free[i] = len(s.nodes)
			s.nodes = append(s.nodes, i)
		}
	}
	s.sum = make([]float64, len(s.nodes))
	for m, mb := range f.Members {
		if mb.I < 0 || mb.I >= n || mb.J < 0 || mb.J >= n || mb.I == mb.J {
			return system{}, fmt.Errorf("member %d: ends %d and %d must be two different nodes of %d", m, mb.I, mb.J, n)
		}
		if !(mb.EI > 0) || math.IsInf(mb.EI, 0) {
			return system{}, fmt.Errorf("member %d: EI must be positive and finite", m)
		}
		if !(mb.L > 0) || math.IsInf(mb.L, 0) {
			return system{}, fmt.Errorf("member %d: L must be positive and finite", m)
		}
		factor := mb.StiffnessFactor
		if factor == 0 {
			factor = 1
		}
		if !(factor > 0) || math.IsInf(factor, 0) {
			return system{}, fmt.Errorf("member %d: stiffness factor must be positive and finite", m)
		}
		slack := 1e-9 * mb.L
		for p, pc := range mb.Loads {
			if !finite(pc.X0, pc.X1, pc.W0, pc.W1) {
				return system{}, fmt.Errorf("member %d: load %d is not finite", m, p)
			}
			if pc.X0 < -slack || pc.X1 > mb.L+slack || !(pc.X1 > pc.X0) {
				return system{}, fmt.Errorf("member %d: load %d must run forwards within the member's length", m, p)
			}
		}
		if !finite(mb.FEM[0], mb.FEM[1]) {
			return system{}, fmt.Errorf("member %d: added fixed-end moments are not finite", m)
		}
		a, b := FixedEnd(mb.L, mb.Loads)
		s.k[m] = factor * mb.EI / mb.L
		s.fem[m] = [2]float64{a + mb.FEM[0], b + mb.FEM[1]}
		for _, nd := range [2]int{mb.I, mb.J} {
			if e := s.free[nd]; e >= 0 {
				s.sum[e] += 4 * s.k[m]
			}
		}
	}
	for e, v := range s.sum {
		if !(v > 0) || math.IsInf(v, 0) {
			return system{}, fmt.Errorf("node %d: a free node needs at least one member to restrain its rotation", s.nodes[e])
		}
	}
	return s, nil
}

// Solve solves the braced frame by the direct stiffness method on the slope-deflection
// equations M_ij = FEM_ij + k·(4θi + 2θj)·EI/L: it assembles the joint stiffness matrix
// and load vector (K·θ = −ΣFEM at each free node), solves by a banded Cholesky
// factorisation after Jacobi scaling (the free nodes renumbered by reverse Cuthill–McKee
// when that narrows the band) and recovers the member end moments and the joint equilibrium residuals.
func (f Frame) Solve() (Result, error) {
	s, err := f.prepare()
	if err != nil {
		return Result{}, err
	}
	theta := make([]float64, len(f.Nodes))
	if n := len(s.nodes); n > 0 {
		order := s.numbering(f.Members)
		bw := bandwidth(f.Members, s.free, order)
		data := make([]float64, n*(bw+1))
		rhs := make([]float64, n)
		for m, mb := range f.Members {
			p, q := s.free[mb.I], s.free[mb.J]
			if p >= 0 {
				p = order[p]
				data[p*(bw+1)] += 4 * s.k[m]
				rhs[p] -= s.fem[m][0]
			}
			if q >= 0 {
				q = order[q]
				data[q*(bw+1)] += 4 * s.k[m]
				rhs[q] -= s.fem[m][1]
			}
			if p >= 0 && q >= 0 {
				lo, hi := min(p, q), max(p, q)
				data[lo*(bw+1)+hi-lo] += 2 * s.k[m]
			}
		}
		// Jacobi scaling D^-½·K·D^-½ gives a unit diagonal; the matrix is then strictly
		// diagonally dominant (each row's off-diagonal terms 2k sum to at most half its 4Σk),
		// so well conditioned whatever the members' stiffnesses.
		scale := make([]float64, n)
		for p := range scale {
			scale[p] = 1 / math.Sqrt(data[p*(bw+1)])
		}
		for p := range n {
			for d := 0; d <= bw && p+d < n; d++ {
				data[p*(bw+1)+d] *= scale[p] * scale[p+d]
			}
			rhs[p] *= scale[p]
		}
		var ch mat.BandCholesky
		if !ch.Factorize(mat.NewSymBandDense(n, bw, data)) {
			return Result{}, errors.New("joint stiffness matrix is not positive definite")
		}
		if c := ch.Cond(); !(c < 1e14) {
			return Result{}, fmt.Errorf("joint stiffness matrix is singular or nearly so (condition number %.3g)", c)
		}
		var x mat.VecDense
		if err := ch.SolveVecTo(&x, mat.NewVecDense(n, rhs)); err != nil {
			return Result{}, fmt.Errorf("joint rotations: %v", err)
		}
		for e, nd := range s.nodes {
			theta[nd] = x.AtVec(order[e]) * scale[order[e]]
		}
	}
	r := s.result(f.Members, theta)
	for _, v := range r.Theta {
		if !finite(v) {
			return Result{}, errors.New("joint rotations are not finite")
		}
	}
	return r, nil
}

// result recovers the member end moments from the slope-deflection equations and sums them
// at the free nodes.
func (s system) result(members []Member, theta []float64) Result {
	r := Result{Theta: theta, End: make([][2]float64, len(members)), Residual: make([]float64, len(theta))}
	for m, mb := range members {
		ti, tj := theta[mb.I], theta[mb.J]
		r.End[m] = [2]float64{
			s.fem[m][0] + s.k[m]*(4*ti+2*tj),
			s.fem[m][1] + s.k[m]*(2*ti+4*tj),
		}
		if s.free[mb.I] >= 0 {
			r.Residual[mb.I] += r.End[m][0]
		}
		if s.free[mb.J] >= 0 {
			r.Residual[mb.J] += r.End[m][1]
		}
	}
	for _, v := range r.Residual {
		r.MaxResidual = math.Max(r.MaxResidual, math.Abs(v))
	}
	return r
}

// numbering returns the position of each equation in the matrix: the given order, or the
// reverse Cuthill–McKee order when its band is narrower.
func (s system) numbering(members []Member) []int {
	n := len(s.nodes)
	given := make([]int, n)
	for e := range given {
		given[e] = e
	}
	adj := make([][]int, n)
	for _, mb := range members {
		p, q := s.free[mb.I], s.free[mb.J]
		if p >= 0 && q >= 0 {
			adj[p] = append(adj[p], q)
			adj[q] = append(adj[q], p)
		}
	}
	rcm := reverseCuthillMcKee(adj)
	if bandwidth(members, s.free, rcm) < bandwidth(members, s.free, given) {
		return rcm
	}
	return given
}

// bandwidth returns the half-bandwidth of the joint stiffness matrix under the numbering.
func bandwidth(members []Member, free, order []int) int {
	bw := 0
	for _, mb := range members {
		p, q := free[mb.I], free[mb.J]
		if p >= 0 && q >= 0 {
			d := order[p] - order[q]
			bw = max(bw, d, -d)
		}
	}
	return bw
}

// reverseCuthillMcKee returns the position of each vertex of the graph in the reverse
// Cuthill–McKee ordering (breadth-first from a vertex of least degree in each component,
// neighbours taken in order of degree, the whole order reversed), which narrows the band.
func reverseCuthillMcKee(adj [][]int) []int {
	n := len(adj)
	seen := make([]bool, n)
	seq := make([]int, 0, n)
	for len(seq) < n {
		start := -1
		for v := range n {
			if !seen[v] && (start < 0 || len(adj[v]) < len(adj[start])) {
				start = v
			}
		}
		seen[start] = true
		seq = append(seq, start)
		for head := len(seq) - 1; head < len(seq); head++ {
			from := len(seq)
			for _, w := range adj[seq[head]] {
				if !seen[w] {
					seen[w] = true
					seq = append(seq, w)
				}
			}
			next := seq[from:]
			for i := 1; i < len(next); i++ { // insertion sort by degree, stable
				for j := i; j > 0 && len(adj[next[j]]) < len(adj[next[j-1]]); j-- {
					next[j], next[j-1] = next[j-1], next[j]
				}
			}
		}
	}
	pos := make([]int, n)
	for i, v := range seq {
		pos[v] = n - 1 - i
	}
	return pos
}

func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}
