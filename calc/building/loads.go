package building

import (
	"colsheet/calc/frame"
	"colsheet/calc/model"
	"math"
)

// BeamLoad holds the characteristic loads on one beam at one level.
type BeamLoad struct {
	G     []frame.Piece            // permanent: slab, self-weight, line loads
	Q     map[string][]frame.Piece // imposed, by category
	Slab  []frame.Piece            // the slab area draining to the beam per unit length (a unit area load), mm
	LineG []LinePiece              // the permanent line loads on the beam
	LineQ map[string][]LinePiece   // the imposed line loads on the beam by category
	// Zones, Cants and Points are the zoned area loads, cantilever slabs and point loads of the
	// input that the beam carries; the first two are in G and Q as pieces too, the point loads
	// only here (a piece cannot hold a concentrated load).
	Zones  []ZoneOn
	Cants  []CantOn
	Points []PointOn
	// Transfers are the columns that stand on the beam, absent below its level; their loads are
	// known once the take-down of the levels above is done (Derive fills them in).
	Transfers []TransferOn
}

// LinePiece is the stretch of one line load of the input that lies on a beam.
type LinePiece struct {
	X0, X1 float64 // extent along the beam from its start, mm
	W      float64 // intensity as given, N/mm
	Load   int     // index of the line load in the input (model.Building.Lines)
	Line   string  // the grid line it is given on
}

// Level holds the beams of one level and their loads.
type Level struct {
	Index   int
	Name    string
	Floor   model.Floor
	Density float64 // weight density of the beams, N/mm³
	Beams   []Beam
	Loads   []BeamLoad
}

// floorOf returns the floor entry that gives the level's loads; an entry without levels gives
// every level.
func floorOf(b *model.Building, level string) (model.Floor, bool) {
	for _, f := range b.Floors {
		if contains(f.Levels, level) {
			return f, true
		}
	}
	return model.Floor{}, false
}

