package section

import (
	"errors"
	"math"
)

// NMPoint is one point of the N–M interaction diagram about an axis.
type NMPoint struct {
	N    float64 // axial force, compression positive, N
	M    float64 // moment of resistance with the positive face compressed (State.M), N·mm
	MNeg float64 // moment of resistance with the negative face compressed, N·mm
}

// CurveNM returns points (at least 2) of the N–M interaction diagram about axis, at axial
// forces evenly spaced from the tension resistance −As·fyd to NRd,max, with the moments of
// resistance for either face compressed (EN 1992-1-1:2004 6.1(5), Fig. 6.1). The first
// point is the limit of full tension yield, M = −fyd·Σ As·coordinate; the last is uniform
// strain, M = 0. It returns nil for an invalid section or axis; points whose solution fails
// are left out, so every value is finite.
func (s *Section) CurveNM(axis Axis, points int) []NMPoint {
	if (axis != AxisY && axis != AxisZ) || s.Validate() != nil {
		return nil
	}
	if points < 2 {
		points = 2
	}
	nmin, nmax := s.NRdMin(), s.NRdMax()
	mt := 0.0 // every bar yielding in tension, no concrete
	for _, b := range s.Bars {
		mt -= s.Fyd * b.Area * coord(axis, b)
	}
	out := make([]NMPoint, 0, points)
	out = append(out, NMPoint{N: nmin, M: mt, MNeg: mt})
	for i := 1; i < points-1; i++ {
		n := nmin + (nmax-nmin)*float64(i)/float64(points-1)
		mp, err1 := s.Resistance(axis, Positive, n)
		mn, err2 := s.Resistance(axis, Negative, n)
		if err1 != nil || err2 != nil || !finite(mp) || !finite(mn) {
			continue
		}
		out = append(out, NMPoint{N: n, M: mp, MNeg: mn})
	}
	return append(out, NMPoint{N: nmax})
}

// MyMzPoint is one point of the My–Mz interaction contour at a given axial force.
type MyMzPoint struct {
	Theta float64 // direction of the moment vector atan2(Mz, My), rad, in (−π, π]
	Angle float64 // neutral-axis angle of the plane, rad (as BiaxialState.Angle)
	My    float64 // moment Σ F·z, N·mm
	Mz    float64 // moment Σ F·y, N·mm
	MRd   float64 // √(My² + Mz²), N·mm
}

// ContourMyMz returns the My–Mz contour of the section at axial force NEd: for points (at
// least 4) neutral-axis angles β = 2πk/points round the full circle, from β = 0, the strain
// plane at that angle whose axial force is NEd (its depth by Brent's method, as Biaxial) and
// its resisting moments, which lie on the contour; each point's θ is the direction of its
// moment. On the axes (β a multiple of π/2) these are the uniaxial resistances. It returns
// nil when the section is invalid or NEd lies outside (−As·fyd, NRd,max]; angles whose
// solution fails are left out, so every value is finite.
func (s *Section) ContourMyMz(NEd float64, points int) []MyMzPoint {
	if s.Validate() != nil || !finite(NEd) || !(NEd > s.NRdMin()) || NEd > s.NRdMax()+1e-9*math.Max(s.NRdMax(), 1) {
		return nil
	}
	if points < 4 {
		points = 4
	}
	nmax := s.NRdMax()
	b := &biaxSolver{s: s, NEd: NEd, nmin: s.NRdMin(), ftol: biaxNTol * math.Max(nmax, 1),
		mtol: 1e-13 * math.Max(nmax, 1) * (s.B + s.H)}
	out := make([]MyMzPoint, 0, points)
	for k := 0; k < points; k++ {
		beta := normAngle(2 * math.Pi * float64(k) / float64(points))
		if points%4 == 0 && k%(points/4) == 0 {
			beta = normAngle(float64(k/(points/4)) * math.Pi / 2) // exactly on an axis
		}
		var st BiaxialState
		if NEd >= nmax-1e-9*math.Max(nmax, 1) {
			st = s.uniform(beta)
		} else {
			p, _, err := b.depth(beta)
			switch {
			case errors.Is(err, errNoMoment):
				st = s.uniform(beta)
			case err != nil:
				continue
			default:
				g := s.incline(beta, b.buf[:])
				st = g.state(beta, p)
			}
		}
		out = append(out, MyMzPoint{Theta: st.Theta, Angle: st.Angle, My: st.My, Mz: st.Mz, MRd: st.MRd})
	}
	return out
}
