package special

import (
	"math/big"
	"testing"

	"qbridge/series"
)

// Reference timing on this machine (python3, mpmath 1.3.0, pure-Python
// backend, timeit): mpmath.taylor(mpmath.loggamma, 0.25, 49) at mp.dps = 100
// took 104 s.

func benchLogGammaSeries(b *testing.B, prec uint) {
	x0 := big.NewFloat(0.25)
	s, err := series.Variable(50, prec, x0)
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
