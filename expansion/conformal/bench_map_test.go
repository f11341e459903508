package conformal

import "testing"

// clearSingularityCaches empties the refined-map and coarse-scan caches, so
// that a benchmark iteration pays for a cold start.
func clearSingularityCaches() {
	mapCache.Lock()
	mapCache.m = map[[4]int]*mapEntry{}
	mapCache.Unlock()
	scanCache.Lock()
	scanCache.m = map[[2]int]*scanResult{}
	scanCache.Unlock()
}

// BenchmarkSingularityMapsCold measures the nearest-singularity maps that
// the radius of every dimension series needs (h_1..h_4 at both ends, at
// radiusDigits), computed from empty caches each iteration.
func BenchmarkSingularityMapsCold(b *testing.B) {
	for i := 0; i < b.N; i++ {
		clearSingularityCaches()
		for _, end := range []End{AroundTwo, AroundInf} {
			for n := 1; n <= 4; n++ {
				if _, err := DimensionSingularities(end, n, 1, radiusDigits); err != nil {
					b.Fatal(err)
				}
			}
		}
	}
	clearSingularityCaches()
}
