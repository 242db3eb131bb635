package reports

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"math"
	"strconv"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/fire"
	"colsheet/calc/model"
)

// CSVHeader names the columns of the CSV summary.
var CSVHeader = []string{"column", "storey", "b_mm", "h_mm", "NEd_kN", "MEd_y_kNm", "MRd_y_kNm",
	"MEd_z_kNm", "MRd_z_kNm", "bars", "links", "utilization", "status", "governing"}

// CSV returns a summary table with one row per design, numbers in display units rounded as
// on the sheets (fmtNum: 4 significant figures), so that a value reads the same in both.
func CSV(r *design.Result) ([]byte, error) {
	f := func(v float64, engine string) string {
		s, _ := DisplayUnit(engine)
		return fmtNum(v * s).plain()
	}
	return table(r, CSVHeader, func(_ int, d design.Design) []string {
		return []string{cell(d.Column), cell(d.Storey), f(d.B, "mm"), f(d.H, "mm"), f(d.NEd, "N"),
			f(d.Y.MEd, "Nmm"), f(d.Y.MRd, "Nmm"), f(d.Z.MEd, "Nmm"), f(d.Z.MRd, "Nmm"),
			fmt.Sprintf("%d x %s mm", d.Bars.Count, fmtNum(d.Bars.Dia).plain()) + onCircle(d),
			linkKind(d, "circular ", "helix ") + fmt.Sprintf("%s mm%s %s mm", fmtNum(d.Links.Dia).plain(), pitch(d, " @", ", pitch"), fmtNum(d.Links.Spacing).plain()),
			f(d.Utilization, ""), d.Status, cell(d.Governing)}
	})
}

