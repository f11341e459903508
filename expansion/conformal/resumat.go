package conformal

import (
	"fmt"

	"qbridge/series"
	"qbridge/series/pade"
)

// This file splits Resum into its q-independent part (the series at both
// ends, TwoEndSeries) and the evaluation at one q (ResumFrom), so that a
// caller resumming at many q builds the series once.

// ResumPrec is the working precision in bits at which Resum evaluates its
// approximants for the given decimal digits and series order.
func ResumPrec(digits, order int) uint { return bitsFor(digits, order) }

// TwoEndSeries returns the series Resum resums for the quantity (dims with
// index n, b or s0) to the given order around q = 2 (in eps) and
// q = infinity (in x): those of h_n and S_0 themselves, and of b^q for b.
// They do not depend on q.
func TwoEndSeries(quantity string, n, order, digits int) (two, inf *Coefficients, err error) {
	if err := checkOrder(order); err != nil {
		return nil, nil, err
	}
	if order < 2 {
		return nil, nil, fmt.Errorf("resummation needs order >= 2 (got %d)", order)
	}
	return bothEnds(quantity, n, order, digits)
}

// TwoPointSeries returns the two series Resum hands to the two-point Pade
// at prec bits: the x-series (around x = 0) and the eps-series rewritten in
// powers of x - 1/2 (eps = -2 (x - 1/2)).
func TwoPointSeries(two, inf *Coefficients, prec uint) (atZero, atHalf *series.Series, err error) {
	st, err := two.toSeries(prec)
	if err != nil {
		return nil, nil, err
	}
	si, err := inf.toSeries(prec)
	if err != nil {
		return nil, nil, err
	}
	return si, epsToXMinusHalf(st), nil
}

// FromResummed turns an estimate of the resummed function (see
// TwoEndSeries) at q into one of the quantity: b = (b^q)^(1/q) for b, with
// the error propagated; unchanged for dims and s0.
func FromResummed(quantity string, e Estimate, q QPoint, prec uint) Estimate {
	if quantity == QuantityB {
		return bFromBq(e, q, prec)
	}
	return e
}

// ResumFrom is Resum's evaluation at one finite q from series computed
// before (TwoEndSeries, or a stored copy of them), at prec bits
// (ResumPrec): the partial sum, the best pole-free Pade-table entry and
// the conformal-mapping resummation at each end, and the two-point Pade,
// in that order, each with its error. It gives the same estimates as
// Resum for the same series.
func ResumFrom(quantity string, q QPoint, two, inf *Coefficients, prec uint) ([]Estimate, error) {
	if q.Inf || q.Q == nil {
		return nil, fmt.Errorf("resummation needs a finite q (at q = inf the series around infinity is exact)")
	}
	return resumEstimates(quantity, q, two, inf, prec)
}

// TwoPointDetail is the Detail string Resum gives a two-point estimate.
func TwoPointDetail(tp *pade.Resummed) string {
	return fmt.Sprintf("[%d/%d] from %d terms at x = 0 and %d at x = 1/2, %d entries; %s", tp.L, tp.M, tp.K1, tp.K2, tp.Used, tp.Method)
}
