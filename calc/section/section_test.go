package section

import (
	"math"
	"strings"
	"testing"
)

// Pure compression by hand: 300 × 500, 4H25, fck = 30, fcd = 17, fyd = 434.78, Es = 200 000.
// NRd,max = fcd·(Ac − As) + As·min(Es·εc2, fyd) with εc2 = 2 ‰, so σs = 400 MPa:
// 17·(150 000 − 1963.50) + 1963.50·400 = 2 516 620.6 + 785 398.2 = 3 302 018.7 N.
// EN 1992-1-1:2004 6.1(5) (uniform strain εc2) with Table 3.1 εc2 = 2.0 ‰; hand calculation.
// For the rectangular block, 3.1.7(3) with η = 1 and εc3 = 1.75 ‰ (σs = 350 MPa):
// 2 516 620.6 + 1963.50·350 = 3 203 844.0 N.
func TestNRdMaxByHand(t *testing.T) {
	a := barArea(25)
	s := &Section{B: 300, H: 500, Bars: []Bar{{-100, -200, a}, {100, -200, a}, {-100, 200, a}, {100, 200, a}},
		Concrete: concreteOf(t, 30), Fcd: 17, Fyd: testFyd, Es: testEs}
	if got := s.NRdMax(); math.Abs(got-3302018.7) > 0.1 {
		t.Errorf("NRd,max = %.2f N, by hand 3 302 018.7 N (tolerance 0.1 N)", got)
	}
	for _, axis := range []Axis{AxisY, AxisZ} {
		st, err := s.MRd(axis, s.NRdMax())
		if err != nil {
			t.Fatal(err)
		}
		if st.P != 2 || !math.IsInf(st.X, 1) || math.Abs(st.M) > 1e-6 || math.Abs(st.N-s.NRdMax()) > 1e-6 {
			t.Errorf("axis %s at NRd,max: state %+v, want uniform strain with M = 0", axis, st)
		}
		if st.EpsTop != 0.002 || st.EpsBottom != 0.002 {
			t.Errorf("axis %s at NRd,max: strains %g, %g, want uniform 0.002", axis, st.EpsTop, st.EpsBottom)
		}
	}
	s.Block = Rectangular
	if got := s.NRdMax(); math.Abs(got-3203844.0) > 0.1 {
		t.Errorf("rectangular NRd,max = %.2f N, by hand 3 203 844.0 N (tolerance 0.1 N)", got)
	}
	if st := s.State(AxisY, math.Inf(1)); math.Abs(st.N-s.NRdMax()) > 1e-6 {
		t.Errorf("rectangular uniform state N = %.6f, NRd,max = %.6f", st.N, s.NRdMax())
	}
}

