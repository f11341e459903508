package conformal

import (
	"encoding/json"
	"fmt"
	"math"
	"math/big"
	"os/exec"
	"strings"
	"testing"

	"qbridge/series"
)

// evalCoeffs sums c_k t^k at 200 bits.
func evalCoeffs(t *testing.T, c []*big.Float, x float64) *big.Float {
	t.Helper()
	s, err := series.FromBig(200, c)
	if err != nil {
		t.Fatal(err)
	}
	return series.Eval(s, new(big.Float).SetPrec(200).SetFloat64(x))
}

// exactFactors returns F_K = 6 q^2 alpha_0 and F_G = F_K/(-q k_A'(2)) at q
// from alpha_0 = 2 pi q/((q-1)(q-2) tan(pi/q)) (PHYSICS.md sec. 7) and the
// closed form of k_A'(2) (KernelASlopeAtTwo, tested against the digamma
// form and finite differences of k_A in kernelderiv_test.go).
func exactFactors(t *testing.T, qs string) (fk, fg float64) {
	t.Helper()
	qp := mustQ(t, qs)
	k, err := KernelASlopeAtTwo(qp, 30)
	if err != nil {
		t.Fatal(err)
	}
	ks, _ := k.Value.Float64()
	q, _ := qp.Q.Float64()
	a0 := 2 * math.Pi * q / ((q - 1) * (q - 2) * math.Tan(math.Pi/q))
	fk = 6 * q * q * a0
	return fk, fk / (-q * ks)
}

// The factor series: leading terms against the limits of PHYSICS.md sec. 7
// and Maldacena-Stanford 2016 (arXiv:1604.07818) sec. 4 (alpha_K -> 3,
// alpha_G -> 2/q with alpha_S = 1/(4 q^2), i.e. x^2 F_K -> 12, x F_G -> 8),
// the q = 2 values (alpha_0(2) = pi^2, so F_K(2) = 24 pi^2; F_G = 6 pi^2 eps
// + O(eps^2), the slope pole -2/eps of k_A'(2)), and the sums against the
// exact factors: at q = 4 (eps = 1/2) F_K = 128 pi and F_G = 32 pi/(pi + 2/3)
// from alpha_0(4) = 4 pi/3 and k_A'(2) = -pi - 2/3 (MS 2016 q = 4 kernel),
// at q = 3 (eps = 1/3) and in x at q = 10 against exactFactors.
func TestSoftFactorSeries(t *testing.T) {
	two, twoG, err := SoftFactorSeries(AroundTwo, 80, 30)
	if err != nil {
		t.Fatal(err)
	}
	inf, infG, err := SoftFactorSeries(AroundInf, 60, 30)
	if err != nil {
		t.Fatal(err)
	}
	f := func(x *big.Float) float64 { v, _ := x.Float64(); return v }
	pi := math.Pi
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"F_K(eps=0)", f(two.Values[0]), 24 * pi * pi},
		{"F_G'(eps=0)", f(twoG.Values[1]), 6 * pi * pi},
		{"x^2 F_K(x=0)", f(inf.Values[0]), 12},
		{"x F_G(x=0)", f(infG.Values[0]), 8},
		{"alpha_K(q=inf) = 12/4", f(inf.Values[0]) / 4, 3},
		{"q alpha_G(q=inf) = 8/4", f(infG.Values[0]) / 4, 2},
	} {
		if math.Abs(c.got-c.want) > 1e-14*c.want {
			t.Errorf("%s = %.17g, want %.17g", c.what, c.got, c.want)
		}
	}
	if twoG.Values[0].Sign() != 0 || twoG.Errors[0].Sign() != 0 {
		t.Errorf("F_G(eps=0) = %s +- %s, want an exact zero", twoG.Values[0].Text('g', 5), twoG.Errors[0].Text('g', 5))
	}
	// Odd coefficients of F_K in eps vanish: tan(pi eps/2)/eps and 1/(1-eps^2) are even.
	for k := 1; k < len(two.Values); k += 2 {
		if math.Abs(f(two.Values[k])) > 1e-25 {
			t.Errorf("F_K eps^%d = %g, want 0 (an even function)", k, f(two.Values[k]))
		}
	}
	// Sums: the eps series have radius 1 (tan(pi eps/2) at eps = +-1), so 80
	// terms at eps = 1/2 leave ~1e-20.
	fk3, fg3 := exactFactors(t, "3")
	fk10, fg10 := exactFactors(t, "10")
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"F_K(q=4)", f(evalCoeffs(t, two.Values, 0.5)), 128 * pi},
		{"F_G(q=4)", f(evalCoeffs(t, twoG.Values, 0.5)), 32 * pi / (pi + 2.0/3)},
		{"F_K(q=3)", f(evalCoeffs(t, two.Values, 1.0/3)), fk3},
		{"F_G(q=3)", f(evalCoeffs(t, twoG.Values, 1.0/3)), fg3},
		{"x^2 F_K(q=10)", f(evalCoeffs(t, inf.Values, 0.1)), fk10 / 100},
		{"x F_G(q=10)", f(evalCoeffs(t, infG.Values, 0.1)), fg10 / 10},
	} {
		if math.Abs(c.got-c.want) > 1e-13*c.want {
			t.Errorf("%s: series sum %.17g, exact %.17g", c.what, c.got, c.want)
		}
	}
	// Errors from two precisions: tiny, and never zero where the value is not.
	for k, e := range two.Errors {
		if ef := f(e); ef > 1e-25*math.Max(1, math.Abs(f(two.Values[k]))) {
			t.Errorf("F_K eps^%d error %g", k, ef)
		}
	}
}

