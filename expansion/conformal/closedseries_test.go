package conformal

import (
	"math/big"
	"os/exec"
	"strings"
	"testing"

	"qbridge/series/scalar"
)

// checkCoefficients compares each coefficient with its exact value: the
// difference must lie within the stated error (and the error must be
// small: below tol relative to max(|exact|, 1)).
func checkCoefficients(t *testing.T, name string, c *Coefficients, want []*big.Float, tol float64) {
	t.Helper()
	if len(c.Values) < len(want) {
		t.Fatalf("%s: %d coefficients, want at least %d", name, len(c.Values), len(want))
	}
	for k, w := range want {
		d := new(big.Float).SetPrec(400).Sub(c.Values[k], w)
		d.Abs(d)
		if d.Cmp(c.Errors[k]) > 0 {
			t.Errorf("%s k=%d: %s, exact %s: difference %s exceeds the stated error %s", name, k,
				c.Values[k].Text('g', 25), w.Text('g', 25), d.Text('e', 2), c.Errors[k].Text('e', 2))
		}
		if r := relDiff(c.Values[k], w); r > tol {
			t.Errorf("%s k=%d: relative difference %.1e above %.0e", name, k, r, tol)
		}
		if c.Errors[k].Sign() <= 0 {
			t.Errorf("%s k=%d: error %s is not positive", name, k, c.Errors[k].Text('e', 2))
		}
	}
}

func forms(t *testing.T, fs ...[]formTerm) []*big.Float {
	t.Helper()
	out := make([]*big.Float, len(fs))
	for i, f := range fs {
		out[i] = formValue(t, f, 400)
	}
	return out
}

// r is the term num/den * pi^(2 pi2).
func r(num, den int64, pi2 int) []formTerm { return []formTerm{{num, den, pi2, 0, 0}} }

// S_0 around q = infinity, in x = 1/q. From S_0 = log(2)/2 - int_0^x pi
// (1/2 - y) tan(pi y) dy (MS 2016 arXiv:1604.07818 sec. 2.6; PHYSICS.md
// sec. 4) and tan z = sum_n T_n z^(2n-1) with T_n = 2^(2n) (2^(2n) - 1)
// |B_2n|/(2n)! (DLMF 4.19.3, equation number from memory; B_2, B_4, B_6, B_8 = 1/6, -1/30, 1/42, -1/30,
// DLMF table 24.2.1; so T = 1, 1/3, 2/15, 17/315):
//
//	S_0 = log(2)/2 - sum_n T_n pi^(2n) [x^(2n)/(4n) - x^(2n+1)/(2n+1)],
//
// c_2n = -T_n pi^(2n)/(4n), c_(2n+1) = T_n pi^(2n)/(2n+1). The x^2 term
// -pi^2/4 is MS 2016's S_0 = log(2)/2 - pi^2/(4 q^2) + O(1/q^3).
//
// Around q = 2, in eps = 1 - 2/q: S_0 = int_0^(eps/2) pi u cot(pi u) du and
// z cot z = sum_n (-1)^n 2^(2n) B_2n z^(2n)/(2n)! (DLMF 4.19.6), so
// c_(2n+1) = -|B_2n| pi^(2n)/(2 (2n+1)!) for n >= 1, c_1 = 1/2, even ones 0.
func TestS0SeriesExact(t *testing.T) {
	inf, err := S0Series(AroundInf, 9, 30)
	if err != nil {
		t.Fatal(err)
	}
	l2half := []formTerm{{1, 2, 0, 0, 1}}
	checkCoefficients(t, "S_0 around inf", inf, forms(t, l2half, r(0, 1, 0),
		r(-1, 4, 1), r(1, 3, 1), r(-1, 24, 2), r(1, 15, 2),
		r(-1, 90, 3), r(2, 105, 3), r(-17, 5040, 4), r(17, 2835, 4)), 1e-30)
	two, err := S0Series(AroundTwo, 9, 30)
	if err != nil {
		t.Fatal(err)
	}
	z := r(0, 1, 0)
	checkCoefficients(t, "S_0 around 2", two, forms(t, z, r(1, 2, 0), z, r(-1, 72, 1), z,
		r(-1, 7200, 2), z, r(-1, 423360, 3), z, r(-1, 21772800, 4)), 1e-30)
	if two.Quantity != "S_0" || two.End != AroundTwo || two.N != -1 || !strings.Contains(two.Method, "bits") {
		t.Errorf("S_0 series labels: %q %v %d %q", two.Quantity, two.End, two.N, two.Method)
	}
	// The radius of convergence: the nearest singularity of tan(pi x) is at
	// x = 1/2 (q = 2), that of pi u cot(pi u) at u = 1, eps = 2.
	if inf.Radius == nil {
		t.Error("S_0 around inf: no radius estimate")
	}
	// S0Taylor is the same series without error estimates.
	s, err := S0Taylor(AroundInf, 9, 200)
	if err != nil {
		t.Fatal(err)
	}
	for k := 0; k < s.Len(); k++ {
		if relDiff(s.Coeff(k), inf.Values[k]) > 1e-50 {
			t.Errorf("S0Taylor k=%d: %s, S0Series %s", k, s.Coeff(k).Text('g', 20), inf.Values[k].Text('g', 20))
		}
	}
}

