package reports

import (
	"bufio"
	"bytes"
	"encoding/json"
	"fmt"
	"hash/maphash"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
	"sync"
	"unicode/utf8"

	"colsheet/calc/code"
	"colsheet/calc/design"
	"colsheet/calc/model"
	"colsheet/calc/section"
	"colsheet/calc/trace"
)

type jsonTool struct {
	Name    string `json:"name"`
	Version string `json:"version"`
}

// jsonOverrides marshals as an object from parameter name to value, in name order.
type jsonOverrides []code.Override

func (o jsonOverrides) MarshalJSON() ([]byte, error) {
	var b bytes.Buffer
	b.WriteByte('{')
	for i, x := range o {
		if i > 0 {
			b.WriteByte(',')
		}
		k, err := json.Marshal(x.Name)
		if err != nil {
			return nil, err
		}
		b.Write(k)
		b.WriteByte(':')
		v, err := json.Marshal(x.Value)
		if err != nil {
			return nil, err
		}
		b.Write(v)
	}
	b.WriteByte('}')
	return b.Bytes(), nil
}

type jsonCode struct {
	Standard  string        `json:"standard"`
	Annex     string        `json:"annex"`
	Overrides jsonOverrides `json:"overrides"`
}

type jsonAxis struct {
	L0M       float64 `json:"l0_m"`
	Lambda    float64 `json:"lambda"`
	LambdaLim float64 `json:"lambda_lim"`
	Slender   bool    `json:"slender"`
	M01       float64 `json:"M01_kNm"`
	M02       float64 `json:"M02_kNm"`
	Ei        float64 `json:"ei_mm"`
	M0Ed      float64 `json:"M0Ed_kNm"`
	M2        float64 `json:"M2_kNm"`
	PhiEf     float64 `json:"phi_ef"`
	MEd       float64 `json:"MEd_kNm"`
	MRd       float64 `json:"MRd_kNm"`
	// Shear along the lever arm of this bending (6.2); null where not checked, and VRd,max
	// where VEd ≤ VRd,c (no links designed for the shear).
	VEd    *float64 `json:"VEd_kN"`
	VRdC   *float64 `json:"VRd_c_kN"`
	VRdMax *float64 `json:"VRd_max_kN"`
}

type jsonAxes struct {
	Y jsonAxis `json:"y"`
	Z jsonAxis `json:"z"`
}

type jsonBiaxial struct {
	Checked bool    `json:"checked"`
	A       float64 `json:"a"`
	Ratio   float64 `json:"ratio"`
}

type jsonBars struct {
	Count     int          `json:"count"`
	Dia       float64      `json:"dia_mm"`
	Positions [][2]float64 `json:"positions_mm"`
}

type jsonLinks struct {
	Type           string   `json:"type"` // design.LinksRect, LinksCircular or LinksHelix
	Dia            float64  `json:"dia_mm"`
	Spacing        float64  `json:"spacing_mm"`
	SpacingReduced float64  `json:"spacing_reduced_mm"`
	SpacingShear   *float64 `json:"spacing_shear_mm"` // the largest spacing the shear allows, where below that of 9.5.3; null where shear does not govern
	SpacingLap     float64  `json:"spacing_lap_mm"`   // over the laps, 8.7.4 and 9.5.3(4); 0 where not detailed
	LapCount       int      `json:"lap_count"`        // links within the lap length; one more lies beyond each end
}

type jsonDesign struct {
	Column        string      `json:"column"`
	Storey        string      `json:"storey"`
	B             float64     `json:"b_mm"`
	H             float64     `json:"h_mm"`
	Shape         string      `json:"shape"`          // "rectangle" or "circle"
	D             *float64    `json:"D_mm,omitempty"` // the diameter of a circle
	Cover         float64     `json:"cover_mm"`
	Fck           float64     `json:"fck_MPa"`
	Fyk           float64     `json:"fyk_MPa"`
	NEd           float64     `json:"NEd_kN"`
	Axes          jsonAxes    `json:"axes"`
	Biaxial       jsonBiaxial `json:"biaxial"`
	AsReq         float64     `json:"As_req_mm2"`
	AsMin         float64     `json:"As_min_mm2"`
	AsMax         float64     `json:"As_max_mm2"`
	AsProv        float64     `json:"As_prov_mm2"`
	Bars          jsonBars    `json:"bars"`
	Links         jsonLinks   `json:"links"`
	Utilization   float64     `json:"utilization"`
	Status        string      `json:"status"`
	Governing     string      `json:"governing"`
	Steps         int         `json:"steps"`
	NRdMax        float64     `json:"NRd_max_kN"`
	Exact         *jsonExact  `json:"biaxial_exact,omitempty"`
	Interaction   *jsonCurves `json:"interaction,omitempty"`
	Reasons       []string    `json:"reasons"`
	Cautions      []string    `json:"cautions"`
	GoverningCase string      `json:"governing_case"`
	Cases         []jsonCase  `json:"cases"`
	Trace         []jsonStep  `json:"trace,omitempty"` // written by JSONStream.Design after the rest
}

