package energy

import (
	"fmt"
	"testing"
)

// BenchmarkEpsSeriesOrder8Beta1000 is the eps-series of log Z and E to order
// 8 at beta = 1000 on the default grids (32768, 16384, 8192 points,
// Richardson-extrapolated).
func BenchmarkEpsSeriesOrder8Beta1000(b *testing.B) {
	for i := 0; i < b.N; i++ {
		if _, err := DeltaExpand(DeltaParams{Beta: 1000, Order: 8, Variable: VarEps}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkDeltaScaling shows the cost against order and grid size on one grid.
func BenchmarkDeltaScaling(b *testing.B) {
	for _, m := range []int{1 << 13, 1 << 15} {
		for _, k := range []int{4, 8, 16} {
			b.Run(fmt.Sprintf("points=%d/order=%d", 2*m, k), func(b *testing.B) {
				for i := 0; i < b.N; i++ {
					if _, err := solveDeltaLevel(1000, m, k); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}

// BenchmarkInvQScaling is the same for the 1/q expansion.
func BenchmarkInvQScaling(b *testing.B) {
	for _, m := range []int{1 << 13, 1 << 15} {
		for _, k := range []int{4, 7, 10} {
			b.Run(fmt.Sprintf("points=%d/order=%d", 2*m, k), func(b *testing.B) {
				for i := 0; i < b.N; i++ {
					if _, err := solveInvQLevel(1000, m, k); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}
