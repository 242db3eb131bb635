package section

// Biaxial bending with an inclined neutral axis (EN 1992-1-1:2004 6.1(2)P, 6.1(5), Fig. 6.1).
//
// Geometry. The unit normal to the neutral axis, pointing to the compressed side, is
// n = (sin β, cos β) in (y, z), so that β = 0 is bending about y with +z compressed, as
// MRd(AxisY, ·), and β = 90° bending about z with +y compressed, as MRd(AxisZ, ·). The
// depth t of a point is measured along −n from the most compressed corner; the section
// depth perpendicular to the axis is D = b·|sin β| + h·|cos β|, and the pivots of Fig. 6.1
// are those of the uniaxial code with this D (εcu at the most compressed corner, or εc2 at
// depth (1 − εc2/εcu2)·D when the whole section is compressed).
//
// Concrete. The strip of the rectangle at depth t is a chord perpendicular to n. Its width
// w(t) and the coordinate c(t) of its midpoint along the axis are linear between the depths
// of the corners 0 ≤ t1 ≤ t2 ≤ D, so the force ∫σ·w dt, the first moment ∫σ·w·t dt and the
// moment across the axis ∫σ·w·c dt are integrals of σ(ε(t)) times polynomials of degree
// two in t. On the plateau σ is constant; on the parabola σ = fc·(1 − u^n) with
// u = (t − tp)/L linear in t, so each integral is a polynomial part minus
// fc·Σ Q_k·[v^(k+1)·u^n/(n + k + 1)] with v = t − tp and Q_k the Taylor coefficients of
// the polynomial about tp: the exact antiderivative of u^n·(polynomial), valid for any
// real n > 0. A parabolic piece that is short and far from tp (the thin end triangles a few
// degrees off the axes) would make these antiderivatives cancel; there u^n is analytic over
// the piece, and a 5-point Gauss–Legendre rule, exact to rounding there, takes their place.
// The rectangular block is a plateau of depth min(λx, D). Once the neutral axis is inclined
// the width of the compressed zone decreases towards the most compressed corner, so the
// block's stress is 0.9·η·fcd there (EN 1992-1-1:2004 3.1.7(3), Note); on the axes, where
// the width is constant, it is η·fcd in full.

import (
	"errors"
	"fmt"
	"math"
)

// BiaxialState is the strain plane in equilibrium with NEd whose resisting moment vector
// (My, Mz) is parallel to the design moment vector, with its resultants.
type BiaxialState struct {
	Theta     float64 // direction of the moment, rad, in (−π, π]: θ asked of Biaxial, atan2(Mz, My) from BiaxialAt
	Angle     float64 // neutral-axis angle β, rad: normal towards compression (sin β, cos β) in (y, z)
	Depth     float64 // neutral-axis depth from the most compressed corner, perpendicular to the axis, mm (+Inf at uniform strain)
	D         float64 // depth of the section perpendicular to the neutral axis, b·|sin β| + h·|cos β|, mm
	P         float64 // profile parameter as State.P: x/D on pivot B, 1 + εbot/εc2 on pivot C
	Pivot     string  // "B" (εcu at the most compressed corner) or "C" (whole section compressed)
	Reduced   bool    // the rectangular block's stress is BlockReduction·η·fcd: the neutral axis is inclined
	EpsTop    float64 // strain at the most compressed corner
	EpsBottom float64 // strain at the least compressed corner
	N         float64 // axial force, compression positive, N
	My        float64 // moment Σ F·z about the centroid, N·mm (as State.M about y)
	Mz        float64 // moment Σ F·y about the centroid, N·mm (as State.M about z)
	MRd       float64 // resisting moment along the direction, √(My² + Mz²), N·mm
}

