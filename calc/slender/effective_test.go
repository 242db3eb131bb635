package slender

import (
	"math"
	"testing"

	"colsheet/calc/trace"
)

// EN 1992-1-1:2004 5.8.3.2(3), Eq. (5.15): both ends rigid (k → 0) give 0.5·l, both free
// (k → ∞) give l; and the recommended minimum k = 0.1 gives about 0.59·l.
func TestEffectiveLengthLimits(t *testing.T) {
	l := trace.Const(3000, "l", "mm")
	cases := []struct {
		k1, k2, want float64
	}{
		{0, 0, 1500},
		{1e12, 1e12, 3000},
		{0, 1e12, 1500 * math.Sqrt(2)},
		{0.1, 0.1, 1500 * (1 + 0.1/0.55)},
	}
	for _, c := range cases {
		s := EffectiveLengthBraced("l0", l, q(c.k1), q(c.k2))
		near(t, "l0", s.Value, c.want, 1e-9)
		if err := trace.Recheck(s, 1e-9); err != nil {
			t.Error(err)
		}
	}
	// The minimum of the note: a stiff restraint is taken as k = 0.1.
	s := Flexibility("k", q(1), q(100))
	near(t, "k min", s.Value, 0.1, 1e-12)
	s = Flexibility("k", q(3), q(4))
	near(t, "k", s.Value, 0.75, 1e-12)
	if err := trace.Recheck(s, 1e-9); err != nil {
		t.Error(err)
	}
}
