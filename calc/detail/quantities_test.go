package detail

import (
	"testing"

	"colsheet/calc/trace"
)

// The anchorage of straight bars in compression, EN 1992-1-1:2004 8.4.2, 8.4.3 and 8.4.4, worked
// by hand for C30/37 (fctm = 2.9 MPa, Table 3.1), γc = 1.5 (Table 2.1N), good bond, fyk = 500 MPa.
func TestAnchorageCompression(t *testing.T) {
	mm := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	for _, c := range []struct {
		name              string
		phi, sigma        float64
		lbRqd, lbMin, lbd float64
	}{
		// 8.4.2(2), Eq. (8.2): fbd = 2.25 × 1 × 1 × (0.7 × 2.9 / 1.5) = 3.045 MPa; 8.4.3(2), Eq. (8.3):
		// lb,rqd = 16/4 × 434.78/3.045 = 571.1 mm; Eq. (8.7): lb,min = max(0.6 × 571.1, 160, 100) = 342.7 mm;
		// Eq. (8.4) with every α = 1: lbd = 571.1 mm.
		{"φ16 at fyd", 16, 500 / 1.15, 16.0 / 4 * (500 / 1.15) / 3.045, 0.6 * 16.0 / 4 * (500 / 1.15) / 3.045, 16.0 / 4 * (500 / 1.15) / 3.045},
		// At σsd = 100 MPa: lb,rqd = 20/4 × 100/3.045 = 164.2 mm, below 10φ = 200 mm, which governs (Eq. (8.7)).
		{"φ20 at 100 MPa", 20, 100, 20.0 / 4 * 100 / 3.045, 200, 200},
	} {
		l := &trace.Log{}
		sigma := l.Add(trace.Input("sigma", "σsd", "input", "σ_sd", "MPa", c.sigma))
		gc := trace.Const(1.5, "γ_c", "")
		b := LapBondSteps(l, "b/", trace.Const(2.9, "f_ctm", "MPa"), gc, sigma, true, 100)
		lbd := AnchorageSteps(l, "a/", "Anchorage", mm(c.phi), b)
		for _, s := range l.Steps {
			recheck(t, s)
		}
		get := func(id string) float64 {
			for _, s := range l.Steps {
				if s.ID == id {
					return s.Value
				}
			}
			t.Fatalf("%s: no step %s", c.name, id)
			return 0
		}
		near(t, c.name+": fbd (8.2)", get("a/fbd"), 3.045, 1e-9)
		near(t, c.name+": lb,rqd (8.3)", get("a/lb_rqd"), c.lbRqd, 1e-6)
		near(t, c.name+": lb,min (8.7)", get("a/lb_min"), c.lbMin, 1e-6)
		near(t, c.name+": lbd (8.4)", lbd.V, c.lbd, 1e-6)
	}
}

// Lengths rounded up to a practical step (common practice, no source): 571.1 → 575, 600 → 600, 616.2 → 625.
func TestRoundUp(t *testing.T) {
	for _, c := range [][3]float64{{571.1, 25, 575}, {600, 25, 600}, {616.2271, 25, 625}, {601, 50, 650}} {
		s := RoundUp("l", "Lap length as built", "l_0,prov", trace.Const(c[0], "l_0", "mm"), trace.Const(c[1], "Δl", "mm"))
		recheck(t, s)
		near(t, "roundup", s.Value, c[2], 1e-9)
		if v, err := trace.EvalShow(s); err != nil || v != s.Value {
			t.Errorf("display form gives %v, %v; want %v", v, err, s.Value)
		}
	}
}

// Masses per metre of bars at ρ = 7850 kg/m³, ρ·π·φ²/4, by hand (common practice, no source):
// φ8: 7850 × 50.27e-6 = 0.3946 kg/m; φ12: 0.8878; φ16: 1.578; φ25: 3.853 kg/m.
func TestBarMass(t *testing.T) {
	for _, c := range [][2]float64{{8, 0.3946}, {12, 0.8878}, {16, 1.5783}, {25, 3.8534}} {
		s := BarMassPerMetre("m", "m'", trace.Const(c[0], "φ", "mm"))
		recheck(t, s)
		near(t, "mass per metre", s.Value, c[1], 5e-4)
	}
	// 16 bars of 4825 mm at 0.8878 kg/m: 16 × 4.825 × 0.8878 = 68.54 kg (by hand).
	m := Mass("m", "Mass", "m", trace.Const(16, "n", ""), trace.Const(4825, "L", "mm"), trace.Const(BarMassPerMetreValue(12), "m'", "kg/m"))
	recheck(t, m)
	near(t, "mass of 16 Ø12 × 4825", m.Value, 68.54, 0.01)
}

