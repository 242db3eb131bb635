package input

import (
	"os"
	"strings"
	"testing"
	"time"
)

// The bad inputs of issue 13, each refused with file, line, field and its message. The limits
// themselves are common practice (see Limits and the README); the cases only check that a value
// outside them is refused and one inside is read.
func TestInputLimits(t *testing.T) {
	col := func(b, h, cover, l0, ned string) string {
		return "materials: {concrete: C30/37}\ncolumns:\n  - id: K1\n    b: " + b + "\n    h: " + h + "\n    cover: " + cover +
			"\n    storeys:\n      - name: L1\n        l0: " + l0 + "\n        NEd: " + ned + "\n"
	}
	good := col("350 mm", "500 mm", "40 mm", "{y: 3.0 m, z: 3.0 m}", "2150 kN")
	cases := []struct {
		name, text string
		want       []string
	}{
		{"metres meant, millimetres read", col("350 mm", "500 mm", "40 mm", "{y: 3.0, z: 3.0}", "2150 kN"), []string{
			`in.yaml:9: columns[0].storeys[0].l0.y: 3.0 is read as 3 mm, less than the least plausible effective length l0 of 300 mm; for metres write the unit: "3.0 m"`,
			`in.yaml:9: columns[0].storeys[0].l0.z: 3.0 is read as 3 mm, less than the least plausible effective length l0 of 300 mm; for metres write the unit: "3.0 m"`}},
		{"one bare l0", col("350 mm", "500 mm", "40 mm", "3", "2150 kN"), []string{
			`in.yaml:9: columns[0].storeys[0].l0: 3 is read as 3 mm, less than the least plausible effective length l0 of 300 mm; for metres write the unit: "3 m"`}},
		{"l0 shorter than the section", col("350 mm", "500 mm", "40 mm", "{y: 320, z: 3 m}", "2150 kN"), []string{
			`in.yaml:9: columns[0].storeys[0].l0.y: l0 = 320 mm is shorter than the section's smaller side 350 mm: not a column`}},
		{"section of 1e9 m", col("1e9 m", "500 mm", "40 mm", "3 m", "2150 kN"), []string{
			`in.yaml:4: columns[0].b: 1e+12 mm is outside the plausible range of the section side, 150 mm to 3000 mm (see the input limits in the README)`}},
		{"1e300 kN", col("350 mm", "500 mm", "40 mm", "3 m", "1e300 kN"), []string{
			`in.yaml:10: columns[0].storeys[0].NEd: 1e+300 kN is outside the plausible range of the design axial force, -100000 kN to 100000 kN (see the input limits in the README)`}},
		{"overflow to infinity", col("350 mm", "500 mm", "40 mm", "3 m", "1e308 MN"), []string{
			`in.yaml:10: columns[0].storeys[0].NEd: "1e308 MN" is not a finite number`}},
		{"cover too small", col("350 mm", "500 mm", "5 mm", "3 m", "2150 kN"), []string{
			`in.yaml:6: columns[0].cover: 5 mm is outside the plausible range of the nominal cover, 10 mm to 100 mm (see the input limits in the README)`}},
		{"bar of 4 mm", strings.Replace(good, "    cover: 40 mm\n", "    cover: 40 mm\n    bars: {count: 4, dia: 4}\n", 1), []string{
			`in.yaml:7: columns[0].bars.dia: 4 mm is outside the plausible range of the longitudinal bar diameter, 8 mm to 50 mm (see the input limits in the README)`}},
		{"date that does not exist", "project: {date: 2026-02-30}\n" + good, []string{
			`in.yaml:1: project.date: "2026-02-30" is not a date of the form 2026-12-01`}},
		{"date in another form", "project: {date: 30.11.2026}\n" + good, []string{
			`in.yaml:1: project.date: "30.11.2026" is not a date of the form 2026-12-01`}},
		{"tab inside the indentation", strings.Replace(good, "    h: 500 mm", "\th: 500 mm", 1), []string{
			`in.yaml:5: tab character: use spaces`}},
		{"tab after a dash", strings.Replace(good, "      - name: L1", "      -\tname: L1", 1), []string{
			`in.yaml:8: tab character: use spaces`}},
		{"l0 bare and shorter than the section", col("350 mm", "500 mm", "40 mm", "{y: 3 m, z: 320}", "2150 kN"), []string{
			`in.yaml:9: columns[0].storeys[0].l0.z: l0 = 320 mm is shorter than the section's smaller side 350 mm: not a column`}},
		{"YAML syntax", "a: [1, 2\n", []string{`in.yaml:1: the file is not valid YAML: did not find expected ',' or ']'`}},
		{"comma in an unquoted title", "project: {title: a, foo, job: x}\n" + good, []string{
			`in.yaml:1: project.foo: unknown key (known here: title, job, revision, designer, checker, date)`}},
		{"var without a value", "vars: {span: 3 m, height}\n" + good, []string{
			`in.yaml:1: vars.height: has no value (give a number or a quantity, e.g. height: 350 mm)`}},
		{"power with ^", col("350 mm", "500 mm", "40 mm", "3 m", `"2 ^ 10"`), []string{
			`in.yaml:10: columns[0].storeys[0].NEd: "2 ^ 10": ^ is not a power here; use ** for powers (a ** 2)`}},
	}
	for _, c := range cases {
		start := time.Now()
		_, err := Parse("in.yaml", []byte(c.text))
		if d := time.Since(start); d > time.Second {
			t.Errorf("%s: parsing took %v", c.name, d)
		}
		if err == nil {
			t.Errorf("%s: no error, want %q", c.name, c.want)
			continue
		}
		if got := err.Error(); got != strings.Join(c.want, "\n") {
			t.Errorf("%s:\n got: %s\nwant: %s", c.name, got, strings.Join(c.want, "\n"))
		}
	}
	if _, err := Parse("in.yaml", []byte(good)); err != nil {
		t.Errorf("the plausible column is refused: %v", err)
	}
	if _, err := Parse("in.yaml", []byte("project: {date: 2026-11-30}\n"+good)); err != nil {
		t.Errorf("a good date is refused: %v", err)
	}
}

