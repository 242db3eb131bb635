package building

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

const frameMethod = "direct stiffness method (slope-deflection equations, joint rotations only: braced, no sway), banded Cholesky factorisation (gonum)"

// superposed holds the solutions of one frame line under one load set: every beam and
// cantilever lightly loaded (base), and each one's added load alone (one case per beam, then one
// per cantilever), whose sums give the end moments of any arrangement (linear elasticity:
// superposition). The moments of the cantilevers on their joints go with each solution.
type superposed struct {
	base  frame.Result
	extra []frame.Result // by beam of the line, then by cantilever
	// baseJoint and extraJoint hold the cantilevers' moments on their joints (by cantilever of
	// the line) of the base and of each case; nil where the line has none.
	baseJoint  []float64
	extraJoint [][]float64
}

// envelope returns the end moment endIdx of member mem that is largest in magnitude over every
// arrangement of loaded and lightly loaded beams, and the beams it loads: those whose added
// load increases the moment's magnitude (EN 1992-1-1:2004 5.1.3(1)P; the envelope of all
// arrangements by superposition of single-span load cases).
func (sp superposed) envelope(mem, endIdx int) (float64, []bool) {
	pos, neg := sp.base.End[mem][endIdx], sp.base.End[mem][endIdx]
	for _, r := range sp.extra {
		if v := r.End[mem][endIdx]; v > 0 {
			pos += v
		} else {
			neg += v
		}
	}
	loaded := make([]bool, len(sp.extra))
	up := math.Abs(pos) >= math.Abs(neg)
	for k, r := range sp.extra {
		v := r.End[mem][endIdx]
		loaded[k] = (up && v > 0) || (!up && v < 0)
	}
	if up {
		return pos, loaded
	}
	return neg, loaded
}

// arrangement is the solution of a frame line under one arrangement: the end moments of every
// member and the moments of the cantilevers on their joints.
type arrangement struct {
	ends  [][2]float64
	joint []float64
}

// under returns the solution with the given beams and cantilevers loaded.
func (sp superposed) under(loaded []bool) arrangement {
	out := arrangement{ends: make([][2]float64, len(sp.base.End))}
	copy(out.ends, sp.base.End)
	if sp.baseJoint != nil {
		out.joint = append([]float64(nil), sp.baseJoint...)
	}
	for k, r := range sp.extra {
		if !loaded[k] {
			continue
		}
		for m := range out.ends {
			out.ends[m][0] += r.End[m][0]
			out.ends[m][1] += r.End[m][1]
		}
		if sp.extraJoint != nil {
			for c, v := range sp.extraJoint[k] {
				out.joint[c] += v
			}
		}
	}
	return out
}

