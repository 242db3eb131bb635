package archive

import (
	"fmt"
	"maps"
	"math"
	"slices"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/detail"
	"colsheet/calc/input"
	"colsheet/calc/trace"
)

// Problem is a fault of a package beyond its files and the reproduction of its steps: a contract
// value of results.json that is not the value of the step producing it, a sheet that prints
// another value than its step, an input step that the archived input does not give, a signature.
type Problem struct {
	Design  string // "COLUMN/LIFT", or "" for the package as a whole
	Key     string // the contract key, the sheet or the step concerned
	Problem string
}

func (r *Report) problem(d *resultsCase, key, format string, a ...any) {
	name := ""
	if d != nil {
		name = d.Column + "/" + d.Lift
	}
	r.Problems = append(r.Problems, Problem{Design: name, Key: key, Problem: fmt.Sprintf(format, a...)})
}

// tie names the one step that produces a contract value of results.json.
type tie struct {
	key   string   // the key in results.json
	v     float64  // its value there
	scale float64  // from the unit of results.json to the engine unit of the step
	ids   []string // the producing step's ID below COLUMN/LIFT/: the first of these the trace holds
}

// ties lists every numeric contract value of d with the step that produces it.
func ties(d *resultsCase) []tie {
	ts := []tie{
		{"b_mm", d.B, 1, []string{"geo/b", "geo/D"}},
		{"h_mm", d.H, 1, []string{"geo/h", "geo/D"}},
		{"NEd_kN", d.NEd, 1e3, []string{"act/NEd", "td/NEd"}},
		{"As_min_mm2", d.AsMin, 1, []string{"cases/As_min", "det/As_min"}},
		{"As_max_mm2", d.AsMax, 1, []string{"det/As_max"}},
	}
	for _, a := range []struct {
		n  string
		ax *resultsAxis
	}{{"y", &d.Axes.Y}, {"z", &d.Axes.Z}} {
		ts = append(ts,
			tie{"axes." + a.n + ".MEd_kNm", a.ax.MEd, 1e6, []string{a.n + "/MEd", a.n + "/MEd_curv", a.n + "/MEd_stiff"}},
			tie{"axes." + a.n + ".MRd_kNm", a.ax.MRd, 1e6, []string{a.n + "/MRd", a.n + "/sec/M_Rd", "sec/M_Rd"}})
	}
	for k, c := range d.Cases {
		key, pre := fmt.Sprintf("cases[%d].", k), c.Prefix
		ts = append(ts, tie{key + "NEd_kN", c.NEd, 1e3, []string{pre + "act/NEd", pre + "td/NEd"}})
		for _, a := range []struct {
			n  string
			ax *resultsAxis
		}{{"y", &c.Axes.Y}, {"z", &c.Axes.Z}} {
			ts = append(ts,
				tie{key + "axes." + a.n + ".MEd_kNm", a.ax.MEd, 1e6, []string{pre + a.n + "/MEd", pre + a.n + "/MEd_curv", pre + a.n + "/MEd_stiff"}},
				tie{key + "axes." + a.n + ".MRd_kNm", a.ax.MRd, 1e6, []string{pre + a.n + "/MRd", pre + a.n + "/sec/M_Rd", pre + "sec/M_Rd"}})
		}
	}
	return append(ts,
		tie{"cover_mm", d.Cover, 1, []string{"space/c_nom"}},
		tie{"As_prov_mm2", d.AsProv, 1, []string{"bars/As"}},
		tie{"As_req_mm2", d.AsReq, 1, []string{"req/As_req", "req/As"}},
		tie{"bars.count", float64(d.Bars.Count), 1, []string{"bars/count"}},
		tie{"bars.dia_mm", d.Bars.Dia, 1, []string{"bars/phi"}},
		tie{"links.dia_mm", d.Links.Dia, 1, []string{"links/phi_t"}},
		tie{"links.spacing_mm", d.Links.Spacing, 1, []string{"links/s"}},
		tie{"links.spacing_reduced_mm", d.Links.SpacingReduced, 1, []string{"links/s_zone"}},
	)
}

