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
	// "eps Pade", "eps conformal map", "1/q partial sum", "1/q Pade",
	// "1/q conformal map" or "two-point Pade".
	Method string
	// Value is the resummed value; nil if the estimator failed or does not
	// apply (Detail says which and why).
	Value *big.Float
	// Err is the estimated absolute error of Value: nil with Value, and nil
	// beside a Value when no error can be stated (a partial sum outside
	// the radius of convergence; Detail says so).
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
	// Estimates in a fixed order: partial sum, Pade table and conformal
	// map at each end (eps, then 1/q), then the two-point Pade.
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
// table's best entry and the conformal-mapping resummation at each end,
// and the two-point Pade that matches both ends, each with an error
// estimate, and the exact value beside them.
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
// function: at each end the partial sum, the best Pade-table entry and the
// conformal-mapping resummation, then the two-point Pade, each with its
// error estimate (for b converted from b^q at the end).
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
		add(partialSumTailEstimate(end.name, end.c, end.s, end.at))
		add(padeEstimate(end.name, end.c, end.at, prec))
		add(conformalEstimate(end.name, end.c, end.at, prec))
	}
	half := bigFrac(1, 2, prec)
	zero := new(big.Float).SetPrec(prec)
	if tp, err := pade.ResumTwoPoint(si, zero, epsToXMinusHalf(st), half, x, pade.TwoPointOptions{}); err == nil {
		add(TwoPointEstimate(tp))
	} else {
		add(Estimate{Method: "two-point Pade", Detail: "failed: " + err.Error()})
	}
	return out, nil
}

// TwoPointEstimate is the estimate Resum makes of a two-point Pade
// resummation (pade.ResumTwoPoint or a copy of its selection): its value,
// and as error twice the spread of the entries of the two highest orders,
// as for the one-point tables. The plain spread fell short of the true
// error (by up to 1.1 times, h_3 at q = 4 and 6 from order 16) in the
// stated-versus-true table of resum_errors_test.go.
func TwoPointEstimate(tp *pade.Resummed) Estimate {
	e := new(big.Float).SetPrec(64).Mul(tp.Err, big.NewFloat(2))
	return Estimate{Method: "two-point Pade", Value: tp.Value, Err: e, Detail: TwoPointDetail(tp) + "; the error stated is twice that spread"}
}

// coefficientErrorSum returns sum_k err_k |t|^k: what the errors of the
// coefficients can move a sum of the series at t by.
func coefficientErrorSum(errs []*big.Float, t *big.Float) *big.Float {
	at := new(big.Float).SetPrec(64).Abs(t)
	sum := new(big.Float).SetPrec(64)
	for k := len(errs) - 1; k >= 0; k-- {
		sum.Mul(sum, at)
		if errs[k] != nil {
			sum.Add(sum, errs[k])
		}
	}
	return sum
}

