package input

import (
	"errors"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"colsheet/calc/model"
)

// files returns a reader of the named texts; any other name does not exist.
func files(texts map[string]string) func(string) ([]byte, error) {
	return func(name string) ([]byte, error) {
		if s, ok := texts[name]; ok {
			return []byte(s), nil
		}
		return nil, &fs.PathError{Op: "open", Path: "/somewhere/" + name, Err: fs.ErrNotExist}
	}
}

// withTable is an input of two columns whose lifts take their cases from t.csv: K1 with L1
// (line 9) and L2 (line 10), K2 with L1 (line 16).
const withTable = `materials: {concrete: C30/37}
actions: t.csv
columns:
  - id: K1
    b: 350 mm
    h: 500 mm
    cover: 40 mm
    storeys:
      - {name: L1, l0: 3 m}
      - {name: L2, l0: 3 m}
  - id: K2
    b: 300 mm
    h: 300 mm
    cover: 30 mm
    storeys:
      - {name: L1, l0: 3 m}
`

const header = "column,lift,case,NEd_kN,My_top_kNm,My_bottom_kNm,Mz_top_kNm,Mz_bottom_kNm"

// rowsOf returns a table of the header and rows, each with one case per lift of withTable
// beside the given ones.
func rowsOf(head string, rows ...string) string {
	return head + "\n" + strings.Join(rows, "\n") + "\n"
}

// The actions table in its accepted forms gives the same cases. The conversions kN → N and
// kNm → N·mm are common practice (SI prefixes), no source.
func TestActionsTable(t *testing.T) {
	a := model.Case{Name: "ULS-1", File: "t.csv", Line: 2, NEd: 2150e3, MY: model.Ends{Top: 85e6, Bottom: -40e6}, MZ: model.Ends{Top: 10e6, Bottom: 10e6},
		V: [2]float64{38e3, 6e3}, HasV: [2]bool{true, true}}
	b := model.Case{Name: "ULS-2", File: "t.csv", Line: 3, NEd: -120.5e3, MY: model.Ends{Top: 1.5e6, Bottom: -2.25e6}, V: [2]float64{0, 4e3}, HasV: [2]bool{false, true}}
	l2 := model.Case{Name: "G", File: "t.csv", Line: 4, NEd: 1000e3}
	k2 := model.Case{Name: "G", File: "t.csv", Line: 5, NEd: 500e3}
	tests := []struct {
		name, table string
		want        [3][]model.Case // K1/L1, K1/L2, K2/L1
		warnings    []string
	}{
		{"commas", rowsOf(header+",Vy_kN,Vz_kN",
			"K1,L1,ULS-1,2150,85,-40,10,10,38,6",
			"K1,L1,ULS-2,-120.5,1.5,-2.25,0,0,,4",
			"K1,L2,G,1000,0,0,0,0,,",
			"K2,L1,G,500,0,0,0,0,,"),
			[3][]model.Case{{a, b}, {l2}, {k2}}, nil},
		{"semicolons and decimal commas", rowsOf(strings.ReplaceAll(header, ",", ";")+";Vy_kN;Vz_kN",
			"K1;L1;ULS-1;2150;85;-40;10;10;38;6",
			"K1;L1;ULS-2;-120,5;1,5;-2,25;0;0;;4",
			"K1;L2;G;1000;0;0;0;0;;",
			"K2;L1;G;500;0;0;0;0;;"),
			[3][]model.Case{{a, b}, {l2}, {k2}}, nil},
		{"byte order mark, CRLF, quotes, spaces", "\uFEFF" + strings.ReplaceAll(rowsOf(header+", Vy_kN ,Vz_kN",
			`K1,L1,"ULS-1", 2150 ,85,-40,10,10,38,6`,
			`"K1","L1","ULS-2",-120.5,1.5,-2.25,0,0,"",4`,
			"K1,L2,G,1e3,0,0,0,0,,",
			",,,,,,,,,",
			"K2,L1,G,+500.0,0,0,0,0,,"), "\n", "\r\n"),
			[3][]model.Case{{a, b}, {l2}, {{Name: "G", File: "t.csv", Line: 6, NEd: 500e3}}}, nil},
		{"columns in any order, other columns warned of", rowsOf("Remark,case,Vz_kN,lift,column,mz_bottom_knm,Mz_top_kNm,My_bottom_kNm,My_top_kNm,NEd_kN,,Vy_kN",
			"max N,ULS-1,6,L1,K1,10,10,-40,85,2150,,38",
			",ULS-2,4,L1,K1,0,0,-2.25,1.5,-120.5,,",
			",G,,L2,K1,0,0,0,0,1000,x,",
			",G,,L1,K2,0,0,0,0,500,,"),
			[3][]model.Case{{a, b}, {l2}, {k2}}, []string{
				"t.csv:1: Remark: column Remark is not used",
				"t.csv:1: column 11 has no name and is not used"}},
	}
	for _, c := range tests {
		in, warns, err := ParseWarn("in.yaml", []byte(withTable), files(map[string]string{"t.csv": c.table}))
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		for i, s := range []model.Storey{in.Columns[0].Storeys[0], in.Columns[0].Storeys[1], in.Columns[1].Storeys[0]} {
			checkCases(t, c.name+", "+s.Name, s.Cases, c.want[i])
			if s.NEd != s.Cases[0].NEd || s.MY != s.Cases[0].MY || s.MZ != s.Cases[0].MZ {
				t.Errorf("%s: the storey's NEd and M are not those of its first case", c.name)
			}
		}
		var got []string
		for _, w := range warns {
			got = append(got, w.String())
		}
		if strings.Join(got, "\n") != strings.Join(c.warnings, "\n") {
			t.Errorf("%s: warnings\n%s\nwant\n%s", c.name, strings.Join(got, "\n"), strings.Join(c.warnings, "\n"))
		}
		// sha256sum of the table's bytes; the name as given.
		if in.Actions == nil || in.Actions.Name != "t.csv" || string(in.Actions.Data) != c.table || len(in.Actions.SHA256) != 64 {
			t.Errorf("%s: actions table %+v", c.name, in.Actions)
		}
		if _, err := ParseWith("in.yaml", []byte(withTable), files(map[string]string{"t.csv": c.table})); err != nil {
			t.Errorf("%s: ParseWith: %v", c.name, err)
		}
	}
}

