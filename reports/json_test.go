package reports

import (
	"bytes"
	"encoding/json"
	"hash/maphash"
	"math"
	"os"
	"reflect"
	"slices"
	"strings"
	"testing"

	"colsheet/calc/design"
	yamlinput "colsheet/calc/input"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// packBuilding is a small building form with two imposed-load categories, creep data, a façade
// and fire; every number is invented test input.
const packBuilding = `project: {title: Packing test, job: P-1, revision: A, designer: A. Berg, checker: C. Dahl}
materials: {concrete: C32/40, fyk: 500 MPa, aggregate: 20 mm}
design: {durability: {exposure: [XC1]}, fire: {rating: R60}}
building:
  storeys:
    - {name: L1, height: 3.6 m}
    - {name: L2, height: 3.3 m}
    - {name: R, height: 3.3 m}
  grid: {x: [6.0 m, 5.0 m], y: [5.5 m]}
  columns: {b: 300 mm, h: 350 mm, cover: 35 mm}
  beams: {b: 300 mm, h: 500 mm}
  floors:
    - {levels: [L1, L2], gk: 5.5 kN/m2, qk: 3 kN/m2, category: C, spans: y}
    - {levels: [R], gk: 4 kN/m2, qk: 0.6 kN/m2, category: H, spans: y}
  line_loads:
    - {levels: [L1, L2], line: A, gk: 8 kN/m}
  creep: {rh: 50, t0: 28}
  base: fixed
`

// runFile designs the input file name, or the text src when name is empty.
func runFile(t testing.TB, name, src string) *design.Result {
	t.Helper()
	r, err := design.Run(parseFile(t, name, src))
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// parseFile reads the input of the file name, or of src when name is empty.
func parseFile(t testing.TB, name, src string) *model.Input {
	t.Helper()
	data := []byte(src)
	if name != "" {
		var err error
		if data, err = os.ReadFile(name); err != nil {
			t.Fatal(err)
		}
	} else {
		name = "pack.yaml"
	}
	in, err := yamlinput.Parse(name, data)
	if err != nil {
		t.Fatal(err)
	}
	return in
}

// results.json read back gives every step of the basis and of every design as the engine
// recorded it: the same ID, title, clause, kind, symbol, expression, arguments (name, value,
// unit, source), value, unit, notes, cautions and every other field (common practice, no
// source: a lossless store). The file is compact, and each form is stored once.
func TestJSONRoundTrip(t *testing.T) {
	for _, tc := range []struct{ name, file, src string }{
		{"actions form", "../testdata/columns.yaml", ""},
		{"building form", "", packBuilding},
	} {
		r := runFile(t, tc.file, tc.src)
		b, err := JSON(r)
		if err != nil {
			t.Fatal(err)
		}
		if bytes.Contains(b, []byte("\n ")) || !bytes.HasSuffix(b, []byte("}\n")) || bytes.Count(b, []byte("\n")) != 1 {
			t.Errorf("%s: results.json is not compact on one line", tc.name)
		}
		got, err := ReadSteps(b)
		if err != nil {
			t.Fatal(err)
		}
		if len(r.Basis) == 0 || !reflect.DeepEqual(got.Basis, r.Basis) {
			t.Errorf("%s: the basis read back differs (%d steps, %d recorded)", tc.name, len(got.Basis), len(r.Basis))
		}
		if len(got.Designs) != len(r.Designs) {
			t.Fatalf("%s: %d designs read back, %d designed", tc.name, len(got.Designs), len(r.Designs))
		}
		steps := 0
		for k, d := range r.Designs {
			want, back := d.Trace(), got.Designs[k]
			steps += len(want)
			if back.Column != d.Column || back.Storey != d.Storey || len(back.Steps) != len(want) {
				t.Fatalf("%s: design %d read back as %s/%s with %d steps, want %s/%s with %d", tc.name, k, back.Column, back.Storey, len(back.Steps), d.Column, d.Storey, len(want))
			}
			for i := range want {
				if !reflect.DeepEqual(back.Steps[i], want[i]) {
					t.Errorf("%s: step read back\n%+v\nwant\n%+v", tc.name, back.Steps[i], want[i])
				}
			}
		}
		var doc struct {
			Forms []json.RawMessage `json:"forms"`
		}
		if err := json.Unmarshal(b, &doc); err != nil {
			t.Fatal(err)
		}
		seen := map[string]bool{}
		for _, f := range doc.Forms {
			if seen[string(f)] {
				t.Errorf("%s: form stored twice: %s", tc.name, f)
			}
			seen[string(f)] = true
			for _, k := range []string{`"id"`, `"value"`, `"verdict"`, `"residual"`} {
				if bytes.Contains(f, []byte(k+":")) {
					t.Errorf("%s: form holds %s: %s", tc.name, k, f)
				}
			}
		}
		if len(doc.Forms) == 0 || len(doc.Forms) >= steps+len(r.Basis) {
			t.Errorf("%s: %d forms for %d steps", tc.name, len(doc.Forms), steps+len(r.Basis))
		}
	}
}

// A trace entry without a form is a whole step, as earlier versions wrote them: read as it is.
// A form's source relative to the design names the design's own step; one from the root, any.
func TestReadStepsWhole(t *testing.T) {
	data := []byte(`{"forms": [{"title": "Gross concrete area", "clause": "common practice", "kind": "formula", "symbol": "A_c",
	  "expr": "b * h", "unit": "mm2", "args": [{"name": "b", "symbol": "b", "unit": "mm", "from": "geo/b"}, {"name": "h", "symbol": "h", "from": "/basis/x/h"}]}],
	  "basis": [{"id": "basis/x/h", "title": "Depth", "clause": "input", "kind": "input", "symbol": "h", "value": 500, "unit": "mm"}],
	  "designs": [{"column": "K1", "storey": "L1", "trace": [
	    {"id": "K1/L1/geo/b", "title": "Width", "clause": "input", "kind": "input", "symbol": "b", "value": 300, "unit": "mm"},
	    {"id": "K1/L1/geo/Ac", "form": 0, "value": 150000, "args": [300, 500]}]}]}`)
	got, err := ReadSteps(data)
	if err != nil {
		t.Fatal(err)
	}
	ac := got.Designs[0].Steps[1]
	want := trace.Formula("K1/L1/geo/Ac", "Gross concrete area", "common practice", "A_c", "mm2", 150000, "b * h",
		trace.Arg{Name: "b", Symbol: "b", Value: 300, Unit: "mm", From: "K1/L1/geo/b"}, trace.Arg{Name: "h", Symbol: "h", Value: 500, From: "basis/x/h"})
	if !reflect.DeepEqual(ac, want) || got.Designs[0].Steps[0].Value != 300 || got.Basis[0].ID != "basis/x/h" {
		t.Errorf("read back %+v, want %+v", ac, want)
	}
	for _, bad := range []string{`"form": 1, "value": 1, "args": [300, 500]`, `"form": 0, "value": 1, "args": [300]`} {
		b := bytes.Replace(data, []byte(`"form": 0, "value": 150000, "args": [300, 500]`), []byte(bad), 1)
		if _, err := ReadSteps(b); err == nil || !strings.Contains(err.Error(), "K1/L1/geo/Ac") {
			t.Errorf("%s: error %v does not name the step", bad, err)
		}
	}
}

// BenchmarkJSONDemo measures results.json of the shipped demo building (target: at most 15 MB,
// issue 11); the size is reported as the metric "bytes".
func BenchmarkJSONDemo(b *testing.B) {
	r := runFile(b, "../testdata/demo.yaml", "")
	design.AddInteraction(r)
	b.ResetTimer()
	var n int
	for i := 0; i < b.N; i++ {
		js, err := JSON(r)
		if err != nil {
			b.Fatal(err)
		}
		n = len(js)
	}
	b.ReportMetric(float64(n), "bytes")
}

// WriteJSON streams one design at a time, yet its bytes are those of the whole document encoded
// at once: read back into jsonResult and encoded whole (compact, no HTML escapes) they come out
// the same, interaction curves, exact biaxial results and a basis with "<" in its text included
// (common practice, no source: a streamed writer must not change the file).
func TestWriteJSONIsWholeEncoding(t *testing.T) {
	for _, tc := range []struct{ name, file, src string }{
		{"actions form", "../testdata/columns.yaml", ""},
		{"building form", "", packBuilding},
	} {
		r := runFile(t, tc.file, tc.src)
		design.AddInteraction(r)
		wholeEncoding(t, tc.name, r)
	}
}

// wholeEncoding checks that results.json of r streamed is the whole document encoded at once.
func wholeEncoding(t *testing.T, name string, r *design.Result) {
	t.Helper()
	var streamed bytes.Buffer
	if err := WriteJSON(&streamed, r); err != nil {
		t.Fatal(err)
	}
	// jsonResult with the code read back as it stands (its overrides only marshal).
	var whole struct {
		Tool        jsonTool          `json:"tool"`
		InputSHA256 string            `json:"input_sha256"`
		Code        json.RawMessage   `json:"code"`
		Designs     []jsonDesign      `json:"designs"`
		Sizes       []jsonSize        `json:"size_search,omitempty"`
		Basis       []jsonStep        `json:"basis"`
		Forms       []json.RawMessage `json:"forms"`
	}
	if err := json.Unmarshal(streamed.Bytes(), &whole); err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	if len(whole.Designs) != len(r.Designs) || len(whole.Designs) == 0 || (r.Designs[0].Interaction != nil) != (whole.Designs[0].Interaction != nil) {
		t.Fatalf("%s: %d designs read back of %d", name, len(whole.Designs), len(r.Designs))
	}
	var again bytes.Buffer
	enc := json.NewEncoder(&again)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(whole); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(streamed.Bytes(), again.Bytes()) {
		a, b := streamed.Bytes(), again.Bytes()
		i := 0
		for i < len(a) && i < len(b) && a[i] == b[i] {
			i++
		}
		t.Errorf("%s: streamed results.json differs from the whole encoding at byte %d of %d/%d", name, i, len(a), len(b))
	}
}

// Every design names its shape right after h_mm ("rectangle" or "circle"), a circle its
// diameter D_mm after that, and its links their type first (rectangular, circular or helix; a
// design that names none gets the kind of its shape); streamed, the file is still the whole
// encoding (common practice, no source: the keys agreed for circular columns).
func TestJSONCircle(t *testing.T) {
	for _, tc := range []struct {
		links string
		want  []string
	}{
		{design.LinksHelix, []string{`"b_mm":450,"h_mm":450,"shape":"circle","D_mm":450,"cover_mm":40,`, `"links":{"type":"helix","dia_mm":8,`,
			`"b_mm":300,"h_mm":300,"shape":"rectangle","cover_mm":35,`, `"links":{"type":"rectangular","dia_mm":6,`}},
		{design.LinksCircular, []string{`"shape":"circle","D_mm":450,`, `"links":{"type":"circular","dia_mm":8,`}},
		{"", []string{`"shape":"circle","D_mm":450,`, `"links":{"type":"circular","dia_mm":8,`}},
	} {
		r := circleSample(t, tc.links)
		b, err := JSON(r)
		if err != nil {
			t.Fatal(err)
		}
		for _, w := range tc.want {
			if !bytes.Contains(b, []byte(w)) {
				t.Errorf("%q: results.json lacks %s", tc.links, w)
			}
		}
		if n := bytes.Count(b, []byte(`"D_mm"`)); n != 1 {
			t.Errorf("%q: D_mm given %d times, want once (the circle only)", tc.links, n)
		}
		var doc struct {
			Designs []struct {
				Shape string   `json:"shape"`
				D     *float64 `json:"D_mm"`
				B     float64  `json:"b_mm"`
				Bars  jsonBars `json:"bars"`
			} `json:"designs"`
		}
		if err := json.Unmarshal(b, &doc); err != nil {
			t.Fatal(err)
		}
		c := doc.Designs[0]
		if c.Shape != "circle" || c.D == nil || *c.D != 450 || len(c.Bars.Positions) != 8 {
			t.Errorf("%q: circle read back as %+v", tc.links, c)
		}
		// The bars read back on their circle, 450/2 − 40 − 8 − 20/2 = 167 mm from the centre (geometry).
		for _, p := range c.Bars.Positions {
			if math.Abs(math.Hypot(p[0], p[1])-167) > 1e-9 {
				t.Errorf("%q: bar at (%g, %g), not on the circle of radius 167", tc.links, p[0], p[1])
			}
		}
		wholeEncoding(t, "circle "+tc.links, r)
		// The interaction data of a circle (both curves in its worst direction) stream alike.
		r.Designs[0].Interaction = engineDesign(t).Interaction
		wholeEncoding(t, "circle with curves "+tc.links, r)
	}
}

// The hand-written encoders of packed steps give the bytes of encoding/json (the reference
// library; compact, no HTML escapes) for awkward strings and numbers.
func TestStepEncodingMatchesEncodingJSON(t *testing.T) {
	strs := []string{"", "K1/L1/geo/b", "a\"b\\c", "tab\tnew\nline\r", "\x00\x01\x1f", "<&>", "λ φ_ef ≤ 1", "\u2028\u2029", "bad\xffutf8", "é\xc3"}
	nums := []float64{0, math.Copysign(0, -1), 1, -1, 0.1, 1e-6, 9.99e-7, 1e-7, 1.5e-9, 1e20, 1e21, 1.234e25, -3.3e-12, 123456789.125, math.SmallestNonzeroFloat64, math.MaxFloat64,
		// whole numbers, written as integers below 1e15
		6000, -26e6, 999999999999999, -999999999999999, 1e15, 1e15 + 2, 1 << 53, -(1 << 53), 4.5e15, 123456789012345678}
	for k := 0; k < 2000; k++ { // whole numbers of every size, common practice, no source
		v := math.Trunc(math.Pow(10, float64(k%20)) * (1 + float64(k)/7))
		nums = append(nums, v, -v)
	}
	for _, s := range strs {
		want, _ := json.Marshal(s)
		var b bytes.Buffer
		enc := json.NewEncoder(&b)
		enc.SetEscapeHTML(false)
		enc.Encode(s)
		want = bytes.TrimSuffix(b.Bytes(), []byte("\n"))
		if got := appendJSONString(nil, "", s); !bytes.Equal(got, want) {
			t.Errorf("string %q: got %s, want %s", s, got, want)
		}
	}
	for _, v := range nums {
		want, _ := json.Marshal(v)
		if got := appendJSONFloat(nil, v); !bytes.Equal(got, want) {
			t.Errorf("float %g: got %s, want %s", v, got, want)
		}
	}
}

// The form of a step (sameForm, formHash) covers every field of trace.Step: a new field must be
// added to it (or to the fields a packed step carries itself), or steps differing only in it
// would share a form.
func TestFormKeyCoversStep(t *testing.T) {
	known := map[string]bool{"ID": true, "Group": true, "Title": true, "Clause": true, "Kind": true, "Symbol": true,
		"Expr": true, "Args": true, "Value": true, "Unit": true, "Row": true, "Method": true, "Verify": true,
		"Residual": true, "Relation": true, "Verdict": true, "Notes": true, "Cautions": true, "Show": true,
		// The rarer parts, read through the methods of the same names.
		"more": true, "row": true, "method": true, "verify": true, "residual": true, "notes": true, "cautions": true}
	ty := reflect.TypeOf(trace.Step{})
	for i := 0; i < ty.NumField(); i++ {
		if !known[ty.Field(i).Name] {
			t.Errorf("trace.Step.%s is not in the form", ty.Field(i).Name)
		}
	}
	more, _ := ty.FieldByName("more")
	for i := 0; i < more.Type.Elem().NumField(); i++ {
		if !known[more.Type.Elem().Field(i).Name] {
			t.Errorf("the part %s of trace.Step is not in the form", more.Type.Elem().Field(i).Name)
		}
	}
	base := trace.Formula("x", "T", "c", "s", "mm", 1, "a", trace.Arg{Name: "a", Symbol: "a", Unit: "mm", From: "f"})
	variants := []func(s *trace.Step){
		func(s *trace.Step) { s.Group = "g" }, func(s *trace.Step) { s.Title = "U" },
		func(s *trace.Step) { s.Args[0].From = "g" }, func(s *trace.Step) { *s = s.Note("n") },
		func(s *trace.Step) { *s = s.Caution("") }, func(s *trace.Step) { s.Show = &trace.Display{} },
		func(s *trace.Step) { s.Title, s.Clause = "Tc", "" }, // lengths keep fields apart
	}
	seed := maphash.MakeSeed()
	h0 := formHash(seed, &base)
	for i, v := range variants {
		s := base
		s.Args = slices.Clone(base.Args)
		v(&s)
		if sameForm(&s, &base) || formHash(seed, &s) == h0 {
			t.Errorf("variant %d shares the form (or its hash) of the base step", i)
		}
	}
	same := base
	same.ID, same.Value, same.Verdict = "y", 2, "pass"
	if !sameForm(&same, &base) || formHash(seed, &same) != h0 {
		t.Error("ID, value or verdict changed the form")
	}
}

// formByMaps is the form of a step made with encoding/json itself (the reference library):
// the step marshalled, its varying keys deleted, the maps marshalled again in key order.
func formByMaps(t *testing.T, s trace.Step) []byte {
	t.Helper()
	key, err := json.Marshal(s)
	if err != nil {
		t.Fatal(err)
	}
	var m map[string]json.RawMessage
	if err := json.Unmarshal(key, &m); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"id", "value", "residual", "verdict"} {
		delete(m, k)
	}
	if raw, ok := m["args"]; ok {
		var args []map[string]json.RawMessage
		if err := json.Unmarshal(raw, &args); err != nil {
			t.Fatal(err)
		}
		for _, a := range args {
			delete(a, "value")
		}
		if m["args"], err = json.Marshal(args); err != nil {
			t.Fatal(err)
		}
	}
	b, err := json.Marshal(m)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// formJSON writes the bytes encoding/json gives for a form, for every step of the building
// form's results and for steps with every optional field, HTML characters and escapes.
func TestFormJSONMatchesEncodingJSON(t *testing.T) {
	r := runFile(t, "", packBuilding)
	steps := slices.Clone(r.Basis)
	for _, d := range r.Designs {
		steps = append(steps, d.Steps...)
	}
	odd := trace.Solve("x", "A <b> & \"c\"\n", "EN 1992 & co", "σ_<", "N/mm2", 1, "m", "v < 1", 0.5,
		trace.Arg{Name: "a", Symbol: "a&b", Unit: "", From: "/basis/x"}, trace.Arg{Name: "b", Symbol: "b", Unit: "mm"})
	odd.Group, odd.Relation = "G\u2028", "a ≤ b"
	odd = odd.WithRow("row <1>").Note("n1").Note("").Caution("c\x01")
	for _, show := range []*trace.Display{nil, {}, {Expr: "a < b"}, {Result: "yes"}, {Expr: "e", Result: "r"}} {
		s := odd
		s.Show = show
		steps = append(steps, s)
	}
	for _, s := range steps {
		if got, want := formJSON(nil, &s), formByMaps(t, s); !bytes.Equal(got, want) {
			t.Fatalf("step %s: form\n%s\nwant\n%s", s.ID, got, want)
		}
	}
}
