package pslq

import (
	"math/big"
	"testing"
)

// PSLQ on (1, a, a^2, a^3, a^4), a = 1 + 2^(1/4), at 100 digits; the
// relation is (a-1)^4 = 2.
func BenchmarkPSLQ5At100Digits(b *testing.B) {
	prec := pslqDigitsToBits(100)
	a := new(big.Float).SetPrec(prec + 16).Sqrt(big.NewFloat(2))
	a.Sqrt(a)
	a.Add(a, big.NewFloat(1))
	x := make([]*big.Float, 5)
	p := new(big.Float).SetPrec(prec + 16).SetInt64(1)
	for k := range x {
		x[k] = new(big.Float).SetPrec(prec).Set(p)
		p.Mul(p, a)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := PSLQ(x, prec, nil); err != nil {
			b.Fatal(err)
		}
	}
}
