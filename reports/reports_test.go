package reports

import (
	"bytes"
	"encoding/json"
	"encoding/xml"
	"flag"
	"io"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"reflect"
	"sort"
	"strings"
	"testing"

	"colsheet/calc/code"
	"colsheet/calc/design"
	"colsheet/calc/fire"
	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

var update = flag.Bool("update", false, "rewrite the golden files under testdata/")

// sample builds a small result by hand. The numbers are invented test data: they only need
// to be finite and to exercise the layout, not to be a correct design.
func sample(t *testing.T, title string) *design.Result {
	t.Helper()
	p, err := code.Recommended().Override("alpha_cc", 0.85)
	if err != nil {
		t.Fatal(err)
	}
	conc, _ := material.Lookup("C32/40")
	in := &model.Input{
		File: "demo.yaml", SHA256: strings.Repeat("ab", 32),
		Project: model.Project{Title: title, Job: "J-204", Revision: "B", Designer: "R. Ortiz",
			Checker: "M. Haas", Date: "2025-03-14"},
		Code:      p,
		Materials: model.Materials{Concrete: conc, Fyk: 500, Aggregate: 20},
		Options:   model.Options{StressBlock: model.ParabolaRectangle, Imperfection: model.ImperfInclination},
	}
	fck := trace.Input("fck", "characteristic cylinder strength", "EN 1992-1-1:2004 Table 3.1", "f_ck", "MPa", 32)
	fck.Group = "Materials"
	gc := trace.Table("gamma_c", "partial factor for concrete", "EN 1992-1-1:2004 2.4.2.4(1), Table 2.1N",
		"persistent and transient", "γ_c", "", 1.5)
	gc.Group = "Materials"
	fcd := trace.Formula("fcd", "design compressive strength", "EN 1992-1-1:2004 3.1.6(1), Eq. (3.15)",
		"f_cd", "MPa", 18.133333333333333, "alpha_cc * fck / gamma_c",
		trace.A("alpha_cc", trace.Const(0.85, "α_cc", "")), trace.A("fck", fck.Q()), trace.A("gamma_c", gc.Q()))
	fcd.Group = "Materials"
	ned := trace.Input("NEd", "design axial force", "input", "N_Ed", "N", 2150000)
	ned.Group = "Actions"
	ei := trace.Formula("ei_y", "eccentricity of the imperfection about y", "EN 1992-1-1:2004 5.2(7), Eq. (5.2)",
		"e_i,y", "mm", 7.25, "theta_i * l0 / 2",
		trace.A("theta_i", trace.Const(0.005, "θ_i", "")), trace.A("l0", trace.Const(2900, "l_0", "mm")))
	ei.Group = "Slenderness and second order"
	lam := trace.Formula("lambda_y", "slenderness about y", "EN 1992-1-1:2004 5.8.3.2(1)",
		"λ_y", "", 20.09, "l0 * sqrt(12) / h",
		trace.A("l0", trace.Const(2900, "l_0", "mm")), trace.A("h", trace.Const(500, "h", "mm")))
	lam.Group = "Slenderness and second order"
	m0 := trace.Formula("M0e", "equivalent first-order moment", "EN 1992-1-1:2004 5.8.8.2(2), Eq. (5.32)",
		"M_0e,y", "Nmm", 51000000, "max(0.6 * M02 + 0.4 * M01, 0.4 * M02)",
		trace.A("M02", trace.Const(85e6, "M_02,y", "Nmm")), trace.A("M01", trace.Const(-40e6, "M_01,y", "Nmm")))
	m0.Group = "Slenderness and second order"
	m0 = m0.Note("double curvature: M_01 is negative")
	pow := trace.Formula("kphi", "creep factor", "EN 1992-1-1:2004 5.8.8.3(4), Eq. (5.37)",
		"K_φ", "", 1.0, "max(1 + beta * phi_ef, 1) ** (1/1)",
		trace.A("beta", trace.Const(0, "β", "")), trace.A("phi_ef", trace.Const(2, "φ_ef", "")))
	pow.Group = "Slenderness and second order"
	x := trace.Solve("x", "neutral axis depth", "EN 1992-1-1:2004 6.1(2)", "x", "mm", 212.4,
		"bisection on axial equilibrium", "Nc + Ns - NEd", 3.2e-7,
		trace.A("Nc", trace.Const(1500000.0000001, "N_c", "N")), trace.A("Ns", trace.Const(650000.0000002, "N_s", "N")),
		trace.A("NEd", ned.Q()))
	x.Group = "Section resistance"
	chk := trace.Check("check_y", "bending about y", "EN 1992-1-1:2004 6.1", "M_Ed,y ≤ M_Rd,y", 0.708,
		"MEd / MRd", trace.A("MEd", trace.Const(85e6, "M_Ed,y", "Nmm")), trace.A("MRd", trace.Const(120e6, "M_Rd,y", "Nmm")))
	chk.Group = "Section resistance"
	chk = chk.Caution("bars assumed continuous through the joint")
	eps := trace.Table("eps", "ultimate strain", "EN 1992-1-1:2004 Table 3.1", "f_ck ≤ 50 MPa", "ε_cu2", "", 0.0035)
	eps.Group = "Materials" // appears after another group: shown under Materials
	steps := []trace.Step{fck, gc, fcd, ned, ei, lam, m0, pow, x, chk, eps}

	fail := trace.Check("check_z", "bending about z", "EN 1992-1-1:2004 6.1", "M_Ed,z ≤ M_Rd,z", 1.12,
		"MEd / MRd", trace.A("MEd", trace.Const(56e6, "M_Ed,z", "Nmm")), trace.A("MRd", trace.Const(50e6, "M_Rd,z", "Nmm")))
	fail.Group = "Section resistance"
	raw := trace.Step{ID: "odd", Title: "expression shown as written", Clause: "common practice",
		Kind: trace.KindFormula, Symbol: "q", Value: 1, Expr: "a ** -1",
		Args: []trace.Arg{{Name: "a", Symbol: "a", Value: 1}}}

	axis := design.Axis{L0: 2900, Lambda: 20.09, LambdaLim: 31.4, M01: -40e6, M02: 85e6, Ei: 7.25,
		M0Ed: 100.6e6, M2: 0, PhiEf: 2, MEd: 100.6e6, MRd: 142e6}
	return &design.Result{
		ToolName: "colsheet", ToolVersion: "0.1.0-test", Input: in,
		Methods: []design.Method{{Topic: "Concrete stress block", Choice: "parabola-rectangle", Clause: "EN 1992-1-1:2004 3.1.7(1)"},
			{Topic: "Links", Choice: "diameter & spacing <check>", Clause: "EN 1992-1-1:2004 9.5.3"}},
		Designs: []design.Design{
			{Column: "K1", Storey: "L1", B: 350, H: 500, Cover: 40, Fck: 32, Fyk: 500, NEd: 2150000,
				Y: axis, Z: design.Axis{L0: 3100, Lambda: 30.68, LambdaLim: 31.4, M01: 10e6, M02: 10e6, Ei: 7.75,
					M0Ed: 26.7e6, PhiEf: 2, MEd: 43e6, MRd: 98e6},
				Biaxial: design.Biaxial{Checked: true, A: 1.38, Ratio: 0.83},
				AsReq:   1880, AsMin: 494.5, AsMax: 7000, AsProv: 2513.3, NRdMax: 5210000,
				Bars: design.Bars{Count: 8, Dia: 20, Positions: [][2]float64{{-117, -192}, {117, -192}, {-117, 192}, {117, 192},
					{-117, 0}, {117, 0}, {0, -192}, {0, 192}}},
				Links:       design.Links{Dia: 8, Spacing: 300, SpacingReduced: 180},
				Utilization: 0.83, Status: design.StatusPass, Governing: "biaxial bending, Eq. (5.39)",
				Steps: steps},
			{Column: "K2/A", Storey: "L1", B: 300, H: 300, Cover: 35, Fck: 32, Fyk: 500, NEd: 1200000,
				Y: axis, Z: axis, AsReq: 2600, AsMin: 276, AsMax: 3600, AsProv: 1257, NRdMax: 2900000,
				Bars:        design.Bars{Count: 4, Dia: 20, Given: true, Positions: [][2]float64{{-100, -100}, {100, -100}, {-100, 100}, {100, 100}}},
				Links:       design.Links{Dia: 6, Spacing: 240, SpacingReduced: 144},
				Utilization: 1.12, Status: design.StatusFail, Governing: "bending about z",
				Reasons:  []string{"M_Ed,z exceeds M_Rd,z with the given bars (utilisation 1.12)"},
				Cautions: []string{"the given bars were checked, not designed"},
				Steps:    []trace.Step{fail, raw}},
		},
	}
}

func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./reports -update to create it)", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs from the golden file (run go test ./reports -update after checking the change)", path)
	}
}

