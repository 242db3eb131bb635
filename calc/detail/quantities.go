package detail

import (
	"math"

	"colsheet/calc/trace"
)

// This file holds the column's bars and links as built: the lap length rounded up to a practical
// step, the zones of reduced link spacing and the number of links in each, the anchorage of the
// starter bars into the foundation and of the top bars into the roof (EN 1992-1-1:2004 8.4.4),
// the lengths of bars, links and ties, and their masses for the schedule.

// SteelDensity is the density of reinforcing steel, kg/m³, common practice, no source.
const SteelDensity = 7850.0

// ceilExpr is the govaluate form of ceil(x) over an expression x, with the guard that keeps a
// value a hair above a whole number from counting one more.
func ceilExpr(x string) string { return "-floor(-(" + x + ") + 0.000000001)" }

// ceilValue returns ceil(x) with the guard of ceilExpr.
func ceilValue(x float64) float64 { return -math.Floor(-x + 1e-9) }

// RoundUp returns the length v rounded up to a multiple of step, common practice.
func RoundUp(id, title, symbol string, v, step trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice", symbol, "mm", ceilValue(v.V/step.V)*step.V,
		ceilExpr("l / step")+" * step", trace.A("l", v), trace.A("step", step)).
		Shown("roundup(l, step)")
}

// LbMinCompressionValue returns lb,min = max(0.6·lb,rqd, 10·φ, 100 mm); see LbMinCompression.
func LbMinCompressionValue(lbRqd, phi float64) float64 {
	return math.Max(math.Max(0.6*lbRqd, 10*phi), 100)
}

// LbMinCompression returns the least anchorage length of bars in compression,
// lb,min = max(0.6·lb,rqd, 10·φ, 100 mm), EN 1992-1-1:2004 8.4.4(1), Eq. (8.7).
func LbMinCompression(id string, lbRqd, phi trace.Q) trace.Step {
	return trace.Formula(id, "Minimum anchorage length in compression", ec2+"8.4.4(1), Eq. (8.7)", "l_b,min", "mm",
		LbMinCompressionValue(lbRqd.V, phi.V), "max(0.6 * l_brqd, 10 * phi, 100)",
		trace.A("l_brqd", lbRqd), trace.A("phi", phi))
}

// AnchorageValue returns lbd = max(α1·α2·α3·α4·α5·lb,rqd, lb,min) with every α = 1; see Anchorage.
func AnchorageValue(lbRqd, lbMin float64) float64 { return math.Max(lbRqd, lbMin) }

// Anchorage returns the design anchorage length of straight bars in compression, lbd = α1·α2·α3·α4·α5·lb,rqd
// ≥ lb,min with α1 = α2 = α3 = α4 = α5 = 1 (straight bars, no welded transverse bars, no benefit
// taken from cover, confinement or transverse pressure), EN 1992-1-1:2004 8.4.4(1), Eq. (8.4), Table 8.2.
func Anchorage(id, title string, lbRqd, lbMin trace.Q) trace.Step {
	return trace.Formula(id, title, ec2+"8.4.4(1), Eq. (8.4), Table 8.2", "l_bd", "mm",
		AnchorageValue(lbRqd.V, lbMin.V), "max(l_brqd, l_bmin)", trace.A("l_brqd", lbRqd), trace.A("l_bmin", lbMin)).
		Note("Straight bars in compression: α1 = α2 = α3 = α4 = α5 = 1 (Table 8.2), no reduction taken.")
}

// AnchorageSteps records lb,rqd of the bar diameter phi at its full design stress with the bond of b,
// the least length lb,min and lbd, under IDs prefix+"lb_rqd", "lb_min" and "lbd", and returns lbd. The
// bond stress is that of the lap (fbd, recorded under prefix+"fbd" with η2 of prefix+"eta2").
func AnchorageSteps(l *trace.Log, prefix, title string, phi trace.Q, b LapBond) trace.Q {
	eta2 := l.Add(Eta2(prefix+"eta2", phi))
	fbd := l.Add(Fbd(prefix+"fbd", b.Eta1, eta2, b.Fctd))
	lb := l.Add(LbRqd(prefix+"lb_rqd", phi, b.SigmaSd, fbd))
	lbMin := l.Add(LbMinCompression(prefix+"lb_min", lb, phi))
	return l.Add(Anchorage(prefix+"lbd", title, lb, lbMin))
}

// BarMassPerMetreValue returns the mass of a bar per metre, ρ·π·φ²/4 in kg/m with φ in mm; see BarMassPerMetre.
func BarMassPerMetreValue(phi float64) float64 { return SteelDensity * math.Pi * phi * phi / 4 / 1e6 }

