package main

import (
	"crypto/ed25519"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"

	"colsheet/reports/archive"
)

// runArchive runs the design of an input and writes it, with the input, the PDF if asked and a manifest, as a package folder.
func runArchive(args []string, stdout, stderr io.Writer) int {
	o := newOptions("archive")
	f := designFlags(&o)
	for _, a := range args {
		for _, name := range []string{"formats", "only"} {
			if a == "--"+name || a == "-"+name || strings.HasPrefix(a, "--"+name+"=") || strings.HasPrefix(a, "-"+name+"=") {
				return failUsage(stderr, "archive", usagef("--%s is not taken: an archive holds every design in every format, so that recheck can design its input again", name))
			}
		}
	}
	rest, code, done := parseCommand("archive", f, args, stdout, stderr)
	if done {
		return code
	}
	if err := o.inputAndOut(rest); err != nil {
		return failUsage(stderr, "archive", err)
	}
	var key ed25519.PrivateKey
	if o.sign != "" {
		if _, err := readFileAs("the key file", o.sign); err != nil {
			fmt.Fprintf(stderr, "colsheet archive: --sign: %v; nothing written\n", err)
			return 2
		}
		var err error
		if key, err = archive.ReadPrivateKey(o.sign); err != nil {
			fmt.Fprintf(stderr, "colsheet archive: --sign: %v; nothing written\n", err)
			return 2
		}
	}
	in, data, err := loadInput(o.input, stderr)
	if err != nil {
		fmt.Fprintln(stderr, err)
		return 2
	}
	inName := filepath.Base(o.input)
	inPath := "input/" + inName
	o.extra = []string{"input", archive.ManifestName}
	if key != nil {
		o.extra = append(o.extra, archive.SignatureName)
	}
	job, err := produce(o, in, data, stderr)
	if err != nil {
		return failRun(stderr, "archive", err)
	}
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

// recheckFlags returns the flags of recheck, setting key.
func recheckFlags(key *string) *flagSet {
	f := newFlagSet("recheck")
	f.Var(fileFlag(key), "key", "check the manifest's signature with the Ed25519 public key in `PUBFILE`")
	return f
}

// runRecheck verifies a package folder against its manifest and re-evaluates its trace.
func runRecheck(args []string, stdout, stderr io.Writer) int {
	keyFile := ""
	rest, code, done := parseCommand("recheck", recheckFlags(&keyFile), args, stdout, stderr)
	if done {
		return code
	}
	if len(rest) != 1 {
		return failUsage(stderr, "recheck", usagef("give one package folder (got %d arguments)", len(rest)))
	}
	dir := rest[0]
	if err := isArchive(dir); err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n", err)
		return 2
	}
	var pub ed25519.PublicKey
	if keyFile != "" {
		_, err := readFileAs("the key file", keyFile)
		if err == nil {
			pub, err = archive.ReadPublicKey(keyFile)
		}
		if err != nil {
			fmt.Fprintf(stderr, "colsheet recheck: --key: %v\n", err)
			return 2
		}
	}
	rep, err := archive.VerifyKey(dir, pub)
	if err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n", plainErr(err))
		return 2
	}
	if err := rep.WriteText(stdout); err != nil {
		fmt.Fprintf(stderr, "colsheet recheck: %v\n", err)
		return 2
	}
	// Provenance: the program that made the package, beside the one that rechecks it.
	if m, err := archive.ReadManifest(filepath.Join(dir, archive.ManifestName)); err == nil {
		fmt.Fprint(stdout, provenanceNote(m.Tool, version(), executableSumOrEmpty()))
	}
	if !rep.OK() {
		return 1
	}
	return 0
}

// isArchive says why dir is not a package written by colsheet archive: missing, not a folder,
// or without a manifest (an output of colsheet design, say).
func isArchive(dir string) error {
	if err := folderProblem("the package", dir); err != nil {
		return err
	}
	_, err := os.Lstat(filepath.Join(dir, archive.ManifestName))
	switch {
	case errors.Is(err, fs.ErrNotExist):
		what := "a folder"
		if m, err := readMarker(dir); err == nil && m != nil {
			what = "an output of 'colsheet " + m.Command + "'"
		}
		return fmt.Errorf("%s is %s without %s: recheck wants a package written by 'colsheet archive INPUT.yaml -o BUNDLE'", dir, what, archive.ManifestName)
	case err != nil:
		return fmt.Errorf("%s of %s cannot be read: %v", archive.ManifestName, dir, plainErr(err))
	}
	return nil
}

// compareFlags returns the flags of compare, setting out.
func compareFlags(out *string) *flagSet {
	f := newFlagSet("compare")
	f.Var(fileFlag(out), "out", "write the table to the new file `FILE.md` instead of stdout")
	f.aka("out", "o")
	return f
}

// runCompare prints, or writes to a new file, the revision table between two package folders;
// it exits 1 when they differ.
func runCompare(args []string, stdout, stderr io.Writer) int {
	out := ""
	dirs, code, done := parseCommand("compare", compareFlags(&out), args, stdout, stderr)
	if done {
		return code
	}
	if len(dirs) != 2 {
		return failUsage(stderr, "compare", usagef("give two package folders, the old one first (got %d)", len(dirs)))
	}
	for _, d := range dirs {
		if err := isPackage(d); err != nil {
			fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
			return 2
		}
	}
	ch, err := archive.Compare(dirs[0], dirs[1])
	if err != nil {
		fmt.Fprintf(stderr, "colsheet compare: %v\n", plainErr(err))
		return 2
	}
	differ := 0
	if !ch.Empty() {
		differ = 1
	}
	md := ch.Markdown()
	if out == "" {
		if _, err := stdout.Write(md); err != nil {
			fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
			return 2
		}
		return differ
	}
	if err := writeNewFile(out, md); err != nil {
		fmt.Fprintf(stderr, "colsheet compare: %v\n", err)
		return 2
	}
	fmt.Fprintf(stdout, "colsheet: revision table written to %s\n", out)
	return differ
}

// isPackage says why dir is not an output or archive of colsheet: missing, not a folder, or
// without results.json.
func isPackage(dir string) error {
	if err := folderProblem("the package", dir); err != nil {
		return err
	}
	if _, err := os.Lstat(filepath.Join(dir, archive.ResultsName)); err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return fmt.Errorf("%s holds no %s: give output folders of 'colsheet design' or 'colsheet archive'", dir, archive.ResultsName)
		}
		return fmt.Errorf("%s of %s cannot be read: %v", archive.ResultsName, dir, plainErr(err))
	}
	return nil
}

// writeNewFile writes data as the file name through a temporary file renamed into place; it refuses an existing name.
func writeNewFile(name string, data []byte) error {
	if _, err := os.Lstat(name); err == nil {
		return fmt.Errorf("%s exists; nothing written", name)
	} else if !os.IsNotExist(err) {
		return err
	}
	if err := writeAtomic(name, data); err != nil {
		return fmt.Errorf("%s: %v", name, plainErr(err))
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