// Pure bending of a doubly reinforced 300 × 500 rectangle, fck = 30 (fcd = 17), fyd = 434.78:
// 4H25 (1963.50 mm²) at d = 450 and 2H12 (226.19 mm²) at d2 = 50.
//
// Parabola-rectangle: resultant (17/21)·fcd·b·x at (99/238)·x from the compressed face,
// the 0.8095 and 0.416 of the design handbooks (e.g. The Concrete Centre, "How to design
// concrete structures using Eurocode 2"; from memory). With both bar layers yielding and
// the compression layer in the plateau (σc = fcd displaced):
//
//	(17/21)·17·300·x + 226.19·(434.78 − 17) = 1963.50·434.78  →  x = 183.89 mm
//
// then εs2 = 3.5‰·(183.89 − 50)/183.89 = 2.55 ‰ > 2.17 ‰ and εs1 = 5.07 ‰: both yield.
// MRd = Fc·(250 − 0.41597·x) + Fs2·200 + Fs1·200 = 321.37 kNm. Hand calculation by
// force equilibrium; EN 1992-1-1:2004 3.1.7(1), 6.1(5).
//
// Rectangular block, λ = 0.8 and η = 1 for fck ≤ 50 (EN 1992-1-1:2004 3.1.7(3),
// Eq. (3.19)-(3.22)): 0.8·17·300·x + 94 500.3 = 853 693.7 → x = 186.08 mm,
// MRd = Fc·(250 − 0.4·x) + (Fs2 + Fs1)·200 = 322.93 kNm.
func TestPureBendingByHand(t *testing.T) {
	a25, a12 := barArea(25), barArea(12)
	s := &Section{B: 300, H: 500, Concrete: concreteOf(t, 30), Fcd: 17, Fyd: testFyd, Es: testEs,
		Bars: []Bar{{-105, -200, a25}, {-35, -200, a25}, {35, -200, a25}, {105, -200, a25}, {-100, 200, a12}, {100, 200, a12}}}
	as1, as2 := 4*a25, 2*a12
	ts := as1 * testFyd           // tension force, yielding
	fs2 := as2 * (testFyd - 17.0) // compression layer, yielding, displaced concrete at fcd
	cases := []struct {
		block       Block
		alpha, beta float64
		x, m        float64 // rounded hand results
	}{
		{ParabolaRectangle, 17.0 / 21, 99.0 / 238, 183.89, 321.37e6},
		{Rectangular, 0.8, 0.4, 186.08, 322.93e6},
	}
	for _, c := range cases {
		s.Block = c.block
		x := (ts - fs2) / (c.alpha * 17 * 300)
		fc := c.alpha * 17 * 300 * x
		m := fc*(250-c.beta*x) + fs2*200 + ts*200
		if math.Abs(x-c.x) > 0.01 || math.Abs(m-c.m) > 0.01e6 {
			t.Fatalf("%s: hand formulas give x = %.3f, M = %.4g; rounded %.2f, %.5g", c.block, x, m, c.x, c.m)
		}
		st, err := s.MRd(AxisY, 0)
		if err != nil {
			t.Fatal(err)
		}
		// Tolerance: relative 1e-9 (the solver's equilibrium tolerance).
		if !relClose(st.X, x, 1e-9, 0) || !relClose(st.M, m, 1e-9, 0) {
			t.Errorf("%s: x = %.9g mm, MRd = %.9g Nmm; by hand %.9g mm, %.9g Nmm", c.block, st.X, st.M, x, m)
		}
		if st.Pivot != "B" || len(st.Layers) != 2 || st.Layers[0].Bars != 2 || st.Layers[1].Bars != 4 {
			t.Errorf("%s: pivot %s, layers %+v", c.block, st.Pivot, st.Layers)
		}
		if l := st.Layers[0]; l.SigmaS != testFyd || l.SigmaC != 17 {
			t.Errorf("%s: compression layer σs = %g, σc = %g; want fyd and fcd", c.block, l.SigmaS, l.SigmaC)
		}
		if l := st.Layers[1]; l.SigmaS != -testFyd || l.SigmaC != 0 {
			t.Errorf("%s: tension layer σs = %g, σc = %g; want −fyd and 0", c.block, l.SigmaS, l.SigmaC)
		}
	}
}

// For fck ≤ 50 and x ≤ h the parabola-rectangle resultant is (17/21)·fcd·b·x at
// (99/238)·x from the compressed face (0.8095 and 0.416; The Concrete Centre, "How to
// design concrete structures using Eurocode 2", from memory). Tolerance relative 1e-12.
func TestParabolaRectangleCoefficients(t *testing.T) {
	s := sym8(t, 30, ParabolaRectangle)
	for _, x := range []float64{20, 100, 250, 499} {
		st := s.State(AxisY, x)
		if want := 17.0 / 21 * s.Fcd * 300 * x; !relClose(st.Fc, want, 1e-12, 0) {
			t.Errorf("x = %g: Fc = %.12g, want %.12g", x, st.Fc, want)
		}
		if want := 250 - 99.0/238*x; !relClose(st.Lc, want, 1e-12, 0) {
			t.Errorf("x = %g: lever = %.12g, want %.12g", x, st.Lc, want)
		}
		// Rounded coefficients within 0.05 %.
		if math.Abs(st.Fc/(s.Fcd*300*x)-0.8095) > 0.0005 || math.Abs((250-st.Lc)/x-0.416) > 0.0005 {
			t.Errorf("x = %g: coefficients %.5f, %.5f", x, st.Fc/(s.Fcd*300*x), (250-st.Lc)/x)
		}
	}
}