// Tolerances of the biaxial search.
const (
	biaxNTol     = 1e-11 // |N − NEd| ≤ biaxNTol·NRd,max for the depth at each trial angle
	biaxAngleTol = 1e-9  // |direction of (My, Mz) − θ| ≤ biaxAngleTol, rad
	biaxAngleX   = 1e-13 // bracket width on β at which the angle search stops, rad
	biaxScan     = 16    // trial angles of the scan round the full circle
	biaxJump     = 1e-2  // largest mismatch accepted where the direction jumps, rad
)

// BlockReduction is the factor on η·fcd of the rectangular block where the width of the
// compression zone decreases towards the extreme compression fibre, EN 1992-1-1:2004
// 3.1.7(3), Note ("η·fcd should be reduced by 10 %").
const BlockReduction = 0.9

// inclinedTol is the distance of the neutral-axis angle from a multiple of 90° (rad) beyond
// which the axis counts as inclined, so that the rectangular block's stress is reduced.
const inclinedTol = 1e-9

// ErrReducedBlock is returned (wrapped) by Biaxial when NEd exceeds the axial resistance of
// the section at uniform strain with the rectangular block's stress reduced to 0.9·η·fcd
// (EN 1992-1-1:2004 3.1.7(3), Note): no plane with an inclined neutral axis carries NEd.
var ErrReducedBlock = errors.New("section: with the rectangular block reduced to 0.9·η·fcd for an inclined neutral axis (EN 1992-1-1:2004 3.1.7(3), Note) no strain plane carries NEd")

// Inclined reports whether the neutral-axis angle beta (rad) lies more than 1e-9 rad from
// a multiple of 90°, so that the compressed zone narrows towards its most compressed corner.
func Inclined(beta float64) bool {
	r := math.Abs(math.Remainder(beta, math.Pi/2))
	return r > inclinedTol
}

// reduces reports whether the block's stress is reduced at neutral-axis angle beta: the
// rectangular block with an inclined axis, EN 1992-1-1:2004 3.1.7(3), Note.
func (s *Section) reduces(beta float64) bool { return s.Block == Rectangular && Inclined(beta) }

// ReducedStress returns the stress of the rectangular block where the compression zone
// narrows towards the extreme compression fibre, 0.9·η·fcd (EN 1992-1-1:2004 3.1.7(3),
// Note), computed as the trace's expression k * eta * f_cd.
func (s *Section) ReducedStress() float64 {
	return float64(BlockReduction*s.Concrete.Eta) * s.Fcd
}

// NRdMaxInclined returns the axial resistance at uniform strain of the section with the
// stress of an inclined neutral axis: NRdMax for the parabola-rectangle, and with
// 0.9·η·fcd for the rectangular block (EN 1992-1-1:2004 3.1.7(3), Note), N.
func (s *Section) NRdMaxInclined() float64 {
	if s.Block != Rectangular {
		return s.NRdMax()
	}
	as := s.Area()
	return s.ReducedStress()*(s.B*s.H-as) + as*math.Min(s.Es*s.Concrete.EpsC3, s.Fyd)
}

// barPt is a bar reduced to what the inclined-axis hot path needs.
type barPt struct{ t, y, z, a float64 }

// incl holds the geometry and block constants of one neutral-axis direction.
type incl struct {
	f      frame      // block constants; f.d is the depth D perpendicular to the axis
	ny, nz float64    // unit normal towards compression
	smax   float64    // coordinate s = n·(y, z) of the most compressed corner
	tb     [4]float64 // depths of the corners: 0, t1, t2, D
	w, c   [4]float64 // chord width and midpoint (along the axis) at those depths
	bars   []barPt
	red    bool // the rectangular block's stress is reduced (3.1.7(3), Note)
}

// snapUnit returns sin and cos of beta with values below 1e-15 set to zero, so that the
// directions of the axes give exactly the uniaxial geometry.
func snapUnit(beta float64) (sn, cs float64) {
	sn, cs = math.Sincos(beta)
	if math.Abs(sn) < 1e-15 {
		sn, cs = 0, math.Copysign(1, cs)
	}
	if math.Abs(cs) < 1e-15 {
		sn, cs = math.Copysign(1, sn), 0
	}
	return sn, cs
}