// BarMassPerMetre returns the mass per metre of a bar of diameter φ, ρ·π·φ²/4, with ρ = 7850 kg/m³,
// common practice, no source.
func BarMassPerMetre(id, symbol string, phi trace.Q) trace.Step {
	return trace.Formula(id, "Mass of the bar per metre", "common practice", symbol, "kg/m",
		BarMassPerMetreValue(phi.V), "rho * 3.141592653589793 * phi ** 2 / 4 / 1000000",
		trace.A("rho", trace.Const(SteelDensity, "ρ_s", "kg/m3")), trace.A("phi", phi)).
		Shown("rho * pi * phi ** 2 / 4 / 1000000").
		Note("ρs = 7850 kg/m³ for reinforcing steel; φ in mm, so that π·φ²/4 in mm² times 10⁻⁶ is in m².")
}

// Mass returns the mass n·L·m′ of n pieces of length L (mm) of a bar of m′ kg/m, common practice.
func Mass(id, title, symbol string, n, length, perMetre trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice", symbol, "kg", n.V*length.V*perMetre.V/1000,
		"n * L / 1000 * m_1", trace.A("n", n), trace.A("L", length), trace.A("m_1", perMetre))
}

// HookExtensionValue returns the straight extension after a link's bend, max(10·φt, 70 mm); see HookExtension.
func HookExtensionValue(phiT float64) float64 { return math.Max(10*phiT, 70) }

// HookExtension returns the straight extension after the bend of a link or tie anchored by a hook of
// 90° up to 150°, max(10·φt, 70 mm), EN 1992-1-1:2004 8.5(1), Fig. 8.5.
func HookExtension(id string, phiT trace.Q) trace.Step {
	return trace.Formula(id, "Extension of a link's hook beyond the bend", ec2+"8.5(1), Fig. 8.5", "l_hook", "mm",
		HookExtensionValue(phiT.V), "max(10 * phi_t, 70)", trace.A("phi_t", phiT)).
		Note("Links and ties closed by 135° hooks round a bar; the length of the bends is taken within the straight lengths (centre-line measure).")
}

// LinkLengthValue returns the cut length of a closed link, 2·(b − 2·c − φt) + 2·(h − 2·c − φt) + 2·lhook; see LinkLength.
func LinkLengthValue(b, h, c, phiT, hook float64) float64 {
	return 2*(b-2*c-phiT) + 2*(h-2*c-phiT) + 2*hook
}

// LinkLength returns the cut length of the perimeter link: its centre line round the section inside the
// cover, 2·(b − 2·c − φt) + 2·(h − 2·c − φt), and two hooks, common practice.
func LinkLength(id string, b, h, c, phiT, hook trace.Q) trace.Step {
	return trace.Formula(id, "Cut length of the perimeter link", "common practice", "L_link", "mm",
		LinkLengthValue(b.V, h.V, c.V, phiT.V, hook.V), "2 * (b - 2 * c_nom - phi_t) + 2 * (h - 2 * c_nom - phi_t) + 2 * l_hook",
		trace.A("b", b), trace.A("h", h), trace.A("c_nom", c), trace.A("phi_t", phiT), trace.A("l_hook", hook))
}

// TieLengthValue returns the cut length of an extra tie across a section of depth w, w − 2·c − φt + 2·lhook; see TieLength.
func TieLengthValue(w, c, phiT, hook float64) float64 { return w - 2*c - phiT + 2*hook }

// TieLength returns the cut length of an extra tie across the section between two opposite bars, from the
// centre line of the link on one face to that on the other, w − 2·c − φt, and two hooks, common practice.
func TieLength(id, title string, w, c, phiT, hook trace.Q) trace.Step {
	return trace.Formula(id, title, "common practice", "L_tie", "mm",
		TieLengthValue(w.V, c.V, phiT.V, hook.V), "w - 2 * c_nom - phi_t + 2 * l_hook",
		trace.A("w", w), trace.A("c_nom", c), trace.A("phi_t", phiT), trace.A("l_hook", hook))
}

// Zones is the link arrangement of one lift as built: a zone at the bottom (above the floor, over the
// laps), the general length, and a zone at the top (below the floor above), each with its spacing,
// length and number of links.
type Zones struct {
	Bottom, General, Top    float64 // lengths, mm
	SBottom, SGeneral, STop float64 // spacings, mm
	NBottom, NGeneral, NTop int     // links in each zone; the bottom zone counts the first link at its foot
	Links                   int     // links in the lift
}

// ZoneInput is what the link zones of a lift need, as traced quantities (mm).
type ZoneInput struct {
	L             trace.Q // length of the lift, floor level to floor level
	Zone          trace.Q // length of the reduced-spacing zone of 9.5.3(4), max(b, h)
	LapStart, L0  trace.Q // start of the laps above the floor, and the lap length as built
	S, SRed, SLap trace.Q // spacings provided: general, reduced, over the laps
	ReducedAtLap  bool    // the reduced spacing applies over the laps (φ > 14 mm), 9.5.3(4)
}