// b^q around both ends, from b^q pi = (1/2 - 1/q) tan(pi/q) (MS 2016,
// arXiv:1604.07818; PHYSICS.md sec. 4).
//
// Around q = 2: b^q = z cot z/pi^2 with z = pi eps/2, and by DLMF 4.19.6
// the eps^(2n) coefficient is -|B_2n| pi^(2n-2)/(2n)! (n >= 1; 1/pi^2 at
// n = 0): 1/pi^2, -1/12, -pi^2/720, -pi^4/30240, -pi^6/1209600.
//
// Around q = infinity: b^q = x (1/2 - x) tan(pi x)/(pi x), so with the T_n
// of TestS0SeriesExact the x^(2n-1) coefficient is T_n pi^(2n-2)/2 and the
// x^(2n) one -T_n pi^(2n-2). The analytic part R(x) = log(b)/x - log(x) =
// log(1/2) + log(1 - 2x) + log(tan(pi x)/(pi x)), with log(tan z/z) =
// z^2/3 + 7 z^4/90 + 62 z^6/2835 + O(z^8) (the log of DLMF 4.19.3 divided by
// z, expanded here by hand).
func TestBSeriesExact(t *testing.T) {
	two, inf, err := TwoEndSeries(QuantityB, 0, 8, 30)
	if err != nil {
		t.Fatal(err)
	}
	z := r(0, 1, 0)
	checkCoefficients(t, "b^q around 2", two, forms(t, r(1, 1, -1), z, r(-1, 12, 0), z, r(-1, 720, 1), z,
		r(-1, 30240, 2), z, r(-1, 1209600, 3)), 1e-30)
	wantInf := forms(t, z, r(1, 2, 0), r(-1, 1, 0), r(1, 6, 1), r(-1, 3, 1), r(1, 15, 2), r(-2, 15, 2),
		r(17, 630, 3), r(-17, 315, 3))
	checkCoefficients(t, "b^q around inf", inf, wantInf, 1e-30)

	parts, err := BSeries(AroundInf, 6, 30)
	if err != nil {
		t.Fatal(err)
	}
	if len(parts) != 2 || parts[0].Quantity != "b^q" {
		t.Fatalf("BSeries around inf: %d parts", len(parts))
	}
	checkCoefficients(t, "BSeries b^q around inf", parts[0], wantInf[:7], 1e-30)
	checkCoefficients(t, "R(x) around inf", parts[1], forms(t,
		[]formTerm{{-1, 1, 0, 0, 1}}, r(-2, 1, 0), []formTerm{{-2, 1, 0, 0, 0}, {1, 3, 1, 0, 0}},
		r(-8, 3, 0), []formTerm{{-4, 1, 0, 0, 0}, {7, 90, 2, 0, 0}}, r(-32, 5, 0),
		[]formTerm{{-32, 3, 0, 0, 0}, {62, 2835, 3, 0, 0}}), 1e-30)
}

