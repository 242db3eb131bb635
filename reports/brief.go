package reports

import (
	"math"
	"path"
	"strings"

	"colsheet/calc/trace"
)

// Detail says how much of each design's trace a sheet prints.
type Detail string

const (
	// Brief prints the chain a checker follows: actions, imperfection, slenderness, second
	// order, design moments, resistance, the checks, bars, links, cover, fire and laps.
	Brief Detail = "brief"
	// Full prints every step of the trace (in HTML with the sub-steps folded).
	Full Detail = "full"
)

// Options are the choices of a rendering.
type Options struct {
	Detail   Detail    // Brief when empty
	Revision *Revision // the previous revision to mark changes against; nil for none
}

// Revision is the previous package a rendering marks its changes against.
type Revision struct {
	Against string             // the previous package, as named on the command line
	Old     map[string]float64 // every step value of the previous package, by full step ID
	Rows    []RevisionRow      // the revision table, in the order the checker reads it
}

// RevisionRow is one changed input or result: plain text, escaped by the printers.
type RevisionRow struct{ Column, Lift, Item, Old, New string }

// changed reports whether the step of full ID id with value v differs from the previous
// revision (or is new there); false without a revision.
func (o Options) changed(id string, v float64) bool {
	if o.Revision == nil {
		return false
	}
	old, ok := o.Revision.Old[id]
	if !ok {
		return true
	}
	return math.Abs(v-old) > 1e-9*math.Max(math.Max(math.Abs(v), math.Abs(old)), 1e-300)
}

func (o Options) full() bool { return o.Detail == Full }

// chain lists the steps a brief sheet prints besides every check: each entry is a path
// pattern (path.Match) over the step's own ID, without the column and lift.
var chain = []string{
	// Actions from the take-down and the moment analysis; the loads of columns stopping on the
	// level's beams (transfers), each with its source and caution.
	"td/NEd",
	"td/*/xfer/G", "td/*/xfer/Q*", "td/*/xfer/*/*/G", "td/*/xfer/*/*/Q*",
	"mom/*/top", "mom/*/bot", "mom/*/bot_alt",
	"frm/*/top", "frm/*/bottom", "frm/*/bottom_alt",
	"l0/*/l0",
	// The actions form.
	"act/NEd", "*/M_top", "*/M_bot",
	// The design chain.
	"creep/phi_ef",
	"*/M02", "*/M01", "*/ei", "*/M02i", "*/l0", "*/phi_ef",
	"*/lambda", "*/lambda_lim", "*/M0e",
	"*/e2", "*/M2", "*/MEd_curv", "*/NB", "*/MEd_stiff", "*/MEd",
	"sec/NRd_max", "sec/NRd_t", "*/sec/x", "*/sec/M_Rd",
	"bi/a", "bi/ratio", "bi/exact/check", "bi/exact/none",
	// Circular sections: the ring of bars, the direction of least resistance, its equilibrium and
	// the resultant moment.
	"bars/r_s", "space/gap_c", "sec/theta", "sec/x", "sec/M_Rd", "bi/M_Ed",
	// Steel, links, laps, ties.
	"bars/As",
	"links/s", "links/s_zone",
	// Shear and the load cases.
	"*/shear/V_Rdmax", "*/shear/s_req", "links/s_shear", "links/s_cases", // VEd and VRd,c stand in their check
	"cases/As_min",
	"lap/l0",
	// Fire.
	"fire/mu_fi", "fire/a", "fire/eq57/R", "fire/method", "fire/note",
	"req/As_req",
}

// briefStep reports whether a brief sheet prints step s (its ID without column and lift):
// every check, and the steps of the chain.
func briefStep(s trace.Step) bool {
	return s.Kind == trace.KindCheck || chainIndex.match(s.ID)
}

// chainIndex is chain compiled once, for briefStep.
var chainIndex = compileChain(chain)

// chainMatcher matches step IDs against a list of path patterns, as path.Match does with each
// in turn, without parsing the patterns again for every ID.
type chainMatcher struct {
	byLast map[string][]segPattern // patterns whose last segment is literal, by that segment
	other  []string                // patterns matched with path.Match
}

// segPattern is a pattern of '/'-separated segments, each literal or "*" (one segment of any
// text without '/', empty included).
type segPattern []string

// compileChain compiles the patterns: those made of literal and "*" segments only are indexed
// by their last segment; any other is kept for path.Match.
func compileChain(patterns []string) chainMatcher {
	m := chainMatcher{byLast: map[string][]segPattern{}}
	for _, p := range patterns {
		segs := strings.Split(p, "/")
		last := segs[len(segs)-1]
		if !plainSegments(segs) || last == "*" {
			m.other = append(m.other, p)
			continue
		}
		m.byLast[last] = append(m.byLast[last], segPattern(segs))
	}
	return m
}

// plainSegments reports whether every segment is "*" or free of pattern syntax.
func plainSegments(segs []string) bool {
	for _, s := range segs {
		if s != "*" && strings.ContainsAny(s, `*?[\`) {
			return false
		}
	}
	return true
}

// match reports whether id matches any of the patterns.
func (m chainMatcher) match(id string) bool {
	last := id[strings.LastIndexByte(id, '/')+1:]
	for _, p := range m.byLast[last] {
		if p.match(id) {
			return true
		}
	}
	for _, p := range m.other {
		if ok, _ := path.Match(p, id); ok {
			return true
		}
	}
	return false
}

// match reports whether id has as many segments as p, each equal to p's or matched by "*".
func (p segPattern) match(id string) bool {
	for k, seg := range p {
		i := strings.IndexByte(id, '/')
		if (i < 0) != (k == len(p)-1) {
			return false
		}
		part := id
		if i >= 0 {
			part, id = id[:i], id[i+1:]
		}
		if seg != "*" && seg != part {
			return false
		}
	}
	return true
}

// localID returns a full step ID without its column and lift.
func localID(full string) string {
	parts := strings.SplitN(full, "/", 3)
	if len(parts) < 3 {
		return full
	}
	return parts[2]
}

// shortClause drops the edition from a clause reference, and the name of EN 1992-1-1 itself,
// which the brief sheets state once: "EN 1992-1-1:2004 6.1(4)" reads "6.1(4)".
func shortClause(c string) string {
	c = strings.ReplaceAll(c, "EN 1992-1-1:2004 ", "")
	for _, ed := range []string{"EN 1992-1-2:2004", "EN 1990:2002", "EN 1991-1-1:2002"} {
		c = strings.ReplaceAll(c, ed, strings.SplitN(ed, ":", 2)[0])
	}
	return c
}
