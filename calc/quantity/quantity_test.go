package quantity

import (
	"errors"
	"math"
	"strings"
	"testing"

	"colsheet/calc/trace"
)

func near(a, b float64) bool {
	return math.Abs(a-b) <= 1e-12*math.Max(math.Abs(a), math.Abs(b))
}

// The conversion factors are common practice (SI prefixes), no source.
func TestParseUnits(t *testing.T) {
	cases := []struct {
		text, unit string
		want       float64
	}{
		{"350 mm", "mm", 350},
		{"35 cm", "mm", 350},
		{"3.6 m", "mm", 3600},
		{"3.6m", "mm", 3600},
		{"350", "mm", 350},
		{"2150 kN", "kN", 2150e3},
		{"2150", "kN", 2150e3},
		{"2.15 MN", "kN", 2.15e6},
		{"500 N", "kN", 500},
		{"85 kNm", "kNm", 85e6},
		{"85 kN m", "kNm", 85e6},
		{"85 kN  m", "kNm", 85e6},
		{"85 kN·m", "kNm", 85e6},
		{"-40 kNm", "kNm", -40e6},
		{"0.085 MNm", "kNm", 85e6},
		{"85000 Nm", "kNm", 85e6},
		{"85e6 Nmm", "kNm", 85e6},
		{"85", "kNm", 85e6},
		{"32 MPa", "MPa", 32},
		{"32 N/mm2", "MPa", 32},
		{"32 N/mm²", "MPa", 32},
		{"200 GPa", "MPa", 200000},
		{"7.5 kN/m2", "kN/m2", 0.0075},
		{"7.5 kN/m²", "kN/m2", 0.0075},
		{"7.5 kPa", "kN/m2", 0.0075},
		{"25 kN/m3", "kN/m3", 2.5e-5},
		{"25 kN/m³", "kN/m3", 2.5e-5},
		{"12 kN/m", "kN/m", 12},
		{"12 N/mm", "kN/m", 12},
		{"1964 mm2", "mm2", 1964},
		{"19.64 cm2", "mm2", 1964},
		{"19.64 cm²", "mm2", 1964},
		{"0.5 m2", "mm2", 5e5},
		{"0.8", "", 0.8},
		{"80 %", "", 0.8},
		{"80%", "", 0.8},
		{".5 m", "mm", 500},
		{"1.5e3 kN", "kN", 1.5e6},
		{"0", "mm", 0},
		{"0 kN", "mm", 0}, // a zero fits any dimension
	}
	for _, c := range cases {
		got, err := Parse(c.text, c.unit)
		if err != nil {
			t.Errorf("Parse(%q, %q): %v", c.text, c.unit, err)
			continue
		}
		if !near(got, c.want) {
			t.Errorf("Parse(%q, %q) = %g, want %g", c.text, c.unit, got, c.want)
		}
	}
}

func testEnv(t *testing.T) *Env {
	t.Helper()
	env, errs := NewEnv([]Def{
		{"half", "spanA/2"}, // uses a later definition
		{"spanA", "6.6 m"},
		{"l1", "3.4 m"},
		{"n", "4"},
		{"fck", "32 MPa"},
		{"slab", "0.25 m * 25 kN/m3 + 1.5 kN/m2"},
	})
	if len(errs) > 0 {
		t.Fatalf("NewEnv: %v", errs)
	}
	return env
}

func TestEvalExpressions(t *testing.T) {
	env := testEnv(t)
	cases := []struct {
		text, unit string
		want       float64
	}{
		{"spanA/2", "mm", 3300},
		{"half", "mm", 3300},
		{"max(3 m, l1) - 200 mm", "mm", 3200},
		{"min(3 m, l1, 5 m)", "mm", 3000},
		{"0.25 m * 25 kN/m3 + 1.5 kN/m2", "kN/m2", 0.00775},
		{"slab * spanA", "kN/m", 0.00775 * 6600},
		{"sqrt(350 mm * 500 mm)", "mm", math.Sqrt(350 * 500)},
		{"(2 m)**2", "mm2", 4e6},
		{"2**3", "mm", 8}, // a pure number in a length field is in mm
		{"n * 1000", "kN", 4e6},
		{"n", "", 4},
		{"6 m / 2 m", "", 3},
		{"-(spanA - 600 mm)", "mm", -6000},
		{"max(0, l1 - 5 m)", "mm", 0},
		{"0.85 * fck / 1.5", "MPa", 0.85 * 32 / 1.5},
		{"2150 kN * 40 mm", "kNm", 2150e3 * 40},
		{"10 - 3 - 2", "", 5},
		{"12 / 3 * 2", "", 8},
		{"(2 m)**-1 * 4 m", "", 2},
		{"1 m ** 2", "mm2", 1e6},
	}
	for _, c := range cases {
		got, err := env.Eval(c.text, c.unit)
		if err != nil {
			t.Errorf("Eval(%q, %q): %v", c.text, c.unit, err)
			continue
		}
		if !near(got, c.want) {
			t.Errorf("Eval(%q, %q) = %g, want %g", c.text, c.unit, got, c.want)
		}
	}
}