// A doubly symmetric section has the same resistance with either face compressed, about
// either axis; and MRd about z of b × h equals MRd about y of h × b with transposed bars.
// Tolerance relative 1e-9 (equilibrium tolerance); common practice, no source.
func TestSymmetry(t *testing.T) {
	for _, fck := range []float64{30, 70} {
		for _, block := range []Block{ParabolaRectangle, Rectangular} {
			for si, mk := range []func(testing.TB, float64, Block) *Section{sym8, sym12, asym} {
				s := mk(t, fck, block)
				tr := *s
				tr.B, tr.H = s.H, s.B
				tr.Bars = nil
				for _, b := range s.Bars {
					tr.Bars = append(tr.Bars, Bar{Y: b.Z, Z: b.Y, Area: b.Area})
				}
				nmax, nmin := s.NRdMax(), s.NRdMin()
				for k := 0; k <= 20; k++ {
					ned := nmin + (nmax-nmin)*(0.001+0.998*float64(k)/20)
					for _, face := range []Face{Positive, Negative} {
						mz, err1 := s.MRdAt(AxisZ, face, ned)
						my, err2 := tr.MRdAt(AxisY, face, ned)
						if err1 != nil || err2 != nil {
							t.Fatal(err1, err2)
						}
						if !relClose(mz.M, my.M, 1e-9, 1e-9*nmax) {
							t.Errorf("transposed: MRd,z = %.9g, MRd,y of the transpose = %.9g", mz.M, my.M)
						}
					}
					if si == 2 {
						continue // asym: the faces differ about y, see TestAsymmetric
					}
					for _, axis := range []Axis{AxisY, AxisZ} {
						p, err1 := s.MRdAt(axis, Positive, ned)
						n, err2 := s.MRdAt(axis, Negative, ned)
						if err1 != nil || err2 != nil {
							t.Fatal(err1, err2)
						}
						if !relClose(p.M, -n.M, 1e-9, 1e-9*nmax) || p.M <= 0 {
							t.Errorf("fck %g %s axis %s NEd %.4g: M+ = %.9g, M− = %.9g", fck, block, axis, ned, p.M, n.M)
						}
					}
				}
			}
		}
	}
}

// An asymmetric layout resists less with the lightly reinforced face in tension;
// MRdBoth returns that face. Common practice, no source.
func TestAsymmetric(t *testing.T) {
	s := asym(t, 30, ParabolaRectangle)
	pos, _ := s.MRdAt(AxisY, Positive, 0) // compressed at +z: heavy steel in tension
	neg, _ := s.MRdAt(AxisY, Negative, 0) // compressed at −z: 2H12 in tension
	if !(pos.M > 0 && neg.M < 0 && -neg.M < pos.M) {
		t.Fatalf("M+ = %g, M− = %g", pos.M, neg.M)
	}
	both, err := s.MRdBoth(AxisY, 0)
	if err != nil || both.M != neg.M || both.Face != Negative {
		t.Errorf("MRdBoth = %+v, %v; want the negative face", both, err)
	}
	// Equilibrium residual of each root, relative 1e-9 of NRd,max.
	for _, st := range []State{pos, neg} {
		if math.Abs(st.N) > 1e-9*s.NRdMax() {
			t.Errorf("N = %g, want 0", st.N)
		}
	}
}

// N rises with x on pivot B for the parabola-rectangle block, and over the whole pivot
// family for the doubly symmetric layouts. On pivot C the bars between the compressed
// face and the pivot point lose strain as the profile turns towards uniform εc2, so a
// heavy, unyielded layer there (the asymmetric layout compressed on its 4H25 face) makes N
// peak above NRd,max and fall back to it; once N has reached NRd,max it must stay there or
// above, so that each NEd ≤ NRd,max has one root. The rectangular block may also step
// down, by no more than the displaced concrete η·fcd·As of one layer, where its edge
// passes a layer. Tolerance 1e-9·NRd,max for rounding. Common practice, no source.
func TestMonotonicN(t *testing.T) {
	for _, fck := range []float64{30, 50, 70, 90} {
		for _, block := range []Block{ParabolaRectangle, Rectangular} {
			for si, mk := range []func(testing.TB, float64, Block) *Section{sym8, sym12, asym} {
				s := mk(t, fck, block)
				symmetric := si < 2
				nmax := s.NRdMax()
				for _, axis := range []Axis{AxisY, AxisZ} {
					for _, face := range []Face{Positive, Negative} {
						f := s.frame(axis, face)
						var drop float64
						for _, l := range s.layers(axis, &f) {
							drop = math.Max(drop, l.Area*f.fc)
						}
						ps := s.points(axis, &f, nil)
						prev, reached := s.NRdMin(), false
						for k := 1; k <= 4000; k++ {
							p := 2 * float64(k) / 4000
							n, m := f.nm(ps, p)
							if math.IsNaN(n) || math.IsNaN(m) {
								t.Fatalf("NaN at p = %g", p)
							}
							allowed := 1e-9 * nmax
							if block == Rectangular {
								allowed += drop
							}
							switch {
							case reached && n < nmax-allowed:
								t.Errorf("fck %g %s layout %d axis %s face %d: N = %.9g falls below NRd,max = %.9g at p = %g", fck, block, si, axis, face, n, nmax, p)
							case (p <= 1 || symmetric) && n < prev-allowed:
								t.Errorf("fck %g %s layout %d axis %s face %d: N falls from %.9g to %.9g at p = %g", fck, block, si, axis, face, prev, n, p)
							}
							reached = reached || n >= nmax-1e-9*nmax
							prev = n
						}
						if !relClose(prev, nmax, 1e-12, 0) {
							t.Errorf("N(p = 2) = %.12g, NRd,max = %.12g", prev, nmax)
						}
					}
				}
			}
		}
	}
}