// sgn returns −1 for negative v and +1 otherwise.
func sgn(v float64) float64 {
	if v < 0 {
		return -1
	}
	return 1
}

// incline builds the geometry for angle beta, keeping the bars in buf; the rectangular
// block's stress is reduced when the axis is inclined (EN 1992-1-1:2004 3.1.7(3), Note).
func (s *Section) incline(beta float64, buf []barPt) incl {
	return s.inclineAs(beta, buf, s.reduces(beta))
}

// inclineAs is incline with the reduction of the rectangular block's stress given.
func (s *Section) inclineAs(beta float64, buf []barPt, reduce bool) incl {
	var g incl
	g.f = s.frame(AxisY, Positive)
	if reduce && g.f.rect {
		g.f.fc, g.red = s.ReducedStress(), true
	}
	g.ny, g.nz = snapUnit(beta)
	sy, sz := sgn(g.ny), sgn(g.nz)
	A, Bz := s.B*math.Abs(g.ny), s.H*math.Abs(g.nz) // depth spans of the b and h sides
	D := A + Bz
	g.f.d = D
	g.smax = D / 2
	t1 := math.Min(A, Bz)
	g.tb = [4]float64{0, t1, D - t1, D}
	// Most compressed corner C0 = (sy·b/2, sz·h/2); its neighbours along y and z lie at
	// depths A and Bz, at r = r0 − sy·nz·b and r0 + sz·ny·h (r measured along (nz, −ny)).
	r0 := g.nz*sy*s.B/2 - g.ny*sz*s.H/2
	var w1, c1 float64
	if A <= Bz { // chord through the y-neighbour and the edge from C0 along z
		w1 = s.B * s.H / Bz
		c1 = r0 + (sz*g.ny*s.H*(A/Bz)-sy*g.nz*s.B)/2
	} else { // chord through the z-neighbour and the edge from C0 along y
		w1 = s.B * s.H / A
		c1 = r0 + (sz*g.ny*s.H-sy*g.nz*s.B*(Bz/A))/2
	}
	w0, c0 := 0.0, r0
	if t1 == 0 { // an edge parallel to the axis: the top chord is that edge
		w0, c0 = w1, c1
	}
	// Central symmetry: the chord at depth D − t is the chord at t reflected through the centroid.
	g.w = [4]float64{w0, w1, w1, w0}
	g.c = [4]float64{c0, c1, -c1, -c0}
	g.bars = buf[:0]
	for _, b := range s.Bars {
		g.bars = append(g.bars, barPt{t: g.smax - (g.ny*b.Y + g.nz*b.Z), y: b.Y, z: b.Z, a: b.Area})
	}
	return g
}

// gaussCond bounds the loss of digits accepted in the antiderivatives of the parabola:
// (1 + ρ)²·(b − tp)/(b − a), ρ the distance of [a, b] from tp in lengths of its interval.
// Beyond it [a, b] lies more than 20 of its own lengths from tp.
const gaussCond = 1e4

// powN returns u^n for 0 ≤ u ≤ 1.
func powN(u, n float64) float64 {
	switch {
	case u <= 0:
		return 0
	case u == 1:
		return 1
	case n == 2:
		return u * u
	}
	return math.Exp(n * math.Log(u))
}

// concrete returns ∫σ·w dt, ∫σ·w·t dt and ∫σ·w·c dt over the compressed zone, in closed
// form (EN 1992-1-1:2004 3.1.7(1) and (3); method in the comment at the top of this file).
func (g *incl) concrete(pr *profile) (F, St, Sc float64) { return g.concreteCond(pr, gaussCond) }

