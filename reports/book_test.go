package reports

import (
	"reflect"
	"testing"

	"colsheet/calc/design"
	"colsheet/calc/trace"
)

// oldAt is the index of every whole step ID that the book once held: the basis first (the
// last of equal IDs), then each design's trace in order, the first of equal IDs winning.
func oldAt(r *design.Result) map[string]where {
	at := map[string]where{}
	for k, s := range r.Basis {
		at[s.ID] = where{basisDesign, k + 1}
	}
	for i := range r.Designs {
		for k, s := range r.Designs[i].Trace() {
			if _, ok := at[s.ID]; !ok {
				at[s.ID] = where{i, k + 1}
			}
		}
	}
	return at
}

// clashing is a result whose names make whole IDs meet: a column and lift named twice, names
// with "/" that give the same start, a column named like the basis, and a basis step twice.
func clashing() *design.Result {
	st := func(id string, from ...string) trace.Step {
		s := trace.Step{ID: id}
		for _, f := range from {
			s.Args = append(s.Args, trace.Arg{Name: "x", From: f})
		}
		return s
	}
	return &design.Result{
		Basis: []trace.Step{st("basis/code/a"), st("basis/code/b", "basis/code/a"), st("basis/code/a")},
		Designs: []design.Design{
			{Column: "A", Storey: "L1", Steps: []trace.Step{st("x"), st("y", "x", "/basis/code/a"), st("x")}},
			{Column: "A/B", Storey: "C", Steps: []trace.Step{st("d/e"), st("f", "/A/B/C/d/e")}},
			{Column: "A", Storey: "B/C", Steps: []trace.Step{st("d/e"), st("g", "d/e", "/A/L1/y")}},
			{Column: "A", Storey: "L1", Steps: []trace.Step{st("y"), st("z", "y")}},
			{Column: "basis", Storey: "code", Steps: []trace.Step{st("a"), st("c", "a", "/missing")}},
			{Column: "A", Storey: "B", Steps: []trace.Step{st("C/g"), st("C/d/e")}},
		},
	}
}

// results returns the results the book is checked on: both shipped inputs, the small building
// and a result made to clash.
func results(t testing.TB) map[string]*design.Result {
	return map[string]*design.Result{
		"demo":     runFile(t, "../testdata/demo.yaml", ""),
		"columns":  runFile(t, "../testdata/columns.yaml", ""),
		"building": runFile(t, "", packBuilding),
		"clashing": clashing(),
	}
}

// One step made whole is the step Design.Trace gives (common practice, no source: the sheets
// print the trace results.json stores).
func TestWholeStepIsTrace(t *testing.T) {
	for name, r := range results(t) {
		b := newBook(r)
		for i := range r.Designs {
			tr := r.Designs[i].Trace()
			for k, s := range r.Designs[i].Steps {
				if got := design.WholeStep(b.prefix(i), s); !reflect.DeepEqual(got, tr[k]) {
					t.Fatalf("%s: design %d step %d: got %+v, want %+v", name, i, k+1, got, tr[k])
				}
			}
		}
	}
}

// The book finds every whole ID, and every reference, where the index of all IDs did, from the
// sheets of the basis and of designs first, amid and last, and of every design of the result
// made to clash (common practice, no source: the links must not move).
func TestFinderIsIndex(t *testing.T) {
	for name, r := range results(t) {
		b := newBook(r)
		want := oldAt(r)
		ids := []string{"", "/", "nowhere", "A/", "A/L1", "basis/", "A/B/C/", "A/B/C/g"}
		for id := range want {
			ids = append(ids, id)
		}
		for _, s := range r.Basis {
			for _, a := range s.Args {
				ids = append(ids, a.From)
			}
		}
		for i := range r.Designs {
			for _, s := range r.Designs[i].Trace() {
				for _, a := range s.Args {
					ids = append(ids, a.From)
				}
			}
		}
		froms := []int{basisDesign, 0, len(r.Designs) / 2, len(r.Designs) - 1}
		if name == "clashing" {
			froms = []int{basisDesign, 0, 1, 2, 3, 4, 5}
		}
		for _, from := range froms {
			f := b.finder(from)
			for _, id := range ids {
				w, ok := want[id]
				got, gok := f.at(id)
				if gok != ok || got != w {
					t.Fatalf("%s: from %d: %q at %v %v, want %v %v", name, from, id, got, gok, w, ok)
				}
			}
		}
	}
}

// BenchmarkNewBook measures the book of the shipped demo building, which every rendering of the
// sheets and of the calc document builds once.
func BenchmarkNewBook(b *testing.B) {
	r := runFile(b, "../testdata/demo.yaml", "")
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		_ = newBook(r)
	}
}

// BenchmarkBookSheets measures the book of the demo building with the tree of every sheet,
// brief and full, where the book's links are looked up.
func BenchmarkBookSheets(b *testing.B) {
	r := runFile(b, "../testdata/demo.yaml", "")
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		bk := newBook(r)
		for _, o := range []Options{{}, {Detail: Full}} {
			p := place{opt: o}
			for k := range r.Designs {
				_ = sheet(bk, k, p)
			}
		}
	}
}
