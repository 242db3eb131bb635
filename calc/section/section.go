// Package section computes the design resistance of a rectangular reinforced-concrete
// section with bars at given coordinates, by strain compatibility (EN 1992-1-1:2004 6.1).
//
// The concrete follows the parabola-rectangle diagram of 3.1.7(1) or, as an option, the
// rectangular block of 3.1.7(3); it carries no tension. The steel is bilinear with a
// horizontal top branch, 3.2.7(2)b, without a strain limit. Concrete displaced by bars in
// compression is deducted. The strain profiles follow the pivots of 6.1(5) and Fig. 6.1.
//
// Units: N, mm, MPa, N·mm; strains as pure numbers; compression positive.
// The section is b × h with b along y and h along z; bar coordinates are measured from
// the centroid. Bending about y (AxisY) has its strain varying along z over the depth h;
// bending about z (AxisZ) has it varying along y over the depth b.
//
// The stress block is integrated in closed form over the compressed depth. With the
// strain linear in the depth t, the parabola written in u = 1 − ε/εc2 and the plateau of
// depth t_p above a parabolic zone of depth L_p over which u runs from 0 to u_e,
//
//	Fc = fcd·w·[t_p + L_p·(1 − u_e^n/(n+1))]
//	Sc = fcd·w·[t_p²/2 + t_p·L_p·(1 − u_e^n/(n+1)) + L_p²·(1/2 − u_e^n/(n+2))]
//
// where Sc is the first moment of the stresses about the compressed face and w the width.
// Under the pivots the parabola always ends at εc2 on its compressed side, so no
// difference quotient (and no loss of precision near uniform strain) appears.
package section

import (
	"errors"
	"fmt"
	"math"

	"colsheet/calc/material"
)

// Bar is one reinforcing bar: its coordinates from the centroid (mm) and its area (mm²).
type Bar struct{ Y, Z, Area float64 }

// Block selects the concrete stress-strain relation used for the section.
type Block int

// The stress blocks of EN 1992-1-1:2004 3.1.7.
const (
	ParabolaRectangle Block = iota // 3.1.7(1), Eq. (3.17)-(3.18), Fig. 3.3
	Rectangular                    // 3.1.7(3), Eq. (3.19)-(3.22), Fig. 3.5
)

// String returns the name of the stress block.
func (b Block) String() string {
	if b == Rectangular {
		return "rectangular"
	}
	return "parabola-rectangle"
}

// Axis names the axis the section bends about.
type Axis int

// The bending axes.
const (
	AxisY Axis = iota // bending about y: strain varies along z, depth h, width b
	AxisZ             // bending about z: strain varies along y, depth b, width h
)

// String returns "y" or "z".
func (a Axis) String() string {
	if a == AxisZ {
		return "z"
	}
	return "y"
}

// Face says which face of the section, along the bending direction, is the more compressed.
type Face int

// The two faces along the bending direction.
const (
	Positive Face = 1  // compressed face at +h/2 (AxisY) or +b/2 (AxisZ)
	Negative Face = -1 // compressed face at −h/2 (AxisY) or −b/2 (AxisZ)
)

// Section is a rectangular reinforced-concrete section with its design material values.
type Section struct {
	B, H     float64           // width along y and depth along z, mm
	Bars     []Bar             // bars, coordinates from the centroid
	Concrete material.Concrete // strain limits, n, λ and η of the class
	Fcd      float64           // design compressive strength of concrete, MPa
	Fyd      float64           // design yield strength of reinforcement, MPa
	Es       float64           // modulus of elasticity of reinforcement, MPa
	Block    Block             // concrete stress block
}

// Layer is the group of bars at one coordinate along the bending direction, with its state.
type Layer struct {
	Coord  float64 // coordinate along the bending direction from the centroid, mm
	Depth  float64 // distance from the compressed face, mm
	Area   float64 // total bar area, mm²
	Bars   int     // number of bars
	Eps    float64 // strain, compression positive
	SigmaS float64 // steel stress, MPa
	SigmaC float64 // stress of the displaced concrete, MPa (0 outside the compressed block)
	Force  float64 // As·(σs − σc), N
}

// State is the stress state of the section for one strain profile.
type State struct {
	Axis      Axis
	Face      Face    // compressed face
	P         float64 // profile parameter: x/D on pivot B (0..1), 1 + εbot/εc2 on pivot C (1..2)
	X         float64 // neutral-axis depth from the compressed face, mm (+Inf for uniform strain)
	Pivot     string  // "B" (εcu at the compressed face) or "C" (whole section compressed)
	EpsTop    float64 // strain at the compressed face
	EpsBottom float64 // strain at the opposite face
	Fc        float64 // concrete resultant, before deducting displaced concrete, N
	Lc        float64 // coordinate of Fc's line of action from the centroid, mm
	Layers    []Layer // bar layers from the compressed face
	N         float64 // axial force, compression positive, N
	M         float64 // moment about the centroid, Σ F·coordinate, N·mm
}

