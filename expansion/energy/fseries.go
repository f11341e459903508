package energy

// Truncated power series with float64 coefficients, used pointwise on the
// grids: c[0] + c[1] t + ... + c[n-1] t^(n-1). These are the small fixed
// helpers of the perturbative solvers; the arbitrary-precision engine is
// package series.

// fsMul returns the product of a and b truncated to n terms.
func fsMul(a, b []float64, n int) []float64 {
	out := make([]float64, n)
	for i := 0; i < n && i < len(a); i++ {
		for j := 0; i+j < n && j < len(b); j++ {
			out[i+j] += a[i] * b[j]
		}
	}
	return out
}

// fsInv returns 1/a to n terms; a[0] must be non-zero.
func fsInv(a []float64, n int) []float64 {
	out := make([]float64, n)
	out[0] = 1 / a[0]
	for k := 1; k < n; k++ {
		s := 0.0
		for j := 1; j <= k && j < len(a); j++ {
			s += a[j] * out[k-j]
		}
		out[k] = -s / a[0]
	}
	return out
}

// fsGeometric returns 1/(c0 + c1 t) to n terms.
func fsGeometric(c0, c1 float64, n int) []float64 {
	out := make([]float64, n)
	r := -c1 / c0
	v := 1 / c0
	for k := range out {
		out[k] = v
		v *= r
	}
	return out
}
