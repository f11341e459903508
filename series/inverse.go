package series

import (
	"qbridge/series/scalar"

	"fmt"
	"math/big"
	"math/bits"
)

// elemWorkPrec is the precision used inside the series operations of length
// n whose result is wanted at prec bits: the package guard plus a few bits
// for the O(n) roundings that accumulate in each coefficient.
func elemWorkPrec(prec uint, n int) uint {
	return prec + scalar.Guard + uint(bits.Len(uint(n)))
}

// elemCheck rejects nil or empty series (the zero value of Series is not
// usable) with an error naming the operation.
func elemCheck(op string, ss ...*Series) error {
	for _, s := range ss {
		if s == nil || len(s.c) == 0 || s.prec == 0 {
			return fmt.Errorf("series: %s: nil or empty series", op)
		}
	}
	return nil
}

// elemZeros returns n zero coefficients at prec bits.
func elemZeros(n int, prec uint) []*big.Float {
	c := make([]*big.Float, n)
	for i := range c {
		c[i] = new(big.Float).SetPrec(prec)
	}
	return c
}

// elemCopyAt returns copies of the first n coefficients of c at prec bits
// (zeros past the end of c).
func elemCopyAt(c []*big.Float, n int, prec uint) []*big.Float {
	out := elemZeros(n, prec)
	for i := 0; i < n && i < len(c); i++ {
		out[i].Set(c[i])
	}
	return out
}

// elemRound packages work coefficients as a Series rounded to prec bits.
func elemRound(c []*big.Float, prec uint) *Series {
	out := newZero(len(c), prec)
	for i := range c {
		out.c[i].Set(c[i])
	}
	return out
}

// elemMulTrunc returns the first n coefficients of the product a*b at prec
// bits, skipping zero coefficients (common in sparse inputs).
func elemMulTrunc(a, b []*big.Float, n int, prec uint) []*big.Float {
	out := elemZeros(n, prec)
	t := new(big.Float).SetPrec(prec)
	for i := 0; i < n && i < len(a); i++ {
		if a[i].Sign() == 0 {
			continue
		}
		for j := 0; i+j < n && j < len(b); j++ {
			if b[j].Sign() == 0 {
				continue
			}
			t.Mul(a[i], b[j])
			out[i+j].Add(out[i+j], t)
		}
	}
	return out
}

// elemDivTrunc returns the first n coefficients of num/den at prec bits by
// the recurrence den * q = num; den[0] must be nonzero.
func elemDivTrunc(num, den []*big.Float, n int, prec uint) []*big.Float {
	q := elemZeros(n, prec)
	acc := new(big.Float).SetPrec(prec)
	t := new(big.Float).SetPrec(prec)
	for k := 0; k < n; k++ {
		if k < len(num) {
			acc.Set(num[k])
		} else {
			acc.SetInt64(0)
		}
		for i := 1; i <= k && i < len(den); i++ {
			if den[i].Sign() == 0 {
				continue
			}
			t.Mul(den[i], q[k-i])
			acc.Sub(acc, t)
		}
		q[k].Quo(acc, den[0])
	}
	return q
}

// Inv returns the series 1/a, with the length and precision of a. It
// returns an error wrapping ErrDomain when a(0) = 0 (then 1/a is a Laurent
// series, not a power series).
func Inv(a *Series) (*Series, error) {
	if err := elemCheck("Inv", a); err != nil {
		return nil, err
	}
	if a.c[0].Sign() == 0 {
		return nil, fmt.Errorf("series: Inv: constant term is zero: %w", scalar.ErrDomain)
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	one := []*big.Float{new(big.Float).SetPrec(wp).SetInt64(1)}
	return elemRound(elemDivTrunc(one, a.c, n, wp), a.prec), nil
}

// Div returns the series a/b with the shorter length and larger precision
// of the two. It returns an error wrapping ErrDomain when b(0) = 0.
func Div(a, b *Series) (*Series, error) {
	if err := elemCheck("Div", a, b); err != nil {
		return nil, err
	}
	if b.c[0].Sign() == 0 {
		return nil, fmt.Errorf("series: Div: constant term of the divisor is zero: %w", scalar.ErrDomain)
	}
	n := minLen(a, b)
	prec := maxPrec(a, b)
	wp := elemWorkPrec(prec, n)
	return elemRound(elemDivTrunc(a.c, b.c, n, wp), prec), nil
}
