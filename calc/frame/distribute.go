package frame

import (
	"errors"
	"fmt"
	"math"
)

// maxSweeps bounds the moment distribution; a frame that needs more is reported as not converged.
const maxSweeps = 1_000_000

// MomentDistribution solves the braced frame by Hardy Cross moment distribution: starting
// from the fixed-end moments it releases each free node in turn, distributes the unbalanced
// moment to the member ends there in proportion to their stiffness 4·k·EI/L, carries half of
// each distributed moment over to the far end, and sweeps until no free node is out of
// balance by more than tol times the largest fixed-end moment. The rotations are the sum of
// the releases (each −unbalanced/Σ4k). It is the Gauss–Seidel iteration of the stiffness
// equations that Solve factorises, so both agree to the tolerance.
func MomentDistribution(f Frame, tol float64) (Result, error) {
	if !(tol > 0) || math.IsInf(tol, 0) {
		return Result{}, errors.New("moment distribution: tolerance must be positive and finite")
	}
	s, err := f.prepare()
	if err != nil {
		return Result{}, err
	}
	at := make([][]end, len(s.nodes)) // the member ends at each free node
	scale := 0.0
	for m, mb := range f.Members {
		for side, nd := range [2]int{mb.I, mb.J} {
			if e := s.free[nd]; e >= 0 {
				at[e] = append(at[e], end{member: m, side: side})
			}
			scale = math.Max(scale, math.Abs(s.fem[m][side]))
		}
	}
	theta := make([]float64, len(f.Nodes))
	moment := make([][2]float64, len(f.Members))
	copy(moment, s.fem)
	limit := tol * scale
	for sweep := 0; ; sweep++ {
		worst := 0.0
		for e, ends := range at {
			unbalanced := 0.0
			for _, c := range ends {
				unbalanced += moment[c.member][c.side]
			}
			worst = math.Max(worst, math.Abs(unbalanced))
			release := -unbalanced / s.sum[e]
			theta[s.nodes[e]] += release
			for _, c := range ends {
				moment[c.member][c.side] += 4 * s.k[c.member] * release
				moment[c.member][1-c.side] += 2 * s.k[c.member] * release
			}
		}
		if worst <= limit {
			break
		}
		if sweep == maxSweeps {
			return Result{}, fmt.Errorf("moment distribution did not converge in %d sweeps", maxSweeps)
		}
	}
	return s.result(f.Members, theta), nil
}

// end is one end of a member: side 0 at node I, 1 at node J.
type end struct{ member, side int }
