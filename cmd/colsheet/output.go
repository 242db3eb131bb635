package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"
	"time"

	"colsheet/reports/archive"
)

// markerName is the file by which colsheet knows the entries of a folder as its own output.
const markerName = ".colsheet-output"

// markerLimit caps the size of a marker file read back.
const markerLimit = 16 << 20

// marker is the content of markerName: the program and the run that wrote an output, and every
// entry (top-level name) and file it wrote. A file listed without a SHA-256 is written after the
// marker (the package manifest, which lists the marker's own SHA-256).
type marker struct {
	Program     string       `json:"program"`
	Version     string       `json:"version"`
	Command     string       `json:"command"`
	Date        string       `json:"date"`
	Input       string       `json:"input"`
	InputSHA256 string       `json:"input_sha256"`
	Entries     []string     `json:"entries"`
	Files       []markerFile `json:"files"`
}

// markerFile is one file of an output: its slash path below the output folder and its SHA-256.
type markerFile struct {
	Path   string `json:"path"`
	SHA256 string `json:"sha256,omitempty"`
}

// topOf returns the top-level entry of the slash path p.
func topOf(p string) string {
	top, _, _ := strings.Cut(p, "/")
	return top
}

// newMarker returns the marker file of m listing files (keyed by slash path) and, without a
// SHA-256, the paths in later; the same files always give the same bytes.
func newMarker(m marker, files map[string][]byte, later ...string) ([]byte, error) {
	tops := map[string]bool{}
	m.Files = []markerFile{}
	for p, data := range files {
		if p == markerName {
			continue
		}
		m.Files = append(m.Files, markerFile{Path: p, SHA256: archive.Sum(data)})
		tops[topOf(p)] = true
	}
	for _, p := range later {
		m.Files = append(m.Files, markerFile{Path: p})
		tops[topOf(p)] = true
	}
	sort.Slice(m.Files, func(i, j int) bool { return m.Files[i].Path < m.Files[j].Path })
	m.Entries = []string{}
	for t := range tops {
		m.Entries = append(m.Entries, t)
	}
	sort.Strings(m.Entries)
	b, err := json.MarshalIndent(m, "", "  ")
	if err != nil {
		return nil, err
	}
	return append(b, '\n'), nil
}

