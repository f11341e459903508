package numeric

import "math"

// kA is the antisymmetric-channel kernel eigenvalue k_A(h) of the conformal
// SYK four-point function (Maldacena-Stanford arXiv:1604.07818, eq. 3.73).
func kA(q, h float64) float64 {
	d := 1 / q
	pre := -(q - 1) * gammaRatio([]float64{1.5 - d, 1 - d}, []float64{0.5 + d, d})
	return pre * gammaRatio([]float64{d + h/2, 0.5 + d - h/2}, []float64{1.5 - d - h/2, 1 - d + h/2})
}

// gammaRatio returns prod Gamma(num) / prod Gamma(den) with signs.
func gammaRatio(num, den []float64) float64 {
	lg, sign := 0.0, 1.0
	for _, x := range num {
		v, s := math.Lgamma(x)
		lg += v
		sign *= float64(s)
	}
	for _, x := range den {
		v, s := math.Lgamma(x)
		lg -= v
		sign *= float64(s)
	}
	return sign * math.Exp(lg)
}

// FirstDimension returns h_1, the smallest operator dimension above the soft
// mode h = 2, as the root of k_A(h) = 1 between the pole at 3 + 2/q and the
// zero at 5 - 2/q (bisection); at q = 2 it is the free value 4.
func FirstDimension(q float64) float64 {
	lo, hi := 3+2/q, 5-2/q
	if hi-lo < 1e-9 {
		return 4
	}
	f := func(h float64) float64 { return kA(q, h) - 1 }
	// Just above the pole k_A -> +infinity or -infinity; find the bracket by scanning.
	a := lo + 1e-12*(hi-lo)
	for f(a) == 0 || math.IsInf(f(a), 0) {
		a += 1e-9
	}
	b := hi
	fa := f(a)
	if fa*f(b) > 0 {
		return math.NaN()
	}
	for i := 0; i < 200 && b-a > 1e-15*b; i++ {
		c := (a + b) / 2
		fc := f(c)
		if fc*fa > 0 {
			a, fa = c, fc
		} else {
			b = c
		}
	}
	return (a + b) / 2
}
