package input

import (
	"errors"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"colsheet/calc/model"
	"colsheet/calc/quantity"

	"gopkg.in/yaml.v3"
)

// Defaults and limits of the durability data (EN 1992-1-1 4.4.1) and the fire data (EN 1992-1-2).
const (
	DefaultStructuralClass = 4   // structural class for a 50-year design life, EN 1992-1-1 Table 4.3N
	StructuralClassMin     = 1   // lowest structural class, S1
	StructuralClassMax     = 6   // highest structural class, S6
	DefaultDesignLife      = 50  // design working life, years
	DesignLifeMin          = 10  // shortest accepted design working life, years
	DesignLifeMax          = 200 // longest accepted design working life, years
	DeltaCoverMax          = 20  // largest accepted Δcdev and Δcdur,γ, mm
	EtaFiMin               = 0.3 // smallest accepted reduction factor ηfi
	EtaFiMax               = 1.0 // largest accepted reduction factor ηfi
)

// exposureClasses are the exposure classes of EN 1992-1-1 Table 4.1, in the table's order.
var exposureClasses = []string{"X0", "XC1", "XC2", "XC3", "XC4", "XD1", "XD2", "XD3", "XS1", "XS2", "XS3",
	"XF1", "XF2", "XF3", "XF4", "XA1", "XA2", "XA3"}

// fireRatings are the standard fire resistances of EN 1992-1-2 Table 5.2a, minutes.
var fireRatings = []int{30, 60, 90, 120, 180, 240}

var durabilityKeys = []string{"exposure", "structural_class", "design_life", "special_qc", "delta_cdev", "delta_cdur_gamma"}

var fireKeys = []string{"rating", "eta_fi", "mu_fi", "method", "note"}

// Choices of mu_fi: how the load level in fire μfi is taken.
const (
	muFiComputed = "computed" // μfi = NEd,fi/NRd with NEd,fi = ηfi·NEd
	muFiEtaFi    = "eta_fi"   // μfi = ηfi, on the safe side
)

// durability reads the data of EN 1992-1-1 4.4.1 for the cover at n. Keys not given keep the
// values of base, the data the entry overrides (nil for none: then the defaults hold and the
// exposure is required). The result is not nil; where it holds faults they are reported, and
// Parse then returns no input.
func (r *reader) durability(n *yaml.Node, path string, base *model.Durability) *model.Durability {
	d := &model.Durability{StructuralClass: DefaultStructuralClass, DesignLife: DefaultDesignLife}
	if base != nil {
		*d = *base
		d.Exposure = append([]string(nil), base.Exposure...)
	}
	f := r.fields(n, path, durabilityKeys...)
	if f == nil {
		return d
	}
	if e, ok := f["exposure"]; ok {
		d.Exposure = r.exposure(e.val, join(path, "exposure"))
	} else if base == nil {
		r.fail(n, join(path, "exposure"), "is required but missing (the exposure classes of EN 1992-1-1 Table 4.1, e.g. exposure: [XC3, XD1])")
	}
	if e, ok := f["structural_class"]; ok {
		if v, ok := r.structuralClass(e.val, join(path, "structural_class")); ok {
			d.StructuralClass = v
		}
	}
	if e, ok := f["design_life"]; ok {
		if v, ok := r.years(e.val, join(path, "design_life")); ok {
			d.DesignLife = v
		}
	}
	if e, ok := f["special_qc"]; ok {
		if v, ok := r.boolean(e.val, join(path, "special_qc")); ok {
			d.SpecialQC = v
		}
	}
	if e, ok := f["delta_cdev"]; ok {
		if v, ok := r.lengthWithin(e.val, join(path, "delta_cdev"), 0, DeltaCoverMax,
			"the allowance for deviation Δcdev (EN 1992-1-1 4.4.1.3(1)P)"); ok {
			d.DeltaCdev = &v // used as given, 0 included (4.4.1.3(3)); not given, the engine takes 10 mm
		}
	}
	if e, ok := f["delta_cdur_gamma"]; ok {
		if v, ok := r.lengthWithin(e.val, join(path, "delta_cdur_gamma"), 0, DeltaCoverMax,
			"the additive safety element Δcdur,γ (EN 1992-1-1 4.4.1.2(6))"); ok {
			d.DeltaCdurGamma = v
		}
	}
	return d
}

// exposure reads one exposure class or a list of them, upper-cased, each given once; X0 stands alone.
func (r *reader) exposure(n *yaml.Node, path string) []string {
	out, _ := r.refs(n, path, "exposure classes", "%s is listed twice", func(it *yaml.Node, p string) (string, bool) {
		return r.upperOf(it, p, "an exposure class of EN 1992-1-1 Table 4.1", exposureClasses)
	})
	if out == nil {
		return nil
	}
	if len(out) > 1 && slices.Contains(out, "X0") {
		r.fail(n, path, "X0 (no risk of corrosion or attack) does not go with other classes; give X0 alone or leave it out")
	}
	return out
}

