package shear

import (
	"testing"

	"colsheet/calc/trace"
)

// AxisValue gives exactly the values that Axis records, for sections with and without links
// needed, in compression and in tension, with αcw from the axial stress and without (common
// practice, no source: both run one set of formulas). The inputs are test data.
func TestAxisValueMatchesAxis(t *testing.T) {
	q := func(v float64) trace.Q { return trace.Q{V: v} }
	for _, axial := range []bool{false, true} {
		for _, fck := range []float64{25, 30, 50, 70} {
			p := Recommended(&trace.Log{}, "", q(1.5), q(fck))
			p.AxialStress = axial
			fcd := 0.85 * fck / 1.5
			for _, nEd := range []float64{-600e3, -50e3, 0, 300e3, 1500e3, 4000e3, 9000e3} {
				for _, vEd := range []float64{0, 40e3, 150e3, 400e3, 900e3, 2500e3} {
					for _, sec := range [][3]float64{{300, 400, 942}, {450, 450, 1473}, {250, 600, 402}} {
						bw, depth, asl := sec[0], sec[1]-55, sec[2]
						in := Input{BW: q(bw), D: q(depth), Asl: q(asl), NEd: q(nEd), Ac: q(sec[0] * sec[1]), Fck: q(fck), Fcd: q(fcd),
							Fywd: q(434.78), Asw: q(100.5), VEd: q(vEd)}
						l := &trace.Log{}
						want := Axis(l, "", in, p)
						got := AxisValue(Values{BW: bw, D: depth, Asl: asl, NEd: nEd, Ac: sec[0] * sec[1], Fck: fck, Fcd: fcd, Fywd: 434.78, Asw: 100.5, VEd: vEd}, p)
						if got.VRdc != want.VRdc.V || got.Needed != want.Needed {
							t.Fatalf("fck %g N %g V %g: VRd,c %v %v, want %v %v", fck, nEd, vEd, got.VRdc, got.Needed, want.VRdc.V, want.Needed)
						}
						if !got.Needed {
							if got.Check != want.Check.V {
								t.Errorf("fck %g N %g V %g: check %v, want %v", fck, nEd, vEd, got.Check, want.Check.V)
							}
							continue
						}
						for _, v := range [][2]float64{{got.Z, want.Z.V}, {got.CotTheta, want.CotTheta.V}, {got.VRdMax, want.VRdMax.V},
							{got.MaxCheck, want.MaxCheck.V}, {got.SReq, want.SReq.V}} {
							if v[0] != v[1] {
								t.Errorf("fck %g N %g V %g axial %v: %v, want %v", fck, nEd, vEd, axial, v[0], v[1])
							}
						}
						for _, s := range []float64{0, 75, 200} {
							vRds, check := WithLinks(&trace.Log{}, "", in, want, q(s))
							gv := VRdsValue(100.5, s, got.Z, 434.78, got.CotTheta)
							if gv != vRds.V || LinksCheckValue(vEd, got.VRdc, gv) != check.V {
								t.Errorf("fck %g N %g V %g s %g: VRd,s %v, want %v", fck, nEd, vEd, s, gv, vRds.V)
							}
						}
					}
				}
			}
		}
	}
}
