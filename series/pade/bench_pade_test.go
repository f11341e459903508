package pade

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