// The SHA-256 of the table is that of its bytes, as sha256sum gives it.
func TestActionsTableHash(t *testing.T) {
	table := rowsOf(header, "K1,L1,A,1,0,0,0,0", "K1,L2,A,1,0,0,0,0", "K2,L1,A,1,0,0,0,0")
	in, err := ParseWith("in.yaml", []byte(withTable), files(map[string]string{"t.csv": table}))
	if err != nil {
		t.Fatal(err)
	}
	// printf '...' | sha256sum, with the table above
	if got, want := in.Actions.SHA256, "872ecb1cc2779f8688abfb2c1aab1bd4a3bbe7a98ea2de4c423eb6937c993c80"; got != want {
		t.Errorf("SHA256 %s, want %s", got, want)
	}
}

func TestActionsTableErrors(t *testing.T) {
	good := []string{"K1,L1,A,1,0,0,0,0", "K1,L2,A,1,0,0,0,0", "K2,L1,A,1,0,0,0,0"}
	tests := []struct {
		name, yaml string
		table      *string // nil: the file does not exist
		want       []string
	}{
		{"not a number", withTable, ptr(rowsOf(header, "K1,L1,A,abc,0,0,0,0", "K1,L2,A,2150 kN,0,0,0,0", `K2,L1,A,1,"1,5",0,0,0`)), []string{
			`t.csv:2: NEd_kN: "abc" is not a number; give a plain number, in the unit the column's name says (kN)`,
			`t.csv:3: NEd_kN: "2150 kN" is not a number; give a plain number, in the unit the column's name says (kN)`,
			`t.csv:4: My_top_kNm: "1,5" is not a number; with "," between the cells write a decimal point, or separate the cells with ";"`}},
		{"thousands with semicolons", withTable, ptr(rowsOf(strings.ReplaceAll(header, ",", ";"), "K1;L1;A;1.234,5;0;0;0;0", "K1;L2;A;1;0;0;0;0", "K2;L1;A;1;0;0;0;0")), []string{
			`t.csv:2: NEd_kN: "1.234,5" is not a number; give a plain number, in the unit the column's name says (kN)`}},
		{"missing required columns", withTable, ptr(rowsOf("column,lift,case,NEd_kN,My_top_kNm,My_bottom_kNm,Mz_top_kNm,Vy_kN,My_Top_kNm", "K1,L1,A,1,0,0,0,0,0")), []string{
			"t.csv:1: My_Top_kNm: the column is given twice (columns 5 and 9 of the header)",
			"t.csv:1: Mz_bottom_kNm: is required but missing from the header (end moment about z at the bottom; the header needs " + header + ", and may have Vy_kN and Vz_kN)"}},
		{"unknown column and lift, no case for a lift", withTable, ptr(rowsOf(header, "K9,L1,A,1,0,0,0,0", "K1,L9,A,1,0,0,0,0", "K1,L1,A,1,0,0,0,0")), []string{
			`in.yaml:10: columns[0].storeys[1]: the actions table "t.csv" has no case of column K1, lift L2`,
			`in.yaml:16: columns[1].storeys[0]: the actions table "t.csv" has no case of column K2, lift L1`,
			`t.csv:2: column: "K9" is not a column of columns: (columns: K1, K2)`,
			`t.csv:3: lift: column K1 has no lift "L9" (lifts: L1, L2)`}},
		{"duplicate case", withTable, ptr(rowsOf(header, append(good, "K1,L1,A,2,0,0,0,0")...)), []string{
			`t.csv:5: case: case "A" of column K1, lift L1 is given twice (first on line 2)`}},
		{"empty cells, names, row width", withTable, ptr(rowsOf(header, "K1,L1,,,0,0,0,0", "K1,L2,A/B,1,0,0,0", "K2,L1,A,1,0,0,0,0,0", "K1,L2,B,1,0,0,0,0")), []string{
			`in.yaml:16: columns[1].storeys[0]: the actions table "t.csv" has no case of column K2, lift L1`,
			"t.csv:2: case: the cell is empty (give the case's name)",
			"t.csv:2: NEd_kN: the cell is empty (give the design axial force in kN)",
			"t.csv:3: the row has 7 cells, the header 8",
			"t.csv:4: the row has 9 cells, the header 8"}},
		{"limits", withTable, ptr(rowsOf(header+",Vy_kN", "K1,L1,A,-150000,0,0,0,0,", "K1,L2,A,1,1e400,1e300,0,0,", "K2,L1,A,1,0,0,0,0,2e5")), []string{
			"t.csv:2: NEd_kN: -150000 kN is outside the plausible range of the design axial force, -100000 kN to 100000 kN (see the input limits in the README)",
			`t.csv:3: My_top_kNm: "1e400" is not a finite number`,
			"t.csv:3: My_bottom_kNm: 1e+300 kNm is outside the plausible range of the first-order end moment, -100000 kNm to 100000 kNm (see the input limits in the README)",
			"t.csv:4: Vy_kN: 200000 kN is outside the plausible range of the design shear force, -100000 kN to 100000 kN (see the input limits in the README)"}},
		{"CSV syntax", withTable, ptr(rowsOf(header, "K1,L1,A,1,0,0,0,0", `K1,L2,A"x,1,0,0,0,0`)), []string{
			`t.csv:3: the table is not valid CSV: bare " in non-quoted-field`}},
		{"empty table", withTable, ptr("\uFEFF\r\n"), []string{
			"t.csv:1: the table is empty; expected a header line such as " + header}},
		{"no such file", withTable, nil, []string{
			`in.yaml:2: actions: cannot read the actions table "t.csv": file does not exist`}},
		{"lifts that give actions", strings.Replace(withTable, "{name: L1, l0: 3 m}", "{name: L1, l0: 3 m, NEd: 1, M: {}, cases: []}", 1), ptr(rowsOf(header, good...)), []string{
			`in.yaml:9: columns[0].storeys[0].NEd: the actions table "t.csv" gives the cases of every lift (actions: at line 2); leave NEd out here`,
			`in.yaml:9: columns[0].storeys[0].M: the actions table "t.csv" gives the cases of every lift (actions: at line 2); leave M out here`,
			`in.yaml:9: columns[0].storeys[0].cases: the actions table "t.csv" gives the cases of every lift (actions: at line 2); leave cases out here`}},
		{"absolute path", strings.Replace(withTable, "t.csv", "/data/t.csv", 1), ptr(""), []string{
			`in.yaml:2: actions: "/data/t.csv": give the path relative to the folder of the input file`}},
		{"with the building form", "actions: t.csv\n" + building, ptr(rowsOf(header, good...)), []string{
			"in.yaml:1: actions: an actions table gives the cases of the actions form (columns:); the building form derives its actions"}},
		{"faults of both files together, the input file's first", strings.Replace(withTable, "b: 350 mm", "b: 3.5 kN", 1),
			ptr(rowsOf(header, "K1,L1,A,x,0,0,0,0", "K2,L1,A,1,0,0,0,0", "K2,L1,A,1,0,0,0,0")), []string{
				`in.yaml:5: columns[0].b: "3.5 kN" is a force, expected a length`,
				`in.yaml:10: columns[0].storeys[1]: the actions table "t.csv" has no case of column K1, lift L2`,
				`t.csv:2: NEd_kN: "x" is not a number; give a plain number, in the unit the column's name says (kN)`,
				`t.csv:4: case: case "A" of column K2, lift L1 is given twice (first on line 3)`}},
	}
	for _, c := range tests {
		texts := map[string]string{}
		if c.table != nil {
			texts["t.csv"] = *c.table
		}
		_, _, err := ParseWarn("in.yaml", []byte(c.yaml), files(texts))
		checkErrors(t, c.name, err, c.want)
	}
}

