package actions

import (
	"strings"
	"testing"

	"colsheet/calc/code"
)

// A catalogue parameter's step title names no unit: the sheets show the value in their own
// unit (the weight density of EN 1991-1-1:2002 Table A.1 in kN/m³, not the catalogue's N/mm³).
// An override's caution names the unit of the recommended value it quotes.
func TestParamStepTitleWithoutUnit(t *testing.T) {
	p := code.Recommended()
	for _, c := range []struct{ name, unit, title string }{
		{"density_rc", "N/mm3", "Weight density of reinforced concrete"},
		{"Es", "MPa", "Design modulus of elasticity of reinforcing steel"},
		{"gamma_G", "", "Partial factor for permanent actions, unfavourable"},
	} {
		if s := ParamStep("p", p, c.name, c.unit); s.Title != c.title {
			t.Errorf("%s: title %q, want %q", c.name, s.Title, c.title)
		}
	}
	q, err := p.Override("density_rc", 2.4e-5)
	if err != nil {
		t.Fatal(err)
	}
	s := ParamStep("p", q, "density_rc", "N/mm3")
	if len(s.Cautions()) != 1 || !strings.Contains(s.Cautions()[0], "2.5e-05 N/mm³") {
		t.Errorf("override caution %q", s.Cautions())
	}
}
