package hightemp

import (
	"fmt"
	"math/big"
	"testing"
)

// BenchmarkSolve measures one exact solve at q = 4 by order: the time
// grows roughly like order^4 (products of degree-2k polynomials summed
// over k), times the growth of the integers.
func BenchmarkSolve(b *testing.B) {
	for _, order := range []int{12, 24, 30, 40, 60} {
		b.Run(fmt.Sprintf("order=%d", order), func(b *testing.B) {
			q := big.NewRat(4, 1)
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Solve(q, order); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkSymbolic measures the coefficients exact in q: order+2 solves
// and the interpolation.
func BenchmarkSymbolic(b *testing.B) {
	for _, order := range []int{12, 24, 30} {
		b.Run(fmt.Sprintf("order=%d", order), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := SymbolicLogZ(order, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
