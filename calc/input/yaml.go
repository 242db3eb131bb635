package input

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"colsheet/calc/quantity"

	"gopkg.in/yaml.v3"
)

// reader walks a YAML node tree and collects the faults it meets.
type reader struct {
	file  string
	errs  Errors
	warns []Warning
	env   *quantity.Env
	read  func(name string) ([]byte, error) // opens a file beside the input file

	signs      string     // the convention of the end moments as given: model.SignsFace or model.SignsMemberEnds
	tableAsked bool       // actions: names a table of cases for the lifts of columns:
	tableName  string     // the actions table as named under actions:
	tableLine  int        // the line of actions:
	declared   []declared // every column of columns: with its lifts, for the actions table
	unnamed    bool       // some column of columns: has no readable id
}

func (r *reader) fail(n *yaml.Node, field, format string, args ...any) {
	line := 1
	if n != nil && n.Line > 0 {
		line = n.Line
	}
	r.errs = append(r.errs, Error{File: r.file, Line: line, Field: field, Msg: fmt.Sprintf(format, args...)})
}

// resolve follows aliases to the node they name.
func resolve(n *yaml.Node) *yaml.Node {
	for i := 0; n != nil && n.Kind == yaml.AliasNode && i < 100; i++ {
		n = n.Alias
	}
	return n
}

// isNull reports whether n is absent or an explicit null.
func isNull(n *yaml.Node) bool {
	n = resolve(n)
	return n == nil || n.Kind == yaml.ScalarNode && n.ShortTag() == "!!null"
}

