package reports

import (
	"bytes"
	"encoding/csv"
	"strconv"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/detail"
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
	out, err := Schedule(r)
	if err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(bytes.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
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
	q, err := QuantitiesCSV(r)
	if err != nil {
		t.Fatal(err)
	}
	qr, err := csv.NewReader(bytes.NewReader(q)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	last := qr[len(qr)-1]
	if last[0] != "building" || last[2] != "2" || last[6] != "161.9" {
		t.Errorf("building total %q, want 2 lifts and 161.9 kg (97.14 + 64.73 = 161.87)", last)
	}
}
