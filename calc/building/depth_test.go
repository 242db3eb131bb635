package building

import (
	"testing"

	"colsheet/calc/model"
)

// BeamDepthAt takes the deeper of the beams through a grid point at a level, the last matching
// override winning (common practice, no source: the clear height below the deeper beam).
func TestBeamDepthAt(t *testing.T) {
	b := &model.Building{Beam: model.Size{B: 300, H: 550}, Beams: []model.BeamSize{
		{Dir: "x", Lines: []string{"2"}, Size: model.Size{B: 450, H: 900}},
		{Levels: []string{"L1"}, Dir: "y", Lines: []string{"B"}, Size: model.Size{B: 500, H: 1100}},
	}}
	for _, c := range []struct {
		level string
		i, j  int
		want  float64
	}{
		{"L1", 0, 0, 550},  // A1: defaults both ways
		{"L2", 0, 1, 900},  // A2: line 2 along x
		{"L1", 1, 0, 1100}, // B1 at L1: line B along y
		{"L2", 1, 0, 550},  // B1 at L2: the override is for L1 only
		{"L1", 1, 1, 1100}, // B2 at L1: the deeper of 900 and 1100
	} {
		if got := BeamDepthAt(b, c.level, c.i, c.j); got != c.want {
			t.Errorf("%s %s: %g, want %g", c.level, ColumnID(c.i, c.j), got, c.want)
		}
	}
}