// Area returns the total area of the bars, mm².
func (s *Section) Area() float64 {
	a := 0.0
	for _, b := range s.Bars {
		a += b.Area
	}
	return a
}

// NRdMin returns the design tension resistance −As·fyd (compression positive), N.
func (s *Section) NRdMin() float64 { return -s.Area() * s.Fyd }

// NRdMax returns the design resistance to pure compression at uniform strain εc2
// (εc3 for the rectangular block): fcd·(Ac − As) + Σ As·min(Es·εc2, fyd), with η·fcd for
// the rectangular block (EN 1992-1-1:2004 6.1(5), Fig. 6.1, pivot C at zero curvature).
func (s *Section) NRdMax() float64 {
	fc, eps := s.Fcd, s.Concrete.EpsC2
	if s.Block == Rectangular {
		fc, eps = s.Concrete.Eta*s.Fcd, s.Concrete.EpsC3
	}
	as := s.Area()
	return fc*(s.B*s.H-as) + as*math.Min(s.Es*eps, s.Fyd)
}

// Validate reports an error when the section or its material values cannot be used.
func (s *Section) Validate() error {
	pos := func(v float64) bool { return v > 0 && !math.IsInf(v, 0) }
	switch {
	case !pos(s.B) || !pos(s.H):
		return fmt.Errorf("section: b = %g mm and h = %g mm must be positive", s.B, s.H)
	case !pos(s.Fcd):
		return fmt.Errorf("section: fcd = %g MPa must be positive", s.Fcd)
	case !pos(s.Fyd) || !pos(s.Es):
		return fmt.Errorf("section: fyd = %g MPa and Es = %g MPa must be positive", s.Fyd, s.Es)
	}
	c := s.Concrete
	switch s.Block {
	case ParabolaRectangle:
		if !pos(c.EpsC2) || !(c.EpsCu2 >= c.EpsC2) || math.IsInf(c.EpsCu2, 0) || !pos(c.N) {
			return fmt.Errorf("section: parabola-rectangle needs 0 < εc2 ≤ εcu2 and n > 0 (εc2 = %g, εcu2 = %g, n = %g)", c.EpsC2, c.EpsCu2, c.N)
		}
	case Rectangular:
		if !pos(c.EpsC3) || !(c.EpsCu3 >= c.EpsC3) || math.IsInf(c.EpsCu3, 0) {
			return fmt.Errorf("section: rectangular block needs 0 < εc3 ≤ εcu3 (εc3 = %g, εcu3 = %g)", c.EpsC3, c.EpsCu3)
		}
		if !(c.Lambda > 0 && c.Lambda <= 1) || !(c.Eta > 0 && c.Eta <= 1) {
			return fmt.Errorf("section: rectangular block needs 0 < λ ≤ 1 and 0 < η ≤ 1 (λ = %g, η = %g)", c.Lambda, c.Eta)
		}
	default:
		return fmt.Errorf("section: unknown stress block %d", int(s.Block))
	}
	for i, b := range s.Bars {
		if !(b.Area >= 0) || math.IsInf(b.Area, 0) {
			return fmt.Errorf("section: bar %d has area %g mm²", i+1, b.Area)
		}
		if !(math.Abs(b.Y) < s.B/2) || !(math.Abs(b.Z) < s.H/2) {
			return fmt.Errorf("section: bar %d at (%g, %g) mm is not inside the %g × %g mm section", i+1, b.Y, b.Z, s.B, s.H)
		}
	}
	return nil
}

// errAxis reports a bad axis or face argument.
var errAxis = errors.New("section: axis must be AxisY or AxisZ and face Positive or Negative")

// frame holds the geometry and block constants for one axis and compressed face.
type frame struct {
	face   float64 // +1 or −1
	d, w   float64 // depth along the bending direction and width across it
	fc     float64 // fcd (parabola-rectangle) or η·fcd (rectangular)
	epk    float64 // εc2 or εc3: uniform strain limit
	eult   float64 // εcu2 or εcu3: strain at the compressed face on pivot B
	r      float64 // epk/eult
	n      float64 // exponent of the parabola
	lambda float64 // depth factor of the rectangular block
	rect   bool
	es     float64
	fyd    float64
}

