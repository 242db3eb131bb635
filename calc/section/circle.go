package section

// Circular sections by strain compatibility (EN 1992-1-1:2004 6.1).
//
// Physics. As Section: the parabola-rectangle diagram of 3.1.7(1) or the rectangular block
// of 3.1.7(3), no tension in the concrete, bilinear steel with a horizontal top branch
// (3.2.7(2)b) and no strain limit, concrete displaced by bars in compression deducted, and
// the pivots of 6.1(5) and Fig. 6.1 with the section depth D: εcu2 (εcu3) at the extreme
// fibre on pivot B, εc2 (εc3) at depth (1 − εc2/εcu2)·D on pivot C. The compression zone of
// a circle always narrows towards its extreme fibre, so the rectangular block's stress is
// BlockReduction·η·fcd (3.1.7(3), Note), as Section uses for an inclined neutral axis; it
// is so at uniform strain too, so that N rises without a jump to NRd,max.
//
// Geometry. A circle is polar-symmetric: for the neutral axis perpendicular to the unit
// normal n = (sin θ, cos θ) in (y, z), pointing to the compressed side (θ = 0 is bending
// about y with +z compressed, θ = π/2 bending about z with +y compressed, as Biaxial's β),
// the problem is the uniaxial one in a frame turned by θ; only the bars' coordinates
// s = n·(y, z) change. A fibre at depth t from the extreme compressed fibre sits at the
// angle φ from n with t = R·(1 − cos φ), s = R·cos φ, and its chord is w = 2·R·sin φ, so
// that w·dt = 2·R²·sin²φ·dφ.
//
// Concrete. A segment of depth h (half-angle α = φ(h)) has, by the geometry of the
// circular segment (common practice),
//
//	A = R²·(α − sin α·cos α),   Q = ∫ s dA = (2/3)·R³·sin³α,   centroid s̄ = Q/A,
//
// which gives the rectangular block and the plateau in closed form. The parabola of
// 3.1.7(1), σ = fcd·(1 − u^n) with u = (t − tp)/L, is the plateau's constant stress over
// the compressed segment less the correction fcd·∫ u^n·w·(1, s) dt over the parabolic
// zone [tp, te]. The correction is integrated by Gauss–Legendre quadrature (circleGLPoints
// points, exact for polynomials of degree 2·circleGLPoints − 1) in the angle φ, where the
// chord is smooth, after the substitution φ = φp + (φe − φp)·v², which turns the branch
// point u^n at the plateau's end (n < 2 above C50/60) into v^(2n) and so keeps the rule's
// fast convergence. The integrand is not polynomial; TestCircleQuadrature measures the
// error below 1e-12 of the concrete force against a 200-point rule on 20 panels, and
// TestCircleMatchesFibres the whole resistance against a 20 000-fibre integration.

import (
	"fmt"
	"math"
	"sort"

	"colsheet/calc/material"
)

// Circle is a circular reinforced-concrete section with its design material values.
type Circle struct {
	D        float64           // diameter, mm
	Bars     []Bar             // bars, coordinates (y, z) from the centre
	Concrete material.Concrete // strain limits, n, λ and η of the class
	Fcd      float64           // design compressive strength of concrete, MPa
	Fyd      float64           // design yield strength of reinforcement, MPa
	Es       float64           // modulus of elasticity of reinforcement, MPa
	Block    Block             // concrete stress block
}

// CircleBar is the state of one bar of a circular section.
type CircleBar struct {
	Y, Z   float64 // coordinates from the centre, mm
	S      float64 // coordinate along the normal n towards compression, n·(y, z), mm
	Depth  float64 // distance from the extreme compressed fibre, R − S, mm
	Area   float64 // mm²
	Eps    float64 // strain, compression positive
	SigmaS float64 // steel stress, MPa
	SigmaC float64 // stress of the displaced concrete, MPa (0 outside the compressed block)
	Force  float64 // As·(σs − σc), N
}

