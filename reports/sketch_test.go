package reports

import (
	"bytes"
	"encoding/xml"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/detail"
	yamlinput "colsheet/calc/input"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// cageDesign builds a design holding only what the sketch reads: the section, the cover, the
// bars of a symmetric pattern at the positions the engine gives them (calc/detail), the links
// and, with traced, the restraint steps of 9.5.3(6) that place the extra ties. The sizes are
// test inputs, not a design.
func cageDesign(b, h, cover, link, dia float64, nb, nh int, traced bool) design.Design {
	g := detail.Geometry{B: b, H: h, Cover: cover, Link: link}
	p := detail.Pattern{Dia: dia, NB: nb, NH: nh}
	d := design.Design{Column: "K1", Storey: "L1", B: b, H: h, Cover: cover,
		Bars:  design.Bars{Count: p.Count(), Dia: dia, Positions: g.Positions(p)},
		Links: design.Links{Dia: link, Spacing: 240, SpacingReduced: 144}}
	l := &trace.Log{}
	d.Detailing.ExtraTies = detail.RestraintSteps(l, "ties/", g, p, detail.Traced{})
	if traced {
		d.Steps = l.Steps
	}
	return d
}

// The two sections of the golden files: a 450 square with 8 Ø16 whose two extra ties are known
// by their count alone, and a wide rectangle 1000 × 300 with 10 Ø20 whose ties the restraint
// steps place.
func squareCage() design.Design { return cageDesign(450, 450, 35, 8, 16, 3, 3, false) }
func wideCage() design.Design   { return cageDesign(1000, 300, 40, 10, 20, 5, 2, true) }

// sketchDoc is the part of a sketch's SVG the tests read back.
type sketchDoc struct {
	XMLName xml.Name `xml:"svg"`
	Width   float64  `xml:"width,attr"`
	Height  float64  `xml:"height,attr"`
	ViewBox string   `xml:"viewBox,attr"`
	Title   string   `xml:"title"`
	Rects   []struct {
		X      float64 `xml:"x,attr"`
		Y      float64 `xml:"y,attr"`
		W      float64 `xml:"width,attr"`
		H      float64 `xml:"height,attr"`
		RX     float64 `xml:"rx,attr"`
		Fill   string  `xml:"fill,attr"`
		Stroke string  `xml:"stroke,attr"`
		SW     float64 `xml:"stroke-width,attr"`
	} `xml:"rect"`
	Groups []struct {
		Fill    string  `xml:"fill,attr"`
		Stroke  string  `xml:"stroke,attr"`
		SW      float64 `xml:"stroke-width,attr"`
		Circles []struct {
			CX float64 `xml:"cx,attr"`
			CY float64 `xml:"cy,attr"`
			R  float64 `xml:"r,attr"`
		} `xml:"circle"`
		Lines []struct {
			X1 float64 `xml:"x1,attr"`
			Y1 float64 `xml:"y1,attr"`
			X2 float64 `xml:"x2,attr"`
			Y2 float64 `xml:"y2,attr"`
		} `xml:"line"`
	} `xml:"g"`
}

// readSketch checks that s is well-formed, self-contained SVG and decodes it.
func readSketch(t *testing.T, s string) sketchDoc {
	t.Helper()
	parseSVG(t, s) // well-formed XML throughout
	for _, bad := range []string{"<script", "href", "class=", "<style", "url(", "\n\n"} {
		if strings.Contains(s, bad) {
			t.Errorf("SVG holds %q", bad)
		}
	}
	if loc := nonFinite.FindStringIndex(s); loc != nil {
		t.Errorf("SVG holds %q", s[loc[0]:loc[1]])
	}
	var doc sketchDoc
	if err := xml.Unmarshal([]byte(s), &doc); err != nil {
		t.Fatal(err)
	}
	return doc
}

// TestSketchScale checks the choice of scale: the largest of the drawing office's scales at
// which the larger side spans at most 80 mm on paper (common practice, no source).
func TestSketchScale(t *testing.T) {
	for _, tc := range []struct{ b, h, want float64 }{
		{400, 400, 5}, {450, 450, 10}, {500, 500, 10}, {800, 800, 10}, {300, 1200, 20}, {1000, 300, 20},
		{2000, 400, 25}, {2400, 600, 50},
	} {
		if got := sketchScale(tc.b, tc.h); got != tc.want {
			t.Errorf("sketchScale(%g, %g) = 1:%g, want 1:%g", tc.b, tc.h, got, tc.want)
		}
	}
}

// TestSketchToScale reads the SVG back: the outline, the link and the bars at their sizes and
// places at the stated scale (96 px to the inch, the CSS reference pixel), every bar inside
// the link, and the caption naming the scale.
func TestSketchToScale(t *testing.T) {
	cases := []struct {
		name string
		d    design.Design
	}{
		{"square", squareCage()},
		{"wide", wideCage()},
		{"tall", cageDesign(300, 1200, 30, 8, 25, 2, 7, true)},
		{"heavy bars", cageDesign(600, 600, 40, 6, 32, 4, 4, true)},
		{"small", cageDesign(200, 250, 25, 6, 12, 2, 2, true)},
		{"engine", engineDesign(t)},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			s, ok := cageSketch(tc.d)
			if !ok {
				t.Fatal("no sketch")
			}
			if !strings.Contains(s.Caption(), "scale 1:"+fmtNum(s.Scale).plain()+",") {
				t.Errorf("caption %q does not name the scale", s.Caption())
			}
			doc := readSketch(t, s.SVG())
			k := 96 / 25.4 / s.Scale // px per mm of the column
			var outline, link *struct {
				X, Y, W, H, RX float64
				Fill, Stroke   string
				SW             float64
			}
			for i := range doc.Rects {
				r := doc.Rects[i]
				c := &struct {
					X, Y, W, H, RX float64
					Fill, Stroke   string
					SW             float64
				}{r.X, r.Y, r.W, r.H, r.RX, r.Fill, r.Stroke, r.SW}
				switch {
				case r.Fill == "#ececec":
					outline = c
				case r.Fill == "none":
					link = c
				}
			}
			if outline == nil || link == nil {
				t.Fatal("no outline or no link")
			}
			const tol = 0.011 // px: coordinates are written to 2 decimals
			if math.Abs(outline.W-tc.d.B*k) > tol || math.Abs(outline.H-tc.d.H*k) > tol {
				t.Errorf("outline %g × %g px, want %g × %g", outline.W, outline.H, tc.d.B*k, tc.d.H*k)
			}
			// The link's centreline lies at c_nom + φt/2 from the faces (c_nom is the cover to the
			// link, EN 1992-1-1:2004 4.4.1.1(2)), drawn as thick as the link.
			in := (tc.d.Cover + tc.d.Links.Dia/2) * k
			if math.Abs(link.X-outline.X-in) > tol || math.Abs(link.W-(outline.W-2*in)) > tol || math.Abs(link.SW-tc.d.Links.Dia*k) > tol {
				t.Errorf("link at x %g, width %g, stroke %g px; want x %g, width %g, stroke %g", link.X-outline.X, link.W, link.SW,
					in, outline.W-2*in, tc.d.Links.Dia*k)
			}
			var bars []struct{ CX, CY, R float64 }
			for _, g := range doc.Groups {
				if g.Fill == skBar {
					for _, c := range g.Circles {
						bars = append(bars, struct{ CX, CY, R float64 }{c.CX, c.CY, c.R})
					}
				}
			}
			if len(bars) != len(tc.d.Bars.Positions) {
				t.Fatalf("%d bars drawn, the design holds %d", len(bars), len(tc.d.Bars.Positions))
			}
			// The inner edge of the link: a rounded rectangle inset by half the stroke.
			hw := link.SW / 2
			xi, yi, wi, hi, ri := link.X+hw, link.Y+hw, link.W-2*hw, link.H-2*hw, link.RX-hw
			for n, c := range bars {
				p := tc.d.Bars.Positions[n]
				// Back from px to mm from the centroid.
				y := (c.CX-outline.X)/k - tc.d.B/2
				z := tc.d.H/2 - (c.CY-outline.Y)/k
				if math.Abs(y-p[0]) > tol/k || math.Abs(z-p[1]) > tol/k || math.Abs(c.R-tc.d.Bars.Dia/2*k) > tol {
					t.Errorf("bar %d drawn at (%g, %g) r %g px, the design has (%g, %g), φ %g", n, y, z, c.R, p[0], p[1], tc.d.Bars.Dia)
				}
				// The bar lies inside when its centre lies inside the inner edge shrunk by its
				// radius: a rounded rectangle with the corner radius max(ri − r, 0) about a core.
				rc := math.Max(ri-c.R, 0)
				in := c.R + rc // from the inner edge to the core
				dx := math.Max(0, math.Max(xi+in-c.CX, c.CX-(xi+wi-in)))
				dy := math.Max(0, math.Max(yi+in-c.CY, c.CY-(yi+hi-in)))
				if math.Hypot(dx, dy) > rc+2*tol { // four rounded numbers
					t.Errorf("bar %d at (%g, %g) px, r %g, reaches outside the link", n, c.CX, c.CY, c.R)
				}
			}
		})
	}
}

