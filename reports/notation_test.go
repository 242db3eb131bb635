package reports

import (
	"math"
	"strings"
	"testing"

	"colsheet/calc/cover"
	"colsheet/calc/creep"
	"colsheet/calc/detail"
	"colsheet/calc/fire"
	"colsheet/calc/frame"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// plainMD turns a Markdown formula into plain text for comparison: a subscript as "_x", a
// superscript as "^(x)", escapes dropped.
func plainMD(s string) string {
	r := strings.NewReplacer("<sub>", "_", "</sub>", "", "<sup>", "^(", "</sup>", ")", `\`, "", "\u00a0", " ")
	return r.Replace(s)
}

// shownMD returns the three lines of a step as the Markdown sheets show them, as plain text.
func shownMD(s trace.Step) (formula, values, result string) {
	v := showStep(s)
	m := md{}
	return plainMD(m.formula(v.Formula)), plainMD(m.formula(v.Values)), plainMD(m.formula(v.Result))
}

// The engine's display forms as a checker reads them: conditions as the comparison with
// "→ yes" or "→ no", roundings in words or as ⌊ ⌋ and ⌈ ⌉, no guards, π as π, and a failed
// check without a ratio as "not met". Each case is a known case worked by hand from the clause
// named beside it; every step still re-evaluates to its value (Expr unchanged) and its display
// form reproduces the value.
func TestEngineDisplayForms(t *testing.T) {
	q := trace.Const
	mm := func(v float64, sym string) trace.Q { return q(v, sym, "mm") }
	kN := func(v float64, sym string) trace.Q { return q(v*1e3, sym, "N") }
	kNm := func(v float64, sym string) trace.Q { return q(v*1e6, sym, "Nmm") }
	n := func(v float64, sym string) trace.Q { return q(v, sym, "") }
	tests := []struct {
		name                    string
		step                    trace.Step
		formula, values, result string
	}{
		// EN 1992-1-1:2004 5.8.3.1(1): λ = 70 > λlim = 64.57, second-order effects to be considered.
		{"slender", slender.IsSlender("s", n(70, "λ"), n(64.57, "λ_lim")),
			"slender = λ > λ_lim", "70 > 64.57 → yes", "slender = yes"},
		// EN 1992-1-1:2004 5.8.9(3), Eq. (5.38a): λy/λz = 60/40 = 1.5 ≤ 2 and 40/60 ≤ 2.
		{"5.38a", slender.SlendernessRatiosClose("c_a", n(60, "λ_y"), n(40, "λ_z")),
			"c_a = λ_y / λ_z ≤ 2 and λ_z / λ_y ≤ 2", "60 / 40 ≤ 2 and 40 / 60 ≤ 2 → yes", "c_a = yes"},
		// EN 1992-1-1:2004 5.8.9(3), Eq. (5.38b): (ey/b)/(ez/h) = (10/400)/(100/400) = 0.1 ≤ 0.2.
		{"5.38b", slender.EccentricitiesApart("c_b", kNm(100, "M_Ed,y"), kNm(10, "M_Ed,z"), mm(400, "b"), mm(400, "h")),
			"c_b = (M_Ed,z / b) / (M_Ed,y / h) ≤ 0.2 or (M_Ed,y / h) / (M_Ed,z / b) ≤ 0.2",
			"(10 kNm / 400 mm) / (100 kNm / 400 mm) ≤ 0.2 or (100 kNm / 400 mm) / (10 kNm / 400 mm) ≤ 0.2 → yes", "c_b = yes"},
		// EN 1992-1-1:2004 5.8.9(4): NEd/NRd = 1000/2500 = 0.4, a = 1 + (0.4 − 0.1)/0.6·0.5 = 1.25.
		{"exponent a", slender.ExponentA("a", kN(1000, "N_Ed"), kN(2500, "N_Rd")),
			"a = 1 + (N_Ed / N_Rd − 0.1) / 0.6 · 0.5", "1 + (1000 kN / 2500 kN − 0.1) / 0.6 · 0.5", "a = 1.25"},
		// EN 1992-1-1:2004 5.8.3.1(1), Eq. (5.13N): λlim = 20·0.7·1.1·0.7/√0.5 = 15.25.
		{"λlim", slender.LambdaLim("l", n(20, "k_λ"), n(0.7, "A"), n(1.1, "B"), n(0.7, "C"), n(0.5, "n")),
			"λ_lim = k_λ · A · B · C / √(n)", "20 · 0.7 · 1.1 · 0.7 / √(0.5)", "λ_lim = 15.25"},
		// EN 1992-1-1:2004 5.8.8.3(3), Eq. (5.36): Kr = (1.2 − 0.5)/(1.2 − 0.4) = 0.875.
		{"Kr", slender.Kr("kr", n(0.5, "n"), n(0.2, "ω")),
			"K_r = min((1 + ω − n) / (1 + ω − 0.4), 1)", "min((1 + 0.2 − 0.5) / (1 + 0.2 − 0.4), 1)", "K_r = 0.875"},
		// EN 1992-1-1:2004 5.8.3.1(1): rm = M01/M02 = −30/60 = −0.5.
		{"rm", slender.MomentRatio("rm", kNm(-30, "M_01"), kNm(60, "M_02")),
			"r_m = M_01 / M_02", "−30 kNm / 60 kNm", "r_m = −0.5"},
		// EN 1992-1-1:2004 5.8.7.3(1), Eq. (5.28): 1 + β/(NB/NEd − 1) = 1 + 1.234/(5000/1000 − 1) = 1.308.
		{"kM", slender.Magnification("km", n(math.Pi*math.Pi/8, "β"), kN(5000, "N_B"), kN(1000, "N_Ed")),
			"k_M = 1 + β / (N_B / N_Ed − 1)", "1 + 1.234 / (5000 kN / 1000 kN − 1)", "k_M = 1.308"},
		// EN 1992-1-1:2004 5.8.7.3(1): NEd/NB = 1000/5000.
		{"NB", slender.BucklingCheck("nb", kN(1000, "N_Ed"), kN(5000, "N_B")),
			"η = N_Ed / N_B", "1000 kN / 5000 kN", "η = 0.2"},
		// EN 1992-1-1:2004 5.8.3.1(1): no end moments, rm = 1; a number alone is shown once, as the result.
		{"rm = 1", slender.MomentRatio("rm", kNm(0, "M_01"), kNm(0, "M_02")), "", "", "r_m = 1"},
		// EN 1992-1-1:2004 5.8.9(4): NEd/NRd = 2600/2500 ≥ 1, a = 2.
		{"a = 2", slender.ExponentA("a", kN(2600, "N_Ed"), kN(2500, "N_Rd")), "", "", "a = 2"},
		// EN 1992-1-1:2004 8.7.3(1), Table 8.3: ρ1 = 100 %, α6 = √(100/25) = 2, at most 1.5.
		{"α6", detail.Alpha6("a6", n(100, "ρ_1")),
			"α_6 = min(max(√(ρ_1 / 25), 1), 1.5)", "min(max(√(100 / 25), 1), 1.5)", "α_6 = 1.5"},
		// EN 1992-1-1:2004 9.5.3(4): bars above 14 mm, the spacing is reduced at laps.
		{"lap zone", detail.LapZoneReduced("z", mm(16, "φ")), "r_lap = φ > 14", "16 mm > 14 → yes", "r_lap = yes"},
		// EN 1992-1-1:2004 8.7.4.1(2): 16 mm bars, links provided for other reasons suffice.
		{"lap transverse", detail.LapTransverse("t", mm(16, "φ"), n(100, "ρ_1")),
			"t_lap = φ ≥ 20 and ρ_1 ≥ 25", "16 mm ≥ 20 and 100 ≥ 25 → no", "t_lap = no"},
		// EN 1992-1-1:2004 8.7.4.1(3): the area of a 20 mm bar, π·20²/4 = 314.2 mm².
		{"bar area", detail.LapBarArea("as", mm(20, "φ")), "A_s = π · φ^(2) / 4", "π · (20 mm)^(2) / 4", "A_s = 314.2 mm²"},
		// EN 1992-1-1:2004 8.7.4.1(3), (4): ⌈314.2/2/(1·50.27)⌉ = ⌈3.125⌉ = 4 links in each outer third.
		{"links per third", detail.LapLinksPerThird("n", q(math.Pi*100, "A_s", "mm2"), q(math.Pi*16, "A_st", "mm2"), n(1, "n_legs")),
			"n_t,3,req = ⌈A_s / 2 / (n_legs · A_st)⌉", "⌈314.2 mm² / 2 / (1 · 50.27 mm²)⌉", "n_t,3,req = 4"},
		// EN 1992-1-1:2004 9.5.3(4): ⌊616.2/240⌋ = 2 links within the lap.
		{"links in lap", detail.LinksInLap("n", mm(616.2, "l_0"), mm(240, "s_t,lap")),
			"n_t,lap = ⌊l_0 / s_t,lap⌋", "⌊616.2 mm / 240 mm⌋", "n_t,lap = 2"},
		// EN 1992-1-1:2004 9.5.3(4): at least three links, 3/2 > 1.
		{"three links", detail.LapLinksCheck("c", n(2, "n_t,lap")), "η = 3 / n_t,lap", "3 / 2", "η = 1.5"},
		// EN 1992-1-1:2004 9.5.3(4): no link within the lap, the rule is not met (no ratio).
		{"no link", detail.LapLinksCheck("c", n(0, "n_t,lap")), "", "", "not met"},
		// Rounding down to the step of the link spacings, 243 mm to 225 mm (common practice, no source).
		{"round down", detail.RoundDown("s", "Link spacing provided", "s_t", mm(243, "s_cl,tmax"), mm(25, "Δs")),
			"s_t = s_cl,tmax rounded down to a step of Δs", "243 mm rounded down to a 25 mm step", "s_t = 225 mm"},
		// Rounding up to the step of the lap lengths, 616.2 mm to 625 mm (common practice, no source).
		{"round up", detail.RoundUp("l", "Lap length as built", "l_0,prov", mm(616.2, "l_0"), mm(25, "Δl")),
			"l_0,prov = l_0 rounded up to a step of Δl", "616.2 mm rounded up to a 25 mm step", "l_0,prov = 625 mm"},
		// EN 1992-1-1:2004 4.4.1.1(2)P: c_nom = 35 mm required, 40 mm given.
		{"cover", cover.CoverCheck("c", mm(40, "c"), mm(35, "c_nom")), "η = c_nom / c", "35 mm / 40 mm", "η = 0.875"},
		// EN 1992-1-1:2004 Table 4.3N: S4, 50 years, C30/37 at least the C30/37 of XC1: S3.
		{"structural class", cover.StructuralClass("s", 0, 50, q(30, "f_ck", "MPa"), []string{"XC1"}, false),
			"S = S_0 − 1", "4 − 1", "S = 3"},
		// EN 1992-1-1:2004 Table 4.2: dg = 20 mm ≤ 32 mm, cmin,b = φ.
		{"cmin,b", cover.CminB("c", mm(8, "φ_t"), mm(20, "d_g")), "c_min,b = φ_t", "8 mm", "c_min,b = 8 mm"},
		// EN 1992-1-2:2004 5.3.2(2): e = 50 kNm/1000 kN = 50 mm.
		{"e fire", fire.Eccentricity("e", kNm(50, "M_0Ed"), kN(1000, "N_Ed")), "e = |M_0Ed| / N_Ed", "|50 kNm| / 1000 kN", "e = 50 mm"},
		// EN 1992-1-2:2004 4.5.2(2): a = 54 mm < 70 mm, no surface reinforcement.
		{"mesh", fire.SurfaceMesh("m", mm(54, "a")), "mesh = a ≥ 70", "54 mm ≥ 70 → no", "mesh = no"},
		// EN 1992-1-2:2004 Table 5.2a: between (350, 53) and (450, 40), at b = 400: 46.5 mm.
		{"a_req", fire.RequiredAxis("a", mm(400, "b"), mm(350, "b_1"), mm(53, "a_1"), mm(450, "b_2"), mm(40, "a_2")),
			"a_req = a_1 + (a_2 − a_1) · (b − b_1) / (b_2 − b_1)", "53 mm + (40 mm − 53 mm) · (400 mm − 350 mm) / (450 mm − 350 mm)", "a_req = 46.5 mm"},
		// EN 1992-1-2:2004 5.3.2, Eq. (5.7): R = 120·((16.2 + 41.6 + 22.1 + 36 + 12)/120)^1.8 = 120·1.0658^1.8.
		{"Eq. (5.7)", fire.Eq57("r", q(16.2, "R_ηfi", "min"), q(41.6, "R_a", "min"), q(22.1, "R_l", "min"), q(36, "R_b", "min"), q(12, "R_n", "min")),
			"R = 120 · ((R_ηfi + R_a + R_l + R_b + R_n) / 120)^(1.8)", "120 · ((16.2 min + 41.6 min + 22.1 min + 36 min + 12 min) / 120)^(1.8)", "R = 134.6 min"},
		// EN 1992-1-2:2004 5.3.2, Eq. (5.7): Rn = 12 for more than 4 bars.
		{"Rn", fire.RN("rn", n(8, "n")), "R_n = 12 if n > 4, otherwise 0", "12 if 8 > 4, otherwise 0", "R_n = 12 min"},
		// EN 1992-1-1:2004 5.8.4(4): φ(∞,t0) = 2.27 > 2, creep may not be ignored.
		{"creep ignorable", creep.MayIgnoreStep("c", n(2.27, "φ(∞,t0)"), n(40, "λ"), kNm(60, "M_0Ed"), kN(1000, "N_Ed"), mm(400, "h")),
			"c_φ = φ(∞,t0) ≤ 2 and λ ≤ 75 and M_0Ed / N_Ed ≥ h", "2.27 ≤ 2 and 40 ≤ 75 and 60 kNm / 1000 kN ≥ 400 mm → no", "c_φ = no"},
		// EN 1992-1-1:2004 Annex B, Eq. (B.3a): fcm = 33 MPa ≤ 35, φRH = 1 + (1 − 0.5)/(0.1·200^(1/3)) = 1.855.
		{"φRH", creep.PhiRH("p", q(50, "RH", "%"), mm(200, "h_0"), q(33, "f_cm", "MPa"), n(1, "α_1"), n(1, "α_2")),
			"φ_RH = 1 + (1 − RH / 100) / (0.1 · h_0^(1/3))", "1 + (1 − 50 % / 100) / (0.1 · (200 mm)^(1/3))", "φ_RH = 1.855"},
		// Roark's Formulas for Stress and Strain, Table 8.1 (from memory): a uniform load over the
		// span gives wL²/12, anticlockwise at the start: 45.73 × 7.2²/12 = 197.5 kNm.
		{"FEM uniform", frame.FEMStep("f", "Fixed-end moment", frame.AtStart, mm(7200, "L"), []frame.Piece{frame.Uniform(45.72675, 7200)}),
			"M_F = −w · L^(2) / 12", "−45.73 kN/m · (7200 mm)^(2) / 12", "M_F = −197.5 kNm"},
	}
	for _, tc := range tests {
		if err := trace.Recheck(tc.step, 1e-9); err != nil {
			t.Errorf("%s: %v", tc.name, err)
		}
		if err := trace.RecheckShow(tc.step, 1e-9); err != nil {
			t.Errorf("%s: %v", tc.name, err)
		}
		f, v, r := shownMD(tc.step)
		if f != tc.formula || v != tc.values || r != tc.result {
			t.Errorf("%s:\n got  %q\n      %q\n      %q\n want %q\n      %q\n      %q", tc.name, f, v, r, tc.formula, tc.values, tc.result)
		}
		for _, line := range []string{f, v} {
			for _, bad := range []string{"0.000000001", "3.14159", "? 1 : 0", "0.001)", "0.0001"} {
				if strings.Contains(line, bad) {
					t.Errorf("%s: %q shows %q", tc.name, line, bad)
				}
			}
		}
	}
}

// Values in the units of the trade, rounded to 4 significant figures: floor areas in m²,
// inertia in ×10⁶ mm⁴, line loads in kN/m, moments in kNm, forces in kN; a bar or section area
// stays in mm² (DESIGN.md, units: the trade's units on the reports; common practice).
func TestTradeUnits(t *testing.T) {
	for _, c := range []struct {
		symbol, unit string
		v            float64
		want         string
	}{
		{"A_slab,A1–B1", "mm2", 24840000, "24.84 m²"},
		{"A", "mm2", 12.5e6, "12.5 m²"},
		{"A_0", "mm2", 10e6, "10 m²"}, // EN 1991-1-1:2002 6.3.1.2(10): A0 = 10 m²
		{"A_s,prov", "mm2", 1809.5573684677208, "1810 mm²"},
		{"A_c", "mm2", 160000, "160000 mm²"},
		{"A_st", "mm2", 50.26548245743669, "50.27 mm²"},
		{"I_c,y", "mm4", 2133333333.3333333, "2133 × 10⁶ mm⁴"},
		{"I_s,y", "mm4", 9643131.216564484, "9.643 × 10⁶ mm⁴"},
		{"I_A3–B3", "mm4", 27337500000, "27340 × 10⁶ mm⁴"},
		{"γ_rc", "N/mm3", 2.5e-5, "25 kN/m³"}, // EN 1991-1-1:2002 Table A.1: reinforced concrete 25 kN/m³
		{"g_k", "N/mm2", 0.0064, "6.4 kN/m²"},
		{"w", "N/mm", 45.72675, "45.73 kN/m"},
		{"M_F", "Nmm", -197539560, "−197.5 kNm"},
		{"N_Ed", "N", 1364491.575, "1364 kN"},
		{"k_A1–B1", "Nmm", 38527094184.5, "38530 kNm"},
		{"N_B", "N", 11535410.75, "11540 kN"},
	} {
		n, u := quantityOf(c.v, c.unit, c.symbol)
		got := plainMD(md{}.formula([]piece{{kind: pNum, n: n, unit: u}}))
		if got != c.want {
			t.Errorf("%s = %g %s: shown %q, want %q", c.symbol, c.v, c.unit, got, c.want)
		}
	}
	// A value in a scaled unit stands in parentheses within a product (common practice, no source).
	k := trace.Formula("k", "Stiffness of the column", "common practice", "k", "Nmm", 4*33350*2133333333.3333333/3150,
		"4 * E * I / L", trace.A("E", trace.Const(33350, "E_cm", "MPa")), trace.A("I", trace.Const(2133333333.3333333, "I_c", "mm4")), trace.A("L", trace.Const(3150, "L", "mm")))
	if _, v, _ := shownMD(k); v != "4 · 33350 MPa · (2133 × 10⁶ mm⁴) / 3150 mm" {
		t.Errorf("stiffness: %q", v)
	}
	// The same rule in a formula's values: the slab area of a load on a beam in m².
	s := trace.Formula("F", "Permanent load on the beam", "common practice", "F_G", "N", 6.4e-3*24840000,
		"w * A_slab", trace.A("w", trace.Const(6.4e-3, "g_k", "N/mm2")), trace.A("A_slab", trace.Const(24840000, "A_slab,A1–B1", "mm2")))
	if _, v, r := shownMD(s); v != "6.4 kN/m² · 24.84 m²" || r != "F_G = 159 kN" {
		t.Errorf("slab load: %q, %q", v, r)
	}
}

// Beam names carry an en dash ("A1–B1"); in LaTeX's math mode it is set as text, never as "?".
func TestTeXEnDashInMath(t *testing.T) {
	x := tex{}
	for _, got := range []string{
		x.formula([]piece{{kind: pSym, text: "M_F,A1–B1,max"}, {kind: pOp, text: "="}, {kind: pSym, text: "k_A1–B1"}}),
		x.sym("L_A1–B1"),
		x.qty(2133333333, "mm4"),
	} {
		if strings.Contains(got, "?") {
			t.Errorf("%q: a character fell to ?", got)
		}
	}
	if got := x.sym("L_A1–B1"); got != `${L}_{\mathrm{A1\text{--}B1}}$` {
		t.Errorf("L_A1–B1 in LaTeX: %q", got)
	}
	if got := x.qty(2133333333, "mm4"); got != `$2133\,\times\,\mathrm{10}^{6}\,\mathrm{mm}^{4}$` {
		t.Errorf("inertia in LaTeX: %q", got)
	}
}

// summary.csv rounds as the sheets do: the NEd, moments and utilisation of each design read the
// same in both (common practice, no source).
func TestCSVRoundsAsSheets(t *testing.T) {
	r := sample(t, "x")
	b, err := CSV(r)
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(string(b)), "\n")
	if len(lines) != len(r.Designs)+1 {
		t.Fatalf("%d lines for %d designs", len(lines), len(r.Designs))
	}
	for i, d := range r.Designs {
		cells := strings.Split(lines[i+1], ",")
		for _, c := range []struct {
			col  int
			want string
		}{
			{4, fmtNum(d.NEd / 1e3).plain()}, {5, fmtNum(d.Y.MEd / 1e6).plain()}, {6, fmtNum(d.Y.MRd / 1e6).plain()},
			{11, fmtNum(d.Utilization).plain()},
		} {
			if cells[c.col] != c.want {
				t.Errorf("%s/%s: %s = %q in the CSV, %q on the sheets", d.Column, d.Storey, CSVHeader[c.col], cells[c.col], c.want)
			}
		}
	}
}
