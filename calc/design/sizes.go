package design

import (
	"cmp"
	"math"
	"slices"

	"colsheet/calc/model"
	"colsheet/calc/trace"
)

// SizeResult is the outcome of the section-size finder for one column.
type SizeResult struct {
	Column      string
	Found       bool       // a size from the list passes every lift
	Size        model.Size // the smallest that passes (B along y, H along z)
	Given       model.Size // the size of the input (the first lift's)
	AsProv      float64    // mm², the most steel any lift needs with that size
	Rho         float64    // AsProv/Ac
	Utilization float64    // the largest utilisation of the lifts with that size
	Tried       int        // sizes tried
}

// sizeArea returns the gross concrete area of a size, mm².
func sizeArea(s model.Size) float64 {
	if s.Shape == model.ShapeCircle {
		return circleArea(s.B)
	}
	return s.B * s.H
}

// diameterList returns the diameters to try for a circular column, smallest first: those of the
// listed sizes that are square or circular (their side taken as the diameter), or the range
// from Min to Max by Step.
func diameterList(s *model.SizeSearch, helix bool) []model.Size {
	var ds []float64
	if len(s.Sizes) > 0 {
		for _, z := range s.Sizes {
			if math.Abs(z.B-z.H) < 1e-9 {
				ds = append(ds, z.B)
			}
		}
	} else if s.Step > 0 {
		for d := s.Min; d <= s.Max+1e-9; d += s.Step {
			ds = append(ds, d)
		}
	}
	slices.Sort(ds)
	ds = slices.Compact(ds)
	out := make([]model.Size, len(ds))
	for i, d := range ds {
		out[i] = model.Size{B: d, H: d, Shape: model.ShapeCircle, Helix: helix}
	}
	return out
}

// sizeList returns the sizes to try, smallest area first, then the squarer, then the narrower.
func sizeList(s *model.SizeSearch) []model.Size {
	var out []model.Size
	if len(s.Sizes) > 0 {
		out = append(out, s.Sizes...)
	} else if s.Step > 0 {
		for b := s.Min; b <= s.Max+1e-9; b += s.Step {
			for h := s.Min; h <= s.Max+1e-9; h += s.Step {
				if !s.Square || math.Abs(b-h) < 1e-9 {
					out = append(out, model.Size{B: b, H: h})
				}
			}
		}
	}
	slices.SortStableFunc(out, func(x, y model.Size) int {
		if c := cmp.Compare(x.B*x.H, y.B*y.H); c != 0 {
			return c
		}
		if c := cmp.Compare(math.Abs(x.B-x.H), math.Abs(y.B-y.H)); c != 0 {
			return c
		}
		return cmp.Compare(x.B, y.B)
	})
	return out
}

// lift is one column lift with the actions the finder checks it for.
type liftCase struct {
	col *model.Column
	st  *model.Storey
}

// findSizes returns, for each column of the result, the smallest section of the size search that
// passes every check of every lift with a steel ratio not above the target. The actions are held
// as derived for the sizes of the input: the self-weight and the stiffness of a new size would
// change them a little, which a rerun with the size chosen settles.
func findSizes(in *model.Input, r *Result) []SizeResult {
	s := in.Options.Sizes
	rectSizes := sizeList(s)
	rhoMax := s.RhoMax
	if !(rhoMax > 0) {
		rhoMax = in.Code.Get("As_max_Ac")
	}
	// Group the lifts by column, the heaviest first so that a size fails early.
	byCol := map[string][]liftCase{}
	var order []string
	for k := range r.Designs {
		d := &r.Designs[k]
		if _, ok := byCol[d.Column]; !ok {
			order = append(order, d.Column)
		}
		byCol[d.Column] = append(byCol[d.Column], r.cases[k])
	}
	var out []SizeResult
	for _, id := range order {
		cases := byCol[id]
		slices.SortStableFunc(cases, func(a, b liftCase) int { return cmp.Compare(b.st.NEd, a.st.NEd) })
		first := cases[0].col
		res := SizeResult{Column: id, Given: model.Size{B: first.B, H: first.H, Shape: first.Shape, Helix: first.Helix}}
		sizes := rectSizes
		if first.Shape == model.ShapeCircle {
			sizes = diameterList(s, first.Helix) // a circular column keeps its shape: the finder tries diameters
		}
		for _, sz := range sizes {
			res.Tried++
			ok, as, util := true, 0.0, 0.0
			for _, lc := range cases {
				col := *lc.col
				col.B, col.H, col.Shape, col.Helix, col.Bars = sz.B, sz.H, sz.Shape, sz.Helix, nil // the bars are designed for each size
				st := *lc.st
				col.Storeys = []model.Storey{st}
				if !quickAxial(in, &col, &col.Storeys[0], rhoMax) {
					ok = false
					break
				}
				d := design(in, &col, &col.Storeys[0], nil, r.bs)
				if d.Status != StatusPass || d.AsProv > rhoMax*sizeArea(sz)*(1+1e-9) {
					ok = false
					break
				}
				as, util = math.Max(as, d.AsProv), math.Max(util, d.Utilization)
			}
			if ok {
				res.Found, res.Size, res.AsProv, res.Rho, res.Utilization = true, sz, as, as/sizeArea(sz), util
				break
			}
		}
		out = append(out, res)
	}
	return out
}

// quickAxial reports whether the section could carry NEd with the largest steel ratio accepted,
// by the resistance to pure compression (EN 1992-1-1:2004 6.1), before a full design is tried.
func quickAxial(in *model.Input, col *model.Column, st *model.Storey, rhoMax float64) bool {
	c := &common{in: in, col: col, st: st, p: in.Code, circle: col.Shape == model.ShapeCircle}
	c.fcd = trace.Const(in.Code.Get("alpha_cc")*in.Materials.Concrete.Fck/in.Code.Get("gamma_c"), "", "MPa")
	c.fyd = trace.Const(in.Materials.Fyk/in.Code.Get("gamma_s"), "", "MPa")
	c.es = trace.Const(in.Code.Get("Es"), "", "MPa")
	return st.NEd <= c.section([][2]float64{{0, 0}}, rhoMax*sizeArea(model.Size{B: col.B, H: col.H, Shape: col.Shape})).nRdMax()
}
