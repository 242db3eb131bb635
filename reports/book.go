package reports

import (
	"iter"

	"colsheet/calc/design"
	"colsheet/calc/trace"
)

// book holds what every sheet of a result needs to link its steps: the sheets' names and the
// means to find where a whole step ID is. It is read only once made, so that sheets may be
// built from it at the same time.
type book struct {
	r     *design.Result
	names []string         // sheet base names, one per design
	basis map[string]int   // whole ID of a step of the project basis → its number (the last of equal IDs)
	lifts map[string][]int // start of a design's whole IDs, "COLUMN/LIFT/" → the designs so named, in order
	pre   []string         // start of each design's whole IDs, "COLUMN/LIFT/"
	// When the sheets are printed as the designs are handed on (SheetStream), held holds the
	// designs in hand, by index, each as it was handed on with its trace; kept what is kept of
	// a design let go since. Both nil otherwise: the designs are the result's.
	held []*design.Design
	kept []*keptDesign
}

// keptDesign is what the sheets still to print need of a design whose sheet is printed and
// whose trace was let go: the own IDs of its steps in order and which are checks, for the links
// to them (briefStep), and the steps that the calc document's tables read (the take-down and the
// column moments), with their values only.
type keptDesign struct {
	ids    []string
	checks []bool
	steps  []keptStep
}

// keptStep is what a table of the calc document reads of a step: its own ID and its value
// with the symbol and unit that say how to show it.
type keptStep struct {
	id, symbol, unit string
	value            float64
}

// design returns design i as its sheet reads it: the one in hand, or the result's.
func (b *book) design(i int) *design.Design {
	if b.held != nil {
		if d := b.held[i]; d != nil {
			return d
		}
	}
	return &b.r.Designs[i]
}

// steps yields the steps of design i in order: its trace, or of a design let go the steps
// kept of it, as steps with their own IDs, values, symbols and units only.
func (b *book) steps(i int) iter.Seq[trace.Step] {
	return func(yield func(trace.Step) bool) {
		if b.kept != nil {
			if k := b.kept[i]; k != nil {
				for _, s := range k.steps {
					if !yield(trace.Step{ID: s.id, Symbol: s.symbol, Unit: s.unit, Value: s.value}) {
						return
					}
				}
				return
			}
		}
		for _, s := range b.design(i).Steps {
			if !yield(s) {
				return
			}
		}
	}
}

// where is a step's design and its number on that design's sheet; design is basisDesign for
// a step of the project basis, numbered in the basis.
type where struct{ design, number int }

// basisDesign marks a step of the project basis in a where.
const basisDesign = -1

// newBook indexes the sheets of r and the starts of its designs' step IDs.
func newBook(r *design.Result) *book {
	b := &book{r: r, names: names(r), basis: make(map[string]int, len(r.Basis)), lifts: make(map[string][]int, len(r.Designs))}
	for k, s := range r.Basis {
		b.basis[s.ID] = k + 1
	}
	b.pre = make([]string, len(r.Designs))
	for i := range r.Designs {
		p := r.Designs[i].Prefix()
		b.pre[i] = p
		b.lifts[p] = append(b.lifts[p], i)
	}
	return b
}

// prefix returns the start of the whole IDs of design i's steps, as Design.Trace makes them.
func (b *book) prefix(i int) string { return b.pre[i] }

// stepAt returns the step (its own ID) at w.
func (b *book) stepAt(w where) trace.Step {
	if w.design == basisDesign {
		return b.r.Basis[w.number-1]
	}
	if b.kept != nil {
		if k := b.kept[w.design]; k != nil {
			s := trace.Step{ID: k.ids[w.number-1]} // what a link to it reads (see briefStep)
			if k.checks[w.number-1] {
				s.Kind = trace.KindCheck
			}
			return s
		}
	}
	return b.design(w.design).Steps[w.number-1]
}

// target returns where the link to step id (at w) from the sheet of design from leads: the
// same page, another design's sheet, or the index sheet for the project basis.
func (b *book) target(from int, w where, id string) target {
	a := anchorName("s-", id)
	switch {
	case w.design == from:
		return target{anchor: a}
	case w.design == basisDesign:
		return target{sheet: "index", anchor: a} // the index sheet holds the project basis
	}
	return target{sheet: b.names[w.design], anchor: a}
}

// finder finds whole step IDs for the sheet of one design (or the basis); it indexes that
// design's own steps, which its steps use most, and is used by one goroutine.
type finder struct {
	b    *book
	from int            // the design whose sheet links, or basisDesign
	own  map[string]int // own ID of a step of design from → its number (the first of equal IDs)
}

// finder returns the finder for the sheet of design from (basisDesign: the project basis).
func (b *book) finder(from int) finder {
	f := finder{b: b, from: from}
	if from == basisDesign {
		return f
	}
	steps := b.design(from).Steps
	f.own = make(map[string]int, len(steps))
	for k, s := range steps {
		if _, ok := f.own[s.ID]; !ok {
			f.own[s.ID] = k + 1
		}
	}
	return f
}

// candidates returns the designs that may hold the step of whole ID id, as at tries them: those
// whose whole IDs start as id does, at every "/" of id.
func (b *book) candidates(id string) []int {
	var out []int
	for k := 0; k < len(id); k++ {
		if id[k] == '/' {
			out = append(out, b.lifts[id[:k+1]]...)
		}
	}
	return out
}

// at returns where the step of whole ID id is: a step of the project basis first, else the
// first design, in the order of the result, that has a step of that whole ID, at its first.
func (f finder) at(id string) (where, bool) {
	if n, ok := f.b.basis[id]; ok {
		return where{basisDesign, n}, true
	}
	// A column or lift name may hold a "/", so every split of id into a design's start and an
	// own ID is tried; the first design that has the step wins.
	best, found := where{}, false
	for k := 0; k < len(id); k++ {
		if id[k] != '/' {
			continue
		}
		for _, i := range f.b.lifts[id[:k+1]] {
			if found && i >= best.design {
				break
			}
			if n := f.number(i, id[k+1:]); n > 0 {
				best, found = where{i, n}, true
				break
			}
		}
	}
	return best, found
}

// number returns the number of the first step of design i with the own ID local, 0 where none.
func (f finder) number(i int, local string) int {
	if i == f.from {
		return f.own[local]
	}
	if f.b.kept != nil {
		if k := f.b.kept[i]; k != nil {
			for n, id := range k.ids {
				if id == local {
					return n + 1
				}
			}
			return 0
		}
	}
	for k, s := range f.b.design(i).Steps {
		if s.ID == local {
			return k + 1
		}
	}
	return 0
}