// noBars reports whether d is a design for which no bar pattern was found: its trace records
// no bars, and the values that depend on them are zero.
func noBars(d *resultsCase) bool {
	_, ok := d.step("bars/count")
	return !ok
}

// step returns the step of d with the ID COLUMN/LIFT/rel.
func (d *resultsCase) step(rel string) (trace.Step, bool) {
	if d.byID == nil {
		d.byID = map[string]int{}
		for i, s := range d.Trace {
			d.byID[s.ID] = i
		}
	}
	i, ok := d.byID[d.Column+"/"+d.Lift+"/"+rel]
	if !ok {
		return trace.Step{}, false
	}
	return d.Trace[i], true
}

// checkContract ties every contract value of each design to the one step that produces it: a
// value that differs from its step, or a step that is missing, is a problem naming the design,
// the key and both values. The bar positions are computed again from the bar and link steps by
// the engine's own geometry, the utilisation is the value of the check named as governing, and
// the status follows from the verdicts of the check steps.
func (r *Report) checkContract(res *results) {
	for i := range res.Designs {
		d := &res.Designs[i]
		none := noBars(d)
		for _, t := range ties(d) {
			s, id, ok := d.first(t.ids)
			if !ok {
				if none && (t.v == 0 || t.key == "cover_mm") {
					// No bar pattern fits: the values of the bars are 0, and the cover, which
					// only the bar steps record, is held to the archived input (checkInputs).
					continue
				}
				r.problem(d, t.key, "results.json says %.12g, but no step %s records it", t.v, strings.Join(t.ids, " or "))
				continue
			}
			if !near(t.v*t.scale, s.Value) {
				r.problem(d, t.key, "results.json says %.12g, its step %s records %.12g", t.v, id, s.Value/t.scale)
			}
		}
		r.checkPositions(d, none)
		r.checkUtilisation(d, none)
		r.checkStatus(d)
	}
}

// first returns the first step of ids (below COLUMN/LIFT/) that d holds, with its full ID.
func (d *resultsCase) first(ids []string) (trace.Step, string, bool) {
	for _, id := range ids {
		if s, ok := d.step(id); ok {
			return s, s.ID, true
		}
	}
	return trace.Step{}, "", false
}

// checkPositions computes the bar positions from the steps of the section, the cover, the link
// and the bar pattern by detail.Geometry.Positions, as the engine does, and compares them with
// bars.positions_mm.
func (r *Report) checkPositions(d *resultsCase, none bool) {
	if none {
		if len(d.Bars.Positions) != 0 {
			r.problem(d, "bars.positions_mm", "results.json lists %d bars, but the trace records no bar pattern", len(d.Bars.Positions))
		}
		return
	}
	if _, circle := d.step("geo/D"); circle {
		r.checkRing(d)
		return
	}
	var v [7]float64
	for k, id := range []string{"geo/b", "geo/h", "space/c_nom", "links/phi_t", "bars/nb", "bars/nh", "bars/phi"} {
		s, ok := d.step(id)
		if !ok {
			r.problem(d, "bars.positions_mm", "the step %s/%s/%s, which places the bars, is missing", d.Column, d.Lift, id)
			return
		}
		v[k] = s.Value
	}
	nb, nh := v[4], v[5]
	if nb != math.Trunc(nb) || nh != math.Trunc(nh) || nb < 2 || nh < 2 || nb > 1e4 || nh > 1e4 {
		r.problem(d, "bars.positions_mm", "the bars per face recorded (%g, %g) are not whole numbers of at least 2", nb, nh)
		return
	}
	p := detail.Pattern{Dia: v[6], NB: int(nb), NH: int(nh)}
	if s, ok := d.step("bars/count"); ok && s.Value != float64(p.Count()) {
		r.problem(d, "bars.count", "the step %s records %g bars, the bars per face (%d, %d) make %d", s.ID, s.Value, p.NB, p.NH, p.Count())
	}
	want := detail.Geometry{B: v[0], H: v[1], Cover: v[2], Link: v[3]}.Positions(p)
	r.comparePositions(d, want)
}

