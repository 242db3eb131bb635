package reports

import (
	"bytes"
	"errors"
	"fmt"

	"colsheet/calc/design"
	"testing"
)

// The sheets printed by a pool of goroutines come out in the same order and with the same bytes
// as printed one at a time (common practice, no source: reruns stay byte-identical).
func TestRenderToWorkersSameBytes(t *testing.T) {
	r := runFile(t, "", packBuilding)
	formats := map[string]bool{"md": true, "tex": true, "html": true}
	type file struct {
		path string
		data []byte
	}
	collect := func(workers int) []file {
		var out []file
		if err := RenderTo(r, formats, Options{}, workers, func(p string, data []byte) error {
			out = append(out, file{path: p, data: bytes.Clone(data)})
			return nil
		}); err != nil {
			t.Fatal(err)
		}
		return out
	}
	one := collect(1)
	if want := 3*(len(r.Designs)+1) + 3; len(one) != want {
		t.Fatalf("%d files, want %d (index and sheets per format, three calc documents)", len(one), want)
	}
	for _, workers := range []int{2, 4, 16} {
		many := collect(workers)
		if len(many) != len(one) {
			t.Fatalf("workers %d: %d files, want %d", workers, len(many), len(one))
		}
		for i := range one {
			if many[i].path != one[i].path || !bytes.Equal(many[i].data, one[i].data) {
				t.Errorf("workers %d: file %d is %s, want %s with the same bytes", workers, i, many[i].path, one[i].path)
			}
		}
	}
	// An error of emit stops the run and comes back as it is.
	stop := errors.New("disk full")
	n := 0
	err := RenderTo(r, formats, Options{}, 4, func(string, []byte) error {
		if n++; n == 3 {
			return stop
		}
		return nil
	})
	if err != stop || n != 3 {
		t.Errorf("emit error: got %v after %d files, want %v after 3", err, n, stop)
	}
}

// inOrder hands the pages over in order, stops at the first error and raises a page's panic on
// the caller's goroutine (common practice, no source).
func TestInOrder(t *testing.T) {
	for _, workers := range []int{1, 3} {
		var got []string
		err := inOrder(40, workers, func(i int) (Sheet, error) {
			if i == 25 {
				return Sheet{}, fmt.Errorf("page %d", i)
			}
			return Sheet{Name: fmt.Sprint(i)}, nil
		}, func(s Sheet) error { got = append(got, s.Name); return nil })
		if err == nil || err.Error() != "page 25" || len(got) != 25 || got[24] != "24" || got[0] != "0" {
			t.Errorf("workers %d: %v after %d pages", workers, err, len(got))
		}
		func() {
			defer func() {
				if p := recover(); p != "fault 7" {
					t.Errorf("workers %d: recovered %v, want the page's panic", workers, p)
				}
			}()
			inOrder(20, workers, func(i int) (Sheet, error) {
				if i == 7 {
					panic("fault 7")
				}
				return Sheet{}, nil
			}, func(Sheet) error { return nil })
		}()
	}
}

// The sheets printed while the designs are handed on (SheetStream, the designs letting go of
// their traces) are the files of RenderTo over the whole result, byte for byte, in the building
// form (links to the lifts above, the take-down and moment tables of the calc document, the
// governing lift of each group) and in the actions form (common practice, no source: the
// package does not depend on how it was printed).
func TestSheetStreamSameFiles(t *testing.T) {
	formats := map[string]bool{"md": true, "tex": true, "html": true}
	for _, c := range []struct {
		name, file, src string
		o               Options
	}{
		{"pack building", "", packBuilding, Options{}},
		{"demo building", "../testdata/demo.yaml", "", Options{}},
		// Every step printed: the links to the loads of the column stopping on the beams of L1,
		// designed after some of the columns it stands on.
		{"demo building in full", "../testdata/demo.yaml", "", Options{Detail: Full}},
		{"columns with given actions", "../testdata/columns.yaml", "", Options{}},
	} {
		in := parseFile(t, c.file, c.src)
		whole, err := design.Stream(in, true, nil, func(int, *design.Design) error { return nil })
		if err != nil {
			t.Fatal(err)
		}
		want := map[string][]byte{}
		if err := RenderTo(whole, formats, c.o, 2, func(p string, data []byte) error {
			want[p] = bytes.Clone(data)
			return nil
		}); err != nil {
			t.Fatal(err)
		}
		for _, workers := range []int{1, 3} {
			got := map[string][]byte{}
			put := func(p string, data []byte) error {
				if _, ok := got[p]; ok {
					t.Errorf("%s: %s written twice", c.name, p)
				}
				got[p] = bytes.Clone(data)
				return nil
			}
			var ss *SheetStream
			r, err := design.Stream(in, false, func(r *design.Result) (err error) {
				ss, err = NewSheetStream(r, formats, c.o, workers, put)
				return err
			}, func(k int, d *design.Design) error { return ss.Design(k, d) })
			if err != nil {
				t.Fatal(err)
			}
			if err := ss.End(); err != nil {
				t.Fatal(err)
			}
			if len(got) != len(want) {
				t.Errorf("%s, %d workers: %d files, want %d", c.name, workers, len(got), len(want))
			}
			for p, data := range want {
				if !bytes.Equal(got[p], data) {
					t.Errorf("%s, %d workers: %s differs from the one printed from the whole result", c.name, workers, p)
				}
			}
			for k := range r.Designs {
				if r.Designs[k].Steps != nil {
					t.Fatalf("%s: design %d kept its trace", c.name, k)
				}
			}
		}
	}
}

// An error of emit stops the stream at that file and comes back as it is (common practice, no
// source).
func TestSheetStreamStopsOnError(t *testing.T) {
	in := parseFile(t, "", packBuilding)
	stop := errors.New("disk full")
	n := 0
	var ss *SheetStream
	_, err := design.Stream(in, false, func(r *design.Result) (err error) {
		ss, err = NewSheetStream(r, map[string]bool{"md": true, "html": true}, Options{}, 2, func(string, []byte) error {
			if n++; n == 3 {
				return stop
			}
			return nil
		})
		return err
	}, func(k int, d *design.Design) error { return ss.Design(k, d) })
	if err == nil {
		err = ss.End()
	}
	if err != stop || n != 3 {
		t.Errorf("emit error: got %v after %d files, want %v after 3", err, n, stop)
	}
}
