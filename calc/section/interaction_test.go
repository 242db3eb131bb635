package section

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// The N–M curve runs from the tension resistance −As·fyd, where every bar yields in
// tension and M = −fyd·Σ As·coordinate, to NRd,max at uniform strain with M = 0
// (EN 1992-1-1:2004 6.1(5), Fig. 6.1; the ends follow from the definitions). Between them
// each point is the uniaxial resistance at its N for either face. Tolerances: relative
// 1e-12 at the ends and for the interior points. Common practice, no source.
func TestCurveNM(t *testing.T) {
	for _, block := range []Block{ParabolaRectangle, Rectangular} {
		for _, mk := range []func(testing.TB, float64, Block) *Section{sym8, asym} {
			s := mk(t, 35, block)
			for _, axis := range []Axis{AxisY, AxisZ} {
				pts := s.CurveNM(axis, 41)
				if len(pts) != 41 {
					t.Fatalf("%s axis %s: %d points, want 41", block, axis, len(pts))
				}
				mt := 0.0
				for _, b := range s.Bars {
					mt -= s.Fyd * b.Area * coord(axis, b)
				}
				first, last := pts[0], pts[len(pts)-1]
				if !relClose(first.N, -s.Area()*s.Fyd, 1e-12, 0) || !relClose(first.M, mt, 1e-12, 1e-3) || first.M != first.MNeg {
					t.Errorf("%s axis %s: first point %+v, want N = %g, M = %g", block, axis, first, -s.Area()*s.Fyd, mt)
				}
				if last.N != s.NRdMax() || last.M != 0 || last.MNeg != 0 {
					t.Errorf("%s axis %s: last point %+v, want N = NRd,max = %g, M = 0", block, axis, last, s.NRdMax())
				}
				for i, p := range pts {
					if !trace.Finite(p.N) || !trace.Finite(p.M) || !trace.Finite(p.MNeg) {
						t.Fatalf("%s axis %s: point %d not finite: %+v", block, axis, i, p)
					}
					if i > 0 && !(p.N > pts[i-1].N) {
						t.Errorf("%s axis %s: N does not rise at point %d", block, axis, i)
					}
					if i == 0 || i == len(pts)-1 {
						continue
					}
					pos, err1 := s.MRdAt(axis, Positive, p.N)
					neg, err2 := s.MRdAt(axis, Negative, p.N)
					if err1 != nil || err2 != nil {
						t.Fatal(err1, err2)
					}
					if !relClose(p.M, pos.M, 1e-12, 0) || !relClose(p.MNeg, neg.M, 1e-12, 0) {
						t.Errorf("%s axis %s point %d: M = %g, MNeg = %g, uniaxial %g, %g", block, axis, i, p.M, p.MNeg, pos.M, neg.M)
					}
				}
			}
		}
	}
	s := sym8(t, 30, ParabolaRectangle)
	if got := s.CurveNM(AxisY, 1); len(got) != 2 {
		t.Errorf("points = 1 gives %d points, want the two ends", len(got))
	}
	bad := *s
	bad.Es = 0
	if bad.CurveNM(AxisY, 10) != nil || s.CurveNM(Axis(7), 10) != nil {
		t.Error("invalid section or axis: want nil")
	}
}