// CircleState is the stress state of a circular section for one strain profile.
type CircleState struct {
	Theta     float64     // direction of the normal n = (sin θ, cos θ) towards compression, rad
	P         float64     // profile parameter as State.P: x/D on pivot B, 1 + εbot/εc2 on pivot C
	X         float64     // neutral-axis depth from the extreme compressed fibre, mm (+Inf at uniform strain)
	Pivot     string      // "B" (εcu at the extreme fibre) or "C" (whole section compressed)
	EpsTop    float64     // strain at the extreme compressed fibre
	EpsBottom float64     // strain at the opposite fibre
	Fc        float64     // concrete resultant, before deducting displaced concrete, N
	Lc        float64     // coordinate of Fc's line of action along n from the centre, mm
	Bars      []CircleBar // bars, from the compressed side
	N         float64     // axial force, compression positive, N
	M         float64     // moment along θ, Σ F·s = My·cos θ + Mz·sin θ, N·mm
	MCross    float64     // moment across θ, −My·sin θ + Mz·cos θ, N·mm (bars only; 0 for a symmetric layout)
	My        float64     // moment Σ F·z about the centre, N·mm (as State.M about y)
	Mz        float64     // moment Σ F·y about the centre, N·mm (as State.M about z)
	MRd       float64     // magnitude of the resisting moment √(My² + Mz²), N·mm
	Direction float64     // direction of the resisting moment atan2(Mz, My), rad (θ where MCross is 0)
}

// Radius returns the radius D/2, mm.
func (c *Circle) Radius() float64 { return c.D / 2 }

// Ac returns the gross concrete area πD²/4, mm².
func (c *Circle) Ac() float64 { return math.Pi * c.D * c.D / 4 }

// Ic returns the second moment of area of the gross section πD⁴/64, mm⁴.
func (c *Circle) Ic() float64 { return math.Pi * math.Pow(c.D, 4) / 64 }

// I returns the radius of gyration of the gross section √(Ic/Ac) = D/4, mm.
func (c *Circle) I() float64 { return c.D / 4 }

// Area returns the total area of the bars, mm².
func (c *Circle) Area() float64 {
	a := 0.0
	for _, b := range c.Bars {
		a += b.Area
	}
	return a
}

// Is returns the radius of gyration of the bars about the centroidal axis perpendicular to
// direction theta, √(Σ As·s²/Σ As) with s = y·sin θ + z·cos θ, mm (0 without bars); the
// is of EN 1992-1-1:2004 5.8.8.3(2).
func (c *Circle) Is(theta float64) float64 {
	ny, nz := snapUnit(theta)
	var a, i float64
	for _, b := range c.Bars {
		s := ny*b.Y + nz*b.Z
		a += b.Area
		i += b.Area * s * s
	}
	if !(a > 0) {
		return 0
	}
	return math.Sqrt(i / a)
}

// RingGyration returns the radius of gyration rs/√2 of n ≥ 3 equal bars evenly spaced on a
// circle of radius rs, about any axis through its centre, mm.
//
// Σ cos²(ψ0 + 2πk/n) = n/2 + ½·Σ cos(2ψ0 + 4πk/n), and the last sum vanishes unless 4π/n
// is a multiple of 2π (n = 1 or 2); so Σ As·s² = As·rs²/2 for n ≥ 3 in every direction.
func RingGyration(rs float64) float64 { return rs / math.Sqrt2 }

// EffectiveDepth returns d = D/2 + is for bending in direction theta, mm: the effective
// depth of reinforcement distributed round the section, EN 1992-1-1:2004 5.8.8.3(2).
func (c *Circle) EffectiveDepth(theta float64) float64 { return c.D/2 + c.Is(theta) }

// BarsOnCircle returns n bars of diameter dia (mm) evenly spaced on a circle of radius
// radius (mm) about the centre, the first at angle firstAngle (rad) from +z towards +y,
// at (radius·sin a, radius·cos a) as the normal of CircleState.Theta.
func BarsOnCircle(n int, dia, radius, firstAngle float64) []Bar {
	if n <= 0 {
		return nil
	}
	area := math.Pi * dia * dia / 4
	bars := make([]Bar, n)
	for k := range bars {
		sn, cs := snapUnit(firstAngle + 2*math.Pi*float64(k)/float64(n))
		bars[k] = Bar{Y: radius * sn, Z: radius * cs, Area: area}
	}
	return bars
}

// square returns the D × D Section without bars that carries the circle's materials.
func (c *Circle) square() Section {
	return Section{B: c.D, H: c.D, Concrete: c.Concrete, Fcd: c.Fcd, Fyd: c.Fyd, Es: c.Es, Block: c.Block}
}

