package series

import (
	"math/big"
	"qbridge/series/scalar"
)

// Eval returns the truncated polynomial s(x) = sum_k s_k x^k by Horner's
// rule, carried out with guard bits and rounded to s.Prec(). A nil x is
// taken as zero. A nil or empty series gives nil.
func Eval(s *Series, x *big.Float) *big.Float {
	if s == nil || len(s.c) == 0 {
		return nil
	}
	wp := elemWorkPrec(s.prec, len(s.c))
	acc := new(big.Float).SetPrec(wp)
	if x == nil {
		return acc.Set(s.c[0]).SetPrec(s.prec)
	}
	for k := len(s.c) - 1; k >= 0; k-- {
		acc.Mul(acc, x)
		acc.Add(acc, s.c[k])
	}
	return acc.SetPrec(s.prec)
}

// EvalComplex returns the truncated polynomial s(z) at a complex point z by
// Horner's rule, with guard bits, rounded to s.Prec(). Nil parts of z are
// taken as zero.
func EvalComplex(s *Series, z scalar.Complex) scalar.Complex {
	if s == nil || len(s.c) == 0 {
		return scalar.Complex{}
	}
	wp := elemWorkPrec(s.prec, len(s.c))
	zz := scalar.NewComplex(z.Re, z.Im, wp)
	acc := scalar.NewComplex(nil, nil, wp)
	for k := len(s.c) - 1; k >= 0; k-- {
		acc = scalar.CMul(acc, zz, wp)
		acc.Re.Add(acc.Re, s.c[k])
	}
	return scalar.NewComplex(acc.Re, acc.Im, s.prec)
}

// PartialSums returns the n partial sums S_k = sum_{j<k} s_j x^j for
// k = 1..n (S_1 = s_0, S_n = s(x)), at s.Prec(): the raw sequence that
// resummation and convergence tables start from. A nil x is taken as zero.
func PartialSums(s *Series, x *big.Float) []*big.Float {
	if s == nil {
		return nil
	}
	n := len(s.c)
	wp := elemWorkPrec(s.prec, n)
	xx := new(big.Float).SetPrec(wp)
	if x != nil {
		xx.Set(x)
	}
	pw := new(big.Float).SetPrec(wp).SetInt64(1)
	sum := new(big.Float).SetPrec(wp)
	t := new(big.Float).SetPrec(wp)
	out := make([]*big.Float, n)
	for k := 0; k < n; k++ {
		if k > 0 {
			pw.Mul(pw, xx)
		}
		t.Mul(s.c[k], pw)
		sum.Add(sum, t)
		out[k] = new(big.Float).SetPrec(s.prec).Set(sum)
	}
	return out
}
