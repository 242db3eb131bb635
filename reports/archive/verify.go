package archive

import (
	"bytes"
	"crypto/ed25519"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"os"
	"path"
	"path/filepath"
	"strings"

	"colsheet/calc/trace"
	"colsheet/reports"
)

// ResultsName is the name of the results file at the top of a package.
const ResultsName = "results.json"

// Tolerance is the relative tolerance to which every traced step must reproduce.
const Tolerance = 1e-9

// FileProblem is a file of a package that does not match its manifest.
type FileProblem struct {
	Path    string // slash path below the package folder
	Problem string
}

// StepProblem is a traced step of results.json that does not reproduce.
type StepProblem struct {
	Column, Lift string
	ID, Title    string
	Problem      string
	Numbers      bool    // whether Recorded and Recomputed hold the two numbers that differ
	Recorded     float64 // the number as recorded
	Recomputed   float64 // the number as evaluated again, or as its source step records it
	Source       bool    // whether Recomputed is the value recorded by the argument's source step
}

// Report is the outcome of Verify: what was checked and every failure found.
type Report struct {
	Dir          string
	Files        int // files listed in the manifest and checked
	Steps        int // traced steps re-evaluated
	References   int // arguments whose source step was looked up
	Printed      int // steps printed on the Markdown sheets and compared with results.json
	Signed       bool
	FileProblems []FileProblem
	StepProblems []StepProblem
	Problems     []Problem // contract values, sheets, inputs and the signature
}

// OK reports whether every file matches the manifest, every step reproduces, every contract
// value, printed value and input agrees with its step, and the signature, where asked, holds.
func (r *Report) OK() bool {
	return len(r.FileProblems) == 0 && len(r.StepProblems) == 0 && len(r.Problems) == 0
}

// WriteText writes a plain text summary of the report to w.
func (r *Report) WriteText(w io.Writer) error {
	var b bytes.Buffer
	fmt.Fprintf(&b, "recheck of %s: %d files, %d steps, %d references, %d printed values checked\n", r.Dir, r.Files, r.Steps, r.References, r.Printed)
	for _, p := range r.FileProblems {
		fmt.Fprintf(&b, "FAIL file %s: %s\n", p.Path, p.Problem)
	}
	for _, p := range r.StepProblems {
		fmt.Fprintf(&b, "FAIL step %s (column %s, lift %s) %q: %s", p.ID, p.Column, p.Lift, p.Title, p.Problem)
		switch {
		case p.Numbers && p.Source:
			fmt.Fprintf(&b, ": recorded %.12g, the source step records %.12g", p.Recorded, p.Recomputed)
		case p.Numbers:
			fmt.Fprintf(&b, ": recorded %.12g, recomputed %.12g", p.Recorded, p.Recomputed)
		}
		b.WriteByte('\n')
	}
	for _, p := range r.Problems {
		if p.Design != "" {
			fmt.Fprintf(&b, "FAIL design %s, %s: %s\n", p.Design, p.Key, p.Problem)
		} else {
			fmt.Fprintf(&b, "FAIL %s: %s\n", p.Key, p.Problem)
		}
	}
	switch {
	case !r.OK():
		fmt.Fprintf(&b, "NOT OK: %d file problems, %d step problems, %d other problems\n", len(r.FileProblems), len(r.StepProblems), len(r.Problems))
	case r.Signed:
		fmt.Fprintln(&b, "OK: the manifest's signature holds for the key given, every file matches the manifest, every step reproduces, and results.json, the sheets and the input agree with the steps")
	default:
		fmt.Fprintln(&b, "OK: every file matches the manifest, every step reproduces, and results.json, the sheets and the input agree with the steps (consistency only: the manifest is not signed)")
	}
	_, err := w.Write(b.Bytes())
	return err
}

// results is the part of results.json that the archive reads.
type results struct {
	Tool        Tool              `json:"tool"`
	InputSHA256 string            `json:"input_sha256"`
	Forms       []json.RawMessage `json:"forms"`
	RawBasis    []json.RawMessage `json:"basis"`
	Designs     []resultsCase     `json:"designs"`
	Basis       []trace.Step      `json:"-"` // the project basis, read back whole
}

// resultsCase is one design of results.json: the contract values and the trace.
// resultsLoadCase is one load case of a design in results.json.
type resultsLoadCase struct {
	Name string  `json:"name"`
	NEd  float64 `json:"NEd_kN"`
	Axes struct {
		Y resultsAxis `json:"y"`
		Z resultsAxis `json:"z"`
	} `json:"axes"`
	Prefix string `json:"steps_prefix"`
}