// Validate reports an error when the section or its material values cannot be used.
func (c *Circle) Validate() error {
	if !(c.D > 0) || math.IsInf(c.D, 0) {
		return fmt.Errorf("section: D = %g mm must be positive", c.D)
	}
	sq := c.square()
	if err := sq.Validate(); err != nil {
		return err
	}
	r := c.D / 2
	for i, b := range c.Bars {
		if !(b.Area >= 0) || math.IsInf(b.Area, 0) {
			return fmt.Errorf("section: bar %d has area %g mm²", i+1, b.Area)
		}
		if !(math.Hypot(b.Y, b.Z) < r) {
			return fmt.Errorf("section: bar %d at (%g, %g) mm is not inside the circle of diameter %g mm", i+1, b.Y, b.Z, c.D)
		}
	}
	return nil
}

// BlockStress returns the stress of the concrete's plateau: fcd for the parabola-rectangle,
// BlockReduction·η·fcd for the rectangular block, whose compression zone narrows towards
// the extreme fibre (EN 1992-1-1:2004 3.1.7(3), Note), MPa.
func (c *Circle) BlockStress() float64 {
	if c.Block == Rectangular {
		return float64(BlockReduction*c.Concrete.Eta) * c.Fcd
	}
	return c.Fcd
}

// NRdMax returns the design resistance to pure compression at uniform strain εc2 (εc3 for
// the rectangular block): σc·(Ac − As) + Σ As·min(Es·ε, fyd) with σc of BlockStress
// (EN 1992-1-1:2004 6.1(5), Fig. 6.1, pivot C at zero curvature), N.
func (c *Circle) NRdMax() float64 {
	eps := c.Concrete.EpsC2
	if c.Block == Rectangular {
		eps = c.Concrete.EpsC3
	}
	as := c.Area()
	return c.BlockStress()*(c.Ac()-as) + as*math.Min(c.Es*eps, c.Fyd)
}

// NRdMin returns the design tension resistance −As·fyd (compression positive), N.
func (c *Circle) NRdMin() float64 { return -c.Area() * c.Fyd }

// cbar is a bar reduced to what the hot path needs.
type cbar struct{ t, s, r, a float64 } // depth, coordinate along n, along the axis, area

// ring holds the geometry and block constants of one direction of a circle.
type ring struct {
	f      frame   // block constants with f.d = D
	rad    float64 // radius
	ny, nz float64 // unit normal towards compression
	bars   []cbar
}

// ring builds the geometry for direction theta, keeping the bars in buf.
func (c *Circle) ring(theta float64, buf []cbar) ring {
	sq := c.square()
	g := ring{f: sq.frame(AxisY, Positive), rad: c.D / 2}
	g.f.fc = c.BlockStress()
	g.ny, g.nz = snapUnit(theta)
	g.bars = buf[:0]
	for _, b := range c.Bars {
		s := g.ny*b.Y + g.nz*b.Z
		g.bars = append(g.bars, cbar{t: g.rad - s, s: s, r: g.nz*b.Y - g.ny*b.Z, a: b.Area})
	}
	return g
}

// segmentAngle returns the half-angle φ of the segment of depth t (0 ≤ t ≤ D) of a circle
// of diameter D: t = R·(1 − cos φ), written as 2·atan2(√t, √(D − t)) to keep its digits.
func segmentAngle(t, d float64) float64 {
	t = math.Min(math.Max(t, 0), d)
	return 2 * math.Atan2(math.Sqrt(t), math.Sqrt(d-t))
}

// segment returns the area A = R²·(α − sin α·cos α) and first moment about the centre
// along the normal Q = (2/3)·R³·sin³α of the circular segment of half-angle alpha
// (geometry of the circular segment, common practice).
func segment(rad, alpha float64) (a, q float64) {
	sn, cs := math.Sincos(alpha)
	return rad * rad * alphaLessSinCos(alpha, sn, cs), 2 * rad * rad * rad * sn * sn * sn / 3
}

// alphaLessSinCos returns α − sin α·cos α, by its Taylor series
// Σ (−1)^(k+1)·4^k·α^(2k+1)/(2k+1)! below α = 0.1, where the difference would cancel.
func alphaLessSinCos(alpha, sn, cs float64) float64 {
	if alpha >= 0.1 {
		return alpha - sn*cs
	}
	a2 := alpha * alpha
	term := 4 * a2 * alpha / 6 // k = 1
	sum := 0.0
	for k := 1; k <= 8; k++ {
		sum += term
		term *= -4 * a2 / float64((2*k+2)*(2*k+3))
	}
	return sum
}

