package design

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"colsheet/calc/cover"
	"colsheet/calc/detail"
	"colsheet/calc/fire"
	"colsheet/calc/model"
	"colsheet/calc/section"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// stepsPerPattern is the room left for the bar-dependent steps of a full evaluation.
const stepsPerPattern = 300

// evaluate runs every bar-dependent step for one bar pattern and returns the design it gives.
// With full false the equilibrium of the section is recorded as one step per axis instead of
// its whole derivation: that serves to try candidate patterns, whose traces are dropped.
func (c *common) evaluate(p detail.Pattern, given, full bool) Design {
	col, st, prm := c.col, c.st, c.p
	l := &trace.Log{Trial: !full || c.lean}
	if full {
		if c.lean && cap(c.steps) == 0 {
			c.steps = make([]trace.Step, 0, leanRoom)
		}
		// The bar-dependent steps follow the common ones in the same backing array: a later
		// full evaluation overwrites them, which is safe since a design keeps only its last.
		l.Steps = c.steps[:len(c.steps):cap(c.steps)]
	} else {
		// A trial's check steps go into one buffer that every trial of c reuses: a trial's
		// design is read (status, utilisation) before the next trial.
		l.Steps = c.trialSteps[:0]
		defer func() { c.trialSteps = l.Steps[:0] }()
	}
	link := c.linkFor(p.Dia)
	g := c.geometryWith(link)
	pos := g.Positions(p)

	d := Design{Column: col.ID, Storey: st.Name, B: col.B, H: col.H, Cover: col.Cover, Shape: col.Shape,
		Class: c.in.Materials.Concrete.Class, Fck: c.fck.V, Fyk: c.in.Materials.Fyk, NEd: st.NEd, pattern: p}
	d.Cautions = append(d.Cautions, c.cautions...)
	d.Bars = Bars{Count: p.Count(), Dia: p.Dia, Positions: pos, Given: given}
	var checks []checked // check steps, for the utilisation and the status

	check := func(s trace.Step) { checks = append(checks, checked{l.Add(s).From, false}) }
	resistance := func(s trace.Step) { checks = append(checks, checked{l.Add(s).From, true}) }

	// Reinforcement provided and its limits.
	l.Group = "Reinforcement provided"
	src := trace.ClauseChosen + "the cheapest pattern that passes every check within the rules of practice"
	if given {
		src = "input"
	}
	phi := l.Add(trace.Input("bars/phi", "Bar diameter", src, "φ", "mm", p.Dia))
	nb := l.Add(trace.Input("bars/count", "Number of bars", src, "n_bars", "", float64(p.Count())))
	var nB, nH trace.Q
	if !c.circle {
		nB = l.Add(trace.Input("bars/nb", "Bars along each b-face, corners included", src, "n_b", "", float64(p.NB)))
		nH = l.Add(trace.Input("bars/nh", "Bars along each h-face, corners included", src, "n_h", "", float64(p.NH)))
	} else {
		check(trace.Check("bars/check_n_circle", "Bars in a circular column: six, common practice beyond the four of 9.5.2(4)", "EN 1992-1-1:2004 9.5.2(4); common practice", "n_min ≤ n_bars",
			float64(detail.RingMin)/float64(p.Count()), "n_min / n", trace.A("n_min", trace.Const(detail.RingMin, "n_min", "")), trace.A("n", nb)))
	}
	as := l.Add(trace.Formula("bars/As", "Area of longitudinal reinforcement provided", "common practice", "A_s,prov", "mm2",
		p.Area(), "n * 3.141592653589793 * phi ** 2 / 4", trace.A("n", nb), trace.A("phi", phi)).Shown("n * pi * phi ** 2 / 4"))
	d.AsProv, d.AsMin, d.AsMax = as.V, c.asMin.V, c.asMax.V
	check(trace.Check("bars/check_As_min", "Minimum reinforcement", "EN 1992-1-1:2004 9.5.2(2)", "A_s,min ≤ A_s,prov",
		c.asMin.V/as.V, "A_s_min / A_s", trace.A("A_s_min", c.asMin), trace.A("A_s", as)))
	check(trace.Check("bars/check_As_max", "Maximum reinforcement outside laps", "EN 1992-1-1:2004 9.5.2(3)", "A_s,prov ≤ A_s,max",
		as.V/c.asMax.V, "A_s / A_s_max", trace.A("A_s", as), trace.A("A_s_max", c.asMax)))
	if dv := c.dv; dv != nil && dv.AsAbove > 0 {
		// The lap above this lift holds its bars and those of the lift above, 9.5.2(3).
		aa := l.Add(trace.Input("bars/As_above", "Bars of the lift above ("+dv.NameAbove+")", trace.ClauseAbove, "A_s,above", "mm2", dv.AsAbove))
		acA := l.Add(trace.Input("bars/Ac_above", "Section of the lift above", trace.ClauseAbove, "A_c,above", "mm2", dv.AcAbove))
		lapMax := l.Add(trace.Formula("bars/As_max_lap", "Maximum reinforcement at laps", "EN 1992-1-1:2004 9.5.2(3)", "A_s,max,lap", "mm2",
			prm.Get("As_max_lap_Ac")*math.Min(c.ac.V, acA.V), "k * min(A_c, A_c_above)", trace.A("k", param(prm, "As_max_lap_Ac", "")), trace.A("A_c", c.ac), trace.A("A_c_above", acA)))
		check(trace.Check("bars/check_As_lap", "Reinforcement at the lap above the lift", "EN 1992-1-1:2004 9.5.2(3)", "A_s,prov + A_s,above ≤ A_s,max,lap",
			(as.V+aa.V)/lapMax.V, "(A_s + A_s_above) / A_s_max_lap", trace.A("A_s", as), trace.A("A_s_above", aa), trace.A("A_s_max_lap", lapMax)))
		check(trace.Check("bars/check_not_less", "Bars not less than in the lift above", "common practice", "A_s,above ≤ A_s,prov",
			aa.V/as.V, "A_s_above / A_s", trace.A("A_s_above", aa), trace.A("A_s", as)))
	}
	phiMin := param(prm, "phi_min", "mm")
	check(trace.Check("bars/check_phi_min", "Minimum bar diameter", "EN 1992-1-1:2004 9.5.2(1)", "φ_min ≤ φ",
		phiMin.V/p.Dia, "phi_min / phi", trace.A("phi_min", phiMin), trace.A("phi", phi)))

	// Links, EN 1992-1-1:2004 9.5.3.
	l.Group = "Links"
	linkSrc := trace.ClauseChosen + "smallest listed size not below the minimum"
	if col.LinkDia > 0 {
		linkSrc = "input"
	}
	d.Links.Type = linkType(col)
	linkTitle := map[string]string{LinksRect: "Link diameter", LinksCircular: "Diameter of the circular links", LinksHelix: "Diameter of the helix"}[d.Links.Type]
	phiT := l.Add(trace.Input("links/phi_t", linkTitle, linkSrc, "φ_t", "mm", link))
	phiTMin := l.Add(detail.MinLinkDia("links/phi_t_min", phi, param(prm, "link_dia_min", "mm"), param(prm, "link_dia_ratio", "")))
	check(trace.Check("links/check_dia", "Link diameter", "EN 1992-1-1:2004 9.5.3(1)", "φ_t,min ≤ φ_t",
		phiTMin.V/link, "phi_t_min / phi_t", trace.A("phi_t_min", phiTMin), trace.A("phi_t", phiT)))
	var bMin, zone trace.Q
	if c.circle {
		bMin = l.Add(trace.Formula("links/b_min", "Lesser dimension of the column: its diameter", "EN 1992-1-1:2004 9.5.3(3)", "b_min", "mm",
			col.B, "D", trace.A("D", c.b)))
	} else {
		bMin = l.Add(trace.Formula("links/b_min", "Lesser dimension of the column", "EN 1992-1-1:2004 9.5.3(3)", "b_min", "mm",
			math.Min(col.B, col.H), "min(b, h)", trace.A("b", c.b), trace.A("h", c.h)))
	}
	sMax := l.Add(detail.MaxLinkSpacing("links/s_max", phi, bMin, param(prm, "link_spacing_bars", ""), param(prm, "link_spacing_max", "mm")))
	sRed := l.Add(detail.ReducedLinkSpacing("links/s_red", sMax, param(prm, "link_spacing_zone", "")))
	step := trace.Const(c.in.Options.LinkStep, "Δs", "mm")
	if c.circle {
		zone = l.Add(trace.Formula("links/zone", "Length of the zones with the reduced spacing above and below beams and slabs: the diameter", "EN 1992-1-1:2004 9.5.3(4)", "l_zone", "mm",
			col.B, "D", trace.A("D", c.b)))
	} else {
		zone = l.Add(trace.Formula("links/zone", "Length of the zones with the reduced spacing above and below beams and slabs", "EN 1992-1-1:2004 9.5.3(4)", "l_zone", "mm",
			math.Max(col.B, col.H), "max(b, h)", trace.A("b", c.b), trace.A("h", c.h)))
	}
	d.Detailing.ZoneLength = zone.V

	// Clear spacing of bars, EN 1992-1-1:2004 8.2(2).
	l.Group = "Bar spacing"
	dg := c.bs.dg
	sMin := l.Add(detail.MinClearSpacing("space/s_min", phi, dg, param(prm, "spacing_k1", ""), param(prm, "spacing_k2", "mm"), param(prm, "spacing_min", "mm")))
	cnom := l.Add(trace.Input("space/c_nom", "Nominal cover to the links", "input", "c_nom", "mm", col.Cover))
	var gb, gh, yc, zc, rs trace.Q
	gapB, gapH := g.ClearGaps(p)
	gapMin := math.Min(gapB, gapH)
	var spacing trace.Step
	if c.circle {
		rs = l.Add(detail.RingRadiusStep("bars/r_s", c.b, cnom, phiT, phi))
		gb = l.Add(detail.RingGapStep("space/gap_c", rs, nb, phi))
		gh = gb
		spacing = trace.Check("space/check", "Clear distance between bars", "EN 1992-1-1:2004 8.2(2)", "s_min ≤ s_c",
			(sMin.V+p.Dia)/math.Max(gapMin+p.Dia, 1e-3), "(s_min + phi) / max(s_c + phi, 0.001)",
			trace.A("s_min", sMin), trace.A("phi", phi), trace.A("s_c", gb))
		if gapMin+p.Dia >= 1e-3 {
			spacing = spacing.Shown("(s_min + phi) / (s_c + phi)")
		}
	} else {
		gapExpr := "(w - 2 * c_nom - 2 * phi_t - phi) / (n - 1) - phi"
		gb = l.Add(trace.Formula("space/gap_b", "Clear distance between bars along a b-face", "common practice", "s_b", "mm", gapB, gapExpr,
			trace.A("w", c.b), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi), trace.A("n", nB)))
		gh = l.Add(trace.Formula("space/gap_h", "Clear distance between bars along an h-face", "common practice", "s_h", "mm", gapH, gapExpr,
			trace.A("w", c.h), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi), trace.A("n", nH)))
		// The outer bars' centres from the centroid, which place the rows of bars (detail.Geometry).
		edgeExpr := "w / 2 - c_nom - phi_t - phi / 2"
		e := g.Edge(p.Dia)
		yc = l.Add(trace.Formula("bars/y_c", "Distance of the outer bars' centres from the centroid along y", "common practice", "y_c", "mm",
			col.B/2-e, edgeExpr, trace.A("w", c.b), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi)))
		zc = l.Add(trace.Formula("bars/z_c", "Distance of the outer bars' centres from the centroid along z", "common practice", "z_c", "mm",
			col.H/2-e, edgeExpr, trace.A("w", c.h), trace.A("c_nom", cnom), trace.A("phi_t", phiT), trace.A("phi", phi)))
		// Compared as centre distances, (s_min + φ)/(s + φ), so that the ratio stays finite and
		// meaningful when given bars overlap; it passes exactly when s ≥ s_min.
		spacing = trace.Check("space/check", "Clear distance between bars", "EN 1992-1-1:2004 8.2(2)", "s_min ≤ min(s_b, s_h)",
			(sMin.V+p.Dia)/math.Max(gapMin+p.Dia, 1e-3), "(s_min + phi) / max(min(s_b, s_h) + phi, 0.001)",
			trace.A("s_min", sMin), trace.A("phi", phi), trace.A("s_b", gb), trace.A("s_h", gh))
		if gapMin+p.Dia >= 1e-3 {
			spacing = spacing.Shown("(s_min + phi) / (min(s_b, s_h) + phi)")
		}
	}
	check(spacing)

	// Cover for durability and bond, EN 1992-1-1:2004 4.4.1.
	if dur := c.durability(); dur != nil {
		l.Group = "Cover (EN 1992-1-1 4.4.1)"
		cl, _ := cover.NominalFor(l, "cover/", c.bs.allowances(l, dur), phi, phiT, dg, cnom)
		checks = append(checks, checked{"cover/check_link", false}, checked{"cover/check_bar", false})
		d.Detailing.CoverRequired = cl.V
	}
	// Shear, EN 1992-1-1:2004 6.2: the links provided are the closer of 9.5.3 and of the shear.
	plan := c.shearSteps(l, tensionBars(pos), phi, phiT, cnom)
	l.Group = "Links"
	sGen, sZone := sMax, sRed
	if plan.limit {
		sGen = l.Add(trace.Formula("links/s_lim", "Largest link spacing: 9.5.3(3) and the shear", "EN 1992-1-1:2004 9.5.3(3); 6.2.3(3)", "s_t,lim", "mm",
			math.Min(sMax.V, plan.sReq.V), "min(s_max, s_V)", trace.A("s_max", sMax), trace.A("s_V", plan.sReq)))
		sZone = l.Add(trace.Formula("links/s_zone_lim", "Largest link spacing near beams, slabs and laps: 9.5.3(4) and the shear", "EN 1992-1-1:2004 9.5.3(4); 6.2.3(3)", "s_t,red,lim", "mm",
			math.Min(sRed.V, plan.sReq.V), "min(s_red, s_V)", trace.A("s_red", sRed), trace.A("s_V", plan.sReq)))
		if plan.sReq.V < sMax.V {
			d.Links.SpacingShear = plan.sReq.V
		}
	}
	sTitle, sZoneTitle := "Link spacing provided", "Link spacing provided near beams, slabs and laps"
	if d.Links.Type == LinksHelix {
		sTitle, sZoneTitle = "Pitch of the helix provided", "Pitch of the helix provided near beams, slabs and laps"
	}
	s1 := l.Add(detail.RoundDown("links/s", sTitle, "s_t", sGen, step))
	s2 := l.Add(detail.RoundDown("links/s_zone", sZoneTitle, "s_t,red", sZone, step))
	if d.Links.Type == LinksHelix {
		l.NoteLast("A helix is taken as links at its pitch: the spacings of 9.5.3(3) and (4) and of the shear apply to the pitch.")
	}
	d.Links.Dia, d.Links.Spacing, d.Links.SpacingReduced = link, s1.V, s2.V
	checks = append(checks, c.shearChecks(l, plan, s1, &d)...)

	// Laps of the bars, EN 1992-1-1:2004 8.4, 8.7; all bars lapped at one section above the floor.
	// The lap checks are cheap arithmetic: trials make them too (their check steps alone are kept).
	l.Group = "Laps (EN 1992-1-1 8.4, 8.7)"
	l0, rho1 := c.bs.lap(l, phi, c.fyd) // the project basis's lap length of the diameter
	// The lap as built: rounded up to a practical step; the links over it are those of this length.
	l0b := l0
	if st := c.in.Options.LapStep; st > 0 {
		l0b = l.Add(detail.RoundUp("lap/l0_built", "Lap length as built", "l_0,prov", l0, trace.Const(st, "Δl", "mm")))
	}
	l.Group = "Arrangement of the laps (EN 1992-1-1 8.7.2)"
	for _, id := range detail.LapArrangement(l, "lap/", phi, gb, gh, sMin) {
		checks = append(checks, checked{id, false})
	}
	l.Group = "Links at the laps (EN 1992-1-1 8.7.4, 9.5.3(4))"
	lk := detail.LapLinks(l, "lap/", detail.LapLinkInput{Phi: phi, PhiT: phiT, L0: l0b, Rho1: rho1, S: s1, SRed: s2, Step: step,
		SMinT: func() trace.Q {
			st := detail.MinClearSpacing("lap/s_min_t", phiT, dg, param(prm, "spacing_k1", ""), param(prm, "spacing_k2", "mm"), param(prm, "spacing_min", "mm"))
			st.Title = "Minimum clear distance between links, as between bars"
			return l.Add(st)
		}})
	for _, id := range lk.Checks {
		checks = append(checks, checked{id, false})
	}
	d.Detailing.LapLength, d.Detailing.LapBuilt, d.Detailing.LapZone = l0.V, l0b.V, lk.Reduced
	d.Detailing.LapLinks, d.Detailing.LapLinkSpacing = lk.Count, lk.Spacing
	if full {
		l.Group = "Restraint of bars (EN 1992-1-1 9.5.3(6))"
		if c.circle {
			l.Add(detail.RingRestraint("ties/held", nb))
		} else {
			d.Detailing.ExtraTies = detail.RestraintSteps(l, "ties/", g, p, detail.Traced{B: c.b, H: c.h, Cover: cnom, Link: phiT, Dia: phi, NB: nB, NH: nH})
		}
		c.asBuilt(l, &d, built{p: p, g: g, phi: phi, phiT: phiT, cnom: cnom, nBars: nb, s: s1, sRed: s2, zone: zone, l0: l0b,
			laps: lk, restraintOfFaces: g.Restraint(p, detail.RestraintLimit)})
	}

	// Slenderness limit and second order, per axis.
	l.Group = "Slenderness limit"
	omega := l.Add(slender.MechanicalRatio("slend/omega", as, c.fyd, c.ac, c.fcd))
	factB := l.Add(slender.FactorB("slend/B", omega))
	kLim := param(prm, "lambda_lim_k", "")
	sec := c.section(pos, p.BarArea())
	var mEds [2]trace.Q
	for k := 0; k < 2; k++ {
		a := &c.ax[k]
		n := a.name
		ax := &d.Y
		if k == 1 {
			ax = &d.Z
		}
		if c.tension {
			ax.L0, ax.Lambda, ax.M01, ax.M02, ax.M0Ed = a.l0.V, a.lambda.V, a.m01.V, a.m02.V, a.m02.V
			l.Group = "Design moment about " + n + " (tension)"
			mEd := l.Add(trace.Formula(n+"/MEd", "Design moment in tension: the larger end moment, no imperfection or second order", "EN 1992-1-1:2004 6.1(4); 5.8.2",
				"M_Ed", "Nmm", a.m02.V, "M_02", trace.A("M_02", a.m02)).
				Note("NEd is a tension: the imperfections of 5.2, the minimum eccentricity of 6.1(4) and the second-order effects of 5.8 concern members in compression and do not apply."))
			ax.MEd = mEd.V
			mEd.Symbol = "M_Ed," + n
			if last := l.Last(); last != nil {
				last.Symbol = mEd.Symbol
			}
			mEds[k] = mEd
			continue
		}
		l.Group = "Slenderness limit about " + n
		lim := l.Add(onAxis(n, slender.LambdaLim(n+"/lambda_lim", kLim, a.factorA, factB, a.factorC, c.nRel)))
		sl := l.Add(onAxis(n, slender.IsSlender(n+"/slender", a.lambda, lim)))
		ax.L0, ax.Lambda, ax.LambdaLim, ax.Slender = a.l0.V, a.lambda.V, lim.V, sl.V == 1
		ax.M01, ax.M02, ax.Ei, ax.M0Ed, ax.PhiEf = a.m01.V, a.m02.V, a.ei.V, a.m02i.V, a.phiEf.V
		var mEd trace.Q
		if ax.Slender {
			method := c.in.Options.SecondOrder
			m0e := l.Add(onAxis(n, slender.EquivalentMoment(n+"/M0e", a.m01i, a.m02i)))
			// Bending about y: the rows of bars lie along z (n_h rows, n_b bars in each outer one).
			var is trace.Q
			if c.circle {
				is = l.Add(onAxis(n, slender.RingGyration(n+"/i_s", rs)))
			} else {
				edge, outer, rows := zc, nB, nH
				if k == 1 {
					edge, outer, rows = yc, nH, nB
				}
				is = l.Add(onAxis(n, slender.ReinforcementGyration(n+"/i_s", edge, outer, rows)))
			}
			var mCurv, mStiff trace.Q
			var m2Curv, m2Stiff float64
			if method != model.SecondOrderStiffness {
				l.Group = "Second-order moment about " + n + " (nominal curvature, 5.8.8)"
				epsYd := l.Add(slender.YieldStrain(n+"/eps_yd", c.fyd, c.es))
				dd := l.Add(onAxis(n, slender.EffectiveDepth(n+"/d", a.depth, is)))
				r0 := l.Add(onAxis(n, slender.BaseCurvature(n+"/inv_r0", epsYd, dd)))
				kr := l.Add(slender.Kr(n+"/Kr", c.nRel, omega))
				beta := l.Add(onAxis(n, slender.Beta(n+"/beta", c.fck, a.lambda)))
				kphi := l.Add(onAxis(n, slender.Kphi(n+"/Kphi", beta, a.phiEf)))
				curv := l.Add(onAxis(n, slender.Curvature(n+"/inv_r", kr, kphi, r0)))
				e2 := l.Add(onAxis(n, slender.SecondOrderEccentricity(n+"/e2", curv, a.l0, param(prm, "c_curv", ""))))
				m2 := l.Add(onAxis(n, slender.SecondOrderMoment(n+"/M2", c.nEd, e2)))
				mCurv = l.Add(slender.DesignMomentSlender(n+"/MEd_curv", a.m01i, a.m02i, m0e, m2, c.nEd, a.e0))
				m2Curv = m2.V
			}
			if method == model.SecondOrderStiffness || method == model.SecondOrderBoth {
				l.Group = "Second-order moment about " + n + " (nominal stiffness, 5.8.7)"
				rho := l.Add(slender.SteelRatio(n+"/rho", as, c.ac))
				k1 := l.Add(slender.K1(n+"/k1", c.fck))
				k2 := l.Add(onAxis(n, slender.K2(n+"/k2", c.nRel, a.lambda)))
				kc := l.Add(onAxis(n, slender.Kc(n+"/Kc", k1, k2, a.phiEf)))
				ks := l.Add(slender.Ks(n+"/Ks", rho))
				ecd := l.Add(slender.Ecd(n+"/Ecd", c.ecm, trace.Const(slender.GammaCE, "γ_cE", "")))
				width := c.b
				if k == 1 {
					width = c.h
				}
				var ic trace.Q
				if c.circle {
					ic = l.Add(onAxis(n, slender.CircleInertia(n+"/Ic", c.b)))
				} else {
					ic = l.Add(onAxis(n, slender.ConcreteInertia(n+"/Ic", width, a.depth)))
				}
				isq := l.Add(onAxis(n, slender.SteelInertia(n+"/Is", as, is)))
				ei := l.Add(onAxis(n, slender.NominalStiffness(n+"/EI", kc, ecd, ic, ks, c.es, isq)))
				nb := l.Add(onAxis(n, slender.BucklingLoad(n+"/NB", ei, a.l0)))
				c0 := l.Add(slender.C0(n+"/c0", slender.ShapeConstant))
				bt := l.Add(slender.MomentBeta(n+"/beta_M", c0))
				km := l.Add(onAxis(n, slender.Magnification(n+"/kM", bt, nb, c.nEd)))
				resistance(slender.BucklingCheck(n+"/check_NB", c.nEd, nb))
				mm := l.Add(onAxis(n, slender.MagnifiedMoment(n+"/M_mag", m0e, km)))
				mStiff = l.Add(slender.DesignMomentStiffness(n+"/MEd_stiff", mm, a.m02i, c.nEd, a.e0))
				m2Stiff = mStiff.V - m0e.V
			}
			switch method {
			case model.SecondOrderStiffness:
				mEd, ax.M2 = mStiff, math.Max(m2Stiff, 0)
			case model.SecondOrderBoth:
				l.Group = "Design moment about " + n + ": the larger of the two methods"
				mEd = l.Add(trace.Formula(n+"/MEd", "Design moment, the larger of nominal curvature and nominal stiffness", "EN 1992-1-1:2004 5.8.5", "M_Ed", "Nmm",
					math.Max(mCurv.V, mStiff.V), "max(M_curv, M_stiff)", trace.A("M_curv", mCurv), trace.A("M_stiff", mStiff)))
				ax.M2 = m2Curv
				if mStiff.V > mCurv.V {
					ax.M2 = math.Max(m2Stiff, 0)
				}
			default:
				mEd, ax.M2 = mCurv, m2Curv
			}
		} else {
			l.Group = "Design moment about " + n
			mEd = l.Add(slender.DesignMomentStocky(n+"/MEd", a.m02i, c.nEd, a.e0))
		}
		ax.MEd = mEd.V
		mEd.Symbol = "M_Ed," + n
		if last := l.Last(); last != nil {
			last.Symbol = mEd.Symbol
		}
		mEds[k] = mEd
	}

	// Section resistance.
	l.Group = "Resistance to axial force"
	nRdMax := l.Add(sec.nRdMaxStep("sec/NRd_max"))
	d.NRdMax = nRdMax.V
	if c.tension {
		nRdT := l.Add(trace.Formula("sec/NRd_t", "Resistance to pure tension: every bar at its design yield strength", "EN 1992-1-1:2004 6.1; 3.2.7",
			"N_Rd,t", "N", as.V*c.fyd.V, "A_s * f_yd", trace.A("A_s", as), trace.A("f_yd", c.fyd)))
		resistance(trace.Check("sec/check_Nt", "Axial tension", "EN 1992-1-1:2004 6.1", "|N_Ed| ≤ N_Rd,t",
			-c.nEd.V/nRdT.V, "-N_Ed / N_Rd_t", trace.A("N_Ed", c.nEd), trace.A("N_Rd_t", nRdT)))
	} else {
		resistance(trace.Check("sec/check_N", "Axial force", "EN 1992-1-1:2004 6.1", "N_Ed ≤ N_Rd,max",
			c.nEd.V/nRdMax.V, "N_Ed / N_Rd_max", trace.A("N_Ed", c.nEd), trace.A("N_Rd_max", nRdMax)))
	}
	var mRd [2]trace.Q
	var circleQ trace.Q
	circleOK := false
	if c.circle {
		circleQ, circleOK = sec.circleSteps(l, c.nEd, full)
		if m, ok := sec.least(c.nEd.V); ok {
			d.theta = m.State.Theta // the interaction diagram's direction (cached: no second search)
		}
	}
	for k := 0; k < 2; k++ {
		n := c.ax[k].name
		l.Group = "Moment resistance about " + n + " at N_Ed"
		q, ok := circleQ, circleOK
		if !c.circle {
			q, ok = sec.mRdSteps(l, n, k, c.nEd, full)
		}
		if !ok {
			mRd[k] = l.Add(trace.Input(n+"/MRd", "Moment resistance about "+n+": none, NEd exceeds the axial resistance", "EN 1992-1-1:2004 6.1", "M_Rd,"+n, "Nmm", 0).
				Caution("NEd exceeds NRd,max: the section cannot carry the axial force, so it has no moment resistance; the axial check fails."))
			continue
		}
		mRd[k] = q
		mEd := mEds[k]
		resistance(shownRatio(trace.Check(n+"/check_M", "Bending about "+n, "EN 1992-1-1:2004 6.1", "M_Ed,"+n+" ≤ M_Rd,"+n,
			mEd.V/math.Max(mRd[k].V, 1), "M_Ed / max(M_Rd, 1)", trace.A("M_Ed", mEd), trace.A("M_Rd", mRd[k])), mRd[k].V))
	}
	d.Y.MRd, d.Z.MRd = mRd[0].V, mRd[1].V

	// Fire resistance, EN 1992-1-2:2004 5.3.2, Method A (Table 5.2a, or Eq. (5.7)), or a rating
	// verified elsewhere and recorded as such.
	checks = c.fireSteps(l, &d, checks, p, fireBars{cnom: cnom, phiT: phiT, phi: phi, nb: nb, as: as, omega: omega, nRdMax: nRdMax})

	if c.circle {
		c.circleBiaxial(l, &d, mEds, mRd, resistance)
	} else {
		// Biaxial bending, EN 1992-1-1:2004 5.8.9.
		l.Group = "Biaxial bending"
		ca := l.Add(slender.SlendernessRatiosClose("bi/c_a", c.ax[0].lambda, c.ax[1].lambda))
		cb := l.Add(slender.EccentricitiesApart("bi/c_b", mEds[0], mEds[1], c.b, c.h))
		nRd := l.Add(slender.NRdBiaxial("bi/NRd", c.ac, c.fcd, as, c.fyd))
		aExp := l.Add(slender.ExponentA("bi/a", c.nEd, nRd))
		d.Biaxial.A = aExp.V
		d.Biaxial.Checked = !(ca.V == 1 && cb.V == 1)
		// In tension (5.39) does not apply (5.8.9 concerns compression members): the exact
		// resistance with an inclined neutral axis is the check.
		exact := c.in.Options.Biaxial == model.BiaxialExact || c.tension
		if mRd[0].V > 0 && mRd[1].V > 0 {
			s := slender.BiaxialRatio("bi/ratio", mEds[0], mRd[0], mEds[1], mRd[1], aExp)
			d.Biaxial.Ratio = s.Value
			switch {
			case d.Biaxial.Checked && exact:
				s.Kind, s.Verdict, s.Relation = trace.KindFormula, "", ""
				s.Title = "Biaxial ratio of (5.39), for comparison (the exact resistance below is the check)"
				l.Add(s)
			case d.Biaxial.Checked:
				resistance(s)
			default:
				s.Kind, s.Verdict, s.Relation = trace.KindFormula, "", ""
				s.Title = "Biaxial ratio (for information)"
				l.Add(s.Note("(5.38a) and (5.38b) both hold: the separate checks about y and z suffice, 5.8.9(3)."))
			}
		} else {
			d.Biaxial.Ratio = 0
			l.Add(trace.Input("bi/ratio", "Biaxial ratio: not computed, the section has no moment resistance", "EN 1992-1-1:2004 5.8.9(4)", "ratio", "", 0))
		}

		// The exact resistance along the resultant design moment, with an inclined neutral axis:
		// beside (5.39) on every sheet, and the check itself when the input asks for it. With
		// (5.39) in use it is shown for comparison only; where it gives the larger ratio the
		// design says so in its cautions, and loudly where it exceeds 1.
		if (full || exact) && mRd[0].V > 0 && mRd[1].V > 0 {
			theta := math.Atan2(mEds[1].V, mEds[0].V)
			// The check in use beside the exact resistance when design.biaxial is "5.39": (5.39)
			// where (5.38) calls for it, else the separate checks about y and z (5.8.9(3)).
			use := inUse{name: "(5.39)", ratio: d.Biaxial.Ratio, checked: d.Biaxial.Checked}
			if !d.Biaxial.Checked {
				use.name = "the separate checks about y and z"
				use.ratio = math.Max(mEds[0].V/mRd[0].V, mEds[1].V/mRd[1].V)
			}
			if st, err := sec.sec.Biaxial(c.nEd.V, theta); err == nil {
				l.Group = "Biaxial bending: exact resistance (inclined neutral axis)"
				if full {
					refs := section.Refs{Fcd: c.fcd.From, Eta: c.eta.From}
					mr, ratio := sec.sec.BiaxialStep(l, "bi/exact/", c.nEd, mEds[0], mEds[1], st, refs)
					last := l.Last()
					d.Exact = &Exact{MRd: mr.V, Ratio: ratio.V, Angle: st.Angle, My: st.My, Mz: st.Mz}
					switch {
					case exact:
						checks = append(checks, checked{last.ID, true})
						*last = last.Note("The exact section resistance is the check in use (design.biaxial: exact). " + which(d.Biaxial.Ratio, ratio.V))
					default:
						last.Kind, last.Verdict, last.Relation = trace.KindFormula, "", ""
						last.Title = "Biaxial bending, exact section resistance (for comparison; " + use.name + " in use)"
						note, stepCaution, caution := use.beside(ratio.V)
						*last = last.Note(note)
						if stepCaution != "" {
							*last = last.Caution(stepCaution)
						}
						if caution != "" {
							d.Cautions = append(d.Cautions, caution)
						}
					}
				} else {
					// A trial: the ratio alone, by the same solution, as a check step.
					med := math.Hypot(mEds[0].V, mEds[1].V)
					resistance(shownRatio(trace.Check("bi/exact/check", "Biaxial bending, exact section resistance", "EN 1992-1-1:2004 6.1", "M_Ed ≤ M_Rd",
						med/math.Max(st.MRd, 1), "M_Ed / max(M_Rd, 1)", trace.A("M_Ed", trace.Const(med, "M_Ed", "Nmm")), trace.A("M_Rd", trace.Const(st.MRd, "M_Rd", "Nmm"))), st.MRd))
				}
			} else if exact {
				resistance(trace.Check("bi/exact/check", "Biaxial bending, exact section resistance: no solution", "EN 1992-1-1:2004 6.1", "M_Ed ≤ M_Rd",
					2, "r", trace.A("r", trace.Const(2, "r", ""))).Unmet().Caution("The inclined neutral axis could not be found: " + err.Error()))
			} else if full {
				// Shown for comparison, and not found: the sheet says so, loudly where no inclined
				// neutral axis carries NEd with the reduced block.
				l.Group = "Biaxial bending: exact resistance (inclined neutral axis)"
				l.Add(trace.Input("bi/exact/none", "Biaxial bending, exact section resistance: not found (for comparison; "+use.name+" in use)", "EN 1992-1-1:2004 6.1", "found", "", 0).
					Caution("The inclined neutral axis could not be found: " + err.Error()))
				if errors.Is(err, section.ErrReducedBlock) {
					d.Cautions = append(d.Cautions, fmt.Sprintf("Biaxial bending: the section does NOT resist the design moments along their resultant by strain compatibility: with the rectangular block reduced for an inclined neutral axis (EN 1992-1-1:2004 3.1.7(3), note) no strain plane carries NEd, while %s, the check in use by the input's choice (design.biaxial: 5.39), gives %.3f. Consider design.biaxial: exact.", use.name, use.ratio))
				}
			}
		}

	}

	d.checks = checks
	c.settle(&d, l, checks)
	return d
}