// TestSketchTies checks the extra ties: each drawn along the side of the two opposite bars it
// holds, from the link on one face to the link on the other; placed where the restraint steps
// say, or from the count on the middle bars of the longer faces, with the caption saying so.
func TestSketchTies(t *testing.T) {
	cases := []struct {
		name       string
		d          design.Design
		ties       int
		indicative bool
	}{
		// 8 bars in a 450 square: 3 a face at (450 − 2·(35 + 8 + 8))/2 = 174 mm > 150 mm, so each
		// face's middle bar is tied, EN 1992-1-1:2004 9.5.3(6).
		{"square by count", squareCage(), 2, true},
		{"square placed", cageDesign(450, 450, 35, 8, 16, 3, 3, true), 2, false},
		// 5 bars a b-face at (1000 − 2·(40 + 10 + 10))/4 = 220 mm: the 3 intermediate bars are tied.
		{"wide placed", wideCage(), 3, false},
		{"wide by count", cageDesign(1000, 300, 40, 10, 20, 5, 2, false), 3, true},
		// 4 bars a face at (600 − 2·(40 + 6 + 16))/3 = 158.7 mm > 150 mm: no bar reaches its
		// neighbour, so both intermediate bars of each face are tied.
		{"heavy bars", cageDesign(600, 600, 40, 6, 32, 4, 4, true), 4, false},
		{"no ties", cageDesign(400, 400, 35, 8, 20, 3, 3, true), 0, false},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			if tc.d.Detailing.ExtraTies != tc.ties {
				t.Fatalf("the design counts %d extra ties, the case %d", tc.d.Detailing.ExtraTies, tc.ties)
			}
			s, _ := cageSketch(tc.d)
			if len(s.Ties) != tc.ties || s.Indicative != tc.indicative {
				t.Fatalf("%d ties drawn (indicative %v), want %d (%v)", len(s.Ties), s.Indicative, tc.ties, tc.indicative)
			}
			said := strings.Contains(s.Caption(), "ties as counted; their positions as drawn are indicative")
			if said != (tc.indicative && tc.ties > 0) {
				t.Errorf("caption %q", s.Caption())
			}
			hy, hz, _ := s.linkLine()
			held := map[int]bool{}
			for _, tie := range s.Ties {
				a, c := s.tieLine(tie)
				for _, i := range tie {
					held[i] = true
					p := s.Bars[i]
					// Distance from the bar's centre to the tie's centreline: φ/2 + φt/2, the tie against the bar.
					var dist float64
					if a.X == c.X {
						dist = math.Abs(p.X - a.X)
					} else {
						dist = math.Abs(p.Y - a.Y)
					}
					if math.Abs(dist-(s.Dia/2+s.Link/2)) > 1e-9 {
						t.Errorf("tie %v passes %g mm from the centre of bar %d, want %g", tie, dist, i, s.Dia/2+s.Link/2)
					}
				}
				across := math.Abs(a.X-c.X) + math.Abs(a.Y-c.Y)
				if a.X == c.X && math.Abs(across-2*hz) > 1e-9 || a.Y == c.Y && math.Abs(across-2*hy) > 1e-9 {
					t.Errorf("tie %v runs %g mm, not from link to link", tie, across)
				}
			}
			// Every bar within 150 mm (centre to centre, along its face) of a corner or of a tied bar,
			// EN 1992-1-1:2004 9.5.3(6); where the ties are placed from their count alone the rule
			// is not claimed.
			if tc.indicative {
				return
			}
			f := s.faces()
			for _, face := range [][]int{f.bottom, f.top, f.left, f.right} {
				for _, i := range face {
					near := math.Inf(1)
					for k, j := range face {
						if k == 0 || k == len(face)-1 || held[j] {
							near = math.Min(near, math.Hypot(s.Bars[i].X-s.Bars[j].X, s.Bars[i].Y-s.Bars[j].Y))
						}
					}
					if near > 150+1e-9 {
						t.Errorf("bar %d is %g mm from a restrained bar", i, near)
					}
				}
			}
		})
	}
	// From the count alone, the ties go to the middle bars of the longer faces: the wide
	// rectangle's 3 ties hold the 3 intermediate bars of its b-faces, each across h.
	s, _ := cageSketch(cageDesign(1000, 300, 40, 10, 20, 5, 2, false))
	for _, tie := range s.Ties {
		if s.Bars[tie[0]].X != s.Bars[tie[1]].X || s.Bars[tie[0]].Y != -s.Bars[tie[1]].Y {
			t.Errorf("tie %v does not run across h between opposite bars", tie)
		}
	}
	// One tie by count in a square goes to the middle bar.
	d := squareCage()
	d.Detailing.ExtraTies = 1
	s, _ = cageSketch(d)
	if len(s.Ties) != 1 || s.Bars[s.Ties[0][0]].X != 0 {
		t.Errorf("one tie by count drawn as %v", s.Ties)
	}
}