// readMarker reads the marker of the folder dir: nil when there is none, an error when it is
// not a regular file, not colsheet's or not well formed.
func readMarker(dir string) (*marker, error) {
	name := filepath.Join(dir, markerName)
	st, err := os.Lstat(name)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return nil, nil
	case err != nil:
		return nil, err
	case !st.Mode().IsRegular():
		return nil, fmt.Errorf("%s is not a regular file", markerName)
	case st.Size() > markerLimit:
		return nil, fmt.Errorf("%s is larger than %d bytes", markerName, markerLimit)
	}
	data, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	var m marker
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&m); err != nil {
		return nil, fmt.Errorf("%s: %v", markerName, err)
	}
	if m.Program != "colsheet" {
		return nil, fmt.Errorf("%s: program: %q is not colsheet", markerName, m.Program)
	}
	entries := map[string]bool{}
	for _, e := range m.Entries {
		if e == "" || e == "." || e == ".." || e == markerName || strings.ContainsAny(e, `/\`) {
			return nil, fmt.Errorf("%s: entries: %q is not a name in the folder", markerName, e)
		}
		entries[e] = true
	}
	for _, f := range m.Files {
		if f.Path == "" || path.Clean(f.Path) != f.Path || strings.HasPrefix(f.Path, "/") || strings.Contains(f.Path, `\`) || !entries[topOf(f.Path)] {
			return nil, fmt.Errorf("%s: files: %q is not a path below a listed entry", markerName, f.Path)
		}
	}
	return &m, nil
}

// checkOwn reports the first file below the entries of m in dir that colsheet did not write as
// it stands: a file not listed, a listed file changed since, or anything but a file or folder.
func checkOwn(dir string, m *marker) error {
	sums := map[string]string{}
	for _, f := range m.Files {
		sums[f.Path] = f.SHA256
	}
	for _, e := range m.Entries {
		root := filepath.Join(dir, e)
		if _, err := os.Lstat(root); errors.Is(err, fs.ErrNotExist) {
			continue
		}
		err := filepath.WalkDir(root, func(p string, d fs.DirEntry, err error) error {
			if err != nil {
				return err
			}
			rel, err := filepath.Rel(dir, p)
			if err != nil {
				return err
			}
			rel = filepath.ToSlash(rel)
			switch {
			case d.IsDir():
				return nil
			case !d.Type().IsRegular():
				return fmt.Errorf("%s is not a file colsheet wrote (%v)", rel, d.Type())
			}
			sum, ok := sums[rel]
			if !ok {
				return fmt.Errorf("%s was not written by colsheet", rel)
			}
			if sum == "" {
				return nil
			}
			data, err := os.ReadFile(p)
			if err != nil {
				return err
			}
			if archive.Sum(data) != sum {
				return fmt.Errorf("%s changed since colsheet wrote it", rel)
			}
			return nil
		})
		if err != nil {
			return err
		}
	}
	return nil
}

// publish writes files (keyed by slash path, the marker among them) as colsheet's output in the
// folder dir, and tells notes what it restored. A missing dir is written whole, as a new folder
// renamed into place. An existing dir is replaced only with replace and only where its marker
// lists colsheet's own entries, unchanged since they were written: whole, when it holds nothing
// else, else entry by entry beside the other files. A folder without a marker takes the output
// beside its files when none of the output's entries is there. Any failure leaves dir as it was.
func publish(dir string, files map[string][]byte, replace bool, notes io.Writer) error {
	dir, err := filepath.Abs(dir)
	if err != nil {
		return err
	}
	parent, base := filepath.Dir(dir), filepath.Base(dir)
	if err := restoreAside(parent, base, true, notes); err != nil {
		return err
	}
	st, err := os.Lstat(dir)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		if err := os.MkdirAll(parent, 0o755); err != nil {
			return err
		}
		return swapFolder(dir, files, false)
	case err != nil:
		return err
	case st.Mode()&os.ModeSymlink != 0:
		return fmt.Errorf("%s is a symbolic link; colsheet does not write through links (give the folder it points to); nothing written", dir)
	case !st.IsDir():
		return fmt.Errorf("%s exists and is not a folder; nothing written", dir)
	}
	old, err := readMarker(dir)
	if err != nil {
		return fmt.Errorf("%s: %v; nothing written", dir, err)
	}
	names, err := dirNames(dir)
	if err != nil {
		return err
	}
	if old == nil {
		if len(names) == 0 {
			return swapFolder(dir, files, true)
		}
		return putEntries(dir, files, nil)
	}
	if !replace {
		return fmt.Errorf("%s holds an earlier output; nothing written (give --replace to replace it)", dir)
	}
	for _, e := range old.Entries {
		if err := restoreAside(dir, e, false, notes); err != nil {
			return err
		}
	}
	if err := checkOwn(dir, old); err != nil {
		return fmt.Errorf("%s: %v; nothing replaced (move it out of the output's entries to replace them)", dir, err)
	}
	if names, err = dirNames(dir); err != nil {
		return err
	}
	own := map[string]bool{markerName: true}
	for _, e := range old.Entries {
		own[e] = true
	}
	for _, n := range names {
		if !own[n] {
			return putEntries(dir, files, old)
		}
	}
	return swapFolder(dir, files, true)
}

// dirNames lists the names in the folder dir.
func dirNames(dir string) ([]string, error) {
	es, err := os.ReadDir(dir)
	if err != nil {
		return nil, err
	}
	names := make([]string, len(es))
	for i, e := range es {
		names[i] = e.Name()
	}
	return names, nil
}

// asidePrefix is the start of the name under which an entry is moved aside while it is replaced.
func asidePrefix(name string) string { return "." + name + ".old-" }

// restoreAside puts back an entry name of parent moved aside by a run that was stopped in the
// middle of the swap (the newest one, if several), when name itself is missing; a folder
// (whole) is put back only when it carries colsheet's marker.
func restoreAside(parent, name string, whole bool, notes io.Writer) error {
	if _, err := os.Lstat(filepath.Join(parent, name)); !errors.Is(err, fs.ErrNotExist) {
		return nil
	}
	es, err := os.ReadDir(parent)
	if err != nil {
		return nil // no parent: nothing to restore
	}
	best, bestTime := "", time.Time{}
	for _, e := range es {
		if !strings.HasPrefix(e.Name(), asidePrefix(name)) {
			continue
		}
		p := filepath.Join(parent, e.Name())
		if whole {
			if m, err := readMarker(p); err != nil || m == nil {
				continue
			}
		}
		info, err := e.Info()
		if err != nil {
			continue
		}
		if best == "" || info.ModTime().After(bestTime) {
			best, bestTime = p, info.ModTime()
		}
	}
	if best == "" {
		return nil
	}
	if err := os.Rename(best, filepath.Join(parent, name)); err != nil {
		return fmt.Errorf("restoring %s from %s: %v", name, best, err)
	}
	fmt.Fprintf(notes, "colsheet: %s was missing; the earlier output left aside by an interrupted run is restored from %s\n", filepath.Join(parent, name), best)
	return nil
}

// reserveAside returns an unused name in dir for name moved aside.
func reserveAside(dir, name string) (string, error) {
	p, err := os.MkdirTemp(dir, asidePrefix(name))
	if err != nil {
		return "", err
	}
	return p, os.Remove(p)
}

// swapFolder writes files as a new folder beside dir and renames it into place; an existing dir
// is moved aside first and removed once the new one is in place, so that dir names either the
// old or the new output at every instant.
func swapFolder(dir string, files map[string][]byte, exists bool) error {
	parent, base := filepath.Dir(dir), filepath.Base(dir)
	tmp, err := temps.mkdirTemp(parent, "."+base+".new-")
	if err != nil {
		return err
	}
	defer temps.discard(tmp)
	if err := writeTree(tmp, files); err != nil {
		return err
	}
	if err := os.Chmod(tmp, 0o755); err != nil {
		return err
	}
	aside := ""
	err = temps.critical(func() error {
		if exists {
			var err error
			if aside, err = reserveAside(parent, base); err != nil {
				return err
			}
			if err := os.Rename(dir, aside); err != nil {
				return err
			}
		}
		if err := os.Rename(tmp, dir); err != nil {
			if exists {
				os.Rename(aside, dir) // put the earlier output back
			}
			return err
		}
		temps.dropLocked(tmp)
		if exists {
			temps.addLocked(aside)
		}
		return nil
	})
	if err != nil || !exists {
		return err
	}
	temps.discard(aside)
	return nil
}

// putEntries writes files into dir, a folder of other files, entry by entry: every entry is
// first written whole under a temporary name, then each is renamed into place (an earlier one of
// old's moved aside first, and removed at the end, as are old's entries that the output no
// longer has). It refuses, writing nothing, when an entry of the output is in dir but not in old.
func putEntries(dir string, files map[string][]byte, old *marker) error {
	own := map[string]bool{}
	if old != nil {
		own[markerName] = true
		for _, e := range old.Entries {
			own[e] = true
		}
	}
	groups := map[string]map[string][]byte{}
	for p, data := range files {
		top, rest, _ := strings.Cut(p, "/")
		if groups[top] == nil {
			groups[top] = map[string][]byte{}
		}
		groups[top][rest] = data
	}
	var tops []string
	for top := range groups {
		if top != markerName {
			tops = append(tops, top)
		}
	}
	sort.Strings(tops)
	for _, top := range append(tops, markerName) {
		if _, err := os.Lstat(filepath.Join(dir, top)); err == nil && !own[top] {
			return fmt.Errorf("%s already holds %s, which no %s there lists as colsheet's; nothing written", dir, top, markerName)
		}
	}
	var gone []string // old entries the output no longer has
	if old != nil {
		for _, e := range old.Entries {
			if _, ok := groups[e]; !ok {
				if _, err := os.Lstat(filepath.Join(dir, e)); err == nil {
					gone = append(gone, e)
				}
			}
		}
	}
	// Every entry written under a temporary name first: a write error changes nothing in dir.
	staged := map[string]string{}
	defer func() {
		for _, t := range staged {
			temps.discard(t)
		}
	}()
	for _, top := range append(tops, markerName) {
		g := groups[top]
		if g == nil {
			continue
		}
		if data, ok := g[""]; ok && len(g) == 1 {
			f, err := temps.createTemp(dir, "."+top+".new-")
			if err != nil {
				return err
			}
			staged[top] = f.Name()
			if err := writeOpen(f, top, data); err != nil {
				return err
			}
			continue
		}
		tmp, err := temps.mkdirTemp(dir, "."+top+".new-")
		if err != nil {
			return err
		}
		staged[top] = tmp
		sub := map[string][]byte{}
		for rest, data := range g {
			sub[rest] = data
		}
		if err := writeTreeAs(tmp, top+"/", sub); err != nil {
			return err
		}
		if err := os.Chmod(tmp, 0o755); err != nil {
			return err
		}
	}
	type swap struct{ top, aside, tmp string }
	var asides []string
	err := temps.critical(func() error {
		var did []swap
		undo := func() {
			for i := len(did) - 1; i >= 0; i-- {
				d := did[i]
				target := filepath.Join(dir, d.top)
				if d.tmp != "" {
					os.Rename(target, d.tmp)
				}
				if d.aside != "" {
					os.Rename(d.aside, target)
				}
			}
		}
		var ops []string // the entries in order: the output's, the old ones gone, the marker last
		ops = append(append(append(ops, tops...), gone...), markerName)
		for _, top := range ops {
			target := filepath.Join(dir, top)
			d := swap{top: top}
			if _, err := os.Lstat(target); err == nil {
				a, err := reserveAside(dir, top)
				if err != nil {
					undo()
					return err
				}
				if err := os.Rename(target, a); err != nil {
					undo()
					return err
				}
				d.aside = a
			}
			if tmp, ok := staged[top]; ok {
				if err := os.Rename(tmp, target); err != nil {
					if d.aside != "" {
						os.Rename(d.aside, target)
					}
					undo()
					return err
				}
				d.tmp = tmp
			}
			did = append(did, d)
		}
		for _, d := range did {
			if d.tmp != "" {
				temps.dropLocked(d.tmp)
				delete(staged, d.top)
			}
			if d.aside != "" {
				temps.addLocked(d.aside)
				asides = append(asides, d.aside)
			}
		}
		return nil
	})
	if err != nil {
		return err
	}
	for _, a := range asides {
		temps.discard(a)
	}
	return nil
}

// writeHook, when set (by tests), is called before each output file is written with its slash
// path below the output folder; an error it returns fails the write as a full disk would.
var writeHook func(name string) error

// writeTree writes every file below dir, which must exist.
func writeTree(dir string, files map[string][]byte) error { return writeTreeAs(dir, "", files) }

// writeTreeAs writes every file below dir, which must exist, naming each prefix+path to writeHook.
func writeTreeAs(dir, prefix string, files map[string][]byte) error {
	names := make([]string, 0, len(files))
	for name := range files {
		names = append(names, name)
	}
	sort.Strings(names)
	for _, name := range names {
		p := filepath.Join(dir, filepath.FromSlash(name))
		if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
			return err
		}
		f, err := os.OpenFile(p, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o644)
		if err != nil {
			return err
		}
		if err := writeOpen(f, prefix+name, files[name]); err != nil {
			return err
		}
	}
	return nil
}

// writeOpen writes data to the new file f (named name below the output), closes it and makes it
// readable by all.
func writeOpen(f *os.File, name string, data []byte) error {
	var err error
	if writeHook != nil {
		err = writeHook(name)
	}
	if err == nil {
		_, err = f.Write(data)
	}
	if e := f.Close(); err == nil {
		err = e
	}
	if err == nil {
		err = os.Chmod(f.Name(), 0o644)
	}
	if err != nil {
		return fmt.Errorf("writing %s: %v", name, err)
	}
	return nil
}

// writeAtomic writes data as the file name through a temporary file beside it renamed into
// place, so that name is never seen half-written.
func writeAtomic(name string, data []byte) error {
	tmp, err := temps.createTemp(filepath.Dir(name), "."+filepath.Base(name)+".new-")
	if err != nil {
		return err
	}
	defer temps.discard(tmp.Name())
	if err := writeOpen(tmp, filepath.Base(name), data); err != nil {
		return err
	}
	return temps.critical(func() error {
		if err := os.Rename(tmp.Name(), name); err != nil {
			return err
		}
		temps.dropLocked(tmp.Name())
		return nil
	})
}
