package building

import (
	"math"
	"strings"

	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// onLine is how close to a grid line, mm, a point load is taken to stand on it.
const onLine = 1e-3

// PointOn is the share of one point load of the input that a beam carries: the load's share K
// of the lever rule across the panel, (Span − Dist)/Span, or K alone where Span is zero (a
// point on the beam's grid line), at X along the beam.
type PointOn struct {
	Load       int     // index of the point load in the input (model.Building.PointLoads)
	X          float64 // position along the beam from its start, mm
	K          float64 // 1, or 1/2 where the load is split between two directions
	Span, Dist float64 // the span across which the lever rule splits the load and the point's distance from this beam, mm; Span 0: no split
	G, Q       float64 // the characteristic loads on the beam, N
	Cat        string  // the imposed-load category of Q
}

// share returns the fraction of the point load that the beam takes.
func (p PointOn) share() float64 {
	if p.Span > 0 {
		return p.K * (p.Span - p.Dist) / p.Span
	}
	return p.K
}

// pointCategory returns the imposed-load category of a point load: its own, or the floor's where
// it gives none.
func pointCategory(pl model.PointLoad, f model.Floor) string { return categoryOr(pl.Category, f) }

// addPoints puts the point loads of the level on the beams of the bay where they stand (common
// practice): a point on a grid line on that line's beam (half on each line's beam at a grid
// point); inside a bay of a one-way slab on the two beams it spans onto, split by the lever rule
// across the span; inside a bay of a two-way slab half each way, each half split so onto the two
// beams of that direction, which with the lever rule along the beams gives each corner column
// the bilinear share (1 − ξ)(1 − η), ξ(1 − η), … of the load.
func (lv *Level) addPoints(b *model.Building, g *Grid) {
	f := lv.Floor
	for pi, pl := range b.PointLoads {
		if !contains(pl.Levels, lv.Name) {
			continue
		}
		cat := pointCategory(pl, f)
		put := func(d Dir, line int, at, k, span, dist float64) {
			bk := beamAt(lv.Beams, d, line, at, at)
			if bk < 0 {
				return
			}
			p := PointOn{Load: pi, X: at - lv.Beams[bk].Start, K: k, Span: span, Dist: dist, Cat: cat}
			p.G, p.Q = pl.Gk*p.share(), pl.Qk*p.share()
			lv.Loads[bk].Points = append(lv.Loads[bk].Points, p)
		}
		i, onX := g.cell(g.X, pl.X)
		j, onY := g.cell(g.Y, pl.Y)
		if i < 0 || j < 0 {
			continue // outside the grid: refused by checkLoads
		}
		switch {
		case onX && onY:
			put(DirX, j, pl.X, 0.5, 0, 0)
			put(DirY, i, pl.Y, 0.5, 0, 0)
		case onX:
			put(DirY, i, pl.Y, 1, 0, 0)
		case onY:
			put(DirX, j, pl.X, 1, 0, 0)
		default:
			lx, ly := g.X[i+1]-g.X[i], g.Y[j+1]-g.Y[j]
			k := 1.0
			if f.Spans == model.SpanTwoWay {
				k = 0.5
			}
			if f.Spans == model.SpanY || f.Spans == model.SpanTwoWay {
				put(DirX, j, pl.X, k, ly, pl.Y-g.Y[j])
				put(DirX, j+1, pl.X, k, ly, g.Y[j+1]-pl.Y)
			}
			if f.Spans == model.SpanX || f.Spans == model.SpanTwoWay {
				put(DirY, i, pl.Y, k, lx, pl.X-g.X[i])
				put(DirY, i+1, pl.Y, k, lx, g.X[i+1]-pl.X)
			}
		}
	}
}

// cell returns, for a coordinate v along lines at xs, the index of the line it lies on (within
// onLine, on true) or of the line that starts the bay it lies in; -1 outside the lines.
func (g *Grid) cell(xs []float64, v float64) (int, bool) {
	for k, x := range xs {
		if math.Abs(v-x) <= onLine {
			return k, true
		}
	}
	for k := 0; k+1 < len(xs); k++ {
		if v > xs[k] && v < xs[k+1] {
			return k, false
		}
	}
	return -1, false
}

// PointShare returns the part of a point load P that a beam takes, P·K·(l − d)/l by the lever
// rule across the span l at the distance d from the beam, or P·K on the beam's own line (K = 1,
// or 1/2 where the load is split between the two directions); common practice.
func PointShare(id, title string, p trace.Q, on PointOn) trace.Step {
	const clause = "common practice (lever rule)"
	k := trace.Const(on.K, "K", "")
	if on.Span > 0 {
		l := trace.Const(on.Span, "l", "mm")
		d := trace.Const(on.Dist, "d", "mm")
		if on.K == 1 {
			return trace.Formula(id, title, clause, "P", "N", p.V*(l.V-d.V)/l.V, "P * (l - d) / l", trace.A("P", p), trace.A("l", l), trace.A("d", d)).
				Note("The slab spans l across the bay; the point stands d from this beam.")
		}
		return trace.Formula(id, title, clause, "P", "N", p.V*k.V*(l.V-d.V)/l.V, "P * K * (l - d) / l", trace.A("P", p), trace.A("K", k), trace.A("l", l), trace.A("d", d)).
			Note("Two-way slab: half the load each way (K), each half split by the lever rule across the span l; the point stands d from this beam.")
	}
	if on.K == 1 {
		return trace.Formula(id, title, clause, "P", "N", p.V, "P", trace.A("P", p)).Note("The point stands on the beam's grid line.")
	}
	return trace.Formula(id, title, clause, "P", "N", p.V*k.V, "P * K", trace.A("P", p), trace.A("K", k)).
		Note("The point stands on a grid point: half the load (K) to the beam of each line.")
}

// Point is a concentrated load on a beam: P (N, downward) at X (mm from the beam's start).
type Point struct{ X, P float64 }

// Concentrated returns the characteristic concentrated loads on the beam, permanent and imposed
// by category, which the pieces G and Q do not hold: the point loads of the input and the
// columns that stand on it (transfers, once Derive has filled in their loads).
func (ld BeamLoad) Concentrated() (g []Point, q map[string][]Point) {
	g, q = ld.pointLoads()
	if q == nil {
		q = map[string][]Point{}
	}
	for _, t := range ld.Transfers {
		if t.G != 0 {
			g = append(g, Point{t.X, t.G})
		}
		for _, c := range keys(t.Q) {
			if t.Q[c] != 0 {
				q[c] = append(q[c], Point{t.X, t.Q[c]})
			}
		}
	}
	return g, q
}

// PointFixedEnd returns the fixed-end moments of a member of length l under concentrated loads,
// clockwise positive on the member ends: −Σ P·a·b²/l² at the start and +Σ P·a²·b/l² at the end,
// a and b the distances of each load from the start and the end (handbook formula).
func PointFixedEnd(l float64, ps []Point) (mStart, mEnd float64) {
	if !(l > 0) {
		return 0, 0
	}
	for _, p := range ps {
		a := min(max(p.X, 0), l)
		b := l - a
		mStart -= p.P * a * b * b / (l * l)
		mEnd += p.P * a * a * b / (l * l)
	}
	return mStart, mEnd
}

// PointFEMStep records the fixed-end moment at one end of a member of length l under
// concentrated loads, clockwise positive: −Σ P·a·(L − a)²/L² at the start, +Σ P·a²·(L − a)/L² at
// the end (handbook formula), for the column-moment code to add to that of the line loads.
func PointFEMStep(id, title string, side frame.Side, l trace.Q, ps []Point) trace.Step {
	var terms []string
	args := []trace.Arg{trace.A("L", l)}
	v := 0.0
	for k, p := range ps {
		n := itoa(k + 1)
		a := min(max(p.X, 0), l.V)
		args = append(args, trace.A("P_"+n, trace.Const(p.P, "P_"+n, "N")), trace.A("a_"+n, trace.Const(a, "a_"+n, "mm")))
		if side == frame.AtStart {
			terms = append(terms, "P_"+n+" * a_"+n+" * (L - a_"+n+") ** 2")
			v -= p.P * a * (l.V - a) * (l.V - a)
		} else {
			terms = append(terms, "P_"+n+" * a_"+n+" ** 2 * (L - a_"+n+")")
			v += p.P * a * a * (l.V - a)
		}
	}
	v /= l.V * l.V
	expr := "0 * L"
	if len(terms) > 0 {
		expr = "(" + strings.Join(terms, " + ") + ") / L ** 2"
		if side == frame.AtStart {
			expr = "-" + expr
		}
	}
	return trace.Formula(id, title, "common practice (fixed-end moments of point loads)", "M_F", "Nmm", v, expr, args...).
		Note("Each load P stands a from the member's start; clockwise positive.")
}

// pointLoads returns the point loads of the input on the beam, permanent and imposed by category
// (not the transfers, which the take-down records apart).
func (ld BeamLoad) pointLoads() (g []Point, q map[string][]Point) {
	for _, p := range ld.Points {
		if p.G != 0 {
			g = append(g, Point{p.X, p.G})
		}
		if p.Q != 0 {
			if q == nil {
				q = map[string][]Point{}
			}
			q[p.Cat] = append(q[p.Cat], Point{p.X, p.Q})
		}
	}
	return g, q
}
