package conformal

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/pade"
	"qbridge/series/scalar"
)

// Estimate is one resummed value of a quantity at a given q.
type Estimate struct {
	// Method is a short label for the estimator: "eps partial sum",
	// "eps Pade", "1/q partial sum", "1/q Pade" or "two-point Pade".
	Method string
	// Value is the resummed value; nil if the estimator failed.
	Value *big.Float
	// Err is the estimated absolute error of Value (nil with Value).
	Err *big.Float
	// Detail says how Value was obtained (order, entry, spread) or why the
	// estimator failed.
	Detail string
}

// Resummation collects the estimates of one quantity at one q, with the
// exact value beside them.
type Resummation struct {
	// Quantity names the quantity resummed, as in Exact.Quantity.
	Quantity string
	// Q is the point q at which the quantity was resummed.
	Q QPoint
	// N is the dimension index n of h_n; -1 for b and S_0.
	N int
	// Order is the series order (highest power) used around each end.
	Order int
	// Exact is the directly computed value of the quantity at Q.
	Exact *Value
	// Estimates in a fixed order: partial sums, Pade table, at each end,
	// then the two-point Pade.
	Estimates []Estimate
}

// Quantities that Resum and the series functions know.
const (
	// QuantityDims selects the operator dimensions h_n.
	QuantityDims = "dims"
	// QuantityB selects the conformal coefficient b.
	QuantityB = "b"
	// QuantityS0 selects the zero-temperature entropy S_0.
	QuantityS0 = "s0"
)

// bothEnds returns the series of the analytic function resummed for the
// quantity, around q = 2 (in eps) and q = infinity (in x). For b that
// function is b^q (b itself has x log x terms at infinity).
func bothEnds(quantity string, n, order, digits int) (two, inf *Coefficients, err error) {
	switch quantity {
	case QuantityDims:
		if two, err = DimensionSeries(AroundTwo, n, order, digits); err != nil {
			return nil, nil, err
		}
		inf, err = DimensionSeries(AroundInf, n, order, digits)
		return two, inf, err
	case QuantityS0:
		if two, err = S0Series(AroundTwo, order, digits); err != nil {
			return nil, nil, err
		}
		inf, err = S0Series(AroundInf, order, digits)
		return two, inf, err
	case QuantityB:
		if two, err = twoPrecision("b^q", AroundTwo, order, digits, "b^q = z cot z / pi^2, z = pi eps/2", bqAroundTwo); err != nil {
			return nil, nil, err
		}
		inf, err = twoPrecision("b^q", AroundInf, order, digits, "b^q = x (1/2 - x) tan(pi x)/(pi x)",
			func(order int, prec uint) ([]*big.Float, error) { return bSeries(AroundInf, order, prec) })
		return two, inf, err
	}
	return nil, nil, fmt.Errorf("unknown quantity %q (known: dims, b, s0)", quantity)
}

// bqAroundTwo returns the eps-series of b^q = z cot z / pi^2, z = pi eps/2.
func bqAroundTwo(order int, prec uint) ([]*big.Float, error) {
	g, err := argCotArg(order+1, prec)
	if err != nil {
		return nil, err
	}
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	g = rescale(g, bigFrac(1, 2, prec))
	g = series.Scale(g, new(big.Float).SetPrec(prec).Quo(bigInt(1, prec), pi2))
	return g.Coeffs(), nil
}

// toSeries packs coefficients into a Series at prec bits.
func (c *Coefficients) toSeries(prec uint) (*series.Series, error) {
	return series.FromBig(prec, c.Values)
}

// epsToXMinusHalf turns a series in eps into one in (x - 1/2): eps = -2 (x - 1/2).
func epsToXMinusHalf(s *series.Series) *series.Series {
	return rescale(s, bigInt(-2, s.Prec()))
}

