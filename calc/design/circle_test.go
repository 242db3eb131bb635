package design

import (
	"math"
	"testing"

	"colsheet/calc/detail"
	"colsheet/calc/model"
	"colsheet/calc/section"
)

// circleColumn returns a circular column of diameter d with one lift; test data only.
func circleColumn(d float64, helix bool, st model.Storey) model.Column {
	return model.Column{ID: "R", B: d, H: d, Shape: model.ShapeCircle, Helix: helix, Cover: 35, Storeys: []model.Storey{st}}
}

// A designed circular column records the section's own properties and checks, each by its
// published formula, and its trace reproduces itself.
func TestCircleDesignChain(t *testing.T) {
	for _, tc := range []struct {
		name   string
		st     model.Storey
		helix  bool
		method string
	}{
		{"stocky", lift(3000, 3000, 1800, 60, -30, 20, 10), false, model.SecondOrderCurvature},
		{"slender curvature", lift(6000, 6000, 1500, 80, 40, 30, 20), true, model.SecondOrderCurvature},
		{"slender stiffness", lift(6000, 6000, 1500, 80, 40, 30, 20), false, model.SecondOrderStiffness},
		{"tension", lift(3000, 3000, -300, 40, -20, 10, 0), false, model.SecondOrderCurvature},
	} {
		t.Run(tc.name, func(t *testing.T) {
			const D = 450.0
			in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, circleColumn(D, tc.helix, tc.st))
			in.Options.SecondOrder = tc.method
			r := mustRun(t, in)
			d := r.Designs[0]
			checkTrace(t, d)
			if d.Shape != model.ShapeCircle || d.pattern.Ring < detail.RingMin {
				t.Fatalf("shape %q, pattern %+v: want a ring of at least 6 bars", d.Shape, d.pattern)
			}
			// Ac = π·D²/4, geometry of the circle.
			near(t, "Ac", stepValue(t, d, "geo/Ac"), math.Pi*D*D/4, 1e-12)
			// i = √(Ic/Ac) = D/4 (geometry; EN 1992-1-1:2004 5.8.3.2(1)).
			near(t, "i", stepValue(t, d, "y/i"), D/4, 1e-12)
			// rs = D/2 − c − φt − φ/2 (common practice, no source).
			rs := D/2 - 35 - d.Links.Dia - d.Bars.Dia/2
			near(t, "r_s", stepValue(t, d, "bars/r_s"), rs, 1e-12)
			// Bars evenly on the circle, the first on +z (the layout colsheet states).
			for k, p := range d.Bars.Positions {
				a := 2 * math.Pi * float64(k) / float64(len(d.Bars.Positions))
				if math.Abs(p[0]-rs*math.Sin(a)) > 1e-9 || math.Abs(p[1]-rs*math.Cos(a)) > 1e-9 {
					t.Errorf("bar %d at (%g, %g), want (%g, %g)", k, p[0], p[1], rs*math.Sin(a), rs*math.Cos(a))
				}
			}
			// The chord gap 2·rs·sin(π/n) − φ (geometry).
			n := float64(d.Bars.Count)
			near(t, "s_c", stepValue(t, d, "space/gap_c"), 2*rs*math.Sin(math.Pi/n)-d.Bars.Dia, 1e-12)
			// The resistance is the least over the directions of the same section.
			circ := section.Circle{D: D, Bars: section.BarsOnCircle(d.Bars.Count, d.Bars.Dia, rs, 0), Concrete: in.Materials.Concrete,
				Fcd: d.Fck / 1.5, Fyd: 500 / 1.15, Es: 200000, Block: section.ParabolaRectangle}
			m, err := circ.MRdMin(d.NEd)
			if err != nil {
				t.Fatal(err)
			}
			near(t, "MRd,y", d.Y.MRd, m.State.M, 1e-9)
			near(t, "MRd,z", d.Z.MRd, m.State.M, 1e-9)
			// 5.8.9(4) with a = 2: the resultant over MRd.
			near(t, "biaxial ratio", d.Biaxial.Ratio, math.Hypot(d.Y.MEd, d.Z.MEd)/m.State.M, 1e-9)
			if d.Biaxial.A != 2 || !d.Biaxial.Checked {
				t.Errorf("biaxial a = %g, checked %v: want 2, true", d.Biaxial.A, d.Biaxial.Checked)
			}
			want := LinksCircular
			if tc.helix {
				want = LinksHelix
			}
			if d.Links.Type != want {
				t.Errorf("links %q, want %q", d.Links.Type, want)
			}
			if d.Status != StatusPass {
				t.Errorf("fails: %v", d.Reasons)
			}
			if tc.st.NEd < 0 {
				return
			}
			// Slender lifts: is = rs/√2 (ring of n ≥ 3 bars, 5.8.8.3(2)) and d = D/2 + is.
			if d.Y.Slender {
				is := rs / math.Sqrt2
				near(t, "i_s", stepValue(t, d, "y/i_s"), is, 1e-12)
				if tc.method == model.SecondOrderCurvature {
					near(t, "d", stepValue(t, d, "y/d"), D/2+is, 1e-12)
				} else {
					// Ic = π·D⁴/64 (geometry), EN 1992-1-1:2004 5.8.7.2(1).
					near(t, "Ic", stepValue(t, d, "y/Ic"), math.Pi*math.Pow(D, 4)/64, 1e-12)
				}
			}
		})
	}
}