// fireBars holds the bar-dependent quantities the fire resistance of a pattern takes.
type fireBars struct {
	cnom, phiT, phi, nb, as, omega, nRdMax trace.Q
}

// fireSteps records the fire resistance of the lift with pattern p, EN 1992-1-2:2004 5.3.2,
// Method A (Table 5.2a, or Eq. (5.7)), or a rating verified elsewhere and recorded as such, or
// that none is asked; it returns checks with the fire checks added.
func (c *common) fireSteps(l *trace.Log, d *Design, checks []checked, p detail.Pattern, fb fireBars) []checked {
	prm := c.p
	cnom, phiT, phi, nb, as, omega, nRdMax := fb.cnom, fb.phiT, fb.phi, fb.nb, fb.as, fb.omega, fb.nRdMax
	if f := c.fire(); f != nil && f.Rating > 0 && c.tension {
		l.Group = "Fire resistance R" + strconv.Itoa(f.Rating)
		l.Add(fire.RatingInput("fire/R_req", f.Rating).
			Caution("NEd is a tension: EN 1992-1-2 5.3.2 (Method A) concerns columns in compression and is not applied to this case; verify the fire resistance of the member in tension by other means (EN 1992-1-2 Section 4 or 5.6 as for members in tension)."))
	} else if f != nil && f.Rating > 0 {
		fc := fire.Column{B: c.b, H: c.h, Circle: c.circle, Ac: c.ac, Fck: c.fck, Cover: cnom, LinkDia: phiT, Dia: phi, Bars: nb, As: as, NEd: c.nEd,
			M0EdY: c.ax[0].m02i, M0EdZ: c.ax[1].m02i, Omega: omega, AlphaCc: param(prm, "alpha_cc", ""), EMax: param(prm, "fire_emax", ""),
			MuFixed: !f.UseMuFi}
		if f.Method == model.FireElsewhere {
			l.Group = "Fire resistance R" + strconv.Itoa(f.Rating) + " (verified elsewhere)"
			d.Detailing.SurfaceMesh = fire.Elsewhere(l, "fire/", f.Rating, f.Note, fc)
			d.Detailing.FireRating, d.Detailing.FireOK, d.Detailing.FireMethod = f.Rating, true, fire.RouteElsewhere
			d.Cautions = append(d.Cautions, fmt.Sprintf("Fire resistance R%d verified elsewhere, outside this calculation (no check of EN 1992-1-2 Method A here): %s", f.Rating, f.Note))
		} else {
			l.Group = "Fire resistance R" + strconv.Itoa(f.Rating) + " (EN 1992-1-2 5.3.2, Method A)"
			fc.L0Fi = l.Add(trace.Formula("fire/l0_fi", "Effective length in fire, taken as at normal temperature", "EN 1992-1-2:2004 5.3.2(2)", "l_0,fi", "mm",
				math.Max(c.ax[0].l0.V, c.ax[1].l0.V), "max(l0_y, l0_z)", trace.A("l0_y", c.ax[0].l0), trace.A("l0_z", c.ax[1].l0)))
			fc.EY, fc.EZ = fire.Eccentricities(l, "fire/", fc)
			mu := c.fireUtilisation(l, f, p, nRdMax, fc.EY, fc.EZ)
			out := fire.Assess(l, "fire/", f.Rating, mu, fc)
			for _, v := range out.Checks {
				checks = append(checks, checked{v.ID, false})
				d.failure(v.ID, v.Reason, v.Fixed)
			}
			d.Detailing.FireRating, d.Detailing.FireOK, d.Detailing.FireMethod = f.Rating, out.OK, out.Route
			d.Detailing.SurfaceMesh = out.Mesh
		}
		if d.Detailing.SurfaceMesh {
			d.Cautions = append(d.Cautions, "Surface reinforcement against falling off of concrete in fire (EN 1992-1-2 4.5.2(2)): the axis distance of the main bars is 70 mm or more, so a mesh is required in the cover (spacing not above 100 mm, bars not below 4 mm) unless tests show that the concrete does not fall off.")
		}
	} else {
		// No rating asked of this lift: the sheet says so, so that no lift is silent on fire.
		l.Group = "Fire resistance: none required"
		l.Add(fire.RatingInput("fire/R_req", 0).
			Note("The input asks no standard fire resistance of this lift, so none is checked. The building regulations and the project's fire strategy govern; give a rating in the design options, the fire levels of the building or the column where one is required."))
	}
	return checks
}

