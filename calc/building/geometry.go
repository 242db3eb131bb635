// Package building derives, from the building form, the design actions on every column
// and lift: the grid, beams and panels, the load take-down with its combinations, the load
// arrangements and the column end moments, each step traced for the sheets.
package building

import (
	"fmt"
	"strconv"
	"strings"

	"colsheet/calc/model"
)

// Grid holds the coordinates of the grid lines and the columns that stand on them.
type Grid struct {
	X, Y  []float64 // line coordinates from the first line, mm
	Has   [][]bool  // Has[i][j]: a column stands at x line i, y line j
	NX    int       // number of x lines (lettered)
	NY    int       // number of y lines (numbered)
	Names []string  // x line names A, B, ...
	// absent holds the lifts (by storey index) that a column leaves out (model.Building.OmitAt).
	absent map[[2]int][]bool
}

// LetterName returns the name of x line i: A … Z, then AA, AB, ….
func LetterName(i int) string {
	s := ""
	for i >= 0 {
		s = string(rune('A'+i%26)) + s
		i = i/26 - 1
	}
	return s
}

// ColumnID returns the id of the column at x line i and y line j, e.g. "B2".
func ColumnID(i, j int) string { return LetterName(i) + strconv.Itoa(j+1) }

// NewGrid builds the grid of the building, without the omitted points.
func NewGrid(b *model.Building) (*Grid, error) {
	g := &Grid{NX: len(b.GridX) + 1, NY: len(b.GridY) + 1}
	g.X = make([]float64, g.NX)
	g.Y = make([]float64, g.NY)
	for i, w := range b.GridX {
		g.X[i+1] = g.X[i] + w
	}
	for j, w := range b.GridY {
		g.Y[j+1] = g.Y[j] + w
	}
	g.Has = make([][]bool, g.NX)
	for i := range g.Has {
		g.Has[i] = make([]bool, g.NY)
		for j := range g.Has[i] {
			g.Has[i][j] = true
		}
		g.Names = append(g.Names, LetterName(i))
	}
	for _, id := range b.Omit {
		i, j, ok := g.Point(id)
		if !ok {
			return nil, fmt.Errorf("building.omit: %s is not a grid point", id)
		}
		if i == 0 || j == 0 || i == g.NX-1 || j == g.NY-1 {
			return nil, fmt.Errorf("building.omit: %s lies on the edge of the grid; only inner grid points may be left without a column (the edge beams need their supports)", id)
		}
		g.Has[i][j] = false
	}
	if err := g.omitAt(b); err != nil {
		return nil, err
	}
	return g, nil
}

// omitAt records the columns absent at some levels only; like omitted points, they must lie
// inside the grid, where the beams of both lines can span across them.
func (g *Grid) omitAt(b *model.Building) error {
	level := map[string]int{}
	for k, st := range b.Storeys {
		level[st.Name] = k
	}
	for _, o := range b.OmitAt {
		for _, id := range o.Columns {
			i, j, ok := g.Point(id)
			if !ok {
				return lineError{o.Line, "column " + id + ", absent at some levels, is not a grid point"}
			}
			if i == 0 || j == 0 || i == g.NX-1 || j == g.NY-1 {
				return lineError{o.Line, "column " + id + ", absent at some levels, lies on the edge of the grid; only inner columns may be left out at some levels (the beams that end on the edge need their supports)"}
			}
			if g.absent == nil {
				g.absent = map[[2]int][]bool{}
			}
			gone := g.absent[[2]int{i, j}]
			if gone == nil {
				gone = make([]bool, len(b.Storeys))
				g.absent[[2]int{i, j}] = gone
			}
			if len(o.Levels) == 0 {
				for k := range gone {
					gone[k] = true
				}
			}
			for _, name := range o.Levels {
				k, ok := level[name]
				if !ok {
					return lineError{o.Line, "column " + id + " is left out at level " + name + ", which is not a storey"}
				}
				gone[k] = true
			}
		}
	}
	return nil
}

// lineError is an error in the building entry at an input line.
type lineError struct {
	line int
	msg  string
}

func (e lineError) Error() string { return e.msg }

// Stands reports whether the column at x line i, y line j has its lift m (from level m−1, or
// the base, up to level m): the grid point is not omitted and the column not absent there.
func (g *Grid) Stands(i, j, m int) bool {
	if !g.Has[i][j] {
		return false
	}
	gone := g.absent[[2]int{i, j}]
	return gone == nil || !gone[m]
}

