package reports

import (
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/model"
)

// sketch is the cross-section of a design's cage drawn to scale from the design's data alone:
// the concrete outline, the perimeter link, the bars, the extra ties, the dimensions b and h
// (of a circle: the outline and the link or helix as circles, the diameter D), the cover and a
// label naming the bars and links. Lengths are in mm of the column; the
// drawing maps them to paper at 1:Scale. Nothing here is an engineering value: the sketch
// draws what the design holds.
type sketch struct {
	Name       string   // short stable name: "section"
	B, H       float64  // section, mm (b along y, drawn across; h along z, drawn up)
	Cover      float64  // nominal cover to the link, mm
	Link       float64  // link diameter φt, mm
	Dia        float64  // bar diameter φ, mm
	Bars       []pt     // bar centres (y, z) from the centroid, mm
	Ties       [][2]int // the bars (indices into Bars) that each extra tie holds
	TieCount   int      // extra ties of the design, drawn or not
	Indicative bool     // the ties are placed by the sketch from their count alone
	Label      string   // "8 Ø20, links Ø8"
	Scale      float64  // the drawing scale is 1:Scale
	Circle     bool     // a circular section of diameter B = H, bars on a circle
	Helix      bool     // a circle's transverse bar is a helix
	Spacing    float64  // the link spacing, or the helix's pitch, mm
	Left       float64  // SVG: px from the left edge to the section where not skLeft (room for the helix's label)
}

// sketchScales are the drawing scales the sketch chooses from, largest first (common practice,
// no source: the scales of a drawing office).
var sketchScales = []float64{5, 10, 20, 25, 50, 100, 200, 500}

// sketchPaper is the greatest extent of the section on paper, mm.
const sketchPaper = 80.0

// sketchScale returns the largest scale of sketchScales at which the larger side of the section
// spans at most sketchPaper on paper.
func sketchScale(b, h float64) float64 {
	for _, s := range sketchScales {
		if math.Max(b, h)/s <= sketchPaper {
			return s
		}
	}
	return sketchScales[len(sketchScales)-1]
}

// tieStepRE matches the trace steps that place a bar held by an extra tie: its distance from the
// corner bar along a b-face or an h-face (calc/detail RestraintSteps).
var tieStepRE = regexp.MustCompile(`(?:^|/)ties/([bh])/tie\d+$`)

// cageSketch returns the section sketch of a design, or false when the design holds no bars to
// draw (or no section).
func cageSketch(d design.Design) (sketch, bool) {
	if !(d.B > 0 && d.H > 0) || len(d.Bars.Positions) == 0 || !(d.Bars.Dia > 0) {
		return sketch{}, false
	}
	s := sketch{Name: "section", B: d.B, H: d.H, Cover: d.Cover, Link: d.Links.Dia, Dia: d.Bars.Dia,
		TieCount: d.Detailing.ExtraTies, Scale: sketchScale(d.B, d.H)}
	if d.Shape == model.ShapeCircle {
		// Circular links or a helix hold every bar: no extra ties to draw.
		s.Circle, s.Helix, s.Spacing, s.TieCount = true, d.Links.Type == design.LinksHelix, d.Links.Spacing, 0
	}
	for _, p := range d.Bars.Positions {
		if q := (pt{p[0], p[1]}); finitePt(q) {
			s.Bars = append(s.Bars, q)
		}
	}
	if len(s.Bars) == 0 {
		return sketch{}, false
	}
	if s.Helix && s.Link > 0 {
		s.Left = s.helixLeft()
	}
	s.Label = barsText(d)
	switch {
	case s.Link > 0 && s.Helix:
		s.Label += ", helix Ø" + fmtNum(s.Link).plain()
	case s.Link > 0 && s.Circle:
		s.Label += ", circular links Ø" + fmtNum(s.Link).plain()
	case s.Link > 0:
		s.Label += ", links Ø" + fmtNum(s.Link).plain()
	}
	if s.TieCount > 0 {
		var at []tieAt
		for _, st := range d.Steps {
			if m := tieStepRE.FindStringSubmatch(st.ID); m != nil {
				at = append(at, tieAt{alongB: m[1] == "b", a: st.Value})
			}
		}
		if ties, ok := s.tiesAt(at); ok && len(ties) == s.TieCount {
			s.Ties = ties
		} else {
			s.Ties, s.Indicative = s.tiesFromCount(), true
		}
	}
	return s, true
}

// tieAt is where the design places a bar held by an extra tie: a the distance from the corner
// bar (least y or least z) along a b-face (alongB) or an h-face.
type tieAt struct {
	alongB bool
	a      float64
}