func kindName(n *yaml.Node) string {
	n = resolve(n)
	switch n.Kind {
	case yaml.MappingNode:
		return "a mapping"
	case yaml.SequenceNode:
		return "a list"
	case yaml.ScalarNode:
		return fmt.Sprintf("%q", n.Value)
	}
	return "something else"
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

func index(path string, i int) string { return fmt.Sprintf("%s[%d]", path, i) }

// pair is one key of a mapping with its value.
type pair struct {
	key, val *yaml.Node
	name     string
}

// pairs returns the entries of mapping n in order, expanding merge keys (<<), refusing
// duplicate and non-scalar keys, and leaving out entries whose value is null.
func (r *reader) pairs(n *yaml.Node, path string) []pair { return r.entries(n, path, false) }

// entries is pairs, keeping the entries whose value is null where withNull is set.
func (r *reader) entries(n *yaml.Node, path string, withNull bool) []pair {
	var out []pair
	seen := map[string]bool{}
	var merged []pair
	visited := map[*yaml.Node]bool{n: true}
	var merge func(m *yaml.Node, depth int)
	merge = func(m *yaml.Node, depth int) {
		m = resolve(m)
		switch {
		case m == nil || visited[m] || depth > 20:
			return
		case m.Kind == yaml.SequenceNode:
			for _, c := range m.Content {
				merge(c, depth+1)
			}
			return
		case m.Kind != yaml.MappingNode:
			r.fail(m, path, "a merge (<<) takes a mapping or a list of mappings, not %s", kindName(m))
			return
		}
		visited[m] = true
		for i := 0; i+1 < len(m.Content); i += 2 {
			k := resolve(m.Content[i])
			if k.Kind != yaml.ScalarNode {
				continue
			}
			if k.ShortTag() == "!!merge" {
				merge(m.Content[i+1], depth+1)
				continue
			}
			merged = append(merged, pair{k, m.Content[i+1], k.Value})
		}
	}
	for i := 0; i+1 < len(n.Content); i += 2 {
		k := resolve(n.Content[i])
		v := n.Content[i+1]
		if k.Kind != yaml.ScalarNode {
			r.fail(k, path, "a key must be a plain name, not %s", kindName(k))
			continue
		}
		if k.ShortTag() == "!!merge" {
			merge(v, 0)
			continue
		}
		if seen[k.Value] {
			r.fail(k, join(path, k.Value), "the key is given twice")
			continue
		}
		seen[k.Value] = true
		if withNull || !isNull(v) {
			out = append(out, pair{k, v, k.Value})
		}
	}
	for _, p := range merged {
		if !seen[p.name] {
			seen[p.name] = true
			if withNull || !isNull(p.val) {
				out = append(out, p)
			}
		}
	}
	return out
}

// fields reads mapping n, reporting keys not in known, and returns its entries by key.
// It reports a fault and returns nil when n is not a mapping.
func (r *reader) fields(n *yaml.Node, path string, known ...string) map[string]pair {
	return r.fieldsHinted(n, path, nil, known...)
}

// fieldsHinted is fields where some keys that do not belong here are answered with a hint of
// where they go instead of the list of known keys.
func (r *reader) fieldsHinted(n *yaml.Node, path string, misplaced map[string]string, known ...string) map[string]pair {
	n = resolve(n)
	if n.Kind != yaml.MappingNode {
		r.fail(n, path, "expected a mapping with the keys %s, found %s", strings.Join(known, ", "), kindName(n))
		return nil
	}
	out := map[string]pair{}
	// Null entries are read too, so that a key without a value that belongs nowhere
	// ({title: a, foo, job: x}) is reported; a known key with a null value is absent.
	for _, p := range r.entries(n, path, true) {
		ok := false
		for _, k := range known {
			ok = ok || k == p.name
		}
		if hint, moved := misplaced[p.name]; !ok && moved {
			r.fail(p.key, join(path, p.name), "%s", hint)
			continue
		}
		if !ok {
			r.fail(p.key, join(path, p.name), "unknown key (known here: %s)", strings.Join(known, ", "))
			continue
		}
		if isNull(p.val) {
			continue
		}
		out[p.name] = p
	}
	return out
}

// list returns the items of sequence n, which must not be empty; it reports a fault and
// returns false otherwise.
func (r *reader) list(n *yaml.Node, path, what string) ([]*yaml.Node, bool) {
	n = resolve(n)
	if n.Kind != yaml.SequenceNode {
		r.fail(n, path, "expected a list of %s, found %s", what, kindName(n))
		return nil, false
	}
	if len(n.Content) == 0 {
		r.fail(n, path, "the list is empty; give at least one of the %s", what)
		return nil, false
	}
	return n.Content, true
}

// str returns the text of scalar n.
func (r *reader) str(n *yaml.Node, path string) (string, bool) {
	n = resolve(n)
	if n.Kind != yaml.ScalarNode {
		r.fail(n, path, "expected a text, found %s", kindName(n))
		return "", false
	}
	return n.Value, true
}

// name returns an identifier (column id, storey name): non-empty text without slashes or control characters.
func (r *reader) name(n *yaml.Node, path string) (string, bool) {
	s, ok := r.str(n, path)
	if !ok {
		return "", false
	}
	s = strings.TrimSpace(s)
	switch {
	case s == "":
		r.fail(n, path, "must not be empty")
		return "", false
	case strings.ContainsAny(s, "/\\"):
		r.fail(n, path, "%q must not contain a slash", s)
		return "", false
	case strings.IndexFunc(s, func(c rune) bool { return c < ' ' || c == 0x7f }) >= 0:
		r.fail(n, path, "%q must not contain control characters", s)
		return "", false
	}
	return s, true
}

// number returns the value of scalar n in engine units: a plain number is in unit, a text is
// a quantity or an expression over the vars. Faults already reported for a var are not repeated.
func (r *reader) number(n *yaml.Node, path, unit string) (float64, bool) {
	n = resolve(n)
	if n.Kind != yaml.ScalarNode {
		r.fail(n, path, "expected a number or a quantity such as %s, found %s", example(unit), kindName(n))
		return 0, false
	}
	switch n.ShortTag() {
	case "!!int", "!!float":
		var v float64
		if err := n.Decode(&v); err != nil {
			r.fail(n, path, "%q is not a number", n.Value)
			return 0, false
		}
		x, err := quantity.Convert(v, unit)
		if err != nil {
			r.fail(n, path, "%s", err)
			return 0, false
		}
		if !finite(x) {
			r.fail(n, path, "%q is not a finite number", n.Value)
			return 0, false
		}
		return x, true
	case "!!str":
		x, err := r.env.Eval(n.Value, unit)
		if errors.Is(err, quantity.ErrBadVar) {
			return 0, false
		}
		if err != nil {
			r.fail(n, path, "%s", err)
			return 0, false
		}
		if !finite(x) {
			r.fail(n, path, "%q is not a finite number", n.Value)
			return 0, false
		}
		return x, true
	}
	r.fail(n, path, "expected a number or a quantity such as %s, found %q", example(unit), n.Value)
	return 0, false
}

// example returns a sample of a quantity in unit for messages.
func example(unit string) string {
	switch unit {
	case "mm":
		return `"350 mm"`
	case "kN":
		return `"2150 kN"`
	case "kNm":
		return `"85 kNm"`
	case "MPa":
		return `"500 MPa"`
	case "kN/m2":
		return `"2.5 kN/m2"`
	case "kN/m":
		return `"8.5 kN/m"`
	case "kN/m3":
		return `"25 kN/m3"`
	}
	return "0.8"
}

// show formats v, in engine units, in unit for messages ("350 mm").
func show(v float64, unit string) string {
	u, _ := quantity.LookupUnit(unit)
	s := strconv.FormatFloat(v/u.Scale, 'g', 6, 64)
	if unit == "" {
		return s
	}
	return s + " " + unit
}

// whole reports whether v is a whole number that fits an int comfortably.
func whole(v float64) bool { return v == math.Trunc(v) && math.Abs(v) < 1e9 }
