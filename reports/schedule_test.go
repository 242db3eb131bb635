package reports

import (
	"bytes"
	"encoding/csv"
	"strconv"
	"strings"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/detail"
	"colsheet/calc/model"
)

// The schedule CSV carries numbers in separate columns (count, diameter, bars per face, lengths,
// masses), and a row read back gives them again (common practice, no source). The masses summed in
// quantities.csv are those of the lifts, by hand: 97.14 + 64.73 = 161.87 kg, 161.9 to one decimal.
func TestScheduleCSVParsedBack(t *testing.T) {
	d := design.Design{Column: "A1", Storey: "L1", B: 400, H: 400, Cover: 35, Status: design.StatusPass, Utilization: 0.8,
		Bars: design.Bars{Count: 12, Dia: 16}, Links: design.Links{Dia: 8, Spacing: 300, SpacingReduced: 175}}
	d.Detailing = design.Detailing{BarsB: 4, BarsH: 4, LapBuilt: 625, LapStart: 0, LapZone: true, LapLinkSpacing: 175, TiesB: 1, TiesH: 1,
		TieBars: "b-faces: bar 3 of 4", Zones: &detail.Zones{Bottom: 625, General: 2125, Top: 400, SBottom: 175, SGeneral: 300, STop: 175, NBottom: 5, NGeneral: 8, NTop: 3, Links: 16}}
	d.Schedule = design.Schedule{Known: true, Bottom: true, Anchorage: 575, MainMass: 83.25, LinkMass: 13.89, TotalMass: 97.14,
		Marks: []design.Mark{{Mark: "A1-L1-01", What: "main bars", Count: 12, Dia: 16, Length: 4825, Mass: 83.25}, {Mark: "A1-L1-02", What: "links", Count: 16, Dia: 8, Length: 1448, Mass: 13.89}}}
	d2 := d
	d2.Storey, d2.Schedule = "L2", design.Schedule{Known: true, MainMass: 53.62, LinkMass: 11.11, TotalMass: 64.73}
	r := &design.Result{Designs: []design.Design{d, d2}}
	rows := csvRows(t, Schedule, r)
	if len(rows) != 3 || len(rows[0]) != len(ScheduleHeader) {
		t.Fatalf("%d rows, header of %d columns; want 3 and %d", len(rows), len(rows[0]), len(ScheduleHeader))
	}
	for i, h := range ScheduleHeader {
		if rows[0][i] != h {
			t.Errorf("header column %d = %q, want %q", i, rows[0][i], h)
		}
	}
	col := map[string]string{}
	for i, h := range rows[0] {
		col[h] = rows[1][i]
	}
	for k, want := range map[string]float64{"bar_count": 12, "bar_dia_mm": 16, "bars_b_face": 4, "bars_h_face": 4, "lap_length_mm": 625,
		"link_dia_mm": 8, "link_spacing_mm": 300, "zone_bottom_mm": 625, "links_bottom": 5, "links_total": 16, "anchorage_mm": 575,
		"main_bar_length_mm": 4825, "link_length_mm": 1448, "mass_main_kg": 83.3, "mass_total_kg": 97.1, "extra_ties_b_faces": 1} {
		v, err := strconv.ParseFloat(col[k], 64)
		if err != nil || v != want {
			t.Errorf("%s = %q, want %v", k, col[k], want)
		}
	}
	if col["mark_main"] != "A1-L1-01" || col["mark_ties"] != "" || col["ties_hold"] != "b-faces: bar 3 of 4" {
		t.Errorf("marks and ties: %q %q %q", col["mark_main"], col["mark_ties"], col["ties_hold"])
	}
	qr := csvRows(t, QuantitiesCSV, r)
	last := qr[len(qr)-1]
	if last[0] != "building" || last[2] != "2" || last[6] != "161.9" {
		t.Errorf("building total %q, want 2 lifts and 161.9 kg (97.14 + 64.73 = 161.87)", last)
	}
}

// circleSample is the sample result with its first design made a circle of diameter 450 with
// 8 Ø20 on a circle and the given links (test inputs, not a design).
func circleSample(t *testing.T, links string) *design.Result {
	r := sample(t, "Round columns")
	d := &r.Designs[0]
	d.Shape, d.B, d.H = model.ShapeCircle, 450, 450
	d.Bars.Positions = detail.Geometry{B: 450, H: 450, Cover: 40, Link: 8, Circle: true}.Positions(detail.Pattern{Dia: 20, Ring: 8})
	d.Links.Type = links
	return r
}