// jsonCase is one load case of a design: its results with the design's bars.
type jsonCase struct {
	Name        string   `json:"name"`
	NEd         float64  `json:"NEd_kN"`
	Axes        jsonAxes `json:"axes"`
	Utilization float64  `json:"utilization"`
	Status      string   `json:"status"`
	Governing   string   `json:"governing"`
	Prefix      string   `json:"steps_prefix"` // what the IDs of its steps start with below COLUMN/LIFT/
}

// jsonExact is the exact biaxial resistance along the resultant design moment.
type jsonExact struct {
	MRd   float64 `json:"MRd_kNm"`
	MRdY  float64 `json:"MRd_y_kNm"`
	MRdZ  float64 `json:"MRd_z_kNm"`
	Ratio float64 `json:"ratio"`
	Angle float64 `json:"neutral_axis_deg"`
}

// jsonCurves holds the interaction data for plotting: [N kN, M kNm with the +face compressed,
// M kNm with the −face compressed] about each axis, and [My kNm, Mz kNm] round the contour at NEd.
type jsonCurves struct {
	NMY  [][3]float64 `json:"N_M_y"`
	NMZ  [][3]float64 `json:"N_M_z"`
	MyMz [][2]float64 `json:"My_Mz_at_NEd"`
}

type jsonResult struct {
	Tool        jsonTool          `json:"tool"`
	InputSHA256 string            `json:"input_sha256"`
	Code        jsonCode          `json:"code"`
	Designs     []jsonDesign      `json:"designs"`
	Sizes       []jsonSize        `json:"size_search,omitempty"`
	Basis       []jsonStep        `json:"basis"`
	Forms       []json.RawMessage `json:"forms"`
}

// sizeShape names a shape (model.ShapeRect or ShapeCircle) as results.json and the schedule give
// it: "rectangle" or "circle".
func sizeShape(shape string) string {
	if shape == model.ShapeCircle {
		return "circle"
	}
	return "rectangle"
}

// jsonSize is one column's result of the section-size finder.
type jsonSize struct {
	Column      string  `json:"column"`
	Found       bool    `json:"found"`
	Shape       string  `json:"shape"` // of the column, kept by the finder: "rectangle" or "circle" (b = h = D)
	B           float64 `json:"b_mm"`
	H           float64 `json:"h_mm"`
	GivenB      float64 `json:"given_b_mm"`
	GivenH      float64 `json:"given_h_mm"`
	AsProv      float64 `json:"As_prov_mm2"`
	Rho         float64 `json:"rho"`
	Utilization float64 `json:"utilization"`
	Tried       int     `json:"sizes_tried"`
}

func axisJSON(a design.Axis) jsonAxis {
	out := jsonAxis{L0M: a.L0 / 1e3, Lambda: a.Lambda, LambdaLim: a.LambdaLim, Slender: a.Slender,
		M01: a.M01 / 1e6, M02: a.M02 / 1e6, Ei: a.Ei, M0Ed: a.M0Ed / 1e6, M2: a.M2 / 1e6,
		PhiEf: a.PhiEf, MEd: a.MEd / 1e6, MRd: a.MRd / 1e6}
	kN := func(v float64) *float64 { v /= 1e3; return &v }
	if a.Shear {
		out.VEd, out.VRdC = kN(a.VEd), kN(a.VRdc)
		if a.LinksShear {
			out.VRdMax = kN(a.VRdMax)
		}
	}
	return out
}

// positive returns v, or nil where it is not above 0 (null in results.json).
func positive(v float64) *float64 {
	if v > 0 {
		return &v
	}
	return nil
}

func nonNil(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}