// The My–Mz contour passes through the uniaxial resistances on the axes (relative 1e-6,
// as Biaxial); its points lie at evenly spaced neutral-axis angles, each is the resistance
// that Biaxial finds in the point's own direction θ (relative 1e-6, the two solvers'
// tolerances) with MRd = √(My² + Mz²); outside (−As·fyd, NRd,max] there is no contour, and at
// NRd,max it collapses to zero. Common practice, no source.
func TestContourMyMz(t *testing.T) {
	for _, block := range []Block{ParabolaRectangle, Rectangular} {
		for _, mk := range []func(testing.TB, float64, Block) *Section{sym8, sym12} {
			s := mk(t, 30, block)
			scale := s.NRdMax() * (s.B + s.H) / 2
			for _, frac := range []float64{0.1, 0.35, 0.6, 0.85} {
				ned := s.NRdMin() + frac*(s.NRdMax()-s.NRdMin())
				pts := s.ContourMyMz(ned, 24)
				if len(pts) != 24 {
					t.Fatalf("%s NEd %.4g: %d points, want 24", block, ned, len(pts))
				}
				for k, p := range pts {
					beta := 2 * math.Pi * float64(k) / 24
					st, err := s.Biaxial(ned, p.Theta)
					if err != nil {
						t.Fatal(err)
					}
					if math.Abs(math.Remainder(p.Angle-beta, 2*math.Pi)) > 1e-12 || !relClose(p.MRd, math.Hypot(p.My, p.Mz), 1e-12, 0) ||
						math.Abs(math.Remainder(math.Atan2(p.Mz, p.My)-p.Theta, 2*math.Pi)) > 1e-12 ||
						!relClose(p.My, st.My, 1e-6, 1e-9*scale) || !relClose(p.Mz, st.Mz, 1e-6, 1e-9*scale) {
						t.Errorf("%s NEd %.4g point %d: %+v, Biaxial in its direction %+v", block, ned, k, p, st)
					}
				}
				for _, c := range []struct {
					k    int
					axis Axis
					face Face
				}{{0, AxisY, Positive}, {6, AxisZ, Positive}, {12, AxisY, Negative}, {18, AxisZ, Negative}} {
					u, err := s.MRdAt(c.axis, c.face, ned)
					if err != nil {
						t.Fatal(err)
					}
					m := pts[c.k].My
					if c.axis == AxisZ {
						m = pts[c.k].Mz
					}
					if !relClose(m, u.M, 1e-6, 0) {
						t.Errorf("%s NEd %.4g point %d: %g, uniaxial about %s %g", block, ned, c.k, m, c.axis, u.M)
					}
				}
			}
			if s.ContourMyMz(s.NRdMin(), 8) != nil || s.ContourMyMz(1.01*s.NRdMax(), 8) != nil || s.ContourMyMz(math.NaN(), 8) != nil {
				t.Errorf("%s: contour outside the range of NEd", block)
			}
			for _, p := range s.ContourMyMz(s.NRdMax(), 8) {
				if p.My != 0 || p.Mz != 0 || p.MRd != 0 {
					t.Errorf("%s: at NRd,max point %+v, want zero moment", block, p)
				}
			}
		}
	}
}

// Pure tension by hand: with every bar yielding, N = −As·fyd (EN 1992-1-1:2004 3.2.7, the
// horizontal top branch; the concrete carries no tension, 3.1.7). For eight 20 mm bars and
// fyd = 500/1.15: As = 8·π·20²/4 = 2513.27 mm², −As·fyd = −1092.73 kN. Just inside that force
// the symmetric section has (almost) no moment resistance, and the resistance grows towards
// N = 0 (common practice, no source).
func TestTensionByHand(t *testing.T) {
	s := sym8(t, 30, ParabolaRectangle)
	as := 8 * math.Pi * 20 * 20 / 4
	if !relClose(s.NRdMin(), -as*testFyd, 1e-12, 0) || !relClose(-as*500/1.15, -1092.73e3, 1e-5, 0) {
		t.Fatalf("NRd,min %g, by hand %g", s.NRdMin(), -as*testFyd)
	}
	prev := 0.0
	for _, frac := range []float64{0.999, 0.8, 0.5, 0.2, 0.0} {
		st, err := s.MRdAt(AxisY, Positive, frac*s.NRdMin())
		if err != nil {
			t.Fatal(err)
		}
		if frac == 0.999 && math.Abs(st.M) > 0.01*as*testFyd*200 {
			t.Errorf("at 0.999·NRd,min: M = %g, want about 0", st.M)
		}
		if math.Abs(st.M) < prev {
			t.Errorf("at %g·NRd,min: |M| = %g falls below %g nearer pure tension", frac, math.Abs(st.M), prev)
		}
		prev = math.Abs(st.M)
	}
}