// circleGLPoints is the number of Gauss–Legendre points of the parabola's correction.
const circleGLPoints = 20

// circleGL holds the Gauss–Legendre nodes and weights on [0, 1].
var circleGL = legendre(circleGLPoints)

// glRule is a Gauss–Legendre rule on [0, 1].
type glRule struct{ x, w []float64 }

// legendre returns the n-point Gauss–Legendre rule on [0, 1]: the nodes are the roots of
// the Legendre polynomial P_n, found by Newton's method from cos(π·(i + 3/4)/(n + 1/2)),
// and the weights 2/((1 − x²)·P_n′(x)²) (Press et al., Numerical Recipes, 3rd ed. 2007,
// § 4.6, gauleg), halved for the interval [0, 1].
func legendre(n int) glRule {
	r := glRule{x: make([]float64, n), w: make([]float64, n)}
	for i := 0; i < (n+1)/2; i++ {
		z := math.Cos(math.Pi * (float64(i) + 0.75) / (float64(n) + 0.5))
		var pp float64
		for it := 0; it < 100; it++ {
			p1, p2 := 1.0, 0.0
			for j := 1; j <= n; j++ {
				p1, p2 = ((2*float64(j)-1)*z*p1-(float64(j)-1)*p2)/float64(j), p1
			}
			pp = float64(n) * (z*p1 - p2) / (z*z - 1)
			dz := p1 / pp
			z -= dz
			if math.Abs(dz) <= 1e-16 {
				break
			}
		}
		w := 1 / ((1 - z*z) * pp * pp) // 2/(…) halved for [0, 1]
		r.x[i], r.x[n-1-i] = (1-z)/2, (1+z)/2
		r.w[i], r.w[n-1-i] = w, w
	}
	return r
}

// concrete returns the concrete resultant F and its first moment Q about the centre along
// the normal (EN 1992-1-1:2004 3.1.7(1) and (3); method in the comment at the top of this
// file).
func (g *ring) concrete(pr *profile) (F, Q float64) { return g.concreteRule(pr, circleGL) }

// concreteRule is concrete with the quadrature rule of the parabola's correction given.
func (g *ring) concreteRule(pr *profile, rule glRule) (F, Q float64) {
	f := &g.f
	D := f.d
	tp, te, L := f.zones(pr)
	ap := segmentAngle(math.Max(tp, te), D)
	a, q := segment(g.rad, ap)
	F, Q = f.fc*a, f.fc*q
	if te > tp && L > 0 {
		ca, cq := g.parabola(segmentAngle(tp, D), segmentAngle(te, D), L, rule)
		F -= f.fc * ca
		Q -= f.fc * cq
	}
	return F, Q
}

// zones returns the depths from the compressed face at which the plateau of the stress
// block ends (tp) and the parabola ends (te ≤ D; 0 when there is none), and the length L
// over which u = (t − tp)/L of the parabola σ = fc·(1 − u^n) runs from 0 to 1.
func (f *frame) zones(pr *profile) (tp, te, L float64) {
	D := f.d
	switch {
	case f.rect:
		return math.Min(math.Max(pr.dc, 0), D), 0, 0
	case pr.kappa <= 0: // uniform εc2 (or more): all plateau
		return D, 0, 0
	case !pr.pivotC:
		return pr.x * (1 - f.r), math.Min(pr.x, D), pr.x * f.r
	}
	return (1 - f.r) * D, D, f.epk / pr.kappa
}

// parabola returns ∫ u^n·w dt and ∫ u^n·w·s dt over the angles [pa, pe] with
// u = (t − tp)/L, by the Gauss–Legendre rule in v with φ = pa + (pe − pa)·v².
func (g *ring) parabola(pa, pe, L float64, rule glRule) (ca, cq float64) {
	R, n := g.rad, g.f.n
	dphi := pe - pa
	for i, v := range rule.x {
		h := dphi * v * v // φ − pa
		phi := pa + h
		sn, cs := math.Sincos(phi)
		// t − tp = R·(cos pa − cos φ) = 2R·sin(pa + h/2)·sin(h/2), free of cancellation.
		u := 2 * R * math.Sin(pa+h/2) * math.Sin(h/2) / L
		wt := rule.w[i] * 2 * dphi * v * 2 * R * R * sn * sn * powN(u, n)
		ca += wt
		cq += wt * R * cs
	}
	return ca, cq
}

