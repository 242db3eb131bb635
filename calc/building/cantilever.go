package building

import (
	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// CantOn is the stretch of one cantilever slab of the input that an edge beam carries.
type CantOn struct {
	Load   int     // index of the cantilever in the input (model.Building.Cantilevers)
	X0, X1 float64 // extent along the beam from its start, mm
	Length float64 // the slab's length beyond the beam's grid line, mm
	Line   string  // the edge grid line
}

// EdgeMoment is the moment that cantilever slabs beyond edge beams apply to the joint of a
// column at one level through the beams' torsion, characteristic and not less than zero, N·mm:
// the hogging moment of the slab per unit length, w·l_c/2, carried along each edge beam to its
// end columns by the lever rule. It acts about the axis along the edge: cantilevers beyond a
// lettered line (beams along y) act in the frames along x, about section axis y; beyond a
// numbered line in the frames along y, about z.
//
// Sign, by faces: the moment turns the joint towards the cantilever, so it bends the column
// below the joint with tension on its inner face (the face away from the cantilever) at its top,
// and the column above with tension on its outer face (towards the cantilever) at its bottom,
// as a loaded cantilever bends the column that carries it. In the frame's clockwise convention
// the cantilever acts at the joint as a beam on that side would: its end moment on the joint is
// Clockwise·M, with Clockwise = +1 where the cantilever lies on the low-coordinate side (edge
// line A or 1, like a loaded beam to the left, whose fixed-end moment at the joint is clockwise)
// and −1 on the high side.
type EdgeMoment struct {
	G         trace.Q            // permanent, N·mm; zero From when no cantilever bears on the joint
	Q         map[string]trace.Q // imposed, by category, N·mm
	Clockwise float64            // +1 or −1, see above; 0 when no cantilever bears on the joint
}

// cantileverEdge returns the direction, line index and coordinate range of the edge beam of a
// cantilever, and the side it lies on (+1 beyond the first line, −1 beyond the last); ok false
// where the line is not an edge of the grid.
func (g *Grid) cantileverEdge(c model.Cantilever) (d Dir, line int, lo, hi, side float64, ok bool) {
	d, line, lo, hi, ok = g.lineRange(model.LineLoad{GridLine: c.GridLine, From: c.From, To: c.To})
	if !ok {
		return
	}
	last := g.NY - 1
	if d == DirY {
		last = g.NX - 1
	}
	switch line {
	case 0:
		side = 1
	case last:
		side = -1
	default:
		ok = false
	}
	return
}

// addCantilevers puts on each edge beam of the level the cantilever slabs beyond it: the floor's
// loads over the slab's length as a line load (w = g_k·l_c, q_k·l_c) along the stretch it runs.
func (lv *Level) addCantilevers(b *model.Building, g *Grid) {
	f := lv.Floor
	for ci, c := range b.Cantilevers {
		if !contains(c.Levels, lv.Name) || !(c.Length > 0) {
			continue
		}
		d, line, lo, hi, _, ok := g.cantileverEdge(c)
		if !ok {
			continue // refused by checkLoads
		}
		lv.alongLine(d, line, lo, hi, func(k int, p frame.Piece) {
			p = p.Scale(c.Length)
			ld := &lv.Loads[k]
			ld.Cants = append(ld.Cants, CantOn{Load: ci, X0: p.X0, X1: p.X1, Length: c.Length, Line: c.GridLine})
			if f.Gk != 0 {
				ld.G = append(ld.G, p.Scale(f.Gk))
			}
			if f.Qk > 0 {
				ld.Q[f.Category] = append(ld.Q[f.Category], p.Scale(f.Qk))
			}
		})
	}
}

// CantileverLoad returns the load that a cantilever slab of length l_c puts on an edge beam over
// the stretch x0 to x1 under the area load w, F = w·l_c·(x1 − x0) (statics).
func CantileverLoad(id, title, symbol string, w, lc trace.Q, x0, x1 float64) trace.Step {
	return trace.Formula(id, title, "common practice (statics)", symbol, "N", w.V*lc.V*(x1-x0), "w * l_c * (x1 - x0)",
		trace.A("w", w), trace.A("l_c", lc), trace.A("x1", trace.Const(x1, "x_1", "mm")), trace.A("x0", trace.Const(x0, "x_0", "mm"))).
		Note("The slab runs from x_0 to x_1 along the beam, measured from its start, and l_c beyond its grid line.")
}

// CantileverTorsion returns the moment that an edge beam of span L carries in torsion to one of
// its end columns from a cantilever slab of length l_c under the area load w over the stretch x0
// to x1: the hogging moment per unit length m = w·l_c²/2 over the stretch, shared between the
// two ends by the lever rule about the stretch's middle x̄, T = m·(x1 − x0)·(L − x̄)/L at the
// start and m·(x1 − x0)·x̄/L at the end (statics of a member held against twisting at both ends;
// common practice).
func CantileverTorsion(id, title, symbol string, w, lc, l trace.Q, x0, x1 float64, atStart bool) trace.Step {
	xbar := (x0 + x1) / 2
	args := []trace.Arg{trace.A("w", w), trace.A("l_c", lc), trace.A("x1", trace.Const(x1, "x_1", "mm")), trace.A("x0", trace.Const(x0, "x_0", "mm")),
		trace.A("xbar", trace.Const(xbar, "x̄", "mm")), trace.A("L", l)}
	m := w.V * lc.V * lc.V / 2 * (x1 - x0)
	if atStart {
		return trace.Formula(id, title, "common practice (statics)", symbol, "Nmm", m*(l.V-xbar)/l.V,
			"w * l_c ** 2 / 2 * (x1 - x0) * (L - xbar) / L", args...)
	}
	return trace.Formula(id, title, "common practice (statics)", symbol, "Nmm", m*xbar/l.V,
		"w * l_c ** 2 / 2 * (x1 - x0) * xbar / L", args...)
}
