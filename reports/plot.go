package reports

import (
	"encoding/xml"
	"math"
	"strconv"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/calc/section"
)

// diagram is one interaction picture of a design in display units, ready to draw as SVG or pgfplots.
type diagram struct {
	Name         string    // short stable name: "nm-y", "nm-z" or "mymz"
	Title        string    // heading drawn above the plot; symbols written like "N_Ed"
	XSym, YSym   string    // quantity on each axis, e.g. "M_y" and "N"
	XUnit, YUnit string    // display unit of each axis, e.g. "kNm" and "kN"
	X, Y         axisRange // axis extents and tick step
	Curves       []curve   // polylines, drawn in order
	Marks        []mark    // marked points, drawn above the curves
	caption      string    // plain-text caption
}

// axisRange is the extent of one axis with its tick step.
type axisRange struct{ Min, Max, Step float64 }

// pt is a point in display units.
type pt struct{ X, Y float64 }

// curve is one polyline of a diagram with its legend text.
type curve struct {
	Legend string
	Points []pt
	Dashed bool
}

// mark is one marked point of a diagram with its legend text and the tag written beside it.
type mark struct {
	Legend string // legend text, e.g. "design point"
	Tag    string // label beside the point naming its coordinates in the axes' order, e.g. "M_Ed,y, N_Ed"
	At     pt
	Hollow bool // an open circle (a resistance) rather than a filled one (an action)
	Below  bool // place the tag below the point rather than above
}

// diagrams returns the pictures of a design: the N–M interaction about y and about z with the
// design point and the resistance at NEd, and the My–Mz contour at NEd with the design moments
// and, when found, the exact resistance along their resultant. It returns nil when the design
// has no interaction data. Values are only converted to display units, never computed.
func diagrams(d design.Design) []diagram {
	if d.Interaction == nil {
		return nil
	}
	fN, uN := DisplayUnit("N")
	fM, uM := DisplayUnit("Nmm")
	var out []diagram
	type nmAxis struct {
		name, axis string
		curve      []section.NMPoint
		a          design.Axis
	}
	axes := []nmAxis{{"nm-y", "y", d.Interaction.NMY, d.Y}, {"nm-z", "z", d.Interaction.NMZ, d.Z}}
	if d.Shape == model.ShapeCircle {
		// A circle: one diagram in the direction of least resistance, with the resultant design
		// moment and the least resistance (the engine's values).
		res := d.Y
		res.MEd = d.Biaxial.Resultant
		axes = []nmAxis{{"nm", "", d.Interaction.NMY, res}}
	}
	for _, ax := range axes {
		var pts []pt
		for _, p := range ax.curve { // positive face compressed, N rising
			pts = appendFinite(pts, p.M*fM, p.N*fN)
		}
		for i := len(ax.curve) - 1; i >= 0; i-- { // negative face compressed, back down
			pts = appendFinite(pts, ax.curve[i].MNeg*fM, ax.curve[i].N*fN)
		}
		if len(pts) < 2 {
			continue
		}
		title, sub := "N–M interaction about "+ax.axis, ","+ax.axis
		if ax.axis == "" {
			title, sub = "N–M interaction in the direction of least resistance", ""
		}
		g := diagram{
			Name:  ax.name,
			Title: title,
			XSym:  strings.TrimSuffix("M_"+ax.axis, "_"), XUnit: uM,
			YSym: "N", YUnit: uN,
			Curves: []curve{{Legend: "interaction curve", Points: pts}},
			caption: title + " of the section with the bars provided, " +
				"with the design point and the resistance at NEd",
		}
		// Each tag names the point's coordinates in the order of the axes, (M, N).
		g.Marks = appendMark(g.Marks, mark{Legend: "design point", Tag: "M_Ed" + sub + ", N_Ed",
			At: pt{ax.a.MEd * fM, d.NEd * fN}})
		g.Marks = appendMark(g.Marks, mark{Legend: "resistance at N_Ed", Tag: "M_Rd" + sub + ", N_Ed",
			At: pt{ax.a.MRd * fM, d.NEd * fN}, Hollow: true, Below: true})
		g.fit()
		out = append(out, g)
	}
	var pts []pt
	for _, p := range d.Interaction.Contour {
		pts = appendFinite(pts, p.My*fM, p.Mz*fM)
	}
	if len(pts) >= 2 {
		pts = append(pts, pts[0]) // close the contour
		g := diagram{
			Name:  "mymz",
			Title: "M_y–M_z interaction at N_Ed",
			XSym:  "M_y", XUnit: uM,
			YSym: "M_z", YUnit: uM,
			Curves:  []curve{{Legend: "contour at N_Ed", Points: pts}},
			caption: "My–Mz interaction contour at NEd of the section with the bars provided, with the design moments",
		}
		ed := pt{d.Y.MEd * fM, d.Z.MEd * fM}
		if d.Exact != nil {
			exact := pt{d.Exact.My * fM, d.Exact.Mz * fM}
			if finitePt(exact) {
				g.Curves = append(g.Curves, curve{Legend: "direction of the resultant", Points: []pt{{0, 0}, exact}, Dashed: true})
			}
			g.caption += " and the exact resistance along their resultant"
			g.Marks = appendMark(g.Marks, mark{Legend: "design point", Tag: "M_Ed,y, M_Ed,z", At: ed, Below: true})
			g.Marks = appendMark(g.Marks, mark{Legend: "exact resistance", Tag: "M_Rd,y, M_Rd,z", At: exact, Hollow: true})
		} else {
			g.Marks = appendMark(g.Marks, mark{Legend: "design point", Tag: "M_Ed,y, M_Ed,z", At: ed})
		}
		g.fit()
		out = append(out, g)
	}
	return out
}