// concreteCond is concrete with the bound on the loss of digits beyond which a parabolic
// piece is integrated by the Gauss–Legendre rule (+Inf: always the antiderivatives).
func (g *incl) concreteCond(pr *profile, cond float64) (F, St, Sc float64) {
	f := &g.f
	D := f.d
	var tp, te, L float64 // plateau ends at tp, parabola at te, u = (t − tp)/L
	switch {
	case f.rect:
		tp, te = math.Min(math.Max(pr.dc, 0), D), 0
	case pr.kappa <= 0: // uniform εc2 (or more): all plateau
		tp, te = D, 0
	case !pr.pivotC:
		tp, te, L = pr.x*(1-f.r), math.Min(pr.x, D), pr.x*f.r
	default:
		tp, te, L = (1-f.r)*D, D, f.epk/pr.kappa
	}
	fc, n := f.fc, f.n
	for k := 0; k < 3; k++ {
		T0, T1 := g.tb[k], g.tb[k+1]
		dt := T1 - T0
		if !(dt > 0) {
			continue
		}
		w0, c0 := g.w[k], g.c[k]
		kw, kc := (g.w[k+1]-w0)/dt, (g.c[k+1]-c0)/dt
		// The three integrands as polynomials in τ = t − T0: w, w·t and w·c.
		q := [3][3]float64{
			{w0, kw, 0},
			{w0 * T0, w0 + kw*T0, kw},
			{w0 * c0, w0*kc + kw*c0, kw * kc},
		}
		var acc [3]float64
		// Plateau part [T0, min(T1, tp)] and the polynomial part of the parabola.
		hi := math.Min(T1, tp)
		if te > tp {
			hi = math.Min(T1, te)
		}
		if hi > T0 {
			tau := hi - T0
			for j := range q {
				acc[j] = tau * (q[j][0] + tau*(q[j][1]/2+tau*q[j][2]/3))
			}
		}
		// Parabola correction over [max(T0, tp), min(T1, te)]: −∫u^n·q dτ.
		a, b := math.Max(T0, tp), math.Min(T1, te)
		if b > a {
			rho := (a - tp) / dt
			if (1+rho)*(1+rho)*(b-tp)/(b-a) <= cond {
				// Exact: −Σ Q_k·[v^(k+1)·u^n/(n+k+1)] with Q_k the coefficients about tp.
				va, vb := a-tp, b-tp
				una, unb := powN(va/L, n), powN(vb/L, n)
				tp0 := tp - T0
				for j := range q {
					Q0 := q[j][0] + tp0*(q[j][1]+tp0*q[j][2])
					Q1 := q[j][1] + 2*q[j][2]*tp0
					Q2 := q[j][2]
					fa := va * una * (Q0/(n+1) + va*(Q1/(n+2)+va*Q2/(n+3)))
					fb := vb * unb * (Q0/(n+1) + vb*(Q1/(n+2)+vb*Q2/(n+3)))
					acc[j] -= fb - fa
				}
			} else {
				// Short and far from tp: u^n is analytic over [a, b] (its branch point u = 0
				// lies more than 20 lengths of [a, b] away), where the 5-point Gauss–Legendre
				// rule is exact to rounding and the antiderivatives would cancel.
				// Nodes and weights on [−1, 1]: Abramowitz and Stegun 1964, Table 25.4.
				gx := [5]float64{-0.9061798459386640, -0.5384693101056831, 0, 0.5384693101056831, 0.9061798459386640}
				gw := [5]float64{0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891}
				mid, half := (a+b)/2, (b-a)/2
				for i, x := range gx {
					t := mid + half*x
					wu := half * gw[i] * powN((t-tp)/L, n)
					tau := t - T0
					for j := range q {
						acc[j] -= wu * (q[j][0] + tau*(q[j][1]+tau*q[j][2]))
					}
				}
			}
		}
		F += fc * acc[0]
		St += fc * acc[1]
		Sc += fc * acc[2]
	}
	return F, St, Sc
}