// frameEnds analyses every frame line of the building in each direction and returns, for each
// column, the clockwise end moments of each lift's column: at each end the envelope over every
// arrangement of loaded and lightly loaded spans (by superposition), under the expression of
// the combination rule that gives the larger moment, and with γG,inf on every span for the least
// axial force.
func frameEnds(in *model.Input, g *Grid, levels []Level, cols map[[2]int][]Lift) (map[[2]int][][2]endQ, error) {
	b := in.Building
	if b.Analysis == model.AnalysisFrame && b.Options.BeamStiffnessGiven {
		return nil, fmt.Errorf("beam_stiffness is for the simplified subframe; the frame analysis takes the beams' own stiffness: leave it out, or use analysis: subframe or both")
	}
	sets := loadSets(in)
	n := len(b.Storeys)
	out := map[[2]int][][2]endQ{}
	for k := range cols {
		out[k] = make([][2]endQ, n)
	}
	for d := DirX; d <= DirY; d++ {
		lines, cross := g.NY, g.NX
		if d == DirY {
			lines, cross = g.NX, g.NY
		}
		for line := 0; line < lines; line++ {
			at := func(c int) [2]int {
				if d == DirX {
					return [2]int{c, line}
				}
				return [2]int{line, c}
			}
			var colsOn []int
			for c := 0; c < cross; c++ {
				if _, ok := cols[at(c)]; ok {
					colsOn = append(colsOn, c)
				}
			}
			if len(colsOn) == 0 {
				continue
			}
			// Nodes: for column c, node base then one per level.
			node := func(ci, m int) int { return ci*(n+1) + m + 1 } // m = -1 is the base
			f := frame.Frame{Nodes: make([]frame.Node, len(colsOn)*(n+1))}
			for ci := range colsOn {
				f.Nodes[node(ci, -1)] = frame.Node{Fixed: b.Base != model.BasePinned}
			}
			colMember := map[[2]int]int{} // (ci, m) → member index
			var eBeam float64
			for ci, c := range colsOn {
				lifts := cols[at(c)]
				eCol, beam := memberClasses(in, lifts)
				eBeam = beam.Ecm
				for m := 0; m < n; m++ {
					colMember[[2]int{ci, m}] = len(f.Members)
					f.Members = append(f.Members, frame.Member{I: node(ci, m-1), J: node(ci, m), EI: eCol[m].Ecm * inPlaneI(lifts[m].Size, d), L: lifts[m].Height})
				}
			}
			var beams []lineBeam
			for m := 0; m < n; m++ {
				lv := &levels[m]
				for bi, bm := range lv.Beams {
					if bm.Dir != d || bm.Line != line {
						continue
					}
					ci0, ci1 := indexOf(colsOn, bm.From), indexOf(colsOn, bm.To)
					if ci0 < 0 || ci1 < 0 {
						continue
					}
					beams = append(beams, lineBeam{len(f.Members), bi, m})
					f.Members = append(f.Members, frame.Member{I: node(ci0, m), J: node(ci1, m),
						EI: eBeam * bm.Size.B * math.Pow(bm.Size.H, 3) / 12, L: bm.L})
				}
			}
			lineName := g.lineName(d, line)
			solve := func() (frame.Result, error) {
				r, err := f.Solve()
				if err != nil {
					return r, fmt.Errorf("frame along %s on line %s: %v", d, lineName, err)
				}
				return r, nil
			}
			// Cantilever slabs beyond the line's ends act on the joints of the edge columns.
			var cants []cantJoint
			for ci, c := range colsOn {
				lifts := cols[at(c)]
				for m := 0; m < n; m++ {
					if e := lifts[m].Cantilever[d]; e.Clockwise != 0 {
						cants = append(cants, cantJoint{node: node(ci, m), member: colMember[[2]int{ci, m}], level: m, column: lifts[m].Column, load: edgeOf(e)})
					}
				}
			}
			lineNotes := concentratedNotes(levels, beams)
			// Solve each set: every beam and cantilever light, then each one's added load alone.
			sols := make([]superposed, len(sets))
			for si, st := range sets {
				for _, br := range beams {
					ld := levels[br.level].Loads[br.beam]
					f.Members[br.member].Loads = st.pieces(ld, false)
					f.Members[br.member].FEM = pointFEM(f.Members[br.member].L, st.points(ld, false))
				}
				base, jl, err := solveJoint(f, cants, func(k int) float64 { return cants[k].load.moment(st, false) }, solve)
				if err != nil {
					return nil, err
				}
				sols[si] = superposed{base: base, baseJoint: jl, extra: make([]frame.Result, len(beams)+len(cants))}
				if len(cants) > 0 {
					sols[si].extraJoint = make([][]float64, len(beams)+len(cants))
				}
				for _, br := range beams {
					f.Members[br.member].Loads, f.Members[br.member].FEM = nil, [2]float64{}
				}
				for k, br := range beams {
					ld := levels[br.level].Loads[br.beam]
					f.Members[br.member].Loads = st.extra(ld)
					f.Members[br.member].FEM = pointFEM(f.Members[br.member].L, st.extraPoints(ld))
					if sols[si].extra[k], _, err = solveJoint(f, nil, nil, solve); err != nil {
						return nil, err
					}
					f.Members[br.member].Loads, f.Members[br.member].FEM = nil, [2]float64{}
				}
				for k := range cants {
					one := func(c int) float64 {
						if c == k {
							return cants[k].load.extra(st)
						}
						return 0
					}
					r, jl, err := solveJoint(f, cants, one, solve)
					if err != nil {
						return nil, err
					}
					sols[si].extra[len(beams)+k], sols[si].extraJoint[len(beams)+k] = r, jl
				}
			}
			// describe names the loaded spans of an arrangement: those at the levels of the
			// lift's ends and next to them by name, the others by count.
			describe := func(loaded []bool, m int, st loadSet) string {
				byLevel := map[int][]string{}
				others := 0
				for k, br := range beams {
					if !loaded[k] {
						continue
					}
					if br.level < m-2 || br.level > m+1 {
						others++
						continue
					}
					byLevel[br.level] = append(byLevel[br.level], levels[br.level].Beams[br.beam].Name())
				}
				for k, cj := range cants {
					if !loaded[len(beams)+k] {
						continue
					}
					if cj.level < m-2 || cj.level > m+1 {
						others++
						continue
					}
					byLevel[cj.level] = append(byLevel[cj.level], "the cantilever slabs at "+cj.column)
				}
				var parts []string
				for lv := 0; lv < n; lv++ {
					if names := byLevel[lv]; len(names) > 0 {
						parts = append(parts, levels[lv].Name+": "+strings.Join(names, ", "))
					}
				}
				text := "none"
				if len(parts) > 0 {
					text = strings.Join(parts, "; ")
				}
				if others > 0 {
					text += " (and " + itoa(others) + " spans at other levels)"
				}
				return "Arrangement (EN 1992-1-1 5.1.3), the envelope of every arrangement by superposition of single-span load cases: loaded (" + st.loaded +
					") the spans whose load increases this moment, " + text + "; the others " + st.light + ". Factors of " + st.label + "."
			}
			// Record, for each column and lift, the governing end moments with the joint equilibrium.
			for ci, c := range colsOn {
				key := at(c)
				lifts := cols[key]
				for m := 0; m < n; m++ {
					mem := colMember[[2]int{ci, m}]
					l := &trace.Log{Steps: lifts[m].Steps}
					axis := d.Axis()
					l.Group = "Column moments about " + axis + ": frame along " + d.String() + " on line " + lineName
					classes := classesNote(in, lifts[m])
					// record adds the solve step of one end (0 bottom, 1 top) with the given
					// member end moments of one arrangement.
					record := func(endIdx int, arr arrangement, suffix, extra, note string) trace.Q {
						ends := arr.ends
						nd := f.Members[mem].I
						where := "bottom"
						if endIdx == 1 {
							nd, where = f.Members[mem].J, "top"
						}
						// Joint equilibrium at the node: the end moments of every member there.
						var args []trace.Arg
						expr := ""
						sum := 0.0
						for mi, mb := range f.Members {
							for s, nn := range []int{mb.I, mb.J} {
								if nn != nd {
									continue
								}
								name := "M" + itoa(len(args)+1)
								if expr != "" {
									expr += " + "
								}
								expr += name
								v := ends[mi][s]
								sum += v
								args = append(args, trace.A(name, trace.Const(v, "M_"+itoa(len(args)+1), "Nmm")))
							}
						}
						for k, cj := range cants {
							if cj.node == nd {
								expr += " + M_cant"
								sum += arr.joint[k]
								args = append(args, trace.A("M_cant", trace.Const(arr.joint[k], "M_cant", "Nmm")))
							}
						}
						if f.Nodes[nd].Fixed {
							expr, sum = "0", 0 // a fixed base takes any moment: no equilibrium to state
						}
						st := trace.Solve("frm/"+d.String()+"/"+where+suffix, "Column moment at the "+where+" of the lift, clockwise (frame along "+d.String()+" on line "+lineName+")"+extra,
							"common practice (braced frame analysis)", "M_"+where[:1]+","+axis, "Nmm", ends[mem][endIdx], frameMethod, expr, sum, args...).
							Note(note).
							Note("The residual is the sum of the end moments of the members meeting at the joint (equilibrium).")
						if strings.Contains(expr, "M_cant") {
							st = st.Note("M_cant is the moment of the cantilever slabs beyond the edge on the joint, clockwise, as a beam on their side: c·(f_G·M_G + Σf_Q·M_Q) loaded, c·f_L·M_G lightly loaded (c = +1 beyond the first grid line, −1 beyond the last).")
						}
						for _, n := range lineNotes {
							st = st.Note(n)
						}
						if classes != "" {
							st = st.Note(classes)
						}
						if b.Options.BeamStiffnessGiven {
							st = st.Note("The frame takes the beams' own stiffness EI: beam_stiffness applies to the simplified subframe only.")
						}
						return l.Add(st)
					}
					var q [2]trace.Q
					var arr [2][]bool
					var set [2]int
					for endIdx := 0; endIdx < 2; endIdx++ {
						best := -1.0
						for si := range mainSets(sets) {
							v, loaded := sols[si].envelope(mem, endIdx)
							if math.Abs(v) > best*(1+1e-12) {
								best, set[endIdx], arr[endIdx] = math.Abs(v), si, loaded
							}
						}
						sp := sols[set[endIdx]]
						q[endIdx] = record(endIdx, sp.under(arr[endIdx]), "", "", describe(arr[endIdx], m, sets[set[endIdx]]))
					}
					e := endQ{top: q[1], bot: q[0], set: set[1]}
					if set[0] != set[1] || !slices.Equal(arr[0], arr[1]) {
						// The bottom under the top's own arrangement: one consistent load case.
						e.botAlt = record(0, sols[set[1]].under(arr[1]), "_alt", ", under the arrangement of the top", describe(arr[1], m, sets[set[1]]))
					}
					// The least axial force: γG,inf on every span, the same envelope.
					l.Group = "Column moments about " + axis + ": frame along " + d.String() + " on line " + lineName + ", permanent load favourable (γG,inf, least axial force)"
					inf := sols[len(sets)-1]
					_, topArr := inf.envelope(mem, 1)
					infEnds := inf.under(topArr)
					note := describe(topArr, m, sets[len(sets)-1])
					e.minTop = record(1, infEnds, "_inf", ", permanent load favourable", note)
					e.minBot = record(0, infEnds, "_inf", ", permanent load favourable, under the arrangement of the top", note)
					lifts[m].Steps = l.Steps
					out[key][m][d] = e
				}
			}
		}
	}
	return out, nil
}