var structuralText = regexp.MustCompile(`^\s*[sS]\s*([0-9]+)\s*$`)

// structuralClass reads a structural class of EN 1992-1-1 4.4.1.2(5): a whole number 1 to 6, or S1 to S6.
func (r *reader) structuralClass(n *yaml.Node, path string) (int, bool) {
	v := resolve(n)
	var x float64
	if m := structuralText.FindStringSubmatch(v.Value); v.Kind == yaml.ScalarNode && v.ShortTag() == "!!str" && m != nil {
		k, err := strconv.Atoi(m[1])
		if err != nil {
			k = math.MaxInt32
		}
		x = float64(k)
	} else {
		var ok bool
		if x, ok = r.number(n, path, ""); !ok {
			return 0, false
		}
	}
	if !whole(x) || x < StructuralClassMin || x > StructuralClassMax {
		r.fail(v, path, "the structural class must be a whole number from %d to %d (S%d to S%d, EN 1992-1-1 4.4.1.2(5)), found %s",
			StructuralClassMin, StructuralClassMax, StructuralClassMin, StructuralClassMax, show(x, ""))
		return 0, false
	}
	return int(x), true
}

var yearsText = regexp.MustCompile(`^\s*([-+]?[0-9]*\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\s*(?:y|yr|yrs|year|years)\s*$`)

// years reads a design working life in years: a number, a number with y, yr, yrs, year or
// years ("50 years"), or an expression over the vars that gives a pure number.
func (r *reader) years(n *yaml.Node, path string) (float64, bool) {
	v := resolve(n)
	var x float64
	if m := yearsText.FindStringSubmatch(v.Value); v.Kind == yaml.ScalarNode && v.ShortTag() == "!!str" && m != nil {
		var err error
		x, err = strconv.ParseFloat(m[1], 64)
		if err != nil || math.IsInf(x, 0) {
			r.fail(v, path, "%q is not a finite number of years", v.Value)
			return 0, false
		}
	} else if v.Kind == yaml.ScalarNode && v.ShortTag() == "!!str" {
		var err error
		x, err = r.env.Eval(v.Value, "")
		if errors.Is(err, quantity.ErrBadVar) {
			return 0, false
		}
		if err != nil {
			r.fail(v, path, "%s; give the design working life in years: 50 or \"50 years\"", err)
			return 0, false
		}
	} else {
		var ok bool
		if x, ok = r.number(n, path, ""); !ok {
			return 0, false
		}
	}
	if x < DesignLifeMin || x > DesignLifeMax {
		r.fail(v, path, "the design working life must lie between %d and %d years, found %s", DesignLifeMin, DesignLifeMax, show(x, ""))
		return 0, false
	}
	return x, true
}

// lengthWithin reads a length that must lie between lo and hi, mm; what names it in the message.
func (r *reader) lengthWithin(n *yaml.Node, path string, lo, hi float64, what string) (float64, bool) {
	v, ok := r.number(n, path, "mm")
	if !ok {
		return 0, false
	}
	if v < lo || v > hi {
		r.fail(n, path, "%s must lie between %s and %s, found %s", what, show(lo, ""), show(hi, "mm"), show(v, "mm"))
		return 0, false
	}
	return v, true
}

// fire reads the fire data of EN 1992-1-2 at n, keys not given keeping the values of base (nil
// for none: then the rating is required). The result is not nil.
func (r *reader) fire(n *yaml.Node, path string, base *model.Fire) *model.Fire {
	f := r.fields(n, path, fireKeys...)
	fi := r.fireFrom(f, n, path, base)
	return &fi
}

// Choices of method: how the fire resistance is verified.
var fireMethods = map[string]string{
	"a": model.FireMethodA, "method a": model.FireMethodA, // EN 1992-1-2 5.3.2, Method A, the default
	"elsewhere": model.FireElsewhere, // verified by another method, recorded with a note
}

