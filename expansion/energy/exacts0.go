package energy

import (
	"fmt"

	"qbridge/expansion/conformal"
	"qbridge/series"
)

// ExactS0Eps returns the exact zero-temperature entropy as a series in
// eps = 1 - 2/q to eps^order, at prec bits: S_0 = int_0^{eps/2} pi u cot(pi u) du
// (Kitaev; Maldacena-Stanford arXiv:1604.07818 sec. 2.6), from the
// conformal-data package.
func ExactS0Eps(order int, prec uint) (*series.Series, error) {
	if order < 0 {
		return nil, fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, order)
	}
	return conformal.S0Taylor(conformal.AroundTwo, order, prec)
}

// ExactS0InvQ returns the exact zero-temperature entropy as a series in
// x = 1/q to x^order: S_0 = (1/2) log 2 - int_0^x pi (1/2 - t) tan(pi t) dt
// (Maldacena-Stanford arXiv:1604.07818 sec. 2.6), from the conformal-data
// package.
func ExactS0InvQ(order int, prec uint) (*series.Series, error) {
	if order < 0 {
		return nil, fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, order)
	}
	return conformal.S0Taylor(conformal.AroundInf, order, prec)
}

// ExactS0Delta returns ExactS0Eps converted to delta = q - 2.
func ExactS0Delta(order int, prec uint) (*series.Series, error) {
	s, err := ExactS0Eps(order, prec)
	if err != nil {
		return nil, err
	}
	return conformal.EpsToDelta(s)
}