// An error message never names a library: the bad inputs above and YAML syntax faults.
func TestMessagesNameNoLibrary(t *testing.T) {
	texts := []string{
		"a: [1, 2\n", "a: {b\n", "a: b: c\n", "- a\nb: c\n", "a: *x\n", "a: !!int b\n", "a: 'b\n",
		"materials: {concrete: C30/37}\ncolumns: [{id: K1, b: \"2 ^ 3\", h: \"sqrt(\", cover: \"1e999\", storeys: [{name: L1, l0: \"x\", NEd: \"1 kN m\"}]}]\n",
	}
	for _, text := range texts {
		_, err := Parse("in.yaml", []byte(text))
		if err == nil {
			t.Errorf("%q: no error", text)
			continue
		}
		msg := strings.ReplaceAll(err.Error(), "in.yaml:", "")
		for _, word := range []string{"govaluate", "yaml:", "yaml.v3", "strconv", "unmarshal", "panic"} {
			if strings.Contains(msg, word) {
				t.Errorf("%q: the message names %q: %s", text, word, err)
			}
		}
	}
}

// limitsTable is the README's table of the input limits.
func limitsTable() string {
	var sb strings.Builder
	sb.WriteString("| quantity | plausible range | reason |\n| --- | --- | --- |\n")
	for _, l := range Limits {
		sb.WriteString("| " + l.What + " | " + show(l.Min, l.Unit) + " to " + show(l.Max, l.Unit) + " | " + l.Reason + " |\n")
	}
	return sb.String()
}

// The README lists every limit as the code holds it.
func TestLimitsDocumented(t *testing.T) {
	data, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	if want := limitsTable(); !strings.Contains(string(data), want) {
		t.Errorf("README.md does not hold the table of the input limits; it should read:\n%s", want)
	}
}
