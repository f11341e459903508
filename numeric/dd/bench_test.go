package dd

import "testing"

// BenchmarkFFT16384 is one real transform of the zero-temperature grid's
// length (the eps-series solver does four per iteration).
func BenchmarkFFT16384(b *testing.B) {
	n := 16384
	f, _ := NewFFT(n)
	x := make([]Float, n)
	for i := range x {
		x[i] = New(float64(i%7) - 3)
	}
	c := make([]Complex, n/2+1)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		f.Coefficients(c, x)
	}
}

// BenchmarkRecipGamma is 1/Gamma at a point like the Mellin weights' (one
// shift of about twenty steps).
func BenchmarkRecipGamma(b *testing.B) {
	z := NewComplex(0.35, 4.2)
	for i := 0; i < b.N; i++ {
		RecipGamma(z)
	}
}

// BenchmarkMul is one double-double product.
func BenchmarkMul(b *testing.B) {
	x, y := New(1.1), New(0.9)
	for i := 0; i < b.N; i++ {
		x = x.Mul(y).AddFloat(0.1)
	}
	_ = x
}

func BenchmarkExp(b *testing.B) {
	x := New(3.7)
	for i := 0; i < b.N; i++ {
		Exp(x)
	}
}