// checked names a check step and says whether it compares an action with a resistance.
type checked struct {
	id         string
	resistance bool
}

// settle sets the utilisation, status, governing check and reasons of d from its check steps.
// The utilisation is the largest ratio of action to resistance; a failed detailing rule
// counts as well, so that a design never passes with a utilisation below 1 and a failure.
func (c *common) settle(d *Design, l *trace.Log, checks []checked) {
	d.Status = StatusPass
	d.Utilization = 0
	d.Governing = ""
	d.Reasons = nil
	for i, ch := range checks {
		if slices.ContainsFunc(checks[:i], func(x checked) bool { return x.id == ch.id }) {
			continue // counted already
		}
		var s *trace.Step
		for i := len(l.Steps) - 1; i >= 0; i-- {
			if l.Steps[i].ID == ch.id {
				s = &l.Steps[i]
				break
			}
		}
		if s == nil || !(ch.resistance || s.Verdict == trace.Fail) {
			continue
		}
		title := checkTitle(*s)
		if s.Value > d.Utilization || d.Governing == "" {
			d.Utilization = s.Value
			d.Governing = title + " (" + s.Clause + ")"
		}
		if s.Verdict == trace.Fail {
			d.Status = StatusFail
			if d.trial {
				continue // a trial is read for its status and utilisation only
			}
			var reason string
			if len(s.Args) == 0 {
				// A condition with no ratio to give (unmet).
				reason = fmt.Sprintf("%s: not met (%s)", title, s.Clause)
			} else {
				reason = fmt.Sprintf("%s: %s does not hold (ratio %.3f, %s)", title, s.Relation, s.Value, s.Clause)
			}
			if r := d.reasons[ch.id]; r != "" {
				reason = r // the check's own words with its values (the scope of the fire method)
			}
			if !slices.Contains(d.Reasons, reason) {
				d.Reasons = append(d.Reasons, reason)
			}
		}
	}
	d.Steps = l.Steps
}

