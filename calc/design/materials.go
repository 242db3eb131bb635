package design

import (
	"colsheet/calc/building"
	"colsheet/calc/cover"
	"colsheet/calc/creep"
	"colsheet/calc/detail"
	"colsheet/calc/material"
	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// This file records the materials of every concrete class in use once in the project basis and
// gives each lift the basis of its own class. The project's class (materials.concrete) keeps the
// IDs it always had: basis/mat/<class>/…, basis/shear/…, basis/cover/<set>/…, basis/creep/<set>/…,
// basis/lap/… and basis/lap/phi<d>/…. Another class of the building's columns (building.concrete)
// records its material steps under basis/mat/<class>/… and what depends on its strength under a
// part named by the class: basis/shear/<class>/nu_1, basis/cover/<set>/<class>/…,
// basis/creep/<set>/<class>/…, basis/lap/<class>/fctk005, fctd and basis/lap/<class>/phi<d>/….

// classMaterials holds the basis steps of one concrete class's strength and deformation
// characteristics (EN 1992-1-1:2004 Table 3.1, 3.1.6, 3.1.7).
type classMaterials struct {
	fck, fcd, epsC2, epsCu, nExp trace.Q
	lam, eta, fctm, ecm          trace.Q
}

// concreteSteps records the material steps of class conc under IDs pre+"f_ck", "f_cd", the
// stress block's strains and factors, "f_ctm" and, for the nominal stiffness method, "E_cm".
func concreteSteps(l *trace.Log, pre string, in *model.Input, conc material.Concrete, param map[string]trace.Q) classMaterials {
	var m classMaterials
	m.fck = l.Add(material.FckStep(pre+"f_ck", conc))
	m.fcd = l.Add(material.Fcd(pre+"f_cd", param["alpha_cc"], m.fck, param["gamma_c"]))
	if in.Options.StressBlock == model.Rectangular {
		m.lam = l.Add(material.LambdaStep(pre+"lambda", conc, m.fck))
		m.eta = l.Add(material.EtaStep(pre+"eta", conc, m.fck))
		m.epsC2 = l.Add(material.EpsC3Step(pre+"eps_c3", conc, m.fck))
		m.epsCu = l.Add(material.EpsCu3Step(pre+"eps_cu3", conc, m.fck))
	} else {
		m.epsC2 = l.Add(material.EpsC2Step(pre+"eps_c2", conc, m.fck))
		m.epsCu = l.Add(material.EpsCu2Step(pre+"eps_cu2", conc, m.fck))
		m.nExp = l.Add(material.NStep(pre+"n", conc, m.fck))
	}
	m.fctm = l.Add(material.FctmStep(pre+"f_ctm", conc))
	if so := in.Options.SecondOrder; so == model.SecondOrderStiffness || so == model.SecondOrderBoth {
		m.ecm = l.Add(material.Ecm(pre+"E_cm", m.fck))
	}
	return m
}

// use makes the basis's own materials those of m.
func (b *projectBasis) use(m classMaterials) {
	b.fck, b.fcd, b.epsC2, b.epsCu, b.nExp = m.fck, m.fcd, m.epsC2, m.epsCu, m.nExp
	b.lam, b.eta, b.fctm, b.ecm = m.lam, m.eta, m.fctm, m.ecm
}

// otherClass is the basis of a concrete class other than the project's, built while the basis
// is recorded and made a view of it (classView) once every step is in.
type otherClass struct {
	conc   material.Concrete
	part   string // the class as a part of an ID, "C40-50"
	mat    classMaterials
	nu1    trace.Q
	covers []coverSet
	creeps []creepSet
	bond   detail.LapBond
	laps   map[float64]trace.Q
}

// otherClasses returns the concrete classes of the building's columns other than the project's,
// in the order building.ClassesInUse gives them; none for the actions form.
func otherClasses(in *model.Input) []*otherClass {
	if in.Building == nil {
		return nil
	}
	var out []*otherClass
	for _, c := range building.ClassesInUse(in.Building, in.Materials.Concrete)[1:] {
		out = append(out, &otherClass{conc: c, part: idPart(c.Class), laps: map[float64]trace.Q{}})
	}
	return out
}

// coverOf records the cover allowances of the durability data d for the concrete of class o
// under IDs "cover/<name>/<class>/…".
func coverOf(l *trace.Log, name string, d model.Durability, o *otherClass) coverSet {
	return coverSet{name: name, d: d, a: cover.Exposure(l, "cover/"+name+"/"+o.part+"/", d, o.mat.fck)}
}

// classView returns the basis as a lift of concrete class o sees it: the same steps, with the
// materials, the shear factor ν1, the cover allowances, the creep data, the bond and the lap
// lengths of its class.
func (b *projectBasis) classView(o *otherClass) *projectBasis {
	v := *b
	v.use(o.mat)
	v.shear.Nu1 = o.nu1
	v.covers, v.creeps, v.bond, v.laps = o.covers, o.creeps, o.bond, o.laps
	return &v
}

// forLift returns the input and the basis that a lift designs with: for a lift of the building
// form whose concrete class (building.ClassOf) is not the project's, a copy of the input with
// that class as its concrete and the basis of that class; else in and b themselves. A lift of
// the actions form keeps the project's class.
func (b *projectBasis) forLift(in *model.Input, col *model.Column, st *model.Storey) (*model.Input, *projectBasis) {
	if in.Building == nil || len(b.classes) == 0 {
		return in, b
	}
	c := building.ClassOf(in.Building, in.Materials.Concrete, col.ID, st.Name)
	v, ok := b.classes[c.Class]
	if !ok {
		return in, b
	}
	if c.Class != in.Materials.Concrete.Class {
		cp := *in
		cp.Materials.Concrete = c
		in = &cp
	}
	return in, v
}

// fcmStep records the mean compressive strength fcm = fck + 8 MPa, EN 1992-1-1:2004 Table 3.1.
func fcmStep(id string, fck trace.Q) trace.Step {
	return trace.Formula(id, "Mean compressive strength of concrete", "EN 1992-1-1:2004 Table 3.1", "f_cm", "MPa",
		fck.V+8, "f_ck + 8", trace.A("f_ck", fck))
}

// classCreep records, for concrete of strength fck and the creep data of base (recorded for
// the project's class), what Annex B derives from the strength alone: fcm, α1 and α2 (fcm above
// 35 MPa) and β(fcm), under IDs pre+"fcm", "alpha_1", "alpha_2" and "beta_fcm"; RH, t0,T, the
// cement exponent and what follows from them alone are base's.
func classCreep(l *trace.Log, pre string, base creepSet, fck trace.Q) creepSet {
	cs := base
	cs.fcm = l.Add(fcmStep(pre+"fcm", fck))
	if cs.fcm.V > 35 {
		l.Add(creep.Alpha1(pre+"alpha_1", cs.fcm))
		l.Add(creep.Alpha2(pre+"alpha_2", cs.fcm))
	}
	l.Add(creep.BetaFcm(pre+"beta_fcm", cs.fcm))
	return cs
}
