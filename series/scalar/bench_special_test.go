package scalar

import (
	"math/big"
	"testing"
)

// Reference timings on this machine (python3, mpmath 1.3.0, pure-Python
// backend, timeit): mpmath.zeta(2.5, 0.3) at dps 100 took 2.8 ms and
// mpmath.gamma(0.318...) 48 us.

func BenchmarkBigGamma100Digits(b *testing.B) {
	x := new(big.Float).SetPrec(333).SetFloat64(0.3183098861837907)
	for i := 0; i < b.N; i++ {
		if _, err := BigGamma(x, 333); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkBigHurwitzZeta100Digits(b *testing.B) {
	s := big.NewFloat(2.5)
	a := big.NewFloat(0.3)
	for i := 0; i < b.N; i++ {
		if _, err := BigHurwitzZeta(s, a, 333); err != nil {
			b.Fatal(err)
		}
	}
}
