package input

import (
	"fmt"
	"math"

	"gopkg.in/yaml.v3"
)

// Limit is the range of plausibility of one kind of input quantity: a value outside it is
// refused as a slip of the pen or of the unit, not designed. The README lists them all.
type Limit struct {
	What     string  // the quantity, for messages and the README table
	Unit     string  // the unit a plain number is read in and values are shown in
	Min, Max float64 // the range, in engine units, both ends included
	Reason   string  // why the range is what it is
}

// The limits of the input quantities.
var (
	LimitSide = Limit{"section side", "mm", 150, 3000,
		"common practice: a cast column or beam narrower than 150 mm cannot be concreted around its bars; over 3 m it is a wall or a pier"}
	LimitCover = Limit{"nominal cover", "mm", 10, 100,
		"EN 1992-1-1:2004 4.4.1.2(2)P, Eq. (4.2): cmin is at least 10 mm; a cover over 100 mm spalls unless it is reinforced itself, common practice"}
	LimitBar = Limit{"longitudinal bar diameter", "mm", 8, 50,
		"EN 1992-1-1:2004 9.5.2(1): at least φmin = 8 mm (recommended); 50 mm is the largest bar commonly rolled, common practice"}
	LimitLink = Limit{"link diameter", "mm", 6, 20,
		"EN 1992-1-1:2004 9.5.3(1): at least 6 mm; 20 mm is more than a quarter of the largest bar (12.5 mm), common practice"}
	LimitAggregate = Limit{"aggregate size", "mm", 4, 63,
		"common practice: the largest aggregate of structural concrete is 4 mm to 63 mm"}
	LimitL0 = Limit{"effective length l0", "mm", 300, 60000,
		"common practice: below 0.3 m the member is a pad, not a column; 60 m is five of the tallest storeys, beyond any effective length of a building column"}
	LimitHeight = Limit{"storey height", "mm", 2000, 12000,
		"common practice: storeys of buildings are 2 m to 12 m high"}
	LimitBay = Limit{"bay width", "mm", 1000, 30000,
		"common practice: beam-and-slab floors span 1 m to 30 m"}
	LimitNEd = Limit{"design axial force", "kN", 0, 1e8,
		"common practice: building columns carry at most some tens of MN (1e4 kN); 1e5 kN is beyond any"}
	LimitMoment = Limit{"first-order end moment", "kNm", -1e11, 1e11,
		"common practice: 1e5 kNm either way is beyond any building column"}
	LimitAreaLoad = Limit{"area load", "kN/m2", 0, 0.1,
		"common practice: 100 kN/m² is beyond any floor of a building (the imposed loads of EN 1991-1-1 Tables 6.2 and 6.4 stay below 10 kN/m², from memory)"}
	LimitLineLoad = Limit{"line load", "kN/m", 0, 1000,
		"common practice: 1000 kN/m is beyond any wall or façade a floor beam carries"}
	LimitStep = Limit{"rounding step", "mm", 5, 100,
		"common practice: site dimensions are rounded to 5 mm to 100 mm"}
	LimitLapStart = Limit{"start of the laps above the floor", "mm", 0, 12000,
		"the laps start within the storey, at most the tallest storey (12 m)"}
)

// LimitShear is the range of a design shear force given with a load case (V of cases: or the
// Vy_kN and Vz_kN of the actions table), either sign.
var LimitShear = Limit{"design shear force", "kN", -1e8, 1e8,
	"common practice: a shear of 1e5 kN either way is beyond any building column"}

// limitAxial is LimitNEd on either side of zero: the actions form takes tension as a negative NEd.
var limitAxial = Limit{LimitNEd.What, LimitNEd.Unit, -LimitNEd.Max, LimitNEd.Max, LimitNEd.Reason}

// Limits lists every limit, in the order of the README table.
var Limits = []Limit{LimitSide, LimitCover, LimitBar, LimitLink, LimitAggregate, LimitL0, LimitHeight,
	LimitBay, LimitNEd, LimitShear, LimitMoment, LimitAreaLoad, LimitLineLoad, LimitStep, LimitLapStart}

// plausible reads a quantity that must lie within l. A plain number for a length that is too
// small in millimetres but plausible in metres is refused with the hint to write the unit.
func (r *reader) plausible(n *yaml.Node, path string, l Limit) (float64, bool) {
	v, ok := r.number(n, path, l.Unit)
	if !ok {
		return 0, false
	}
	if !r.inside(n, path, v, l) {
		return 0, false
	}
	return v, true
}

// inside reports whether v, read from n, lies within l, and reports a fault when it does not.
func (r *reader) inside(n *yaml.Node, path string, v float64, l Limit) bool {
	if l.within(v) {
		return true
	}
	rn := resolve(n)
	bare := rn.Kind == yaml.ScalarNode && (rn.ShortTag() == "!!int" || rn.ShortTag() == "!!float")
	if bare && l.Unit == "mm" && v < l.Min && v*1000 >= l.Min && v*1000 <= l.Max {
		r.fail(n, path, "%s is read as %s, less than the least plausible %s of %s; for metres write the unit: \"%s m\"",
			rn.Value, show(v, "mm"), l.What, show(l.Min, l.Unit), rn.Value)
		return false
	}
	r.fail(n, path, "%s", l.outside(v))
	return false
}

// within reports whether v lies within l, both ends included.
func (l Limit) within(v float64) bool { return v >= l.Min && v <= l.Max }

// outside returns the message for a value v (engine units) outside l.
func (l Limit) outside(v float64) string {
	return fmt.Sprintf("%s is outside the plausible range of the %s, %s to %s (see the input limits in the README)",
		show(v, l.Unit), l.What, show(l.Min, l.Unit), show(l.Max, l.Unit))
}

// finite reports whether v is a finite number.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
