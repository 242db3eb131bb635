package reports

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"strconv"
	"strings"

	"colsheet/calc/design"
)

// CSVHeader names the columns of the CSV summary.
var CSVHeader = []string{"column", "storey", "b_mm", "h_mm", "NEd_kN", "MEd_y_kNm", "MRd_y_kNm",
	"MEd_z_kNm", "MRd_z_kNm", "bars", "links", "utilization", "status", "governing"}

// CSV returns a summary table with one row per design, numbers in display units.
func CSV(r *design.Result) ([]byte, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	if err := finiteResult(r); err != nil {
		return nil, err
	}
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	if err := w.Write(CSVHeader); err != nil {
		return nil, err
	}
	f := func(v float64, dec int) string {
		s := strconv.FormatFloat(v, 'f', dec, 64)
		if strings.Trim(s, "-0.") == "" {
			s = strings.TrimPrefix(s, "-")
		}
		return s
	}
	for _, d := range r.Designs {
		row := []string{cell(d.Column), cell(d.Storey), f(d.B, 0), f(d.H, 0), f(d.NEd/1e3, 1),
			f(d.Y.MEd/1e6, 1), f(d.Y.MRd/1e6, 1), f(d.Z.MEd/1e6, 1), f(d.Z.MRd/1e6, 1),
			fmt.Sprintf("%d x %s mm", d.Bars.Count, fmtNum(d.Bars.Dia).plain()),
			fmt.Sprintf("%s mm @ %s mm", fmtNum(d.Links.Dia).plain(), fmtNum(d.Links.Spacing).plain()),
			f(d.Utilization, 3), d.Status, cell(d.Governing)}
		if err := w.Write(row); err != nil {
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