func ptr(s string) *string { return &s }

// Parse reads no file: an input with an actions table is refused at actions.
func TestParseReadsNoTable(t *testing.T) {
	_, err := Parse("in.yaml", []byte(withTable))
	want := `in.yaml:2: actions: cannot read the actions table "t.csv": this program reads no file beside the input file (the command line does)`
	if err == nil || err.Error() != want {
		t.Errorf("got %v, want %s", err, want)
	}
}

// moment_signs means nothing to the building form: a warning, and the input is read.
func TestBuildingMomentSignsWarning(t *testing.T) {
	in, warns, err := ParseWarn("in.yaml", []byte("moment_signs: member-ends\n"+building), nil)
	if err != nil {
		t.Fatal(err)
	}
	if len(warns) != 1 || warns[0].String() != "in.yaml:1: moment_signs: not used: the building form derives its end moments" {
		t.Errorf("warnings %v", warns)
	}
	if in.Building == nil {
		t.Error("no building")
	}
}

// The demo of the actions table reads without faults or warnings, with at least 12 cases a
// lift, a tension case and some shear forces.
func TestCasesDemo(t *testing.T) {
	path := "../../testdata/cases.yaml"
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	read := func(name string) ([]byte, error) { return os.ReadFile(filepath.Join(filepath.Dir(path), name)) }
	in, warns, err := ParseWarn(path, data, read)
	if err != nil {
		t.Fatal(err)
	}
	if len(warns) > 0 {
		t.Errorf("warnings: %v", warns)
	}
	if in.Actions == nil || in.Actions.Name != "cases.csv" || in.MomentSigns != model.SignsMemberEnds {
		t.Errorf("actions %v, signs %q", in.Actions != nil, in.MomentSigns)
	}
	tension, shear := 0, 0
	for _, c := range in.Columns {
		for _, s := range c.Storeys {
			if len(s.Cases) < 12 {
				t.Errorf("%s/%s has %d cases, want at least 12", c.ID, s.Name, len(s.Cases))
			}
			for _, k := range s.Cases {
				if k.NEd < 0 {
					tension++
				}
				if k.HasV[0] || k.HasV[1] {
					shear++
				}
			}
		}
	}
	if tension == 0 || shear == 0 {
		t.Errorf("%d tension cases and %d with shear forces, want some of each", tension, shear)
	}
}

