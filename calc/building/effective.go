package building

import (
	"math"

	"colsheet/calc/model"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// rigidK and freeK stand for a fixed and a free end in the relative flexibility: the minimum of
// EN 1992-1-1:2004 5.8.3.2(3) and a value large enough to be free in Eq. (5.15).
const freeK = 1e9

// effectiveLengths records, for every lift of one column, the effective length about each axis by
// EN 1992-1-1:2004 Eq. (5.15) from the columns and beams at its two ends.
func effectiveLengths(in *model.Input, levels []Level, lifts []Lift) {
	b := in.Building
	kcr := in.Options.CrackedK
	if !(kcr > 0) {
		kcr = 0.5
	}
	eCol, eBeam := memberClasses(in, lifts)
	i, j := lifts[0].I, lifts[0].J
	// clear returns the clear height of lift c in the plane of direction d: the storey less the
	// deeper beam framing in at its top.
	clear := func(c int, d Dir) (float64, float64) {
		depth := 0.0
		left, right := levels[c].beamsAt(d, i, j)
		for _, k := range []int{left, right} {
			if k >= 0 {
				depth = math.Max(depth, levels[c].Beams[k].Size.H)
			}
		}
		return lifts[c].Height - depth, depth
	}
	for m := range lifts {
		l := &trace.Log{Steps: lifts[m].Steps}
		for d := DirX; d <= DirY; d++ {
			axis := d.Axis()
			l.Group = "Effective length about " + axis + " (frame along " + d.String() + ")"
			pre := "l0/" + axis + "/"
			kc := trace.Const(kcr, "k_cr", "")
			_, depth := clear(m, d)
			lc := l.Add(trace.Formula(pre+"l", "Clear height of the lift in this plane", "EN 1992-1-1:2004 5.8.3.2(3)", "l", "mm",
				lifts[m].Height-depth, "H - h_b", trace.A("H", trace.Const(lifts[m].Height, "H", "mm")), trace.A("h_b", trace.Const(depth, "h_b", "mm"))).
				Note("The storey height less the depth of the deeper beam framing in at the top in this plane."))
			// One end: the joint at level `at`, shared by the lifts `below` and `below+1`.
			end := func(name string, at int) trace.Q {
				var cols []trace.Q
				for _, c := range []int{at, at + 1} {
					if c < 0 || c >= len(lifts) {
						continue
					}
					lf := lifts[c]
					ei := eCol[c].Ecm * inPlaneI(lf.Size, d)
					hc, _ := clear(c, d)
					title := "Stiffness EI/l of the column over lift " + lf.Name
					if lf.Size.Shape == model.ShapeCircle {
						title = "Stiffness EI/l of the circular column over lift " + lf.Name + ", I = π·D⁴/64"
					}
					cols = append(cols, l.Add(trace.Formula(pre+name+"/col"+itoa(c+1), title, "EN 1992-1-1:2004 5.8.3.2(3)", "EI/l", "Nmm",
						ei/hc, "E * I / l", trace.A("E", ecmConst(in, eCol[c])), trace.A("I", trace.Const(inPlaneI(lf.Size, d), "I_c", "mm4")), trace.A("l", trace.Const(hc, "l", "mm")))))
				}
				var beams []trace.Q
				bl, br := levels[at].beamsAt(d, i, j)
				for _, k := range []int{bl, br} {
					if k < 0 {
						continue
					}
					bm := levels[at].Beams[k]
					ib := bm.Size.B * math.Pow(bm.Size.H, 3) / 12
					beams = append(beams, l.Add(trace.Formula(pre+name+"/"+bm.Name(), "Restraint k_cr·2EI/l of beam "+bm.Name()+", cracked", "EN 1992-1-1:2004 5.8.3.2(3)", "k_cr·2EI/l", "Nmm",
						kcr*2*eBeam.Ecm*ib/bm.L, "k_cr * 2 * E * I / L", trace.A("k_cr", kc), trace.A("E", ecmConst(in, eBeam)), trace.A("I", trace.Const(ib, "I_b", "mm4")), trace.A("L", trace.Const(bm.L, "L", "mm")))))
				}
				sc := l.Add(Sum(pre+name+"/Sc", "Columns at the joint", "EN 1992-1-1:2004 5.8.3.2(3)", "ΣEI/l", "Nmm", cols))
				if len(beams) == 0 {
					return l.Add(trace.Input(pre+name+"/k", "Relative flexibility at the "+name+": no restraining beam in this plane", "EN 1992-1-1:2004 5.8.3.2(3)", "k_"+name, "", freeK))
				}
				sb := l.Add(Sum(pre+name+"/Sb", "Restraining beams at the joint", "EN 1992-1-1:2004 5.8.3.2(3)", "Σk_cr·2EI/l", "Nmm", beams))
				st := slender.Flexibility(pre+name+"/k", sc, sb)
				st.Symbol = "k_" + name
				return l.Add(st)
			}
			top := end("top", m)
			var bot trace.Q
			switch {
			case m > 0:
				bot = end("bottom", m-1)
			case b.Base == model.BasePinned:
				bot = l.Add(trace.Input(pre+"bottom/k", "Relative flexibility at the base: pinned, no restraint", "EN 1992-1-1:2004 5.8.3.2(3)", "k_bottom", "", freeK))
			default:
				bot = l.Add(trace.Input(pre+"bottom/k", "Relative flexibility at the base: fixed, the recommended minimum", "EN 1992-1-1:2004 5.8.3.2(3), note", "k_bottom", "", slender.KMin))
			}
			st := slender.EffectiveLengthBraced(pre+"l0", lc, top, bot)
			st.Symbol = "l_0," + axis
			q := l.Add(st)
			lifts[m].Src.L0[d] = q
		}
		lifts[m].Steps = l.Steps
	}
}