// checkTitle returns the title of a check step, naming its axis ("… about y") where the step
// belongs to one axis (a part of its ID is "y" or "z") and the title does not say so already.
func checkTitle(s trace.Step) string {
	for rest := s.ID; rest != ""; {
		var part string
		part, rest, _ = strings.Cut(rest, "/")
		if (part == "y" || part == "z") && !strings.Contains(s.Title, "about "+part) {
			return s.Title + " about " + part
		}
	}
	return s.Title
}

// unmet returns the failed check of a condition that has no ratio to give: its value 2 only
// marks the failure, and settle words its reason as "not met"; the sheets show it as "not met".
func unmet(id, title, clause, relation, caution string) trace.Step {
	return trace.Check(id, title, clause, relation, 2, "2").Unmet().Caution(caution)
}

// shownRatio returns the check M_Ed / max(M_Rd, 1) shown as M_Ed / M_Rd where the resistance
// mRd is not below the guard of 1 N·mm.
func shownRatio(s trace.Step, mRd float64) trace.Step {
	if mRd >= 1 {
		return s.Shown("M_Ed / M_Rd")
	}
	return s
}

// layersOf groups bar positions into rows along the lever arm of axis k (0: coordinate z, 1: coordinate y).
func layersOf(pos [][2]float64, k int) []slender.Layer {
	idx := 1
	if k == 1 {
		idx = 0
	}
	var out []slender.Layer
	for _, p := range pos {
		v := p[idx]
		found := false
		for i := range out {
			if math.Abs(out[i].Coord-v) < 1e-6 {
				out[i].Count++
				found = true
				break
			}
		}
		if !found {
			out = append(out, slender.Layer{Coord: v, Count: 1})
		}
	}
	return out
}