// A circle's row of the schedule names its diameter where a rectangle gives b × h, its bars on
// a circle (no faces) and the kind of its links, the same in every format; the CSV gives the
// shape, D and the link type in columns of their own, at the end, and leaves the bars per face
// empty (common practice, no source).
func TestScheduleCircle(t *testing.T) {
	for _, tc := range []struct {
		links, kind string // the design's link type and its name in the schedule
		linksCell   string
		summary     string // the summary CSV's links cell
	}{
		{design.LinksCircular, "circular", "circular links Ø8 @ 300 / 180", "circular 8 mm @ 300 mm"},
		{design.LinksHelix, "helix", "helix Ø8, pitch 300 / 180", "helix 8 mm, pitch 300 mm"},
		{"", "circular", "circular links Ø8 @ 300 / 180", "circular 8 mm @ 300 mm"}, // not named: circular links round a circle
	} {
		r := circleSample(t, tc.links)
		cells := scheduleCells(r.Designs[0], "Group 1", design.LiftLevel{})
		rect := scheduleCells(r.Designs[1], "Group 2", design.LiftLevel{})
		for i, want := range map[int]string{4: "Ø450", 5: "8 Ø20 on a circle", 6: "–", 8: tc.linksCell} {
			if got := plainText(cells[i]); got != want {
				t.Errorf("%s: cell %d = %q, want %q", tc.kind, i, got, want)
			}
		}
		for i, want := range map[int]string{4: "300 × 300", 5: "4 Ø20", 6: "0 / 0", 8: "Ø6 @ 240 / 144"} {
			if got := plainText(rect[i]); got != want {
				t.Errorf("rectangle: cell %d = %q, want %q", i, got, want)
			}
		}
		// The printed schedules of the index sheet.
		printed := map[string]string{}
		for format, f := range map[string]func(*design.Result, Options) ([]Sheet, error){"md": Markdown, "tex": LaTeX, "html": HTML} {
			sheets, err := f(r, Options{})
			if err != nil {
				t.Fatal(err)
			}
			printed[format] = string(sheets[0].Data)
		}
		for format, want := range map[string][]string{
			"md":   {"| Ø450 | 8 Ø20 on a circle | – |", tc.linksCell},
			"html": {"<td>Ø450</td>", "<td>8 Ø20 on a circle</td>", tc.linksCell},
			"tex":  {`\ensuremath{\text{\O}}450 & 8 \ensuremath{\text{\O}}20 on a circle`, strings.ReplaceAll(tc.linksCell, "Ø", `\ensuremath{\text{\O}}`)},
		} {
			for _, w := range want {
				if !strings.Contains(printed[format], w) {
					t.Errorf("%s: the schedule of the %s index lacks %q", tc.kind, format, w)
				}
			}
		}
		// schedule.csv
		rows := csvRows(t, Schedule, r)
		n := len(ScheduleHeader)
		if got := strings.Join(rows[0][n-3:], ","); got != "shape,D_mm,link_type" {
			t.Errorf("the last columns are %q", got)
		}
		col := func(row int, h string) string {
			for i, x := range rows[0] {
				if x == h {
					return rows[row][i]
				}
			}
			t.Fatalf("no column %s", h)
			return ""
		}
		for h, want := range map[string][2]string{"shape": {"circle", "rectangle"}, "D_mm": {"450", ""}, "link_type": {tc.kind, "rectangular"},
			"b_mm": {"450", "300"}, "h_mm": {"450", "300"}, "bars_b_face": {"", "0"}, "bars_h_face": {"", "0"}, "bar_count": {"8", "4"}} {
			if col(1, h) != want[0] || col(2, h) != want[1] {
				t.Errorf("%s: %s = %q, %q; want %q, %q", tc.kind, h, col(1, h), col(2, h), want[0], want[1])
			}
		}
		// summary.csv: the same columns as ever; the bars and links cells say circle and link kind.
		srows := csvRows(t, CSV, r)
		if len(srows[0]) != len(CSVHeader) || srows[1][9] != "8 x 20 mm on a circle" || srows[1][10] != tc.summary ||
			srows[2][9] != "4 x 20 mm" || srows[2][10] != "6 mm @ 240 mm" {
			t.Errorf("%s: summary rows %q, %q", tc.kind, srows[1], srows[2])
		}
	}
}

// plainText is the text of a run of plain text spans.
func plainText(in inline) string {
	var b strings.Builder
	for _, s := range in {
		b.WriteString(s.text)
	}
	return b.String()
}

// csvRows makes a CSV file of r and reads its rows back.
func csvRows(t *testing.T, make func(*design.Result) ([]byte, error), r *design.Result) [][]string {
	t.Helper()
	out, err := make(r)
	if err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(bytes.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	return rows
}
