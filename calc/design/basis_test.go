package design

import (
	"math"
	"path"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// projectLevel lists, as path patterns over a step's own ID, the steps of a lift that hold for the
// whole project: the project basis records them once, and no lift may record them again.
var projectLevel = []string{
	"mat/*", "code/*", "space/dg", "*/m", "*/alpha_m",
	"td/rho", "td/*/gamma_*", "td/*/xi", "td/*/psi0_*", "qp/psi2_*", "arr/*/*/NEd/gamma_*", "arr/*/*/NEd/psi0_*", "arr/*/*/NEd/xi",
	"creep/fcm", "creep/RH", "creep/t0T", "creep/alpha", "creep/alpha_1", "creep/alpha_2", "creep/beta_fcm", "creep/t0", "creep/beta_t0",
	"cover/class", "cover/c_min_dur", "cover/dc_dur_gamma", "cover/dc_dev",
	"lap/fctm", "lap/sigma_sd", "lap/fctk005", "lap/fctd", "lap/eta1", "lap/rho1", "lap/alpha6",
	"lap/eta2", "lap/fbd", "lap/lb_rqd", "lap/l0_min", "lap/l0",
}

// checkBasis asserts the contract of the project basis (DESIGN.md, project-level steps): every
// basis step has an ID basis/<part>/<name> of its own and reproduces itself, its references name
// earlier basis steps, no lift records a project-level step again, and every reference of every
// lift names a step of its own trace, of another lift or of the basis whose value it carries.
func checkBasis(t *testing.T, r *Result) {
	t.Helper()
	value := map[string]float64{}
	for _, s := range r.Basis {
		if !strings.HasPrefix(s.ID, BasisPrefix) || strings.Count(s.ID, "/") < 2 {
			t.Errorf("basis step %s: not an ID basis/<part>/<name>", s.ID)
		}
		if _, dup := value[s.ID]; dup {
			t.Errorf("basis step %s recorded twice", s.ID)
		}
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
		if !trace.ClauseForm(s.Clause) {
			t.Errorf("basis step %s: clause %q", s.ID, s.Clause)
		}
		for _, a := range s.Args {
			if v, ok := value[a.From]; a.From != "" && (!ok || math.Abs(v-a.Value) > 1e-12*math.Max(1, math.Abs(v))) {
				t.Errorf("basis step %s: argument %s from %q, not an earlier basis step of its value", s.ID, a.Name, a.From)
			}
		}
		value[s.ID] = s.Value
	}
	for _, d := range r.Designs {
		for _, s := range d.Trace() {
			value[s.ID] = s.Value
		}
	}
	for _, d := range r.Designs {
		for _, s := range d.Steps {
			for _, p := range projectLevel {
				if ok, _ := path.Match(p, s.ID); ok {
					t.Errorf("%s/%s: step %s holds for the whole project but is recorded on the lift", d.Column, d.Storey, s.ID)
				}
			}
		}
		for _, s := range d.Trace() {
			for _, a := range s.Args {
				if a.From == "" {
					continue
				}
				v, ok := value[a.From]
				if !ok {
					t.Errorf("step %s: argument %s refers to %s, which neither a design nor the basis holds", s.ID, a.Name, a.From)
				} else if math.Abs(v-a.Value) > 1e-9*math.Max(1, math.Abs(v)) {
					t.Errorf("step %s: argument %s = %g, its step %s records %g", s.ID, a.Name, a.Value, a.From, v)
				}
			}
		}
	}
}

// basisValue returns the value of the basis step id of r, or fails the test.
func basisValue(t *testing.T, r *Result, id string) float64 {
	t.Helper()
	return basisStep(t, r, id).Value
}

// The project basis of a building holds each project value once, by hand from the standards, and
// the lifts refer to it: fcd = αcc·fck/γc = 30/1.5 = 20 MPa (EN 1992-1-1:2004 3.1.6(1), Eq. (3.15),
// αcc = 1 and γc = 1.5 recommended, Table 2.1N); fyd = 500/1.15 (3.2.7(2)); γG = 1.35, γQ = 1.5
// (EN 1990:2002 Table A1.2(B)); ψ0 = 0.7, ψ2 = 0.3 for category B (EN 1990:2002 Table A1.1);
// cmin,dur = 25 mm for XC2 at S4, C30/37 being below the C35/45 that would reduce the class
// (EN 1992-1-1:2004 Tables 4.3N and 4.4N, from memory); the lap length of φ20 in good bond with all bars lapped, l0 = α6·(φ/4)·(fyd/fbd),
// fbd = 2.25·η1·η2·fctd, fctd = 0.7·fctm/γc, fctm = 0.30·fck^(2/3), α6 = 1.5 (8.4.2(2), Eq. (8.2);
// 8.4.3(2), Eq. (8.3); 8.7.3(1), Eq. (8.10), Table 8.3; Table 3.1).
func TestBasisOnce(t *testing.T) {
	in := generatedBuilding(3, 2, model.AnalysisSubframe)
	c, _ := lookupClass("C30/37")
	in.Materials.Concrete = c
	in.Building.Options.Creep = &model.Creep{RH: 60, T0: 28, Cement: "N"}
	in.Options.Durability = &model.Durability{Exposure: []string{"XC2"}}
	r := mustRun(t, in)
	checkBasis(t, r)
	fyd := 500 / 1.15
	fctd := 0.7 * 0.30 * math.Pow(30, 2.0/3) / 1.5
	l0 := 1.5 * 20 / 4 * fyd / (2.25 * fctd)
	for _, w := range []struct {
		id   string
		want float64
	}{
		{"basis/mat/C30-37/f_cd", 20}, {"basis/mat/steel/f_yd", fyd}, {"basis/code/gamma_G", 1.35}, {"basis/code/gamma_Q", 1.5},
		{"basis/psi/B/psi0", 0.7}, {"basis/psi/B/psi2", 0.3}, {"basis/cover/XC2/c_min_dur", 25}, {"basis/lap/phi20/l0", l0},
		{"basis/creep/RH60-t28-N/fcm", 38},
	} {
		near(t, w.id, basisValue(t, r, w.id), w.want, 1e-12)
	}
	// Each once, however many lifts use it: 3 storeys × 9 columns.
	if len(r.Designs) != 27 {
		t.Fatalf("%d designs", len(r.Designs))
	}
	uses := map[string]int{}
	for _, d := range r.Designs {
		for _, s := range d.Trace() {
			for _, a := range s.Args {
				uses[a.From]++
			}
		}
		if l := d.Detailing.LapLength; l != basisValue(t, r, "basis/lap/phi"+num(d.Bars.Dia)+"/l0") {
			t.Errorf("%s/%s: lap length %g is not the basis's for φ%g", d.Column, d.Storey, l, d.Bars.Dia)
		}
	}
	for _, id := range []string{"basis/mat/C30-37/f_cd", "basis/code/gamma_G", "basis/psi/B/psi2", "basis/cover/XC2/c_min_dur", "basis/creep/RH60-t28-N/beta_t0"} {
		if uses[id] < len(r.Designs) {
			t.Errorf("%s used %d times by %d lifts", id, uses[id], len(r.Designs))
		}
	}
	// An override is the project's: the basis records it once, with its caution, and fcd follows.
	in.Code, _ = in.Code.Override("gamma_c", 1.4)
	r = mustRun(t, in)
	checkBasis(t, r)
	if s := basisStep(t, r, "basis/code/gamma_c"); s.Value != 1.4 || len(s.Cautions()) == 0 {
		t.Errorf("overridden γc: %+v", s)
	}
	near(t, "fcd with γc = 1.4", basisValue(t, r, "basis/mat/C30-37/f_cd"), 30/1.4, 1e-12)
}

// The actions form with creep data per lift: one basis set per distinct data (RH, t0, cement),
// each lift referring to its own (EN 1992-1-1:2004 Annex B; fcm = fck + 8, Table 3.1).
func TestBasisCreepSets(t *testing.T) {
	a, b := lift(5000, 5000, 1200, 40, 20, 10, 5), lift(5000, 5000, 1000, 40, 20, 10, 5)
	a.Creep = &model.Creep{RH: 50, T0: 28, Ratio: 0.7}
	b.Creep = &model.Creep{RH: 80, T0: 28, Cement: "R", Ratio: 0.7}
	b.Name = "L2"
	c := lift(5000, 5000, 900, 40, 20, 10, 5)
	c.Name, c.Creep = "L3", &model.Creep{RH: 50, T0: 28, Cement: "N", Ratio: 0.6}
	col := model.Column{ID: "CR", B: 300, H: 400, Cover: 35, Storeys: []model.Storey{a, b, c}}
	r := mustRun(t, newInput("C40/50", model.ParabolaRectangle, model.ImperfInclination, col))
	checkBasis(t, r)
	near(t, "fcm", basisValue(t, r, "basis/creep/RH50-t28-N/fcm"), 48, 0)
	near(t, "RH", basisValue(t, r, "basis/creep/RH80-t28-R/RH"), 80, 0)
	for i, want := range []string{"/basis/creep/RH50-t28-N/RH", "/basis/creep/RH80-t28-R/RH", "/basis/creep/RH50-t28-N/RH"} {
		found := false
		for _, s := range r.Designs[i].Steps {
			for _, a := range s.Args {
				found = found || a.From == want
			}
		}
		if !found {
			t.Errorf("%s: no reference to %s", r.Designs[i].Storey, want)
		}
	}
}