// faces holds the bars of each face of the sketch, by index into Bars: the b-faces (least and
// greatest z) ordered by y, the h-faces (least and greatest y) ordered by z.
type faces struct {
	bottom, top, left, right []int
	y0, z0                   float64 // the least y and the least z of the bars
}

// faces sorts the bars onto the faces of the section.
func (s sketch) faces() faces {
	f := faces{y0: math.Inf(1), z0: math.Inf(1)}
	y1, z1 := math.Inf(-1), math.Inf(-1)
	for _, p := range s.Bars {
		f.y0, y1 = math.Min(f.y0, p.X), math.Max(y1, p.X)
		f.z0, z1 = math.Min(f.z0, p.Y), math.Max(z1, p.Y)
	}
	tol := 1e-6 * math.Max(s.B, s.H)
	for i, p := range s.Bars {
		if math.Abs(p.Y-f.z0) <= tol {
			f.bottom = append(f.bottom, i)
		}
		if math.Abs(p.Y-z1) <= tol {
			f.top = append(f.top, i)
		}
		if math.Abs(p.X-f.y0) <= tol {
			f.left = append(f.left, i)
		}
		if math.Abs(p.X-y1) <= tol {
			f.right = append(f.right, i)
		}
	}
	byY := func(is []int) { sort.SliceStable(is, func(a, b int) bool { return s.Bars[is[a]].X < s.Bars[is[b]].X }) }
	byZ := func(is []int) { sort.SliceStable(is, func(a, b int) bool { return s.Bars[is[a]].Y < s.Bars[is[b]].Y }) }
	byY(f.bottom)
	byY(f.top)
	byZ(f.left)
	byZ(f.right)
	return f
}

// opposite returns the bar of face to that lies across from bar i (the same y for the b-faces,
// the same z for the h-faces), or −1.
func (s sketch) opposite(i int, to []int, alongB bool) int {
	tol := 1e-6 * math.Max(s.B, s.H)
	for _, j := range to {
		if alongB && math.Abs(s.Bars[j].X-s.Bars[i].X) <= tol || !alongB && math.Abs(s.Bars[j].Y-s.Bars[i].Y) <= tol {
			return j
		}
	}
	return -1
}

// tiesAt returns the pairs of opposite bars that the design's tie positions name, or false when a
// position matches no intermediate bar with an opposite one.
func (s sketch) tiesAt(at []tieAt) ([][2]int, bool) {
	if len(at) == 0 {
		return nil, false
	}
	f := s.faces()
	tol := 1e-6*math.Max(s.B, s.H) + 1e-9
	var out [][2]int
	for _, t := range at {
		from, to, base := f.bottom, f.top, f.y0
		if !t.alongB {
			from, to, base = f.left, f.right, f.z0
		}
		found := false
		for k, i := range from {
			c := s.Bars[i].X
			if !t.alongB {
				c = s.Bars[i].Y
			}
			if k == 0 || k == len(from)-1 || math.Abs(c-base-t.a) > tol {
				continue
			}
			if j := s.opposite(i, to, t.alongB); j >= 0 {
				out = append(out, [2]int{i, j})
				found = true
			}
			break
		}
		if !found {
			return nil, false
		}
	}
	return out, true
}

// tiesFromCount places the design's count of extra ties where only the count is known: on the
// intermediate bars of the longer faces nearest their middle, symmetrically as far as the
// count allows, then on those of the shorter faces.
func (s sketch) tiesFromCount() [][2]int {
	f := s.faces()
	type face struct {
		from, to []int
		alongB   bool
	}
	b := face{f.bottom, f.top, true}
	h := face{f.left, f.right, false}
	order := []face{b, h}
	if s.H > s.B {
		order = []face{h, b}
	}
	var out [][2]int
	for _, fc := range order {
		if len(fc.from) < 3 {
			continue
		}
		mid := fc.from[1 : len(fc.from)-1]
		// The intermediate bars from the middle outwards, alternating sides.
		var pick []int
		for lo, hi := (len(mid)-1)/2, len(mid)/2; lo >= 0; lo, hi = lo-1, hi+1 {
			pick = append(pick, mid[lo])
			if hi != lo {
				pick = append(pick, mid[hi])
			}
		}
		for _, i := range pick {
			if len(out) == s.TieCount {
				return out
			}
			if j := s.opposite(i, fc.to, fc.alongB); j >= 0 {
				out = append(out, [2]int{i, j})
			}
		}
	}
	return out
}

// bendRadius returns the inner bend radius of the link at the corners as drawn: about 2φt
// (a mandrel of 4φt, EN 1992-1-1:2004 Table 8.1N for φ ≤ 16 mm, from memory), but not more
// than the corner bar's radius, since the design places the corner bars against both legs of
// the link and the drawing keeps them there.
func (s sketch) bendRadius() float64 { return math.Min(2*s.Link, s.Dia/2) }

