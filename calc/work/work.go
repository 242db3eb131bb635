// Package work runs independent items of a calculation on the machine's cores, results kept
// in input order.
package work

import (
	"runtime"
	"sync"
	"sync/atomic"
)

// Each calls f(i) for every i in [0, n) on at most GOMAXPROCS goroutines and returns when all
// are done; f(i) must write only what belongs to i. A panic in f is raised again in the caller.
func Each(n int, f func(i int)) {
	w := min(runtime.GOMAXPROCS(0), n)
	if w <= 1 {
		for i := 0; i < n; i++ {
			f(i)
		}
		return
	}
	var next atomic.Int64
	var c crew
	for range w {
		c.start(func() {
			for i := int(next.Add(1)) - 1; i < n; i = int(next.Add(1)) - 1 {
				f(i)
			}
		}, func() { next.Store(int64(n)) }) // after a panic the others stop at their next item
	}
	c.wait()
}

// crew is a set of goroutines whose first panic is raised again in the caller by wait.
type crew struct {
	wg     sync.WaitGroup
	once   sync.Once
	caught any
}

// start runs body on a goroutine of the crew; on the crew's first panic stopped is called.
func (c *crew) start(body, stopped func()) {
	c.wg.Add(1)
	go func() {
		defer c.wg.Done()
		defer func() {
			if p := recover(); p != nil {
				c.once.Do(func() { c.caught = p; stopped() })
			}
		}()
		body()
	}()
}

// wait waits for the crew and raises its first panic again, if any.
func (c *crew) wait() {
	c.wg.Wait()
	if c.caught != nil {
		panic(c.caught)
	}
}

// EachInOrder calls f(i) for every i in [0, n) as Each does and emit(i) in the caller's
// goroutine in order of i, as soon as f(i) and every emit before it are done; the workers keep
// at most ahead items per worker ahead of emit (at least one), so that what f makes can be let
// go by emit.
// An error from emit stops the work and is returned; a panic in f is raised again in the caller.
func EachInOrder(n, ahead int, f func(i int), emit func(i int) error) error {
	w := min(runtime.GOMAXPROCS(0), n)
	if w <= 1 {
		for i := 0; i < n; i++ {
			f(i)
			if err := emit(i); err != nil {
				return err
			}
		}
		return nil
	}
	ahead = max(ahead, 1)
	window := make(chan struct{}, ahead*w) // a slot per item between its start and its emit
	ready := make(chan int, ahead*w)
	stop := make(chan struct{})
	var next atomic.Int64
	var c crew
	for range w {
		c.start(func() {
			for {
				select {
				case window <- struct{}{}:
				case <-stop:
					return
				}
				i := int(next.Add(1)) - 1
				if i >= n {
					return
				}
				f(i)
				select {
				case ready <- i:
				case <-stop:
					return
				}
			}
		}, func() { close(stop) })
	}
	var err error
	done := make([]bool, n)
	for emitted := 0; emitted < n && err == nil; {
		select {
		case i := <-ready:
			done[i] = true
		case <-stop:
			c.wait() // a worker panicked: raised again here
		}
		for emitted < n && done[emitted] && err == nil {
			err = emit(emitted)
			emitted++
			<-window
		}
	}
	if err != nil {
		c.once.Do(func() { close(stop) })
	}
	c.wait()
	return err
}
