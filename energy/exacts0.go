package energy

import (
	"fmt"
	"math/big"

	"qbridge/series"
)

// ExactS0Eps returns the exact zero-temperature entropy as a series in
// eps = 1 - 2/q to eps^order, at prec bits:
// S_0 = int_0^{eps/2} pi u cot(pi u) du (Kitaev; Maldacena-Stanford
// arXiv:1604.07818 sec. 2.6, rewritten with u = 1/2 - 1/q).
func ExactS0Eps(order int, prec uint) (*series.Series, error) {
	if order < 0 {
		return nil, fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, order)
	}
	n := order + 1
	c := new(big.Float).SetPrec(prec).Quo(series.Pi(prec), big.NewFloat(2))
	// a = (pi/2) t; pi u cot(pi u) with u = t/2 is a cos(a)/sin(a).
	a, err := series.Variable(n+1, prec, nil)
	if err != nil {
		return nil, err
	}
	a = series.Scale(a, c)
	sin, cos, err := series.SinCos(a)
	if err != nil {
		return nil, err
	}
	// sin(a)/a as a series in t: shift down by one power and divide by pi/2.
	sc := sin.Coeffs()[1:]
	for _, v := range sc {
		v.Quo(v, c)
	}
	sa, err := series.FromBig(prec, sc)
	if err != nil {
		return nil, err
	}
	cs, err := series.FromBig(prec, cos.Coeffs()[:n])
	if err != nil {
		return nil, err
	}
	f, err := series.Div(cs, sa)
	if err != nil {
		return nil, err
	}
	// S_0 = (1/2) int_0^eps f(t) dt.
	s := series.Scale(series.Integral(f, nil), big.NewFloat(0.5))
	return series.FromBig(prec, s.Coeffs()[:n])
}

// ExactS0InvQ returns the exact zero-temperature entropy as a series in
// x = 1/q to x^order: S_0 = (1/2) log 2 - int_0^x pi (1/2 - t) tan(pi t) dt
// (Maldacena-Stanford arXiv:1604.07818 sec. 2.6).
func ExactS0InvQ(order int, prec uint) (*series.Series, error) {
	if order < 0 {
		return nil, fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, order)
	}
	n := order + 1
	pi := series.Pi(prec)
	a, err := series.Variable(n, prec, nil)
	if err != nil {
		return nil, err
	}
	tan, err := series.Tan(series.Scale(a, pi))
	if err != nil {
		return nil, err
	}
	// 1/2 - t, at the full length (Mul truncates to the shorter operand).
	half, err := series.Variable(n, prec, big.NewFloat(-0.5))
	if err != nil {
		return nil, err
	}
	half = series.Neg(half)
	f := series.Scale(series.Mul(half, tan), pi)
	s := series.Neg(series.Integral(f, nil))
	l2 := new(big.Float).SetPrec(prec).Quo(series.Ln2(prec), big.NewFloat(2))
	s = series.AddConst(s, l2)
	return series.FromBig(prec, s.Coeffs()[:n])
}

// ExactS0Delta returns ExactS0Eps converted to delta = q - 2.
func ExactS0Delta(order int, prec uint) (*series.Series, error) {
	s, err := ExactS0Eps(order, prec)
	if err != nil {
		return nil, err
	}
	return series.EpsToDelta(s)
}