type resultsCase struct {
	Column string  `json:"column"`
	Lift   string  `json:"storey"`
	NEd    float64 `json:"NEd_kN"`
	Axes   struct {
		Y resultsAxis `json:"y"`
		Z resultsAxis `json:"z"`
	} `json:"axes"`
	AsProv float64 `json:"As_prov_mm2"`
	Bars   struct {
		Count     int          `json:"count"`
		Dia       float64      `json:"dia_mm"`
		Positions [][2]float64 `json:"positions_mm"`
	} `json:"bars"`
	Links struct {
		Dia            float64 `json:"dia_mm"`
		Spacing        float64 `json:"spacing_mm"`
		SpacingReduced float64 `json:"spacing_reduced_mm"`
	} `json:"links"`
	B           float64           `json:"b_mm"`
	H           float64           `json:"h_mm"`
	Cover       float64           `json:"cover_mm"`
	AsReq       float64           `json:"As_req_mm2"`
	AsMin       float64           `json:"As_min_mm2"`
	AsMax       float64           `json:"As_max_mm2"`
	Utilization float64           `json:"utilization"`
	Status      string            `json:"status"`
	Governing   string            `json:"governing"`
	Cases       []resultsLoadCase `json:"cases"`
	RawTrace    []json.RawMessage `json:"trace"`
	Trace       []trace.Step      `json:"-"` // read back whole (reports.Unpacker)
	byID        map[string]int    // index of each step of Trace by its ID, built on first use
}

// resultsAxis holds the design and resisting moments about one axis.
type resultsAxis struct {
	MEd float64 `json:"MEd_kNm"`
	MRd float64 `json:"MRd_kNm"`
}

// readResults reads and decodes the results file at name.
func readResults(name string) (*results, error) {
	data, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	return parseResults(name, data)
}

// parseResults reads the results.json data (name is for messages).
func parseResults(name string, data []byte) (*results, error) {
	var r results
	if err := json.Unmarshal(data, &r); err != nil {
		return nil, fmt.Errorf("%s: %v", name, err)
	}
	if r.Designs == nil {
		return nil, fmt.Errorf("%s: designs: missing", name)
	}
	for i, d := range r.Designs {
		if d.Column == "" || d.Lift == "" {
			return nil, fmt.Errorf("%s: designs[%d]: column or storey missing", name, i)
		}
	}
	u, err := reports.NewUnpacker(r.Forms)
	if err != nil {
		return nil, fmt.Errorf("%s: %v", name, err)
	}
	if r.Basis, err = u.Steps(r.RawBasis, ""); err != nil {
		return nil, fmt.Errorf("%s: basis: %v", name, err)
	}
	for i := range r.Designs {
		d := &r.Designs[i]
		if d.Trace, err = u.Steps(d.RawTrace, d.Column+"/"+d.Lift+"/"); err != nil {
			return nil, fmt.Errorf("%s: designs[%d]: %v", name, i, err)
		}
	}
	return &r, nil
}

// Verify checks the package in dir against its manifest and re-evaluates every traced step of its
// results.json; it ties each contract value of results.json to the step that produces it, each
// value printed on the Markdown sheets to its step, and each input step to the archived input,
// read and designed again. It returns an error only when the manifest cannot be read; every
// other fault goes into the report. Symbolic links, FIFOs, devices and files larger than
// MaxFileSize are refused unread.
func Verify(dir string) (*Report, error) { return VerifyKey(dir, nil) }

// VerifyKey is Verify that also checks the manifest's signature (SignatureName) with the Ed25519
// public key pub; with pub nil it checks no signature.
func VerifyKey(dir string, pub ed25519.PublicKey) (*Report, error) {
	data, err := readInside(dir, ManifestName)
	if err != nil {
		return nil, err
	}
	m, err := ParseManifest(filepath.Join(dir, ManifestName), data)
	if err != nil {
		return nil, err
	}
	r := &Report{Dir: dir}
	if pub != nil {
		r.checkSignature(dir, data, pub)
	}
	files := r.checkFiles(dir, m)
	resData, ok := files[ResultsName]
	if !ok {
		if resData, err = readInside(dir, ResultsName); err != nil {
			r.fileProblem(ResultsName, fmt.Sprintf("cannot be read: %v", err))
			return r, nil
		}
	}
	res, err := parseResults(filepath.Join(dir, ResultsName), resData)
	if err != nil {
		r.fileProblem(ResultsName, fmt.Sprintf("cannot be read: %v", err))
		return r, nil
	}
	if res.InputSHA256 != m.Input.SHA256 {
		r.fileProblem(ResultsName, fmt.Sprintf("input_sha256 %s differs from the manifest's input.sha256 %s", res.InputSHA256, m.Input.SHA256))
	}
	r.checkSteps(res)
	r.checkContract(res)
	steps := map[string]trace.Step{}
	for _, s := range res.Basis {
		steps[reports.StepAnchor(s.ID)] = s
	}
	for _, d := range res.Designs {
		for _, s := range d.Trace {
			steps[reports.StepAnchor(s.ID)] = s
		}
	}
	for _, f := range m.Files {
		if data, ok := files[f.Path]; ok && strings.HasSuffix(f.Path, ".md") {
			r.checkSheet(f.Path, data, steps)
		}
	}
	in := path.Join("input", m.Input.Name)
	if data, ok := files[in]; ok {
		read := func(name string) ([]byte, error) {
			// The actions table, archived beside the input under the name the input gives.
			if t, ok := files[path.Join("input", path.Clean(filepath.ToSlash(name)))]; ok {
				return t, nil
			}
			return nil, fmt.Errorf("%s is not in the bundle's input folder", name)
		}
		r.checkInputs(res, filepath.Join(dir, filepath.FromSlash(in)), data, read)
	} else {
		r.problem(nil, "input", "the archived input %s cannot be read, so the input steps cannot be checked", in)
	}
	return r, nil
}

