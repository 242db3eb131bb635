package input

import (
	"errors"
	"strings"

	"colsheet/calc/model"
	"colsheet/calc/quantity"

	"gopkg.in/yaml.v3"
)

// Limits of the rules of practice for the choice of bars.
const (
	MaxVibratorGap = 150 // mm, the largest vibrator gap accepted
	MaxLabour      = 100 // kg of steel, the largest labour term accepted
	MaxCosted      = 100 // most passing patterns costed
	MaxTolerance   = 100 // %, the largest tolerance of the typical-pattern pass
)

// selection reads design.selection: the rules of practice the designed bars keep to and the
// labour terms of their cost, over the defaults of model.DefaultSelection.
func (r *reader) selection(n *yaml.Node, path string, s *model.Selection) {
	f := r.fields(n, path, "least_bar", "least_bar_wide", "wide_from", "vibrator_gap", "labour_per_bar", "labour_per_tie", "costed")
	if f == nil {
		return
	}
	for key, at := range map[string]*float64{"least_bar": &s.LeastBar, "least_bar_wide": &s.LeastBarWide, "wide_from": &s.WideFrom} {
		if e, ok := f[key]; ok {
			if v, ok := r.positive(e.val, join(path, key), "mm"); ok {
				*at = v
			}
		}
	}
	if e, ok := f["vibrator_gap"]; ok {
		if v, ok := r.number(e.val, join(path, "vibrator_gap"), "mm"); ok {
			if v < 0 || v > MaxVibratorGap {
				r.fail(e.val, join(path, "vibrator_gap"), "the clear gap for a poker vibrator must lie between 0 and %d mm (0: no such gap asked), found %s", MaxVibratorGap, show(v, "mm"))
			} else {
				s.VibratorGap = v
			}
		}
	}
	for key, at := range map[string]*float64{"labour_per_bar": &s.LabourBar, "labour_per_tie": &s.LabourTie} {
		if e, ok := f[key]; ok {
			if v, ok := r.within(e.val, join(path, key), 0, MaxLabour, "the labour term in kilograms of steel"); ok {
				*at = v
			}
		}
	}
	if e, ok := f["costed"]; ok {
		if v, ok := r.number(e.val, join(path, "costed"), ""); ok {
			if !whole(v) || v < 2 || v > MaxCosted {
				r.fail(e.val, join(path, "costed"), "the number of passing patterns costed must be a whole number from 2 to %d, found %s", MaxCosted, show(v, ""))
			} else {
				s.Costed = int(v)
			}
		}
	}
	if s.LeastBar > s.LeastBarWide {
		at := n
		if e, ok := f["least_bar"]; ok {
			at = e.val
		}
		r.fail(at, join(path, "least_bar"), "least_bar = %s is greater than least_bar_wide = %s", show(s.LeastBar, "mm"), show(s.LeastBarWide, "mm"))
	}
}

// typical reads design.typical: {on: true, tolerance: 10%} over model.DefaultTypical.
func (r *reader) typical(n *yaml.Node, path string, t *model.Typical) {
	f := r.fields(n, path, "on", "tolerance")
	if f == nil {
		return
	}
	if e, ok := f["on"]; ok {
		if b, ok := r.boolean(e.val, join(path, "on")); ok {
			t.On = b
		}
	}
	if e, ok := f["tolerance"]; ok {
		if v, ok := r.percent(e.val, join(path, "tolerance")); ok {
			if v < 0 || v > MaxTolerance {
				r.fail(e.val, join(path, "tolerance"), "the tolerance must lie between 0 and %d %%, found %s %%", MaxTolerance, show(v, ""))
			} else {
				t.Tolerance = v / 100
			}
		}
	}
}

// percent reads a percentage: a plain number (10) or a text with the sign ("10 %").
func (r *reader) percent(n *yaml.Node, path string) (float64, bool) {
	t := resolve(n)
	if t.Kind == yaml.ScalarNode && t.ShortTag() == "!!str" && strings.HasSuffix(strings.TrimSpace(t.Value), "%") {
		x, err := r.env.Eval(strings.TrimSuffix(strings.TrimSpace(t.Value), "%"), "")
		if errors.Is(err, quantity.ErrBadVar) {
			return 0, false
		}
		if err != nil {
			r.fail(t, path, "%q: give a percentage, e.g. 10 or \"10 %%\"", t.Value)
			return 0, false
		}
		return x, true
	}
	return r.number(n, path, "")
}