// Caption returns a plain-text caption of the sketch, naming its scale.
func (s sketch) Caption() string {
	if s.Circle {
		return "Section of the cage to scale 1:" + fmtNum(s.Scale).plain() + ", dimensions in mm: " + s.circleText()
	}
	c := "Section of the cage to scale 1:" + fmtNum(s.Scale).plain() + ", dimensions in mm: " + s.Label
	switch {
	case s.TieCount == 1:
		c += ", 1 extra tie"
	case s.TieCount > 1:
		c += ", " + strconv.Itoa(s.TieCount) + " extra ties"
	}
	if s.TieCount > 0 && len(s.Ties) < s.TieCount {
		c += " (" + strconv.Itoa(len(s.Ties)) + " drawn: no other pair of opposite intermediate bars)"
	}
	if s.Indicative && len(s.Ties) > 0 {
		c += "; ties as counted; their positions as drawn are indicative"
	}
	return c
}

// linkLine returns the link's centreline as drawn, a rounded rectangle inset from the faces by
// the cover plus half the link: its half-widths along y and z and its corner radius, mm.
func (s sketch) linkLine() (halfY, halfZ, radius float64) {
	in := s.Cover + s.Link/2
	return s.B/2 - in, s.H/2 - in, s.bendRadius() + s.Link/2
}

// ---- SVG ----

// Layout of the SVG sketch, in px.
const (
	skLeft    = 56 // from the left edge to the section
	skRight   = 88 // from the section to the right edge
	skTop     = 40 // from the top edge to the section
	skBottom  = 44 // from the section to the bottom edge
	skPxPerMm = 96 / 25.4
	skBar     = "#b03a2e" // bars
	skSteel   = "#1f5f8b" // links and ties
	skLine    = "#333333" // outline, dimensions and text
	skCentre  = "#7a7a7a" // centre lines
)

// left returns the px from the left edge of the SVG sketch to the section.
func (s sketch) left() float64 {
	if s.Left > 0 {
		return s.Left
	}
	return skLeft
}

// k returns the px per mm of the column.
func (s sketch) k() float64 { return skPxPerMm / s.Scale }

// size returns the width and height of the SVG sketch in px.
func (s sketch) size() (w, h float64) {
	return s.left() + s.B*s.k() + skRight, skTop + s.H*s.k() + skBottom
}

// px maps a point (y, z) of the section, mm from the centroid, to SVG pixels.
func (s sketch) px(p pt) (x, y float64) {
	k := s.k()
	return s.left() + (p.X+s.B/2)*k, skTop + (s.H/2-p.Y)*k
}

// frame returns the corners of the section's outline (upper left x0, y0; lower right x1, y1) and
// its centre (cx, cy) in SVG pixels.
func (s sketch) frame() (x0, y0, x1, y1, cx, cy float64) {
	x0, y0 = s.px(pt{-s.B / 2, s.H / 2})
	x1, y1 = s.px(pt{s.B / 2, -s.H / 2})
	cx, cy = s.px(pt{0, 0})
	return
}

// svgOpen writes the start of the SVG sketch: the element, its title (what, then the label and
// scale), the white ground and the label above the section.
func (s sketch) svgOpen(b *strings.Builder, what string) {
	f := coord
	w, h := s.size()
	_, _, _, _, cx, _ := s.frame()
	b.WriteString(`<svg xmlns="http://www.w3.org/2000/svg" width="` + f(w) + `" height="` + f(h) + `" viewBox="0 0 ` + f(w) + " " + f(h) +
		`" role="img" font-family="sans-serif" font-size="` + strconv.Itoa(svgFont) + `">` + "\n")
	b.WriteString("<title>" + xmlText(what+", "+s.Label+", scale 1:"+fmtNum(s.Scale).plain()) + "</title>\n")
	b.WriteString(`<rect x="0" y="0" width="` + f(w) + `" height="` + f(h) + `" fill="#ffffff"/>` + "\n")
	b.WriteString(`<text x="` + f(cx) + `" y="20" text-anchor="middle" font-size="13" font-weight="bold">` + xmlText(s.Label) + "</text>\n")
}