// JSON returns results.json (see WriteJSON) in memory.
func JSON(r *design.Result) ([]byte, error) {
	var b bytes.Buffer
	if err := WriteJSON(&b, r); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// WriteJSON writes results.json of r to w through a JSONStream (see there).
func WriteJSON(w io.Writer, r *design.Result) error {
	if r == nil {
		return fmt.Errorf("reports: no result")
	}
	s, err := NewJSONStream(w, toolName(r), r.ToolVersion, input(r))
	if err != nil {
		return err
	}
	for k := range r.Designs {
		if err := s.Design(&r.Designs[k]); err != nil {
			return err
		}
	}
	return s.End(r)
}

// JSONStream writes results.json one design at a time, compact on one line: the contract of
// DESIGN.md plus, per design, NRd_max_kN, reasons, cautions and the full trace, then the
// size search, the project basis (Result.Basis) once and the forms. The steps are packed (see
// packer): each names its form in the top-level "forms" list, written last, and carries its own
// ID and numbers; ReadSteps reads them back whole. Its bytes are those of the whole document
// encoded at once with encoding/json (compact, no HTML escapes). A number that is not finite
// is an error naming where it is, and what was written must then be discarded.
type JSONStream struct {
	e  *jsonWriter
	pk *packer
	n  int // designs written
}

// NewJSONStream starts results.json on w for the given program, version and input: everything
// before the first design.
func NewJSONStream(w io.Writer, tool, version string, in *model.Input) (*JSONStream, error) {
	for _, o := range in.Code.Overrides() {
		if !trace.Finite(o.Value) {
			return nil, fmt.Errorf("reports: code override %s is not finite", o.Name)
		}
	}
	s := &JSONStream{e: newJSONWriter(w), pk: newPacker()}
	s.e.raw(`{"tool":`)
	s.e.value(jsonTool{Name: tool, Version: version})
	s.e.raw(`,"input_sha256":`)
	s.e.value(in.SHA256)
	s.e.raw(`,"code":`)
	s.e.value(jsonCode{Standard: code.Standard, Annex: in.Code.Annex, Overrides: in.Code.Overrides()})
	s.e.raw(`,"designs":[`)
	return s, s.e.err
}

// Design writes the next design, its trace packed: Write(EncodeDesign(d)).
func (s *JSONStream) Design(d *design.Design) error { return s.Write(EncodeDesign(d)) }

// EncodedDesign is the text of one design of results.json made ahead of its turn, on any
// goroutine (EncodeDesign), for JSONStream.Write to put in its place: all of it but the form
// numbers of its steps, which depend on the designs written before it.
type EncodedDesign struct {
	d    *design.Design
	text []byte // the design, each step's form number left out
	cuts []int  // where in text each step's form number goes
	err  error  // a number that is not finite, or an encoding error
}

// EncodeDesign makes the text of design d for results.json. It is safe for concurrent use;
// d and its steps must not change until the text is written.
func EncodeDesign(d *design.Design) *EncodedDesign {
	e := &EncodedDesign{d: d}
	if e.err = finiteDesign(d); e.err != nil {
		return e
	}
	// The design without its trace, then the trace, the last key, appended by hand.
	text := (*textPool.Get().(*[]byte))[:0] // this design's own until written
	if text, e.err = appendObjectOpen(text, designJSON(*d)); e.err != nil {
		return e
	}
	text = append(text, `,"trace":[`...)
	prefix := d.Prefix()
	e.cuts = make([]int, len(d.Steps))
	for i := range d.Steps {
		if i > 0 {
			text = append(text, ',')
		}
		text = appendStepText(text, &d.Steps[i], prefix, &e.cuts[i])
	}
	e.text = append(text, "]}"...)
	return e
}

// textPool holds the byte slices of written designs' texts for the next ones.
var textPool = sync.Pool{New: func() any { return new([]byte) }}

// Write writes the next design from its text, giving each step its form.
func (s *JSONStream) Write(e *EncodedDesign) error {
	if e.err != nil {
		return e.err
	}
	if s.e.err != nil {
		return s.e.err
	}
	if s.n > 0 {
		s.e.raw(",")
	}
	s.n++
	var num [20]byte
	at := 0
	for i, c := range e.cuts {
		s.e.w.Write(e.text[at:c])
		if _, s.e.err = s.e.w.Write(strconv.AppendInt(num[:0], int64(s.pk.formOf(&e.d.Steps[i])), 10)); s.e.err != nil {
			return s.e.err
		}
		at = c
	}
	_, s.e.err = s.e.w.Write(e.text[at:])
	text := e.text[:0]
	e.text, e.d = nil, nil
	textPool.Put(&text)
	return s.e.err
}

// End writes what follows the designs (the size search of r, its basis and the forms) and
// flushes the output.
func (s *JSONStream) End(r *design.Result) error {
	s.e.raw("]")
	if len(r.Sizes) > 0 {
		var sizes []jsonSize
		for _, z := range r.Sizes {
			if !finite(z.Size.B, z.Size.H, z.Given.B, z.Given.H, z.AsProv, z.Rho, z.Utilization) {
				return fmt.Errorf("reports: size search of column %s: a number is not finite", z.Column)
			}
			sizes = append(sizes, jsonSize{Column: z.Column, Found: z.Found, Shape: sizeShape(z.Given.Shape), B: z.Size.B, H: z.Size.H,
				GivenB: z.Given.B, GivenH: z.Given.H, AsProv: z.AsProv, Rho: z.Rho, Utilization: z.Utilization, Tried: z.Tried})
		}
		s.e.raw(`,"size_search":`)
		s.e.value(sizes)
	}
	basis := basisForJSON(r.Basis)
	s.e.raw(`,"basis":[`)
	for i := range basis {
		st := &basis[i]
		if err := finiteStep(st); err != nil {
			return err
		}
		if i > 0 {
			s.e.raw(",")
		}
		s.e.step(st, "", s.pk.form(st))
	}
	s.e.raw(`],"forms":[`)
	for i := range s.pk.n {
		if i > 0 {
			s.e.raw(",")
		}
		s.e.form(s.pk.rep(i))
	}
	s.e.raw("]")
	s.e.raw("}\n")
	return s.e.flush()
}

// basisForJSON returns the basis steps as results.json holds them: a basis step names other
// basis steps by their whole ID, from the root in its form.
func basisForJSON(basis []trace.Step) []trace.Step {
	out := slices.Clone(basis)
	for i, s := range out {
		if len(s.Args) > 0 {
			s.Args = slices.Clone(s.Args)
			for j := range s.Args {
				if f := s.Args[j].From; f != "" && !strings.HasPrefix(f, "/") {
					s.Args[j].From = "/" + f
				}
			}
			out[i] = s
		}
	}
	return out
}

// designJSON returns design d as results.json holds it, with its packed trace steps.
func designJSON(d design.Design) jsonDesign {
	pos := d.Bars.Positions
	if pos == nil {
		pos = [][2]float64{}
	}
	out := jsonDesign{
		Column: d.Column, Storey: d.Storey, B: d.B, H: d.H, Shape: shapeName(d), Cover: d.Cover, Fck: d.Fck, Fyk: d.Fyk,
		NEd:     d.NEd / 1e3,
		Axes:    jsonAxes{Y: axisJSON(d.Y), Z: axisJSON(d.Z)},
		Biaxial: jsonBiaxial{Checked: d.Biaxial.Checked, A: d.Biaxial.A, Ratio: d.Biaxial.Ratio},
		AsReq:   d.AsReq, AsMin: d.AsMin, AsMax: d.AsMax, AsProv: d.AsProv,
		Bars: jsonBars{Count: d.Bars.Count, Dia: d.Bars.Dia, Positions: pos},
		Links: jsonLinks{Type: linkType(d), Dia: d.Links.Dia, Spacing: d.Links.Spacing, SpacingReduced: d.Links.SpacingReduced,
			SpacingLap: d.Detailing.LapLinkSpacing, LapCount: d.Detailing.LapLinks, SpacingShear: positive(d.Links.SpacingShear)},
		Utilization: d.Utilization, Status: d.Status, Governing: d.Governing, Steps: len(d.Steps),
		NRdMax: d.NRdMax / 1e3, Reasons: nonNil(d.Reasons), Cautions: nonNil(d.Cautions),
	}
	if circular(d) {
		dia := d.B
		out.D = &dia
	}
	out.GoverningCase = d.GoverningCase
	out.Cases = []jsonCase{}
	for _, c := range d.Cases {
		out.Cases = append(out.Cases, jsonCase{Name: c.Name, NEd: c.NEd / 1e3, Axes: jsonAxes{Y: axisJSON(c.Y), Z: axisJSON(c.Z)},
			Utilization: c.Utilization, Status: c.Status, Governing: c.Governing, Prefix: c.Prefix})
	}
	if e := d.Exact; e != nil {
		out.Exact = &jsonExact{MRd: e.MRd / 1e6, MRdY: e.My / 1e6, MRdZ: e.Mz / 1e6, Ratio: e.Ratio, Angle: e.Angle * 180 / math.Pi}
	}
	if it := d.Interaction; it != nil {
		c := &jsonCurves{NMY: [][3]float64{}, NMZ: [][3]float64{}, MyMz: [][2]float64{}}
		for _, p := range it.NMY {
			c.NMY = append(c.NMY, [3]float64{p.N / 1e3, p.M / 1e6, p.MNeg / 1e6})
		}
		for _, p := range it.NMZ {
			c.NMZ = append(c.NMZ, [3]float64{p.N / 1e3, p.M / 1e6, p.MNeg / 1e6})
		}
		for _, p := range it.Contour {
			c.MyMz = append(c.MyMz, [2]float64{p.My / 1e6, p.Mz / 1e6})
		}
		out.Interaction = c
	}
	return out
}

// jsonWriter writes JSON values one at a time through a buffer, each encoded as it would be
// inside a whole document (compact, without HTML escapes); the first error sticks.
type jsonWriter struct {
	w       *bufio.Writer
	scratch []byte // one packed step, or one value
	err     error
}

func newJSONWriter(w io.Writer) *jsonWriter {
	return &jsonWriter{w: bufio.NewWriterSize(w, 1<<16)}
}

func (e *jsonWriter) raw(s string) {
	if e.err == nil {
		_, e.err = e.w.WriteString(s)
	}
}

func (e *jsonWriter) value(v any) {
	if e.err != nil {
		return
	}
	if e.scratch, e.err = appendValue(e.scratch[:0], v); e.err == nil {
		_, e.err = e.w.Write(e.scratch)
	}
}

// valueEncoder is an encoder of JSON without HTML escapes, with its buffer.
type valueEncoder struct {
	buf bytes.Buffer
	enc *json.Encoder
}

// encoders holds valueEncoders for appendValue, which may run on several goroutines.
var encoders = sync.Pool{New: func() any {
	o := &valueEncoder{}
	o.enc = json.NewEncoder(&o.buf)
	o.enc.SetEscapeHTML(false)
	return o
}}

// appendValue appends v as encoding/json writes it, compact and without HTML escapes.
func appendValue(b []byte, v any) ([]byte, error) {
	o := encoders.Get().(*valueEncoder)
	defer encoders.Put(o)
	o.buf.Reset()
	if err := o.enc.Encode(v); err != nil {
		return b, err
	}
	return append(b, bytes.TrimSuffix(o.buf.Bytes(), []byte("\n"))...), nil
}

// appendObjectOpen appends the JSON object v as appendValue does, without its closing brace,
// for keys to follow by hand.
func appendObjectOpen(b []byte, v any) ([]byte, error) {
	n := len(b)
	b, err := appendValue(b, v)
	if err != nil {
		return b[:n], err
	}
	if len(b) == n || b[len(b)-1] != '}' {
		return b[:n], fmt.Errorf("reports: %T is not a JSON object", v)
	}
	return b[:len(b)-1], nil
}

// step writes step st packed under the form k, its ID prefixed by prefix (see jsonStep): the
// bytes encoding/json gives for the jsonStep, without its reflection.
func (e *jsonWriter) step(st *trace.Step, prefix string, k int) {
	if e.err != nil {
		return
	}
	b := appendStepHead(e.scratch[:0], st, prefix)
	b = strconv.AppendInt(b, int64(k), 10)
	b = appendStepTail(b, st)
	e.scratch = b
	_, e.err = e.w.Write(b)
}

// appendStepText appends the packed text of step st (see step) without its form number,
// setting *cut to the place where the number goes.
func appendStepText(b []byte, st *trace.Step, prefix string, cut *int) []byte {
	b = appendStepHead(b, st, prefix)
	*cut = len(b)
	return appendStepTail(b, st)
}

// appendStepHead appends the packed text of step st up to its form number.
func appendStepHead(b []byte, st *trace.Step, prefix string) []byte {
	b = append(b, `{"id":`...)
	b = appendJSONString(b, prefix, st.ID)
	return append(b, `,"form":`...)
}

// appendStepTail appends the packed text of step st after its form number.
func appendStepTail(b []byte, st *trace.Step) []byte {
	b = append(b, `,"value":`...)
	b = appendJSONFloat(b, st.Value)
	if len(st.Args) > 0 {
		b = append(b, `,"args":[`...)
		for i := range st.Args {
			if i > 0 {
				b = append(b, ',')
			}
			b = appendJSONFloat(b, st.Args[i].Value)
		}
		b = append(b, ']')
	}
	if st.Residual() != 0 {
		b = append(b, `,"residual":`...)
		b = appendJSONFloat(b, st.Residual())
	}
	if st.Verdict != "" {
		b = append(b, `,"verdict":`...)
		b = appendJSONString(b, "", st.Verdict)
	}
	return append(b, '}')
}

// form writes the form of step st (see formJSON).
func (e *jsonWriter) form(st *trace.Step) {
	if e.err != nil {
		return
	}
	e.scratch = formJSON(e.scratch[:0], st)
	_, e.err = e.w.Write(e.scratch)
}

// appendJSONFloat appends v as encoding/json writes a float64: the shortest form that reads
// back, in exponent form below 1e-6 and from 1e21, with a two-digit exponent cut to one.
func appendJSONFloat(b []byte, v float64) []byte {
	if v == math.Trunc(v) && math.Abs(v) < 1e15 && (v != 0 || !math.Signbit(v)) {
		// A whole number below 1e15 is exact in an int64 and written with its digits alone.
		return strconv.AppendInt(b, int64(v), 10)
	}
	f := byte('f')
	if a := math.Abs(v); a != 0 && (a < 1e-6 || a >= 1e21) {
		f = 'e'
	}
	b = strconv.AppendFloat(b, v, f, -1, 64)
	if f == 'e' {
		if n := len(b); n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	return b
}

// appendJSONString appends the JSON string of a+s as encoding/json writes it without HTML
// escapes: quotes, backslashes and control characters escaped, U+2028 and U+2029 as \u escapes,
// invalid UTF-8 as U+FFFD.
func appendJSONString(b []byte, a, s string) []byte {
	b = append(b, '"')
	b = appendJSONText(b, a, false)
	b = appendJSONText(b, s, false)
	return append(b, '"')
}

// appendJSONEscaped appends the JSON string of s as appendJSONString does, with "<", ">" and
// "&" escaped as well when html is set (as json.Marshal writes them).
func appendJSONEscaped(b []byte, s string, html bool) []byte {
	b = append(b, '"')
	b = appendJSONText(b, s, html)
	return append(b, '"')
}

func appendJSONText(b []byte, s string, html bool) []byte {
	const hex = "0123456789abcdef"
	start := 0
	for i := 0; i < len(s); {
		if c := s[i]; c < utf8.RuneSelf {
			if c >= 0x20 && c != '"' && c != '\\' && (!html || c != '<' && c != '>' && c != '&') {
				i++
				continue
			}
			b = append(b, s[start:i]...)
			switch c {
			case '"', '\\':
				b = append(b, '\\', c)
			case '\b':
				b = append(b, '\\', 'b')
			case '\f':
				b = append(b, '\\', 'f')
			case '\n':
				b = append(b, '\\', 'n')
			case '\r':
				b = append(b, '\\', 'r')
			case '\t':
				b = append(b, '\\', 't')
			default:
				b = append(b, '\\', 'u', '0', '0', hex[c>>4], hex[c&0xf])
			}
			i++
			start = i
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			b = append(b, s[start:i]...)
			b = append(b, `\ufffd`...)
			i += size
			start = i
			continue
		}
		if r == '\u2028' || r == '\u2029' {
			b = append(b, s[start:i]...)
			b = append(b, '\\', 'u', '2', '0', '2', hex[r&0xf])
			i += size
			start = i
			continue
		}
		i += size
	}
	return append(b, s[start:]...)
}

func (e *jsonWriter) flush() error {
	if e.err != nil {
		return e.err
	}
	return e.w.Flush()
}

// finiteResult reports the first number of r that is NaN or infinite, naming where it is.
func finiteResult(r *design.Result) error {
	for _, o := range input(r).Code.Overrides() {
		if !trace.Finite(o.Value) {
			return fmt.Errorf("reports: code override %s is not finite", o.Name)
		}
	}
	for i := range r.Basis {
		if err := finiteStep(&r.Basis[i]); err != nil {
			return err
		}
	}
	for k := range r.Designs {
		if err := finiteDesign(&r.Designs[k]); err != nil {
			return err
		}
	}
	return nil
}

// finite reports whether every one of vs is neither NaN nor infinite.
func finite(vs ...float64) bool {
	for _, v := range vs {
		if !trace.Finite(v) {
			return false
		}
	}
	return true
}

// notFinite returns the error for the first of vs that is not finite, naming it by where.
func notFinite(where string, vs ...float64) error {
	for i, v := range vs {
		if !trace.Finite(v) {
			return fmt.Errorf("reports: %s (value %d) is not finite", where, i+1)
		}
	}
	return nil
}

// finiteStep reports a number of step s that is NaN or infinite, naming the step; the text is
// built only then.
func finiteStep(s *trace.Step) error {
	if !finite(s.Value, s.Residual()) {
		return notFinite("step "+s.ID, s.Value, s.Residual())
	}
	for _, a := range s.Args {
		if !trace.Finite(a.Value) {
			return notFinite("step "+s.ID+" argument "+a.Name, a.Value)
		}
	}
	return nil
}

// axisValues lists the numbers of axis a that results.json holds.
func axisValues(a *design.Axis) []float64 {
	return []float64{a.L0, a.Lambda, a.LambdaLim, a.M01, a.M02, a.Ei, a.M0Ed, a.M2, a.PhiEf, a.MEd, a.MRd, a.VEd, a.VRdc, a.VRdMax}
}

// finiteDesign reports the first number of design d that is NaN or infinite, naming where it is.
func finiteDesign(d *design.Design) error {
	id := func() string { return d.Column + "/" + d.Storey }
	if vs := []float64{d.B, d.H, d.Cover, d.Fck, d.Fyk, d.NEd, d.AsReq, d.AsMin, d.AsMax,
		d.AsProv, d.NRdMax, d.Utilization, d.Biaxial.A, d.Biaxial.Ratio, d.Bars.Dia, d.Links.Dia,
		d.Links.Spacing, d.Links.SpacingReduced, d.Links.SpacingShear, d.Detailing.LapLinkSpacing}; !finite(vs...) {
		return notFinite("design "+id(), vs...)
	}
	for k, a := range []*design.Axis{&d.Y, &d.Z} {
		if vs := axisValues(a); !finite(vs...) {
			return notFinite("design "+id()+" axis "+[]string{"y", "z"}[k], vs...)
		}
	}
	for _, c := range d.Cases {
		for k, a := range []*design.Axis{&c.Y, &c.Z} {
			if vs := append([]float64{c.NEd, c.Utilization}, axisValues(a)...); !finite(vs...) {
				return notFinite("design "+id()+" case "+c.Name+" axis "+[]string{"y", "z"}[k], vs...)
			}
		}
	}
	if e := d.Exact; e != nil && !finite(e.MRd, e.Ratio, e.Angle, e.My, e.Mz) {
		return notFinite("design "+id()+" exact biaxial", e.MRd, e.Ratio, e.Angle, e.My, e.Mz)
	}
	if it := d.Interaction; it != nil {
		for _, c := range [][]section.NMPoint{it.NMY, it.NMZ} {
			for _, p := range c {
				if !finite(p.N, p.M, p.MNeg) {
					return notFinite("design "+id()+" N–M curve", p.N, p.M, p.MNeg)
				}
			}
		}
		for _, p := range it.Contour {
			if !finite(p.My, p.Mz) {
				return notFinite("design "+id()+" My–Mz contour", p.My, p.Mz)
			}
		}
	}
	for i, p := range d.Bars.Positions {
		if !finite(p[0], p[1]) {
			return notFinite("design "+id()+" bar "+strconv.Itoa(i+1), p[0], p[1])
		}
	}
	for i := range d.Steps {
		if err := finiteStep(&d.Steps[i]); err != nil {
			return err
		}
	}
	return nil
}

// The steps of results.json are packed. What a step's clause fixes (its title, clause, kind,
// symbol, unit, expression, the names, symbols, units and sources of its arguments, its sheet
// section, notes and cautions, every field of trace.Step but the following) is its form, stored
// once in the top-level list "forms"; the step itself holds
//
//	{"id": whole ID, "form": index into forms, "value": v, "args": [the arguments' values in the
//	 order of the form's args], "residual": r (solve steps), "verdict": "pass" or "fail" (checks)}
//
// A source ("from") in a form is written as the design's own steps record it: an ID relative to
// the design of the step ("geo/b" in the design K1/L2 names K1/L2/geo/b), or, starting with "/",
// a whole ID from the root ("/K1/L3/td/G_cum", "/basis/code/gamma_c"). A trace entry without
// "form" is a whole step as trace.Step writes it (results.json of earlier versions).

// jsonStep is one packed step.
type jsonStep struct {
	ID       string    `json:"id"`
	Form     *int      `json:"form,omitempty"`
	Value    float64   `json:"value"`
	Args     []float64 `json:"args,omitempty"`
	Residual float64   `json:"residual,omitempty"`
	Verdict  string    `json:"verdict,omitempty"`
}

// packer collects the distinct forms of the steps it packs, in the order of first use.
type packer struct {
	seed  maphash.Seed
	index map[uint64][]int // form hash to the forms with that hash
	reps  [][]trace.Step   // one step of each form, in blocks of repBlock (no copying as they grow)
	n     int              // the number of forms
	last  map[string]int   // own step ID → the form of the last step of a design so named
}

// repBlock is the number of forms of one block of packer.reps.
const repBlock = 4096

// rep returns the step that stands for form k.
func (p *packer) rep(k int) *trace.Step { return &p.reps[k/repBlock][k%repBlock] }

func newPacker() *packer {
	return &packer{seed: maphash.MakeSeed(), index: map[uint64][]int{}, last: map[string]int{}}
}

// form returns the index of the form of step s, adding it at the end when it is new.
func (p *packer) form(s *trace.Step) int {
	h := formHash(p.seed, s)
	for _, k := range p.index[h] {
		if sameForm(p.rep(k), s) {
			return k
		}
	}
	k := p.n
	p.index[h] = append(p.index[h], k)
	if k%repBlock == 0 {
		p.reps = append(p.reps, make([]trace.Step, 0, repBlock))
	}
	last := &p.reps[len(p.reps)-1]
	*last = append(*last, *s)
	p.n++
	return k
}

// formOf returns the form of step s of a design's trace (its own ID): that of the last step of
// the same own ID when s shares it (the designs of a building repeat their steps, so most do),
// else as form finds it. The forms are distinct by sameForm, so both ways give the same form.
func (p *packer) formOf(s *trace.Step) int {
	if k, ok := p.last[s.ID]; ok && sameForm(p.rep(k), s) {
		return k
	}
	k := p.form(s)
	p.last[s.ID] = k
	return k
}

// formHash returns a hash of the form of step s: every field of trace.Step but its ID, value,
// residual and verdict and its arguments' values (see sameForm).
func formHash(seed maphash.Seed, s *trace.Step) uint64 {
	var h maphash.Hash
	h.SetSeed(seed)
	str := func(v string) {
		h.WriteString(v)
		h.WriteByte(0)
	}
	for _, v := range []string{s.Group, s.Title, s.Clause, string(s.Kind), s.Symbol, s.Expr, s.Unit, s.Row(), s.Method(), s.Verify(), s.Relation} {
		str(v)
	}
	for i := range s.Args {
		a := &s.Args[i]
		str(a.Name)
		str(a.Symbol)
		str(a.Unit)
		str(a.From)
	}
	h.WriteByte(byte(len(s.Args)))
	for _, l := range [][]string{s.Notes(), s.Cautions()} {
		for _, v := range l {
			str(v)
		}
		h.WriteByte(byte(len(l)))
	}
	if s.Show != nil {
		str(s.Show.Expr)
		str(s.Show.Result)
	}
	return h.Sum64()
}

// sameForm reports whether steps a and b share a form: they differ at most in their IDs,
// values, residuals and verdicts and their arguments' values.
func sameForm(a, b *trace.Step) bool {
	if a.Group != b.Group || a.Title != b.Title || a.Clause != b.Clause || a.Kind != b.Kind || a.Symbol != b.Symbol ||
		a.Expr != b.Expr || a.Unit != b.Unit || a.Row() != b.Row() || a.Method() != b.Method() || a.Verify() != b.Verify() ||
		a.Relation != b.Relation || len(a.Args) != len(b.Args) || !slices.Equal(a.Notes(), b.Notes()) ||
		!slices.Equal(a.Cautions(), b.Cautions()) || (a.Show == nil) != (b.Show == nil) {
		return false
	}
	if a.Show != nil && *a.Show != *b.Show {
		return false
	}
	for i := range a.Args {
		x, y := &a.Args[i], &b.Args[i]
		if x.Name != y.Name || x.Symbol != y.Symbol || x.Unit != y.Unit || x.From != y.From {
			return false
		}
	}
	return true
}

// formJSON appends the form of step s: its JSON as encoding/json writes a trace.Step (with
// HTML escapes), without its ID, value, residual and verdict and without the values of its
// arguments, the keys of the step and of each argument in name order.
func formJSON(b []byte, s *trace.Step) []byte {
	first := true
	key := func(k string) {
		if !first {
			b = append(b, ',')
		}
		first = false
		b = append(b, '"')
		b = append(b, k...)
		b = append(b, '"', ':')
	}
	str := func(k, v string, omitEmpty bool) {
		if omitEmpty && v == "" {
			return
		}
		key(k)
		b = appendJSONEscaped(b, v, true)
	}
	list := func(k string, vs []string) {
		if len(vs) == 0 {
			return
		}
		key(k)
		b = append(b, '[')
		for i, v := range vs {
			if i > 0 {
				b = append(b, ',')
			}
			b = appendJSONEscaped(b, v, true)
		}
		b = append(b, ']')
	}
	b = append(b, '{')
	if len(s.Args) > 0 {
		key("args")
		b = append(b, '[')
		for i := range s.Args {
			a := &s.Args[i]
			if i > 0 {
				b = append(b, ',')
			}
			b = append(b, '{')
			if a.From != "" {
				b = append(b, `"from":`...)
				b = appendJSONEscaped(b, a.From, true)
				b = append(b, ',')
			}
			b = append(b, `"name":`...)
			b = appendJSONEscaped(b, a.Name, true)
			b = append(b, `,"symbol":`...)
			b = appendJSONEscaped(b, a.Symbol, true)
			if a.Unit != "" {
				b = append(b, `,"unit":`...)
				b = appendJSONEscaped(b, a.Unit, true)
			}
			b = append(b, '}')
		}
		b = append(b, ']')
	}
	list("cautions", s.Cautions())
	str("clause", s.Clause, false)
	str("expr", s.Expr, true)
	str("group", s.Group, true)
	str("kind", string(s.Kind), false)
	str("method", s.Method(), true)
	list("notes", s.Notes())
	str("relation", s.Relation, true)
	str("row", s.Row(), true)
	if s.Show != nil {
		// A struct inside: its keys in field order.
		key("show")
		b = append(b, '{')
		if s.Show.Expr != "" {
			b = append(b, `"expr":`...)
			b = appendJSONEscaped(b, s.Show.Expr, true)
		}
		if s.Show.Result != "" {
			if s.Show.Expr != "" {
				b = append(b, ',')
			}
			b = append(b, `"result":`...)
			b = appendJSONEscaped(b, s.Show.Result, true)
		}
		b = append(b, '}')
	}
	str("symbol", s.Symbol, true)
	str("title", s.Title, false)
	str("unit", s.Unit, true)
	str("verify", s.Verify(), true)
	return append(b, '}')
}

// Unpacker reads the packed steps of results.json back into whole steps.
type Unpacker struct {
	forms []trace.Step
}

// NewUnpacker returns an unpacker for the top-level "forms" list of results.json.
func NewUnpacker(forms []json.RawMessage) (*Unpacker, error) {
	u := &Unpacker{forms: make([]trace.Step, len(forms))}
	for i, raw := range forms {
		if err := json.Unmarshal(raw, &u.forms[i]); err != nil {
			return nil, fmt.Errorf("forms[%d]: %v", i, err)
		}
	}
	return u, nil
}

// Steps returns the trace entries raw whole: IDs and sources as whole IDs, column/lift/part/name
// or basis/part/name. prefix is the "COLUMN/LIFT/" of the design that holds them ("" for the basis).
func (u *Unpacker) Steps(raw []json.RawMessage, prefix string) ([]trace.Step, error) {
	out := make([]trace.Step, len(raw))
	for i, r := range raw {
		var p struct {
			jsonStep
			Args json.RawMessage `json:"args"`
		}
		if err := json.Unmarshal(r, &p); err != nil {
			return nil, fmt.Errorf("step %d: %v", i, err)
		}
		if p.Form == nil {
			// A whole step, as earlier versions wrote every step.
			if err := json.Unmarshal(r, &out[i]); err != nil {
				return nil, fmt.Errorf("step %d: %v", i, err)
			}
			continue
		}
		var vals []float64
		if len(p.Args) > 0 {
			if err := json.Unmarshal(p.Args, &vals); err != nil {
				return nil, fmt.Errorf("step %s: args: %v", p.ID, err)
			}
		}
		k := *p.Form
		if k < 0 || k >= len(u.forms) {
			return nil, fmt.Errorf("step %s: form %d is not in forms", p.ID, k)
		}
		s := u.forms[k]
		if len(vals) != len(s.Args) {
			return nil, fmt.Errorf("step %s: %d argument values for the %d arguments of form %d", p.ID, len(vals), len(s.Args), k)
		}
		s.ID, s.Value, s.Verdict = p.ID, p.Value, p.Verdict
		s = s.WithResidual(p.Residual) // the form's rarer parts copied, not shared
		if s.Show != nil {
			show := *s.Show
			s.Show = &show
		}
		if len(s.Args) > 0 {
			s.Args = slices.Clone(s.Args)
			for j := range s.Args {
				s.Args[j].Value = vals[j]
				switch f := s.Args[j].From; {
				case f == "":
				case strings.HasPrefix(f, "/"):
					s.Args[j].From = f[1:]
				default:
					s.Args[j].From = prefix + f
				}
			}
		}
		out[i] = s
	}
	return out, nil
}

// Steps is the trace of results.json read back whole: the project basis and each design's steps.
type Steps struct {
	Basis   []trace.Step
	Designs []DesignSteps
}

// DesignSteps is the trace of one design of results.json.
type DesignSteps struct {
	Column, Storey string
	Steps          []trace.Step
}

// ReadSteps reads the steps of results.json (data) back whole, with IDs and sources as whole IDs,
// as design.Design.Trace and design.Result.Basis give them.
func ReadSteps(data []byte) (*Steps, error) {
	var f struct {
		Forms   []json.RawMessage `json:"forms"`
		Basis   []json.RawMessage `json:"basis"`
		Designs []struct {
			Column string            `json:"column"`
			Storey string            `json:"storey"`
			Trace  []json.RawMessage `json:"trace"`
		} `json:"designs"`
	}
	if err := json.Unmarshal(data, &f); err != nil {
		return nil, err
	}
	u, err := NewUnpacker(f.Forms)
	if err != nil {
		return nil, err
	}
	out := &Steps{}
	if out.Basis, err = u.Steps(f.Basis, ""); err != nil {
		return nil, fmt.Errorf("basis: %v", err)
	}
	for _, d := range f.Designs {
		steps, err := u.Steps(d.Trace, d.Column+"/"+d.Storey+"/")
		if err != nil {
			return nil, fmt.Errorf("design %s/%s: %v", d.Column, d.Storey, err)
		}
		out.Designs = append(out.Designs, DesignSteps{Column: d.Column, Storey: d.Storey, Steps: steps})
	}
	return out, nil
}
