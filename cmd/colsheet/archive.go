package main

import (
	"crypto/ed25519"
	"fmt"
	"io"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"

	"colsheet/reports/archive"
)

// runArchive runs the design of an input and writes it, with the input, the PDF if asked and a manifest, as a package folder.
func runArchive(args []string, stdout, stderr io.Writer) int {
	for _, a := range args {
		if a == "--formats" || strings.HasPrefix(a, "--formats=") {
			fmt.Fprintf(stderr, "colsheet archive: --formats is not taken: a package holds every format\n\n%s", usage)
			return 2
		}
	}
	args, keyFile, err := takeFlag(args, "--sign")
	if err != nil {
		fmt.Fprintf(stderr, "colsheet archive: %v\n\n%s", err, usage)
		return 2
	}
	var key ed25519.PrivateKey
	if keyFile != "" {
		if key, err = archive.ReadPrivateKey(keyFile); err != nil {
			fmt.Fprintf(stderr, "colsheet archive: --sign: %v; nothing written\n", err)
			return 2
		}
	}
	o, err := parseDesignArgs(args)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet archive: %v\n\n%s", err, usage)
		return 2
	}
	o.formats = map[string]bool{"md": true, "tex": true, "html": true}
	inName := filepath.Base(o.input)
	inPath := "input/" + inName
	o.extra = []string{"input", archive.ManifestName}
	if key != nil {
		o.extra = append(o.extra, archive.SignatureName)
	}
	job, err := produce(o, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	o.command = "archive"
	if job.st.has(inPath) {
		job.st.discard()
		job.progress.end()
		fmt.Fprintf(stderr, "colsheet: %s is already an output file; nothing written\n", inPath)
		return 2
	}
	if err := job.st.put(inPath, job.input); err != nil {
		job.st.discard()
		job.progress.end()
		fmt.Fprintf(stderr, "colsheet: %v; nothing written\n", err)
		return 2
	}
	if t := job.res.Input.Actions; t != nil {
		// The actions table beside the input, as the input names it.
		rel := path.Clean(filepath.ToSlash(t.Name))
		if !filepath.IsLocal(filepath.FromSlash(rel)) || rel == inName {
			job.st.discard()
			job.progress.end()
			fmt.Fprintf(stderr, "colsheet: the actions table %s lies outside the input's folder and cannot be archived beside it; nothing written\n", t.Name)
			return 2
		}
		if err := job.st.put("input/"+rel, t.Data); err != nil {
			job.st.discard()
			job.progress.end()
			fmt.Fprintf(stderr, "colsheet: %v; nothing written\n", err)
			return 2
		}
	}
	exe, err := executableSum()
	if err != nil {
		job.st.discard()
		job.progress.end()
		fmt.Fprintf(stderr, "colsheet: the SHA-256 of the running program: %v; nothing written\n", err)
		return 2
	}
	seal := func(st *stage) error {
		m := archive.Manifest{Format: archive.FormatVersion,
			Tool:  archive.Tool{Name: job.res.ToolName, Version: job.res.ToolVersion, Executable: exe},
			Date:  job.res.Input.Project.Date,
			Input: archive.Input{Name: inName, SHA256: archive.Sum(job.input)},
			Files: []archive.File{},
		}
		for p, f := range st.files {
			if p != archive.ManifestName {
				m.Files = append(m.Files, archive.File{Path: p, Size: f.size, SHA256: f.sum})
			}
		}
		sort.Slice(m.Files, func(i, j int) bool { return m.Files[i].Path < m.Files[j].Path })
		data, err := m.JSON()
		if err != nil {
			return fmt.Errorf("%s: %v", archive.ManifestName, err)
		}
		if err := st.put(archive.ManifestName, data); err != nil {
			return err
		}
		if key != nil {
			return st.put(archive.SignatureName, archive.Sign(data, key))
		}
		return nil
	}
	return deliver(o, job, seal, stdout, stderr)
}

// runRecheck verifies a package folder against its manifest and re-evaluates its trace.
func runRecheck(args []string, stdout, stderr io.Writer) int {
	args, keyFile, err := takeFlag(args, "--key")
	if err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n\n%s", err, usage)
		return 2
	}
	if len(args) != 1 || strings.HasPrefix(args[0], "-") {
		fmt.Fprintf(stderr, "colsheet recheck: give one package folder\n\n%s", usage)
		return 2
	}
	var pub ed25519.PublicKey
	if keyFile != "" {
		if pub, err = archive.ReadPublicKey(keyFile); err != nil {
			fmt.Fprintf(stderr, "colsheet recheck: --key: %v\n", err)
			return 2
		}
	}
	rep, err := archive.VerifyKey(args[0], pub)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n", err)
		return 2
	}
	if err := rep.WriteText(stdout); err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n", err)
		return 2
	}
	// Provenance: the program that made the package, beside the one that rechecks it.
	if m, err := archive.ReadManifest(filepath.Join(args[0], archive.ManifestName)); err == nil {
		fmt.Fprint(stdout, provenanceNote(m.Tool, version(), executableSumOrEmpty()))
	}
	if !rep.OK() {
		return 1
	}
	return 0
}