// partialSumTailEstimate returns the sum of the series c (as s) at the
// point, with the tail estimated from the exact radius of convergence R
// (the nearest singularity, Coefficients.Radius less its error): the
// coefficients of a function whose nearest singularities are branch points
// or poles on |t| = R fall like R^-k times a power of k, so with
// r = |t|/R < 1 and A the largest of |c_k| R^k over the last four
// coefficients (two of them nonzero in an even or odd series) the terms
// beyond the last are taken to be at most A r^k and the tail at most
// A r^(K+1)/(1 - r); the stated error is twice that plus the coefficient
// errors summed at |t|. The old error, the size of the last terms, missed
// the tail by up to 13 times close to the radius (h_3 at q = 6 in eps).
// Outside the radius (r >= 1) the partial sums diverge and no error is
// stated. Without a radius the error is the larger of the last two terms.
func partialSumTailEstimate(name string, c *Coefficients, s *series.Series, at *big.Float) Estimate {
	ps := series.PartialSums(s, at)
	n := len(ps)
	v := ps[n-1]
	est := Estimate{Method: name + " partial sum", Value: v}
	if c.Radius == nil || c.Radius.Sign() <= 0 {
		e := new(big.Float).SetPrec(64).Sub(ps[n-1], ps[n-2])
		e.Abs(e)
		if n >= 3 {
			e2 := new(big.Float).SetPrec(64).Sub(ps[n-2], ps[n-3])
			e2.Abs(e2)
			if e2.Cmp(e) > 0 {
				e = e2
			}
		}
		est.Err = e.Add(e, coefficientErrorSum(c.Errors, at))
		est.Detail = fmt.Sprintf("sum of %d terms; error: largest of the last two terms (no radius of convergence known)", n)
		return est
	}
	R := new(big.Float).SetPrec(64).Set(c.Radius)
	if c.RadiusErr != nil {
		R.Sub(R, c.RadiusErr)
	}
	r := new(big.Float).SetPrec(64).Abs(at)
	r.Quo(r, R)
	if r.Cmp(big.NewFloat(1)) >= 0 {
		est.Detail = fmt.Sprintf("sum of %d terms; not estimated: |%s| = %s lies outside the radius of convergence %s (%s), where the partial sums diverge",
			n, c.End.Variable(), new(big.Float).Abs(at).Text('g', 6), c.Radius.Text('g', 6), c.RadiusMethod)
		return est
	}
	K := len(c.Values) - 1
	amp := new(big.Float).SetPrec(64)
	for k := max(0, K-3); k <= K; k++ {
		a := new(big.Float).SetPrec(64).Abs(c.Values[k])
		a.Mul(a, powFloat(R, k))
		scalar.RaiseAbs(amp, a)
	}
	tail := amp.Mul(amp, powFloat(r, K+1))
	tail.Quo(tail, new(big.Float).SetPrec(64).Sub(big.NewFloat(1), r))
	tail.Mul(tail, big.NewFloat(2))
	tail.Add(tail, coefficientErrorSum(c.Errors, at))
	if tail.Sign() == 0 {
		est.Err = nil
		est.Detail = fmt.Sprintf("sum of %d terms; not estimated: the last four coefficients vanish", n)
		return est
	}
	est.Err = tail
	est.Detail = fmt.Sprintf("sum of %d terms; error: twice the tail bound A r^(K+1)/(1 - r), r = |%s|/R = %s with the exact radius R = %s, A = max |c_k| R^k over the last four terms",
		n, c.End.Variable(), r.Text('g', 4), c.Radius.Text('g', 6))
	return est
}

// powFloat returns x^k at 64 bits.
func powFloat(x *big.Float, k int) *big.Float {
	out := new(big.Float).SetPrec(64).SetInt64(1)
	b := new(big.Float).SetPrec(64).Set(x)
	for ; k > 0; k >>= 1 {
		if k&1 == 1 {
			out.Mul(out, b)
		}
		b.Mul(b, b)
	}
	return out
}

// padeWindow is how many total orders below the leading entry the error
// estimate of padeFromEntries compares with.
const padeWindow = 3

// padeFromEntries turns the pole-free entries (highest order first) into
// a value and an error: the value is the entry of the highest order L+M
// (the diagonal one first), the error twice the largest deviation from it
// of the entries of the padeWindow next lower orders, L+M-1 to L+M-3, of
// which at least one must lie two or more orders below (neighbouring
// entries can coincide in degenerate blocks of the table and then say
// nothing about the error), plus the rounding floor 2^-(prec-8) |value|.
// For entries converging geometrically the deviation of the order below
// overestimates the error of the leading one by the ratio of successive
// errors; the factor 2 covers tables whose entries converge unevenly.
func padeFromEntries(es []padeEntry, prec uint) (v, e *big.Float, used int, ok bool) {
	if len(es) == 0 {
		return nil, nil, 0, false
	}
	top := es[0]
	spread := new(big.Float).SetPrec(64)
	d := new(big.Float).SetPrec(prec)
	lower := false
	for _, x := range es[1:] {
		if x.n < top.n-padeWindow {
			continue
		}
		if x.n <= top.n-2 {
			lower = true
		}
		d.Sub(x.v, top.v)
		scalar.RaiseAbs(spread, d)
		used++
	}
	if !lower {
		return top.v, nil, used, false
	}
	spread.Mul(spread, big.NewFloat(2))
	floor := new(big.Float).SetPrec(64).Abs(top.v)
	floor.SetMantExp(floor, -int(prec)+8)
	spread.Add(spread, floor)
	return top.v, spread, used + 1, true
}

