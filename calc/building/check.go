package building

import (
	"fmt"

	"colsheet/calc/model"
)

// checkLoads refuses the point loads, zones and cantilevers that the take-down cannot place: a
// point load outside the grid, a zone of no area, a cantilever beyond a line that is not an edge
// of the grid or of no length. Errors name the input line.
func checkLoads(b *model.Building, g *Grid) error {
	for k, p := range b.PointLoads {
		i, _ := g.cell(g.X, p.X)
		j, _ := g.cell(g.Y, p.Y)
		if i < 0 || j < 0 {
			return lineError{p.Line, fmt.Sprintf("point load %d stands outside the grid; a point load must stand on a floor between the grid's edge lines", k+1)}
		}
	}
	for k, z := range b.AreaLoads {
		if !(z.X[0] != z.X[1] && z.Y[0] != z.Y[1]) {
			return lineError{z.Line, fmt.Sprintf("zone %d has no area", k+1)}
		}
	}
	for k, c := range b.Cantilevers {
		if _, _, _, _, _, ok := g.cantileverEdge(c); !ok {
			return lineError{c.Line, fmt.Sprintf("cantilever %d: grid line %s is not an edge of the grid; a cantilever slab continues beyond an edge beam", k+1, c.GridLine)}
		}
		if !(c.Length > 0) {
			return lineError{c.Line, fmt.Sprintf("cantilever %d has no length", k+1)}
		}
	}
	return nil
}