// Every NEd strictly between the tension and compression capacities gives a finite,
// converged state; beyond them, an error. Tolerance |N − NEd| ≤ 1e-9·NRd,max, the
// solver's stated tolerance; common practice, no source.
func TestRangeAndErrors(t *testing.T) {
	for _, fck := range []float64{30, 70} {
		for _, block := range []Block{ParabolaRectangle, Rectangular} {
			s := sym12(t, fck, block)
			nmax, nmin := s.NRdMax(), s.NRdMin()
			for _, axis := range []Axis{AxisY, AxisZ} {
				for k := 0; k <= 200; k++ {
					ned := nmin + (nmax-nmin)*float64(k)/200
					st, err := s.MRd(axis, ned)
					if k == 0 {
						if err == nil || !strings.Contains(err.Error(), "tension") {
							t.Errorf("NEd = NRd,min: err = %v", err)
						}
						continue
					}
					if err != nil {
						t.Fatalf("NEd = %g: %v", ned, err)
					}
					for _, v := range []float64{st.X, st.N, st.M, st.Fc, st.Lc, st.EpsTop, st.EpsBottom} {
						if math.IsNaN(v) || math.IsInf(v, -1) {
							t.Fatalf("NEd = %g: non-finite value in %+v", ned, st)
						}
					}
					if math.Abs(st.N-ned) > 1e-9*nmax {
						t.Errorf("%s axis %s NEd = %.9g: N = %.9g", block, axis, ned, st.N)
					}
					if m, err := s.Resistance(axis, Positive, ned); err != nil || !relClose(m, st.M, 1e-12, 1e-3) {
						t.Errorf("Resistance = %g (%v), MRd = %g", m, err, st.M)
					}
				}
				for _, ned := range []float64{nmax * 1.0001, nmax + 1, nmin * 1.0001, nmin - 1, math.NaN(), math.Inf(1)} {
					st, err := s.MRd(axis, ned)
					if err == nil {
						t.Errorf("NEd = %g: no error, state %+v", ned, st)
					}
					if m, err := s.Resistance(axis, Positive, ned); err == nil || m != 0 {
						t.Errorf("Resistance(%g) = %g, %v", ned, m, err)
					}
				}
				// Just above the tension capacity and just below NRd,max.
				for _, ned := range []float64{nmin + 1e-6*(nmax-nmin), nmax * (1 - 1e-7)} {
					st, err := s.MRd(axis, ned)
					if err != nil || math.Abs(st.N-ned) > 1e-9*nmax || math.IsNaN(st.M) {
						t.Errorf("NEd = %.9g: N = %.9g, M = %g, %v", ned, st.N, st.M, err)
					}
				}
			}
		}
	}
	bad := sym8(t, 30, ParabolaRectangle)
	bad.Bars[0].Z = 260
	if _, err := bad.MRd(AxisY, 0); err == nil {
		t.Error("bar outside the section: no error")
	}
	if _, err := sym8(t, 30, ParabolaRectangle).MRd(Axis(7), 0); err == nil {
		t.Error("bad axis: no error")
	}
}