func (s *Section) frame(axis Axis, face Face) frame {
	f := frame{face: float64(face), d: s.H, w: s.B, es: s.Es, fyd: s.Fyd}
	if axis == AxisZ {
		f.d, f.w = s.B, s.H
	}
	c := s.Concrete
	if s.Block == Rectangular {
		f.rect = true
		f.fc, f.epk, f.eult, f.lambda = c.Eta*s.Fcd, c.EpsC3, c.EpsCu3, c.Lambda
	} else {
		f.fc, f.epk, f.eult, f.n = s.Fcd, c.EpsC2, c.EpsCu2, c.N
	}
	f.r = f.epk / f.eult
	return f
}

// coord returns the coordinate of a bar along the bending direction of axis.
func coord(axis Axis, b Bar) float64 {
	if axis == AxisZ {
		return b.Y
	}
	return b.Z
}

// profile is one strain profile of the pivot family.
type profile struct {
	pivotC bool
	x      float64 // neutral-axis depth, +Inf at uniform strain
	etop   float64 // strain at the compressed face
	ebot   float64 // strain at the opposite face
	kappa  float64 // strain gradient per mm of depth, ≥ 0
	s      float64 // parabola-rectangle: scale length, x on pivot B, D on pivot C
	ue     float64 // parabola-rectangle: u = 1 − ε/εc2 at the end of the compressed zone
	dc     float64 // rectangular: depth of the stress block, min(λx, D)
}

// profile returns the strain profile for parameter p in [0, 2] (EN 1992-1-1:2004 6.1(5),
// Fig. 6.1): for p ≤ 1 pivot B with x = p·D and εcu at the compressed face; for p > 1
// pivot C with εbot = (p − 1)·εc2 and εc2 at depth (1 − εc2/εcu2)·D.
func (f *frame) profile(p float64) profile {
	var pr profile
	if p <= 1 {
		pr.x = p * f.d
		pr.etop = f.eult
		pr.kappa = f.eult / pr.x
		pr.ebot = f.eult * (pr.x - f.d) / pr.x
		pr.s, pr.ue = pr.x, 1
		pr.dc = math.Min(f.lambda*pr.x, f.d)
		return pr
	}
	pr.pivotC = true
	q := math.Min(p-1, 1)
	pr.ebot = q * f.epk
	pr.etop = f.epk + (f.epk-pr.ebot)*(f.eult-f.epk)/f.epk
	de := pr.etop - pr.ebot
	pr.kappa = de / f.d
	if de > 0 {
		pr.x = pr.etop * f.d / de
	} else {
		pr.x = math.Inf(1)
	}
	pr.s, pr.ue = f.d, math.Max(0, 1-pr.ebot/f.epk)
	// Block depth min(λx, D) = D·λ·εtop / max(εtop − εbot, λ·εtop): finite at uniform strain.
	pr.dc = f.d * f.lambda * pr.etop / math.Max(de, f.lambda*pr.etop)
	return pr
}

// concrete returns the concrete resultant Fc and its distance a from the compressed face,
// integrated in closed form (see the package comment; EN 1992-1-1:2004 3.1.7(1) and (3)).
func (f *frame) concrete(pr *profile) (fc, a float64) {
	if f.rect {
		return f.fc * f.w * pr.dc, pr.dc / 2
	}
	if pr.s <= 0 {
		return 0, 0
	}
	un := 1.0 // u_e^n
	switch {
	case pr.ue <= 0:
		un = 0
	case pr.ue != 1:
		un = math.Exp(f.n * math.Log(pr.ue))
	}
	r := f.r
	alpha := 1 - r*un/(f.n+1)
	ka := ((1-r)*(1-r)/2 + (1-r)*r*(1-un/(f.n+1)) + r*r*(0.5-un/(f.n+2))) / alpha
	return f.fc * f.w * pr.s * alpha, ka * pr.s
}

// sigmaC returns the stress of the concrete displaced by a bar at depth t with strain eps:
// Eq. (3.17)-(3.18) for the parabola-rectangle, η·fcd inside the rectangular block.
func (f *frame) sigmaC(pr *profile, eps, t float64) float64 {
	if f.rect {
		if t < pr.dc {
			return f.fc
		}
		return 0
	}
	if eps <= 0 {
		return 0
	}
	if eps >= f.epk {
		return f.fc
	}
	u := 1 - eps/f.epk
	if f.n == 2 {
		return f.fc * (1 - u*u)
	}
	return f.fc * (1 - math.Exp(f.n*math.Log(u))) // u^n for 0 < u ≤ 1
}

// sigmaS returns the steel stress Es·ε limited to ±fyd (EN 1992-1-1:2004 3.2.7(2)b).
func (f *frame) sigmaS(eps float64) float64 {
	sig := f.es * eps
	if sig > f.fyd {
		return f.fyd
	}
	if sig < -f.fyd {
		return -f.fyd
	}
	return sig
}

