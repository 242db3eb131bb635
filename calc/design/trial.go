package design

import (
	"math"

	"colsheet/calc/cover"
	"colsheet/calc/detail"
	"colsheet/calc/fire"
	"colsheet/calc/model"
	"colsheet/calc/shear"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// This file tries a candidate bar pattern cheaply: trial computes the check steps that
// evaluate(p, false, false) keeps, with the same IDs, titles, clauses, relations, ratios and
// verdicts, by the value functions the step functions use, without building the other steps.
// Its check steps carry no arguments, notes or display forms, and its design words no reasons:
// a trial is read for its status and utilisation (and so by withArrangements and the load
// cases), never shown. TestTrialMatchesEvaluate holds the two paths together.

// axisIDs are the IDs and words of the per-axis check steps, about y and about z.
var axisIDs = [2]struct {
	checkM, bending, relM, shearCheck, shearMax, checkNB string
}{
	{"y/check_M", "Bending about y", "M_Ed,y ≤ M_Rd,y", "y/shear/check", "y/shear/check_V_Rdmax", "y/check_NB"},
	{"z/check_M", "Bending about z", "M_Ed,z ≤ M_Rd,z", "z/shear/check", "z/shear/check_V_Rdmax", "z/check_NB"},
}

// trial returns the design that pattern p gives as a candidate: the status, utilisation and
// check steps of evaluate(p, false, false), without its other steps. pre, when not nil, is the
// quick evaluation of p at the NEd of c (cannotPass), whose section and moment resistances it
// takes over: the same functions of the same section give the same values.
func (c *common) trial(p detail.Pattern, pre *quick) Design {
	col, st, prm := c.col, c.st, c.p
	// The check steps and the checks go into buffers that every trial of c reuses (see
	// evaluate): a trial's design is read before the next trial.
	l := &trace.Log{Trial: true, Steps: c.trialSteps[:0]}
	checks := c.trialChecks[:0]
	defer func() { c.trialSteps, c.trialChecks = l.Steps[:0], checks[:0] }()
	// put records a check step; add records it and counts it among the design's checks.
	put := func(id, title, clause, relation string, ratio float64) {
		l.Steps = append(l.Steps, trace.Check(id, title, clause, relation, ratio, ""))
	}
	add := func(id, title, clause, relation string, ratio float64, resistance bool) {
		put(id, title, clause, relation, ratio)
		checks = append(checks, checked{id, resistance})
	}
	link := c.linkFor(p.Dia)
	g := c.geometryWith(link)
	var pos [][2]float64
	var sec *resist
	if pre != nil && pre.sec != nil {
		pos, sec = pre.pos, pre.sec
	} else {
		pos = g.Positions(p)
		sec = c.section(pos, p.BarArea())
	}
	d := Design{Column: col.ID, Storey: st.Name, B: col.B, H: col.H, Cover: col.Cover, Shape: col.Shape,
		Class: c.in.Materials.Concrete.Class, Fck: c.fck.V, Fyk: c.in.Materials.Fyk, NEd: st.NEd, pattern: p, trial: true}
	phi, n := p.Dia, float64(p.Count())

	// Reinforcement provided and its limits.
	if c.circle {
		add("bars/check_n_circle", "Bars in a circular column: six, common practice beyond the four of 9.5.2(4)", "EN 1992-1-1:2004 9.5.2(4); common practice", "n_min ≤ n_bars",
			float64(detail.RingMin)/n, false)
	}
	as := p.Area()
	add("bars/check_As_min", "Minimum reinforcement", "EN 1992-1-1:2004 9.5.2(2)", "A_s,min ≤ A_s,prov", c.asMin.V/as, false)
	add("bars/check_As_max", "Maximum reinforcement outside laps", "EN 1992-1-1:2004 9.5.2(3)", "A_s,prov ≤ A_s,max", as/c.asMax.V, false)
	if dv := c.dv; dv != nil && dv.AsAbove > 0 {
		lapMax := prm.Get("As_max_lap_Ac") * math.Min(c.ac.V, dv.AcAbove)
		add("bars/check_As_lap", "Reinforcement at the lap above the lift", "EN 1992-1-1:2004 9.5.2(3)", "A_s,prov + A_s,above ≤ A_s,max,lap", (as+dv.AsAbove)/lapMax, false)
		add("bars/check_not_less", "Bars not less than in the lift above", "common practice", "A_s,above ≤ A_s,prov", dv.AsAbove/as, false)
	}
	add("bars/check_phi_min", "Minimum bar diameter", "EN 1992-1-1:2004 9.5.2(1)", "φ_min ≤ φ", prm.Get("phi_min")/phi, false)

	// Links, EN 1992-1-1:2004 9.5.3.
	phiTMin := math.Max(prm.Get("link_dia_min"), prm.Get("link_dia_ratio")*phi) // detail.MinLinkDia
	add("links/check_dia", "Link diameter", "EN 1992-1-1:2004 9.5.3(1)", "φ_t,min ≤ φ_t", phiTMin/link, false)
	bMin := col.B
	if !c.circle {
		bMin = math.Min(col.B, col.H)
	}
	sMax := math.Min(math.Min(prm.Get("link_spacing_bars")*phi, bMin), prm.Get("link_spacing_max")) // detail.MaxLinkSpacing
	sRed := prm.Get("link_spacing_zone") * sMax                                                     // detail.ReducedLinkSpacing
	step := c.in.Options.LinkStep

	// Clear spacing of bars, EN 1992-1-1:2004 8.2(2).
	dg := c.bs.dg.V
	k1, k2, s0 := prm.Get("spacing_k1"), prm.Get("spacing_k2"), prm.Get("spacing_min")
	sMin := math.Max(math.Max(k1*phi, dg+k2), s0) // detail.MinClearSpacing
	cnom := col.Cover
	gapB, gapH := g.ClearGaps(p)
	gapMin := math.Min(gapB, gapH)
	var gb, gh, rs, yc, zc float64
	spacing := (sMin + phi) / math.Max(gapMin+phi, 1e-3)
	if c.circle {
		rs = c.b.V/2 - cnom - link - phi/2 // detail.RingRadiusStep
		gb = detail.RingGap(rs, int(n), phi)
		gh = gb
		add("space/check", "Clear distance between bars", "EN 1992-1-1:2004 8.2(2)", "s_min ≤ s_c", spacing, false)
	} else {
		gb, gh = gapB, gapH
		e := g.Edge(phi)
		yc, zc = col.B/2-e, col.H/2-e
		add("space/check", "Clear distance between bars", "EN 1992-1-1:2004 8.2(2)", "s_min ≤ min(s_b, s_h)", spacing, false)
	}

	// Cover for durability and bond, EN 1992-1-1:2004 4.4.1 (cover.NominalFor).
	if dur := c.durability(); dur != nil {
		a := c.bs.allowances(l, dur)
		nominal := func(dia float64) float64 {
			return cover.CnomValue(cover.CminValue(cover.CminBValue(dia, dg), a.Dur.V, a.Gamma.V), a.Dev.V)
		}
		cBar := cnom + link // cover.BarCover
		add("cover/check_link", "Cover to the links", "EN 1992-1-1:2004 4.4.1.1(2)P", "c_nom ≤ c", nominal(link)/max(cnom, 1e-3), false)
		add("cover/check_bar", "Cover to the main bars", "EN 1992-1-1:2004 4.4.1.1(2)P", "c_nom ≤ c", nominal(phi)/max(cBar, 1e-3), false)
	}

	// Shear, EN 1992-1-1:2004 6.2 (shearSteps, shearChecks).
	var sh [2]shear.AxisResult
	var vEd [2]float64
	sReq, limit := c.shearValues(pos, phi, link, cnom, &sh, &vEd, put)
	sGen, sZone := sMax, sRed
	if limit {
		sGen, sZone = math.Min(sMax, sReq), math.Min(sRed, sReq)
	}
	s1 := math.Floor(sGen/step+1e-9) * step // detail.RoundDown
	s2 := math.Floor(sZone/step+1e-9) * step
	asw := 2 * math.Pi * link * link / 4
	for k := 0; k < 2; k++ {
		if r := sh[k]; r.Needed {
			checks = append(checks, checked{axisIDs[k].shearMax, true})
			vRds := shear.VRdsValue(asw, s1, r.Z, c.fyd.V, r.CotTheta)
			add(axisIDs[k].shearCheck, "Shear with the links provided", "EN 1992-1-1:2004 6.2.1(3), (5); 6.2.3(3), Eq. (6.8)", "V_Ed ≤ max(V_Rd,c, V_Rd,s)",
				shear.LinksCheckValue(vEd[k], r.VRdc, vRds), true)
		} else {
			checks = append(checks, checked{axisIDs[k].shearCheck, true})
		}
	}

	// Laps of the bars, EN 1992-1-1:2004 8.4, 8.7.
	phiQ := trace.Const(phi, "φ", "mm")
	l0Q, rho1Q := c.bs.lap(l, phiQ, c.fyd)
	l0, rho1 := l0Q.V, rho1Q.V
	if ls := c.in.Options.LapStep; ls > 0 {
		l0 = -math.Floor(-(l0/ls)+1e-9) * ls // detail.RoundUp
	}
	c.lapValues(phi, link, gb, gh, sMin, l0, rho1, s1, s2, step, add)

	// Slenderness limit and second order, per axis (nominal curvature, 5.8.8; nominal stiffness, 5.8.7).
	omega := slender.MechanicalRatioValue(as, c.fyd.V, c.ac.V, c.fcd.V)
	factB := slender.FactorBValue(omega)
	kLim := prm.Get("lambda_lim_k")
	var mEd [2]float64
	for k := 0; k < 2; k++ {
		a := &c.ax[k]
		if c.tension {
			mEd[k] = a.m02.V
			continue
		}
		lim := slender.LambdaLimValue(kLim, a.factorA.V, factB, a.factorC.V, c.nRel.V)
		if !(a.lambda.V > lim) {
			mEd[k] = slender.DesignMomentStockyValue(a.m02i.V, c.nEd.V, a.e0.V)
			continue
		}
		m0e := slender.EquivalentMomentValue(a.m01i.V, a.m02i.V)
		var is float64
		if c.circle {
			is = rs / math.Sqrt2 // slender.RingGyration
		} else {
			edge, outer, rows := zc, float64(p.NB), float64(p.NH)
			if k == 1 {
				edge, outer, rows = yc, float64(p.NH), float64(p.NB)
			}
			is = slender.SymmetricGyrationValue(edge, outer, rows)
		}
		method := c.in.Options.SecondOrder
		var mCurv, mStiff float64
		if method != model.SecondOrderStiffness {
			r0 := slender.BaseCurvatureValue(c.fyd.V/c.es.V, slender.EffectiveDepthValue(a.depth.V, is))
			kphi := slender.KphiValue(slender.BetaValue(c.fck.V, a.lambda.V), a.phiEf.V)
			curv := slender.CurvatureValue(slender.KrValue(c.nRel.V, omega), kphi, r0)
			m2 := c.nEd.V * slender.SecondOrderEccentricityValue(curv, a.l0.V, prm.Get("c_curv"))
			mCurv = slender.DesignMomentSlenderValue(a.m01i.V, a.m02i.V, m0e, m2, c.nEd.V, a.e0.V)
		}
		if method == model.SecondOrderStiffness || method == model.SecondOrderBoth {
			var nb float64
			mStiff, nb, _ = c.stiffnessValues(k, as, is, m0e, a.m02i.V, c.nEd.V, c.nRel.V)
			s := trace.Check(axisIDs[k].checkNB, "Axial force below the buckling load", "EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28)", "N_Ed < N_B",
				slender.BucklingRatioValue(c.nEd.V, nb), "")
			if slender.Buckles(c.nEd.V, nb) {
				s.Verdict = trace.Fail // as slender.BucklingCheck
			}
			l.Steps = append(l.Steps, s)
			checks = append(checks, checked{axisIDs[k].checkNB, true})
		}
		switch method {
		case model.SecondOrderStiffness:
			mEd[k] = mStiff
		case model.SecondOrderBoth:
			mEd[k] = math.Max(mCurv, mStiff)
		default:
			mEd[k] = mCurv
		}
	}

	// Section resistance.
	nRdMax := sec.nRdMax()
	if c.tension {
		add("sec/check_Nt", "Axial tension", "EN 1992-1-1:2004 6.1", "|N_Ed| ≤ N_Rd,t", -c.nEd.V/(as*c.fyd.V), true)
	} else {
		add("sec/check_N", "Axial force", "EN 1992-1-1:2004 6.1", "N_Ed ≤ N_Rd,max", c.nEd.V/nRdMax, true)
	}
	var mRd [2]float64
	for k := 0; k < 2; k++ {
		var m float64
		var ok bool
		if pre != nil && pre.mRd[k] > 0 {
			m, ok = pre.mRd[k], true // resist.mRd of the same section at the same NEd
		} else if c.circle {
			least, found := sec.least(c.nEd.V)
			m, ok = least.State.M, found && least.State.M > 0
		} else {
			m, ok = sec.mRd(k, c.nEd.V)
		}
		if !ok {
			continue
		}
		mRd[k] = m
		add(axisIDs[k].checkM, axisIDs[k].bending, "EN 1992-1-1:2004 6.1", axisIDs[k].relM, mEd[k]/math.Max(m, 1), true)
	}

	// Fire resistance, EN 1992-1-2:2004 5.3.2, Method A (fireSteps); a rating verified elsewhere
	// has no check.
	if f := c.fire(); f != nil && f.Rating > 0 && !c.tension && f.Method != model.FireElsewhere {
		q := func(v float64) trace.Q { return trace.Q{V: v} }
		fc := fire.Column{B: c.b, H: c.h, Circle: c.circle, Ac: c.ac, Fck: c.fck, Cover: q(cnom), LinkDia: q(link), Dia: q(phi), Bars: q(n), As: q(as),
			NEd: c.nEd, Omega: q(omega), AlphaCc: q(prm.Get("alpha_cc")), EMax: q(prm.Get("fire_emax")), MuFixed: !f.UseMuFi,
			L0Fi: q(math.Max(c.ax[0].l0.V, c.ax[1].l0.V)),
			EY:   q(fire.EccentricityValue(c.ax[0].m02i.V, c.nEd.V)), EZ: q(fire.EccentricityValue(c.ax[1].m02i.V, c.nEd.V))}
		nRd := 0.0
		if f.UseMuFi && c.nEd.V > 0 {
			nRd = c.fireNRd(p, q(nRdMax), fc.EY, fc.EZ).Value
		}
		out := fire.AssessTrial(l, "fire/", f.Rating, q(fire.UtilisationValue(*f, c.nEd.V, nRd)), fc)
		for _, v := range out.Checks {
			checks = append(checks, checked{v.ID, false})
			d.failure(v.ID, "", v.Fixed)
		}
	}

	// Biaxial bending, EN 1992-1-1:2004 5.8.9.
	if c.circle {
		if mRd[0] > 0 {
			add("bi/check", "Biaxial bending: the resultant moment against the least resistance over the directions", "EN 1992-1-1:2004 5.8.9(4)", "M_Ed ≤ M_Rd",
				math.Hypot(mEd[0], mEd[1])/math.Max(mRd[0], 1), true)
		}
	} else if mRd[0] > 0 && mRd[1] > 0 {
		biaxial := !(slender.SlendernessRatiosCloseValue(c.ax[0].lambda.V, c.ax[1].lambda.V) &&
			slender.EccentricitiesApartValue(mEd[0], mEd[1], c.b.V, c.h.V))
		exact := c.in.Options.Biaxial == model.BiaxialExact || c.tension
		if biaxial && !exact {
			a := slender.ExponentAValue(c.nEd.V, slender.NRdBiaxialValue(c.ac.V, c.fcd.V, as, c.fyd.V))
			add("bi/ratio", "Biaxial bending", "EN 1992-1-1:2004 5.8.9(4), Eq. (5.39)", "(M_Edz/M_Rdz)^a + (M_Edy/M_Rdy)^a ≤ 1",
				slender.BiaxialRatioValue(mEd[0], mRd[0], mEd[1], mRd[1], a), true)
		}
		if exact {
			if st, err := sec.sec.Biaxial(c.nEd.V, math.Atan2(mEd[1], mEd[0])); err == nil {
				add("bi/exact/check", "Biaxial bending, exact section resistance", "EN 1992-1-1:2004 6.1", "M_Ed ≤ M_Rd",
					math.Hypot(mEd[0], mEd[1])/math.Max(st.MRd, 1), true)
			} else {
				add("bi/exact/check", "Biaxial bending, exact section resistance: no solution", "EN 1992-1-1:2004 6.1", "M_Ed ≤ M_Rd", 2, true)
			}
		}
	}

	d.checks = checks
	c.settle(&d, l, checks)
	return d
}

// shearValues computes the shear of the lift about y and z for the bars at pos as shearSteps
// records it, puts the check steps that do not depend on the links provided (VEd ≤ VRd,c, or VEd ≤ VRd,max),
// and returns the largest link spacing the shear allows and whether it holds.
func (c *common) shearValues(pos [][2]float64, phi, link, cnom float64, sh *[2]shear.AxisResult, vEd *[2]float64,
	put func(id, title, clause, relation string, ratio float64)) (sReq float64, limit bool) {
	st := c.st
	cs := model.Case{}
	if len(st.Cases) == 1 {
		cs = st.Cases[0]
	}
	var length float64
	switch {
	case st.Clear > 0:
		length = st.Clear
	case st.Length > 0:
		length = st.Length
	default:
		length = math.Min(st.L0Y, st.L0Z)
	}
	asw := 2 * math.Pi * link * link / 4
	widths := [2]float64{c.b.V, c.h.V}
	tension := tensionBars(pos)
	first := true
	for k := 0; k < 2; k++ {
		a := &c.ax[k]
		if cs.HasV[k] {
			vEd[k] = math.Abs(cs.V[k])
		} else {
			vEd[k] = math.Abs(a.top.V-a.bot.V) / length
		}
		var d float64
		if c.circle {
			rs := a.depth.V/2 - cnom - link - phi/2
			d = a.depth.V/2 + 2*rs/math.Pi
		} else {
			d = a.depth.V - cnom - link - phi/2
		}
		asl := float64(tension[k]) * math.Pi * phi * phi / 4
		in := shear.Values{BW: widths[k], D: d, Asl: asl, NEd: c.nEd.V, Ac: c.ac.V, Fck: c.fck.V, Fcd: c.fcd.V, Fywd: c.fyd.V, Asw: asw, VEd: vEd[k]}
		r := shear.AxisValue(in, c.bs.shear)
		sh[k] = r
		if r.Needed {
			put(axisIDs[k].shearMax, "Shear within the resistance of the concrete struts", "EN 1992-1-1:2004 6.2.1(6); 6.2.3(3), Eq. (6.9)", "V_Ed ≤ V_Rd,max", r.MaxCheck)
			// extremeStep: the least of the axes' spacings, in order.
			if first {
				sReq, first = r.SReq, false
			}
			sReq = math.Min(sReq, r.SReq)
		} else {
			put(axisIDs[k].shearCheck, "Shear without calculated shear reinforcement", "EN 1992-1-1:2004 6.2.1(3); 6.2.2(1)", "V_Ed ≤ V_Rd,c", r.Check)
		}
	}
	if cp := c.shearCap; cp != nil {
		if first {
			sReq, first = cp.s, false
		}
		sReq = math.Min(sReq, cp.s)
	}
	return sReq, !first
}

// lapValues adds the checks of the arrangement of the laps and of the links over them
// (detail.LapArrangement, detail.LapLinks) for bars phi in links link, with the clear distances
// gb and gh along the faces, the least clear distance sMin, the lap length l0 as built, the
// percentage rho1 lapped at one section, the link spacings s and sRed and their step.
func (c *common) lapValues(phi, link, gb, gh, sMin, l0, rho1, s, sRed, step float64,
	add func(id, title, clause, relation string, ratio float64, resistance bool)) {
	add("lap/check_pair", "Clear distance between the two bars of a lapped pair", "EN 1992-1-1:2004 8.7.2(3), Fig. 8.7", "a_pair ≤ min(4φ, 50 mm)",
		0/math.Min(4*phi, 50), false)
	gap, gapMin := detail.LappedGapValue(gb, gh, phi), detail.LappedGapMinValue(phi, sMin)
	add("lap/check_gap", "Clear distance between a lapped pair and the next bar", "EN 1992-1-1:2004 8.2(2); 8.7.2(3)", "s_lap,min ≤ s_lap",
		(gapMin+phi)/math.Max(gap+phi, 1e-3), false)

	reduced := detail.LapZoneReducedValue(phi) == 1
	transverse := detail.LapTransverseValue(phi, rho1) == 1
	var as, ast, nReq float64
	if transverse {
		as = math.Pi * phi * phi / 4
		ast = math.Pi * link * link / 4
		nReq = detail.LapLinksPerThirdValue(as, ast, detail.LapLegs)
	}
	sMax := detail.LapSpacingMaxValue(reduced, transverse, s, sRed, l0, nReq)
	sLap := math.Floor(sMax/step+1e-9) * step
	if !(sLap > 0) {
		add("lap/check_s", "Link spacing over the laps on the step of the link spacings", "common practice", "Δs ≤ s_t,lap,max", step/math.Max(sMax, 1e-3), false)
		return
	}
	if reduced {
		nLap := detail.LinksInLapValue(l0, sLap)
		add("lap/links_check", "At least three links in the lap length", "EN 1992-1-1:2004 9.5.3(4)", "3 ≤ n_t,lap", 3/math.Max(nLap, 1), false)
	}
	if transverse {
		prm := c.p
		sMinT := math.Max(math.Max(prm.Get("spacing_k1")*link, c.bs.dg.V+prm.Get("spacing_k2")), prm.Get("spacing_min"))
		add("lap/check_s_t", "Clear distance between the links over the laps", "EN 1992-1-1:2004 8.2(2)", "s_min,t ≤ s_t,lap − φ_t", (sMinT+link)/math.Max(sLap, 1e-3), false)
		n3 := math.Floor(l0/(3*sLap) + 1e-9)
		sum := 2 * n3 * detail.LapLegs * ast
		add("lap/check_Ast", "Transverse reinforcement at the laps", "EN 1992-1-1:2004 8.7.4.1(3)", "A_s ≤ ΣA_st", as/math.Max(sum, 1e-3), false)
	}
}
