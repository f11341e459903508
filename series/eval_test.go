package series

import (
	"qbridge/series/scalar"

	"math/big"
	"testing"
)

// Geometric polynomial sum_{k<n} x^k = (1 - x^n)/(1 - x), real and complex,
// and its partial sums.
func TestEvalGeometric(t *testing.T) {
	const prec, n = 200, 17
	s := newZero(n, prec)
	for k := range s.c {
		s.c[k].SetInt64(1)
	}
	for _, xs := range []string{"0.5", "-0.9", "3", "0"} {
		x, _ := new(big.Float).SetPrec(prec).SetString(xs)
		if x.Cmp(big.NewFloat(1)) == 0 {
			continue
		}
		want := func(k int) *big.Float { // (1 - x^k)/(1 - x)
			pw := big.NewFloat(1).SetPrec(prec + 64)
			for i := 0; i < k; i++ {
				pw.Mul(pw, x)
			}
			num := new(big.Float).SetPrec(prec+64).Sub(big.NewFloat(1), pw)
			den := new(big.Float).SetPrec(prec+64).Sub(big.NewFloat(1), x)
			return num.Quo(num, den)
		}
		got := Eval(s, x)
		if got.Prec() != prec || !elemTCloseFloat(got, want(n), prec-4) {
			t.Errorf("Eval at %s = %s, want %s", xs, got.Text('g', 30), want(n).Text('g', 30))
		}
		ps := PartialSums(s, x)
		if len(ps) != n {
			t.Fatalf("PartialSums: %d values, want %d", len(ps), n)
		}
		for k := 1; k <= n; k++ {
			if !elemTCloseFloat(ps[k-1], want(k), prec-4) {
				t.Errorf("PartialSums at %s, k=%d: %s, want %s", xs, k, ps[k-1].Text('g', 30), want(k).Text('g', 30))
			}
		}
	}
	// Complex: z = i, sum_{k<17} i^k = (1 - i^17)/(1 - i) = (1 - i)/(1 - i) = 1.
	z := scalar.ComplexFloat64(0, 1, prec)
	got := EvalComplex(s, z)
	if got.Re.Cmp(big.NewFloat(1)) != 0 || got.Im.Sign() != 0 {
		t.Errorf("EvalComplex at i = %v, want 1", got.Complex128())
	}
	// z = 0.3 + 0.4i against (1 - z^n)/(1 - z).
	z = scalar.NewComplex(elemTRat(3, 10, prec), elemTRat(4, 10, prec), prec)
	pw := scalar.ComplexFloat64(1, 0, prec+64)
	for i := 0; i < n; i++ {
		pw = scalar.CMul(pw, z, prec+64)
	}
	want, _ := scalar.CDiv(scalar.CSub(scalar.ComplexFloat64(1, 0, prec+64), pw, prec+64), scalar.CSub(scalar.ComplexFloat64(1, 0, prec+64), z, prec+64), prec+64)
	got = EvalComplex(s, z)
	if !elemTCloseFloat(got.Re, want.Re, prec-4) || !elemTCloseFloat(got.Im, want.Im, prec-4) {
		t.Errorf("EvalComplex at 0.3+0.4i = %v, want %v", got.Complex128(), want.Complex128())
	}
}

// The exp series summed at x = 1/2 approaches e^(1/2) with the Taylor
// remainder bound x^n/n! * e^x (Lagrange form).
func TestEvalExpSeries(t *testing.T) {
	const prec, n = 256, 60
	e, _ := Exp(elemTVar(n, prec))
	x := big.NewFloat(0.5)
	got := Eval(e, x)
	want := scalar.BigExp(x, prec)
	d := new(big.Float).Sub(got, want)
	d.Abs(d)
	// 0.5^60/60! * 2 < 1e-99
	if d.Cmp(big.NewFloat(1e-99)) > 0 {
		t.Errorf("exp series at 1/2: error %s", d.Text('g', 5))
	}
}
