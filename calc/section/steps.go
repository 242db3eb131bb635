package section

import (
	"math"
	"strconv"
	"strings"

	"colsheet/calc/trace"
)

// Clause strings used by the trace.
const (
	clausePR      = "EN 1992-1-1:2004 3.1.7(1), Eq. (3.17)-(3.18)"
	clauseRect    = "EN 1992-1-1:2004 3.1.7(3), Eq. (3.19)-(3.22)"
	clauseSteel   = "EN 1992-1-1:2004 3.2.7(2)b, Fig. 3.8"
	clausePivots  = "EN 1992-1-1:2004 6.1(5), Fig. 6.1"
	clausePlane   = "EN 1992-1-1:2004 6.1(2)P, Fig. 6.1"
	clauseCommon  = "common practice"
	methodBrent   = "Brent's method (Brent 1973, zeroin) on the strain-profile parameter, |N − N_Ed| ≤ 1e-9·N_Rd,max"
	methodUniform = "none: N_Ed reaches N_Rd,max, so the strain is uniform over the section"
)

// layerName holds the names of bar layer i+1 in the trace: the strings are the same for every
// section, so they are made once for the first layers rather than at each step.
type layerName struct {
	num                 string    // "1", "2", …
	fs, as, epsS, sigS  string    // F_s1, A_s1, ε_s1, σ_s1
	sigC                string    // σ_c1
	epsID, sigID, sigCI string    // eps_s1, sigma_s1, sigma_c1
	coord               [2]string // z_s1 (bending about y), y_s1 (about z)
	stress, concrete    string    // titles of the steel and displaced-concrete stresses
	force               string    // title of the layer force
}

// layerNames are the names of the first bar layers; layerNamed makes those of any layer.
var layerNames = func() (out [24]layerName) {
	for i := range out {
		out[i] = makeLayerName(i)
	}
	return out
}()

func makeLayerName(i int) layerName {
	n := strconv.Itoa(i + 1)
	return layerName{num: n, fs: "F_s" + n, as: "A_s" + n, epsS: "ε_s" + n, sigS: "σ_s" + n, sigC: "σ_c" + n,
		epsID: "eps_s" + n, sigID: "sigma_s" + n, sigCI: "sigma_c" + n, coord: [2]string{"z_s" + n, "y_s" + n},
		stress:   "Steel stress in layer " + n + ", Es·ε limited to ±f_yd",
		concrete: "Stress of the concrete displaced by layer " + n,
		force:    "Force in layer " + n + ", displaced concrete deducted"}
}

// layerNamed returns the names of bar layer i+1.
func layerNamed(i int) layerName {
	if i < len(layerNames) {
		return layerNames[i]
	}
	return makeLayerName(i)
}

// resistSymbol is the symbol of the moment of resistance about each axis.
var resistSymbol = [...]string{AxisY: "M_Rd,y", AxisZ: "M_Rd,z"}

// Refs names the steps that produced the section's inputs, so that trace arguments can
// point at them; empty fields leave the arguments without a producing step.
type Refs struct {
	Fcd, Fyd, Es string // steps giving fcd, fyd and Es
	B, H         string // steps giving b and h
	EpsPeak      string // step giving εc2 (or εc3 for the rectangular block)
	EpsUlt       string // step giving εcu2 (or εcu3)
	N            string // step giving the exponent n of the parabola
	Lambda, Eta  string // steps giving λ and η of the rectangular block
}

