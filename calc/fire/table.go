package fire

import "math"

// ratings are the standard fire resistances of the rows of Table 5.2a, in minutes.
var ratings = [6]int{30, 60, 90, 120, 180, 240}

// muColumns are the degrees of utilisation μfi of the columns of Table 5.2a for columns exposed
// on more than one side.
var muColumns = [3]float64{0.2, 0.5, 0.7}

// alt is one alternative bmin/a of a cell of Table 5.2a.
type alt struct {
	b, a  float64 // least column width and axis distance, mm
	eight bool    // at least 8 bars (the table's double asterisk)
}

// table52a holds Table 5.2a for columns exposed on more than one side: rows R30 to R240, columns
// μfi = 0.2, 0.5 and 0.7; a nil cell needs a width above 600 mm and an assessment of buckling.
var table52a = [6][3][]alt{
	{{{200, 25, false}}, {{200, 25, false}}, {{200, 32, false}, {300, 27, false}}},
	{{{200, 25, false}}, {{200, 36, false}, {300, 31, false}}, {{250, 46, false}, {350, 40, false}}},
	{{{200, 31, false}, {300, 25, false}}, {{300, 45, false}, {400, 38, false}}, {{350, 53, false}, {450, 40, true}}},
	{{{250, 40, false}, {350, 35, false}}, {{350, 45, true}, {450, 40, true}}, {{350, 57, true}, {450, 51, true}}},
	{{{350, 45, true}}, {{350, 63, true}}, {{450, 70, true}}},
	{{{350, 61, true}}, {{450, 75, true}}, nil},
}

// lookup is where a rating and μfi fall in Table 5.2a.
type lookup struct {
	row      int     // index of the row used: the rating's, or the next higher
	exact    bool    // the rating is a row of the table
	k1, k2   int     // the two μfi columns interpolated between
	t        float64 // weight of column k2, within [0, 1]
	covered  bool    // the table gives values for the rating and μfi
	belowMin bool    // μfi below the first column: the first column is used
}

func locate(rating int, mu float64) lookup {
	lk := lookup{row: len(ratings) - 1, covered: true}
	found := false
	for i, r := range ratings {
		if r >= rating {
			lk.row, lk.exact, found = i, r == rating, true
			break
		}
	}
	if !found {
		lk.covered = false
	}
	lk.k1, lk.k2 = 0, 1
	if mu > muColumns[1] && table52a[lk.row][2] != nil {
		lk.k1, lk.k2 = 1, 2
	}
	if mu > muColumns[lk.k2] {
		lk.covered = false
	}
	lk.belowMin = mu < muColumns[0]
	lk.t = weight(mu, muColumns[lk.k1], muColumns[lk.k2])
	return lk
}

// weight returns the clamped linear-interpolation weight of x between x1 and x2.
func weight(x, x1, x2 float64) float64 { return math.Min(math.Max((x-x1)/(x2-x1), 0), 1) }

// pair returns the i-th alternative (0 or 1) of a cell; a cell with one alternative gives it twice.
func pair(cell []alt, i int) alt {
	if i >= len(cell) {
		return cell[len(cell)-1]
	}
	return cell[i]
}

// ends returns the i-th alternative of the two columns interpolated between.
func (lk lookup) ends(i int) (alt, alt) {
	r := table52a[lk.row]
	return pair(r[lk.k1], i), pair(r[lk.k2], i)
}

// eight reports whether the i-th alternative needs at least 8 bars in a column with weight.
func (lk lookup) eight(i int) bool {
	x1, x2 := lk.ends(i)
	return (lk.t < 1 && x1.eight) || (lk.t > 0 && x2.eight)
}

// AlternativeValue returns the width and axis distance of the i-th alternative (0 or 1) of the
// rating's row of Table 5.2a, interpolated linearly at μfi; see Alternative.
func AlternativeValue(rating int, mu float64, i int) (b, a float64) {
	lk := locate(rating, mu)
	x1, x2 := lk.ends(i)
	return x1.b + (x2.b-x1.b)*lk.t, x1.a + (x2.a-x1.a)*lk.t
}

// CoveredValue reports whether Table 5.2a gives values for the rating and μfi; see Alternative.
func CoveredValue(rating int, mu float64) bool { return locate(rating, mu).covered }

// RequiredAxisValue returns the axis distance needed at the least width b, interpolated linearly
// between the alternatives (b1, a1) and (b2, a2) and constant outside them; see RequiredAxis.
func RequiredAxisValue(b, b1, a1, b2, a2 float64) float64 {
	return a1 + (a2-a1)*math.Min(math.Max((b-b1)/math.Max(b2-b1, 1e-3), 0), 1)
}

// MinBarsValue returns the least number of bars Table 5.2a asks for at the rating, μfi and least
// width b: 8 where an alternative used carries the double asterisk, 4 otherwise; see MinBars.
func MinBarsValue(rating int, mu, b float64) int {
	lk := locate(rating, mu)
	b1, _ := AlternativeValue(rating, mu, 0)
	if lk.eight(0) || (b > b1 && lk.eight(1)) {
		return 8
	}
	return 4
}
