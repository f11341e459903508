package conformal

import (
	"fmt"
	"math/big"

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
// (ResumPrec): the partial sums and the best pole-free Pade-table entries
// at each end, and the two-point Pade, in that order, each with its error.
// It gives the same estimates as Resum for the same series.
func ResumFrom(quantity string, q QPoint, two, inf *Coefficients, prec uint) ([]Estimate, error) {
	if q.Inf || q.Q == nil {
		return nil, fmt.Errorf("resummation needs a finite q (at q = inf the series around infinity is exact)")
	}
	eps := q.Eps(prec)
	x := q.X(prec)
	st, err := two.toSeries(prec)
	if err != nil {
		return nil, err
	}
	si, err := inf.toSeries(prec)
	if err != nil {
		return nil, err
	}
	var out []Estimate
	add := func(e Estimate) { out = append(out, FromResummed(quantity, e, q, prec)) }
	for _, end := range []struct {
		name string
		s    *series.Series
		at   *big.Float
	}{{"eps", st, eps}, {"1/q", si, x}} {
		add(partialSumEstimate(end.name, end.s, end.at))
		if pt, err := pade.PadeTable(end.s, end.at, pade.PadeTableOptions{}); err == nil {
			add(Estimate{Method: end.name + " Pade", Value: pt.Value, Err: pt.Err,
				Detail: fmt.Sprintf("[%d/%d], %d entries; %s", pt.L, pt.M, pt.Used, pt.Method)})
		} else {
			add(Estimate{Method: end.name + " Pade", Detail: "failed: " + err.Error()})
		}
	}
	half := bigFrac(1, 2, prec)
	zero := new(big.Float).SetPrec(prec)
	if tp, err := pade.ResumTwoPoint(si, zero, epsToXMinusHalf(st), half, x, pade.TwoPointOptions{}); err == nil {
		add(Estimate{Method: "two-point Pade", Value: tp.Value, Err: tp.Err,
			Detail: TwoPointDetail(tp)})
	} else {
		add(Estimate{Method: "two-point Pade", Detail: "failed: " + err.Error()})
	}
	return out, nil
}

// TwoPointDetail is the Detail string Resum gives a two-point estimate.
func TwoPointDetail(tp *pade.Resummed) string {
	return fmt.Sprintf("[%d/%d] from %d terms at x = 0 and %d at x = 1/2, %d entries; %s", tp.L, tp.M, tp.K1, tp.K2, tp.Used, tp.Method)
}