func TestEvalErrors(t *testing.T) {
	env := testEnv(t)
	cases := []struct {
		text, unit string
		want       string // part of the message
	}{
		{"3.6 kN", "mm", `"3.6 kN" is a force, expected a length`},
		{"85 kNm", "kN", "is a moment, expected a force"},
		{"2 m2", "mm", "is an area, expected a length"},
		{"3 m", "", "is a length, expected a pure number"},
		{"25 kN/m3", "MPa", "is a weight density, expected a stress"},
		{"3 kN * 2 kN", "kN", "is a quantity in N^2, expected a force"},
		{"3 m + 2 kN", "mm", "cannot add a length and a force"},
		{"3 m + 2", "mm", "cannot add a length and a pure number (give the number a unit)"},
		{"3 m - 2 kN", "mm", "cannot subtract a length and a force"},
		{"max(3 m, 2 kN)", "mm", "max: cannot compare a length and a force"},
		{"2 ^ 3", "", "use ** for powers"},
		{"spanA ^ 2", "mm2", "use ** for powers"},
		{"1 m / 0", "mm", "division by zero"},
		{"1 m / (l1 - 3400 mm)", "mm", "division by zero"},
		{"0 ** -1", "", "division by zero"},
		{"sqrt(-1)", "", "sqrt of a negative number"},
		{"(-8) ** 0.5", "", "is not a real number"},
		{"1e300 * 1e300", "", "too large"},
		{"1e999", "", "out of range"},
		{"spanB/2", "mm", "undefined name spanB"},
		{"(3+2) m", "mm", "a unit goes directly after a number"},
		{"3 m > 2 m", "", `">" is not allowed`},
		{"3 m >= 2 m", "", `">=" is not allowed`},
		{"n == 4", "", `"==" is not allowed`},
		{"n > 1 ? 2 : 3", "", "is not allowed"},
		{"n && n", "", `"&&" is not allowed`},
		{"n % 3", "", `"%" is not allowed`},
		{"'text'", "", `"'" is not allowed`},
		{"true", "", `"true" is not allowed`},
		{"n in (1, 2)", "", `"in" is not allowed`},
		{"abs(-3)", "", "unknown function abs"},
		{"sqrt(1, 2)", "", "sqrt takes 1 argument, not 2"},
		{"max", "", "max needs its arguments in parentheses"},
		{"sqrt(3 m)", "mm", "square root of a length has no whole-numbered dimension"},
		{"(3 m) ** 0.5", "mm", "has no whole-numbered dimension"},
		{"2 ** (3 m)", "", "an exponent must be a pure number"},
		{"-2 ** 2", "", "ambiguous"},
		{"2 ** 3 ** 2", "", "ambiguous"},
		{"", "mm", "empty"},
		{"   ", "mm", "empty"},
		{"3 m m", "mm", "unexpected m: a unit goes directly after a number"},
		{"3 4", "mm", "unexpected number 4"},
		{"(3 m + 1 m", "mm", "closing parenthesis is missing"},
		{"3 m +", "mm", "ends too early"},
		{"3 m)", "mm", `unexpected ")"`},
		{"2.3.4", "", "is not a number"},
		{"a.b", "", "names contain no dots"},
		{"\xff", "", "not valid UTF-8"},
		{strings.Repeat("(", 200) + "1" + strings.Repeat(")", 200), "", "nested too deeply"},
	}
	for _, c := range cases {
		got, err := env.Eval(c.text, c.unit)
		if err == nil {
			t.Errorf("Eval(%q, %q) = %g, want an error containing %q", c.text, c.unit, got, c.want)
			continue
		}
		if !strings.Contains(err.Error(), c.want) {
			t.Errorf("Eval(%q, %q): error %q does not contain %q", c.text, c.unit, err, c.want)
		}
	}
}