// svgAxes writes the centre lines of the SVG sketch with the axes' names.
func (s sketch) svgAxes(b *strings.Builder) {
	f := coord
	x0, y0, x1, y1, cx, cy := s.frame()
	b.WriteString(`<g stroke="` + skCentre + `" stroke-width="0.8" stroke-dasharray="8 2 2 2">` + "\n")
	b.WriteString(`<line x1="` + f(x0-8) + `" y1="` + f(cy) + `" x2="` + f(x1+10) + `" y2="` + f(cy) + `"/>` + "\n")
	b.WriteString(`<line x1="` + f(cx) + `" y1="` + f(y1+8) + `" x2="` + f(cx) + `" y2="` + f(y0-10) + `"/>` + "\n")
	b.WriteString("</g>\n")
	b.WriteString(`<g fill="` + skCentre + `" font-style="italic">` + "\n")
	b.WriteString(`<text x="` + f(x1+12) + `" y="` + f(cy+4) + `">y</text>` + "\n")
	b.WriteString(`<text x="` + f(cx+4) + `" y="` + f(y0-6) + `">z</text>` + "\n")
	b.WriteString("</g>\n")
}

// svgBars writes the bars of the SVG sketch at their sizes.
func (s sketch) svgBars(b *strings.Builder) {
	f := coord
	b.WriteString(`<g fill="` + skBar + `">` + "\n")
	for _, p := range s.Bars {
		x, y := s.px(p)
		b.WriteString(`<circle cx="` + f(x) + `" cy="` + f(y) + `" r="` + f(s.Dia/2*s.k()) + `"/>` + "\n")
	}
	b.WriteString("</g>\n")
}

// SVG returns the sketch as a self-contained inline <svg> element.
func (s sketch) SVG() string {
	if s.Circle {
		return s.circleSVG()
	}
	var b strings.Builder
	f := coord
	k := s.k()
	x0, y0, x1, y1, cx, cy := s.frame()
	s.svgOpen(&b, "Section "+fmtNum(s.B).plain()+" × "+fmtNum(s.H).plain())
	// Concrete.
	b.WriteString(`<rect x="` + f(x0) + `" y="` + f(y0) + `" width="` + f(x1-x0) + `" height="` + f(y1-y0) +
		`" fill="#ececec" stroke="` + skLine + `" stroke-width="1.2"/>` + "\n")
	s.svgAxes(&b)
	// The link, on its centreline, as thick as it is.
	if s.Link > 0 {
		hy, hz, r := s.linkLine()
		lx, ly := s.px(pt{-hy, hz})
		b.WriteString(`<rect x="` + f(lx) + `" y="` + f(ly) + `" width="` + f(2*hy*k) + `" height="` + f(2*hz*k) + `" rx="` + f(r*k) + `" ry="` + f(r*k) +
			`" fill="none" stroke="` + skSteel + `" stroke-width="` + f(s.Link*k) + `"/>` + "\n")
	}
	// Extra ties: each along the side of the bars it holds, from the link on one face to the link
	// on the other.
	if len(s.Ties) > 0 {
		b.WriteString(`<g stroke="` + skSteel + `" stroke-width="` + f(math.Max(s.Link, 1)*k) + `">` + "\n")
		for _, t := range s.Ties {
			a, c := s.tieLine(t)
			ax, ay := s.px(a)
			bx, by := s.px(c)
			b.WriteString(`<line x1="` + f(ax) + `" y1="` + f(ay) + `" x2="` + f(bx) + `" y2="` + f(by) + `"/>` + "\n")
		}
		b.WriteString("</g>\n")
	}
	s.svgBars(&b)
	// Dimensions: b below, h to the left, the cover at the right.
	b.WriteString(`<g stroke="` + skLine + `" stroke-width="0.8">` + "\n")
	line := func(xa, ya, xb, yb float64) {
		b.WriteString(`<line x1="` + f(xa) + `" y1="` + f(ya) + `" x2="` + f(xb) + `" y2="` + f(yb) + `"/>` + "\n")
	}
	tick := func(x, y float64) { line(x-3, y+3, x+3, y-3) }
	db := y1 + 22
	line(x0, y1+4, x0, db+4)
	line(x1, y1+4, x1, db+4)
	line(x0-4, db, x1+4, db)
	tick(x0, db)
	tick(x1, db)
	dh := x0 - 22
	line(x0-4, y0, dh-4, y0)
	line(x0-4, y1, dh-4, y1)
	line(dh, y0-4, dh, y1+4)
	tick(dh, y0)
	tick(dh, y1)
	cz, hasCover := s.coverAt()
	var cvy float64
	if hasCover && s.Cover > 0 {
		_, cvy = s.px(pt{0, cz})
		xc := x1 - s.Cover*k
		line(xc-4, cvy, x1+18, cvy)
		tick(xc, cvy)
		tick(x1, cvy)
	}
	b.WriteString("</g>\n")
	b.WriteString(`<g fill="` + skLine + `">` + "\n")
	b.WriteString(`<text x="` + f(cx) + `" y="` + f(db-4) + `" text-anchor="middle">` + xmlText(fmtNum(s.B).plain()) + "</text>\n")
	b.WriteString(`<text x="` + f(dh-4) + `" y="` + f(cy) + `" text-anchor="middle" transform="rotate(-90 ` + f(dh-4) + " " + f(cy) + `)">` +
		xmlText(fmtNum(s.H).plain()) + "</text>\n")
	if hasCover && s.Cover > 0 {
		b.WriteString(`<text x="` + f(x1+21) + `" y="` + f(cvy+4) + `">` + svgLabel("c_nom = "+fmtNum(s.Cover).plain()) + "</text>\n")
	}
	b.WriteString(`<text x="` + f(cx) + `" y="` + f(db+16) + `" text-anchor="middle" fill="` + skCentre + `">` +
		xmlText("b × h = "+fmtNum(s.B).plain()+" × "+fmtNum(s.H).plain()+" mm, scale 1:"+fmtNum(s.Scale).plain()) + "</text>\n")
	b.WriteString("</g>\n")
	b.WriteString("</svg>\n")
	return b.String()
}

