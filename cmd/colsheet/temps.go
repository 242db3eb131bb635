package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"sync"
	"syscall"
)

// errStopped says that the run was stopped by a signal.
var errStopped = errors.New("stopped by a signal")

// tempSet holds the temporary files and folders of a run, so that a signal or an internal error
// can remove them. The swaps of old and new output run under its lock (critical), so that a
// signal never falls between moving the old output aside and renaming the new one in.
type tempSet struct {
	mu      sync.Mutex
	paths   map[string]bool
	stopped bool
}

// temps are the temporary files and folders of this process.
var temps = newTempSet()

func newTempSet() *tempSet { return &tempSet{paths: map[string]bool{}} }

// mkdirTemp makes and registers a temporary folder, as os.MkdirTemp.
func (s *tempSet) mkdirTemp(dir, pattern string) (string, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.stopped {
		return "", errStopped
	}
	p, err := os.MkdirTemp(dir, pattern)
	if err == nil {
		s.paths[p] = true
	}
	return p, err
}

// createTemp makes and registers a temporary file, as os.CreateTemp.
func (s *tempSet) createTemp(dir, pattern string) (*os.File, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.stopped {
		return nil, errStopped
	}
	f, err := os.CreateTemp(dir, pattern)
	if err == nil {
		s.paths[f.Name()] = true
	}
	return f, err
}

// discard removes p if it is still registered (not renamed into place meanwhile).
func (s *tempSet) discard(p string) {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.paths[p] {
		os.RemoveAll(p)
		delete(s.paths, p)
	}
}

// critical runs f under the lock; f registers with addLocked and dropLocked.
func (s *tempSet) critical(f func() error) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.stopped {
		return errStopped
	}
	return f()
}

// addLocked registers p; the lock must be held.
func (s *tempSet) addLocked(p string) { s.paths[p] = true }

// dropLocked forgets p (renamed into place); the lock must be held.
func (s *tempSet) dropLocked(p string) { delete(s.paths, p) }

// removeAll removes every registered path; with stop, no temporary path or swap is made after.
func (s *tempSet) removeAll(stop bool) {
	s.mu.Lock()
	defer s.mu.Unlock()
	for p := range s.paths {
		os.RemoveAll(p)
		delete(s.paths, p)
	}
	s.stopped = s.stopped || stop
}

// interrupted removes the temporary files of s after the signal sig, says so and returns the
// exit status for the signal (128 + its number).
func interrupted(s *tempSet, sig os.Signal, stderr io.Writer) int {
	s.removeAll(true)
	fmt.Fprintf(stderr, "colsheet: stopped (%v): temporary files removed; an earlier output is left as it was\n", sig)
	if n, ok := sig.(syscall.Signal); ok {
		return 128 + int(n)
	}
	return 130
}