// AreaFor scales a bar pattern until MRd = MEd. Tolerance: MRd of the scaled section equals
// MEd within relative 1e-6 (area tolerance 1e-9·AsMax); common practice, no source.
func TestAreaFor(t *testing.T) {
	for _, block := range []Block{ParabolaRectangle, Rectangular} {
		s := sym8(t, 30, block)
		for _, c := range []struct {
			axis     Axis
			ned, med float64
		}{
			{AxisY, 1500e3, 250e6}, {AxisY, 1500e3, -250e6}, {AxisZ, 800e3, 120e6}, {AxisY, -200e3, 90e6}, {AxisY, 3000e3, 60e6},
		} {
			as, err := s.AreaFor(c.axis, c.ned, c.med, 6000)
			if err != nil {
				t.Fatalf("%+v: %v", c, err)
			}
			sc := s.Scaled(as)
			face := Positive
			if c.med < 0 {
				face = Negative
			}
			m, err := sc.Resistance(c.axis, face, c.ned)
			if err != nil || !relClose(m, c.med, 1e-6, 0) || math.Abs(m) < math.Abs(c.med)*(1-1e-9) {
				t.Errorf("%s %+v: As = %.2f mm² gives MRd = %.6g (%v)", block, c, as, m, err)
			}
			if !relClose(sc.Area(), as, 1e-12, 0) {
				t.Errorf("scaled area %g, want %g", sc.Area(), as)
			}
		}
		// No steel needed: 500 kN with 10 kNm.
		if as, err := s.AreaFor(AxisY, 500e3, 10e6, 6000); err != nil || as != 0 {
			t.Errorf("light load: As = %g, %v; want 0", as, err)
		}
		// Not enough even at the upper area.
		if _, err := s.AreaFor(AxisY, 1500e3, 900e6, 6000); err == nil || !strings.Contains(err.Error(), "does not suffice") {
			t.Errorf("heavy moment: err = %v", err)
		}
		if _, err := s.AreaFor(AxisY, 9000e3, 10e6, 3000); err == nil {
			t.Error("NEd beyond NRd,max at AsMax: no error")
		}
	}
}

// AreaWhere solves a caller's ratio = 1, here a biaxial interaction
// (MEdy/MRdy)^a + (MEdz/MRdz)^a with a = 1.5 chosen for the test (the form of
// EN 1992-1-1:2004 5.8.9(4) Eq. (5.39)). Tolerance: ratio within 1e-6 below 1.
func TestAreaWhereBiaxial(t *testing.T) {
	s := sym8(t, 30, ParabolaRectangle)
	ned, medy, medz := 1200e3, 150e6, 60e6
	ratio := func(t *Section) (float64, error) {
		my, err := t.Resistance(AxisY, Positive, ned)
		if err != nil {
			return 0, err
		}
		mz, err := t.Resistance(AxisZ, Positive, ned)
		if err != nil {
			return 0, err
		}
		return math.Pow(medy/my, 1.5) + math.Pow(medz/mz, 1.5), nil
	}
	as, err := s.AreaWhere(8000, ratio)
	if err != nil {
		t.Fatal(err)
	}
	sc := s.Scaled(as)
	r, err := ratio(&sc)
	if err != nil || r > 1 || r < 1-1e-6 {
		t.Errorf("As = %.3f: ratio %.9f (%v)", as, r, err)
	}
}

func BenchmarkMRd(b *testing.B) {
	for _, c := range []struct {
		name string
		mk   func(testing.TB, float64, Block) *Section
		fck  float64
	}{{"8bars_C30", sym8, 30}, {"12bars_C30", sym12, 30}, {"12bars_C70", sym12, 70}} {
		s := c.mk(b, c.fck, ParabolaRectangle)
		nmax, nmin := s.NRdMax(), s.NRdMin()
		neds := make([]float64, 64)
		for i := range neds {
			neds[i] = nmin + (nmax-nmin)*(0.02+0.96*float64(i)/63)
		}
		b.Run(c.name+"/State", func(b *testing.B) {
			for i := 0; b.Loop(); i++ {
				if _, err := s.MRd(AxisY, neds[i%64]); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(c.name+"/Resistance", func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; b.Loop(); i++ {
				if _, err := s.Resistance(AxisY, Positive, neds[i%64]); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