func TestNewEnvErrors(t *testing.T) {
	cases := []struct {
		name string
		defs []Def
		want []string // one message part per expected error, in definition order
		good []string // names that must be defined
	}{
		{"cycle", []Def{{"a", "b + 1 m"}, {"b", "c * 2"}, {"c", "a"}, {"d", "1 m"}},
			[]string{"a: the definitions form a cycle: a -> b -> c -> a"}, []string{"d"}},
		{"cycle named from its first definition", []Def{{"x", "y"}, {"y", "z"}, {"z", "y"}},
			[]string{"y: the definitions form a cycle: y -> z -> y"}, nil},
		{"self reference", []Def{{"a", "a + 1"}}, []string{"a: the definitions form a cycle: a -> a"}, nil},
		{"undefined", []Def{{"a", "2 * b"}, {"c", "a + 1"}}, []string{`a: "2 * b": undefined name b`}, nil},
		{"duplicate", []Def{{"a", "1"}, {"a", "2"}}, []string{"a: defined twice"}, []string{"a"}},
		{"bad names", []Def{{"m", "1"}, {"max", "1"}, {"2x", "1"}, {"true", "1"}, {"ok_1", "1"}},
			[]string{"m is a unit", "max is a function", `"2x" is not a name`, "true is reserved"}, []string{"ok_1"}},
		{"syntax and dimension", []Def{{"a", "3 m + 2 kN"}, {"b", "2 ^ 2"}, {"c", "1 / 0"}},
			[]string{"cannot add a length and a force", "use ** for powers", "division by zero"}, nil},
	}
	for _, c := range cases {
		env, errs := NewEnv(c.defs)
		if len(errs) != len(c.want) {
			t.Errorf("%s: got errors %v, want %d", c.name, errs, len(c.want))
			continue
		}
		for i, e := range errs {
			if !strings.Contains(e.Error(), c.want[i]) {
				t.Errorf("%s: error %q does not contain %q", c.name, e, c.want[i])
			}
			var de *DefError
			if !errors.As(e, &de) {
				t.Errorf("%s: error %v is not a *DefError", c.name, e)
			}
		}
		for _, n := range c.good {
			if _, ok := env.Lookup(n); !ok {
				t.Errorf("%s: %s is not defined", c.name, n)
			}
		}
	}
}

func TestBadVarIsMarked(t *testing.T) {
	env, errs := NewEnv([]Def{{"a", "1 / 0"}, {"b", "a * 2"}})
	if len(errs) != 1 {
		t.Fatalf("errors %v, want one", errs)
	}
	_, err := env.Eval("b + 1", "")
	if !errors.Is(err, ErrBadVar) {
		t.Fatalf("Eval over a faulty definition gives %v, want ErrBadVar", err)
	}
	if _, err := env.Eval("c + 1", ""); err == nil || errors.Is(err, ErrBadVar) {
		t.Fatalf("Eval over an undefined name gives %v, want a plain error", err)
	}
}

// The accepted expressions mean what govaluate makes of them.
func TestAgreesWithGovaluate(t *testing.T) {
	env, _ := NewEnv([]Def{{"x", "3"}, {"y", "0.5"}})
	args := []trace.Arg{{Name: "x", Value: 3}, {Name: "y", Value: 0.5}}
	for _, e := range []string{
		"10 - 3 - 2", "10 - 3 + 2", "12 / 3 / 2", "12 / 3 * 2", "2 * 3 ** 2", "2 ** 2 * 3",
		"1 - 2 * 3 - 4", "-3 - 2", "3 - -2", "x ** y", "-(x ** 2)", "(-x) ** 2",
		"min(x, y, 2) + max(1, x) * sqrt(16) / 2", "(1 + 2) * (3 - 4) / 5", "x / y / 4 * 3 - 1 - 1",
		"2 ** -1", ".5 + 5.", "x * -y",
	} {
		want, err := trace.Eval(e, args)
		if err != nil {
			t.Fatalf("govaluate %q: %v", e, err)
		}
		got, err := env.Eval(e, "")
		if err != nil {
			t.Fatalf("Eval(%q): %v", e, err)
		}
		if !near(got, want) {
			t.Errorf("Eval(%q) = %g, govaluate gives %g", e, got, want)
		}
	}
}

