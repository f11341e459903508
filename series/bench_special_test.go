package series

import (
	"math/big"
	"testing"
)

// Reference timings on this machine (python3, mpmath 1.3.0, pure-Python
// backend, timeit): mpmath.taylor(mpmath.loggamma, 0.25, 49) at mp.dps = 100
// took 104 s; mpmath.zeta(2.5, 0.3) at dps 100 took 2.8 ms and
// mpmath.gamma(0.318...) 48 us.

func benchLogGammaSeries(b *testing.B, prec uint) {
	x0 := big.NewFloat(0.25)
	s, err := Variable(50, prec, x0)
	if err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := LogGamma(s); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkLogGammaSeries100Digits: series of log Gamma at 1/4, length 50, 333 bits.
func BenchmarkLogGammaSeries100Digits(b *testing.B) { benchLogGammaSeries(b, 333) }

// BenchmarkLogGammaSeries300Digits: the same at 997 bits.
func BenchmarkLogGammaSeries300Digits(b *testing.B) { benchLogGammaSeries(b, 997) }

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