// ZoneSteps records the link zones of a lift under IDs prefix+…: the bottom zone's length, the larger of the
// zone of 9.5.3(4) and the top of the lap where the spacing is reduced over the laps, its spacing (the
// smaller of the reduced and the lap spacings), the top zone, the general length between them, and the
// links in each and in the lift, and returns them with the step of the links in the lift. Links are counted as spaces: one link a space in each zone, and one more
// at the foot of the lift.
func ZoneSteps(l *trace.Log, prefix string, in ZoneInput) (Zones, trace.Q) {
	var z Zones
	lapTop := l.Add(trace.Formula(prefix+"lap_top", "Top of the laps above the floor", ec2+"8.7.3; 9.5.3(4)", "a_lap,top", "mm",
		in.LapStart.V+in.L0.V, "a_lap + l_0", trace.A("a_lap", in.LapStart), trace.A("l_0", in.L0)))
	var bot, sBot trace.Q
	if in.ReducedAtLap {
		bot = l.Add(trace.Formula(prefix+"l_bottom", "Length of the zone of reduced link spacing at the foot of the lift (above the floor and over the laps)",
			ec2+"9.5.3(4)", "l_zone,bot", "mm", math.Min(math.Max(in.Zone.V, lapTop.V), in.L.V), "min(max(l_zone, a_lap_top), l)",
			trace.A("l_zone", in.Zone), trace.A("a_lap_top", lapTop), trace.A("l", in.L)).
			Note("The zone above the floor and the laps both take the reduced spacing: the zone runs to the higher of the two."))
		sBot = l.Add(trace.Formula(prefix+"s_bottom", "Link spacing in the zone at the foot of the lift", ec2+"9.5.3(4); 8.7.4", "s_t,bot", "mm",
			math.Min(in.SRed.V, in.SLap.V), "min(s_red, s_lap)", trace.A("s_red", in.SRed), trace.A("s_lap", in.SLap)))
	} else {
		bot = l.Add(trace.Formula(prefix+"l_bottom", "Length of the zone of reduced link spacing at the foot of the lift (above the floor)",
			ec2+"9.5.3(4)", "l_zone,bot", "mm", math.Min(in.Zone.V, in.L.V), "min(l_zone, l)", trace.A("l_zone", in.Zone), trace.A("l", in.L)).
			Note("The bars do not exceed 14 mm: the spacing over the laps is the general one, and the zone is that of the floor alone."))
		sBot = l.Add(trace.Formula(prefix+"s_bottom", "Link spacing in the zone at the foot of the lift", ec2+"9.5.3(4)", "s_t,bot", "mm",
			in.SRed.V, "s_red", trace.A("s_red", in.SRed)))
	}
	top := l.Add(trace.Formula(prefix+"l_top", "Length of the zone of reduced link spacing at the top of the lift (below the floor above)",
		ec2+"9.5.3(4)", "l_zone,top", "mm", math.Min(in.Zone.V, math.Max(in.L.V-bot.V, 0)), "min(l_zone, max(l - l_bot, 0))",
		trace.A("l_zone", in.Zone), trace.A("l", in.L), trace.A("l_bot", bot)).
		Note("Measured down from the floor level at the top of the lift, through the depth of the floor construction."))
	gen := l.Add(trace.Formula(prefix+"l_general", "Length of the lift at the general link spacing", "common practice", "l_gen", "mm",
		math.Max(in.L.V-bot.V-top.V, 0), "max(l - l_bot - l_top, 0)", trace.A("l", in.L), trace.A("l_bot", bot), trace.A("l_top", top)))
	count := func(id, title, sym string, length, s trace.Q, plus float64) trace.Q {
		expr := ceilExpr("L / s")
		shown := "ceil(L / s)"
		if plus > 0 {
			expr += " + 1"
			shown += " + 1"
		}
		return l.Add(trace.Formula(prefix+id, title, "common practice", sym, "", ceilValue(length.V/s.V)+plus, expr,
			trace.A("L", length), trace.A("s", s)).Shown(shown))
	}
	nb := count("n_bottom", "Links in the zone at the foot of the lift, the first at the floor included", "n_t,bot", bot, sBot, 1)
	nt := count("n_top", "Links in the zone at the top of the lift", "n_t,top", top, in.SRed, 0)
	ng := count("n_general", "Links in the general length", "n_t,gen", gen, in.S, 0)
	n := l.Add(trace.Formula(prefix+"n_links", "Links in the lift", "common practice", "n_t", "", nb.V+ng.V+nt.V,
		"n_bot + n_gen + n_top", trace.A("n_bot", nb), trace.A("n_gen", ng), trace.A("n_top", nt)))
	z.Bottom, z.General, z.Top = bot.V, gen.V, top.V
	z.SBottom, z.SGeneral, z.STop = sBot.V, in.S.V, in.SRed.V
	z.NBottom, z.NGeneral, z.NTop, z.Links = int(nb.V), int(ng.V), int(nt.V), int(n.V)
	return z, n
}