// b itself around q = 2. By hand: log b = ((1 - eps)/2) log(b^q) and
// log(b^q) = -2 log(pi) - pi^2 eps^2/12 + O(eps^4) (TestBSeriesExact), so
// b = (1/pi) exp(eps L - pi^2 eps^2/24 + pi^2 eps^3/24 + O(eps^4)) with
// L = log(pi): b_0 = 1/pi, b_1 = L/pi, b_2 = (L^2/2 - pi^2/24)/pi,
// b_3 = (L^3/6 - L pi^2/24 + pi^2/24)/pi.
func TestBSeriesAroundTwo(t *testing.T) {
	cs, err := BSeries(AroundTwo, 6, 30)
	if err != nil {
		t.Fatal(err)
	}
	if len(cs) != 1 || cs[0].Quantity != "b" {
		t.Fatalf("BSeries around 2: %d parts", len(cs))
	}
	c := cs[0]
	const prec = 400
	pi := scalar.Pi(prec)
	L, err := scalar.BigLog(pi, prec)
	if err != nil {
		t.Fatal(err)
	}
	f := func(x float64) *big.Float { return new(big.Float).SetPrec(prec).SetFloat64(x) }
	mul := func(xs ...*big.Float) *big.Float {
		v := f(1)
		for _, x := range xs {
			v.Mul(v, x)
		}
		return v
	}
	add := func(xs ...*big.Float) *big.Float {
		v := f(0)
		for _, x := range xs {
			v.Add(v, x)
		}
		return v
	}
	pi2o24 := new(big.Float).SetPrec(prec).Quo(mul(pi, pi), f(24))
	invPi := new(big.Float).SetPrec(prec).Quo(f(1), pi)
	want := []*big.Float{
		invPi,
		mul(L, invPi),
		mul(add(mul(L, L, f(0.5)), mul(pi2o24, f(-1))), invPi),
		mul(add(new(big.Float).SetPrec(prec).Quo(mul(L, L, L), f(6)), mul(L, pi2o24, f(-1)), pi2o24), invPi),
	}
	checkCoefficients(t, "b around 2", c, want, 1e-30)
	// Coefficients 1..6 against mpmath.taylor of
	// b(eps) = ((eps/2) tan(pi (1 - eps)/2)/pi)^((1 - eps)/2), the same
	// formula b^q pi = (1/2 - 1/q) tan(pi/q) with q = 2/(1 - eps), by finite
	// differences at 120 digits with step 1e-25 (as testdata/gen_conformal.py
	// does for h_n), kept to 20 digits. With singular=True mpmath's 0th
	// entry is b at an offset point, not the limit 1/pi, so k = 0 is
	// checked only above.
	out := runMpmath(t, `
import mpmath as mp
mp.mp.dps = 120
b = lambda e: ((e/2)*mp.tan(mp.pi*(1-e)/2)/mp.pi)**((1-e)/2)
print(" ".join(mp.nstr(c, 25) for c in mp.taylor(b, 0, 6, singular=True, h=mp.mpf("1e-25"))[1:]))
`)
	got := strings.Fields(out)
	if len(got) != 6 {
		t.Fatalf("mpmath printed %q", out)
	}
	for i, s := range got {
		k := i + 1
		if d := relDiff(c.Values[k], parseBig(t, s)); d > 1e-20 {
			t.Errorf("b eps^%d: %s, mpmath %s", k, c.Values[k].Text('g', 22), s)
		}
	}
}

// runMpmath runs a python3 script that uses mpmath and returns its output;
// it skips the test when python3 or mpmath is missing.
func runMpmath(t *testing.T, script string) string {
	t.Helper()
	py, err := exec.LookPath("python3")
	if err != nil {
		t.Skip("skipped: python3 not available for the mpmath check")
	}
	if exec.Command(py, "-c", "import mpmath").Run() != nil {
		t.Skip("skipped: mpmath not installed (pip install mpmath, or Debian python3-mpmath)")
	}
	out, err := exec.Command(py, "-c", script).Output()
	if err != nil {
		t.Fatalf("mpmath script failed: %v", err)
	}
	return strings.TrimSpace(string(out))
}

func TestSeriesBadInput(t *testing.T) {
	cases := []struct {
		name string
		run  func() error
	}{
		{"S_0 order -1", func() error { _, err := S0Series(AroundTwo, -1, 20); return err }},
		{"S_0 order above cap", func() error { _, err := S0Series(AroundInf, MaxOrder+1, 20); return err }},
		{"S_0 digits 2", func() error { _, err := S0Series(AroundInf, 4, 2); return err }},
		{"S_0 digits above cap", func() error { _, err := S0Series(AroundInf, 4, MaxDigits+1); return err }},
		{"b order -2", func() error { _, err := BSeries(AroundTwo, -2, 20); return err }},
		{"b digits 0 around inf", func() error { _, err := BSeries(AroundInf, 4, 0); return err }},
		{"S0Taylor order -1", func() error { _, err := S0Taylor(AroundTwo, -1, 64); return err }},
		{"h_n n = -1", func() error { _, err := DimensionSeries(AroundInf, -1, 4, 20); return err }},
		{"h_n n above cap", func() error { _, err := DimensionSeries(AroundInf, MaxN+1, 4, 20); return err }},
	}
	for _, c := range cases {
		err := c.run()
		if err == nil {
			t.Errorf("%s: accepted", c.name)
			continue
		}
		if !strings.Contains(err.Error(), "must be between") {
			t.Errorf("%s: message %q does not say the allowed range", c.name, err)
		}
	}
}
