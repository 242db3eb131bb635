package archive

import (
	"bytes"
	"encoding/json"
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
	FileProblems []FileProblem
	StepProblems []StepProblem
}

// OK reports whether every file matches the manifest and every step reproduces.
func (r *Report) OK() bool { return len(r.FileProblems) == 0 && len(r.StepProblems) == 0 }

// WriteText writes a plain text summary of the report to w.
func (r *Report) WriteText(w io.Writer) error {
	var b bytes.Buffer
	fmt.Fprintf(&b, "recheck of %s: %d files, %d steps, %d references checked\n", r.Dir, r.Files, r.Steps, r.References)
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
	if r.OK() {
		fmt.Fprintln(&b, "OK: every file matches the manifest and every step reproduces")
	} else {
		fmt.Fprintf(&b, "NOT OK: %d file problems, %d step problems\n", len(r.FileProblems), len(r.StepProblems))
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
		Count int     `json:"count"`
		Dia   float64 `json:"dia_mm"`
	} `json:"bars"`
	Links struct {
		Dia     float64 `json:"dia_mm"`
		Spacing float64 `json:"spacing_mm"`
	} `json:"links"`
	Utilization float64           `json:"utilization"`
	Status      string            `json:"status"`
	Governing   string            `json:"governing"`
	RawTrace    []json.RawMessage `json:"trace"`
	Trace       []trace.Step      `json:"-"` // read back whole (reports.Unpacker)
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

// Verify checks the package in dir against its manifest and re-evaluates every traced step of its results.json.
// It returns an error only when the manifest cannot be read; every other fault goes into the report.
func Verify(dir string) (*Report, error) {
	m, err := ReadManifest(filepath.Join(dir, ManifestName))
	if err != nil {
		return nil, err
	}
	r := &Report{Dir: dir}
	r.checkFiles(dir, m)
	res, err := readResults(filepath.Join(dir, ResultsName))
	if err != nil {
		r.fileProblem(ResultsName, fmt.Sprintf("cannot be read: %v", err))
		return r, nil
	}
	if res.InputSHA256 != m.Input.SHA256 {
		r.fileProblem(ResultsName, fmt.Sprintf("input_sha256 %s differs from the manifest's input.sha256 %s", res.InputSHA256, m.Input.SHA256))
	}
	r.checkSteps(res)
	r.checkContract(res)
	return r, nil
}

func (r *Report) fileProblem(p, problem string) {
	r.FileProblems = append(r.FileProblems, FileProblem{Path: p, Problem: problem})
}

// checkFiles compares every file listed in m with the file in dir and lists the files m does not list.
func (r *Report) checkFiles(dir string, m Manifest) {
	listed := map[string]bool{ManifestName: true}
	for _, f := range m.Files {
		listed[f.Path] = true
		r.Files++
		name := filepath.Join(dir, filepath.FromSlash(f.Path))
		st, err := os.Lstat(name)
		switch {
		case os.IsNotExist(err):
			r.fileProblem(f.Path, "missing")
			continue
		case err != nil:
			r.fileProblem(f.Path, fmt.Sprintf("cannot be read: %v", err))
			continue
		case !st.Mode().IsRegular():
			r.fileProblem(f.Path, "is not a regular file")
			continue
		case st.Size() != f.Size:
			r.fileProblem(f.Path, fmt.Sprintf("size %d bytes, the manifest says %d", st.Size(), f.Size))
			continue
		}
		data, err := os.ReadFile(name)
		if err != nil {
			r.fileProblem(f.Path, fmt.Sprintf("cannot be read: %v", err))
			continue
		}
		if got := Sum(data); got != f.SHA256 {
			r.fileProblem(f.Path, fmt.Sprintf("content changed: SHA-256 %s, the manifest says %s", got, f.SHA256))
		}
	}
	in := path.Join("input", m.Input.Name)
	found := false
	for _, f := range m.Files {
		if f.Path == in {
			found = true
			if f.SHA256 != m.Input.SHA256 {
				r.fileProblem(in, fmt.Sprintf("listed with SHA-256 %s, the manifest's input.sha256 is %s", f.SHA256, m.Input.SHA256))
			}
		}
	}
	if !found {
		r.fileProblem(in, "the input file named in the manifest is not listed")
	}
	err := filepath.WalkDir(dir, func(p string, d fs.DirEntry, err error) error {
		if err != nil {
			rel, _ := filepath.Rel(dir, p)
			r.fileProblem(filepath.ToSlash(rel), fmt.Sprintf("cannot be read: %v", err))
			return nil
		}
		if d.IsDir() {
			return nil
		}
		rel, err := filepath.Rel(dir, p)
		if err != nil {
			return err
		}
		rel = filepath.ToSlash(rel)
		if !listed[rel] {
			r.fileProblem(rel, "present but not listed in the manifest")
		}
		return nil
	})
	if err != nil {
		r.fileProblem(".", fmt.Sprintf("cannot be listed: %v", err))
	}
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
			if got, e := trace.Eval(s.Verify, s.Args); e == nil && trace.Finite(s.Residual) {
				r.stepProblem(d, s, "residual does not reproduce from "+s.Verify, true, s.Residual, got)
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

// checkContract checks that every contract value of a design (NEd, MEd and MRd about each axis,
// As,prov, the utilisation) is the value of one of its traced steps, so that a number changed in
// results.json outside the trace is caught too.
func (r *Report) checkContract(res *results) {
	for _, d := range res.Designs {
		for _, c := range []struct {
			key   string
			v     float64
			scale float64 // to engine units
		}{
			{"NEd_kN", d.NEd, 1e3},
			{"axes.y.MEd_kNm", d.Axes.Y.MEd, 1e6}, {"axes.y.MRd_kNm", d.Axes.Y.MRd, 1e6},
			{"axes.z.MEd_kNm", d.Axes.Z.MEd, 1e6}, {"axes.z.MRd_kNm", d.Axes.Z.MRd, 1e6},
			{"As_prov_mm2", d.AsProv, 1}, {"utilization", d.Utilization, 1},
		} {
			want := c.v * c.scale
			found := false
			for _, s := range d.Trace {
				if near(s.Value, want) {
					found = true
					break
				}
			}
			if !found {
				r.StepProblems = append(r.StepProblems, StepProblem{Column: d.Column, Lift: d.Lift, ID: d.Column + "/" + d.Lift + "/" + c.key,
					Title: "contract value " + c.key, Problem: "no traced step records this value"})
			}
		}
	}
}
