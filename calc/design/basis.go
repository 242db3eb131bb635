package design

import (
	"colsheet/calc/shear"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"sync/atomic"

	"colsheet/calc/actions"
	"colsheet/calc/code"
	"colsheet/calc/cover"
	"colsheet/calc/creep"
	"colsheet/calc/detail"
	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/slender"
	"colsheet/calc/trace"
)

// This file records the project basis: the values that hold for the whole project, traced once
// under IDs basis/<part>/<name> (Result.Basis): every code parameter in force, the ψ factors of
// the imposed-load categories, the materials, the imperfection's αm, the cover allowances of each
// set of durability data, the lap lengths of each bar diameter and the creep data. A lift's steps
// refer to them from the root ("/basis/…", see Design.Trace) instead of recording them again.

// BasisPrefix starts the ID of every step of the project basis.
const BasisPrefix = "basis/"

// projectBasis holds the steps of the project basis, with IDs and references from the root
// ("/basis/…") as the designs refer to them, and the quantities the designs take from them.
type projectBasis struct {
	steps                        []trace.Step
	param                        map[string]trace.Q // code parameters by catalogue name
	fck, fcd, epsC2, epsCu, nExp trace.Q
	lam, eta, fctm, ecm          trace.Q
	fyk, fyd, es, dg             trace.Q
	m, alphaM                    trace.Q // the imperfection by inclination only
	bond                         detail.LapBond
	shear                        shear.Params        // the parameters of 6.2.2 and 6.2.3
	laps                         map[float64]trace.Q // l0 by bar diameter
	covers                       []coverSet
	creeps                       []creepSet
	near                         map[likeKey][]int // basis steps by title, symbol and value, for the hoister
	// classes holds the basis of each concrete class of the building's columns by class name,
	// the project's class the basis itself (see forLift); nil where every lift is of the
	// project's class.
	classes map[string]*projectBasis
	// tail is the most steps a design has added after those of its derivation so far, shared
	// by the bases of every class, to size the step slice of the next design.
	tail *atomic.Int64
}

// room returns the capacity to give the step slice of a design whose derivation has n steps:
// n and the most steps a design has added after its derivation so far (a guess before any).
func (b *projectBasis) room(n int) int {
	if t := b.tail.Load(); t > 0 {
		return n + int(t)
	}
	return n + 64 + stepsPerPattern
}

// noteTail records that a design added n steps after those of its derivation.
func (b *projectBasis) noteTail(n int) {
	for {
		t := b.tail.Load()
		if int64(n) <= t || b.tail.CompareAndSwap(t, int64(n)) {
			return
		}
	}
}

// coverSet is the cover allowances of one set of durability data.
type coverSet struct {
	name string // the part of its IDs after "cover/"
	d    model.Durability
	a    cover.Allowances
}

// creepSet is the creep data of Annex B shared by the lifts with the same data.
type creepSet struct {
	key                creepKey
	fcm, rh, t0, alpha trace.Q
}

// creepKey is what makes two lifts' creep data the same for the basis (the ratio M0Eqp/M0Ed is the lift's).
type creepKey struct {
	rh, t0 float64
	cement string
}

// paramUnits gives the engine unit of the code parameters that have one; the others are numbers.
var paramUnits = map[string]string{
	"Es": "MPa", "phi_min": "mm", "link_dia_min": "mm", "link_spacing_max": "mm",
	"spacing_k2": "mm", "spacing_min": "mm", "density_rc": "N/mm3",
}

// paramUnit returns the engine unit of the code parameter name ("" for a number).
func paramUnit(name string) string { return paramUnits[name] }

// idPart makes a name fit one part of a step ID: "C32/40" → "C32-40", spaces to "-".
func idPart(s string) string {
	return strings.NewReplacer("/", "-", " ", "-").Replace(s)
}

