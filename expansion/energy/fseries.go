package energy

import "math"

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

// at returns a[k], or zero beyond the length.
func at(a []float64, k int) float64 {
	if k < len(a) {
		return a[k]
	}
	return 0
}

// fsLogInto writes log(a) to dst (len(dst) terms) without allocating; a[0]
// must be positive. From a f' = a': k f_k a_0 = k a_k - sum_{j=1}^{k-1} j f_j a_{k-j}.
func fsLogInto(dst, a []float64) {
	n := len(dst)
	dst[0] = math.Log(a[0])
	for k := 1; k < n; k++ {
		s := float64(k) * at(a, k)
		for j := 1; j < k; j++ {
			s -= float64(j) * dst[j] * at(a, k-j)
		}
		dst[k] = s / (float64(k) * a[0])
	}
}

// fsExpInto writes exp(a) to dst (len(dst) terms) without allocating.
// From f' = a' f: k f_k = sum_j j a_j f_{k-j}.
func fsExpInto(dst, a []float64) {
	n := len(dst)
	dst[0] = math.Exp(a[0])
	for k := 1; k < n; k++ {
		s := 0.0
		for j := 1; j <= k; j++ {
			s += float64(j) * at(a, j) * dst[k-j]
		}
		dst[k] = s / float64(k)
	}
}
