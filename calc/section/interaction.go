package section

import "math"

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

// ContourMyMz returns the My–Mz contour of the section at axial force NEd: the exact
// biaxial resistance (Biaxial) in points (at least 4) directions θ = 2πk/points round the
// full circle, from θ = 0. It returns nil when the section is invalid or NEd lies outside
// (−As·fyd, NRd,max]; directions whose solution fails are left out, so every value is
// finite.
func (s *Section) ContourMyMz(NEd float64, points int) []MyMzPoint {
	if s.Validate() != nil || !finite(NEd) || !(NEd > s.NRdMin()) || NEd > s.NRdMax()+1e-9*math.Max(s.NRdMax(), 1) {
		return nil
	}
	if points < 4 {
		points = 4
	}
	out := make([]MyMzPoint, 0, points)
	beta := 0.0
	for k := 0; k < points; k++ {
		theta := 2 * math.Pi * float64(k) / float64(points)
		// Start from the last angle turned by the step in θ: the neighbouring plane.
		guess := theta
		if k > 0 {
			guess = beta + 2*math.Pi/float64(points)
		}
		st, err := s.biaxial(NEd, theta, guess)
		if err != nil {
			continue
		}
		beta = st.Angle
		out = append(out, MyMzPoint{Theta: st.Theta, Angle: st.Angle, My: st.My, Mz: st.Mz, MRd: st.MRd})
	}
	return out
}
