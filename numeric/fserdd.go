package numeric

import "qbridge/numeric/dd"

// Truncated power series with double-double coefficients: the pointwise
// operations of the eps-series map at extended precision, with the shapes
// of their float64 counterparts in fser.go (dst has the length of the
// result and must not alias an argument).

// ddMulInto sets dst = a b.
func ddMulInto(dst, a, b []dd.Float) {
	for k := range dst {
		var s dd.Float
		for j := 0; j <= k; j++ {
			s = s.Add(a[j].Mul(b[k-j]))
		}
		dst[k] = s
	}
}

// ddInvInto sets dst = 1/a (a[0] != 0).
func ddInvInto(dst, a []dd.Float) {
	dst[0] = a[0].Inv()
	for k := 1; k < len(dst); k++ {
		var s dd.Float
		for j := 1; j <= k; j++ {
			s = s.Add(a[j].Mul(dst[k-j]))
		}
		dst[k] = s.Mul(dst[0]).Neg()
	}
}

// ddLogInto sets dst = log a (a[0] > 0), from a (log a)' = a'.
func ddLogInto(dst, a []dd.Float) {
	dst[0] = dd.Log(a[0])
	inv := a[0].Inv()
	for k := 1; k < len(dst); k++ {
		s := a[k].MulFloat(float64(k))
		for j := 1; j < k; j++ {
			s = s.Sub(dst[j].Mul(a[k-j]).MulFloat(float64(j)))
		}
		dst[k] = s.Mul(inv).DivFloat(float64(k))
	}
}

// ddExpInto sets dst = exp a, from (e^a)' = a' e^a; a constant term below
// the float64 range gives the zero series, as in ExpSeriesInto.
func ddExpInto(dst, a []dd.Float) {
	dst[0] = dd.Exp(a[0])
	if dst[0].Hi == 0 {
		for k := range dst {
			dst[k] = dd.Float{}
		}
		return
	}
	for k := 1; k < len(dst); k++ {
		var s dd.Float
		for j := 1; j <= k; j++ {
			s = s.Add(a[j].Mul(dst[k-j]).MulFloat(float64(j)))
		}
		dst[k] = s.DivFloat(float64(k))
	}
}