// Caption returns a plain-text caption of the picture.
func (g diagram) Caption() string { return g.caption }

// finitePt reports whether both coordinates of p are finite.
func finitePt(p pt) bool {
	return !math.IsNaN(p.X) && !math.IsInf(p.X, 0) && !math.IsNaN(p.Y) && !math.IsInf(p.Y, 0)
}

// appendFinite appends (x, y) to pts when both are finite.
func appendFinite(pts []pt, x, y float64) []pt {
	if p := (pt{x, y}); finitePt(p) {
		return append(pts, p)
	}
	return pts
}

// appendMark appends m to ms when its point is finite.
func appendMark(ms []mark, m mark) []mark {
	if finitePt(m.At) {
		return append(ms, m)
	}
	return ms
}

// fit sets the axis ranges to hold every curve and mark and the origin, with a margin,
// on whole multiples of a nice tick step.
func (g *diagram) fit() {
	xlo, xhi, ylo, yhi := 0.0, 0.0, 0.0, 0.0
	see := func(p pt) {
		if !finitePt(p) {
			return
		}
		xlo, xhi = math.Min(xlo, p.X), math.Max(xhi, p.X)
		ylo, yhi = math.Min(ylo, p.Y), math.Max(yhi, p.Y)
	}
	for _, c := range g.Curves {
		for _, p := range c.Points {
			see(p)
		}
	}
	for _, m := range g.Marks {
		see(m.At)
	}
	g.X, g.Y = niceRange(xlo, xhi), niceRange(ylo, yhi)
}

// niceRange widens [lo, hi] by 4 % each side and rounds it out to multiples of a step of
// 1, 2, 2.5 or 5 × 10^k: of the steps giving 4 to 10 intervals, the one with the shortest
// axis, and of those the largest step.
func niceRange(lo, hi float64) axisRange {
	span := hi - lo
	if !(span > 0) {
		span = 1
	}
	lo, hi = lo-0.04*span, hi+0.04*span
	best := axisRange{}
	for step := niceStep((hi - lo) / 10); ; step = niceStep(step * (1 + 1e-9)) {
		r := axisRange{Min: math.Floor(lo/step) * step, Max: math.Ceil(hi/step) * step, Step: step}
		n := math.Round((r.Max - r.Min) / step)
		if n < 4 {
			if best.Step == 0 {
				best = r
			}
			break
		}
		if n <= 10 && (best.Step == 0 || r.Max-r.Min <= (best.Max-best.Min)*(1+1e-9)) {
			best = r
		}
	}
	return best
}

// niceStep returns the smallest of 1, 2, 2.5, 5 × 10^k that is at least raw.
func niceStep(raw float64) float64 {
	e := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, f := range []float64{1, 2, 2.5, 5} {
		if f*e >= raw*(1-1e-12) {
			return f * e
		}
	}
	return 10 * e
}

// ticks returns the tick values of the axis, from Min to Max.
func (a axisRange) ticks() []float64 {
	if !(a.Step > 0) || !(a.Max > a.Min) {
		return nil
	}
	n := int(math.Round((a.Max - a.Min) / a.Step))
	if n > 100 {
		n = 100
	}
	out := make([]float64, 0, n+1)
	for i := 0; i <= n; i++ {
		out = append(out, a.Min+float64(i)*a.Step)
	}
	return out
}

