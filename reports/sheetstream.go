package reports

import (
	"fmt"
	"strings"

	"colsheet/calc/design"
)

// SheetStream prints the sheets of a result while its designs are handed on one by one (see
// design.Stream), then the index and the calc document, handing each file to emit as soon as it
// is printed; the files are those of RenderTo, byte for byte. It holds the traces of the column
// in hand and of each column group's governing lift so far; of every other design only what
// the calc document needs (its step IDs for the links, its take-down and moment steps by value),
// so that its memory does not grow with the traces of the whole building.
type SheetStream struct {
	x       *renderer // nil: no sheets asked for
	emit    func(path string, data []byte) error
	workers int
	busy    chan struct{}    // a place per page being printed
	queue   []*pageJob       // the pages being printed, in order
	column  []int            // the designs in hand of the column being handed on
	gov     map[groupKey]int // the governing design of each column group so far
}

// pageJob is one page being printed on a goroutine of its own.
type pageJob struct {
	done  chan struct{} // closed once printed
	files []file
	err   error
	fault any   // a panic of the printing, raised again on the caller's goroutine
	last  []int // the designs of the column whose last page this is, let go once it is handed on
}

// NewSheetStream returns the stream of the sheets of r in the formats asked for (md, tex,
// html), printed by up to workers goroutines; r is as design.Stream hands it to its start: the
// designs' names and the project basis, nothing else of the designs until each is handed on.
func NewSheetStream(r *design.Result, formats map[string]bool, o Options, workers int, emit func(path string, data []byte) error) (*SheetStream, error) {
	if r == nil {
		return nil, fmt.Errorf("reports: no result")
	}
	for i := range r.Basis {
		if err := finiteStep(&r.Basis[i]); err != nil {
			return nil, err
		}
	}
	x, err := newRenderer(r, formats, o)
	if err != nil {
		return nil, err
	}
	workers = max(workers, 1)
	s := &SheetStream{x: x, emit: emit, workers: workers, busy: make(chan struct{}, workers), gov: map[groupKey]int{}}
	if x != nil {
		x.bk.held = make([]*design.Design, len(r.Designs))
		x.bk.kept = make([]*keptDesign, len(r.Designs))
	}
	return s, nil
}

// Design takes design k as it is handed on, with its trace, sections and interaction data; its
// sheet is printed once every lift of its column is in hand (a lift's steps refer to those of
// the lifts above it). The designs come in order, k = 0, 1, ….
func (s *SheetStream) Design(k int, d *design.Design) error {
	if s.x == nil {
		return nil
	}
	if err := finiteDesign(d); err != nil {
		return err
	}
	if len(s.column) > 0 && s.x.bk.held[s.column[0]].Column != d.Column {
		if err := s.printColumn(); err != nil {
			return err
		}
	}
	c := *d // as handed on: the stream lets go of the result's copy
	s.x.bk.held[k] = &c
	s.column = append(s.column, k)
	return nil
}

// End prints the sheets still in hand, then the index and the calc document of each format.
func (s *SheetStream) End() error {
	if s.x == nil {
		return nil
	}
	if err := s.printColumn(); err != nil {
		return err
	}
	for len(s.queue) > 0 {
		if err := s.handOn(); err != nil {
			return err
		}
	}
	x := s.x
	return inOrder(1+len(x.fs), s.workers, func(i int) ([]file, error) {
		if i == 0 {
			return x.page(0)
		}
		return x.docFile(x.fs[i-1])
	}, func(files []file) error { return emitFiles(files, s.emit) })
}

// printColumn starts printing the sheets of the column in hand and hands on the pages printed,
// waiting while more than two pages per worker are being printed.
func (s *SheetStream) printColumn() error {
	col := s.column
	s.column = nil
	for n, k := range col {
		j := &pageJob{done: make(chan struct{})}
		if n == len(col)-1 {
			j.last = col
		}
		s.queue = append(s.queue, j)
		s.busy <- struct{}{}
		go func(i int) {
			defer close(j.done)
			defer func() { <-s.busy }()
			defer func() {
				if p := recover(); p != nil {
					j.fault = p
				}
			}()
			j.files, j.err = s.x.page(i)
		}(k + 1)
		for len(s.queue) > 2*s.workers {
			if err := s.handOn(); err != nil {
				return err
			}
		}
	}
	return nil
}

// handOn waits for the first page being printed, hands its files to emit and, after a
// column's last page, lets go of the column's traces but what the calc document needs.
func (s *SheetStream) handOn() error {
	j := s.queue[0]
	<-j.done
	s.queue[0] = nil
	s.queue = s.queue[1:]
	if j.fault != nil {
		panic(j.fault)
	}
	if j.err != nil {
		return j.err
	}
	if err := emitFiles(j.files, s.emit); err != nil {
		return err
	}
	for _, k := range j.last {
		s.settle(k)
	}
	return nil
}

// settle keeps design k in full while it governs its column group (as columnGroups finds it:
// the first of the worst in the order of the result) and otherwise only what the calc
// document needs of it.
func (s *SheetStream) settle(k int) {
	bk := s.x.bk
	d := bk.held[k]
	key := keyOf(*d)
	g, ok := s.gov[key]
	if ok && !worse(*d, *bk.held[g]) {
		s.keepOnly(k)
		return
	}
	if ok {
		s.keepOnly(g)
	}
	s.gov[key] = k
}

// keepOnly lets go of the trace of design k but for what the calc document needs of a lift
// that does not govern its group: its step IDs in order (links to its steps name their
// numbers) and, by value, the steps of the take-down and the column moments (its tables).
func (s *SheetStream) keepOnly(k int) {
	bk := s.x.bk
	d := bk.held[k]
	kd := &keptDesign{ids: make([]string, len(d.Steps))}
	for n := range d.Steps {
		st := &d.Steps[n]
		kd.ids[n] = st.ID
		if tableStep(st.ID) {
			kd.steps = append(kd.steps, keptStep{id: st.ID, symbol: st.Symbol, unit: st.Unit, value: st.Value})
		}
	}
	bk.kept[k], bk.held[k] = kd, nil
}

// tableStep reports whether the step of own ID id is one the calc document's tables read: of
// the take-down or of the column moments (subframe or frame line).
func tableStep(id string) bool {
	for _, p := range [...]string{"td/", "subx/", "suby/", "frm/"} {
		if strings.HasPrefix(id, p) {
			return true
		}
	}
	return false
}