// TestSketchNone: a design without bars or section gives no sketch.
func TestSketchNone(t *testing.T) {
	d := squareCage()
	d.Bars.Positions = nil
	if _, ok := cageSketch(d); ok {
		t.Error("a design without bars gave a sketch")
	}
	d = squareCage()
	d.B = 0
	if _, ok := cageSketch(d); ok {
		t.Error("a design without a section gave a sketch")
	}
}

// sketchInput is a 600 square with 8 Ø20 given: 3 bars a face at (600 − 2·(35 + 8 + 10))/2 =
// 247 mm, so each face's middle bar is tied, EN 1992-1-1:2004 9.5.3(6).
const sketchInput = `project: {title: Sketch test, job: S-1, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
columns:
  - id: K2
    b: 600 mm
    h: 600 mm
    cover: 35 mm
    bars: {count: 8, dia: 20 mm}
    storeys:
      - name: L1
        l0: {y: 3.0 m, z: 3.0 m}
        NEd: 3000 kN
        M: {y: {top: 60 kNm, bottom: -30 kNm}, z: {top: 20 kNm, bottom: 10 kNm}}
`

// TestSketchEngine draws a design of the engine: its ties placed by the restraint steps on the
// middle bars, and the sketch on the sheet before the interaction diagrams.
func TestSketchEngine(t *testing.T) {
	in, err := yamlinput.Parse("sketch.yaml", []byte(sketchInput))
	if err != nil {
		t.Fatal(err)
	}
	r, err := design.Run(in)
	if err != nil {
		t.Fatal(err)
	}
	d := r.Designs[0]
	if d.Detailing.ExtraTies != 2 {
		t.Fatalf("the engine counts %d extra ties, want 2 (EN 1992-1-1:2004 9.5.3(6))", d.Detailing.ExtraTies)
	}
	s, ok := cageSketch(d)
	if !ok || s.Indicative || len(s.Ties) != 2 {
		t.Fatalf("sketch %v: %d ties, indicative %v", ok, len(s.Ties), s.Indicative)
	}
	for _, tie := range s.Ties {
		p, q := s.Bars[tie[0]], s.Bars[tie[1]]
		if !(p.X == 0 && q.X == 0 || p.Y == 0 && q.Y == 0) {
			t.Errorf("tie holds (%g, %g) and (%g, %g), not the middle bars", p.X, p.Y, q.X, q.Y)
		}
	}
	readSketch(t, s.SVG())
	pkg, docs, err := Render(r, map[string]bool{"md": true, "tex": true}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range []struct{ format, heading, picture string }{
		{"md", "### Section and interaction diagrams", `<svg xmlns="http://www.w3.org/2000/svg" width="`},
		{"tex", "{Section and interaction diagrams}", "\\begin{tikzpicture}[x=1mm"},
	} {
		var sheet string
		for _, sh := range pkg[f.format] {
			if strings.Contains(sh.Name, "K2") {
				sheet = string(sh.Data)
			}
		}
		if !strings.Contains(sheet, f.heading) || strings.Count(sheet, f.picture) != 1 {
			t.Errorf("%s: the sheet of K2/L1 lacks the sketch or holds it more than once", f.format)
		}
		if i, j := strings.Index(sheet, f.heading), strings.Index(sheet, "Interaction diagrams"); j >= 0 && i > j {
			t.Errorf("%s: the sketch follows the interaction diagrams", f.format)
		}
	}
	// The calc document draws the group's cage once, beside its table, not again in the
	// governing lift's section.
	for _, doc := range docs {
		want := "<svg"
		if strings.HasSuffix(doc.Name, ".tex") {
			want = "\\begin{tikzpicture}[x=1mm"
		}
		if n := strings.Count(string(doc.Data), want); n != 1 {
			t.Errorf("%s holds the sketch %d times, want once", doc.Name, n)
		}
	}
}

func TestSketchGolden(t *testing.T) {
	for name, d := range map[string]design.Design{"square": squareCage(), "wide": wideCage(), "round": roundCage(), "helix": helixCage()} {
		s, _ := cageSketch(d)
		golden(t, filepath.Join("sketch", name+".svg"), []byte(s.SVG()))
		golden(t, filepath.Join("sketch", name+".tex"), []byte(s.PGF()))
	}
}

// TestSketchTikZCompiles sets the sketches with pdflatex and the packages of the calc sheets.
func TestSketchTikZCompiles(t *testing.T) {
	pdflatex, err := exec.LookPath("pdflatex")
	if err != nil {
		t.Skip("pdflatex not installed")
	}
	var b strings.Builder
	b.WriteString("\\documentclass{article}\n\\usepackage[T1]{fontenc}\n\\usepackage[utf8]{inputenc}\n\\usepackage{amsmath}\n" +
		"\\usepackage{xcolor}\n\\usepackage{pgfplots}\n\\pgfplotsset{compat=1.16}\n\\begin{document}\n")
	for _, d := range []design.Design{squareCage(), wideCage(), cageDesign(300, 1200, 30, 8, 25, 2, 7, true), engineDesign(t), roundCage(), helixCage()} {
		s, _ := cageSketch(d)
		b.WriteString("\\begin{center}\n" + s.PGF() + "\n{\\small\\itshape " + tex{}.text(s.Caption()) + "}\n\\end{center}\n")
	}
	b.WriteString("\\end{document}\n")
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "sketch.tex"), []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(pdflatex, "-interaction=nonstopmode", "-halt-on-error", "-no-shell-escape", "sketch.tex")
	cmd.Dir = dir
	out, err := cmd.CombinedOutput()
	if err != nil {
		if len(out) > 3000 {
			out = out[len(out)-3000:]
		}
		t.Fatalf("pdflatex: %v\n%s", err, out)
	}
	log, _ := os.ReadFile(filepath.Join(dir, "sketch.log"))
	for _, w := range []string{"Missing character", "undefined", "Overfull \\hbox"} {
		if bytes.Contains(log, []byte(w)) {
			t.Errorf("log reports %q", w)
		}
	}
}