// comparePositions compares bars.positions_mm of d with the positions want that the bar steps give.
func (r *Report) comparePositions(d *resultsCase, want [][2]float64) {
	if len(d.Bars.Positions) != len(want) {
		r.problem(d, "bars.positions_mm", "results.json lists %d positions, the bar steps place %d bars", len(d.Bars.Positions), len(want))
		return
	}
	for i, w := range want {
		got := d.Bars.Positions[i]
		if math.Abs(got[0]-w[0]) > 1e-6 || math.Abs(got[1]-w[1]) > 1e-6 {
			r.problem(d, fmt.Sprintf("bars.positions_mm[%d]", i), "results.json says (%.12g, %.12g), the bar steps place it at (%.12g, %.12g)", got[0], got[1], w[0], w[1])
			return
		}
	}
}

// checkRing computes the positions of the bars of a circular section from the steps of the
// diameter, the cover, the link, the number of bars and their diameter by detail.Geometry.Positions,
// as the engine does, and compares them with bars.positions_mm.
func (r *Report) checkRing(d *resultsCase) {
	var v [5]float64
	for k, id := range []string{"geo/D", "space/c_nom", "links/phi_t", "bars/count", "bars/phi"} {
		s, ok := d.step(id)
		if !ok {
			r.problem(d, "bars.positions_mm", "the step %s/%s/%s, which places the bars, is missing", d.Column, d.Lift, id)
			return
		}
		v[k] = s.Value
	}
	if n := v[3]; n != math.Trunc(n) || n < detail.RingMin || n > 1e4 {
		r.problem(d, "bars.positions_mm", "the bars recorded on the circle (%g) are not a whole number of at least %d", n, detail.RingMin)
		return
	}
	want := detail.Geometry{B: v[0], H: v[0], Cover: v[1], Link: v[2], Circle: true}.Positions(detail.Pattern{Dia: v[4], Ring: int(v[3])})
	r.comparePositions(d, want)
}

// checkUtilisation ties the utilisation to the check step named by governing ("title (clause)").
func (r *Report) checkUtilisation(d *resultsCase, none bool) {
	var named []trace.Step
	for _, s := range d.Trace {
		if s.Kind != trace.KindCheck || s.Title == "" {
			continue
		}
		// The engine names the check "title (clause)", the title with its axis where it has one.
		if title, ok := strings.CutSuffix(d.Governing, " ("+s.Clause+")"); ok && strings.HasPrefix(title, s.Title) {
			named = append(named, s)
		}
	}
	if len(named) == 0 && none {
		// No bar pattern fits: the utilisation is the failed check that says so.
		for _, s := range d.Trace {
			if s.Kind == trace.KindCheck && s.Verdict == trace.Fail {
				named = append(named, s)
			}
		}
	}
	if len(named) == 0 {
		r.problem(d, "governing", "%q names no check step of the trace", d.Governing)
		return
	}
	for _, s := range named {
		if near(d.Utilization, s.Value) {
			return
		}
	}
	r.problem(d, "utilization", "results.json says %.12g, the governing check %s records %.12g", d.Utilization, named[0].ID, named[0].Value)
}

// checkStatus holds the status to the verdicts: a design fails if and only if one of its check
// steps fails or the steel area it needs lies beyond the search (the step req/As).
func (r *Report) checkStatus(d *resultsCase) {
	var failed []string
	for _, s := range d.Trace {
		if s.Kind == trace.KindCheck && s.Verdict == trace.Fail {
			failed = append(failed, s.ID)
		}
	}
	if s, ok := d.step("req/As"); ok {
		failed = append(failed, s.ID)
	}
	switch {
	case d.Status != design.StatusPass && d.Status != design.StatusFail:
		r.problem(d, "status", "%q is neither pass nor fail", d.Status)
	case d.Status == design.StatusPass && len(failed) > 0:
		r.problem(d, "status", "results.json says pass, but the check step %s fails", failed[0])
	case d.Status == design.StatusFail && len(failed) == 0:
		r.problem(d, "status", "results.json says fail, but no check step fails")
	}
}