// table writes a CSV table with the header and one row per design.
func table(r *design.Result, header []string, row func(int, design.Design) []string) ([]byte, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	if err := w.Write(header); err != nil {
		return nil, err
	}
	for i, d := range r.Designs {
		if err := w.Write(row(i, d)); err != nil {
			return nil, err
		}
	}
	w.Flush()
	if err := w.Error(); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// cell keeps text that a spreadsheet would take for a formula from being one.
func cell(s string) string {
	s = oneLine(s)
	if s != "" && strings.ContainsRune("=+-@", rune(s[0])) {
		return "'" + s
	}
	return s
}

// ScheduleHeader names the columns of the column schedule: numbers in separate columns, lengths in mm,
// levels in mm above the base of the column, masses in kg; empty where not known.
var ScheduleHeader = []string{"column", "lift", "group", "level_bottom_mm", "level_top_mm", "b_mm", "h_mm",
	"bar_count", "bar_dia_mm", "bars_b_face", "bars_h_face", "As_prov_mm2",
	"lap_length_mm", "lap_start_mm", "lap_reduced_links", "lap_transverse",
	"link_dia_mm", "link_spacing_mm", "link_spacing_reduced_mm", "link_spacing_lap_mm",
	"zone_bottom_mm", "zone_bottom_spacing_mm", "links_bottom", "zone_general_mm", "links_general", "zone_top_mm", "links_top", "links_total",
	"extra_ties_b_faces", "extra_ties_h_faces", "ties_hold", "cover_mm", "cover_required_mm", "fire_rating", "fire",
	"anchorage_mm", "mark_main", "main_bar_length_mm", "mark_links", "link_length_mm", "mark_ties", "ties_total", "tie_length_mm",
	"mark_starters", "starter_length_mm", "mass_main_kg", "mass_links_kg", "mass_total_kg",
	"utilization", "status", "governing", "shape", "D_mm", "link_type"}

// Schedule returns the column schedule, one row per column and lift, for the drawing office.
func Schedule(r *design.Result) ([]byte, error) {
	names := groupNames(r)
	lv := r.Levels()
	return table(r, ScheduleHeader, func(i int, d design.Design) []string { return scheduleRow(d, names[i], lv[i], cell) })
}

// QuantitiesHeader names the columns of the quantity take-off.
var QuantitiesHeader = []string{"scope", "name", "lifts", "lifts_not_known", "mass_main_kg", "mass_links_kg", "mass_total_kg"}

// QuantitiesCSV returns the steel masses per column, per level and for the building, kg: main bars
// (starter bars included), links with ties, and their sum; lifts whose masses are not known (no length
// given) are counted in lifts_not_known and left out of the sums.
func QuantitiesCSV(r *design.Result) ([]byte, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	_ = w.Write(QuantitiesHeader)
	for _, t := range totalRows(r.Quantities()) {
		if err := w.Write(t); err != nil {
			return nil, err
		}
	}
	w.Flush()
	return b.Bytes(), w.Error()
}

// totalRows returns the rows of the quantity take-off as text: scope, name, lifts, lifts not known, masses.
func totalRows(q design.Quantities) [][]string {
	var out [][]string
	row := func(scope string, t design.Total) []string {
		if t.Unknown == t.Lifts {
			// No lift of the scope has a known mass: no sum to give.
			return []string{scope, cell(t.Name), strconv.Itoa(t.Lifts), strconv.Itoa(t.Unknown), "", "", ""}
		}
		return []string{scope, cell(t.Name), strconv.Itoa(t.Lifts), strconv.Itoa(t.Unknown),
			massText(t.Main), massText(t.Links), massText(t.Total)}
	}
	for _, t := range q.Columns {
		out = append(out, row("column", t))
	}
	for _, t := range q.Levels {
		out = append(out, row("level", t))
	}
	return append(out, row("building", q.Building))
}

// massText is a mass in kg to one decimal.
func massText(v float64) string { return strconv.FormatFloat(math.Round(v*10)/10, 'f', 1, 64) }

// mmText is a length in whole mm; lengths of the schedule are on practical steps or cut lengths.
func mmText(v float64) string { return strconv.FormatFloat(math.Round(v), 'f', 0, 64) }

// scheduleRow returns one design's schedule entries as text (ScheduleHeader), passing user text through esc.
func scheduleRow(d design.Design, group string, lv design.LiftLevel, esc func(string) string) []string {
	n := func(v float64) string { return fmtNum(v).plain() }
	opt := func(v float64) string {
		if v <= 0 {
			return ""
		}
		return mmText(v)
	}
	yes := func(b bool) string {
		if b {
			return "yes"
		}
		return "no"
	}
	status, rating := fireStatus(d)
	dt, sch := d.Detailing, d.Schedule
	levelB, levelT := "", ""
	if lv.Known {
		levelB, levelT = mmText(lv.Bottom), mmText(lv.Top)
	}
	z := make([]string, 8)
	if zs := dt.Zones; zs != nil {
		z = []string{mmText(zs.Bottom), mmText(zs.SBottom), strconv.Itoa(zs.NBottom), mmText(zs.General), strconv.Itoa(zs.NGeneral),
			mmText(zs.Top), strconv.Itoa(zs.NTop), strconv.Itoa(zs.Links)}
	}
	marks := map[string]design.Mark{}
	for _, m := range sch.Marks {
		marks[m.What] = m
	}
	mark := func(what string) (string, string) {
		m, ok := marks[what]
		if !ok {
			return "", ""
		}
		return m.Mark, mmText(m.Length)
	}
	mMain, lMain := mark("main bars")
	mLinks, lLinks := mark("links")
	mTies, lTies := mark("ties")
	mStart, lStart := mark("starter bars")
	tiesTotal := ""
	if m, ok := marks["ties"]; ok {
		tiesTotal = strconv.Itoa(m.Count)
	}
	masses := []string{"", "", ""}
	if sch.Known {
		masses = []string{massText(sch.MainMass), massText(sch.LinkMass), massText(sch.TotalMass)}
	}
	perB, perH, dia := strconv.Itoa(dt.BarsB), strconv.Itoa(dt.BarsH), ""
	if circular(d) {
		// Bars on a circle: no faces.
		perB, perH, dia = "", "", n(d.B)
	}
	row := []string{esc(d.Column), esc(d.Storey), esc(group), levelB, levelT, n(d.B), n(d.H),
		strconv.Itoa(d.Bars.Count), n(d.Bars.Dia), perB, perH, n(math.Round(d.AsProv)),
		opt(dt.LapBuilt), mmText(dt.LapStart), yes(dt.LapZone), yes(dt.LapTransverse),
		n(d.Links.Dia), n(d.Links.Spacing), n(d.Links.SpacingReduced), opt(dt.LapLinkSpacing)}
	row = append(row, z...)
	row = append(row, strconv.Itoa(dt.TiesB), strconv.Itoa(dt.TiesH), dt.TieBars, n(d.Cover), opt(dt.CoverRequired), rating, status,
		opt(sch.Anchorage), mMain, lMain, mLinks, lLinks, mTies, tiesTotal, lTies, mStart, lStart)
	row = append(row, masses...)
	return append(row, fmtNum(d.Utilization).plain(), d.Status, esc(d.Governing), shapeName(d), dia, linkType(d))
}

// fireStatus returns how the fire rating of a design is shown and the rating ("R90", or "none").
func fireStatus(d design.Design) (status, rating string) {
	status, rating = "not required", "none"
	if d.Detailing.FireRating > 0 {
		rating = "R" + strconv.Itoa(d.Detailing.FireRating)
		status = "fails"
		if d.Detailing.FireOK {
			status = "passes"
			if d.Detailing.FireMethod == fire.RouteElsewhere {
				status = fire.RouteElsewhere
			}
		}
	}
	return status, rating
}

// scheduleCells returns one design's row of the cage table of the schedule as cells of the document tree:
// column, lift, group, levels, section, bars, bars per face, lap, links, links over the laps, zones, links in
// the lift, ties, cover, fire, utilisation and status.
func scheduleCells(d design.Design, group string, lv design.LiftLevel) []inline {
	n := func(v float64) string { return fmtNum(v).plain() }
	dash := txt("–")
	dt := d.Detailing
	levels := dash
	if lv.Known {
		levels = txt(n(lv.Bottom/1000) + " – " + n(lv.Top/1000))
	}
	lap := dash
	if dt.LapBuilt > 0 {
		lap = txt(mmText(dt.LapBuilt) + " from +" + mmText(dt.LapStart))
	}
	overLaps := dash
	if dt.LapLinkSpacing > 0 {
		overLaps = txt("@ " + n(dt.LapLinkSpacing))
		if dt.LapTransverse {
			overLaps = cat(overLaps, txt(", ΣAst ≥ As"))
		}
	}
	zones, count := dash, dash
	if zs := dt.Zones; zs != nil {
		zones = txt(fmt.Sprintf("%s @ %s (%d) · %s @ %s (%d) · %s @ %s (%d)", mmText(zs.Bottom), n(zs.SBottom), zs.NBottom,
			mmText(zs.General), n(zs.SGeneral), zs.NGeneral, mmText(zs.Top), n(zs.STop), zs.NTop))
		count = txt(strconv.Itoa(zs.Links))
	}
	ties := txt("none")
	if k := dt.TiesB + dt.TiesH; k > 0 {
		ties = txt(fmt.Sprintf("%d: %s", k, dt.TieBars))
	}
	cov := txt(n(d.Cover))
	if dt.CoverRequired > 0 {
		cov = txt(n(d.Cover) + " (" + n(dt.CoverRequired) + ")")
	}
	status, rating := fireStatus(d)
	size, perFace := txt(n(d.B)+" × "+n(d.H)), txt(fmt.Sprintf("%d / %d", dt.BarsB, dt.BarsH))
	if circular(d) {
		size, perFace = txt("Ø"+n(d.B)), dash
	}
	return []inline{txt(d.Column), txt(d.Storey), txt(group), levels, size,
		txt(fmt.Sprintf("%d Ø%s", d.Bars.Count, n(d.Bars.Dia)) + onCircle(d)), perFace, lap,
		txt(linkKind(d, "circular links ", "helix ") + fmt.Sprintf("Ø%s%s %s / %s", n(d.Links.Dia), pitch(d, " @", ", pitch"), n(d.Links.Spacing), n(d.Links.SpacingReduced))),
		overLaps, zones, count, ties, cov, txt(rating + " " + status), numv(fmtNum(d.Utilization)), txt(d.Status)}
}

// circular reports whether design d is of a circular section.
func circular(d design.Design) bool { return d.Shape == model.ShapeCircle }

// shapeName names the section's shape as results.json and the schedule give it: "rectangle" or "circle".
func shapeName(d design.Design) string { return sizeShape(d.Shape) }

// linkType returns the kind of the design's transverse bars (design.LinksRect, LinksCircular or
// LinksHelix); where the design names none, that of its shape: rectangular links round a
// rectangle, circular links round a circle.
func linkType(d design.Design) string {
	switch {
	case d.Links.Type != "":
		return d.Links.Type
	case circular(d):
		return design.LinksCircular
	}
	return design.LinksRect
}

// onCircle is what follows the bars of a circular section: " on a circle"; "" for a rectangle.
func onCircle(d design.Design) string {
	if circular(d) {
		return " on a circle"
	}
	return ""
}

// linkKind returns the word that names a circle's links before their diameter, circ or helix;
// "" for a rectangle's links, named as always.
func linkKind(d design.Design, circ, helix string) string {
	switch {
	case !circular(d):
		return ""
	case linkType(d) == design.LinksHelix:
		return helix
	}
	return circ
}

// pitch returns what stands before the spacing of the links: at, or pitch for a helix.
func pitch(d design.Design, at, pitch string) string {
	if linkType(d) == design.LinksHelix {
		return pitch
	}
	return at
}

// markCells returns the rows of the bar marks of a design: mark, what, count, diameter, cut length, mass,
// with the anchorage length on the rows of the bars it concerns.
func markCells(d design.Design) [][]inline {
	var out [][]inline
	sch := d.Schedule
	for _, m := range sch.Marks {
		anch := txt("–")
		if sch.Anchorage > 0 && (m.What == "starter bars" || m.What == "main bars" && sch.Top) {
			where := "into the foundation"
			if m.What == "main bars" {
				where = "into the roof"
			}
			anch = txt(mmText(sch.Anchorage) + " " + where)
		}
		out = append(out, []inline{txt(m.Mark), txt(m.What), txt(strconv.Itoa(m.Count)), txt("Ø" + fmtNum(m.Dia).plain()),
			txt(mmText(m.Length)), txt(massText(m.Mass)), anch})
	}
	return out
}

// totalCells returns the rows of the quantity take-off as cells.
func totalCells(q design.Quantities) [][]inline {
	var out [][]inline
	for _, r := range totalRows(q) {
		row := make([]inline, len(r))
		for i, c := range r {
			if c == "" {
				c = "–"
			}
			row[i] = txt(c)
		}
		if r[3] != "0" {
			row[3] = txt(r[3] + " (not counted: no length given)")
		}
		out = append(out, row)
	}
	return out
}