func (r *Report) fileProblem(p, problem string) {
	r.FileProblems = append(r.FileProblems, FileProblem{Path: p, Problem: problem})
}

// MaxFileSize is the largest file recheck reads from a package: 256 MiB. A larger file is
// refused unread, so that a hostile package cannot exhaust memory or time.
const MaxFileSize = 256 << 20

// readInside reads the file at the slash path rel below dir. Every component of the path must
// be a directory or, the last, a regular file: a symbolic link, FIFO, device or socket is
// refused before it is opened, so that a package can neither read outside itself nor block
// the reader; a file above MaxFileSize is refused, and one that changes while read fails.
func readInside(dir, rel string) ([]byte, error) {
	parts := strings.Split(rel, "/")
	name := dir
	var st fs.FileInfo
	for i, part := range parts {
		name = filepath.Join(name, part)
		var err error
		if st, err = os.Lstat(name); err != nil {
			return nil, err
		}
		last := i == len(parts)-1
		switch m := st.Mode(); {
		case m&fs.ModeSymlink != 0:
			return nil, fmt.Errorf("%s is a symbolic link: refused", path.Join(parts[:i+1]...))
		case !last && !m.IsDir():
			return nil, fmt.Errorf("%s is not a folder: refused", path.Join(parts[:i+1]...))
		case last && !m.IsRegular():
			return nil, fmt.Errorf("%s is not a regular file (%v): refused", rel, m.Type())
		}
	}
	if st.Size() > MaxFileSize {
		return nil, fmt.Errorf("%s is %d bytes, above the limit of %d: refused", rel, st.Size(), MaxFileSize)
	}
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	if st2, err := f.Stat(); err != nil || !os.SameFile(st, st2) {
		return nil, fmt.Errorf("%s changed while it was opened: refused", rel)
	}
	data, err := io.ReadAll(io.LimitReader(f, MaxFileSize+1))
	if err != nil {
		return nil, err
	}
	if int64(len(data)) > MaxFileSize {
		return nil, fmt.Errorf("%s grew above the limit of %d bytes while read: refused", rel, MaxFileSize)
	}
	return data, nil
}

// checkFiles compares every file listed in m with the file in dir, lists the files m does not
// list and refuses every entry that is neither a folder nor a regular file. It returns the
// files read that match the manifest, by slash path.
func (r *Report) checkFiles(dir string, m Manifest) map[string][]byte {
	files := map[string][]byte{}
	listed := map[string]bool{ManifestName: true, SignatureName: true}
	for _, f := range m.Files {
		listed[f.Path] = true
		r.Files++
		data, err := readInside(dir, f.Path)
		switch {
		case errors.Is(err, fs.ErrNotExist):
			r.fileProblem(f.Path, "missing")
			continue
		case err != nil:
			r.fileProblem(f.Path, fmt.Sprintf("cannot be read: %v", err))
			continue
		case int64(len(data)) != f.Size:
			r.fileProblem(f.Path, fmt.Sprintf("size %d bytes, the manifest says %d", len(data), f.Size))
			continue
		}
		if got := Sum(data); got != f.SHA256 {
			r.fileProblem(f.Path, fmt.Sprintf("content changed: SHA-256 %s, the manifest says %s", got, f.SHA256))
			continue
		}
		files[f.Path] = data
	}
	in := path.Join("input", m.Input.Name)
	found := false
	for _, f := range m.Files {
		if f.Path == in {
			found = true
			if f.SHA256 != m.Input.SHA256 {
				r.fileProblem(in, fmt.Sprintf("listed with SHA-256 %s, the manifest's input.sha256 is %s", f.SHA256, m.Input.SHA256))
				delete(files, in)
			}
		}
	}
	if !found {
		r.fileProblem(in, "the input file named in the manifest is not listed")
	}
	err := filepath.WalkDir(dir, func(p string, d fs.DirEntry, err error) error {
		rel, _ := filepath.Rel(dir, p)
		rel = filepath.ToSlash(rel)
		if err != nil {
			r.fileProblem(rel, fmt.Sprintf("cannot be read: %v", err))
			return nil
		}
		switch t := d.Type(); {
		case d.IsDir():
			return nil
		case t&fs.ModeSymlink != 0:
			r.fileProblem(rel, "is a symbolic link: a package holds only folders and regular files")
		case !t.IsRegular():
			r.fileProblem(rel, fmt.Sprintf("is not a regular file (%v): a package holds only folders and regular files", t))
		case !listed[rel]:
			r.fileProblem(rel, "present but not listed in the manifest")
		}
		return nil
	})
	if err != nil {
		r.fileProblem(".", fmt.Sprintf("cannot be listed: %v", err))
	}
	return files
}

