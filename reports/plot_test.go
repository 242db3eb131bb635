package reports

import (
	"bytes"
	"encoding/xml"
	"io"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
	"colsheet/calc/section"
)

// plotDesign builds a design with invented interaction data: the shapes only need to look
// like interaction curves, they are not the resistance of any section.
func plotDesign() design.Design {
	var nm []section.NMPoint
	const nmin, nmax = -1000e3, 4000e3
	for i := 0; i <= 10; i++ {
		n := nmin + (nmax-nmin)*float64(i)/10
		m := 300e6 * math.Pow(math.Sin(math.Pi*float64(i)/10), 0.8)
		if i == 10 {
			m = 0
		}
		nm = append(nm, section.NMPoint{N: n, M: m, MNeg: -m})
	}
	var nmz []section.NMPoint
	for _, p := range nm {
		nmz = append(nmz, section.NMPoint{N: p.N, M: 0.6 * p.M, MNeg: 0.6 * p.MNeg})
	}
	var contour []section.MyMzPoint
	for k := 0; k < 12; k++ {
		th := 2 * math.Pi * float64(k) / 12
		my, mz := 250e6*math.Cos(th), 160e6*math.Sin(th)
		contour = append(contour, section.MyMzPoint{Theta: th, My: my, Mz: mz, MRd: math.Hypot(my, mz)})
	}
	return design.Design{
		Column: "K1", Storey: "L1", B: 350, H: 500, NEd: 2150e3,
		Y:           design.Axis{MEd: 100.6e6, MRd: 262.5e6},
		Z:           design.Axis{MEd: 43e6, MRd: 157.5e6},
		Exact:       &design.Exact{MRd: 221.4e6, My: 203.1e6, Mz: 86.8e6},
		Interaction: &design.Interaction{NMY: nm, NMZ: nmz, Contour: contour},
	}
}

// plotInput is a small column in the actions form, designed by the engine for the tests.
const plotInput = `project: {title: Plot test, job: P-1, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C32/40, fyk: 500 MPa, aggregate: 20 mm}
columns:
  - id: K1
    b: 350 mm
    h: 500 mm
    cover: 40 mm
    bars: {count: 8, dia: 20 mm}
    storeys:
      - name: L1
        l0: {y: 2.9 m, z: 3.1 m}
        NEd: 2150 kN
        M: {y: {top: 85 kNm, bottom: -40 kNm}, z: {top: 10 kNm, bottom: 10 kNm}}
`

// engineDesign runs the engine on plotInput and adds the interaction data.
func engineDesign(t testing.TB) design.Design {
	t.Helper()
	in, err := yamlinput.Parse("plot.yaml", []byte(plotInput))
	if err != nil {
		t.Fatal(err)
	}
	r, err := design.Run(in)
	if err != nil {
		t.Fatal(err)
	}
	design.AddInteraction(r)
	if len(r.Designs) != 1 || r.Designs[0].Interaction == nil {
		t.Fatalf("engine gave %d designs, interaction %v", len(r.Designs), r.Designs[0].Interaction)
	}
	return r.Designs[0]
}

// svgDoc is the part of an SVG picture the tests read back.
type svgDoc struct {
	XMLName   xml.Name `xml:"svg"`
	ViewBox   string   `xml:"viewBox,attr"`
	Width     string   `xml:"width,attr"`
	Title     string   `xml:"title"`
	Polylines []struct {
		Points string `xml:"points,attr"`
	} `xml:"polyline"`
	Groups []struct {
		Title   string `xml:"title"`
		Circles []struct {
			CX float64 `xml:"cx,attr"`
			CY float64 `xml:"cy,attr"`
		} `xml:"circle"`
	} `xml:"g"`
}

// parseSVG decodes the whole of s as XML, failing on any error, and returns its structure.
func parseSVG(t *testing.T, s string) svgDoc {
	t.Helper()
	dec := xml.NewDecoder(strings.NewReader(s))
	for {
		if _, err := dec.Token(); err == io.EOF {
			break
		} else if err != nil {
			t.Fatalf("SVG is not well-formed XML: %v\n%s", err, s)
		}
	}
	var doc svgDoc
	if err := xml.Unmarshal([]byte(s), &doc); err != nil {
		t.Fatalf("SVG does not decode: %v", err)
	}
	return doc
}