func TestGolden(t *testing.T) {
	r := sample(t, "Riverside Offices")
	type maker func(*design.Result, Options) ([]Sheet, error)
	doc := func(r *design.Result, o Options) ([]Sheet, error) {
		var out []Sheet
		for _, f := range []func(*design.Result, Options) (Sheet, error){DocumentMarkdown, DocumentLaTeX, DocumentHTML} {
			s, err := f(r, o)
			if err != nil {
				return nil, err
			}
			out = append(out, s)
		}
		return out, nil
	}
	tests := []struct {
		dir  string
		make maker
		opt  Options
	}{
		{"md", Markdown, Options{}},
		{"tex", LaTeX, Options{}},
		{"html", HTML, Options{}},
		{"data", func(r *design.Result, _ Options) ([]Sheet, error) {
			j, err := JSON(r)
			if err != nil {
				return nil, err
			}
			c, err := CSV(r)
			if err != nil {
				return nil, err
			}
			return []Sheet{{"results.json", j}, {"summary.csv", c}}, nil
		}, Options{}},
		{"doc", doc, Options{}},
		// Every step, in HTML with the sub-steps folded.
		{"full/md", Markdown, Options{Detail: Full}},
		{"full/html", HTML, Options{Detail: Full}},
		{"full/doc", doc, Options{Detail: Full}},
	}
	for _, tc := range tests {
		t.Run(tc.dir, func(t *testing.T) {
			sheets, err := tc.make(r, tc.opt)
			if err != nil {
				t.Fatal(err)
			}
			for _, s := range sheets {
				golden(t, filepath.Join(tc.dir, s.Name), s.Data)
			}
		})
	}
}

