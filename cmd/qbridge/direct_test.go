package main

import (
	"math"
	"testing"
)

// One direct value per q: ground, resum and report print the same direct
// E_0 and alpha_S for the same q (one ladder, one cache). At q = 4 they
// also agree with the published E_0 = -0.0406 J = -0.05746 script-J
// (MS 2016 arXiv:1604.07818; Garcia-Garcia-Verbaarschot arXiv:1610.03816;
// from memory, three digits) and alpha_S ~ 0.007 (MS 2016).
func TestOneDirectValue(t *testing.T) {
	g := runJSON(t, "ground", "--q", "4")
	e := runJSON(t, "resum", "E_0", "--q", "4", "--order", "4")
	a := runJSON(t, "resum", "alpha_S", "--q", "4", "--order", "4")
	ge, ga := parseDecimal(t, g["E_0"]), parseDecimal(t, g["alpha_S"])
	re, ra := parseDecimal(t, e["reference"]), parseDecimal(t, a["reference"])
	if math.Abs(ge-re) > 1e-14*math.Abs(ge) || math.Abs(ga-ra) > 1e-13*math.Abs(ga) {
		t.Errorf("ground E_0 %v alpha_S %v; resum references %v %v", ge, ga, re, ra)
	}
	if e["reference_kind"] != "direct" {
		t.Errorf("E_0 reference kind %v", e["reference_kind"])
	}
	if math.Abs(ge+0.05746) > 0.00001 || math.Abs(ga-0.007) > 0.0005 {
		t.Errorf("q = 4: E_0 %v alpha_S %v against the published -0.05746, 0.007", ge, ga)
	}
}
