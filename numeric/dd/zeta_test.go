package dd

import (
	"math"
	"math/big"
	"testing"
)

// zeta(2k) = (-1)^{k+1} B_2k (2 pi)^{2k} / (2 (2k)!) (DLMF 25.6.2), with the
// Bernoulli numbers of DLMF Table 24.2.1, and zeta(3), zeta(5) against
// their decimal values (DLMF 25.6 and the OEIS A002117, A013663; written
// from memory).
func TestZetaDLMF(t *testing.T) {
	b := []*big.Rat{big.NewRat(1, 6), big.NewRat(-1, 30), big.NewRat(1, 42), big.NewRat(-1, 30), big.NewRat(5, 66), big.NewRat(-691, 2730)}
	twoPi := Pi.Ldexp(1)
	for k := 1; k <= len(b); k++ {
		c := new(big.Rat).Abs(b[k-1])
		fact := new(big.Int).MulRange(1, int64(2*k))
		c.Quo(c, new(big.Rat).SetInt(fact))
		want := FromBig(new(big.Float).SetPrec(200).SetRat(c)).Mul(powInt(twoPi, 2*k)).Ldexp(-1)
		if d := Zeta(2 * k).Div(want).AddFloat(-1).Float64(); math.Abs(d) > 1e-30 {
			t.Errorf("zeta(%d): relative error %.3g", 2*k, d)
		}
	}
	for _, c := range []struct {
		s    int
		want string
	}{{3, "1.2020569031595942853997381615114499907649862923405"}, {5, "1.0369277551433699263313654864570341680570809195019"}} {
		w, _ := Parse(c.want)
		if d := Zeta(c.s).Sub(w).Float64(); math.Abs(d) > 1e-30 {
			t.Errorf("zeta(%d): error %.3g", c.s, d)
		}
	}
	if z := Zeta(1); !math.IsNaN(z.Hi) {
		t.Errorf("zeta(1) = %v, want NaN", z.Hi)
	}
	// For large s the series itself: zeta(40) = 1 + 2^-40 + ... + 10^-40
	// + O(11^-40 = 2e-42).
	direct := New(1)
	for m := 2; m <= 10; m++ {
		direct = direct.Add(powInt(New(float64(m)), -40))
	}
	if d := Zeta(40).Sub(direct).Float64(); math.Abs(d) > 1e-31 {
		t.Errorf("zeta(40) - sum_{m<=10} m^-40 = %.3g", d)
	}
}

// Euler's constant against H_n - log n - 1/(2n) + sum_k B_2k/(2k n^2k)
// (DLMF 2.10.8) at n = 40 in double-double.
func TestEulerGamma(t *testing.T) {
	n := 40
	h := Float{}
	for m := n; m >= 1; m-- {
		h = h.Add(New(1).DivFloat(float64(m)))
	}
	g := h.Sub(Log(New(float64(n)))).Sub(New(1).DivFloat(float64(2 * n)))
	for k, bk := range bernoulliEven(12) {
		c := FromBig(new(big.Float).SetPrec(200).SetRat(bk)).DivFloat(float64(2 * (k + 1)))
		g = g.Add(c.Mul(powInt(New(float64(n)), -2*(k+1))))
	}
	if d := g.Sub(EulerGamma).Float64(); math.Abs(d) > 1e-30 {
		t.Errorf("Euler's constant: difference %.3g", d)
	}
}
