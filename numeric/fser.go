package numeric

import "math"

// Truncated power series with float64 coefficients, a[0] + a[1] e + ... +
// a[K-1] e^(K-1), all of one length K, written into a destination so that
// the pointwise work of the series solvers allocates nothing. The
// arbitrary-precision engine is package series; these are the small fixed
// helpers of the float64 grids.

// fsMulInto sets dst = a b (dst must not alias a or b).
func fsMulInto(dst, a, b []float64) {
	for k := range dst {
		s := 0.0
		for j := 0; j <= k; j++ {
			s += a[j] * b[k-j]
		}
		dst[k] = s
	}
}

// fsInvInto sets dst = 1/a (a[0] != 0; dst must not alias a).
func fsInvInto(dst, a []float64) {
	dst[0] = 1 / a[0]
	for k := 1; k < len(dst); k++ {
		s := 0.0
		for j := 1; j <= k; j++ {
			s += a[j] * dst[k-j]
		}
		dst[k] = -s * dst[0]
	}
}

// LogSeriesInto sets dst = log a for the float64 series a truncated to
// len(dst) terms (a[0] > 0, len(a) >= len(dst); dst must not alias a), from
// a (log a)' = a'. It allocates nothing: the series solvers call it at every
// grid point.
func LogSeriesInto(dst, a []float64) {
	dst[0] = math.Log(a[0])
	for k := 1; k < len(dst); k++ {
		s := float64(k) * a[k]
		for j := 1; j < k; j++ {
			s -= float64(j) * dst[j] * a[k-j]
		}
		dst[k] = s / (float64(k) * a[0])
	}
}

// ExpSeriesInto sets dst = exp a for the float64 series a truncated to
// len(dst) terms (len(a) >= len(dst); dst must not alias a), from
// (e^a)' = a' e^a. A constant term below the float64 range gives the zero
// series (the higher terms would multiply 0 by overflowing powers).
func ExpSeriesInto(dst, a []float64) {
	dst[0] = math.Exp(a[0])
	if dst[0] == 0 {
		for k := range dst {
			dst[k] = 0
		}
		return
	}
	for k := 1; k < len(dst); k++ {
		s := 0.0
		for j := 1; j <= k; j++ {
			s += float64(j) * a[j] * dst[k-j]
		}
		dst[k] = s / float64(k)
	}
}

// fsExpLinear sets dst = exp(c0 + c1 e).
func fsExpLinear(dst []float64, c0, c1 float64) {
	v := math.Exp(c0)
	for k := range dst {
		dst[k] = v
		v *= c1 / float64(k+1)
	}
}