// coverAt returns the z at which the cover is dimensioned on the right face, clear of the bars
// and of the centre line: midway between the top bar of that face and the bar below it, or
// between the top bar and the centre line where the face holds only its corner bars; false
// when the face holds fewer than two bars.
func (s sketch) coverAt() (float64, bool) {
	r := s.faces().right
	if len(r) < 2 {
		return 0, false
	}
	top := s.Bars[r[len(r)-1]].Y
	if len(r) == 2 {
		return top / 2, true
	}
	return (top + s.Bars[r[len(r)-2]].Y) / 2, true
}

// tieLine returns the ends of an extra tie holding the bars t: along the side of the bars
// (the side towards the centroid), from the link's centreline on one face to that on the other.
func (s sketch) tieLine(t [2]int) (a, c pt) {
	p, q := s.Bars[t[0]], s.Bars[t[1]]
	off := s.Dia/2 + math.Max(s.Link, 1)/2
	hy, hz, _ := s.linkLine()
	if math.Abs(p.X-q.X) < math.Abs(p.Y-q.Y) { // across h, at the bars' y
		y := p.X - math.Copysign(off, p.X)
		if p.X == 0 {
			y = p.X + off
		}
		return pt{y, -hz}, pt{y, hz}
	}
	z := p.Y - math.Copysign(off, p.Y)
	if p.Y == 0 {
		z = p.Y + off
	}
	return pt{-hy, z}, pt{hy, z}
}

// ---- TikZ ----

// Colours of the TikZ sketch: links and ties, bars (those of the SVG).
const (
	pgfSteel = "{rgb,255:red,31;green,95;blue,139}"
	pgfBar   = "{rgb,255:red,176;green,58;blue,46}"
)

// at writes a point of the section (mm of the column from the centroid) moved by (dx, dy) mm on
// paper, as a TikZ coordinate.
func (s sketch) at(p pt, dx, dy float64) string {
	return "(" + coord(p.X/s.Scale+dx) + "," + coord(p.Y/s.Scale+dy) + ")"
}

// pgfOpen writes the start of the tikzpicture: the label above the section, the concrete
// outline (the TikZ path given) and the centre lines with the axes' names.
func (s sketch) pgfOpen(b *strings.Builder, outline string) {
	at := s.at
	hb, hh := s.B/2, s.H/2
	b.WriteString("\\begin{tikzpicture}[x=1mm, y=1mm, font=\\footnotesize]\n")
	b.WriteString("\\node[anchor=south, font=\\small\\bfseries] at " + at(pt{0, hh}, 0, 6) + " {" + tex{}.text(s.Label) + "};\n")
	b.WriteString("\\filldraw[fill=black!8, draw=black!80, line width=0.5pt] " + outline + ";\n")
	b.WriteString("\\draw[black!55, line width=0.3pt, dash dot] " + at(pt{-hb, 0}, -2, 0) + " -- " + at(pt{hb, 0}, 2.5, 0) +
		" node[right, font=\\footnotesize\\itshape] {y};\n")
	b.WriteString("\\draw[black!55, line width=0.3pt, dash dot] " + at(pt{0, -hh}, 0, -2) + " -- " + at(pt{0, hh}, 0, 2.5) +
		" node[above, font=\\footnotesize\\itshape] {z};\n")
}

// pgfBars writes the bars of the tikzpicture at their sizes.
func (s sketch) pgfBars(b *strings.Builder) {
	for _, p := range s.Bars {
		b.WriteString("\\fill[fill=" + pgfBar + "] " + s.at(p, 0, 0) + " circle[radius=" + coord(s.Dia/2/s.Scale) + "];\n")
	}
}