// num writes a number of an ID or a title as briefly as it reads: 16, 12.5.
func num(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// newBasis records the project basis of the input.
func newBasis(in *model.Input) *projectBasis {
	b := &projectBasis{param: map[string]trace.Q{}, laps: map[float64]trace.Q{}, tail: new(atomic.Int64)}
	l := &trace.Log{Prefix: "/" + BasisPrefix}
	p := in.Code

	l.Group = "Partial factors and nationally determined parameters"
	for _, c := range code.Catalogue {
		b.param[c.Name] = l.Add(actions.ParamStep("code/"+c.Name, p, c.Name, paramUnit(c.Name)))
	}
	if cats := categories(in); len(cats) > 0 {
		l.Group = "Combination and quasi-permanent factors ψ of the imposed loads"
		for _, cat := range cats {
			l.Add(actions.PsiStep("psi/"+idPart(cat)+"/psi0", 0, cat))
			l.Add(actions.PsiStep("psi/"+idPart(cat)+"/psi2", 2, cat))
		}
	}

	conc := in.Materials.Concrete
	l.Group = "Concrete " + conc.Class
	b.use(concreteSteps(l, "mat/"+idPart(conc.Class)+"/", in, conc, b.param))
	b.dg = l.Add(trace.Input("mat/d_g", "Maximum aggregate size", "input", "d_g", "mm", in.Materials.Aggregate))
	others := otherClasses(in)
	for _, o := range others {
		l.Group = "Concrete " + o.conc.Class
		o.mat = concreteSteps(l, "mat/"+o.part+"/", in, o.conc, b.param)
	}

	l.Group = "Reinforcing steel"
	b.fyk = l.Add(trace.Input("mat/steel/f_yk", "Characteristic yield strength of reinforcement", "EN 1992-1-1:2004 3.2.2(3)P", "f_yk", "MPa", in.Materials.Fyk))
	b.fyd = l.Add(material.Fyd("mat/steel/f_yd", b.fyk, b.param["gamma_s"]))
	b.es = b.param["Es"]

	l.Group = "Shear (EN 1992-1-1 6.2)"
	b.shear = shear.Recommended(l, "shear/", b.param["gamma_c"], b.fck)
	for _, o := range others {
		o.nu1 = l.Add(shear.Nu1("shear/"+o.part+"/nu_1", o.mat.fck))
	}

	if in.Options.Imperfection != model.ImperfL0Over400 {
		l.Group = "Geometric imperfection"
		b.m = l.Add(trace.Input("imp/m", "Number of vertical members contributing", "EN 1992-1-1:2004 5.2(5)", "m", "", in.Options.Members))
		b.alphaM = l.Add(slender.AlphaM("imp/alpha_m", b.m))
	}

	for _, d := range durabilities(in) {
		name := idPart(strings.Join(d.Exposure, "-"))
		if name == "" {
			name = "none"
		}
		for n, base := 2, name; slices.ContainsFunc(b.covers, func(c coverSet) bool { return c.name == name }); n++ {
			name = base + "-" + strconv.Itoa(n)
		}
		l.Group = "Cover for durability: " + strings.Join(d.Exposure, ", ")
		b.covers = append(b.covers, coverSet{name: name, d: d, a: cover.Exposure(l, "cover/"+name+"/", d, b.fck)})
		for _, o := range others {
			l.Group = "Cover for durability: " + strings.Join(d.Exposure, ", ") + ", concrete " + o.conc.Class
			o.covers = append(o.covers, coverOf(l, name, d, o))
		}
	}

	for _, k := range creepKeys(in) {
		l.Group = "Creep data (EN 1992-1-1 Annex B): RH " + num(k.rh) + " %, t0 " + num(k.t0) + " days, cement class " + k.cement
		pre := "creep/RH" + num(k.rh) + "-t" + num(k.t0) + "-" + idPart(k.cement) + "/"
		b.creeps = append(b.creeps, creepSteps(l, pre, k, b.fck))
		for _, o := range others {
			l.Group = "Creep data (EN 1992-1-1 Annex B): RH " + num(k.rh) + " %, t0 " + num(k.t0) + " days, cement class " + k.cement + ", concrete " + o.conc.Class
			o.creeps = append(o.creeps, classCreep(l, pre+o.part+"/", b.creeps[len(b.creeps)-1], o.mat.fck))
		}
	}

	l.Group = "Laps of the bars (EN 1992-1-1 8.4, 8.7)"
	sigma := l.Add(detail.FullStress("lap/sigma_sd", b.fyd))
	b.bond = detail.LapBondSteps(l, "lap/", b.fctm, b.param["gamma_c"], sigma, true, 100)
	l.Group = "Lap lengths by bar diameter (EN 1992-1-1 8.7.3)"
	phis := map[float64]trace.Q{}
	for _, dia := range diameters(in) {
		pre := "lap/phi" + num(dia) + "/"
		phis[dia] = l.Add(trace.Input(pre+"phi", "Bar diameter listed for the design", "input", "φ", "mm", dia))
		b.laps[dia] = detail.LapFor(l, pre, phis[dia], b.bond)
	}
	for _, o := range others {
		l.Group = "Laps of the bars (EN 1992-1-1 8.4, 8.7), concrete " + o.conc.Class
		o.bond = b.bond
		fctk := l.Add(detail.Fctk005("lap/"+o.part+"/fctk005", o.mat.fctm))
		o.bond.Fctd = l.Add(detail.Fctd("lap/"+o.part+"/fctd", trace.Const(detail.AlphaCt, "α_ct", ""), fctk, b.param["gamma_c"]).Note("αct = 1.0, the recommended value (3.1.6(2)P)."))
		for _, dia := range diameters(in) {
			o.laps[dia] = detail.LapFor(l, "lap/"+o.part+"/phi"+num(dia)+"/", phis[dia], o.bond)
		}
	}

	b.steps = l.Steps
	b.near = make(map[likeKey][]int, len(b.steps))
	for i, s := range b.steps {
		k := likeKey{s.Title, s.Symbol, s.Value}
		b.near[k] = append(b.near[k], i)
	}
	if len(others) > 0 {
		b.classes = map[string]*projectBasis{conc.Class: b}
		for _, o := range others {
			b.classes[o.conc.Class] = b.classView(o)
		}
	}
	return b
}

// creepSteps records the creep data of one set for concrete of strength fck and what Annex B
// derives from it alone: fcm, RH, t0,T, the cement exponent and, as creep.Coefficient records
// them, α1, α2, β(fcm), t0 and β(t0).
func creepSteps(l *trace.Log, pre string, k creepKey, fck trace.Q) creepSet {
	cs := creepSet{key: k}
	cs.fcm, cs.rh, cs.t0, cs.alpha = creepData(l, pre, &model.Creep{RH: k.rh, T0: k.t0, Cement: k.cement}, fck)
	if cs.fcm.V > 35 {
		l.Add(creep.Alpha1(pre+"alpha_1", cs.fcm))
		l.Add(creep.Alpha2(pre+"alpha_2", cs.fcm))
	}
	l.Add(creep.BetaFcm(pre+"beta_fcm", cs.fcm))
	t0 := l.Add(creep.AdjustedAge(pre+"t0", cs.t0, cs.alpha))
	l.Add(creep.BetaT0(pre+"beta_t0", t0))
	return cs
}

// creepData records fcm, RH, the age at loading t0,T and the cement exponent of the creep data
// cr under IDs pre+"fcm", "RH", "t0T" and "alpha".
func creepData(l *trace.Log, pre string, cr *model.Creep, fck trace.Q) (fcm, rh, t0T, alpha trace.Q) {
	fcm = l.Add(fcmStep(pre+"fcm", fck))
	rh = l.Add(trace.Input(pre+"RH", "Relative humidity of the ambient environment", "input", "RH", "%", cr.RH))
	t0T = l.Add(trace.Input(pre+"t0T", "Age of the concrete at loading", "input", "t_0,T", "d", cr.T0))
	cls := cementClass(cr)
	as, ok := creep.CementExponentStep(pre+"alpha", cls)
	if !ok {
		as, _ = creep.CementExponentStep(pre+"alpha", "N")
		as = as.Caution("Cement class " + cls + " is not S, N or R: class N is used.")
	}
	alpha = l.Add(as)
	return fcm, rh, t0T, alpha
}

// cementClass returns the cement class of the creep data, N where none is given.
func cementClass(cr *model.Creep) string {
	if cr.Cement == "" {
		return "N"
	}
	return cr.Cement
}

// categories returns the imposed-load categories of the building's floors and line loads, in the
// order of the input, each once.
func categories(in *model.Input) []string {
	var out []string
	add := func(c string) {
		if c != "" && !slices.Contains(out, c) {
			out = append(out, c)
		}
	}
	if b := in.Building; b != nil {
		for _, f := range b.Floors {
			if f.Qk > 0 {
				add(f.Category)
			}
		}
		for _, ll := range b.Lines {
			if ll.Qk > 0 {
				add(ll.Category)
			}
		}
	}
	return out
}

// durabilities returns the distinct sets of durability data of the input: the project's, then
// each column's own, in input order.
func durabilities(in *model.Input) []model.Durability {
	var out []model.Durability
	add := func(d *model.Durability) {
		if d != nil && !slices.ContainsFunc(out, func(o model.Durability) bool { return reflect.DeepEqual(o, *d) }) {
			out = append(out, *d)
		}
	}
	add(in.Options.Durability)
	for i := range in.Columns {
		add(in.Columns[i].Durability)
	}
	return out
}

// creepKeys returns the distinct creep data of the input's lifts (the building's, or each
// lift's of the actions form), in input order.
func creepKeys(in *model.Input) []creepKey {
	var out []creepKey
	add := func(cr *model.Creep) {
		if cr == nil {
			return
		}
		k := creepKey{rh: cr.RH, t0: cr.T0, cement: cementClass(cr)}
		if !slices.Contains(out, k) {
			out = append(out, k)
		}
	}
	if b := in.Building; b != nil {
		add(b.Options.Creep)
	}
	for i := range in.Columns {
		for j := range in.Columns[i].Storeys {
			add(in.Columns[i].Storeys[j].Creep)
		}
	}
	return out
}

// diameters returns the bar diameters a design may use, ascending: the listed ones and the given bars'.
func diameters(in *model.Input) []float64 {
	out := slices.Clone(in.Options.BarDiameters)
	if b := in.Building; b != nil && b.Bars != nil {
		out = append(out, b.Bars.Dia)
	}
	for i := range in.Columns {
		if bs := in.Columns[i].Bars; bs != nil {
			out = append(out, bs.Dia)
		}
	}
	slices.Sort(out)
	return slices.Compact(out)
}

// lap returns the lap length of bars of diameter phi and the share ρ1 of bars lapped at one
// section: the basis steps of the diameter, or, for a diameter the basis does not list, the
// steps recorded in l under "lap/".
func (b *projectBasis) lap(l *trace.Log, phi, fyd trace.Q) (l0, rho1 trace.Q) {
	if q, ok := b.laps[phi.V]; ok {
		return q, b.bond.Rho1
	}
	return detail.Lap(l, "lap/", phi, b.fctm, b.param["gamma_c"], fyd, true, 100)
}

// allowances returns the cover allowances of the durability data d: the basis steps of its set,
// or, for data the basis does not hold, the steps recorded in l under "cover/".
func (b *projectBasis) allowances(l *trace.Log, d *model.Durability) cover.Allowances {
	for _, c := range b.covers {
		if reflect.DeepEqual(c.d, *d) {
			return c.a
		}
	}
	return cover.Exposure(l, "cover/", *d, b.fck)
}

// creepOf returns fcm, RH, t0,T and the cement exponent of the creep data cr: the basis steps of
// its set, or, for data the basis does not hold, the steps recorded in l under "creep/".
func (b *projectBasis) creepOf(l *trace.Log, cr *model.Creep) (fcm, rh, t0T, alpha trace.Q) {
	k := creepKey{rh: cr.RH, t0: cr.T0, cement: cementClass(cr)}
	for _, c := range b.creeps {
		if c.key == k {
			return c.fcm, c.rh, c.t0, c.alpha
		}
	}
	return creepData(l, "creep/", cr, b.fck)
}

// public returns the basis steps as Result.Basis holds them: IDs basis/<part>/<name>, and
// references to other basis steps by their whole ID, without the leading "/".
func (b *projectBasis) public() []trace.Step {
	out := make([]trace.Step, len(b.steps))
	for i, s := range b.steps {
		s.ID = strings.TrimPrefix(s.ID, "/")
		if len(s.Args) > 0 {
			s.Args = slices.Clone(s.Args)
			for j := range s.Args {
				s.Args[j].From = strings.TrimPrefix(s.Args[j].From, "/")
			}
		}
		out[i] = s
	}
	return out
}

// find returns the basis step with the ID id ("/basis/…" or "basis/…").
func (b *projectBasis) find(id string) (trace.Step, bool) {
	id = "/" + strings.TrimPrefix(id, "/")
	for _, s := range b.steps {
		if s.ID == id {
			return s, true
		}
	}
	return trace.Step{}, false
}

// hoister takes out of a run's steps those that repeat a basis step (the same clause, formula,
// arguments and value: the code parameters and ψ factors that the building's take-down records,
// the factors of Annex B that depend on the creep data alone) and refers their users to the basis
// step, so that every reference still names a step of its own trace, of another design's, or of
// the basis.
type hoister struct {
	b     *projectBasis
	moved map[string]string // whole ID of a step taken out → basis ID ("/basis/…")
}

func (b *projectBasis) hoister() *hoister {
	return &hoister{b: b, moved: map[string]string{}}
}

// filter appends to out the steps, of the design with IDs under prefix (COLUMN/LIFT/), that do
// not repeat a basis step, with the users of those that do referring to it; and returns the
// places in out of the steps that refer to another design.
func (h *hoister) filter(out, steps []trace.Step, prefix string) (_ []trace.Step, across []int) {
	var local map[string]string // own ID of a step taken out → basis ID
	for i := range steps {
		out = append(out, steps[i])
		s := &out[len(out)-1]
		cross := h.redirect(s, local)
		if id, ok := h.repeats(s); ok {
			if local == nil {
				local = map[string]string{}
			}
			local[s.ID] = id
			h.moved[prefix+s.ID] = id
			out = out[:len(out)-1]
			continue
		}
		if cross {
			across = append(across, len(out)-1)
		}
	}
	return out, across
}

// repeats returns the ID of the basis step that s repeats, if any: the same step in every field
// but its ID and sheet section (the same clause, formula, arguments with their sources, value
// and remarks).
func (h *hoister) repeats(s *trace.Step) (string, bool) {
	if !mayRepeat(s) {
		return "", false
	}
	// Compared in place, with the ID and section of the basis step for the while.
	id, group := s.ID, s.Group
	for _, i := range h.b.near[likeKey{s.Title, s.Symbol, s.Value}] {
		b := &h.b.steps[i]
		s.ID, s.Group = b.ID, b.Group
		same := reflect.DeepEqual(s, b)
		s.ID, s.Group = id, group
		if same {
			return b.ID, true
		}
	}
	return "", false
}

// redirect makes every argument of s whose source step was taken out (own in local by its ID in
// the design, any in moved by its whole ID) refer to the basis step instead, the arguments copied
// before any change, and reports whether s refers to a step of another design.
func (h *hoister) redirect(s *trace.Step, local map[string]string) (across bool) {
	copied := false
	for j := range s.Args {
		f := s.Args[j].From
		var id string
		var ok bool
		switch {
		case f == "" || strings.HasPrefix(f, "/"+BasisPrefix):
			continue
		case f[0] == '/':
			across = true
			id, ok = h.moved[f[1:]]
		case local != nil:
			id, ok = local[f]
		}
		if !ok {
			continue
		}
		if !copied {
			s.Args, copied = slices.Clone(s.Args), true
		}
		s.Args[j].From = id
	}
	return across
}

// hoistTail takes out of the steps of l from index from on those that repeat a basis step,
// in place, and refers the later ones to it (a step's references name earlier steps).
func (b *projectBasis) hoistTail(l *trace.Log, from int) {
	h := b.hoister()
	kept, _ := h.filter(nil, l.Steps[from:], "")
	n := copy(l.Steps[from:], kept)
	clear(l.Steps[from+n:])
	l.Steps = l.Steps[:from+n]
}

// mayRepeat reports whether s is of a kind that a basis step can stand for, its arguments (if
// any) all from the basis; repeats tells for certain.
func mayRepeat(s *trace.Step) bool {
	switch s.Kind {
	case trace.KindInput, trace.KindTable, trace.KindFormula:
	default:
		return false
	}
	for _, a := range s.Args {
		if a.From != "" && !strings.HasPrefix(a.From, "/"+BasisPrefix) {
			return false
		}
	}
	return true
}

// likeKey is what a step must share with a basis step to be worth comparing in full.
type likeKey struct {
	title, symbol string
	value         float64
}