func indexOf(xs []int, v int) int {
	for i, x := range xs {
		if x == v {
			return i
		}
	}
	return -1
}

// lineBeam is a beam of a frame line: its member in the frame, its index in its level, the level.
type lineBeam struct{ member, beam, level int }

// cantJoint is a joint of a frame line on which cantilever slabs act: its node, the column
// member below it (which carries the moment into the solution), its level and column.
type cantJoint struct {
	node, member, level int
	column              string
	load                edgeLoad
}

// pointFEM returns the fixed-end moments of concentrated loads on a member of length l.
func pointFEM(l float64, ps []Point) [2]float64 {
	a, b := PointFixedEnd(l, ps)
	return [2]float64{a, b}
}

// solveJoint solves the frame with the moment load(k) of each cantilever k on its joint (none
// where load is nil) and returns the solution, with the column members' end moments free of
// them, and the moments on the joints. A moment on a joint enters the solution as a fixed-end
// moment added to one member end there (the column below), taken off again after the solution:
// the joint's equilibrium is then the members' end moments and the applied moment together.
func solveJoint(f frame.Frame, cants []cantJoint, load func(k int) float64, solve func() (frame.Result, error)) (frame.Result, []float64, error) {
	var jl []float64
	if load != nil && len(cants) > 0 {
		jl = make([]float64, len(cants))
		for k, c := range cants {
			jl[k] = load(k)
			f.Members[c.member].FEM[1] += jl[k]
		}
	}
	r, err := solve()
	for k, c := range cants {
		if jl == nil {
			break
		}
		f.Members[c.member].FEM[1] -= jl[k]
		if err == nil {
			r.End[c.member][1] -= jl[k]
		}
	}
	return r, jl, err
}

// concentratedNotes returns the notes that the frame's column moments carry where the beams of a
// line carry point loads of the input or columns stopping on them.
func concentratedNotes(levels []Level, beams []lineBeam) []string {
	var points, xfer bool
	for _, br := range beams {
		ld := levels[br.level].Loads[br.beam]
		points = points || len(ld.Points) > 0
		xfer = xfer || len(ld.Transfers) > 0
	}
	var out []string
	if points {
		out = append(out, "The point loads of the input on the beams enter as fixed-end moments P·a·b²/L² and P·a²·b/L² (handbook formula), factored as their span.")
	}
	if xfer {
		out = append(out, "The columns stopping on the beams enter as fixed-end moments P·a·b²/L² and P·a²·b/L² (handbook formula). "+transferNote)
	}
	return out
}
