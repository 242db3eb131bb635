package reports

import (
	"fmt"
	"strings"

	"colsheet/calc/design"
	"colsheet/calc/trace"
)

// SheetStream prints the files of RenderTo, byte for byte, while a result's designs are handed
// on one by one (design.Stream), holding only the traces that the pages still to print need.
type SheetStream struct {
	// Each file goes to emit as soon as it is printed, its bytes valid only during the call. A
	// column's sheets are printed once its lifts and every design they refer to (a column
	// stopping on the beams of another refers to its loads) are in hand; the index and the calc
	// document at the end. The stream holds the traces of the columns in hand, of the designs
	// they refer to and of each column group's governing lift so far; of every other design
	// only what later pages need (keptDesign: its step IDs and which are checks, for the links;
	// its take-down and moment values, for the calc document's tables).
	x       *renderer // nil: no sheets asked for
	emit    func(path string, data []byte) error
	workers int
	busy    chan struct{}    // a place per page being printed
	queue   []*pageJob       // the pages being printed, in order
	column  []int            // the designs in hand of the column being handed on
	waiting []*columnJob     // columns in hand that refer to designs not yet handed on, in order
	handed  int              // the designs handed on so far: 0 … handed-1
	gov     map[groupKey]int // the governing design of each column group so far
	state   []designState    // by design
}

// designState is what keeps a design's trace in hand.
type designState struct {
	governs bool // it governs its column group so far
	printed bool // its sheet is printed and handed on
	pins    int  // the columns not yet printed whose sheets refer to it
}

// columnJob is a column whose sheets are to be printed: its designs, in order, and the designs
// of other columns its steps refer to.
type columnJob struct {
	designs, needs []int
	after          int // the designs handed on before it can be printed: the last it needs, plus one
}

// pageJob is one page being printed on a goroutine of its own.
type pageJob struct {
	done  chan struct{} // closed once printed
	files []file
	err   error
	fault any        // a panic of the printing, raised again on the caller's goroutine
	last  *columnJob // the column whose last page this is, its designs let go once it is handed on
}

// NewSheetStream returns the stream of the pages of r in the formats asked for (md, tex, html),
// printed by up to workers goroutines, r as design.Stream hands it to its start.
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
		s.state = make([]designState, len(r.Designs))
	}
	return s, nil
}

// Design takes design k (k = 0, 1, … in order) as it is handed on, with its trace, sections and
// interaction data.
func (s *SheetStream) Design(k int, d *design.Design) error {
	if s.x == nil {
		return nil
	}
	if err := finiteDesign(d); err != nil {
		return err
	}
	bk := s.x.bk
	if len(s.column) > 0 && bk.held[s.column[0]].Column != d.Column {
		s.columnDone()
	}
	c := *d // as handed on: the stream lets go of the result's copy
	bk.held[k] = &c
	s.handed = k + 1
	s.column = append(s.column, k)
	// The governing lift of its group, as columnGroups finds it: the first of the worst in the
	// order of the result.
	key := keyOf(c)
	if g, ok := s.gov[key]; !ok || worse(c, *bk.held[g]) {
		s.gov[key] = k
		s.state[k].governs = true
		if ok {
			s.state[g].governs = false
			s.letGo(g)
		}
	}
	return s.printReady()
}

// End prints the sheets still in hand, then the index and the calc document of each format.
func (s *SheetStream) End() error {
	if s.x == nil {
		return nil
	}
	s.columnDone()
	if err := s.printReady(); err != nil {
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

// columnDone puts the column in hand among those waiting to be printed, with the designs of
// other columns that its steps refer to, which stay in hand until its sheets are printed.
func (s *SheetStream) columnDone() {
	if len(s.column) == 0 {
		return
	}
	col := &columnJob{designs: s.column}
	s.column = nil
	bk := s.x.bk
	own := map[int]bool{}
	for _, k := range col.designs {
		own[k] = true
	}
	seen := map[int]bool{}
	for _, k := range col.designs {
		for i := range bk.held[k].Steps {
			for _, a := range bk.held[k].Steps[i].Args {
				// Another design's step: its whole ID, "/" first (see design.WholeStep).
				if len(a.From) < 2 || a.From[0] != '/' || strings.HasPrefix(a.From, "/"+design.BasisPrefix) {
					continue
				}
				for _, j := range bk.candidates(a.From[1:]) {
					if !own[j] && !seen[j] {
						seen[j] = true
						col.needs = append(col.needs, j)
						col.after = max(col.after, j+1)
						s.state[j].pins++
					}
				}
			}
		}
	}
	s.waiting = append(s.waiting, col)
}

// printReady starts printing the columns waiting whose designs and the designs they refer to
// are all handed on, and hands on the pages printed, waiting while more than two pages per
// worker are being printed.
func (s *SheetStream) printReady() error {
	kept := s.waiting[:0]
	for _, col := range s.waiting {
		if col.after > s.handed {
			kept = append(kept, col)
			continue
		}
		if err := s.print(col); err != nil {
			return err // the stream stops here
		}
	}
	clear(s.waiting[len(kept):])
	s.waiting = kept
	return nil
}

// print starts printing the sheets of col.
func (s *SheetStream) print(col *columnJob) error {
	for n, k := range col.designs {
		j := &pageJob{done: make(chan struct{})}
		if n == len(col.designs)-1 {
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
// column's last page, lets go of what no sheet still to print needs.
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
	if col := j.last; col != nil {
		for _, k := range col.designs {
			s.state[k].printed = true
			s.letGo(k)
		}
		for _, k := range col.needs {
			s.state[k].pins--
			s.letGo(k)
		}
	}
	return nil
}

// letGo lets go of the trace of design k, but for what the calc document needs, once its sheet
// is printed, no sheet still to print refers to it and it does not govern its group.
func (s *SheetStream) letGo(k int) {
	if st := s.state[k]; st.printed && st.pins == 0 && !st.governs && s.x.bk.held[k] != nil {
		s.keepOnly(k)
	}
}

// keepOnly lets go of the trace of design k but for what the sheets still to print need of a
// lift that does not govern its group: its step IDs in order and which are checks (links to
// its steps name their numbers) and, by value, the steps of the take-down and the column
// moments (the calc document's tables).
func (s *SheetStream) keepOnly(k int) {
	bk := s.x.bk
	d := bk.held[k]
	kd := &keptDesign{ids: make([]string, len(d.Steps)), checks: make([]bool, len(d.Steps))}
	for n := range d.Steps {
		st := &d.Steps[n]
		kd.ids[n], kd.checks[n] = st.ID, st.Kind == trace.KindCheck
		if tableStep(st.ID) {
			kd.steps = append(kd.steps, keptStep{id: st.ID, symbol: st.Symbol, unit: st.Unit, value: st.Value})
		}
	}
	bk.kept[k], bk.held[k] = kd, nil
}
