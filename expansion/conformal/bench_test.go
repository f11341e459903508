package conformal

import "testing"

// Speed targets of the series engine (measured here, never in timed
// tests): the order-40 series of h_1..h_4 at both ends at 50 digits, the
// order-100 series of h_1 at 100 digits, and the exact h_1..h_20 at one q
// at 50 digits. Each DimensionSeries call includes its second run at a
// higher precision (the error estimate).

func BenchmarkDimensionSeriesOrder40(b *testing.B) {
	for i := 0; i < b.N; i++ {
		for _, end := range []End{AroundTwo, AroundInf} {
			for n := 1; n <= 4; n++ {
				if _, err := DimensionSeries(end, n, 40, 50); err != nil {
					b.Fatal(err)
				}
			}
		}
	}
}

func BenchmarkDimensionSeriesOrder100(b *testing.B) {
	for i := 0; i < b.N; i++ {
		if _, err := DimensionSeries(AroundTwo, 1, 100, 100); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkDimensionsExact20(b *testing.B) {
	q, err := ParseQ("4", 256)
	if err != nil {
		b.Fatal(err)
	}
	for i := 0; i < b.N; i++ {
		resetKernelConstants() // one process's cost, not a warm cache's
		for n := 1; n <= 20; n++ {
			if _, err := Dimension(q, n, 50); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkDimensionSeriesH1 is the case compared with the mpmath
// reference testdata/cauchy_dims.py: h_1 around q = 2 to order 40 at 40
// digits.
func BenchmarkDimensionSeriesH1(b *testing.B) {
	for i := 0; i < b.N; i++ {
		if _, err := DimensionSeries(AroundTwo, 1, 40, 40); err != nil {
			b.Fatal(err)
		}
	}
}