// FuzzActionsCSV reads any bytes as an actions table without a panic: faults carry the table's
// name and a line, and the cases read are finite and within the limits.
func FuzzActionsCSV(f *testing.F) {
	f.Add([]byte(rowsOf(header+",Vy_kN,Vz_kN", "K1,L1,ULS-1,2150,85,-40,10,10,38,6", "K1,L2,G,1000,0,0,0,0,,")))
	f.Add([]byte("\uFEFF" + strings.ReplaceAll(rowsOf(strings.ReplaceAll(header, ",", ";"), "K1;L1;A;-120,5;1,5;0;0;0", `"K2";"L1";"B";1;0;0;0;0`), "\n", "\r\n")))
	f.Add([]byte(rowsOf("Remark,case,lift,column,NEd_kN", `x,"a""b",L1,K1,1e400`)))
	f.Add([]byte("column\n\"unterminated\n"))
	f.Add([]byte(""))
	if data, err := os.ReadFile("../../testdata/cases.csv"); err == nil {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		for _, signs := range []string{model.SignsFace, model.SignsMemberEnds} {
			got := readTable("f.csv", data, signs)
			for _, e := range got.errs {
				if e.File != "f.csv" || e.Line < 1 || e.Msg == "" {
					t.Fatalf("bad fault %+v", e)
				}
			}
			for _, w := range got.warns {
				if w.File != "f.csv" || w.Line < 1 {
					t.Fatalf("bad warning %+v", w)
				}
			}
			for _, r := range got.rows {
				if r.column == "" || r.lift == "" {
					t.Fatalf("row without its column or lift: %+v", r)
				}
				if !r.ok {
					continue
				}
				c := r.c
				for _, v := range []float64{c.NEd, c.MY.Top, c.MY.Bottom, c.MZ.Top, c.MZ.Bottom, c.V[0], c.V[1]} {
					if math.IsNaN(v) || math.IsInf(v, 0) {
						t.Fatalf("non-finite value accepted: %+v", c)
					}
				}
				if c.Name == "" || c.File != "f.csv" || c.Line < 1 || !limitAxial.within(c.NEd) {
					t.Fatalf("invalid case accepted: %+v", c)
				}
			}
			if len(got.errs) == 0 {
				for _, r := range got.rows {
					if !r.ok {
						t.Fatalf("a row with a fault and no fault reported: %+v", r)
					}
				}
			}
		}
		// The whole input with this table: refused with Errors, or every lift has its cases.
		in, _, err := ParseWarn("in.yaml", []byte(withTable), files(map[string]string{"t.csv": string(data)}))
		if err != nil {
			var es Errors
			if !errors.As(err, &es) || len(es) == 0 {
				t.Fatalf("error %v is not a non-empty Errors", err)
			}
			return
		}
		for _, c := range in.Columns {
			for _, s := range c.Storeys {
				if len(s.Cases) == 0 {
					t.Fatalf("%s/%s accepted without a case", c.ID, s.Name)
				}
			}
		}
	})
}
