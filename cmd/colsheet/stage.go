package main

import (
	"bufio"
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"io"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"
)

// stage is an output being written: a temporary folder that publish renames into place, and
// the size and SHA-256 of every file written into it, taken while writing.
type stage struct {
	dir     string
	files   map[string]stagedFile // by slash path below the output folder
	written func()                // called after each file written, where set
}

// stagedFile is the size and SHA-256 (lower-case hex) of a file of a stage.
type stagedFile struct {
	size int64
	sum  string
}

// newStage makes an empty stage, a registered temporary folder in parent named after base.
func newStage(parent, base string) (*stage, error) {
	dir, err := temps.mkdirTemp(parent, "."+base+".new-")
	if err != nil {
		return nil, err
	}
	return &stage{dir: dir, files: map[string]stagedFile{}}, nil
}

// discard removes the stage's folder unless it was renamed into place.
func (s *stage) discard() { temps.discard(s.dir) }

// has reports whether the stage holds the file name.
func (s *stage) has(name string) bool {
	_, ok := s.files[name]
	return ok
}

// create writes the new file name (a slash path below the output folder) by fill, through a
// buffer, taking its size and SHA-256 as it goes; the file is readable by all.
func (s *stage) create(name string, fill func(w io.Writer) error) error {
	return s.make(name, fill, true)
}

// make writes the new file name by fill as create does, through a buffer where buffered.
func (s *stage) make(name string, fill func(w io.Writer) error, buffered bool) error {
	if name == "" || path.Clean(name) != name || strings.HasPrefix(name, "/") || strings.HasPrefix(name, "../") {
		return fmt.Errorf("writing %s: not a path below the output folder", name)
	}
	if s.has(name) {
		return fmt.Errorf("writing %s: written twice", name)
	}
	p := filepath.Join(s.dir, filepath.FromSlash(name))
	if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
		return err
	}
	f, err := os.OpenFile(p, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o644)
	if err != nil {
		return err
	}
	if writeHook != nil {
		err = writeHook(name)
	}
	h := sha256.New()
	n := &counter{}
	switch {
	case err == nil && buffered:
		bw := bufio.NewWriterSize(io.MultiWriter(f, h, n), 1<<16)
		if err = fill(bw); err == nil {
			err = bw.Flush()
		}
	case err == nil:
		err = fill(io.MultiWriter(f, h, n))
	}
	if e := f.Close(); err == nil {
		err = e
	}
	if err == nil {
		err = os.Chmod(p, 0o644)
	}
	if err != nil {
		return fmt.Errorf("writing %s: %v", name, plainErr(err))
	}
	s.files[name] = stagedFile{size: n.n, sum: hex.EncodeToString(h.Sum(nil))}
	if s.written != nil {
		s.written()
	}
	return nil
}

// put writes the new file name with data, in one write (no buffer to fill).
func (s *stage) put(name string, data []byte) error {
	return s.make(name, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	}, false)
}

// read returns the file name written into the stage.
func (s *stage) read(name string) ([]byte, error) {
	return os.ReadFile(filepath.Join(s.dir, filepath.FromSlash(name)))
}

// tops returns the top-level entries of the stage, sorted.
func (s *stage) tops() []string {
	seen := map[string]bool{}
	var out []string
	for p := range s.files {
		if t := topOf(p); !seen[t] {
			seen[t] = true
			out = append(out, t)
		}
	}
	sort.Strings(out)
	return out
}

// counter counts the bytes written through it.
type counter struct{ n int64 }

func (c *counter) Write(p []byte) (int, error) {
	c.n += int64(len(p))
	return len(p), nil
}