// nm returns N, My and Mz for profile parameter p, without allocating (the hot path).
func (g *incl) nm(p float64) (n, my, mz float64) {
	pr := g.f.profile(p)
	return g.resultants(&pr)
}

// resultants returns N, My and Mz for the strain profile pr.
func (g *incl) resultants(pr *profile) (n, my, mz float64) {
	F, St, Sc := g.concrete(pr)
	ms := g.smax*F - St // ∫σ·w·s dt, s = smax − t
	n = F
	my = g.nz*ms - g.ny*Sc
	mz = g.ny*ms + g.nz*Sc
	for i := range g.bars {
		b := &g.bars[i]
		e := pr.etop - pr.kappa*b.t
		force := b.a * (g.f.sigmaS(e) - g.f.sigmaC(pr, e, b.t))
		n += force
		my += force * b.z
		mz += force * b.y
	}
	return n, my, mz
}

// state returns the BiaxialState of angle beta and parameter p.
func (g *incl) state(beta, p float64) BiaxialState {
	pr := g.f.profile(p)
	n, my, mz := g.resultants(&pr)
	st := BiaxialState{Theta: math.Atan2(mz, my), Angle: normAngle(beta), Depth: pr.x, D: g.f.d, P: p,
		Pivot: "B", Reduced: g.red, EpsTop: pr.etop, EpsBottom: pr.ebot, N: n, My: my, Mz: mz,
		MRd: math.Sqrt(float64(my*my) + float64(mz*mz))}
	if pr.pivotC {
		st.Pivot = "C"
	}
	return st
}

// normAngle returns a in (−π, π].
func normAngle(a float64) float64 {
	a = math.Remainder(a, 2*math.Pi)
	if a <= -math.Pi {
		a += 2 * math.Pi
	}
	return a
}

// BiaxialAt returns the state of the strain plane with neutral-axis angle beta (rad, as
// BiaxialState.Angle) and depth x (mm) from the most compressed corner, perpendicular to
// the axis; x > D gives a pivot-C plane, +Inf uniform strain (EN 1992-1-1:2004 6.1(5)).
func (s *Section) BiaxialAt(beta, x float64) BiaxialState {
	var buf [maxPoints]barPt
	g := s.incline(beta, buf[:])
	if !(x >= 1e-12*g.f.d) {
		x = 1e-12 * g.f.d
	}
	return g.state(beta, g.f.paramFor(x))
}

// errNoMoment marks a plane whose resisting moment vanishes, so that it has no direction.
var errNoMoment = errors.New("section: the resisting moment vanishes")

// biaxSolver finds the plane at one NEd and direction theta; it remembers the last
// depth solved, for a plane without moment.
type biaxSolver struct {
	s            *Section
	NEd, theta   float64
	nmin, ftol   float64
	buf          [maxPoints]barPt
	mtol         float64 // moments below mtol have no direction
	lastP, lastB float64
	haveLast     bool
}

// depthWindow is the half-width of the first bracket on the profile parameter round the
// last root.
const depthWindow = 0.02