// Partial reports whether some column is absent at some levels only.
func (g *Grid) Partial() bool { return len(g.absent) > 0 }

// Point returns the line indices of a column id such as "B2".
func (g *Grid) Point(id string) (i, j int, ok bool) {
	id = strings.ToUpper(strings.TrimSpace(id))
	k := 0
	for k < len(id) && id[k] >= 'A' && id[k] <= 'Z' {
		k++
	}
	if k == 0 || k == len(id) {
		return 0, 0, false
	}
	n, err := strconv.Atoi(id[k:])
	if err != nil || n < 1 || n > g.NY {
		return 0, 0, false
	}
	for i, name := range g.Names {
		if name == id[:k] {
			return i, n - 1, true
		}
	}
	return 0, 0, false
}

// Dir is a direction in plan.
type Dir int

// The two plan directions.
const (
	DirX Dir = iota // along x: beams on the numbered lines; their frames bend the columns about section axis y
	DirY            // along y: beams on the lettered lines; their frames bend the columns about section axis z
)

// String returns "x" or "y".
func (d Dir) String() string {
	if d == DirY {
		return "y"
	}
	return "x"
}

// Axis returns the section axis that the frames of direction d bend the columns about:
// frames along x bend them about y, frames along y about z.
func (d Dir) Axis() string {
	if d == DirY {
		return "z"
	}
	return "y"
}

// Beam is a beam between two neighbouring columns on one grid line at one level.
type Beam struct {
	Dir      Dir
	Line     int     // index of the grid line it runs on (a y line for DirX, an x line for DirY)
	From, To int     // indices of the cross lines at its ends (columns stand there)
	Start    float64 // coordinate of its start along its direction, mm
	L        float64 // span, mm
	Size     model.Size
}

// Name returns a readable name such as "B1–C1".
func (b Beam) Name() string {
	if b.Dir == DirX {
		return ColumnID(b.From, b.Line) + "–" + ColumnID(b.To, b.Line)
	}
	return ColumnID(b.Line, b.From) + "–" + ColumnID(b.Line, b.To)
}

// Beams returns the beams of one level where every column stands: on each grid line, one beam
// between each pair of neighbouring columns (a beam spans across an omitted grid point).
func (g *Grid) Beams(sizeOf func(d Dir, line int) model.Size) []Beam {
	return g.beamsWhere(sizeOf, func(i, j int) bool { return g.Has[i][j] })
}

// LevelBeams returns the beams of level m: on each grid line, one beam between each pair of
// neighbouring columns whose lift m stands (a beam spans across an omitted grid point and across
// a column absent below the level, which then stands on it).
func (g *Grid) LevelBeams(m int, sizeOf func(d Dir, line int) model.Size) []Beam {
	return g.beamsWhere(sizeOf, func(i, j int) bool { return g.Stands(i, j, m) })
}

// beamsWhere returns the beams between neighbouring supports on every grid line, a support
// standing at (i, j) where stands says so.
func (g *Grid) beamsWhere(sizeOf func(d Dir, line int) model.Size, stands func(i, j int) bool) []Beam {
	var out []Beam
	// lines runs the beams of direction d: along each line, between neighbouring columns at the
	// cross-line coordinates cross; has tells whether a column stands at (line, cross line).
	lines := func(d Dir, nLines int, cross []float64, has func(line, c int) bool) {
		for line := 0; line < nLines; line++ {
			prev := -1
			for c := range cross {
				if !has(line, c) {
					continue
				}
				if prev >= 0 {
					out = append(out, Beam{Dir: d, Line: line, From: prev, To: c, Start: cross[prev], L: cross[c] - cross[prev], Size: sizeOf(d, line)})
				}
				prev = c
			}
		}
	}
	lines(DirX, g.NY, g.X, func(j, i int) bool { return stands(i, j) }) // along x on the numbered lines
	lines(DirY, g.NX, g.Y, func(i, j int) bool { return stands(i, j) }) // along y on the lettered lines
	return out
}

// beamAt returns the index of the beam of direction d on line `line` that covers the
// coordinate range [a, b], or -1.
func beamAt(beams []Beam, d Dir, line int, a, b float64) int {
	for k, bm := range beams {
		if bm.Dir == d && bm.Line == line && bm.Start <= a+1e-6 && bm.Start+bm.L >= b-1e-6 {
			return k
		}
	}
	return -1
}
