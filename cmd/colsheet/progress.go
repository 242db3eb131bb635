package main

import (
	"fmt"
	"io"
	"os"
	"sync"
	"time"
)

// progress shows, on a terminal, one line on stderr for a run that takes over a second: what
// the run is doing, with the files written of their total once it writes them. It stays quiet
// when stderr is not a terminal or with -q, and clears its line when the run ends.
type progress struct {
	mu     sync.Mutex
	w      io.Writer
	start  time.Time
	what   string
	done   int
	total  int
	shown  bool
	closed bool
	stop   chan struct{}
}

// progressDelay is how long a run goes before its progress line is shown.
const progressDelay = time.Second

// newProgress returns the progress line of a run on stderr: nil (which shows nothing) when quiet
// or when stderr is not a terminal (a character device).
func newProgress(stderr io.Writer, quiet bool) *progress {
	f, ok := stderr.(*os.File)
	if quiet || !ok {
		return nil
	}
	if st, err := f.Stat(); err != nil || st.Mode()&os.ModeCharDevice == 0 {
		return nil
	}
	return startProgress(stderr, time.Now())
}

// startProgress starts the line on w for a run started at start, redrawn four times a second.
func startProgress(w io.Writer, start time.Time) *progress {
	p := progressLine(w, start)
	go func(stop <-chan struct{}) {
		t := time.NewTicker(250 * time.Millisecond)
		defer t.Stop()
		for {
			select {
			case <-stop:
				return
			case now := <-t.C:
				p.draw(now)
			}
		}
	}(p.stop)
	return p
}

// progressLine returns the line on w for a run started at start, drawn only by draw.
func progressLine(w io.Writer, start time.Time) *progress {
	return &progress{w: w, start: start, stop: make(chan struct{})}
}

// phase says what the run does now, with total things to do (0 where not counted).
func (p *progress) phase(what string, total int) {
	if p == nil {
		return
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	p.what, p.done, p.total = what, 0, total
}

// step counts one more thing done.
func (p *progress) step() {
	if p == nil {
		return
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	p.done++
}

// draw redraws the line at the time now, once the run is over the delay.
func (p *progress) draw(now time.Time) {
	p.mu.Lock()
	defer p.mu.Unlock()
	el := now.Sub(p.start)
	if p.closed || el < progressDelay || p.what == "" {
		return
	}
	line := "colsheet: " + p.what
	if p.total > 0 {
		line += fmt.Sprintf(" %d of %d", p.done, p.total)
	}
	fmt.Fprintf(p.w, "\r%s (%d s)\x1b[K", line, int(el.Seconds()))
	p.shown = true
}

// end stops the line and clears it; later calls do nothing.
func (p *progress) end() {
	if p == nil {
		return
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	if p.closed {
		return
	}
	p.closed = true
	close(p.stop)
	if p.shown {
		fmt.Fprint(p.w, "\r\x1b[K")
	}
}