// depth returns the parameter p of the plane at angle beta with N = NEd and the
// mismatch of the direction of (My, Mz) with theta, wrapped to [−π, π].
//
// Method: Brent's method on p, bracketed by ±0.02 round the last root when N changes sign
// there, else on [0, 2] by N → −As·fyd as p → 0 and N(2) at uniform strain, as in the
// uniaxial solve.
func (b *biaxSolver) depth(beta float64) (p, mismatch float64, err error) {
	g := b.s.incline(beta, b.buf[:])
	fn := func(p float64) float64 {
		n, _, _ := g.nm(p)
		return n - b.NEd
	}
	// The depth moves little between neighbouring trial angles: try a narrow bracket round
	// the last root first, then the whole range.
	lo, hi := 0.0, 2.0
	glo, ghi := b.nmin-b.NEd, 0.0
	found := false
	if b.haveLast {
		l, h := math.Max(b.lastP-depthWindow, 0), math.Min(b.lastP+depthWindow, 2)
		if l > 0 && h < 2 {
			gl, gh := fn(l), fn(h)
			if gl < 0 && gh > 0 {
				lo, hi, glo, ghi, found = l, h, gl, gh, true
			}
		}
	}
	if !found {
		ghi = fn(2)
		if ghi < 0 && g.red {
			// Only the reduced block falls short of NEd at uniform strain: NEd is below
			// NRd,max − ftol here, which the unreduced resultant at p = 2 reproduces.
			return 0, 0, fmt.Errorf("%w: NEd = %.6g N > %.6g N, its axial resistance at uniform strain", ErrReducedBlock, b.NEd, b.s.NRdMaxInclined())
		}
	}
	p, ok := brent(fn, lo, hi, glo, ghi, 1e-15, b.ftol)
	if !ok {
		return 0, 0, fmt.Errorf("section: neutral-axis depth search did not converge in %d iterations at NEd = %.6g N", MaxIter, b.NEd)
	}
	_, my, mz := g.nm(p)
	b.lastP, b.lastB, b.haveLast = p, beta, true
	if math.Abs(my)+math.Abs(mz) <= b.mtol {
		return p, 0, errNoMoment
	}
	return p, math.Remainder(math.Atan2(mz, my)-b.theta, 2*math.Pi), nil
}

// Biaxial returns the resistance of the section at axial force NEd (N, compression
// positive) in the direction theta = atan2(MEdz, MEdy) of the design moment vector (rad),
// with My and Mz signed as State.M about y and z: the strain plane with N = NEd whose
// resisting moment (My, Mz) is parallel to (cos θ, sin θ), EN 1992-1-1:2004 6.1(2)P, 6.1(5).
//
// Method: for a trial neutral-axis angle β the depth follows from N = NEd by Brent's
// method (one unknown, N monotone in the depth as in the uniaxial solve); the angle is then
// the root of the mismatch between the direction of (My, Mz) and θ, bracketed by secant
// steps from β = θ (or by a scan of the full circle, always so when the bars' centroid is
// off the section's) and closed by Brent's method (R. P. Brent, Algorithms for
// Minimization without Derivatives, 1973, ch. 4). Where the edge of the rectangular block
// crosses a bar the depth jumps and some directions are not reached exactly; the nearest
// plane within 0.01 rad is returned. The error wraps ErrNotEnclosed when the scan finds
// that the resisting moments at NEd do not surround zero moment.
func (s *Section) Biaxial(NEd, theta float64) (BiaxialState, error) {
	return s.biaxial(NEd, theta, theta)
}

// biaxial is Biaxial with a first trial angle beta0.
func (s *Section) biaxial(NEd, theta, beta0 float64) (BiaxialState, error) {
	if err := s.Validate(); err != nil {
		return BiaxialState{}, err
	}
	if !finite(NEd) || !finite(theta) || !finite(beta0) {
		return BiaxialState{}, fmt.Errorf("section: NEd = %g N and θ = %g rad must be finite numbers", NEd, theta)
	}
	theta = normAngle(theta)
	if !Inclined(theta) {
		// A direction along an axis starts from the uniaxial plane, whose rectangular block
		// is not reduced: for a layout symmetric about that axis it is the solution.
		beta0 = theta
	}
	nmax, nmin := s.NRdMax(), s.NRdMin()
	ftolUni := 1e-9 * math.Max(nmax, 1)
	switch {
	case NEd > nmax+ftolUni:
		return BiaxialState{}, fmt.Errorf("section: NEd = %.6g N exceeds the pure compression resistance NRd,max = %.6g N", NEd, nmax)
	case NEd >= nmax-ftolUni:
		return s.uniform(theta), nil
	case NEd <= nmin:
		return BiaxialState{}, fmt.Errorf("section: NEd = %.6g N is at or beyond the tension resistance −As·fyd = %.6g N", NEd, nmin)
	}
	b := &biaxSolver{s: s, NEd: NEd, theta: theta, nmin: nmin, ftol: biaxNTol * math.Max(nmax, 1),
		mtol: 1e-13 * math.Max(nmax, 1) * (s.B + s.H)}
	beta, p, err := b.solveAngle(beta0, s.offCentre())
	if errors.Is(err, errNoMoment) {
		return s.uniformLike(b, theta), nil
	}
	if err != nil {
		return BiaxialState{}, err
	}
	g := s.incline(beta, b.buf[:])
	st := g.state(beta, p)
	st.Theta = theta
	return st, nil
}