// PGF returns the sketch as a tikzpicture drawn to scale (1 unit = 1 mm on paper); it needs
// TikZ (loaded by pgfplots) and xcolor.
func (s sketch) PGF() string {
	if s.Circle {
		return s.circlePGF()
	}
	var b strings.Builder
	var t tex
	f := coord
	at := s.at
	mm := func(v float64) string { return f(v/s.Scale) + "mm" }
	hb, hh := s.B/2, s.H/2
	ll, lr, ul := pt{-hb, -hh}, pt{hb, -hh}, pt{-hb, hh}
	s.pgfOpen(&b, at(ll, 0, 0)+" rectangle "+at(pt{hb, hh}, 0, 0))
	if s.Link > 0 {
		hy, hz, r := s.linkLine()
		b.WriteString("\\draw[draw=" + pgfSteel + ", line width=" + mm(s.Link) + ", rounded corners=" + mm(r) + "] " +
			at(pt{-hy, -hz}, 0, 0) + " rectangle " + at(pt{hy, hz}, 0, 0) + ";\n")
	}
	for _, tie := range s.Ties {
		a, c := s.tieLine(tie)
		b.WriteString("\\draw[draw=" + pgfSteel + ", line width=" + mm(math.Max(s.Link, 1)) + "] " + at(a, 0, 0) + " -- " + at(c, 0, 0) + ";\n")
	}
	s.pgfBars(&b)
	b.WriteString("\\begin{scope}[black!80, line width=0.3pt]\n")
	// b below the section, h to its left: extension lines and the dimension line.
	b.WriteString("\\draw " + at(ll, 0, -1) + " -- " + at(ll, 0, -7) + " " + at(lr, 0, -1) + " -- " + at(lr, 0, -7) + ";\n")
	b.WriteString("\\draw[<->, >=latex] " + at(ll, 0, -6) + " -- node[below] {" + t.text(fmtNum(s.B).plain()) + "} " + at(lr, 0, -6) + ";\n")
	b.WriteString("\\draw " + at(ll, -1, 0) + " -- " + at(ll, -7, 0) + " " + at(ul, -1, 0) + " -- " + at(ul, -7, 0) + ";\n")
	b.WriteString("\\draw[<->, >=latex] " + at(ll, -6, 0) + " -- node[above, rotate=90] {" + t.text(fmtNum(s.H).plain()) + "} " + at(ul, -6, 0) + ";\n")
	if cz, ok := s.coverAt(); ok && s.Cover > 0 {
		face, link := pt{hb, cz}, pt{hb - s.Cover, cz}
		b.WriteString("\\draw " + at(link, -1, 0) + " -- " + at(face, 4, 0) + " node[right] {" + t.sym("c_nom") + " = " +
			t.text(fmtNum(s.Cover).plain()) + "};\n")
		b.WriteString("\\draw " + at(link, -0.6, -0.6) + " -- " + at(link, 0.6, 0.6) + " " + at(face, -0.6, -0.6) + " -- " + at(face, 0.6, 0.6) + ";\n")
	}
	b.WriteString("\\end{scope}\n")
	b.WriteString("\\end{tikzpicture}\n")
	return b.String()
}

// ---- Circular sections ----

// circleText names the bars and the transverse bar of a circular section for the caption:
// "8 Ø20 on a circle, circular links Ø8 @ 300" or "…, helix Ø8, pitch 75".
func (s sketch) circleText() string {
	c := strings.TrimSuffix(s.Label, s.linkText()) + " on a circle"
	if s.Link > 0 {
		c += s.linkText()
		if s.Spacing > 0 && s.Helix {
			c += ", pitch " + fmtNum(s.Spacing).plain()
		} else if s.Spacing > 0 {
			c += " @ " + fmtNum(s.Spacing).plain()
		}
	}
	return c
}

// linkText is the part of the label that names a circle's links: ", circular links Ø8" or ", helix Ø8".
func (s sketch) linkText() string {
	switch {
	case s.Link > 0 && s.Helix:
		return ", helix Ø" + fmtNum(s.Link).plain()
	case s.Link > 0:
		return ", circular links Ø" + fmtNum(s.Link).plain()
	}
	return ""
}

// helixLabel is the label of a helix drawn beside it: "helix, pitch 75".
func (s sketch) helixLabel() string {
	if s.Spacing > 0 {
		return "helix, pitch " + fmtNum(s.Spacing).plain()
	}
	return "helix"
}

// Angles (radians, from the y axis towards z) near which the circle's cover is dimensioned and
// the helix is labelled: upper right and upper left, clear of the axes' names.
var (
	coverAngle = 40 * math.Pi / 180
	helixAngle = 140 * math.Pi / 180
)

