package main

import (
	"math"
	"math/big"
	"strings"
	"testing"
)

// The coefficients printed without --q, evaluated at q = 4, are the ones
// printed with --q 4; and at q = 2 they are the semicircle's (PHYSICS.md
// sec. 5: log Z = (1/2) int rho log(2 cosh(beta E/2)), whose beta^2..beta^6
// terms 1/16, -1/192, 1/1152 follow from the Catalan moments 1, 2, 5 and
// log cosh x = x^2/2 - x^4/12 + x^6/45).
func TestHightempSymbolicMatchesAtQ(t *testing.T) {
	sym := runJSON(t, "hightemp", "logz", "--order", "6")
	at := runJSON(t, "hightemp", "logz", "--order", "6", "--q", "4,2")
	results := at["results"].([]any)
	semicircle := []string{"1/16", "-1/192", "1/1152"}
	for i, c := range sym["coefficients"].([]any) {
		cm := c.(map[string]any)
		if cm["power"] == "0" {
			if cm["constant"] != "(1/2) log 2" {
				t.Errorf("constant term %v", cm)
			}
			continue
		}
		poly := new(big.Rat)
		for _, term := range cm["inverse_q_terms"].([]any) {
			tm := term.(map[string]any)
			c, _ := new(big.Rat).SetString(tm["numerator"].(string) + "/" + tm["denominator"].(string))
			j := int(parseDecimal(t, tm["inverse_q_power"]))
			poly.Add(poly, c.Mul(c, new(big.Rat).SetFrac64(1, int64(math.Pow(4, float64(j))))))
		}
		got := results[0].(map[string]any)["coefficients"].([]any)[i].(map[string]any)
		want, _ := new(big.Rat).SetString(got["numerator"].(string) + "/" + got["denominator"].(string))
		if poly.Cmp(want) != 0 {
			t.Errorf("power %v: symbolic at q = 4 gives %s, --q 4 gives %s", cm["power"], poly.RatString(), want.RatString())
		}
		if k := i - 1; k < len(semicircle) {
			g := results[1].(map[string]any)["coefficients"].([]any)[i].(map[string]any)
			if s := g["numerator"].(string) + "/" + g["denominator"].(string); s != semicircle[k] {
				t.Errorf("q = 2, power %v: %s, semicircle %s", cm["power"], s, semicircle[k])
			}
		}
	}
}

// Summed at q = 4, beta = 1 the series agrees with qbridge solve (the
// direct Schwinger-Dyson solver) within the solver's error, and states
// where it stops converging.
func TestHightempSumAgreesWithSolve(t *testing.T) {
	if testing.Short() {
		t.Skip("direct solve")
	}
	ht := runJSON(t, "hightemp", "logz", "--order", "30", "--q", "4", "--beta", "1")
	sums := ht["sums"].([]any)
	pade := sums[1].(map[string]any)
	v := parseDecimal(t, pade["value"])
	e := parseDecimal(t, pade["value_error"])
	sol := runJSON(t, "solve", "--q", "4", "--beta", "1")
	d := parseDecimal(t, sol["logZ"])
	de := parseDecimal(t, sol["logZ_error"])
	if math.Abs(v-d) > e+de || math.Abs(v-d) > 1e-10 {
		t.Errorf("hightemp %.15g +- %.2g, solve %.15g +- %.2g", v, e, d, de)
	}
	if b := parseDecimal(t, ht["beta_max"]); !(b > 1.3 && b < 1.6) {
		t.Errorf("beta_max = %g", b)
	}
	checkErrors(t, "hightemp --beta", "", ht)
}

// Every format prints the exact coefficients: heat's beta^2 term is
// 2 a_1 = 1/(2 q^2) (a_1 = 1/(4 q^2), PHYSICS.md sec. 5), and at q = 9/2
// kappa_2/N = 2! a_1 = 2/81.
func TestHightempFormats(t *testing.T) {
	cases := []struct {
		args []string
		want map[string]string // format -> text that must appear
	}{
		{[]string{"hightemp", "heat", "--order", "5"}, map[string]string{"text": "1/(2*q^2)", "csv": "1/(2*q^2)", "tex": `$\frac{1}{2 q^{2}}$`}},
		{[]string{"hightemp", "cumulants", "--order", "9", "--q", "9/2"}, map[string]string{"text": "2/81", "csv": "2,2/81,", "tex": `$\frac{2}{81}$`}},
	}
	for _, c := range cases {
		for f, want := range c.want {
			out, err := runCLI(t, append(c.args, "--format", f)...)
			if err != nil {
				t.Fatalf("%v %s: %v", c.args, f, err)
			}
			if !strings.Contains(out, want) {
				t.Errorf("%v --format %s: no %q in\n%s", c.args, f, want, out)
			}
		}
	}
	// J units: kappa_2/N = 1/(2 q^2) script-J^2 = 1/(2 q^2) (q/2^(q-1)) J^2 = 1/64 at q = 4
	m := runJSON(t, "hightemp", "cumulants", "--order", "2", "--q", "4", "--units", "J")
	c := m["coefficients"].([]any)[0].(map[string]any)
	if c["numerator"] != "1" || c["denominator"] != "64" {
		t.Errorf("kappa_2/N in J units at q = 4: %v/%v, want 1/64", c["numerator"], c["denominator"])
	}
}

// In J units the energy is E/J = (E/script-J) r at beta script-J =
// beta J r, r = sqrt(q/2^(q-1)) (PHYSICS.md sec. 1): at q = 4, r = 1/sqrt 2,
// so E/J at beta J = sqrt 2 is E/script-J at beta script-J = 1 over sqrt 2,
// to 30 digits; and the beta coefficient is -2 a_1 r^2 = -1/64.
func TestHightempEnergyInJUnits(t *testing.T) {
	const sqrt2 = "1.41421356237309504880168872420969807856967187537694"
	j := runJSON(t, "hightemp", "energy", "--order", "30", "--q", "4", "--units", "J", "--beta", sqrt2, "--digits", "30")
	s := runJSON(t, "hightemp", "energy", "--order", "30", "--q", "4", "--beta", "1", "--digits", "30")
	c := j["coefficients"].([]any)[0].(map[string]any)
	if c["numerator"] != "-1" || c["denominator"] != "64" {
		t.Errorf("energy_1 in J units at q = 4: %v/%v, want -1/64", c["numerator"], c["denominator"])
	}
	pick := func(m map[string]any) (v, e *big.Float) {
		p := m["sums"].([]any)[1].(map[string]any)
		v, _, err := big.ParseFloat(p["value"].(string), 10, 200, big.ToNearestEven)
		if err != nil {
			t.Fatal(err)
		}
		e, _, err = big.ParseFloat(p["value_error"].(string), 10, 200, big.ToNearestEven)
		if err != nil {
			t.Fatal(err)
		}
		return v, e
	}
	vj, ej := pick(j)
	vs, es := pick(s)
	r, _, _ := big.ParseFloat(sqrt2, 10, 200, big.ToNearestEven)
	want := new(big.Float).SetPrec(200).Quo(vs, r)
	d := new(big.Float).Sub(vj, want)
	d.Abs(d)
	bound := new(big.Float).Add(ej, new(big.Float).Quo(es, r))
	bound.Add(bound, big.NewFloat(1e-29)) // the 30 printed digits
	if d.Cmp(bound) > 0 || d.Cmp(big.NewFloat(1e-25)) > 0 {
		t.Errorf("E/J = %s +- %s, E/script-J / sqrt 2 = %s: differ by %.3g", vj.Text('g', 30), ej.Text('e', 2), want.Text('g', 30), d)
	}
}