// offCentre reports whether the centroid of the bars lies off the section's centroid,
// beyond 1e-9 of the section's size.
func (s *Section) offCentre() bool {
	var a, ay, az float64
	for _, b := range s.Bars {
		a += b.Area
		ay += b.Area * b.Y
		az += b.Area * b.Z
	}
	return math.Abs(ay) > 1e-9*a*s.B || math.Abs(az) > 1e-9*a*s.H
}

// finite reports whether v is neither NaN nor infinite.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// uniform returns the state of uniform strain, with no moment, for direction theta. With
// the strain uniform there is no neutral axis to incline, so the block is not reduced.
func (s *Section) uniform(theta float64) BiaxialState {
	var buf [maxPoints]barPt
	g := s.inclineAs(theta, buf[:], false)
	st := g.state(theta, 2)
	st.Theta, st.My, st.Mz, st.MRd = theta, 0, 0, 0
	return st
}

// uniformLike returns the last plane found, whose moment vanished, with no moment.
func (s *Section) uniformLike(b *biaxSolver, theta float64) BiaxialState {
	g := s.incline(b.lastB, b.buf[:])
	st := g.state(b.lastB, b.lastP)
	st.Theta, st.My, st.Mz, st.MRd = theta, 0, 0, 0
	return st
}

// ErrNotEnclosed is returned (wrapped) by Biaxial when, at NEd, the resisting moments of
// the section do not surround zero moment: the section cannot carry NEd without a moment
// about its centroid (bars whose centroid is off the section's, near the tension or the
// compression limit), so its resistance in a direction is not one number.
var ErrNotEnclosed = errors.New("section: at this axial force the resisting moments do not surround zero moment about the centroid")

// anglePt is one trial of the angle search.
type anglePt struct{ beta, p, e, phi float64 }

// trial solves the depth at beta and returns the trial with its mismatch.
func (b *biaxSolver) trial(beta float64) (anglePt, error) {
	p, e, err := b.depth(beta)
	return anglePt{beta, p, e, normAngle(e + b.theta)}, err
}

