package claim

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/series"
)

// Laurent is a truncated Laurent series in the expansion variable t,
//
//	t^Lo (Val_0 + Val_1 t + ... + Val_{n-1} t^{n-1}),
//
// known through t^Hi, Hi = Lo + n - 1, with an absolute error bound on every
// coefficient (Err, nonnegative). Coefficients below t^Lo are exactly zero.
type Laurent struct {
	// Lo is the power of t of the first stored coefficient.
	Lo int
	// Val holds the coefficients of t^Lo, ..., t^Hi.
	Val *series.Series
	// Err holds their absolute error bounds.
	Err *series.Series
}

// Hi is the highest power of t whose coefficient is known.
func (l *Laurent) Hi() int { return l.Lo + l.Val.Len() - 1 }

// Coeff returns the coefficient of t^k and its error bound: exact zeros
// below Lo, nil above Hi.
func (l *Laurent) Coeff(k int) (v, e *big.Float) {
	prec := l.Val.Prec()
	switch {
	case k < l.Lo:
		return new(big.Float).SetPrec(prec), new(big.Float).SetPrec(prec)
	case k > l.Hi():
		return nil, nil
	}
	return l.Val.Coeff(k - l.Lo), l.Err.Coeff(k - l.Lo)
}

// errShort reports that an intermediate result has no known coefficient:
// the inputs must be expanded further.
var errShort = errors.New("claim: the series are too short for this expression")

// shortError is a fault that more terms may cure: a division by a series
// all of whose computed coefficients are exact zeros. It matches errShort
// (Check expands further) and keeps the column for the final message.
type shortError struct {
	col int
	msg string
}

func (e *shortError) Error() string        { return e.msg }
func (e *shortError) Is(target error) bool { return target == errShort }

// roundBound returns 2^-(prec-2): the relative rounding bound added per
// operation (the series package works with guard bits and rounds once, so
// a few units in the last place per coefficient and term cover it).
func roundBound(prec uint) *big.Float {
	return new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)+2)
}

// newSeries builds a series from coefficients (no checks beyond series').
func newSeries(prec uint, c []*big.Float) (*series.Series, error) {
	return series.FromBig(prec, c)
}

// zeros returns n zero coefficients.
func zeros(n int, prec uint) []*big.Float {
	out := make([]*big.Float, n)
	for i := range out {
		out[i] = new(big.Float).SetPrec(prec)
	}
	return out
}

// absSeries returns the series of absolute values of the coefficients.
func absSeries(s *series.Series) *series.Series {
	c := s.Coeffs()
	for _, x := range c {
		x.Abs(x)
	}
	out, _ := series.FromBig(s.Prec(), c)
	return out
}

// truncate returns the first n coefficients of s (n <= s.Len()).
func truncate(s *series.Series, n int) *series.Series {
	if s.Len() == n {
		return s
	}
	out, _ := s.Truncate(n)
	return out
}

// addRounding returns e + n * bound * x, the error e with the rounding of
// an operation whose absolute-value result is x over n terms.
func addRounding(e, x *series.Series, n int) *series.Series {
	b := roundBound(x.Prec())
	b.Mul(b, big.NewFloat(float64(n)))
	return series.Add(e, series.Scale(x, b))
}

// exactLaurent builds an error-free Laurent series from coefficients of
// t^lo, t^(lo+1), ...
func exactLaurent(lo int, c []*big.Float, prec uint) (*Laurent, error) {
	v, err := newSeries(prec, c)
	if err != nil {
		return nil, err
	}
	e, err := series.New(len(c), prec)
	if err != nil {
		return nil, err
	}
	return &Laurent{Lo: lo, Val: v, Err: e}, nil
}

// constant is the constant c known through t^hi, with error bound e on its
// value (nil: none).
func constant(c, e *big.Float, hi int, prec uint) (*Laurent, error) {
	cs := zeros(max(hi+1, 1), prec)
	cs[0].Set(c)
	l, err := exactLaurent(0, cs, prec)
	if err != nil {
		return nil, err
	}
	if e != nil {
		if err := l.Err.SetCoeff(0, e); err != nil {
			return nil, err
		}
	}
	return l, nil
}

// align returns the value and error coefficients of t^lo..t^hi
// (lo <= l.Lo, hi <= l.Hi()).
func align(l *Laurent, lo, hi int) (v, e *series.Series, err error) {
	prec := l.Val.Prec()
	vc, ec := zeros(hi-lo+1, prec), zeros(hi-lo+1, prec)
	for k := l.Lo; k <= hi; k++ {
		vc[k-lo].Set(l.Val.Coeff(k - l.Lo))
		ec[k-lo].Set(l.Err.Coeff(k - l.Lo))
	}
	if v, err = newSeries(prec, vc); err != nil {
		return nil, nil, err
	}
	e, err = newSeries(prec, ec)
	return v, e, err
}

// neg returns -a.
func neg(a *Laurent) *Laurent {
	return &Laurent{Lo: a.Lo, Val: series.Neg(a.Val), Err: a.Err.Copy()}
}