// TestSketchNumbers: the SVG's size is written with two decimals and no exponent.
func TestSketchNumbers(t *testing.T) {
	s, _ := cageSketch(wideCage())
	doc := readSketch(t, s.SVG())
	w, h := s.size()
	if strconv.FormatFloat(doc.Width, 'f', 2, 64) != fixed(w, 2) || strconv.FormatFloat(doc.Height, 'f', 2, 64) != fixed(h, 2) {
		t.Errorf("size %g × %g, want %s × %s", doc.Width, doc.Height, fixed(w, 2), fixed(h, 2))
	}
}

// circleDesign builds a circular design holding only what the sketch reads: the diameter, the
// cover, n bars on the circle at the positions the engine gives them (calc/detail) and circular
// links or a helix. The sizes are test inputs, not a design.
func circleDesign(d, cover, link, dia float64, n int, links string, spacing float64) design.Design {
	g := detail.Geometry{B: d, H: d, Cover: cover, Link: link, Circle: true}
	p := detail.Pattern{Dia: dia, Ring: n}
	return design.Design{Column: "R1", Storey: "L1", B: d, H: d, Cover: cover, Shape: model.ShapeCircle,
		Bars:  design.Bars{Count: n, Dia: dia, Positions: g.Positions(p)},
		Links: design.Links{Type: links, Dia: link, Spacing: spacing, SpacingReduced: spacing * 0.6}}
}

