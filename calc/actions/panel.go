package actions

import (
	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// PanelLoads returns the line loads that a rectangular slab panel lx × ly (mm) with area load
// q (N/mm²) puts on its four edge beams, by its span direction (model.SpanX, model.SpanY or
// model.SpanTwoWay with 45° lines from the corners); common practice. South and north are the
// beams along x at y = 0 and y = ly, west and east the beams along y at x = 0 and x = lx; each
// piece is measured from the beam's lower coordinate. A panel without area gives no loads, and
// an unknown span direction panics.
func PanelLoads(lx, ly, q float64, spans string) (south, north, west, east []frame.Piece) {
	if !(lx > 0 && ly > 0) {
		return nil, nil, nil, nil
	}
	switch spans {
	case model.SpanX:
		w := q * lx / 2
		return nil, nil, []frame.Piece{frame.Uniform(w, ly)}, []frame.Piece{frame.Uniform(w, ly)}
	case model.SpanY:
		w := q * ly / 2
		return []frame.Piece{frame.Uniform(w, lx)}, []frame.Piece{frame.Uniform(w, lx)}, nil, nil
	case model.SpanTwoWay:
		a := min(lx, ly) / 2
		w := q * a
		return frame.Trapezoid(w, lx, a), frame.Trapezoid(w, lx, a), frame.Trapezoid(w, ly, a), frame.Trapezoid(w, ly, a)
	}
	panic("actions: unknown span direction " + spans)
}

// Edges of a slab panel, for EdgePeak.
const (
	South = "south" // the beam along x at y = 0
	North = "north" // the beam along x at y = ly
	West  = "west"  // the beam along y at x = 0
	East  = "east"  // the beam along y at x = lx
)

// EdgePeak returns the peak line load (N/mm) that a slab panel lx × ly with area load q puts on
// its edge beam edge (South, North, West, East) for the span direction spans, the value that
// PanelLoads distributes; common practice.
func EdgePeak(id, edge, spans string, lx, ly, q trace.Q) trace.Step {
	const title = "Peak line load from the slab panel on the edge beam"
	alongX := edge == South || edge == North
	if edge != South && edge != North && edge != West && edge != East {
		panic("actions: unknown panel edge " + edge)
	}
	switch spans {
	case model.SpanX:
		if alongX {
			return trace.Input(id, title, "common practice", "w", "N/mm", 0).Note("The slab spans along x: the beams along x carry none of its load.")
		}
		return trace.Formula(id, title, "common practice", "w", "N/mm", q.V*lx.V/2, "q * L_x / 2", trace.A("q", q), trace.A("L_x", lx))
	case model.SpanY:
		if !alongX {
			return trace.Input(id, title, "common practice", "w", "N/mm", 0).Note("The slab spans along y: the beams along y carry none of its load.")
		}
		return trace.Formula(id, title, "common practice", "w", "N/mm", q.V*ly.V/2, "q * L_y / 2", trace.A("q", q), trace.A("L_y", ly))
	case model.SpanTwoWay:
		return trace.Formula(id, title, "common practice", "w", "N/mm", q.V*(min(lx.V, ly.V)/2), "q * (min(L_x, L_y) / 2)",
			trace.A("q", q), trace.A("L_x", lx), trace.A("L_y", ly)).
			Note("Two-way slab: 45° lines from the corners give trapezia on the long sides and triangles on the short sides.")
	}
	panic("actions: unknown span direction " + spans)
}