func viewBox(t *testing.T, doc svgDoc) (w, h float64) {
	t.Helper()
	f := strings.Fields(doc.ViewBox)
	if len(f) != 4 || f[0] != "0" || f[1] != "0" {
		t.Fatalf("viewBox %q", doc.ViewBox)
	}
	w, err1 := strconv.ParseFloat(f[2], 64)
	h, err2 := strconv.ParseFloat(f[3], 64)
	if err1 != nil || err2 != nil || w <= 0 || h <= 0 {
		t.Fatalf("viewBox %q", doc.ViewBox)
	}
	return w, h
}

func TestDiagramsList(t *testing.T) {
	noContour := plotDesign()
	noContour.Interaction = &design.Interaction{NMY: noContour.Interaction.NMY, NMZ: noContour.Interaction.NMZ}
	noExact := plotDesign()
	noExact.Exact = nil
	tests := []struct {
		name  string
		d     design.Design
		names []string
		marks []int
	}{
		{"no interaction", design.Design{NEd: 1e6}, nil, nil},
		{"full", plotDesign(), []string{"nm-y", "nm-z", "mymz"}, []int{2, 2, 2}},
		{"no contour", noContour, []string{"nm-y", "nm-z"}, []int{2, 2}},
		{"no exact", noExact, []string{"nm-y", "nm-z", "mymz"}, []int{2, 2, 1}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			gs := diagrams(tc.d)
			if tc.names == nil {
				if gs != nil {
					t.Fatalf("got %d diagrams, want nil", len(gs))
				}
				return
			}
			if len(gs) != len(tc.names) {
				t.Fatalf("got %d diagrams, want %d", len(gs), len(tc.names))
			}
			for i, g := range gs {
				if g.Name != tc.names[i] || len(g.Marks) != tc.marks[i] {
					t.Errorf("diagram %d: %s with %d marks, want %s with %d", i, g.Name, len(g.Marks), tc.names[i], tc.marks[i])
				}
				if g.Caption() == "" || strings.ContainsAny(g.Caption(), "_\\$<") {
					t.Errorf("%s: caption %q is not plain text", g.Name, g.Caption())
				}
			}
		})
	}
}

// TestDiagramUnits checks the conversion to kN and kNm and the closed N–M curve.
func TestDiagramUnits(t *testing.T) {
	d := plotDesign()
	gs := diagrams(d)
	y := gs[0]
	if y.XUnit != "kNm" || y.YUnit != "kN" || gs[2].XUnit != "kNm" || gs[2].YUnit != "kNm" {
		t.Errorf("units %s %s, %s %s", y.XUnit, y.YUnit, gs[2].XUnit, gs[2].YUnit)
	}
	if m := y.Marks[0].At; math.Abs(m.X-100.6) > 1e-9 || math.Abs(m.Y-2150) > 1e-9 {
		t.Errorf("design point %+v, want (100.6, 2150)", m)
	}
	if m := y.Marks[1].At; math.Abs(m.X-262.5) > 1e-9 || math.Abs(m.Y-2150) > 1e-9 {
		t.Errorf("resistance point %+v, want (262.5, 2150)", m)
	}
	pts := y.Curves[0].Points
	if len(pts) != 2*len(d.Interaction.NMY) || pts[0] != pts[len(pts)-1] {
		t.Errorf("N–M curve of %d points is not closed: %+v … %+v", len(pts), pts[0], pts[len(pts)-1])
	}
	if pts[5].X <= 0 || pts[len(pts)-6].X >= 0 {
		t.Errorf("positive-face branch should be drawn right of M = 0 and the negative-face branch left: %+v, %+v", pts[5], pts[len(pts)-6])
	}
	c := gs[2].Curves[0].Points
	if c[0] != c[len(c)-1] || len(c) != len(d.Interaction.Contour)+1 {
		t.Errorf("contour not closed")
	}
	if m := gs[2].Marks[1].At; math.Abs(m.X-203.1) > 1e-9 || math.Abs(m.Y-86.8) > 1e-9 {
		t.Errorf("exact point %+v", m)
	}
}