// resultants returns N, the moment along the normal and the moment across it for the
// strain profile pr.
func (g *ring) resultants(pr *profile) (n, m, mx float64) {
	F, Q := g.concrete(pr)
	n, m = F, Q
	for i := range g.bars {
		b := &g.bars[i]
		_, ss, sc := g.f.bar(pr, b.t)
		force := b.a * (ss - sc)
		n += force
		m += force * b.s
		mx += force * b.r
	}
	return n, m, mx
}

// bar returns the strain, the steel stress and the stress of the displaced concrete of a
// bar at depth t for the strain profile pr.
func (f *frame) bar(pr *profile, t float64) (eps, sigS, sigC float64) {
	eps = pr.etop - pr.kappa*t
	return eps, f.sigmaS(eps), f.sigmaC(pr, eps, t)
}

// nm returns N and the moment along the normal for parameter p (the hot path).
func (g *ring) nm(p float64) (n, m float64) {
	pr := g.f.profile(p)
	n, m, _ = g.resultants(&pr)
	return n, m
}

// StateAt returns the stress state for the neutral axis perpendicular to direction theta
// (rad, as CircleState.Theta) at depth x (mm) from the extreme compressed fibre; x > D
// gives a pivot-C profile, +Inf uniform strain (EN 1992-1-1:2004 6.1(5), Fig. 6.1).
func (c *Circle) StateAt(theta, x float64) CircleState {
	var buf [maxPoints]cbar
	g := c.ring(theta, buf[:])
	if !(x >= 1e-12*g.f.d) {
		x = 1e-12 * g.f.d
	}
	return c.state(theta, &g, g.f.paramFor(x))
}

// state builds the full CircleState, bars included, for parameter p.
func (c *Circle) state(theta float64, g *ring, p float64) CircleState {
	pr := g.f.profile(p)
	F, Q := g.concrete(&pr)
	st := CircleState{Theta: theta, P: p, X: pr.x, Pivot: "B", EpsTop: pr.etop, EpsBottom: pr.ebot, Fc: F, N: F, M: Q}
	if pr.pivotC {
		st.Pivot = "C"
	}
	if F > 0 {
		st.Lc = Q / F
	}
	st.Bars = make([]CircleBar, len(c.Bars))
	for i, b := range c.Bars {
		cb := &g.bars[i]
		bs := CircleBar{Y: b.Y, Z: b.Z, S: cb.s, Depth: cb.t, Area: b.Area}
		bs.Eps, bs.SigmaS, bs.SigmaC = g.f.bar(&pr, cb.t)
		bs.Force = bs.Area * (bs.SigmaS - bs.SigmaC)
		st.N += bs.Force
		st.M += bs.Force * cb.s
		st.MCross += bs.Force * cb.r
		st.Bars[i] = bs
	}
	sort.SliceStable(st.Bars, func(i, j int) bool { return st.Bars[i].Depth < st.Bars[j].Depth })
	// (My, Mz) = M·(cos θ, sin θ) + M⊥·(−sin θ, cos θ), with (sin θ, cos θ) = (ny, nz).
	st.My = st.M*g.nz - st.MCross*g.ny
	st.Mz = st.M*g.ny + st.MCross*g.nz
	st.MRd = math.Hypot(st.My, st.Mz)
	st.Direction = math.Atan2(st.Mz, st.My)
	return st
}

// MRdAt returns the state in equilibrium with NEd (N, compression positive) for the neutral
// axis perpendicular to direction theta (rad, as CircleState.Theta); its M is the design
// moment of resistance along θ (EN 1992-1-1:2004 6.1(5)). Where the bars are not symmetric
// about θ the moment also has a component MCross across θ; MRd and Direction then give the
// point of the My–Mz contour that the plane reaches.
func (c *Circle) MRdAt(theta, NEd float64) (CircleState, error) {
	var buf [maxPoints]cbar
	g, p, err := c.solve(theta, NEd, buf[:])
	if err != nil {
		return CircleState{}, err
	}
	return c.state(theta, &g, p), nil
}

