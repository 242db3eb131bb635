package building

import (
	"fmt"
	"math"

	"colsheet/calc/frame"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// arrangement names a load arrangement of the frame analysis, EN 1992-1-1:2004 5.1.3.
type arrangement struct {
	name   string
	loaded func(k, m int) bool // whether beam k of the line at level m carries γG·Gk + γQ·Qk
}

var arrangements = []arrangement{
	{"all spans loaded", func(k, m int) bool { return true }},
	{"alternate spans loaded, pattern 1 (checkerboard)", func(k, m int) bool { return (k+m)%2 == 0 }},
	{"alternate spans loaded, pattern 2 (checkerboard)", func(k, m int) bool { return (k+m)%2 == 1 }},
}

const frameMethod = "direct stiffness method (slope-deflection equations, joint rotations only: braced, no sway), banded Cholesky factorisation (gonum)"

// frameEnds analyses every frame line of the building in each direction under the load
// arrangements and returns, for each column, the clockwise end moments of each lift's column:
// at each end the largest in magnitude among the arrangements.
func frameEnds(in *model.Input, g *Grid, levels []Level, cols map[[2]int][]Lift) (map[[2]int][][2]endQ, error) {
	b := in.Building
	p := in.Code
	e := in.Materials.Concrete.Ecm
	gG, gQ, gL := p.Get("gamma_G"), p.Get("gamma_Q"), p.Get("gamma_G_light")
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
			for ci, c := range colsOn {
				lifts := cols[at(c)]
				for m := 0; m < n; m++ {
					colMember[[2]int{ci, m}] = len(f.Members)
					f.Members = append(f.Members, frame.Member{I: node(ci, m-1), J: node(ci, m), EI: e * inPlaneI(lifts[m].Size, d), L: lifts[m].Height})
				}
			}
			type beamRef struct{ member, beam, level, k int }
			var beams []beamRef
			for m := 0; m < n; m++ {
				lv := &levels[m]
				k := 0
				for bi, bm := range lv.Beams {
					if bm.Dir != d || bm.Line != line {
						continue
					}
					ci0, ci1 := indexOf(colsOn, bm.From), indexOf(colsOn, bm.To)
					if ci0 < 0 || ci1 < 0 {
						continue
					}
					beams = append(beams, beamRef{len(f.Members), bi, m, k})
					f.Members = append(f.Members, frame.Member{I: node(ci0, m), J: node(ci1, m),
						EI: e * bm.Size.B * math.Pow(bm.Size.H, 3) / 12, L: bm.L})
					k++
				}
			}
			// Solve each arrangement.
			results := make([]frame.Result, len(arrangements))
			for a, arr := range arrangements {
				for _, br := range beams {
					ld := levels[br.level].Loads[br.beam]
					if arr.loaded(br.k, br.level) {
						f.Members[br.member].Loads = factored(ld, gG, gQ, true)
					} else {
						f.Members[br.member].Loads = factored(ld, gL, 0, false)
					}
				}
				r, err := f.Solve()
				if err != nil {
					return nil, fmt.Errorf("frame along %s on line %s: %v", d, g.lineName(d, line), err)
				}
				results[a] = r
			}
			// Record, for each column and lift, the governing end moments with the joint equilibrium.
			lineName := g.lineName(d, line)
			for ci, c := range colsOn {
				key := at(c)
				lifts := cols[key]
				for m := 0; m < n; m++ {
					mem := colMember[[2]int{ci, m}]
					l := &trace.Log{Steps: lifts[m].Steps}
					axis := d.Axis()
					l.Group = "Column moments about " + axis + ": frame along " + d.String() + " on line " + lineName
					// record adds the solve step of one end (0 bottom, 1 top) under arrangement a.
					record := func(endIdx, a int, suffix, extra string) trace.Q {
						r := results[a]
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
								v := r.End[mi][s]
								sum += v
								args = append(args, trace.A(name, trace.Const(v, "M_"+itoa(len(args)+1), "Nmm")))
							}
						}
						if f.Nodes[nd].Fixed {
							expr, sum = "0", 0 // a fixed base takes any moment: no equilibrium to state
						}
						st := trace.Solve("frm/"+d.String()+"/"+where+suffix, "Column moment at the "+where+" of the lift, clockwise (frame along "+d.String()+" on line "+lineName+")"+extra,
							"common practice (braced frame analysis)", "M_"+where[:1]+","+axis, "Nmm", r.End[mem][endIdx], frameMethod, expr, sum, args...).
							Note("Arrangement (EN 1992-1-1 5.1.3): " + arrangements[a].name + "; loaded spans γG·Gk + γQ·Qk, the others γG,light·Gk.").
							Note("The residual is the sum of the end moments of the members meeting at the joint (equilibrium).")
						return l.Add(st)
					}
					var q [2]trace.Q
					var best [2]int
					for endIdx := 0; endIdx < 2; endIdx++ {
						for a := range results {
							if math.Abs(results[a].End[mem][endIdx]) > math.Abs(results[best[endIdx]].End[mem][endIdx])*(1+1e-12) {
								best[endIdx] = a
							}
						}
						q[endIdx] = record(endIdx, best[endIdx], "", "")
					}
					e := endQ{top: q[1], bot: q[0]}
					if best[0] != best[1] {
						// The bottom under the top's own arrangement: one consistent load case.
						e.botAlt = record(0, best[1], "_alt", ", under the arrangement of the top")
					}
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