func TestDimWords(t *testing.T) {
	cases := []struct {
		d    Dim
		want string
	}{
		{Length, "a length"}, {Area, "an area"}, {Force, "a force"}, {Moment, "a moment"},
		{Stress, "a stress"}, {LineLoad, "a line load"}, {Density, "a weight density"},
		{Number, "a pure number"}, {Dim{1, -4}, "a quantity in N·mm^-4"},
	}
	for _, c := range cases {
		if got := c.d.Describe(); got != c.want {
			t.Errorf("%v.Describe() = %q, want %q", c.d, got, c.want)
		}
	}
}

func FuzzEval(f *testing.F) {
	for _, s := range []string{
		"3.6 m", "85 kN m", "0.25 m * 25 kN/m3 + 1.5 kN/m2", "spanA/2", "max(3 m, l1) - 200 mm",
		"2 ^ 3", "1/0", "sqrt(-1)", "(2 m)**2", "x ** y", "-x", "min(1,2,3)", "3 m + 2", "80 %",
		"1e308*10", "a > b ? 1 : 2", "(((1)))", "2 ** 3 ** 2",
	} {
		f.Add(s)
	}
	env, errs := NewEnv([]Def{{"spanA", "6.6 m"}, {"l1", "3.4 m"}, {"x", "3"}, {"y", "0.5"}})
	if len(errs) > 0 {
		f.Fatal(errs)
	}
	args := []trace.Arg{{Name: "spanA", Value: 6600}, {Name: "l1", Value: 3400}, {Name: "x", Value: 3}, {Name: "y", Value: 0.5}}
	f.Fuzz(func(t *testing.T, s string) {
		q, err := env.Quantity(s)
		if err != nil {
			return
		}
		if math.IsNaN(q.Value) || math.IsInf(q.Value, 0) {
			t.Fatalf("Quantity(%q) = %v without an error", s, q)
		}
		for _, u := range []string{"", "mm", "kN", "kNm", "MPa"} {
			if v, err := env.Eval(s, u); err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Fatalf("Eval(%q, %q) = %v without an error", s, u, v)
			}
		}
		// Without units, an expression both accept must mean the same to govaluate.
		toks, _ := lex(s)
		for _, tk := range toks {
			if tk.kind == tNum && !plainNumber(tk.text) {
				return
			}
		}
		if want, err := trace.Eval(s, args); err == nil && !near(q.Value, want) && !(q.Value == 0 && want == 0) {
			t.Fatalf("Quantity(%q) = %v, govaluate gives %v", s, q.Value, want)
		}
	})
}

// plainNumber reports whether a number token is digits and a point only, as govaluate reads them.
func plainNumber(s string) bool {
	return strings.Trim(s, "0123456789.") == ""
}

// matchName agrees with matching word by word on the name split after its spaces, each space
// matching one or more (common practice, no source), for names and texts with odd spacing.
func TestMatchNameWords(t *testing.T) {
	byWords := func(s, name string) (int, bool) {
		i := 0
		for _, part := range strings.SplitAfter(name, " ") {
			word := strings.TrimSuffix(part, " ")
			if !strings.HasPrefix(s[i:], word) {
				return 0, false
			}
			i += len(word)
			if strings.HasSuffix(part, " ") {
				j := i
				for j < len(s) && s[j] == ' ' {
					j++
				}
				if j == i {
					return 0, false
				}
				i = j
			}
		}
		return i, true
	}
	names := []string{"", "m", "kN", "kN m", "kN  m", "kN m ", " kN", "per cent", "a b c"}
	texts := []string{"", "m", "mm", "kN", "kNm", "kN m", "kN   m/m", "kN  m", "kN m ", " kN", "per  cent", "a b c d", "a  b  c", "kN\tm"}
	for _, name := range names {
		for _, s := range texts {
			gn, gok := matchName(s, name)
			wn, wok := byWords(s, name)
			if gn != wn || gok != wok {
				t.Errorf("matchName(%q, %q) = %d, %v; want %d, %v", s, name, gn, gok, wn, wok)
			}
		}
	}
}