// The quick evaluation of a circular section gives the traced design's values (common
// practice, no source).
func TestCircleQuickMatchesTrace(t *testing.T) {
	for _, st := range []model.Storey{lift(3000, 3000, 2000, 60, -30, 10, 5), lift(6500, 6000, 900, 40, 35, 25, 20)} {
		in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, circleColumn(400, false, st))
		d := mustRun(t, in).Designs[0]
		c := newCommon(in, &in.Columns[0], &in.Columns[0].Storeys[0], nil, newBasis(in))
		q := c.quickResist(d.pattern, st.NEd)
		for _, v := range [][2]float64{{q.mEd[0], d.Y.MEd}, {q.mEd[1], d.Z.MEd}, {q.mRd[0], d.Y.MRd}, {q.nRdMax, d.NRdMax}, {q.ratioB, d.Biaxial.Ratio}} {
			near(t, "quick vs traced", v[0], v[1], 1e-9)
		}
	}
}

// Pure compression of a circle by hand: NRd,max = fcd·(π·D²/4 − As) + As·min(Es·εc2, fyd),
// EN 1992-1-1:2004 6.1(5), Fig. 6.1; with 8 Ø20 in 400 mm, C30/37: fcd = 20 MPa,
// Es·εc2 = 400 MPa < fyd = 434.8 MPa.
func TestCircleNRdMaxInDesign(t *testing.T) {
	col := circleColumn(400, false, lift(3000, 3000, 1500, 30, -10, 10, 0))
	col.Bars = &model.BarSpec{Count: 8, Dia: 20}
	in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, col)
	d := mustRun(t, in).Designs[0]
	as := 8 * math.Pi * 20 * 20 / 4
	near(t, "NRd,max", d.NRdMax, 20*(math.Pi*400*400/4-as)+as*400, 1e-12)
	checkTrace(t, d)
}

// A square and a circle of equal area, with the same bars, both at the same actions: the
// circle's least moment resistance is below the square's about its axis (its steel and
// concrete lie nearer the centre), within plausible bounds (common practice, no source).
func TestCircleAgainstSquareOfEqualArea(t *testing.T) {
	const D = 450.0
	side := math.Sqrt(math.Pi) * D / 2
	st := lift(3000, 3000, 1500, 50, -20, 10, 0)
	cc := circleColumn(D, false, st)
	cc.Bars = &model.BarSpec{Count: 8, Dia: 20}
	sq := model.Column{ID: "S", B: side, H: side, Cover: 35, Bars: &model.BarSpec{Count: 8, Dia: 20}, Storeys: []model.Storey{st}}
	dc := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, cc)).Designs[0]
	ds := mustRun(t, newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, sq)).Designs[0]
	near(t, "NRd,max equal areas", dc.NRdMax, ds.NRdMax, 1e-9)
	ratio := dc.Y.MRd / ds.Y.MRd
	if !(ratio > 0.7 && ratio < 1) {
		t.Errorf("MRd circle / square of equal area = %.3f, want within (0.7, 1)", ratio)
	}
}

