package design

import (
	"strconv"
	"strings"

	"colsheet/calc/detail"
	"colsheet/calc/trace"
)

// built is what the cage as built takes from the evaluation of a bar pattern.
type built struct {
	p                detail.Pattern
	g                detail.Geometry
	phi, phiT, cnom  trace.Q
	nBars            trace.Q // number of main bars
	s, sRed, zone    trace.Q // link spacings provided and the zone length of 9.5.3(4)
	l0               trace.Q // lap length as built
	laps             detail.LapLinkPlan
	restraintOfFaces detail.RestraintPlan
}

// liftEnds says whether the lift stands on the foundation (bottom) and whether it ends at the
// roof (top): in the building form the lowest level and the lift with no lift above; in the
// actions form the first and the last lift of the column.
func (c *common) liftEnds() (bottom, top bool) {
	if b := c.in.Building; b != nil && c.dv != nil {
		return len(b.Storeys) > 0 && b.Storeys[0].Name == c.st.Name, c.dv.NameAbove == ""
	}
	n := len(c.col.Storeys)
	return n > 0 && c.col.Storeys[0].Name == c.st.Name, n > 0 && c.col.Storeys[n-1].Name == c.st.Name
}

// asBuilt records the cage of the lift as built: the start of the laps, the link zones and their
// links, the anchorage of starter bars and top bars (EN 1992-1-1:2004 8.4.4), the cut lengths and
// masses of the bar marks, and sets d.Detailing and d.Schedule from them.
func (c *common) asBuilt(l *trace.Log, d *Design, in built) {
	l.Group = "Laps and links as built"
	src := "input"
	if c.in.Options.LapStart == 0 {
		src = "common practice"
	}
	a := l.Add(trace.Input("built/a_lap", "Start of the laps above the floor level at the foot of the lift", src, "a_lap", "mm", c.in.Options.LapStart).
		Note("The bars of the lift below (or the starter bars) project above the floor; each bar of this lift is set beside one of them from this level up over the lap length."))
	d.Detailing.LapStart, d.Detailing.LapTransverse = a.V, in.laps.Transverse
	d.Detailing.BarsB, d.Detailing.BarsH = in.p.NB, in.p.NH
	r := in.restraintOfFaces
	d.Detailing.TiesB, d.Detailing.TiesH, d.Detailing.TieBars = r.AlongB.Extra, r.AlongH.Extra, tieBars(r)

	bottom, top := c.liftEnds()
	sch := Schedule{Bottom: bottom, Top: top}
	var lbd trace.Q
	if bottom || top {
		what := "starter bars into the foundation"
		switch {
		case bottom && top:
			what = "starter bars into the foundation and bars into the roof"
		case top:
			what = "bars into the roof construction"
		}
		l.Group = "Anchorage of the " + what + " (EN 1992-1-1 8.4.4)"
		lbd = detail.AnchorageSteps(l, "built/anch/", "Design anchorage length of the "+what, in.phi, c.bs.bond)
		if bottom {
			l.NoteLast("Starter bars: straight into the foundation as given, in compression and good bond; the foundation is taken to be of the column's concrete.")
		}
		if top {
			l.NoteLast("At the roof the bars run up into the roof beams or slab to the cover at the top; lbd is measured from the soffit. Where the roof construction is shallower than lbd plus the cover, the bars are bent over into it.")
		}
		if st := c.in.Options.LapStep; st > 0 {
			lbd = l.Add(detail.RoundUp("built/anch/lbd_built", "Anchorage length as built", "l_bd,prov", lbd, trace.Const(st, "Δl", "mm")))
		}
		sch.Anchorage = lbd.V
	}
	if c.st.Length <= 0 || in.laps.S.From == "" {
		// The lift's length is not given (or the links over the laps could not be detailed): no
		// zones, counts, lengths or masses; the schedule leaves them blank.
		d.Schedule = sch
		return
	}
	l.Group = "Laps and links as built"
	lq := l.Add(trace.Input("built/l", "Length of the lift, floor level to floor level", "input", "l", "mm", c.st.Length))
	zs, nLinks := detail.ZoneSteps(l, "built/links/", detail.ZoneInput{L: lq, Zone: in.zone, LapStart: a, L0: in.l0,
		S: in.s, SRed: in.sRed, SLap: in.laps.S, ReducedAtLap: in.laps.Reduced})
	d.Detailing.Zones = &zs

	l.Group = "Cut lengths and masses"
	mark := d.Column + "-" + d.Storey + "-"
	m1 := l.Add(detail.BarMassPerMetre("built/bars/m1", "m'_φ", in.phi))
	var lBar trace.Q
	if top {
		lBar = l.Add(trace.Formula("built/bars/L", "Cut length of a main bar: from the start of the lap to the top of the roof less the cover", "common practice", "L_bar", "mm",
			lq.V-a.V-in.cnom.V, "l - a_lap - c_nom", trace.A("l", lq), trace.A("a_lap", a), trace.A("c_nom", in.cnom)))
	} else {
		lBar = l.Add(trace.Formula("built/bars/L", "Cut length of a main bar: from the start of the lap at the foot to the end of the lap above the floor at the top", "common practice", "L_bar", "mm",
			lq.V+in.l0.V, "l + l_0", trace.A("l", lq), trace.A("l_0", in.l0)).
			Note("The lap above the floor at the top takes the lap length of this lift's bars, the larger where the bars of the lift above are not larger."))
	}
	mBars := l.Add(detail.Mass("built/bars/m", "Mass of the main bars", "m_bars", in.nBars, lBar, m1))
	sch.Marks = append(sch.Marks, Mark{Mark: mark + "01", What: "main bars", Count: in.p.Count(), Dia: in.p.Dia, Length: lBar.V, Mass: mBars.V})
	main := mBars.V

	var hook, mt trace.Q
	var links float64
	switch d.Links.Type {
	case LinksHelix:
		mt = l.Add(detail.BarMassPerMetre("built/links/m1", "m'_φt", in.phiT))
		lh := l.Add(detail.HelixLength("built/links/L", nLinks, c.b, in.cnom, in.phiT))
		mh := l.Add(detail.Mass("built/links/m", "Mass of the helix", "m_helix", trace.Const(1, "n", ""), lh, mt))
		sch.Marks = append(sch.Marks, Mark{Mark: mark + "02", What: "helix", Count: 1, Dia: in.phiT.V, Length: lh.V, Mass: mh.V})
		links = mh.V
	case LinksCircular:
		hook = l.Add(detail.HookExtension("built/links/l_hook", in.phiT))
		ov := l.Add(trace.Formula("built/links/l_ov", "Overlap of the ends of a circular link: a hook at each end", "EN 1992-1-1:2004 8.5(1), Fig. 8.5", "l_ov", "mm",
			2*hook.V, "2 * l_hook", trace.A("l_hook", hook)))
		lLink := l.Add(detail.CircularLinkLength("built/links/L", c.b, in.cnom, in.phiT, ov))
		mt = l.Add(detail.BarMassPerMetre("built/links/m1", "m'_φt", in.phiT))
		mLinks := l.Add(detail.Mass("built/links/m", "Mass of the circular links", "m_links", nLinks, lLink, mt))
		sch.Marks = append(sch.Marks, Mark{Mark: mark + "02", What: "circular links", Count: zs.Links, Dia: in.phiT.V, Length: lLink.V, Mass: mLinks.V})
		links = mLinks.V
	default:
		hook = l.Add(detail.HookExtension("built/links/l_hook", in.phiT))
		lLink := l.Add(detail.LinkLength("built/links/L", c.b, c.h, in.cnom, in.phiT, hook))
		mt = l.Add(detail.BarMassPerMetre("built/links/m1", "m'_φt", in.phiT))
		mLinks := l.Add(detail.Mass("built/links/m", "Mass of the links", "m_links", nLinks, lLink, mt))
		sch.Marks = append(sch.Marks, Mark{Mark: mark + "02", What: "links", Count: zs.Links, Dia: in.phiT.V, Length: lLink.V, Mass: mLinks.V})
		links = mLinks.V
	}

	if ties := r.AlongB.Extra + r.AlongH.Extra; ties > 0 {
		// Each extra tie runs across the section at every link: those on the b-faces across h,
		// those on the h-faces across b.
		var tieMass float64
		var tieLen []float64
		for _, f := range []struct {
			side  string
			k     int
			width trace.Q
		}{{"b", r.AlongB.Extra, c.h}, {"h", r.AlongH.Extra, c.b}} {
			if f.k == 0 {
				continue
			}
			across := "h"
			if f.side == "h" {
				across = "b"
			}
			lt := l.Add(detail.TieLength("built/ties/L_"+f.side, "Cut length of an extra tie on the "+f.side+"-faces (across "+across+")", f.width, in.cnom, in.phiT, hook))
			kq := trace.Const(float64(f.k), "k_"+f.side, "")
			n := l.Add(trace.Formula("built/ties/n_"+f.side, "Extra ties on the "+f.side+"-faces in the lift, one at every link", "EN 1992-1-1:2004 9.5.3(6)", "n_tie,"+f.side, "",
				float64(f.k)*nLinks.V, "k * n_t", trace.A("k", kq), trace.A("n_t", nLinks)))
			m := l.Add(detail.Mass("built/ties/m_"+f.side, "Mass of the extra ties on the "+f.side+"-faces", "m_ties,"+f.side, n, lt, mt))
			tieMass += m.V
			tieLen = append(tieLen, lt.V)
		}
		// One mark for the ties; where ties cross both ways, the longer cut length is given and
		// the mass is that of both lengths.
		lt := tieLen[0]
		for _, v := range tieLen[1:] {
			if v > lt {
				lt = v
			}
		}
		sch.Marks = append(sch.Marks, Mark{Mark: mark + "03", What: "ties", Count: ties * zs.Links, Dia: in.phiT.V, Length: lt, Mass: tieMass})
		links += tieMass
	}
	if bottom {
		ls := l.Add(trace.Formula("built/starters/L", "Cut length of a starter bar: the anchorage in the foundation, the start of the lap and the lap", "EN 1992-1-1:2004 8.4.4; 8.7.3", "L_starter", "mm",
			lbd.V+a.V+in.l0.V, "l_bd + a_lap + l_0", trace.A("l_bd", lbd), trace.A("a_lap", a), trace.A("l_0", in.l0)))
		ms := l.Add(detail.Mass("built/starters/m", "Mass of the starter bars", "m_starters", in.nBars, ls, m1))
		sch.Marks = append(sch.Marks, Mark{Mark: mark + "04", What: "starter bars", Count: in.p.Count(), Dia: in.p.Dia, Length: ls.V, Mass: ms.V})
		main += ms.V
	}
	sch.Known, sch.MainMass, sch.LinkMass, sch.TotalMass = true, main, links, main+links
	d.Schedule = sch
}

// tieBars words which bars the extra ties hold, counted from a corner along each face:
// "b-faces: bar 3 of 5; h-faces: bars 3 and 5 of 7"; empty where there are none.
func tieBars(r detail.RestraintPlan) string {
	var parts []string
	for _, f := range []struct {
		side string
		face detail.FaceRestraint
	}{{"b", r.AlongB}, {"h", r.AlongH}} {
		rs := f.face.Restrained()
		if f.face.Extra == 0 || len(rs) < 3 {
			continue
		}
		var ns []string
		for _, i := range rs[1 : len(rs)-1] {
			ns = append(ns, strconv.Itoa(i+1))
		}
		word := "bar "
		if len(ns) > 1 {
			word = "bars "
		}
		list := strings.Join(ns, ", ")
		if len(ns) > 1 {
			list = strings.Join(ns[:len(ns)-1], ", ") + " and " + ns[len(ns)-1]
		}
		parts = append(parts, f.side+"-faces: "+word+list+" of "+strconv.Itoa(f.face.Bars))
	}
	return strings.Join(parts, "; ")
}