// Cut lengths of links and ties, by hand (common practice, no source); hook extensions of
// max(10φ, 70 mm), EN 1992-1-1:2004 8.5(1), Fig. 8.5 (from memory).
func TestLinkAndTieLengths(t *testing.T) {
	q := func(v float64) trace.Q { return trace.Const(v, "x", "mm") }
	h8 := HookExtension("h", q(8))
	h6 := HookExtension("h", q(6))
	recheck(t, h8)
	near(t, "hook φ8 = 10 × 8", h8.Value, 80, 1e-9)
	near(t, "hook φ6 = 70 mm", h6.Value, 70, 1e-9)
	// 400 × 400, cover 35, φt 8: 4 × (400 − 70 − 8) + 2 × 80 = 1448 mm.
	ll := LinkLength("L", q(400), q(400), q(35), q(8), trace.Const(h8.Value, "l_hook", "mm"))
	recheck(t, ll)
	near(t, "link 400 × 400", ll.Value, 1448, 1e-9)
	// Tie across 600: 600 − 70 − 8 + 160 = 682 mm.
	tl := TieLength("T", "Tie", q(600), q(35), q(8), trace.Const(h8.Value, "l_hook", "mm"))
	recheck(t, tl)
	near(t, "tie across 600", tl.Value, 682, 1e-9)
}

// The zones of reduced link spacing, EN 1992-1-1:2004 9.5.3(4): the zone at the foot is the larger
// of max(b, h) and the top of the lap where the spacing is reduced over the laps (φ > 14 mm); links
// counted one a space, one more at the foot (common practice, no source). Worked by hand.
func TestZones(t *testing.T) {
	q := func(v float64, sym string) trace.Q { return trace.Const(v, sym, "mm") }
	for _, c := range []struct {
		name              string
		reduced           bool
		bot, gen, top     float64
		nb, ng, nt, total int
	}{
		// l = 3150, zone 400, lap 625 from the floor, s = 250, s_red = 150, s_lap = 150:
		// foot max(400, 625) = 625, ⌈625/150⌉ + 1 = 6; top 400, ⌈400/150⌉ = 3; general 2125, ⌈2125/250⌉ = 9.
		{"reduced over the laps", true, 625, 2125, 400, 6, 9, 3, 18},
		// Bars not above 14 mm: foot 400, ⌈400/150⌉ + 1 = 4; general 2350, ⌈2350/250⌉ = 10; top 3.
		{"not reduced", false, 400, 2350, 400, 4, 10, 3, 17},
	} {
		l := &trace.Log{}
		z, n := ZoneSteps(l, "z/", ZoneInput{L: q(3150, "l"), Zone: q(400, "l_zone"), LapStart: q(0, "a_lap"), L0: q(625, "l_0"),
			S: q(250, "s"), SRed: q(150, "s_red"), SLap: q(150, "s_lap"), ReducedAtLap: c.reduced})
		for _, s := range l.Steps {
			recheck(t, s)
		}
		near(t, c.name+": foot", z.Bottom, c.bot, 1e-9)
		near(t, c.name+": general", z.General, c.gen, 1e-9)
		near(t, c.name+": top", z.Top, c.top, 1e-9)
		if z.NBottom != c.nb || z.NGeneral != c.ng || z.NTop != c.nt || z.Links != c.total || int(n.V) != c.total {
			t.Errorf("%s: links %d + %d + %d = %d, want %d + %d + %d = %d", c.name, z.NBottom, z.NGeneral, z.NTop, z.Links, c.nb, c.ng, c.nt, c.total)
		}
	}
	// A lift shorter than its zones: the foot zone takes the whole lift, no general length.
	l := &trace.Log{}
	z, _ := ZoneSteps(l, "z/", ZoneInput{L: q(500, "l"), Zone: q(400, "l_zone"), LapStart: q(0, "a_lap"), L0: q(625, "l_0"),
		S: q(250, "s"), SRed: q(150, "s_red"), SLap: q(150, "s_lap"), ReducedAtLap: true})
	near(t, "short lift: foot", z.Bottom, 500, 1e-9)
	near(t, "short lift: top", z.Top+z.General, 0, 1e-9)
}
