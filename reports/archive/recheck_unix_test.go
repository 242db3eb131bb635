//go:build unix

package archive

import (
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// A FIFO in a bundle, listed or not, is refused without being opened, so recheck cannot hang on it.
func TestRecheckFIFO(t *testing.T) {
	dir := engineBundle(t, "forge.yaml", forgeColumn)
	if err := syscall.Mkfifo(filepath.Join(dir, "md", "pipe.md"), 0o644); err != nil {
		t.Skip("no FIFOs here:", err)
	}
	r, err := Verify(dir)
	if err != nil {
		t.Fatal(err)
	}
	if r.OK() || len(r.FileProblems) != 1 || r.FileProblems[0].Path != "md/pipe.md" || !strings.Contains(r.FileProblems[0].Problem, "not a regular file") {
		t.Errorf("file problems %+v", r.FileProblems)
	}
	if _, err := readInside(dir, "md/pipe.md"); err == nil || !strings.Contains(err.Error(), "not a regular file") {
		t.Errorf("readInside of a FIFO: %v", err)
	}
}
