package work

import (
	"errors"
	"runtime"
	"testing"
)

// EachInOrder emits every item once, in order, whatever order the workers finish in; an emit
// error stops it; a panic in f reaches the caller (common practice, no source).
func TestEachInOrder(t *testing.T) {
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(4))
	for _, n := range []int{0, 1, 7, 500} {
		made := make([]int, n)
		var got []int
		err := EachInOrder(n, 8, func(i int) {
			for k := 0; k < (n-i)*50; k++ { // later items finish sooner
				made[i] += k % 3
			}
			made[i] = i
		}, func(i int) error {
			if made[i] != i {
				t.Errorf("item %d emitted before it was made", i)
			}
			got = append(got, i)
			return nil
		})
		if err != nil || len(got) != n {
			t.Fatalf("n=%d: %v, %d emitted", n, err, len(got))
		}
		for i, v := range got {
			if v != i {
				t.Fatalf("n=%d: emitted %v", n, got)
			}
		}
	}
	stop := errors.New("stop")
	calls := 0
	if err := EachInOrder(100, 8, func(int) {}, func(i int) error {
		calls++
		if i == 3 {
			return stop
		}
		return nil
	}); !errors.Is(err, stop) || calls != 4 {
		t.Errorf("emit error: %v after %d calls", err, calls)
	}
	defer func() {
		if p := recover(); p != "boom" {
			t.Errorf("panic %v, want boom", p)
		}
	}()
	EachInOrder(100, 8, func(i int) {
		if i == 42 {
			panic("boom")
		}
	}, func(int) error { return nil })
	t.Error("no panic")
}
