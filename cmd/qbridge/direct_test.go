package main

import (
	"math"
	"testing"
)

// One direct value per q: ground (its table of direct values), resum and
// report print the same direct E_0 and alpha_S for the same q (one
// ladder and one T = 0 solve, each cached). At q = 4 they
// also agree with the published E_0 = -0.0406 J = -0.05746 script-J
// (MS 2016 arXiv:1604.07818; Garcia-Garcia-Verbaarschot arXiv:1610.03816;
// from memory, three digits) and alpha_S ~ 0.007 (MS 2016).
func TestOneDirectValue(t *testing.T) {
	g := runJSON(t, "ground", "--q", "4")
	e := runJSON(t, "resum", "E_0", "--q", "4", "--order", "4")
	a := runJSON(t, "resum", "alpha_S", "--q", "4", "--order", "4")
	dir := g["direct"].(map[string]any)
	ge, ga := parseDecimal(t, dir["E_0"]), parseDecimal(t, dir["alpha_S"])
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

// One direct value per q across commands and units: ground, resum, table
// --method direct and report print the same decimal string for the direct
// E_0 and alpha_S at q = 4 (the one ground ladder, one cache), and resum,
// table and report the same alpha_G and alpha_K (the one zero-temperature
// route). In J units every document says so ("units": "J = 1") and the
// values are the script-J ones times sqrt(4/8) (E_0) or sqrt(8/4) (the
// soft-mode coefficients), script-J^2 = q J^2/2^(q-1) (PHYSICS.md sec. 1);
// ground and resum still agree digit for digit. alpha_K(4) also agrees
// with the published 2.852 (MS 2016 arXiv:1604.07818; from memory).
func TestOneDirectValueEverywhere(t *testing.T) {
	for _, units := range []string{"script-J", "J"} {
		u := []string{"--units", units}
		g := runJSON(t, append([]string{"ground", "--q", "4"}, u...)...)
		tab := runJSON(t, append([]string{"table", "E_0,alpha_S,alpha_G,alpha_K", "--q", "4", "--method", "direct", "--no-cache"}, u...)...)
		rep := runJSON(t, append([]string{"report", "--q", "4", "--order", "4"}, u...)...)
		row := tab["results"].([]any)[0].(map[string]any)
		reported := map[string]string{}
		for _, r := range rep["rows"].([]any) {
			m := r.(map[string]any)
			reported[m["quantity"].(string)] = m["reference"].(string)
		}
		for _, doc := range []map[string]any{g, tab, rep} {
			if doc["units"] != units+" = 1" {
				t.Errorf("--units %s: document says units %v", units, doc["units"])
			}
		}
		for _, name := range []string{"E_0", "alpha_S", "alpha_G", "alpha_K"} {
			r := runJSON(t, append([]string{"resum", name, "--q", "4", "--order", "4"}, u...)...)
			vals := map[string]string{
				"resum":  r["reference"].(string),
				"table":  row[name].(map[string]any)["value"].(string),
				"report": reported[name],
			}
			if name == "E_0" || name == "alpha_S" {
				vals["ground"] = g["direct"].(map[string]any)[name].(string)
			}
			for where, v := range vals {
				if v != vals["resum"] {
					t.Errorf("--units %s: direct %s: %s prints %s, resum %s", units, name, where, v, vals["resum"])
				}
			}
			if r["reference_kind"] != "direct" {
				t.Errorf("%s reference kind %v", name, r["reference_kind"])
			}
		}
	}
	// The J values are the script-J ones converted.
	s := runJSON(t, "resum", "alpha_K", "--q", "4", "--order", "4")
	j := runJSON(t, "resum", "alpha_K", "--q", "4", "--order", "4", "--units", "J")
	sv, jv := parseDecimal(t, s["reference"]), parseDecimal(t, j["reference"])
	if math.Abs(jv-sv*math.Sqrt2) > 1e-14*jv {
		t.Errorf("alpha_K(4): %v script-J units, %v J units; want the factor sqrt(2)", sv, jv)
	}
	if math.Abs(sv-2.852) > 0.0006 {
		t.Errorf("alpha_K(4) = %v, published ~2.852", sv)
	}
	ge := runJSON(t, "ground", "--q", "4", "--units", "J")
	if e := parseDecimal(t, ge["E_0"]); math.Abs(e+0.0406) > 0.0001 {
		t.Errorf("E_0(4) = %v J, published -0.0406 J", e)
	}
}