// The factor series against mpmath (a live call; skipped without python3
// and mpmath): Taylor coefficients by discrete Cauchy sums (64 points on a
// circle well inside the radius: 1/4 in eps and for x^2 F_K, 1/16 for
// x F_G, whose series in x has radius about 0.24) of 6 q^2 alpha_0 and
// 6 q^2 alpha_0/(-q k_A'(2)), with k_A'(2) from the digamma form of
// PHYSICS.md sec. 4 (mpmath.psi) rather than the closed form the series
// use; q = 2/(1-eps) around q = 2 and q = 1/x around infinity (as x^2 F_K
// and x F_G). Held to 1e-18 relative.
func TestSoftFactorSeriesMpmath(t *testing.T) {
	if testing.Short() {
		t.Skip("short mode")
	}
	if _, err := exec.LookPath("python3"); err != nil {
		t.Skip("python3 not found")
	}
	if err := exec.Command("python3", "-c", "import mpmath").Run(); err != nil {
		t.Skip("mpmath not importable")
	}
	const script = `
import json
from mpmath import mp, mpf, pi, tan, psi, expjpi
mp.dps = 40
def slope(q):
    D = 1/q
    return (psi(0, D + 1) - psi(0, D - mpf(1)/2) + psi(0, mpf(1)/2 - D) - psi(0, 2 - D))/2
def fk(q):
    return 6*q**2*2*pi*q/((q - 1)*(q - 2)*tan(pi/q))
def fg(q):
    return fk(q)/(-q*slope(q))
def cauchy(f, r, n=8, N=64):
    pts = [r*expjpi(mpf(2*j)/N) for j in range(N)]
    vals = [f(z) for z in pts]
    return [sum(v*z**(-k) for v, z in zip(vals, pts))/N for k in range(n + 1)]
out = {}
for name, f, r in [("two_k", lambda e: fk(2/(1 - e)), mpf(1)/4), ("two_g", lambda e: fg(2/(1 - e)), mpf(1)/4),
                   ("inf_k", lambda x: x**2*fk(1/x), mpf(1)/4), ("inf_g", lambda x: x*fg(1/x), mpf(1)/16)]:
    out[name] = [mp.nstr(c.real, 30) for c in cauchy(f, r)]
print(json.dumps(out))
`
	raw, err := exec.Command("python3", "-c", script).Output()
	if err != nil {
		t.Fatalf("mpmath: %v", err)
	}
	var want map[string][]string
	if err := json.Unmarshal(raw, &want); err != nil {
		t.Fatalf("%v: %s", err, raw)
	}
	two, twoG, err := SoftFactorSeries(AroundTwo, 8, 30)
	if err != nil {
		t.Fatal(err)
	}
	inf, infG, err := SoftFactorSeries(AroundInf, 8, 30)
	if err != nil {
		t.Fatal(err)
	}
	for name, c := range map[string]*Coefficients{"two_k": two, "two_g": twoG, "inf_k": inf, "inf_g": infG} {
		for k, ws := range want[name] {
			w, _, err := big.ParseFloat(strings.TrimSpace(ws), 10, 200, big.ToNearestEven)
			if err != nil {
				t.Fatal(err)
			}
			d := new(big.Float).Sub(c.Values[k], w)
			df, _ := d.Float64()
			wf, _ := w.Float64()
			if math.Abs(df) > 1e-18*math.Max(1, math.Abs(wf)) {
				t.Errorf("%s coefficient %d: %s, mpmath %s", name, k, c.Values[k].Text('g', 25), ws)
			}
		}
	}
}

// The factors alpha_K/alpha_S and alpha_G/alpha_S around q = 2: F_K(2) =
// 24 pi^2 and F_G = 6 pi^2 eps + ..., so alpha_K(2) = pi and alpha_G(2) = 0.
func ExampleSoftFactorSeries() {
	fk, fg, err := SoftFactorSeries(AroundTwo, 3, 20)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k := range fk.Values {
		fmt.Printf("eps^%d: F_K %s, F_G %s\n", k, fk.Values[k].Text('f', 6), fg.Values[k].Text('f', 6))
	}
	// Output:
	// eps^0: F_K 236.870506, F_G 0.000000
	// eps^1: F_K 0.000000, F_G 59.217626
	// eps^2: F_K 431.688688, F_G -59.217626
	// eps^3: F_K 0.000000, F_G 118.435253
}