// gapAngle returns the direction from the centre, radians, midway between two neighbouring bars
// of a circle, the midway direction nearest to want, so that a dimension or a leader drawn
// along it passes between the bars.
func (s sketch) gapAngle(want float64) float64 {
	var a []float64
	for _, p := range s.Bars {
		if p.X != 0 || p.Y != 0 {
			a = append(a, math.Atan2(p.Y, p.X))
		}
	}
	if len(a) == 0 {
		return want
	}
	sort.Float64s(a)
	best, dist := want, math.Inf(1)
	for i, x := range a {
		next := a[0] + 2*math.Pi
		if i+1 < len(a) {
			next = a[i+1]
		}
		mid := (x + next) / 2
		d := math.Abs(math.Remainder(mid-want, 2*math.Pi))
		if d < dist {
			best, dist = math.Remainder(mid, 2*math.Pi), d
		}
	}
	return best
}

// Layout of the helix's label in the SVG sketch, px: the leader runs out past the face by
// skLeader, then level by skShoulder; text is about skCharW wide a character.
const (
	skLeader   = 14
	skShoulder = 8
	skCharW    = 0.6 * svgFont
)

// helixLeft returns the left margin of the SVG sketch of a circle that leaves room for the
// helix's label, px.
func (s sketch) helixLeft() float64 {
	r := s.B / 2 * s.k()
	c := math.Cos(s.gapAngle(helixAngle))
	if c >= 0 {
		return skLeft
	}
	need := 4 + skShoulder + 3 + skCharW*float64(len([]rune(s.helixLabel()))) - r - c*(r+skLeader)
	return math.Max(skLeft, math.Ceil(need))
}

// circleSVG returns the sketch of a circular section as a self-contained inline <svg> element:
// the outline, the link or helix as a circle on its centreline, the bars, the diameter below,
// the cover along a radius between the bars and, for a helix, a label with its pitch.
func (s sketch) circleSVG() string {
	var b strings.Builder
	f := coord
	k := s.k()
	r := s.B / 2
	x0, _, x1, y1, cx, cy := s.frame()
	s.svgOpen(&b, "Section Ø"+fmtNum(s.B).plain())
	circle := func(rad float64, attrs string) {
		b.WriteString(`<circle cx="` + f(cx) + `" cy="` + f(cy) + `" r="` + f(rad*k) + `" ` + attrs + "/>\n")
	}
	// Concrete.
	circle(r, `fill="#ececec" stroke="`+skLine+`" stroke-width="1.2"`)
	s.svgAxes(&b)
	// The link or helix, on its centreline, as thick as it is.
	rl := r - s.Cover - s.Link/2
	if s.Link > 0 {
		circle(rl, `fill="none" stroke="`+skSteel+`" stroke-width="`+f(s.Link*k)+`"`)
	}
	s.svgBars(&b)
	// Dimensions: D below, the cover along a radius to the upper right; the helix's leader.
	b.WriteString(`<g stroke="` + skLine + `" stroke-width="0.8">` + "\n")
	line := func(xa, ya, xb, yb float64) {
		b.WriteString(`<line x1="` + f(xa) + `" y1="` + f(ya) + `" x2="` + f(xb) + `" y2="` + f(yb) + `"/>` + "\n")
	}
	// slash draws a tick at (x, y) across a dimension line in the direction th (screen y down).
	slash := func(x, y, th float64) {
		dx, dy := 3*math.Sqrt2*math.Cos(th+math.Pi/4), -3*math.Sqrt2*math.Sin(th+math.Pi/4)
		line(x-dx, y-dy, x+dx, y+dy)
	}
	// along returns the point at rad px from the centre in the direction th.
	along := func(rad, th float64) (float64, float64) { return cx + rad*math.Cos(th), cy - rad*math.Sin(th) }
	db := y1 + 22
	line(x0, cy+4, x0, db+4)
	line(x1, cy+4, x1, db+4)
	line(x0-4, db, x1+4, db)
	slash(x0, db, 0)
	slash(x1, db, 0)
	tc := s.gapAngle(coverAngle)
	var cex, cey float64
	if s.Cover > 0 {
		ax, ay := along((r-s.Cover)*k-4, tc)
		cex, cey = along(r*k+skLeader, tc)
		line(ax, ay, cex, cey)
		px, py := along((r-s.Cover)*k, tc)
		slash(px, py, tc)
		px, py = along(r*k, tc)
		slash(px, py, tc)
	}
	th := s.gapAngle(helixAngle)
	var hx, hy float64
	left := math.Cos(th) < 0
	if s.Helix && s.Link > 0 {
		ax, ay := along(rl*k, th)
		ex, ey := along(r*k+skLeader, th)
		hx, hy = ex+skShoulder, ey
		if left {
			hx = ex - skShoulder
		}
		line(ax, ay, ex, ey)
		line(ex, ey, hx, hy)
	}
	b.WriteString("</g>\n")
	b.WriteString(`<g fill="` + skLine + `">` + "\n")
	b.WriteString(`<text x="` + f(cx) + `" y="` + f(db-4) + `" text-anchor="middle">` + xmlText("D = "+fmtNum(s.B).plain()) + "</text>\n")
	if s.Cover > 0 {
		b.WriteString(`<text x="` + f(cex+3) + `" y="` + f(cey+4) + `">` + svgLabel("c_nom = "+fmtNum(s.Cover).plain()) + "</text>\n")
	}
	if s.Helix && s.Link > 0 {
		if left {
			b.WriteString(`<text x="` + f(hx-3) + `" y="` + f(hy+4) + `" text-anchor="end">` + xmlText(s.helixLabel()) + "</text>\n")
		} else {
			b.WriteString(`<text x="` + f(hx+3) + `" y="` + f(hy+4) + `">` + xmlText(s.helixLabel()) + "</text>\n")
		}
	}
	b.WriteString(`<text x="` + f(cx) + `" y="` + f(db+16) + `" text-anchor="middle" fill="` + skCentre + `">` +
		xmlText("D = "+fmtNum(s.B).plain()+" mm, scale 1:"+fmtNum(s.Scale).plain()) + "</text>\n")
	b.WriteString("</g>\n")
	b.WriteString("</svg>\n")
	return b.String()
}

