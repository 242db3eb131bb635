package design

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// μfi of EN 1992-1-2:2004 5.3.2(3) takes NRd at the eccentricity of NEd, not the resistance to
// pure compression. A stocky 400 × 400 column, C30/37 with the rectangular block (η = 1,
// λ = 0.8, εcu3 = 3.5‰, EN 1992-1-1:2004 3.1.7(3), Table 3.1), 4 H25 with 35 mm cover to H8
// links (d′ = 55.5 mm), fyd = 500/1.15, fcd = 1.0·30/1.5 = 20 MPa (3.1.6(1), αcc = 1.0
// recommended), l0 = 1 m, ei = l0/400 = 2.5 mm (5.2(9)); NEd = 1000 kN with M = 232.5 kNm about y
// at both ends: e = 232.5 + 2.5 = 235 mm, held as N grows.
//
// By hand (equilibrium of the rectangular block, both bar layers yielding, concrete displaced by
// the compressed bars deducted, common practice): with y = λ·x the block depth and As = 981.7 mm²
// per layer, N = fcd·b·y − As·fcd and N·e = fcd·b·y·(h/2 − y/2) + As·(2·fyd − fcd)·(h/2 − d′),
// a quadratic in y. About z only the minimum eccentricity 20 mm (6.1(4)) acts, and (5.38b) holds
// (235/20 > 5), so y governs. The old μfi with NRd,max was about 0.18; this one is about 0.61.
func TestMuFiAtEccentricity(t *testing.T) {
	col := model.Column{ID: "MU", B: 400, H: 400, Cover: 35, LinkDia: 8, Bars: &model.BarSpec{Count: 4, Dia: 25},
		Fire:    &model.Fire{Rating: 60, UseMuFi: true},
		Storeys: []model.Storey{lift(1000, 1000, 1000, 232.5, 232.5, 0, 0)}}
	in := newInput("C30/37", model.Rectangular, model.ImperfL0Over400, col)
	d := mustRun(t, in).Designs[0]
	checkTrace(t, d)

	const b, h, dp, fcd, e = 400.0, 400.0, 55.5, 20.0, 235.0
	fyd := 500 / 1.15
	as := 2 * math.Pi * 12.5 * 12.5
	ms := as * (2*fyd - fcd) * (h/2 - dp)
	// fcd·b·y·(h/2 − y/2) + ms = (fcd·b·y − As·fcd)·e  →  A·y² + B·y + C = 0
	qa, qb, qc := -fcd*b/2, fcd*b*(h/2-e), ms+as*fcd*e
	y := (-qb - math.Sqrt(qb*qb-4*qa*qc)) / (2 * qa)
	x := y / 0.8
	// Both layers yield at this neutral axis (the assumption of the hand method).
	epsYd := fyd / 200000
	if top, bot := 0.0035*(x-dp)/x, 0.0035*(h-dp-x)/x; top < epsYd || bot < epsYd {
		t.Fatalf("hand method: a layer does not yield (x = %.1f mm: %.5f, %.5f)", x, top, bot)
	}
	nRd := fcd*b*y - as*fcd

	s := stepByID(t, d, "fire/N_Rd")
	if s.Kind != trace.KindSolve || s.Residual() > 0 {
		t.Errorf("NRd step: kind %s, residual %g", s.Kind, s.Residual())
	}
	near(t, "NRd at e = 235 mm", s.Value, nRd, 1e-5)
	mu := stepByID(t, d, "fire/mu_fi")
	near(t, "μfi = 0.7·NEd/NRd", mu.Value, 0.7*1000e3/nRd, 1e-5)
	var eArgs int
	for _, a := range s.Args {
		if a.From == "fire/e_y" || a.From == "fire/e_z" {
			eArgs++
		}
	}
	near(t, "e_y", stepByID(t, d, "fire/e_y").Value, e, 1e-12)
	if eArgs != 2 {
		t.Errorf("the NRd step does not record the eccentricities it holds: %+v", s.Args)
	}
}

