package numeric

import (
	"fmt"
	"math"
	"testing"
)

// TestLogExpSeries checks the float64 series log and exp against their
// Taylor series (DLMF 4.6.1: log(1+e) = sum (-1)^(k+1) e^k/k; DLMF 4.2.19:
// exp(c e) = sum c^k e^k/k!) and that exp undoes log.
func TestLogExpSeries(t *testing.T) {
	const n = 12
	a := make([]float64, n)
	a[0], a[1] = 1, 1
	l := make([]float64, n)
	LogSeriesInto(l, a)
	for k := 1; k < n; k++ {
		want := math.Pow(-1, float64(k+1)) / float64(k)
		if math.Abs(l[k]-want) > 1e-15 {
			t.Fatalf("log(1+e): coefficient %d = %v, want %v", k, l[k], want)
		}
	}
	e := make([]float64, n)
	ExpSeriesInto(e, l)
	for k := range e {
		if math.Abs(e[k]-a[k]) > 1e-15 {
			t.Fatalf("exp(log(1+e)): coefficient %d = %v, want %v", k, e[k], a[k])
		}
	}
	c := []float64{0, 2.5, 0, 0, 0, 0, 0, 0}
	ex := make([]float64, len(c))
	ExpSeriesInto(ex, c)
	want := 1.0
	for k := range ex {
		if math.Abs(ex[k]-want) > 1e-14*want {
			t.Fatalf("exp(2.5 e): coefficient %d = %v, want %v", k, ex[k], want)
		}
		want *= 2.5 / float64(k+1)
	}
	// a constant term below the float64 range: the zero series, not NaN
	ExpSeriesInto(ex, []float64{-800, 1e3, 0, 0, 0, 0, 0, 0})
	for k, v := range ex {
		if v != 0 {
			t.Fatalf("exp of an underflowing series: coefficient %d = %v, want 0", k, v)
		}
	}
}

// log(1 - e) to four terms: 0, -1, -1/2, -1/3.
func ExampleLogSeriesInto() {
	l := make([]float64, 4)
	LogSeriesInto(l, []float64{1, -1, 0, 0})
	fmt.Printf("%.4f\n", l)
	// Output: [0.0000 -1.0000 -0.5000 -0.3333]
}

// exp(e) to four terms: 1, 1, 1/2, 1/6.
func ExampleExpSeriesInto() {
	e := make([]float64, 4)
	ExpSeriesInto(e, []float64{0, 1, 0, 0})
	fmt.Printf("%.4f\n", e)
	// Output: [1.0000 1.0000 0.5000 0.1667]
}
