// Package cover holds the nominal cover of EN 1992-1-1:2004 4.4.1 with the recommended values:
// the structural class (Table 4.3N), the minimum cover for durability (Table 4.4N) and for bond
// (Table 4.2), the minimum cover (Eq. (4.2)), the nominal cover (Eq. (4.1)) and its check.
//
// Every step function takes traced quantities and returns one trace step whose value its
// expression reproduces; the value functions in values.go hold the same formulas untraced.
package cover

import (
	"strings"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

const ec2 = "EN 1992-1-1:2004 "

// StructuralClass returns the structural class (1 to 6 for S1 to S6) from the base class
// (0 = S4) raised by 2 for a design working life above 50 years, reduced by 1 for a strength
// class at least that of the exposure and by 1 for special quality control, EN 1992-1-1:2004
// 4.4.1.2(5), Table 4.3N.
func StructuralClass(id string, base int, life float64, fck trace.Q, exposure []string, specialQC bool) trace.Step {
	r := read(exposure)
	if life == 0 {
		life = LongLife
	}
	s0 := baseOf(base)
	v := StructuralClassValue(base, life, fck.V, exposure, specialQC)
	s := trace.Formula(id, "Structural class", ec2+"4.4.1.2(5), Table 4.3N", "S", "", float64(v),
		"min(max(S_0 + (L > 50 ? 2 : 0) - (f_ck >= f_ck_min ? 1 : 0) - q, 1), 6)",
		trace.A("S_0", trace.Const(float64(s0), "S_0", "")),
		trace.A("L", trace.Const(life, "L_d", "years")),
		trace.A("f_ck", fck),
		trace.A("f_ck_min", trace.Const(r.fck, "f_ck,min", "MPa")),
		trace.A("q", trace.Const(boolNum(specialQC), "QC", "")))
	if base == 0 {
		s = s.Note("Recommended structural class S4 for a design working life of 50 years.")
	}
	switch {
	case life > 2*LongLife:
		s = s.Note("Design working life above 50 years: class raised by 2.").
			Caution("Table 4.3N provides for design working lives up to 100 years; a longer life needs a special assessment.")
	case life > LongLife:
		s = s.Note("Design working life above 50 years: class raised by 2, as for 100 years.")
	case life < LongLife:
		s = s.Note("A design working life below 50 years does not reduce the class in the recommended Table 4.3N.")
	}
	if fck.V >= r.fck {
		s = s.Note("Strength class at least that of Table 4.3N for the exposure (the most demanding of the listed classes): class reduced by 1.")
	} else {
		s = s.Note("Strength class below that of Table 4.3N for the exposure (the most demanding of the listed classes): no reduction.")
	}
	if specialQC {
		s = s.Note("Special quality control of the concrete production: class reduced by 1.")
	}
	s = s.Note("No reduction for slab geometry: a column is not a member with slab geometry.")
	// Shown with the modifications of Table 4.3N that apply, each named by a note above.
	show := "S_0"
	if life > LongLife {
		show += " + 2"
	}
	if fck.V >= r.fck {
		show += " - 1"
	}
	if specialQC {
		show += " - q"
	}
	if rawClass(base, life, fck.V, r, specialQC) != v {
		return s.Shown("min(max(" + show + ", 1), 6)").Note("The class is kept within S1 to S6.")
	}
	return s.Shown(show)
}

// CminDur returns the minimum cover for durability of reinforcing steel for the structural class,
// the most onerous of the exposure classes governing, EN 1992-1-1:2004 4.4.1.2(5), Table 4.4N.
func CminDur(id string, class int, exposure []string) trace.Step {
	r := read(exposure)
	c := min(max(class, ClassFloor), ClassCeil)
	row := "S" + string(rune('0'+c)) + ", " + tableColumns[r.column]
	s := trace.Table(id, "Minimum cover for durability", ec2+"4.4.1.2(5), Table 4.4N", row, "c_min,dur", "mm",
		CminDurValue(class, exposure))
	if len(exposure) > 1 {
		s = s.Note("The most onerous of the listed exposure classes governs.")
	}
	if !r.cover {
		s = s.Caution("No exposure class of Table 4.4N (X0, XC, XD, XS) is given: the column X0 is used; state the carbonation or chloride class that applies.")
	}
	if len(r.other) > 0 {
		s = s.Note("Freeze-thaw and chemical attack classes (" + strings.Join(r.other, ", ") + ") do not change cmin,dur; EN 206 governs the concrete for them.")
	}
	if len(r.unknown) > 0 {
		s = s.Caution("Not exposure classes of Table 4.1, ignored: " + strings.Join(r.unknown, ", ") + ".")
	}
	if class != c {
		s = s.Caution("The structural class is outside S1 to S6 and is taken within them.")
	}
	return s
}

// CminB returns the minimum cover for bond, cmin,b = φ for a separated bar, increased by 5 mm
// where the nominal maximum aggregate size dg exceeds 32 mm, EN 1992-1-1:2004 4.4.1.2(3), Table 4.2.
func CminB(id string, dia, dg trace.Q) trace.Step {
	s := trace.Formula(id, "Minimum cover for bond", ec2+"4.4.1.2(3), Table 4.2", "c_min,b", "mm",
		CminBValue(dia.V, dg.V), "phi + (d_g > 32 ? 5 : 0)", trace.A("phi", dia), trace.A("d_g", dg))
	if dg.V > AggLimit {
		return s.Shown("phi + 5").Note("Nominal maximum aggregate size above 32 mm: cmin,b increased by 5 mm.")
	}
	return s.Shown("phi")
}

// Cmin returns cmin = max{cmin,b; cmin,dur + Δcdur,γ − Δcdur,st − Δcdur,add; 10 mm} with the
// recommended Δcdur,st = Δcdur,add = 0, EN 1992-1-1:2004 4.4.1.2(2)P, Eq. (4.2).
func Cmin(id string, cminb, cmindur, dGamma trace.Q) trace.Step {
	return trace.Formula(id, "Minimum cover", ec2+"4.4.1.2(2)P, Eq. (4.2)", "c_min", "mm",
		CminValue(cminb.V, cmindur.V, dGamma.V), "max(c_min_b, c_min_dur + dc_dur_gamma, 10)",
		trace.A("c_min_b", cminb), trace.A("c_min_dur", cmindur), trace.A("dc_dur_gamma", dGamma)).
		Note("Δcdur,st and Δcdur,add take their recommended value 0 (4.4.1.2(7) and (8)).")
}

// Cnom returns the nominal cover cnom = cmin + Δcdev, EN 1992-1-1:2004 4.4.1.1(2)P, Eq. (4.1).
func Cnom(id string, cmin, dev trace.Q) trace.Step {
	return trace.Formula(id, "Nominal cover", ec2+"4.4.1.1(2)P, Eq. (4.1)", "c_nom", "mm",
		CnomValue(cmin.V, dev.V), "c_min + dc_dev", trace.A("c_min", cmin), trace.A("dc_dev", dev))
}

// CoverCheck returns the check that the given cover is not less than the required nominal cover,
// ratio required/given, EN 1992-1-1:2004 4.4.1.1(2)P.
func CoverCheck(id string, given, required trace.Q) trace.Step {
	s := trace.Check(id, "Cover", ec2+"4.4.1.1(2)P", "c_nom ≤ c", required.V/max(given.V, 1e-3),
		"c_nom / max(c, 0.001)", trace.A("c_nom", required), trace.A("c", given))
	if given.V >= 1e-3 {
		return s.Shown("c_nom / c")
	}
	return s
}

// BarCover returns the cover to the main bars, the cover to the links plus the link diameter (common practice).
func BarCover(id string, cover, linkDia trace.Q) trace.Step {
	return trace.Formula(id, "Cover to the main bars", "common practice", "c_bar", "mm", cover.V+linkDia.V,
		"c + phi_t", trace.A("c", cover), trace.A("phi_t", linkDia))
}

// DeviationInput returns the allowance in design for deviation Δcdev: the given value as given,
// or the recommended 10 mm where none is given, EN 1992-1-1:2004 4.4.1.3(1)P. A given value
// below 10 mm rests on the quality control of 4.4.1.3(3), which the step states.
func DeviationInput(id string, d model.Durability) trace.Step {
	title := "Allowance in design for deviation"
	if d.DeltaCdev == nil {
		return trace.Input(id, title, ec2+"4.4.1.3(1)P", "Δc_dev", "mm", DeltaCdev).Note("Recommended value.")
	}
	v := *d.DeltaCdev
	s := trace.Input(id, title, "input", "Δc_dev", "mm", v)
	switch {
	case v < DeltaCdevQA:
		s = s.Note("A reduced allowance is permitted by EN 1992-1-1 4.4.1.3(3): down to 0 mm where a very accurate measuring device is used for monitoring and non-conforming members are rejected (e.g. precast elements).").
			Caution("Δcdev below 5 mm relies on a very accurate measurement of the cover and the rejection of non-conforming members (EN 1992-1-1 4.4.1.3(3)): the specification must require both.")
	case v < DeltaCdev:
		s = s.Note("A reduced allowance is permitted by EN 1992-1-1 4.4.1.3(3) where the fabrication is subject to a quality assurance system whose monitoring includes measurement of the cover (recommended range 5 mm to 10 mm).").
			Caution("Δcdev below 10 mm relies on the quality assurance of EN 1992-1-1 4.4.1.3(3), with the cover measured: the specification must require it.")
	case v == DeltaCdev:
		s = s.Note("Given; equal to the recommended value of 4.4.1.3(1)P.")
	default:
		s = s.Note("Given; above the recommended value of 4.4.1.3(1)P, as a National Annex may set.")
	}
	return s
}

// SafetyInput returns the additive safety element Δcdur,γ (recommended 0), EN 1992-1-1:2004 4.4.1.2(6).
func SafetyInput(id string, d model.Durability) trace.Step {
	s := trace.Input(id, "Additive safety element", ec2+"4.4.1.2(6)", "Δc_dur,γ", "mm", d.DeltaCdurGamma)
	if d.DeltaCdurGamma == 0 {
		s = s.Note("Recommended value.")
	}
	return s
}

// Nominal records the nominal cover for the link (cmin,b = link diameter) and for the main bars
// (cmin,b = bar diameter), the cover to the bars and both checks against the given cover to the
// links, under IDs prefix+"class", "c_min_dur", "dc_dur_gamma", "dc_dev", "link/…", "bar/…",
// "c_bar", "check_link" and "check_bar", and returns the two nominal covers.
func Nominal(l *trace.Log, prefix string, d model.Durability, fck, dia, linkDia, dg, givenCover trace.Q) (cnomLink, cnomBar trace.Q) {
	return NominalFor(l, prefix, Exposure(l, prefix, d, fck), dia, linkDia, dg, givenCover)
}

// Allowances holds what the nominal cover takes from one set of durability data, the same for
// every member with that data: the structural class, cmin,dur, Δcdur,γ and Δcdev.
type Allowances struct {
	Class, Dur, Gamma, Dev trace.Q
}

// Exposure records the structural class, the minimum cover for durability and the allowances
// Δcdur,γ and Δcdev of the durability data d under IDs prefix+"class", "c_min_dur",
// "dc_dur_gamma" and "dc_dev", and returns them.
func Exposure(l *trace.Log, prefix string, d model.Durability, fck trace.Q) Allowances {
	cs := StructuralClass(prefix+"class", d.StructuralClass, d.DesignLife, fck, d.Exposure, d.SpecialQC)
	if d.SlabGeometry {
		cs = cs.Caution("The reduction for slab geometry is asked for but does not apply to a column.")
	}
	class := l.Add(cs)
	return Allowances{Class: class, Dur: l.Add(CminDur(prefix+"c_min_dur", int(class.V), d.Exposure)),
		Gamma: l.Add(SafetyInput(prefix+"dc_dur_gamma", d)), Dev: l.Add(DeviationInput(prefix+"dc_dev", d))}
}

// NominalFor records what Nominal records after the allowances a: the covers for bond and the
// nominal covers of the link and of the main bars, the cover to the bars and both checks.
func NominalFor(l *trace.Log, prefix string, a Allowances, dia, linkDia, dg, givenCover trace.Q) (cnomLink, cnomBar trace.Q) {
	dur, gamma, dev := a.Dur, a.Gamma, a.Dev
	chain := func(part, what string, phi trace.Q) trace.Q {
		b := CminB(prefix+part+"/c_min_b", phi, dg)
		b.Title += " of the " + what
		cmin := Cmin(prefix+part+"/c_min", l.Add(b), dur, gamma)
		cmin.Title += " of the " + what
		cnom := Cnom(prefix+part+"/c_nom", l.Add(cmin), dev)
		cnom.Title += " of the " + what
		return l.Add(cnom)
	}
	cnomLink = chain("link", "link", linkDia)
	cnomBar = chain("bar", "main bars", dia)
	cBar := l.Add(BarCover(prefix+"c_bar", givenCover, linkDia))
	ck := CoverCheck(prefix+"check_link", givenCover, cnomLink)
	ck.Title = "Cover to the links"
	l.Add(ck)
	ck = CoverCheck(prefix+"check_bar", cBar, cnomBar)
	ck.Title = "Cover to the main bars"
	l.Add(ck)
	return cnomLink, cnomBar
}