// which compares the ratio of (5.39) with that of the exact section resistance, the check in
// use under design.biaxial: exact.
func which(rule, exact float64) string {
	switch {
	case rule > exact*(1+1e-9):
		return "(5.39), shown for comparison, gives a larger ratio: it would be the more conservative here."
	case rule < exact*(1-1e-9):
		return "(5.39), shown for comparison, gives a smaller ratio: the exact section resistance is the more conservative here."
	}
	return "(5.39), shown for comparison, gives the same ratio."
}

// inUse is the biaxial check in use under design.biaxial "5.39": (5.39), or the separate
// checks about y and z where (5.38a) and (5.38b) both hold.
type inUse struct {
	name    string  // "(5.39)" or "the separate checks about y and z"
	ratio   float64 // its ratio: (5.39), or the larger of MEd/MRd about y and z
	checked bool    // (5.39) is the check
}

// beside words the exact section resistance, of ratio exact, shown beside the check in use:
// the note of its step, a caution for the step (no numbers) and one for the design (with
// both ratios), each empty where there is nothing to caution: the design is cautioned, loudly,
// only where the exact ratio exceeds 1 while the check in use passes (a larger ratio below 1
// is said in the step's note, not in the design's cautions, which a checker reads first). (5.39) is the check EN 1992-1-1:2004
// 5.8.9(4) permits; the separate checks, 5.8.9(3).
func (u inUse) beside(exact float64) (note, stepCaution, caution string) {
	const tol = 1e-9
	larger := exact > u.ratio*(1+tol)
	byChoice := u.name + " is the check in use by the input's choice (design.biaxial: 5.39)"
	if !u.checked {
		byChoice = "(5.38a) and (5.38b) both hold, so with design.biaxial: 5.39, the input's choice, " + u.name + " are in use (EN 1992-1-1:2004 5.8.9(3))"
	}
	switch {
	case larger:
		than := u.name
		if !u.checked {
			than = "the larger of " + u.name
		}
		note = "The exact section resistance gives a larger ratio than " + than + "; " + byChoice + "."
	case exact < u.ratio*(1-tol):
		note = "The exact section resistance gives a smaller ratio than " + u.name + ", the check in use: " + u.name + " is the more conservative here."
	default:
		note = "The exact section resistance gives the same ratio as " + u.name + ", the check in use."
	}
	switch {
	case exact > 1+tol && u.ratio <= 1+tol:
		stepCaution = "The exact section resistance is exceeded while " + u.name + " passes: the section does not resist the design moments along their resultant by strain compatibility. Consider design.biaxial: exact."
		caution = fmt.Sprintf("Biaxial bending: the section does NOT resist the design moments along their resultant by strain compatibility: the exact section resistance gives the ratio %.3f > 1, while %s, the check in use by the input's choice (design.biaxial: 5.39), passes at %.3f. Consider design.biaxial: exact.", exact, u.name, u.ratio)
	}
	return note, stepCaution, caution
}

