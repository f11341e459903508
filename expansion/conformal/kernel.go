package conformal

import (
	"math/big"

	"qbridge/series"
)

// End names one of the two solvable ends of the q axis.
type End int

const (
	// AroundTwo is q = 2 (free random hopping); the variable is eps = 1 - 2/q.
	AroundTwo End = iota
	// AroundInf is q = infinity; the variable is x = 1/q.
	AroundInf
)

// Variable is the name of the expansion variable at the end.
func (e End) Variable() string {
	if e == AroundTwo {
		return "eps"
	}
	return "x"
}

// String is the end's label as the command line spells it ("2" or "inf").
func (e End) String() string {
	if e == AroundTwo {
		return "2"
	}
	return "inf"
}

// kernelForm fixes how the unknown enters: h = base + scale(s) * y, with
// Delta = 1/q a series in s. It is chosen so that the pole and the zero of
// k_A that collide at s = 0 cancel analytically and y(0) is finite.
type kernelForm struct {
	delta *series.Series // Delta = 1/q as a series in s
	base  *big.Float     // h at s = 0
	scale *series.Series // h = base + scale * y
	// samples bracket y(0) (or y at a fixed s): increasing interior points
	// of the interval between the pole and the zero of k_A.
	samples []*big.Float
}

func bigInt(v int64, prec uint) *big.Float { return new(big.Float).SetPrec(prec).SetInt64(v) }

func bigFrac(num, den int64, prec uint) *big.Float {
	x := bigInt(num, prec)
	return x.Quo(x, bigInt(den, prec))
}

// intervalSamples returns increasing interior points of (lo, hi): 63
// uniform ones, and geometric ones crowding towards both ends (down to
// 2^-100 of the width), where the root sits when q is close to 2 or large.
func intervalSamples(lo, hi *big.Float, prec uint) []*big.Float {
	w := new(big.Float).SetPrec(prec).Sub(hi, lo)
	var fracs []*big.Float
	one := bigInt(1, prec)
	for j := 100; j > 6; j-- {
		fracs = append(fracs, new(big.Float).SetPrec(prec).SetMantExp(one, -j))
	}
	for k := int64(1); k < 64; k++ {
		fracs = append(fracs, bigFrac(k, 64, prec))
	}
	for j := 7; j <= 100; j++ {
		f := new(big.Float).SetPrec(prec).SetMantExp(one, -j)
		fracs = append(fracs, f.Sub(one, f))
	}
	out := make([]*big.Float, 0, len(fracs))
	for _, f := range fracs {
		x := new(big.Float).SetPrec(prec).Mul(w, f)
		out = append(out, x.Add(x, lo))
	}
	return out
}

// formAt builds the kernel form for dimension n with s the given series in
// the expansion variable (length 1 for a fixed numerical value of s).
//
// Around q = 2 (s = eps, Delta = (1 - eps)/2): the n-th root lies between
// the pole of k_A at h = 2n + 2 - eps and its zero at h = 2n + 2 + eps, so
// h = 2n + 2 + eps*y with y in (-1, 1); this holds at every eps in [0, 1).
// Around q = infinity (s = x = 1/q, Delta = x): for n >= 1 the pole at
// 2n + 1 + 2x and the zero at 2n + 1 - 2x collide, and the root lies above
// the pole, so h = 2n + 1 + x*w with w in (2, infinity); for n = 0 nothing
// collides and h = 2 + y with y in (-1, 1).
func formAt(end End, n int, s *series.Series) *kernelForm {
	p := s.Prec()
	one := bigInt(1, p)
	half := bigFrac(1, 2, p)
	f := &kernelForm{}
	switch end {
	case AroundTwo:
		f.delta = series.Scale(series.AddConst(series.Neg(s), one), half)
		f.base = bigInt(int64(2*n+2), p)
		f.scale = s
		f.samples = intervalSamples(bigInt(-1, p), one, p)
	default:
		f.delta = s
		if n == 0 {
			f.base = bigInt(2, p)
			f.scale = series.AddConst(series.Scale(s, new(big.Float)), one) // the constant 1
			f.samples = intervalSamples(bigInt(-1, p), one, p)
		} else {
			f.base = bigInt(int64(2*n+1), p)
			f.scale = s
			for j := -30; j <= 60; j++ {
				x := new(big.Float).SetPrec(p).SetMantExp(one, j)
				f.samples = append(f.samples, x.Add(x, bigInt(2, p)))
			}
		}
	}
	return f
}

// kernelEquation returns log|k_A(h)| = 0 for the antisymmetric-channel
// kernel (MS 2016, arXiv:1604.07818; PHYSICS.md section 4)
//
//	k_A(h) = -(q-1) Gamma(3/2-D) Gamma(1-D) / [Gamma(1/2+D) Gamma(D)]
//	         * Gamma(D + h/2) Gamma(1/2 + D - h/2) / [Gamma(3/2 - D - h/2) Gamma(1 - D + h/2)],
//
// D = 1/q, written with q - 1 = (1 - D)/D and h = base + scale*y.
func kernelEquation(f *kernelForm, prec uint) (*logEquation, error) {
	e := newLogEquation(prec)
	e.sign = -1
	D := f.delta
	zero := series.Scale(D, new(big.Float).SetPrec(prec))
	one := bigInt(1, prec)
	half := bigFrac(1, 2, prec)
	threeHalves := bigFrac(3, 2, prec)
	negD := series.Neg(D)
	hb := new(big.Float).SetPrec(prec).Mul(f.base, half) // base/2
	negHb := new(big.Float).SetPrec(prec).Neg(hb)        // -base/2
	hs := series.Scale(f.scale, half)                    // scale/2
	negHs := series.Neg(hs)                              // -scale/2
	steps := []struct {
		coef int64
		lg   bool
		a    *series.Series
		b    *series.Series
	}{
		{+1, false, series.AddConst(negD, one), zero},                                 // 1 - D
		{-1, false, D, zero},                                                          // D
		{+1, true, series.AddConst(negD, threeHalves), zero},                          // Gamma(3/2 - D)
		{+1, true, series.AddConst(negD, one), zero},                                  // Gamma(1 - D)
		{-1, true, series.AddConst(D, half), zero},                                    // Gamma(1/2 + D)
		{-1, true, D, zero},                                                           // Gamma(D)
		{+1, true, series.AddConst(D, hb), hs},                                        // Gamma(D + h/2)
		{+1, true, series.AddConst(series.AddConst(D, half), negHb), negHs},           // Gamma(1/2 + D - h/2)
		{-1, true, series.AddConst(series.AddConst(negD, threeHalves), negHb), negHs}, // Gamma(3/2 - D - h/2)
		{-1, true, series.AddConst(series.AddConst(negD, one), hb), hs},               // Gamma(1 - D + h/2)
	}
	for _, st := range steps {
		var err error
		if st.lg {
			err = e.addLogGamma(st.coef, st.a, st.b)
		} else {
			err = e.addLog(st.coef, st.a, st.b)
		}
		if err != nil {
			return nil, err
		}
	}
	return e, nil
}
