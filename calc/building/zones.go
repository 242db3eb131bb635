package building

import (
	"slices"

	"colsheet/calc/frame"
	"colsheet/calc/model"
)

// ZoneOn is the share of one zoned area load of the input that a beam carries.
type ZoneOn struct {
	Load int           // index of the zone in the input (model.Building.AreaLoads)
	Slab []frame.Piece // the zone's width that drains to the beam per unit area load, mm, from the beam's start
}

// zoneCategory returns the imposed-load category of a zone: its own, or the floor's where it
// gives none.
func zoneCategory(z model.AreaLoad, f model.Floor) string { return categoryOr(z.Category, f) }

// categoryOr returns the category c, or the floor's where c is empty.
func categoryOr(c string, f model.Floor) string {
	if c != "" {
		return c
	}
	return f.Category
}

// addZones puts the zoned area loads of the level on the beams of each bay they cover, by the
// panel shares of the floor's span direction (zonePieces).
func (lv *Level) addZones(b *model.Building, g *Grid) {
	f := lv.Floor
	for zi, z := range b.AreaLoads {
		if !contains(z.Levels, lv.Name) {
			continue
		}
		x0, x1 := min(z.X[0], z.X[1]), max(z.X[0], z.X[1])
		y0, y1 := min(z.Y[0], z.Y[1]), max(z.Y[0], z.Y[1])
		cat := zoneCategory(z, f)
		for i := 0; i+1 < g.NX; i++ {
			for j := 0; j+1 < g.NY; j++ {
				// The part of the zone in bay (i, j), in the panel's coordinates.
				a0, a1 := max(x0, g.X[i])-g.X[i], min(x1, g.X[i+1])-g.X[i]
				b0, b1 := max(y0, g.Y[j])-g.Y[j], min(y1, g.Y[j+1])-g.Y[j]
				if a1-a0 <= 1e-9 || b1-b0 <= 1e-9 {
					continue
				}
				s, n, w, e := zonePieces(g.X[i+1]-g.X[i], g.Y[j+1]-g.Y[j], a0, a1, b0, b1, f.Spans)
				lv.onEdges(g, i, j, [4][]frame.Piece{s, n, w, e}, func(k int, p frame.Piece) {
					ld := &lv.Loads[k]
					at := slices.IndexFunc(ld.Zones, func(zo ZoneOn) bool { return zo.Load == zi })
					if at < 0 {
						ld.Zones = append(ld.Zones, ZoneOn{Load: zi})
						at = len(ld.Zones) - 1
					}
					ld.Zones[at].Slab = append(ld.Zones[at].Slab, p)
					if z.Gk != 0 {
						ld.G = append(ld.G, p.Scale(z.Gk))
					}
					if z.Qk > 0 {
						ld.Q[cat] = append(ld.Q[cat], p.Scale(z.Qk))
					}
				})
			}
		}
	}
}

// zonePieces returns the pieces, per unit area load, that the part [x0, x1] × [y0, y1] of a
// panel lx × ly (the panel's coordinates, mm) gives its four edge beams, each measured from the
// edge's lower end: one way (model.SpanX, model.SpanY) by the lever rule across the span, the
// reactions of a simply supported strip; two way by the 45° lines from the corners, each point
// of the zone to the edge nearest to it, as actions.PanelLoads shares a whole panel (common
// practice). The pieces of a whole panel carry what PanelLoads gives.
func zonePieces(lx, ly, x0, x1, y0, y1 float64, spans string) (south, north, west, east []frame.Piece) {
	strip := func(lo, hi, w float64) []frame.Piece {
		if !(w > 0) {
			return nil
		}
		return []frame.Piece{{X0: lo, X1: hi, W0: w, W1: w}}
	}
	switch spans {
	case model.SpanY:
		d, c := y1-y0, (y0+y1)/2
		return strip(x0, x1, d*(ly-c)/ly), strip(x0, x1, d*c/ly), nil, nil
	case model.SpanX:
		d, c := x1-x0, (x0+x1)/2
		return nil, nil, strip(y0, y1, d*(lx-c)/lx), strip(y0, y1, d*c/lx)
	case model.SpanTwoWay:
		return nearest(x0, x1, y0, y1, lx, ly), nearest(x0, x1, ly-y1, ly-y0, lx, ly),
			nearest(y0, y1, x0, x1, ly, lx), nearest(y0, y1, lx-x1, lx-x0, ly, lx)
	}
	return nil, nil, nil, nil
}

// nearest returns the pieces, per unit area load, that the rectangle [a0, a1] along an edge of
// length la by [b0, b1] away from it gives that edge of a panel la deep lb across, where the
// points nearest to the edge drain to it: at u along the edge, the depth min(u, la − u, lb/2)
// (the 45° lines from the corners and the panel's mid-line); the width of the rectangle within
// that depth is piecewise linear in u, with breaks where the depth bends or meets b0 or b1.
func nearest(a0, a1, b0, b1, la, lb float64) []frame.Piece {
	w := func(u float64) float64 {
		depth := min(u, la-u, lb/2)
		return max(0, min(b1, depth)-b0)
	}
	xs := []float64{a0, a1}
	for _, x := range []float64{lb / 2, la - lb/2, la / 2, b0, la - b0, b1, la - b1} {
		if x > a0 && x < a1 {
			xs = append(xs, x)
		}
	}
	slices.Sort(xs)
	var out []frame.Piece
	for k := 0; k+1 < len(xs); k++ {
		u0, u1 := xs[k], xs[k+1]
		if u1-u0 <= 1e-9 {
			continue
		}
		w0, w1 := w(u0), w(u1)
		if w0 <= 0 && w1 <= 0 {
			continue
		}
		out = append(out, frame.Piece{X0: u0, X1: u1, W0: w0, W1: w1})
	}
	return out
}
