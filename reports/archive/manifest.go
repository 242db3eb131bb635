// Package archive writes the manifest of a calculation package, verifies a package against
// it (files and traced steps) and lists the changes between two packages for a revision note.
package archive

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"fmt"
	"io"
	"os"
	"path"
	"sort"
	"strings"
)

// ManifestName is the name of the manifest file at the top of a package.
const ManifestName = "manifest.json"

// FormatVersion is the version of the manifest layout written by NewManifest.
const FormatVersion = 1

// Tool names the program and version that wrote a package and the SHA-256 of its executable.
type Tool struct {
	Name       string `json:"name"`
	Version    string `json:"version"`
	Executable string `json:"executable_sha256,omitempty"` // empty in a package of an earlier version
}

// Input names the input file of a package and holds its SHA-256.
type Input struct {
	Name   string `json:"name"`
	SHA256 string `json:"sha256"`
}

// File is one file of a package: its slash-separated path below the package folder, size and SHA-256.
type File struct {
	Path   string `json:"path"`
	Size   int64  `json:"size"`
	SHA256 string `json:"sha256"`
}

// Manifest lists what a package holds and what made it.
type Manifest struct {
	Format int    `json:"format"`
	Tool   Tool   `json:"tool"`
	Date   string `json:"date"`
	Input  Input  `json:"input"`
	Files  []File `json:"files"`
}

// Meta is what NewManifest records besides the files: the tool, the project date and the input file.
type Meta struct {
	ToolName    string
	ToolVersion string
	Executable  string // SHA-256 of the running executable, lower-case hex
	Date        string // the project date of the sheets, or "undated"
	InputName   string // base name of the input file
	Input       []byte // the input file as read
}

// Sum returns the SHA-256 of data in lower-case hex.
func Sum(data []byte) string {
	h := sha256.Sum256(data)
	return hex.EncodeToString(h[:])
}

// NewManifest returns the manifest of files (keyed by slash path; a manifest.json among them is not listed), sorted by path.
func NewManifest(files map[string][]byte, m Meta) Manifest {
	out := Manifest{
		Format: FormatVersion,
		Tool:   Tool{Name: m.ToolName, Version: m.ToolVersion, Executable: m.Executable},
		Date:   m.Date,
		Input:  Input{Name: m.InputName, SHA256: Sum(m.Input)},
		Files:  []File{},
	}
	for p, data := range files {
		if p == ManifestName {
			continue
		}
		out.Files = append(out.Files, File{Path: p, Size: int64(len(data)), SHA256: Sum(data)})
	}
	sort.Slice(out.Files, func(i, j int) bool { return out.Files[i].Path < out.Files[j].Path })
	return out
}

// JSON returns the manifest as indented JSON ending in a newline; the same manifest always gives the same bytes.
func (m Manifest) JSON() ([]byte, error) {
	if m.Files == nil {
		m.Files = []File{}
	}
	b, err := json.MarshalIndent(m, "", "  ")
	if err != nil {
		return nil, err
	}
	return append(b, '\n'), nil
}

// ReadManifest reads and checks the manifest file at name.
func ReadManifest(name string) (Manifest, error) {
	data, err := os.ReadFile(name)
	if err != nil {
		return Manifest{}, err
	}
	return ParseManifest(name, data)
}

// ParseManifest decodes and checks a manifest read from the file name; every error names the file and the field.
func ParseManifest(name string, data []byte) (Manifest, error) {
	var m Manifest
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&m); err != nil {
		return Manifest{}, fmt.Errorf("%s: %v", name, err)
	}
	if _, err := dec.Token(); err != io.EOF {
		return Manifest{}, fmt.Errorf("%s: data after the manifest object", name)
	}
	fail := func(field, format string, a ...any) (Manifest, error) {
		return Manifest{}, fmt.Errorf("%s: %s: %s", name, field, fmt.Sprintf(format, a...))
	}
	if m.Format != FormatVersion {
		return fail("format", "is %d; this version reads format %d", m.Format, FormatVersion)
	}
	if m.Tool.Name == "" {
		return fail("tool.name", "missing")
	}
	if m.Tool.Executable != "" && !isSum(m.Tool.Executable) {
		return fail("tool.executable_sha256", "%q is not a SHA-256 in lower-case hex", m.Tool.Executable)
	}
	if m.Input.Name == "" || strings.ContainsAny(m.Input.Name, `/\`) {
		return fail("input.name", "%q is not a file name", m.Input.Name)
	}
	if !isSum(m.Input.SHA256) {
		return fail("input.sha256", "%q is not a SHA-256 in lower-case hex", m.Input.SHA256)
	}
	if m.Files == nil {
		return fail("files", "missing")
	}
	for i, f := range m.Files {
		field := fmt.Sprintf("files[%d]", i)
		if err := checkPath(f.Path); err != nil {
			return fail(field+".path", "%v", err)
		}
		if i > 0 && m.Files[i-1].Path >= f.Path {
			return fail(field+".path", "%q is out of order or listed twice", f.Path)
		}
		if f.Size < 0 {
			return fail(field+".size", "%d is negative", f.Size)
		}
		if !isSum(f.SHA256) {
			return fail(field+".sha256", "%q is not a SHA-256 in lower-case hex", f.SHA256)
		}
	}
	return m, nil
}

// checkPath reports why p is not a clean relative slash path of a listed file.
func checkPath(p string) error {
	switch {
	case p == "":
		return fmt.Errorf("empty")
	case p == ManifestName:
		return fmt.Errorf("the manifest does not list itself")
	case strings.HasPrefix(p, "/") || strings.Contains(p, `\`) || path.Clean(p) != p || p == "." || p == ".." || strings.HasPrefix(p, "../"):
		return fmt.Errorf("%q is not a clean relative slash path inside the package", p)
	}
	return nil
}

// isSum reports whether s is a SHA-256 written as 64 lower-case hex digits.
func isSum(s string) bool {
	if len(s) != 64 {
		return false
	}
	for _, c := range s {
		if !('0' <= c && c <= '9' || 'a' <= c && c <= 'f') {
			return false
		}
	}
	return true
}