// The circles of the golden files: D 450 with 8 Ø20 and circular links Ø8 @ 300, and D 600 with
// 10 Ø25 and a helix Ø10 of pitch 75.
func roundCage() design.Design { return circleDesign(450, 35, 8, 20, 8, design.LinksCircular, 300) }
func helixCage() design.Design { return circleDesign(600, 40, 10, 25, 10, design.LinksHelix, 75) }

// circleDoc is the part of a circle's SVG the tests read back beside sketchDoc: the top-level
// circles (outline and link) and the texts of the groups.
type circleDoc struct {
	Circles []struct {
		CX     float64 `xml:"cx,attr"`
		CY     float64 `xml:"cy,attr"`
		R      float64 `xml:"r,attr"`
		Fill   string  `xml:"fill,attr"`
		Stroke string  `xml:"stroke,attr"`
		SW     float64 `xml:"stroke-width,attr"`
	} `xml:"circle"`
	Texts []string `xml:"g>text"`
}

// TestSketchCircle reads the SVG of circular sections back: the outline a circle of diameter D,
// the link a circle on its centreline at c_nom + φt/2 inside the face and as thick as the link,
// every bar drawn where the design puts it, on the circle of radius D/2 − c_nom − φt − φ/2
// (the bars against the link, geometry), inside the link; the dimension "D = …", the cover,
// the helix's label and the caption naming the bars on a circle and the links.
func TestSketchCircle(t *testing.T) {
	cases := []struct {
		name    string
		d       design.Design
		caption string // the end of the caption
		helix   string // the helix's label, "" for circular links
	}{
		{"circular links", roundCage(), "8 Ø20 on a circle, circular links Ø8 @ 300", ""},
		{"helix", helixCage(), "10 Ø25 on a circle, helix Ø10, pitch 75", "helix, pitch 75"},
		{"small, six bars", circleDesign(250, 25, 6, 12, 6, design.LinksCircular, 150), "6 Ø12 on a circle, circular links Ø6 @ 150", ""},
		{"large helix, odd count", circleDesign(1200, 50, 12, 32, 15, design.LinksHelix, 100), "15 Ø32 on a circle, helix Ø12, pitch 100", "helix, pitch 100"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			s, ok := cageSketch(tc.d)
			if !ok || !s.Circle {
				t.Fatal("no sketch of a circle")
			}
			if want := "Section of the cage to scale 1:" + fmtNum(s.Scale).plain() + ", dimensions in mm: " + tc.caption; s.Caption() != want {
				t.Errorf("caption %q, want %q", s.Caption(), want)
			}
			svg := s.SVG()
			base := readSketch(t, svg) // well-formed, self-contained
			var doc circleDoc
			if err := xml.Unmarshal([]byte(svg), &doc); err != nil {
				t.Fatal(err)
			}
			k := 96 / 25.4 / s.Scale // px per mm of the column
			const tol = 0.011        // px: coordinates are written to 2 decimals
			if len(doc.Circles) != 2 || doc.Circles[0].Fill != "#ececec" || doc.Circles[1].Fill != "none" {
				t.Fatalf("top-level circles %+v, want the outline and the link", doc.Circles)
			}
			outline, link := doc.Circles[0], doc.Circles[1]
			if math.Abs(outline.R-tc.d.B/2*k) > tol {
				t.Errorf("outline r %g px, want %g", outline.R, tc.d.B/2*k)
			}
			// c_nom is the cover to the link, EN 1992-1-1:2004 4.4.1.1(2).
			if rl := (tc.d.B/2 - tc.d.Cover - tc.d.Links.Dia/2) * k; math.Abs(link.R-rl) > tol || math.Abs(link.SW-tc.d.Links.Dia*k) > tol ||
				link.CX != outline.CX || link.CY != outline.CY {
				t.Errorf("link r %g, stroke %g px at (%g, %g); want r %g, stroke %g", link.R, link.SW, link.CX, link.CY, rl, tc.d.Links.Dia*k)
			}
			if len(base.Rects) != 1 || base.Rects[0].Fill != "#ffffff" {
				t.Errorf("%d rectangles drawn, want only the background", len(base.Rects))
			}
			var bars []struct{ CX, CY, R float64 }
			for _, g := range base.Groups {
				if g.Fill == skBar {
					for _, c := range g.Circles {
						bars = append(bars, struct{ CX, CY, R float64 }{c.CX, c.CY, c.R})
					}
				}
			}
			if len(bars) != tc.d.Bars.Count {
				t.Fatalf("%d bars drawn, the design holds %d", len(bars), tc.d.Bars.Count)
			}
			rs := tc.d.B/2 - tc.d.Cover - tc.d.Links.Dia - tc.d.Bars.Dia/2 // by hand, geometry
			inner := link.R - link.SW/2                                    // the link's inner edge, px
			for n, c := range bars {
				p := tc.d.Bars.Positions[n]
				y, z := (c.CX-outline.CX)/k, (outline.CY-c.CY)/k
				if math.Abs(y-p[0]) > tol/k || math.Abs(z-p[1]) > tol/k || math.Abs(c.R-tc.d.Bars.Dia/2*k) > tol {
					t.Errorf("bar %d drawn at (%g, %g) r %g px, the design has (%g, %g), φ %g", n, y, z, c.R, p[0], p[1], tc.d.Bars.Dia)
				}
				if rho := math.Hypot(y, z); math.Abs(rho-rs) > 2*tol/k {
					t.Errorf("bar %d drawn %g mm from the centre, want %g", n, rho, rs)
				}
				if math.Hypot(c.CX-outline.CX, c.CY-outline.CY)+c.R > inner+2*tol {
					t.Errorf("bar %d reaches outside the link", n)
				}
			}
			texts := strings.Join(doc.Texts, "|")
			for _, want := range []string{"D = " + fmtNum(tc.d.B).plain(), "D = " + fmtNum(tc.d.B).plain() + " mm, scale 1:" + fmtNum(s.Scale).plain(), "c", "y", "z"} {
				if !strings.Contains("|"+texts+"|", "|"+want+"|") {
					t.Errorf("no text %q among %q", want, texts)
				}
			}
			if strings.Contains(texts, "×") || strings.Contains(svg, "<rect x=\""+coord(outline.CX-outline.R)) {
				t.Error("a circle drawn or dimensioned as a rectangle")
			}
			if got := strings.Contains(texts, "helix"); got != (tc.helix != "") || tc.helix != "" && !strings.Contains(texts, tc.helix) {
				t.Errorf("helix label in %q, want %q", texts, tc.helix)
			}
			// Every text inside the picture (a character about 0.6 of the font size wide, common
			// practice, no source).
			w, _ := s.size()
			re := regexp.MustCompile(`<text x="([0-9.]+)"[^>]*?(text-anchor="(\w+)")?[^>]*>(.*?)</text>`)
			for _, m := range re.FindAllStringSubmatch(svg, -1) {
				x, _ := strconv.ParseFloat(m[1], 64)
				plain := regexp.MustCompile(`<[^>]+>`).ReplaceAllString(m[4], "")
				wide := 0.6 * svgFont * float64(len([]rune(plain)))
				lo, hi := x, x+wide
				switch m[3] {
				case "end":
					lo, hi = x-wide, x
				case "middle":
					lo, hi = x-wide/2, x+wide/2
				}
				if strings.Contains(m[0], "font-size=\"13\"") {
					continue // the bold label above, checked by the rectangles' layout alike
				}
				if lo < 0 || hi > w {
					t.Errorf("text %q spans %g to %g px, the picture %g", plain, lo, hi, w)
				}
			}
		})
	}
}