// Trace records in log the steps of the equilibrium state st of the section (from MRd,
// MRdAt or MRdBoth) at axial force NEd: the solve step for the neutral axis with its
// equilibrium residual, the concrete resultant and its lever arm, the strain, stresses
// and force of each bar layer, and the moment of resistance, which it returns.
// Step IDs are id followed by a short name; every expression reproduces its value.
func (s *Section) Trace(log *trace.Log, id string, NEd trace.Q, st State, refs Refs) trace.Q {
	axis, face := st.Axis, st.Face
	if face != Negative {
		face = Positive
	}
	f := s.frame(axis, face)
	pr := f.profile(math.Max(math.Min(st.P, 2), 1e-12))
	layers := s.layers(axis, &f)

	// Names in expressions: dn is the depth along the bending direction, wn the width.
	dn, wn, cn := "h", "b", "z"
	dq := trace.Q{V: s.H, Symbol: "h", Unit: "mm", From: refs.H}
	wq := trace.Q{V: s.B, Symbol: "b", Unit: "mm", From: refs.B}
	if axis == AxisZ {
		dn, wn, cn = "b", "h", "y"
		dq, wq = wq, dq
	}
	D := dq.V
	fcd := trace.Q{V: s.Fcd, Symbol: "f_cd", Unit: "MPa", From: refs.Fcd}
	fyd := trace.Q{V: s.Fyd, Symbol: "f_yd", Unit: "MPa", From: refs.Fyd}
	es := trace.Q{V: s.Es, Symbol: "E_s", Unit: "MPa", From: refs.Es}
	con := func(v float64, sym, from string) trace.Q { return trace.Q{V: v, Symbol: sym, Unit: "", From: from} }
	c := s.Concrete
	var epk, eult trace.Q
	pkn, ultn := "eps_c2", "eps_cu2"
	if f.rect {
		epk, eult = con(c.EpsC3, "ε_c3", refs.EpsPeak), con(c.EpsCu3, "ε_cu3", refs.EpsUlt)
		pkn, ultn = "eps_c3", "eps_cu3"
	} else {
		epk, eult = con(c.EpsC2, "ε_c2", refs.EpsPeak), con(c.EpsCu2, "ε_cu2", refs.EpsUlt)
	}
	nq, lam, eta := con(c.N, "n", refs.N), con(c.Lambda, "λ", refs.Lambda), con(c.Eta, "η", refs.Eta)

	// IDs of later steps, as the log will name them (the solve step refers forward to them).
	full := func(name string) string { return log.Prefix + id + name }

	// Layer forces, computed first so that the solve step can state the residual.
	// Every value below mirrors its expression operation for operation (float64()
	// conversions keep the compiler from fusing multiply-adds), so Recheck is exact.
	type lv struct{ eps, ss, sc, force float64 }
	vals := make([]lv, len(layers))

	// Solve step.
	var xq, ebq, etq trace.Q
	etq = eult
	etop, ebot := f.eult, 0.0
	x := pr.x
	if !pr.pivotC {
		xq = trace.Q{V: x, Symbol: "x", Unit: "mm", From: full("x")}
	} else {
		ebot = pr.ebot
		ebq = trace.Q{V: ebot, Symbol: "ε_bot", Unit: "", From: full("eps_bot")}
		etop = f.epk + float64((f.epk-ebot)*(f.eult-f.epk))/f.epk
		etq = trace.Q{V: etop, Symbol: "ε_top", Unit: "", From: full("eps_top")}
	}

	// Concrete block.
	var alphaR, ka, dc, fc, zc float64
	r := f.epk / f.eult
	if f.rect {
		if !pr.pivotC {
			dc = math.Min(float64(f.lambda*x), D)
		} else {
			dc = float64(float64(D*f.lambda)*etop) / math.Max(etop-ebot, float64(f.lambda*etop))
		}
		fc = float64(float64(c.Eta*s.Fcd)*wq.V) * dc
		if face == Positive {
			zc = D/2 - dc/2
		} else {
			zc = dc/2 - D/2
		}
	} else {
		n := c.N
		if !pr.pivotC {
			alphaR = 1 - f.epk/float64((n+1)*f.eult)
			ka = (math.Pow(1-r, 2)/2 + float64(float64((1-r)*r)*n)/(n+1) + float64(math.Pow(r, 2)*(1.0/2-1/(n+2)))) / alphaR
			fc = float64(float64(float64(alphaR*s.Fcd)*wq.V) * x)
			if face == Positive {
				zc = D/2 - float64(ka*x)
			} else {
				zc = float64(ka*x) - D/2
			}
		} else {
			un := math.Pow(math.Max(0, 1-ebot/f.epk), n)
			alphaR = 1 - float64(f.epk/f.eult/(n+1)*un)
			ka = (math.Pow(1-r, 2)/2 + float64(float64((1-r)*r)*(1-un/(n+1))) + float64(math.Pow(r, 2)*(1.0/2-un/(n+2)))) / alphaR
			fc = float64(float64(float64(alphaR*s.Fcd)*wq.V) * D)
			if face == Positive {
				zc = D/2 - float64(ka*D)
			} else {
				zc = float64(ka*D) - D/2
			}
		}
	}

	depthExpr := "(" + dn + " / 2 - z)"
	if face == Negative {
		depthExpr = "(" + dn + " / 2 + z)"
	}
	for i, l := range layers {
		t := D/2 - l.Coord
		if face == Negative {
			t = D/2 + l.Coord
		}
		var e float64
		if !pr.pivotC {
			e = float64(f.eult*(x-t)) / x
		} else {
			e = etop - float64((etop-ebot)*t)/D
		}
		ss := math.Max(-s.Fyd, math.Min(s.Fyd, float64(s.Es*e)))
		var sc float64
		if f.rect {
			if t < dc {
				sc = float64(c.Eta * s.Fcd)
			}
		} else {
			sc = s.Fcd * (1 - math.Pow(1-math.Min(math.Max(e, 0), f.epk)/f.epk, c.N))
		}
		vals[i] = lv{e, ss, sc, l.Area * (ss - sc)}
	}
	mval := float64(fc * zc)
	for i, l := range layers {
		mval = mval + float64(vals[i].force*l.Coord)
	}
	if log.Trial {
		// A log that keeps no formula step: the moment alone, as the last step would give it.
		return trace.Q{V: mval, Symbol: resistSymbol[axis], Unit: "Nmm", From: id + "M_Rd"}
	}

	// 1. Solve step with the equilibrium residual.
	verify := []string{"F_c"}
	vargs := []trace.Arg{trace.A("F_c", trace.Q{V: fc, Symbol: "F_c", Unit: "N", From: full("F_c")})}
	res := fc
	for i := range layers {
		name := layerNamed(i).fs
		verify = append(verify, name)
		vargs = append(vargs, trace.A(name, trace.Q{V: vals[i].force, Symbol: name, Unit: "N", From: full(name)}))
		res += vals[i].force
	}
	vargs = append(vargs, trace.A("N_Ed", NEd))
	res -= NEd.V
	verifyExpr := strings.Join(verify, " + ") + " - N_Ed"
	method := methodBrent
	if st.P >= 2 {
		method = methodUniform
	}
	choices := "Concrete: " + s.Block.String() + " block, no tension; steel: horizontal top branch, no strain limit; concrete displaced by bars in compression deducted."
	if !pr.pivotC {
		step := trace.Solve(id+"x", "Neutral-axis depth for equilibrium with N_Ed (pivot B: ε at the compressed face = "+eult.Symbol+")",
			clausePivots, "x", "mm", x, method, verifyExpr, res, vargs...)
		log.Add(step.Note(choices))
	} else {
		step := trace.Solve(id+"eps_bot", "Strain at the less compressed face for equilibrium with N_Ed (pivot C: whole section compressed)",
			clausePivots, "ε_bot", "", ebot, method, verifyExpr, res, vargs...).Note(choices)
		if trace.Finite(pr.x) {
			step = step.Note("The neutral axis lies beyond the section depth " + dn + ", outside the section.")
		} else {
			step = step.Note("Uniform strain: the neutral axis is at infinity.")
		}
		log.Add(step)
		log.Add(trace.Formula(id+"eps_top", "Strain at the compressed face (pivot C)", clausePivots, "ε_top", "", etop,
			pkn+" + ("+pkn+" - eps_bot) * ("+ultn+" - "+pkn+") / "+pkn,
			trace.A(pkn, epk), trace.A(ultn, eult), trace.A("eps_bot", ebq)))
	}

	// 2. Concrete resultant and its lever arm.
	cq := cn + "_c"
	var fcQ, zcQ trace.Q
	if f.rect {
		var dcStep trace.Step
		if !pr.pivotC {
			dcStep = trace.Formula(id+"d_c", "Depth of the rectangular stress block λ·x, at most the section depth", clauseRect, "d_c", "mm", dc,
				"min(lambda * x, "+dn+")", trace.A("lambda", lam), trace.A("x", xq), trace.A(dn, dq))
		} else {
			dcStep = trace.Formula(id+"d_c", "Depth of the rectangular stress block min(λ·x, depth), with x = depth·ε_top/(ε_top − ε_bot)", clauseRect, "d_c", "mm", dc,
				dn+" * lambda * eps_top / max(eps_top - eps_bot, lambda * eps_top)",
				trace.A(dn, dq), trace.A("lambda", lam), trace.A("eps_top", etq), trace.A("eps_bot", ebq))
		}
		dcQ := log.Add(dcStep)
		fcQ = log.Add(trace.Formula(id+"F_c", "Concrete compression resultant η·f_cd over the block", clauseRect, "F_c", "N", fc,
			"eta * fcd * "+wn+" * d_c", trace.A("eta", eta), trace.A("fcd", fcd), trace.A(wn, wq), trace.A("d_c", dcQ)))
		zexpr := dn + " / 2 - d_c / 2"
		if face == Negative {
			zexpr = "d_c / 2 - " + dn + " / 2"
		}
		zcQ = log.Add(trace.Formula(id+"z_c", "Coordinate of F_c from the centroid (centre of the block)", clauseRect, cq, "mm", zc,
			zexpr, trace.A(dn, dq), trace.A("d_c", dcQ)))
	} else {
		rr := "(" + pkn + " / " + ultn + ")"
		var aStep, kStep trace.Step
		if !pr.pivotC {
			aStep = trace.Formula(id+"alpha_R", "Fullness of the parabola-rectangle block over the compressed depth x", clausePR, "α_R", "", alphaR,
				"1 - "+pkn+" / ((n + 1) * "+ultn+")", trace.A(pkn, epk), trace.A(ultn, eult), trace.A("n", nq))
			if c.N == 2 && c.EpsC2 == 0.002 && c.EpsCu2 == 0.0035 {
				aStep = aStep.Note("For n = 2, ε_c2 = 2 ‰ and ε_cu2 = 3.5 ‰: α_R = 17/21 ≈ 0.8095, k_a = 99/238 ≈ 0.416.")
			}
		} else {
			aStep = trace.Formula(id+"alpha_R", "Fullness of the parabola-rectangle block over the whole depth (pivot C)", clausePR, "α_R", "", alphaR,
				"1 - "+pkn+" / "+ultn+" / (n + 1) * max(0, 1 - eps_bot / "+pkn+") ** n",
				trace.A(pkn, epk), trace.A(ultn, eult), trace.A("n", nq), trace.A("eps_bot", ebq))
		}
		aQ := log.Add(aStep)
		var kexpr string
		kargs := []trace.Arg{trace.A(pkn, epk), trace.A(ultn, eult), trace.A("n", nq), trace.A("alpha_R", aQ)}
		if !pr.pivotC {
			kexpr = "((1 - " + rr + ") ** 2 / 2 + (1 - " + rr + ") * " + rr + " * n / (n + 1) + " + rr + " ** 2 * (1 / 2 - 1 / (n + 2))) / alpha_R"
			kStep = trace.Formula(id+"k_a", "Depth of F_c from the compressed face as a fraction of x", clausePR, "k_a", "", ka, kexpr, kargs...)
		} else {
			u := "(max(0, 1 - eps_bot / " + pkn + ") ** n)"
			kexpr = "((1 - " + rr + ") ** 2 / 2 + (1 - " + rr + ") * " + rr + " * (1 - " + u + " / (n + 1)) + " + rr + " ** 2 * (1 / 2 - " + u + " / (n + 2))) / alpha_R"
			kargs = append(kargs, trace.A("eps_bot", ebq))
			kStep = trace.Formula(id+"k_a", "Depth of F_c from the compressed face as a fraction of the section depth", clausePR, "k_a", "", ka, kexpr, kargs...)
		}
		kQ := log.Add(kStep)
		lq, ln := xq, "x"
		if pr.pivotC {
			lq, ln = dq, dn
		}
		fcArgs := []trace.Arg{trace.A("alpha_R", aQ), trace.A("fcd", fcd), trace.A(wn, wq)}
		if ln != wn {
			fcArgs = append(fcArgs, trace.A(ln, lq))
		}
		fcQ = log.Add(trace.Formula(id+"F_c", "Concrete compression resultant, closed-form integral of the parabola-rectangle block", clausePR, "F_c", "N", fc,
			"alpha_R * fcd * "+wn+" * "+ln, fcArgs...))
		zexpr := dn + " / 2 - k_a * " + ln
		if face == Negative {
			zexpr = "k_a * " + ln + " - " + dn + " / 2"
		}
		zargs := []trace.Arg{trace.A(dn, dq), trace.A("k_a", kQ)}
		if ln != dn {
			zargs = append(zargs, trace.A(ln, lq))
		}
		zcQ = log.Add(trace.Formula(id+"z_c", "Coordinate of F_c from the centroid", clausePR, cq, "mm", zc, zexpr, zargs...))
	}

	// 3. Bar layers.
	mexpr := []string{"F_c * " + cq}
	margs := []trace.Arg{trace.A("F_c", fcQ), trace.A(cq, zcQ)}
	ax := 0
	if axis == AxisZ {
		ax = 1
	}
	for i, l := range layers {
		v := vals[i]
		nm := layerNamed(i)
		// The layer's coordinate and area are data of the bar layout (listed in the bar step).
		zq := trace.Q{V: l.Coord, Symbol: nm.coord[ax], Unit: "mm"}
		aq := trace.Q{V: l.Area, Symbol: nm.as, Unit: "mm2"}
		var eStep trace.Step
		title := "Strain of bar layer " + nm.num + " (" + strconv.Itoa(l.Bars) + " bar(s) at " + zq.Symbol + ")"
		if !pr.pivotC {
			eStep = trace.Formula(id+nm.epsID, title, clausePlane, nm.epsS, "", v.eps,
				ultn+" * (x - "+depthExpr+") / x", trace.A(ultn, eult), trace.A("x", xq), trace.A(dn, dq), trace.A("z", zq))
		} else {
			eStep = trace.Formula(id+nm.epsID, title, clausePlane, nm.epsS, "", v.eps,
				"eps_top - (eps_top - eps_bot) * "+depthExpr+" / "+dn, trace.A("eps_top", etq), trace.A("eps_bot", ebq), trace.A(dn, dq), trace.A("z", zq))
		}
		eQ := log.Add(eStep)
		sStep := trace.Formula(id+nm.sigID, nm.stress, clauseSteel, nm.sigS, "MPa", v.ss,
			"max(-fyd, min(fyd, Es * eps))", trace.A("fyd", fyd), trace.A("Es", es), trace.A("eps", eQ))
		// Shown as the branch of the stress-strain line that applies: elastic, or yielded at ±f_yd.
		switch {
		case v.ss == fyd.V && es.V*v.eps >= fyd.V:
			sStep = sStep.Shown("fyd")
		case v.ss == -fyd.V && es.V*v.eps <= -fyd.V:
			sStep = sStep.Shown("-fyd")
		default:
			sStep = sStep.Shown("Es * eps")
		}
		sQ := log.Add(sStep)
		var cStep trace.Step
		ctitle := nm.concrete
		if f.rect {
			t := D/2 - l.Coord
			if face == Negative {
				t = D/2 + l.Coord
			}
			if t < dc {
				cStep = trace.Formula(id+nm.sigCI, ctitle, clauseRect, nm.sigC, "MPa", v.sc,
					"eta * fcd", trace.A("eta", eta), trace.A("fcd", fcd)).Note("The layer lies within the stress block (its depth is less than d_c).")
			} else {
				cStep = trace.Formula(id+nm.sigCI, ctitle, clauseRect, nm.sigC, "MPa", v.sc, "0").
					Note("The layer lies outside the stress block (its depth is at least d_c).")
			}
		} else {
			cStep = trace.Formula(id+nm.sigCI, ctitle, clausePR, nm.sigC, "MPa", v.sc,
				"fcd * (1 - (1 - min(max(eps, 0), "+pkn+") / "+pkn+") ** n)",
				trace.A("fcd", fcd), trace.A("eps", eQ), trace.A(pkn, epk), trace.A("n", nq))
			// Shown as the branch of the parabola-rectangle diagram that applies.
			switch {
			case v.eps <= 0:
				cStep = cStep.Shown("0").Note("The layer is not compressed: the concrete it displaces carries no stress.")
			case v.eps >= epk.V:
				cStep = cStep.Shown("fcd")
			default:
				cStep = cStep.Shown("fcd * (1 - (1 - eps / " + pkn + ") ** n)")
			}
		}
		cQ := log.Add(cStep)
		fQ := log.Add(trace.Formula(id+nm.fs, nm.force, clauseCommon, nm.fs, "N", v.force,
			"A * (sigma_s - sigma_c)", trace.A("A", aq), trace.A("sigma_s", sQ), trace.A("sigma_c", cQ)))
		fn, zn := nm.fs, nm.coord[ax]
		mexpr = append(mexpr, fn+" * "+zn)
		margs = append(margs, trace.A(fn, fQ), trace.A(zn, zq))
	}

	// 4. Moment of resistance.
	mstep := trace.Formula(id+"M_Rd", "Design moment of resistance about "+axis.String()+" at N_Ed", clausePlane, resistSymbol[axis], "Nmm", mval,
		strings.Join(mexpr, " + "), margs...).
		Note("Moments about the centroid, Σ F·" + cn + "; positive when the compressed face is on the positive side.")
	return log.Add(mstep)
}