func contains(list []string, s string) bool {
	if len(list) == 0 {
		return true
	}
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// beamSize returns the section of a beam on a grid line at a level, the last matching override winning.
func beamSize(b *model.Building, level string, d Dir, lineName string) model.Size {
	s := b.Beam
	for _, o := range b.Beams {
		if !contains(o.Levels, level) || (o.Dir != "" && o.Dir != d.String()) || !contains(o.Lines, lineName) {
			continue
		}
		s = o.Size
	}
	return s
}

// lineName returns the grid-line name of the line a beam of direction d runs on.
func (g *Grid) lineName(d Dir, line int) string {
	if d == DirX {
		return itoa(line + 1)
	}
	return g.Names[line]
}

func itoa(i int) string {
	if i < 10 {
		return string(rune('0' + i))
	}
	return itoa(i/10) + string(rune('0'+i%10))
}

// slabPieces returns the load pieces, per unit area load, that a panel gives its four edge
// beams: south and north (along x), west and east (along y), common practice.
type panelLoader func(lx, ly float64, spans string) (south, north, west, east []frame.Piece)

// Levels builds every level's beams and their characteristic loads.
func Levels(b *model.Building, g *Grid, panel panelLoader) []Level {
	out := make([]Level, len(b.Storeys))
	for li, st := range b.Storeys {
		lv := Level{Index: li, Name: st.Name, Density: b.Options.Density}
		lv.Floor, _ = floorOf(b, st.Name)
		lv.Beams = g.LevelBeams(li, func(d Dir, line int) model.Size { return beamSize(b, st.Name, d, g.lineName(d, line)) })
		lv.Loads = make([]BeamLoad, len(lv.Beams))
		for k := range lv.Loads {
			lv.Loads[k].Q = map[string][]frame.Piece{}
			lv.Loads[k].LineQ = map[string][]LinePiece{}
		}
		addQ := func(k int, cat string, ps []frame.Piece) {
			lv.Loads[k].Q[cat] = append(lv.Loads[k].Q[cat], ps...)
		}
		// Slab panels.
		f := lv.Floor
		for i := 0; i+1 < g.NX; i++ {
			for j := 0; j+1 < g.NY; j++ {
				lx, ly := g.X[i+1]-g.X[i], g.Y[j+1]-g.Y[j]
				s, n, w, e := panel(lx, ly, f.Spans)
				lv.onEdges(g, i, j, [4][]frame.Piece{s, n, w, e}, func(k int, p frame.Piece) {
					lv.Loads[k].Slab = append(lv.Loads[k].Slab, p)
					lv.Loads[k].G = append(lv.Loads[k].G, p.Scale(f.Gk))
					if f.Qk > 0 {
						addQ(k, f.Category, []frame.Piece{p.Scale(f.Qk)})
					}
				})
			}
		}
		// Self-weight of the beams, density × b × h, or × (h − t) below a slab of thickness t.
		for k, bm := range lv.Beams {
			lv.Loads[k].G = append(lv.Loads[k].G, frame.Uniform(b.Options.Density*bm.Size.B*downstand(bm.Size.H, f.Thickness), bm.L))
		}
		// Line loads on grid lines.
		for li, ll := range b.Lines {
			if !contains(ll.Levels, st.Name) {
				continue
			}
			d, line, lo, hi, ok := g.lineRange(ll)
			if !ok {
				continue
			}
			lv.alongLine(d, line, lo, hi, func(k int, p frame.Piece) {
				lp := LinePiece{X0: p.X0, X1: p.X1, Load: li, Line: ll.GridLine}
				if ll.Gk > 0 {
					lv.Loads[k].G = append(lv.Loads[k].G, p.Scale(ll.Gk))
					lp.W = ll.Gk
					lv.Loads[k].LineG = append(lv.Loads[k].LineG, lp)
				}
				if ll.Qk > 0 {
					addQ(k, ll.Category, []frame.Piece{p.Scale(ll.Qk)})
					lp.W = ll.Qk
					lv.Loads[k].LineQ[ll.Category] = append(lv.Loads[k].LineQ[ll.Category], lp)
				}
			})
		}
		lv.addZones(b, g)
		lv.addCantilevers(b, g)
		lv.addPoints(b, g)
		lv.addTransfers(g, len(b.Storeys))
		out[li] = lv
	}
	return out
}

// alongLine hands add each beam of direction d on the grid line that the coordinate range
// [lo, hi] overlaps, with the overlap as a unit piece measured from the beam's start.
func (lv *Level) alongLine(d Dir, line int, lo, hi float64, add func(k int, p frame.Piece)) {
	for k, bm := range lv.Beams {
		if bm.Dir != d || bm.Line != line {
			continue
		}
		a, c := maxf(lo, bm.Start), minf(hi, bm.Start+bm.L)
		if c-a <= 1e-6 {
			continue
		}
		add(k, frame.Piece{X0: a - bm.Start, X1: c - bm.Start, W0: 1, W1: 1})
	}
}

// downstand returns the depth of a beam below a slab of thickness t (0: the whole depth h), not
// less than zero.
func downstand(h, t float64) float64 {
	if t > 0 {
		return max(h-t, 0)
	}
	return h
}

// onEdges hands each piece that the panel of bay (i, j) gives its south, north, west and east
// edge (pieces[0..3], measured from the edge's lower end) to add, with the beam of the level
// that carries that edge and the piece measured from the beam's start.
func (lv *Level) onEdges(g *Grid, i, j int, pieces [4][]frame.Piece, add func(k int, p frame.Piece)) {
	edges := [4]struct {
		d    Dir
		line int
		a, b float64
	}{
		{DirX, j, g.X[i], g.X[i+1]}, {DirX, j + 1, g.X[i], g.X[i+1]},
		{DirY, i, g.Y[j], g.Y[j+1]}, {DirY, i + 1, g.Y[j], g.Y[j+1]},
	}
	for e, ed := range edges {
		if len(pieces[e]) == 0 {
			continue
		}
		k := beamAt(lv.Beams, ed.d, ed.line, ed.a, ed.b)
		if k < 0 {
			continue
		}
		shift := ed.a - lv.Beams[k].Start
		for _, p := range pieces[e] {
			add(k, p.Shift(shift))
		}
	}
}

// lineRange returns the direction, line index and coordinate range of a line load.
func (g *Grid) lineRange(ll model.LineLoad) (d Dir, line int, lo, hi float64, ok bool) {
	name := ll.GridLine
	if n, err := atoi(name); err == nil {
		// A numbered line runs along x.
		if n < 1 || n > g.NY {
			return 0, 0, 0, 0, false
		}
		d, line, lo, hi = DirX, n-1, g.X[0], g.X[g.NX-1]
		if ll.From != "" {
			if i, ok := g.letterIndex(ll.From); ok {
				lo = g.X[i]
			}
		}
		if ll.To != "" {
			if i, ok := g.letterIndex(ll.To); ok {
				hi = g.X[i]
			}
		}
	} else {
		i, ok := g.letterIndex(name)
		if !ok {
			return 0, 0, 0, 0, false
		}
		d, line, lo, hi = DirY, i, g.Y[0], g.Y[g.NY-1]
		if n, err := atoi(ll.From); err == nil && n >= 1 && n <= g.NY {
			lo = g.Y[n-1]
		}
		if n, err := atoi(ll.To); err == nil && n >= 1 && n <= g.NY {
			hi = g.Y[n-1]
		}
	}
	if hi < lo {
		lo, hi = hi, lo
	}
	return d, line, lo, hi, true
}

func (g *Grid) letterIndex(s string) (int, bool) {
	for i, n := range g.Names {
		if n == s {
			return i, true
		}
	}
	return 0, false
}

type errNotNumber struct{}

func (errNotNumber) Error() string { return "not a number" }

func atoi(s string) (int, error) {
	if s == "" {
		return 0, errNotNumber{}
	}
	n := 0
	for _, c := range s {
		if c < '0' || c > '9' {
			return 0, errNotNumber{}
		}
		n = 10*n + int(c-'0')
	}
	return n, nil
}

func maxf(a, b float64) float64 {
	if a > b {
		return a
	}
	return b
}

func minf(a, b float64) float64 {
	if a < b {
		return a
	}
	return b
}

// BeamDepthAt returns the depth of the deeper of the beams that run through grid point (i, j)
// at a level: along x on its numbered line and along y on its lettered line (the default beam
// and the overrides that match), for the clear height of the column below.
func BeamDepthAt(b *model.Building, level string, i, j int) float64 {
	return math.Max(beamSize(b, level, DirX, itoa(j+1)).H, beamSize(b, level, DirY, LetterName(i)).H)
}
