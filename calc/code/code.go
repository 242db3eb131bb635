// Package code holds the partial factors and nationally determined parameters in force.
//
// Every nationally determined parameter has the value recommended in the EN text and
// may be overridden by name; Params lists which ones were.
package code

import (
	"fmt"
	"sort"
)

// Standard names the editions the engine implements.
const Standard = "EN 1992-1-1:2004+A1:2014; EN 1992-1-2:2004; EN 1990:2002+A1:2005; EN 1991-1-1:2002"

// Param describes one overridable parameter.
type Param struct {
	Name    string  // key under code.overrides
	Symbol  string  // display symbol
	Clause  string  // clause that sets it
	What    string  // meaning in words
	Default float64 // EN recommended value
	Min     float64 // smallest accepted value
	Max     float64 // largest accepted value
}

// Catalogue lists every overridable parameter with its EN recommended value.
var Catalogue = []Param{
	{"gamma_c", "γ_c", "EN 1992-1-1:2004 2.4.2.4(1), Table 2.1N", "Partial factor for concrete, persistent and transient", 1.5, 1, 2},
	{"gamma_s", "γ_s", "EN 1992-1-1:2004 2.4.2.4(1), Table 2.1N", "Partial factor for reinforcing steel, persistent and transient", 1.15, 1, 1.5},
	{"alpha_cc", "α_cc", "EN 1992-1-1:2004 3.1.6(1)", "Coefficient for long-term effects on compressive strength", 1.0, 0.8, 1},
	{"Es", "E_s", "EN 1992-1-1:2004 3.2.7(4)", "Design modulus of elasticity of reinforcing steel, MPa", 200000, 150000, 250000},
	{"theta_0", "θ_0", "EN 1992-1-1:2004 5.2(5)", "Basic value of the inclination imperfection", 1.0 / 200, 0, 0.05},
	{"lambda_lim_k", "k_λ", "EN 1992-1-1:2004 5.8.3.1(1)", "Constant of the slenderness limit λlim = k·A·B·C/√n", 20, 5, 50},
	{"c_curv", "c", "EN 1992-1-1:2004 5.8.8.2(4)", "Factor of the curvature distribution in e2 = (1/r)·l0²/c", 10, 8, 12},
	{"phi_ef_default", "φ_ef", "common practice", "Effective creep ratio used in Kφ (5.8.8.3) and Kc (5.8.7.2) where the input gives none", 2.0, 0, 5},
	{"As_min_N", "k_N", "EN 1992-1-1:2004 9.5.2(2)", "As,min as a fraction of NEd/fyd", 0.10, 0, 1},
	{"As_min_Ac", "k_A", "EN 1992-1-1:2004 9.5.2(2)", "As,min as a fraction of Ac", 0.002, 0, 0.04},
	{"As_max_Ac", "k_max", "EN 1992-1-1:2004 9.5.2(3)", "As,max outside lap locations as a fraction of Ac", 0.04, 0.01, 0.08},
	{"As_max_lap_Ac", "k_max,lap", "EN 1992-1-1:2004 9.5.2(3)", "As,max at laps as a fraction of Ac", 0.08, 0.01, 0.16},
	{"phi_min", "φ_min", "EN 1992-1-1:2004 9.5.2(1)", "Minimum diameter of longitudinal bars, mm", 8, 6, 40},
	{"link_dia_min", "φ_t,min", "EN 1992-1-1:2004 9.5.3(1)", "Minimum link diameter, mm", 6, 4, 16},
	{"link_dia_ratio", "k_t", "EN 1992-1-1:2004 9.5.3(1)", "Minimum link diameter as a fraction of the largest bar diameter", 0.25, 0, 1},
	{"link_spacing_bars", "k_s", "EN 1992-1-1:2004 9.5.3(3)", "Link spacing limit as a multiple of the smallest bar diameter", 20, 5, 40},
	{"link_spacing_max", "s_max", "EN 1992-1-1:2004 9.5.3(3)", "Absolute link spacing limit, mm", 400, 100, 600},
	{"link_spacing_zone", "k_r", "EN 1992-1-1:2004 9.5.3(4)", "Factor on the link spacing near beams, slabs and laps", 0.6, 0.3, 1},
	{"spacing_k1", "k_1", "EN 1992-1-1:2004 8.2(2)", "Clear bar spacing as a multiple of bar diameter", 1, 0.5, 3},
	{"spacing_k2", "k_2", "EN 1992-1-1:2004 8.2(2)", "Clear bar spacing above the aggregate size, mm", 5, 0, 20},
	{"spacing_min", "s_min", "EN 1992-1-1:2004 8.2(2)", "Absolute minimum clear bar spacing, mm", 20, 10, 50},
	{"gamma_G", "γ_G", "EN 1990:2002 A1.3.1(4), Table A1.2(B)", "Partial factor for permanent actions, unfavourable", 1.35, 1, 2},
	{"gamma_G_inf", "γ_G,inf", "EN 1990:2002 A1.3.1(4), Table A1.2(B)", "Partial factor for permanent actions, favourable", 1.0, 0.8, 1.35},
	{"gamma_Q", "γ_Q", "EN 1990:2002 A1.3.1(4), Table A1.2(B)", "Partial factor for variable actions, unfavourable", 1.5, 1, 2},
	{"xi", "ξ", "EN 1990:2002 A1.3.1(4), Table A1.2(B)", "Reduction factor for unfavourable permanent actions in Eq. (6.10b)", 0.85, 0.5, 1},
	{"gamma_G_light", "γ_G,light", "EN 1992-1-1:2004 5.1.3(1)P", "Partial factor for permanent load on the lightly loaded spans of the load arrangements", 1.35, 1, 2},
	{"density_rc", "γ_rc", "EN 1991-1-1:2002 Annex A, Table A.1", "Weight density of reinforced concrete, N/mm³", 2.5e-5, 1e-5, 3.5e-5},
	{"fire_emax", "k_e", "EN 1992-1-2:2004 5.3.2(2)", "Greatest first-order eccentricity for Method A (Table 5.2a) as a fraction of the section dimension", 0.15, 0.05, 0.5},
}