// decimals returns how many decimals show every tick of the axis exactly.
func (a axisRange) decimals() int {
	for d := 0; d < 6; d++ {
		s := a.Step * math.Pow(10, float64(d))
		if math.Abs(s-math.Round(s)) < 1e-6*math.Max(1, s) {
			return d
		}
	}
	return 6
}

// fixed formats v with dec decimals, never as "-0"; non-finite values give "0".
// coord writes a coordinate of a drawing to 0.01 px without trailing zeros ("64.00" is "64").
func coord(v float64) string {
	s := fixed(v, 2)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}

func fixed(v float64, dec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "0"
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.HasPrefix(s, "-") && strings.Trim(s, "-0.") == "" {
		s = s[1:]
	}
	return s
}

// plainLabel writes a label with symbols like "M_Ed,y" as plain text, "MEd,y".
func plainLabel(s string) string {
	return richWith(s, func(t string) string { return t }, func(sym string) string {
		b, sub := splitSymbol(sym)
		return b + sub
	})
}

// ---- SVG ----

// Layout of the SVG picture, in px.
const (
	svgWidth   = 480
	svgLeft    = 64  // left edge of the plot area
	svgRight   = 464 // right edge of the plot area
	svgTop     = 36  // top edge of the plot area
	svgBottom  = 296 // bottom edge of the plot area
	svgLegend  = 346 // baseline of the first legend row
	svgRowStep = 16  // legend row height
	svgFont    = 11  // font size of labels
)

// Colours of the SVG picture.
const (
	svgCurveColour = "#1f5f8b"
	svgPointColour = "#b03a2e"
	svgRayColour   = "#7a7a7a"
)

// height returns the height of the SVG picture in px.
func (g diagram) height() int {
	rows := (len(g.legendItems()) + 1) / 2
	return svgLegend + rows*svgRowStep
}

// px maps a point in display units to SVG pixel coordinates.
func (g diagram) px(p pt) (x, y float64) {
	x = svgLeft + (p.X-g.X.Min)/(g.X.Max-g.X.Min)*(svgRight-svgLeft)
	y = svgBottom - (p.Y-g.Y.Min)/(g.Y.Max-g.Y.Min)*(svgBottom-svgTop)
	return x, y
}

// legendItem is one entry of the legend: a curve or a mark.
type legendItem struct {
	text  string
	curve *curve
	mark  *mark
}

// legendItems returns the legend entries: the curves, then the marks.
func (g diagram) legendItems() []legendItem {
	var out []legendItem
	for i := range g.Curves {
		if g.Curves[i].Legend != "" {
			out = append(out, legendItem{text: g.Curves[i].Legend, curve: &g.Curves[i]})
		}
	}
	for i := range g.Marks {
		if g.Marks[i].Legend != "" && finitePt(g.Marks[i].At) {
			out = append(out, legendItem{text: g.Marks[i].Legend, mark: &g.Marks[i]})
		}
	}
	return out
}

// xmlText escapes s for XML character data and attribute values.
func xmlText(s string) string {
	var b strings.Builder
	_ = xml.EscapeText(&b, []byte(oneLine(s)))
	return b.String()
}

// svgLabel lays a label out as SVG text content, symbols with a lowered, smaller subscript.
func svgLabel(s string) string {
	var b strings.Builder
	low := false // whether the current baseline is lowered
	text := func(t string) string {
		if t == "" {
			return ""
		}
		if low {
			low = false
			return `<tspan dy="-3">` + xmlText(t) + `</tspan>`
		}
		return xmlText(t)
	}
	sym := func(t string) string {
		base, sub := splitSymbol(t)
		out := text(base)
		if sub != "" {
			low = true
			out += `<tspan dy="3" font-size="` + strconv.Itoa(svgFont-3) + `">` + xmlText(sub) + `</tspan>`
		}
		return out
	}
	b.WriteString(richWith(s, text, sym))
	return b.String()
}

// svgNum formats a tick value for the SVG picture, with a true minus sign.
func svgNum(v float64, dec int) string {
	s := fixed(v, dec)
	if strings.HasPrefix(s, "-") {
		s = "−" + s[1:]
	}
	return s
}

// svgSize and pgfSize are room for a diagram's SVG and TikZ, made in one piece (the demo's are
// 4 to 6 kB and 2.5 kB).
const (
	svgSize = 7 << 10
	pgfSize = 3 << 10
)

