package numeric

import (
	"runtime"
	"testing"

	"qbridge/numeric/dd"
)

// BenchmarkSolveQ4Beta1000 is one solve at q = 4, beta = 1000 on 2^20 points
// to residual 1e-12, from a cold start (internal continuation in beta).
// Run with -cpu 1,2. Memory: heapSysMB is the heap obtained from the OS after
// the solves (an upper bound on the peak live heap), allocMB what one solve allocates.
func BenchmarkSolveQ4Beta1000(b *testing.B) {
	runtime.GC()
	var before runtime.MemStats
	runtime.ReadMemStats(&before)
	for i := 0; i < b.N; i++ {
		lv, err := continuation(4, 1000, 1<<20, 1e-12, nil)
		if err != nil {
			b.Fatal(err)
		}
		if lv.Residual > 1e-12 {
			b.Fatalf("residual %g", lv.Residual)
		}
	}
	var after runtime.MemStats
	runtime.ReadMemStats(&after)
	b.ReportMetric(float64(after.HeapSys)/1e6, "heapSysMB")
	b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/1e6, "allocMB/op")
}

// BenchmarkSolveGroundQ4 is the default ladder and joint fits at q = 4.
func BenchmarkSolveGroundQ4(b *testing.B) {
	c := conformalData(b, 4)
	for i := 0; i < b.N; i++ {
		if _, err := SolveGround(GroundLadder(4, 0, nil), c); err != nil {
			b.Fatal(err)
		}
	}
}

// The zero-temperature eps-series to order 10 on the default grid, in
// float64 and refined in double-double.
func BenchmarkSolveZeroTEpsOrder10(b *testing.B) {
	for _, ext := range []bool{false, true} {
		name := "float64"
		if ext {
			name = "double-double"
		}
		b.Run(name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				if _, err := SolveZeroTEps(EpsSeriesParams{Order: 10, Extended: ext}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkEpsKernelDD is one double-double Mellin weight table of the
// default zero-temperature grid (16384 points, step 0.05) to order 12, and
// BenchmarkEpsKernel its float64 counterpart.
func BenchmarkEpsKernelDD(b *testing.B) {
	for i := 0; i < b.N; i++ {
		epsKernelDD(16384, DefaultZeroTStep, dd.New(-1).AddFloat(DefaultZeroTTilt), DefaultKernelRadius, 13)
	}
}

func BenchmarkEpsKernel(b *testing.B) {
	g, err := NewLogGrid(DefaultZeroTTauMin, DefaultZeroTStep, 16384)
	if err != nil {
		b.Fatal(err)
	}
	for i := 0; i < b.N; i++ {
		epsKernel(g, -1+DefaultZeroTTilt, DefaultKernelRadius, 13)
	}
}