// circlePGF returns the sketch of a circular section as a tikzpicture drawn to scale (1 unit =
// 1 mm on paper), with what circleSVG draws.
func (s sketch) circlePGF() string {
	var b strings.Builder
	var t tex
	f := coord
	at := s.at
	// ray returns the point at rad mm of the column from the centre in the direction th, moved
	// by d mm on paper along it.
	ray := func(rad, th, d float64) string {
		return at(pt{rad * math.Cos(th), rad * math.Sin(th)}, d*math.Cos(th), d*math.Sin(th))
	}
	// slash returns a tick across a dimension line in the direction th at the point rad.
	slash := func(rad, th float64) string {
		c := pt{rad * math.Cos(th), rad * math.Sin(th)}
		dx, dy := 0.6*math.Sqrt2*math.Cos(th+math.Pi/4), 0.6*math.Sqrt2*math.Sin(th+math.Pi/4)
		return at(c, -dx, -dy) + " -- " + at(c, dx, dy)
	}
	mm := func(v float64) string { return f(v/s.Scale) + "mm" }
	r := s.B / 2
	o := pt{0, 0}
	s.pgfOpen(&b, at(o, 0, 0)+" circle[radius="+f(r/s.Scale)+"]")
	rl := r - s.Cover - s.Link/2
	if s.Link > 0 {
		b.WriteString("\\draw[draw=" + pgfSteel + ", line width=" + mm(s.Link) + "] " + at(o, 0, 0) + " circle[radius=" + f(rl/s.Scale) + "];\n")
	}
	s.pgfBars(&b)
	b.WriteString("\\begin{scope}[black!80, line width=0.3pt]\n")
	// D below the section: extension lines from the ends of the horizontal diameter.
	b.WriteString("\\draw " + at(pt{-r, 0}, 0, -1) + " -- " + at(pt{-r, -r}, 0, -7) + " " + at(pt{r, 0}, 0, -1) + " -- " + at(pt{r, -r}, 0, -7) + ";\n")
	b.WriteString("\\draw[<->, >=latex] " + at(pt{-r, -r}, 0, -6) + " -- node[below] {" + t.text("D = "+fmtNum(s.B).plain()) + "} " + at(pt{r, -r}, 0, -6) + ";\n")
	if s.Cover > 0 {
		tc := s.gapAngle(coverAngle)
		b.WriteString("\\draw " + ray(r-s.Cover, tc, -1) + " -- " + ray(r, tc, 4) + " node[right] {" + t.sym("c_nom") + " = " +
			t.text(fmtNum(s.Cover).plain()) + "};\n")
		b.WriteString("\\draw " + slash(r-s.Cover, tc) + " " + slash(r, tc) + ";\n")
	}
	if s.Helix && s.Link > 0 {
		th := s.gapAngle(helixAngle)
		side, dx := "left", -2.0
		if math.Cos(th) >= 0 {
			side, dx = "right", 2
		}
		end := pt{r * math.Cos(th), r * math.Sin(th)}
		ex, ey := 4*math.Cos(th), 4*math.Sin(th)
		b.WriteString("\\draw " + ray(rl, th, 0) + " -- " + at(end, ex, ey) + " -- " + at(end, ex+dx, ey) + " node[" + side + "] {" +
			t.text(s.helixLabel()) + "};\n")
	}
	b.WriteString("\\end{scope}\n")
	b.WriteString("\\end{tikzpicture}\n")
	return b.String()
}