// Where Method A does not apply for a reason that no bars change, the design says exactly that,
// with the values, its utilisation is the ratio of the condition (not a placeholder), the
// governing check names the condition, and the bars are the least that pass every other check:
// no bigger pattern is searched to cure the method. EN 1992-1-2:2004 5.3.2(2): e ≤ emax with
// emax = 0.15·h recommended (note); Section 6 for C55/67 and above.
func TestFireNotApplicable(t *testing.T) {
	mk := func(class string, fire *model.Fire) Design {
		// e = (70 kNm + 1000 kN·ei)/1000 kN about y with h = 400: emax = 60 mm.
		col := model.Column{ID: "NA", B: 400, H: 400, Cover: 35, Fire: fire,
			Storeys: []model.Storey{lift(3000, 3000, 1000, 70, 70, 10, 10)}}
		d := mustRun(t, newInput(class, model.ParabolaRectangle, model.ImperfL0Over400, col)).Designs[0]
		checkTrace(t, d)
		return d
	}
	plain := mk("C30/37", nil)
	if plain.Status != StatusPass {
		t.Fatalf("without fire: %s %v", plain.Status, plain.Reasons)
	}
	d := mk("C30/37", &model.Fire{Rating: 60})
	e := (70e6 + 1000e3*3000.0/400) / 1000e3 // EN 1992-1-1:2004 5.2(9): ei = l0/400
	wantReason := "Method A not applicable: e = 77.5 mm > emax = 60.0 mm about y"
	if d.Status != StatusFail || d.Detailing.FireOK || len(d.Reasons) != 1 || !strings.HasPrefix(d.Reasons[0], wantReason) {
		t.Errorf("e > emax: status %s, reasons %q", d.Status, d.Reasons)
	}
	near(t, "utilisation e/emax", d.Utilization, e/60, 1e-9)
	if !strings.Contains(d.Governing, "eccentricity about y") || !strings.Contains(d.Governing, "5.3.2(2)") {
		t.Errorf("governing %q does not name the condition", d.Governing)
	}
	if d.AsProv != plain.AsProv || d.Bars.Count != plain.Bars.Count || d.Bars.Dia != plain.Bars.Dia {
		t.Errorf("bars searched beyond the least that pass: %d H%g (%g mm²), without fire %d H%g", d.Bars.Count, d.Bars.Dia, d.AsProv, plain.Bars.Count, plain.Bars.Dia)
	}

	// High-strength concrete: Method A refused (Section 6), with the ratio fck/50.
	hsPlain := mk("C60/75", nil)
	hs := mk("C60/75", &model.Fire{Rating: 60})
	if hs.Status != StatusFail || len(hs.Reasons) == 0 || !strings.Contains(hs.Reasons[0], "Section 6 applies to C55/67 and above") {
		t.Errorf("C60/75: status %s, reasons %q", hs.Status, hs.Reasons)
	}
	near(t, "C60/75 ratio", hs.Utilization, 60.0/50, 1e-12)
	if hs.AsProv != hsPlain.AsProv {
		t.Errorf("C60/75: bars searched beyond the least that pass: %g mm², without fire %g mm²", hs.AsProv, hsPlain.AsProv)
	}
	var spalling bool
	for _, s := range hs.Steps {
		spalling = spalling || strings.Contains(strings.Join(s.Cautions(), " "), "6.2")
	}
	if !spalling {
		t.Error("C60/75: no caution on spalling (EN 1992-1-2 6.2)")
	}
	for _, s := range d.Steps {
		if s.ID == "fire/method" {
			t.Error("a placeholder check fire/method is still recorded")
		}
	}
}

