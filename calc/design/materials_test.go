package design

import (
	"math"
	"reflect"
	"testing"

	"colsheet/calc/material"
	"colsheet/calc/model"
)

func mustClass(t *testing.T, name string) material.Concrete {
	t.Helper()
	c, ok := material.Lookup(name)
	if !ok {
		t.Fatalf("no class %s", name)
	}
	return c
}

// zonedBuilding is generatedBuilding (project class C40/50) with C30/37 at the top level and
// C50/60 for column B2 at L1, durability and creep data; invented numbers, test input only.
func zonedBuilding(t *testing.T) *model.Input {
	in := generatedBuilding(3, 2, model.AnalysisSubframe)
	in.Building.Concrete = []model.ConcreteZone{
		{Levels: []string{"L3"}, Class: mustClass(t, "C30/37")},
		{Columns: []string{"B2"}, Levels: []string{"L1"}, Class: mustClass(t, "C50/60")},
	}
	in.Building.Options.Creep = &model.Creep{RH: 60, T0: 28, Cement: "N"}
	in.Options.Durability = &model.Durability{Exposure: []string{"XC2"}}
	return in
}

// Each lift is designed with the concrete of its class, whose materials the project basis records
// once: fcd = αcc·fck/γc with αcc = 1, γc = 1.5 (EN 1992-1-1:2004 3.1.6(1), Eq. (3.15); Table
// 2.1N); fcm = fck + 8 (Table 3.1); the lap length of φ20 in good bond with all bars lapped,
// l0 = α6·(φ/4)·(fyd/fbd), fbd = 2.25·η1·η2·fctd, fctd = 0.7·fctm/γc, fctm = 0.30·fck^(2/3),
// α6 = 1.5 (8.4.2(2), Eq. (8.2); 8.4.3(2), Eq. (8.3); 8.7.3(1), Eq. (8.10), Table 8.3; Table 3.1).
func TestLiftConcreteClass(t *testing.T) {
	r := mustRun(t, zonedBuilding(t))
	checkBasis(t, r)
	lap := func(fck float64) float64 {
		fctd := 0.7 * 0.30 * math.Pow(fck, 2.0/3) / 1.5
		return 1.5 * 20 / 4 * (500 / 1.15) / (2.25 * fctd)
	}
	for _, w := range []struct {
		id   string
		want float64
	}{
		{"basis/mat/C40-50/f_cd", 40 / 1.5}, {"basis/mat/C30-37/f_cd", 20}, {"basis/mat/C50-60/f_cd", 50 / 1.5},
		{"basis/lap/phi20/l0", lap(40)}, {"basis/lap/C30-37/phi20/l0", lap(30)}, {"basis/lap/C50-60/phi20/l0", lap(50)},
		{"basis/creep/RH60-t28-N/fcm", 48}, {"basis/creep/RH60-t28-N/C30-37/fcm", 38}, {"basis/creep/RH60-t28-N/C50-60/fcm", 58},
		{"basis/shear/C30-37/nu_1", 0.6 * (1 - 30.0/250)}, // EN 1992-1-1:2004 6.2.3(3), Eq. (6.6N)
	} {
		near(t, w.id, basisValue(t, r, w.id), w.want, 1e-12)
	}
	basisStep(t, r, "basis/cover/XC2/C30-37/c_min_dur")
	for _, d := range r.Designs {
		class, fck := "C40-50", 40.0
		switch {
		case d.Storey == "L3":
			class, fck = "C30-37", 30
		case d.Column == "B2" && d.Storey == "L1":
			class, fck = "C50-60", 50
		}
		if d.Fck != fck {
			t.Errorf("%s/%s: fck %g, want %g", d.Column, d.Storey, d.Fck, fck)
		}
		refers := map[string]bool{}
		for _, s := range d.Trace() {
			for _, a := range s.Args {
				refers[a.From] = true
			}
		}
		for _, id := range []string{"basis/mat/" + class + "/f_cd", "basis/creep/RH60-t28-N/" + map[bool]string{true: "", false: class + "/"}[class == "C40-50"] + "fcm"} {
			if !refers[id] && !refers["/"+id] {
				t.Errorf("%s/%s: no reference to %s", d.Column, d.Storey, id)
			}
		}
		lapID := "basis/lap/" + class + "/phi" + num(d.Bars.Dia) + "/l0"
		if class == "C40-50" {
			lapID = "basis/lap/phi" + num(d.Bars.Dia) + "/l0"
		}
		if l := d.Detailing.LapLength; l != basisValue(t, r, lapID) {
			t.Errorf("%s/%s: lap length %g is not the basis's %s", d.Column, d.Storey, l, lapID)
		}
	}
}