// SVG returns the picture as a self-contained inline <svg> element.
func (g diagram) SVG() string {
	var b strings.Builder
	b.Grow(svgSize)
	h := g.height()
	f := coord
	b.WriteString(`<svg xmlns="http://www.w3.org/2000/svg" width="` + strconv.Itoa(svgWidth) + `" height="` + strconv.Itoa(h) +
		`" viewBox="0 0 ` + strconv.Itoa(svgWidth) + " " + strconv.Itoa(h) + `" role="img" font-family="sans-serif" font-size="` +
		strconv.Itoa(svgFont) + `">` + "\n")
	b.WriteString("<title>" + xmlText(plainLabel(g.Title)) + "</title>\n")
	b.WriteString(`<rect x="0" y="0" width="` + strconv.Itoa(svgWidth) + `" height="` + strconv.Itoa(h) + `" fill="#ffffff"/>` + "\n")
	b.WriteString(`<text x="` + strconv.Itoa((svgLeft+svgRight)/2) + `" y="20" text-anchor="middle" font-size="13" font-weight="bold">` +
		svgLabel(g.Title) + "</text>\n")

	line := func(x1, y1, x2, y2 float64) {
		b.WriteString(`<line x1="`)
		b.WriteString(f(x1))
		b.WriteString(`" y1="`)
		b.WriteString(f(y1))
		b.WriteString(`" x2="`)
		b.WriteString(f(x2))
		b.WriteString(`" y2="`)
		b.WriteString(f(y2))
		b.WriteString(`"/>` + "\n")
	}
	xt, yt := g.X.ticks(), g.Y.ticks()
	// tickLines draws, in one colour, a vertical line from ya to yb at each x tick and a
	// horizontal line from xa to xb at each y tick.
	tickLines := func(stroke string, xa, xb, ya, yb float64) {
		b.WriteString(`<g stroke="` + stroke + `" stroke-width="1">` + "\n")
		for _, v := range xt {
			x, _ := g.px(pt{v, g.Y.Min})
			line(x, ya, x, yb)
		}
		for _, v := range yt {
			_, y := g.px(pt{g.X.Min, v})
			line(xa, y, xb, y)
		}
		b.WriteString("</g>\n")
	}
	tickLines("#e2e2e2", svgLeft, svgRight, svgTop, svgBottom) // grid
	// Zero lines.
	ox, oy := g.px(pt{0, 0})
	b.WriteString(`<g stroke="#8c8c8c" stroke-width="1">` + "\n")
	if g.X.Min < 0 && g.X.Max > 0 {
		line(ox, svgTop, ox, svgBottom)
	}
	if g.Y.Min < 0 && g.Y.Max > 0 {
		line(svgLeft, oy, svgRight, oy)
	}
	b.WriteString("</g>\n")
	b.WriteString(`<rect x="` + strconv.Itoa(svgLeft) + `" y="` + strconv.Itoa(svgTop) + `" width="` + strconv.Itoa(svgRight-svgLeft) +
		`" height="` + strconv.Itoa(svgBottom-svgTop) + `" fill="none" stroke="#333333" stroke-width="1"/>` + "\n")
	tickLines("#333333", svgLeft-4, svgLeft, svgBottom, svgBottom+4) // ticks
	b.WriteString(`<g fill="#333333">` + "\n")
	for _, v := range xt {
		x, _ := g.px(pt{v, g.Y.Min})
		b.WriteString(`<text x="` + f(x) + `" y="` + strconv.Itoa(svgBottom+15) + `" text-anchor="middle">` + svgNum(v, g.X.decimals()) + "</text>\n")
	}
	for _, v := range yt {
		_, y := g.px(pt{g.X.Min, v})
		b.WriteString(`<text x="` + strconv.Itoa(svgLeft-7) + `" y="` + f(y+4) + `" text-anchor="end">` + svgNum(v, g.Y.decimals()) + "</text>\n")
	}
	b.WriteString("</g>\n")
	// Axis labels.
	b.WriteString(`<text x="` + strconv.Itoa((svgLeft+svgRight)/2) + `" y="` + strconv.Itoa(svgBottom+32) + `" text-anchor="middle">` +
		svgLabel(g.XSym+" ("+g.XUnit+")") + "</text>\n")
	cy := (svgTop + svgBottom) / 2
	b.WriteString(`<text x="14" y="` + strconv.Itoa(cy) + `" text-anchor="middle" transform="rotate(-90 14 ` + strconv.Itoa(cy) + `)">` +
		svgLabel(g.YSym+" ("+g.YUnit+")") + "</text>\n")

	// Curves.
	for _, c := range g.Curves {
		n := 0
		for _, p := range c.Points {
			if finitePt(p) {
				n++
			}
		}
		if n < 2 {
			continue
		}
		b.WriteString(`<polyline points="`)
		k := 0
		for _, p := range c.Points {
			if finitePt(p) {
				if k > 0 {
					b.WriteByte(' ')
				}
				x, y := g.px(p)
				b.WriteString(f(x))
				b.WriteByte(',')
				b.WriteString(f(y))
				k++
			}
		}
		b.WriteString(`" fill="none" ` + svgStroke(c) + `/>` + "\n")
	}
	// Marks with their tags.
	for _, m := range g.Marks {
		if !finitePt(m.At) {
			continue
		}
		x, y := g.px(m.At)
		b.WriteString("<g>\n<title>" + xmlText(plainLabel(m.Legend)+" ("+plainLabel(m.Tag)+") = ("+
			fixed(m.At.X, 1)+" "+g.XUnit+", "+fixed(m.At.Y, 1)+" "+g.YUnit+")") + "</title>\n")
		b.WriteString(svgCircle(m, x, y) + "\n")
		tx, anchor := x+6, "start"
		if x > svgLeft+0.7*(svgRight-svgLeft) {
			tx, anchor = x-6, "end"
		}
		ty := y - 6
		if m.Below {
			ty = y + 14
		}
		b.WriteString(`<text x="` + f(tx) + `" y="` + f(ty) + `" text-anchor="` + anchor + `" fill="` + markColour(m) + `">` +
			svgLabel(m.Tag) + "</text>\n</g>\n")
	}
	// Legend, two entries a row.
	for i, it := range g.legendItems() {
		x := float64(svgLeft + (i%2)*(svgRight-svgLeft)/2)
		y := float64(svgLegend + (i/2)*svgRowStep)
		if it.curve != nil {
			b.WriteString(`<line x1="` + f(x) + `" y1="` + f(y-4) + `" x2="` + f(x+22) + `" y2="` + f(y-4) + `" ` + svgStroke(*it.curve) + `/>` + "\n")
		} else {
			b.WriteString(svgCircle(*it.mark, x+11, y-4) + "\n")
		}
		b.WriteString(`<text x="` + f(x+28) + `" y="` + f(y) + `">` + svgLabel(it.text) + "</text>\n")
	}
	b.WriteString("</svg>\n")
	return b.String()
}