// The cover is dimensioned and the helix labelled along a radius between two bars, never
// through one.
func TestSketchCircleGaps(t *testing.T) {
	for _, d := range []design.Design{roundCage(), helixCage(), circleDesign(400, 30, 8, 16, 6, design.LinksHelix, 60),
		circleDesign(1200, 50, 12, 32, 15, design.LinksHelix, 100)} {
		s, _ := cageSketch(d)
		for _, want := range []float64{coverAngle, helixAngle} {
			a := s.gapAngle(want)
			// Clear of every bar: the ray passes the bar's centre at more than its radius.
			for _, p := range s.Bars {
				along := p.X*math.Cos(a) + p.Y*math.Sin(a)
				off := math.Abs(-p.X*math.Sin(a) + p.Y*math.Cos(a))
				if along > 0 && off <= d.Bars.Dia/2 {
					t.Errorf("D %g: the ray at %g° passes through the bar at (%g, %g)", d.B, a*180/math.Pi, p.X, p.Y)
				}
			}
			// Midway: its angular distance to the nearest bar is half the bars' pitch.
			near := math.Inf(1)
			for _, p := range s.Bars {
				near = math.Min(near, math.Abs(math.Remainder(math.Atan2(p.Y, p.X)-a, 2*math.Pi)))
			}
			if half := math.Pi / float64(len(s.Bars)); math.Abs(near-half) > 1e-9 {
				t.Errorf("D %g: the ray at %g° lies %g° from the nearest bar, want %g°", d.B, a*180/math.Pi, near*180/math.Pi, half*180/math.Pi)
			}
		}
	}
}