// add returns a + b, or a - b when sub.
func add(a, b *Laurent, sub bool) (*Laurent, error) {
	lo, hi := min(a.Lo, b.Lo), min(a.Hi(), b.Hi())
	if hi < lo {
		return nil, errShort
	}
	av, ae, err := align(a, lo, hi)
	if err != nil {
		return nil, err
	}
	bv, be, err := align(b, lo, hi)
	if err != nil {
		return nil, err
	}
	v := series.Add(av, bv)
	if sub {
		v = series.Sub(av, bv)
	}
	e := series.Add(ae, be)
	e = addRounding(e, series.Add(absSeries(av), absSeries(bv)), 1)
	return &Laurent{Lo: lo, Val: v, Err: e}, nil
}

// mul returns a b with |d(ab)| <= |a||db| + |da||b| + |da||db| on series of
// absolute values.
func mul(a, b *Laurent) *Laurent {
	n := min(a.Val.Len(), b.Val.Len())
	av, ae := truncate(a.Val, n), truncate(a.Err, n)
	bv, be := truncate(b.Val, n), truncate(b.Err, n)
	aa, ba := absSeries(av), absSeries(bv)
	e := series.Add(series.Add(series.Mul(aa, be), series.Mul(ae, ba)), series.Mul(ae, be))
	e = addRounding(e, series.Mul(aa, ba), n)
	return &Laurent{Lo: a.Lo + b.Lo, Val: series.Mul(av, bv), Err: e}
}

// negligible reports a coefficient that is zero to the working precision:
// exactly zero, or zero within an error bound below 2^-(prec/2) (the
// rounding level of exactly known series, far below the error of any
// numerically fitted coefficient).
func negligible(v, e *big.Float, prec uint) bool {
	if v.Sign() == 0 && e.Sign() == 0 {
		return true
	}
	tiny := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec/2))
	three := new(big.Float).Mul(e, big.NewFloat(3))
	return e.Cmp(tiny) <= 0 && new(big.Float).Abs(v).Cmp(three) <= 0
}

// errVanishes reports a series all of whose known coefficients are zero.
var errVanishes = errors.New("vanishes to every order computed")

// strip drops leading coefficients that are zero to the working precision,
// raising Lo.
func strip(a *Laurent) (*Laurent, error) {
	prec := a.Val.Prec()
	k := 0
	for k < a.Val.Len() && negligible(a.Val.Coeff(k), a.Err.Coeff(k), prec) {
		k++
	}
	if k == a.Val.Len() {
		return nil, errVanishes
	}
	if k == 0 {
		return a, nil
	}
	vc, ec := a.Val.Coeffs()[k:], a.Err.Coeffs()[k:]
	v, err := newSeries(prec, vc)
	if err != nil {
		return nil, err
	}
	e, err := newSeries(prec, ec)
	if err != nil {
		return nil, err
	}
	return &Laurent{Lo: a.Lo + k, Val: v, Err: e}, nil
}

// leading returns the stripped series and checks that its leading
// coefficient is distinguishable from zero: more than three times its error.
func leading(a *Laurent, what string) (*Laurent, error) {
	s, err := strip(a)
	if err != nil {
		return nil, &shortError{msg: what + " by a series that vanishes to every order computed"}
	}
	v, e := s.Val.Coeff(0), s.Err.Coeff(0)
	three := new(big.Float).Mul(e, big.NewFloat(3))
	if new(big.Float).Abs(v).Cmp(three) <= 0 {
		return nil, fmt.Errorf("%s: the leading coefficient (of t^%d) %s +- %s is zero within its error, so the series' leading power is not known",
			what, s.Lo, v.Text('g', 6), e.Text('g', 2))
	}
	return s, nil
}

// div returns a/b to first order: d(a/b) = (da - (a/b) db)/b. The divisor's
// leading zeros (exact ones) move into Lo; one that is zero only within a
// larger error is refused.
func div(a, b *Laurent) (*Laurent, error) {
	b, err := leading(b, "division")
	if err != nil {
		return nil, err
	}
	n := min(a.Val.Len(), b.Val.Len())
	av, ae := truncate(a.Val, n), truncate(a.Err, n)
	bv, be := truncate(b.Val, n), truncate(b.Err, n)
	v, err := series.Div(av, bv)
	if err != nil {
		return nil, err
	}
	inv, err := series.Inv(bv)
	if err != nil {
		return nil, err
	}
	va := absSeries(v)
	e := series.Mul(absSeries(inv), series.Add(ae, series.Mul(va, be)))
	e = addRounding(e, va, n)
	return &Laurent{Lo: a.Lo - b.Lo, Val: v, Err: e}, nil
}

// maxIntPower bounds the integer exponents taken by repeated products.
const maxIntPower = 1000

// intPow returns a^k by repeated squaring (a quotient for k < 0); hi is how
// far the constant 1 of a^0 is known.
func intPow(a *Laurent, k, hi int) (*Laurent, error) {
	if abs(k) > maxIntPower {
		return nil, fmt.Errorf("integer powers are limited to |k| <= %d (got %d)", maxIntPower, k)
	}
	prec := a.Val.Prec()
	one, err := constant(big.NewFloat(1), nil, hi, prec)
	if err != nil {
		return nil, err
	}
	if k == 0 {
		return one, nil
	}
	if k < 0 {
		p, err := intPow(a, -k, hi)
		if err != nil {
			return nil, err
		}
		return div(one, p)
	}
	var out *Laurent
	sq := a
	for m := k; m > 0; m >>= 1 {
		if m&1 == 1 {
			if out == nil {
				out = sq
			} else {
				out = mul(out, sq)
			}
		}
		if m > 1 {
			sq = mul(sq, sq)
		}
	}
	return out, nil
}
