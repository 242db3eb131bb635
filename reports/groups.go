package reports

import (
	"fmt"
	"sort"

	"colsheet/calc/design"
)

// colGroup is a column group: lifts with the same section, bars, links, cover and fire rating,
// which one calculation (of its governing lift) covers.
type colGroup struct {
	lifts     []int // design indices, in the order of the result
	governing int   // the lift with the highest utilisation (a failing one first)
	d         design.Design
}

// groupKey is what the lifts of a group share.
type groupKey struct {
	b, h, cover         float64
	shape, links        string
	count               int
	dia, link, s, sZone float64
	fire                int
}

func keyOf(d design.Design) groupKey {
	return groupKey{b: d.B, h: d.H, cover: d.Cover, shape: d.Shape, links: d.Links.Type, count: d.Bars.Count, dia: d.Bars.Dia,
		link: d.Links.Dia, s: d.Links.Spacing, sZone: d.Links.SpacingReduced, fire: d.Detailing.FireRating}
}

// columnGroups returns the column groups of r, ordered by section, then steel, links, cover
// and fire rating.
func columnGroups(r *design.Result) []colGroup {
	at := map[groupKey]int{}
	var out []colGroup
	for i, d := range r.Designs {
		k := keyOf(d)
		n, ok := at[k]
		if !ok {
			n = len(out)
			at[k] = n
			out = append(out, colGroup{governing: i, d: d})
		}
		g := &out[n]
		g.lifts = append(g.lifts, i)
		if worse(d, r.Designs[g.governing]) {
			g.governing = i
		}
	}
	sort.SliceStable(out, func(x, y int) bool {
		a, b := keyOf(out[x].d), keyOf(out[y].d)
		switch {
		case a.b*a.h != b.b*b.h:
			return a.b*a.h < b.b*b.h
		case a.b != b.b:
			return a.b < b.b
		case float64(a.count)*a.dia*a.dia != float64(b.count)*b.dia*b.dia:
			return float64(a.count)*a.dia*a.dia < float64(b.count)*b.dia*b.dia
		case a.dia != b.dia:
			return a.dia < b.dia
		case a.link != b.link:
			return a.link < b.link
		case a.s != b.s:
			return a.s < b.s
		case a.sZone != b.sZone:
			return a.sZone < b.sZone
		case a.cover != b.cover:
			return a.cover < b.cover
		}
		return a.fire < b.fire
	})
	return out
}

// worse reports whether design a governs over b: a failing design first, then the higher utilisation.
func worse(a, b design.Design) bool {
	af, bf := a.Status != design.StatusPass, b.Status != design.StatusPass
	if af != bf {
		return af
	}
	return a.Utilization > b.Utilization
}

// groupOf returns the index of the group that holds design i.
func groupOf(gs []colGroup, i int) int {
	for n, g := range gs {
		for _, k := range g.lifts {
			if k == i {
				return n
			}
		}
	}
	return -1
}

func (g colGroup) name(n int) string { return fmt.Sprintf("Group %d", n+1) }

func (g colGroup) section() string {
	return sizeText(g.d.B, g.d.H, g.d.Shape)
}

// cage names the group's bars and links.
func (g colGroup) cage() string {
	return barsText(g.d) + ", links " + linksText(g.d)
}

// title is the group's heading: "Group 3: 450 × 450, 8 Ø20, links Ø8 @ 300, cover 40, R90; 23 lifts".
func (g colGroup) title(n int) string {
	s := g.name(n) + ": " + g.section() + ", " + g.cage() + ", cover " + fmtNum(g.d.Cover).plain()
	if g.d.Detailing.FireRating > 0 {
		s += fmt.Sprintf(", R%d", g.d.Detailing.FireRating)
	}
	lifts := "lifts"
	if len(g.lifts) == 1 {
		lifts = "lift"
	}
	return fmt.Sprintf("%s; %d %s", s, len(g.lifts), lifts)
}

// groupNames returns the name of the group of each design of r ("Group 3").
func groupNames(r *design.Result) []string {
	out := make([]string, len(r.Designs))
	for n, g := range columnGroups(r) {
		for _, i := range g.lifts {
			out[i] = g.name(n)
		}
	}
	return out
}