// checkSteps re-evaluates every step of res, its project basis and every design's, and checks
// every argument against the step it names as its source.
func (r *Report) checkSteps(res *results) {
	ids := map[string]trace.Step{}
	basis := resultsCase{Column: "(project basis)", Lift: "—", Trace: res.Basis}
	for _, s := range basis.Trace {
		if _, dup := ids[s.ID]; dup {
			r.stepProblem(basis, s, "the step ID is used twice", false, 0, 0)
			continue
		}
		ids[s.ID] = s
	}
	for _, d := range res.Designs {
		for _, s := range d.Trace {
			if _, dup := ids[s.ID]; dup {
				r.stepProblem(d, s, "the step ID is used twice", false, 0, 0)
				continue
			}
			ids[s.ID] = s
		}
	}
	for _, d := range append([]resultsCase{basis}, res.Designs...) {
		prefix := d.Column + "/" + d.Lift + "/"
		for _, s := range d.Trace {
			r.Steps++
			r.checkStep(d, s)
			for _, a := range s.Args {
				if a.From == "" {
					continue
				}
				src, ok := ids[strings.TrimPrefix(a.From, "/")]
				if !ok && !strings.HasPrefix(a.From, "/") {
					src, ok = ids[prefix+a.From]
				}
				if !ok {
					r.stepProblem(d, s, fmt.Sprintf("argument %s names step %s, which results.json does not hold", a.Name, a.From), false, 0, 0)
					continue
				}
				r.References++
				if !near(a.Value, src.Value) {
					r.stepProblem(d, s, fmt.Sprintf("argument %s does not carry the value of its source step %s", a.Name, src.ID), true, a.Value, src.Value)
					r.StepProblems[len(r.StepProblems)-1].Source = true
				}
			}
		}
	}
}

// checkStep re-evaluates one step with trace.Recheck and checks the verdict of a check step.
func (r *Report) checkStep(d resultsCase, s trace.Step) {
	switch s.Kind {
	case trace.KindInput, trace.KindTable, trace.KindFormula, trace.KindSolve, trace.KindCheck:
	default:
		r.stepProblem(d, s, fmt.Sprintf("unknown kind %q", s.Kind), false, 0, 0)
		return
	}
	if err := trace.Recheck(s, Tolerance); err != nil {
		what := strings.TrimPrefix(err.Error(), "step "+s.ID+": ")
		switch s.Kind {
		case trace.KindFormula, trace.KindCheck:
			if got, e := trace.Eval(s.Expr, s.Args); e == nil && trace.Finite(s.Value) {
				r.stepProblem(d, s, "value does not reproduce from "+s.Expr, true, s.Value, got)
				return
			}
		case trace.KindSolve:
			if got, e := trace.Eval(s.Verify(), s.Args); e == nil && trace.Finite(s.Residual()) {
				r.stepProblem(d, s, "residual does not reproduce from "+s.Verify(), true, s.Residual(), got)
				return
			}
		}
		r.stepProblem(d, s, what, false, 0, 0)
		return
	}
	if s.Kind == trace.KindCheck {
		switch {
		case s.Verdict != trace.Pass && s.Verdict != trace.Fail:
			r.stepProblem(d, s, fmt.Sprintf("verdict %q is neither pass nor fail", s.Verdict), false, 0, 0)
		case s.Verdict == trace.Pass && !(s.Value <= 1+Tolerance):
			r.stepProblem(d, s, "verdict pass with a ratio above 1", false, 0, 0)
		}
	}
}

func (r *Report) stepProblem(d resultsCase, s trace.Step, problem string, numbers bool, recorded, recomputed float64) {
	r.StepProblems = append(r.StepProblems, StepProblem{Column: d.Column, Lift: d.Lift, ID: s.ID, Title: s.Title,
		Problem: problem, Numbers: numbers, Recorded: recorded, Recomputed: recomputed})
}

// near reports whether a and b agree to the relative Tolerance.
func near(a, b float64) bool {
	d := math.Abs(a - b)
	return d <= Tolerance*math.Max(math.Abs(a), math.Abs(b)) || d <= 1e-300
}
