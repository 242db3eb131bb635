package building

import (
	"colsheet/calc/actions"
	"colsheet/calc/frame"
	"colsheet/calc/model"
)

// loadSet is the set of partial factors that one expression of EN 1990:2002 6.4.3.2(3) applies
// to the beams of a moment arrangement, EN 1992-1-1:2004 5.1.3(1)P: the loaded spans carry
// fG·Gk + fQ·Qk, the lightly loaded ones fL·Gk.
type loadSet struct {
	expr       string  // actions.Expr610, Expr610a, Expr610b or ExprInf
	label      string  // the expression as the sheet names it
	loaded     string  // the loaded spans' load in symbols
	light      string  // the lightly loaded spans' load in symbols
	fG, fL, fQ float64 // factors on Gk of the loaded and the light spans, and on Qk
	psi0       bool    // fQ is multiplied by ψ0 of each load's category (Eq. (6.10a))
}

// loadSets returns the sets of factors of the moment arrangements: those of the combination
// rule in force (Eq. (6.10), or (6.10a) and (6.10b)), each giving the largest axial force with
// its moments, and last the set with the permanent actions favourable (γG,inf on every span,
// EN 1990:2002 Table A1.2(B), Note 3: one source, one factor), which gives the least axial force
// that goes with the same variable actions.
func loadSets(in *model.Input) []loadSet {
	p := in.Code
	gG, gL, gQ, xi, gInf := p.Get("gamma_G"), p.Get("gamma_G_light"), p.Get("gamma_Q"), p.Get("xi"), p.Get("gamma_G_inf")
	inf := loadSet{expr: actions.ExprInf, label: "Eq. (6.10) with γG,inf (least axial force)", loaded: "γG,inf·Gk + γQ·Qk", light: "γG,inf·Gk", fG: gInf, fL: gInf, fQ: gQ}
	if in.Building.Options.Combination == model.Comb610ab {
		return []loadSet{
			{expr: actions.Expr610a, label: "Eq. (6.10a)", loaded: "γG·Gk + γQ·ψ0·Qk", light: "γG,light·Gk", fG: gG, fL: gL, fQ: gQ, psi0: true},
			{expr: actions.Expr610b, label: "Eq. (6.10b)", loaded: "ξ·γG·Gk + γQ·Qk", light: "ξ·γG,light·Gk", fG: xi * gG, fL: xi * gL, fQ: gQ},
			inf,
		}
	}
	return []loadSet{{expr: actions.Expr610, label: "Eq. (6.10)", loaded: "γG·Gk + γQ·Qk", light: "γG,light·Gk", fG: gG, fL: gL, fQ: gQ}, inf}
}

// mainSets returns the sets of the combination rule, without the least-axial-force set.
func mainSets(sets []loadSet) []loadSet { return sets[:len(sets)-1] }

// q returns the factor on the imposed load of category c.
func (s loadSet) q(c string) float64 {
	if s.psi0 {
		return s.fQ * actions.PsiStep("", 0, c).Value
	}
	return s.fQ
}

// pieces returns the factored load pieces of a beam, loaded (fG·G + fQ·ΣQ) or light (fL·G).
func (s loadSet) pieces(ld BeamLoad, loaded bool) []frame.Piece {
	n := len(ld.G)
	if loaded {
		for _, q := range ld.Q {
			n += len(q)
		}
	}
	var out []frame.Piece
	if n > 0 {
		out = make([]frame.Piece, 0, n)
	}
	g := s.fL
	if loaded {
		g = s.fG
	}
	for _, p := range ld.G {
		out = append(out, p.Scale(g))
	}
	if loaded {
		for _, c := range keys(ld.Q) {
			f := s.q(c)
			for _, p := range ld.Q[c] {
				out = append(out, p.Scale(f))
			}
		}
	}
	return frame.Merge(out)
}

// extra returns the load pieces that loading a beam adds to its light load: (fG − fL)·G + fQ·ΣQ.
func (s loadSet) extra(ld BeamLoad) []frame.Piece {
	var out []frame.Piece
	if d := s.fG - s.fL; d != 0 {
		for _, p := range ld.G {
			out = append(out, p.Scale(d))
		}
	}
	for _, c := range keys(ld.Q) {
		f := s.q(c)
		for _, p := range ld.Q[c] {
			out = append(out, p.Scale(f))
		}
	}
	return frame.Merge(out)
}