// Resistance returns the moment M along θ (N·mm) of the equilibrium state at NEd for the
// neutral axis perpendicular to direction theta, without building the state.
func (c *Circle) Resistance(theta, NEd float64) (float64, error) {
	var buf [maxPoints]cbar
	g, p, err := c.solve(theta, NEd, buf[:])
	if err != nil {
		return 0, err
	}
	_, m := g.nm(p)
	return m, nil
}

// solve returns the geometry of direction theta and the profile parameter p in [0, 2] with
// N(p) = NEd, by Brent's method bracketed by N → −As·fyd as p → 0 and N(2) = NRd,max, as
// Section's solve (which states why the bracket closes on a true root).
func (c *Circle) solve(theta, NEd float64, buf []cbar) (ring, float64, error) {
	if err := c.Validate(); err != nil {
		return ring{}, 0, err
	}
	if !finite(NEd) || !finite(theta) {
		return ring{}, 0, fmt.Errorf("section: NEd = %g N and θ = %g rad must be finite numbers", NEd, theta)
	}
	g := c.ring(theta, buf)
	nmax, nmin := c.NRdMax(), c.NRdMin()
	ftol := 1e-9 * math.Max(nmax, 1)
	switch {
	case NEd > nmax+ftol:
		return g, 0, fmt.Errorf("section: NEd = %.6g N exceeds the pure compression resistance NRd,max = %.6g N", NEd, nmax)
	case NEd >= nmax-ftol:
		return g, 2, nil
	case NEd <= nmin:
		return g, 0, fmt.Errorf("section: NEd = %.6g N is at or beyond the tension resistance −As·fyd = %.6g N", NEd, nmin)
	}
	n2, _ := g.nm(2)
	fn := func(p float64) float64 {
		n, _ := g.nm(p)
		return n - NEd
	}
	p, ok := brent(fn, 0, 2, nmin-NEd, n2-NEd, 1e-15, ftol)
	if !ok {
		return g, 0, fmt.Errorf("section: neutral-axis search did not converge in %d iterations at NEd = %.6g N", MaxIter, NEd)
	}
	return g, p, nil
}

// CurveNM returns points (at least 2) of the N–M interaction diagram for bending in direction
// theta (rad, as CircleState.Theta), at axial forces evenly spaced from the tension resistance
// −As·fyd to NRd,max: M is the moment along θ with the side of θ compressed, MNeg the moment
// along θ with the opposite side compressed (EN 1992-1-1:2004 6.1(5), Fig. 6.1). The first
// point is the limit of full tension yield, M = −fyd·Σ As·s; the last is uniform strain. It
// returns nil for an invalid section or direction; points whose solution fails are left out,
// so every value is finite.
func (c *Circle) CurveNM(theta float64, points int) []NMPoint {
	if c.Validate() != nil || !finite(theta) {
		return nil
	}
	if points < 2 {
		points = 2
	}
	opp := normAngle(theta + math.Pi)
	nmin, nmax := c.NRdMin(), c.NRdMax()
	out := make([]NMPoint, 0, points)
	out = append(out, NMPoint{N: nmin, M: c.tensionMoment(theta), MNeg: -c.tensionMoment(opp)})
	for i := 1; i < points-1; i++ {
		n := nmin + (nmax-nmin)*float64(i)/float64(points-1)
		mp, err1 := c.Resistance(theta, n)
		mn, err2 := c.Resistance(opp, n)
		if err1 != nil || err2 != nil || !finite(mp) || !finite(mn) {
			continue
		}
		out = append(out, NMPoint{N: n, M: mp, MNeg: -mn})
	}
	return append(out, NMPoint{N: nmax, M: c.uniformMoment(theta), MNeg: -c.uniformMoment(opp)})
}

// tensionMoment returns the moment along theta with every bar yielding in tension and no
// concrete, −fyd·Σ As·s, N·mm.
func (c *Circle) tensionMoment(theta float64) float64 {
	var buf [maxPoints]cbar
	g := c.ring(theta, buf[:])
	m := 0.0
	for _, b := range g.bars {
		m -= c.Fyd * b.a * b.s
	}
	return m
}

// uniformMoment returns the moment along theta at uniform strain, that of MRdAt at NRd,max, N·mm.
func (c *Circle) uniformMoment(theta float64) float64 {
	var buf [maxPoints]cbar
	g := c.ring(theta, buf[:])
	_, m := g.nm(2)
	return m
}