// The project's class keeps its basis steps and IDs: the basis of the building without concrete
// zones is, step for step and in order, within the basis with them (outputs of inputs without
// zones do not change).
func TestDefaultClassBasisStable(t *testing.T) {
	for _, so := range []string{model.SecondOrderCurvature, model.SecondOrderBoth} {
		for _, block := range []string{model.ParabolaRectangle, model.Rectangular} {
			plain := zonedBuilding(t)
			plain.Building.Concrete = nil
			zoned := zonedBuilding(t)
			for _, in := range []*model.Input{plain, zoned} {
				in.Options.SecondOrder, in.Options.StressBlock = so, block
			}
			a, b := newBasis(plain).public(), newBasis(zoned).public()
			k := 0
			for _, s := range b {
				if k < len(a) && reflect.DeepEqual(s, a[k]) {
					k++
				}
			}
			if k != len(a) {
				t.Errorf("%s, %s: basis step %s of the project's class is not kept in the zoned basis", so, block, a[k].ID)
			}
			if len(b) <= len(a) {
				t.Errorf("%s, %s: the zoned basis records no other class", so, block)
			}
			if so == model.SecondOrderBoth {
				near(t, "Ecm of C30/37", basisValue(t, &Result{Basis: b}, "basis/mat/C30-37/E_cm"), mustClass(t, "C30/37").Ecm, 1e-12)
			}
		}
	}
}

// A building whose every member is of one class by concrete zones designs as the same building
// with that class as the project's: the lift's class reaches the materials, the section (its
// strains, n, λ and η differ above C50/60, EN 1992-1-1:2004 Table 3.1), the laps and the result
// (common practice, no source: one class, one design).
func TestZonedClassDesignsAsProjectClass(t *testing.T) {
	for _, name := range []string{"C50/60", "C70/85"} {
		for _, block := range []string{model.ParabolaRectangle, model.Rectangular} {
			c := mustClass(t, name)
			zoned := generatedBuilding(2, 2, model.AnalysisSubframe)
			zoned.Building.Concrete = []model.ConcreteZone{{Class: c}}
			zoned.Building.BeamConcrete = &c
			project := generatedBuilding(2, 2, model.AnalysisSubframe)
			project.Materials.Concrete = c
			zoned.Options.StressBlock, project.Options.StressBlock = block, block
			a, b := mustRun(t, zoned), mustRun(t, project)
			checkBasis(t, a)
			for k := range b.Designs {
				x, y := a.Designs[k], b.Designs[k]
				what := name + ", " + block + ", " + x.Column + "/" + x.Storey
				if x.Fck != c.Fck || x.Fck != y.Fck || x.AsProv != y.AsProv || x.Bars.Count != y.Bars.Count || x.Bars.Dia != y.Bars.Dia ||
					x.Detailing.LapLength != y.Detailing.LapLength || x.Status != y.Status {
					t.Errorf("%s: zoned fck %g As %g lap %g, project class fck %g As %g lap %g", what, x.Fck, x.AsProv, x.Detailing.LapLength, y.Fck, y.AsProv, y.Detailing.LapLength)
				}
				near(t, what+" utilisation", x.Utilization, y.Utilization, 1e-9)
				near(t, what+" MRd,y", x.Y.MRd, y.Y.MRd, 1e-9)
				near(t, what+" NRd,max", x.NRdMax, y.NRdMax, 1e-9)
			}
		}
	}
}