// padeEstimate resums the series c at the point at from its near-diagonal
// Pade approximants (padeEntries, padeFromEntries). A series even or odd
// in its variable t (h_n, b^q and S_0 around q = 2) is written as
// t^p g(t^2) and g is resummed in t^2: the Pade table of the series in t
// itself is then made of 2x2 blocks of equal entries.
func padeEstimate(name string, c *Coefficients, at *big.Float, prec uint) Estimate {
	est := Estimate{Method: name + " Pade"}
	vals, errs := c.Values, c.Errors
	t := new(big.Float).SetPrec(prec).Set(at)
	scale := bigInt(1, prec)
	variable := c.End.Variable()
	par := seriesParity(c)
	if par >= 0 {
		vals, errs = reduceParity(c, par)
		if par == 1 {
			scale.Set(at)
		}
		t.Mul(t, at)
		variable = fmt.Sprintf("%s^2 (the series is %s in %s)", variable, map[int]string{0: "even", 1: "odd"}[par], c.End.Variable())
	}
	s, err := series.FromBig(prec, vals)
	if err != nil {
		est.Detail = "failed: " + err.Error()
		return est
	}
	es := padeEntries(s, t)
	v, e, used, ok := padeFromEntries(es, prec)
	if v == nil {
		est.Detail = fmt.Sprintf("failed: no pole-free entry [L/M], |L-M| <= 1, of total order %d..%d in %s", max(1, s.Len()-1-padeRungs), s.Len()-1, variable)
		return est
	}
	if !ok {
		est.Detail = fmt.Sprintf("failed: no pole-free entry of total order %d..%d below [%d/%d] in %s; no error estimate possible", es[0].n-padeWindow, es[0].n-2, es[0].l, es[0].m, variable)
		return est
	}
	e.Add(e, coefficientErrorSum(errs, t))
	e.Mul(e, new(big.Float).Abs(scale))
	est.Value = new(big.Float).SetPrec(prec).Mul(v, scale)
	est.Err = e
	est.Detail = fmt.Sprintf("[%d/%d] in %s; error: twice the max deviation of the %d pole-free entries with |L-M| <= 1 of total order %d..%d, plus the coefficient errors",
		es[0].l, es[0].m, variable, used-1, es[0].n-padeWindow, es[0].n-1)
	return est
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

// padeRungs is how many total orders L+M below the highest the Pade
// estimates scan for pole-free entries.
const padeRungs = 4

// padeEntry is one pole-free near-diagonal Pade approximant at the point.
type padeEntry struct {
	n, l, m int
	v       *big.Float
}

// padeEntries returns the pole-free entries [L/M] with |L - M| <= 1 of
// the series s at the point at, for the padeRungs+1 highest total orders
// L+M, highest first (diagonal before off-diagonal): no pole other than a
// Froissart doublet within |at|/100 of the segment [0, at], and a
// regular linear system (degenerate entries, where M had to be lowered,
// repeat a lower entry and are left out).
func padeEntries(s *series.Series, at *big.Float) []padeEntry {
	prec := s.Prec()
	top := s.Len() - 1
	margin := new(big.Float).SetPrec(prec).Abs(at)
	margin.Quo(margin, big.NewFloat(100))
	dtol := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec/4))
	zero := new(big.Float).SetPrec(prec)
	var out []padeEntry
	for n := top; n >= 1 && n >= top-padeRungs; n-- {
		ls := []int{n / 2}
		if n%2 == 1 {
			ls = []int{(n + 1) / 2, n / 2}
		}
		for _, l := range ls {
			p, err := pade.NewPade(s, l, n-l)
			if err != nil || p.M < n-l {
				continue
			}
			if free, err := p.PoleFree(zero, at, margin, dtol); err != nil || !free {
				continue
			}
			v, err := p.Eval(at)
			if err != nil {
				continue
			}
			out = append(out, padeEntry{n, l, n - l, v})
		}
	}
	return out
}