// Resum evaluates the quantity (dims with index n, b or s0) at q from its
// series of the given order around both ends: partial sums, the Pade
// table's best entry at each end, and the two-point Pade that matches both
// ends, each with an error estimate, and the exact value beside them.
func Resum(quantity string, q QPoint, n, order, digits int) (*Resummation, error) {
	if err := q.Check(); err != nil {
		return nil, err
	}
	if q.Inf {
		return nil, fmt.Errorf("resummation needs a finite q (at q = inf the series around infinity is exact)")
	}
	if err := checkOrder(order); err != nil {
		return nil, err
	}
	if order < 2 {
		return nil, fmt.Errorf("resummation needs order >= 2 (got %d)", order)
	}
	two, inf, err := bothEnds(quantity, n, order, digits)
	if err != nil {
		return nil, err
	}
	var exact *Value
	switch quantity {
	case QuantityDims:
		exact, err = Dimension(q, n, digits)
	case QuantityB:
		exact, err = B(q, digits)
	case QuantityS0:
		exact, err = S0(q, digits)
	}
	if err != nil {
		return nil, err
	}
	prec := bitsFor(digits, order)
	r := &Resummation{Quantity: exact.Quantity, Q: q, N: exact.N, Order: order, Exact: exact}
	if quantity != QuantityDims {
		r.N = -1
	}
	if r.Estimates, err = resumEstimates(quantity, q, two, inf, prec); err != nil {
		return nil, err
	}
	return r, nil
}

// resumEstimates evaluates at the finite q, at prec bits, the estimates of
// Resum from the series two (in eps) and inf (in x) of the resummed
// function: partial sums and the best Pade-table entries at each end, then
// the two-point Pade, each with its error estimate (for b converted from
// b^q at the end).
func resumEstimates(quantity string, q QPoint, two, inf *Coefficients, prec uint) ([]Estimate, error) {
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
	add := func(e Estimate) {
		if quantity == QuantityB {
			e = bFromBq(e, q, prec)
		}
		out = append(out, e)
	}
	for _, end := range []struct {
		name string
		c    *Coefficients
		s    *series.Series
		at   *big.Float
	}{{"eps", two, st, eps}, {"1/q", inf, si, x}} {
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
			Detail: fmt.Sprintf("[%d/%d] from %d terms at x = 0 and %d at x = 1/2, %d entries; %s", tp.L, tp.M, tp.K1, tp.K2, tp.Used, tp.Method)})
	} else {
		add(Estimate{Method: "two-point Pade", Detail: "failed: " + err.Error()})
	}
	return out, nil
}

// partialSumEstimate returns the last partial sum at the point, with the
// size of the last two terms as its error.
func partialSumEstimate(name string, s *series.Series, at *big.Float) Estimate {
	ps := series.PartialSums(s, at)
	n := len(ps)
	v := ps[n-1]
	e := new(big.Float).SetPrec(64).Sub(ps[n-1], ps[n-2])
	e.Abs(e)
	if n >= 3 {
		e2 := new(big.Float).SetPrec(64).Sub(ps[n-2], ps[n-3])
		e2.Abs(e2)
		if e2.Cmp(e) > 0 {
			e = e2
		}
	}
	return Estimate{Method: name + " partial sum", Value: v, Err: e,
		Detail: fmt.Sprintf("sum of %d terms; error: largest of the last two terms", n)}
}

// bFromBq converts an estimate of b^q into one of b = (b^q)^(1/q), with
// the error propagated to first order: db = b/q * d(b^q)/b^q.
func bFromBq(e Estimate, q QPoint, prec uint) Estimate {
	if e.Value == nil || e.Value.Sign() <= 0 {
		if e.Value != nil {
			e.Detail = "b^q came out non-positive; " + e.Detail
			e.Value, e.Err = nil, nil
		}
		return e
	}
	x := q.X(prec)
	b, err := scalar.BigPow(e.Value, x, prec)
	if err != nil {
		e.Value, e.Err = nil, nil
		return e
	}
	db := new(big.Float).SetPrec(64).Quo(e.Err, e.Value)
	db.Mul(db, b)
	db.Mul(db, x)
	e.Detail = "resummed b^q, then b = (b^q)^(1/q); " + e.Detail
	e.Value, e.Err = b, db
	return e
}

// Difference returns estimate - exact (nil if the estimate failed).
func (r *Resummation) Difference(e Estimate) *big.Float {
	if e.Value == nil {
		return nil
	}
	return new(big.Float).SetPrec(e.Value.Prec()).Sub(e.Value, r.Exact.Value)
}