// index maps each parameter name to its place in Catalogue.
var index = func() map[string]int {
	m := make(map[string]int, len(Catalogue))
	for i, p := range Catalogue {
		m[p.Name] = i
	}
	return m
}()

// Lookup returns the catalogue entry called name.
func Lookup(name string) (Param, bool) {
	i, ok := index[name]
	if !ok {
		return Param{}, false
	}
	return Catalogue[i], true
}

// IsOverridden reports whether the input changed the named parameter.
func (p Params) IsOverridden(name string) bool {
	_, ok := p.overrides[name]
	return ok
}

// Params holds the values in force for one calculation.
type Params struct {
	Annex     string             // national annex in force ("recommended" for the EN values)
	values    map[string]float64 // every catalogue parameter
	overrides map[string]float64 // the ones the input changed
}

// Recommended returns the EN recommended values.
func Recommended() Params {
	p := Params{Annex: "recommended", values: map[string]float64{}, overrides: map[string]float64{}}
	for _, c := range Catalogue {
		p.values[c.Name] = c.Default
	}
	return p
}

// Override returns a copy of p with the named parameter set to v, or an error naming the fault.
func (p Params) Override(name string, v float64) (Params, error) {
	c, ok := Lookup(name)
	if !ok {
		return p, fmt.Errorf("unknown parameter %q (known: %s)", name, names())
	}
	if !(v >= c.Min && v <= c.Max) {
		return p, fmt.Errorf("%s = %g is outside the accepted range %g to %g", name, v, c.Min, c.Max)
	}
	q := Params{Annex: p.Annex, values: map[string]float64{}, overrides: map[string]float64{}}
	for k, x := range p.values {
		q.values[k] = x
	}
	for k, x := range p.overrides {
		q.overrides[k] = x
	}
	q.values[name] = v
	q.overrides[name] = v
	return q, nil
}

func names() string {
	s := ""
	for i, c := range Catalogue {
		if i > 0 {
			s += ", "
		}
		s += c.Name
	}
	return s
}

// Get returns the value in force of the named parameter; it panics on a name not in the catalogue.
func (p Params) Get(name string) float64 {
	v, ok := p.values[name]
	if !ok {
		if p.values == nil {
			if c, ok := Lookup(name); ok {
				return c.Default
			}
		}
		panic("code: unknown parameter " + name)
	}
	return v
}

// Overrides returns the overridden parameters, sorted by name.
func (p Params) Overrides() []Override {
	out := make([]Override, 0, len(p.overrides))
	for k, v := range p.overrides {
		c, _ := Lookup(k)
		out = append(out, Override{Param: c, Value: v})
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Name < out[j].Name })
	return out
}

// Override is a parameter whose value differs from the EN recommendation.
type Override struct {
	Param
	Value float64
}