// durability returns the durability data of the column, its own or the project's, or nil.
func (c *common) durability() *model.Durability {
	if c.col.Durability != nil {
		return c.col.Durability
	}
	return c.in.Options.Durability
}

// fire returns the fire data of the lift: the column's own, the level's (building form), or the project's.
func (c *common) fire() *model.Fire {
	if c.col.Fire != nil {
		return c.col.Fire
	}
	if b := c.in.Building; b != nil {
		for k := range b.Fires {
			for _, lv := range b.Fires[k].Levels {
				if lv == c.st.Name {
					return &b.Fires[k].Fire
				}
			}
		}
	}
	return c.in.Options.Fire
}

// fireUtilisation records ηfi and μfi of EN 1992-1-2:2004 5.3.2(3) for the bar pattern p. With
// mu_fi: computed, NRd is the resistance of the column at normal temperature at the eccentricity
// of NEd (fire.NRdAtEccentricity): at each trial axial force the first-order end moments (and so
// the imperfection's) grow in proportion, and quickResist applies the design checks of the
// column, second order and the biaxial check included, by the same formulas as the trace.
func (c *common) fireUtilisation(l *trace.Log, f *model.Fire, p detail.Pattern, nRdMax, eY, eZ trace.Q) trace.Q {
	var nRd trace.Q
	if f.UseMuFi && c.nEd.V > 0 {
		nRd = l.Add(c.fireNRd(p, nRdMax, eY, eZ))
	}
	return fire.Utilisation(l, "fire/", *f, c.nEd, nRd)
}