// takeFlag removes the option name with its value ("--name VALUE" or "--name=VALUE") from args
// and returns the rest and the value, "" where the option is not given.
func takeFlag(args []string, name string) ([]string, string, error) {
	var rest []string
	value, seen := "", false
	for i := 0; i < len(args); i++ {
		a := args[i]
		v, has := strings.CutPrefix(a, name+"=")
		switch {
		case a != name && !has:
			rest = append(rest, a)
			continue
		case seen:
			return nil, "", fmt.Errorf("%s given twice", name)
		case !has:
			if i+1 >= len(args) {
				return nil, "", fmt.Errorf("%s needs a key file", name)
			}
			i++
			v = args[i]
		}
		if v == "" {
			return nil, "", fmt.Errorf("%s needs a key file", name)
		}
		value, seen = v, true
	}
	return rest, value, nil
}

// runCompare prints, or writes to a new file, the revision table between two package folders.
func runCompare(args []string, stdout, stderr io.Writer) int {
	var dirs []string
	out := ""
	for i := 0; i < len(args); i++ {
		switch a := args[i]; {
		case a == "-o" || a == "--out":
			if i+1 >= len(args) {
				fmt.Fprintf(stderr, "colsheet compare: %s needs a value\n\n%s", a, usage)
				return 2
			}
			i++
			out = args[i]
		case strings.HasPrefix(a, "-o="):
			out = strings.TrimPrefix(a, "-o=")
		case strings.HasPrefix(a, "--out="):
			out = strings.TrimPrefix(a, "--out=")
		case strings.HasPrefix(a, "-"):
			fmt.Fprintf(stderr, "colsheet compare: unknown option %s\n\n%s", a, usage)
			return 2
		default:
			dirs = append(dirs, a)
		}
	}
	if len(dirs) != 2 {
		fmt.Fprintf(stderr, "colsheet compare: give two package folders, the old one first\n\n%s", usage)
		return 2
	}
	ch, err := archive.Compare(dirs[0], dirs[1])
	if err != nil {
		fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
		return 2
	}
	md := ch.Markdown()
	if out == "" {
		if _, err := stdout.Write(md); err != nil {
			fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
			return 2
		}
		return 0
	}
	if err := writeNewFile(out, md); err != nil {
		fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
		return 2
	}
	fmt.Fprintf(stdout, "colsheet: revision table written to %s\n", out)
	return 0
}

// writeNewFile writes data as the file name through a temporary file renamed into place; it refuses an existing name.
func writeNewFile(name string, data []byte) error {
	if _, err := os.Lstat(name); err == nil {
		return fmt.Errorf("%s exists; nothing written", name)
	} else if !os.IsNotExist(err) {
		return err
	}
	if err := writeAtomic(name, data); err != nil {
		return fmt.Errorf("%s: %v", name, err)
	}
	return nil
}

// executableSumOrEmpty returns the SHA-256 of the running executable, "" where it cannot be read.
func executableSumOrEmpty() string {
	sum, err := executableSum()
	if err != nil {
		return ""
	}
	return sum
}

// provenanceNote says whether the package was made by the program that rechecks it: the same
// version and executable, or which differ (a different engine may design differently, so the
// re-run of the archived input can then disagree).
func provenanceNote(made archive.Tool, runVersion, runExe string) string {
	var diff []string
	if made.Version != runVersion {
		diff = append(diff, fmt.Sprintf("version %s, rechecked with %s", made.Version, runVersion))
	}
	switch {
	case made.Executable == "":
		diff = append(diff, "the executable's SHA-256 is not recorded")
	case runExe != "" && made.Executable != runExe:
		diff = append(diff, fmt.Sprintf("executable SHA-256 %s, rechecked with %s", made.Executable, runExe))
	}
	if len(diff) == 0 {
		return "provenance: made by this program (same version and executable)\n"
	}
	return "provenance: made by a different program: " + strings.Join(diff, "; ") + "\n"
}
