package archive

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Compare lists the changed input and results of exactly the design whose load changed, and the input hashes.
func TestCompareChangedLoad(t *testing.T) {
	old := writeBundle(t, readTree(t, filepath.Join("testdata", "small")))
	revised := readTree(t, filepath.Join("testdata", "revised"))
	c, err := Compare(old, writeBundle(t, revised))
	if err != nil {
		t.Fatal(err)
	}
	// K1/L1: NEd 1200 kN → 1300 kN; η = N/(17 MPa · 90000 mm²): 1200000/1530000 → 1300000/1530000.
	want := []Change{
		{"K1", "L1", "input `act/NEd`: Design axial force, N\\_Ed", "1200 kN", "1300 kN"},
		{"K1", "L1", "result N\\_Ed", "1200 kN", "1300 kN"},
		{"K1", "L1", "result utilization", "0.7843", "0.8497"},
	}
	if len(c.Rows) != len(want) {
		t.Fatalf("%d rows, want %d: %+v", len(c.Rows), len(want), c.Rows)
	}
	for i, w := range want {
		if c.Rows[i] != w {
			t.Errorf("row %d = %+v, want %+v", i, c.Rows[i], w)
		}
	}
	md := string(c.Markdown())
	for _, w := range []string{
		"| Column | Lift | Item | Old | New |\n| --- | --- | --- | --- | --- |\n",
		"| K1 | L1 | input `act/NEd`: Design axial force, N\\_Ed | 1200 kN | 1300 kN |\n",
		"- Input SHA-256: `" + Sum(readTree(t, filepath.Join("testdata", "small"))["input/small.yaml"]) + "` → `" + Sum(revised["input/small.yaml"]) + "`",
		"- Input file: `small.yaml`\n",
	} {
		if !strings.Contains(md, w) {
			t.Errorf("Markdown lacks %q:\n%s", w, md)
		}
	}
	if strings.Contains(md, "K3") || strings.Contains(md, "L2") {
		t.Errorf("designs that did not change are listed:\n%s", md)
	}
	if again := string(c.Markdown()); again != md {
		t.Error("Markdown is not deterministic")
	}
}

// Equal bundles say no changes; a bundle with a design more or less lists it as added or removed.
func TestCompareDesigns(t *testing.T) {
	small := readTree(t, filepath.Join("testdata", "small"))
	a, b := writeBundle(t, small), writeBundle(t, small)
	c, err := Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	if !c.Empty() || !strings.Contains(string(c.Markdown()), "No changes") || strings.Contains(string(c.Markdown()), "| Column |") {
		t.Errorf("equal bundles:\n%s", c.Markdown())
	}
	editResults(t, b, func(d []any) {
		d[2].(map[string]any)["column"] = "K4"
	})
	c, err = Compare(a, b)
	if err != nil {
		t.Fatal(err)
	}
	md := string(c.Markdown())
	for _, w := range []string{"| K4 | L1 | design added | — | status pass, utilization 0.6536 |", "| K3 | L1 | design removed | status pass, utilization 0.6536 | — |"} {
		if !strings.Contains(md, w) {
			t.Errorf("Markdown lacks %q:\n%s", w, md)
		}
	}
	// A bundle written by design, without a manifest, compares on results.json alone.
	os.Remove(filepath.Join(b, ManifestName))
	if c, err = Compare(a, b); err != nil || c.New.InputName != "" || c.New.InputSHA256 != c.Old.InputSHA256 {
		t.Errorf("without a manifest: %v %+v", err, c)
	}
	if _, err := Compare(a, filepath.Join(b, "none")); err == nil || !strings.Contains(err.Error(), "results.json") {
		t.Errorf("no results: %v", err)
	}
	os.WriteFile(filepath.Join(b, ResultsName), []byte(`{"designs": [{"column": "K1", "storey": "L1"}, {"column": "K1", "storey": "L1"}]}`), 0o644)
	if _, err := Compare(a, b); err == nil || !strings.Contains(err.Error(), "designs[1]") {
		t.Errorf("a design listed twice: %v", err)
	}
}

// Numbers are shown in the trade's units with four significant figures, or as many as it takes to tell two apart.
func TestPairFormats(t *testing.T) {
	for _, tc := range []struct {
		old, new float64
		ou, nu   string
		wo, wn   string
	}{
		{1200e3, 1300e3, "N", "N", "1200 kN", "1300 kN"},
		{85e6, 85.25e6, "Nmm", "Nmm", "85 kNm", "85.25 kNm"},
		{3380e3, 3380.4e3, "N", "N", "3380 kN", "3380.4 kN"},
		{0.95, 0.9500001, "", "", "0.95", "0.9500001"},
		{1256.637, 1256.6, "mm2", "mm2", "1256.64 mm²", "1256.6 mm²"},
		{-0.00001234, 2e20, "", "", "-1.234e-05", "2e+20"},
		{20, 20, "mm", "MPa", "20 mm", "20 MPa"},
	} {
		if o, n := pair(tc.old, tc.new, tc.ou, tc.nu); o != tc.wo || n != tc.wn {
			t.Errorf("pair(%g, %g, %q, %q) = %q, %q; want %q, %q", tc.old, tc.new, tc.ou, tc.nu, o, n, tc.wo, tc.wn)
		}
	}
	if got := escape("a|b_c*d"); got != `a\|b\_c\*d` {
		t.Errorf("escape = %q", got)
	}
}
