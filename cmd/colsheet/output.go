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

// newMarker returns the marker file of m listing the files of st with their SHA-256 and,
// without one, the paths in later; the same files always give the same bytes.
func newMarker(m marker, st *stage, later ...string) ([]byte, error) {
	tops := map[string]bool{}
	m.Files = []markerFile{}
	for p, f := range st.files {
		if p == markerName {
			continue
		}
		m.Files = append(m.Files, markerFile{Path: p, SHA256: f.sum})
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

// publish puts the output written in the stage st (the marker among its files) in place as
// colsheet's output in the folder dir, and tells notes what it restored. A missing dir is the
// stage renamed into place. An existing dir is replaced only with replace and only where its
// marker lists colsheet's own entries, unchanged since they were written: whole, when it holds
// nothing else, else entry by entry beside the other files (always so when st is staged inside
// dir). A folder without a marker takes the output beside its files when none of the output's
// entries is there. Any failure leaves dir as it was. checkOut runs the same checks up front.
func publish(dir string, st *stage, replace bool, notes io.Writer) error {
	dir, err := filepath.Abs(dir)
	if err != nil {
		return err
	}
	parent, base := filepath.Dir(dir), filepath.Base(dir)
	if err := restoreAside(parent, base, true, notes); err != nil {
		return err
	}
	inside := filepath.Dir(st.dir) == dir
	info, err := os.Lstat(dir)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		if err := os.MkdirAll(parent, 0o755); err != nil {
			return err
		}
		return swapFolder(dir, st, false)
	case err != nil:
		return err
	}
	if err := isFolder(dir, info); err != nil {
		return err
	}
	old, err := readMarker(dir)
	if err != nil {
		return fmt.Errorf("%s: %v; nothing written", dir, plainErr(err))
	}
	names, err := dirNames(dir)
	if err != nil {
		return err
	}
	names = without(names, filepath.Base(st.dir))
	if old == nil {
		if len(names) == 0 && !inside {
			return swapFolder(dir, st, true)
		}
		return putEntries(dir, st, nil)
	}
	if !replace {
		return errEarlier(dir)
	}
	for _, e := range old.Entries {
		if err := restoreAside(dir, e, false, notes); err != nil {
			return err
		}
	}
	if err := checkOwn(dir, old); err != nil {
		return errChanged(dir, err)
	}
	if names, err = dirNames(dir); err != nil {
		return err
	}
	names = without(names, filepath.Base(st.dir))
	if inside || !onlyOwn(names, old) {
		return putEntries(dir, st, old)
	}
	return swapFolder(dir, st, true)
}

// checkOut runs the checks of publish on the output folder dir, for an output of the top-level
// entries tops (the marker besides), so that a run that would be refused stops before it
// designs. It writes nothing; the one change it may make is publish's first: an earlier output
// that an interrupted run left aside is put back (and notes told). It returns the folder to
// stage the output in: dir's parent where the output will be renamed into place whole, dir
// itself where it goes entry by entry beside other files.
func checkOut(dir string, replace bool, tops []string, notes io.Writer) (string, error) {
	dir, err := filepath.Abs(dir)
	if err != nil {
		return "", err
	}
	parent, base := filepath.Dir(dir), filepath.Base(dir)
	if err := restoreAside(parent, base, true, notes); err != nil {
		return "", err
	}
	info, err := os.Lstat(dir)
	if errors.Is(err, fs.ErrNotExist) {
		return parent, nil
	}
	if err != nil {
		return "", err
	}
	if err := isFolder(dir, info); err != nil {
		return "", err
	}
	old, err := readMarker(dir)
	if err != nil {
		return "", fmt.Errorf("%s: %v; nothing written", dir, plainErr(err))
	}
	names, err := dirNames(dir)
	if err != nil {
		return "", err
	}
	if old != nil {
		if !replace {
			return "", errEarlier(dir)
		}
		if err := checkOwn(dir, old); err != nil {
			return "", errChanged(dir, err)
		}
		if onlyOwn(names, old) {
			return parent, nil
		}
	} else if len(names) == 0 {
		return parent, nil
	}
	for _, top := range append(tops, markerName) {
		if _, err := os.Lstat(filepath.Join(dir, top)); err == nil && !owns(old, top) {
			return "", errForeign(dir, top)
		}
	}
	return dir, nil
}

// isFolder refuses dir, of the file info, where it is a symbolic link or not a folder.
func isFolder(dir string, info fs.FileInfo) error {
	switch {
	case info.Mode()&os.ModeSymlink != 0:
		return fmt.Errorf("%s is a symbolic link; colsheet does not write through links (give the folder it points to); nothing written", dir)
	case !info.IsDir():
		return fmt.Errorf("%s exists and is not a folder; nothing written", dir)
	}
	return nil
}

func errEarlier(dir string) error {
	return fmt.Errorf("%s holds an earlier output; nothing written (give --replace to replace it)", dir)
}

func errChanged(dir string, err error) error {
	return fmt.Errorf("%s: %v; nothing replaced (move it out of the output's entries to replace them)", dir, err)
}

func errForeign(dir, top string) error {
	return fmt.Errorf("%s already holds %s, which no %s there lists as colsheet's; nothing written", dir, top, markerName)
}

// owns reports whether the marker old lists the top-level name as colsheet's (the marker itself included).
func owns(old *marker, name string) bool {
	if old == nil {
		return false
	}
	if name == markerName {
		return true
	}
	for _, e := range old.Entries {
		if e == name {
			return true
		}
	}
	return false
}

// onlyOwn reports whether every one of names is colsheet's by the marker old.
func onlyOwn(names []string, old *marker) bool {
	for _, n := range names {
		if !owns(old, n) {
			return false
		}
	}
	return true
}

// without returns names less name.
func without(names []string, name string) []string {
	out := names[:0:0]
	for _, n := range names {
		if n != name {
			out = append(out, n)
		}
	}
	return out
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
	best := asideOf(parent, name, whole)
	if best == "" {
		return nil
	}
	if err := os.Rename(best, filepath.Join(parent, name)); err != nil {
		return fmt.Errorf("restoring %s from %s: %v", name, best, err)
	}
	fmt.Fprintf(notes, "colsheet: %s was missing; the earlier output left aside by an interrupted run is restored from %s\n", filepath.Join(parent, name), best)
	return nil
}

// asideOf returns the newest entry of parent that is name moved aside, "" when there is none; a
// folder (whole) counts only when it carries colsheet's marker.
func asideOf(parent, name string, whole bool) string {
	es, err := os.ReadDir(parent)
	if err != nil {
		return "" // no parent: nothing to restore
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
	return best
}

// reserveAside returns an unused name in dir for name moved aside.
func reserveAside(dir, name string) (string, error) {
	p, err := os.MkdirTemp(dir, asidePrefix(name))
	if err != nil {
		return "", err
	}
	return p, os.Remove(p)
}

// swapFolder renames the stage st into place as dir; an existing dir is moved aside first and
// removed once the new one is in place, so that dir names either the old or the new output at
// every instant.
func swapFolder(dir string, st *stage, exists bool) error {
	parent, base := filepath.Dir(dir), filepath.Base(dir)
	tmp := st.dir
	if err := os.Chmod(tmp, 0o755); err != nil {
		return err
	}
	aside := ""
	err := temps.critical(func() error {
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

// putEntries puts the entries of the stage st into dir, a folder of other files, entry by entry:
// each is renamed into place (an earlier one of old's moved aside first, and removed at the end,
// as are old's entries that the output no longer has), the marker last. It refuses, changing
// nothing, when an entry of the output is in dir but not in old.
func putEntries(dir string, st *stage, old *marker) error {
	var tops []string
	for _, top := range st.tops() {
		if top != markerName {
			tops = append(tops, top)
		}
	}
	for _, top := range append(tops, markerName) {
		if _, err := os.Lstat(filepath.Join(dir, top)); err == nil && !owns(old, top) {
			return errForeign(dir, top)
		}
	}
	output := map[string]bool{}
	for _, top := range tops {
		output[top] = true
	}
	var gone []string // old entries the output no longer has
	if old != nil {
		for _, e := range old.Entries {
			if !output[e] {
				if _, err := os.Lstat(filepath.Join(dir, e)); err == nil {
					gone = append(gone, e)
				}
			}
		}
	}
	// Every entry is written whole in the stage: a write error has changed nothing in dir.
	staged := map[string]string{}
	for _, top := range st.tops() {
		staged[top] = filepath.Join(st.dir, top)
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