func TestNiceRange(t *testing.T) {
	for _, tc := range []struct{ raw, want float64 }{
		{0.7, 1}, {1, 1}, {1.3, 2}, {2.1, 2.5}, {2.5, 2.5}, {3, 5}, {6, 10}, {0.013, 0.02}, {240, 250}, {800, 1000},
	} {
		if got := niceStep(tc.raw); math.Abs(got-tc.want) > 1e-12*tc.want {
			t.Errorf("niceStep(%g) = %g, want %g", tc.raw, got, tc.want)
		}
	}
	for _, tc := range []struct{ lo, hi float64 }{{-351.7, 351.7}, {0, 4685}, {-1093, 4685}, {0, 0}, {-0.3, 0.02}} {
		r := niceRange(tc.lo, tc.hi)
		if !(r.Min <= tc.lo && r.Max >= tc.hi && r.Max > r.Min) {
			t.Errorf("niceRange(%g, %g) = %+v does not hold the data", tc.lo, tc.hi, r)
		}
		n := (r.Max - r.Min) / r.Step
		if math.Abs(n-math.Round(n)) > 1e-9 || n < 4 || n > 12 {
			t.Errorf("niceRange(%g, %g) = %+v: %g intervals", tc.lo, tc.hi, r, n)
		}
		if k := r.Min / r.Step; math.Abs(k-math.Round(k)) > 1e-9 {
			t.Errorf("niceRange(%g, %g) = %+v: Min not on a tick", tc.lo, tc.hi, r)
		}
	}
	for _, tc := range []struct {
		v    float64
		dec  int
		want string
	}{{-0.0001, 1, "0.0"}, {-0.4, 0, "0"}, {-2.5, 1, "-2.5"}, {1234.5678, 2, "1234.57"}, {math.NaN(), 2, "0"}} {
		if got := fixed(tc.v, tc.dec); got != tc.want {
			t.Errorf("fixed(%g, %d) = %q, want %q", tc.v, tc.dec, got, tc.want)
		}
	}
}

// textRE and dyRE find the text elements of an SVG picture and their baseline shifts.
var (
	textRE = regexp.MustCompile(`<text[^>]*>.*?</text>`)
	dyRE   = regexp.MustCompile(`dy="(-?\d+)"`)
)

// TestDiagramSVG reads each picture back: well-formed XML, every curve point inside the
// viewBox and the plot area, and the design and resistance points at the right place.
func TestDiagramSVG(t *testing.T) {
	for _, tc := range []struct {
		name string
		d    design.Design
	}{{"invented", plotDesign()}, {"engine", engineDesign(t)}} {
		d := tc.d
		gs := diagrams(d)
		if len(gs) != 3 {
			t.Fatalf("%s: %d diagrams, want 3", tc.name, len(gs))
		}
		// Expected marks in display units, the first the design point, per diagram.
		want := [][]pt{
			{{d.Y.MEd / 1e6, d.NEd / 1e3}, {d.Y.MRd / 1e6, d.NEd / 1e3}},
			{{d.Z.MEd / 1e6, d.NEd / 1e3}, {d.Z.MRd / 1e6, d.NEd / 1e3}},
			{{d.Y.MEd / 1e6, d.Z.MEd / 1e6}, {d.Exact.My / 1e6, d.Exact.Mz / 1e6}},
		}
		for i, g := range gs {
			t.Run(tc.name+"/"+g.Name, func(t *testing.T) {
				s := g.SVG()
				if s != g.SVG() {
					t.Fatal("SVG differs between two calls")
				}
				doc := parseSVG(t, s)
				w, h := viewBox(t, doc)
				if w != 480 || doc.Width != "480" || doc.Title == "" {
					t.Errorf("width %s, viewBox %s, title %q", doc.Width, doc.ViewBox, doc.Title)
				}
				for _, bad := range []string{"<script", "href", "class=", "<style", "url("} {
					if strings.Contains(s, bad) {
						t.Errorf("SVG holds %q", bad)
					}
				}
				for _, txt := range textRE.FindAllString(s, -1) {
					shift := 0
					for _, m := range dyRE.FindAllStringSubmatch(txt, -1) {
						v, _ := strconv.Atoi(m[1])
						shift += v
						if shift != 0 && shift != 3 {
							t.Fatalf("baseline shifted by %d in %s", shift, txt)
						}
					}
				}
				if len(doc.Polylines) == 0 {
					t.Fatal("no polyline")
				}
				for _, pl := range doc.Polylines {
					for _, p := range strings.Fields(pl.Points) {
						xy := strings.Split(p, ",")
						x, err1 := strconv.ParseFloat(xy[0], 64)
						y, err2 := strconv.ParseFloat(xy[1], 64)
						if len(xy) != 2 || err1 != nil || err2 != nil {
							t.Fatalf("bad point %q", p)
						}
						if x < 0 || x > w || y < 0 || y > h {
							t.Errorf("point (%g, %g) outside the viewBox %s", x, y, doc.ViewBox)
						}
						if x < svgLeft-1e-9 || x > svgRight+1e-9 || y < svgTop-1e-9 || y > svgBottom+1e-9 {
							t.Errorf("point (%g, %g) outside the plot area", x, y)
						}
					}
				}
				var marks [][2]float64
				for _, gr := range doc.Groups {
					if gr.Title != "" && len(gr.Circles) == 1 {
						marks = append(marks, [2]float64{gr.Circles[0].CX, gr.Circles[0].CY})
					}
				}
				if len(marks) != len(want[i]) {
					t.Fatalf("%d marks, want %d", len(marks), len(want[i]))
				}
				// Invert the scale: pixel → display units, and compare within half a pixel.
				perPxX := (g.X.Max - g.X.Min) / (svgRight - svgLeft)
				perPxY := (g.Y.Max - g.Y.Min) / (svgBottom - svgTop)
				for k, m := range marks {
					x := g.X.Min + (m[0]-svgLeft)*perPxX
					y := g.Y.Min + (svgBottom-m[1])*perPxY
					if math.Abs(x-want[i][k].X) > 0.5*perPxX || math.Abs(y-want[i][k].Y) > 0.5*perPxY {
						t.Errorf("mark %d at px (%g, %g) maps to (%g, %g), want (%g, %g)", k, m[0], m[1], x, y, want[i][k].X, want[i][k].Y)
					}
				}
			})
		}
	}
}