// point is a bar layer reduced to what the hot path needs.
type point struct {
	t, c, a float64 // depth from the compressed face, coordinate, area
}

// maxPoints is the number of layers the hot path keeps on the stack.
const maxPoints = 32

// points groups the bars into layers (coordinates within layerTol) into buf, which it
// returns resliced; it grows past buf only for unusually many layers.
func (s *Section) points(axis Axis, f *frame, buf []point) []point {
	ps := buf[:0]
next:
	for _, b := range s.Bars {
		c := coord(axis, b)
		for i := range ps {
			if math.Abs(ps[i].c-c) <= layerTol {
				ps[i].a += b.Area
				continue next
			}
		}
		ps = append(ps, point{t: f.d/2 - f.face*c, c: c, a: b.Area})
	}
	return ps
}

// nm returns N and M for parameter p over the layers ps, without allocating (the hot path).
func (f *frame) nm(ps []point, p float64) (n, m float64) {
	pr := f.profile(p)
	fc, a := f.concrete(&pr)
	n = fc
	m = fc * f.face * (f.d/2 - a)
	for i := range ps {
		q := &ps[i]
		e := pr.etop - pr.kappa*q.t
		force := q.a * (f.sigmaS(e) - f.sigmaC(&pr, e, q.t))
		n += force
		m += force * q.c
	}
	return n, m
}

// paramFor returns the profile parameter for a neutral-axis depth x ≥ 0 (+Inf allowed).
func (f *frame) paramFor(x float64) float64 {
	switch {
	case x <= f.d:
		return x / f.d
	case math.IsInf(x, 1):
		return 2
	}
	// Pivot C: εbot/εc2 = (x − D)/(x − (1 − r)·D).
	return 1 + (x-f.d)/(x-(1-f.r)*f.d)
}

// State returns the stress state with the compressed face on the positive side and the
// neutral axis at depth x (mm) from it; x > D gives a pivot-C profile, +Inf uniform strain.
func (s *Section) State(axis Axis, x float64) State { return s.StateAt(axis, Positive, x) }

// StateAt returns the stress state for the given compressed face and neutral-axis depth x;
// x is raised to at least 1e-12·D so that every strain stays finite.
func (s *Section) StateAt(axis Axis, face Face, x float64) State {
	f := s.frame(axis, face)
	if !(x >= 1e-12*f.d) {
		x = 1e-12 * f.d
	}
	return s.state(axis, face, &f, f.paramFor(x))
}

// state builds the full State, layers included, for parameter p.
func (s *Section) state(axis Axis, face Face, f *frame, p float64) State {
	pr := f.profile(p)
	fc, a := f.concrete(&pr)
	st := State{Axis: axis, Face: face, P: p, X: pr.x, Pivot: "B", EpsTop: pr.etop, EpsBottom: pr.ebot,
		Fc: fc, Lc: f.face * (f.d/2 - a)}
	if pr.pivotC {
		st.Pivot = "C"
	}
	st.Layers = s.layers(axis, f)
	st.N = fc
	st.M = fc * st.Lc
	for i := range st.Layers {
		l := &st.Layers[i]
		l.Eps = pr.etop - pr.kappa*l.Depth
		l.SigmaS = f.sigmaS(l.Eps)
		l.SigmaC = f.sigmaC(&pr, l.Eps, l.Depth)
		l.Force = l.Area * (l.SigmaS - l.SigmaC)
		st.N += l.Force
		st.M += l.Force * l.Coord
	}
	return st
}

// layerTol is the tolerance within which bars share a layer, mm.
const layerTol = 1e-6

// layers groups the bars by coordinate along the bending direction, ordered from the
// compressed face.
func (s *Section) layers(axis Axis, f *frame) []Layer {
	ls := make([]Layer, 0, len(s.Bars))
next:
	for _, b := range s.Bars {
		c := coord(axis, b)
		for i := range ls {
			if math.Abs(ls[i].Coord-c) <= layerTol {
				ls[i].Area += b.Area
				ls[i].Bars++
				continue next
			}
		}
		ls = append(ls, Layer{Coord: c, Depth: f.d/2 - f.face*c, Area: b.Area, Bars: 1})
	}
	// Insertion sort by depth: few layers, no allocation.
	for i := 1; i < len(ls); i++ {
		for j := i; j > 0 && ls[j].Depth < ls[j-1].Depth; j-- {
			ls[j], ls[j-1] = ls[j-1], ls[j]
		}
	}
	return ls
}