// solveAngle returns the neutral-axis angle and depth parameter whose moment points along
// theta: secant steps from beta0 to bracket the root (skipped when the bars' centroid is
// off the section's), else a scan of the full circle that also counts how often the
// moment winds round zero; then Brent's method in the bracket.
func (b *biaxSolver) solveAngle(beta0 float64, offCentre bool) (beta, p float64, err error) {
	var lo, hi anglePt
	found := false
	if !offCentre {
		x0, err := b.trial(beta0)
		if err != nil || math.Abs(x0.e) <= biaxAngleTol {
			return x0.beta, x0.p, err
		}
		// The slope starts at 1: the direction of the moment follows the normal of the axis.
		slope := 1.0
		for it := 0; it < 12; it++ {
			step := -x0.e / slope * 1.05 // a little beyond the secant root, to bracket it
			step = math.Copysign(math.Min(math.Max(math.Abs(step), 1e-9), math.Pi/4), step)
			x1, err := b.trial(x0.beta + step)
			if err != nil || math.Abs(x1.e) <= biaxAngleTol {
				return x1.beta, x1.p, err
			}
			if (x1.e > 0) != (x0.e > 0) && math.Abs(x1.e-x0.e) < math.Pi {
				lo, hi, found = x0, x1, true
				break
			}
			if math.Abs(x1.e) >= math.Abs(x0.e) || math.Abs(x1.e-x0.e) >= math.Pi {
				break // not approaching a root: scan instead
			}
			slope = (x1.e - x0.e) / (x1.beta - x0.beta)
			x0 = x1
		}
	}
	if !found {
		lo, hi, err = b.scan()
		if err != nil || lo.beta == hi.beta {
			return lo.beta, lo.p, err
		}
	}
	best := lo
	if math.Abs(hi.e) < math.Abs(lo.e) {
		best = hi
	}
	var last anglePt
	var lastErr error
	g := func(beta float64) float64 {
		last, lastErr = b.trial(beta)
		if lastErr != nil {
			return 0 // stops the search; the error is returned below
		}
		if math.Abs(last.e) < math.Abs(best.e) {
			best = last
		}
		return last.e
	}
	if _, ok := brent(g, lo.beta, hi.beta, lo.e, hi.e, biaxAngleX, biaxAngleTol); lastErr != nil {
		return last.beta, last.p, lastErr
	} else if !ok {
		return 0, 0, fmt.Errorf("section: neutral-axis angle search did not converge in %d iterations at θ = %.6g rad", MaxIter, b.theta)
	}
	// A step of the rectangular block's edge across a bar makes the depth, and with it the
	// direction of the moment, jump; the search then closes on the jump. The trial nearest
	// to θ is kept when it misses θ by little (the trace states the mismatch).
	if math.Abs(best.e) > biaxJump {
		return 0, 0, fmt.Errorf("section: the resisting moment cannot be turned to θ = %.6g rad (mismatch %.3g rad)", b.theta, best.e)
	}
	return best.beta, best.p, nil
}

// scan tries biaxScan angles round the full circle from θ − π, halving a step (up to 12
// times) where the direction of the moment turns by more than π/2 over it, and returns the
// two neighbours between which the mismatch changes sign (away from its ±π wrap), or one
// trial twice when it meets θ. It returns ErrNotEnclosed when the moment does not wind
// once round zero over the circle.
func (b *biaxSolver) scan() (lo, hi anglePt, err error) {
	first, err := b.trial(b.theta - math.Pi)
	if err != nil {
		return first, first, err
	}
	wind := 0.0
	found := false
	var segment func(a, c anglePt, depth int) error
	segment = func(a, c anglePt, depth int) error {
		d := math.Remainder(c.phi-a.phi, 2*math.Pi)
		if math.Abs(d) > math.Pi/2 && depth < 12 {
			m, err := b.trial((a.beta + c.beta) / 2)
			if err != nil {
				return err
			}
			if err := segment(a, m, depth+1); err != nil {
				return err
			}
			return segment(m, c, depth+1)
		}
		wind += d
		if !found {
			if math.Abs(a.e) <= biaxAngleTol {
				lo, hi, found = a, a, true
			} else if (c.e > 0) != (a.e > 0) && math.Abs(c.e-a.e) < math.Pi {
				lo, hi, found = a, c, true
			}
		}
		return nil
	}
	prev := first
	for k := 1; k <= biaxScan; k++ {
		cur := first
		cur.beta += 2 * math.Pi // the same plane, closing the circle
		if k < biaxScan {
			if cur, err = b.trial(b.theta - math.Pi + 2*math.Pi*float64(k)/biaxScan); err != nil {
				return cur, cur, err
			}
		}
		if err := segment(prev, cur, 0); err != nil {
			return first, first, err
		}
		prev = cur
	}
	if math.Abs(wind) < math.Pi {
		return first, first, fmt.Errorf("%w (NEd = %.6g N)", ErrNotEnclosed, b.NEd)
	}
	if !found {
		return first, first, fmt.Errorf("section: no neutral-axis angle gives a resisting moment in the direction θ = %.6g rad", b.theta)
	}
	return lo, hi, nil
}