// fireNRd returns the step of NRd of μfi for the bar pattern p (fire.NRdAtEccentricity), the
// resistance of the column at normal temperature at the eccentricities eY and eZ of NEd.
func (c *common) fireNRd(p detail.Pattern, nRdMax, eY, eZ trace.Q) trace.Step {
	at := func(n float64) fire.Ratios {
		at := *c
		for k := range at.ax {
			at.ax[k].m01.V *= n / c.nEd.V
			at.ax[k].m02.V *= n / c.nEd.V
		}
		q := at.quickResist(p, n)
		return fire.Ratios{N: n, NRdMax: q.nRdMax, MEdY: q.mEd[0], MRdY: q.mRd[0], MEdZ: q.mEd[1], MRdZ: q.mRd[1], Biaxial: q.ratioB, OK: q.ok}
	}
	return fire.NRdAtEccentricity("fire/N_Rd", nRdMax, eY, eZ, at)
}

// failure records, for the check step id, the reason to give where it fails (empty: settle's
// usual words) and whether no bar pattern can make it hold (fixed).
func (d *Design) failure(id, reason string, fixed bool) {
	if reason != "" {
		if d.reasons == nil {
			d.reasons = map[string]string{}
		}
		d.reasons[id] = reason
	}
	if fixed {
		if d.fixed == nil {
			d.fixed = map[string]bool{}
		}
		d.fixed[id] = true
	}
}

// failsOnlyOnFixed reports whether d fails and every check that fails is one that no bar pattern
// can make hold (the scope of the fire method): trying more or other bars would not help.
func (d *Design) failsOnlyOnFixed() bool {
	if d.Status == StatusPass || len(d.fixed) == 0 {
		return false
	}
	for _, ch := range d.checks {
		for i := len(d.Steps) - 1; i >= 0; i-- {
			if s := &d.Steps[i]; s.ID == ch.id {
				if s.Verdict == trace.Fail && !d.fixed[ch.id] {
					return false
				}
				break
			}
		}
	}
	return true
}
