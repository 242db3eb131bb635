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
			fmt.Sprintf("%d x %s mm", d.Bars.Count, fmtNum(d.Bars.Dia).plain()),
			fmt.Sprintf("%s mm @ %s mm", fmtNum(d.Links.Dia).plain(), fmtNum(d.Links.Spacing).plain()),
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

// ScheduleHeader names the columns of the column schedule.
var ScheduleHeader = []string{"column", "lift", "group", "b_mm", "h_mm", "bars", "As_prov_mm2", "link_dia_mm", "link_spacing_mm",
	"link_spacing_reduced_mm", "reduced_zone_mm", "reduced_over_laps", "lap_length_mm", "lap_links", "lap_link_spacing_mm", "extra_ties", "cover_mm",
	"cover_required_mm", "fire_rating", "fire", "utilization", "status", "governing"}

// Schedule returns the column schedule, one row per column and lift, for the drawing office.
func Schedule(r *design.Result) ([]byte, error) {
	names := groupNames(r)
	return table(r, ScheduleHeader, func(i int, d design.Design) []string { return scheduleRow(d, names[i], cell) })
}

// scheduleRow returns one design's schedule entries as text, passing user text through esc.
func scheduleRow(d design.Design, group string, esc func(string) string) []string {
	n := func(v float64) string { return fmtNum(v).plain() }
	opt := func(v float64) string {
		if v <= 0 {
			return "–"
		}
		return n(v)
	}
	status, rating := "not required", "none"
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
	// The links within the lap length at their spacing; none where they were not detailed.
	optInt := func(k int, spacing float64) string {
		if spacing <= 0 {
			return "–"
		}
		return strconv.Itoa(k)
	}
	laps := "no"
	if d.Detailing.LapZone {
		laps = "yes"
	}
	return []string{esc(d.Column), esc(d.Storey), esc(group), n(d.B), n(d.H), fmt.Sprintf("%d × %s mm", d.Bars.Count, n(d.Bars.Dia)), n(math.Round(d.AsProv)),
		n(d.Links.Dia), n(d.Links.Spacing), n(d.Links.SpacingReduced), n(d.Detailing.ZoneLength), laps, opt(d.Detailing.LapLength),
		optInt(d.Detailing.LapLinks, d.Detailing.LapLinkSpacing), opt(d.Detailing.LapLinkSpacing),
		strconv.Itoa(d.Detailing.ExtraTies), n(d.Cover), opt(d.Detailing.CoverRequired), rating, status,
		fmtNum(d.Utilization).plain(), d.Status, esc(d.Governing)}
}

// scheduleCells returns one design's schedule entries as cells of the document tree.
func scheduleCells(d design.Design, group string) []inline {
	row := scheduleRow(d, group, func(s string) string { return s })
	out := make([]inline, len(row))
	for i, c := range row {
		out[i] = txt(c)
	}
	return out
}
