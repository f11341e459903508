package series

import (
	"math/big"
	"testing"
)

// Pade [20/20] of the 41-term log(1+x) series at 200 bits.
func BenchmarkNewPade20x20At200Bits(b *testing.B) {
	s := padeTestLog1p(41, 200)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := NewPade(s, 20, 20); err != nil {
			b.Fatal(err)
		}
	}
}

// Poles of the [20/20] approximant (degree-20 Aberth at 200 bits).
func BenchmarkPadePoles20At200Bits(b *testing.B) {
	p, err := NewPade(padeTestLog1p(41, 200), 20, 20)
	if err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := p.Poles(); err != nil {
			b.Fatal(err)
		}
	}
}

// PadeTable of log(1+x) at x = 1 from 41 terms at 200 bits.
func BenchmarkPadeTableLog1p41At200Bits(b *testing.B) {
	s := padeTestLog1p(41, 200)
	x := big.NewFloat(1)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := PadeTable(s, x, PadeTableOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

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