// nonFinite finds NaN or infinities as Go, XML or LaTeX would print them, and negative zeros.
var nonFinite = regexp.MustCompile(`(?i)nan|inf|[-−]0(\.0*)?([^.0-9]|$)`)

func TestDiagramNonFinite(t *testing.T) {
	d := plotDesign()
	nan, inf := math.NaN(), math.Inf(1)
	nm := append([]section.NMPoint{{N: nan, M: 1e6, MNeg: -1e6}}, d.Interaction.NMY...)
	nm = append(nm, section.NMPoint{N: 1e6, M: inf, MNeg: 0})
	d.Interaction = &design.Interaction{NMY: nm, NMZ: []section.NMPoint{{N: nan}},
		Contour: append(d.Interaction.Contour, section.MyMzPoint{My: nan, Mz: 1})}
	d.Z.MEd = inf
	d.Exact = &design.Exact{My: nan, Mz: 1}
	gs := diagrams(d)
	if len(gs) != 2 || gs[0].Name != "nm-y" || gs[1].Name != "mymz" {
		t.Fatalf("got %d diagrams", len(gs))
	}
	// A hand-made diagram with non-finite values must not print them either.
	gs = append(gs, diagram{Name: "raw", Title: "raw", XSym: "x", YSym: "y", X: axisRange{-1, 1, 0.5}, Y: axisRange{-1, 1, 0.5},
		Curves: []curve{{Legend: "c", Points: []pt{{0, 0}, {nan, 1}, {1, inf}, {0.5, 0.5}}}},
		Marks:  []mark{{Legend: "m", Tag: "m", At: pt{nan, 0}}}})
	for _, g := range gs {
		for _, out := range []string{g.SVG(), g.PGF()} {
			if loc := nonFinite.FindStringIndex(out); loc != nil {
				t.Errorf("%s: output holds %q: …%s…", g.Name, out[loc[0]:loc[1]], out[max(0, loc[0]-40):min(len(out), loc[1]+40)])
			}
		}
		parseSVG(t, g.SVG())
	}
}

// hostileDiagram carries characters special to XML and LaTeX in every label.
func hostileDiagram() diagram {
	g := diagrams(plotDesign())[0]
	g.Title = `a<b> & "c" 'd' $5 % #1 {x} ~^ \relax N_Ed–M é`
	g.XSym = "M_y&"
	g.Curves[0].Legend = "curve <1> & 50 %"
	g.Marks[0].Tag = `N_Ed, M_Ed,y # & $`
	return g
}

func TestDiagramEscaping(t *testing.T) {
	g := hostileDiagram()
	doc := parseSVG(t, g.SVG())
	if !strings.Contains(doc.Title, `a<b> & "c"`) {
		t.Errorf("title read back as %q", doc.Title)
	}
	p := g.PGF()
	for _, w := range []string{`\&`, `\%`, `\$5`, `\#1`, `\{x\}`, `\textbackslash{}relax`, `\textless{}b\textgreater{}`} {
		if !strings.Contains(p, w) {
			t.Errorf("PGF lacks %q", w)
		}
	}
	if strings.Contains(p, `\relax`) && !strings.Contains(p, `\textbackslash{}relax`) {
		t.Error("a backslash reached the PGF unescaped")
	}
}

