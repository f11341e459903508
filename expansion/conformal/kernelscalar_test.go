package conformal

import (
	"math"
	"math/big"
	"testing"
)

// The two-Gamma route (reflection and duplication applied to k_A) and the
// four-Gamma route of the general solver find the same roots h_n: two
// algebraically different evaluations of PHYSICS.md's k_A.
func TestTwoGammaRouteMatchesFourGamma(t *testing.T) {
	const prec = 230
	for _, qs := range []string{"2.01", "2.5", "3", "4", "6", "10", "100", "999"} {
		q, err := ParseQ(qs, prec+16)
		if err != nil {
			t.Fatal(err)
		}
		for _, n := range []int{1, 2, 5, 13, 20} {
			fast, _, ok := dimensionTwoGamma(q, n, prec, nil)
			if !ok {
				t.Errorf("q = %s, n = %d: two-Gamma route not taken", qs, n)
				continue
			}
			// the general route: no seed and n forced through the four-Gamma equation
			slow, err := dimensionFourGamma(q, n, prec)
			if err != nil {
				t.Fatal(err)
			}
			d := new(big.Float).Sub(fast, slow)
			d.Abs(d)
			tol := new(big.Float).SetMantExp(slow, -prec+12)
			tol.Abs(tol)
			if d.Cmp(tol) > 0 {
				t.Errorf("q = %s, n = %d: two-Gamma %s, four-Gamma %s, differ by %.3g", qs, n, fast.Text('g', 40), slow.Text('g', 40), d)
			}
		}
	}
}

// At q = 4 the two-Gamma form is PHYSICS.md's closed form
// k_A = -(3/2) tan(pi (h - 1/2)/2)/(h - 1/2): its log at h = 5.3 by hand.
func TestTwoGammaAtQ4(t *testing.T) {
	k := newTwoGammaKernel(big.NewFloat(4).SetPrec(200))
	h := new(big.Float).SetPrec(200).SetFloat64(5.3)
	L, _, err := k.at(h, 200, 100)
	if err != nil {
		t.Fatal(err)
	}
	// tan(pi 4.8/2) = tan(2.4 pi) = tan(0.4 pi) = 3.0776835371752534 (A&S 4.3)
	want := 1.5 * 3.0776835371752534 / 4.8
	got, _ := L.Float64()
	lw := math.Log(want)
	if d := got - lw; d > 1e-14 || d < -1e-14 {
		t.Errorf("log|k_A(5.3)| = %.16g, want log(%.16g) = %.16g", got, want, lw)
	}
	if _, s := k.float64At(5.3); s != -1 {
		t.Errorf("sign of k_A(5.3) = %d, want -1 (-(3/2) tan(0.4 pi)/4.8 < 0)", s)
	}
}
