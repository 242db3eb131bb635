package design

import (
	"math"
	"strconv"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// CaseResult is what one load case of a lift gives with the bars of the design: a lift of
// several cases is designed for all of them with one bar pattern and one link arrangement, and
// the design's own values are those of its governing case.
type CaseResult struct {
	Name        string
	File        string  // where the case is given
	Line        int     // its line there
	NEd         float64 // N, compression positive
	Y, Z        Axis
	Utilization float64 // largest ratio of action to resistance of the case's checks
	Status      string  // StatusPass or StatusFail
	Governing   string  // the check that sets Utilization, in words
	// Prefix is what the IDs of the case's steps in the design's trace start with: "" for the
	// governing case, whose steps are the design's own, else "case/K/" (K its place in the list).
	Prefix string
}

// CasePrefix returns the prefix of the step IDs of the k-th case (from 0) of a lift when it
// does not govern.
func CasePrefix(k int) string { return "case/" + strconv.Itoa(k+1) + "/" }

// caseStorey returns the lift st with the actions of its case k.
func caseStorey(st *model.Storey, k int) model.Storey {
	s := *st
	c := st.Cases[k]
	s.NEd, s.MY, s.MZ = c.NEd, c.MY, c.MZ
	s.Cases = []model.Case{c}
	return s
}

// caseSet is the commons of the cases of a lift (one each, in input order) and the one that
// leads the search: the case of the largest NEd, whose As,min is the largest.
type caseSet struct {
	all     []*common
	storeys []model.Storey // the lift with each case's actions, which the commons point to
	lead    int
}

// newCaseSet returns the commons of every case of the lift st.
func newCaseSet(in *model.Input, col *model.Column, st *model.Storey, bs *projectBasis) *caseSet {
	cs := &caseSet{all: make([]*common, len(st.Cases)), storeys: make([]model.Storey, len(st.Cases))}
	for k := range st.Cases {
		cs.storeys[k] = caseStorey(st, k)
		cs.all[k] = newCommon(in, col, &cs.storeys[k], nil, bs)
		cs.all[k].cases = cs
		if st.Cases[k].NEd > st.Cases[cs.lead].NEd {
			cs.lead = k
		}
	}
	return cs
}

// trial evaluates pattern p for the cases other than the lead's (whose trial is d) and gives d
// the largest utilisation of all; it reports whether every case passes or fails only where no
// bar pattern helps.
func (cs *caseSet) trial(d *Design, p detail.Pattern) bool {
	keep := d.Status == StatusPass || d.failsOnlyOnFixed()
	for k, c := range cs.all {
		if k == cs.lead {
			continue
		}
		o := c.trial(p, nil)
		if o.Status != StatusPass {
			d.Status = StatusFail
			keep = keep && o.failsOnlyOnFixed()
		}
		if o.Utilization > d.Utilization {
			d.Utilization, d.Governing = o.Utilization, o.Governing
		}
	}
	return keep
}

// caseDesign is the full evaluation of one case with the bars of the lift.
type caseDesign struct {
	c *common
	d Design
}

// governing evaluates pattern p in full for every case (lead, the lead's, given) and returns
// the index of the governing case, the one of the highest utilisation (the first of equals),
// and every case's design.
func (cs *caseSet) governing(lead Design, p detail.Pattern, given bool) (int, []caseDesign) {
	// One link arrangement for every case: where another case's shear needs closer links,
	// a case takes them over (and is evaluated again if it is the lead).
	demand := make([]float64, len(cs.all))
	least := math.Inf(1)
	for k, c := range cs.all {
		if demand[k] = c.shearDemand(p); demand[k] < least {
			least = demand[k]
		}
	}
	out := make([]caseDesign, len(cs.all))
	g := cs.lead
	for k, c := range cs.all {
		c.shearCap = nil
		if least < demand[k] {
			for j := range cs.all {
				if demand[j] == least {
					c.shearCap = &shearCap{s: least, name: cs.storeys[j].Cases[0].Name}
					break
				}
			}
		}
		d := lead
		if k != cs.lead || c.shearCap != nil {
			d = c.evaluate(p, given, true)
		}
		out[k] = caseDesign{c, d}
	}
	for k := range out {
		if out[k].d.Utilization > out[g].d.Utilization || out[k].d.Utilization == out[g].d.Utilization && k < g {
			g = k
		}
	}
	return g, out
}

// attach records every case of the lift in design d, the governing case g's, finished: each
// case's results, the other cases' steps under their prefixes, the largest As,min, and the
// status and reasons of the whole.
func (cs *caseSet) attach(d Design, g int, all []caseDesign) Design {
	st := cs.storeys[g].Cases[0]
	d.GoverningCase = st.Name
	l := &trace.Log{Steps: d.Steps, Group: "Load cases"}
	asMin := make([]trace.Arg, len(all))
	for k, cd := range all {
		c := cs.storeys[k].Cases[0]
		own := &cd.d
		if k == g {
			own = &d // the governing case's design, finished
		}
		r := CaseResult{Name: c.Name, File: c.File, Line: c.Line, NEd: c.NEd, Y: own.Y, Z: own.Z,
			Utilization: own.Utilization, Status: own.Status, Governing: own.Governing}
		if k != g {
			r.Prefix = CasePrefix(k)
			for _, s := range cd.d.Steps {
				l.Steps = append(l.Steps, prefixed(s, r.Prefix, "Case "+c.Name+": "))
			}
			if cd.d.Status != StatusPass {
				d.Status = StatusFail
				for _, why := range cd.d.Reasons {
					d.Reasons = append(d.Reasons, "Case "+c.Name+": "+why)
				}
			}
		}
		d.Cases = append(d.Cases, r)
		asMin[k] = trace.A("A_s_min_"+strconv.Itoa(k+1), trace.Q{V: cd.c.asMin.V, Symbol: "A_s,min," + c.Name, Unit: "mm2", From: r.Prefix + "det/As_min"})
	}
	d.AsMin = l.Add(extremeStep("cases/As_min", "Minimum reinforcement, the largest of the load cases", "EN 1992-1-1:2004 9.5.2(2)",
		"A_s,min", "mm2", true, asMin)).V
	d.Steps = l.Steps
	return d
}

// prefixed returns step s of a case that does not govern as the design's trace holds it: its ID
// and the sources of its arguments within the lift under prefix, its section headed by group.
func prefixed(s trace.Step, prefix, group string) trace.Step {
	s = underPrefix(s, prefix, false)
	s.Group = group + s.Group
	return s
}

// oneCase records the single case of a lift given without several cases in design d.
func oneCase(d Design, st *model.Storey) Design {
	c := model.Case{Name: "1", NEd: st.NEd}
	if len(st.Cases) == 1 {
		c = st.Cases[0]
	}
	d.GoverningCase = c.Name
	d.Cases = []CaseResult{{Name: c.Name, File: c.File, Line: c.Line, NEd: d.NEd, Y: d.Y, Z: d.Z,
		Utilization: d.Utilization, Status: d.Status, Governing: d.Governing}}
	return d
}

// settleCases completes the design lead of the lead case c with pattern p for every case of
// the lift: the governing case's design, with the rules of practice of the choice ch where
// the bars were chosen (nil for given bars), finished, and every case attached.
func (c *common) settleCases(lead Design, p detail.Pattern, given bool, practice func(g *common, d *Design)) Design {
	cs := c.cases
	g, all := cs.governing(lead, p, given)
	d := all[g].d
	if practice != nil {
		practice(all[g].c, &d)
	}
	d = all[g].c.finish(d)
	return cs.attach(d, g, all)
}