// A rectangle keeps its rectangular sketch whatever its link type says, and a circle draws no
// extra ties.
func TestSketchShapeOnly(t *testing.T) {
	d := squareCage()
	d.Links.Type = design.LinksRect
	s, _ := cageSketch(d)
	want, _ := cageSketch(squareCage())
	if s.SVG() != want.SVG() || s.PGF() != want.PGF() || s.Caption() != want.Caption() {
		t.Error("the link type changed a rectangle's sketch")
	}
	c := roundCage()
	c.Detailing.ExtraTies = 2
	s, _ = cageSketch(c)
	if len(s.Ties) != 0 || strings.Contains(s.Caption(), "tie") {
		t.Errorf("a circle drawn with ties: %v, %q", s.Ties, s.Caption())
	}
}

// circleInput is two circular columns with 8 Ø20 given: D 450 with circular links, D 600 with a
// helix (invented test input).
const circleInput = `project: {title: Round sketch test, job: S-2, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C30/37, fyk: 500 MPa, aggregate: 20 mm}
columns:
  - id: R1
    shape: circle
    D: 450 mm
    cover: 35 mm
    bars: {count: 8, dia: 20 mm}
    storeys:
      - name: L1
        l0: {y: 3.5 m, z: 3.5 m}
        NEd: 2500 kN
        M: {y: {top: 80 kNm, bottom: -40 kNm}, z: {top: 30 kNm, bottom: 10 kNm}}
  - id: R2
    shape: circle
    D: 600 mm
    helix: true
    cover: 40 mm
    bars: {count: 8, dia: 20 mm}
    storeys:
      - name: L1
        l0: {y: 4.0 m, z: 4.0 m}
        NEd: 3500 kN
        M: {y: {top: 90 kNm, bottom: -40 kNm}, z: {top: 20 kNm, bottom: 10 kNm}}
`