// A rating verified elsewhere is recorded as given: an input step with the note, a caution in the
// design's cautions, no check of Method A, and the verdict of the other checks (common practice,
// no source). The same column fails Method A (e > emax), which the note replaces.
func TestFireElsewhere(t *testing.T) {
	col := model.Column{ID: "EW", B: 400, H: 400, Cover: 35,
		Fire:    &model.Fire{Rating: 90, Method: model.FireElsewhere, Note: "Annex B.2 zone method, calc F-7"},
		Storeys: []model.Storey{lift(3000, 3000, 1000, 70, 70, 10, 10)}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfL0Over400, col)).Designs[0]
	checkTrace(t, d)
	if d.Status != StatusPass || !d.Detailing.FireOK || d.Detailing.FireMethod != "verified elsewhere" || d.Detailing.FireRating != 90 {
		t.Errorf("status %s, detailing %+v, reasons %v", d.Status, d.Detailing, d.Reasons)
	}
	m := stepByID(t, d, "fire/method")
	if m.Kind != trace.KindInput || m.Value != 90 || len(m.Cautions()) == 0 || !strings.Contains(strings.Join(m.Notes(), " "), "calc F-7") {
		t.Errorf("method step %+v", m)
	}
	if !strings.Contains(strings.Join(d.Cautions, " "), "verified elsewhere") {
		t.Errorf("cautions %q", d.Cautions)
	}
	for _, s := range d.Steps {
		if strings.HasPrefix(s.ID, "fire/") && s.Kind == trace.KindCheck {
			t.Errorf("%s: a check of Method A with the rating verified elsewhere", s.ID)
		}
	}
}

// Surface reinforcement where the axis distance is 70 mm or more, EN 1992-1-2:2004 4.5.2(2) (from
// memory): 55 mm cover to H8 links and H16 bars gives a = 55 + 8 + 8 = 71 mm (Figure 5.2).
func TestSurfaceMeshInDesign(t *testing.T) {
	col := model.Column{ID: "SM", B: 500, H: 500, Cover: 55, LinkDia: 8, Bars: &model.BarSpec{Count: 8, Dia: 16},
		Fire:    &model.Fire{Rating: 120},
		Storeys: []model.Storey{lift(3000, 3000, 1500, 30, -15, 10, -5)}}
	d := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)).Designs[0]
	checkTrace(t, d)
	near(t, "a", stepByID(t, d, "fire/a").Value, 71, 1e-12)
	if !d.Detailing.SurfaceMesh || stepByID(t, d, "fire/mesh").Value != 1 || !strings.Contains(strings.Join(d.Cautions, " "), "4.5.2(2)") {
		t.Errorf("no surface reinforcement: %+v, cautions %q", d.Detailing, d.Cautions)
	}
}

// μfi computed on odd but valid columns, every second-order method and block: nothing panics,
// every step reproduces itself and is finite, μfi is not below the value with NRd,max, and NRd
// is not above NRd,max (common practice, no source).
func TestMuFiSweep(t *testing.T) {
	for _, so := range []string{model.SecondOrderCurvature, model.SecondOrderStiffness, model.SecondOrderBoth} {
		for _, block := range []string{model.ParabolaRectangle, model.Rectangular} {
			for _, l0 := range []float64{2000, 6000, 12000} {
				for _, n := range []float64{100, 1500, 6000} {
					col := model.Column{ID: "SW", B: 300, H: 450, Cover: 30, Fire: &model.Fire{Rating: 90, UseMuFi: true},
						Storeys: []model.Storey{lift(l0, 0.8*l0, n, 0.06*n, -0.03*n, 0.02*n, 0.01*n)}}
					in := newInput("C35/45", block, model.ImperfInclination, col)
					in.Options.SecondOrder = so
					in.Options.Biaxial = model.BiaxialRule
					d := mustRun(t, in).Designs[0]
					checkTrace(t, d)
					nrd, max := stepByID(t, d, "fire/N_Rd"), stepByID(t, d, "sec/NRd_max")
					if nrd.Value > max.Value*(1+1e-12) || nrd.Residual() > 0 {
						t.Errorf("%s %s l0 %g N %g: NRd %g > NRd,max %g or residual %g", so, block, l0, n, nrd.Value, max.Value, nrd.Residual())
					}
					if mu := stepByID(t, d, "fire/mu_fi"); nrd.Value > 0 && mu.Value < 0.7*n*1e3/max.Value*(1-1e-12) {
						t.Errorf("%s %s l0 %g N %g: μfi %g below the value with NRd,max", so, block, l0, n, mu.Value)
					}
				}
			}
		}
	}
}