// svgStroke returns the stroke attributes of a curve.
func svgStroke(c curve) string {
	if c.Dashed {
		return `stroke="` + svgRayColour + `" stroke-width="1.2" stroke-dasharray="5 3"`
	}
	return `stroke="` + svgCurveColour + `" stroke-width="1.8" stroke-linejoin="round"`
}

// markColour returns the colour of a mark and its tag.
func markColour(m mark) string {
	if m.Hollow {
		return svgCurveColour
	}
	return svgPointColour
}

// svgCircle draws a mark as a circle centred at pixel (x, y).
func svgCircle(m mark, x, y float64) string {
	fill := svgPointColour
	if m.Hollow {
		fill = "#ffffff"
	}
	return `<circle cx="` + coord(x) + `" cy="` + coord(y) + `" r="3.5" fill="` + fill + `" stroke="` + markColour(m) + `" stroke-width="1.5"/>`
}

// ---- pgfplots ----

// pgfLabel lays a label out for LaTeX text mode, symbols in math.
func pgfLabel(s string) string {
	var t tex
	return t.rich(s)
}

// pgfNum formats a tick value as a LaTeX math number.
func pgfNum(v float64, dec int) string { return "$" + fixed(v, dec) + "$" }

// PGF returns the picture as a tikzpicture holding a pgfplots axis; it needs
// \usepackage{pgfplots} and \pgfplotsset{compat=1.16} in the preamble.
func (g diagram) PGF() string {
	var b strings.Builder
	b.Grow(pgfSize)
	join := func(vs []float64, dec int, f func(float64, int) string) string {
		s := make([]string, len(vs))
		for i, v := range vs {
			s[i] = f(v, dec)
		}
		return strings.Join(s, ",")
	}
	xt, yt := g.X.ticks(), g.Y.ticks()
	xd, yd := g.X.decimals(), g.Y.decimals()
	b.WriteString("\\begin{tikzpicture}\n\\begin{axis}[\n")
	b.WriteString("  width=0.8\\linewidth, height=0.56\\linewidth,\n")
	b.WriteString("  title={" + pgfLabel(g.Title) + "},\n")
	b.WriteString("  xlabel={" + pgfLabel(g.XSym+" ("+g.XUnit+")") + "},\n")
	b.WriteString("  ylabel={" + pgfLabel(g.YSym+" ("+g.YUnit+")") + "},\n")
	b.WriteString("  xmin=" + fixed(g.X.Min, xd) + ", xmax=" + fixed(g.X.Max, xd) + ",\n")
	b.WriteString("  ymin=" + fixed(g.Y.Min, yd) + ", ymax=" + fixed(g.Y.Max, yd) + ",\n")
	b.WriteString("  xtick={" + join(xt, xd, fixed) + "},\n")
	b.WriteString("  xticklabels={" + join(xt, xd, pgfNum) + "},\n")
	b.WriteString("  ytick={" + join(yt, yd, fixed) + "},\n")
	b.WriteString("  yticklabels={" + join(yt, yd, pgfNum) + "},\n")
	b.WriteString("  tick label style={font=\\footnotesize},\n")
	b.WriteString("  grid=major, major grid style={black!12},\n")
	b.WriteString("  clip=false,\n")
	b.WriteString("  legend cell align=left,\n")
	b.WriteString("  legend style={at={(0.5,-0.2)}, anchor=north, legend columns=2, draw=none, font=\\footnotesize,\n")
	b.WriteString("    /tikz/every even column/.append style={column sep=1.2em}},\n")
	b.WriteString("]\n")
	if g.X.Min < 0 && g.X.Max > 0 {
		b.WriteString("\\draw[black!45] (axis cs:0," + fixed(g.Y.Min, yd) + ") -- (axis cs:0," + fixed(g.Y.Max, yd) + ");\n")
	}
	if g.Y.Min < 0 && g.Y.Max > 0 {
		b.WriteString("\\draw[black!45] (axis cs:" + fixed(g.X.Min, xd) + ",0) -- (axis cs:" + fixed(g.X.Max, xd) + ",0);\n")
	}
	for _, c := range g.Curves {
		var pts []string
		for _, p := range c.Points {
			if finitePt(p) {
				pts = append(pts, "("+fixed(p.X, 3)+","+fixed(p.Y, 3)+")")
			}
		}
		if len(pts) < 2 {
			continue
		}
		style := "color={rgb,255:red,31;green,95;blue,139}, thick, mark=none"
		if c.Dashed {
			style = "color=black!55, dashed, mark=none"
		}
		if c.Legend == "" {
			style += ", forget plot"
		}
		b.WriteString("\\addplot[" + style + "] coordinates {\n")
		for i := 0; i < len(pts); i += 6 {
			b.WriteString("  " + strings.Join(pts[i:min(i+6, len(pts))], " ") + "\n")
		}
		b.WriteString("};\n")
		if c.Legend != "" {
			b.WriteString("\\addlegendentry{" + pgfLabel(c.Legend) + "}\n")
		}
	}
	for _, m := range g.Marks {
		if !finitePt(m.At) {
			continue
		}
		at := fixed(m.At.X, 3) + "," + fixed(m.At.Y, 3)
		style := "only marks, mark=*, mark size=2pt, color={rgb,255:red,176;green,58;blue,46}"
		colour := "{rgb,255:red,176;green,58;blue,46}"
		if m.Hollow {
			style = "only marks, mark=*, mark size=2pt, color={rgb,255:red,31;green,95;blue,139}, mark options={fill=white}"
			colour = "{rgb,255:red,31;green,95;blue,139}"
		}
		b.WriteString("\\addplot[" + style + "] coordinates {(" + at + ")};\n")
		b.WriteString("\\addlegendentry{" + pgfLabel(m.Legend) + "}\n")
		anchor := "south"
		if m.Below {
			anchor = "north"
		}
		if x, _ := g.px(m.At); x > svgLeft+0.7*(svgRight-svgLeft) {
			anchor += " east"
		} else {
			anchor += " west"
		}
		b.WriteString("\\node[anchor=" + anchor + ", font=\\footnotesize, text=" + colour + "] at (axis cs:" + at + ") {" + pgfLabel(m.Tag) + "};\n")
	}
	b.WriteString("\\end{axis}\n\\end{tikzpicture}\n")
	return b.String()
}
