package actions

import (
	"strings"

	"colsheet/calc/trace"
)

// A0 is the reference area of the reduction factor αA, 10 m² in mm², EN 1991-1-1:2002 6.3.1.2(10), Eq. (6.1).
const A0 = 10e6

// reducible reports whether the imposed-load reductions of EN 1991-1-1:2002 6.3.1.2(10) and (11)
// apply to a category: A to D.
func reducible(cat string) bool {
	switch cat {
	case "A", "B", "C", "D":
		return true
	}
	return false
}

const noReduction = "EN 1991-1-1 6.3.1.2(10) and (11) reduce imposed loads of categories A to D only: no reduction for "

// AlphaA returns the reduction factor for the loaded area A (mm²), αA = 5/7·ψ0 + A0/A ≤ 1.0,
// at least 0.6 for categories C and D, EN 1991-1-1:2002 6.3.1.2(10), Eq. (6.1); 1 outside categories A to D.
func AlphaA(id, category string, psi0, area trace.Q) trace.Step {
	const title = "Reduction factor of the imposed load for the loaded area"
	const clause = en1991 + "6.3.1.2(10), Eq. (6.1)"
	cat := canon(category)
	if !reducible(cat) {
		return trace.Input(id, title, en1991+"6.3.1.2(10)", "α_A", "", 1).Note(noReduction + catLabel(cat) + ".")
	}
	if !(area.V > 0) {
		return trace.Input(id, title, en1991+"6.3.1.2(10)", "α_A", "", 1).Caution("The loaded area is not positive: no reduction.")
	}
	a0 := trace.Const(A0, "A_0", "mm2")
	args := []trace.Arg{trace.A("psi_0", psi0), trace.A("A_0", a0), trace.A("A", area)}
	v := min(5.0/7.0*psi0.V+A0/area.V, 1.0)
	if cat == "C" || cat == "D" {
		v = max(v, 0.6)
		return trace.Formula(id, title, clause, "α_A", "", v, "max(min(5 / 7 * psi_0 + A_0 / A, 1.0), 0.6)", args...).
			Note("Categories C and D: αA is not taken below 0.6.")
	}
	return trace.Formula(id, title, clause, "α_A", "", v, "min(5 / 7 * psi_0 + A_0 / A, 1.0)", args...)
}

// AlphaN returns the reduction factor for n storeys of the same category above the loaded
// member, αn = (2 + (n − 2)·ψ0)/n for n > 2 and 1 for n ≤ 2, EN 1991-1-1:2002 6.3.1.2(11), Eq. (6.2);
// 1 outside categories A to D.
func AlphaN(id, category string, psi0, n trace.Q) trace.Step {
	const title = "Reduction factor of the imposed load for the number of storeys"
	cat := canon(category)
	if !reducible(cat) {
		return trace.Input(id, title, en1991+"6.3.1.2(11)", "α_n", "", 1).Note(noReduction + catLabel(cat) + ".")
	}
	if !(n.V > 2) {
		return trace.Input(id, title, en1991+"6.3.1.2(11)", "α_n", "", 1).Note("Not more than two storeys of the category above: no reduction.")
	}
	return trace.Formula(id, title, en1991+"6.3.1.2(11), Eq. (6.2)", "α_n", "", (2+(n.V-2)*psi0.V)/n.V,
		"(2 + (n - 2) * psi_0) / n", trace.A("psi_0", psi0), trace.A("n", n)).
		Note("Where the reduced load accompanies another action, ψ and αn are not applied together (EN 1991-1-1:2002 3.3.1(2)P).")
}

// Reduced returns the imposed load multiplied by a reduction factor αA or αn, EN 1991-1-1:2002 6.3.1.2(10), (11).
func Reduced(id string, alpha, q trace.Q) trace.Step {
	sym := q.Symbol + "_red"
	if strings.Contains(q.Symbol, "_") {
		sym = q.Symbol + ",red"
	}
	return trace.Formula(id, "Reduced imposed load", en1991+"6.3.1.2(10), (11)", sym, q.Unit, alpha.V*q.V,
		"alpha * Q_k", trace.A("alpha", alpha), trace.A("Q_k", q))
}

// TributaryArea returns the floor area carried by a column, A = (Lx1 + Lx2)/2 · (Ly1 + Ly2)/2,
// from the bays either side of it in x and y (0 where there is none), mm²; common practice.
func TributaryArea(id string, lx1, lx2, ly1, ly2 trace.Q) trace.Step {
	return trace.Formula(id, "Tributary floor area of the column", "common practice", "A", "mm2",
		(lx1.V+lx2.V)/2*((ly1.V+ly2.V)/2), "(L_x1 + L_x2) / 2 * ((L_y1 + L_y2) / 2)",
		trace.A("L_x1", lx1), trace.A("L_x2", lx2), trace.A("L_y1", ly1), trace.A("L_y2", ly2))
}