// TestSketchCircleEngine draws circular designs of the engine: every bar on the circle of
// radius D/2 − c_nom − φt − φ/2 (geometry), the link or helix as the design names it, the sketch
// once on each sheet, and the schedule and results.json naming the shape.
func TestSketchCircleEngine(t *testing.T) {
	r := runFile(t, "", circleInput)
	for k, want := range []struct {
		d     float64
		links string
	}{{450, design.LinksCircular}, {600, design.LinksHelix}} {
		d := r.Designs[k]
		if d.Shape != model.ShapeCircle || d.B != want.d || d.H != want.d || d.Links.Type != want.links {
			t.Fatalf("%s: shape %q, %g × %g, links %q; want a circle of %g with %s links", d.Column, d.Shape, d.B, d.H, d.Links.Type, want.d, want.links)
		}
		s, ok := cageSketch(d)
		if !ok || !s.Circle || s.Helix != (want.links == design.LinksHelix) || len(s.Bars) != 8 {
			t.Fatalf("%s: sketch %v, circle %v, helix %v, %d bars", d.Column, ok, s.Circle, s.Helix, len(s.Bars))
		}
		rs := d.B/2 - d.Cover - d.Links.Dia - d.Bars.Dia/2
		for _, p := range s.Bars {
			if math.Abs(math.Hypot(p.X, p.Y)-rs) > 1e-9*rs {
				t.Errorf("%s: bar at (%g, %g), %g from the centre, want %g", d.Column, p.X, p.Y, math.Hypot(p.X, p.Y), rs)
			}
		}
		readSketch(t, s.SVG())
		kind := "circular links Ø" + fmtNum(d.Links.Dia).plain() + " @ "
		if s.Helix {
			kind = "helix Ø" + fmtNum(d.Links.Dia).plain() + ", pitch "
		}
		if !strings.HasSuffix(s.Caption(), "8 Ø20 on a circle, "+kind+fmtNum(d.Links.Spacing).plain()) {
			t.Errorf("%s: caption %q", d.Column, s.Caption())
		}
		if cells := scheduleCells(d, "", design.LiftLevel{}); plainText(cells[4]) != "Ø"+fmtNum(want.d).plain() || plainText(cells[5]) != "8 Ø20 on a circle" {
			t.Errorf("%s: schedule row starts %q, %q", d.Column, plainText(cells[4]), plainText(cells[5]))
		}
	}
	pkg, _, err := Render(r, map[string]bool{"md": true, "tex": true}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for format, picture := range map[string]string{"md": "<title>Section Ø", "tex": "\\filldraw[fill=black!8, draw=black!80, line width=0.5pt] (0,0) circle"} {
		n := 0
		for _, sh := range pkg[format] {
			if strings.Contains(sh.Name, "R1") || strings.Contains(sh.Name, "R2") {
				n++
				if c := strings.Count(string(sh.Data), picture); c != 1 {
					t.Errorf("%s: %s holds the circle's sketch %d times, want once", format, sh.Name, c)
				}
			}
		}
		if n != 2 {
			t.Errorf("%s: %d sheets of the circles", format, n)
		}
	}
	js, err := JSON(r)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []string{`"h_mm":450,"shape":"circle","D_mm":450,"cover_mm":35,`, `"h_mm":600,"shape":"circle","D_mm":600,"cover_mm":40,`,
		`"links":{"type":"circular",`, `"links":{"type":"helix",`} {
		if !strings.Contains(string(js), w) {
			t.Errorf("results.json lacks %s", w)
		}
	}
}
