package series

import "math/big"

// Deriv returns the derivative of a: the series sum k a_k t^(k-1), of
// length max(n-1, 1) (the derivative of a length-1 series is the zero series
// of length 1), at the precision of a.
func Deriv(a *Series) *Series {
	if a == nil || a.prec == 0 {
		return nil
	}
	n := len(a.c)
	if n <= 1 {
		return newZero(1, a.prec)
	}
	out := newZero(n-1, a.prec)
	k := new(big.Float)
	for i := range out.c {
		k.SetInt64(int64(i + 1))
		out.c[i].Mul(a.c[i+1], k)
	}
	return out
}

// Integral returns the antiderivative of a with constant term c0 (nil means
// zero): the series c0 + sum a_k t^(k+1)/(k+1), of length n+1, at the
// precision of a. The extra coefficient is exact: it only uses a_(n-1).
func Integral(a *Series, c0 *big.Float) *Series {
	if a == nil || a.prec == 0 {
		return nil
	}
	n := len(a.c)
	out := newZero(n+1, a.prec)
	if c0 != nil {
		out.c[0].Set(c0)
	}
	k := new(big.Float)
	for i := 0; i < n; i++ {
		k.SetInt64(int64(i + 1))
		out.c[i+1].Quo(a.c[i], k)
	}
	return out
}