func TestDiagramGolden(t *testing.T) {
	for _, g := range diagrams(plotDesign()) {
		golden(t, filepath.Join("plot", g.Name+".svg"), []byte(g.SVG()))
		golden(t, filepath.Join("plot", g.Name+".tex"), []byte(g.PGF()))
	}
}

// TestDiagramPGFCompiles sets every picture, the hostile one included, with pdflatex.
func TestDiagramPGFCompiles(t *testing.T) {
	pdflatex, err := exec.LookPath("pdflatex")
	if err != nil {
		t.Skip("pdflatex not installed")
	}
	var b strings.Builder
	b.WriteString("\\documentclass{article}\n\\usepackage[T1]{fontenc}\n\\usepackage[utf8]{inputenc}\n" +
		"\\usepackage{pgfplots}\n\\pgfplotsset{compat=1.16}\n\\begin{document}\n")
	gs := append(diagrams(engineDesign(t)), diagrams(plotDesign())...)
	gs = append(gs, hostileDiagram())
	for _, g := range gs {
		b.WriteString("\\begin{figure}[h]\n\\centering\n" + g.PGF() + "\\caption{" + tex{}.text(g.Caption()) + "}\n\\end{figure}\n\\clearpage\n")
	}
	b.WriteString("\\end{document}\n")
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "plot.tex"), []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(pdflatex, "-interaction=nonstopmode", "-halt-on-error", "-no-shell-escape", "plot.tex")
	cmd.Dir = dir
	out, err := cmd.CombinedOutput()
	if err != nil {
		if len(out) > 3000 {
			out = out[len(out)-3000:]
		}
		t.Fatalf("pdflatex: %v\n%s", err, out)
	}
	log, _ := os.ReadFile(filepath.Join(dir, "plot.log"))
	for _, w := range []string{"Missing character", "undefined", "Package pgfplots Warning"} {
		if bytes.Contains(log, []byte(w)) {
			t.Errorf("log reports %q", w)
		}
	}
}

func BenchmarkDiagramSVG(b *testing.B) {
	gs := diagrams(engineDesign(b))
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		for _, g := range gs {
			_ = g.SVG()
		}
	}
}

// Each marked point's tag names its coordinates in the order of the axes, so that the tooltip
// "(tag) = (x, y)" pairs every symbol with its own value and unit (common practice, no source:
// a point is written (abscissa, ordinate)).
func TestMarkTagsFollowAxes(t *testing.T) {
	d := plotDesign()
	gs := diagrams(d)
	// The symbol's letter and, where the axis has one, its subscript's last letter (y or z).
	parts := func(sym string) (string, string) {
		b, sub := splitSymbol(sym)
		last := ""
		if sub != "" {
			last = sub[len(sub)-1:]
		}
		return b, last
	}
	for _, g := range gs {
		xb, xs := parts(g.XSym)
		yb, ys := parts(g.YSym)
		for _, m := range g.Marks {
			syms := strings.Split(m.Tag, ", ")
			if len(syms) != 2 {
				t.Fatalf("%s: tag %q does not name two coordinates", g.Name, m.Tag)
			}
			ab, as := parts(syms[0])
			bb, bs := parts(syms[1])
			if ab != xb || bb != yb || (xs != "" && as != xs) || (ys != "" && bs != ys) {
				t.Errorf("%s: tag %q does not follow the axes (%s, %s)", g.Name, m.Tag, g.XSym, g.YSym)
			}
		}
	}
	// The tooltips of the invented design: MEd,y = 100.6 kNm and MRd,y = 262.5 kNm at NEd = 2150 kN.
	for i, want := range []string{
		"<title>design point (MEd,y, NEd) = (100.6 kNm, 2150.0 kN)</title>",
		"<title>resistance at NEd (MRd,z, NEd) = (157.5 kNm, 2150.0 kN)</title>",
		"<title>design point (MEd,y, MEd,z) = (100.6 kNm, 43.0 kNm)</title>",
	} {
		if s := gs[i].SVG(); !strings.Contains(s, want) {
			t.Errorf("%s lacks %q", gs[i].Name, want)
		}
	}
}