func TestNames(t *testing.T) {
	r := sample(t, "x")
	r.Designs = append(r.Designs, r.Designs[0], r.Designs[0], r.Designs[0])
	r.Designs[2].Column = "../../etc"
	r.Designs[3].Column = "k1" // differs from K1 only in case
	tests := []struct {
		make func(*design.Result, Options) ([]Sheet, error)
		want []string
	}{
		{Markdown, []string{"index.md", "K1-L1.md", "K2_A-L1.md", "______etc-L1.md", "k1-L1-2.md", "K1-L1-3.md"}},
		{LaTeX, []string{"index.tex", "K1-L1.tex", "K2_A-L1.tex", "______etc-L1.tex", "k1-L1-2.tex", "K1-L1-3.tex"}},
		{HTML, []string{"index.html", "K1-L1.html", "K2_A-L1.html", "______etc-L1.html", "k1-L1-2.html", "K1-L1-3.html"}},
	}
	for _, tc := range tests {
		sheets, err := tc.make(r, Options{})
		if err != nil {
			t.Fatal(err)
		}
		var got []string
		for _, s := range sheets {
			got = append(got, s.Name)
			if strings.ContainsAny(s.Name, `/\`) || strings.Contains(s.Name, "..") {
				t.Errorf("unsafe name %q", s.Name)
			}
		}
		if !reflect.DeepEqual(got, tc.want) {
			t.Errorf("names %q, want %q", got, tc.want)
		}
	}
}

const nasty = `A & B <script>alert(1)</script> 50% $x_1$ #2 {c} ~d^e \f [g](h) *i* |j|`

func TestEscaping(t *testing.T) {
	r := sample(t, nasty)
	r.Designs[0].Column = "<b>K1</b>"
	r.Designs[0].Governing = nasty
	tests := []struct {
		name   string
		make   func(*design.Result, Options) ([]Sheet, error)
		want   []string // must appear
		refuse []string // must not appear
	}{
		{"md", Markdown,
			[]string{`A \& B \<script\>alert(1)\</script\> 50% \$x\_1\$ \#2 \{c\} \~d^e \\f \[g\](h) \*i\* \|j\|`},
			[]string{"<script>", "<b>", "[g](h)"}},
		{"tex", LaTeX,
			[]string{`A \& B \textless{}script\textgreater{}alert(1)\textless{}/script\textgreater{} 50\% \$x\_1\$ \#2 \{c\} \textasciitilde{}d\textasciicircum{}e \textbackslash{}f {[}g{]}(h) *i* \textbar{}j\textbar{}`},
			[]string{"50% ", "$x_1$", " #2", "~d^e"}},
		{"html", HTML,
			[]string{`A &amp; B &lt;script&gt;alert(1)&lt;/script&gt; 50% $x_1$ #2 {c} ~d^e \f [g](h) *i* |j|`},
			[]string{"<script>", "<b>K1", `href="h"`, "<em>i</em>"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			sheets, err := tc.make(r, Options{})
			if err != nil {
				t.Fatal(err)
			}
			for _, s := range sheets {
				text := string(s.Data)
				for _, w := range tc.want {
					if !strings.Contains(text, w) {
						t.Errorf("%s: escaped title %q not found", s.Name, w)
					}
				}
				for _, w := range tc.refuse {
					if strings.Contains(text, w) {
						t.Errorf("%s: unescaped %q found", s.Name, w)
					}
				}
			}
		})
	}
}

func keys(m map[string]any) []string {
	var k []string
	for n := range m {
		k = append(k, n)
	}
	sort.Strings(k)
	return k
}

func TestJSONContract(t *testing.T) {
	b, err := JSON(sample(t, "x"))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasSuffix(b, []byte("}\n")) || !bytes.HasPrefix(b, []byte(`{"tool":`)) || bytes.Count(b, []byte("\n")) != 1 {
		t.Error("results.json is not compact on one line with a trailing newline")
	}
	// null only where the contract allows it: the shear values where no shear check applies.
	rest := b
	for _, key := range []string{"VEd_kN", "VRd_c_kN", "VRd_max_kN", "spacing_shear_mm"} {
		rest = bytes.ReplaceAll(rest, []byte(`"`+key+`":null`), nil)
	}
	for _, bad := range []string{"NaN", "Inf", "null"} {
		if bytes.Contains(rest, []byte(bad)) {
			t.Errorf("results.json contains %s", bad)
		}
	}
	var doc map[string]any
	if err := json.Unmarshal(b, &doc); err != nil {
		t.Fatal(err)
	}
	axis := []string{"M01_kNm", "M02_kNm", "M0Ed_kNm", "M2_kNm", "MEd_kNm", "MRd_kNm", "ei_mm", "l0_m", "lambda", "lambda_lim", "phi_ef", "slender", "VEd_kN", "VRd_c_kN", "VRd_max_kN"}
	d0 := doc["designs"].([]any)[0].(map[string]any)
	tests := []struct {
		name string
		obj  any
		want []string
	}{
		{"top", doc, []string{"basis", "code", "designs", "forms", "input_sha256", "tool"}},
		{"tool", doc["tool"], []string{"name", "version"}},
		{"code", doc["code"], []string{"annex", "overrides", "standard"}},
		{"overrides", doc["code"].(map[string]any)["overrides"], []string{"alpha_cc"}},
		{"design", d0, []string{"As_max_mm2", "As_min_mm2", "As_prov_mm2", "As_req_mm2", "NEd_kN", "NRd_max_kN",
			"axes", "b_mm", "bars", "biaxial", "cases", "cautions", "column", "cover_mm", "fck_MPa", "fyk_MPa", "governing",
			"governing_case", "h_mm", "links", "reasons", "shape", "status", "steps", "storey", "trace", "utilization"}},
		{"axes", d0["axes"], []string{"y", "z"}},
		{"axis y", d0["axes"].(map[string]any)["y"], axis},
		{"axis z", d0["axes"].(map[string]any)["z"], axis},
		{"biaxial", d0["biaxial"], []string{"a", "checked", "ratio"}},
		{"bars", d0["bars"], []string{"count", "dia_mm", "positions_mm"}},
		{"links", d0["links"], []string{"type", "dia_mm", "spacing_mm", "spacing_reduced_mm", "spacing_shear_mm", "spacing_lap_mm", "lap_count"}},
	}
	for _, tc := range tests {
		m, ok := tc.obj.(map[string]any)
		if !ok {
			t.Errorf("%s is not an object", tc.name)
			continue
		}
		sort.Strings(tc.want)
		if got := keys(m); !reflect.DeepEqual(got, tc.want) {
			t.Errorf("%s keys %q, want %q", tc.name, got, tc.want)
		}
	}
	if n, ok := d0["steps"].(float64); !ok || n != 11 || len(d0["trace"].([]any)) != 11 {
		t.Errorf("steps %v, want the number 11 and a trace of 11 steps", d0["steps"])
	}
	if v := d0["NEd_kN"].(float64); v != 2150 {
		t.Errorf("NEd_kN %v, want 2150", v)
	}
	if v := d0["axes"].(map[string]any)["y"].(map[string]any)["l0_m"].(float64); v != 2.9 {
		t.Errorf("l0_m %v, want 2.9", v)
	}
}

func TestNonFinite(t *testing.T) {
	tests := []struct {
		name  string
		spoil func(r *design.Result)
	}{
		{"MEd", func(r *design.Result) { r.Designs[0].Y.MEd = math.NaN() }},
		{"utilization", func(r *design.Result) { r.Designs[1].Utilization = math.Inf(1) }},
		{"step value", func(r *design.Result) { r.Designs[0].Steps[2].Value = math.NaN() }},
		{"step argument", func(r *design.Result) { r.Designs[0].Steps[2].Args[0].Value = math.Inf(-1) }},
		{"bar", func(r *design.Result) { r.Designs[0].Bars.Positions[0][1] = math.NaN() }},
	}
	makers := map[string]func(*design.Result) ([]byte, error){
		"JSON": JSON, "CSV": CSV,
		"Markdown": func(r *design.Result) ([]byte, error) { _, err := Markdown(r, Options{}); return nil, err },
		"LaTeX":    func(r *design.Result) ([]byte, error) { _, err := LaTeX(r, Options{}); return nil, err },
		"HTML":     func(r *design.Result) ([]byte, error) { _, err := HTML(r, Options{}); return nil, err },
	}
	for _, tc := range tests {
		for name, f := range makers {
			r := sample(t, "x")
			tc.spoil(r)
			if _, err := f(r); err == nil {
				t.Errorf("%s with a non-finite %s: no error", name, tc.name)
			}
		}
	}
}

func TestFmtNum(t *testing.T) {
	tests := []struct {
		v    float64
		want string
	}{
		{0, "0"}, {2150, "2150"}, {18.133333, "18.13"}, {1.5, "1.5"}, {0.0035, "0.0035"},
		{0.00175, "0.00175"}, {-40, "-40"}, {999.96, "1000"}, {123456.7, "123500"}, {0.70812, "0.7081"},
		{3.2e-7, "3.2e-7"}, {-0.00001234, "-1.234e-5"}, {-0.00000001, "-1e-8"}, {2.5e13, "2.5e13"},
		{math.NaN(), "?"}, {-0.00004, "-4e-5"}, {-1e-300, "-1e-300"},
	}
	for _, tc := range tests {
		if got := fmtNum(tc.v).plain(); got != tc.want {
			t.Errorf("fmtNum(%g) = %q, want %q", tc.v, got, tc.want)
		}
	}
}

func TestDisplayUnit(t *testing.T) {
	tests := []struct {
		engine string
		scale  float64
		unit   string
	}{
		{"N", 1e-3, "kN"}, {"Nmm", 1e-6, "kNm"}, {"mm", 1, "mm"}, {"mm2", 1, "mm²"}, {"MPa", 1, "MPa"},
		{"N/mm", 1, "kN/m"}, {"", 1, ""},
	}
	for _, tc := range tests {
		s, u := DisplayUnit(tc.engine)
		if s != tc.scale || u != tc.unit {
			t.Errorf("DisplayUnit(%q) = %g, %q; want %g, %q", tc.engine, s, u, tc.scale, tc.unit)
		}
	}
}

func TestFormula(t *testing.T) {
	args := []trace.Arg{
		{Name: "fck", Symbol: "f_ck", Value: 32, Unit: "MPa"},
		{Name: "gamma_c", Symbol: "γ_c", Value: 1.5},
		{Name: "l0", Symbol: "l_0", Value: 2900, Unit: "mm"},
		{Name: "M01", Symbol: "M_01", Value: -40e6, Unit: "Nmm"},
		{Name: "n", Symbol: "n", Value: 0.4},
	}
	tests := []struct {
		expr, symbols, values, texSymbols string
	}{
		{"fck / gamma_c", "f<sub>ck</sub> / γ<sub>c</sub>", "32\u00a0MPa / 1.5", `${f}_{\mathrm{ck}}/{\gamma{}}_{\mathrm{c}}$`},
		{"l0 ** 2 * k", "l<sub>0</sub><sup>2</sup> · k", "(2900\u00a0mm)<sup>2</sup> · k", `${l}_{\mathrm{0}}^{2}\cdot \mathrm{k}$`},
		{"(1 + n) ** (1/3)", "(1 + n)<sup>1/3</sup>", "(1 + 0.4)<sup>1/3</sup>", `$(1+n)^{1/3}$`},
		{"sqrt(n) * -M01", "√(n) · −M<sub>01</sub>", "√(0.4) · −(−40\u00a0kNm)", `$\sqrt{n}\cdot -{}{M}_{\mathrm{01}}$`},
		{"max(n, abs(M01))", "max(n, \\|M<sub>01</sub>\\|)", "max(0.4, \\|−40\u00a0kNm\\|)", `$\max(n,\allowbreak\ \lvert {M}_{\mathrm{01}}\rvert )$`},
		{"n <= 1 && n >= 0", "n ≤ 1 and n ≥ 0", "0.4 ≤ 1 and 0.4 ≥ 0", `$n\leq 1\ \text{and}\ n\geq 0$`},
	}
	for _, tc := range tests {
		ps, err := layout(tc.expr, args, false)
		if err != nil {
			t.Fatalf("%s: %v", tc.expr, err)
		}
		if got := (md{}).formula(ps); got != tc.symbols {
			t.Errorf("%s: symbols %q, want %q", tc.expr, got, tc.symbols)
		}
		if got := (tex{}).formula(ps); got != tc.texSymbols {
			t.Errorf("%s: LaTeX %q, want %q", tc.expr, got, tc.texSymbols)
		}
		ps, _ = layout(tc.expr, args, true)
		if got := (md{}).formula(ps); got != tc.values {
			t.Errorf("%s: values %q, want %q", tc.expr, got, tc.values)
		}
	}
	for _, bad := range []string{"a ** -1", "(a", "a)", "a # b", "** 2"} {
		if _, err := layout(bad, args, false); err == nil {
			t.Errorf("%q: no error", bad)
		}
	}
}

func TestSymbols(t *testing.T) {
	tests := []struct{ in, md, tex string }{
		{"f_cd", "f<sub>cd</sub>", `${f}_{\mathrm{cd}}$`},
		{"λ_lim", "λ<sub>lim</sub>", `${\lambda{}}_{\mathrm{lim}}$`},
		{"M_Ed,y", "M<sub>Ed,y</sub>", `${M}_{\mathrm{Ed,y}}$`},
		{"ε_cu2", "ε<sub>cu2</sub>", `${\varepsilon{}}_{\mathrm{cu2}}$`},
		{"A_s,min", "A<sub>s,min</sub>", `${A}_{\mathrm{s,min}}$`},
		{"η", "η", `$\eta{}$`},
		{"x_a_b", `x<sub>a\_b</sub>`, `${x}_{\mathrm{a\_b}}$`},
	}
	for _, tc := range tests {
		if got := (md{}).sym(tc.in); got != tc.md {
			t.Errorf("md %q: %q, want %q", tc.in, got, tc.md)
		}
		if got := (tex{}).sym(tc.in); got != tc.tex {
			t.Errorf("tex %q: %q, want %q", tc.in, got, tc.tex)
		}
	}
}

// TestHTMLWellFormed parses every page as XML (the pages are written as XHTML-compatible
// HTML), which catches unbalanced or unclosed elements.
func TestHTMLWellFormed(t *testing.T) {
	sheets, err := HTML(sample(t, nasty), Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range sheets {
		d := xml.NewDecoder(bytes.NewReader(s.Data))
		d.Strict = true
		d.Entity = xml.HTMLEntity
		var stack []string
		sections := 0
		for {
			tok, err := d.Token()
			if err == io.EOF {
				break
			}
			if err != nil {
				t.Fatalf("%s: %v", s.Name, err)
			}
			switch e := tok.(type) {
			case xml.StartElement:
				stack = append(stack, e.Name.Local)
				if e.Name.Local == "section" {
					sections++
				}
				if e.Name.Local == "script" || e.Name.Local == "link" || e.Name.Local == "img" {
					t.Errorf("%s: element %s in a self-contained page", s.Name, e.Name.Local)
				}
			case xml.EndElement:
				stack = stack[:len(stack)-1]
			}
		}
		if len(stack) != 0 {
			t.Errorf("%s: unclosed %v", s.Name, stack)
		}
		want := 1
		if sections != want {
			t.Errorf("%s: %d sheets, want %d", s.Name, sections, want)
		}
		for _, w := range []string{"<!DOCTYPE html>", "@media print", "break-before: page", "<style>"} {
			if !bytes.Contains(s.Data, []byte(w)) {
				t.Errorf("%s: %q missing", s.Name, w)
			}
		}
	}
}

// TestLaTeXCompiles runs pdflatex over every sheet, the escaping test's hostile title included.
func TestLaTeXCompiles(t *testing.T) {
	pdflatex, err := exec.LookPath("pdflatex")
	if err != nil {
		t.Skip("pdflatex not installed: apt-get install texlive-latex-base texlive-latex-recommended texlive-pictures")
	}
	r := sample(t, nasty+" αβγ ≤ ≥ ² ‰ √ × · é ü ñ Ø 中")
	r.Designs[0].Column = "K1_a&b"
	sheets, err := LaTeX(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	for _, s := range sheets {
		if err := os.WriteFile(filepath.Join(dir, s.Name), s.Data, 0o644); err != nil {
			t.Fatal(err)
		}
		for run := 0; run < 2; run++ { // twice, so that the page count resolves
			cmd := exec.Command(pdflatex, "-interaction=nonstopmode", "-halt-on-error", "-no-shell-escape", s.Name)
			cmd.Dir = dir
			out, err := cmd.CombinedOutput()
			if err != nil {
				t.Fatalf("%s: pdflatex: %v\n%s", s.Name, err, tail(out))
			}
		}
		log, _ := os.ReadFile(filepath.Join(dir, strings.TrimSuffix(s.Name, ".tex")+".log"))
		for _, w := range []string{"Missing character", "undefined", "LaTeX Warning: Reference"} {
			if bytes.Contains(log, []byte(w)) {
				t.Errorf("%s: log reports %q", s.Name, w)
			}
		}
	}
}

func tail(b []byte) string {
	if len(b) > 3000 {
		b = b[len(b)-3000:]
	}
	return string(b)
}

// The schedule says how a fire rating is shown: a rating verified by another method reads as
// such, never as a pass of this calculation (common practice, no source).
func TestScheduleFireStatus(t *testing.T) {
	for _, c := range []struct {
		rating int
		ok     bool
		method string
		want   string
	}{
		{0, false, "", "not required"},
		{90, true, fire.RouteTable, "passes"},
		{90, false, "", "fails"},
		{60, true, fire.RouteElsewhere, "verified elsewhere"},
	} {
		var d design.Design
		d.Detailing.FireRating, d.Detailing.FireOK, d.Detailing.FireMethod = c.rating, c.ok, c.method
		row := scheduleRow(d, "Group 1", design.LiftLevel{}, func(s string) string { return s })
		found := false
		for _, cell := range row {
			if cell == c.want {
				found = true
			}
		}
		if !found {
			t.Errorf("R%d %v %q: row %q lacks %q", c.rating, c.ok, c.method, row, c.want)
		}
	}
}

// The PDF carries the project's title and designer in its metadata, in characters a PDF
// information string takes safely (common practice, no source).
func TestPDFMetadata(t *testing.T) {
	for in, want := range map[string]string{
		"Fenwick Quay, block 2":   "Fenwick Quay, block 2",
		`50% {raw} \input & #tab`: "50 raw input tab",
		"Beam A1–B1":              "Beam A1-B1",
	} {
		if got := pdfText(in); got != want {
			t.Errorf("pdfText(%q) = %q, want %q", in, got, want)
		}
	}
	sheets, err := LaTeX(sample(t, "Riverside Offices"), Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(sheets[1].Data, []byte(`pdftitle={Riverside Offices: Column K1, lift L1}`)) {
		t.Error("the sheet's PDF has no title")
	}
}
