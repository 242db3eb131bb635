package section

import "math"

// Scaled returns a copy of the circle whose bar areas are scaled to total As (mm²), keeping
// their proportions.
func (c *Circle) Scaled(As float64) Circle {
	out := *c
	out.Bars = scaledBars(c.Bars, As)
	return out
}

// AreaWhere returns the smallest total steel area As in [0, AsMax] (mm²), shared among the bars
// in proportion to their areas, at which ratio(circle with As) ≤ 1, as Section.AreaWhere (the same
// regula falsi on the same scaling of the bars).
func (c *Circle) AreaWhere(AsMax float64, ratio func(*Circle) (float64, error)) (float64, error) {
	carrier := Section{Bars: c.Bars}
	trial := *c
	return carrier.AreaWhere(AsMax, func(t *Section) (float64, error) {
		trial.Bars = t.Bars
		return ratio(&trial)
	})
}

// ContourMyMz returns the My–Mz contour of the circle at axial force NEd: for points (at least
// 4) directions θ = 2πk/points round the circle, the plane whose neutral axis is perpendicular
// to θ and whose axial force is NEd (Circle.MRdAt), with its resisting moments; each point's
// Theta is the direction of its moment and Angle the direction θ of the plane. It returns nil
// when NEd lies outside (−As·fyd, NRd,max]; directions whose solution fails are left out.
func (c *Circle) ContourMyMz(NEd float64, points int) []MyMzPoint {
	if c.Validate() != nil || !finite(NEd) || !(NEd > c.NRdMin()) || NEd > c.NRdMax()+1e-9*math.Max(c.NRdMax(), 1) {
		return nil
	}
	if points < 4 {
		points = 4
	}
	out := make([]MyMzPoint, 0, points)
	for k := 0; k < points; k++ {
		theta := normAngle(2 * math.Pi * float64(k) / float64(points))
		if points%4 == 0 && k%(points/4) == 0 {
			theta = normAngle(float64(k/(points/4)) * math.Pi / 2) // exactly on an axis
		}
		st, err := c.MRdAt(theta, math.Min(NEd, c.NRdMax()))
		if err != nil || !finite(st.My) || !finite(st.Mz) {
			continue
		}
		out = append(out, MyMzPoint{Theta: st.Direction, Angle: theta, My: st.My, Mz: st.Mz, MRd: st.MRd})
	}
	return out
}