// The ring patterns: at least six bars (EN 1992-1-1:2004 9.5.2(4)), spaced by the chord, the
// next count fitting only while the chord gap holds (geometry).
func TestRingCandidates(t *testing.T) {
	g := detail.Geometry{B: 400, H: 400, Cover: 35, Circle: true}
	ps := detail.CandidatesIn(g, []float64{16, 20}, func(float64) float64 { return 8 }, func(float64) float64 { return 40 }, 0, math.Inf(1))
	if len(ps) == 0 {
		t.Fatal("no ring pattern")
	}
	prev := 0.0
	for _, p := range ps {
		if p.Ring < detail.RingMin || p.NB != 0 {
			t.Errorf("pattern %+v is not a ring of six or more", p)
		}
		if p.Area() < prev-1e-9 {
			t.Errorf("pattern %+v out of order of area", p)
		}
		prev = p.Area()
		rs := 200 - 35 - 8 - p.Dia/2
		if gap := 2*rs*math.Sin(math.Pi/float64(p.Ring)) - p.Dia; gap < 40-1e-9 {
			t.Errorf("pattern %+v leaves %g mm, below 40", p, gap)
		}
	}
	// The most bars of 20 mm: the largest n with 2·rs·sin(π/n) − 20 ≥ 40, rs = 147 mm.
	most := 0
	for _, p := range ps {
		if p.Dia == 20 && p.Ring > most {
			most = p.Ring
		}
	}
	want := int(math.Floor(math.Pi / math.Asin(60/(2*147.0))))
	if most != want {
		t.Errorf("most bars of 20 mm = %d, want %d", most, want)
	}
}

// A helix is scheduled as one piece of (n + 3) turns of π·(D − 2c − φt), circular links as closed
// circles with two hooks (common practice, no source; hooks EN 1992-1-1:2004 8.5(1)).
func TestCircleSchedule(t *testing.T) {
	for _, helix := range []bool{false, true} {
		st := lift(3000, 3000, 1800, 60, -30, 20, 10)
		st.Length = 3300
		in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, circleColumn(450, helix, st))
		d := mustRun(t, in).Designs[0]
		var links *Mark
		for i := range d.Schedule.Marks {
			if m := &d.Schedule.Marks[i]; m.What == "helix" || m.What == "circular links" {
				links = m
			}
		}
		if links == nil {
			t.Fatalf("helix %v: no transverse mark in %+v", helix, d.Schedule.Marks)
		}
		dc := 450 - 2*35 - d.Links.Dia
		if helix {
			n := float64(d.Detailing.Zones.Links)
			near(t, "helix length", links.Length, (n+3)*math.Pi*dc, 1e-12)
			if links.Count != 1 {
				t.Errorf("helix count %d, want 1", links.Count)
			}
		} else {
			hook := math.Max(10*d.Links.Dia, 70)
			near(t, "circular link length", links.Length, math.Pi*dc+2*hook, 1e-12)
		}
	}
}

// The size finder keeps a circular column round and returns the smallest diameter of the range
// that passes, every smaller one failing (common practice, no source).
func TestCircleSizeFinder(t *testing.T) {
	st := lift(3200, 3200, 2600, 60, -30, 20, 10)
	in := newInput("C30/37", model.ParabolaRectangle, model.ImperfInclination, circleColumn(300, false, st))
	in.Options.Sizes = &model.SizeSearch{Step: 50, Min: 250, Max: 700, RhoMax: 0.02}
	r := mustRun(t, in)
	if len(r.Sizes) != 1 || !r.Sizes[0].Found {
		t.Fatalf("sizes: %+v", r.Sizes)
	}
	got := r.Sizes[0]
	if got.Size.Shape != model.ShapeCircle || got.Size.B != got.Size.H {
		t.Fatalf("found %+v: want a circle", got.Size)
	}
	near(t, "rho", got.Rho, got.AsProv/(math.Pi*got.Size.B*got.Size.B/4), 1e-12)
	for d := 250.0; d < got.Size.B; d += 50 {
		c := circleColumn(d, false, st)
		dd := design(in, &c, &c.Storeys[0], nil, newBasis(in))
		if dd.Status == StatusPass && dd.AsProv <= 0.02*math.Pi*d*d/4 {
			t.Errorf("Ø%g passes but Ø%g was chosen", d, got.Size.B)
		}
	}
}