// fireFrom reads rating, eta_fi, mu_fi, method and note from the fields f of the mapping at n
// over base. A note goes with method: elsewhere, which needs one; an inherited note is dropped
// where the entry switches the method back to Method A.
func (r *reader) fireFrom(f map[string]pair, n *yaml.Node, path string, base *model.Fire) model.Fire {
	var fi model.Fire
	if base != nil {
		fi = *base
	}
	if f == nil {
		return fi
	}
	if e, ok := f["rating"]; ok {
		if v, ok := r.rating(e.val, join(path, "rating")); ok {
			fi.Rating = v
		}
	} else if base == nil {
		r.fail(n, join(path, "rating"), "is required but missing (the standard fire resistance, e.g. rating: R90)")
	}
	if e, ok := f["eta_fi"]; ok {
		if v, ok := r.within(e.val, join(path, "eta_fi"), EtaFiMin, EtaFiMax, "the reduction factor ηfi (EN 1992-1-2 2.4.2)"); ok {
			fi.EtaFi = v
		}
	}
	if e, ok := f["mu_fi"]; ok {
		if v, ok := r.oneOf(e.val, join(path, "mu_fi"), muFiComputed, muFiEtaFi); ok {
			fi.UseMuFi = v == muFiComputed
		}
	}
	if e, ok := f["method"]; ok {
		if s, ok := r.str(e.val, join(path, "method")); ok {
			if m, known := fireMethods[strings.ToLower(strings.TrimSpace(s))]; known {
				fi.Method = m
			} else {
				r.fail(e.val, join(path, "method"), "%q is not a method of verifying the fire resistance (A: EN 1992-1-2 5.3.2 Method A, checked here, the default; elsewhere: verified by another method, recorded with a note)", s)
			}
		}
	}
	e, noteGiven := f["note"]
	noteRead := false // a note given and read as text
	if noteGiven {
		if s, ok := r.str(e.val, join(path, "note")); ok {
			noteRead = true
			if s = strings.TrimSpace(s); s == "" {
				r.fail(e.val, join(path, "note"), "is empty; say how and where the fire resistance was verified")
			} else {
				fi.Note = s
			}
		}
	}
	switch {
	case fi.Method == model.FireElsewhere && fi.Note == "" && !noteGiven:
		r.fail(n, join(path, "note"), "is required with method: elsewhere (how and where the fire resistance was verified, e.g. note: \"zone method, calc F-7\")")
	case fi.Method != model.FireElsewhere && noteRead:
		r.fail(e.val, join(path, "note"), "goes with method: elsewhere only (Method A, the default, is checked here)")
	case fi.Method != model.FireElsewhere:
		fi.Note = ""
	}
	return fi
}

var ratingText = regexp.MustCompile(`^R?\s*([0-9]+)(?:\s*MIN)?$`)

// rating reads a standard fire resistance: R30 to R240 or the same in minutes (90, "90 min");
// none gives 0, no fire check.
func (r *reader) rating(n *yaml.Node, path string) (int, bool) {
	v := resolve(n)
	tag := v.ShortTag()
	if v.Kind != yaml.ScalarNode || tag != "!!str" && tag != "!!int" {
		r.fail(v, path, "expected a standard fire resistance such as R90 or 90 (minutes), found %s", kindName(v))
		return 0, false
	}
	text := strings.ToUpper(strings.TrimSpace(v.Value))
	if text == "NONE" {
		return 0, true
	}
	if m := ratingText.FindStringSubmatch(text); m != nil {
		if k, err := strconv.Atoi(m[1]); err == nil {
			for _, s := range fireRatings {
				if k == s {
					return k, true
				}
			}
		}
	}
	names := make([]string, len(fireRatings))
	for i, s := range fireRatings {
		names[i] = "R" + strconv.Itoa(s)
	}
	r.fail(v, path, "%q is not a standard fire resistance of EN 1992-1-2 Table 5.2a (one of %s, or the same in minutes; none for no fire check)",
		v.Value, strings.Join(names, ", "))
	return 0, false
}

// fireLevels reads the fire data of some levels of the building over base, the data of
// design.fire; every entry names its levels, and no level is in two entries.
func (r *reader) fireLevels(s *site, n *yaml.Node, path string, base *model.Fire) []model.FireLevels {
	items, ok := r.list(n, path, "fire ratings by level")
	if !ok {
		return nil
	}
	var out []model.FireLevels
	owner := map[string]int{}
	keys := append([]string{"levels"}, fireKeys...)
	for i, it := range items {
		p := index(path, i)
		f := r.fields(it, p, keys...)
		if f == nil {
			continue
		}
		fl := model.FireLevels{Line: it.Line}
		if e, ok := f["levels"]; ok {
			fl.Levels, _ = r.levelRefs(s, e.val, join(p, "levels"))
			for _, l := range fl.Levels {
				if first, dup := owner[l]; dup {
					r.fail(e.val, join(p, "levels"), "level %s is given by %s and %s", l, index(path, first), p)
				} else {
					owner[l] = i
				}
			}
		} else {
			r.fail(it, join(p, "levels"), "is required but missing (the levels of this rating, e.g. levels: [L1, L2]; design.fire serves the others)")
		}
		fl.Fire = r.fireFrom(f, it, p, base)
		out = append(out, fl)
	}
	return out
}
