package building

import "colsheet/calc/trace"

// TransferOn is a column that stands on a beam at a level where the column is absent below (a
// transfer): its share K of the load at the foot of its lowest lift above, at X along the beam.
type TransferOn struct {
	Column string  // the column that stands on the beam, e.g. "B2"
	I, J   int     // its grid line indices
	X      float64 // position along the beam from its start, mm
	K      float64 // the beam's share of the column's load
	// G and Q are the characteristic loads the beam takes from the column, N, the permanent and
	// the imposed by category; Derive fills them in once the take-down of the levels above is done.
	G float64
	Q map[string]float64
}

// transferCaution is the caution on every step that carries a column's load into a beam.
const transferCaution = "The beam carries a column that stops on it (a transfer beam): its design, and the column's seating on it, are outside colsheet's scope and must be done separately."

// addTransfers puts on the beams of the level each column that is absent below the level and
// stands above it: half its load on the beam of each of the two grid lines that cross at its
// grid point (simply supported, common practice), or all of it where one beam crosses there.
func (lv *Level) addTransfers(g *Grid, n int) {
	m := lv.Index
	if m+1 >= n {
		return
	}
	for i := 0; i < g.NX; i++ {
		for j := 0; j < g.NY; j++ {
			if !g.Has[i][j] || g.Stands(i, j, m) || !g.Stands(i, j, m+1) {
				continue
			}
			type place struct {
				beam int
				x    float64
			}
			var on []place
			for _, c := range []struct {
				d    Dir
				line int
				at   float64
			}{{DirX, j, g.X[i]}, {DirY, i, g.Y[j]}} {
				if k := beamAt(lv.Beams, c.d, c.line, c.at, c.at); k >= 0 {
					on = append(on, place{k, c.at - lv.Beams[k].Start})
				}
			}
			for _, o := range on {
				lv.Loads[o.beam].Transfers = append(lv.Loads[o.beam].Transfers, TransferOn{Column: ColumnID(i, j), I: i, J: j, X: o.x, K: 1 / float64(len(on))})
			}
		}
	}
}

// TransferReaction returns the reaction at one end of a simply supported beam of span L from a
// column standing on it at a from its start, which puts the share K of its load P on the beam:
// K·P·(L − a)/L at the start and K·P·a/L at the end (statics; common practice).
func TransferReaction(id, title string, p, k, a, l trace.Q, atStart bool) trace.Step {
	const clause = "common practice (simply supported beam reaction)"
	args := []trace.Arg{trace.A("K", k), trace.A("P", p), trace.A("a", a), trace.A("L", l)}
	if atStart {
		return trace.Formula(id, title, clause, "R", "N", k.V*p.V*(l.V-a.V)/l.V, "K * P * (L - a) / L", args...)
	}
	return trace.Formula(id, title, clause, "R", "N", k.V*p.V*a.V/l.V, "K * P * a / L", args...)
}