// checkInputs reads the archived input again, designs it, and compares every input step
// (kind input, clause "input") of each design with the steps the input gives, by ID and value,
// and the project basis step by step; the status, utilisation and governing check as well.
func (r *Report) checkInputs(res *results, name string, data []byte, read func(string) ([]byte, error)) {
	in, err := input.ParseWith(name, data, read)
	if err != nil {
		r.problem(nil, "input", "the archived input cannot be read again: %v", err)
		return
	}
	again, err := design.Run(in)
	if err != nil {
		r.problem(nil, "input", "the archived input cannot be designed again: %v", err)
		return
	}
	want := map[string]trace.Step{}
	for _, s := range again.Basis {
		want[s.ID] = s
	}
	got := map[string]bool{}
	for _, s := range res.Basis {
		got[s.ID] = true
		w, ok := want[s.ID]
		switch {
		case !ok:
			r.problem(nil, s.ID, "the project basis holds this step; the archived input does not give it")
		case !near(s.Value, w.Value):
			r.problem(nil, s.ID, "results.json records %.12g, the archived input gives %.12g", s.Value, w.Value)
		}
	}
	for _, id := range slices.Sorted(maps.Keys(want)) {
		if !got[id] {
			r.problem(nil, id, "the archived input gives this project basis step; results.json does not hold it")
		}
	}
	designs := map[string]*design.Design{}
	for i := range again.Designs {
		a := &again.Designs[i]
		designs[a.Column+"/"+a.Storey] = a
	}
	seen := map[string]bool{}
	for i := range res.Designs {
		d := &res.Designs[i]
		key := d.Column + "/" + d.Lift
		a := designs[key]
		if a == nil {
			r.problem(d, "design", "the archived input gives no design of column %s, lift %s", d.Column, d.Lift)
			continue
		}
		seen[key] = true
		inputs := map[string]trace.Step{}
		for _, s := range a.Steps {
			if s.Kind == trace.KindInput && s.Clause == "input" {
				if !strings.HasPrefix(s.ID, key+"/") {
					s.ID = key + "/" + s.ID
				}
				inputs[s.ID] = s
			}
		}
		for _, s := range d.Trace {
			if s.Kind != trace.KindInput || s.Clause != "input" {
				continue
			}
			w, ok := inputs[s.ID]
			switch {
			case !ok:
				r.problem(d, s.ID, "an input step the archived input does not give")
			case !near(s.Value, w.Value):
				r.problem(d, s.ID, "results.json records %.12g, the archived input gives %.12g", s.Value, w.Value)
			}
			delete(inputs, s.ID)
		}
		for _, id := range slices.Sorted(maps.Keys(inputs)) {
			r.problem(d, id, "the archived input gives this input step; results.json does not hold it")
		}
		for _, c := range []struct {
			key       string
			got, want float64
		}{{"b_mm", d.B, a.B}, {"h_mm", d.H, a.H}, {"cover_mm", d.Cover, a.Cover}} {
			if !near(c.got, c.want) {
				r.problem(d, c.key, "results.json says %.12g, the archived input gives %.12g", c.got, c.want)
			}
		}
		if a.Status != d.Status || !near(a.Utilization, d.Utilization) || a.Governing != d.Governing {
			r.problem(d, "utilization", "the archived input designed again gives %s at %.12g (%s); results.json says %s at %.12g (%s)",
				a.Status, a.Utilization, a.Governing, d.Status, d.Utilization, d.Governing)
		}
	}
	for _, a := range again.Designs {
		if key := a.Column + "/" + a.Storey; !seen[key] {
			r.problem(nil, key, "the archived input gives this design; results.json does not hold it")
		}
	}
}
